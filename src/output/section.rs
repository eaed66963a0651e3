//! Rendering of `trimline section`: summary and angle-of-attack tables, JSON, and the
//! surface-pressure CSV. The serde mirror types live here; the core types have none.

use crate::caution::Caution;
use crate::section::{ClMaxSource, SectionOutcome, SurfacePressure, SweepPoint};
use comfy_table::{presets::UTF8_FULL_CONDENSED, Cell, CellAlignment, Table};
use serde::Serialize;

/// Everything `section` shows, in display units (degrees), ready for JSON.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SectionReport {
    /// Airfoil name.
    pub airfoil: String,
    /// Shape in words ("NACA 2412", "Joukowski t/c 12 %, f/c 2 %").
    pub shape: String,
    /// Method name: exact, thin or panel.
    pub method: String,
    /// Panel count (panel method only).
    pub panels: Option<usize>,
    /// Zero-lift angle, deg (from the chord line).
    pub alpha_zero_lift_deg: f64,
    /// Lift slope at zero lift, per rad.
    pub cl_alpha_per_rad: f64,
    /// Lift slope at zero lift, per deg.
    pub cl_alpha_per_deg: f64,
    /// Moment coefficient about the quarter chord at zero lift (positive nose up).
    pub cm_quarter_chord: f64,
    /// Moment coefficient about the aerodynamic centre.
    pub cm_ac: f64,
    /// Aerodynamic centre, fraction of chord aft of the leading edge.
    pub aerodynamic_center_x_c: f64,
    /// Positive stall limit of cl.
    pub cl_max: f64,
    /// "given" or "default".
    pub cl_max_source: String,
    /// Negative stall limit of cl.
    pub cl_min: f64,
    /// The table over angle of attack.
    pub points: Vec<PointReport>,
    /// Cautions.
    pub cautions: Vec<CautionReport>,
}

/// One angle of attack.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct PointReport {
    /// Angle of attack, deg.
    pub alpha_deg: f64,
    /// Lift coefficient of the method.
    pub cl: f64,
    /// Moment coefficient about the quarter chord.
    pub cm_quarter_chord: f64,
    /// Lift coefficient of the section model with its stall limits.
    pub cl_model: f64,
}

/// A caution as JSON.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CautionReport {
    /// note, warning or danger.
    pub level: String,
    /// Stable code.
    pub code: String,
    /// Message.
    pub message: String,
}

impl From<&Caution> for CautionReport {
    fn from(c: &Caution) -> Self {
        CautionReport {
            level: c.level.as_str().to_string(),
            code: c.code.to_string(),
            message: c.message.clone(),
        }
    }
}

impl SectionReport {
    /// Builds the report from the section outcome and its sweep.
    pub fn new(
        airfoil: &str,
        shape: &str,
        panels: Option<usize>,
        outcome: &SectionOutcome,
        points: &[SweepPoint],
    ) -> SectionReport {
        let m = &outcome.model;
        SectionReport {
            airfoil: airfoil.to_string(),
            shape: shape.to_string(),
            method: m.method.as_str().to_string(),
            panels,
            alpha_zero_lift_deg: m.alpha_zero_lift_rad.to_degrees(),
            cl_alpha_per_rad: m.cl_alpha_per_rad,
            cl_alpha_per_deg: m.cl_alpha_per_rad.to_radians(),
            cm_quarter_chord: m.cm_quarter_chord(0.0),
            cm_ac: m.cm_ac,
            aerodynamic_center_x_c: m.x_ac_c,
            cl_max: m.cl_max,
            cl_max_source: match m.cl_max_source {
                ClMaxSource::Given => "given",
                ClMaxSource::Default => "default",
            }
            .to_string(),
            cl_min: m.cl_min,
            points: points
                .iter()
                .map(|p| PointReport {
                    alpha_deg: p.alpha_rad.to_degrees(),
                    cl: p.cl,
                    cm_quarter_chord: p.cm_quarter_chord,
                    cl_model: p.cl_model,
                })
                .collect(),
            cautions: outcome.cautions.iter().map(CautionReport::from).collect(),
        }
    }

    /// True when every number in the report is finite.
    pub fn all_finite(&self) -> bool {
        let scalars = [
            self.alpha_zero_lift_deg,
            self.cl_alpha_per_rad,
            self.cm_quarter_chord,
            self.cm_ac,
            self.aerodynamic_center_x_c,
            self.cl_max,
            self.cl_min,
        ];
        scalars.iter().all(|v| v.is_finite())
            && self.points.iter().all(|p| {
                p.alpha_deg.is_finite()
                    && p.cl.is_finite()
                    && p.cm_quarter_chord.is_finite()
                    && p.cl_model.is_finite()
            })
    }
}

/// The report as pretty JSON.
pub fn to_json(report: &SectionReport) -> Result<String, serde_json::Error> {
    serde_json::to_string_pretty(report)
}

/// `value` with `digits` decimals, without a minus sign on a value that rounds to zero.
fn fixed(value: f64, digits: usize) -> String {
    let text = format!("{value:.digits$}");
    if text.starts_with('-') && text[1..].chars().all(|c| c == '0' || c == '.') {
        text[1..].to_string()
    } else {
        text
    }
}

fn right(text: String) -> Cell {
    Cell::new(text).set_alignment(CellAlignment::Right)
}

/// The report as two tables (summary, then over angle of attack) and the cautions.
pub fn render_tables(report: &SectionReport) -> String {
    let mut summary = Table::new();
    summary.load_style(UTF8_FULL_CONDENSED);
    summary.set_header(vec!["Section", "Value", "Unit"]);
    let method = match report.panels {
        Some(n) => format!("{} ({n} panels)", report.method),
        None => report.method.clone(),
    };
    let rows: Vec<(&str, String, &str)> = vec![
        ("Airfoil", report.airfoil.clone(), ""),
        ("Shape", report.shape.clone(), ""),
        ("Method", method, ""),
        (
            "Zero-lift angle",
            fixed(report.alpha_zero_lift_deg, 2),
            "deg",
        ),
        ("Lift slope", fixed(report.cl_alpha_per_rad, 3), "per rad"),
        ("Lift slope", fixed(report.cl_alpha_per_deg, 4), "per deg"),
        (
            "cm about c/4 at zero lift",
            fixed(report.cm_quarter_chord, 4),
            "",
        ),
        (
            "Aerodynamic centre",
            fixed(report.aerodynamic_center_x_c, 3),
            "x/c",
        ),
        (
            "cl_max",
            format!("{} ({})", fixed(report.cl_max, 2), report.cl_max_source),
            "",
        ),
        ("cl_min", fixed(report.cl_min, 2), ""),
    ];
    for (name, value, unit) in rows {
        summary.add_row(vec![Cell::new(name), right(value), Cell::new(unit)]);
    }
    let mut sweep = Table::new();
    sweep.load_style(UTF8_FULL_CONDENSED);
    sweep.set_header(vec!["alpha (deg)", "cl", "cm c/4", "cl used by the wing"]);
    for p in &report.points {
        sweep.add_row(vec![
            right(fixed(p.alpha_deg, 1)),
            right(fixed(p.cl, 4)),
            right(fixed(p.cm_quarter_chord, 4)),
            right(fixed(p.cl_model, 4)),
        ]);
    }
    let mut out = format!(
        "{summary}\n{sweep}\ncl: the 2-D method at each angle. cl used by the wing: the straight line \
         through the zero-lift angle with the lift slope above, cut off at cl_max and cl_min.\n"
    );
    for c in &report.cautions {
        out.push_str(&format!("{} [{}]: {}\n", c.level, c.code, c.message));
    }
    out
}

/// Surface pressures as CSV with a header `x_c,y_c,cp`.
pub fn surface_csv(points: &[SurfacePressure]) -> String {
    let mut s = String::from("x_c,y_c,cp\n");
    for p in points {
        s.push_str(&format!("{:.6},{:.6},{:.5}\n", p.x_c, p.y_c, p.cp));
    }
    s
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::model::SectionMethod;
    use crate::section::SectionModel;

    fn report() -> SectionReport {
        let outcome = SectionOutcome {
            model: SectionModel {
                method: SectionMethod::Thin,
                alpha_zero_lift_rad: -0.04,
                cl_alpha_per_rad: 6.2,
                cm_ac: -0.05,
                x_ac_c: 0.25,
                cl_max: 1.2,
                cl_min: -0.9,
                cl_max_source: ClMaxSource::Given,
            },
            cautions: vec![],
        };
        let pts = [SweepPoint {
            alpha_rad: 0.0,
            cl: 0.248,
            cm_quarter_chord: -0.05,
            cl_model: 0.248,
        }];
        SectionReport::new("a", "NACA 2412", None, &outcome, &pts)
    }

    #[test]
    fn json_has_the_documented_keys() {
        let v: serde_json::Value = serde_json::from_str(&to_json(&report()).unwrap()).unwrap();
        for key in [
            "/method",
            "/alpha_zero_lift_deg",
            "/cl_alpha_per_rad",
            "/cm_quarter_chord",
            "/aerodynamic_center_x_c",
            "/points/0/alpha_deg",
            "/points/0/cl",
            "/points/0/cm_quarter_chord",
        ] {
            assert!(v.pointer(key).is_some(), "missing {key}");
        }
    }

    #[test]
    fn tables_show_degrees_and_rounded_values() {
        let t = render_tables(&report());
        assert!(t.contains("-2.29"), "{t}");
        assert!(t.contains("0.2480"), "{t}");
    }

    #[test]
    fn no_minus_sign_on_zero() {
        assert_eq!(fixed(-1e-17, 4), "0.0000");
        assert_eq!(fixed(-0.00004, 4), "0.0000");
        assert_eq!(fixed(-0.00006, 4), "-0.0001");
    }

    #[test]
    fn csv_has_a_header_and_one_line_per_point() {
        let csv = surface_csv(&[SurfacePressure {
            x_c: 0.5,
            y_c: 0.01,
            cp: -0.3,
        }]);
        assert_eq!(csv, "x_c,y_c,cp\n0.500000,0.010000,-0.30000\n");
    }
}
