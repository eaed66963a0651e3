//! Property tests (proptest) of the readers and the chain on generated and mutated input:
//! no panic, no NaN or infinity in the text or JSON output, every error located and
//! single-line with no control characters; and three laws of the balance:
//!
//! - scaling every mass by the same whole factor (2 to 10) leaves the CG where it is (the CG is the
//!   mass-weighted mean position, x_cg = sum(m_i x_i) / sum(m_i); any textbook of statics,
//!   e.g. Meriam & Kraige, "Engineering Mechanics: Statics", the centre-of-mass definition),
//!   within 1e-12 relative (floating-point rounding only);
//! - the order of the mass items does not matter, shifting every item by d shifts the CG
//!   by d, and mirroring every item about the datum mirrors the CG (same definition),
//!   within 1e-9 m;
//! - the same aircraft written in millimetres and grams or in inches and ounces gives the
//!   same CG and wing area (1 in = 25.4 mm exactly, 1 oz = 28.349523125 g exactly: NIST
//!   Special Publication 811, Appendix B), within 1e-9 m and 1e-9 relative (the inch values
//!   are written with 12 decimals).
//!
//! Case counts are kept small (the whole module runs in about a second) and the random
//! generator starts from a fixed seed (`TRIMLINE_FUZZ_SEED=random` explores further); the
//! hostile inputs found earlier are in tests/data/fuzz/ and are run every time.

use proptest::prelude::*;
use proptest::test_runner::{Config, FileFailurePersistence, RngSeed};
use trimline::analysis::{analyse, AnalysisOptions};
use trimline::input::coordinates::parse_coordinates;
use trimline::input::parse_aircraft;

/// `cases` cases from a fixed seed, so every run (and CI) tries the same inputs; set
/// `TRIMLINE_FUZZ_SEED` to a number to try others, or to `random` for a fresh seed each run.
fn config(cases: u32) -> Config {
    let seed = match std::env::var("TRIMLINE_FUZZ_SEED").ok().as_deref() {
        Some("random") => RngSeed::Random,
        Some(n) => RngSeed::Fixed(n.trim().parse().unwrap_or(14)),
        None => RngSeed::Fixed(14),
    };
    Config {
        cases,
        rng_seed: seed,
        failure_persistence: Some(Box::new(FileFailurePersistence::Off)),
        ..Config::default()
    }
}

/// A plain aircraft description the generator fills in; lengths mm, masses g, angles deg.
#[derive(Debug, Clone)]
struct Plane {
    naca: String,
    wing_x: f64,
    incidence: f64,
    root_chord: f64,
    panels: Vec<(f64, f64, f64, f64)>,
    tail: Option<(f64, f64, f64)>,
    masses: Vec<(f64, f64)>,
}

fn plane() -> impl Strategy<Value = Plane> {
    (
        (0u32..5, 8u32..16),
        -50.0..50.0f64,
        -2.0..4.0f64,
        120.0..300.0f64,
        prop::collection::vec(
            (150.0..800.0f64, 0.4..1.0f64, 0.0..8.0f64, 0.0..10.0f64),
            1..4,
        ),
        prop::option::of((450.0..1000.0f64, 60.0..140.0f64, 150.0..300.0f64)),
        prop::collection::vec((5.0..400.0f64, -300.0..300.0f64), 1..8),
    )
        .prop_map(
            |((camber, thick), wing_x, incidence, root_chord, raw_panels, tail, masses)| {
                let mut chord = root_chord;
                let panels = raw_panels
                    .into_iter()
                    .map(|(span, taper, dihedral, sweep)| {
                        chord = (chord * taper).max(40.0);
                        (span, chord, dihedral, sweep)
                    })
                    .collect();
                // Masses and positions to 0.001 g and 0.001 mm, so that printing them with six
                // decimals, scaled by a whole number or not, loses nothing.
                let q = |v: f64| (v * 1000.0).round() / 1000.0;
                let masses = masses.into_iter().map(|(g, x)| (q(g), q(x))).collect();
                Plane {
                    naca: format!("{camber}4{thick:02}"),
                    wing_x,
                    incidence,
                    root_chord,
                    panels,
                    tail,
                    masses,
                }
            },
        )
}

/// A length as the file writes it: bare mm, or a string in inches.
fn len(mm: f64, inches: bool) -> String {
    // Both forms start from the same value as printed in mm, so they differ by the
    // 12-decimal rounding of the inch value only.
    let printed = format!("{mm:.6}");
    if inches {
        let mm: f64 = printed.parse().unwrap();
        format!("\"{:.12} in\"", mm / 25.4)
    } else {
        printed
    }
}

/// A mass: bare g, or a string in ounces.
fn mass(g: f64, ounces: bool) -> String {
    let printed = format!("{g:.6}");
    if ounces {
        let g: f64 = printed.parse().unwrap();
        format!("\"{:.12} oz\"", g / 28.349_523_125)
    } else {
        printed
    }
}

/// The file text of `p`, in mm and g or in inches and ounces.
fn file_text(p: &Plane, imperial: bool) -> String {
    let l = |v: f64| len(v, imperial);
    let mut t = format!(
        "name = \"Fuzz plane\"\n[airfoils.a]\nnaca = \"{}\"\n[wing]\nx = {}\nincidence = {}\n\
         root_chord = {}\nairfoil = \"a\"\n",
        p.naca,
        l(p.wing_x),
        p.incidence,
        l(p.root_chord)
    );
    for (span, tip, dihedral, sweep) in &p.panels {
        t.push_str(&format!(
            "[[wing.panel]]\nspan = {}\ntip_chord = {}\ndihedral = {dihedral}\nsweep = {sweep}\n",
            l(*span),
            l(*tip)
        ));
    }
    if let Some((arm, chord, span)) = p.tail {
        t.push_str(&format!(
            "[stabiliser]\nx = {}\nroot_chord = {}\nairfoil = \"a\"\n[[stabiliser.panel]]\n\
             span = {}\n",
            l(p.wing_x + arm),
            l(chord),
            l(span)
        ));
    }
    for (i, (g, x)) in p.masses.iter().enumerate() {
        t.push_str(&format!(
            "[[mass]]\nname = \"item {i}\"\nmass = {}\nx = {}\n",
            mass(*g, imperial),
            l(*x)
        ));
    }
    t
}

/// No NaN or infinity spelt out in `text` (as Rust prints them: `NaN`, `inf`, `-inf`).
fn assert_finite_text(text: &str) -> Result<(), TestCaseError> {
    let words = text.split(|c: char| !(c.is_alphanumeric() || c == '-'));
    for w in words {
        let w = w.trim_start_matches('-').to_ascii_lowercase();
        prop_assert!(
            !matches!(w.as_str(), "nan" | "inf" | "infinity"),
            "`{}` in output:\n{}",
            w,
            text
        );
    }
    Ok(())
}

/// A JSON value with no null where a number stood and no non-finite number.
fn json_numbers_finite(v: &serde_json::Value) -> bool {
    match v {
        serde_json::Value::Number(n) => n.as_f64().is_some_and(f64::is_finite),
        serde_json::Value::Array(a) => a.iter().all(json_numbers_finite),
        serde_json::Value::Object(o) => o.values().all(json_numbers_finite),
        _ => true,
    }
}

/// What every reader error must look like: one line, no control characters, a position
/// inside the text (or the whole file).
fn assert_well_formed_error(
    e: &trimline::input::InputError,
    text: &str,
) -> Result<(), TestCaseError> {
    let shown = e.to_string();
    prop_assert!(!shown.chars().any(char::is_control), "{:?}", shown);
    prop_assert!(shown.starts_with(&e.location.file), "{}", shown);
    prop_assert!(
        e.location.line <= text.lines().count() + 1,
        "line {} of {}",
        e.location.line,
        text.lines().count()
    );
    prop_assert!(!e.field.is_empty(), "{}", shown);
    // No number of ours printed as NaN or inf; what the file said is quoted in backticks or
    // quotes, and the key path may hold the file's own words.
    let ours: String = e
        .problem
        .split(['`', '\''])
        .step_by(2)
        .collect::<Vec<_>>()
        .join(" ");
    assert_finite_text(&ours)?;
    Ok(())
}

/// Run the whole chain on a parsed aircraft; its text and JSON must be finite.
fn analyse_and_render(aircraft: &trimline::model::Aircraft) -> Result<(), TestCaseError> {
    if let Ok(a) = analyse(aircraft, &AnalysisOptions::default()) {
        let text = trimline::output::tables::check_report(
            aircraft,
            &a,
            "fuzz.toml",
            trimline::output::units::UnitSystem::Metric,
        );
        // A name from the file may itself read "nan" (a mutation puts it there).
        let mut names = vec![aircraft.name.as_str(), &aircraft.notes, &aircraft.datum];
        names.extend(aircraft.masses.iter().map(|m| m.name.as_str()));
        names.extend(aircraft.ballast_bays.iter().map(|b| b.name.as_str()));
        names.extend(aircraft.setups.iter().map(|s| s.name.as_str()));
        names.extend(aircraft.airfoils.iter().map(|f| f.name.as_str()));
        let named = names.iter().any(|n| {
            let n = n.to_ascii_lowercase();
            n.contains("nan") || n.contains("inf")
        });
        if !named {
            assert_finite_text(&text)?;
        }
        let doc = trimline::output::json::check_document(aircraft, &a, "fuzz.toml");
        let json = serde_json::to_value(&doc).unwrap();
        prop_assert!(json_numbers_finite(&json), "{}", json);
    }
    Ok(())
}

proptest! {
    #![proptest_config(config(64))]

    #[test]
    fn generated_aircraft_parse_and_analyse_to_finite_output(p in plane()) {
        let text = file_text(&p, false);
        let aircraft = parse_aircraft(&text, "fuzz.toml", None)
            .map_err(|e| TestCaseError::fail(format!("{e}\n{text}")))?;
        analyse_and_render(&aircraft)?;
    }
}

proptest! {
    #![proptest_config(config(256))]

    #[test]
    fn scaling_every_mass_leaves_the_cg(p in plane(), factor in 2u32..=10) {
        let a = parse_aircraft(&file_text(&p, false), "a.toml", None).unwrap();
        let mut q = p.clone();
        for m in &mut q.masses {
            m.0 *= f64::from(factor);
        }
        // Keep within the wing-loading limit: the scaled file may be refused, never wrong.
        let Ok(b) = parse_aircraft(&file_text(&q, false), "b.toml", None) else {
            return Ok(());
        };
        let ca = trimline::balance::mass_summary(&a.masses).unwrap().cg_x_m;
        let cb = trimline::balance::mass_summary(&b.masses).unwrap().cg_x_m;
        prop_assert!((ca - cb).abs() <= 1e-12 * (1.0 + ca.abs()) + 1e-9, "{} vs {}", ca, cb);
    }

    #[test]
    fn order_and_shift_of_the_masses(p in plane(), shift in -200_000i32..200_000) {
        let shift = f64::from(shift) / 1000.0;
        let base = parse_aircraft(&file_text(&p, false), "a.toml", None).unwrap();
        let mut q = p.clone();
        q.masses.reverse();
        for m in &mut q.masses {
            m.1 += shift;
        }
        let moved = parse_aircraft(&file_text(&q, false), "b.toml", None).unwrap();
        let c0 = trimline::balance::mass_summary(&base.masses).unwrap().cg_x_m;
        let c1 = trimline::balance::mass_summary(&moved.masses).unwrap().cg_x_m;
        prop_assert!((c1 - (c0 + shift / 1000.0)).abs() < 1e-9, "{} + {} vs {}", c0, shift, c1);
        // Mirrored about the datum (every x negated; the tail must then stay behind the
        // wing, so only the masses move): the CG is mirrored too.
        let mut m = p.clone();
        for item in &mut m.masses {
            item.1 = -item.1;
        }
        let mirrored = parse_aircraft(&file_text(&m, false), "m.toml", None).unwrap();
        let cm = trimline::balance::mass_summary(&mirrored.masses).unwrap().cg_x_m;
        prop_assert!((cm + c0).abs() < 1e-9, "{} vs {}", cm, c0);
    }

    #[test]
    fn millimetres_and_inches_give_the_same_aircraft(p in plane()) {
        let metric = parse_aircraft(&file_text(&p, false), "mm.toml", None).unwrap();
        let imperial = parse_aircraft(&file_text(&p, true), "in.toml", None).unwrap();
        let cm = trimline::balance::mass_summary(&metric.masses).unwrap();
        let ci = trimline::balance::mass_summary(&imperial.masses).unwrap();
        prop_assert!((cm.cg_x_m - ci.cg_x_m).abs() < 1e-9);
        prop_assert!((cm.total_kg - ci.total_kg).abs() < 1e-9 * cm.total_kg);
        let am = trimline::planform::geometry(&metric.wing).area_m2;
        let ai = trimline::planform::geometry(&imperial.wing).area_m2;
        prop_assert!((am - ai).abs() < 1e-9 * am, "{} vs {}", am, ai);
    }
}

/// Things a careless or hostile edit puts into a file.
const PAYLOADS: [&str; 24] = [
    "nan",
    "inf",
    "-inf",
    "1e400",
    "-1e400",
    "1e-400",
    "0",
    "-0",
    "\"12 furlongs\"",
    "\"\"",
    "\"\\u001b[31m\"",
    "[[mass]]",
    "[wing]",
    "=",
    "\"",
    "{",
    "}",
    "[[wing.panel]]\nspan = 0",
    "99999999999999999999",
    "\u{0}",
    "\u{202e}",
    "\u{e9}",
    "\n",
    "#",
];

/// One edit of `text` at byte fraction `at`: 0 insert, 1 delete, 2 duplicate the line,
/// 3 replace the next number.
fn mutate(text: &str, kind: u8, at: f64, payload: &str, len: usize) -> String {
    let mut pos = ((text.len() as f64) * at) as usize;
    while !text.is_char_boundary(pos) {
        pos -= 1;
    }
    match kind {
        0 => format!("{}{payload}{}", &text[..pos], &text[pos..]),
        1 => {
            let mut end = (pos + len).min(text.len());
            while !text.is_char_boundary(end) {
                end -= 1;
            }
            format!("{}{}", &text[..pos], &text[end..])
        }
        2 => {
            let start = text[..pos].rfind('\n').map_or(0, |i| i + 1);
            let end = text[pos..].find('\n').map_or(text.len(), |i| pos + i + 1);
            format!("{}{}", &text[..end], &text[start..end])
        }
        _ => match text[pos..].find(|c: char| c.is_ascii_digit()) {
            Some(i) => {
                let s = pos + i;
                let e = text[s..]
                    .find(|c: char| !(c.is_ascii_digit() || c == '.'))
                    .map_or(text.len(), |j| s + j);
                format!("{}{payload}{}", &text[..s], &text[e..])
            }
            None => text.to_string(),
        },
    }
}

proptest! {
    #![proptest_config(config(256))]

    #[test]
    fn mutated_files_give_located_errors_or_finite_results(
        p in plane(),
        edits in prop::collection::vec((0u8..4, 0.0..1.0f64, 0usize..PAYLOADS.len(), 1usize..40), 1..4),
    ) {
        let mut text = file_text(&p, false);
        for (kind, at, payload, len) in edits {
            text = mutate(&text, kind, at, PAYLOADS[payload], len);
        }
        match parse_aircraft(&text, "mutated.toml", None) {
            Err(e) => assert_well_formed_error(&e, &text)?,
            Ok(a) => analyse_and_render(&a)?,
        }
    }

    #[test]
    fn an_out_of_range_value_names_its_position_and_range(
        p in plane(),
        key in 0usize..6,
        value in prop_oneof![-1e9..-1e3f64, 5e4..1e9f64],
    ) {
        let keys = ["root_chord", "span", "tip_chord", "mass", "dihedral", "incidence"];
        let text = file_text(&p, false);
        let k = keys[key];
        let at = text.find(&format!("\n{k} = ")).unwrap() + 1;
        let end = at + text[at..].find('\n').unwrap();
        let bad = format!("{}{k} = {value}{}", &text[..at], &text[end..]);
        let e = parse_aircraft(&bad, "range.toml", None).unwrap_err();
        assert_well_formed_error(&e, &bad)?;
        let line = bad[..at].matches('\n').count() + 1;
        prop_assert_eq!(e.location.line, line, "{}", e);
        prop_assert!(e.field.ends_with(k), "{}", e);
        prop_assert!(e.accepted.is_some(), "{}", e);
        prop_assert!(e.to_string().contains(" to "), "{}", e);
    }

    #[test]
    fn coordinates_reader_never_panics_and_locates_its_errors(
        chars in prop::collection::vec(
            prop_oneof![
                Just('0'), Just('1'), Just('.'), Just('-'), Just(' '), Just('\n'), Just(','),
                Just('e'), Just('\t'), Just('x'), Just('\u{1b}'), any::<char>()
            ],
            0..300,
        ),
    ) {
        let text: String = chars.into_iter().collect();
        match parse_coordinates(&text, "f.dat") {
            Ok((_, points)) => {
                prop_assert!(points.iter().all(|p| p[0].is_finite() && p[1].is_finite()));
            }
            Err(e) => assert_well_formed_error(&e, &text)?,
        }
    }

    #[test]
    fn coordinates_round_trip_with_any_separator(
        points in prop::collection::vec((-2.0..2.0f64, -1.0..1.0f64), 1..60),
        sep in prop_oneof![Just(" "), Just("\t"), Just(","), Just(" , "), Just("   ")],
    ) {
        let text: String = points.iter().map(|(x, y)| format!("{x}{sep}{y}\n")).collect();
        let (title, read) = parse_coordinates(&format!("A title\n{text}"), "f.dat").unwrap();
        prop_assert_eq!(title.as_deref(), Some("A title"));
        prop_assert_eq!(read.len(), points.len());
        for (r, p) in read.iter().zip(&points) {
            prop_assert!(r[0].to_bits() == p.0.to_bits() && r[1].to_bits() == p.1.to_bits());
        }
    }
}

/// The seeds in tests/data/fuzz/: earlier hostile inputs, each either refused with a
/// well-formed error or analysed to finite output.
#[test]
fn fuzz_corpus_seeds() {
    let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/data/fuzz");
    let mut n = 0;
    for entry in std::fs::read_dir(&dir).unwrap() {
        let path = entry.unwrap().path();
        let bytes = std::fs::read(&path).unwrap();
        let text = String::from_utf8_lossy(&bytes);
        let name = path.display().to_string();
        let is_coordinates = path.extension().is_some_and(|e| e == "dat");
        let result: Result<(), TestCaseError> = if is_coordinates {
            match parse_coordinates(&text, &name) {
                Ok(_) => Ok(()),
                Err(e) => assert_well_formed_error(&e, &text),
            }
        } else {
            match parse_aircraft(&text, &name, None) {
                Ok(a) => analyse_and_render(&a),
                Err(e) => assert_well_formed_error(&e, &text),
            }
        };
        if let Err(e) = result {
            panic!("{name}: {e}");
        }
        n += 1;
    }
    assert!(n >= 5, "only {n} seeds in {}", dir.display());
}
