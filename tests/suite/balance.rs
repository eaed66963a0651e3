//! Mass, CG and ballast against hand calculation.

use approx::assert_relative_eq;
use trimline::balance::{
    ballast_for_target, mass_summary, weighing, with_added_mass, BallastOutcome, Support,
};
use trimline::model::{BallastBay, MassItem};

fn item(name: &str, g: f64, x_mm: f64, z_mm: Option<f64>) -> MassItem {
    MassItem {
        name: name.into(),
        mass_kg: g / 1000.0,
        x_m: x_mm / 1000.0,
        z_m: z_mm.map(|z| z / 1000.0),
        tolerance: Default::default(),
    }
}

// Hand-checkable mass list (statics: x_cg = sum(m x)/sum(m)):
// 300 g at 100 mm, 200 g at -50 mm, 100 g at 600 mm -> 600 g,
// moment 30000 - 10000 + 60000 = 80000 g mm -> x_cg = 133.333 mm.
// z: 300 g at 0, 200 g at 20, 100 g at 50 -> (0 + 4000 + 5000)/600 = 15 mm.
#[test]
fn cg_of_a_hand_checked_list() {
    let m = mass_summary(&[
        item("wing", 300.0, 100.0, Some(0.0)),
        item("battery", 200.0, -50.0, Some(20.0)),
        item("tail", 100.0, 600.0, Some(50.0)),
    ])
    .unwrap();
    assert_relative_eq!(m.total_kg, 0.6, epsilon = 1e-12);
    assert_relative_eq!(m.cg_x_m, 0.133_333_333_333, epsilon = 1e-9);
    assert_relative_eq!(m.cg_z_m.unwrap(), 0.015, epsilon = 1e-12);
}

// A missing z on any item leaves the vertical CG unknown rather than guessing.
#[test]
fn cg_z_unknown_when_any_item_lacks_z() {
    let m = mass_summary(&[
        item("a", 100.0, 0.0, Some(0.0)),
        item("b", 100.0, 10.0, None),
    ])
    .unwrap();
    assert!(m.cg_z_m.is_none());
}

// Ballast formula from the moment balance: m_b = M (x_t - x_cg)/(x_b - x_t).
// 600 g with CG at 133.333 mm, bay at -200 mm, target 100 mm:
// m_b = 600 * (100 - 133.333)/(-200 - 100) = 66.667 g. Hand calculation.
#[test]
fn ballast_formula_by_hand() {
    let m = mass_summary(&[
        item("wing", 300.0, 100.0, None),
        item("battery", 200.0, -50.0, None),
        item("tail", 100.0, 600.0, None),
    ])
    .unwrap();
    let bay = BallastBay {
        name: "nose".into(),
        x_m: -0.2,
        z_m: None,
        max_mass_kg: 0.1,
    };
    match ballast_for_target(&m, &bay, 0.1) {
        BallastOutcome::Reachable { mass_kg } => {
            assert_relative_eq!(mass_kg, 0.066_666_666_667, epsilon = 1e-9);
            let after = with_added_mass(&m, mass_kg, bay.x_m, None);
            assert_relative_eq!(after.cg_x_m, 0.1, epsilon = 1e-12);
        }
        other => panic!("expected reachable, got {other:?}"),
    }
    // A bay that holds only 50 g cannot reach the target, and says how much it would need.
    let small = BallastBay {
        max_mass_kg: 0.05,
        ..bay
    };
    match ballast_for_target(&m, &small, 0.1) {
        BallastOutcome::ExceedsBay { needed_kg, max_kg } => {
            assert_relative_eq!(needed_kg, 0.066_666_666_667, epsilon = 1e-9);
            assert_relative_eq!(max_kg, 0.05, epsilon = 1e-12);
        }
        other => panic!("expected exceeds-bay, got {other:?}"),
    }
}

// Weighing on two supports (FAA-H-8083-1, Aircraft Weight and Balance Handbook, ch. 2:
// CG = sum(reading x arm) / sum(readings)). Nose support at -100 mm reads 250 g, main support
// at 150 mm reads 350 g: CG = (-25000 + 52500)/600 = 45.833 mm.
#[test]
fn weighing_on_two_supports() {
    let m = weighing(&[
        Support {
            x_m: -0.1,
            reading_kg: 0.25,
        },
        Support {
            x_m: 0.15,
            reading_kg: 0.35,
        },
    ])
    .unwrap();
    assert_relative_eq!(m.total_kg, 0.6, epsilon = 1e-12);
    assert_relative_eq!(m.cg_x_m, 0.045_833_333_333, epsilon = 1e-9);
    assert!(weighing(&[Support {
        x_m: 0.0,
        reading_kg: 1.0
    }])
    .is_err());
}
