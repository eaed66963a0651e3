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

/// Share of the two-arc angle ([`two_arc_angle_rad`]) accepted as trailing-edge angle. Close to
/// the two-arc section the leading edge becomes sharp (its radius tends to zero) and the circle
/// passes next to the map's second singular point; keeping a tenth away leaves a rounded
/// leading edge and a well-conditioned shape solution.
pub const TWO_ARC_ANGLE_SHARE: f64 = 0.9;

/// Included trailing-edge angle of the thinnest Karman-Trefftz section of a given thickness and
/// camber (fractions of chord), rad: `2 [atan(t + 2 f) - atan(2 f - t)]`.
///
/// When the circle passes through both singular points (`mu_x -> 0`), the argument of
/// `(zeta - 1) / (zeta + 1)` is constant along each of its two arcs (inscribed angle), the power
/// `n` keeps it so, and `w -> n (1 + w) / (1 - w)` takes those two rays to two circular arcs
/// through `z = -n` and `z = n` that meet at both ends at the trailing-edge angle. Two circular
/// arcs on a chord c that leave it at angles `d1 > d2` rise `(c / 2) tan(d / 2)` at mid-chord,
/// so `t = (tan(d1 / 2) - tan(d2 / 2)) / 2`, `f = (tan(d1 / 2) + tan(d2 / 2)) / 4` and the angle
/// `d1 - d2` is the formula above. Moving the circle off `zeta = -1` only thickens the section,
/// so a larger angle than this has no Karman-Trefftz section of that thickness and camber.
pub fn two_arc_angle_rad(thickness_ratio: f64, camber_ratio: f64) -> f64 {
    2.0 * ((thickness_ratio + 2.0 * camber_ratio).atan()
        - (2.0 * camber_ratio - thickness_ratio).atan())
}

/// Largest trailing-edge angle accepted for a thickness and camber (fractions of chord), rad:
/// [`TWO_ARC_ANGLE_SHARE`] of [`two_arc_angle_rad`] (and below [`MAX_TRAILING_EDGE_ANGLE_RAD`]
/// in any case). About 2 deg per percent of thickness for thin sections.
pub fn max_trailing_edge_angle_rad(thickness_ratio: f64, camber_ratio: f64) -> f64 {
    TWO_ARC_ANGLE_SHARE * two_arc_angle_rad(thickness_ratio, camber_ratio)
}

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
    /// trailing-edge angle, found by solving for the circle centre. The angle must not exceed
    /// [`max_trailing_edge_angle_rad`] for that thickness and camber.
    pub fn from_shape(
        thickness_ratio: f64,
        camber_ratio: f64,
        tau_rad: f64,
    ) -> Result<Self, CircleMapError> {
        let map = KarmanTrefftzMap::new(tau_rad)?;
        let max_rad = max_trailing_edge_angle_rad(thickness_ratio, camber_ratio);
        // Thickness and camber out of range are reported by the shape solution below.
        if max_rad.is_finite() && thickness_ratio > 0.0 && camber_ratio >= 0.0 && tau_rad > max_rad
        {
            return Err(CircleMapError::TrailingEdgeAngleForShape {
                angle_rad: tau_rad,
                thickness_ratio,
                camber_ratio,
                max_rad,
            });
        }
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

    // The two-arc limit, checked against the map itself: a circle through both singular points
    // (mu_x -> 0) gives a section whose measured thickness and camber put `two_arc_angle_rad`
    // at the map's trailing-edge angle. Tolerance 1e-4 rad: the circle is 1e-7 off zeta = -1
    // and the shape is measured on sampled points.
    #[test]
    fn two_arc_angle_matches_the_map_at_its_limit() {
        for (mu_y, tau_deg) in [(0.0, 10.0), (0.0, 25.0), (0.1, 15.0), (0.25, 30.0)] {
            let tau = f64::to_radians(tau_deg);
            let a = KarmanTrefftzAirfoil::from_circle(-1e-7, mu_y, tau).unwrap();
            let (t, f) = a.shape_ratios();
            assert_relative_eq!(two_arc_angle_rad(t, f), tau, epsilon = 1e-4);
        }
    }

    // Up to the accepted share of the limit the shape is found; past it the angle is refused,
    // with the limit in the error, rather than failing to converge.
    #[test]
    fn shape_solution_reaches_the_accepted_limit() {
        for (t, f) in [(0.001, 0.0), (0.05, 0.1499), (0.1, 0.02), (0.12, 0.0)] {
            let max = max_trailing_edge_angle_rad(t, f);
            let a = KarmanTrefftzAirfoil::from_shape(t, f, max).unwrap();
            let (tm, fm) = a.shape_ratios();
            assert_relative_eq!(tm, t, epsilon = 1e-6 * t);
            assert_relative_eq!(fm, f, epsilon = 1e-6 * t.max(f));
            assert!(matches!(
                KarmanTrefftzAirfoil::from_shape(t, f, max * 1.001),
                Err(CircleMapError::TrailingEdgeAngleForShape { .. })
            ));
        }
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
