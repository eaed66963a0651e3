//! The viscous section method (integral boundary layer coupled to the panel method by
//! transpiration) against published section data, its convergence with panel count, and its
//! refusals of bad input. Numbers of this method are checked against outside data only; the
//! trend checks compare the method with itself across Reynolds numbers, where the direction
//! (not the size) is what the sources establish.

use trimline::section::geometry::Contour;
use trimline::section::naca::NacaProfile;
use trimline::section::panel::PanelSolution;
use trimline::section::polar::Polar;
use trimline::section::viscous::{ViscousError, ViscousSection, ViscousSettings};

fn naca(d: &str) -> Contour {
    let raw = NacaProfile::parse(d).unwrap().coordinates(300);
    Contour::with_leading_edge(&raw, raw.len() / 2).unwrap()
}

fn section(d: &str, reynolds: f64, panels: usize) -> ViscousSection {
    ViscousSection::new(
        &naca(d),
        ViscousSettings {
            reynolds,
            n_crit: 9.0,
            panels,
        },
    )
    .unwrap()
}

fn deg(a: &[f64]) -> Vec<f64> {
    a.iter().map(|d| d.to_radians()).collect()
}

#[test]
fn naca_0012_minimum_drag_at_high_reynolds_number() {
    // Source: Abbott & von Doenhoff, Theory of Wing Sections (1959), appendix IV, NACA 0012
    // smooth at Re 5.9e6: cd_min about 0.0058 (read from the chart, from memory; Ladson,
    // NASA TM-4074, free transition at Re 6e6, gives a similar value, also from memory).
    // Tolerance 15 %: the chart reading and the method's transition prediction (N 9).
    let v = section("0012", 6e6, 160);
    let p = v.solve(0.0).unwrap();
    assert!((p.cd / 0.0058 - 1.0).abs() < 0.15, "cd {}", p.cd);
    // Symmetric section at zero incidence: no lift, no moment (symmetry, 1e-6 for rounding).
    assert!(p.cl.abs() < 1e-6 && p.cm_quarter_chord.abs() < 1e-6);
}

#[test]
fn lift_slope_below_inviscid_and_near_measured_at_high_reynolds_number() {
    // Source: measured NACA 2412 and 0012 at Re about 6e6 (Abbott & von Doenhoff's charts as
    // restated in Anderson's books; see /work/shared/REFERENCES.md): lift slope about
    // 0.105 /deg, NACA 2412 zero-lift angle about -2.2 deg. Tolerances: zero-lift angle
    // 0.3 deg (the reading); lift slope 0.015 /deg: this method leaves out the wake's
    // curvature and runs about 10 % above the measured slope at this Reynolds number (a
    // known limit, DEVELOPERS.md). The boundary layer must lower the slope below the
    // inviscid panel value on the same panels in every case.
    for d in ["2412", "0012"] {
        let v = section(d, 6e6, 160);
        let polar = Polar::sweep(&v, &deg(&[-4.0, -2.0, 0.0, 2.0, 4.0]));
        let (slope, alpha0) = polar.linear_fit(1.0).unwrap();
        let inviscid = PanelSolution::solve(&naca(d), 160).unwrap();
        let slope_deg = slope.to_radians();
        assert!(slope < inviscid.cl_alpha_per_rad(), "{d}: {slope_deg}");
        assert!((slope_deg - 0.105).abs() < 0.015, "{d}: {slope_deg} /deg");
        if d == "2412" {
            assert!(
                (alpha0.to_degrees() + 2.2).abs() < 0.3,
                "{}",
                alpha0.to_degrees()
            );
        }
    }
}

#[test]
fn lift_slope_falls_and_drag_rises_as_reynolds_number_falls() {
    // Trend: at lower Reynolds numbers the thicker boundary layer lowers the lift slope and
    // the laminar separation bubble raises the drag (McGhee, Walker & Millard, NASA TM-4062,
    // 1988, the Eppler 387 from Re 460,000 down to 60,000; Lissaman, Low-Reynolds-number
    // airfoils, Annual Review of Fluid Mechanics 15, 1983). Checked on NACA 0012 at cl 0.4.
    let alphas = deg(&[0.0, 2.0, 4.0]);
    let mut last: Option<(f64, f64)> = None;
    for re in [6e6, 1e6, 2e5] {
        let polar = Polar::sweep(&section("0012", re, 160), &alphas);
        let (slope, _) = polar.linear_fit(1.0).unwrap();
        let cd = polar.cd_at_cl(0.4).unwrap();
        if let Some((s0, cd0)) = last {
            assert!(slope < s0, "Re {re}: slope {slope} not below {s0}");
            assert!(cd > cd0, "Re {re}: cd {cd} not above {cd0}");
        }
        last = Some((slope, cd));
    }
}

#[test]
fn computed_cl_max_falls_with_reynolds_number() {
    // Trend only: section cl_max falls as the Reynolds number falls (Abbott & von Doenhoff,
    // Theory of Wing Sections, ch. 7, the scale effect on maximum lift; McGhee et al., NASA
    // TM-4062, for the Eppler 387). The values themselves run high (docs/section.md) and are
    // not checked here.
    let alphas: Vec<f64> = deg(&(0..=20).map(f64::from).collect::<Vec<_>>());
    let low = Polar::sweep(&section("0012", 2e5, 120), &alphas)
        .cl_max
        .unwrap()
        .0;
    let high = Polar::sweep(&section("0012", 2e6, 120), &alphas)
        .cl_max
        .unwrap()
        .0;
    assert!(low < high, "cl_max {low} at Re 2e5, {high} at 2e6");
}

#[test]
fn michel_and_envelope_transition_agree_roughly() {
    // Michel's criterion (Michel 1951, as in Cebeci & Bradshaw, Momentum Transfer in Boundary
    // Layers, sec. 4.4) is a correlation of transition in quiet streams, the e^9 envelope
    // (Drela & Giles 1987) a stability estimate: on NACA 0012 at Re 6e6 and 0 deg, where
    // transition is by amplification, they should agree within 0.2 of chord (a judgement of
    // the scatter of such criteria).
    let p = section("0012", 6e6, 160).solve(0.0).unwrap();
    let (tr, mi) = (p.upper.transition_x_c.unwrap(), p.upper.michel_x_c.unwrap());
    assert!((tr - mi).abs() < 0.2, "envelope {tr}, Michel {mi}");
}

#[test]
fn a_converged_point_is_steady_when_the_tolerance_is_tightened() {
    // Method property (the definition of convergence of an iteration): a point reported as
    // converged must not move when the iteration is carried on to a five times smaller
    // residual. Checked on NACA 0012 at Re 2e5, where the adaptive relaxation sits at its
    // floor for most passes: cl within 0.2 %, cd within 0.3 %, transition within 1 % of
    // chord. (A residual measured after the relaxation, the change of one relaxed pass, had
    // stopped these points with the drag 4-7 % low.)
    let v = section("0012", 2e5, 160);
    for alpha_deg in [0.0f64, 2.0, 4.0] {
        let a = alpha_deg.to_radians();
        let p = v.solve(a).unwrap();
        let tight = v
            .solve_to(a, trimline::section::viscous::TOLERANCE / 5.0)
            .unwrap();
        assert!(p.residual < trimline::section::viscous::TOLERANCE);
        let cl_ok = (p.cl - tight.cl).abs() <= 0.002 * tight.cl.abs().max(0.1);
        let cd_ok = (p.cd / tight.cd - 1.0).abs() < 0.003;
        let (t0, t1) = (
            p.upper.transition_x_c.unwrap(),
            tight.upper.transition_x_c.unwrap(),
        );
        assert!(
            cl_ok && cd_ok && (t0 - t1).abs() < 0.01,
            "{alpha_deg} deg: cl {} / {}, cd {} / {}, transition {t0} / {t1}",
            p.cl,
            tight.cl,
            p.cd,
            tight.cd
        );
    }
}

/// (cl, cd) of NACA `d` at `re` and `alpha_deg` for each panel count.
fn by_panels(d: &str, re: f64, alpha_deg: f64, panels: &[usize]) -> Vec<(f64, f64)> {
    let a = alpha_deg.to_radians();
    panels
        .iter()
        .map(|&n| {
            let p = section(d, re, n).solve(a).unwrap();
            (p.cl, p.cd)
        })
        .collect()
}

#[test]
fn polar_converges_with_panel_count() {
    // Method property (common practice): cl and cd settle as the panels are refined.
    // Where the transition sits near the leading edge (NACA 0012 at Re 2e5 and 8 deg) each
    // step from 120 to 320 panels moves cl by less than 0.5 % and cd by less than 1 %.
    let r = by_panels("0012", 2e5, 8.0, &[120, 160, 240, 320]);
    for w in r.windows(2) {
        assert!((w[1].0 / w[0].0 - 1.0).abs() < 0.005, "{r:?}");
        assert!((w[1].1 / w[0].1 - 1.0).abs() < 0.01, "{r:?}");
    }
    // Known limit (DEVELOPERS.md): where a laminar separation ends the laminar run in
    // mid-chord (NACA 2412 at Re 1e6 and 4 deg), the direct coupling pulls it forward as the
    // panels are refined, so cd rises by 3-5 % a step from 120 to 240 panels (cl still within
    // 0.5 %). The bound below is that drift, so that a worse one fails.
    let r = by_panels("2412", 1e6, 4.0, &[120, 160, 240]);
    for w in r.windows(2) {
        assert!((w[1].0 / w[0].0 - 1.0).abs() < 0.005, "{r:?}");
        assert!((w[1].1 / w[0].1 - 1.0).abs() < 0.06, "{r:?}");
    }
}

#[test]
fn bad_input_gives_typed_errors() {
    let c = naca("0012");
    let with = |reynolds: f64, n_crit: f64, panels: usize| {
        ViscousSection::new(
            &c,
            ViscousSettings {
                reynolds,
                n_crit,
                panels,
            },
        )
        .err()
    };
    assert!(matches!(
        with(5e3, 9.0, 160),
        Some(ViscousError::Reynolds { .. })
    ));
    assert!(matches!(
        with(2e7, 9.0, 160),
        Some(ViscousError::Reynolds { .. })
    ));
    assert!(matches!(
        with(f64::NAN, 9.0, 160),
        Some(ViscousError::Reynolds { .. })
    ));
    assert!(matches!(
        with(1e6, 0.0, 160),
        Some(ViscousError::NCrit { .. })
    ));
    assert!(matches!(
        with(1e6, 9.0, 40),
        Some(ViscousError::TooCoarse { panels: 40 })
    ));
    // NACA 0030: the thickness form's open trailing edge is 0.63 % of chord.
    let thick = naca("0030");
    let e = ViscousSection::new(&thick, ViscousSettings::default()).err();
    assert!(
        matches!(e, Some(ViscousError::OpenTrailingEdge { .. })),
        "{e:?}"
    );
    let msg = e.unwrap().to_string();
    assert!(msg.contains("0.63 %"), "{msg}");
}

#[test]
fn far_past_stall_is_a_typed_result_not_a_number() {
    // At 25 deg no attached solution exists: the method must say it did not converge or that
    // the point is past the stall criterion; never a NaN.
    let v = section("0012", 2e5, 160);
    match v.solve(25f64.to_radians()) {
        Err(ViscousError::NotConverged {
            alpha_rad,
            residual,
            ..
        }) => {
            assert!((alpha_rad.to_degrees() - 25.0).abs() < 1e-9);
            assert!(residual.is_finite());
        }
        Ok(p) => {
            assert!(p.is_stalled(), "{p:?}");
            assert!(p.cl.is_finite() && p.cd.is_finite());
        }
        Err(e) => panic!("unexpected {e}"),
    }
}

const VISCOUS_FILE: &str = r#"
name = "Test glider"
[airfoils.a]
naca = "2412"
method = "viscous"
reynolds = 2e5
transition_n = 7
[wing]
root_chord = 200
airfoil = "a"
[[wing.panel]]
span = 600
tip_chord = 150
[[mass]]
name = "all"
mass = 400
x = 60
"#;

#[test]
fn aircraft_file_keys_give_a_viscous_section_model() {
    // The file's method, Reynolds number and N reach the section model, which then carries
    // its Reynolds number and polar; cl_max stays the conservative default, flagged, because
    // the viscous cl_max is not validated (docs/section.md). The lift slope must fall below
    // the inviscid panel value on the same section (the boundary layer's displacement).
    use trimline::model::SectionMethod;
    use trimline::section::{section_model, ClMaxSource, SectionOptions};
    let a = trimline::input::parse_aircraft(VISCOUS_FILE, "v.toml", None).unwrap();
    let airfoil = &a.airfoils[0];
    assert_eq!(airfoil.method, Some(SectionMethod::Viscous));
    assert_eq!(airfoil.reynolds, Some(2e5));
    assert_eq!(airfoil.transition_n, Some(7.0));
    let out = section_model(airfoil, &SectionOptions { panels: 160 }).unwrap();
    let m = &out.model;
    assert_eq!(m.method, SectionMethod::Viscous);
    assert_eq!(m.reynolds_number, Some(2e5));
    let polar = m.polar.as_ref().expect("polar carried");
    approx::assert_relative_eq!(polar.n_crit, 7.0);
    assert_eq!(m.cl_max_source, ClMaxSource::Default);
    assert!(out.cautions.iter().any(|c| c.code == "cl-max-default"));
    let inviscid = PanelSolution::solve(&naca("2412"), 160).unwrap();
    assert!(m.cl_alpha_per_rad < inviscid.cl_alpha_per_rad());
    // Same zero-lift angle as measured within the reading's 0.3 deg (REFERENCES.md).
    assert!((m.alpha_zero_lift_rad.to_degrees() + 2.2).abs() < 0.3);
}

#[test]
fn aircraft_file_viscous_keys_are_checked() {
    let with = |a: &str, b: &str| VISCOUS_FILE.replace(a, b);
    let err = |text: String| match trimline::input::parse_aircraft(&text, "v.toml", None) {
        Ok(_) => panic!("expected an error"),
        Err(e) => e.to_string(),
    };
    let e = err(with("reynolds = 2e5", "reynolds = 5e3"));
    assert!(
        e.contains("airfoils.a.reynolds") && e.contains("10000"),
        "{e}"
    );
    let e = err(with("transition_n = 7", "transition_n = 20"));
    assert!(e.contains("airfoils.a.transition_n"), "{e}");
    let e = err(with("reynolds = 2e5\n", ""));
    assert!(
        e.contains("needs the section's chord Reynolds number"),
        "{e}"
    );
    let e = err(with("method = \"viscous\"", "method = \"wet\""));
    assert!(e.contains("exact, thin, panel, viscous"), "{e}");
    let e = err(with("reynolds = 2e5\n", "") + "[targets]\ntrim_speed = 0.5\n");
    assert!(e.contains("outside the range"), "{e}");
}

#[test]
fn reynolds_number_defaults_from_the_trim_speed_and_the_chords() {
    // Without `reynolds`, the file's target trim speed and the mean chord of the panel ends
    // that use the airfoil (200 and 150 mm) give Re = V c / nu. Check value: sea-level ISA
    // Re per (m/s * m) = 68,459 (US Standard Atmosphere 1976 with Sutherland's viscosity, see
    // /work/shared/REFERENCES.md): 68,459 * 9 * 0.175 = 107,823; 0.05 % for the rounding.
    let text = VISCOUS_FILE.replace("reynolds = 2e5\n", "") + "[targets]\ntrim_speed = 9\n";
    let a = trimline::input::parse_aircraft(&text, "v.toml", None).unwrap();
    let re = a.airfoils[0].reynolds.unwrap();
    assert!((re / 107_823.0 - 1.0).abs() < 5e-4, "{re}");
}

#[test]
fn the_wing_model_follows_each_station_s_polar() {
    // The strip relation of the wing model (lattice or lifting line) takes the section's lift
    // curve per station: with a viscous polar, the solved circulations satisfy
    // Gamma = (c/2) cl_polar(alpha_section) at every station (the model's own equation, to the
    // Newton tolerance), where alpha_section is the station's angle with the induced angle;
    // and because the polar is nonlinear, the full solve differs from the superposed linear
    // one while staying within a few per cent of it at a small angle (law: the linear fit is
    // the polar's slope near zero lift). Beyond the polar's last converged point the curve is
    // held flat (a stall limit), as the flat-top model does at cl_max.
    use trimline::lifting_line::{LiftingLineOptions, MultiSurfaceSystem, Reference, SurfaceInput};
    use trimline::section::{section_model, SectionOptions};
    let a = trimline::input::parse_aircraft(VISCOUS_FILE, "v.toml", None).unwrap();
    let m = section_model(&a.airfoils[0], &SectionOptions { panels: 160 })
        .unwrap()
        .model;
    let sections = [m.clone()];
    let input = [SurfaceInput {
        surface: &a.wing,
        sections: &sections,
        elevator: None,
    }];
    let sys = MultiSurfaceSystem::new(
        &input,
        Reference::of_surface(&a.wing),
        LiftingLineOptions::default(),
    )
    .unwrap();
    let r = sys.solve(&sys.condition(0.06)).unwrap();
    assert!(matches!(
        r.status,
        trimline::lifting_line::SolveStatus::Converged { .. }
    ));
    for st in &r.stations {
        let lp = m.lift_point(st.alpha_rad, 0.0);
        assert!((st.cl - lp.cl).abs() < 1e-6, "{} vs {}", st.cl, lp.cl);
    }
    let lin = sys
        .linear_coefficients(&sys.condition(0.06), 0.0, 0.0)
        .unwrap();
    assert!((r.cl / lin.cl - 1.0).abs() < 0.05, "{} vs {}", r.cl, lin.cl);
    let far = m.lift_point(1.0, 0.0);
    assert!(!far.attached && far.slope_per_rad == 0.0 && far.cl <= m.cl_max);
}
