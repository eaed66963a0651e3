//! Polars, section figures and lattices kept between runs (`trimline::polar_store`,
//! `trimline::lattice_store`): a polar reads back exactly as it was
//! computed, a second run gives the same output as the first, and a damaged or foreign
//! store file is ignored. The law checked is identity (a store is only a shortcut), so the
//! expected values are the tool's own first results.

use trimline::section::cache::{FigureCache, PolarCache};

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
    let none = FigureCache::default();
    let kept = trimline::polar_store::Caches {
        polars: &cache,
        figures: &none,
    };
    trimline::polar_store::save(&path, &kept).unwrap();
    let back = PolarCache::new();
    let read = trimline::polar_store::Caches {
        polars: &back,
        figures: &none,
    };
    assert_eq!(trimline::polar_store::load(&path, &read), 2);
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
    let files: Vec<_> = std::fs::read_dir(&dir)
        .unwrap()
        .flatten()
        .filter(|e| e.file_name().to_string_lossy().starts_with("polars-"))
        .collect();
    assert_eq!(files.len(), 1, "one store file");
    // The demo's condensed vortex lattice is kept too (see `trimline::lattice_store`); the
    // second run reads it instead of building it.
    let lattices = std::fs::read_dir(&dir)
        .unwrap()
        .flatten()
        .filter(|e| e.file_name().to_string_lossy().starts_with("lattice-"))
        .count();
    assert_eq!(lattices, 1, "one lattice file");
    let second = check_with_store(&dir);
    assert_eq!(first.stdout, second.stdout);
    // A damaged store is ignored, and the output is still the same.
    std::fs::write(
        files[0].path(),
        "trimline stored results 2\np 0 1 2 zz\nf 3 0\nnonsense",
    )
    .unwrap();
    let third = check_with_store(&dir);
    assert_eq!(first.stdout, third.stdout);
    assert!(third.status.success() || third.status.code() == Some(3));
    // So is a damaged lattice file.
    for e in std::fs::read_dir(&dir).unwrap().flatten() {
        if e.file_name().to_string_lossy().starts_with("lattice-") {
            std::fs::write(e.path(), b"trimline lattice 1\n\x01\x02").unwrap();
        }
    }
    let fourth = check_with_store(&dir);
    assert_eq!(first.stdout, fourth.stdout);
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

#[test]
fn section_figures_read_back_exactly_and_make_the_same_model() {
    let options = trimline::section::SectionOptions { panels: 120 };
    let figures = FigureCache::default();
    for naca in ["2410", "0009"] {
        let a = airfoil(naca);
        figures
            .panel_figures(&a, options.panels, || {
                trimline::section::solve_section(
                    &a,
                    trimline::model::SectionMethod::Panel,
                    &options,
                )
            })
            .unwrap();
    }
    assert_eq!(figures.computed(), 2);
    let dir = crate::common::scratch_in("polar-store", "figures");
    let path = dir.join("store.txt");
    let polars = PolarCache::new();
    let kept = trimline::polar_store::Caches {
        polars: &polars,
        figures: &figures,
    };
    trimline::polar_store::save(&path, &kept).unwrap();
    let back = FigureCache::default();
    let read = trimline::polar_store::Caches {
        polars: &polars,
        figures: &back,
    };
    assert_eq!(trimline::polar_store::load(&path, &read), 2);
    for naca in ["2410", "0009"] {
        let a = airfoil(naca);
        // Served from what was read: the solver given here is never called.
        let stored = back
            .panel_figures(&a, options.panels, || panic!("solved again"))
            .unwrap();
        let solution =
            trimline::section::solve_section(&a, trimline::model::SectionMethod::Panel, &options)
                .unwrap();
        assert_eq!(
            trimline::section::model_from_figures(&a, &stored).unwrap(),
            trimline::section::model_from_solution(&a, &solution).unwrap()
        );
    }
    assert_eq!(back.computed(), 0);
}
