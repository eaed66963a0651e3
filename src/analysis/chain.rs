//! [`analyse_with`] in named steps: the equivalent surfaces and masses, the closed form, the
//! full model, the figures that follow from the headline, the cautions, the result.

use super::balance_checks::{
    balance_cautions, cg_band_empty_caution, neutral_point_range_caution,
    uncertain_aft_limit_caution,
};
use super::band::{ballast_advice, cg_band, headline_of, require_finite};
use super::estimate::{
    closed_form_input, fuselage_cm_alpha, glide_estimate, numerics_used, trim_input, Glide,
};
use super::fin::{fin_note, FinNote};
use super::input_checks::{tip_reynolds_caution, vertical_cg_partial_caution, weighing_if_any};
use super::model_checks::full_model_cautions;
use super::{
    flight_polar_if_asked, full_stability_or_caution, Analysis, AnalysisError, AnalysisOptions,
    BallastAdvice, CgBand, Headline, Method, SectionSet,
};
use crate::atmosphere::{self, AirState};
use crate::balance::{self, MassSummary};
use crate::caution::{safety_caution, Caution};
use crate::finding::InputFinding;
use crate::lifting_line::{LiftingLineError, MultiSurfaceSystem};
use crate::model::Aircraft;
use crate::planform;
use crate::stability::classical::{self, ClassicalEstimate, EquivalentSurface};
use crate::stability::trim;
use crate::stability::uncertainty::{self, CgSpread, NeutralPointSpread};

/// Run the chain on `aircraft` with its sections and its factored wing system already made
/// (by [`super::section_set`] and `trim::build_system` of this aircraft, or of one that
/// differs only in masses, with the incidence changes applied by
/// `MultiSurfaceSystem::with_angle_change`); `system` is the build's error when it failed;
/// `memo` remembers the forward CG limit found on that system for later calls. Gives what
/// [`super::analyse`] gives.
pub fn analyse_with(
    aircraft: &Aircraft,
    section_set: &SectionSet,
    system: Result<&MultiSurfaceSystem, &LiftingLineError>,
    memo: Option<&trim::ForwardLimitMemo>,
    options: &AnalysisOptions,
) -> Result<Analysis, AnalysisError> {
    let mut cautions = section_set.cautions.clone();
    let basis = basis(aircraft, section_set)?;
    let (estimate, neutral_point_spread) = closed_form(aircraft, &basis);
    let input = trim_input(
        aircraft,
        &section_set.models,
        &basis.mass,
        &basis.air,
        basis.fuselage_cm_alpha_per_rad,
        options,
    );
    let full = full_stability_or_caution(system, &input, memo, &mut cautions);
    let headline = headline_of(aircraft, full.as_ref(), &estimate);
    let derived = derived_figures(
        aircraft,
        &basis,
        full.as_ref(),
        &headline,
        2.0 * neutral_point_spread.sigma_m,
    )?;
    let (glide_polar, flap_polars) = flight_polar_if_asked(
        &input,
        system,
        full.as_ref(),
        &basis.air,
        options,
        &mut cautions,
    )?;
    let weighed = weighing_if_any(aircraft, &basis.mass, &mut cautions)?;
    let tail_volume = basis
        .stabiliser
        .as_ref()
        .map(|s| planform::tail_volume(&basis.wing.geometry, &s.geometry));
    let figures = Figures {
        estimate,
        neutral_point_spread,
        full,
        headline,
        derived,
    };
    let (cg_spread, fin) = closing_cautions(aircraft, &basis, &figures, &mut cautions);
    let derived = figures.derived;
    let Basis {
        air,
        wing,
        stabiliser,
        mass,
        ..
    } = basis;
    Ok(Analysis {
        numerics: numerics_used(aircraft, options),
        air,
        sections: section_set.models.clone(),
        wing_geometry: wing.geometry,
        stabiliser_geometry: stabiliser.map(|s| s.geometry),
        tail_volume,
        mass,
        wing_loading_kg_m2: derived.wing_loading_kg_m2,
        wing,
        stabiliser,
        classical: figures.estimate,
        full: figures.full,
        neutral_point_spread: figures.neutral_point_spread,
        cg_spread,
        fin,
        headline: figures.headline,
        band: derived.band,
        ballast: derived.ballast,
        reynolds_mac: derived.reynolds_mac,
        weighed,
        glide: derived.glide,
        glide_polar,
        flap_polars,
        cautions,
    })
}

/// The analysis's figures that the closing cautions look at.
struct Figures {
    estimate: ClassicalEstimate,
    neutral_point_spread: NeutralPointSpread,
    full: Option<trim::FullStability>,
    headline: Headline,
    derived: Derived,
}

/// The cautions after the figures, in the order they are printed: the vertical CG, balance
/// and model, fin, spreads and the closing safety note; gives the CG spread and the fin note.
fn closing_cautions(
    aircraft: &Aircraft,
    basis: &Basis,
    f: &Figures,
    cautions: &mut Vec<Caution>,
) -> (CgSpread, Option<FinNote>) {
    vertical_cg_partial_caution(aircraft, cautions);
    balance_and_model_cautions(
        aircraft,
        basis,
        f.full.as_ref(),
        &f.headline,
        &f.estimate,
        &f.derived,
        cautions,
    );
    let cg_spread = uncertainty::cg_spread(&aircraft.masses, &aircraft.tolerances);
    let fin = fin_note(aircraft, &basis.wing.geometry, cautions);
    spread_cautions(
        basis,
        &f.headline,
        &f.estimate,
        &f.neutral_point_spread,
        &cg_spread,
        &f.derived.band,
        cautions,
    );
    cautions.push(safety_caution());
    (cg_spread, fin)
}

/// What every later step reads: the air at the file's altitude, the wing and stabiliser as
/// equivalent straight surfaces, the masses and CG, and the fuselage's pitching term.
struct Basis {
    air: AirState,
    wing: EquivalentSurface,
    stabiliser: Option<EquivalentSurface>,
    mass: MassSummary,
    /// dC_m/dalpha of the fuselage, per radian.
    fuselage_cm_alpha_per_rad: f64,
}

/// The [`Basis`] of `aircraft` with the thin-airfoil sections of `section_set`.
fn basis(aircraft: &Aircraft, section_set: &SectionSet) -> Result<Basis, AnalysisError> {
    let air = atmosphere::air_state(&aircraft.air);
    let thin_sections = &section_set.thin;
    let wing = classical::equivalent_surface(&aircraft.wing, thin_sections);
    let stabiliser = aircraft
        .stabiliser
        .as_ref()
        .map(|s| classical::equivalent_surface(&s.surface, thin_sections));
    let mass = balance::mass_summary(&aircraft.masses)?;
    let fuselage_cm_alpha_per_rad = fuselage_cm_alpha(aircraft, &wing);
    Ok(Basis {
        air,
        wing,
        stabiliser,
        mass,
        fuselage_cm_alpha_per_rad,
    })
}

/// The closed-form estimate and the neutral point's spread by its linear sensitivities.
fn closed_form(aircraft: &Aircraft, b: &Basis) -> (ClassicalEstimate, NeutralPointSpread) {
    let estimate_input = closed_form_input(
        aircraft,
        &b.wing,
        b.stabiliser.as_ref(),
        &b.mass,
        &b.air,
        b.fuselage_cm_alpha_per_rad,
    );
    let estimate = classical::estimate(&estimate_input);
    let neutral_point_spread =
        uncertainty::linear_spread(&estimate_input, &uncertainty::COMMON_SPREADS);
    (estimate, neutral_point_spread)
}

/// The figures that follow from the headline: CG band, ballast advice, the speed the
/// Reynolds number is taken at, wing loading and the parabolic glide estimate.
struct Derived {
    band: CgBand,
    /// True when the forward limit lies aft of the aft limit (no usable range).
    band_empty: bool,
    ballast: Vec<BallastAdvice>,
    /// Trim speed, or the stall speed without a trim, m/s.
    speed_m_s: f64,
    reynolds_mac: f64,
    wing_loading_kg_m2: f64,
    glide: Glide,
}

/// The [`Derived`] figures (the band's aft end measured from the forward end of the neutral
/// point's range, `np_spread_m` ahead of it), or an error when a headline number is not finite.
fn derived_figures(
    aircraft: &Aircraft,
    b: &Basis,
    full: Option<&trim::FullStability>,
    headline: &Headline,
    np_spread_m: f64,
) -> Result<Derived, AnalysisError> {
    let mac = b.wing.geometry.mac_m;
    let np = headline.neutral_point_x_m;
    let (band, band_empty) = cg_band(aircraft, full, np, np_spread_m, mac);
    let ballast = ballast_advice(aircraft, &b.mass, np, mac, &band);
    let speed_m_s = headline
        .trim
        .map(|t| t.speed_m_s)
        .unwrap_or(headline.stall_speed_m_s);
    let reynolds_mac = b.air.reynolds(speed_m_s, mac);
    let wing_loading_kg_m2 = b.mass.total_kg / b.wing.geometry.area_m2;
    let glide = glide_estimate(
        aircraft,
        &b.wing,
        b.stabiliser.as_ref(),
        &b.mass,
        &b.air,
        headline.cl_max,
    );
    require_finite(&[
        ("neutral point", headline.neutral_point_x_m),
        ("static margin", headline.static_margin),
        ("stall speed", headline.stall_speed_m_s),
        ("wing loading", wing_loading_kg_m2),
        ("Reynolds number", reynolds_mac),
        ("zero-lift drag", glide.cd0),
        ("best glide", glide.performance.best_glide.glide_ratio),
        ("minimum sink", glide.performance.min_sink.sink_m_s),
    ])?;
    Ok(Derived {
        band,
        band_empty,
        ballast,
        speed_m_s,
        reynolds_mac,
        wing_loading_kg_m2,
        glide,
    })
}

/// The balance cautions, the full model's, the tip Reynolds number's and the plausibility
/// cautions, in that order.
fn balance_and_model_cautions(
    aircraft: &Aircraft,
    b: &Basis,
    full: Option<&trim::FullStability>,
    headline: &Headline,
    estimate: &ClassicalEstimate,
    d: &Derived,
    cautions: &mut Vec<Caution>,
) {
    let mac = b.wing.geometry.mac_m;
    if d.band_empty {
        cg_band_empty_caution(aircraft, d.band.aft_x_m, cautions);
    }
    let elevons_trim_it = full
        .and_then(|f| f.tailless)
        .is_some_and(|t| t.elevon_to_trim_rad.is_some() && t.elevon_within_throws);
    balance_cautions(
        aircraft,
        &b.mass,
        headline,
        &d.band,
        mac,
        elevons_trim_it,
        cautions,
    );
    if let Some(f) = full {
        full_model_cautions(
            aircraft,
            f,
            headline,
            estimate,
            mac,
            b.mass.cg_x_m,
            &d.band,
            cautions,
        );
    }
    tip_reynolds_caution(
        aircraft,
        &b.air,
        d.reynolds_mac,
        d.speed_m_s,
        headline.stall_speed_m_s,
        cautions,
    );
    cautions.extend(crate::plausibility::cautions(
        aircraft,
        &b.wing.geometry,
        b.mass.total_kg,
    ));
}

/// The cautions on the spreads: a CG whose tolerance range reaches past the uncertain aft
/// limit, and tolerances that spread the CG over more than the mean chord.
fn spread_cautions(
    b: &Basis,
    headline: &Headline,
    estimate: &ClassicalEstimate,
    neutral_point_spread: &NeutralPointSpread,
    cg_spread: &CgSpread,
    band: &CgBand,
    cautions: &mut Vec<Caution>,
) {
    let mac = b.wing.geometry.mac_m;
    // The closed form is a second opinion only when the full model gave the headline.
    let closed_form_np_x_m = match headline.method {
        Method::Numerical(_) => Some(estimate.neutral_point_x_m),
        Method::Classical => None,
    };
    neutral_point_range_caution(
        b.mass.cg_x_m,
        headline,
        2.0 * neutral_point_spread.sigma_m,
        closed_form_np_x_m,
        band.aft_x_m,
        cautions,
    );
    uncertain_aft_limit_caution(
        headline.neutral_point_x_m,
        2.0 * neutral_point_spread.sigma_m,
        (b.mass.cg_x_m, 2.0 * cg_spread.sigma_m),
        (band.forward_x_m, band.aft_x_m),
        cautions,
    );
    // Tolerances that spread the CG over more than the mean chord are almost certainly typed
    // wrong (a kilogram for a gram, a tolerance on the wrong item).
    if (4.0 * cg_spread.sigma_m).is_finite() && 4.0 * cg_spread.sigma_m > mac {
        cautions.push(Caution::of(
            InputFinding::TolerancesTooLarge {
                cg_range_m: 4.0 * cg_spread.sigma_m,
                mac_m: mac,
            }
            .into(),
        ));
    }
}
