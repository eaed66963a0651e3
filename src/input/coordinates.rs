//! Airfoil coordinate files: plain text, one point `x y` per line.
//!
//! Accepted: numbers separated by spaces, tabs or one comma; an optional single title line
//! first (any line that is not two numbers); blank lines anywhere. Every other line must hold
//! exactly two finite numbers. The points keep the file's order and units; checking the shape
//! (order round the airfoil, crossings, duplicates) is the section geometry's job. At most
//! [`MAX_COORDINATE_POINTS`] points; quoted tokens are cut short and escaped.

use crate::input::error::{InputError, Location};
use crate::printable::{first_word, printable, token};
use std::path::Path;

/// Most points accepted in one coordinates file. Published airfoil files hold 30 to 400
/// points (common practice); the limit keeps the shape checks (whose self-crossing test
/// compares every pair of segments) to a fraction of a second.
pub const MAX_COORDINATE_POINTS: usize = 10_000;

/// What a coordinates line may hold, for error messages.
const ACCEPTED: &str = "two numbers per line, x then y, separated by spaces, tabs or a comma; \
                        an optional title on the first line; blank lines are ignored";

/// Parses coordinates text. `file` names the source in errors. Returns the title (if the
/// first non-blank line is not a pair of numbers) and the points.
pub fn parse_coordinates(
    text: &str,
    file: &str,
) -> Result<(Option<String>, Vec<[f64; 2]>), InputError> {
    let mut title = None;
    let mut points = Vec::new();
    let mut seen_content = false;
    for (index, line) in text.lines().enumerate() {
        let line_no = index + 1;
        if line.trim().is_empty() {
            continue;
        }
        let first_content = !seen_content;
        seen_content = true;
        match parse_pair(line) {
            Ok(_) if points.len() == MAX_COORDINATE_POINTS => {
                return Err(InputError::new(
                    Location {
                        file: file.to_string(),
                        line: line_no,
                        column: 1,
                    },
                    format!("line {line_no}"),
                    format!("more than {MAX_COORDINATE_POINTS} points"),
                    Some(format!(
                        "at most {MAX_COORDINATE_POINTS} points (x y pairs)"
                    )),
                ))
            }
            Ok(p) => points.push(p),
            Err(_) if first_content => title = Some(printable(line.trim()).into_owned()),
            Err((column, problem)) => {
                return Err(InputError::new(
                    Location {
                        file: file.to_string(),
                        line: line_no,
                        column,
                    },
                    format!("line {line_no}"),
                    problem,
                    Some(ACCEPTED.to_string()),
                ))
            }
        }
    }
    if points.is_empty() {
        return Err(InputError::new(
            Location {
                file: file.to_string(),
                line: 0,
                column: 0,
            },
            "coordinates",
            if seen_content {
                "the file holds a title but no coordinates"
            } else {
                "the file is empty"
            },
            Some(ACCEPTED.to_string()),
        ));
    }
    Ok((title, points))
}

/// Reads and parses a coordinates file.
pub fn read_coordinates_file(path: &Path) -> Result<(Option<String>, Vec<[f64; 2]>), InputError> {
    let name = path.display().to_string();
    let text = super::file::read_input_file(path, super::file::COORDINATES_FILE)?;
    parse_coordinates(&text, &name)
}

/// Two finite numbers from one line, or the 1-based column of the problem and a message.
fn parse_pair(line: &str) -> Result<[f64; 2], (usize, String)> {
    let mut tokens: Vec<(usize, &str)> = Vec::new();
    let mut start = None;
    let mut commas = 0;
    for (i, c) in line.char_indices() {
        let sep = c.is_whitespace() || c == ',';
        if c == ',' {
            commas += 1;
        }
        match (sep, start) {
            (true, Some(s)) => {
                tokens.push((s, &line[s..i]));
                start = None;
            }
            (false, None) => start = Some(i),
            _ => {}
        }
    }
    if let Some(s) = start {
        tokens.push((s, &line[s..]));
    }
    let column = |byte: usize| line[..byte].chars().count() + 1;
    if commas > 1 {
        let at = line.match_indices(',').nth(1).map(|(i, _)| i).unwrap_or(0);
        return Err((column(at), "more than one comma".to_string()));
    }
    let mut values = [0.0; 2];
    for (k, &(at, tok)) in tokens.iter().enumerate() {
        if k >= 2 {
            return Err((
                column(at),
                format!("unexpected third value '{}'", token(tok)),
            ));
        }
        let v: f64 = tok
            .parse()
            .map_err(|_| (column(at), format!("'{}' is not a number", first_word(tok))))?;
        if !v.is_finite() {
            return Err((
                column(at),
                format!("'{}' is not a finite number", token(tok)),
            ));
        }
        values[k] = v;
    }
    if tokens.len() < 2 {
        let at = line.len();
        return Err((column(at), "expected two numbers, x and y".to_string()));
    }
    Ok(values)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn reads_title_and_mixed_separators() {
        let text = "My foil\n1.0 0.0\n\n0.5,0.05\n 0.0\t0.0 \n0.5 , -0.04\n1 0\n";
        let (title, pts) = parse_coordinates(text, "f.dat").unwrap();
        assert_eq!(title.as_deref(), Some("My foil"));
        assert_eq!(pts.len(), 5);
        approx::assert_relative_eq!(pts[3][0], 0.5, epsilon = 1e-15);
        approx::assert_relative_eq!(pts[3][1], -0.04, epsilon = 1e-15);
    }

    #[test]
    fn no_title_when_the_first_line_is_numbers() {
        let (title, pts) = parse_coordinates("1 0\n0 0\n", "f").unwrap();
        assert!(title.is_none());
        assert_eq!(pts.len(), 2);
    }

    #[test]
    fn errors_name_line_and_column() {
        let e = parse_coordinates("title\n1 0\n0.5 abc\n", "f.dat").unwrap_err();
        assert_eq!(e.location.line, 3);
        assert_eq!(e.location.column, 5);
        assert!(e.to_string().contains("'abc' is not a number"), "{e}");
        assert!(e.to_string().contains("accepted"), "{e}");
        let e = parse_coordinates("1 0\n0.5 NaN\n", "f.dat").unwrap_err();
        assert!(e.to_string().contains("not a finite number"), "{e}");
        let e = parse_coordinates("1 0\n0.5 0 3\n", "f.dat").unwrap_err();
        assert!(e.to_string().contains("third value"), "{e}");
        let e = parse_coordinates("1 0\n0.5\n", "f.dat").unwrap_err();
        assert!(e.to_string().contains("two numbers"), "{e}");
    }

    #[test]
    fn empty_and_title_only_files_are_errors() {
        let e = parse_coordinates("\n  \n", "e.dat").unwrap_err();
        assert!(e.to_string().contains("empty"), "{e}");
        let e = parse_coordinates("just a title\n", "e.dat").unwrap_err();
        assert!(e.to_string().contains("no coordinates"), "{e}");
    }
}
