//! Flat plate at zero incidence: the integral boundary-layer methods against the classical
//! skin-friction laws.

use trimline::section::boundary_layer::march::MarchSettings;
use trimline::section::boundary_layer::{march_surface, Regime, Station};

fn plate(n: usize) -> Vec<Station> {
    (1..=n)
        .map(|i| Station {
            s: i as f64 / n as f64,
            ue: 1.0,
        })
        .collect()
}

/// Total skin friction of one side of a unit plate: `2 theta(L) / L` (momentum balance at
/// zero pressure gradient).
fn total_cf(re: f64, trip_s: Option<f64>) -> (f64, Vec<Regime>) {
    let layer = march_surface(
        &plate(400),
        &MarchSettings {
            nu: 1.0 / re,
            n_crit: 9.0,
            trip_s,
        },
    );
    let last = layer.states.last().unwrap();
    (
        2.0 * last.theta,
        layer.states.iter().map(|s| s.regime).collect(),
    )
}

#[test]
fn laminar_plate_follows_blasius() {
    // Source: Blasius' solution, total skin friction of one side Cf = 1.328 / sqrt(Re_L)
    // (Schlichting, Boundary-Layer Theory, ch. 7; Raymer, Aircraft Design, eq. 12.25).
    // Tolerance 2 %: Thwaites' constant 0.45 gives 1.342 / sqrt(Re), 1.05 % high, by design.
    for re in [1e4, 1e5, 3e5] {
        let (cf, regimes) = total_cf(re, None);
        assert!(regimes.iter().all(|r| *r == Regime::Laminar), "Re {re}");
        let blasius = 1.328 / re.sqrt();
        assert!(
            (cf / blasius - 1.0).abs() < 0.02,
            "Re {re}: {cf} vs Blasius {blasius}"
        );
    }
}

#[test]
fn turbulent_plate_follows_prandtl_schlichting() {
    // Source: Prandtl-Schlichting turbulent flat-plate law Cf = 0.455 / (log10 Re)^2.58
    // (Schlichting, Boundary-Layer Theory, ch. 21; Raymer, Aircraft Design, eq. 12.27).
    // Tripped at 0.26 % of the length so the plate is turbulent from near its leading edge,
    // as the law assumes. Tolerance 8 %: Head's method with Ludwieg-Tillmann friction settles
    // at H about 1.35-1.42 here and runs 6-7 % below the law over Re 1e6-1e7 (a bias of the
    // method as implemented, listed in DEVELOPERS.md; the law itself fits the data within
    // about 3 %). It errs towards lower drag, so it is also checked not to be further off.
    for re in [1e6, 3e6, 1e7] {
        let (cf, regimes) = total_cf(re, Some(0.0026));
        assert!(regimes[10..].iter().all(|r| *r == Regime::Turbulent));
        let law = 0.455 / re.log10().powf(2.58);
        assert!(
            (cf / law - 1.0).abs() < 0.08,
            "Re {re}: {cf} vs Prandtl-Schlichting {law}"
        );
    }
}

#[test]
fn untripped_plate_turns_turbulent_at_high_reynolds_number() {
    // Flat-plate transition in a quiet stream happens at Re_x of about 3e6 (Schlichting,
    // Boundary-Layer Theory, ch. 15, Schubauer & Skramstad's plate: 2.8e6 at very low
    // turbulence). The envelope method at N 9 must put it between 1e6 and 1e7: check that a
    // plate at Re 1e5 stays laminar (above) and one at Re 1e7 does not.
    let (_, regimes) = total_cf(1e7, None);
    let first_turbulent = regimes
        .iter()
        .position(|r| *r == Regime::Turbulent)
        .expect("turbulent somewhere");
    let x_tr = (first_turbulent + 1) as f64 / 400.0;
    let re_x = x_tr * 1e7;
    assert!((1e6..1e7).contains(&re_x), "transition at Re_x {re_x:e}");
}
