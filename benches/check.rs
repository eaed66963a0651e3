//! Benchmark of the analysis behind `trimline check` of each example aircraft, warm: the
//! first analysis fills the shared caches (viscous polars, panel-method section figures,
//! condensed lattices), as an earlier run fills the store a warm `check` reads. Issue 15's
//! target is for the whole command (scripts/check-ratio.sh): under 3 times the bare process
//! start.

use std::hint::black_box;

use criterion::{criterion_group, criterion_main, Criterion};
use trimline::analysis::{analyse, AnalysisOptions};

fn bench(c: &mut Criterion) {
    let mut group = c.benchmark_group("check, warm");
    group.sample_size(20);
    for name in [
        "larkspire-2000",
        "merrowtail-1700",
        "skerrywing-900",
        "wrenfield-1400",
    ] {
        let path = format!("aircraft/{name}.toml");
        let text = std::fs::read_to_string(&path).unwrap();
        let ac = trimline::input::parse_aircraft(&text, &path, None).unwrap();
        let options = AnalysisOptions::default();
        analyse(&ac, &options).unwrap();
        group.bench_function(name, |b| {
            b.iter(|| black_box(analyse(black_box(&ac), &options).unwrap()))
        });
    }
    group.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
