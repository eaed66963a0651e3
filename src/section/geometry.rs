//! Airfoil contours: checking and normalising a loop of coordinates, splitting it into
//! surfaces, taking its mean line, and re-panelling it with cosine spacing.
//!
//! A contour is a closed loop that starts and ends at the trailing edge and passes round the
//! leading edge once, in either direction. The trailing-edge point may be repeated at the end
//! (sharp trailing edge), given once (the loop closes on it), or the two ends may be apart
//! (blunt trailing edge, the trailing edge is their midpoint). The leading edge is the point
//! farthest from the trailing edge. Normalising moves the leading edge to (0, 0), the trailing
//! edge to (1, 0), and orders the points trailing edge -> upper surface -> leading edge ->
//! lower surface -> trailing edge.
//!
//! Re-panelling interpolates each coordinate by a natural cubic spline in the cumulative chord
//! length of the points and places the nodes of both surfaces at the same stations, a blend of
//! cosine spacing `x/c = (1 - cos beta) / 2` (gathered at both edges) with half-cosine spacing
//! `1 - cos(beta / 2)` (gathered at the leading edge only). The leading and trailing edges
//! stay nodes.
//!
//! # References
//! - de Boor, C. (2001). A Practical Guide to Splines, rev. ed., Springer (cubic spline
//!   interpolation, natural end conditions).
//! - Katz, J., Plotkin, A. (2001). Low-Speed Aerodynamics, 2nd ed., ch. 11 (panel layout,
//!   cosine spacing).
//! - Abbott, I. H., von Doenhoff, A. E. (1959). Theory of Wing Sections, ch. 6 (chord line,
//!   mean line as the locus of midpoints).

use std::f64::consts::PI;

mod plane;
mod spline;

use plane::{check_self_crossing, cross, dist, dot, farthest_from, sub, unit};
use spline::{refine_leading_edge, Spline};

/// Fewest points accepted in a contour.
pub const MIN_POINTS: usize = 8;

/// Errors in a coordinate loop. Indices are 0-based positions in the points given.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum GeometryError {
    /// Fewer than [`MIN_POINTS`] points.
    #[error("{0} points is too few for an airfoil contour (at least {MIN_POINTS} are needed)")]
    TooFewPoints(usize),
    /// NaN or infinite coordinate.
    #[error("point {} has a coordinate that is not a finite number", .0 + 1)]
    NotFinite(usize),
    /// Two consecutive points coincide.
    #[error("points {} and {} are the same point (remove the duplicate)", .0 + 1, .0 + 2)]
    Duplicate(usize),
    /// The loop has no extent.
    #[error("the points have no extent (all at one place)")]
    Degenerate,
    /// Two segments of the loop cross or touch.
    #[error("the contour crosses itself: segment from point {} and segment from point {} intersect", .0 + 1, .1 + 1)]
    SelfCrossing(usize, usize),
    /// The points do not run once from the trailing edge round the leading edge and back.
    #[error("the points are not in order around the airfoil near point {} (expected trailing edge -> one surface -> leading edge -> other surface -> trailing edge)", .0 + 1)]
    Unordered(usize),
    /// The loop starts and ends at the blunter end of the shape.
    #[error("the contour seems to start and end at the leading edge; it must start and end at the trailing edge")]
    StartsAtLeadingEdge,
    /// Fewer panels than the method needs, or absurdly many.
    #[error("{0} panels is outside the accepted range {min} to {max}", min = MIN_PANELS, max = MAX_PANELS)]
    PanelCount(usize),
}

/// Weight of full-cosine spacing in the station blend (the rest is half-cosine spacing, which
/// gathers points at the leading edge only). Full cosine spacing makes the last panels so short
/// that, where the section is thinner than a panel is long (a cusp), the normal-velocity
/// conditions of the two surfaces nearly repeat each other and the Kutta condition sits on
/// poorly determined strengths: a cambered Joukowski section then comes out about 1 % high in
/// cl at any panel count. With 3/4 full cosine the trailing-edge panels are about 0.4 / (N/2)
/// long and the same section agrees within 0.1 %, while finite-angle and blunt trailing edges
/// stay within about 0.25 % (a judgement from a convergence study; see tests/suite/section_panel.rs).
pub const FULL_COSINE_WEIGHT: f64 = 0.75;

/// Fewest panels accepted when re-panelling.
pub const MIN_PANELS: usize = 16;
/// Most panels accepted when re-panelling.
pub const MAX_PANELS: usize = 1000;

/// A checked, normalised airfoil contour.
#[derive(Debug, Clone, PartialEq)]
pub struct Contour {
    /// Points in chord fractions, trailing edge -> upper -> leading edge -> lower -> trailing
    /// edge; for a sharp trailing edge the first and last points are both (1, 0).
    points: Vec<[f64; 2]>,
    /// Index of the leading edge (0, 0) in `points`.
    le: usize,
}

impl Contour {
    /// Checks and normalises a loop of points (any units, any order direction); the leading
    /// edge is the point of the contour farthest from the trailing edge.
    pub fn new(raw: &[[f64; 2]]) -> Result<Contour, GeometryError> {
        Self::build(raw, None)
    }

    /// As [`Contour::new`], but with the leading edge at the given point (index into `raw`),
    /// for shapes whose published chord line starts at a known point (the NACA sections,
    /// whose chord runs from the origin of the mean line).
    pub fn with_leading_edge(raw: &[[f64; 2]], le_index: usize) -> Result<Contour, GeometryError> {
        Self::build(raw, Some(le_index))
    }

    fn build(raw: &[[f64; 2]], le_hint: Option<usize>) -> Result<Contour, GeometryError> {
        let (mut pts, closed, tol) = checked_points(raw)?;
        // Points put in front of the raw ones (moves the indices of `le_hint`).
        let shift = if closed {
            0
        } else {
            close_at_trailing_edge(&mut pts)
        };
        let (first, last) = (pts[0], pts[pts.len() - 1]);
        let te = [0.5 * (first[0] + last[0]), 0.5 * (first[1] + last[1])];
        let le = match le_hint {
            Some(i) if i + shift < pts.len() => i + shift,
            Some(i) => return Err(GeometryError::Unordered(i)),
            None => {
                let le = farthest_from(&pts, te);
                if le > 0 && le + 1 < pts.len() {
                    refine_leading_edge(&mut pts, le, te, tol)
                } else {
                    le
                }
            }
        };
        let chord = dist(te, pts[le]);
        if chord <= tol {
            return Err(GeometryError::Degenerate);
        }
        let e = unit(sub(te, pts[le]));
        let origin = pts[le];
        let mut points: Vec<[f64; 2]> = pts
            .iter()
            .map(|p| {
                let d = sub(*p, origin);
                [dot(d, e) / chord, cross(e, d) / chord]
            })
            .collect();
        let mut le_index = le;
        // Orientation: counter-clockwise (positive area) is trailing edge -> upper first.
        let area: f64 = (0..points.len())
            .map(|i| {
                let (p, q) = (points[i], points[(i + 1) % points.len()]);
                p[0] * q[1] - q[0] * p[1]
            })
            .sum();
        if area < 0.0 {
            points.reverse();
            le_index = points.len() - 1 - le_index;
        }
        if le_index == 0 || le_index == points.len() - 1 {
            return Err(GeometryError::Unordered(le));
        }
        points[le_index] = [0.0, 0.0];
        let contour = Contour {
            points,
            le: le_index,
        };
        contour.check_order(area < 0.0, pts.len())?;
        contour.check_trailing_edge_is_sharper()?;
        Ok(contour)
    }

    /// x must fall from the trailing edge to the leading edge on the first surface and rise
    /// after it, apart from small wiggles (0.2 % of chord).
    fn check_order(&self, reversed: bool, n: usize) -> Result<(), GeometryError> {
        let report = |i: usize| if reversed { n - 1 - i } else { i };
        let wiggle = 2e-3;
        let mut lowest = f64::INFINITY;
        for i in 0..=self.le {
            let x = self.points[i][0];
            if x > lowest + wiggle {
                return Err(GeometryError::Unordered(report(i)));
            }
            lowest = lowest.min(x);
        }
        let mut highest = f64::NEG_INFINITY;
        for i in self.le..self.points.len() {
            let x = self.points[i][0];
            if x < highest - wiggle {
                return Err(GeometryError::Unordered(report(i)));
            }
            highest = highest.max(x);
        }
        Ok(())
    }

    /// The end taken as the trailing edge must be the thinner end: compare the thickness at
    /// 8 % of chord from each end.
    fn check_trailing_edge_is_sharper(&self) -> Result<(), GeometryError> {
        let near_te = self.thickness_at(0.92);
        let near_le = self.thickness_at(0.08);
        if near_te > near_le * 1.05 + 1e-9 {
            return Err(GeometryError::StartsAtLeadingEdge);
        }
        Ok(())
    }

    fn thickness_at(&self, x: f64) -> f64 {
        let (upper, lower) = self.surfaces();
        interp_y(&upper, x) - interp_y(&lower, x)
    }

    /// The normalised points.
    pub fn points(&self) -> &[[f64; 2]] {
        &self.points
    }

    /// Index of the leading edge.
    pub fn leading_edge_index(&self) -> usize {
        self.le
    }

    /// Gap between the two trailing-edge points, fraction of chord (0 for a sharp edge).
    pub fn trailing_edge_gap(&self) -> f64 {
        dist(self.points[0], self.points[self.points.len() - 1])
    }

    /// Upper and lower surfaces, each from the leading edge to the trailing edge.
    pub fn surfaces(&self) -> (Vec<[f64; 2]>, Vec<[f64; 2]>) {
        let mut upper = self.points[..=self.le].to_vec();
        upper.reverse();
        let lower = self.points[self.le..].to_vec();
        (upper, lower)
    }

    /// Mean line (midpoints of the surfaces at equal x/c) at `n` cosine-spaced stations
    /// from 0 to 1, with z = 0 at both ends of the chord line.
    pub fn mean_line(&self, n: usize) -> Vec<[f64; 2]> {
        let n = n.max(3);
        let (upper, lower) = self.surfaces();
        (0..n)
            .map(|i| {
                let x = 0.5 * (1.0 - (PI * i as f64 / (n - 1) as f64).cos());
                let z = 0.5 * (interp_y(&upper, x) + interp_y(&lower, x));
                [x, z]
            })
            .collect()
    }

    /// Greatest thickness, fraction of chord, normal to the chord line (sampled at 400
    /// stations).
    pub fn thickness_ratio(&self) -> f64 {
        (1..400)
            .map(|i| self.thickness_at(0.5 * (1.0 - (PI * i as f64 / 400.0).cos())))
            .fold(0.0, f64::max)
    }

    /// Nodes of `panels` panels, `panels / 2` on each surface, at the same stations on both
    /// surfaces (a blend of cosine spacings, see [`FULL_COSINE_WEIGHT`]), in the contour's order (trailing
    /// edge -> upper -> leading edge -> lower -> trailing edge). An odd count is raised by one.
    /// Sharing the stations keeps the straight panels of the two surfaces from crossing where
    /// the section is thinner than a panel's sag (a cambered cusp). Returns the nodes, one more
    /// than the panels.
    pub fn repanel(&self, panels: usize) -> Result<Vec<[f64; 2]>, GeometryError> {
        if !(MIN_PANELS..=MAX_PANELS).contains(&panels) {
            return Err(GeometryError::PanelCount(panels));
        }
        let per_surface = panels.div_ceil(2);
        let mut s = vec![0.0; self.points.len()];
        for i in 1..self.points.len() {
            s[i] = s[i - 1] + dist(self.points[i - 1], self.points[i]);
        }
        let xs: Vec<f64> = self.points.iter().map(|p| p[0]).collect();
        let ys: Vec<f64> = self.points.iter().map(|p| p[1]).collect();
        let sx = Spline::new(&s, &xs);
        let sy = Spline::new(&s, &ys);
        let (s_le, s_end) = (s[self.le], s[s.len() - 1]);
        let stations = |x_te: f64| -> Vec<f64> {
            (0..=per_surface)
                .map(|i| {
                    let u = i as f64 / per_surface as f64;
                    let full = 0.5 * (1.0 - (PI * u).cos());
                    let half = 1.0 - (0.5 * PI * u).cos();
                    x_te * (FULL_COSINE_WEIGHT * full + (1.0 - FULL_COSINE_WEIGHT) * half)
                })
                .collect()
        };
        // Arc length on [lo, hi] where the spline's x equals `x` (x monotone there): first the
        // pair of data points that brackets x, then bisection between them.
        let find = |x: f64, lo: f64, hi: f64, rising: bool| -> f64 {
            let (k_lo, k_hi) = (
                s.partition_point(|&t| t < lo),
                s.partition_point(|&t| t <= hi),
            );
            let (mut a, mut b) = (lo, hi);
            for k in k_lo..k_hi.min(s.len()) {
                if (xs[k] < x) == rising {
                    a = a.max(s[k]);
                } else {
                    b = b.min(s[k]);
                    break;
                }
            }
            if a >= b {
                (a, b) = (lo, hi);
            }
            for _ in 0..45 {
                let m = 0.5 * (a + b);
                if (sx.eval(m) < x) == rising {
                    a = m;
                } else {
                    b = m;
                }
            }
            0.5 * (a + b)
        };
        let mut nodes = Vec::with_capacity(2 * per_surface + 1);
        let x_te_upper = self.points[0][0];
        for &x in stations(x_te_upper).iter().rev() {
            let si = if x >= x_te_upper {
                0.0
            } else if x <= 0.0 {
                s_le
            } else {
                find(x, 0.0, s_le, false)
            };
            nodes.push(si);
        }
        let x_te_lower = self.points[self.points.len() - 1][0];
        for &x in stations(x_te_lower).iter().skip(1) {
            let si = if x >= x_te_lower {
                s_end
            } else {
                find(x, s_le, s_end, true)
            };
            nodes.push(si);
        }
        Ok(nodes
            .into_iter()
            .map(|si| [sx.eval(si), sy.eval(si)])
            .collect())
    }
}

/// y of a surface (x increasing from 0 to 1) at x, linear between points.
pub(crate) fn interp_y(surface: &[[f64; 2]], x: f64) -> f64 {
    let k = surface
        .partition_point(|p| p[0] < x)
        .clamp(1, surface.len() - 1);
    let (p, q) = (surface[k - 1], surface[k]);
    if q[0] > p[0] {
        p[1] + (q[1] - p[1]) * (x - p[0]) / (q[0] - p[0])
    } else {
        q[1]
    }
}

/// The raw points checked (finite, enough of them, not all one point, no repeats, no
/// self-crossing) with the length tolerance of the check, and whether a repeated first point
/// closes the loop at a sharp trailing edge (the last point is then made exactly the first).
fn checked_points(raw: &[[f64; 2]]) -> Result<(Vec<[f64; 2]>, bool, f64), GeometryError> {
    if let Some(i) = raw
        .iter()
        .position(|p| !p[0].is_finite() || !p[1].is_finite())
    {
        return Err(GeometryError::NotFinite(i));
    }
    if raw.len() < MIN_POINTS {
        return Err(GeometryError::TooFewPoints(raw.len()));
    }
    let scale = raw
        .iter()
        .flat_map(|p| raw.iter().take(1).map(move |q| dist(*p, *q)))
        .fold(0.0, f64::max);
    if scale <= 0.0 {
        return Err(GeometryError::Degenerate);
    }
    let tol = 1e-9 * scale;
    let mut pts: Vec<[f64; 2]> = raw.to_vec();
    // A repeated trailing-edge point closes the loop (sharp trailing edge).
    let closed = dist(pts[0], pts[pts.len() - 1]) <= tol;
    if closed {
        let n = pts.len();
        pts[n - 1] = pts[0];
    }
    for i in 0..pts.len() - 1 {
        if dist(pts[i], pts[i + 1]) <= tol {
            return Err(GeometryError::Duplicate(i));
        }
    }
    check_self_crossing(&pts, closed, tol)?;
    Ok((pts, closed, tol))
}

/// An open loop's trailing edge: when the gap between the end points runs more along the
/// chord than across it (a trailing-edge point given once), the loop is closed on the end
/// further aft by repeating it at the other end; a blunt gap is left open (its midpoint is
/// the trailing edge). Returns how many points were put in front of the raw ones (0 or 1).
fn close_at_trailing_edge(pts: &mut Vec<[f64; 2]>) -> usize {
    let first = pts[0];
    let last = pts[pts.len() - 1];
    let mid = [0.5 * (first[0] + last[0]), 0.5 * (first[1] + last[1])];
    let le = farthest_from(pts, mid);
    let dir = unit(sub(mid, pts[le]));
    let gap = sub(last, first);
    let along = dot(gap, dir);
    let across = cross(dir, gap);
    if along.abs() <= across.abs() {
        return 0;
    }
    if along < 0.0 {
        // The first point is further aft: the loop closes on it.
        pts.push(first);
        0
    } else {
        pts.insert(0, last);
        1
    }
}

#[cfg(test)]
mod tests;
