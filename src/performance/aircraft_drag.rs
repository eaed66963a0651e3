//! Trimmed drag of a whole aircraft from its wing-model solution: the source behind the
//! flight polar ([`super::flight_polar`]).
//!
//! At each lift coefficient the aircraft is trimmed (zero pitching moment about the CG's
//! effective moment reference, fuselage included) with its pitch control, or, for a tailplane
//! without one, with the tailplane's incidence. The trimmed solution gives every strip's
//! lift coefficient and the induced drag of all surfaces from the Trefftz plane (so the
//! tail's load and the trim drag are in it). Profile drag is the strip sum of section drag at
//! each strip's lift coefficient and Reynolds number (McCormick's strip method), on the strip's
//! true area (chord times its width in the y-z plane, so a V-tail counts its real area). A
//! stabiliser working at `eta` times the free stream's dynamic pressure has its strips' lift
//! coefficients referred to the free stream in the wing model; here its own cl is that over
//! eta, its Reynolds number is taken at `sqrt(eta) V`, and its drag is eta times its own
//! coefficient. The stabiliser's profile drag carries the interference factor of a
//! conventional tail, 1.04 (1.03 for a V-tail) (Raymer, *Aircraft Design*, 6th ed., sec.
//! 12.5.5; from memory); the wing's is 1.0 (a high or filleted wing, same source). The
//! fuselage is the flat-plate build-up of [`super::drag`], fully turbulent.
//!
//! # References
//! - B. W. McCormick, *Aerodynamics, Aeronautics and Flight Mechanics*, 2nd ed., ch. 4 (strip
//!   method for profile drag; from memory).
//! - E. Trefftz (1921): induced drag in the far wake, see [`crate::lifting_line::results`].

use crate::lifting_line::{FlightCondition, MultiSurfaceSystem, SurfaceRole, TrimControl};
use crate::model::{Aircraft, PitchControl};
use crate::performance::drag::{self, BodyDragInput};
use crate::performance::flight_polar::{Drag, DragSource};
use crate::performance::profile_drag::SectionDrag;
use crate::planform;

/// Interference factor of a conventional tail's profile drag (Raymer, sec. 12.5.5; from
/// memory).
pub const TAIL_INTERFERENCE: f64 = 1.04;
/// Interference factor of a V-tail's profile drag (same source).
pub const VEE_TAIL_INTERFERENCE: f64 = 1.03;
/// Dihedral from which a stabiliser counts as a V-tail for the interference factor, rad
/// (common practice: about 20 deg).
const VEE_TAIL_DIHEDRAL_RAD: f64 = 0.35;

/// What one strip needs for its profile drag.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct StripDrag {
    /// Surface index in the system.
    pub surface: usize,
    /// Chord, m.
    pub chord_m: f64,
    /// True area of the strip, m^2.
    pub area_m2: f64,
    /// Inboard and outboard airfoil indices and the outboard weight (0 to 1).
    pub airfoils: (usize, usize, f64),
    /// Dynamic-pressure ratio of its surface.
    pub eta: f64,
    /// Interference factor of its surface's profile drag.
    pub interference: f64,
}

/// One trimmed state of the aircraft.
#[derive(Debug, Clone, PartialEq)]
pub struct AircraftTrim {
    /// Fuselage-datum angle of attack, rad.
    pub alpha_rad: f64,
    /// Setting of the trim control: the real elevator (or elevon) deflection, rad (trailing
    /// edge down positive), or the tailplane incidence change when it trims by incidence.
    pub control_rad: f64,
    /// Which control trims.
    pub control: TrimControl,
    /// True when the control setting is within its throws.
    pub within_throws: bool,
    /// Induced-drag coefficient of all surfaces.
    pub induced_drag: f64,
    /// Stabiliser lift coefficient on its own area and own dynamic pressure (0 without one).
    pub stabiliser_cl: f64,
    /// Strip lift coefficients referred to the free stream, parallel to the strips.
    pub strip_cl: Vec<f64>,
    /// Span efficiency of the whole system, C_L^2 / (pi A C_Di).
    pub span_efficiency: Option<f64>,
}

/// The trimmed-drag source of one aircraft configuration.
#[derive(Debug, Clone)]
pub struct AircraftDrag<'a> {
    system: &'a MultiSurfaceSystem,
    base: FlightCondition,
    control: TrimControl,
    pitch_control: Option<&'a PitchControl>,
    x_ref_m: f64,
    z_ref_m: f64,
    strips: Vec<StripDrag>,
    sections: &'a [SectionDrag],
    body: Option<BodyDragInput>,
    nu_m2_s: f64,
    /// Per strip, the lift coefficient a camber flap adds to the section at a given angle;
    /// the plain section's drag is looked up at the strip's cl less this (empty: none).
    cl_shift: Vec<f64>,
}

/// The strips of `system` with their airfoils and areas (the surfaces of `aircraft`: wing,
/// then stabiliser).
pub fn strips_of(aircraft: &Aircraft, system: &MultiSurfaceSystem) -> Vec<StripDrag> {
    let vee = system
        .stations()
        .iter()
        .filter(|st| st.is_on(SurfaceRole::Stabiliser))
        .any(|st| st.normal_z < VEE_TAIL_DIHEDRAL_RAD.cos());
    system
        .stations()
        .iter()
        .map(|st| {
            let (surface, eta, interference) = match (
                SurfaceRole::of_index(st.surface),
                aircraft.stabiliser.as_ref(),
            ) {
                (Some(SurfaceRole::Wing), _) | (_, None) => (&aircraft.wing, 1.0, 1.0),
                (_, Some(s)) => {
                    let q = if vee {
                        VEE_TAIL_INTERFERENCE
                    } else {
                        TAIL_INTERFERENCE
                    };
                    (&s.surface, s.dynamic_pressure_ratio, q)
                }
            };
            let at = planform::station_at(surface, st.s_m.abs());
            StripDrag {
                surface: st.surface,
                chord_m: st.chord_m,
                area_m2: st.chord_m * st.width_m,
                airfoils: (
                    at.airfoil_inboard.0,
                    at.airfoil_outboard.0,
                    at.airfoil_weight,
                ),
                eta,
                interference,
            }
        })
        .collect()
}

impl<'a> AircraftDrag<'a> {
    /// The source for `aircraft` on its factored `system`, trimming about the effective
    /// moment reference (`x_ref_m`, `z_ref_m`: the CG moved aft by the fuselage's moment, as
    /// in [`crate::stability::trim`]), with profile drag from `sections` (parallel to the
    /// aircraft's airfoils) and air of kinematic viscosity `nu_m2_s`.
    pub fn new(
        aircraft: &'a Aircraft,
        system: &'a MultiSurfaceSystem,
        sections: &'a [SectionDrag],
        x_ref_m: f64,
        z_ref_m: f64,
        nu_m2_s: f64,
    ) -> Option<AircraftDrag<'a>> {
        let pitch_control = aircraft.pitch_control();
        // The pitch control trims every speed, checked against its throws (an all-moving
        // tail is an elevator of full chord; a control with no throw trims one speed only).
        // A stabiliser without any control would be re-rigged by its incidence.
        let control = match (pitch_control, aircraft.stabiliser.as_ref()) {
            (Some(_), _) => TrimControl::Elevator,
            (None, Some(_)) => TrimControl::Incidence(SurfaceRole::Stabiliser.index()),
            (None, None) => return None,
        };
        Some(AircraftDrag {
            system,
            base: system.condition(0.0),
            control,
            pitch_control,
            x_ref_m,
            z_ref_m,
            strips: strips_of(aircraft, system),
            sections,
            body: aircraft.fuselage.as_ref().map(|f| BodyDragInput {
                length_m: f.length_m,
                width_m: f.max_width_m,
            }),
            nu_m2_s,
            cl_shift: Vec::new(),
        })
    }

    /// The same source with camber-flap lift shifts per strip (parallel to the strips): a
    /// flapped section's drag is taken as the plain section's at the cl it would have at the
    /// same angle without the flap (the drag polar moves along cl with the camber; the hinge's
    /// own drag is not included: a judgement, said in the flap-setting note).
    pub fn with_cl_shifts(mut self, shifts: &[f64]) -> Self {
        self.cl_shift = shifts.to_vec();
        self
    }

    /// The lift coefficient strip `k` is looked up at, its own (on its own dynamic pressure,
    /// less any flap shift), from its free-stream-referred `cl`.
    pub fn lookup_cl(&self, k: usize, cl: f64) -> f64 {
        let eta = self.strips.get(k).map_or(1.0, |s| s.eta.max(1e-6));
        cl / eta - self.cl_shift.get(k).copied().unwrap_or(0.0)
    }

    /// The strips.
    pub fn strips(&self) -> &[StripDrag] {
        &self.strips
    }

    /// Which control trims the polar.
    pub fn control(&self) -> TrimControl {
        self.control
    }
}

impl DragSource for AircraftDrag<'_> {
    type Trim = AircraftTrim;

    fn trim(&self, cl: f64) -> Option<AircraftTrim> {
        let tp = self
            .system
            .trim_for_cl(&self.base, self.control, cl, self.x_ref_m, self.z_ref_m)
            .ok()?;
        let mut cond = self.base.clone();
        cond.alpha_rad = tp.alpha_rad;
        match self.control {
            TrimControl::Elevator => cond.elevator_rad = tp.control_rad,
            TrimControl::Incidence(s) => {
                if let Some(v) = cond.incidence_change_rad.get_mut(s) {
                    *v = tp.control_rad;
                }
            }
        }
        let result = self.system.solve(&cond).ok()?;
        let (control_rad, within_throws) = match (self.control, self.pitch_control) {
            (TrimControl::Elevator, Some(p)) => {
                let real = crate::stability::trim::real_deflection_rad(p, tp.control_rad);
                (real, p.within_throws(real))
            }
            _ => (tp.control_rad, true),
        };
        let stabiliser_cl = result.surface(SurfaceRole::Stabiliser).map_or(0.0, |s| {
            let eta = self
                .strips
                .iter()
                .find(|t| t.surface == SurfaceRole::Stabiliser.index())
                .map_or(1.0, |t| t.eta);
            s.cl_own_area / eta
        });
        Some(AircraftTrim {
            alpha_rad: tp.alpha_rad,
            control_rad,
            control: self.control,
            within_throws,
            induced_drag: result.induced_drag,
            stabiliser_cl,
            strip_cl: result.stations.iter().map(|s| s.cl).collect(),
            span_efficiency: result.span_efficiency,
        })
    }

    fn drag(&self, trim: &AircraftTrim, speed_m_s: f64) -> Drag {
        let s_ref = self.system.reference().area_m2;
        let mut profile = 0.0;
        let mut beyond = false;
        for (k, (strip, cl)) in self.strips.iter().zip(&trim.strip_cl).enumerate() {
            let eta = strip.eta.max(1e-6);
            let re = speed_m_s * eta.sqrt() * strip.chord_m / self.nu_m2_s;
            let cl_own = self.lookup_cl(k, *cl);
            let (i, o, w) = strip.airfoils;
            let a = self.sections[i].cd(cl_own, re);
            let cd = if w > 0.0 && o != i {
                let b = self.sections[o].cd(cl_own, re);
                beyond |= b.beyond_polar;
                (1.0 - w) * a.cd + w * b.cd
            } else {
                a.cd
            };
            beyond |= a.beyond_polar;
            profile += eta * strip.interference * cd * strip.area_m2 / s_ref;
        }
        let parasite = self
            .body
            .map_or(0.0, |b| drag::body_cd(b, s_ref, speed_m_s, self.nu_m2_s));
        Drag {
            profile,
            induced: trim.induced_drag,
            parasite,
            beyond_polar: beyond,
        }
    }

    fn flyable(&self, trim: &AircraftTrim) -> bool {
        trim.within_throws
    }
}
