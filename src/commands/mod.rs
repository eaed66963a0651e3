//! One module per subcommand: argument struct and the glue from arguments to library calls.

pub mod check;
pub mod compare;
pub mod new;
pub mod report;
pub mod section;

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
