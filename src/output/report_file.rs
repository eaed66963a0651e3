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
    let analysis = analyse(aircraft, &AnalysisOptions::default())?;
    let data = report::build(aircraft, &analysis, source);
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
