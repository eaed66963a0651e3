//! Validation of the numerical multi-surface lifting line (Phillips and Snyder, Journal of
//! Aircraft 37(4), 2000) against closed forms and against the classical Glauert solution.

mod common;

use approx::assert_relative_eq;
use common::{elliptic_wing, flat_plate, panel, section, surface, tapered_wing};
use std::f64::consts::PI;
use trimline::lifting_line::{
    classical::DEFAULT_TERMS, ClassicalWing, LiftingLineOptions, MultiSurfaceSystem, Reference,
    SurfaceInput,
};
use trimline::model::Surface;
use trimline::section::SectionModel;

fn options(per_half: usize) -> LiftingLineOptions {
    LiftingLineOptions {
        stations_per_half_span: per_half,
        ..LiftingLineOptions::default()
    }
}

fn wing_only(wing: &Surface, sections: &[SectionModel], per_half: usize) -> MultiSurfaceSystem {
    let input = [SurfaceInput {
        surface: wing,
        sections,
        elevator: None,
    }];
    MultiSurfaceSystem::new(&input, Reference::of_surface(wing), options(per_half)).unwrap()
}

fn lift_slope(system: &MultiSurfaceSystem) -> f64 {
    system
        .solve(&system.condition(0.05))
        .unwrap()
        .lift_slope_per_rad
}

#[test]
fn elliptic_wing_lift_slope_and_efficiency() {
    // Source: Prandtl's elliptic wing, C_L alpha = a0/(1 + a0/(pi A)) and e = 1 (J. D.
    // Anderson, Fundamentals of Aerodynamics, sec. 5.3.1). Tolerance 0.5 % as the issue asks:
    // the discrete horseshoes approximate the continuous sheet.
    let sections = [flat_plate()];
    for aspect_ratio in [6.0, 8.0, 10.0] {
        let wing = elliptic_wing(aspect_ratio, 2.0);
        let system = wing_only(&wing, &sections, 40);
        let r = system.solve(&system.condition(0.08)).unwrap();
        let a0 = 2.0 * PI;
        assert_relative_eq!(
            r.lift_slope_per_rad,
            a0 / (1.0 + a0 / (PI * aspect_ratio)),
            max_relative = 5e-3
        );
        assert_relative_eq!(r.span_efficiency.unwrap(), 1.0, max_relative = 5e-3);
    }
}

#[test]
fn numerical_agrees_with_classical_on_straight_wings() {
    // Source: the classical Glauert solution of the same wing (this crate's classical module,
    // itself checked against published values in lifting_line_classical.rs); both solve
    // Prandtl's model, so the issue asks for agreement within 1 % for A 4 to 20.
    let sections = [flat_plate()];
    for aspect_ratio in [4.0, 6.0, 10.0, 20.0] {
        for taper in [1.0, 0.5, 0.3] {
            let wing = tapered_wing(aspect_ratio, taper, 2.0);
            let numerical = wing_only(&wing, &sections, 40);
            let classical = ClassicalWing::from_surface(&wing, &sections)
                .unwrap()
                .solve(DEFAULT_TERMS)
                .unwrap();
            let r = numerical.solve(&numerical.condition(0.05)).unwrap();
            assert_relative_eq!(
                r.lift_slope_per_rad,
                classical.lift_slope_per_rad(),
                max_relative = 1e-2
            );
            // e within 1 % as well (both are Prandtl's model).
            assert_relative_eq!(
                r.span_efficiency.unwrap(),
                classical.span_efficiency(),
                max_relative = 1e-2
            );
        }
    }
}

#[test]
fn lift_slope_converges_when_stations_double() {
    // Source: common practice for discretised methods; the issue asks for less than 0.2 %
    // change when the stations double.
    let sections = [flat_plate()];
    for wing in [tapered_wing(8.0, 0.5, 2.0), tapered_wing(6.0, 1.0, 1.5)] {
        let coarse = lift_slope(&wing_only(&wing, &sections, 40));
        let fine = lift_slope(&wing_only(&wing, &sections, 80));
        assert_relative_eq!(coarse, fine, max_relative = 2e-3);
    }
}
