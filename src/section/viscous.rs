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
/// Panel count at which [`SMOOTHING_PASSES`] apply.
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
    /// Re 200,000, N 9 (quiet air), 160 panels.
    fn default() -> Self {
        ViscousSettings {
            reynolds: 2e5,
            n_crit: crate::section::boundary_layer::envelope::DEFAULT_N_CRIT,
            panels: 160,
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

/// `y = a x` for a column-major `a`, summed column by column in rising order (the order of
/// nalgebra's own product, so the same numbers), on contiguous columns so that the inner loop
/// vectorises: the coupling loop spends much of its time here.
fn mat_vec_into(a: &DMatrix<f64>, x: &[f64], y: &mut [f64]) {
    y.fill(0.0);
    let rows = a.nrows();
    if rows == 0 {
        return;
    }
    let columns = a.as_slice();
    let mut j = 0;
    // Four columns a pass: each y_i still gets its terms in rising column order, but is
    // loaded and stored once for four of them.
    while j + 4 <= x.len() {
        let c = &columns[j * rows..(j + 4) * rows];
        let (c0, rest) = c.split_at(rows);
        let (c1, rest) = rest.split_at(rows);
        let (c2, c3) = rest.split_at(rows);
        let (x0, x1, x2, x3) = (x[j], x[j + 1], x[j + 2], x[j + 3]);
        for ((((yi, a0), a1), a2), a3) in y.iter_mut().zip(c0).zip(c1).zip(c2).zip(c3) {
            let mut v = *yi;
            v += a0 * x0;
            v += a1 * x1;
            v += a2 * x2;
            v += a3 * x3;
            *yi = v;
        }
        j += 4;
    }
    for (column, &xj) in columns[j * rows..].chunks_exact(rows).zip(&x[j..]) {
        for (yi, &aij) in y.iter_mut().zip(column) {
            *yi += aij * xj;
        }
    }
}

/// One side's stations mapped to panels.
struct Side {
    panels: Vec<usize>,
    stations: Vec<Station>,
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

    /// Splits the surface at the stagnation point of the signed speed `q`.
    fn sides(&self, q: &DVector<f64>) -> (Side, Side) {
        let np = q.len();
        let mid = &self.system.midpoints;
        // Leading edge: the node farthest forward; the stagnation point is the sign change of
        // q (negative on the lower side, positive on the upper) nearest to it.
        let le = (0..np)
            .min_by(|&a, &b| mid[a][0].total_cmp(&mid[b][0]))
            .unwrap_or(np / 2);
        let mut k = None;
        for d in 0..np {
            for cand in [le + d, le.wrapping_sub(d)] {
                if cand >= 1 && cand < np && q[cand - 1] < 0.0 && q[cand] >= 0.0 {
                    k = Some(cand);
                    break;
                }
            }
            if k.is_some() {
                break;
            }
        }
        let k = k.unwrap_or(le.max(1));
        let dist = |a: usize, b: usize| (mid[a][0] - mid[b][0]).hypot(mid[a][1] - mid[b][1]);
        let f = (-q[k - 1] / (q[k] - q[k - 1])).clamp(0.0, 1.0);
        let d0 = dist(k - 1, k);
        let build = |order: Vec<usize>, first_s: f64| {
            let mut stations = Vec::with_capacity(order.len());
            let mut s = first_s.max(1e-6);
            for (n, &p) in order.iter().enumerate() {
                if n > 0 {
                    s += dist(order[n - 1], p);
                }
                stations.push(Station {
                    s,
                    ue: q[p].abs().max(1e-6),
                });
            }
            // The panel method's speed on the last panel before the trailing edge is unreliable
            // (it jumps at the open gap of a blunt edge): hold the speed of the one before.
            let n = stations.len();
            if n >= 3 {
                stations[n - 1].ue = stations[n - 2].ue;
            }
            Side {
                panels: order,
                stations,
            }
        };
        let upper = build((k..np).collect(), (1.0 - f) * d0);
        let lower = build((0..k).rev().collect(), f * d0);
        (upper, lower)
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

    /// The coupling loop: converged surface speed, source strengths, passes, residual.
    #[allow(clippy::type_complexity)]
    fn iterate(
        &self,
        alpha_rad: f64,
        tolerance: f64,
    ) -> Result<(DVector<f64>, DVector<f64>, usize, f64, MarchSettings), ViscousError> {
        let np = self.system.panels();
        let (sa, ca) = alpha_rad.sin_cos();
        let q_inv = &self.q_x * ca + &self.q_y * sa;
        let march = MarchSettings {
            nu: 1.0 / self.settings.reynolds,
            n_crit: self.settings.n_crit,
            trip_s: None,
        };
        let mut mass = DVector::<f64>::zeros(np);
        let mut sigma = DVector::<f64>::zeros(np);
        let mut q = q_inv.clone();
        let mut q_new = q_inv.clone();
        let (mut from_sigma, mut from_wake) = (vec![0.0; np], vec![0.0; np]);
        let mut sigma_wake = vec![0.0; self.wake_s.len()];
        let mut residual = f64::INFINITY;
        let mut w = RELAXATION;
        let mut last_change = f64::INFINITY;
        let smoothing_passes = self.smoothing_passes();
        for iteration in 1..=MAX_ITERATIONS {
            let (upper, lower) = self.sides(&q);
            let lu = march_surface(&upper.stations, &march);
            let ll = march_surface(&lower.stations, &march);
            let w_now = if iteration == 1 { 1.0 } else { w };
            for (side, layer) in [(&upper, &lu), (&lower, &ll)] {
                for (n, &p) in side.panels.iter().enumerate() {
                    let m_new = side.stations[n].ue * layer.states[n].delta_star;
                    mass[p] += w_now * (m_new - mass[p]);
                }
                // sigma = d(Ue delta*)/ds along the flow, by differences on the stations (the
                // stagnation point has zero mass defect).
                let st = &side.stations;
                for n in 0..st.len() {
                    let p = side.panels[n];
                    let (s0, m0) = if n == 0 {
                        (0.0, 0.0)
                    } else {
                        (st[n - 1].s, mass[side.panels[n - 1]])
                    };
                    let (s1, m1) = match st.get(n + 1) {
                        Some(nx) => (nx.s, mass[side.panels[n + 1]]),
                        None => (st[n].s, mass[p]),
                    };
                    sigma[p] = if s1 > s0 { (m1 - m0) / (s1 - s0) } else { 0.0 };
                }
                // Panel-to-panel oscillation of the sources is the direct iteration's unstable
                // mode: take it out with 1-2-1 smoothing along the surface.
                for _ in 0..smoothing_passes {
                    let raw: Vec<f64> = side.panels.iter().map(|&p| sigma[p]).collect();
                    for n in 1..raw.len().saturating_sub(1) {
                        sigma[side.panels[n]] = 0.25 * (raw[n - 1] + 2.0 * raw[n] + raw[n + 1]);
                    }
                }
            }
            // Wake: mass defect from the two trailing-edge values down to the far-wake momentum
            // thickness (Squire-Young), exponentially over WAKE_DECAY_C.
            let te = |side: &Side, layer: &SurfaceLayer| {
                let (st, ls) = (side.stations.last(), layer.states.last());
                match (st, ls) {
                    (Some(st), Some(ls)) => (
                        mass[*side.panels.last().unwrap_or(&0)],
                        squire_young::drag_coefficient(ls.theta, st.ue, ls.h),
                    ),
                    _ => (0.0, 0.0),
                }
            };
            let (mu, cdu) = te(&upper, &lu);
            let (ml, cdl) = te(&lower, &ll);
            let (m_te, m_far) = (mu + ml, 0.5 * (cdu + cdl));
            for (sw, &x) in sigma_wake.iter_mut().zip(&self.wake_s) {
                *sw = -(m_te - m_far) / WAKE_DECAY_C * (-x / WAKE_DECAY_C).exp();
            }
            mat_vec_into(&self.q_sigma, sigma.as_slice(), &mut from_sigma);
            mat_vec_into(&self.q_wake, &sigma_wake, &mut from_wake);
            for i in 0..np {
                q_new[i] = q_inv[i] + from_sigma[i] + from_wake[i];
            }
            let change = (0..np)
                .map(|i| (q_new[i].abs() - q[i].abs()).abs())
                .fold(0.0, f64::max);
            // The change a full pass would make (see the module documentation).
            residual = change / w_now;
            // Adaptive relaxation: back off when the change grows, recover slowly.
            w = if change > last_change {
                (0.7 * w).max(MIN_RELAXATION)
            } else {
                (1.1 * w).min(RELAXATION)
            };
            last_change = change;
            std::mem::swap(&mut q, &mut q_new);
            if !residual.is_finite() || q.iter().any(|v| !v.is_finite()) {
                break;
            }
            if residual < tolerance && iteration > 2 {
                return Ok((q, sigma, iteration, residual, march));
            }
        }
        Err(ViscousError::NotConverged {
            alpha_rad,
            residual: if residual.is_finite() {
                residual
            } else {
                f64::MAX
            },
            iterations: MAX_ITERATIONS,
        })
    }

    /// Coefficients of a converged surface speed.
    fn point(
        &self,
        alpha_rad: f64,
        q: &DVector<f64>,
        march: &MarchSettings,
        iterations: usize,
        residual: f64,
    ) -> ViscousPoint {
        let sys = &self.system;
        let np = sys.panels();
        let circulation: f64 = (0..np).map(|j| q[j] * sys.lengths[j]).sum();
        let m_ccw: f64 = (0..np)
            .map(|j| {
                let cp = 1.0 - q[j] * q[j];
                let nl = [
                    sys.normals[j][0] * sys.lengths[j],
                    sys.normals[j][1] * sys.lengths[j],
                ];
                let (fx, fy) = (-cp * nl[0], -cp * nl[1]);
                (sys.midpoints[j][0] - 0.25) * fy - sys.midpoints[j][1] * fx
            })
            .sum();
        let (upper, lower) = self.sides(q);
        let lu = march_surface(&upper.stations, march);
        let ll = march_surface(&lower.stations, march);
        let up = self.summary(&upper, &lu);
        let lo = self.summary(&lower, &ll);
        ViscousPoint {
            alpha_rad,
            cl: 2.0 * circulation,
            cd: up.cd + lo.cd,
            cm_quarter_chord: -m_ccw,
            upper: up,
            lower: lo,
            iterations,
            residual,
        }
    }

    fn summary(&self, side: &Side, layer: &SurfaceLayer) -> SurfaceSummary {
        let mid = &self.system.midpoints;
        // x/c at a distance s from the stagnation point, by interpolation on the stations.
        let x_at = |s: f64| -> f64 {
            let st = &side.stations;
            match st.iter().position(|p| p.s >= s) {
                Some(0) | None => mid[side.panels[if s <= st[0].s { 0 } else { st.len() - 1 }]][0],
                Some(n) => {
                    let f = (s - st[n - 1].s) / (st[n].s - st[n - 1].s);
                    let (a, b) = (mid[side.panels[n - 1]][0], mid[side.panels[n]][0]);
                    a + f * (b - a)
                }
            }
        };
        let last = layer.states.last().copied();
        let ue_te = side.stations.last().map_or(1.0, |s| s.ue);
        let (theta_te, h_te) = last.map_or((0.0, 1.4), |s| (s.theta, s.h));
        SurfaceSummary {
            transition_x_c: layer.transition.map(|(s, _)| x_at(s)),
            transition_cause: layer.transition.map(|(_, c)| c),
            michel_x_c: layer.michel_s.map(x_at),
            separation_x_c: layer.separation_s.map(x_at),
            theta_te,
            h_te,
            cd: squire_young::drag_coefficient(theta_te, ue_te, h_te),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn matrix_vector_product_is_nalgebra_s_to_the_bit() {
        // mat_vec_into replaces nalgebra's product in the coupling loop for speed; it keeps
        // the order of the sums, so the numbers must be identical (column counts on and off a
        // multiple of four).
        for (rows, cols) in [(161, 37), (160, 160), (7, 3), (5, 4)] {
            let a = DMatrix::<f64>::from_fn(rows, cols, |i, j| {
                ((i * 31 + j * 17) as f64 * 0.37).sin() / (1.0 + j as f64)
            });
            let x = DVector::<f64>::from_fn(cols, |j, _| (j as f64 * 0.71).cos() * 1e-3);
            let reference = &a * &x;
            let mut y = vec![f64::NAN; rows];
            mat_vec_into(&a, x.as_slice(), &mut y);
            for i in 0..rows {
                assert_eq!(
                    y[i].to_bits(),
                    reference[i].to_bits(),
                    "row {i} of {rows}x{cols}"
                );
            }
        }
    }
}
