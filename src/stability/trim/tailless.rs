//! The tailless checks: trim with the elevons at the design C_L, and the extra washout a
//! tailless wing would need to trim there with the elevons neutral.

use super::*;

/// The tailless check at the design CL: the target speed's, or [`TAILLESS_DESIGN_CL`].
pub(super) fn tailless_at_design_cl(
    system: &MultiSurfaceSystem,
    input: &TrimInput<'_>,
    area_m2: f64,
    cg_eff_x_m: f64,
) -> Result<TaillessCheck, LiftingLineError> {
    let design_cl = input
        .target_speed_m_s
        .map(|v| cl_at(input.mass_kg, input.density_kg_m3, area_m2, v))
        .unwrap_or(TAILLESS_DESIGN_CL);
    tailless_check(input, system, design_cl, cg_eff_x_m, input.cg_z_m)
}

pub(super) fn tailless_check(
    input: &TrimInput<'_>,
    system: &MultiSurfaceSystem,
    design_cl: f64,
    x_ref: f64,
    z: f64,
) -> Result<TaillessCheck, LiftingLineError> {
    let cm_at_cl = |sys: &MultiSurfaceSystem, cl: f64| -> Result<f64, LiftingLineError> {
        let base = sys.condition(0.0);
        let k0 = sys.linear_coefficients(&base, x_ref, z)?;
        let mut cond = base;
        cond.alpha_rad = (cl - k0.cl) / k0.cl_alpha_per_rad;
        Ok(sys.linear_coefficients(&cond, x_ref, z)?.cm)
    };
    let cm_zero_lift = cm_at_cl(system, 0.0)?;
    let cm_at_design = cm_at_cl(system, design_cl)?;
    let base = system.condition(0.0);
    let elevon_to_trim_rad = input.aircraft.elevons.and_then(|_| {
        system
            .trim_for_cl(&base, TrimControl::Elevator, design_cl, x_ref, z)
            .ok()
            .map(|tp| tp.control_rad)
            .filter(|d| d.is_finite() && d.abs() < std::f64::consts::FRAC_PI_2)
    });
    let elevon_to_trim_rad = match (input.aircraft.elevons.as_ref(), elevon_to_trim_rad) {
        (Some(p), Some(d)) => Some(real_deflection_rad(p, d)),
        _ => None,
    };
    let elevon_within_throws = match (input.aircraft.elevons, elevon_to_trim_rad) {
        (Some(p), Some(d)) => p.within_throws(d),
        _ => false,
    };
    // A uniform rise of cm_ac changes the wing's Cm by the same amount (the MAC is defined so
    // that the chord-squared integral over S c equals one).
    let reflex_cm_change = -cm_at_design;
    // Extra linear washout that zeroes the moment at the design CL: the moment is nearly linear
    // in twist (the trim angle moves a little with it), so a few secant steps, each rebuilding
    // the system with the new twist, converge it.
    let half_span_m = crate::planform::half_span_length_m(&input.aircraft.wing);
    let cm_with = |extra_rad: f64| -> Option<f64> {
        // Linear extra washout, zero at the root and `extra_rad` at the tip (as
        // `add_linear_washout` would put it in the file), on the factored system.
        let sys = system
            .with_angle_change(|st| {
                if st.is_on(SurfaceRole::Wing) {
                    extra_rad * st.s_m.abs() / half_span_m
                } else {
                    0.0
                }
            })
            .ok()?;
        cm_at_cl(&sys, design_cl).ok()
    };
    let washout_change_rad = (|| {
        let (mut w0, mut m0) = (0.0, cm_at_design);
        let mut w1 = -1f64.to_radians();
        let mut m1 = cm_with(w1)?;
        for _ in 0..6 {
            if (m1 - m0).abs() < 1e-12 {
                return None;
            }
            let w2 = w1 - m1 * (w1 - w0) / (m1 - m0);
            if !w2.is_finite() || w2.abs() > 0.5 {
                return None;
            }
            (w0, m0) = (w1, m1);
            w1 = w2;
            m1 = cm_with(w1)?;
            if m1.abs() < 1e-9 {
                break;
            }
        }
        Some(w1)
    })();
    Ok(TaillessCheck {
        design_cl,
        cm_zero_lift,
        cm_at_design,
        washout_change_rad,
        reflex_cm_change,
        elevon_to_trim_rad,
        elevon_within_throws,
    })
}

/// Add twist growing linearly from 0 at the root to `tip_rad` at the tip of the wing.
#[cfg(test)]
pub(super) fn add_linear_washout(aircraft: &mut Aircraft, tip_rad: f64) {
    use crate::model::SurfaceShape;
    match &mut aircraft.wing.shape {
        SurfaceShape::Panels(panels) => {
            let total: f64 = panels.iter().map(|p| p.span_m).sum();
            let mut s = 0.0;
            for p in panels.iter_mut() {
                s += p.span_m;
                p.tip_twist_rad += tip_rad * s / total;
            }
        }
        SurfaceShape::Elliptic(e) => e.tip_twist_rad += tip_rad,
    }
}
