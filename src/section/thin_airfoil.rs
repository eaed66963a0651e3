//! Thin-airfoil theory for an arbitrary mean line (Glauert's Fourier solution).
//!
//! The mean line z(x)/c is represented by its slope dz/dx. With `x = (1 - cos theta) / 2` the
//! vortex sheet on the chord is the Fourier series of Glauert, and for an angle of attack
//! `alpha` (rad, from the chord line)
//!
//! - `A0 = alpha - (1/pi) int_0^pi dz/dx dtheta`,
//! - `An = (2/pi) int_0^pi dz/dx cos(n theta) dtheta`,
//! - `cl = 2 pi (A0 + A1 / 2)`, zero-lift angle `alpha_L0 = (1/pi) int dz/dx (cos theta - 1) dtheta`,
//! - `cm_c/4 = (pi/4) (A2 - A1)`, independent of alpha (the quarter chord is the aerodynamic
//!   centre), `x_cp/c = 1/4 (1 + pi (A1 - A2) / cl)`.
//!
//! The integrals are taken by composite Gauss-Legendre quadrature in theta, with the mean
//! line's joints (where its formula changes) as panel edges so that each piece is smooth.
//! Valid for thin sections at small angles in incompressible, inviscid flow; thickness does
//! not enter.
//!
//! # References
//! - Glauert, H. (1926). The Elements of Aerofoil and Airscrew Theory. Cambridge University
//!   Press (thin aerofoil, Fourier coefficients).
//! - Anderson, J. D. (2017). Fundamentals of Aerodynamics, 6th ed., McGraw-Hill, ch. 4
//!   (cambered thin airfoil: A0, An, cl, cm_c/4, centre of pressure).

use std::f64::consts::PI;

/// A mean line described by its slope.
pub trait MeanLine {
    /// Slope dz/dx of the mean line at x/c in (0, 1).
    fn slope(&self, x_c: f64) -> f64;
    /// Positions x/c in (0, 1) where the slope or its derivatives jump (quadrature joints).
    fn joints(&self) -> Vec<f64> {
        Vec::new()
    }
}

/// A mean line given by a slope function, with optional joints.
pub struct SlopeFn<F: Fn(f64) -> f64> {
    /// The slope dz/dx as a function of x/c.
    pub slope: F,
    /// Joints x/c where the function changes form.
    pub joints: Vec<f64>,
}

impl<F: Fn(f64) -> f64> MeanLine for SlopeFn<F> {
    fn slope(&self, x_c: f64) -> f64 {
        (self.slope)(x_c)
    }
    fn joints(&self) -> Vec<f64> {
        self.joints.clone()
    }
}

impl MeanLine for crate::section::naca::NacaProfile {
    fn slope(&self, x_c: f64) -> f64 {
        self.camber_slope(x_c)
    }
    fn joints(&self) -> Vec<f64> {
        self.mean_line_joint().into_iter().collect()
    }
}

/// Errors of the sampled mean line.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum ThinAirfoilError {
    /// Fewer than two points.
    #[error("a sampled mean line needs at least 2 points, got {0}")]
    TooFewPoints(usize),
    /// x not strictly increasing, or outside 0..1, or not finite.
    #[error(
        "sampled mean line point {index}: x/c must increase strictly from 0 to 1 and be finite"
    )]
    BadStation {
        /// Index of the offending point.
        index: usize,
    },
}

/// A mean line sampled at points (x/c, z/c), x strictly increasing from 0 to 1; linear
/// between points (so its slope is constant on each interval).
#[derive(Debug, Clone, PartialEq)]
pub struct SampledMeanLine {
    points: Vec<[f64; 2]>,
}

impl SampledMeanLine {
    /// Builds the mean line, checking the stations.
    pub fn new(points: Vec<[f64; 2]>) -> Result<SampledMeanLine, ThinAirfoilError> {
        if points.len() < 2 {
            return Err(ThinAirfoilError::TooFewPoints(points.len()));
        }
        for (i, p) in points.iter().enumerate() {
            let bad_order = i > 0 && p[0] <= points[i - 1][0];
            if !p[0].is_finite() || !p[1].is_finite() || bad_order || !(0.0..=1.0).contains(&p[0]) {
                return Err(ThinAirfoilError::BadStation { index: i });
            }
        }
        Ok(SampledMeanLine { points })
    }

    /// The sample points.
    pub fn points(&self) -> &[[f64; 2]] {
        &self.points
    }
}

impl MeanLine for SampledMeanLine {
    fn slope(&self, x_c: f64) -> f64 {
        let p = &self.points;
        let k = p.partition_point(|q| q[0] <= x_c).clamp(1, p.len() - 1);
        (p[k][1] - p[k - 1][1]) / (p[k][0] - p[k - 1][0])
    }
    fn joints(&self) -> Vec<f64> {
        self.points
            .iter()
            .map(|p| p[0])
            .filter(|&x| x > 0.0 && x < 1.0)
            .collect()
    }
}

/// The angle-independent part of Glauert's solution for one mean line.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ThinAirfoil {
    /// `(1/pi) int dz/dx dtheta`: A0 = alpha - this.
    pub slope_mean: f64,
    /// Fourier coefficient A1.
    pub a1: f64,
    /// Fourier coefficient A2.
    pub a2: f64,
}

/// Gauss-Legendre nodes and weights on [-1, 1], 8 points.
const GAUSS_8: [(f64, f64); 8] = [
    (-0.960_289_856_497_536_3, 0.101_228_536_290_376_26),
    (-0.796_666_477_413_626_7, 0.222_381_034_453_374_47),
    (-0.525_532_409_916_329, 0.313_706_645_877_887),
    (-0.183_434_642_495_649_8, 0.362_683_783_378_362),
    (0.183_434_642_495_649_8, 0.362_683_783_378_362),
    (0.525_532_409_916_329, 0.313_706_645_877_887),
    (0.796_666_477_413_626_7, 0.222_381_034_453_374_47),
    (0.960_289_856_497_536_3, 0.101_228_536_290_376_26),
];

/// Sub-intervals of theta between joints (each smooth piece is cut into this many).
const PIECES_PER_SEGMENT: usize = 24;

impl ThinAirfoil {
    /// Computes the coefficients of `mean_line` by quadrature.
    pub fn solve(mean_line: &dyn MeanLine) -> ThinAirfoil {
        let mut edges: Vec<f64> = vec![0.0, PI];
        for x in mean_line.joints() {
            if x > 0.0 && x < 1.0 {
                edges.push((1.0 - 2.0 * x).acos());
            }
        }
        edges.sort_by(f64::total_cmp);
        edges.dedup_by(|a, b| (*a - *b).abs() < 1e-14);
        let (mut i0, mut i1, mut i2) = (0.0, 0.0, 0.0);
        for w in edges.windows(2) {
            let h = (w[1] - w[0]) / PIECES_PER_SEGMENT as f64;
            for k in 0..PIECES_PER_SEGMENT {
                let lo = w[0] + h * k as f64;
                for &(node, weight) in &GAUSS_8 {
                    let theta = lo + 0.5 * h * (node + 1.0);
                    let s = mean_line.slope(0.5 * (1.0 - theta.cos()));
                    let wt = 0.5 * h * weight;
                    i0 += wt * s;
                    i1 += wt * s * theta.cos();
                    i2 += wt * s * (2.0 * theta).cos();
                }
            }
        }
        ThinAirfoil {
            slope_mean: i0 / PI,
            a1: 2.0 * i1 / PI,
            a2: 2.0 * i2 / PI,
        }
    }

    /// A0 at angle of attack `alpha_rad`.
    pub fn a0(&self, alpha_rad: f64) -> f64 {
        alpha_rad - self.slope_mean
    }

    /// Lift coefficient at `alpha_rad`: `2 pi (A0 + A1/2)`.
    pub fn cl(&self, alpha_rad: f64) -> f64 {
        2.0 * PI * (self.a0(alpha_rad) + 0.5 * self.a1)
    }

    /// Zero-lift angle, rad.
    pub fn alpha_zero_lift_rad(&self) -> f64 {
        self.slope_mean - 0.5 * self.a1
    }

    /// Lift slope, per rad (2 pi).
    pub fn cl_alpha_per_rad(&self) -> f64 {
        2.0 * PI
    }

    /// Moment coefficient about the quarter chord (positive nose up), the same at every alpha.
    pub fn cm_quarter_chord(&self) -> f64 {
        0.25 * PI * (self.a2 - self.a1)
    }

    /// Moment coefficient about the leading edge at `alpha_rad` (positive nose up).
    pub fn cm_leading_edge(&self, alpha_rad: f64) -> f64 {
        -0.25 * self.cl(alpha_rad) + self.cm_quarter_chord()
    }

    /// Centre of pressure x_cp/c at `alpha_rad`; `None` where the lift is (nearly) zero.
    pub fn centre_of_pressure(&self, alpha_rad: f64) -> Option<f64> {
        let cl = self.cl(alpha_rad);
        if cl.abs() < 1e-9 {
            None
        } else {
            Some(0.25 * (1.0 + PI * (self.a1 - self.a2) / cl))
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    #[test]
    fn flat_plate_has_no_camber_terms() {
        let t = ThinAirfoil::solve(&SlopeFn {
            slope: |_| 0.0,
            joints: vec![],
        });
        assert_relative_eq!(t.alpha_zero_lift_rad(), 0.0, epsilon = 1e-15);
        assert_relative_eq!(t.cm_quarter_chord(), 0.0, epsilon = 1e-15);
        assert_relative_eq!(t.cl(0.1), 0.2 * PI, epsilon = 1e-12);
    }

    #[test]
    fn parabolic_mean_line_matches_closed_form() {
        // z = 4 h x (1 - x): alpha_L0 = -2h, cm_c/4 = -pi h, A1 = 4h, A2 = 0 (Anderson,
        // Fundamentals of Aerodynamics, ch. 4, circular-arc camber); tolerance 1e-12 because
        // the integrand is a trigonometric polynomial, integrated exactly by the quadrature.
        let h = 0.03;
        let t = ThinAirfoil::solve(&SlopeFn {
            slope: move |x| 4.0 * h * (1.0 - 2.0 * x),
            joints: vec![],
        });
        assert_relative_eq!(t.alpha_zero_lift_rad(), -2.0 * h, epsilon = 1e-12);
        assert_relative_eq!(t.cm_quarter_chord(), -PI * h, epsilon = 1e-12);
        assert_relative_eq!(t.a2, 0.0, epsilon = 1e-12);
    }

    #[test]
    fn sampled_line_of_a_parabola_converges_to_it() {
        // Piecewise-linear samples of z = 4 h x (1 - x) on 401 cosine stations: the slope error
        // is O(dx), so 1e-4 relative is a generous bound.
        let h = 0.02;
        let pts: Vec<[f64; 2]> = (0..=400)
            .map(|i| {
                let x = 0.5 * (1.0 - (PI * i as f64 / 400.0).cos());
                [x, 4.0 * h * x * (1.0 - x)]
            })
            .collect();
        let t = ThinAirfoil::solve(&SampledMeanLine::new(pts).unwrap());
        assert_relative_eq!(t.alpha_zero_lift_rad(), -2.0 * h, max_relative = 1e-4);
        assert_relative_eq!(t.cm_quarter_chord(), -PI * h, max_relative = 1e-4);
    }

    #[test]
    fn sampled_line_rejects_bad_stations() {
        assert_eq!(
            SampledMeanLine::new(vec![[0.0, 0.0]]),
            Err(ThinAirfoilError::TooFewPoints(1))
        );
        assert_eq!(
            SampledMeanLine::new(vec![[0.0, 0.0], [0.5, 0.0], [0.4, 0.0]]),
            Err(ThinAirfoilError::BadStation { index: 2 })
        );
    }

    #[test]
    fn centre_of_pressure_is_undefined_at_zero_lift() {
        let t = ThinAirfoil::solve(&SlopeFn {
            slope: |x| 0.08 * (1.0 - 2.0 * x),
            joints: vec![],
        });
        assert!(t.centre_of_pressure(t.alpha_zero_lift_rad()).is_none());
        let xcp = t.centre_of_pressure(0.1).unwrap();
        assert!(xcp > 0.25 && xcp < 1.0);
    }
}
