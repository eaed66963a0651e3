//! Golden files of `check`: the tables (metric and imperial) and the JSON of every example
//! aircraft and every setup, written before the analysis core was refactored so that a
//! refactor that should change no printed figure shows any figure it does change.
//!
//! The files are `tests/data/golden/<aircraft>[@<setup>].{metric,imperial}.txt` and
//! `.json`. Refresh after an intended change with
//! `UPDATE_EXPECT=1 cargo test --release --test suite golden_check`, and read the diff.
//!
//! These are regression checks of our own output, not validation against the outside: the
//! outside checks of each figure are in the other modules.

use std::path::{Path, PathBuf};
use trimline::analysis::{analyse, AnalysisOptions};
use trimline::output::units::UnitSystem;

fn examples() -> Vec<PathBuf> {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("aircraft");
    let mut files: Vec<PathBuf> = std::fs::read_dir(&dir)
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|e| e == "toml"))
        .collect();
    files.sort();
    files
}

/// JSON with every number rounded to 9 significant figures, so that a change in the last
/// bits of a root finder does not count as a changed figure.
fn rounded(v: &serde_json::Value) -> serde_json::Value {
    use serde_json::Value;
    match v {
        Value::Number(n) => match n.as_f64() {
            Some(x) if n.is_f64() && x != 0.0 => {
                let s = format!("{x:.8e}");
                serde_json::from_str(&s.parse::<f64>().unwrap().to_string()).unwrap()
            }
            _ => v.clone(),
        },
        Value::Array(a) => Value::Array(a.iter().map(rounded).collect()),
        Value::Object(o) => Value::Object(o.iter().map(|(k, x)| (k.clone(), rounded(x))).collect()),
        other => other.clone(),
    }
}

fn compare_or_update(path: &Path, got: &str, failures: &mut Vec<String>) {
    if std::env::var_os("UPDATE_EXPECT").is_some() {
        std::fs::create_dir_all(path.parent().unwrap()).unwrap();
        std::fs::write(path, got).unwrap();
        return;
    }
    let want = std::fs::read_to_string(path).unwrap_or_default();
    if want != got {
        let first = want
            .lines()
            .zip(got.lines())
            .enumerate()
            .find(|(_, (w, g))| w != g)
            .map(|(i, (w, g))| format!("line {}:\n  expected: {w}\n  got:      {g}", i + 1))
            .unwrap_or_else(|| "lengths differ".to_string());
        failures.push(format!("{}: {first}", path.display()));
    }
}

#[test]
fn check_output_of_every_example_matches_its_golden_file() {
    let golden = Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/data/golden");
    let mut failures = Vec::new();
    let mut count = 0;
    for file in examples() {
        let text = std::fs::read_to_string(&file).unwrap();
        let stem = file.file_stem().unwrap().to_string_lossy().to_string();
        let shown = format!("aircraft/{stem}.toml");
        let base = trimline::input::parse_aircraft(&text, &shown, None).unwrap();
        let mut configs = vec![(stem.clone(), base.clone())];
        for s in &base.setups {
            configs.push((
                format!("{stem}@{}", s.name.replace(' ', "-")),
                s.apply(&base),
            ));
        }
        for (name, aircraft) in configs {
            let a = analyse(&aircraft, &AnalysisOptions::default()).unwrap();
            for (u, tag) in [
                (UnitSystem::Metric, "metric"),
                (UnitSystem::Imperial, "imperial"),
            ] {
                let got = trimline::output::tables::check_report(&aircraft, &a, &shown, u);
                compare_or_update(
                    &golden.join(format!("{name}.{tag}.txt")),
                    &got,
                    &mut failures,
                );
            }
            let doc = trimline::output::json::check_document(&aircraft, &a, &shown);
            let got = format!(
                "{}\n",
                serde_json::to_string_pretty(&rounded(&serde_json::to_value(&doc).unwrap()))
                    .unwrap()
            );
            compare_or_update(&golden.join(format!("{name}.json")), &got, &mut failures);
            count += 1;
        }
    }
    assert!(
        count >= 4,
        "expected every example and its setups, got {count}"
    );
    assert!(
        failures.is_empty(),
        "{} golden file(s) differ:\n{}\nRun with UPDATE_EXPECT=1 to accept an intended change.",
        failures.len(),
        failures.join("\n")
    );
}
