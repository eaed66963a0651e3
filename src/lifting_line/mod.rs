//! The wing model: all lifting surfaces together on spanwise strips, with the induced angles
//! from a vortex lattice (the default) or a lifting line, and the classical lifting line for
//! one straight wing.
//!
//! - [`lattice`]: the horseshoe vortex lattice with chordwise panels, condensed onto the
//!   strips so that each strip's section data decide its lift (the default model).
//! - [`classical`]: Prandtl's lifting-line equation solved by Glauert's Fourier collocation,
//!   for one straight unswept wing; the reference the numerical model is checked against.
//! - [`vortex`]: Biot-Savart kernels (segment, semi-infinite leg, horseshoe, Trefftz pair).
//! - [`multi_surface`]: the strip system of wing and tail (or canard) together, with the
//!   lattice's or the Phillips-Snyder lifting line's induced angles, factored once per
//!   geometry, with unit solutions for fast trim.
//! - [`superposition`]: trim, neutral point and stall from the unit solutions (microseconds).
//! - [`results`]: per-surface and total coefficients, the spanwise table and the stall station.
//!
//! Inside this module every quantity is SI with angles in radians; circulations are stored
//! divided by the free-stream speed (metres), so no speed or density is needed.
//!
//! For balance and trim, build a [`MultiSurfaceSystem`] once per geometry
//! ([`MultiSurfaceSystem::from_aircraft`]: surface 0 is the wing, 1 the stabiliser) and use its
//! linear-range helpers, which only combine unit solutions: `linear_coefficients` (C_L, C_m
//! and their alpha slopes about any point), `dcm_dcl`, `neutral_point_x_m`,
//! `alpha_for_zero_moment`, `trim_for_cl` (alpha with the elevator or a surface's incidence),
//! `first_stall_alpha_rad` and `trimmed_stall` (critical-section C_L max). `solve` gives the
//! full result with the spanwise table, using Newton's method once a station passes cl_max.

pub mod classical;
mod error;
pub mod lattice;
pub mod lattice_cache;
pub mod multi_surface;
pub mod results;
pub mod superposition;
mod surface_role;
pub mod vortex;

pub use classical::{ClassicalSolution, ClassicalStation, ClassicalWing};
pub use error::LiftingLineError;
pub use multi_surface::{
    ElevatorEffect, FlightCondition, LiftingLineOptions, MultiSurfaceSystem, NewtonWork, Reference,
    SolveStatus, Station, SurfaceInput, WingModel, DEFAULT_CHORDWISE_PANELS,
    DEFAULT_STRIPS_PER_HALF_SPAN,
};
pub use results::{LiftingLineResult, StallStation, StationResult, SurfaceResult};
pub use superposition::{LinearCoefficients, TrimControl, TrimPoint, TrimmedStall};
pub use surface_role::SurfaceRole;
