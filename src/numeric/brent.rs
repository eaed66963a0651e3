//! Brent's method: the root of a continuous function of one variable inside a bracket where
//! it changes sign, by inverse quadratic interpolation or the secant step where they make
//! good progress and bisection where they do not.
//!
//! The method keeps three points: `b`, the best estimate so far; `c`, with f(c) of the
//! opposite sign to f(b), so that the root stays between `b` and `c`; and `a`, the previous
//! `b`. Each step tries inverse quadratic interpolation through the three points (or the
//! secant through `a` and `b` when two of them coincide) and takes it only when it lands
//! well inside the bracket and shrinks the step faster than halving would; otherwise it
//! bisects. The bracket therefore always contains a sign change, convergence is guaranteed
//! for any function with a sign change between the ends (continuous or not), and for a
//! smooth function with a simple root the order is about 1.84. The search ends when half
//! the bracket is within `2 eps |b| + x_tolerance / 2` or f(b) is zero.
//!
//! Assumes: f is finite on the bracket and f(a), f(b) differ in sign (or one is zero).
//! Anything else is a [`RootError`], never a panic.
//!
//! # References
//! - R. P. Brent, *Algorithms for Minimization without Derivatives*, Prentice-Hall, 1973,
//!   ch. 4 (the algorithm and its convergence guarantee; the procedure `zero`).
//! - W. H. Press, S. A. Teukolsky, W. T. Vetterling, B. P. Flannery, *Numerical Recipes*,
//!   3rd ed., 2007, sec. 9.3 (van Wijngaarden-Dekker-Brent method).

/// When to stop and how long to try.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Settings {
    /// Absolute tolerance on the root, in the units of x (> 0); the search also stops within
    /// a few rounding units of `|x|`.
    pub x_tolerance: f64,
    /// Most evaluations of f after the two ends.
    pub max_iterations: usize,
}

/// A root found, with the other end of the last bracket.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Root {
    /// The best estimate of the root.
    pub x: f64,
    /// f there.
    pub fx: f64,
    /// The other end of the last bracket (within about twice the tolerance of `x`).
    pub other_x: f64,
    /// f there (of the opposite sign to `fx`, or `fx` is zero).
    pub other_fx: f64,
    /// Evaluations of f after the two ends.
    pub iterations: usize,
}

impl Root {
    /// The end of the last bracket where f >= 0 (the root itself when f is zero there).
    pub fn nonnegative_end(&self) -> f64 {
        if self.fx >= 0.0 {
            self.x
        } else {
            self.other_x
        }
    }

    /// The end of the last bracket where f < 0, or the root itself when f is zero there.
    pub fn negative_end(&self) -> f64 {
        if self.fx > 0.0 {
            self.other_x
        } else {
            self.x
        }
    }
}

/// Why no root was found.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum RootError<E: std::error::Error + 'static> {
    /// f has the same sign at both ends (or one end's value is not a number).
    #[error("f has no sign change over the bracket: f({a}) = {fa}, f({b}) = {fb}")]
    NoSignChange {
        /// One end.
        a: f64,
        /// f there.
        fa: f64,
        /// The other end.
        b: f64,
        /// f there.
        fb: f64,
    },
    /// f returned a value that is not finite, or an end is not finite.
    #[error("f({x}) = {fx} is not finite")]
    NonFinite {
        /// Where.
        x: f64,
        /// The value.
        fx: f64,
    },
    /// The tolerance was not reached within the allowed evaluations.
    #[error(
        "no root within the tolerance after {iterations} evaluations; last bracket [{a}, {b}]"
    )]
    NotConverged {
        /// Evaluations made.
        iterations: usize,
        /// One end of the last bracket (the best estimate).
        a: f64,
        /// The other end.
        b: f64,
    },
    /// The tolerance is not a positive finite number.
    #[error("x_tolerance = {0} must be finite and > 0")]
    BadTolerance(f64),
    /// f itself failed.
    #[error(transparent)]
    Function(E),
}

/// The root of `f` between `a` and `b`, with `fa` = f(a) and `fb` = f(b) already known
/// (callers usually have them from the scan that found the bracket).
pub fn find_root<E: std::error::Error + 'static>(
    mut f: impl FnMut(f64) -> Result<f64, E>,
    (a, fa): (f64, f64),
    (b, fb): (f64, f64),
    settings: Settings,
) -> Result<Root, RootError<E>> {
    let t = settings.x_tolerance;
    if !(t.is_finite() && t > 0.0) {
        return Err(RootError::BadTolerance(t));
    }
    for (x, fx) in [(a, fa), (b, fb)] {
        if !(x.is_finite() && fx.is_finite()) {
            return Err(RootError::NonFinite { x, fx });
        }
    }
    if (fa > 0.0 && fb > 0.0) || (fa < 0.0 && fb < 0.0) {
        return Err(RootError::NoSignChange { a, fa, b, fb });
    }
    let (mut a, mut fa, mut b, mut fb) = (a, fa, b, fb);
    let (mut c, mut fc) = (a, fa);
    let (mut d, mut e) = (b - a, b - a);
    let mut iterations = 0;
    loop {
        if (fb > 0.0 && fc > 0.0) || (fb < 0.0 && fc < 0.0) {
            // Keep the root between b and c.
            (c, fc) = (a, fa);
            d = b - a;
            e = d;
        }
        if fc.abs() < fb.abs() {
            // b is the better estimate.
            (a, fa) = (b, fb);
            (b, fb) = (c, fc);
            (c, fc) = (a, fa);
        }
        let tol1 = 2.0 * f64::EPSILON * b.abs() + 0.5 * t;
        let m = 0.5 * (c - b);
        if m.abs() <= tol1 || fb == 0.0 {
            return Ok(Root {
                x: b,
                fx: fb,
                other_x: c,
                other_fx: fc,
                iterations,
            });
        }
        if iterations >= settings.max_iterations {
            return Err(RootError::NotConverged {
                iterations,
                a: b,
                b: c,
            });
        }
        if e.abs() >= tol1 && fa.abs() > fb.abs() {
            // Try interpolation: p / q is the step from b.
            let s = fb / fa;
            let (mut p, mut q) = if a.to_bits() == c.to_bits() {
                // Secant (two of the points coincide).
                (2.0 * m * s, 1.0 - s)
            } else {
                // Inverse quadratic interpolation through a, b and c.
                let (qa, r) = (fa / fc, fb / fc);
                (
                    s * (2.0 * m * qa * (qa - r) - (b - a) * (r - 1.0)),
                    (qa - 1.0) * (r - 1.0) * (s - 1.0),
                )
            };
            if p > 0.0 {
                q = -q;
            } else {
                p = -p;
            }
            // Accept only a step well inside the bracket that shrinks faster than bisection.
            if 2.0 * p < (3.0 * m * q - (tol1 * q).abs()).min((e * q).abs()) {
                e = d;
                d = p / q;
            } else {
                d = m;
                e = m;
            }
        } else {
            d = m;
            e = m;
        }
        (a, fa) = (b, fb);
        b += if d.abs() > tol1 { d } else { tol1.copysign(m) };
        fb = f(b).map_err(RootError::Function)?;
        iterations += 1;
        if !fb.is_finite() {
            return Err(RootError::NonFinite { x: b, fx: fb });
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use std::convert::Infallible;

    fn settings(x_tolerance: f64) -> Settings {
        Settings {
            x_tolerance,
            max_iterations: 100,
        }
    }

    fn ok(f: impl Fn(f64) -> f64) -> impl FnMut(f64) -> Result<f64, Infallible> {
        move |x| Ok(f(x))
    }

    fn solve(f: impl Fn(f64) -> f64, a: f64, b: f64, tol: f64) -> Root {
        let (fa, fb) = (f(a), f(b));
        find_root(ok(f), (a, fa), (b, fb), settings(tol)).unwrap()
    }

    // Bisection from a unit bracket to 1e-12 takes 40 evaluations; Brent's method on a smooth
    // simple root converges with order about 1.84 (Brent 1973, ch. 3-4), so a dozen is
    // a generous bound for both smooth examples below.
    const SMOOTH_BOUND: usize = 12;

    // x^3 - 2x - 5 = 0 (the cubic Wallis solved by Newton's method, a classic test; the
    // expected root is Cardano's closed form, x = cbrt(5/2 + sqrt(D)) + cbrt(5/2 - sqrt(D)),
    // D = 25/4 - 8/27, evaluated here; value 2.0945514815423265). Tolerance 1e-12 absolute
    // plus the rounding of Cardano's formula in f64 (a few ulp).
    #[test]
    fn cubic_root_against_cardano() {
        let f = |x: f64| x * x * x - 2.0 * x - 5.0;
        let disc = (25.0_f64 / 4.0 - 8.0 / 27.0).sqrt();
        let cardano = (2.5 + disc).cbrt() + (2.5 - disc).cbrt();
        assert!((cardano - 2.094_551_481_542_326_5).abs() < 1e-15);
        let r = solve(f, 2.0, 3.0, 1e-12);
        assert!((r.x - cardano).abs() < 1e-12 + 8.0 * f64::EPSILON * cardano);
        assert!(r.iterations <= SMOOTH_BOUND, "{} evaluations", r.iterations);
        // The bracket is kept: the other end has f of the other sign, within 2 tolerances.
        assert!(r.fx * r.other_fx <= 0.0);
        assert!((r.x - r.other_x).abs() <= 2.0 * (1e-12 + 2.0 * f64::EPSILON * r.x.abs()));
        assert!(f(r.nonnegative_end()) >= 0.0 && f(r.negative_end()) <= 0.0);
    }

    // cos x = x (the Dottie number 0.7390851332151607, from memory); checked also by the
    // defining law: cos(root) - root within a few ulp. Tolerance 1e-12.
    #[test]
    fn cosine_fixed_point() {
        let f = |x: f64| x.cos() - x;
        let r = solve(f, 0.0, 1.0, 1e-12);
        assert!((r.x - 0.739_085_133_215_160_7).abs() < 1e-12);
        assert!(f(r.x).abs() < 1e-12);
        assert!(r.iterations <= SMOOTH_BOUND, "{} evaluations", r.iterations);
        // The same root with the ends given in the other order.
        let r2 = solve(f, 1.0, 0.0, 1e-12);
        assert!((r2.x - r.x).abs() < 2e-12);
    }

    // A root at a jump (f is -1 below 1/3 and +1 from there): no interpolation helps, the
    // method falls back on bisection and must still find the jump. Bound: bisection from a
    // unit bracket to 1e-10 takes 34 halvings; Brent's rejection tests cost at most a few
    // extra steps here (allow twice).
    #[test]
    fn finds_a_jump_at_bisection_speed() {
        let third = 1.0 / 3.0;
        let f = move |x: f64| if x < third { -1.0 } else { 1.0 };
        let r = solve(f, 0.0, 1.0, 1e-10);
        assert!((r.x - third).abs() <= 2e-10);
        assert!(r.iterations <= 68, "{} evaluations", r.iterations);
        assert!(r.nonnegative_end() >= third && r.negative_end() < third);
    }

    // A root at an end is returned at once.
    #[test]
    fn root_at_an_end() {
        let r = solve(|x| x - 2.0, 2.0, 5.0, 1e-12);
        assert_eq!(r.iterations, 0);
        assert!((r.x - 2.0).abs() < 1e-15);
    }

    // No sign change, non-finite values and a bad tolerance are errors, never panics.
    #[test]
    fn failures_are_typed_errors() {
        let f = |x: f64| x * x + 1.0;
        let err = find_root(ok(f), (-1.0, f(-1.0)), (2.0, f(2.0)), settings(1e-12)).unwrap_err();
        assert!(matches!(err, RootError::NoSignChange { .. }));
        let err = find_root(ok(f), (-1.0, f64::NAN), (2.0, -1.0), settings(1e-12)).unwrap_err();
        assert!(matches!(err, RootError::NonFinite { .. }));
        let g = |x: f64| if x > 0.25 { f64::NAN } else { x - 0.5 };
        let err = find_root(ok(g), (0.0, -0.5), (1.0, 0.5), settings(1e-12)).unwrap_err();
        assert!(matches!(err, RootError::NonFinite { .. }));
        let err = find_root(ok(f), (0.0, -1.0), (1.0, 1.0), settings(0.0)).unwrap_err();
        assert!(matches!(err, RootError::BadTolerance(_)));
        let few = Settings {
            x_tolerance: 1e-14,
            max_iterations: 2,
        };
        let h = |x: f64| x.cos() - x;
        let err = find_root(ok(h), (0.0, h(0.0)), (1.0, h(1.0)), few).unwrap_err();
        assert!(matches!(err, RootError::NotConverged { iterations: 2, .. }));
    }

    // An error of f itself comes back unchanged.
    #[test]
    fn function_errors_pass_through() {
        #[derive(Debug, PartialEq, thiserror::Error)]
        #[error("no value")]
        struct NoValue;
        let err = find_root(|_| Err(NoValue), (0.0, -1.0), (1.0, 1.0), settings(1e-9));
        assert_eq!(err, Err(RootError::Function(NoValue)));
    }
}
