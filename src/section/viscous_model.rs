//! The section model of the viscous method: the polar at the airfoil's Reynolds number,
//! reduced to a lift curve (its linear part, the lift peak as cl_max) and the polar kept.

use super::{
    boundary_layer, build_contour, cache, geometry, linear_outcome, polar, shape_solutions,
    viscous, SectionError, SectionOptions, SectionOutcome,
};
use crate::model::{Airfoil, SectionMethod};

/// The section model of `airfoil` from its viscous polar over [`MODEL_SWEEP_DEG`] (from the
/// shared polar cache).
pub(super) fn viscous_outcome(
    airfoil: &Airfoil,
    options: &SectionOptions,
) -> Result<SectionOutcome, SectionError> {
    let settings = viscous_settings(airfoil, options)?;
    let alphas: Vec<f64> = (MODEL_SWEEP_DEG.0..=MODEL_SWEEP_DEG.1)
        .map(|d| (d as f64).to_radians())
        .collect();
    let polar = cache::PolarCache::shared().polar(airfoil, settings, &alphas)?;
    model_from_polar(airfoil, polar)
}

/// Angles of the polar behind a viscous section model, whole degrees from the chord line
/// (1 deg steps; the sweep stops at the first stalled or failed angle).
const MODEL_SWEEP_DEG: (i32, i32) = (-8, 20);

/// Fewest converged points near zero lift for a viscous section model.
const MIN_LINEAR_POINTS: usize = 3;

/// |cl| up to which the viscous polar is taken as the linear part of the lift curve (a
/// judgement: below the stall of any section the method treats).
const LINEAR_CL_LIMIT: f64 = 0.6;

/// The viscous settings of `airfoil`: its Reynolds number (required), its transition setting
/// or N 9, and the panels of `options` (raised to the viscous minimum).
fn viscous_settings(
    airfoil: &Airfoil,
    options: &SectionOptions,
) -> Result<viscous::ViscousSettings, SectionError> {
    let Some(reynolds) = airfoil.reynolds else {
        return Err(SectionError::ViscousNeedsReynolds {
            airfoil: airfoil.name.clone(),
        });
    };
    Ok(viscous::ViscousSettings {
        reynolds,
        n_crit: airfoil
            .transition_n
            .unwrap_or(boundary_layer::envelope::DEFAULT_N_CRIT),
        panels: options.panels.max(viscous::MIN_VISCOUS_PANELS),
    })
}

/// The section model of `airfoil` from its viscous polar: zero-lift angle and lift slope from a
/// straight line through the converged points with |cl| <= 0.6, the aerodynamic centre and
/// cm_ac from a straight line of cm against cl over the same points, cl_max as given or the
/// default (the polar's own cl_max is carried in the polar but not used: it runs high, see
/// [`polar`]), the Reynolds number and the polar itself.
pub fn model_from_polar(
    airfoil: &Airfoil,
    polar: std::sync::Arc<polar::Polar>,
) -> Result<SectionOutcome, SectionError> {
    let pts: Vec<(f64, f64)> = polar
        .points()
        .filter(|p| p.cl.abs() <= LINEAR_CL_LIMIT)
        .map(|p| (p.cl, p.cm_quarter_chord))
        .collect();
    let fit = polar.linear_fit(LINEAR_CL_LIMIT);
    let Some((slope, alpha0)) = fit.filter(|_| pts.len() >= MIN_LINEAR_POINTS) else {
        return Err(SectionError::ViscousTooFewPoints {
            airfoil: airfoil.name.clone(),
            points: pts.len(),
        });
    };
    let n = pts.len() as f64;
    let (mcl, mcm) = pts
        .iter()
        .fold((0.0, 0.0), |a, p| (a.0 + p.0 / n, a.1 + p.1 / n));
    let sxx: f64 = pts.iter().map(|p| (p.0 - mcl).powi(2)).sum();
    let sxy: f64 = pts.iter().map(|p| (p.0 - mcl) * (p.1 - mcm)).sum();
    let dcm_dcl = if sxx > 0.0 { sxy / sxx } else { 0.0 };
    let cm_ac = mcm - dcm_dcl * mcl;
    let x_ac_c = 0.25 - dcm_dcl;
    let not_finite = |what| SectionError::NotFinite {
        airfoil: airfoil.name.clone(),
        method: "viscous",
        what,
    };
    if !(slope.is_finite() && slope > 0.0) {
        return Err(not_finite("lift slope"));
    }
    if !(alpha0.is_finite() && cm_ac.is_finite() && x_ac_c.is_finite()) {
        return Err(not_finite("zero-lift angle or moment"));
    }
    linear_outcome(
        airfoil,
        SectionMethod::Viscous,
        (alpha0, slope, cm_ac, x_ac_c),
        Some(polar),
    )
}

/// The viscous polar of `airfoil` at `settings` (Reynolds number, N, panels) over
/// `alphas_rad`: the boundary layer on the panel method ([`viscous`], [`polar`]).
pub fn viscous_polar(
    airfoil: &Airfoil,
    settings: viscous::ViscousSettings,
    alphas_rad: &[f64],
) -> Result<polar::Polar, SectionError> {
    let name = || airfoil.name.clone();
    let (exact, naca) = shape_solutions(airfoil)?;
    let contour = build_contour(
        airfoil,
        &exact,
        &naca,
        &SectionOptions {
            panels: settings
                .panels
                .clamp(geometry::MIN_PANELS, geometry::MAX_PANELS),
        },
    )?;
    let section = viscous::ViscousSection::new(&contour, settings).map_err(|error| {
        SectionError::Viscous {
            airfoil: name(),
            error,
        }
    })?;
    Ok(polar::Polar::sweep(&section, alphas_rad))
}
