//! Our drawing layer on printpdf's page operations: pens with dash patterns, polylines,
//! filled polygons, hatched rectangles, markers and aligned text.
//!
//! Coordinates are millimetres from the page's bottom-left corner, y up (the PDF convention).
//! Everything is drawn in black and greys only, so a page prints the same in black and white:
//! meaning is carried by line style, hatching and marker shape, never by colour.

use super::metrics::{self, Face};
use printpdf::{
    BuiltinFont, Color, Greyscale, Line, LineDashPattern, LinePoint, Mm, Op, PaintMode,
    PdfFontHandle, Point, Polygon, PolygonRing, Pt, TextItem, WindingOrder,
};

/// A point on the page, mm from the bottom-left corner.
pub type P = (f64, f64);

/// Dash pattern of a pen.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Dash {
    /// Continuous.
    Solid,
    /// Long dashes.
    Dashed,
    /// Short dots.
    Dotted,
    /// Dash and dot, for centre lines.
    DashDot,
}

/// How a line is stroked.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Pen {
    /// Line width, pt.
    pub width_pt: f64,
    /// Grey level, 0 black to 1 white.
    pub grey: f64,
    /// Dash pattern.
    pub dash: Dash,
}

impl Pen {
    /// A solid black pen of `width_pt`.
    pub const fn solid(width_pt: f64) -> Self {
        Pen {
            width_pt,
            grey: 0.0,
            dash: Dash::Solid,
        }
    }

    /// The same pen with another dash pattern.
    pub const fn with_dash(self, dash: Dash) -> Self {
        Pen { dash, ..self }
    }

    /// The same pen with another grey level.
    pub const fn with_grey(self, grey: f64) -> Self {
        Pen { grey, ..self }
    }
}

/// Horizontal alignment of text on its anchor point.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Align {
    /// The anchor is the start of the text.
    Left,
    /// The anchor is the middle of the text.
    Centre,
    /// The anchor is the end of the text.
    Right,
}

/// A face and a size.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Font {
    /// Regular or bold.
    pub face: Face,
    /// Size, pt.
    pub size_pt: f64,
}

impl Font {
    /// Helvetica at `size_pt`.
    pub const fn regular(size_pt: f64) -> Self {
        Font {
            face: Face::Regular,
            size_pt,
        }
    }

    /// Helvetica-Bold at `size_pt`.
    pub const fn bold(size_pt: f64) -> Self {
        Font {
            face: Face::Bold,
            size_pt,
        }
    }

    /// Width of `text` in this font, mm.
    pub fn width_mm(&self, text: &str) -> f64 {
        metrics::text_width_mm(text, self.face, self.size_pt)
    }

    /// Height of capital letters above the baseline, mm (Helvetica cap height 718/1000 em).
    pub fn cap_height_mm(&self) -> f64 {
        0.718 * self.size_pt * super::MM_PER_PT
    }

    /// A comfortable distance between baselines, mm (1.2 times the size).
    pub fn line_height_mm(&self) -> f64 {
        1.2 * self.size_pt * super::MM_PER_PT
    }
}

/// Marker shapes for points on charts and drawings; distinct in black and white.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Marker {
    /// Filled circle.
    Dot,
    /// Open circle.
    Ring,
    /// Open triangle, point up.
    Triangle,
    /// Open square.
    Square,
    /// Diagonal cross.
    Cross,
}

/// Where a piece of text was put: its box from the descender to the cap height, mm.
#[derive(Debug, Clone, PartialEq)]
pub struct TextBox {
    /// Left, bottom, right, top, mm.
    pub rect: [f64; 4],
    /// The text.
    pub text: String,
}

impl TextBox {
    /// Whether two boxes overlap by more than `tolerance_mm` in both directions.
    pub fn overlaps(&self, other: &TextBox, tolerance_mm: f64) -> bool {
        let [a0, b0, a1, b1] = self.rect;
        let [c0, d0, c1, d1] = other.rect;
        a0 + tolerance_mm < c1
            && c0 + tolerance_mm < a1
            && b0 + tolerance_mm < d1
            && d0 + tolerance_mm < b1
    }
}

/// A page being drawn: a list of printpdf operations, and the boxes of the text placed so
/// far (for layout checks).
#[derive(Debug, Default)]
pub struct Canvas {
    ops: Vec<Op>,
    texts: Vec<TextBox>,
}

fn pt(p: P) -> Point {
    Point::new(Mm(p.0 as f32), Mm(p.1 as f32))
}

fn grey(level: f64) -> Color {
    Color::Greyscale(Greyscale::new(level.clamp(0.0, 1.0) as f32, None))
}

fn line_points(points: &[P]) -> Vec<LinePoint> {
    points
        .iter()
        .map(|&p| LinePoint {
            p: pt(p),
            bezier: false,
        })
        .collect()
}

/// Points of a circle of `radius` mm around `c`, counter-clockwise from angle `from_rad` to
/// `to_rad`, `n` segments.
pub fn arc(c: P, radius: f64, from_rad: f64, to_rad: f64, n: usize) -> Vec<P> {
    (0..=n)
        .map(|i| {
            let t = from_rad + (to_rad - from_rad) * i as f64 / n as f64;
            (c.0 + radius * t.cos(), c.1 + radius * t.sin())
        })
        .collect()
}

impl Canvas {
    /// An empty page.
    pub fn new() -> Self {
        Canvas::default()
    }

    /// The operations drawn so far.
    pub fn into_ops(self) -> Vec<Op> {
        self.ops
    }

    /// The boxes of every text drawn so far.
    pub fn text_boxes(&self) -> &[TextBox] {
        &self.texts
    }

    fn set_pen(&mut self, pen: Pen) {
        let w = pen.width_pt;
        let pattern: &[f32] = match pen.dash {
            Dash::Solid => &[],
            Dash::Dashed => &[(4.0 * w.max(0.8)) as f32, (2.5 * w.max(0.8)) as f32],
            Dash::Dotted => &[(1.0 * w.max(0.8)) as f32, (1.8 * w.max(0.8)) as f32],
            Dash::DashDot => &[
                (6.0 * w.max(0.8)) as f32,
                (2.0 * w.max(0.8)) as f32,
                (1.0 * w.max(0.8)) as f32,
                (2.0 * w.max(0.8)) as f32,
            ],
        };
        self.ops.push(Op::SetOutlineThickness { pt: Pt(w as f32) });
        self.ops.push(Op::SetOutlineColor {
            col: grey(pen.grey),
        });
        self.ops.push(Op::SetLineDashPattern {
            dash: LineDashPattern::new(0.0, pattern),
        });
    }

    /// An open polyline through `points`; non-finite points break the line.
    pub fn polyline(&mut self, points: &[P], pen: Pen) {
        let mut run: Vec<P> = Vec::new();
        let mut runs: Vec<Vec<P>> = Vec::new();
        for &p in points {
            if p.0.is_finite() && p.1.is_finite() {
                run.push(p);
            } else if !run.is_empty() {
                runs.push(std::mem::take(&mut run));
            }
        }
        runs.push(run);
        for r in runs.into_iter().filter(|r| r.len() >= 2) {
            self.set_pen(pen);
            self.ops.push(Op::DrawLine {
                line: Line {
                    points: line_points(&r),
                    is_closed: false,
                },
            });
        }
    }

    /// A straight line from `a` to `b`.
    pub fn line(&mut self, a: P, b: P, pen: Pen) {
        self.polyline(&[a, b], pen);
    }

    /// A closed polygon, filled with grey `fill` and/or outlined with `pen`.
    pub fn polygon(&mut self, points: &[P], fill: Option<f64>, pen: Option<Pen>) {
        if points.len() < 3 || points.iter().any(|p| !p.0.is_finite() || !p.1.is_finite()) {
            return;
        }
        let mode = match (fill, pen) {
            (Some(_), Some(_)) => PaintMode::FillStroke,
            (Some(_), None) => PaintMode::Fill,
            (None, Some(_)) => PaintMode::Stroke,
            (None, None) => return,
        };
        if let Some(g) = fill {
            self.ops.push(Op::SetFillColor { col: grey(g) });
        }
        if let Some(p) = pen {
            self.set_pen(p);
        }
        self.ops.push(Op::DrawPolygon {
            polygon: Polygon {
                rings: vec![PolygonRing {
                    points: line_points(points),
                }],
                mode,
                winding_order: WindingOrder::NonZero,
            },
        });
    }

    /// A rectangle with its bottom-left corner at (`x`, `y`).
    pub fn rect(&mut self, x: f64, y: f64, w: f64, h: f64, fill: Option<f64>, pen: Option<Pen>) {
        self.polygon(&[(x, y), (x + w, y), (x + w, y + h), (x, y + h)], fill, pen);
    }

    /// Diagonal hatching (lines at 45 degrees, `spacing_mm` apart) clipped to a rectangle.
    pub fn hatch_rect(&mut self, x: f64, y: f64, w: f64, h: f64, spacing_mm: f64, pen: Pen) {
        if !(w > 0.0 && h > 0.0 && spacing_mm > 0.0) {
            return;
        }
        // Lines u = x' - y' = const, for u from -h to w, in the rectangle's own frame.
        let mut u = -h + spacing_mm * 0.5;
        while u < w {
            // Intersect x' - y' = u with 0 <= x' <= w, 0 <= y' <= h.
            let (x0, y0) = if u >= 0.0 { (u, 0.0) } else { (0.0, -u) };
            let (x1, y1) = if u + h <= w { (u + h, h) } else { (w, w - u) };
            self.line((x + x0, y + y0), (x + x1, y + y1), pen);
            u += spacing_mm;
        }
    }

    /// Text with its baseline at `y`, aligned on `x`.
    pub fn text(&mut self, x: f64, y: f64, text: &str, font: Font, align: Align) {
        self.text_grey(x, y, text, font, align, 0.0);
    }

    /// Text in a grey level (0 black).
    pub fn text_grey(&mut self, x: f64, y: f64, text: &str, font: Font, align: Align, g: f64) {
        if text.is_empty() {
            return;
        }
        let w = font.width_mm(text);
        let x0 = match align {
            Align::Left => x,
            Align::Centre => x - 0.5 * w,
            Align::Right => x - w,
        };
        // Helvetica descender 207/1000 em below the baseline.
        let descent = 0.207 * font.size_pt * super::MM_PER_PT;
        self.texts.push(TextBox {
            rect: [x0, y - descent, x0 + w, y + font.cap_height_mm()],
            text: text.to_string(),
        });
        let builtin = match font.face {
            Face::Regular => BuiltinFont::Helvetica,
            Face::Bold => BuiltinFont::HelveticaBold,
        };
        self.ops.push(Op::StartTextSection);
        self.ops.push(Op::SetFillColor { col: grey(g) });
        self.ops.push(Op::SetFont {
            font: PdfFontHandle::Builtin(builtin),
            size: Pt(font.size_pt as f32),
        });
        self.ops.push(Op::SetTextCursor { pos: pt((x0, y)) });
        self.ops.push(Op::ShowText {
            items: vec![TextItem::Text(text.to_string())],
        });
        self.ops.push(Op::EndTextSection);
    }

    /// Lines of text from the baseline `y` of the first downward; returns the baseline
    /// below the last line.
    pub fn text_lines(&mut self, x: f64, y: f64, lines: &[String], font: Font) -> f64 {
        let mut y = y;
        for l in lines {
            self.text(x, y, l, font, Align::Left);
            y -= font.line_height_mm();
        }
        y
    }

    /// A marker of overall size `size_mm` centred on `c`.
    pub fn marker(&mut self, c: P, marker: Marker, size_mm: f64, pen: Pen) {
        let r = 0.5 * size_mm;
        let solid = pen.with_dash(Dash::Solid);
        match marker {
            Marker::Dot => {
                let pts = arc(c, r, 0.0, std::f64::consts::TAU, 20);
                self.polygon(&pts, Some(pen.grey), None);
            }
            Marker::Ring => {
                let pts = arc(c, r, 0.0, std::f64::consts::TAU, 20);
                self.polygon(&pts, Some(1.0), Some(solid));
            }
            Marker::Triangle => {
                let pts = [
                    (c.0, c.1 + r),
                    (c.0 - 0.866 * r, c.1 - 0.5 * r),
                    (c.0 + 0.866 * r, c.1 - 0.5 * r),
                ];
                self.polygon(&pts, Some(1.0), Some(solid));
            }
            Marker::Square => {
                let s = 0.8 * r;
                self.rect(c.0 - s, c.1 - s, 2.0 * s, 2.0 * s, Some(1.0), Some(solid));
            }
            Marker::Cross => {
                let s = 0.75 * r;
                self.line((c.0 - s, c.1 - s), (c.0 + s, c.1 + s), solid);
                self.line((c.0 - s, c.1 + s), (c.0 + s, c.1 - s), solid);
            }
        }
    }

    /// The balance-point symbol: a circle with two opposite quarters filled.
    pub fn cg_symbol(&mut self, c: P, radius_mm: f64) {
        use std::f64::consts::{FRAC_PI_2, PI, TAU};
        let ring = arc(c, radius_mm, 0.0, TAU, 32);
        self.polygon(&ring, Some(1.0), None);
        for start in [0.0, PI] {
            let mut q = vec![c];
            q.extend(arc(c, radius_mm, start, start + FRAC_PI_2, 8));
            self.polygon(&q, Some(0.0), None);
        }
        self.polygon(&ring, None, Some(Pen::solid(0.8)));
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn non_finite_points_are_never_drawn() {
        let mut c = Canvas::new();
        c.polyline(&[(0.0, 0.0), (f64::NAN, 1.0), (2.0, 2.0)], Pen::solid(1.0));
        c.polygon(
            &[(0.0, 0.0), (1.0, f64::INFINITY), (2.0, 0.0)],
            Some(0.5),
            None,
        );
        let ops = c.into_ops();
        assert!(!ops
            .iter()
            .any(|op| matches!(op, Op::DrawLine { .. } | Op::DrawPolygon { .. })));
    }

    #[test]
    fn hatching_stays_inside_its_rectangle() {
        let mut c = Canvas::new();
        c.hatch_rect(10.0, 20.0, 7.0, 3.0, 1.0, Pen::solid(0.3));
        let ops = c.into_ops();
        let mut n = 0;
        for op in &ops {
            if let Op::DrawLine { line } = op {
                n += 1;
                for lp in &line.points {
                    let (x, y) = (Mm::from(lp.p.x).0, Mm::from(lp.p.y).0);
                    assert!((9.99..=17.01).contains(&x) && (19.99..=23.01).contains(&y));
                }
            }
        }
        assert!(n >= 8, "{n} hatch lines");
    }
}
