//! The top view's leader labels: the balance marks' positions in a column at the left, as
//! many as fit, spread apart so none overlap, each joined to its mark.

use super::{Layout, Mark, Placement, CAPTION, LABEL_BOLD};
use crate::output::pdf::canvas::{Align, Canvas, Pen};
use crate::output::pdf::chart::Frame;

/// The marks that fit `capacity` label lines. On a view too short for all of them, the least
/// needed go first: the root leading edge (always 0), then the target, then the band's ends
/// (the balance box prints the band in figures), then the neutral point.
fn marks_that_fit(mut marks: Vec<Mark>, capacity: usize) -> Vec<Mark> {
    if marks.len() > capacity {
        marks.retain(|m| !m.is_root);
    }
    if marks.len() > capacity {
        marks.retain(|m| !m.text.starts_with("target"));
    }
    if marks.len() > capacity {
        marks.retain(|m| !m.text.starts_with("forward limit") && !m.text.starts_with("aft limit"));
    }
    if marks.len() > capacity {
        // Room for one label only: the CG.
        marks.retain(|m| m.text.starts_with("CG "));
    }
    marks
}

/// The label heights (page mm) for marks wanted at `ideal`, one line `gap` apart, in order,
/// between `floor` and the area's `top_limit`.
fn spread_labels(ideal: &[f64], gap: f64, floor: f64, top_limit: f64) -> Vec<f64> {
    let mut placed = ideal.to_vec();
    if let Some(p0) = placed.first_mut() {
        *p0 = p0.min(top_limit);
    }
    for i in 1..placed.len() {
        placed[i] = placed[i].min(placed[i - 1] - gap);
    }
    if let Some(&last) = placed.last() {
        if last < floor {
            let lift = floor - last;
            for p in &mut placed {
                *p += lift;
            }
        }
    }
    // On a short view the lifted stack can reach above the view; then spread the labels evenly
    // between the floor and the top instead (closer together, still in order).
    if placed.first().is_some_and(|&p| p > top_limit) && placed.len() > 1 {
        let step = (top_limit - floor) / (placed.len() - 1) as f64;
        for (i, p) in placed.iter_mut().enumerate() {
            *p = top_limit - step * i as f64;
        }
    }
    placed
}

/// Leader labels in the column at the left, spread apart vertically so none overlap, each
/// joined to its mark (`w_mark` mm each side of the centre line).
pub(super) fn leader_labels(
    c: &mut Canvas,
    area: Frame,
    l: &Layout,
    marks: Vec<Mark>,
    place: Placement,
    w_mark: f64,
) {
    let gap = LABEL_BOLD.line_height_mm();
    let capacity = ((area.top() - CAPTION.line_height_mm() - gap - (area.y + l.caption_h)) / gap)
        .floor()
        .max(0.0) as usize
        + 1;
    let floor = area.y + l.caption_h;
    let top_limit = area.top() - CAPTION.line_height_mm() - gap;
    // Not even one label and its heading fit beside a view this short: none (the balance
    // box prints the figures).
    let marks = if top_limit < floor {
        Vec::new()
    } else {
        marks_that_fit(marks, capacity)
    };
    let ideal: Vec<f64> = marks.iter().map(|mk| place.page((mk.x_m, 0.0)).1).collect();
    let placed = spread_labels(&ideal, gap, floor, top_limit);
    let col_right = area.x + l.label_w;
    if let Some(&first) = placed.first() {
        c.text_grey(
            col_right,
            first + gap,
            "mm aft of root LE",
            CAPTION,
            Align::Right,
            0.3,
        );
    }
    let port_end = place.cx - w_mark;
    for ((mk, &y_ideal), &y_label) in marks.iter().zip(&ideal).zip(&placed) {
        // The root leading edge is a point on the centre line; the others are mark lines.
        let end = if mk.is_root { place.cx } else { port_end };
        c.text(
            col_right,
            y_label - 0.5 * mk.font.cap_height_mm(),
            &mk.text,
            mk.font,
            Align::Right,
        );
        let leader = Pen::solid(0.3).with_grey(0.2);
        c.polyline(
            &[
                (col_right + 0.8, y_label),
                (col_right + 2.5, y_label),
                (end - 2.0, y_ideal),
                (end, y_ideal),
            ],
            leader,
        );
    }
}
