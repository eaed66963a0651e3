//! Side-by-side comparison of several configurations: a table with the differences against the
//! first column, and a JSON form.

use crate::analysis::KeyFigures;
use crate::output::tables::num;
use crate::output::units::UnitSystem;
use comfy_table::{presets, Cell, CellAlignment, Table};
use serde::Serialize;

/// How a figure is written in `compare --json`: in SI units like `check --json`, under its
/// own key.
#[derive(Clone, Copy)]
enum JsonNumber {
    /// The table's value times `to_si`, rounded to `decimals` decimals (one more significant
    /// decimal than the table shows).
    Si {
        key: &'static str,
        to_si: f64,
        decimals: i32,
    },
    /// A count, written as an integer.
    Count { key: &'static str },
}

impl JsonNumber {
    fn key(self) -> &'static str {
        match self {
            JsonNumber::Si { key, .. } | JsonNumber::Count { key } => key,
        }
    }

    /// The table's value `v` as the JSON writes it (before the integer form of a count).
    fn rounded(self, v: f64) -> f64 {
        match self {
            JsonNumber::Si {
                to_si, decimals, ..
            } => round_to(v * to_si, decimals),
            JsonNumber::Count { .. } => v.round(),
        }
    }
}

/// `JsonNumber::Si` of a value shown in mm, to 0.01 mm.
const fn metres(key: &'static str) -> JsonNumber {
    JsonNumber::Si {
        key,
        to_si: 1e-3,
        decimals: 5,
    }
}

/// `JsonNumber::Si` of a value already in SI (or in % or deg), to `decimals` decimals.
const fn same(key: &'static str, decimals: i32) -> JsonNumber {
    JsonNumber::Si {
        key,
        to_si: 1.0,
        decimals,
    }
}

/// One row of the comparison: a label, a unit and how to read a value from the figures.
/// The ballast row's label; a ballast of zero there reads "none needed".
const BALLAST_LABEL: &str = "ballast for target margin g";

struct Row {
    label: &'static str,
    /// Decimals in the table.
    decimals: usize,
    /// How the JSON writes it: its SI key and rounding, or a count.
    json: JsonNumber,
    value: fn(&KeyFigures) -> Option<f64>,
}

const ROWS: &[Row] = &[
    Row {
        label: "mass g",
        decimals: 0,
        json: JsonNumber::Si {
            key: "mass_kg",
            to_si: 1e-3,
            decimals: 4,
        },
        value: |k| Some(k.mass_kg * 1000.0),
    },
    Row {
        label: "wing loading g/dm^2",
        decimals: 1,
        json: JsonNumber::Si {
            key: "wing_loading_kg_m2",
            to_si: 0.1,
            decimals: 3,
        },
        value: |k| Some(k.wing_loading_kg_m2 * 10.0),
    },
    Row {
        label: "CG mm from datum",
        decimals: 1,
        json: metres("cg_x_m"),
        value: |k| Some(k.cg_x_m * 1000.0),
    },
    Row {
        label: "CG mm aft of wing root LE",
        decimals: 1,
        json: metres("cg_aft_of_wing_root_le_m"),
        value: |k| Some(k.cg_from_wing_root_le_m * 1000.0),
    },
    Row {
        label: "CG % MAC",
        decimals: 1,
        json: same("cg_percent_mac", 2),
        value: |k| Some(k.cg_percent_mac),
    },
    Row {
        label: "neutral point mm from datum",
        decimals: 1,
        json: metres("neutral_point_x_m"),
        value: |k| Some(k.neutral_point_x_m * 1000.0),
    },
    Row {
        label: "static margin %",
        decimals: 1,
        json: same("static_margin_percent", 2),
        value: |k| Some(k.static_margin * 100.0),
    },
    Row {
        label: "CG band forward mm",
        decimals: 1,
        json: metres("cg_band_forward_x_m"),
        value: |k| Some(k.band.forward_x_m * 1000.0),
    },
    Row {
        label: "CG band aft mm",
        decimals: 1,
        json: metres("cg_band_aft_x_m"),
        value: |k| Some(k.band.aft_x_m * 1000.0),
    },
    Row {
        label: "decalage deg",
        decimals: 2,
        json: same("decalage_deg", 3),
        value: |k| k.decalage_rad.map(f64::to_degrees),
    },
    Row {
        label: "elevons to trim deg",
        decimals: 1,
        json: same("elevons_to_trim_deg", 2),
        value: |k| k.elevon_trim_rad.map(f64::to_degrees),
    },
    Row {
        label: "trim CL",
        decimals: 3,
        json: same("trim_cl", 4),
        value: |k| k.trim_cl,
    },
    Row {
        label: "trim speed m/s",
        decimals: 2,
        json: same("trim_speed_m_s", 3),
        value: |k| k.trim_speed_m_s,
    },
    Row {
        label: "stall speed m/s",
        decimals: 2,
        json: same("stall_speed_m_s", 3),
        value: |k| Some(k.stall_speed_m_s),
    },
    Row {
        label: "minimum sink m/s",
        decimals: 2,
        json: same("minimum_sink_m_s", 3),
        value: |k| k.min_sink_m_s.map(|m| m.0),
    },
    Row {
        label: "minimum sink speed m/s",
        decimals: 1,
        json: same("minimum_sink_speed_m_s", 2),
        value: |k| k.min_sink_m_s.map(|m| m.1),
    },
    Row {
        label: "best glide ratio",
        decimals: 1,
        json: same("best_glide_ratio", 2),
        value: |k| k.best_glide.map(|m| m.0),
    },
    Row {
        label: "best glide speed m/s",
        decimals: 1,
        json: same("best_glide_speed_m_s", 2),
        value: |k| k.best_glide.map(|m| m.1),
    },
    Row {
        label: BALLAST_LABEL,
        decimals: 1,
        json: JsonNumber::Si {
            key: "ballast_for_target_margin_kg",
            to_si: 1e-3,
            decimals: 5,
        },
        value: |k| k.ballast_kg.as_ref().map(|b| b.1 * 1000.0),
    },
    Row {
        label: "warnings",
        decimals: 0,
        json: JsonNumber::Count { key: "warnings" },
        value: |k| Some(k.warnings as f64),
    },
    Row {
        label: "dangers",
        decimals: 0,
        json: JsonNumber::Count { key: "dangers" },
        value: |k| Some(k.dangers as f64),
    },
];

/// The comparison as text cells: one row per figure, the label then one cell per
/// configuration; later columns show their difference from the first in brackets, "(=)" when
/// unchanged, and "n/a" where a value does not exist.
pub fn compare_cells(columns: &[KeyFigures]) -> Vec<(&'static str, Vec<String>)> {
    compare_cells_in(columns, UnitSystem::Metric)
        .into_iter()
        .map(|(label, cells, _)| (label, cells))
        .collect()
}

/// Factor from a row's metric unit (the word of its label that names one) to `u`'s, and the
/// decimals to add.
fn unit_factor(label: &str, u: UnitSystem) -> (f64, usize) {
    if u == UnitSystem::Metric {
        return (1.0, 0);
    }
    for w in label.split(' ') {
        match w {
            "mm" => return (1.0 / 25.4, 1),
            "g" => return (1.0 / 28.349_523_125, 1),
            // g/dm^2 = 0.1 kg/m^2; kg/m^2 to oz/ft^2 is 0.3048^2 / 0.028349523125.
            "g/dm^2" => return (0.1 * 0.3048 * 0.3048 / 0.028_349_523_125, 1),
            _ => {}
        }
    }
    (1.0, 0)
}

/// The comparison cells in units `u`: each row's label, its cells, and its label in `u`.
pub fn compare_cells_in(
    columns: &[KeyFigures],
    u: UnitSystem,
) -> Vec<(&'static str, Vec<String>, String)> {
    let from_mac_le = columns
        .first()
        .is_some_and(|k| k.datum == crate::analysis::COMMON_REFERENCE);
    ROWS.iter()
        // A figure that no configuration has (elevons on aircraft with a tail) is left out.
        .filter(|row| columns.iter().any(|k| (row.value)(k).is_some()))
        .map(|row| {
            let (factor, extra) = unit_factor(row.label, u);
            let decimals = row.decimals + extra;
            let value = |k: &KeyFigures| (row.value)(k).map(|v| v * factor);
            let base = columns.first().and_then(value);
            let shown_value = |v: f64| {
                let s = num(v, decimals);
                if row.label == BALLAST_LABEL && s.chars().all(|c| c == '0' || c == '.') {
                    format!("{s}, none needed")
                } else {
                    s
                }
            };
            let cells = columns
                .iter()
                .enumerate()
                .map(|(i, k)| match (value(k).filter(|v| v.is_finite()), base) {
                    (None, _) => "n/a".to_string(),
                    (Some(v), _) if i == 0 => shown_value(v),
                    (Some(v), Some(b)) => {
                        // The difference of the values as printed, so that "(=)" never
                        // stands beside two numbers that print differently.
                        let scale = 10f64.powi(decimals as i32);
                        let d = (v * scale).round() / scale - (b * scale).round() / scale;
                        let shown = num(d, decimals);
                        if shown
                            .trim_start_matches('-')
                            .chars()
                            .all(|c| c == '0' || c == '.')
                        {
                            format!("{} (=)", shown_value(v))
                        } else {
                            let sign = if d > 0.0 { "+" } else { "" };
                            format!("{} ({sign}{shown})", shown_value(v))
                        }
                    }
                    (Some(v), None) => shown_value(v),
                })
                .collect();
            let label = if from_mac_le {
                relabel(row.label)
            } else {
                row.label
            };
            (label, cells, u.header(label))
        })
        .collect()
}

/// A row's label once positions are measured from the wing's MAC leading edge.
fn relabel(label: &'static str) -> &'static str {
    match label {
        "CG mm from datum" => "CG mm aft of MAC LE",
        "neutral point mm from datum" => "neutral point mm aft of MAC LE",
        "CG band forward mm" => "CG band forward mm aft of MAC LE",
        "CG band aft mm" => "CG band aft mm aft of MAC LE",
        other => other,
    }
}

/// The comparison table: one column per configuration; later columns show their difference
/// from the first in brackets.
pub fn compare_table(columns: &[KeyFigures]) -> Table {
    compare_table_in(columns, UnitSystem::Metric)
}

/// The comparison table in units `u`.
pub fn compare_table_in(columns: &[KeyFigures], u: UnitSystem) -> Table {
    let mut t = Table::new();
    t.load_style(presets::UTF8_FULL_CONDENSED);
    let mut header = vec![Cell::new("")];
    header.extend(columns.iter().map(|k| Cell::new(&k.name)));
    t.set_header(header);
    for (_, cells, label) in compare_cells_in(columns, u) {
        let mut row = vec![label];
        row.extend(cells);
        t.add_row(row);
    }
    for i in 1..=columns.len() {
        if let Some(c) = t.column_mut(i) {
            c.set_cell_alignment(CellAlignment::Right);
        }
    }
    t
}

/// One configuration in `compare --json`.
#[derive(Debug, Serialize)]
pub struct CompareColumnJson {
    /// Configuration name.
    pub name: String,
    /// Source file.
    pub source: String,
    /// Figures by key; null where a value does not exist.
    pub figures: serde_json::Map<String, serde_json::Value>,
    /// Differences from the first configuration, same keys.
    pub difference_from_first: serde_json::Map<String, serde_json::Value>,
    /// Every caution the configuration raised, in the order the checks ran (as in
    /// `check --json`): level and code.
    pub cautions: Vec<CautionCodeJson>,
    /// What the positions (the keys ending in `x_m`, and the band) are measured from: the file's datum, or the wing's MAC leading edge when the files'
    /// datums differ.
    pub x_reference: String,
}

/// The level and code of every caution of one configuration, in the order the checks ran.
pub type CautionCodes = Vec<(crate::caution::Level, &'static str)>;

/// One caution in `compare --json`: its level and stable code (the message is `check`'s).
#[derive(Debug, Serialize)]
pub struct CautionCodeJson {
    /// `note`, `warning` or `danger`.
    pub level: &'static str,
    /// Stable code, as in docs/cautions.md.
    pub code: &'static str,
}

/// `v` rounded to `decimals` decimals, never `-0`.
fn round_to(v: f64, decimals: i32) -> f64 {
    let scale = 10f64.powi(decimals);
    let r = (v * scale).round() / scale;
    if r == 0.0 {
        0.0
    } else {
        r
    }
}

/// A rounded figure as JSON, a count as an integer.
fn json_number(v: f64, how: JsonNumber) -> serde_json::Value {
    match how {
        JsonNumber::Si { decimals, .. } => serde_json::Value::from(round_to(v, decimals)),
        // Counts are whole numbers held in an f64; the cast cannot lose anything.
        JsonNumber::Count { .. } => serde_json::Value::from(v.round() as i64),
    }
}

/// The whole `compare --json` document: the version, the unit convention (the same as
/// `check --json`) and the configurations.
#[derive(Debug, Serialize)]
pub struct CompareJson {
    /// The tool's version.
    pub trimline_version: &'static str,
    /// The unit convention.
    pub units: &'static str,
    /// One entry per configuration, in command-line and file order.
    pub configurations: Vec<CompareColumnJson>,
}

/// The JSON form of a comparison, in SI units as `check --json` (each key names its unit).
/// Values are rounded to one significant decimal more than the table shows and counts are
/// integers; a difference is that of the rounded values, so it equals the configuration's
/// figure minus the first configuration's. `cautions` holds, in the same order as `columns`,
/// every caution of each configuration (an entry missing gives an empty list).
pub fn compare_json(columns: &[(KeyFigures, String)], cautions: &[CautionCodes]) -> CompareJson {
    let first = columns.first().map(|c| &c.0);
    let rounded = |row: &Row, k: &KeyFigures| -> Option<f64> {
        (row.value)(k)
            .filter(|v| v.is_finite())
            .map(|v| row.json.rounded(v))
    };
    let configurations = columns
        .iter()
        .enumerate()
        .map(|(i, (k, source))| {
            let mut figures = serde_json::Map::new();
            let mut diff = serde_json::Map::new();
            for row in ROWS {
                let key = row.json.key().to_string();
                let v = rounded(row, k);
                let b = first.and_then(|f| rounded(row, f));
                figures.insert(
                    key.clone(),
                    v.map(|v| json_number(v, row.json))
                        .unwrap_or(serde_json::Value::Null),
                );
                diff.insert(
                    key,
                    v.zip(b)
                        .map(|(v, b)| json_number(v - b, row.json))
                        .unwrap_or(serde_json::Value::Null),
                );
            }
            CompareColumnJson {
                name: k.name.clone(),
                source: source.clone(),
                figures,
                difference_from_first: diff,
                cautions: cautions
                    .get(i)
                    .into_iter()
                    .flatten()
                    .map(|(level, code)| CautionCodeJson {
                        level: level.as_str(),
                        code,
                    })
                    .collect(),
                x_reference: k.datum.clone(),
            }
        })
        .collect();
    CompareJson {
        trimline_version: env!("CARGO_PKG_VERSION"),
        units: crate::output::json::JSON_UNITS,
        configurations,
    }
}

/// The comparison page's content from analysed configurations `(figures, source file)`.
pub fn compare_data(
    columns: &[(KeyFigures, String)],
    date: String,
) -> crate::output::pdf::compare_page::CompareData {
    use crate::output::pdf::compare_page::{CgRow, CompareData};
    let figures: Vec<KeyFigures> = columns.iter().map(|c| c.0.clone()).collect();
    let mut sources: Vec<String> = Vec::new();
    for (_, s) in columns {
        if !sources.contains(s) {
            sources.push(s.clone());
        }
    }
    let mm = |k: &KeyFigures, x: f64| (x - k.wing_root_le_x_m) * 1000.0;
    CompareData {
        date,
        tool_version: env!("CARGO_PKG_VERSION").to_string(),
        sources,
        names: figures.iter().map(|k| k.name.clone()).collect(),
        rows: compare_cells(&figures)
            .into_iter()
            .map(|(label, cells)| (label.to_string(), cells))
            .collect(),
        cg: figures
            .iter()
            .map(|k| CgRow {
                name: k.name.clone(),
                band_mm: (mm(k, k.band.forward_x_m), mm(k, k.band.aft_x_m)),
                neutral_point_mm: mm(k, k.neutral_point_x_m),
                cg_mm: mm(k, k.cg_x_m),
            })
            .collect(),
        cautions: figures
            .iter()
            .map(|k| {
                (
                    k.name.clone(),
                    k.caution_codes
                        .iter()
                        .map(|(l, c)| (*l, c.to_string()))
                        .collect(),
                )
            })
            .collect(),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::analysis::{analyse, AnalysisOptions};

    // 102.24 mm and 102.26 mm print as 102.2 and 102.3: the cell must show the printed
    // difference (+0.1), not "(=)" from the raw difference of 0.02 mm rounding to zero.
    #[test]
    fn differences_are_those_of_the_printed_values() {
        let text = include_str!("../../aircraft/larkspire-2000.toml");
        let aircraft = crate::input::parse_aircraft(text, "larkspire-2000.toml", None).unwrap();
        let a = analyse(&aircraft, &AnalysisOptions::default()).unwrap();
        let mut first = KeyFigures::of(&aircraft, &a);
        first.neutral_point_x_m = 0.10224;
        let mut second = first.clone();
        second.neutral_point_x_m = 0.10226;
        let cells = compare_cells(&[first.clone(), second]);
        let np = cells
            .iter()
            .find(|(label, _)| *label == "neutral point mm from datum")
            .unwrap();
        assert_eq!(np.1[1], "102.3 (+0.1)");
        let same = compare_cells(&[first.clone(), first]);
        let np = same
            .iter()
            .find(|(label, _)| *label == "neutral point mm from datum")
            .unwrap();
        assert_eq!(np.1[1], "102.2 (=)");
    }

    // A row no configuration has is left out of the table (elevons on tailed aircraft); it
    // appears, with "n/a" where missing, as soon as one configuration has it.
    #[test]
    fn rows_no_configuration_has_are_left_out() {
        let figures = |text: &str, name: &str| {
            let aircraft = crate::input::parse_aircraft(text, name, None).unwrap();
            let a = analyse(&aircraft, &AnalysisOptions::default()).unwrap();
            KeyFigures::of(&aircraft, &a)
        };
        let tail = figures(include_str!("../../aircraft/larkspire-2000.toml"), "l.toml");
        let wing = figures(include_str!("../../aircraft/skerrywing-900.toml"), "s.toml");
        let has = |cells: &[(&str, Vec<String>)], label: &str| cells.iter().any(|c| c.0 == label);
        let only_tail = compare_cells(&[tail.clone(), tail.clone()]);
        assert!(!has(&only_tail, "elevons to trim deg"));
        assert!(has(&only_tail, "decalage deg"));
        let mixed = compare_cells(&[tail, wing]);
        let row = mixed
            .iter()
            .find(|c| c.0 == "elevons to trim deg")
            .expect("the flying wing has elevons");
        assert_eq!(row.1[0], "n/a");
        assert_ne!(row.1[1], "n/a");
    }
}
