//! What the analysis found that the builder must hear about, as data: each finding carries its
//! numbers (SI units) and no sentence. Its level and code are fixed here; the sentence, units
//! and rounding are written in `output::cautions`, and the codes are documented in
//! `docs/cautions.md`.

use crate::caution::Level;

/// One finding.
#[derive(Debug, Clone, PartialEq)]
pub enum Finding {
    /// The standing caution of every result: the figures are estimates.
    SafetyEstimateOnly,
    /// A finding whose sentence was written where it was found (not yet typed); its level and
    /// code travel in the [`crate::caution::Caution`] that holds it.
    Worded(String),
}

impl Finding {
    /// The level of a typed finding (`Note` for a worded one: its caution holds the level).
    pub fn level(&self) -> Level {
        match self {
            Finding::SafetyEstimateOnly | Finding::Worded(_) => Level::Note,
        }
    }

    /// The stable code of a typed finding (empty for a worded one: its caution holds the
    /// code).
    pub fn code(&self) -> &'static str {
        match self {
            Finding::SafetyEstimateOnly => "safety-estimate-only",
            Finding::Worded(_) => "",
        }
    }
}
