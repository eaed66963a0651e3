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

impl SectionModel {
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
