//! The words of the findings on the inputs and on how the analysis ran.

use crate::analysis::LOW_REYNOLDS_WARNING;
use crate::finding::{InputFinding, MarginSetting};
use crate::model::StabiliserRole;

use super::reynolds_text;

/// The sentence of `f` (lengths in mm, masses in g).
pub(super) fn message(f: &InputFinding) -> String {
    use InputFinding::*;
    match f {
        VerticalCgPartial {
            with_height,
            masses,
        } => format!(
            "{with_height} of the {masses} masses have a height (z); the vertical CG needs all of them, so it is \
             not used and moments are taken at the wing root's height. Give every mass a z to use it."
        ),
        WeighingDiffers {
            weighed_cg_x_m,
            weighed_kg,
            listed_cg_x_m,
            listed_kg,
        } => {
            let dx_mm = (weighed_cg_x_m - listed_cg_x_m) * 1000.0;
            let dm_pct = 100.0 * (weighed_kg - listed_kg) / listed_kg;
            format!(
                "The weighing puts the CG at {:.0} mm and the mass at {:.0} g; the mass list gives {:.0} mm \
                 and {:.0} g ({dx_mm:+.0} mm, {dm_pct:+.1} %). Trust the scales: correct the mass list \
                 (a forgotten item, a wrong position) before relying on the figures here.",
                weighed_cg_x_m * 1000.0,
                weighed_kg * 1000.0,
                listed_cg_x_m * 1000.0,
                listed_kg * 1000.0
            )
        }
        ReynoldsLow { .. } => reynolds_message(f),
        TolerancesTooLarge { cg_range_m, mac_m } => format!(
            "The mass and position tolerances spread the CG over {:.0} mm (two standard \
             deviations each way), more than the {:.0} mm mean chord: check the [tolerances] \
             and the items' own tolerances (g and mm).",
            1000.0 * cg_range_m,
            1000.0 * mac_m
        ),
        FinAheadOfWing { .. } | FinVolumeOutsideRange { .. } | FinMassAwayFromFin { .. } => {
            fin_message(f)
        }
        StaticMarginLimitNegative { .. }
        | MarginLooksLikeAFraction { .. }
        | SurfacesOverlap { .. }
        | CanardWakeOnWing { .. }
        | WingLoadingUnusual { .. }
        | FuselageLong { .. }
        | TailArmLong { .. }
        | AspectRatioUnusual { .. } => plausibility_message(f),
        LiftingLineFailed { .. }
        | SectionTooThinForPanels { .. }
        | ClMaxDefault { .. } => run_message(f),
    }
}

/// The sentence of `reynolds-low`.
fn reynolds_message(f: &InputFinding) -> String {
    let InputFinding::ReynoldsLow {
        reynolds_mac,
        speed_m_s,
        reynolds_tip_at_stall,
        tip_chord_m,
        tip_station,
        stall_speed_m_s,
    } = *f
    else {
        return message(f);
    };
    let effect = if reynolds_mac.min(reynolds_tip_at_stall) < LOW_REYNOLDS_WARNING {
        "airfoils lose lift and gain drag sharply below about 50,000, so expect a higher stall \
         speed, an earlier tip stall and a poorer glide than estimated"
    } else {
        "below about 100,000 section data and cl_max are uncertain; choose airfoils made for low \
         Reynolds numbers"
    };
    format!(
        "Reynolds number on the wing's mean chord at {speed_m_s:.1} m/s is {}; at the tip ({:.0} mm \
         chord, {:.0} % of the semispan) at the stall speed {stall_speed_m_s:.1} m/s it is {}: {effect}.",
        reynolds_text(reynolds_mac),
        tip_chord_m * 1000.0,
        100.0 * tip_station,
        reynolds_text(reynolds_tip_at_stall),
    )
}

/// The sentences of the fin findings.
fn fin_message(f: &InputFinding) -> String {
    match f {
        InputFinding::FinAheadOfWing { ahead_m } => format!(
            "The fin's quarter chord lies {:.0} mm ahead of the wing's: a fin there \
             makes the aircraft unstable in yaw. Check fin.x (measured from the datum, \
             in mm unless a unit is written).",
            1000.0 * ahead_m
        ),
        InputFinding::FinVolumeOutsideRange {
            volume_coefficient: v,
            range: (lo, hi),
        } => format!(
            "The fin's volume coefficient S_v l_v / (S b) is {v:.3}, {} the typical values \
             of {lo:.2} (sailplanes) to {hi:.2} (Raymer, Aircraft Design, table of tail volume \
             coefficients): {}. This is a lateral note only; the fin does not enter the \
             pitch figures.",
            if v < lo { "below" } else { "above" },
            if v < lo {
                "weak directional stability is possible; compare with similar aircraft \
                 that fly well"
            } else {
                "a large fin; check that it is what you meant"
            }
        ),
        InputFinding::FinMassAwayFromFin {
            item,
            item_x_m,
            fin_x_m: (x0, x1),
        } => format!(
            "The mass item `{item}`, named as the fin's mass, is at {:.0} mm, outside the fin \
             ({:.0} to {:.0} mm from the datum); check its x.",
            1000.0 * item_x_m,
            1000.0 * x0,
            1000.0 * x1
        ),
        other => message(other),
    }
}

/// The sentences of the plausibility findings.
fn plausibility_message(f: &InputFinding) -> String {
    use InputFinding::*;
    match *f {
        StaticMarginLimitNegative {
            setting,
            static_margin,
        } => format!(
            "The file asks for a negative static margin ({} {:.1} % of MAC): the CG is \
             then behind the neutral point and the aircraft is unstable in pitch. Only \
             for a design flown with a stabilising system; the recommended range and \
             ballast advice follow the file, not common practice.",
            match setting {
                MarginSetting::Target => "target",
                MarginSetting::LeastLimit => "smallest limit",
            },
            100.0 * static_margin
        ),
        MarginLooksLikeAFraction {
            setting,
            static_margin: m,
        } => format!(
            "The {} is {:.2} % of MAC, which puts the CG practically on the \
             neutral point. Margins are in percent of MAC: did you mean {:.0} %?",
            match setting {
                MarginSetting::Target => "target static margin",
                MarginSetting::LeastLimit => "smallest static margin of [limits]",
            },
            100.0 * m,
            10_000.0 * m
        ),
        SurfacesOverlap { role, y_m, gap_m } => format!(
            "The {} overlaps the wing in the top view ({:.0} mm from the centre line, \
             {:.0} mm above or below it): the two are modelled as a biplane, each in the \
             other's field. If that is not the layout, check stabiliser.x and z.",
            match role {
                StabiliserRole::Tail => "tail",
                StabiliserRole::Canard => "canard",
            },
            1000.0 * y_m,
            1000.0 * gap_m
        ),
        CanardWakeOnWing { gap_m, span_m } => format!(
            "The canard lies {:.0} mm from the wing's plane ({:.1} % of the span): its tip \
             vortices pass through the wing, which the vortex model resolves poorly this close, \
             so the wing's loading near them, the stall order and the induced drag are \
             uncertain. A height difference of a few percent of the span avoids it.",
            1000.0 * gap_m.abs(),
            100.0 * gap_m.abs() / span_m
        ),
        WingLoadingUnusual {
            loading_kg_m2,
            usual_kg_m2: (lo, hi),
        } => format!(
            "The wing loading is {loading_kg_m2:.2} kg/m^2 ({:.1} g/dm^2), outside the usual {lo} to \
             {hi} kg/m^2 of models and light aircraft: check the masses and the \
             planform (bare masses are grams, bare lengths millimetres).",
            10.0 * loading_kg_m2
        ),
        _ => proportions_message(f),
    }
}

/// The sentences of `proportions-unusual`.
fn proportions_message(f: &InputFinding) -> String {
    use InputFinding::*;
    match *f {
        FuselageLong {
            length_m,
            span_m,
            usual_max,
        } => format!(
            "The fuselage ({:.0} mm) is {:.1} times the wing span ({:.0} mm); \
             usual is at most {usual_max}: check fuselage.length.",
            1000.0 * length_m,
            length_m / span_m,
            1000.0 * span_m
        ),
        TailArmLong {
            arm_m,
            span_m,
            usual_max,
        } => format!(
            "The stabiliser is {:.0} mm from the wing, {:.1} times the wing span \
             ({:.0} mm); usual is at most {usual_max}: check stabiliser.x.",
            1000.0 * arm_m,
            arm_m / span_m,
            1000.0 * span_m
        ),
        AspectRatioUnusual {
            aspect_ratio,
            span_m,
            usual: (lo, hi),
        } => format!(
            "The wing's aspect ratio is {aspect_ratio:.1} (span {:.0} mm), outside the usual {lo} \
             to {hi} of models and light aircraft: check the span and the chords (bare lengths \
             are millimetres).",
            1000.0 * span_m
        ),
        _ => message(f),
    }
}

/// The sentences of the findings on how the analysis ran.
fn run_message(f: &InputFinding) -> String {
    use InputFinding::*;
    match f {
        LiftingLineFailed { error } => format!(
            "The lifting-line model could not be solved ({error}); the figures come from the \
             closed-form estimate only, which ignores sweep, tail height and the spanwise loading."
        ),
        SectionTooThinForPanels {
            airfoil,
            thickness,
            limit,
        } => format!(
            "Airfoil '{airfoil}' is only {:.1} % thick; the panel method loses accuracy on \
             sections thinner than {:.0} % of chord. Thin-airfoil theory (method thin) \
             suits such sections better.",
            100.0 * thickness,
            100.0 * limit
        ),
        ClMaxDefault { airfoil, default } => format!(
            "Airfoil '{airfoil}' has no cl_max; the conservative default {default:.1} is \
             assumed. Give the section's cl_max at your Reynolds number for a better \
             stall estimate."
        ),
        other => message(other),
    }
}
