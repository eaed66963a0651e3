//! Glide performance from a parabolic drag polar `CD = CD0 + CL^2 / (pi A e)`: best glide and
//! minimum sink, each limited by the aircraft's CL_max.
//!
//! Best glide is at `CL = sqrt(pi A e CD0)` with `(L/D)max = 1/2 sqrt(pi A e / CD0)`; minimum
//! sink at `CL = sqrt(3 pi A e CD0)`. When either CL exceeds the usable CL_max, the point is
//! taken at CL_max instead and flagged, since a model cannot fly beyond it.
//!
//! Span efficiency when no lifting-line value is available: Raymer's estimate for straight
//! wings, `e = 1.78 (1 - 0.045 A^0.68) - 0.64`.
//!
//! # References
//! - J. D. Anderson, *Introduction to Flight*, ch. 6 (parabolic polar, maximum L/D, minimum
//!   power and minimum sink conditions).
//! - D. P. Raymer, *Aircraft Design: A Conceptual Approach*, eq. 12.48 (Oswald efficiency).

use crate::atmosphere::G0;
use std::f64::consts::PI;

/// Raymer's Oswald span-efficiency estimate for a straight wing of aspect ratio `a`.
pub fn oswald_straight_wing(a: f64) -> f64 {
    1.78 * (1.0 - 0.045 * a.powf(0.68)) - 0.64
}

/// Inputs of the polar.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PolarInput {
    /// Zero-lift drag coefficient.
    pub cd0: f64,
    /// Aspect ratio.
    pub aspect_ratio: f64,
    /// Span efficiency.
    pub span_efficiency: f64,
    /// Mass, kg.
    pub mass_kg: f64,
    /// Wing area, m^2.
    pub area_m2: f64,
    /// Air density, kg/m^3.
    pub density_kg_m3: f64,
    /// Usable CL_max.
    pub cl_max: f64,
}

/// One point of steady gliding flight.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GlidePoint {
    /// Lift coefficient.
    pub cl: f64,
    /// Drag coefficient.
    pub cd: f64,
    /// Airspeed, m/s.
    pub speed_m_s: f64,
    /// Sink rate, m/s (positive down).
    pub sink_m_s: f64,
    /// Glide ratio L/D.
    pub glide_ratio: f64,
    /// True when the ideal point lay beyond CL_max and CL_max was used instead.
    pub limited_by_cl_max: bool,
}

/// Glide performance.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct GlidePerformance {
    /// Best glide.
    pub best_glide: GlidePoint,
    /// Minimum sink.
    pub min_sink: GlidePoint,
}

impl PolarInput {
    /// Induced-drag factor k in CD = CD0 + k CL^2.
    pub fn k(&self) -> f64 {
        1.0 / (PI * self.aspect_ratio * self.span_efficiency)
    }

    /// The glide point at lift coefficient `cl` (clamped to CL_max).
    pub fn point(&self, cl: f64) -> GlidePoint {
        let limited = cl > self.cl_max;
        let cl = cl.min(self.cl_max);
        let cd = self.cd0 + self.k() * cl * cl;
        let speed_m_s = (2.0 * self.mass_kg * G0 / (self.density_kg_m3 * self.area_m2 * cl)).sqrt();
        GlidePoint {
            cl,
            cd,
            speed_m_s,
            sink_m_s: speed_m_s * cd / cl,
            glide_ratio: cl / cd,
            limited_by_cl_max: limited,
        }
    }

    /// Best glide and minimum sink.
    pub fn performance(&self) -> GlidePerformance {
        let base = PI * self.aspect_ratio * self.span_efficiency * self.cd0;
        GlidePerformance {
            best_glide: self.point(base.sqrt()),
            min_sink: self.point((3.0 * base).sqrt()),
        }
    }
}
