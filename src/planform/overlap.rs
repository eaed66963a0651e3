//! Where two surfaces overlap in the top view, and their vertical gap there (the check that
//! surfaces do not intersect), sampled along each half-span.

use super::*;

/// Where two surfaces overlap in the top view: at the spanwise position `y_m` their chords
/// share some x, and there they are `gap_m` apart vertically; `chord_m` is the shorter of
/// the two chords there.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlanOverlap {
    /// Spanwise position, m.
    pub y_m: f64,
    /// Vertical distance between the two surfaces' chord lines there, m.
    pub gap_m: f64,
    /// The shorter chord there, m.
    pub chord_m: f64,
}

/// The point where `a` and `b` overlap in the top view with the smallest vertical gap
/// relative to the chord, or `None` when one lies wholly ahead of or behind the other at
/// every spanwise position both reach. Sampled at 200 stations along each half-span.
pub fn plan_overlap(a: &Surface, b: &Surface) -> Option<PlanOverlap> {
    const SAMPLES: usize = 200;
    let sample = |s: &Surface| -> Vec<SpanStation> {
        let total = half_span_length_m(s);
        stations_at(s, (0..=SAMPLES).map(|k| total * k as f64 / SAMPLES as f64))
    };
    // Linear interpolation of (x_le, chord, z) at y along stations sorted by y, in the first
    // window holding y. The search starts at `from`, the window found for the last (smaller)
    // y: where the stations' y never decrease, no window before it can hold a larger y, so
    // the window is the same as a search from the root finds (elsewhere `from` stays 0).
    let at = |st: &[SpanStation], y: f64, from: &mut Option<usize>| -> Option<(f64, f64, f64)> {
        let start = from.unwrap_or(0);
        let i = start
            + st[start..]
                .windows(2)
                .position(|w| w[0].y_m <= y && y <= w[1].y_m)?;
        if let Some(f) = from {
            *f = i;
        }
        let (p, q) = (&st[i], &st[i + 1]);
        let t = if q.y_m > p.y_m {
            (y - p.y_m) / (q.y_m - p.y_m)
        } else {
            0.0
        };
        let lerp = |u: f64, v: f64| u + (v - u) * t;
        Some((
            lerp(p.x_le_m, q.x_le_m),
            lerp(p.chord_m, q.chord_m),
            lerp(p.z_m, q.z_m),
        ))
    };
    let (sa, sb) = (sample(a), sample(b));
    let y_max = sa.last()?.y_m.min(sb.last()?.y_m);
    let mut best: Option<PlanOverlap> = None;
    let sorted = |st: &[SpanStation]| st.windows(2).all(|w| w[0].y_m <= w[1].y_m);
    let (mut from_a, mut from_b) = (sorted(&sa).then_some(0), sorted(&sb).then_some(0));
    for k in 0..=SAMPLES {
        let y = y_max * k as f64 / SAMPLES as f64;
        let (Some((xa, ca, za)), Some((xb, cb, zb))) =
            (at(&sa, y, &mut from_a), at(&sb, y, &mut from_b))
        else {
            continue;
        };
        let overlaps = xa < xb + cb && xb < xa + ca;
        let chord_m = ca.min(cb);
        if overlaps && chord_m > 0.0 {
            let candidate = PlanOverlap {
                y_m: y,
                gap_m: (za - zb).abs(),
                chord_m,
            };
            if best.is_none_or(|o| candidate.gap_m / chord_m < o.gap_m / o.chord_m) {
                best = Some(candidate);
            }
        }
    }
    best
}
