//! Rendering of `trimline section`: summary and angle-of-attack tables, JSON, and the
//! surface-pressure CSV. The serde mirror types live here; the core types have none.

use crate::caution::Caution;
use crate::section::boundary_layer::TransitionCause;
use crate::section::polar::{PeakKind, Polar, PolarStatus, StallCause};
use crate::section::viscous::ViscousPoint;
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
    /// Chord Reynolds number of a viscous section's summary (viscous method only).
    #[serde(skip_serializing_if = "Option::is_none")]
    pub reynolds: Option<f64>,
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
    /// Viscous polars, one per Reynolds number asked for (`--re`); left out when none.
    #[serde(skip_serializing_if = "Vec::is_empty")]
    pub viscous: Vec<ViscousReport>,
}

/// One viscous polar (boundary layer on the panel method) at one Reynolds number.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ViscousReport {
    /// Chord Reynolds number.
    pub reynolds: f64,
    /// Transition setting: critical amplification factor N.
    pub transition_n: f64,
    /// Zero-lift angle from a straight line through the converged points with |cl| <= 0.6, deg.
    pub alpha_zero_lift_deg: Option<f64>,
    /// Lift slope of that line, per deg.
    pub cl_alpha_per_deg: Option<f64>,
    /// Lift slope of that line, per rad.
    pub cl_alpha_per_rad: Option<f64>,
    /// Least drag coefficient over the converged points.
    pub cd_min: Option<f64>,
    /// cl at the least drag.
    pub cl_at_cd_min: Option<f64>,
    /// Greatest cl of the converged points below stall.
    pub cl_max: Option<f64>,
    /// Angle of that cl, deg.
    pub stall_alpha_deg: Option<f64>,
    /// What that cl is: "maximum" (the computed lift curve turned over after it) or
    /// "last-converged" (the last converged angle, the curve still rising there; the
    /// section's maximum is not known from the polar); null when no point converged.
    pub cl_max_kind: Option<&'static str>,
    /// What ended the lift curve: "separation", "not-converged" or "end-of-sweep".
    pub stall_found_by: String,
    /// The points.
    pub points: Vec<ViscousPointReport>,
}

/// One angle of a viscous polar; the numbers are null where the point has none.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct ViscousPointReport {
    /// Angle of attack, deg.
    pub alpha_deg: f64,
    /// "converged", "past-stall", "not-converged" or "not-solved" (beyond a stalled angle).
    pub status: &'static str,
    /// Lift coefficient.
    pub cl: Option<f64>,
    /// Profile drag coefficient.
    pub cd: Option<f64>,
    /// Moment coefficient about the quarter chord.
    pub cm_quarter_chord: Option<f64>,
    /// Upper-surface transition, x/c (null: laminar to the trailing edge).
    pub transition_upper_x_c: Option<f64>,
    /// Lower-surface transition, x/c.
    pub transition_lower_x_c: Option<f64>,
    /// "amplification", "laminar-separation" or null, upper surface.
    pub transition_upper_by: Option<&'static str>,
    /// Turbulent separation, most forward of both surfaces, x/c.
    pub separation_x_c: Option<f64>,
    /// Last residual of a point that did not converge.
    pub residual: Option<f64>,
}

fn cause_name(c: TransitionCause) -> &'static str {
    match c {
        TransitionCause::Amplification => "amplification",
        TransitionCause::LaminarSeparation => "laminar-separation",
        TransitionCause::Trip => "trip",
    }
}

impl ViscousReport {
    /// Builds the report of one polar.
    pub fn new(polar: &Polar) -> ViscousReport {
        let fit = polar.linear_fit(0.6);
        let point =
            |alpha_deg: f64, status: &'static str, p: Option<&ViscousPoint>| ViscousPointReport {
                alpha_deg,
                status,
                cl: p.map(|p| p.cl),
                cd: p.map(|p| p.cd),
                cm_quarter_chord: p.map(|p| p.cm_quarter_chord),
                transition_upper_x_c: p.and_then(|p| p.upper.transition_x_c),
                transition_lower_x_c: p.and_then(|p| p.lower.transition_x_c),
                transition_upper_by: p.and_then(|p| p.upper.transition_cause.map(cause_name)),
                separation_x_c: p.and_then(|p| p.separation_x_c()),
                residual: None,
            };
        ViscousReport {
            reynolds: polar.reynolds,
            transition_n: polar.n_crit,
            alpha_zero_lift_deg: fit.map(|f| f.1.to_degrees()),
            cl_alpha_per_deg: fit.map(|f| f.0.to_radians()),
            cl_alpha_per_rad: fit.map(|f| f.0),
            cd_min: polar.cd_min().map(|c| c.0),
            cl_at_cd_min: polar.cd_min().map(|c| c.1),
            cl_max: polar.cl_max.map(|c| c.0),
            stall_alpha_deg: polar.cl_max.map(|c| c.1.to_degrees()),
            cl_max_kind: polar.lift_peak().map(|p| match p.kind {
                PeakKind::Maximum => "maximum",
                PeakKind::LastConverged(_) => "last-converged",
            }),
            stall_found_by: match polar.stall_cause {
                StallCause::Separation => "separation",
                StallCause::NotConverged => "not-converged",
                StallCause::EndOfSweep => "end-of-sweep",
            }
            .to_string(),
            points: polar
                .entries
                .iter()
                .map(|e| {
                    let a = e.alpha_rad.to_degrees();
                    match &e.status {
                        PolarStatus::Converged(p) => point(a, "converged", Some(p)),
                        PolarStatus::PastStall(p) => point(a, "past-stall", Some(p)),
                        PolarStatus::NotConverged(err) => ViscousPointReport {
                            residual: match err {
                                crate::section::viscous::ViscousError::NotConverged {
                                    residual,
                                    ..
                                } => Some(*residual),
                                _ => None,
                            },
                            ..point(a, "not-converged", None)
                        },
                        PolarStatus::BeyondStall => point(a, "not-solved", None),
                    }
                })
                .collect(),
        }
    }

    /// True when every number present is finite.
    pub fn all_finite(&self) -> bool {
        let ok = |v: Option<f64>| v.is_none_or(f64::is_finite);
        [
            self.alpha_zero_lift_deg,
            self.cl_alpha_per_deg,
            self.cl_alpha_per_rad,
            self.cd_min,
            self.cl_at_cd_min,
            self.cl_max,
            self.stall_alpha_deg,
        ]
        .into_iter()
        .all(ok)
            && self.points.iter().all(|p| {
                [
                    p.cl,
                    p.cd,
                    p.cm_quarter_chord,
                    p.transition_upper_x_c,
                    p.transition_lower_x_c,
                    p.separation_x_c,
                    p.residual,
                ]
                .into_iter()
                .all(ok)
            })
    }
}

fn opt(v: Option<f64>, digits: usize) -> String {
    v.map_or_else(|| "-".to_string(), |v| fixed(v, digits))
}

/// The viscous polars as tables: a summary and the points of each.
pub fn render_viscous(reports: &[ViscousReport]) -> String {
    let mut out = String::new();
    for r in reports {
        let mut summary = Table::new();
        summary.load_style(UTF8_FULL_CONDENSED);
        summary.set_header(vec![
            format!("Viscous, Re {:.0}, N {}", r.reynolds, r.transition_n),
            "Value".into(),
            "Unit".into(),
        ]);
        let peak_name = match r.cl_max_kind {
            Some("maximum") => "Greatest cl (the computed curve turns over)",
            _ => "Greatest cl (last converged angle, still rising)",
        };
        let ended_by = match r.stall_found_by.as_str() {
            "separation" => "separation criterion",
            "not-converged" => "no convergence",
            "end-of-sweep" => "end of the angles asked for",
            other => other,
        };
        let rows: Vec<(&str, String, &str)> = vec![
            ("Reynolds number", format!("{:.0}", r.reynolds), ""),
            ("Zero-lift angle", opt(r.alpha_zero_lift_deg, 2), "deg"),
            ("Lift slope", opt(r.cl_alpha_per_rad, 3), "per rad"),
            ("Lift slope", opt(r.cl_alpha_per_deg, 4), "per deg"),
            ("Least cd of the angles computed", opt(r.cd_min, 5), ""),
            ("  at cl", opt(r.cl_at_cd_min, 3), ""),
            (peak_name, opt(r.cl_max, 3), ""),
            ("  at alpha", opt(r.stall_alpha_deg, 1), "deg"),
            ("Lift curve ended by", ended_by.to_string(), ""),
        ];
        for (name, value, unit) in rows {
            summary.add_row(vec![Cell::new(name), right(value), Cell::new(unit)]);
        }
        let mut t = Table::new();
        t.load_style(UTF8_FULL_CONDENSED);
        t.set_header(vec![
            "alpha (deg)",
            "cl",
            "cd",
            "cm c/4",
            "transition upper x/c",
            "transition lower x/c",
            "separation x/c",
            "state",
        ]);
        for p in &r.points {
            t.add_row(vec![
                right(fixed(p.alpha_deg, 1)),
                right(opt(p.cl, 4)),
                right(opt(p.cd, 5)),
                right(opt(p.cm_quarter_chord, 4)),
                right(opt(p.transition_upper_x_c, 3)),
                right(opt(p.transition_lower_x_c, 3)),
                right(opt(p.separation_x_c, 3)),
                Cell::new(p.status),
            ]);
        }
        out.push_str(&format!(
            "{summary}
{t}
"
        ));
    }
    if !reports.is_empty() {
        out.push_str(
            "Viscous: integral boundary layer (Thwaites, e^N envelope, Head) coupled to the panel \
             method; cd by Squire-Young. The greatest cl is that of the computed lift curve: \
             where it is the last converged angle, the curve was still rising and the method \
             does not know the section's maximum; where the curve turns over, the maximum runs \
             high against wind-tunnel data (see docs/section.md). Either way it is shown, not \
             used.\n",
        );
    }
    out
}

/// The viscous polars as CSV, one line per angle and Reynolds number; empty cells where a
/// point has no number.
pub fn polar_csv(reports: &[ViscousReport]) -> String {
    let mut s = String::from(
        "reynolds,transition_n,alpha_deg,state,cl,cd,cm_c4,transition_upper_x_c,transition_lower_x_c,separation_x_c\n",
    );
    let cell = |v: Option<f64>, d: usize| v.map_or_else(String::new, |v| format!("{v:.d$}"));
    for r in reports {
        for p in &r.points {
            s.push_str(&format!(
                "{:.0},{},{:.3},{},{},{},{},{},{},{}\n",
                r.reynolds,
                r.transition_n,
                p.alpha_deg,
                p.status,
                cell(p.cl, 5),
                cell(p.cd, 6),
                cell(p.cm_quarter_chord, 5),
                cell(p.transition_upper_x_c, 4),
                cell(p.transition_lower_x_c, 4),
                cell(p.separation_x_c, 4),
            ));
        }
    }
    s
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
            message: crate::output::cautions::message(c),
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
            reynolds: m.reynolds_number,
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
            viscous: Vec::new(),
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
            && self.reynolds.is_none_or(f64::is_finite)
            && self.viscous.iter().all(ViscousReport::all_finite)
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
    let mut rows: Vec<(&str, String, &str)> = vec![
        ("Airfoil", report.airfoil.clone(), ""),
        ("Shape", report.shape.clone(), ""),
        ("Method", method, ""),
    ];
    if let Some(re) = report.reynolds {
        rows.push(("Reynolds number", format!("{re:.0}"), ""));
    }
    rows.extend([
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
    ]);
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
                reynolds_number: None,
                polar: None,
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
