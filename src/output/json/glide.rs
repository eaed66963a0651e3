//! The glide part of `check --json`: `/glide` (the headline figures) and `/flight_polar`
//! (the trimmed speed polar with its optimums and speeds to fly), SI units as the parent
//! document states.

use super::r;
use crate::analysis::glide::GlidePolar;
use crate::analysis::Analysis;
use crate::lifting_line::TrimControl;
use crate::model::Aircraft;
use crate::performance::aircraft_drag::AircraftTrim;
use crate::performance::flight_polar::{GlidePoint, Optimum};
use serde::Serialize;

/// `/glide`: the headline glide figures, from the flight polar when it was computed, else
/// from the parabolic estimate.
#[derive(Debug, Serialize)]
pub struct GlideJson {
    /// `flight-polar`; `none-unstable` (negative static margin: no glide figures) or `none`
    /// (no glide polar could be computed: see the cautions).
    pub source: &'static str,
    /// Best glide ratio (horizontal distance over height lost), or null.
    pub best_glide_ratio: Option<f64>,
    /// m/s
    pub best_glide_speed_m_s: Option<f64>,
    /// Minimum sink rate, m/s.
    pub min_sink_m_s: Option<f64>,
    /// m/s
    pub min_sink_speed_m_s: Option<f64>,
    /// True when minimum sink lies on the stall end of the range (not a true optimum).
    pub min_sink_at_stall: Option<bool>,
    /// 1.2 times the stall speed when the least sink lies below it (fly above it), m/s, or
    /// null.
    pub min_sink_slow_limit_m_s: Option<f64>,
    /// Span efficiency C_L^2 / (pi A C_Di) at best glide (from the wake in the flight polar;
    /// the Oswald estimate in the parabolic one).
    pub span_efficiency: Option<f64>,
    /// The parabolic polar from the drag build-up and Raymer's Oswald factor, kept as a
    /// cross-check.
    pub parabolic_cross_check: ParabolicJson,
}

/// `/glide/parabolic_cross_check`
#[derive(Debug, Serialize)]
pub struct ParabolicJson {
    /// Zero-lift drag coefficient from the build-up.
    pub cd0: f64,
    /// Raymer's Oswald span efficiency.
    pub oswald_span_efficiency: f64,
    /// Best glide ratio L/D.
    pub best_glide_ratio: f64,
    /// m/s
    pub best_glide_speed_m_s: f64,
    /// Minimum sink rate, m/s.
    pub min_sink_m_s: f64,
    /// m/s
    pub min_sink_speed_m_s: f64,
    /// True when minimum sink would lie beyond CL_max and was taken at CL_max.
    pub min_sink_at_cl_max: bool,
}

/// `/flight_polar`
#[derive(Debug, Serialize)]
pub struct FlightPolarJson {
    /// `elevator`, `elevons` or `stabiliser-incidence`: what trims each point.
    pub trimmed_by: &'static str,
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
    /// Top speed of the range, m/s.
    pub top_speed_m_s: f64,
    /// Minimum sink.
    pub min_sink: PolarOptimumJson,
    /// Best glide.
    pub best_glide: PolarOptimumJson,
    /// Speed to fly through sinking air (no climb expected).
    pub speed_to_fly: Vec<SpeedToFlyJson>,
    /// Speed to fly between thermals in still air for an expected climb (MacCready).
    pub speed_to_fly_between_thermals: Vec<ThermalSpeedJson>,
    /// Where each airfoil's section drag comes from.
    pub profile_drag: Vec<ProfileDragJson>,
    /// The polar, in rising speed.
    pub points: Vec<PolarPointJson>,
}

/// `/flap_settings/N`
#[derive(Debug, Serialize)]
pub struct FlapSettingJson {
    /// The setting's name.
    pub name: String,
    /// Its polar (the fields of `/flight_polar`), or null.
    pub polar: Option<FlightPolarJson>,
    /// Why there is no polar, or null.
    pub no_polar: Option<String>,
}

/// `/flight_polar/min_sink`, `/flight_polar/best_glide`
#[derive(Debug, Serialize)]
pub struct PolarOptimumJson {
    /// The point.
    #[serde(flatten)]
    pub point: PolarPointJson,
    /// True when it lies on the stall end of the range.
    pub at_stall: bool,
    /// True when it lies on the top-speed end.
    pub at_top_speed: bool,
    /// True when it lies where the control runs out.
    pub at_control_limit: bool,
}

/// `/flight_polar/points/N`
#[derive(Debug, Serialize)]
pub struct PolarPointJson {
    /// m/s
    pub speed_m_s: f64,
    /// Sink rate, m/s.
    pub sink_m_s: f64,
    /// Glide ratio.
    pub glide_ratio: f64,
    /// Lift coefficient.
    pub cl: f64,
    /// Total drag coefficient.
    pub cd: f64,
    /// Section (profile) drag of the lifting surfaces.
    pub cd_profile: f64,
    /// Induced drag of all surfaces (wake).
    pub cd_induced: f64,
    /// Fuselage drag.
    pub cd_parasite: f64,
    /// Span efficiency from the wake.
    pub span_efficiency: Option<f64>,
    /// Fuselage-datum angle of attack, deg.
    pub alpha_deg: f64,
    /// Trim control setting, deg (elevator trailing edge down positive, or the tailplane's
    /// incidence change).
    pub control_deg: f64,
    /// Within the control throws.
    pub within_throws: bool,
    /// Stabiliser lift coefficient on its own area.
    pub stabiliser_cl: f64,
    /// True when some strip's drag was extrapolated beyond its section polar.
    pub drag_extrapolated: bool,
}

/// `/flight_polar/speed_to_fly/N`
#[derive(Debug, Serialize)]
pub struct SpeedToFlyJson {
    /// Sink of the air, m/s.
    pub air_sink_m_s: f64,
    /// m/s
    pub speed_m_s: f64,
    /// Glide ratio over the ground in that air.
    pub glide_ratio_in_air: f64,
    /// True when it is the top of the range.
    pub at_top_speed: bool,
    /// True when a section's drag there was extrapolated beyond its polar.
    pub drag_extrapolated: bool,
}

/// `/flight_polar/speed_to_fly_between_thermals/N`
#[derive(Debug, Serialize)]
pub struct ThermalSpeedJson {
    /// Expected climb in the next thermal, m/s (the MacCready setting).
    pub climb_m_s: f64,
    /// Airspeed to fly between thermals, m/s.
    pub speed_m_s: f64,
    /// Mean cross-country speed, m/s.
    pub cross_country_speed_m_s: f64,
    /// True when it is the top of the range.
    pub at_top_speed: bool,
    /// True when a section's drag there was extrapolated beyond its polar.
    pub drag_extrapolated: bool,
}

/// `/flight_polar/profile_drag/N`
#[derive(Debug, Serialize)]
pub struct ProfileDragJson {
    /// Airfoil name.
    pub airfoil: String,
    /// Reynolds numbers of its viscous polars.
    pub reynolds: Vec<f64>,
    /// Why the flat-plate estimate was used, or null.
    pub flat_plate_reason: Option<String>,
}

fn polar_point_json(p: &GlidePoint<AircraftTrim>) -> PolarPointJson {
    PolarPointJson {
        speed_m_s: r(p.speed_m_s, 3),
        sink_m_s: r(p.sink_m_s, 4),
        glide_ratio: r(p.glide_ratio, 2),
        cl: r(p.cl, 4),
        cd: r(p.drag.total(), 5),
        cd_profile: r(p.drag.profile, 5),
        cd_induced: r(p.drag.induced, 5),
        cd_parasite: r(p.drag.parasite, 5),
        span_efficiency: p.trim.span_efficiency.map(|e| r(e, 4)),
        alpha_deg: r(p.trim.alpha_rad.to_degrees(), 3),
        control_deg: r(p.trim.control_rad.to_degrees(), 3),
        within_throws: p.trim.within_throws,
        stabiliser_cl: r(p.trim.stabiliser_cl, 4),
        drag_extrapolated: p.drag.beyond_polar,
    }
}

/// What trims the flight polar, as a JSON word.
pub fn trimmed_by(aircraft: &Aircraft, control: TrimControl) -> &'static str {
    match control {
        TrimControl::Elevator if aircraft.stabiliser.is_none() => "elevons",
        TrimControl::Elevator => "elevator",
        TrimControl::Incidence(_) => "stabiliser-incidence",
    }
}

pub(super) fn flight_polar_json(aircraft: &Aircraft, p: &GlidePolar) -> FlightPolarJson {
    let optimum = |o: &Optimum<AircraftTrim>| PolarOptimumJson {
        point: polar_point_json(&o.point),
        at_stall: o.at_stall,
        at_top_speed: o.at_top_speed,
        at_control_limit: o.at_control_limit,
    };
    FlightPolarJson {
        trimmed_by: trimmed_by(aircraft, p.control),
        stall_speed_m_s: r(p.stall_speed_m_s, 3),
        top_speed_m_s: r(p.top_speed_m_s, 3),
        min_sink: optimum(&p.min_sink),
        best_glide: optimum(&p.best_glide),
        speed_to_fly: p
            .speed_to_fly
            .iter()
            .map(|s| SpeedToFlyJson {
                air_sink_m_s: s.air_sink_m_s,
                speed_m_s: r(s.speed_m_s, 3),
                glide_ratio_in_air: r(s.glide_ratio_in_air, 2),
                at_top_speed: s.at_top_speed,
                drag_extrapolated: s.drag_extrapolated,
            })
            .collect(),
        speed_to_fly_between_thermals: p
            .speed_to_fly_between_thermals
            .iter()
            .map(|s| ThermalSpeedJson {
                climb_m_s: s.climb_m_s,
                speed_m_s: r(s.speed_m_s, 3),
                cross_country_speed_m_s: r(s.cross_country_speed_m_s, 3),
                at_top_speed: s.at_top_speed,
                drag_extrapolated: s.drag_extrapolated,
            })
            .collect(),
        profile_drag: p
            .profile_sources
            .iter()
            .map(|s| ProfileDragJson {
                airfoil: s.airfoil.clone(),
                reynolds: s.reynolds.clone(),
                flat_plate_reason: s.flat_plate_reason.clone(),
            })
            .collect(),
        points: p.points.iter().map(polar_point_json).collect(),
    }
}

pub(super) fn glide_json(a: &Analysis) -> GlideJson {
    let g = &a.glide;
    let cross = ParabolicJson {
        cd0: r(g.cd0, 5),
        oswald_span_efficiency: r(g.span_efficiency, 4),
        best_glide_ratio: r(g.performance.best_glide.glide_ratio, 3),
        best_glide_speed_m_s: r(g.performance.best_glide.speed_m_s, 3),
        min_sink_m_s: r(g.performance.min_sink.sink_m_s, 4),
        min_sink_speed_m_s: r(g.performance.min_sink.speed_m_s, 3),
        min_sink_at_cl_max: g.performance.min_sink.limited_by_cl_max,
    };
    let figures = a.glide_figures();
    GlideJson {
        source: match (&figures, &a.glide_polar) {
            (None, _) if a.headline.static_margin <= 0.0 => "none-unstable",
            (None, _) => "none",
            (Some(_), _) => "flight-polar",
        },
        best_glide_ratio: figures.map(|g| r(g.best_glide_ratio, 3)),
        best_glide_speed_m_s: figures.map(|g| r(g.best_glide_speed_m_s, 3)),
        min_sink_m_s: figures.map(|g| r(g.min_sink_m_s, 4)),
        min_sink_speed_m_s: figures.map(|g| r(g.min_sink_speed_m_s, 3)),
        min_sink_at_stall: figures.map(|g| g.min_sink_at_stall),
        min_sink_slow_limit_m_s: figures.and_then(|g| g.min_sink_slow_limit_m_s.map(|v| r(v, 3))),
        span_efficiency: match (&figures, &a.glide_polar) {
            (None, _) => None,
            (Some(_), Some(p)) => p.best_glide.point.trim.span_efficiency.map(|e| r(e, 4)),
            (Some(_), None) => Some(cross.oswald_span_efficiency),
        },
        parabolic_cross_check: cross,
    }
}

/// `/flap_settings`
pub(super) fn flap_settings_json(aircraft: &Aircraft, a: &Analysis) -> Vec<FlapSettingJson> {
    a.flap_polars
        .iter()
        .map(|s| FlapSettingJson {
            name: s.name.clone(),
            polar: s
                .polar
                .as_ref()
                .ok()
                .map(|p| flight_polar_json(aircraft, p)),
            no_polar: s.polar.as_ref().err().map(|e| match e {
                crate::analysis::glide::NoPolar::Failed(e) => e.to_string(),
                crate::analysis::glide::NoPolar::NoStall => "no trimmed stall".to_string(),
                crate::analysis::glide::NoPolar::NoTrimControl => "no pitch control".to_string(),
            }),
        })
        .collect()
}
