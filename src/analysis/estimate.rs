//! The inputs of the closed-form estimate and of the full model's trim, and the first glide
//! estimate from the flat-plate drag build-up.

use super::{lifting_line_options, AnalysisError, AnalysisOptions};
use crate::atmosphere::AirState;
use crate::balance::MassSummary;
use crate::model::{Aircraft, StabiliserRole};
use crate::performance::drag;
use crate::performance::drag::{BodyDragInput, SurfaceDragInput};
use crate::performance::polar::{oswald_straight_wing, GlidePerformance, PolarInput};
use crate::section::SectionModel;
use crate::stability::classical::{EquivalentSurface, StabiliserPlace};
use crate::stability::{classical, trim};

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
pub(super) fn surface_thickness(aircraft: &Aircraft, surface: &crate::model::Surface) -> f64 {
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

pub(super) fn glide_estimate(
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

/// The inputs of the full-model balance and trim for an aircraft, its section models, masses
/// and air (shared by the analysis and by charts that re-trim at other CG positions).
pub fn trim_input<'a>(
    aircraft: &'a Aircraft,
    sections: &'a [SectionModel],
    mass: &MassSummary,
    air: &AirState,
    fuselage_cm_alpha_per_rad: f64,
    options: &AnalysisOptions,
) -> trim::TrimInput<'a> {
    trim::TrimInput {
        aircraft,
        sections,
        mass_kg: mass.total_kg,
        cg_x_m: mass.cg_x_m,
        cg_z_m: mass.cg_z_m.unwrap_or(aircraft.wing.root_le_z_m),
        density_kg_m3: air.density_kg_m3,
        fuselage_cm_alpha_per_rad,
        options: lifting_line_options(aircraft, options),
        target_speed_m_s: aircraft.targets.trim_speed_m_s,
        top_speed_m_s: aircraft.targets.top_speed_m_s,
    }
}

/// The file's `[numerics]` with the options' override applied.
pub(super) fn numerics_used(
    aircraft: &Aircraft,
    options: &AnalysisOptions,
) -> crate::model::Numerics {
    crate::model::Numerics {
        strips_per_half_span: options
            .stations_per_half_span
            .unwrap_or(aircraft.numerics.strips_per_half_span),
        ..aircraft.numerics
    }
}

/// Thin-airfoil section models of every airfoil (for the closed-form estimate), with the
/// airfoils' own cl_max.
pub(super) fn thin_section_models(
    aircraft: &Aircraft,
    options: &AnalysisOptions,
) -> Result<Vec<SectionModel>, AnalysisError> {
    aircraft
        .airfoils
        .iter()
        .map(|a| {
            let thin = crate::model::Airfoil {
                method: Some(crate::model::SectionMethod::Thin),
                ..a.clone()
            };
            let opts = crate::section::SectionOptions {
                panels: options.panels,
            };
            Ok(crate::section::section_model(&thin, &opts)?.model)
        })
        .collect()
}

/// The closed-form estimate's input: the equivalent wing and stabiliser (with its place, tail
/// or canard), the mass and CG, the air density, the fuselage's pitching term and the
/// stabiliser's dynamic-pressure ratio (1 without a stabiliser).
pub(super) fn closed_form_input<'a>(
    aircraft: &Aircraft,
    wing: &'a EquivalentSurface,
    stabiliser: Option<&'a EquivalentSurface>,
    mass: &MassSummary,
    air: &AirState,
    fuselage_cm_alpha_per_rad: f64,
) -> classical::EstimateInput<'a> {
    let place = aircraft.stabiliser.as_ref().map(|s| match s.role {
        StabiliserRole::Tail => StabiliserPlace::Tail,
        StabiliserRole::Canard => StabiliserPlace::Canard,
    });
    classical::EstimateInput {
        wing,
        stabiliser: stabiliser.zip(place),
        mass_kg: mass.total_kg,
        cg_x_m: mass.cg_x_m,
        density_kg_m3: air.density_kg_m3,
        fuselage_cm_alpha_per_rad,
        stabiliser_dynamic_pressure_ratio: aircraft
            .stabiliser
            .as_ref()
            .map_or(1.0, |s| s.dynamic_pressure_ratio),
        downwash_factor: 1.0,
    }
}
