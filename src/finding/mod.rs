//! What the analysis found that the builder must hear about, as data: each finding carries its
//! numbers (SI units) and no sentence. Its level and code are fixed here; the sentence, units
//! and rounding are written in `output::cautions`, and the codes are documented in
//! `docs/cautions.md`.

use crate::caution::Level;
use crate::model::{Aircraft, StabiliserRole};

mod balance;
mod glide;
mod model;

pub use balance::{BalanceFinding, FasterTrim};
pub use glide::{GlideFinding, PolarMissing};
pub use model::{ElevonTrim, ModelFinding, TailStall};

/// The aircraft's pitch control, as the cautions name it.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Control {
    /// A tailplane's elevator.
    Elevator,
    /// A canard's elevator.
    CanardElevator,
    /// A tailless wing's elevons.
    Elevons,
    /// A tailless wing without elevons: only the airfoils' reflex.
    Reflex,
}

impl Control {
    /// The pitch control of `aircraft`.
    pub fn of(aircraft: &Aircraft) -> Control {
        match (&aircraft.stabiliser, &aircraft.elevons) {
            (Some(s), _) if s.role == StabiliserRole::Canard => Control::CanardElevator,
            (Some(_), _) => Control::Elevator,
            (None, Some(_)) => Control::Elevons,
            (None, None) => Control::Reflex,
        }
    }
}

/// One finding.
#[derive(Debug, Clone, PartialEq)]
pub enum Finding {
    /// The standing caution of every result: the figures are estimates.
    SafetyEstimateOnly,
    /// Balance and trim.
    Balance(BalanceFinding),
    /// What only the full model finds.
    Model(ModelFinding),
    /// The glide polars.
    Glide(GlideFinding),
    /// A finding whose sentence was written where it was found (not yet typed); its level and
    /// code travel in the [`crate::caution::Caution`] that holds it.
    Worded(String),
}

impl Finding {
    /// The level of a typed finding (`Note` for a worded one: its caution holds the level).
    pub fn level(&self) -> Level {
        match self {
            Finding::SafetyEstimateOnly | Finding::Worded(_) => Level::Note,
            Finding::Balance(f) => f.level(),
            Finding::Model(f) => f.level(),
            Finding::Glide(f) => f.level(),
        }
    }

    /// The stable code of a typed finding (empty for a worded one: its caution holds the
    /// code).
    pub fn code(&self) -> &'static str {
        match self {
            Finding::SafetyEstimateOnly => "safety-estimate-only",
            Finding::Balance(f) => f.code(),
            Finding::Model(f) => f.code(),
            Finding::Glide(f) => f.code(),
            Finding::Worded(_) => "",
        }
    }
}

impl From<BalanceFinding> for Finding {
    fn from(f: BalanceFinding) -> Self {
        Finding::Balance(f)
    }
}

impl From<ModelFinding> for Finding {
    fn from(f: ModelFinding) -> Self {
        Finding::Model(f)
    }
}

impl From<GlideFinding> for Finding {
    fn from(f: GlideFinding) -> Self {
        Finding::Glide(f)
    }
}
