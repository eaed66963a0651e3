//! Empirical correction of a plain flap's lift effectiveness at large deflections.
//!
//! Thin-airfoil theory ([`super::flap`]) makes the lift of a plain flap grow linearly with its
//! deflection. Measured flaps fall below that line once the flow starts to separate over the
//! hinge, from about 10 to 15 deg on: the published design charts give a factor `K'` (0..1)
//! with `delta cl = K'(delta, F) (dcl/ddelta)_theory delta`, a secant factor for the whole
//! deflection, falling with deflection and faster for larger flap-chord fractions `F`.
//!
//! The table below holds that chart's curves for F = 0.10, 0.15, 0.25, 0.30, 0.40 and 0.50 at
//! 0 to 60 deg of deflection. It was transcribed from a public digitisation of the chart (not
//! read from the printed figure by us), at the grid points listed, to 0.001; the digitisation
//! scatters by about 0.01 about a smooth curve, so the table is good to about +-0.02 in K'.
//! Between grid points and between curves the factor is interpolated linearly. Outside the
//! chart the nearest curve is used (F below 0.10 or above 0.50) and, above 60 deg, the 60 deg
//! value is held (the input accepts throws up to 45 deg). The factor depends on the magnitude
//! of the deflection only (the chart is for a symmetric section's flap; up and down
//! deflections are treated alike).
//!
//! The chart is for plain flaps; a gap at the hinge is not modelled (an unsealed gap loses
//! more effectiveness, so the factor is optimistic for an open hinge line). The same factor is
//! applied to the moment increment of the flap (the flap's moment is carried by its lift
//! increment in the design method the chart belongs to).
//!
//! The effective (lift-equivalent) deflection `K'(delta) delta` does not grow monotonically on
//! every curve: near the knee (about 16 to 22 deg for F >= 0.25) it stalls or dips slightly.
//! [`max_effective_deflection_rad`] gives the most a throw can produce, and
//! [`deflection_for_effective_rad`] the smallest deflection that produces a given effect.
//!
//! # References
//! - J. Roskam, *Airplane Design, Part VI: Preliminary Calculation of Aerodynamic, Thrust and
//!   Power Characteristics*, DARcorporation, fig. 8.13 (empirical correction for lift
//!   effectiveness of plain flaps); the same design method is given in the USAF Stability and
//!   Control DATCOM, sec. 6.1.1.1 (not checked against it here).

/// Flap-chord fractions of the chart's curves.
const CHORD_FRACTIONS: [f64; 6] = [0.10, 0.15, 0.25, 0.30, 0.40, 0.50];

/// Deflections of the table, deg.
const DEFLECTIONS_DEG: [f64; 18] = [
    0.0, 10.0, 12.0, 14.0, 16.0, 18.0, 20.0, 22.0, 24.0, 26.0, 28.0, 30.0, 35.0, 40.0, 45.0, 50.0,
    55.0, 60.0,
];

/// K' at [`DEFLECTIONS_DEG`], one row per entry of [`CHORD_FRACTIONS`].
const K_PRIME: [[f64; 18]; 6] = [
    [
        1.000, 1.000, 0.995, 0.986, 0.971, 0.937, 0.897, 0.855, 0.806, 0.767, 0.736, 0.714, 0.671,
        0.641, 0.617, 0.595, 0.578, 0.565,
    ],
    [
        1.000, 0.999, 0.996, 0.986, 0.969, 0.935, 0.890, 0.832, 0.785, 0.749, 0.718, 0.693, 0.650,
        0.617, 0.590, 0.568, 0.549, 0.531,
    ],
    [
        1.000, 0.999, 0.995, 0.987, 0.964, 0.927, 0.854, 0.766, 0.720, 0.687, 0.660, 0.642, 0.601,
        0.569, 0.543, 0.520, 0.499, 0.482,
    ],
    [
        1.000, 1.000, 0.996, 0.986, 0.965, 0.904, 0.803, 0.726, 0.683, 0.652, 0.627, 0.609, 0.571,
        0.542, 0.517, 0.496, 0.478, 0.463,
    ],
    [
        1.000, 0.999, 0.989, 0.962, 0.923, 0.856, 0.748, 0.683, 0.646, 0.617, 0.594, 0.577, 0.541,
        0.513, 0.491, 0.473, 0.456, 0.442,
    ],
    [
        1.000, 0.997, 0.979, 0.937, 0.873, 0.773, 0.695, 0.644, 0.607, 0.583, 0.562, 0.547, 0.515,
        0.490, 0.470, 0.453, 0.438, 0.425,
    ],
];

/// Largest deflection the chart covers, deg.
pub const CHART_MAX_DEFLECTION_DEG: f64 = 60.0;

/// Step of the scans over deflection, rad (0.05 deg: far below the chart's reading accuracy).
const SCAN_STEP_RAD: f64 = 0.05 * std::f64::consts::PI / 180.0;

/// Linear interpolation in a table with ascending abscissae, clamped at the ends.
fn interpolate(xs: &[f64], ys: &[f64], x: f64) -> f64 {
    if x <= xs[0] {
        return ys[0];
    }
    for i in 1..xs.len() {
        if x <= xs[i] {
            let w = (x - xs[i - 1]) / (xs[i] - xs[i - 1]);
            return ys[i - 1] + w * (ys[i] - ys[i - 1]);
        }
    }
    ys[ys.len() - 1]
}

/// The chart's factor K' (0..1) for flap-chord fraction `chord_fraction` at deflection
/// `deflection_rad` (either sign). Non-finite inputs give 1 (no correction is claimed).
pub fn lift_effectiveness_factor(chord_fraction: f64, deflection_rad: f64) -> f64 {
    if !chord_fraction.is_finite() || !deflection_rad.is_finite() {
        return 1.0;
    }
    let d = deflection_rad.abs().to_degrees();
    let per_curve: Vec<f64> = K_PRIME
        .iter()
        .map(|row| interpolate(&DEFLECTIONS_DEG, row, d))
        .collect();
    interpolate(&CHORD_FRACTIONS, &per_curve, chord_fraction)
}

/// The lift-equivalent deflection `K'(delta) delta`, rad (same sign as `deflection_rad`): the
/// deflection that, in the linear flap theory, gives the lift the chart gives at
/// `deflection_rad`.
pub fn effective_deflection_rad(chord_fraction: f64, deflection_rad: f64) -> f64 {
    lift_effectiveness_factor(chord_fraction, deflection_rad) * deflection_rad
}

/// The largest lift-equivalent deflection magnitude a throw of `throw_rad` (magnitude) can
/// produce, rad (positive): the greatest `K' delta` for `0 <= delta <= throw`.
pub fn max_effective_deflection_rad(chord_fraction: f64, throw_rad: f64) -> f64 {
    let throw = throw_rad.abs();
    let mut best: f64 = 0.0;
    let mut d: f64 = 0.0;
    while d < throw {
        best = best.max(effective_deflection_rad(chord_fraction, d));
        d += SCAN_STEP_RAD;
    }
    best.max(effective_deflection_rad(chord_fraction, throw))
}

/// The smallest deflection (same sign as `effective_rad`) whose lift-equivalent deflection
/// reaches `effective_rad`, rad; `None` when no deflection up to the chart's 60 deg reaches
/// it.
pub fn deflection_for_effective_rad(chord_fraction: f64, effective_rad: f64) -> Option<f64> {
    if !effective_rad.is_finite() {
        return None;
    }
    let target = effective_rad.abs();
    let top = CHART_MAX_DEFLECTION_DEG.to_radians();
    let mut lo = 0.0;
    let mut d = 0.0;
    while d <= top + 1e-12 {
        if effective_deflection_rad(chord_fraction, d) >= target {
            // Refine the first crossing between lo and d by bisection.
            let mut hi = d;
            for _ in 0..40 {
                let mid = 0.5 * (lo + hi);
                if effective_deflection_rad(chord_fraction, mid) >= target {
                    hi = mid;
                } else {
                    lo = mid;
                }
            }
            return Some(hi.copysign(effective_rad));
        }
        lo = d;
        d += SCAN_STEP_RAD;
    }
    None
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn the_table_is_read_back_at_its_points() {
        for (i, f) in CHORD_FRACTIONS.iter().enumerate() {
            for (j, d) in DEFLECTIONS_DEG.iter().enumerate() {
                let k = lift_effectiveness_factor(*f, d.to_radians());
                assert_relative_eq!(k, K_PRIME[i][j], epsilon = 1e-9);
            }
        }
    }

    #[test]
    fn inverse_gives_back_the_deflection_on_a_rising_stretch() {
        // F = 0.25 at 30 deg lies past the knee, where K' delta rises again.
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
