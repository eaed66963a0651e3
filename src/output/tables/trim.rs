//! The trim table: trim at the CG, the stabiliser's load, stall and glide.

use super::{num, right_align, table};
use crate::analysis::{Analysis, Method};
use crate::model::{Aircraft, StabiliserRole};
use crate::output::units::UnitSystem;
use comfy_table::Table;

/// The trim, stall and glide table.
pub(super) fn trim_table(aircraft: &Aircraft, a: &Analysis, u: UnitSystem) -> Table {
    let mut t = table(&["quantity", "value", "unit"]);
    trim_rows(&mut t, aircraft, a);
    trim_load_rows(&mut t, aircraft, a, u);
    stall_rows(&mut t, a);
    glide_rows(&mut t, a);
    // The Reynolds number is taken at the trim speed, or at the stall speed without a trim.
    let at = if a.headline.trim.is_some() {
        "at trim"
    } else {
        "at the stall speed (no trim)"
    };
    t.add_row(vec![
        format!("Reynolds number on MAC {at}"),
        crate::output::cautions::reynolds_text(a.reynolds_mac),
        String::new(),
    ]);
    right_align(&mut t, 1..2);
    t
}

/// Rows of the trim at the CG: lift coefficient, angle, speed and the stabiliser's CL.
fn trim_rows(t: &mut Table, aircraft: &Aircraft, a: &Analysis) {
    let h = &a.headline;
    match h.trim {
        Some(tr) => {
            t.add_row(vec!["trim CL".into(), num(tr.cl, 3), String::new()]);
            t.add_row(vec![
                "trim angle of attack (fuselage datum)".into(),
                num(tr.alpha_rad.to_degrees(), 2),
                "deg".into(),
            ]);
            t.add_row(vec![
                format!("trim speed, neutral {}", aircraft.pitch_control_name()),
                format!(
                    "{} ({} km/h)",
                    num(tr.speed_m_s, 1),
                    num(tr.speed_m_s * 3.6, 0)
                ),
                "m/s".into(),
            ]);
            if aircraft.stabiliser.is_some() {
                t.add_row(vec![
                    "stabiliser CL at trim (own area)".into(),
                    num(tr.stabiliser_cl, 3),
                    String::new(),
                ]);
            }
        }
        None => {
            t.add_row(vec!["trim".into(), "not found".into(), String::new()]);
        }
    }
}

/// Rows of the full model's trim: the stabiliser's load, the downwash (or a canard's upwash)
/// and the span efficiency.
fn trim_load_rows(t: &mut Table, aircraft: &Aircraft, a: &Analysis, u: UnitSystem) {
    if let Some(ft) = a.full.as_ref().and_then(|f| f.trim.as_ref()) {
        if aircraft.stabiliser.is_some() {
            t.add_row(vec![
                "stabiliser load at trim".into(),
                {
                    // A load under 10 g keeps a decimal, so a small download never reads 0 g.
                    let kg = ft.stabiliser_load_n / crate::atmosphere::G0;
                    let decimals = if (kg * 1000.0).abs() < 10.0 { 1 } else { 0 };
                    format!("{} {}", u.mass(kg, decimals), u.mass_unit())
                },
                if ft.stabiliser_load_n < 0.0 {
                    "a download".into()
                } else {
                    "an upload".into()
                },
            ]);
            let canard = aircraft
                .stabiliser
                .as_ref()
                .is_some_and(|s| s.role == StabiliserRole::Canard);
            // Ahead of the wing the wing's bound vortex induces an upwash: show it as such.
            let (label, sign) = if canard {
                ("upwash at the canard, from the wing", -1.0)
            } else {
                ("downwash at the stabiliser", 1.0)
            };
            t.add_row(vec![
                label.into(),
                format!(
                    "{} deg, gradient {}",
                    num(sign * ft.downwash_rad.to_degrees(), 2),
                    num(sign * ft.downwash_gradient, 3)
                ),
                String::new(),
            ]);
        }
        if let Some(e) = ft.span_efficiency {
            t.add_row(vec![
                "span efficiency at trim".into(),
                if e > crate::analysis::MAX_PLAUSIBLE_SPAN_EFFICIENCY {
                    format!("{} (not plausible: see the cautions)", num(e, 3))
                } else {
                    num(e, 3)
                },
                String::new(),
            ]);
        }
    }
}

/// Rows of the aircraft's CL max, the stall speed and where the stall begins.
fn stall_rows(t: &mut Table, a: &Analysis) {
    let h = &a.headline;
    let crit = if matches!(h.method, Method::Numerical(_)) {
        "aircraft CL max (first section to stall)"
    } else {
        "aircraft CL max (0.9 x section)"
    };
    t.add_row(vec![crit.into(), num(h.cl_max, 3), String::new()]);
    t.add_row(vec![
        "stall speed".into(),
        format!(
            "{} ({} km/h)",
            num(h.stall_speed_m_s, 1),
            num(h.stall_speed_m_s * 3.6, 0)
        ),
        "m/s".into(),
    ]);
    if let Some(loc) = &h.stall_location {
        t.add_row(vec![
            "stall begins".into(),
            format!(
                "{} at {} % semispan",
                loc.surface_name,
                num(loc.percent_semispan, 0)
            ),
            String::new(),
        ]);
    }
}

/// Rows of the best glide and minimum sink (or why there are none).
fn glide_rows(t: &mut Table, a: &Analysis) {
    match a.glide_figures() {
        None => {
            t.add_row(vec![
                "best glide ratio, minimum sink".into(),
                if a.headline.static_margin <= 0.0 {
                    "none: unstable at this CG".into()
                } else {
                    "none: no glide polar (see the cautions)".into()
                },
                String::new(),
            ]);
        }
        Some(g) => {
            let flag = |limited: bool| if limited { " (at the stall)" } else { "" };
            let from = if g.from_flight_polar {
                ""
            } else {
                " (parabolic estimate)"
            };
            t.add_row(vec![
                format!("best glide ratio{from}"),
                format!(
                    "{} at {} m/s{}",
                    num(g.best_glide_ratio, 1),
                    num(g.best_glide_speed_m_s, 1),
                    flag(g.best_glide_at_stall)
                ),
                String::new(),
            ]);
            let near = g.min_sink_slow_limit_m_s.map_or(String::new(), |v| {
                format!("; near the stall: fly above {} m/s", num(v, 1))
            });
            t.add_row(vec![
                format!("minimum sink{from}"),
                format!(
                    "{} at {} m/s{}{near}",
                    num(g.min_sink_m_s, 2),
                    num(g.min_sink_speed_m_s, 1),
                    flag(g.min_sink_at_stall)
                ),
                "m/s".into(),
            ]);
        }
    }
}
