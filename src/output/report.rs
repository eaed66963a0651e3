//! The content of the printed trim report as plain data, independent of any page layout:
//! titles, key figures, the top-view outlines, chart series, the mass list, cautions and the
//! methods used. `output::pdf` lays this out; a comparison page can reuse the same pieces.
//!
//! Nothing here computes aerodynamics: every number comes from [`Analysis`], from the model's
//! geometry ([`planform::station_at`]) or from re-running the library's closed-form estimate
//! ([`classical::estimate`]) at other CG positions.

use crate::analysis::{Analysis, BandPosition};
use crate::balance::BallastOutcome;
use crate::caution::{Caution, Level};
use crate::model::{Aircraft, StabiliserRole, Surface};
use crate::output::cautions::SAFETY_MESSAGE;
use crate::planform;
use crate::stability::classical::{self, EstimateInput, StabiliserPlace};

mod methods;

mod charts;
mod views;

pub use charts::*;
pub use methods::methods;
pub use views::*;

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

/// A closed outline in the aircraft's top view: points (x m aft of the datum, y m to starboard).
pub type Outline = Vec<(f64, f64)>;

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
    /// in percent, and true when it is held at the band's aft end (the margin would lie aft
    /// of the band).
    pub target_from_root_le_mm: Option<(f64, f64, bool)>,
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

/// Build the report content for `aircraft` and its `analysis`.
pub fn build(aircraft: &Aircraft, a: &Analysis, source: ReportSource) -> ReportData {
    let root_le = aircraft.wing.root_le_x_m;
    let to_root_mm = |x_m: f64| (x_m - root_le) * 1000.0;
    let target = target_static_margin_x(aircraft, a);
    let mut cautions: Vec<Caution> = a
        .cautions
        .iter()
        .filter(|c| c.finding != crate::finding::Finding::SafetyEstimateOnly)
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
        target_from_root_le_mm: target.map(|(x, sm, held)| (to_root_mm(x), 100.0 * sm, held)),
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

/// CG for the file's target static margin (m aft of the datum), that margin (fraction), and
/// whether the target is held at the band's aft end because the margin would lie aft of it
/// (as the ballast advice is).
fn target_static_margin_x(aircraft: &Aircraft, a: &Analysis) -> Option<(f64, f64, bool)> {
    aircraft.targets.static_margin.map(|sm| {
        let x = a.headline.neutral_point_x_m - sm * a.wing_geometry.mac_m;
        if a.band.position(x) == BandPosition::Aft {
            (a.band.aft_x_m, sm, true)
        } else {
            (x, sm, false)
        }
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
        format!(
            "{} {at}",
            crate::output::cautions::reynolds_text(a.reynolds_mac)
        ),
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
    let aim = if a.ballast.iter().any(|b| b.held_at_band_aft_end) {
        format!(
            "to the recommended band's aft end ({} mm): a {} % static margin would lie aft of it",
            fmt(a.band.aft_x_m * 1000.0, 0),
            fmt(100.0 * sm, 0)
        )
    } else if a
        .ballast
        .first()
        .is_some_and(|b| a.band.position(b.target_x_m) != BandPosition::Inside)
    {
        format!(
            "for a {} % static margin, outside the recommended band",
            fmt(100.0 * sm, 0)
        )
    } else {
        format!("for a {} % static margin", fmt(100.0 * sm, 0))
    };
    format!("{} {aim}", parts.join("; "))
}

/// `text` with its first letter in upper case.
fn capitalised(text: &str) -> String {
    let mut c = text.chars();
    c.next()
        .map(|f| f.to_uppercase().chain(c).collect())
        .unwrap_or_default()
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
