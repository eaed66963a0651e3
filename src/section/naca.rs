//! NACA four-digit and five-digit sections: designation, mean lines, thickness form and
//! surface coordinates.
//!
//! Four-digit `MPTT`: greatest camber `M` % of chord at `P`/10 of chord, thickness `TT` %.
//! Five-digit `LPSTT` (standard, non-reflexed mean lines 210 to 250 only): design lift
//! coefficient `0.15 L`, camber position `P/20` of chord, `S = 0`, thickness `TT` %.
//! The thickness form is the original one with its small blunt trailing edge (thickness
//! 0.21 % of chord at x/c = 1 for a 12 % section); it is laid perpendicular to the mean line.
//!
//! Coordinates are in chord fractions, the leading edge at (0, 0), the chord along +x, and are
//! ordered trailing edge -> upper surface -> leading edge -> lower surface -> trailing edge.
//! Stations are cosine spaced, `x = (1 - cos beta) / 2`, to gather points at both edges.
//!
//! # References
//! - Jacobs, E. N., Ward, K. E., Pinkerton, R. M. (1933). The characteristics of 78 related
//!   airfoil sections from tests in the variable-density wind tunnel. NACA Report 460
//!   (four-digit thickness form and mean line).
//! - Abbott, I. H., von Doenhoff, A. E., Stivers, L. S. (1945). Summary of airfoil data.
//!   NACA Report 824, sec. "Numbering system" and the mean-line tables.
//! - Abbott, I. H., von Doenhoff, A. E. (1959). Theory of Wing Sections. Dover, ch. 6
//!   (equations of the four- and five-digit mean lines, constants r and k1 of the 210-250 lines).

/// Largest thickness accepted, fraction of chord (the NACA thickness form is published up to
/// about 30 %; beyond that the shape is not a sensible wing section).
pub const MAX_THICKNESS_RATIO: f64 = 0.40;

/// Errors in a NACA designation.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum NacaError {
    /// Designation without digits.
    #[error("empty NACA designation (expected 4 or 5 digits such as 2412 or 23012)")]
    Empty,
    /// Something that is not a digit.
    #[error("NACA designation '{0}' contains '{1}' (expected only digits, such as 2412 or 23012)")]
    NotDigits(String, char),
    /// Neither 4 nor 5 digits.
    #[error("NACA designation '{0}' has {1} digits (accepted: 4-digit such as 2412, 5-digit such as 23012)")]
    Length(String, usize),
    /// Zero thickness.
    #[error("NACA designation '{0}' has zero thickness (last two digits must be 01 to 40)")]
    ZeroThickness(String),
    /// Thickness beyond [`MAX_THICKNESS_RATIO`].
    #[error("NACA designation '{0}': thickness {1} % is above the accepted 40 %")]
    TooThick(String, u32),
    /// A four-digit section with camber but camber position 0.
    #[error("NACA designation '{0}': camber {1} % needs a camber position 1 to 9 (second digit)")]
    CamberPositionMissing(String, u32),
    /// A five-digit mean line other than the standard 210..250.
    #[error("NACA designation '{0}': mean line {1} is not supported (accepted: 210, 220, 230, 240, 250)")]
    UnsupportedMeanLine(String, String),
    /// A reflexed five-digit mean line (third digit 1).
    #[error("NACA designation '{0}': reflexed mean lines (third digit 1) are not supported")]
    Reflexed(String),
}

/// A parsed NACA section.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum NacaProfile {
    /// Four-digit section.
    FourDigit {
        /// Greatest camber, fraction of chord.
        max_camber: f64,
        /// Position of greatest camber, fraction of chord (0 for symmetric sections).
        camber_position: f64,
        /// Greatest thickness, fraction of chord.
        thickness_ratio: f64,
    },
    /// Five-digit section with a standard (non-reflexed) mean line.
    FiveDigit {
        /// Design lift coefficient (0.3 for the 230 line).
        design_cl: f64,
        /// Position of greatest camber, fraction of chord.
        camber_position: f64,
        /// Mean-line constant r (fraction of chord where the cubic part ends).
        r: f64,
        /// Mean-line constant k1 for the design lift coefficient of this section.
        k1: f64,
        /// Greatest thickness, fraction of chord.
        thickness_ratio: f64,
    },
}

/// Constants (P digit, r, k1) of the standard five-digit mean lines for design cl 0.3
/// (Abbott & von Doenhoff 1959, ch. 6).
const FIVE_DIGIT_LINES: [(u32, f64, f64); 5] = [
    (1, 0.0580, 361.4),
    (2, 0.1260, 51.64),
    (3, 0.2025, 15.957),
    (4, 0.2900, 6.643),
    (5, 0.3910, 3.230),
];

impl NacaProfile {
    /// Parses a designation: 4 or 5 digits, optionally after `NACA` (any case) and spaces or
    /// a dash, e.g. `"2412"`, `"naca23012"`, `"NACA 0012"`.
    pub fn parse(designation: &str) -> Result<NacaProfile, NacaError> {
        let trimmed = designation.trim();
        let digits_part = match (trimmed.get(..4), trimmed.get(4..)) {
            (Some(prefix), Some(rest)) if prefix.eq_ignore_ascii_case("naca") => {
                rest.trim_start_matches([' ', '-', '_'])
            }
            _ => trimmed,
        };
        if digits_part.is_empty() {
            return Err(NacaError::Empty);
        }
        if let Some(c) = digits_part.chars().find(|c| !c.is_ascii_digit()) {
            return Err(NacaError::NotDigits(designation.to_string(), c));
        }
        let d: Vec<u32> = digits_part.chars().filter_map(|c| c.to_digit(10)).collect();
        let name = digits_part.to_string();
        let thickness_pct = |a: u32, b: u32| 10 * a + b;
        match d.len() {
            4 => {
                let t = thickness_pct(d[2], d[3]);
                check_thickness(&name, t)?;
                if d[0] > 0 && d[1] == 0 {
                    return Err(NacaError::CamberPositionMissing(name, d[0]));
                }
                let max_camber = f64::from(d[0]) / 100.0;
                Ok(NacaProfile::FourDigit {
                    max_camber,
                    camber_position: if d[0] == 0 {
                        0.0
                    } else {
                        f64::from(d[1]) / 10.0
                    },
                    thickness_ratio: f64::from(t) / 100.0,
                })
            }
            5 => {
                let t = thickness_pct(d[3], d[4]);
                check_thickness(&name, t)?;
                if d[2] == 1 {
                    return Err(NacaError::Reflexed(name));
                }
                let line = format!("{}{}{}", d[0], d[1], d[2]);
                let entry = FIVE_DIGIT_LINES.iter().find(|(p, _, _)| *p == d[1]);
                match (d[0], d[2], entry) {
                    (l, 0, Some(&(p, r, k1_03))) if l > 0 => {
                        let design_cl = 0.15 * f64::from(l);
                        Ok(NacaProfile::FiveDigit {
                            design_cl,
                            camber_position: f64::from(p) / 20.0,
                            r,
                            // The ordinates scale with the design lift coefficient.
                            k1: k1_03 * design_cl / 0.3,
                            thickness_ratio: f64::from(t) / 100.0,
                        })
                    }
                    _ => Err(NacaError::UnsupportedMeanLine(name, line)),
                }
            }
            n => Err(NacaError::Length(designation.to_string(), n)),
        }
    }

    /// Greatest thickness, fraction of chord.
    pub fn thickness_ratio(&self) -> f64 {
        match *self {
            NacaProfile::FourDigit {
                thickness_ratio, ..
            }
            | NacaProfile::FiveDigit {
                thickness_ratio, ..
            } => thickness_ratio,
        }
    }

    /// Mean-line ordinate z/c at x/c (0..1).
    pub fn camber(&self, x: f64) -> f64 {
        match *self {
            NacaProfile::FourDigit {
                max_camber: m,
                camber_position: p,
                ..
            } => {
                if m == 0.0 {
                    0.0
                } else if x < p {
                    m / (p * p) * (2.0 * p * x - x * x)
                } else {
                    m / ((1.0 - p) * (1.0 - p)) * (1.0 - 2.0 * p + 2.0 * p * x - x * x)
                }
            }
            NacaProfile::FiveDigit { r, k1, .. } => {
                if x < r {
                    k1 / 6.0 * (x * x * x - 3.0 * r * x * x + r * r * (3.0 - r) * x)
                } else {
                    k1 * r * r * r / 6.0 * (1.0 - x)
                }
            }
        }
    }

    /// Mean-line slope dz/dx at x/c (0..1).
    pub fn camber_slope(&self, x: f64) -> f64 {
        match *self {
            NacaProfile::FourDigit {
                max_camber: m,
                camber_position: p,
                ..
            } => {
                if m == 0.0 {
                    0.0
                } else if x < p {
                    2.0 * m / (p * p) * (p - x)
                } else {
                    2.0 * m / ((1.0 - p) * (1.0 - p)) * (p - x)
                }
            }
            NacaProfile::FiveDigit { r, k1, .. } => {
                if x < r {
                    k1 / 6.0 * (3.0 * x * x - 6.0 * r * x + r * r * (3.0 - r))
                } else {
                    -k1 * r * r * r / 6.0
                }
            }
        }
    }

    /// x/c where the mean-line formula changes (its slope has a kink in curvature there),
    /// useful as a quadrature break point; `None` for symmetric sections.
    pub fn mean_line_joint(&self) -> Option<f64> {
        match *self {
            NacaProfile::FourDigit {
                max_camber,
                camber_position,
                ..
            } if max_camber > 0.0 => Some(camber_position),
            NacaProfile::FourDigit { .. } => None,
            NacaProfile::FiveDigit { r, .. } => Some(r),
        }
    }

    /// Half thickness y_t/c at x/c of the NACA thickness form (blunt trailing edge).
    pub fn half_thickness(&self, x: f64) -> f64 {
        let t = self.thickness_ratio();
        let x = x.clamp(0.0, 1.0);
        5.0 * t
            * (0.2969 * x.sqrt() - 0.1260 * x - 0.3516 * x * x + 0.2843 * x * x * x
                - 0.1015 * x * x * x * x)
    }

    /// Surface coordinates with `points_per_surface` cosine-spaced stations per surface
    /// (at least 3), ordered trailing edge -> upper -> leading edge -> lower -> trailing
    /// edge; the leading-edge point appears once. Returns `2 n - 1` points.
    pub fn coordinates(&self, points_per_surface: usize) -> Vec<[f64; 2]> {
        let n = points_per_surface.max(3);
        let stations: Vec<f64> = (0..n)
            .map(|i| {
                let beta = std::f64::consts::PI * i as f64 / (n - 1) as f64;
                0.5 * (1.0 - beta.cos())
            })
            .collect();
        let surface = |x: f64, sign: f64| -> [f64; 2] {
            let yt = self.half_thickness(x);
            let theta = self.camber_slope(x).atan();
            [
                x - sign * yt * theta.sin(),
                self.camber(x) + sign * yt * theta.cos(),
            ]
        };
        let mut points = Vec::with_capacity(2 * n - 1);
        for &x in stations.iter().rev() {
            points.push(surface(x, 1.0));
        }
        for &x in stations.iter().skip(1) {
            points.push(surface(x, -1.0));
        }
        points
    }
}

fn check_thickness(name: &str, t_pct: u32) -> Result<(), NacaError> {
    if t_pct == 0 {
        Err(NacaError::ZeroThickness(name.to_string()))
    } else if f64::from(t_pct) / 100.0 > MAX_THICKNESS_RATIO {
        Err(NacaError::TooThick(name.to_string(), t_pct))
    } else {
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn parses_four_and_five_digit_designations() {
        let p = NacaProfile::parse("NACA 2412").unwrap();
        assert_eq!(
            p,
            NacaProfile::FourDigit {
                max_camber: 0.02,
                camber_position: 0.4,
                thickness_ratio: 0.12
            }
        );
        match NacaProfile::parse("naca23012").unwrap() {
            NacaProfile::FiveDigit {
                design_cl,
                camber_position,
                r,
                k1,
                thickness_ratio,
            } => {
                assert_relative_eq!(design_cl, 0.3, epsilon = 1e-12);
                assert_relative_eq!(camber_position, 0.15, epsilon = 1e-12);
                assert_relative_eq!(r, 0.2025, epsilon = 1e-12);
                assert_relative_eq!(k1, 15.957, epsilon = 1e-9);
                assert_relative_eq!(thickness_ratio, 0.12, epsilon = 1e-12);
            }
            other => panic!("expected five-digit, got {other:?}"),
        }
    }

    #[test]
    fn rejects_bad_designations_with_typed_errors() {
        assert_eq!(NacaProfile::parse("naca"), Err(NacaError::Empty));
        assert!(matches!(
            NacaProfile::parse("nac\u{e4}2412"),
            Err(NacaError::NotDigits(_, 'n'))
        ));
        assert!(matches!(
            NacaProfile::parse("24a2"),
            Err(NacaError::NotDigits(_, 'a'))
        ));
        assert!(matches!(
            NacaProfile::parse("241"),
            Err(NacaError::Length(_, 3))
        ));
        assert!(matches!(
            NacaProfile::parse("2400"),
            Err(NacaError::ZeroThickness(_))
        ));
        assert!(matches!(
            NacaProfile::parse("2450"),
            Err(NacaError::TooThick(_, 50))
        ));
        assert!(matches!(
            NacaProfile::parse("2012"),
            Err(NacaError::CamberPositionMissing(_, 2))
        ));
        assert!(matches!(
            NacaProfile::parse("23112"),
            Err(NacaError::Reflexed(_))
        ));
        assert!(matches!(
            NacaProfile::parse("27012"),
            Err(NacaError::UnsupportedMeanLine(_, _))
        ));
    }

    #[test]
    fn four_digit_mean_line_peaks_at_its_position_with_continuous_slope() {
        // Definition of the four-digit line: z(p) = m, slope zero at p from both sides.
        let p = NacaProfile::parse("4412").unwrap();
        assert_relative_eq!(p.camber(0.4), 0.04, epsilon = 1e-12);
        assert_relative_eq!(p.camber_slope(0.4 - 1e-12), 0.0, epsilon = 1e-9);
        assert_relative_eq!(p.camber(1.0), 0.0, epsilon = 1e-12);
    }

    #[test]
    fn five_digit_mean_line_is_continuous_and_closes_at_the_trailing_edge() {
        let p = NacaProfile::parse("23012").unwrap();
        let r = 0.2025;
        assert_relative_eq!(p.camber(r - 1e-12), p.camber(r), epsilon = 1e-9);
        assert_relative_eq!(p.camber_slope(r - 1e-12), p.camber_slope(r), epsilon = 1e-6);
        assert_relative_eq!(p.camber(1.0), 0.0, epsilon = 1e-12);
        // Greatest camber near x = 0.15 (the '3' of 230), about 1.8 % (Abbott & von Doenhoff
        // table of the 230 line, memory), with zero slope there.
        let slope_at_p = p.camber_slope(0.15);
        assert!(slope_at_p.abs() < 0.01, "slope at 0.15 {slope_at_p}");
    }

    #[test]
    fn thickness_form_gives_its_published_greatest_thickness() {
        // The four-digit form has its greatest thickness t at x/c = 0.30 (NACA Report 460).
        let p = NacaProfile::parse("0012").unwrap();
        assert_relative_eq!(2.0 * p.half_thickness(0.3), 0.12, epsilon = 2e-4);
        // Blunt trailing edge, 2 * 5 t * 0.0021 = 0.00252 for t = 0.12.
        assert_relative_eq!(2.0 * p.half_thickness(1.0), 0.00252, epsilon = 1e-6);
    }

    #[test]
    fn coordinates_run_from_trailing_edge_over_the_top() {
        let pts = NacaProfile::parse("2412").unwrap().coordinates(41);
        assert_eq!(pts.len(), 81);
        assert_relative_eq!(pts[40][0], 0.0, epsilon = 1e-12);
        assert!(pts[20][1] > 0.0 && pts[60][1] < 0.0);
        assert_relative_eq!(pts[0][0], 1.0, epsilon = 1e-3);
    }
}
