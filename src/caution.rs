//! Cautions: findings that travel with a result as data, so a table or report can show them.
//!
//! Each caution has a stable machine code (documented in `docs/cautions.md`), a level and a
//! plain-language message for the builder.

use std::fmt;

/// A Reynolds number as a builder reads it: three significant figures with thousands
/// separators (105,416 becomes "105,000"; 45,123 becomes "45,100"); the figures behind it are
/// not known better than that (common practice).
pub fn reynolds_text(re: f64) -> String {
    if !re.is_finite() || re <= 0.0 {
        return "0".to_string();
    }
    let magnitude = re.log10().floor() as i32;
    let scale = 10f64.powi((magnitude - 2).max(0));
    let rounded = ((re / scale).round() * scale) as u64;
    let digits = rounded.to_string();
    let mut out = String::new();
    for (i, ch) in digits.chars().enumerate() {
        if i > 0 && (digits.len() - i) % 3 == 0 {
            out.push(',');
        }
        out.push(ch);
    }
    out
}

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

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn reynolds_numbers_read_to_three_figures() {
        assert_eq!(reynolds_text(105_416.0), "105,000");
        assert_eq!(reynolds_text(138_456.0), "138,000");
        assert_eq!(reynolds_text(45_123.0), "45,100");
        assert_eq!(reynolds_text(1_234_567.0), "1,230,000");
        assert_eq!(reynolds_text(987.0), "987");
        assert_eq!(reynolds_text(f64::NAN), "0");
    }
}
