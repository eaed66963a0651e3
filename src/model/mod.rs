//! The aircraft as plain, validated types in SI units (m, kg, rad).
//!
//! Conventions used throughout the crate:
//! - x is measured aft from the datum named in the aircraft file, z is up, y is to starboard
//!   (right, seen from the cockpit); only the starboard half of each symmetric surface is stored.
//! - Angles are radians. Incidence and twist are positive leading edge up; negative tip twist is
//!   washout.
//! - Masses are kg, lengths m.
//!
//! These types are built only by [`crate::input`] (which checks every range) or by tests; they
//! hold no serde derive, so the file format can change without touching the core.

mod airfoil;
mod setup;
mod surface;

pub use airfoil::{Airfoil, AirfoilId, AirfoilShape, SectionMethod};
pub use setup::{Change, Setup};
pub use surface::{
    EllipticShape, Panel, PitchControl, Stabiliser, StabiliserRole, Surface, SurfaceShape,
    DEFAULT_CANARD_DYNAMIC_PRESSURE_RATIO, DEFAULT_TAIL_DYNAMIC_PRESSURE_RATIO,
};

/// The air the aircraft flies in.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Air {
    /// International Standard Atmosphere at a geopotential altitude, with a temperature offset.
    Standard {
        /// Geopotential altitude above mean sea level, m (0 to 11 000).
        altitude_m: f64,
        /// Temperature offset from ISA, K (positive is warmer).
        temperature_offset_k: f64,
    },
    /// A density given directly, with the ISA sea-level viscosity.
    Density {
        /// Air density, kg/m^3.
        density_kg_m3: f64,
    },
}

/// An optional fuselage, used for its destabilising (pitch-up) contribution.
#[derive(Debug, Clone, PartialEq)]
pub struct Fuselage {
    /// x of the nose, m.
    pub nose_x_m: f64,
    /// Overall length, m.
    pub length_m: f64,
    /// Greatest width, m.
    pub max_width_m: f64,
}

/// One item of mass, treated as a point.
#[derive(Debug, Clone, PartialEq)]
pub struct MassItem {
    /// Builder's name for the item ("battery", "servo, rudder").
    pub name: String,
    /// Mass, kg (>= 0).
    pub mass_kg: f64,
    /// x of the item's own CG, m aft of the datum.
    pub x_m: f64,
    /// z of the item's own CG, m above the datum line; `None` when not given.
    pub z_m: Option<f64>,
    /// The builder's own tolerances for this item, where the file gives them (otherwise the
    /// file's `[tolerances]` apply).
    pub tolerance: ItemTolerance,
}

/// How sure the builder is of one mass item, each read as one standard deviation; `None`
/// where the file gives nothing for the item (the aircraft's [`Tolerances`] apply).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct ItemTolerance {
    /// Of its mass, kg (>= 0).
    pub mass_kg: Option<f64>,
    /// Of its x, m (>= 0).
    pub x_m: Option<f64>,
}

/// The builder's tolerances for every mass item that gives none of its own (`[tolerances]`),
/// each read as one standard deviation. Zero (the default) claims no uncertainty in the CG.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Tolerances {
    /// Of each weighed mass, kg (>= 0).
    pub mass_kg: f64,
    /// Of each position x, m (>= 0).
    pub position_m: f64,
}

impl Tolerances {
    /// The tolerances that apply to `item`: its own where it has them, else these.
    pub fn of(&self, item: &MassItem) -> (f64, f64) {
        (
            item.tolerance.mass_kg.unwrap_or(self.mass_kg),
            item.tolerance.x_m.unwrap_or(self.position_m),
        )
    }
}

/// An optional fin (vertical tail), one trapezoid on the centre line. Its only roles are
/// drawing and a lateral note (the fin volume coefficient); it does not enter the pitch
/// figures. Its mass, if any, is one of the listed mass items (`mass_item`), so it cannot be
/// counted twice.
#[derive(Debug, Clone, PartialEq)]
pub struct Fin {
    /// x of the root leading edge, m aft of the datum.
    pub root_le_x_m: f64,
    /// z of the root chord, m above the datum line.
    pub root_z_m: f64,
    /// Root chord, m.
    pub root_chord_m: f64,
    /// Tip chord, m (0 for a pointed fin).
    pub tip_chord_m: f64,
    /// Height from root to tip, m (upward; the fin stands above its root).
    pub height_m: f64,
    /// Leading-edge sweep, rad, positive swept back.
    pub sweep_le_rad: f64,
    /// Name of the listed mass item that is the fin, when the builder says which.
    pub mass_item: Option<String>,
}

/// A place where ballast (nose weight or tail weight) can be added.
#[derive(Debug, Clone, PartialEq)]
pub struct BallastBay {
    /// Name of the bay ("nose", "wing joiner").
    pub name: String,
    /// x of the ballast's CG, m aft of the datum.
    pub x_m: f64,
    /// z of the ballast's CG, m; `None` when not given.
    pub z_m: Option<f64>,
    /// Greatest ballast mass the bay holds, kg.
    pub max_mass_kg: f64,
}

/// One support of a weighing: where it touches the aircraft and what its scale reads.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct WeighingSupport {
    /// x of the support's contact point, m aft of the datum.
    pub x_m: f64,
    /// Scale reading, kg (tare already subtracted).
    pub reading_kg: f64,
}

/// What the builder wants the aircraft to do, where they have a wish.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Targets {
    /// Desired static margin as a fraction of MAC (0.10 is 10 %).
    pub static_margin: Option<f64>,
    /// Desired trim speed, m/s.
    pub trim_speed_m_s: Option<f64>,
    /// Highest speed the aircraft should trim at (top of the elevator schedule), m/s.
    pub top_speed_m_s: Option<f64>,
}

/// Static-margin limits that bound the recommended CG band, as fractions of MAC.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MarginLimits {
    /// Smallest recommended static margin (aft CG limit).
    pub min_static_margin: f64,
    /// Largest recommended static margin (forward CG limit).
    pub max_static_margin: f64,
    /// True when the limits were taken from common-practice defaults rather than the file.
    pub from_defaults: bool,
}

/// The whole aircraft.
#[derive(Debug, Clone, PartialEq)]
pub struct Aircraft {
    /// Name shown in tables and reports.
    pub name: String,
    /// Free text from the builder.
    pub notes: String,
    /// What x = 0 is, in the builder's words.
    pub datum: String,
    /// The air.
    pub air: Air,
    /// Every airfoil used, referred to by [`AirfoilId`].
    pub airfoils: Vec<Airfoil>,
    /// The main wing.
    pub wing: Surface,
    /// Horizontal tail or canard, if any.
    pub stabiliser: Option<Stabiliser>,
    /// Elevons of a tailless wing (pitch use only); `None` with a stabiliser.
    pub elevons: Option<PitchControl>,
    /// Trailing-edge surfaces of the wing used as camber flaps (both sides together).
    pub wing_flaps: Vec<WingFlap>,
    /// Named flap settings (thermal, cruise, speed...), each its own glide polar.
    pub flap_settings: Vec<FlapSetting>,
    /// Fuselage, if described.
    pub fuselage: Option<Fuselage>,
    /// Fin (vertical tail), if described: drawing and lateral note only.
    pub fin: Option<Fin>,
    /// The builder's tolerances of masses and positions (`[tolerances]`), for the CG's
    /// uncertainty.
    pub tolerances: Tolerances,
    /// Mass items (at least one).
    pub masses: Vec<MassItem>,
    /// Ballast bays (may be empty).
    pub ballast_bays: Vec<BallastBay>,
    /// Targets.
    pub targets: Targets,
    /// Static-margin limits for the recommended CG band.
    pub margin_limits: MarginLimits,
    /// Named setups for comparison (may be empty).
    pub setups: Vec<Setup>,
    /// Supports of a weighing of the finished model (empty, or two or three supports).
    pub weighing: Vec<WeighingSupport>,
    /// Resolution and choice of the wing model (`[numerics]`).
    pub numerics: Numerics,
}

/// Which three-dimensional model gives the induced angles and the lift's chordwise centre.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum WingModel {
    /// Vortex lattice with chordwise panels (the default): right for sweep, low aspect ratio
    /// and the tail's downwash.
    #[default]
    VortexLattice,
    /// Phillips-Snyder lifting line, one horseshoe per strip on the quarter-chord line: the
    /// reference for straight wings of moderate to high aspect ratio; its neutral point of a
    /// swept wing lies too far aft.
    LiftingLine,
}

impl WingModel {
    /// Name used in the file, tables and JSON.
    pub fn as_str(self) -> &'static str {
        match self {
            WingModel::VortexLattice => "vortex-lattice",
            WingModel::LiftingLine => "lifting-line",
        }
    }
}

/// Resolution of the wing model, as the builder set it (`[numerics]`) or by default.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Numerics {
    /// The model.
    pub wing_model: WingModel,
    /// Strips per half-span of the wing (other surfaces keep the wing's strip width).
    pub strips_per_half_span: usize,
    /// Chordwise lattice panels per strip (vortex lattice only).
    pub chordwise_panels: usize,
}

impl Default for Numerics {
    fn default() -> Self {
        Numerics {
            wing_model: WingModel::VortexLattice,
            strips_per_half_span: DEFAULT_STRIPS_PER_HALF_SPAN,
            chordwise_panels: DEFAULT_CHORDWISE_PANELS,
        }
    }
}

/// Default strips per half-span: the vortex lattice's neutral point is then within 0.2 % of
/// the MAC of the one with both counts doubled, on swept wings to 35 deg and on a wing with
/// its tail (tests/suite/lattice.rs).
pub const DEFAULT_STRIPS_PER_HALF_SPAN: usize = 24;
/// Default stations per half-span of the lifting line, when the file chooses it (its own
/// convergence study: tests/suite/lifting_line_multi.rs).
pub const DEFAULT_LIFTING_LINE_STATIONS: usize = 40;
/// Default chordwise lattice panels per strip (see [`DEFAULT_STRIPS_PER_HALF_SPAN`]).
pub const DEFAULT_CHORDWISE_PANELS: usize = 6;

impl Aircraft {
    /// The airfoil with the given id.
    pub fn airfoil(&self, id: AirfoilId) -> &Airfoil {
        &self.airfoils[id.0]
    }

    /// The pitch control: the stabiliser's elevator, or the elevons of a tailless wing.
    pub fn pitch_control(&self) -> Option<&PitchControl> {
        match &self.stabiliser {
            Some(s) => Some(&s.elevator),
            None => self.elevons.as_ref(),
        }
    }

    /// Decalage, rad: incidence of the front lifting surface minus that of the rear one (wing
    /// minus tail, or canard minus wing), so that it is positive on a normally rigged
    /// aircraft of either layout; `None` without a stabiliser.
    pub fn decalage_rad(&self) -> Option<f64> {
        self.stabiliser.as_ref().map(|s| {
            let d = self.wing.incidence_rad - s.surface.incidence_rad;
            match s.role {
                StabiliserRole::Tail => d,
                StabiliserRole::Canard => -d,
            }
        })
    }

    /// What the builder calls the pitch control: "elevator" or "elevons".
    pub fn pitch_control_name(&self) -> &'static str {
        if self.stabiliser.is_none() && self.elevons.is_some() {
            "elevons"
        } else {
            "elevator"
        }
    }

    /// Total mass of the mass items, kg.
    pub fn total_mass_kg(&self) -> f64 {
        self.masses.iter().map(|m| m.mass_kg).sum()
    }
}

/// A trailing-edge surface of the wing deflected symmetrically as a camber flap (flaps, or
/// ailerons drooped as flaps).
#[derive(Debug, Clone, PartialEq)]
pub struct WingFlap {
    /// Name used by the flap settings.
    pub name: String,
    /// Flap chord, fraction of the local chord.
    pub chord_fraction: f64,
    /// Inboard end, fraction of the semispan.
    pub inboard_fraction: f64,
    /// Outboard end, fraction of the semispan.
    pub outboard_fraction: f64,
}

/// A named flap setting: a deflection for some of the wing's flaps.
#[derive(Debug, Clone, PartialEq)]
pub struct FlapSetting {
    /// Name (e.g. thermal, cruise, speed).
    pub name: String,
    /// (index into `Aircraft::wing_flaps`, deflection rad, trailing edge down positive).
    pub deflections: Vec<(usize, f64)>,
}
