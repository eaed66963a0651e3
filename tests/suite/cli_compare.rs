//! `compare` end to end, and setups applied as documented.

use approx::assert_relative_eq;
use std::process::Command;
use trimline::balance::mass_summary;
use trimline::input::parse_aircraft;

fn trimline(args: &[&str]) -> std::process::Output {
    Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .output()
        .expect("the binary runs")
}

const BASE: &str = r#"
name = "Setup test"
[airfoils.a]
naca = "0012"
cl_max = 1.0
[wing]
root_chord = 200
airfoil = "a"
[[wing.panel]]
span = 600
tip_chord = 200
[[mass]]
name = "airframe"
mass = 400
x = 60
[[mass]]
name = "battery"
mass = 100
x = -50
[[ballast]]
name = "nose"
x = -100
max = 50
[[setup]]
name = "lead"
ballast = { nose = 20 }
[[setup]]
name = "battery back"
mass_x = { battery = 0 }
"#;

// Setups change the mass list exactly as stated: statics by hand.
// Base: (400*60 - 100*50)/500 = 38 mm. "lead": + 20 g at -100 -> (19000 - 2000)/520 = 32.6923 mm.
// "battery back": (24000 + 0)/500 = 48 mm.
#[test]
fn setups_apply_their_changes() {
    let a = parse_aircraft(BASE, "setups.toml", None).unwrap();
    assert_eq!(a.setups.len(), 2);
    let cg = |x: &trimline::model::Aircraft| mass_summary(&x.masses).unwrap().cg_x_m;
    assert_relative_eq!(cg(&a), 0.038, epsilon = 1e-12);
    assert_relative_eq!(cg(&a.setups[0].apply(&a)), 0.017 / 0.52, epsilon = 1e-12);
    assert_relative_eq!(cg(&a.setups[1].apply(&a)), 0.048, epsilon = 1e-12);
}

#[test]
fn setup_naming_a_missing_item_is_an_error() {
    let bad = BASE.replace("mass_x = { battery = 0 }", "mass_x = { batery = 0 }");
    let e = parse_aircraft(&bad, "setups.toml", None)
        .unwrap_err()
        .to_string();
    assert!(e.contains("no mass item named `batery`"), "{e}");
    assert!(e.contains("battery"), "{e}");
    let too_much = BASE.replace("nose = 20", "nose = 80");
    let e = parse_aircraft(&too_much, "setups.toml", None)
        .unwrap_err()
        .to_string();
    assert!(e.contains("setup[0].ballast.nose"), "{e}");
}

#[test]
fn compare_demo_shows_setups_and_differences() {
    let out = trimline(&["compare", "--json"]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let cols = v["configurations"].as_array().unwrap();
    assert!(cols.len() >= 2);
    // The first column's differences from itself are zero.
    assert_eq!(
        cols[0]["difference_from_first"]["mass_kg"].as_f64(),
        Some(0.0)
    );
    // A difference is the column's value minus the first column's value.
    let m0 = cols[0]["figures"]["cg_x_m"].as_f64().unwrap();
    let m1 = cols[1]["figures"]["cg_x_m"].as_f64().unwrap();
    let d1 = cols[1]["difference_from_first"]["cg_x_m"].as_f64().unwrap();
    assert_relative_eq!(d1, m1 - m0, epsilon = 1e-9);
}

#[test]
fn compare_two_files_as_table() {
    let out = trimline(&[
        "compare",
        "--base-only",
        "aircraft/larkspire-2000.toml",
        "aircraft/wrenfield-1400.toml",
    ]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        text.contains("Larkspire 2000") && text.contains("Wrenfield 1400"),
        "{text}"
    );
    assert!(text.contains("static margin %"));
}

// Two files that carry the same aircraft name are told apart by their file names; the same
// file twice by a number (found by a new-user trial: both columns read alike).
#[test]
fn columns_of_the_same_name_are_told_apart() {
    let dir = crate::common::scratch_in("compare-names", "copies");
    let copy = dir.join("copy.toml");
    std::fs::copy(
        concat!(env!("CARGO_MANIFEST_DIR"), "/aircraft/larkspire-2000.toml"),
        &copy,
    )
    .unwrap();
    let copy = copy.to_str().unwrap();
    let out = trimline(&[
        "compare",
        "--base-only",
        "aircraft/larkspire-2000.toml",
        copy,
    ]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        text.contains("Larkspire 2000 (larkspire-2000.toml)")
            && text.contains("Larkspire 2000 (copy.toml)"),
        "{text}"
    );
    let out = trimline(&["compare", "--base-only", copy, copy]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(
        text.contains("Larkspire 2000 (1)") && text.contains("Larkspire 2000 (2)"),
        "{text}"
    );
}

#[test]
fn compare_with_nothing_to_compare_fails_cleanly() {
    let out = trimline(&["compare", "--base-only", "aircraft/wrenfield-1400.toml"]);
    assert_eq!(out.status.code(), Some(1));
    assert!(String::from_utf8_lossy(&out.stderr).contains("nothing to compare"));
}

fn read_back(path: &std::path::Path) -> (usize, String) {
    let bytes = std::fs::read(path).expect("the PDF was written");
    assert!(bytes.starts_with(b"%PDF-"), "no PDF header");
    let doc = lopdf::Document::load_mem(&bytes).expect("lopdf reads the comparison");
    let text = doc.extract_text(&[1]).expect("text of page 1");
    (
        doc.get_pages().len(),
        text.split_whitespace().collect::<Vec<_>>().join(" "),
    )
}

// The comparison PDF: one page, every setup's name and its CG figure as text, the standing
// safety caution; the figures are those of the JSON comparison of the same run.
#[test]
fn comparison_pdf_is_one_page_with_the_figures() {
    let dir = std::env::temp_dir().join(format!("trimline-cmp-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let pdf = dir.join("cmp.pdf");
    let out = trimline(&["compare", "--json", "--pdf", pdf.to_str().unwrap()]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let (pages, text) = read_back(&pdf);
    assert_eq!(pages, 1);
    for col in v["configurations"].as_array().unwrap() {
        assert!(text.contains(col["name"].as_str().unwrap()), "{text}");
        let cg = 1000.0 * col["figures"]["cg_x_m"].as_f64().unwrap();
        assert!(
            text.contains(&format!("{cg:.1}")),
            "CG {cg:.1} missing in {text}"
        );
    }
    let safety: String = trimline::output::cautions::SAFETY_MESSAGE
        .split_whitespace()
        .collect::<Vec<_>>()
        .join(" ");
    assert!(text.contains(&safety));
}

// A comparison that fails writes nothing and leaves an existing file untouched.
#[test]
fn failed_comparison_leaves_the_old_pdf_alone() {
    let dir = std::env::temp_dir().join(format!("trimline-cmp-fail-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let pdf = dir.join("old.pdf");
    std::fs::write(&pdf, b"old contents").unwrap();
    let out = trimline(&[
        "compare",
        "--base-only",
        "aircraft/wrenfield-1400.toml",
        "--pdf",
        pdf.to_str().unwrap(),
    ]);
    assert_eq!(out.status.code(), Some(1));
    assert_eq!(std::fs::read(&pdf).unwrap(), b"old contents");
}

// `compare --json` writes rounded figures (docs/json.md): no number has more than 6 decimals,
// so float noise such as 565.0000000000001 never shows, and the caution counts are integers.
// Checked on the demo's setups and on three whole files (one of them tailless, with nulls).
#[test]
fn compare_json_numbers_are_rounded_and_counts_are_integers() {
    fn numbers(v: &serde_json::Value, path: &str, out: &mut Vec<(String, serde_json::Number)>) {
        match v {
            serde_json::Value::Object(map) => {
                for (k, child) in map {
                    numbers(child, &format!("{path}/{k}"), out);
                }
            }
            serde_json::Value::Array(items) => {
                for (i, child) in items.iter().enumerate() {
                    numbers(child, &format!("{path}/{i}"), out);
                }
            }
            serde_json::Value::Number(n) => out.push((path.to_string(), n.clone())),
            _ => {}
        }
    }
    for args in [
        vec!["compare", "--json"],
        vec![
            "compare",
            "--json",
            "--base-only",
            "aircraft/larkspire-2000.toml",
            "aircraft/skerrywing-900.toml",
            "aircraft/wrenfield-1400.toml",
        ],
    ] {
        let out = trimline(&args);
        assert!(
            out.status.success(),
            "{}",
            String::from_utf8_lossy(&out.stderr)
        );
        let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
        let mut found = Vec::new();
        numbers(&v, "", &mut found);
        assert!(found.len() > 20, "too few numbers: {found:?}");
        for (path, n) in &found {
            let text = n.to_string();
            assert!(
                !text.contains(['e', 'E']),
                "{path} = {text} is in exponent form"
            );
            let decimals = text.split_once('.').map_or(0, |(_, d)| d.len());
            assert!(decimals <= 6, "{path} = {text} has {decimals} decimals");
            if path.ends_with("/warnings") || path.ends_with("/dangers") {
                assert!(
                    n.is_i64() || n.is_u64(),
                    "{path} = {text} is not an integer"
                );
            }
        }
        let counts = found
            .iter()
            .filter(|(p, _)| p.ends_with("/warnings") || p.ends_with("/dangers"))
            .count();
        let columns = v["configurations"].as_array().unwrap().len();
        assert_eq!(counts, 4 * columns, "warnings and dangers in both maps");
    }
}

// The table names the warnings and dangers of each column (their counts alone leave the
// builder guessing), with the same codes as `check --setup` of that column.
#[test]
fn compare_names_each_columns_cautions() {
    let out = trimline(&["compare", "aircraft/larkspire-2000.toml"]);
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("Warnings and dangers raised"), "{text}");
    let check = trimline(&[
        "check",
        "aircraft/larkspire-2000.toml",
        "--setup",
        "battery 40 mm aft",
        "--json",
    ]);
    let v: serde_json::Value = serde_json::from_slice(&check.stdout).unwrap();
    let line = text
        .lines()
        .find(|l| l.trim_start().starts_with("battery 40 mm aft:"))
        .expect("a line for the setup");
    for c in v["cautions"].as_array().unwrap() {
        let level = c["level"].as_str().unwrap();
        if level == "warning" || level == "danger" {
            let code = c["code"].as_str().unwrap();
            assert!(line.contains(code), "{code} missing from {line}");
        }
    }
}

// One unit convention for every JSON document (issue 15): `compare --json` is in the SI
// units of `check --json`, says so in the same `units` text, and each figure equals the
// `check --json --setup` figure of that configuration to the stated rounding; every path it
// writes is documented in docs/json.md.
#[test]
fn compare_json_is_in_the_units_of_check_json_and_documented() {
    let out = trimline(&["compare", "--json", "aircraft/larkspire-2000.toml"]);
    let cmp: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let check = trimline(&[
        "check",
        "--json",
        "aircraft/larkspire-2000.toml",
        "--setup",
        "battery 40 mm aft",
    ]);
    let chk: serde_json::Value = serde_json::from_slice(&check.stdout).unwrap();
    assert_eq!(cmp["units"], chk["units"]);
    assert!(cmp["units"].as_str().unwrap().starts_with("SI"));
    let col = cmp["configurations"]
        .as_array()
        .unwrap()
        .iter()
        .find(|c| c["name"] == "battery 40 mm aft")
        .expect("the setup's column");
    let f = &col["figures"];
    let close = |key: &str, expected: f64, tol: f64| {
        let got = f[key].as_f64().unwrap();
        assert!((got - expected).abs() <= tol, "{key}: {got} vs {expected}");
    };
    close("cg_x_m", chk["balance"]["cg_x_m"].as_f64().unwrap(), 5e-6);
    close("mass_kg", chk["mass"]["total_kg"].as_f64().unwrap(), 5e-5);
    close(
        "neutral_point_x_m",
        chk["stability"]["neutral_point_x_m"].as_f64().unwrap(),
        5e-6,
    );
    close(
        "stall_speed_m_s",
        chk["stall"]["speed_m_s"].as_f64().unwrap(),
        5e-4,
    );
    let doc = std::fs::read_to_string(
        std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("docs/json.md"),
    )
    .unwrap();
    let mut missing = Vec::new();
    let mut walk = vec![(String::new(), &cmp)];
    while let Some((path, v)) = walk.pop() {
        match v {
            serde_json::Value::Object(m) => {
                if !path.is_empty() && !doc.contains(&format!("`{path}`")) {
                    missing.push(path.clone());
                }
                for (k, c) in m {
                    walk.push((format!("{path}/{k}"), c));
                }
            }
            serde_json::Value::Array(items) => {
                for c in items {
                    walk.push((format!("{path}/N"), c));
                }
            }
            _ => {
                if !doc.contains(&format!("`{path}`")) && !missing.contains(&path) {
                    missing.push(path);
                }
            }
        }
    }
    // The difference map repeats the figures' keys, documented once under `figures`.
    missing.retain(|p| !p.contains("/difference_from_first/"));
    assert!(missing.is_empty(), "undocumented compare JSON: {missing:?}");
}

// Each configuration of `compare --json` carries the level and code of every caution it raised
// (docs/json.md, `/configurations/N/cautions`): the same list, in the same order, as
// `check --json` for that configuration, and its warning and danger counts agree with it.
#[test]
fn compare_json_lists_each_configurations_cautions_as_check_does() {
    let out = trimline(&["compare", "--json"]);
    let cmp: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let configurations = cmp["configurations"].as_array().unwrap();
    assert!(configurations.len() >= 2);
    let pairs = |v: &serde_json::Value| -> Vec<(String, String)> {
        v.as_array()
            .unwrap()
            .iter()
            .map(|c| {
                (
                    c["level"].as_str().unwrap().to_string(),
                    c["code"].as_str().unwrap().to_string(),
                )
            })
            .collect()
    };
    let mut differ = false;
    for (i, col) in configurations.iter().enumerate() {
        let name = col["name"].as_str().unwrap();
        let mut args = vec!["check", "--json"];
        if i > 0 {
            args.extend(["--setup", name]);
        }
        let check = trimline(&args);
        let chk: serde_json::Value = serde_json::from_slice(&check.stdout).unwrap();
        let listed = pairs(&col["cautions"]);
        assert_eq!(listed, pairs(&chk["cautions"]), "cautions of {name}");
        let count = |level: &str| listed.iter().filter(|(l, _)| l == level).count() as u64;
        assert_eq!(col["figures"]["warnings"].as_u64(), Some(count("warning")));
        assert_eq!(col["figures"]["dangers"].as_u64(), Some(count("danger")));
        differ |= listed != pairs(&configurations[0]["cautions"]);
    }
    // The demo's setups do not all raise the same cautions (one moves the CG aft of the band).
    assert!(differ, "every configuration has the same cautions");
}
