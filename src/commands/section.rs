//! `trimline section`: one airfoil's zero-lift angle, lift slope, moments and a table over
//! angle of attack, from a NACA designation, Joukowski or Karman-Trefftz parameters, or a
//! coordinates file. The SPEC syntax is documented in docs/section.md.

use anyhow::{bail, Context};
use clap::{Args, ValueEnum};
use std::path::{Path, PathBuf};
use trimline::input::coordinates::read_coordinates_file;
use trimline::model::{Airfoil, AirfoilShape, SectionMethod};
use trimline::output::fs::write_file;
use trimline::output::section::{
    polar_csv, render_tables, render_viscous, surface_csv, to_json, SectionReport, ViscousReport,
};
use trimline::printable::printable;
use trimline::section::naca::NacaProfile;
use trimline::section::viscous::ViscousSettings;
use trimline::section::{analyse_section, sweep, viscous_polar, SectionOptions, SectionSolution};

/// Method choice on the command line.
#[derive(Debug, Clone, Copy, PartialEq, Eq, ValueEnum)]
pub enum MethodArg {
    /// Exact conformal-map solution (Joukowski and Karman-Trefftz only).
    Exact,
    /// Thin-airfoil theory on the mean line.
    Thin,
    /// Vortex panel method.
    Panel,
    /// Panel method with the boundary layer, at the first Reynolds number of --re.
    Viscous,
}

/// Arguments of `section`.
#[derive(Debug, Args)]
pub struct SectionArgs {
    /// Airfoil: naca2412 or naca23012 (any case); jouk:T/F (thickness and camber, % of chord,
    /// e.g. jouk:12/2); kt:T/F/A (Karman-Trefftz, A = trailing-edge angle in deg, e.g.
    /// kt:12/2/10); or a coordinates file.
    pub spec: String,
    /// Angles of attack, deg: a comma-separated list of values and start:stop:step ranges,
    /// e.g. -4,0,4 or -4:12:2 [default: -4:12:2].
    #[arg(long, allow_hyphen_values = true)]
    pub alpha: Option<String>,
    /// Method; the default is exact for Joukowski and Karman-Trefftz sections, panel otherwise
    /// (viscous needs --re: its summary is at the first Reynolds number).
    #[arg(long, value_enum)]
    pub method: Option<MethodArg>,
    /// Number of panels for the panel method (16 to 1000; an odd number is raised by one).
    #[arg(long, default_value_t = SectionOptions::default().panels)]
    pub panels: usize,
    /// Section cl_max to use for the stall limit (a conservative default otherwise).
    #[arg(long)]
    pub cl_max: Option<f64>,
    /// Print one JSON object instead of tables.
    #[arg(long)]
    pub json: bool,
    /// Write x/c, y/c and Cp at the first angle of attack to this CSV file.
    #[arg(long, value_name = "PATH")]
    pub csv: Option<PathBuf>,
    /// When the CSV's PATH is a symbolic link, write to the file it points to (refused
    /// otherwise).
    #[arg(long)]
    pub follow_link: bool,
    /// Chord Reynolds numbers for viscous polars (boundary layer on the panel method), a
    /// comma-separated list, e.g. 2e5 or 100000,200000,300000 (1e4 to 1e7).
    #[arg(long, value_name = "LIST")]
    pub re: Option<String>,
    /// Transition setting for the viscous polars: the critical amplification factor N of the
    /// e^N criterion (9 for calm air or a quiet tunnel, lower for turbulent air; 1 to 14).
    #[arg(long, value_name = "N", default_value_t = 9.0)]
    pub transition_n: f64,
    /// Write the viscous polars (needs --re) to this CSV file.
    #[arg(long, value_name = "PATH")]
    pub polar_csv: Option<PathBuf>,
}

/// Parses the --re list.
fn parse_re_list(text: &str) -> anyhow::Result<Vec<f64>> {
    let accepted = "a comma-separated list of chord Reynolds numbers from 1e4 to 1e7, e.g. 2e5 or 100000,200000";
    let mut out = Vec::new();
    for item in text.split(',').map(str::trim).filter(|s| !s.is_empty()) {
        let v: f64 = item
            .parse()
            .ok()
            .filter(|v: &f64| v.is_finite())
            .with_context(|| format!("'{item}' is not a number (accepted: {accepted})"))?;
        if !(trimline::section::viscous::MIN_REYNOLDS..=trimline::section::viscous::MAX_REYNOLDS)
            .contains(&v)
        {
            bail!("Reynolds number {item} is outside the accepted range 1e4 to 1e7");
        }
        out.push(v);
    }
    if out.is_empty() || out.len() > MAX_REYNOLDS_NUMBERS {
        bail!("--re needs 1 to {MAX_REYNOLDS_NUMBERS} values (accepted: {accepted})");
    }
    Ok(out)
}

/// Most Reynolds numbers in one `section` run.
const MAX_REYNOLDS_NUMBERS: usize = 10;

/// Most angles accepted in one table.
const MAX_ALPHAS: usize = 400;
/// Largest |angle of attack| accepted, deg (potential flow means nothing far beyond stall).
const MAX_ALPHA_DEG: f64 = 30.0;

/// Run `section`.
pub fn run(args: &SectionArgs) -> anyhow::Result<()> {
    let (airfoil, shape_text) = airfoil_from_spec(&args.spec, args)?;
    let alphas_deg =
        parse_alpha_list(args.alpha.as_deref().unwrap_or("-4:12:2")).context("reading --alpha")?;
    let options = SectionOptions {
        panels: args.panels,
    };
    let analysis = analyse_section(&airfoil, &options)
        .with_context(|| format!("analysing section '{}'", args.spec))?;
    let alphas_rad: Vec<f64> = alphas_deg.iter().map(|a| a.to_radians()).collect();
    let points = sweep(&analysis, &alphas_rad);
    let panels = match &analysis.solution {
        SectionSolution::Panel(p) => Some(p.panels()),
        _ => None,
    };
    let mut report = SectionReport::new(
        &airfoil.name,
        &shape_text,
        panels,
        &analysis.outcome,
        &points,
    );
    if args.polar_csv.is_some() && args.re.is_none() {
        bail!("--polar-csv needs --re (the Reynolds numbers of the polars)");
    }
    if let Some(list) = &args.re {
        for reynolds in parse_re_list(list).context("reading --re")? {
            let settings = ViscousSettings {
                reynolds,
                n_crit: args.transition_n,
                panels: args.panels,
            };
            let polar = viscous_polar(&airfoil, settings, &alphas_rad)
                .with_context(|| format!("viscous polar of '{}' at Re {reynolds:.0}", args.spec))?;
            report.viscous.push(ViscousReport::new(&polar));
        }
    }
    if !report.all_finite() {
        bail!(
            "the {} method gave a non-finite result for '{}'; try another method or panel count",
            report.method,
            args.spec
        );
    }
    if let Some(path) = &args.csv {
        let surface = analysis.solution.surface(alphas_rad[0]).with_context(|| {
            "thin-airfoil theory gives no surface pressures; use --method panel (or exact) with --csv"
        })?;
        if surface
            .iter()
            .any(|p| !(p.x_c.is_finite() && p.y_c.is_finite() && p.cp.is_finite()))
        {
            bail!("the surface pressures are not finite; the CSV was not written");
        }
        write_file(
            path,
            surface_csv(&surface).as_bytes(),
            &super::csv_write_options(args.follow_link, b"x_c,y_c,cp"),
        )
        .context("writing the CSV file")?;
    }
    if let Some(path) = &args.polar_csv {
        write_file(
            path,
            polar_csv(&report.viscous).as_bytes(),
            &super::csv_write_options(args.follow_link, b"reynolds,transition_n,"),
        )
        .with_context(|| format!("writing {}", printable(&path.display().to_string())))?;
    }
    if args.json {
        super::emit(&format!("{}\n", to_json(&report)?))?;
    } else {
        super::emit(&format!(
            "{}{}",
            render_tables(&report),
            render_viscous(&report.viscous)
        ))?;
    }
    Ok(())
}

/// The airfoil described by SPEC, and its shape in words.
fn airfoil_from_spec(spec: &str, args: &SectionArgs) -> anyhow::Result<(Airfoil, String)> {
    let method = args.method.map(|m| match m {
        MethodArg::Exact => SectionMethod::Exact,
        MethodArg::Thin => SectionMethod::Thin,
        MethodArg::Panel => SectionMethod::Panel,
        MethodArg::Viscous => SectionMethod::Viscous,
    });
    let reynolds = match &args.re {
        Some(list) => parse_re_list(list)
            .context("reading --re")?
            .first()
            .copied(),
        None => None,
    };
    let (name, shape, text) = parse_spec(spec)?;
    Ok((
        Airfoil {
            name,
            shape,
            cl_max: args.cl_max,
            method,
            reynolds,
            transition_n: Some(args.transition_n),
        },
        text,
    ))
}

/// Parses SPEC into (name, shape, description).
fn parse_spec(spec: &str) -> anyhow::Result<(String, AirfoilShape, String)> {
    let s = spec.trim();
    let lower = s.to_ascii_lowercase();
    if lower.starts_with("naca") && !Path::new(s).exists() {
        let profile = NacaProfile::parse(s).with_context(|| format!("reading SPEC '{spec}'"))?;
        let digits: String = s.chars().filter(|c| c.is_ascii_digit()).collect();
        let kind = match profile {
            NacaProfile::FourDigit { .. } => "four-digit",
            NacaProfile::FiveDigit { .. } => "five-digit",
        };
        return Ok((
            format!("NACA {digits}"),
            AirfoilShape::Naca(digits.clone()),
            format!("NACA {digits} ({kind})"),
        ));
    }
    for (prefix, is_kt) in [("jouk:", false), ("kt:", true)] {
        if let Some(rest) = lower.strip_prefix(prefix) {
            return conformal_spec(spec, prefix, rest, is_kt);
        }
    }
    let path = Path::new(s);
    if !path.exists() {
        bail!(
            "SPEC '{spec}' is not a NACA designation (naca2412, naca23012), a Joukowski or \
             Karman-Trefftz spec (jouk:12/2, kt:12/2/10) or an existing coordinates file"
        );
    }
    let (title, points) = read_coordinates_file(path)?;
    let stem = path
        .file_stem()
        .map(|s| printable(&s.to_string_lossy()).into_owned())
        .unwrap_or_else(|| s.to_string());
    let title = title.unwrap_or(stem);
    let text = format!(
        "coordinates from {} ({} points)",
        printable(&path.display().to_string()),
        points.len()
    );
    Ok((
        title.clone(),
        AirfoilShape::Coordinates { title, points },
        text,
    ))
}

/// A Joukowski (`jouk:T/F`) or Karman-Trefftz (`kt:T/F/A`) SPEC, `rest` being the text after
/// the prefix: (name, shape, description).
fn conformal_spec(
    spec: &str,
    prefix: &str,
    rest: &str,
    is_kt: bool,
) -> anyhow::Result<(String, AirfoilShape, String)> {
    let values = parse_numbers(rest).with_context(|| {
        format!(
            "reading SPEC '{spec}' (accepted: {})",
            if is_kt {
                "kt:T/F/A, thickness and camber in % of chord, trailing-edge angle in deg, e.g. kt:12/2/10"
            } else {
                "jouk:T/F, thickness and camber in % of chord, e.g. jouk:12/2"
            }
        )
    })?;
    let want = if is_kt { 3 } else { 2 };
    if values.len() != want {
        bail!(
            "SPEC '{spec}' has {} values; {} takes {want} separated by '/' (e.g. {})",
            values.len(),
            prefix.trim_end_matches(':'),
            if is_kt { "kt:12/2/10" } else { "jouk:12/2" }
        );
    }
    let (t, f) = (values[0] / 100.0, values[1] / 100.0);
    Ok(if is_kt {
        (
            format!("Karman-Trefftz {}/{}/{}", values[0], values[1], values[2]),
            AirfoilShape::KarmanTrefftz {
                thickness_ratio: t,
                camber_ratio: f,
                trailing_edge_angle_rad: values[2].to_radians(),
            },
            format!(
                "Karman-Trefftz, t/c {} %, f/c {} %, trailing-edge angle {} deg",
                values[0], values[1], values[2]
            ),
        )
    } else {
        (
            format!("Joukowski {}/{}", values[0], values[1]),
            AirfoilShape::Joukowski {
                thickness_ratio: t,
                camber_ratio: f,
            },
            format!("Joukowski, t/c {} %, f/c {} %", values[0], values[1]),
        )
    })
}

fn parse_numbers(text: &str) -> anyhow::Result<Vec<f64>> {
    text.split('/')
        .map(|t| {
            let v: f64 = t
                .trim()
                .parse()
                .with_context(|| format!("'{t}' is not a number"))?;
            if !v.is_finite() {
                bail!("'{t}' is not a finite number");
            }
            Ok(v)
        })
        .collect()
}

/// Parses `-4,0,4` and `-4:12:2` style lists (degrees).
fn parse_alpha_list(text: &str) -> anyhow::Result<Vec<f64>> {
    let accepted = "comma-separated degrees and start:stop:step ranges, e.g. -4,0,4 or -4:12:2";
    let mut out = Vec::new();
    for item in text.split(',').map(str::trim).filter(|s| !s.is_empty()) {
        let parts = item
            .split(':')
            .map(|p| {
                p.trim()
                    .parse::<f64>()
                    .ok()
                    .filter(|v| v.is_finite())
                    .with_context(|| format!("'{p}' is not a number (accepted: {accepted})"))
            })
            .collect::<anyhow::Result<Vec<f64>>>()?;
        match parts.as_slice() {
            [a] => out.push(*a),
            [start, stop, step] => {
                if *step <= 0.0 || stop < start {
                    bail!("range '{item}' needs start <= stop and a positive step (accepted: {accepted})");
                }
                let n = ((stop - start) / step + 1e-9).floor() as usize;
                if n >= MAX_ALPHAS {
                    bail!("range '{item}' gives more than {MAX_ALPHAS} angles");
                }
                out.extend((0..=n).map(|i| start + step * i as f64));
            }
            _ => bail!("'{item}' is neither a number nor start:stop:step (accepted: {accepted})"),
        }
        if out.len() > MAX_ALPHAS {
            bail!("more than {MAX_ALPHAS} angles of attack");
        }
    }
    if out.is_empty() {
        bail!("no angles of attack given (accepted: {accepted})");
    }
    if let Some(a) = out.iter().find(|a| a.abs() > MAX_ALPHA_DEG) {
        bail!("angle of attack {a} deg is outside the accepted range -{MAX_ALPHA_DEG} to {MAX_ALPHA_DEG} deg");
    }
    Ok(out)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn alpha_lists_and_ranges() {
        assert_eq!(parse_alpha_list("-4,0,4").unwrap(), vec![-4.0, 0.0, 4.0]);
        assert_eq!(
            parse_alpha_list("-2:2:1, 8").unwrap(),
            vec![-2.0, -1.0, 0.0, 1.0, 2.0, 8.0]
        );
        assert!(parse_alpha_list("1:0:1").is_err());
        assert!(parse_alpha_list("0:4:0").is_err());
        assert!(parse_alpha_list("abc").is_err());
        assert!(parse_alpha_list("nan").is_err());
        assert!(parse_alpha_list("45").is_err());
        assert!(parse_alpha_list("").is_err());
    }

    #[test]
    fn specs() {
        let (_, shape, _) = parse_spec("NACA23012").unwrap();
        assert_eq!(shape, AirfoilShape::Naca("23012".into()));
        let (_, shape, _) = parse_spec("jouk:12/2").unwrap();
        assert_eq!(
            shape,
            AirfoilShape::Joukowski {
                thickness_ratio: 0.12,
                camber_ratio: 0.02
            }
        );
        assert!(matches!(
            parse_spec("kt:12/2/10").unwrap().1,
            AirfoilShape::KarmanTrefftz { .. }
        ));
        assert!(parse_spec("jouk:12").is_err());
        assert!(parse_spec("kt:12/x/10").is_err());
        assert!(parse_spec("naca24x2").is_err());
        assert!(parse_spec("no-such-file.dat").is_err());
    }
}
