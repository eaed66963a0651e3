//! The one-page comparison of setups: the key figures side by side with their differences from
//! the first column, the CG of each setup drawn against its recommended band and neutral point
//! on a common scale, the warnings of each setup, and the standing safety caution.

use super::canvas::{Align, Canvas, Font, Marker, Pen};
use super::chart::Axis;
use super::metrics::{self, Face};
use super::Paper;
use crate::caution::Level;
use crate::output::cautions::SAFETY_MESSAGE;

const MARGIN: f64 = 10.0;
const GAP: f64 = 5.0;
const TITLE: Font = Font::bold(14.0);
const HEAD: Font = Font::bold(8.0);
const BODY: Font = Font::regular(7.0);
const BODY_BOLD: Font = Font::bold(7.0);
const SMALL: Font = Font::regular(6.0);

/// Most configurations that fit side by side on a portrait page.
pub const MAX_COLUMNS: usize = 6;

/// Balance positions of one configuration, mm aft of its wing root leading edge.
#[derive(Debug, Clone, PartialEq)]
pub struct CgRow {
    /// Configuration name.
    pub name: String,
    /// Recommended band, forward and aft ends.
    pub band_mm: (f64, f64),
    /// Neutral point.
    pub neutral_point_mm: f64,
    /// Centre of gravity.
    pub cg_mm: f64,
}

/// Everything the comparison page shows, as plain data.
#[derive(Debug, Clone, PartialEq)]
pub struct CompareData {
    /// Date printed in the title block.
    pub date: String,
    /// Tool version.
    pub tool_version: String,
    /// Input files, in order.
    pub sources: Vec<String>,
    /// Column headings (configuration names).
    pub names: Vec<String>,
    /// Rows: label, then one cell per configuration.
    pub rows: Vec<(String, Vec<String>)>,
    /// Balance positions per configuration.
    pub cg: Vec<CgRow>,
    /// Warnings and dangers per configuration: (name, codes with their level).
    pub cautions: Vec<(String, Vec<(Level, String)>)>,
}

/// Draw the comparison page.
pub fn draw(d: &CompareData, paper: Paper) -> Canvas {
    let (pw, ph) = paper.size_mm();
    let mut c = Canvas::new();
    let x0 = MARGIN;
    let w = pw - 2.0 * MARGIN;
    let mut y = ph - MARGIN - TITLE.cap_height_mm();
    y = title_block(&mut c, d, x0, y, w);
    y = key_figures_table(&mut c, d, x0, y, w);

    // CG against band and neutral point, one row per configuration.
    y = cg_chart(&mut c, d, x0, y, w);
    y -= GAP;
    y = cautions_list(&mut c, d, x0, y, w);
    safety_box(&mut c, x0, y, w);
    c
}

/// The title block: title, date and version, the input files; returns the baseline below it.
fn title_block(c: &mut Canvas, d: &CompareData, x0: f64, top: f64, w: f64) -> f64 {
    let mut y = top;
    c.text(x0, y, "Setup comparison", TITLE, Align::Left);
    let info = [
        format!("Comparison, {}", d.date),
        format!("trimline {}", d.tool_version),
    ];
    let mut yi = y + 1.0;
    for l in &info {
        c.text(x0 + w, yi, l, SMALL, Align::Right);
        yi -= SMALL.line_height_mm();
    }
    y -= TITLE.line_height_mm();
    let sources = format!("Input: {}", d.sources.join(", "));
    for line in metrics::wrap(&sources, Face::Regular, SMALL.size_pt, w) {
        c.text(x0, y, &line, SMALL, Align::Left);
        y -= SMALL.line_height_mm();
    }
    y -= GAP;
    y
}

/// The key-figures table with its footnote; returns the baseline below it.
fn key_figures_table(c: &mut Canvas, d: &CompareData, x0: f64, top: f64, w: f64) -> f64 {
    let mut y = top;
    let n = d.names.len().max(1);
    let label_w = 52.0;
    let col_w = (w - label_w) / n as f64;
    c.text(x0, y, "Key figures", HEAD, Align::Left);
    y -= HEAD.line_height_mm() + 1.0;
    let header_lines: Vec<Vec<String>> = d
        .names
        .iter()
        .map(|name| {
            let mut lines = metrics::wrap(name, Face::Bold, BODY_BOLD.size_pt, col_w - 2.0);
            lines.truncate(2);
            lines
                .into_iter()
                .map(|l| metrics::shorten(&l, Face::Bold, BODY_BOLD.size_pt, col_w - 2.0, false))
                .collect()
        })
        .collect();
    let header_h = header_lines.iter().map(Vec::len).max().unwrap_or(1) as f64;
    for (i, lines) in header_lines.iter().enumerate() {
        let xr = x0 + label_w + col_w * (i as f64 + 1.0) - 1.0;
        let mut yl = y;
        for l in lines {
            c.text(xr, yl, l, BODY_BOLD, Align::Right);
            yl -= BODY_BOLD.line_height_mm();
        }
    }
    y -= header_h * BODY_BOLD.line_height_mm() - 0.5;
    c.line((x0, y + 1.2), (x0 + w, y + 1.2), Pen::solid(0.6));
    y -= BODY.line_height_mm() - 0.6;
    for (k, (label, cells)) in d.rows.iter().enumerate() {
        if k % 2 == 1 {
            c.rect(x0, y - 1.2, w, BODY.line_height_mm(), Some(0.92), None);
        }
        c.text(x0 + 1.0, y, label, BODY, Align::Left);
        for (i, cell) in cells.iter().enumerate() {
            let text = metrics::shorten(cell, Face::Regular, BODY.size_pt, col_w - 2.0, false);
            let font = if i == 0 { BODY_BOLD } else { BODY };
            c.text(
                x0 + label_w + col_w * (i as f64 + 1.0) - 1.0,
                y,
                &text,
                font,
                Align::Right,
            );
        }
        y -= BODY.line_height_mm();
    }
    c.line((x0, y + 2.5), (x0 + w, y + 2.5), Pen::solid(0.6));
    y -= 1.0;
    c.text(
        x0,
        y,
        "Values in brackets are differences from the first column; (=) means no change; n/a: \
         does not exist (no trim, or no ballast bay that can reach the target).",
        SMALL,
        Align::Left,
    );
    y -= SMALL.line_height_mm() + GAP;
    y
}

/// The warnings and dangers raised per configuration; returns the baseline below them.
fn cautions_list(c: &mut Canvas, d: &CompareData, x0: f64, top: f64, w: f64) -> f64 {
    let mut y = top;
    c.text(x0, y, "Warnings and dangers raised", HEAD, Align::Left);
    y -= HEAD.line_height_mm() + 0.5;
    for (name, codes) in &d.cautions {
        let text = if codes.is_empty() {
            format!("{name}: none")
        } else {
            let list: Vec<String> = codes
                .iter()
                .map(|(level, code)| match level {
                    Level::Danger => format!("{code} (DANGER)"),
                    _ => code.clone(),
                })
                .collect();
            format!("{name}: {}", list.join(", "))
        };
        for line in metrics::wrap(&text, Face::Regular, BODY.size_pt, w) {
            c.text(x0, y, &line, BODY, Align::Left);
            y -= BODY.line_height_mm();
        }
    }
    c.text(
        x0,
        y,
        "Run trimline check on a file (with --setup NAME for a setup) for the full messages.",
        SMALL,
        Align::Left,
    );
    y -= SMALL.line_height_mm() + GAP;
    y
}

/// The standing safety caution, boxed, from the baseline `y`.
fn safety_box(c: &mut Canvas, x0: f64, y: f64, w: f64) {
    let lines = metrics::wrap(SAFETY_MESSAGE, Face::Bold, BODY_BOLD.size_pt, w - 4.0);
    let box_h = lines.len() as f64 * BODY_BOLD.line_height_mm() + 3.0;
    c.rect(x0, y - box_h + 3.0, w, box_h, None, Some(Pen::solid(0.8)));
    let mut yl = y;
    for l in &lines {
        c.text(x0 + 2.0, yl, l, BODY_BOLD, Align::Left);
        yl -= BODY_BOLD.line_height_mm();
    }
}

/// The CG chart; returns the baseline below it.
fn cg_chart(c: &mut Canvas, d: &CompareData, x0: f64, top: f64, w: f64) -> f64 {
    let mut y = top;
    c.text(
        x0,
        y,
        "CG against the recommended band and the neutral point (mm aft of the wing root leading edge)",
        HEAD,
        Align::Left,
    );
    y -= HEAD.line_height_mm() + 1.5;
    let finite = |v: f64| v.is_finite().then_some(v);
    let all: Vec<f64> =
        d.cg.iter()
            .flat_map(|r| [r.band_mm.0, r.band_mm.1, r.neutral_point_mm, r.cg_mm])
            .filter_map(finite)
            .collect();
    let lo = all.iter().copied().fold(f64::INFINITY, f64::min);
    let hi = all.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    let axis = Axis::nice(lo, hi, 8, "mm");
    let label_w = 52.0;
    let plot_x = x0 + label_w;
    let plot_w = w - label_w - 4.0;
    let to_x = |v: f64| plot_x + (v - axis.min) / (axis.max - axis.min) * plot_w;
    let row_h = 7.0;
    for r in &d.cg {
        let mid = y - 0.5 * row_h + 1.5;
        let name = metrics::shorten(&r.name, Face::Regular, BODY.size_pt, label_w - 2.0, false);
        c.text(x0 + 1.0, mid - 1.0, &name, BODY, Align::Left);
        c.line(
            (plot_x, mid),
            (plot_x + plot_w, mid),
            Pen::solid(0.3).with_grey(0.6),
        );
        if let (Some(a), Some(b)) = (finite(r.band_mm.0), finite(r.band_mm.1)) {
            let (xa, xb) = (to_x(a.min(b)), to_x(a.max(b)));
            c.hatch_rect(xa, mid - 1.8, xb - xa, 3.6, 0.9, Pen::solid(0.3));
            c.rect(xa, mid - 1.8, xb - xa, 3.6, None, Some(Pen::solid(0.5)));
        }
        if let Some(np) = finite(r.neutral_point_mm) {
            c.marker((to_x(np), mid), Marker::Triangle, 3.0, Pen::solid(0.7));
        }
        if let Some(cg) = finite(r.cg_mm) {
            c.cg_symbol((to_x(cg), mid), 1.6);
        }
        y -= row_h;
    }
    // Axis with ticks.
    let ya = y + 1.5;
    c.line((plot_x, ya), (plot_x + plot_w, ya), Pen::solid(0.5));
    for t in axis.ticks() {
        let xt = to_x(t);
        c.line((xt, ya), (xt, ya - 1.2), Pen::solid(0.4));
        c.text(xt, ya - 4.0, &axis.label(t), SMALL, Align::Centre);
    }
    y = ya - 4.0 - SMALL.line_height_mm();
    // Legend.
    let mut xl = plot_x;
    c.hatch_rect(xl, y - 0.5, 6.0, 2.6, 0.9, Pen::solid(0.3));
    c.rect(xl, y - 0.5, 6.0, 2.6, None, Some(Pen::solid(0.5)));
    xl += 7.5;
    c.text(xl, y, "recommended band", SMALL, Align::Left);
    xl += SMALL.width_mm("recommended band") + 5.0;
    c.marker((xl + 1.5, y + 0.8), Marker::Triangle, 3.0, Pen::solid(0.7));
    xl += 4.5;
    c.text(xl, y, "neutral point", SMALL, Align::Left);
    xl += SMALL.width_mm("neutral point") + 5.0;
    c.cg_symbol((xl + 1.5, y + 0.8), 1.6);
    xl += 4.5;
    c.text(xl, y, "CG; nose to the left", SMALL, Align::Left);
    y - SMALL.line_height_mm()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn sample(columns: usize) -> CompareData {
        CompareData {
            date: "2026-01-02".into(),
            tool_version: "0.1.0".into(),
            sources: vec!["a.toml".into()],
            names: (0..columns)
                .map(|i| format!("setup number {i} with a long name"))
                .collect(),
            rows: (0..16)
                .map(|r| {
                    (
                        format!("row {r}"),
                        (0..columns)
                            .map(|i| format!("{}.5 (+{i}.0)", 100 + r))
                            .collect(),
                    )
                })
                .collect(),
            cg: (0..columns)
                .map(|i| CgRow {
                    name: format!("setup {i}"),
                    band_mm: (60.0, 90.0),
                    neutral_point_mm: 100.0,
                    cg_mm: 70.0 + i as f64,
                })
                .collect(),
            cautions: (0..columns)
                .map(|i| {
                    (
                        format!("setup {i}"),
                        vec![(Level::Warning, "tip-stall".into())],
                    )
                })
                .collect(),
        }
    }

    /// No two pieces of text overlap and all text lies inside the margins, at the most
    /// columns the page takes, on both paper sizes.
    #[test]
    fn full_page_has_no_overlapping_text() {
        for paper in [Paper::A4, Paper::Letter] {
            let c = draw(&sample(MAX_COLUMNS), paper);
            let (w, h) = paper.size_mm();
            let boxes = c.text_boxes();
            for (i, a) in boxes.iter().enumerate() {
                let [x0, y0, x1, y1] = a.rect;
                assert!(
                    x0 >= MARGIN - 0.5 && x1 <= w - MARGIN + 0.5 && y0 >= MARGIN - 0.5 && y1 <= h,
                    "{a:?} runs off the page ({paper:?})"
                );
                for b in &boxes[i + 1..] {
                    assert!(!a.overlaps(b, 0.05), "{a:?} overlaps {b:?} ({paper:?})");
                }
            }
        }
    }
}
