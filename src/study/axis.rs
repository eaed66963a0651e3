//! What a trade study varies: the quantities, their values in SI units, and how a value
//! changes the aircraft.
//!
//! A study point is an ordinary [`Aircraft`]: the changes are applied to a copy of the base
//! aircraft, so a point can always be checked by analysing that aircraft on its own.
//! Changes are applied in a fixed order whatever the order of the axes: masses first (item
//! mass, item position, ballast, scaling of every mass), then the CG position (every item
//! moved by the same distance, which moves the CG by that distance and leaves the CG height
//! alone), then incidences.

use crate::model::{Aircraft, MassItem, StabiliserRole};
use thiserror::Error;

/// Largest incidence or decalage a study may set, rad (the aircraft file's own limit of
/// 15 deg).
pub const MAX_INCIDENCE_RAD: f64 = 15.0 * std::f64::consts::PI / 180.0;
/// Largest factor on every mass (common practice: ten times the listed mass is far beyond
/// any model's ballast range; the limit only keeps the numbers sane).
pub const MAX_MASS_SCALE: f64 = 10.0;
/// Largest distance of the CG (or an item) from the datum a study may set, m: the aircraft
/// file's own limit on positions (50,000 mm).
pub const MAX_CG_DISTANCE_M: f64 = 50.0;

/// One quantity a study can vary.
#[derive(Debug, Clone, PartialEq)]
pub enum Quantity {
    /// CG x, m aft of the datum: every mass item moved by the same distance.
    CgX,
    /// Ballast mass in the bay of this index (into `ballast_bays`), kg; zero to the bay's
    /// limit.
    Ballast(usize),
    /// Mass of the mass item of this index, kg (zero or more).
    ItemMass(usize),
    /// x of the mass item of this index, m aft of the datum.
    ItemX(usize),
    /// Factor on every mass (items and ballast); the CG stays where it is.
    MassScale,
    /// Stabiliser incidence, rad (leading edge up positive).
    StabiliserIncidence,
    /// Decalage, rad (front surface minus rear): set through the stabiliser's incidence.
    Decalage,
}

impl Quantity {
    /// Short name used in column headings, CSV and JSON ("set_cg_x_m", "ballast_kg", ...), with
    /// the unit of the CSV and JSON (SI, but angles in degrees as in `check --json`).
    pub fn key(&self) -> &'static str {
        match self {
            Quantity::CgX => "set_cg_x_m",
            Quantity::Ballast(_) => "ballast_kg",
            Quantity::ItemMass(_) => "item_mass_kg",
            Quantity::ItemX(_) => "item_x_m",
            Quantity::MassScale => "mass_scale",
            Quantity::StabiliserIncidence => "stabiliser_incidence_deg",
            Quantity::Decalage => "decalage_deg",
        }
    }

    /// A value (SI) in the unit the key ends in (degrees for angles, else unchanged).
    /// Degrees come back from radians without the conversion's round-off (0.3, not
    /// 0.30000000000000004).
    pub fn in_key_unit(&self, value_si: f64) -> f64 {
        if self.is_incidence() {
            super::without_noise(value_si.to_degrees())
        } else {
            value_si
        }
    }

    /// The name on the command line (`cg`, `ballast`, `mass`, `x`, `mass-scale`,
    /// `stab-incidence`, `decalage`; the bay or item name follows a colon there).
    pub fn option_name(&self) -> &'static str {
        match self {
            Quantity::CgX => "cg",
            Quantity::Ballast(_) => "ballast",
            Quantity::ItemMass(_) => "mass",
            Quantity::ItemX(_) => "x",
            Quantity::MassScale => "mass-scale",
            Quantity::StabiliserIncidence => "stab-incidence",
            Quantity::Decalage => "decalage",
        }
    }

    /// The builder's unit of the command line's values (docs/sweep.md) and the factor from SI
    /// to it: mm, g, deg, or none for the factor on every mass.
    pub fn builder_unit(&self) -> (&'static str, f64) {
        match self {
            Quantity::CgX | Quantity::ItemX(_) => ("mm", 1000.0),
            Quantity::Ballast(_) | Quantity::ItemMass(_) => ("g", 1000.0),
            Quantity::MassScale => ("", 1.0),
            Quantity::StabiliserIncidence | Quantity::Decalage => {
                ("deg", 180.0 / std::f64::consts::PI)
            }
        }
    }

    /// True for the quantities that change a surface's incidence (the wing system is then
    /// re-solved for the new boundary angles, not rebuilt).
    pub fn is_incidence(&self) -> bool {
        matches!(self, Quantity::StabiliserIncidence | Quantity::Decalage)
    }

    /// The order in which changes are applied (masses, then CG, then incidences).
    fn stage(&self) -> u8 {
        match self {
            Quantity::ItemMass(_) | Quantity::ItemX(_) | Quantity::Ballast(_) => 0,
            Quantity::MassScale => 1,
            Quantity::CgX => 2,
            Quantity::StabiliserIncidence | Quantity::Decalage => 3,
        }
    }
}

/// One axis of a study: a quantity and its values (SI units, in the order given).
#[derive(Debug, Clone, PartialEq)]
pub struct Axis {
    /// What is varied.
    pub quantity: Quantity,
    /// Its values, SI (m, kg, rad, or a plain factor).
    pub values: Vec<f64>,
}

/// Why a study cannot be run as asked.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum StudyError {
    /// No axis, or more than two.
    #[error("a study varies one or two quantities (got {axes})")]
    AxisCount {
        /// Axes given.
        axes: usize,
    },
    /// An axis without values.
    #[error("the {quantity} axis has no values")]
    EmptyAxis {
        /// The quantity's key.
        quantity: &'static str,
    },
    /// More points than a study runs.
    #[error("the study has {points} points; at most {limit} are run (use fewer values on an axis or a coarser step)")]
    TooManyPoints {
        /// Points asked for (product of the axis lengths).
        points: u128,
        /// The limit.
        limit: usize,
    },
    /// Two axes change the same thing.
    #[error("two axes change the same thing ({first} and {second}); vary each quantity on one axis only")]
    SameQuantity {
        /// First axis's key.
        first: &'static str,
        /// Second axis's key.
        second: &'static str,
    },
    /// A value outside what the quantity accepts.
    #[error("{quantity} value {value}{unit} is outside the accepted range {range}")]
    OutOfRange {
        /// The quantity's name on the command line.
        quantity: &'static str,
        /// The value, in the builder's unit of the command line.
        value: f64,
        /// That unit with a leading space ("" for a plain factor).
        unit: String,
        /// The accepted range, in words and the same unit.
        range: String,
    },
    /// The aircraft has nothing for this quantity to change.
    #[error("{quantity}: {reason}")]
    NotApplicable {
        /// The quantity's key.
        quantity: &'static str,
        /// Why.
        reason: &'static str,
    },
}

/// Check that `value` is one `quantity` accepts on `base`.
pub fn check_value(base: &Aircraft, quantity: &Quantity, value: f64) -> Result<(), StudyError> {
    let (unit, factor) = quantity.builder_unit();
    // Shown to 6 significant figures: the value as the builder typed it, without the
    // rounding noise of the unit conversion.
    let shown = |v: f64| format!("{}", (v * factor * 1e6).round() / 1e6);
    let out = |range: String| StudyError::OutOfRange {
        quantity: quantity.option_name(),
        value: (value * factor * 1e6).round() / 1e6,
        unit: if unit.is_empty() {
            String::new()
        } else {
            format!(" {unit}")
        },
        range,
    };
    let not = |reason| StudyError::NotApplicable {
        quantity: quantity.key(),
        reason,
    };
    if !value.is_finite() {
        return Err(out("finite numbers".into()));
    }
    match quantity {
        Quantity::CgX => {
            if value.abs() > MAX_CG_DISTANCE_M {
                let m = shown(MAX_CG_DISTANCE_M);
                return Err(out(format!("-{m} to {m} {unit}")));
            }
        }
        Quantity::Ballast(bay) => {
            let b = base
                .ballast_bays
                .get(*bay)
                .ok_or_else(|| not("no such ballast bay"))?;
            if !(0.0..=b.max_mass_kg).contains(&value) {
                return Err(out(format!(
                    "0 to {} {unit} (the bay's limit)",
                    shown(b.max_mass_kg)
                )));
            }
        }
        Quantity::ItemMass(item) => {
            base.masses
                .get(*item)
                .ok_or_else(|| not("no such mass item"))?;
            // The aircraft file's own limit for one mass item (1 t).
            if !(0.0..=1000.0).contains(&value) {
                return Err(out(format!("0 to {} {unit}", shown(1000.0))));
            }
        }
        Quantity::ItemX(item) => {
            base.masses
                .get(*item)
                .ok_or_else(|| not("no such mass item"))?;
            if value.abs() > MAX_CG_DISTANCE_M {
                let m = shown(MAX_CG_DISTANCE_M);
                return Err(out(format!("-{m} to {m} {unit}")));
            }
        }
        Quantity::MassScale => {
            if value <= 0.0 || value > MAX_MASS_SCALE {
                return Err(out(format!("above 0, at most {MAX_MASS_SCALE}")));
            }
        }
        Quantity::StabiliserIncidence | Quantity::Decalage => {
            if base.stabiliser.is_none() {
                return Err(not("the aircraft has no stabiliser"));
            }
            let incidence = stabiliser_incidence_for(base, quantity, value);
            if value.abs() > MAX_INCIDENCE_RAD || incidence.abs() > MAX_INCIDENCE_RAD {
                return Err(out(
                    "-15 to 15 deg, and a stabiliser incidence within the same".into(),
                ));
            }
        }
    }
    Ok(())
}

/// The stabiliser incidence (rad) that an incidence or decalage value sets.
fn stabiliser_incidence_for(base: &Aircraft, quantity: &Quantity, value: f64) -> f64 {
    match (quantity, base.stabiliser.as_ref().map(|s| s.role)) {
        (Quantity::Decalage, Some(StabiliserRole::Tail)) => base.wing.incidence_rad - value,
        (Quantity::Decalage, Some(StabiliserRole::Canard)) => base.wing.incidence_rad + value,
        _ => value,
    }
}

/// The base aircraft with `changes` applied (values checked by [`check_value`]), in the
/// order masses, CG, incidences.
pub fn apply(base: &Aircraft, changes: &[(&Quantity, f64)]) -> Aircraft {
    let mut a = base.clone();
    let mut ordered: Vec<&(&Quantity, f64)> = changes.iter().collect();
    ordered.sort_by_key(|(q, _)| q.stage());
    for &&(q, value) in &ordered {
        match q {
            Quantity::ItemMass(i) => {
                if let Some(m) = a.masses.get_mut(*i) {
                    m.mass_kg = value;
                }
            }
            Quantity::ItemX(i) => {
                if let Some(m) = a.masses.get_mut(*i) {
                    m.x_m = value;
                }
            }
            Quantity::Ballast(bay) => {
                // As a named setup adds ballast: one more mass item at the bay.
                if let (Some(b), true) = (base.ballast_bays.get(*bay), value > 0.0) {
                    a.masses.push(MassItem {
                        name: format!("ballast in {}", b.name),
                        mass_kg: value,
                        x_m: b.x_m,
                        z_m: b.z_m,
                        tolerance: Default::default(),
                    });
                }
            }
            Quantity::MassScale => {
                for m in &mut a.masses {
                    m.mass_kg *= value;
                }
            }
            Quantity::CgX => {
                if let Ok(summary) = crate::balance::mass_summary(&a.masses) {
                    let dx = value - summary.cg_x_m;
                    for m in &mut a.masses {
                        m.x_m += dx;
                    }
                }
            }
            Quantity::StabiliserIncidence | Quantity::Decalage => {
                let incidence = stabiliser_incidence_for(base, q, value);
                if let Some(s) = a.stabiliser.as_mut() {
                    s.surface.incidence_rad = incidence;
                }
            }
        }
    }
    a
}
