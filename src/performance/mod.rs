//! Performance: drag of the aircraft and its glide.
//!
//! - [`drag`]: zero-lift drag by component build-up (flat-plate friction and form factors).
//! - [`polar`]: the parabolic polar from that build-up, kept as a cross-check.
//! - [`profile_drag`]: section drag cd(cl, Re) from viscous polars on a Reynolds ladder.
//! - [`aircraft_drag`]: trimmed drag of the whole aircraft from the wing-model solution.
//! - [`flight_polar`]: sink, glide ratio and speed to fly over the speed range.

pub mod aircraft_drag;
pub mod drag;
pub mod flight_polar;
pub mod polar;
pub mod profile_drag;
