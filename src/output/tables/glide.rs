//! The glide tables of `check`: the speed polar, the flap settings and the best setting per
//! speed, the speeds to fly, and the CSV of the polar.

use super::*;

/// Rows of the spanwise table: about `rows` wing stations from root to tip.
/// Rows of the glide table in `check`.
const GLIDE_ROWS: usize = 12;

/// The flight polar, sampled, with the minimum-sink and best-glide points marked.
pub(super) fn glide_polar_table(
    aircraft: &Aircraft,
    p: &crate::analysis::glide::GlidePolar,
) -> Table {
    let control = match p.control {
        crate::lifting_line::TrimControl::Elevator => aircraft.pitch_control_name(),
        crate::lifting_line::TrimControl::Incidence(_) => "tail incidence change",
    };
    let header = format!("{control} (deg, down +)");
    let body = aircraft.fuselage.is_some();
    let mut columns = vec![
        "speed (m/s)",
        "sink (m/s)",
        "glide ratio",
        "CL",
        "section drag",
        "induced drag",
    ];
    if body {
        columns.push("fuselage drag");
    }
    columns.extend([header.as_str(), ""]);
    let mut t = table(&columns);
    let mut rows: Vec<(&crate::performance::flight_polar::GlidePoint<_>, &str)> =
        sample(&p.points, GLIDE_ROWS)
            .into_iter()
            .map(|q| (q, ""))
            .collect();
    let marked = [
        (&p.min_sink.point, "least sink"),
        (&p.best_glide.point, "best glide"),
    ];
    // A sampled row that prints as a marked one (least sink at the stall, say) gives way.
    rows.retain(|(q, _)| {
        marked
            .iter()
            .all(|(m, _)| (m.speed_m_s - q.speed_m_s).abs() >= 0.05)
    });
    rows.extend(marked);
    rows.sort_by(|x, y| x.0.speed_m_s.total_cmp(&y.0.speed_m_s));
    for (q, mark) in rows {
        let mut note = mark.to_string();
        if !q.flyable {
            note = "beyond the throws".into();
        } else if q.drag.beyond_polar {
            note = if note.is_empty() {
                "drag extrapolated".into()
            } else {
                format!("{note} (drag extrapolated)")
            };
        }
        let mut row = vec![
            num(q.speed_m_s, 1),
            num(q.sink_m_s, 3),
            num(q.glide_ratio, 1),
            num(q.cl, 3),
            num(q.drag.profile, 4),
            num(q.drag.induced, 4),
        ];
        if body {
            row.push(num(q.drag.parasite, 4));
        }
        row.extend([num(q.trim.control_rad.to_degrees(), 1), note]);
        t.add_row(row);
    }
    right_align(&mut t, 0..columns.len() - 1);
    t
}

/// One row per flap setting (the plain wing first): least sink, best glide, control.
pub(super) fn flap_settings_table(
    aircraft: &Aircraft,
    base: &crate::analysis::glide::GlidePolar,
    settings: &[crate::analysis::glide::SettingPolar],
) -> Table {
    let control = format!(
        "{} at best glide (deg, down +)",
        aircraft.pitch_control_name()
    );
    let mut t = table(&[
        "setting",
        "stall (m/s)",
        "least sink (m/s)",
        "at (m/s)",
        "best glide",
        "at (m/s)",
        &control,
    ]);
    let row = |t: &mut Table, name: &str, p: &crate::analysis::glide::GlidePolar| {
        t.add_row(vec![
            name.to_string(),
            num(p.stall_speed_m_s, 1),
            num(p.min_sink.point.sink_m_s, 3),
            num(p.min_sink.point.speed_m_s, 1),
            num(p.best_glide.point.glide_ratio, 1),
            num(p.best_glide.point.speed_m_s, 1),
            num(p.best_glide.point.trim.control_rad.to_degrees(), 1),
        ]);
    };
    row(&mut t, "flaps neutral", base);
    for s in settings {
        match &s.polar {
            Ok(p) => row(&mut t, &crate::printable::printable(&s.name), p),
            Err(_) => {
                t.add_row(vec![
                    crate::printable::printable(&s.name).into_owned(),
                    "no polar (see the cautions)".to_string(),
                ]);
            }
        }
    }
    right_align(&mut t, 1..7);
    t
}

/// Rows of the best-setting table.
const BEST_SETTING_ROWS: usize = 10;

/// At speeds across the range, the setting (or neutral flaps) with the least sink there.
pub(super) fn best_setting_table(
    base: &crate::analysis::glide::GlidePolar,
    settings: &[crate::analysis::glide::SettingPolar],
) -> Table {
    use crate::analysis::glide::sink_at;
    let mut t = table(&[
        "speed (m/s)",
        "least sink with",
        "sink (m/s)",
        "neutral flaps (m/s)",
    ]);
    let polars: Vec<(&str, &crate::analysis::glide::GlidePolar)> =
        std::iter::once(("flaps neutral", base))
            .chain(
                settings
                    .iter()
                    .filter_map(|s| s.polar.as_ref().ok().map(|p| (s.name.as_str(), p))),
            )
            .collect();
    let lo = polars
        .iter()
        .map(|p| p.1.stall_speed_m_s)
        .fold(f64::INFINITY, f64::min);
    let hi = base.top_speed_m_s;
    for k in 0..BEST_SETTING_ROWS {
        let v = lo + (hi - lo) * (k as f64 + 0.5) / BEST_SETTING_ROWS as f64;
        let best = polars
            .iter()
            .filter_map(|(n, p)| sink_at(p, v).map(|s| (*n, s)))
            .min_by(|a, b| a.1.total_cmp(&b.1));
        let neutral = sink_at(base, v).map_or("-".to_string(), |s| num(s, 3));
        match best {
            Some((name, sink)) => t.add_row(vec![
                num(v, 1),
                crate::printable::printable(name).into_owned(),
                num(sink, 3),
                neutral,
            ]),
            None => t.add_row(vec![
                num(v, 1),
                "none trims here".into(),
                "-".into(),
                neutral,
            ]),
        };
    }
    right_align(&mut t, 0..1);
    right_align(&mut t, 2..4);
    t
}

/// What to say after a speed to fly that lies on an end of the speeds flown.
fn end_note(s: &crate::performance::flight_polar::SpeedToFly) -> String {
    let end = if s.at_control_limit && s.on_slow_end {
        " (the slowest the control trims)"
    } else if s.at_control_limit {
        " (the fastest the control trims)"
    } else if s.at_top_speed {
        " (top speed)"
    } else {
        ""
    };
    let drag = if s.drag_extrapolated {
        " (drag extrapolated)"
    } else {
        ""
    };
    format!("{end}{drag}")
}

/// The speed to fly between thermals for a few expected climbs.
pub(super) fn thermal_speed_table(p: &crate::analysis::glide::GlidePolar) -> Table {
    three_columns(
        &[
            "next climb expected (m/s)",
            "fly at (m/s)",
            "mean cross-country speed (km/h)",
        ],
        p.speed_to_fly_between_thermals.iter().map(|s| {
            [
                num(s.climb_m_s, 1),
                format!("{}{}", num(s.speed_m_s, 1), end_note(s)),
                num(3.6 * s.cross_country_speed_m_s, 1),
            ]
        }),
    )
}

/// The speed to fly in air sinking at a few rates.
pub(super) fn speed_to_fly_table(p: &crate::analysis::glide::GlidePolar) -> Table {
    three_columns(
        &[
            "air sinking at (m/s)",
            "fly at (m/s)",
            "glide ratio over the ground",
        ],
        p.speed_to_fly.iter().map(|s| {
            [
                num(s.air_sink_m_s, 1),
                format!("{}{}", num(s.speed_m_s, 1), end_note(s)),
                num(s.glide_ratio_in_air, 1),
            ]
        }),
    )
}

/// A right-aligned table of three columns.
fn three_columns(header: &[&str; 3], rows: impl Iterator<Item = [String; 3]>) -> Table {
    let mut t = table(header);
    for row in rows {
        t.add_row(row.to_vec());
    }
    right_align(&mut t, 0..3);
    t
}

pub(super) fn sample<T>(items: &[T], rows: usize) -> Vec<&T> {
    if items.len() <= rows {
        return items.iter().collect();
    }
    (0..rows)
        .map(|k| &items[k * (items.len() - 1) / (rows - 1)])
        .collect()
}

/// The flight polar as CSV: one row per speed, SI units, our own column names.
pub fn glide_csv(p: &crate::analysis::glide::GlidePolar) -> String {
    let mut out = String::from(
        "speed_m_s,sink_m_s,glide_ratio,cl,cd,cd_section,cd_induced,cd_fuselage,\
         alpha_deg,control_deg,within_throws,drag_extrapolated\n",
    );
    for q in &p.points {
        let _ = writeln!(
            out,
            "{:.4},{:.5},{:.3},{:.5},{:.6},{:.6},{:.6},{:.6},{:.4},{:.4},{},{}",
            q.speed_m_s,
            q.sink_m_s,
            q.glide_ratio,
            q.cl,
            q.drag.total(),
            q.drag.profile,
            q.drag.induced,
            q.drag.parasite,
            q.trim.alpha_rad.to_degrees(),
            q.trim.control_rad.to_degrees(),
            q.flyable,
            q.drag.beyond_polar
        );
    }
    out
}
