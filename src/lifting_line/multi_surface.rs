//! Strip system for several lifting surfaces together (wing with tail or canard): the
//! Phillips-Snyder numerical lifting line, or the same strips with the induced-angle matrix
//! and the lift's chordwise centre of the vortex lattice ([`super::lattice`], the default;
//! chosen by [`LiftingLineOptions::model`]). The description below is the lifting line's; the
//! lattice replaces A_ij by its condensed matrix and keeps everything else (section relation,
//! unit solutions, Newton's method past cl_max).
//!
//! Each surface is cut spanwise, over both halves, into segments along its quarter-chord line.
//! Every segment carries a horseshoe vortex: a bound vortex on the segment and two trailing
//! legs that leave its ends parallel to the free stream and run to infinity. Stations are
//! clustered toward the tips and panel joins by cosine spacing (and, on request, toward a root
//! where the quarter-chord line is kinked by sweep or dihedral); each control point sits on its
//! bound segment at the cosine-parameter midpoint. Sweep, dihedral, twist, panel joins and the
//! longitudinal and vertical offset of each surface are all part of the geometry, so the
//! wing's trailing vorticity induces the downwash at the tail and the tail's bound vortex the
//! upwash at the wing.
//!
//! # Equations
//! With circulations divided by the free-stream speed (metres), station i satisfies the
//! section relation Gamma_i = (1/2) c_i cl_i(alpha_i) (Phillips and Snyder's 2 |v x zeta| G =
//! cl with the small-angle free stream; c is the streamwise chord), where
//!
//! alpha_i = theta_i + alpha n_z,i + sum_j A_ij Gamma_j,
//!
//! theta_i is the surface incidence plus twist, n_z,i the vertical component of the station's
//! normal (cos of the dihedral) and A_ij the normal velocity at control point i induced by a
//! unit horseshoe j. Angles are small in the kinematics (Prandtl's assumption); the forces use
//! the exact free-stream direction.
//!
//! In the linear range cl = a (alpha - alpha_L0) and the system (I - D A) Gamma = D (theta +
//! alpha n_z - alpha_L0), D = diag(c a / 2), has a matrix that depends only on the geometry. It
//! is factored once (nalgebra LU with a pivot and residual check) and solved for unit right-hand
//! sides: the constant geometry, angle of attack, elevator deflection and each surface's
//! incidence change. These inputs are symmetric, so the unit solutions are found from the
//! system folded onto the starboard half (port columns added to their mirror images; a quarter
//! of the matrix, an eighth of the LU work) and checked against the full system's residual. Any flight condition is a superposition of those unit solutions, so a
//! trim solve costs a few multiplications.
//!
//! Past a section's cl_max (or below cl_min) the flat-top section model holds cl at its limit,
//! which makes the system piecewise linear; it is then solved by Newton's method, whose
//! Jacobian has the zero section slope on stalled rows. Below the limits the linear solution is
//! exact for the flat-top model, so Newton is used only once a station passes a limit; it
//! reports non-convergence as an error.
//!
//! The trailing legs follow a fixed wake direction (the body x axis rotated by
//! [`LiftingLineOptions::wake_angle_rad`], default zero): that fixes the geometry and therefore
//! the factored matrix. Build a new system with another wake angle to move the wake.
//!
//! Building and re-solving the system is in `build.rs`; strips and their clustering (and the
//! swept-root caveat) in `strips.rs`; the horseshoe influences, their vortex cores and the unit
//! solutions in `influence.rs`; Newton's method past cl_max in `newton.rs`.
//!
//! # References
//! - W. F. Phillips and D. O. Snyder, "Modern adaptation of Prandtl's classic lifting-line
//!   theory", *Journal of Aircraft* 37(4), 2000 (horseshoe system, control points,
//!   nonlinear section relation and Newton's method, cosine clustering).
//! - L. Prandtl, "Tragflügeltheorie", 1918 (small-angle lifting-line kinematics).
//! - H. Glauert, *The Elements of Aerofoil and Airscrew Theory*, 1926, ch. X (flap: the
//!   elevator enters as a change of zero-lift angle and moment, computed by the caller).

use std::ops::Range;

use nalgebra::{DMatrix, DVector};

use super::classical::{check_pivots, check_residual, check_vector_residual_into};
use super::lattice;
use super::results::{self, LiftingLineResult};
use super::vortex::{
    horseshoe_velocity, segment_velocity, semi_infinite_velocity, trefftz_line_velocity, Vec3,
};
use super::LiftingLineError;
use crate::model::{Aircraft, Surface, SurfaceShape};
pub use crate::model::{WingModel, DEFAULT_CHORDWISE_PANELS, DEFAULT_STRIPS_PER_HALF_SPAN};
use crate::numeric::lu::LuWork;
use crate::planform::{self, break_points_m, half_span_length_m, station_at};
use crate::section::SectionModel;

mod build;
mod influence;
mod newton;
mod strips;

pub(crate) use influence::trefftz_width_m;
use influence::{horseshoe_influences, solve_unit_inputs, system_matrix, unit_right_hand_sides};
pub use newton::NewtonWork;
use strips::{check_elevators, check_options, discretise_surfaces, mirror_stations};

/// Effect of pitch-control deflection (an elevator, or the elevons of a tailless wing) on each
/// section it covers (Glauert flap theory values computed by the caller). Deflection is
/// positive trailing edge down; it acts between the inboard and outboard ends, given as
/// fractions of the semispan measured along the surface (as panel spans are).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ElevatorEffect {
    /// d alpha_L0 / d delta (negative: trailing edge down lowers the zero-lift angle), rad/rad.
    pub dalpha0_per_rad_deflection: f64,
    /// d cm_ac / d delta, per rad (negative: trailing edge down pitches the section nose down).
    pub dcm_ac_per_rad_deflection: f64,
    /// Inboard end of the control, fraction of the semispan (0 at the centre line).
    pub inboard_fraction: f64,
    /// Outboard end, fraction of the semispan (1 at the tip).
    pub outboard_fraction: f64,
}

impl ElevatorEffect {
    /// A control over the whole span with the given section effects.
    pub fn full_span(dalpha0_per_rad_deflection: f64, dcm_ac_per_rad_deflection: f64) -> Self {
        Self {
            dalpha0_per_rad_deflection,
            dcm_ac_per_rad_deflection,
            inboard_fraction: 0.0,
            outboard_fraction: 1.0,
        }
    }
}

/// One surface handed to the builder.
#[derive(Debug, Clone, Copy)]
pub struct SurfaceInput<'a> {
    /// Its geometry.
    pub surface: &'a Surface,
    /// Section models indexed by `AirfoilId.0`.
    pub sections: &'a [SectionModel],
    /// Elevator effect when this surface carries the elevator.
    pub elevator: Option<ElevatorEffect>,
}

impl<'a> SurfaceInput<'a> {
    /// The wing of `aircraft`, which carries the pitch control `elevator` only when there is
    /// no stabiliser (elevons).
    pub fn wing_of(
        aircraft: &'a Aircraft,
        sections: &'a [SectionModel],
        elevator: Option<ElevatorEffect>,
    ) -> Self {
        SurfaceInput {
            surface: &aircraft.wing,
            sections,
            elevator: elevator.filter(|_| aircraft.stabiliser.is_none()),
        }
    }
}

/// Reference quantities for the coefficients (normally the wing's).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Reference {
    /// Reference area, m^2.
    pub area_m2: f64,
    /// Reference chord for moments (mean aerodynamic chord), m.
    pub mac_m: f64,
    /// Reference span for the span efficiency, m.
    pub span_m: f64,
}

impl Reference {
    /// The area, MAC and span of `surface`.
    pub fn of_surface(surface: &Surface) -> Self {
        let g = planform::geometry(surface);
        Reference {
            area_m2: g.area_m2,
            mac_m: g.mac_m,
            span_m: g.span_m,
        }
    }

    /// Aspect ratio b^2 / S.
    pub fn aspect_ratio(&self) -> f64 {
        self.span_m * self.span_m / self.area_m2
    }
}

/// Discretisation and solver settings.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LiftingLineOptions {
    /// The three-dimensional model (default: the vortex lattice, [`super::lattice`]).
    pub model: WingModel,
    /// Strips (horseshoe vortices of the lifting line) per half-span of each surface (2 to
    /// 500; default 40).
    pub stations_per_half_span: usize,
    /// Chordwise lattice panels per strip (1 to 40; default 6; used by the vortex lattice
    /// only).
    pub chordwise_panels: usize,
    /// Direction of the trailing legs: the body x axis rotated nose-up by this angle, rad
    /// (default 0; |angle| < 1.5).
    pub wake_angle_rad: f64,
    /// Core radius between stations of one surface, as a fraction of the source segment width
    /// (default 0.01: with the Gaussian core its effect half a width away is exp(-2500)).
    pub self_core_fraction: f64,
    /// Core radius seen from another surface, as a fraction of the source segment width
    /// (default 0.25).
    pub wake_core_fraction: f64,
    /// Lifting line only: cluster stations toward a kinked root (sweep or dihedral) as well
    /// as toward the tips and panel joins (the vortex lattice always does, which speeds its
    /// convergence at a swept root; default false for the lifting line: at a swept root the discrete solution depends on the
    /// distance of the nearest control point from the kink, and clustering there makes that
    /// dependence stronger; see the module documentation).
    pub cluster_at_kinked_root: bool,
    /// Space the strips evenly along the span instead of by the cosine rule (default false;
    /// even spacing reproduces textbook lattice examples, the cosine rule converges faster).
    pub uniform_spacing: bool,
    /// Largest number of Newton iterations for the stalled system (default 50).
    pub max_newton_iterations: usize,
    /// Newton convergence: largest residual relative to the largest circulation (default 1e-10).
    pub newton_relative_tolerance: f64,
}

impl Default for LiftingLineOptions {
    fn default() -> Self {
        LiftingLineOptions {
            model: WingModel::VortexLattice,
            stations_per_half_span: DEFAULT_STRIPS_PER_HALF_SPAN,
            chordwise_panels: DEFAULT_CHORDWISE_PANELS,
            wake_angle_rad: 0.0,
            self_core_fraction: 1e-2,
            wake_core_fraction: 0.25,
            cluster_at_kinked_root: false,
            uniform_spacing: false,
            max_newton_iterations: 50,
            newton_relative_tolerance: 1e-10,
        }
    }
}

/// One station (horseshoe vortex) of the discretised aircraft.
#[derive(Debug, Clone, PartialEq)]
pub struct Station {
    /// Index of its surface in the system (0 is the first surface given, normally the wing).
    pub surface: usize,
    /// Signed in-plane distance of the control point from the root, m (negative to port).
    pub s_m: f64,
    /// y of the control point, m (starboard positive).
    pub y_m: f64,
    /// x of the control point (on the quarter-chord line), m aft of the datum.
    pub x_m: f64,
    /// z of the control point, m.
    pub z_m: f64,
    /// Chord at the control point (streamwise), m.
    pub chord_m: f64,
    /// Projected spanwise width of the segment (y extent), m.
    pub dy_m: f64,
    /// Width of the segment normal to the x axis (in the y-z plane), m.
    pub width_m: f64,
    /// Surface incidence plus twist, rad (leading edge up positive).
    pub geometric_angle_rad: f64,
    /// Vertical component of the station's unit normal (cos of the local dihedral).
    pub normal_z: f64,
    /// Spanwise position in percent of the surface's semispan (0 root, 100 tip).
    pub percent_semispan: f64,
    /// Section model at the control point (blend of the panel's end airfoils).
    pub section: SectionModel,
    /// Share of the segment's span covered by the surface's pitch control (0 to 1).
    pub control_share: f64,
    pub(crate) node_a: Vec3,
    pub(crate) node_b: Vec3,
    pub(crate) control: Vec3,
    pub(crate) normal: Vec3,
    /// Leading-edge points at the strip's two side edges (port-side edge first), m.
    pub(crate) le_a: Vec3,
    pub(crate) le_b: Vec3,
    /// Streamwise chords at the two side edges, m.
    pub(crate) chord_a_m: f64,
    pub(crate) chord_b_m: f64,
    /// Where the control point lies between the side edges (0 at `node_a`, 1 at `node_b`).
    pub(crate) control_t: f64,
}

/// What the system knows about one surface.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct SurfaceInfo {
    pub name: String,
    pub range: Range<usize>,
    pub area_m2: f64,
    pub aspect_ratio: f64,
    pub elevator: Option<ElevatorEffect>,
}

/// Angle of attack and controls for one solve.
#[derive(Debug, Clone, PartialEq)]
pub struct FlightCondition {
    /// Angle of attack of the body x axis to the free stream, rad (nose up positive).
    pub alpha_rad: f64,
    /// Elevator deflection, rad (trailing edge down positive).
    pub elevator_rad: f64,
    /// Change of each surface's incidence from its geometry, rad (one entry per surface).
    pub incidence_change_rad: Vec<f64>,
}

impl FlightCondition {
    /// Angle of attack `alpha_rad` with no elevator and no incidence change, for a system of
    /// `surface_count` surfaces.
    pub fn new(alpha_rad: f64, surface_count: usize) -> Self {
        FlightCondition {
            alpha_rad,
            elevator_rad: 0.0,
            incidence_change_rad: vec![0.0; surface_count],
        }
    }
}

/// How a solution was obtained.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum SolveStatus {
    /// Every station inside its cl limits: the superposed linear solution is exact.
    Linear,
    /// Some station at a cl limit: Newton's method converged.
    Converged {
        /// Newton iterations taken.
        iterations: usize,
        /// Largest absolute residual at the end, m (circulation / speed).
        residual_m: f64,
    },
}

/// Index of the unit solutions (columns of the unit matrix).
pub(super) const UNIT_CONSTANT: usize = 0;
pub(super) const UNIT_ALPHA: usize = 1;
pub(super) const UNIT_ELEVATOR: usize = 2;
pub(super) const UNIT_FIRST_INCIDENCE: usize = 3;

/// Per surface and unit solution: lift and moment building blocks (on the reference area).
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub(crate) struct UnitSums {
    /// C_L contribution.
    pub cl: f64,
    /// -sum 2 Gamma dy x / (S c): lift moment about x = 0, times cos(alpha).
    pub mx: f64,
    /// -sum 2 Gamma dy z / (S c): lift moment about z = 0, times sin(alpha).
    pub mz: f64,
    /// Section moments about the quarter chord (cm_ac and the ac offset).
    pub sec: f64,
}

impl UnitSums {
    pub(crate) fn cm(&self, alpha_rad: f64, x_ref_m: f64, z_ref_m: f64, mac_m: f64) -> f64 {
        alpha_rad.cos() * (self.mx + x_ref_m * self.cl / mac_m)
            + alpha_rad.sin() * (self.mz + z_ref_m * self.cl / mac_m)
            + self.sec
    }

    pub(super) fn dcm_dalpha_partial(
        &self,
        alpha_rad: f64,
        x_ref_m: f64,
        z_ref_m: f64,
        mac_m: f64,
    ) -> f64 {
        -alpha_rad.sin() * (self.mx + x_ref_m * self.cl / mac_m)
            + alpha_rad.cos() * (self.mz + z_ref_m * self.cl / mac_m)
    }

    pub(super) fn add_scaled(&mut self, other: &UnitSums, k: f64) {
        self.cl += k * other.cl;
        self.mx += k * other.mx;
        self.mz += k * other.mz;
        self.sec += k * other.sec;
    }
}

/// The discretised aircraft with its factored influence system and unit solutions.
#[derive(Debug, Clone)]
pub struct MultiSurfaceSystem {
    pub(super) stations: Vec<Station>,
    pub(super) surfaces: Vec<SurfaceInfo>,
    pub(super) reference: Reference,
    options: LiftingLineOptions,
    /// A_ij: induced angle at strip i per unit circulation (/ speed) of strip j: the normal
    /// velocity of horseshoe j for the lifting line, the condensed lattice's effective
    /// induced angle for the vortex lattice.
    induced: DMatrix<f64>,
    /// Vortex lattice only: x-moment of circulation beyond each strip's own x, per unit
    /// circulation of each strip (the lift's chordwise centre; `None` for the lifting line,
    /// whose lift acts on the quarter-chord line).
    lift_x_offset: Option<DMatrix<f64>>,
    /// Trefftz-plane normal-wash at station i per unit circulation of horseshoe j.
    trefftz: DMatrix<f64>,
    /// Circulation per unit input: columns constant, alpha, elevator, incidence of each surface.
    pub(super) units: DMatrix<f64>,
    /// unit_sums[surface][unit].
    pub(super) unit_sums: Vec<Vec<UnitSums>>,
    /// The factored system folded on the symmetry plane, its representative stations and
    /// each station's representative (for re-solving the constant column cheaply).
    folded_lu: nalgebra::LU<f64, nalgebra::Dyn, nalgebra::Dyn>,
    reps: Vec<usize>,
    rep_of: Vec<usize>,
}

impl MultiSurfaceSystem {
    /// The stations, surface by surface, each from port tip to starboard tip.
    pub fn stations(&self) -> &[Station] {
        &self.stations
    }

    /// Number of surfaces.
    pub fn surface_count(&self) -> usize {
        self.surfaces.len()
    }

    /// Name of surface `index` (as in the model), or `None`.
    pub fn surface_name(&self, index: usize) -> Option<&str> {
        self.surfaces.get(index).map(|s| s.name.as_str())
    }

    /// The reference area, chord and span.
    pub fn reference(&self) -> Reference {
        self.reference
    }

    /// The options the system was built with.
    pub fn options(&self) -> LiftingLineOptions {
        self.options
    }

    /// A condition at `alpha_rad` with neutral controls for this system.
    pub fn condition(&self, alpha_rad: f64) -> FlightCondition {
        FlightCondition::new(alpha_rad, self.surfaces.len())
    }

    pub(crate) fn surfaces(&self) -> &[SurfaceInfo] {
        &self.surfaces
    }

    pub(crate) fn induced(&self) -> &DMatrix<f64> {
        &self.induced
    }

    /// x-moment of circulation beyond each strip's own x for the circulations in the columns
    /// of `gamma` (m^2 per speed); zero for the lifting line.
    pub(crate) fn lift_x_offsets(&self, gamma: &DMatrix<f64>) -> DMatrix<f64> {
        match &self.lift_x_offset {
            Some(p) => p * gamma,
            None => DMatrix::zeros(gamma.nrows(), gamma.ncols()),
        }
    }

    pub(crate) fn trefftz(&self) -> &DMatrix<f64> {
        &self.trefftz
    }

    /// Weights of the unit solutions for `cond`.
    pub(super) fn weights(&self, cond: &FlightCondition) -> Result<Vec<f64>, LiftingLineError> {
        if cond.incidence_change_rad.len() != self.surfaces.len() {
            return Err(LiftingLineError::SurfaceCount {
                what: "incidence_change_rad entries",
                got: cond.incidence_change_rad.len(),
                expected: self.surfaces.len(),
            });
        }
        let mut q = Vec::with_capacity(self.units.ncols());
        q.extend([1.0, cond.alpha_rad, cond.elevator_rad]);
        q.extend(cond.incidence_change_rad.iter().copied());
        for (parameter, v) in [
            ("alpha_rad", cond.alpha_rad),
            ("elevator_rad", cond.elevator_rad),
        ]
        .into_iter()
        .chain(
            cond.incidence_change_rad
                .iter()
                .map(|v| ("incidence_change_rad", *v)),
        ) {
            if !(v.is_finite() && v.abs() < 1.5) {
                return Err(LiftingLineError::InvalidInput {
                    parameter,
                    value: v,
                    range: "finite, |value| < 1.5 rad",
                });
            }
        }
        Ok(q)
    }

    /// Unit-solution sums of one surface combined with weights `q`.
    pub(super) fn combined(&self, surface: usize, q: &[f64]) -> UnitSums {
        let mut out = UnitSums::default();
        for (k, w) in q.iter().enumerate() {
            out.add_scaled(&self.unit_sums[surface][k], *w);
        }
        out
    }

    /// Downwash angle (rad, positive down) at a point `point_m` = [x, y, z] from every horseshoe
    /// of the system with the circulations of `result` (small-angle: minus the vertical induced
    /// velocity over the free-stream speed). The point is treated as lying off every surface,
    /// so the wake core applies (see the module documentation).
    pub fn downwash_at_rad(
        &self,
        result: &LiftingLineResult,
        point_m: [f64; 3],
    ) -> Result<f64, LiftingLineError> {
        if let Some(bad) = point_m.iter().find(|v| !v.is_finite()) {
            return Err(LiftingLineError::InvalidInput {
                parameter: "downwash point_m",
                value: *bad,
                range: "finite",
            });
        }
        if result.stations.len() != self.stations.len() {
            return Err(LiftingLineError::SurfaceCount {
                what: "result stations (result from another system)",
                got: result.stations.len(),
                expected: self.stations.len(),
            });
        }
        let p = Vec3::new(point_m[0], point_m[1], point_m[2]);
        let wake = self.wake_direction();
        let w: f64 = self
            .stations
            .iter()
            .zip(&result.stations)
            .map(|(st, r)| {
                let core = self.options.wake_core_fraction * st.width_m;
                horseshoe_velocity(&p, &st.node_a, &st.node_b, &wake, core, core).z
                    * r.circulation_per_speed_m
            })
            .sum();
        Ok(-w)
    }

    /// Unit vector of the trailing legs.
    pub(crate) fn wake_direction(&self) -> Vec3 {
        Vec3::new(
            self.options.wake_angle_rad.cos(),
            0.0,
            self.options.wake_angle_rad.sin(),
        )
    }

    /// Circulations (divided by speed, m) of the linear model for unit weights `q`, and their
    /// derivative with respect to alpha.
    pub(super) fn linear_circulation(&self, q: &[f64]) -> (DVector<f64>, DVector<f64>) {
        let mut g = DVector::<f64>::zeros(self.stations.len());
        for (k, w) in q.iter().enumerate() {
            g.axpy(*w, &self.units.column(k), 1.0);
        }
        (g, self.units.column(UNIT_ALPHA).into_owned())
    }
}

#[cfg(test)]
pub(crate) mod tests;
