//! The one-page trim report: title block, to-scale top view beside the balance point and key
//! figures, the two charts, the mass list beside the cautions box, and the methods footer.
//!
//! The layout is computed from the paper size: fixed-height blocks are measured first (title,
//! charts, mass list and cautions, footer) and the top view takes the height that is left.

use super::canvas::{Align, Canvas, Font, Pen};
use super::chart::Frame;
use super::metrics::{self, Face};
use super::{charts, planform, Paper};
use crate::output::report::{fmt, level_name, ReportData};
use room::make_room;

mod room;

const MARGIN: f64 = 10.0;
const GAP: f64 = 4.0;
/// Smallest chart height on a crowded page, mm (axes, ticks, legend and note still legible).
const MIN_CHART_H: f64 = 46.0;
/// Extra chart height when the sink chart makes a third column, mm.
const THIRD_CHART_EXTRA_H: f64 = 10.0;
/// How much taller than their base height the charts may grow when the top view leaves
/// room, mm.
const MAX_CHART_GROWTH: f64 = 20.0;
const BODY: Font = Font::regular(7.0);
const BODY_BOLD: Font = Font::bold(7.0);
const HEAD: Font = Font::bold(8.0);
const SMALL: Font = Font::regular(5.8);

/// Draw the whole report for `data` on one page of `paper`.
///
/// From the top: title block; the top view across the full width; a row with the balance
/// point, the key figures and the mass list; the two charts; the cautions box; the footer.
pub fn draw(data: &ReportData, paper: Paper) -> Canvas {
    let (pw, ph) = paper.size_mm();
    let mut c = Canvas::new();
    let w = pw - 2.0 * MARGIN;
    let x0 = MARGIN;
    let top = title_block(&mut c, data, x0, ph - MARGIN, w) - 2.0;

    // Column widths of the figures row.
    let box_w = 58.0;
    let mass_w = 54.0;
    let key_w = w - box_w - mass_w - 2.0 * GAP;
    // Measure the blocks of fixed content; the top view takes the height that is left.
    let footer_h = footer(&mut Canvas::new(), data, x0, 0.0, w, false);
    let caution_h = cautions_box(&mut Canvas::new(), data, 0.0, 0.0, w);
    let box_h = 0.0 - balance_box(&mut Canvas::new(), data, 0.0, 0.0, box_w);
    let key_h = 0.0 - key_figures(&mut Canvas::new(), data, 0.0, 0.0, key_w);
    let mass_h = mass_list(&mut Canvas::new(), data, 0.0, 0.0, mass_w);
    let row_h = box_h.max(key_h).max(mass_h);
    // Three charts in a row are narrower: their legends and notes wrap onto more lines.
    let extra = if data.glide.is_some() {
        THIRD_CHART_EXTRA_H
    } else {
        0.0
    };
    let mut chart_h = extra
        + match paper {
            Paper::A4 => 58.0,
            Paper::Letter => 52.0,
        };
    let caution_top = MARGIN + footer_h + GAP + caution_h;
    let charts_y = caution_top + GAP;
    // Height the top view would get; what it does not need goes to the charts (up to a limit).
    let view_h = top - (charts_y + chart_h + GAP + row_h) - GAP;
    let spare = view_h - planform::height_needed(w, view_h, &data.top_view);
    // A crowded page (long mass list or many cautions) takes the shortfall from the charts,
    // down to a legible minimum, so that the view keeps room for its labels.
    let min_view = planform::min_height(&data.top_view);
    let shortfall = (min_view - view_h).max(0.0);
    if let Some(lighter) = make_room(data, chart_h - shortfall < MIN_CHART_H + extra) {
        return draw(&lighter, paper);
    }
    chart_h = (chart_h - shortfall).max(MIN_CHART_H + extra);
    chart_h += spare.clamp(0.0, MAX_CHART_GROWTH);
    let row_top = charts_y + chart_h + GAP + row_h;
    let view = Frame {
        x: x0,
        y: row_top + GAP,
        w,
        h: top - row_top - GAP,
    };
    planform::top_view(&mut c, view, &data.top_view);

    balance_box(&mut c, data, x0, row_top, box_w);
    key_figures(&mut c, data, x0 + box_w + GAP, row_top, key_w);
    mass_list(
        &mut c,
        data,
        x0 + box_w + key_w + 2.0 * GAP,
        row_top,
        mass_w,
    );

    charts_row(
        &mut c,
        data,
        Frame {
            x: x0,
            y: charts_y,
            w,
            h: chart_h,
        },
    );
    cautions_box(&mut c, data, x0, caution_top, w);
    footer(&mut c, data, x0, MARGIN + footer_h, w, true);
    c
}

/// The charts side by side in `row`: spanwise lift, trim speed and, when there is a glide
/// polar, sink.
fn charts_row(c: &mut Canvas, data: &ReportData, row: Frame) {
    let columns = if data.glide.is_some() { 3.0 } else { 2.0 };
    let part = (row.w - (columns - 1.0) * GAP) / columns;
    let frame = |k: f64| Frame {
        x: row.x + k * (part + GAP),
        y: row.y,
        w: part,
        h: row.h,
    };
    charts::spanwise_chart(c, frame(0.0), &data.spanwise);
    charts::trim_speed_chart(c, frame(1.0), &data.trim_sweep);
    if let Some(g) = &data.glide {
        charts::glide_chart(c, frame(2.0), g);
    }
}

/// Title, notes, and the input's identity at the right. Returns the y below the rule.
fn title_block(c: &mut Canvas, d: &ReportData, x: f64, top: f64, w: f64) -> f64 {
    let info = Font::regular(6.5);
    let right_max = 0.45 * w;
    let right: Vec<String> = [
        format!("Trim report, {}", d.source.date),
        format!("Input: {}", d.source.file_name),
        format!("Input hash (FNV-1a 64): {}", d.source.content_hash),
        format!("trimline {}", d.tool_version),
    ]
    .iter()
    .map(|l| metrics::shorten(l, Face::Regular, info.size_pt, right_max, true))
    .collect();
    let right_w = right.iter().map(|l| info.width_mm(l)).fold(0.0, f64::max);
    let left_w = w - right_w - 6.0;
    // The name at 16 pt, smaller (down to 10 pt) when it is long, shortened as a last resort.
    let wide = Font::bold(16.0).width_mm(&d.name);
    let size = if wide > left_w {
        (16.0 * left_w / wide).max(10.0)
    } else {
        16.0
    };
    let title = Font::bold(size);
    let name = metrics::shorten(&d.name, Face::Bold, size, left_w, false);
    c.text(x, top - title.cap_height_mm(), &name, title, Align::Left);
    let mut y = top - info.cap_height_mm();
    for line in &right {
        c.text(x + w, y, line, info, Align::Right);
        y -= info.line_height_mm();
    }
    let mut ly = top - Font::bold(16.0).line_height_mm() - 1.5;
    let notes = metrics::wrap(&d.notes, Face::Regular, BODY.size_pt, left_w);
    for (i, l) in notes.iter().take(2).enumerate() {
        let line = if i == 1 && notes.len() > 2 {
            metrics::shorten(
                &format!("{l} ..."),
                Face::Regular,
                BODY.size_pt,
                left_w,
                false,
            )
        } else {
            l.clone()
        };
        c.text(x, ly, &line, BODY, Align::Left);
        ly -= BODY.line_height_mm();
    }
    let bottom = ly.min(y) + 0.5;
    c.line((x, bottom), (x + w, bottom), Pen::solid(0.8));
    bottom
}

/// The balance box's lines under the large figure: which side of the wing root leading edge,
/// the recommended band and the target, each with its font.
fn balance_lines(d: &ReportData) -> Vec<(String, Font)> {
    let ahead = d.cg_from_root_le_mm < -0.5;
    // Both ends ahead of the wing's leading edge (a canard): give them as distances ahead.
    let band_ahead = d.band_from_root_le_mm.1 < -0.5;
    let band_note = if band_ahead { " ahead" } else { "" };
    let band_mm = |v: f64| if band_ahead { v.abs() } else { v };
    let mut lines: Vec<(String, Font)> = vec![
        (
            if ahead {
                "ahead of the wing root leading edge,"
            } else {
                "aft of the wing root leading edge,"
            }
            .to_string(),
            BODY,
        ),
        ("as the mass list puts it".to_string(), BODY),
        (
            format!(
                "Recommended {} to {} mm{band_note}",
                fmt(band_mm(d.band_from_root_le_mm.0), 0),
                fmt(band_mm(d.band_from_root_le_mm.1), 0)
            ),
            Font::bold(8.0),
        ),
    ];
    if let Some((t, sm, held)) = d.target_from_root_le_mm {
        lines.push((
            if held {
                format!(
                    "Target: {} mm, the band's aft end ({} % margin lies aft)",
                    fmt(t, 0),
                    fmt(sm, 0)
                )
            } else {
                format!("Target ({} % static margin): {} mm", fmt(sm, 0), fmt(t, 0))
            },
            BODY,
        ));
    }
    lines
}

/// The balance point in large type, with the band and target. Returns its bottom y.
fn balance_box(c: &mut Canvas, d: &ReportData, x: f64, top: f64, w: f64) -> f64 {
    let big = Font::bold(30.0);
    let pad = 2.5;
    let lines = balance_lines(d);
    let alert_font = Font::bold(8.0);
    let alert_h = if d.balance_alert.is_some() {
        alert_font.line_height_mm() + 2.8
    } else {
        0.0
    };
    let h = pad
        + HEAD.line_height_mm()
        + big.cap_height_mm()
        + 4.0
        + lines.iter().map(|l| l.1.line_height_mm()).sum::<f64>()
        + alert_h
        + pad;
    c.rect(x, top - h, w, h, Some(1.0), Some(Pen::solid(1.4)));
    let mut y = top - pad - HEAD.cap_height_mm();
    c.text(x + 0.5 * w, y, "BALANCE POINT (CG)", HEAD, Align::Centre);
    y -= 2.0 + big.cap_height_mm();
    c.text(
        x + 0.5 * w,
        y,
        &format!("{} mm", fmt(d.cg_from_root_le_mm.abs(), 0)),
        big,
        Align::Centre,
    );
    y -= 2.0;
    for (i, (text, font)) in lines.iter().enumerate() {
        y -= font.line_height_mm();
        c.text(x + 0.5 * w, y, text, *font, Align::Centre);
        // After "as the mass list puts it": the alarm, white on a black bar.
        if i == 1 {
            if let Some(alert) = &d.balance_alert {
                let bar_top = y - 1.6;
                let bar_h = alert_h - 1.4;
                // Shrink the alarm's type if it is wider than the bar.
                let room = w - 8.0;
                let wide = alert_font.width_mm(alert);
                let font = if wide > room {
                    Font::bold(alert_font.size_pt * room / wide)
                } else {
                    alert_font
                };
                c.rect(x + 2.0, bar_top - bar_h, w - 4.0, bar_h, Some(0.0), None);
                c.text_grey(
                    x + 0.5 * w,
                    bar_top - bar_h + 0.5 * (bar_h - font.cap_height_mm()),
                    alert,
                    font,
                    Align::Centre,
                    1.0,
                );
                y -= alert_h;
            }
        }
    }
    top - h
}

/// Label and value rows; values wrap within their column. Returns the y below the block.
fn key_figures(c: &mut Canvas, d: &ReportData, x: f64, top: f64, w: f64) -> f64 {
    let mut y = top - HEAD.cap_height_mm();
    c.text(x, y, "Key figures", HEAD, Align::Left);
    y -= HEAD.line_height_mm() + 0.3;
    let label_w = d
        .key_figures
        .iter()
        .map(|k| BODY.width_mm(&k.label))
        .fold(0.0, f64::max)
        + 2.0;
    for k in &d.key_figures {
        c.text(x, y, &k.label, BODY, Align::Left);
        let lines = metrics::wrap(&k.value, Face::Bold, BODY_BOLD.size_pt, w - label_w);
        for l in &lines {
            c.text(x + label_w, y, l, BODY_BOLD, Align::Left);
            y -= BODY.line_height_mm();
        }
        y -= 0.4;
    }
    y
}

/// The mass list as a small table. Draws with its top at `top`; returns its height.
fn mass_list(c: &mut Canvas, d: &ReportData, x: f64, top: f64, w: f64) -> f64 {
    let mut y = top - HEAD.cap_height_mm();
    c.text(x, y, "Mass list", HEAD, Align::Left);
    y -= HEAD.line_height_mm();
    for l in metrics::wrap(
        &format!("x in mm aft of the datum: {}", d.datum),
        Face::Regular,
        SMALL.size_pt,
        w,
    ) {
        c.text(x, y, &l, SMALL, Align::Left);
        y -= SMALL.line_height_mm();
    }
    y -= 0.6;
    let col_x = x + w;
    let col_g = x + w - 14.0;
    let name_w = col_g - 12.0 - x;
    c.text(x, y, "item", BODY_BOLD, Align::Left);
    c.text(col_g, y, "mass g", BODY_BOLD, Align::Right);
    c.text(col_x, y, "x mm", BODY_BOLD, Align::Right);
    y -= 1.0;
    c.line((x, y), (x + w, y), Pen::solid(0.5));
    y -= BODY.line_height_mm();
    let n_items = d
        .masses
        .iter()
        .position(|m| m.name == "Total, CG")
        .unwrap_or(d.masses.len());
    for (i, m) in d.masses.iter().enumerate() {
        let font = if i == n_items { BODY_BOLD } else { BODY };
        if i == n_items {
            c.line(
                (x, y + BODY.line_height_mm() - 0.8),
                (x + w, y + BODY.line_height_mm() - 0.8),
                Pen::solid(0.5),
            );
        }
        c.text(col_g, y, &m.mass_g, font, Align::Right);
        c.text(col_x, y, &m.x_mm, font, Align::Right);
        for l in metrics::wrap(&m.name, font.face, font.size_pt, name_w) {
            c.text(x, y, &l, font, Align::Left);
            y -= BODY.line_height_mm();
        }
    }
    top - y
}

/// The framed cautions box: this aircraft's cautions, then the standing safety caution.
/// Draws with its top at `top`; returns its height.
fn cautions_box(c: &mut Canvas, d: &ReportData, x: f64, top: f64, w: f64) -> f64 {
    let pad = 2.0;
    let inner = w - 2.0 * pad;
    let mut y = top - pad - HEAD.cap_height_mm();
    c.text(
        x + pad,
        y,
        "CAUTIONS: read before flying",
        HEAD,
        Align::Left,
    );
    y -= HEAD.line_height_mm() + 0.3;
    let font = Font::regular(6.5);
    let bold = Font::bold(6.5);
    if d.cautions.is_empty() {
        c.text(
            x + pad,
            y,
            "No cautions raised for this aircraft.",
            font,
            Align::Left,
        );
        y -= font.line_height_mm();
    }
    for cau in &d.cautions {
        let tag = format!("{}:", level_name(cau.level));
        let tag_w = bold.width_mm(&tag) + 1.2;
        c.text(x + pad, y, &tag, bold, Align::Left);
        for l in metrics::wrap(
            &crate::output::cautions::message(cau),
            Face::Regular,
            font.size_pt,
            inner - tag_w,
        ) {
            c.text(x + pad + tag_w, y, &l, font, Align::Left);
            y -= font.line_height_mm();
        }
        y -= 0.5;
    }
    y += font.line_height_mm() - 1.2;
    c.line((x + pad, y), (x + w - pad, y), Pen::solid(0.4));
    y -= 1.0 + bold.cap_height_mm();
    for l in metrics::wrap(&d.safety, Face::Bold, bold.size_pt, inner) {
        c.text(x + pad, y, &l, bold, Align::Left);
        y -= bold.line_height_mm();
    }
    let h = top - y - bold.line_height_mm() + pad + 1.0;
    c.rect(x, top - h, w, h, None, Some(Pen::solid(1.4)));
    h
}

/// Methods and sources in small type under a rule. With `paint` false only measures.
/// `top` is the y of the rule; returns the height.
fn footer(c: &mut Canvas, d: &ReportData, x: f64, top: f64, w: f64, paint: bool) -> f64 {
    let mut lines = Vec::new();
    for m in &d.methods {
        lines.extend(metrics::wrap(m, Face::Regular, SMALL.size_pt, w));
    }
    lines.extend(metrics::wrap(
        &format!(
            "Methods. x is measured aft of the datum ({}). Figures are estimates; see the cautions.",
            d.datum
        ),
        Face::Regular,
        SMALL.size_pt,
        w,
    ));
    // The last line states the whole footer; put it first.
    lines.rotate_right(1);
    let h = 1.2 + lines.len() as f64 * SMALL.line_height_mm();
    if paint {
        c.line((x, top), (x + w, top), Pen::solid(0.5));
        let mut y = top - 1.2 - SMALL.cap_height_mm();
        for l in &lines {
            c.text_grey(x, y, l, SMALL, Align::Left, 0.15);
            y -= SMALL.line_height_mm();
        }
    }
    h
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::analysis::{analyse, AnalysisOptions};
    use crate::caution::Caution;
    use crate::output::report::{self, ReportSource};

    fn data(path: &str) -> ReportData {
        data_with(path, "")
    }

    /// The report data of example `path` with `more` appended to its file.
    fn data_with(path: &str, more: &str) -> ReportData {
        let file = format!("{}/aircraft/{path}", env!("CARGO_MANIFEST_DIR"));
        let text = std::fs::read_to_string(&file).unwrap() + more;
        let aircraft = crate::input::parse_aircraft(&text, &file, None).unwrap();
        let a = analyse(&aircraft, &AnalysisOptions::default()).unwrap();
        report::build(
            &aircraft,
            &a,
            ReportSource {
                file_name: path.to_string(),
                content_hash: report::content_hash(&text),
                date: "2026-01-02".to_string(),
            },
        )
    }

    /// No two pieces of text overlap, and all text lies inside the page margins.
    fn assert_clean_layout(d: &ReportData, paper: Paper) {
        let c = draw(d, paper);
        let (w, h) = paper.size_mm();
        let boxes = c.text_boxes();
        for (i, a) in boxes.iter().enumerate() {
            let [x0, y0, x1, y1] = a.rect;
            assert!(
                x0 >= MARGIN - 0.5
                    && x1 <= w - MARGIN + 0.5
                    && y0 >= MARGIN - 0.5
                    && y1 <= h - MARGIN + 0.5,
                "{:?} runs off the page area ({paper:?})",
                a
            );
            for b in &boxes[i + 1..] {
                assert!(!a.overlaps(b, 0.05), "{a:?} overlaps {b:?} ({paper:?})");
            }
        }
    }

    #[test]
    fn example_pages_have_no_overlapping_text() {
        for f in [
            "larkspire-2000.toml",
            "wrenfield-1400.toml",
            "skerrywing-900.toml",
            "merrowtail-1700.toml",
        ] {
            let d = data(f);
            assert_clean_layout(&d, Paper::A4);
            assert_clean_layout(&d, Paper::Letter);
        }
    }

    // A V-tail page with flaps and a long mass list loses its notes and then its sink chart;
    // the line saying so fits without overlapping anything.
    #[test]
    fn a_crowded_v_tail_page_still_has_no_overlapping_text() {
        let more: String = (0..12)
            .map(|k| format!("\n[[mass]]\nname = \"extra {k}\"\nmass = 1\nx = 60\n"))
            .collect();
        let d = data_with("merrowtail-1700.toml", &more);
        assert_clean_layout(&d, Paper::A4);
        assert_clean_layout(&d, Paper::Letter);
    }

    // A crowded page: long names, many mass items and cautions, a long datum.
    #[test]
    fn a_crowded_page_still_has_no_overlapping_text() {
        let mut d = data("larkspire-2000.toml");
        d.name =
            "Larkspire 2000 with a rather long name for a model, too long for one line at 16 pt"
                .to_string();
        d.notes = "Notes that go on and on. ".repeat(20);
        d.balance_alert = Some("CG FORWARD OF BAND: see the cautions below, and more".to_string());
        d.source.file_name = format!("{}.toml", "very-long-file-name-".repeat(8));
        d.datum = "the front face of the motor firewall, measured along the fuselage datum line"
            .to_string();
        // Eight extra mass rows and five extra warnings: with the demo's own three warnings, eight
        // warnings in all, about the most this layout was sized for (beyond it notes give way).
        for i in 0..8 {
            d.masses.insert(
                0,
                report::MassRow {
                    name: format!("extra item number {i} with a long description"),
                    mass_g: "1234".to_string(),
                    x_mm: "-1234".to_string(),
                },
            );
            if i >= 5 {
                continue;
            }
            // A warning that needs more than one line of the box to print in full, so the
            // layout must make room for it without running into the charts above.
            d.cautions.push(Caution::of(
                crate::finding::BalanceFinding::StaticMarginLow {
                    static_margin: 0.03,
                }
                .into(),
            ));
        }
        assert_clean_layout(&d, Paper::A4);
        assert_clean_layout(&d, Paper::Letter);
        // A page without the sink chart says so (or says that notes were left out).
        for paper in [Paper::A4, Paper::Letter] {
            let texts: Vec<String> = draw(&d, paper)
                .text_boxes()
                .iter()
                .map(|t| t.text.clone())
                .collect();
            let all = texts.join(" ");
            assert!(
                all.contains("Sink rate against airspeed")
                    || all.contains("sink chart is left out")
                    || all.contains("notes are left out"),
                "{paper:?}"
            );
        }
        // The alarm stays on its bar inside the balance box (58 mm wide at the left margin).
        let c = draw(&d, Paper::A4);
        let alarm = c
            .text_boxes()
            .iter()
            .find(|t| t.text.starts_with("CG FORWARD OF BAND"))
            .expect("the alarm is printed");
        assert!(alarm.rect[0] >= MARGIN + 2.0 && alarm.rect[2] <= MARGIN + 58.0 - 2.0);
    }
}
