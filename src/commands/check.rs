//! `trimline check` (in progress).
use clap::Args;
/// Arguments of `check`.
#[derive(Debug, Args)]
pub struct CheckArgs {
    /// Aircraft file; the built-in demo when omitted.
    pub file: Option<std::path::PathBuf>,
    /// Print one JSON object instead of tables.
    #[arg(long)]
    pub json: bool,
}
/// Run `check`.
pub fn run(_args: &CheckArgs) -> anyhow::Result<()> {
    anyhow::bail!("not yet")
}
