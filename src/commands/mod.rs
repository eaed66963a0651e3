//! One module per subcommand: argument struct and the glue from arguments to library calls.

pub mod check;
pub mod compare;
pub mod new;
pub mod report;
pub mod section;
pub mod sweep;

/// How a command that ran to the end finished, for the exit code.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Finish {
    /// Nothing to signal: exit 0.
    Clean,
    /// A danger-level caution was raised (and `--exit-zero-on-danger` was not given): exit 3.
    Danger,
}

impl Finish {
    /// `Danger` when `dangers` > 0 and the user did not ask for exit code 0 regardless.
    pub fn from_dangers(dangers: usize, exit_zero_on_danger: bool) -> Finish {
        if dangers > 0 && !exit_zero_on_danger {
            Finish::Danger
        } else {
            Finish::Clean
        }
    }
}

/// Number of danger-level cautions of an analysis.
pub fn dangers(analysis: &trimline::analysis::Analysis) -> usize {
    analysis
        .cautions
        .iter()
        .filter(|c| c.level == trimline::caution::Level::Danger)
        .count()
}

/// How the commands write PDFs: as [`write_options`], and an existing file is replaced only if
/// it is a PDF (an aircraft file given as the output by mistake is refused).
pub fn pdf_write_options(follow_link: bool) -> trimline::output::fs::WriteOptions {
    trimline::output::fs::WriteOptions {
        replace_only_if_starts_with: Some(b"%PDF-"),
        ..write_options(follow_link)
    }
}

/// How the commands write a CSV whose header starts with `header`: as [`write_options`], and
/// an existing file is replaced only if it starts with the same header (a CSV this command
/// wrote before); an aircraft file or any other file given as the CSV by mistake is refused.
pub fn csv_write_options(
    follow_link: bool,
    header: &'static [u8],
) -> trimline::output::fs::WriteOptions {
    trimline::output::fs::WriteOptions {
        replace_only_if_starts_with: Some(header),
        ..write_options(follow_link)
    }
}

/// How the commands write files: atomically, a symbolic link at the target refused unless
/// `--follow-link` was given.
pub fn write_options(follow_link: bool) -> trimline::output::fs::WriteOptions {
    trimline::output::fs::WriteOptions {
        follow_link,
        ..trimline::output::fs::WriteOptions::default()
    }
}

/// Write `text` to standard output. A reader that has gone away (a closed pipe, as in
/// `trimline compare | head`) is not an error: the rest of the output is dropped quietly.
pub fn emit(text: &str) -> anyhow::Result<()> {
    use std::io::Write as _;
    let mut out = std::io::stdout().lock();
    match out.write_all(text.as_bytes()).and_then(|()| out.flush()) {
        Err(e) if e.kind() == std::io::ErrorKind::BrokenPipe => Ok(()),
        other => Ok(other?),
    }
}
