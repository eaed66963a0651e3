//! Glauert's plain-flap result from thin-airfoil theory: lift and moment change per radian of
//! flap (or elevator) deflection.
//!
//! A flap of chord fraction `F` hinged at `x_h/c = 1 - F` and deflected by `delta` (rad,
//! trailing edge down positive) adds a slope `-delta` to the mean line aft of the hinge.
//! With `cos theta_h = 2 F - 1` (the hinge in Glauert's variable):
//!
//! - flap effectiveness `tau = dalpha_L0/ddelta (negated) = 1 - (theta_h - sin theta_h) / pi`,
//! - `dcl/ddelta = 2 pi tau = 2 (pi - theta_h + sin theta_h)` per rad,
//! - `dcm_c/4/ddelta = -(1/2) sin theta_h (1 - cos theta_h)` per rad (nose down for a flap
//!   deflected down).
//!
//! Thin-airfoil theory over-predicts measured flap effectiveness, most for small flap chords
//! and large deflections (gap leakage and the boundary layer are ignored).
//!
//! # References
//! - Glauert, H. (1927). Theoretical relationships for an aerofoil with hinged flap. ARC
//!   R&M 1095.
//! - Houghton, E. L., Carpenter, P. W. (2003). Aerodynamics for Engineering Students, 5th ed.,
//!   Butterworth-Heinemann, eqs. 4.49-4.52.

use std::f64::consts::PI;

/// Errors of the flap model.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum FlapError {
    /// Flap-chord fraction outside (0, 1] or not finite.
    #[error("flap-chord fraction {0} is outside the accepted range 0 < F <= 1")]
    ChordFraction(f64),
}

/// Lift and moment derivatives of a plain flap.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FlapEffect {
    /// Flap-chord fraction F (flap chord / section chord).
    pub chord_fraction: f64,
    /// Flap effectiveness tau: change of zero-lift angle per flap angle, negated (0..1).
    pub tau: f64,
    /// dcl/ddelta, per rad of flap deflection.
    pub dcl_ddelta_per_rad: f64,
    /// dcm_c/4/ddelta, per rad of flap deflection (positive nose up).
    pub dcm_quarter_chord_ddelta_per_rad: f64,
}

/// Glauert's plain-flap derivatives for flap-chord fraction `chord_fraction` (0 < F <= 1).
pub fn plain_flap(chord_fraction: f64) -> Result<FlapEffect, FlapError> {
    if !(chord_fraction > 0.0 && chord_fraction <= 1.0) {
        return Err(FlapError::ChordFraction(chord_fraction));
    }
    let theta_h = (2.0 * chord_fraction - 1.0).clamp(-1.0, 1.0).acos();
    let tau = 1.0 - (theta_h - theta_h.sin()) / PI;
    Ok(FlapEffect {
        chord_fraction,
        tau,
        dcl_ddelta_per_rad: 2.0 * PI * tau,
        dcm_quarter_chord_ddelta_per_rad: -0.5 * theta_h.sin() * (1.0 - theta_h.cos()),
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::section::thin_airfoil::{SlopeFn, ThinAirfoil};
    use approx::assert_relative_eq;

    #[test]
    fn quarter_chord_flap_matches_published_numbers() {
        // Houghton & Carpenter, eqs. 4.49-4.52, evaluated at F = 0.25 (theta_h = 2 pi / 3):
        // tau 0.6090, dcl/ddelta 3.8264, dcm/ddelta -0.6495 per rad; 1e-4 is the rounding.
        let f = plain_flap(0.25).unwrap();
        assert_relative_eq!(f.tau, 0.6090, epsilon = 1e-4);
        assert_relative_eq!(f.dcl_ddelta_per_rad, 3.8264, epsilon = 1e-4);
        assert_relative_eq!(f.dcm_quarter_chord_ddelta_per_rad, -0.6495, epsilon = 1e-4);
    }

    #[test]
    fn whole_chord_flap_is_an_angle_of_attack_change() {
        // F = 1 deflects the whole chord: tau = 1 and no moment about c/4 (thin-airfoil theory).
        let f = plain_flap(1.0).unwrap();
        assert_relative_eq!(f.tau, 1.0, epsilon = 1e-12);
        assert_relative_eq!(f.dcm_quarter_chord_ddelta_per_rad, 0.0, epsilon = 1e-12);
    }

    #[test]
    fn agrees_with_thin_airfoil_quadrature_of_the_kinked_mean_line() {
        // The closed form against the general quadrature on the mean line with slope -delta
        // aft of the hinge (same theory, independent evaluation); 1e-10 for quadrature error.
        for &f in &[0.1, 0.3, 0.5, 0.8] {
            let delta = 0.01;
            let hinge = 1.0 - f;
            let kinked = ThinAirfoil::solve(&SlopeFn {
                slope: move |x| if x > hinge { -delta } else { 0.0 },
                joints: vec![hinge],
            });
            let e = plain_flap(f).unwrap();
            assert_relative_eq!(
                kinked.cl(0.0),
                e.dcl_ddelta_per_rad * delta,
                epsilon = 1e-10
            );
            assert_relative_eq!(
                kinked.cm_quarter_chord(),
                e.dcm_quarter_chord_ddelta_per_rad * delta,
                epsilon = 1e-10
            );
        }
    }

    #[test]
    fn rejects_fractions_outside_the_chord() {
        assert!(plain_flap(0.0).is_err());
        assert!(plain_flap(1.2).is_err());
        assert!(plain_flap(f64::NAN).is_err());
    }
}
