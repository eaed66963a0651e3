//! Cautions: findings that travel with a result as data, so a table or report can show them.
//!
//! Each caution has a stable machine code (documented in `docs/cautions.md`), a level and a
//! [`Finding`] that holds its numbers; the sentence a builder reads is written from it by
//! `output::cautions::message`, the one place where cautions are worded.

pub use crate::finding::Finding;

use std::fmt;

/// How serious a caution is.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord)]
pub enum Level {
    /// Background information the builder should know (method used, default assumed).
    Note,
    /// Something to look at before flying.
    Warning,
    /// A configuration that is likely unflyable or dangerous as described.
    Danger,
}

impl Level {
    /// Lower-case name used in JSON and tables.
    pub fn as_str(self) -> &'static str {
        match self {
            Level::Note => "note",
            Level::Warning => "warning",
            Level::Danger => "danger",
        }
    }
}

impl fmt::Display for Level {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(self.as_str())
    }
}

/// One finding about the analysed aircraft, with its level and code.
#[derive(Debug, Clone, PartialEq)]
pub struct Caution {
    /// Severity.
    pub level: Level,
    /// Stable code, kebab-case, e.g. `static-margin-low`.
    pub code: &'static str,
    /// What was found, with its numbers.
    pub finding: Finding,
}

impl Caution {
    /// A caution from a typed finding: its level and code are the finding's.
    pub fn of(finding: Finding) -> Self {
        Caution {
            level: finding.level(),
            code: finding.code(),
            finding,
        }
    }
}

/// The standing safety caution (code `safety-estimate-only`).
pub fn safety_caution() -> Caution {
    Caution::of(Finding::SafetyEstimateOnly)
}
