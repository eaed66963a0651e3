//! Validation of swept wings in the multi-surface lifting line (the Phillips-Snyder model, kept
//! as a selectable reference) against the classical sweep correction (Helmbold-Diederich, DATCOM form).

use crate::common::{flat_plate, panel, surface};
use approx::assert_relative_eq;
use std::f64::consts::PI;
use trimline::lifting_line::{MultiSurfaceSystem, Reference, SurfaceInput};

/// Lift slope of a constant-chord wing of aspect ratio 8 swept `sweep_deg` (leading edge,
/// quarter chord and half chord alike), default discretisation.
fn swept_lift_slope(sweep_deg: f64) -> f64 {
    let sections = [flat_plate()];
    let span = 2.0;
    let chord = span / 8.0;
    let wing = surface("wing", 0.0, 0.0, vec![panel(1.0, chord, chord, sweep_deg)]);
    let input = [SurfaceInput {
        surface: &wing,
        sections: &sections,
        elevator: None,
    }];
    let sys = MultiSurfaceSystem::new(
        &input,
        Reference::of_surface(&wing),
        crate::common::lifting_line_options(),
    )
    .unwrap();
    sys.solve(&sys.condition(0.05)).unwrap().lift_slope_per_rad
}

/// Helmbold-Diederich (DATCOM) lift slope with a0 = 2 pi, incompressible:
/// C_L alpha = 2 pi A / (2 + sqrt(A^2 (1 + tan^2 sweep_c/2) + 4)).
fn helmbold_diederich(aspect_ratio: f64, half_chord_sweep_rad: f64) -> f64 {
    let t = half_chord_sweep_rad.tan();
    2.0 * PI * aspect_ratio / (2.0 + (aspect_ratio * aspect_ratio * (1.0 + t * t) + 4.0).sqrt())
}

#[test]
fn formula_matches_the_tabulated_check_values() {
    // Source: REFERENCES.md, "swept, Helmbold-Diederich (DATCOM form), A 8": 4.3894 / 3.7264
    // per rad at 30 / 45 deg half-chord sweep (formula; tolerance is the table's rounding).
    assert_relative_eq!(
        helmbold_diederich(8.0, 30f64.to_radians()),
        4.3894,
        epsilon = 1e-4
    );
    assert_relative_eq!(
        helmbold_diederich(8.0, 45f64.to_radians()),
        3.7264,
        epsilon = 1e-4
    );
}

#[test]
fn lift_slope_falls_with_sweep() {
    // Source: the classical sweep effect (Helmbold-Diederich, DATCOM; REFERENCES.md): the lift
    // slope falls monotonically with sweep. Checked at 0, 15, 30, 45 deg.
    let slopes: Vec<f64> = [0.0, 15.0, 30.0, 45.0]
        .iter()
        .map(|s| swept_lift_slope(*s))
        .collect();
    for w in slopes.windows(2) {
        assert!(w[1] < w[0], "{slopes:?}");
    }
}

#[test]
fn lift_slope_near_helmbold_diederich_up_to_30_degrees() {
    // Source: Helmbold-Diederich formula in the DATCOM form, A 8, sweep 0 / 15 / 30 deg
    // (REFERENCES.md gives 4.3894 at 30 deg). Tolerance 6 %: REFERENCES.md expects lifting line
    // within about 5-8 % (a judgement); the lifting line's root kink makes the swept result
    // depend on the station count (module documentation of multi_surface). At 45 deg the
    // default discretisation is about 16 % above the formula, so it is not checked here.
    for sweep_deg in [0.0, 15.0, 30.0] {
        let expected = helmbold_diederich(8.0, f64::to_radians(sweep_deg));
        assert_relative_eq!(swept_lift_slope(sweep_deg), expected, max_relative = 6e-2);
    }
}
