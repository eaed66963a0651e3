//! How uncertain the neutral point is: linear sensitivities of the closed-form neutral point
//! to the inputs the tool cannot know well, combined root-sum-square, with a Monte Carlo
//! estimate of the same spread as a check.
//!
//! The neutral point is the lift-weighted form of [`super::classical`],
//! `x_n = (a_w x_w + k x_t)/(a_w + k) - c dCm_f/(a_w + k)`, `k = eta (S_t/S) a_t (1 - d eps/d
//! alpha)`. Each uncertain input is given a spread, read as one standard deviation:
//!
//! | input | spread | basis |
//! |---|---|---|
//! | tail dynamic-pressure ratio eta | 0.05 (absolute) | about 0.9 is the usual value for an aft tail (Etkin and Reid; Raymer ch. 16; from memory); the spread is a judgement (common practice) |
//! | downwash gradient | 15 % | a judgement: the simple far-wake form ignores the tail's height and distance behind the wing |
//! | fuselage term dCm_f | 30 % | a judgement: Gilruth-White is an empirical fit |
//! | section lift slopes (wing, tail) | 7 % each | a judgement: panel-method slopes are inviscid and real model sections fall below them |
//! | wing aerodynamic centre | 1.5 % of the MAC (absolute) | a judgement: measured section aerodynamic centres lie between about 0.24 and 0.27 of the chord (Abbott and von Doenhoff, *Theory of Wing Sections*, app. IV; from memory) and move with laminar separation bubbles at model Reynolds numbers; the spanwise loading of a swept or twisted wing adds model error of about the same size (common practice). It is the main term of a tailless wing, whose neutral point is the wing's own aerodynamic centre |
//!
//! The linear estimate is `sigma^2 = sum (d x_n / d p_i sigma_i)^2` with central differences
//! in each input (the inputs taken independent); the Monte Carlo samples every input from a
//! normal distribution with those standard deviations and takes the standard deviation of the
//! neutral points. The two agree when the neutral point is close to linear over the spreads,
//! which the validation tests check.
//!
//! The CG has its own spread, from the builder's tolerances (`[tolerances]` and each mass
//! item's `mass_tolerance`, `x_tolerance`, read as standard deviations): with
//! `x_cg = sum m_i x_i / M`, the first-order propagation gives
//! `sigma_cg^2 = sum ((x_i - x_cg)/M sigma_m,i)^2 + sum (m_i/M sigma_x,i)^2`, the masses and
//! positions taken independent. With no tolerances in the file it is zero, and the figures
//! are those of the neutral point's spread alone.
//!
//! # References
//! - B. Etkin, L. D. Reid, *Dynamics of Flight: Stability and Control*, 3rd ed., sec. 2.4 (the
//!   neutral point of wing and tail, tail efficiency).
//! - First-order propagation of independent errors (any text on measurement uncertainty, e.g.
//!   the ISO Guide to the Expression of Uncertainty in Measurement, sec. 5.1).

use super::classical::{estimate, helmbold_lift_slope, EquivalentSurface, EstimateInput};
use crate::model::{MassItem, Tolerances};

/// The CG's spread from the builder's tolerances.
#[derive(Debug, Clone, Copy, PartialEq, Default)]
pub struct CgSpread {
    /// Combined standard deviation of the CG's x, m.
    pub sigma_m: f64,
    /// The share of the mass tolerances alone (root-sum-square), m.
    pub from_masses_m: f64,
    /// The share of the position tolerances alone (root-sum-square), m.
    pub from_positions_m: f64,
}

/// The spread of the CG of `masses` from the builder's `tolerances` (first-order propagation
/// of independent errors, GUM sec. 5.1, eq. (10)). Zero when no tolerance is given; zero
/// also for a total mass of zero (no CG to spread: the mass summary refuses that list).
pub fn cg_spread(masses: &[MassItem], tolerances: &Tolerances) -> CgSpread {
    let total: f64 = masses.iter().map(|m| m.mass_kg).sum();
    if total.is_nan() || total <= 0.0 {
        return CgSpread::default();
    }
    let cg = masses.iter().map(|m| m.mass_kg * m.x_m).sum::<f64>() / total;
    let (mut from_masses, mut from_positions) = (0.0, 0.0);
    for m in masses {
        let (sigma_mass_kg, sigma_x_m) = tolerances.of(m);
        // d x_cg / d m_i = (x_i - x_cg) / M;  d x_cg / d x_i = m_i / M.
        from_masses += ((m.x_m - cg) / total * sigma_mass_kg).powi(2);
        from_positions += (m.mass_kg / total * sigma_x_m).powi(2);
    }
    CgSpread {
        sigma_m: (from_masses + from_positions).sqrt(),
        from_masses_m: from_masses.sqrt(),
        from_positions_m: from_positions.sqrt(),
    }
}

/// How many uncertain inputs there are.
pub const INPUT_COUNT: usize = 6;

/// Spreads (one standard deviation) of the uncertain inputs.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Spreads {
    /// Tail dynamic-pressure ratio, absolute.
    pub dynamic_pressure_ratio: f64,
    /// Downwash gradient, relative.
    pub downwash_gradient: f64,
    /// Fuselage contribution to dCm/dalpha, relative.
    pub fuselage: f64,
    /// Wing section lift slope, relative.
    pub wing_section_slope: f64,
    /// Stabiliser section lift slope, relative.
    pub stabiliser_section_slope: f64,
    /// Position of the wing's aerodynamic centre, absolute, as a fraction of the wing's MAC.
    pub wing_aerodynamic_centre_mac: f64,
}

/// The spreads of the table in the module doc (common practice).
pub const COMMON_SPREADS: Spreads = Spreads {
    dynamic_pressure_ratio: 0.05,
    downwash_gradient: 0.15,
    fuselage: 0.30,
    wing_section_slope: 0.07,
    stabiliser_section_slope: 0.07,
    wing_aerodynamic_centre_mac: 0.015,
};

/// Names of the inputs, in the order of [`NeutralPointSpread::contributions_m`].
pub const INPUT_NAMES: [&str; INPUT_COUNT] = [
    "tail dynamic-pressure ratio",
    "downwash gradient",
    "fuselage term",
    "wing section lift slope",
    "stabiliser section lift slope",
    "wing aerodynamic centre",
];

/// The neutral point's spread.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct NeutralPointSpread {
    /// Combined standard deviation, m.
    pub sigma_m: f64,
    /// Each input's share (sensitivity times spread), m, signed, in [`INPUT_NAMES`] order.
    pub contributions_m: [f64; INPUT_COUNT],
}

/// Deviations of the inputs from their nominal values, in units of the inputs (absolute for
/// eta and for the wing's aerodynamic centre, a fraction of its MAC; relative for the others).
fn neutral_point_with(input: &EstimateInput<'_>, d: [f64; INPUT_COUNT]) -> f64 {
    let surface = |s: &EquivalentSurface, rel: f64| {
        let a0 = s.section_cl_alpha_per_rad * (1.0 + rel);
        EquivalentSurface {
            section_cl_alpha_per_rad: a0,
            lift_slope_per_rad: helmbold_lift_slope(a0, s.geometry.aspect_ratio),
            ..*s
        }
    };
    let mut wing = surface(input.wing, d[3]);
    wing.x_ac_m += d[5] * wing.geometry.mac_m;
    let stab = input.stabiliser.map(|(s, place)| (surface(s, d[4]), place));
    estimate(&EstimateInput {
        wing: &wing,
        stabiliser: stab.as_ref().map(|(s, p)| (s, *p)),
        stabiliser_dynamic_pressure_ratio: input.stabiliser_dynamic_pressure_ratio + d[0],
        downwash_factor: input.downwash_factor * (1.0 + d[1]),
        fuselage_cm_alpha_per_rad: input.fuselage_cm_alpha_per_rad * (1.0 + d[2]),
        ..*input
    })
    .neutral_point_x_m
}

fn sigmas(s: &Spreads) -> [f64; INPUT_COUNT] {
    [
        s.dynamic_pressure_ratio,
        s.downwash_gradient,
        s.fuselage,
        s.wing_section_slope,
        s.stabiliser_section_slope,
        s.wing_aerodynamic_centre_mac,
    ]
}

/// The linear (first-order) spread of the closed-form neutral point of `input`.
pub fn linear_spread(input: &EstimateInput<'_>, spreads: &Spreads) -> NeutralPointSpread {
    let sig = sigmas(spreads);
    let mut contributions_m = [0.0; INPUT_COUNT];
    for i in 0..INPUT_COUNT {
        if sig[i] == 0.0 {
            continue;
        }
        // Central difference over +-1 % of the spread: the derivative, to second order.
        let h = 0.01 * sig[i];
        let (mut up, mut down) = ([0.0; INPUT_COUNT], [0.0; INPUT_COUNT]);
        up[i] = h;
        down[i] = -h;
        let slope = (neutral_point_with(input, up) - neutral_point_with(input, down)) / (2.0 * h);
        contributions_m[i] = slope * sig[i];
    }
    NeutralPointSpread {
        sigma_m: contributions_m.iter().map(|c| c * c).sum::<f64>().sqrt(),
        contributions_m,
    }
}

/// A small deterministic generator (xorshift64*, Vigna 2016) for the Monte Carlo: the same
/// seed gives the same samples, so the check is repeatable.
struct Xorshift(u64);

impl Xorshift {
    fn next_unit(&mut self) -> f64 {
        self.0 ^= self.0 >> 12;
        self.0 ^= self.0 << 25;
        self.0 ^= self.0 >> 27;
        let x = self.0.wrapping_mul(0x2545_F491_4F6C_DD1D);
        // 53 random bits in (0, 1).
        ((x >> 11) as f64 + 0.5) / (1u64 << 53) as f64
    }

    /// A standard normal sample (Box-Muller).
    fn normal(&mut self) -> f64 {
        let (u1, u2) = (self.next_unit(), self.next_unit());
        (-2.0 * u1.ln()).sqrt() * (2.0 * std::f64::consts::PI * u2).cos()
    }
}

/// Standard deviation of the closed-form neutral point over `samples` Monte Carlo draws of
/// the inputs (normal, standard deviations `spreads`), m.
pub fn monte_carlo_sigma_m(
    input: &EstimateInput<'_>,
    spreads: &Spreads,
    samples: usize,
    seed: u64,
) -> f64 {
    let sig = sigmas(spreads);
    let mut rng = Xorshift(seed.max(1));
    let (mut sum, mut sum2) = (0.0, 0.0);
    for _ in 0..samples {
        let mut d = [0.0; INPUT_COUNT];
        for i in 0..INPUT_COUNT {
            d[i] = sig[i] * rng.normal();
        }
        let x = neutral_point_with(input, d);
        sum += x;
        sum2 += x * x;
    }
    let n = samples.max(2) as f64;
    let mean = sum / n;
    ((sum2 / n - mean * mean).max(0.0) * n / (n - 1.0)).sqrt()
}
