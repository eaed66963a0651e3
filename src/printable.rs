//! Text from a file made safe to show: control characters (terminal escape sequences,
//! carriage returns, bidirectional overrides) written as visible escapes, and quoted tokens
//! cut short, so neither an aircraft's name nor an error message can drive the terminal or
//! copy a long stretch of whatever file was given.
//!
//! Pure string functions; the input reader applies them to names and notes as it reads
//! them, the error and output code to anything else taken from a file or a path.

use std::borrow::Cow;

/// Longest token quoted in an error message, characters; longer ones end in "...".
pub const MAX_QUOTED_CHARS: usize = 32;

/// Whether `c` would be drawn as nothing or act on the terminal: C0 and C1 controls, DEL,
/// and the Unicode bidirectional embedding, override and isolate marks.
fn is_hazard(c: char) -> bool {
    c.is_control() || matches!(c, '\u{202a}'..='\u{202e}' | '\u{2066}'..='\u{2069}')
}

/// `text` with every control character written as `\u{1b}` (tab and newline too, so one
/// line stays one line). Text without them is returned as it is.
pub fn printable(text: &str) -> Cow<'_, str> {
    if !text.chars().any(is_hazard) {
        return Cow::Borrowed(text);
    }
    let mut out = String::with_capacity(text.len() + 8);
    for c in text.chars() {
        if is_hazard(c) {
            out.push_str(&format!("\\u{{{:x}}}", c as u32));
        } else {
            out.push(c);
        }
    }
    Cow::Owned(out)
}

/// A token from a file, for quoting in an error: printable, and at most
/// [`MAX_QUOTED_CHARS`] characters (then "...").
pub fn token(text: &str) -> String {
    let shown: String = text.chars().take(MAX_QUOTED_CHARS).collect();
    let cut = text.chars().nth(MAX_QUOTED_CHARS).is_some();
    let mut out = printable(&shown).into_owned();
    if cut {
        out.push_str("...");
    }
    out
}

/// Names for a list in a message, each quoted as [`token`] shows it and separated by
/// commas: `'root', 'battery, 4 cells'` (quoted, so that a comma inside a name cannot be
/// read as a separator).
pub fn name_list<S: AsRef<str>>(names: &[S]) -> String {
    names
        .iter()
        .map(|n| format!("'{}'", token(n.as_ref())))
        .collect::<Vec<_>>()
        .join(", ")
}

/// What an error about an unreadable value may quote of a file: the value's first word
/// (letters, digits and `+-._%^/`; a number or a unit), with one short second word when it
/// looks like a unit (`2 deg`), as [`token`] shows it, and "..." when anything was left
/// out. A line of some other file (`root:x:0:0:...`) is cut at its first odd character.
pub fn first_word(text: &str) -> String {
    let text = text.trim();
    let is_word = |c: char| c.is_alphanumeric() || "+-._%^/".contains(c);
    let end_of = |s: &str| s.find(|c: char| !is_word(c)).unwrap_or(s.len());
    let mut end = end_of(text);
    if let Some(rest) = text[end..].strip_prefix(' ') {
        let unit_end = end_of(rest);
        let after = &rest[unit_end..];
        let after = after.trim_start();
        let ends_there = after.is_empty() || after.starts_with('#');
        if unit_end > 0 && unit_end <= 8 && ends_there {
            end += 1 + unit_end;
        }
    }
    let word = &text[..end];
    let mut out = token(word);
    if word.len() < text.len() && !out.ends_with("...") {
        out.push_str("...");
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn escapes_controls_and_keeps_plain_text() {
        assert!(matches!(printable("Wren 1400 \u{b0}"), Cow::Borrowed(_)));
        assert_eq!(printable("a\u{1b}[31mred"), "a\\u{1b}[31mred");
        assert_eq!(printable("two\nlines\r"), "two\\u{a}lines\\u{d}");
        assert_eq!(printable("x\u{202e}y\u{9b}"), "x\\u{202e}y\\u{9b}");
    }

    #[test]
    fn tokens_are_cut() {
        assert_eq!(token("short"), "short");
        let long = "root:x:0:0:root:/root:/bin/bash:and-more";
        let t = token(long);
        assert!(
            t.ends_with("...") && t.chars().count() == MAX_QUOTED_CHARS + 3,
            "{t}"
        );
        assert_eq!(first_word("value with words"), "value...");
        assert_eq!(first_word("2 deg"), "2 deg");
        assert_eq!(first_word("root:x:0:0:root:/root:/bin/bash"), "root...");
        assert_eq!(first_word(" 12 "), "12");
    }
}
