//! The `check` command end to end: exit codes, JSON paths, errors on stderr.

use std::process::Command;

fn trimline(args: &[&str]) -> std::process::Output {
    Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(args)
        .current_dir(env!("CARGO_MANIFEST_DIR"))
        .output()
        .expect("the binary runs")
}

const REQUIRED: &[&str] = &[
    "/aircraft/name",
    "/mass/total_kg",
    "/balance/cg_x_m",
    "/balance/cg_percent_mac",
    "/wing/area_m2",
    "/wing/span_m",
    "/wing/aspect_ratio",
    "/wing/mac_m",
    "/wing/mac_le_x_m",
    "/wing/cl_alpha_per_rad",
    "/stability/neutral_point_x_m",
    "/stability/neutral_point_percent_mac",
    "/stability/static_margin_percent",
    "/trim/cl",
    "/trim/alpha_deg",
    "/trim/speed_m_s",
    "/stall/cl_max",
    "/stall/speed_m_s",
    "/cautions",
];

#[test]
fn demo_json_has_every_documented_path() {
    let out = trimline(&["check", "--json"]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let v: serde_json::Value = serde_json::from_slice(&out.stdout).expect("valid JSON");
    for path in REQUIRED {
        let field = v.pointer(path).unwrap_or_else(|| panic!("missing {path}"));
        assert!(!field.is_null(), "{path} is null in the demo");
    }
    let cautions = v["cautions"].as_array().unwrap();
    assert!(cautions.iter().any(|c| c["code"] == "safety-estimate-only"));
    for c in cautions {
        for key in ["level", "code", "message"] {
            assert!(c[key].is_string(), "caution lacks {key}: {c}");
        }
    }
}

#[test]
fn every_example_aircraft_checks_cleanly() {
    let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("aircraft");
    let mut n = 0;
    for entry in std::fs::read_dir(dir).unwrap() {
        let path = entry.unwrap().path();
        if path.extension().and_then(|e| e.to_str()) != Some("toml") {
            continue;
        }
        n += 1;
        let p = path.to_str().unwrap();
        let out = trimline(&["check", p]);
        assert!(
            out.status.success(),
            "{p}: {}",
            String::from_utf8_lossy(&out.stderr)
        );
        let text = String::from_utf8_lossy(&out.stdout);
        assert!(
            !text.contains("NaN") && !text.contains("inf"),
            "{p}: non-finite output"
        );
        let out = trimline(&["check", "--json", p]);
        assert!(out.status.success());
        let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
        assert!(v.pointer("/wing/mac_m").unwrap().as_f64().unwrap() > 0.0);
    }
    assert!(
        n >= 3,
        "expected at least three example aircraft, found {n}"
    );
}

#[test]
fn bad_file_exits_1_with_location_on_stderr() {
    let dir = std::env::temp_dir().join(format!("trimline-cli-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let bad = dir.join("bad.toml");
    std::fs::write(&bad, "name = \"x\"\n[wing]\nroot_chord = 200\nspna = 3\n").unwrap();
    let out = trimline(&["check", bad.to_str().unwrap()]);
    assert_eq!(out.status.code(), Some(1));
    let err = String::from_utf8_lossy(&out.stderr);
    assert!(err.contains("bad.toml:4:1"), "{err}");
    assert!(err.contains("spna"), "{err}");
    assert!(out.stdout.is_empty());
    let missing = trimline(&["check", dir.join("nope.toml").to_str().unwrap()]);
    assert_eq!(missing.status.code(), Some(1));
}

#[test]
fn usage_error_exits_2() {
    let out = trimline(&["check", "--no-such-option"]);
    assert_eq!(out.status.code(), Some(2));
    let out = trimline(&["fly"]);
    assert_eq!(out.status.code(), Some(2));
}

fn json_paths(v: &serde_json::Value, prefix: &str, out: &mut Vec<String>) {
    match v {
        serde_json::Value::Object(map) => {
            for (k, child) in map {
                json_paths(child, &format!("{prefix}/{k}"), out);
            }
        }
        serde_json::Value::Array(items) => match items.first() {
            Some(first) => json_paths(first, &format!("{prefix}/N"), out),
            None => out.push(prefix.to_string()),
        },
        serde_json::Value::Null => out.push(prefix.to_string()),
        _ => out.push(prefix.to_string()),
    }
}

// The JSON is documented field by field in docs/json.md (issue requirement): every leaf path
// that any example aircraft produces must appear there, in backticks.
#[test]
fn every_json_field_is_documented() {
    let doc = std::fs::read_to_string(
        std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("docs/json.md"),
    )
    .unwrap();
    let dir = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("aircraft");
    let mut missing = Vec::new();
    for entry in std::fs::read_dir(dir).unwrap() {
        let path = entry.unwrap().path();
        if path.extension().and_then(|e| e.to_str()) != Some("toml") {
            continue;
        }
        let out = trimline(&["check", "--json", path.to_str().unwrap()]);
        let v: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
        let mut paths = Vec::new();
        json_paths(&v, "", &mut paths);
        for p in paths {
            // A null object is documented by its own path; its children are listed elsewhere.
            if !doc.contains(&format!("`{p}`")) && !missing.contains(&p) {
                missing.push(p);
            }
        }
    }
    assert!(missing.is_empty(), "undocumented JSON fields: {missing:?}");
}

// `new` writes a starter file that checks cleanly, and never overwrites an existing file.
#[test]
fn new_writes_a_starter_file_and_never_overwrites() {
    let dir = std::env::temp_dir().join(format!("trimline-new-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("mine.toml");
    let _ = std::fs::remove_file(&path);
    let out = trimline(&["new", path.to_str().unwrap(), "--from", "wing"]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let check = trimline(&["check", path.to_str().unwrap()]);
    assert!(check.status.success());
    std::fs::write(&path, "my own work").unwrap();
    let again = trimline(&["new", path.to_str().unwrap()]);
    assert_eq!(again.status.code(), Some(1));
    assert_eq!(std::fs::read_to_string(&path).unwrap(), "my own work");
}

// `new --from v-tail` starts from the V-tail example: the file it writes reads back, its
// stabiliser is a V-tail in the sense of the planform code (projected area below 0.985 of
// the true area, src/planform/tail.rs), and it carries flaps and flap settings to edit.
#[test]
fn new_from_v_tail_writes_a_v_tail_starter() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("vee.toml");
    let out = trimline(&["new", path.to_str().unwrap(), "--from", "v-tail"]);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    assert!(String::from_utf8_lossy(&out.stdout).contains("V-tail"));
    let text = std::fs::read_to_string(&path).unwrap();
    let aircraft = trimline::input::parse_aircraft(&text, "vee.toml", None).unwrap();
    let stab = aircraft.stabiliser.as_ref().expect("a stabiliser");
    assert!(trimline::planform::is_vee_tail(&stab.surface));
    assert!(text.contains("[[wing.flap]]") && text.contains("[[flap_setting]]"));
    let check = trimline(&["check", path.to_str().unwrap()]);
    assert!(
        check.status.code() == Some(0) || check.status.code() == Some(3),
        "{}",
        String::from_utf8_lossy(&check.stderr)
    );
}

// The example in docs/json.md has the keys `check --json` writes today, no more and no fewer
// (its lists are cut; their entries keep the keys of the real ones), so it cannot go stale
// in shape when a field is added or renamed.
#[test]
fn the_json_example_in_the_docs_has_the_shape_of_the_output() {
    fn shape(v: &serde_json::Value, path: &str, out: &mut std::collections::BTreeSet<String>) {
        match v {
            serde_json::Value::Object(m) => {
                for (k, c) in m {
                    let p = format!("{path}/{k}");
                    out.insert(p.clone());
                    shape(c, &p, out);
                }
            }
            serde_json::Value::Array(items) => {
                for c in items.iter().take(2) {
                    shape(c, &format!("{path}/N"), out);
                }
            }
            _ => {}
        }
    }
    let doc = std::fs::read_to_string(
        std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("docs/json.md"),
    )
    .unwrap();
    let example = doc
        .split("## Example")
        .nth(1)
        .and_then(|s| s.split("```json").nth(1))
        .and_then(|s| s.split("```").next())
        .expect("the example block");
    let documented: serde_json::Value = serde_json::from_str(example).unwrap();
    let out = trimline(&["check", "--json"]);
    let real: serde_json::Value = serde_json::from_slice(&out.stdout).unwrap();
    let (mut a, mut b) = (Default::default(), Default::default());
    shape(&documented, "", &mut a);
    shape(&real, "", &mut b);
    let only_doc: Vec<_> = a.difference(&b).collect();
    let only_real: Vec<_> = b.difference(&a).collect();
    assert!(
        only_doc.is_empty() && only_real.is_empty(),
        "only in the example: {only_doc:?}; only in the output: {only_real:?}"
    );
}
