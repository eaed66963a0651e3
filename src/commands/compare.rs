//! `trimline compare`: key results of several aircraft files, or of the named setups inside
//! them, side by side.

use anyhow::Context;
use clap::Args;
use std::path::PathBuf;
use trimline::analysis::{analyse, AnalysisOptions, KeyFigures};
use trimline::output::compare::CautionCodes;
use trimline::output::fs::write_file;
use trimline::output::pdf::compare_page::MAX_COLUMNS;
use trimline::output::pdf::Paper;

/// Arguments of `compare`.
#[derive(Debug, Args)]
pub struct CompareArgs {
    /// Aircraft files; each contributes its base configuration and every [[setup]] in it.
    /// With no file, the built-in demo and its setups.
    pub files: Vec<PathBuf>,
    /// Leave out the named setups: compare the files' base configurations only.
    #[arg(long)]
    pub base_only: bool,
    /// Print JSON instead of a table: the same figures in the SI units of `check --json`
    /// (m, kg, m/s, deg, as each key's name says), described in docs/json.md.
    #[arg(long)]
    pub json: bool,
    /// Also write a one-page comparison PDF: to PATH, or to
    /// reports/<first file's stem>-compare.pdf when no PATH is given.
    #[arg(long, value_name = "PATH", num_args = 0..=1)]
    pub pdf: Option<Option<PathBuf>>,
    /// US Letter paper for the PDF instead of A4.
    #[arg(long)]
    pub letter: bool,
    /// When the PDF's PATH is a symbolic link, write to the file it points to (refused
    /// otherwise).
    #[arg(long)]
    pub follow_link: bool,
    /// Exit with code 0 even when a configuration raises a danger-level caution (otherwise 3).
    #[arg(long)]
    pub exit_zero_on_danger: bool,
    /// Units of the table: metric (mm, g) or imperial (in, oz); the JSON stays SI and the
    /// PDF metric (their keys and labels name their units).
    #[arg(long, value_enum, default_value_t = super::check::UnitChoice::Metric)]
    pub unit_system: super::check::UnitChoice,
}

/// The configurations to compare with their source names, and their cautions in the same order.
pub type Configurations = (Vec<(KeyFigures, String)>, Vec<CautionCodes>);

/// Every configuration to compare, analysed: key figures and source name, and beside them (same
/// order) the level and code of every caution each configuration raised.
pub fn configurations(args: &CompareArgs) -> anyhow::Result<Configurations> {
    let mut loaded = Vec::new();
    if args.files.is_empty() {
        loaded.push(super::check::load(None)?);
    }
    for f in &args.files {
        loaded.push(super::check::load(Some(f))?);
    }
    let mut out = Vec::new();
    let mut cautions = Vec::new();
    for (aircraft, source) in loaded {
        let mut variants = vec![(aircraft.clone(), aircraft.name.clone())];
        if !args.base_only {
            variants.extend(
                aircraft
                    .setups
                    .iter()
                    .map(|s| (s.apply(&aircraft), s.name.clone())),
            );
        }
        // The configurations are independent: analysed in parallel over the cores, kept in
        // their order (the polar cache is shared, so a polar is computed once).
        use rayon::prelude::*;
        let figures: Vec<anyhow::Result<(KeyFigures, CautionCodes)>> = variants
            .par_iter()
            .map(|(v, column)| {
                let a = analyse(v, &AnalysisOptions::default())
                    .with_context(|| format!("analysing {} ({source})", v.name))?;
                let mut k = KeyFigures::of(v, &a);
                k.name = column.clone();
                let codes = a.cautions.iter().map(|c| (c.level, c.code)).collect();
                Ok((k, codes))
            })
            .collect();
        for k in figures {
            let (k, codes) = k?;
            out.push((k, source.clone()));
            cautions.push(codes);
        }
    }
    tell_apart_same_names(&mut out);
    let mut figures: Vec<KeyFigures> = out.iter().map(|c| c.0.clone()).collect();
    if trimline::analysis::to_common_reference(&mut figures) {
        for (c, k) in out.iter_mut().zip(figures) {
            c.0 = k;
        }
    }
    Ok((out, cautions))
}

/// Columns that would carry the same name (two files of the same aircraft, say) get their
/// file's name after it, or a number when the file is the same too.
fn tell_apart_same_names(out: &mut [(KeyFigures, String)]) {
    let names: Vec<String> = out.iter().map(|(k, _)| k.name.clone()).collect();
    for i in 0..out.len() {
        let same: Vec<usize> = (0..out.len()).filter(|&j| names[j] == names[i]).collect();
        if same.len() < 2 {
            continue;
        }
        let file = |j: usize| {
            std::path::Path::new(&out[j].1)
                .file_name()
                .map_or_else(|| out[j].1.clone(), |f| f.to_string_lossy().into_owned())
        };
        let files_differ = same.iter().filter(|&&j| file(j) == file(i)).count() == 1;
        out[i].0.name = if files_differ {
            format!("{} ({})", names[i], file(i))
        } else {
            let n = same.iter().position(|&j| j == i).unwrap_or(0) + 1;
            format!("{} ({n})", names[i])
        };
    }
}

/// Run `compare`.
pub fn run(args: &CompareArgs) -> anyhow::Result<super::Finish> {
    let (columns, cautions) = configurations(args)?;
    let dangers: usize = columns.iter().map(|c| c.0.dangers).sum();
    if columns.len() < 2 {
        anyhow::bail!(
            "nothing to compare: give two or more aircraft files, or a file with [[setup]] tables"
        );
    }
    if columns.len() > MAX_COLUMNS && args.pdf.is_some() {
        anyhow::bail!(
            "{} configurations do not fit on one comparison page (at most {MAX_COLUMNS}); \
             use --base-only or fewer files",
            columns.len()
        );
    }
    if let Some(pdf) = &args.pdf {
        write_comparison_pdf(args, pdf.as_ref(), &columns)?;
    }
    if args.json {
        let doc = trimline::output::compare::compare_json(&columns, &cautions);
        super::emit(&format!("{}\n", serde_json::to_string_pretty(&doc)?))?;
    } else {
        print_comparison(args, columns)?;
    }
    Ok(super::Finish::from_dangers(
        dangers,
        args.exit_zero_on_danger,
    ))
}

/// Write the one-page comparison PDF (to `pdf`, or to reports/STEM-compare.pdf).
fn write_comparison_pdf(
    args: &CompareArgs,
    pdf: Option<&PathBuf>,
    columns: &[(KeyFigures, String)],
) -> anyhow::Result<()> {
    let path = if let Some(p) = pdf {
        p.clone()
    } else {
        let stem = args
            .files
            .first()
            .and_then(|f| f.file_stem())
            .map(|s| s.to_string_lossy().into_owned())
            .unwrap_or_else(|| "larkspire-2000".to_string());
        PathBuf::from("reports").join(format!("{stem}-compare.pdf"))
    };
    let data = trimline::output::compare::compare_data(columns, super::report::today_utc());
    let paper = if args.letter {
        Paper::Letter
    } else {
        Paper::A4
    };
    let bytes = trimline::output::pdf::comparison_report(&data, paper);
    write_file(&path, &bytes, &super::pdf_write_options(args.follow_link))
        .context("writing the comparison PDF")?;
    eprintln!(
        "Wrote the comparison of {} setups to {}",
        columns.len(),
        trimline::printable::printable(&path.display().to_string())
    );
    Ok(())
}

/// Print the comparison table, with the datum note and the cautions raised per column.
fn print_comparison(args: &CompareArgs, columns: Vec<(KeyFigures, String)>) -> anyhow::Result<()> {
    let figures: Vec<KeyFigures> = columns.into_iter().map(|c| c.0).collect();
    let reference = if figures
        .first()
        .is_some_and(|k| k.datum == trimline::analysis::COMMON_REFERENCE)
    {
        "The files measure x from different datums: every position here is measured from \
         each aircraft's own wing MAC leading edge instead.\n"
    } else {
        ""
    };
    super::emit(&format!(
        "{}\n{reference}Values in brackets are differences from the first column; (=) means no change; \
         n/a: the figure does not exist there (no stabiliser, no elevons, no trim, or no \
         ballast bay that reaches the target).\n",
        trimline::output::compare::compare_table_in(&figures, args.unit_system.into())
    ))?;
    // Which warnings and dangers each column raised (`check --setup NAME` prints them).
    let mut named = String::new();
    for k in figures.iter().filter(|k| !k.caution_codes.is_empty()) {
        let codes: Vec<String> = k
            .caution_codes
            .iter()
            .map(|(l, c)| format!("{}:{c}", l.as_str()))
            .collect();
        named.push_str(&format!(
            "  {}: {}\n",
            trimline::printable::printable(&k.name),
            codes.join(" ")
        ));
    }
    if !named.is_empty() {
        super::emit(&format!(
            "Warnings and dangers raised (read them with `trimline check --setup NAME`):\n{named}"
        ))?;
    }
    Ok(())
}
