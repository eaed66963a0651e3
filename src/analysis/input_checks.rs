//! The cautions on the inputs and the air: weighing against the mass list, vertical CG
//! partly given, low Reynolds numbers.

use super::{AnalysisError, LOW_REYNOLDS_NOTE, WEIGHING_CG_TOLERANCE_M, WEIGHING_MASS_TOLERANCE};
use crate::atmosphere::AirState;
use crate::balance::MassSummary;
use crate::caution::Caution;
use crate::finding::InputFinding;
use crate::model::Aircraft;
use crate::{balance, planform};

/// The note `vertical-cg-partial` when some but not all masses have a height.
pub(super) fn vertical_cg_partial_caution(aircraft: &Aircraft, cautions: &mut Vec<Caution>) {
    let with_z = aircraft.masses.iter().filter(|m| m.z_m.is_some()).count();
    if with_z > 0 && with_z < aircraft.masses.len() {
        cautions.push(Caution::of(
            InputFinding::VerticalCgPartial {
                with_height: with_z,
                masses: aircraft.masses.len(),
            }
            .into(),
        ));
    }
}

/// The Reynolds-number cautions on the MAC at `speed_m_s` and near the tip (at
/// `TIP_REYNOLDS_STATION` of the half span) at the stall speed `stall_speed_m_s`.
pub(super) fn tip_reynolds_caution(
    aircraft: &Aircraft,
    air: &AirState,
    reynolds_mac: f64,
    speed_m_s: f64,
    stall_speed_m_s: f64,
    cautions: &mut Vec<Caution>,
) {
    let tip_chord_m = planform::station_at(
        &aircraft.wing,
        TIP_REYNOLDS_STATION * planform::half_span_length_m(&aircraft.wing),
    )
    .chord_m;
    reynolds_caution(
        reynolds_mac,
        speed_m_s,
        air.reynolds(stall_speed_m_s, tip_chord_m),
        tip_chord_m,
        stall_speed_m_s,
        cautions,
    );
}

pub(super) fn weighing_caution(w: &MassSummary, mass: &MassSummary, cautions: &mut Vec<Caution>) {
    let dx_m = w.cg_x_m - mass.cg_x_m;
    let dm = (w.total_kg - mass.total_kg) / mass.total_kg;
    if dx_m.abs() > WEIGHING_CG_TOLERANCE_M || dm.abs() > WEIGHING_MASS_TOLERANCE {
        cautions.push(Caution::of(
            InputFinding::WeighingDiffers {
                weighed_cg_x_m: w.cg_x_m,
                weighed_kg: w.total_kg,
                listed_cg_x_m: mass.cg_x_m,
                listed_kg: mass.total_kg,
            }
            .into(),
        ));
    }
}

/// Fraction of the semispan where the wing's tip Reynolds number is taken (95 %: the outer
/// sections that stall a tip; the very tip of an elliptic wing has no chord).
pub const TIP_REYNOLDS_STATION: f64 = 0.95;

/// The Reynolds caution: the wing's mean chord at `speed` (trim, or stall when there is no
/// trim), and its tip (chord `tip_chord_m`) at the stall speed, where a tip stall starts.
pub(super) fn reynolds_caution(
    reynolds_mac: f64,
    speed: f64,
    reynolds_tip_at_stall: f64,
    tip_chord_m: f64,
    stall_speed: f64,
    cautions: &mut Vec<Caution>,
) {
    if reynolds_mac.min(reynolds_tip_at_stall) >= LOW_REYNOLDS_NOTE {
        return;
    }
    cautions.push(Caution::of(
        InputFinding::ReynoldsLow {
            reynolds_mac,
            speed_m_s: speed,
            reynolds_tip_at_stall,
            tip_chord_m,
            tip_station: TIP_REYNOLDS_STATION,
            stall_speed_m_s: stall_speed,
        }
        .into(),
    ));
}

/// The mass and CG from the file's weighing, if it has one, with the caution comparing it
/// with the listed masses.
pub(super) fn weighing_if_any(
    aircraft: &Aircraft,
    mass: &MassSummary,
    cautions: &mut Vec<Caution>,
) -> Result<Option<MassSummary>, AnalysisError> {
    let weighed = if aircraft.weighing.is_empty() {
        None
    } else {
        Some(balance::weighing(&aircraft.weighing)?)
    };
    if let Some(w) = &weighed {
        weighing_caution(w, mass, cautions);
    }
    Ok(weighed)
}
