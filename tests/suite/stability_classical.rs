//! The closed-form first estimate: Helmbold's lift slope against its formula, and the exact
//! internal laws of the linear wing-plus-tail model.

use approx::assert_relative_eq;
use std::f64::consts::PI;
use trimline::model::SectionMethod;
use trimline::model::{AirfoilId, Panel, Surface, SurfaceShape};
use trimline::section::{ClMaxSource, SectionModel};
use trimline::stability::classical::{
    equivalent_surface, estimate, helmbold_lift_slope, EquivalentSurface, EstimateInput,
    StabiliserPlace,
};

// Source: H. G. Helmbold (1942) lift-slope equation, values for a0 = 2 pi per rad from
// REFERENCES.md ("formula"): A 1 / 2 / 4 / 6 -> 1.4833 / 2.6026 / 3.8832 / 4.5287 per rad.
// Tolerance 1e-4 (the values' printed precision).
#[test]
fn helmbold_published_values() {
    for (a, expected) in [(1.0, 1.4833), (2.0, 2.6026), (4.0, 3.8832), (6.0, 4.5287)] {
        assert_relative_eq!(helmbold_lift_slope(2.0 * PI, a), expected, epsilon = 1e-4);
    }
}

fn section(alpha0_deg: f64, cm_ac: f64) -> SectionModel {
    SectionModel {
        method: SectionMethod::Thin,
        alpha_zero_lift_rad: alpha0_deg.to_radians(),
        cl_alpha_per_rad: 2.0 * PI,
        cm_ac,
        x_ac_c: 0.25,
        cl_max: 1.2,
        cl_min: -0.8,
        cl_max_source: ClMaxSource::Given,
        reynolds_number: None,
        polar: None,
    }
}

fn rect(x_le: f64, half_span: f64, chord: f64, incidence_deg: f64, airfoil: usize) -> Surface {
    Surface {
        name: "s".into(),
        root_le_x_m: x_le,
        root_le_z_m: 0.0,
        incidence_rad: incidence_deg.to_radians(),
        shape: SurfaceShape::Panels(vec![Panel {
            span_m: half_span,
            root_chord_m: chord,
            tip_chord_m: chord,
            sweep_le_rad: 0.0,
            dihedral_rad: 0.0,
            tip_twist_rad: 0.0,
            root_airfoil: AirfoilId(airfoil),
            tip_airfoil: AirfoilId(airfoil),
        }]),
    }
}

fn surfaces() -> (EquivalentSurface, EquivalentSurface) {
    let sections = [section(-2.0, -0.05), section(0.0, 0.0)];
    let wing = equivalent_surface(&rect(0.0, 1.0, 0.2, 2.0, 0), &sections);
    let tail = equivalent_surface(&rect(0.8, 0.25, 0.1, 0.0, 1), &sections);
    (wing, tail)
}

fn run(
    cg_x_m: f64,
    mass_kg: f64,
    fuselage: f64,
) -> trimline::stability::classical::ClassicalEstimate {
    let (wing, tail) = surfaces();
    estimate(&EstimateInput {
        wing: &wing,
        stabiliser: Some((&tail, StabiliserPlace::Tail)),
        mass_kg,
        cg_x_m,
        density_kg_m3: 1.225,
        fuselage_cm_alpha_per_rad: fuselage,
        stabiliser_dynamic_pressure_ratio: 1.0,
        downwash_factor: 1.0,
    })
}

// Exact law (definition of the neutral point, Etkin & Reid, Dynamics of Flight, sec. 2.3):
// with the CG at the neutral point, dCm/dalpha about the CG is zero. Holds with a fuselage
// term too. Tolerance 1e-12 (round-off only).
#[test]
fn cg_at_neutral_point_gives_zero_pitch_stiffness() {
    for fus in [0.0, 0.15] {
        let np = run(0.05, 1.0, fus).neutral_point_x_m;
        let at_np = run(np, 1.0, fus);
        assert!(
            at_np.cm_alpha_per_rad.abs() < 1e-12,
            "{}",
            at_np.cm_alpha_per_rad
        );
        assert!(at_np.static_margin.abs() < 1e-12);
    }
}

// Exact law: moving the CG by dx changes the static margin by -dx / MAC (definition of static
// margin, Etkin & Reid sec. 2.3). Tolerance 1e-12.
#[test]
fn static_margin_moves_by_dx_over_mac() {
    let (wing, _) = surfaces();
    let a = run(0.05, 1.0, 0.0);
    let b = run(0.05 + 0.01, 1.0, 0.0);
    assert_relative_eq!(
        a.static_margin - b.static_margin,
        0.01 / wing.geometry.mac_m,
        epsilon = 1e-12
    );
    assert_relative_eq!(a.neutral_point_x_m, b.neutral_point_x_m, epsilon = 1e-15);
}

// Exact law: at a fixed trim CL the trim speed scales with the square root of mass
// (lift equation W = 1/2 rho V^2 S CL; Anderson, Introduction to Flight, ch. 5).
#[test]
fn trim_speed_scales_with_root_mass() {
    let a = run(0.04, 1.0, 0.0).trim.expect("trims");
    let b = run(0.04, 2.0, 0.0).trim.expect("trims");
    assert_relative_eq!(a.cl, b.cl, epsilon = 1e-12);
    assert_relative_eq!(b.speed_m_s / a.speed_m_s, 2f64.sqrt(), epsilon = 1e-12);
}

// The lift-weighted neutral point equals the textbook form h_n = h_w + V_H' (a_t/a)(1 - de/da)
// with a the whole-aircraft lift slope and V_H' = S_t l_t / (S c) taken from the wing's
// aerodynamic centre (Etkin & Reid, sec. 2.4; McCormick ch. 9): an algebraic identity,
// checked to round-off.
#[test]
fn lift_weighted_form_equals_tail_volume_form() {
    let (wing, tail) = surfaces();
    let e = run(0.05, 1.0, 0.0);
    let a_w = wing.lift_slope_per_rad;
    let a_t = tail.lift_slope_per_rad;
    let ratio = tail.geometry.area_m2 / wing.geometry.area_m2;
    let a_total = a_w + ratio * a_t * (1.0 - e.downwash_gradient);
    let v_h = ratio * (tail.x_ac_m - wing.x_ac_m) / wing.geometry.mac_m;
    let h_n = (wing.x_ac_m - wing.geometry.mac_le_x_m) / wing.geometry.mac_m
        + v_h * a_t / a_total * (1.0 - e.downwash_gradient);
    assert_relative_eq!(
        (e.neutral_point_x_m - wing.geometry.mac_le_x_m) / wing.geometry.mac_m,
        h_n,
        epsilon = 1e-12
    );
    assert_relative_eq!(e.aircraft_lift_slope_per_rad, a_total, epsilon = 1e-12);
}

// Simple downwash gradient d eps/d alpha = 2 CL_alpha / (pi A) (McCormick ch. 9; REFERENCES.md).
#[test]
fn downwash_gradient_formula() {
    let (wing, _) = surfaces();
    let e = run(0.05, 1.0, 0.0);
    assert_relative_eq!(
        e.downwash_gradient,
        2.0 * wing.lift_slope_per_rad / (PI * wing.geometry.aspect_ratio),
        epsilon = 1e-12
    );
}

// The fuselage moves the neutral point forward by MAC * dCm_f / CL_alpha (follows from adding
// dCm_f to Cm_alpha = CL_alpha (h - h_n)); Gilruth & White, NACA Report 711.
#[test]
fn fuselage_moves_neutral_point_forward() {
    let (wing, _) = surfaces();
    let clean = run(0.05, 1.0, 0.0);
    let with = run(0.05, 1.0, 0.2);
    assert_relative_eq!(
        clean.neutral_point_x_m - with.neutral_point_x_m,
        wing.geometry.mac_m * 0.2 / clean.aircraft_lift_slope_per_rad,
        epsilon = 1e-12
    );
}
