//! Classical lifting line: Prandtl's integro-differential equation for one straight, unswept
//! wing, solved by Glauert's Fourier-series collocation.
//!
//! The spanwise circulation is written as a sine series in the angle theta, where
//! y = -(b/2) cos(theta):
//!
//! Gamma(theta) = 2 b V sum_n A_n sin(n theta),
//!
//! and Prandtl's equation is enforced at N collocation angles theta_i = i pi / (2N), i = 1..N,
//! on one half of the span. Symmetric loading keeps only the odd n = 1, 3, ..., 2N-1. With
//! mu = a0 c / (4 b) each collocation equation reads
//!
//! sum_n A_n sin(n theta) (sin theta + n mu) = mu (alpha + theta_geo - alpha_L0) sin theta.
//!
//! Results: C_L = pi A A_1; C_Di = pi A sum n A_n^2 = C_L^2 (1 + delta) / (pi A);
//! span efficiency e = 1 / (1 + delta); the lift slope a = a0 / (1 + a0 (1 + tau) / (pi A))
//! defines Glauert's tau, here with a0 the area-weighted mean section lift slope.
//!
//! Valid for straight (unswept quarter-chord line), planar wings of moderate to high aspect
//! ratio (A above about 4) in incompressible flow with attached flow (linear sections). The
//! section models are linear here: cl_max is not applied. Dihedral is ignored: the wing is
//! solved in its projected span.
//!
//! # References
//! - L. Prandtl, "Tragflügeltheorie", Nachrichten der Gesellschaft der Wissenschaften zu
//!   Göttingen, 1918 (the lifting-line equation).
//! - H. Glauert, *The Elements of Aerofoil and Airscrew Theory*, Cambridge, 1926, ch. XI
//!   (Fourier-series solution, the factors delta and tau, and the figure of delta against
//!   taper ratio).
//! - J. D. Anderson, *Fundamentals of Aerodynamics*, sec. 5.3 (general lift distribution,
//!   C_L = pi A A_1, C_Di = pi A sum n A_n^2, the monoplane equation).

use std::f64::consts::PI;

use nalgebra::{DMatrix, DVector};

use super::LiftingLineError;
use crate::model::{Surface, SurfaceShape};
use crate::planform;
use crate::section::SectionModel;

/// Number of odd Fourier terms used when none is given: converges the rectangular-wing
/// delta to about 1e-4 (common practice is 10 to 50 terms; more cost nothing here).
pub const DEFAULT_TERMS: usize = 60;

/// The wing at one spanwise station, as the classical method needs it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ClassicalStation {
    /// Chord, m (may be zero at a tip).
    pub chord_m: f64,
    /// Geometric angle of the section to the wing's reference line (incidence plus twist), rad,
    /// leading edge up positive.
    pub geometric_angle_rad: f64,
    /// Section lift slope, per rad.
    pub cl_alpha_per_rad: f64,
    /// Section zero-lift angle, rad.
    pub alpha_zero_lift_rad: f64,
}

/// A straight wing: its span and a function giving the station at eta = |2y/b| in [0, 1].
pub struct ClassicalWing<'a> {
    span_m: f64,
    station: Box<dyn Fn(f64) -> ClassicalStation + 'a>,
}

impl<'a> ClassicalWing<'a> {
    /// A wing of projected span `span_m` whose stations are given by `station(eta)`,
    /// eta = |2y / b| from 0 (root) to 1 (tip).
    pub fn new(span_m: f64, station: impl Fn(f64) -> ClassicalStation + 'a) -> Self {
        ClassicalWing {
            span_m,
            station: Box::new(station),
        }
    }

    /// The wing described by a model surface; `sections` is indexed by `AirfoilId.0`. The
    /// surface's incidence is included in the geometric angle. Fails for a swept quarter-chord
    /// line or a missing section model.
    pub fn from_surface(
        surface: &'a Surface,
        sections: &'a [SectionModel],
    ) -> Result<Self, LiftingLineError> {
        if let SurfaceShape::Panels(panels) = &surface.shape {
            for (i, p) in panels.iter().enumerate() {
                let y_panel = p.span_m * p.dihedral_rad.cos();
                let tan_qc = if y_panel > 0.0 {
                    p.sweep_le_rad.tan() + 0.25 * (p.tip_chord_m - p.root_chord_m) / y_panel
                } else {
                    0.0
                };
                if tan_qc.abs() > 1e-9 {
                    return Err(LiftingLineError::SweptQuarterChord {
                        surface: surface.name.clone(),
                        panel: i,
                        sweep_rad: tan_qc.atan(),
                    });
                }
                for id in [p.root_airfoil, p.tip_airfoil] {
                    check_section(surface, sections, id.0)?;
                }
            }
        }
        if let SurfaceShape::Elliptic(e) = &surface.shape {
            for id in [e.root_airfoil, e.tip_airfoil] {
                check_section(surface, sections, id.0)?;
            }
        }
        let geometry = planform::geometry(surface);
        let half_span = 0.5 * geometry.span_m;
        let station = move |eta: f64| {
            let s = in_plane_distance_m(surface, eta * half_span);
            let st = planform::station_at(surface, s);
            let section = sections[st.airfoil_inboard.0]
                .blend(&sections[st.airfoil_outboard.0], st.airfoil_weight);
            ClassicalStation {
                chord_m: st.chord_m,
                geometric_angle_rad: surface.incidence_rad + st.twist_rad,
                cl_alpha_per_rad: section.cl_alpha_per_rad,
                alpha_zero_lift_rad: section.alpha_zero_lift_rad,
            }
        };
        Ok(ClassicalWing::new(geometry.span_m, station))
    }

    /// Solve Prandtl's equation with `n_terms` odd Fourier terms (and as many collocation
    /// points on the half-span).
    pub fn solve(&self, n_terms: usize) -> Result<ClassicalSolution, LiftingLineError> {
        if !(self.span_m.is_finite() && self.span_m > 0.0) {
            return Err(LiftingLineError::InvalidInput {
                parameter: "span_m",
                value: self.span_m,
                range: "finite and > 0",
            });
        }
        if !(1..=400).contains(&n_terms) {
            return Err(LiftingLineError::InvalidInput {
                parameter: "n_terms",
                value: n_terms as f64,
                range: "1 to 400",
            });
        }
        let b = self.span_m;
        let (area_m2, a0_ref) = self.area_and_mean_slope()?;
        let n = n_terms;
        let mut m = DMatrix::<f64>::zeros(n, n);
        let mut rhs = DMatrix::<f64>::zeros(n, 2);
        let mut stations = Vec::with_capacity(n);
        for i in 0..n {
            let theta = (i + 1) as f64 * PI / (2.0 * n as f64);
            let eta = theta.cos().abs();
            let st = (self.station)(eta);
            check_station(&st)?;
            let mu = st.cl_alpha_per_rad * st.chord_m / (4.0 * b);
            let sin_t = theta.sin();
            for k in 0..n {
                let order = (2 * k + 1) as f64;
                m[(i, k)] = (order * theta).sin() * (sin_t + order * mu);
            }
            rhs[(i, 0)] = mu * sin_t;
            rhs[(i, 1)] = mu * sin_t * (st.geometric_angle_rad - st.alpha_zero_lift_rad);
            stations.push((eta, st));
        }
        let coeffs = solve_checked(&m, &rhs)?;
        Ok(ClassicalSolution {
            span_m: b,
            area_m2,
            aspect_ratio: b * b / area_m2,
            a0_ref_per_rad: a0_ref,
            a_alpha: coeffs.column(0).iter().copied().collect(),
            a_zero: coeffs.column(1).iter().copied().collect(),
            stations,
        })
    }

    /// Area (both halves) and area-weighted mean section lift slope, by the midpoint rule in
    /// theta (dy = (b/2) sin theta d theta), which handles the square-root behaviour of an
    /// elliptic tip exactly enough (relative error below 1e-7 with 4000 points).
    fn area_and_mean_slope(&self) -> Result<(f64, f64), LiftingLineError> {
        const POINTS: usize = 4000;
        let h = 0.5 * PI / POINTS as f64;
        let (mut area, mut slope_area) = (0.0, 0.0);
        for i in 0..POINTS {
            let theta = (i as f64 + 0.5) * h;
            let st = (self.station)(theta.cos());
            let w = self.span_m * theta.sin() * h;
            area += st.chord_m * w;
            slope_area += st.cl_alpha_per_rad * st.chord_m * w;
        }
        if !(area.is_finite() && area > 0.0) {
            return Err(LiftingLineError::InvalidInput {
                parameter: "wing area_m2",
                value: area,
                range: "finite and > 0",
            });
        }
        Ok((area, slope_area / area))
    }
}

/// The solved classical lifting line: Fourier coefficients per unit angle of attack and at
/// zero angle of attack, so any angle is a linear combination.
#[derive(Debug, Clone, PartialEq)]
pub struct ClassicalSolution {
    /// Projected span, m.
    pub span_m: f64,
    /// Wing area, m^2.
    pub area_m2: f64,
    /// Aspect ratio b^2 / S.
    pub aspect_ratio: f64,
    /// Area-weighted mean section lift slope used in tau, per rad.
    pub a0_ref_per_rad: f64,
    /// A_n (n = 1, 3, 5, ...) per radian of angle of attack.
    a_alpha: Vec<f64>,
    /// A_n at zero angle of attack (from twist and zero-lift angles).
    a_zero: Vec<f64>,
    /// Collocation stations: eta and the station data.
    stations: Vec<(f64, ClassicalStation)>,
}

impl ClassicalSolution {
    fn coefficients(&self, alpha_rad: f64) -> impl Iterator<Item = f64> + '_ {
        self.a_alpha
            .iter()
            .zip(&self.a_zero)
            .map(move |(a, z)| alpha_rad * a + z)
    }

    /// Wing lift coefficient at angle of attack `alpha_rad` of the reference line.
    pub fn cl(&self, alpha_rad: f64) -> f64 {
        PI * self.aspect_ratio * (alpha_rad * self.a_alpha[0] + self.a_zero[0])
    }

    /// Lift slope dC_L/dalpha, per rad.
    pub fn lift_slope_per_rad(&self) -> f64 {
        PI * self.aspect_ratio * self.a_alpha[0]
    }

    /// Angle of attack of the reference line at zero wing lift, rad.
    pub fn zero_lift_alpha_rad(&self) -> f64 {
        -self.a_zero[0] / self.a_alpha[0]
    }

    /// Induced-drag coefficient at `alpha_rad`: pi A sum n A_n^2.
    pub fn induced_drag(&self, alpha_rad: f64) -> f64 {
        PI * self.aspect_ratio
            * self
                .coefficients(alpha_rad)
                .enumerate()
                .map(|(k, a)| (2 * k + 1) as f64 * a * a)
                .sum::<f64>()
    }

    /// Glauert's induced-drag factor delta of the loading at `alpha_rad`
    /// (C_Di = C_L^2 (1 + delta) / (pi A)); `None` where the lift is zero.
    pub fn delta_at(&self, alpha_rad: f64) -> Option<f64> {
        let coeffs: Vec<f64> = self.coefficients(alpha_rad).collect();
        delta_of(&coeffs)
    }

    /// delta of the loading due to angle of attack alone (the whole delta of an untwisted wing
    /// with a constant zero-lift angle).
    pub fn delta(&self) -> f64 {
        delta_of(&self.a_alpha).unwrap_or(0.0)
    }

    /// Span efficiency e = 1 / (1 + delta) of the angle-of-attack loading.
    pub fn span_efficiency(&self) -> f64 {
        1.0 / (1.0 + self.delta())
    }

    /// Glauert's lift-slope factor tau, from a = a0 / (1 + a0 (1 + tau) / (pi A)) with a0 the
    /// area-weighted mean section slope.
    pub fn tau(&self) -> f64 {
        let a = self.lift_slope_per_rad();
        let a0 = self.a0_ref_per_rad;
        (a0 / a - 1.0) * PI * self.aspect_ratio / a0 - 1.0
    }

    /// Circulation divided by free-stream speed at eta = |2y/b| (m), at `alpha_rad`.
    pub fn circulation_per_speed_m(&self, alpha_rad: f64, eta: f64) -> f64 {
        let theta = (-eta.clamp(0.0, 1.0)).acos();
        2.0 * self.span_m
            * self
                .coefficients(alpha_rad)
                .enumerate()
                .map(|(k, a)| a * ((2 * k + 1) as f64 * theta).sin())
                .sum::<f64>()
    }

    /// Spanwise loading at the collocation stations, root to tip: (eta, chord m, section cl,
    /// circulation / speed m). The section cl is 2 Gamma / (V c); zero where the chord is zero.
    pub fn spanwise(&self, alpha_rad: f64) -> Vec<(f64, f64, f64, f64)> {
        self.stations
            .iter()
            .rev()
            .map(|(eta, st)| {
                let g = self.circulation_per_speed_m(alpha_rad, *eta);
                let cl = if st.chord_m > 0.0 {
                    2.0 * g / st.chord_m
                } else {
                    0.0
                };
                (*eta, st.chord_m, cl, g)
            })
            .collect()
    }
}

fn delta_of(coeffs: &[f64]) -> Option<f64> {
    let a1 = coeffs[0];
    if a1.abs() <= 1e-300 {
        return None;
    }
    Some(
        coeffs
            .iter()
            .enumerate()
            .skip(1)
            .map(|(k, a)| (2 * k + 1) as f64 * (a / a1).powi(2))
            .sum(),
    )
}

fn check_section(
    surface: &Surface,
    sections: &[SectionModel],
    index: usize,
) -> Result<(), LiftingLineError> {
    if index >= sections.len() {
        return Err(LiftingLineError::MissingSection {
            surface: surface.name.clone(),
            index,
            available: sections.len(),
        });
    }
    Ok(())
}

fn check_station(st: &ClassicalStation) -> Result<(), LiftingLineError> {
    let checks = [
        ("chord_m", st.chord_m, st.chord_m >= 0.0, ">= 0"),
        (
            "cl_alpha_per_rad",
            st.cl_alpha_per_rad,
            st.cl_alpha_per_rad > 0.0,
            "> 0",
        ),
        (
            "geometric_angle_rad",
            st.geometric_angle_rad,
            true,
            "finite",
        ),
        (
            "alpha_zero_lift_rad",
            st.alpha_zero_lift_rad,
            true,
            "finite",
        ),
    ];
    for (parameter, value, ok, range) in checks {
        if !(value.is_finite() && ok) {
            return Err(LiftingLineError::InvalidInput {
                parameter,
                value,
                range,
            });
        }
    }
    Ok(())
}

/// The in-plane distance s from the root at which the surface's projected y equals `y_m`.
fn in_plane_distance_m(surface: &Surface, y_m: f64) -> f64 {
    match &surface.shape {
        SurfaceShape::Panels(panels) => {
            let (mut s0, mut y0) = (0.0, 0.0);
            for p in panels {
                let y_panel = p.span_m * p.dihedral_rad.cos();
                if y_m <= y0 + y_panel {
                    let f = if y_panel > 0.0 {
                        (y_m - y0) / y_panel
                    } else {
                        0.0
                    };
                    return s0 + f.clamp(0.0, 1.0) * p.span_m;
                }
                s0 += p.span_m;
                y0 += y_panel;
            }
            s0
        }
        SurfaceShape::Elliptic(e) => y_m / e.dihedral_rad.cos(),
    }
}

/// Solve m x = rhs by LU, rejecting a singular or ill-conditioned matrix (pivot check) and an
/// inaccurate result (residual check), as nalgebra does neither.
pub(crate) fn solve_checked(
    m: &DMatrix<f64>,
    rhs: &DMatrix<f64>,
) -> Result<DMatrix<f64>, LiftingLineError> {
    let lu = m.clone().lu();
    check_pivots(lu.u().diagonal().as_slice())?;
    let x = lu
        .solve(rhs)
        .ok_or(LiftingLineError::SingularSystem { pivot_ratio: 0.0 })?;
    check_residual(m, &x, rhs)?;
    Ok(x)
}

/// Smallest accepted ratio of the smallest to the largest LU pivot.
pub(crate) const MIN_PIVOT_RATIO: f64 = 1e-12;
/// Largest accepted relative residual of a linear solve.
pub(crate) const MAX_RELATIVE_RESIDUAL: f64 = 1e-8;

pub(crate) fn check_pivots(diagonal: &[f64]) -> Result<(), LiftingLineError> {
    let max = diagonal.iter().fold(0.0_f64, |m, d| m.max(d.abs()));
    let min = diagonal.iter().fold(f64::INFINITY, |m, d| m.min(d.abs()));
    let ratio = if max > 0.0 { min / max } else { 0.0 };
    if !(ratio.is_finite() && ratio >= MIN_PIVOT_RATIO) {
        return Err(LiftingLineError::SingularSystem { pivot_ratio: ratio });
    }
    Ok(())
}

pub(crate) fn check_residual(
    m: &DMatrix<f64>,
    x: &DMatrix<f64>,
    rhs: &DMatrix<f64>,
) -> Result<(), LiftingLineError> {
    let finite = x.iter().all(|v| v.is_finite());
    residual_within_tolerance(finite, || (m * x - rhs).amax(), rhs.amax())
}

/// Residual check for a single right-hand side, with the product m x written into `product`
/// (sized like `x`) so that nothing is allocated.
pub(crate) fn check_vector_residual_into(
    m: &DMatrix<f64>,
    x: &DVector<f64>,
    rhs: &DVector<f64>,
    product: &mut DVector<f64>,
) -> Result<(), LiftingLineError> {
    let finite = x.iter().all(|v| v.is_finite());
    let residual_amax = || {
        m.mul_to(x, product);
        product
            .iter()
            .zip(rhs.iter())
            .fold(0.0_f64, |acc, (p, r)| acc.max((p - r).abs()))
    };
    residual_within_tolerance(finite, residual_amax, rhs.amax())
}

/// The shared test of a linear solve: a finite solution whose largest residual, relative to
/// the largest right-hand side, is within [`MAX_RELATIVE_RESIDUAL`].
fn residual_within_tolerance(
    finite: bool,
    residual_amax: impl FnOnce() -> f64,
    rhs_amax: f64,
) -> Result<(), LiftingLineError> {
    if !finite {
        return Err(LiftingLineError::NonFinite {
            quantity: "linear-solve result",
        });
    }
    let residual = residual_amax() / rhs_amax.max(1e-300);
    if residual > MAX_RELATIVE_RESIDUAL {
        return Err(LiftingLineError::InaccurateSolve {
            residual,
            tolerance: MAX_RELATIVE_RESIDUAL,
        });
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    fn flat(chord_m: f64) -> ClassicalStation {
        ClassicalStation {
            chord_m,
            geometric_angle_rad: 0.0,
            cl_alpha_per_rad: 2.0 * PI,
            alpha_zero_lift_rad: 0.0,
        }
    }

    // Elliptic loading is the exact one-term solution: a = a0/(1 + a0/(pi A)) (Prandtl;
    // Anderson, Fundamentals of Aerodynamics, eq. for the elliptic wing); tolerance is
    // round-off and the area quadrature.
    #[test]
    fn elliptic_wing_is_one_term() {
        let b = 2.0;
        let c0 = 4.0 * b / (PI * 8.0); // A = 8
        let wing = ClassicalWing::new(b, move |eta: f64| flat(c0 * (1.0 - eta * eta).sqrt()));
        let sol = wing.solve(20).unwrap();
        let a0 = 2.0 * PI;
        assert_relative_eq!(sol.aspect_ratio, 8.0, max_relative = 1e-6);
        assert_relative_eq!(
            sol.lift_slope_per_rad(),
            a0 / (1.0 + a0 / (PI * 8.0)),
            max_relative = 1e-6
        );
        assert_relative_eq!(sol.delta(), 0.0, epsilon = 1e-10);
    }

    // Law: the lift slope tends to the section slope as the aspect ratio grows (Prandtl; the
    // limit named in STYLE.md). At A = 1000 the estimate a0/(1 + a0/(pi A)) differs from a0 by
    // 0.2 %, so a 1 % tolerance checks the limit without depending on tau.
    #[test]
    fn very_high_aspect_ratio_tends_to_section_slope() {
        let wing = ClassicalWing::new(100.0, |_| flat(0.1)); // A = 1000
        let a = wing.solve(40).unwrap().lift_slope_per_rad();
        let a0 = 2.0 * PI;
        assert_relative_eq!(a, a0 / (1.0 + a0 / (PI * 1000.0)), max_relative = 1e-2);
    }

    // The induced drag from the coefficients equals C_L^2 (1 + delta)/(pi A) by definition.
    #[test]
    fn induced_drag_consistent_with_delta() {
        let wing = ClassicalWing::new(1.5, |eta: f64| flat(0.25 * (1.0 - 0.5 * eta)));
        let sol = wing.solve(30).unwrap();
        let cl = sol.cl(0.1);
        assert_relative_eq!(
            sol.induced_drag(0.1),
            cl * cl * (1.0 + sol.delta()) / (PI * sol.aspect_ratio),
            max_relative = 1e-10
        );
    }

    #[test]
    fn swept_surface_or_missing_section_is_refused() {
        use crate::model::{AirfoilId, Panel};
        use crate::section::ClMaxSource;
        let panel = Panel {
            span_m: 1.0,
            root_chord_m: 0.2,
            tip_chord_m: 0.2,
            sweep_le_rad: 0.2,
            dihedral_rad: 0.0,
            tip_twist_rad: 0.0,
            root_airfoil: AirfoilId(0),
            tip_airfoil: AirfoilId(0),
        };
        let surface = Surface {
            name: "wing".into(),
            root_le_x_m: 0.0,
            root_le_z_m: 0.0,
            incidence_rad: 0.0,
            shape: SurfaceShape::Panels(vec![panel.clone()]),
        };
        let section = SectionModel {
            method: crate::model::SectionMethod::Thin,
            alpha_zero_lift_rad: 0.0,
            cl_alpha_per_rad: 2.0 * PI,
            cm_ac: 0.0,
            x_ac_c: 0.25,
            cl_max: 1.0,
            cl_min: -1.0,
            cl_max_source: ClMaxSource::Given,
            reynolds_number: None,
            polar: None,
        };
        let sections = [section];
        assert!(matches!(
            ClassicalWing::from_surface(&surface, &sections),
            Err(LiftingLineError::SweptQuarterChord { panel: 0, .. })
        ));
        let straight = Surface {
            shape: SurfaceShape::Panels(vec![Panel {
                sweep_le_rad: 0.0,
                ..panel
            }]),
            ..surface
        };
        assert!(matches!(
            ClassicalWing::from_surface(&straight, &[]),
            Err(LiftingLineError::MissingSection { index: 0, .. })
        ));
        assert!(ClassicalWing::from_surface(&straight, &sections).is_ok());
    }

    #[test]
    fn bad_inputs_are_errors() {
        let wing = ClassicalWing::new(1.0, |_| ClassicalStation {
            cl_alpha_per_rad: f64::NAN,
            ..flat(0.1)
        });
        assert!(matches!(
            wing.solve(10),
            Err(LiftingLineError::InvalidInput { .. })
        ));
        let wing = ClassicalWing::new(-1.0, |_| flat(0.1));
        assert!(wing.solve(10).is_err());
    }
}
