//! Linear-strength vortex panel method with the Kutta condition.
//!
//! The contour is cut into N straight panels between N + 1 nodes, ordered clockwise (lower
//! trailing edge -> lower surface -> leading edge -> upper surface -> upper trailing edge). The
//! vortex strength varies linearly along each panel and is continuous at the nodes, giving
//! N + 1 unknown node strengths gamma_j (positive clockwise). At the midpoint of every panel
//! the normal velocity is zero (N equations); the Kutta condition `gamma_1 + gamma_{N+1} = 0`
//! closes the system. It is solved once for a unit free stream along x and once along y; a
//! stream at angle of attack alpha is their combination `cos(alpha), sin(alpha)`, so every
//! angle costs nothing more. Lift comes from the circulation (Kutta-Joukowski), `cl = 2 Gamma
//! / (U c)`; Cp at the panel midpoints from the local sheet strength, which is the surface speed
//! when the flow inside the contour is at rest, `Cp = 1 - (gamma / U)^2` (this is much more
//! accurate near the leading edge than summing the induced velocities at the flat panel);
//! cm about the quarter chord by integrating Cp over the panels. Blunt trailing edges are left
//! open (the gap carries no panel); sharp ones close.
//!
//! The velocity induced by a linear vortex panel is the closed form in the panel's own frame
//! (angles `theta_1, theta_2` and distances `r_1, r_2` to its ends). The linear system uses
//! nalgebra's LU decomposition; a singular or ill-conditioned system, or a non-finite
//! solution, is reported as an error rather than passed on.
//!
//! Incompressible, inviscid; angles of attack from the chord line, rad; coefficients on the
//! chord of the normalised contour (leading edge (0, 0), trailing edge (1, 0)); cm positive
//! nose up.
//!
//! # References
//! - Katz, J., Plotkin, A. (2001). Low-Speed Aerodynamics, 2nd ed., Cambridge University Press,
//!   ch. 10 (velocity induced by a linear-strength vortex element) and ch. 11
//!   (linear-strength vortex method with the Kutta condition).

use crate::section::geometry::{Contour, GeometryError};
use nalgebra::{DMatrix, DVector};
use std::f64::consts::PI;

/// Errors of the panel method.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum PanelError {
    /// The contour or panel count was not accepted.
    #[error(transparent)]
    Geometry(#[from] GeometryError),
    /// The influence matrix has a zero pivot.
    #[error("the panel equations are singular (check the coordinates for folded or overlapping surfaces)")]
    Singular,
    /// The solution contains NaN or infinity.
    #[error("the panel solution is not finite (check the coordinates)")]
    NotFinite,
    /// The solution does not satisfy the equations (nearly singular system).
    #[error(
        "the panel equations are ill-conditioned (relative residual {0:e}); check the coordinates"
    )]
    IllConditioned(f64),
}

/// A solved panel model of one airfoil, valid for every angle of attack.
#[derive(Debug, Clone, PartialEq)]
pub struct PanelSolution {
    /// Collocation points (panel midpoints), contour order (trailing edge -> upper -> leading
    /// edge -> lower).
    midpoints: Vec<[f64; 2]>,
    /// Outward normal times panel length, contour order.
    normal_lengths: Vec<[f64; 2]>,
    /// Surface speed at the midpoints for unit free streams along x and y, contour order: the
    /// mean vortex strength of the panel (sign irrelevant: only its square enters Cp).
    qt_x: Vec<f64>,
    qt_y: Vec<f64>,
    /// Circulation for unit free streams along x and along y.
    gamma_x: f64,
    gamma_y: f64,
}

/// One panel's surface point and pressure.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PanelPoint {
    /// x/c of the panel midpoint.
    pub x_c: f64,
    /// y/c of the panel midpoint.
    pub y_c: f64,
    /// Pressure coefficient.
    pub cp: f64,
}

/// The assembled linear-vortex panel equations of one contour, factored once: the geometry in
/// the method's clockwise order (lower trailing edge -> lower surface -> leading edge -> upper
/// surface -> upper trailing edge) and the LU factors of the influence matrix with its Kutta
/// row. Shared by the inviscid solution and the viscous coupling, which adds the normal
/// velocity of surface sources to the right-hand side.
#[derive(Debug, Clone)]
pub struct PanelSystem {
    /// Panel corners, clockwise, N + 1.
    pub(crate) nodes: Vec<[f64; 2]>,
    /// Panel midpoints, clockwise.
    pub(crate) midpoints: Vec<[f64; 2]>,
    /// Unit tangents (node j to node j + 1).
    pub(crate) tangents: Vec<[f64; 2]>,
    /// Unit outward normals.
    pub(crate) normals: Vec<[f64; 2]>,
    /// Panel lengths.
    pub(crate) lengths: Vec<f64>,
    a: DMatrix<f64>,
    lu: nalgebra::LU<f64, nalgebra::Dyn, nalgebra::Dyn>,
}

/// Relative residual above which a panel solve is refused as ill-conditioned.
const RESIDUAL_LIMIT: f64 = 1e-8;

impl PanelSystem {
    /// Builds and factors the equations on the given nodes (contour order: trailing edge ->
    /// upper -> leading edge -> lower -> trailing edge, chord fractions).
    pub fn assemble(nodes_ccw: &[[f64; 2]]) -> Result<PanelSystem, PanelError> {
        if nodes_ccw
            .iter()
            .any(|p| !p[0].is_finite() || !p[1].is_finite())
        {
            return Err(PanelError::NotFinite);
        }
        if nodes_ccw.len() < 4 {
            return Err(PanelError::Geometry(GeometryError::TooFewPoints(
                nodes_ccw.len(),
            )));
        }
        let mut nodes = nodes_ccw.to_vec();
        nodes.reverse(); // clockwise, as the method is written
        let n = nodes.len() - 1;
        let mut mid = Vec::with_capacity(n);
        let mut tan = Vec::with_capacity(n);
        let mut nor = Vec::with_capacity(n);
        let mut len = Vec::with_capacity(n);
        for j in 0..n {
            let (p, q) = (nodes[j], nodes[j + 1]);
            let l = (q[0] - p[0]).hypot(q[1] - p[1]);
            if l <= 0.0 {
                return Err(PanelError::Singular);
            }
            let t = [(q[0] - p[0]) / l, (q[1] - p[1]) / l];
            mid.push([0.5 * (p[0] + q[0]), 0.5 * (p[1] + q[1])]);
            tan.push(t);
            // Left normal; outward for a clockwise loop.
            nor.push([-t[1], t[0]]);
            len.push(l);
        }
        let mut a = DMatrix::<f64>::zeros(n + 1, n + 1);
        let inv2pi = 0.5 / PI;
        for i in 0..n {
            for j in 0..n {
                let (t, nn, l) = (tan[j], nor[j], len[j]);
                let d = [mid[i][0] - nodes[j][0], mid[i][1] - nodes[j][1]];
                let (x, z) = (d[0] * t[0] + d[1] * t[1], d[0] * nn[0] + d[1] * nn[1]);
                let (dtheta, log_r) = if i == j {
                    // On the panel's outer side at its midpoint.
                    (PI, 0.0)
                } else {
                    // theta_2 - theta_1 is the angle from (x, z) to (x - l, z): one atan2 of
                    // their cross and dot products.
                    let r1sq = x * x + z * z;
                    let r2sq = (x - l) * (x - l) + z * z;
                    ((z * l).atan2(x * (x - l) + z * z), 0.5 * (r1sq / r2sq).ln())
                };
                let (x, z) = if i == j { (0.5 * l, 0.0) } else { (x, z) };
                // Velocity of gamma_a (1 - s/l) + gamma_b s/l in the panel frame.
                let ub = inv2pi * (x * dtheta - z * log_r) / l;
                let ua = inv2pi * dtheta - ub;
                let wb = -inv2pi * (x * log_r - l + z * dtheta) / l;
                let wa = -inv2pi * log_r - wb;
                let to_global = |u: f64, w: f64| [u * t[0] + w * nn[0], u * t[1] + w * nn[1]];
                let ga = to_global(ua, wa);
                let gb = to_global(ub, wb);
                a[(i, j)] += ga[0] * nor[i][0] + ga[1] * nor[i][1];
                a[(i, j + 1)] += gb[0] * nor[i][0] + gb[1] * nor[i][1];
            }
        }
        a[(n, 0)] = 1.0;
        a[(n, n)] = 1.0;
        let lu = a.clone().lu();
        Ok(PanelSystem {
            nodes,
            midpoints: mid,
            tangents: tan,
            normals: nor,
            lengths: len,
            a,
            lu,
        })
    }

    /// Number of panels.
    pub fn panels(&self) -> usize {
        self.lengths.len()
    }

    /// Solves for the node vortex strengths (N + 1 rows, clockwise) for each column of `rhs`
    /// (minus the normal velocity at each midpoint, then 0 for the Kutta row), checking the
    /// residual.
    pub fn solve(&self, rhs: &DMatrix<f64>) -> Result<DMatrix<f64>, PanelError> {
        let sol = self.lu.solve(rhs).ok_or(PanelError::Singular)?;
        if sol.iter().any(|v| !v.is_finite()) {
            return Err(PanelError::NotFinite);
        }
        let residual = (&self.a * &sol - rhs).norm() / rhs.norm().max(f64::MIN_POSITIVE);
        if residual.is_nan() || residual >= RESIDUAL_LIMIT {
            return Err(PanelError::IllConditioned(residual));
        }
        Ok(sol)
    }

    /// Normal velocity at each midpoint, on the inner side of the surface, induced by unit
    /// constant-strength source panels (column j: panel j of strength 1), followed by one
    /// column per extra source panel in `extra` (start point, unit tangent, length), which lie
    /// off the surface. A source sheet's normal velocity jumps by its strength across the
    /// sheet: on the inner side of its own panel it is -1/2 (Katz & Plotkin, sec. 10.2.1,
    /// constant-strength source element).
    pub fn source_normal_influence(&self, extra: &[([f64; 2], [f64; 2], f64)]) -> DMatrix<f64> {
        let n = self.panels();
        let mut b = DMatrix::<f64>::zeros(n, n + extra.len());
        for i in 0..n {
            let ni = self.normals[i];
            for j in 0..n + extra.len() {
                let g = if i == j {
                    [-0.5 * ni[0], -0.5 * ni[1]]
                } else if j < n {
                    source_panel_velocity(
                        self.nodes[j],
                        self.tangents[j],
                        self.lengths[j],
                        self.midpoints[i],
                    )
                } else {
                    let (p0, t, l) = extra[j - n];
                    source_panel_velocity(p0, t, l, self.midpoints[i])
                };
                b[(i, j)] = g[0] * ni[0] + g[1] * ni[1];
            }
        }
        b
    }
}

/// Velocity at `point` induced by a straight source panel of unit strength from `start` along
/// the unit `tangent`, `length` long: in the panel frame `u = ln(r1^2/r2^2) / (4 pi)`, `w =
/// (theta_2 - theta_1) / (2 pi)` (Katz & Plotkin, sec. 10.2.1), the left normal being +w.
/// Not for points on the panel itself.
pub fn source_panel_velocity(
    start: [f64; 2],
    tangent: [f64; 2],
    length: f64,
    point: [f64; 2],
) -> [f64; 2] {
    let inv2pi = 0.5 / PI;
    let nn = [-tangent[1], tangent[0]];
    let d = [point[0] - start[0], point[1] - start[1]];
    let (x, z) = (
        d[0] * tangent[0] + d[1] * tangent[1],
        d[0] * nn[0] + d[1] * nn[1],
    );
    let l = length;
    let r1sq = x * x + z * z;
    let r2sq = (x - l) * (x - l) + z * z;
    let dtheta = (z * l).atan2(x * (x - l) + z * z);
    let (u, w) = (inv2pi * 0.5 * (r1sq / r2sq).ln(), inv2pi * dtheta);
    [u * tangent[0] + w * nn[0], u * tangent[1] + w * nn[1]]
}

impl PanelSolution {
    /// Re-panels `contour` with `panels` cosine-spaced panels and solves.
    pub fn solve(contour: &Contour, panels: usize) -> Result<PanelSolution, PanelError> {
        let nodes = contour.repanel(panels)?;
        Self::solve_nodes(&nodes)
    }

    /// Solves on the given nodes (contour order: trailing edge -> upper -> leading edge ->
    /// lower -> trailing edge, chord fractions), taking them as the panel corners as they are.
    pub fn solve_nodes(nodes_ccw: &[[f64; 2]]) -> Result<PanelSolution, PanelError> {
        let sys = PanelSystem::assemble(nodes_ccw)?;
        let n = sys.panels();
        let (nor, len) = (&sys.normals, &sys.lengths);
        let mid = &sys.midpoints;
        let mut rhs = DMatrix::<f64>::zeros(n + 1, 2);
        for i in 0..n {
            rhs[(i, 0)] = -nor[i][0];
            rhs[(i, 1)] = -nor[i][1];
        }
        let sol = sys.solve(&rhs)?;
        let gx: DVector<f64> = sol.column(0).into_owned();
        let gy: DVector<f64> = sol.column(1).into_owned();
        let circulation =
            |g: &DVector<f64>| -> f64 { (0..n).map(|j| 0.5 * (g[j] + g[j + 1]) * len[j]).sum() };
        // Back to contour order (reverse the clockwise panels).
        let mut midpoints = Vec::with_capacity(n);
        let mut normal_lengths = Vec::with_capacity(n);
        let mut qt_x = Vec::with_capacity(n);
        let mut qt_y = Vec::with_capacity(n);
        for j in (0..n).rev() {
            midpoints.push(mid[j]);
            normal_lengths.push([nor[j][0] * len[j], nor[j][1] * len[j]]);
            qt_x.push(0.5 * (gx[j] + gx[j + 1]));
            qt_y.push(0.5 * (gy[j] + gy[j + 1]));
        }
        let s = PanelSolution {
            midpoints,
            normal_lengths,
            qt_x,
            qt_y,
            gamma_x: circulation(&gx),
            gamma_y: circulation(&gy),
        };
        if !(s.gamma_x.is_finite() && s.gamma_y.is_finite()) {
            return Err(PanelError::NotFinite);
        }
        Ok(s)
    }

    /// Number of panels.
    pub fn panels(&self) -> usize {
        self.midpoints.len()
    }

    /// Lift coefficient at `alpha_rad` from the circulation.
    pub fn cl(&self, alpha_rad: f64) -> f64 {
        2.0 * (alpha_rad.cos() * self.gamma_x + alpha_rad.sin() * self.gamma_y)
    }

    /// Zero-lift angle, rad.
    pub fn alpha_zero_lift_rad(&self) -> f64 {
        (-self.gamma_x).atan2(self.gamma_y)
    }

    /// Lift slope at zero lift, per rad.
    pub fn cl_alpha_per_rad(&self) -> f64 {
        2.0 * self.gamma_x.hypot(self.gamma_y)
    }

    /// Pressure coefficient at each panel midpoint, contour order.
    pub fn surface(&self, alpha_rad: f64) -> Vec<PanelPoint> {
        let (s, c) = alpha_rad.sin_cos();
        self.midpoints
            .iter()
            .zip(self.qt_x.iter().zip(&self.qt_y))
            .map(|(m, (qx, qy))| {
                let q = c * qx + s * qy;
                PanelPoint {
                    x_c: m[0],
                    y_c: m[1],
                    cp: 1.0 - q * q,
                }
            })
            .collect()
    }

    /// Moment coefficient about the point (x_c, 0) on the chord line, positive nose up, by
    /// integrating Cp over the panels.
    pub fn cm_about(&self, x_c: f64, alpha_rad: f64) -> f64 {
        let m_ccw: f64 = self
            .surface(alpha_rad)
            .iter()
            .zip(&self.normal_lengths)
            .map(|(p, nl)| {
                let (fx, fy) = (-p.cp * nl[0], -p.cp * nl[1]);
                (p.x_c - x_c) * fy - p.y_c * fx
            })
            .sum();
        -m_ccw
    }

    /// Moment coefficient about the quarter chord, positive nose up.
    pub fn cm_quarter_chord(&self, alpha_rad: f64) -> f64 {
        self.cm_about(0.25, alpha_rad)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::section::naca::NacaProfile;
    use approx::assert_relative_eq;

    fn naca(d: &str, panels: usize) -> PanelSolution {
        let c = Contour::new(&NacaProfile::parse(d).unwrap().coordinates(101)).unwrap();
        PanelSolution::solve(&c, panels).unwrap()
    }

    #[test]
    fn symmetric_section_has_no_lift_or_moment_at_zero_angle() {
        // Symmetry: 1e-10 allows for rounding in the solve.
        let s = naca("0012", 100);
        assert_relative_eq!(s.cl(0.0), 0.0, epsilon = 1e-10);
        assert_relative_eq!(s.alpha_zero_lift_rad(), 0.0, epsilon = 1e-10);
        assert_relative_eq!(s.cm_quarter_chord(0.0), 0.0, epsilon = 1e-10);
    }

    #[test]
    fn lift_is_the_combination_of_the_two_unit_streams() {
        let s = naca("2412", 80);
        let a = 0.07;
        let expected = s.cl_alpha_per_rad() * (a - s.alpha_zero_lift_rad()).sin();
        assert_relative_eq!(s.cl(a), expected, epsilon = 1e-12);
    }

    #[test]
    fn pressure_integrated_lift_agrees_with_circulation() {
        // Two ways to the same lift differ by the discretisation only: 1 % at 160 panels.
        let s = naca("2412", 160);
        let a = 4f64.to_radians();
        let (sa, ca) = a.sin_cos();
        let cl_p: f64 = s
            .surface(a)
            .iter()
            .zip(&s.normal_lengths)
            .map(|(p, nl)| -p.cp * (-nl[0] * sa + nl[1] * ca))
            .sum();
        assert_relative_eq!(cl_p, s.cl(a), max_relative = 1e-2);
    }

    #[test]
    fn rejects_non_finite_nodes() {
        let mut nodes = NacaProfile::parse("0012").unwrap().coordinates(21);
        nodes[3][1] = f64::NAN;
        assert_eq!(
            PanelSolution::solve_nodes(&nodes),
            Err(PanelError::NotFinite)
        );
    }
}
