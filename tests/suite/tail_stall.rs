//! Tail stall in the negative direction: a heavy download at a far-forward CG, trimmed with
//! an all-moving tail, reaches the tailplane's cl_min before the wing reaches its cl_max.
//!
//! Independent hand calculation (moment balance of two lifting surfaces; any stability text,
//! e.g. Etkin & Reid, Dynamics of Flight, sec. 2.3): with symmetric sections (cm_ac = 0),
//! unswept rectangular surfaces at the CG's height and an all-moving tail (no flap moment),
//! the trimmed tail load is fixed by the moment balance alone, whatever the speed:
//! L_t = -W (x_acw - x_cg) / (x_act - x_acw), with each aerodynamic centre on its quarter
//! chord. The tail works at eta q, so its lift coefficient grows in magnitude as the speed
//! falls, and its most loaded station (the centre) reaches cl_min when
//! eta q S_t (cl_min / f) = L_t, with f = cl_centre / C_L = 1.144 for a rectangular wing of
//! aspect ratio 6 (Glauert's Fourier solution of Prandtl's equation, a0 = 2 pi; computed, in
//! REFERENCES.md's lifting-line table). Hence V = sqrt(2 f L_t / (rho eta S_t cl_min)).
//! Tolerance 3 % in speed: the wing's downwash varies a little along the tail's span, which
//! changes f by about 1-2 %, and tail induced drag and the small-angle force direction
//! enter at the 0.5 % level.

use trimline::analysis::{analyse, AnalysisOptions};
use trimline::input::parse_aircraft;
use trimline::stability::trim::StallLimit;

const FORWARD_CG: &str = r#"
name = "Nose-heavy"
[air]
density = 1.225
[airfoils.w]
naca = "0012"
cl_max = 1.4
method = "thin"
[airfoils.t]
naca = "0009"
cl_max = 0.5
method = "thin"
[wing]
root_chord = 200
airfoil = "w"
[[wing.panel]]
span = 1000
tip_chord = 200
[stabiliser]
x = 800
root_chord = 100
airfoil = "t"
elevator_chord = 0
elevator_up = 45
elevator_down = 45
dynamic_pressure_ratio = 0.9
[[stabiliser.panel]]
span = 300
tip_chord = 100
[limits]
min_static_margin = 5
max_static_margin = 40
[[mass]]
name = "all"
mass = 1000
x = CG
z = 0
"#;

fn analysed(cg_mm: f64) -> (trimline::model::Aircraft, trimline::analysis::Analysis) {
    let text = FORWARD_CG.replace("CG", &cg_mm.to_string());
    let ac = parse_aircraft(&text, "test.toml", None).unwrap();
    let a = analyse(&ac, &AnalysisOptions::default()).unwrap();
    (ac, a)
}

#[test]
fn download_stall_of_the_tail_is_found_at_the_hand_calculated_speed() {
    let (_, a) = analysed(0.0);
    let (w, x_cg, x_acw, x_act) = (1.0 * 9.80665, 0.0, 0.05, 0.825);
    let (rho, eta, s_t, cl_min, f): (f64, f64, f64, f64, f64) = (1.225, 0.9, 0.06, -0.5, 1.144);
    let l_t = -w * (x_acw - x_cg) / (x_act - x_acw);
    let v_hand = (2.0 * f * l_t / (rho * eta * s_t * cl_min)).sqrt();
    let stall = a.full.as_ref().unwrap().stall.as_ref().unwrap();
    assert_eq!(stall.surface, 1, "the tail stalls first");
    let StallLimit::StabiliserClMin {
        speed_otherwise_m_s,
        ..
    } = stall.limit
    else {
        panic!("expected the tail's negative stall, got {:?}", stall.limit);
    };
    assert!(
        (stall.speed_m_s - v_hand).abs() < 0.03 * v_hand,
        "tail stall at {} m/s, hand calculation {v_hand}",
        stall.speed_m_s
    );
    assert!(speed_otherwise_m_s < stall.speed_m_s);
    assert!((a.headline.stall_speed_m_s - stall.speed_m_s).abs() < 1e-12);
    let c = a
        .cautions
        .iter()
        .find(|c| c.code == "tail-stalls-first")
        .expect("a caution names the surface that stalls first");
    assert!(
        trimline::output::cautions::message(c).contains("tailplane stalls first, downwards"),
        "{}",
        trimline::output::cautions::message(c)
    );
    assert!(trimline::output::cautions::message(c).contains(&format!("{:.1} m/s", stall.speed_m_s)));
}

// Law of the forward CG limit: with the CG at the limit the tool reports (set by the tail's
// negative stall here: the all-moving tail has ample throw; the file's largest accepted
// static-margin limit, 40 %, still sets the band's forward end, so the band is not checked),
// trimming to the wing's stall
// puts the tail exactly on cl_min; 1 mm further forward the tail stalls first, 1 mm aft the
// wing does.
#[test]
fn forward_limit_is_where_the_tail_just_reaches_cl_min_at_the_stall() {
    let (_, a) = analysed(0.0);
    let f = a.full.as_ref().unwrap();
    assert_eq!(
        f.forward_limit_cause,
        trimline::stability::trim::ForwardLimitCause::StabiliserClMin
    );
    let x = f.elevator_forward_limit_x_m.unwrap();
    let limit_of = |mm: f64| {
        let (_, b) = analysed(mm);
        b.full.unwrap().stall.unwrap().limit
    };
    assert!(matches!(
        limit_of(x * 1000.0 - 1.0),
        StallLimit::StabiliserClMin { .. }
    ));
    assert!(matches!(limit_of(x * 1000.0 + 1.0), StallLimit::ClMax));
}
