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
    /// Aircraft file (TOML), or - for standard input; the built-in demo sailplane when
    /// omitted.
    pub file: Option<PathBuf>,
    /// Print one JSON object (SI units) instead of tables.
    #[arg(long)]
    pub json: bool,
    /// Analyse the named [[setup]] of the file instead of its base configuration.
    #[arg(long, value_name = "NAME")]
    pub setup: Option<String>,
    /// Exit with code 0 even when a danger-level caution is raised (otherwise 3).
    #[arg(long)]
    pub exit_zero_on_danger: bool,
    /// Units of the tables: metric (mm, g) or imperial (in, oz). Speeds stay in m/s and
    /// km/h; the cautions and the JSON keep their own units.
    #[arg(long, value_enum, default_value_t = UnitChoice::Metric)]
    pub unit_system: UnitChoice,
    /// Also write the glide polar (sink and glide ratio over the speed range) to this CSV
    /// file, SI units.
    #[arg(long, value_name = "PATH")]
    pub glide_csv: Option<PathBuf>,
    /// When the CSV's PATH is a symbolic link, write to the file it points to (refused
    /// otherwise).
    #[arg(long)]
    pub follow_link: bool,
}

/// `--unit-system` values.
#[derive(Debug, Clone, Copy, PartialEq, Eq, clap::ValueEnum)]
pub enum UnitChoice {
    /// mm, g, dm^2, g/dm^2.
    Metric,
    /// in, oz, in^2, oz/ft^2.
    Imperial,
}

impl From<UnitChoice> for trimline::output::units::UnitSystem {
    fn from(c: UnitChoice) -> Self {
        match c {
            UnitChoice::Metric => Self::Metric,
            UnitChoice::Imperial => Self::Imperial,
        }
    }
}

/// The aircraft with the named setup applied, or an error listing the setups there are.
pub fn with_setup(aircraft: Aircraft, setup: Option<&str>) -> anyhow::Result<Aircraft> {
    let Some(name) = setup else {
        return Ok(aircraft);
    };
    match aircraft.setups.iter().find(|s| s.name == name) {
        Some(s) => Ok(s.apply(&aircraft)),
        None => {
            let names: Vec<&str> = aircraft.setups.iter().map(|s| s.name.as_str()).collect();
            if names.is_empty() {
                anyhow::bail!("--setup {name}: the file has no [[setup]] tables")
            }
            anyhow::bail!(
                "--setup {name}: no such setup (the file has: {})",
                trimline::printable::name_list(&names)
            )
        }
    }
}

/// Load the aircraft named by `file`, or the demo; returns it with the name to show.
pub fn load(file: Option<&PathBuf>) -> anyhow::Result<(Aircraft, String)> {
    match file {
        Some(path) => {
            let (text, shown, base) = input::aircraft_file::read_aircraft_text(path)?;
            let aircraft = input::parse_aircraft(&text, &shown, Some(&base))?;
            Ok((aircraft, shown))
        }
        None => {
            let aircraft = input::parse_aircraft(DEMO_TEXT, DEMO_NAME, None)?;
            Ok((aircraft, DEMO_NAME.to_string()))
        }
    }
}

/// Run `check`.
pub fn run(args: &CheckArgs) -> anyhow::Result<super::Finish> {
    let (aircraft, source) = load(args.file.as_ref())?;
    let aircraft = with_setup(aircraft, args.setup.as_deref())?;

    let analysis = analyse(&aircraft, &AnalysisOptions::default())
        .with_context(|| format!("analysing {source}"))?;
    if let Some(path) = &args.glide_csv {
        let Some(p) = &analysis.glide_polar else {
            anyhow::bail!(
                "--glide-csv: no glide polar for this aircraft (see the cautions of `trimline check`); nothing was written"
            );
        };
        trimline::output::fs::write_file(
            path,
            trimline::output::tables::glide_csv(p).as_bytes(),
            &super::csv_write_options(args.follow_link, b"speed_m_s,sink_m_s,"),
        )
        .with_context(|| {
            format!(
                "writing {}",
                trimline::printable::printable(&path.display().to_string())
            )
        })?;
    }
    if args.json {
        let doc = trimline::output::json::check_document(&aircraft, &analysis, &source);
        super::emit(&format!("{}\n", serde_json::to_string_pretty(&doc)?))?;
    } else {
        super::emit(&trimline::output::tables::check_report(
            &aircraft,
            &analysis,
            &source,
            args.unit_system.into(),
        ))?;
    }
    Ok(super::Finish::from_dangers(
        super::dangers(&analysis),
        args.exit_zero_on_danger,
    ))
}
