//! Errors from reading input files, each naming where the problem is and what is accepted.

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
            write!(f, "{}", self.file)
        } else {
            write!(f, "{}:{}:{}", self.file, self.line, self.column)
        }
    }
}

/// Something wrong with an input file.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
#[error("{location}: {field}: {problem}{}", accepted_suffix(.accepted))]
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
        Some(a) => format!(" (accepted: {a})"),
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

/// Read a whole text file, or an [`InputError`] naming it (field `file`).
pub fn read_text_file(path: &std::path::Path) -> Result<String, InputError> {
    std::fs::read_to_string(path).map_err(|e| {
        InputError::new(
            Location {
                file: path.display().to_string(),
                line: 0,
                column: 0,
            },
            "file",
            format!("cannot be read: {e}"),
            None,
        )
    })
}
