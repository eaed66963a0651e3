//! Running a trade study: the sections are computed once, the wing system is built and
//! factored once (and re-solved only for the boundary angles of each incidence on an
//! incidence axis), and every point is the ordinary analysis chain on those.
//!
//! Each point is [`crate::analysis::analyse_with`] of the changed aircraft: the same code as
//! `analyse`, so its figures and cautions are those of `check` of that configuration
//! (tests/suite/study.rs checks this on random points against a full analysis). Masses only
//! move the CG and the weight, which enter the trim and stall solves as the moment reference
//! and the lift needed; an incidence enters the small-angle lattice only as a boundary angle
//! (`MultiSurfaceSystem::with_angle_change`), so no point rebuilds the geometry. The forward
//! CG limit from elevator authority depends on the system and the CG height only, so it is
//! found once per system and height (`trim::ForwardLimitMemo`).

use super::axis::{apply, check_value, Axis, Quantity, StudyError};
use crate::analysis::{self, Analysis, AnalysisError, AnalysisOptions, SectionSet};
use crate::caution::Level;
use crate::lifting_line::{LiftingLineError, MultiSurfaceSystem, SurfaceRole, TrimControl};
use crate::model::Aircraft;
use crate::stability::trim::ForwardLimitMemo;

/// Most points a study runs.
pub const MAX_POINTS: usize = 10_000;

/// A study prepared to run: base aircraft, axes, sections and factored systems.
pub struct Study<'a> {
    base: &'a Aircraft,
    axes: Vec<Axis>,
    options: AnalysisOptions,
    sections: SectionSet,
    /// The factored system for each value of the incidence axis (one entry when no axis
    /// changes an incidence), or the build's error.
    systems: Vec<Result<MultiSurfaceSystem, LiftingLineError>>,
    /// The forward CG limits found on each system (the limit depends on the system and the
    /// CG height only, not on the CG's x or the mass).
    memos: Vec<ForwardLimitMemo>,
    /// Which axis changes an incidence, if any.
    incidence_axis: Option<usize>,
}

/// How a point's trim came out.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum TrimOutcome {
    /// Trimmed at positive lift with neutral elevator.
    Trimmed {
        /// Trim lift coefficient on the wing area.
        cl: f64,
        /// Trim speed, m/s.
        speed_m_s: f64,
    },
    /// No stable trim at positive lift (CG at or behind the neutral point, or the rigging
    /// trims at zero or negative lift).
    NoTrim,
}

/// The elevator (or elevons) that trims at the target speed.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum ControlOutcome {
    /// No target speed was set, or the aircraft has no pitch control.
    NotAsked,
    /// The deflection, rad (trailing edge down positive), and whether it is within throws.
    Deflection {
        /// Deflection, rad.
        rad: f64,
        /// True when within the control's throws.
        within_throws: bool,
    },
    /// No deflection trims there (unstable, or the full model did not solve).
    NoTrim,
}

/// The figures of one study point.
#[derive(Debug, Clone, PartialEq)]
pub struct Point {
    /// The axis values of this point, SI, one per axis.
    pub values: Vec<f64>,
    /// The outcome: the figures, or why the chain could not run.
    pub outcome: Result<PointFigures, AnalysisError>,
}

/// The figures of a point that analysed.
#[derive(Debug, Clone, PartialEq)]
pub struct PointFigures {
    /// Total mass, kg.
    pub mass_kg: f64,
    /// CG x, m aft of the datum.
    pub cg_x_m: f64,
    /// Neutral point, m aft of the datum.
    pub neutral_point_x_m: f64,
    /// Static margin, fraction of MAC.
    pub static_margin: f64,
    /// Trim with neutral elevator.
    pub trim: TrimOutcome,
    /// Control to trim at the target speed.
    pub control_at_target: ControlOutcome,
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
    /// Which model gave the figures ("vortex-lattice", "lifting-line", "classical").
    pub method: &'static str,
    /// Codes of the cautions raised, in the analysis's order, without the standing safety
    /// caution that every analysis carries.
    pub cautions: Vec<(Level, &'static str)>,
    /// Least sink and best glide from the flight polar, when the study's options ask for it
    /// and it was computed at this point.
    pub glide: Option<crate::analysis::GlideFigures>,
}

impl<'a> Study<'a> {
    /// Prepare a study of `base` over `axes` (one or two), with the analysis `options`.
    /// Checks the axes and every value before anything is computed.
    pub fn new(
        base: &'a Aircraft,
        axes: Vec<Axis>,
        options: AnalysisOptions,
    ) -> Result<Self, StudyPrepareError> {
        check_axes(base, &axes)?;
        let sections = analysis::section_set(base, &options)?;
        let ll_options = analysis::lifting_line_options(base, &options);
        let built = crate::stability::trim::build_system(base, &sections.models, ll_options);
        let incidence_axis = axes.iter().position(|a| a.quantity.is_incidence());
        let systems = match (incidence_axis, &built) {
            (Some(k), Ok(system)) => {
                let axis = &axes[k];
                let base_incidence = base
                    .stabiliser
                    .as_ref()
                    .map_or(0.0, |s| s.surface.incidence_rad);
                axis.values
                    .iter()
                    .map(|&v| {
                        let changed = apply(base, &[(&axis.quantity, v)]);
                        let new_incidence = changed
                            .stabiliser
                            .as_ref()
                            .map_or(0.0, |s| s.surface.incidence_rad);
                        let d = new_incidence - base_incidence;
                        system.with_angle_change(|st| {
                            if st.is_on(SurfaceRole::Stabiliser) {
                                d
                            } else {
                                0.0
                            }
                        })
                    })
                    .collect()
            }
            _ => vec![built],
        };
        let memos = systems
            .iter()
            .map(|_| ForwardLimitMemo::default())
            .collect();
        Ok(Study {
            base,
            axes,
            options,
            sections,
            systems,
            memos,
            incidence_axis,
        })
    }

    /// The axes.
    pub fn axes(&self) -> &[Axis] {
        &self.axes
    }

    /// Number of points (product of the axis lengths; the last axis varies fastest).
    pub fn len(&self) -> usize {
        self.axes.iter().map(|a| a.values.len()).product()
    }

    /// True when the study has no points (never, once built: axes are not empty).
    pub fn is_empty(&self) -> bool {
        self.len() == 0
    }

    /// The aircraft of point `index` (the configuration `check` would analyse).
    pub fn aircraft_at(&self, index: usize) -> Aircraft {
        let idx = self.value_indices(index);
        let changes: Vec<(&Quantity, f64)> = self
            .axes
            .iter()
            .zip(&idx)
            .map(|(a, &i)| (&a.quantity, a.values[i]))
            .collect();
        apply(self.base, &changes)
    }

    /// Index into each axis of point `index` (last axis fastest).
    fn value_indices(&self, index: usize) -> Vec<usize> {
        let mut rest = index;
        let mut idx = vec![0; self.axes.len()];
        for (k, a) in self.axes.iter().enumerate().rev() {
            idx[k] = rest % a.values.len();
            rest /= a.values.len();
        }
        idx
    }

    /// The full analysis of point `index` on the shared sections and system.
    pub fn analysis_at(&self, index: usize) -> Result<(Aircraft, Analysis), AnalysisError> {
        let aircraft = self.aircraft_at(index);
        let k = self.system_index(index);
        let a = analysis::analyse_with(
            &aircraft,
            &self.sections,
            self.systems[k].as_ref(),
            Some(&self.memos[k]),
            &self.options,
        )?;
        Ok((aircraft, a))
    }

    fn system_index(&self, index: usize) -> usize {
        self.incidence_axis
            .map_or(0, |axis| self.value_indices(index)[axis])
    }

    fn system_at(&self, index: usize) -> Result<&MultiSurfaceSystem, &LiftingLineError> {
        self.systems[self.system_index(index)].as_ref()
    }

    /// Every point, in order (index 0 first, the last axis fastest), computed in parallel
    /// over the machine's cores; `on_point` is called once after each point (from any
    /// thread), for a progress display. The result does not depend on the number of threads:
    /// each point is computed on its own from shared, read-only data.
    pub fn run(&self, on_point: &(dyn Fn() + Sync)) -> Vec<Point> {
        use rayon::prelude::*;
        (0..self.len())
            .into_par_iter()
            .map(|i| {
                let p = self.point(i);
                on_point();
                p
            })
            .collect()
    }

    /// Point `index` of the study.
    pub fn point(&self, index: usize) -> Point {
        let idx = self.value_indices(index);
        let values = self
            .axes
            .iter()
            .zip(&idx)
            .map(|(a, &i)| a.values[i])
            .collect();
        let outcome = self
            .analysis_at(index)
            .map(|(aircraft, a)| self.figures(&aircraft, &a, index));
        Point { values, outcome }
    }

    fn figures(&self, aircraft: &Aircraft, a: &Analysis, index: usize) -> PointFigures {
        let h = &a.headline;
        let standing = crate::caution::safety_caution().code;
        PointFigures {
            glide: a.glide_polar.as_ref().and_then(|_| a.glide_figures()),
            mass_kg: a.mass.total_kg,
            cg_x_m: a.mass.cg_x_m,
            neutral_point_x_m: h.neutral_point_x_m,
            static_margin: h.static_margin,
            trim: match h.trim {
                Some(t) => TrimOutcome::Trimmed {
                    cl: t.cl,
                    speed_m_s: t.speed_m_s,
                },
                None => TrimOutcome::NoTrim,
            },
            control_at_target: self.control_at_target(aircraft, a, index),
            stall_speed_m_s: h.stall_speed_m_s,
            method: h.method.as_str(),
            cautions: a
                .cautions
                .iter()
                .filter(|c| c.code != standing)
                .map(|c| (c.level, c.code))
                .collect(),
        }
    }

    /// Elevator (or elevons) to trim at the target speed with the CG of the point: the same
    /// solve as the elevator schedule of the analysis, at the one speed asked for.
    fn control_at_target(&self, aircraft: &Aircraft, a: &Analysis, index: usize) -> ControlOutcome {
        let (Some(v), Some(control)) = (aircraft.targets.trim_speed_m_s, aircraft.pitch_control())
        else {
            return ControlOutcome::NotAsked;
        };
        let (Some(full), Ok(system)) = (a.full.as_ref(), self.system_at(index)) else {
            return ControlOutcome::NoTrim;
        };
        if full.static_margin <= 0.0 {
            return ControlOutcome::NoTrim;
        }
        let reference = system.reference();
        let cl = 2.0 * a.mass.total_kg * crate::atmosphere::G0
            / (a.air.density_kg_m3 * reference.area_m2 * v * v);
        // The fuselage enters as an aft shift of the moment reference (stability/trim.rs).
        let shift_m = reference.mac_m * analysis::fuselage_cm_alpha(aircraft, &a.wing)
            / full.cl_alpha_per_rad;
        let z = a.mass.cg_z_m.unwrap_or(aircraft.wing.root_le_z_m);
        match system.trim_for_cl(
            &system.condition(0.0),
            TrimControl::Elevator,
            cl,
            a.mass.cg_x_m + shift_m,
            z,
        ) {
            Ok(tp) if tp.control_rad.is_finite() => {
                // The solve gives the linear model's (lift-equivalent) deflection; the builder
                // sets the real one, larger by the flap correction (as in `check`).
                let rad = crate::stability::trim::real_deflection_rad(control, tp.control_rad);
                ControlOutcome::Deflection {
                    rad,
                    within_throws: control.within_throws(rad),
                }
            }
            _ => ControlOutcome::NoTrim,
        }
    }
}

/// Why a study could not be prepared.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum StudyPrepareError {
    /// The axes are not acceptable.
    #[error(transparent)]
    Axes(#[from] StudyError),
    /// The sections could not be computed.
    #[error(transparent)]
    Analysis(#[from] AnalysisError),
}

fn check_axes(base: &Aircraft, axes: &[Axis]) -> Result<(), StudyError> {
    if axes.is_empty() || axes.len() > 2 {
        return Err(StudyError::AxisCount { axes: axes.len() });
    }
    let mut points: u128 = 1;
    for a in axes {
        if a.values.is_empty() {
            return Err(StudyError::EmptyAxis {
                quantity: a.quantity.key(),
            });
        }
        points = points.saturating_mul(a.values.len() as u128);
    }
    if points > MAX_POINTS as u128 {
        return Err(StudyError::TooManyPoints {
            points,
            limit: MAX_POINTS,
        });
    }
    if let [a, b] = axes {
        let same = a.quantity == b.quantity
            || (a.quantity.is_incidence() && b.quantity.is_incidence())
            || matches!(
                (&a.quantity, &b.quantity),
                (Quantity::ItemX(_), Quantity::CgX) | (Quantity::CgX, Quantity::ItemX(_))
            );
        if same {
            return Err(StudyError::SameQuantity {
                first: a.quantity.key(),
                second: b.quantity.key(),
            });
        }
    }
    for a in axes {
        for &v in &a.values {
            check_value(base, &a.quantity, v)?;
        }
    }
    Ok(())
}
