//! The handful of figures that `compare` and the report put side by side, and their move to
//! one common reference point.

use super::{Analysis, CgBand};
use crate::balance::BallastOutcome;
use crate::caution::Level;
use crate::model::Aircraft;

/// The handful of figures a builder compares between setups and reads first on a report.
#[derive(Debug, Clone, PartialEq)]
pub struct KeyFigures {
    /// Name of the configuration.
    pub name: String,
    /// Total mass, kg.
    pub mass_kg: f64,
    /// Wing loading, kg/m^2.
    pub wing_loading_kg_m2: f64,
    /// CG, m aft of the datum.
    pub cg_x_m: f64,
    /// CG aft of the wing root leading edge, m (the number measured on the model).
    pub cg_from_wing_root_le_m: f64,
    /// CG in percent of MAC.
    pub cg_percent_mac: f64,
    /// Neutral point, m aft of the datum.
    pub neutral_point_x_m: f64,
    /// Static margin, fraction of MAC.
    pub static_margin: f64,
    /// Recommended CG band, m aft of the datum.
    pub band: CgBand,
    /// Decalage (front surface minus rear), rad, when there is a stabiliser.
    pub decalage_rad: Option<f64>,
    /// Elevon deflection that trims a tailless wing at its design CL, rad (trailing edge down
    /// positive), when it has elevons and one does.
    pub elevon_trim_rad: Option<f64>,
    /// Trim CL, when trimmed.
    pub trim_cl: Option<f64>,
    /// Trim speed, m/s, when trimmed.
    pub trim_speed_m_s: Option<f64>,
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
    /// Ballast needed for the target static margin in the first bay that can reach it, kg.
    pub ballast_kg: Option<(String, f64)>,
    /// Minimum sink and its speed, m/s (flight polar only).
    pub min_sink_m_s: Option<(f64, f64)>,
    /// Best glide ratio and its speed, m/s (flight polar only).
    pub best_glide: Option<(f64, f64)>,
    /// Number of warnings.
    pub warnings: usize,
    /// Number of dangers.
    pub dangers: usize,
    /// x of the wing root leading edge, m (to express positions as builders measure them).
    pub wing_root_le_x_m: f64,
    /// x of the wing's MAC leading edge, m (the common reference of a comparison).
    pub mac_le_x_m: f64,
    /// What x = 0 is, in the builder's words (or [`COMMON_REFERENCE`] once moved there).
    pub datum: String,
    /// Codes of the warnings and dangers raised, most serious first.
    pub caution_codes: Vec<(Level, &'static str)>,
}

/// The datum of key figures whose positions were moved to the wing's MAC leading edge.
pub const COMMON_REFERENCE: &str = "the wing's MAC leading edge";

/// Whether the configurations' datums differ (compared as written, ignoring case and
/// surrounding spaces); when they do, every position of every configuration is moved to be
/// measured from its own wing's MAC leading edge, so that the positions can be compared.
/// Returns true when it moved them.
pub fn to_common_reference(columns: &mut [KeyFigures]) -> bool {
    let key = |k: &KeyFigures| k.datum.trim().to_lowercase();
    let Some(first) = columns.first().map(key) else {
        return false;
    };
    if columns.iter().all(|k| key(k) == first) {
        return false;
    }
    for k in columns.iter_mut() {
        let dx = k.mac_le_x_m;
        k.cg_x_m -= dx;
        k.neutral_point_x_m -= dx;
        k.band.forward_x_m -= dx;
        k.band.aft_x_m -= dx;
        k.wing_root_le_x_m -= dx;
        k.mac_le_x_m = 0.0;
        k.datum = COMMON_REFERENCE.to_string();
    }
    true
}

impl KeyFigures {
    /// Collect the key figures of an analysed aircraft.
    pub fn of(aircraft: &Aircraft, a: &Analysis) -> KeyFigures {
        let g = &a.wing_geometry;
        let h = &a.headline;
        KeyFigures {
            name: aircraft.name.clone(),
            mass_kg: a.mass.total_kg,
            wing_loading_kg_m2: a.wing_loading_kg_m2,
            cg_x_m: a.mass.cg_x_m,
            cg_from_wing_root_le_m: a.mass.cg_x_m - aircraft.wing.root_le_x_m,
            cg_percent_mac: g.percent_mac(a.mass.cg_x_m),
            neutral_point_x_m: h.neutral_point_x_m,
            static_margin: h.static_margin,
            band: a.band,
            decalage_rad: aircraft.decalage_rad(),
            elevon_trim_rad: a
                .full
                .as_ref()
                .and_then(|f| f.tailless)
                .and_then(|t| t.elevon_to_trim_rad),
            trim_cl: h.trim.map(|t| t.cl),
            trim_speed_m_s: h.trim.map(|t| t.speed_m_s),
            stall_speed_m_s: h.stall_speed_m_s,
            ballast_kg: a.ballast.iter().find_map(|b| match b.outcome {
                BallastOutcome::Reachable { mass_kg } => Some((b.bay.clone(), mass_kg)),
                BallastOutcome::NotNeeded => Some((b.bay.clone(), 0.0)),
                _ => None,
            }),
            min_sink_m_s: a
                .glide_polar
                .as_ref()
                .map(|p| (p.min_sink.point.sink_m_s, p.min_sink.point.speed_m_s)),
            best_glide: a
                .glide_polar
                .as_ref()
                .map(|p| (p.best_glide.point.glide_ratio, p.best_glide.point.speed_m_s)),
            warnings: a
                .cautions
                .iter()
                .filter(|c| c.level == Level::Warning)
                .count(),
            dangers: a
                .cautions
                .iter()
                .filter(|c| c.level == Level::Danger)
                .count(),
            wing_root_le_x_m: aircraft.wing.root_le_x_m,
            mac_le_x_m: g.mac_le_x_m,
            datum: aircraft.datum.clone(),
            caution_codes: {
                let mut codes: Vec<(Level, &'static str)> = a
                    .cautions
                    .iter()
                    .filter(|c| c.level >= Level::Warning)
                    .map(|c| (c.level, c.code))
                    .collect();
                codes.sort_by_key(|c| std::cmp::Reverse(c.0));
                codes
            },
        }
    }
}
