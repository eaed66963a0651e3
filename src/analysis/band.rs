//! The headline figures (full model, or the closed form when it failed), the recommended CG
//! band and the ballast advice.

use super::{
    AftLimit, AnalysisError, BallastAdvice, BandPosition, CgBand, ForwardLimit, Headline, Method,
    StallLocation, TrimSummary,
};
use crate::balance;
use crate::balance::MassSummary;
use crate::model::{Aircraft, StabiliserRole};
use crate::stability::classical::ClassicalEstimate;
use crate::stability::trim;

/// The recommended CG band from the neutral point `np_x_m` and the wing's MAC `mac_m`: the
/// aft end at the least static margin, the forward end at the greatest static margin or at the
/// full model's forward limit when that lies further aft. The flag is true when that forward
/// limit lies aft of the aft end (no usable range; the band then closes on its aft end).
pub(super) fn cg_band(
    aircraft: &Aircraft,
    full: Option<&trim::FullStability>,
    np_x_m: f64,
    np_spread_m: f64,
    mac_m: f64,
) -> (CgBand, bool) {
    let margin_forward_x_m = np_x_m - aircraft.margin_limits.max_static_margin * mac_m;
    let elevator_limit = full.and_then(|f| {
        f.elevator_forward_limit_x_m
            .map(|x| (x, f.forward_limit_cause))
    });
    let (forward_x_m, forward_limit) = match elevator_limit {
        Some((x, cause)) if x > margin_forward_x_m => (
            x,
            match cause {
                trim::ForwardLimitCause::ControlAuthority => ForwardLimit::ElevatorAuthority,
                trim::ForwardLimitCause::StabiliserClMin => ForwardLimit::TailStall,
            },
        ),
        _ => (margin_forward_x_m, ForwardLimit::StaticMargin),
    };
    // The aft end keeps the smallest margin even from the forward end of the neutral
    // point's uncertainty range: the unsafe side of the estimate is a neutral point further
    // forward than computed.
    let (aft_from_x_m, aft_limit) = if np_spread_m.is_finite() && np_spread_m > 0.0 {
        (np_x_m - np_spread_m, AftLimit::NeutralPointRange)
    } else {
        (np_x_m, AftLimit::StaticMargin)
    };
    let aft_x_m = aft_from_x_m - aircraft.margin_limits.min_static_margin * mac_m;
    // A control too weak to hold the stall even at the aft limit leaves no usable range: the
    // band closes on its aft end and a danger says so (`cg-band-empty`).
    let band_empty = forward_x_m > aft_x_m;
    let band = CgBand {
        forward_x_m: forward_x_m.min(aft_x_m),
        aft_x_m,
        forward_limit,
        aft_limit,
    };
    (band, band_empty)
}

/// Ballast advice for every bay to reach the file's target static margin (none without a
/// target), from the neutral point `np_x_m` and the wing's MAC `mac_m`. A target margin
/// whose CG lies aft of the recommended `band` is held at the band's aft end: ballast advice
/// never leads behind it.
pub(super) fn ballast_advice(
    aircraft: &Aircraft,
    mass: &MassSummary,
    np_x_m: f64,
    mac_m: f64,
    band: &CgBand,
) -> Vec<BallastAdvice> {
    match aircraft.targets.static_margin {
        None => Vec::new(),
        Some(sm) => {
            let margin_x_m = np_x_m - sm * mac_m;
            let held_at_band_aft_end = band.position(margin_x_m) == BandPosition::Aft;
            let target_x_m = if held_at_band_aft_end {
                band.aft_x_m
            } else {
                margin_x_m
            };
            aircraft
                .ballast_bays
                .iter()
                .map(|bay| BallastAdvice {
                    bay: bay.name.clone(),
                    target_x_m,
                    held_at_band_aft_end,
                    outcome: balance::ballast_for_target(mass, bay, target_x_m),
                })
                .collect()
        }
    }
}

pub(super) fn headline_of(
    aircraft: &Aircraft,
    full: Option<&trim::FullStability>,
    est: &ClassicalEstimate,
) -> Headline {
    let surface_name = |i: usize| -> &'static str {
        match (i, aircraft.stabiliser.as_ref().map(|s| s.role)) {
            (0, _) => "wing",
            (_, Some(StabiliserRole::Canard)) => "canard",
            _ => "tail",
        }
    };
    match full {
        Some(f) => Headline {
            method: Method::Numerical(aircraft.numerics.wing_model),
            neutral_point_x_m: f.neutral_point_x_m,
            static_margin: f.static_margin,
            trim: f.trim.as_ref().map(|t| TrimSummary {
                alpha_rad: t.alpha_rad,
                cl: t.cl,
                speed_m_s: t.speed_m_s,
                stabiliser_cl: t.stabiliser_cl,
                elevator_rad: 0.0,
            }),
            cl_max: f.stall.as_ref().map_or(est.cl_max, |s| s.cl_max),
            stall_speed_m_s: f
                .stall
                .as_ref()
                .map_or(est.stall_speed_m_s, |s| s.speed_m_s),
            stall_location: f.stall.as_ref().map(|s| StallLocation {
                surface: s.surface,
                surface_name: surface_name(s.surface),
                percent_semispan: s.percent_semispan,
            }),
        },
        None => Headline {
            method: Method::Classical,
            neutral_point_x_m: est.neutral_point_x_m,
            static_margin: est.static_margin,
            trim: est.trim.map(|t| TrimSummary {
                alpha_rad: t.alpha_body_rad,
                cl: t.cl,
                speed_m_s: t.speed_m_s,
                stabiliser_cl: t.stabiliser_cl,
                elevator_rad: 0.0,
            }),
            cl_max: est.cl_max,
            stall_speed_m_s: est.stall_speed_m_s,
            stall_location: None,
        },
    }
}

/// The first named quantity that is not finite, as `AnalysisError::NonFinite`.
pub(super) fn require_finite(quantities: &[(&'static str, f64)]) -> Result<(), AnalysisError> {
    for &(name, v) in quantities {
        if !v.is_finite() {
            return Err(AnalysisError::NonFinite { quantity: name });
        }
    }
    Ok(())
}
