//! Planform geometry of a lifting surface: area, span, aspect ratio, taper, mean aerodynamic
//! chord, and the shape at any spanwise station.
//!
//! All integrals are exact. For trapezoidal panels the integrands (c, c^2, c x_LE, c y) are
//! polynomials of degree two or less in y, so Simpson's rule over each panel is exact; the
//! elliptic planform uses closed forms.
//!
//! Conventions: `s` is the distance along the half-span measured in the surface's own plane
//! (along the dihedral), from the root; `y` is its projection on the horizontal (spanwise)
//! axis. Sweep is measured in the top view: a panel's tip leading edge is `y_panel tan(sweep)`
//! aft of its root leading edge, where `y_panel` is the panel's projected span.
//!
//! # References
//! - D. P. Raymer, *Aircraft Design: A Conceptual Approach*, 6th ed., sec. 7.3 (mean
//!   aerodynamic chord of a trapezoidal wing, its spanwise and chordwise position).
//! - The MAC is the chord-squared-weighted mean, c_bar = (2/S) integral c^2 dy over the
//!   half-span; its leading edge is the chord-weighted mean of x_LE (same source).

use crate::model::{AirfoilId, Panel, Surface, SurfaceShape};

mod overlap;
mod tail;

pub use overlap::{plan_overlap, PlanOverlap};
pub use tail::{
    fin_geometry, fin_volume_coefficient, is_vee_tail, side_area_m2, tail_volume, true_area_m2,
    FinGeometry, TailVolume, VEE_TAIL_AREA_RATIO,
};

/// Geometric summary of one symmetric surface (both halves).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlanformGeometry {
    /// Projected area of both halves, m^2.
    pub area_m2: f64,
    /// Projected tip-to-tip span, m.
    pub span_m: f64,
    /// Aspect ratio b^2 / S.
    pub aspect_ratio: f64,
    /// Tip chord / root chord.
    pub taper: f64,
    /// Root chord, m.
    pub root_chord_m: f64,
    /// Mean aerodynamic chord length, m.
    pub mac_m: f64,
    /// x of the MAC leading edge, m aft of the datum.
    pub mac_le_x_m: f64,
    /// Spanwise (y) position of the MAC, m from the centre line.
    pub mac_y_m: f64,
    /// z of the MAC leading edge, m.
    pub mac_le_z_m: f64,
}

impl PlanformGeometry {
    /// x of the MAC quarter-chord point, m.
    pub fn mac_quarter_x_m(&self) -> f64 {
        self.mac_le_x_m + 0.25 * self.mac_m
    }

    /// A position x (m) expressed in percent of MAC aft of the MAC leading edge.
    pub fn percent_mac(&self, x_m: f64) -> f64 {
        100.0 * (x_m - self.mac_le_x_m) / self.mac_m
    }
}

/// The surface's shape at one spanwise station.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpanStation {
    /// Distance along the half-span in the surface's plane, m.
    pub s_m: f64,
    /// Projected spanwise position, m (starboard positive).
    pub y_m: f64,
    /// x of the leading edge, m aft of the datum.
    pub x_le_m: f64,
    /// z of the leading edge, m.
    pub z_m: f64,
    /// Chord, m.
    pub chord_m: f64,
    /// Geometric twist relative to the surface's root chord, rad (not including incidence).
    pub twist_rad: f64,
    /// Local dihedral angle of the surface here, rad.
    pub dihedral_rad: f64,
    /// Airfoil at the inboard end of the panel holding this station.
    pub airfoil_inboard: AirfoilId,
    /// Airfoil at the outboard end of the panel.
    pub airfoil_outboard: AirfoilId,
    /// Blend weight of the outboard airfoil, 0 at the panel's inboard end, 1 at its tip.
    pub airfoil_weight: f64,
}

/// Total length of the half-span measured in the surface plane, m.
pub fn half_span_length_m(surface: &Surface) -> f64 {
    match &surface.shape {
        SurfaceShape::Panels(panels) => panels.iter().map(|p| p.span_m).sum(),
        SurfaceShape::Elliptic(e) => e.semispan_m,
    }
}

/// The in-plane positions `s` (m) of the root, of every panel join and of the tip.
/// Lifting-line discretisations cluster stations toward these points.
pub fn break_points_m(surface: &Surface) -> Vec<f64> {
    match &surface.shape {
        SurfaceShape::Panels(panels) => {
            let mut out = Vec::with_capacity(panels.len() + 1);
            let mut s = 0.0;
            out.push(s);
            for p in panels {
                s += p.span_m;
                out.push(s);
            }
            out
        }
        SurfaceShape::Elliptic(e) => vec![0.0, e.semispan_m],
    }
}

/// The surface at in-plane distance `s_m` from the root (clamped to the half-span).
pub fn station_at(surface: &Surface, s_m: f64) -> SpanStation {
    match &surface.shape {
        SurfaceShape::Panels(panels) => {
            let total: f64 = panels.iter().map(|p| p.span_m).sum();
            let s_target = s_m.clamp(0.0, total);
            let last = panels.len().saturating_sub(1);
            panel_walk(surface, panels)
                .find(|w| s_target <= w.s0 + w.panel.span_m || w.index == last)
                .map_or_else(|| unreachable_station(surface), |w| w.station(s_target))
        }
        SurfaceShape::Elliptic(_) => elliptic_station(surface, s_m),
    }
}

/// The stations at each in-plane distance of `s_m` (m from the root, clamped to the
/// half-span): the same as [`station_at`] at each, with each panel's trigonometry computed
/// once for all of them.
pub fn stations_at(surface: &Surface, s_m: impl Iterator<Item = f64>) -> Vec<SpanStation> {
    match &surface.shape {
        SurfaceShape::Panels(panels) => {
            let total: f64 = panels.iter().map(|p| p.span_m).sum();
            let walk: Vec<PanelWalk<'_>> = panel_walk(surface, panels).collect();
            let last = panels.len().saturating_sub(1);
            s_m.map(|s| {
                let s_target = s.clamp(0.0, total);
                walk.iter()
                    .find(|w| s_target <= w.s0 + w.panel.span_m || w.index == last)
                    .map_or_else(|| unreachable_station(surface), |w| w.station(s_target))
            })
            .collect()
        }
        SurfaceShape::Elliptic(_) => s_m.map(|s| elliptic_station(surface, s)).collect(),
    }
}

/// One panel as the walk from the root reaches it: where it starts (leading edge, in-plane
/// distance, twist) and its trigonometry.
#[derive(Debug, Clone, Copy)]
struct PanelWalk<'a> {
    index: usize,
    panel: &'a Panel,
    x0: f64,
    y0: f64,
    z0: f64,
    s0: f64,
    twist0: f64,
    /// Projected span of the panel, m.
    y_panel: f64,
    tan_sweep: f64,
    sin_dihedral: f64,
}

impl PanelWalk<'_> {
    /// The station at in-plane distance `s_target` (already clamped) on this panel.
    fn station(&self, s_target: f64) -> SpanStation {
        let p = self.panel;
        let eta = if p.span_m > 0.0 {
            ((s_target - self.s0) / p.span_m).clamp(0.0, 1.0)
        } else {
            0.0
        };
        SpanStation {
            s_m: s_target,
            y_m: self.y0 + eta * self.y_panel,
            x_le_m: self.x0 + eta * self.y_panel * self.tan_sweep,
            z_m: self.z0 + eta * p.span_m * self.sin_dihedral,
            chord_m: p.root_chord_m + eta * (p.tip_chord_m - p.root_chord_m),
            twist_rad: self.twist0 + eta * (p.tip_twist_rad - self.twist0),
            dihedral_rad: p.dihedral_rad,
            airfoil_inboard: p.root_airfoil,
            airfoil_outboard: p.tip_airfoil,
            airfoil_weight: eta,
        }
    }
}

/// The panels from root to tip with where each starts, its trigonometry computed as it is
/// reached.
fn panel_walk<'a>(surface: &Surface, panels: &'a [Panel]) -> impl Iterator<Item = PanelWalk<'a>> {
    let mut start = (surface.root_le_x_m, 0.0, surface.root_le_z_m, 0.0, 0.0);
    panels.iter().enumerate().map(move |(index, p)| {
        let (x0, y0, z0, s0, twist0) = start;
        let y_panel = p.span_m * p.dihedral_rad.cos();
        let tan_sweep = p.sweep_le_rad.tan();
        let sin_dihedral = p.dihedral_rad.sin();
        start = (
            x0 + y_panel * tan_sweep,
            y0 + y_panel,
            z0 + p.span_m * sin_dihedral,
            s0 + p.span_m,
            p.tip_twist_rad,
        );
        PanelWalk {
            index,
            panel: p,
            x0,
            y0,
            z0,
            s0,
            twist0,
            y_panel,
            tan_sweep,
            sin_dihedral,
        }
    })
}

/// The station of an elliptic surface at in-plane distance `s_m`.
fn elliptic_station(surface: &Surface, s_m: f64) -> SpanStation {
    match &surface.shape {
        SurfaceShape::Elliptic(e) => {
            let s = s_m.clamp(0.0, e.semispan_m);
            let eta = s / e.semispan_m;
            let chord_m = e.root_chord_m * (1.0 - eta * eta).max(0.0).sqrt();
            SpanStation {
                s_m: s,
                y_m: s * e.dihedral_rad.cos(),
                x_le_m: surface.root_le_x_m + 0.25 * (e.root_chord_m - chord_m),
                z_m: surface.root_le_z_m + s * e.dihedral_rad.sin(),
                chord_m,
                twist_rad: eta * e.tip_twist_rad,
                dihedral_rad: e.dihedral_rad,
                airfoil_inboard: e.root_airfoil,
                airfoil_outboard: e.tip_airfoil,
                airfoil_weight: eta,
            }
        }
        SurfaceShape::Panels(_) => station_at(surface, s_m),
    }
}

/// A surface with no panels has no stations; validation in [`crate::input`] prevents it, and
/// this returns a zero-chord root station rather than panicking.
fn unreachable_station(surface: &Surface) -> SpanStation {
    SpanStation {
        s_m: 0.0,
        y_m: 0.0,
        x_le_m: surface.root_le_x_m,
        z_m: surface.root_le_z_m,
        chord_m: 0.0,
        twist_rad: 0.0,
        dihedral_rad: 0.0,
        airfoil_inboard: AirfoilId(0),
        airfoil_outboard: AirfoilId(0),
        airfoil_weight: 0.0,
    }
}

/// Integrals over the half-span of c, c^2, c x_LE, c y and c z (all with respect to the
/// projected y).
#[derive(Debug, Clone, Copy, Default)]
struct ChordMoments {
    c: f64,
    c2: f64,
    c_xle: f64,
    c_y: f64,
    c_z: f64,
}

fn chord_moments(surface: &Surface) -> ChordMoments {
    match &surface.shape {
        SurfaceShape::Panels(_) => {
            let breaks = break_points_m(surface);
            let mut m = ChordMoments::default();
            for w in breaks.windows(2) {
                let (a, b) = (w[0], w[1]);
                let stations = [
                    station_at(surface, a),
                    station_at(surface, 0.5 * (a + b)),
                    station_at(surface, b),
                ];
                // Projected width of the panel; the inboard end of the panel is found just
                // outboard of the join so that panel-local values are used.
                let ya = panel_start(surface, a, b);
                let dy = stations[2].y_m - ya.y_m;
                let ends = [ya, stations[1], stations[2]];
                let simpson = |f: &dyn Fn(&SpanStation) -> f64| {
                    dy / 6.0 * (f(&ends[0]) + 4.0 * f(&ends[1]) + f(&ends[2]))
                };
                m.c += simpson(&|s| s.chord_m);
                m.c2 += simpson(&|s| s.chord_m * s.chord_m);
                m.c_xle += simpson(&|s| s.chord_m * s.x_le_m);
                m.c_y += simpson(&|s| s.chord_m * s.y_m);
                m.c_z += simpson(&|s| s.chord_m * s.z_m);
            }
            m
        }
        SurfaceShape::Elliptic(e) => {
            let cr = e.root_chord_m;
            let s = e.semispan_m;
            let cos_g = e.dihedral_rad.cos();
            let half_b = s * cos_g;
            // integral_0^b/2 sqrt(1 - (y/(b/2))^2) dy = pi b/8 ; of (1 - eta^2) = b/3;
            // of eta sqrt(1 - eta^2) (b/2)^2 d eta = (b/2)^2 / 3.
            let c = cr * std::f64::consts::PI * half_b / 4.0;
            let c2 = cr * cr * half_b * 2.0 / 3.0;
            let c_y = cr * half_b * half_b / 3.0;
            let x_root_quarter = surface.root_le_x_m + 0.25 * cr;
            ChordMoments {
                c,
                c2,
                c_xle: x_root_quarter * c - 0.25 * c2,
                c_y,
                c_z: surface.root_le_z_m * c + e.dihedral_rad.tan() * c_y,
            }
        }
    }
}

/// The station at the inboard end of the panel spanning `a..b` (the value just outboard of a
/// join, where chord and twist may jump).
fn panel_start(surface: &Surface, a: f64, b: f64) -> SpanStation {
    let mut st = station_at(surface, a);
    if let SurfaceShape::Panels(panels) = &surface.shape {
        // station_at(a) resolves a join to the inboard panel's tip; use the outboard panel's
        // root chord instead.
        let mut s0 = 0.0;
        for p in panels {
            if (s0 - a).abs() <= 1e-12 * (1.0 + b.abs()) {
                st.chord_m = p.root_chord_m;
                break;
            }
            s0 += p.span_m;
        }
    }
    st
}

/// The geometric summary of a surface.
pub fn geometry(surface: &Surface) -> PlanformGeometry {
    let m = chord_moments(surface);
    let half_area = m.c;
    let area_m2 = 2.0 * half_area;
    let tip = station_at(surface, half_span_length_m(surface));
    let root = panel_start(surface, 0.0, half_span_length_m(surface));
    let span_m = 2.0 * tip.y_m;
    let safe = |num: f64, den: f64| if den > 0.0 { num / den } else { 0.0 };
    PlanformGeometry {
        area_m2,
        span_m,
        aspect_ratio: safe(span_m * span_m, area_m2),
        taper: safe(tip.chord_m, root.chord_m),
        root_chord_m: root.chord_m,
        mac_m: safe(m.c2, m.c),
        mac_le_x_m: safe(m.c_xle, m.c),
        mac_y_m: safe(m.c_y, m.c),
        mac_le_z_m: safe(m.c_z, m.c),
    }
}

#[cfg(test)]
mod tests;
