//! A section polar: cl, cd and cm over angle of attack at one Reynolds number and transition
//! setting, with the stall found from the viscous solution.
//!
//! The sweep ([`Polar::sweep`]) solves the viscous method at each angle given. Going up from
//! the angle nearest zero lift, the first angle that is stalled (turbulent separation ahead of
//! [`STALL_SEPARATION_X_C`] on either surface) or at which the coupling does not converge
//! ends the positive branch; the same going down ends the negative branch. cl_max is the
//! greatest cl of the converged, unstalled points of the positive branch and the stall angle
//! is its angle (the peak of cl over the sweep, so the result depends on the angle step:
//! 0.5 deg or finer is advised). Points outside the branches are kept with their status, so
//! that output can say "past stall" or "did not converge" instead of a number.
//!
//! The failure of the direct coupling near separation is itself a sign of stall (Veldman
//! 1981), but it is not a stall model: where the stall is found only because the coupling
//! stopped converging, [`StallCause::NotConverged`] says so and callers should caution.
//!
//! # References
//! - Veldman, A. E. P. (1981), AIAA Journal 19(1): direct iteration breaks down at separation.
//! - Common practice: cl_max taken as the peak of the computed lift curve.

#[cfg(doc)]
use crate::section::viscous::STALL_SEPARATION_X_C;
use crate::section::viscous::{ViscousError, ViscousPoint, ViscousSection};

/// Status of one angle of a polar.
#[derive(Debug, Clone, PartialEq)]
pub enum PolarStatus {
    /// Converged, attached enough to count.
    Converged(ViscousPoint),
    /// Converged, but the separation is past the stall criterion.
    PastStall(ViscousPoint),
    /// The coupling did not converge (the last residual is in the error).
    NotConverged(ViscousError),
    /// Beyond the first stalled or failed angle of its branch: not solved.
    BeyondStall,
}

/// What ended the positive branch.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StallCause {
    /// The separation criterion.
    Separation,
    /// The coupling stopped converging.
    NotConverged,
    /// The sweep ended before either: cl_max is at the sweep's last angle (a lower bound).
    EndOfSweep,
}

/// What the greatest cl of a polar's positive branch is ([`Polar::lift_peak`]).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PeakKind {
    /// A real maximum of the computed lift curve: a later angle of the branch converged (below
    /// or past the stall criterion) with a lower cl, so the curve turned over within the
    /// solution. Still the method's maximum, not a measured one (it runs high).
    Maximum,
    /// The greatest cl is that of the last converged angle of the branch, the curve still
    /// rising there: what came next ended the branch ([`StallCause`]), and the section's
    /// true maximum is not known from this polar. A lower bound of the computed curve's
    /// maximum when the cause is [`StallCause::EndOfSweep`]; with
    /// [`StallCause::NotConverged`] the point where the iteration failed; with
    /// [`StallCause::Separation`] the last angle before the separation criterion.
    LastConverged(StallCause),
}

/// The greatest cl of a polar's positive branch, its angle and what kind of value it is.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LiftPeak {
    /// Lift coefficient.
    pub cl: f64,
    /// Angle of attack, rad.
    pub alpha_rad: f64,
    /// Real maximum or last converged angle.
    pub kind: PeakKind,
}

/// One angle of a polar.
#[derive(Debug, Clone, PartialEq)]
pub struct PolarEntry {
    /// Angle of attack from the chord line, rad.
    pub alpha_rad: f64,
    /// Result.
    pub status: PolarStatus,
}

/// A polar at one Reynolds number and N.
#[derive(Debug, Clone, PartialEq)]
pub struct Polar {
    /// Chord Reynolds number.
    pub reynolds: f64,
    /// Critical amplification factor.
    pub n_crit: f64,
    /// Entries in rising angle.
    pub entries: Vec<PolarEntry>,
    /// Greatest cl of the positive branch and its angle (rad), if any point converged.
    pub cl_max: Option<(f64, f64)>,
    /// Least cl of the negative branch and its angle (rad).
    pub cl_min: Option<(f64, f64)>,
    /// What ended the positive branch.
    pub stall_cause: StallCause,
}

impl Polar {
    /// Solves `section` at each of `alphas_rad` (sorted here) as described in the module
    /// documentation.
    pub fn sweep(section: &ViscousSection, alphas_rad: &[f64]) -> Polar {
        let mut alphas: Vec<f64> = alphas_rad
            .iter()
            .copied()
            .filter(|a| a.is_finite())
            .collect();
        alphas.sort_by(f64::total_cmp);
        alphas.dedup();
        let mut entries: Vec<PolarEntry> = alphas
            .iter()
            .map(|&alpha_rad| PolarEntry {
                alpha_rad,
                status: PolarStatus::BeyondStall,
            })
            .collect();
        // Start at the angle nearest zero lift guess: the smallest |alpha|.
        let start = (0..alphas.len())
            .min_by(|&a, &b| alphas[a].abs().total_cmp(&alphas[b].abs()))
            .unwrap_or(0);
        let mut stall_cause = StallCause::EndOfSweep;
        let mut solve_branch = |range: Vec<usize>, up: bool, entries: &mut Vec<PolarEntry>| {
            for i in range {
                let status = match section.solve(alphas[i]) {
                    Ok(p) if p.is_stalled() => PolarStatus::PastStall(p),
                    Ok(p) => PolarStatus::Converged(p),
                    Err(e) => PolarStatus::NotConverged(e),
                };
                let stop = !matches!(status, PolarStatus::Converged(_));
                if stop && up {
                    stall_cause = if matches!(status, PolarStatus::PastStall(_)) {
                        StallCause::Separation
                    } else {
                        StallCause::NotConverged
                    };
                }
                entries[i].status = status;
                if stop {
                    break;
                }
            }
        };
        if !alphas.is_empty() {
            solve_branch((start..alphas.len()).collect(), true, &mut entries);
            solve_branch((0..start).rev().collect(), false, &mut entries);
        }
        let converged = |e: &PolarEntry| match &e.status {
            PolarStatus::Converged(p) => Some((p.cl, e.alpha_rad)),
            _ => None,
        };
        let cl_max = entries[start.min(entries.len())..]
            .iter()
            .filter_map(converged)
            .max_by(|a, b| a.0.total_cmp(&b.0));
        let cl_min = entries[..=start.min(entries.len().saturating_sub(1))]
            .iter()
            .filter_map(converged)
            .min_by(|a, b| a.0.total_cmp(&b.0));
        Polar {
            reynolds: section.settings().reynolds,
            n_crit: section.settings().n_crit,
            entries,
            cl_max,
            cl_min,
            stall_cause,
        }
    }

    /// The greatest cl of the positive branch ([`Polar::cl_max`]) with the distinction
    /// whether the computed lift curve turned over after it ([`PeakKind::Maximum`]) or it is
    /// just the last converged angle ([`PeakKind::LastConverged`]); `None` when no point of
    /// the positive branch converged.
    pub fn lift_peak(&self) -> Option<LiftPeak> {
        let (cl, alpha_rad) = self.cl_max?;
        // A converged solution (below or past the stall criterion) at a greater angle with a
        // lower cl: the curve turned over.
        let turned_over = self.entries.iter().any(|e| {
            e.alpha_rad > alpha_rad
                && match &e.status {
                    PolarStatus::Converged(p) | PolarStatus::PastStall(p) => p.cl < cl,
                    _ => false,
                }
        });
        let kind = if turned_over {
            PeakKind::Maximum
        } else {
            PeakKind::LastConverged(self.stall_cause)
        };
        Some(LiftPeak {
            cl,
            alpha_rad,
            kind,
        })
    }

    /// The converged, unstalled points in rising angle.
    pub fn points(&self) -> impl Iterator<Item = &ViscousPoint> {
        self.entries.iter().filter_map(|e| match &e.status {
            PolarStatus::Converged(p) => Some(p),
            _ => None,
        })
    }

    /// Least drag coefficient over the converged points and its cl.
    pub fn cd_min(&self) -> Option<(f64, f64)> {
        self.points()
            .map(|p| (p.cd, p.cl))
            .min_by(|a, b| a.0.total_cmp(&b.0))
    }

    /// Lift slope (per rad) and zero-lift angle (rad) by a least-squares line through the
    /// converged points with |cl| below `cl_limit`; `None` with fewer than two such points.
    pub fn linear_fit(&self, cl_limit: f64) -> Option<(f64, f64)> {
        let pts: Vec<(f64, f64)> = self
            .points()
            .filter(|p| p.cl.abs() <= cl_limit)
            .map(|p| (p.alpha_rad, p.cl))
            .collect();
        if pts.len() < 2 {
            return None;
        }
        let n = pts.len() as f64;
        let (sx, sy) = pts.iter().fold((0.0, 0.0), |a, p| (a.0 + p.0, a.1 + p.1));
        let (mx, my) = (sx / n, sy / n);
        let sxx: f64 = pts.iter().map(|p| (p.0 - mx).powi(2)).sum();
        let sxy: f64 = pts.iter().map(|p| (p.0 - mx) * (p.1 - my)).sum();
        if sxx <= 0.0 {
            return None;
        }
        let slope = sxy / sxx;
        Some((slope, mx - my / slope))
    }

    /// cd at lift coefficient `cl` by linear interpolation between converged points (`None`
    /// outside their range).
    pub fn cd_at_cl(&self, cl: f64) -> Option<f64> {
        let pts: Vec<&ViscousPoint> = self.points().collect();
        pts.windows(2).find_map(|w| {
            let (a, b) = (w[0], w[1]);
            if (a.cl - cl) * (b.cl - cl) <= 0.0 && (b.cl - a.cl).abs() > 1e-12 {
                let f = (cl - a.cl) / (b.cl - a.cl);
                Some(a.cd + f * (b.cd - a.cd))
            } else {
                None
            }
        })
    }

    /// cl at `alpha_rad` by linear interpolation between converged points (`None` outside
    /// their range).
    pub fn cl_at_alpha(&self, alpha_rad: f64) -> Option<f64> {
        let pts: Vec<&ViscousPoint> = self.points().collect();
        pts.windows(2).find_map(|w| {
            let (a, b) = (w[0], w[1]);
            if (a.alpha_rad..=b.alpha_rad).contains(&alpha_rad) {
                let f = (alpha_rad - a.alpha_rad) / (b.alpha_rad - a.alpha_rad);
                Some(a.cl + f * (b.cl - a.cl))
            } else {
                None
            }
        })
    }
}

/// Polars of one section at several Reynolds numbers (same N), for cl(alpha) and cd(cl) at a
/// Reynolds number between them: linear interpolation in log Re between the two polars that
/// bracket it; `None` outside their range or where either polar has no converged value (no
/// extrapolation).
#[derive(Debug, Clone, PartialEq)]
pub struct PolarFamily {
    polars: Vec<std::sync::Arc<Polar>>,
}

impl PolarFamily {
    /// The family, sorted by Reynolds number.
    pub fn new(mut polars: Vec<std::sync::Arc<Polar>>) -> PolarFamily {
        polars.sort_by(|a, b| a.reynolds.total_cmp(&b.reynolds));
        PolarFamily { polars }
    }

    fn bracket(&self, reynolds: f64) -> Option<(&Polar, &Polar, f64)> {
        let ps = &self.polars;
        if ps.len() == 1 && (ps[0].reynolds - reynolds).abs() <= 1e-9 * reynolds {
            return Some((&ps[0], &ps[0], 0.0));
        }
        ps.windows(2).find_map(|w| {
            let (a, b) = (&w[0], &w[1]);
            (a.reynolds <= reynolds && reynolds <= b.reynolds).then(|| {
                let f = (reynolds / a.reynolds).ln() / (b.reynolds / a.reynolds).ln();
                (a.as_ref(), b.as_ref(), f)
            })
        })
    }

    /// cl at `alpha_rad` and `reynolds`.
    pub fn cl_at_alpha(&self, alpha_rad: f64, reynolds: f64) -> Option<f64> {
        let (a, b, f) = self.bracket(reynolds)?;
        Some((1.0 - f) * a.cl_at_alpha(alpha_rad)? + f * b.cl_at_alpha(alpha_rad)?)
    }

    /// cd at `cl` and `reynolds`.
    pub fn cd_at_cl(&self, cl: f64, reynolds: f64) -> Option<f64> {
        let (a, b, f) = self.bracket(reynolds)?;
        Some((1.0 - f) * a.cd_at_cl(cl)? + f * b.cd_at_cl(cl)?)
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::section::geometry::Contour;
    use crate::section::naca::NacaProfile;
    use crate::section::viscous::ViscousSettings;
    use std::sync::Arc;

    fn polar(re: f64) -> Arc<Polar> {
        let raw = NacaProfile::parse("0012").unwrap().coordinates(200);
        let c = Contour::with_leading_edge(&raw, raw.len() / 2).unwrap();
        let s = ViscousSection::new(
            &c,
            ViscousSettings {
                reynolds: re,
                n_crit: 9.0,
                panels: 100,
            },
        )
        .unwrap();
        let alphas: Vec<f64> = [0.0f64, 2.0, 4.0].iter().map(|d| d.to_radians()).collect();
        Arc::new(Polar::sweep(&s, &alphas))
    }

    fn entry(alpha_deg: f64, cl: f64, past_stall: bool) -> PolarEntry {
        let side = crate::section::viscous::SurfaceSummary {
            transition_x_c: None,
            transition_cause: None,
            michel_x_c: None,
            separation_x_c: None,
            theta_te: 0.001,
            h_te: 1.6,
            cd: 0.005,
        };
        let p = ViscousPoint {
            alpha_rad: alpha_deg.to_radians(),
            cl,
            cd: 0.01,
            cm_quarter_chord: 0.0,
            upper: side,
            lower: side,
            iterations: 10,
            residual: 1e-4,
        };
        PolarEntry {
            alpha_rad: alpha_deg.to_radians(),
            status: if past_stall {
                PolarStatus::PastStall(p)
            } else {
                PolarStatus::Converged(p)
            },
        }
    }

    fn hand_polar(mut entries: Vec<PolarEntry>, tail: PolarStatus, cause: StallCause) -> Polar {
        entries.push(PolarEntry {
            alpha_rad: 20f64.to_radians(),
            status: tail,
        });
        let cl_max = entries
            .iter()
            .filter_map(|e| match &e.status {
                PolarStatus::Converged(p) => Some((p.cl, e.alpha_rad)),
                _ => None,
            })
            .max_by(|a, b| a.0.total_cmp(&b.0));
        Polar {
            reynolds: 2e5,
            n_crit: 9.0,
            entries,
            cl_max,
            cl_min: None,
            stall_cause: cause,
        }
    }

    #[test]
    fn lift_peak_tells_a_turned_over_curve_from_the_last_converged_angle() {
        // The definition of PeakKind: the peak counts as a maximum only when a later
        // converged solution (attached or past the criterion) has a lower cl.
        let not_conv = || {
            PolarStatus::NotConverged(ViscousError::NotConverged {
                alpha_rad: 0.2,
                residual: 1e-2,
                iterations: 200,
            })
        };
        // Rising to the last converged angle, then the iteration fails.
        let p = hand_polar(
            vec![entry(0.0, 0.2, false), entry(4.0, 0.6, false)],
            not_conv(),
            StallCause::NotConverged,
        );
        let peak = p.lift_peak().unwrap();
        assert_eq!(peak.kind, PeakKind::LastConverged(StallCause::NotConverged));
        assert_eq!((peak.cl, peak.alpha_rad), p.cl_max.unwrap());
        // The curve turns over at an attached point before the failure.
        let p = hand_polar(
            vec![
                entry(0.0, 0.2, false),
                entry(4.0, 0.6, false),
                entry(6.0, 0.55, false),
            ],
            not_conv(),
            StallCause::NotConverged,
        );
        assert_eq!(p.lift_peak().unwrap().kind, PeakKind::Maximum);
        assert!((p.lift_peak().unwrap().cl - 0.6).abs() < 1e-15);
        // A past-stall point with a lower cl ends the branch: a maximum.
        let p = hand_polar(
            vec![entry(0.0, 0.2, false), entry(4.0, 0.6, false)],
            entry(6.0, 0.5, true).status,
            StallCause::Separation,
        );
        assert_eq!(p.lift_peak().unwrap().kind, PeakKind::Maximum);
        // A past-stall point with a higher cl: the curve was still rising.
        let p = hand_polar(
            vec![entry(0.0, 0.2, false), entry(4.0, 0.6, false)],
            entry(6.0, 0.7, true).status,
            StallCause::Separation,
        );
        assert_eq!(
            p.lift_peak().unwrap().kind,
            PeakKind::LastConverged(StallCause::Separation)
        );
        // Nothing converged: no peak.
        let p = hand_polar(vec![], not_conv(), StallCause::NotConverged);
        assert!(p.lift_peak().is_none());
    }

    #[test]
    fn family_interpolates_between_and_refuses_outside() {
        // Linear interpolation in log Re: at an end it gives that polar's value; half-way in
        // log Re (Re 4.47e5 between 2e5 and 1e6) the mean of the two (1e-12: rounding).
        let (a, b) = (polar(2e5), polar(1e6));
        let fam = PolarFamily::new(vec![b.clone(), a.clone()]);
        let cd_a = a.cd_at_cl(0.2).unwrap();
        let cd_b = b.cd_at_cl(0.2).unwrap();
        assert!((fam.cd_at_cl(0.2, 2e5).unwrap() - cd_a).abs() < 1e-12);
        let mid = (2e5f64 * 1e6).sqrt();
        assert!((fam.cd_at_cl(0.2, mid).unwrap() - 0.5 * (cd_a + cd_b)).abs() < 1e-12);
        assert!(fam.cd_at_cl(0.2, 3e6).is_none());
        assert!(fam.cl_at_alpha(1f64.to_radians(), mid).is_some());
        assert!(fam.cl_at_alpha(9f64.to_radians(), mid).is_none());
    }
}
