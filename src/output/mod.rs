//! (in progress)

pub mod section;
