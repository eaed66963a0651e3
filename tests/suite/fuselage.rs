//! Fuselage pitch-up contribution (Gilruth & White, NACA Report 711; Raymer, Aircraft Design,
//! sec. 16.3 and the K_fus figure).

use approx::assert_relative_eq;
use trimline::model::Fuselage;
use trimline::stability::fuselage::{cm_alpha_per_rad, k_f};

// Formula: Delta Cm_alpha = K_f w_f^2 L_f / (c S) per degree. Inputs: w_f 1.2 m, L_f 8 m,
// c 1.5 m, S 16 m^2, wing root quarter chord at 30 % of the length (K_f 0.0104 per degree,
// read from digitised reproductions of Raymer's K_fus figure; four digitisations agree within
// about 5 % at x/L = 0.3). Hand arithmetic: 0.0104 * 1.44 * 8 / 24 = 0.004992 per degree.
#[test]
fn formula_by_hand() {
    let f = Fuselage {
        nose_x_m: -2.0,
        length_m: 8.0,
        max_width_m: 1.2,
    };
    let per_rad = cm_alpha_per_rad(&f, -2.0 + 0.3 * 8.0, 1.5, 16.0);
    assert_relative_eq!(per_rad.to_radians(), 0.004_992, epsilon = 1e-9);
}

// The K_f curve rises monotonically with the wing placed further aft (the shape of Raymer's
// figure: more fuselage ahead of the wing is more destabilising).
#[test]
fn k_f_rises_as_the_wing_moves_aft() {
    let mut last = 0.0;
    for i in 0..=60 {
        let k = k_f(i as f64 / 100.0);
        assert!(k >= last);
        last = k;
    }
}
