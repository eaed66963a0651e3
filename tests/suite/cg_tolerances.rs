//! The builder's own tolerances of masses and positions, carried into the CG's range.
//!
//! Source: the law of propagation of uncertainty for independent inputs, ISO Guide to the
//! Expression of Uncertainty in Measurement (GUM, JCGM 100:2008), sec. 5.1.2, eq. (10):
//! u_c^2(y) = sum (df/dx_i)^2 u^2(x_i). For the CG x_cg = sum m_i x_i / M the derivatives are
//! (x_i - x_cg) / M in each mass and m_i / M in each position (statics: the CG is the
//! mass-weighted mean position). The expected values below are worked by hand from these.

use approx::assert_relative_eq;
use std::process::Command;
use trimline::analysis::{analyse, AnalysisOptions};
use trimline::input::parse_aircraft;
use trimline::model::{ItemTolerance, MassItem, Tolerances};
use trimline::stability::uncertainty::cg_spread;

const GLIDER: &str = crate::small_glider!(
    name: "Tolerance glider",
    top: "",
    wing: "",
    wing_panel: "tip_chord = 150\n",
    stabiliser: "x = 850\nroot_chord = 110\n",
    stabiliser_panel: "span = 300\ntip_chord = 90\n",
    rest: r#"[[mass]]
name = "fuselage"
mass = 300
x = 100
[[mass]]
name = "nose"
mass = 200
x = -50
"#,
);

fn item(name: &str, g: f64, x_mm: f64) -> MassItem {
    MassItem {
        name: name.into(),
        mass_kg: g / 1000.0,
        x_m: x_mm / 1000.0,
        z_m: None,
        tolerance: ItemTolerance::default(),
    }
}

// Hand-worked, GUM eq. (10): 300 g at 100 mm and 200 g at -50 mm, M = 500 g, x_cg = 40 mm.
// sigma_m = 2 g: ((100-40)/500 2)^2 + ((-50-40)/500 2)^2 = 0.24^2 + 0.36^2 = 0.1872 mm^2;
// sigma_x = 3 mm: (300/500 3)^2 + (200/500 3)^2 = 1.8^2 + 1.2^2 = 4.68 mm^2;
// sigma_cg = sqrt(4.8672) = 2.2062 mm. Tolerance 1e-9 relative: the formula is exact.
#[test]
fn cg_spread_matches_the_propagation_law_worked_by_hand() {
    let masses = [item("a", 300.0, 100.0), item("b", 200.0, -50.0)];
    let tol = Tolerances {
        mass_kg: 0.002,
        position_m: 0.003,
    };
    let s = cg_spread(&masses, &tol);
    assert_relative_eq!(
        s.from_masses_m,
        0.1872f64.sqrt() / 1000.0,
        max_relative = 1e-9
    );
    assert_relative_eq!(
        s.from_positions_m,
        4.68f64.sqrt() / 1000.0,
        max_relative = 1e-9
    );
    assert_relative_eq!(s.sigma_m, 4.8672f64.sqrt() / 1000.0, max_relative = 1e-9);
}

// An item's own tolerance replaces the global one for that item only (aircraft/README.md,
// [tolerances]). Hand-worked as above with item a at sigma_x = 10 mm and no mass tolerance:
// (300/500 10)^2 + (200/500 3)^2 = 36 + 1.44 = 37.44 mm^2.
#[test]
fn an_items_own_tolerance_replaces_the_global_one() {
    let mut a = item("a", 300.0, 100.0);
    a.tolerance.x_m = Some(0.010);
    let masses = [a, item("b", 200.0, -50.0)];
    let tol = Tolerances {
        mass_kg: 0.0,
        position_m: 0.003,
    };
    let s = cg_spread(&masses, &tol);
    assert_relative_eq!(s.sigma_m, 37.44f64.sqrt() / 1000.0, max_relative = 1e-9);
    assert_relative_eq!(s.from_masses_m, 0.0, epsilon = 0.0);
}

/// A small repeatable normal generator for the Monte Carlo below (xorshift64, Box-Muller),
/// written here so the check does not use the library's own sampler.
struct Normal(u64);
impl Normal {
    fn unit(&mut self) -> f64 {
        self.0 ^= self.0 << 13;
        self.0 ^= self.0 >> 7;
        self.0 ^= self.0 << 17;
        ((self.0 >> 11) as f64 + 0.5) / (1u64 << 53) as f64
    }
    fn sample(&mut self) -> f64 {
        let (u1, u2) = (self.unit(), self.unit());
        (-2.0 * u1.ln()).sqrt() * (2.0 * std::f64::consts::PI * u2).cos()
    }
}

// The linear propagation against a Monte Carlo of the CG itself (GUM Supplement 1, JCGM
// 101:2008, propagation of distributions): 20 000 draws give the standard deviation to about
// 1 / sqrt(2 N) = 0.5 %; the CG is nearly linear over gram and millimetre spreads, so the two
// agree within 3 %.
#[test]
fn cg_spread_agrees_with_a_monte_carlo_of_the_cg() {
    let masses = [
        item("a", 300.0, 100.0),
        item("b", 200.0, -50.0),
        item("c", 40.0, 800.0),
    ];
    let tol = Tolerances {
        mass_kg: 0.005,
        position_m: 0.004,
    };
    let linear = cg_spread(&masses, &tol).sigma_m;
    let mut rng = Normal(0x9E37_79B9_7F4A_7C15);
    let n = 20_000;
    let (mut sum, mut sum2) = (0.0, 0.0);
    for _ in 0..n {
        let (mut m_sum, mut mx_sum) = (0.0, 0.0);
        for m in &masses {
            let mass = m.mass_kg + tol.mass_kg * rng.sample();
            let x = m.x_m + tol.position_m * rng.sample();
            m_sum += mass;
            mx_sum += mass * x;
        }
        let cg = mx_sum / m_sum;
        sum += cg;
        sum2 += cg * cg;
    }
    let mean = sum / n as f64;
    let mc = (sum2 / n as f64 - mean * mean).sqrt();
    assert_relative_eq!(linear, mc, max_relative = 0.03);
}

// Defaults stay as they were: a file without tolerances, and one with both set to zero,
// give the same analysis, with no CG spread (issue 16: "defaults must stay as today").
#[test]
fn no_tolerances_change_nothing() {
    let opts = AnalysisOptions::default();
    let plain = parse_aircraft(GLIDER, "t.toml", None).unwrap();
    let zero = parse_aircraft(
        &format!("{GLIDER}[tolerances]\nmass = 0\nposition = \"0 mm\"\n"),
        "t.toml",
        None,
    )
    .unwrap();
    let a = analyse(&plain, &opts).unwrap();
    let b = analyse(&zero, &opts).unwrap();
    assert_relative_eq!(a.cg_spread.sigma_m, 0.0, epsilon = 0.0);
    assert_eq!(a, b);
}

// The file's tolerances, in builder units, reach the analysis: 2 g and 0.3 cm on the glider
// above give the hand-worked 2.2062 mm (first test).
#[test]
fn file_tolerances_reach_the_analysis_in_builder_units() {
    let ac = parse_aircraft(
        &format!("{GLIDER}[tolerances]\nmass = 2\nposition = \"0.3 cm\"\n"),
        "t.toml",
        None,
    )
    .unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    assert_relative_eq!(
        a.cg_spread.sigma_m,
        4.8672f64.sqrt() / 1000.0,
        max_relative = 1e-9
    );
}

// The caution against the uncertain aft limit (docs/cautions.md) looks at the CG's aft end
// when there are tolerances: a CG 3 mm ahead of that limit raises nothing by itself, and
// raises the caution with a 3 mm position tolerance on a single mass (aft end 3 mm aft).
#[test]
fn the_cgs_aft_end_is_checked_against_the_uncertain_aft_limit() {
    let one_mass = |x_mm: f64, extra: &str| {
        let text = GLIDER.replace(
            "[[mass]]\nname = \"fuselage\"\nmass = 300\nx = 100\n[[mass]]\nname = \"nose\"\nmass = 200\nx = -50\n",
            &format!("[[mass]]\nname = \"all\"\nmass = 500\nx = {x_mm}\n{extra}"),
        );
        let ac = parse_aircraft(&text, "t.toml", None).unwrap();
        analyse(&ac, &AnalysisOptions::default()).unwrap()
    };
    let first = one_mass(40.0, "");
    let mac = first.wing_geometry.mac_m;
    let limit =
        first.headline.neutral_point_x_m - 2.0 * first.neutral_point_spread.sigma_m - 0.05 * mac; // the default smallest static margin with a tail, 5 %
                                                                                                  // The recommended band's aft end is that limit (the unsafe side of the estimate is a
                                                                                                  // neutral point further forward than computed), and says so.
    assert!((first.band.aft_x_m - limit).abs() < 1e-12);
    assert_eq!(
        first.band.aft_limit,
        trimline::analysis::AftLimit::NeutralPointRange
    );
    let x_mm = (1000.0 * (limit - 0.003)).round();
    let has = |a: &trimline::analysis::Analysis| {
        a.cautions
            .iter()
            .any(|c| c.code == "cg-aft-of-uncertain-limit")
    };
    // A CG a fraction of a millimetre aft of the band's end (inside the half-millimetre
    // that `cg-aft-of-band` allows) with tolerances still gets this caution: one of the two
    // must speak.
    let on_end = one_mass(1000.0 * limit + 0.3, "x_tolerance = 5\n");
    assert!((on_end.mass.cg_x_m - on_end.band.aft_x_m - 3e-4).abs() < 1e-6);
    assert!(has(&on_end), "{:?}", on_end.cautions);
    assert!(!on_end.cautions.iter().any(|c| c.code == "cg-aft-of-band"));
    let without = one_mass(x_mm, "");
    assert!(!has(&without), "{:?}", without.cautions);
    let with = one_mass(x_mm, "x_tolerance = 3\n");
    assert_relative_eq!(with.cg_spread.sigma_m, 0.003, max_relative = 1e-9);
    assert!(has(&with), "{:?}", with.cautions);
    let msg = &trimline::output::cautions::message(
        with.cautions
            .iter()
            .find(|c| c.code == "cg-aft-of-uncertain-limit")
            .unwrap(),
    );
    assert!(msg.contains("tolerances"), "{msg}");
    assert!(msg.contains("or further forward"), "{msg}");
    // The CG is inside the band and only its tolerance range reaches past the aft end: the
    // message says which is which, with the positions to 0.1 mm (a CG 0.3 mm ahead of the
    // limit must not read as the same number as the limit).
    assert!(
        msg.contains("is inside the recommended band, but")
            && msg.contains(&format!("{:.1} mm", 1000.0 * with.band.aft_x_m))
            && msg.contains(&format!("as far aft as {:.1} mm", x_mm + 6.0)),
        "{msg}"
    );
    // Tolerances so large that the advice would leave the band: the caution says no CG in
    // the band is safe enough and sends the builder to the band's forward end, never to a
    // position outside it.
    let wild = one_mass(x_mm, "x_tolerance = 200\n");
    let caution = wild
        .cautions
        .iter()
        .find(|c| c.code == "cg-aft-of-uncertain-limit")
        .expect("the caution is raised");
    // Its CG range reaches behind the neutral point: a danger, not a warning.
    assert_eq!(caution.level, trimline::caution::Level::Danger);
    let level_with = with
        .cautions
        .iter()
        .find(|c| c.code == "cg-aft-of-uncertain-limit")
        .unwrap()
        .level;
    assert_eq!(level_with, trimline::caution::Level::Warning);
    let msg = &trimline::output::cautions::message(caution);
    let fwd = format!("{:.1} mm", 1000.0 * wild.band.forward_x_m);
    assert!(
        msg.contains("No CG in the recommended band") && msg.contains(&fwd),
        "{msg}"
    );
}

fn check(args: &[&str], text: &str) -> std::process::Output {
    let dir = crate::common::scratch_in("cg-tolerances", "file");
    let path = dir.join("t.toml");
    std::fs::write(&path, text).unwrap();
    let mut all: Vec<&str> = args.to_vec();
    let p = path.to_str().unwrap().to_string();
    all.push(&p);
    Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(&all)
        .output()
        .unwrap()
}

// The output reports the range: the JSON's aft end is the CG plus two standard deviations
// (docs/json.md), the table has its row; without tolerances the aft end is the CG.
#[test]
fn the_output_reports_the_cgs_range() {
    let text = format!("{GLIDER}[tolerances]\nmass = 2\nposition = 3\n");
    let out = check(&["check", "--json"], &text);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let cg = v["balance"]["cg_x_m"].as_f64().unwrap();
    let sigma = v["balance"]["cg_sigma_m"].as_f64().unwrap();
    let aft = v["balance"]["cg_aft_end_x_m"].as_f64().unwrap();
    assert_relative_eq!(sigma, 4.8672f64.sqrt() / 1000.0, epsilon = 1e-5);
    assert_relative_eq!(aft, cg + 2.0 * sigma, epsilon = 2e-5);
    let table = check(&["check"], &text);
    let t = String::from_utf8_lossy(&table.stdout);
    assert!(t.contains("CG, aft end of its range"), "{t}");
    let plain = check(&["check", "--json"], GLIDER);
    let v: serde_json::Value = serde_json::from_slice(&plain.stdout).unwrap();
    assert_eq!(v["balance"]["cg_sigma_m"].as_f64(), Some(0.0));
    assert_eq!(
        v["balance"]["cg_aft_end_x_m"].as_f64(),
        v["balance"]["cg_x_m"].as_f64()
    );
    let t = String::from_utf8_lossy(&check(&["check"], GLIDER).stdout).to_string();
    assert!(!t.contains("CG, aft end of its range"), "{t}");
}

fn error_of(text: &str) -> String {
    parse_aircraft(text, "bad.toml", None)
        .unwrap_err()
        .to_string()
}

// Bad tolerances are refused with file, line, column, key and the accepted range
// (aircraft/README.md, reference table: 0 to 10 000 g, 0 to 1 000 mm).
#[test]
fn bad_tolerances_are_located_errors() {
    let base_lines = GLIDER.lines().count();
    let e = error_of(&format!("{GLIDER}[tolerances]\nmass = -1\n"));
    assert!(
        e.starts_with(&format!("bad.toml:{}:8:", base_lines + 2)),
        "{e}"
    );
    assert!(e.contains("tolerances.mass"), "{e}");
    assert!(e.contains("0 g to 10000 g"), "{e}");

    let e = error_of(&format!("{GLIDER}[tolerances]\nposition = \"2 m\"\n"));
    assert!(e.contains("tolerances.position"), "{e}");
    assert!(e.contains("0 mm to 1000 mm"), "{e}");

    let e = error_of(&format!("{GLIDER}[tolerances]\nposition = true\n"));
    assert!(e.contains("tolerances.position"), "{e}");
    assert!(e.contains("expected a number"), "{e}");

    let e = error_of(&format!("{GLIDER}mass_tolerance = \"20 kg\"\n"));
    assert!(
        e.starts_with(&format!("bad.toml:{}:18:", base_lines + 1)),
        "{e}"
    );
    assert!(e.contains("mass[1].mass_tolerance"), "{e}");
    assert!(e.contains("0 g to 10000 g"), "{e}");

    let e = error_of(&format!("{GLIDER}x_tolerance = nan\n"));
    assert!(e.contains("mass[1].x_tolerance"), "{e}");

    let e = error_of(&format!("{GLIDER}[tolerances]\nweight = 2\n"));
    assert!(e.contains("weight"), "{e}");
}
