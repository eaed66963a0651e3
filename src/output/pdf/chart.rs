//! A small charting layer on [`Canvas`]: linear axes with "nice" ticks, tick labels, axis
//! titles, clipped series with line styles and markers, reference lines, hatched bands and a
//! legend. Page-independent: a chart is drawn into any rectangle of any page.

use super::canvas::{Align, Canvas, Dash, Font, Marker, Pen, P};
use crate::output::report::fmt;

/// A rectangle on the page, mm, bottom-left corner and size.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Frame {
    /// Left edge, mm.
    pub x: f64,
    /// Bottom edge, mm.
    pub y: f64,
    /// Width, mm.
    pub w: f64,
    /// Height, mm.
    pub h: f64,
}

impl Frame {
    /// Top edge, mm.
    pub fn top(&self) -> f64 {
        self.y + self.h
    }

    /// Right edge, mm.
    pub fn right(&self) -> f64 {
        self.x + self.w
    }
}

/// One linear axis: range, tick step and how to label it.
#[derive(Debug, Clone, PartialEq)]
pub struct Axis {
    /// Lower end, data units.
    pub min: f64,
    /// Upper end, data units.
    pub max: f64,
    /// Distance between ticks, data units.
    pub step: f64,
    /// Decimals of the tick labels.
    pub decimals: usize,
    /// Title with its unit.
    pub title: String,
}

impl Axis {
    /// An axis covering `lo..hi` with about `ticks` intervals of 1, 2, 2.5 or 5 times a power
    /// of ten, its ends on ticks. A degenerate or non-finite range is widened to something
    /// drawable.
    pub fn nice(lo: f64, hi: f64, ticks: usize, title: &str) -> Axis {
        let (mut lo, mut hi) = if lo.is_finite() && hi.is_finite() {
            (lo.min(hi), lo.max(hi))
        } else {
            (0.0, 1.0)
        };
        if hi - lo < 1e-9 {
            let pad = if lo.abs() > 1e-9 { 0.1 * lo.abs() } else { 1.0 };
            lo -= pad;
            hi += pad;
        }
        let raw = (hi - lo) / ticks.max(1) as f64;
        let mag = 10f64.powf(raw.log10().floor());
        let (mant, extra) = [(1.0, 0), (2.0, 0), (2.5, 1), (5.0, 0), (10.0, 0)]
            .into_iter()
            .find(|(m, _)| m * mag >= raw * (1.0 - 1e-9))
            .unwrap_or((10.0, 0));
        let step = mant * mag;
        let decimals = (-(step.log10().floor()) as i64 + extra).max(0) as usize;
        Axis {
            min: (lo / step + 1e-9).floor() * step,
            max: (hi / step - 1e-9).ceil() * step,
            step,
            decimals,
            title: title.to_string(),
        }
    }

    /// The tick values from `min` to `max`.
    pub fn ticks(&self) -> Vec<f64> {
        let n = ((self.max - self.min) / self.step).round() as i64;
        (0..=n.max(0))
            .map(|i| self.min + i as f64 * self.step)
            .collect()
    }

    /// The label of tick `v`.
    pub fn label(&self, v: f64) -> String {
        fmt(v, self.decimals)
    }
}

/// Fonts and sizes shared by the charts of a page.
pub const TICK_FONT: Font = Font::regular(6.5);
/// Axis titles.
pub const TITLE_FONT: Font = Font::regular(7.0);
/// Legend.
pub const LEGEND_FONT: Font = Font::regular(6.5);

/// A plot area with its two axes.
#[derive(Debug, Clone, PartialEq)]
pub struct Axes {
    /// The plot area (inside the axis lines).
    pub frame: Frame,
    /// Horizontal axis.
    pub x: Axis,
    /// Vertical axis.
    pub y: Axis,
}

impl Axes {
    /// Page position of data point `(x, y)`.
    pub fn map(&self, p: (f64, f64)) -> P {
        let f = &self.frame;
        (
            f.x + (p.0 - self.x.min) / (self.x.max - self.x.min) * f.w,
            f.y + (p.1 - self.y.min) / (self.y.max - self.y.min) * f.h,
        )
    }

    /// Width the y tick labels need, mm.
    pub fn y_label_width(y: &Axis) -> f64 {
        y.ticks()
            .iter()
            .map(|&v| TICK_FONT.width_mm(&y.label(v)))
            .fold(0.0, f64::max)
    }

    /// Frame, light grid, ticks, tick labels, the x title under the labels and the y title
    /// above the plot at its left. Returns the baseline of the x title.
    pub fn draw(&self, c: &mut Canvas) -> f64 {
        let f = self.frame;
        let grid = Pen::solid(0.25).with_grey(0.75).with_dash(Dash::Dotted);
        let tick = Pen::solid(0.5);
        for v in self.x.ticks() {
            let (px, _) = self.map((v, self.y.min));
            if v > self.x.min && v < self.x.max {
                c.line((px, f.y), (px, f.top()), grid);
            }
            c.line((px, f.y), (px, f.y - 1.0), tick);
            c.text(
                px,
                f.y - 1.5 - TICK_FONT.cap_height_mm(),
                &self.x.label(v),
                TICK_FONT,
                Align::Centre,
            );
        }
        for v in self.y.ticks() {
            let (_, py) = self.map((self.x.min, v));
            if v > self.y.min && v < self.y.max {
                c.line((f.x, py), (f.right(), py), grid);
            }
            c.line((f.x - 1.0, py), (f.x, py), tick);
            c.text(
                f.x - 1.5,
                py - 0.5 * TICK_FONT.cap_height_mm(),
                &self.y.label(v),
                TICK_FONT,
                Align::Right,
            );
        }
        c.rect(f.x, f.y, f.w, f.h, None, Some(Pen::solid(0.6)));
        let x_title_y = f.y - 1.5 - TICK_FONT.line_height_mm() - TITLE_FONT.cap_height_mm() - 0.6;
        c.text(
            f.x + 0.5 * f.w,
            x_title_y,
            &self.x.title,
            TITLE_FONT,
            Align::Centre,
        );
        c.text(
            f.x - 1.5 - Self::y_label_width(&self.y),
            f.top() + 1.8,
            &self.y.title,
            TITLE_FONT,
            Align::Left,
        );
        x_title_y
    }

    /// A data series as a polyline clipped to the plot area; `None` breaks the line.
    pub fn series(&self, c: &mut Canvas, points: &[Option<(f64, f64)>], pen: Pen) {
        for pair in points.windows(2) {
            if let (Some(a), Some(b)) = (pair[0], pair[1]) {
                if let Some((pa, pb)) = self.clip(a, b) {
                    c.line(self.map(pa), self.map(pb), pen);
                }
            }
        }
    }

    /// Markers at the points inside the plot area.
    pub fn markers(&self, c: &mut Canvas, points: &[(f64, f64)], marker: Marker, pen: Pen) {
        for &p in points {
            if self.contains(p) {
                c.marker(self.map(p), marker, 1.6, pen);
            }
        }
    }

    /// Whether a data point lies inside the axes' ranges.
    pub fn contains(&self, p: (f64, f64)) -> bool {
        let e = 1e-9;
        p.0 >= self.x.min - e
            && p.0 <= self.x.max + e
            && p.1 >= self.y.min - e
            && p.1 <= self.y.max + e
    }

    /// A vertical line at data `x` across the plot, when inside.
    pub fn vline(&self, c: &mut Canvas, x: f64, pen: Pen) {
        if x >= self.x.min && x <= self.x.max {
            let (px, _) = self.map((x, 0.0));
            c.line((px, self.frame.y), (px, self.frame.top()), pen);
        }
    }

    /// A horizontal line at data `y` across the plot, when inside.
    pub fn hline(&self, c: &mut Canvas, y: f64, pen: Pen) {
        if y >= self.y.min && y <= self.y.max {
            let (_, py) = self.map((0.0, y));
            c.line((self.frame.x, py), (self.frame.right(), py), pen);
        }
    }

    /// A hatched vertical band between data `x0` and `x1`, clipped to the plot.
    pub fn x_band(&self, c: &mut Canvas, x0: f64, x1: f64, pen: Pen) {
        let lo = x0.min(x1).max(self.x.min);
        let hi = x0.max(x1).min(self.x.max);
        if hi > lo {
            let (p0, _) = self.map((lo, 0.0));
            let (p1, _) = self.map((hi, 0.0));
            c.hatch_rect(p0, self.frame.y, p1 - p0, self.frame.h, 1.6, pen);
        }
    }

    /// Liang-Barsky clipping of the data segment a-b to the axes' ranges.
    fn clip(&self, a: (f64, f64), b: (f64, f64)) -> Option<((f64, f64), (f64, f64))> {
        if ![a.0, a.1, b.0, b.1].iter().all(|v| v.is_finite()) {
            return None;
        }
        let (dx, dy) = (b.0 - a.0, b.1 - a.1);
        let mut t0: f64 = 0.0;
        let mut t1: f64 = 1.0;
        for (p, q) in [
            (-dx, a.0 - self.x.min),
            (dx, self.x.max - a.0),
            (-dy, a.1 - self.y.min),
            (dy, self.y.max - a.1),
        ] {
            if p.abs() < 1e-300 {
                if q < 0.0 {
                    return None;
                }
            } else {
                let r = q / p;
                if p < 0.0 {
                    t0 = t0.max(r);
                } else {
                    t1 = t1.min(r);
                }
            }
        }
        (t0 <= t1).then_some({
            (
                (a.0 + t0 * dx, a.1 + t0 * dy),
                (a.0 + t1 * dx, a.1 + t1 * dy),
            )
        })
    }
}

/// What a legend entry shows next to its text.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Swatch {
    /// A short line in this pen, with an optional marker on it.
    Line(Pen, Option<Marker>),
    /// A small hatched box.
    Hatch(Pen),
    /// The balance-point symbol.
    CgSymbol,
}

/// Draw legend entries in rows from left to right starting at (`x`, `y` baseline of the first
/// row), wrapping at `width`; returns the baseline below the last row.
pub fn legend(c: &mut Canvas, x: f64, y: f64, width: f64, entries: &[(Swatch, String)]) -> f64 {
    let swatch_w = 6.0;
    let row_h = LEGEND_FONT.line_height_mm() + 0.6;
    let (mut cx, mut cy) = (x, y);
    for (swatch, text) in entries {
        let w = swatch_w + 1.2 + LEGEND_FONT.width_mm(text) + 3.0;
        if cx > x && cx + w > x + width {
            cx = x;
            cy -= row_h;
        }
        let mid = cy + 0.5 * LEGEND_FONT.cap_height_mm();
        match *swatch {
            Swatch::Line(pen, marker) => {
                c.line((cx, mid), (cx + swatch_w, mid), pen);
                if let Some(m) = marker {
                    c.marker((cx + 0.5 * swatch_w, mid), m, 1.6, pen);
                }
            }
            Swatch::Hatch(pen) => {
                c.rect(cx, mid - 1.2, swatch_w, 2.4, None, Some(Pen::solid(0.4)));
                c.hatch_rect(cx, mid - 1.2, swatch_w, 2.4, 1.0, pen);
            }
            Swatch::CgSymbol => c.cg_symbol((cx + 0.5 * swatch_w, mid), 1.1),
        }
        c.text(cx + swatch_w + 1.2, cy, text, LEGEND_FONT, Align::Left);
        cx += w;
    }
    cy - row_h
}

/// Height a legend will take, mm (same wrapping as [`legend`]).
pub fn legend_height(width: f64, entries: &[(Swatch, String)]) -> f64 {
    let row_h = LEGEND_FONT.line_height_mm() + 0.6;
    let mut rows = 1;
    let mut cx = 0.0;
    for (_, text) in entries {
        let w = 6.0 + 1.2 + LEGEND_FONT.width_mm(text) + 3.0;
        if cx > 0.0 && cx + w > width {
            rows += 1;
            cx = 0.0;
        }
        cx += w;
    }
    rows as f64 * row_h
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn nice_axes_cover_the_range_on_round_ticks() {
        let a = Axis::nice(0.13, 1.17, 5, "cl");
        assert!(a.min <= 0.13 && a.max >= 1.17);
        assert_relative_eq!(a.step, 0.25, epsilon = 1e-12);
        assert_eq!(a.decimals, 2);
        let b = Axis::nice(58.0, 91.0, 7, "mm");
        assert_relative_eq!(b.step, 5.0, epsilon = 1e-12);
        assert_relative_eq!(b.min, 55.0, epsilon = 1e-9);
        assert_relative_eq!(b.max, 95.0, epsilon = 1e-9);
        let c = Axis::nice(f64::NAN, 3.0, 4, "x");
        assert!(c.min.is_finite() && c.max > c.min);
    }

    #[test]
    fn clipping_keeps_segments_inside() {
        let axes = Axes {
            frame: Frame {
                x: 0.0,
                y: 0.0,
                w: 10.0,
                h: 10.0,
            },
            x: Axis::nice(0.0, 1.0, 5, "x"),
            y: Axis::nice(0.0, 1.0, 5, "y"),
        };
        let (a, b) = axes.clip((-1.0, 0.5), (2.0, 0.5)).unwrap();
        assert_relative_eq!(a.0, 0.0, epsilon = 1e-12);
        assert_relative_eq!(b.0, 1.0, epsilon = 1e-12);
        assert!(axes.clip((2.0, 2.0), (3.0, 3.0)).is_none());
    }
}
