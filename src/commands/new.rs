//! `trimline new`: start an aircraft file from one of the example aircraft, to edit.

use anyhow::Context;
use clap::{Args, ValueEnum};
use std::path::PathBuf;
use trimline::output::fs::{write_file, Replace, WriteOptions};
use trimline::printable::printable;

/// Which example to start from.
#[derive(Debug, Clone, Copy, ValueEnum)]
pub enum Kind {
    /// A 2 m thermal sailplane with a conventional tail.
    Sailplane,
    /// A 1.4 m electric high-wing trainer.
    Trainer,
    /// A 900 mm swept flying wing.
    Wing,
    /// A 1.7 m thermal sailplane with a V-tail (ruddervators) and camber flaps.
    VTail,
}

/// Arguments of `new`.
#[derive(Debug, Args)]
pub struct NewArgs {
    /// Where to write the new aircraft file (an existing file is never overwritten).
    pub path: PathBuf,
    /// Which example aircraft to start from.
    #[arg(long, value_enum, default_value_t = Kind::Sailplane)]
    pub from: Kind,
}

/// Run `new`.
pub fn run(args: &NewArgs) -> anyhow::Result<()> {
    // Anything at the path (a file, a link, even a dangling one) is left alone.
    if std::fs::symlink_metadata(&args.path).is_ok() {
        anyhow::bail!(
            "{} already exists; choose another name (trimline new never overwrites a file)",
            printable(&args.path.display().to_string())
        );
    }
    let text = match args.from {
        Kind::Sailplane => super::check::DEMO_TEXT,
        Kind::Trainer => include_str!("../../aircraft/wrenfield-1400.toml"),
        Kind::Wing => include_str!("../../aircraft/skerrywing-900.toml"),
        Kind::VTail => include_str!("../../aircraft/merrowtail-1700.toml"),
    };
    let options = WriteOptions {
        follow_link: false,
        replace: Replace::Never,
        create_folders: true,
        replace_only_if_starts_with: None,
    };
    write_file(&args.path, text.as_bytes(), &options).context("writing the new aircraft file")?;
    let parts = match args.from {
        Kind::Wing => "wing, elevons",
        Kind::Sailplane | Kind::Trainer => "wing, stabiliser",
        Kind::VTail => "wing, flaps, V-tail stabiliser",
    };
    super::emit(&format!(
        "Wrote {}: edit the name, {parts}, airfoils and [[mass]] items (every key is \
         explained in aircraft/README.md), then run `trimline check {}`.\n",
        printable(&args.path.display().to_string()),
        printable(&args.path.display().to_string())
    ))?;
    Ok(())
}
