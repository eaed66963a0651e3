//! Benchmark of the flight polar of the demo sailplane (40 trimmed speeds with viscous
//! section drag), after its section polars are in the cache: the target is under
//! 50 ms.

use std::hint::black_box;

use criterion::{criterion_group, criterion_main, Criterion};
use trimline::analysis::glide::{glide_polar, GlideInput};
use trimline::analysis::{analyse, lifting_line_options, AnalysisOptions};
use trimline::atmosphere;
use trimline::stability::trim;

fn bench(c: &mut Criterion) {
    let text = std::fs::read_to_string("aircraft/larkspire-2000.toml").unwrap();
    let ac = trimline::input::parse_aircraft(&text, "larkspire-2000.toml", None).unwrap();
    let options = AnalysisOptions::default();
    // The first analysis fills the polar cache.
    let a = analyse(&ac, &options).unwrap();
    let system = trim::build_system(&ac, &a.sections, lifting_line_options(&ac, &options)).unwrap();
    let air = atmosphere::air_state(&ac.air);
    let full = a.full.as_ref().unwrap();
    let input = GlideInput {
        aircraft: &ac,
        system: &system,
        sections: &a.sections,
        full,
        mass_kg: a.mass.total_kg,
        cg_m: (a.mass.cg_x_m, a.mass.cg_z_m.unwrap_or(ac.wing.root_le_z_m)),
        air: &air,
        panels: options.panels,
    };
    c.bench_function(
        "flight polar of the demo, 40 speeds, cached sections",
        |b| b.iter(|| black_box(glide_polar(black_box(&input)).unwrap())),
    );
}

criterion_group!(benches, bench);
criterion_main!(benches);
