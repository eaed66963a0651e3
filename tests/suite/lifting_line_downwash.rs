//! Validation of the downwash the multi-surface lifting line gives behind a wing and at a
//! tail (Phillips and Snyder's horseshoe system, trailing legs along the free stream).

use crate::common::{elliptic_wing, flat_plate, panel, surface, tapered_wing};
use approx::assert_relative_eq;
use std::f64::consts::PI;
use trimline::lifting_line::{MultiSurfaceSystem, Reference, SurfaceInput};
use trimline::model::Surface;
use trimline::section::SectionModel;

fn system(surfaces: &[&Surface], sections: &[SectionModel]) -> MultiSurfaceSystem {
    let inputs: Vec<SurfaceInput<'_>> = surfaces
        .iter()
        .map(|s| SurfaceInput {
            surface: s,
            sections,
            elevator: None,
        })
        .collect();
    MultiSurfaceSystem::new(
        &inputs,
        Reference::of_surface(surfaces[0]),
        crate::common::lifting_line_options(),
    )
    .unwrap()
}

#[test]
fn far_wake_downwash_of_an_elliptic_wing() {
    // Source: classical far-field result of lifting-line theory: far behind an elliptic wing
    // the downwash in the wake is uniform and twice the induced angle at the wing,
    // 2 C_L / (pi A) (the semi-infinite trailing vortices become infinite; Prandtl; e.g.
    // B. W. McCormick, Aerodynamics, Aeronautics and Flight Mechanics, ch. 4, downwash at the
    // tail, from memory). Evaluated 100 spans behind, in the wake plane, midway between
    // trailing lines (at the wing's control-point y), inboard of 70 % semispan where the
    // cosine-spaced lines are evenly enough spaced for the midpoint to be symmetric.
    // Tolerance 1 %: discretisation (0.4 % at the root, 0.8 % at 70 % semispan).
    let sections = [flat_plate()];
    let aspect_ratio = 10.0;
    let wing = elliptic_wing(aspect_ratio, 2.0);
    let sys = system(&[&wing], &sections);
    let r = sys.solve(&sys.condition(0.1)).unwrap();
    let expected = 2.0 * r.cl / (PI * aspect_ratio);
    for st in r.stations.iter().filter(|s| s.y_m.abs() < 0.7) {
        let eps = sys.downwash_at_rad(&r, [200.0, st.y_m, 0.0]).unwrap();
        assert_relative_eq!(eps, expected, max_relative = 1e-2);
    }
}

#[test]
fn tail_far_behind_sees_twice_the_induced_angle() {
    // Source: as above (2 C_L/(pi A) and its gradient 2 C_L alpha/(pi A) far behind an
    // elliptic wing in its wake plane). The tail is small (its lift changes the wing by a
    // negligible amount) and averages the wing's downwash over its own stations. Tolerance
    // 3 %: the wake core's first-order smoothing bias inside the sheet (module documentation
    // of multi_surface) plus discretisation.
    let sections = [flat_plate()];
    let aspect_ratio = 10.0;
    let wing = elliptic_wing(aspect_ratio, 2.0);
    let tail = surface("tail", 200.0, 0.0, vec![panel(0.3, 0.01, 0.01, 0.0)]);
    let sys = system(&[&wing, &tail], &sections);
    let r = sys.solve(&sys.condition(0.1)).unwrap();
    let wing_result = &r.surfaces[0];
    let expected = 2.0 * wing_result.cl / (PI * aspect_ratio);
    assert_relative_eq!(r.surfaces[1].downwash_rad, expected, max_relative = 3e-2);
    let expected_gradient = 2.0 * wing_result.lift_slope_per_rad / (PI * aspect_ratio);
    assert_relative_eq!(
        r.surfaces[1].downwash_gradient,
        expected_gradient,
        max_relative = 3e-2
    );
}

#[test]
fn downwash_gradient_falls_as_the_tail_rises() {
    // Source: the requirement and the trend of the DATCOM downwash method (K_H =
    // (1 - h_H/b)/(2 l_H/b)^(1/3) falls with tail height h_H; REFERENCES.md, Stability): a tail
    // above the wake plane sees less downwash change. Strict monotonic decrease is checked.
    let sections = [flat_plate()];
    let wing = tapered_wing(8.0, 0.5, 2.0);
    let mac = trimline::planform::geometry(&wing).mac_m;
    let mut previous = f64::INFINITY;
    for height_over_span in [0.0, 0.05, 0.1, 0.2, 0.4] {
        let tail = surface(
            "tail",
            3.5 * mac,
            2.0 * height_over_span,
            vec![panel(0.35, 0.12, 0.08, 10.0)],
        );
        let sys = system(&[&wing, &tail], &sections);
        let r = sys.solve(&sys.condition(0.05)).unwrap();
        let gradient = r.surfaces[1].downwash_gradient;
        assert!(
            gradient > 0.0 && gradient < previous,
            "{height_over_span}: {gradient}"
        );
        previous = gradient;
    }
}

#[test]
fn downwash_gradient_near_the_datcom_estimate() {
    // Source: USAF DATCOM downwash gradient, d eps/d alpha = 4.44 (K_A K_lambda K_H
    // sqrt(cos sweep_c/4))^1.19, K_A = 1/A - 1/(1 + A^1.7), K_lambda = (10 - 3 lambda)/7,
    // K_H = (1 - h_H/b)/(2 l_H/b)^(1/3) (as restated in REFERENCES.md, Stability). It is an
    // empirical fit to wind-tunnel data that includes wake roll-up and deflection, which the
    // flat-wake lifting line does not model; tolerance 15 % is a judgement. Tail 0.1 span above
    // the wing plane at l_H = 3.5 MAC behind the wing's quarter chord.
    let sections = [flat_plate()];
    let (aspect_ratio, taper, span) = (8.0_f64, 0.5_f64, 2.0_f64);
    let wing = tapered_wing(aspect_ratio, taper, span);
    let g = trimline::planform::geometry(&wing);
    let (l_h, h_h) = (3.5 * g.mac_m, 0.1 * span);
    // Tail quarter chord at the wing quarter chord + l_H (tail MAC about 0.1 m).
    let tail_le = g.mac_quarter_x_m() + l_h - 0.25 * 0.1;
    let tail = surface("tail", tail_le, h_h, vec![panel(0.35, 0.12, 0.08, 0.0)]);
    let sys = system(&[&wing, &tail], &sections);
    let r = sys.solve(&sys.condition(0.05)).unwrap();
    let k_a = 1.0 / aspect_ratio - 1.0 / (1.0 + aspect_ratio.powf(1.7));
    let k_lambda = (10.0 - 3.0 * taper) / 7.0;
    let k_h = (1.0 - h_h / span) / (2.0 * l_h / span).powf(1.0 / 3.0);
    let datcom = 4.44 * (k_a * k_lambda * k_h).powf(1.19);
    assert_relative_eq!(r.surfaces[1].downwash_gradient, datcom, max_relative = 0.15);
}

#[test]
fn canard_ahead_of_the_wing_sees_upwash() {
    // Source: Biot-Savart law for the wing's bound vortex: ahead of a lifting wing the flow is
    // turned up (upwash), growing with the wing's lift (e.g. Nelson, Flight Stability and
    // Automatic Control, canard configurations; from memory). Sign check: the canard's
    // downwash angle and its gradient are negative.
    let sections = [flat_plate()];
    let wing = tapered_wing(8.0, 0.5, 2.0);
    let mac = trimline::planform::geometry(&wing).mac_m;
    let canard = surface("canard", -3.0 * mac, 0.02, vec![panel(0.3, 0.1, 0.07, 0.0)]);
    let sys = system(&[&wing, &canard], &sections);
    let r = sys.solve(&sys.condition(0.05)).unwrap();
    assert!(
        r.surfaces[1].downwash_rad < 0.0,
        "{}",
        r.surfaces[1].downwash_rad
    );
    assert!(r.surfaces[1].downwash_gradient < 0.0);
}
