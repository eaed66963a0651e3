//! Checks of the planform: the station walk gives the same bits as the walk it replaced, two
//! equal panels give the one-panel answer, an elliptic station's chord follows the ellipse.

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
