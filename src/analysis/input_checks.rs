//! The cautions on the inputs and the air: weighing against the mass list, vertical CG
//! partly given, low Reynolds numbers.

use super::{
    AnalysisError, LOW_REYNOLDS_NOTE, LOW_REYNOLDS_WARNING, WEIGHING_CG_TOLERANCE_M,
    WEIGHING_MASS_TOLERANCE,
};
use crate::atmosphere::AirState;
use crate::balance::MassSummary;
use crate::caution::{Caution, Level};
use crate::model::Aircraft;
use crate::{balance, planform};

/// The note `vertical-cg-partial` when some but not all masses have a height.
pub(super) fn vertical_cg_partial_caution(aircraft: &Aircraft, cautions: &mut Vec<Caution>) {
    let with_z = aircraft.masses.iter().filter(|m| m.z_m.is_some()).count();
    if with_z > 0 && with_z < aircraft.masses.len() {
        cautions.push(Caution::new(
            Level::Note,
            "vertical-cg-partial",
            format!(
                "{with_z} of the {} masses have a height (z); the vertical CG needs all of them, so it is \
                 not used and moments are taken at the wing root's height. Give every mass a z to use it.",
                aircraft.masses.len()
            ),
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
    use crate::output::cautions::reynolds_text;
    let worst = reynolds_mac.min(reynolds_tip_at_stall);
    let level = if worst < LOW_REYNOLDS_WARNING {
        Level::Warning
    } else if worst < LOW_REYNOLDS_NOTE {
        Level::Note
    } else {
        return;
    };
    let effect = if worst < LOW_REYNOLDS_WARNING {
        "airfoils lose lift and gain drag sharply below about 50,000, so expect a higher stall \
         speed, an earlier tip stall and a poorer glide than estimated"
    } else {
        "below about 100,000 section data and cl_max are uncertain; choose airfoils made for low \
         Reynolds numbers"
    };
    cautions.push(Caution::new(
        level,
        "reynolds-low",
        format!(
            "Reynolds number on the wing's mean chord at {speed:.1} m/s is {}; at the tip ({:.0} mm \
             chord, {:.0} % of the semispan) at the stall speed {stall_speed:.1} m/s it is {}: {effect}.",
            reynolds_text(reynolds_mac),
            tip_chord_m * 1000.0,
            100.0 * TIP_REYNOLDS_STATION,
            reynolds_text(reynolds_tip_at_stall),
        ),
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
