//! Plausibility cautions: values the file reader accepts (they are possible) but that are
//! unusual enough to be a slip or a risk, raised as cautions with their numbers.
//!
//! The ranges are common practice for models and light aircraft (from memory, not from one
//! published table): wing loadings from about 0.1 kg/m^2 (indoor models) through 2 to
//! 15 kg/m^2 (outdoor models, jets at the top) to about 150 kg/m^2 (light aircraft); a
//! fuselage up to about 1.5 times the wing span (sailplanes are far shorter, some jets and
//! canards reach 1.5); a stabiliser within about 1.5 spans of the wing. Impossible values are refused earlier,
//! by the reader, with an error.

use crate::caution::{Caution, Level};
use crate::model::Aircraft;
use crate::planform::PlanformGeometry;

/// Wing loadings outside this range get `wing-loading-unusual`, kg/m^2 (common practice).
pub const USUAL_WING_LOADING_KG_M2: (f64, f64) = (0.1, 160.0);
/// A fuselage longer than this many wing spans gets `proportions-unusual` (common practice).
pub const MAX_USUAL_FUSELAGE_PER_SPAN: f64 = 1.5;
/// A stabiliser farther than this many wing spans from the wing gets `proportions-unusual`.
pub const MAX_USUAL_TAIL_ARM_PER_SPAN: f64 = 1.5;

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
        wing_loading_caution(wing, mass_kg, &mut out);
        proportion_cautions(aircraft, wing, &mut out);
    }
    out
}

/// A negative static margin asked for, and a margin that looks typed as a fraction.
fn margin_cautions(aircraft: &Aircraft, out: &mut Vec<Caution>) {
    let limits = &aircraft.margin_limits;
    let negative_target = aircraft.targets.static_margin.is_some_and(|m| m < 0.0);
    if limits.min_static_margin < 0.0 || negative_target {
        out.push(Caution::new(
            Level::Danger,
            "static-margin-limit-negative",
            format!(
                "The file asks for a negative static margin ({} {:.1} % of MAC): the CG is \
                 then behind the neutral point and the aircraft is unstable in pitch. Only \
                 for a design flown with a stabilising system; the recommended range and \
                 ballast advice follow the file, not common practice.",
                if negative_target {
                    "target"
                } else {
                    "smallest limit"
                },
                100.0
                    * if negative_target {
                        aircraft.targets.static_margin.unwrap_or(0.0)
                    } else {
                        limits.min_static_margin
                    }
            ),
        ));
    }
    // A margin typed as a fraction (0.10 for 10 %) reads as 0.1 % of MAC: a CG on the
    // neutral point. Margins of model aircraft start at about 3 % (common practice).
    for (what, value) in [
        ("target static margin", aircraft.targets.static_margin),
        (
            "smallest static margin of [limits]",
            (!limits.from_defaults).then_some(limits.min_static_margin),
        ),
    ] {
        if let Some(m) = value.filter(|m| *m > 0.0 && *m < MARGIN_FRACTION_SLIP) {
            out.push(Caution::new(
                Level::Warning,
                "margin-looks-like-a-fraction",
                format!(
                    "The {what} is {:.2} % of MAC, which puts the CG practically on the \
                     neutral point. Margins are in percent of MAC: did you mean {:.0} %?",
                    100.0 * m,
                    10_000.0 * m
                ),
            ));
        }
    }
}

/// The stabiliser overlapping the wing in the top view.
fn overlap_caution(aircraft: &Aircraft, out: &mut Vec<Caution>) {
    if let Some(stab) = &aircraft.stabiliser {
        if let Some(o) = crate::planform::plan_overlap(&aircraft.wing, &stab.surface) {
            out.push(Caution::new(
                Level::Warning,
                "surfaces-overlap",
                format!(
                    "The {} overlaps the wing in the top view ({:.0} mm from the centre line, \
                     {:.0} mm above or below it): the two are modelled as a biplane, each in the \
                     other's field. If that is not the layout, check stabiliser.x and z.",
                    match stab.role {
                        crate::model::StabiliserRole::Tail => "tail",
                        crate::model::StabiliserRole::Canard => "canard",
                    },
                    1000.0 * o.y_m,
                    1000.0 * o.gap_m
                ),
            ));
        }
    }
}

/// A wing loading outside the usual range (`wing` with a positive area and span).
fn wing_loading_caution(wing: &PlanformGeometry, mass_kg: f64, out: &mut Vec<Caution>) {
    let loading = mass_kg / wing.area_m2;
    let (lo, hi) = USUAL_WING_LOADING_KG_M2;
    if loading < lo || loading > hi {
        out.push(Caution::new(
            Level::Warning,
            "wing-loading-unusual",
            format!(
                "The wing loading is {:.2} kg/m^2 ({:.1} g/dm^2), outside the usual {lo} to \
                 {hi} kg/m^2 of models and light aircraft: check the masses and the \
                 planform (bare masses are grams, bare lengths millimetres).",
                loading,
                10.0 * loading
            ),
        ));
    }
}

/// A fuselage or tail arm long for the span (`wing` with a positive span).
fn proportion_cautions(aircraft: &Aircraft, wing: &PlanformGeometry, out: &mut Vec<Caution>) {
    if let Some(f) = &aircraft.fuselage {
        if f.length_m > MAX_USUAL_FUSELAGE_PER_SPAN * wing.span_m {
            out.push(Caution::new(
                Level::Warning,
                "proportions-unusual",
                format!(
                    "The fuselage ({:.0} mm) is {:.1} times the wing span ({:.0} mm); \
                     usual is at most {MAX_USUAL_FUSELAGE_PER_SPAN}: check fuselage.length.",
                    1000.0 * f.length_m,
                    f.length_m / wing.span_m,
                    1000.0 * wing.span_m
                ),
            ));
        }
    }
    if let Some(s) = &aircraft.stabiliser {
        let arm = (s.surface.root_le_x_m - aircraft.wing.root_le_x_m).abs();
        if arm > MAX_USUAL_TAIL_ARM_PER_SPAN * wing.span_m {
            out.push(Caution::new(
                Level::Warning,
                "proportions-unusual",
                format!(
                    "The stabiliser is {:.0} mm from the wing, {:.1} times the wing span \
                     ({:.0} mm); usual is at most {MAX_USUAL_TAIL_ARM_PER_SPAN}: check \
                     stabiliser.x.",
                    1000.0 * arm,
                    arm / wing.span_m,
                    1000.0 * wing.span_m
                ),
            ));
        }
    }
}
