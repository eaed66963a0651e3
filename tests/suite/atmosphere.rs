//! ISA against the published tables.

use approx::assert_relative_eq;
use trimline::atmosphere::{isa, sutherland_viscosity};

// Source: U.S. Standard Atmosphere, 1976 (NOAA-S/T 76-1562), Table I, density at geopotential
// altitude 0, 500, 1000, 2000 m: 1.2250, 1.16727, 1.11164, 1.00649 kg/m^3. Tolerance 0.01 %,
// the table's printed precision.
#[test]
fn density_matches_us_standard_atmosphere_1976() {
    for (h, rho) in [
        (0.0, 1.2250),
        (500.0, 1.16727),
        (1000.0, 1.11164),
        (2000.0, 1.00649),
    ] {
        assert_relative_eq!(isa(h, 0.0).density_kg_m3, rho, max_relative = 1e-4);
    }
}

// Same source, Table I: temperature 281.65 K and pressure 89 874.6 Pa at 1000 m.
#[test]
fn temperature_and_pressure_at_1000_m() {
    let s = isa(1000.0, 0.0);
    assert_relative_eq!(s.temperature_k, 281.65, epsilon = 1e-9);
    assert_relative_eq!(s.pressure_pa, 89_874.6, max_relative = 1e-5);
}

// Sutherland's law as given in the 1976 standard (eq. 51): sea-level viscosity
// 1.7894e-5 Pa s (Table I). Tolerance 1e-4 relative (table precision).
#[test]
fn sea_level_viscosity() {
    assert_relative_eq!(sutherland_viscosity(288.15), 1.7894e-5, max_relative = 1e-4);
}

// A warmer day at the same pressure altitude has lower density in proportion to absolute
// temperature (ideal-gas law, p = rho R T at fixed p).
#[test]
fn temperature_offset_lowers_density_by_ideal_gas_law() {
    let std_day = isa(500.0, 0.0);
    let hot = isa(500.0, 15.0);
    assert_relative_eq!(hot.pressure_pa, std_day.pressure_pa, epsilon = 1e-9);
    assert_relative_eq!(
        hot.density_kg_m3 / std_day.density_kg_m3,
        std_day.temperature_k / hot.temperature_k,
        epsilon = 1e-12
    );
}
