//! The flight polar: steady gliding flight over the speed range, from any source of trimmed
//! drag, with minimum sink, best glide and the speed to fly in sinking air.
//!
//! Steady straight glide, no small-angle approximation: lift `L = W cos(gamma)` and drag
//! `D = W sin(gamma)`, so the glide path angle is `tan(gamma) = C_D / C_L`, the glide ratio
//! (horizontal distance over height lost) is exactly `C_L / C_D`, the airspeed at lift
//! coefficient `C_L` is `V = sqrt(2 W cos(gamma) / (rho S C_L))` and the sink rate is
//! `V sin(gamma)`. Drag depends on speed through the Reynolds number, so at each C_L the speed
//! and the drag are iterated to a fixed point (a few passes: drag varies slowly with speed).
//!
//! The polar is computed on a grid of lift coefficients (equally spaced in speed from the
//! stall to the top speed); minimum sink, best glide and the speed to fly are then refined
//! by Brent's minimisation between the grid neighbours of the best grid point, only over
//! points that can be trimmed within the control throws. An optimum on the end of the range
//! is flagged (`at_stall`, `at_top_speed`): it is where the range ends, not an optimum.
//!
//! Speed to fly: flying from one climb to the next through air that sinks at `s`, with
//! climbs expected at `m` (the MacCready setting), the mean cross-country speed
//! `V_h m / (w + s + m)` is largest where `(w(V) + s + m) / V_h` is least: the tangent to the
//! polar from the point `(0, -(s + m))` on the speed axis. With `m = 0` this is the flattest
//! glide over the ground through sinking air.
//!
//! # References
//! - J. D. Anderson, *Introduction to Flight*, ch. 6 (equations of gliding flight, the glide
//!   ratio as L/D, minimum sink and best glide conditions of a parabolic polar).
//! - P. B. MacCready Jr., "Optimum airspeed selector", *Soaring*, Jan.-Feb. 1958 (the speed
//!   to fly from the polar shifted by the air's sink and the expected climb; from memory);
//!   H. Reichmann, *Cross-Country Soaring*, ch. 1 (the tangent construction; from memory).
//! - The optimum's search: Brent's minimisation, see [`crate::numeric::brent_min`].

use crate::atmosphere::G0;
use crate::numeric::brent_min::{find_minimum, MinSettings};

/// Drag coefficients of one trimmed state, on the reference area.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct Drag {
    /// Profile drag of the lifting surfaces' sections.
    pub profile: f64,
    /// Induced drag from the wake (Trefftz plane), all surfaces.
    pub induced: f64,
    /// Fuselage and other parasite drag.
    pub parasite: f64,
    /// True when a section's drag was extrapolated beyond its polar.
    pub beyond_polar: bool,
}

impl Drag {
    /// Total drag coefficient.
    pub fn total(&self) -> f64 {
        self.profile + self.induced + self.parasite
    }
}

/// A source of trimmed drag: trims the aircraft at a lift coefficient and gives its drag at
/// a speed (speed enters through the Reynolds number only).
pub trait DragSource {
    /// What the trim solve returns (angle, control setting, loads...).
    type Trim: Clone;
    /// The trimmed state at lift coefficient `cl`; `None` when it cannot be trimmed.
    fn trim(&self, cl: f64) -> Option<Self::Trim>;
    /// Drag of that state at airspeed `speed_m_s`.
    fn drag(&self, trim: &Self::Trim, speed_m_s: f64) -> Drag;
    /// True when the state is within the control throws (and any other limit of the source).
    fn flyable(&self, trim: &Self::Trim) -> bool;
}

/// The flight condition the polar is flown at.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PolarConditions {
    /// Mass, kg.
    pub mass_kg: f64,
    /// Air density, kg/m^3.
    pub density_kg_m3: f64,
    /// Reference (wing) area, m^2.
    pub area_m2: f64,
    /// Highest lift coefficient flown (the trimmed stall).
    pub cl_stall: f64,
    /// Top speed of the range, m/s.
    pub top_speed_m_s: f64,
    /// Points on the grid (at least 3).
    pub points: usize,
    /// A lift coefficient always put on the grid (the trim with the control neutral, so that
    /// an aircraft whose control cannot move still has its one flyable speed), if any.
    pub trim_cl: Option<f64>,
}

/// One point of steady gliding flight.
#[derive(Debug, Clone, PartialEq)]
pub struct GlidePoint<T> {
    /// Lift coefficient.
    pub cl: f64,
    /// Drag coefficients.
    pub drag: Drag,
    /// Airspeed, m/s.
    pub speed_m_s: f64,
    /// Sink rate, m/s (positive down).
    pub sink_m_s: f64,
    /// Glide ratio, horizontal distance over height lost (= C_L / C_D).
    pub glide_ratio: f64,
    /// Glide path angle below the horizon, rad.
    pub path_angle_rad: f64,
    /// True when the trimmed state is within the control throws.
    pub flyable: bool,
    /// The trimmed state.
    pub trim: T,
}

impl<T> GlidePoint<T> {
    /// Horizontal speed, m/s.
    pub fn horizontal_speed_m_s(&self) -> f64 {
        self.speed_m_s * self.path_angle_rad.cos()
    }
}

/// Why the flight polar could not be computed.
#[derive(Debug, Clone, Copy, PartialEq, thiserror::Error)]
pub enum FlightPolarError {
    /// A condition is out of range.
    #[error("flight polar: {quantity} must be finite and positive (got {value})")]
    BadCondition {
        /// Which one.
        quantity: &'static str,
        /// Its value.
        value: f64,
    },
    /// The stall speed is not below the top speed.
    #[error("flight polar: the top speed {top_m_s:.1} m/s is not above the stall speed {stall_m_s:.1} m/s")]
    EmptyRange {
        /// Stall speed, m/s.
        stall_m_s: f64,
        /// Top speed, m/s.
        top_m_s: f64,
    },
    /// No grid point could be trimmed within the throws.
    #[error("flight polar: no speed of the range can be trimmed within the control throws")]
    NothingFlyable,
    /// The speed iteration gave a non-finite number.
    #[error("flight polar: non-finite {quantity}")]
    NonFinite {
        /// Which quantity.
        quantity: &'static str,
    },
}

/// An optimum of the polar with where it lies.
#[derive(Debug, Clone, PartialEq)]
pub struct Optimum<T> {
    /// The point.
    pub point: GlidePoint<T>,
    /// True when it lies on the stall end of the flyable range.
    pub at_stall: bool,
    /// True when it lies on the fast end.
    pub at_top_speed: bool,
    /// True when it lies where the control runs out (the end of the trimmable speeds, which
    /// is not an end of the range).
    pub at_control_limit: bool,
    /// True when it lies on the slow end of the trimmable speeds (the stall, or where the
    /// control runs out at the slow end).
    pub on_slow_end: bool,
}

/// The speed to fly through air sinking at a given rate.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpeedToFly {
    /// Sink rate of the air, m/s (positive down).
    pub air_sink_m_s: f64,
    /// Expected climb rate in the next thermal, m/s (the MacCready setting).
    pub climb_m_s: f64,
    /// Airspeed to fly, m/s.
    pub speed_m_s: f64,
    /// Glide ratio over the ground in that air (horizontal speed over total sink).
    pub glide_ratio_in_air: f64,
    /// True when the best speed is the top of the range.
    pub at_top_speed: bool,
    /// True when the best speed is where the control runs out.
    pub at_control_limit: bool,
    /// True when the best speed is the slow end of the trimmable speeds.
    pub on_slow_end: bool,
    /// True when a section's drag at that speed was extrapolated beyond its polar's
    /// converged points (the speed is then less certain).
    pub drag_extrapolated: bool,
    /// Mean cross-country speed when each glide is followed by a climb at `climb_m_s`,
    /// `V_h m / (m + w + s)`, m/s (0 when no climb is expected).
    pub cross_country_speed_m_s: f64,
}

/// The computed polar.
#[derive(Debug, Clone, PartialEq)]
pub struct FlightPolar<T> {
    /// Grid points in rising speed.
    pub points: Vec<GlidePoint<T>>,
    /// Minimum sink.
    pub min_sink: Optimum<T>,
    /// Best glide.
    pub best_glide: Optimum<T>,
    /// The conditions.
    pub conditions: PolarConditions,
}

/// The glide at lift coefficient `cl` with trimmed state `trim`.
pub fn glide_at<D: DragSource>(
    source: &D,
    trim: D::Trim,
    cl: f64,
    cond: &PolarConditions,
) -> Result<GlidePoint<D::Trim>, FlightPolarError> {
    let weight_n = cond.mass_kg * G0;
    let speed_of = |cos_gamma: f64| {
        (2.0 * weight_n * cos_gamma / (cond.density_kg_m3 * cond.area_m2 * cl)).sqrt()
    };
    let mut speed = speed_of(1.0);
    let mut drag = source.drag(&trim, speed);
    for _ in 0..20 {
        let gamma = (drag.total() / cl).atan();
        let next = speed_of(gamma.cos());
        let change = (next - speed).abs();
        speed = next;
        drag = source.drag(&trim, speed);
        if change <= 1e-12 * speed {
            break;
        }
    }
    let cd = drag.total();
    let gamma = (cd / cl).atan();
    let point = GlidePoint {
        cl,
        drag,
        speed_m_s: speed,
        sink_m_s: speed * gamma.sin(),
        glide_ratio: cl / cd,
        path_angle_rad: gamma,
        flyable: source.flyable(&trim),
        trim,
    };
    for (quantity, v) in [
        ("speed", point.speed_m_s),
        ("sink rate", point.sink_m_s),
        ("glide ratio", point.glide_ratio),
    ] {
        if !(v.is_finite() && v > 0.0) {
            return Err(FlightPolarError::NonFinite { quantity });
        }
    }
    Ok(point)
}

fn check_conditions(cond: &PolarConditions) -> Result<(), FlightPolarError> {
    for (quantity, value) in [
        ("mass", cond.mass_kg),
        ("air density", cond.density_kg_m3),
        ("wing area", cond.area_m2),
        ("stall lift coefficient", cond.cl_stall),
        ("top speed", cond.top_speed_m_s),
    ] {
        if !(value.is_finite() && value > 0.0) {
            return Err(FlightPolarError::BadCondition { quantity, value });
        }
    }
    Ok(())
}

/// Lift coefficient at `speed_m_s` in level-flight terms (cos gamma = 1), for the grid.
fn grid_cl(cond: &PolarConditions, speed_m_s: f64) -> f64 {
    2.0 * cond.mass_kg * G0 / (cond.density_kg_m3 * cond.area_m2 * speed_m_s * speed_m_s)
}

/// How closely an optimum's C_L is searched for: a minimum is defined only to about the
/// square root of the rounding of the objective (see [`crate::numeric::brent_min`]).
const OPTIMUM_SEARCH: MinSettings = MinSettings {
    rel_tolerance: 1e-8,
    abs_tolerance: 1e-12,
    max_evaluations: 100,
};

/// The least of `objective` over the flyable part of `points` (rising speed), refined between
/// the best grid point's flyable neighbours by Brent's method in C_L.
fn optimum<D: DragSource>(
    source: &D,
    points: &[GlidePoint<D::Trim>],
    cond: &PolarConditions,
    objective: &dyn Fn(&GlidePoint<D::Trim>) -> f64,
) -> Result<Optimum<D::Trim>, FlightPolarError> {
    let flyable: Vec<usize> = (0..points.len()).filter(|&i| points[i].flyable).collect();
    let (&first, &last) = match (flyable.first(), flyable.last()) {
        (Some(f), Some(l)) => (f, l),
        _ => return Err(FlightPolarError::NothingFlyable),
    };
    let best = *flyable
        .iter()
        .min_by(|&&i, &&j| objective(&points[i]).total_cmp(&objective(&points[j])))
        .ok_or(FlightPolarError::NothingFlyable)?;
    let neighbour = |i: Option<usize>| i.filter(|&k| k < points.len() && points[k].flyable);
    let lo = neighbour(best.checked_sub(1)).unwrap_or(best);
    let hi = neighbour(Some(best + 1)).unwrap_or(best);
    let mut chosen = points[best].clone();
    if lo != hi {
        // C_L falls with speed: the slow neighbour has the larger C_L.
        let (cl_a, cl_b) = (points[hi].cl, points[lo].cl);
        let mut f = |cl: f64| match source.trim(cl) {
            Some(t) => glide_at(source, t, cl, cond)
                .ok()
                .filter(|p| p.flyable)
                .map_or(f64::INFINITY, |p| objective(&p)),
            None => f64::INFINITY,
        };
        let cl = find_minimum(cl_a, cl_b, OPTIMUM_SEARCH, &mut f).x;
        if let Some(t) = source.trim(cl) {
            let p = glide_at(source, t, cl, cond)?;
            if p.flyable && objective(&p) <= objective(&chosen) {
                chosen = p;
            }
        }
    }
    // On the end of the range when the best grid point is the end one and the refined point
    // did not move inside it by more than a grid-step fraction.
    let on_slow_end = best == first && chosen.cl >= points[first].cl - 1e-9;
    let on_fast_end = best == last && chosen.cl <= points[last].cl + 1e-9;
    let at_stall = on_slow_end && first == 0;
    let at_top_speed = on_fast_end && last + 1 == points.len();
    Ok(Optimum {
        point: chosen,
        at_stall,
        at_top_speed,
        at_control_limit: (on_slow_end && !at_stall) || (on_fast_end && !at_top_speed),
        on_slow_end,
    })
}

/// The flight polar of `source` at `cond`.
pub fn flight_polar<D: DragSource>(
    source: &D,
    cond: &PolarConditions,
) -> Result<FlightPolar<D::Trim>, FlightPolarError> {
    check_conditions(cond)?;
    let n = cond.points.max(3);
    let stall_m_s =
        (2.0 * cond.mass_kg * G0 / (cond.density_kg_m3 * cond.area_m2 * cond.cl_stall)).sqrt();
    if cond.top_speed_m_s <= stall_m_s * (1.0 + 1e-9) {
        return Err(FlightPolarError::EmptyRange {
            stall_m_s,
            top_m_s: cond.top_speed_m_s,
        });
    }
    let mut cls: Vec<f64> = (0..n)
        .map(|k| {
            let v = stall_m_s + (cond.top_speed_m_s - stall_m_s) * k as f64 / (n - 1) as f64;
            // The stall end exactly at the stall C_L (no rounding through the speed).
            if k == 0 {
                cond.cl_stall
            } else {
                grid_cl(cond, v)
            }
        })
        .collect();
    let cl_top = grid_cl(cond, cond.top_speed_m_s);
    if let Some(t) = cond
        .trim_cl
        .filter(|c| c.is_finite() && *c < cond.cl_stall && *c > cl_top)
    {
        cls.push(t);
        // Rising speed: falling lift coefficient.
        cls.sort_by(|a, b| b.total_cmp(a));
    }
    let mut points = Vec::with_capacity(cls.len());
    for cl in cls {
        if let Some(t) = source.trim(cl) {
            points.push(glide_at(source, t, cl, cond)?);
        }
    }
    let min_sink = optimum(source, &points, cond, &|p| p.sink_m_s)?;
    let best_glide = optimum(source, &points, cond, &|p| -p.glide_ratio)?;
    Ok(FlightPolar {
        points,
        min_sink,
        best_glide,
        conditions: *cond,
    })
}

impl<T: Clone> FlightPolar<T> {
    /// The speed to fly through air sinking at `air_sink_m_s` with climbs of `climb_m_s`
    /// expected (see the module doc), over the flyable range.
    pub fn speed_to_fly<D: DragSource<Trim = T>>(
        &self,
        source: &D,
        air_sink_m_s: f64,
        climb_m_s: f64,
    ) -> Result<SpeedToFly, FlightPolarError> {
        let shift = air_sink_m_s + climb_m_s;
        let objective = |p: &GlidePoint<T>| (p.sink_m_s + shift) / p.horizontal_speed_m_s();
        let o = optimum(source, &self.points, &self.conditions, &objective)?;
        let p = &o.point;
        Ok(SpeedToFly {
            air_sink_m_s,
            climb_m_s,
            speed_m_s: p.speed_m_s,
            glide_ratio_in_air: p.horizontal_speed_m_s() / (p.sink_m_s + air_sink_m_s),
            at_top_speed: o.at_top_speed,
            at_control_limit: o.at_control_limit,
            on_slow_end: o.on_slow_end,
            drag_extrapolated: p.drag.beyond_polar,
            cross_country_speed_m_s: if climb_m_s > 0.0 {
                p.horizontal_speed_m_s() * climb_m_s / (climb_m_s + p.sink_m_s + air_sink_m_s)
            } else {
                0.0
            },
        })
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// A parabolic polar CD = CD0 + k CL^2 that needs no trim.
    struct Parabolic {
        cd0: f64,
        k: f64,
    }

    impl DragSource for Parabolic {
        type Trim = f64;
        fn trim(&self, cl: f64) -> Option<f64> {
            Some(cl)
        }
        fn drag(&self, cl: &f64, _speed_m_s: f64) -> Drag {
            Drag {
                profile: self.cd0,
                induced: self.k * cl * cl,
                ..Drag::default()
            }
        }
        fn flyable(&self, _: &f64) -> bool {
            true
        }
    }

    #[test]
    fn glide_ratio_is_lift_over_drag() {
        let s = Parabolic { cd0: 0.02, k: 0.04 };
        let c = PolarConditions {
            mass_kg: 1.0,
            density_kg_m3: 1.2,
            area_m2: 0.4,
            cl_stall: 1.2,
            top_speed_m_s: 20.0,
            points: 10,
            trim_cl: None,
        };
        let p = flight_polar(&s, &c).unwrap();
        for q in &p.points {
            let cd = q.drag.total();
            assert!((q.glide_ratio - q.cl / cd).abs() < 1e-12);
            assert!((q.horizontal_speed_m_s() / q.sink_m_s - q.cl / cd).abs() < 1e-9);
        }
    }

    /// The parabolic polar whose section drag counts as extrapolated below `cl_edge` (the
    /// fast end, where real polars run out of converged low-lift angles).
    struct EdgedParabolic {
        inner: Parabolic,
        cl_edge: f64,
    }

    impl DragSource for EdgedParabolic {
        type Trim = f64;
        fn trim(&self, cl: f64) -> Option<f64> {
            Some(cl)
        }
        fn drag(&self, cl: &f64, speed_m_s: f64) -> Drag {
            Drag {
                beyond_polar: *cl < self.cl_edge,
                ..self.inner.drag(cl, speed_m_s)
            }
        }
        fn flyable(&self, _: &f64) -> bool {
            true
        }
    }

    // A speed to fly that falls where the drag is extrapolated says so; one on the polar's
    // converged part does not (the flag follows the chosen point's own drag).
    #[test]
    fn speed_to_fly_in_the_extrapolated_range_is_marked() {
        let s = EdgedParabolic {
            inner: Parabolic { cd0: 0.02, k: 0.04 },
            cl_edge: 0.3,
        };
        let c = PolarConditions {
            mass_kg: 1.0,
            density_kg_m3: 1.2,
            area_m2: 0.4,
            cl_stall: 1.2,
            top_speed_m_s: 25.0,
            points: 40,
            trim_cl: None,
        };
        let p = flight_polar(&s, &c).unwrap();
        let still = p.speed_to_fly(&s, 0.0, 0.0).unwrap();
        let fast = p.speed_to_fly(&s, 3.0, 0.0).unwrap();
        let cl_of = |v: f64| 2.0 * G0 / (1.2 * 0.4 * v * v);
        assert!(cl_of(still.speed_m_s) > 0.3 && !still.drag_extrapolated);
        assert!(cl_of(fast.speed_m_s) < 0.3 && fast.drag_extrapolated);
    }

    #[test]
    fn empty_range_is_an_error() {
        let s = Parabolic { cd0: 0.02, k: 0.04 };
        let c = PolarConditions {
            mass_kg: 1.0,
            density_kg_m3: 1.2,
            area_m2: 0.4,
            cl_stall: 1.2,
            top_speed_m_s: 1.0,
            points: 10,
            trim_cl: None,
        };
        assert!(matches!(
            flight_polar(&s, &c),
            Err(FlightPolarError::EmptyRange { .. })
        ));
    }
}
