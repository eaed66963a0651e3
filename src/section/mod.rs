//! Two-dimensional airfoil aerodynamics: each published method in its own module, and the
//! [`SectionModel`] that the wing model consumes.

pub mod model;

pub use model::{ClMaxSource, SectionModel, DEFAULT_CL_MAX};
pub mod pending;
