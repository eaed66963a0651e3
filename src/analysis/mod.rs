//! The whole analysis chain in one call: sections, planform, masses, balance, stability, trim,
//! stall; with the cautions found on the way.
//!
//! This module only composes the published methods that live in their own modules; it adds
//! the decisions a builder needs (CG band, ballast advice, cautions) and their thresholds,
//! which are common practice and documented in `docs/cautions.md`.

use crate::atmosphere::AirState;
use crate::balance::{self, BallastOutcome, MassSummary};
use crate::caution::{Caution, Level};
use crate::model::{Aircraft, StabiliserRole};
use crate::performance::drag::{self, BodyDragInput, SurfaceDragInput};
use crate::performance::polar::{oswald_straight_wing, GlidePerformance, PolarInput};

use crate::lifting_line::{LiftingLineError, LiftingLineOptions, MultiSurfaceSystem};
use crate::model::WingModel;
use crate::planform::{self, PlanformGeometry, TailVolume};
use crate::section::SectionModel;
use crate::stability::classical::{self, ClassicalEstimate, EquivalentSurface, StabiliserPlace};
use crate::stability::trim;
use thiserror::Error;

mod chain;
pub mod glide;

pub use chain::analyse_with;

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

/// Lowest and highest vertical tail volume coefficients of the table of typical values for
/// each class of aircraft in Raymer, *Aircraft Design: A Conceptual Approach*, Table 6.4
/// (0.02 for sailplanes to 0.09 for jet transports; homebuilts 0.04; table number from
/// memory). A fin outside this range gets a note; nothing in the pitch figures depends on it.
pub const FIN_VOLUME_RANGE: (f64, f64) = (0.02, 0.09);

/// The lateral note of a fin or V-tail: its side area, arm and vertical tail volume
/// coefficient. It does not enter any pitch figure.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FinFigures {
    /// Side area, m^2 (a fin's own area; a V-tail's area in its plane times sin^2 of the
    /// dihedral).
    pub side_area_m2: f64,
    /// From the wing's MAC quarter chord to the fin's (or the V-tail's), m.
    pub arm_m: f64,
    /// V_v = S_v l_v / (S b).
    pub volume_coefficient: f64,
}

/// A fin, a V-tail, or both.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FinNote {
    /// The `[fin]` of the file, if any.
    pub fin: Option<FinFigures>,
    /// The V-tail's side projection, when the stabiliser is a V-tail.
    pub vee_tail: Option<FinFigures>,
}

/// The fin note of `aircraft` (None without a fin or a V-tail), with a note when a fin's
/// volume coefficient lies outside [`FIN_VOLUME_RANGE`] on an aircraft without a V-tail.
fn fin_note(
    aircraft: &Aircraft,
    wing: &PlanformGeometry,
    cautions: &mut Vec<Caution>,
) -> Option<FinNote> {
    let fin = aircraft.fin.as_ref().map(|f| {
        let g = planform::fin_geometry(f);
        let arm_m = g.mac_quarter_x_m() - wing.mac_quarter_x_m();
        FinFigures {
            side_area_m2: g.area_m2,
            arm_m,
            volume_coefficient: planform::fin_volume_coefficient(wing, g.area_m2, arm_m),
        }
    });
    let vee_tail = aircraft
        .stabiliser
        .as_ref()
        .filter(|s| planform::is_vee_tail(&s.surface))
        .map(|s| {
            let side = planform::side_area_m2(&s.surface);
            let arm_m = planform::geometry(&s.surface).mac_quarter_x_m() - wing.mac_quarter_x_m();
            FinFigures {
                side_area_m2: side,
                arm_m,
                volume_coefficient: planform::fin_volume_coefficient(wing, side, arm_m),
            }
        });
    if let (Some(f), None) = (fin, vee_tail) {
        let (lo, hi) = FIN_VOLUME_RANGE;
        let v = f.volume_coefficient;
        if f.arm_m.is_finite() && f.arm_m <= 0.0 {
            // A fin at or ahead of the wing destabilises in yaw: most likely a position typed
            // from another datum or in another unit.
            cautions.push(Caution::new(
                Level::Warning,
                "fin-ahead-of-wing",
                format!(
                    "The fin's quarter chord lies {:.0} mm ahead of the wing's: a fin there \
                     makes the aircraft unstable in yaw. Check fin.x (measured from the datum, \
                     in mm unless a unit is written).",
                    -1000.0 * f.arm_m
                ),
            ));
        } else if v.is_finite() && !(lo..=hi).contains(&v) {
            cautions.push(Caution::new(
                Level::Note,
                "fin-volume-outside-range",
                format!(
                    "The fin's volume coefficient S_v l_v / (S b) is {v:.3}, {} the typical values \
                     of {lo:.2} (sailplanes) to {hi:.2} (Raymer, Aircraft Design, table of tail volume \
                     coefficients): {}. This is a lateral note only; the fin does not enter the \
                     pitch figures.",
                    if v < lo { "below" } else { "above" },
                    if v < lo {
                        "weak directional stability is possible; compare with similar aircraft \
                         that fly well"
                    } else {
                        "a large fin; check that it is what you meant"
                    }
                ),
            ));
        }
    }
    if let Some((f, item)) = aircraft.fin.as_ref().and_then(|f| {
        let name = f.mass_item.as_ref()?;
        Some((f, aircraft.masses.iter().find(|m| &m.name == name)?))
    }) {
        // The fin's extent along x: root leading edge to the further trailing edge.
        let tip_le = f.root_le_x_m + f.height_m * f.sweep_le_rad.tan();
        let (x0, x1) = (
            f.root_le_x_m.min(tip_le),
            (f.root_le_x_m + f.root_chord_m).max(tip_le + f.tip_chord_m),
        );
        if item.x_m < x0 || item.x_m > x1 {
            cautions.push(Caution::new(
                Level::Note,
                "fin-mass-away-from-fin",
                format!(
                    "The mass item `{}`, named as the fin's mass, is at {:.0} mm, outside the fin \
                     ({:.0} to {:.0} mm from the datum); check its x.",
                    item.name,
                    1000.0 * item.x_m,
                    1000.0 * x0,
                    1000.0 * x1
                ),
            ));
        }
    }
    (fin.is_some() || vee_tail.is_some()).then_some(FinNote { fin, vee_tail })
}

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

/// Advice for one ballast bay.
#[derive(Debug, Clone, PartialEq)]
pub struct BallastAdvice {
    /// Bay name.
    pub bay: String,
    /// Target CG, m.
    pub target_x_m: f64,
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

/// The closed-form estimate's input: the equivalent wing and stabiliser (with its place, tail
/// or canard), the mass and CG, the air density, the fuselage's pitching term and the
/// stabiliser's dynamic-pressure ratio (1 without a stabiliser).
fn closed_form_input<'a>(
    aircraft: &Aircraft,
    wing: &'a EquivalentSurface,
    stabiliser: Option<&'a EquivalentSurface>,
    mass: &MassSummary,
    air: &AirState,
    fuselage_cm_alpha_per_rad: f64,
) -> classical::EstimateInput<'a> {
    let place = aircraft.stabiliser.as_ref().map(|s| match s.role {
        StabiliserRole::Tail => StabiliserPlace::Tail,
        StabiliserRole::Canard => StabiliserPlace::Canard,
    });
    classical::EstimateInput {
        wing,
        stabiliser: stabiliser.zip(place),
        mass_kg: mass.total_kg,
        cg_x_m: mass.cg_x_m,
        density_kg_m3: air.density_kg_m3,
        fuselage_cm_alpha_per_rad,
        stabiliser_dynamic_pressure_ratio: aircraft
            .stabiliser
            .as_ref()
            .map_or(1.0, |s| s.dynamic_pressure_ratio),
        downwash_factor: 1.0,
    }
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
            cautions.push(Caution::new(
                Level::Warning,
                "lifting-line-failed",
                format!(
                    "The lifting-line model could not be solved ({e}); the figures come from the \
                     closed-form estimate only, which ignores sweep, tail height and the spanwise loading."
                ),
            ));
            None
        }
    }
}

/// The recommended CG band from the neutral point `np_x_m` and the wing's MAC `mac_m`: the
/// aft end at the least static margin, the forward end at the greatest static margin or at the
/// full model's forward limit when that lies further aft. The flag is true when that forward
/// limit lies aft of the aft end (no usable range; the band then closes on its aft end).
fn cg_band(
    aircraft: &Aircraft,
    full: Option<&trim::FullStability>,
    np_x_m: f64,
    np_spread_m: f64,
    mac_m: f64,
) -> (CgBand, bool) {
    let margin_forward_x_m = np_x_m - aircraft.margin_limits.max_static_margin * mac_m;
    let elevator_limit = full.and_then(|f| {
        f.elevator_forward_limit_x_m
            .map(|x| (x, f.forward_limit_cause))
    });
    let (forward_x_m, forward_limit) = match elevator_limit {
        Some((x, cause)) if x > margin_forward_x_m => (
            x,
            match cause {
                trim::ForwardLimitCause::ControlAuthority => ForwardLimit::ElevatorAuthority,
                trim::ForwardLimitCause::StabiliserClMin => ForwardLimit::TailStall,
            },
        ),
        _ => (margin_forward_x_m, ForwardLimit::StaticMargin),
    };
    // The aft end keeps the smallest margin even from the forward end of the neutral
    // point's uncertainty range: the unsafe side of the estimate is a neutral point further
    // forward than computed.
    let (aft_from_x_m, aft_limit) = if np_spread_m.is_finite() && np_spread_m > 0.0 {
        (np_x_m - np_spread_m, AftLimit::NeutralPointRange)
    } else {
        (np_x_m, AftLimit::StaticMargin)
    };
    let aft_x_m = aft_from_x_m - aircraft.margin_limits.min_static_margin * mac_m;
    // A control too weak to hold the stall even at the aft limit leaves no usable range: the
    // band closes on its aft end and a danger says so (`cg-band-empty`).
    let band_empty = forward_x_m > aft_x_m;
    let band = CgBand {
        forward_x_m: forward_x_m.min(aft_x_m),
        aft_x_m,
        forward_limit,
        aft_limit,
    };
    (band, band_empty)
}

/// Ballast advice for every bay to reach the file's target static margin (none without a
/// target), from the neutral point `np_x_m` and the wing's MAC `mac_m`.
fn ballast_advice(
    aircraft: &Aircraft,
    mass: &MassSummary,
    np_x_m: f64,
    mac_m: f64,
) -> Vec<BallastAdvice> {
    match aircraft.targets.static_margin {
        None => Vec::new(),
        Some(sm) => {
            let target_x_m = np_x_m - sm * mac_m;
            aircraft
                .ballast_bays
                .iter()
                .map(|bay| BallastAdvice {
                    bay: bay.name.clone(),
                    target_x_m,
                    outcome: balance::ballast_for_target(mass, bay, target_x_m),
                })
                .collect()
        }
    }
}

/// The first named quantity that is not finite, as `AnalysisError::NonFinite`.
fn require_finite(quantities: &[(&'static str, f64)]) -> Result<(), AnalysisError> {
    for &(name, v) in quantities {
        if !v.is_finite() {
            return Err(AnalysisError::NonFinite { quantity: name });
        }
    }
    Ok(())
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
        cautions.push(Caution::new(
            Level::Note,
            "no-flight-polar",
            "At this CG the aircraft is unstable in pitch (negative static margin): it cannot \
             hold a trimmed glide, so no glide figures are given.",
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

/// The mass and CG from the file's weighing, if it has one, with the caution comparing it
/// with the listed masses.
fn weighing_if_any(
    aircraft: &Aircraft,
    mass: &MassSummary,
    cautions: &mut Vec<Caution>,
) -> Result<Option<MassSummary>, AnalysisError> {
    let weighed = if aircraft.weighing.is_empty() {
        None
    } else {
        Some(balance::weighing(&aircraft.weighing)?)
    };
    if let Some(w) = &weighed {
        weighing_caution(w, mass, cautions);
    }
    Ok(weighed)
}

/// The note `vertical-cg-partial` when some but not all masses have a height.
fn vertical_cg_partial_caution(aircraft: &Aircraft, cautions: &mut Vec<Caution>) {
    let with_z = aircraft.masses.iter().filter(|m| m.z_m.is_some()).count();
    if with_z > 0 && with_z < aircraft.masses.len() {
        cautions.push(Caution::new(
            Level::Note,
            "vertical-cg-partial",
            format!(
                "{with_z} of the {} masses have a height (z); the vertical CG needs all of them, so it is \
                 not used and moments are taken at the wing root's height. Give every mass a z to use it.",
                aircraft.masses.len()
            ),
        ));
    }
}

/// The danger `cg-band-empty`: full nose-up control cannot hold the stall even with the CG at
/// the band's aft end `aft_x_m`.
fn cg_band_empty_caution(aircraft: &Aircraft, aft_x_m: f64, cautions: &mut Vec<Caution>) {
    let control = aircraft.pitch_control_name();
    cautions.push(Caution::new(
        Level::Danger,
        "cg-band-empty",
        format!(
            "Full up {control} cannot hold the wing at its stall even with the CG at the aft end \
             of the recommended range ({:.0} mm from the datum, static margin {:.0} %): there is no \
                              usable CG range. Give the {control} more throw or more chord before flying.",
            aft_x_m * 1000.0,
            100.0 * aircraft.margin_limits.min_static_margin
        ),
    ));
}

/// The Reynolds-number cautions on the MAC at `speed_m_s` and near the tip (at
/// `TIP_REYNOLDS_STATION` of the half span) at the stall speed `stall_speed_m_s`.
fn tip_reynolds_caution(
    aircraft: &Aircraft,
    air: &AirState,
    reynolds_mac: f64,
    speed_m_s: f64,
    stall_speed_m_s: f64,
    cautions: &mut Vec<Caution>,
) {
    let tip_chord_m = planform::station_at(
        &aircraft.wing,
        TIP_REYNOLDS_STATION * planform::half_span_length_m(&aircraft.wing),
    )
    .chord_m;
    reynolds_caution(
        reynolds_mac,
        speed_m_s,
        air.reynolds(stall_speed_m_s, tip_chord_m),
        tip_chord_m,
        stall_speed_m_s,
        cautions,
    );
}

fn headline_of(
    aircraft: &Aircraft,
    full: Option<&trim::FullStability>,
    est: &ClassicalEstimate,
) -> Headline {
    let surface_name = |i: usize| -> &'static str {
        match (i, aircraft.stabiliser.as_ref().map(|s| s.role)) {
            (0, _) => "wing",
            (_, Some(StabiliserRole::Canard)) => "canard",
            _ => "tail",
        }
    };
    match full {
        Some(f) => Headline {
            method: Method::Numerical(aircraft.numerics.wing_model),
            neutral_point_x_m: f.neutral_point_x_m,
            static_margin: f.static_margin,
            trim: f.trim.as_ref().map(|t| TrimSummary {
                alpha_rad: t.alpha_rad,
                cl: t.cl,
                speed_m_s: t.speed_m_s,
                stabiliser_cl: t.stabiliser_cl,
                elevator_rad: 0.0,
            }),
            cl_max: f.stall.as_ref().map_or(est.cl_max, |s| s.cl_max),
            stall_speed_m_s: f
                .stall
                .as_ref()
                .map_or(est.stall_speed_m_s, |s| s.speed_m_s),
            stall_location: f.stall.as_ref().map(|s| StallLocation {
                surface: s.surface,
                surface_name: surface_name(s.surface),
                percent_semispan: s.percent_semispan,
            }),
        },
        None => Headline {
            method: Method::Classical,
            neutral_point_x_m: est.neutral_point_x_m,
            static_margin: est.static_margin,
            trim: est.trim.map(|t| TrimSummary {
                alpha_rad: t.alpha_body_rad,
                cl: t.cl,
                speed_m_s: t.speed_m_s,
                stabiliser_cl: t.stabiliser_cl,
                elevator_rad: 0.0,
            }),
            cl_max: est.cl_max,
            stall_speed_m_s: est.stall_speed_m_s,
            stall_location: None,
        },
    }
}

fn weighing_caution(w: &MassSummary, mass: &MassSummary, cautions: &mut Vec<Caution>) {
    let dx_mm = (w.cg_x_m - mass.cg_x_m) * 1000.0;
    let dm_pct = 100.0 * (w.total_kg - mass.total_kg) / mass.total_kg;
    if dx_mm.abs() > WEIGHING_CG_TOLERANCE_M * 1000.0
        || dm_pct.abs() > 100.0 * WEIGHING_MASS_TOLERANCE
    {
        cautions.push(Caution::new(
            Level::Warning,
            "weighing-differs",
            format!(
                "The weighing puts the CG at {:.0} mm and the mass at {:.0} g; the mass list gives {:.0} mm \
                 and {:.0} g ({dx_mm:+.0} mm, {dm_pct:+.1} %). Trust the scales: correct the mass list \
                 (a forgotten item, a wrong position) before relying on the figures here.",
                w.cg_x_m * 1000.0,
                w.total_kg * 1000.0,
                mass.cg_x_m * 1000.0,
                mass.total_kg * 1000.0
            ),
        ));
    }
}

/// Fraction of the semispan where the wing's tip Reynolds number is taken (95 %: the outer
/// sections that stall a tip; the very tip of an elliptic wing has no chord).
pub const TIP_REYNOLDS_STATION: f64 = 0.95;

/// The Reynolds caution: the wing's mean chord at `speed` (trim, or stall when there is no
/// trim), and its tip (chord `tip_chord_m`) at the stall speed, where a tip stall starts.
fn reynolds_caution(
    reynolds_mac: f64,
    speed: f64,
    reynolds_tip_at_stall: f64,
    tip_chord_m: f64,
    stall_speed: f64,
    cautions: &mut Vec<Caution>,
) {
    use crate::caution::reynolds_text;
    let worst = reynolds_mac.min(reynolds_tip_at_stall);
    let level = if worst < LOW_REYNOLDS_WARNING {
        Level::Warning
    } else if worst < LOW_REYNOLDS_NOTE {
        Level::Note
    } else {
        return;
    };
    let effect = if worst < LOW_REYNOLDS_WARNING {
        "airfoils lose lift and gain drag sharply below about 50,000, so expect a higher stall \
         speed, an earlier tip stall and a poorer glide than estimated"
    } else {
        "below about 100,000 section data and cl_max are uncertain; choose airfoils made for low \
         Reynolds numbers"
    };
    cautions.push(Caution::new(
        level,
        "reynolds-low",
        format!(
            "Reynolds number on the wing's mean chord at {speed:.1} m/s is {}; at the tip ({:.0} mm \
             chord, {:.0} % of the semispan) at the stall speed {stall_speed:.1} m/s it is {}: {effect}.",
            reynolds_text(reynolds_mac),
            tip_chord_m * 1000.0,
            100.0 * TIP_REYNOLDS_STATION,
            reynolds_text(reynolds_tip_at_stall),
        ),
    ));
}

fn balance_cautions(
    aircraft: &Aircraft,
    mass: &MassSummary,
    h: &Headline,
    band: &CgBand,
    mac_m: f64,
    elevons_trim_it: bool,
    cautions: &mut Vec<Caution>,
) {
    static_margin_cautions(aircraft, mass, h, cautions);
    cg_outside_band_caution(aircraft, mass, band, cautions);
    trim_cautions(aircraft, mass, h, band, elevons_trim_it, cautions);
    band_defaults_note(aircraft, mac_m, cautions);
}

/// The danger `static-margin-negative` or the warning `static-margin-low`.
fn static_margin_cautions(
    aircraft: &Aircraft,
    mass: &MassSummary,
    h: &Headline,
    cautions: &mut Vec<Caution>,
) {
    let sm_pct = 100.0 * h.static_margin;
    if h.static_margin < 0.0 {
        cautions.push(Caution::new(
            Level::Danger,
            "static-margin-negative",
            format!(
                "The CG is {:.0} mm behind the neutral point (static margin {sm_pct:.1} %): the aircraft is \
                 unstable in pitch and will not fly as balanced. Move the CG forward or add nose weight.",
                (mass.cg_x_m - h.neutral_point_x_m) * 1000.0
            ),
        ));
    } else if h.static_margin < LOW_STATIC_MARGIN.min(aircraft.margin_limits.min_static_margin) {
        cautions.push(Caution::new(
            Level::Warning,
            "static-margin-low",
            format!(
                "Static margin is only {sm_pct:.1} % of the mean chord: pitch will be sensitive and an error in \
                 the estimate could make it unstable. Models usually fly with 5 to 15 %."
            ),
        ));
    }
}

/// The warning `cg-aft-of-band` or `cg-forward-of-band` (with why the forward limit is there),
/// when the CG is more than half a millimetre outside the band.
fn cg_outside_band_caution(
    aircraft: &Aircraft,
    mass: &MassSummary,
    band: &CgBand,
    cautions: &mut Vec<Caution>,
) {
    let fwd = band.forward_x_m;
    let aft = band.aft_x_m;
    if mass.cg_x_m > aft + 5e-4 {
        cautions.push(Caution::new(
            Level::Warning,
            "cg-aft-of-band",
            format!(
                "The CG is {:.0} mm aft of the recommended band ({:.0} to {:.0} mm from the datum){}.",
                (mass.cg_x_m - aft) * 1000.0,
                fwd * 1000.0,
                aft * 1000.0,
                match band.aft_limit {
                    AftLimit::NeutralPointRange => {
                        ", whose aft end keeps the smallest static margin even if the neutral \
                         point lies at the forward end of its uncertainty range"
                    }
                    AftLimit::StaticMargin => "",
                }
            ),
        ));
    } else if mass.cg_x_m < fwd - 5e-4 {
        let control = aircraft.pitch_control_name();
        let why = match band.forward_limit {
            ForwardLimit::ElevatorAuthority => format!(
                "further forward, full up {control} can no longer hold the wing at its stall, so the \
                 model cannot be flared or slowed properly"
            ),
            ForwardLimit::TailStall => "further forward, the tailplane reaches its negative stall \
                 (its download at cl_min) before the wing stalls, and pitch control is lost when \
                 slowing down"
                .to_string(),
            ForwardLimit::StaticMargin => {
                format!(
                    "the aircraft will be nose-heavy, need more {} and fly faster",
                    nose_up_control(aircraft)
                )
            }
        };
        cautions.push(Caution::new(
            Level::Warning,
            "cg-forward-of-band",
            format!(
                "The CG is {:.0} mm forward of the recommended band ({:.0} to {:.0} mm from the datum): {why}.",
                (fwd - mass.cg_x_m) * 1000.0,
                fwd * 1000.0,
                aft * 1000.0
            ),
        ));
    }
}

/// The cautions on the trim point: `trim-beyond-stall`, `trim-near-stall` (each with what to
/// change to trim faster), or `no-trim` when a stable aircraft finds no trim (unless its
/// elevons trim it within their throws).
fn trim_cautions(
    aircraft: &Aircraft,
    mass: &MassSummary,
    h: &Headline,
    band: &CgBand,
    elevons_trim_it: bool,
    cautions: &mut Vec<Caution>,
) {
    // With the incidences fixed, a CG further forward trims at a lower CL (faster): CL_trim =
    // Cm0 about the neutral point / static margin (Etkin & Reid, sec. 2.3).
    let rigging = if aircraft.stabiliser.is_some() {
        "Reduce the decalage (stabiliser incidence closer to the wing's)"
    } else {
        "Reduce the washout or reflex"
    };
    // Moving the CG forward is offered only where the band leaves room for it.
    let faster = if mass.cg_x_m > band.forward_x_m + 5e-4 {
        format!(
            "{rigging}, or move the CG forward within the recommended band: nose weight makes it \
             trim faster."
        )
    } else {
        format!("{rigging}: the CG is already at or ahead of the recommended band.")
    };
    if let Some(t) = h.trim {
        if t.cl > h.cl_max {
            cautions.push(Caution::new(
                Level::Danger,
                "trim-beyond-stall",
                format!(
                                        "The aircraft trims at CL {:.2}, above its CL max of {:.2}: as balanced it would fly \
                     stalled. {faster}",
                    t.cl, h.cl_max
                ),
            ));
        } else if t.speed_m_s < NEAR_STALL_FACTOR * h.stall_speed_m_s {
            cautions.push(Caution::new(
                Level::Warning,
                "trim-near-stall",
                format!(
                                        "Trim speed {:.1} m/s is within 20 % of the stall speed {:.1} m/s: little margin \
                     against a stall in gusts or turns. {faster}",
                    t.speed_m_s, h.stall_speed_m_s
                ),
            ));
        }
    } else if h.static_margin > 0.0 && !elevons_trim_it {
        // (A tailless wing that its elevons trim within their throws gets the tailless-trim
        // note instead.)
        cautions.push(Caution::new(
            Level::Danger,
            "no-trim",
            if aircraft.stabiliser.is_some() {
                "No trimmed flight at positive lift was found with this CG and these incidences: \
                 check the decalage (stabiliser incidence) and the CG."
            } else {
                "No trimmed flight at positive lift was found with this CG: check the washout, the \
                 reflex of the airfoils (or the elevons' trim) and the CG."
            }
            .to_string(),
        ));
    }
}

/// The note `band-defaults` when the band uses the common-practice static margins, on a mean
/// chord of `mac_m`.
fn band_defaults_note(aircraft: &Aircraft, mac_m: f64, cautions: &mut Vec<Caution>) {
    let mac_mm = mac_m * 1000.0;
    if aircraft.margin_limits.from_defaults {
        cautions.push(Caution::new(
            Level::Note,
            "band-defaults",
            format!(
                "The recommended CG band uses common-practice static margins of {:.0} to {:.0} % of the \
                 {mac_mm:.0} mm mean chord; set [limits] in the file to use your own.",
                100.0 * aircraft.margin_limits.min_static_margin,
                100.0 * aircraft.margin_limits.max_static_margin
            ),
        ));
    }
}

/// Difference between the lifting-line and closed-form neutral points above which a note
/// explains it, fraction of MAC (a judgement: the two agree within a few percent on
/// conventional high-aspect-ratio models).
pub const MODELS_DISAGREE: f64 = 0.05;

/// Stall beginning outboard of this fraction of the semispan is "tip first" (common practice:
/// outboard of mid-semispan a stall drops a wing).
pub const TIP_STALL_PERCENT_SEMISPAN: f64 = 50.0;

/// A washout change larger than this is not suggested (the file accepts twist within 15 deg;
/// a change this large means the planform or the sections must change instead).
pub const MAX_USEFUL_WASHOUT_CHANGE_DEG: f64 = 10.0;

/// What gives nose-up pitch on this aircraft, in the builder's words.
fn nose_up_control(aircraft: &Aircraft) -> &'static str {
    match (&aircraft.stabiliser, &aircraft.elevons) {
        (Some(s), _) if s.role == StabiliserRole::Canard => {
            "nose-up canard elevator (trailing edge down)"
        }
        (Some(_), _) => "up elevator",
        (None, Some(_)) => "up elevon",
        (None, None) => "nose-up trim (reflex)",
    }
}

/// `x` with a sign and `decimals` decimals, never "-0.000".
fn signed(x: f64, decimals: usize) -> String {
    let s = format!("{x:+.decimals$}");
    if s[1..].chars().all(|c| c == '0' || c == '.') {
        s[1..].to_string()
    } else {
        s
    }
}

#[allow(clippy::too_many_arguments)]
fn full_model_cautions(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    h: &Headline,
    est: &ClassicalEstimate,
    mac_m: f64,
    cg_x_m: f64,
    band_aft_x_m: f64,
    cautions: &mut Vec<Caution>,
) {
    stall_order_caution(aircraft, f, h, cautions);
    elevator_authority_caution(aircraft, f, cautions);
    tail_stall_in_range_caution(f, cautions);
    if let Some(t) = &f.tailless {
        tailless_trim_caution(aircraft, t, cg_x_m, band_aft_x_m, cautions);
    }
    models_disagree_note(aircraft, f, est, mac_m, cautions);
}

/// The caution on which surface stalls first and where: `tail-stalls-first` (downwards at
/// cl_min, or at cl_max), `canard-stall-order` or `tip-stall`.
fn stall_order_caution(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    h: &Headline,
    cautions: &mut Vec<Caution>,
) {
    if let Some(loc) = &h.stall_location {
        let role = aircraft.stabiliser.as_ref().map(|s| s.role);
        let unstable = h.static_margin <= 0.0;
        // Whether the tail carries an upload at the stall: then a forward CG relieves it.
        let tail_uploaded = f
            .stall
            .as_ref()
            .and_then(|s| s.result.surfaces.get(1))
            .is_some_and(|s| s.cl > 0.0);
        let negative = f.stall.as_ref().and_then(|s| match s.limit {
            trim::StallLimit::StabiliserClMin {
                speed_otherwise_m_s,
                ..
            } => Some((s.speed_m_s, speed_otherwise_m_s)),
            trim::StallLimit::ClMax => None,
        });
        match (loc.surface, role) {
            (1, _) if negative.is_some() => {
                let (v_tail, v_wing) = negative.unwrap_or_default();
                let surface = if role == Some(StabiliserRole::Canard) {
                    "canard"
                } else {
                    "tailplane"
                };
                cautions.push(Caution::new(
                    Level::Danger,
                    "tail-stalls-first",
                    format!(
                        "The {surface} stalls first, downwards: slowing down with the elevator, it \
                         reaches its negative cl limit (cl_min, at {:.0} % of its semispan) at {:.1} m/s, \
                         before the wing would stall at {:.1} m/s. Below {:.1} m/s pitch control would be \
                         lost, so that is the stall speed shown. Move the CG aft within the \
                         recommended band (less download needed), or give the {surface} more area or \
                         a section with a larger negative cl limit (or camber it for download).",
                        loc.percent_semispan, v_tail, v_wing, v_tail
                    ),
                ));
            }
            (0, Some(StabiliserRole::Canard)) => cautions.push(Caution::new(
                Level::Danger,
                "canard-stall-order",
                format!(
                                        "The wing reaches its cl_max before the canard (at {:.0} % of its semispan): a canard \
                     aircraft must stall on the canard first so that the nose drops. Give the canard a \
                     higher loading (more incidence relative to the wing), or move the CG forward, which \
                     loads the canard more.",
                    loc.percent_semispan
                ),
            )),
            (0, _) if loc.percent_semispan > TIP_STALL_PERCENT_SEMISPAN => cautions.push(Caution::new(
                Level::Warning,
                "tip-stall",
                format!(
                    "Stall begins at {:.0} % of the semispan, outboard of mid-span: expect a wing to drop at \
                     the stall. More washout, a tip airfoil with a higher cl_max, or less taper move it inboard.",
                    loc.percent_semispan
                ),
            )),
            (1, Some(StabiliserRole::Tail)) => cautions.push(Caution::new(
                Level::Danger,
                "tail-stalls-first",
                format!(
                                        "The tailplane reaches its cl_max before the wing (at {:.0} % of its semispan) when \
                     trimmed near the stall: pitch control would be lost. {}",
                    loc.percent_semispan,
                                        match (unstable, tail_uploaded) {
                        (true, _) => "First move the CG forward of the neutral point (see \
                                      static-margin-negative); then check this again.",
                        (false, true) => "The tail is lifting there: give it a larger area or a \
                                          section with a higher cl_max, or move the CG forward \
                                          within the recommended band (less upload needed).",
                        (false, false) => "Give the tail a larger area, a section with a higher \
                                           cl_max, or move the CG aft within the recommended band \
                                           (less download needed).",
                    }
                ),
            )),
            _ => {}
        }
    }
}

/// The warning `elevator-authority` at the first speed of the elevator schedule that needs more
/// pitch-control throw than the aircraft has.
fn elevator_authority_caution(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    cautions: &mut Vec<Caution>,
) {
    if let Some(s) = aircraft.pitch_control() {
        if let Some(p) = f.elevator_schedule.iter().find(|p| !p.within_limits) {
            let canard = aircraft
                .stabiliser
                .as_ref()
                .is_some_and(|st| st.role == StabiliserRole::Canard);
            let (need, have) = match (p.elevator_rad < 0.0, canard) {
                (true, false) => ("up", s.max_up_rad),
                (false, false) => ("down", s.max_down_rad),
                (true, true) => ("trailing edge up (nose down)", s.max_up_rad),
                (false, true) => ("trailing edge down (nose up)", s.max_down_rad),
            };
            let control = aircraft.pitch_control_name();
            let rigging = if aircraft.stabiliser.is_some() {
                "the decalage"
            } else {
                "the washout and reflex"
            };
            cautions.push(Caution::new(
                Level::Warning,
                "elevator-authority",
                format!(
                    "At {:.1} m/s the {control} need{} {:.1} deg {need} to trim, more than the {:.1} deg \
                     available: the speed range is limited by the {control}. Check the CG and {rigging}.",
                    p.speed_m_s,
                    if control == "elevons" { "" } else { "s" },
                    p.elevator_rad.abs().to_degrees(),
                    have.to_degrees()
                ),
            ));
        }
    }
}

/// The warning `tail-stall-in-range` at the first speed of the elevator schedule where the
/// tailplane is at its negative cl limit.
fn tail_stall_in_range_caution(f: &trim::FullStability, cautions: &mut Vec<Caution>) {
    if let Some(p) = f.elevator_schedule.iter().find(|p| p.stabiliser_at_cl_min) {
        cautions.push(Caution::new(
            Level::Warning,
            "tail-stall-in-range",
            format!(
                "At {:.1} m/s, trimmed with {:.1} deg of elevator, the tailplane is at its negative cl \
                 limit (cl_min): within the speed range it would stall downwards and pitch control \
                 would be lost. Move the CG aft within the band or enlarge the tailplane.",
                p.speed_m_s,
                p.elevator_rad.to_degrees()
            ),
        ));
    }
}

/// The caution `tailless-trim`: a note when the elevons trim the wing within their throws, a
/// danger or warning with the remedies when nothing trims it at its design CL.
fn tailless_trim_caution(
    aircraft: &Aircraft,
    t: &trim::TaillessCheck,
    cg_x_m: f64,
    band_aft_x_m: f64,
    cautions: &mut Vec<Caution>,
) {
    let untrimmed = t.cm_zero_lift <= 0.0 || t.cm_at_design < -1e-4;
    if let (true, true, Some(d)) = (untrimmed, t.elevon_within_throws, t.elevon_to_trim_rad) {
        // Here the wing lacks nose-up moment at the design CL (a stable wing's moment falls
        // with CL), so the fixes are more washout where it helps, or reflex.
        let washout = t
            .washout_change_rad
            .map(f64::to_degrees)
            .filter(|w| *w < 0.0 && w.abs() <= MAX_USEFUL_WASHOUT_CHANGE_DEG)
            .map(|w| format!("About {:.1} deg more tip washout, or airfoils", w.abs()))
            .unwrap_or_else(|| "Airfoils".to_string());
        cautions.push(Caution::new(
            Level::Note,
            "tailless-trim",
            format!(
                "With the elevons neutral this tailless wing does not trim at its design CL {:.2} \
                 (pitching moment {} there, {} at zero lift). It trims there with about {:.1} \
                 deg of {} elevon, within the throws; that much throw is then not available for \
                                      control. {washout} with about {:.3} more reflex (cm_ac) would trim it \
                 with the elevons neutral.",
                t.design_cl,
                signed(t.cm_at_design, 3),
                signed(t.cm_zero_lift, 3),
                d.abs().to_degrees(),
                if d < 0.0 { "up" } else { "down" },
                t.reflex_cm_change
            ),
        ));
    } else if untrimmed {
        let level = if t.cm_zero_lift <= 0.0 {
            Level::Danger
        } else {
            Level::Warning
        };
        let elevons = match (aircraft.elevons, t.elevon_to_trim_rad) {
            (Some(_), Some(d)) => format!(
                "; the elevons would need {:.1} deg {}, beyond their throws",
                d.abs().to_degrees(),
                if d < 0.0 { "up" } else { "down" }
            ),
            (Some(_), None) => "; the elevons cannot trim it there".to_string(),
            _ => String::new(),
        };
        let remedies = tailless_remedies(t, cg_x_m, band_aft_x_m);
        cautions.push(Caution::new(
            level,
            "tailless-trim",
            format!(
                "This tailless wing does not trim at its design CL {:.2} with this CG (pitching moment \
                 {} there, {} at zero lift; it must be positive at zero lift){elevons}. It needs {remedies}.",
                t.design_cl,
                signed(t.cm_at_design, 3),
                signed(t.cm_zero_lift, 3),
            ),
        ));
    }
}

/// The remedies for a tailless wing that does not trim, in words: washout within what the file
/// accepts, reflex, and a CG further aft (`cg_x_m`) only while it is ahead of the band's aft
/// end `band_aft_x_m` and the moment at zero lift is positive.
fn tailless_remedies(t: &trim::TaillessCheck, cg_x_m: f64, band_aft_x_m: f64) -> String {
    // The remedies that apply: washout within what the file accepts, reflex, and a
    // CG further aft only while the CG is still ahead of the band's aft end.
    let mut remedies = Vec::new();
    if let Some(w) = t.washout_change_rad {
        let deg = w.to_degrees();
        if deg.abs() <= MAX_USEFUL_WASHOUT_CHANGE_DEG {
            remedies.push(format!(
                "about {:.1} deg {} tip washout",
                deg.abs(),
                if deg < 0.0 { "more" } else { "less" }
            ));
        }
    }
    remedies.push(format!(
        "airfoils with about {:.3} more reflex (cm_ac)",
        t.reflex_cm_change
    ));
    // At zero lift the moment about the CG is a pure couple: moving the CG cannot make
    // it positive, so a CG further aft only helps when it already is.
    if cg_x_m < band_aft_x_m - 5e-4 && t.cm_zero_lift > 0.0 {
        remedies.push("the CG moved aft within the recommended band".to_string());
    }
    let last = remedies.pop().unwrap_or_default();
    if remedies.is_empty() {
        last
    } else {
        format!("{}, or {last}", remedies.join(", "))
    }
}

/// The note `models-disagree` when the full model's and the closed form's neutral points
/// differ by more than `MODELS_DISAGREE` of the MAC `mac_m`, with why and what to do.
fn models_disagree_note(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    est: &ClassicalEstimate,
    mac_m: f64,
    cautions: &mut Vec<Caution>,
) {
    let diff = (f.neutral_point_x_m - est.neutral_point_x_m) / mac_m;
    if diff.abs() > MODELS_DISAGREE {
        let model = match aircraft.numerics.wing_model {
            WingModel::VortexLattice => "vortex-lattice",
            WingModel::LiftingLine => "lifting-line",
        };
        let why = match aircraft.numerics.wing_model {
            WingModel::VortexLattice => format!(
                "The lattice models sweep, taper, twist, {}and where along the chord each strip \
                 carries its lift; the closed form reduces the wing to a straight equivalent wing{}. \
                 Neither models the fuselage's interference or a flexible wing.",
                if aircraft.stabiliser.is_some() {
                    "the stabiliser's place in the wake (downwash) "
                } else {
                    ""
                },
                if aircraft.stabiliser.is_some() {
                    " with a simple downwash formula"
                } else {
                    ""
                }
            ),
            WingModel::LiftingLine => "The lifting line puts each strip's lift on its quarter-chord line, which places \
                 the neutral point of a swept or low-aspect-ratio surface too far aft; the closed form \
                 reduces the wing to a straight equivalent wing."
                .to_string(),
        };
        let advice = if diff > 0.0 {
            format!(
                "Until a glide test confirms the balance, keep the CG ahead of {:.0} mm, the aft end \
                 of the band measured from the closed-form neutral point (the more forward, safer one).",
                1000.0 * (est.neutral_point_x_m - aircraft.margin_limits.min_static_margin * mac_m)
            )
        } else {
            "The band is measured from the more forward of the two, the safer one.".to_string()
        };
        cautions.push(Caution::new(
            Level::Note,
            "models-disagree",
            format!(
                "The {model} neutral point lies {:.0} mm {} of the closed-form estimate ({:.1} % of MAC). \
                 {why} {advice}",
                (diff * mac_m * 1000.0).abs(),
                if diff > 0.0 { "aft" } else { "forward" },
                100.0 * diff.abs(),
            ),
        ));
    }
}

/// The handful of figures a builder compares between setups and reads first on a report.
#[derive(Debug, Clone, PartialEq)]
pub struct KeyFigures {
    /// Name of the configuration.
    pub name: String,
    /// Total mass, kg.
    pub mass_kg: f64,
    /// Wing loading, kg/m^2.
    pub wing_loading_kg_m2: f64,
    /// CG, m aft of the datum.
    pub cg_x_m: f64,
    /// CG aft of the wing root leading edge, m (the number measured on the model).
    pub cg_from_wing_root_le_m: f64,
    /// CG in percent of MAC.
    pub cg_percent_mac: f64,
    /// Neutral point, m aft of the datum.
    pub neutral_point_x_m: f64,
    /// Static margin, fraction of MAC.
    pub static_margin: f64,
    /// Recommended CG band, m aft of the datum.
    pub band: CgBand,
    /// Decalage (front surface minus rear), rad, when there is a stabiliser.
    pub decalage_rad: Option<f64>,
    /// Elevon deflection that trims a tailless wing at its design CL, rad (trailing edge down
    /// positive), when it has elevons and one does.
    pub elevon_trim_rad: Option<f64>,
    /// Trim CL, when trimmed.
    pub trim_cl: Option<f64>,
    /// Trim speed, m/s, when trimmed.
    pub trim_speed_m_s: Option<f64>,
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
    /// Ballast needed for the target static margin in the first bay that can reach it, kg.
    pub ballast_kg: Option<(String, f64)>,
    /// Minimum sink and its speed, m/s (flight polar only).
    pub min_sink_m_s: Option<(f64, f64)>,
    /// Best glide ratio and its speed, m/s (flight polar only).
    pub best_glide: Option<(f64, f64)>,
    /// Number of warnings.
    pub warnings: usize,
    /// Number of dangers.
    pub dangers: usize,
    /// x of the wing root leading edge, m (to express positions as builders measure them).
    pub wing_root_le_x_m: f64,
    /// x of the wing's MAC leading edge, m (the common reference of a comparison).
    pub mac_le_x_m: f64,
    /// What x = 0 is, in the builder's words (or [`COMMON_REFERENCE`] once moved there).
    pub datum: String,
    /// Codes of the warnings and dangers raised, most serious first.
    pub caution_codes: Vec<(Level, &'static str)>,
}

/// The datum of key figures whose positions were moved to the wing's MAC leading edge.
pub const COMMON_REFERENCE: &str = "the wing's MAC leading edge";

/// Whether the configurations' datums differ (compared as written, ignoring case and
/// surrounding spaces); when they do, every position of every configuration is moved to be
/// measured from its own wing's MAC leading edge, so that the positions can be compared.
/// Returns true when it moved them.
pub fn to_common_reference(columns: &mut [KeyFigures]) -> bool {
    let key = |k: &KeyFigures| k.datum.trim().to_lowercase();
    let Some(first) = columns.first().map(key) else {
        return false;
    };
    if columns.iter().all(|k| key(k) == first) {
        return false;
    }
    for k in columns.iter_mut() {
        let dx = k.mac_le_x_m;
        k.cg_x_m -= dx;
        k.neutral_point_x_m -= dx;
        k.band.forward_x_m -= dx;
        k.band.aft_x_m -= dx;
        k.wing_root_le_x_m -= dx;
        k.mac_le_x_m = 0.0;
        k.datum = COMMON_REFERENCE.to_string();
    }
    true
}

impl KeyFigures {
    /// Collect the key figures of an analysed aircraft.
    pub fn of(aircraft: &Aircraft, a: &Analysis) -> KeyFigures {
        let g = &a.wing_geometry;
        let h = &a.headline;
        KeyFigures {
            name: aircraft.name.clone(),
            mass_kg: a.mass.total_kg,
            wing_loading_kg_m2: a.wing_loading_kg_m2,
            cg_x_m: a.mass.cg_x_m,
            cg_from_wing_root_le_m: a.mass.cg_x_m - aircraft.wing.root_le_x_m,
            cg_percent_mac: g.percent_mac(a.mass.cg_x_m),
            neutral_point_x_m: h.neutral_point_x_m,
            static_margin: h.static_margin,
            band: a.band,
            decalage_rad: aircraft.decalage_rad(),
            elevon_trim_rad: a
                .full
                .as_ref()
                .and_then(|f| f.tailless)
                .and_then(|t| t.elevon_to_trim_rad),
            trim_cl: h.trim.map(|t| t.cl),
            trim_speed_m_s: h.trim.map(|t| t.speed_m_s),
            stall_speed_m_s: h.stall_speed_m_s,
            ballast_kg: a.ballast.iter().find_map(|b| match b.outcome {
                BallastOutcome::Reachable { mass_kg } => Some((b.bay.clone(), mass_kg)),
                BallastOutcome::NotNeeded => Some((b.bay.clone(), 0.0)),
                _ => None,
            }),
            min_sink_m_s: a
                .glide_polar
                .as_ref()
                .map(|p| (p.min_sink.point.sink_m_s, p.min_sink.point.speed_m_s)),
            best_glide: a
                .glide_polar
                .as_ref()
                .map(|p| (p.best_glide.point.glide_ratio, p.best_glide.point.speed_m_s)),
            warnings: a
                .cautions
                .iter()
                .filter(|c| c.level == Level::Warning)
                .count(),
            dangers: a
                .cautions
                .iter()
                .filter(|c| c.level == Level::Danger)
                .count(),
            wing_root_le_x_m: aircraft.wing.root_le_x_m,
            mac_le_x_m: g.mac_le_x_m,
            datum: aircraft.datum.clone(),
            caution_codes: {
                let mut codes: Vec<(Level, &'static str)> = a
                    .cautions
                    .iter()
                    .filter(|c| c.level >= Level::Warning)
                    .map(|c| (c.level, c.code))
                    .collect();
                codes.sort_by_key(|c| std::cmp::Reverse(c.0));
                codes
            },
        }
    }
}

/// The fuselage's contribution to dCm/dalpha (per rad), or 0 without a fuselage.
pub fn fuselage_cm_alpha(aircraft: &Aircraft, wing: &EquivalentSurface) -> f64 {
    aircraft.fuselage.as_ref().map_or(0.0, |f| {
        crate::stability::fuselage::cm_alpha_per_rad(
            f,
            aircraft.wing.root_le_x_m + 0.25 * wing.geometry.root_chord_m,
            wing.geometry.mac_m,
            wing.geometry.area_m2,
        )
    })
}

/// Glide performance of the aircraft.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Glide {
    /// Zero-lift drag coefficient (at the best-glide speed's Reynolds numbers).
    pub cd0: f64,
    /// Span efficiency used in the polar (Raymer's Oswald estimate).
    pub span_efficiency: f64,
    /// Best glide and minimum sink.
    pub performance: GlidePerformance,
}

/// Position of greatest thickness assumed in the drag build-up, fraction of chord (NACA
/// 4-digit sections have it at 0.3; common practice for model sections).
const X_THICKNESS_C: f64 = 0.3;

/// Area-weighted thickness ratio of a surface's airfoils (each panel counts the mean of its
/// end airfoils).
fn surface_thickness(aircraft: &Aircraft, surface: &crate::model::Surface) -> f64 {
    let t = |id: crate::model::AirfoilId| crate::section::thickness_ratio(aircraft.airfoil(id));
    match &surface.shape {
        crate::model::SurfaceShape::Panels(panels) => {
            let (mut num, mut den) = (0.0, 0.0);
            for p in panels {
                let area = p.span_m * (p.root_chord_m + p.tip_chord_m);
                num += area * 0.5 * (t(p.root_airfoil) + t(p.tip_airfoil));
                den += area;
            }
            if den > 0.0 {
                num / den
            } else {
                0.12
            }
        }
        crate::model::SurfaceShape::Elliptic(e) => 0.5 * (t(e.root_airfoil) + t(e.tip_airfoil)),
    }
}

fn glide_estimate(
    aircraft: &Aircraft,
    wing: &EquivalentSurface,
    stabiliser: Option<&EquivalentSurface>,
    mass: &MassSummary,
    air: &AirState,
    cl_max: f64,
) -> Glide {
    let mut surfaces = vec![SurfaceDragInput {
        area_m2: wing.geometry.area_m2,
        mac_m: wing.geometry.mac_m,
        thickness_ratio: surface_thickness(aircraft, &aircraft.wing),
        x_thickness_c: X_THICKNESS_C,
    }];
    if let (Some(eq), Some(st)) = (stabiliser, aircraft.stabiliser.as_ref()) {
        surfaces.push(SurfaceDragInput {
            area_m2: eq.geometry.area_m2,
            mac_m: eq.geometry.mac_m,
            thickness_ratio: surface_thickness(aircraft, &st.surface),
            x_thickness_c: X_THICKNESS_C,
        });
    }
    let body = aircraft.fuselage.as_ref().map(|f| BodyDragInput {
        length_m: f.length_m,
        width_m: f.max_width_m,
    });
    let span_efficiency = oswald_straight_wing(wing.geometry.aspect_ratio).clamp(0.3, 1.0);
    let nu = air.kinematic_viscosity_m2_s();
    let area = wing.geometry.area_m2;
    // Reynolds numbers depend on speed: evaluate CD0 at the best-glide speed by a few
    // fixed-point steps (converges in two or three; CD0 varies slowly with Re).
    let mut speed = 10.0;
    let mut polar = PolarInput {
        cd0: 0.0,
        aspect_ratio: wing.geometry.aspect_ratio,
        span_efficiency,
        mass_kg: mass.total_kg,
        area_m2: area,
        density_kg_m3: air.density_kg_m3,
        cl_max,
    };
    for _ in 0..4 {
        polar.cd0 = drag::cd0(&surfaces, body, area, speed, nu);
        speed = polar.performance().best_glide.speed_m_s;
    }
    Glide {
        cd0: polar.cd0,
        span_efficiency,
        performance: polar.performance(),
    }
}

/// The inputs of the full-model balance and trim for an aircraft, its section models, masses
/// and air (shared by the analysis and by charts that re-trim at other CG positions).
pub fn trim_input<'a>(
    aircraft: &'a Aircraft,
    sections: &'a [SectionModel],
    mass: &MassSummary,
    air: &AirState,
    fuselage_cm_alpha_per_rad: f64,
    options: &AnalysisOptions,
) -> trim::TrimInput<'a> {
    trim::TrimInput {
        aircraft,
        sections,
        mass_kg: mass.total_kg,
        cg_x_m: mass.cg_x_m,
        cg_z_m: mass.cg_z_m.unwrap_or(aircraft.wing.root_le_z_m),
        density_kg_m3: air.density_kg_m3,
        fuselage_cm_alpha_per_rad,
        options: lifting_line_options(aircraft, options),
        target_speed_m_s: aircraft.targets.trim_speed_m_s,
        top_speed_m_s: aircraft.targets.top_speed_m_s,
    }
}

/// A CG inside the recommended band whose range (`cg`: the CG and two standard deviations of
/// the builder's tolerances) reaches aft of the band's aft end (which is measured from the
/// forward end of the neutral point's uncertainty range, `spread_m`, two standard deviations).
fn uncertain_aft_limit_caution(
    neutral_point_x_m: f64,
    spread_m: f64,
    cg: (f64, f64),
    band: (f64, f64),
    cautions: &mut Vec<Caution>,
) {
    let (cg_x_m, cg_spread_m) = cg;
    let (band_forward_x_m, band_aft_x_m) = band;
    let spread_m = if spread_m.is_finite() { spread_m } else { 0.0 };
    let cg_spread_m = if cg_spread_m.is_finite() {
        cg_spread_m
    } else {
        0.0
    };
    if spread_m <= 0.0 && cg_spread_m <= 0.0 {
        return;
    }
    // The band's aft end is the limit (it allows for the neutral point's range already).
    let limit = band_aft_x_m;
    let cg_aft_end = cg_x_m + cg_spread_m;
    // Inside the band only: forward or aft of it, other cautions speak.
    // The same half-millimetre allowance as `cg-aft-of-band`, so that one of the two speaks.
    let inside = cg_x_m >= band_forward_x_m - 5e-4 && cg_x_m <= band_aft_x_m + 5e-4;
    if cg_aft_end > limit && inside {
        let balance_at = limit - cg_spread_m;
        let advice = if balance_at >= band_forward_x_m {
            format!(
                "For the first flights balance at {:.1} mm or further forward.",
                1000.0 * balance_at
            )
        } else {
            // The advice would leave the band: the uncertainties are too large for any CG in
            // it to be safely ahead of the limit.
            format!(
                "No CG in the recommended band keeps the whole uncertain range ahead of that \
                 limit: weigh the items and measure their positions again to narrow the \
                 tolerances, and meanwhile balance at the band's forward end ({:.1} mm) and \
                 test-glide with care.",
                1000.0 * band_forward_x_m
            )
        };
        // A CG range that reaches behind the neutral point itself may be unstable.
        let level = if cg_aft_end >= neutral_point_x_m {
            Level::Danger
        } else {
            Level::Warning
        };
        let limit_text = if spread_m > 0.0 {
            format!(
                "the band's aft end, {:.1} mm, which keeps the smallest margin from the forward \
                 end of the neutral point's uncertainty range ({:.0} mm ahead of the computed \
                 point: two standard deviations from common-practice spreads of tail \
                 efficiency, downwash, fuselage, section lift slopes and the wing's \
                 aerodynamic centre)",
                1000.0 * limit,
                1000.0 * spread_m
            )
        } else {
            format!("the band's aft end, {:.1} mm", 1000.0 * limit)
        };
        cautions.push(Caution::new(
            level,
            "cg-aft-of-uncertain-limit",
            format!(
                "The CG ({:.1} mm) is {}, but with two standard deviations of the builder's \
                 own mass and position tolerances it may lie as far aft as {:.1} mm, {:.1} mm \
                 aft of {limit_text}. {advice}",
                1000.0 * cg_x_m,
                if cg_x_m > limit {
                    "on the aft end of the recommended band"
                } else {
                    "inside the recommended band"
                },
                1000.0 * cg_aft_end,
                1000.0 * (cg_aft_end - limit),
            ),
        ));
    }
}

/// The file's `[numerics]` with the options' override applied.
fn numerics_used(aircraft: &Aircraft, options: &AnalysisOptions) -> crate::model::Numerics {
    crate::model::Numerics {
        strips_per_half_span: options
            .stations_per_half_span
            .unwrap_or(aircraft.numerics.strips_per_half_span),
        ..aircraft.numerics
    }
}

/// Thin-airfoil section models of every airfoil (for the closed-form estimate), with the
/// airfoils' own cl_max.
fn thin_section_models(
    aircraft: &Aircraft,
    options: &AnalysisOptions,
) -> Result<Vec<SectionModel>, AnalysisError> {
    aircraft
        .airfoils
        .iter()
        .map(|a| {
            let thin = crate::model::Airfoil {
                method: Some(crate::model::SectionMethod::Thin),
                ..a.clone()
            };
            let opts = crate::section::SectionOptions {
                panels: options.panels,
            };
            Ok(crate::section::section_model(&thin, &opts)?.model)
        })
        .collect()
}
