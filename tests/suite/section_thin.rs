//! Validation of thin-airfoil theory (Glauert) on the NACA mean lines and on mean lines taken
//! from coordinates.

use approx::assert_relative_eq;
use std::f64::consts::PI;
use trimline::model::{Airfoil, AirfoilShape, SectionMethod};
use trimline::section::naca::NacaProfile;
use trimline::section::thin_airfoil::{SlopeFn, ThinAirfoil};
use trimline::section::{section_model, SectionOptions};

fn thin(designation: &str) -> ThinAirfoil {
    ThinAirfoil::solve(&NacaProfile::parse(designation).unwrap())
}

#[test]
fn naca_2412_zero_lift_angle_and_moment() {
    // Anderson, Fundamentals of Aerodynamics, ch. 4, worked example for the NACA 2412:
    // alpha_L0 = -2.077 deg and cm_c/4 = -0.053 (memory); REFERENCES.md gives the converged
    // values -2.0772 deg and -0.05312 (independent computation of Glauert's integrals).
    // Tolerances 0.002 deg and 2e-4: the rounding of those values.
    let t = thin("2412");
    assert_relative_eq!(
        t.alpha_zero_lift_rad().to_degrees(),
        -2.0772,
        epsilon = 0.002
    );
    assert_relative_eq!(t.cm_quarter_chord(), -0.05312, epsilon = 2e-4);
}

#[test]
fn naca_2412_lift_and_centre_of_pressure_at_4_deg() {
    // REFERENCES.md (independent computation of thin-airfoil theory, Anderson ch. 4, cl and
    // centre-of-pressure formulas): cl 0.6664 and x_cp/c 0.3297 at 4 deg; tolerance 1e-3, the rounding.
    let t = thin("2412");
    let a = 4f64.to_radians();
    assert_relative_eq!(t.cl(a), 0.6664, epsilon = 1e-3);
    assert_relative_eq!(t.centre_of_pressure(a).unwrap(), 0.3297, epsilon = 1e-3);
}

#[test]
fn naca_4412_zero_lift_angle_and_moment() {
    // REFERENCES.md, independent computation of Glauert's integrals for the NACA 4412 mean
    // line (m 0.04, p 0.4): -4.1545 deg and -0.10624; tolerances 0.002 deg and 2e-4.
    let t = thin("4412");
    assert_relative_eq!(
        t.alpha_zero_lift_rad().to_degrees(),
        -4.1545,
        epsilon = 0.002
    );
    assert_relative_eq!(t.cm_quarter_chord(), -0.10624, epsilon = 2e-4);
}

#[test]
fn naca_23012_zero_lift_angle_moment_and_design_lift() {
    // REFERENCES.md, independent computation for the 230 mean line with Abbott & von
    // Doenhoff's constants (Theory of Wing Sections, ch. 6: r 0.2025, k1 15.957):
    // alpha_L0 -1.0936 deg (tol 0.002 deg), cm_c/4 -0.01284 (tol 1e-4). The design lift
    // coefficient, cl at the ideal angle (A0 = 0) = pi A1, must be the 0.3 that the first digit
    // 2 stands for (NACA Report 824, numbering system); tolerance 2e-3 for the rounded k1.
    let t = thin("23012");
    assert_relative_eq!(
        t.alpha_zero_lift_rad().to_degrees(),
        -1.0936,
        epsilon = 0.002
    );
    assert_relative_eq!(t.cm_quarter_chord(), -0.01284, epsilon = 1e-4);
    assert_relative_eq!(PI * t.a1, 0.300, epsilon = 2e-3);
}

#[test]
fn thickness_does_not_enter() {
    // Thin-airfoil theory uses only the mean line (Anderson ch. 4): NACA 2415 = NACA 2412
    // exactly (1e-15, rounding).
    let (a, b) = (thin("2412"), thin("2415"));
    assert_relative_eq!(
        a.alpha_zero_lift_rad(),
        b.alpha_zero_lift_rad(),
        epsilon = 1e-15
    );
    assert_relative_eq!(a.cm_quarter_chord(), b.cm_quarter_chord(), epsilon = 1e-15);
}

#[test]
fn symmetric_sections_give_exactly_zero() {
    // A straight mean line has zero slope everywhere, so A0 = alpha, A1 = A2 = 0 (Glauert);
    // the result must be exactly zero, not merely small.
    for d in ["0012", "0006", "0021"] {
        let t = thin(d);
        assert_relative_eq!(t.alpha_zero_lift_rad(), 0.0, epsilon = 0.0);
        assert_relative_eq!(t.cm_quarter_chord(), 0.0, epsilon = 0.0);
    }
}

#[test]
fn results_are_linear_in_maximum_camber() {
    // The Fourier coefficients are linear in the mean-line slope, which is linear in m
    // (Glauert; NACA Report 824 mean line): doubling and tripling m at the same p scales
    // alpha_L0 and cm_c/4 by 2 and 3 to rounding (1e-12 relative).
    let (t2, t4, t6) = (thin("2412"), thin("4412"), thin("6412"));
    assert_relative_eq!(
        t4.alpha_zero_lift_rad(),
        2.0 * t2.alpha_zero_lift_rad(),
        max_relative = 1e-12
    );
    assert_relative_eq!(
        t6.cm_quarter_chord(),
        3.0 * t2.cm_quarter_chord(),
        max_relative = 1e-12
    );
}

#[test]
fn parabolic_mean_line_closed_form() {
    // Circular-arc (parabolic) camber z = 4 h x (1 - x): alpha_L0 = -2 h, cm_c/4 = -pi h
    // (Anderson ch. 4; REFERENCES.md, formula): h = 0.02 gives -2.2918 deg and -0.062832;
    // tolerance 1e-5 as listed there (the quadrature is far better).
    let h = 0.02;
    let t = ThinAirfoil::solve(&SlopeFn {
        slope: move |x| 4.0 * h * (1.0 - 2.0 * x),
        joints: vec![],
    });
    assert_relative_eq!(
        t.alpha_zero_lift_rad().to_degrees(),
        -2.2918,
        epsilon = 1e-4
    );
    assert_relative_eq!(t.cm_quarter_chord(), -0.062832, epsilon = 1e-5);
}

#[test]
fn mean_line_from_a_coordinates_file() {
    // The NACA 2412 coordinates of tests/data/naca2412.dat (written from the NACA Report 824
    // formulas by an independent script, 81 stations per surface): the mean line taken from the
    // surfaces must give Anderson's -2.077 deg within 0.1 deg and -0.053 within 1.5e-3. A file
    // marks no leading edge, so its chord runs from the point farthest from the trailing edge;
    // on this section that point lies about 0.0016 c above the mean line's origin (nose radius
    // 1.1019 t^2 centred along the mean-line slope 2m/p = 0.1 at the nose, Abbott & von
    // Doenhoff ch. 6), which turns the chord line by up to 0.09 deg; the rest of the
    // tolerance covers the linear interpolation of the 81-point surfaces.
    let text = std::fs::read_to_string("tests/data/naca2412.dat").unwrap();
    let (title, points) = trimline::input::coordinates::parse_coordinates(&text, "naca2412.dat")
        .expect("test file parses");
    let airfoil = Airfoil {
        name: "file".into(),
        shape: AirfoilShape::Coordinates {
            title: title.unwrap(),
            points,
        },
        cl_max: Some(1.2),
        method: Some(SectionMethod::Thin),
        reynolds: None,
        transition_n: None,
    };
    let m = section_model(&airfoil, &SectionOptions::default())
        .unwrap()
        .model;
    assert_eq!(m.method, SectionMethod::Thin);
    assert_relative_eq!(m.alpha_zero_lift_rad.to_degrees(), -2.077, epsilon = 0.1);
    assert_relative_eq!(m.cm_ac, -0.053, epsilon = 1.5e-3);
    assert_relative_eq!(m.cl_alpha_per_rad, 2.0 * PI, epsilon = 1e-12);
}

#[test]
fn measured_naca_2412_is_near_the_theory() {
    // Sanity only: Abbott & von Doenhoff's measured NACA 2412 data (as restated in
    // REFERENCES.md) give a zero-lift angle about -2.2 deg; thin-airfoil theory should be
    // within 0.3 deg of it.
    let t = thin("2412");
    assert_relative_eq!(t.alpha_zero_lift_rad().to_degrees(), -2.2, epsilon = 0.3);
}
