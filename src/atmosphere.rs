//! International Standard Atmosphere, troposphere (500 m below sea level to 11 km geopotential
//! altitude). The troposphere law holds below sea level unchanged: the 1976 standard defines
//! its first layer from -5 km (geometric) upwards, so a negative altitude is computed, not
//! clamped to 0 (-400 m gives 1.2727 kg/m^3).
//!
//! Temperature falls linearly at 6.5 K/km from 288.15 K; pressure follows the hydrostatic law
//! for that lapse rate; density from the ideal-gas law. A temperature offset shifts the
//! temperature at a given pressure altitude (the usual "ISA + dT" day), which changes density
//! but not pressure. Viscosity from Sutherland's law.
//!
//! Altitudes are geopotential; below 2 km they differ from geometric altitude by less than
//! 0.03 %, which is far inside every other uncertainty here.
//!
//! # References
//! - U.S. Standard Atmosphere, 1976 (NOAA/NASA/USAF), eqs. 23 and 33 (pressure for a non-zero
//!   lapse rate), Table I (sea-level values), eq. 51 (Sutherland viscosity).
//! - ICAO Doc 7488/3, Manual of the ICAO Standard Atmosphere (identical below 32 km).

use crate::model::Air;

/// Sea-level standard temperature, K.
pub const T0_K: f64 = 288.15;
/// Sea-level standard pressure, Pa.
pub const P0_PA: f64 = 101_325.0;
/// Troposphere lapse rate, K/m.
pub const LAPSE_K_PER_M: f64 = 0.0065;
/// Specific gas constant of dry air, J/(kg K) (R* / M0 of the 1976 standard).
pub const R_AIR: f64 = 287.052_87;
/// Standard gravity, m/s^2.
pub const G0: f64 = 9.806_65;
/// Sutherland's constant beta, kg/(m s K^0.5).
const SUTHERLAND_BETA: f64 = 1.458e-6;
/// Sutherland's constant S, K.
const SUTHERLAND_S_K: f64 = 110.4;
/// Highest altitude this model covers, m (top of the troposphere).
pub const MAX_ALTITUDE_M: f64 = 11_000.0;

/// The state of the air at one point.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct AirState {
    /// Density, kg/m^3.
    pub density_kg_m3: f64,
    /// Temperature, K.
    pub temperature_k: f64,
    /// Static pressure, Pa.
    pub pressure_pa: f64,
    /// Dynamic viscosity, Pa s.
    pub viscosity_pa_s: f64,
}

impl AirState {
    /// Kinematic viscosity, m^2/s.
    pub fn kinematic_viscosity_m2_s(&self) -> f64 {
        self.viscosity_pa_s / self.density_kg_m3
    }

    /// Reynolds number for a speed (m/s) and a length (m).
    pub fn reynolds(&self, speed_m_s: f64, length_m: f64) -> f64 {
        speed_m_s * length_m / self.kinematic_viscosity_m2_s()
    }
}

/// Dynamic viscosity from Sutherland's law, Pa s, at temperature `t_k` (K).
pub fn sutherland_viscosity(t_k: f64) -> f64 {
    SUTHERLAND_BETA * t_k.powf(1.5) / (t_k + SUTHERLAND_S_K)
}

/// Lowest altitude accepted, m (the troposphere law holds below sea level too).
pub const MIN_ALTITUDE_M: f64 = -500.0;

/// ISA state at geopotential altitude `altitude_m` (clamped to -500..=11 000 m) with a temperature
/// offset `temperature_offset_k` from the standard day.
pub fn isa(altitude_m: f64, temperature_offset_k: f64) -> AirState {
    let h = altitude_m.clamp(MIN_ALTITUDE_M, MAX_ALTITUDE_M);
    let t_std = T0_K - LAPSE_K_PER_M * h;
    let exponent = G0 / (R_AIR * LAPSE_K_PER_M);
    let pressure_pa = P0_PA * (t_std / T0_K).powf(exponent);
    let temperature_k = t_std + temperature_offset_k;
    AirState {
        density_kg_m3: pressure_pa / (R_AIR * temperature_k),
        temperature_k,
        pressure_pa,
        viscosity_pa_s: sutherland_viscosity(temperature_k),
    }
}

/// The air state for an aircraft file's [`Air`] description. A directly given density uses the
/// sea-level standard temperature and viscosity.
pub fn air_state(air: &Air) -> AirState {
    match *air {
        Air::Standard {
            altitude_m,
            temperature_offset_k,
        } => isa(altitude_m, temperature_offset_k),
        Air::Density { density_kg_m3 } => AirState {
            density_kg_m3,
            temperature_k: T0_K,
            pressure_pa: density_kg_m3 * R_AIR * T0_K,
            viscosity_pa_s: sutherland_viscosity(T0_K),
        },
    }
}
