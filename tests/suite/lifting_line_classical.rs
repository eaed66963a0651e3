//! Validation of the classical lifting line (Prandtl's equation, Glauert's Fourier solution)
//! against published closed forms and independently computed Glauert values.

use approx::assert_relative_eq;
use std::f64::consts::PI;
use trimline::lifting_line::{ClassicalStation, ClassicalWing};

const TERMS: usize = trimline::lifting_line::classical::DEFAULT_TERMS;

fn plate(chord_m: f64) -> ClassicalStation {
    ClassicalStation {
        chord_m,
        geometric_angle_rad: 0.0,
        cl_alpha_per_rad: 2.0 * PI,
        alpha_zero_lift_rad: 0.0,
    }
}

fn tapered(aspect_ratio: f64, taper: f64) -> ClassicalWing<'static> {
    let b = 2.0;
    let root = 2.0 * b / (aspect_ratio * (1.0 + taper));
    ClassicalWing::new(b, move |eta: f64| plate(root * (1.0 - (1.0 - taper) * eta)))
}

#[test]
fn elliptic_wing_lift_slope_and_efficiency() {
    // Source: Prandtl's elliptic-loading result, C_L = a0 (alpha - alpha_L0)/(1 + a0/(pi A)),
    // e = 1 (J. D. Anderson, Fundamentals of Aerodynamics, sec. 5.3.1); REFERENCES.md gives
    // 4.71239 / 5.02655 / 5.23599 per rad at A 6 / 8 / 10. The issue asks for 0.5 %; the
    // method is exact for this case, so 1e-5 (area quadrature) is used.
    for (aspect_ratio, expected) in [(6.0, 4.71239), (8.0, 5.02655), (10.0, 5.23599)] {
        let b = 3.0;
        let c0 = 4.0 * b / (PI * aspect_ratio);
        let wing = ClassicalWing::new(b, move |eta: f64| plate(c0 * (1.0 - eta * eta).sqrt()));
        let sol = wing.solve(TERMS).unwrap();
        assert_relative_eq!(sol.lift_slope_per_rad(), expected, max_relative = 1e-5);
        assert_relative_eq!(sol.span_efficiency(), 1.0, epsilon = 1e-6);
    }
}

#[test]
fn rectangular_aspect_ratio_6() {
    // Source: REFERENCES.md "rectangular, A 6" row: independent computation of Glauert's
    // Fourier method (H. Glauert, The Elements of Aerofoil and Airscrew Theory, ch. XI):
    // C_L alpha 4.5304 per rad (0.2 %), delta 0.0483, tau 0.1607, e 0.9539 (0.002 each).
    let sol = tapered(6.0, 1.0).solve(TERMS).unwrap();
    assert_relative_eq!(sol.lift_slope_per_rad(), 4.5304, max_relative = 2e-3);
    assert_relative_eq!(sol.delta(), 0.0483, epsilon = 2e-3);
    assert_relative_eq!(sol.tau(), 0.1607, epsilon = 2e-3);
    assert_relative_eq!(sol.span_efficiency(), 0.9539, epsilon = 2e-3);
}

#[test]
fn rectangular_aspect_ratio_6_spanwise_loading() {
    // Source: REFERENCES.md, same computation: cl/C_L at eta 0, 0.5, 0.75, 0.9, 0.95 is
    // 1.144, 1.082, 0.948, 0.728, 0.564, tolerance 0.005 as listed there.
    let sol = tapered(6.0, 1.0).solve(TERMS).unwrap();
    let alpha = 0.1;
    let cl = sol.cl(alpha);
    let chord = 2.0 / 6.0;
    for (eta, expected) in [
        (0.0, 1.144),
        (0.5, 1.082),
        (0.75, 0.948),
        (0.9, 0.728),
        (0.95, 0.564),
    ] {
        let local = 2.0 * sol.circulation_per_speed_m(alpha, eta) / chord;
        assert_relative_eq!(local / cl, expected, epsilon = 5e-3);
    }
}

#[test]
fn tapered_aspect_ratio_8_lift_slope() {
    // Source: REFERENCES.md "tapered, A 8, taper 0.5": C_L alpha 4.9639 per rad, independent
    // computation of Glauert's method; tolerance 0.2 % as listed.
    let sol = tapered(8.0, 0.5).solve(TERMS).unwrap();
    assert_relative_eq!(sol.lift_slope_per_rad(), 4.9639, max_relative = 2e-3);
}

#[test]
fn delta_against_taper_has_glauerts_minimum() {
    // Source: REFERENCES.md "tapered, A 6" row, independent computation of Glauert's method
    // whose shape is Glauert's well-known figure of delta against taper ratio (The Elements of
    // Aerofoil and Airscrew Theory, ch. XI): delta 0.0185 / 0.0099 / 0.0088 / 0.0169 / 0.0313
    // at taper 0.2 / 0.3 / 0.4 / 0.6 / 0.8, tolerance 0.002; minimum near taper 0.35.
    let cases = [
        (0.2, 0.0185),
        (0.3, 0.0099),
        (0.4, 0.0088),
        (0.6, 0.0169),
        (0.8, 0.0313),
    ];
    for (taper, expected) in cases {
        let delta = tapered(6.0, taper).solve(TERMS).unwrap().delta();
        assert_relative_eq!(delta, expected, epsilon = 2e-3);
    }
    // The minimum lies between taper 0.25 and 0.45 (Glauert's figure; scanned at 0.01).
    let (mut best_taper, mut best) = (0.0, f64::INFINITY);
    for k in 10..=90 {
        let taper = k as f64 / 100.0;
        let d = tapered(6.0, taper).solve(TERMS).unwrap().delta();
        if d < best {
            best = d;
            best_taper = taper;
        }
    }
    assert!(
        (0.25..=0.45).contains(&best_taper),
        "minimum delta at taper {best_taper}"
    );
}

#[test]
fn zero_lift_at_the_zero_lift_angle() {
    // Source: Prandtl's theory is linear in (alpha - alpha_L0): an untwisted wing with a
    // constant section zero-lift angle has no lift at that angle (Anderson, sec. 5.3.2).
    // Tolerance: round-off.
    let alpha0 = (-3.0_f64).to_radians();
    let wing = ClassicalWing::new(2.0, move |eta: f64| ClassicalStation {
        alpha_zero_lift_rad: alpha0,
        ..plate(0.3 * (1.0 - 0.5 * eta))
    });
    let sol = wing.solve(TERMS).unwrap();
    assert_relative_eq!(sol.zero_lift_alpha_rad(), alpha0, epsilon = 1e-12);
    assert_relative_eq!(sol.cl(alpha0), 0.0, epsilon = 1e-12);
}
