//! The `trimline` command line: parse arguments, load, analyse, render, map errors to exit codes.
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
}

fn main() -> ExitCode {
    let cli = Cli::parse();
    let result = match cli.command {
        Command::Check(args) => commands::check::run(&args),
        Command::Compare(args) => commands::compare::run(&args),
        Command::New(args) => commands::new::run(&args),
        Command::Section(args) => commands::section::run(&args),
        Command::Report(args) => commands::report::run(&args),
    };
    match result {
        Ok(()) => ExitCode::SUCCESS,
        Err(err) => {
            eprintln!("error: {err}");
            for cause in err.chain().skip(1) {
                eprintln!("  caused by: {cause}");
            }
            ExitCode::from(1)
        }
    }
}
