//! Drag build-up and glide polar against published formulas and values.

use approx::assert_relative_eq;
use trimline::performance::drag::{cf_laminar, cf_turbulent, form_factor_surface};
use trimline::performance::polar::{oswald_straight_wing, PolarInput};

// Raymer, Aircraft Design, eq. 12.25-12.27: at Re 2e5, laminar Cf 0.00297, turbulent 0.00615
// (REFERENCES.md, formula). Tolerance 1e-5 (printed precision).
#[test]
fn flat_plate_friction() {
    assert_relative_eq!(cf_laminar(2e5), 0.00297, epsilon = 1e-5);
    assert_relative_eq!(cf_turbulent(2e5), 0.00615, epsilon = 1e-5);
}

// Raymer eq. 12.30 without the Mach term: 1.2607 at t/c 0.12, (x/c)_m 0.3 (REFERENCES.md).
#[test]
fn surface_form_factor() {
    assert_relative_eq!(form_factor_surface(0.12, 0.3), 1.2607, epsilon = 1e-4);
}

fn reference_case(cl_max: f64) -> PolarInput {
    // A 8, e 0.9, CD0 0.02, 1 kg, S 0.5 m^2, sea level (REFERENCES.md, parabolic polar laws;
    // Anderson, Introduction to Flight, ch. 6).
    PolarInput {
        cd0: 0.02,
        aspect_ratio: 8.0,
        span_efficiency: 0.9,
        mass_kg: 1.0,
        area_m2: 0.5,
        density_kg_m3: 1.225,
        cl_max,
    }
}

// (L/D)max = 1/2 sqrt(pi A e / CD0) = 16.815 at 6.900 m/s. Tolerance 1e-3 (printed precision).
#[test]
fn best_glide_matches_closed_form() {
    let p = reference_case(2.0).performance();
    assert_relative_eq!(p.best_glide.glide_ratio, 16.815, epsilon = 1e-3);
    assert_relative_eq!(p.best_glide.speed_m_s, 6.900, epsilon = 1e-3);
    assert!(!p.best_glide.limited_by_cl_max);
}

// Minimum sink at CL = sqrt(3 pi A e CD0) = 1.165 (REFERENCES.md); with a typical CL_max of 1.0
// the clamp must show.
#[test]
fn min_sink_cl_and_clamp() {
    let free = reference_case(2.0).performance();
    assert_relative_eq!(free.min_sink.cl, 1.165, epsilon = 1e-3);
    let clamped = reference_case(1.0).performance();
    assert!(clamped.min_sink.limited_by_cl_max);
    assert_relative_eq!(clamped.min_sink.cl, 1.0, epsilon = 1e-12);
}

// Raymer eq. 12.48: e = 1.78 (1 - 0.045 A^0.68) - 0.64; at A = 8: 1.78 * (1 - 0.045 * 4.1109) - 0.64
// = 0.8107 (hand arithmetic on the published formula).
#[test]
fn oswald_estimate() {
    assert_relative_eq!(oswald_straight_wing(8.0), 0.8107, epsilon = 1e-3);
}
