//! Tail and fin figures of the planform: the horizontal tail volume, the V-tail test and its
//! side area (Purser and Campbell, NACA Report 823, 1945), the fin's area and MAC and the
//! vertical tail volume coefficient (D. P. Raymer, *Aircraft Design: A Conceptual
//! Approach*, 6th ed., secs. 6.4 and 7.3).

use super::*;

/// Horizontal tail (or canard) volume coefficient and arm.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TailVolume {
    /// Distance from the wing's MAC quarter chord to the stabiliser's MAC quarter chord, m
    /// (positive for a tail behind the wing, negative for a canard).
    pub arm_m: f64,
    /// V_H = S_h l_h / (S_w c_w); negative for a canard.
    pub coefficient: f64,
}

/// Tail volume of `stab` relative to `wing`.
pub fn tail_volume(wing: &PlanformGeometry, stab: &PlanformGeometry) -> TailVolume {
    let arm_m = stab.mac_quarter_x_m() - wing.mac_quarter_x_m();
    TailVolume {
        arm_m,
        coefficient: stab.area_m2 * arm_m / (wing.area_m2 * wing.mac_m),
    }
}

/// A stabiliser whose projected area is less than this share of its area in its own plane
/// (a mean dihedral above about 10 deg) is treated as a V-tail: it is described as one, and
/// it is the aircraft's fin.
pub const VEE_TAIL_AREA_RATIO: f64 = 0.985;

/// True when `surface` (a stabiliser) is a V-tail in the sense of [`VEE_TAIL_AREA_RATIO`].
pub fn is_vee_tail(surface: &Surface) -> bool {
    let true_area = true_area_m2(surface);
    true_area > 0.0 && geometry(surface).area_m2 / true_area < VEE_TAIL_AREA_RATIO
}

/// The side (yaw) area of a surface with dihedral, both halves, m^2: each panel's area in its
/// own plane times sin^2 of its dihedral (the V-tail projection of Purser and Campbell, NACA
/// Report 823, 1945: a V-tail acts in yaw as a fin of about this area, as it acts in pitch as
/// a flat tail of area times cos^2). Zero for a flat surface.
pub fn side_area_m2(surface: &Surface) -> f64 {
    match &surface.shape {
        SurfaceShape::Panels(panels) => panels
            .iter()
            .map(|p| p.span_m * (p.root_chord_m + p.tip_chord_m) * p.dihedral_rad.sin().powi(2))
            .sum(),
        SurfaceShape::Elliptic(e) => {
            0.5 * std::f64::consts::PI
                * e.root_chord_m
                * e.semispan_m
                * e.dihedral_rad.sin().powi(2)
        }
    }
}

/// Area of the surface in its own plane (both halves), m^2: each panel's span along its
/// dihedral times its mean chord. Equals the projected area of a flat surface; a V-tail's is
/// larger by 1 / cos(dihedral).
pub fn true_area_m2(surface: &Surface) -> f64 {
    match &surface.shape {
        SurfaceShape::Panels(panels) => panels
            .iter()
            .map(|p| p.span_m * (p.root_chord_m + p.tip_chord_m))
            .sum(),
        SurfaceShape::Elliptic(e) => 0.5 * std::f64::consts::PI * e.root_chord_m * e.semispan_m,
    }
}

/// Geometry of a fin: one trapezoid standing on the centre line.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FinGeometry {
    /// Area, m^2 (one side: the fin is not mirrored).
    pub area_m2: f64,
    /// Mean aerodynamic chord, m.
    pub mac_m: f64,
    /// x of the MAC's leading edge, m aft of the datum.
    pub mac_le_x_m: f64,
    /// z of the MAC, m above the datum line.
    pub mac_z_m: f64,
}

impl FinGeometry {
    /// x of the MAC quarter-chord point, m.
    pub fn mac_quarter_x_m(&self) -> f64 {
        self.mac_le_x_m + 0.25 * self.mac_m
    }
}

/// The fin's area and MAC: the trapezoid's MAC `(2/3) c_r (1 + l + l^2)/(1 + l)` at
/// `(h/3) (1 + 2 l)/(1 + l)` above the root, `l` the taper (Raymer sec. 7.3, as for a half
/// wing), its leading edge that height times tan(sweep) aft of the root leading edge.
pub fn fin_geometry(fin: &crate::model::Fin) -> FinGeometry {
    let (cr, ct, h) = (fin.root_chord_m, fin.tip_chord_m, fin.height_m);
    let taper = if cr > 0.0 { ct / cr } else { 0.0 };
    let z_mac = h / 3.0 * (1.0 + 2.0 * taper) / (1.0 + taper);
    FinGeometry {
        area_m2: 0.5 * (cr + ct) * h,
        mac_m: 2.0 / 3.0 * cr * (1.0 + taper + taper * taper) / (1.0 + taper),
        mac_le_x_m: fin.root_le_x_m + z_mac * fin.sweep_le_rad.tan(),
        mac_z_m: fin.root_z_m + z_mac,
    }
}

/// The vertical tail (fin) volume coefficient `V_v = S_v l_v / (S b)`, with `l_v` from the
/// wing's MAC quarter chord to the fin's (`arm_m`), on the wing's area and span (Raymer,
/// *Aircraft Design: A Conceptual Approach*, sec. 6.4, eq. 6.29, the vertical tail volume
/// coefficient; equation number from memory).
pub fn fin_volume_coefficient(wing: &PlanformGeometry, side_area_m2: f64, arm_m: f64) -> f64 {
    side_area_m2 * arm_m / (wing.area_m2 * wing.span_m)
}
