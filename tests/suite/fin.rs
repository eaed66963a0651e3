//! The fin (vertical tail) and a V-tail's side projection: geometry, the vertical tail volume
//! coefficient as a lateral note, its caution, that neither enters the pitch figures, the
//! drawing data of the side view, and bad input.
//!
//! Sources:
//! - D. P. Raymer, *Aircraft Design: A Conceptual Approach*, sec. 7.3: the MAC of a trapezoid
//!   `(2/3) c_r (1 + l + l^2)/(1 + l)` at `(b/6) (1 + 2 l)/(1 + l)` from the root of a
//!   symmetric wing of span b (for a fin of height h: `(h/3)(1 + 2 l)/(1 + l)`); sec. 6.4,
//!   eq. 6.29 and the table of tail volume coefficients there (Table 6.4; equation and table
//!   numbers from memory): `c_VT = L_VT S_VT / (b_W S_W)`, typical values 0.02 (sailplanes)
//!   to 0.09 (jet transports), the arm from the wing's quarter-MAC to the tail's quarter-MAC.
//! - P. E. Purser, J. P. Campbell, *Experimental verification of a simplified vee-tail
//!   theory and analysis of available data on complete models with vee tails*, NACA Report
//!   823 (1945): a V-tail of area S and dihedral G acts in pitch as a flat tail of about
//!   S cos^2 G and in yaw as a fin of about S sin^2 G.

use approx::assert_relative_eq;
use trimline::analysis::{analyse, Analysis, AnalysisOptions};
use trimline::input::parse_aircraft;
use trimline::output::report::{self, ReportSource};

/// A rectangular wing (MAC = chord = 200 mm, MAC quarter chord at x = 50 mm, span 2 m,
/// area 0.4 m^2: worked by hand) and a flat tail.
const BASE: &str = crate::small_glider!(
    name: "Fin glider",
    top: "",
    wing: "",
    wing_panel: "",
    stabiliser: "x = 850\nroot_chord = 110\n",
    stabiliser_panel: "span = 300\ntip_chord = 90\n",
    rest: r#"[[mass]]
name = "fuselage"
mass = 600
x = 50
[[mass]]
name = "fin"
mass = 20
x = 900
"#,
);

/// A fin of root chord 160, tip chord 80, height 200 mm, leading edge swept 30 deg, its root
/// leading edge at x = 840 mm.
const FIN: &str = "[fin]\nx = 840\nz = 20\nroot_chord = 160\ntip_chord = 80\nheight = 200\nsweep = 30\nmass_item = \"fin\"\n";

fn analysis(text: &str) -> Analysis {
    let ac = parse_aircraft(text, "t.toml", None).unwrap();
    analyse(&ac, &AnalysisOptions::default()).unwrap()
}

fn has(a: &Analysis, code: &str) -> bool {
    a.cautions.iter().any(|c| c.code == code)
}

// Fin area, arm and volume coefficient worked by hand from Raymer's formulas (module doc):
// taper l = 0.5; S_v = (160 + 80)/2 x 200 = 24 000 mm^2; MAC = (2/3) 160 (1.75/1.5) = 124.44
// mm at z = (200/3)(2/1.5) = 88.89 mm above the root, its leading edge 88.89 tan 30 = 51.32 mm
// aft of the root's: the quarter chord at 840 + 51.32 + 31.11 = 922.43 mm; the arm from the
// wing's MAC quarter chord (50 mm) is 872.43 mm; V_v = 0.024 x 0.87243 / (0.4 x 2) = 0.02617.
// Tolerance 1e-9: the geometry is exact.
#[test]
fn fin_volume_coefficient_matches_raymers_formula_worked_by_hand() {
    let a = analysis(&format!("{BASE}{FIN}"));
    let f = a.fin.expect("a fin note").fin.expect("the fin's figures");
    let l: f64 = 0.5;
    let mac = 2.0 / 3.0 * 160.0 * (1.0 + l + l * l) / (1.0 + l);
    let z_mac = 200.0 / 3.0 * (1.0 + 2.0 * l) / (1.0 + l);
    let quarter = 840.0 + z_mac * 30f64.to_radians().tan() + 0.25 * mac;
    let arm_mm = quarter - 50.0;
    assert_relative_eq!(f.side_area_m2, 0.024, max_relative = 1e-9);
    assert_relative_eq!(f.arm_m, arm_mm / 1000.0, max_relative = 1e-9);
    assert_relative_eq!(
        f.volume_coefficient,
        0.024 * (arm_mm / 1000.0) / (0.4 * 2.0),
        max_relative = 1e-9
    );
    // Inside Raymer's typical range: no note.
    assert!(!has(&a, "fin-volume-outside-range"), "{:?}", a.cautions);
    assert!(a.fin.unwrap().vee_tail.is_none());
}

// The fin does not enter the pitch figures (its stated role): neutral point, margin, band,
// trim and stall are the same with and without it. The mass is the listed item either way,
// so the CG cannot change (no double count).
#[test]
fn the_fin_does_not_change_the_pitch_figures_or_the_mass() {
    let without = analysis(BASE);
    let with = analysis(&format!("{BASE}{FIN}"));
    assert_eq!(without.headline, with.headline);
    assert_eq!(without.band, with.band);
    assert_eq!(without.mass, with.mass);
    assert!(without.fin.is_none());
}

// Raymer's range (0.02 to 0.09): a fin of a tenth of the area above (V_v about 0.0026) gets
// the note, which says it is lateral only; so does one far too large.
#[test]
fn a_fin_outside_the_published_range_gets_a_note() {
    let small = FIN.replace(
        "root_chord = 160\ntip_chord = 80\nheight = 200",
        "root_chord = 50\ntip_chord = 30\nheight = 60",
    );
    let a = analysis(&format!("{BASE}{small}"));
    let v = a.fin.unwrap().fin.unwrap().volume_coefficient;
    assert!(v < 0.02, "{v}");
    let c = a
        .cautions
        .iter()
        .find(|c| c.code == "fin-volume-outside-range")
        .expect("note raised");
    assert!(
        trimline::output::cautions::message(c).contains("below"),
        "{}",
        trimline::output::cautions::message(c)
    );
    assert!(
        trimline::output::cautions::message(c).contains("does not enter the"),
        "{}",
        trimline::output::cautions::message(c)
    );

    let big = FIN.replace("height = 200", "height = 800");
    let a = analysis(&format!("{BASE}{big}"));
    assert!(a.fin.unwrap().fin.unwrap().volume_coefficient > 0.09);
    assert!(has(&a, "fin-volume-outside-range"));
}

// A fin ahead of the wing (here typed from the wrong end) destabilises in yaw: a warning
// that names fin.x, not a volume note (common practice: the fin acts only behind the CG).
#[test]
fn a_fin_ahead_of_the_wing_is_a_warning() {
    let ahead = FIN.replace("x = 840", "x = -300");
    let a = analysis(&format!("{BASE}{ahead}"));
    let c = a
        .cautions
        .iter()
        .find(|c| c.code == "fin-ahead-of-wing")
        .expect("warning raised");
    assert_eq!(c.level, trimline::caution::Level::Warning);
    assert!(
        trimline::output::cautions::message(c).contains("fin.x"),
        "{}",
        trimline::output::cautions::message(c)
    );
    assert!(!has(&a, "fin-volume-outside-range"));
    assert!(!has(
        &analysis(&format!("{BASE}{FIN}")),
        "fin-ahead-of-wing"
    ));
}

/// The base glider with its tail turned into a V-tail of 40 deg dihedral.
fn vee(extra: &str) -> String {
    format!(
        "{}{extra}",
        BASE.replace(
            "span = 300\ntip_chord = 90\n",
            "span = 300\ntip_chord = 90\ndihedral = 40\n"
        )
    )
}

// Purser and Campbell (NACA Report 823): the V-tail's side area is its area in its own plane
// times sin^2 of the dihedral, its pitch area that times cos^2, so the two add up to the
// true area. True area by hand: 2 x 300 x (110 + 90)/2 = 60 000 mm^2. A V-tail gets no fin
// note even with a fin far too small beside it.
#[test]
fn a_vee_tail_is_the_fin_with_the_sin_squared_side_area() {
    let g: f64 = 40f64.to_radians();
    let a = analysis(&vee(""));
    let v = a
        .fin
        .expect("a V-tail gives a note")
        .vee_tail
        .expect("its side figures");
    assert_relative_eq!(v.side_area_m2, 0.060 * g.sin().powi(2), max_relative = 1e-9);
    let pitch = a.stabiliser.as_ref().unwrap().pitch_area_m2;
    assert_relative_eq!(v.side_area_m2 + pitch, 0.060, max_relative = 1e-9);

    let tiny = FIN.replace(
        "root_chord = 160\ntip_chord = 80\nheight = 200",
        "root_chord = 20\ntip_chord = 10\nheight = 20",
    );
    let a = analysis(&vee(&tiny));
    assert!(a.fin.unwrap().fin.unwrap().volume_coefficient < 0.02);
    assert!(!has(&a, "fin-volume-outside-range"), "{:?}", a.cautions);
}

// The output says the fin is lateral only (issue 16), and names the V-tail as the fin.
#[test]
fn the_output_states_the_fins_role() {
    let dir = crate::common::scratch_in("fin", "output");
    std::fs::write(dir.join("fin.toml"), format!("{BASE}{FIN}")).unwrap();
    std::fs::write(dir.join("vee.toml"), vee("")).unwrap();
    let out = crate::common::run_trimline(&["check", "fin.toml"], &dir);
    let t = String::from_utf8_lossy(&out.stdout);
    assert!(
        t.contains("the fin does not enter the pitch figures"),
        "{t}"
    );
    assert!(t.contains("`fin`"), "{t}");
    let out = crate::common::run_trimline(&["check", "--json", "fin.toml"], &dir);
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    assert!(v["fin"]["fin"]["volume_coefficient"].as_f64().unwrap() > 0.02);
    assert!(v["fin"]["vee_tail"].is_null());
    let out = crate::common::run_trimline(&["check", "vee.toml"], &dir);
    let t = String::from_utf8_lossy(&out.stdout);
    assert!(t.contains("The V-tail is the fin"), "{t}");
    assert!(t.contains("sin^2"), "{t}");
}

fn report_of(text: &str) -> report::ReportData {
    let ac = parse_aircraft(text, "t.toml", None).unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    report::build(
        &ac,
        &a,
        ReportSource {
            file_name: "t.toml".into(),
            content_hash: String::new(),
            date: String::new(),
        },
    )
}

fn z_extent(o: &[(f64, f64)]) -> f64 {
    let z = o.iter().map(|p| p.1);
    z.clone().fold(f64::NEG_INFINITY, f64::max) - z.fold(f64::INFINITY, f64::min)
}

// The side view's data: the fin stands its height above its root, and the V-tail shows its
// projected height, span along the panel x sin(dihedral) (300 sin 40 deg = 192.8 mm; the
// projection of a straight panel, exact); a flat tail is a line. The fin's line on the top
// view's centre line runs from its root leading edge to its tip trailing edge (840 mm to
// 840 + 200 tan 30 + 80 = 1035.5 mm).
#[test]
fn the_side_view_draws_the_fin_and_the_vee_tails_height() {
    let d = report_of(&format!("{BASE}{FIN}"));
    let side = &d.top_view.side;
    assert_eq!(side.len(), 3, "wing, tail, fin");
    assert_relative_eq!(z_extent(&side[2]), 0.200, max_relative = 1e-9);
    assert!(z_extent(&side[1]) < 1e-12, "a flat tail is a line");
    let (x0, x1) = d.top_view.fin_x_m.unwrap();
    assert_relative_eq!(x0, 0.840, max_relative = 1e-9);
    assert_relative_eq!(
        x1,
        (840.0 + 200.0 * 30f64.to_radians().tan() + 80.0) / 1000.0,
        max_relative = 1e-9
    );

    let d = report_of(&vee(""));
    assert_eq!(d.top_view.side.len(), 2);
    assert_relative_eq!(
        z_extent(&d.top_view.side[1]),
        0.300 * 40f64.to_radians().sin(),
        max_relative = 1e-9
    );
    assert!(d.top_view.fin_x_m.is_none());
}

fn error_of(text: &str) -> String {
    parse_aircraft(text, "bad.toml", None)
        .unwrap_err()
        .to_string()
}

// Bad fins are refused with file, line, column, key and the accepted range
// (aircraft/README.md, reference table).
#[test]
fn bad_fins_are_located_errors() {
    let line0 = BASE.lines().count() + 1; // the [fin] line
    let e = error_of(&format!(
        "{BASE}{}",
        FIN.replace("height = 200", "height = 0")
    ));
    assert!(e.starts_with(&format!("bad.toml:{}:10:", line0 + 5)), "{e}");
    assert!(e.contains("fin.height"), "{e}");
    assert!(e.contains("5 mm to 30000 mm"), "{e}");

    let e = error_of(&format!("{BASE}{}", FIN.replace("x = 840\n", "")));
    assert!(e.starts_with(&format!("bad.toml:{line0}:")), "{e}");
    assert!(e.contains("fin.x"), "{e}");
    assert!(e.contains("missing"), "{e}");

    let e = error_of(&format!(
        "{BASE}{}",
        FIN.replace("sweep = 30", "sweep = 75")
    ));
    assert!(e.contains("fin.sweep"), "{e}");
    assert!(e.contains("-60 deg to 60 deg"), "{e}");

    let e = error_of(&format!(
        "{BASE}{}",
        FIN.replace("root_chord = 160", "root_chord = \"1 kg\"")
    ));
    assert!(e.contains("fin.root_chord"), "{e}");

    let e = error_of(&format!("{BASE}{}", FIN.replace("\"fin\"", "\"rudder\"")));
    assert!(e.starts_with(&format!("bad.toml:{}:13:", line0 + 7)), "{e}");
    assert!(e.contains("fin.mass_item"), "{e}");
    assert!(e.contains("no mass item named `rudder`"), "{e}");
    assert!(e.contains("'fuselage', 'fin'"), "{e}");

    let e = error_of(&format!("{BASE}{FIN}mass = 20\n"));
    assert!(e.contains("mass"), "{e}");
    assert!(e.contains("fin"), "{e}");
}

// The fin's mass item is checked for lying on the fin (a note, not an error).
#[test]
fn a_fin_mass_item_away_from_the_fin_gets_a_note() {
    let a = analysis(&format!("{BASE}{FIN}"));
    assert!(!has(&a, "fin-mass-away-from-fin"));
    let moved = BASE.replace("mass = 20\nx = 900", "mass = 20\nx = 300");
    let a = analysis(&format!("{moved}{FIN}"));
    assert!(has(&a, "fin-mass-away-from-fin"), "{:?}", a.cautions);
}
