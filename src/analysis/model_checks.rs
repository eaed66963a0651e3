//! The cautions that only the full model can raise: stall order along the span, elevator
//! authority, tail stall, tailless trim, and the full model against the closed form.

use super::{CgBand, Headline, CG_BAND_ALLOWANCE_M};
use crate::caution::Caution;
use crate::finding::{Control, ElevonTrim, ModelFinding, TailStall};
use crate::model::{Aircraft, StabiliserRole};
use crate::stability::classical::ClassicalEstimate;
use crate::stability::trim;

/// Difference between the lifting-line and closed-form neutral points above which a note
/// explains it, fraction of MAC (a judgement: the two agree within a few percent on
/// conventional high-aspect-ratio models).
pub const MODELS_DISAGREE: f64 = 0.05;

/// Stall beginning outboard of this fraction of the semispan is "tip first" (common practice:
/// outboard of mid-semispan a stall drops a wing).
pub const TIP_STALL_PERCENT_SEMISPAN: f64 = 50.0;

/// A washout change larger than this is not suggested (the file accepts twist within 15 deg;
/// a change this large means the planform or the sections must change instead).
pub const MAX_USEFUL_WASHOUT_CHANGE_DEG: f64 = 10.0;

#[allow(clippy::too_many_arguments)]
pub(super) fn full_model_cautions(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    h: &Headline,
    est: &ClassicalEstimate,
    mac_m: f64,
    cg_x_m: f64,
    band: &CgBand,
    cautions: &mut Vec<Caution>,
) {
    let room_forward = cg_x_m > band.forward_x_m + CG_BAND_ALLOWANCE_M;
    stall_order_caution(aircraft, f, h, room_forward, cautions);
    elevator_authority_caution(aircraft, f, cautions);
    tail_stall_in_range_caution(f, cautions);
    if let Some(t) = &f.tailless {
        tailless_trim_caution(aircraft, t, cg_x_m, band.aft_x_m, cautions);
    }
    models_disagree_note(aircraft, f, est, mac_m, cautions);
}

/// The caution on which surface stalls first and where: `tail-stalls-first` (downwards at
/// cl_min, or at cl_max), `canard-stall-order` or `tip-stall`.
/// `room_forward`: the band leaves room to move the CG forward (a canard's remedy).
pub(super) fn stall_order_caution(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    h: &Headline,
    room_forward: bool,
    cautions: &mut Vec<Caution>,
) {
    let Some(loc) = &h.stall_location else {
        return;
    };
    let percent_semispan = loc.percent_semispan;
    let role = aircraft.stabiliser.as_ref().map(|s| s.role);
    // Whether the tail carries an upload at the stall: then a forward CG relieves it.
    let tail_uploaded = f
        .stall
        .as_ref()
        .and_then(|s| s.result.surfaces.get(1))
        .is_some_and(|s| s.cl > 0.0);
    let negative = f.stall.as_ref().and_then(|s| match s.limit {
        trim::StallLimit::StabiliserClMin {
            speed_otherwise_m_s,
            ..
        } => Some((s.speed_m_s, speed_otherwise_m_s)),
        trim::StallLimit::ClMax => None,
    });
    let tail_stalls_first = |stall| ModelFinding::TailStallsFirst {
        percent_semispan,
        stall,
    };
    let finding = match (loc.surface, role) {
        (1, _) if negative.is_some() => {
            let (speed_m_s, wing_stall_speed_m_s) = negative.unwrap_or_default();
            tail_stalls_first(TailStall::Downwards {
                role: role.unwrap_or(StabiliserRole::Tail),
                speed_m_s,
                wing_stall_speed_m_s,
            })
        }
        (0, Some(StabiliserRole::Canard)) => ModelFinding::CanardStallOrder {
            percent_semispan,
            room_forward,
        },
        (0, _) if percent_semispan > TIP_STALL_PERCENT_SEMISPAN => {
            ModelFinding::TipStall { percent_semispan }
        }
        (1, Some(StabiliserRole::Tail)) => tail_stalls_first(TailStall::AtClMax {
            unstable: h.static_margin <= 0.0,
            tail_uploaded,
        }),
        _ => return,
    };
    cautions.push(Caution::of(finding.into()));
}

/// The warning `elevator-authority` at the first speed of the elevator schedule that needs more
/// pitch-control throw than the aircraft has.
pub(super) fn elevator_authority_caution(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    cautions: &mut Vec<Caution>,
) {
    let Some(s) = aircraft.pitch_control() else {
        return;
    };
    if let Some(p) = f.elevator_schedule.iter().find(|p| !p.within_limits) {
        let available_rad = if p.elevator_rad < 0.0 {
            s.max_up_rad
        } else {
            s.max_down_rad
        };
        cautions.push(Caution::of(
            ModelFinding::ElevatorAuthority {
                speed_m_s: p.speed_m_s,
                elevator_rad: p.elevator_rad,
                available_rad,
                control: Control::of(aircraft),
            }
            .into(),
        ));
    }
}

/// The warning `tail-stall-in-range` at the first speed of the elevator schedule where the
/// tailplane is at its negative cl limit.
pub(super) fn tail_stall_in_range_caution(f: &trim::FullStability, cautions: &mut Vec<Caution>) {
    if let Some(p) = f.elevator_schedule.iter().find(|p| p.stabiliser_at_cl_min) {
        cautions.push(Caution::of(
            ModelFinding::TailStallInRange {
                speed_m_s: p.speed_m_s,
                elevator_rad: p.elevator_rad,
            }
            .into(),
        ));
    }
}

/// The caution `tailless-trim` when nothing trims the wing at its design CL with the elevons
/// neutral: a note when the elevons trim it within their throws, a danger or warning with the
/// remedies otherwise.
pub(super) fn tailless_trim_caution(
    aircraft: &Aircraft,
    t: &trim::TaillessCheck,
    cg_x_m: f64,
    band_aft_x_m: f64,
    cautions: &mut Vec<Caution>,
) {
    let untrimmed = t.cm_zero_lift <= 0.0 || t.cm_at_design < -1e-4;
    if !untrimmed {
        return;
    }
    let elevons = match (
        t.elevon_within_throws,
        aircraft.elevons,
        t.elevon_to_trim_rad,
    ) {
        (true, _, Some(deflection_rad)) => ElevonTrim::Within { deflection_rad },
        (false, Some(_), Some(deflection_rad)) => ElevonTrim::Beyond { deflection_rad },
        (_, Some(_), None) => ElevonTrim::Cannot,
        _ => ElevonTrim::NoElevons,
    };
    // A washout change larger than the useful one is not suggested.
    let washout_change_rad = t
        .washout_change_rad
        .filter(|w| w.to_degrees().abs() <= MAX_USEFUL_WASHOUT_CHANGE_DEG);
    // At zero lift the moment about the CG is a pure couple: moving the CG cannot make it
    // positive, so a CG further aft only helps when it already is, and only while the CG is
    // still ahead of the band's aft end.
    let cg_aft_helps = cg_x_m < band_aft_x_m - super::CG_BAND_ALLOWANCE_M && t.cm_zero_lift > 0.0;
    cautions.push(Caution::of(
        ModelFinding::TaillessTrim {
            design_cl: t.design_cl,
            cm_at_design: t.cm_at_design,
            cm_zero_lift: t.cm_zero_lift,
            elevons,
            washout_change_rad,
            reflex_cm_change: t.reflex_cm_change,
            cg_aft_helps,
        }
        .into(),
    ));
}

/// The note `models-disagree` when the full model's and the closed form's neutral points
/// differ by more than `MODELS_DISAGREE` of the MAC `mac_m`.
pub(super) fn models_disagree_note(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    est: &ClassicalEstimate,
    mac_m: f64,
    cautions: &mut Vec<Caution>,
) {
    let diff = (f.neutral_point_x_m - est.neutral_point_x_m) / mac_m;
    if diff.abs() > MODELS_DISAGREE {
        cautions.push(Caution::of(
            ModelFinding::ModelsDisagree {
                wing_model: aircraft.numerics.wing_model,
                has_stabiliser: aircraft.stabiliser.is_some(),
                neutral_point_x_m: f.neutral_point_x_m,
                closed_form_neutral_point_x_m: est.neutral_point_x_m,
                mac_m,
                closed_form_band_aft_x_m: est.neutral_point_x_m
                    - aircraft.margin_limits.min_static_margin * mac_m,
            }
            .into(),
        ));
    }
}
