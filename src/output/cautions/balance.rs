//! The words of the balance and trim findings.

use crate::analysis::{AftLimit, CgBand, ForwardLimit};
use crate::finding::{BalanceFinding, Control, FasterTrim};

use super::{control_name, nose_up_control};

/// The sentence of `f` (lengths in mm from the datum).
pub(super) fn message(f: &BalanceFinding) -> String {
    use BalanceFinding::*;
    match *f {
        StaticMarginNegative {
            cg_behind_neutral_point_m,
            static_margin,
        } => format!(
            "The CG is {:.0} mm behind the neutral point (static margin {:.1} %): the aircraft is \
             unstable in pitch and will not fly as balanced. Move the CG forward or add nose weight.",
            cg_behind_neutral_point_m * 1000.0,
            100.0 * static_margin
        ),
        StaticMarginLow { static_margin } => format!(
            "Static margin is only {:.1} % of the mean chord: pitch will be sensitive and an error in \
             the estimate could make it unstable. Models usually fly with 5 to 15 %.",
            100.0 * static_margin
        ),
        CgBehindNeutralPointRange {
            cg_x_m,
            limit_x_m,
            neutral_point_x_m,
            closed_form,
            band_aft_x_m,
        } => behind_range_message(cg_x_m, limit_x_m, neutral_point_x_m, closed_form, band_aft_x_m),
        CgAftOfBand { cg_x_m, band } => format!(
            "The CG is {:.0} mm aft of the recommended band ({:.0} to {:.0} mm from the datum){}.",
            (cg_x_m - band.aft_x_m) * 1000.0,
            band.forward_x_m * 1000.0,
            band.aft_x_m * 1000.0,
            match band.aft_limit {
                AftLimit::NeutralPointRange => {
                    ", whose aft end keeps the smallest static margin even if the neutral \
                     point lies at the forward end of its uncertainty range"
                }
                AftLimit::StaticMargin => "",
            }
        ),
        CgForwardOfBand {
            cg_x_m,
            band,
            control,
        } => forward_of_band_message(cg_x_m, &band, control),
        CgAftOfUncertainLimit {
            cg_x_m,
            cg_spread_m,
            neutral_point_spread_m,
            band_forward_x_m,
            band_aft_x_m,
            ..
        } => uncertain_limit_message(
            cg_x_m,
            cg_spread_m,
            neutral_point_spread_m,
            band_forward_x_m,
            band_aft_x_m,
        ),
        CgBandEmpty {
            aft_x_m,
            min_static_margin,
            control,
        } => {
            let control = control_name(control);
            format!(
                "Full up {control} cannot hold the wing at its stall even with the CG at the aft end \
                 of the recommended range ({:.0} mm from the datum, static margin {:.0} %): there is no \
                 usable CG range. Give the {control} more throw or more chord before flying.",
                aft_x_m * 1000.0,
                100.0 * min_static_margin
            )
        }
        TrimBeyondStall { .. }
        | TrimNearStall { .. }
        | TargetSpeedNearStall { .. }
        | NoTrim { .. }
        | BandDefaults { .. } => {
            trim_message(f)
        }
    }
}

/// What to change to trim faster (with the fixed incidences, a CG further forward trims at a
/// lower CL: CL_trim = Cm0 about the neutral point / static margin, Etkin & Reid, sec. 2.3).
fn faster_text(f: FasterTrim) -> String {
    let rigging = if f.has_stabiliser {
        "Reduce the decalage (stabiliser incidence closer to the wing's)"
    } else {
        "Reduce the washout or reflex"
    };
    if f.room_forward {
        format!(
            "{rigging}, or move the CG forward within the recommended band: nose weight makes it \
             trim faster."
        )
    } else {
        format!("{rigging}: the CG is already at or ahead of the recommended band.")
    }
}

/// The sentence of `cg-aft-of-uncertain-limit` (two-sigma spreads, lengths m).
fn uncertain_limit_message(
    cg_x_m: f64,
    cg_spread_m: f64,
    neutral_point_spread_m: f64,
    band_forward_x_m: f64,
    band_aft_x_m: f64,
) -> String {
    let limit = band_aft_x_m;
    let cg_aft_end = cg_x_m + cg_spread_m;
    let balance_at = limit - cg_spread_m;
    let advice = if balance_at >= band_forward_x_m {
        format!(
            "For the first flights balance at {:.1} mm or further forward.",
            1000.0 * balance_at
        )
    } else {
        // The advice would leave the band: the uncertainties are too large for any CG in it
        // to be safely ahead of the limit.
        format!(
            "No CG in the recommended band keeps the whole uncertain range ahead of that \
             limit: weigh the items and measure their positions again to narrow the \
             tolerances, and meanwhile balance at the band's forward end ({:.1} mm) and \
             test-glide with care.",
            1000.0 * band_forward_x_m
        )
    };
    let limit_text = if neutral_point_spread_m > 0.0 {
        format!(
            "the band's aft end, {:.1} mm, which keeps the smallest margin from the forward \
             end of the neutral point's uncertainty range ({:.0} mm ahead of the computed \
             point: two standard deviations from common-practice spreads of tail \
             efficiency, downwash, fuselage, section lift slopes and the wing's \
             aerodynamic centre)",
            1000.0 * limit,
            1000.0 * neutral_point_spread_m
        )
    } else {
        format!("the band's aft end, {:.1} mm", 1000.0 * limit)
    };
    format!(
        "The CG ({:.1} mm) is {}, but with two standard deviations of the builder's \
         own mass and position tolerances it may lie as far aft as {:.1} mm, {:.1} mm \
         aft of {limit_text}. {advice}",
        1000.0 * cg_x_m,
        if cg_x_m > limit {
            "on the aft end of the recommended band"
        } else {
            "inside the recommended band"
        },
        1000.0 * cg_aft_end,
        1000.0 * (cg_aft_end - limit),
    )
}

/// The sentence of `cg-behind-neutral-point-range` (lengths m).
fn behind_range_message(
    cg_x_m: f64,
    limit_x_m: f64,
    neutral_point_x_m: f64,
    closed_form: bool,
    band_aft_x_m: f64,
) -> String {
    let which = if closed_form {
        format!(
            "the closed-form neutral point ({:.1} mm), which lies ahead of the computed {:.1} mm",
            1000.0 * limit_x_m,
            1000.0 * neutral_point_x_m
        )
    } else {
        format!(
            "the forward end of the neutral point's uncertainty range ({:.1} mm, two standard \
                     deviations of the inputs known least well ahead of the computed {:.1} mm)",
            1000.0 * limit_x_m,
            1000.0 * neutral_point_x_m
        )
    };
    format!(
        "The CG ({:.1} mm) is {:.1} mm behind {which}: if the neutral point lies there, the \
                 aircraft is neutral or unstable in pitch as balanced. Move the CG forward to the \
                 recommended band's aft end ({:.1} mm) or ahead of it before any flight.",
        1000.0 * cg_x_m,
        1000.0 * (cg_x_m - limit_x_m),
        1000.0 * band_aft_x_m
    )
}

/// The sentence of `cg-forward-of-band`, with why the forward limit is where it is.
fn forward_of_band_message(cg_x_m: f64, band: &CgBand, control: Control) -> String {
    let why = match band.forward_limit {
                ForwardLimit::ElevatorAuthority => format!(
                    "further forward, full up {} can no longer hold the wing at its stall, so the \
                     model cannot be flared or slowed properly",
                    control_name(control)
                ),
                ForwardLimit::TailStall => "further forward, the tailplane reaches its negative stall \
                     (its download at cl_min) before the wing stalls, and pitch control is lost when \
                     slowing down"
                    .to_string(),
                ForwardLimit::StaticMargin => format!(
                    "the aircraft will be nose-heavy, need more {} and fly faster",
                    nose_up_control(control)
                ),
            };
    format!(
                "The CG is {:.0} mm forward of the recommended band ({:.0} to {:.0} mm from the datum): {why}.",
                (band.forward_x_m - cg_x_m) * 1000.0,
                band.forward_x_m * 1000.0,
                band.aft_x_m * 1000.0
            )
}

/// The sentences of the trim findings and of `band-defaults`.
fn trim_message(f: &BalanceFinding) -> String {
    use BalanceFinding::*;
    match *f {
        TrimBeyondStall { cl, cl_max, faster } => format!(
            "The aircraft trims at CL {cl:.2}, above its CL max of {cl_max:.2}: as balanced it would fly \
             stalled. {}",
            faster_text(faster)
        ),
        TrimNearStall {
            speed_m_s,
            stall_speed_m_s,
            faster,
        } => format!(
            "Trim speed {speed_m_s:.1} m/s is within 20 % of the stall speed {stall_speed_m_s:.1} m/s: \
             little margin against a stall in gusts or turns. {}",
            faster_text(faster)
        ),
        TargetSpeedNearStall {
            target_speed_m_s,
            stall_speed_m_s,
            factor,
            has_stabiliser,
        } => {
            let what = if target_speed_m_s < stall_speed_m_s {
                "below the stall speed"
            } else {
                "too close to the stall speed"
            };
            format!(
                "The target trim speed {target_speed_m_s:.1} m/s is {what} {stall_speed_m_s:.1} \
                 m/s: the {} solved for it would trim the aircraft {}. Choose a \
                 target of at least {:.1} m/s ({factor} times the stall speed).",
                if has_stabiliser {
                    "decalage and CG"
                } else {
                    "CG"
                },
                if target_speed_m_s < stall_speed_m_s {
                    "stalled"
                } else {
                    "with little margin against a stall in gusts or turns"
                },
                factor * stall_speed_m_s
            )
        }
        NoTrim { has_stabiliser } => if has_stabiliser {
            "No trimmed flight at positive lift was found with this CG and these incidences: \
             check the decalage (stabiliser incidence) and the CG."
        } else {
            "No trimmed flight at positive lift was found with this CG: check the washout, the \
             reflex of the airfoils (or the elevons' trim) and the CG."
        }
        .to_string(),
        BandDefaults {
            min_static_margin,
            max_static_margin,
            mac_m,
        } => format!(
            "The recommended CG band uses common-practice static margins of {:.0} to {:.0} % of the \
             {:.0} mm mean chord; set [limits] in the file to use your own.",
            100.0 * min_static_margin,
            100.0 * max_static_margin,
            mac_m * 1000.0
        ),
        // The others are worded by `message`.
        _ => message(f),
    }
}
