//! The cautions on balance and trim: static margin, CG outside the band, the CG's tolerance
//! range against the uncertain aft limit, trim near or beyond the stall.

use super::{
    BandPosition, CgBand, Headline, CG_BAND_ALLOWANCE_M, LOW_STATIC_MARGIN, NEAR_STALL_FACTOR,
};
use crate::balance::MassSummary;
use crate::caution::Caution;
use crate::finding::{BalanceFinding, Control, FasterTrim};
use crate::model::Aircraft;

pub(super) fn balance_cautions(
    aircraft: &Aircraft,
    mass: &MassSummary,
    h: &Headline,
    band: &CgBand,
    mac_m: f64,
    elevons_trim_it: bool,
    cautions: &mut Vec<Caution>,
) {
    static_margin_cautions(aircraft, mass, h, cautions);
    cg_outside_band_caution(aircraft, mass, band, cautions);
    trim_cautions(aircraft, mass, h, band, elevons_trim_it, cautions);
    band_defaults_note(aircraft, mac_m, cautions);
    target_speed_caution(aircraft, h, cautions);
}

/// `target-speed-near-stall`: the file's target trim speed below the near-stall factor times
/// the stall speed (the decalage and CG solved for it would trim at or near the stall).
pub(super) fn target_speed_caution(aircraft: &Aircraft, h: &Headline, cautions: &mut Vec<Caution>) {
    let Some(target_speed_m_s) = aircraft.targets.trim_speed_m_s else {
        return;
    };
    if target_speed_m_s < NEAR_STALL_FACTOR * h.stall_speed_m_s {
        cautions.push(Caution::of(
            BalanceFinding::TargetSpeedNearStall {
                target_speed_m_s,
                stall_speed_m_s: h.stall_speed_m_s,
                factor: NEAR_STALL_FACTOR,
                has_stabiliser: aircraft.stabiliser.is_some(),
            }
            .into(),
        ));
    }
}

/// The danger `static-margin-negative` or the warning `static-margin-low`.
pub(super) fn static_margin_cautions(
    aircraft: &Aircraft,
    mass: &MassSummary,
    h: &Headline,
    cautions: &mut Vec<Caution>,
) {
    if h.static_margin < 0.0 {
        cautions.push(Caution::of(
            BalanceFinding::StaticMarginNegative {
                cg_behind_neutral_point_m: mass.cg_x_m - h.neutral_point_x_m,
                static_margin: h.static_margin,
            }
            .into(),
        ));
    } else if h.static_margin < LOW_STATIC_MARGIN.min(aircraft.margin_limits.min_static_margin) {
        cautions.push(Caution::of(
            BalanceFinding::StaticMarginLow {
                static_margin: h.static_margin,
            }
            .into(),
        ));
    }
}

/// The warning `cg-aft-of-band` or `cg-forward-of-band` (with why the forward limit is there),
/// when the CG is more than half a millimetre outside the band.
pub(super) fn cg_outside_band_caution(
    aircraft: &Aircraft,
    mass: &MassSummary,
    band: &CgBand,
    cautions: &mut Vec<Caution>,
) {
    let cg_x_m = mass.cg_x_m;
    let finding = match band.position(cg_x_m) {
        BandPosition::Aft => BalanceFinding::CgAftOfBand {
            cg_x_m,
            band: *band,
        },
        BandPosition::Forward => BalanceFinding::CgForwardOfBand {
            cg_x_m,
            band: *band,
            control: Control::of(aircraft),
        },
        BandPosition::Inside => return,
    };
    cautions.push(Caution::of(finding.into()));
}

/// The cautions on the trim point: `trim-beyond-stall`, `trim-near-stall` (each with what to
/// change to trim faster), or `no-trim` when a stable aircraft finds no trim (unless its
/// elevons trim it within their throws).
pub(super) fn trim_cautions(
    aircraft: &Aircraft,
    mass: &MassSummary,
    h: &Headline,
    band: &CgBand,
    elevons_trim_it: bool,
    cautions: &mut Vec<Caution>,
) {
    let has_stabiliser = aircraft.stabiliser.is_some();
    // Moving the CG forward is offered only where the band leaves room for it.
    let faster = FasterTrim {
        has_stabiliser,
        room_forward: mass.cg_x_m > band.forward_x_m + CG_BAND_ALLOWANCE_M,
    };
    let finding = match h.trim {
        Some(t) if t.cl > h.cl_max => BalanceFinding::TrimBeyondStall {
            cl: t.cl,
            cl_max: h.cl_max,
            faster,
        },
        Some(t) if t.speed_m_s < NEAR_STALL_FACTOR * h.stall_speed_m_s => {
            BalanceFinding::TrimNearStall {
                speed_m_s: t.speed_m_s,
                stall_speed_m_s: h.stall_speed_m_s,
                faster,
            }
        }
        // (A tailless wing that its elevons trim within their throws gets the tailless-trim
        // note instead.)
        None if h.static_margin > 0.0 && !elevons_trim_it => {
            BalanceFinding::NoTrim { has_stabiliser }
        }
        _ => return,
    };
    cautions.push(Caution::of(finding.into()));
}

/// The note `band-defaults` when the band uses the common-practice static margins, on a mean
/// chord of `mac_m`.
pub(super) fn band_defaults_note(aircraft: &Aircraft, mac_m: f64, cautions: &mut Vec<Caution>) {
    if aircraft.margin_limits.from_defaults {
        cautions.push(Caution::of(
            BalanceFinding::BandDefaults {
                min_static_margin: aircraft.margin_limits.min_static_margin,
                max_static_margin: aircraft.margin_limits.max_static_margin,
                mac_m,
            }
            .into(),
        ));
    }
}

/// A CG inside the recommended band whose range (`cg`: the CG and two standard deviations of
/// the builder's tolerances) reaches aft of the band's aft end (which is measured from the
/// forward end of the neutral point's uncertainty range, `spread_m`, two standard deviations).
pub(super) fn uncertain_aft_limit_caution(
    neutral_point_x_m: f64,
    spread_m: f64,
    cg: (f64, f64),
    band: (f64, f64),
    cautions: &mut Vec<Caution>,
) {
    let (cg_x_m, cg_spread_m) = cg;
    let (band_forward_x_m, band_aft_x_m) = band;
    let finite_or_zero = |x: f64| if x.is_finite() { x } else { 0.0 };
    let (spread_m, cg_spread_m) = (finite_or_zero(spread_m), finite_or_zero(cg_spread_m));
    if spread_m <= 0.0 && cg_spread_m <= 0.0 {
        return;
    }
    // The band's aft end is the limit (it allows for the neutral point's range already).
    // Inside the band only: forward or aft of it, other cautions speak; the same
    // half-millimetre allowance as `cg-aft-of-band`, so that one of the two speaks.
    let inside = cg_x_m >= band_forward_x_m - CG_BAND_ALLOWANCE_M
        && cg_x_m <= band_aft_x_m + CG_BAND_ALLOWANCE_M;
    if cg_x_m + cg_spread_m > band_aft_x_m && inside {
        cautions.push(Caution::of(
            BalanceFinding::CgAftOfUncertainLimit {
                cg_x_m,
                cg_spread_m,
                neutral_point_x_m,
                neutral_point_spread_m: spread_m,
                band_forward_x_m,
                band_aft_x_m,
            }
            .into(),
        ));
    }
}

/// The danger `cg-band-empty`: full nose-up control cannot hold the stall even with the CG at
/// the band's aft end `aft_x_m`.
pub(super) fn cg_band_empty_caution(
    aircraft: &Aircraft,
    aft_x_m: f64,
    cautions: &mut Vec<Caution>,
) {
    cautions.push(Caution::of(
        BalanceFinding::CgBandEmpty {
            aft_x_m,
            min_static_margin: aircraft.margin_limits.min_static_margin,
            control: Control::of(aircraft),
        }
        .into(),
    ));
}

/// The danger `cg-behind-neutral-point-range`: the CG is ahead of the headline neutral point
/// (positive static margin) but behind the forward end of that point's uncertainty range
/// (`np_spread_m` ahead of it), or behind the closed-form neutral point
/// (`closed_form_np_x_m`, given when the full model made the headline) when that lies further
/// forward. Either estimate may be the right one, so the aircraft may be neutral or unstable
/// in pitch as balanced: the unsafe side of the estimate decides.
pub(super) fn neutral_point_range_caution(
    cg_x_m: f64,
    h: &Headline,
    np_spread_m: f64,
    closed_form_np_x_m: Option<f64>,
    band_aft_x_m: f64,
    cautions: &mut Vec<Caution>,
) {
    if h.static_margin < 0.0 || !cg_x_m.is_finite() {
        // `static-margin-negative` speaks.
        return;
    }
    let range_forward_x_m =
        (np_spread_m.is_finite() && np_spread_m > 0.0).then_some(h.neutral_point_x_m - np_spread_m);
    let closed = closed_form_np_x_m.filter(|x| x.is_finite());
    let (limit_x_m, closed_form) = match (range_forward_x_m, closed) {
        (Some(r), Some(c)) if c < r => (c, true),
        (Some(r), _) => (r, false),
        (None, Some(c)) if c < h.neutral_point_x_m => (c, true),
        _ => return,
    };
    if cg_x_m > limit_x_m + CG_BAND_ALLOWANCE_M {
        cautions.push(Caution::of(
            BalanceFinding::CgBehindNeutralPointRange {
                cg_x_m,
                limit_x_m,
                neutral_point_x_m: h.neutral_point_x_m,
                closed_form,
                band_aft_x_m,
            }
            .into(),
        ));
    }
}
