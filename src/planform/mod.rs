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

/// Horizontal tail (or canard) volume coefficient and arm.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TailVolume {
    /// Distance from the wing's MAC quarter chord to the stabiliser's MAC quarter chord, m
    /// (positive for a tail behind the wing, negative for a canard).
    pub arm_m: f64,
    /// V_H = S_h l_h / (S_w c_w); negative for a canard.
    pub coefficient: f64,
}

/// Tail volume of `stab` relative to `wing`.
pub fn tail_volume(wing: &PlanformGeometry, stab: &PlanformGeometry) -> TailVolume {
    let arm_m = stab.mac_quarter_x_m() - wing.mac_quarter_x_m();
    TailVolume {
        arm_m,
        coefficient: stab.area_m2 * arm_m / (wing.area_m2 * wing.mac_m),
    }
}

/// A stabiliser whose projected area is less than this share of its area in its own plane
/// (a mean dihedral above about 10 deg) is treated as a V-tail: it is described as one, and
/// it is the aircraft's fin.
pub const VEE_TAIL_AREA_RATIO: f64 = 0.985;

/// True when `surface` (a stabiliser) is a V-tail in the sense of [`VEE_TAIL_AREA_RATIO`].
pub fn is_vee_tail(surface: &Surface) -> bool {
    let true_area = true_area_m2(surface);
    true_area > 0.0 && geometry(surface).area_m2 / true_area < VEE_TAIL_AREA_RATIO
}

/// The side (yaw) area of a surface with dihedral, both halves, m^2: each panel's area in its
/// own plane times sin^2 of its dihedral (the V-tail projection of Purser and Campbell, NACA
/// Report 823, 1945: a V-tail acts in yaw as a fin of about this area, as it acts in pitch as
/// a flat tail of area times cos^2). Zero for a flat surface.
pub fn side_area_m2(surface: &Surface) -> f64 {
    match &surface.shape {
        SurfaceShape::Panels(panels) => panels
            .iter()
            .map(|p| p.span_m * (p.root_chord_m + p.tip_chord_m) * p.dihedral_rad.sin().powi(2))
            .sum(),
        SurfaceShape::Elliptic(e) => {
            0.5 * std::f64::consts::PI
                * e.root_chord_m
                * e.semispan_m
                * e.dihedral_rad.sin().powi(2)
        }
    }
}

/// Geometry of a fin: one trapezoid standing on the centre line.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct FinGeometry {
    /// Area, m^2 (one side: the fin is not mirrored).
    pub area_m2: f64,
    /// Mean aerodynamic chord, m.
    pub mac_m: f64,
    /// x of the MAC's leading edge, m aft of the datum.
    pub mac_le_x_m: f64,
    /// z of the MAC, m above the datum line.
    pub mac_z_m: f64,
}

impl FinGeometry {
    /// x of the MAC quarter-chord point, m.
    pub fn mac_quarter_x_m(&self) -> f64 {
        self.mac_le_x_m + 0.25 * self.mac_m
    }
}

/// The fin's area and MAC: the trapezoid's MAC `(2/3) c_r (1 + l + l^2)/(1 + l)` at
/// `(h/3) (1 + 2 l)/(1 + l)` above the root, `l` the taper (Raymer sec. 7.3, as for a half
/// wing), its leading edge that height times tan(sweep) aft of the root leading edge.
pub fn fin_geometry(fin: &crate::model::Fin) -> FinGeometry {
    let (cr, ct, h) = (fin.root_chord_m, fin.tip_chord_m, fin.height_m);
    let taper = if cr > 0.0 { ct / cr } else { 0.0 };
    let z_mac = h / 3.0 * (1.0 + 2.0 * taper) / (1.0 + taper);
    FinGeometry {
        area_m2: 0.5 * (cr + ct) * h,
        mac_m: 2.0 / 3.0 * cr * (1.0 + taper + taper * taper) / (1.0 + taper),
        mac_le_x_m: fin.root_le_x_m + z_mac * fin.sweep_le_rad.tan(),
        mac_z_m: fin.root_z_m + z_mac,
    }
}

/// The vertical tail (fin) volume coefficient `V_v = S_v l_v / (S b)`, with `l_v` from the
/// wing's MAC quarter chord to the fin's (`arm_m`), on the wing's area and span (Raymer,
/// *Aircraft Design: A Conceptual Approach*, sec. 6.4, eq. 6.29, the vertical tail volume
/// coefficient; equation number from memory).
pub fn fin_volume_coefficient(wing: &PlanformGeometry, side_area_m2: f64, arm_m: f64) -> f64 {
    side_area_m2 * arm_m / (wing.area_m2 * wing.span_m)
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The panel walk as it was before each panel's trigonometry was kept (the reference for
    /// the test below).
    fn old_station_at(surface: &Surface, s_m: f64) -> SpanStation {
        match &surface.shape {
            SurfaceShape::Panels(panels) => {
                let total: f64 = panels.iter().map(|p| p.span_m).sum();
                let s_target = s_m.clamp(0.0, total);
                let (mut x0, mut y0, mut z0, mut s0, mut twist0) =
                    (surface.root_le_x_m, 0.0, surface.root_le_z_m, 0.0, 0.0);
                for (i, p) in panels.iter().enumerate() {
                    let last = i + 1 == panels.len();
                    if s_target <= s0 + p.span_m || last {
                        let eta = if p.span_m > 0.0 {
                            ((s_target - s0) / p.span_m).clamp(0.0, 1.0)
                        } else {
                            0.0
                        };
                        let y_panel = p.span_m * p.dihedral_rad.cos();
                        return SpanStation {
                            s_m: s_target,
                            y_m: y0 + eta * y_panel,
                            x_le_m: x0 + eta * y_panel * p.sweep_le_rad.tan(),
                            z_m: z0 + eta * p.span_m * p.dihedral_rad.sin(),
                            chord_m: p.root_chord_m + eta * (p.tip_chord_m - p.root_chord_m),
                            twist_rad: twist0 + eta * (p.tip_twist_rad - twist0),
                            dihedral_rad: p.dihedral_rad,
                            airfoil_inboard: p.root_airfoil,
                            airfoil_outboard: p.tip_airfoil,
                            airfoil_weight: eta,
                        };
                    }
                    let y_panel = p.span_m * p.dihedral_rad.cos();
                    x0 += y_panel * p.sweep_le_rad.tan();
                    y0 += y_panel;
                    z0 += p.span_m * p.dihedral_rad.sin();
                    s0 += p.span_m;
                    twist0 = p.tip_twist_rad;
                }
                unreachable_station(surface)
            }
            SurfaceShape::Elliptic(_) => elliptic_station(surface, s_m),
        }
    }

    // `station_at` walks the panels computing each panel's trigonometry once, and
    // `stations_at` shares that walk: both must give the same bits as the walk they replaced,
    // on the example aircraft's surfaces, at the root, the joins, the tip, beyond both ends
    // and in between. No outside source: a refactoring must not change the numbers.
    #[test]
    fn station_walk_gives_the_same_bits_as_before() {
        let examples = [
            include_str!("../../aircraft/larkspire-2000.toml"),
            include_str!("../../aircraft/merrowtail-1700.toml"),
            include_str!("../../aircraft/skerrywing-900.toml"),
            include_str!("../../aircraft/wrenfield-1400.toml"),
        ];
        let mut compared = 0;
        for text in examples {
            let ac = crate::input::parse_aircraft(text, "example.toml", None).unwrap();
            let mut surfaces = vec![ac.wing.clone()];
            surfaces.extend(ac.stabiliser.iter().map(|s| s.surface.clone()));
            for surface in &surfaces {
                let total = half_span_length_m(surface);
                let mut s: Vec<f64> = (0..=300)
                    .map(|k| total * (k as f64 / 250.0 - 0.1))
                    .collect();
                s.extend(break_points_m(surface));
                let batch = stations_at(surface, s.iter().copied());
                for (x, b) in s.iter().zip(&batch) {
                    let old = old_station_at(surface, *x);
                    assert_eq!(station_at(surface, *x), old);
                    assert_eq!(*b, old);
                    compared += 1;
                }
            }
        }
        assert!(compared > 2000);
    }
    use crate::model::{EllipticShape, Panel};
    use approx::assert_relative_eq;

    fn panel(span: f64, cr: f64, ct: f64, sweep_deg: f64) -> Panel {
        Panel {
            span_m: span,
            root_chord_m: cr,
            tip_chord_m: ct,
            sweep_le_rad: sweep_deg.to_radians(),
            dihedral_rad: 0.0,
            tip_twist_rad: 0.0,
            root_airfoil: AirfoilId(0),
            tip_airfoil: AirfoilId(0),
        }
    }

    fn surface(shape: SurfaceShape) -> Surface {
        Surface {
            name: "wing".into(),
            root_le_x_m: 0.1,
            root_le_z_m: 0.0,
            incidence_rad: 0.0,
            shape,
        }
    }

    #[test]
    fn two_equal_panels_give_the_one_panel_answer() {
        let one = geometry(&surface(SurfaceShape::Panels(vec![panel(
            1.0, 0.3, 0.2, 5.0,
        )])));
        let two = geometry(&surface(SurfaceShape::Panels(vec![
            panel(0.5, 0.3, 0.25, 5.0),
            panel(0.5, 0.25, 0.2, 5.0),
        ])));
        assert_relative_eq!(one.mac_m, two.mac_m, epsilon = 1e-12);
        assert_relative_eq!(one.mac_le_x_m, two.mac_le_x_m, epsilon = 1e-12);
        assert_relative_eq!(one.area_m2, two.area_m2, epsilon = 1e-12);
    }

    #[test]
    fn elliptic_station_chord_follows_the_ellipse() {
        let s = surface(SurfaceShape::Elliptic(EllipticShape {
            semispan_m: 1.0,
            root_chord_m: 0.2,
            dihedral_rad: 0.0,
            tip_twist_rad: 0.0,
            root_airfoil: AirfoilId(0),
            tip_airfoil: AirfoilId(0),
        }));
        let st = station_at(&s, 0.6);
        assert_relative_eq!(st.chord_m, 0.2 * 0.8, epsilon = 1e-12);
        // quarter-chord line straight: x_le + c/4 constant
        assert_relative_eq!(st.x_le_m + 0.25 * st.chord_m, 0.1 + 0.05, epsilon = 1e-12);
    }
}

/// Where two surfaces overlap in the top view: at the spanwise position `y_m` their chords
/// share some x, and there they are `gap_m` apart vertically; `chord_m` is the shorter of
/// the two chords there.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlanOverlap {
    /// Spanwise position, m.
    pub y_m: f64,
    /// Vertical distance between the two surfaces' chord lines there, m.
    pub gap_m: f64,
    /// The shorter chord there, m.
    pub chord_m: f64,
}

/// The point where `a` and `b` overlap in the top view with the smallest vertical gap
/// relative to the chord, or `None` when one lies wholly ahead of or behind the other at
/// every spanwise position both reach. Sampled at 200 stations along each half-span.
pub fn plan_overlap(a: &Surface, b: &Surface) -> Option<PlanOverlap> {
    const SAMPLES: usize = 200;
    let sample = |s: &Surface| -> Vec<SpanStation> {
        let total = half_span_length_m(s);
        stations_at(s, (0..=SAMPLES).map(|k| total * k as f64 / SAMPLES as f64))
    };
    // Linear interpolation of (x_le, chord, z) at y along stations sorted by y, in the first
    // window holding y. The search starts at `from`, the window found for the last (smaller)
    // y: where the stations' y never decrease, no window before it can hold a larger y, so
    // the window is the same as a search from the root finds (elsewhere `from` stays 0).
    let at = |st: &[SpanStation], y: f64, from: &mut Option<usize>| -> Option<(f64, f64, f64)> {
        let start = from.unwrap_or(0);
        let i = start
            + st[start..]
                .windows(2)
                .position(|w| w[0].y_m <= y && y <= w[1].y_m)?;
        if let Some(f) = from {
            *f = i;
        }
        let (p, q) = (&st[i], &st[i + 1]);
        let t = if q.y_m > p.y_m {
            (y - p.y_m) / (q.y_m - p.y_m)
        } else {
            0.0
        };
        let lerp = |u: f64, v: f64| u + (v - u) * t;
        Some((
            lerp(p.x_le_m, q.x_le_m),
            lerp(p.chord_m, q.chord_m),
            lerp(p.z_m, q.z_m),
        ))
    };
    let (sa, sb) = (sample(a), sample(b));
    let y_max = sa.last()?.y_m.min(sb.last()?.y_m);
    let mut best: Option<PlanOverlap> = None;
    let sorted = |st: &[SpanStation]| st.windows(2).all(|w| w[0].y_m <= w[1].y_m);
    let (mut from_a, mut from_b) = (sorted(&sa).then_some(0), sorted(&sb).then_some(0));
    for k in 0..=SAMPLES {
        let y = y_max * k as f64 / SAMPLES as f64;
        let (Some((xa, ca, za)), Some((xb, cb, zb))) =
            (at(&sa, y, &mut from_a), at(&sb, y, &mut from_b))
        else {
            continue;
        };
        let overlaps = xa < xb + cb && xb < xa + ca;
        let chord_m = ca.min(cb);
        if overlaps && chord_m > 0.0 {
            let candidate = PlanOverlap {
                y_m: y,
                gap_m: (za - zb).abs(),
                chord_m,
            };
            if best.is_none_or(|o| candidate.gap_m / chord_m < o.gap_m / o.chord_m) {
                best = Some(candidate);
            }
        }
    }
    best
}

/// Area of the surface in its own plane (both halves), m^2: each panel's span along its
/// dihedral times its mean chord. Equals the projected area of a flat surface; a V-tail's is
/// larger by 1 / cos(dihedral).
pub fn true_area_m2(surface: &Surface) -> f64 {
    match &surface.shape {
        SurfaceShape::Panels(panels) => panels
            .iter()
            .map(|p| p.span_m * (p.root_chord_m + p.tip_chord_m))
            .sum(),
        SurfaceShape::Elliptic(e) => 0.5 * std::f64::consts::PI * e.root_chord_m * e.semispan_m,
    }
}
