//! Trade studies: the analysis over one or two varied quantities (CG position, ballast, a
//! mass item's mass or position, every mass scaled, stabiliser incidence or decalage),
//! reusing one set of section models and one factored wing system for every point.
//!
//! No I/O: the axes arrive as values in SI units (parsed at the command line), the points
//! leave as plain figures for `output/` to render.

mod axis;
mod decimal;
mod run;

pub use axis::{
    apply, check_value, Axis, Quantity, StudyError, MAX_CG_DISTANCE_M, MAX_INCIDENCE_RAD,
    MAX_MASS_SCALE,
};
pub use decimal::{decimals_written, round_to_decimals, without_noise, MAX_DECIMALS};
pub use run::{
    ControlOutcome, Point, PointFigures, Study, StudyPrepareError, TrimOutcome, MAX_POINTS,
};
