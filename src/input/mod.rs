//! Reading input files: the aircraft file (TOML), airfoil coordinate files, units.
//!
//! This is the only module that knows TOML and the file format. It reads in two stages: a raw
//! mirror of the file (serde, unknown keys rejected), then validation into [`crate::model`]
//! types, with every error naming file, line, column, key and accepted range.

pub mod coordinates;
pub mod error;

pub use error::{InputError, Location};
