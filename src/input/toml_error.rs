//! Turning the TOML reader's errors into [`InputError`]s in the file's own terms: the full key
//! path where the error is (`ballast[1].max`, `airfoils.root.karman_trefftz.thickness`), what
//! is wrong in plain words, and what would be accepted, without the parser's own vocabulary
//! ("expected nothing", "as i128").
//!
//! The TOML reader reports a message and a byte span. The key path is worked out from the text:
//! the `[table]` / `[[array]]` heading above the span (array entries counted from 0), then the
//! keys of the line up to the span, inline tables included.

use super::error::{InputError, Location};
use crate::printable::{first_word, token};
use std::collections::BTreeMap;

mod issues;
mod unknown;

use issues::{is_number_error, plain_expected, plain_problem};

/// Tables of the aircraft file that are lists (`[[name]]`, one heading per entry).
const LIST_TABLES: [&str; 6] = [
    "mass",
    "ballast",
    "setup",
    "weighing",
    "wing.panel",
    "stabiliser.panel",
];

/// What a number in the file may look like.
const NUMBER_FORM: &str =
    "a number such as 12, -3.5 or 1.5e3, or a value with a unit in quotes such as \"48 in\"";

/// Keys whose value is text.
const TEXT_KEYS: [&str; 9] = [
    "name",
    "notes",
    "datum",
    "airfoil",
    "tip_airfoil",
    "role",
    "method",
    "coordinates",
    "naca",
];

/// The position of byte `offset` in `text`, 1-based line and column (columns in characters).
pub(super) fn location(text: &str, file: &str, offset: usize) -> Location {
    let mut offset = offset.min(text.len());
    while !text.is_char_boundary(offset) {
        offset -= 1;
    }
    let before = &text[..offset];
    let line = before.matches('\n').count() + 1;
    let line_start = before.rfind('\n').map(|i| i + 1).unwrap_or(0);
    let column = text[line_start..offset].chars().count() + 1;
    Location {
        file: file.to_string(),
        line,
        column,
    }
}

/// The [`InputError`] for an error of the TOML reader on `text`.
pub(super) fn translate(text: &str, file: &str, e: &toml::de::Error) -> InputError {
    let span = e.span();
    let at = span.clone().map(|s| s.start.min(text.len())).unwrap_or(0);
    let location = match &span {
        Some(s) => location(text, file, s.start),
        None => Location {
            file: file.to_string(),
            line: 0,
            column: 0,
        },
    };
    let message = e.message().trim();
    let (head, expected) = match message.split_once(", expected ") {
        Some((h, x)) => (h.trim(), Some(x.trim())),
        None => (message, None),
    };
    let src = Source::new(text);
    let ctx = src.context(at);
    let issue = if head == "duplicate key" {
        src.duplicate_key(&ctx, span.unwrap_or(at..at))
    } else if let Some(key) = head.strip_prefix("unknown field ") {
        src.unknown_key(&ctx, &token(key.trim_matches('`')), at, expected)
    } else if let Some(key) = head.strip_prefix("missing field ") {
        // Required keys are checked after reading (see raw.rs); this is a fallback.
        let key = &token(key.trim_matches('`'));
        Issue {
            field: ctx.path_with(key),
            problem: format!("missing: `{key}` is required here"),
            accepted: Some("see the table of keys in aircraft/README.md".into()),
        }
    } else if is_number_error(head) {
        src.bad_number(&ctx, head, at)
    } else if head.starts_with("invalid type") || head.starts_with("invalid length") {
        src.wrong_kind(&ctx, head, expected.unwrap_or(""))
    } else if head == "string values must be quoted" {
        src.unquoted(&ctx, at)
    } else if head == "unexpected key or value" && !ctx.on_header {
        src.after_value(&ctx, at)
    } else {
        Issue {
            field: if ctx.on_header || ctx.key.is_none() {
                "syntax".to_string()
            } else {
                ctx.path()
            },
            problem: plain_problem(head),
            accepted: expected.and_then(plain_expected),
        }
    };
    InputError::new(location, issue.field, issue.problem, issue.accepted)
}

/// Field, problem and accepted values of one error.
struct Issue {
    field: String,
    problem: String,
    accepted: Option<String>,
}

/// Where in the file an offset is.
struct Context {
    /// Byte offset of the line the offset is on.
    line_start: usize,
    /// Path of the table heading above (`mass[2]`, `wing.panel[0]`), or empty at the top.
    table: String,
    /// The offset is on a `[table]` or `[[array]]` heading line.
    on_header: bool,
    /// Keys of inline tables open at the offset, outermost first.
    inline: Vec<String>,
    /// Key whose value the offset is in, if any.
    key: Option<String>,
    /// Byte range of that value's text, from after its `=` to the offset's line end or the
    /// next `,`, `}` or comment.
    value: Option<std::ops::Range<usize>>,
}

impl Context {
    /// The full path of the key at the offset.
    fn path(&self) -> String {
        self.join(self.key.as_deref())
    }

    /// The full path of `key` in the table (and inline tables) at the offset.
    fn path_with(&self, key: &str) -> String {
        self.join(Some(key))
    }

    fn join(&self, key: Option<&str>) -> String {
        let parts = std::iter::once(self.table.as_str())
            .chain(self.inline.iter().map(String::as_str))
            .chain(key)
            .filter(|s| !s.is_empty());
        parts.collect::<Vec<_>>().join(".")
    }

    /// The last part of the key at the offset (`naca` for `airfoils.root.naca`).
    fn leaf(&self) -> &str {
        self.key
            .as_deref()
            .and_then(|k| k.rsplit('.').next())
            .unwrap_or("")
    }
}

/// A table heading of the file.
struct Header {
    /// Byte offset of the line.
    start: usize,
    /// Name as written, normalised (`wing.panel`).
    name: String,
    /// `[[name]]` rather than `[name]`.
    is_array: bool,
    /// Path with the entry index for arrays (`wing.panel[1]`).
    path: String,
}

struct Source<'a> {
    text: &'a str,
    headers: Vec<Header>,
}

impl<'a> Source<'a> {
    fn new(text: &'a str) -> Self {
        let mut headers = Vec::new();
        let mut counts: BTreeMap<String, usize> = BTreeMap::new();
        let mut in_multiline: Option<&str> = None;
        let mut start = 0;
        for line in text.split_inclusive('\n') {
            let line_start = start;
            start += line.len();
            // Skip the inside of multi-line strings, where a `[` starts no heading.
            if let Some(delim) = in_multiline {
                if line.matches(delim).count() % 2 == 1 {
                    in_multiline = None;
                }
                continue;
            }
            for delim in ["\"\"\"", "'''"] {
                if line.matches(delim).count() % 2 == 1 {
                    in_multiline = Some(delim);
                }
            }
            if let Some((name, is_array)) = header_of(line) {
                let path = if is_array {
                    let n = counts.entry(name.clone()).or_insert(0);
                    *n += 1;
                    format!("{name}[{}]", *n - 1)
                } else {
                    name.clone()
                };
                headers.push(Header {
                    start: line_start,
                    name,
                    is_array,
                    path,
                });
            }
        }
        Source { text, headers }
    }

    /// The heading whose table holds `offset`.
    fn header_at(&self, offset: usize) -> Option<&Header> {
        self.headers.iter().rev().find(|h| h.start <= offset)
    }

    fn line_bounds(&self, offset: usize) -> (usize, usize) {
        let start = self.text[..offset].rfind('\n').map(|i| i + 1).unwrap_or(0);
        let end = self.text[offset..]
            .find('\n')
            .map(|i| offset + i)
            .unwrap_or(self.text.len());
        (start, end)
    }

    fn line_number(&self, offset: usize) -> usize {
        self.text[..offset.min(self.text.len())]
            .matches('\n')
            .count()
            + 1
    }

    fn context(&self, offset: usize) -> Context {
        let (line_start, line_end) = self.line_bounds(offset);
        let header = self.header_at(offset);
        let on_header = header.is_some_and(|h| h.start == line_start);
        let table = match header {
            Some(h) if !on_header => h.path.clone(),
            Some(h) => self
                .headers
                .iter()
                .rev()
                .find(|g| g.start < h.start)
                .map(|g| g.path.clone())
                .unwrap_or_default(),
            None => String::new(),
        };
        if on_header {
            return Context {
                line_start,
                table,
                on_header,
                inline: Vec::new(),
                key: None,
                value: None,
            };
        }
        // Keys of the line up to the offset, through inline tables.
        let prefix = &self.text[line_start..offset];
        let (inline, key, value_start) = keys_before(prefix, line_start);
        let value = value_start.map(|s| {
            let rest = &self.text[offset..line_end];
            let end = rest
                .find([',', '}', '#'])
                .map(|i| offset + i)
                .unwrap_or(line_end);
            s..end.max(s)
        });
        Context {
            line_start,
            table,
            on_header,
            inline,
            key,
            value,
        }
    }
}

/// The inline-table keys open at the end of `prefix` (the start of a line, which begins at
/// byte `line_start` of the file), the key being given a value there, and the byte where
/// that value starts; quoted text and comments are skipped.
fn keys_before(prefix: &str, line_start: usize) -> (Vec<String>, Option<String>, Option<usize>) {
    let mut inline = Vec::new();
    let mut key: Option<String> = None;
    let mut value_start: Option<usize> = None;
    let mut segment = 0;
    let mut quote: Option<char> = None;
    let mut escaped = false;
    for (i, c) in prefix.char_indices() {
        if let Some(q) = quote {
            if escaped {
                escaped = false;
            } else if c == '\\' && q == '"' {
                escaped = true;
            } else if c == q {
                quote = None;
            }
            continue;
        }
        match c {
            '"' | '\'' => quote = Some(c),
            '=' => {
                key = Some(clean_key(&prefix[segment..i]));
                value_start = Some(line_start + i + 1);
            }
            '{' => {
                if let Some(k) = key.take() {
                    inline.push(k);
                }
                segment = i + 1;
                value_start = None;
            }
            ',' => {
                key = None;
                segment = i + 1;
                value_start = None;
            }
            '}' => {
                inline.pop();
                key = None;
                segment = i + 1;
                value_start = None;
            }
            '#' => break,
            _ => {}
        }
    }
    (inline, key, value_start)
}

/// `(name, is_array)` of a heading line such as `[wing]`, `[[wing.panel]]  # inner`.
fn header_of(line: &str) -> Option<(String, bool)> {
    let t = line.trim();
    let (inner, is_array) = if let Some(r) = t.strip_prefix("[[") {
        (r.split("]]").next()?, true)
    } else {
        (t.strip_prefix('[')?.split(']').next()?, false)
    };
    Some((clean_key(inner), is_array))
}

/// A key as written (`"battery, 4 cells"`, ` wing . panel `) in path form.
fn clean_key(raw: &str) -> String {
    raw.split('.')
        .map(|p| p.trim().trim_matches('"').trim_matches('\''))
        .collect::<Vec<_>>()
        .join(".")
}
