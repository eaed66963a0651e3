//! Where the top view's MAC label goes: outside every outline (wing, stabiliser, fuselage),
//! ahead of the MAC's leading edge if there is room, else behind its trailing edge, so it
//! never covers the planform.

/// A label's box on the page: left, bottom, width, height, mm.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(super) struct LabelBox {
    pub x: f64,
    pub y: f64,
    pub w: f64,
    pub h: f64,
}

impl LabelBox {
    fn contains(&self, p: (f64, f64)) -> bool {
        p.0 >= self.x && p.0 <= self.x + self.w && p.1 >= self.y && p.1 <= self.y + self.h
    }

    fn corners(&self) -> [(f64, f64); 4] {
        [
            (self.x, self.y),
            (self.x + self.w, self.y),
            (self.x + self.w, self.y + self.h),
            (self.x, self.y + self.h),
        ]
    }

    /// True when the box and the closed polygon `outline` (page mm) share any point.
    fn overlaps(&self, outline: &[(f64, f64)]) -> bool {
        let corners = self.corners();
        let edges = |pts: &[(f64, f64)]| -> Vec<((f64, f64), (f64, f64))> {
            (0..pts.len())
                .map(|i| (pts[i], pts[(i + 1) % pts.len()]))
                .collect()
        };
        outline.iter().any(|&p| self.contains(p))
            || corners.iter().any(|&p| inside(p, outline))
            || edges(outline)
                .iter()
                .any(|&e| edges(&corners).iter().any(|&f| crosses(e, f)))
    }
}

/// Even-odd rule: `p` inside the closed polygon `outline`.
fn inside(p: (f64, f64), outline: &[(f64, f64)]) -> bool {
    let n = outline.len();
    let mut odd = false;
    for i in 0..n {
        let (a, b) = (outline[i], outline[(i + n - 1) % n]);
        if (a.1 > p.1) != (b.1 > p.1) && p.0 < a.0 + (p.1 - a.1) * (b.0 - a.0) / (b.1 - a.1) {
            odd = !odd;
        }
    }
    odd
}

/// True when the segments `e` and `f` cross or touch.
#[allow(clippy::float_cmp)] // exactly on one line: the collinear case
fn crosses(e: ((f64, f64), (f64, f64)), f: ((f64, f64), (f64, f64))) -> bool {
    let side = |a: (f64, f64), b: (f64, f64), p: (f64, f64)| {
        (b.0 - a.0) * (p.1 - a.1) - (b.1 - a.1) * (p.0 - a.0)
    };
    let (d1, d2) = (side(f.0, f.1, e.0), side(f.0, f.1, e.1));
    let (d3, d4) = (side(e.0, e.1, f.0), side(e.0, e.1, f.1));
    if d1 == 0.0 && d2 == 0.0 {
        // On one line: they meet only where their extents overlap.
        let apart = |a: f64, b: f64, c: f64, d: f64| a.max(b) < c.min(d) || c.max(d) < a.min(b);
        return !(apart(e.0 .0, e.1 .0, f.0 .0, f.1 .0) || apart(e.0 .1, e.1 .1, f.0 .1, f.1 .1));
    }
    d1 * d2 <= 0.0 && d3 * d4 <= 0.0
}

/// The box of a label `w` by `h` mm for the MAC drawn from `le` (its leading edge, page mm)
/// to `te` (its trailing edge, below it on the page): the first of ahead of the leading edge,
/// behind the trailing edge, and those two shifted outboard, that overlaps none of
/// `outlines`; ahead of the leading edge when none is clear.
pub(super) fn place(
    le: (f64, f64),
    te: (f64, f64),
    (w, h): (f64, f64),
    outlines: &[Vec<(f64, f64)>],
) -> LabelBox {
    /// Paper between the MAC's end and the label, mm.
    const CLEAR_MM: f64 = 1.5;
    let ahead = LabelBox {
        x: le.0 - 0.5 * w,
        y: le.1 + CLEAR_MM,
        w,
        h,
    };
    let behind = LabelBox {
        x: te.0 - 0.5 * w,
        y: te.1 - CLEAR_MM - h,
        w,
        h,
    };
    let outboard = |b: LabelBox| LabelBox {
        x: b.x + 0.5 * w,
        ..b
    };
    [ahead, behind, outboard(ahead), outboard(behind)]
        .into_iter()
        .find(|b| !outlines.iter().any(|o| b.overlaps(o)))
        .unwrap_or(ahead)
}

#[cfg(test)]
mod tests {
    use super::*;

    // A rectangle wing 100 mm wide and 20 mm deep centred on the page origin, the MAC from
    // (25, 10) to (25, -10): the label goes above the leading edge, clear of the outline.
    #[test]
    fn label_goes_ahead_of_a_plain_wing() {
        let wing = vec![(-50.0, 10.0), (50.0, 10.0), (50.0, -10.0), (-50.0, -10.0)];
        let b = place(
            (25.0, 10.0),
            (25.0, -10.0),
            (12.0, 3.0),
            std::slice::from_ref(&wing),
        );
        assert!(!b.overlaps(&wing));
        assert!(b.y > 10.0);
    }

    // A canard just ahead of the wing takes the room ahead: the label goes behind the
    // trailing edge.
    #[test]
    fn label_goes_behind_when_the_room_ahead_is_taken() {
        let wing = vec![(-50.0, 10.0), (50.0, 10.0), (50.0, -10.0), (-50.0, -10.0)];
        let canard = vec![(-40.0, 20.0), (40.0, 20.0), (40.0, 11.0), (-40.0, 11.0)];
        let b = place(
            (25.0, 10.0),
            (25.0, -10.0),
            (12.0, 3.0),
            &[wing.clone(), canard.clone()],
        );
        assert!(!b.overlaps(&wing) && !b.overlaps(&canard));
        assert!(b.y + b.h < -10.0);
    }

    #[test]
    fn overlap_is_found_inside_and_across() {
        let square = vec![(0.0, 0.0), (10.0, 0.0), (10.0, 10.0), (0.0, 10.0)];
        let within = LabelBox {
            x: 2.0,
            y: 2.0,
            w: 2.0,
            h: 2.0,
        };
        let across = LabelBox {
            x: 8.0,
            y: -1.0,
            w: 5.0,
            h: 2.0,
        };
        let apart = LabelBox {
            x: 11.0,
            y: 0.0,
            w: 2.0,
            h: 2.0,
        };
        assert!(within.overlaps(&square));
        assert!(across.overlaps(&square));
        assert!(!apart.overlaps(&square));
    }
}
