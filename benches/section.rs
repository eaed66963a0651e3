//! Speed of the panel method: a 200-panel linear-vortex solve (influence matrix, LU solve,
//! residual check) and evaluation at one angle of attack, with the nodes given and with the
//! re-panelling included. Issue 3 asks for well under 5 ms in release.

use criterion::{criterion_group, criterion_main, Criterion};
use std::hint::black_box;
use trimline::section::geometry::Contour;
use trimline::section::naca::NacaProfile;
use trimline::section::panel::PanelSolution;

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

criterion_group!(benches, panel_200);
criterion_main!(benches);
