//! The forward CG limit from pitch-control authority: Brent's root of a continuous hold
//! residual in the CG (B. Etkin, L. D. Reid, *Dynamics of Flight: Stability and Control*, 3rd
//! ed., ch. 2, the forward CG limit from elevator power), remembered per CG height by
//! [`ForwardLimitMemo`] for a study; and the CG that trims at a given C_L.

use super::path::{limit_residual, stabiliser_least_margin, TrimmedPath, AT_LIMIT};
use super::*;

/// A forward CG limit from pitch control (m aft of the datum, or none) and what sets it.
pub(super) type ForwardLimit = (Option<f64>, ForwardLimitCause);

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
    pub(super) fn get_or(
        &self,
        key: [f64; 3],
        compute: impl FnOnce() -> ForwardLimit,
    ) -> ForwardLimit {
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
    pub(super) fn station_map(
        &self,
        make: impl FnOnce() -> Result<Option<StationMap>, LiftingLineError>,
    ) -> Result<Option<&StationMap>, LiftingLineError> {
        match self.map.get_or_init(make) {
            Ok(map) => Ok(map.as_ref()),
            Err(e) => Err(e.clone()),
        }
    }
}

/// The forward CG limit (m) from full nose-up pitch control and its cause, from `memo` when it
/// knows it; none for a canard, whose elevator works on the surface that must stall first.
pub(super) fn forward_limit(
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

/// Root-finder settings of the forward-limit search: the width 30 halvings of a MAC gave
/// (`mac_m / 2^30`, far below a millimetre), with Brent's bound on the evaluations (about the
/// square of the bisection count, Brent 1973, ch. 4) as the limit.
pub(super) fn forward_limit_root(mac_m: f64) -> brent::Settings {
    brent::Settings {
        x_tolerance: mac_m / (1u64 << 30) as f64,
        max_iterations: 1000,
    }
}

/// The residual of the forward-limit search where no trimmed stall exists or its search fails
/// (not held: a weaker control must move the limit aft, never remove it).
pub(super) const NOT_HELD: f64 = -1.0;

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
pub(super) fn hold_residual(
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
pub(super) fn elevator_limit(
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
pub(super) fn cg_for_cl(
    system: &MultiSurfaceSystem,
    base: &FlightCondition,
    cl: f64,
    z: f64,
) -> Option<f64> {
    let k0 = system.linear_coefficients(base, 0.0, z).ok()?;
    let mut cond = base.clone();
    cond.alpha_rad = (cl - k0.cl) / k0.cl_alpha_per_rad;
    // Cm is linear in the reference x: Cm(x) = Cm(0) + x (Cm(1) - Cm(0)).
    let m0 = system.linear_coefficients(&cond, 0.0, z).ok()?.cm;
    let m1 = system.linear_coefficients(&cond, 1.0, z).ok()?.cm;
    let x = -m0 / (m1 - m0);
    x.is_finite().then_some(x)
}
