//! Per-setup weighing, the vertical CG, and comparisons across files with different datums.
//!
//! Sources: statics (the CG as the mass-weighted mean position; FAA, Aircraft Weight and
//! Balance Handbook, FAA-H-8083-1, ch. 2: moving the datum moves every arm by the same
//! amount and nothing else) and the rule that a weighing describes the masses that were on
//! the scales.

use trimline::analysis::{analyse, to_common_reference, AnalysisOptions, KeyFigures};
use trimline::input::parse_aircraft;

const BASE: &str = crate::small_glider!(
    name: "Datum glider",
    top: "datum = \"DATUM\"\n",
    wing: "x = WING_X\n",
    wing_panel: "tip_chord = 200\n",
    stabiliser: "x = STAB_X\nroot_chord = 100\n",
    stabiliser_panel: "span = 250\ntip_chord = 100\n",
    rest: r#"[[mass]]
name = "airframe"
mass = 900
x = MASS_X
[[mass]]
name = "battery"
mass = 100
x = BATT_X
[[ballast]]
name = "nose"
x = BALLAST_X
max = 500
[[weighing]]
x = W1
reading = 640
[[weighing]]
x = W2
reading = 360
[[setup]]
name = "nose lead"
ballast = { nose = 20 }
[[setup]]
name = "weighed with lead"
ballast = { nose = 20 }
[[setup.weighing]]
x = W1
reading = 670
[[setup.weighing]]
x = W2
reading = 350
[[setup]]
name = "less decalage"
wing_incidence = 1.5
"#,
);

/// The aircraft with every position measured from a datum `shift_mm` ahead of the wing root.
fn text(shift_mm: f64, datum: &str) -> String {
    let at = |mm: f64| format!("{}", mm + shift_mm);
    BASE.replace("DATUM", datum)
        .replace("WING_X", &at(0.0))
        .replace("STAB_X", &at(900.0))
        .replace("MASS_X", &at(70.0))
        .replace("BATT_X", &at(-100.0))
        .replace("BALLAST_X", &at(-300.0))
        .replace("W1", &at(20.0))
        .replace("W2", &at(150.0))
}

fn key_figures(text: &str) -> Vec<KeyFigures> {
    let ac = parse_aircraft(text, "test.toml", None).unwrap();
    let mut variants = vec![ac.clone()];
    variants.extend(ac.setups.iter().map(|s| s.apply(&ac)));
    variants
        .iter()
        .map(|v| KeyFigures::of(v, &analyse(v, &AnalysisOptions::default()).unwrap()))
        .collect()
}

// A setup that adds ballast is not the aircraft that was weighed: without its own weighing
// it has none (and no weighing-differs caution from the base's scales); with its own it is
// checked against that one; a setup that changes only an incidence keeps the base's.
#[test]
fn each_setup_is_checked_against_its_own_weighing() {
    let ac = parse_aircraft(&text(0.0, "wing root leading edge"), "t.toml", None).unwrap();
    let weighed = |i: usize| {
        let v = ac.setups[i].apply(&ac);
        analyse(&v, &AnalysisOptions::default()).unwrap().weighed
    };
    assert!(weighed(0).is_none(), "ballast changes the masses");
    let own = weighed(1).expect("the setup's own weighing");
    // (670 g x 20 mm + 350 g x 150 mm) / 1020 g, FAA-H-8083-1 ch. 2.
    let expected = (0.670 * 0.020 + 0.350 * 0.150) / 1.020;
    assert!((own.cg_x_m - expected).abs() < 1e-12, "{}", own.cg_x_m);
    assert!((own.total_kg - 1.020).abs() < 1e-12);
    let base = analyse(&ac, &AnalysisOptions::default())
        .unwrap()
        .weighed
        .unwrap();
    let kept = weighed(2).expect("an incidence change keeps the weighing");
    assert!((kept.cg_x_m - base.cg_x_m).abs() < 1e-15);
}

// Moving the datum moves every position by the same amount (statics): two files describing
// the same aircraft from datums 250 mm apart, with different datum texts, compare as equal
// once moved to the wing's MAC leading edge, to round-off.
#[test]
fn compare_moves_files_with_different_datums_to_the_mac_leading_edge() {
    let a = key_figures(&text(0.0, "wing root leading edge"));
    let b = key_figures(&text(250.0, "spinner back plate"));
    let mut columns = vec![a[0].clone(), b[0].clone()];
    assert!(to_common_reference(&mut columns));
    let (x, y) = (&columns[0], &columns[1]);
    for (p, q) in [
        (x.cg_x_m, y.cg_x_m),
        (x.neutral_point_x_m, y.neutral_point_x_m),
        (x.band.forward_x_m, y.band.forward_x_m),
        (x.band.aft_x_m, y.band.aft_x_m),
    ] {
        assert!((p - q).abs() < 1e-9, "{p} vs {q}");
    }
    let cells = trimline::output::compare::compare_cells(&columns);
    let cg = cells
        .iter()
        .find(|c| c.0 == "CG mm aft of MAC LE")
        .expect("the row says what it is measured from");
    assert!(cg.1[1].ends_with("(=)"), "{:?}", cg.1);
    // The same datum text: positions are left as they are.
    let mut same = vec![a[0].clone(), a[1].clone()];
    assert!(!to_common_reference(&mut same));
    assert!((same[0].cg_x_m - a[0].cg_x_m).abs() < 1e-15);
}

// The vertical CG is used only when every mass has a z; a partial set is said in a note.
#[test]
fn vertical_cg_only_with_every_z() {
    let partial = text(0.0, "wing root leading edge").replacen(
        "name = \"battery\"\nmass = 100\n",
        "name = \"battery\"\nmass = 100\nz = -20\n",
        1,
    );
    let ac = parse_aircraft(&partial, "t.toml", None).unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    assert!(a.mass.cg_z_m.is_none());
    assert!(a.cautions.iter().any(|c| c.code == "vertical-cg-partial"));
    let full = partial.replacen(
        "name = \"airframe\"\nmass = 900\n",
        "name = \"airframe\"\nmass = 900\nz = 10\n",
        1,
    );
    let ac = parse_aircraft(&full, "t.toml", None).unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    // (900 g x 10 mm + 100 g x -20 mm) / 1000 g.
    assert!((a.mass.cg_z_m.unwrap() - 0.007).abs() < 1e-12);
    assert!(!a.cautions.iter().any(|c| c.code == "vertical-cg-partial"));
}
