//! Unit tests of the section entry points: defaults, cautions, cl_max and the models of
//! each method.

use super::*;
use approx::assert_relative_eq;

fn airfoil(shape: AirfoilShape, method: Option<SectionMethod>) -> Airfoil {
    Airfoil {
        name: "test".into(),
        shape,
        cl_max: None,
        method,
        reynolds: None,
        transition_n: None,
    }
}

#[test]
fn default_methods_by_shape() {
    let j = airfoil(
        AirfoilShape::Joukowski {
            thickness_ratio: 0.1,
            camber_ratio: 0.02,
        },
        None,
    );
    let out = section_model(&j, &SectionOptions::default()).unwrap();
    assert_eq!(out.model.method, SectionMethod::Exact);
    assert_eq!(out.cautions[0].code, "cl-max-default");
    assert!(crate::output::cautions::message(&out.cautions[0]).contains("'test'"));
    let n = airfoil(AirfoilShape::Naca("2412".into()), None);
    let out = section_model(&n, &SectionOptions { panels: 80 }).unwrap();
    assert_eq!(out.model.method, SectionMethod::Panel);
}

#[test]
fn exact_is_refused_for_naca_sections() {
    let n = airfoil(
        AirfoilShape::Naca("2412".into()),
        Some(SectionMethod::Exact),
    );
    assert!(matches!(
        section_model(&n, &SectionOptions::default()),
        Err(SectionError::MethodNotAvailable { .. })
    ));
}

#[test]
fn thin_model_of_a_naca_section_has_ac_at_quarter_chord() {
    // Thin-airfoil theory: cm about c/4 does not change with lift, so x_ac = 0.25 exactly
    // (Anderson, Fundamentals of Aerodynamics, ch. 4); 1e-12 for rounding.
    let n = airfoil(AirfoilShape::Naca("4412".into()), Some(SectionMethod::Thin));
    let m = section_model(&n, &SectionOptions::default()).unwrap().model;
    assert_relative_eq!(m.x_ac_c, 0.25, epsilon = 1e-12);
    assert!(m.cl_min < 0.0 && m.cl_min > -m.cl_max);
}

#[test]
fn symmetric_section_has_symmetric_stall_limits() {
    let mut n = airfoil(AirfoilShape::Naca("0012".into()), Some(SectionMethod::Thin));
    n.cl_max = Some(1.2);
    let out = section_model(&n, &SectionOptions::default()).unwrap();
    assert!(out.cautions.is_empty());
    assert_relative_eq!(out.model.cl_min, -1.2, epsilon = 1e-12);
    n.cl_max = Some(f64::NAN);
    assert!(section_model(&n, &SectionOptions::default()).is_err());
}

#[test]
fn very_thin_sections_are_flagged_for_the_panel_method() {
    let n = airfoil(
        AirfoilShape::Naca("0002".into()),
        Some(SectionMethod::Panel),
    );
    let out = section_model(&n, &SectionOptions { panels: 80 }).unwrap();
    assert!(out
        .cautions
        .iter()
        .any(|c| c.code == "section-too-thin-for-panels"));
    let j = airfoil(
        AirfoilShape::Joukowski {
            thickness_ratio: 0.01,
            camber_ratio: 0.14,
        },
        Some(SectionMethod::Panel),
    );
    // Either refused as not credible or flagged: never a silent answer.
    match section_model(&j, &SectionOptions::default()) {
        Err(SectionError::NotCredible { .. }) => {}
        Ok(out) => assert!(out
            .cautions
            .iter()
            .any(|c| c.code == "section-too-thin-for-panels")),
        Err(e) => panic!("unexpected error {e}"),
    }
}

#[test]
fn flap_effectiveness_passes_glauert_through() {
    let f = flap_effectiveness(0.3).unwrap();
    assert!(f.tau > 0.0 && f.tau < 1.0);
    assert!(flap_effectiveness(0.0).is_err());
}
