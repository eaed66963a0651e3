//! Polars kept between runs (`trimline::polar_store`): a polar reads back exactly as it was
//! computed, a second run gives the same output as the first, and a damaged or foreign
//! store file is ignored. The law checked is identity (a store is only a shortcut), so the
//! expected values are the tool's own first results.

use trimline::section::cache::PolarCache;

fn airfoil(naca: &str) -> trimline::model::Airfoil {
    trimline::model::Airfoil {
        name: naca.into(),
        shape: trimline::model::AirfoilShape::Naca(naca.into()),
        cl_max: None,
        method: None,
        reynolds: None,
        transition_n: None,
    }
}

#[test]
fn polars_read_back_exactly() {
    let cache = PolarCache::new();
    let alphas: Vec<f64> = [-3.0f64, 0.0, 3.0, 6.0, 9.0, 12.0, 15.0]
        .iter()
        .map(|d| d.to_radians())
        .collect();
    for (naca, re) in [("2410", 60_000.0), ("0009", 2e5)] {
        cache
            .polar(
                &airfoil(naca),
                trimline::section::viscous::ViscousSettings {
                    reynolds: re,
                    n_crit: 9.0,
                    panels: 120,
                },
                &alphas,
            )
            .unwrap();
    }
    let dir = crate::common::scratch_in("polar-store", "round-trip");
    let path = dir.join("store.txt");
    trimline::polar_store::save(&path, &cache).unwrap();
    let back = PolarCache::new();
    assert_eq!(trimline::polar_store::load(&path, &back), 2);
    let mut a = cache.snapshot();
    let mut b = back.snapshot();
    a.sort_by_key(|e| e.0.reynolds);
    b.sort_by_key(|e| e.0.reynolds);
    assert_eq!(a.len(), b.len());
    for (x, y) in a.iter().zip(&b) {
        assert_eq!(x.0, y.0);
        assert_eq!(*x.1, *y.1, "a polar changed on its way through the store");
    }
    // Some of these angles do not converge or pass the stall: those states travel too.
    assert!(a.iter().any(|e| e.1.entries.iter().any(|en| !matches!(
        en.status,
        trimline::section::polar::PolarStatus::Converged(_)
    ))));
}

fn check_with_store(dir: &std::path::Path) -> std::process::Output {
    std::process::Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(["check", "--json"])
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .env("TRIMLINE_CACHE_DIR", dir)
        .output()
        .expect("the binary runs")
}

#[test]
fn a_second_run_reads_the_store_and_prints_the_same() {
    let dir = crate::common::scratch_in("polar-store", "cli");
    let first = check_with_store(&dir);
    let files: Vec<_> = std::fs::read_dir(&dir).unwrap().flatten().collect();
    assert_eq!(files.len(), 1, "one store file");
    let second = check_with_store(&dir);
    assert_eq!(first.stdout, second.stdout);
    // A damaged store is ignored, and the output is still the same.
    std::fs::write(
        files[0].path(),
        "trimline viscous polars 1\n0 1 2 zz\nnonsense",
    )
    .unwrap();
    let third = check_with_store(&dir);
    assert_eq!(first.stdout, third.stdout);
    assert!(third.status.success() || third.status.code() == Some(3));
}

#[test]
fn off_keeps_nothing() {
    let dir = crate::common::scratch_in("polar-store", "off");
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(["check"])
        .current_dir(&dir)
        .env("TRIMLINE_CACHE_DIR", "off")
        .env("HOME", &dir)
        .env_remove("XDG_CACHE_HOME")
        .output()
        .unwrap();
    assert!(out.status.success() || out.status.code() == Some(3));
    assert_eq!(std::fs::read_dir(&dir).unwrap().count(), 0);
}
