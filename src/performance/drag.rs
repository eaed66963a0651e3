//! Zero-lift drag by component build-up: skin friction of a flat plate at the component's
//! Reynolds number, times a form factor for thickness, times wetted area.
//!
//! - Laminar flat plate `Cf = 1.328 / sqrt(Re)` (Blasius); turbulent
//!   `Cf = 0.455 / (log10 Re)^2.58` (Prandtl-Schlichting, low Mach form). Model-scale surfaces
//!   run partly laminar: lifting surfaces take the mean of the two, i.e. about half the chord
//!   laminar (common practice for smooth model surfaces at Re 1e5 to 5e5; a judgement, not a
//!   measurement); fuselages are taken fully turbulent.
//! - Form factor of a lifting surface `FF = 1 + 0.6 / (x/c)_m (t/c) + 100 (t/c)^4` with the
//!   Mach term left out (it is 1 at model speeds); of a body `FF = 1 + 60 / f^3 + f / 400`,
//!   f = length / width.
//! - Wetted area of a lifting surface `S_wet = S (1.977 + 0.52 t/c)`; of a fuselage, that of an
//!   ellipsoid-like body, `S_wet = 0.75 pi w L` (a slender body of revolution with pointed ends
//!   has a factor between 2/3 and pi/4; 0.75 is a judgement).
//! - 10 % is added for interference and small items (common practice).
//!
//! # References
//! - D. P. Raymer, *Aircraft Design: A Conceptual Approach*, 6th ed., eqs. 12.25-12.27 (skin
//!   friction), 12.30-12.31 (form factors), sec. 7.9 (wetted area of a wing).
//! - H. Schlichting, *Boundary-Layer Theory* (flat-plate friction laws).

/// Laminar flat-plate skin-friction coefficient at Reynolds number `re` (Blasius).
pub fn cf_laminar(re: f64) -> f64 {
    1.328 / re.sqrt()
}

/// Turbulent flat-plate skin-friction coefficient at Reynolds number `re` (low Mach).
pub fn cf_turbulent(re: f64) -> f64 {
    0.455 / re.log10().powf(2.58)
}

/// Skin friction taken for lifting surfaces: the mean of laminar and turbulent values.
pub fn cf_surface(re: f64) -> f64 {
    0.5 * (cf_laminar(re) + cf_turbulent(re))
}

/// Form factor of a lifting surface of thickness ratio `t_c` with greatest thickness at
/// `x_t_c` (fraction of chord), without the Mach term.
pub fn form_factor_surface(t_c: f64, x_t_c: f64) -> f64 {
    1.0 + 0.6 / x_t_c * t_c + 100.0 * t_c.powi(4)
}

/// Form factor of a body of fineness ratio `f` = length / greatest width.
pub fn form_factor_body(f: f64) -> f64 {
    1.0 + 60.0 / f.powi(3) + f / 400.0
}

/// Extra drag for interference and small items, fraction of the component sum
/// (common practice).
pub const INTERFERENCE_FRACTION: f64 = 0.10;

/// A lifting surface for the drag build-up.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SurfaceDragInput {
    /// Planform area, m^2.
    pub area_m2: f64,
    /// Mean aerodynamic chord, m.
    pub mac_m: f64,
    /// Thickness ratio.
    pub thickness_ratio: f64,
    /// Position of greatest thickness, fraction of chord.
    pub x_thickness_c: f64,
}

/// A fuselage for the drag build-up.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct BodyDragInput {
    /// Length, m.
    pub length_m: f64,
    /// Greatest width, m.
    pub width_m: f64,
}

/// Drag coefficient of a fuselage alone on `reference_area_m2` at speed `speed_m_s` with
/// kinematic viscosity `nu_m2_s` (fully turbulent, no interference allowance).
pub fn body_cd(body: BodyDragInput, reference_area_m2: f64, speed_m_s: f64, nu_m2_s: f64) -> f64 {
    let re = speed_m_s * body.length_m / nu_m2_s;
    let wet = 0.75 * std::f64::consts::PI * body.width_m * body.length_m;
    cf_turbulent(re) * form_factor_body(body.length_m / body.width_m) * wet / reference_area_m2
}

/// Zero-lift drag coefficient on `reference_area_m2` at speed `speed_m_s` with kinematic
/// viscosity `nu_m2_s`.
pub fn cd0(
    surfaces: &[SurfaceDragInput],
    body: Option<BodyDragInput>,
    reference_area_m2: f64,
    speed_m_s: f64,
    nu_m2_s: f64,
) -> f64 {
    let mut sum = 0.0;
    for s in surfaces {
        let re = speed_m_s * s.mac_m / nu_m2_s;
        let wet = s.area_m2 * (1.977 + 0.52 * s.thickness_ratio);
        sum += cf_surface(re) * form_factor_surface(s.thickness_ratio, s.x_thickness_c) * wet;
    }
    if let Some(b) = body {
        sum += body_cd(b, 1.0, speed_m_s, nu_m2_s);
    }
    (1.0 + INTERFERENCE_FRACTION) * sum / reference_area_m2
}
