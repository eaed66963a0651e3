//! The coupling loop of one angle: march the boundary layer on both surfaces from the
//! stagnation point, turn its mass defect into transpiration sources, re-solve the factored
//! panel equations, relax and repeat until the unrelaxed change is below the tolerance; then
//! lift, moment and Squire-Young drag of the converged state.

use super::*;

/// `y = a x` for a column-major `a`, summed column by column in rising order (the order of
/// nalgebra's own product, so the same numbers), on contiguous columns so that the inner loop
/// vectorises: the coupling loop spends much of its time here.
pub(super) fn mat_vec_into(a: &DMatrix<f64>, x: &[f64], y: &mut [f64]) {
    y.fill(0.0);
    let rows = a.nrows();
    if rows == 0 {
        return;
    }
    let columns = a.as_slice();
    let mut j = 0;
    // Four columns a pass: each y_i still gets its terms in rising column order, but is
    // loaded and stored once for four of them.
    while j + 4 <= x.len() {
        let c = &columns[j * rows..(j + 4) * rows];
        let (c0, rest) = c.split_at(rows);
        let (c1, rest) = rest.split_at(rows);
        let (c2, c3) = rest.split_at(rows);
        let (x0, x1, x2, x3) = (x[j], x[j + 1], x[j + 2], x[j + 3]);
        for ((((yi, a0), a1), a2), a3) in y.iter_mut().zip(c0).zip(c1).zip(c2).zip(c3) {
            let mut v = *yi;
            v += a0 * x0;
            v += a1 * x1;
            v += a2 * x2;
            v += a3 * x3;
            *yi = v;
        }
        j += 4;
    }
    for (column, &xj) in columns[j * rows..].chunks_exact(rows).zip(&x[j..]) {
        for (yi, &aij) in y.iter_mut().zip(column) {
            *yi += aij * xj;
        }
    }
}

/// One side's stations mapped to panels.
pub(super) struct Side {
    panels: Vec<usize>,
    stations: Vec<Station>,
}

impl ViscousSection {
    /// Splits the surface at the stagnation point of the signed speed `q`.
    pub(super) fn sides(&self, q: &DVector<f64>) -> (Side, Side) {
        let np = q.len();
        let mid = &self.system.midpoints;
        // Leading edge: the node farthest forward; the stagnation point is the sign change of
        // q (negative on the lower side, positive on the upper) nearest to it.
        let le = (0..np)
            .min_by(|&a, &b| mid[a][0].total_cmp(&mid[b][0]))
            .unwrap_or(np / 2);
        let mut k = None;
        for d in 0..np {
            for cand in [le + d, le.wrapping_sub(d)] {
                if cand >= 1 && cand < np && q[cand - 1] < 0.0 && q[cand] >= 0.0 {
                    k = Some(cand);
                    break;
                }
            }
            if k.is_some() {
                break;
            }
        }
        let k = k.unwrap_or(le.max(1));
        let dist = |a: usize, b: usize| (mid[a][0] - mid[b][0]).hypot(mid[a][1] - mid[b][1]);
        let f = (-q[k - 1] / (q[k] - q[k - 1])).clamp(0.0, 1.0);
        let d0 = dist(k - 1, k);
        let build = |order: Vec<usize>, first_s: f64| {
            let mut stations = Vec::with_capacity(order.len());
            let mut s = first_s.max(1e-6);
            for (n, &p) in order.iter().enumerate() {
                if n > 0 {
                    s += dist(order[n - 1], p);
                }
                stations.push(Station {
                    s,
                    ue: q[p].abs().max(1e-6),
                });
            }
            // The panel method's speed on the last panel before the trailing edge is unreliable
            // (it jumps at the open gap of a blunt edge): hold the speed of the one before.
            let n = stations.len();
            if n >= 3 {
                stations[n - 1].ue = stations[n - 2].ue;
            }
            Side {
                panels: order,
                stations,
            }
        };
        let upper = build((k..np).collect(), (1.0 - f) * d0);
        let lower = build((0..k).rev().collect(), f * d0);
        (upper, lower)
    }

    /// The coupling loop: converged surface speed, source strengths, passes, residual.
    #[allow(clippy::type_complexity)]
    pub(super) fn iterate(
        &self,
        alpha_rad: f64,
        tolerance: f64,
    ) -> Result<(DVector<f64>, DVector<f64>, usize, f64, MarchSettings), ViscousError> {
        let np = self.system.panels();
        let (sa, ca) = alpha_rad.sin_cos();
        let q_inv = &self.q_x * ca + &self.q_y * sa;
        let march = MarchSettings {
            nu: 1.0 / self.settings.reynolds,
            n_crit: self.settings.n_crit,
            trip_s: None,
        };
        let mut mass = DVector::<f64>::zeros(np);
        let mut sigma = DVector::<f64>::zeros(np);
        let mut q = q_inv.clone();
        let mut q_new = q_inv.clone();
        let (mut from_sigma, mut from_wake) = (vec![0.0; np], vec![0.0; np]);
        let mut sigma_wake = vec![0.0; self.wake_s.len()];
        let mut residual = f64::INFINITY;
        let mut w = RELAXATION;
        let mut last_change = f64::INFINITY;
        let smoothing_passes = self.smoothing_passes();
        for iteration in 1..=MAX_ITERATIONS {
            let (upper, lower) = self.sides(&q);
            let lu = march_surface(&upper.stations, &march);
            let ll = march_surface(&lower.stations, &march);
            let w_now = if iteration == 1 { 1.0 } else { w };
            for (side, layer) in [(&upper, &lu), (&lower, &ll)] {
                relax_sources(side, layer, w_now, smoothing_passes, &mut mass, &mut sigma);
            }
            self.wake_sources([(&upper, &lu), (&lower, &ll)], &mass, &mut sigma_wake);
            mat_vec_into(&self.q_sigma, sigma.as_slice(), &mut from_sigma);
            mat_vec_into(&self.q_wake, &sigma_wake, &mut from_wake);
            for i in 0..np {
                q_new[i] = q_inv[i] + from_sigma[i] + from_wake[i];
            }
            let change = (0..np)
                .map(|i| (q_new[i].abs() - q[i].abs()).abs())
                .fold(0.0, f64::max);
            // The change a full pass would make (see the module documentation).
            residual = change / w_now;
            // Adaptive relaxation: back off when the change grows, recover slowly.
            w = if change > last_change {
                (0.7 * w).max(MIN_RELAXATION)
            } else {
                (1.1 * w).min(RELAXATION)
            };
            last_change = change;
            std::mem::swap(&mut q, &mut q_new);
            if !residual.is_finite() || q.iter().any(|v| !v.is_finite()) {
                break;
            }
            if residual < tolerance && iteration > 2 {
                return Ok((q, sigma, iteration, residual, march));
            }
        }
        Err(ViscousError::NotConverged {
            alpha_rad,
            residual: if residual.is_finite() {
                residual
            } else {
                f64::MAX
            },
            iterations: MAX_ITERATIONS,
        })
    }

    /// The wake's sources: its mass defect runs from the two trailing-edge values down to
    /// the far-wake momentum thickness (Squire-Young), exponentially over `WAKE_DECAY_C`.
    fn wake_sources(
        &self,
        sides: [(&Side, &SurfaceLayer); 2],
        mass: &DVector<f64>,
        sigma_wake: &mut [f64],
    ) {
        let te = |side: &Side, layer: &SurfaceLayer| {
            let (st, ls) = (side.stations.last(), layer.states.last());
            match (st, ls) {
                (Some(st), Some(ls)) => (
                    mass[*side.panels.last().unwrap_or(&0)],
                    squire_young::drag_coefficient(ls.theta, st.ue, ls.h),
                ),
                _ => (0.0, 0.0),
            }
        };
        let (mu, cdu) = te(sides[0].0, sides[0].1);
        let (ml, cdl) = te(sides[1].0, sides[1].1);
        let (m_te, m_far) = (mu + ml, 0.5 * (cdu + cdl));
        for (sw, &x) in sigma_wake.iter_mut().zip(&self.wake_s) {
            *sw = -(m_te - m_far) / WAKE_DECAY_C * (-x / WAKE_DECAY_C).exp();
        }
    }

    /// Coefficients of a converged surface speed.
    pub(super) fn point(
        &self,
        alpha_rad: f64,
        q: &DVector<f64>,
        march: &MarchSettings,
        iterations: usize,
        residual: f64,
    ) -> ViscousPoint {
        let sys = &self.system;
        let np = sys.panels();
        let circulation: f64 = (0..np).map(|j| q[j] * sys.lengths[j]).sum();
        let m_ccw: f64 = (0..np)
            .map(|j| {
                let cp = 1.0 - q[j] * q[j];
                let nl = [
                    sys.normals[j][0] * sys.lengths[j],
                    sys.normals[j][1] * sys.lengths[j],
                ];
                let (fx, fy) = (-cp * nl[0], -cp * nl[1]);
                (sys.midpoints[j][0] - 0.25) * fy - sys.midpoints[j][1] * fx
            })
            .sum();
        let (upper, lower) = self.sides(q);
        let lu = march_surface(&upper.stations, march);
        let ll = march_surface(&lower.stations, march);
        let up = self.summary(&upper, &lu);
        let lo = self.summary(&lower, &ll);
        ViscousPoint {
            alpha_rad,
            cl: 2.0 * circulation,
            cd: up.cd + lo.cd,
            cm_quarter_chord: -m_ccw,
            upper: up,
            lower: lo,
            iterations,
            residual,
        }
    }

    pub(super) fn summary(&self, side: &Side, layer: &SurfaceLayer) -> SurfaceSummary {
        let mid = &self.system.midpoints;
        // x/c at a distance s from the stagnation point, by interpolation on the stations.
        let x_at = |s: f64| -> f64 {
            let st = &side.stations;
            match st.iter().position(|p| p.s >= s) {
                Some(0) | None => mid[side.panels[if s <= st[0].s { 0 } else { st.len() - 1 }]][0],
                Some(n) => {
                    let f = (s - st[n - 1].s) / (st[n].s - st[n - 1].s);
                    let (a, b) = (mid[side.panels[n - 1]][0], mid[side.panels[n]][0]);
                    a + f * (b - a)
                }
            }
        };
        let last = layer.states.last().copied();
        let ue_te = side.stations.last().map_or(1.0, |s| s.ue);
        let (theta_te, h_te) = last.map_or((0.0, 1.4), |s| (s.theta, s.h));
        SurfaceSummary {
            transition_x_c: layer.transition.map(|(s, _)| x_at(s)),
            transition_cause: layer.transition.map(|(_, c)| c),
            michel_x_c: layer.michel_s.map(x_at),
            separation_x_c: layer.separation_s.map(x_at),
            theta_te,
            h_te,
            cd: squire_young::drag_coefficient(theta_te, ue_te, h_te),
        }
    }
}

/// One side's sources for the next pass: its mass defect `Ue delta*` relaxed by `w` toward
/// the boundary layer's, then sigma = d(Ue delta*)/ds along the flow by differences on the
/// stations (the stagnation point has zero mass defect), smoothed `smoothing_passes` times.
fn relax_sources(
    side: &Side,
    layer: &SurfaceLayer,
    w: f64,
    smoothing_passes: usize,
    mass: &mut DVector<f64>,
    sigma: &mut DVector<f64>,
) {
    for (n, &p) in side.panels.iter().enumerate() {
        let m_new = side.stations[n].ue * layer.states[n].delta_star;
        mass[p] += w * (m_new - mass[p]);
    }
    let st = &side.stations;
    for n in 0..st.len() {
        let p = side.panels[n];
        let (s0, m0) = if n == 0 {
            (0.0, 0.0)
        } else {
            (st[n - 1].s, mass[side.panels[n - 1]])
        };
        let (s1, m1) = match st.get(n + 1) {
            Some(nx) => (nx.s, mass[side.panels[n + 1]]),
            None => (st[n].s, mass[p]),
        };
        sigma[p] = if s1 > s0 { (m1 - m0) / (s1 - s0) } else { 0.0 };
    }
    // Panel-to-panel oscillation of the sources is the direct iteration's unstable mode: take
    // it out with 1-2-1 smoothing along the surface.
    for _ in 0..smoothing_passes {
        let raw: Vec<f64> = side.panels.iter().map(|&p| sigma[p]).collect();
        for n in 1..raw.len().saturating_sub(1) {
            sigma[side.panels[n]] = 0.25 * (raw[n - 1] + 2.0 * raw[n] + raw[n + 1]);
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn matrix_vector_product_is_nalgebra_s_to_the_bit() {
        // mat_vec_into replaces nalgebra's product in the coupling loop for speed; it keeps
        // the order of the sums, so the numbers must be identical (column counts on and off a
        // multiple of four).
        for (rows, cols) in [(161, 37), (160, 160), (7, 3), (5, 4)] {
            let a = DMatrix::<f64>::from_fn(rows, cols, |i, j| {
                ((i * 31 + j * 17) as f64 * 0.37).sin() / (1.0 + j as f64)
            });
            let x = DVector::<f64>::from_fn(cols, |j, _| (j as f64 * 0.71).cos() * 1e-3);
            let reference = &a * &x;
            let mut y = vec![f64::NAN; rows];
            mat_vec_into(&a, x.as_slice(), &mut y);
            for i in 0..rows {
                assert_eq!(
                    y[i].to_bits(),
                    reference[i].to_bits(),
                    "row {i} of {rows}x{cols}"
                );
            }
        }
    }
}
