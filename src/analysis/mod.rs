//! The whole analysis chain in one call: sections, planform, masses, balance, stability, trim,
//! stall; with the cautions found on the way.
//!
//! This module only composes the published methods that live in their own modules; it adds
//! the decisions a builder needs (CG band, ballast advice, cautions) and their thresholds,
//! which are common practice and documented in `docs/cautions.md`.

use crate::atmosphere::AirState;
use crate::balance::{self, BallastOutcome, MassSummary};
use crate::caution::Caution;
use crate::finding::{GlideFinding, InputFinding, PolarMissing};
use crate::model::Aircraft;

use crate::lifting_line::{LiftingLineError, LiftingLineOptions, MultiSurfaceSystem};
use crate::model::WingModel;
use crate::planform::{PlanformGeometry, TailVolume};
use crate::section::SectionModel;
use crate::stability::classical::{ClassicalEstimate, EquivalentSurface};
use crate::stability::trim;
use thiserror::Error;

mod balance_checks;
mod band;
mod chain;
mod estimate;
mod fin;
pub mod glide;
mod input_checks;
mod key_figures;
mod model_checks;

use band::require_finite;
pub use chain::analyse_with;
pub use estimate::{fuselage_cm_alpha, trim_input, Glide};
use estimate::{numerics_used, thin_section_models};
pub use fin::{FinFigures, FinNote, FIN_VOLUME_RANGE};
pub use input_checks::TIP_REYNOLDS_STATION;
pub use key_figures::{to_common_reference, KeyFigures, COMMON_REFERENCE};
pub use model_checks::{
    MAX_USEFUL_WASHOUT_CHANGE_DEG, MODELS_DISAGREE, TIP_STALL_PERCENT_SEMISPAN,
};

/// Trim speed below this multiple of the stall speed gives a caution (common practice: 1.2,
/// the margin a pilot keeps in turbulence).
pub const NEAR_STALL_FACTOR: f64 = 1.2;
/// Static margin below which the builder is warned, fraction of MAC (common practice: 5 %).
pub const LOW_STATIC_MARGIN: f64 = 0.05;
/// Reynolds number (on the wing MAC at trim speed) below which sections lose lift and gain
/// drag sharply; a warning is raised (common practice for model airfoils: 50 000).
pub const LOW_REYNOLDS_WARNING: f64 = 50_000.0;
/// Reynolds number below which a note is raised (common practice: 100 000).
pub const LOW_REYNOLDS_NOTE: f64 = 100_000.0;
/// Difference between weighed and listed CG above which the builder is warned, m
/// (common practice: 5 mm, about what a kitchen-scale weighing resolves on a model).
pub const WEIGHING_CG_TOLERANCE_M: f64 = 0.005;
/// Relative difference between weighed and listed mass above which the builder is warned
/// (common practice: 5 %).
pub const WEIGHING_MASS_TOLERANCE: f64 = 0.05;

/// Options of an analysis.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AnalysisOptions {
    /// Panels for the vortex panel method, where it is used.
    pub panels: usize,
    /// Strips per half-span of the wing, overriding the file's `[numerics]` (`None`: the
    /// file's, or the default).
    pub stations_per_half_span: Option<usize>,
    /// Compute the flight polar (sink and glide over the speed range, with viscous section
    /// drag); off for trade studies that only need balance and trim.
    pub flight_polar: bool,
}

impl Default for AnalysisOptions {
    fn default() -> Self {
        AnalysisOptions {
            panels: crate::section::DEFAULT_ANALYSIS_PANELS,
            stations_per_half_span: None,
            flight_polar: true,
        }
    }
}

/// Why an analysis could not be completed.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum AnalysisError {
    /// The mass list is unusable.
    #[error(transparent)]
    Balance(#[from] balance::BalanceError),
    /// An airfoil could not be analysed.
    #[error(transparent)]
    Section(#[from] crate::section::SectionError),
    /// A result came out non-finite: the input is outside what the models can handle.
    #[error("the analysis produced a non-finite {quantity}; check the geometry and masses for extreme values")]
    NonFinite {
        /// Which quantity.
        quantity: &'static str,
    },
}

/// The recommended CG band.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CgBand {
    /// Forward limit, m aft of the datum (at the largest recommended static margin).
    pub forward_x_m: f64,
    /// Aft limit, m aft of the datum: the smallest recommended static margin, measured from
    /// the forward end of the neutral point's uncertainty range where it has one.
    pub aft_x_m: f64,
    /// What sets the forward limit.
    pub forward_limit: ForwardLimit,
    /// What sets the aft limit.
    pub aft_limit: AftLimit,
}

/// How far a CG may lie outside the recommended band before it counts as outside, m: the
/// half millimetre that the printed figures round away.
pub const CG_BAND_ALLOWANCE_M: f64 = 5e-4;

/// Where a CG lies against the recommended band (with [`CG_BAND_ALLOWANCE_M`]).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum BandPosition {
    /// Forward of the band's forward end.
    Forward,
    /// Inside the band.
    Inside,
    /// Aft of the band's aft end.
    Aft,
}

impl CgBand {
    /// Where `x_m` (m aft of the datum) lies against the band.
    pub fn position(&self, x_m: f64) -> BandPosition {
        if x_m < self.forward_x_m - CG_BAND_ALLOWANCE_M {
            BandPosition::Forward
        } else if x_m > self.aft_x_m + CG_BAND_ALLOWANCE_M {
            BandPosition::Aft
        } else {
            BandPosition::Inside
        }
    }
}

/// Advice for one ballast bay.
#[derive(Debug, Clone, PartialEq)]
pub struct BallastAdvice {
    /// Bay name.
    pub bay: String,
    /// Target CG, m: the file's target static margin, or the band's aft end when that
    /// margin would put the CG behind it.
    pub target_x_m: f64,
    /// True when the target margin lies aft of the band and the advice aims at the band's aft
    /// end instead.
    pub held_at_band_aft_end: bool,
    /// What the bay can do.
    pub outcome: BallastOutcome,
}

/// Everything computed for one aircraft.
#[derive(Debug, Clone, PartialEq)]
pub struct Analysis {
    /// The wing model and resolution the figures come from.
    pub numerics: crate::model::Numerics,
    /// The air at the file's altitude.
    pub air: AirState,
    /// Section models, parallel to `aircraft.airfoils`.
    pub sections: Vec<SectionModel>,
    /// Wing geometry.
    pub wing_geometry: PlanformGeometry,
    /// Stabiliser geometry.
    pub stabiliser_geometry: Option<PlanformGeometry>,
    /// Tail or canard volume.
    pub tail_volume: Option<TailVolume>,
    /// Masses and CG.
    pub mass: MassSummary,
    /// Wing loading, kg/m^2 (mass over wing area).
    pub wing_loading_kg_m2: f64,
    /// Wing reduced to an equivalent straight wing.
    pub wing: EquivalentSurface,
    /// Stabiliser reduced likewise.
    pub stabiliser: Option<EquivalentSurface>,
    /// Closed-form estimate, kept as a cross-check.
    pub classical: ClassicalEstimate,
    /// Full lifting-line balance and trim, when it solved.
    pub full: Option<trim::FullStability>,
    /// Spread (one standard deviation) of the neutral point from the inputs the tool cannot
    /// know well, by linear sensitivities of the closed form
    /// ([`crate::stability::uncertainty`], common-practice spreads).
    pub neutral_point_spread: crate::stability::uncertainty::NeutralPointSpread,
    /// Spread (one standard deviation) of the CG from the builder's own tolerances of masses
    /// and positions (zero when the file gives none).
    pub cg_spread: crate::stability::uncertainty::CgSpread,
    /// The fin's lateral note, when the aircraft has a fin or a V-tail.
    pub fin: Option<FinNote>,
    /// The headline figures (from `full` when present, else from `classical`).
    pub headline: Headline,
    /// Recommended CG band.
    pub band: CgBand,
    /// Ballast advice, per bay, when a target static margin is given.
    pub ballast: Vec<BallastAdvice>,
    /// Reynolds number on the wing MAC at trim speed (or stall speed when no trim).
    pub reynolds_mac: f64,
    /// Mass and CG measured by the weighing in the file, if any.
    pub weighed: Option<MassSummary>,
    /// The parabolic glide estimate from the drag build-up (a cross-check only).
    pub glide: Glide,
    /// The flight polar from the trimmed wing model and viscous section drag (when asked for
    /// and computed).
    pub glide_polar: Option<glide::GlidePolar>,
    /// The flight polar of each named flap setting (empty without settings or polar).
    pub flap_polars: Vec<glide::SettingPolar>,
    /// Everything the builder should read.
    pub cautions: Vec<Caution>,
}

/// The headline glide figures, from the flight polar when it was computed, else from the
/// parabolic estimate: the one place tables, JSON, the report and comparisons read them.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GlideFigures {
    /// True when they come from the flight polar.
    pub from_flight_polar: bool,
    /// Best glide ratio.
    pub best_glide_ratio: f64,
    /// Its speed, m/s.
    pub best_glide_speed_m_s: f64,
    /// Minimum sink, m/s.
    pub min_sink_m_s: f64,
    /// Its speed, m/s.
    pub min_sink_speed_m_s: f64,
    /// True when minimum sink lies on the stall end of the range (not an optimum).
    pub min_sink_at_stall: bool,
    /// True when best glide lies on the stall end.
    pub best_glide_at_stall: bool,
    /// The slowest speed to fly for least sink, m/s: 1.2 times the stall speed (common
    /// practice), when the least sink lies below it; `None` otherwise.
    pub min_sink_slow_limit_m_s: Option<f64>,
}

impl Analysis {
    /// The headline glide figures; `None` when the aircraft is unstable at its CG (it cannot
    /// hold a trimmed glide, so no glide figure means anything).
    pub fn glide_figures(&self) -> Option<GlideFigures> {
        if self.headline.static_margin <= 0.0 {
            return None;
        }
        // Only the flight polar gives headline figures: the parabolic estimate (its least
        // sink always at CL max) stays a cross-check in the JSON.
        let p = self.glide_polar.as_ref()?;
        Some(GlideFigures {
            from_flight_polar: true,
            best_glide_ratio: p.best_glide.point.glide_ratio,
            best_glide_speed_m_s: p.best_glide.point.speed_m_s,
            min_sink_m_s: p.min_sink.point.sink_m_s,
            min_sink_speed_m_s: p.min_sink.point.speed_m_s,
            min_sink_at_stall: p.min_sink.at_stall,
            best_glide_at_stall: p.best_glide.at_stall,
            min_sink_slow_limit_m_s: {
                let v = glide::MIN_SINK_STALL_MARGIN * p.stall_speed_m_s;
                (p.min_sink.point.speed_m_s < v).then_some(v)
            },
        })
    }
}

/// Which model gave the headline figures.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Method {
    /// The numerical model of all surfaces together (the vortex lattice, or the lifting line
    /// when the file asks for it).
    Numerical(WingModel),
    /// The closed-form estimate (used only when the numerical model could not be solved).
    Classical,
}

impl Method {
    /// Name used in tables and JSON.
    pub fn as_str(self) -> &'static str {
        match self {
            Method::Numerical(m) => m.as_str(),
            Method::Classical => "classical",
        }
    }
}

/// The trim state shown to the builder.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TrimSummary {
    /// Fuselage-datum angle of attack, rad.
    pub alpha_rad: f64,
    /// Total lift coefficient on the wing area.
    pub cl: f64,
    /// Trim speed, m/s.
    pub speed_m_s: f64,
    /// Stabiliser lift coefficient on its own area.
    pub stabiliser_cl: f64,
    /// Elevator at trim, rad (zero: the trim is computed with neutral elevator).
    pub elevator_rad: f64,
}

/// Where the stall begins.
#[derive(Debug, Clone, PartialEq)]
pub struct StallLocation {
    /// Surface index (0 wing, 1 stabiliser).
    pub surface: usize,
    /// Surface name ("wing", "tail", "canard").
    pub surface_name: &'static str,
    /// Spanwise position, percent of that surface's semispan.
    pub percent_semispan: f64,
}

/// The headline figures of balance and trim, from the best model that solved.
#[derive(Debug, Clone, PartialEq)]
pub struct Headline {
    /// Which model.
    pub method: Method,
    /// Neutral point, m aft of the datum.
    pub neutral_point_x_m: f64,
    /// Static margin, fraction of MAC.
    pub static_margin: f64,
    /// Trim at the CG, when there is one at positive lift.
    pub trim: Option<TrimSummary>,
    /// Aircraft CL_max.
    pub cl_max: f64,
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
    /// Where stall begins (lifting line only).
    pub stall_location: Option<StallLocation>,
}

/// What sets the forward end of the recommended CG band.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ForwardLimit {
    /// The largest recommended static margin.
    StaticMargin,
    /// Elevator authority: further forward, full up elevator cannot hold the stall.
    ElevatorAuthority,
    /// Tailplane stall: further forward, the tailplane reaches its negative cl limit before
    /// the wing's stall can be reached.
    TailStall,
}

/// What sets the aft end of the recommended CG band.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum AftLimit {
    /// The smallest recommended static margin on the computed neutral point (no uncertainty
    /// range is known for it).
    StaticMargin,
    /// The smallest recommended static margin measured from the forward end of the neutral
    /// point's uncertainty range (two standard deviations ahead of the computed point): a CG
    /// there keeps that margin even if the neutral point lies at the forward end.
    NeutralPointRange,
}

/// The section models of an aircraft's airfoils, computed once and reusable for every
/// configuration that keeps the airfoils (masses, CG, incidences may change).
#[derive(Debug, Clone, PartialEq)]
pub struct SectionSet {
    /// Section models (the file's methods), parallel to `aircraft.airfoils`.
    pub models: Vec<SectionModel>,
    /// Thin-airfoil models for the closed-form cross-check, parallel likewise.
    pub thin: Vec<SectionModel>,
    /// Cautions the section methods raised, in airfoil order.
    pub cautions: Vec<Caution>,
}

/// Compute the section models of every airfoil of `aircraft`.
pub fn section_set(
    aircraft: &Aircraft,
    options: &AnalysisOptions,
) -> Result<SectionSet, AnalysisError> {
    let mut cautions = Vec::new();
    let mut models = Vec::with_capacity(aircraft.airfoils.len());
    for airfoil in &aircraft.airfoils {
        let outcome = crate::section::section_model(
            airfoil,
            &crate::section::SectionOptions {
                panels: options.panels,
            },
        )?;
        models.push(outcome.model);
        cautions.extend(outcome.cautions);
    }
    // The closed-form cross-check uses thin-airfoil theory for every section (lift slope
    // 2 pi, zero-lift angle and moment from the mean line), independent of the panel method.
    let thin = thin_section_models(aircraft, options)?;
    Ok(SectionSet {
        models,
        thin,
        cautions,
    })
}

/// The lifting-line options an analysis of `aircraft` uses (the file's `[numerics]` with the
/// options' override).
pub fn lifting_line_options(aircraft: &Aircraft, options: &AnalysisOptions) -> LiftingLineOptions {
    let n = numerics_used(aircraft, options);
    LiftingLineOptions {
        model: n.wing_model,
        stations_per_half_span: n.strips_per_half_span,
        chordwise_panels: n.chordwise_panels,
        ..LiftingLineOptions::default()
    }
}

/// Run the whole chain on `aircraft`.
pub fn analyse(aircraft: &Aircraft, options: &AnalysisOptions) -> Result<Analysis, AnalysisError> {
    let sections = section_set(aircraft, options)?;
    let system = trim::build_system(
        aircraft,
        &sections.models,
        lifting_line_options(aircraft, options),
    );
    analyse_with(aircraft, &sections, system.as_ref(), None, options)
}

/// The full lifting-line balance and trim on `system`, or `None` with the warning
/// `lifting-line-failed` when the system could not be built or solved.
fn full_stability_or_caution(
    system: Result<&MultiSurfaceSystem, &LiftingLineError>,
    input: &trim::TrimInput<'_>,
    memo: Option<&trim::ForwardLimitMemo>,
    cautions: &mut Vec<Caution>,
) -> Option<trim::FullStability> {
    match system
        .map_err(Clone::clone)
        .and_then(|system| trim::full_stability_on(system, input, memo))
    {
        Ok(f) => Some(f),
        Err(e) => {
            cautions.push(Caution::of(
                InputFinding::LiftingLineFailed { error: e }.into(),
            ));
            None
        }
    }
}

/// Span efficiency (on the projected span) above which the wake solution is not trusted.
/// Munk's theorem bounds a planar lifting system at 1 (the elliptic loading); the height that
/// dihedral and a stabiliser give model aircraft adds a few percent (Kroo's nonplanar results
/// reach about 1.1 for a height of a tenth of the span; from memory). 1.2 leaves room for
/// those and for the lattice's discretisation.
pub const MAX_PLAUSIBLE_SPAN_EFFICIENCY: f64 = 1.2;

/// `Some` when a span efficiency over the polar's trimmed points exceeds
/// [`MAX_PLAUSIBLE_SPAN_EFFICIENCY`] or is not finite: the greatest finite one, or `None`
/// inside when one was not finite.
fn implausible_span_efficiency(p: &glide::GlidePolar) -> Option<Option<f64>> {
    let values: Vec<f64> = p
        .points
        .iter()
        .filter_map(|q| q.trim.span_efficiency)
        .collect();
    if values.iter().any(|e| !e.is_finite()) {
        return Some(None);
    }
    let worst = values.iter().copied().fold(0.0_f64, f64::max);
    (worst > MAX_PLAUSIBLE_SPAN_EFFICIENCY).then_some(Some(worst))
}

/// The flight polar from the trimmed wing model, when asked for and the full model solved,
/// with the glide cautions; an error when its minimum sink or best glide is not finite.
fn flight_polar_if_asked(
    input: &trim::TrimInput<'_>,
    system: Result<&MultiSurfaceSystem, &LiftingLineError>,
    full: Option<&trim::FullStability>,
    air: &AirState,
    options: &AnalysisOptions,
    cautions: &mut Vec<Caution>,
) -> Result<(Option<glide::GlidePolar>, Vec<glide::SettingPolar>), AnalysisError> {
    let unstable = full.is_some_and(|f| f.static_margin <= 0.0);
    if options.flight_polar && unstable {
        cautions.push(Caution::of(
            GlideFinding::NoFlightPolar {
                why: PolarMissing::Unstable,
            }
            .into(),
        ));
    }
    let (glide_polar, flap_polars) = match (options.flight_polar, system, full) {
        (true, Ok(system), Some(f)) if !unstable => {
            let glide_input = glide::GlideInput {
                aircraft: input.aircraft,
                system,
                sections: input.sections,
                full: f,
                mass_kg: input.mass_kg,
                cg_m: (input.cg_x_m, input.cg_z_m),
                air,
                panels: options.panels,
            };
            // Independent: the flap settings' polars are made alongside the plain one.
            let (polar, settings) = rayon::join(
                || glide::glide_polar(&glide_input),
                || glide::setting_polars(&glide_input),
            );
            if let Some(e) = polar.as_ref().ok().and_then(implausible_span_efficiency) {
                cautions.push(Caution::of(
                    GlideFinding::NoFlightPolar {
                        why: PolarMissing::ImplausibleInducedDrag { span_efficiency: e },
                    }
                    .into(),
                ));
                return Ok((None, Vec::new()));
            }
            glide::glide_cautions(input.aircraft, &polar, cautions);
            glide::setting_cautions(input.aircraft, &settings, cautions);
            (polar.ok(), settings)
        }
        _ => (None, Vec::new()),
    };
    if let Some(p) = &glide_polar {
        require_finite(&[
            ("minimum sink", p.min_sink.point.sink_m_s),
            ("best glide", p.best_glide.point.glide_ratio),
        ])?;
    }
    Ok((glide_polar, flap_polars))
}
