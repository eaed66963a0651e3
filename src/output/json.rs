//! JSON output of `check`: one object, SI units, x aft of the file's datum, percent of MAC
//! aft of the MAC leading edge. Every field is documented in `docs/json.md`.

use crate::analysis::{AftLimit, Analysis, BandPosition, ForwardLimit};
use crate::balance::BallastOutcome;
use crate::caution::Caution;
use crate::model::Aircraft;
use serde::Serialize;

mod aero;
mod glide;
pub use aero::*;
pub use glide::*;

/// The unit convention of every JSON document the tool writes (`check`, `compare`, `sweep`),
/// stated in each document's `units`.
pub const JSON_UNITS: &str = "SI (lengths m, masses kg, speeds m/s, density kg/m^3) except \
     angles in degrees and static margins and positions in percent of the MAC where the name \
     says so; each name ends in its unit; the same in check, compare and sweep";

/// The whole `check --json` document.
#[derive(Debug, Serialize)]
pub struct CheckDocument {
    /// Tool and format version.
    pub trimline_version: &'static str,
    /// The unit convention ([`JSON_UNITS`]).
    pub units: &'static str,
    /// Aircraft identity.
    pub aircraft: AircraftJson,
    /// The air.
    pub air: AirJson,
    /// Masses.
    pub mass: MassJson,
    /// Balance.
    pub balance: BalanceJson,
    /// Wing.
    pub wing: SurfaceJson,
    /// Stabiliser, or null.
    pub stabiliser: Option<StabiliserJson>,
    /// The lateral note of a fin and of a V-tail, or null (neither).
    pub fin: Option<FinNoteJson>,
    /// Airfoil sections.
    pub sections: Vec<SectionJson>,
    /// Stability.
    pub stability: StabilityJson,
    /// Trim.
    pub trim: TrimJson,
    /// Stall.
    pub stall: StallJson,
    /// Glide performance (headline figures).
    pub glide: GlideJson,
    /// The flight polar over the speed range, or null when it was not computed.
    pub flight_polar: Option<FlightPolarJson>,
    /// The flight polar of each named flap setting.
    pub flap_settings: Vec<FlapSettingJson>,
    /// Solves from the lifting-line model (decalage, CG, elevator schedule).
    pub solves: Option<SolvesJson>,
    /// Wing spanwise loading (lifting line), starboard half, root to tip.
    pub spanwise: Vec<SpanwiseJson>,
    /// Cautions.
    pub cautions: Vec<CautionJson>,
}

/// `/fin`: a lateral note only; nothing here enters a pitch figure.
#[derive(Debug, Serialize)]
pub struct FinNoteJson {
    /// The file's `[fin]`, or null.
    pub fin: Option<FinFiguresJson>,
    /// The V-tail's side projection, or null (no V-tail).
    pub vee_tail: Option<FinFiguresJson>,
}

/// `/fin/fin`, `/fin/vee_tail`
#[derive(Debug, Serialize)]
pub struct FinFiguresJson {
    /// m^2
    pub side_area_m2: f64,
    /// m, wing MAC quarter chord to the fin's
    pub arm_m: f64,
    /// S_v l_v / (S b)
    pub volume_coefficient: f64,
}

fn fin_figures_json(f: &crate::analysis::FinFigures) -> FinFiguresJson {
    FinFiguresJson {
        side_area_m2: r(f.side_area_m2, 6),
        arm_m: r(f.arm_m, 5),
        volume_coefficient: r(f.volume_coefficient, 4),
    }
}

/// `/aircraft`
#[derive(Debug, Serialize)]
pub struct AircraftJson {
    /// Name.
    pub name: String,
    /// Notes.
    pub notes: String,
    /// What x = 0 is.
    pub datum: String,
    /// Input file, or `<built-in demo>`.
    pub source: String,
}

/// `/air`
#[derive(Debug, Serialize)]
pub struct AirJson {
    /// kg/m^3
    pub density_kg_m3: f64,
    /// K
    pub temperature_k: f64,
    /// Pa
    pub pressure_pa: f64,
    /// Pa s
    pub viscosity_pa_s: f64,
}

/// `/mass`
#[derive(Debug, Serialize)]
pub struct MassJson {
    /// kg
    pub total_kg: f64,
    /// kg/m^2
    pub wing_loading_kg_m2: f64,
    /// Items.
    pub items: Vec<MassItemJson>,
}

/// `/mass/items/N`
#[derive(Debug, Serialize)]
pub struct MassItemJson {
    /// Name.
    pub name: String,
    /// kg
    pub mass_kg: f64,
    /// m
    pub x_m: f64,
    /// m or null
    pub z_m: Option<f64>,
}

/// `/balance`
#[derive(Debug, Serialize)]
pub struct BalanceJson {
    /// m
    pub cg_x_m: f64,
    /// m or null
    pub cg_z_m: Option<f64>,
    /// Percent of MAC aft of the MAC leading edge.
    pub cg_percent_mac: f64,
    /// One standard deviation of the CG from the builder's tolerances, m (0 without them).
    pub cg_sigma_m: f64,
    /// Aft end of the CG's range (two standard deviations aft), m.
    pub cg_aft_end_x_m: f64,
    /// Recommended band.
    pub band: BandJson,
    /// Ballast advice.
    pub ballast: Vec<BallastJson>,
    /// The weighing, or null.
    pub weighed: Option<WeighedJson>,
}

/// `/balance/weighed`
#[derive(Debug, Serialize)]
pub struct WeighedJson {
    /// kg on the scales
    pub total_kg: f64,
    /// m
    pub cg_x_m: f64,
    /// percent MAC
    pub cg_percent_mac: f64,
    /// m, weighed minus listed
    pub cg_difference_m: f64,
    /// kg, weighed minus listed
    pub mass_difference_kg: f64,
}

/// `/balance/band`
#[derive(Debug, Serialize)]
pub struct BandJson {
    /// m
    pub forward_x_m: f64,
    /// m
    pub aft_x_m: f64,
    /// percent MAC
    pub forward_percent_mac: f64,
    /// percent MAC
    pub aft_percent_mac: f64,
    /// percent
    pub min_static_margin_percent: f64,
    /// percent
    pub max_static_margin_percent: f64,
    /// True when common-practice defaults were used.
    pub from_defaults: bool,
    /// What sets the forward limit: `static-margin` or `elevator-authority`.
    pub forward_limit: &'static str,
    /// What sets the aft end: `static-margin` (the smallest margin on the computed
    /// neutral point) or `neutral-point-range` (that margin from the forward end of the
    /// neutral point's uncertainty range).
    pub aft_limit: &'static str,
    /// Where the CG sits: `forward`, `inside`, `aft`.
    pub cg_position: &'static str,
}

/// `/balance/ballast/N`
#[derive(Debug, Serialize)]
pub struct BallastJson {
    /// Bay name.
    pub bay: String,
    /// m
    pub target_cg_x_m: f64,
    /// True when the target margin lies aft of the band and the advice aims at its aft end.
    pub held_at_band_aft_end: bool,
    /// `not-needed`, `reachable`, `exceeds-bay`, `wrong-side`.
    pub status: &'static str,
    /// kg to add, or null.
    pub mass_kg: Option<f64>,
    /// kg the target would need when it exceeds the bay, or null.
    pub needed_kg: Option<f64>,
    /// kg the bay holds.
    pub max_kg: f64,
}

/// `/cautions/N`
#[derive(Debug, Serialize)]
pub struct CautionJson {
    /// `note`, `warning`, `danger`.
    pub level: &'static str,
    /// Stable code.
    pub code: &'static str,
    /// Text.
    pub message: String,
}

impl From<&Caution> for CautionJson {
    fn from(c: &Caution) -> Self {
        CautionJson {
            level: c.level.as_str(),
            code: c.code,
            message: crate::output::cautions::message(c),
        }
    }
}

/// `v` rounded to `decimals` decimals for stable, readable output (no -0).
pub(crate) fn r(v: f64, decimals: i32) -> f64 {
    let f = 10f64.powi(decimals);
    let out = (v * f).round() / f;
    if out == 0.0 {
        0.0
    } else {
        out
    }
}

/// Build the JSON document for an analysed aircraft.
pub fn check_document(aircraft: &Aircraft, a: &Analysis, source: &str) -> CheckDocument {
    CheckDocument {
        trimline_version: env!("CARGO_PKG_VERSION"),
        units: JSON_UNITS,
        aircraft: AircraftJson {
            name: aircraft.name.clone(),
            notes: aircraft.notes.clone(),
            datum: aircraft.datum.clone(),
            source: source.to_string(),
        },
        air: AirJson {
            density_kg_m3: r(a.air.density_kg_m3, 5),
            temperature_k: r(a.air.temperature_k, 2),
            pressure_pa: r(a.air.pressure_pa, 1),
            viscosity_pa_s: a.air.viscosity_pa_s,
        },
        mass: mass_json(aircraft, a),
        balance: balance_json(aircraft, a),
        wing: surface_json(&a.wing),
        stabiliser: stabiliser_json(aircraft, a),
        fin: a.fin.as_ref().map(|n| FinNoteJson {
            fin: n.fin.as_ref().map(fin_figures_json),
            vee_tail: n.vee_tail.as_ref().map(fin_figures_json),
        }),
        sections: sections_json(aircraft, a),
        stability: stability_json(aircraft, a),
        trim: trim_json(aircraft, a),
        stall: stall_json(a),
        solves: solves_json(aircraft, a),
        spanwise: spanwise_json(a),
        glide: glide_json(a),
        flight_polar: a
            .glide_polar
            .as_ref()
            .map(|p| flight_polar_json(aircraft, p)),
        flap_settings: flap_settings_json(aircraft, a),
        cautions: a.cautions.iter().map(CautionJson::from).collect(),
    }
}

/// `/mass`
fn mass_json(aircraft: &Aircraft, a: &Analysis) -> MassJson {
    MassJson {
        total_kg: r(a.mass.total_kg, 5),
        wing_loading_kg_m2: r(a.wing_loading_kg_m2, 4),
        items: aircraft
            .masses
            .iter()
            .map(|m| MassItemJson {
                name: m.name.clone(),
                mass_kg: r(m.mass_kg, 5),
                x_m: r(m.x_m, 5),
                z_m: m.z_m.map(|z| r(z, 5)),
            })
            .collect(),
    }
}

/// `/balance`
fn balance_json(aircraft: &Aircraft, a: &Analysis) -> BalanceJson {
    let g = &a.wing_geometry;
    let band_pos = match a.band.position(a.mass.cg_x_m) {
        BandPosition::Forward => "forward",
        BandPosition::Aft => "aft",
        BandPosition::Inside => "inside",
    };
    BalanceJson {
        cg_x_m: r(a.mass.cg_x_m, 5),
        cg_z_m: a.mass.cg_z_m.map(|z| r(z, 5)),
        cg_percent_mac: r(g.percent_mac(a.mass.cg_x_m), 2),
        cg_sigma_m: r(finite_or_zero(a.cg_spread.sigma_m), 5),
        cg_aft_end_x_m: r(a.mass.cg_x_m + 2.0 * finite_or_zero(a.cg_spread.sigma_m), 5),
        band: BandJson {
            forward_x_m: r(a.band.forward_x_m, 5),
            aft_x_m: r(a.band.aft_x_m, 5),
            forward_percent_mac: r(g.percent_mac(a.band.forward_x_m), 2),
            aft_percent_mac: r(g.percent_mac(a.band.aft_x_m), 2),
            min_static_margin_percent: r(100.0 * aircraft.margin_limits.min_static_margin, 2),
            max_static_margin_percent: r(100.0 * aircraft.margin_limits.max_static_margin, 2),
            from_defaults: aircraft.margin_limits.from_defaults,
            aft_limit: match a.band.aft_limit {
                AftLimit::StaticMargin => "static-margin",
                AftLimit::NeutralPointRange => "neutral-point-range",
            },
            forward_limit: match a.band.forward_limit {
                ForwardLimit::StaticMargin => "static-margin",
                ForwardLimit::ElevatorAuthority => "elevator-authority",
                ForwardLimit::TailStall => "tail-stall",
            },
            cg_position: band_pos,
        },
        ballast: a
            .ballast
            .iter()
            .map(|b| {
                let max_kg = aircraft
                    .ballast_bays
                    .iter()
                    .find(|bay| bay.name == b.bay)
                    .map(|bay| bay.max_mass_kg)
                    .unwrap_or(0.0);
                let (status, mass_kg, needed_kg) = match b.outcome {
                    BallastOutcome::NotNeeded => ("not-needed", Some(0.0), None),
                    BallastOutcome::Reachable { mass_kg } => {
                        ("reachable", Some(r(mass_kg, 5)), None)
                    }
                    BallastOutcome::ExceedsBay { needed_kg, .. } => {
                        ("exceeds-bay", None, Some(r(needed_kg, 5)))
                    }
                    BallastOutcome::WrongSide => ("wrong-side", None, None),
                };
                BallastJson {
                    bay: b.bay.clone(),
                    target_cg_x_m: r(b.target_x_m, 5),
                    held_at_band_aft_end: b.held_at_band_aft_end,
                    status,
                    mass_kg,
                    needed_kg,
                    max_kg: r(max_kg, 5),
                }
            })
            .collect(),
        weighed: a.weighed.map(|w| WeighedJson {
            total_kg: r(w.total_kg, 5),
            cg_x_m: r(w.cg_x_m, 5),
            cg_percent_mac: r(g.percent_mac(w.cg_x_m), 2),
            cg_difference_m: r(w.cg_x_m - a.mass.cg_x_m, 5),
            mass_difference_kg: r(w.total_kg - a.mass.total_kg, 5),
        }),
    }
}

/// `v`, or 0 where it is not finite (no spread is claimed then).
fn finite_or_zero(v: f64) -> f64 {
    if v.is_finite() {
        v
    } else {
        0.0
    }
}
