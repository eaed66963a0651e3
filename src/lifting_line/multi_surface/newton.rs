//! Solving a flight condition: the superposed linear solution inside the cl limits, and past
//! them Newton's method on the flat-top (or polar) section relation, whose Jacobian has the
//! zero section slope on stalled rows, in work buffers reused between solves (Phillips and
//! Snyder 2000, nonlinear section relation and Newton's method).

use super::influence::system_matrix_into;
use super::*;

impl MultiSurfaceSystem {
    /// Per-station geometric angle and zero-lift angle at the condition's controls.
    pub(super) fn station_angles(&self, cond: &FlightCondition) -> (DVector<f64>, DVector<f64>) {
        let n = self.stations.len();
        let mut geo = DVector::zeros(n);
        let mut zero = DVector::zeros(n);
        for (i, st) in self.stations.iter().enumerate() {
            geo[i] = st.geometric_angle_rad
                + cond.incidence_change_rad[st.surface]
                + cond.alpha_rad * st.normal_z;
            let de = self.surfaces[st.surface].elevator.map_or(0.0, |e| {
                e.dalpha0_per_rad_deflection * cond.elevator_rad * st.control_share
            });
            zero[i] = st.section.alpha_zero_lift_rad + de;
        }
        (geo, zero)
    }

    /// Solve at `cond`: the superposed linear solution when every station is inside its cl
    /// limits, Newton's method on the flat-top section model otherwise.
    pub fn solve(&self, cond: &FlightCondition) -> Result<LiftingLineResult, LiftingLineError> {
        self.solve_with(cond, &mut NewtonWork::default())
    }

    /// [`Self::solve`] with Newton's work buffers given, for a caller that solves many states
    /// (the same result; the buffers are sized on first use and then reused).
    pub fn solve_with(
        &self,
        cond: &FlightCondition,
        work: &mut NewtonWork,
    ) -> Result<LiftingLineResult, LiftingLineError> {
        let q = self.weights(cond)?;
        let (gamma, tangent) = self.linear_circulation(&q);
        let (geo, zero) = self.station_angles(cond);
        // The superposed linear solution is exact unless a station passes a stall limit or
        // follows a polar's curved lift curve.
        let beyond = self.stations.iter().zip(gamma.iter()).any(|(st, g)| {
            let cl = 2.0 * g / st.chord_m;
            cl > st.section.cl_max || cl < st.section.cl_min || st.section.polar.is_some()
        });
        let (gamma, tangent, status) = if beyond {
            self.newton(gamma, &geo, &zero, work)?
        } else {
            (gamma, tangent, SolveStatus::Linear)
        };
        results::assemble(self, cond, &gamma, &tangent, &geo, status)
    }

    /// Newton's method on R(Gamma) = Gamma - (c/2) cl(alpha(Gamma)) with each station's lift
    /// curve ([`SectionModel::lift_point`]: the flat-top linear curve, or a viscous polar's).
    /// Every iteration works in the buffers of `work` (sized on first use), so the iterations
    /// and their backtracking allocate nothing.
    pub(super) fn newton(
        &self,
        mut gamma: DVector<f64>,
        geo: &DVector<f64>,
        zero: &DVector<f64>,
        work: &mut NewtonWork,
    ) -> Result<(DVector<f64>, DVector<f64>, SolveStatus), LiftingLineError> {
        let n = self.stations.len();
        work.size_for(n);
        let NewtonWork {
            alpha,
            now,
            trial_eval,
            trial,
            jacobian,
            lu,
            step,
            rhs,
            product,
            pivots,
        } = work;
        let scale = gamma.amax().max(1e-9);
        let tol = self.options.newton_relative_tolerance * scale;
        self.newton_eval(&gamma, geo, zero, alpha, now);
        let mut res = now.r.amax();
        let mut iterations = 0;
        while res > tol {
            if iterations >= self.options.max_newton_iterations {
                return Err(LiftingLineError::NotConverged {
                    iterations,
                    residual: res,
                });
            }
            iterations += 1;
            system_matrix_into(&self.induced, &now.d, &now.active, jacobian);
            factor_checked(lu, jacobian, pivots)?;
            rhs.zip_apply(&now.r, |b, r| *b = -r);
            step.copy_from(rhs);
            if !lu.solve_in_place(step) {
                return Err(LiftingLineError::SingularSystem { pivot_ratio: 0.0 });
            }
            check_vector_residual_into(jacobian, step, rhs, product)?;
            // Backtracking: the residual is piecewise linear, a full step is normally exact.
            let mut lambda = 1.0;
            loop {
                trial.zip_zip_apply(&gamma, step, |t, g, s| *t = g + s * lambda);
                self.newton_eval(trial, geo, zero, alpha, trial_eval);
                let res_t = trial_eval.r.amax();
                if res_t < res || lambda < 1e-3 {
                    std::mem::swap(&mut gamma, trial);
                    std::mem::swap(now, trial_eval);
                    res = res_t;
                    break;
                }
                lambda *= 0.5;
            }
            if !res.is_finite() {
                return Err(LiftingLineError::NonFinite {
                    quantity: "Newton residual",
                });
            }
        }
        // Tangent d Gamma / d alpha at the solution: J t = d n_z on active rows.
        system_matrix_into(&self.induced, &now.d, &now.active, jacobian);
        for (i, s) in self.stations.iter().enumerate() {
            rhs[i] = if now.active[i] {
                now.d[i] * s.normal_z
            } else {
                0.0
            };
        }
        factor_checked(lu, jacobian, pivots)?;
        let mut tangent = rhs.clone();
        if !lu.solve_in_place(&mut tangent) {
            return Err(LiftingLineError::SingularSystem { pivot_ratio: 0.0 });
        }
        check_vector_residual_into(jacobian, &tangent, rhs, product)?;
        Ok((
            gamma,
            tangent,
            SolveStatus::Converged {
                iterations,
                residual_m: res,
            },
        ))
    }

    /// Newton's residual at circulations `g`: the section angles (into `alpha`), and into
    /// `out` the residual, which rows are on the attached part of their lift curve, and each
    /// row's (c/2) dcl/dalpha there (the Jacobian's diagonal factor).
    pub(super) fn newton_eval(
        &self,
        g: &DVector<f64>,
        geo: &DVector<f64>,
        zero: &DVector<f64>,
        alpha: &mut DVector<f64>,
        out: &mut NewtonRows,
    ) {
        self.induced.mul_to(g, alpha);
        *alpha += geo;
        for (i, st) in self.stations.iter().enumerate() {
            let shift = zero[i] - st.section.alpha_zero_lift_rad;
            let lp = st.section.lift_point(alpha[i], shift);
            out.active[i] = lp.attached;
            out.d[i] = 0.5 * st.chord_m * lp.slope_per_rad;
            out.r[i] = g[i] - 0.5 * st.chord_m * lp.cl;
        }
    }
}

/// Newton's residual rows at one set of circulations.
#[derive(Debug, Clone, Default)]
pub(super) struct NewtonRows {
    /// Residual Gamma - (c/2) cl, m.
    r: DVector<f64>,
    /// True on rows on the attached part of their lift curve.
    active: Vec<bool>,
    /// (c/2) dcl/dalpha, m per rad.
    d: DVector<f64>,
}

/// Factor `jacobian` into `lu` and check its pivots (gathered in the buffer `pivots`).
fn factor_checked(
    lu: &mut LuWork,
    jacobian: &DMatrix<f64>,
    pivots: &mut Vec<f64>,
) -> Result<(), LiftingLineError> {
    lu.factor(jacobian);
    pivots.clear();
    pivots.extend(lu.pivots());
    check_pivots(pivots)
}

/// Work buffers of Newton's method on the stalled system (see [`MultiSurfaceSystem::solve_with`]):
/// made once, reused by every iteration and every solve given them.
#[derive(Debug, Clone, Default)]
pub struct NewtonWork {
    alpha: DVector<f64>,
    now: NewtonRows,
    trial_eval: NewtonRows,
    trial: DVector<f64>,
    jacobian: DMatrix<f64>,
    lu: LuWork,
    step: DVector<f64>,
    rhs: DVector<f64>,
    product: DVector<f64>,
    pivots: Vec<f64>,
}

impl NewtonWork {
    /// Size every buffer for `n` stations (nothing is allocated when they already are).
    fn size_for(&mut self, n: usize) {
        if self.alpha.len() == n && self.jacobian.nrows() == n {
            return;
        }
        let rows = || NewtonRows {
            r: DVector::zeros(n),
            active: vec![true; n],
            d: DVector::zeros(n),
        };
        *self = NewtonWork {
            alpha: DVector::zeros(n),
            now: rows(),
            trial_eval: rows(),
            trial: DVector::zeros(n),
            jacobian: DMatrix::zeros(n, n),
            lu: LuWork::new(n),
            step: DVector::zeros(n),
            rhs: DVector::zeros(n),
            product: DVector::zeros(n),
            pivots: Vec::with_capacity(n),
        };
    }
}
