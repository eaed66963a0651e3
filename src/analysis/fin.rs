//! The lateral note of a fin or V-tail: side area, arm and vertical tail volume coefficient
//! (Raymer, *Aircraft Design: A Conceptual Approach*, sec. 6.4); no pitch figure reads it.

use crate::caution::Caution;
use crate::finding::InputFinding;
use crate::model::Aircraft;
use crate::planform;
use crate::planform::PlanformGeometry;

/// Lowest and highest vertical tail volume coefficients of the table of typical values for
/// each class of aircraft in Raymer, *Aircraft Design: A Conceptual Approach*, Table 6.4
/// (0.02 for sailplanes to 0.09 for jet transports; homebuilts 0.04; table number from
/// memory). A fin outside this range gets a note; nothing in the pitch figures depends on it.
pub const FIN_VOLUME_RANGE: (f64, f64) = (0.02, 0.09);

/// The lateral note of a fin or V-tail: its side area, arm and vertical tail volume
/// coefficient. It does not enter any pitch figure.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FinFigures {
    /// Side area, m^2 (a fin's own area; a V-tail's area in its plane times sin^2 of the
    /// dihedral).
    pub side_area_m2: f64,
    /// From the wing's MAC quarter chord to the fin's (or the V-tail's), m.
    pub arm_m: f64,
    /// V_v = S_v l_v / (S b).
    pub volume_coefficient: f64,
}

/// A fin, a V-tail, or both.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FinNote {
    /// The `[fin]` of the file, if any.
    pub fin: Option<FinFigures>,
    /// The V-tail's side projection, when the stabiliser is a V-tail.
    pub vee_tail: Option<FinFigures>,
}

/// The fin note of `aircraft` (None without a fin or a V-tail), with a note when a fin's
/// volume coefficient lies outside [`FIN_VOLUME_RANGE`] on an aircraft without a V-tail.
pub(super) fn fin_note(
    aircraft: &Aircraft,
    wing: &PlanformGeometry,
    cautions: &mut Vec<Caution>,
) -> Option<FinNote> {
    let fin = aircraft.fin.as_ref().map(|f| {
        let g = planform::fin_geometry(f);
        let arm_m = g.mac_quarter_x_m() - wing.mac_quarter_x_m();
        FinFigures {
            side_area_m2: g.area_m2,
            arm_m,
            volume_coefficient: planform::fin_volume_coefficient(wing, g.area_m2, arm_m),
        }
    });
    let vee_tail = aircraft
        .stabiliser
        .as_ref()
        .filter(|s| planform::is_vee_tail(&s.surface))
        .map(|s| {
            let side = planform::side_area_m2(&s.surface);
            let arm_m = planform::geometry(&s.surface).mac_quarter_x_m() - wing.mac_quarter_x_m();
            FinFigures {
                side_area_m2: side,
                arm_m,
                volume_coefficient: planform::fin_volume_coefficient(wing, side, arm_m),
            }
        });
    if let (Some(f), None) = (fin, vee_tail) {
        let (lo, hi) = FIN_VOLUME_RANGE;
        let v = f.volume_coefficient;
        if f.arm_m.is_finite() && f.arm_m <= 0.0 {
            // A fin at or ahead of the wing destabilises in yaw: most likely a position typed
            // from another datum or in another unit.
            cautions.push(Caution::of(
                InputFinding::FinAheadOfWing { ahead_m: -f.arm_m }.into(),
            ));
        } else if v.is_finite() && !(lo..=hi).contains(&v) {
            cautions.push(Caution::of(
                InputFinding::FinVolumeOutsideRange {
                    volume_coefficient: v,
                    range: (lo, hi),
                }
                .into(),
            ));
        }
    }
    if let Some((f, item)) = aircraft.fin.as_ref().and_then(|f| {
        let name = f.mass_item.as_ref()?;
        Some((f, aircraft.masses.iter().find(|m| &m.name == name)?))
    }) {
        // The fin's extent along x: root leading edge to the further trailing edge.
        let tip_le = f.root_le_x_m + f.height_m * f.sweep_le_rad.tan();
        let (x0, x1) = (
            f.root_le_x_m.min(tip_le),
            (f.root_le_x_m + f.root_chord_m).max(tip_le + f.tip_chord_m),
        );
        if item.x_m < x0 || item.x_m > x1 {
            cautions.push(Caution::of(
                InputFinding::FinMassAwayFromFin {
                    item: item.name.clone(),
                    item_x_m: item.x_m,
                    fin_x_m: (x0, x1),
                }
                .into(),
            ));
        }
    }
    (fin.is_some() || vee_tail.is_some()).then_some(FinNote { fin, vee_tail })
}
