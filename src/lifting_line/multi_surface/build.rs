//! Building the system: the aircraft's surfaces cut into strips, the influence matrix (or the
//! condensed lattice) factored on the folded system, the unit solutions and their lift and
//! moment sums; and the same system re-solved for a changed twist, incidence or section.

use super::*;

impl MultiSurfaceSystem {
    /// The wing (surface 0, [`crate::lifting_line::SurfaceRole::Wing`]) and, if present, the
    /// stabiliser (surface 1, [`crate::lifting_line::SurfaceRole::Stabiliser`]) of `aircraft`,
    /// on the wing's reference area, MAC and span. `sections` is indexed by `AirfoilId.0`
    /// (parallel to `aircraft.airfoils`); `elevator` is the pitch control: it goes on the
    /// stabiliser when there is one, otherwise on the wing (elevons).
    pub fn from_aircraft(
        aircraft: &Aircraft,
        sections: &[SectionModel],
        elevator: Option<ElevatorEffect>,
        options: LiftingLineOptions,
    ) -> Result<Self, LiftingLineError> {
        let mut inputs = vec![SurfaceInput::wing_of(aircraft, sections, elevator)];
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
                let c = crate::lifting_line::lattice_cache::LatticeCache::shared().condense(
                    &stations,
                    &mirror,
                    options.chordwise_panels,
                    &wake,
                    cores,
                )?;
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
}
