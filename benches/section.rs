//! Speed of the panel method: a 200-panel linear-vortex solve (influence matrix, LU solve,
//! residual check) and evaluation at one angle of attack, with the nodes given and with the
//! re-panelling included. Issue 3 asks for well under 5 ms in release.
//!
//! The viscous method (issue 12 asks for one converged point on 160 panels under 5 ms and a
//! 30-angle polar under 100 ms): one point on a prepared section (panel equations factored
//! once), the preparation itself, and a polar of 30 angles from -4 to 10.5 deg at Re 2e5.

use criterion::{criterion_group, criterion_main, Criterion};
use std::hint::black_box;
use trimline::section::geometry::Contour;
use trimline::section::naca::NacaProfile;
use trimline::section::panel::PanelSolution;
use trimline::section::polar::Polar;
use trimline::section::viscous::{ViscousSection, ViscousSettings};

fn panel_200(c: &mut Criterion) {
    let contour = Contour::new(&NacaProfile::parse("2412").unwrap().coordinates(201)).unwrap();
    let nodes = contour.repanel(200).unwrap();
    let alpha_rad = 4f64.to_radians();
    c.bench_function("panel solve, NACA 2412, 200 panels, one angle", |b| {
        b.iter(|| {
            let s = PanelSolution::solve_nodes(black_box(&nodes)).unwrap();
            black_box((s.cl(alpha_rad), s.cm_quarter_chord(alpha_rad)))
        })
    });
    c.bench_function(
        "re-panel and solve, NACA 2412, 200 panels, one angle",
        |b| {
            b.iter(|| {
                let s = PanelSolution::solve(black_box(&contour), 200).unwrap();
                black_box((s.cl(alpha_rad), s.cm_quarter_chord(alpha_rad)))
            })
        },
    );
}

fn viscous_160(c: &mut Criterion) {
    let raw = NacaProfile::parse("2412").unwrap().coordinates(300);
    let contour = Contour::with_leading_edge(&raw, raw.len() / 2).unwrap();
    let settings = ViscousSettings {
        reynolds: 2e5,
        n_crit: 9.0,
        panels: 160,
    };
    let section = ViscousSection::new(&contour, settings).unwrap();
    let alpha_rad = 4f64.to_radians();
    let mut group = c.benchmark_group("viscous");
    group.sample_size(10);
    group.bench_function("prepare, NACA 2412, 160 panels", |b| {
        b.iter(|| ViscousSection::new(black_box(&contour), settings).unwrap())
    });
    group.bench_function("one point, NACA 2412, 160 panels, Re 2e5, 4 deg", |b| {
        b.iter(|| section.solve(black_box(alpha_rad)).unwrap())
    });
    let alphas: Vec<f64> = (0..30)
        .map(|i| (-4.0 + 0.5 * i as f64).to_radians())
        .collect();
    group.bench_function("polar of 30 angles, NACA 2412, 160 panels, Re 2e5", |b| {
        b.iter(|| Polar::sweep(&section, black_box(&alphas)))
    });
    group.finish();
}

criterion_group!(benches, panel_200, viscous_160);
criterion_main!(benches);
