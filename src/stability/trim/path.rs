//! The trimmed path in C_L and its first limit: a station of any surface at its section
//! cl_max, or the stabiliser at its negative limit cl_min. A scan in steps of
//! [`TRIM_PATH_CL_STEP`] brackets the first limit and Brent's method finds it on a continuous
//! residual; the critical-section stall follows (W. F. Phillips, *Mechanics of Flight*, 2nd
//! ed., sec. 4.3).

use super::*;

/// Least margin of the stabiliser's stations above their negative limit in `result`
/// (cl - cl_min, free-stream based); `None` without a stabiliser. A station held at cl_min
/// by the flat-top model shows zero.
pub(super) fn stabiliser_negative_margin(
    system: &MultiSurfaceSystem,
    result: &LiftingLineResult,
) -> Option<(f64, usize)> {
    result
        .stations
        .iter()
        .zip(system.stations())
        .enumerate()
        .filter(|(_, (r, _))| r.is_on(SurfaceRole::Stabiliser))
        .map(|(i, (r, s))| (r.cl - s.section.cl_min, i))
        .min_by(|a, b| a.0.total_cmp(&b.0))
}

/// Margin below which a stabiliser station counts as at its negative limit (the flat-top
/// model holds it exactly at cl_min once there; 1e-9 is round-off).
pub(super) const AT_LIMIT: f64 = 1e-9;

/// Whether the stabiliser is at or past its negative limit in the trimmed state `tp`.
pub(super) fn stabiliser_at_cl_min(
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

/// The first limit met on the trimmed path.
pub(super) struct TrimmedLimit {
    /// The trimmed state there.
    pub(super) point: TrimPoint,
    /// Its full solution.
    pub(super) result: LiftingLineResult,
    /// The station at its limit (index in the system's stations).
    pub(super) station: usize,
    /// True when that is a stabiliser station at cl_min (otherwise a station at cl_max).
    pub(super) negative: bool,
}

/// Step of the scan along the trimmed path, in C_L (0.1: a stall is then bracketed within
/// 0.1 and found inside by Brent's method; trimmed lift coefficients of models stay below
/// about 2).
pub(super) const TRIM_PATH_CL_STEP: f64 = 0.1;

/// Highest trimmed C_L scanned.
pub(super) const TRIM_PATH_CL_TOP: f64 = 4.0;

/// Section cl of every station as a linear function of the angle of attack and the pitch
/// control, `cl_i = c0_i + ca_i alpha + cd_i delta` (exact below the stall limits: the
/// lifting-line equations are linear there), found from three solves; lets the trimmed path
/// be searched without a full solve at every step.
#[derive(Debug)]
pub(super) struct StationMap {
    pub(super) c0: Vec<f64>,
    pub(super) ca: Vec<f64>,
    pub(super) cd: Vec<f64>,
}

impl StationMap {
    /// The map of `system` about `base`, or `None` when a sample solve is not in the linear
    /// range (then the search solves each state in full).
    pub(super) fn of(
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

impl StationMap {
    /// True when every station's cl in the elevator-trimmed state `tp` lies inside its cl_min
    /// and cl_max by [`MAP_CLEAR_MARGIN`] on linear lift curves (no viscous polar).
    pub(super) fn clearly_inside_limits(
        &self,
        system: &MultiSurfaceSystem,
        tp: &TrimPoint,
    ) -> bool {
        system.stations().iter().enumerate().all(|(i, st)| {
            let cl = self.c0[i] + self.ca[i] * tp.alpha_rad + self.cd[i] * tp.control_rad;
            st.section.polar.is_none()
                && cl < st.section.cl_max - MAP_CLEAR_MARGIN
                && cl > st.section.cl_min + MAP_CLEAR_MARGIN
        })
    }
}

/// Margin in cl by which every station's cl from the linear map must lie inside its limits
/// for a trimmed state to be taken as inside them without a full solve: the map gives the
/// linear solution to round-off (about 1e-14 over the flight range), so with 1e-6 the full
/// solve would be linear and find no station at a limit (the same answer, without it).
pub(super) const MAP_CLEAR_MARGIN: f64 = 1e-6;

/// The station at its limit in a state with station lift coefficients `cls`: the one furthest
/// past its cl_max (`false`), else, when `count_negative`, the stabiliser station furthest
/// past its cl_min (`true`); `None` within the limits.
pub(super) fn limit_in(
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
        .filter(|(_, (_, s))| s.is_on(SurfaceRole::Stabiliser))
        .map(|(i, (cl, s))| (cl - s.section.cl_min, i))
        .min_by(|a, b| a.0.total_cmp(&b.0))
        .filter(|(m, _)| *m <= AT_LIMIT)
        .map(|(_, i)| (i, true))
}

/// Where the trimmed path meets its first limit, before the full solve there.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(super) struct PathLimit {
    /// The trimmed state there.
    pub(super) point: TrimPoint,
    /// The station at its limit and whether that is a stabiliser station at cl_min.
    pub(super) limit: Limit,
}

/// Root-finder settings of the search along the trimmed path: a limit bracketed by the scan
/// within one step is found to the width 40 halvings of the step gave (about 1e-13 in C_L).
/// Brent's method never needs more than about the square of the bisection count (Brent
/// 1973, ch. 4), so 2000 evaluations are never reached while a sign change is bracketed.
pub(super) const TRIM_PATH_ROOT: brent::Settings = brent::Settings {
    x_tolerance: TRIM_PATH_CL_STEP / (1u64 << 40) as f64,
    max_iterations: 2000,
};

/// How far a state with station lift coefficients `cls` lies past its nearest limit: the
/// largest cl / cl_max less one and, when `count_negative`, the stabiliser's least margin
/// above its cl_min taken negative, whichever is greater (each shifted by the round-off
/// allowance [`AT_LIMIT`]). Continuous in the cls, and >= 0 exactly where [`limit_in`] finds
/// a limit: the residual whose root along the trimmed path is the first limit.
pub(super) fn limit_residual(
    system: &MultiSurfaceSystem,
    cls: &[f64],
    count_negative: bool,
) -> f64 {
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
pub(super) fn stabiliser_least_margin(system: &MultiSurfaceSystem, cls: &[f64]) -> f64 {
    cls.iter()
        .zip(system.stations())
        .filter(|(_, s)| s.is_on(SurfaceRole::Stabiliser))
        .map(|(cl, s)| cl - s.section.cl_min)
        .fold(f64::INFINITY, f64::min)
}

/// The trimmed path of one system about one moment reference: the trimmed state at each C_L
/// with the elevator, and its stations' lift coefficients (from the linear map when there is
/// one, else from a full solve).
pub(super) struct TrimmedPath<'a> {
    pub(super) system: &'a MultiSurfaceSystem,
    pub(super) map: Option<&'a StationMap>,
    pub(super) base: &'a FlightCondition,
    pub(super) x_ref: f64,
    pub(super) z: f64,
    pub(super) count_negative: bool,
}

/// A search along the trimmed path that met a C_L without a trimmed state inside the bracket
/// (the residual has no value there), or a solve that failed.
#[derive(Debug, thiserror::Error)]
pub(super) enum PathError {
    #[error("no trimmed state inside the bracket")]
    NoTrim,
    #[error(transparent)]
    Solve(#[from] LiftingLineError),
}

impl TrimmedPath<'_> {
    /// The trimmed state at `cl`, or `None` where the elevator cannot trim there.
    pub(super) fn point(&self, cl: f64) -> Result<Option<TrimPoint>, LiftingLineError> {
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
    pub(super) fn condition(&self, tp: &TrimPoint) -> FlightCondition {
        let mut cond = self.base.clone();
        cond.alpha_rad = tp.alpha_rad;
        cond.elevator_rad = tp.control_rad;
        cond
    }

    /// The stations' lift coefficients in the trimmed state `tp`, written into `cls`.
    pub(super) fn station_cls(
        &self,
        tp: &TrimPoint,
        cls: &mut Vec<f64>,
    ) -> Result<(), LiftingLineError> {
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
    pub(super) fn residual(&self, cl: f64, cls: &mut Vec<f64>) -> Result<f64, PathError> {
        let tp = self.point(cl)?.ok_or(PathError::NoTrim)?;
        self.station_cls(&tp, cls)?;
        Ok(limit_residual(self.system, cls, self.count_negative))
    }

    /// The trimmed state at `cl` and the station at its limit there, if any.
    #[allow(clippy::type_complexity)]
    pub(super) fn state(
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
    pub(super) fn first_limit(
        &self,
        cls: &mut Vec<f64>,
    ) -> Result<Option<PathLimit>, LiftingLineError> {
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
    pub(super) fn bisect(
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
pub(super) fn first_trimmed_limit(
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
pub(super) fn stall_at(
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
pub(super) fn limit_is_finite(limit: &StallLimit) -> bool {
    match limit {
        StallLimit::ClMax => true,
        StallLimit::StabiliserClMin {
            cl_max_otherwise,
            speed_otherwise_m_s,
        } => cl_max_otherwise.is_finite() && speed_otherwise_m_s.is_finite(),
    }
}
