//! The cautions on balance and trim: static margin, CG outside the band, the CG's tolerance
//! range against the uncertain aft limit, trim near or beyond the stall.

use super::{
    AftLimit, BandPosition, CgBand, ForwardLimit, Headline, CG_BAND_ALLOWANCE_M, LOW_STATIC_MARGIN,
    NEAR_STALL_FACTOR,
};
use crate::balance::MassSummary;
use crate::caution::{Caution, Level};
use crate::model::{Aircraft, StabiliserRole};

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
}

/// The danger `static-margin-negative` or the warning `static-margin-low`.
pub(super) fn static_margin_cautions(
    aircraft: &Aircraft,
    mass: &MassSummary,
    h: &Headline,
    cautions: &mut Vec<Caution>,
) {
    let sm_pct = 100.0 * h.static_margin;
    if h.static_margin < 0.0 {
        cautions.push(Caution::new(
            Level::Danger,
            "static-margin-negative",
            format!(
                "The CG is {:.0} mm behind the neutral point (static margin {sm_pct:.1} %): the aircraft is \
                 unstable in pitch and will not fly as balanced. Move the CG forward or add nose weight.",
                (mass.cg_x_m - h.neutral_point_x_m) * 1000.0
            ),
        ));
    } else if h.static_margin < LOW_STATIC_MARGIN.min(aircraft.margin_limits.min_static_margin) {
        cautions.push(Caution::new(
            Level::Warning,
            "static-margin-low",
            format!(
                "Static margin is only {sm_pct:.1} % of the mean chord: pitch will be sensitive and an error in \
                 the estimate could make it unstable. Models usually fly with 5 to 15 %."
            ),
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
    let fwd = band.forward_x_m;
    let aft = band.aft_x_m;
    if band.position(mass.cg_x_m) == BandPosition::Aft {
        cautions.push(Caution::new(
            Level::Warning,
            "cg-aft-of-band",
            format!(
                "The CG is {:.0} mm aft of the recommended band ({:.0} to {:.0} mm from the datum){}.",
                (mass.cg_x_m - aft) * 1000.0,
                fwd * 1000.0,
                aft * 1000.0,
                match band.aft_limit {
                    AftLimit::NeutralPointRange => {
                        ", whose aft end keeps the smallest static margin even if the neutral \
                         point lies at the forward end of its uncertainty range"
                    }
                    AftLimit::StaticMargin => "",
                }
            ),
        ));
    } else if band.position(mass.cg_x_m) == BandPosition::Forward {
        let control = aircraft.pitch_control_name();
        let why = match band.forward_limit {
            ForwardLimit::ElevatorAuthority => format!(
                "further forward, full up {control} can no longer hold the wing at its stall, so the \
                 model cannot be flared or slowed properly"
            ),
            ForwardLimit::TailStall => "further forward, the tailplane reaches its negative stall \
                 (its download at cl_min) before the wing stalls, and pitch control is lost when \
                 slowing down"
                .to_string(),
            ForwardLimit::StaticMargin => {
                format!(
                    "the aircraft will be nose-heavy, need more {} and fly faster",
                    nose_up_control(aircraft)
                )
            }
        };
        cautions.push(Caution::new(
            Level::Warning,
            "cg-forward-of-band",
            format!(
                "The CG is {:.0} mm forward of the recommended band ({:.0} to {:.0} mm from the datum): {why}.",
                (fwd - mass.cg_x_m) * 1000.0,
                fwd * 1000.0,
                aft * 1000.0
            ),
        ));
    }
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
    // With the incidences fixed, a CG further forward trims at a lower CL (faster): CL_trim =
    // Cm0 about the neutral point / static margin (Etkin & Reid, sec. 2.3).
    let rigging = if aircraft.stabiliser.is_some() {
        "Reduce the decalage (stabiliser incidence closer to the wing's)"
    } else {
        "Reduce the washout or reflex"
    };
    // Moving the CG forward is offered only where the band leaves room for it.
    let faster = if mass.cg_x_m > band.forward_x_m + CG_BAND_ALLOWANCE_M {
        format!(
            "{rigging}, or move the CG forward within the recommended band: nose weight makes it \
             trim faster."
        )
    } else {
        format!("{rigging}: the CG is already at or ahead of the recommended band.")
    };
    if let Some(t) = h.trim {
        if t.cl > h.cl_max {
            cautions.push(Caution::new(
                Level::Danger,
                "trim-beyond-stall",
                format!(
                                        "The aircraft trims at CL {:.2}, above its CL max of {:.2}: as balanced it would fly \
                     stalled. {faster}",
                    t.cl, h.cl_max
                ),
            ));
        } else if t.speed_m_s < NEAR_STALL_FACTOR * h.stall_speed_m_s {
            cautions.push(Caution::new(
                Level::Warning,
                "trim-near-stall",
                format!(
                                        "Trim speed {:.1} m/s is within 20 % of the stall speed {:.1} m/s: little margin \
                     against a stall in gusts or turns. {faster}",
                    t.speed_m_s, h.stall_speed_m_s
                ),
            ));
        }
    } else if h.static_margin > 0.0 && !elevons_trim_it {
        // (A tailless wing that its elevons trim within their throws gets the tailless-trim
        // note instead.)
        cautions.push(Caution::new(
            Level::Danger,
            "no-trim",
            if aircraft.stabiliser.is_some() {
                "No trimmed flight at positive lift was found with this CG and these incidences: \
                 check the decalage (stabiliser incidence) and the CG."
            } else {
                "No trimmed flight at positive lift was found with this CG: check the washout, the \
                 reflex of the airfoils (or the elevons' trim) and the CG."
            }
            .to_string(),
        ));
    }
}

/// The note `band-defaults` when the band uses the common-practice static margins, on a mean
/// chord of `mac_m`.
pub(super) fn band_defaults_note(aircraft: &Aircraft, mac_m: f64, cautions: &mut Vec<Caution>) {
    let mac_mm = mac_m * 1000.0;
    if aircraft.margin_limits.from_defaults {
        cautions.push(Caution::new(
            Level::Note,
            "band-defaults",
            format!(
                "The recommended CG band uses common-practice static margins of {:.0} to {:.0} % of the \
                 {mac_mm:.0} mm mean chord; set [limits] in the file to use your own.",
                100.0 * aircraft.margin_limits.min_static_margin,
                100.0 * aircraft.margin_limits.max_static_margin
            ),
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
    let spread_m = if spread_m.is_finite() { spread_m } else { 0.0 };
    let cg_spread_m = if cg_spread_m.is_finite() {
        cg_spread_m
    } else {
        0.0
    };
    if spread_m <= 0.0 && cg_spread_m <= 0.0 {
        return;
    }
    // The band's aft end is the limit (it allows for the neutral point's range already).
    let limit = band_aft_x_m;
    let cg_aft_end = cg_x_m + cg_spread_m;
    // Inside the band only: forward or aft of it, other cautions speak.
    // The same half-millimetre allowance as `cg-aft-of-band`, so that one of the two speaks.
    let inside = cg_x_m >= band_forward_x_m - CG_BAND_ALLOWANCE_M
        && cg_x_m <= band_aft_x_m + CG_BAND_ALLOWANCE_M;
    if cg_aft_end > limit && inside {
        let balance_at = limit - cg_spread_m;
        let advice = if balance_at >= band_forward_x_m {
            format!(
                "For the first flights balance at {:.1} mm or further forward.",
                1000.0 * balance_at
            )
        } else {
            // The advice would leave the band: the uncertainties are too large for any CG in
            // it to be safely ahead of the limit.
            format!(
                "No CG in the recommended band keeps the whole uncertain range ahead of that \
                 limit: weigh the items and measure their positions again to narrow the \
                 tolerances, and meanwhile balance at the band's forward end ({:.1} mm) and \
                 test-glide with care.",
                1000.0 * band_forward_x_m
            )
        };
        // A CG range that reaches behind the neutral point itself may be unstable.
        let level = if cg_aft_end >= neutral_point_x_m {
            Level::Danger
        } else {
            Level::Warning
        };
        let limit_text = if spread_m > 0.0 {
            format!(
                "the band's aft end, {:.1} mm, which keeps the smallest margin from the forward \
                 end of the neutral point's uncertainty range ({:.0} mm ahead of the computed \
                 point: two standard deviations from common-practice spreads of tail \
                 efficiency, downwash, fuselage, section lift slopes and the wing's \
                 aerodynamic centre)",
                1000.0 * limit,
                1000.0 * spread_m
            )
        } else {
            format!("the band's aft end, {:.1} mm", 1000.0 * limit)
        };
        cautions.push(Caution::new(
            level,
            "cg-aft-of-uncertain-limit",
            format!(
                "The CG ({:.1} mm) is {}, but with two standard deviations of the builder's \
                 own mass and position tolerances it may lie as far aft as {:.1} mm, {:.1} mm \
                 aft of {limit_text}. {advice}",
                1000.0 * cg_x_m,
                if cg_x_m > limit {
                    "on the aft end of the recommended band"
                } else {
                    "inside the recommended band"
                },
                1000.0 * cg_aft_end,
                1000.0 * (cg_aft_end - limit),
            ),
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
    let control = aircraft.pitch_control_name();
    cautions.push(Caution::new(
        Level::Danger,
        "cg-band-empty",
        format!(
            "Full up {control} cannot hold the wing at its stall even with the CG at the aft end \
             of the recommended range ({:.0} mm from the datum, static margin {:.0} %): there is no \
                              usable CG range. Give the {control} more throw or more chord before flying.",
            aft_x_m * 1000.0,
            100.0 * aircraft.margin_limits.min_static_margin
        ),
    ));
}

/// What gives nose-up pitch on this aircraft, in the builder's words.
pub(super) fn nose_up_control(aircraft: &Aircraft) -> &'static str {
    match (&aircraft.stabiliser, &aircraft.elevons) {
        (Some(s), _) if s.role == StabiliserRole::Canard => {
            "nose-up canard elevator (trailing edge down)"
        }
        (Some(_), _) => "up elevator",
        (None, Some(_)) => "up elevon",
        (None, None) => "nose-up trim (reflex)",
    }
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
    let (limit_x_m, what) = match (range_forward_x_m, closed) {
        (Some(r), Some(c)) if c < r => (c, ClosestLimit::ClosedForm),
        (Some(r), _) => (r, ClosestLimit::RangeForwardEnd),
        (None, Some(c)) if c < h.neutral_point_x_m => (c, ClosestLimit::ClosedForm),
        _ => return,
    };
    if cg_x_m <= limit_x_m + CG_BAND_ALLOWANCE_M {
        return;
    }
    let which = match what {
        ClosestLimit::RangeForwardEnd => format!(
            "the forward end of the neutral point's uncertainty range ({:.1} mm, two standard \
             deviations of the inputs known least well ahead of the computed {:.1} mm)",
            1000.0 * limit_x_m,
            1000.0 * h.neutral_point_x_m
        ),
        ClosestLimit::ClosedForm => format!(
            "the closed-form neutral point ({:.1} mm), which lies ahead of the computed {:.1} mm",
            1000.0 * limit_x_m,
            1000.0 * h.neutral_point_x_m
        ),
    };
    cautions.push(Caution::new(
        Level::Danger,
        "cg-behind-neutral-point-range",
        format!(
            "The CG ({:.1} mm) is {:.1} mm behind {which}: if the neutral point lies there, the \
             aircraft is neutral or unstable in pitch as balanced. Move the CG forward to the \
             recommended band's aft end ({:.1} mm) or ahead of it before any flight.",
            1000.0 * cg_x_m,
            1000.0 * (cg_x_m - limit_x_m),
            1000.0 * band_aft_x_m
        ),
    ));
}

/// Which of the two forward neutral-point estimates is the nearer limit.
enum ClosestLimit {
    RangeForwardEnd,
    ClosedForm,
}
