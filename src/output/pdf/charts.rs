//! The report's two charts, drawn from plain data so any source of results can feed them:
//! spanwise lift against local cl_max ([`spanwise_chart`]) and trim speed against CG position
//! ([`trim_speed_chart`]). Each is laid out inside a given rectangle: title, y title, plot,
//! x labels and title, legend, and a note on how the numbers were obtained.

use super::canvas::{Align, Canvas, Dash, Font, Marker, Pen};
use super::chart::{self, Axes, Axis, Frame, Swatch, TICK_FONT, TITLE_FONT};
use super::metrics::{self, Face};
use crate::output::report::{fmt, GlideChart, SpanPoint, SpanwiseData, TrimSweep};

const CHART_TITLE: Font = Font::bold(8.0);
const NOTE: Font = Font::regular(6.0);

/// Lay out a chart in `area`: title at the top, legend and note at the bottom, the plot in
/// between with room for its tick labels. Returns the axes and draws everything but the data.
fn chart_frame(
    c: &mut Canvas,
    area: Frame,
    title: &str,
    x: Axis,
    y: Axis,
    legend: &[(Swatch, String)],
    note: &str,
) -> Axes {
    c.text(
        area.x,
        area.top() - CHART_TITLE.cap_height_mm(),
        title,
        CHART_TITLE,
        Align::Left,
    );
    let left = area.x + Axes::y_label_width(&y) + 2.0;
    // Room on the right for half of the last x tick label.
    let last_x = x.label(x.max);
    let width = area.right() - left - (0.5 * TICK_FONT.width_mm(&last_x) + 0.3).max(1.0);
    let note_lines = metrics::wrap(note, Face::Regular, NOTE.size_pt, area.w);
    let legend_h = chart::legend_height(area.w, legend);
    let bottom_stack = TICK_FONT.line_height_mm()
        + TITLE_FONT.line_height_mm()
        + 2.5
        + legend_h
        + note_lines.len() as f64 * NOTE.line_height_mm()
        + 0.5;
    let top = area.top() - CHART_TITLE.line_height_mm() - TITLE_FONT.line_height_mm() - 1.0;
    let frame = Frame {
        x: left,
        y: area.y + bottom_stack,
        w: width,
        h: (top - area.y - bottom_stack).max(5.0),
    };
    let axes = Axes { frame, x, y };
    let x_title = axes.draw(c);
    let after = chart::legend(
        c,
        area.x,
        x_title - TITLE_FONT.line_height_mm() - 0.3,
        area.w,
        legend,
    );
    let mut yy = after + LEGEND_GAP;
    for l in &note_lines {
        c.text_grey(area.x, yy, l, NOTE, Align::Left, 0.25);
        yy -= NOTE.line_height_mm();
    }
    axes
}

const LEGEND_GAP: f64 = 0.4;

/// Every `n`-th point, for sparse markers along a line.
fn every(points: &[(f64, f64)], n: usize) -> Vec<(f64, f64)> {
    points.iter().step_by(n.max(1)).copied().collect()
}

/// The spanwise chart: local section cl_max (thick solid), cl at trim (dashed, rings) and
/// near stall (dotted, triangles), and where stall begins when the data say so.
pub fn spanwise_chart(c: &mut Canvas, area: Frame, data: &SpanwiseData) {
    let cases: Vec<(&str, &[SpanPoint])> = [
        data.trim
            .as_ref()
            .map(|t| (t.label.as_str(), t.points.as_slice())),
        data.near_stall
            .as_ref()
            .map(|t| (t.label.as_str(), t.points.as_slice())),
    ]
    .into_iter()
    .flatten()
    .collect();
    let all = cases.iter().flat_map(|(_, p)| p.iter());
    let y_hi = all
        .clone()
        .flat_map(|p| [p.cl, p.cl_max])
        .filter(|v| v.is_finite())
        .fold(0.5, f64::max);
    let y_lo = all
        .flat_map(|p| [p.cl, p.cl_max])
        .filter(|v| v.is_finite())
        .fold(0.0, f64::min);
    let x = Axis::nice(0.0, 1.0, 5, "spanwise station 2y/b (0 root, 1 tip)");
    let y = Axis::nice(y_lo, 1.08 * y_hi, 5, "local lift coefficient cl");
    let clmax_pen = Pen::solid(1.3);
    let trim_pen = Pen::solid(0.9).with_dash(Dash::Dashed);
    let stall_pen = Pen::solid(0.9).with_dash(Dash::Dotted);
    let mut legend = vec![(Swatch::Line(clmax_pen, None), "section cl max".to_string())];
    if let Some(t) = &data.trim {
        legend.push((Swatch::Line(trim_pen, Some(Marker::Ring)), t.label.clone()));
    }
    if let Some(t) = &data.near_stall {
        legend.push((
            Swatch::Line(stall_pen, Some(Marker::Triangle)),
            t.label.clone(),
        ));
    }
    if data.stall_onset_eta.is_some() {
        legend.push((
            Swatch::Line(Pen::solid(0.6), Some(Marker::Cross)),
            "stall begins".to_string(),
        ));
    }
    let axes = chart_frame(
        c,
        area,
        "Spanwise lift against local cl max",
        x,
        y,
        &legend,
        &data.method,
    );
    if let Some((_, pts)) = cases.first() {
        let clmax: Vec<_> = pts.iter().map(|p| Some((p.eta, p.cl_max))).collect();
        axes.series(c, &clmax, clmax_pen);
    }
    for (pts, pen, marker) in [
        (data.trim.as_ref(), trim_pen, Marker::Ring),
        (data.near_stall.as_ref(), stall_pen, Marker::Triangle),
    ]
    .into_iter()
    .filter_map(|(case, pen, m)| case.map(|t| (&t.points, pen, m)))
    {
        let line: Vec<(f64, f64)> = pts.iter().map(|p| (p.eta, p.cl)).collect();
        axes.series(c, &line.iter().copied().map(Some).collect::<Vec<_>>(), pen);
        axes.markers(c, &every(&line, 8), marker, pen.with_dash(Dash::Solid));
    }
    if let (Some(eta), Some(stall)) = (data.stall_onset_eta, &data.near_stall) {
        if let Some(p) = stall
            .points
            .iter()
            .min_by(|a, b| (a.eta - eta).abs().total_cmp(&(b.eta - eta).abs()))
        {
            axes.vline(c, eta, Pen::solid(0.5).with_dash(Dash::DashDot));
            axes.markers(c, &[(eta, p.cl)], Marker::Cross, Pen::solid(0.8));
        }
    }
}

/// Trim speed against CG position over the recommended band (hatched), with the stall speed
/// (dotted) and the present CG (dash-dot line and balance symbol). Trim speeds below the stall
/// speed cannot be flown: that part of the curve is drawn thin and dashed and named in the
/// legend.
pub fn trim_speed_chart(c: &mut Canvas, area: Frame, data: &TrimSweep) {
    let (x, y) = trim_speed_axes(data);
    let trim_pen = Pen::solid(1.3);
    let stall_pen = Pen::solid(0.9).with_dash(Dash::Dotted);
    let band_pen = Pen::solid(0.35).with_grey(0.45);
    let edge_pen = Pen::solid(0.6).with_dash(Dash::Dashed);
    let cg_pen = Pen::solid(0.6).with_dash(Dash::DashDot);
    let below_pen = Pen::solid(0.5).with_dash(Dash::Dashed);
    let stalled = |v: f64| v < data.stall_speed_m_s;
    let any_below = data.points.iter().any(|p| p.1.is_some_and(stalled));
    let legend = trim_speed_legend(data, (trim_pen, stall_pen, band_pen), any_below);
    let axes = chart_frame(
        c,
        area,
        "Trim speed against CG position",
        x,
        y,
        &legend,
        &data.method,
    );
    axes.x_band(c, data.band_mm.0, data.band_mm.1, band_pen);
    axes.vline(c, data.band_mm.0, edge_pen);
    axes.vline(c, data.band_mm.1, edge_pen);
    axes.hline(c, data.stall_speed_m_s, stall_pen);
    let line: Vec<Option<(f64, f64)>> = data
        .points
        .iter()
        .map(|&(x, v)| v.map(|v| (x, v)))
        .collect();
    axes.series(c, &stall_part(&line, data.stall_speed_m_s, false), trim_pen);
    if any_below {
        axes.series(c, &stall_part(&line, data.stall_speed_m_s, true), below_pen);
    }
    axes.vline(c, data.cg_mm, cg_pen);
    cg_symbol_on_curve(c, &axes, data);
    if !line.iter().any(Option::is_some) {
        no_trim_message(c, &axes);
    }
}

/// The CG axis over the sweep and the speed axis over the trim and stall speeds.
fn trim_speed_axes(data: &TrimSweep) -> (Axis, Axis) {
    let speeds: Vec<f64> = data
        .points
        .iter()
        .filter_map(|p| p.1)
        .chain([data.stall_speed_m_s])
        .filter(|v| v.is_finite())
        .collect();
    let lo = speeds.iter().copied().fold(f64::INFINITY, f64::min);
    let hi = speeds.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    let (lo, hi) = if lo.is_finite() {
        (0.9 * lo, 1.05 * hi)
    } else {
        (0.0, 1.0)
    };
    let xs = data.points.iter().map(|p| p.0);
    let x_lo = xs.clone().fold(f64::INFINITY, f64::min);
    let x_hi = xs.fold(f64::NEG_INFINITY, f64::max);
    let x = Axis::nice(x_lo, x_hi, 6, "CG, mm aft of the wing root leading edge");
    let y = Axis::nice(lo, hi, 5, "speed, m/s");
    (x, y)
}

/// The legend of the trim-speed chart, with the `(trim, stall, band)` pens; `any_below` when
/// part of the curve lies below the stall speed.
fn trim_speed_legend(
    data: &TrimSweep,
    (trim_pen, stall_pen, band_pen): (Pen, Pen, Pen),
    any_below: bool,
) -> Vec<(Swatch, String)> {
    vec![
        (
            Swatch::Line(trim_pen, None),
            if any_below {
                "trim speed (thin dashed: below the stall, not flyable)".to_string()
            } else {
                "trim speed".to_string()
            },
        ),
        (
            Swatch::Line(stall_pen, None),
            format!("stall speed {} m/s", fmt(data.stall_speed_m_s, 1)),
        ),
        (
            Swatch::Hatch(band_pen),
            format!(
                "recommended band {} to {} mm",
                fmt(data.band_mm.0, 0),
                fmt(data.band_mm.1, 0)
            ),
        ),
        (
            Swatch::CgSymbol,
            format!("CG from mass list {} mm", fmt(data.cg_mm, 0)),
        ),
    ]
}

/// The points of `line` on the flyable (`below` false) or stalled side of `stall_speed_m_s`.
fn stall_part(
    line: &[Option<(f64, f64)>],
    stall_speed_m_s: f64,
    below: bool,
) -> Vec<Option<(f64, f64)>> {
    let stalled = |v: f64| v < stall_speed_m_s;
    // Each point belongs to the flyable or the stalled curve; a segment that crosses the
    // stall line is drawn in both, so the curve stays continuous.
    (0..line.len())
        .map(|i| {
            let mine = |j: usize| {
                line.get(j)
                    .copied()
                    .flatten()
                    .filter(|p| stalled(p.1) == below)
            };
            let p = line[i]?;
            let neighbour = i.checked_sub(1).and_then(mine).or_else(|| mine(i + 1));
            (stalled(p.1) == below || neighbour.is_some()).then_some(p)
        })
        .collect()
}

/// The trim speed at which the balance symbol goes on the curve: that of the sweep point
/// nearest the present CG that trims, only when it lies within one sweep step of the CG (a
/// CG that does not trim, behind the neutral point, gets no symbol on a curve that is not
/// its own).
fn cg_symbol_speed(data: &TrimSweep) -> Option<f64> {
    let (first, last) = (data.points.first()?, data.points.last()?);
    if data.points.len() < 2 {
        return None;
    }
    let step = (last.0 - first.0).abs() / (data.points.len() - 1) as f64;
    let (x, v) = data
        .points
        .iter()
        .filter_map(|&(x, v)| v.map(|v| (x, v)))
        .min_by(|a, b| {
            (a.0 - data.cg_mm)
                .abs()
                .total_cmp(&(b.0 - data.cg_mm).abs())
        })?;
    ((x - data.cg_mm).abs() <= step * (1.0 + 1e-9)).then_some(v)
}

/// The balance symbol on the curve at the present CG ([`cg_symbol_speed`]).
fn cg_symbol_on_curve(c: &mut Canvas, axes: &Axes, data: &TrimSweep) {
    if let Some(v) = cg_symbol_speed(data) {
        if axes.contains((data.cg_mm, v)) {
            c.cg_symbol(axes.map((data.cg_mm, v)), 1.3);
        }
    }
}

/// A boxed message in the middle of the plot when nothing trims over the CG range.
fn no_trim_message(c: &mut Canvas, axes: &Axes) {
    let f = axes.frame;
    let msg_w = TITLE_FONT.width_mm("no trimmed flight in this CG range") + 3.0;
    c.rect(
        f.x + 0.5 * (f.w - msg_w),
        f.y + 0.5 * f.h - 1.5,
        msg_w,
        TITLE_FONT.cap_height_mm() + 3.0,
        Some(1.0),
        Some(Pen::solid(0.4)),
    );
    c.text(
        f.x + 0.5 * f.w,
        f.y + 0.5 * f.h,
        "no trimmed flight in this CG range",
        TITLE_FONT,
        Align::Centre,
    );
}

/// The sink chart: sink rate against airspeed for this configuration (solid) and the ballast
/// cases (dashed, dotted, dash-dot), with minimum sink (ring), best glide (triangle) and the
/// stall speed (dotted vertical line) of this configuration marked.
pub fn glide_chart(c: &mut Canvas, area: Frame, data: &GlideChart) {
    let Some(first) = data.cases.first() else {
        return;
    };
    let all = data.cases.iter().flat_map(|k| k.points.iter());
    let v_lo = all
        .clone()
        .map(|p| p.0)
        .fold(first.stall_speed_m_s, f64::min);
    let v_hi = all.clone().map(|p| p.0).fold(v_lo + 1.0, f64::max);
    // The useful part of a sink polar is near its least sink: the scale stops at five times
    // the least sink (the fast end runs off the top, clipped).
    let s_hi = all
        .map(|p| p.1)
        .fold(0.1, f64::max)
        .min(5.0 * first.min_sink.1.max(0.05));
    let x = Axis::nice(0.0_f64.max(0.9 * v_lo), v_hi, 5, "airspeed (m/s)");
    let y = Axis::nice(0.0, 1.05 * s_hi, 5, "sink rate (m/s)");
    let pens = [
        Pen::solid(1.3),
        Pen::solid(0.8).with_dash(Dash::Dashed),
        Pen::solid(0.8).with_dash(Dash::Dotted),
        Pen::solid(0.8).with_dash(Dash::DashDot),
    ];
    let stall_pen = Pen::solid(0.5).with_dash(Dash::Dotted).with_grey(0.4);
    let mut legend: Vec<(Swatch, String)> = data
        .cases
        .iter()
        .zip(pens.iter().cycle())
        .map(|(k, pen)| (Swatch::Line(*pen, None), k.label.clone()))
        .collect();
    legend.push((
        Swatch::Line(Pen::solid(0.6), Some(Marker::Ring)),
        format!(
            "least sink {} m/s at {} m/s",
            fmt(first.min_sink.1, 2),
            fmt(first.min_sink.0, 1)
        ),
    ));
    legend.push((
        Swatch::Line(Pen::solid(0.6), Some(Marker::Triangle)),
        format!(
            "best glide {} at {} m/s",
            fmt(first.best_glide.2, 1),
            fmt(first.best_glide.0, 1)
        ),
    ));
    legend.push((
        Swatch::Line(stall_pen, None),
        format!("stall {} m/s", fmt(first.stall_speed_m_s, 1)),
    ));
    let axes = chart_frame(
        c,
        area,
        "Sink rate against airspeed",
        x,
        y,
        &legend,
        &data.method,
    );
    axes.vline(c, first.stall_speed_m_s, stall_pen);
    for (k, pen) in data.cases.iter().zip(pens.iter().cycle()) {
        let line: Vec<Option<(f64, f64)>> = k.points.iter().map(|p| Some(*p)).collect();
        axes.series(c, &line, *pen);
    }
    axes.markers(c, &[first.min_sink], Marker::Ring, Pen::solid(0.6));
    axes.markers(
        c,
        &[(first.best_glide.0, first.best_glide.1)],
        Marker::Triangle,
        Pen::solid(0.6),
    );
}

#[cfg(test)]
mod tests {
    use super::*;

    fn sweep(points: Vec<(f64, Option<f64>)>, cg_mm: f64) -> TrimSweep {
        TrimSweep {
            points,
            band_mm: (50.0, 80.0),
            cg_mm,
            stall_speed_m_s: 5.0,
            method: String::new(),
        }
    }

    // The symbol marks the present CG's own trim: next to a point that trims it sits on the
    // curve; a CG far from every trimming point (it does not trim itself) gets none.
    #[test]
    fn the_balance_symbol_only_marks_a_cg_that_trims() {
        let pts = |last_trim: f64| -> Vec<(f64, Option<f64>)> {
            (0..=10)
                .map(|i| {
                    let x = 50.0 + 4.0 * f64::from(i);
                    (x, (x <= last_trim).then_some(10.0 - 0.05 * x))
                })
                .collect()
        };
        assert_eq!(
            cg_symbol_speed(&sweep(pts(90.0), 61.0)),
            Some(10.0 - 0.05 * 62.0)
        );
        assert_eq!(cg_symbol_speed(&sweep(pts(66.0), 88.0)), None);
        assert_eq!(
            cg_symbol_speed(&sweep(pts(86.0), 88.0)),
            Some(10.0 - 0.05 * 86.0)
        );
    }
}
