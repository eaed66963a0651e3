//! The natural cubic spline through a contour's points in their cumulative chord length
//! (de Boor, C. (2001). A Practical Guide to Splines, rev. ed., Springer: cubic spline
//! interpolation, natural end conditions), and the leading edge found on it.

use super::*;

/// Moves the leading edge from the data point `le` to the point of the spline through the
/// data that is farthest from `te` (golden-section search between the neighbours of `le`),
/// replacing the data point when the two nearly coincide and inserting it otherwise. Returns
/// the new index of the leading edge.
pub(super) fn refine_leading_edge(
    pts: &mut Vec<[f64; 2]>,
    le: usize,
    te: [f64; 2],
    tol: f64,
) -> usize {
    let mut s = vec![0.0; pts.len()];
    for i in 1..pts.len() {
        s[i] = s[i - 1] + dist(pts[i - 1], pts[i]);
    }
    let xs: Vec<f64> = pts.iter().map(|p| p[0]).collect();
    let ys: Vec<f64> = pts.iter().map(|p| p[1]).collect();
    let (sx, sy) = (Spline::new(&s, &xs), Spline::new(&s, &ys));
    let at = |t: f64| [sx.eval(t), sy.eval(t)];
    let (mut lo, mut hi) = (s[le - 1], s[le + 1]);
    let g = 0.5 * (5f64.sqrt() - 1.0);
    for _ in 0..100 {
        let m1 = hi - g * (hi - lo);
        let m2 = lo + g * (hi - lo);
        if dist(at(m1), te) > dist(at(m2), te) {
            hi = m2;
        } else {
            lo = m1;
        }
    }
    let t = 0.5 * (lo + hi);
    let p = at(t);
    if !(p[0].is_finite() && p[1].is_finite()) || dist(p, te) <= dist(pts[le], te) {
        return le;
    }
    let spacing = (s[le + 1] - s[le]).min(s[le] - s[le - 1]);
    if (t - s[le]).abs() < 0.05 * spacing || dist(p, pts[le]) <= tol {
        pts[le] = p;
        le
    } else if t < s[le] {
        pts.insert(le, p);
        le
    } else {
        pts.insert(le + 1, p);
        le + 1
    }
}

/// Natural cubic spline through (t_i, v_i), t strictly increasing.
pub(super) struct Spline {
    t: Vec<f64>,
    v: Vec<f64>,
    /// Second derivatives at the knots.
    m: Vec<f64>,
}

impl Spline {
    pub(super) fn new(t: &[f64], v: &[f64]) -> Spline {
        let n = t.len();
        let mut m = vec![0.0; n];
        if n > 2 {
            // Tridiagonal system for interior second derivatives (Thomas algorithm).
            let mut c_prime = vec![0.0; n];
            let mut d_prime = vec![0.0; n];
            for i in 1..n - 1 {
                let h0 = t[i] - t[i - 1];
                let h1 = t[i + 1] - t[i];
                let a = h0 / 6.0;
                let b = (h0 + h1) / 3.0;
                let c = h1 / 6.0;
                let d = (v[i + 1] - v[i]) / h1 - (v[i] - v[i - 1]) / h0;
                let denom = b - a * c_prime[i - 1];
                c_prime[i] = c / denom;
                d_prime[i] = (d - a * d_prime[i - 1]) / denom;
            }
            for i in (1..n - 1).rev() {
                m[i] = d_prime[i] - c_prime[i] * m[i + 1];
            }
        }
        Spline {
            t: t.to_vec(),
            v: v.to_vec(),
            m,
        }
    }

    pub(super) fn eval(&self, x: f64) -> f64 {
        let n = self.t.len();
        let k = self.t.partition_point(|&ti| ti <= x).clamp(1, n - 1);
        let (t0, t1) = (self.t[k - 1], self.t[k]);
        let h = t1 - t0;
        let a = (t1 - x) / h;
        let b = (x - t0) / h;
        a * self.v[k - 1]
            + b * self.v[k]
            + ((a * a * a - a) * self.m[k - 1] + (b * b * b - b) * self.m[k]) * h * h / 6.0
    }
}
