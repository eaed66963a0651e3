//! A 10 000-point trade study as `trimline sweep` runs it: the demo sailplane over 100 CG
//! positions x 100 stabiliser incidences, each point with trim, the trimmed stall, the
//! forward CG limit from elevator authority, the elevator at the target speed and the
//! cautions (README.md, "Performance").

use std::hint::black_box;

use criterion::{criterion_group, criterion_main, Criterion};
use trimline::analysis::AnalysisOptions;
use trimline::study::{Axis, Quantity, Study};

fn sweep(c: &mut Criterion) {
    let text = include_str!("../aircraft/larkspire-2000.toml");
    let aircraft = trimline::input::parse_aircraft(text, "larkspire-2000.toml", None).unwrap();
    let cg: Vec<f64> = (0..100).map(|i| 0.050 + 0.0005 * i as f64).collect();
    let incidence: Vec<f64> = (0..100)
        .map(|i| (0.5 + 0.02 * i as f64).to_radians())
        .collect();
    let mut group = c.benchmark_group("sweep");
    group.sample_size(10);
    group.bench_function("10000 points, CG x stabiliser incidence", |b| {
        b.iter(|| {
            let study = Study::new(
                &aircraft,
                vec![
                    Axis {
                        quantity: Quantity::CgX,
                        values: cg.clone(),
                    },
                    Axis {
                        quantity: Quantity::StabiliserIncidence,
                        values: incidence.clone(),
                    },
                ],
                AnalysisOptions {
                    flight_polar: false,
                    ..AnalysisOptions::default()
                },
            )
            .unwrap();
            black_box(study.run(&|| {}))
        })
    });
    group.finish();
}

criterion_group!(benches, sweep);
criterion_main!(benches);
