//! `trimline section` (in progress).
use clap::Args;
/// Arguments of `section`.
#[derive(Debug, Args)]
pub struct SectionArgs {
    /// Airfoil specification.
    pub spec: String,
}
/// Run `section`.
pub fn run(_args: &SectionArgs) -> anyhow::Result<()> {
    anyhow::bail!("not yet")
}
