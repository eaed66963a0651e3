//! Brent's method for the least value of a function of one variable on an interval: a
//! parabola through the three best points where it makes good progress, a golden-section
//! step where it does not.
//!
//! The method keeps the bracket `[a, b]` and three points: `x`, the least value so far; `w`,
//! the second least; `v`, the previous `w`. A step fits a parabola through `x`, `w` and `v`
//! and takes its vertex when it lies inside the bracket and the step is less than half the
//! step before last (so that the steps shrink); otherwise it takes the golden section of the
//! larger part of the bracket. A smooth function with a simple minimum is found with
//! superlinear convergence (order about 1.32), and never more slowly than golden section by
//! more than a small factor. The search ends when `x` is within `2 tol` of the bracket's
//! ends, `tol = rel |x| + abs`.
//!
//! A minimum of a smooth function is only defined to about the square root of the rounding
//! of its values (near the minimum f changes with the square of the distance), so a relative
//! tolerance much below 1e-8 buys nothing in double precision.
//!
//! Assumes: f is defined on `[a, b]`; where it returns infinity (a point that does not count)
//! the parabola gives no step there and the golden section carries on. Never evaluates the
//! ends, never panics.
//!
//! # References
//! - R. P. Brent, *Algorithms for Minimization without Derivatives*, Prentice-Hall, 1973,
//!   ch. 5 (the algorithm, its stopping rule and convergence; the procedure `localmin`).
//! - W. H. Press, S. A. Teukolsky, W. T. Vetterling, B. P. Flannery, *Numerical Recipes*,
//!   3rd ed., 2007, sec. 10.3 (one-dimensional search with parabolic interpolation).

/// When to stop.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MinSettings {
    /// Relative tolerance on the abscissa (about 1e-8 or more; see the module doc).
    pub rel_tolerance: f64,
    /// Absolute tolerance on the abscissa, in the units of x (> 0).
    pub abs_tolerance: f64,
    /// Most evaluations of f.
    pub max_evaluations: usize,
}

/// A minimum found.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Minimum {
    /// The abscissa of the least value found.
    pub x: f64,
    /// f there.
    pub fx: f64,
    /// How many times f was evaluated.
    pub evaluations: usize,
}

/// The golden ratio's complement, (3 - sqrt 5) / 2.
const GOLDEN: f64 = 0.381_966_011_250_105_1;

/// The three best points and the bracket.
struct State {
    a: f64,
    b: f64,
    x: f64,
    w: f64,
    v: f64,
    fx: f64,
    fw: f64,
    fv: f64,
}

impl State {
    /// Takes in the new point `u` with value `fu`.
    fn update(&mut self, u: f64, fu: f64) {
        if fu <= self.fx {
            if u < self.x {
                self.b = self.x;
            } else {
                self.a = self.x;
            }
            (self.v, self.fv) = (self.w, self.fw);
            (self.w, self.fw) = (self.x, self.fx);
            (self.x, self.fx) = (u, fu);
            return;
        }
        if u < self.x {
            self.a = u;
        } else {
            self.b = u;
        }
        let same = |p: f64, q: f64| p.to_bits() == q.to_bits();
        if fu <= self.fw || same(self.w, self.x) {
            (self.v, self.fv) = (self.w, self.fw);
            (self.w, self.fw) = (u, fu);
        } else if fu <= self.fv || same(self.v, self.x) || same(self.v, self.w) {
            (self.v, self.fv) = (u, fu);
        }
    }

    /// The vertex step of the parabola through x, w, v as (p, q) with the step p / q, or
    /// None when the three points give no parabola.
    fn parabola(&self) -> Option<(f64, f64)> {
        let r = (self.x - self.w) * (self.fx - self.fv);
        let q = (self.x - self.v) * (self.fx - self.fw);
        let mut p = (self.x - self.v) * q - (self.x - self.w) * r;
        let mut q = 2.0 * (q - r);
        if q > 0.0 {
            p = -p;
        } else {
            q = -q;
        }
        (p.is_finite() && q.is_finite()).then_some((p, q))
    }
}

/// The least value of `f` on `(lo, hi)` by Brent's method (see the module doc). The ends
/// may be given in either order.
pub fn find_minimum(
    lo: f64,
    hi: f64,
    settings: MinSettings,
    f: &mut dyn FnMut(f64) -> f64,
) -> Minimum {
    let (a, b) = if lo <= hi { (lo, hi) } else { (hi, lo) };
    let x = a + GOLDEN * (b - a);
    let fx = f(x);
    let mut s = State {
        a,
        b,
        x,
        w: x,
        v: x,
        fx,
        fw: fx,
        fv: fx,
    };
    let mut evaluations = 1;
    // The step before last (e) and the last step (d).
    let (mut d, mut e) = (0.0f64, 0.0f64);
    while evaluations < settings.max_evaluations {
        let m = 0.5 * (s.a + s.b);
        let tol = settings.rel_tolerance * s.x.abs() + settings.abs_tolerance;
        let t2 = 2.0 * tol;
        if (s.x - m).abs() <= t2 - 0.5 * (s.b - s.a) {
            break;
        }
        let mut golden = true;
        if e.abs() > tol {
            if let Some((p, q)) = s.parabola() {
                let before_last = e;
                if p.abs() < (0.5 * q * before_last).abs()
                    && p > q * (s.a - s.x)
                    && p < q * (s.b - s.x)
                {
                    e = d;
                    d = p / q;
                    let u = s.x + d;
                    // Not too close to the ends.
                    if u - s.a < t2 || s.b - u < t2 {
                        d = if s.x < m { tol } else { -tol };
                    }
                    golden = false;
                }
            }
        }
        if golden {
            e = if s.x < m { s.b - s.x } else { s.a - s.x };
            d = GOLDEN * e;
        }
        // Never a step smaller than the tolerance: f would not tell the points apart.
        let u = if d.abs() >= tol {
            s.x + d
        } else {
            s.x + tol.copysign(d)
        };
        let fu = f(u);
        evaluations += 1;
        s.update(u, fu);
    }
    Minimum {
        x: s.x,
        fx: s.fx,
        evaluations,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // The tolerance the module doc recommends: near a minimum f is flat to rounding within
    // about sqrt(eps) |x|, so a finer one only makes the search wander.
    const SETTINGS: MinSettings = MinSettings {
        rel_tolerance: 1e-8,
        abs_tolerance: 1e-12,
        max_evaluations: 200,
    };

    // A parabola's vertex is found exactly by the first parabolic steps (closed form: the
    // vertex of (x - 2)^2 + 1 is at 2).
    #[test]
    fn a_parabola_is_found_at_its_vertex_in_few_steps() {
        let m = find_minimum(0.0, 5.0, SETTINGS, &mut |x| (x - 2.0).powi(2) + 1.0);
        assert!((m.x - 2.0).abs() < 1e-8, "{m:?}");
        assert!((m.fx - 1.0).abs() < 1e-15);
        assert!(m.evaluations < 15, "{m:?}");
    }

    // A smooth, not parabolic function: the least of x - ln x on (0.1, 10) is at x = 1
    // (derivative 1 - 1/x); found faster than golden section's 50 steps to this tolerance.
    #[test]
    fn a_smooth_minimum_is_found_faster_than_golden_section() {
        let m = find_minimum(10.0, 0.1, SETTINGS, &mut |x: f64| x - x.ln());
        assert!((m.x - 1.0).abs() < 1e-6, "{m:?}");
        assert!(m.evaluations < 30, "{m:?}");
    }

    // Points that do not count (infinite values) on part of the interval: the golden
    // section steps past them to the minimum of the rest, and the ends are never evaluated.
    #[test]
    fn infinite_values_are_stepped_over_and_ends_never_evaluated() {
        let mut ends = false;
        let m = find_minimum(0.0, 4.0, SETTINGS, &mut |x: f64| {
            ends |= x <= 0.0 || x >= 4.0;
            if x < 1.0 {
                f64::INFINITY
            } else {
                (x - 3.0).powi(2)
            }
        });
        assert!((m.x - 3.0).abs() < 1e-6, "{m:?}");
        assert!(!ends);
    }

    // A minimum at an end of the interval: the search closes in on that end, to within the
    // two tolerances it keeps from the ends.
    #[test]
    fn a_minimum_at_the_end_is_approached() {
        let m = find_minimum(1.0, 2.0, SETTINGS, &mut |x: f64| x * x);
        assert!(m.x - 1.0 < 5e-8 && m.x > 1.0, "{m:?}");
    }
}
