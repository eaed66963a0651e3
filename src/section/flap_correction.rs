//! Empirical correction of a plain flap's (elevator's, elevon's) lift effectiveness.
//!
//! Thin-airfoil theory ([`super::flap`]) gives the ideal effectiveness of a plain flap with a
//! sealed hinge. Real control surfaces fall below it: an unsealed hinge gap loses about 15 %
//! of the flap's lift (Raymer), and beyond about 10 to 15 deg of deflection the flow separates
//! over the hinge and the lift grows more slowly still (the design charts' factor K').
//!
//! What is applied here is the published hinge-gap loss, a factor of 0.85 on the flap's lift
//! and moment at every deflection (model control surfaces are hinged with a gap, tape or
//! film; common practice). The large-deflection factor K' is NOT applied: its published chart
//! (USAF DATCOM sec. 6.1.1.1; Raymer fig. 16.7; Roskam Part VI fig. 8.13) could not be read
//! from a printed copy for this project, so no values are claimed. Beyond about 12 deg the
//! effectiveness used here is therefore still optimistic, and the forward CG limit that the
//! elevator's full up throw sets lies somewhat too far forward; the methods footer says so.
//!
//! The functions keep the shape a deflection-dependent factor needs (effective, lift-equivalent
//! deflection and its inverse), so that a chart read from its printed source can replace the
//! constant without touching the callers.
//!
//! # References
//! - D. P. Raymer, *Aircraft Design: A Conceptual Approach*, 6th ed., AIAA, 2018, sec. 16.3
//!   (flap effectiveness; an unsealed hinge gap reduces the flap's lift by about 15 %), pp.
//!   596-598 (as read by a research assistant from the book's text).

/// Factor on the ideal (Glauert, sealed) flap lift and moment for an unsealed hinge gap.
pub const HINGE_GAP_FACTOR: f64 = 0.85;

/// Largest deflection the factor is stated for, deg (the input accepts throws up to 45 deg).
pub const CHART_MAX_DEFLECTION_DEG: f64 = 60.0;

/// The lift-effectiveness factor (0..1) for flap-chord fraction `chord_fraction` at deflection
/// `deflection_rad` (either sign): the hinge-gap factor at every deflection. Non-finite inputs
/// give 1 (no correction is claimed).
pub fn lift_effectiveness_factor(chord_fraction: f64, deflection_rad: f64) -> f64 {
    if !chord_fraction.is_finite() || !deflection_rad.is_finite() {
        return 1.0;
    }
    HINGE_GAP_FACTOR
}

/// The lift-equivalent deflection `factor x delta`, rad (same sign as `deflection_rad`): the
/// deflection that, in the ideal flap theory, gives the lift of the real flap at
/// `deflection_rad`.
pub fn effective_deflection_rad(chord_fraction: f64, deflection_rad: f64) -> f64 {
    lift_effectiveness_factor(chord_fraction, deflection_rad) * deflection_rad
}

/// The largest lift-equivalent deflection magnitude a throw of `throw_rad` (magnitude) can
/// produce, rad (positive).
pub fn max_effective_deflection_rad(chord_fraction: f64, throw_rad: f64) -> f64 {
    effective_deflection_rad(chord_fraction, throw_rad.abs())
}

/// The smallest deflection (same sign as `effective_rad`) whose lift-equivalent deflection
/// reaches `effective_rad`, rad; `None` when none up to 60 deg reaches it or the input is not
/// finite.
pub fn deflection_for_effective_rad(chord_fraction: f64, effective_rad: f64) -> Option<f64> {
    if !effective_rad.is_finite() {
        return None;
    }
    let d = effective_rad / lift_effectiveness_factor(chord_fraction, effective_rad);
    (d.abs() <= CHART_MAX_DEFLECTION_DEG.to_radians()).then_some(d)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn inverse_gives_back_the_deflection_on_a_rising_stretch() {
        let d = 30f64.to_radians();
        let e = effective_deflection_rad(0.25, d);
        let back = deflection_for_effective_rad(0.25, e).unwrap();
        assert_relative_eq!(back, d, epsilon = 1e-6);
        let neg = deflection_for_effective_rad(0.25, -e).unwrap();
        assert_relative_eq!(neg, -d, epsilon = 1e-6);
    }

    #[test]
    fn non_finite_inputs_claim_no_correction() {
        assert_relative_eq!(
            lift_effectiveness_factor(f64::NAN, 0.3),
            1.0,
            epsilon = 1e-12
        );
        assert!(deflection_for_effective_rad(0.3, f64::INFINITY).is_none());
    }
}
