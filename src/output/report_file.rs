//! Writing the trim report to a file: analyse, lay out, then write atomically (a temporary
//! file in the destination folder, renamed over the destination), so an existing report is
//! never left half-written and a failed analysis writes nothing.

use crate::analysis::{analyse, Analysis, AnalysisError, AnalysisOptions};
use crate::model::Aircraft;
use crate::output::pdf::{self, Paper};
use crate::output::report::{self, ReportSource};
use std::io::Write as _;
use std::path::{Path, PathBuf};
use thiserror::Error;

/// Why a report could not be made.
#[derive(Debug, Error)]
pub enum ReportError {
    /// The analysis failed; nothing was written.
    #[error(transparent)]
    Analysis(#[from] AnalysisError),
    /// The file could not be written; an existing file at the path is unchanged.
    #[error("cannot write the report to {path}: {source}")]
    Write {
        /// Destination.
        path: PathBuf,
        /// The I/O error.
        #[source]
        source: std::io::Error,
    },
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

/// Analyse `aircraft` and write its report to `path` (folders created as needed); returns the
/// analysis the report was made from.
pub fn write_report(
    aircraft: &Aircraft,
    source: ReportSource,
    paper: Paper,
    path: &Path,
) -> Result<Analysis, ReportError> {
    let (bytes, analysis) = analysed_report(aircraft, source, paper)?;
    write_atomically(path, &bytes).map_err(|source| ReportError::Write {
        path: path.to_path_buf(),
        source,
    })?;
    Ok(analysis)
}

/// Write `bytes` to `path` through a temporary file in the same folder and a rename.
pub fn write_atomically(path: &Path, bytes: &[u8]) -> std::io::Result<()> {
    let dir = match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p.to_path_buf(),
        _ => PathBuf::from("."),
    };
    std::fs::create_dir_all(&dir)?;
    let name = path
        .file_name()
        .map(|n| n.to_string_lossy().into_owned())
        .unwrap_or_else(|| "report.pdf".to_string());
    let tmp = dir.join(format!(".{name}.{}.tmp", std::process::id()));
    let result = (|| {
        let mut f = std::fs::File::create(&tmp)?;
        f.write_all(bytes)?;
        f.sync_all()?;
        drop(f);
        std::fs::rename(&tmp, path)
    })();
    if result.is_err() {
        let _ = std::fs::remove_file(&tmp);
    }
    result
}
