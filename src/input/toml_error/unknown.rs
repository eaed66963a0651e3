//! An unknown key or table name: where it hangs in the file (a misspelt table heading such as
//! `[[stabilser.panel]]` is an unknown key of its parent, not of the table above it), the
//! heading's name as written (without brackets, so a foreign file's line is never quoted
//! whole), and the accepted name closest to it.

use super::*;

/// Edit distance (insertions, deletions, substitutions and swaps of two neighbours) between
/// `a` and `b`, counted in characters.
fn edit_distance(a: &str, b: &str) -> usize {
    let a: Vec<char> = a.chars().collect();
    let b: Vec<char> = b.chars().collect();
    // d[i][j]: distance between a[..i] and b[..j].
    let mut d = vec![vec![0usize; b.len() + 1]; a.len() + 1];
    for (i, row) in d.iter_mut().enumerate() {
        row[0] = i;
    }
    for (j, cell) in d[0].iter_mut().enumerate() {
        *cell = j;
    }
    for i in 1..=a.len() {
        for j in 1..=b.len() {
            let cost = usize::from(a[i - 1] != b[j - 1]);
            let mut best = (d[i - 1][j] + 1)
                .min(d[i][j - 1] + 1)
                .min(d[i - 1][j - 1] + cost);
            if i > 1 && j > 1 && a[i - 1] == b[j - 2] && a[i - 2] == b[j - 1] {
                best = best.min(d[i - 2][j - 2] + 1);
            }
            d[i][j] = best;
        }
    }
    d[a.len()][b.len()]
}

/// Keys longer than this get no suggestion (the longest accepted key is far shorter).
const MAX_SUGGESTED_KEY_CHARS: usize = 64;

/// The accepted name closest to `key`, if it is close enough to be a slip of the keyboard:
/// at most 2 edits, and fewer than half the characters of the longer name.
pub(super) fn closest<'n>(key: &str, names: &[&'n str]) -> Option<&'n str> {
    // No accepted name is near this long: a hostile key of a megabyte gets no table of it.
    if key.chars().count() > MAX_SUGGESTED_KEY_CHARS {
        return None;
    }
    let lower = key.to_lowercase();
    names
        .iter()
        .map(|n| (edit_distance(&lower, &n.to_lowercase()), *n))
        .filter(|(d, n)| *d <= 2 && 2 * d < key.chars().count().max(n.chars().count()))
        .min_by_key(|(d, _)| *d)
        .map(|(_, n)| n)
}

/// The names between backticks in the reader's "one of `a`, `b`" list.
fn names_in(list: &str) -> Vec<&str> {
    list.split('`').skip(1).step_by(2).collect()
}

impl Source<'_> {
    /// The issue for key `key` refused by the reader at `at`; `expected` is the reader's list of
    /// accepted keys.
    pub(super) fn unknown_key(
        &self,
        ctx: &Context,
        key: &str,
        at: usize,
        expected: Option<&str>,
    ) -> Issue {
        // The reader shares one table type for the wing and the stabiliser; what only the
        // other one may have is not offered.
        let refused: &[&str] = match (ctx.table.as_str(), ctx.inline.is_empty()) {
            ("stabiliser", true) => &["elevons", "flap"],
            ("wing", true) => &[
                "role",
                "elevator_chord",
                "elevator_up",
                "elevator_down",
                "dynamic_pressure_ratio",
            ],
            _ => &[],
        };
        let names: Vec<&str> = expected
            .map(names_in)
            .unwrap_or_default()
            .into_iter()
            .filter(|n| !refused.contains(n))
            .collect();
        let hint = closest(key, &names)
            .map(|n| format!("; did you mean `{n}`?"))
            .unwrap_or_default();
        let accepted = expected.map(|x| {
            if x.starts_with("one of ") {
                let keys: Vec<String> = names.iter().map(|n| format!("`{n}`")).collect();
                format!("one of {}", keys.join(", "))
            } else {
                plain_expected(x).unwrap_or_default()
            }
        });
        let header = self
            .header_at(at)
            .filter(|h| ctx.on_header && h.start == ctx.line_start);
        match header {
            Some(h) => {
                // The heading's name as written, without its brackets (a whole line of a
                // foreign file is never quoted); a one-part heading is the key itself.
                let name = token(&h.name);
                let place = match (h.name.contains('.'), h.is_array) {
                    (false, _) => String::new(),
                    (true, true) => format!(" in the heading of the list `{name}`"),
                    (true, false) => format!(" in the heading `{name}`"),
                };
                Issue {
                    field: self.heading_path(h, key),
                    problem: format!("unknown table `{key}`{place}{hint}"),
                    accepted,
                }
            }
            None => Issue {
                field: ctx.path_with(key),
                problem: format!("unknown key `{key}`{hint}"),
                accepted,
            },
        }
    }

    /// The key path of part `key` of heading `h` (`stabilser` for `[[stabilser.panel]]`,
    /// `wing.flapp` for `[[wing.flapp]]`), parents that are lists given the index of their
    /// last entry before the heading.
    fn heading_path(&self, h: &Header, key: &str) -> String {
        let parts: Vec<&str> = h.name.split('.').collect();
        let upto = parts
            .iter()
            .position(|p| token(p) == key)
            .unwrap_or(parts.len().saturating_sub(1));
        let mut path = String::new();
        for i in 0..=upto {
            if !path.is_empty() {
                path.push('.');
            }
            path.push_str(&token(parts[i]));
            let prefix = parts[..=i].join(".");
            let entries = self
                .headers
                .iter()
                .filter(|g| g.is_array && g.name == prefix && g.start < h.start)
                .count();
            if i < upto && entries > 0 {
                path.push_str(&format!("[{}]", entries - 1));
            }
        }
        path
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_huge_key_gets_no_suggestion_and_no_huge_table() {
        let key = "root_chord".repeat(100_000);
        assert_eq!(closest(&key, &["root_chord", "tip_chord"]), None);
        assert_eq!(
            closest("root_chrd", &["root_chord", "tip_chord"]),
            Some("root_chord")
        );
    }

    #[test]
    // Optimal string alignment distance: Damerau, F. J. (1964), "A technique for computer
    // detection and correction of spelling errors", Comm. ACM 7(3), one edit per swap.
    fn distance_counts_swaps_as_one() {
        assert_eq!(edit_distance("tip_chrod", "tip_chord"), 1);
        assert_eq!(edit_distance("fuselarge", "fuselage"), 1);
        assert_eq!(edit_distance("", "abc"), 3);
        assert_eq!(closest("wing", &["wing"]), Some("wing"));
        assert_eq!(closest("xyz", &["fin", "air"]), None);
    }
}
