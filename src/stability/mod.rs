//! Longitudinal stability and trim.
//!
//! [`classical`] is the closed-form first estimate (Helmbold lift slope, simple downwash
//! gradient, the textbook wing-plus-tail neutral point, trim from Cm = 0); it stays as a
//! cross-check beside the lifting-line model.

pub mod classical;
pub mod fuselage;
pub mod trim;
pub mod uncertainty;
