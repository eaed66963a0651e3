//! Results of the multi-surface lifting line: coefficients per surface and in total, the
//! spanwise table, downwash at each surface from the others, and the station nearest stall.
//!
//! Conventions: coefficients are on the reference area and chord of the system (normally the
//! wing's); C_m is positive nose up; lift is normal to the free stream. Induced drag comes from
//! the Trefftz plane, D_i = -(rho/2) sum Gamma w ds, with w the normal-wash of the trailing
//! lines far downstream; the share of a surface is its own circulation times the normal-wash of
//! all wakes. Downwash is positive when the other surfaces turn the flow down at this surface
//! (a canard sees the wing's upwash as a negative downwash).
//!
//! # References
//! - E. Trefftz, "Prandtlsche Tragflächen- und Propeller-Theorie", ZAMM 1, 1921 (induced drag
//!   in the far wake plane); J. Katz and A. Plotkin, *Low-Speed Aerodynamics*, 2nd ed., sec.
//!   8.2 (the same result in lifting-line form, from memory).
//! - W. F. Phillips and D. O. Snyder, *Journal of Aircraft* 37(4), 2000 (forces and moments
//!   of the horseshoe system: Kutta-Joukowski on each bound segment plus the section moments).

use std::f64::consts::PI;

use nalgebra::{DMatrix, DVector};

use super::multi_surface::{
    trefftz_width_m, FlightCondition, MultiSurfaceSystem, SolveStatus, SurfaceInfo, UnitSums,
};
use super::vortex::Vec3;
use super::LiftingLineError;

/// One station of the spanwise table.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StationResult {
    /// Surface index.
    pub surface: usize,
    /// y of the control point, m (starboard positive).
    pub y_m: f64,
    /// Spanwise position, percent of the surface's semispan.
    pub percent_semispan: f64,
    /// x of the control point, m.
    pub x_m: f64,
    /// z of the control point, m.
    pub z_m: f64,
    /// Chord, m.
    pub chord_m: f64,
    /// Local section angle of attack including the induced angle, rad.
    pub alpha_rad: f64,
    /// Induced angle (positive up-wash), rad.
    pub induced_alpha_rad: f64,
    /// Section lift coefficient 2 Gamma / (V c).
    pub cl: f64,
    /// cl / cl_max of the local section.
    pub cl_ratio: f64,
    /// Circulation divided by free-stream speed, m (multiply by V for m^2/s).
    pub circulation_per_speed_m: f64,
}

/// The station with the largest cl / cl_max (where stall begins by the critical-section rule).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StallStation {
    /// Surface index.
    pub surface: usize,
    /// Index in [`LiftingLineResult::stations`].
    pub station: usize,
    /// y, m.
    pub y_m: f64,
    /// Percent of the surface's semispan.
    pub percent_semispan: f64,
    /// cl / cl_max there.
    pub cl_ratio: f64,
}

/// Results of one surface.
#[derive(Debug, Clone, PartialEq)]
pub struct SurfaceResult {
    /// Surface name.
    pub name: String,
    /// Lift coefficient on the reference area.
    pub cl: f64,
    /// Lift coefficient on the surface's own area.
    pub cl_own_area: f64,
    /// dC_L/d alpha of this surface on the reference area at this state, per rad.
    pub lift_slope_per_rad: f64,
    /// Induced-drag coefficient on the reference area.
    pub induced_drag: f64,
    /// C_L^2 / (pi A C_Di) on the surface's own area and aspect ratio; `None` at zero drag.
    pub span_efficiency: Option<f64>,
    /// Mean downwash angle induced by the other surfaces, weighted by c dy, rad.
    pub downwash_rad: f64,
    /// d(downwash)/d alpha.
    pub downwash_gradient: f64,
    /// The station of this surface nearest its cl_max.
    pub stall: StallStation,
    sums: UnitSums,
    alpha_rad: f64,
    mac_m: f64,
}

impl SurfaceResult {
    /// This surface's pitching-moment coefficient about (x_ref_m, z_ref_m), on the reference
    /// area and chord: lift moments plus section moments (cm_ac, ac offset, elevator).
    pub fn cm(&self, x_ref_m: f64, z_ref_m: f64) -> f64 {
        self.sums.cm(self.alpha_rad, x_ref_m, z_ref_m, self.mac_m)
    }
}

/// Results of one solve.
#[derive(Debug, Clone, PartialEq)]
pub struct LiftingLineResult {
    /// The condition solved.
    pub condition: FlightCondition,
    /// Linear superposition or Newton.
    pub status: SolveStatus,
    /// Total lift coefficient.
    pub cl: f64,
    /// Total dC_L/d alpha at this state, per rad.
    pub lift_slope_per_rad: f64,
    /// Total induced-drag coefficient.
    pub induced_drag: f64,
    /// C_L^2 / (pi A_ref C_Di); `None` at zero drag.
    pub span_efficiency: Option<f64>,
    /// Per surface, in system order.
    pub surfaces: Vec<SurfaceResult>,
    /// Spanwise table, surface by surface, port tip to starboard tip.
    pub stations: Vec<StationResult>,
    /// The station of any surface nearest its cl_max.
    pub stall: StallStation,
}

impl LiftingLineResult {
    /// Total pitching-moment coefficient about (x_ref_m, z_ref_m).
    pub fn cm(&self, x_ref_m: f64, z_ref_m: f64) -> f64 {
        self.surfaces.iter().map(|s| s.cm(x_ref_m, z_ref_m)).sum()
    }
}

fn stall_of(stations: &[StationResult], indices: impl Iterator<Item = usize>) -> StallStation {
    let mut best: Option<usize> = None;
    for i in indices {
        if best.is_none_or(|b| stations[i].cl_ratio > stations[b].cl_ratio) {
            best = Some(i);
        }
    }
    let i = best.unwrap_or(0);
    let st = stations.get(i);
    StallStation {
        surface: st.map_or(0, |s| s.surface),
        station: i,
        y_m: st.map_or(0.0, |s| s.y_m),
        percent_semispan: st.map_or(0.0, |s| s.percent_semispan),
        cl_ratio: st.map_or(0.0, |s| s.cl_ratio),
    }
}

/// Build the result of a solved state: `gamma` the circulations / speed (m), `tangent` their
/// derivative with alpha, `geo` each station's geometric angle at this condition (rad).
pub(crate) fn assemble(
    system: &MultiSurfaceSystem,
    cond: &FlightCondition,
    gamma: &DVector<f64>,
    tangent: &DVector<f64>,
    geo: &DVector<f64>,
    status: SolveStatus,
) -> Result<LiftingLineResult, LiftingLineError> {
    let reference = system.reference();
    let induced = system.induced() * gamma;
    let state = SolvedState {
        cond,
        gamma,
        tangent,
        offsets: system.lift_x_offsets(&DMatrix::from_column_slice(
            gamma.len(),
            1,
            gamma.as_slice(),
        )),
        trefftz: system.trefftz() * gamma,
        wake: system.wake_direction(),
    };

    let table = station_table(system, gamma, geo, &induced);

    let mut surfaces = Vec::with_capacity(system.surface_count());
    for (s, info) in system.surfaces().iter().enumerate() {
        surfaces.push(surface_result(system, s, info, &state, &table));
    }
    let cl: f64 = surfaces.iter().map(|s| s.cl).sum();
    let cdi: f64 = surfaces.iter().map(|s| s.induced_drag).sum();
    let result = LiftingLineResult {
        condition: cond.clone(),
        status,
        cl,
        lift_slope_per_rad: surfaces.iter().map(|s| s.lift_slope_per_rad).sum(),
        induced_drag: cdi,
        span_efficiency: efficiency(cl, cdi, reference.aspect_ratio()),
        stall: stall_of(&table, 0..table.len()),
        surfaces,
        stations: table,
    };
    if !result_is_finite(&result) {
        return Err(LiftingLineError::NonFinite { quantity: "result" });
    }
    Ok(result)
}

/// A solved state of the system, as [`assemble`] takes it apart: the condition, the
/// circulations / speed (m) and their derivative with alpha, each station's lift x offset
/// (m, one column), the Trefftz-plane normal-wash per unit speed and the wake direction.
struct SolvedState<'a> {
    cond: &'a FlightCondition,
    gamma: &'a DVector<f64>,
    tangent: &'a DVector<f64>,
    offsets: DMatrix<f64>,
    trefftz: DVector<f64>,
    wake: Vec3,
}

/// The spanwise table of a solved state: `gamma` the circulations / speed (m), `geo` the
/// geometric angles and `induced` the induced angles (rad).
fn station_table(
    system: &MultiSurfaceSystem,
    gamma: &DVector<f64>,
    geo: &DVector<f64>,
    induced: &DVector<f64>,
) -> Vec<StationResult> {
    system
        .stations()
        .iter()
        .enumerate()
        .map(|(i, st)| {
            let cl = 2.0 * gamma[i] / st.chord_m;
            StationResult {
                surface: st.surface,
                y_m: st.y_m,
                percent_semispan: st.percent_semispan,
                x_m: st.x_m,
                z_m: st.z_m,
                chord_m: st.chord_m,
                alpha_rad: geo[i] + induced[i],
                induced_alpha_rad: induced[i],
                cl,
                cl_ratio: cl / st.section.cl_max,
                circulation_per_speed_m: gamma[i],
            }
        })
        .collect()
}

/// The coefficients of surface `s` (described by `info`) in a solved state: lift, moments,
/// lift slope, induced drag, span efficiency, downwash from the other surfaces and its
/// gradient (chord-weighted over the span), and the station nearest stall.
fn surface_result(
    system: &MultiSurfaceSystem,
    s: usize,
    info: &SurfaceInfo,
    state: &SolvedState<'_>,
    table: &[StationResult],
) -> SurfaceResult {
    let reference = system.reference();
    let (s_ref, c_ref) = (reference.area_m2, reference.mac_m);
    let stations = system.stations();
    let SolvedState {
        cond,
        gamma,
        tangent,
        offsets,
        trefftz,
        wake,
    } = state;
    let mut sums = UnitSums::default();
    let (mut slope, mut cdi) = (0.0, 0.0);
    let (mut eps_w, mut deps_w, mut weight) = (0.0, 0.0, 0.0);
    for i in info.range.clone() {
        let st = &stations[i];
        let lift = 2.0 * gamma[i] * st.dy_m / s_ref;
        sums.cl += lift;
        sums.mx -= (lift * st.x_m + 2.0 * offsets[(i, 0)] * st.dy_m / s_ref) / c_ref;
        sums.mz -= lift * st.z_m / c_ref;
        let cm_ac = st.section.cm_ac
            + info.elevator.map_or(0.0, |e| {
                e.dcm_ac_per_rad_deflection * cond.elevator_rad * st.control_share
            });
        // Section moment about the quarter chord: cm_ac + cl (1/4 - x_ac/c).
        let cm_qc = cm_ac + table[i].cl * (0.25 - st.section.x_ac_c);
        sums.sec += st.chord_m * st.chord_m * st.dy_m * cm_qc / (s_ref * c_ref);
        slope += 2.0 * tangent[i] * st.dy_m / s_ref;
        cdi -= gamma[i] * trefftz[i] * trefftz_width_m(st, wake) / s_ref;
        // Downwash from the other surfaces only.
        let (from_others, d_from_others) = downwash_from_others(system, s, i, gamma, tangent);
        let w = st.chord_m * st.dy_m;
        eps_w -= w * from_others;
        deps_w -= w * d_from_others;
        weight += w;
    }
    let own = s_ref / info.area_m2;
    let cl_own = sums.cl * own;
    let cdi_own = cdi * own;
    SurfaceResult {
        name: info.name.clone(),
        cl: sums.cl,
        cl_own_area: cl_own,
        lift_slope_per_rad: slope,
        induced_drag: cdi,
        span_efficiency: efficiency(cl_own, cdi_own, info.aspect_ratio),
        downwash_rad: eps_w / weight,
        downwash_gradient: deps_w / weight,
        stall: stall_of(table, info.range.clone()),
        sums,
        alpha_rad: cond.alpha_rad,
        mac_m: c_ref,
    }
}

/// The induced angle at station `i` from the circulations of the surfaces other than
/// `surface` alone (rad), and its derivative with alpha.
fn downwash_from_others(
    system: &MultiSurfaceSystem,
    surface: usize,
    i: usize,
    gamma: &DVector<f64>,
    tangent: &DVector<f64>,
) -> (f64, f64) {
    let stations = system.stations();
    let (mut from_others, mut d_from_others) = (0.0, 0.0);
    for (j, sj) in stations.iter().enumerate() {
        if sj.surface != surface {
            let a = system.induced()[(i, j)];
            from_others += a * gamma[j];
            d_from_others += a * tangent[j];
        }
    }
    (from_others, d_from_others)
}

/// True when the totals, every station and every surface of `result` are finite.
fn result_is_finite(result: &LiftingLineResult) -> bool {
    result.cl.is_finite()
        && result.induced_drag.is_finite()
        && result.lift_slope_per_rad.is_finite()
        && result.stations.iter().all(|s| {
            s.cl.is_finite() && s.alpha_rad.is_finite() && s.circulation_per_speed_m.is_finite()
        })
        && result.surfaces.iter().all(|s| {
            s.downwash_rad.is_finite()
                && s.downwash_gradient.is_finite()
                && s.cm(0.0, 0.0).is_finite()
        })
}

fn efficiency(cl: f64, cdi: f64, aspect_ratio: f64) -> Option<f64> {
    if cdi.abs() > 1e-12 && cl.abs() > 1e-9 {
        let e = cl * cl / (PI * aspect_ratio * cdi);
        e.is_finite().then_some(e)
    } else {
        None
    }
}

#[cfg(test)]
mod tests {
    use crate::lifting_line::multi_surface::tests::{plate, wing_and_tail};
    use approx::assert_relative_eq;

    // The reported lift slope (from the tangent solve) against a finite difference of C_L,
    // in the linear range and with stalled stations. Tolerance: difference step.
    #[test]
    fn lift_slope_matches_finite_difference() {
        let sections = [plate(1.0)];
        let sys = wing_and_tail(&sections);
        for alpha in [0.02, 0.2] {
            let h = 1e-6;
            let r = sys.solve(&sys.condition(alpha)).unwrap();
            let up = sys.solve(&sys.condition(alpha + h)).unwrap().cl;
            let down = sys.solve(&sys.condition(alpha - h)).unwrap().cl;
            assert_relative_eq!(
                r.lift_slope_per_rad,
                (up - down) / (2.0 * h),
                epsilon = 1e-5
            );
            let up = sys.solve(&sys.condition(alpha + h)).unwrap().surfaces[1].downwash_rad;
            let down = sys.solve(&sys.condition(alpha - h)).unwrap().surfaces[1].downwash_rad;
            assert_relative_eq!(
                r.surfaces[1].downwash_gradient,
                (up - down) / (2.0 * h),
                epsilon = 1e-5
            );
        }
    }

    // The total moment is the sum of the surfaces' and moves with the reference point by
    // C_L dx / c (moment transfer).
    #[test]
    fn moment_transfer_law() {
        let sections = [plate(2.0)];
        let sys = wing_and_tail(&sections);
        let r = sys.solve(&sys.condition(0.08)).unwrap();
        let c = sys.reference().mac_m;
        let a = r.condition.alpha_rad;
        let dx = 0.1;
        assert_relative_eq!(
            r.cm(0.2 + dx, 0.0) - r.cm(0.2, 0.0),
            r.cl * dx * a.cos() / c,
            epsilon = 1e-12
        );
    }
}
