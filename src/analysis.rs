//! The whole analysis chain in one call: sections, planform, masses, balance, stability, trim,
//! stall; with the cautions found on the way.
//!
//! This module only composes the published methods that live in their own modules; it adds
//! the decisions a builder needs (CG band, ballast advice, cautions) and their thresholds,
//! which are common practice and documented in `docs/cautions.md`.

use crate::atmosphere::{self, AirState};
use crate::balance::{self, BallastOutcome, MassSummary};
use crate::caution::{safety_caution, Caution, Level};
use crate::model::{Aircraft, StabiliserRole};
use crate::performance::drag::{self, BodyDragInput, SurfaceDragInput};
use crate::performance::polar::{oswald_straight_wing, GlidePerformance, PolarInput};

use crate::planform::{self, PlanformGeometry, TailVolume};
use crate::section::SectionModel;
use crate::stability::classical::{self, ClassicalEstimate, EquivalentSurface, StabiliserPlace};
use thiserror::Error;

/// Trim speed below this multiple of the stall speed gives a caution (common practice: 1.2,
/// the margin a pilot keeps in turbulence).
pub const NEAR_STALL_FACTOR: f64 = 1.2;
/// Static margin below which the builder is warned, fraction of MAC (common practice: 5 %).
pub const LOW_STATIC_MARGIN: f64 = 0.05;
/// Reynolds number (on the wing MAC at trim speed) below which sections lose lift and gain
/// drag sharply; a warning is raised (common practice for model airfoils: 50 000).
pub const LOW_REYNOLDS_WARNING: f64 = 50_000.0;
/// Reynolds number below which a note is raised (common practice: 100 000).
pub const LOW_REYNOLDS_NOTE: f64 = 100_000.0;
/// Difference between weighed and listed CG above which the builder is warned, m
/// (common practice: 5 mm, about what a kitchen-scale weighing resolves on a model).
pub const WEIGHING_CG_TOLERANCE_M: f64 = 0.005;
/// Relative difference between weighed and listed mass above which the builder is warned
/// (common practice: 5 %).
pub const WEIGHING_MASS_TOLERANCE: f64 = 0.05;

/// Options of an analysis.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AnalysisOptions {
    /// Panels for the vortex panel method, where it is used.
    pub panels: usize,
}

impl Default for AnalysisOptions {
    fn default() -> Self {
        AnalysisOptions { panels: 160 }
    }
}

/// Why an analysis could not be completed.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum AnalysisError {
    /// The mass list is unusable.
    #[error(transparent)]
    Balance(#[from] balance::BalanceError),
    /// An airfoil could not be analysed.
    #[error(transparent)]
    Section(#[from] crate::section::SectionError),
    /// A result came out non-finite: the input is outside what the models can handle.
    #[error("the analysis produced a non-finite {quantity}; check the geometry and masses for extreme values")]
    NonFinite {
        /// Which quantity.
        quantity: &'static str,
    },
}

/// The recommended CG band.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CgBand {
    /// Forward limit, m aft of the datum (at the largest recommended static margin).
    pub forward_x_m: f64,
    /// Aft limit, m aft of the datum (at the smallest recommended static margin).
    pub aft_x_m: f64,
}

/// Advice for one ballast bay.
#[derive(Debug, Clone, PartialEq)]
pub struct BallastAdvice {
    /// Bay name.
    pub bay: String,
    /// Target CG, m.
    pub target_x_m: f64,
    /// What the bay can do.
    pub outcome: BallastOutcome,
}

/// Everything computed for one aircraft.
#[derive(Debug, Clone, PartialEq)]
pub struct Analysis {
    /// The air at the file's altitude.
    pub air: AirState,
    /// Section models, parallel to `aircraft.airfoils`.
    pub sections: Vec<SectionModel>,
    /// Wing geometry.
    pub wing_geometry: PlanformGeometry,
    /// Stabiliser geometry.
    pub stabiliser_geometry: Option<PlanformGeometry>,
    /// Tail or canard volume.
    pub tail_volume: Option<TailVolume>,
    /// Masses and CG.
    pub mass: MassSummary,
    /// Wing loading, kg/m^2 (mass over wing area).
    pub wing_loading_kg_m2: f64,
    /// Wing reduced to an equivalent straight wing.
    pub wing: EquivalentSurface,
    /// Stabiliser reduced likewise.
    pub stabiliser: Option<EquivalentSurface>,
    /// Closed-form estimate.
    pub classical: ClassicalEstimate,
    /// Recommended CG band.
    pub band: CgBand,
    /// Ballast advice, per bay, when a target static margin is given.
    pub ballast: Vec<BallastAdvice>,
    /// Reynolds number on the wing MAC at trim speed (or stall speed when no trim).
    pub reynolds_mac: f64,
    /// Mass and CG measured by the weighing in the file, if any.
    pub weighed: Option<MassSummary>,
    /// Glide performance from the drag build-up.
    pub glide: Glide,
    /// Everything the builder should read.
    pub cautions: Vec<Caution>,
}

/// Run the whole chain on `aircraft`.
pub fn analyse(aircraft: &Aircraft, options: &AnalysisOptions) -> Result<Analysis, AnalysisError> {
    let mut cautions = Vec::new();
    let air = atmosphere::air_state(&aircraft.air);
    let mut sections = Vec::with_capacity(aircraft.airfoils.len());
    for airfoil in &aircraft.airfoils {
        let outcome = crate::section::section_model(
            airfoil,
            &crate::section::SectionOptions {
                panels: options.panels,
            },
        )?;
        sections.push(outcome.model);
        cautions.extend(outcome.cautions);
    }
    let wing = classical::equivalent_surface(&aircraft.wing, &sections);
    let stabiliser = aircraft
        .stabiliser
        .as_ref()
        .map(|s| classical::equivalent_surface(&s.surface, &sections));
    let mass = balance::mass_summary(&aircraft.masses)?;
    let place = aircraft.stabiliser.as_ref().map(|s| match s.role {
        StabiliserRole::Tail => StabiliserPlace::Tail,
        StabiliserRole::Canard => StabiliserPlace::Canard,
    });
    let estimate = classical::estimate(&classical::EstimateInput {
        wing: &wing,
        stabiliser: stabiliser.as_ref().zip(place),
        mass_kg: mass.total_kg,
        cg_x_m: mass.cg_x_m,
        density_kg_m3: air.density_kg_m3,
        fuselage_cm_alpha_per_rad: fuselage_cm_alpha(aircraft, &wing),
    });

    let mac = wing.geometry.mac_m;
    let np = estimate.neutral_point_x_m;
    let band = CgBand {
        forward_x_m: np - aircraft.margin_limits.max_static_margin * mac,
        aft_x_m: np - aircraft.margin_limits.min_static_margin * mac,
    };
    let ballast = match aircraft.targets.static_margin {
        None => Vec::new(),
        Some(sm) => {
            let target_x_m = np - sm * mac;
            aircraft
                .ballast_bays
                .iter()
                .map(|bay| BallastAdvice {
                    bay: bay.name.clone(),
                    target_x_m,
                    outcome: balance::ballast_for_target(&mass, bay, target_x_m),
                })
                .collect()
        }
    };
    let speed = estimate
        .trim
        .map(|t| t.speed_m_s)
        .unwrap_or(estimate.stall_speed_m_s);
    let reynolds_mac = air.reynolds(speed, mac);
    let wing_loading_kg_m2 = mass.total_kg / wing.geometry.area_m2;
    let glide = glide_estimate(
        aircraft,
        &wing,
        stabiliser.as_ref(),
        &mass,
        &air,
        estimate.cl_max,
    );
    for (name, v) in [
        ("neutral point", estimate.neutral_point_x_m),
        ("static margin", estimate.static_margin),
        ("stall speed", estimate.stall_speed_m_s),
        ("wing loading", wing_loading_kg_m2),
        ("Reynolds number", reynolds_mac),
        ("zero-lift drag", glide.cd0),
        ("best glide", glide.performance.best_glide.glide_ratio),
        ("minimum sink", glide.performance.min_sink.sink_m_s),
    ] {
        if !v.is_finite() {
            return Err(AnalysisError::NonFinite { quantity: name });
        }
    }
    let weighed = if aircraft.weighing.is_empty() {
        None
    } else {
        Some(balance::weighing(&aircraft.weighing)?)
    };
    if let Some(w) = &weighed {
        let dx_mm = (w.cg_x_m - mass.cg_x_m) * 1000.0;
        let dm_pct = 100.0 * (w.total_kg - mass.total_kg) / mass.total_kg;
        if dx_mm.abs() > WEIGHING_CG_TOLERANCE_M * 1000.0
            || dm_pct.abs() > 100.0 * WEIGHING_MASS_TOLERANCE
        {
            cautions.push(Caution::new(
                Level::Warning,
                "weighing-differs",
                format!(
                    "The weighing puts the CG at {:.0} mm and the mass at {:.0} g; the mass list gives {:.0} mm \
                     and {:.0} g ({dx_mm:+.0} mm, {dm_pct:+.1} %). Trust the scales: correct the mass list \
                     (a forgotten item, a wrong position) before relying on the figures here.",
                    w.cg_x_m * 1000.0,
                    w.total_kg * 1000.0,
                    mass.cg_x_m * 1000.0,
                    mass.total_kg * 1000.0
                ),
            ));
        }
    }
    let tail_volume = stabiliser
        .as_ref()
        .map(|s| planform::tail_volume(&wing.geometry, &s.geometry));

    balance_cautions(aircraft, &mass, &estimate, &band, mac, &mut cautions);
    if reynolds_mac < LOW_REYNOLDS_WARNING {
        cautions.push(Caution::new(
            Level::Warning,
            "reynolds-low",
            format!(
                "Reynolds number on the wing's mean chord at {speed:.1} m/s is only {reynolds_mac:.0}: \
                 airfoils lose lift and gain drag sharply below about 50 000, so expect a higher stall \
                 speed and poorer glide than estimated."
            ),
        ));
    } else if reynolds_mac < LOW_REYNOLDS_NOTE {
        cautions.push(Caution::new(
            Level::Note,
            "reynolds-low",
            format!(
                "Reynolds number on the wing's mean chord at {speed:.1} m/s is {reynolds_mac:.0}: \
                 below about 100 000 section data and cl_max are uncertain; choose airfoils made for low Reynolds numbers."
            ),
        ));
    }
    cautions.push(safety_caution());
    Ok(Analysis {
        air,
        sections,
        wing_geometry: wing.geometry,
        stabiliser_geometry: stabiliser.map(|s| s.geometry),
        tail_volume,
        mass,
        wing_loading_kg_m2,
        wing,
        stabiliser,
        classical: estimate,
        band,
        ballast,
        reynolds_mac,
        weighed,
        glide,
        cautions,
    })
}

fn balance_cautions(
    aircraft: &Aircraft,
    mass: &MassSummary,
    est: &ClassicalEstimate,
    band: &CgBand,
    mac_m: f64,
    cautions: &mut Vec<Caution>,
) {
    let mac_mm = mac_m * 1000.0;
    let sm_pct = 100.0 * est.static_margin;
    if est.static_margin < 0.0 {
        cautions.push(Caution::new(
            Level::Danger,
            "static-margin-negative",
            format!(
                "The CG is {:.0} mm behind the neutral point (static margin {sm_pct:.1} %): the aircraft is \
                 unstable in pitch and will not fly as balanced. Move the CG forward or add nose weight.",
                (mass.cg_x_m - est.neutral_point_x_m) * 1000.0
            ),
        ));
    } else if est.static_margin < LOW_STATIC_MARGIN.min(aircraft.margin_limits.min_static_margin) {
        cautions.push(Caution::new(
            Level::Warning,
            "static-margin-low",
            format!(
                "Static margin is only {sm_pct:.1} % of the mean chord: pitch will be sensitive and an error in \
                 the estimate could make it unstable. Models usually fly with 5 to 15 %."
            ),
        ));
    }
    let fwd = band.forward_x_m;
    let aft = band.aft_x_m;
    if mass.cg_x_m > aft + 5e-4 {
        cautions.push(Caution::new(
            Level::Warning,
            "cg-aft-of-band",
            format!(
                "The CG is {:.0} mm aft of the recommended band ({:.0} to {:.0} mm from the datum).",
                (mass.cg_x_m - aft) * 1000.0,
                fwd * 1000.0,
                aft * 1000.0
            ),
        ));
    } else if mass.cg_x_m < fwd - 5e-4 {
        cautions.push(Caution::new(
            Level::Warning,
            "cg-forward-of-band",
            format!(
                "The CG is {:.0} mm forward of the recommended band ({:.0} to {:.0} mm from the datum): \
                 the aircraft will be nose-heavy, need more up elevator and fly faster.",
                (fwd - mass.cg_x_m) * 1000.0,
                fwd * 1000.0,
                aft * 1000.0
            ),
        ));
    }
    if let Some(t) = est.trim {
        if t.cl > est.cl_max {
            cautions.push(Caution::new(
                Level::Danger,
                "trim-beyond-stall",
                format!(
                    "The aircraft trims at CL {:.2}, above its CL max of {:.2}: as balanced it would fly \
                     stalled. Reduce the decalage (stabiliser incidence closer to the wing's) or move the \
                     CG aft within the recommended band.",
                    t.cl, est.cl_max
                ),
            ));
        } else if t.speed_m_s < NEAR_STALL_FACTOR * est.stall_speed_m_s {
            cautions.push(Caution::new(
                Level::Warning,
                "trim-near-stall",
                format!(
                    "Trim speed {:.1} m/s is within 20 % of the stall speed {:.1} m/s: little margin \
                     against a stall in gusts or turns. Reduce the decalage slightly or move the CG aft.",
                    t.speed_m_s, est.stall_speed_m_s
                ),
            ));
        }
    }
    if est.trim.is_none() {
        cautions.push(Caution::new(
            Level::Danger,
            "no-trim",
            "No trimmed flight at positive lift was found with this CG and these incidences: \
             check the decalage (stabiliser incidence) and the CG."
                .to_string(),
        ));
    }
    if aircraft.margin_limits.from_defaults {
        cautions.push(Caution::new(
            Level::Note,
            "band-defaults",
            format!(
                "The recommended CG band uses common-practice static margins of {:.0} to {:.0} % of the \
                 {mac_mm:.0} mm mean chord; set [limits] in the file to use your own.",
                100.0 * aircraft.margin_limits.min_static_margin,
                100.0 * aircraft.margin_limits.max_static_margin
            ),
        ));
    }
}

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
    /// Decalage (wing incidence minus stabiliser incidence), rad, when there is a stabiliser.
    pub decalage_rad: Option<f64>,
    /// Trim CL, when trimmed.
    pub trim_cl: Option<f64>,
    /// Trim speed, m/s, when trimmed.
    pub trim_speed_m_s: Option<f64>,
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
    /// Ballast needed for the target static margin in the first bay that can reach it, kg.
    pub ballast_kg: Option<(String, f64)>,
    /// Number of warnings.
    pub warnings: usize,
    /// Number of dangers.
    pub dangers: usize,
}

impl KeyFigures {
    /// Collect the key figures of an analysed aircraft.
    pub fn of(aircraft: &Aircraft, a: &Analysis) -> KeyFigures {
        let g = &a.wing_geometry;
        let est = &a.classical;
        KeyFigures {
            name: aircraft.name.clone(),
            mass_kg: a.mass.total_kg,
            wing_loading_kg_m2: a.wing_loading_kg_m2,
            cg_x_m: a.mass.cg_x_m,
            cg_from_wing_root_le_m: a.mass.cg_x_m - aircraft.wing.root_le_x_m,
            cg_percent_mac: g.percent_mac(a.mass.cg_x_m),
            neutral_point_x_m: est.neutral_point_x_m,
            static_margin: est.static_margin,
            band: a.band,
            decalage_rad: aircraft
                .stabiliser
                .as_ref()
                .map(|s| aircraft.wing.incidence_rad - s.surface.incidence_rad),
            trim_cl: est.trim.map(|t| t.cl),
            trim_speed_m_s: est.trim.map(|t| t.speed_m_s),
            stall_speed_m_s: est.stall_speed_m_s,
            ballast_kg: a.ballast.iter().find_map(|b| match b.outcome {
                BallastOutcome::Reachable { mass_kg } => Some((b.bay.clone(), mass_kg)),
                BallastOutcome::NotNeeded => Some((b.bay.clone(), 0.0)),
                _ => None,
            }),
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
        }
    }
}

/// The fuselage's contribution to dCm/dalpha (per rad), or 0 without a fuselage.
pub fn fuselage_cm_alpha(aircraft: &Aircraft, wing: &EquivalentSurface) -> f64 {
    aircraft.fuselage.as_ref().map_or(0.0, |f| {
        crate::stability::fuselage::cm_alpha_per_rad(
            f,
            aircraft.wing.root_le_x_m + 0.25 * wing.geometry.root_chord_m,
            wing.geometry.mac_m,
            wing.geometry.area_m2,
        )
    })
}

/// Glide performance of the aircraft.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Glide {
    /// Zero-lift drag coefficient (at the best-glide speed's Reynolds numbers).
    pub cd0: f64,
    /// Span efficiency used in the polar (Raymer's Oswald estimate).
    pub span_efficiency: f64,
    /// Best glide and minimum sink.
    pub performance: GlidePerformance,
}

/// Position of greatest thickness assumed in the drag build-up, fraction of chord (NACA
/// 4-digit sections have it at 0.3; common practice for model sections).
const X_THICKNESS_C: f64 = 0.3;

/// Area-weighted thickness ratio of a surface's airfoils (each panel counts the mean of its
/// end airfoils).
fn surface_thickness(aircraft: &Aircraft, surface: &crate::model::Surface) -> f64 {
    let t = |id: crate::model::AirfoilId| crate::section::thickness_ratio(aircraft.airfoil(id));
    match &surface.shape {
        crate::model::SurfaceShape::Panels(panels) => {
            let (mut num, mut den) = (0.0, 0.0);
            for p in panels {
                let area = p.span_m * (p.root_chord_m + p.tip_chord_m);
                num += area * 0.5 * (t(p.root_airfoil) + t(p.tip_airfoil));
                den += area;
            }
            if den > 0.0 {
                num / den
            } else {
                0.12
            }
        }
        crate::model::SurfaceShape::Elliptic(e) => 0.5 * (t(e.root_airfoil) + t(e.tip_airfoil)),
    }
}

fn glide_estimate(
    aircraft: &Aircraft,
    wing: &EquivalentSurface,
    stabiliser: Option<&EquivalentSurface>,
    mass: &MassSummary,
    air: &AirState,
    cl_max: f64,
) -> Glide {
    let mut surfaces = vec![SurfaceDragInput {
        area_m2: wing.geometry.area_m2,
        mac_m: wing.geometry.mac_m,
        thickness_ratio: surface_thickness(aircraft, &aircraft.wing),
        x_thickness_c: X_THICKNESS_C,
    }];
    if let (Some(eq), Some(st)) = (stabiliser, aircraft.stabiliser.as_ref()) {
        surfaces.push(SurfaceDragInput {
            area_m2: eq.geometry.area_m2,
            mac_m: eq.geometry.mac_m,
            thickness_ratio: surface_thickness(aircraft, &st.surface),
            x_thickness_c: X_THICKNESS_C,
        });
    }
    let body = aircraft.fuselage.as_ref().map(|f| BodyDragInput {
        length_m: f.length_m,
        width_m: f.max_width_m,
    });
    let span_efficiency = oswald_straight_wing(wing.geometry.aspect_ratio).clamp(0.3, 1.0);
    let nu = air.kinematic_viscosity_m2_s();
    let area = wing.geometry.area_m2;
    // Reynolds numbers depend on speed: evaluate CD0 at the best-glide speed by a few
    // fixed-point steps (converges in two or three; CD0 varies slowly with Re).
    let mut speed = 10.0;
    let mut polar = PolarInput {
        cd0: 0.0,
        aspect_ratio: wing.geometry.aspect_ratio,
        span_efficiency,
        mass_kg: mass.total_kg,
        area_m2: area,
        density_kg_m3: air.density_kg_m3,
        cl_max,
    };
    for _ in 0..4 {
        polar.cd0 = drag::cd0(&surfaces, body, area, speed, nu);
        speed = polar.performance().best_glide.speed_m_s;
    }
    Glide {
        cd0: polar.cd0,
        span_efficiency,
        performance: polar.performance(),
    }
}
