//! Validation of the exact Joukowski and Karman-Trefftz solutions, and of the panel method
//! against them.

use approx::assert_relative_eq;
use std::f64::consts::PI;
use trimline::section::geometry::Contour;
use trimline::section::joukowski::JoukowskiAirfoil;
use trimline::section::karman_trefftz::KarmanTrefftzAirfoil;
use trimline::section::panel::PanelSolution;

/// Angle from the chord line for an angle `deg` measured from the map's real axis (the
/// convention of the REFERENCES.md table).
fn from_axis<M: trimline::section::circle_map::CircleMap>(
    a: &trimline::section::circle_map::CircleAirfoil<M>,
    deg: f64,
) -> f64 {
    deg.to_radians() - a.chord_angle_rad()
}

#[test]
fn symmetric_section_shape_lift_and_moment() {
    // REFERENCES.md, independent computation of the Joukowski map, centre mu = -0.1:
    // a 1.1, chord 4.033333, t/c 0.11785 (tol 1e-5); at 5 deg cl 0.59740 (tol 1e-4) and
    // cm_c/4 -0.00235 (tol 2e-4). cl = 8 pi (a/c) sin(alpha + beta) (Katz & Plotkin ch. 6).
    let j = JoukowskiAirfoil::from_circle(-0.1, 0.0).unwrap();
    assert_relative_eq!(j.radius(), 1.1, epsilon = 1e-12);
    assert_relative_eq!(j.chord(), 4.033333, epsilon = 1e-5);
    assert_relative_eq!(j.shape_ratios().0, 0.11785, epsilon = 1e-5);
    let a = from_axis(&j, 5.0);
    assert_relative_eq!(j.cl(a), 0.59740, epsilon = 1e-4);
    assert_relative_eq!(j.cm_quarter_chord(a), -0.00235, epsilon = 2e-4);
}

#[test]
fn cambered_section_geometry() {
    // REFERENCES.md, independent computation, mu = -0.1 + 0.1i: a 1.104536, beta 5.1944 deg,
    // chord 4.033609 (tol 1e-5), t/c 0.1186 (tol 1e-4, its rounding).
    let j = JoukowskiAirfoil::from_circle(-0.1, 0.1).unwrap();
    assert_relative_eq!(j.radius(), 1.104536, epsilon = 1e-5);
    assert_relative_eq!(j.beta_rad().to_degrees(), 5.1944, epsilon = 1e-4);
    assert_relative_eq!(j.chord(), 4.033609, epsilon = 1e-5);
    assert_relative_eq!(j.shape_ratios().0, 0.1186, epsilon = 1e-4);
}

#[test]
fn cambered_section_lift_moment_and_pressures() {
    // REFERENCES.md, independent computation, mu = -0.1 + 0.1i, alpha from the real axis:
    // alpha 0: cl 0.62308, cm_c/4 -0.14292, Cp_min -0.829 at x/c 0.223;
    // alpha 5 deg: cl 1.21807, cm_c/4 -0.14672, Cp_min -1.899 at x/c 0.0137.
    // Tolerances: cl 1e-4, cm 5e-4, Cp_min 2e-3 (value) and 0.01 (position, sampled at
    // 4000 points), all from the listed rounding.
    let j = JoukowskiAirfoil::from_circle(-0.1, 0.1).unwrap();
    let cases = [
        (0.0, 0.62308, -0.14292, -0.829, 0.223),
        (5.0, 1.21807, -0.14672, -1.899, 0.0137),
    ];
    for (deg, cl, cm, cp_min, x_min) in cases {
        let a = from_axis(&j, deg);
        assert_relative_eq!(j.cl(a), cl, epsilon = 1e-4);
        assert_relative_eq!(j.cm_quarter_chord(a), cm, epsilon = 5e-4);
        let s = j.surface(4000, a);
        let min = s.iter().min_by(|p, q| p.cp.total_cmp(&q.cp)).unwrap();
        assert_relative_eq!(min.cp, cp_min, epsilon = 2e-3);
        assert_relative_eq!(min.x_c, x_min, epsilon = 0.01);
    }
}

#[test]
fn cusp_speed_of_the_cambered_section() {
    // REFERENCES.md, independent computation: V_TE / U = 0.8911 at alpha 5 deg from the
    // axis, mu = -0.1 + 0.1i (tol 1e-4). The cusp is not a stagnation point.
    let j = JoukowskiAirfoil::from_circle(-0.1, 0.1).unwrap();
    let v = j.surface_point(0.0, from_axis(&j, 5.0)).speed_ratio;
    assert_relative_eq!(v, 0.8911, epsilon = 1e-4);
}

#[test]
fn zero_lift_angle_is_minus_beta_from_the_axis() {
    // Kutta condition: Gamma = 4 pi a U sin(alpha + beta) vanishes at alpha = -beta
    // (Katz & Plotkin ch. 6; REFERENCES.md formula); 1e-12 for rounding.
    let j = JoukowskiAirfoil::from_circle(-0.08, 0.06).unwrap();
    assert_relative_eq!(
        j.alpha_zero_lift_rad() + j.chord_angle_rad(),
        -j.beta_rad(),
        epsilon = 1e-12
    );
    assert_relative_eq!(j.cl(j.alpha_zero_lift_rad()), 0.0, epsilon = 1e-12);
}

#[test]
fn thin_symmetric_lift_slope_tends_to_two_pi() {
    // Thin-airfoil limit 2 pi per rad (Glauert; REFERENCES.md formula). The exact slope
    // 8 pi a / c exceeds 2 pi by about 2 pi * 0.77 t/c (REFERENCES.md: "the symmetric Joukowski
    // case gives 1 + 0.772 t/c", computed): the excess must shrink in proportion to t/c, to
    // within 1 % of 2 pi at t/c 1 %, and be 0.77 t/c within 2 % at t/c 0.2 %.
    let mut last_excess = f64::INFINITY;
    for eps in [0.05, 0.02, 0.008, 0.002] {
        let j = JoukowskiAirfoil::from_circle(-eps, 0.0).unwrap();
        let excess = j.cl_alpha_per_rad() / (2.0 * PI) - 1.0;
        assert!(excess > 0.0 && excess < last_excess, "eps {eps}: {excess}");
        last_excess = excess;
        let tc = j.shape_ratios().0;
        if tc < 0.01 {
            assert_relative_eq!(j.cl_alpha_per_rad(), 2.0 * PI, max_relative = 0.01);
        }
        if eps < 0.005 {
            assert_relative_eq!(excess / tc, 0.77, max_relative = 0.02);
        }
    }
}

#[test]
fn shape_solve_recovers_the_circle() {
    // Asking for the thickness of the mu = -0.1 section (0.11785, REFERENCES.md) must give
    // back mu = -0.1 within what the rounding of 0.11785 allows (about 1e-4 in mu).
    let j = JoukowskiAirfoil::from_shape(0.11785, 0.0).unwrap();
    let (mx, my) = j.centre();
    assert_relative_eq!(mx, -0.1, epsilon = 2e-4);
    assert_relative_eq!(my, 0.0, epsilon = 1e-12);
}

#[test]
fn karman_trefftz_ten_degree_trailing_edge() {
    // REFERENCES.md, independent computation: tau 10 deg (n = 1.94444), mu = -0.1 + 0.1i,
    // alpha 5 deg from the axis: chord 3.926273, cl 1.25137, cm_c/4 -0.15725, V_TE = 0;
    // tolerance 1e-4 as listed.
    let k = KarmanTrefftzAirfoil::from_circle(-0.1, 0.1, 10f64.to_radians()).unwrap();
    assert_relative_eq!(k.map().exponent(), 1.94444, epsilon = 1e-5);
    assert_relative_eq!(k.chord(), 3.926273, epsilon = 1e-4);
    let a = from_axis(&k, 5.0);
    assert_relative_eq!(k.cl(a), 1.25137, epsilon = 1e-4);
    assert_relative_eq!(k.cm_quarter_chord(a), -0.15725, epsilon = 1e-4);
    assert_relative_eq!(k.surface_point(0.0, a).speed_ratio, 0.0, epsilon = 1e-12);
}

#[test]
fn karman_trefftz_at_zero_angle_is_joukowski() {
    // The Karman-Trefftz map with n = 2 is the Joukowski map (von Karman & Trefftz 1918;
    // Milne-Thomson, Theoretical Hydrodynamics): everything must agree to machine precision (1e-12, a few
    // hundred ulps for the complex powers).
    let j = JoukowskiAirfoil::from_circle(-0.09, 0.07).unwrap();
    let k = KarmanTrefftzAirfoil::from_circle(-0.09, 0.07, 0.0).unwrap();
    let tol = 1e-12;
    assert_relative_eq!(j.chord(), k.chord(), epsilon = tol);
    assert_relative_eq!(
        j.alpha_zero_lift_rad(),
        k.alpha_zero_lift_rad(),
        epsilon = tol
    );
    for deg in [-4.0, 0.0, 3.0, 8.0] {
        let a = f64::to_radians(deg);
        assert_relative_eq!(j.cl(a), k.cl(a), epsilon = tol);
        assert_relative_eq!(j.cm_quarter_chord(a), k.cm_quarter_chord(a), epsilon = tol);
        assert_relative_eq!(j.cm_leading_edge(a), k.cm_leading_edge(a), epsilon = tol);
        for (p, q) in j.surface(120, a).iter().zip(k.surface(120, a)) {
            assert_relative_eq!(p.x_c, q.x_c, epsilon = tol);
            assert_relative_eq!(p.y_c, q.y_c, epsilon = tol);
            assert_relative_eq!(p.cp, q.cp, epsilon = 1e-10);
        }
    }
}

/// Panel solution on the exact contour (`points` surface points, re-panelled to `panels`).
fn panel_on(j: &JoukowskiAirfoil, points: usize, panels: usize) -> PanelSolution {
    let contour = Contour::new(&j.coordinates(points)).unwrap();
    PanelSolution::solve(&contour, panels).unwrap()
}

#[test]
fn panel_method_reproduces_the_exact_lift_and_pressures() {
    // The classic panel-method check (Katz & Plotkin, Low-Speed Aerodynamics, ch. 11, and
    // their comparison with the exact Joukowski solution): at 200 panels the panel cl must be
    // within 0.5 % of the exact cl, and Cp within 0.01 of the exact Cp at the same x/c on the
    // same surface for 0.02 <= x/c <= 0.95 (away from the trailing edge, where the cusp
    // limits any panel method).
    let j = JoukowskiAirfoil::from_circle(-0.1, 0.1).unwrap();
    let p = panel_on(&j, 800, 200);
    let a = 5f64.to_radians();
    assert_relative_eq!(p.cl(a), j.cl(a), max_relative = 0.005);
    let exact = j.surface(4000, a);
    let le = exact
        .iter()
        .enumerate()
        .min_by(|x, y| x.1.x_c.total_cmp(&y.1.x_c))
        .unwrap()
        .0;
    let mut checked = 0;
    let panel_surface = p.surface(a);
    let half = panel_surface.len() / 2;
    for (k, q) in panel_surface.into_iter().enumerate() {
        if !(0.02..=0.95).contains(&q.x_c) {
            continue;
        }
        // Both lists run trailing edge -> upper surface -> leading edge -> lower surface.
        let side = if k < half {
            &exact[..=le]
        } else {
            &exact[le..]
        };
        let near = side
            .iter()
            .min_by(|u, v| {
                let du = (u.x_c - q.x_c).hypot(u.y_c - q.y_c);
                let dv = (v.x_c - q.x_c).hypot(v.y_c - q.y_c);
                du.total_cmp(&dv)
            })
            .unwrap();
        assert!(
            (near.cp - q.cp).abs() < 0.01,
            "x/c {:.4}: panel Cp {:.4}, exact {:.4}",
            q.x_c,
            q.cp,
            near.cp
        );
        checked += 1;
    }
    assert!(checked > 150, "only {checked} points compared");
}

#[test]
fn panel_method_agrees_with_the_exact_moment_and_zero_lift_angle() {
    // Same check for the moment about c/4 (Blasius' theorem exactly, pressure integration on
    // the panels): within 1.5e-3, about 1 % of the moment, at 200 panels; zero-lift angle within
    // 0.02 deg. Tolerances are a judgement on the discretisation error of 200 flat panels.
    let j = JoukowskiAirfoil::from_circle(-0.1, 0.1).unwrap();
    let p = panel_on(&j, 800, 200);
    for deg in [0.0, 5.0] {
        let a = f64::to_radians(deg);
        assert_relative_eq!(
            p.cm_quarter_chord(a),
            j.cm_quarter_chord(a),
            epsilon = 1.5e-3
        );
    }
    assert_relative_eq!(
        p.alpha_zero_lift_rad().to_degrees(),
        j.alpha_zero_lift_rad().to_degrees(),
        epsilon = 0.02
    );
}
