//! One module per subcommand: argument struct and the glue from arguments to library calls.

pub mod check;
pub mod compare;
pub mod new;
pub mod report;
pub mod section;

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
