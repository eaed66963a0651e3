//! The `trimline` command line: parse arguments, load, analyse, render, map errors to exit codes.
#![warn(clippy::too_many_lines)]
#![allow(clippy::print_stdout, clippy::print_stderr)]

mod commands;

use clap::{Parser, Subcommand};
use std::process::ExitCode;

/// Balance, trim and stall estimates for gliders and model aircraft.
#[derive(Debug, Parser)]
#[command(name = "trimline", version, about, long_about = None)]
struct Cli {
    #[command(subcommand)]
    command: Command,
}

#[derive(Debug, Subcommand)]
enum Command {
    /// Analyse one aircraft file (or the built-in demo): geometry, masses, balance, trim, stall.
    Check(commands::check::CheckArgs),
    /// Start a new aircraft file from one of the example aircraft.
    New(commands::new::NewArgs),
    /// Compare the key results of several aircraft files or named setups side by side.
    Compare(commands::compare::CompareArgs),
    /// Look at one airfoil: zero-lift angle, lift slope, moments, a table over angle of attack.
    Section(commands::section::SectionArgs),
    /// Write the one-page PDF trim report (A4, or US Letter with --letter).
    Report(commands::report::ReportArgs),
    /// Trade study: static margin, trim, control at a target speed and stall over one or two
    /// varied quantities (CG, ballast, a mass item, every mass, stabiliser incidence, decalage).
    Sweep(commands::sweep::SweepArgs),
}

/// Exit code when the command ran to the end but raised a danger-level caution.
const EXIT_DANGER: u8 = 3;

fn main() -> ExitCode {
    let cli = Cli::parse();
    // Viscous polars and section figures of earlier runs of this same build (see
    // `trimline::polar_store`).
    let folder = trimline::polar_store::folder();
    let store = folder.as_deref().and_then(trimline::polar_store::file_in);
    let caches = trimline::polar_store::Caches::shared();
    if let Some(path) = &store {
        trimline::polar_store::load(path, &caches);
    }
    // And the condensed vortex lattices (`trimline::lattice_store`), read when asked for.
    let lattices = trimline::lifting_line::lattice_cache::LatticeCache::shared();
    if let Some(dir) = &folder {
        trimline::lattice_store::install(dir, lattices);
    }
    let clean = |r: anyhow::Result<()>| r.map(|()| commands::Finish::Clean);
    let result = match cli.command {
        Command::Check(args) => commands::check::run(&args),
        Command::Compare(args) => commands::compare::run(&args),
        Command::New(args) => clean(commands::new::run(&args)),
        Command::Section(args) => clean(commands::section::run(&args)),
        Command::Report(args) => commands::report::run(&args),
        Command::Sweep(args) => commands::sweep::run(&args),
    };
    // Keep what this run computed; a store that cannot be written only costs time next run.
    if let (Some(path), true) = (&store, caches.computed_any()) {
        let _ = trimline::polar_store::save(path, &caches);
    }
    if let Some(dir) = &folder {
        let _ = trimline::lattice_store::save_computed(dir, lattices);
    }
    // Exit codes (README.md, "Exit codes"): 0 done, 1 an input, file or analysis error,
    // 2 a command-line usage error (clap), 3 done but a danger-level caution was raised.
    match result {
        Ok(commands::Finish::Clean) => ExitCode::SUCCESS,
        Ok(commands::Finish::Danger) => ExitCode::from(EXIT_DANGER),
        Err(err) => {
            // Anything quoted from a file or a path is shown with control characters escaped.
            eprintln!(
                "error: {}",
                trimline::printable::printable(&err.to_string())
            );
            for cause in err.chain().skip(1) {
                eprintln!(
                    "  caused by: {}",
                    trimline::printable::printable(&cause.to_string())
                );
            }
            ExitCode::from(1)
        }
    }
}
