//! Small numerical methods shared by the models, pure and free of physics: each file one
//! published method with its source.
//!
//! - [`brent`]: Brent's bracketing root finder for a continuous function of one variable.
//! - [`brent_min`]: Brent's method for the least value of a function of one variable.
//! - [`lu`]: LU factorisation with partial pivoting in buffers the caller keeps.

pub mod brent;
pub mod brent_min;
pub mod lu;
