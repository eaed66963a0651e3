//! The content of the printed trim report as plain data, independent of any page layout:
//! titles, key figures, the top-view outlines, chart series, the mass list, cautions and the
//! methods used. `output::pdf` lays this out; a comparison page can reuse the same pieces.
//!
//! Nothing here computes aerodynamics: every number comes from [`Analysis`], from the model's
//! geometry ([`planform::station_at`]) or from re-running the library's closed-form estimate
//! ([`classical::estimate`]) at other CG positions.

use crate::analysis::Analysis;
use crate::balance::BallastOutcome;
use crate::caution::{Caution, Level, SAFETY_MESSAGE};
use crate::model::{Aircraft, StabiliserRole, Surface};
use crate::planform;
use crate::stability::classical::{self, EstimateInput, StabiliserPlace};

mod methods;

pub use methods::methods;

/// Where the report's input came from, for its title block.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct ReportSource {
    /// Input file name as given, or a description of the built-in demo.
    pub file_name: String,
    /// Short content hash of the input text ([`content_hash`]).
    pub content_hash: String,
    /// Date of the report, ISO 8601 (YYYY-MM-DD).
    pub date: String,
}

/// 64-bit FNV-1a hash of `text`, as 16 lower-case hex digits. Identifies the exact input a
/// printed report was made from; not a security measure.
///
/// # References
/// - G. Fowler, L. C. Noll, K.-P. Vo, D. Eastlake, "The FNV Non-Cryptographic Hash Algorithm",
///   IETF draft-eastlake-fnv (offset basis 14695981039346656037, prime 1099511628211).
pub fn content_hash(text: &str) -> String {
    let mut h: u64 = 0xcbf2_9ce4_8422_2325;
    for b in text.as_bytes() {
        h ^= u64::from(*b);
        h = h.wrapping_mul(0x0000_0100_0000_01b3);
    }
    format!("{h:016x}")
}

/// Format `v` with `decimals`, "n/a" when not finite, never "-0".
pub fn fmt(v: f64, decimals: usize) -> String {
    if v.is_finite() {
        super::tables::num(v, decimals)
    } else {
        "n/a".to_string()
    }
}

/// One line of the key-figures block.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct KeyFigure {
    /// What it is ("Static margin").
    pub label: String,
    /// Value with its unit, already formatted ("11.8 % MAC"), or "n/a" / "not computed".
    pub value: String,
}

impl KeyFigure {
    /// A figure with its label and formatted value.
    pub fn new(label: &str, value: String) -> KeyFigure {
        KeyFigure {
            label: label.to_string(),
            value,
        }
    }
}

/// The chord line of a mean aerodynamic chord in the top view.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MacLine {
    /// x of its leading edge, m aft of the datum.
    pub le_x_m: f64,
    /// Spanwise position, m from the centre line.
    pub y_m: f64,
    /// Length, m.
    pub chord_m: f64,
}

/// A closed outline in the aircraft's top view: points (x m aft of the datum, y m to starboard).
pub type Outline = Vec<(f64, f64)>;

/// Everything needed to draw the aircraft from above, to scale, with its balance marks.
#[derive(Debug, Clone, PartialEq)]
pub struct TopView {
    /// Both halves of the wing.
    pub wing: Outline,
    /// Tail or canard, with its name.
    pub stabiliser: Option<(String, Outline)>,
    /// A schematic fuselage from its length and greatest width only.
    pub fuselage: Option<Outline>,
    /// Pitch-control surfaces (elevator or elevons), each half a separate outline: hinge line
    /// and trailing edge. Empty for an all-moving tail.
    pub controls: Vec<Outline>,
    /// The wing's MAC (drawn on the starboard half).
    pub mac: MacLine,
    /// x of the wing root leading edge, m: the reference the builder measures from.
    pub root_le_x_m: f64,
    /// CG from the mass list, m aft of the datum.
    pub cg_x_m: f64,
    /// Neutral point, m aft of the datum.
    pub neutral_point_x_m: f64,
    /// Recommended CG band (forward, aft), m aft of the datum.
    pub band_x_m: (f64, f64),
    /// The CG for the target static margin, when one is set.
    pub target_x_m: Option<f64>,
    /// The side view beside the top view, at its scale: each surface's outline projected on
    /// the x-z plane (x aft, z up, m): wing, stabiliser (a V-tail at its projected height),
    /// fin.
    pub side: Vec<Outline>,
    /// The schematic fuselage in the side view (its depth taken as its width, on z = 0).
    pub side_fuselage: Option<Outline>,
    /// The fin's extent along x (fore, aft), m, drawn as a line on the top view's centre line.
    pub fin_x_m: Option<(f64, f64)>,
}

/// Local lift coefficient and local section cl_max at one station of the half-span.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpanPoint {
    /// Spanwise station 2y/b, 0 at the root, 1 at the tip.
    pub eta: f64,
    /// Local lift coefficient.
    pub cl: f64,
    /// Local section maximum lift coefficient.
    pub cl_max: f64,
}

/// One loading case for the spanwise chart.
#[derive(Debug, Clone, PartialEq)]
pub struct SpanCase {
    /// Legend text ("at trim, CL 0.52").
    pub label: String,
    /// Points from root to tip.
    pub points: Vec<SpanPoint>,
}

/// Spanwise lift against local cl_max, at trim and near stall.
#[derive(Debug, Clone, PartialEq)]
pub struct SpanwiseData {
    /// How the cl values were obtained, printed under the chart.
    pub method: String,
    /// At trim (absent when there is no trim).
    pub trim: Option<SpanCase>,
    /// Near stall.
    pub near_stall: Option<SpanCase>,
    /// Station where stall begins, 2y/b, when the method can tell.
    pub stall_onset_eta: Option<f64>,
}

/// Trim speed at CG positions across (and a little beyond) the recommended band.
#[derive(Debug, Clone, PartialEq)]
pub struct TrimSweep {
    /// (CG mm aft of the wing root leading edge, trim speed m/s or `None` where it does not trim).
    pub points: Vec<(f64, Option<f64>)>,
    /// Recommended band, mm aft of the wing root leading edge (forward, aft).
    pub band_mm: (f64, f64),
    /// Present CG, mm aft of the wing root leading edge.
    pub cg_mm: f64,
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
    /// How the speeds were obtained.
    pub method: String,
}

/// One configuration's glide polar for the sink chart.
#[derive(Debug, Clone, PartialEq)]
pub struct GlideCase {
    /// Legend label.
    pub label: String,
    /// (airspeed m/s, sink m/s) of the points that trim within the throws, rising speed.
    pub points: Vec<(f64, f64)>,
    /// Minimum sink (speed, sink).
    pub min_sink: (f64, f64),
    /// Best glide (speed, sink) and its glide ratio.
    pub best_glide: (f64, f64, f64),
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
}

/// The sink chart: this configuration first, then the ballast cases of the file.
#[derive(Debug, Clone, PartialEq)]
pub struct GlideChart {
    /// The cases.
    pub cases: Vec<GlideCase>,
    /// How the polar was obtained.
    pub method: String,
}

/// The glide case of a polar, labelled `label`.
fn case_of(p: &crate::analysis::glide::GlidePolar, label: String) -> GlideCase {
    GlideCase {
        label,
        points: p
            .points
            .iter()
            .filter(|q| q.flyable)
            .map(|q| (q.speed_m_s, q.sink_m_s))
            .collect(),
        min_sink: (p.min_sink.point.speed_m_s, p.min_sink.point.sink_m_s),
        best_glide: (
            p.best_glide.point.speed_m_s,
            p.best_glide.point.sink_m_s,
            p.best_glide.point.glide_ratio,
        ),
        stall_speed_m_s: p.stall_speed_m_s,
    }
}

/// The glide case of an analysed configuration, labelled `label`.
pub fn glide_case(a: &Analysis, label: &str) -> Option<GlideCase> {
    a.glide_polar
        .as_ref()
        .map(|p| case_of(p, label.to_string()))
}

/// Most curves on the sink chart (the configuration, its flap settings, ballast cases).
pub const MAX_GLIDE_CASES: usize = 4;

/// The sink chart of `a`: its polar, then its flap settings' polars, then the `ballast`
/// cases (label, analysis), at most [`MAX_GLIDE_CASES`] curves in all.
pub fn glide_chart(a: &Analysis, ballast: &[(String, Analysis)]) -> Option<GlideChart> {
    let mass = |x: &Analysis| fmt(1000.0 * x.mass.total_kg, 0);
    let flapped = !a.flap_polars.is_empty();
    let first_label = if flapped {
        format!("{} g, flaps neutral", mass(a))
    } else {
        format!("{} g", mass(a))
    };
    let mut cases = vec![glide_case(a, &first_label)?];
    for s in &a.flap_polars {
        if let Ok(p) = &s.polar {
            cases.push(case_of(
                p,
                format!("flaps {}", crate::printable::printable(&s.name)),
            ));
        }
    }
    for (name, b) in ballast {
        if let Some(c) = glide_case(b, &format!("{name}: {} g", mass(b))) {
            cases.push(c);
        }
    }
    cases.truncate(MAX_GLIDE_CASES);
    Some(GlideChart {
        cases,
        method: "Trimmed at each speed; section drag from viscous polars at each strip's \
                 Reynolds number, induced drag from the wake, fuselage by flat-plate build-up. \
                 Still air."
            .to_string(),
    })
}

/// One row of the mass list, formatted.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct MassRow {
    /// Item name.
    pub name: String,
    /// Mass, g.
    pub mass_g: String,
    /// x, mm aft of the datum.
    pub x_mm: String,
}

/// The whole content of a trim report.
#[derive(Debug, Clone, PartialEq)]
pub struct ReportData {
    /// Aircraft name.
    pub name: String,
    /// The builder's notes.
    pub notes: String,
    /// What x = 0 is.
    pub datum: String,
    /// Input identity.
    pub source: ReportSource,
    /// trimline version.
    pub tool_version: String,
    /// CG, mm aft of the wing root leading edge (the headline number).
    pub cg_from_root_le_mm: f64,
    /// Recommended band, mm aft of the wing root leading edge.
    pub band_from_root_le_mm: (f64, f64),
    /// CG for the target static margin, mm aft of the wing root leading edge, with the margin
    /// in percent.
    pub target_from_root_le_mm: Option<(f64, f64)>,
    /// A short alarm for the balance box when the CG is unsafe or outside the band
    /// (from the cautions `static-margin-negative`, `cg-aft-of-band`, `cg-forward-of-band`).
    pub balance_alert: Option<String>,
    /// Key figures, in order.
    pub key_figures: Vec<KeyFigure>,
    /// Top view.
    pub top_view: TopView,
    /// Spanwise chart.
    pub spanwise: SpanwiseData,
    /// Trim speed against CG.
    pub trim_sweep: TrimSweep,
    /// Sink against speed (none when the flight polar was not computed).
    pub glide: Option<GlideChart>,
    /// Mass items, then added ballast, then the total.
    pub masses: Vec<MassRow>,
    /// The aircraft's cautions, most serious first (the standing safety caution excluded).
    pub cautions: Vec<Caution>,
    /// The standing safety caution.
    pub safety: String,
    /// Methods and their sources, one line each.
    pub methods: Vec<String>,
}

/// Number of points along the half-span for the spanwise chart.
const SPAN_POINTS: usize = 41;
/// Number of CG positions in the trim-speed sweep.
const SWEEP_POINTS: usize = 41;

/// Build the report content for `aircraft` and its `analysis`.
pub fn build(aircraft: &Aircraft, a: &Analysis, source: ReportSource) -> ReportData {
    let root_le = aircraft.wing.root_le_x_m;
    let to_root_mm = |x_m: f64| (x_m - root_le) * 1000.0;
    let target = target_static_margin_x(aircraft, a);
    let mut cautions: Vec<Caution> = a
        .cautions
        .iter()
        .filter(|c| c.message != SAFETY_MESSAGE)
        .cloned()
        .collect();
    cautions.sort_by_key(|c| std::cmp::Reverse(c.level));
    ReportData {
        name: aircraft.name.clone(),
        notes: aircraft.notes.trim().to_string(),
        datum: aircraft.datum.clone(),
        source,
        tool_version: env!("CARGO_PKG_VERSION").to_string(),
        cg_from_root_le_mm: to_root_mm(a.mass.cg_x_m),
        band_from_root_le_mm: (to_root_mm(a.band.forward_x_m), to_root_mm(a.band.aft_x_m)),
        target_from_root_le_mm: target.map(|(x, sm)| (to_root_mm(x), 100.0 * sm)),
        balance_alert: balance_alert(&a.cautions),
        key_figures: key_figures(aircraft, a),
        top_view: top_view(aircraft, a, target.map(|t| t.0)),
        spanwise: lifting_line_spanwise(a).unwrap_or_else(|| strip_spanwise(aircraft, a)),
        trim_sweep: trim_sweep(aircraft, a),
        glide: glide_chart(a, &[]),
        masses: mass_rows(aircraft, a),
        cautions,
        safety: SAFETY_MESSAGE.to_string(),
        methods: methods(aircraft, a),
    }
}

fn balance_alert(cautions: &[Caution]) -> Option<String> {
    let has = |code: &str| cautions.iter().any(|c| c.code == code);
    if has("static-margin-negative") {
        Some("UNSTABLE: see cautions".to_string())
    } else if has("cg-aft-of-band") {
        Some("CG AFT OF BAND: see cautions".to_string())
    } else if has("cg-forward-of-band") {
        Some("CG FORWARD OF BAND: see cautions".to_string())
    } else {
        None
    }
}

/// CG for the file's target static margin (m aft of the datum) and that margin (fraction).
fn target_static_margin_x(aircraft: &Aircraft, a: &Analysis) -> Option<(f64, f64)> {
    aircraft.targets.static_margin.map(|sm| {
        (
            a.headline.neutral_point_x_m - sm * a.wing_geometry.mac_m,
            sm,
        )
    })
}

fn key_figures(aircraft: &Aircraft, a: &Analysis) -> Vec<KeyFigure> {
    let kf = |label: &str, value: String| KeyFigure {
        label: label.to_string(),
        value,
    };
    let g = &a.wing_geometry;
    let h = &a.headline;
    let speed = |v: f64| format!("{} m/s ({} km/h)", fmt(v, 1), fmt(v * 3.6, 0));
    let mut out = vec![
        kf("Mass", format!("{} g", fmt(a.mass.total_kg * 1000.0, 0))),
        kf(
            "Wing area, span",
            format!(
                "{} dm\u{b2}, {} mm",
                fmt(g.area_m2 * 100.0, 1),
                fmt(g.span_m * 1000.0, 0)
            ),
        ),
        kf(
            "Wing loading",
            format!("{} g/dm\u{b2}", fmt(a.wing_loading_kg_m2 * 10.0, 1)),
        ),
        kf("CG", cg_figure(a)),
        kf("Neutral point", neutral_point_figure(a)),
        kf(
            "Static margin",
            format!("{} % MAC", fmt(100.0 * h.static_margin, 1)),
        ),
        kf(
            "Trim speed",
            match h.trim {
                Some(t) => speed(t.speed_m_s),
                None => "no trim found".to_string(),
            },
        ),
        kf("Stall speed", speed(h.stall_speed_m_s)),
    ];
    if let Some(loc) = &h.stall_location {
        out.push(kf(
            "Stall begins",
            format!(
                "{}, {} % semispan",
                loc.surface_name,
                fmt(loc.percent_semispan, 0)
            ),
        ));
    }
    out.push(decalage_figure(aircraft, a));
    out.push(kf("Ballast needed", ballast_text(aircraft, a)));
    if let Some(d) = a.full.as_ref().and_then(|f| f.decalage_for_target) {
        out.push(kf(
            &format!("Decalage for {} m/s", fmt(d.speed_m_s, 1)),
            format!(
                "{}\u{b0} ({} {}\u{b0})",
                fmt(d.decalage_rad.to_degrees(), 2),
                match aircraft.stabiliser.as_ref().map(|s| s.role) {
                    Some(StabiliserRole::Canard) => "canard",
                    _ => "tail",
                },
                fmt(d.stabiliser_incidence_rad.to_degrees(), 2)
            ),
        ));
    }
    out.extend(glide_figures(a));
    let at = if a.headline.trim.is_some() {
        "at trim"
    } else {
        "at the stall"
    };
    out.push(kf(
        "Reynolds number (MAC)",
        format!("{} {at}", crate::caution::reynolds_text(a.reynolds_mac)),
    ));
    out
}

/// The CG key figure: % MAC and mm from the datum, with the aft end of its range when the
/// file gives tolerances.
fn cg_figure(a: &Analysis) -> String {
    let g = &a.wing_geometry;
    let spread = 2.0 * a.cg_spread.sigma_m;
    let range = if spread.is_finite() && spread > 0.0 {
        format!(
            "; aft end of its range {} mm, from your tolerances",
            fmt((a.mass.cg_x_m + spread) * 1000.0, 0)
        )
    } else {
        String::new()
    };
    format!(
        "{} % MAC ({} mm from datum{range})",
        fmt(g.percent_mac(a.mass.cg_x_m), 1),
        fmt(a.mass.cg_x_m * 1000.0, 0)
    )
}

/// The neutral point key figure: % MAC and mm from the datum, with the forward end of its
/// range.
fn neutral_point_figure(a: &Analysis) -> String {
    let g = &a.wing_geometry;
    let h = &a.headline;
    let spread = 2.0 * a.neutral_point_spread.sigma_m;
    let range = if spread.is_finite() && spread > 0.0 {
        format!(
            "; forward end of its range {} mm",
            fmt((h.neutral_point_x_m - spread) * 1000.0, 0)
        )
    } else {
        String::new()
    };
    format!(
        "{} % MAC ({} mm from datum{range})",
        fmt(g.percent_mac(h.neutral_point_x_m), 1),
        fmt(h.neutral_point_x_m * 1000.0, 0)
    )
}

/// The decalage key figure (or, on a tailless wing with elevons, the elevons to trim).
fn decalage_figure(aircraft: &Aircraft, a: &Analysis) -> KeyFigure {
    let elevon_trim = a
        .full
        .as_ref()
        .and_then(|f| f.tailless)
        .filter(|_| aircraft.elevons.is_some());
    let label = if elevon_trim.is_some() {
        "Elevons to trim"
    } else {
        "Decalage"
    };
    let value = match &aircraft.stabiliser {
        Some(st) => {
            // Front surface minus rear surface incidence.
            let (front, back, front_name, back_name) = match st.role {
                StabiliserRole::Tail => (&aircraft.wing, &st.surface, "wing", "tail"),
                StabiliserRole::Canard => (&st.surface, &aircraft.wing, "canard", "wing"),
            };
            format!(
                "{}\u{b0} ({front_name} {}\u{b0}, {back_name} {}\u{b0})",
                fmt((front.incidence_rad - back.incidence_rad).to_degrees(), 2),
                fmt(front.incidence_rad.to_degrees(), 2),
                fmt(back.incidence_rad.to_degrees(), 2)
            )
        }
        None => match elevon_trim {
            Some(t) => match t.elevon_to_trim_rad {
                Some(d) if d.to_degrees().abs() < 0.05 => {
                    format!("neutral at CL {}", fmt(t.design_cl, 2))
                }
                Some(d) => format!(
                    "{}\u{b0} {} at CL {}{}",
                    fmt(d.abs().to_degrees(), 1),
                    if d < 0.0 { "up" } else { "down" },
                    fmt(t.design_cl, 2),
                    if t.elevon_within_throws {
                        ""
                    } else {
                        ", beyond the throws"
                    }
                ),
                None => format!("none trims at CL {}", fmt(t.design_cl, 2)),
            },
            None => "n/a (tailless)".to_string(),
        },
    };
    KeyFigure::new(label, value)
}

/// The glide key figures (none on an aircraft unstable at its CG).
fn glide_figures(a: &Analysis) -> Vec<KeyFigure> {
    let mut out = Vec::new();
    match a.glide_figures() {
        None => out.push(KeyFigure::new(
            "Glide",
            if a.headline.static_margin <= 0.0 {
                "none: unstable at this CG".to_string()
            } else {
                "none: no glide polar (see the cautions)".to_string()
            },
        )),
        Some(g) => {
            let at_stall = |limited: bool| if limited { ", at the stall" } else { "" };
            let est = if g.from_flight_polar {
                ""
            } else {
                " (parabolic)"
            };
            out.push(KeyFigure::new(
                &format!("Best glide{est}"),
                format!(
                    "{} at {} m/s{}",
                    fmt(g.best_glide_ratio, 1),
                    fmt(g.best_glide_speed_m_s, 1),
                    at_stall(g.best_glide_at_stall)
                ),
            ));
            out.push(KeyFigure::new(
                &format!("Minimum sink{est}"),
                format!(
                    "{} m/s at {} m/s{}{}",
                    fmt(g.min_sink_m_s, 2),
                    fmt(g.min_sink_speed_m_s, 1),
                    at_stall(g.min_sink_at_stall),
                    g.min_sink_slow_limit_m_s
                        .map_or(String::new(), |v| format!("; fly above {} m/s", fmt(v, 1)))
                ),
            ));
        }
    }
    out
}

fn ballast_text(aircraft: &Aircraft, a: &Analysis) -> String {
    let Some(sm) = aircraft.targets.static_margin else {
        return "no target static margin set".to_string();
    };
    if a.ballast.is_empty() {
        return format!(
            "no ballast bay given (target: {} % static margin)",
            fmt(100.0 * sm, 0)
        );
    }
    let parts: Vec<String> = a
        .ballast
        .iter()
        .map(|b| match b.outcome {
            BallastOutcome::NotNeeded => format!("{}: 0 g, none needed", b.bay),
            BallastOutcome::Reachable { mass_kg } => {
                format!("{}: {} g", b.bay, fmt(mass_kg * 1000.0, 0))
            }
            BallastOutcome::ExceedsBay { needed_kg, max_kg } => format!(
                "{}: {} g, bay holds {} g",
                b.bay,
                fmt(needed_kg * 1000.0, 0),
                fmt(max_kg * 1000.0, 0)
            ),
            BallastOutcome::WrongSide => format!("{}: cannot help", b.bay),
        })
        .collect();
    format!(
        "{} for a {} % static margin",
        parts.join("; "),
        fmt(100.0 * sm, 0)
    )
}

/// Outline of both halves of `surface` in the top view: leading edge from the port tip to the
/// starboard tip, trailing edge back.
pub fn surface_outline(surface: &Surface) -> Outline {
    let total = planform::half_span_length_m(surface);
    let mut s_values: Vec<f64> = (0..=64).map(|i| total * f64::from(i) / 64.0).collect();
    for b in planform::break_points_m(surface) {
        // Both sides of a join, where the chord may jump.
        s_values.push(b);
        s_values.push((b + 1e-9 * total.max(1e-3)).min(total));
    }
    s_values.sort_by(f64::total_cmp);
    s_values.dedup();
    let stations: Vec<_> = s_values
        .iter()
        .map(|&s| planform::station_at(surface, s))
        .collect();
    let mut le: Vec<(f64, f64)> = stations.iter().map(|st| (st.x_le_m, st.y_m)).collect();
    let mut te: Vec<(f64, f64)> = stations
        .iter()
        .map(|st| (st.x_le_m + st.chord_m, st.y_m))
        .collect();
    // Starboard: root to tip along the leading edge, back along the trailing edge.
    let mut out: Outline = Vec::new();
    out.extend(le.iter().rev().map(|&(x, y)| (x, -y)));
    out.append(&mut le);
    te.reverse();
    out.extend(te.iter().copied());
    out.extend(te.iter().rev().map(|&(x, y)| (x, -y)));
    out
}

/// Outlines of the pitch control on its surface, starboard and port, between its ends: along
/// the hinge line (at `1 - F` of the local chord) and back along the trailing edge.
fn control_outlines(aircraft: &Aircraft) -> Vec<Outline> {
    let (surface, control) = match (&aircraft.stabiliser, &aircraft.elevons) {
        (Some(s), _) => (&s.surface, &s.elevator),
        (None, Some(e)) => (&aircraft.wing, e),
        (None, None) => return Vec::new(),
    };
    if control.chord_fraction <= 0.0 {
        return Vec::new();
    }
    let total = planform::half_span_length_m(surface);
    let (s0, s1) = (
        control.inboard_fraction * total,
        control.outboard_fraction * total,
    );
    let mut s_values: Vec<f64> = (0..=32)
        .map(|i| s0 + (s1 - s0) * f64::from(i) / 32.0)
        .collect();
    s_values.extend(
        planform::break_points_m(surface)
            .into_iter()
            .filter(|b| *b > s0 && *b < s1),
    );
    s_values.sort_by(f64::total_cmp);
    let stations: Vec<_> = s_values
        .iter()
        .map(|&s| planform::station_at(surface, s))
        .collect();
    let starboard: Outline = stations
        .iter()
        .map(|st| {
            (
                st.x_le_m + (1.0 - control.chord_fraction) * st.chord_m,
                st.y_m,
            )
        })
        .chain(
            stations
                .iter()
                .rev()
                .map(|st| (st.x_le_m + st.chord_m, st.y_m)),
        )
        .collect();
    let port: Outline = starboard.iter().map(|&(x, y)| (x, -y)).collect();
    vec![starboard, port]
}

fn fuselage_outline(f: &crate::model::Fuselage) -> Outline {
    // Schematic: rounded over the first 8 % of the length, full width to 35 %, then tapering
    // straight to 35 % of the width at the tail. Only length and greatest width are known.
    let (x0, l, half) = (f.nose_x_m, f.length_m, 0.5 * f.max_width_m);
    let mut side: Vec<(f64, f64)> = (0..=8)
        .map(|i| {
            let t = f64::from(i) / 8.0;
            let ang = t * std::f64::consts::FRAC_PI_2;
            (x0 + 0.08 * l * (1.0 - ang.cos()), half * ang.sin())
        })
        .collect();
    side.push((x0 + 0.35 * l, half));
    side.push((x0 + l, 0.35 * half));
    let mut out: Outline = side.clone();
    out.extend(side.iter().rev().map(|&(x, y)| (x, -y)));
    out
}

fn top_view(aircraft: &Aircraft, a: &Analysis, target_x_m: Option<f64>) -> TopView {
    let g = &a.wing_geometry;
    TopView {
        wing: surface_outline(&aircraft.wing),
        stabiliser: aircraft.stabiliser.as_ref().map(|s| {
            let name = match s.role {
                StabiliserRole::Tail => "tail",
                StabiliserRole::Canard => "canard",
            };
            (name.to_string(), surface_outline(&s.surface))
        }),
        fuselage: aircraft.fuselage.as_ref().map(fuselage_outline),
        controls: control_outlines(aircraft),
        mac: MacLine {
            le_x_m: g.mac_le_x_m,
            y_m: g.mac_y_m,
            chord_m: g.mac_m,
        },
        root_le_x_m: aircraft.wing.root_le_x_m,
        cg_x_m: a.mass.cg_x_m,
        neutral_point_x_m: a.headline.neutral_point_x_m,
        band_x_m: (a.band.forward_x_m, a.band.aft_x_m),
        target_x_m,
        side: std::iter::once(side_outline(&aircraft.wing))
            .chain(
                aircraft
                    .stabiliser
                    .as_ref()
                    .map(|s| side_outline(&s.surface)),
            )
            .chain(aircraft.fin.as_ref().map(fin_side_outline))
            .collect(),
        side_fuselage: aircraft.fuselage.as_ref().map(fuselage_outline),
        fin_x_m: aircraft.fin.as_ref().map(|f| {
            let o = fin_side_outline(f);
            let xs = o.iter().map(|p| p.0);
            (
                xs.clone().fold(f64::INFINITY, f64::min),
                xs.fold(f64::NEG_INFINITY, f64::max),
            )
        }),
    }
}

/// Outline of `surface` seen from the side (x, z): along the leading edge from root to tip,
/// back along the trailing edge. A flat surface is a line; a V-tail or a wing with dihedral
/// shows its projected height (span along the panel times sin of its dihedral).
pub fn side_outline(surface: &Surface) -> Outline {
    let total = planform::half_span_length_m(surface);
    let mut s_values: Vec<f64> = (0..=16).map(|i| total * f64::from(i) / 16.0).collect();
    s_values.extend(planform::break_points_m(surface));
    s_values.sort_by(f64::total_cmp);
    s_values.dedup();
    let stations: Vec<_> = s_values
        .iter()
        .map(|&s| planform::station_at(surface, s))
        .collect();
    stations
        .iter()
        .map(|st| (st.x_le_m, st.z_m))
        .chain(
            stations
                .iter()
                .rev()
                .map(|st| (st.x_le_m + st.chord_m, st.z_m)),
        )
        .collect()
}

/// Outline of the fin seen from the side (x, z): root leading edge, tip leading edge, tip
/// trailing edge, root trailing edge.
pub fn fin_side_outline(f: &crate::model::Fin) -> Outline {
    let tip_le = f.root_le_x_m + f.height_m * f.sweep_le_rad.tan();
    let tip_z = f.root_z_m + f.height_m;
    vec![
        (f.root_le_x_m, f.root_z_m),
        (tip_le, tip_z),
        (tip_le + f.tip_chord_m, tip_z),
        (f.root_le_x_m + f.root_chord_m, f.root_z_m),
    ]
}

/// `text` with its first letter in upper case.
fn capitalised(text: &str) -> String {
    let mut c = text.chars();
    c.next()
        .map(|f| f.to_uppercase().chain(c).collect())
        .unwrap_or_default()
}

/// The spanwise chart from the lifting-line solution: the wing's local cl against its local
/// cl_max at trim and at the critical-section stall, with the station where stall begins.
pub fn lifting_line_spanwise(a: &Analysis) -> Option<SpanwiseData> {
    use crate::stability::trim::wing_starboard;
    let f = a.full.as_ref()?;
    let stall = f.stall.as_ref()?;
    let half_b = 0.5 * a.wing_geometry.span_m;
    if half_b <= 0.0 {
        return None;
    }
    let case = |label: String, r: &crate::lifting_line::LiftingLineResult| SpanCase {
        label,
        points: wing_starboard(r)
            .into_iter()
            .map(|st| SpanPoint {
                eta: st.y_m / half_b,
                cl: st.cl,
                cl_max: if st.cl_ratio > 0.0 {
                    st.cl / st.cl_ratio
                } else {
                    f64::NAN
                },
            })
            .filter(|p| p.cl_max.is_finite())
            .collect(),
    };
    let onset = a
        .headline
        .stall_location
        .as_ref()
        .filter(|l| l.surface == 0)
        .map(|l| l.percent_semispan / 100.0);
    Some(SpanwiseData {
        method: format!(
            "All surfaces together: {}; stall where the first section reaches its cl max \
             (critical-section method, conservative).",
            super::wing_model_method(&a.numerics)
        ),
        trim: f
            .trim
            .as_ref()
            .map(|t| case(format!("at trim, CL {}", fmt(t.cl, 2)), &t.result)),
        near_stall: Some(case(
            format!("at stall, CL max {}", fmt(stall.cl_max, 2)),
            &stall.result,
        )),
        stall_onset_eta: onset,
    })
}

/// The spanwise chart fed from the strip estimate: local section cl_max along the span from
/// the wing's airfoils, and a uniform cl equal to the aircraft CL at trim and at CL_max. This
/// is a stand-in until the lifting-line loading is available; it cannot say where stall
/// begins, so `stall_onset_eta` is `None`.
pub fn strip_spanwise(aircraft: &Aircraft, a: &Analysis) -> SpanwiseData {
    let wing = &aircraft.wing;
    let total = planform::half_span_length_m(wing);
    let half_b = 0.5 * a.wing_geometry.span_m;
    let stations: Vec<(f64, f64)> = (0..SPAN_POINTS)
        .map(|i| {
            let s = total * i as f64 / (SPAN_POINTS - 1) as f64;
            let st = planform::station_at(wing, s);
            let sec = classical::section_at(&a.sections, &st);
            let eta = if half_b > 0.0 { st.y_m / half_b } else { 0.0 };
            (eta, sec.cl_max)
        })
        .collect();
    let case = |label: String, cl: f64| SpanCase {
        label,
        points: stations
            .iter()
            .map(|&(eta, cl_max)| SpanPoint { eta, cl, cl_max })
            .collect(),
    };
    let est = &a.classical;
    SpanwiseData {
        method: "Strip estimate: uniform cl equal to the aircraft CL (no spanwise loading model \
                 yet), so the stall station is not predicted."
            .to_string(),
        trim: est
            .trim
            .map(|t| case(format!("strip estimate at trim, CL {}", fmt(t.cl, 2)), t.cl)),
        near_stall: Some(case(
            format!("strip estimate near stall, CL max {}", fmt(est.cl_max, 2)),
            est.cl_max,
        )),
        stall_onset_eta: None,
    }
}

/// Trim speed against CG position across the recommended band ([`trim_sweep_with`] gives the
/// range): from the lifting-line model when it solved, else from the closed-form estimate.
pub fn trim_sweep(aircraft: &Aircraft, a: &Analysis) -> TrimSweep {
    let fuselage = crate::analysis::fuselage_cm_alpha(aircraft, &a.wing);
    if a.full.is_some() {
        let input = crate::analysis::trim_input(
            aircraft,
            &a.sections,
            &a.mass,
            &a.air,
            fuselage,
            &crate::analysis::AnalysisOptions::default(),
        );
        if let Ok(sweeper) = crate::stability::trim::TrimSweeper::new(input) {
            return trim_sweep_with(
                aircraft,
                a,
                |cg_x_m| sweeper.trim_speed_m_s(cg_x_m),
                &format!(
                    "{} re-trimmed at each CG position, same mass and incidences, {} neutral.",
                    capitalised(super::wing_model_name(&a.numerics)),
                    aircraft.pitch_control_name()
                ),
            );
        }
    }
    let place = aircraft.stabiliser.as_ref().map(|s| match s.role {
        StabiliserRole::Tail => StabiliserPlace::Tail,
        StabiliserRole::Canard => StabiliserPlace::Canard,
    });
    trim_sweep_with(
        aircraft,
        a,
        |cg_x_m| {
            classical::estimate(&EstimateInput {
                wing: &a.wing,
                stabiliser: a.stabiliser.as_ref().zip(place),
                mass_kg: a.mass.total_kg,
                cg_x_m,
                density_kg_m3: a.air.density_kg_m3,
                fuselage_cm_alpha_per_rad: fuselage,
                stabiliser_dynamic_pressure_ratio: aircraft
                    .stabiliser
                    .as_ref()
                    .map_or(1.0, |s| s.dynamic_pressure_ratio),
                downwash_factor: 1.0,
            })
            .trim
            .map(|t| t.speed_m_s)
        },
        "Closed-form estimate re-run at each CG position, same mass and incidences.",
    )
}

/// Trim speed against CG position with any trim solver: `speed_at(cg_x_m)` gives the trim
/// speed (m/s) with the CG at `cg_x_m` (m aft of the datum), or `None` where the aircraft does
/// not trim. The CG runs over the recommended band, extended by a quarter of its width each
/// side and far enough to include the present CG. Non-finite speeds are dropped.
pub fn trim_sweep_with(
    aircraft: &Aircraft,
    a: &Analysis,
    speed_at: impl Fn(f64) -> Option<f64>,
    method: &str,
) -> TrimSweep {
    let root_le = aircraft.wing.root_le_x_m;
    let (fwd, aft) = (a.band.forward_x_m, a.band.aft_x_m);
    let width = (aft - fwd).abs().max(1e-3);
    let lo = (fwd - 0.25 * width).min(a.mass.cg_x_m - 0.05 * width);
    let hi = (aft + 0.25 * width).max(a.mass.cg_x_m + 0.05 * width);
    let points = (0..SWEEP_POINTS)
        .map(|i| {
            let x = lo + (hi - lo) * i as f64 / (SWEEP_POINTS - 1) as f64;
            let v = speed_at(x).filter(|v| v.is_finite());
            ((x - root_le) * 1000.0, v)
        })
        .collect();
    TrimSweep {
        points,
        band_mm: ((fwd - root_le) * 1000.0, (aft - root_le) * 1000.0),
        cg_mm: (a.mass.cg_x_m - root_le) * 1000.0,
        stall_speed_m_s: a.headline.stall_speed_m_s,
        method: method.to_string(),
    }
}

fn mass_rows(aircraft: &Aircraft, a: &Analysis) -> Vec<MassRow> {
    let mut rows: Vec<MassRow> = aircraft
        .masses
        .iter()
        .map(|m| MassRow {
            name: m.name.clone(),
            mass_g: fmt(m.mass_kg * 1000.0, 0),
            x_mm: fmt(m.x_m * 1000.0, 0),
        })
        .collect();
    rows.push(MassRow {
        name: "Total, CG".to_string(),
        mass_g: fmt(a.mass.total_kg * 1000.0, 0),
        x_mm: fmt(a.mass.cg_x_m * 1000.0, 0),
    });
    for b in &a.ballast {
        if let BallastOutcome::Reachable { mass_kg } = b.outcome {
            let bay = aircraft.ballast_bays.iter().find(|bay| bay.name == b.bay);
            rows.push(MassRow {
                name: format!("+ ballast in {} (to target)", b.bay),
                mass_g: fmt(mass_kg * 1000.0, 0),
                x_mm: bay
                    .map(|bay| fmt(bay.x_m * 1000.0, 0))
                    .unwrap_or_else(|| "n/a".to_string()),
            });
        }
    }
    rows
}

/// Name of a caution level as the cautions box prints it (danger in capitals).
pub fn level_name(level: Level) -> &'static str {
    match level {
        Level::Danger => "DANGER",
        Level::Warning => "Warning",
        Level::Note => "Note",
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // The elevons of the flying-wing example are drawn where the file puts them: from 20 to
    // 95 % of the 450 mm semispan (no dihedral, so y = span position), hinge line at
    // 1 - 22 % of the local chord, back edge on the trailing edge (geometry by definition).
    #[test]
    fn elevon_outline_follows_the_file() {
        let text = include_str!("../../aircraft/skerrywing-900.toml");
        let aircraft = crate::input::parse_aircraft(text, "skerrywing-900.toml", None).unwrap();
        let outlines = control_outlines(&aircraft);
        assert_eq!(outlines.len(), 2);
        let starboard = &outlines[0];
        let (y_min, y_max) = starboard.iter().fold((f64::MAX, f64::MIN), |(lo, hi), p| {
            (lo.min(p.1), hi.max(p.1))
        });
        assert!((y_min - 0.090).abs() < 1e-9 && (y_max - 0.4275).abs() < 1e-9);
        let first = starboard[0];
        let st = planform::station_at(&aircraft.wing, 0.090);
        assert!((first.0 - (st.x_le_m + 0.78 * st.chord_m)).abs() < 1e-12);
        let last = starboard[starboard.len() - 1];
        assert!((last.0 - (st.x_le_m + st.chord_m)).abs() < 1e-12);
        assert!(outlines[1].iter().all(|p| p.1 <= 0.0));
    }

    // FNV-1a 64 test vectors from the FNV reference (draft-eastlake-fnv, test suite):
    // "" -> cbf29ce484222325, "a" -> af63dc4c8601ec8c, "foobar" -> 85944171f73967e8.
    #[test]
    fn fnv1a_matches_the_reference_vectors() {
        assert_eq!(content_hash(""), "cbf29ce484222325");
        assert_eq!(content_hash("a"), "af63dc4c8601ec8c");
        assert_eq!(content_hash("foobar"), "85944171f73967e8");
    }

    // The sweep re-runs the library's estimate with the CG moved; interpolated at the
    // mass-list CG it must give the analysis's own trim speed. Tolerance 1 %: linear
    // interpolation between sweep points 1/40 of the range apart on a smooth curve.
    #[test]
    fn sweep_passes_through_the_analysis_trim_speed() {
        use crate::analysis::{analyse, AnalysisOptions};
        let text = include_str!("../../aircraft/larkspire-2000.toml");
        let aircraft = crate::input::parse_aircraft(text, "demo", None).unwrap();
        let a = analyse(&aircraft, &AnalysisOptions::default()).unwrap();
        let want = a.headline.trim.expect("the demo trims").speed_m_s;
        let sweep = trim_sweep(&aircraft, &a);
        let root = aircraft.wing.root_le_x_m;
        assert!(sweep.points.first().unwrap().0 < (a.band.forward_x_m - root) * 1000.0);
        assert!(sweep.points.last().unwrap().0 > (a.band.aft_x_m - root) * 1000.0);
        let cg = sweep.cg_mm;
        let pair = sweep
            .points
            .windows(2)
            .find(|w| w[0].0 <= cg && cg <= w[1].0)
            .expect("the sweep covers the present CG");
        let (x0, v0) = (pair[0].0, pair[0].1.unwrap());
        let (x1, v1) = (pair[1].0, pair[1].1.unwrap());
        let got = v0 + (v1 - v0) * (cg - x0) / (x1 - x0);
        approx::assert_relative_eq!(got, want, max_relative = 0.01);
    }

    #[test]
    fn non_finite_numbers_print_as_not_available() {
        assert_eq!(fmt(f64::NAN, 1), "n/a");
        assert_eq!(fmt(f64::INFINITY, 0), "n/a");
        assert_eq!(fmt(-0.01, 1), "0.0");
    }
}
