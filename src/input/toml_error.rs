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
        let key = &token(key.trim_matches('`'));
        Issue {
            field: ctx.path_with(key),
            problem: format!("unknown key `{key}`"),
            accepted: expected.map(|x| {
                x.strip_prefix("one of ")
                    .map(|keys| format!("one of {keys}"))
                    .unwrap_or_else(|| plain_expected(x).unwrap_or_default())
            }),
        }
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

    /// The value's text at the offset, trimmed (empty if none).
    fn value_text(&self, ctx: &Context, at: usize) -> String {
        match &ctx.value {
            Some(r) => self.text[r.clone()].trim().to_string(),
            None => {
                let (s, e) = self.line_bounds(at);
                let line = &self.text[s..e];
                let i = at - s;
                let stop = |c: char| c.is_whitespace() || ",{}[]=#".contains(c);
                let a = line[..i].rfind(stop).map(|j| j + 1).unwrap_or(0);
                let b = line[i..].find(stop).map(|j| i + j).unwrap_or(line.len());
                line[a..b].to_string()
            }
        }
    }

    fn duplicate_key(&self, ctx: &Context, span: std::ops::Range<usize>) -> Issue {
        let span = span.start.min(self.text.len())..span.end.min(self.text.len());
        let key = token(&clean_key(self.text.get(span.clone()).unwrap_or("")));
        let (line_start, _) = self.line_bounds(span.start);
        let here = self.headers.iter().find(|h| h.start == line_start);
        if let Some(h) = here {
            let name = &h.name;
            let is_list = LIST_TABLES.contains(&name.as_str());
            let first = self
                .headers
                .iter()
                .find(|g| g.name == *name && g.start < h.start);
            let (written, other) = if h.is_array {
                (format!("[[{name}]]"), format!("[{name}]"))
            } else {
                (format!("[{name}]"), format!("[[{name}]]"))
            };
            let problem = match first {
                Some(g) if g.is_array != h.is_array => format!(
                    "`{written}` here, but `{other}` on line {}: a table and a list of tables \
                     cannot share a name",
                    self.line_number(g.start)
                ),
                Some(g) => format!(
                    "`{written}` appears twice (first on line {})",
                    self.line_number(g.start)
                ),
                None => format!(
                    "`{name}` is defined twice (as `{written}` and before, through dotted keys \
                     such as `{name}.key = ...`)"
                ),
            };
            let accepted = if is_list {
                format!(
                    "`[[{name}]]` (double brackets) for every entry: {name} is a list of tables"
                )
            } else {
                format!(
                    "`[{name}]` (single brackets) once, with all its keys under that heading: \
                     {name} is a single table"
                )
            };
            return Issue {
                field: name.clone(),
                problem,
                accepted: Some(accepted),
            };
        }
        // A key given twice in one table (or inline table).
        let path = ctx.path_with(&key);
        let table_start = self.header_at(span.start).map(|h| h.start).unwrap_or(0);
        let first_line = self.text[table_start..line_start]
            .split_inclusive('\n')
            .scan(table_start, |pos, l| {
                let s = *pos;
                *pos += l.len();
                Some((s, l))
            })
            .find(|(_, l)| {
                l.split_once('=')
                    .is_some_and(|(k, _)| clean_key(k) == key && header_of(l).is_none())
            })
            .map(|(s, _)| self.line_number(s));
        let table = match (ctx.inline.last(), ctx.table.as_str()) {
            (Some(inline), _) => format!("in `{inline} = {{ ... }}`"),
            (None, "") => "at the top of the file".to_string(),
            (None, t) if t.ends_with(']') => format!("in {t}"),
            (None, t) => format!("in [{t}]"),
        };
        Issue {
            field: path,
            problem: match first_line {
                Some(n) => format!("`{key}` is given twice {table} (first on line {n})"),
                None => format!("`{key}` is given twice {table}"),
            },
            accepted: Some("each key once per table: keep one of the two".into()),
        }
    }

    fn wrong_kind(&self, ctx: &Context, head: &str, expected: &str) -> Issue {
        let header = self.headers.iter().find(|h| h.start == ctx.line_start);
        let wants_list = expected.contains("sequence");
        let wants_table = expected.contains("map") || expected.starts_with("struct");
        if let Some(h) = header {
            let name = &h.name;
            if wants_list && !h.is_array {
                return Issue {
                    field: name.clone(),
                    problem: format!(
                        "`[{name}]` is a single table, but {name} is a list of tables"
                    ),
                    accepted: Some(format!(
                        "`[[{name}]]` (double brackets), one heading for every entry"
                    )),
                };
            }
            if h.is_array && (wants_table || head.starts_with("invalid length")) {
                return Issue {
                    field: name.clone(),
                    problem: format!("`[[{name}]]` makes a list, but {name} is a single table"),
                    accepted: Some(format!("`[{name}]` (single brackets), once")),
                };
            }
        }
        let found = head
            .strip_prefix("invalid type: ")
            .map(|f| f.replace("map", "a table").replace("sequence", "a list"))
            .unwrap_or_else(|| "a list".into());
        let (what, accepted) = if wants_list {
            (
                "a list of tables".to_string(),
                format!(
                    "`[[{}]]` tables, one for every entry",
                    ctx.path().trim_end_matches('.')
                ),
            )
        } else if wants_table {
            (
                "a table".to_string(),
                format!(
                    "a table: an inline table such as `{} = {{ key = value, ... }}`, or a \
                     [heading] with its keys below",
                    ctx.leaf()
                ),
            )
        } else if expected.contains("string") {
            (
                "text in quotes".to_string(),
                format!("text in quotes, e.g. {} = \"...\"", ctx.leaf()),
            )
        } else {
            (
                plain_expected(expected).unwrap_or_default(),
                NUMBER_FORM.to_string(),
            )
        };
        Issue {
            field: ctx.path(),
            problem: format!("expected {what}, found {found}"),
            accepted: Some(accepted),
        }
    }

    fn bad_number(&self, ctx: &Context, head: &str, at: usize) -> Issue {
        let value = first_word(&self.value_text(ctx, at));
        if ctx.leaf() == "naca" {
            let digits: String = value.chars().filter(char::is_ascii_digit).collect();
            return Issue {
                field: ctx.path(),
                problem: format!(
                    "`{value}` is read as a number; a NACA designation is text and must be in \
                     quotes"
                ),
                accepted: Some(format!(
                    "naca = \"{}\" (4 or 5 digits in quotes)",
                    if digits.is_empty() { "0009" } else { &digits }
                )),
            };
        }
        let why = if head.contains("overflow") || head.contains("as i128") {
            " (too large)"
        } else if head.contains("leading zero") {
            " (a number cannot start with 0 unless it is 0 or 0.something)"
        } else {
            ""
        };
        Issue {
            field: ctx.path(),
            problem: format!("`{value}` is not a number{why}"),
            accepted: Some(NUMBER_FORM.to_string()),
        }
    }

    fn unquoted(&self, ctx: &Context, at: usize) -> Issue {
        let value = first_word(&self.value_text(ctx, at));
        if value.is_empty() {
            return Issue {
                field: ctx.path(),
                problem: "no value after `=`".into(),
                accepted: Some(if TEXT_KEYS.contains(&ctx.leaf()) {
                    "text in quotes".into()
                } else {
                    NUMBER_FORM.into()
                }),
            };
        }
        let starts_like_number = value
            .chars()
            .next()
            .is_some_and(|c| c.is_ascii_digit() || "+-.".contains(c));
        if TEXT_KEYS.contains(&ctx.leaf()) {
            return Issue {
                field: ctx.path(),
                problem: format!("`{value}` is not in quotes; text must be"),
                accepted: Some(format!("\"{value}\"")),
            };
        }
        if starts_like_number {
            return Issue {
                field: ctx.path(),
                problem: format!(
                    "`{value}` is not a number; a value with a unit must be in quotes"
                ),
                accepted: Some(format!(
                    "\"{value}\" (in quotes), or a bare number in the key's default unit"
                )),
            };
        }
        Issue {
            field: ctx.path(),
            problem: format!("`{value}` is not a number (and text would need quotes)"),
            accepted: Some(NUMBER_FORM.to_string()),
        }
    }

    /// Something after a value on its line: often a decimal comma.
    fn after_value(&self, ctx: &Context, at: usize) -> Issue {
        let (_, line_end) = self.line_bounds(at);
        let before = ctx
            .value
            .as_ref()
            .map(|r| self.text[r.start..at].trim().to_string())
            .unwrap_or_default();
        let after = self.text[at..line_end].trim_end();
        let decimal_comma = before.parse::<f64>().is_ok()
            && after
                .strip_prefix(',')
                .is_some_and(|d| !d.is_empty() && d.chars().all(|c| c.is_ascii_digit()));
        if decimal_comma {
            let digits = &after[1..];
            return Issue {
                field: ctx.path(),
                problem: format!(
                    "`{before},{digits}` is not a number: the decimal mark is a point"
                ),
                accepted: Some(format!("{before}.{digits}")),
            };
        }
        Issue {
            field: ctx.path(),
            problem: format!("unexpected `{}` after the value", unexpected_text(after)),
            accepted: Some("one `key = value` on each line; after a value only a # comment".into()),
        }
    }
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

fn is_number_error(head: &str) -> bool {
    const NUMBER_ERRORS: [&str; 16] = [
        "invalid float",
        "invalid mantissa",
        "invalid exponent",
        "invalid fraction",
        "invalid integer number",
        "invalid hexadecimal number",
        "invalid octal number",
        "invalid binary number",
        "unexpected leading zero",
        "floating-point number overflowed",
        "`_` may only go between digits",
        "redundant numeric sign",
        "unexpected sign",
        "integers with a radix cannot be signed",
        "radix must be lowercase",
        "redundant integer number prefix",
    ];
    NUMBER_ERRORS.contains(&head)
        || (head.starts_with("invalid type: integer") && head.contains("as i128"))
}

/// The parser's problem in the file's terms, where it uses its own.
fn plain_problem(head: &str) -> String {
    match head {
        "invalid basic string" | "invalid literal string" => {
            "text in quotes is not closed on its line (or holds a bad \\ escape)".into()
        }
        "unclosed table" => "a `[table]` heading is not closed".into(),
        "unclosed array table" => "a `[[table]]` heading is not closed".into(),
        "unclosed inline table" => "an inline table `{ ... }` is not closed on its line".into(),
        // A bare word such as `TCL` or `yes`: the parser took it for a misspelt boolean.
        "invalid boolean" | "invalid string" => "a bare word is not a value".into(),
        other => other.to_string(),
    }
}

/// The parser's list of what it expected (`` `]` ``, `newline`, `nothing`), in plain words.
fn plain_expected(expected: &str) -> Option<String> {
    let items: Vec<String> = expected
        .split(", ")
        .map(str::trim)
        .filter(|x| !x.is_empty() && *x != "nothing")
        .map(|x| match x {
            "newline" => "the end of the line".to_string(),
            "literal string" | "basic string" => "text in quotes".to_string(),
            "`#`" => "a # comment".to_string(),
            "`\"`" | "`'`" => "a closing quote".to_string(),
            "`]`" | "`]]`" | "`}`" => format!("a closing {x}"),
            "`true`" | "`false`" => {
                "a number such as 12.5, or text in quotes such as \"12 mm\"".to_string()
            }
            other => other.to_string(),
        })
        .collect();
    (!items.is_empty()).then(|| items.join(" or "))
}

/// What an error may quote of the text after a value: its first character and the word
/// that follows it (`,5`, `mm`), cut as [`first_word`] cuts.
fn unexpected_text(after: &str) -> String {
    let mut chars = after.chars();
    match chars.next() {
        None => String::new(),
        Some(c) if c.is_alphanumeric() => first_word(after),
        Some(c) => {
            let rest = chars.as_str();
            let word = first_word(rest);
            let lead = token(&c.to_string());
            if rest.is_empty() || rest.starts_with(char::is_whitespace) {
                format!("{lead}{}", if rest.trim().is_empty() { "" } else { "..." })
            } else {
                format!("{lead}{word}")
            }
        }
    }
}
