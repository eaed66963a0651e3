//! Output of a trade study (`trimline sweep`): the terminal table in the builder's units, and
//! CSV and JSON in the convention of `check --json` (SI units, but angles in degrees and the
//! static margin in percent of the MAC, each name ending in its unit), one row or object per
//! point in the study's order.

use crate::caution::Level;
use crate::model::Aircraft;
use crate::output::json::r as round;
use crate::study::{Axis, ControlOutcome, Point, PointFigures, Quantity, TrimOutcome};
use comfy_table::{presets, Cell, CellAlignment, Table};
use serde::{Deserialize, Serialize};

/// The unit convention of the JSON and CSV, stated in the JSON document.
pub const UNITS: &str = crate::output::json::JSON_UNITS;

/// The name of an axis for headings: its key, with the bay's or item's name where it has one
/// ("set_cg_x_m", "ballast_kg[nose]", "item_mass_kg[battery]").
pub fn axis_label(aircraft: &Aircraft, quantity: &Quantity) -> String {
    let named = |name: &str| format!("{}[{}]", quantity.key(), crate::printable::printable(name));
    match quantity {
        Quantity::Ballast(b) => named(aircraft.ballast_bays.get(*b).map_or("?", |b| &b.name)),
        Quantity::ItemMass(i) | Quantity::ItemX(i) => {
            named(aircraft.masses.get(*i).map_or("?", |m| &m.name))
        }
        _ => quantity.key().to_string(),
    }
}

/// An axis heading for the terminal table, in the builder's words and units.
fn table_label(aircraft: &Aircraft, quantity: &Quantity) -> String {
    let unit = display(quantity, 0.0).1;
    let name = |n: Option<&str>| crate::printable::printable(n.unwrap_or("?")).into_owned();
    match quantity {
        Quantity::CgX => format!("CG x ({unit})"),
        Quantity::Ballast(b) => format!(
            "ballast {} ({unit})",
            name(aircraft.ballast_bays.get(*b).map(|b| b.name.as_str()))
        ),
        Quantity::ItemMass(i) => format!(
            "mass {} ({unit})",
            name(aircraft.masses.get(*i).map(|m| m.name.as_str()))
        ),
        Quantity::ItemX(i) => format!(
            "x {} ({unit})",
            name(aircraft.masses.get(*i).map(|m| m.name.as_str()))
        ),
        Quantity::MassScale => "mass scale".to_string(),
        Quantity::StabiliserIncidence => format!("stab. incidence ({unit})"),
        Quantity::Decalage => format!("decalage ({unit})"),
    }
}

/// An axis value in the builder's units for the table (mm, g, deg, plain factor), and that
/// unit.
fn display(quantity: &Quantity, value_si: f64) -> (String, &'static str) {
    match quantity {
        Quantity::CgX | Quantity::ItemX(_) => (format!("{:.1}", value_si * 1000.0), "mm"),
        Quantity::Ballast(_) | Quantity::ItemMass(_) => (format!("{:.1}", value_si * 1000.0), "g"),
        Quantity::MassScale => (format!("{value_si:.3}"), "x"),
        Quantity::StabiliserIncidence | Quantity::Decalage => {
            (format!("{:.2}", value_si.to_degrees()), "deg")
        }
    }
}

/// The caution codes of a point as one field: "level:code" separated by spaces, most
/// serious first (the analysis's order within a level).
pub fn caution_field(cautions: &[(Level, &'static str)]) -> String {
    let mut sorted: Vec<&(Level, &str)> = cautions.iter().collect();
    sorted.sort_by_key(|c| std::cmp::Reverse(c.0));
    sorted
        .iter()
        .map(|(l, c)| format!("{}:{c}", l.as_str()))
        .collect::<Vec<_>>()
        .join(" ")
}

/// The terminal table: one row per point.
pub fn table(aircraft: &Aircraft, axes: &[Axis], points: &[Point], target_speed: bool) -> String {
    let mut t = Table::new();
    t.load_style(presets::UTF8_FULL_CONDENSED);
    let glide = points
        .iter()
        .any(|p| p.outcome.as_ref().is_ok_and(|f| f.glide.is_some()));
    let header = table_header(aircraft, axes, target_speed, glide);
    t.set_header(header.iter().map(Cell::new));
    for p in points {
        let mut row: Vec<String> = axes
            .iter()
            .zip(&p.values)
            .map(|(a, &v)| display(&a.quantity, v).0)
            .collect();
        match &p.outcome {
            Ok(f) => {
                figure_cells(f, target_speed, glide, &mut row);
                row.push(caution_field(&f.cautions));
            }
            Err(e) => {
                row.push(format!(
                    "not analysed: {}",
                    crate::printable::printable(&e.to_string())
                ));
            }
        }
        t.add_row(row);
    }
    for i in 0..t.column_count().saturating_sub(1) {
        if let Some(c) = t.column_mut(i) {
            c.set_cell_alignment(CellAlignment::Right);
        }
    }
    format!("{t}\n")
}

/// The table's column headings: the axes, the figures, the cautions.
fn table_header(
    aircraft: &Aircraft,
    axes: &[Axis],
    target_speed: bool,
    glide: bool,
) -> Vec<String> {
    let mut header: Vec<String> = axes
        .iter()
        .map(|a| table_label(aircraft, &a.quantity))
        .collect();
    header.extend(
        [
            "mass (g)",
            "CG (mm)",
            "margin (% MAC)",
            "trim CL",
            "trim (m/s)",
        ]
        .iter()
        .map(|s| s.to_string()),
    );
    if target_speed {
        header.push("control at target (deg)".into());
    }
    header.push("stall (m/s)".into());
    if glide {
        header.extend(
            ["least sink (m/s)", "at (m/s)", "best glide", "at (m/s)"]
                .iter()
                .map(|s| s.to_string()),
        );
    }
    header.push("cautions".into());
    header
}

/// A point's figures, in the order of [`table_header`], after its axis values.
fn figure_cells(f: &PointFigures, target_speed: bool, glide: bool, row: &mut Vec<String>) {
    row.push(format!("{:.0}", f.mass_kg * 1000.0));
    row.push(format!("{:.1}", f.cg_x_m * 1000.0));
    row.push(format!("{:.1}", 100.0 * f.static_margin));
    match f.trim {
        TrimOutcome::Trimmed { cl, speed_m_s } => {
            row.push(format!("{cl:.3}"));
            row.push(format!("{speed_m_s:.2}"));
        }
        TrimOutcome::NoTrim => {
            row.push("no trim".into());
            row.push("-".into());
        }
    }
    if target_speed {
        row.push(match f.control_at_target {
            ControlOutcome::Deflection { rad, within_throws } => format!(
                "{:+.2}{}",
                rad.to_degrees(),
                if within_throws { "" } else { " beyond throws" }
            ),
            ControlOutcome::NoTrim => "no trim".into(),
            ControlOutcome::NotAsked => "-".into(),
        });
    }
    row.push(format!("{:.2}", f.stall_speed_m_s));
    if glide {
        match &f.glide {
            Some(g) => row.extend([
                format!("{:.3}", g.min_sink_m_s),
                format!("{:.1}", g.min_sink_speed_m_s),
                format!("{:.1}", g.best_glide_ratio),
                format!("{:.1}", g.best_glide_speed_m_s),
            ]),
            None => row.extend(["-", "-", "-", "-"].map(String::from)),
        }
    }
}

/// One point in the CSV and JSON (SI units, rounded to the decimals of `check --json`; absent
/// values are empty cells or null, with a
/// status saying why).
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct PointRecord {
    /// Position of the point in the study (0-based; the last axis varies fastest).
    pub index: usize,
    /// The axis values, one per axis, in the units of the axes' names.
    pub values: Vec<f64>,
    /// "ok", or "error" when the chain could not run at this point.
    pub status: String,
    /// Why the chain could not run (empty when it ran).
    pub error: String,
    /// Total mass, kg.
    pub mass_kg: Option<f64>,
    /// CG x, m aft of the datum.
    pub cg_x_m: Option<f64>,
    /// Neutral point, m aft of the datum.
    pub neutral_point_x_m: Option<f64>,
    /// Static margin, percent of MAC.
    pub static_margin_percent: Option<f64>,
    /// "trimmed" or "no-trim" (empty on an error).
    pub trim_status: String,
    /// Trim lift coefficient.
    pub trim_cl: Option<f64>,
    /// Trim speed, m/s.
    pub trim_speed_m_s: Option<f64>,
    /// "not-asked", "within-throws", "beyond-throws" or "no-trim".
    pub control_status: String,
    /// Elevator (or elevons) to trim at the target speed, deg, trailing edge down positive.
    pub control_at_target_deg: Option<f64>,
    /// Stall speed, m/s.
    pub stall_speed_m_s: Option<f64>,
    /// Least sink, m/s (flight polar; null unless asked for with `--glide`).
    pub min_sink_m_s: Option<f64>,
    /// Its speed, m/s.
    pub min_sink_speed_m_s: Option<f64>,
    /// Best glide ratio.
    pub best_glide_ratio: Option<f64>,
    /// Its speed, m/s.
    pub best_glide_speed_m_s: Option<f64>,
    /// Model that gave the figures.
    pub method: String,
    /// Caution codes, "level:code" separated by spaces, most serious first.
    pub cautions: String,
}

/// The records of `points` of a study over `axes`.
pub fn records(axes: &[Axis], points: &[Point]) -> Vec<PointRecord> {
    points
        .iter()
        .enumerate()
        .map(|(index, p)| {
            let mut r = PointRecord {
                index,
                values: axes
                    .iter()
                    .zip(&p.values)
                    .map(|(a, &v)| a.quantity.in_key_unit(v))
                    .collect(),
                status: "ok".into(),
                error: String::new(),
                mass_kg: None,
                cg_x_m: None,
                neutral_point_x_m: None,
                static_margin_percent: None,
                trim_status: String::new(),
                trim_cl: None,
                trim_speed_m_s: None,
                control_status: String::new(),
                control_at_target_deg: None,
                stall_speed_m_s: None,
                min_sink_m_s: None,
                min_sink_speed_m_s: None,
                best_glide_ratio: None,
                best_glide_speed_m_s: None,
                method: String::new(),
                cautions: String::new(),
            };
            match &p.outcome {
                Ok(f) => {
                    r.mass_kg = Some(round(f.mass_kg, 5));
                    r.cg_x_m = Some(round(f.cg_x_m, 5));
                    r.neutral_point_x_m = Some(round(f.neutral_point_x_m, 5));
                    r.static_margin_percent = Some(round(100.0 * f.static_margin, 2));
                    match f.trim {
                        TrimOutcome::Trimmed { cl, speed_m_s } => {
                            r.trim_status = "trimmed".into();
                            r.trim_cl = Some(round(cl, 4));
                            r.trim_speed_m_s = Some(round(speed_m_s, 3));
                        }
                        TrimOutcome::NoTrim => r.trim_status = "no-trim".into(),
                    }
                    r.control_status = match f.control_at_target {
                        ControlOutcome::NotAsked => "not-asked",
                        ControlOutcome::NoTrim => "no-trim",
                        ControlOutcome::Deflection { rad, within_throws } => {
                            r.control_at_target_deg = Some(round(rad.to_degrees(), 2));
                            if within_throws {
                                "within-throws"
                            } else {
                                "beyond-throws"
                            }
                        }
                    }
                    .into();
                    r.stall_speed_m_s = Some(round(f.stall_speed_m_s, 3));
                    if let Some(g) = &f.glide {
                        r.min_sink_m_s = Some(round(g.min_sink_m_s, 3));
                        r.min_sink_speed_m_s = Some(round(g.min_sink_speed_m_s, 3));
                        r.best_glide_ratio = Some(round(g.best_glide_ratio, 2));
                        r.best_glide_speed_m_s = Some(round(g.best_glide_speed_m_s, 3));
                    }
                    r.method = f.method.into();
                    r.cautions = caution_field(&f.cautions);
                }
                Err(e) => {
                    r.status = "error".into();
                    r.error = crate::printable::printable(&e.to_string()).into_owned();
                }
            }
            r
        })
        .collect()
}

/// One axis in the JSON document.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct AxisRecord {
    /// The quantity's label ("set_cg_x_m", "ballast_kg[nose]", ...).
    pub quantity: String,
    /// Its values, in the unit its name ends in.
    pub values: Vec<f64>,
}

/// The JSON document of a study.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct StudyDocument {
    /// The unit convention ([`UNITS`]).
    pub units: String,
    /// Aircraft name.
    pub aircraft: String,
    /// Where it came from.
    pub source: String,
    /// Target speed used for the control column, m/s.
    pub target_speed_m_s: Option<f64>,
    /// The axes, in order (the last varies fastest).
    pub axes: Vec<AxisRecord>,
    /// Every point, in order.
    pub points: Vec<PointRecord>,
}

/// The JSON document of a study.
pub fn document(
    aircraft: &Aircraft,
    source: &str,
    axes: &[Axis],
    points: &[Point],
) -> StudyDocument {
    StudyDocument {
        units: UNITS.into(),
        aircraft: aircraft.name.clone(),
        source: source.to_string(),
        target_speed_m_s: aircraft.targets.trim_speed_m_s,
        axes: axes
            .iter()
            .map(|a| AxisRecord {
                quantity: axis_label(aircraft, &a.quantity),
                values: a
                    .values
                    .iter()
                    .map(|&v| a.quantity.in_key_unit(v))
                    .collect(),
            })
            .collect(),
        points: records(axes, points),
    }
}

/// The fixed CSV columns after the axis columns.
pub const CSV_COLUMNS: [&str; 18] = [
    "status",
    "error",
    "mass_kg",
    "cg_x_m",
    "neutral_point_x_m",
    "static_margin_percent",
    "trim_status",
    "trim_cl",
    "trim_speed_m_s",
    "control_status",
    "control_at_target_deg",
    "stall_speed_m_s",
    "min_sink_m_s",
    "min_sink_speed_m_s",
    "best_glide_ratio",
    "best_glide_speed_m_s",
    "method",
    "cautions",
];

/// A CSV field, quoted when it holds a comma, a quote or a line break.
fn field(text: &str) -> String {
    if text.contains([',', '"', '\n', '\r']) {
        format!("\"{}\"", text.replace('"', "\"\""))
    } else {
        text.to_string()
    }
}

fn number(v: Option<f64>) -> String {
    // Shortest text that reads back as the same f64.
    v.map_or(String::new(), |v| format!("{v}"))
}

/// The CSV text: a header ("index", the axis labels, then [`CSV_COLUMNS`]) and one row per
/// point; numbers read back to the same value.
pub fn csv(aircraft: &Aircraft, axes: &[Axis], points: &[Point]) -> String {
    let mut out = String::new();
    let mut header = vec!["index".to_string()];
    header.extend(
        axes.iter()
            .map(|a| field(&axis_label(aircraft, &a.quantity))),
    );
    header.extend(CSV_COLUMNS.iter().map(|s| s.to_string()));
    out.push_str(&header.join(","));
    out.push('\n');
    for r in records(axes, points) {
        let mut row = vec![r.index.to_string()];
        row.extend(r.values.iter().map(|v| number(Some(*v))));
        row.extend([
            field(&r.status),
            field(&r.error),
            number(r.mass_kg),
            number(r.cg_x_m),
            number(r.neutral_point_x_m),
            number(r.static_margin_percent),
            field(&r.trim_status),
            number(r.trim_cl),
            number(r.trim_speed_m_s),
            field(&r.control_status),
            number(r.control_at_target_deg),
            number(r.stall_speed_m_s),
            number(r.min_sink_m_s),
            number(r.min_sink_speed_m_s),
            number(r.best_glide_ratio),
            number(r.best_glide_speed_m_s),
            field(&r.method),
            field(&r.cautions),
        ]);
        out.push_str(&row.join(","));
        out.push('\n');
    }
    out
}
