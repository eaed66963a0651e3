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
    let tip = c
        .message
        .split("it is ")
        .nth(1)
        .and_then(|s| s.split(':').next())
        .map(|s| s.replace(',', ""))
        .and_then(|s| s.parse::<f64>().ok())
        .expect("the tip Reynolds number in the message");
    assert!(
        (tip - expected).abs() < 0.005 * expected,
        "{tip} vs {expected}: {}",
        c.message
    );
    assert!(c.message.contains("(85 mm chord"), "{}", c.message);
}
