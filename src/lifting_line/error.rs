//! Errors of the lifting-line methods: each variant names the quantity and the offending value.

/// Why a lifting-line model could not be built or solved.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum LiftingLineError {
    /// A numerical input lies outside its accepted range (or is not finite).
    #[error("{parameter} = {value} is outside the accepted range ({range})")]
    InvalidInput {
        /// Name of the parameter.
        parameter: &'static str,
        /// The value given.
        value: f64,
        /// The accepted range, in words.
        range: &'static str,
    },
    /// A surface refers to an airfoil for which no section model was supplied.
    #[error("surface `{surface}` uses airfoil index {index}, but only {available} section models were given")]
    MissingSection {
        /// Surface name.
        surface: String,
        /// The airfoil index asked for.
        index: usize,
        /// Number of section models given.
        available: usize,
    },
    /// The classical method was asked to solve a swept wing.
    #[error("the classical lifting line needs an unswept quarter-chord line; surface `{surface}` panel {panel} has quarter-chord sweep {sweep_rad} rad")]
    SweptQuarterChord {
        /// Surface name.
        surface: String,
        /// Panel index (0 at the root).
        panel: usize,
        /// Quarter-chord sweep of that panel, rad.
        sweep_rad: f64,
    },
    /// The linear system is singular or too badly conditioned to trust.
    #[error("the lifting-line system is singular or ill-conditioned (smallest / largest LU pivot = {pivot_ratio:e})")]
    SingularSystem {
        /// Ratio of the smallest to the largest absolute LU pivot.
        pivot_ratio: f64,
    },
    /// A linear solve left a residual larger than the accepted tolerance.
    #[error("lifting-line linear solve residual {residual:e} exceeds {tolerance:e}")]
    InaccurateSolve {
        /// Relative residual max|Ax - b| / max|b|.
        residual: f64,
        /// Accepted relative residual.
        tolerance: f64,
    },
    /// Newton's method on the stalled (nonlinear) system did not converge.
    #[error("the nonlinear (stall) lifting-line solve did not converge after {iterations} Newton iterations (residual {residual:e})")]
    NotConverged {
        /// Iterations done.
        iterations: usize,
        /// Largest absolute residual of the last iterate, m (circulation / speed).
        residual: f64,
    },
    /// A computation produced NaN or infinity.
    #[error("the lifting-line {quantity} is not finite")]
    NonFinite {
        /// What was being computed.
        quantity: &'static str,
    },
    /// A surface index, per-surface list or station count does not match the system.
    #[error("{what}: got {got}, expected {expected}")]
    SurfaceCount {
        /// What was mismatched.
        what: &'static str,
        /// Number or index given.
        got: usize,
        /// What the system has (surfaces or stations).
        expected: usize,
    },
    /// No station reaches its cl_max in the searched range of angle of attack.
    #[error("no station reaches cl_max between alpha = {alpha_low_rad} and {alpha_high_rad} rad")]
    StallNotFound {
        /// Lower end of the search, rad.
        alpha_low_rad: f64,
        /// Upper end of the search, rad.
        alpha_high_rad: f64,
    },
    /// No angle of attack makes the pitching moment zero.
    #[error("no angle of attack between -90 and 90 deg gives zero pitching moment about x = {x_ref_m} m")]
    NoTrim {
        /// Moment reference x, m.
        x_ref_m: f64,
    },
}
