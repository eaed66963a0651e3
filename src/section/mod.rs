//! Two-dimensional airfoil aerodynamics: each published method in its own module, and the
//! [`SectionModel`] that the wing model consumes.
//!
//! [`section_model`] picks a method for an [`Airfoil`] (the one it names, or the default for
//! its shape: exact for Joukowski and Karman-Trefftz sections, the panel method for NACA
//! sections and coordinates; thin-airfoil theory works for every shape), solves, and reduces
//! the solution to a [`SectionModel`]:
//!
//! - zero-lift angle and lift slope (at zero lift) from the method's own solution;
//! - `cm_ac` = cm about the quarter chord at zero lift, and the aerodynamic centre
//!   `x_ac/c = 1/4 - dcm_c/4/dcl` from the moments at two lifts either side of zero lift
//!   (angles `alpha_L0 -+ 0.02 rad`);
//! - `cl_max` as given, or [`DEFAULT_CL_MAX`] with a `cl-max-default` caution;
//! - `cl_min` by the rule that the two stall angles lie symmetric about the chord line
//!   (`alpha_stall_neg = -alpha_stall_pos`), i.e. `cl_min = -cl_max + 2 cl(alpha = 0)`, but
//!   never above `-cl_max / 4` (a judgement: negative stall of cambered sections comes at a
//!   smaller |cl| than positive stall, but not at a positive one).

pub mod boundary_layer;
pub mod cache;
pub mod circle_map;
pub mod flap;
pub mod flap_correction;
pub mod geometry;
pub mod joukowski;
pub mod karman_trefftz;
pub mod model;
pub mod naca;
pub mod panel;
pub mod polar;
pub mod registry;
pub mod thin_airfoil;
pub mod viscous;

mod error;
mod solution;
mod viscous_model;

use viscous_model::viscous_outcome;
pub use viscous_model::{model_from_polar, viscous_polar};

pub use error::SectionError;
pub use flap::FlapEffect;
pub use model::{ClMaxSource, SectionModel, DEFAULT_CL_MAX};
pub use solution::{ExactSolution, SectionSolution, SolutionFigures, SurfacePressure};

use crate::caution::Caution;
use crate::finding::InputFinding;
use crate::model::{Airfoil, AirfoilShape, SectionMethod};
use circle_map::CircleMapError;
use geometry::{Contour, GeometryError};
use joukowski::JoukowskiAirfoil;
use karman_trefftz::KarmanTrefftzAirfoil;
use naca::{NacaError, NacaProfile};
use panel::{PanelError, PanelSolution};
use thin_airfoil::{SampledMeanLine, ThinAirfoil, ThinAirfoilError};

/// Panel count of the `section` command when `--panels` is not given
/// ([`SectionOptions::default`]; also its `--re` viscous polars): 200, where the inviscid panel
/// method's cl of smooth sections is converged to about 0.1 % (tests/suite/section_panel.rs).
/// The command looks at one airfoil at a time, so it can afford more panels than an analysis.
///
/// It differs from [`DEFAULT_ANALYSIS_PANELS`] on purpose, and neither may change in a pure
/// refactor: making the two one number would change printed figures (see that constant).
pub const DEFAULT_SECTION_PANELS: usize = 200;

/// Panel count of every analysis of an aircraft (`analysis::AnalysisOptions::default`, used by
/// `check`, `report`, `compare` and `sweep`: the panel-method sections and the viscous section
/// drag of the flight polar) and of [`viscous::ViscousSettings::default`]: 160. The viscous
/// coupling runs 40-260 passes a point, each with a panels x panels source-influence product,
/// and an analysis needs about 12 polars, so the count is kept lower than
/// [`DEFAULT_SECTION_PANELS`]; cd still moves 3-5 % a step between 120 and 240 panels where a
/// laminar separation ends mid-chord, and the coupling stops converging beyond about 300
/// (DEVELOPERS.md, known limits). [`viscous::SMOOTHING_REFERENCE_PANELS`] is the count the
/// source smoothing was tuned at (the same 160, kept as its own constant).
///
/// Using 200 here would change every figure of `check` and `report` that rests on section
/// lift slopes or viscous drag (sink, glide, speeds to fly; the goldens) and the keys of the
/// polar store, and cost about 1.5 to 2 times the time; using 160 for `section` would change
/// its printed tables (`tests/data/*.expected`).
pub const DEFAULT_ANALYSIS_PANELS: usize = 160;

/// Options of the section methods.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SectionOptions {
    /// Number of panels for the panel method (16 to 1000).
    pub panels: usize,
}

impl Default for SectionOptions {
    /// [`DEFAULT_SECTION_PANELS`] panels.
    fn default() -> Self {
        SectionOptions {
            panels: DEFAULT_SECTION_PANELS,
        }
    }
}

/// A section model with the cautions found while making it.
#[derive(Debug, Clone, PartialEq)]
pub struct SectionOutcome {
    /// The model.
    pub model: SectionModel,
    /// Cautions (e.g. `cl-max-default`).
    pub cautions: Vec<Caution>,
}

/// A solved section with the model and cautions made from it.
#[derive(Debug, Clone, PartialEq)]
pub struct SectionAnalysis {
    /// The solution (for tables over angle of attack and pressures).
    pub solution: SectionSolution,
    /// The model and cautions.
    pub outcome: SectionOutcome,
}

/// The default method for a shape: exact where there is an exact solution, else the panel
/// method.
pub fn default_method(shape: &AirfoilShape) -> SectionMethod {
    match shape {
        AirfoilShape::Joukowski { .. } | AirfoilShape::KarmanTrefftz { .. } => SectionMethod::Exact,
        AirfoilShape::Naca(_) | AirfoilShape::Coordinates { .. } => SectionMethod::Panel,
    }
}

/// The section model of `airfoil` by its method (or the default for its shape). The panel
/// method's figures are taken from [`cache::FigureCache::shared`] when it holds them (the
/// same numbers: they are kept exactly as computed), so that the section is not solved again.
pub fn section_model(
    airfoil: &Airfoil,
    options: &SectionOptions,
) -> Result<SectionOutcome, SectionError> {
    let method = method_of(airfoil);
    if !matches!(method, SectionMethod::Panel | SectionMethod::Viscous) {
        return Ok(analyse_section(airfoil, options)?.outcome);
    }
    // A viscous section is solved by the panel method first (its errors come first).
    let figures = cache::FigureCache::shared().panel_figures(airfoil, options.panels, || {
        solve_section(airfoil, SectionMethod::Panel, options)
    })?;
    if method == SectionMethod::Viscous {
        return viscous_outcome(airfoil, options);
    }
    let mut outcome = model_from_figures(airfoil, &figures)?;
    thin_for_panels_caution(airfoil, &mut outcome);
    Ok(outcome)
}

/// The method `airfoil` asks for, or the default for its shape.
fn method_of(airfoil: &Airfoil) -> SectionMethod {
    airfoil
        .method
        .unwrap_or_else(|| default_method(&airfoil.shape))
}

/// Solves `airfoil` by its method (or the default for its shape) and makes its model.
pub fn analyse_section(
    airfoil: &Airfoil,
    options: &SectionOptions,
) -> Result<SectionAnalysis, SectionError> {
    let method = method_of(airfoil);
    if method == SectionMethod::Viscous {
        let solution = solve_section(airfoil, SectionMethod::Panel, options)?;
        let outcome = viscous_outcome(airfoil, options)?;
        return Ok(SectionAnalysis { solution, outcome });
    }
    let solution = solve_section(airfoil, method, options)?;
    let mut outcome = model_from_solution(airfoil, &solution)?;
    if method == SectionMethod::Panel {
        thin_for_panels_caution(airfoil, &mut outcome);
    }
    Ok(SectionAnalysis { solution, outcome })
}

/// The caution for a section too thin for the panel method, added to `outcome`.
fn thin_for_panels_caution(airfoil: &Airfoil, outcome: &mut SectionOutcome) {
    if let Some(t) = shape_thickness(airfoil).filter(|&t| t < THIN_SECTION_FOR_PANELS) {
        outcome.cautions.push(Caution::of(
            InputFinding::SectionTooThinForPanels {
                airfoil: airfoil.name.clone(),
                thickness: t,
                limit: THIN_SECTION_FOR_PANELS,
            }
            .into(),
        ));
    }
}

/// Thickness below which the panel method gets a caution (judgement: on thinner sections the
/// normal-velocity conditions of the two surfaces nearly repeat each other, see
/// [`geometry::FULL_COSINE_WEIGHT`]; at 1 % thickness the aerodynamic centre is already a few
/// per cent of chord off).
const THIN_SECTION_FOR_PANELS: f64 = 0.03;

/// Greatest thickness of the airfoil's shape, fraction of chord, where it is known.
fn shape_thickness(airfoil: &Airfoil) -> Option<f64> {
    match &airfoil.shape {
        AirfoilShape::Naca(d) => NacaProfile::parse(d).ok().map(|p| p.thickness_ratio()),
        AirfoilShape::Joukowski {
            thickness_ratio, ..
        }
        | AirfoilShape::KarmanTrefftz {
            thickness_ratio, ..
        } => Some(*thickness_ratio),
        AirfoilShape::Coordinates { points, .. } => {
            Contour::new(points).ok().map(|c| c.thickness_ratio())
        }
    }
}

/// Grid of surface points per panel used to describe exact and NACA shapes to the panel
/// method before re-panelling.
const SHAPE_POINTS_PER_PANEL: usize = 4;

/// Most surface points used to describe exact and NACA shapes (keeps the contour checks fast).
const MAX_SHAPE_POINTS: usize = 2400;

/// Stations of a mean line taken from coordinates.
const MEAN_LINE_STATIONS: usize = 201;

/// Solves `airfoil` with `method`.
pub fn solve_section(
    airfoil: &Airfoil,
    method: SectionMethod,
    options: &SectionOptions,
) -> Result<SectionSolution, SectionError> {
    let name = || airfoil.name.clone();
    let (exact, naca) = shape_solutions(airfoil)?;
    if method == SectionMethod::Exact {
        return exact
            .map(SectionSolution::Exact)
            .ok_or(SectionError::MethodNotAvailable {
                airfoil: name(),
                method: "exact",
            });
    }
    if let (SectionMethod::Thin, Some(profile)) = (method, naca) {
        return Ok(SectionSolution::Thin(ThinAirfoil::solve(&profile)));
    }
    if method == SectionMethod::Panel
        && !(geometry::MIN_PANELS..=geometry::MAX_PANELS).contains(&options.panels)
    {
        return Err(SectionError::Panel {
            airfoil: name(),
            error: PanelError::Geometry(GeometryError::PanelCount(options.panels)),
        });
    }
    let contour = build_contour(airfoil, &exact, &naca, options)?;
    match method {
        SectionMethod::Thin => {
            let line =
                SampledMeanLine::new(contour.mean_line(MEAN_LINE_STATIONS)).map_err(|error| {
                    SectionError::MeanLine {
                        airfoil: name(),
                        error,
                    }
                })?;
            Ok(SectionSolution::Thin(ThinAirfoil::solve(&line)))
        }
        _ => Ok(SectionSolution::Panel(
            PanelSolution::solve(&contour, options.panels).map_err(|error| {
                SectionError::Panel {
                    airfoil: name(),
                    error,
                }
            })?,
        )),
    }
}

/// The exact solution (Joukowski, Karman-Trefftz) or the NACA profile of an airfoil's shape,
/// where it has one.
fn shape_solutions(
    airfoil: &Airfoil,
) -> Result<(Option<ExactSolution>, Option<NacaProfile>), SectionError> {
    let name = || airfoil.name.clone();
    let circle_err = |error| SectionError::CircleMap {
        airfoil: name(),
        error,
    };
    let exact = match &airfoil.shape {
        AirfoilShape::Joukowski {
            thickness_ratio,
            camber_ratio,
        } => Some(ExactSolution::Joukowski(
            JoukowskiAirfoil::from_shape(*thickness_ratio, *camber_ratio).map_err(circle_err)?,
        )),
        AirfoilShape::KarmanTrefftz {
            thickness_ratio,
            camber_ratio,
            trailing_edge_angle_rad,
        } => Some(ExactSolution::KarmanTrefftz(
            KarmanTrefftzAirfoil::from_shape(
                *thickness_ratio,
                *camber_ratio,
                *trailing_edge_angle_rad,
            )
            .map_err(circle_err)?,
        )),
        _ => None,
    };
    let naca = match &airfoil.shape {
        AirfoilShape::Naca(d) => {
            Some(NacaProfile::parse(d).map_err(|error| SectionError::Naca {
                airfoil: name(),
                error,
            })?)
        }
        _ => None,
    };
    Ok((exact, naca))
}

/// The checked contour of `airfoil` for the panel-based methods.
fn build_contour(
    airfoil: &Airfoil,
    exact: &Option<ExactSolution>,
    naca: &Option<NacaProfile>,
    options: &SectionOptions,
) -> Result<Contour, SectionError> {
    let geometry_err = |error| SectionError::Geometry {
        airfoil: airfoil.name.clone(),
        error,
    };
    let shape_points = (options.panels * SHAPE_POINTS_PER_PANEL).clamp(400, MAX_SHAPE_POINTS);
    let raw: Vec<[f64; 2]> = match (&airfoil.shape, exact, naca) {
        (_, Some(ExactSolution::Joukowski(j)), _) => j.coordinates(shape_points),
        (_, Some(ExactSolution::KarmanTrefftz(k)), _) => k.coordinates(shape_points),
        (_, _, Some(profile)) => profile.coordinates(shape_points / 2),
        (AirfoilShape::Coordinates { points, .. }, _, _) => points.clone(),
        // Every shape is exact, NACA or coordinates; kept as an error rather than a panic.
        _ => return Err(geometry_err(GeometryError::Degenerate)),
    };
    match naca {
        // NACA coordinates have the leading edge of their chord line at the middle point. On
        // thick, strongly cambered sections the surface runs ahead of that point; their chord
        // then starts at the point farthest from the trailing edge, as for a file.
        Some(_) => Contour::with_leading_edge(&raw, raw.len() / 2).or_else(|_| Contour::new(&raw)),
        None => Contour::new(&raw),
    }
    .map_err(geometry_err)
}

/// Half-width of the angle step either side of zero lift used for the aerodynamic centre, rad.
const AC_STEP_RAD: f64 = 0.02;

/// Largest cl_max accepted.
const CL_MAX_LIMIT: f64 = 3.0;

/// The negative stall of a linear lift curve of slope `slope` (per rad) through the zero-lift
/// angle `alpha0` (rad) with stall at `cl_max`: as far below the cl at zero incidence as
/// cl_max lies above it, and at least a quarter of cl_max below zero.
fn cl_min_of(cl_max: f64, slope: f64, alpha0: f64) -> f64 {
    let cl_at_zero_alpha = -slope * alpha0;
    (-cl_max + 2.0 * cl_at_zero_alpha).min(-0.25 * cl_max)
}

/// cl_max of `airfoil`: as given (checked), or the conservative default with its caution.
fn resolve_cl_max(airfoil: &Airfoil) -> Result<(f64, ClMaxSource, Vec<Caution>), SectionError> {
    let mut cautions = Vec::new();
    let (cl_max, cl_max_source) = match airfoil.cl_max {
        Some(v) if v.is_finite() && v > 0.0 && v <= CL_MAX_LIMIT => (v, ClMaxSource::Given),
        Some(value) => {
            return Err(SectionError::ClMax {
                airfoil: airfoil.name.clone(),
                value,
            })
        }
        None => {
            cautions.push(Caution::of(
                InputFinding::ClMaxDefault {
                    airfoil: airfoil.name.clone(),
                    default: DEFAULT_CL_MAX,
                }
                .into(),
            ));
            (DEFAULT_CL_MAX, ClMaxSource::Default)
        }
    };
    Ok((cl_max, cl_max_source, cautions))
}

/// Reduces a solution to the section model of `airfoil` (see the module documentation).
pub fn model_from_solution(
    airfoil: &Airfoil,
    solution: &SectionSolution,
) -> Result<SectionOutcome, SectionError> {
    model_from_figures(airfoil, &SolutionFigures::of(solution))
}

/// The section model of `airfoil` from the figures of its solution (what
/// [`model_from_solution`] makes of the solution itself).
pub fn model_from_figures(
    airfoil: &Airfoil,
    figures: &SolutionFigures,
) -> Result<SectionOutcome, SectionError> {
    let method = figures.method;
    let not_finite = |what| SectionError::NotFinite {
        airfoil: airfoil.name.clone(),
        method: method.as_str(),
        what,
    };
    let alpha0 = figures.alpha_zero_lift_rad;
    let slope = figures.cl_alpha_per_rad;
    if !alpha0.is_finite() {
        return Err(not_finite("zero-lift angle"));
    }
    if !(slope.is_finite() && slope > 0.0) {
        return Err(not_finite("lift slope"));
    }
    let ((cl1, cl2), (cm1, cm2)) = (figures.cl_either_side, figures.cm_either_side);
    let x_ac_c = 0.25 - (cm2 - cm1) / (cl2 - cl1);
    let cm_ac = figures.cm_zero_lift;
    if !x_ac_c.is_finite() {
        return Err(not_finite("aerodynamic centre"));
    }
    if !(-0.5..=1.5).contains(&x_ac_c) {
        return Err(SectionError::NotCredible {
            airfoil: airfoil.name.clone(),
            method: method.as_str(),
            x_ac_c,
        });
    }
    if !cm_ac.is_finite() {
        return Err(not_finite("moment coefficient"));
    }
    linear_outcome(airfoil, method, (alpha0, slope, cm_ac, x_ac_c), None)
}

/// The section model of `airfoil` by `method` from its linear lift curve `(alpha0_rad,
/// slope_per_rad, cm_ac, x_ac_c)`, its stall limits from the file's cl_max (or the default,
/// with its caution), and the viscous `polar` it came from, if any.
fn linear_outcome(
    airfoil: &Airfoil,
    method: SectionMethod,
    (alpha0, slope, cm_ac, x_ac_c): (f64, f64, f64, f64),
    polar: Option<std::sync::Arc<polar::Polar>>,
) -> Result<SectionOutcome, SectionError> {
    let (cl_max, cl_max_source, cautions) = resolve_cl_max(airfoil)?;
    let cl_min = cl_min_of(cl_max, slope, alpha0);
    Ok(SectionOutcome {
        model: SectionModel {
            method,
            alpha_zero_lift_rad: alpha0,
            cl_alpha_per_rad: slope,
            cm_ac,
            x_ac_c,
            cl_max,
            cl_min,
            cl_max_source,
            reynolds_number: polar.as_ref().map(|p| p.reynolds),
            polar,
        },
        cautions,
    })
}

/// One angle of attack of a sweep.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SweepPoint {
    /// Angle of attack from the chord line, rad.
    pub alpha_rad: f64,
    /// Lift coefficient of the method (no stall).
    pub cl: f64,
    /// Moment coefficient about the quarter chord, positive nose up.
    pub cm_quarter_chord: f64,
    /// Lift coefficient of the section model (linear, flat-top stall limits).
    pub cl_model: f64,
}

/// cl and cm of `analysis` at each angle of `alphas_rad`.
pub fn sweep(analysis: &SectionAnalysis, alphas_rad: &[f64]) -> Vec<SweepPoint> {
    alphas_rad
        .iter()
        .map(|&alpha_rad| SweepPoint {
            alpha_rad,
            cl: analysis.solution.cl(alpha_rad),
            cm_quarter_chord: analysis.solution.cm_quarter_chord(alpha_rad),
            cl_model: analysis.outcome.model.cl(alpha_rad),
        })
        .collect()
}

/// Glauert's plain-flap derivatives for an elevator or flap of chord fraction
/// `chord_fraction` (flap chord / section chord, 0 < F <= 1); see [`flap`].
pub fn flap_effectiveness(chord_fraction: f64) -> Result<FlapEffect, SectionError> {
    Ok(flap::plain_flap(chord_fraction)?)
}

/// Greatest thickness / chord of an airfoil's shape (used by the drag build-up).
///
/// NACA and Joukowski-type sections give it by definition; coordinates are measured. A
/// coordinate loop that cannot be read as a contour (input validation prevents this) gives
/// 0.12, a typical model section, rather than failing the whole analysis.
pub fn thickness_ratio(airfoil: &Airfoil) -> f64 {
    shape_thickness(airfoil).unwrap_or(0.12)
}

#[cfg(test)]
mod tests;
