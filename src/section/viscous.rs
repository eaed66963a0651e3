//! Viscous-inviscid coupling: the boundary layer on the linear-vortex panel method by
//! transpiration (surface sources).
//!
//! The displacement effect of the boundary layer is represented by a source sheet on the
//! airfoil surface of strength `sigma = d(Ue delta*)/ds` (Lighthill's equivalent source, the
//! "blowing velocity"), s running with the flow away from the stagnation point. The sources'
//! normal velocity enters the right-hand side of the panel equations (the influence matrix and
//! its Kutta row are factored once per contour), so the flow leaving the surface is the
//! transpiration velocity and the surface speed is still the local sheet strength. The
//! boundary layer ([`crate::section::boundary_layer`]) is marched on both surfaces from the
//! stagnation point with the current surface speed; the mass defect `Ue delta*` is relaxed
//! ([`RELAXATION`]) and the loop is repeated until the residual is below [`TOLERANCE`]
//! (fraction of the free-stream speed), or it fails after [`MAX_ITERATIONS`] with a typed
//! [`ViscousError::NotConverged`] carrying the last residual. The residual is the largest
//! change of the surface speed that a full (unrelaxed) pass would make: the change of the
//! relaxed pass divided by its relaxation factor. (Measuring the relaxed change itself would
//! call a point converged whenever the relaxation is small: at the relaxation floor of 0.05
//! that let points stop with a true change near 1 % of the free stream and the transition
//! still moving, which put the drag 4-7 % low.) There is no fallback to the inviscid numbers.
//!
//! Lift from the circulation (Kutta-Joukowski), moment about the quarter chord by integrating
//! the surface pressure `Cp = 1 - (Ue/U)^2`, drag by Squire-Young from the trailing-edge state
//! of each surface. The wake is a straight line of source panels behind the trailing edge
//! along the chord line whose mass defect falls from the sum of the two trailing-edge values
//! to the far-wake momentum thickness over [`WAKE_DECAY_C`] (a prescribed decay, not a wake
//! boundary layer). Three measures keep the direct iteration stable: the relaxation backs off
//! when the change grows ([`MIN_RELAXATION`]), the source strengths are smoothed along each
//! surface ([`SMOOTHING_PASSES`]), and the panel speed on the last panel before the trailing
//! edge, which jumps at an open gap, is replaced by its neighbour's. Lift near stall and the
//! moment are the least accurate outputs; separated flow is not modelled.
//!
//! Angles of attack from the chord line, rad; coefficients on the chord; cm positive nose up;
//! transition and separation as x/c of the surface point.
//!
//! # References
//! - Lighthill, M. J. (1958). On displacement thickness. Journal of Fluid Mechanics 4(4),
//!   383-392 (the equivalent source distribution `d(Ue delta*)/ds`).
//! - Katz, J., Plotkin, A. (2001). Low-Speed Aerodynamics, 2nd ed., sec. 10.2.1 (velocity of a
//!   constant-strength source panel) and ch. 11 (panel method).
//! - Veldman, A. E. P. (1981). New, quasi-simultaneous method to calculate interacting boundary
//!   layers. AIAA Journal 19(1), 79-85 (why direct iteration needs relaxation and fails at
//!   separation: the reason for the typed not-converged result).
//! - Squire & Young (1937), Thwaites (1949), Drela & Giles (1987), Head (1958): see
//!   [`crate::section::boundary_layer`].

use crate::section::boundary_layer::{
    march::MarchSettings, march_surface, squire_young, Station, SurfaceLayer, TransitionCause,
};
use crate::section::geometry::{Contour, GeometryError};
use crate::section::panel::{PanelError, PanelSystem};
use nalgebra::{DMatrix, DVector};

mod coupling;

/// Lowest chord Reynolds number accepted (below it the flow is laminar-separated over most
/// sections and the integral methods have no footing; common practice).
pub const MIN_REYNOLDS: f64 = 1e4;
/// Highest chord Reynolds number accepted (the correlations are used up to about 1e7).
pub const MAX_REYNOLDS: f64 = 1e7;
/// Range of the critical amplification factor accepted (1: very turbulent air, 14: quieter
/// than any wind tunnel).
pub const N_CRIT_RANGE: (f64, f64) = (1.0, 14.0);
/// Fewest panels for the viscous solution: the boundary layer needs about 40 stations a
/// surface to resolve the suction peak and transition (see tests/suite/section_viscous.rs).
pub const MIN_VISCOUS_PANELS: usize = 80;
/// Largest trailing-edge gap accepted, fraction of chord: a blunt base has a base drag and a
/// wake that this method does not model (the NACA four-digit form's 0.25 % at 12 % passes).
pub const MAX_TRAILING_EDGE_GAP: f64 = 0.005;
/// Under-relaxation of the mass defect between passes (judgement from the tests: direct
/// iteration oscillates near transition with larger factors).
pub const RELAXATION: f64 = 0.25;
/// Smallest relaxation factor the adaptive relaxation goes down to.
pub const MIN_RELAXATION: f64 = 0.05;
/// Passes of 1-2-1 smoothing of the source strengths along each surface.
pub const SMOOTHING_PASSES: usize = 2;
/// Panel count at which [`SMOOTHING_PASSES`] apply (the count they were tuned at, the same as
/// [`crate::section::DEFAULT_ANALYSIS_PANELS`]; kept apart so that the smoothing stays put if
/// that default ever moves).
pub const SMOOTHING_REFERENCE_PANELS: usize = 160;
/// Convergence: largest change of the surface speed a full (unrelaxed) pass would make,
/// fraction of the free-stream speed. At 5e-4 the lift and drag agree with those at a five
/// times tighter tolerance within 0.3 % (tests/suite/section_viscous.rs).
pub const TOLERANCE: f64 = 5e-4;
/// Most passes before a point is reported as not converged (attached points need 40-260 at
/// 120-320 panels; a judgement with margin).
pub const MAX_ITERATIONS: usize = 400;
/// A point counts as stalled when the turbulent separation on either surface lies ahead of
/// this chord fraction (a judgement, common practice for trailing-edge stall: the lift curve
/// of such sections flattens once about the aft 30 % of chord is separated).
pub const STALL_SEPARATION_X_C: f64 = 0.7;

/// Length of the modelled wake, chords.
const WAKE_LENGTH: f64 = 2.0;
/// Growth of the wake panels' length from one to the next.
const WAKE_GROWTH: f64 = 1.3;
/// Decay length of the wake's mass defect behind the trailing edge, chords (a judgement: the
/// near wake's displacement thickness falls to its far-wake value, the momentum thickness,
/// within a few tenths of a chord as the wake's shape factor goes to 1).
pub const WAKE_DECAY_C: f64 = 0.2;

/// Settings of the viscous section method.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ViscousSettings {
    /// Chord Reynolds number `U c / nu`.
    pub reynolds: f64,
    /// Critical amplification factor N of the e^N transition criterion.
    pub n_crit: f64,
    /// Panels of the underlying panel method.
    pub panels: usize,
}

impl Default for ViscousSettings {
    /// Re 200,000, N 9 (quiet air), [`crate::section::DEFAULT_ANALYSIS_PANELS`] (160) panels.
    fn default() -> Self {
        ViscousSettings {
            reynolds: 2e5,
            n_crit: crate::section::boundary_layer::envelope::DEFAULT_N_CRIT,
            panels: crate::section::DEFAULT_ANALYSIS_PANELS,
        }
    }
}

/// Errors of the viscous method.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum ViscousError {
    /// Reynolds number outside the accepted range.
    #[error("Reynolds number {value} is outside the accepted range {MIN_REYNOLDS:e} to {MAX_REYNOLDS:e}")]
    Reynolds {
        /// Value given.
        value: f64,
    },
    /// Amplification factor outside the accepted range.
    #[error("transition setting N {value} is outside the accepted range 1 to 14")]
    NCrit {
        /// Value given.
        value: f64,
    },
    /// Too few panels for the boundary layer.
    #[error(
        "{panels} panels is too coarse for the viscous method (at least {MIN_VISCOUS_PANELS})"
    )]
    TooCoarse {
        /// Panels asked for.
        panels: usize,
    },
    /// Open or blunt trailing edge.
    #[error("the trailing edge is open by {:.2} % of chord; the viscous method needs a closed or nearly closed trailing edge (at most {:.1} %)", 100.0 * gap_c, 100.0 * MAX_TRAILING_EDGE_GAP)]
    OpenTrailingEdge {
        /// Gap, fraction of chord.
        gap_c: f64,
    },
    /// The panel equations failed.
    #[error(transparent)]
    Panel(#[from] PanelError),
    /// The coupling did not converge at this angle.
    #[error("the viscous solution did not converge at alpha = {:.2} deg (residual {residual:.1e} after {iterations} passes)", alpha_rad.to_degrees())]
    NotConverged {
        /// Angle of attack, rad.
        alpha_rad: f64,
        /// Last residual (largest change of the surface speed, fraction of free stream).
        residual: f64,
        /// Passes made.
        iterations: usize,
    },
}

/// Boundary-layer summary of one surface.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SurfaceSummary {
    /// Transition x/c, `None` if laminar to the trailing edge.
    pub transition_x_c: Option<f64>,
    /// What caused the transition.
    pub transition_cause: Option<TransitionCause>,
    /// Michel's criterion x/c (cross-check), if met on the laminar part.
    pub michel_x_c: Option<f64>,
    /// Turbulent separation x/c, if any.
    pub separation_x_c: Option<f64>,
    /// Momentum thickness at the trailing edge, chord fractions.
    pub theta_te: f64,
    /// Shape factor at the trailing edge.
    pub h_te: f64,
    /// Drag share (Squire-Young).
    pub cd: f64,
}

/// A converged viscous solution at one angle of attack.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ViscousPoint {
    /// Angle of attack from the chord line, rad.
    pub alpha_rad: f64,
    /// Lift coefficient.
    pub cl: f64,
    /// Profile drag coefficient (Squire-Young, both surfaces).
    pub cd: f64,
    /// Moment coefficient about the quarter chord, positive nose up.
    pub cm_quarter_chord: f64,
    /// Upper surface.
    pub upper: SurfaceSummary,
    /// Lower surface.
    pub lower: SurfaceSummary,
    /// Passes to convergence.
    pub iterations: usize,
    /// Final residual.
    pub residual: f64,
}

impl ViscousPoint {
    /// Most forward turbulent separation of the two surfaces, x/c.
    pub fn separation_x_c(&self) -> Option<f64> {
        match (self.upper.separation_x_c, self.lower.separation_x_c) {
            (Some(a), Some(b)) => Some(a.min(b)),
            (a, b) => a.or(b),
        }
    }

    /// Whether the point is past the stall criterion ([`STALL_SEPARATION_X_C`]).
    pub fn is_stalled(&self) -> bool {
        self.separation_x_c()
            .is_some_and(|x| x < STALL_SEPARATION_X_C)
    }
}

/// A contour prepared for viscous solutions at one Reynolds number and N.
#[derive(Debug, Clone)]
pub struct ViscousSection {
    settings: ViscousSettings,
    system: PanelSystem,
    /// Signed surface speed at the midpoints (clockwise order) for unit streams along x, y.
    q_x: DVector<f64>,
    q_y: DVector<f64>,
    /// Surface speed at the midpoints per unit source strength on each panel.
    q_sigma: DMatrix<f64>,
    /// Surface speed at the midpoints per unit source strength on each wake panel.
    q_wake: DMatrix<f64>,
    /// Distance of each wake panel's midpoint behind the trailing edge, chord fractions.
    wake_s: Vec<f64>,
}

/// Wake panels behind the trailing edge (1, 0) along the chord line: the first `first_length`
/// long, each next one [`WAKE_GROWTH`] times longer, to [`WAKE_LENGTH`] chords.
fn wake_panels(first_length: f64) -> Vec<([f64; 2], [f64; 2], f64)> {
    let mut out = Vec::new();
    let (mut x, mut l) = (1.0, first_length.max(1e-3));
    while x < 1.0 + WAKE_LENGTH {
        out.push(([x, 0.0], [1.0, 0.0], l));
        x += l;
        l *= WAKE_GROWTH;
    }
    out
}

impl ViscousSection {
    /// Checks the settings and the contour, panels it and factors the equations.
    pub fn new(
        contour: &Contour,
        settings: ViscousSettings,
    ) -> Result<ViscousSection, ViscousError> {
        let re = settings.reynolds;
        if !(re.is_finite() && (MIN_REYNOLDS..=MAX_REYNOLDS).contains(&re)) {
            return Err(ViscousError::Reynolds { value: re });
        }
        let n = settings.n_crit;
        if !(n.is_finite() && (N_CRIT_RANGE.0..=N_CRIT_RANGE.1).contains(&n)) {
            return Err(ViscousError::NCrit { value: n });
        }
        if settings.panels < MIN_VISCOUS_PANELS {
            return Err(ViscousError::TooCoarse {
                panels: settings.panels,
            });
        }
        let gap = contour.trailing_edge_gap();
        if gap > MAX_TRAILING_EDGE_GAP {
            return Err(ViscousError::OpenTrailingEdge { gap_c: gap });
        }
        let nodes = contour
            .repanel(settings.panels)
            .map_err(|e: GeometryError| ViscousError::Panel(PanelError::Geometry(e)))?;
        let system = PanelSystem::assemble(&nodes)?;
        let np = system.panels();
        let mut rhs = DMatrix::<f64>::zeros(np + 1, np + 2);
        for i in 0..np {
            rhs[(i, 0)] = -system.normals[i][0];
            rhs[(i, 1)] = -system.normals[i][1];
        }
        let wake = wake_panels(system.lengths[0].min(system.lengths[np - 1]));
        let nw = wake.len();
        let b = system.source_normal_influence(&wake);
        let mut rhs = rhs.resize_horizontally(np + 2 + nw, 0.0);
        for i in 0..np {
            for j in 0..np + nw {
                rhs[(i, j + 2)] = -b[(i, j)];
            }
        }
        let gamma = system.solve(&rhs)?;
        // Mean sheet strength of each panel = surface speed.
        let mut q = DMatrix::<f64>::zeros(np, np + 2 + nw);
        for i in 0..np {
            for c in 0..np + 2 + nw {
                q[(i, c)] = 0.5 * (gamma[(i, c)] + gamma[(i + 1, c)]);
            }
        }
        Ok(ViscousSection {
            settings,
            q_x: q.column(0).into_owned(),
            q_y: q.column(1).into_owned(),
            q_sigma: q.columns(2, np).into_owned(),
            q_wake: q.columns(2 + np, nw).into_owned(),
            wake_s: wake.iter().map(|w| w.0[0] - 1.0 + 0.5 * w.2).collect(),
            system,
        })
    }

    /// Passes of the 1-2-1 smoothing for this panel count (see [`SMOOTHING_PASSES`]).
    fn smoothing_passes(&self) -> usize {
        let ratio = self.settings.panels as f64 / SMOOTHING_REFERENCE_PANELS as f64;
        ((SMOOTHING_PASSES as f64) * ratio * ratio).round().max(1.0) as usize
    }

    /// The settings.
    pub fn settings(&self) -> &ViscousSettings {
        &self.settings
    }

    /// Solves the coupled problem at `alpha_rad`.
    pub fn solve(&self, alpha_rad: f64) -> Result<ViscousPoint, ViscousError> {
        self.solve_to(alpha_rad, TOLERANCE)
    }

    /// Solves the coupled problem at `alpha_rad` to the residual `tolerance` (fraction of the
    /// free-stream speed) instead of [`TOLERANCE`]: for convergence studies.
    pub fn solve_to(&self, alpha_rad: f64, tolerance: f64) -> Result<ViscousPoint, ViscousError> {
        let (q, _, iterations, residual, march) = self.iterate(alpha_rad, tolerance)?;
        Ok(self.point(alpha_rad, &q, &march, iterations, residual))
    }
}
