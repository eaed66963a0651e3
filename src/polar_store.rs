//! Viscous polars and panel-method section figures kept between runs: a text file in the
//! user's cache folder, so that a second `check` of the same aircraft does not recompute its
//! section polars (the flight polar needs about a dozen of them) nor solve its sections by the
//! panel method again.
//!
//! The file holds one polar (a line starting `p`) or one section's figures (`f`) per line with
//! every number as the hexadecimal bits of its f64, so everything reads back exactly as it was
//! computed. The file's name carries a fingerprint of
//! the running program (its size and modification time): another build, which might compute
//! other numbers, never reads this build's polars. Any file that cannot be read, or any line
//! that does not decode, is ignored (the polars are then computed again); writing goes
//! through [`crate::output::fs`] (temporary file, then rename), so two runs at once cannot
//! leave a half-written file.
//!
//! Where: `$TRIMLINE_CACHE_DIR` when set (set it to `off` to keep nothing), else
//! `$XDG_CACHE_HOME/trimline`, else `$HOME/.cache/trimline`.

use std::path::{Path, PathBuf};

use crate::model::SectionMethod;
use crate::section::boundary_layer::TransitionCause;
use crate::section::cache::{FigureCache, FigureKey, PolarCache, PolarKey};
use crate::section::polar::{Polar, PolarEntry, PolarStatus, StallCause};
use crate::section::viscous::{SurfaceSummary, ViscousError, ViscousPoint};
use crate::section::SolutionFigures;

/// First line of a store file.
const HEADER: &str = "trimline stored results 2";
/// Most polars kept in a store file (the most recently written first).
pub const MAX_POLARS: usize = 2000;
/// Most section figures kept in a store file.
pub const MAX_FIGURES: usize = 2000;

/// The caches a store fills and keeps.
#[derive(Debug, Clone, Copy)]
pub struct Caches<'a> {
    /// Viscous polars.
    pub polars: &'a PolarCache,
    /// Panel-method section figures.
    pub figures: &'a FigureCache,
}

impl Caches<'static> {
    /// The caches shared by every caller in this process.
    pub fn shared() -> Caches<'static> {
        Caches {
            polars: PolarCache::shared(),
            figures: FigureCache::shared(),
        }
    }
}

impl Caches<'_> {
    /// True when this run computed something the store does not hold yet.
    pub fn computed_any(&self) -> bool {
        self.polars.computed() > 0 || self.figures.computed() > 0
    }
}

/// The store folder, or `None` when keeping polars is switched off or no folder is known.
pub fn folder() -> Option<PathBuf> {
    if let Some(dir) = std::env::var_os("TRIMLINE_CACHE_DIR") {
        if dir.is_empty() || dir == "off" {
            return None;
        }
        return Some(PathBuf::from(dir));
    }
    if let Some(x) = std::env::var_os("XDG_CACHE_HOME").filter(|x| !x.is_empty()) {
        return Some(PathBuf::from(x).join("trimline"));
    }
    std::env::var_os("HOME")
        .filter(|h| !h.is_empty())
        .map(|h| PathBuf::from(h).join(".cache").join("trimline"))
}

/// The fingerprint of the running program in store file names: its version, size and
/// modification time.
pub fn build_stamp() -> Option<String> {
    let exe = std::env::current_exe().ok()?;
    let meta = std::fs::metadata(exe).ok()?;
    let stamp = meta
        .modified()
        .ok()?
        .duration_since(std::time::UNIX_EPOCH)
        .ok()?
        .as_nanos();
    Some(format!(
        "{}-{:x}-{:x}",
        env!("CARGO_PKG_VERSION"),
        meta.len(),
        stamp
    ))
}

/// The store file of this build in `dir`.
pub fn file_in(dir: &Path) -> Option<PathBuf> {
    Some(dir.join(format!("polars-{}.txt", build_stamp()?)))
}

/// Load the polars and figures of `path` into `caches`; returns how many entries were read.
pub fn load(path: &Path, caches: &Caches<'_>) -> usize {
    let Ok(text) = std::fs::read_to_string(path) else {
        return 0;
    };
    let mut lines = text.lines();
    if lines.next() != Some(HEADER) {
        return 0;
    }
    let (mut polars, mut figures) = (Vec::new(), Vec::new());
    for line in lines {
        match line.split_once(' ') {
            Some(("p", rest)) => polars.extend(decode(rest)),
            Some(("f", rest)) => figures.extend(decode_figures(rest)),
            _ => {}
        }
    }
    let n = polars.len() + figures.len();
    caches.polars.preload(polars);
    caches.figures.preload(figures);
    n
}

/// Write every polar and figure of `caches` to `path` (at most [`MAX_POLARS`] and
/// [`MAX_FIGURES`]).
pub fn save(path: &Path, caches: &Caches<'_>) -> Result<(), crate::output::fs::WriteError> {
    let mut text = String::from(HEADER);
    text.push('\n');
    for (k, p) in caches.polars.snapshot().into_iter().take(MAX_POLARS) {
        if let Some(line) = encode(&k, &p) {
            text.push_str("p ");
            text.push_str(&line);
            text.push('\n');
        }
    }
    for (k, f) in caches.figures.snapshot().into_iter().take(MAX_FIGURES) {
        text.push_str("f ");
        text.push_str(&encode_figures(&k, &f));
        text.push('\n');
    }
    if let Some(dir) = path.parent() {
        let _ = std::fs::create_dir_all(dir);
    }
    crate::output::fs::write_file(path, text.as_bytes(), &Default::default())?;
    // Files of other builds are never read again by this one: remove them.
    if let (Some(dir), Some(own)) = (path.parent(), path.file_name()) {
        if let Ok(list) = std::fs::read_dir(dir) {
            for e in list.flatten() {
                let name = e.file_name();
                let n = name.to_string_lossy();
                if name != own && n.starts_with("polars-") && n.ends_with(".txt") {
                    let _ = std::fs::remove_file(e.path());
                }
            }
        }
    }
    Ok(())
}

/// Token writer.
struct Out(Vec<String>);

impl Out {
    fn u(&mut self, v: u64) {
        self.0.push(format!("{v:x}"));
    }
    fn f(&mut self, v: f64) {
        self.u(v.to_bits());
    }
    fn of(&mut self, v: Option<f64>) {
        match v {
            Some(x) => {
                self.u(1);
                self.f(x);
            }
            None => self.u(0),
        }
    }
    fn list(&mut self, v: &[u64]) {
        self.u(v.len() as u64);
        for x in v {
            self.u(*x);
        }
    }
    fn summary(&mut self, s: &SurfaceSummary) {
        self.of(s.transition_x_c);
        self.u(match s.transition_cause {
            None => 0,
            Some(TransitionCause::Amplification) => 1,
            Some(TransitionCause::LaminarSeparation) => 2,
            Some(TransitionCause::Trip) => 3,
        });
        self.of(s.michel_x_c);
        self.of(s.separation_x_c);
        self.f(s.theta_te);
        self.f(s.h_te);
        self.f(s.cd);
    }
    fn point(&mut self, p: &ViscousPoint) {
        for v in [p.alpha_rad, p.cl, p.cd, p.cm_quarter_chord] {
            self.f(v);
        }
        self.summary(&p.upper);
        self.summary(&p.lower);
        self.u(p.iterations as u64);
        self.f(p.residual);
    }
    fn pair(&mut self, v: Option<(f64, f64)>) {
        match v {
            Some((a, b)) => {
                self.u(1);
                self.f(a);
                self.f(b);
            }
            None => self.u(0),
        }
    }
}

/// One line for a polar; `None` when it holds an error kind the store does not keep.
fn encode(k: &PolarKey, p: &Polar) -> Option<String> {
    let mut o = Out(Vec::new());
    o.list(&k.shape);
    o.u(k.reynolds);
    o.u(k.n_crit);
    o.u(k.panels as u64);
    o.list(&k.alphas);
    o.f(p.reynolds);
    o.f(p.n_crit);
    o.u(p.entries.len() as u64);
    for e in &p.entries {
        o.f(e.alpha_rad);
        match &e.status {
            PolarStatus::Converged(pt) => {
                o.u(0);
                o.point(pt);
            }
            PolarStatus::PastStall(pt) => {
                o.u(1);
                o.point(pt);
            }
            PolarStatus::NotConverged(ViscousError::NotConverged {
                alpha_rad,
                residual,
                iterations,
            }) => {
                o.u(2);
                o.f(*alpha_rad);
                o.f(*residual);
                o.u(*iterations as u64);
            }
            PolarStatus::NotConverged(_) => return None,
            PolarStatus::BeyondStall => o.u(3),
        }
    }
    o.pair(p.cl_max);
    o.pair(p.cl_min);
    o.u(match p.stall_cause {
        StallCause::Separation => 0,
        StallCause::NotConverged => 1,
        StallCause::EndOfSweep => 2,
    });
    Some(o.0.join(" "))
}

/// Token reader.
struct In<'a>(std::str::SplitWhitespace<'a>);

impl In<'_> {
    fn u(&mut self) -> Option<u64> {
        u64::from_str_radix(self.0.next()?, 16).ok()
    }
    fn n(&mut self) -> Option<usize> {
        usize::try_from(self.u()?).ok()
    }
    fn f(&mut self) -> Option<f64> {
        Some(f64::from_bits(self.u()?))
    }
    fn of(&mut self) -> Option<Option<f64>> {
        match self.u()? {
            0 => Some(None),
            1 => Some(Some(self.f()?)),
            _ => None,
        }
    }
    fn list(&mut self) -> Option<Vec<u64>> {
        let n = self.n()?;
        if n > 100_000 {
            return None;
        }
        (0..n).map(|_| self.u()).collect()
    }
    fn summary(&mut self) -> Option<SurfaceSummary> {
        Some(SurfaceSummary {
            transition_x_c: self.of()?,
            transition_cause: match self.u()? {
                0 => None,
                1 => Some(TransitionCause::Amplification),
                2 => Some(TransitionCause::LaminarSeparation),
                3 => Some(TransitionCause::Trip),
                _ => return None,
            },
            michel_x_c: self.of()?,
            separation_x_c: self.of()?,
            theta_te: self.f()?,
            h_te: self.f()?,
            cd: self.f()?,
        })
    }
    fn point(&mut self) -> Option<ViscousPoint> {
        Some(ViscousPoint {
            alpha_rad: self.f()?,
            cl: self.f()?,
            cd: self.f()?,
            cm_quarter_chord: self.f()?,
            upper: self.summary()?,
            lower: self.summary()?,
            iterations: self.n()?,
            residual: self.f()?,
        })
    }
    fn pair(&mut self) -> Option<Option<(f64, f64)>> {
        match self.u()? {
            0 => Some(None),
            1 => Some(Some((self.f()?, self.f()?))),
            _ => None,
        }
    }
}

/// The polar of one line; `None` when the line does not decode completely.
fn decode(line: &str) -> Option<(PolarKey, Polar)> {
    let mut i = In(line.split_whitespace());
    let key = PolarKey {
        shape: i.list()?,
        reynolds: i.u()?,
        n_crit: i.u()?,
        panels: i.n()?,
        alphas: i.list()?,
    };
    let reynolds = i.f()?;
    let n_crit = i.f()?;
    let n = i.n()?;
    if n > 10_000 {
        return None;
    }
    let mut entries = Vec::with_capacity(n);
    for _ in 0..n {
        let alpha_rad = i.f()?;
        let status = match i.u()? {
            0 => PolarStatus::Converged(i.point()?),
            1 => PolarStatus::PastStall(i.point()?),
            2 => PolarStatus::NotConverged(ViscousError::NotConverged {
                alpha_rad: i.f()?,
                residual: i.f()?,
                iterations: i.n()?,
            }),
            3 => PolarStatus::BeyondStall,
            _ => return None,
        };
        entries.push(PolarEntry { alpha_rad, status });
    }
    let cl_max = i.pair()?;
    let cl_min = i.pair()?;
    let stall_cause = match i.u()? {
        0 => StallCause::Separation,
        1 => StallCause::NotConverged,
        2 => StallCause::EndOfSweep,
        _ => return None,
    };
    if i.0.next().is_some() {
        return None;
    }
    Some((
        key,
        Polar {
            reynolds,
            n_crit,
            entries,
            cl_max,
            cl_min,
            stall_cause,
        },
    ))
}

const METHODS: [SectionMethod; 4] = [
    SectionMethod::Exact,
    SectionMethod::Thin,
    SectionMethod::Panel,
    SectionMethod::Viscous,
];

/// One line (after its tag) for a section's figures.
fn encode_figures(k: &FigureKey, f: &SolutionFigures) -> String {
    let mut o = Out(Vec::new());
    o.list(&k.shape);
    o.u(k.panels as u64);
    o.u(METHODS.iter().position(|m| *m == f.method).unwrap_or(0) as u64);
    for v in [
        f.alpha_zero_lift_rad,
        f.cl_alpha_per_rad,
        f.cl_either_side.0,
        f.cl_either_side.1,
        f.cm_either_side.0,
        f.cm_either_side.1,
        f.cm_zero_lift,
    ] {
        o.f(v);
    }
    o.0.join(" ")
}

/// The figures of one line (after its tag); `None` when it does not decode completely.
fn decode_figures(line: &str) -> Option<(FigureKey, SolutionFigures)> {
    let mut i = In(line.split_whitespace());
    let key = FigureKey {
        shape: i.list()?,
        panels: i.n()?,
    };
    let method = *METHODS.get(i.n()?)?;
    let figures = SolutionFigures {
        method,
        alpha_zero_lift_rad: i.f()?,
        cl_alpha_per_rad: i.f()?,
        cl_either_side: (i.f()?, i.f()?),
        cm_either_side: (i.f()?, i.f()?),
        cm_zero_lift: i.f()?,
    };
    if i.0.next().is_some() {
        return None;
    }
    Some((key, figures))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_line_with_a_token_missing_or_extra_is_ignored() {
        let p = Polar {
            reynolds: 1e5,
            n_crit: 9.0,
            entries: vec![PolarEntry {
                alpha_rad: 0.1,
                status: PolarStatus::BeyondStall,
            }],
            cl_max: None,
            cl_min: Some((-0.5, -0.1)),
            stall_cause: StallCause::EndOfSweep,
        };
        let k = PolarKey {
            shape: vec![0, 50],
            reynolds: 1e5f64.to_bits(),
            n_crit: 9f64.to_bits(),
            panels: 160,
            alphas: vec![0.1f64.to_bits()],
        };
        let line = encode(&k, &p).unwrap();
        assert_eq!(decode(&line), Some((k, p)));
        assert_eq!(decode(&format!("{line} 1")), None);
        let short = line.rsplit_once(' ').unwrap().0;
        assert_eq!(decode(short), None);
        assert_eq!(decode("zz"), None);
    }
}
