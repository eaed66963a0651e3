//! Checks of the contour code: normalising, closing the loop, re-panelling, the spline.

use super::*;
use approx::assert_relative_eq;

/// A symmetric test shape: NACA-like thickness, 41 points per surface.
fn ellipse_like(n: usize) -> Vec<[f64; 2]> {
    let mut v = Vec::new();
    for i in 0..=2 * n {
        let th = PI * i as f64 / n as f64;
        let x = 0.5 * (1.0 + th.cos());
        let y = 0.6 * (x.sqrt() - x) * th.sin().signum();
        v.push([x, y]);
    }
    v
}

#[test]
fn normalises_scaled_rotated_and_reversed_loops_alike() {
    let base = ellipse_like(40);
    let c0 = Contour::new(&base).unwrap();
    let turned: Vec<[f64; 2]> = base
        .iter()
        .rev()
        .map(|p| {
            let (s, c) = 0.3f64.sin_cos();
            [
                3.0 + 2.0 * (c * p[0] - s * p[1]),
                -1.0 + 2.0 * (s * p[0] + c * p[1]),
            ]
        })
        .collect();
    let c1 = Contour::new(&turned).unwrap();
    assert_eq!(c0.points().len(), c1.points().len());
    for (p, q) in c0.points().iter().zip(c1.points()) {
        assert_relative_eq!(p[0], q[0], epsilon = 1e-12);
        assert_relative_eq!(p[1], q[1], epsilon = 1e-12);
    }
    assert!(c0.points()[5][1] > 0.0, "upper surface first");
}

#[test]
fn trailing_edge_given_once_closes_the_loop() {
    let mut pts = ellipse_like(40);
    pts.pop();
    let c = Contour::new(&pts).unwrap();
    assert_relative_eq!(c.trailing_edge_gap(), 0.0, epsilon = 1e-15);
    assert_eq!(c.points().len(), 81);
}

#[test]
fn repanel_keeps_edges_and_count() {
    let c = Contour::new(&ellipse_like(40)).unwrap();
    let nodes = c.repanel(61).unwrap();
    assert_eq!(nodes.len(), 63);
    assert_relative_eq!(nodes[0][0], 1.0, epsilon = 1e-12);
    assert_relative_eq!(nodes[31][0], 0.0, epsilon = 1e-12);
    assert_relative_eq!(nodes[62][0], 1.0, epsilon = 1e-12);
    // Both surfaces share their stations.
    assert_relative_eq!(nodes[10][0], nodes[52][0], epsilon = 1e-9);
    assert!(c.repanel(3).is_err());
}

#[test]
fn spline_reproduces_a_cubic_inside() {
    // A natural spline is exact for straight lines.
    let t: Vec<f64> = (0..10).map(|i| i as f64 * 0.3).collect();
    let v: Vec<f64> = t.iter().map(|x| 2.0 * x - 1.0).collect();
    let s = Spline::new(&t, &v);
    assert_relative_eq!(s.eval(1.37), 2.0 * 1.37 - 1.0, epsilon = 1e-12);
}
