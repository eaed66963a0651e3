//! The wording of each kind of TOML reader error, once its place is known: a key given twice,
//! a value of the wrong kind, a number the reader refused, text without quotes, something
//! after a value; and the reader's own phrases put in plain words.

use super::*;

impl Source<'_> {
    /// The value's text at the offset, trimmed (empty if none).
    pub(super) fn value_text(&self, ctx: &Context, at: usize) -> String {
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

    pub(super) fn duplicate_key(&self, ctx: &Context, span: std::ops::Range<usize>) -> Issue {
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

    pub(super) fn wrong_kind(&self, ctx: &Context, head: &str, expected: &str) -> Issue {
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

    pub(super) fn bad_number(&self, ctx: &Context, head: &str, at: usize) -> Issue {
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

    pub(super) fn unquoted(&self, ctx: &Context, at: usize) -> Issue {
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
    pub(super) fn after_value(&self, ctx: &Context, at: usize) -> Issue {
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

pub(super) fn is_number_error(head: &str) -> bool {
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
pub(super) fn plain_problem(head: &str) -> String {
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
pub(super) fn plain_expected(expected: &str) -> Option<String> {
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
pub(super) fn unexpected_text(after: &str) -> String {
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
