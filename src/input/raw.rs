//! First stage of reading an aircraft file: a mirror of the TOML text, with every value's
//! position kept so that validation errors can point at it. Unknown keys are refused here.
//!
//! Required keys are `Option`s all the same: validation reports a missing one at its table,
//! with the full key path and the accepted range, which serde's own "missing field" cannot.

use serde::Deserialize;
use std::collections::BTreeMap;
use toml::Spanned;

/// A value that may be a bare number (in the field's default unit) or a string with a unit.
pub type Quantity = Spanned<toml::Value>;

/// The whole file.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawAircraft {
    pub name: Option<Spanned<String>>,
    #[serde(default)]
    pub notes: Option<String>,
    #[serde(default)]
    pub datum: Option<String>,
    #[serde(default)]
    pub air: Option<RawAir>,
    #[serde(default)]
    pub airfoils: BTreeMap<String, Spanned<RawAirfoil>>,
    pub wing: Option<Spanned<RawSurface>>,
    #[serde(default)]
    pub stabiliser: Option<Spanned<RawSurface>>,
    #[serde(default)]
    pub fuselage: Option<Spanned<RawFuselage>>,
    #[serde(default)]
    pub fin: Option<Spanned<RawFin>>,
    #[serde(default)]
    pub tolerances: Option<Spanned<RawTolerances>>,
    #[serde(default)]
    pub mass: Vec<Spanned<RawMass>>,
    #[serde(default)]
    pub ballast: Vec<Spanned<RawBallast>>,
    #[serde(default)]
    pub targets: Option<RawTargets>,
    #[serde(default)]
    pub limits: Option<RawLimits>,
    #[serde(default)]
    pub setup: Vec<Spanned<RawSetup>>,
    #[serde(default)]
    pub flap_setting: Vec<Spanned<RawFlapSetting>>,
    #[serde(default)]
    pub weighing: Vec<Spanned<RawSupport>>,
    #[serde(default)]
    pub numerics: Option<RawNumerics>,
}

/// `[numerics]`: the wing model and its resolution.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawNumerics {
    pub wing_model: Option<Spanned<String>>,
    pub spanwise_strips: Option<Quantity>,
    pub chordwise_panels: Option<Quantity>,
}

/// `[[weighing]]`: one support of a weighing.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawSupport {
    pub x: Option<Quantity>,
    pub reading: Option<Quantity>,
}

/// `[air]`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawAir {
    pub altitude: Option<Quantity>,
    pub temperature_offset: Option<Quantity>,
    pub density: Option<Quantity>,
}

/// `[airfoils.NAME]`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawAirfoil {
    pub naca: Option<Spanned<toml::Value>>,
    pub joukowski: Option<Spanned<RawJoukowski>>,
    pub karman_trefftz: Option<Spanned<RawKarmanTrefftz>>,
    pub coordinates: Option<Spanned<String>>,
    pub cl_max: Option<Quantity>,
    pub method: Option<Spanned<String>>,
    pub reynolds: Option<Quantity>,
    pub transition_n: Option<Quantity>,
}

/// `joukowski = { thickness = 12, camber = 3 }` (percent of chord)
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawJoukowski {
    pub thickness: Option<Quantity>,
    #[serde(default)]
    pub camber: Option<Quantity>,
}

/// `karman_trefftz = { thickness = 12, camber = 3, trailing_edge_angle = 8 }`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawKarmanTrefftz {
    pub thickness: Option<Quantity>,
    #[serde(default)]
    pub camber: Option<Quantity>,
    pub trailing_edge_angle: Option<Quantity>,
}

/// `[wing]` and `[stabiliser]`. `role` and the `elevator_*` keys belong to the stabiliser
/// only, `elevons` to a tailless wing only; validation refuses them elsewhere.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawSurface {
    pub x: Option<Quantity>,
    pub z: Option<Quantity>,
    pub incidence: Option<Quantity>,
    pub root_chord: Option<Quantity>,
    pub airfoil: Option<Spanned<String>>,
    #[serde(default)]
    pub panel: Vec<Spanned<RawPanel>>,
    pub ellipse: Option<Spanned<RawEllipse>>,
    pub role: Option<Spanned<String>>,
    pub elevator_chord: Option<Quantity>,
    pub elevator_up: Option<Quantity>,
    pub elevator_down: Option<Quantity>,
    pub dynamic_pressure_ratio: Option<Quantity>,
    pub elevons: Option<Spanned<RawElevons>>,
    #[serde(default)]
    pub flap: Vec<Spanned<RawFlap>>,
}

/// `[[wing.flap]]`: a trailing-edge surface used as a camber flap (both sides together).
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawFlap {
    pub name: Option<Spanned<String>>,
    pub chord: Option<Quantity>,
    pub inboard: Option<Quantity>,
    pub outboard: Option<Quantity>,
}

/// `[[flap_setting]]`: a named setting, a deflection per flap name.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawFlapSetting {
    pub name: Option<Spanned<String>>,
    #[serde(default)]
    pub deflect: BTreeMap<String, Quantity>,
}

/// `[wing.elevons]`: the elevons of a tailless wing, used together for pitch.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawElevons {
    pub chord: Option<Quantity>,
    pub inboard: Option<Quantity>,
    pub outboard: Option<Quantity>,
    pub up: Option<Quantity>,
    pub down: Option<Quantity>,
}

/// `[[wing.panel]]`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawPanel {
    pub span: Option<Quantity>,
    pub root_chord: Option<Quantity>,
    pub tip_chord: Option<Quantity>,
    pub sweep: Option<Quantity>,
    pub dihedral: Option<Quantity>,
    pub twist: Option<Quantity>,
    pub tip_airfoil: Option<Spanned<String>>,
}

/// `[wing.ellipse]`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawEllipse {
    pub span: Option<Quantity>,
    pub dihedral: Option<Quantity>,
    pub twist: Option<Quantity>,
    pub tip_airfoil: Option<Spanned<String>>,
}

/// `[fuselage]`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawFuselage {
    pub nose_x: Option<Quantity>,
    pub length: Option<Quantity>,
    pub width: Option<Quantity>,
}

/// `[fin]`: an optional fin (vertical tail), drawing and lateral note only.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawFin {
    pub x: Option<Quantity>,
    pub z: Option<Quantity>,
    pub root_chord: Option<Quantity>,
    pub tip_chord: Option<Quantity>,
    pub height: Option<Quantity>,
    pub sweep: Option<Quantity>,
    pub mass_item: Option<Spanned<String>>,
}

/// `[tolerances]`: how sure the builder is of every mass and position, for the CG's spread.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawTolerances {
    pub mass: Option<Quantity>,
    pub position: Option<Quantity>,
}

/// `[[mass]]`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawMass {
    pub name: Option<Spanned<String>>,
    pub mass: Option<Quantity>,
    pub x: Option<Quantity>,
    pub z: Option<Quantity>,
    pub mass_tolerance: Option<Quantity>,
    pub x_tolerance: Option<Quantity>,
}

/// `[[ballast]]`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawBallast {
    pub name: Option<Spanned<String>>,
    pub x: Option<Quantity>,
    pub z: Option<Quantity>,
    pub max: Option<Quantity>,
}

/// `[targets]`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawTargets {
    pub static_margin: Option<Quantity>,
    pub trim_speed: Option<Quantity>,
    pub top_speed: Option<Quantity>,
}

/// `[limits]`
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawLimits {
    pub min_static_margin: Option<Quantity>,
    pub max_static_margin: Option<Quantity>,
    pub negative_margin_intended: Option<Spanned<bool>>,
}

/// `[[setup]]`: a named variation of the aircraft for comparisons.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct RawSetup {
    pub name: Option<Spanned<String>>,
    /// Ballast bay name -> mass added there.
    #[serde(default)]
    pub ballast: BTreeMap<String, Quantity>,
    /// Mass item name -> new x.
    #[serde(default)]
    pub mass_x: BTreeMap<String, Quantity>,
    /// Mass item name -> new mass.
    #[serde(default)]
    pub mass: BTreeMap<String, Quantity>,
    pub wing_incidence: Option<Quantity>,
    pub stabiliser_incidence: Option<Quantity>,
    /// Airfoil name -> airfoil name to use instead, everywhere it appears.
    #[serde(default)]
    pub airfoils: BTreeMap<String, Spanned<String>>,
    /// `[[setup.weighing]]`: a weighing of this setup.
    #[serde(default)]
    pub weighing: Vec<Spanned<RawSupport>>,
}
