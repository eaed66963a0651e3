//! The report's drawings as data: the top view (outlines of the surfaces, controls and
//! fuselage, with the MAC, CG and neutral point marked) and the side outlines.

use super::*;

/// The chord line of a mean aerodynamic chord in the top view.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MacLine {
    /// x of its leading edge, m aft of the datum.
    pub le_x_m: f64,
    /// Spanwise position, m from the centre line.
    pub y_m: f64,
    /// Length, m.
    pub chord_m: f64,
}

/// Everything needed to draw the aircraft from above, to scale, with its balance marks.
#[derive(Debug, Clone, PartialEq)]
pub struct TopView {
    /// Both halves of the wing.
    pub wing: Outline,
    /// Tail or canard, with its name.
    pub stabiliser: Option<(String, Outline)>,
    /// A schematic fuselage from its length and greatest width only.
    pub fuselage: Option<Outline>,
    /// Pitch-control surfaces (elevator or elevons), each half a separate outline: hinge line
    /// and trailing edge. Empty for an all-moving tail.
    pub controls: Vec<Outline>,
    /// The wing's MAC (drawn on the starboard half).
    pub mac: MacLine,
    /// x of the wing root leading edge, m: the reference the builder measures from.
    pub root_le_x_m: f64,
    /// CG from the mass list, m aft of the datum.
    pub cg_x_m: f64,
    /// Neutral point, m aft of the datum.
    pub neutral_point_x_m: f64,
    /// Recommended CG band (forward, aft), m aft of the datum.
    pub band_x_m: (f64, f64),
    /// The CG for the target static margin, when one is set.
    pub target_x_m: Option<f64>,
    /// The side view beside the top view, at its scale: each surface's outline projected on
    /// the x-z plane (x aft, z up, m): wing, stabiliser (a V-tail at its projected height),
    /// fin.
    pub side: Vec<Outline>,
    /// The schematic fuselage in the side view (its depth taken as its width, on z = 0).
    pub side_fuselage: Option<Outline>,
    /// The fin's extent along x (fore, aft), m, drawn as a line on the top view's centre line.
    pub fin_x_m: Option<(f64, f64)>,
}

/// Stations of `surface` from root to tip for drawing: `intervals` equal steps along the
/// half-span plus every panel join, and, with `both_sides_of_joins`, a point just outboard of
/// each join too (where the chord or sweep may jump).
fn stations_along(
    surface: &Surface,
    intervals: u32,
    both_sides_of_joins: bool,
) -> Vec<planform::SpanStation> {
    let total = planform::half_span_length_m(surface);
    let mut s_values: Vec<f64> = (0..=intervals)
        .map(|i| total * f64::from(i) / f64::from(intervals))
        .collect();
    for b in planform::break_points_m(surface) {
        s_values.push(b);
        if both_sides_of_joins {
            s_values.push((b + 1e-9 * total.max(1e-3)).min(total));
        }
    }
    s_values.sort_by(f64::total_cmp);
    s_values.dedup();
    s_values
        .iter()
        .map(|&s| planform::station_at(surface, s))
        .collect()
}

/// Outline of both halves of `surface` in the top view: leading edge from the port tip to the
/// starboard tip, trailing edge back.
pub fn surface_outline(surface: &Surface) -> Outline {
    // Both sides of a join, where the chord may jump.
    let stations = stations_along(surface, 64, true);
    let mut le: Vec<(f64, f64)> = stations.iter().map(|st| (st.x_le_m, st.y_m)).collect();
    let mut te: Vec<(f64, f64)> = stations
        .iter()
        .map(|st| (st.x_le_m + st.chord_m, st.y_m))
        .collect();
    // Starboard: root to tip along the leading edge, back along the trailing edge.
    let mut out: Outline = Vec::new();
    out.extend(le.iter().rev().map(|&(x, y)| (x, -y)));
    out.append(&mut le);
    te.reverse();
    out.extend(te.iter().copied());
    out.extend(te.iter().rev().map(|&(x, y)| (x, -y)));
    out
}

/// Outlines of the pitch control on its surface, starboard and port, between its ends: along
/// the hinge line (at `1 - F` of the local chord) and back along the trailing edge.
pub(crate) fn control_outlines(aircraft: &Aircraft) -> Vec<Outline> {
    let (surface, control) = match (&aircraft.stabiliser, &aircraft.elevons) {
        (Some(s), _) => (&s.surface, &s.elevator),
        (None, Some(e)) => (&aircraft.wing, e),
        (None, None) => return Vec::new(),
    };
    if control.chord_fraction <= 0.0 {
        return Vec::new();
    }
    let total = planform::half_span_length_m(surface);
    let (s0, s1) = (
        control.inboard_fraction * total,
        control.outboard_fraction * total,
    );
    let mut s_values: Vec<f64> = (0..=32)
        .map(|i| s0 + (s1 - s0) * f64::from(i) / 32.0)
        .collect();
    s_values.extend(
        planform::break_points_m(surface)
            .into_iter()
            .filter(|b| *b > s0 && *b < s1),
    );
    s_values.sort_by(f64::total_cmp);
    let stations: Vec<_> = s_values
        .iter()
        .map(|&s| planform::station_at(surface, s))
        .collect();
    let starboard: Outline = stations
        .iter()
        .map(|st| {
            (
                st.x_le_m + (1.0 - control.chord_fraction) * st.chord_m,
                st.y_m,
            )
        })
        .chain(
            stations
                .iter()
                .rev()
                .map(|st| (st.x_le_m + st.chord_m, st.y_m)),
        )
        .collect();
    let port: Outline = starboard.iter().map(|&(x, y)| (x, -y)).collect();
    vec![starboard, port]
}

fn fuselage_outline(f: &crate::model::Fuselage) -> Outline {
    // Schematic: rounded over the first 8 % of the length, full width to 35 %, then tapering
    // straight to 35 % of the width at the tail. Only length and greatest width are known.
    let (x0, l, half) = (f.nose_x_m, f.length_m, 0.5 * f.max_width_m);
    let mut side: Vec<(f64, f64)> = (0..=8)
        .map(|i| {
            let t = f64::from(i) / 8.0;
            let ang = t * std::f64::consts::FRAC_PI_2;
            (x0 + 0.08 * l * (1.0 - ang.cos()), half * ang.sin())
        })
        .collect();
    side.push((x0 + 0.35 * l, half));
    side.push((x0 + l, 0.35 * half));
    let mut out: Outline = side.clone();
    out.extend(side.iter().rev().map(|&(x, y)| (x, -y)));
    out
}

pub(super) fn top_view(aircraft: &Aircraft, a: &Analysis, target_x_m: Option<f64>) -> TopView {
    let g = &a.wing_geometry;
    TopView {
        wing: surface_outline(&aircraft.wing),
        stabiliser: aircraft.stabiliser.as_ref().map(|s| {
            let name = match s.role {
                StabiliserRole::Tail => "tail",
                StabiliserRole::Canard => "canard",
            };
            (name.to_string(), surface_outline(&s.surface))
        }),
        fuselage: aircraft.fuselage.as_ref().map(fuselage_outline),
        controls: control_outlines(aircraft),
        mac: MacLine {
            le_x_m: g.mac_le_x_m,
            y_m: g.mac_y_m,
            chord_m: g.mac_m,
        },
        root_le_x_m: aircraft.wing.root_le_x_m,
        cg_x_m: a.mass.cg_x_m,
        neutral_point_x_m: a.headline.neutral_point_x_m,
        band_x_m: (a.band.forward_x_m, a.band.aft_x_m),
        target_x_m,
        side: std::iter::once(side_outline(&aircraft.wing))
            .chain(
                aircraft
                    .stabiliser
                    .as_ref()
                    .map(|s| side_outline(&s.surface)),
            )
            .chain(aircraft.fin.as_ref().map(fin_side_outline))
            .collect(),
        side_fuselage: aircraft.fuselage.as_ref().map(fuselage_outline),
        fin_x_m: aircraft.fin.as_ref().map(|f| {
            let o = fin_side_outline(f);
            let xs = o.iter().map(|p| p.0);
            (
                xs.clone().fold(f64::INFINITY, f64::min),
                xs.fold(f64::NEG_INFINITY, f64::max),
            )
        }),
    }
}

/// Outline of `surface` seen from the side (x, z): along the leading edge from root to tip,
/// back along the trailing edge. A flat surface is a line; a V-tail or a wing with dihedral
/// shows its projected height (span along the panel times sin of its dihedral).
pub fn side_outline(surface: &Surface) -> Outline {
    let stations = stations_along(surface, 16, false);
    stations
        .iter()
        .map(|st| (st.x_le_m, st.z_m))
        .chain(
            stations
                .iter()
                .rev()
                .map(|st| (st.x_le_m + st.chord_m, st.z_m)),
        )
        .collect()
}

/// Outline of the fin seen from the side (x, z): root leading edge, tip leading edge, tip
/// trailing edge, root trailing edge.
pub fn fin_side_outline(f: &crate::model::Fin) -> Outline {
    let tip_le = f.root_le_x_m + f.height_m * f.sweep_le_rad.tan();
    let tip_z = f.root_z_m + f.height_m;
    vec![
        (f.root_le_x_m, f.root_z_m),
        (tip_le, tip_z),
        (tip_le + f.tip_chord_m, tip_z),
        (f.root_le_x_m + f.root_chord_m, f.root_z_m),
    ]
}
