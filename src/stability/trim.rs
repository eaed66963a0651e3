//! Balance and trim from the full multi-surface lifting-line model: neutral point, static
//! margin, trim at the CG, the critical-section stall, the forward CG limit set by elevator
//! authority, and the solves a builder asks for (decalage for a speed, CG for a speed,
//! elevator over the speed range, washout missing on a tailless wing).
//!
//! The fuselage enters as its Gilruth-White contribution to pitch stiffness
//! ([`super::fuselage`]). In the linear range a moment `dCm_f (alpha - alpha_L0)` equals
//! `(dCm_f / CL_alpha) CL`, which is what moving the moment reference aft by
//! `c dCm_f / CL_alpha` produces; every moment here is therefore taken about that effective
//! point, so trim, stall and the solves all carry the fuselage consistently.
//!
//! The aircraft's maximum lift is the trimmed C_L at which the first station of any surface
//! reaches its section cl_max (the critical-section method): conservative, since the rest of
//! the span could still gain lift.
//!
//! # References
//! - W. F. Phillips, D. O. Snyder, "Modern adaptation of Prandtl's classic lifting-line
//!   theory", *Journal of Aircraft* 37(4), 2000 (the lifting-line model used here).
//! - B. Etkin, L. D. Reid, *Dynamics of Flight: Stability and Control*, 3rd ed., ch. 2
//!   (neutral point as the point where dCm/dCL = 0, static margin, elevator angle to trim,
//!   the forward CG limit from elevator power).
//! - J. D. Anderson, *Introduction to Flight*, ch. 5 (lift equation, stall speed).
//! - W. F. Phillips, *Mechanics of Flight*, 2nd ed., sec. 4.3 (critical-section estimate of
//!   maximum lift).

use crate::lifting_line::{
    ElevatorEffect, FlightCondition, LiftingLineError, LiftingLineOptions, LiftingLineResult,
    MultiSurfaceSystem, StationResult, TrimControl,
};
use crate::model::{Aircraft, StabiliserRole};
use crate::section::SectionModel;

/// Standard gravity, m/s^2.
const G0: f64 = crate::atmosphere::G0;

/// Design lift coefficient used to judge a tailless wing when no trim speed is given
/// (common practice: flying wings cruise near CL 0.3).
pub const TAILLESS_DESIGN_CL: f64 = 0.3;

/// Top of the elevator schedule when the file gives no top speed, as a multiple of the stall
/// speed (common practice: a model's useful speed range is about three times its stall speed).
pub const DEFAULT_TOP_SPEED_FACTOR: f64 = 3.0;

/// Lowest speed of the elevator schedule, as a multiple of the stall speed (common practice:
/// 1.2, the usual approach-speed margin).
pub const SCHEDULE_LOW_SPEED_FACTOR: f64 = 1.2;

/// Points in the elevator schedule.
const SCHEDULE_POINTS: usize = 8;

/// Inputs of the full-model balance and trim.
#[derive(Debug, Clone, Copy)]
pub struct TrimInput<'a> {
    /// The aircraft.
    pub aircraft: &'a Aircraft,
    /// Section models, parallel to `aircraft.airfoils`.
    pub sections: &'a [SectionModel],
    /// Total mass, kg.
    pub mass_kg: f64,
    /// CG x, m aft of the datum.
    pub cg_x_m: f64,
    /// Height used as the moment reference, m (the CG's z when known).
    pub cg_z_m: f64,
    /// Air density, kg/m^3.
    pub density_kg_m3: f64,
    /// Fuselage contribution to dCm/dalpha, per rad.
    pub fuselage_cm_alpha_per_rad: f64,
    /// Lifting-line discretisation.
    pub options: LiftingLineOptions,
    /// Target trim speed, m/s, if the builder has one.
    pub target_speed_m_s: Option<f64>,
    /// Top speed for the elevator schedule, m/s; `None` takes three times the stall speed.
    pub top_speed_m_s: Option<f64>,
}

/// The trimmed state at the actual CG with neutral elevator.
#[derive(Debug, Clone, PartialEq)]
pub struct FullTrim {
    /// Fuselage-datum angle of attack, rad.
    pub alpha_rad: f64,
    /// Total lift coefficient on the wing area.
    pub cl: f64,
    /// Trim speed, m/s.
    pub speed_m_s: f64,
    /// Stabiliser lift on its own area (0 without one).
    pub stabiliser_cl: f64,
    /// Stabiliser lift force at the trim speed, N (negative is a download).
    pub stabiliser_load_n: f64,
    /// Wing induced-drag coefficient share and span efficiency at trim.
    pub span_efficiency: Option<f64>,
    /// Downwash angle at the stabiliser, rad (0 without one).
    pub downwash_rad: f64,
    /// d(downwash)/d(alpha) at the stabiliser.
    pub downwash_gradient: f64,
    /// The full solution (spanwise table and all).
    pub result: LiftingLineResult,
}

/// The critical-section stall.
#[derive(Debug, Clone, PartialEq)]
pub struct FullStall {
    /// Aircraft CL_max (trimmed where the aircraft has an elevator).
    pub cl_max: f64,
    /// Stall speed, m/s.
    pub speed_m_s: f64,
    /// Surface whose station stalls first (0 wing, 1 stabiliser).
    pub surface: usize,
    /// Where on that surface, percent of its semispan.
    pub percent_semispan: f64,
    /// Elevator at the stall, rad (trailing edge down positive; 0 when not trimmed by elevator).
    pub elevator_rad: f64,
    /// True when the stall state was trimmed with the elevator.
    pub trimmed: bool,
    /// The full solution at the stall angle (spanwise cl against cl_max).
    pub result: LiftingLineResult,
}

/// One point of the elevator schedule.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ElevatorPoint {
    /// Airspeed, m/s.
    pub speed_m_s: f64,
    /// Lift coefficient there.
    pub cl: f64,
    /// Elevator to trim, rad (trailing edge down positive).
    pub elevator_rad: f64,
    /// True when the deflection is within the elevator's throws.
    pub within_limits: bool,
}

/// The stabiliser incidence that trims at a target speed with neutral elevator.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DecalageSolve {
    /// The target speed, m/s.
    pub speed_m_s: f64,
    /// CL at that speed.
    pub cl: f64,
    /// Stabiliser incidence to set, rad.
    pub stabiliser_incidence_rad: f64,
    /// Resulting decalage, rad (front surface minus rear: wing minus tail, canard minus wing).
    pub decalage_rad: f64,
}

/// What a tailless wing lacks to trim at its design lift.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TaillessCheck {
    /// The design CL used.
    pub design_cl: f64,
    /// Cm about the CG at zero lift (must be positive for trim at positive lift).
    pub cm_zero_lift: f64,
    /// Cm about the CG at the design CL (zero when trimmed there).
    pub cm_at_design: f64,
    /// Extra tip washout (linear along the span) that would trim at the design CL, rad
    /// (negative: more washout needed; positive: less).
    pub washout_change_rad: Option<f64>,
    /// Rise of every section's cm_ac (reflex) that would trim at the design CL.
    pub reflex_cm_change: f64,
    /// Elevon deflection that trims at the design CL, rad (trailing edge down positive;
    /// `None` without elevons or when no deflection trims there).
    pub elevon_to_trim_rad: Option<f64>,
    /// True when that deflection is within the elevons' throws.
    pub elevon_within_throws: bool,
}

/// Everything the full model gives for balance and trim.
#[derive(Debug, Clone, PartialEq)]
pub struct FullStability {
    /// Neutral point with the fuselage, m aft of the datum.
    pub neutral_point_x_m: f64,
    /// Neutral point of the lifting surfaces alone, m.
    pub neutral_point_surfaces_x_m: f64,
    /// Static margin at the CG, fraction of MAC.
    pub static_margin: f64,
    /// Whole-aircraft lift slope on the wing area, per rad.
    pub cl_alpha_per_rad: f64,
    /// Trim at the CG, neutral elevator.
    pub trim: Option<FullTrim>,
    /// Critical-section stall.
    pub stall: Option<FullStall>,
    /// CG at which full up elevator just holds the stall: the forward limit pilots meet, m.
    pub elevator_forward_limit_x_m: Option<f64>,
    /// Stabiliser incidence for the target speed.
    pub decalage_for_target: Option<DecalageSolve>,
    /// CG that trims at the target speed with the present incidences, m.
    pub cg_for_target_x_m: Option<f64>,
    /// Elevator over the speed range.
    pub elevator_schedule: Vec<ElevatorPoint>,
    /// Top speed used for the schedule, m/s.
    pub top_speed_m_s: f64,
    /// Tailless check (only for aircraft without a stabiliser, and only with the CG ahead of
    /// the neutral point: an unstable wing gets no rigging advice).
    pub tailless: Option<TaillessCheck>,
}

/// Build the lifting-line system of an aircraft with its pitch control, the stabiliser's
/// elevator or a tailless wing's elevons (Glauert plain flap; the flap theory moment is about
/// the quarter chord, which is where the section models carry it).
pub fn build_system(
    aircraft: &Aircraft,
    sections: &[SectionModel],
    options: LiftingLineOptions,
) -> Result<MultiSurfaceSystem, LiftingLineError> {
    let elevator = aircraft.pitch_control().and_then(|p| {
        let effect = if p.chord_fraction > 0.0 {
            let f = crate::section::flap_effectiveness(p.chord_fraction).ok()?;
            ElevatorEffect::full_span(-f.tau, f.dcm_quarter_chord_ddelta_per_rad)
        } else {
            // An all-moving surface: the control turns the whole section.
            ElevatorEffect::full_span(-1.0, 0.0)
        };
        Some(ElevatorEffect {
            inboard_fraction: p.inboard_fraction,
            outboard_fraction: p.outboard_fraction,
            ..effect
        })
    });
    MultiSurfaceSystem::from_aircraft(aircraft, sections, elevator, options)
}

/// CL at speed `v` for weight `m g` on area `s`.
fn cl_at(mass_kg: f64, density: f64, area_m2: f64, v: f64) -> f64 {
    2.0 * mass_kg * G0 / (density * area_m2 * v * v)
}

/// Speed for lift coefficient `cl`.
fn speed_at(mass_kg: f64, density: f64, area_m2: f64, cl: f64) -> f64 {
    (2.0 * mass_kg * G0 / (density * area_m2 * cl)).sqrt()
}

/// Run the full-model balance and trim.
pub fn full_stability(input: &TrimInput<'_>) -> Result<FullStability, LiftingLineError> {
    let system = build_system(input.aircraft, input.sections, input.options)?;
    full_stability_on(&system, input, None)
}

/// Forward CG limits already found on one system, remembered by what they depend on: the
/// CG height (the moment reference's z), the control's full-up throw and the fuselage term.
/// The limit does not depend on the CG's x or on the mass (the trimmed stall is solved in
/// coefficients), so a study over CG positions and masses finds it once per system.
#[derive(Debug, Default)]
pub struct ForwardLimitMemo {
    found: std::sync::Mutex<Vec<([u64; 3], Option<f64>)>>,
}

impl ForwardLimitMemo {
    /// The remembered limit for `key`, or `compute()` (then remembered).
    fn get_or(&self, key: [f64; 3], compute: impl FnOnce() -> Option<f64>) -> Option<f64> {
        let key = key.map(f64::to_bits);
        let known = self
            .found
            .lock()
            .ok()
            .and_then(|found| found.iter().find(|(k, _)| *k == key).map(|(_, v)| *v));
        if let Some(v) = known {
            return v;
        }
        let v = compute();
        if let Ok(mut found) = self.found.lock() {
            found.push((key, v));
        }
        v
    }
}

/// The full-model balance and trim on a system already built and factored for the input's
/// aircraft (by [`build_system`], or one built once and changed by
/// `MultiSurfaceSystem::with_angle_change` for other incidences): masses, CG and target
/// speed come from `input`, the geometry from `system`. `memo`, when given, remembers the
/// forward CG limit for other calls on the same system.
pub fn full_stability_on(
    system: &MultiSurfaceSystem,
    input: &TrimInput<'_>,
    memo: Option<&ForwardLimitMemo>,
) -> Result<FullStability, LiftingLineError> {
    let reference = system.reference();
    let c = reference.mac_m;
    let area = reference.area_m2;
    let z = input.cg_z_m;
    let base = system.condition(0.0);
    let pitch_control = input.aircraft.pitch_control();

    let coeffs = system.linear_coefficients(&base, input.cg_x_m, z)?;
    let cl_alpha = coeffs.cl_alpha_per_rad;
    let np_surfaces = system.neutral_point_x_m(&base, z)?;
    // The fuselage moves the neutral point forward and the effective moment reference aft.
    let fuselage_shift_m = c * input.fuselage_cm_alpha_per_rad / cl_alpha;
    let neutral_point_x_m = np_surfaces - fuselage_shift_m;
    let eff = |x_cg: f64| x_cg + fuselage_shift_m;
    let static_margin = (neutral_point_x_m - input.cg_x_m) / c;

    // Trim at the CG with neutral elevator.
    let trim = match system.alpha_for_zero_moment(&base, eff(input.cg_x_m), z) {
        Ok(tp) if tp.cl > crate::stability::classical::MIN_TRIM_CL && static_margin > 0.0 => {
            let mut cond = base.clone();
            cond.alpha_rad = tp.alpha_rad;
            let result = system.solve(&cond)?;
            let speed = speed_at(input.mass_kg, input.density_kg_m3, area, result.cl);
            let stab = result.surfaces.get(1);
            let q = 0.5 * input.density_kg_m3 * speed * speed;
            let (downwash_rad, mut downwash_gradient) =
                stab.map_or((0.0, 0.0), |s| (s.downwash_rad, s.downwash_gradient));
            // Trimmed beyond the stall (flagged elsewhere) the local gradient of the stalled
            // wing is near zero; report the attached-flow gradient the neutral point uses.
            if result.status != crate::lifting_line::SolveStatus::Linear {
                if let Some(s) = system.solve(&base)?.surfaces.get(1) {
                    downwash_gradient = s.downwash_gradient;
                }
            }
            Some(FullTrim {
                alpha_rad: tp.alpha_rad,
                cl: result.cl,
                speed_m_s: speed,
                stabiliser_cl: stab.map_or(0.0, |s| s.cl_own_area),
                stabiliser_load_n: stab.map_or(0.0, |s| s.cl * q * area),
                span_efficiency: result.span_efficiency,
                downwash_rad,
                downwash_gradient,
                result,
            })
        }
        Ok(_) | Err(LiftingLineError::NoTrim { .. }) => None,
        Err(e) => return Err(e),
    };

    // Critical-section stall, trimmed with the elevator (or elevons) where there is one.
    let stall = stall_at(
        system,
        &base,
        pitch_control.is_some(),
        eff(input.cg_x_m),
        z,
        input,
    )?;

    // Forward CG limit from elevator (or elevon) authority; not for a canard, whose elevator
    // works on the surface that must stall first.
    let is_canard = input
        .aircraft
        .stabiliser
        .as_ref()
        .is_some_and(|s| s.role == StabiliserRole::Canard);
    let elevator_forward_limit_x_m = match pitch_control {
        Some(p) if !is_canard => {
            let find = || {
                elevator_limit(
                    system,
                    &base,
                    -p.max_up_rad,
                    neutral_point_x_m,
                    c,
                    z,
                    fuselage_shift_m,
                )
            };
            match memo {
                Some(m) => m.get_or([z, p.max_up_rad, input.fuselage_cm_alpha_per_rad], find),
                None => find(),
            }
        }
        _ => None,
    };

    // Solves for a target speed: only for a stable aircraft (with the CG behind the neutral
    // point a trimmed state cannot be held, and rigging advice would mislead), and a CG for the
    // target speed only where that CG is itself ahead of the neutral point.
    let mut decalage_for_target = None;
    let mut cg_for_target_x_m = None;
    let stable = static_margin > 0.0;
    if let (Some(v), true) = (input.target_speed_m_s, stable) {
        let cl_t = cl_at(input.mass_kg, input.density_kg_m3, area, v);
        if let Some(stab) = &input.aircraft.stabiliser {
            if let Ok(tp) =
                system.trim_for_cl(&base, TrimControl::Incidence(1), cl_t, eff(input.cg_x_m), z)
            {
                let incidence = stab.surface.incidence_rad + tp.control_rad;
                let wing_minus_stab = input.aircraft.wing.incidence_rad - incidence;
                decalage_for_target = Some(DecalageSolve {
                    speed_m_s: v,
                    cl: cl_t,
                    stabiliser_incidence_rad: incidence,
                    decalage_rad: match stab.role {
                        StabiliserRole::Tail => wing_minus_stab,
                        StabiliserRole::Canard => -wing_minus_stab,
                    },
                });
            }
        }
        cg_for_target_x_m = cg_for_cl(system, &base, cl_t, z)
            .map(|x| x - fuselage_shift_m)
            .filter(|x| *x < neutral_point_x_m);
    }

    // Elevator schedule from 1.2 Vs to the top speed.
    let stall_speed = stall.as_ref().map(|s| s.speed_m_s);
    let top_speed_m_s = input
        .top_speed_m_s
        .or(stall_speed.map(|v| DEFAULT_TOP_SPEED_FACTOR * v))
        .unwrap_or(0.0);
    let mut elevator_schedule = Vec::new();
    if let (Some(control), Some(vs), true) = (pitch_control, stall_speed, stable) {
        let lo = SCHEDULE_LOW_SPEED_FACTOR * vs;
        if top_speed_m_s > lo {
            for k in 0..SCHEDULE_POINTS {
                let v = lo + (top_speed_m_s - lo) * k as f64 / (SCHEDULE_POINTS - 1) as f64;
                let cl = cl_at(input.mass_kg, input.density_kg_m3, area, v);
                if let Ok(tp) =
                    system.trim_for_cl(&base, TrimControl::Elevator, cl, eff(input.cg_x_m), z)
                {
                    let d = tp.control_rad;
                    elevator_schedule.push(ElevatorPoint {
                        speed_m_s: v,
                        cl,
                        elevator_rad: d,
                        within_limits: control.within_throws(d),
                    });
                }
            }
        }
    }

    let tailless = if input.aircraft.stabiliser.is_some() || !stable {
        None
    } else {
        let design_cl = input
            .target_speed_m_s
            .map(|v| cl_at(input.mass_kg, input.density_kg_m3, area, v))
            .unwrap_or(TAILLESS_DESIGN_CL);
        Some(tailless_check(
            input,
            system,
            design_cl,
            eff(input.cg_x_m),
            z,
        )?)
    };

    Ok(FullStability {
        neutral_point_x_m,
        neutral_point_surfaces_x_m: np_surfaces,
        static_margin,
        cl_alpha_per_rad: cl_alpha,
        trim,
        stall,
        elevator_forward_limit_x_m,
        decalage_for_target,
        cg_for_target_x_m,
        elevator_schedule,
        top_speed_m_s,
        tailless,
    })
}

/// The stall state with the moment reference at `x_ref` (already shifted for the fuselage).
fn stall_at(
    system: &MultiSurfaceSystem,
    base: &FlightCondition,
    trimmed_by_elevator: bool,
    x_ref: f64,
    z: f64,
    input: &TrimInput<'_>,
) -> Result<Option<FullStall>, LiftingLineError> {
    let area = system.reference().area_m2;
    let trimmed_stall = if trimmed_by_elevator {
        match system.trimmed_stall(base, TrimControl::Elevator, x_ref, z) {
            Ok(s) => Some(s),
            // No trimmed stall within the elevator's reach (an unstable or badly rigged
            // aircraft): fall back to the stall with the elevator neutral.
            Err(
                LiftingLineError::StallNotFound { .. }
                | LiftingLineError::NoTrim { .. }
                | LiftingLineError::InvalidInput { .. },
            ) => None,
            Err(e) => return Err(e),
        }
    } else {
        None
    };
    let (cond, station, trimmed) = if let Some(s) = trimmed_stall {
        let mut cond = base.clone();
        cond.alpha_rad = s.alpha_rad;
        cond.elevator_rad = s.control_rad;
        (cond, s.station, true)
    } else {
        match system.first_stall_alpha_rad(base)? {
            Some((alpha, station)) => {
                let mut cond = base.clone();
                cond.alpha_rad = alpha;
                (cond, station, false)
            }
            None => return Ok(None),
        }
    };
    let result = system.solve(&cond)?;
    if result.cl <= 0.0 {
        return Ok(None);
    }
    let st = &system.stations()[station];
    Ok(Some(FullStall {
        cl_max: result.cl,
        speed_m_s: speed_at(input.mass_kg, input.density_kg_m3, area, result.cl),
        surface: st.surface,
        percent_semispan: st.percent_semispan,
        elevator_rad: cond.elevator_rad,
        trimmed,
        result,
    }))
}

/// The CG (effective moment reference) at which the elevator needed to hold the stall equals
/// `full_up_rad`; searched between one MAC ahead of the neutral point and the neutral point.
fn elevator_limit(
    system: &MultiSurfaceSystem,
    base: &FlightCondition,
    full_up_rad: f64,
    neutral_point_x_m: f64,
    mac_m: f64,
    z: f64,
    fuselage_shift_m: f64,
) -> Option<f64> {
    // Margin of elevator left at the stall with the CG at x (negative: full up is not enough).
    // Where no trimmed stall exists at all (far forward, the deflection needed runs past
    // anything a flap can give), the elevator is taken as not enough: a weaker control must
    // move the limit aft, never remove it.
    let needed = |x: f64| {
        system
            .trimmed_stall(base, TrimControl::Elevator, x + fuselage_shift_m, z)
            .ok()
            .map_or(-1.0, |s| s.control_rad - full_up_rad)
    };
    let (mut fwd, mut aft) = (neutral_point_x_m - mac_m, neutral_point_x_m - 0.01 * mac_m);
    let (f_fwd, f_aft) = (needed(fwd), needed(aft));
    if f_aft < 0.0 {
        // Even near the neutral point full up elevator does not reach the stall.
        return Some(aft);
    }
    if f_fwd >= 0.0 {
        // Elevator power is not the limit anywhere within a MAC of the neutral point.
        return None;
    }
    for _ in 0..40 {
        let mid = 0.5 * (fwd + aft);
        if needed(mid) >= 0.0 {
            aft = mid;
        } else {
            fwd = mid;
        }
    }
    Some(0.5 * (fwd + aft))
}

/// The moment reference x at which the aircraft trims at `cl` with the controls of `base`
/// (the CG for a target speed, before the fuselage shift is removed).
fn cg_for_cl(system: &MultiSurfaceSystem, base: &FlightCondition, cl: f64, z: f64) -> Option<f64> {
    let k0 = system.linear_coefficients(base, 0.0, z).ok()?;
    let mut cond = base.clone();
    cond.alpha_rad = (cl - k0.cl) / k0.cl_alpha_per_rad;
    // Cm is linear in the reference x: Cm(x) = Cm(0) + x (Cm(1) - Cm(0)).
    let m0 = system.linear_coefficients(&cond, 0.0, z).ok()?.cm;
    let m1 = system.linear_coefficients(&cond, 1.0, z).ok()?.cm;
    let x = -m0 / (m1 - m0);
    x.is_finite().then_some(x)
}

fn tailless_check(
    input: &TrimInput<'_>,
    system: &MultiSurfaceSystem,
    design_cl: f64,
    x_ref: f64,
    z: f64,
) -> Result<TaillessCheck, LiftingLineError> {
    let cm_at_cl = |sys: &MultiSurfaceSystem, cl: f64| -> Result<f64, LiftingLineError> {
        let base = sys.condition(0.0);
        let k0 = sys.linear_coefficients(&base, x_ref, z)?;
        let mut cond = base;
        cond.alpha_rad = (cl - k0.cl) / k0.cl_alpha_per_rad;
        Ok(sys.linear_coefficients(&cond, x_ref, z)?.cm)
    };
    let cm_zero_lift = cm_at_cl(system, 0.0)?;
    let cm_at_design = cm_at_cl(system, design_cl)?;
    let base = system.condition(0.0);
    let elevon_to_trim_rad = input.aircraft.elevons.and_then(|_| {
        system
            .trim_for_cl(&base, TrimControl::Elevator, design_cl, x_ref, z)
            .ok()
            .map(|tp| tp.control_rad)
            .filter(|d| d.is_finite() && d.abs() < std::f64::consts::FRAC_PI_2)
    });
    let elevon_within_throws = match (input.aircraft.elevons, elevon_to_trim_rad) {
        (Some(p), Some(d)) => p.within_throws(d),
        _ => false,
    };
    // A uniform rise of cm_ac changes the wing's Cm by the same amount (the MAC is defined so
    // that the chord-squared integral over S c equals one).
    let reflex_cm_change = -cm_at_design;
    // Extra linear washout that zeroes the moment at the design CL: the moment is nearly linear
    // in twist (the trim angle moves a little with it), so a few secant steps, each rebuilding
    // the system with the new twist, converge it.
    let half_span_m = crate::planform::half_span_length_m(&input.aircraft.wing);
    let cm_with = |extra_rad: f64| -> Option<f64> {
        // Linear extra washout, zero at the root and `extra_rad` at the tip (as
        // `add_linear_washout` would put it in the file), on the factored system.
        let sys = system
            .with_angle_change(|st| {
                if st.surface == 0 {
                    extra_rad * st.s_m.abs() / half_span_m
                } else {
                    0.0
                }
            })
            .ok()?;
        cm_at_cl(&sys, design_cl).ok()
    };
    let washout_change_rad = (|| {
        let (mut w0, mut m0) = (0.0, cm_at_design);
        let mut w1 = -1f64.to_radians();
        let mut m1 = cm_with(w1)?;
        for _ in 0..6 {
            if (m1 - m0).abs() < 1e-12 {
                return None;
            }
            let w2 = w1 - m1 * (w1 - w0) / (m1 - m0);
            if !w2.is_finite() || w2.abs() > 0.5 {
                return None;
            }
            (w0, m0) = (w1, m1);
            w1 = w2;
            m1 = cm_with(w1)?;
            if m1.abs() < 1e-9 {
                break;
            }
        }
        Some(w1)
    })();
    Ok(TaillessCheck {
        design_cl,
        cm_zero_lift,
        cm_at_design,
        washout_change_rad,
        reflex_cm_change,
        elevon_to_trim_rad,
        elevon_within_throws,
    })
}

/// Add twist growing linearly from 0 at the root to `tip_rad` at the tip of the wing.
#[cfg(test)]
fn add_linear_washout(aircraft: &mut Aircraft, tip_rad: f64) {
    use crate::model::SurfaceShape;
    match &mut aircraft.wing.shape {
        SurfaceShape::Panels(panels) => {
            let total: f64 = panels.iter().map(|p| p.span_m).sum();
            let mut s = 0.0;
            for p in panels.iter_mut() {
                s += p.span_m;
                p.tip_twist_rad += tip_rad * s / total;
            }
        }
        SurfaceShape::Elliptic(e) => e.tip_twist_rad += tip_rad,
    }
}

/// The wing's stations of a result, root to starboard tip (for spanwise tables and charts).
pub fn wing_starboard(result: &LiftingLineResult) -> Vec<&StationResult> {
    let mut out: Vec<&StationResult> = result
        .stations
        .iter()
        .filter(|s| s.surface == 0 && s.y_m >= 0.0)
        .collect();
    out.sort_by(|a, b| a.y_m.total_cmp(&b.y_m));
    out
}

/// Trim speed at any CG position with the incidences held, from one factored system (for
/// charts of trim speed against CG).
pub struct TrimSweeper<'a> {
    input: TrimInput<'a>,
    system: MultiSurfaceSystem,
    fuselage_shift_m: f64,
}

impl<'a> TrimSweeper<'a> {
    /// Build the system once for `input` (its CG is ignored).
    pub fn new(input: TrimInput<'a>) -> Result<Self, LiftingLineError> {
        let system = build_system(input.aircraft, input.sections, input.options)?;
        let base = system.condition(0.0);
        let cl_alpha = system
            .linear_coefficients(&base, input.cg_x_m, input.cg_z_m)?
            .cl_alpha_per_rad;
        let fuselage_shift_m =
            system.reference().mac_m * input.fuselage_cm_alpha_per_rad / cl_alpha;
        Ok(TrimSweeper {
            input,
            system,
            fuselage_shift_m,
        })
    }

    /// Trim speed (m/s) with the CG at `cg_x_m` and neutral elevator, or `None` where there is
    /// no stable trim at positive lift.
    pub fn trim_speed_m_s(&self, cg_x_m: f64) -> Option<f64> {
        let base = self.system.condition(0.0);
        let x = cg_x_m + self.fuselage_shift_m;
        let np = self
            .system
            .neutral_point_x_m(&base, self.input.cg_z_m)
            .ok()?;
        if x >= np {
            return None;
        }
        let tp = self
            .system
            .alpha_for_zero_moment(&base, x, self.input.cg_z_m)
            .ok()?;
        (tp.cl > crate::stability::classical::MIN_TRIM_CL).then(|| {
            speed_at(
                self.input.mass_kg,
                self.input.density_kg_m3,
                self.system.reference().area_m2,
                tp.cl,
            )
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::lifting_line::LiftingLineOptions;

    // The washout solve re-uses the factored system (`with_angle_change`) instead of building
    // a new one from the washed geometry: twist enters this small-angle model only as a
    // boundary angle, so both must give the same moment to round-off (exact law of the model).
    #[test]
    fn re_solved_washout_equals_a_rebuilt_system() {
        let text = include_str!("../../aircraft/skerrywing-900.toml");
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
}
