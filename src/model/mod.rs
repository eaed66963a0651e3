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
    /// Fuselage, if described.
    pub fuselage: Option<Fuselage>,
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
}

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
