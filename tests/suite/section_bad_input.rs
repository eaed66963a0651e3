//! Bad airfoil input must give clear, typed errors (never a panic, never NaN): coordinate files
//! with too few points, NaN, a non-number, duplicate points, a crossing or unordered contour,
//! an empty file; bad NACA designations and Joukowski parameters.

use std::path::Path;
use trimline::input::coordinates::read_coordinates_file;
use trimline::section::circle_map::CircleMapError;
use trimline::section::geometry::{Contour, GeometryError};
use trimline::section::joukowski::JoukowskiAirfoil;
use trimline::section::naca::{NacaError, NacaProfile};

fn contour_error(file: &str) -> GeometryError {
    let (_, pts) = read_coordinates_file(Path::new(&format!("tests/data/{file}")))
        .expect("the file itself parses");
    Contour::new(&pts).expect_err("the contour must be refused")
}

#[test]
fn too_few_points() {
    assert_eq!(contour_error("too_few.dat"), GeometryError::TooFewPoints(5));
}

#[test]
fn duplicate_points_are_named() {
    // Points 41 and 42 (1-based) of the file are the same.
    let e = contour_error("duplicate.dat");
    assert_eq!(e, GeometryError::Duplicate(40));
    assert!(e.to_string().contains("points 41 and 42"), "{e}");
}

#[test]
fn self_crossing_contour() {
    let e = contour_error("self_crossing.dat");
    assert!(matches!(e, GeometryError::SelfCrossing(_, _)), "{e:?}");
    assert!(e.to_string().contains("crosses itself"), "{e}");
}

#[test]
fn unordered_contour() {
    // Both surfaces listed from the leading edge: the second surface runs the wrong way.
    let e = contour_error("unordered.dat");
    assert!(matches!(e, GeometryError::Unordered(_)), "{e:?}");
    assert!(e.to_string().contains("not in order"), "{e}");
}

#[test]
fn contour_starting_at_the_leading_edge() {
    assert_eq!(
        contour_error("starts_at_le.dat"),
        GeometryError::StartsAtLeadingEdge
    );
}

#[test]
fn nan_and_infinite_points_are_refused() {
    // In a file: the reader names line and column.
    let e = read_coordinates_file(Path::new("tests/data/nan.dat")).unwrap_err();
    assert_eq!((e.location.line, e.location.column), (32, 11));
    assert!(e.to_string().contains("not a finite number"), "{e}");
    // Given directly to the geometry.
    let mut pts = NacaProfile::parse("0012").unwrap().coordinates(20);
    pts[7][0] = f64::INFINITY;
    assert_eq!(Contour::new(&pts), Err(GeometryError::NotFinite(7)));
}

#[test]
fn a_non_number_is_named_with_its_place() {
    let e = read_coordinates_file(Path::new("tests/data/non_number.dat")).unwrap_err();
    assert_eq!(e.location.line, 14);
    let text = e.to_string();
    assert!(text.contains("non_number.dat:14:11"), "{text}");
    assert!(text.contains("'0.0l2' is not a number"), "{text}");
    assert!(text.contains("accepted"), "{text}");
}

#[test]
fn empty_and_title_only_files() {
    let e = read_coordinates_file(Path::new("tests/data/empty.dat")).unwrap_err();
    assert!(e.to_string().contains("empty"), "{e}");
    let e = read_coordinates_file(Path::new("tests/data/title_only.dat")).unwrap_err();
    assert!(e.to_string().contains("no coordinates"), "{e}");
    let e = read_coordinates_file(Path::new("tests/data/no_such_file.dat")).unwrap_err();
    assert!(e.to_string().contains("cannot be read"), "{e}");
}

#[test]
fn points_all_in_one_place() {
    let pts = vec![[0.5, 0.5]; 10];
    let e = Contour::new(&pts).unwrap_err();
    assert_eq!(e, GeometryError::Degenerate);
}

#[test]
fn bad_naca_designations() {
    assert!(matches!(
        NacaProfile::parse("naca24"),
        Err(NacaError::Length(_, 2))
    ));
    assert!(matches!(
        NacaProfile::parse("naca 24 12"),
        Err(NacaError::NotDigits(_, ' '))
    ));
    assert!(matches!(
        NacaProfile::parse("naca23112"),
        Err(NacaError::Reflexed(_))
    ));
}

#[test]
fn bad_joukowski_parameters() {
    assert!(matches!(
        JoukowskiAirfoil::from_shape(f64::NAN, 0.02),
        Err(CircleMapError::Shape { .. })
    ));
    assert!(matches!(
        JoukowskiAirfoil::from_shape(0.12, 0.3),
        Err(CircleMapError::Shape { .. })
    ));
    assert!(matches!(
        JoukowskiAirfoil::from_circle(-0.1, f64::INFINITY),
        Err(CircleMapError::Centre { .. })
    ));
}

/// Runs the built binary with `args`; returns (exit code, stdout, stderr).
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
fn command_reports_bad_input_without_panicking() {
    let cases: [(&[&str], &str); 8] = [
        (
            &["section", "tests/data/self_crossing.dat"],
            "crosses itself",
        ),
        (&["section", "tests/data/empty.dat"], "empty"),
        (&["section", "tests/data/nan.dat"], "not a finite number"),
        (&["section", "naca2400"], "zero thickness"),
        (&["section", "jouk:12"], "takes 2"),
        (&["section", "naca2412", "--alpha", "a,b"], "not a number"),
        (&["section", "naca2412", "--panels", "3"], "panels"),
        (&["section", "naca2412", "--method", "exact"], "exact"),
    ];
    for (args, expected) in cases {
        let (code, stdout, stderr) = run(args);
        assert_eq!(code, 1, "{args:?}: {stderr}");
        assert!(stdout.is_empty(), "{args:?}: {stdout}");
        assert!(stderr.contains(expected), "{args:?}: {stderr}");
        assert!(!stderr.contains("panicked"), "{args:?}: {stderr}");
    }
}
