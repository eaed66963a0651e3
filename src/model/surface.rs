//! Lifting surfaces: wing, tail or canard, described by panels or as an ellipse.

use super::AirfoilId;

/// One trapezoidal panel of a half-span, from its root (inboard) end to its tip (outboard) end.
///
/// The panel's root leading edge sits at the previous panel's tip leading edge (or at the
/// surface's root leading edge for the first panel).
#[derive(Debug, Clone, PartialEq)]
pub struct Panel {
    /// Spanwise length of the panel, measured in the surface's plane (along the dihedral), m.
    pub span_m: f64,
    /// Chord at the panel's inboard end, m.
    pub root_chord_m: f64,
    /// Chord at the panel's outboard end, m.
    pub tip_chord_m: f64,
    /// Leading-edge sweep, rad, positive swept back.
    pub sweep_le_rad: f64,
    /// Dihedral, rad, positive tip up.
    pub dihedral_rad: f64,
    /// Geometric twist of the outboard end relative to the surface's root chord, rad
    /// (negative is washout). The inboard end has the previous panel's tip twist (0 for the first).
    pub tip_twist_rad: f64,
    /// Airfoil at the inboard end.
    pub root_airfoil: AirfoilId,
    /// Airfoil at the outboard end.
    pub tip_airfoil: AirfoilId,
}

/// An elliptic planform: chord c(y) = c_root sqrt(1 - (y/s)^2) with a straight, unswept
/// quarter-chord line.
#[derive(Debug, Clone, PartialEq)]
pub struct EllipticShape {
    /// Semispan s, m.
    pub semispan_m: f64,
    /// Root chord, m.
    pub root_chord_m: f64,
    /// Dihedral, rad.
    pub dihedral_rad: f64,
    /// Geometric twist at the tip relative to the root, varying linearly with y, rad.
    pub tip_twist_rad: f64,
    /// Airfoil at the root.
    pub root_airfoil: AirfoilId,
    /// Airfoil at the tip.
    pub tip_airfoil: AirfoilId,
}

/// The planform of a half-span.
#[derive(Debug, Clone, PartialEq)]
pub enum SurfaceShape {
    /// One or more trapezoidal panels, root to tip.
    Panels(Vec<Panel>),
    /// An elliptic planform.
    Elliptic(EllipticShape),
}

/// A symmetric lifting surface (wing, tail or canard).
#[derive(Debug, Clone, PartialEq)]
pub struct Surface {
    /// Name ("wing", "tail").
    pub name: String,
    /// x of the root leading edge, m aft of the datum.
    pub root_le_x_m: f64,
    /// z of the root leading edge, m above the datum line.
    pub root_le_z_m: f64,
    /// Incidence of the root chord to the fuselage datum line, rad (leading edge up positive).
    pub incidence_rad: f64,
    /// The half-span planform.
    pub shape: SurfaceShape,
}

/// Whether the horizontal stabiliser is behind or ahead of the wing.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StabiliserRole {
    /// A conventional tailplane aft of the wing.
    Tail,
    /// A foreplane ahead of the wing.
    Canard,
}

/// Horizontal tail or canard.
#[derive(Debug, Clone, PartialEq)]
pub struct Stabiliser {
    /// Tail or canard.
    pub role: StabiliserRole,
    /// Its geometry.
    pub surface: Surface,
    /// The elevator (over the whole span; chord share 0 for an all-moving surface).
    pub elevator: PitchControl,
    /// Tail efficiency: dynamic pressure at the stabiliser over the free stream's (0.5 to 1.2;
    /// below 1 in a fuselage's or wing's wake, above 1 in a propeller's slipstream). It
    /// multiplies the stabiliser's lift and moment.
    pub dynamic_pressure_ratio: f64,
}

/// Default dynamic-pressure ratio of a tail behind the wing and fuselage: 0.9 (Etkin & Reid,
/// *Dynamics of Flight*, sec. 2.4, and Raymer, *Aircraft Design: A Conceptual Approach*,
/// ch. 16, give about 0.9 for a conventional aft tail; from memory). Below 1 is the safe side
/// for the neutral point and for elevator authority.
pub const DEFAULT_TAIL_DYNAMIC_PRESSURE_RATIO: f64 = 0.9;

/// Default dynamic-pressure ratio of a canard: 1.0 (it flies ahead of the wing, in the free
/// stream; Raymer, ch. 16, from memory).
pub const DEFAULT_CANARD_DYNAMIC_PRESSURE_RATIO: f64 = 1.0;

/// A plain trailing-edge flap used for pitch: the elevator of a stabiliser, or the elevons of a
/// tailless wing (moved together for pitch).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PitchControl {
    /// Flap chord / local chord (0 for an all-moving surface, 0 < F < 1 otherwise).
    pub chord_fraction: f64,
    /// Inboard end, fraction of the surface's semispan (0 at the centre line).
    pub inboard_fraction: f64,
    /// Outboard end, fraction of the semispan (1 at the tip), above `inboard_fraction`.
    pub outboard_fraction: f64,
    /// Greatest trailing-edge-up deflection, rad (positive number).
    pub max_up_rad: f64,
    /// Greatest trailing-edge-down deflection, rad (positive number).
    pub max_down_rad: f64,
}

impl PitchControl {
    /// A control over the whole span.
    pub fn full_span(chord_fraction: f64, max_up_rad: f64, max_down_rad: f64) -> Self {
        Self {
            chord_fraction,
            inboard_fraction: 0.0,
            outboard_fraction: 1.0,
            max_up_rad,
            max_down_rad,
        }
    }

    /// True when `deflection_rad` (trailing edge down positive) is within the throws.
    pub fn within_throws(&self, deflection_rad: f64) -> bool {
        deflection_rad >= -self.max_up_rad - 1e-12 && deflection_rad <= self.max_down_rad + 1e-12
    }
}
