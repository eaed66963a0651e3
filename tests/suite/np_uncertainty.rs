//! The neutral point's uncertainty by linear sensitivities, against a Monte Carlo and the
//! analytic derivative.
//!
//! Sources: first-order propagation of independent errors (ISO Guide to the Expression of
//! Uncertainty in Measurement, sec. 5.1); the lift-weighted neutral point (Etkin & Reid,
//! Dynamics of Flight, sec. 2.4), whose derivative in the tail efficiency is
//! d x_n / d eta = (k / eta) (x_t - x_n) / (a_w + k) without a fuselage.

use trimline::analysis::{analyse, AnalysisOptions};
use trimline::input::parse_aircraft;
use trimline::stability::classical::{EstimateInput, StabiliserPlace};
use trimline::stability::uncertainty::{
    linear_spread, monte_carlo_sigma_m, Spreads, COMMON_SPREADS,
};

const GLIDER: &str = crate::small_glider!(
    name: "Spread glider",
    top: "",
    wing: "",
    wing_panel: "tip_chord = 150\n",
    stabiliser: "x = 850\nroot_chord = 110\n",
    stabiliser_panel: "span = 300\ntip_chord = 90\n",
    rest: r#"[[mass]]
name = "all"
mass = 1000
x = 60
"#,
);

fn with_input<R>(extra: &str, f: impl FnOnce(&EstimateInput<'_>) -> R) -> R {
    let ac = parse_aircraft(&format!("{GLIDER}{extra}"), "t.toml", None).unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    let input = EstimateInput {
        wing: &a.wing,
        stabiliser: a.stabiliser.as_ref().map(|s| (s, StabiliserPlace::Tail)),
        mass_kg: a.mass.total_kg,
        cg_x_m: a.mass.cg_x_m,
        density_kg_m3: a.air.density_kg_m3,
        fuselage_cm_alpha_per_rad: trimline::analysis::fuselage_cm_alpha(&ac, &a.wing),
        stabiliser_dynamic_pressure_ratio: 0.9,
        downwash_factor: 1.0,
    };
    f(&input)
}

const FUSELAGE: &str = r#"
[fuselage]
nose_x = -250
length = 1000
width = 60
"#;

// With every spread zero the range collapses to the point, in both estimates (exactly).
#[test]
fn zero_spreads_collapse_the_range() {
    let zero = Spreads {
        dynamic_pressure_ratio: 0.0,
        downwash_gradient: 0.0,
        fuselage: 0.0,
        wing_section_slope: 0.0,
        stabiliser_section_slope: 0.0,
        wing_aerodynamic_centre_mac: 0.0,
    };
    with_input(FUSELAGE, |input| {
        let s = linear_spread(input, &zero);
        assert!(s.sigma_m.abs() < 1e-15 && s.contributions_m.iter().all(|c| *c == 0.0));
        assert!(monte_carlo_sigma_m(input, &zero, 200, 7).abs() < 1e-12);
    });
}

// The linear estimate and a Monte Carlo of 20 000 draws agree within 5 %: the sampling
// error of a standard deviation from N draws is about 1/sqrt(2N) = 0.5 %, the rest is the
// neutral point's curvature over the spreads (small at these spreads).
#[test]
fn monte_carlo_and_linear_estimate_agree() {
    with_input(FUSELAGE, |input| {
        let linear = linear_spread(input, &COMMON_SPREADS).sigma_m;
        let mc = monte_carlo_sigma_m(input, &COMMON_SPREADS, 20_000, 12345);
        assert!(linear > 1e-4, "{linear}");
        assert!(
            (mc - linear).abs() < 0.05 * linear,
            "MC {mc} vs linear {linear}"
        );
    });
}

// The tail-efficiency share equals the analytic derivative times its spread (no fuselage),
// to 1e-6 relative (the central difference).
#[test]
fn tail_efficiency_share_is_the_analytic_derivative() {
    with_input("", |input| {
        let eta = input.stabiliser_dynamic_pressure_ratio;
        let (w, (t, _)) = (input.wing, input.stabiliser.unwrap());
        let a_w = w.lift_slope_per_rad;
        let de = 2.0 * a_w / (std::f64::consts::PI * w.geometry.aspect_ratio);
        let k = eta * t.geometry.area_m2 / w.geometry.area_m2 * t.lift_slope_per_rad * (1.0 - de);
        let x_n = (a_w * w.x_ac_m + k * t.x_ac_m) / (a_w + k);
        let slope = k / eta * (t.x_ac_m - x_n) / (a_w + k);
        let s = linear_spread(input, &COMMON_SPREADS);
        let expected = slope * COMMON_SPREADS.dynamic_pressure_ratio;
        assert!(
            (s.contributions_m[0] - expected).abs() < 1e-6 * expected.abs(),
            "{} vs {expected}",
            s.contributions_m[0]
        );
    });
}

// The range reaches every output the same way (law of the outputs: one figure, printed
// three times): the JSON's forward end and aft limit are the neutral point minus two standard
// deviations (and minus the smallest margin times the MAC), the check table prints the same
// forward end, and the PDF's key figures name it.
#[test]
fn the_range_reaches_json_table_and_report_alike() {
    let text = std::fs::read_to_string("aircraft/larkspire-2000.toml").unwrap();
    let ac = parse_aircraft(&text, "l.toml", None).unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    let doc = trimline::output::json::check_document(&ac, &a, "l.toml");
    let v = serde_json::to_value(&doc).unwrap();
    let s = &v["stability"];
    let two_sigma = 2.0 * a.neutral_point_spread.sigma_m;
    assert!(two_sigma > 0.0);
    let fwd = s["neutral_point_forward_end_x_m"].as_f64().unwrap();
    assert!((fwd - (a.headline.neutral_point_x_m - two_sigma)).abs() < 1e-5);
    let mac = a.wing_geometry.mac_m;
    let aft = s["aft_limit_from_range_x_m"].as_f64().unwrap();
    assert!((aft - (fwd - ac.margin_limits.min_static_margin * mac)).abs() < 2e-5);
    let table = trimline::output::tables::check_report(
        &ac,
        &a,
        "l.toml",
        trimline::output::units::UnitSystem::Metric,
    );
    assert!(table.contains(&format!("{:.1}", 1000.0 * fwd)), "{table}");
    let data = trimline::output::report::build(
        &ac,
        &a,
        trimline::output::report::ReportSource {
            file_name: "l.toml".into(),
            content_hash: trimline::output::report::content_hash(&text),
            date: "2026-12-03".into(),
        },
    );
    let np_line = data
        .key_figures
        .iter()
        .find(|k| k.label == "Neutral point")
        .unwrap();
    assert!(
        np_line
            .value
            .contains(&format!("forward end of its range {:.0} mm", 1000.0 * fwd)),
        "{}",
        np_line.value
    );
}

// The wing aerodynamic centre's share is the analytic derivative of the lift-weighted neutral
// point (Etkin & Reid, Dynamics of Flight, sec. 2.4): d x_n / d x_w = a_w / (a_w + k), the
// fuselage term not depending on x_w; times its spread of 1.5 % of the MAC.
#[test]
fn wing_aerodynamic_centre_share_is_the_analytic_derivative() {
    with_input(FUSELAGE, |input| {
        let eta = input.stabiliser_dynamic_pressure_ratio;
        let (w, (t, _)) = (input.wing, input.stabiliser.unwrap());
        let a_w = w.lift_slope_per_rad;
        let de = 2.0 * a_w / (std::f64::consts::PI * w.geometry.aspect_ratio);
        let k =
            eta * t.pitch_area_m2 / w.geometry.area_m2 * t.pitch_lift_slope_per_rad() * (1.0 - de);
        let expected =
            a_w / (a_w + k) * COMMON_SPREADS.wing_aerodynamic_centre_mac * w.geometry.mac_m;
        let s = linear_spread(input, &COMMON_SPREADS);
        assert!(
            (s.contributions_m[5] - expected).abs() < 1e-6 * expected,
            "{} vs {expected}",
            s.contributions_m[5]
        );
    });
}

// The stabiliser's section-slope share by the chain rule (Etkin & Reid, sec. 2.4, no
// fuselage): d x_n / d k = (x_t - x_n) / (a_w + k), k proportional to the tail's finite lift
// slope a_t, and a_t = Helmbold's slope of the section slope a0 on the true aspect ratio
// (Helmbold's equation, e.g. McCormick, Aerodynamics, Aeronautics and Flight Mechanics, ch. 3),
// so dk = k (d a_t / d a0) a0 sigma / a_t for a relative spread sigma of a0. It must not be
// zero: a tailed aircraft's neutral point moves with its tail's lift slope.
#[test]
fn stabiliser_section_slope_share_is_the_chain_rule_derivative() {
    use trimline::stability::classical::helmbold_lift_slope;
    with_input("", |input| {
        let eta = input.stabiliser_dynamic_pressure_ratio;
        let (w, (t, _)) = (input.wing, input.stabiliser.unwrap());
        let a_w = w.lift_slope_per_rad;
        let de = 2.0 * a_w / (std::f64::consts::PI * w.geometry.aspect_ratio);
        let a0 = t.section_cl_alpha_per_rad;
        let a_t = helmbold_lift_slope(a0, t.true_aspect_ratio);
        let k = eta * t.pitch_area_m2 / w.geometry.area_m2 * a_t * (1.0 - de);
        let x_n = (a_w * w.x_ac_m + k * t.x_ac_m) / (a_w + k);
        let h = 1e-6 * a0;
        let dat_da0 = (helmbold_lift_slope(a0 + h, t.true_aspect_ratio)
            - helmbold_lift_slope(a0 - h, t.true_aspect_ratio))
            / (2.0 * h);
        let sigma = COMMON_SPREADS.stabiliser_section_slope;
        let expected = (t.x_ac_m - x_n) / (a_w + k) * k / a_t * dat_da0 * a0 * sigma;
        let s = linear_spread(input, &COMMON_SPREADS);
        assert!(
            expected.abs() > 1e-4,
            "the share should be felt: {expected}"
        );
        assert!(
            (s.contributions_m[4] - expected).abs() < 1e-5 * expected.abs(),
            "{} vs {expected}",
            s.contributions_m[4]
        );
    });
}

// A tailless wing's neutral point is its own aerodynamic centre (Etkin & Reid, sec. 2.4, with
// no tail), so without a fuselage its spread is exactly the aerodynamic centre's, 1.5 % of the
// MAC; and the example flying wing's recommended band then ends the smallest margin ahead of
// the range's forward end, not of the computed neutral point (the safe side).
#[test]
fn a_tailless_wing_has_a_neutral_point_range_and_its_band_allows_for_it() {
    let text = std::fs::read_to_string("aircraft/skerrywing-900.toml").unwrap();
    let ac = parse_aircraft(&text, "s.toml", None).unwrap();
    assert!(ac.stabiliser.is_none(), "the example should be tailless");
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    let input = EstimateInput {
        wing: &a.wing,
        stabiliser: None,
        mass_kg: a.mass.total_kg,
        cg_x_m: a.mass.cg_x_m,
        density_kg_m3: a.air.density_kg_m3,
        fuselage_cm_alpha_per_rad: 0.0,
        stabiliser_dynamic_pressure_ratio: 1.0,
        downwash_factor: 1.0,
    };
    let mac = a.wing_geometry.mac_m;
    let s = linear_spread(&input, &COMMON_SPREADS);
    assert!(
        (s.sigma_m - 0.015 * mac).abs() < 1e-9 * mac,
        "{} vs {}",
        s.sigma_m,
        0.015 * mac
    );
    let mc = monte_carlo_sigma_m(&input, &COMMON_SPREADS, 20_000, 99);
    assert!(
        (mc - s.sigma_m).abs() < 0.03 * s.sigma_m,
        "MC {mc} vs {}",
        s.sigma_m
    );

    let sigma = a.neutral_point_spread.sigma_m;
    assert!(
        sigma >= 0.015 * mac * 0.999,
        "{sigma} m against MAC {mac} m"
    );
    assert_eq!(
        a.band.aft_limit,
        trimline::analysis::AftLimit::NeutralPointRange
    );
    let expected_aft =
        a.headline.neutral_point_x_m - 2.0 * sigma - ac.margin_limits.min_static_margin * mac;
    assert!(
        (a.band.aft_x_m - expected_aft).abs() < 1e-6,
        "{} vs {expected_aft}",
        a.band.aft_x_m
    );
}

/// `GLIDER` with its one mass at `x_mm` and `extra` appended, analysed.
fn glider_with_cg_at(x_mm: f64, extra: &str) -> trimline::analysis::Analysis {
    glider_and_analysis(x_mm, extra).1
}

/// `GLIDER` with its one mass at `x_mm` and `extra` appended: the aircraft and its analysis.
fn glider_and_analysis(
    x_mm: f64,
    extra: &str,
) -> (trimline::model::Aircraft, trimline::analysis::Analysis) {
    let text = GLIDER.replace("x = 60\n", &format!("x = {x_mm:.2}\n"));
    let ac = parse_aircraft(&format!("{text}{extra}"), "t.toml", None).unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    (ac, a)
}

fn has_code(a: &trimline::analysis::Analysis, code: &str) -> Option<trimline::caution::Level> {
    a.cautions.iter().find(|c| c.code == code).map(|c| c.level)
}

// The unsafe side of an uncertain neutral point decides (common practice: a CG that may lie
// behind the neutral point is not flown). A CG with a positive computed margin but behind the
// forward end of the neutral point's two-sigma range is a danger; the band's aft end is not.
#[test]
fn a_cg_behind_the_forward_end_of_the_neutral_point_range_is_a_danger() {
    let base = glider_with_cg_at(60.0, "");
    let np_mm = 1000.0 * base.headline.neutral_point_x_m;
    let spread_mm = 1000.0 * 2.0 * base.neutral_point_spread.sigma_m;
    assert!(
        spread_mm > 2.0,
        "the glider should have a range: {spread_mm} mm"
    );

    let inside_range = glider_with_cg_at(np_mm - 0.5 * spread_mm, "");
    assert!(inside_range.headline.static_margin > 0.0);
    assert_eq!(
        has_code(&inside_range, "cg-behind-neutral-point-range"),
        Some(trimline::caution::Level::Danger)
    );

    let at_band_end = glider_with_cg_at(1000.0 * base.band.aft_x_m - 0.2, "");
    assert_eq!(
        has_code(&at_band_end, "cg-behind-neutral-point-range"),
        None
    );
    // Behind the neutral point itself the negative margin speaks instead.
    let behind = glider_with_cg_at(np_mm + 5.0, "");
    assert_eq!(has_code(&behind, "cg-behind-neutral-point-range"), None);
    assert!(has_code(&behind, "static-margin-negative").is_some());
}

// Ballast advice never leads behind the recommended band: a target margin that would put the
// CG aft of the band (here 2 % against a band whose aft end keeps 5 % from the forward end of
// the neutral point's range) is held at the band's aft end, and the advice says so.
#[test]
fn ballast_advice_for_a_small_target_margin_stops_at_the_band() {
    let bay = "[[ballast]]\nname = \"nose\"\nx = -300\nmax = 500\n";
    let small = glider_with_cg_at(20.0, &format!("{bay}[targets]\nstatic_margin = 2\n"));
    let b = &small.ballast[0];
    assert!(b.held_at_band_aft_end);
    assert!((b.target_x_m - small.band.aft_x_m).abs() < 1e-12);
    let normal = glider_with_cg_at(20.0, &format!("{bay}[targets]\nstatic_margin = 15\n"));
    let b = &normal.ballast[0];
    assert!(!b.held_at_band_aft_end);
    let mac = normal.wing_geometry.mac_m;
    assert!((b.target_x_m - (normal.headline.neutral_point_x_m - 0.15 * mac)).abs() < 1e-9);
}

// The PDF's target marker follows the ballast advice: held at the band's aft end when the
// target margin would lie aft of it, and saying so.
#[test]
fn the_report_target_is_held_at_the_band_like_the_ballast_advice() {
    let bay = "[[ballast]]\nname = \"nose\"\nx = -300\nmax = 500\n";
    let (ac, a) = glider_and_analysis(20.0, &format!("{bay}[targets]\nstatic_margin = 2\n"));
    let d = trimline::output::report::build(
        &ac,
        &a,
        trimline::output::report::ReportSource {
            file_name: "t.toml".into(),
            content_hash: String::new(),
            date: String::new(),
        },
    );
    let (t_mm, sm, held) = d.target_from_root_le_mm.expect("a target");
    assert!(held);
    assert!((sm - 2.0).abs() < 1e-9);
    let aft_mm = 1000.0 * (a.band.aft_x_m - ac.wing.root_le_x_m);
    assert!((t_mm - aft_mm).abs() < 1e-6, "{t_mm} vs {aft_mm}");
}

// A CG whose tolerance range (two standard deviations; GUM sec. 5.1.2 for one item: the
// position tolerance itself) reaches behind the forward end of the neutral point's range is a
// danger, the same bar as for the CG itself.
#[test]
fn a_cg_range_behind_the_forward_end_of_the_neutral_point_range_is_a_danger() {
    let base = glider_with_cg_at(60.0, "");
    let np_mm = 1000.0 * base.headline.neutral_point_x_m;
    let spread_mm = 1000.0 * 2.0 * base.neutral_point_spread.sigma_m;
    let cg_mm = 1000.0 * base.band.aft_x_m - 1.0;
    // Two sigma of the CG reach half-way into the neutral point's range.
    let sigma_mm = (np_mm - 0.5 * spread_mm - cg_mm) / 2.0;
    let a = glider_with_cg_at(cg_mm, &format!("[tolerances]\nposition = {sigma_mm:.3}\n"));
    assert!(a.mass.cg_x_m + 2.0 * a.cg_spread.sigma_m < a.headline.neutral_point_x_m);
    assert_eq!(
        has_code(&a, "cg-aft-of-uncertain-limit"),
        Some(trimline::caution::Level::Danger)
    );
    // A range that stays ahead of that end is a warning.
    let small = (np_mm - 1.5 * spread_mm - cg_mm).max(0.2) / 2.0;
    let b = glider_with_cg_at(cg_mm, &format!("[tolerances]\nposition = {small:.3}\n"));
    assert_eq!(
        has_code(&b, "cg-aft-of-uncertain-limit"),
        Some(trimline::caution::Level::Warning)
    );
}

// A target trim speed below the stall is a danger (the decalage solved for it trims the
// aircraft stalled), one below 1.2 times the stall a warning (common practice: the margin a
// pilot keeps in turbulence), a comfortable one nothing.
#[test]
fn a_target_speed_at_or_near_the_stall_is_cautioned() {
    let base = glider_with_cg_at(40.0, "");
    let vs = base.headline.stall_speed_m_s;
    let at = |v: f64| glider_with_cg_at(40.0, &format!("[targets]\ntrim_speed = {v:.3}\n"));
    assert_eq!(
        has_code(&at(0.9 * vs), "target-speed-near-stall"),
        Some(trimline::caution::Level::Danger)
    );
    assert_eq!(
        has_code(&at(1.1 * vs), "target-speed-near-stall"),
        Some(trimline::caution::Level::Warning)
    );
    assert_eq!(has_code(&at(1.5 * vs), "target-speed-near-stall"), None);
}
