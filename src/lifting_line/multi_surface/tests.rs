//! Checks of the strip system: typed input errors, independence of scale, Newton's buffers; the shapes other modules' tests share (plate section, trapezoid, wing and tail).

use super::*;
use crate::model::{AirfoilId, Panel, SectionMethod};
use crate::section::ClMaxSource;
use approx::assert_relative_eq;

pub(crate) fn plate(cl_max: f64) -> SectionModel {
    SectionModel {
        method: SectionMethod::Thin,
        alpha_zero_lift_rad: -0.03,
        cl_alpha_per_rad: 2.0 * std::f64::consts::PI,
        cm_ac: -0.05,
        x_ac_c: 0.25,
        cl_max,
        cl_min: -cl_max,
        cl_max_source: ClMaxSource::Given,
        reynolds_number: None,
        polar: None,
    }
}

pub(crate) fn trapezoid(name: &str, x: f64, z: f64, span: f64, cr: f64, ct: f64) -> Surface {
    Surface {
        name: name.into(),
        root_le_x_m: x,
        root_le_z_m: z,
        incidence_rad: 0.0,
        shape: SurfaceShape::Panels(vec![Panel {
            span_m: span,
            root_chord_m: cr,
            tip_chord_m: ct,
            sweep_le_rad: 0.05,
            dihedral_rad: 0.04,
            tip_twist_rad: -0.03,
            root_airfoil: AirfoilId(0),
            tip_airfoil: AirfoilId(0),
        }]),
    }
}

pub(crate) fn wing_and_tail(sections: &[SectionModel]) -> MultiSurfaceSystem {
    let wing = trapezoid("wing", 0.0, 0.0, 1.0, 0.25, 0.15);
    let tail = trapezoid("tail", 0.8, 0.1, 0.3, 0.12, 0.08);
    let elevator = ElevatorEffect::full_span(-0.6, -0.6);
    let inputs = [
        SurfaceInput {
            surface: &wing,
            sections,
            elevator: None,
        },
        SurfaceInput {
            surface: &tail,
            sections,
            elevator: Some(elevator),
        },
    ];
    let options = LiftingLineOptions {
        stations_per_half_span: 12,
        ..LiftingLineOptions::default()
    };
    MultiSurfaceSystem::new(&inputs, Reference::of_surface(&wing), options).unwrap()
}

#[test]
fn bad_inputs_are_typed_errors() {
    let sections = [plate(1.2)];
    let wing = trapezoid("wing", 0.0, 0.0, 1.0, 0.25, 0.15);
    let input = [SurfaceInput {
        surface: &wing,
        sections: &[],
        elevator: None,
    }];
    let reference = Reference::of_surface(&wing);
    let err = MultiSurfaceSystem::new(&input, reference, LiftingLineOptions::default());
    assert!(matches!(
        err,
        Err(LiftingLineError::MissingSection { index: 0, .. })
    ));
    let input = [SurfaceInput {
        surface: &wing,
        sections: &sections,
        elevator: None,
    }];
    let options = LiftingLineOptions {
        stations_per_half_span: 1,
        ..LiftingLineOptions::default()
    };
    let err = MultiSurfaceSystem::new(&input, reference, options);
    assert!(matches!(err, Err(LiftingLineError::InvalidInput { .. })));
    let sys = MultiSurfaceSystem::new(&input, reference, LiftingLineOptions::default()).unwrap();
    let err = sys.solve(&FlightCondition::new(0.1, 2));
    assert!(matches!(err, Err(LiftingLineError::SurfaceCount { .. })));
}

// Law: the coefficients are dimensionless, so scaling every length by k leaves C_L and C_m
// (about the scaled point) unchanged and multiplies the circulation / speed by k.
// Tolerance: round-off.
#[test]
fn coefficients_do_not_depend_on_scale() {
    let sections = [plate(2.0)];
    let small = wing_and_tail(&sections);
    let scaled = |s: &Surface, k: f64| {
        let mut out = s.clone();
        out.root_le_x_m *= k;
        out.root_le_z_m *= k;
        if let SurfaceShape::Panels(panels) = &mut out.shape {
            for p in panels {
                p.span_m *= k;
                p.root_chord_m *= k;
                p.tip_chord_m *= k;
            }
        }
        out
    };
    let wing = scaled(&trapezoid("wing", 0.0, 0.0, 1.0, 0.25, 0.15), 3.0);
    let tail = scaled(&trapezoid("tail", 0.8, 0.1, 0.3, 0.12, 0.08), 3.0);
    let elevator = ElevatorEffect::full_span(-0.6, -0.6);
    let inputs = [
        SurfaceInput {
            surface: &wing,
            sections: &sections,
            elevator: None,
        },
        SurfaceInput {
            surface: &tail,
            sections: &sections,
            elevator: Some(elevator),
        },
    ];
    let options = LiftingLineOptions {
        stations_per_half_span: 12,
        ..LiftingLineOptions::default()
    };
    let big = MultiSurfaceSystem::new(&inputs, Reference::of_surface(&wing), options).unwrap();
    let a = small.solve(&small.condition(0.1)).unwrap();
    let b = big.solve(&big.condition(0.1)).unwrap();
    assert_relative_eq!(a.cl, b.cl, max_relative = 1e-12);
    assert_relative_eq!(a.cm(0.1, 0.02), b.cm(0.3, 0.06), epsilon = 1e-12);
    assert_relative_eq!(
        3.0 * a.stations[5].circulation_per_speed_m,
        b.stations[5].circulation_per_speed_m,
        max_relative = 1e-12
    );
}

/// Newton's method as it was before it kept its work buffers (new vectors, matrices and
/// an nalgebra LU at every iteration), kept as the reference for the test below.
fn newton_allocating(
    sys: &MultiSurfaceSystem,
    mut gamma: DVector<f64>,
    geo: &DVector<f64>,
    zero: &DVector<f64>,
) -> (DVector<f64>, DVector<f64>, usize) {
    let n = sys.stations.len();
    let eval = |g: &DVector<f64>| -> (DVector<f64>, Vec<bool>, DVector<f64>) {
        let alpha = geo + &sys.induced * g;
        let mut r = DVector::zeros(n);
        let mut active = vec![true; n];
        let mut d = DVector::zeros(n);
        for (i, st) in sys.stations.iter().enumerate() {
            let shift = zero[i] - st.section.alpha_zero_lift_rad;
            let lp = st.section.lift_point(alpha[i], shift);
            active[i] = lp.attached;
            d[i] = 0.5 * st.chord_m * lp.slope_per_rad;
            r[i] = g[i] - 0.5 * st.chord_m * lp.cl;
        }
        (r, active, d)
    };
    let tol = sys.options.newton_relative_tolerance * gamma.amax().max(1e-9);
    let (mut r, mut active, mut d_full) = eval(&gamma);
    let mut res = r.amax();
    let mut iterations = 0;
    while res > tol && iterations < sys.options.max_newton_iterations {
        iterations += 1;
        let j = system_matrix(&sys.induced, &d_full, &active);
        let step = j.clone().lu().solve(&-&r).unwrap();
        let mut lambda = 1.0;
        loop {
            let trial = &gamma + &step * lambda;
            let (r_t, a_t, d_t) = eval(&trial);
            let res_t = r_t.amax();
            if res_t < res || lambda < 1e-3 {
                (gamma, r, active, d_full, res) = (trial, r_t, a_t, d_t, res_t);
                break;
            }
            lambda *= 0.5;
        }
    }
    let j = system_matrix(&sys.induced, &d_full, &active);
    let rhs = DVector::from_iterator(
        n,
        sys.stations
            .iter()
            .zip(&active)
            .zip(d_full.iter())
            .map(|((s, a), d)| if *a { d * s.normal_z } else { 0.0 }),
    );
    let tangent = j.lu().solve(&rhs).unwrap();
    (gamma, tangent, iterations)
}

// Newton's method in reused work buffers gives the same bits as the allocating version it
// replaced, on the example aircraft past their first stall (several stations held at
// cl_max, with and without elevator, one set of buffers for every solve). No outside
// source: a refactoring must not change the numbers (the buffers change only where the
// numbers are kept, the LU is nalgebra's operations in the same order).
#[test]
fn newton_reuses_buffers_with_the_same_bits() {
    let examples = [
        include_str!("../../../aircraft/larkspire-2000.toml"),
        include_str!("../../../aircraft/merrowtail-1700.toml"),
        include_str!("../../../aircraft/skerrywing-900.toml"),
        include_str!("../../../aircraft/wrenfield-1400.toml"),
    ];
    let options = crate::analysis::AnalysisOptions {
        flight_polar: false,
        ..crate::analysis::AnalysisOptions::default()
    };
    let mut work = NewtonWork::default();
    let mut newton_solves = 0;
    for text in examples {
        let ac = crate::input::parse_aircraft(text, "example.toml", None).unwrap();
        let set = crate::analysis::section_set(&ac, &options).unwrap();
        let ll = crate::analysis::lifting_line_options(&ac, &options);
        let sys = crate::stability::trim::build_system(&ac, &set.models, ll).unwrap();
        let (alpha_stall, _) = sys
            .first_stall_alpha_rad(&sys.condition(0.0))
            .unwrap()
            .unwrap();
        for (d_alpha, elevator) in [(0.002, 0.0), (0.03, 0.0), (0.1, -0.1), (0.25, 0.05)] {
            let mut cond = sys.condition(alpha_stall + d_alpha);
            cond.elevator_rad = elevator;
            let q = sys.weights(&cond).unwrap();
            let (gamma0, _) = sys.linear_circulation(&q);
            let (geo, zero) = sys.station_angles(&cond);
            let Ok((gamma, tangent, status)) = sys.newton(gamma0.clone(), &geo, &zero, &mut work)
            else {
                continue;
            };
            let (g_ref, t_ref, iterations) = newton_allocating(&sys, gamma0, &geo, &zero);
            let same = |a: &DVector<f64>, b: &DVector<f64>| {
                a.iter()
                    .zip(b.iter())
                    .all(|(x, y)| x.to_bits() == y.to_bits())
            };
            assert!(same(&gamma, &g_ref) && same(&tangent, &t_ref));
            assert!(
                matches!(status, SolveStatus::Converged { iterations: k, .. } if k == iterations)
            );
            assert_eq!(
                sys.solve_with(&cond, &mut work).unwrap(),
                sys.solve(&cond).unwrap()
            );
            newton_solves += 1;
        }
    }
    assert!(
        newton_solves >= 12,
        "{newton_solves} stalled states compared"
    );
}
