//! Reading input files: the aircraft file (TOML), airfoil coordinate files, units.
//!
//! This is the only module that knows TOML and the file format. It reads in two stages: a raw
//! mirror of the file (`raw`, serde, unknown keys refused), then validation into
//! [`crate::model`] types ([`aircraft_file`]), with every error naming file, line, column, key
//! and accepted range.

pub mod aircraft_file;
pub mod coordinates;
pub mod error;
pub mod file;
pub mod limits;
mod raw;
mod toml_error;
pub mod units;

pub use aircraft_file::{load_aircraft_file, parse_aircraft};
pub use error::{InputError, Location};
