//! The aerodynamic part of `check --json`: the surfaces, the stabiliser, the sections, the
//! stability and trim figures, the stall, the solver record and the spanwise loading, SI
//! units as the parent document states.

use super::{finite_or_zero, r};
use crate::analysis::{Analysis, Method};
use crate::model::{Aircraft, StabiliserRole};
use crate::section::ClMaxSource;
use serde::Serialize;

/// `/wing`
#[derive(Debug, Serialize)]
pub struct SurfaceJson {
    /// m^2
    pub area_m2: f64,
    /// m
    pub span_m: f64,
    /// b^2/S
    pub aspect_ratio: f64,
    /// tip/root chord
    pub taper: f64,
    /// m
    pub root_chord_m: f64,
    /// m
    pub mac_m: f64,
    /// m
    pub mac_le_x_m: f64,
    /// m
    pub mac_y_m: f64,
    /// deg, root chord to the fuselage datum
    pub incidence_deg: f64,
    /// per rad
    pub cl_alpha_per_rad: f64,
    /// deg, relative to the root chord
    pub alpha_zero_lift_deg: f64,
    /// about the aerodynamic centre
    pub cm_ac: f64,
}

/// `/stabiliser`
#[derive(Debug, Serialize)]
pub struct StabiliserJson {
    /// `tail` or `canard`
    pub role: &'static str,
    /// Geometry and aerodynamics.
    #[serde(flatten)]
    pub surface: SurfaceJson,
    /// m, wing MAC quarter chord to stabiliser MAC quarter chord
    pub arm_m: f64,
    /// S_h l_h / (S c)
    pub volume_coefficient: f64,
    /// deg, front surface incidence minus rear (wing minus tail, or canard minus wing)
    pub decalage_deg: f64,
}

/// `/sections/N`
#[derive(Debug, Serialize)]
pub struct SectionJson {
    /// Airfoil name in the file.
    pub name: String,
    /// `exact`, `thin`, `panel`.
    pub method: &'static str,
    /// deg
    pub alpha_zero_lift_deg: f64,
    /// per rad
    pub cl_alpha_per_rad: f64,
    /// about the aerodynamic centre
    pub cm_ac: f64,
    /// fraction of chord
    pub aerodynamic_center_x_c: f64,
    /// section cl_max
    pub cl_max: f64,
    /// `given` or `default`
    pub cl_max_source: &'static str,
}

/// `/stability`
#[derive(Debug, Serialize)]
pub struct StabilityJson {
    /// Method of the figures below: `vortex-lattice`, `lifting-line` or `classical`.
    pub method: &'static str,
    /// Strips per half-span of the wing in the numerical model.
    pub spanwise_strips: usize,
    /// Chordwise lattice panels per strip (1 for the lifting line).
    pub chordwise_panels: usize,
    /// Closed-form neutral point (cross-check), m.
    pub classical_neutral_point_x_m: f64,
    /// Numerical-model minus closed-form neutral point, percent MAC (0 when only the closed form ran).
    pub neutral_point_difference_percent_mac: f64,
    /// m
    pub neutral_point_x_m: f64,
    /// percent MAC
    pub neutral_point_percent_mac: f64,
    /// percent MAC
    pub static_margin_percent: f64,
    /// Forward end of the neutral point's uncertainty range (two standard deviations of the
    /// common-practice input spreads), m; equal to the neutral point when the spreads vanish.
    pub neutral_point_forward_end_x_m: f64,
    /// The aft CG limit measured from that forward end (the smallest static margin), m.
    pub aft_limit_from_range_x_m: f64,
    /// d eps / d alpha at the tail
    pub downwash_gradient: f64,
    /// per rad, aircraft lift slope on the wing area
    pub aircraft_cl_alpha_per_rad: f64,
    /// per rad, about the CG
    pub cm_alpha_per_rad: f64,
}

/// `/trim`
#[derive(Debug, Serialize)]
pub struct TrimJson {
    /// True when a trimmed state at positive lift exists.
    pub found: bool,
    /// Total CL, or null.
    pub cl: Option<f64>,
    /// Fuselage-datum angle of attack, deg, or null.
    pub alpha_deg: Option<f64>,
    /// m/s, or null.
    pub speed_m_s: Option<f64>,
    /// Stabiliser CL on its own area, or null.
    pub stabiliser_cl: Option<f64>,
    /// On the wing MAC at the trim (or stall) speed.
    pub reynolds_mac: f64,
    /// Elevator at trim, deg (trailing edge down positive; the trim is computed with it neutral).
    pub elevator_deg: Option<f64>,
    /// Stabiliser lift at trim, N (negative is a download), or null.
    pub stabiliser_load_n: Option<f64>,
    /// Downwash at the stabiliser at trim, deg, or null.
    pub downwash_deg: Option<f64>,
    /// Span efficiency of the whole aircraft at trim, or null.
    pub span_efficiency: Option<f64>,
}

/// `/stall`
#[derive(Debug, Serialize)]
pub struct StallJson {
    /// Aircraft CL_max.
    pub cl_max: f64,
    /// m/s
    pub speed_m_s: f64,
    /// `critical-section` (lifting line) or `classical` (0.9 x section cl_max).
    pub method: &'static str,
    /// Surface where stall begins (`wing`, `tail`, `canard`), or null.
    pub surface: Option<&'static str>,
    /// Where on that surface, percent of its semispan, or null.
    pub percent_semispan: Option<f64>,
    /// Elevator holding the stall, deg, or null.
    pub elevator_deg: Option<f64>,
}

/// `/solves`
#[derive(Debug, Serialize)]
pub struct SolvesJson {
    /// Stabiliser incidence for the target trim speed with neutral elevator, or null.
    pub decalage_for_target: Option<DecalageJson>,
    /// CG that trims at the target speed with the present incidences, m, or null.
    pub cg_for_target_speed_x_m: Option<f64>,
    /// What does the pitching: `elevator`, `elevons` (tailless wing), or null when neither.
    pub pitch_control: Option<&'static str>,
    /// Top speed of the elevator schedule, m/s.
    pub top_speed_m_s: f64,
    /// Elevator (or elevons) to trim over the speed range.
    pub elevator_schedule: Vec<ElevatorPointJson>,
    /// Tailless check, or null.
    pub tailless: Option<TaillessJson>,
}

/// `/solves/decalage_for_target`
#[derive(Debug, Serialize)]
pub struct DecalageJson {
    /// m/s
    pub speed_m_s: f64,
    /// CL at that speed.
    pub cl: f64,
    /// deg
    pub stabiliser_incidence_deg: f64,
    /// deg, wing incidence minus stabiliser incidence
    pub decalage_deg: f64,
}

/// `/solves/elevator_schedule/N`
#[derive(Debug, Serialize)]
pub struct ElevatorPointJson {
    /// m/s
    pub speed_m_s: f64,
    /// CL
    pub cl: f64,
    /// deg, trailing edge down positive
    pub elevator_deg: f64,
    /// Within the elevator's throws.
    pub within_limits: bool,
}

/// `/solves/tailless`
#[derive(Debug, Serialize)]
pub struct TaillessJson {
    /// CL at which trim is judged.
    pub design_cl: f64,
    /// Cm about the CG at zero lift.
    pub cm_zero_lift: f64,
    /// Cm about the CG at the design CL.
    pub cm_at_design: f64,
    /// Change of tip twist that trims at the design CL, deg (negative: more washout), or null.
    pub washout_change_deg: Option<f64>,
    /// Rise of the sections' cm_ac that trims at the design CL.
    pub reflex_cm_change: f64,
    /// Elevon deflection that trims at the design CL, deg (trailing edge down positive), or
    /// null without elevons or when none trims there.
    pub elevon_to_trim_deg: Option<f64>,
    /// True when that deflection is within the elevons' throws.
    pub elevon_within_throws: bool,
}

/// `/spanwise/N`: one wing station, starboard half.
#[derive(Debug, Serialize)]
pub struct SpanwiseJson {
    /// m
    pub y_m: f64,
    /// percent of the semispan
    pub percent_semispan: f64,
    /// m
    pub chord_m: f64,
    /// Section cl at trim, or null.
    pub cl_trim: Option<f64>,
    /// cl / cl_max at trim, or null.
    pub cl_ratio_trim: Option<f64>,
    /// cl / cl_max at the stall.
    pub cl_ratio_stall: f64,
}

pub(super) fn surface_json(s: &crate::stability::classical::EquivalentSurface) -> SurfaceJson {
    let g = &s.geometry;
    SurfaceJson {
        area_m2: r(g.area_m2, 6),
        span_m: r(g.span_m, 5),
        aspect_ratio: r(g.aspect_ratio, 4),
        taper: r(g.taper, 4),
        root_chord_m: r(g.root_chord_m, 5),
        mac_m: r(g.mac_m, 5),
        mac_le_x_m: r(g.mac_le_x_m, 5),
        mac_y_m: r(g.mac_y_m, 5),
        incidence_deg: r(s.incidence_rad.to_degrees(), 3),
        cl_alpha_per_rad: r(s.lift_slope_per_rad, 4),
        alpha_zero_lift_deg: r(s.alpha_zero_lift_rad.to_degrees(), 3),
        cm_ac: r(s.cm_ac, 4),
    }
}

/// `/stabiliser`
pub(super) fn stabiliser_json(aircraft: &Aircraft, a: &Analysis) -> Option<StabiliserJson> {
    aircraft
        .stabiliser
        .as_ref()
        .zip(a.stabiliser.as_ref())
        .map(|(s, eq)| {
            let tv = a.tail_volume;
            StabiliserJson {
                role: match s.role {
                    StabiliserRole::Tail => "tail",
                    StabiliserRole::Canard => "canard",
                },
                surface: surface_json(eq),
                arm_m: r(tv.map(|t| t.arm_m).unwrap_or(0.0), 5),
                volume_coefficient: r(tv.map(|t| t.coefficient).unwrap_or(0.0), 4),
                decalage_deg: r(aircraft.decalage_rad().unwrap_or(0.0).to_degrees(), 3),
            }
        })
}

/// `/sections`
pub(super) fn sections_json(aircraft: &Aircraft, a: &Analysis) -> Vec<SectionJson> {
    aircraft
        .airfoils
        .iter()
        .zip(&a.sections)
        .map(|(af, s)| SectionJson {
            name: af.name.clone(),
            method: s.method.as_str(),
            alpha_zero_lift_deg: r(s.alpha_zero_lift_rad.to_degrees(), 4),
            cl_alpha_per_rad: r(s.cl_alpha_per_rad, 4),
            cm_ac: r(s.cm_ac, 5),
            aerodynamic_center_x_c: r(s.x_ac_c, 4),
            cl_max: r(s.cl_max, 3),
            cl_max_source: match s.cl_max_source {
                ClMaxSource::Given => "given",
                ClMaxSource::Default => "default",
            },
        })
        .collect()
}

/// `/stability`
pub(super) fn stability_json(aircraft: &Aircraft, a: &Analysis) -> StabilityJson {
    let g = &a.wing_geometry;
    let est = &a.classical;
    let h = &a.headline;
    let full_trim = a.full.as_ref().and_then(|f| f.trim.as_ref());
    StabilityJson {
        method: h.method.as_str(),
        spanwise_strips: a.numerics.strips_per_half_span,
        chordwise_panels: match a.numerics.wing_model {
            crate::model::WingModel::VortexLattice => a.numerics.chordwise_panels,
            crate::model::WingModel::LiftingLine => 1,
        },
        classical_neutral_point_x_m: r(est.neutral_point_x_m, 5),
        neutral_point_difference_percent_mac: r(
            100.0 * (h.neutral_point_x_m - est.neutral_point_x_m) / g.mac_m,
            2,
        ),
        neutral_point_x_m: r(h.neutral_point_x_m, 5),
        neutral_point_percent_mac: r(g.percent_mac(h.neutral_point_x_m), 2),
        static_margin_percent: r(100.0 * h.static_margin, 2),
        neutral_point_forward_end_x_m: r(
            h.neutral_point_x_m - 2.0 * finite_or_zero(a.neutral_point_spread.sigma_m),
            5,
        ),
        aft_limit_from_range_x_m: r(
            h.neutral_point_x_m
                - 2.0 * finite_or_zero(a.neutral_point_spread.sigma_m)
                - aircraft.margin_limits.min_static_margin * g.mac_m,
            5,
        ),
        downwash_gradient: r(
            full_trim.map_or(est.downwash_gradient, |t| t.downwash_gradient),
            4,
        ),
        aircraft_cl_alpha_per_rad: r(
            a.full
                .as_ref()
                .map_or(est.aircraft_lift_slope_per_rad, |f| f.cl_alpha_per_rad),
            4,
        ),
        cm_alpha_per_rad: r(
            -h.static_margin
                * a.full
                    .as_ref()
                    .map_or(est.aircraft_lift_slope_per_rad, |f| f.cl_alpha_per_rad),
            4,
        ),
    }
}

/// `/trim`
pub(super) fn trim_json(aircraft: &Aircraft, a: &Analysis) -> TrimJson {
    let h = &a.headline;
    let full_trim = a.full.as_ref().and_then(|f| f.trim.as_ref());
    TrimJson {
        found: h.trim.is_some(),
        cl: h.trim.map(|t| r(t.cl, 4)),
        alpha_deg: h.trim.map(|t| r(t.alpha_rad.to_degrees(), 3)),
        speed_m_s: h.trim.map(|t| r(t.speed_m_s, 3)),
        stabiliser_cl: h.trim.map(|t| r(t.stabiliser_cl, 4)),
        reynolds_mac: r(a.reynolds_mac, 0),
        elevator_deg: h.trim.map(|t| r(t.elevator_rad.to_degrees(), 3)),
        stabiliser_load_n: full_trim
            .filter(|_| aircraft.stabiliser.is_some())
            .map(|t| r(t.stabiliser_load_n, 4)),
        downwash_deg: full_trim
            .filter(|_| aircraft.stabiliser.is_some())
            .map(|t| r(t.downwash_rad.to_degrees(), 3)),
        span_efficiency: full_trim.and_then(|t| t.span_efficiency).map(|e| r(e, 4)),
    }
}

/// `/stall`
pub(super) fn stall_json(a: &Analysis) -> StallJson {
    let h = &a.headline;
    StallJson {
        cl_max: r(h.cl_max, 4),
        speed_m_s: r(h.stall_speed_m_s, 3),
        method: match h.method {
            Method::Numerical(_) => "critical-section",
            Method::Classical => "classical",
        },
        surface: h.stall_location.as_ref().map(|l| l.surface_name),
        percent_semispan: h.stall_location.as_ref().map(|l| r(l.percent_semispan, 1)),
        elevator_deg: a
            .full
            .as_ref()
            .and_then(|f| f.stall.as_ref())
            .filter(|s| s.trimmed)
            .map(|s| r(s.elevator_rad.to_degrees(), 2)),
    }
}

/// `/solves`
pub(super) fn solves_json(aircraft: &Aircraft, a: &Analysis) -> Option<SolvesJson> {
    a.full.as_ref().map(|f| SolvesJson {
        decalage_for_target: f.decalage_for_target.map(|d| DecalageJson {
            speed_m_s: r(d.speed_m_s, 3),
            cl: r(d.cl, 4),
            stabiliser_incidence_deg: r(d.stabiliser_incidence_rad.to_degrees(), 3),
            decalage_deg: r(d.decalage_rad.to_degrees(), 3),
        }),
        cg_for_target_speed_x_m: f.cg_for_target_x_m.map(|x| r(x, 5)),
        pitch_control: aircraft
            .pitch_control()
            .map(|_| aircraft.pitch_control_name()),
        top_speed_m_s: r(f.top_speed_m_s, 3),
        elevator_schedule: f
            .elevator_schedule
            .iter()
            .map(|p| ElevatorPointJson {
                speed_m_s: r(p.speed_m_s, 3),
                cl: r(p.cl, 4),
                elevator_deg: r(p.elevator_rad.to_degrees(), 3),
                within_limits: p.within_limits,
            })
            .collect(),
        tailless: f.tailless.map(|t| TaillessJson {
            design_cl: r(t.design_cl, 4),
            cm_zero_lift: r(t.cm_zero_lift, 5),
            cm_at_design: r(t.cm_at_design, 5),
            washout_change_deg: t.washout_change_rad.map(|w| r(w.to_degrees(), 3)),
            reflex_cm_change: r(t.reflex_cm_change, 5),
            elevon_to_trim_deg: t.elevon_to_trim_rad.map(|d| r(d.to_degrees(), 3)),
            elevon_within_throws: t.elevon_within_throws,
        }),
    })
}

pub(super) fn spanwise_json(a: &Analysis) -> Vec<SpanwiseJson> {
    let Some(f) = a.full.as_ref() else {
        return Vec::new();
    };
    let Some(stall) = f.stall.as_ref() else {
        return Vec::new();
    };
    let trim_rows = f
        .trim
        .as_ref()
        .map(|t| crate::stability::trim::wing_starboard(&t.result));
    crate::stability::trim::wing_starboard(&stall.result)
        .into_iter()
        .map(|st| {
            let at_trim = trim_rows
                .as_ref()
                .and_then(|rows| rows.iter().find(|t| (t.y_m - st.y_m).abs() < 1e-9));
            SpanwiseJson {
                y_m: r(st.y_m, 5),
                percent_semispan: r(st.percent_semispan, 2),
                chord_m: r(st.chord_m, 5),
                cl_trim: at_trim.map(|t| r(t.cl, 4)),
                cl_ratio_trim: at_trim.map(|t| r(t.cl_ratio, 4)),
                cl_ratio_stall: r(st.cl_ratio, 4),
            }
        })
        .collect()
}
