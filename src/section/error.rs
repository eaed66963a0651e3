//! Errors from the section methods, each naming the airfoil.

use super::*;

/// Errors from the section methods, each naming the airfoil.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum SectionError {
    /// Bad NACA designation.
    #[error("airfoil '{airfoil}': {error}")]
    Naca {
        /// Airfoil name.
        airfoil: String,
        /// Cause.
        error: NacaError,
    },
    /// Joukowski or Karman-Trefftz parameters not accepted.
    #[error("airfoil '{airfoil}': {error}")]
    CircleMap {
        /// Airfoil name.
        airfoil: String,
        /// Cause.
        error: CircleMapError,
    },
    /// Bad coordinates.
    #[error("airfoil '{airfoil}': {error}")]
    Geometry {
        /// Airfoil name.
        airfoil: String,
        /// Cause.
        error: GeometryError,
    },
    /// Panel solution failed.
    #[error("airfoil '{airfoil}': {error}")]
    Panel {
        /// Airfoil name.
        airfoil: String,
        /// Cause.
        error: PanelError,
    },
    /// Mean line not usable.
    #[error("airfoil '{airfoil}': {error}")]
    MeanLine {
        /// Airfoil name.
        airfoil: String,
        /// Cause.
        error: ThinAirfoilError,
    },
    /// The method cannot treat this shape.
    #[error("airfoil '{airfoil}': the {method} method is only available for Joukowski and Karman-Trefftz sections (use panel or thin)")]
    MethodNotAvailable {
        /// Airfoil name.
        airfoil: String,
        /// Method asked for.
        method: &'static str,
    },
    /// cl_max not a positive finite number.
    #[error("airfoil '{airfoil}': cl_max {value} is outside the accepted range 0 < cl_max <= 3")]
    ClMax {
        /// Airfoil name.
        airfoil: String,
        /// Value given.
        value: f64,
    },
    /// The solution produced a non-finite number.
    #[error("airfoil '{airfoil}': the {method} solution gave a non-finite {what}")]
    NotFinite {
        /// Airfoil name.
        airfoil: String,
        /// Method.
        method: &'static str,
        /// Which quantity.
        what: &'static str,
    },
    /// The solution puts the aerodynamic centre far off the section.
    #[error("airfoil '{airfoil}': the {method} solution is not credible (aerodynamic centre at x/c = {x_ac_c:.2}); for very thin sections use method thin")]
    NotCredible {
        /// Airfoil name.
        airfoil: String,
        /// Method.
        method: &'static str,
        /// The aerodynamic centre found, fraction of chord.
        x_ac_c: f64,
    },
    /// The viscous method refused the settings or the shape.
    #[error("airfoil '{airfoil}': {error}")]
    Viscous {
        /// Airfoil name.
        airfoil: String,
        /// Cause.
        error: viscous::ViscousError,
    },
    /// The viscous method needs a Reynolds number.
    #[error(
        "airfoil '{airfoil}': the viscous method needs the chord Reynolds number (1e4 to 1e7)"
    )]
    ViscousNeedsReynolds {
        /// Airfoil name.
        airfoil: String,
    },
    /// Too few converged viscous points for the linear part of the lift curve.
    #[error("airfoil '{airfoil}': the viscous polar converged at only {points} angles with |cl| <= 0.6; at least 3 are needed for the lift slope")]
    ViscousTooFewPoints {
        /// Airfoil name.
        airfoil: String,
        /// Converged points found.
        points: usize,
    },
    /// Flap-chord fraction not accepted.
    #[error(transparent)]
    Flap(#[from] flap::FlapError),
}
