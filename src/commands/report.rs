//! `trimline report`: analyse one aircraft file (or the built-in demo) and write the one-page
//! PDF trim report, atomically, to `reports/<file stem>.pdf` or the path given.

use anyhow::Context;
use clap::Args;
use std::path::PathBuf;
use std::time::{SystemTime, UNIX_EPOCH};
use trimline::input;
use trimline::output::pdf::Paper;
use trimline::output::report::{content_hash, ReportSource};
use trimline::output::report_file::write_report_with;
use trimline::printable::printable;

use super::check::DEMO_TEXT;

/// Stem of the demo's report file.
const DEMO_STEM: &str = "larkspire-2000";

/// Arguments of `report`.
#[derive(Debug, Args)]
pub struct ReportArgs {
    /// Aircraft file (TOML), or - for standard input; the built-in demo sailplane when
    /// omitted.
    pub file: Option<PathBuf>,
    /// Where to write the PDF (default: reports/<aircraft file stem>.pdf).
    #[arg(short = 'o', long = "output", value_name = "PATH")]
    pub output: Option<PathBuf>,
    /// US Letter paper instead of A4.
    #[arg(long)]
    pub letter: bool,
    /// When PATH is a symbolic link, write to the file it points to (refused otherwise).
    #[arg(long)]
    pub follow_link: bool,
    /// Exit with code 0 even when a danger-level caution is raised (otherwise 3, after the
    /// report is written).
    #[arg(long)]
    pub exit_zero_on_danger: bool,
}

/// Run `report`.
pub fn run(args: &ReportArgs) -> anyhow::Result<super::Finish> {
    let (aircraft, text, file_name, stem) = match &args.file {
        Some(path) => {
            let (text, shown, base) = input::aircraft_file::read_aircraft_text(path)?;
            let aircraft = input::parse_aircraft(&text, &shown, Some(&base))?;
            let from_stdin = path.as_os_str() == "-";
            let name = match path.file_name() {
                Some(n) if !from_stdin => printable(&n.to_string_lossy()).into_owned(),
                _ => shown.clone(),
            };
            let stem = match path.file_stem() {
                Some(s) if !from_stdin => s.to_string_lossy().into_owned(),
                _ => "standard-input".to_string(),
            };
            (aircraft, text, name, stem)
        }
        None => {
            let aircraft = input::parse_aircraft(DEMO_TEXT, super::check::DEMO_NAME, None)?;
            (
                aircraft,
                DEMO_TEXT.to_string(),
                "built-in demo (aircraft/larkspire-2000.toml)".to_string(),
                DEMO_STEM.to_string(),
            )
        }
    };
    let out = args
        .output
        .clone()
        .unwrap_or_else(|| PathBuf::from("reports").join(format!("{stem}.pdf")));
    let source = ReportSource {
        file_name,
        content_hash: content_hash(&text),
        date: today_utc(),
    };
    let paper = if args.letter {
        Paper::Letter
    } else {
        Paper::A4
    };
    let analysis = write_report_with(
        &aircraft,
        source,
        paper,
        &out,
        &super::pdf_write_options(args.follow_link),
    )
    .with_context(|| format!("making the report for {}", aircraft.name))?;
    super::emit(&summary(&aircraft, &analysis))?;
    super::emit(&format!(
        "Wrote the trim report for {} to {}\n",
        aircraft.name,
        printable(&out.display().to_string())
    ))?;
    Ok(super::Finish::from_dangers(
        super::dangers(&analysis),
        args.exit_zero_on_danger,
    ))
}

/// A few lines of the key figures, for the terminal.
fn summary(aircraft: &trimline::model::Aircraft, a: &trimline::analysis::Analysis) -> String {
    use trimline::output::tables::num;
    let k = trimline::analysis::KeyFigures::of(aircraft, a);
    let mm = |x: f64| num((x - k.wing_root_le_x_m) * 1000.0, 0);
    let trim = k.trim_speed_m_s.map_or("no trim found".to_string(), |v| {
        format!("trim speed {} m/s", num(v, 1))
    });
    let mut out = format!(
        "{}: CG {} the wing root leading edge (recommended {} to {} mm{}), \
         static margin {} %, {}, stall speed {} m/s.\n",
        aircraft.name,
        trimline::output::mm_aft_or_ahead(k.cg_x_m - k.wing_root_le_x_m),
        mm(k.band.forward_x_m),
        mm(k.band.aft_x_m),
        if k.band.forward_x_m < k.wing_root_le_x_m {
            ", negative is ahead of it"
        } else {
            ""
        },
        num(100.0 * k.static_margin, 1),
        trim,
        num(k.stall_speed_m_s, 1)
    );
    if k.dangers + k.warnings > 0 {
        let codes: Vec<&str> = k.caution_codes.iter().map(|c| c.1).collect();
        out.push_str(&format!(
            "{} danger(s), {} warning(s): {}. Run `trimline check` for the full messages.\n",
            k.dangers,
            k.warnings,
            codes.join(", ")
        ));
    }
    out
}

/// Today's date (UTC) as YYYY-MM-DD; `SOURCE_DATE_EPOCH` (seconds), when set, is used instead
/// of the clock so reports can be reproduced byte for byte.
pub fn today_utc() -> String {
    let secs = std::env::var("SOURCE_DATE_EPOCH")
        .ok()
        .and_then(|s| s.trim().parse::<i64>().ok())
        .unwrap_or_else(|| {
            SystemTime::now()
                .duration_since(UNIX_EPOCH)
                .map(|d| d.as_secs() as i64)
                .unwrap_or(0)
        });
    let (y, m, d) = civil_from_days(secs.div_euclid(86_400));
    format!("{y:04}-{m:02}-{d:02}")
}

/// Proleptic Gregorian date of day `z` counted from 1970-01-01 (H. Hinnant, "chrono-Compatible
/// Low-Level Date Algorithms", algorithm `civil_from_days`).
fn civil_from_days(z: i64) -> (i64, u32, u32) {
    let z = z + 719_468;
    let era = z.div_euclid(146_097);
    let doe = z.rem_euclid(146_097);
    let yoe = (doe - doe / 1460 + doe / 36_524 - doe / 146_096) / 365;
    let y = yoe + era * 400;
    let doy = doe - (365 * yoe + yoe / 4 - yoe / 100);
    let mp = (5 * doy + 2) / 153;
    let d = (doy - (153 * mp + 2) / 5 + 1) as u32;
    let m = if mp < 10 { mp + 3 } else { mp - 9 } as u32;
    (if m <= 2 { y + 1 } else { y }, m, d)
}

#[cfg(test)]
mod tests {
    use super::civil_from_days;

    // Known dates: 1970-01-01 is day 0; 2000-03-01 is day 11017; 2024-02-29 is day 19782.
    #[test]
    fn days_convert_to_calendar_dates() {
        assert_eq!(civil_from_days(0), (1970, 1, 1));
        assert_eq!(civil_from_days(11_017), (2000, 3, 1));
        assert_eq!(civil_from_days(19_782), (2024, 2, 29));
        assert_eq!(civil_from_days(-1), (1969, 12, 31));
    }
}
