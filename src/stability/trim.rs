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
    MultiSurfaceSystem, NewtonWork, Reference, StationResult, SurfaceInput, TrimControl, TrimPoint,
};
use crate::model::{Aircraft, PitchControl, StabiliserRole};
use crate::numeric::brent;
use crate::section::flap_correction;
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

/// A section's data referred to the free stream's dynamic pressure for a surface working at
/// `eta` times it, on a surface of aspect ratio `aspect_ratio` (see the module doc): cl limits
/// and cm_ac times eta, the lift slope lowered so that the surface's finite-span slope is eta
/// times its own. eta = 1 returns the section unchanged.
pub fn referred_to_free_stream(
    section: &SectionModel,
    eta: f64,
    aspect_ratio: f64,
) -> SectionModel {
    let a0 = section.cl_alpha_per_rad;
    let a = if aspect_ratio > 0.0 && a0 > 0.0 && eta > 0.0 {
        1.0 / (1.0 / (eta * a0) + (1.0 / eta - 1.0) / (std::f64::consts::PI * aspect_ratio))
    } else {
        eta * a0
    };
    SectionModel {
        cl_alpha_per_rad: a,
        cm_ac: eta * section.cm_ac,
        cl_max: eta * section.cl_max,
        cl_min: eta * section.cl_min,
        ..section.clone()
    }
}

/// The deflection the linear model uses for a real pitch-control deflection (the correction
/// applied); an all-moving surface is not corrected.
pub fn model_deflection_rad(control: &PitchControl, real_rad: f64) -> f64 {
    if control.chord_fraction > 0.0 {
        flap_correction::effective_deflection_rad(control.chord_fraction, real_rad)
    } else {
        real_rad
    }
}

/// The real deflection that gives the linear model's deflection `model_rad` (the smallest
/// one); beyond the chart's 60 deg its last factor is held.
pub fn real_deflection_rad(control: &PitchControl, model_rad: f64) -> f64 {
    if control.chord_fraction > 0.0 {
        flap_correction::deflection_for_effective_rad(control.chord_fraction, model_rad)
            .unwrap_or_else(|| {
                let top = flap_correction::CHART_MAX_DEFLECTION_DEG.to_radians();
                model_rad / flap_correction::lift_effectiveness_factor(control.chord_fraction, top)
            })
    } else {
        model_rad
    }
}

/// The largest trailing-edge-up deflection of the linear model that full up throw gives, rad
/// (a negative number).
fn model_full_up_rad(control: &PitchControl) -> f64 {
    if control.chord_fraction > 0.0 {
        -flap_correction::max_effective_deflection_rad(control.chord_fraction, control.max_up_rad)
    } else {
        -control.max_up_rad
    }
}

/// Build the lifting-line system of an aircraft with its pitch control, the stabiliser's
/// elevator or a tailless wing's elevons (Glauert plain flap per radian of lift-equivalent
/// deflection; the flap theory moment is about the quarter chord, which is where the section
/// models carry it), and the stabiliser referred to the free stream by its dynamic-pressure
/// ratio.
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
    let stabiliser_sections: Vec<SectionModel> = match &aircraft.stabiliser {
        Some(stab) => {
            let aspect_ratio = crate::planform::geometry(&stab.surface).aspect_ratio;
            sections
                .iter()
                .map(|s| referred_to_free_stream(s, stab.dynamic_pressure_ratio, aspect_ratio))
                .collect()
        }
        None => Vec::new(),
    };
    let mut inputs = vec![SurfaceInput {
        surface: &aircraft.wing,
        sections,
        elevator: if aircraft.stabiliser.is_none() {
            elevator
        } else {
            None
        },
    }];
    if let Some(stab) = &aircraft.stabiliser {
        let eta = stab.dynamic_pressure_ratio;
        inputs.push(SurfaceInput {
            surface: &stab.surface,
            sections: &stabiliser_sections,
            elevator: elevator.map(|e| ElevatorEffect {
                dcm_ac_per_rad_deflection: eta * e.dcm_ac_per_rad_deflection,
                ..e
            }),
        });
    }
    MultiSurfaceSystem::new(&inputs, Reference::of_surface(&aircraft.wing), options)
}

/// Least margin of the stabiliser's stations above their negative limit in `result`
/// (cl - cl_min, free-stream based); `None` without a stabiliser. A station held at cl_min
/// by the flat-top model shows zero.
fn stabiliser_negative_margin(
    system: &MultiSurfaceSystem,
    result: &LiftingLineResult,
) -> Option<(f64, usize)> {
    result
        .stations
        .iter()
        .zip(system.stations())
        .enumerate()
        .filter(|(_, (r, _))| r.surface == 1)
        .map(|(i, (r, s))| (r.cl - s.section.cl_min, i))
        .min_by(|a, b| a.0.total_cmp(&b.0))
}

/// Margin below which a stabiliser station counts as at its negative limit (the flat-top
/// model holds it exactly at cl_min once there; 1e-9 is round-off).
const AT_LIMIT: f64 = 1e-9;

/// Whether the stabiliser is at or past its negative limit in the trimmed state `tp`.
fn stabiliser_at_cl_min(
    system: &MultiSurfaceSystem,
    base: &FlightCondition,
    tp: &TrimPoint,
    control: TrimControl,
) -> Result<Option<usize>, LiftingLineError> {
    let mut cond = base.clone();
    cond.alpha_rad = tp.alpha_rad;
    match control {
        TrimControl::Elevator => cond.elevator_rad = tp.control_rad,
        TrimControl::Incidence(s) => {
            if let Some(v) = cond.incidence_change_rad.get_mut(s) {
                *v = tp.control_rad;
            }
        }
    }
    let result = system.solve(&cond)?;
    Ok(stabiliser_negative_margin(system, &result)
        .filter(|(m, _)| *m <= AT_LIMIT)
        .map(|(_, i)| i))
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

/// A forward CG limit from pitch control (m aft of the datum, or none) and what sets it.
type ForwardLimit = (Option<f64>, ForwardLimitCause);

/// Forward CG limits already found on one system, remembered by what they depend on: the
/// CG height (the moment reference's z), the control's full-up throw and the fuselage term.
/// The limit does not depend on the CG's x or on the mass (the trimmed stall is solved in
/// coefficients), so a study over CG positions and masses finds it once per system. The
/// system's linear station map (three solves, the same for every CG and mass) is kept too.
#[derive(Debug, Default)]
pub struct ForwardLimitMemo {
    found: std::sync::Mutex<Vec<([u64; 3], ForwardLimit)>>,
    map: std::sync::OnceLock<Result<Option<StationMap>, LiftingLineError>>,
}

impl ForwardLimitMemo {
    /// The remembered limit for `key`, or `compute()` (then remembered).
    fn get_or(&self, key: [f64; 3], compute: impl FnOnce() -> ForwardLimit) -> ForwardLimit {
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

    /// The station map of the system, made by `make` the first time.
    fn station_map(
        &self,
        make: impl FnOnce() -> Result<Option<StationMap>, LiftingLineError>,
    ) -> Result<Option<&StationMap>, LiftingLineError> {
        match self.map.get_or_init(make) {
            Ok(map) => Ok(map.as_ref()),
            Err(e) => Err(e.clone()),
        }
    }
}

/// The tailless check at the design CL: the target speed's, or [`TAILLESS_DESIGN_CL`].
fn tailless_at_design_cl(
    system: &MultiSurfaceSystem,
    input: &TrimInput<'_>,
    area_m2: f64,
    cg_eff_x_m: f64,
) -> Result<TaillessCheck, LiftingLineError> {
    let design_cl = input
        .target_speed_m_s
        .map(|v| cl_at(input.mass_kg, input.density_kg_m3, area_m2, v))
        .unwrap_or(TAILLESS_DESIGN_CL);
    tailless_check(input, system, design_cl, cg_eff_x_m, input.cg_z_m)
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
    let trim = trim_at_cg(system, input, &base, eff(input.cg_x_m), static_margin)?;

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
        pitch_control.is_some(),
        eff(input.cg_x_m),
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
            eff(input.cg_x_m),
            fuselage_shift_m,
            neutral_point_x_m,
        ),
        _ => (None, None),
    };

    // Elevator schedule from 1.2 Vs to the top speed.
    let stall_speed = stall.as_ref().map(|s| s.speed_m_s);
    let top_speed_m_s = input
        .top_speed_m_s
        .or(stall_speed.map(|v| DEFAULT_TOP_SPEED_FACTOR * v))
        .unwrap_or(0.0);
    let elevator_schedule = match (pitch_control, stall_speed, stable) {
        (Some(control), Some(vs), true) => elevator_schedule(
            system,
            map,
            &base,
            input,
            control,
            vs,
            top_speed_m_s,
            eff(input.cg_x_m),
        )?,
        _ => Vec::new(),
    };

    let tailless = if input.aircraft.stabiliser.is_some() || !stable {
        None
    } else {
        Some(tailless_at_design_cl(
            system,
            input,
            area,
            eff(input.cg_x_m),
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
        forward_limit_cause,
        decalage_for_target,
        cg_for_target_x_m,
        elevator_schedule,
        top_speed_m_s,
        tailless,
    })
}

/// The forward CG limit (m) from full nose-up pitch control and its cause, from `memo` when it
/// knows it; none for a canard, whose elevator works on the surface that must stall first.
fn forward_limit(
    system: &MultiSurfaceSystem,
    map: Option<&StationMap>,
    base: &FlightCondition,
    input: &TrimInput<'_>,
    memo: Option<&ForwardLimitMemo>,
    neutral_point_x_m: f64,
    fuselage_shift_m: f64,
) -> (Option<f64>, ForwardLimitCause) {
    let mac_m = system.reference().mac_m;
    let z = input.cg_z_m;
    let pitch_control = input.aircraft.pitch_control();
    let is_canard = input
        .aircraft
        .stabiliser
        .as_ref()
        .is_some_and(|s| s.role == StabiliserRole::Canard);
    match pitch_control {
        Some(p) if !is_canard => {
            let full_up_rad = model_full_up_rad(p);
            let find = || {
                elevator_limit(
                    system,
                    map,
                    base,
                    full_up_rad,
                    neutral_point_x_m,
                    mac_m,
                    z,
                    fuselage_shift_m,
                )
            };
            match memo {
                Some(m) => m.get_or([z, full_up_rad, input.fuselage_cm_alpha_per_rad], find),
                None => find(),
            }
        }
        _ => (None, ForwardLimitCause::ControlAuthority),
    }
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
            let stab = result.surfaces.get(1);
            let q = 0.5 * input.density_kg_m3 * speed * speed;
            let (downwash_rad, mut downwash_gradient) =
                stab.map_or((0.0, 0.0), |s| (s.downwash_rad, s.downwash_gradient));
            // Trimmed beyond the stall (flagged elsewhere) the local gradient of the stalled
            // wing is near zero; report the attached-flow gradient the neutral point uses.
            if result.status != crate::lifting_line::SolveStatus::Linear {
                if let Some(s) = system.solve(base)?.surfaces.get(1) {
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

/// For a target speed `speed_m_s`: the stabiliser incidence and decalage that trim there, and
/// the CG that trims there (only where it lies ahead of the neutral point), m.
fn target_speed_solves(
    system: &MultiSurfaceSystem,
    base: &FlightCondition,
    input: &TrimInput<'_>,
    speed_m_s: f64,
    cg_eff_x_m: f64,
    fuselage_shift_m: f64,
    neutral_point_x_m: f64,
) -> (Option<DecalageSolve>, Option<f64>) {
    let area = system.reference().area_m2;
    let z = input.cg_z_m;
    let v = speed_m_s;
    let mut decalage_for_target = None;
    let cl_t = cl_at(input.mass_kg, input.density_kg_m3, area, v);
    if let Some(stab) = &input.aircraft.stabiliser {
        if let Ok(tp) = system.trim_for_cl(base, TrimControl::Incidence(1), cl_t, cg_eff_x_m, z) {
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
    let cg_for_target_x_m = cg_for_cl(system, base, cl_t, z)
        .map(|x| x - fuselage_shift_m)
        .filter(|x| *x < neutral_point_x_m);
    (decalage_for_target, cg_for_target_x_m)
}

/// The elevator schedule of a stable aircraft from `SCHEDULE_LOW_SPEED_FACTOR` times the stall
/// speed `stall_speed_m_s` to `top_speed_m_s`, trimmed at the CG (`cg_eff_x_m`).
#[allow(clippy::too_many_arguments)]
fn elevator_schedule(
    system: &MultiSurfaceSystem,
    map: Option<&StationMap>,
    base: &FlightCondition,
    input: &TrimInput<'_>,
    control: &PitchControl,
    stall_speed_m_s: f64,
    top_speed_m_s: f64,
    cg_eff_x_m: f64,
) -> Result<Vec<ElevatorPoint>, LiftingLineError> {
    let area = system.reference().area_m2;
    let z = input.cg_z_m;
    let vs = stall_speed_m_s;
    let mut elevator_schedule = Vec::new();
    let lo = SCHEDULE_LOW_SPEED_FACTOR * vs;
    if top_speed_m_s > lo {
        for k in 0..SCHEDULE_POINTS {
            let v = lo + (top_speed_m_s - lo) * k as f64 / (SCHEDULE_POINTS - 1) as f64;
            let cl = cl_at(input.mass_kg, input.density_kg_m3, area, v);
            if let Ok(tp) = system.trim_for_cl(base, TrimControl::Elevator, cl, cg_eff_x_m, z) {
                let d = real_deflection_rad(control, tp.control_rad);
                let stalled = !map.is_some_and(|m| m.clearly_inside_limits(system, &tp))
                    && stabiliser_at_cl_min(system, base, &tp, TrimControl::Elevator)?.is_some();
                elevator_schedule.push(ElevatorPoint {
                    speed_m_s: v,
                    cl,
                    elevator_rad: d,
                    within_limits: control.within_throws(d),
                    stabiliser_at_cl_min: stalled,
                });
            }
        }
    }
    Ok(elevator_schedule)
}

/// The first limit met on the trimmed path.
struct TrimmedLimit {
    /// The trimmed state there.
    point: TrimPoint,
    /// Its full solution.
    result: LiftingLineResult,
    /// The station at its limit (index in the system's stations).
    station: usize,
    /// True when that is a stabiliser station at cl_min (otherwise a station at cl_max).
    negative: bool,
}

/// Step of the scan along the trimmed path, in C_L (0.1: a stall is then bracketed within
/// 0.1 and found inside by Brent's method; trimmed lift coefficients of models stay below
/// about 2).
const TRIM_PATH_CL_STEP: f64 = 0.1;
/// Highest trimmed C_L scanned.
const TRIM_PATH_CL_TOP: f64 = 4.0;

/// Section cl of every station as a linear function of the angle of attack and the pitch
/// control, `cl_i = c0_i + ca_i alpha + cd_i delta` (exact below the stall limits: the
/// lifting-line equations are linear there), found from three solves; lets the trimmed path
/// be searched without a full solve at every step.
#[derive(Debug)]
struct StationMap {
    c0: Vec<f64>,
    ca: Vec<f64>,
    cd: Vec<f64>,
}

impl StationMap {
    /// The map of `system` about `base`, or `None` when a sample solve is not in the linear
    /// range (then the search solves each state in full).
    fn of(
        system: &MultiSurfaceSystem,
        base: &FlightCondition,
    ) -> Result<Option<StationMap>, LiftingLineError> {
        const STEP_RAD: f64 = 0.01;
        let r0 = system.solve(base)?;
        let mut ca_cond = base.clone();
        ca_cond.alpha_rad += STEP_RAD;
        let ra = system.solve(&ca_cond)?;
        let mut cd_cond = base.clone();
        cd_cond.elevator_rad += STEP_RAD;
        let rd = system.solve(&cd_cond)?;
        let linear = crate::lifting_line::SolveStatus::Linear;
        if r0.status != linear || ra.status != linear || rd.status != linear {
            return Ok(None);
        }
        let cl = |r: &LiftingLineResult| r.stations.iter().map(|s| s.cl).collect::<Vec<_>>();
        let (c_0, c_a, c_d) = (cl(&r0), cl(&ra), cl(&rd));
        let (alpha0, delta0) = (base.alpha_rad, base.elevator_rad);
        let ca: Vec<f64> = c_a
            .iter()
            .zip(&c_0)
            .map(|(a, b)| (a - b) / STEP_RAD)
            .collect();
        let cd: Vec<f64> = c_d
            .iter()
            .zip(&c_0)
            .map(|(a, b)| (a - b) / STEP_RAD)
            .collect();
        let c0 = c_0
            .iter()
            .zip(ca.iter().zip(&cd))
            .map(|(c, (a, d))| c - a * alpha0 - d * delta0)
            .collect();
        Ok(Some(StationMap { c0, ca, cd }))
    }
}

/// Margin in cl by which every station's cl from the linear map must lie inside its limits
/// for a trimmed state to be taken as inside them without a full solve: the map gives the
/// linear solution to round-off (about 1e-14 over the flight range), so with 1e-6 the full
/// solve would be linear and find no station at a limit (the same answer, without it).
const MAP_CLEAR_MARGIN: f64 = 1e-6;

impl StationMap {
    /// True when every station's cl in the elevator-trimmed state `tp` lies inside its cl_min
    /// and cl_max by [`MAP_CLEAR_MARGIN`] on linear lift curves (no viscous polar).
    fn clearly_inside_limits(&self, system: &MultiSurfaceSystem, tp: &TrimPoint) -> bool {
        system.stations().iter().enumerate().all(|(i, st)| {
            let cl = self.c0[i] + self.ca[i] * tp.alpha_rad + self.cd[i] * tp.control_rad;
            st.section.polar.is_none()
                && cl < st.section.cl_max - MAP_CLEAR_MARGIN
                && cl > st.section.cl_min + MAP_CLEAR_MARGIN
        })
    }
}

/// A station at its limit: its index, and true for a stabiliser station at cl_min.
type Limit = (usize, bool);

/// The station at its limit in a state with station lift coefficients `cls`: the one furthest
/// past its cl_max (`false`), else, when `count_negative`, the stabiliser station furthest
/// past its cl_min (`true`); `None` within the limits.
fn limit_in(
    system: &MultiSurfaceSystem,
    cls: &[f64],
    count_negative: bool,
) -> Option<(usize, bool)> {
    let stations = system.stations();
    let pos = cls
        .iter()
        .zip(stations)
        .enumerate()
        .map(|(i, (cl, s))| (cl / s.section.cl_max, i))
        .max_by(|a, b| a.0.total_cmp(&b.0))
        .filter(|(r, _)| *r >= 1.0 - AT_LIMIT);
    if let Some((_, i)) = pos {
        return Some((i, false));
    }
    if !count_negative {
        return None;
    }
    cls.iter()
        .zip(stations)
        .enumerate()
        .filter(|(_, (_, s))| s.surface == 1)
        .map(|(i, (cl, s))| (cl - s.section.cl_min, i))
        .min_by(|a, b| a.0.total_cmp(&b.0))
        .filter(|(m, _)| *m <= AT_LIMIT)
        .map(|(_, i)| (i, true))
}

/// Where the trimmed path meets its first limit, before the full solve there.
#[derive(Debug, Clone, Copy, PartialEq)]
struct PathLimit {
    /// The trimmed state there.
    point: TrimPoint,
    /// The station at its limit and whether that is a stabiliser station at cl_min.
    limit: Limit,
}

/// Root-finder settings of the search along the trimmed path: a limit bracketed by the scan
/// within one step is found to the width 40 halvings of the step gave (about 1e-13 in C_L).
/// Brent's method never needs more than about the square of the bisection count (Brent
/// 1973, ch. 4), so 2000 evaluations are never reached while a sign change is bracketed.
const TRIM_PATH_ROOT: brent::Settings = brent::Settings {
    x_tolerance: TRIM_PATH_CL_STEP / (1u64 << 40) as f64,
    max_iterations: 2000,
};

/// How far a state with station lift coefficients `cls` lies past its nearest limit: the
/// largest cl / cl_max less one and, when `count_negative`, the stabiliser's least margin
/// above its cl_min taken negative, whichever is greater (each shifted by the round-off
/// allowance [`AT_LIMIT`]). Continuous in the cls, and >= 0 exactly where [`limit_in`] finds
/// a limit: the residual whose root along the trimmed path is the first limit.
fn limit_residual(system: &MultiSurfaceSystem, cls: &[f64], count_negative: bool) -> f64 {
    let stations = system.stations();
    let ratio = cls
        .iter()
        .zip(stations)
        .map(|(cl, s)| cl / s.section.cl_max)
        .fold(f64::NEG_INFINITY, f64::max);
    let positive = ratio - (1.0 - AT_LIMIT);
    if !count_negative {
        return positive;
    }
    positive.max(AT_LIMIT - stabiliser_least_margin(system, cls))
}

/// The stabiliser's least margin above cl_min in a state with station lift coefficients `cls`
/// (infinite without a stabiliser).
fn stabiliser_least_margin(system: &MultiSurfaceSystem, cls: &[f64]) -> f64 {
    cls.iter()
        .zip(system.stations())
        .filter(|(_, s)| s.surface == 1)
        .map(|(cl, s)| cl - s.section.cl_min)
        .fold(f64::INFINITY, f64::min)
}

/// The trimmed path of one system about one moment reference: the trimmed state at each C_L
/// with the elevator, and its stations' lift coefficients (from the linear map when there is
/// one, else from a full solve).
struct TrimmedPath<'a> {
    system: &'a MultiSurfaceSystem,
    map: Option<&'a StationMap>,
    base: &'a FlightCondition,
    x_ref: f64,
    z: f64,
    count_negative: bool,
}

/// A search along the trimmed path that met a C_L without a trimmed state inside the bracket
/// (the residual has no value there), or a solve that failed.
#[derive(Debug, thiserror::Error)]
enum PathError {
    #[error("no trimmed state inside the bracket")]
    NoTrim,
    #[error(transparent)]
    Solve(#[from] LiftingLineError),
}

impl TrimmedPath<'_> {
    /// The trimmed state at `cl`, or `None` where the elevator cannot trim there.
    fn point(&self, cl: f64) -> Result<Option<TrimPoint>, LiftingLineError> {
        match self
            .system
            .trim_for_cl(self.base, TrimControl::Elevator, cl, self.x_ref, self.z)
        {
            Ok(tp) => Ok(Some(tp)),
            Err(LiftingLineError::NoTrim { .. }) => Ok(None),
            Err(e) => Err(e),
        }
    }

    /// The condition of the trimmed state `tp`.
    fn condition(&self, tp: &TrimPoint) -> FlightCondition {
        let mut cond = self.base.clone();
        cond.alpha_rad = tp.alpha_rad;
        cond.elevator_rad = tp.control_rad;
        cond
    }

    /// The stations' lift coefficients in the trimmed state `tp`, written into `cls`.
    fn station_cls(&self, tp: &TrimPoint, cls: &mut Vec<f64>) -> Result<(), LiftingLineError> {
        cls.clear();
        match self.map {
            Some(m) => cls.extend(
                (0..m.c0.len())
                    .map(|i| m.c0[i] + m.ca[i] * tp.alpha_rad + m.cd[i] * tp.control_rad),
            ),
            None => cls.extend(
                self.system
                    .solve(&self.condition(tp))?
                    .stations
                    .iter()
                    .map(|s| s.cl),
            ),
        }
        Ok(())
    }

    /// The residual ([`limit_residual`]) of the trimmed state at `cl`.
    fn residual(&self, cl: f64, cls: &mut Vec<f64>) -> Result<f64, PathError> {
        let tp = self.point(cl)?.ok_or(PathError::NoTrim)?;
        self.station_cls(&tp, cls)?;
        Ok(limit_residual(self.system, cls, self.count_negative))
    }

    /// The trimmed state at `cl` and the station at its limit there, if any.
    #[allow(clippy::type_complexity)]
    fn state(
        &self,
        cl: f64,
        cls: &mut Vec<f64>,
    ) -> Result<Option<(TrimPoint, Option<Limit>)>, LiftingLineError> {
        let Some(tp) = self.point(cl)? else {
            return Ok(None);
        };
        self.station_cls(&tp, cls)?;
        Ok(Some((tp, limit_in(self.system, cls, self.count_negative))))
    }

    /// The first limit met as the trimmed C_L rises from zero: scanned in steps of
    /// [`TRIM_PATH_CL_STEP`] up to [`TRIM_PATH_CL_TOP`] (so that the first crossing is the one
    /// found), then found inside the step by Brent's method on [`limit_residual`]. Where the
    /// root finder cannot work (a C_L without a trimmed state inside the step), the step is
    /// bisected 40 times with such states counted as within the limits, as before.
    fn first_limit(&self, cls: &mut Vec<f64>) -> Result<Option<PathLimit>, LiftingLineError> {
        let steps = (TRIM_PATH_CL_TOP / TRIM_PATH_CL_STEP).round() as usize;
        let mut lo: Option<(f64, f64)> = None;
        for k in 1..=steps {
            let cl = k as f64 * TRIM_PATH_CL_STEP;
            let Some(tp) = self.point(cl)? else {
                continue;
            };
            self.station_cls(&tp, cls)?;
            let r = limit_residual(self.system, cls, self.count_negative);
            let Some(limit) = limit_in(self.system, cls, self.count_negative) else {
                lo = Some((cl, r));
                continue;
            };
            let Some(lo) = lo else {
                // Already at a limit at the lowest lift scanned.
                return Ok(Some(PathLimit { point: tp, limit }));
            };
            let found =
                brent::find_root(|c| self.residual(c, &mut *cls), lo, (cl, r), TRIM_PATH_ROOT);
            return match found {
                Ok(root) => match self.state(root.nonnegative_end(), cls)? {
                    Some((point, Some(limit))) => Ok(Some(PathLimit { point, limit })),
                    _ => self.bisect(lo.0, (cl, PathLimit { point: tp, limit }), cls),
                },
                Err(brent::RootError::Function(PathError::Solve(e))) => Err(e),
                Err(_) => self.bisect(lo.0, (cl, PathLimit { point: tp, limit }), cls),
            };
        }
        Ok(None)
    }

    /// The limit between the C_L `lo` (within the limits) and `hi` (a C_L at a limit, with
    /// the limit found there) by 40 halvings.
    fn bisect(
        &self,
        mut lo: f64,
        (mut hi_cl, mut found): (f64, PathLimit),
        cls: &mut Vec<f64>,
    ) -> Result<Option<PathLimit>, LiftingLineError> {
        for _ in 0..40 {
            let mid = 0.5 * (lo + hi_cl);
            match self.state(mid, cls)? {
                Some((point, Some(limit))) => {
                    hi_cl = mid;
                    found = PathLimit { point, limit };
                }
                _ => lo = mid,
            }
        }
        Ok(Some(found))
    }
}

/// The first limit met as the trimmed C_L rises from zero (the aircraft slowing down, trimmed
/// by the elevator about `x_ref`): a station of any surface at its cl_max, or, when
/// `count_negative`, a stabiliser station at its cl_min; with the full solution there. Only
/// positive trimmed lift is searched, which is the flight range (a scan over the angle of
/// attack would also meet limits at negative lift that are never flown). `work` holds the
/// full solve's Newton buffers.
fn first_trimmed_limit(
    system: &MultiSurfaceSystem,
    map: Option<&StationMap>,
    base: &FlightCondition,
    x_ref: f64,
    z: f64,
    count_negative: bool,
    work: &mut NewtonWork,
) -> Result<Option<TrimmedLimit>, LiftingLineError> {
    let path = TrimmedPath {
        system,
        map,
        base,
        x_ref,
        z,
        count_negative,
    };
    let Some(found) = path.first_limit(&mut Vec::with_capacity(system.stations().len()))? else {
        return Ok(None);
    };
    let (station, negative) = found.limit;
    Ok(Some(TrimmedLimit {
        result: system.solve_with(&path.condition(&found.point), work)?,
        point: found.point,
        station,
        negative,
    }))
}
/// The stall state with the moment reference at `x_ref` (already shifted for the fuselage).
fn stall_at(
    system: &MultiSurfaceSystem,
    map: Option<&StationMap>,
    base: &FlightCondition,
    trimmed_by_elevator: bool,
    x_ref: f64,
    z: f64,
    input: &TrimInput<'_>,
) -> Result<Option<FullStall>, LiftingLineError> {
    let area = system.reference().area_m2;
    let control = input.aircraft.pitch_control();
    let real = |model_rad: f64| control.map_or(model_rad, |p| real_deflection_rad(p, model_rad));
    let speed = |cl: f64| speed_at(input.mass_kg, input.density_kg_m3, area, cl);
    // One set of Newton buffers for every full solve of this stall search.
    let mut work = NewtonWork::default();
    // Trimmed with the elevator (or elevons) where there is one; where no trimmed stall
    // exists within the flight range (an unstable or badly rigged aircraft), the stall with
    // the elevator neutral is shown instead.
    let trimmed = if trimmed_by_elevator {
        first_trimmed_limit(system, map, base, x_ref, z, true, &mut work)?
    } else {
        None
    };
    if let Some(t) = trimmed {
        let st = &system.stations()[t.station];
        let limit = if t.negative {
            // The positive stall it pre-empts, for the caution.
            let otherwise = first_trimmed_limit(system, map, base, x_ref, z, false, &mut work)?;
            let cl = otherwise.map_or(f64::NAN, |o| o.result.cl);
            StallLimit::StabiliserClMin {
                cl_max_otherwise: cl,
                speed_otherwise_m_s: speed(cl),
            }
        } else {
            StallLimit::ClMax
        };
        if t.result.cl > 0.0 && limit_is_finite(&limit) {
            return Ok(Some(FullStall {
                cl_max: t.result.cl,
                speed_m_s: speed(t.result.cl),
                surface: st.surface,
                percent_semispan: st.percent_semispan,
                elevator_rad: real(t.point.control_rad),
                trimmed: true,
                limit,
                result: t.result,
            }));
        }
    }
    let Some((alpha, station)) = system.first_stall_alpha_rad(base)? else {
        return Ok(None);
    };
    let mut cond = base.clone();
    cond.alpha_rad = alpha;
    let result = system.solve_with(&cond, &mut work)?;
    if result.cl <= 0.0 {
        return Ok(None);
    }
    let st = &system.stations()[station];
    Ok(Some(FullStall {
        cl_max: result.cl,
        speed_m_s: speed(result.cl),
        surface: st.surface,
        percent_semispan: st.percent_semispan,
        elevator_rad: real(cond.elevator_rad),
        trimmed: false,
        limit: StallLimit::ClMax,
        result,
    }))
}

/// False when the pre-empted positive stall could not be found (no NaN reaches output: the
/// negative-stall state is then not reported as such).
fn limit_is_finite(limit: &StallLimit) -> bool {
    match limit {
        StallLimit::ClMax => true,
        StallLimit::StabiliserClMin {
            cl_max_otherwise,
            speed_otherwise_m_s,
        } => cl_max_otherwise.is_finite() && speed_otherwise_m_s.is_finite(),
    }
}

/// Root-finder settings of the forward-limit search: the width 30 halvings of a MAC gave
/// (`mac_m / 2^30`, far below a millimetre), with Brent's bound on the evaluations (about the
/// square of the bisection count, Brent 1973, ch. 4) as the limit.
fn forward_limit_root(mac_m: f64) -> brent::Settings {
    brent::Settings {
        x_tolerance: mac_m / (1u64 << 30) as f64,
        max_iterations: 1000,
    }
}

/// The residual of the forward-limit search where no trimmed stall exists or its search fails
/// (not held: a weaker control must move the limit aft, never remove it).
const NOT_HELD: f64 = -1.0;

/// Whether the stall can be held with the CG (effective moment reference less the fuselage
/// shift) at `x`, as a continuous residual, >= 0 where it is held, and what limits it.
///
/// On the trimmed path the first limit is found ([`TrimmedPath::first_limit`]). Where it is
/// a station at cl_max, the residual is the smaller of the pitch-control margin (the model
/// deflection there less full up, rad) and the stabiliser's least margin above cl_min there;
/// where the stabiliser reaches cl_min first, it is the smaller of the control margin and the
/// wing's largest cl / cl_max less one there (negative, since the wing has not stalled yet).
/// Both tail terms go to zero where the two limits meet, so the residual is continuous
/// through the change of cause; its sign is the test the bisection used (held when the first
/// limit is a stall at cl_max and the deflection there is within full up).
#[allow(clippy::too_many_arguments)]
fn hold_residual(
    system: &MultiSurfaceSystem,
    map: Option<&StationMap>,
    base: &FlightCondition,
    full_up_rad: f64,
    z: f64,
    fuselage_shift_m: f64,
    x: f64,
    cls: &mut Vec<f64>,
) -> (f64, ForwardLimitCause) {
    let path = TrimmedPath {
        system,
        map,
        base,
        x_ref: x + fuselage_shift_m,
        z,
        count_negative: true,
    };
    let found = path.first_limit(cls).and_then(|f| {
        f.map(|f| path.station_cls(&f.point, cls).map(|()| f))
            .transpose()
    });
    let Ok(Some(found)) = found else {
        // No trimmed stall at all (far forward, the deflection needed runs past anything a
        // flap can give), or a solve that failed: not held (the safe side).
        return (NOT_HELD, ForwardLimitCause::ControlAuthority);
    };
    let control = found.point.control_rad - full_up_rad;
    let negative = found.limit.1;
    let tail = if negative {
        limit_residual(system, cls, false)
    } else {
        stabiliser_least_margin(system, cls) - AT_LIMIT
    };
    let cause = if negative || (control >= 0.0 && tail < 0.0) {
        ForwardLimitCause::StabiliserClMin
    } else {
        ForwardLimitCause::ControlAuthority
    };
    (control.min(tail), cause)
}

/// The CG (effective moment reference) at which the elevator needed to hold the stall equals
/// `full_up_rad` (the linear model's deflection), or at which the stabiliser just reaches its
/// negative limit at the stall, whichever is further aft; searched between one MAC ahead of
/// the neutral point and the neutral point, by Brent's method on [`hold_residual`]. The
/// answer is the held end of the last bracket (on the aft, safe side of the root).
#[allow(clippy::too_many_arguments)]
fn elevator_limit(
    system: &MultiSurfaceSystem,
    map: Option<&StationMap>,
    base: &FlightCondition,
    full_up_rad: f64,
    neutral_point_x_m: f64,
    mac_m: f64,
    z: f64,
    fuselage_shift_m: f64,
) -> (Option<f64>, ForwardLimitCause) {
    let mut cls = Vec::with_capacity(system.stations().len());
    let mut hold = |x: f64| {
        hold_residual(
            system,
            map,
            base,
            full_up_rad,
            z,
            fuselage_shift_m,
            x,
            &mut cls,
        )
    };
    let (fwd, aft) = (neutral_point_x_m - mac_m, neutral_point_x_m - 0.01 * mac_m);
    let (r_aft, cause_aft) = hold(aft);
    if r_aft < 0.0 {
        // Even near the neutral point the stall cannot be held.
        return (Some(aft), cause_aft);
    }
    let (r_fwd, _) = hold(fwd);
    if r_fwd >= 0.0 {
        // Pitch control is not the limit anywhere within a MAC of the neutral point.
        return (None, ForwardLimitCause::ControlAuthority);
    }
    let found = brent::find_root(
        |x| Ok::<f64, std::convert::Infallible>(hold(x).0),
        (fwd, r_fwd),
        (aft, r_aft),
        forward_limit_root(mac_m),
    );
    match found {
        Ok(root) => {
            let cause = hold(root.negative_end()).1;
            (Some(root.nonnegative_end()), cause)
        }
        // Not reached with a bracketed sign change; the safe answer is the aft end.
        Err(_) => (Some(aft), cause_aft),
    }
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
    let elevon_to_trim_rad = match (input.aircraft.elevons.as_ref(), elevon_to_trim_rad) {
        (Some(p), Some(d)) => Some(real_deflection_rad(p, d)),
        _ => None,
    };
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

    const EXAMPLES: [(&str, &str); 4] = [
        (
            "larkspire-2000",
            include_str!("../../aircraft/larkspire-2000.toml"),
        ),
        (
            "merrowtail-1700",
            include_str!("../../aircraft/merrowtail-1700.toml"),
        ),
        (
            "skerrywing-900",
            include_str!("../../aircraft/skerrywing-900.toml"),
        ),
        (
            "wrenfield-1400",
            include_str!("../../aircraft/wrenfield-1400.toml"),
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
            let (found, cause) =
                elevator_limit(system, map, &base, full_up, np, mac, ex.z, ex.shift_m);
            // The analysis runs this same search (the shift recovered here from the neutral
            // points may differ from its own in the last bit).
            let tolerance = mac / (1u64 << 30) as f64;
            match (found, ex.full.elevator_forward_limit_x_m) {
                (Some(a), Some(b)) => assert!((a - b).abs() <= tolerance, "{name}: {a} {b}"),
                (a, b) => assert_eq!(a.is_some(), b.is_some(), "{name}"),
            }
            let old_test = |x: f64| -> Result<(), ForwardLimitCause> {
                let mut work = NewtonWork::default();
                match first_trimmed_limit(system, map, &base, x + ex.shift_m, ex.z, true, &mut work)
                {
                    Ok(Some(t)) if t.negative => Err(ForwardLimitCause::StabiliserClMin),
                    Ok(Some(t)) if t.point.control_rad >= full_up => Ok(()),
                    _ => Err(ForwardLimitCause::ControlAuthority),
                }
            };
            let mut cls = Vec::new();
            let mut residual = |x: f64| {
                hold_residual(system, map, &base, full_up, ex.z, ex.shift_m, x, &mut cls).0
            };
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
                let (Some(control), Some(stall)) = (ex.aircraft.pitch_control(), &plain.stall)
                else {
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
}
