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
//! the span could still gain lift. The stabiliser's negative limit counts too: when trimming
//! towards the wing's stall drives a station of the stabiliser down to its section cl_min
//! first (a heavy download at a forward CG), the stall speed is where that happens, and the
//! forward CG limit is where the stabiliser just reaches cl_min at the wing's stall.
//!
//! Tail efficiency (the dynamic-pressure ratio eta of [`crate::model::Stabiliser`]) enters by
//! referring the stabiliser's section data to the free stream's dynamic pressure: its cl_max,
//! cl_min and cm_ac are multiplied by eta, and its section lift slope is lowered so that the
//! stabiliser's own finite-span lift slope is eta times its value (Prandtl's relation
//! 1/a_3D = 1/a_0 + 1/(pi A) solved for the section slope; scaling the section slope by eta
//! alone would lower the 3-D slope by less, since the surface's own induced angle would fall
//! with it). The stabiliser's lift, moment, downwash response and stall limits are then eta
//! times their free-stream values, as in the textbook tail term `eta (S_t/S) a_t (1 - d eps/d
//! alpha)`. The surfaces' own unit solutions are not touched, so this works with any solver
//! behind [`MultiSurfaceSystem`] that takes section lift slopes.
//!
//! Pitch-control deflections carry the empirical plain-flap correction of
//! [`crate::section::flap_correction`]: the system is built with Glauert's linear effect per
//! radian of *lift-equivalent* deflection (factor times deflection); every deflection the
//! system returns is turned back into the real deflection that produces it (the smallest
//! one), and full throw is turned into the largest lift-equivalent deflection the throw can
//! give. A deflection-dependent factor would then be used at the deflection actually needed,
//! without iteration.
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
    MultiSurfaceSystem, NewtonWork, Reference, StationResult, SurfaceInput, SurfaceRole,
    TrimControl, TrimPoint,
};
use crate::model::{Aircraft, PitchControl, StabiliserRole};
use crate::numeric::brent;
use crate::section::flap_correction;
use crate::section::SectionModel;

mod forward_limit;
mod path;
mod solves;
mod system;
mod tailless;

pub use forward_limit::ForwardLimitMemo;
use forward_limit::{cg_for_cl, forward_limit};
use path::{stabiliser_at_cl_min, stall_at, StationMap};
pub use solves::TrimSweeper;
use solves::{elevator_schedule, target_speed_solves};
use system::model_full_up_rad;
pub use system::{
    build_system, model_deflection_rad, real_deflection_rad, referred_to_free_stream,
};
use tailless::tailless_at_design_cl;

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
    /// Which limit sets the stall.
    pub limit: StallLimit,
    /// The full solution at the stall angle (spanwise cl against cl_max).
    pub result: LiftingLineResult,
}

/// What limits the slowest trimmed flight.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum StallLimit {
    /// A station of some surface reaches its cl_max (the critical-section stall).
    ClMax,
    /// A station of the stabiliser reaches its negative limit cl_min first, before any
    /// station reaches cl_max; the positive stall would have come at these figures.
    StabiliserClMin {
        /// C_L at which the first station would reach cl_max.
        cl_max_otherwise: f64,
        /// The speed of that stall, m/s.
        speed_otherwise_m_s: f64,
    },
}

/// What sets the forward CG limit found from pitch control.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ForwardLimitCause {
    /// Full up elevator (or elevon) just holds the stall there.
    ControlAuthority,
    /// The stabiliser just reaches its negative limit cl_min at the stall there.
    StabiliserClMin,
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
    /// True when the stabiliser is at its negative limit (cl_min) in that trimmed state.
    pub stabiliser_at_cl_min: bool,
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
    /// CG at which full up elevator just holds the stall, or the stabiliser just reaches its
    /// negative limit there, whichever is further aft: the forward limit pilots meet, m.
    pub elevator_forward_limit_x_m: Option<f64>,
    /// What sets that limit.
    pub forward_limit_cause: ForwardLimitCause,
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
    let area = system.reference().area_m2;
    let z = input.cg_z_m;
    let base = system.condition(0.0);
    let Balance {
        cl_alpha,
        np_surfaces,
        fuselage_shift_m,
        neutral_point_x_m,
        static_margin,
    } = balance(system, input, &base)?;
    // Every moment is about the effective reference, shifted aft for the fuselage.
    let cg_eff_x_m = input.cg_x_m + fuselage_shift_m;

    // Trim at the CG with neutral elevator.
    let trim = trim_at_cg(system, input, &base, cg_eff_x_m, static_margin)?;

    // Critical-section stall, trimmed with the elevator (or elevons) where there is one.
    let own_map;
    let map = match memo {
        Some(m) => m.station_map(|| StationMap::of(system, &base))?,
        None => {
            own_map = StationMap::of(system, &base)?;
            own_map.as_ref()
        }
    };
    let stall = stall_at(
        system,
        map,
        &base,
        input.aircraft.pitch_control().is_some(),
        cg_eff_x_m,
        z,
        input,
    )?;

    // Forward CG limit from elevator (or elevon) authority; not for a canard, whose elevator
    // works on the surface that must stall first.
    let (elevator_forward_limit_x_m, forward_limit_cause) = forward_limit(
        system,
        map,
        &base,
        input,
        memo,
        neutral_point_x_m,
        fuselage_shift_m,
    );

    // Solves for a target speed: only for a stable aircraft (with the CG behind the neutral
    // point a trimmed state cannot be held, and rigging advice would mislead), and a CG for the
    // target speed only where that CG is itself ahead of the neutral point.
    let stable = static_margin > 0.0;
    let (decalage_for_target, cg_for_target_x_m) = match (input.target_speed_m_s, stable) {
        (Some(v), true) => target_speed_solves(
            system,
            &base,
            input,
            v,
            cg_eff_x_m,
            fuselage_shift_m,
            neutral_point_x_m,
        ),
        _ => (None, None),
    };

    // Elevator schedule from 1.2 Vs to the top speed.
    let stall_speed = stall.as_ref().map(|s| s.speed_m_s);
    let (elevator_schedule, top_speed_m_s) =
        schedule_to_top_speed(system, map, &base, input, stall_speed, stable, cg_eff_x_m)?;

    let tailless = if input.aircraft.stabiliser.is_some() || !stable {
        None
    } else {
        Some(tailless_at_design_cl(system, input, area, cg_eff_x_m)?)
    };

    Ok(FullStability {
        neutral_point_x_m,
        neutral_point_surfaces_x_m: np_surfaces,
        static_margin,
        cl_alpha_per_rad: cl_alpha,
        trim,
        stall,
        elevator_forward_limit_x_m,
        forward_limit_cause,
        decalage_for_target,
        cg_for_target_x_m,
        elevator_schedule,
        top_speed_m_s,
        tailless,
    })
}

/// The aircraft's lift slope and balance about its neutral point.
struct Balance {
    /// Lift-curve slope of the whole aircraft, per rad.
    cl_alpha: f64,
    /// Neutral point of the lifting surfaces alone, m aft of the datum.
    np_surfaces: f64,
    /// How far aft the fuselage moves the effective moment reference, m.
    fuselage_shift_m: f64,
    /// Neutral point with the fuselage, m aft of the datum.
    neutral_point_x_m: f64,
    /// Static margin at the input's CG, fraction of the MAC.
    static_margin: f64,
}

/// Lift slope, neutral point and static margin at the input's CG; the fuselage moves the
/// neutral point forward and the effective moment reference aft.
fn balance(
    system: &MultiSurfaceSystem,
    input: &TrimInput<'_>,
    base: &FlightCondition,
) -> Result<Balance, LiftingLineError> {
    let c = system.reference().mac_m;
    let z = input.cg_z_m;
    let coeffs = system.linear_coefficients(base, input.cg_x_m, z)?;
    let cl_alpha = coeffs.cl_alpha_per_rad;
    let np_surfaces = system.neutral_point_x_m(base, z)?;
    let fuselage_shift_m = c * input.fuselage_cm_alpha_per_rad / cl_alpha;
    let neutral_point_x_m = np_surfaces - fuselage_shift_m;
    Ok(Balance {
        cl_alpha,
        np_surfaces,
        fuselage_shift_m,
        neutral_point_x_m,
        static_margin: (neutral_point_x_m - input.cg_x_m) / c,
    })
}

/// The top speed of the schedule (the input's, or [`DEFAULT_TOP_SPEED_FACTOR`] times the stall
/// speed `stall_speed_m_s`) and the elevator schedule up to it; the schedule is empty without
/// a pitch control, a stall speed or static stability (`stable`).
fn schedule_to_top_speed(
    system: &MultiSurfaceSystem,
    map: Option<&StationMap>,
    base: &FlightCondition,
    input: &TrimInput<'_>,
    stall_speed_m_s: Option<f64>,
    stable: bool,
    cg_eff_x_m: f64,
) -> Result<(Vec<ElevatorPoint>, f64), LiftingLineError> {
    let top_speed_m_s = input
        .top_speed_m_s
        .or(stall_speed_m_s.map(|v| DEFAULT_TOP_SPEED_FACTOR * v))
        .unwrap_or(0.0);
    let schedule = match (input.aircraft.pitch_control(), stall_speed_m_s, stable) {
        (Some(control), Some(vs), true) => elevator_schedule(
            system,
            map,
            base,
            input,
            control,
            vs,
            top_speed_m_s,
            cg_eff_x_m,
        )?,
        _ => Vec::new(),
    };
    Ok((schedule, top_speed_m_s))
}

/// The trimmed state with neutral pitch control at the CG (`cg_eff_x_m`, shifted for the
/// fuselage), when the aircraft is stable and trims at a positive lift.
fn trim_at_cg(
    system: &MultiSurfaceSystem,
    input: &TrimInput<'_>,
    base: &FlightCondition,
    cg_eff_x_m: f64,
    static_margin: f64,
) -> Result<Option<FullTrim>, LiftingLineError> {
    let area = system.reference().area_m2;
    let z = input.cg_z_m;
    let eta = input
        .aircraft
        .stabiliser
        .as_ref()
        .map_or(1.0, |s| s.dynamic_pressure_ratio);

    Ok(match system.alpha_for_zero_moment(base, cg_eff_x_m, z) {
        Ok(tp) if tp.cl > crate::stability::classical::MIN_TRIM_CL && static_margin > 0.0 => {
            let mut cond = base.clone();
            cond.alpha_rad = tp.alpha_rad;
            let result = system.solve(&cond)?;
            let speed = speed_at(input.mass_kg, input.density_kg_m3, area, result.cl);
            let stab = result.surface(SurfaceRole::Stabiliser);
            let q = 0.5 * input.density_kg_m3 * speed * speed;
            let (downwash_rad, mut downwash_gradient) =
                stab.map_or((0.0, 0.0), |s| (s.downwash_rad, s.downwash_gradient));
            // Trimmed beyond the stall (flagged elsewhere) the local gradient of the stalled
            // wing is near zero; report the attached-flow gradient the neutral point uses.
            if result.status != crate::lifting_line::SolveStatus::Linear {
                if let Some(s) = system.solve(base)?.surface(SurfaceRole::Stabiliser) {
                    downwash_gradient = s.downwash_gradient;
                }
            }
            Some(FullTrim {
                alpha_rad: tp.alpha_rad,
                cl: result.cl,
                speed_m_s: speed,
                // The system's stabiliser coefficients are on the free stream's dynamic
                // pressure; its own cl is on the dynamic pressure it meets.
                stabiliser_cl: stab.map_or(0.0, |s| s.cl_own_area) / eta,
                stabiliser_load_n: stab.map_or(0.0, |s| s.cl * q * area),
                span_efficiency: result.span_efficiency,
                downwash_rad,
                downwash_gradient,
                result,
            })
        }
        Ok(_) | Err(LiftingLineError::NoTrim { .. }) => None,
        Err(e) => return Err(e),
    })
}

/// A station at its limit: its index, and true for a stabiliser station at cl_min.
type Limit = (usize, bool);

/// The wing's stations of a result, root to starboard tip (for spanwise tables and charts).
pub fn wing_starboard(result: &LiftingLineResult) -> Vec<&StationResult> {
    let mut out: Vec<&StationResult> = result
        .stations
        .iter()
        .filter(|s| s.is_on(SurfaceRole::Wing) && s.y_m >= 0.0)
        .collect();
    out.sort_by(|a, b| a.y_m.total_cmp(&b.y_m));
    out
}

#[cfg(test)]
mod tests;
