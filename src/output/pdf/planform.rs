//! The to-scale top view: wing, tail or canard, schematic fuselage, centre line, MAC, the
//! recommended CG band (hatched), neutral point, target CG and CG, with labelled leaders
//! giving each position in mm aft of the wing root leading edge, and a scale bar.
//!
//! Orientation: nose up, starboard wing on the right (seen from above). Aircraft x (aft)
//! runs down the page, y (starboard) to the right.

use super::canvas::{Align, Canvas, Dash, Font, Marker, Pen};
use super::chart::Frame;
use crate::output::report::{fmt, Outline, TopView};

mod labels;
mod mac_label;

use labels::leader_labels;

const LABEL: Font = Font::regular(7.0);
const LABEL_BOLD: Font = Font::bold(7.5);
const CAPTION: Font = Font::regular(6.5);

/// Drawing scales offered, as N in "1:N": round numbers a builder can use with a ruler.
const SCALES: [f64; 16] = [
    1.0, 2.0, 2.5, 4.0, 5.0, 7.5, 10.0, 12.5, 15.0, 20.0, 25.0, 30.0, 40.0, 50.0, 75.0, 100.0,
];

struct Mark {
    x_m: f64,
    text: String,
    font: Font,
    is_root: bool,
}

/// The balance marks of `view`, sorted fore to aft.
fn marks(view: &TopView) -> Vec<Mark> {
    let mm = |x_m: f64| (x_m - view.root_le_x_m) * 1000.0;
    let mut marks = vec![
        Mark {
            x_m: view.root_le_x_m,
            text: "wing root LE: 0".to_string(),
            font: LABEL,
            is_root: true,
        },
        Mark {
            x_m: view.band_x_m.0,
            text: format!("forward limit {}", fmt(mm(view.band_x_m.0), 0)),
            font: LABEL,
            is_root: false,
        },
        Mark {
            x_m: view.band_x_m.1,
            text: format!("aft limit {}", fmt(mm(view.band_x_m.1), 0)),
            font: LABEL,
            is_root: false,
        },
        Mark {
            x_m: view.neutral_point_x_m,
            text: format!("neutral point {}", fmt(mm(view.neutral_point_x_m), 0)),
            font: LABEL,
            is_root: false,
        },
        Mark {
            x_m: view.cg_x_m,
            text: format!("CG {}", fmt(mm(view.cg_x_m), 0)),
            font: LABEL_BOLD,
            is_root: false,
        },
    ];
    if let Some(t) = view.target_x_m {
        marks.push(Mark {
            x_m: t,
            text: format!("target CG {}", fmt(mm(t), 0)),
            font: LABEL,
            is_root: false,
        });
    }
    marks.retain(|m| m.x_m.is_finite());
    marks.sort_by(|a, b| a.x_m.total_cmp(&b.x_m));
    marks
}

/// Where the drawing goes inside an area, and at what scale.
struct Layout {
    /// Width of the label column, mm.
    label_w: f64,
    /// Height of the caption and scale bar under the drawing, mm.
    caption_h: f64,
    /// The drawing's frame.
    draw: Frame,
    /// Scale denominator N (1:N).
    n: f64,
    /// Aircraft extent: x_min, x_max, greatest |y|, m.
    x_min: f64,
    x_max: f64,
    y_max: f64,
    /// The side view's height range (z_min, z_max), m.
    z_range: (f64, f64),
}

/// Paper between the top view and the side view beside it, mm.
const SIDE_GAP_MM: f64 = 8.0;

/// The side view's outlines (surfaces and fuselage), in (x, z), m.
fn side_points(view: &TopView) -> Vec<(f64, f64)> {
    let mut pts: Vec<(f64, f64)> = view.side.iter().flatten().copied().collect();
    if let Some(f) = &view.side_fuselage {
        pts.extend(f);
    }
    pts.retain(|p| p.0.is_finite() && p.1.is_finite());
    pts
}

fn layout(area: Frame, view: &TopView, marks: &[Mark]) -> Option<Layout> {
    // Extent of everything drawn, aircraft axes (m).
    let mut pts: Vec<(f64, f64)> = view.wing.clone();
    if let Some((_, o)) = &view.stabiliser {
        pts.extend(o);
    }
    if let Some(o) = &view.fuselage {
        pts.extend(o);
    }
    pts.extend(marks.iter().map(|m| (m.x_m, 0.0)));
    pts.retain(|p| p.0.is_finite() && p.1.is_finite());
    let side = side_points(view);
    let x_min = pts
        .iter()
        .chain(&side)
        .map(|p| p.0)
        .fold(f64::INFINITY, f64::min);
    let x_max = pts
        .iter()
        .chain(&side)
        .map(|p| p.0)
        .fold(f64::NEG_INFINITY, f64::max);
    let y_max = pts.iter().map(|p| p.1.abs()).fold(0.0, f64::max);
    if !(x_min.is_finite() && x_max > x_min && y_max > 0.0) {
        return None;
    }
    let z_range = if side.is_empty() {
        (0.0, 0.0)
    } else {
        (
            side.iter().map(|p| p.1).fold(f64::INFINITY, f64::min),
            side.iter().map(|p| p.1).fold(f64::NEG_INFINITY, f64::max),
        )
    };
    // Paper across the page that the side view takes besides its height at the scale.
    let side_gap = if side.is_empty() { 0.0 } else { SIDE_GAP_MM };
    let across_m = 2.0 * y_max + (z_range.1 - z_range.0);
    // Label column on the left, caption and scale bar at the bottom.
    let label_w = marks
        .iter()
        .map(|m| m.font.width_mm(&m.text))
        .fold(CAPTION.width_mm("mm aft of root LE"), f64::max)
        + 2.0;
    let caption_h = 2.0 * CAPTION.line_height_mm() + 4.0;
    let draw = Frame {
        x: area.x + label_w + 4.0,
        y: area.y + caption_h,
        w: area.w - label_w - 4.0,
        h: area.h - caption_h - 2.0,
    };
    // mm of paper per m of aircraft for 1:N is 1000/N; pick the smallest N that fits.
    let n = SCALES
        .iter()
        .copied()
        .find(|n| {
            let k = 1000.0 / n;
            across_m * k + side_gap <= draw.w && (x_max - x_min) * k <= draw.h
        })
        .unwrap_or_else(|| {
            let k =
                ((draw.w - side_gap).max(0.5 * draw.w) / across_m).min(draw.h / (x_max - x_min));
            (1000.0 / k).ceil()
        });
    Some(Layout {
        label_w,
        caption_h,
        draw,
        n,
        x_min,
        x_max,
        y_max,
        z_range,
    })
}

/// The least height (mm) in which the top view can print all its labels: one line per mark,
/// their heading and the caption, with a little air.
pub fn min_height(view: &TopView) -> f64 {
    (marks(view).len() as f64 + 3.0) * LABEL_BOLD.line_height_mm() + 6.0
}

/// The height (mm) the top view of `view` needs in an area `width` wide and at most
/// `max_height` tall: the drawing at the scale it would get, its caption and a little air.
pub fn height_needed(width: f64, max_height: f64, view: &TopView) -> f64 {
    let marks = marks(view);
    let area = Frame {
        x: 0.0,
        y: 0.0,
        w: width,
        h: max_height,
    };
    match layout(area, view, &marks) {
        Some(l) => {
            let drawing = (l.x_max - l.x_min) * 1000.0 / l.n;
            // Room for the labels too, spread one line apart, with their heading above.
            let labels = (marks.len() as f64 + 2.0) * LABEL_BOLD.line_height_mm();
            (drawing.max(labels) + l.caption_h + 6.0).min(max_height)
        }
        None => max_height,
    }
}

/// Where the views sit on the page: the top view's centre line `cx` and top `top` (mm), the
/// scale `k` (mm of paper per m) and the aircraft's most forward x `x_min` (m).
#[derive(Clone, Copy)]
struct Placement {
    cx: f64,
    top: f64,
    k: f64,
    x_min: f64,
}

impl Placement {
    /// The page point (mm) of the top view's (x, y), m.
    fn page(&self, p: (f64, f64)) -> (f64, f64) {
        (
            self.cx + p.1 * self.k,
            self.top - (p.0 - self.x_min) * self.k,
        )
    }
}

/// Draw `view` inside `area`. Returns the scale denominator N (drawing is 1:N), NaN when the
/// view has nothing to draw.
pub fn top_view(c: &mut Canvas, area: Frame, view: &TopView) -> f64 {
    let marks = marks(view);
    let Some(l) = layout(area, view, &marks) else {
        return f64::NAN;
    };
    let k = 1000.0 / l.n;
    // The top view and, at its right, the side view, centred together across the frame.
    let has_side = !side_points(view).is_empty();
    let side_w = if has_side {
        SIDE_GAP_MM + (l.z_range.1 - l.z_range.0) * k
    } else {
        0.0
    };
    let draw = l.draw;
    let cx = draw.x + 0.5 * (draw.w - side_w);
    let cx = cx
        .max(draw.x + l.y_max * k)
        .min(draw.x + draw.w - side_w - l.y_max * k);
    let top = draw.top() - 0.5 * (draw.h - (l.x_max - l.x_min) * k);
    let place = Placement {
        cx,
        top,
        k,
        x_min: l.x_min,
    };
    let page = |p: (f64, f64)| place.page(p);

    let wing_and_stabiliser: Vec<&Outline> = std::iter::once(&view.wing)
        .chain(view.stabiliser.as_ref().map(|(_, o)| o))
        .collect();
    outlines(c, view.fuselage.as_ref(), &wing_and_stabiliser, page);
    for o in &view.controls {
        let p: Vec<_> = o.iter().map(|&q| page(q)).collect();
        c.polygon(&p, Some(0.82), Some(Pen::solid(0.4)));
    }
    c.line(
        (cx, top + 2.0),
        (cx, top - (l.x_max - l.x_min) * k - 2.0),
        Pen::solid(0.3).with_dash(Dash::DashDot),
    );

    // Balance marks across the wing root: half-width w_mark on each side of the centre line.
    let w_mark = (0.22 * l.y_max * k).clamp(6.0, 0.5 * draw.w);
    balance_marks(c, view, place, w_mark);
    mac_line(c, view, place);
    leader_labels(c, area, &l, marks, place, w_mark);

    // The fin seen from above: a line on the centre line.
    if let Some((x0, x1)) = view.fin_x_m {
        c.line(page((x0, 0.0)), page((x1, 0.0)), Pen::solid(1.4));
    }
    if has_side {
        side_view(c, view, place, l.y_max, l.z_range);
    }
    caption_and_scale_bar(c, area, draw, k, l.n);
    l.n
}

/// The fuselage (lighter) and then each surface outline, through `to_page` (m to page mm):
/// the drawing run the top view and the side view share.
fn outlines(
    c: &mut Canvas,
    fuselage: Option<&Outline>,
    surfaces: &[&Outline],
    to_page: impl Fn((f64, f64)) -> (f64, f64),
) {
    if let Some(f) = fuselage {
        let p: Vec<_> = f.iter().map(|&q| to_page(q)).collect();
        c.polygon(&p, Some(0.85), Some(Pen::solid(0.5)));
    }
    for o in surfaces {
        let p: Vec<_> = o.iter().map(|&q| to_page(q)).collect();
        c.polygon(&p, Some(0.95), Some(Pen::solid(0.8)));
    }
}

/// The recommended band (hatched), the neutral point, the target CG and the CG across the
/// wing root, `w_mark` mm each side of the centre line.
fn balance_marks(c: &mut Canvas, view: &TopView, place: Placement, w_mark: f64) {
    let cx = place.cx;
    let (b0, b1) = (
        place.page((view.band_x_m.0, 0.0)).1,
        place.page((view.band_x_m.1, 0.0)).1,
    );
    if b0.is_finite() && b1.is_finite() {
        let (lo, hi) = (b0.min(b1), b0.max(b1));
        c.rect(cx - w_mark, lo, 2.0 * w_mark, hi - lo, Some(1.0), None);
        c.hatch_rect(cx - w_mark, lo, 2.0 * w_mark, hi - lo, 0.9, Pen::solid(0.3));
        c.rect(
            cx - w_mark,
            lo,
            2.0 * w_mark,
            hi - lo,
            None,
            Some(Pen::solid(0.5)),
        );
    }
    let np_y = place.page((view.neutral_point_x_m, 0.0)).1;
    c.line(
        (cx - w_mark, np_y),
        (cx + w_mark, np_y),
        Pen::solid(0.9).with_dash(Dash::Dashed),
    );
    c.marker((cx + w_mark, np_y), Marker::Triangle, 2.2, Pen::solid(0.7));
    if let Some(t) = view.target_x_m {
        let ty = place.page((t, 0.0)).1;
        c.line(
            (cx - w_mark, ty),
            (cx + w_mark, ty),
            Pen::solid(0.7).with_dash(Dash::Dotted),
        );
    }
    let cg_y = place.page((view.cg_x_m, 0.0)).1;
    c.line((cx - w_mark, cg_y), (cx + w_mark, cg_y), Pen::solid(1.2));
    c.cg_symbol((cx, cg_y), 1.8);
}

/// The MAC on the starboard half, with end ticks and its length.
fn mac_line(c: &mut Canvas, view: &TopView, place: Placement) {
    let m = view.mac;
    let a = place.page((m.le_x_m, m.y_m));
    let b = place.page((m.le_x_m + m.chord_m, m.y_m));
    c.line(a, b, Pen::solid(1.6));
    c.line((a.0 - 1.2, a.1), (a.0 + 1.2, a.1), Pen::solid(0.8));
    c.line((b.0 - 1.2, b.1), (b.0 + 1.2, b.1), Pen::solid(0.8));
    // Outside the outlines, so it covers no part of the planform; on a white ground so it
    // stays legible over the centre line or a scale bar.
    let mac_font = Font::regular(6.5);
    let mac_text = format!("MAC {} mm", fmt(m.chord_m * 1000.0, 0));
    let outlines: Vec<Vec<(f64, f64)>> = std::iter::once(&view.wing)
        .chain(view.stabiliser.as_ref().map(|(_, o)| o))
        .chain(view.fuselage.as_ref())
        .map(|o| o.iter().map(|&q| place.page(q)).collect())
        .collect();
    let size = (
        mac_font.width_mm(&mac_text) + 1.0,
        mac_font.cap_height_mm() + 1.2,
    );
    let label = mac_label::place(a, b, size, &outlines);
    c.rect(label.x, label.y, label.w, label.h, Some(1.0), None);
    c.text(
        label.x + 0.5,
        label.y + 0.6,
        &mac_text,
        mac_font,
        Align::Left,
    );
}

/// The side view at the top view's scale, nose up, z (up) to the right, right of the top view
/// (half-span `y_max`, m; heights `z_range`, m): x rows line up with the top view's.
fn side_view(c: &mut Canvas, view: &TopView, place: Placement, y_max: f64, z_range: (f64, f64)) {
    let k = place.k;
    let sx0 = place.cx + y_max * k + SIDE_GAP_MM;
    let side_page = |p: (f64, f64)| {
        (
            sx0 + (p.1 - z_range.0) * k,
            place.top - (p.0 - place.x_min) * k,
        )
    };
    let side: Vec<&Outline> = view.side.iter().collect();
    outlines(c, view.side_fuselage.as_ref(), &side, side_page);
}

/// The caption and a 100 mm (or shorter) scale bar under the drawing (`k` mm of paper per m,
/// scale 1:`n`).
fn caption_and_scale_bar(c: &mut Canvas, area: Frame, draw: Frame, k: f64, n: f64) {
    let bar_m = [0.5, 0.2, 0.1, 0.05]
        .into_iter()
        .find(|len| len * k <= 0.3 * draw.w)
        .unwrap_or(0.05);
    let bar_y = area.y + CAPTION.line_height_mm() + 1.5;
    let bx = draw.x;
    c.rect(
        bx,
        bar_y,
        0.5 * bar_m * k,
        1.0,
        Some(0.0),
        Some(Pen::solid(0.4)),
    );
    c.rect(
        bx + 0.5 * bar_m * k,
        bar_y,
        0.5 * bar_m * k,
        1.0,
        Some(1.0),
        Some(Pen::solid(0.4)),
    );
    c.text(
        bx + bar_m * k + 1.5,
        bar_y,
        &format!("{} mm", fmt(bar_m * 1000.0, 0)),
        CAPTION,
        Align::Left,
    );
    c.text(
        area.x,
        area.y + 0.5,
        &format!(
            "Top view to scale 1:{} when printed at 100 %. Nose up, starboard wing right; side view at its right, same scale, up to the right.",
            fmt(n, if n.fract().abs() < 1e-9 { 0 } else { 1 })
        ),
        CAPTION,
        Align::Left,
    );
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::analysis::{analyse, AnalysisOptions};
    use crate::output::report::{self, ReportSource};
    use approx::assert_relative_eq;
    use printpdf::{Mm, Op};

    /// Page polygons (in mm) drawn by the top view, in drawing order.
    fn polygons(c: Canvas) -> Vec<Vec<(f64, f64)>> {
        c.into_ops()
            .into_iter()
            .filter_map(|op| match op {
                Op::DrawPolygon { polygon } => Some(
                    polygon.rings[0]
                        .points
                        .iter()
                        .map(|lp| (f64::from(Mm::from(lp.p.x).0), f64::from(Mm::from(lp.p.y).0)))
                        .collect(),
                ),
                _ => None,
            })
            .collect()
    }

    // An example aircraft analysed and its top view drawn in a 190 x 110 mm frame: the
    // aircraft, its analysis, its report data, the canvas, the frame and the scale (1 : n).
    #[allow(clippy::type_complexity)]
    fn drawn_top_view(
        text: &str,
    ) -> (
        crate::model::Aircraft,
        crate::analysis::Analysis,
        report::ReportData,
        Canvas,
        Frame,
        f64,
    ) {
        let aircraft = crate::input::parse_aircraft(text, "demo", None).unwrap();
        let a = analyse(&aircraft, &AnalysisOptions::default()).unwrap();
        let d = report::build(
            &aircraft,
            &a,
            ReportSource {
                file_name: "demo".into(),
                content_hash: String::new(),
                date: String::new(),
            },
        );
        let mut c = Canvas::new();
        let area = Frame {
            x: 10.0,
            y: 100.0,
            w: 190.0,
            h: 110.0,
        };
        let n = top_view(&mut c, area, &d.top_view);
        (aircraft, a, d, c, area, n)
    }

    // The demo has a fuselage, a wing and a tail: the wing polygon must be exactly the span
    // at the stated scale wide, and the tail must lie below the wing (nose up).
    #[test]
    fn demo_top_view_is_to_scale_and_nose_up() {
        let (aircraft, a, _, c, _, n) =
            drawn_top_view(include_str!("../../../aircraft/larkspire-2000.toml"));
        assert!(n.is_finite() && n >= 1.0);
        let polys = polygons(c);
        // Drawing order: fuselage, wing, tail.
        let extent = |p: &Vec<(f64, f64)>| {
            let xs = p.iter().map(|q| q.0);
            let ys = p.iter().map(|q| q.1);
            (
                xs.clone().fold(f64::INFINITY, f64::min),
                xs.fold(f64::NEG_INFINITY, f64::max),
                ys.clone().fold(f64::INFINITY, f64::min),
                ys.fold(f64::NEG_INFINITY, f64::max),
            )
        };
        let (fx0, fx1, fy0, fy1) = extent(&polys[0]);
        let (wx0, wx1, wy0, wy1) = extent(&polys[1]);
        let (_, _, _, ty1) = extent(&polys[2]);
        // printpdf stores points as f32 pt: allow 0.01 mm.
        assert_relative_eq!(
            wx1 - wx0,
            a.wing_geometry.span_m * 1000.0 / n,
            epsilon = 0.01
        );
        let fus = aircraft.fuselage.as_ref().unwrap();
        assert_relative_eq!(fx1 - fx0, fus.max_width_m * 1000.0 / n, epsilon = 0.01);
        assert_relative_eq!(fy1 - fy0, fus.length_m * 1000.0 / n, epsilon = 0.01);
        assert!(ty1 < wy0, "tail not below the wing: nose is not up");
        assert!(fy1 > wy1, "the nose must be above the wing");
        // The wing's vertical extent is at least its root chord at the same scale.
        assert!(wy1 - wy0 >= a.wing_geometry.root_chord_m * 1000.0 / n - 0.01);
    }

    // The trainer has a fin: the side view, drawn last, puts it right of the top view at the
    // top view's scale, as tall across the page as the fin's height, its x rows level with
    // the top view's (the fin's root leading edge at the same page height as in the top
    // view's centre-line line).
    #[test]
    fn side_view_is_beside_the_top_view_at_its_scale() {
        let (aircraft, _, d, c, area, n) =
            drawn_top_view(include_str!("../../../aircraft/wrenfield-1400.toml"));
        let k = 1000.0 / n;
        let polys = polygons(c);
        let xs = |p: &Vec<(f64, f64)>| p.iter().map(|q| q.0).collect::<Vec<_>>();
        let ys = |p: &Vec<(f64, f64)>| p.iter().map(|q| q.1).collect::<Vec<_>>();
        let max = |v: Vec<f64>| v.into_iter().fold(f64::NEG_INFINITY, f64::max);
        let min = |v: Vec<f64>| v.into_iter().fold(f64::INFINITY, f64::min);
        let wing = &polys[1];
        // The fin is the one four-cornered outline right of the top view (the scale bar's
        // rectangles lie at the lower left).
        let right_of_top: Vec<_> = polys
            .iter()
            .filter(|p| min(xs(p)) > max(xs(wing)))
            .collect();
        assert_eq!(
            right_of_top.len(),
            4,
            "fuselage, wing, tail and fin in the side view"
        );
        let fin = right_of_top.iter().find(|p| p.len() == 4).unwrap();
        let f = aircraft.fin.as_ref().unwrap();
        assert_relative_eq!(max(xs(fin)) - min(xs(fin)), f.height_m * k, epsilon = 0.01);
        assert!(
            min(xs(fin)) > max(xs(wing)),
            "the side view is right of the top view"
        );
        let (x0, x1) = d.top_view.fin_x_m.unwrap();
        assert_relative_eq!(max(ys(fin)) - min(ys(fin)), (x1 - x0) * k, epsilon = 0.01);
        // Everything inside the area given.
        for p in &polys {
            assert!(max(xs(p)) <= area.x + area.w + 0.01 && min(xs(p)) >= area.x - 0.01);
        }
    }
}
