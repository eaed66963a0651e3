//! Flow past a circle with circulation, carried to an airfoil by a conformal map: the common
//! part of the Joukowski and Karman-Trefftz solutions.
//!
//! In the zeta plane a circle of radius `a` about `mu` passes through the map's singular point
//! `zeta = b` (the trailing edge). With unit free-stream speed at angle `alpha_x` to the real
//! axis the complex potential is
//! `F = (zeta - mu) e^{-i alpha_x} + a^2 e^{i alpha_x} / (zeta - mu) + (i Gamma / 2 pi) ln(zeta - mu)`
//! (Gamma positive clockwise). The Kutta condition puts the rear stagnation point at
//! `zeta = b`: `Gamma = 4 pi a sin(alpha_x + beta)`, `beta = arg(b - mu)` negated.
//!
//! Forces and moment come from Blasius' theorem by residues at infinity: when the map behaves
//! as `z = zeta + k / zeta + O(zeta^-3)` far away, the force is `X - iY = -i rho U Gamma
//! e^{-i alpha_x}` (Kutta-Joukowski) and the counter-clockwise moment about z = 0 is
//! `M0 = rho U Gamma Re(mu e^{-i alpha_x}) - 2 pi rho k U^2 sin(2 alpha_x)`.
//!
//! All public angles here are measured from the chord line of the produced shape (leading
//! edge, the point farthest from the trailing edge, to trailing edge); coefficients use the
//! true chord of that shape. Coordinates are chord fractions with the leading edge at (0, 0)
//! and the trailing edge at (1, 0). Moments are positive nose up.
//!
//! # References
//! - Milne-Thomson, L. M. (1968). Theoretical Hydrodynamics, 5th ed., Macmillan (circle theorem,
//!   Blasius' theorem, aerofoils).
//! - Katz, J., Plotkin, A. (2001). Low-Speed Aerodynamics, 2nd ed., Cambridge University Press,
//!   ch. 6 (Joukowski and Karman-Trefftz airfoils, Kutta condition).

use nalgebra::Complex;
use std::f64::consts::PI;

/// Complex numbers used by the maps.
pub type C64 = Complex<f64>;

/// A conformal map from the circle plane (zeta) to the airfoil plane (z).
pub trait CircleMap {
    /// Singular point `b` on the positive real axis, the image of the trailing edge.
    fn b(&self) -> f64;
    /// The map z(zeta).
    fn z(&self, zeta: C64) -> C64;
    /// The derivative dz/dzeta.
    fn dz_dzeta(&self, zeta: C64) -> C64;
    /// The constant k of the far-field expansion `z = zeta + k/zeta + O(zeta^-3)`.
    fn far_field_k(&self) -> f64;
    /// The conjugate velocity dF/dz at the trailing edge itself, given dW/dzeta there
    /// (W = dF/dzeta vanishes at the trailing edge by the Kutta condition).
    fn trailing_edge_velocity(&self, dw_dzeta: C64) -> C64;
}

/// Errors of the circle-map airfoils.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum CircleMapError {
    /// Circle centre outside the accepted range.
    #[error("circle centre ({mu_x}, {mu_y}) is outside the accepted range (-0.5 < mu_x <= 0, -0.5 < mu_y < 0.5, in units of b)")]
    Centre {
        /// Real part of the centre.
        mu_x: f64,
        /// Imaginary part of the centre.
        mu_y: f64,
    },
    /// Thickness or camber outside the accepted range.
    #[error("{what} {value} is outside the accepted range {range}")]
    Shape {
        /// Which quantity.
        what: &'static str,
        /// The value given.
        value: f64,
        /// Accepted range, in words.
        range: &'static str,
    },
    /// Trailing-edge angle outside the accepted range.
    #[error("trailing-edge angle {:.2} deg is outside the accepted range 0 <= angle < 57.3 deg (1 rad)", .0.to_degrees())]
    TrailingEdgeAngle(f64),
    /// Trailing-edge angle too large for the thickness and camber asked for (see
    /// [`crate::section::karman_trefftz::max_trailing_edge_angle_rad`]).
    #[error("trailing-edge angle {:.2} deg is too large for thickness {:.2} % and camber {:.2} % (accepted: 0 to {:.2} deg for this thickness and camber; no section this thin has a larger angle, a thicker one allows more)", .angle_rad.to_degrees(), 100.0 * .thickness_ratio, 100.0 * .camber_ratio, .max_rad.to_degrees())]
    TrailingEdgeAngleForShape {
        /// The angle asked for, rad.
        angle_rad: f64,
        /// Thickness ratio asked for.
        thickness_ratio: f64,
        /// Camber ratio asked for.
        camber_ratio: f64,
        /// Largest angle accepted for them, rad.
        max_rad: f64,
    },
    /// The circle that gives the requested shape was not found.
    #[error("no circle found for thickness {thickness_ratio} and camber {camber_ratio} (residual {residual:.1e})")]
    NotConverged {
        /// Requested thickness ratio.
        thickness_ratio: f64,
        /// Requested camber ratio.
        camber_ratio: f64,
        /// Remaining mismatch.
        residual: f64,
    },
}

/// One point on the surface with its flow.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SurfacePoint {
    /// x/c in the chord frame.
    pub x_c: f64,
    /// y/c in the chord frame.
    pub y_c: f64,
    /// Local speed / free-stream speed.
    pub speed_ratio: f64,
    /// Pressure coefficient `1 - (V/U)^2`.
    pub cp: f64,
}

/// An airfoil made by a [`CircleMap`] from a circle through its singular point.
#[derive(Debug, Clone, PartialEq)]
pub struct CircleAirfoil<M: CircleMap> {
    map: M,
    centre: C64,
    radius: f64,
    beta_rad: f64,
    z_te: C64,
    z_le: C64,
    chord: f64,
    /// Unit vector from leading edge to trailing edge.
    chord_dir: C64,
}

/// Angular samples around the circle used to locate the leading edge and measure the shape.
const SHAPE_SAMPLES: usize = 2000;

/// Smallest thickness ratio the shape solution is checked for (see `tests/suite/input_errors.rs`).
/// Thinner cambered sections with a trailing-edge angle near its limit may fail to converge:
/// their thickness is below what the 2000 sampled surface points measure reliably on a
/// cambered section (interpolation error about 1e-7 of the chord). The aircraft file accepts
/// no thinner section.
pub const MIN_RELIABLE_THICKNESS_RATIO: f64 = 0.001;

/// Thickness ratio accepted by the shape solution: less than this.
pub const MAX_THICKNESS_RATIO: f64 = 0.4;

/// Camber ratio accepted by the shape solution: 0 or more, less than this.
pub const MAX_CAMBER_RATIO: f64 = 0.15;

/// Most Newton steps when solving for the circle of a given thickness and camber.
const MAX_SHAPE_ITERATIONS: usize = 60;

/// Mismatch in thickness plus camber (fractions of chord) accepted by the shape solution.
const SHAPE_TOLERANCE: f64 = 1e-11;

/// Relative mismatch accepted when no step reduces it further (the sampled shape measure has
/// small steps of its own).
const SHAPE_STALL_TOLERANCE: f64 = 1e-6;

/// Refuses a thickness ratio outside 0 < t/c < 0.4 or a camber ratio outside 0 <= f/c < 0.15.
fn check_shape(thickness_ratio: f64, camber_ratio: f64) -> Result<(), CircleMapError> {
    if !(thickness_ratio > 0.0 && thickness_ratio < MAX_THICKNESS_RATIO) {
        return Err(CircleMapError::Shape {
            what: "thickness ratio",
            value: thickness_ratio,
            range: "0 < t/c < 0.4",
        });
    }
    if !(0.0..MAX_CAMBER_RATIO).contains(&camber_ratio) {
        return Err(CircleMapError::Shape {
            what: "camber ratio",
            value: camber_ratio,
            range: "0 <= f/c < 0.15",
        });
    }
    Ok(())
}

/// Newton's step for the centre from the mismatch `r` and its Jacobian `j` (None when the
/// Jacobian is singular); a symmetric section moves along the axis only.
fn newton_step(j: [[f64; 2]; 2], r: [f64; 2], symmetric: bool) -> Option<[f64; 2]> {
    let det = j[0][0] * j[1][1] - j[0][1] * j[1][0];
    if symmetric {
        // A symmetric section keeps its centre on the axis; camber stays zero.
        let step = -r[0] / j[0][0];
        step.is_finite().then_some([step, 0.0])
    } else if det.is_finite() && det.abs() > 1e-300 {
        Some([
            -(j[1][1] * r[0] - j[0][1] * r[1]) / det,
            -(-j[1][0] * r[0] + j[0][0] * r[1]) / det,
        ])
    } else {
        None
    }
}

/// The proportional update of the thin-section estimates (t/c ~ 1.3 eps, f/c ~ mu_y / (2 b))
/// from the centre `mu`, its mismatch `r` and the wanted `(thickness, camber)` ratios.
fn proportional_step(
    mu: [f64; 2],
    r: [f64; 2],
    (thickness_ratio, camber_ratio): (f64, f64),
    b: f64,
    symmetric: bool,
) -> [f64; 2] {
    let (t, f) = (r[0] + thickness_ratio, r[1] + camber_ratio);
    [
        mu[0] * thickness_ratio / t - mu[0],
        if symmetric {
            0.0
        } else {
            2.0 * b * (camber_ratio - f)
        },
    ]
}

impl<M: CircleMap> CircleAirfoil<M> {
    /// Builds the airfoil for a circle centred at `(mu_x, mu_y)` (units of b) through `b`.
    pub(crate) fn with_map(map: M, mu_x: f64, mu_y: f64) -> Result<Self, CircleMapError> {
        let b = map.b();
        let ok = mu_x.is_finite()
            && mu_y.is_finite()
            && mu_x <= 0.0
            && mu_x > -0.5 * b
            && mu_y.abs() < 0.5 * b;
        if !ok {
            return Err(CircleMapError::Centre { mu_x, mu_y });
        }
        Ok(Self::build(map, mu_x, mu_y))
    }

    /// Builds the airfoil for a centre already checked: finite, with `mu_x <= 0` (the circle
    /// through `b` then holds `-b`, the map's other singular point) and `|mu| < b`.
    fn build(map: M, mu_x: f64, mu_y: f64) -> Self {
        let b = map.b();
        let centre = C64::new(mu_x, mu_y);
        let radius = (C64::new(b, 0.0) - centre).norm();
        let beta_rad = mu_y.atan2(b - mu_x);
        let z_te = map.z(C64::new(b, 0.0));
        let mut s = CircleAirfoil {
            map,
            centre,
            radius,
            beta_rad,
            z_te,
            z_le: z_te,
            chord: 0.0,
            chord_dir: C64::new(1.0, 0.0),
        };
        let theta_le = s.find_leading_edge();
        s.z_le = s.z_at(theta_le);
        let d = s.z_te - s.z_le;
        s.chord = d.norm();
        s.chord_dir = d / s.chord;
        s
    }

    /// Solves for the circle centre that gives greatest thickness `thickness_ratio` and
    /// greatest camber `camber_ratio` (fractions of chord, measured normal to the chord line).
    pub(crate) fn with_shape(
        make_map: impl Fn() -> M,
        thickness_ratio: f64,
        camber_ratio: f64,
    ) -> Result<Self, CircleMapError> {
        check_shape(thickness_ratio, camber_ratio)?;
        let b = make_map().b();
        // The airfoil of a centre and its mismatch (infinite if the shape cannot be measured).
        let eval = |mu: [f64; 2]| -> (Self, [f64; 2]) {
            let trial = Self::build(make_map(), mu[0], mu[1]);
            let (t, f) = trial.shape_ratios();
            let r = [t - thickness_ratio, f - camber_ratio];
            if r[0].is_finite() && r[1].is_finite() {
                (trial, r)
            } else {
                (trial, [f64::INFINITY; 2])
            }
        };
        let norm = |r: [f64; 2]| r[0].abs() + r[1].abs();
        let symmetric = camber_ratio == 0.0;
        // Keep the centre strictly inside the region where the map is one to one. This is wider
        // than `with_map` accepts: the thickest, most cambered sections (40 %, 15 %) need
        // |mu_y| a little over b / 2.
        let (lo_x, hi_x, lim_y) = (-0.9 * b, -1e-12 * b, 0.9 * b);
        let clamp = |mu: [f64; 2]| [mu[0].clamp(lo_x, hi_x), mu[1].clamp(-lim_y, lim_y)];
        // Start from the thin-section estimates t/c ~ 1.3 eps and f/c ~ mu_y / (2 b).
        let mut mu = clamp([-b * thickness_ratio / 1.3, 2.0 * b * camber_ratio]);
        let (mut best, mut r) = eval(mu);
        // Newton's method on (thickness, camber) with a forward-difference Jacobian and a
        // halving line search. Near the smallest thickness a trailing-edge angle allows (the
        // two-arc section, mu_x -> 0) thickness depends on mu_x with a large offset, where a
        // simple proportional update converges too slowly; Newton's method does not mind.
        for _ in 0..MAX_SHAPE_ITERATIONS {
            if norm(r) < SHAPE_TOLERANCE {
                return Ok(best);
            }
            // Difference step: small against the centre's distance from the axis, which is of
            // the order of the thickness.
            let h = (1e-4 * mu[0].abs()).clamp(1e-12 * b, 1e-7 * b);
            // Step into the region: towards more negative mu_x unless at its lower bound.
            let hx = if mu[0] - h > lo_x { -h } else { h };
            let hy = if mu[1] + h < lim_y { h } else { -h };
            let (_, rx) = eval([mu[0] + hx, mu[1]]);
            let ry = if symmetric {
                r
            } else {
                eval([mu[0], mu[1] + hy]).1
            };
            let j = [
                [(rx[0] - r[0]) / hx, (ry[0] - r[0]) / hy],
                [(rx[1] - r[1]) / hx, (ry[1] - r[1]) / hy],
            ];
            let newton = newton_step(j, r, symmetric);
            // The proportional update of the thin-section estimates, used when Newton's step
            // does not reduce the mismatch.
            let fallback = proportional_step(mu, r, (thickness_ratio, camber_ratio), b, symmetric);
            let mut moved = false;
            for step in newton.into_iter().chain(std::iter::once(fallback)) {
                if !(step[0].is_finite() && step[1].is_finite()) {
                    continue;
                }
                let mut lambda = 1.0;
                for _ in 0..30 {
                    let next = clamp([mu[0] + lambda * step[0], mu[1] + lambda * step[1]]);
                    let (trial, rn) = eval(next);
                    if norm(rn) < norm(r) {
                        (mu, best, r) = (next, trial, rn);
                        moved = true;
                        break;
                    }
                    lambda *= 0.5;
                }
                if moved {
                    break;
                }
            }
            if !moved {
                break;
            }
        }
        // Stalled: the sampled measure of the shape is not smooth below about 1e-8 of the chord;
        // accept what is that close.
        if r[0].abs() < SHAPE_STALL_TOLERANCE * thickness_ratio
            && r[1].abs() < SHAPE_STALL_TOLERANCE * thickness_ratio.max(camber_ratio)
        {
            return Ok(best);
        }
        Err(CircleMapError::NotConverged {
            thickness_ratio,
            camber_ratio,
            residual: norm(r),
        })
    }

    /// The map.
    pub fn map(&self) -> &M {
        &self.map
    }

    /// Circle centre (mu_x, mu_y), units of b.
    pub fn centre(&self) -> (f64, f64) {
        (self.centre.re, self.centre.im)
    }

    /// Circle radius, units of b.
    pub fn radius(&self) -> f64 {
        self.radius
    }

    /// Angle beta (rad): the zero-lift angle measured from the real axis is `-beta`.
    pub fn beta_rad(&self) -> f64 {
        self.beta_rad
    }

    /// Chord of the produced shape (leading edge to trailing edge), units of b.
    pub fn chord(&self) -> f64 {
        self.chord
    }

    /// Inclination of the chord line (leading to trailing edge) to the real axis, rad
    /// (positive when the trailing edge is higher than the leading edge). An angle of attack
    /// from the real axis is `alpha_axis = alpha_chord + chord_angle_rad()`.
    pub fn chord_angle_rad(&self) -> f64 {
        self.chord_dir.arg()
    }

    fn alpha_axis(&self, alpha_rad: f64) -> f64 {
        alpha_rad + self.chord_angle_rad()
    }

    fn zeta_at(&self, theta: f64) -> C64 {
        self.centre + C64::from_polar(self.radius, theta)
    }

    fn z_at(&self, theta: f64) -> C64 {
        self.map.z(self.zeta_at(theta))
    }

    fn theta_te(&self) -> f64 {
        -self.beta_rad
    }

    /// Circle angle of the point farthest from the trailing edge: sampling, then bisection on
    /// the derivative of the squared distance, `2 Re[(z - z_te) conj(dz/dtheta)]`.
    fn find_leading_edge(&self) -> f64 {
        let dist = |th: f64| (self.z_at(th) - self.z_te).norm();
        let slope = |th: f64| {
            let zeta = self.zeta_at(th);
            let dz_dtheta = self.map.dz_dzeta(zeta) * (zeta - self.centre) * C64::new(0.0, 1.0);
            ((self.map.z(zeta) - self.z_te) * dz_dtheta.conj()).re
        };
        let t0 = self.theta_te();
        let step = 2.0 * PI / SHAPE_SAMPLES as f64;
        let (mut best, mut best_d) = (t0 + PI, 0.0);
        for i in 1..SHAPE_SAMPLES {
            let th = t0 + step * i as f64;
            let d = dist(th);
            if d > best_d {
                best_d = d;
                best = th;
            }
        }
        let (mut lo, mut hi) = (best - step, best + step);
        if slope(lo) < 0.0 || slope(hi) > 0.0 {
            return best;
        }
        for _ in 0..200 {
            let m = 0.5 * (lo + hi);
            if m <= lo || m >= hi {
                break;
            }
            if slope(m) > 0.0 {
                lo = m;
            } else {
                hi = m;
            }
        }
        0.5 * (lo + hi)
    }

    /// A point of the z plane in chord-frame fractions (x/c, y/c).
    fn to_chord_frame(&self, z: C64) -> [f64; 2] {
        let w = (z - self.z_le) * self.chord_dir.conj() / self.chord;
        [w.re, w.im]
    }

    /// Surface coordinates: `n_points + 1` points equally spaced in the circle angle, from the
    /// trailing edge over the upper surface and back (the trailing edge appears twice).
    pub fn coordinates(&self, n_points: usize) -> Vec<[f64; 2]> {
        let n = n_points.max(8);
        let t0 = self.theta_te();
        (0..=n)
            .map(|i| {
                if i == 0 || i == n {
                    [1.0, 0.0]
                } else {
                    self.to_chord_frame(self.z_at(t0 + 2.0 * PI * i as f64 / n as f64))
                }
            })
            .collect()
    }

    /// Greatest thickness and camber (fractions of chord), measured normal to the chord line
    /// on 2000 sampled surface points.
    pub fn shape_ratios(&self) -> (f64, f64) {
        let pts = self.coordinates(SHAPE_SAMPLES);
        let le = pts
            .iter()
            .enumerate()
            .min_by(|a, b| a.1[0].total_cmp(&b.1[0]))
            .map(|(i, _)| i)
            .unwrap_or(0);
        let mut upper: Vec<[f64; 2]> = pts[..=le].to_vec();
        upper.reverse();
        let lower: Vec<[f64; 2]> = pts[le..].to_vec();
        let interp = |s: &[[f64; 2]], x: f64| -> f64 {
            let k = s.partition_point(|p| p[0] < x).clamp(1, s.len() - 1);
            let (p, q) = (s[k - 1], s[k]);
            if q[0] > p[0] {
                p[1] + (q[1] - p[1]) * (x - p[0]) / (q[0] - p[0])
            } else {
                q[1]
            }
        };
        let n = 800;
        let stations = (1..n).map(|i| 0.5 * (1.0 - (PI * i as f64 / n as f64).cos()));
        let thickness: Vec<f64> = stations
            .clone()
            .map(|x| interp(&upper, x) - interp(&lower, x))
            .collect();
        let camber: Vec<f64> = stations
            .map(|x| 0.5 * (interp(&upper, x) + interp(&lower, x)))
            .collect();
        (max_refined(&thickness), max_refined(&camber))
    }

    /// Circulation per unit free-stream speed, units of b (Kutta condition).
    pub fn circulation(&self, alpha_rad: f64) -> f64 {
        4.0 * PI * self.radius * (self.alpha_axis(alpha_rad) + self.beta_rad).sin()
    }

    /// Lift coefficient at `alpha_rad` (from the chord line), on the true chord.
    pub fn cl(&self, alpha_rad: f64) -> f64 {
        2.0 * self.circulation(alpha_rad) / self.chord
    }

    /// Zero-lift angle from the chord line, rad.
    pub fn alpha_zero_lift_rad(&self) -> f64 {
        -self.beta_rad - self.chord_angle_rad()
    }

    /// Lift slope at zero lift, per rad: `8 pi a / c`.
    pub fn cl_alpha_per_rad(&self) -> f64 {
        8.0 * PI * self.radius / self.chord
    }

    /// Moment coefficient about a point at `x_c` along the chord line (0 = leading edge),
    /// positive nose up (Blasius' theorem, exact).
    pub fn cm_about(&self, x_c: f64, alpha_rad: f64) -> f64 {
        let ax = self.alpha_axis(alpha_rad);
        let gamma = self.circulation(alpha_rad);
        let k = self.map.far_field_k();
        // Counter-clockwise moment about z = 0 over rho U^2.
        let m0 =
            gamma * (self.centre * C64::from_polar(1.0, -ax)).re - 2.0 * PI * k * (2.0 * ax).sin();
        // Force over rho U^2, and transfer to the reference point.
        let (fx, fy) = (-gamma * ax.sin(), gamma * ax.cos());
        let r = self.z_le + self.chord_dir * (x_c * self.chord);
        let m_ref = m0 - (r.re * fy - r.im * fx);
        -2.0 * m_ref / (self.chord * self.chord)
    }

    /// Moment coefficient about the leading edge, positive nose up.
    pub fn cm_leading_edge(&self, alpha_rad: f64) -> f64 {
        self.cm_about(0.0, alpha_rad)
    }

    /// Moment coefficient about the quarter chord, positive nose up.
    pub fn cm_quarter_chord(&self, alpha_rad: f64) -> f64 {
        self.cm_about(0.25, alpha_rad)
    }

    /// Surface point at circle angle offset `phi` from the trailing edge (0..2 pi, over the
    /// upper surface first) with its speed and pressure coefficient at `alpha_rad`.
    pub fn surface_point(&self, phi: f64, alpha_rad: f64) -> SurfacePoint {
        let ax = self.alpha_axis(alpha_rad);
        let theta = self.theta_te() + phi;
        let zeta = self.zeta_at(theta);
        let gamma = self.circulation(alpha_rad);
        let b = C64::new(self.map.b(), 0.0);
        let velocity = if (zeta - b).norm() < 1e-9 * self.map.b() {
            // dW/dzeta at the trailing edge: -G/(zeta-mu)^2 + 2 a^2 e^{i ax}/(zeta-mu)^3.
            let d = b - self.centre;
            let g = C64::new(0.0, gamma / (2.0 * PI));
            let dw =
                -g / (d * d) + C64::from_polar(2.0 * self.radius * self.radius, ax) / (d * d * d);
            self.map.trailing_edge_velocity(dw)
        } else {
            // Conjugate velocity on the circle: W = i (2 sin(theta - ax) + Gamma/(2 pi a)) e^{-i theta}.
            let w = C64::new(
                0.0,
                2.0 * (theta - ax).sin() + gamma / (2.0 * PI * self.radius),
            ) * C64::from_polar(1.0, -theta);
            w / self.map.dz_dzeta(zeta)
        };
        let speed = velocity.norm();
        let [x_c, y_c] = if phi == 0.0 {
            [1.0, 0.0]
        } else {
            self.to_chord_frame(self.map.z(zeta))
        };
        SurfacePoint {
            x_c,
            y_c,
            speed_ratio: speed,
            cp: 1.0 - speed * speed,
        }
    }

    /// Surface points with speed and Cp at `n_points + 1` circle angles equally spaced from
    /// the trailing edge (trailing edge at both ends), at `alpha_rad`.
    pub fn surface(&self, n_points: usize, alpha_rad: f64) -> Vec<SurfacePoint> {
        let n = n_points.max(8);
        (0..=n)
            .map(|i| {
                let phi = if i == n {
                    0.0
                } else {
                    2.0 * PI * i as f64 / n as f64
                };
                self.surface_point(phi, alpha_rad)
            })
            .collect()
    }
}

/// Greatest value of a sampled function, refined by a parabola through the largest sample and
/// its neighbours.
fn max_refined(v: &[f64]) -> f64 {
    let (k, &m) = match v.iter().enumerate().max_by(|a, b| a.1.total_cmp(b.1)) {
        Some(x) => x,
        None => return 0.0,
    };
    if k == 0 || k + 1 >= v.len() {
        return m;
    }
    let (a, c) = (v[k - 1], v[k + 1]);
    let denom = a - 2.0 * m + c;
    if denom >= 0.0 {
        return m;
    }
    m - 0.125 * (c - a) * (c - a) / denom
}
