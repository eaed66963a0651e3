//! Profile drag from the boundary layer at the trailing edge (Squire and Young).
//!
//! The wake's momentum thickness far downstream, and so the drag, follows from the state at
//! the trailing edge of each surface: `cd = 2 theta_TE (Ue_TE / U)^((H_TE + 5) / 2)` per
//! surface, the section's drag being the sum over both surfaces (theta as a fraction of chord).
//! The exponent comes from integrating the wake's momentum equation with an assumed linear
//! relation between H and the wake's speed; it is accurate for attached trailing-edge flow.
//!
//! # References
//! - Squire, H. B., Young, A. D. (1937). The calculation of the profile drag of aerofoils. ARC
//!   R&M 1838.
//! - Cebeci, T., Cousteix, J. (2005). Modeling and Computation of Boundary-Layer Flows, 2nd
//!   ed., Springer (the formula as restated there).

/// Drag contribution of one surface from its trailing-edge momentum thickness `theta_te`
/// (chord fractions), edge speed `ue_te` (fraction of free stream) and shape factor `h_te`.
pub fn drag_coefficient(theta_te: f64, ue_te: f64, h_te: f64) -> f64 {
    2.0 * theta_te * ue_te.max(0.0).powf(0.5 * (h_te + 5.0))
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn flat_plate_reduces_to_the_momentum_thickness() {
        // At Ue = U the formula is the flat-plate result cd = 2 theta (momentum balance).
        assert_relative_eq!(drag_coefficient(0.002, 1.0, 1.4), 0.004, epsilon = 1e-15);
    }
}
