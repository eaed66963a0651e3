//! `trimline sweep`: a trade study over one or two quantities (CG, ballast, a mass item,
//! every mass, stabiliser incidence or decalage), as a table, CSV or JSON.

use anyhow::{bail, Context};
use clap::Args;
use std::path::PathBuf;
use trimline::analysis::AnalysisOptions;
use trimline::model::Aircraft;
use trimline::output::fs::write_file;
use trimline::printable::{name_list, printable};
use trimline::study::{Axis, Quantity, Study, MAX_POINTS};

/// Arguments of `sweep`.
#[derive(Debug, Args)]
pub struct SweepArgs {
    /// Aircraft file (TOML), or - for standard input; the built-in demo sailplane when
    /// omitted.
    pub file: Option<PathBuf>,
    /// A quantity and its values, QUANTITY=VALUES; give it once or twice. QUANTITY is one of
    /// cg (CG x, mm), ballast:BAY (g), mass:ITEM (g), x:ITEM (mm), mass-scale (factor on
    /// every mass), stab-incidence (deg), decalage (deg); VALUES is start:stop:step or a
    /// comma list, e.g. cg=60:90:2 or ballast:nose=0,20,40.
    #[arg(
        long = "vary",
        value_name = "QUANTITY=VALUES",
        required = true,
        allow_hyphen_values = true
    )]
    pub vary: Vec<String>,
    /// Target speed, m/s, for the elevator (or elevons) to trim there (default: the file's
    /// trim speed target, if any).
    #[arg(long, value_name = "M/S")]
    pub speed: Option<f64>,
    /// Study the named [[setup]] of the file instead of its base configuration.
    #[arg(long, value_name = "NAME")]
    pub setup: Option<String>,
    /// Print one JSON document (units of check --json: SI, angles in deg, margin in %) instead
    /// of the table.
    #[arg(long)]
    pub json: bool,
    /// Also compute the glide polar at every point and give its least sink and best glide
    /// (slower: about a millisecond or more a point).
    #[arg(long)]
    pub glide: bool,
    /// Also write every point to this CSV file (same units as the JSON).
    #[arg(long, value_name = "PATH")]
    pub csv: Option<PathBuf>,
    /// When the CSV's PATH is a symbolic link, write to the file it points to (refused
    /// otherwise).
    #[arg(long)]
    pub follow_link: bool,
}

/// Accepted form of `--vary`, quoted in its errors.
const ACCEPTED: &str = "QUANTITY=VALUES with QUANTITY cg, ballast:BAY, mass:ITEM, x:ITEM, \
mass-scale, stab-incidence or decalage, and VALUES start:stop:step or a comma list \
(e.g. cg=60:90:2, ballast:nose=0,20,40)";

/// Fastest speed accepted by `--speed`, m/s (common practice: well beyond any model glider
/// or sport model; the limit only keeps the solves sane).
const MAX_SPEED_M_S: f64 = 150.0;

/// Run `sweep`.
pub fn run(args: &SweepArgs) -> anyhow::Result<super::Finish> {
    let (aircraft, source) = super::check::load(args.file.as_ref())?;
    let mut aircraft = super::check::with_setup(aircraft, args.setup.as_deref())?;
    if let Some(v) = args.speed {
        if !(v.is_finite() && v > 0.0 && v <= MAX_SPEED_M_S) {
            bail!("--speed {v}: the target speed must be above 0 and at most {MAX_SPEED_M_S} m/s");
        }
        aircraft.targets.trim_speed_m_s = Some(v);
    }
    let axes = args
        .vary
        .iter()
        .map(|spec| parse_axis(&aircraft, spec))
        .collect::<anyhow::Result<Vec<Axis>>>()?;
    let options = AnalysisOptions {
        flight_polar: args.glide,
        ..AnalysisOptions::default()
    };
    let study = Study::new(&aircraft, axes, options)
        .with_context(|| format!("preparing the study of {source}"))?;
    let points = run_points(&study);
    if let Some(path) = &args.csv {
        let text = trimline::output::study::csv(&aircraft, study.axes(), &points);
        write_file(
            path,
            text.as_bytes(),
            &super::csv_write_options(args.follow_link, b"index,"),
        )
        .context("writing the CSV file")?;
    }
    if args.json {
        let doc = trimline::output::study::document(&aircraft, &source, study.axes(), &points);
        super::emit(&format!("{}\n", serde_json::to_string_pretty(&doc)?))?;
    } else {
        super::emit(&format!(
            "Trade study of {} ({} points{})\n",
            printable(&aircraft.name),
            points.len(),
            aircraft
                .targets
                .trim_speed_m_s
                .map_or(String::new(), |v| format!(
                    ", control to trim at {v:.1} m/s"
                ))
        ))?;
        super::emit(&trimline::output::study::table(
            &aircraft,
            study.axes(),
            &points,
            aircraft.targets.trim_speed_m_s.is_some(),
        ))?;
    }
    // A study explores configurations that are meant to include bad ones: a danger at a
    // point is shown in its row and does not change the exit code.
    Ok(super::Finish::Clean)
}

/// A study runs with a progress bar on standard error when that is a terminal and the run
/// has taken longer than this (a shorter run finishes before a bar would be read).
const PROGRESS_AFTER: std::time::Duration = std::time::Duration::from_secs(1);

fn run_points(study: &Study<'_>) -> Vec<trimline::study::Point> {
    use indicatif::{ProgressBar, ProgressDrawTarget, ProgressStyle};
    use std::io::IsTerminal as _;
    let on_terminal = std::io::stderr().is_terminal();
    let bar = ProgressBar::with_draw_target(Some(study.len() as u64), ProgressDrawTarget::hidden());
    if let Ok(style) = ProgressStyle::with_template("{bar:40} {pos}/{len} points, {eta} left") {
        bar.set_style(style);
    }
    let start = std::time::Instant::now();
    let shown = std::sync::atomic::AtomicBool::new(false);
    let points = study.run(&|| {
        bar.inc(1);
        if on_terminal
            && start.elapsed() > PROGRESS_AFTER
            && !shown.swap(true, std::sync::atomic::Ordering::Relaxed)
        {
            bar.set_draw_target(ProgressDrawTarget::stderr());
        }
    });
    bar.finish_and_clear();
    points
}

/// Parse one `--vary` option into an axis in SI units.
pub fn parse_axis(aircraft: &Aircraft, spec: &str) -> anyhow::Result<Axis> {
    let shown = printable(spec);
    let Some((name, values)) = spec.rsplit_once('=') else {
        bail!("--vary {shown}: no '=' (accepted: {ACCEPTED})");
    };
    let name = name.trim();
    let (quantity, to_si) = match name.split_once(':') {
        None => match name {
            "cg" => (Quantity::CgX, 1e-3),
            "mass-scale" => (Quantity::MassScale, 1.0),
            "stab-incidence" => (Quantity::StabiliserIncidence, std::f64::consts::PI / 180.0),
            "decalage" => (Quantity::Decalage, std::f64::consts::PI / 180.0),
            _ => bail!(
                "--vary {shown}: unknown quantity '{}' (accepted: {ACCEPTED})",
                printable(name)
            ),
        },
        Some((kind, item)) => {
            let item = item.trim();
            let find_item = || {
                aircraft
                    .masses
                    .iter()
                    .position(|m| m.name == item)
                    .with_context(|| {
                        let names: Vec<&str> =
                            aircraft.masses.iter().map(|m| m.name.as_str()).collect();
                        format!(
                            "--vary {shown}: no mass item named '{}' (the file has: {})",
                            printable(item),
                            name_list(&names)
                        )
                    })
            };
            match kind.trim() {
                "ballast" => {
                    let bay = aircraft
                        .ballast_bays
                        .iter()
                        .position(|b| b.name == item)
                        .with_context(|| {
                            let names: Vec<&str> = aircraft
                                .ballast_bays
                                .iter()
                                .map(|b| b.name.as_str())
                                .collect();
                            if names.is_empty() {
                                format!("--vary {shown}: the file has no [[ballast]] bays")
                            } else {
                                format!(
                                    "--vary {shown}: no ballast bay named '{}' (the file has: {})",
                                    printable(item),
                                    name_list(&names)
                                )
                            }
                        })?;
                    (Quantity::Ballast(bay), 1e-3)
                }
                "mass" => (Quantity::ItemMass(find_item()?), 1e-3),
                "x" => (Quantity::ItemX(find_item()?), 1e-3),
                other => bail!(
                    "--vary {shown}: unknown quantity '{}:' (accepted: {ACCEPTED})",
                    printable(other)
                ),
            }
        }
    };
    let values: Vec<f64> = parse_values(values)
        .with_context(|| format!("--vary {shown}"))?
        .into_iter()
        .map(|(v, decimals)| in_si(&quantity, v, decimals, to_si))
        .collect();
    for &v in &values {
        trimline::study::check_value(aircraft, &quantity, v)
            .with_context(|| format!("--vary {shown}"))?;
    }
    Ok(Axis { quantity, values })
}

/// A value in the builder's unit, `decimals` decimals as written, in SI: mm and g are divided
/// by 1000 and rounded to 3 more decimals, so 574 mm is 0.574 m exactly as printed (not
/// 0.5740000000000001); degrees go to radians (the output turns them back without noise).
fn in_si(quantity: &Quantity, value: f64, decimals: Option<u32>, to_si: f64) -> f64 {
    if matches!(quantity.builder_unit().0, "mm" | "g") {
        match decimals {
            Some(d) => trimline::study::round_to_decimals(value / 1000.0, d + 3),
            None => value / 1000.0,
        }
    } else {
        value * to_si
    }
}

/// Parse `start:stop:step` or `a,b,c` (the builder's units): each value with the decimals it
/// is written to. A range's values are `start + i * step` rounded to the most decimals of its
/// start, stop and step as written, so `0:0.3:0.1` gives 0.3, not 0.30000000000000004.
fn parse_values(text: &str) -> anyhow::Result<Vec<(f64, Option<u32>)>> {
    let num = |t: &str| -> anyhow::Result<(f64, Option<u32>)> {
        t.trim()
            .parse::<f64>()
            .ok()
            .filter(|v| v.is_finite())
            .map(|v| (v, trimline::study::decimals_written(t)))
            .with_context(|| format!("'{}' is not a number (accepted: {ACCEPTED})", printable(t)))
    };
    if text.contains(':') {
        let parts = text
            .split(':')
            .map(num)
            .collect::<anyhow::Result<Vec<(f64, Option<u32>)>>>()?;
        let [(start, d0), (stop, d1), (step, d2)] = parts[..] else {
            bail!(
                "'{}' is not start:stop:step (accepted: {ACCEPTED})",
                printable(text)
            );
        };
        if step <= 0.0 || stop < start {
            bail!(
                "'{}' needs start <= stop and a step above 0 (accepted: {ACCEPTED})",
                printable(text)
            );
        }
        let steps = ((stop - start) / step + 1e-9).floor();
        if steps + 1.0 > MAX_POINTS as f64 {
            bail!(
                "'{}' gives {} values; a study runs at most {MAX_POINTS} points",
                printable(text),
                steps + 1.0
            );
        }
        let decimals = d0.zip(d1).zip(d2).map(|((a, b), c)| a.max(b).max(c));
        Ok((0..=steps as usize)
            .map(|i| {
                let v = start + step * i as f64;
                match decimals {
                    Some(d) => (trimline::study::round_to_decimals(v, d), Some(d)),
                    None => (v, None),
                }
            })
            .collect())
    } else {
        let values = text
            .split(',')
            .map(num)
            .collect::<anyhow::Result<Vec<(f64, Option<u32>)>>>()?;
        if values.len() > MAX_POINTS {
            bail!(
                "{} values; a study runs at most {MAX_POINTS} points",
                values.len()
            );
        }
        Ok(values)
    }
}
