//! Errors from reading input files, each naming where the problem is and what is accepted;
//! shown with control characters escaped ([`crate::printable`]).

use crate::printable::printable;
use std::fmt;

/// A position in an input file, 1-based.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct Location {
    /// File name as the user gave it (or `<built-in demo>`).
    pub file: String,
    /// Line, 1-based (0 when unknown).
    pub line: usize,
    /// Column, 1-based (0 when unknown).
    pub column: usize,
}

impl fmt::Display for Location {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        if self.line == 0 {
            write!(f, "{}", printable(&self.file))
        } else {
            write!(f, "{}:{}:{}", printable(&self.file), self.line, self.column)
        }
    }
}

/// Something wrong with an input file.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[error(
    "{location}: {}: {}{}",
    printable(.field),
    printable(.problem),
    accepted_suffix(.accepted)
)]
pub struct InputError {
    /// Where.
    pub location: Location,
    /// The key or field concerned, as a dotted path (`wing.panels[0].tip_chord`), or a
    /// description such as `line 3` for coordinates files.
    pub field: String,
    /// What is wrong.
    pub problem: String,
    /// What would be accepted, when there is a simple answer ("0 to 89 deg").
    pub accepted: Option<String>,
}

fn accepted_suffix(accepted: &Option<String>) -> String {
    match accepted {
        Some(a) => format!(" (accepted: {})", printable(a)),
        None => String::new(),
    }
}

impl InputError {
    /// An error at a location, for a field, with an optional accepted range.
    pub fn new(
        location: Location,
        field: impl Into<String>,
        problem: impl Into<String>,
        accepted: Option<String>,
    ) -> Self {
        InputError {
            location,
            field: field.into(),
            problem: problem.into(),
            accepted,
        }
    }
}
