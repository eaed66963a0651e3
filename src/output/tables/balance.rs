//! The balance table: CG, neutral point and their ranges, the recommended band, ballast and
//! the CG for the target speed.

use super::{num, right_align, table_in};
use crate::analysis::{AftLimit, Analysis, BandPosition, ForwardLimit, Method};
use crate::balance::BallastOutcome;
use crate::model::Aircraft;
use crate::output::units::UnitSystem;
use comfy_table::Table;

/// The balance table: CG, neutral point and their ranges, the recommended band, ballast and
/// the CG for the target speed.
pub(super) fn balance_table(aircraft: &Aircraft, a: &Analysis, u: UnitSystem) -> Table {
    let mut t = table_in(u, &["quantity", "mm from datum", "% MAC", "note"]);
    cg_rows(&mut t, aircraft, a, u);
    neutral_point_rows(&mut t, aircraft, a, u);
    spread_rows(&mut t, a, u);
    band_rows(&mut t, aircraft, a, u);
    ballast_rows(&mut t, a, u);
    target_cg_rows(&mut t, aircraft, a, u);
    right_align(&mut t, 1..3);
    t
}

/// Rows of the CG from the mass list and from the weighing.
fn cg_rows(t: &mut Table, aircraft: &Aircraft, a: &Analysis, u: UnitSystem) {
    let g = &a.wing_geometry;
    let h = &a.headline;
    let g_ = u.mass_unit();
    let pct = |x: f64| num(g.percent_mac(x), 1);
    t.add_row(vec![
        "CG".to_string(),
        u.length(a.mass.cg_x_m, 1),
        pct(a.mass.cg_x_m),
        format!(
            "from the mass list; {} the wing root leading edge",
            u.aft_or_ahead(a.mass.cg_x_m - aircraft.wing.root_le_x_m)
        ),
    ]);
    if let Some(w) = &a.weighed {
        t.add_row(vec![
            "CG by weighing".to_string(),
            u.length(w.cg_x_m, 1),
            pct(w.cg_x_m),
            format!(
                "{} {g_} on the scales; static margin {} %",
                u.mass(w.total_kg, 0),
                num(100.0 * (h.neutral_point_x_m - w.cg_x_m) / g.mac_m, 1)
            ),
        ]);
    }
}

/// Rows of the headline neutral point and the closed form's cross-check.
fn neutral_point_rows(t: &mut Table, aircraft: &Aircraft, a: &Analysis, u: UnitSystem) {
    let g = &a.wing_geometry;
    let h = &a.headline;
    let mm = u.length_unit();
    let pct = |x: f64| num(g.percent_mac(x), 1);
    t.add_row(vec![
        "neutral point".to_string(),
        u.length(h.neutral_point_x_m, 1),
        pct(h.neutral_point_x_m),
        match h.method {
            Method::Numerical(_) if aircraft.fuselage.is_some() => {
                format!(
                    "{} with fuselage",
                    crate::output::wing_model_name(&aircraft.numerics)
                )
            }
            Method::Numerical(_) => format!(
                "{} (no [fuselage] given)",
                crate::output::wing_model_name(&aircraft.numerics)
            ),
            Method::Classical => "closed-form estimate".to_string(),
        },
    ]);
    if matches!(h.method, Method::Numerical(_)) {
        let c = &a.classical;
        t.add_row(vec![
            "neutral point, closed form".to_string(),
            u.length(c.neutral_point_x_m, 1),
            pct(c.neutral_point_x_m),
            format!(
                "cross-check: {} {mm} from the {}",
                u.length(c.neutral_point_x_m - h.neutral_point_x_m, 1),
                match aircraft.numerics.wing_model {
                    crate::model::WingModel::VortexLattice => "lattice",
                    crate::model::WingModel::LiftingLine => "lifting line",
                }
            ),
        ]);
    }
}

/// Rows of the neutral point's uncertainty range, the aft limit against its forward end and
/// the CG's range from the builder's tolerances.
fn spread_rows(t: &mut Table, a: &Analysis, u: UnitSystem) {
    let g = &a.wing_geometry;
    let h = &a.headline;
    let mm = u.length_unit();
    let pct = |x: f64| num(g.percent_mac(x), 1);
    let spread = 2.0 * a.neutral_point_spread.sigma_m;
    if spread.is_finite() && spread > 0.0 {
        let fwd_np = h.neutral_point_x_m - spread;
        t.add_row(vec![
            "neutral point, forward end of its range".to_string(),
            u.length(fwd_np, 1),
            pct(fwd_np),
            format!(
                "2 standard deviations ({} {mm}) of the inputs known least well (common-practice spreads)",
                u.length(spread, 1)
            ),
        ]);
    }
    let cg_spread = 2.0 * a.cg_spread.sigma_m;
    if cg_spread.is_finite() && cg_spread > 0.0 {
        let aft_cg = a.mass.cg_x_m + cg_spread;
        t.add_row(vec![
            "CG, aft end of its range".to_string(),
            u.length(aft_cg, 1),
            pct(aft_cg),
            format!(
                "2 standard deviations ({} {mm}) of your own tolerances (masses alone {} {mm}, positions alone {} {mm})",
                u.length(cg_spread, 1),
                u.length(2.0 * a.cg_spread.from_masses_m, 1),
                u.length(2.0 * a.cg_spread.from_positions_m, 1),
            ),
        ]);
    }
}

/// Rows of the recommended band, the MAC leading edge and the static margin.
fn band_rows(t: &mut Table, aircraft: &Aircraft, a: &Analysis, u: UnitSystem) {
    let g = &a.wing_geometry;
    let pct = |x: f64| num(g.percent_mac(x), 1);
    let h = &a.headline;
    let mm = u.length_unit();
    let forward_note = match a.band.forward_limit {
        ForwardLimit::StaticMargin => format!(
            "static margin {} %",
            num(100.0 * aircraft.margin_limits.max_static_margin, 0)
        ),
        ForwardLimit::ElevatorAuthority if a.band.forward_x_m >= a.band.aft_x_m => format!(
            "no range: full up {} cannot hold the stall (cg-band-empty)",
            aircraft.pitch_control_name()
        ),
        ForwardLimit::ElevatorAuthority => {
            let name = aircraft.pitch_control_name();
            let verb = if name == "elevons" { "hold" } else { "holds" };
            format!("full up {name} just {verb} the stall")
        }
        ForwardLimit::TailStall if a.band.forward_x_m >= a.band.aft_x_m => {
            "no range: the tailplane stalls downwards before the wing (cg-band-empty)".to_string()
        }
        ForwardLimit::TailStall => {
            "the tailplane just reaches its negative stall at the wing's stall".to_string()
        }
    };
    t.add_row(vec![
        "recommended CG, forward".to_string(),
        u.length(a.band.forward_x_m, 1),
        pct(a.band.forward_x_m),
        forward_note,
    ]);
    t.add_row(vec![
        "recommended CG, aft".to_string(),
        u.length(a.band.aft_x_m, 1),
        pct(a.band.aft_x_m),
        match a.band.aft_limit {
            AftLimit::StaticMargin => format!(
                "static margin {} %",
                num(100.0 * aircraft.margin_limits.min_static_margin, 0)
            ),
            AftLimit::NeutralPointRange => format!(
                "static margin {} % from the forward end of the neutral-point range ({} % on \
                 the computed neutral point)",
                num(100.0 * aircraft.margin_limits.min_static_margin, 0),
                num(
                    100.0 * (a.headline.neutral_point_x_m - a.band.aft_x_m) / g.mac_m,
                    1
                )
            ),
        },
    ]);
    t.add_row(vec![
        "MAC leading edge".to_string(),
        u.length(g.mac_le_x_m, 1),
        "0.0".to_string(),
        format!("MAC {} {mm}", u.length(g.mac_m, 1)),
    ]);
    t.add_row(vec![
        "static margin".to_string(),
        String::new(),
        num(100.0 * h.static_margin, 1),
        "neutral point minus CG".to_string(),
    ]);
}

/// One row per ballast bay: the target CG and the ballast that reaches it.
fn ballast_rows(t: &mut Table, a: &Analysis, u: UnitSystem) {
    let g = &a.wing_geometry;
    let pct = |x: f64| num(g.percent_mac(x), 1);
    let (mm, g_) = (u.length_unit(), u.mass_unit());
    for b in &a.ballast {
        let text = match b.outcome {
            BallastOutcome::NotNeeded => format!("{} {g_}, none needed", u.mass(0.0, 0)),
            BallastOutcome::Reachable { mass_kg } => format!("add {} {g_}", u.mass(mass_kg, 1)),
            BallastOutcome::ExceedsBay { needed_kg, max_kg } => format!(
                "needs {} {g_}, bay holds {} {g_}: cannot reach the target",
                u.mass(needed_kg, 1),
                u.mass(max_kg, 1)
            ),
            BallastOutcome::WrongSide => {
                let way = if b.target_x_m > a.mass.cg_x_m {
                    "aft"
                } else {
                    "forward"
                };
                format!(
                    "target {} {mm} {way} of the CG: this bay moves it the wrong way",
                    u.length((b.target_x_m - a.mass.cg_x_m).abs(), 1)
                )
            }
        };
        let text = if b.held_at_band_aft_end {
            format!(
                "{text}; the target margin lies aft of the recommended band, so this aims at \
                 the band's aft end"
            )
        } else if a.band.position(b.target_x_m) != BandPosition::Inside {
            format!("{text}; outside the recommended band")
        } else {
            text
        };
        t.add_row(vec![
            format!("target CG, ballast in {}", b.bay),
            u.length(b.target_x_m, 1),
            pct(b.target_x_m),
            text,
        ]);
    }
}

/// The CG that trims at the target speed with the present incidences.
fn target_cg_rows(t: &mut Table, aircraft: &Aircraft, a: &Analysis, u: UnitSystem) {
    let g = &a.wing_geometry;
    let pct = |x: f64| num(g.percent_mac(x), 1);
    if let Some(f) = a.full.as_ref() {
        match (f.cg_for_target_x_m, aircraft.targets.trim_speed_m_s) {
            (Some(x), _) => t.add_row(vec![
                "CG for the target trim speed".to_string(),
                u.length(x, 1),
                pct(x),
                if a.band.position(x) != BandPosition::Inside {
                    "with the present incidences; outside the recommended band: change the \
                     incidences instead"
                        .to_string()
                } else {
                    "with the present incidences".to_string()
                },
            ]),
            (None, Some(_)) => t.add_row(vec![
                "CG for the target trim speed".to_string(),
                "-".to_string(),
                "-".to_string(),
                if a.headline.static_margin <= 0.0 {
                    "not solved: the CG is behind the neutral point".to_string()
                } else {
                    "none ahead of the neutral point: change the incidences instead".to_string()
                },
            ]),
            (None, None) => t,
        };
    }
}
