//! Figures as a builder reads them: the Reynolds caution at the wing tip at the stall speed,
//! Reynolds numbers to three figures.
//!
//! Source: Re = V c / nu with the sea-level kinematic viscosity of the US Standard
//! Atmosphere 1976 (Sutherland's law): Re per (m/s x m) = 68,459 at sea level (REFERENCES.md,
//! atmosphere table). Tolerance 0.5 %: the message prints three significant figures.

use trimline::analysis::{analyse, AnalysisOptions};
use trimline::input::parse_aircraft;

const SMALL: &str = r#"
name = "Small glider"
[air]
altitude = 0
[airfoils.w]
naca = "2412"
cl_max = 1.0
[wing]
root_chord = 180
incidence = 2
airfoil = "w"
[[wing.panel]]
span = 600
tip_chord = 80
[stabiliser]
x = 600
root_chord = 80
airfoil = "w"
incidence = 0
[[stabiliser.panel]]
span = 180
tip_chord = 60
[[mass]]
name = "all"
mass = 250
x = 50
"#;

#[test]
fn reynolds_caution_looks_at_the_tip_at_the_stall_speed() {
    let ac = parse_aircraft(SMALL, "t.toml", None).unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    let c = a
        .cautions
        .iter()
        .find(|c| c.code == "reynolds-low")
        .expect("a small wing's tip at the stall is at low Reynolds number");
    // Chord at 95 % of the 600 mm semispan of a straight taper 180 -> 80 mm: 85 mm.
    let chord = 0.180 - 0.95 * (0.180 - 0.080);
    let expected = 68_459.0 * a.headline.stall_speed_m_s * chord;
    let tip = trimline::output::cautions::message(c)
        .split("it is ")
        .nth(1)
        .and_then(|s| s.split(':').next())
        .map(|s| s.replace(',', ""))
        .and_then(|s| s.parse::<f64>().ok())
        .expect("the tip Reynolds number in the message");
    assert!(
        (tip - expected).abs() < 0.005 * expected,
        "{tip} vs {expected}: {}",
        trimline::output::cautions::message(c)
    );
    assert!(
        trimline::output::cautions::message(c).contains("(85 mm chord"),
        "{}",
        trimline::output::cautions::message(c)
    );
}

fn trimline(args: &[&str]) -> String {
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .output()
        .unwrap();
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    String::from_utf8(out.stdout).unwrap()
}

/// The number in the table row that starts with `label`, in column `col` (0 the label).
fn cell(text: &str, label: &str, col: usize) -> f64 {
    let line = text
        .lines()
        .find(|l| l.trim_start_matches(['│', ' ']).starts_with(label))
        .unwrap_or_else(|| panic!("no row {label}"));
    let cells: Vec<&str> = line.split(['│', '┆']).map(str::trim).collect();
    cells[col + 1].parse().unwrap()
}

// --unit-system imperial prints inches and ounces: 1 in = 25.4 mm and 1 oz = 28.349523125 g
// exactly (international yard and pound, 1959). Tolerance: the printed rounding (0.1 mm and
// 0.01 in; 0.1 g and 0.01 oz).
#[test]
fn imperial_tables_are_the_metric_ones_in_inches_and_ounces() {
    let file = "aircraft/wrenfield-1400.toml";
    let metric = trimline(&["check", file]);
    let imperial = trimline(&["check", file, "--unit-system", "imperial"]);
    assert!(imperial.contains("mass oz") && imperial.contains("x in"));
    let (cg_mm, cg_in) = (
        cell(&metric, "total / CG", 2),
        cell(&imperial, "total / CG", 2),
    );
    assert!(
        (cg_mm / 25.4 - cg_in).abs() < 0.006 + 0.05 / 25.4,
        "{cg_mm} mm vs {cg_in} in"
    );
    let (m_g, m_oz) = (
        cell(&metric, "total / CG", 1),
        cell(&imperial, "total / CG", 1),
    );
    assert!(
        (m_g / 28.349_523_125 - m_oz).abs() < 0.006 + 0.05 / 28.35,
        "{m_g} g vs {m_oz} oz"
    );
    let compare = trimline(&[
        "compare",
        "aircraft/larkspire-2000.toml",
        "--unit-system",
        "imperial",
    ]);
    assert!(
        compare.contains("mass oz") && compare.contains("CG in from datum"),
        "{compare}"
    );
}

// A tail load under 10 g keeps one decimal, so a small download never reads "0 g"; larger
// loads are whole grams (their accuracy). The demo sailplane carries a fraction of a gram.
#[test]
fn small_tail_loads_keep_a_decimal() {
    for file in [
        "aircraft/larkspire-2000.toml",
        "aircraft/wrenfield-1400.toml",
    ] {
        let text = trimline(&["check", file]);
        let line = text
            .lines()
            .find(|l| l.contains("stabiliser load at trim"))
            .unwrap();
        let value = line
            .split('┆')
            .nth(1)
            .unwrap()
            .trim()
            .trim_end_matches(" g");
        let grams: f64 = value.parse().unwrap();
        assert_eq!(value.contains('.'), grams.abs() < 10.0, "{line}");
        assert_ne!(value.trim_start_matches('-'), "0", "{line}");
    }
}
