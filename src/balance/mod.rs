//! Mass and balance: total mass, centre of gravity, ballast to move the CG, and the CG found by
//! weighing on two or three supports.
//!
//! These are the moment balances of statics, sum(m x) / sum(m); the ballast mass follows from
//! putting the new CG at the target: m_b = M (x_t - x_cg) / (x_b - x_t). The weighing
//! procedure is the usual one of weight-and-balance practice (FAA, *Aircraft Weight and Balance
//! Handbook*, FAA-H-8083-1, ch. 2-3): the CG is the reading-weighted mean of the support
//! positions.

use crate::model::{BallastBay, MassItem};
use thiserror::Error;

/// Total mass and centre of gravity of a list of items.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MassSummary {
    /// Total mass, kg.
    pub total_kg: f64,
    /// x of the CG, m aft of the datum.
    pub cg_x_m: f64,
    /// z of the CG, m, when every item has a z.
    pub cg_z_m: Option<f64>,
}

/// Errors of the balance computations.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum BalanceError {
    /// The items have no mass.
    #[error("the total mass is {total_kg} kg; it must be above zero")]
    NoMass {
        /// The total found, kg.
        total_kg: f64,
    },
    /// A weighing needs at least two supports with readings adding to more than zero.
    #[error("a weighing needs 2 or 3 supports with readings adding up to more than zero (got {supports} supports, {total_kg} kg)")]
    BadWeighing {
        /// Number of supports given.
        supports: usize,
        /// Sum of readings, kg.
        total_kg: f64,
    },
}

/// Total mass and CG of `items`.
pub fn mass_summary(items: &[MassItem]) -> Result<MassSummary, BalanceError> {
    let total_kg: f64 = items.iter().map(|m| m.mass_kg).sum();
    if total_kg <= 0.0 || !total_kg.is_finite() {
        return Err(BalanceError::NoMass { total_kg });
    }
    let cg_x_m = items.iter().map(|m| m.mass_kg * m.x_m).sum::<f64>() / total_kg;
    let cg_z_m = items
        .iter()
        .map(|m| m.z_m.map(|z| m.mass_kg * z))
        .sum::<Option<f64>>()
        .map(|s| s / total_kg);
    Ok(MassSummary {
        total_kg,
        cg_x_m,
        cg_z_m,
    })
}

/// The summary after adding `mass_kg` at (`x_m`, `z_m`).
pub fn with_added_mass(m: &MassSummary, mass_kg: f64, x_m: f64, z_m: Option<f64>) -> MassSummary {
    let total_kg = m.total_kg + mass_kg;
    MassSummary {
        total_kg,
        cg_x_m: (m.total_kg * m.cg_x_m + mass_kg * x_m) / total_kg,
        cg_z_m: match (m.cg_z_m, z_m) {
            (Some(zc), Some(z)) => Some((m.total_kg * zc + mass_kg * z) / total_kg),
            _ => None,
        },
    }
}

/// What a ballast bay can do for a target CG.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum BallastOutcome {
    /// The CG is already at the target (within 0.5 mm), or forward of it with the bay unable
    /// to move it aft to the target (more static margin than the target): nothing to add.
    NotNeeded,
    /// This much ballast puts the CG on the target, within the bay's limit.
    Reachable {
        /// Ballast to add, kg.
        mass_kg: f64,
    },
    /// The target needs more than the bay holds.
    ExceedsBay {
        /// Ballast needed, kg.
        needed_kg: f64,
        /// What the bay holds, kg.
        max_kg: f64,
    },
    /// The bay is on the wrong side of the target: adding mass there moves the CG away from it.
    WrongSide,
}

/// Ballast in `bay` that moves the CG of `m` to `target_x_m`.
pub fn ballast_for_target(m: &MassSummary, bay: &BallastBay, target_x_m: f64) -> BallastOutcome {
    let shift = target_x_m - m.cg_x_m;
    if shift.abs() < 5e-4 {
        return BallastOutcome::NotNeeded;
    }
    let lever = bay.x_m - target_x_m;
    // Mass at the bay pulls the CG toward the bay: the bay must lie beyond the target,
    // seen from the present CG.
    if lever == 0.0 || lever.signum() != shift.signum() {
        // A CG forward of the target already has more static margin than asked for: the
        // target is a least margin, so a bay that could only move the CG forward has nothing
        // to do (common practice: a nose-heavy model is the safe side).
        if shift > 0.0 {
            return BallastOutcome::NotNeeded;
        }
        return BallastOutcome::WrongSide;
    }
    let needed_kg = m.total_kg * shift / lever;
    if needed_kg <= bay.max_mass_kg {
        BallastOutcome::Reachable { mass_kg: needed_kg }
    } else {
        BallastOutcome::ExceedsBay {
            needed_kg,
            max_kg: bay.max_mass_kg,
        }
    }
}

pub use crate::model::WeighingSupport as Support;

/// Mass and CG from a weighing on two or three supports.
pub fn weighing(supports: &[Support]) -> Result<MassSummary, BalanceError> {
    let total_kg: f64 = supports.iter().map(|s| s.reading_kg).sum();
    if !(2..=3).contains(&supports.len()) || total_kg <= 0.0 || !total_kg.is_finite() {
        return Err(BalanceError::BadWeighing {
            supports: supports.len(),
            total_kg,
        });
    }
    Ok(MassSummary {
        total_kg,
        cg_x_m: supports.iter().map(|s| s.reading_kg * s.x_m).sum::<f64>() / total_kg,
        cg_z_m: None,
    })
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn item(mass_kg: f64, x_m: f64) -> MassItem {
        MassItem {
            name: "x".into(),
            mass_kg,
            x_m,
            z_m: Some(0.0),
            tolerance: Default::default(),
        }
    }

    #[test]
    fn ballast_puts_cg_on_target() {
        let m = mass_summary(&[item(1.0, 0.10), item(0.5, 0.20)]).unwrap();
        let bay = BallastBay {
            name: "nose".into(),
            x_m: -0.2,
            z_m: None,
            max_mass_kg: 1.0,
        };
        let BallastOutcome::Reachable { mass_kg } = ballast_for_target(&m, &bay, 0.10) else {
            panic!("expected reachable");
        };
        let after = with_added_mass(&m, mass_kg, bay.x_m, None);
        assert_relative_eq!(after.cg_x_m, 0.10, epsilon = 1e-12);
    }

    #[test]
    fn tail_bay_cannot_move_cg_forward() {
        let m = mass_summary(&[item(1.0, 0.10)]).unwrap();
        let bay = BallastBay {
            name: "tail".into(),
            x_m: 1.0,
            z_m: None,
            max_mass_kg: 1.0,
        };
        assert_eq!(
            ballast_for_target(&m, &bay, 0.05),
            BallastOutcome::WrongSide
        );
    }
}
