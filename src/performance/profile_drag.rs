//! Section profile drag for the flight polar: cd(cl, Re) of each airfoil from viscous polars
//! computed on a fixed ladder of Reynolds numbers, or a flat-plate estimate where the viscous
//! method cannot give one.
//!
//! - The viscous polars come from the boundary layer on the panel method
//!   ([`crate::section::viscous`], [`crate::section::polar`]) through the shared
//!   [`PolarCache`], at Reynolds numbers on a ladder `10,000 x 2^k` (every rung the flight
//!   range of the stations using the airfoil touches, plus one either side), over angles on a
//!   fixed 1.5 deg grid covering the lift the wing model can ask for. Fixed rungs and angles
//!   mean that two configurations of one aircraft (another CG, a ballast case) reuse the same
//!   polars.
//! - Between rungs cd is interpolated linearly in log Re; along a polar linearly in cl between
//!   converged points (a chord above a convex cd(cl) curve: slightly high, the safe side for
//!   sink). Beyond the last converged point at either end the last two points' slope is
//!   continued and the lookup is flagged `beyond_polar`, so the flight polar can say that part
//!   of it rests on extrapolated drag.
//! - The flat-plate estimate (no rise of drag with lift) is the build-up of
//!   [`crate::performance::drag`] per unit planform area: `cd = Cf(Re) FF (1.977 + 0.52 t/c)`
//!   (Raymer, *Aircraft Design*, 6th ed., eqs. 12.25-12.27, 12.30 and sec. 7.9).
//!
//! # References
//! - B. W. McCormick, *Aerodynamics, Aeronautics and Flight Mechanics*, 2nd ed., ch. 4
//!   (profile drag of a wing as the span integral of section drag at the local lift
//!   coefficient: the strip method; from memory).

use std::sync::Arc;

use crate::model::Airfoil;
use crate::section::cache::PolarCache;
use crate::section::polar::Polar;
use crate::section::viscous::{ViscousSettings, MAX_REYNOLDS, MIN_REYNOLDS, MIN_VISCOUS_PANELS};
use crate::section::SectionError;

/// Lowest rung of the Reynolds-number ladder.
pub const LADDER_BASE: f64 = 1e4;
/// Ratio of one rung to the next.
pub const LADDER_RATIO: f64 = 2.0;
/// Spacing of the polar angles, deg.
pub const ANGLE_STEP_DEG: f64 = 1.5;
/// Transition setting used when the airfoil gives none (critical amplification factor 9, a
/// quiet wind tunnel; common practice for the e^N method).
pub const DEFAULT_N_CRIT: f64 = 9.0;

/// The rungs of the ladder that bracket `[re_low, re_high]`: the highest rung at or below
/// `re_low` to the lowest at or above `re_high`, kept inside the viscous method's range.
pub fn ladder_rungs(re_low: f64, re_high: f64) -> Vec<f64> {
    let lo = re_low.clamp(MIN_REYNOLDS, MAX_REYNOLDS);
    let hi = re_high.clamp(lo, MAX_REYNOLDS);
    let k_lo = ((lo / LADDER_BASE).ln() / LADDER_RATIO.ln() + 1e-9).floor() as i32;
    let k_hi = ((hi / LADDER_BASE).ln() / LADDER_RATIO.ln() - 1e-9).ceil() as i32;
    (k_lo.max(0)..=k_hi.max(k_lo.max(0)))
        .map(|k| (LADDER_BASE * LADDER_RATIO.powi(k)).min(MAX_REYNOLDS))
        .collect()
}

/// Angles of the drag polars, rad: the 1.5 deg grid points from just below `alpha_low_rad` to
/// just above `alpha_high_rad`.
pub fn polar_angles_rad(alpha_low_rad: f64, alpha_high_rad: f64) -> Vec<f64> {
    let step = ANGLE_STEP_DEG.to_radians();
    let k_lo = (alpha_low_rad / step).floor() as i32 - 1;
    let k_hi = (alpha_high_rad / step).ceil() as i32 + 1;
    (k_lo..=k_hi.max(k_lo + 2))
        .map(|k| (f64::from(k) * ANGLE_STEP_DEG).to_radians())
        .collect()
}

/// One section drag value.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DragLookup {
    /// Section drag coefficient.
    pub cd: f64,
    /// True when `cl` lay beyond the converged points of a polar (extrapolated).
    pub beyond_polar: bool,
}

/// Where an airfoil's profile drag comes from.
#[derive(Debug, Clone, PartialEq)]
pub enum SectionDrag {
    /// Viscous polars, in rising Reynolds number.
    Viscous {
        /// The polars on the ladder rungs.
        polars: Vec<Arc<Polar>>,
        /// Their drag curves, parallel.
        curves: Vec<DragCurve>,
    },
    /// The flat-plate estimate (no drag rise with lift).
    FlatPlate {
        /// Thickness ratio of the section.
        thickness_ratio: f64,
        /// Why the viscous polars could not be used.
        reason: String,
    },
}

/// The drag curve of one polar: (cl, cd, past stall) of its converged points and of the
/// first point past the separation criterion, in rising cl up to the lift peak.
#[derive(Debug, Clone, PartialEq)]
pub struct DragCurve {
    /// Chord Reynolds number.
    pub reynolds: f64,
    /// Its natural logarithm (kept: the lookups interpolate in log Re).
    pub ln_reynolds: f64,
    /// The points.
    pub points: Vec<(f64, f64, bool)>,
    /// cl of the last attached point when the branch ended at the separation criterion (the
    /// section's stall at this Reynolds number by the viscous method).
    pub separation_cl: Option<f64>,
    /// The points' cl alone, in the same (strictly rising) order: the lookups count the ones
    /// below a cl in one pass the compiler can vectorise, which is the binary search's answer.
    cls: Vec<f64>,
}

impl DragCurve {
    /// The curve of `polar`; `None` with fewer than two points.
    pub fn of(polar: &Polar) -> Option<DragCurve> {
        use crate::section::polar::{PolarStatus, StallCause};
        let mut all: Vec<(f64, f64, f64, bool)> = polar
            .entries
            .iter()
            .filter_map(|e| match &e.status {
                PolarStatus::Converged(p) => Some((e.alpha_rad, p.cl, p.cd, false)),
                PolarStatus::PastStall(p) => Some((e.alpha_rad, p.cl, p.cd, true)),
                _ => None,
            })
            .filter(|q| q.1.is_finite() && q.2.is_finite() && q.2 > 0.0)
            .collect();
        all.sort_by(|a, b| a.0.total_cmp(&b.0));
        // The rising run through the point nearest zero angle.
        let start = (0..all.len()).min_by(|&i, &j| all[i].0.abs().total_cmp(&all[j].0.abs()))?;
        let mut lo = start;
        while lo > 0 && all[lo - 1].1 < all[lo].1 {
            lo -= 1;
        }
        let mut hi = start;
        while hi + 1 < all.len() && all[hi + 1].1 > all[hi].1 {
            hi += 1;
        }
        let points: Vec<(f64, f64, bool)> = all[lo..=hi].iter().map(|q| (q.1, q.2, q.3)).collect();
        if points.len() < 2 {
            return None;
        }
        let separation_cl = (polar.stall_cause == StallCause::Separation)
            .then(|| polar.cl_max.map(|(cl, _)| cl))
            .flatten();
        Some(DragCurve {
            reynolds: polar.reynolds,
            ln_reynolds: polar.reynolds.ln(),
            cls: points.iter().map(|p| p.0).collect(),
            points,
            separation_cl,
        })
    }

    /// cd at `cl`, continued linearly beyond the ends (flagged), flagged too on a segment
    /// that reaches a point past the separation criterion.
    pub fn cd(&self, cl: f64) -> DragLookup {
        let pts = &self.points;
        let n = pts.len();
        let lerp =
            |a: (f64, f64, bool), b: (f64, f64, bool)| a.1 + (cl - a.0) * (b.1 - a.1) / (b.0 - a.0);
        if cl < pts[0].0 {
            return DragLookup {
                cd: lerp(pts[0], pts[1]).max(pts[0].1),
                beyond_polar: true,
            };
        }
        if cl > pts[n - 1].0 {
            return DragLookup {
                cd: lerp(pts[n - 2], pts[n - 1]).max(pts[n - 1].1),
                beyond_polar: true,
            };
        }
        // The points rise strictly in cl: the count below `cl` is where it would go.
        let below: usize = self.cls.iter().map(|&c| usize::from(c < cl)).sum();
        let k = below.clamp(1, n - 1);
        DragLookup {
            cd: lerp(pts[k - 1], pts[k]),
            beyond_polar: pts[k].2 || pts[k - 1].2,
        }
    }
}

impl SectionDrag {
    /// Section drag at lift coefficient `cl` and chord Reynolds number `reynolds`.
    pub fn cd(&self, cl: f64, reynolds: f64) -> DragLookup {
        match self {
            SectionDrag::FlatPlate {
                thickness_ratio, ..
            } => DragLookup {
                cd: flat_plate_cd(*thickness_ratio, reynolds),
                beyond_polar: false,
            },
            SectionDrag::Viscous { curves, .. } => {
                let re = reynolds.max(1.0);
                // The bracketing rungs; outside the ladder the end rung, flagged.
                let i = curves.partition_point(|p| p.reynolds <= re);
                let last = curves.len() - 1;
                let (a, b, f, outside) = match i {
                    0 => (0, 0, 0.0, true),
                    i if i > last => (last, last, 0.0, true),
                    i => {
                        let (la, lb) = (curves[i - 1].ln_reynolds, curves[i].ln_reynolds);
                        (i - 1, i, (re.ln() - la) / (lb - la), false)
                    }
                };
                let x = curves[a].cd(cl);
                // Outside the ladder both ends are one rung: the same lookup.
                let y = if b == a { x } else { curves[b].cd(cl) };
                DragLookup {
                    cd: (1.0 - f) * x.cd + f * y.cd,
                    beyond_polar: x.beyond_polar || y.beyond_polar || outside,
                }
            }
        }
    }

    /// The cl at which the viscous polars bracketing `reynolds` reach the separation
    /// criterion (interpolated in log Re; the lower of the two when only one separates);
    /// `None` for the flat plate or when neither polar ended by separation.
    pub fn separation_cl(&self, reynolds: f64) -> Option<f64> {
        let SectionDrag::Viscous { curves, .. } = self else {
            return None;
        };
        let i = curves.partition_point(|p| p.reynolds <= reynolds.max(1.0));
        let last = curves.len() - 1;
        let (a, b) = match i {
            0 => (0, 0),
            i if i > last => (last, last),
            i => (i - 1, i),
        };
        match (curves[a].separation_cl, curves[b].separation_cl) {
            (Some(x), Some(y)) if a != b => {
                let (ra, rb) = (curves[a].reynolds, curves[b].reynolds);
                let f = (reynolds / ra).ln() / (rb / ra).ln();
                Some((1.0 - f) * x + f * y)
            }
            (Some(x), Some(y)) => Some(x.min(y)),
            (Some(x), None) | (None, Some(x)) => Some(x),
            (None, None) => None,
        }
    }

    /// True for the flat-plate estimate.
    pub fn is_flat_plate(&self) -> bool {
        matches!(self, SectionDrag::FlatPlate { .. })
    }
}

/// Flat-plate section drag on planform area (both surfaces, form factor for thickness at 30 %
/// chord), see the module doc.
pub fn flat_plate_cd(thickness_ratio: f64, reynolds: f64) -> f64 {
    use crate::performance::drag::{cf_surface, form_factor_surface};
    cf_surface(reynolds.max(1e3))
        * form_factor_surface(thickness_ratio, 0.3)
        * (1.977 + 0.52 * thickness_ratio)
}

/// What the flight range asks of one airfoil.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct DragRequest {
    /// Lowest and highest chord Reynolds number of the stations using it.
    pub reynolds_range: (f64, f64),
    /// Lowest and highest section angle of attack the flight range can ask for, rad.
    pub alpha_range_rad: (f64, f64),
}

/// The profile-drag source of `airfoil` for `request`: viscous polars on the ladder rungs (at
/// `panels`, raised to the viscous method's minimum), or the flat-plate estimate with the
/// reason when a polar fails or has too few converged points. Polars are taken from `cache`.
pub fn section_drag(
    airfoil: &Airfoil,
    request: DragRequest,
    panels: usize,
    cache: &PolarCache,
) -> SectionDrag {
    let rungs = ladder_rungs(request.reynolds_range.0, request.reynolds_range.1);
    let alphas = polar_angles_rad(request.alpha_range_rad.0, request.alpha_range_rad.1);
    let n_crit = airfoil.transition_n.unwrap_or(DEFAULT_N_CRIT);
    let fallback = |reason: String| SectionDrag::FlatPlate {
        thickness_ratio: crate::section::thickness_ratio(airfoil),
        reason,
    };
    let results: Vec<Result<Arc<Polar>, SectionError>> = {
        use rayon::prelude::*;
        rungs
            .par_iter()
            .map(|re| {
                cache.polar(
                    airfoil,
                    ViscousSettings {
                        reynolds: *re,
                        n_crit,
                        panels: panels.max(MIN_VISCOUS_PANELS),
                    },
                    &alphas,
                )
            })
            .collect()
    };
    let mut polars = Vec::with_capacity(results.len());
    let mut curves = Vec::with_capacity(results.len());
    for r in results {
        match r {
            Ok(p) if p.points().filter(|q| q.cl.is_finite()).count() >= 3 => {
                match DragCurve::of(&p) {
                    Some(c) => curves.push(c),
                    None => {
                        return fallback(format!(
                            "the viscous polar at Re {:.0} has no rising lift curve",
                            p.reynolds
                        ))
                    }
                }
                polars.push(p);
            }
            Ok(p) => {
                return fallback(format!(
                    "the viscous polar at Re {:.0} converged at fewer than 3 angles",
                    p.reynolds
                ))
            }
            Err(e) => return fallback(e.to_string()),
        }
    }
    if polars.is_empty() {
        return fallback("no Reynolds number in the viscous method's range".into());
    }
    SectionDrag::Viscous { polars, curves }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn ladder_brackets_the_range() {
        let r = ladder_rungs(45_000.0, 200_000.0);
        assert_eq!(r, vec![40_000.0, 80_000.0, 160_000.0, 320_000.0]);
        // A range that falls on rungs takes them exactly.
        assert_eq!(ladder_rungs(40_000.0, 80_000.0), vec![40_000.0, 80_000.0]);
        // Below the method's range: clamped to its lowest Reynolds number.
        assert_eq!(ladder_rungs(10.0, 15_000.0), vec![10_000.0, 20_000.0]);
    }

    #[test]
    fn angles_cover_the_range_on_the_grid() {
        let a = polar_angles_rad((-2.0f64).to_radians(), 9.0f64.to_radians());
        let deg: Vec<f64> = a.iter().map(|x| x.to_degrees()).collect();
        assert!((deg[0] + 4.5).abs() < 1e-9, "{deg:?}");
        assert!((deg[deg.len() - 1] - 10.5).abs() < 1e-9, "{deg:?}");
    }

    #[test]
    fn lookup_finds_the_same_segment_as_a_binary_search() {
        let points = vec![
            (-0.3, 0.02, false),
            (0.1, 0.011, false),
            (0.4, 0.012, false),
            (0.9, 0.018, false),
            (1.1, 0.03, true),
        ];
        let curve = DragCurve {
            reynolds: 1e5,
            ln_reynolds: 1e5f64.ln(),
            cls: points.iter().map(|p| p.0).collect(),
            points: points.clone(),
            separation_cl: None,
        };
        for i in 0..=60 {
            let cl = -0.5 + 0.03 * f64::from(i);
            let k = points
                .partition_point(|p| p.0 < cl)
                .clamp(1, points.len() - 1);
            let (a, b) = (points[k - 1], points[k]);
            let got = curve.cd(cl);
            if (points[0].0..=points[4].0).contains(&cl) {
                let want = a.1 + (cl - a.0) * (b.1 - a.1) / (b.0 - a.0);
                assert_eq!(got.cd.to_bits(), want.to_bits(), "cl {cl}");
                assert_eq!(got.beyond_polar, a.2 || b.2, "cl {cl}");
            } else {
                assert!(got.beyond_polar);
            }
        }
    }

    #[test]
    fn flat_plate_falls_with_reynolds_number() {
        assert!(flat_plate_cd(0.1, 1e5) > flat_plate_cd(0.1, 1e6));
        assert!(flat_plate_cd(0.12, 2e5) > flat_plate_cd(0.06, 2e5));
    }
}
