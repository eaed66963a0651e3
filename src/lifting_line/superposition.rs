//! Fast answers from the unit solutions of a [`MultiSurfaceSystem`]: linear-range C_L and C_m
//! with their alpha slopes, dC_m/dC_L, the neutral point, the angle of zero moment, trim with
//! the elevator or a surface's incidence, and the critical-section stall angle (with controls
//! held or trimmed).
//!
//! Every quantity is a weighted sum of the unit solutions (constant geometry, alpha, elevator,
//! each surface's incidence), so each call costs a few multiplications per surface; the force
//! direction uses the exact free-stream angle, C_m = A cos(alpha) + B sin(alpha) + C, where A,
//! B and C are linear in the controls. Valid below the first station's cl_max, where the
//! flat-top section model is linear.
//!
//! # References
//! - Superposition of solutions of a linear system (any linear-algebra text); its use for
//!   trim: B. Etkin and L. D. Reid, *Dynamics of Flight: Stability and Control*, 3rd ed., ch. 2
//!   (trim and the neutral point from C_m linear in alpha and the controls; from memory).
//! - Critical-section estimate of stall (common practice): the aircraft is taken to reach its
//!   maximum lift when its first section reaches cl_max, which is conservative because the
//!   other sections could still gain lift.

use super::multi_surface::{
    FlightCondition, MultiSurfaceSystem, UnitSums, UNIT_ALPHA, UNIT_ELEVATOR, UNIT_FIRST_INCIDENCE,
};
use super::LiftingLineError;
use crate::numeric::brent::{find_root, RootError, Settings};

/// The trimmed stall's angle is found to 1e-12 rad (about the rounding of the station loads).
const STALL_ROOT: Settings = Settings {
    x_tolerance: 1e-12,
    max_iterations: 200,
};

/// Which control a trim solve moves together with the angle of attack.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum TrimControl {
    /// The elevator deflection.
    Elevator,
    /// The incidence of the surface with this index (decalage).
    Incidence(usize),
}

/// The trimmed state at which the first station reaches its cl_max.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TrimmedStall {
    /// Angle of attack, rad.
    pub alpha_rad: f64,
    /// Total lift coefficient there (the critical-section C_L max).
    pub cl: f64,
    /// Trim control setting there, rad.
    pub control_rad: f64,
    /// Index of the first station to stall in [`MultiSurfaceSystem::stations`].
    pub station: usize,
    /// Its surface.
    pub surface: usize,
    /// Its spanwise position, percent of that surface's semispan.
    pub percent_semispan: f64,
}

fn control_value(cond: &FlightCondition, control: TrimControl) -> f64 {
    match control {
        TrimControl::Elevator => cond.elevator_rad,
        TrimControl::Incidence(s) => cond.incidence_change_rad.get(s).copied().unwrap_or(0.0),
    }
}

fn set_control(cond: &mut FlightCondition, control: TrimControl, value: f64) {
    match control {
        TrimControl::Elevator => cond.elevator_rad = value,
        TrimControl::Incidence(s) => {
            if let Some(v) = cond.incidence_change_rad.get_mut(s) {
                *v = value;
            }
        }
    }
}

/// A trimmed state of the linear model.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TrimPoint {
    /// Angle of attack, rad.
    pub alpha_rad: f64,
    /// Total lift coefficient on the reference area.
    pub cl: f64,
    /// Setting of the trim control (elevator or incidence change), rad; zero when none moved.
    pub control_rad: f64,
}

/// Linear-range coefficients of the whole aircraft at one condition.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LinearCoefficients {
    /// Total lift coefficient.
    pub cl: f64,
    /// Total pitching-moment coefficient about the given point (nose up positive).
    pub cm: f64,
    /// dC_L / d alpha, per rad.
    pub cl_alpha_per_rad: f64,
    /// dC_m / d alpha, per rad.
    pub cm_alpha_per_rad: f64,
}

impl MultiSurfaceSystem {
    /// Linear-range C_L, C_m about (x_ref_m, z_ref_m) and their alpha derivatives at `cond`,
    /// from the unit solutions alone (no stall limits; microseconds).
    pub fn linear_coefficients(
        &self,
        cond: &FlightCondition,
        x_ref_m: f64,
        z_ref_m: f64,
    ) -> Result<LinearCoefficients, LiftingLineError> {
        let q = self.weights(cond)?;
        let c = self.reference.mac_m;
        let a = cond.alpha_rad;
        let (mut cl, mut cm, mut cl_a, mut cm_a) = (0.0, 0.0, 0.0, 0.0);
        for s in 0..self.surfaces.len() {
            let sums = self.combined(s, &q);
            let unit_alpha = &self.unit_sums[s][UNIT_ALPHA];
            cl += sums.cl;
            cm += sums.cm(a, x_ref_m, z_ref_m, c);
            cl_a += unit_alpha.cl;
            cm_a += unit_alpha.cm(a, x_ref_m, z_ref_m, c)
                + sums.dcm_dalpha_partial(a, x_ref_m, z_ref_m, c);
        }
        Ok(LinearCoefficients {
            cl,
            cm,
            cl_alpha_per_rad: cl_a,
            cm_alpha_per_rad: cm_a,
        })
    }

    /// dC_m/dC_L about (x_ref_m, z_ref_m) at `cond`, linear range.
    pub fn dcm_dcl(
        &self,
        cond: &FlightCondition,
        x_ref_m: f64,
        z_ref_m: f64,
    ) -> Result<f64, LiftingLineError> {
        let k = self.linear_coefficients(cond, x_ref_m, z_ref_m)?;
        let ratio = k.cm_alpha_per_rad / k.cl_alpha_per_rad;
        if !ratio.is_finite() {
            return Err(LiftingLineError::NonFinite {
                quantity: "dC_m/dC_L (zero lift slope)",
            });
        }
        Ok(ratio)
    }

    /// The neutral point: the x (m) about which dC_m/dC_L = 0 at `cond`, for a reference
    /// height `z_ref_m` (dC_m/d alpha is linear in x, so this is exact for the linear model).
    pub fn neutral_point_x_m(
        &self,
        cond: &FlightCondition,
        z_ref_m: f64,
    ) -> Result<f64, LiftingLineError> {
        let at0 = self
            .linear_coefficients(cond, 0.0, z_ref_m)?
            .cm_alpha_per_rad;
        let at1 = self
            .linear_coefficients(cond, 1.0, z_ref_m)?
            .cm_alpha_per_rad;
        let slope = at1 - at0;
        let x = -at0 / slope;
        if !x.is_finite() {
            return Err(LiftingLineError::NonFinite {
                quantity: "neutral point",
            });
        }
        Ok(x)
    }

    /// The angle of attack at which C_m about (x_ref_m, z_ref_m) is zero with the controls of
    /// `cond` held (linear model, closed form: C_m = A cos alpha + B sin alpha + C).
    pub fn alpha_for_zero_moment(
        &self,
        cond: &FlightCondition,
        x_ref_m: f64,
        z_ref_m: f64,
    ) -> Result<TrimPoint, LiftingLineError> {
        let mut q = self.weights(cond)?;
        let c = self.reference.mac_m;
        // C_m(alpha) = sum over units of q_k [cos a (mx + x cl/c) + sin a (mz + z cl/c) + sec],
        // with q_alpha = alpha: collect the parts independent of alpha and proportional to it.
        q[UNIT_ALPHA] = 0.0;
        let (mut fixed, mut per_alpha) = (UnitSums::default(), UnitSums::default());
        for s in 0..self.surfaces.len() {
            fixed.add_scaled(&self.combined(s, &q), 1.0);
            per_alpha.add_scaled(&self.unit_sums[s][UNIT_ALPHA], 1.0);
        }
        let g =
            |a: f64| fixed.cm(a, x_ref_m, z_ref_m, c) + a * per_alpha.cm(a, x_ref_m, z_ref_m, c);
        let dg = |a: f64| {
            fixed.dcm_dalpha_partial(a, x_ref_m, z_ref_m, c)
                + per_alpha.cm(a, x_ref_m, z_ref_m, c)
                + a * per_alpha.dcm_dalpha_partial(a, x_ref_m, z_ref_m, c)
        };
        // Newton from the small-angle root.
        let mut a = {
            let slope = dg(0.0);
            if slope.abs() > 0.0 {
                -g(0.0) / slope
            } else {
                0.0
            }
        };
        for _ in 0..30 {
            let step = g(a) / dg(a);
            if !step.is_finite() {
                break;
            }
            a -= step;
            if step.abs() < 1e-14 {
                break;
            }
        }
        if !(a.is_finite() && a.abs() < 1.5 && g(a).abs() < 1e-10) {
            return Err(LiftingLineError::NoTrim { x_ref_m });
        }
        let cl = fixed.cl + a * per_alpha.cl;
        Ok(TrimPoint {
            alpha_rad: a,
            cl,
            control_rad: 0.0,
        })
    }

    /// The angle of attack and the setting of `control` (elevator, or a surface's incidence
    /// change) that give total lift `cl_target` with zero C_m about (x_ref_m, z_ref_m); the
    /// other controls are taken from `base`. Linear model; Newton on two unknowns.
    pub fn trim_for_cl(
        &self,
        base: &FlightCondition,
        control: TrimControl,
        cl_target: f64,
        x_ref_m: f64,
        z_ref_m: f64,
    ) -> Result<TrimPoint, LiftingLineError> {
        let unit = self.control_unit(control)?;
        let mut cond = base.clone();
        self.weights(&cond)?;
        let set = |cond: &mut FlightCondition, v: f64| set_control(cond, control, v);
        let get = |cond: &FlightCondition| control_value(cond, control);
        let c = self.reference.mac_m;
        for _ in 0..30 {
            let k = self.linear_coefficients(&cond, x_ref_m, z_ref_m)?;
            let (mut cl_u, mut cm_u) = (0.0, 0.0);
            for s in 0..self.surfaces.len() {
                cl_u += self.unit_sums[s][unit].cl;
                cm_u += self.unit_sums[s][unit].cm(cond.alpha_rad, x_ref_m, z_ref_m, c);
            }
            let (r1, r2) = (k.cl - cl_target, k.cm);
            let det = k.cl_alpha_per_rad * cm_u - cl_u * k.cm_alpha_per_rad;
            if det.abs() <= 1e-14 || !det.is_finite() {
                return Err(LiftingLineError::NoTrim { x_ref_m });
            }
            let da = -(r1 * cm_u - cl_u * r2) / det;
            let du = -(k.cl_alpha_per_rad * r2 - k.cm_alpha_per_rad * r1) / det;
            cond.alpha_rad += da;
            let v = get(&cond) + du;
            set(&mut cond, v);
            if !(cond.alpha_rad.abs() < 1.5 && v.abs() < 1.5) {
                return Err(LiftingLineError::NoTrim { x_ref_m });
            }
            if da.abs() < 1e-14 && du.abs() < 1e-14 {
                break;
            }
        }
        let k = self.linear_coefficients(&cond, x_ref_m, z_ref_m)?;
        if (k.cl - cl_target).abs() > 1e-9 || k.cm.abs() > 1e-9 {
            return Err(LiftingLineError::NoTrim { x_ref_m });
        }
        Ok(TrimPoint {
            alpha_rad: cond.alpha_rad,
            cl: k.cl,
            control_rad: get(&cond),
        })
    }

    /// The angle of attack at which the first station reaches its cl_max with the controls of
    /// `cond` held (linear model; the critical-section estimate of stall), with that station's
    /// index; `None` when no station's cl rises with alpha.
    pub fn first_stall_alpha_rad(
        &self,
        cond: &FlightCondition,
    ) -> Result<Option<(f64, usize)>, LiftingLineError> {
        let mut q = self.weights(cond)?;
        q[UNIT_ALPHA] = 0.0;
        let (g0, ga) = self.linear_circulation(&q);
        let mut best: Option<(f64, usize)> = None;
        for (i, st) in self.stations.iter().enumerate() {
            let slope = 2.0 * ga[i] / st.chord_m;
            if slope > 0.0 {
                let a = (st.section.cl_max - 2.0 * g0[i] / st.chord_m) / slope;
                if best.is_none_or(|(b, _)| a < b) {
                    best = Some((a, i));
                }
            }
        }
        Ok(best)
    }

    /// The trimmed state at which the first station of any surface reaches its cl_max (the
    /// critical-section estimate of the aircraft's maximum lift: conservative, since the other
    /// stations could still gain lift). At each angle of attack `control` is set so that C_m
    /// about (x_ref_m, z_ref_m) is zero; the other controls are taken from `base`. Linear model:
    /// the flat-top sections are exact up to that point. The search scans alpha from -0.2 to
    /// 0.8 rad in 0.01 rad steps and refines the first crossing by Brent's method
    /// ([`crate::numeric::brent`]).
    pub fn trimmed_stall(
        &self,
        base: &FlightCondition,
        control: TrimControl,
        x_ref_m: f64,
        z_ref_m: f64,
    ) -> Result<TrimmedStall, LiftingLineError> {
        const ALPHA_LOW_RAD: f64 = -0.2;
        const ALPHA_HIGH_RAD: f64 = 0.8;
        const STEP_RAD: f64 = 0.01;
        let unit = self.control_unit(control)?;
        let c = self.reference.mac_m;
        // The trimmed condition at alpha and its largest cl / cl_max.
        let state = |alpha: f64| -> Result<(FlightCondition, f64, usize), LiftingLineError> {
            let mut cond = base.clone();
            cond.alpha_rad = alpha;
            let cm = self.linear_coefficients(&cond, x_ref_m, z_ref_m)?.cm;
            let cm_u: f64 = (0..self.surfaces.len())
                .map(|s| self.unit_sums[s][unit].cm(alpha, x_ref_m, z_ref_m, c))
                .sum();
            if cm_u.abs() <= 1e-14 {
                return Err(LiftingLineError::NoTrim { x_ref_m });
            }
            let v = control_value(&cond, control) - cm / cm_u;
            set_control(&mut cond, control, v);
            let q = self.weights(&cond)?;
            let (g, _) = self.linear_circulation(&q);
            let (mut best, mut at) = (f64::NEG_INFINITY, 0);
            for (i, st) in self.stations.iter().enumerate() {
                let ratio = 2.0 * g[i] / (st.chord_m * st.section.cl_max);
                if ratio > best {
                    best = ratio;
                    at = i;
                }
            }
            Ok((cond, best - 1.0, at))
        };
        let not_found = LiftingLineError::StallNotFound {
            alpha_low_rad: ALPHA_LOW_RAD,
            alpha_high_rad: ALPHA_HIGH_RAD,
        };
        let (mut lo, mut f_lo) = (ALPHA_LOW_RAD, state(ALPHA_LOW_RAD)?.1);
        if f_lo >= 0.0 {
            return Err(not_found);
        }
        let steps = ((ALPHA_HIGH_RAD - ALPHA_LOW_RAD) / STEP_RAD).round() as usize;
        let mut bracket = None;
        for k in 1..=steps {
            let a = ALPHA_LOW_RAD + k as f64 * STEP_RAD;
            let f = state(a)?.1;
            if f >= 0.0 {
                bracket = Some((a, f));
                break;
            }
            (lo, f_lo) = (a, f);
        }
        let Some((hi, f_hi)) = bracket else {
            return Err(not_found);
        };
        // The largest cl / cl_max is a maximum of functions linear in alpha: continuous, so
        // Brent's method closes the bracket; its end at or past cl_max is kept.
        let root = find_root(
            |a| state(a).map(|s| s.1),
            (lo, f_lo),
            (hi, f_hi),
            STALL_ROOT,
        )
        .map_err(|e| match e {
            RootError::Function(inner) => inner,
            _ => not_found.clone(),
        })?;
        let hi = root.nonnegative_end();
        let (cond, _, station) = state(hi)?;
        let cl = self.linear_coefficients(&cond, x_ref_m, z_ref_m)?.cl;
        Ok(TrimmedStall {
            alpha_rad: cond.alpha_rad,
            cl,
            control_rad: control_value(&cond, control),
            station,
            surface: self.stations[station].surface,
            percent_semispan: self.stations[station].percent_semispan,
        })
    }

    fn control_unit(&self, control: TrimControl) -> Result<usize, LiftingLineError> {
        match control {
            TrimControl::Elevator => Ok(UNIT_ELEVATOR),
            TrimControl::Incidence(s) if s < self.surfaces.len() => Ok(UNIT_FIRST_INCIDENCE + s),
            TrimControl::Incidence(s) => Err(LiftingLineError::SurfaceCount {
                what: "trim surface index",
                got: s,
                expected: self.surfaces.len(),
            }),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::lifting_line::multi_surface::tests::{plate, wing_and_tail};
    use approx::assert_relative_eq;

    // Analytic dC_m/d alpha against a central finite difference (STYLE.md: analytic
    // derivatives against finite differences). Tolerance 1e-7: the difference step.
    #[test]
    fn moment_slope_matches_finite_difference() {
        let sections = [plate(2.0)];
        let sys = wing_and_tail(&sections);
        let (x, z, h) = (0.1, 0.05, 1e-5);
        let at = |a: f64| sys.linear_coefficients(&sys.condition(a), x, z).unwrap();
        let k = at(0.1);
        let fd_cm = (at(0.1 + h).cm - at(0.1 - h).cm) / (2.0 * h);
        let fd_cl = (at(0.1 + h).cl - at(0.1 - h).cl) / (2.0 * h);
        assert_relative_eq!(k.cm_alpha_per_rad, fd_cm, epsilon = 1e-7);
        assert_relative_eq!(k.cl_alpha_per_rad, fd_cl, epsilon = 1e-7);
    }

    // Law: the trimmed stall state has C_m = 0 and its first station exactly at cl_max in a
    // full solve.
    #[test]
    fn trimmed_stall_is_trimmed_and_on_cl_max() {
        let sections = [plate(1.1)];
        let sys = wing_and_tail(&sections);
        let (x, z) = (0.05, 0.0);
        let t = sys
            .trimmed_stall(&sys.condition(0.0), TrimControl::Elevator, x, z)
            .unwrap();
        let mut cond = sys.condition(t.alpha_rad);
        cond.elevator_rad = t.control_rad;
        let r = sys.solve(&cond).unwrap();
        assert_relative_eq!(r.cm(x, z), 0.0, epsilon = 1e-9);
        assert_relative_eq!(r.stall.cl_ratio, 1.0, epsilon = 1e-9);
        assert_relative_eq!(r.cl, t.cl, epsilon = 1e-9);
        assert_eq!(r.stall.station, t.station);
    }

    // Law: at the first-stall angle the most loaded station is exactly at cl_max.
    #[test]
    fn first_stall_angle_puts_one_station_on_cl_max() {
        let sections = [plate(1.1)];
        let sys = wing_and_tail(&sections);
        let (alpha, index) = sys
            .first_stall_alpha_rad(&sys.condition(0.0))
            .unwrap()
            .unwrap();
        let r = sys.solve(&sys.condition(alpha)).unwrap();
        assert_relative_eq!(r.stall.cl_ratio, 1.0, epsilon = 1e-9);
        assert_eq!(r.stall.station, index);
    }
}
