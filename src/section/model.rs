//! The section model handed from the 2-D methods to the wing model.
//!
//! A linear lift curve `cl = a (alpha - alpha_L0)` between a negative and a positive stall
//! limit, a constant moment about the aerodynamic centre, and a flat-top stall model: past
//! `cl_max` (or below `cl_min`) the lift coefficient is held at the limit. The flat top is a
//! deliberate simplification: it marks where a section stops gaining lift, which is all the
//! critical-section stall estimate needs; it says nothing about the post-stall drop.

use crate::model::SectionMethod;
use crate::section::polar::Polar;
use std::sync::Arc;

/// Where a section's cl_max came from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ClMaxSource {
    /// Given by the builder in the aircraft file.
    Given,
    /// The conservative default (see [`DEFAULT_CL_MAX`]).
    Default,
}

/// Conservative default section cl_max for model-scale Reynolds numbers when none is given
/// (common practice: thin cambered model sections reach about 1.0 to 1.3 at Re 1e5 to 3e5).
pub const DEFAULT_CL_MAX: f64 = 1.0;

/// Lift and moment characteristics of one airfoil section (2-D, incompressible).
#[derive(Debug, Clone, PartialEq)]
pub struct SectionModel {
    /// Method that produced the numbers.
    pub method: SectionMethod,
    /// Zero-lift angle of attack, rad (negative for positive camber).
    pub alpha_zero_lift_rad: f64,
    /// Lift slope dcl/dalpha, per rad.
    pub cl_alpha_per_rad: f64,
    /// Pitching-moment coefficient about the aerodynamic centre (positive nose up).
    pub cm_ac: f64,
    /// Aerodynamic-centre position, fraction of chord aft of the leading edge.
    pub x_ac_c: f64,
    /// Positive stall limit of cl.
    pub cl_max: f64,
    /// Negative stall limit of cl (a negative number).
    pub cl_min: f64,
    /// Where `cl_max` came from.
    pub cl_max_source: ClMaxSource,
    /// Chord Reynolds number the numbers were computed at (`None`: an inviscid method).
    pub reynolds_number: Option<f64>,
    /// The viscous polar behind the numbers, for a wing model that takes cl(alpha) and
    /// cd(cl) per station (`None`: an inviscid method). Shared, not copied, between the
    /// stations that use the same section.
    pub polar: Option<Arc<Polar>>,
}

impl LiftPoint {
    /// Beyond the end of a polar the curve is held flat: detached when `beyond`.
    fn clamp_attached(mut self, beyond: bool) -> Self {
        if beyond {
            self.attached = false;
            self.slope_per_rad = 0.0;
        }
        self
    }
}

/// One point of a section's lift curve as the wing model uses it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LiftPoint {
    /// Lift coefficient.
    pub cl: f64,
    /// Its slope dcl/dalpha there, per rad (zero on a stall limit).
    pub slope_per_rad: f64,
    /// False on a stall limit (cl held at cl_max or cl_min).
    pub attached: bool,
}

impl SectionModel {
    /// The lift curve the wing model's strip relation uses, at the section's angle of attack
    /// `alpha_rad` from its chord line, with the zero-lift angle moved by `zero_shift_rad` (a
    /// flap's effect). Without a polar: the linear curve with the flat-top stall. With a
    /// viscous polar: its converged points interpolated linearly (moved by the same shift),
    /// held flat beyond its last point on either side, and never above `cl_max` nor below
    /// `cl_min` (the stall limits in force stay the ones the analysis states).
    pub fn lift_point(&self, alpha_rad: f64, zero_shift_rad: f64) -> LiftPoint {
        let limited = |cl: f64, slope: f64| {
            if cl > self.cl_max {
                LiftPoint {
                    cl: self.cl_max,
                    slope_per_rad: 0.0,
                    attached: false,
                }
            } else if cl < self.cl_min {
                LiftPoint {
                    cl: self.cl_min,
                    slope_per_rad: 0.0,
                    attached: false,
                }
            } else {
                LiftPoint {
                    cl,
                    slope_per_rad: slope,
                    attached: true,
                }
            }
        };
        if let Some(p) = self.polar.as_deref() {
            let pts: Vec<(f64, f64)> = p.points().map(|q| (q.alpha_rad, q.cl)).collect();
            if pts.len() >= 2 {
                let a = alpha_rad - zero_shift_rad;
                let (first, last) = (pts[0], pts[pts.len() - 1]);
                if a <= first.0 {
                    return limited(first.1, 0.0).clamp_attached(a < first.0);
                }
                if a >= last.0 {
                    return limited(last.1, 0.0).clamp_attached(a > last.0);
                }
                for w in pts.windows(2) {
                    let ((a0, c0), (a1, c1)) = (w[0], w[1]);
                    if a <= a1 && a1 > a0 {
                        let slope = (c1 - c0) / (a1 - a0);
                        return limited(c0 + slope * (a - a0), slope);
                    }
                }
            }
        }
        limited(
            self.cl_alpha_per_rad * (alpha_rad - zero_shift_rad - self.alpha_zero_lift_rad),
            self.cl_alpha_per_rad,
        )
    }

    /// Lift coefficient at angle of attack `alpha_rad` (flat-top stall model).
    pub fn cl(&self, alpha_rad: f64) -> f64 {
        self.cl_linear(alpha_rad).clamp(self.cl_min, self.cl_max)
    }

    /// Lift coefficient of the linear lift curve, without the stall limits.
    pub fn cl_linear(&self, alpha_rad: f64) -> f64 {
        self.cl_alpha_per_rad * (alpha_rad - self.alpha_zero_lift_rad)
    }

    /// dcl/dalpha at `alpha_rad`, per rad: the lift slope inside the limits, zero outside.
    pub fn dcl_dalpha(&self, alpha_rad: f64) -> f64 {
        let cl = self.cl_linear(alpha_rad);
        if cl > self.cl_max || cl < self.cl_min {
            0.0
        } else {
            self.cl_alpha_per_rad
        }
    }

    /// Angle of attack at which the linear lift curve reaches `cl`, rad.
    pub fn alpha_for_cl(&self, cl: f64) -> f64 {
        self.alpha_zero_lift_rad + cl / self.cl_alpha_per_rad
    }

    /// Pitching-moment coefficient about the quarter chord at lift coefficient `cl`:
    /// `cm_c/4 = cm_ac + cl (0.25 - x_ac/c)` (moment transfer, positive nose up).
    pub fn cm_quarter_chord(&self, cl: f64) -> f64 {
        self.cm_ac + cl * (0.25 - self.x_ac_c)
    }

    /// Linear blend `(1 - w) self + w other` of two sections, used between a panel's end
    /// airfoils (w = 0 at `self`, 1 at `other`). The method and cl_max source are taken from the
    /// nearer end; a default at either end marks the blend as default.
    pub fn blend(&self, other: &SectionModel, w: f64) -> SectionModel {
        let w = w.clamp(0.0, 1.0);
        let mix = |a: f64, b: f64| (1.0 - w) * a + w * b;
        SectionModel {
            method: if w < 0.5 { self.method } else { other.method },
            alpha_zero_lift_rad: mix(self.alpha_zero_lift_rad, other.alpha_zero_lift_rad),
            cl_alpha_per_rad: mix(self.cl_alpha_per_rad, other.cl_alpha_per_rad),
            cm_ac: mix(self.cm_ac, other.cm_ac),
            x_ac_c: mix(self.x_ac_c, other.x_ac_c),
            cl_max: mix(self.cl_max, other.cl_max),
            cl_min: mix(self.cl_min, other.cl_min),
            cl_max_source: if self.cl_max_source == ClMaxSource::Default
                || other.cl_max_source == ClMaxSource::Default
            {
                ClMaxSource::Default
            } else {
                ClMaxSource::Given
            },
            reynolds_number: match (self.reynolds_number, other.reynolds_number) {
                (Some(a), Some(b)) => Some(mix(a, b)),
                (a, b) => a.or(b),
            },
            polar: if w < 0.5 {
                self.polar.clone()
            } else {
                other.polar.clone()
            },
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn thin_flat_plate() -> SectionModel {
        SectionModel {
            method: SectionMethod::Thin,
            alpha_zero_lift_rad: 0.0,
            cl_alpha_per_rad: 2.0 * std::f64::consts::PI,
            cm_ac: 0.0,
            x_ac_c: 0.25,
            cl_max: 1.0,
            cl_min: -1.0,
            cl_max_source: ClMaxSource::Given,
            reynolds_number: None,
            polar: None,
        }
    }

    #[test]
    fn flat_top_holds_cl_at_the_limits() {
        let s = thin_flat_plate();
        assert_relative_eq!(s.cl(0.1), 0.2 * std::f64::consts::PI, epsilon = 1e-12);
        assert_relative_eq!(s.cl(1.0), 1.0, epsilon = 1e-12);
        assert_relative_eq!(s.cl(-1.0), -1.0, epsilon = 1e-12);
        assert_relative_eq!(s.dcl_dalpha(1.0), 0.0, epsilon = 1e-12);
    }

    #[test]
    fn alpha_for_cl_inverts_the_linear_curve() {
        let mut s = thin_flat_plate();
        s.alpha_zero_lift_rad = -0.03;
        let a = s.alpha_for_cl(0.5);
        assert_relative_eq!(s.cl_linear(a), 0.5, epsilon = 1e-12);
    }

    #[test]
    fn moment_transfer_from_ac_to_quarter_chord() {
        let mut s = thin_flat_plate();
        s.x_ac_c = 0.24;
        s.cm_ac = -0.05;
        // cm about c/4 = cm_ac + cl (0.25 - 0.24)
        assert_relative_eq!(s.cm_quarter_chord(0.8), -0.05 + 0.008, epsilon = 1e-12);
    }
}
