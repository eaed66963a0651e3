//! Points in the plane: the vector arithmetic of the contour code, the farthest point and
//! the test that a contour does not cross itself.

use super::*;

/// Sort-and-sweep along x: only segments whose x-ranges overlap are compared, so an airfoil
/// (whose segments overlap in x only with the few on the other surface) costs O(n log n);
/// the reader's point limit bounds the worst case. Returns the first crossing pair (i, j)
/// in index order, as comparing every pair would.
pub(super) fn check_self_crossing(
    pts: &[[f64; 2]],
    closed: bool,
    tol: f64,
) -> Result<(), GeometryError> {
    // Segments i: pts[i] -> pts[i+1]; in a closed loop the first and last share a point.
    let segs = pts.len() - 1;
    let lo = |i: usize| pts[i][0].min(pts[i + 1][0]) - tol;
    let hi = |i: usize| pts[i][0].max(pts[i + 1][0]) + tol;
    let mut order: Vec<usize> = (0..segs).collect();
    order.sort_by(|&a, &b| lo(a).total_cmp(&lo(b)));
    let mut first: Option<(usize, usize)> = None;
    for (k, &i) in order.iter().enumerate() {
        let hi_i = hi(i);
        for &j in &order[k + 1..] {
            if lo(j) > hi_i {
                break;
            }
            let (a, b) = (i.min(j), i.max(j));
            let adjacent = b == a + 1 || (closed && a == 0 && b == segs - 1);
            if adjacent || first.is_some_and(|f| f <= (a, b)) {
                continue;
            }
            if segments_intersect(pts[a], pts[a + 1], pts[b], pts[b + 1], tol) {
                first = Some((a, b));
            }
        }
    }
    match first {
        Some((i, j)) => Err(GeometryError::SelfCrossing(i, j)),
        None => Ok(()),
    }
}

pub(super) fn segments_intersect(
    a: [f64; 2],
    b: [f64; 2],
    c: [f64; 2],
    d: [f64; 2],
    tol: f64,
) -> bool {
    // Bounding boxes first.
    if a[0].max(b[0]) < c[0].min(d[0]) - tol
        || c[0].max(d[0]) < a[0].min(b[0]) - tol
        || a[1].max(b[1]) < c[1].min(d[1]) - tol
        || c[1].max(d[1]) < a[1].min(b[1]) - tol
    {
        return false;
    }
    let d1 = cross(sub(b, a), sub(c, a));
    let d2 = cross(sub(b, a), sub(d, a));
    let d3 = cross(sub(d, c), sub(a, c));
    let d4 = cross(sub(d, c), sub(b, c));
    (d1 * d2 < 0.0) && (d3 * d4 < 0.0)
}

pub(super) fn farthest_from(pts: &[[f64; 2]], p: [f64; 2]) -> usize {
    let mut best = 0;
    let mut best_d = -1.0;
    for (i, q) in pts.iter().enumerate() {
        let d = dist(*q, p);
        if d > best_d {
            best_d = d;
            best = i;
        }
    }
    best
}

pub(super) fn sub(a: [f64; 2], b: [f64; 2]) -> [f64; 2] {
    [a[0] - b[0], a[1] - b[1]]
}

pub(super) fn dot(a: [f64; 2], b: [f64; 2]) -> f64 {
    a[0] * b[0] + a[1] * b[1]
}

pub(super) fn cross(a: [f64; 2], b: [f64; 2]) -> f64 {
    a[0] * b[1] - a[1] * b[0]
}

pub(super) fn dist(a: [f64; 2], b: [f64; 2]) -> f64 {
    (a[0] - b[0]).hypot(a[1] - b[1])
}

pub(super) fn unit(a: [f64; 2]) -> [f64; 2] {
    let l = a[0].hypot(a[1]);
    [a[0] / l, a[1] / l]
}
