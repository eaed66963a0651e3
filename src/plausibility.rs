//! Plausibility cautions: values the file reader accepts (they are possible) but that are
//! unusual enough to be a slip or a risk, raised as cautions with their numbers.
//!
//! The ranges are common practice for models and light aircraft (from memory, not from one
//! published table): wing loadings from about 0.1 kg/m^2 (indoor models) through 2 to
//! 15 kg/m^2 (outdoor models, jets at the top) to about 150 kg/m^2 (light aircraft); a
//! fuselage up to about 1.5 times the wing span (sailplanes are far shorter, some jets and
//! canards reach 1.5); a stabiliser within about 1.5 spans of the wing; a wing aspect ratio of about 1.5 to 55. Impossible values are refused earlier,
//! by the reader, with an error.

use crate::caution::Caution;
use crate::finding::{InputFinding, MarginSetting};
use crate::model::Aircraft;
use crate::planform::PlanformGeometry;

/// Wing loadings outside this range get `wing-loading-unusual`, kg/m^2 (common practice).
pub const USUAL_WING_LOADING_KG_M2: (f64, f64) = (0.1, 160.0);
/// A fuselage longer than this many wing spans gets `proportions-unusual` (common practice).
pub const MAX_USUAL_FUSELAGE_PER_SPAN: f64 = 1.5;
/// A stabiliser farther than this many wing spans from the wing gets `proportions-unusual`.
pub const MAX_USUAL_TAIL_ARM_PER_SPAN: f64 = 1.5;

/// Wing aspect ratios outside this range get `proportions-unusual` (common practice, from
/// memory: about 2 for the stubbiest flying wings and discs, about 50 for the most slender
/// open-class sailplanes).
pub const USUAL_ASPECT_RATIO: (f64, f64) = (1.5, 55.0);

/// A canard nearer the wing's plane than this fraction of the wing span gets
/// `canard-wake-on-wing`: its tip vortices then cross the wing so close to its lattice that the
/// loading and drag there are not resolved (seen here: a flat canard 1 mm from the wing's plane
/// gave a span efficiency of 4, 10 mm gave 0.87, 50 mm 0.67 on a 0.9 m span).
pub const MIN_CANARD_GAP_PER_SPAN: f64 = 0.03;

/// A positive static margin below this (1 % of MAC) is most likely a fraction typed for a
/// percentage.
pub const MARGIN_FRACTION_SLIP: f64 = 0.01;

/// The plausibility cautions of `aircraft` with wing geometry `wing` and total mass
/// `mass_kg`.
pub fn cautions(aircraft: &Aircraft, wing: &PlanformGeometry, mass_kg: f64) -> Vec<Caution> {
    let mut out = Vec::new();
    margin_cautions(aircraft, &mut out);
    overlap_caution(aircraft, &mut out);
    if wing.area_m2 > 0.0 && wing.span_m > 0.0 {
        canard_plane_caution(aircraft, wing, &mut out);
        wing_loading_caution(wing, mass_kg, &mut out);
        proportion_cautions(aircraft, wing, &mut out);
    }
    out
}

/// A negative static margin asked for, and a margin that looks typed as a fraction.
fn margin_cautions(aircraft: &Aircraft, out: &mut Vec<Caution>) {
    let limits = &aircraft.margin_limits;
    let target = aircraft.targets.static_margin;
    if let Some(m) = target.filter(|m| *m < 0.0) {
        out.push(Caution::of(
            InputFinding::StaticMarginLimitNegative {
                setting: MarginSetting::Target,
                static_margin: m,
            }
            .into(),
        ));
    } else if limits.min_static_margin < 0.0 {
        out.push(Caution::of(
            InputFinding::StaticMarginLimitNegative {
                setting: MarginSetting::LeastLimit,
                static_margin: limits.min_static_margin,
            }
            .into(),
        ));
    }
    // A margin typed as a fraction (0.10 for 10 %) reads as 0.1 % of MAC: a CG on the
    // neutral point. Margins of model aircraft start at about 3 % (common practice).
    for (setting, value) in [
        (MarginSetting::Target, target),
        (
            MarginSetting::LeastLimit,
            (!limits.from_defaults).then_some(limits.min_static_margin),
        ),
    ] {
        if let Some(m) = value.filter(|m| *m > 0.0 && *m < MARGIN_FRACTION_SLIP) {
            out.push(Caution::of(
                InputFinding::MarginLooksLikeAFraction {
                    setting,
                    static_margin: m,
                }
                .into(),
            ));
        }
    }
}

/// The stabiliser overlapping the wing in the top view.
fn overlap_caution(aircraft: &Aircraft, out: &mut Vec<Caution>) {
    if let Some(stab) = &aircraft.stabiliser {
        if let Some(o) = crate::planform::plan_overlap(&aircraft.wing, &stab.surface) {
            out.push(Caution::of(
                InputFinding::SurfacesOverlap {
                    role: stab.role,
                    y_m: o.y_m,
                    gap_m: o.gap_m,
                }
                .into(),
            ));
        }
    }
}

/// A canard closer to the wing's plane than [`MIN_CANARD_GAP_PER_SPAN`] of the span (`wing`
/// with a positive span).
fn canard_plane_caution(aircraft: &Aircraft, wing: &PlanformGeometry, out: &mut Vec<Caution>) {
    if let Some(s) = aircraft
        .stabiliser
        .as_ref()
        .filter(|s| s.role == crate::model::StabiliserRole::Canard)
    {
        let gap_m = s.surface.root_le_z_m - aircraft.wing.root_le_z_m;
        if gap_m.abs() < MIN_CANARD_GAP_PER_SPAN * wing.span_m {
            out.push(Caution::of(
                InputFinding::CanardWakeOnWing {
                    gap_m,
                    span_m: wing.span_m,
                }
                .into(),
            ));
        }
    }
}

/// A wing loading outside the usual range (`wing` with a positive area and span).
fn wing_loading_caution(wing: &PlanformGeometry, mass_kg: f64, out: &mut Vec<Caution>) {
    let loading = mass_kg / wing.area_m2;
    let (lo, hi) = USUAL_WING_LOADING_KG_M2;
    if loading < lo || loading > hi {
        out.push(Caution::of(
            InputFinding::WingLoadingUnusual {
                loading_kg_m2: loading,
                usual_kg_m2: USUAL_WING_LOADING_KG_M2,
            }
            .into(),
        ));
    }
}

/// A fuselage or tail arm long for the span, or a wing of unusual aspect ratio (`wing` with a
/// positive span and area).
fn proportion_cautions(aircraft: &Aircraft, wing: &PlanformGeometry, out: &mut Vec<Caution>) {
    let span_m = wing.span_m;
    if let Some(f) = &aircraft.fuselage {
        if f.length_m > MAX_USUAL_FUSELAGE_PER_SPAN * span_m {
            out.push(Caution::of(
                InputFinding::FuselageLong {
                    length_m: f.length_m,
                    span_m,
                    usual_max: MAX_USUAL_FUSELAGE_PER_SPAN,
                }
                .into(),
            ));
        }
    }
    if let Some(s) = &aircraft.stabiliser {
        let arm_m = (s.surface.root_le_x_m - aircraft.wing.root_le_x_m).abs();
        if arm_m > MAX_USUAL_TAIL_ARM_PER_SPAN * span_m {
            out.push(Caution::of(
                InputFinding::TailArmLong {
                    arm_m,
                    span_m,
                    usual_max: MAX_USUAL_TAIL_ARM_PER_SPAN,
                }
                .into(),
            ));
        }
    }
    let aspect_ratio = span_m * span_m / wing.area_m2;
    let (lo, hi) = USUAL_ASPECT_RATIO;
    if aspect_ratio.is_finite() && !(lo..=hi).contains(&aspect_ratio) {
        out.push(Caution::of(
            InputFinding::AspectRatioUnusual {
                aspect_ratio,
                span_m,
                usual: USUAL_ASPECT_RATIO,
            }
            .into(),
        ));
    }
}
