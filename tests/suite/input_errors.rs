//! Aircraft-file errors: every one names file:line:column, the full key path, the problem in
//! plain words and what is accepted. The expected ranges are those of the file format
//! (aircraft/README.md, reference table), written out here by hand.

use trimline::input::parse_aircraft;

/// A valid file; the line numbers below refer to it.
const BASE: &str = r#"name = "Test glider"
[airfoils.a]
naca = "2412"
[wing]
root_chord = 200
airfoil = "a"
incidence = 1.5
[[wing.panel]]
span = 600
tip_chord = 150
[[mass]]
name = "fuselage"
mass = 300
x = 60
[[mass]]
name = "battery"
mass = 50
x = -60
[[mass]]
name = "wing"
mass = 200
x = 40
[[ballast]]
name = "nose"
x = -100
max = 50
[[ballast]]
name = "tail"
x = 700
max = 20
"#;

fn error_of(text: &str) -> String {
    match parse_aircraft(text, "bad.toml", None) {
        Ok(_) => panic!("expected an error for:\n{text}"),
        Err(e) => e.to_string(),
    }
}

/// `BASE` with `from` (which must occur exactly once) replaced by `to`.
fn edit(from: &str, to: &str) -> String {
    assert_eq!(BASE.matches(from).count(), 1, "`{from}` not unique in BASE");
    BASE.replacen(from, to, 1)
}

/// The error starts with `prefix` (`file:line:col: key.path:`) and mentions every fragment.
fn check(e: &str, prefix: &str, fragments: &[&str]) {
    assert!(
        e.starts_with(prefix),
        "expected `{prefix}` at the start of:\n{e}"
    );
    for f in fragments {
        assert!(e.contains(f), "expected `{f}` in:\n{e}");
    }
    // Never the TOML reader's own vocabulary.
    for leak in [
        "expected nothing",
        "as i128",
        "any valid TOML value",
        "missing field",
        "expected a sequence",
        "struct Raw",
    ] {
        assert!(!e.contains(leak), "parser text `{leak}` in:\n{e}");
    }
}

#[test]
fn the_base_file_is_valid() {
    parse_aircraft(BASE, "good.toml", None).unwrap();
}

// --- Keys given twice, and headings with the wrong brackets. ---

#[test]
fn a_key_given_twice_is_named_with_both_lines() {
    let e = error_of(&edit(
        "incidence = 1.5\n",
        "incidence = 1.5\nincidence = 2\n",
    ));
    check(
        &e,
        "bad.toml:8:1: wing.incidence:",
        &["`incidence` is given twice", "line 7", "once"],
    );
    let e = error_of(&edit("mass = 200\n", "mass = 200\nmass = 210\n"));
    check(&e, "bad.toml:22:1: mass[2].mass:", &["twice", "line 21"]);
}

#[test]
fn single_table_heading_among_array_entries_gets_a_hint() {
    // The second mass item written as [mass]: the file mixes a table and a list of tables.
    let text = edit("[[mass]]\nname = \"battery\"", "[mass]\nname = \"battery\"");
    let e = error_of(&text);
    check(
        &e,
        "bad.toml:15:2: mass:",
        &["[[mass]]", "line 11", "list of tables"],
    );
    // The only ballast bay written as [ballast].
    let text =
        BASE.split("[[ballast]]").next().unwrap().to_string() + "[ballast]\nx = 1\nmax = 2\n";
    let e = error_of(&text);
    check(
        &e,
        "bad.toml:23:1: ballast:",
        &["[[ballast]]", "list of tables"],
    );
    // And the other way round: [[wing]].
    let e = error_of(&edit("[wing]", "[[wing]]"));
    check(&e, "bad.toml:4:1: wing:", &["[wing]", "single table"]);
}

// --- Malformed values: plain words, no parser vocabulary. ---

#[test]
fn malformed_numbers_are_not_a_number_with_the_accepted_form() {
    let e = error_of(&edit("incidence = 1.5", "incidence = 2.0.0"));
    check(
        &e,
        "bad.toml:7:",
        &[
            "wing.incidence",
            "`2.0.0` is not a number",
            "a number such as 12",
        ],
    );
    let e = error_of(&edit("x = 60", "x = 123456789012345678901234567890"));
    check(
        &e,
        "bad.toml:14:5: mass[0].x:",
        // The field's range (README: positions -50000 to 50000 mm), not the bare number form.
        &[
            "is not a number",
            "too large",
            "accepted: -50000 mm to 50000 mm",
        ],
    );
    let e = error_of(&edit("x = 60", "x = 1e400"));
    check(
        &e,
        "bad.toml:14:5: mass[0].x:",
        &["not a number", "too large"],
    );
    let e = error_of(&edit("x = 60", "x = 060"));
    check(&e, "bad.toml:14:5: mass[0].x:", &["`060` is not a number"]);
    let e = error_of(&edit("incidence = 1.5", "incidence = 1,5"));
    check(
        &e,
        "bad.toml:7:",
        &[
            "wing.incidence",
            "`1,5` is not a number",
            "decimal mark",
            "1.5",
        ],
    );
    let e = error_of(&edit("incidence = 1.5", "incidence = 2 deg"));
    check(
        &e,
        "bad.toml:7:13: wing.incidence:",
        &["must be in quotes", "\"2 deg\""],
    );
}

#[test]
fn unquoted_naca_designation_says_to_quote_it() {
    let e = error_of(&edit("naca = \"2412\"", "naca = 0009"));
    check(
        &e,
        "bad.toml:3:8: airfoils.a.naca:",
        &["quotes", "naca = \"0009\""],
    );
    assert!(!e.contains("leading zero, expected"), "{e}");
}

#[test]
fn unknown_key_in_an_array_entry_has_the_entry_index() {
    let e = error_of(&edit("tip_chord = 150", "tip_chrod = 150"));
    check(
        &e,
        "bad.toml:10:1: wing.panel[0].tip_chrod:",
        &["unknown key", "one of `span`", "`tip_chord`"],
    );
}

#[test]
fn unknown_key_suggests_the_close_name() {
    let e = error_of(&edit("tip_chord = 150", "tip_chrod = 150"));
    check(
        &e,
        "bad.toml:10:1: wing.panel[0].tip_chrod:",
        &["did you mean `tip_chord`?"],
    );
    // Far from every accepted key: no guess.
    let e = error_of(&edit("tip_chord = 150", "colour = 150"));
    assert!(!e.contains("did you mean"), "{e}");
}

// A misspelt table heading is an unknown key of the heading's own parent (the top of the
// file for `[fuselarge]`), not of the table above it; the heading's name is given as written
// (without its brackets: hostile_input.rs never sees a whole line quoted) and the valid name
// next to it suggested. Names from the file format (aircraft/README.md).

#[test]
fn misspelt_table_heading_is_named_at_its_own_place() {
    // Line 31 is the first line after BASE.
    let e = error_of(&format!("{BASE}[fuselarge]\nnose_x = -200\n"));
    check(
        &e,
        "bad.toml:31:2: fuselarge:",
        &["unknown table `fuselarge`;", "did you mean `fuselage`?"],
    );
    assert!(!e.contains("ballast[1].fuselarge"), "{e}");

    let e = error_of(&format!("{BASE}[target]\ntrim_speed = 10\n"));
    check(
        &e,
        "bad.toml:31:2: target:",
        &["unknown table `target`;", "did you mean `targets`?"],
    );
}

#[test]
fn misspelt_list_heading_is_named_at_its_own_place() {
    let text = format!(
        "{BASE}[stabiliser]\nx = 800\nroot_chord = 100\nairfoil = \"a\"\n\
         [[stabilser.panel]]\nspan = 200\n"
    );
    let e = error_of(&text);
    check(
        &e,
        "bad.toml:35:3: stabilser:",
        &[
            "unknown table `stabilser` in the heading of the list `stabilser.panel`",
            "did you mean `stabiliser`?",
        ],
    );
    assert!(!e.contains("stabiliser.stabilser"), "{e}");

    // A misspelt last part names its parent's path.
    let e = error_of(&edit("[[wing.panel]]", "[[wing.pannel]]"));
    check(
        &e,
        "bad.toml:8:8: wing.pannel:",
        &[
            "unknown table `pannel` in the heading of the list `wing.pannel`",
            "did you mean `panel`?",
        ],
    );
}

#[test]
fn unquoted_text_is_named() {
    let e = error_of(&edit("airfoil = \"a\"", "airfoil = a"));
    check(&e, "bad.toml:6:11: wing.airfoil:", &["quotes", "\"a\""]);
}

// --- Missing required keys: located at their table's heading, with the full path. ---

#[test]
fn missing_key_in_an_array_entry_names_entry_and_range() {
    let e = error_of(&edit("max = 20\n", ""));
    check(
        &e,
        "bad.toml:27:1: ballast[1].max:",
        &["missing", "more than 0 g to 1000000 g", "oz"],
    );

    let e = error_of(&edit("x = 40\n", ""));
    check(
        &e,
        "bad.toml:19:1: mass[2].x:",
        &["missing", "-50000 mm to 50000 mm", "in"],
    );

    let e = error_of(&edit("mass = 50\n", ""));
    check(
        &e,
        "bad.toml:15:1: mass[1].mass:",
        &["missing", "0 g to 1000000 g"],
    );

    let e = error_of(&edit("name = \"battery\"\n", ""));
    check(&e, "bad.toml:15:1: mass[1].name:", &["missing", "text"]);

    let e = error_of(&edit("name = \"tail\"\n", ""));
    check(&e, "bad.toml:27:1: ballast[1].name:", &["missing", "text"]);

    let e = error_of(&edit("span = 600\n", ""));
    check(
        &e,
        "bad.toml:8:1: wing.panel[0].span:",
        &["missing", "5 mm to 30000 mm"],
    );
}

#[test]
fn missing_key_in_a_table_names_table_and_range() {
    let e = error_of(&edit("root_chord = 200\n", ""));
    check(
        &e,
        "bad.toml:4:1: wing.root_chord:",
        &["missing", "5 mm to 10000 mm"],
    );

    let fuselage = "[fuselage]\nlength = 900\nwidth = 60\n[[mass]]\nname = \"fuselage\"";
    let e = error_of(&edit("[[mass]]\nname = \"fuselage\"", fuselage));
    check(
        &e,
        "bad.toml:11:1: fuselage.nose_x:",
        &["missing", "-50000 mm to 50000 mm"],
    );

    let ellipse = "[wing.ellipse]\ndihedral = 2\n";
    let e = error_of(&edit(
        "[[wing.panel]]\nspan = 600\ntip_chord = 150\n",
        ellipse,
    ));
    check(
        &e,
        "bad.toml:8:1: wing.ellipse.span:",
        &["missing", "5 mm to 30000 mm"],
    );

    let elevons = "[wing.elevons]\ninboard = 20\noutboard = 90\n[[mass]]\nname = \"fuselage\"";
    let e = error_of(&edit("[[mass]]\nname = \"fuselage\"", elevons));
    check(
        &e,
        "bad.toml:11:1: wing.elevons.chord:",
        &["missing", "more than 0% to less than 100%"],
    );

    let weighing = "max = 20\n[[weighing]]\nx = 30\nreading = 50\n[[weighing]]\nx = 300\n";
    let e = error_of(&edit("max = 20\n", weighing));
    check(
        &e,
        "bad.toml:34:1: weighing[1].reading:",
        &["missing", "0 g to 1000000 g"],
    );

    let setup = "max = 20\n[[setup]]\nballast = { nose = 5 }\n";
    let e = error_of(&edit("max = 20\n", setup));
    check(&e, "bad.toml:31:1: setup[0].name:", &["missing", "text"]);
}

#[test]
fn missing_key_in_an_inline_table_is_located_at_the_table() {
    let e = error_of(&edit(
        "naca = \"2412\"",
        "karman_trefftz = { thickness = 12, camber = 2 }",
    ));
    check(
        &e,
        "bad.toml:3:18: airfoils.a.karman_trefftz.trailing_edge_angle:",
        &["missing", "0 deg to 30 deg"],
    );
}

// --- Karman-Trefftz sections: the accepted range is the one that works. ---

/// BASE with airfoil `a` given by `shape` (the text after `naca = ...`'s place).
fn with_airfoil(shape: &str) -> String {
    edit("naca = \"2412\"", shape)
}

/// The file is read and the section analysed, with finite results.
fn section_works(shape: &str) {
    let a = parse_aircraft(&with_airfoil(shape), "ok.toml", None)
        .unwrap_or_else(|e| panic!("{shape}: {e}"));
    let out = trimline::section::section_model(
        &a.airfoils[0],
        &trimline::section::SectionOptions::default(),
    )
    .unwrap_or_else(|e| panic!("{shape}: {e}"));
    let m = out.model;
    assert!(
        m.cl_alpha_per_rad.is_finite()
            && m.alpha_zero_lift_rad.is_finite()
            && m.cm_ac.is_finite()
            && m.x_ac_c.is_finite(),
        "{shape}: {m:?}"
    );
}

// The reviewer's case: 10 % thick, 2 % camber. The thinnest Karman-Trefftz section with
// trailing-edge angle tau is two circular arcs meeting at tau; with t = 0.10, f = 0.02 that is
// tau = 2 [atan(t + 2f) - atan(2f - t)] = 2 [atan(0.14) + atan(0.06)] = 22.81 deg, and 90 % of
// it, 20.53 deg, is accepted (shown rounded down: 20.5).
#[test]
fn trailing_edge_angle_too_large_for_the_thickness_is_located() {
    for angle in ["25", "30", "20.6"] {
        let e = error_of(&with_airfoil(&format!(
            "karman_trefftz = {{ thickness = 10, camber = 2, trailing_edge_angle = {angle} }}"
        )));
        check(
            &e,
            "bad.toml:3:70: airfoils.a.karman_trefftz.trailing_edge_angle:",
            &[
                "too large",
                "10 % thick",
                "0 deg to 20.5 deg",
                "up to 30 deg",
            ],
        );
    }
}

#[test]
fn trailing_edge_angles_at_the_edges_of_the_accepted_range_work() {
    // Limits (90 % of the two-arc angle, worked out as above): 0.1 % thick, no camber: 0.206 deg;
    // 0.1 % thick, 14.99 % camber: 0.189 deg; 15 % thick: 30.7 deg, so the file's 30 deg.
    for shape in [
        "karman_trefftz = { thickness = 10, camber = 2, trailing_edge_angle = 20.5 }",
        "karman_trefftz = { thickness = 0.1, camber = 0, trailing_edge_angle = 0.2 }",
        "karman_trefftz = { thickness = 0.1, camber = 14.99, trailing_edge_angle = 0.18 }",
        "karman_trefftz = { thickness = 0.1, camber = 14.99, trailing_edge_angle = 0 }",
        "karman_trefftz = { thickness = 15, trailing_edge_angle = 30 }",
        "karman_trefftz = { thickness = 39.99, camber = 0, trailing_edge_angle = 30 }",
        "karman_trefftz = { thickness = 39.99, camber = 14.99, trailing_edge_angle = 30 }",
        "karman_trefftz = { thickness = 39.99, camber = 14.99, trailing_edge_angle = 0 }",
        "joukowski = { thickness = 0.1, camber = 14.99 }",
        "joukowski = { thickness = 39.99, camber = 14.99 }",
        "joukowski = { thickness = 39.99 }",
    ] {
        section_works(shape);
    }
}

#[test]
fn thickness_and_camber_outside_the_range_are_located() {
    let e = error_of(&with_airfoil("joukowski = { camber = 2 }"));
    check(
        &e,
        "bad.toml:3:13: airfoils.a.joukowski.thickness:",
        &["missing", "0.1% to less than 40%"],
    );
    let e = error_of(&with_airfoil(
        "karman_trefftz = { thickness = 40, trailing_edge_angle = 10 }",
    ));
    check(
        &e,
        "bad.toml:3:32: airfoils.a.karman_trefftz.thickness:",
        &["out of range", "0.1% to less than 40%"],
    );
    let e = error_of(&with_airfoil("joukowski = { thickness = 12, camber = 15 }"));
    check(
        &e,
        "bad.toml:3:40: airfoils.a.joukowski.camber:",
        &["out of range", "0% to less than 15%"],
    );
    let e = error_of(&with_airfoil(
        "karman_trefftz = { thickness = 20, trailing_edge_angle = 30.5 }",
    ));
    check(
        &e,
        "bad.toml:3:58: airfoils.a.karman_trefftz.trailing_edge_angle:",
        &["out of range", "0 deg to 30 deg"],
    );
}

// The `section` command refuses the same shapes with the limit, and solves the edge.
#[test]
fn section_command_states_the_angle_limit() {
    let run = |spec: &str| {
        std::process::Command::new(env!("CARGO_BIN_EXE_trimline"))
            .args(["section", spec, "--alpha", "0"])
            .output()
            .expect("binary runs")
    };
    let out = run("kt:10/2/25");
    assert!(!out.status.success());
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("too large"), "{err}");
    assert!(err.contains("0 to 20.53 deg"), "{err}");
    let out = run("kt:10/2/20.5");
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
}

// --- Names must be unique: setups refer to them. ---

#[test]
fn duplicate_setup_names_are_refused_at_the_second() {
    let setups = "max = 20\n[[setup]]\nname = \"lead\"\nballast = { nose = 5 }\n\
                  [[setup]]\nname = \"lead\"\nballast = { nose = 10 }\n";
    let e = error_of(&edit("max = 20\n", setups));
    check(
        &e,
        "bad.toml:35:8: setup[1].name:",
        &["`lead`", "setup[0]", "line 32", "--setup"],
    );
}

#[test]
fn duplicate_mass_and_ballast_names_are_refused() {
    let e = error_of(&edit("name = \"wing\"", "name = \"battery\""));
    check(
        &e,
        "bad.toml:20:8: mass[2].name:",
        &["`battery`", "mass[1]", "line 16"],
    );
    // Names are compared as read: surrounding spaces do not make a new name.
    let e = error_of(&edit("name = \"tail\"", "name = \" nose \""));
    check(
        &e,
        "bad.toml:28:8: ballast[1].name:",
        &["`nose`", "ballast[0]", "line 24"],
    );
}

// --- Grammar. ---

#[test]
fn one_weighing_support_is_singular() {
    let e = error_of(&edit(
        "max = 20\n",
        "max = 20\n[[weighing]]\nx = 30\nreading = 50\n",
    ));
    check(
        &e,
        "bad.toml:31:1: weighing:",
        &["1 support given", "2 or 3"],
    );
    assert!(!e.contains("supports given"), "{e}");
}

// --- The standard atmosphere below sea level. ---

// The file keeps a negative altitude, and the density there is the ISA one. Reference value
// by integrating the hydrostatic equation dp/dh = -p g0 / (R T(h)), T = 288.15 K - 6.5 K/km h,
// from sea level (101 325 Pa) down to -400 m with Runge-Kutta steps: independent of the closed
// form the code uses. It gives 1.27274 kg/m^3 (and more than the 1.225 at sea level).
#[test]
fn altitude_below_sea_level_is_not_treated_as_zero() {
    let text = edit("[wing]", "[air]\naltitude = -400\n[wing]");
    let a = parse_aircraft(&text, "low.toml", None).unwrap();
    let state = trimline::atmosphere::air_state(&a.air);

    let (r, g0, lapse, t0) = (287.052_87, 9.806_65, 0.0065, 288.15);
    let dpdh = |h: f64, p: f64| -p * g0 / (r * (t0 - lapse * h));
    let (mut h, mut p) = (0.0, 101_325.0);
    let n = 400;
    let dh = -400.0 / n as f64;
    for _ in 0..n {
        let k1 = dpdh(h, p);
        let k2 = dpdh(h + dh / 2.0, p + dh / 2.0 * k1);
        let k3 = dpdh(h + dh / 2.0, p + dh / 2.0 * k2);
        let k4 = dpdh(h + dh, p + dh * k3);
        p += dh / 6.0 * (k1 + 2.0 * k2 + 2.0 * k3 + k4);
        h += dh;
    }
    let rho = p / (r * (t0 - lapse * h));
    assert!((rho - 1.27274).abs() < 1e-4, "reference {rho}");
    assert!(
        (state.density_kg_m3 - rho).abs() < 1e-6,
        "density at -400 m: {} (ISA {rho})",
        state.density_kg_m3
    );
    // Below the accepted range it is an error, not a silent clamp.
    let e = error_of(&edit("[wing]", "[air]\naltitude = -600\n[wing]"));
    check(&e, "bad.toml:5:12: air.altitude:", &["-500 m to 11000 m"]);
}

// --- The documentation states the ranges the code applies. ---

#[test]
fn chord_range_starts_at_5_mm_as_documented() {
    let e = error_of(&edit("root_chord = 200", "root_chord = 0.21"));
    check(
        &e,
        "bad.toml:5:14: wing.root_chord:",
        &["out of range", "5 mm to 10000 mm"],
    );
    let e = error_of(&edit("root_chord = 200", "root_chord = 4.9"));
    check(&e, "bad.toml:5:14: wing.root_chord:", &["out of range"]);
    parse_aircraft(&edit("root_chord = 200", "root_chord = 5"), "ok.toml", None).unwrap();

    let doc = std::fs::read_to_string(
        std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("aircraft/README.md"),
    )
    .unwrap();
    let row = |key: &str| {
        doc.lines()
            .find(|l| l.starts_with(&format!("| `{key}` |")))
            .unwrap_or_else(|| panic!("no row for {key}"))
            .to_string()
    };
    assert!(row("wing.root_chord").ends_with("| 5 to 10 000 mm |"));
    assert!(row("wing.panel[].root_chord").ends_with("| 5 to 10 000 mm |"));
    assert!(row("wing.panel[].span").ends_with("| 5 to 30 000 mm |"));
    assert!(row("air.altitude").ends_with("| −500 to 11 000 m |"));
    assert!(!doc.contains("is *not* caught"));
    assert!(!doc.contains("treated as 0"));
}

#[test]
fn bare_word_value_is_explained() {
    // A word beginning with t or f reads to the parser as a misspelt true or false; the
    // message must not offer `true` as the accepted value.
    for word in ["tall", "flat"] {
        let e = error_of(&BASE.replace("incidence = 1.5", &format!("incidence = {word}")));
        assert!(e.starts_with("bad.toml:7:13:"), "{e}");
        assert!(e.contains("wing.incidence"), "{e}");
        assert!(e.contains("a bare word is not a value"), "{e}");
        assert!(e.contains("text in quotes"), "{e}");
        assert!(!e.contains("`true`") && !e.contains("`false`"), "{e}");
    }
}

// A length in quotes without a unit is read in mm (aircraft/README.md, units); a quoted
// "0.15" meant as metres is then out of range, and the error says the unit is missing and
// which units the key takes (mm, cm, m, in, ft: the README's list for lengths).
#[test]
fn quoted_number_without_a_unit_gets_a_missing_unit_hint() {
    let e = error_of(&edit("root_chord = 200", "root_chord = \"0.15\""));
    check(
        &e,
        "bad.toml:5:14: wing.root_chord:",
        &[
            "0.15 mm is out of range",
            "\"0.15\" has no unit",
            "read in mm",
            "mm, cm, m, in, ft",
            "accepted: 5 mm to 10000 mm",
        ],
    );
    // A bare number keeps its own hint; a quoted value with its unit gets none.
    let with_unit = error_of(&edit("root_chord = 200", "root_chord = \"0.15 mm\""));
    assert!(!with_unit.contains("has no unit"), "{with_unit}");
}

// A number too large for a 64-bit float or integer is refused by the TOML reader before
// the field's check; the error still gives the field's accepted range (the README's span
// range, 5 mm to 30000 mm), at the number's own place.
#[test]
fn number_too_large_to_read_names_the_fields_range() {
    for big in ["1e400", "-1e400", "99999999999999999999"] {
        let e = error_of(&edit("span = 600", &format!("span = {big}")));
        check(
            &e,
            "bad.toml:9:8: wing.panel[0].span:",
            &["is not a number (too large)", "accepted: 5 mm to 30000 mm"],
        );
    }
    let e = error_of(&edit("mass = 300", "mass = 1e400"));
    check(
        &e,
        "bad.toml:13:8: mass[0].mass:",
        &["too large", "accepted: 0 g to"],
    );
}

// A mass typed in kilograms without a unit reads as grams: 190 000 g on a 600 mm semispan
// wing is far above any aircraft (the file format's limit of 400 kg/m^2). The error points at
// the heaviest item's mass, the likely slip.
#[test]
fn an_impossible_wing_loading_points_at_the_heaviest_mass() {
    let e = error_of(&edit("mass = 200\n", "mass = 190000\n"));
    check(
        &e,
        "bad.toml:21:8: mass[2].mass:",
        &["the heaviest item, 'wing', is 190000 g", "up to 400 kg/m^2"],
    );
}

// The wing and the stabiliser share one table type in the reader; a misspelt key lists only
// what that surface accepts (aircraft/README.md: `elevons` and `[[wing.flap]]` belong to the
// wing, `role` and the `elevator_*` keys to the stabiliser).
#[test]
fn an_unknown_surface_key_lists_only_that_surfaces_keys() {
    let e = error_of(&edit("root_chord = 200\n", "root_chrd = 200\n"));
    check(
        &e,
        "bad.toml:5:1: wing.root_chrd:",
        &["did you mean `root_chord`?", "`flap`"],
    );
    assert!(!e.contains("`elevator_up`") && !e.contains("`role`"), "{e}");
    let stab = format!(
        "{BASE}[stabiliser]\nx = 700\nroot_chord = 100\nairfoil = \"a\"\nrol = \"tail\"\n[[stabiliser.panel]]\nspan = 200\ntip_chord = 80\n"
    );
    let e = error_of(&stab);
    assert!(e.contains("did you mean `role`?"), "{e}");
    assert!(!e.contains("`elevons`") && !e.contains("`flap`"), "{e}");
    assert!(e.contains("`elevator_up`"), "{e}");
}
