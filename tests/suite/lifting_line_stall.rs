//! Validation of the nonlinear (stall) solve of the multi-surface lifting line: Newton's
//! method on the flat-top section model (Phillips and Snyder, Journal of Aircraft 37(4), 2000,
//! nonlinear section relation solved by Newton's method).

use crate::common::{section, tapered_wing};
use approx::assert_relative_eq;
use std::f64::consts::PI;
use trimline::lifting_line::{
    LiftingLineError, LiftingLineOptions, MultiSurfaceSystem, Reference, SolveStatus, SurfaceInput,
};
use trimline::model::Surface;
use trimline::section::SectionModel;

fn build(
    wing: &Surface,
    sections: &[SectionModel],
    options: LiftingLineOptions,
) -> MultiSurfaceSystem {
    let input = [SurfaceInput {
        surface: wing,
        sections,
        elevator: None,
    }];
    MultiSurfaceSystem::new(&input, Reference::of_surface(wing), options).unwrap()
}

#[test]
fn stalled_stations_sit_on_the_flat_top_and_the_rest_on_the_lift_curve() {
    // Source: the model's own definition (flat-top section: cl = min(a (alpha - alpha_L0),
    // cl_max)); the converged solution must satisfy it at every station. Tolerance 1e-8:
    // Newton's residual tolerance scaled to cl.
    let sections = [section(2.0 * PI, 0.0, 1.0)];
    let wing = tapered_wing(6.0, 1.0, 1.5);
    let sys = build(&wing, &sections, LiftingLineOptions::default());
    let r = sys.solve(&sys.condition(14f64.to_radians())).unwrap();
    assert!(
        matches!(r.status, SolveStatus::Converged { .. }),
        "{:?}",
        r.status
    );
    let mut stalled = 0;
    for st in &r.stations {
        let linear = 2.0 * PI * st.alpha_rad;
        if linear >= 1.0 {
            stalled += 1;
            assert_relative_eq!(st.cl, 1.0, epsilon = 1e-8);
        } else {
            assert_relative_eq!(st.cl, linear, epsilon = 1e-8);
        }
    }
    assert!(stalled > 0);
    // The stall limit costs lift compared with the unlimited linear model.
    let linear_cl = sys
        .linear_coefficients(&sys.condition(14f64.to_radians()), 0.0, 0.0)
        .unwrap()
        .cl;
    assert!(r.cl < linear_cl);
}

#[test]
fn solution_is_continuous_through_first_stall() {
    // Source: continuity of the flat-top model (the stalled branch starts at cl = cl_max);
    // tolerance: a step of 1e-4 rad in alpha changes C_L by about 5e-4.
    let sections = [section(2.0 * PI, 0.0, 1.1)];
    let wing = tapered_wing(8.0, 0.5, 2.0);
    let sys = build(&wing, &sections, LiftingLineOptions::default());
    let (alpha_stall, _) = sys
        .first_stall_alpha_rad(&sys.condition(0.0))
        .unwrap()
        .unwrap();
    let below = sys.solve(&sys.condition(alpha_stall - 1e-4)).unwrap();
    let above = sys.solve(&sys.condition(alpha_stall + 1e-4)).unwrap();
    assert_eq!(below.status, SolveStatus::Linear);
    assert!(matches!(above.status, SolveStatus::Converged { .. }));
    assert_relative_eq!(below.cl, above.cl, epsilon = 1e-3);
    assert_relative_eq!(below.stall.cl_ratio, 1.0, epsilon = 1e-3);
}

#[test]
fn rectangular_wing_stalls_at_the_root_tapered_wing_outboard() {
    // Source: the classical stall patterns of untwisted planforms with one airfoil: the
    // rectangular wing's section cl peaks at the root, a strongly tapered wing's well outboard
    // (e.g. D. P. Raymer, Aircraft Design, ch. 4, tip stall of tapered wings; from memory).
    // Limits (inboard 20 %, outboard 40 % of the semispan) are a judgement.
    let sections = [section(2.0 * PI, 0.0, 1.2)];
    let rect = tapered_wing(6.0, 1.0, 1.5);
    let sys = build(&rect, &sections, LiftingLineOptions::default());
    let r = sys.solve(&sys.condition(0.1)).unwrap();
    assert!(r.stall.percent_semispan < 20.0, "{:?}", r.stall);
    let pointed = tapered_wing(8.0, 0.3, 2.0);
    let sys = build(&pointed, &sections, LiftingLineOptions::default());
    let r = sys.solve(&sys.condition(0.1)).unwrap();
    assert!(r.stall.percent_semispan > 40.0, "{:?}", r.stall);
}

#[test]
fn non_convergence_is_an_error_not_numbers() {
    // Source: STYLE.md (solvers report status, never numbers on failure). With no Newton
    // iteration allowed, a stalled state must be reported as NotConverged.
    let sections = [section(2.0 * PI, 0.0, 1.0)];
    let wing = tapered_wing(6.0, 1.0, 1.5);
    let options = LiftingLineOptions {
        max_newton_iterations: 0,
        ..LiftingLineOptions::default()
    };
    let sys = build(&wing, &sections, options);
    let err = sys.solve(&sys.condition(0.3)).unwrap_err();
    assert!(
        matches!(err, LiftingLineError::NotConverged { .. }),
        "{err}"
    );
    // Non-finite input is rejected, never propagated.
    let err = sys.solve(&sys.condition(f64::NAN)).unwrap_err();
    assert!(
        matches!(err, LiftingLineError::InvalidInput { .. }),
        "{err}"
    );
}
