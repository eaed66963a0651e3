//! What the analysis found that the builder must hear about, as data: each finding carries its
//! numbers (SI units) and no sentence. Its level and code are fixed here; the sentence, units
//! and rounding are written in `output::cautions`, and the codes are documented in
//! `docs/cautions.md`.

use crate::caution::Level;
use crate::model::{Aircraft, StabiliserRole};

mod balance;
mod glide;
mod inputs;
mod model;

pub use balance::{BalanceFinding, FasterTrim};
pub use glide::{GlideFinding, PolarMissing};
pub use inputs::{InputFinding, MarginSetting};
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

/// What the one-page report had to leave out for room (notes).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PageFinding {
    /// `notes-left-out`: this many notes gave way.
    NotesLeftOut {
        /// How many.
        notes: usize,
    },
    /// `sink-chart-left-out`: the sink chart gave way, and perhaps notes too.
    SinkChartLeftOut {
        /// How many notes gave way with it.
        notes: Option<usize>,
    },
}

/// One finding.
#[derive(Debug, Clone, PartialEq)]
pub enum Finding {
    /// The standing caution of every result: the figures are estimates.
    SafetyEstimateOnly,
    /// Balance and trim.
    Balance(BalanceFinding),
    /// The inputs, and how the analysis ran.
    Input(InputFinding),
    /// A line about the report page itself.
    Page(PageFinding),
    /// What only the full model finds.
    Model(ModelFinding),
    /// The glide polars.
    Glide(GlideFinding),
}

impl Finding {
    /// Its level.
    pub fn level(&self) -> Level {
        match self {
            Finding::SafetyEstimateOnly | Finding::Page(_) => Level::Note,
            Finding::Balance(f) => f.level(),
            Finding::Input(f) => f.level(),
            Finding::Model(f) => f.level(),
            Finding::Glide(f) => f.level(),
        }
    }

    /// Its stable code.
    pub fn code(&self) -> &'static str {
        match self {
            Finding::SafetyEstimateOnly => "safety-estimate-only",
            Finding::Balance(f) => f.code(),
            Finding::Input(f) => f.code(),
            Finding::Page(PageFinding::NotesLeftOut { .. }) => "notes-left-out",
            Finding::Page(PageFinding::SinkChartLeftOut { .. }) => "sink-chart-left-out",
            Finding::Model(f) => f.code(),
            Finding::Glide(f) => f.code(),
        }
    }
}

impl From<BalanceFinding> for Finding {
    fn from(f: BalanceFinding) -> Self {
        Finding::Balance(f)
    }
}

impl From<InputFinding> for Finding {
    fn from(f: InputFinding) -> Self {
        Finding::Input(f)
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
