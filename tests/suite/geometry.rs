//! Planform geometry against published closed forms.

use approx::assert_relative_eq;
use trimline::model::{AirfoilId, EllipticShape, Panel, Surface, SurfaceShape};
use trimline::planform::{geometry, tail_volume};

fn trapezoid(full_span_m: f64, cr: f64, ct: f64, sweep_le_deg: f64) -> Surface {
    Surface {
        name: "wing".into(),
        root_le_x_m: 0.0,
        root_le_z_m: 0.0,
        incidence_rad: 0.0,
        shape: SurfaceShape::Panels(vec![Panel {
            span_m: full_span_m / 2.0,
            root_chord_m: cr,
            tip_chord_m: ct,
            sweep_le_rad: sweep_le_deg.to_radians(),
            dihedral_rad: 0.0,
            tip_twist_rad: 0.0,
            root_airfoil: AirfoilId(0),
            tip_airfoil: AirfoilId(0),
        }]),
    }
}

// Source: D. P. Raymer, Aircraft Design: A Conceptual Approach, sec. 7.3 (trapezoidal wing):
// MAC = (2/3) c_r (1 + l + l^2)/(1 + l); spanwise position y = (b/6)(1 + 2l)/(1 + l);
// x_LE of the MAC = y tan(sweep_LE). Worked numbers c_r 0.30, c_t 0.20, b 2.0:
// MAC 0.253333, y 0.466667, S 0.5, A 8 (REFERENCES.md, formula). Tolerance 1e-12: exact
// integration of polynomials.
#[test]
fn trapezoid_mac_matches_closed_form() {
    let g = geometry(&trapezoid(2.0, 0.30, 0.20, 0.0));
    let l: f64 = 0.20 / 0.30;
    assert_relative_eq!(
        g.mac_m,
        2.0 / 3.0 * 0.30 * (1.0 + l + l * l) / (1.0 + l),
        epsilon = 1e-12
    );
    assert_relative_eq!(g.mac_m, 0.253_333_333_333, epsilon = 1e-9);
    assert_relative_eq!(
        g.mac_y_m,
        2.0 / 6.0 * (1.0 + 2.0 * l) / (1.0 + l),
        epsilon = 1e-12
    );
    assert_relative_eq!(g.mac_y_m, 0.466_666_666_667, epsilon = 1e-9);
    assert_relative_eq!(g.area_m2, 0.5, epsilon = 1e-12);
    assert_relative_eq!(g.aspect_ratio, 8.0, epsilon = 1e-12);
    assert_relative_eq!(g.taper, l, epsilon = 1e-12);
}

// Same source: with leading-edge sweep the MAC leading edge lies at x = y_mac tan(sweep_LE).
#[test]
fn swept_trapezoid_mac_leading_edge() {
    let sweep = 20.0_f64;
    let g = geometry(&trapezoid(2.0, 0.30, 0.20, sweep));
    assert_relative_eq!(
        g.mac_le_x_m,
        g.mac_y_m * sweep.to_radians().tan(),
        epsilon = 1e-12
    );
}

// Source: elliptic planform MAC = (8 / (3 pi)) c_root (follows from c_bar = (2/S) int c^2 dy
// with c = c_r sqrt(1 - (2y/b)^2); e.g. Raymer sec. 7.3 definition applied to the ellipse).
// Area = pi b c_r / 4. Tolerance 1e-12 (closed forms in the code).
#[test]
fn elliptic_mac_and_area() {
    let s = Surface {
        name: "wing".into(),
        root_le_x_m: 0.0,
        root_le_z_m: 0.0,
        incidence_rad: 0.0,
        shape: SurfaceShape::Elliptic(EllipticShape {
            semispan_m: 0.75,
            root_chord_m: 0.24,
            dihedral_rad: 0.0,
            tip_twist_rad: 0.0,
            root_airfoil: AirfoilId(0),
            tip_airfoil: AirfoilId(0),
        }),
    };
    let g = geometry(&s);
    assert_relative_eq!(
        g.mac_m,
        8.0 / (3.0 * std::f64::consts::PI) * 0.24,
        epsilon = 1e-12
    );
    assert_relative_eq!(
        g.area_m2,
        std::f64::consts::PI * 1.5 * 0.24 / 4.0,
        epsilon = 1e-12
    );
    // Spanwise centroid of a half-ellipse: 4 (b/2) / (3 pi) (standard centroid of a
    // semicircular/semi-elliptic area).
    assert_relative_eq!(
        g.mac_y_m,
        4.0 * 0.75 / (3.0 * std::f64::consts::PI),
        epsilon = 1e-12
    );
}

// The MAC of a two-panel wing by exact integration must equal the area-weighted combination
// of the two panels' own MACs: c_bar = sum(S_i c_bar_i) / sum(S_i) (integral of c^2 is
// additive; Raymer sec. 7.3 definition). Panel MACs from the trapezoid closed form above.
#[test]
fn two_panel_mac_is_area_weighted_combination() {
    let s = Surface {
        name: "wing".into(),
        root_le_x_m: 0.0,
        root_le_z_m: 0.0,
        incidence_rad: 0.0,
        shape: SurfaceShape::Panels(vec![
            Panel {
                span_m: 0.5,
                root_chord_m: 0.25,
                tip_chord_m: 0.22,
                sweep_le_rad: 0.0,
                dihedral_rad: 0.0,
                tip_twist_rad: 0.0,
                root_airfoil: AirfoilId(0),
                tip_airfoil: AirfoilId(0),
            },
            Panel {
                span_m: 0.4,
                root_chord_m: 0.22,
                tip_chord_m: 0.12,
                sweep_le_rad: 0.0,
                dihedral_rad: 0.0,
                tip_twist_rad: 0.0,
                root_airfoil: AirfoilId(0),
                tip_airfoil: AirfoilId(0),
            },
        ]),
    };
    let mac = |cr: f64, ct: f64| {
        let l = ct / cr;
        2.0 / 3.0 * cr * (1.0 + l + l * l) / (1.0 + l)
    };
    let s1 = 0.5 * (0.25 + 0.22) / 2.0;
    let s2 = 0.4 * (0.22 + 0.12) / 2.0;
    let expected = (s1 * mac(0.25, 0.22) + s2 * mac(0.22, 0.12)) / (s1 + s2);
    let g = geometry(&s);
    assert_relative_eq!(g.mac_m, expected, epsilon = 1e-12);
    assert_relative_eq!(g.area_m2, 2.0 * (s1 + s2), epsilon = 1e-12);
    assert_relative_eq!(g.span_m, 1.8, epsilon = 1e-12);
}

// Dihedral: the projected span is the panel length times cos(dihedral) (plain trigonometry).
#[test]
fn dihedral_projects_the_span() {
    let mut s = trapezoid(2.0, 0.2, 0.2, 0.0);
    if let SurfaceShape::Panels(p) = &mut s.shape {
        p[0].dihedral_rad = 10f64.to_radians();
    }
    let g = geometry(&s);
    assert_relative_eq!(g.span_m, 2.0 * 10f64.to_radians().cos(), epsilon = 1e-12);
}

// Tail volume coefficient V = S_t l_t / (S c) (Raymer sec. 6.4, eq. 6.28).
#[test]
fn tail_volume_definition() {
    let wing = geometry(&trapezoid(2.0, 0.2, 0.2, 0.0));
    let mut tail_surface = trapezoid(0.5, 0.1, 0.1, 0.0);
    tail_surface.root_le_x_m = 0.8;
    let tail = geometry(&tail_surface);
    let tv = tail_volume(&wing, &tail);
    // wing c/4 at 0.05, tail c/4 at 0.825: arm 0.775; V = 0.05 * 0.775 / (0.4 * 0.2)
    assert_relative_eq!(tv.arm_m, 0.775, epsilon = 1e-12);
    assert_relative_eq!(tv.coefficient, 0.05 * 0.775 / (0.4 * 0.2), epsilon = 1e-12);
}
