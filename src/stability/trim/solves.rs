//! The solves a builder asks for on a stable aircraft: the stabiliser incidence and CG for a
//! target speed, the elevator schedule over the speed range, and trim speed swept over the CG.

use super::*;

/// For a target speed `speed_m_s`: the stabiliser incidence and decalage that trim there, and
/// the CG that trims there (only where it lies ahead of the neutral point), m.
pub(super) fn target_speed_solves(
    system: &MultiSurfaceSystem,
    base: &FlightCondition,
    input: &TrimInput<'_>,
    speed_m_s: f64,
    cg_eff_x_m: f64,
    fuselage_shift_m: f64,
    neutral_point_x_m: f64,
) -> (Option<DecalageSolve>, Option<f64>) {
    let area = system.reference().area_m2;
    let z = input.cg_z_m;
    let v = speed_m_s;
    let mut decalage_for_target = None;
    let cl_t = cl_at(input.mass_kg, input.density_kg_m3, area, v);
    if let Some(stab) = &input.aircraft.stabiliser {
        if let Ok(tp) = system.trim_for_cl(
            base,
            TrimControl::Incidence(SurfaceRole::Stabiliser.index()),
            cl_t,
            cg_eff_x_m,
            z,
        ) {
            let incidence = stab.surface.incidence_rad + tp.control_rad;
            let wing_minus_stab = input.aircraft.wing.incidence_rad - incidence;
            decalage_for_target = Some(DecalageSolve {
                speed_m_s: v,
                cl: cl_t,
                stabiliser_incidence_rad: incidence,
                decalage_rad: match stab.role {
                    StabiliserRole::Tail => wing_minus_stab,
                    StabiliserRole::Canard => -wing_minus_stab,
                },
            });
        }
    }
    let cg_for_target_x_m = cg_for_cl(system, base, cl_t, z)
        .map(|x| x - fuselage_shift_m)
        .filter(|x| *x < neutral_point_x_m);
    (decalage_for_target, cg_for_target_x_m)
}

/// The elevator schedule of a stable aircraft from `SCHEDULE_LOW_SPEED_FACTOR` times the stall
/// speed `stall_speed_m_s` to `top_speed_m_s`, trimmed at the CG (`cg_eff_x_m`).
#[allow(clippy::too_many_arguments)]
pub(super) fn elevator_schedule(
    system: &MultiSurfaceSystem,
    map: Option<&StationMap>,
    base: &FlightCondition,
    input: &TrimInput<'_>,
    control: &PitchControl,
    stall_speed_m_s: f64,
    top_speed_m_s: f64,
    cg_eff_x_m: f64,
) -> Result<Vec<ElevatorPoint>, LiftingLineError> {
    let area = system.reference().area_m2;
    let z = input.cg_z_m;
    let vs = stall_speed_m_s;
    let mut elevator_schedule = Vec::new();
    let lo = SCHEDULE_LOW_SPEED_FACTOR * vs;
    if top_speed_m_s > lo {
        for k in 0..SCHEDULE_POINTS {
            let v = lo + (top_speed_m_s - lo) * k as f64 / (SCHEDULE_POINTS - 1) as f64;
            let cl = cl_at(input.mass_kg, input.density_kg_m3, area, v);
            if let Ok(tp) = system.trim_for_cl(base, TrimControl::Elevator, cl, cg_eff_x_m, z) {
                let d = real_deflection_rad(control, tp.control_rad);
                let stalled = !map.is_some_and(|m| m.clearly_inside_limits(system, &tp))
                    && stabiliser_at_cl_min(system, base, &tp, TrimControl::Elevator)?.is_some();
                elevator_schedule.push(ElevatorPoint {
                    speed_m_s: v,
                    cl,
                    elevator_rad: d,
                    within_limits: control.within_throws(d),
                    stabiliser_at_cl_min: stalled,
                });
            }
        }
    }
    Ok(elevator_schedule)
}

/// Trim speed at any CG position with the incidences held, from one factored system (for
/// charts of trim speed against CG).
pub struct TrimSweeper<'a> {
    input: TrimInput<'a>,
    system: MultiSurfaceSystem,
    fuselage_shift_m: f64,
}

impl<'a> TrimSweeper<'a> {
    /// Build the system once for `input` (its CG is ignored).
    pub fn new(input: TrimInput<'a>) -> Result<Self, LiftingLineError> {
        let system = build_system(input.aircraft, input.sections, input.options)?;
        let base = system.condition(0.0);
        let cl_alpha = system
            .linear_coefficients(&base, input.cg_x_m, input.cg_z_m)?
            .cl_alpha_per_rad;
        let fuselage_shift_m =
            system.reference().mac_m * input.fuselage_cm_alpha_per_rad / cl_alpha;
        Ok(TrimSweeper {
            input,
            system,
            fuselage_shift_m,
        })
    }

    /// Trim speed (m/s) with the CG at `cg_x_m` and neutral elevator, or `None` where there is
    /// no stable trim at positive lift.
    pub fn trim_speed_m_s(&self, cg_x_m: f64) -> Option<f64> {
        let base = self.system.condition(0.0);
        let x = cg_x_m + self.fuselage_shift_m;
        let np = self
            .system
            .neutral_point_x_m(&base, self.input.cg_z_m)
            .ok()?;
        if x >= np {
            return None;
        }
        let tp = self
            .system
            .alpha_for_zero_moment(&base, x, self.input.cg_z_m)
            .ok()?;
        (tp.cl > crate::stability::classical::MIN_TRIM_CL).then(|| {
            speed_at(
                self.input.mass_kg,
                self.input.density_kg_m3,
                self.system.reference().area_m2,
                tp.cl,
            )
        })
    }
}
