//! Thwaites' method for the laminar boundary layer.
//!
//! The momentum integral equation with Thwaites' observation that `theta^2 dUe/ds / nu` (the
//! parameter lambda) fixes the profile gives the momentum thickness in closed form,
//!
//! `theta^2(s) = 0.45 nu / Ue^6(s) * integral_0^s Ue^5 ds`,
//!
//! and the shape factor `H(lambda)` and the wall-shear correlation `l(lambda) = tau_w theta /
//! (mu Ue)` follow from lambda; skin friction `cf = 2 l / Re_theta`. Laminar separation is at
//! `lambda = -0.09`. The correlations are Cebeci and Bradshaw's curve fits of Thwaites' table.
//!
//! Assumes attached, two-dimensional, incompressible laminar flow. At a stagnation point
//! (`Ue = 0`, `dUe/ds = k`) the integral gives `theta^2 = 0.075 nu / k` (lambda = 0.075, the
//! Hiemenz value within the fit's accuracy). On a flat plate it gives `theta = 0.671
//! sqrt(nu x / U)`, i.e. a total skin friction `1.342 / sqrt(Re_x)`, 1 % above Blasius.
//!
//! # References
//! - Thwaites, B. (1949). Approximate calculation of the laminar boundary layer. Aeronautical
//!   Quarterly 1, 245-280 (the integral and the 0.45 constant; separation at lambda = -0.09).
//! - Cebeci, T., Bradshaw, P. (1977). Momentum Transfer in Boundary Layers. Hemisphere,
//!   sec. 4.4 (fits `l(lambda)`, `H(lambda)` for `-0.1 <= lambda <= 0.1`).

/// Thwaites' constant in `theta^2 Ue^6 = 0.45 nu integral Ue^5 ds`.
pub const THWAITES_A: f64 = 0.45;
/// Thwaites' exponent of Ue under the integral (`b - 1` with b = 6).
pub const THWAITES_B: i32 = 6;
/// lambda at laminar separation (Thwaites 1949).
pub const LAMBDA_SEPARATION: f64 = -0.09;
/// Upper end of the correlations' range; larger (stagnation-point) values are held here.
const LAMBDA_MAX: f64 = 0.1;

/// Shape factor `H = delta* / theta` at `lambda` (Cebeci-Bradshaw fit; lambda held to
/// `-0.09..0.1`).
pub fn shape_factor(lambda: f64) -> f64 {
    let l = lambda.clamp(LAMBDA_SEPARATION, LAMBDA_MAX);
    if l >= 0.0 {
        2.61 - 3.75 * l + 5.24 * l * l
    } else {
        2.088 + 0.0731 / (l + 0.14)
    }
}

/// Wall-shear correlation `l = tau_w theta / (mu Ue)` at `lambda` (Cebeci-Bradshaw fit).
pub fn shear(lambda: f64) -> f64 {
    let l = lambda.clamp(LAMBDA_SEPARATION, LAMBDA_MAX);
    if l >= 0.0 {
        0.22 + 1.57 * l - 1.8 * l * l
    } else {
        0.22 + 1.402 * l + 0.018 * l / (l + 0.107)
    }
}

/// `integral Ue^5 ds` over one interval on which Ue varies linearly from `ua` to `ub`
/// (exact for the linear variation), `ds` long.
pub fn ue5_integral(ua: f64, ub: f64, ds: f64) -> f64 {
    // integral of (ua + (ub - ua) t)^5 dt over 0..1 = sum_k ua^(5-k) ub^k / 6.
    let mut sum = 0.0;
    for k in 0..=5 {
        sum += ua.powi(5 - k) * ub.powi(k);
    }
    ds * sum / 6.0
}

/// Momentum thickness from the running integral `int_ue5 = integral_0^s Ue^5 ds` at the local
/// speed `ue`, kinematic viscosity `nu` (chord fractions, free-stream speed = 1).
pub fn momentum_thickness(int_ue5: f64, ue: f64, nu: f64) -> f64 {
    (THWAITES_A * nu * int_ue5 / ue.powi(THWAITES_B)).sqrt()
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn flat_plate_constant() {
        // Flat plate: theta = sqrt(0.45 nu x / U) = 0.6708 sqrt(nu x / U); 1e-12 is rounding.
        let nu = 1e-5;
        let th = momentum_thickness(ue5_integral(1.0, 1.0, 0.5), 1.0, nu);
        assert_relative_eq!(th, (0.45f64 * nu * 0.5).sqrt(), max_relative = 1e-12);
    }

    #[test]
    fn fits_join_at_zero_and_match_thwaites_table() {
        // The two branches meet at lambda = 0 within the fit's rounding (Cebeci & Bradshaw):
        // H 2.61 vs 2.610, l 0.22 vs 0.22.
        assert_relative_eq!(shape_factor(0.0), 2.61, epsilon = 2e-3);
        assert_relative_eq!(shape_factor(-1e-12), 2.61, epsilon = 2e-3);
        assert_relative_eq!(shear(-1e-12), 0.22, epsilon = 1e-6);
        // Near separation the profile is much fuller in deficit: H about 3.5, shear near zero.
        assert!(shape_factor(LAMBDA_SEPARATION) > 3.4);
        assert!(shear(LAMBDA_SEPARATION).abs() < 0.02);
    }

    #[test]
    fn linear_ue_integral_is_exact() {
        // integral_0^1 s^5 ds = 1/6 for Ue = s.
        assert_relative_eq!(ue5_integral(0.0, 1.0, 1.0), 1.0 / 6.0, epsilon = 1e-15);
    }
}
