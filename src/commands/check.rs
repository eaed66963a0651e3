//! `trimline check`: analyse one aircraft file (or the built-in demo) and print tables or JSON.

use anyhow::Context;
use clap::Args;
use std::path::PathBuf;
use trimline::analysis::{analyse, AnalysisOptions};
use trimline::input;
use trimline::model::Aircraft;

/// The built-in demo aircraft, analysed when no file is given.
pub const DEMO_TEXT: &str = include_str!("../../aircraft/larkspire-2000.toml");
/// How the demo is named in output.
pub const DEMO_NAME: &str = "<built-in demo: aircraft/larkspire-2000.toml>";

/// Arguments of `check`.
#[derive(Debug, Args)]
pub struct CheckArgs {
    /// Aircraft file (TOML); the built-in demo sailplane when omitted.
    pub file: Option<PathBuf>,
    /// Print one JSON object (SI units) instead of tables.
    #[arg(long)]
    pub json: bool,
}

/// Load the aircraft named by `file`, or the demo; returns it with the name to show.
pub fn load(file: Option<&PathBuf>) -> anyhow::Result<(Aircraft, String)> {
    match file {
        Some(path) => {
            let aircraft = input::load_aircraft_file(path)?;
            Ok((aircraft, path.display().to_string()))
        }
        None => {
            let aircraft = input::parse_aircraft(DEMO_TEXT, DEMO_NAME, None)?;
            Ok((aircraft, DEMO_NAME.to_string()))
        }
    }
}

/// Run `check`.
pub fn run(args: &CheckArgs) -> anyhow::Result<()> {
    let (aircraft, source) = load(args.file.as_ref())?;
    let analysis = analyse(&aircraft, &AnalysisOptions::default())
        .with_context(|| format!("analysing {source}"))?;
    if args.json {
        let doc = trimline::output::json::check_document(&aircraft, &analysis, &source);
        println!("{}", serde_json::to_string_pretty(&doc)?);
    } else {
        print!(
            "{}",
            trimline::output::tables::check_report(&aircraft, &analysis, &source)
        );
    }
    Ok(())
}
