//! The horseshoe influences A_ij (or the lattice's condensed matrix), the system matrix
//! I - D A and its unit solutions found on the folded (starboard) system, and the
//! Trefftz-plane normals of the wake (Phillips and Snyder 2000).
//!
//! # Vortex cores
//! The kernels use a Gaussian core (see [`crate::lifting_line::vortex`]). Between stations of the same
//! surface its radius is 1 % of the segment width (a Gaussian core leaves neighbours half a
//! width away untouched): it only removes the 0/0 of a bound vortex at its own control point.
//! Seen from another surface, a wake of discrete lines stands for a continuous sheet, and a
//! control point of the tail can fall on or next to one line; there the radius is a fraction
//! ([`super::LiftingLineOptions::wake_core_fraction`], default 0.25) of the source segment's width
//! (for a trailing leg, shared by two neighbouring horseshoes, the mean of their widths). Any smoothing shifts the downwash inside the sheet by
//! an amount of first order in the core radius (it samples the field slightly off the sheet);
//! with the default, a tail lying in the far wake of an elliptic wing sees 2 C_L/(pi A) within
//! about 3 % (tests/suite/lifting_line_downwash.rs), and the error falls as stations are added.
//! Points off the wake plane by more than a station width are not affected.

use super::*;

/// The horseshoe influence matrices (normal velocity at each control point per unit
/// circulation, and its Trefftz-plane counterpart) with the wake leaving along `wake`.
/// Rows of the starboard half (and a centre station) are computed, the others copied from
/// their mirror images: half the kernel evaluations, which dominate the build.
pub(super) fn horseshoe_influences(
    stations: &[Station],
    surfaces: &[SurfaceInfo],
    mirror: &[usize],
    options: &LiftingLineOptions,
    wake: &Vec3,
) -> (DMatrix<f64>, DMatrix<f64>) {
    let n = stations.len();
    let mut induced = DMatrix::<f64>::zeros(n, n);
    let mut trefftz = DMatrix::<f64>::zeros(n, n);
    // Trailing legs are shared: the outboard leg of one horseshoe is the inboard leg of the
    // next (with opposite sign), so each node's leg is evaluated once per control point. A
    // leg's core uses the mean width of the segments that share it.
    let nodes = trailing_nodes(stations, surfaces);
    let mut legs = vec![Vec3::zeros(); nodes.len()];
    let mut lines = vec![Vec3::zeros(); nodes.len()];
    for (i, si) in stations.iter().enumerate() {
        if mirror[i] < i {
            continue;
        }
        let fraction = |surface: usize| {
            if surface == si.surface {
                options.self_core_fraction
            } else {
                options.wake_core_fraction
            }
        };
        for (k, node) in nodes.iter().enumerate() {
            let core = fraction(node.surface) * node.width_m;
            legs[k] = semi_infinite_velocity(&si.control, &node.point, wake, core);
            lines[k] = trefftz_line_velocity(&si.control, &node.point, wake, core);
        }
        let normal_t = trefftz_normal(si, wake);
        for (j, sj) in stations.iter().enumerate() {
            let core = fraction(sj.surface) * sj.width_m;
            let (ka, kb) = (j + sj.surface, j + sj.surface + 1);
            let v =
                segment_velocity(&si.control, &sj.node_a, &sj.node_b, core) + legs[kb] - legs[ka];
            let vt = lines[kb] - lines[ka];
            let (a, t) = (v.dot(&si.normal), vt.dot(&normal_t));
            induced[(i, j)] = a;
            trefftz[(i, j)] = t;
            induced[(mirror[i], mirror[j])] = a;
            trefftz[(mirror[i], mirror[j])] = t;
        }
    }
    (induced, trefftz)
}

/// The right-hand sides of the unit solutions, one column each: the constant part, alpha,
/// pitch control and each surface's incidence, scaled by the section factor `d` (c/2 times
/// the lift slope).
pub(super) fn unit_right_hand_sides(
    stations: &[Station],
    surfaces: &[SurfaceInfo],
    d: &DVector<f64>,
) -> DMatrix<f64> {
    let n = stations.len();
    let unit_count = UNIT_FIRST_INCIDENCE + surfaces.len();
    let mut rhs = DMatrix::<f64>::zeros(n, unit_count);
    for (i, st) in stations.iter().enumerate() {
        rhs[(i, UNIT_CONSTANT)] = d[i] * (st.geometric_angle_rad - st.section.alpha_zero_lift_rad);
        rhs[(i, UNIT_ALPHA)] = d[i] * st.normal_z;
        if let Some(e) = surfaces[st.surface].elevator {
            rhs[(i, UNIT_ELEVATOR)] = -d[i] * e.dalpha0_per_rad_deflection * st.control_share;
        }
        rhs[(i, UNIT_FIRST_INCIDENCE + st.surface)] = d[i];
    }
    rhs
}

/// The factored folded system, the representative stations, each station's representative
/// and the unit solutions of `matrix` for `rhs`, checked by their residual.
#[allow(clippy::type_complexity)]
pub(super) fn solve_unit_inputs(
    matrix: &DMatrix<f64>,
    rhs: &DMatrix<f64>,
    mirror: &[usize],
) -> Result<
    (
        nalgebra::LU<f64, nalgebra::Dyn, nalgebra::Dyn>,
        Vec<usize>,
        Vec<usize>,
        DMatrix<f64>,
    ),
    LiftingLineError,
> {
    let n = matrix.nrows();
    // Every unit input is symmetric (alpha, elevator, incidences), so every unit solution
    // is: solve for the starboard half (and any centre station) with the port columns
    // folded onto their mirror images, an LU of half the size (an eighth of the work), then
    // copy. The residual is checked on the full system, which also confirms the symmetry.
    let reps: Vec<usize> = (0..n).filter(|&i| mirror[i] >= i).collect();
    let mut rep_of = vec![0; n];
    for (r, &i) in reps.iter().enumerate() {
        rep_of[i] = r;
        rep_of[mirror[i]] = r;
    }
    let m = reps.len();
    let mut folded = DMatrix::<f64>::zeros(m, m);
    for j in 0..n {
        for (r, &i) in reps.iter().enumerate() {
            folded[(r, rep_of[j])] += matrix[(i, j)];
        }
    }
    let folded_rhs = rhs.select_rows(reps.iter());
    let lu = folded.lu();
    check_pivots(lu.u().diagonal().as_slice())?;
    let half = lu
        .solve(&folded_rhs)
        .ok_or(LiftingLineError::SingularSystem { pivot_ratio: 0.0 })?;
    let units = half.select_rows(rep_of.iter());
    check_residual(matrix, &units, rhs)?;
    Ok((lu, reps, rep_of, units))
}

/// The start point of one trailing leg (a node of the discretisation).
pub(super) struct TrailingNode {
    point: Vec3,
    surface: usize,
    /// Mean width of the segments that share the node, m.
    width_m: f64,
}

/// The nodes of every surface, port tip to starboard tip: surface s has its stations' nodes
/// at indices range.start + s ..= range.end + s, so station j has nodes j + s and j + s + 1.
pub(super) fn trailing_nodes(stations: &[Station], surfaces: &[SurfaceInfo]) -> Vec<TrailingNode> {
    let mut nodes = Vec::with_capacity(stations.len() + surfaces.len());
    for (s, info) in surfaces.iter().enumerate() {
        for j in info.range.clone() {
            let st = &stations[j];
            let width_m = if j > info.range.start {
                0.5 * (st.width_m + stations[j - 1].width_m)
            } else {
                st.width_m
            };
            nodes.push(TrailingNode {
                point: st.node_a,
                surface: s,
                width_m,
            });
        }
        if let Some(last) = info.range.clone().last() {
            nodes.push(TrailingNode {
                point: stations[last].node_b,
                surface: s,
                width_m: stations[last].width_m,
            });
        }
    }
    nodes
}

/// J = I - diag(d_active) A, with d zero on inactive (stalled) rows, written into `out`
/// (already n x n).
pub(super) fn system_matrix_into(
    induced: &DMatrix<f64>,
    d: &DVector<f64>,
    active: &[bool],
    out: &mut DMatrix<f64>,
) {
    let n = induced.nrows();
    out.fill_with_identity();
    // Column by column (the storage order); each entry is computed as before.
    for j in 0..n {
        for i in 0..n {
            if active[i] {
                out[(i, j)] -= d[i] * induced[(i, j)];
            }
        }
    }
}

/// J = I - diag(d_active) A, with d zero on inactive (stalled) rows.
pub(super) fn system_matrix(
    induced: &DMatrix<f64>,
    d: &DVector<f64>,
    active: &[bool],
) -> DMatrix<f64> {
    let n = induced.nrows();
    let mut m = DMatrix::<f64>::zeros(n, n);
    system_matrix_into(induced, d, active, &mut m);
    m
}

/// Unit normal of a station's bound segment in the Trefftz plane (normal to the wake).
pub(super) fn trefftz_normal(st: &Station, wake: &Vec3) -> Vec3 {
    let dl = st.node_b - st.node_a;
    let proj = dl - wake * wake.dot(&dl);
    let n = wake.cross(&proj);
    let len = n.norm();
    if len > 0.0 {
        n / len
    } else {
        st.normal
    }
}

/// Length of a station's bound segment projected on the Trefftz plane, m.
pub(crate) fn trefftz_width_m(st: &Station, wake: &Vec3) -> f64 {
    let dl = st.node_b - st.node_a;
    (dl - wake * wake.dot(&dl)).norm()
}
