//! Reading aircraft files: units, defaults, and every kind of bad input giving a located error.

use approx::assert_relative_eq;
use trimline::input::parse_aircraft;
use trimline::model::SurfaceShape;

const GOOD: &str = r#"
name = "Test glider"
[airfoils.a]
naca = "2412"
[wing]
root_chord = 200
airfoil = "a"
incidence = "0.05 rad"
[[wing.panel]]
span = "24 in"
tip_chord = 150
dihedral = 5
twist = -2
[[mass]]
name = "all"
mass = "12.5 oz"
x = 60
"#;

// Unit conversions are exact by definition (1 in = 25.4 mm; 1 oz = 28.349523125 g).
#[test]
fn units_and_defaults_in_a_file() {
    let a = parse_aircraft(GOOD, "good.toml", None).unwrap();
    let SurfaceShape::Panels(p) = &a.wing.shape else {
        panic!("panels expected")
    };
    assert_relative_eq!(p[0].span_m, 0.6096, epsilon = 1e-12);
    assert_relative_eq!(p[0].root_chord_m, 0.2, epsilon = 1e-12);
    assert_relative_eq!(p[0].tip_twist_rad, (-2f64).to_radians(), epsilon = 1e-12);
    assert_relative_eq!(a.wing.incidence_rad, 0.05, epsilon = 1e-12);
    assert_relative_eq!(a.masses[0].mass_kg, 0.354_369_039_062_5, epsilon = 1e-12);
    assert!(a.stabiliser.is_none());
}

fn error_of(text: &str) -> String {
    match parse_aircraft(text, "bad.toml", None) {
        Ok(_) => panic!("expected an error for:\n{text}"),
        Err(e) => e.to_string(),
    }
}

#[test]
fn unknown_key_is_named_with_its_position() {
    let text = GOOD.replace("tip_chord = 150", "tip_chrod = 150");
    let e = error_of(&text);
    assert!(e.starts_with("bad.toml:11:1:"), "{e}");
    assert!(e.contains("tip_chrod"), "{e}");
    assert!(e.contains("tip_chord"), "expected keys listed: {e}");
}

#[test]
fn out_of_range_value_names_field_and_range() {
    let text = GOOD.replace("dihedral = 5", "dihedral = 75");
    let e = error_of(&text);
    assert!(e.starts_with("bad.toml:12:12"), "{e}");
    assert!(e.contains("wing.panel[0].dihedral"), "{e}");
    assert!(e.contains("-45 deg to 45 deg"), "{e}");
}

#[test]
fn wrong_unit_is_refused() {
    let e = error_of(&GOOD.replace("span = \"24 in\"", "span = \"24 kg\""));
    assert!(e.contains("wing.panel[0].span"), "{e}");
    assert!(e.contains("mm, cm, m, in, ft"), "{e}");
}

#[test]
fn negative_chord_is_refused() {
    let e = error_of(&GOOD.replace("root_chord = 200", "root_chord = -200"));
    assert!(e.contains("wing.root_chord"), "{e}");
    assert!(e.contains("out of range"), "{e}");
}

#[test]
fn text_where_number_expected() {
    let e = error_of(&GOOD.replace("x = 60", "x = true"));
    assert!(e.contains("mass[0].x"), "{e}");
    assert!(e.contains("expected a number"), "{e}");
}

#[test]
fn unknown_airfoil_lists_the_known_ones() {
    let e = error_of(&GOOD.replace("airfoil = \"a\"", "airfoil = \"b\""));
    assert!(e.contains("no airfoil named `b`"), "{e}");
    assert!(e.contains("one of: 'a'"), "{e}");
}

#[test]
fn bad_naca_designation() {
    let e = error_of(&GOOD.replace("naca = \"2412\"", "naca = \"24x2\""));
    assert!(e.contains("airfoils.a.naca"), "{e}");
}

#[test]
fn missing_masses_is_an_error() {
    let text = GOOD.split("[[mass]]").next().unwrap();
    let e = error_of(text);
    assert!(e.contains("mass"), "{e}");
}

#[test]
fn missing_required_key_is_reported() {
    let e = error_of(&GOOD.replace("span = \"24 in\"\n", ""));
    assert!(e.contains("span"), "{e}");
    assert!(e.starts_with("bad.toml:"), "{e}");
}

#[test]
fn syntax_error_is_located() {
    let e = error_of(&GOOD.replace("[wing]", "[wing"));
    assert!(e.starts_with("bad.toml:5:"), "{e}");
    assert!(e.contains("syntax"), "{e}");
}

#[test]
fn both_panels_and_ellipse_refused() {
    let text = GOOD.replace(
        "[[wing.panel]]",
        "[wing.ellipse]\nspan = 600\n[[wing.panel]]",
    );
    let e = error_of(&text);
    assert!(e.contains("wing.ellipse"), "{e}");
}

#[test]
fn nan_and_infinity_refused() {
    let e = error_of(&GOOD.replace("x = 60", "x = nan"));
    assert!(e.contains("finite"), "{e}");
    let e = error_of(&GOOD.replace("x = 60", "x = \"inf mm\""));
    assert!(e.contains("mass[0].x"), "{e}");
}

#[test]
fn empty_file_is_an_error_not_a_panic() {
    let e = error_of("");
    assert!(e.contains("name") || e.contains("missing"), "{e}");
}

// An airfoil from a coordinates file is read relative to the aircraft file, and a bad contour
// is reported at the key that names the file, with the reason.
#[test]
fn coordinates_files_are_read_and_checked() {
    let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/data");
    let a = trimline::input::load_aircraft_file(&dir.join("coords-glider.toml")).unwrap();
    assert!(matches!(
        a.airfoils.iter().find(|f| f.name == "w").unwrap().shape,
        trimline::model::AirfoilShape::Coordinates { .. }
    ));
    let e = trimline::input::load_aircraft_file(&dir.join("coords-bad.toml"))
        .unwrap_err()
        .to_string();
    assert!(e.contains("coords-bad.toml:4:15"), "{e}");
    assert!(e.contains("airfoils.w.coordinates"), "{e}");
    assert!(e.contains("crosses itself"), "{e}");
}

// aircraft/README.md documents every key of the file format (issue requirement): every field
// of the raw mirror of the file must appear there as `key`, `table.key`, `table.key.ITEM`,
// [table] or [[table]].
#[test]
fn every_file_key_is_documented() {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let raw = std::fs::read_to_string(root.join("src/input/raw.rs")).unwrap();
    let doc = std::fs::read_to_string(root.join("aircraft/README.md")).unwrap();
    let mut missing = Vec::new();
    for line in raw.lines() {
        let t = line.trim();
        let Some(rest) = t.strip_prefix("pub ") else {
            continue;
        };
        let Some((name, _)) = rest.split_once(':') else {
            continue;
        };
        if name.contains(' ') {
            continue; // `pub struct`, `pub type`
        }
        let documented = doc.contains(&format!("`{name}`"))
            || doc.contains(&format!(".{name}`"))
            || doc.contains(&format!(".{name}."))
            || doc.contains(&format!("[{name}]"))
            || doc.contains(&format!(".{name}]"))
            || doc.contains(&format!("[[{name}]]"));
        if !documented {
            missing.push(name.to_string());
        }
    }
    assert!(
        missing.is_empty(),
        "keys missing from aircraft/README.md: {missing:?}"
    );
}

// The key reference of aircraft/README.md ("Reference: every key") has a row for each key of
// the camber flaps and their settings, as `wing.flap[].KEY` and `flap_setting[].KEY`, the
// keys read from the raw mirror of the file (src/input/raw.rs).
#[test]
fn flap_keys_are_in_the_key_reference() {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let raw = std::fs::read_to_string(root.join("src/input/raw.rs")).unwrap();
    let doc = std::fs::read_to_string(root.join("aircraft/README.md")).unwrap();
    let reference = &doc[doc.find("## Reference: every key").expect("the reference")..];
    let fields = |name: &str| -> Vec<String> {
        let start = raw.find(&format!("pub struct {name} {{")).expect(name);
        let body = &raw[start..start + raw[start..].find('}').unwrap()];
        body.lines()
            .skip(1)
            .filter_map(|l| l.trim().strip_prefix("pub "))
            .filter_map(|l| l.split_once(':').map(|(k, _)| k.to_string()))
            .collect()
    };
    let mut missing = Vec::new();
    for (name, path) in [
        ("RawFlap", "wing.flap[]"),
        ("RawFlapSetting", "flap_setting[]"),
    ] {
        let keys = fields(name);
        assert!(keys.len() >= 2, "{name}: {keys:?}");
        for key in keys {
            let row = format!("| `{path}.{key}");
            if !reference.contains(&row) {
                missing.push(row);
            }
        }
    }
    assert!(missing.is_empty(), "missing rows: {missing:?}");
}

// README.md's limits table says what the reader does: 100 characters in an aircraft's (or
// mass item's...) name, 40 in a flap's or flap setting's; one more is refused.
#[test]
fn name_limits_in_the_readme_are_the_readers() {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let readme = std::fs::read_to_string(root.join("README.md")).unwrap();
    let limit = |row_start: &str| -> usize {
        let line = readme
            .lines()
            .find(|l| l.starts_with(row_start))
            .unwrap_or_else(|| panic!("no row `{row_start}`"));
        line.trim_end_matches('|')
            .rsplit('|')
            .next()
            .unwrap()
            .trim()
            .parse()
            .unwrap()
    };
    let name = limit("| characters in a name");
    let flap = limit("| characters in the name of a `[[wing.flap]]`");
    let with_name = |n: usize| GOOD.replace("Test glider", &"n".repeat(n));
    parse_aircraft(&with_name(name), "ok.toml", None).unwrap();
    assert!(error_of(&with_name(name + 1)).contains(&format!("at most {name}")));
    let flapped = |n: usize| {
        let f = "f".repeat(n);
        format!(
            "{GOOD}[[wing.flap]]\nname = \"{f}\"\nchord = 25\ninboard = 5\noutboard = 50\n\
             [[flap_setting]]\nname = \"{f}\"\ndeflect = {{ {f} = 5 }}\n"
        )
    };
    parse_aircraft(&flapped(flap), "ok.toml", None).unwrap();
    let e = error_of(&flapped(flap + 1));
    assert!(
        e.contains("wing.flap.name") && e.contains(&format!("1 to {flap}")),
        "{e}"
    );
}

// Stabiliser-only keys on the wing are refused with their position, not ignored.
#[test]
fn elevator_keys_on_the_wing_are_refused() {
    let e = error_of(&GOOD.replace(
        "incidence = \"0.05 rad\"",
        "incidence = \"0.05 rad\"\nelevator_up = 10",
    ));
    assert!(e.starts_with("bad.toml:9:15"), "{e}");
    assert!(e.contains("wing.elevator_up"), "{e}");
    assert!(e.contains("[stabiliser]"), "{e}");
}

const ELEVONS: &str = "\n[wing.elevons]\nchord = 22\ninboard = 20\noutboard = 95\nup = 12\n";

#[test]
fn elevons_are_read_in_builder_units() {
    let text = GOOD.replace("\n[[mass]]", &format!("{ELEVONS}\n[[mass]]"));
    let a = parse_aircraft(&text, "wing.toml", None).unwrap();
    let e = a.elevons.expect("elevons read");
    assert_relative_eq!(e.chord_fraction, 0.22, epsilon = 1e-12);
    assert_relative_eq!(e.inboard_fraction, 0.20, epsilon = 1e-12);
    assert_relative_eq!(e.outboard_fraction, 0.95, epsilon = 1e-12);
    assert_relative_eq!(e.max_up_rad, 12f64.to_radians(), epsilon = 1e-12);
    // Default throw, as for an elevator.
    assert_relative_eq!(e.max_down_rad, 15f64.to_radians(), epsilon = 1e-12);
    assert_eq!(a.pitch_control_name(), "elevons");
    assert!(a.pitch_control().is_some());
}

#[test]
fn elevons_with_a_stabiliser_are_refused_with_their_position() {
    let stab = "\n[stabiliser]\nx = 800\nroot_chord = 100\nairfoil = \"a\"\n[[stabiliser.panel]]\nspan = 200\n";
    let text = GOOD.replace("\n[[mass]]", &format!("{ELEVONS}{stab}\n[[mass]]"));
    let e = error_of(&text);
    assert!(e.starts_with("bad.toml:14:1:"), "{e}");
    assert!(e.contains("wing.elevons"), "{e}");
    assert!(e.contains("stabiliser"), "{e}");
}

#[test]
fn elevons_on_the_stabiliser_are_refused() {
    let stab = "\n[stabiliser]\nx = 800\nroot_chord = 100\nairfoil = \"a\"\n[[stabiliser.panel]]\nspan = 200\n[stabiliser.elevons]\nchord = 20\ninboard = 0\noutboard = 100\n";
    let text = GOOD.replace("\n[[mass]]", &format!("{stab}\n[[mass]]"));
    let e = error_of(&text);
    assert!(e.contains("stabiliser.elevons"), "{e}");
    assert!(e.contains("elevator_chord"), "accepted keys named: {e}");
}

#[test]
fn elevons_must_end_outboard_of_where_they_start() {
    let text = GOOD.replace(
        "\n[[mass]]",
        &(ELEVONS.replace("outboard = 95", "outboard = 20") + "\n[[mass]]"),
    );
    let e = error_of(&text);
    assert!(e.starts_with("bad.toml:17:12:"), "{e}");
    assert!(e.contains("wing.elevons.outboard"), "{e}");
    assert!(e.contains("more than 20 % to 100 %"), "{e}");
}

#[test]
fn elevon_chord_out_of_range_names_the_range() {
    let text = GOOD.replace(
        "\n[[mass]]",
        &(ELEVONS.replace("chord = 22", "chord = 0") + "\n[[mass]]"),
    );
    let e = error_of(&text);
    assert!(e.contains("wing.elevons.chord"), "{e}");
    assert!(e.contains("more than 0% to less than 100%"), "{e}");
}

// The coordinates example that aircraft/README.md prints is a file `section` accepts: a
// builder who copies it gets a result, not a refusal (a trial found a 5-point example that the
// 8-point minimum refused).
#[test]
fn the_readme_coordinates_example_is_accepted() {
    let root = std::path::Path::new(env!("CARGO_MANIFEST_DIR"));
    let doc = std::fs::read_to_string(root.join("aircraft/README.md")).unwrap();
    let after = doc
        .split("#### Coordinates files")
        .nth(1)
        .expect("the coordinates section");
    let block = after
        .split("```")
        .nth(1)
        .expect("a code block in the coordinates section");
    let dir = crate::common::scratch_in("input-file-tests", "readme-coordinates");
    std::fs::write(dir.join("my.dat"), block.trim_start_matches('\n')).unwrap();
    let out = crate::common::run_trimline(&["section", "my.dat", "--alpha", "0,4"], &dir);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    assert!(String::from_utf8_lossy(&out.stdout).contains("My section"));
}
