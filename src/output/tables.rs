//! Terminal tables for `check`, in the builder's units (mm, g, g/dm^2, deg, m/s and km/h), with
//! the unit in every header.

use crate::analysis::Analysis;
use crate::caution::Level;
use crate::model::{Aircraft, StabiliserRole};
use crate::output::units::UnitSystem;
use crate::section::ClMaxSource;
use comfy_table::{presets, Cell, CellAlignment, Table};
use std::fmt::Write as _;

mod balance;
mod glide;

pub use glide::glide_csv;
use glide::{
    best_setting_table, flap_settings_table, glide_polar_table, sample, speed_to_fly_table,
    thermal_speed_table,
};
mod solves;
mod trim;

use balance::balance_table;
use solves::solves_table;
use trim::trim_table;

fn table(header: &[&str]) -> Table {
    table_in(UnitSystem::Metric, header)
}

/// A table whose header words name metric units, printed in `u`.
fn table_in(u: UnitSystem, header: &[&str]) -> Table {
    let mut t = Table::new();
    t.load_style(presets::UTF8_FULL_CONDENSED);
    t.set_header(header.iter().map(|h| Cell::new(u.header(h))));
    t
}

fn right_align_from(t: &mut Table, first: usize) {
    let n = t.column_count();
    right_align(t, first..n);
}

fn right_align(t: &mut Table, columns: std::ops::Range<usize>) {
    for i in columns {
        if let Some(c) = t.column_mut(i) {
            c.set_cell_alignment(CellAlignment::Right);
        }
    }
}

/// Format a number with `d` decimals, never printing `-0`.
pub fn num(v: f64, d: usize) -> String {
    let s = format!("{v:.d$}");
    if s.trim_start_matches('-')
        .chars()
        .all(|c| c == '0' || c == '.')
    {
        s.trim_start_matches('-').to_string()
    } else {
        s
    }
}

/// The whole human-readable `check` report, lengths and masses in `u` (the cautions keep
/// the metric units they are written in).
pub fn check_report(aircraft: &Aircraft, a: &Analysis, source: &str, u: UnitSystem) -> String {
    let mut out = String::new();
    let _ = writeln!(out, "{}  ({source})", aircraft.name);
    if !aircraft.notes.trim().is_empty() {
        let _ = writeln!(out, "{}", aircraft.notes.trim());
    }
    let _ = writeln!(
        out,
        "x is measured aft from the datum: {}. Air density {} kg/m^3.\n",
        aircraft.datum,
        num(a.air.density_kg_m3, 3)
    );
    out.push_str("Geometry\n");
    out.push_str(&geometry_table(aircraft, a, u).to_string());
    out.push_str(&geometry_footer(aircraft, a, u));
    out.push_str("\n\nAirfoil sections\n");
    out.push_str(&sections_table(aircraft, a).to_string());
    out.push_str("\n\nMasses\n");
    out.push_str(&mass_table(aircraft, a, u).to_string());
    let _ = write!(
        out,
        "\nWing loading {} {}.",
        u.loading(a.wing_loading_kg_m2),
        u.header("g/dm^2")
    );
    out.push_str("\n\nBalance and stability\n");
    out.push_str(&balance_table(aircraft, a, u).to_string());
    out.push('\n');
    out.push_str(&cg_gauge(a, 60, u));

    out.push_str("\nTrim and stall\n");
    out.push_str(&trim_table(aircraft, a, u).to_string());
    if let Some(t) = spanwise_table(a, u) {
        out.push_str("\n\nSpanwise loading of the wing (starboard half, at the strip centres)\n");
        out.push_str(&t.to_string());
    }
    if let Some(p) = &a.glide_polar {
        out.push_str("\n\nGlide over the speed range (trimmed, still air)\n");
        out.push_str(&glide_polar_table(aircraft, p).to_string());
        out.push_str("\n\nSpeed to fly through sinking air\n");
        out.push_str(&speed_to_fly_table(p).to_string());
        out.push_str("\n\nSpeed to fly between thermals (still air, MacCready setting)\n");
        out.push_str(&thermal_speed_table(p).to_string());
        if !a.flap_polars.is_empty() {
            out.push_str("\n\nFlap settings (each trimmed over its speed range)\n");
            out.push_str(&flap_settings_table(aircraft, p, &a.flap_polars).to_string());
            out.push_str("\n\nLeast sink at each speed, by flap setting\n");
            out.push_str(&best_setting_table(p, &a.flap_polars).to_string());
        }
    }
    if let Some(t) = solves_table(aircraft, a) {
        if aircraft.stabiliser.is_some() {
            out.push_str("\n\nDecalage and elevator\n");
        } else {
            out.push_str("\n\nTailless trim and elevons\n");
        }
        out.push_str(&t.to_string());
    }
    out.push_str("\n\nCautions\n");
    out.push_str(&cautions_table(a).to_string());
    out.push_str("\n\nMethods\n");
    for line in crate::output::report::methods(aircraft, a) {
        out.push_str(&wrap(&format!("- {line}"), 100));
        out.push('\n');
    }
    out
}

fn geometry_table(aircraft: &Aircraft, a: &Analysis, u: UnitSystem) -> Table {
    let mut t = table_in(
        u,
        &[
            "surface",
            "area dm^2",
            "span mm",
            "aspect ratio",
            "taper",
            "MAC mm",
            "MAC LE x mm",
            "incidence deg",
            "lift slope /rad",
        ],
    );
    let mut row = |name: &str, s: &crate::stability::classical::EquivalentSurface| {
        let g = &s.geometry;
        t.add_row(vec![
            name.to_string(),
            u.area(g.area_m2),
            u.length(g.span_m, 0),
            num(g.aspect_ratio, 2),
            num(g.taper, 2),
            u.length(g.mac_m, 1),
            u.length(g.mac_le_x_m, 1),
            num(s.incidence_rad.to_degrees(), 2),
            num(s.lift_slope_per_rad, 3),
        ]);
    };
    row("wing", &a.wing);
    if let (Some(st), Some(eq)) = (&aircraft.stabiliser, &a.stabiliser) {
        let name = match st.role {
            StabiliserRole::Tail => "tail",
            StabiliserRole::Canard => "canard",
        };
        row(name, eq);
    }
    right_align_from(&mut t, 1);
    t
}

fn geometry_footer(aircraft: &Aircraft, a: &Analysis, u: UnitSystem) -> String {
    let vee = match (&aircraft.stabiliser, &a.stabiliser) {
        (Some(st), Some(eq)) => {
            let true_area = crate::planform::true_area_m2(&st.surface);
            let cos = if true_area > 0.0 {
                (eq.geometry.area_m2 / true_area).min(1.0)
            } else {
                1.0
            };
            if cos < crate::planform::VEE_TAIL_AREA_RATIO {
                format!(
                    "\nThe stabiliser is a V-tail ({} deg mean dihedral): area {} {} in its own plane, \
                     {} projected; in pitch it acts about as a flat tail of {} {} (area x cos^2, \
                     Purser and Campbell, NACA Report 823); the lattice models the dihedral itself. \
                     The volume coefficient below is on the projected area; on the pitch area it \
                     is about {}. Yaw and the ruddervators' yaw use are not analysed.",
                    num(cos.acos().to_degrees(), 0),
                    u.area(true_area),
                    u.area_unit(),
                    u.area(eq.geometry.area_m2),
                    u.area(eq.pitch_area_m2),
                    u.area_unit(),
                    a.tail_volume
                        .as_ref()
                        .map_or("-".to_string(), |tv| num(tv.coefficient * cos, 3)),
                )
            } else {
                String::new()
            }
        }
        _ => String::new(),
    };
    vee + &fin_footer(aircraft, a, u)
        + &match (&a.tail_volume, &aircraft.stabiliser) {
        (Some(tv), Some(s)) if s.role == crate::model::StabiliserRole::Canard => format!(
            "\nCanard arm {} {} ahead (MAC quarter chord to MAC quarter chord), volume coefficient {} (canard area times arm over wing area times MAC), decalage {} deg.",
            u.length(tv.arm_m.abs(), 0),
            u.length_unit(),
            num(tv.coefficient.abs(), 3),
            num(aircraft.decalage_rad().unwrap_or(0.0).to_degrees(), 2)
        ),
        (Some(tv), Some(_)) => format!(
            "\nStabiliser arm {} {} (MAC quarter chord to MAC quarter chord), volume coefficient {}, decalage {} deg.",
            u.length(tv.arm_m, 0),
            u.length_unit(),
            num(tv.coefficient, 3),
            num(aircraft.decalage_rad().unwrap_or(0.0).to_degrees(), 2)
        ),
        _ => "\nNo stabiliser: tailless.".to_string(),
    }
}

/// The lateral note of a fin and of a V-tail (which is the fin of its aircraft).
fn fin_footer(aircraft: &Aircraft, a: &Analysis, u: UnitSystem) -> String {
    let Some(note) = &a.fin else {
        return String::new();
    };
    let mut out = String::new();
    if let Some(f) = &note.fin {
        let (lo, hi) = crate::analysis::FIN_VOLUME_RANGE;
        let mass = match aircraft.fin.as_ref().and_then(|f| f.mass_item.as_ref()) {
            Some(name) => format!(" Its mass is the listed item `{name}`."),
            None => " Its mass, if any, is among the listed masses.".to_string(),
        };
        out += &format!(
            "\nFin: area {} {}, arm {} {} (wing MAC quarter chord to fin MAC quarter chord), \
             volume coefficient S_v l_v / (S b) {} (typical {} for sailplanes to {}, Raymer, \
             Aircraft Design).{mass} A lateral note only: the fin does not enter the pitch figures.",
            u.area(f.side_area_m2),
            u.area_unit(),
            u.length(f.arm_m, 0),
            u.length_unit(),
            num(f.volume_coefficient, 3),
            num(lo, 2),
            num(hi, 2),
        );
    }
    if let Some(v) = &note.vee_tail {
        out += &format!(
            "\nThe V-tail is the fin: side area {} {} (area x sin^2 of the dihedral, Purser and \
             Campbell, NACA Report 823), fin volume coefficient {}; no fin caution is given for a \
             V-tail. A lateral note only.",
            u.area(v.side_area_m2),
            u.area_unit(),
            num(v.volume_coefficient, 3),
        );
    }
    out
}

fn sections_table(aircraft: &Aircraft, a: &Analysis) -> Table {
    let mut t = table(&[
        "airfoil",
        "method",
        "zero-lift deg",
        "lift slope /rad",
        "cm ac",
        "ac x/c",
        "cl max",
    ]);
    for (af, s) in aircraft.airfoils.iter().zip(&a.sections) {
        let clmax = match s.cl_max_source {
            ClMaxSource::Given => num(s.cl_max, 2),
            ClMaxSource::Default => format!("{} (default)", num(s.cl_max, 2)),
        };
        t.add_row(vec![
            af.name.clone(),
            s.method.as_str().to_string(),
            num(s.alpha_zero_lift_rad.to_degrees(), 2),
            num(s.cl_alpha_per_rad, 3),
            num(s.cm_ac, 4),
            num(s.x_ac_c, 3),
            clmax,
        ]);
    }
    right_align_from(&mut t, 2);
    t
}

fn mass_table(aircraft: &Aircraft, a: &Analysis, u: UnitSystem) -> Table {
    let mut t = table_in(u, &["item", "mass g", "x mm", "z mm", "moment g*m"]);
    for m in &aircraft.masses {
        t.add_row(vec![
            m.name.clone(),
            u.mass(m.mass_kg, 1),
            u.length(m.x_m, 1),
            m.z_m.map(|z| u.length(z, 1)).unwrap_or_else(|| "-".into()),
            u.moment(m.mass_kg * m.x_m),
        ]);
    }
    t.add_row(vec![
        "total / CG".to_string(),
        u.mass(a.mass.total_kg, 1),
        u.length(a.mass.cg_x_m, 1),
        a.mass
            .cg_z_m
            .map(|z| u.length(z, 1))
            .unwrap_or_else(|| "-".into()),
        u.moment(a.mass.total_kg * a.mass.cg_x_m),
    ]);
    right_align_from(&mut t, 1);
    t
}

fn cautions_table(a: &Analysis) -> Table {
    let mut t = table(&["level", "code", "message"]);
    let mut sorted: Vec<_> = a.cautions.iter().collect();
    sorted.sort_by_key(|c| std::cmp::Reverse(c.level));
    for c in sorted {
        let level = match c.level {
            Level::Danger => "DANGER",
            Level::Warning => "warning",
            Level::Note => "note",
        };
        t.add_row(vec![
            level.to_string(),
            c.code.to_string(),
            wrap(&crate::output::cautions::message(c), 72),
        ]);
    }
    t
}

/// Wrap text at word boundaries to lines of at most `width` characters.
pub fn wrap(text: &str, width: usize) -> String {
    let mut out = String::new();
    let mut line_len = 0;
    for word in text.split_whitespace() {
        let w = word.chars().count();
        if line_len > 0 && line_len + 1 + w > width {
            out.push('\n');
            line_len = 0;
        } else if line_len > 0 {
            out.push(' ');
            line_len += 1;
        }
        out.push_str(word);
        line_len += w;
    }
    out
}

/// A one-line picture of the CG against the recommended band and the neutral point, nose to
/// the left, followed by a legend line:
/// `  61 mm [=====G=====]   N  99 mm`.
pub fn cg_gauge(a: &Analysis, width: usize, u: UnitSystem) -> String {
    let cg = a.mass.cg_x_m;
    let np = a.headline.neutral_point_x_m;
    let (fwd, aft) = (a.band.forward_x_m, a.band.aft_x_m);
    let lo_raw = fwd.min(cg).min(np);
    let hi_raw = aft.max(cg).max(np);
    let pad = 0.1 * (hi_raw - lo_raw).max(1e-3);
    let (lo, hi) = (lo_raw - pad, hi_raw + pad);
    let width = width.max(20);
    let col = |x: f64| -> usize {
        let f = ((x - lo) / (hi - lo)).clamp(0.0, 1.0);
        ((f * (width - 1) as f64).round() as usize).min(width - 1)
    };
    let mut line: Vec<char> = vec!['.'; width];
    let (cf, ca) = (col(fwd), col(aft));
    for c in line.iter_mut().take(ca + 1).skip(cf) {
        *c = '=';
    }
    line[cf] = '[';
    line[ca] = ']';
    line[col(np)] = 'N';
    line[col(cg)] = 'G';
    let gauge: String = line.into_iter().collect();
    format!(
        "{} {mm} {gauge} {} {mm}\nnose left; [ ] recommended CG band, G centre of gravity, N neutral point\n",
        u.length(lo, 0),
        u.length(hi, 0),
        mm = u.length_unit()
    )
}

/// The wing's spanwise loading at trim and at the stall (lifting line only).
fn spanwise_table(a: &Analysis, u: UnitSystem) -> Option<Table> {
    let f = a.full.as_ref()?;
    let stall = f.stall.as_ref()?;
    let at_stall = crate::stability::trim::wing_starboard(&stall.result);
    let at_trim = f
        .trim
        .as_ref()
        .map(|t| crate::stability::trim::wing_starboard(&t.result));
    let mut t = table_in(
        u,
        &[
            "% semispan",
            "y mm",
            "chord mm",
            "cl at trim",
            "cl/cl max at trim",
            "cl/cl max at stall",
        ],
    );
    for st in sample(&at_stall, 9) {
        let trim_row = at_trim
            .as_ref()
            .and_then(|rows| rows.iter().find(|r| (r.y_m - st.y_m).abs() < 1e-9));
        t.add_row(vec![
            num(st.percent_semispan, 0),
            u.length(st.y_m, 0),
            u.length(st.chord_m, 0),
            trim_row.map_or("-".into(), |r| num(r.cl, 3)),
            trim_row.map_or("-".into(), |r| num(r.cl_ratio, 2)),
            num(st.cl_ratio, 2),
        ]);
    }
    right_align_from(&mut t, 0);
    Some(t)
}
