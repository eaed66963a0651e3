//! Vortex-lattice lifting surface for all surfaces together, condensed onto the spanwise strips
//! of the multi-surface system so that the section data (lift slope, zero-lift angle, cl_max)
//! still decides each strip's lift.
//!
//! # The lattice
//! Every strip (station) of every surface is cut chordwise into `n_c` equal panels between the
//! leading and trailing edges of the strip's two side edges. Each panel carries a horseshoe
//! vortex whose bound segment lies on the panel's quarter-chord line and whose legs run from the
//! panel's side edges to infinity along the wake direction; the flow-tangency condition is met
//! at the panel's three-quarter-chord point on the strip's spanwise control parameter. This is
//! the classical horseshoe-vortex lattice (Falkner; Bertin & Smith's formulation; Katz &
//! Plotkin, ch. 12): the 1/4-3/4 placement gives a flat plate's 2 pi lift slope and quarter-chord
//! centre of pressure exactly in two dimensions for any number of chordwise panels, and the
//! spanwise and chordwise loading of swept, tapered, low-aspect-ratio and non-planar surfaces
//! converges as the lattice is refined, because no control point sits on a bound vortex.
//!
//! Panels are flat (the strip's chord plane, the dihedral included): every panel of strip s
//! sees the same boundary angle phi_s. With K the panel influence matrix (normal velocity per
//! unit circulation, per unit speed) and E the strip-to-panel incidence, the panel strengths
//! are Gamma_p = -K^-1 E phi and the strip circulation is G = E^T Gamma_p = M phi, with
//! M = -E^T K^-1 E. The x-moment of the strip's circulation (its panels' bound segments at
//! their own x) is Q phi with Q = -E^T diag(x_b) K^-1 E.
//!
//! # Coupling with the section data (decambering)
//! A lattice strip with lift coefficient cl behaves as a two-dimensional flat plate at the
//! effective angle cl / (2 pi) = G / (pi c); its induced angle is therefore
//! alpha_i = G / (pi c) - M^-1 G. Writing the section's own angle as geometric angle plus this
//! induced angle puts the lattice in exactly the form of the lifting line,
//!
//! alpha_section = theta + alpha n_z + A G, A = diag(1 / (pi c)) - M^-1,
//!
//! and the section relation G = (c/2) cl(alpha_section) closes it. The lattice then acts as if
//! each strip's camber line were rotated by its own correction angle (the strip's decambering,
//! phi - theta - alpha n_z), chosen so that the lattice's strip lift equals the section's lift
//! at the section's effective angle. With cl = 2 pi (alpha - alpha_0) this is the pure lattice
//! with each strip's zero-lift angle as its camber; with another lift slope, or on the
//! flat top past cl_max, the section data decide. The lift's chordwise centre follows from the
//! lattice: the x-moment of circulation is R G with R = Q M^-1, so a swept wing's forward shift
//! of lift at the root and aft shift at the tips (which moves the neutral point) is kept.
//! The section's own moment about its aerodynamic centre is added per strip, as in the lifting
//! line.
//!
//! # Symmetry
//! Pitch-plane inputs are symmetric, so the lattice is folded onto the starboard half (each
//! port panel's influence added to its mirror image's column); the condensed matrices are
//! exact for symmetric loadings, which are the only ones the system solves. In the full
//! station-by-station form handed back, a port/starboard pair shares each folded entry
//! equally.
//!
//! # References
//! - J. Katz and A. Plotkin, *Low-Speed Aerodynamics*, 2nd ed., Cambridge University Press,
//!   2001, ch. 12 (vortex-lattice method; horseshoe elements; quarter/three-quarter rule).
//! - J. J. Bertin and M. L. Smith, *Aerodynamics for Engineers*, Prentice Hall, ch. on the
//!   vortex-lattice method (horseshoe vortices on the panel quarter-chord lines, control points
//!   at three quarters of each panel chord).
//! - V. M. Falkner, "The calculation of aerodynamic loading on surfaces of any shape", ARC R&M
//!   1910, 1943 (the lattice of horseshoe vortices).
//! - R. Mukherjee and A. Gopalarathnam, "Poststall prediction of multiple-lifting-surface
//!   configurations using a decambering approach", *Journal of Aircraft* 43(3), 2006 (a
//!   lattice corrected strip by strip so that its lift matches the section data).

use nalgebra::DMatrix;
use std::f64::consts::PI;

use super::classical::check_pivots;
use super::multi_surface::Station;
use super::vortex::{segment_velocity, semi_infinite_velocity, Vec3};
use super::LiftingLineError;

/// Largest number of lattice panels on one half of the aircraft: the folded influence matrix
/// then takes about 32 MB and its factorisation a few seconds on a laptop core.
pub const MAX_HALF_PANELS: usize = 2000;

/// The lattice reduced to the strips.
#[derive(Debug, Clone)]
pub(crate) struct Condensed {
    /// Effective induced-angle matrix A (rad per m of strip circulation / speed), n x n.
    pub induced: DMatrix<f64>,
    /// x-moment of circulation beyond each strip's own x: (R - diag(x)) (m per m), n x n.
    pub lift_x_offset: DMatrix<f64>,
}

/// Core radii for one lattice (same meaning as the lifting line's).
#[derive(Debug, Clone, Copy)]
pub(crate) struct Cores {
    /// Fraction of the source strip width for panels of the same surface.
    pub self_fraction: f64,
    /// Fraction of the source strip width seen from another surface.
    pub wake_fraction: f64,
}

struct PanelRow {
    control: Vec3,
    normal: Vec3,
    surface: usize,
}

/// Bound segment of panel `k` of station `st`, and the x of its force at the strip's control
/// parameter.
fn bound(st: &Station, k: usize, n_c: usize) -> (Vec3, Vec3, f64) {
    let f = (k as f64 + 0.25) / n_c as f64;
    let x = Vec3::x();
    let a = st.le_a + x * (f * st.chord_a_m);
    let b = st.le_b + x * (f * st.chord_b_m);
    let xb = a.x + (b.x - a.x) * st.control_t;
    (a, b, xb)
}

/// Control point of panel `k` of station `st`.
fn control(st: &Station, k: usize, n_c: usize) -> Vec3 {
    let f = (k as f64 + 0.75) / n_c as f64;
    let x = Vec3::x();
    let a = st.le_a + x * (f * st.chord_a_m);
    let b = st.le_b + x * (f * st.chord_b_m);
    a + (b - a) * st.control_t
}

/// Build the lattice of `stations` (`mirror[i]` is the mirror image of station i) with `n_c`
/// chordwise panels per strip and condense it onto the strips.
pub(crate) fn condense(
    stations: &[Station],
    mirror: &[usize],
    n_c: usize,
    wake: &Vec3,
    cores: Cores,
) -> Result<Condensed, LiftingLineError> {
    let (reps, rep_of) = representatives(mirror);
    let m = reps.len();
    let np = m * n_c;
    if np > MAX_HALF_PANELS {
        return Err(LiftingLineError::InvalidInput {
            parameter: "lattice panels per half (strips x chordwise panels)",
            value: np as f64,
            range: "at most 2000 (about 32 MB and a few seconds to factor)",
        });
    }
    let rows = panel_rows(stations, &reps, n_c);
    let (elements, x_bound) = bound_elements(stations, mirror, &rep_of, n_c, np);
    let k_fold = folded_influence(&rows, &elements, np, wake, cores);
    if k_fold.iter().any(|v| !v.is_finite()) {
        return Err(LiftingLineError::NonFinite {
            quantity: "lattice influence matrix",
        });
    }
    let (strip_m, strip_q) = strip_sums(k_fold, &x_bound, m, n_c)?;
    expand_condensed(stations, mirror, &rep_of, strip_m, &strip_q)
}

/// The representative stations (the starboard half and any centre station, in order) and
/// each station's index among them (a port station takes its mirror image's).
fn representatives(mirror: &[usize]) -> (Vec<usize>, Vec<usize>) {
    let n = mirror.len();
    let reps: Vec<usize> = (0..n).filter(|&i| mirror[i] >= i).collect();
    let mut rep_of = vec![0; n];
    for (r, &i) in reps.iter().enumerate() {
        rep_of[i] = r;
        rep_of[mirror[i]] = r;
    }
    (reps, rep_of)
}

/// The control point, normal and surface of every chordwise panel of the representative
/// strips `reps`, strip by strip.
fn panel_rows(stations: &[Station], reps: &[usize], n_c: usize) -> Vec<PanelRow> {
    reps.iter()
        .flat_map(|&i| {
            let st = &stations[i];
            (0..n_c).map(move |k| PanelRow {
                control: control(st, k, n_c),
                normal: st.normal,
                surface: st.surface,
            })
        })
        .collect()
}

/// Per strip and chordwise row: the bound segment, its x, and the cores of its two legs.
struct Element {
    a: Vec3,
    b: Vec3,
    col: usize,
    surface: usize,
    width_m: f64,
    width_a_m: f64,
    width_b_m: f64,
    /// The leg at `a` is the `b` leg of the previous element in this list (same line,
    /// same start, same core): it is taken from there instead of evaluated again.
    shares_a: bool,
}

/// The bound segments of every strip's chordwise rows (all stations, row by row), with the
/// folded column each belongs to, and the x of each representative panel's bound segment, m.
fn bound_elements(
    stations: &[Station],
    mirror: &[usize],
    rep_of: &[usize],
    n_c: usize,
    np: usize,
) -> (Vec<Element>, Vec<f64>) {
    let n = stations.len();
    let mut x_bound = vec![0.0; np];
    // A trailing leg on a side edge shared by two strips uses the mean of their widths for
    // its core, so that the two legs on that line (one from each strip's panel) cancel to
    // their difference of strength, as the lifting line's shared legs do; a core taken from
    // each strip's own width would leave a spurious field next to the line wherever
    // neighbouring widths differ (a tail lying in the wing's wake sheet would see it).
    let edge_width = |j: usize, side_a: bool| -> f64 {
        let sj = &stations[j];
        let neighbour = if side_a {
            j.checked_sub(1)
                .filter(|&i| stations[i].surface == sj.surface && stations[i].node_b == sj.node_a)
        } else {
            Some(j + 1).filter(|&i| {
                i < n && stations[i].surface == sj.surface && stations[i].node_a == sj.node_b
            })
        };
        neighbour.map_or(sj.width_m, |i| 0.5 * (sj.width_m + stations[i].width_m))
    };
    let mut elements = Vec::with_capacity(n * n_c);
    for k in 0..n_c {
        for (j, sj) in stations.iter().enumerate() {
            let (a, b, xb) = bound(sj, k, n_c);
            let col = rep_of[j] * n_c + k;
            if mirror[j] >= j {
                x_bound[col] = xb;
            }
            let shares_a = j > 0
                && stations[j - 1].surface == sj.surface
                && stations[j - 1].node_b == sj.node_a;
            elements.push(Element {
                a,
                b,
                col,
                surface: sj.surface,
                width_m: sj.width_m,
                width_a_m: edge_width(j, true),
                width_b_m: edge_width(j, false),
                shares_a,
            });
        }
    }
    (elements, x_bound)
}

/// The folded influence matrix: the column of a starboard panel collects its own horseshoe's
/// normal velocity at each panel row's control point and its mirror image's.
fn folded_influence(
    rows: &[PanelRow],
    elements: &[Element],
    np: usize,
    wake: &Vec3,
    cores: Cores,
) -> DMatrix<f64> {
    let mut k_fold = DMatrix::<f64>::zeros(np, np);
    for (r, row) in rows.iter().enumerate() {
        let mut previous_b_leg = Vec3::zeros();
        for e in elements {
            let fraction = if row.surface == e.surface {
                cores.self_fraction
            } else {
                cores.wake_fraction
            };
            let leg_a = if e.shares_a {
                previous_b_leg
            } else {
                semi_infinite_velocity(&row.control, &e.a, wake, fraction * e.width_a_m)
            };
            let leg_b = semi_infinite_velocity(&row.control, &e.b, wake, fraction * e.width_b_m);
            let v =
                segment_velocity(&row.control, &e.a, &e.b, fraction * e.width_m) + leg_b - leg_a;
            previous_b_leg = leg_b;
            k_fold[(r, e.col)] += v.dot(&row.normal);
        }
    }
    k_fold
}

/// Solve the folded lattice for a unit boundary angle on each representative strip and sum
/// each strip's panels: the strip circulation matrix and its x moment (m).
fn strip_sums(
    k_fold: DMatrix<f64>,
    x_bound: &[f64],
    m: usize,
    n_c: usize,
) -> Result<(DMatrix<f64>, DMatrix<f64>), LiftingLineError> {
    let np = m * n_c;
    // Right-hand sides: a unit boundary angle on each strip's panels.
    let mut e = DMatrix::<f64>::zeros(np, m);
    for r in 0..m {
        for k in 0..n_c {
            e[(r * n_c + k, r)] = 1.0;
        }
    }
    let lu = k_fold.lu();
    check_pivots(lu.u().diagonal().as_slice())?;
    let y = lu
        .solve(&e)
        .ok_or(LiftingLineError::SingularSystem { pivot_ratio: 0.0 })?;
    let mut strip_m = DMatrix::<f64>::zeros(m, m);
    let mut strip_q = DMatrix::<f64>::zeros(m, m);
    for c in 0..m {
        let col = y.column(c);
        for r in 0..m {
            let (mut g, mut q) = (0.0, 0.0);
            for k in 0..n_c {
                let p = r * n_c + k;
                g -= col[p];
                q -= col[p] * x_bound[p];
            }
            strip_m[(r, c)] = g;
            strip_q[(r, c)] = q;
        }
    }
    Ok((strip_m, strip_q))
}

/// Condense onto the strips and unfold onto every station: the induced matrix (the strip
/// circulation matrix's inverse with the two-dimensional self term taken out) and each
/// strip's lift x offset from its control point, m.
fn expand_condensed(
    stations: &[Station],
    mirror: &[usize],
    rep_of: &[usize],
    strip_m: DMatrix<f64>,
    strip_q: &DMatrix<f64>,
) -> Result<Condensed, LiftingLineError> {
    let n = stations.len();
    let lu_m = strip_m.lu();
    check_pivots(lu_m.u().diagonal().as_slice())?;
    let m_inv = lu_m
        .try_inverse()
        .ok_or(LiftingLineError::SingularSystem { pivot_ratio: 0.0 })?;
    let r_fold = strip_q * &m_inv;
    let mut induced = DMatrix::<f64>::zeros(n, n);
    let mut lift_x_offset = DMatrix::<f64>::zeros(n, n);
    for (i, si) in stations.iter().enumerate() {
        let ri = rep_of[i];
        for (j, sj) in stations.iter().enumerate() {
            let rj = rep_of[j];
            let share = if mirror[j] == j { 1.0 } else { 0.5 };
            let mut a = -m_inv[(ri, rj)];
            let mut p = r_fold[(ri, rj)];
            if ri == rj {
                a += 1.0 / (PI * sj.chord_m);
                p -= si.x_m;
            }
            induced[(i, j)] = share * a;
            lift_x_offset[(i, j)] = share * p;
        }
    }
    if induced
        .iter()
        .chain(lift_x_offset.iter())
        .any(|v| !v.is_finite())
    {
        return Err(LiftingLineError::NonFinite {
            quantity: "condensed lattice",
        });
    }
    Ok(Condensed {
        induced,
        lift_x_offset,
    })
}
