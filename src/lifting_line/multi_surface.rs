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
//! # Swept wings
//! At the root of a swept (or dihedral) wing the bound vortex is kinked, and the velocity the
//! other half's bound vortex induces near the kink grows without bound as the control point
//! approaches it. The discrete solution of a swept wing therefore changes slowly with the
//! number of stations (lift slope about -4 % per doubling at 30 deg sweep, aspect ratio 8),
//! where a straight wing converges to 0.01 %; even a model wing with about 2 deg of
//! quarter-chord sweep at the root drifts by about 0.25 % per doubling from 40 stations per
//! half-span (its neutral point by about 0.2 % of the MAC). Dihedral alone does not do this:
//! an unswept bound vortex induces no normal velocity on the other half. This is a property of the lifting-line model at a
//! kink, not of the solver; the default station count gives lift slopes within about 5 % of
//! the Helmbold-Diederich formula up to 30 deg of sweep (tests/suite/lifting_line_sweep.rs; 16 % high
//! at 45 deg). The loading dips at the kink, so the Trefftz-plane span efficiency of a swept
//! wing comes out low (about 0.57 at 30 deg, aspect ratio 8; the same wing unswept gives 0.94):
//! treat induced drag of strongly swept wings as unreliable. Stations are not clustered at a
//! kinked root unless asked, because clustering strengthens the dependence.
//!
//! # Vortex cores
//! The kernels use a Gaussian core (see [`super::vortex`]). Between stations of the same
//! surface its radius is 1 % of the segment width (a Gaussian core leaves neighbours half a
//! width away untouched): it only removes the 0/0 of a bound vortex at its own control point.
//! Seen from another surface, a wake of discrete lines stands for a continuous sheet, and a
//! control point of the tail can fall on or next to one line; there the radius is a fraction
//! ([`LiftingLineOptions::wake_core_fraction`], default 0.25) of the source segment's width
//! (for a trailing leg, shared by two neighbouring horseshoes, the mean of their widths). Any smoothing shifts the downwash inside the sheet by
//! an amount of first order in the core radius (it samples the field slightly off the sheet);
//! with the default, a tail lying in the far wake of an elliptic wing sees 2 C_L/(pi A) within
//! about 3 % (tests/suite/lifting_line_downwash.rs), and the error falls as stations are added.
//! Points off the wake plane by more than a station width are not affected.
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
    /// The wing (surface 0) and, if present, the stabiliser (surface 1) of `aircraft`, on the
    /// wing's reference area, MAC and span. `sections` is indexed by `AirfoilId.0` (parallel to
    /// `aircraft.airfoils`); `elevator` is the pitch control: it goes on the stabiliser when
    /// there is one, otherwise on the wing (elevons).
    pub fn from_aircraft(
        aircraft: &Aircraft,
        sections: &[SectionModel],
        elevator: Option<ElevatorEffect>,
        options: LiftingLineOptions,
    ) -> Result<Self, LiftingLineError> {
        let mut inputs = vec![SurfaceInput {
            surface: &aircraft.wing,
            sections,
            elevator: if aircraft.stabiliser.is_none() {
                elevator
            } else {
                None
            },
        }];
        if let Some(stab) = &aircraft.stabiliser {
            inputs.push(SurfaceInput {
                surface: &stab.surface,
                sections,
                elevator,
            });
        }
        Self::new(&inputs, Reference::of_surface(&aircraft.wing), options)
    }

    /// Build and factor the system for `inputs` (the first is normally the wing).
    pub fn new(
        inputs: &[SurfaceInput<'_>],
        reference: Reference,
        options: LiftingLineOptions,
    ) -> Result<Self, LiftingLineError> {
        check_options(&options, &reference, inputs.len())?;
        check_elevators(inputs)?;
        let (stations, surfaces) = discretise_surfaces(inputs, &options)?;
        let n = stations.len();
        let wake = Vec3::new(
            options.wake_angle_rad.cos(),
            0.0,
            options.wake_angle_rad.sin(),
        );
        // Every surface is the mirror image of itself about y = 0 and its stations run from port
        // tip to starboard tip, so the mirror of station i is start + end - 1 - i, and the
        // influence of horseshoe j at control point i equals that of mirror(j) at mirror(i).
        let mirror = mirror_stations(&stations, &surfaces);
        let (mut induced, trefftz) =
            horseshoe_influences(&stations, &surfaces, &mirror, &options, &wake);
        if induced.iter().any(|v| !v.is_finite()) {
            return Err(LiftingLineError::NonFinite {
                quantity: "influence matrix",
            });
        }
        let lift_x_offset = match options.model {
            WingModel::LiftingLine => None,
            WingModel::VortexLattice => {
                let cores = lattice::Cores {
                    self_fraction: options.self_core_fraction,
                    wake_fraction: options.wake_core_fraction,
                };
                let c =
                    lattice::condense(&stations, &mirror, options.chordwise_panels, &wake, cores)?;
                induced = c.induced;
                Some(c.lift_x_offset)
            }
        };
        let d = DVector::from_iterator(
            n,
            stations
                .iter()
                .map(|s| 0.5 * s.chord_m * s.section.cl_alpha_per_rad),
        );
        let matrix = system_matrix(&induced, &d, &vec![true; n]);
        let rhs = unit_right_hand_sides(&stations, &surfaces, &d);
        let (lu, reps, rep_of, units) = solve_unit_inputs(&matrix, &rhs, &mirror)?;
        let mut system = MultiSurfaceSystem {
            folded_lu: lu,
            reps,
            rep_of,
            stations,
            surfaces,
            reference,
            options,
            induced,
            lift_x_offset,
            trefftz,
            units,
            unit_sums: Vec::new(),
        };
        system.unit_sums = system.compute_unit_sums();
        Ok(system)
    }

    fn compute_unit_sums(&self) -> Vec<Vec<UnitSums>> {
        let s_ref = self.reference.area_m2;
        let c_ref = self.reference.mac_m;
        let offsets = self.lift_x_offsets(&self.units);
        self.surfaces
            .iter()
            .map(|info| {
                (0..self.units.ncols())
                    .map(|k| {
                        let mut sums = UnitSums::default();
                        for i in info.range.clone() {
                            let st = &self.stations[i];
                            let g = self.units[(i, k)];
                            let lift = 2.0 * g * st.dy_m / s_ref;
                            sums.cl += lift;
                            sums.mx -=
                                (lift * st.x_m + 2.0 * offsets[(i, k)] * st.dy_m / s_ref) / c_ref;
                            sums.mz -= lift * st.z_m / c_ref;
                            sums.sec += 2.0 * g * st.chord_m * (0.25 - st.section.x_ac_c) * st.dy_m
                                / (s_ref * c_ref);
                            let c2 = st.chord_m * st.chord_m * st.dy_m / (s_ref * c_ref);
                            if k == UNIT_CONSTANT {
                                sums.sec += c2 * st.section.cm_ac;
                            }
                            if k == UNIT_ELEVATOR {
                                if let Some(e) = info.elevator {
                                    sums.sec += c2 * e.dcm_ac_per_rad_deflection * st.control_share;
                                }
                            }
                        }
                        sums
                    })
                    .collect()
            })
            .collect()
    }

    /// The same system with each station's geometric angle changed by `change_rad(station)`
    /// (a twist or incidence change that leaves the geometry of the vortex system alone: in
    /// this small-angle model twist enters only as a boundary angle). The factored matrix is
    /// reused: only the constant unit solution is solved again. `change_rad` must be mirror
    /// symmetric (it is called with each station, whose `s_m` is negative to port).
    pub fn with_angle_change(
        &self,
        change_rad: impl Fn(&Station) -> f64,
    ) -> Result<MultiSurfaceSystem, LiftingLineError> {
        let mut out = self.clone();
        for st in &mut out.stations {
            let d = change_rad(st);
            if !(d.is_finite() && d.abs() < 1.5) {
                return Err(LiftingLineError::InvalidInput {
                    parameter: "geometric angle change",
                    value: d,
                    range: "finite, |value| < 1.5 rad",
                });
            }
            st.geometric_angle_rad += d;
        }
        let rhs = DVector::from_iterator(
            out.reps.len(),
            out.reps.iter().map(|&i| {
                let st = &out.stations[i];
                0.5 * st.chord_m
                    * st.section.cl_alpha_per_rad
                    * (st.geometric_angle_rad - st.section.alpha_zero_lift_rad)
            }),
        );
        let half = out
            .folded_lu
            .solve(&rhs)
            .ok_or(LiftingLineError::SingularSystem { pivot_ratio: 0.0 })?;
        for (i, r) in out.rep_of.iter().enumerate() {
            out.units[(i, UNIT_CONSTANT)] = half[*r];
        }
        if out.units.iter().any(|v| !v.is_finite()) {
            return Err(LiftingLineError::NonFinite {
                quantity: "re-solved constant unit solution",
            });
        }
        out.unit_sums = out.compute_unit_sums();
        Ok(out)
    }

    /// The same system with each station's section changed by `change(index, station)` = (change
    /// of the zero-lift angle, rad; change of cm about the aerodynamic centre): a camber
    /// flap's effect in Glauert's linear theory. The factored matrix is reused; only the
    /// constant unit solution is solved again. `change` must be mirror symmetric.
    pub fn with_section_change(
        &self,
        change: impl Fn(usize, &Station) -> (f64, f64),
    ) -> Result<MultiSurfaceSystem, LiftingLineError> {
        let mut out = self.clone();
        for (i, st) in out.stations.iter_mut().enumerate() {
            let (d_alpha0, d_cm) = change(i, st);
            if !(d_alpha0.is_finite() && d_alpha0.abs() < 1.0 && d_cm.is_finite()) {
                return Err(LiftingLineError::InvalidInput {
                    parameter: "section change",
                    value: d_alpha0,
                    range: "finite, |zero-lift angle change| < 1 rad",
                });
            }
            st.section.alpha_zero_lift_rad += d_alpha0;
            st.section.cm_ac += d_cm;
        }
        out.with_angle_change(|_| 0.0)
    }

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

    /// Per-station geometric angle and zero-lift angle at the condition's controls.
    fn station_angles(&self, cond: &FlightCondition) -> (DVector<f64>, DVector<f64>) {
        let n = self.stations.len();
        let mut geo = DVector::zeros(n);
        let mut zero = DVector::zeros(n);
        for (i, st) in self.stations.iter().enumerate() {
            geo[i] = st.geometric_angle_rad
                + cond.incidence_change_rad[st.surface]
                + cond.alpha_rad * st.normal_z;
            let de = self.surfaces[st.surface].elevator.map_or(0.0, |e| {
                e.dalpha0_per_rad_deflection * cond.elevator_rad * st.control_share
            });
            zero[i] = st.section.alpha_zero_lift_rad + de;
        }
        (geo, zero)
    }

    /// Solve at `cond`: the superposed linear solution when every station is inside its cl
    /// limits, Newton's method on the flat-top section model otherwise.
    pub fn solve(&self, cond: &FlightCondition) -> Result<LiftingLineResult, LiftingLineError> {
        self.solve_with(cond, &mut NewtonWork::default())
    }

    /// [`Self::solve`] with Newton's work buffers given, for a caller that solves many states
    /// (the same result; the buffers are sized on first use and then reused).
    pub fn solve_with(
        &self,
        cond: &FlightCondition,
        work: &mut NewtonWork,
    ) -> Result<LiftingLineResult, LiftingLineError> {
        let q = self.weights(cond)?;
        let (gamma, tangent) = self.linear_circulation(&q);
        let (geo, zero) = self.station_angles(cond);
        // The superposed linear solution is exact unless a station passes a stall limit or
        // follows a polar's curved lift curve.
        let beyond = self.stations.iter().zip(gamma.iter()).any(|(st, g)| {
            let cl = 2.0 * g / st.chord_m;
            cl > st.section.cl_max || cl < st.section.cl_min || st.section.polar.is_some()
        });
        let (gamma, tangent, status) = if beyond {
            self.newton(gamma, &geo, &zero, work)?
        } else {
            (gamma, tangent, SolveStatus::Linear)
        };
        results::assemble(self, cond, &gamma, &tangent, &geo, status)
    }

    /// Newton's method on R(Gamma) = Gamma - (c/2) cl(alpha(Gamma)) with each station's lift
    /// curve ([`SectionModel::lift_point`]: the flat-top linear curve, or a viscous polar's).
    /// Every iteration works in the buffers of `work` (sized on first use), so the iterations
    /// and their backtracking allocate nothing.
    fn newton(
        &self,
        mut gamma: DVector<f64>,
        geo: &DVector<f64>,
        zero: &DVector<f64>,
        work: &mut NewtonWork,
    ) -> Result<(DVector<f64>, DVector<f64>, SolveStatus), LiftingLineError> {
        let n = self.stations.len();
        work.size_for(n);
        let NewtonWork {
            alpha,
            now,
            trial_eval,
            trial,
            jacobian,
            lu,
            step,
            rhs,
            product,
            pivots,
        } = work;
        let scale = gamma.amax().max(1e-9);
        let tol = self.options.newton_relative_tolerance * scale;
        self.newton_eval(&gamma, geo, zero, alpha, now);
        let mut res = now.r.amax();
        let mut iterations = 0;
        while res > tol {
            if iterations >= self.options.max_newton_iterations {
                return Err(LiftingLineError::NotConverged {
                    iterations,
                    residual: res,
                });
            }
            iterations += 1;
            system_matrix_into(&self.induced, &now.d, &now.active, jacobian);
            lu.factor(jacobian);
            pivots.clear();
            pivots.extend(lu.pivots());
            check_pivots(pivots)?;
            rhs.zip_apply(&now.r, |b, r| *b = -r);
            step.copy_from(rhs);
            if !lu.solve_in_place(step) {
                return Err(LiftingLineError::SingularSystem { pivot_ratio: 0.0 });
            }
            check_vector_residual_into(jacobian, step, rhs, product)?;
            // Backtracking: the residual is piecewise linear, a full step is normally exact.
            let mut lambda = 1.0;
            loop {
                trial.zip_zip_apply(&gamma, step, |t, g, s| *t = g + s * lambda);
                self.newton_eval(trial, geo, zero, alpha, trial_eval);
                let res_t = trial_eval.r.amax();
                if res_t < res || lambda < 1e-3 {
                    std::mem::swap(&mut gamma, trial);
                    std::mem::swap(now, trial_eval);
                    res = res_t;
                    break;
                }
                lambda *= 0.5;
            }
            if !res.is_finite() {
                return Err(LiftingLineError::NonFinite {
                    quantity: "Newton residual",
                });
            }
        }
        // Tangent d Gamma / d alpha at the solution: J t = d n_z on active rows.
        system_matrix_into(&self.induced, &now.d, &now.active, jacobian);
        for (i, s) in self.stations.iter().enumerate() {
            rhs[i] = if now.active[i] {
                now.d[i] * s.normal_z
            } else {
                0.0
            };
        }
        lu.factor(jacobian);
        pivots.clear();
        pivots.extend(lu.pivots());
        check_pivots(pivots)?;
        let mut tangent = rhs.clone();
        if !lu.solve_in_place(&mut tangent) {
            return Err(LiftingLineError::SingularSystem { pivot_ratio: 0.0 });
        }
        check_vector_residual_into(jacobian, &tangent, rhs, product)?;
        Ok((
            gamma,
            tangent,
            SolveStatus::Converged {
                iterations,
                residual_m: res,
            },
        ))
    }

    /// Newton's residual at circulations `g`: the section angles (into `alpha`), and into
    /// `out` the residual, which rows are on the attached part of their lift curve, and each
    /// row's (c/2) dcl/dalpha there (the Jacobian's diagonal factor).
    fn newton_eval(
        &self,
        g: &DVector<f64>,
        geo: &DVector<f64>,
        zero: &DVector<f64>,
        alpha: &mut DVector<f64>,
        out: &mut NewtonRows,
    ) {
        self.induced.mul_to(g, alpha);
        *alpha += geo;
        for (i, st) in self.stations.iter().enumerate() {
            let shift = zero[i] - st.section.alpha_zero_lift_rad;
            let lp = st.section.lift_point(alpha[i], shift);
            out.active[i] = lp.attached;
            out.d[i] = 0.5 * st.chord_m * lp.slope_per_rad;
            out.r[i] = g[i] - 0.5 * st.chord_m * lp.cl;
        }
    }
}

/// Newton's residual rows at one set of circulations.
#[derive(Debug, Clone, Default)]
struct NewtonRows {
    /// Residual Gamma - (c/2) cl, m.
    r: DVector<f64>,
    /// True on rows on the attached part of their lift curve.
    active: Vec<bool>,
    /// (c/2) dcl/dalpha, m per rad.
    d: DVector<f64>,
}

/// Work buffers of Newton's method on the stalled system (see [`MultiSurfaceSystem::solve_with`]):
/// made once, reused by every iteration and every solve given them.
#[derive(Debug, Clone, Default)]
pub struct NewtonWork {
    alpha: DVector<f64>,
    now: NewtonRows,
    trial_eval: NewtonRows,
    trial: DVector<f64>,
    jacobian: DMatrix<f64>,
    lu: LuWork,
    step: DVector<f64>,
    rhs: DVector<f64>,
    product: DVector<f64>,
    pivots: Vec<f64>,
}

impl NewtonWork {
    /// Size every buffer for `n` stations (nothing is allocated when they already are).
    fn size_for(&mut self, n: usize) {
        if self.alpha.len() == n && self.jacobian.nrows() == n {
            return;
        }
        let rows = || NewtonRows {
            r: DVector::zeros(n),
            active: vec![true; n],
            d: DVector::zeros(n),
        };
        *self = NewtonWork {
            alpha: DVector::zeros(n),
            now: rows(),
            trial_eval: rows(),
            trial: DVector::zeros(n),
            jacobian: DMatrix::zeros(n, n),
            lu: LuWork::new(n),
            step: DVector::zeros(n),
            rhs: DVector::zeros(n),
            product: DVector::zeros(n),
            pivots: Vec::with_capacity(n),
        };
    }
}

/// Refuse an elevator with non-finite effects or span fractions outside
/// 0 <= inboard < outboard <= 1.
fn check_elevators(inputs: &[SurfaceInput<'_>]) -> Result<(), LiftingLineError> {
    for e in inputs.iter().filter_map(|i| i.elevator) {
        let ok = e.dalpha0_per_rad_deflection.is_finite()
            && e.dcm_ac_per_rad_deflection.is_finite()
            && (0.0..1.0).contains(&e.inboard_fraction)
            && e.outboard_fraction > e.inboard_fraction
            && e.outboard_fraction <= 1.0;
        if !ok {
            return Err(LiftingLineError::InvalidInput {
                parameter: "elevator span fractions",
                value: e.outboard_fraction - e.inboard_fraction,
                range: "finite effects, 0 <= inboard < outboard <= 1",
            });
        }
    }
    Ok(())
}

/// Cut every surface into its stations (in input order) and describe each surface: name, range
/// of stations, area, aspect ratio and elevator.
fn discretise_surfaces(
    inputs: &[SurfaceInput<'_>],
    options: &LiftingLineOptions,
) -> Result<(Vec<Station>, Vec<SurfaceInfo>), LiftingLineError> {
    let mut stations = Vec::new();
    let mut surfaces = Vec::with_capacity(inputs.len());
    for (index, input) in inputs.iter().enumerate() {
        let start = stations.len();
        let per_half = strips_per_half(options, input.surface, inputs[0].surface);
        discretise(input, index, options, per_half, &mut stations)?;
        let g = planform::geometry(input.surface);
        surfaces.push(SurfaceInfo {
            name: input.surface.name.clone(),
            range: start..stations.len(),
            area_m2: g.area_m2,
            aspect_ratio: g.aspect_ratio,
            elevator: input.elevator,
        });
    }
    Ok((stations, surfaces))
}

/// The mirror image about y = 0 of every station: `start + end - 1 - i` on its own surface.
fn mirror_stations(stations: &[Station], surfaces: &[SurfaceInfo]) -> Vec<usize> {
    stations
        .iter()
        .enumerate()
        .map(|(i, st)| {
            let r = &surfaces[st.surface].range;
            r.start + r.end - 1 - i
        })
        .collect()
}

/// The horseshoe influence matrices (normal velocity at each control point per unit
/// circulation, and its Trefftz-plane counterpart) with the wake leaving along `wake`.
/// Rows of the starboard half (and a centre station) are computed, the others copied from
/// their mirror images: half the kernel evaluations, which dominate the build.
fn horseshoe_influences(
    stations: &[Station],
    surfaces: &[SurfaceInfo],
    mirror: &[usize],
    options: &LiftingLineOptions,
    wake: &Vec3,
) -> (DMatrix<f64>, DMatrix<f64>) {
    let n = stations.len();
    let mut induced = DMatrix::<f64>::zeros(n, n);
    let mut trefftz = DMatrix::<f64>::zeros(n, n);
    // Trailing legs are shared: the outboard leg of one horseshoe is the inboard leg of the
    // next (with opposite sign), so each node's leg is evaluated once per control point. A
    // leg's core uses the mean width of the segments that share it.
    let nodes = trailing_nodes(stations, surfaces);
    let mut legs = vec![Vec3::zeros(); nodes.len()];
    let mut lines = vec![Vec3::zeros(); nodes.len()];
    for (i, si) in stations.iter().enumerate() {
        if mirror[i] < i {
            continue;
        }
        let fraction = |surface: usize| {
            if surface == si.surface {
                options.self_core_fraction
            } else {
                options.wake_core_fraction
            }
        };
        for (k, node) in nodes.iter().enumerate() {
            let core = fraction(node.surface) * node.width_m;
            legs[k] = semi_infinite_velocity(&si.control, &node.point, wake, core);
            lines[k] = trefftz_line_velocity(&si.control, &node.point, wake, core);
        }
        let normal_t = trefftz_normal(si, wake);
        for (j, sj) in stations.iter().enumerate() {
            let core = fraction(sj.surface) * sj.width_m;
            let (ka, kb) = (j + sj.surface, j + sj.surface + 1);
            let v =
                segment_velocity(&si.control, &sj.node_a, &sj.node_b, core) + legs[kb] - legs[ka];
            let vt = lines[kb] - lines[ka];
            let (a, t) = (v.dot(&si.normal), vt.dot(&normal_t));
            induced[(i, j)] = a;
            trefftz[(i, j)] = t;
            induced[(mirror[i], mirror[j])] = a;
            trefftz[(mirror[i], mirror[j])] = t;
        }
    }
    (induced, trefftz)
}

/// The right-hand sides of the unit solutions, one column each: the constant part, alpha,
/// pitch control and each surface's incidence, scaled by the section factor `d` (c/2 times
/// the lift slope).
fn unit_right_hand_sides(
    stations: &[Station],
    surfaces: &[SurfaceInfo],
    d: &DVector<f64>,
) -> DMatrix<f64> {
    let n = stations.len();
    let unit_count = UNIT_FIRST_INCIDENCE + surfaces.len();
    let mut rhs = DMatrix::<f64>::zeros(n, unit_count);
    for (i, st) in stations.iter().enumerate() {
        rhs[(i, UNIT_CONSTANT)] = d[i] * (st.geometric_angle_rad - st.section.alpha_zero_lift_rad);
        rhs[(i, UNIT_ALPHA)] = d[i] * st.normal_z;
        if let Some(e) = surfaces[st.surface].elevator {
            rhs[(i, UNIT_ELEVATOR)] = -d[i] * e.dalpha0_per_rad_deflection * st.control_share;
        }
        rhs[(i, UNIT_FIRST_INCIDENCE + st.surface)] = d[i];
    }
    rhs
}

/// The factored folded system, the representative stations, each station's representative
/// and the unit solutions of `matrix` for `rhs`, checked by their residual.
#[allow(clippy::type_complexity)]
fn solve_unit_inputs(
    matrix: &DMatrix<f64>,
    rhs: &DMatrix<f64>,
    mirror: &[usize],
) -> Result<
    (
        nalgebra::LU<f64, nalgebra::Dyn, nalgebra::Dyn>,
        Vec<usize>,
        Vec<usize>,
        DMatrix<f64>,
    ),
    LiftingLineError,
> {
    let n = matrix.nrows();
    // Every unit input is symmetric (alpha, elevator, incidences), so every unit solution
    // is: solve for the starboard half (and any centre station) with the port columns
    // folded onto their mirror images, an LU of half the size (an eighth of the work), then
    // copy. The residual is checked on the full system, which also confirms the symmetry.
    let reps: Vec<usize> = (0..n).filter(|&i| mirror[i] >= i).collect();
    let mut rep_of = vec![0; n];
    for (r, &i) in reps.iter().enumerate() {
        rep_of[i] = r;
        rep_of[mirror[i]] = r;
    }
    let m = reps.len();
    let mut folded = DMatrix::<f64>::zeros(m, m);
    for j in 0..n {
        for (r, &i) in reps.iter().enumerate() {
            folded[(r, rep_of[j])] += matrix[(i, j)];
        }
    }
    let folded_rhs = rhs.select_rows(reps.iter());
    let lu = folded.lu();
    check_pivots(lu.u().diagonal().as_slice())?;
    let half = lu
        .solve(&folded_rhs)
        .ok_or(LiftingLineError::SingularSystem { pivot_ratio: 0.0 })?;
    let units = half.select_rows(rep_of.iter());
    check_residual(matrix, &units, rhs)?;
    Ok((lu, reps, rep_of, units))
}

/// The start point of one trailing leg (a node of the discretisation).
struct TrailingNode {
    point: Vec3,
    surface: usize,
    /// Mean width of the segments that share the node, m.
    width_m: f64,
}

/// The nodes of every surface, port tip to starboard tip: surface s has its stations' nodes
/// at indices range.start + s ..= range.end + s, so station j has nodes j + s and j + s + 1.
fn trailing_nodes(stations: &[Station], surfaces: &[SurfaceInfo]) -> Vec<TrailingNode> {
    let mut nodes = Vec::with_capacity(stations.len() + surfaces.len());
    for (s, info) in surfaces.iter().enumerate() {
        for j in info.range.clone() {
            let st = &stations[j];
            let width_m = if j > info.range.start {
                0.5 * (st.width_m + stations[j - 1].width_m)
            } else {
                st.width_m
            };
            nodes.push(TrailingNode {
                point: st.node_a,
                surface: s,
                width_m,
            });
        }
        if let Some(last) = info.range.clone().last() {
            nodes.push(TrailingNode {
                point: stations[last].node_b,
                surface: s,
                width_m: stations[last].width_m,
            });
        }
    }
    nodes
}

/// J = I - diag(d_active) A, with d zero on inactive (stalled) rows, written into `out`
/// (already n x n).
fn system_matrix_into(
    induced: &DMatrix<f64>,
    d: &DVector<f64>,
    active: &[bool],
    out: &mut DMatrix<f64>,
) {
    let n = induced.nrows();
    out.fill_with_identity();
    // Column by column (the storage order); each entry is computed as before.
    for j in 0..n {
        for i in 0..n {
            if active[i] {
                out[(i, j)] -= d[i] * induced[(i, j)];
            }
        }
    }
}

/// J = I - diag(d_active) A, with d zero on inactive (stalled) rows.
fn system_matrix(induced: &DMatrix<f64>, d: &DVector<f64>, active: &[bool]) -> DMatrix<f64> {
    let n = induced.nrows();
    let mut m = DMatrix::<f64>::zeros(n, n);
    system_matrix_into(induced, d, active, &mut m);
    m
}

/// Unit normal of a station's bound segment in the Trefftz plane (normal to the wake).
fn trefftz_normal(st: &Station, wake: &Vec3) -> Vec3 {
    let dl = st.node_b - st.node_a;
    let proj = dl - wake * wake.dot(&dl);
    let n = wake.cross(&proj);
    let len = n.norm();
    if len > 0.0 {
        n / len
    } else {
        st.normal
    }
}

/// Length of a station's bound segment projected on the Trefftz plane, m.
pub(crate) fn trefftz_width_m(st: &Station, wake: &Vec3) -> f64 {
    let dl = st.node_b - st.node_a;
    (dl - wake * wake.dot(&dl)).norm()
}

fn check_options(
    o: &LiftingLineOptions,
    r: &Reference,
    surface_count: usize,
) -> Result<(), LiftingLineError> {
    let invalid = |parameter, value, range| {
        Err(LiftingLineError::InvalidInput {
            parameter,
            value,
            range,
        })
    };
    if !(2..=500).contains(&o.stations_per_half_span) {
        return invalid(
            "stations_per_half_span",
            o.stations_per_half_span as f64,
            "2 to 500",
        );
    }
    if !(1..=40).contains(&o.chordwise_panels) {
        return invalid("chordwise_panels", o.chordwise_panels as f64, "1 to 40");
    }
    if !(o.wake_angle_rad.is_finite() && o.wake_angle_rad.abs() < 1.5) {
        return invalid("wake_angle_rad", o.wake_angle_rad, "|angle| < 1.5 rad");
    }
    if !(o.self_core_fraction.is_finite() && o.self_core_fraction > 0.0) {
        return invalid("self_core_fraction", o.self_core_fraction, "finite and > 0");
    }
    if !(o.wake_core_fraction.is_finite() && o.wake_core_fraction > 0.0) {
        return invalid("wake_core_fraction", o.wake_core_fraction, "finite and > 0");
    }
    if !(o.newton_relative_tolerance.is_finite() && o.newton_relative_tolerance > 0.0) {
        return invalid(
            "newton_relative_tolerance",
            o.newton_relative_tolerance,
            "finite and > 0",
        );
    }
    for (parameter, value) in [
        ("reference area_m2", r.area_m2),
        ("reference mac_m", r.mac_m),
        ("reference span_m", r.span_m),
    ] {
        if !(value.is_finite() && value > 0.0) {
            return invalid(parameter, value, "finite and > 0");
        }
    }
    if surface_count == 0 {
        return Err(LiftingLineError::SurfaceCount {
            what: "surfaces given",
            got: 0,
            expected: 1,
        });
    }
    Ok(())
}

/// Quarter-chord point at signed in-plane distance `s` (negative to port).
fn quarter_chord_point(surface: &Surface, s: f64) -> Vec3 {
    let st = station_at(surface, s.abs());
    let sign = if s < 0.0 { -1.0 } else { 1.0 };
    Vec3::new(st.x_le_m + 0.25 * st.chord_m, sign * st.y_m, st.z_m)
}

/// Strips per half-span of `surface`. The lifting line gives every surface the same count
/// (its tail stations then line up with the wing's trailing legs, see the module
/// documentation). The vortex lattice keeps the strip width of the first surface (normally
/// the wing) on the others, with at least 8 strips (or the requested count, if smaller):
/// a tail of a third of the wing's span then costs a third of the panels, and the lattice
/// has no line vortices to line up.
fn strips_per_half(options: &LiftingLineOptions, surface: &Surface, first: &Surface) -> usize {
    let n = options.stations_per_half_span;
    match options.model {
        WingModel::LiftingLine => n,
        WingModel::VortexLattice => {
            let ratio = half_span_length_m(surface) / half_span_length_m(first);
            let scaled = (n as f64 * ratio).round();
            if scaled.is_finite() {
                (scaled as usize).clamp(n.min(8), n)
            } else {
                n
            }
        }
    }
}

/// Leading-edge point and streamwise chord at signed in-plane distance `s` (negative to port).
fn leading_edge_point(surface: &Surface, s: f64) -> (Vec3, f64) {
    let st = station_at(surface, s.abs());
    let sign = if s < 0.0 { -1.0 } else { 1.0 };
    (Vec3::new(st.x_le_m, sign * st.y_m, st.z_m), st.chord_m)
}

/// True when the quarter-chord line has a kink at the root (sweep or dihedral there).
fn root_is_kinked(surface: &Surface) -> bool {
    let total = half_span_length_m(surface);
    let eps = 1e-6 * total;
    let d = quarter_chord_point(surface, eps) - quarter_chord_point(surface, 0.0);
    let len = d.norm();
    len > 0.0 && (d.x.abs() + d.z.abs()) / len > 1e-9
}

/// The segments of one surface, port tip to starboard tip, as (start, end, control point) in
/// the signed in-plane span coordinate, m. Nodes follow a cosine distribution over the whole
/// span (clustered at the tips), or over each half when the root is kinked and is to be
/// clustered at. Interior break points (panel joints, control ends) are not clustered at: the
/// nearest node is moved onto each, because stations crowded against a kink of the bound
/// vortex line (a change of dihedral or sweep at a joint) pick up a spurious local peak of
/// lift that would be taken for the start of the stall. Control points sit at the cosine
/// parameter's midpoint of each segment. Built for the starboard half and mirrored, so the
/// layout is exactly symmetric.
fn segments(
    total: f64,
    half_breaks: &[f64],
    split_at_root: bool,
    per_half: usize,
    uniform: bool,
) -> Vec<(f64, f64, f64)> {
    use std::f64::consts::PI;
    // Cosine map of the starboard half: parameter t to span s, and back.
    let (t0, m) = if split_at_root {
        (0.0, per_half.max(2))
    } else {
        (0.5, per_half.max(1))
    };
    let at = |t: f64| match (uniform, split_at_root) {
        (true, true) => total * t,
        (true, false) => total * (2.0 * t - 1.0),
        (false, true) => total * 0.5 * (1.0 - (PI * t).cos()),
        (false, false) => -total * (PI * t).cos(),
    };
    let param = |s: f64| match (uniform, split_at_root) {
        (true, true) => (s / total).clamp(0.0, 1.0),
        (true, false) => (0.5 * (s / total + 1.0)).clamp(0.5, 1.0),
        (false, true) => (1.0 - 2.0 * s / total).clamp(-1.0, 1.0).acos() / PI,
        (false, false) => (-s / total).clamp(-1.0, 1.0).acos() / PI,
    };
    let mut nodes: Vec<f64> = (0..=m)
        .map(|k| at(t0 + (1.0 - t0) * k as f64 / m as f64))
        .collect();
    nodes[0] = 0.0;
    nodes[m] = total;
    let mut fixed = vec![false; m + 1];
    fixed[0] = true;
    fixed[m] = true;
    let mut extra = Vec::new();
    for &b in half_breaks.iter().filter(|b| **b < total * (1.0 - 1e-9)) {
        let nearest = (1..m).min_by(|&i, &j| (nodes[i] - b).abs().total_cmp(&(nodes[j] - b).abs()));
        match nearest {
            Some(k) if !fixed[k] => {
                nodes[k] = b;
                fixed[k] = true;
            }
            _ => extra.push(b),
        }
    }
    nodes.extend(extra);
    nodes.sort_by(f64::total_cmp);
    nodes.dedup_by(|a, b| (*a - *b).abs() <= 1e-9 * total);
    let starboard: Vec<(f64, f64, f64)> = nodes
        .windows(2)
        .map(|w| (w[0], w[1], at(0.5 * (param(w[0]) + param(w[1])))))
        .collect();
    starboard
        .iter()
        .rev()
        .map(|&(a, b, c)| (-b, -a, -c))
        .chain(starboard.iter().copied())
        .collect()
}

/// Append the stations of one surface, port tip to starboard tip.
fn discretise(
    input: &SurfaceInput<'_>,
    surface_index: usize,
    options: &LiftingLineOptions,
    per_half: usize,
    out: &mut Vec<Station>,
) -> Result<(), LiftingLineError> {
    let surface = input.surface;
    let total = half_span_length_m(surface);
    if !(total.is_finite() && total > 0.0) {
        return Err(LiftingLineError::InvalidInput {
            parameter: "half-span length_m",
            value: total,
            range: "finite and > 0",
        });
    }
    check_section_ids(input)?;
    let half_breaks = station_break_points_m(input, total);
    let semispan_y = station_at(surface, total).y_m;
    let cluster = match options.model {
        WingModel::LiftingLine => options.cluster_at_kinked_root,
        WingModel::VortexLattice => true,
    };
    let split_at_root = cluster && root_is_kinked(surface);
    for segment in segments(
        total,
        &half_breaks,
        split_at_root,
        per_half,
        options.uniform_spacing,
    ) {
        out.push(strip_station(
            input,
            surface_index,
            total,
            semispan_y,
            segment,
        )?);
    }
    Ok(())
}

/// Refuse a surface whose panels name an airfoil index beyond the section models given.
fn check_section_ids(input: &SurfaceInput<'_>) -> Result<(), LiftingLineError> {
    let surface = input.surface;
    let check_id = |index: usize| {
        if index < input.sections.len() {
            Ok(())
        } else {
            Err(LiftingLineError::MissingSection {
                surface: surface.name.clone(),
                index,
                available: input.sections.len(),
            })
        }
    };
    match &surface.shape {
        SurfaceShape::Panels(panels) => {
            for p in panels {
                check_id(p.root_airfoil.0)?;
                check_id(p.tip_airfoil.0)?;
            }
        }
        SurfaceShape::Elliptic(e) => {
            check_id(e.root_airfoil.0)?;
            check_id(e.tip_airfoil.0)?;
        }
    }
    Ok(())
}

/// The break points of one half of the surface along its span line, m (`total_m` its length):
/// panel joints and the ends of a part-span control, sorted.
fn station_break_points_m(input: &SurfaceInput<'_>, total_m: f64) -> Vec<f64> {
    let surface = input.surface;
    // Signed break points, port tip to starboard tip.
    let half_breaks: Vec<f64> = break_points_m(surface)
        .into_iter()
        .filter(|b| *b > 1e-12 * total_m)
        .collect();
    // The ends of a part-span control are break points too, so that no segment straddles one.
    let mut half_breaks = half_breaks;
    if let Some(e) = &input.elevator {
        for f in [e.inboard_fraction, e.outboard_fraction] {
            let s = f * total_m;
            if s > 1e-9 * total_m
                && s < (1.0 - 1e-9) * total_m
                && half_breaks.iter().all(|b| (b - s).abs() > 1e-6 * total_m)
            {
                half_breaks.push(s);
            }
        }
        half_breaks.sort_by(f64::total_cmp);
    }
    half_breaks
}

/// The station of one strip of the surface, from the strip's ends `s0`, `s1` and control point
/// `s_cp` along the span line (m, negative to port); `total` is the half-span length and
/// `semispan_y` the tip's y, m.
fn strip_station(
    input: &SurfaceInput<'_>,
    surface_index: usize,
    total: f64,
    semispan_y: f64,
    (s0, s1, s_cp): (f64, f64, f64),
) -> Result<Station, LiftingLineError> {
    let surface = input.surface;
    let a = quarter_chord_point(surface, s0);
    let b = quarter_chord_point(surface, s1);
    let (le_a, chord_a_m) = leading_edge_point(surface, s0);
    let (le_b, chord_b_m) = leading_edge_point(surface, s1);
    let t = (s_cp - s0) / (s1 - s0);
    let control = a + (b - a) * t;
    let st = station_at(surface, s_cp.abs());
    let dl = b - a;
    let width_m = (dl.y * dl.y + dl.z * dl.z).sqrt();
    if !(width_m > 0.0 && st.chord_m > 0.0 && dl.y > 0.0) {
        return Err(LiftingLineError::InvalidInput {
            parameter: "station chord_m or width_m",
            value: st.chord_m.min(width_m),
            range: "> 0 at every control point (surface must have area and span)",
        });
    }
    let normal = Vec3::new(0.0, -dl.z, dl.y) / width_m;
    let control_share = input.elevator.map_or(0.0, |e| {
        let (lo, hi) = (s0.abs().min(s1.abs()), s0.abs().max(s1.abs()));
        let covered =
            (hi.min(e.outboard_fraction * total) - lo.max(e.inboard_fraction * total)).max(0.0);
        (covered / (hi - lo)).clamp(0.0, 1.0)
    });
    let section = input.sections[st.airfoil_inboard.0]
        .blend(&input.sections[st.airfoil_outboard.0], st.airfoil_weight);
    if !(section.cl_alpha_per_rad.is_finite() && section.cl_alpha_per_rad > 0.0) {
        return Err(LiftingLineError::InvalidInput {
            parameter: "section cl_alpha_per_rad",
            value: section.cl_alpha_per_rad,
            range: "finite and > 0",
        });
    }
    Ok(Station {
        surface: surface_index,
        s_m: s_cp,
        y_m: control.y,
        x_m: control.x,
        z_m: control.z,
        chord_m: st.chord_m,
        dy_m: dl.y,
        width_m,
        geometric_angle_rad: surface.incidence_rad + st.twist_rad,
        normal_z: normal.z,
        percent_semispan: 100.0 * control.y.abs() / semispan_y,
        section,
        control_share,
        node_a: a,
        node_b: b,
        control,
        normal,
        le_a,
        le_b,
        chord_a_m,
        chord_b_m,
        control_t: t,
    })
}

#[cfg(test)]
pub(crate) mod tests {
    use super::*;
    use crate::model::{AirfoilId, Panel, SectionMethod};
    use crate::section::ClMaxSource;
    use approx::assert_relative_eq;

    pub(crate) fn plate(cl_max: f64) -> SectionModel {
        SectionModel {
            method: SectionMethod::Thin,
            alpha_zero_lift_rad: -0.03,
            cl_alpha_per_rad: 2.0 * std::f64::consts::PI,
            cm_ac: -0.05,
            x_ac_c: 0.25,
            cl_max,
            cl_min: -cl_max,
            cl_max_source: ClMaxSource::Given,
            reynolds_number: None,
            polar: None,
        }
    }

    pub(crate) fn trapezoid(name: &str, x: f64, z: f64, span: f64, cr: f64, ct: f64) -> Surface {
        Surface {
            name: name.into(),
            root_le_x_m: x,
            root_le_z_m: z,
            incidence_rad: 0.0,
            shape: SurfaceShape::Panels(vec![Panel {
                span_m: span,
                root_chord_m: cr,
                tip_chord_m: ct,
                sweep_le_rad: 0.05,
                dihedral_rad: 0.04,
                tip_twist_rad: -0.03,
                root_airfoil: AirfoilId(0),
                tip_airfoil: AirfoilId(0),
            }]),
        }
    }

    pub(crate) fn wing_and_tail(sections: &[SectionModel]) -> MultiSurfaceSystem {
        let wing = trapezoid("wing", 0.0, 0.0, 1.0, 0.25, 0.15);
        let tail = trapezoid("tail", 0.8, 0.1, 0.3, 0.12, 0.08);
        let elevator = ElevatorEffect::full_span(-0.6, -0.6);
        let inputs = [
            SurfaceInput {
                surface: &wing,
                sections,
                elevator: None,
            },
            SurfaceInput {
                surface: &tail,
                sections,
                elevator: Some(elevator),
            },
        ];
        let options = LiftingLineOptions {
            stations_per_half_span: 12,
            ..LiftingLineOptions::default()
        };
        MultiSurfaceSystem::new(&inputs, Reference::of_surface(&wing), options).unwrap()
    }

    #[test]
    fn bad_inputs_are_typed_errors() {
        let sections = [plate(1.2)];
        let wing = trapezoid("wing", 0.0, 0.0, 1.0, 0.25, 0.15);
        let input = [SurfaceInput {
            surface: &wing,
            sections: &[],
            elevator: None,
        }];
        let reference = Reference::of_surface(&wing);
        let err = MultiSurfaceSystem::new(&input, reference, LiftingLineOptions::default());
        assert!(matches!(
            err,
            Err(LiftingLineError::MissingSection { index: 0, .. })
        ));
        let input = [SurfaceInput {
            surface: &wing,
            sections: &sections,
            elevator: None,
        }];
        let options = LiftingLineOptions {
            stations_per_half_span: 1,
            ..LiftingLineOptions::default()
        };
        let err = MultiSurfaceSystem::new(&input, reference, options);
        assert!(matches!(err, Err(LiftingLineError::InvalidInput { .. })));
        let sys =
            MultiSurfaceSystem::new(&input, reference, LiftingLineOptions::default()).unwrap();
        let err = sys.solve(&FlightCondition::new(0.1, 2));
        assert!(matches!(err, Err(LiftingLineError::SurfaceCount { .. })));
    }

    // Law: the coefficients are dimensionless, so scaling every length by k leaves C_L and C_m
    // (about the scaled point) unchanged and multiplies the circulation / speed by k.
    // Tolerance: round-off.
    #[test]
    fn coefficients_do_not_depend_on_scale() {
        let sections = [plate(2.0)];
        let small = wing_and_tail(&sections);
        let scaled = |s: &Surface, k: f64| {
            let mut out = s.clone();
            out.root_le_x_m *= k;
            out.root_le_z_m *= k;
            if let SurfaceShape::Panels(panels) = &mut out.shape {
                for p in panels {
                    p.span_m *= k;
                    p.root_chord_m *= k;
                    p.tip_chord_m *= k;
                }
            }
            out
        };
        let wing = scaled(&trapezoid("wing", 0.0, 0.0, 1.0, 0.25, 0.15), 3.0);
        let tail = scaled(&trapezoid("tail", 0.8, 0.1, 0.3, 0.12, 0.08), 3.0);
        let elevator = ElevatorEffect::full_span(-0.6, -0.6);
        let inputs = [
            SurfaceInput {
                surface: &wing,
                sections: &sections,
                elevator: None,
            },
            SurfaceInput {
                surface: &tail,
                sections: &sections,
                elevator: Some(elevator),
            },
        ];
        let options = LiftingLineOptions {
            stations_per_half_span: 12,
            ..LiftingLineOptions::default()
        };
        let big = MultiSurfaceSystem::new(&inputs, Reference::of_surface(&wing), options).unwrap();
        let a = small.solve(&small.condition(0.1)).unwrap();
        let b = big.solve(&big.condition(0.1)).unwrap();
        assert_relative_eq!(a.cl, b.cl, max_relative = 1e-12);
        assert_relative_eq!(a.cm(0.1, 0.02), b.cm(0.3, 0.06), epsilon = 1e-12);
        assert_relative_eq!(
            3.0 * a.stations[5].circulation_per_speed_m,
            b.stations[5].circulation_per_speed_m,
            max_relative = 1e-12
        );
    }

    /// Newton's method as it was before it kept its work buffers (new vectors, matrices and
    /// an nalgebra LU at every iteration), kept as the reference for the test below.
    fn newton_allocating(
        sys: &MultiSurfaceSystem,
        mut gamma: DVector<f64>,
        geo: &DVector<f64>,
        zero: &DVector<f64>,
    ) -> (DVector<f64>, DVector<f64>, usize) {
        let n = sys.stations.len();
        let eval = |g: &DVector<f64>| -> (DVector<f64>, Vec<bool>, DVector<f64>) {
            let alpha = geo + &sys.induced * g;
            let mut r = DVector::zeros(n);
            let mut active = vec![true; n];
            let mut d = DVector::zeros(n);
            for (i, st) in sys.stations.iter().enumerate() {
                let shift = zero[i] - st.section.alpha_zero_lift_rad;
                let lp = st.section.lift_point(alpha[i], shift);
                active[i] = lp.attached;
                d[i] = 0.5 * st.chord_m * lp.slope_per_rad;
                r[i] = g[i] - 0.5 * st.chord_m * lp.cl;
            }
            (r, active, d)
        };
        let tol = sys.options.newton_relative_tolerance * gamma.amax().max(1e-9);
        let (mut r, mut active, mut d_full) = eval(&gamma);
        let mut res = r.amax();
        let mut iterations = 0;
        while res > tol && iterations < sys.options.max_newton_iterations {
            iterations += 1;
            let j = system_matrix(&sys.induced, &d_full, &active);
            let step = j.clone().lu().solve(&-&r).unwrap();
            let mut lambda = 1.0;
            loop {
                let trial = &gamma + &step * lambda;
                let (r_t, a_t, d_t) = eval(&trial);
                let res_t = r_t.amax();
                if res_t < res || lambda < 1e-3 {
                    (gamma, r, active, d_full, res) = (trial, r_t, a_t, d_t, res_t);
                    break;
                }
                lambda *= 0.5;
            }
        }
        let j = system_matrix(&sys.induced, &d_full, &active);
        let rhs = DVector::from_iterator(
            n,
            sys.stations
                .iter()
                .zip(&active)
                .zip(d_full.iter())
                .map(|((s, a), d)| if *a { d * s.normal_z } else { 0.0 }),
        );
        let tangent = j.lu().solve(&rhs).unwrap();
        (gamma, tangent, iterations)
    }

    // Newton's method in reused work buffers gives the same bits as the allocating version it
    // replaced, on the example aircraft past their first stall (several stations held at
    // cl_max, with and without elevator, one set of buffers for every solve). No outside
    // source: a refactoring must not change the numbers (the buffers change only where the
    // numbers are kept, the LU is nalgebra's operations in the same order).
    #[test]
    fn newton_reuses_buffers_with_the_same_bits() {
        let examples = [
            include_str!("../../aircraft/larkspire-2000.toml"),
            include_str!("../../aircraft/merrowtail-1700.toml"),
            include_str!("../../aircraft/skerrywing-900.toml"),
            include_str!("../../aircraft/wrenfield-1400.toml"),
        ];
        let options = crate::analysis::AnalysisOptions {
            flight_polar: false,
            ..crate::analysis::AnalysisOptions::default()
        };
        let mut work = NewtonWork::default();
        let mut newton_solves = 0;
        for text in examples {
            let ac = crate::input::parse_aircraft(text, "example.toml", None).unwrap();
            let set = crate::analysis::section_set(&ac, &options).unwrap();
            let ll = crate::analysis::lifting_line_options(&ac, &options);
            let sys = crate::stability::trim::build_system(&ac, &set.models, ll).unwrap();
            let (alpha_stall, _) = sys
                .first_stall_alpha_rad(&sys.condition(0.0))
                .unwrap()
                .unwrap();
            for (d_alpha, elevator) in [(0.002, 0.0), (0.03, 0.0), (0.1, -0.1), (0.25, 0.05)] {
                let mut cond = sys.condition(alpha_stall + d_alpha);
                cond.elevator_rad = elevator;
                let q = sys.weights(&cond).unwrap();
                let (gamma0, _) = sys.linear_circulation(&q);
                let (geo, zero) = sys.station_angles(&cond);
                let Ok((gamma, tangent, status)) =
                    sys.newton(gamma0.clone(), &geo, &zero, &mut work)
                else {
                    continue;
                };
                let (g_ref, t_ref, iterations) = newton_allocating(&sys, gamma0, &geo, &zero);
                let same = |a: &DVector<f64>, b: &DVector<f64>| {
                    a.iter()
                        .zip(b.iter())
                        .all(|(x, y)| x.to_bits() == y.to_bits())
                };
                assert!(same(&gamma, &g_ref) && same(&tangent, &t_ref));
                assert!(
                    matches!(status, SolveStatus::Converged { iterations: k, .. } if k == iterations)
                );
                assert_eq!(
                    sys.solve_with(&cond, &mut work).unwrap(),
                    sys.solve(&cond).unwrap()
                );
                newton_solves += 1;
            }
        }
        assert!(
            newton_solves >= 12,
            "{newton_solves} stalled states compared"
        );
    }
}
