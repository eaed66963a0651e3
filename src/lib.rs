//! trimline: balance, trim and stall estimates for gliders and model aircraft.
//!
//! Data flows one way through the modules:
//! aircraft file ([`input`]) -> [`model`] -> [`section`] -> [`planform`] and
//! [`lifting_line`] -> [`balance`], [`stability`] -> [`analysis`] -> [`output`];
//! [`study`] runs the chain over a grid of configurations.
//!
//! Everything between `input` and `output` is the numerical core: it does no I/O,
//! prints nothing and works in SI units with angles in radians.
#![warn(clippy::too_many_lines)]
#![deny(clippy::print_stdout, clippy::print_stderr)]

pub mod analysis;
pub mod atmosphere;
pub mod balance;
pub mod caution;
pub mod finding;
pub mod input;
pub mod lattice_store;
pub mod lifting_line;
pub mod model;
pub mod numeric;
pub mod output;
pub mod performance;
pub mod planform;
pub mod plausibility;
pub mod polar_store;
pub mod printable;
pub mod section;
pub mod stability;
pub mod study;
