//! JSON output of `check`: one object, SI units, x aft of the file's datum, percent of MAC
//! aft of the MAC leading edge. Every field is documented in `docs/json.md`.

use crate::analysis::glide::GlidePolar;
use crate::analysis::{AftLimit, Analysis, ForwardLimit, Method};
use crate::balance::BallastOutcome;
use crate::caution::Caution;
use crate::lifting_line::TrimControl;
use crate::model::{Aircraft, StabiliserRole};
use crate::performance::aircraft_drag::AircraftTrim;
use crate::performance::flight_polar::{GlidePoint, Optimum};
use crate::section::ClMaxSource;
use serde::Serialize;

/// The unit convention of every JSON document the tool writes (`check`, `compare`, `sweep`),
/// stated in each document's `units`.
pub const JSON_UNITS: &str = "SI (lengths m, masses kg, speeds m/s, density kg/m^3) except \
     angles in degrees and static margins and positions in percent of the MAC where the name \
     says so; each name ends in its unit; the same in check, compare and sweep";

/// The whole `check --json` document.
#[derive(Debug, Serialize)]
pub struct CheckDocument {
    /// Tool and format version.
    pub trimline_version: &'static str,
    /// The unit convention ([`JSON_UNITS`]).
    pub units: &'static str,
    /// Aircraft identity.
    pub aircraft: AircraftJson,
    /// The air.
    pub air: AirJson,
    /// Masses.
    pub mass: MassJson,
    /// Balance.
    pub balance: BalanceJson,
    /// Wing.
    pub wing: SurfaceJson,
    /// Stabiliser, or null.
    pub stabiliser: Option<StabiliserJson>,
    /// The lateral note of a fin and of a V-tail, or null (neither).
    pub fin: Option<FinNoteJson>,
    /// Airfoil sections.
    pub sections: Vec<SectionJson>,
    /// Stability.
    pub stability: StabilityJson,
    /// Trim.
    pub trim: TrimJson,
    /// Stall.
    pub stall: StallJson,
    /// Glide performance (headline figures).
    pub glide: GlideJson,
    /// The flight polar over the speed range, or null when it was not computed.
    pub flight_polar: Option<FlightPolarJson>,
    /// The flight polar of each named flap setting.
    pub flap_settings: Vec<FlapSettingJson>,
    /// Solves from the lifting-line model (decalage, CG, elevator schedule).
    pub solves: Option<SolvesJson>,
    /// Wing spanwise loading (lifting line), starboard half, root to tip.
    pub spanwise: Vec<SpanwiseJson>,
    /// Cautions.
    pub cautions: Vec<CautionJson>,
}

/// `/fin`: a lateral note only; nothing here enters a pitch figure.
#[derive(Debug, Serialize)]
pub struct FinNoteJson {
    /// The file's `[fin]`, or null.
    pub fin: Option<FinFiguresJson>,
    /// The V-tail's side projection, or null (no V-tail).
    pub vee_tail: Option<FinFiguresJson>,
}

/// `/fin/fin`, `/fin/vee_tail`
#[derive(Debug, Serialize)]
pub struct FinFiguresJson {
    /// m^2
    pub side_area_m2: f64,
    /// m, wing MAC quarter chord to the fin's
    pub arm_m: f64,
    /// S_v l_v / (S b)
    pub volume_coefficient: f64,
}

fn fin_figures_json(f: &crate::analysis::FinFigures) -> FinFiguresJson {
    FinFiguresJson {
        side_area_m2: r(f.side_area_m2, 6),
        arm_m: r(f.arm_m, 5),
        volume_coefficient: r(f.volume_coefficient, 4),
    }
}

/// `/aircraft`
#[derive(Debug, Serialize)]
pub struct AircraftJson {
    /// Name.
    pub name: String,
    /// Notes.
    pub notes: String,
    /// What x = 0 is.
    pub datum: String,
    /// Input file, or `<built-in demo>`.
    pub source: String,
}

/// `/air`
#[derive(Debug, Serialize)]
pub struct AirJson {
    /// kg/m^3
    pub density_kg_m3: f64,
    /// K
    pub temperature_k: f64,
    /// Pa
    pub pressure_pa: f64,
    /// Pa s
    pub viscosity_pa_s: f64,
}

/// `/mass`
#[derive(Debug, Serialize)]
pub struct MassJson {
    /// kg
    pub total_kg: f64,
    /// kg/m^2
    pub wing_loading_kg_m2: f64,
    /// Items.
    pub items: Vec<MassItemJson>,
}

/// `/mass/items/N`
#[derive(Debug, Serialize)]
pub struct MassItemJson {
    /// Name.
    pub name: String,
    /// kg
    pub mass_kg: f64,
    /// m
    pub x_m: f64,
    /// m or null
    pub z_m: Option<f64>,
}

/// `/balance`
#[derive(Debug, Serialize)]
pub struct BalanceJson {
    /// m
    pub cg_x_m: f64,
    /// m or null
    pub cg_z_m: Option<f64>,
    /// Percent of MAC aft of the MAC leading edge.
    pub cg_percent_mac: f64,
    /// One standard deviation of the CG from the builder's tolerances, m (0 without them).
    pub cg_sigma_m: f64,
    /// Aft end of the CG's range (two standard deviations aft), m.
    pub cg_aft_end_x_m: f64,
    /// Recommended band.
    pub band: BandJson,
    /// Ballast advice.
    pub ballast: Vec<BallastJson>,
    /// The weighing, or null.
    pub weighed: Option<WeighedJson>,
}

/// `/balance/weighed`
#[derive(Debug, Serialize)]
pub struct WeighedJson {
    /// kg on the scales
    pub total_kg: f64,
    /// m
    pub cg_x_m: f64,
    /// percent MAC
    pub cg_percent_mac: f64,
    /// m, weighed minus listed
    pub cg_difference_m: f64,
    /// kg, weighed minus listed
    pub mass_difference_kg: f64,
}

/// `/balance/band`
#[derive(Debug, Serialize)]
pub struct BandJson {
    /// m
    pub forward_x_m: f64,
    /// m
    pub aft_x_m: f64,
    /// percent MAC
    pub forward_percent_mac: f64,
    /// percent MAC
    pub aft_percent_mac: f64,
    /// percent
    pub min_static_margin_percent: f64,
    /// percent
    pub max_static_margin_percent: f64,
    /// True when common-practice defaults were used.
    pub from_defaults: bool,
    /// What sets the forward limit: `static-margin` or `elevator-authority`.
    pub forward_limit: &'static str,
    /// What sets the aft end: `static-margin` (the smallest margin on the computed
    /// neutral point) or `neutral-point-range` (that margin from the forward end of the
    /// neutral point's uncertainty range).
    pub aft_limit: &'static str,
    /// Where the CG sits: `forward`, `inside`, `aft`.
    pub cg_position: &'static str,
}

/// `/balance/ballast/N`
#[derive(Debug, Serialize)]
pub struct BallastJson {
    /// Bay name.
    pub bay: String,
    /// m
    pub target_cg_x_m: f64,
    /// `not-needed`, `reachable`, `exceeds-bay`, `wrong-side`.
    pub status: &'static str,
    /// kg to add, or null.
    pub mass_kg: Option<f64>,
    /// kg the target would need when it exceeds the bay, or null.
    pub needed_kg: Option<f64>,
    /// kg the bay holds.
    pub max_kg: f64,
}

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

fn flight_polar_json(aircraft: &Aircraft, p: &GlidePolar) -> FlightPolarJson {
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

fn glide_json(a: &Analysis) -> GlideJson {
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

/// `/cautions/N`
#[derive(Debug, Serialize)]
pub struct CautionJson {
    /// `note`, `warning`, `danger`.
    pub level: &'static str,
    /// Stable code.
    pub code: &'static str,
    /// Text.
    pub message: String,
}

impl From<&Caution> for CautionJson {
    fn from(c: &Caution) -> Self {
        CautionJson {
            level: c.level.as_str(),
            code: c.code,
            message: c.message.clone(),
        }
    }
}

/// Round to `digits` significant decimals for stable, readable output.
fn r(v: f64, decimals: i32) -> f64 {
    let f = 10f64.powi(decimals);
    let out = (v * f).round() / f;
    if out == 0.0 {
        0.0
    } else {
        out
    }
}

fn surface_json(s: &crate::stability::classical::EquivalentSurface) -> SurfaceJson {
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

/// Build the JSON document for an analysed aircraft.
pub fn check_document(aircraft: &Aircraft, a: &Analysis, source: &str) -> CheckDocument {
    CheckDocument {
        trimline_version: env!("CARGO_PKG_VERSION"),
        units: JSON_UNITS,
        aircraft: AircraftJson {
            name: aircraft.name.clone(),
            notes: aircraft.notes.clone(),
            datum: aircraft.datum.clone(),
            source: source.to_string(),
        },
        air: AirJson {
            density_kg_m3: r(a.air.density_kg_m3, 5),
            temperature_k: r(a.air.temperature_k, 2),
            pressure_pa: r(a.air.pressure_pa, 1),
            viscosity_pa_s: a.air.viscosity_pa_s,
        },
        mass: mass_json(aircraft, a),
        balance: balance_json(aircraft, a),
        wing: surface_json(&a.wing),
        stabiliser: stabiliser_json(aircraft, a),
        fin: a.fin.as_ref().map(|n| FinNoteJson {
            fin: n.fin.as_ref().map(fin_figures_json),
            vee_tail: n.vee_tail.as_ref().map(fin_figures_json),
        }),
        sections: sections_json(aircraft, a),
        stability: stability_json(aircraft, a),
        trim: trim_json(aircraft, a),
        stall: stall_json(a),
        solves: solves_json(aircraft, a),
        spanwise: spanwise_json(a),
        glide: glide_json(a),
        flight_polar: a
            .glide_polar
            .as_ref()
            .map(|p| flight_polar_json(aircraft, p)),
        flap_settings: flap_settings_json(aircraft, a),
        cautions: a.cautions.iter().map(CautionJson::from).collect(),
    }
}

/// `/mass`
fn mass_json(aircraft: &Aircraft, a: &Analysis) -> MassJson {
    MassJson {
        total_kg: r(a.mass.total_kg, 5),
        wing_loading_kg_m2: r(a.wing_loading_kg_m2, 4),
        items: aircraft
            .masses
            .iter()
            .map(|m| MassItemJson {
                name: m.name.clone(),
                mass_kg: r(m.mass_kg, 5),
                x_m: r(m.x_m, 5),
                z_m: m.z_m.map(|z| r(z, 5)),
            })
            .collect(),
    }
}

/// `/balance`
fn balance_json(aircraft: &Aircraft, a: &Analysis) -> BalanceJson {
    let g = &a.wing_geometry;
    let band_pos = if a.mass.cg_x_m < a.band.forward_x_m - 5e-4 {
        "forward"
    } else if a.mass.cg_x_m > a.band.aft_x_m + 5e-4 {
        "aft"
    } else {
        "inside"
    };
    BalanceJson {
        cg_x_m: r(a.mass.cg_x_m, 5),
        cg_z_m: a.mass.cg_z_m.map(|z| r(z, 5)),
        cg_percent_mac: r(g.percent_mac(a.mass.cg_x_m), 2),
        cg_sigma_m: r(finite_or_zero(a.cg_spread.sigma_m), 5),
        cg_aft_end_x_m: r(a.mass.cg_x_m + 2.0 * finite_or_zero(a.cg_spread.sigma_m), 5),
        band: BandJson {
            forward_x_m: r(a.band.forward_x_m, 5),
            aft_x_m: r(a.band.aft_x_m, 5),
            forward_percent_mac: r(g.percent_mac(a.band.forward_x_m), 2),
            aft_percent_mac: r(g.percent_mac(a.band.aft_x_m), 2),
            min_static_margin_percent: r(100.0 * aircraft.margin_limits.min_static_margin, 2),
            max_static_margin_percent: r(100.0 * aircraft.margin_limits.max_static_margin, 2),
            from_defaults: aircraft.margin_limits.from_defaults,
            aft_limit: match a.band.aft_limit {
                AftLimit::StaticMargin => "static-margin",
                AftLimit::NeutralPointRange => "neutral-point-range",
            },
            forward_limit: match a.band.forward_limit {
                ForwardLimit::StaticMargin => "static-margin",
                ForwardLimit::ElevatorAuthority => "elevator-authority",
                ForwardLimit::TailStall => "tail-stall",
            },
            cg_position: band_pos,
        },
        ballast: a
            .ballast
            .iter()
            .map(|b| {
                let max_kg = aircraft
                    .ballast_bays
                    .iter()
                    .find(|bay| bay.name == b.bay)
                    .map(|bay| bay.max_mass_kg)
                    .unwrap_or(0.0);
                let (status, mass_kg, needed_kg) = match b.outcome {
                    BallastOutcome::NotNeeded => ("not-needed", Some(0.0), None),
                    BallastOutcome::Reachable { mass_kg } => {
                        ("reachable", Some(r(mass_kg, 5)), None)
                    }
                    BallastOutcome::ExceedsBay { needed_kg, .. } => {
                        ("exceeds-bay", None, Some(r(needed_kg, 5)))
                    }
                    BallastOutcome::WrongSide => ("wrong-side", None, None),
                };
                BallastJson {
                    bay: b.bay.clone(),
                    target_cg_x_m: r(b.target_x_m, 5),
                    status,
                    mass_kg,
                    needed_kg,
                    max_kg: r(max_kg, 5),
                }
            })
            .collect(),
        weighed: a.weighed.map(|w| WeighedJson {
            total_kg: r(w.total_kg, 5),
            cg_x_m: r(w.cg_x_m, 5),
            cg_percent_mac: r(g.percent_mac(w.cg_x_m), 2),
            cg_difference_m: r(w.cg_x_m - a.mass.cg_x_m, 5),
            mass_difference_kg: r(w.total_kg - a.mass.total_kg, 5),
        }),
    }
}

/// `/stabiliser`
fn stabiliser_json(aircraft: &Aircraft, a: &Analysis) -> Option<StabiliserJson> {
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
fn sections_json(aircraft: &Aircraft, a: &Analysis) -> Vec<SectionJson> {
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
fn stability_json(aircraft: &Aircraft, a: &Analysis) -> StabilityJson {
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
fn trim_json(aircraft: &Aircraft, a: &Analysis) -> TrimJson {
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
fn stall_json(a: &Analysis) -> StallJson {
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
fn solves_json(aircraft: &Aircraft, a: &Analysis) -> Option<SolvesJson> {
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

/// `/flap_settings`
fn flap_settings_json(aircraft: &Aircraft, a: &Analysis) -> Vec<FlapSettingJson> {
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

fn spanwise_json(a: &Analysis) -> Vec<SpanwiseJson> {
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

/// `v`, or 0 where it is not finite (no spread is claimed then).
fn finite_or_zero(v: f64) -> f64 {
    if v.is_finite() {
        v
    } else {
        0.0
    }
}
