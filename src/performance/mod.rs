//! Performance: a drag build-up and the parabolic glide polar it gives.

pub mod drag;
pub mod polar;
