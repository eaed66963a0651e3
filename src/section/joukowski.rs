//! Joukowski airfoils, exact: the map `z = zeta + b^2 / zeta` of a circle through `zeta = b`.
//!
//! A circle centred at `mu = (mu_x, mu_y)` (mu_x <= 0) through the singular point `zeta = b`
//! maps to a cusped airfoil: `mu_x` sets the thickness, `mu_y` the camber. The Kutta condition
//! fixes the circulation `Gamma = 4 pi a U sin(alpha + beta)`, and the lift per span is
//! `L' = rho U Gamma` (Kutta-Joukowski), so `cl = 8 pi (a / c) sin(alpha + beta)` with `c` the
//! true chord of the produced shape, not `4 b`. The moment is exact from Blasius' theorem
//! (far field `z = zeta + b^2 / zeta`, so k = b^2); surface speed and Cp follow from the
//! complex velocity `dF/dz = (dF/dzeta) / (dz/dzeta)`, with its finite limit at the cusp.
//! Here b = 1. Flow solution and conventions: see [`crate::section::circle_map`].
//!
//! # References
//! - Joukowski, N. (1910). Ueber die Konturen der Tragflaechen der Drachenflieger.
//!   Zeitschrift fuer Flugtechnik und Motorluftschiffahrt 1, 281-284.
//! - Katz, J., Plotkin, A. (2001). Low-Speed Aerodynamics, 2nd ed., Cambridge University Press,
//!   ch. 6 (Joukowski airfoil).
//! - Milne-Thomson, L. M. (1968). Theoretical Hydrodynamics, 5th ed. (Joukowski aerofoils).

use crate::section::circle_map::{CircleAirfoil, CircleMap, CircleMapError, C64};

/// The Joukowski map with b = 1.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct JoukowskiMap;

impl CircleMap for JoukowskiMap {
    fn b(&self) -> f64 {
        1.0
    }
    fn z(&self, zeta: C64) -> C64 {
        zeta + zeta.inv()
    }
    fn dz_dzeta(&self, zeta: C64) -> C64 {
        C64::new(1.0, 0.0) - (zeta * zeta).inv()
    }
    fn far_field_k(&self) -> f64 {
        1.0
    }
    fn trailing_edge_velocity(&self, dw_dzeta: C64) -> C64 {
        // L'Hopital: dF/dz -> (dW/dzeta) / (d2z/dzeta2), and d2z/dzeta2 = 2 / b at zeta = b.
        dw_dzeta * 0.5
    }
}

/// A Joukowski airfoil (see the module documentation).
pub type JoukowskiAirfoil = CircleAirfoil<JoukowskiMap>;

impl CircleAirfoil<JoukowskiMap> {
    /// The airfoil of the circle centred at `(mu_x, mu_y)` through `zeta = 1`
    /// (-0.5 < mu_x <= 0, |mu_y| < 0.5).
    pub fn from_circle(mu_x: f64, mu_y: f64) -> Result<Self, CircleMapError> {
        CircleAirfoil::with_map(JoukowskiMap, mu_x, mu_y)
    }

    /// The airfoil with greatest thickness `thickness_ratio` (0 < t/c < 0.4) and greatest
    /// camber `camber_ratio` (0 <= f/c < 0.15), both normal to the chord line, found by
    /// solving for the circle centre.
    pub fn from_shape(thickness_ratio: f64, camber_ratio: f64) -> Result<Self, CircleMapError> {
        CircleAirfoil::with_shape(|| JoukowskiMap, thickness_ratio, camber_ratio)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;
    use std::f64::consts::PI;

    #[test]
    fn symmetric_section_has_zero_lift_at_zero_angle() {
        let j = JoukowskiAirfoil::from_circle(-0.1, 0.0).unwrap();
        assert_relative_eq!(j.alpha_zero_lift_rad(), 0.0, epsilon = 1e-14);
        assert_relative_eq!(j.cl(0.0), 0.0, epsilon = 1e-14);
        assert_relative_eq!(j.cm_quarter_chord(0.0), 0.0, epsilon = 1e-13);
    }

    #[test]
    fn symmetric_section_chord_and_slope() {
        // Closed form: mu = -0.1 gives a = 1.1, leading edge at zeta = -1.2, z = -(1.2 + 1/1.2),
        // so c = 2 + 1.2 + 1/1.2 = 4.033333 and dcl/dalpha = 8 pi a / c (Katz & Plotkin,
        // ch. 6); 1e-12 for rounding.
        let j = JoukowskiAirfoil::from_circle(-0.1, 0.0).unwrap();
        let c = 2.0 + 1.2 + 1.0 / 1.2;
        assert_relative_eq!(j.chord(), c, epsilon = 1e-12);
        assert_relative_eq!(j.cl_alpha_per_rad(), 8.0 * PI * 1.1 / c, epsilon = 1e-12);
    }

    #[test]
    fn blasius_moment_matches_pressure_integration() {
        // Independent check inside the method: integrate -Cp n around the exact surface with
        // 4000 points and compare with the closed-form Blasius moment about c/4; 2e-4 for the
        // trapezoidal integration error.
        let j = JoukowskiAirfoil::from_circle(-0.1, 0.1).unwrap();
        let alpha = 5f64.to_radians();
        let s = j.surface(4000, alpha);
        let mut m = 0.0;
        for w in s.windows(2) {
            let (p, q) = (w[0], w[1]);
            let cp = 0.5 * (p.cp + q.cp);
            let (dx, dy) = (q.x_c - p.x_c, q.y_c - p.y_c);
            // Outward normal times length for a counter-clockwise loop is (dy, -dx).
            let (fx, fy) = (-cp * dy, cp * dx);
            let (xm, ym) = (0.5 * (p.x_c + q.x_c) - 0.25, 0.5 * (p.y_c + q.y_c));
            m += xm * fy - ym * fx;
        }
        assert_relative_eq!(-m, j.cm_quarter_chord(alpha), epsilon = 2e-4);
    }

    #[test]
    fn cusp_speed_is_finite_and_matches_neighbours() {
        // The trailing-edge limit must join the speeds just beside it (continuity, 1e-3).
        let j = JoukowskiAirfoil::from_circle(-0.1, 0.1).unwrap();
        let alpha = 0.05;
        let te = j.surface_point(0.0, alpha).speed_ratio;
        let near = j.surface_point(1e-4, alpha).speed_ratio;
        assert!(te.is_finite());
        assert_relative_eq!(te, near, epsilon = 1e-3);
        assert!(j
            .surface_point(2.0 * PI - 1e-4, alpha)
            .speed_ratio
            .is_finite());
    }

    #[test]
    fn shape_solve_hits_the_requested_thickness_and_camber() {
        let j = JoukowskiAirfoil::from_shape(0.12, 0.03).unwrap();
        let (t, f) = j.shape_ratios();
        assert_relative_eq!(t, 0.12, epsilon = 1e-9);
        assert_relative_eq!(f, 0.03, epsilon = 1e-9);
        assert!(JoukowskiAirfoil::from_shape(0.5, 0.0).is_err());
        assert!(JoukowskiAirfoil::from_shape(0.1, -0.01).is_err());
        assert!(JoukowskiAirfoil::from_circle(0.1, 0.0).is_err());
    }
}
