//! The fuselage's destabilising contribution to pitch stiffness, by the Gilruth-White empirical
//! method: `Delta Cm_alpha = K_f w_f^2 L_f / (c S)` per degree, positive (nose up), with `w_f` the
//! greatest fuselage width, `L_f` its length, `c` the wing MAC and `S` the wing area. `K_f` (per
//! degree) depends on where the wing root quarter chord sits along the fuselage, as a fraction
//! of its length from the nose.
//!
//! The `K_f` table below was read from digitised reproductions of Raymer's figure (four
//! independent digitisations agree within about 5 % for x/L 0.3 to 0.6; between 0.1 and 0.2
//! the curve is flat and trusted to about 0.001 only). Outside 0.1 to 0.6 the end values are
//! held, which is conservative forward and may understate the effect of a wing far aft.
//!
//! # References
//! - R. R. Gilruth, M. D. White, "Analysis and prediction of longitudinal stability of
//!   airplanes", NACA Report 711, 1941 (the method).
//! - D. P. Raymer, *Aircraft Design: A Conceptual Approach*, sec. 16.3 and the figure of the
//!   empirical pitching-moment factor K_fus (the formula and the K_f curve).
//! - C. D. Perkins, R. E. Hage, *Airplane Performance, Stability and Control*, 1949, ch. 5
//!   (the same estimate, as used in model-aircraft practice).

use crate::model::Fuselage;

/// K_f per degree against the position of the wing root quarter chord (fraction of fuselage
/// length from the nose); see the module doc for how it was read.
pub const K_F_TABLE: [(f64, f64); 6] = [
    (0.1, 0.005),
    (0.2, 0.0065),
    (0.3, 0.0104),
    (0.4, 0.018),
    (0.5, 0.031),
    (0.6, 0.048),
];

/// K_f (per degree) at fractional position `x_over_l`, linearly interpolated in
/// [`K_F_TABLE`], end values held outside it.
pub fn k_f(x_over_l: f64) -> f64 {
    let t = &K_F_TABLE;
    if x_over_l <= t[0].0 {
        return t[0].1;
    }
    for w in t.windows(2) {
        let ((x0, k0), (x1, k1)) = (w[0], w[1]);
        if x_over_l <= x1 {
            return k0 + (k1 - k0) * (x_over_l - x0) / (x1 - x0);
        }
    }
    t[t.len() - 1].1
}

/// Fuselage contribution to dCm/dalpha, per rad (positive: destabilising), for a wing whose
/// root quarter chord is at `wing_root_quarter_x_m`, with MAC `mac_m` and area `area_m2`.
pub fn cm_alpha_per_rad(
    fuselage: &Fuselage,
    wing_root_quarter_x_m: f64,
    mac_m: f64,
    area_m2: f64,
) -> f64 {
    let x_over_l = (wing_root_quarter_x_m - fuselage.nose_x_m) / fuselage.length_m;
    let per_deg =
        k_f(x_over_l) * fuselage.max_width_m.powi(2) * fuselage.length_m / (mac_m * area_m2);
    per_deg.to_degrees()
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn interpolation_hits_the_table_and_holds_the_ends() {
        assert_relative_eq!(k_f(0.3), 0.0104, epsilon = 1e-15);
        assert_relative_eq!(k_f(0.35), 0.5 * (0.0104 + 0.018), epsilon = 1e-15);
        assert_relative_eq!(k_f(0.0), 0.005, epsilon = 1e-15);
        assert_relative_eq!(k_f(0.9), 0.048, epsilon = 1e-15);
    }
}
