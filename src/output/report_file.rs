//! Writing the trim report to a file: analyse, lay out, then write through
//! [`crate::output::fs`] (atomic, link-safe), so an existing report is never left
//! half-written and a failed analysis writes nothing.

use crate::analysis::{analyse, Analysis, AnalysisError, AnalysisOptions};
use crate::model::Aircraft;
use crate::output::fs::{write_file, WriteError, WriteOptions};
use crate::output::pdf::{self, Paper};
use crate::output::report::{self, ReportSource};
use std::path::Path;
use thiserror::Error;

/// Why a report could not be made.
#[derive(Debug, Error)]
pub enum ReportError {
    /// The analysis failed; nothing was written.
    #[error(transparent)]
    Analysis(#[from] AnalysisError),
    /// The file could not be written; an existing file at the path is unchanged.
    #[error(transparent)]
    Write(#[from] WriteError),
}

/// Most ballast cases drawn on the report's sink chart.
pub const MAX_BALLAST_CASES: usize = 3;

/// The report for `aircraft` as PDF bytes.
pub fn report_pdf(
    aircraft: &Aircraft,
    source: ReportSource,
    paper: Paper,
) -> Result<Vec<u8>, AnalysisError> {
    Ok(analysed_report(aircraft, source, paper)?.0)
}

fn analysed_report(
    aircraft: &Aircraft,
    source: ReportSource,
    paper: Paper,
) -> Result<(Vec<u8>, Analysis), AnalysisError> {
    // The file's ballast cases overlaid on the sink chart (a case that fails to analyse is
    // left out; `compare` reports it), analysed beside the configuration itself.
    use rayon::prelude::*;
    let cases: Vec<&crate::model::Setup> = aircraft
        .setups
        .iter()
        .filter(|s| {
            s.changes
                .iter()
                .any(|c| matches!(c, crate::model::Change::Ballast { .. }))
        })
        .take(MAX_BALLAST_CASES)
        .collect();
    let (analysis, ballast) = rayon::join(
        || analyse(aircraft, &AnalysisOptions::default()),
        || -> Vec<(String, Analysis)> {
            cases
                .par_iter()
                .filter_map(|s| {
                    analyse(&s.apply(aircraft), &AnalysisOptions::default())
                        .ok()
                        .map(|a| (s.name.clone(), a))
                })
                .collect()
        },
    );
    let analysis = analysis?;
    let mut data = report::build(aircraft, &analysis, source);
    data.glide = report::glide_chart(&analysis, &ballast);
    Ok((pdf::trim_report(&data, paper), analysis))
}

/// Analyse `aircraft` and write its report to `path` (folders created as needed, a symbolic
/// link at `path` refused); returns the analysis the report was made from.
pub fn write_report(
    aircraft: &Aircraft,
    source: ReportSource,
    paper: Paper,
    path: &Path,
) -> Result<Analysis, ReportError> {
    write_report_with(aircraft, source, paper, path, &WriteOptions::default())
}

/// [`write_report`] with the file-writing options given (see [`crate::output::fs`]).
pub fn write_report_with(
    aircraft: &Aircraft,
    source: ReportSource,
    paper: Paper,
    path: &Path,
    options: &WriteOptions,
) -> Result<Analysis, ReportError> {
    let (bytes, analysis) = analysed_report(aircraft, source, paper)?;
    write_file(path, &bytes, options)?;
    Ok(analysis)
}
