//! The solves table: decalage for the target speed, elevator schedule and tailless check.

use super::{num, table};
use crate::analysis::Analysis;
use crate::model::{Aircraft, StabiliserRole};
use comfy_table::Table;

/// Decalage solve, elevator schedule and tailless check (lifting line only).
pub(super) fn solves_table(aircraft: &Aircraft, a: &Analysis) -> Option<Table> {
    let f = a.full.as_ref()?;
    let mut t = table(&["what", "value", "note"]);
    if a.headline.static_margin <= 0.0 {
        t.add_row(vec![
            if aircraft.stabiliser.is_some() {
                format!("decalage and {}", aircraft.pitch_control_name())
            } else {
                "washout, reflex and elevon trim".to_string()
            },
            "not solved".to_string(),
            "the CG is behind the neutral point: move it forward first".to_string(),
        ]);
    }
    if let Some(d) = &f.decalage_for_target {
        t.add_row(vec![
            format!("stabiliser incidence for {} m/s", num(d.speed_m_s, 1)),
            format!("{} deg", num(d.stabiliser_incidence_rad.to_degrees(), 2)),
            format!(
                "decalage {} deg (now {} deg), neutral elevator, CL {}",
                num(d.decalage_rad.to_degrees(), 2),
                num(aircraft.decalage_rad().unwrap_or(0.0).to_degrees(), 2),
                num(d.cl, 3)
            ),
        ]);
    }
    elevator_schedule_rows(&mut t, aircraft, f);
    if let Some(tl) = &f.tailless {
        tailless_rows(&mut t, aircraft, tl);
    }
    (t.row_count() > 0).then_some(t)
}

/// Rows of the elevator (or elevon) schedule over the speeds.
fn elevator_schedule_rows(
    t: &mut Table,
    aircraft: &Aircraft,
    f: &crate::stability::trim::FullStability,
) {
    let control = aircraft.pitch_control_name();
    let control_owner = if aircraft.stabiliser.is_some() {
        "elevator's"
    } else {
        "elevons'"
    };
    // On a canard, trailing edge down is up elevator (nose up): name the trailing edge.
    let canard = aircraft
        .stabiliser
        .as_ref()
        .is_some_and(|s| s.role == StabiliserRole::Canard);
    for p in &f.elevator_schedule {
        let up = p.elevator_rad < 0.0;
        t.add_row(vec![
            format!("{control} at {} m/s", num(p.speed_m_s, 1)),
            if p.elevator_rad.to_degrees().abs() < 0.05 {
                "neutral".to_string()
            } else {
                format!(
                    "{} deg {}",
                    num(p.elevator_rad.abs().to_degrees(), 1),
                    match (canard, up) {
                        (false, true) => "up",
                        (false, false) => "down",
                        (true, true) => "TE up (nose down)",
                        (true, false) => "TE down (nose up)",
                    }
                )
            },
            if p.within_limits {
                format!("CL {}", num(p.cl, 3))
            } else {
                format!("CL {}: beyond the {control_owner} throw", num(p.cl, 3))
            },
        ]);
    }
}

/// Rows of the tailless check: pitching moments, the washout change and the elevons to trim.
fn tailless_rows(t: &mut Table, aircraft: &Aircraft, tl: &crate::stability::trim::TaillessCheck) {
    t.add_row(vec![
        "pitching moment at zero lift".into(),
        num(tl.cm_zero_lift, 4),
        "about the CG; must be positive for a tailless wing".into(),
    ]);
    t.add_row(vec![
        format!("pitching moment at CL {}", num(tl.design_cl, 2)),
        num(tl.cm_at_design, 4),
        "zero when trimmed there".into(),
    ]);
    if let Some(w) = tl.washout_change_rad {
        t.add_row(vec![
            "washout change to trim there".into(),
            format!("{} deg", num(w.to_degrees(), 2)),
            if w.to_degrees().abs() > crate::analysis::MAX_USEFUL_WASHOUT_CHANGE_DEG {
                "too large to be practical: change the sections, sweep or CG".into()
            } else {
                "negative: more washout at the tip".into()
            },
        ]);
    }
    if aircraft.elevons.is_some() {
        t.add_row(vec![
            "elevons to trim there".into(),
            tl.elevon_to_trim_rad.map_or("none found".into(), |d| {
                if d.to_degrees().abs() < 0.05 {
                    "neutral".to_string()
                } else {
                    format!(
                        "{} deg {}",
                        num(d.abs().to_degrees(), 1),
                        if d < 0.0 { "up" } else { "down" }
                    )
                }
            }),
            if tl.elevon_within_throws {
                "instead of a washout change; within the throws".into()
            } else {
                "beyond the elevons' throws".into()
            },
        ]);
    }
}
