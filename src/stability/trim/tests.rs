//! Checks of the trim module against rebuilt systems, fine scans and the earlier bisections.

use super::forward_limit::{elevator_limit, hold_residual};
use super::path::{
    first_trimmed_limit, limit_residual, PathLimit, TrimmedPath, TRIM_PATH_CL_STEP, TRIM_PATH_ROOT,
};
use super::tailless::add_linear_washout;
use super::*;
use crate::lifting_line::LiftingLineOptions;

// The washout solve re-uses the factored system (`with_angle_change`) instead of building
// a new one from the washed geometry: twist enters this small-angle model only as a
// boundary angle, so both must give the same moment to round-off (exact law of the model).
#[test]
fn re_solved_washout_equals_a_rebuilt_system() {
    let text = include_str!("../../../aircraft/skerrywing-900.toml");
    let ac = crate::input::parse_aircraft(text, "w.toml", None).unwrap();
    let sections: Vec<SectionModel> = ac
        .airfoils
        .iter()
        .map(|a| {
            crate::section::section_model(a, &crate::section::SectionOptions { panels: 120 })
                .unwrap()
                .model
        })
        .collect();
    let options = LiftingLineOptions::default();
    let sys = build_system(&ac, &sections, options).unwrap();
    let extra = -1.5f64.to_radians();
    let half = crate::planform::half_span_length_m(&ac.wing);
    let fast = sys
        .with_angle_change(|st| {
            if st.surface == 0 {
                extra * st.s_m.abs() / half
            } else {
                0.0
            }
        })
        .unwrap();
    let mut washed = ac.clone();
    add_linear_washout(&mut washed, extra);
    let slow = build_system(&washed, &sections, options).unwrap();
    for alpha in [0.0, 0.08] {
        let (a, b) = (
            fast.linear_coefficients(&fast.condition(alpha), 0.13, 0.0)
                .unwrap(),
            slow.linear_coefficients(&slow.condition(alpha), 0.13, 0.0)
                .unwrap(),
        );
        assert!((a.cm - b.cm).abs() < 1e-10 && (a.cl - b.cl).abs() < 1e-10);
    }
}

const EXAMPLES: [(&str, &str); 4] = [
    (
        "larkspire-2000",
        include_str!("../../../aircraft/larkspire-2000.toml"),
    ),
    (
        "merrowtail-1700",
        include_str!("../../../aircraft/merrowtail-1700.toml"),
    ),
    (
        "skerrywing-900",
        include_str!("../../../aircraft/skerrywing-900.toml"),
    ),
    (
        "wrenfield-1400",
        include_str!("../../../aircraft/wrenfield-1400.toml"),
    ),
];

/// An example aircraft with what the forward-limit search needs: the system, its linear
/// map, the full model's figures, the CG height and the fuselage shift.
struct Example {
    aircraft: Aircraft,
    sections: Vec<SectionModel>,
    mass_kg: f64,
    density_kg_m3: f64,
    options: LiftingLineOptions,
    system: MultiSurfaceSystem,
    map: Option<StationMap>,
    full: FullStability,
    cg_x_m: f64,
    z: f64,
    shift_m: f64,
}

fn example(text: &str) -> Example {
    let aircraft = crate::input::parse_aircraft(text, "example.toml", None).unwrap();
    let options = crate::analysis::AnalysisOptions {
        flight_polar: false,
        ..crate::analysis::AnalysisOptions::default()
    };
    let analysis = crate::analysis::analyse(&aircraft, &options).unwrap();
    let set = crate::analysis::section_set(&aircraft, &options).unwrap();
    let ll = crate::analysis::lifting_line_options(&aircraft, &options);
    let system = build_system(&aircraft, &set.models, ll).unwrap();
    let map = StationMap::of(&system, &system.condition(0.0)).unwrap();
    let full = analysis.full.clone().unwrap();
    let z = analysis.mass.cg_z_m.unwrap_or(aircraft.wing.root_le_z_m);
    Example {
        shift_m: full.neutral_point_surfaces_x_m - full.neutral_point_x_m,
        cg_x_m: analysis.mass.cg_x_m,
        sections: set.models.clone(),
        mass_kg: analysis.mass.total_kg,
        density_kg_m3: analysis.air.density_kg_m3,
        options: ll,
        aircraft,
        system,
        map,
        full,
        z,
    }
}

// The forward CG limit found by Brent's method on the continuous residual, checked on the
// example aircraft against (1) an independent fine scan of the same residual whose one
// sign change is refined by bisection, and (2) the bisection of the held / not-held test
// that found the limit before (kept here as the reference). No outside source: a law of
// the search. The residual's sign must equal the old test at every scanned CG, and both
// roots must agree with the limit to the old search's tolerance, MAC / 2^30 (30 halvings
// of one MAC), with the same cause.
#[test]
// One check end to end (scan, refine, compare with the old search) reads best in one
// piece.
#[allow(clippy::too_many_lines)]
fn forward_limit_agrees_with_a_fine_scan_and_the_old_bisection() {
    let mut interior_roots = 0;
    for (name, text) in EXAMPLES {
        let ex = example(text);
        let (system, map, base) = (&ex.system, ex.map.as_ref(), ex.system.condition(0.0));
        let Some(control) = ex.aircraft.pitch_control() else {
            continue;
        };
        let canard = ex
            .aircraft
            .stabiliser
            .as_ref()
            .is_some_and(|s| s.role == StabiliserRole::Canard);
        if canard {
            continue;
        }
        let full_up = model_full_up_rad(control);
        let mac = system.reference().mac_m;
        let np = ex.full.neutral_point_x_m;
        let (found, cause) = elevator_limit(system, map, &base, full_up, np, mac, ex.z, ex.shift_m);
        // The analysis runs this same search (the shift recovered here from the neutral
        // points may differ from its own in the last bit).
        let tolerance = mac / (1u64 << 30) as f64;
        match (found, ex.full.elevator_forward_limit_x_m) {
            (Some(a), Some(b)) => assert!((a - b).abs() <= tolerance, "{name}: {a} {b}"),
            (a, b) => assert_eq!(a.is_some(), b.is_some(), "{name}"),
        }
        let old_test = |x: f64| -> Result<(), ForwardLimitCause> {
            let mut work = NewtonWork::default();
            match first_trimmed_limit(system, map, &base, x + ex.shift_m, ex.z, true, &mut work) {
                Ok(Some(t)) if t.negative => Err(ForwardLimitCause::StabiliserClMin),
                Ok(Some(t)) if t.point.control_rad >= full_up => Ok(()),
                _ => Err(ForwardLimitCause::ControlAuthority),
            }
        };
        let mut cls = Vec::new();
        let mut residual =
            |x: f64| hold_residual(system, map, &base, full_up, ex.z, ex.shift_m, x, &mut cls).0;
        let (fwd, aft) = (np - mac, np - 0.01 * mac);
        let n = 300;
        let xs: Vec<f64> = (0..=n)
            .map(|k| fwd + (aft - fwd) * k as f64 / n as f64)
            .collect();
        let rs: Vec<f64> = xs.iter().map(|&x| residual(x)).collect();
        for (x, r) in xs.iter().zip(&rs) {
            assert_eq!(*r >= 0.0, old_test(*x).is_ok(), "{name}: sign at x = {x}");
        }
        let changes: Vec<usize> = (0..n)
            .filter(|&k| (rs[k] >= 0.0) != (rs[k + 1] >= 0.0))
            .collect();
        match found {
            None => assert!(
                rs[0] >= 0.0 && changes.is_empty(),
                "{name}: held everywhere"
            ),
            Some(x) if rs[n] < 0.0 => {
                assert!(
                    (x - aft).abs() < 1e-15,
                    "{name}: not held even at the aft end"
                );
            }
            Some(x) => {
                assert_eq!(changes.len(), 1, "{name}: one sign change over the scan");
                let k = changes[0];
                assert!(
                    rs[k] < 0.0,
                    "{name}: held aft of the limit, not ahead of it"
                );
                let (mut lo, mut hi) = (xs[k], xs[k + 1]);
                for _ in 0..40 {
                    let mid = 0.5 * (lo + hi);
                    if residual(mid) >= 0.0 {
                        hi = mid;
                    } else {
                        lo = mid;
                    }
                }
                assert!(
                    (x - hi).abs() <= tolerance,
                    "{name}: {x} against the scan's {hi}"
                );
                // The old search: 30 halvings of the held / not-held test.
                let (mut f, mut a) = (fwd, aft);
                let mut old_cause = old_test(fwd).unwrap_err();
                for _ in 0..30 {
                    let mid = 0.5 * (f + a);
                    match old_test(mid) {
                        Ok(()) => a = mid,
                        Err(c) => {
                            f = mid;
                            old_cause = c;
                        }
                    }
                }
                let old = 0.5 * (f + a);
                assert!(
                    (x - old).abs() <= tolerance,
                    "{name}: {x} against the old {old}"
                );
                assert_eq!(cause, old_cause, "{name}: cause");
                interior_roots += 1;
            }
        }
    }
    assert!(interior_roots >= 2, "the examples must exercise the search");
}

// The first limit on the trimmed path (the stall at the example's CG, and the stall one
// tenth of a MAC further forward) by Brent's method against the old 40 halvings of the
// scan's step. No outside source: both must give the same limit station and the same
// trimmed C_L to the old width, step / 2^40 (about 1e-13), and a state at the limit.
#[test]
fn trimmed_path_limit_agrees_with_the_old_bisection() {
    for (name, text) in EXAMPLES {
        let ex = example(text);
        let base = ex.system.condition(0.0);
        let mac = ex.system.reference().mac_m;
        for dx in [0.0, -0.1 * mac] {
            for count_negative in [true, false] {
                let path = TrimmedPath {
                    system: &ex.system,
                    map: ex.map.as_ref(),
                    base: &base,
                    x_ref: ex.cg_x_m + dx + ex.shift_m,
                    z: ex.z,
                    count_negative,
                };
                let mut cls = Vec::new();
                let Some(new) = path.first_limit(&mut cls).unwrap() else {
                    continue;
                };
                // The old search: scan, then 40 halvings of the step.
                let mut lo = None;
                let mut old = None;
                for k in 1..=40 {
                    let cl = k as f64 * TRIM_PATH_CL_STEP;
                    match path.state(cl, &mut cls).unwrap() {
                        Some((_, None)) => lo = Some(cl),
                        Some((tp, Some(limit))) => {
                            let hi = (cl, PathLimit { point: tp, limit });
                            old = Some(match lo {
                                Some(lo) => path.bisect(lo, hi, &mut cls).unwrap().unwrap(),
                                None => hi.1,
                            });
                            break;
                        }
                        None => {}
                    }
                }
                let old = old.unwrap();
                assert_eq!(new.limit, old.limit, "{name}: the limit station");
                assert!(
                    (new.point.cl - old.point.cl).abs() <= TRIM_PATH_ROOT.x_tolerance + 1e-15,
                    "{name}: C_L {} against the old {}",
                    new.point.cl,
                    old.point.cl
                );
                path.station_cls(&new.point, &mut cls).unwrap();
                assert!(limit_residual(&ex.system, &cls, count_negative) >= 0.0);
            }
        }
    }
}

// The station map kept by the memo, and the elevator schedule's shortcut (no full solve
// where the map puts every station clearly inside its limits), change no figure: the full
// model with a memo (the second call reading it) equals the one without, and the schedule
// equals the one from a full solve at every point. No outside source: a law of the
// refactoring, checked on the example aircraft at their CG and 0.1 MAC further forward.
#[test]
fn kept_map_and_schedule_shortcut_change_no_figure() {
    let mut schedule_points = 0;
    for (name, text) in EXAMPLES {
        let ex = example(text);
        let mac = ex.system.reference().mac_m;
        let memo = ForwardLimitMemo::default();
        for dx in [0.0, -0.1 * mac] {
            let input = TrimInput {
                aircraft: &ex.aircraft,
                sections: &ex.sections,
                mass_kg: ex.mass_kg,
                cg_x_m: ex.cg_x_m + dx,
                cg_z_m: ex.z,
                density_kg_m3: ex.density_kg_m3,
                fuselage_cm_alpha_per_rad: ex.shift_m * ex.full.cl_alpha_per_rad / mac,
                options: ex.options,
                target_speed_m_s: ex.aircraft.targets.trim_speed_m_s,
                top_speed_m_s: ex.aircraft.targets.top_speed_m_s,
            };
            let plain = full_stability_on(&ex.system, &input, None).unwrap();
            for _ in 0..2 {
                let kept = full_stability_on(&ex.system, &input, Some(&memo)).unwrap();
                assert_eq!(kept, plain, "{name}");
            }
            let (Some(control), Some(stall)) = (ex.aircraft.pitch_control(), &plain.stall) else {
                continue;
            };
            let base = ex.system.condition(0.0);
            let schedule = |map: Option<&StationMap>| {
                elevator_schedule(
                    &ex.system,
                    map,
                    &base,
                    &input,
                    control,
                    stall.speed_m_s,
                    plain.top_speed_m_s,
                    input.cg_x_m + ex.shift_m,
                )
                .unwrap()
            };
            let (fast, full_solves) = (schedule(ex.map.as_ref()), schedule(None));
            assert_eq!(fast, full_solves, "{name}");
            schedule_points += fast.len();
        }
    }
    assert!(
        schedule_points >= 16,
        "{schedule_points} schedule points compared"
    );
}
