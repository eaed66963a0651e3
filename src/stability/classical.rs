//! Closed-form first estimate of lift slope, neutral point, trim and stall.
//!
//! The analysis feeds it thin-airfoil section models (lift slope 2 pi, zero-lift angle and
//! moment from the mean line), so that this cross-check is independent of the panel method.
//! Each surface is reduced to an "equivalent" straight wing: its zero-lift angle, moment about
//! the aerodynamic centre, section lift slope and cl_max are strip averages over the span
//! (chord-weighted, and chord-squared-weighted for the moment), which is the usual way to
//! carry twist and mixed airfoils into a closed-form estimate. Then:
//!
//! - finite-wing lift slope by Helmbold's equation,
//!   `a = a0 / (sqrt(1 + (a0 / (pi A))^2) + a0 / (pi A))`;
//! - downwash gradient at the tail `d eps / d alpha = 2 a_w / (pi A)` (elliptic loading, far
//!   wake);
//! - neutral point, lift-weighted form, `x_n = (a_w x_w + k x_t) / (a_w + k)` with
//!   `k = eta (S_t / S) a_t (1 - d eps / d alpha)` with the tail efficiency (dynamic-pressure
//!   ratio) eta of the file; for a canard the foreplane is taken outside the wing's flow field
//!   (k without the downwash factor);
//! - the stabiliser's lift and moment in trim are eta times their free-stream values;
//! - trim: total Cm about the CG (wing and stabiliser lift with their arms, plus their cm_ac)
//!   is linear in the body angle; trim is where it is zero, and the trim speed follows from
//!   `W = 1/2 rho V^2 S CL`;
//! - aircraft CL_max taken as 0.9 times the wing's chord-weighted section cl_max
//!   (common practice for a first estimate), stabiliser lift neglected at stall.
//!
//! # References
//! - H. G. Helmbold, "Der unverwundene Ellipsenfluegel als tragende Wirbelflaeche",
//!   Jahrbuch der Deutschen Luftfahrtforschung, 1942 (the lift-slope equation).
//! - B. W. McCormick, *Aerodynamics, Aeronautics and Flight Mechanics*, 2nd ed., 1995, ch. 8-9
//!   (downwash gradient 2 CL_alpha/(pi A), neutral point and static margin).
//! - B. Etkin, L. D. Reid, *Dynamics of Flight: Stability and Control*, 3rd ed., sec. 2.3-2.4
//!   (neutral point of wing plus tail, static margin).
//! - J. D. Anderson, *Introduction to Flight*, ch. 5 and 7 (lift equation, stall speed).

use crate::model::Surface;
use crate::planform::{self, PlanformGeometry};
use crate::section::SectionModel;
use std::f64::consts::PI;

/// Standard gravity, m/s^2.
pub const G0: f64 = crate::atmosphere::G0;

/// Smallest trimmed lift coefficient treated as a trim: below it the aircraft would have to
/// dive at an unbounded speed to balance (0.02 on a model of 15 g/dm^2 is already about
/// 35 m/s).
pub const MIN_TRIM_CL: f64 = 0.02;

/// Number of strips used for the spanwise averages (midpoint rule).
const STRIPS: usize = 400;

/// A surface reduced to an equivalent straight wing.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct EquivalentSurface {
    /// Planform geometry.
    pub geometry: PlanformGeometry,
    /// Incidence of the root chord to the fuselage datum, rad.
    pub incidence_rad: f64,
    /// Strip-averaged zero-lift angle relative to the root chord (section zero-lift angle minus
    /// local twist), rad.
    pub alpha_zero_lift_rad: f64,
    /// Chord-squared-weighted mean cm about the aerodynamic centre (on the surface's MAC).
    pub cm_ac: f64,
    /// Chord-weighted section lift slope, per rad.
    pub section_cl_alpha_per_rad: f64,
    /// Chord-weighted section cl_max.
    pub section_cl_max: f64,
    /// Smallest section cl_max anywhere on the span.
    pub section_cl_max_min: f64,
    /// Finite-surface lift slope by Helmbold's equation, per rad.
    pub lift_slope_per_rad: f64,
    /// x of the aerodynamic centre (MAC quarter chord), m.
    pub x_ac_m: f64,
    /// Area that acts in pitch, m^2: the true (in-plane) area times cos^2 of the mean dihedral,
    /// which is the projected area times the cosine (the V-tail projection of Purser and
    /// Campbell, NACA Report 823, 1945); equal to the area of a flat surface.
    pub pitch_area_m2: f64,
    /// Aspect ratio of the true (in-plane) span and area (the projected one for a flat
    /// surface).
    pub true_aspect_ratio: f64,
}

impl EquivalentSurface {
    /// Helmbold lift slope on the true (in-plane) aspect ratio, per rad: the slope that goes
    /// with [`EquivalentSurface::pitch_area_m2`].
    pub fn pitch_lift_slope_per_rad(&self) -> f64 {
        helmbold_lift_slope(self.section_cl_alpha_per_rad, self.true_aspect_ratio)
    }
}

/// Helmbold's lift slope for aspect ratio `aspect_ratio` and section slope `a0_per_rad`, per rad.
pub fn helmbold_lift_slope(a0_per_rad: f64, aspect_ratio: f64) -> f64 {
    let k = a0_per_rad / (PI * aspect_ratio);
    a0_per_rad / ((1.0 + k * k).sqrt() + k)
}

/// Reduce `surface` to an equivalent straight wing, with `sections[i]` the section model of
/// airfoil id `i`.
pub fn equivalent_surface(surface: &Surface, sections: &[SectionModel]) -> EquivalentSurface {
    let geometry = planform::geometry(surface);
    let s_total = planform::half_span_length_m(surface);
    let mut w_c = 0.0;
    let mut w_c2 = 0.0;
    let (mut a0, mut cm, mut slope, mut clmax) = (0.0, 0.0, 0.0, 0.0);
    let mut clmax_min = f64::INFINITY;
    let mut y_prev = 0.0;
    let mids = planform::stations_at(
        surface,
        (0..STRIPS).map(|i| s_total * (i as f64 + 0.5) / STRIPS as f64),
    );
    let ends = planform::stations_at(
        surface,
        (0..STRIPS).map(|i| s_total * (i as f64 + 1.0) / STRIPS as f64),
    );
    for (st, end) in mids.iter().zip(&ends) {
        let y_end = end.y_m;
        let dy = y_end - y_prev;
        y_prev = y_end;
        let sec = section_at(sections, st);
        let c = st.chord_m;
        w_c += c * dy;
        w_c2 += c * c * dy;
        a0 += (sec.alpha_zero_lift_rad - st.twist_rad) * c * dy;
        slope += sec.cl_alpha_per_rad * c * dy;
        clmax += sec.cl_max * c * dy;
        cm += sec.cm_ac * c * c * dy;
        clmax_min = clmax_min.min(sec.cl_max);
    }
    let safe = |n: f64, d: f64| if d > 0.0 { n / d } else { 0.0 };
    let section_cl_alpha = safe(slope, w_c);
    // cos of the mean dihedral = projected area / true area (exact for one straight panel).
    let true_area = planform::true_area_m2(surface);
    let cos_dihedral = safe(geometry.area_m2, true_area).min(1.0);
    let pitch_area = geometry.area_m2 * cos_dihedral;
    let true_span = 2.0 * s_total;
    let true_aspect_ratio = safe(true_span * true_span, true_area);
    EquivalentSurface {
        geometry,
        incidence_rad: surface.incidence_rad,
        alpha_zero_lift_rad: safe(a0, w_c),
        cm_ac: safe(cm, w_c2),
        section_cl_alpha_per_rad: section_cl_alpha,
        section_cl_max: safe(clmax, w_c),
        section_cl_max_min: if clmax_min.is_finite() {
            clmax_min
        } else {
            0.0
        },
        lift_slope_per_rad: helmbold_lift_slope(section_cl_alpha, geometry.aspect_ratio),
        x_ac_m: geometry.mac_quarter_x_m(),
        pitch_area_m2: pitch_area,
        true_aspect_ratio,
    }
}

/// The section model at a span station: the blend of the panel's end airfoils.
pub fn section_at(sections: &[SectionModel], st: &planform::SpanStation) -> SectionModel {
    let a = &sections[st.airfoil_inboard.0];
    let b = &sections[st.airfoil_outboard.0];
    a.blend(b, st.airfoil_weight)
}

/// Whether the stabiliser is a tail or a canard, for the downwash treatment.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum StabiliserPlace {
    /// Behind the wing, in its downwash.
    Tail,
    /// Ahead of the wing, outside its downwash.
    Canard,
}

/// Inputs of the closed-form estimate.
#[derive(Debug, Clone, Copy)]
pub struct EstimateInput<'a> {
    /// The wing.
    pub wing: &'a EquivalentSurface,
    /// The stabiliser, if any.
    pub stabiliser: Option<(&'a EquivalentSurface, StabiliserPlace)>,
    /// Total mass, kg.
    pub mass_kg: f64,
    /// CG, m aft of the datum.
    pub cg_x_m: f64,
    /// Air density, kg/m^3.
    pub density_kg_m3: f64,
    /// Fuselage contribution to dCm/dalpha, per rad (0 without a fuselage); see
    /// [`crate::stability::fuselage`].
    pub fuselage_cm_alpha_per_rad: f64,
    /// Stabiliser dynamic-pressure ratio eta (tail efficiency; 1 without a stabiliser).
    pub stabiliser_dynamic_pressure_ratio: f64,
    /// Multiplier on the downwash gradient 2 a_w / (pi A) (1 for the estimate itself; the
    /// neutral-point uncertainty varies it, see [`super::uncertainty`]).
    pub downwash_factor: f64,
}

/// Trim state from the closed-form estimate.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ClassicalTrim {
    /// Fuselage-datum angle of attack, rad.
    pub alpha_body_rad: f64,
    /// Total lift coefficient on the wing area.
    pub cl: f64,
    /// Stabiliser lift coefficient on its own area.
    pub stabiliser_cl: f64,
    /// Trim speed, m/s.
    pub speed_m_s: f64,
}

/// Results of the closed-form estimate.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ClassicalEstimate {
    /// Wing lift slope (Helmbold), per rad.
    pub wing_lift_slope_per_rad: f64,
    /// Whole-aircraft lift slope on the wing area, per rad of body angle.
    pub aircraft_lift_slope_per_rad: f64,
    /// Downwash gradient at the tail (0 for canard and tailless).
    pub downwash_gradient: f64,
    /// Neutral point, m aft of the datum.
    pub neutral_point_x_m: f64,
    /// Static margin, fraction of MAC (positive is stable).
    pub static_margin: f64,
    /// dCm/dalpha about the CG, per rad.
    pub cm_alpha_per_rad: f64,
    /// Pitching moment about the CG at zero body angle.
    pub cm_zero: f64,
    /// Trim, when the aircraft is stable and trims at positive lift.
    pub trim: Option<ClassicalTrim>,
    /// Aircraft CL_max estimate.
    pub cl_max: f64,
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
}

/// Lift (on the wing area) and moment about `x_m` (on wing area and MAC) as linear functions
/// `value = v0 + v_alpha * alpha_body` of the body angle.
struct Linear {
    cl0: f64,
    cl_a: f64,
    cm0: f64,
    cm_a: f64,
    stab_cl0: f64,
    stab_cl_a: f64,
}

fn linear_model(input: &EstimateInput<'_>, x_ref_m: f64, downwash_gradient: f64) -> Linear {
    let w = input.wing;
    let c = w.geometry.mac_m;
    let s = w.geometry.area_m2;
    let a_w = w.lift_slope_per_rad;
    // Wing: CL_w = a_w (alpha_b + i_w - alpha0_w)
    let clw0 = a_w * (w.incidence_rad - w.alpha_zero_lift_rad);
    let arm_w = (x_ref_m - w.x_ac_m) / c;
    let mut out = Linear {
        cl0: clw0,
        cl_a: a_w,
        cm0: w.cm_ac + clw0 * arm_w,
        cm_a: a_w * arm_w,
        stab_cl0: 0.0,
        stab_cl_a: 0.0,
    };
    if let Some((t, _)) = input.stabiliser {
        let a_t = t.pitch_lift_slope_per_rad();
        let ratio = input.stabiliser_dynamic_pressure_ratio * t.pitch_area_m2 / s;
        // Downwash eps = (d eps/d alpha) CL_w / a_w.
        let e0 = downwash_gradient * clw0 / a_w;
        let ct0 = a_t * (t.incidence_rad - t.alpha_zero_lift_rad - e0);
        let ct_a = a_t * (1.0 - downwash_gradient);
        let arm_t = (x_ref_m - t.x_ac_m) / c;
        out.cl0 += ratio * ct0;
        out.cl_a += ratio * ct_a;
        out.cm0 += ratio * (ct0 * arm_t + t.cm_ac * t.geometry.mac_m / c);
        out.cm_a += ratio * ct_a * arm_t;
        out.stab_cl0 = ct0;
        out.stab_cl_a = ct_a;
    }
    out
}

/// Run the closed-form estimate.
pub fn estimate(input: &EstimateInput<'_>) -> ClassicalEstimate {
    let w = input.wing;
    let a_w = w.lift_slope_per_rad;
    let downwash_gradient = match input.stabiliser {
        Some((_, StabiliserPlace::Tail)) => {
            input.downwash_factor * 2.0 * a_w / (PI * w.geometry.aspect_ratio)
        }
        _ => 0.0,
    };
    let neutral_point_x_m = match input.stabiliser {
        None => w.x_ac_m,
        Some((t, _)) => {
            let k = input.stabiliser_dynamic_pressure_ratio * t.pitch_area_m2 / w.geometry.area_m2
                * t.pitch_lift_slope_per_rad()
                * (1.0 - downwash_gradient);
            (a_w * w.x_ac_m + k * t.x_ac_m) / (a_w + k)
        }
    };
    let mut lin = linear_model(input, input.cg_x_m, downwash_gradient);
    // The fuselage adds pitch-up stiffness: Cm_alpha grows by dCm_f, which moves the neutral
    // point forward by c dCm_f / CL_alpha.
    lin.cm_a += input.fuselage_cm_alpha_per_rad;
    let neutral_point_x_m =
        neutral_point_x_m - w.geometry.mac_m * input.fuselage_cm_alpha_per_rad / lin.cl_a;

    let static_margin = (neutral_point_x_m - input.cg_x_m) / w.geometry.mac_m;
    let weight_n = input.mass_kg * G0;
    let q_s = |cl: f64| (2.0 * weight_n / (input.density_kg_m3 * w.geometry.area_m2 * cl)).sqrt();
    let trim = if lin.cm_a < 0.0 {
        let alpha = -lin.cm0 / lin.cm_a;
        let cl = lin.cl0 + lin.cl_a * alpha;
        (cl > MIN_TRIM_CL).then(|| ClassicalTrim {
            alpha_body_rad: alpha,
            cl,
            stabiliser_cl: lin.stab_cl0 + lin.stab_cl_a * alpha,
            speed_m_s: q_s(cl),
        })
    } else {
        None
    };
    let cl_max = 0.9 * w.section_cl_max;
    ClassicalEstimate {
        wing_lift_slope_per_rad: a_w,
        aircraft_lift_slope_per_rad: lin.cl_a,
        downwash_gradient,
        neutral_point_x_m,
        static_margin,
        cm_alpha_per_rad: lin.cm_a,
        cm_zero: lin.cm0,
        trim,
        cl_max,
        stall_speed_m_s: q_s(cl_max),
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    // Helmbold's equation tends to the Prandtl elliptic result a0/(1 + a0/(pi A)) at large A
    // and to pi A / 2 (slender-wing theory) as A -> 0.
    #[test]
    fn helmbold_limits() {
        let a0 = 2.0 * PI;
        let big = 200.0;
        assert_relative_eq!(
            helmbold_lift_slope(a0, big),
            a0 / (1.0 + a0 / (PI * big)),
            max_relative = 1e-4
        );
        let small = 0.01;
        assert_relative_eq!(
            helmbold_lift_slope(a0, small),
            PI * small / 2.0,
            max_relative = 1e-3
        );
    }
}
