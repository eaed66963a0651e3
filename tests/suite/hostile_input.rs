//! Hostile and absurd input, as a careless or hostile user would give it: devices, FIFOs,
//! huge and non-UTF-8 files, files that are not aircraft files at all, escape sequences in
//! names, lists past their count limits, implausible values, and the exit codes.
//!
//! The expectations are our own rules (README.md "Limits", "Exit codes", "Files it reads and
//! writes"; issue 14), not outside figures; where a plausibility range is involved its source
//! is given in `src/input/aircraft_file.rs` and `src/plausibility.rs` (common practice).

use std::path::{Path, PathBuf};
use std::process::{Command, Output};

const DEMO: &str = include_str!("../../aircraft/larkspire-2000.toml");

fn scratch(name: &str) -> PathBuf {
    crate::common::scratch_in("hostile-input-tests", name)
}

fn trimline(args: &[&str], dir: &Path) -> Output {
    crate::common::run_trimline(args, dir)
}

fn err(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

/// `check` on `text` written to a scratch file; returns the output.
fn check_text(name: &str, text: &str) -> Output {
    let dir = scratch(name);
    std::fs::write(dir.join("a.toml"), text).unwrap();
    trimline(&["check", "a.toml"], &dir)
}

/// The demo with `from` replaced by `to` (which must occur).
fn demo_with(from: &str, to: &str) -> String {
    assert!(DEMO.contains(from), "the demo has no {from:?}");
    DEMO.replacen(from, to, 1)
}

/// An error line must name a position (file:line:column or the file) and what is accepted.
fn assert_located(e: &str, file: &str) {
    assert!(e.contains(file), "no file named: {e}");
    assert!(e.contains("accepted"), "no accepted range: {e}");
    assert!(!e.contains("NaN") && !e.contains("inf "), "{e}");
}

#[cfg(unix)]
#[test]
fn devices_and_fifos_are_refused_at_once() {
    let dir = scratch("devices");
    for dev in ["/dev/zero", "/dev/urandom"] {
        if !Path::new(dev).exists() {
            continue;
        }
        let out = trimline(&["check", dev], &dir);
        assert_eq!(out.status.code(), Some(1));
        let e = err(&out);
        assert!(e.contains("character device") && e.contains("1 MB"), "{e}");
        let out = trimline(&["section", dev], &dir);
        assert_eq!(out.status.code(), Some(1), "{}", err(&out));
    }
    let fifo = dir.join("pipe.toml");
    if Command::new("mkfifo")
        .arg(&fifo)
        .status()
        .is_ok_and(|s| s.success())
    {
        // Opening a FIFO to read would wait for a writer for ever; the type is checked first.
        let out = trimline(&["check", "pipe.toml"], &dir);
        assert_eq!(out.status.code(), Some(1));
        assert!(err(&out).contains("FIFO"), "{}", err(&out));
        // Named as a coordinates file inside an aircraft file, too.
        let text = demo_with("naca = \"2410\"", "coordinates = \"pipe.toml\"");
        std::fs::write(dir.join("a.toml"), text).unwrap();
        let out = trimline(&["check", "a.toml"], &dir);
        assert_eq!(out.status.code(), Some(1));
        let e = err(&out);
        assert!(
            e.contains("airfoils.root.coordinates") && e.contains("FIFO"),
            "{e}"
        );
    }
}

#[test]
fn oversize_and_non_utf8_files_are_refused_with_the_limit_and_the_offset() {
    let mut big = DEMO.to_string();
    big.push_str(&"# padding\n".repeat(100_001));
    let out = check_text("big", &big);
    assert_eq!(out.status.code(), Some(1));
    assert!(err(&out).contains("1 MB"), "{}", err(&out));

    let mut bad = b"name = \"ok\"\nnotes = \"caf".to_vec();
    bad.extend_from_slice(&[0xe9, b'"', b'\n']);
    let dir = scratch("latin1");
    std::fs::write(dir.join("a.toml"), &bad).unwrap();
    let out = trimline(&["check", "a.toml"], &dir);
    assert_eq!(out.status.code(), Some(1));
    let e = err(&out);
    assert!(e.contains("a.toml:2:13"), "{e}");
    assert!(e.contains("byte 24 (0xe9)") && e.contains("UTF-8"), "{e}");
}

#[test]
fn standard_input_is_read_with_a_dash() {
    use std::io::Write as _;
    let dir = scratch("stdin");
    let mut child = Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(["check", "-", "--json"])
        .current_dir(&dir)
        .stdin(std::process::Stdio::piped())
        .stdout(std::process::Stdio::piped())
        .stderr(std::process::Stdio::piped())
        .spawn()
        .unwrap();
    child
        .stdin
        .take()
        .unwrap()
        .write_all(DEMO.as_bytes())
        .unwrap();
    let out = child.wait_with_output().unwrap();
    assert_eq!(out.status.code(), Some(0), "{}", err(&out));
    let doc: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    assert_eq!(doc["aircraft"]["name"], "Larkspire 2000", "{doc}");
}

/// Files that are not aircraft files at all: the error may quote a token, never a line.
#[test]
fn foreign_files_are_never_quoted_beyond_one_token() {
    let foreign = [
        "root:x:0:0:root:/root:/bin/bash\ndaemon:x:1:1:daemon:/usr/sbin:/usr/sbin/nologin\n",
        "root:$6$saltsalt$hashhashhashhashhashhashhashhashhash:19000:0:99999:7:::\n",
        "127.0.0.1 localhost localhost.localdomain secret-host-name\n",
        "key = value with several secret words on one line\n",
        "x = 1 2 3 4 5 6 7 8 9 secret words after the value\n",
        "[section]\nsecret_key_number_one = 0x1234567890abcdef1234567890abcdef\n",
    ];
    for (i, text) in foreign.iter().enumerate() {
        let out = check_text(&format!("foreign-{i}"), text);
        assert_eq!(out.status.code(), Some(1), "{text}");
        let e = err(&out);
        for line in text.lines() {
            assert!(!e.contains(line), "a whole line quoted: {e}");
        }
        for tail in ["secret words", "secret-host-name", "/usr/sbin/nologin"] {
            assert!(!e.contains(tail), "{e}");
        }
        // Only one line of message, naming the position.
        assert_eq!(e.lines().count(), 1, "{e}");
        assert!(e.contains("a.toml"), "{e}");
    }
    // The machine's own password file, where there is one, as aircraft and as coordinates.
    if let Ok(real) = std::fs::read_to_string("/etc/passwd") {
        let dir = scratch("etc-passwd");
        for args in [
            &["check", "/etc/passwd"][..],
            &["section", "/etc/passwd"][..],
        ] {
            let out = trimline(args, &dir);
            assert_eq!(out.status.code(), Some(1), "{args:?}");
            let e = err(&out);
            for line in real.lines().filter(|l| l.len() > 8) {
                assert!(!e.contains(line), "{args:?} quoted a line: {e}");
            }
        }
    }
    // Coordinates files: a token is cut at its first character that no number has.
    let dir = scratch("foreign-coords");
    std::fs::write(
        dir.join("f.dat"),
        "title\n1 0\n0.5 daemon:x:1:1:daemon:/usr/sbin:/usr/sbin/nologin\n",
    )
    .unwrap();
    let out = trimline(&["section", "f.dat"], &dir);
    assert_eq!(out.status.code(), Some(1));
    let e = err(&out);
    assert!(!e.contains("/usr/sbin/nologin"), "{e}");
    assert!(e.contains("'daemon...' is not a number"), "{e}");
}

#[test]
fn control_characters_are_shown_escaped() {
    let text = demo_with(
        "name = \"Larkspire 2000\"",
        "name = \"Lark\\u001b[2J\\u001b]0;owned\\u0007spire\"",
    );
    let out = check_text("escape-name", &text);
    assert_eq!(out.status.code(), Some(0), "{}", err(&out));
    let table = String::from_utf8_lossy(&out.stdout);
    assert!(
        !table.contains('\u{1b}') && !table.contains('\u{7}'),
        "raw ESC"
    );
    assert!(table.contains("Lark\\u{1b}[2J"), "{table}");
    // In an error message.
    let text = demo_with("airfoil = \"root\"", "airfoil = \"r\\u001b[31moot\"");
    let out = check_text("escape-error", &text);
    assert_eq!(out.status.code(), Some(1));
    let e = err(&out);
    assert!(!e.contains('\u{1b}'), "raw ESC in {e:?}");
    assert!(e.contains("\\u{1b}[31m"), "{e}");
    // In the PDF's text.
    let dir = scratch("escape-pdf");
    let text = demo_with("name = \"Larkspire 2000\"", "name = \"Bad\\u001b[0mName\"");
    std::fs::write(dir.join("a.toml"), text).unwrap();
    let out = trimline(&["report", "a.toml", "-o", "a.pdf"], &dir);
    assert_eq!(out.status.code(), Some(0), "{}", err(&out));
    let doc = lopdf::Document::load(dir.join("a.pdf")).unwrap();
    let page = doc.extract_text(&[1]).unwrap();
    assert!(!page.contains('\u{1b}'));
    assert!(page.contains("Bad\\u{1b}[0mName"), "{page}");
}

#[test]
fn every_list_has_a_count_limit_named_in_the_error() {
    let panel = "[[wing.panel]]\nspan = 20\ntip_chord = 190\n";
    let text = demo_with("[stabiliser]", &format!("{}[stabiliser]", panel.repeat(20)));
    let out = check_text("panels", &text);
    let e = err(&out);
    assert_eq!(out.status.code(), Some(1), "{e}");
    assert!(
        e.contains("wing.panel[20]") && e.contains("at most 20"),
        "{e}"
    );

    let mass = |i: usize| format!("[[mass]]\nname = \"extra {i}\"\nmass = 1\nx = 50\n");
    let masses: String = (0..500).map(mass).collect();
    let out = check_text("masses", &format!("{DEMO}\n{masses}"));
    let e = err(&out);
    assert_eq!(out.status.code(), Some(1), "{e}");
    assert!(e.contains("mass[500]") && e.contains("at most 500"), "{e}");

    let setup = |i: usize| format!("[[setup]]\nname = \"extra {i}\"\nwing_incidence = 1\n");
    let setups: String = (0..18).map(setup).collect();
    let out = check_text("setups", &format!("{DEMO}\n{setups}"));
    let e = err(&out);
    assert_eq!(out.status.code(), Some(1), "{e}");
    assert!(e.contains("setup[20]") && e.contains("at most 20"), "{e}");

    let foil = |i: usize| format!("[airfoils.extra{i:02}]\nnaca = \"0012\"\n");
    let foils: String = (0..18).map(foil).collect();
    let out = check_text("airfoils", &demo_with("[wing]", &format!("{foils}[wing]")));
    let e = err(&out);
    assert_eq!(out.status.code(), Some(1), "{e}");
    assert!(e.contains("at most 20 [airfoils.NAME]"), "{e}");

    let long = "n".repeat(101);
    let out = check_text(
        "long-name",
        &demo_with("name = \"receiver\"", &format!("name = \"{long}\"")),
    );
    let e = err(&out);
    assert!(
        e.contains("mass[3].name") && e.contains("at most 100"),
        "{e}"
    );
}

#[test]
fn a_coordinates_file_past_the_point_limit_is_refused() {
    let dir = scratch("points");
    let mut text = String::from("too many\n");
    for i in 0..10_001 {
        let t = i as f64 / 10_001.0 * std::f64::consts::TAU;
        text.push_str(&format!("{} {}\n", 0.5 + 0.5 * t.cos(), 0.05 * t.sin()));
    }
    std::fs::write(dir.join("many.dat"), text).unwrap();
    let out = trimline(&["section", "many.dat"], &dir);
    assert_eq!(out.status.code(), Some(1));
    let e = err(&out);
    assert!(
        e.contains("many.dat:10002:1") && e.contains("10000 points"),
        "{e}"
    );
}

#[test]
fn static_margins_must_make_sense() {
    // Negative: refused, and the error says how to mean it.
    let negative = demo_with(
        "[targets]",
        "[limits]\nmin_static_margin = -21\n\n[targets]",
    );
    let out = check_text("negative-margin", &negative);
    let e = err(&out);
    assert_eq!(out.status.code(), Some(1), "{e}");
    assert!(e.contains("limits.min_static_margin"), "{e}");
    assert!(e.contains("negative_margin_intended = true"), "{e}");
    assert_located(&e, "a.toml:");
    // Meant: accepted (down to -20 %), with a danger caution and exit code 3.
    let meant = demo_with(
        "[targets]",
        "[limits]\nnegative_margin_intended = true\nmin_static_margin = -5\n\n[targets]",
    );
    let out = check_text("negative-intended", &meant);
    assert_eq!(out.status.code(), Some(3), "{}", err(&out));
    assert!(String::from_utf8_lossy(&out.stdout).contains("static-margin-limit-negative"));
    // Too large, and out of order.
    for (limits, field) in [
        ("max_static_margin = 50", "limits.max_static_margin"),
        (
            "min_static_margin = 12\nmax_static_margin = 8",
            "limits.max_static_margin",
        ),
    ] {
        let out = check_text(
            "margin-range",
            &demo_with("[targets]", &format!("[limits]\n{limits}\n\n[targets]")),
        );
        let e = err(&out);
        assert_eq!(out.status.code(), Some(1), "{e}");
        assert!(e.contains(field), "{e}");
        assert_located(&e, "a.toml:");
    }
    // A negative target static margin, unmeant.
    let out = check_text(
        "negative-target",
        &demo_with("static_margin = 15", "static_margin = -10"),
    );
    let e = err(&out);
    assert!(
        e.contains("targets.static_margin") && e.contains("negative"),
        "{e}"
    );
}

#[test]
fn implausible_geometry_and_masses_are_refused_or_cautioned() {
    // A tail ahead of the wing is a canard.
    let out = check_text(
        "tail-ahead",
        &demo_with("role = \"tail\"\nx = 800", "role = \"tail\"\nx = -800"),
    );
    let e = err(&out);
    assert_eq!(out.status.code(), Some(1), "{e}");
    assert!(e.contains("stabiliser.x") && e.contains("canard"), "{e}");
    assert_located(&e, "a.toml:");
    // A unit slip: 2 mm of span.
    let out = check_text("slip", &demo_with("span = 550", "span = 2"));
    let e = err(&out);
    assert!(e.contains("did you mean 2 m?"), "{e}");
    assert!(e.contains("wing.panel[0].span"), "{e}");
    // A unit slip inside a quoted length: metres written where millimetres were meant, and
    // millimetres where metres were meant (the number alone fits the other unit's range).
    let out = check_text(
        "slip-m",
        &demo_with("root_chord = 210", "root_chord = \"210 m\""),
    );
    let e = err(&out);
    assert!(
        e.contains("wing.root_chord") && e.contains("did you mean \"210 mm\"?"),
        "{e}"
    );
    let out = check_text("slip-mm", &demo_with("span = 550", "span = \"2 mm\""));
    let e = err(&out);
    assert!(e.contains("did you mean \"2 m\"?"), "{e}");
    // A length in range in neither unit gets no guess.
    let out = check_text("no-guess", &demo_with("span = 550", "span = \"0.001 mm\""));
    let e = err(&out);
    assert!(
        e.contains("wing.panel[0].span") && !e.contains("did you mean"),
        "{e}"
    );
    // A one-tonne glider of 2 m span: refused on its wing loading.
    let out = check_text("heavy", &demo_with("mass = 165", "mass = 1000000"));
    let e = err(&out);
    assert_eq!(out.status.code(), Some(1), "{e}");
    assert!(
        e.contains("wing loading") && e.contains("400 kg/m^2"),
        "{e}"
    );
    // An absurd number is shown in exponent form, not in 300 digits, with its range.
    let out = check_text("huge", &demo_with("altitude = 300", "altitude = 1e300"));
    let e = err(&out);
    assert!(
        e.contains("1.000e300 m is out of range") && e.len() < 300,
        "{e}"
    );
    assert!(e.contains("-500 m to 11000 m"), "{e}");
    // A feather-light glider (a few grams in all): possible, cautioned on its wing loading.
    let light: String = DEMO
        .lines()
        .map(|l| match l.strip_prefix("mass = ") {
            Some(_) => "mass = 0.5".to_string(),
            None => l.to_string(),
        })
        .collect::<Vec<_>>()
        .join("\n");
    let out = check_text("light", &light);
    let table = String::from_utf8_lossy(&out.stdout);
    assert!(table.contains("wing-loading-unusual"), "{}", err(&out));
    // A 30 m fuselage on a 2 m model: possible to compute, cautioned.
    let out = check_text(
        "long-fuselage",
        &demo_with("length = 1250", "length = 30000"),
    );
    assert!(
        String::from_utf8_lossy(&out.stdout).contains("proportions-unusual"),
        "{}",
        err(&out)
    );
}

#[test]
fn exit_code_3_on_a_danger_unless_asked_otherwise() {
    let dir = scratch("exit-codes");
    // The battery far aft puts the CG behind the neutral point: danger.
    let text = demo_with("mass = 60\nx = -360", "mass = 600\nx = 500");
    std::fs::write(dir.join("a.toml"), text).unwrap();
    let out = trimline(&["check", "a.toml"], &dir);
    assert_eq!(out.status.code(), Some(3), "{}", err(&out));
    let out = trimline(&["check", "a.toml", "--exit-zero-on-danger"], &dir);
    assert_eq!(out.status.code(), Some(0));
    let out = trimline(&["report", "a.toml", "-o", "a.pdf"], &dir);
    assert_eq!(out.status.code(), Some(3));
    assert!(
        dir.join("a.pdf").exists(),
        "the report is written all the same"
    );
    // The demo has no danger.
    assert_eq!(trimline(&["check"], &dir).status.code(), Some(0));
    // compare: one configuration with a danger is enough.
    let out = trimline(&["compare", "a.toml"], &dir);
    assert_eq!(out.status.code(), Some(3), "{}", err(&out));
    let out = trimline(&["compare", "a.toml", "--exit-zero-on-danger"], &dir);
    assert_eq!(out.status.code(), Some(0), "{}", err(&out));
}
