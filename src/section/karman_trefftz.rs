//! Karman-Trefftz airfoils, exact: the Joukowski construction with a finite trailing-edge
//! angle.
//!
//! The map `(z - n b) / (z + n b) = ((zeta - b) / (zeta + b))^n` with `n = 2 - tau / pi`
//! turns a circle through `zeta = b` into an airfoil whose trailing edge has the included angle
//! `tau`; at `tau = 0` (n = 2) it is the Joukowski map `z = zeta + b^2 / zeta`. Its
//! derivative is `dz/dzeta = 4 n^2 b^2 q / ((1 - q)^2 (zeta^2 - b^2))` with
//! `q = ((zeta - b) / (zeta + b))^n`, and far away `z = zeta + (n^2 - 1) b^2 / (3 zeta) + ...`,
//! which is all Blasius' theorem needs for the exact moment. With a finite angle the trailing
//! edge is a stagnation point. Here b = 1. Flow solution and conventions: see
//! [`crate::section::circle_map`].
//!
//! # References
//! - von Karman, Th., Trefftz, E. (1918). Potentialstroemung um gegebene Tragflaechenquerschnitte.
//!   Zeitschrift fuer Flugtechnik und Motorluftschiffahrt 9, 111-116.
//! - Milne-Thomson, L. M. (1968). Theoretical Hydrodynamics, 5th ed.
//!   (Karman-Trefftz profiles).
//! - Katz, J., Plotkin, A. (2001). Low-Speed Aerodynamics, 2nd ed., ch. 6.

use crate::section::circle_map::{CircleAirfoil, CircleMap, CircleMapError, C64};
use std::f64::consts::PI;

/// Largest trailing-edge angle accepted, rad (about 57 deg; beyond it the shapes stop looking
/// like wing sections).
pub const MAX_TRAILING_EDGE_ANGLE_RAD: f64 = 1.0;

/// The Karman-Trefftz map with b = 1 and exponent n = 2 - tau / pi.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct KarmanTrefftzMap {
    n: f64,
}

impl KarmanTrefftzMap {
    /// The map for trailing-edge angle `tau_rad` (0 <= tau < [`MAX_TRAILING_EDGE_ANGLE_RAD`]).
    pub fn new(tau_rad: f64) -> Result<Self, CircleMapError> {
        if !(0.0..MAX_TRAILING_EDGE_ANGLE_RAD).contains(&tau_rad) {
            return Err(CircleMapError::TrailingEdgeAngle(tau_rad));
        }
        Ok(KarmanTrefftzMap {
            n: 2.0 - tau_rad / PI,
        })
    }

    /// The exponent n.
    pub fn exponent(&self) -> f64 {
        self.n
    }

    fn q(&self, zeta: C64) -> C64 {
        let one = C64::new(1.0, 0.0);
        ((zeta - one) / (zeta + one)).powf(self.n)
    }
}

impl CircleMap for KarmanTrefftzMap {
    fn b(&self) -> f64 {
        1.0
    }
    fn z(&self, zeta: C64) -> C64 {
        let one = C64::new(1.0, 0.0);
        let q = self.q(zeta);
        (one + q) / (one - q) * self.n
    }
    fn dz_dzeta(&self, zeta: C64) -> C64 {
        let one = C64::new(1.0, 0.0);
        let q = self.q(zeta);
        let d = one - q;
        q * (4.0 * self.n * self.n) / (d * d * (zeta * zeta - one))
    }
    fn far_field_k(&self) -> f64 {
        (self.n * self.n - 1.0) / 3.0
    }
    fn trailing_edge_velocity(&self, dw_dzeta: C64) -> C64 {
        if self.n < 2.0 {
            // dz/dzeta vanishes like (zeta - b)^(n - 1), W like (zeta - b): the ratio goes to 0.
            C64::new(0.0, 0.0)
        } else {
            // The cusp (n = 2): the Joukowski limit (dW/dzeta) / (d2z/dzeta2), d2z = 2 / b.
            dw_dzeta * 0.5
        }
    }
}

/// A Karman-Trefftz airfoil (see the module documentation).
pub type KarmanTrefftzAirfoil = CircleAirfoil<KarmanTrefftzMap>;

impl CircleAirfoil<KarmanTrefftzMap> {
    /// The airfoil of the circle centred at `(mu_x, mu_y)` through `zeta = 1`, with
    /// trailing-edge angle `tau_rad`.
    pub fn from_circle(mu_x: f64, mu_y: f64, tau_rad: f64) -> Result<Self, CircleMapError> {
        CircleAirfoil::with_map(KarmanTrefftzMap::new(tau_rad)?, mu_x, mu_y)
    }

    /// The airfoil with the given greatest thickness and camber (fractions of chord) and
    /// trailing-edge angle, found by solving for the circle centre.
    pub fn from_shape(
        thickness_ratio: f64,
        camber_ratio: f64,
        tau_rad: f64,
    ) -> Result<Self, CircleMapError> {
        let map = KarmanTrefftzMap::new(tau_rad)?;
        CircleAirfoil::with_shape(move || map, thickness_ratio, camber_ratio)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::section::joukowski::JoukowskiMap;
    use approx::assert_relative_eq;

    #[test]
    fn map_and_derivative_reduce_to_joukowski_at_zero_angle() {
        let kt = KarmanTrefftzMap::new(0.0).unwrap();
        for &(x, y) in &[(1.3, 0.4), (-1.2, 0.1), (0.2, -1.1), (2.5, -0.7)] {
            let zeta = C64::new(x, y);
            assert_relative_eq!(
                (kt.z(zeta) - JoukowskiMap.z(zeta)).norm(),
                0.0,
                epsilon = 1e-13
            );
            assert_relative_eq!(
                (kt.dz_dzeta(zeta) - JoukowskiMap.dz_dzeta(zeta)).norm(),
                0.0,
                epsilon = 1e-13
            );
        }
    }

    #[test]
    fn derivative_matches_finite_difference() {
        // Central difference with step 1e-6: truncation about 1e-12, rounding about 1e-10.
        let kt = KarmanTrefftzMap::new(0.3).unwrap();
        let zeta = C64::new(-0.7, 1.2);
        let h = 1e-6;
        let fd = (kt.z(zeta + C64::new(h, 0.0)) - kt.z(zeta - C64::new(h, 0.0))) / (2.0 * h);
        assert_relative_eq!((fd - kt.dz_dzeta(zeta)).norm(), 0.0, epsilon = 1e-8);
    }

    #[test]
    fn far_field_constant_matches_the_map() {
        // z - zeta ~ k / zeta far away: check at |zeta| = 1e3 (next term O(1e-9)).
        let kt = KarmanTrefftzMap::new(0.4).unwrap();
        let zeta = C64::new(600.0, 800.0);
        let k = ((kt.z(zeta) - zeta) * zeta).re;
        assert_relative_eq!(k, kt.far_field_k(), epsilon = 1e-5);
    }

    #[test]
    fn finite_angle_trailing_edge_is_a_stagnation_point() {
        let a = KarmanTrefftzAirfoil::from_circle(-0.1, 0.1, 10f64.to_radians()).unwrap();
        assert_relative_eq!(a.surface_point(0.0, 0.1).speed_ratio, 0.0, epsilon = 1e-15);
        // Approaching it the speed falls like (zeta - b)^(2 - n), slowly for a small angle.
        assert!(a.surface_point(1e-6, 0.1).speed_ratio < a.surface_point(1e-3, 0.1).speed_ratio);
        assert!(KarmanTrefftzMap::new(-0.1).is_err());
        assert!(KarmanTrefftzMap::new(1.5).is_err());
    }
}
