//! Velocity induced by straight vortex filaments: a finite segment, a semi-infinite trailing
//! leg, a horseshoe vortex made of the three, and the two-dimensional field of an infinite
//! trailing line (for the Trefftz plane).
//!
//! All functions return the velocity **per unit circulation** (m^-1; multiply by the
//! circulation in m^2/s to get m/s). A positive circulation has its vorticity along the
//! filament's stated direction (right-hand rule).
//!
//! # Core radius
//! The Biot-Savart kernel is singular on the filament. Each function takes a core radius
//! `core_m` and multiplies the ideal line-vortex field by 1 - exp(-h^2/core^2), where h is the
//! perpendicular distance from the filament (the Gaussian, Lamb-Oseen, core). A few core radii
//! away the result is the ideal line vortex to within exp(-h^2/core^2); on the filament it is
//! zero instead of infinite, so no NaN or infinity can leave these functions for finite inputs.
//! A zero core gives the ideal kernel (and zero exactly on the filament).
//!
//! # References
//! - Gaussian (Lamb-Oseen) vortex core: the viscous line vortex of Oseen (1912) and Lamb,
//!   *Hydrodynamics*, 6th ed., art. 334a (from memory), used here only as a regularisation.
//! - Biot-Savart law for a straight vortex segment of finite length, written with the two
//!   end vectors r1, r2: V = Gamma/(4 pi) (r1 x r2)/|r1 x r2|^2 r0.(r1/|r1| - r2/|r2|);
//!   J. Katz and A. Plotkin, *Low-Speed Aerodynamics*, 2nd ed., Cambridge, 2001, sec. 2.13
//!   (from memory).
//! - The horseshoe vortex with semi-infinite legs parallel to the free stream: W. F. Phillips
//!   and D. O. Snyder, "Modern adaptation of Prandtl's classic lifting-line theory", *Journal
//!   of Aircraft* 37(4), 2000, eq. for the velocity induced by horseshoe vortex j.

use nalgebra::Vector3;

/// A 3-vector in the aircraft axes (x aft, y starboard, z up), m or m/s.
pub type Vec3 = Vector3<f64>;

const INV_FOUR_PI: f64 = 0.25 / std::f64::consts::PI;
const INV_TWO_PI: f64 = 0.5 / std::f64::consts::PI;

/// A point closer to a segment's line than this fraction of the segment length is on it.
const ON_LINE_RELATIVE: f64 = 1e-10;

/// The ideal kernel's 1/h^2 with a Gaussian (Lamb-Oseen) core: (1 - exp(-h^2/core^2)) / h^2,
/// which tends to 1/core^2 on the filament (where the caller's numerator vanishes) and to
/// 1/h^2 a few core radii away.
fn core_factor(h2: f64, core_m: f64) -> f64 {
    let c2 = core_m * core_m;
    if c2 <= 0.0 {
        if h2 > 0.0 {
            1.0 / h2
        } else {
            0.0
        }
    } else if h2 > 40.0 * c2 {
        // exp(-40) = 4e-18: below double-precision resolution of the factor; skip the exp.
        1.0 / h2
    } else if h2 > 1e-12 * c2 {
        -(-h2 / c2).exp_m1() / h2
    } else {
        1.0 / c2
    }
}

/// Velocity per unit circulation at `p` from a straight segment from `a` to `b` (vorticity
/// along b - a), with Gaussian core radius `core_m`.
pub fn segment_velocity(p: &Vec3, a: &Vec3, b: &Vec3, core_m: f64) -> Vec3 {
    let r0 = b - a;
    let r1 = p - a;
    let r2 = p - b;
    let n1 = r1.norm();
    let n2 = r2.norm();
    let len2 = r0.norm_squared();
    if n1 <= 0.0 || n2 <= 0.0 || len2 <= 0.0 {
        return Vec3::zeros();
    }
    let cross = r1.cross(&r2);
    // |r1 x r2|^2 = h^2 |r0|^2.
    let h2 = cross.norm_squared() / len2;
    if h2 <= ON_LINE_RELATIVE * ON_LINE_RELATIVE * len2 {
        // On the filament's line (within round-off): the field along the line is zero, and the
        // round-off direction of r1 x r2 must not be amplified by the core.
        return Vec3::zeros();
    }
    // Reciprocals once: divisions dominate the cost of this kernel.
    let k = r0.dot(&(r1 * n1.recip() - r2 * n2.recip()));
    cross * (k * core_factor(h2, core_m) * INV_FOUR_PI * len2.recip())
}

/// Velocity per unit circulation at `p` from a semi-infinite filament that starts at `a` and
/// runs to infinity along the unit vector `u` (vorticity along `u`).
pub fn semi_infinite_velocity(p: &Vec3, a: &Vec3, u: &Vec3, core_m: f64) -> Vec3 {
    let r = p - a;
    let nr = r.norm();
    if nr <= 0.0 {
        return Vec3::zeros();
    }
    let ucr = u.cross(&r);
    // u x r / (|r| (|r| - u.r)) rewritten as (u x r)(1 + u.r/|r|) / |u x r|^2, which is
    // regular upstream of the start and takes the core directly (|u x r| = h).
    ucr * ((1.0 + u.dot(&r) * nr.recip()) * core_factor(ucr.norm_squared(), core_m) * INV_FOUR_PI)
}

/// Velocity per unit circulation at `p` from a horseshoe vortex: a trailing leg from infinity
/// (downstream, along `u`) to `a`, the bound segment from `a` to `b`, and a trailing leg from
/// `b` back to infinity along `u`. With `u` pointing aft and `a` to port of `b`, a positive
/// circulation gives lift (up) in a stream along `u`.
///
/// `bound_core_m` is the core radius of the bound segment, `trailing_core_m` that of the legs.
pub fn horseshoe_velocity(
    p: &Vec3,
    a: &Vec3,
    b: &Vec3,
    u: &Vec3,
    bound_core_m: f64,
    trailing_core_m: f64,
) -> Vec3 {
    segment_velocity(p, a, b, bound_core_m) + semi_infinite_velocity(p, b, u, trailing_core_m)
        - semi_infinite_velocity(p, a, u, trailing_core_m)
}

/// Two-dimensional velocity per unit circulation at `p` from the two infinite trailing lines
/// of a horseshoe (through `a` with vorticity -u and through `b` with vorticity +u), seen in a
/// plane normal to `u` far downstream (the Trefftz plane). Points are projected on that plane.
pub fn trefftz_pair_velocity(p: &Vec3, a: &Vec3, b: &Vec3, u: &Vec3, core_m: f64) -> Vec3 {
    trefftz_line_velocity(p, b, u, core_m) - trefftz_line_velocity(p, a, u, core_m)
}

/// Two-dimensional velocity per unit circulation at `p` from an infinite straight line through
/// `q` along the unit vector `u` (vorticity along `u`), the field of one trailing line in the
/// Trefftz plane.
pub fn trefftz_line_velocity(p: &Vec3, q: &Vec3, u: &Vec3, core_m: f64) -> Vec3 {
    let r = p - q;
    let r_perp = r - u * u.dot(&r);
    u.cross(&r_perp) * (core_factor(r_perp.norm_squared(), core_m) * INV_TWO_PI)
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;
    use std::f64::consts::PI;

    // Infinite straight line: |V| = 1/(2 pi h) per unit circulation (Biot-Savart, any
    // aerodynamics text); a long segment seen from its middle approaches it.
    #[test]
    fn long_segment_tends_to_the_infinite_line() {
        let a = Vec3::new(0.0, -1e4, 0.0);
        let b = Vec3::new(0.0, 1e4, 0.0);
        let p = Vec3::new(-0.5, 0.0, 0.0);
        let v = segment_velocity(&p, &a, &b, 0.0);
        // vorticity +y, point ahead (-x): y x (-x) = +z
        assert_relative_eq!(v.z, 1.0 / (2.0 * PI * 0.5), max_relative = 1e-6);
        assert_relative_eq!(v.x, 0.0, epsilon = 1e-12);
    }

    // Semi-infinite line seen beside its start induces half the infinite line's velocity.
    #[test]
    fn semi_infinite_line_at_its_start_gives_half() {
        let u = Vec3::new(1.0, 0.0, 0.0);
        let v = semi_infinite_velocity(&Vec3::new(0.0, -0.2, 0.0), &Vec3::zeros(), &u, 0.0);
        assert_relative_eq!(v.z.abs(), 1.0 / (4.0 * PI * 0.2), max_relative = 1e-12);
        // x x (-y) = -z
        assert!(v.z < 0.0);
    }

    // The segment formula and two semi-infinite lines must agree: a segment from a to b equals
    // the semi-infinite line from a minus the one from b (same direction).
    #[test]
    fn segment_equals_difference_of_semi_infinite_lines() {
        let a = Vec3::new(0.1, 0.2, -0.1);
        let b = Vec3::new(0.7, 0.5, 0.2);
        let u = (b - a).normalize();
        let p = Vec3::new(0.3, -0.4, 0.5);
        let seg = segment_velocity(&p, &a, &b, 0.0);
        let diff =
            semi_infinite_velocity(&p, &a, &u, 0.0) - semi_infinite_velocity(&p, &b, &u, 0.0);
        assert_relative_eq!(seg, diff, epsilon = 1e-12);
    }

    // On the filament the core gives zero, never NaN.
    #[test]
    fn points_on_filaments_give_finite_zero() {
        let a = Vec3::zeros();
        let b = Vec3::new(0.0, 1.0, 0.0);
        let u = Vec3::new(1.0, 0.0, 0.0);
        let on_bound = Vec3::new(0.0, 0.5, 0.0);
        let on_leg = Vec3::new(3.0, 1.0, 0.0);
        let v1 = horseshoe_velocity(&on_bound, &a, &b, &u, 1e-6, 1e-6);
        let v2 = horseshoe_velocity(&on_leg, &a, &b, &u, 1e-6, 1e-6);
        assert!(v1.iter().chain(v2.iter()).all(|c| c.is_finite()));
        // at the bound midpoint only the legs act: 2 * 1/(4 pi 0.5) (1 + 0) downward
        assert_relative_eq!(v1.z, -2.0 / (4.0 * PI * 0.5), max_relative = 1e-9);
    }

    // Far downstream the horseshoe's field tends to the Trefftz-plane pair (twice the field of
    // the legs beside their starts).
    #[test]
    fn far_wake_matches_trefftz_pair() {
        let a = Vec3::new(0.0, -0.5, 0.0);
        let b = Vec3::new(0.0, 0.5, 0.0);
        let u = Vec3::new(1.0, 0.0, 0.0);
        let p = Vec3::new(1e5, 0.2, 0.1);
        let v3 = horseshoe_velocity(&p, &a, &b, &u, 0.0, 0.0);
        let v2 = trefftz_pair_velocity(&p, &a, &b, &u, 0.0);
        assert_relative_eq!(v3, v2, epsilon = 1e-9);
    }
}
