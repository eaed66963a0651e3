//! Camber flaps and named flap settings (`[[wing.flap]]`, `[[flap_setting]]`): Glauert's
//! flap effect per strip against the closed form, exact laws of the linear model, each
//! setting's polar, and located errors for bad input.

use approx::assert_relative_eq;
use trimline::analysis::{analyse, lifting_line_options, AnalysisOptions};
use trimline::input::parse_aircraft;

fn merrowtail_text() -> String {
    std::fs::read_to_string("aircraft/merrowtail-1700.toml").unwrap()
}

fn merrowtail() -> trimline::model::Aircraft {
    parse_aircraft(&merrowtail_text(), "merrowtail-1700.toml", None).unwrap()
}

fn error_of(text: &str) -> String {
    match parse_aircraft(text, "bad.toml", None) {
        Ok(_) => panic!("expected an error"),
        Err(e) => e.to_string(),
    }
}

// Thin-airfoil theory of a plain flap (Glauert; Abbott & von Doenhoff, Theory of Wing
// Sections, sec. 8.2, from memory), hinge at x/c = 1 - E, theta_h = acos(1 - 2 x_h):
// d(alpha_0)/d(delta) = -tau with tau = 1 - (theta_h - sin theta_h) / pi, and
// d(cm_c/4)/d(delta) = -(1/2) sin theta_h (1 - cos theta_h) (our derivation from the Fourier
// coefficients A_n = (2/pi) delta sin(n theta_h) / n). With the hinge-gap factor 0.85
// (Raymer, Aircraft Design, 6th ed., sec. 16.3) for the 25 % flaps of the Merrowtail at
// 5 deg: strips fully inside the flap get exactly these, strips outside every flap nothing.
#[test]
fn strip_effects_are_glauert_with_the_hinge_gap_loss() {
    let ac = merrowtail();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    let system = trimline::stability::trim::build_system(
        &ac,
        &a.sections,
        lifting_line_options(&ac, &AnalysisOptions::default()),
    )
    .unwrap();
    let thermal = ac
        .flap_settings
        .iter()
        .find(|s| s.name == "thermal")
        .unwrap();
    let effects = trimline::analysis::glide::setting_effects(&ac, &system, thermal);
    let theta = (1.0f64 - 2.0 * 0.75).acos();
    let tau = 1.0 - (theta - theta.sin()) / std::f64::consts::PI;
    let dcm = -0.5 * theta.sin() * (1.0 - theta.cos());
    let d = 0.85 * 5f64.to_radians();
    let semispan = trimline::planform::half_span_length_m(&ac.wing);
    let (mut inside, mut outside) = (0, 0);
    for (st, e) in system.stations().iter().zip(&effects) {
        let (lo, hi) = (
            (st.s_m.abs() - 0.5 * st.width_m) / semispan,
            (st.s_m.abs() + 0.5 * st.width_m) / semispan,
        );
        if st.surface == 0 && lo > 0.05 && hi < 0.58 {
            inside += 1;
            assert_relative_eq!(e.0, -tau * d, max_relative = 1e-12);
            assert_relative_eq!(e.1, dcm * d, max_relative = 1e-12);
        } else if st.surface != 0 || hi < 0.05 || (lo > 0.96) {
            outside += 1;
            assert_eq!((e.0, e.1, e.2), (0.0, 0.0, 0.0));
        }
    }
    assert!(
        inside >= 6 && outside >= 6,
        "{inside} inside, {outside} outside"
    );
}

// Exact law of the linear model: only alpha - alpha_0 enters a strip's lift, so lowering
// every wing strip's zero-lift angle by d gives the same lift as raising its angle by d
// (the definition of the zero-lift angle; any thin-airfoil text).
#[test]
fn a_zero_lift_change_equals_the_same_angle_change() {
    let ac = merrowtail();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    let system = trimline::stability::trim::build_system(
        &ac,
        &a.sections,
        lifting_line_options(&ac, &AnalysisOptions::default()),
    )
    .unwrap();
    let d = 0.03;
    let by_zero = system
        .with_section_change(|_, st| {
            if st.surface == 0 {
                (-d, 0.0)
            } else {
                (0.0, 0.0)
            }
        })
        .unwrap();
    let by_angle = system
        .with_angle_change(|st| if st.surface == 0 { d } else { 0.0 })
        .unwrap();
    for alpha in [0.0, 0.05] {
        let x = by_zero.solve(&by_zero.condition(alpha)).unwrap();
        let y = by_angle.solve(&by_angle.condition(alpha)).unwrap();
        assert_relative_eq!(x.cl, y.cl, max_relative = 1e-12);
        assert_relative_eq!(x.cm(0.05, 0.0), y.cm(0.05, 0.0), epsilon = 1e-12);
    }
}

// A setting that deflects nothing is the plain polar, point for point (to 1e-6: its stall,
// the polar's slow end, comes from a second stall search that agrees with the first to
// about 1e-10 in CL).
#[test]
fn a_zero_setting_is_the_plain_polar() {
    let text = merrowtail_text().replace(
        "deflect = { flaps = 5, ailerons = 3 }",
        "deflect = { flaps = 0, ailerons = 0 }",
    );
    let ac = parse_aircraft(&text, "m.toml", None).unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    let base = a.glide_polar.as_ref().unwrap();
    let zero = a.flap_polars[0].polar.as_ref().unwrap();
    assert_eq!(base.points.len(), zero.points.len());
    for (p, q) in base.points.iter().zip(&zero.points) {
        assert_relative_eq!(p.sink_m_s, q.sink_m_s, max_relative = 1e-6);
        assert_relative_eq!(p.speed_m_s, q.speed_m_s, max_relative = 1e-6);
    }
}

// Camber flaps down lower the least sink, reflex lowers the sink at high speed (the purpose
// of sailplane camber flaps; common practice).
#[test]
fn thermal_flaps_lower_the_least_sink_and_reflex_helps_at_speed() {
    let a = analyse(&merrowtail(), &AnalysisOptions::default()).unwrap();
    let base = a.glide_polar.as_ref().unwrap();
    let get = |n: &str| {
        a.flap_polars
            .iter()
            .find(|s| s.name == n)
            .and_then(|s| s.polar.as_ref().ok())
            .unwrap()
    };
    assert!(get("thermal").min_sink.point.sink_m_s < base.min_sink.point.sink_m_s);
    let fast = 0.9 * base.top_speed_m_s;
    let sink = |p| trimline::analysis::glide::sink_at(p, fast).unwrap();
    assert!(sink(get("speed")) < sink(base));
    // The JSON carries each setting's polar.
    let doc = trimline::output::json::check_document(&merrowtail(), &a, "m.toml");
    let v = serde_json::to_value(&doc).unwrap();
    assert_eq!(v["flap_settings"].as_array().unwrap().len(), 2);
    assert_eq!(
        v["flap_settings"][0]["polar"]["points"]
            .as_array()
            .unwrap()
            .len(),
        40
    );
}

const FLAPS: &str = r#"
[[wing.flap]]
name = "flaps"
chord = 25
inboard = 5
outboard = 58
"#;

/// The Merrowtail without its own flaps and settings, with `extra` added after the wing.
fn with(extra: &str) -> String {
    let t = merrowtail_text();
    let start = t.find("# Camber flaps").unwrap();
    let end = t.find("# A V-tail is a stabiliser").unwrap();
    format!("{}{extra}\n{}", &t[..start], &t[end..])
}

#[test]
fn bad_flap_input_is_a_located_error_with_the_accepted_range() {
    let line_of =
        |text: &str, needle: &str| text.lines().position(|l| l.contains(needle)).unwrap() + 1;
    // A setting naming a flap that does not exist.
    let text = with(&format!(
        "{FLAPS}\n[[flap_setting]]\nname = \"t\"\ndeflect = {{ flapz = 3 }}\n"
    ));
    let e = error_of(&text);
    let l = line_of(&text, "flapz");
    assert!(
        e.starts_with(&format!("bad.toml:{l}:")) && e.contains("flap_setting.deflect.flapz"),
        "{e}"
    );
    assert!(e.contains("one of: 'flaps'"), "{e}");
    // A deflection beyond linear theory.
    let text = with(&format!(
        "{FLAPS}\n[[flap_setting]]\nname = \"t\"\ndeflect = {{ flaps = 30 }}\n"
    ));
    let e = error_of(&text);
    assert!(
        e.contains("flap_setting.deflect.flaps") && e.contains("-15") && e.contains("20"),
        "{e}"
    );
    // Two flaps over the same span.
    let text = with(&format!(
        "{FLAPS}\n[[wing.flap]]\nname = \"more\"\nchord = 20\ninboard = 50\noutboard = 70\n"
    ));
    let e = error_of(&text);
    assert!(e.contains("overlaps flap 'flaps'"), "{e}");
    // Outboard end inside the inboard end.
    let e = error_of(&with(
        "[[wing.flap]]\nname = \"f\"\nchord = 20\ninboard = 50\noutboard = 40\n",
    ));
    assert!(
        e.contains("wing.flap.outboard") && e.contains("must lie outboard"),
        "{e}"
    );
    // A setting on a wing without flaps.
    let e = error_of(&with(
        "[[flap_setting]]\nname = \"t\"\ndeflect = { a = 1 }\n",
    ));
    assert!(e.contains("the wing has none"), "{e}");
    // A flap chord of 0 %.
    let e = error_of(&with(
        "[[wing.flap]]\nname = \"f\"\nchord = 0\ninboard = 10\noutboard = 40\n",
    ));
    assert!(e.contains("wing.flap.chord"), "{e}");
}
