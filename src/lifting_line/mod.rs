//! The wing model: lifting-line theory for one wing (classical) and for all lifting surfaces
//! together (numerical, multi-surface).
//!
//! - [`classical`]: Prandtl's lifting-line equation solved by Glauert's Fourier collocation,
//!   for one straight unswept wing; the reference the numerical model is checked against.
//! - [`vortex`]: Biot-Savart kernels (segment, semi-infinite leg, horseshoe, Trefftz pair).
//! - [`multi_surface`]: the Phillips-Snyder numerical lifting line for wing and tail (or
//!   canard) together, factored once per geometry, with unit solutions for fast trim.
//! - [`results`]: per-surface and total coefficients, the spanwise table and the stall station.
//!
//! Inside this module every quantity is SI with angles in radians; circulations are stored
//! divided by the free-stream speed (metres), so no speed or density is needed.

pub mod classical;
mod error;
pub mod multi_surface;
pub mod results;
pub mod vortex;

pub use classical::{ClassicalSolution, ClassicalStation, ClassicalWing};
pub use error::LiftingLineError;
pub use multi_surface::{
    ElevatorEffect, FlightCondition, LiftingLineOptions, LinearCoefficients, MultiSurfaceSystem,
    Reference, SolveStatus, Station, SurfaceInput, TrimControl, TrimPoint, TrimmedStall,
};
pub use results::{LiftingLineResult, StallStation, StationResult, SurfaceResult};
