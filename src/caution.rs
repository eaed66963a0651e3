//! Cautions: findings that travel with a result as data, so a table or report can show them.
//!
//! Each caution has a stable machine code (documented in `docs/cautions.md`), a level and a
//! plain-language message for the builder.

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

/// One finding about the analysed aircraft.
#[derive(Debug, Clone, PartialEq)]
pub struct Caution {
    /// Severity.
    pub level: Level,
    /// Stable code, kebab-case, e.g. `static-margin-low`.
    pub code: &'static str,
    /// Message for the builder, one or two sentences.
    pub message: String,
}

impl Caution {
    /// A caution with the given level, code and message.
    pub fn new(level: Level, code: &'static str, message: impl Into<String>) -> Self {
        Caution {
            level,
            code,
            message: message.into(),
        }
    }
}

/// The standing safety caution carried by every analysis and report.
pub const SAFETY_MESSAGE: &str = "These figures are estimates from a simplified aerodynamic model. \
They do not replace the designer's stated balance point, a careful hand-glide or first-flight test, \
or the safety code of your model-flying association. For a full-size aircraft, the flight manual, \
the weighing report and licensed airworthiness practice always take precedence.";

/// The standing safety caution as a [`Caution`] (code `safety-estimate-only`).
pub fn safety_caution() -> Caution {
    Caution::new(Level::Note, "safety-estimate-only", SAFETY_MESSAGE)
}
