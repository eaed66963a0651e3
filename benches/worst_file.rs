//! The largest aircraft file the reader accepts, read and analysed as `trimline check` does:
//! every list at its count limit (src/input/limits.rs), all but one airfoil from a coordinates
//! file of the largest point count. Target: well inside 2 s (README.md, "Limits"). The shared
//! caches (section figures, lattices, polars) live through the iterations, so after the first
//! one this measures a warm analysis; the first, cold one is the `check` of a new file.

use std::hint::black_box;
use std::path::Path;

use criterion::{criterion_group, criterion_main, Criterion};
use trimline::analysis::{analyse, AnalysisOptions};
use trimline::input::coordinates::MAX_COORDINATE_POINTS;
use trimline::input::limits::{
    MAX_AIRFOILS, MAX_BALLAST_BAYS, MAX_MASS_ITEMS, MAX_PANELS_PER_SURFACE, MAX_SETUPS,
};

/// A symmetric section of `n` points (NACA 0012 thickness form), trailing edge to trailing
/// edge over the upper surface first.
fn coordinates(n: usize) -> String {
    let half = n / 2;
    let y = |x: f64| {
        0.6 * (0.2969 * x.sqrt() - 0.126 * x - 0.3516 * x * x + 0.2843 * x.powi(3)
            - 0.1015 * x.powi(4))
    };
    let mut out = String::from("bench section\n");
    for i in 0..=half {
        let x = 0.5 * (1.0 + (std::f64::consts::PI * i as f64 / half as f64).cos());
        out.push_str(&format!("{x:.9} {:.9}\n", y(x)));
    }
    for i in (0..half).rev().take(n - half - 1) {
        let x = 0.5 * (1.0 + (std::f64::consts::PI * i as f64 / half as f64).cos());
        out.push_str(&format!("{x:.9} {:.9}\n", -y(x)));
    }
    out
}

fn worst_file() -> String {
    let p = MAX_PANELS_PER_SURFACE as f64;
    let mut t = String::from("name = \"bench\"\n");
    for a in 0..MAX_AIRFOILS {
        if a == 0 {
            t.push_str("[airfoils.a0]\nnaca = \"2412\"\n");
        } else {
            t.push_str(&format!("[airfoils.a{a}]\ncoordinates = \"foil.dat\"\n"));
        }
    }
    t.push_str("[wing]\nroot_chord = 200\nairfoil = \"a0\"\n");
    for i in 0..MAX_PANELS_PER_SURFACE {
        t.push_str(&format!(
            "[[wing.panel]]\nspan = {}\ntip_chord = {}\ndihedral = {}\ntip_airfoil = \"a{}\"\n",
            1000.0 / p,
            200.0 - 100.0 * (i + 1) as f64 / p,
            i % 5,
            i % MAX_AIRFOILS
        ));
    }
    t.push_str("[stabiliser]\nx = 800\nroot_chord = 110\nairfoil = \"a0\"\n");
    for i in 0..MAX_PANELS_PER_SURFACE {
        t.push_str(&format!(
            "[[stabiliser.panel]]\nspan = {}\ntip_chord = {}\ntip_airfoil = \"a{}\"\n",
            250.0 / p,
            110.0 - 30.0 * (i + 1) as f64 / p,
            i % MAX_AIRFOILS
        ));
    }
    t.push_str("[fuselage]\nnose_x = -380\nlength = 1250\nwidth = 45\n");
    for m in 0..MAX_MASS_ITEMS {
        t.push_str(&format!(
            "[[mass]]\nname = \"m{m}\"\nmass = 3\nx = {}\n",
            45 + (m % 7) * 5
        ));
    }
    for b in 0..MAX_BALLAST_BAYS {
        t.push_str(&format!(
            "[[ballast]]\nname = \"b{b}\"\nx = -300\nmax = 50\n"
        ));
    }
    for s in 0..MAX_SETUPS {
        t.push_str(&format!(
            "[[setup]]\nname = \"s{s}\"\nballast = {{ b{} = 5 }}\nmass_x = {{ m{s} = 70 }}\n",
            s % MAX_BALLAST_BAYS
        ));
    }
    t.push_str("[targets]\nstatic_margin = 10\ntrim_speed = 9\n");
    t
}

fn bench(c: &mut Criterion) {
    let dir = std::env::temp_dir().join(format!("trimline-bench-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    std::fs::write(dir.join("foil.dat"), coordinates(MAX_COORDINATE_POINTS)).unwrap();
    let path = dir.join("worst.toml");
    std::fs::write(&path, worst_file()).unwrap();
    let mut group = c.benchmark_group("worst_file");
    group.sample_size(10);
    group.bench_function("read_and_check", |b| {
        b.iter(|| {
            let aircraft = trimline::input::load_aircraft_file(black_box(Path::new(&path)))
                .expect("the worst file is accepted");
            black_box(analyse(&aircraft, &AnalysisOptions::default()).expect("it analyses"))
        })
    });
    group.finish();
    let _ = std::fs::remove_dir_all(&dir);
}

criterion_group!(benches, bench);
criterion_main!(benches);
