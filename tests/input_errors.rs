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
        &["is not a number", "too large", "a number such as 12"],
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
