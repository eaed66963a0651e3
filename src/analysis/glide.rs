//! The glide step of the chain: the flight polar of the analysed configuration from its
//! factored wing system, its trimmed stall and its masses, with section drag from viscous
//! polars ([`crate::performance::profile_drag`]), and the cautions it raises.

use crate::atmosphere::AirState;
use crate::caution::Caution;
use crate::finding::{Control, GlideFinding, PolarMissing};
use crate::lifting_line::{MultiSurfaceSystem, TrimControl};
use crate::model::Aircraft;
use crate::performance::aircraft_drag::{AircraftDrag, AircraftTrim};
use crate::performance::flight_polar::{
    flight_polar, FlightPolarError, GlidePoint, Optimum, PolarConditions, SpeedToFly,
};
use crate::performance::profile_drag::{section_drag, DragRequest, SectionDrag};
use crate::section::cache::PolarCache;
use crate::section::SectionModel;
use crate::stability::trim::FullStability;

/// Speeds on the polar's grid (stall to top speed).
pub const POLAR_POINTS: usize = 40;

/// Sink rates of the air for which the speed to fly is given, m/s (common practice: model
/// and full-size gliders meet 0.5 to 2 m/s of sinking air between thermals).
pub const AIR_SINK_RATES_M_S: [f64; 4] = [0.0, 0.5, 1.0, 2.0];

/// Expected climb rates in the next thermal for the MacCready speed to fly, m/s (common
/// practice: weak to good thermals for models and sailplanes).
pub const CLIMB_RATES_M_S: [f64; 3] = [0.5, 1.0, 2.0];

/// Padding of the lift range a section's drag polar covers beyond what the range asks for.
const CL_PADDING: f64 = 0.15;

/// Minimum sink closer to the stall than this factor on the stall speed is flagged (common
/// practice: 1.2 times the stall speed is the usual margin for slow flight).
pub const MIN_SINK_STALL_MARGIN: f64 = 1.2;

/// Where one airfoil's profile drag came from.
#[derive(Debug, Clone, PartialEq)]
pub struct ProfileSource {
    /// Airfoil name.
    pub airfoil: String,
    /// Reynolds numbers of its viscous polars (empty for the flat-plate estimate).
    pub reynolds: Vec<f64>,
    /// Why the flat-plate estimate was used, when it was.
    pub flat_plate_reason: Option<String>,
}

/// The flight polar of one configuration.
#[derive(Debug, Clone, PartialEq)]
pub struct GlidePolar {
    /// Grid points in rising speed.
    pub points: Vec<GlidePoint<AircraftTrim>>,
    /// Minimum sink.
    pub min_sink: Optimum<AircraftTrim>,
    /// Best glide.
    pub best_glide: Optimum<AircraftTrim>,
    /// Speed to fly through sinking air ([`AIR_SINK_RATES_M_S`], no climb expected).
    pub speed_to_fly: Vec<SpeedToFly>,
    /// Speed to fly between thermals in still air for each expected climb
    /// ([`CLIMB_RATES_M_S`], MacCready), with the mean cross-country speed.
    pub speed_to_fly_between_thermals: Vec<SpeedToFly>,
    /// Which control trims the polar.
    pub control: TrimControl,
    /// Stall speed at the polar's mass, m/s (level-flight definition).
    pub stall_speed_m_s: f64,
    /// Top speed of the range, m/s.
    pub top_speed_m_s: f64,
    /// Profile-drag source of every airfoil used.
    pub profile_sources: Vec<ProfileSource>,
    /// The strip whose cl at the stall most exceeds the cl at which its viscous polar
    /// separates at its Reynolds number, if any does.
    pub early_separation: Option<EarlySeparation>,
}

/// A strip that, at the stall, flies beyond the lift at which the viscous method finds its
/// section separating.
#[derive(Debug, Clone, PartialEq)]
pub struct EarlySeparation {
    /// Airfoil name (the strip's inboard airfoil).
    pub airfoil: String,
    /// Surface index (0 wing).
    pub surface: usize,
    /// Chord Reynolds number there at the stall speed.
    pub reynolds: f64,
    /// cl at which the viscous polar separates there.
    pub separation_cl: f64,
    /// The strip's cl at the stall (the section cl_max used, or near it).
    pub cl_at_stall: f64,
}

fn early_separation(
    aircraft: &Aircraft,
    source: &AircraftDrag<'_>,
    drags: &[SectionDrag],
    stall_point: &GlidePoint<AircraftTrim>,
    nu: f64,
) -> Option<EarlySeparation> {
    let mut worst: Option<(f64, EarlySeparation)> = None;
    for (k, (strip, cl)) in source
        .strips()
        .iter()
        .zip(&stall_point.trim.strip_cl)
        .enumerate()
    {
        let eta = strip.eta.max(1e-6);
        let re = stall_point.speed_m_s * eta.sqrt() * strip.chord_m / nu;
        let cl_own = source.lookup_cl(k, *cl);
        let id = if strip.airfoils.2 > 0.5 {
            strip.airfoils.1
        } else {
            strip.airfoils.0
        };
        let Some(sep) = drags.get(id).and_then(|d| d.separation_cl(re)) else {
            continue;
        };
        let excess = cl_own - sep;
        if excess > 0.02 && worst.as_ref().is_none_or(|w| excess > w.0) {
            worst = Some((
                excess,
                EarlySeparation {
                    airfoil: aircraft.airfoils[id].name.clone(),
                    surface: strip.surface,
                    reynolds: re,
                    separation_cl: sep,
                    cl_at_stall: cl_own,
                },
            ));
        }
    }
    worst.map(|w| w.1)
}

/// Inputs of the glide step.
#[derive(Debug, Clone, Copy)]
pub struct GlideInput<'a> {
    /// The aircraft.
    pub aircraft: &'a Aircraft,
    /// Its factored system.
    pub system: &'a MultiSurfaceSystem,
    /// Its section models (lift), parallel to the airfoils.
    pub sections: &'a [SectionModel],
    /// The full-model results (stall, neutral points, top speed).
    pub full: &'a FullStability,
    /// Mass, kg.
    pub mass_kg: f64,
    /// CG x and the moment reference height, m.
    pub cg_m: (f64, f64),
    /// The air.
    pub air: &'a AirState,
    /// Panels of the viscous polars.
    pub panels: usize,
}

/// What the range asks of one airfoil: Reynolds number low and high, cl low and high.
type Need = (f64, f64, f64, f64);

/// The section drag of every airfoil over what the flight range asks of it.
fn section_drags(
    input: &GlideInput<'_>,
    probe: &AircraftDrag<'_>,
    stall_m_s: f64,
    top_m_s: f64,
    cl_stall: f64,
    cl_top: f64,
) -> Vec<SectionDrag> {
    let aircraft = input.aircraft;
    let nu = input.air.kinematic_viscosity_m2_s();
    let n = aircraft.airfoils.len();
    // Per airfoil: (Re low, Re high, cl low, cl high) over the strips that use it.
    let mut need: Vec<Option<Need>> = vec![None; n];
    let trims: Vec<AircraftTrim> = [cl_stall, 0.5 * (cl_stall + cl_top), cl_top]
        .iter()
        .filter_map(|cl| probe_trim(probe, *cl))
        .collect();
    for (k, strip) in probe.strips().iter().enumerate() {
        let sq = strip.eta.max(1e-6).sqrt();
        let re_lo = 0.95 * stall_m_s * sq * strip.chord_m / nu;
        let re_hi = 1.05 * top_m_s * sq * strip.chord_m / nu;
        let (i, o, w) = strip.airfoils;
        for t in &trims {
            let cl = probe.lookup_cl(k, t.strip_cl[k]);
            for (id, used) in [(i, true), (o, w > 0.0)] {
                if !used || id >= n {
                    continue;
                }
                let e = need[id].get_or_insert((re_lo, re_hi, cl, cl));
                e.0 = e.0.min(re_lo);
                e.1 = e.1.max(re_hi);
                e.2 = e.2.min(cl);
                e.3 = e.3.max(cl);
            }
        }
    }
    let cache = PolarCache::shared();
    let jobs: Vec<(usize, Option<Need>)> = need.into_iter().enumerate().collect();
    use rayon::prelude::*;
    jobs.par_iter()
        .map(|(id, need)| {
            let airfoil = &aircraft.airfoils[*id];
            let Some((re_lo, re_hi, cl_lo, cl_hi)) = *need else {
                // Not used by any strip: never looked up; the flat plate keeps the slot.
                return SectionDrag::FlatPlate {
                    thickness_ratio: crate::section::thickness_ratio(airfoil),
                    reason: "not used by any strip".into(),
                };
            };
            let s = &input.sections[*id];
            let slope = s.cl_alpha_per_rad.max(1.0);
            let alpha = |cl: f64| s.alpha_zero_lift_rad + cl / slope;
            section_drag(
                airfoil,
                DragRequest {
                    reynolds_range: (re_lo, re_hi),
                    alpha_range_rad: (alpha(cl_lo - CL_PADDING), alpha(cl_hi + CL_PADDING)),
                },
                input.panels,
                cache,
            )
        })
        .collect()
}

fn probe_trim(probe: &AircraftDrag<'_>, cl: f64) -> Option<AircraftTrim> {
    use crate::performance::flight_polar::DragSource;
    probe.trim(cl)
}

/// Why there is no flight polar.
#[derive(Debug, Clone, PartialEq)]
pub enum NoPolar {
    /// The aircraft has no pitch control and no stabiliser: one trimmed speed only.
    NoTrimControl,
    /// No stall was found (the trim or stall solve failed).
    NoStall,
    /// The polar itself failed.
    Failed(FlightPolarError),
}

/// The flight polar of the configuration.
pub fn glide_polar(input: &GlideInput<'_>) -> Result<GlidePolar, NoPolar> {
    let stall = input.full.stall.as_ref().ok_or(NoPolar::NoStall)?;
    polar_on(input, input.system, &[], stall.cl_max, stall.speed_m_s)
}

/// The flight polar on `system` (the configuration's, or one with flaps set), with the
/// strips' flap lift shifts `cl_shifts` (empty: none), from the trimmed stall at `cl_stall`
/// and `stall_speed_m_s`.
fn polar_on(
    input: &GlideInput<'_>,
    system: &MultiSurfaceSystem,
    cl_shifts: &[f64],
    cl_stall: f64,
    stall_speed_m_s: f64,
) -> Result<GlidePolar, NoPolar> {
    let shift = input.full.neutral_point_surfaces_x_m - input.full.neutral_point_x_m;
    let (x_ref, z_ref) = (input.cg_m.0 + shift, input.cg_m.1);
    let nu = input.air.kinematic_viscosity_m2_s();
    let density = input.air.density_kg_m3;
    let area = system.reference().area_m2;
    let top = input.full.top_speed_m_s;
    let cl_top = 2.0 * input.mass_kg * crate::atmosphere::G0 / (density * area * top * top);
    let probe = AircraftDrag::new(input.aircraft, system, &[], x_ref, z_ref, nu)
        .ok_or(NoPolar::NoTrimControl)?
        .with_cl_shifts(cl_shifts);
    let drags = section_drags(input, &probe, stall_speed_m_s, top, cl_stall, cl_top);
    let source = AircraftDrag::new(input.aircraft, system, &drags, x_ref, z_ref, nu)
        .ok_or(NoPolar::NoTrimControl)?
        .with_cl_shifts(cl_shifts);
    let cond = PolarConditions {
        mass_kg: input.mass_kg,
        density_kg_m3: density,
        area_m2: area,
        cl_stall,
        top_speed_m_s: top,
        points: POLAR_POINTS,
        // A control with no throw trims one speed only: put it on the grid.
        trim_cl: input.full.trim.as_ref().map(|t| t.cl).filter(|_| {
            input
                .aircraft
                .pitch_control()
                .is_some_and(|p| p.max_up_rad + p.max_down_rad <= 0.0)
        }),
    };
    let polar = flight_polar(&source, &cond).map_err(NoPolar::Failed)?;
    let speed_to_fly = AIR_SINK_RATES_M_S
        .iter()
        .filter_map(|s| polar.speed_to_fly(&source, *s, 0.0).ok())
        .collect();
    let speed_to_fly_between_thermals = CLIMB_RATES_M_S
        .iter()
        .filter_map(|m| polar.speed_to_fly(&source, 0.0, *m).ok())
        .collect();
    let profile_sources = profile_sources(input.aircraft, &drags);
    let early_separation = polar
        .points
        .first()
        .and_then(|p| early_separation(input.aircraft, &source, &drags, p, nu));
    Ok(GlidePolar {
        early_separation,
        points: polar.points,
        min_sink: polar.min_sink,
        best_glide: polar.best_glide,
        speed_to_fly,
        speed_to_fly_between_thermals,
        control: source.control(),
        stall_speed_m_s,
        top_speed_m_s: top,
        profile_sources,
    })
}

/// Where the profile drag of every airfoil used by a strip came from, with `drags` parallel
/// to the airfoils of `aircraft`.
fn profile_sources(aircraft: &Aircraft, drags: &[SectionDrag]) -> Vec<ProfileSource> {
    aircraft
        .airfoils
        .iter()
        .zip(drags)
        .filter(|(_, d)| {
            !matches!(d, SectionDrag::FlatPlate { reason, .. } if reason == "not used by any strip")
        })
        .map(|(a, d)| match d {
            SectionDrag::Viscous { polars, .. } => ProfileSource {
                airfoil: a.name.clone(),
                reynolds: polars.iter().map(|p| p.reynolds).collect(),
                flat_plate_reason: None,
            },
            SectionDrag::FlatPlate { reason, .. } => ProfileSource {
                airfoil: a.name.clone(),
                reynolds: Vec::new(),
                flat_plate_reason: Some(reason.clone()),
            },
        })
        .collect()
}

/// The cautions of a flight polar (or of its absence).
pub fn glide_cautions(
    aircraft: &Aircraft,
    polar: &Result<GlidePolar, NoPolar>,
    cautions: &mut Vec<Caution>,
) {
    let p = match polar {
        Ok(p) => p,
        Err(why) => {
            no_polar_caution(why, cautions);
            return;
        }
    };
    min_sink_near_stall_caution(p, cautions);
    early_separation_caution(p, cautions);
    profile_drag_estimated_cautions(p, cautions);
    polar_drag_extrapolated_note(p, cautions);
    polar_control_runs_out_caution(aircraft, p, cautions);
}

/// The caution `no-flight-polar` saying why there is no flight polar (none when no stall was
/// found).
fn no_polar_caution(why: &NoPolar, cautions: &mut Vec<Caution>) {
    let why = match why {
        NoPolar::NoTrimControl => PolarMissing::NoTrimControl,
        NoPolar::NoStall => return,
        NoPolar::Failed(e) => PolarMissing::Failed(*e),
    };
    cautions.push(Caution::of(GlideFinding::NoFlightPolar { why }.into()));
}

/// The warning `min-sink-near-stall` when the least sink lies at the stall or within
/// `MIN_SINK_STALL_MARGIN` times the stall speed.
fn min_sink_near_stall_caution(p: &GlidePolar, cautions: &mut Vec<Caution>) {
    let vs = p.stall_speed_m_s;
    let ms = &p.min_sink;
    if ms.at_stall || ms.point.speed_m_s < MIN_SINK_STALL_MARGIN * vs {
        cautions.push(Caution::of(
            GlideFinding::MinSinkNearStall {
                speed_m_s: ms.point.speed_m_s,
                at_stall: ms.at_stall,
                stall_speed_m_s: vs,
                margin_factor: MIN_SINK_STALL_MARGIN,
            }
            .into(),
        ));
    }
}

/// The warning `section-separates-early` when an airfoil's viscous polar separates below the
/// cl it flies at the stall speed.
fn early_separation_caution(p: &GlidePolar, cautions: &mut Vec<Caution>) {
    if let Some(e) = &p.early_separation {
        cautions.push(Caution::of(
            GlideFinding::SectionSeparatesEarly {
                separation: e.clone(),
                stall_speed_m_s: p.stall_speed_m_s,
            }
            .into(),
        ));
    }
}

/// The warning `profile-drag-estimated` for each airfoil whose section drag is the flat-plate
/// estimate.
fn profile_drag_estimated_cautions(p: &GlidePolar, cautions: &mut Vec<Caution>) {
    for s in &p.profile_sources {
        if let Some(reason) = &s.flat_plate_reason {
            cautions.push(Caution::of(
                GlideFinding::ProfileDragEstimated {
                    airfoil: s.airfoil.clone(),
                    reason: reason.clone(),
                }
                .into(),
            ));
        }
    }
}

/// The note `polar-drag-extrapolated` with the speed range (m/s) where some flyable point's
/// drag is continued beyond its section polar.
fn polar_drag_extrapolated_note(p: &GlidePolar, cautions: &mut Vec<Caution>) {
    let extrapolated: Vec<f64> = p
        .points
        .iter()
        .filter(|q| q.flyable && q.drag.beyond_polar)
        .map(|q| q.speed_m_s)
        .collect();
    if let (Some(low_m_s), Some(high_m_s)) = (
        extrapolated.iter().copied().reduce(f64::min),
        extrapolated.iter().copied().reduce(f64::max),
    ) {
        cautions.push(Caution::of(
            GlideFinding::PolarDragExtrapolated { low_m_s, high_m_s }.into(),
        ));
    }
}

/// The warning `polar-control-runs-out` over the speeds (m/s) the pitch control cannot
/// trim.
fn polar_control_runs_out_caution(
    aircraft: &Aircraft,
    p: &GlidePolar,
    cautions: &mut Vec<Caution>,
) {
    if let Some((low_m_s, high_m_s)) = unflyable_range(p) {
        cautions.push(Caution::of(
            GlideFinding::PolarControlRunsOut {
                low_m_s,
                high_m_s,
                control: Control::of(aircraft),
            }
            .into(),
        ));
    }
}

/// The flight polar of one named flap setting.
#[derive(Debug, Clone, PartialEq)]
pub struct SettingPolar {
    /// The setting's name.
    pub name: String,
    /// Its polar, or why there is none.
    pub polar: Result<GlidePolar, NoPolar>,
}

/// Per station of `system`: (zero-lift angle change, cm_ac change, section cl shift) that
/// `setting` makes, by Glauert's plain-flap theory with the hinge-gap factor
/// ([`crate::section::flap_correction`]), weighted by the share of the strip each flap
/// covers.
pub fn setting_effects(
    aircraft: &Aircraft,
    system: &MultiSurfaceSystem,
    setting: &crate::model::FlapSetting,
) -> Vec<(f64, f64, f64)> {
    let semispan = crate::planform::half_span_length_m(&aircraft.wing).max(1e-9);
    system
        .stations()
        .iter()
        .map(|st| {
            if st.surface != 0 {
                return (0.0, 0.0, 0.0);
            }
            let (lo, hi) = (
                (st.s_m.abs() - 0.5 * st.width_m).max(0.0) / semispan,
                (st.s_m.abs() + 0.5 * st.width_m) / semispan,
            );
            let mut out = (0.0, 0.0, 0.0);
            for &(i, deflection_rad) in &setting.deflections {
                let Some(f) = aircraft.wing_flaps.get(i) else {
                    continue;
                };
                let Ok(effect) = crate::section::flap_effectiveness(f.chord_fraction) else {
                    continue;
                };
                let overlap = (hi.min(f.outboard_fraction) - lo.max(f.inboard_fraction)).max(0.0);
                let share = if hi > lo { overlap / (hi - lo) } else { 0.0 };
                let d = crate::section::flap_correction::effective_deflection_rad(
                    f.chord_fraction,
                    deflection_rad,
                ) * share;
                out.0 -= effect.tau * d;
                out.1 += effect.dcm_quarter_chord_ddelta_per_rad * d;
                out.2 += st.section.cl_alpha_per_rad * effect.tau * d;
            }
            out
        })
        .collect()
}

/// The flight polar of every flap setting of the aircraft.
pub fn setting_polars(input: &GlideInput<'_>) -> Vec<SettingPolar> {
    let aircraft = input.aircraft;
    let shift = input.full.neutral_point_surfaces_x_m - input.full.neutral_point_x_m;
    let (x_ref, z_ref) = (input.cg_m.0 + shift, input.cg_m.1);
    aircraft
        .flap_settings
        .iter()
        .map(|setting| {
            let effects = setting_effects(aircraft, input.system, setting);
            let polar = (|| {
                let flapped = input
                    .system
                    .with_section_change(|k, _| (effects[k].0, effects[k].1))
                    .map_err(|_| NoPolar::NoStall)?;
                let probe = AircraftDrag::new(aircraft, &flapped, &[], x_ref, z_ref, 1.0)
                    .ok_or(NoPolar::NoTrimControl)?;
                let stall = flapped
                    .trimmed_stall(&flapped.condition(0.0), probe.control(), x_ref, z_ref)
                    .map_err(|_| NoPolar::NoStall)?;
                let area = flapped.reference().area_m2;
                let speed = (2.0 * input.mass_kg * crate::atmosphere::G0
                    / (input.air.density_kg_m3 * area * stall.cl))
                    .sqrt();
                let shifts: Vec<f64> = effects.iter().map(|e| e.2).collect();
                polar_on(input, &flapped, &shifts, stall.cl, speed)
            })();
            SettingPolar {
                name: setting.name.clone(),
                polar,
            }
        })
        .collect()
}

/// The cautions of the flap settings' polars.
pub fn setting_cautions(
    aircraft: &Aircraft,
    settings: &[SettingPolar],
    cautions: &mut Vec<Caution>,
) {
    if settings.is_empty() {
        return;
    }
    cautions.push(Caution::of(GlideFinding::FlapSettingsEstimated.into()));
    for s in settings {
        let setting = s.name.clone();
        let finding = match &s.polar {
            Err(NoPolar::Failed(e)) => GlideFinding::FlapSettingNoPolar {
                setting,
                error: Some(*e),
            },
            Err(_) => GlideFinding::FlapSettingNoPolar {
                setting,
                error: None,
            },
            Ok(p) => match unflyable_range(p) {
                Some((low_m_s, high_m_s)) => GlideFinding::FlapSettingControlRunsOut {
                    setting,
                    low_m_s,
                    high_m_s,
                    control: Control::of(aircraft),
                },
                None => continue,
            },
        };
        cautions.push(Caution::of(finding.into()));
    }
}

/// Sink at `speed_m_s` on the flyable part of `p` (linear between its points), `None`
/// outside it.
pub fn sink_at(p: &GlidePolar, speed_m_s: f64) -> Option<f64> {
    p.points
        .windows(2)
        .filter(|w| w[0].flyable && w[1].flyable)
        .find(|w| w[0].speed_m_s <= speed_m_s && speed_m_s <= w[1].speed_m_s)
        .map(|w| {
            let f = (speed_m_s - w[0].speed_m_s) / (w[1].speed_m_s - w[0].speed_m_s);
            w[0].sink_m_s + f * (w[1].sink_m_s - w[0].sink_m_s)
        })
}

/// The slowest and fastest speeds (m/s) of `p` that the pitch control cannot trim, if any.
fn unflyable_range(p: &GlidePolar) -> Option<(f64, f64)> {
    let speeds = p.points.iter().filter(|q| !q.flyable).map(|q| q.speed_m_s);
    Some((speeds.clone().reduce(f64::min)?, speeds.reduce(f64::max)?))
}
