//! The `trimline section` command run as a user would: JSON, tables and the pressure CSV.

use serde_json::Value;

fn run(args: &[&str]) -> (i32, String, String) {
    let out = std::process::Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(args)
        .output()
        .expect("binary runs");
    (
        out.status.code().unwrap_or(-1),
        String::from_utf8_lossy(&out.stdout).into_owned(),
        String::from_utf8_lossy(&out.stderr).into_owned(),
    )
}

#[test]
fn naca_2412_json_has_the_documented_fields() {
    // Values: the panel method on NACA 2412 must land near thin-airfoil theory (Anderson,
    // Fundamentals of Aerodynamics, ch. 4: -2.077 deg, -0.053) within 0.15 deg and 0.004,
    // and its lift slope near 2 pi (1 + 0.77 t/c) = 6.86 per rad (thickness correction, from
    // memory) within 3 %; the aerodynamic centre near the quarter chord (0.23 to 0.28,
    // judgement for a 12 % section in potential flow).
    let (code, stdout, stderr) = run(&["section", "naca2412", "--json", "--alpha", "-2,0,4"]);
    assert_eq!(code, 0, "{stderr}");
    let v: Value = serde_json::from_str(&stdout).expect("valid JSON");
    assert_eq!(v["method"], "panel");
    let num = |p: &str| v.pointer(p).and_then(Value::as_f64).unwrap_or(f64::NAN);
    approx::assert_relative_eq!(num("/alpha_zero_lift_deg"), -2.077, epsilon = 0.15);
    approx::assert_relative_eq!(num("/cm_quarter_chord"), -0.053, epsilon = 0.004);
    approx::assert_relative_eq!(num("/cl_alpha_per_rad"), 6.86, max_relative = 0.03);
    let x_ac = num("/aerodynamic_center_x_c");
    assert!((0.23..0.28).contains(&x_ac), "x_ac {x_ac}");
    let points = v["points"].as_array().expect("points array");
    assert_eq!(points.len(), 3);
    for (p, alpha) in points.iter().zip([-2.0, 0.0, 4.0]) {
        approx::assert_relative_eq!(p["alpha_deg"].as_f64().unwrap(), alpha, epsilon = 1e-12);
        assert!(p["cl"].as_f64().unwrap().is_finite());
        assert!(p["cm_quarter_chord"].as_f64().unwrap().is_finite());
    }
    assert_eq!(v["cautions"][0]["code"], "cl-max-default");
}

#[test]
fn methods_and_specs_from_the_command_line() {
    // Exact Joukowski section, thin theory on a five-digit section, and Karman-Trefftz:
    // each prints a finite zero-lift angle of the right sign (camber makes it negative).
    for (args, method) in [
        (vec!["section", "jouk:12/2", "--json"], "exact"),
        (
            vec!["section", "NACA23012", "--method", "thin", "--json"],
            "thin",
        ),
        (
            vec!["section", "kt:10/3/8", "--json", "--cl-max", "1.2"],
            "exact",
        ),
        (
            vec![
                "section",
                "tests/data/naca2412.dat",
                "--json",
                "--panels",
                "120",
            ],
            "panel",
        ),
    ] {
        let (code, stdout, stderr) = run(&args);
        assert_eq!(code, 0, "{args:?}: {stderr}");
        let v: Value = serde_json::from_str(&stdout).unwrap();
        assert_eq!(v["method"], method, "{args:?}");
        let a0 = v["alpha_zero_lift_deg"].as_f64().unwrap();
        assert!(a0 < 0.0 && a0 > -10.0, "{args:?}: {a0}");
    }
}

#[test]
fn tables_show_summary_and_angles() {
    let (code, stdout, stderr) = run(&["section", "naca0012", "--alpha", "0:4:2"]);
    assert_eq!(code, 0, "{stderr}");
    assert!(stdout.contains("Zero-lift angle"), "{stdout}");
    assert!(stdout.contains("alpha (deg)"), "{stdout}");
    assert!(
        !stdout.contains("NaN") && !stdout.contains("inf"),
        "{stdout}"
    );
    assert!(stdout.matches("┆").count() > 10, "{stdout}");
}

#[test]
fn csv_is_written_with_one_row_per_surface_point() {
    let dir = std::env::temp_dir().join(format!("trimline-section-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("cp.csv");
    let p = path.to_str().unwrap();
    let (code, _, stderr) = run(&["section", "naca2412", "--panels", "80", "--csv", p]);
    assert_eq!(code, 0, "{stderr}");
    let text = std::fs::read_to_string(&path).unwrap();
    let mut lines = text.lines();
    assert_eq!(lines.next(), Some("x_c,y_c,cp"));
    assert_eq!(lines.count(), 80);
    // Only the CSV is left in the folder: the temporary file was renamed.
    assert_eq!(std::fs::read_dir(&dir).unwrap().count(), 1);
    std::fs::remove_dir_all(&dir).unwrap();
}

#[test]
fn table_output_matches_the_golden_file() {
    // Regression check of the terminal layout (STYLE.md, golden files at the edges): thin
    // theory on NACA 0012 is analytic, so the numbers are stable. Refresh with UPDATE_EXPECT=1.
    let (code, stdout, stderr) = run(&[
        "section", "naca0012", "--method", "thin", "--alpha", "0,4", "--cl-max", "1.3",
    ]);
    assert_eq!(code, 0, "{stderr}");
    let path = "tests/data/section_naca0012_thin.expected";
    if std::env::var_os("UPDATE_EXPECT").is_some() {
        std::fs::write(path, &stdout).unwrap();
    }
    let expected = std::fs::read_to_string(path).expect("golden file (UPDATE_EXPECT=1 makes it)");
    assert!(
        stdout == expected,
        "table changed.\n--- expected\n{expected}\n--- got\n{stdout}"
    );
}

#[test]
fn viscous_polars_in_json_tables_and_csv() {
    // Values: NACA 0012 at Re 1e6, 0 deg: no lift (symmetry) and a profile drag between the
    // smooth-model value at Re 6e6 (about 0.006, Abbott & von Doenhoff appendix IV, from
    // memory) and the laminar-bubble drag of model Reynolds numbers (about 0.012 at Re 2e5,
    // the same charts' trend, from memory): 0.006 to 0.0095 at Re 1e6.
    let dir = std::env::temp_dir().join(format!("trimline-polar-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let csv = dir.join("polar.csv");
    let (code, stdout, stderr) = run(&[
        "section",
        "naca0012",
        "--json",
        "--alpha",
        "0,4",
        "--panels",
        "160",
        "--re",
        "1e6,2e5",
        "--polar-csv",
        csv.to_str().unwrap(),
    ]);
    assert_eq!(code, 0, "{stderr}");
    let v: Value = serde_json::from_str(&stdout).expect("valid JSON");
    let polars = v["viscous"].as_array().expect("viscous array");
    assert_eq!(polars.len(), 2);
    approx::assert_relative_eq!(polars[0]["reynolds"].as_f64().unwrap(), 1e6);
    approx::assert_relative_eq!(polars[0]["transition_n"].as_f64().unwrap(), 9.0);
    let p0 = &polars[0]["points"][0];
    assert_eq!(p0["status"], "converged");
    assert!(p0["cl"].as_f64().unwrap().abs() < 1e-6);
    let cd = p0["cd"].as_f64().unwrap();
    assert!((0.006..0.0095).contains(&cd), "cd {cd}");
    assert!(p0["transition_upper_x_c"].as_f64().is_some());
    let text = std::fs::read_to_string(&csv).unwrap();
    let mut lines = text.lines();
    assert_eq!(
        lines.next().unwrap(),
        "reynolds,transition_n,alpha_deg,state,cl,cd,cm_c4,transition_upper_x_c,transition_lower_x_c,separation_x_c"
    );
    assert_eq!(lines.count(), 4);
    let (code, stdout, _) = run(&["section", "naca0012", "--alpha", "2", "--re", "2e5"]);
    assert_eq!(code, 0);
    assert!(stdout.contains("Viscous, Re 200000, N 9"), "{stdout}");
    assert!(stdout.contains("transition upper x/c"), "{stdout}");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn viscous_bad_settings_are_refused_with_the_range() {
    let (code, _, stderr) = run(&["section", "naca0012", "--re", "5e3"]);
    assert_eq!(code, 1, "{stderr}");
    assert!(stderr.contains("1e4 to 1e7"), "{stderr}");
    let (code, _, stderr) = run(&["section", "naca0012", "--re", "2e5", "--transition-n", "20"]);
    assert_eq!(code, 1, "{stderr}");
    assert!(stderr.contains("1 to 14"), "{stderr}");
    let (code, _, stderr) = run(&["section", "naca0012", "--re", "2e5", "--panels", "40"]);
    assert_eq!(code, 1, "{stderr}");
    assert!(stderr.contains("too coarse"), "{stderr}");
    let (code, _, stderr) = run(&["section", "naca0012", "--polar-csv", "x.csv"]);
    assert_eq!(code, 1, "{stderr}");
    assert!(stderr.contains("needs --re"), "{stderr}");
}

#[test]
fn viscous_summary_shows_reynolds_number_least_drag_slope_and_what_cl_max_is() {
    // Consistency of the summary with its own points (no outside value): the least cd and
    // its cl are those of the converged point with the least cd; the slope per rad and per
    // deg agree; a sweep that stops at 4 deg on NACA 2412 (its lift rises to about 12-16
    // deg in any wind tunnel, Abbott & von Doenhoff appendix IV, from memory) cannot show a
    // real maximum: its greatest cl must be called the last converged angle, ended by the
    // end of the sweep, in JSON and in words.
    let args = [
        "section", "naca2412", "--method", "viscous", "--re", "2e5", "--alpha", "-2:4:1",
        "--panels", "160",
    ];
    let mut json_args = args.to_vec();
    json_args.push("--json");
    let (code, stdout, stderr) = run(&json_args);
    assert_eq!(code, 0, "{stderr}");
    let v: Value = serde_json::from_str(&stdout).expect("valid JSON");
    approx::assert_relative_eq!(v["reynolds"].as_f64().unwrap(), 2e5);
    let p = &v["viscous"][0];
    let per_rad = p["cl_alpha_per_rad"].as_f64().unwrap();
    let per_deg = p["cl_alpha_per_deg"].as_f64().unwrap();
    approx::assert_relative_eq!(per_rad.to_radians(), per_deg, max_relative = 1e-12);
    let points = p["points"].as_array().unwrap();
    let least = points
        .iter()
        .filter(|q| q["status"] == "converged")
        .min_by(|a, b| {
            a["cd"]
                .as_f64()
                .unwrap()
                .total_cmp(&b["cd"].as_f64().unwrap())
        })
        .unwrap();
    approx::assert_relative_eq!(p["cd_min"].as_f64().unwrap(), least["cd"].as_f64().unwrap());
    approx::assert_relative_eq!(
        p["cl_at_cd_min"].as_f64().unwrap(),
        least["cl"].as_f64().unwrap()
    );
    assert_eq!(p["stall_found_by"], "end-of-sweep");
    assert_eq!(p["cl_max_kind"], "last-converged");
    let last = points.last().unwrap();
    approx::assert_relative_eq!(p["cl_max"].as_f64().unwrap(), last["cl"].as_f64().unwrap());
    let (code, stdout, stderr) = run(&args);
    assert_eq!(code, 0, "{stderr}");
    assert!(stdout.contains("Reynolds number"), "{stdout}");
    assert!(
        stdout.contains("Greatest cl (last converged angle, still rising)"),
        "{stdout}"
    );
    assert!(stdout.contains("end of the angles asked for"), "{stdout}");
    assert!(
        !stdout.contains("the computed curve turns over"),
        "{stdout}"
    );
}
