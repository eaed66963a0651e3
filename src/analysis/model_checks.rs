//! The cautions that only the full model can raise: stall order along the span, elevator
//! authority, tail stall, tailless trim, and the full model against the closed form.

use super::Headline;
use crate::caution::{Caution, Level};
use crate::model::{Aircraft, StabiliserRole, WingModel};
use crate::stability::classical::ClassicalEstimate;
use crate::stability::trim;

/// Difference between the lifting-line and closed-form neutral points above which a note
/// explains it, fraction of MAC (a judgement: the two agree within a few percent on
/// conventional high-aspect-ratio models).
pub const MODELS_DISAGREE: f64 = 0.05;

/// Stall beginning outboard of this fraction of the semispan is "tip first" (common practice:
/// outboard of mid-semispan a stall drops a wing).
pub const TIP_STALL_PERCENT_SEMISPAN: f64 = 50.0;

/// A washout change larger than this is not suggested (the file accepts twist within 15 deg;
/// a change this large means the planform or the sections must change instead).
pub const MAX_USEFUL_WASHOUT_CHANGE_DEG: f64 = 10.0;

/// `x` with a sign and `decimals` decimals, never "-0.000".
pub(super) fn signed(x: f64, decimals: usize) -> String {
    let s = format!("{x:+.decimals$}");
    if s[1..].chars().all(|c| c == '0' || c == '.') {
        s[1..].to_string()
    } else {
        s
    }
}

#[allow(clippy::too_many_arguments)]
pub(super) fn full_model_cautions(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    h: &Headline,
    est: &ClassicalEstimate,
    mac_m: f64,
    cg_x_m: f64,
    band_aft_x_m: f64,
    cautions: &mut Vec<Caution>,
) {
    stall_order_caution(aircraft, f, h, cautions);
    elevator_authority_caution(aircraft, f, cautions);
    tail_stall_in_range_caution(f, cautions);
    if let Some(t) = &f.tailless {
        tailless_trim_caution(aircraft, t, cg_x_m, band_aft_x_m, cautions);
    }
    models_disagree_note(aircraft, f, est, mac_m, cautions);
}

/// The caution on which surface stalls first and where: `tail-stalls-first` (downwards at
/// cl_min, or at cl_max), `canard-stall-order` or `tip-stall`.
pub(super) fn stall_order_caution(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    h: &Headline,
    cautions: &mut Vec<Caution>,
) {
    if let Some(loc) = &h.stall_location {
        let role = aircraft.stabiliser.as_ref().map(|s| s.role);
        let unstable = h.static_margin <= 0.0;
        // Whether the tail carries an upload at the stall: then a forward CG relieves it.
        let tail_uploaded = f
            .stall
            .as_ref()
            .and_then(|s| s.result.surfaces.get(1))
            .is_some_and(|s| s.cl > 0.0);
        let negative = f.stall.as_ref().and_then(|s| match s.limit {
            trim::StallLimit::StabiliserClMin {
                speed_otherwise_m_s,
                ..
            } => Some((s.speed_m_s, speed_otherwise_m_s)),
            trim::StallLimit::ClMax => None,
        });
        match (loc.surface, role) {
            (1, _) if negative.is_some() => {
                let (v_tail, v_wing) = negative.unwrap_or_default();
                let surface = if role == Some(StabiliserRole::Canard) {
                    "canard"
                } else {
                    "tailplane"
                };
                cautions.push(Caution::new(
                    Level::Danger,
                    "tail-stalls-first",
                    format!(
                        "The {surface} stalls first, downwards: slowing down with the elevator, it \
                         reaches its negative cl limit (cl_min, at {:.0} % of its semispan) at {:.1} m/s, \
                         before the wing would stall at {:.1} m/s. Below {:.1} m/s pitch control would be \
                         lost, so that is the stall speed shown. Move the CG aft within the \
                         recommended band (less download needed), or give the {surface} more area or \
                         a section with a larger negative cl limit (or camber it for download).",
                        loc.percent_semispan, v_tail, v_wing, v_tail
                    ),
                ));
            }
            (0, Some(StabiliserRole::Canard)) => cautions.push(Caution::new(
                Level::Danger,
                "canard-stall-order",
                format!(
                                        "The wing reaches its cl_max before the canard (at {:.0} % of its semispan): a canard \
                     aircraft must stall on the canard first so that the nose drops. Give the canard a \
                     higher loading (more incidence relative to the wing), or move the CG forward, which \
                     loads the canard more.",
                    loc.percent_semispan
                ),
            )),
            (0, _) if loc.percent_semispan > TIP_STALL_PERCENT_SEMISPAN => cautions.push(Caution::new(
                Level::Warning,
                "tip-stall",
                format!(
                    "Stall begins at {:.0} % of the semispan, outboard of mid-span: expect a wing to drop at \
                     the stall. More washout, a tip airfoil with a higher cl_max, or less taper move it inboard.",
                    loc.percent_semispan
                ),
            )),
            (1, Some(StabiliserRole::Tail)) => cautions.push(Caution::new(
                Level::Danger,
                "tail-stalls-first",
                format!(
                                        "The tailplane reaches its cl_max before the wing (at {:.0} % of its semispan) when \
                     trimmed near the stall: pitch control would be lost. {}",
                    loc.percent_semispan,
                                        match (unstable, tail_uploaded) {
                        (true, _) => "First move the CG forward of the neutral point (see \
                                      static-margin-negative); then check this again.",
                        (false, true) => "The tail is lifting there: give it a larger area or a \
                                          section with a higher cl_max, or move the CG forward \
                                          within the recommended band (less upload needed).",
                        (false, false) => "Give the tail a larger area, a section with a higher \
                                           cl_max, or move the CG aft within the recommended band \
                                           (less download needed).",
                    }
                ),
            )),
            _ => {}
        }
    }
}

/// The warning `elevator-authority` at the first speed of the elevator schedule that needs more
/// pitch-control throw than the aircraft has.
pub(super) fn elevator_authority_caution(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    cautions: &mut Vec<Caution>,
) {
    if let Some(s) = aircraft.pitch_control() {
        if let Some(p) = f.elevator_schedule.iter().find(|p| !p.within_limits) {
            let canard = aircraft
                .stabiliser
                .as_ref()
                .is_some_and(|st| st.role == StabiliserRole::Canard);
            let (need, have) = match (p.elevator_rad < 0.0, canard) {
                (true, false) => ("up", s.max_up_rad),
                (false, false) => ("down", s.max_down_rad),
                (true, true) => ("trailing edge up (nose down)", s.max_up_rad),
                (false, true) => ("trailing edge down (nose up)", s.max_down_rad),
            };
            let control = aircraft.pitch_control_name();
            let rigging = if aircraft.stabiliser.is_some() {
                "the decalage"
            } else {
                "the washout and reflex"
            };
            cautions.push(Caution::new(
                Level::Warning,
                "elevator-authority",
                format!(
                    "At {:.1} m/s the {control} need{} {:.1} deg {need} to trim, more than the {:.1} deg \
                     available: the speed range is limited by the {control}. Check the CG and {rigging}.",
                    p.speed_m_s,
                    if control == "elevons" { "" } else { "s" },
                    p.elevator_rad.abs().to_degrees(),
                    have.to_degrees()
                ),
            ));
        }
    }
}

/// The warning `tail-stall-in-range` at the first speed of the elevator schedule where the
/// tailplane is at its negative cl limit.
pub(super) fn tail_stall_in_range_caution(f: &trim::FullStability, cautions: &mut Vec<Caution>) {
    if let Some(p) = f.elevator_schedule.iter().find(|p| p.stabiliser_at_cl_min) {
        cautions.push(Caution::new(
            Level::Warning,
            "tail-stall-in-range",
            format!(
                "At {:.1} m/s, trimmed with {:.1} deg of elevator, the tailplane is at its negative cl \
                 limit (cl_min): within the speed range it would stall downwards and pitch control \
                 would be lost. Move the CG aft within the band or enlarge the tailplane.",
                p.speed_m_s,
                p.elevator_rad.to_degrees()
            ),
        ));
    }
}

/// The caution `tailless-trim`: a note when the elevons trim the wing within their throws, a
/// danger or warning with the remedies when nothing trims it at its design CL.
pub(super) fn tailless_trim_caution(
    aircraft: &Aircraft,
    t: &trim::TaillessCheck,
    cg_x_m: f64,
    band_aft_x_m: f64,
    cautions: &mut Vec<Caution>,
) {
    let untrimmed = t.cm_zero_lift <= 0.0 || t.cm_at_design < -1e-4;
    if let (true, true, Some(d)) = (untrimmed, t.elevon_within_throws, t.elevon_to_trim_rad) {
        // Here the wing lacks nose-up moment at the design CL (a stable wing's moment falls
        // with CL), so the fixes are more washout where it helps, or reflex.
        let washout = t
            .washout_change_rad
            .map(f64::to_degrees)
            .filter(|w| *w < 0.0 && w.abs() <= MAX_USEFUL_WASHOUT_CHANGE_DEG)
            .map(|w| format!("About {:.1} deg more tip washout, or airfoils", w.abs()))
            .unwrap_or_else(|| "Airfoils".to_string());
        cautions.push(Caution::new(
            Level::Note,
            "tailless-trim",
            format!(
                "With the elevons neutral this tailless wing does not trim at its design CL {:.2} \
                 (pitching moment {} there, {} at zero lift). It trims there with about {:.1} \
                 deg of {} elevon, within the throws; that much throw is then not available for \
                                      control. {washout} with about {:.3} more reflex (cm_ac) would trim it \
                 with the elevons neutral.",
                t.design_cl,
                signed(t.cm_at_design, 3),
                signed(t.cm_zero_lift, 3),
                d.abs().to_degrees(),
                if d < 0.0 { "up" } else { "down" },
                t.reflex_cm_change
            ),
        ));
    } else if untrimmed {
        let level = if t.cm_zero_lift <= 0.0 {
            Level::Danger
        } else {
            Level::Warning
        };
        let elevons = match (aircraft.elevons, t.elevon_to_trim_rad) {
            (Some(_), Some(d)) => format!(
                "; the elevons would need {:.1} deg {}, beyond their throws",
                d.abs().to_degrees(),
                if d < 0.0 { "up" } else { "down" }
            ),
            (Some(_), None) => "; the elevons cannot trim it there".to_string(),
            _ => String::new(),
        };
        let remedies = tailless_remedies(t, cg_x_m, band_aft_x_m);
        cautions.push(Caution::new(
            level,
            "tailless-trim",
            format!(
                "This tailless wing does not trim at its design CL {:.2} with this CG (pitching moment \
                 {} there, {} at zero lift; it must be positive at zero lift){elevons}. It needs {remedies}.",
                t.design_cl,
                signed(t.cm_at_design, 3),
                signed(t.cm_zero_lift, 3),
            ),
        ));
    }
}

/// The remedies for a tailless wing that does not trim, in words: washout within what the file
/// accepts, reflex, and a CG further aft (`cg_x_m`) only while it is ahead of the band's aft
/// end `band_aft_x_m` and the moment at zero lift is positive.
pub(super) fn tailless_remedies(t: &trim::TaillessCheck, cg_x_m: f64, band_aft_x_m: f64) -> String {
    // The remedies that apply: washout within what the file accepts, reflex, and a
    // CG further aft only while the CG is still ahead of the band's aft end.
    let mut remedies = Vec::new();
    if let Some(w) = t.washout_change_rad {
        let deg = w.to_degrees();
        if deg.abs() <= MAX_USEFUL_WASHOUT_CHANGE_DEG {
            remedies.push(format!(
                "about {:.1} deg {} tip washout",
                deg.abs(),
                if deg < 0.0 { "more" } else { "less" }
            ));
        }
    }
    remedies.push(format!(
        "airfoils with about {:.3} more reflex (cm_ac)",
        t.reflex_cm_change
    ));
    // At zero lift the moment about the CG is a pure couple: moving the CG cannot make
    // it positive, so a CG further aft only helps when it already is.
    if cg_x_m < band_aft_x_m - super::CG_BAND_ALLOWANCE_M && t.cm_zero_lift > 0.0 {
        remedies.push("the CG moved aft within the recommended band".to_string());
    }
    let last = remedies.pop().unwrap_or_default();
    if remedies.is_empty() {
        last
    } else {
        format!("{}, or {last}", remedies.join(", "))
    }
}

/// The note `models-disagree` when the full model's and the closed form's neutral points
/// differ by more than `MODELS_DISAGREE` of the MAC `mac_m`, with why and what to do.
pub(super) fn models_disagree_note(
    aircraft: &Aircraft,
    f: &trim::FullStability,
    est: &ClassicalEstimate,
    mac_m: f64,
    cautions: &mut Vec<Caution>,
) {
    let diff = (f.neutral_point_x_m - est.neutral_point_x_m) / mac_m;
    if diff.abs() > MODELS_DISAGREE {
        let model = match aircraft.numerics.wing_model {
            WingModel::VortexLattice => "vortex-lattice",
            WingModel::LiftingLine => "lifting-line",
        };
        let why = match aircraft.numerics.wing_model {
            WingModel::VortexLattice => format!(
                "The lattice models sweep, taper, twist, {}and where along the chord each strip \
                 carries its lift; the closed form reduces the wing to a straight equivalent wing{}. \
                 Neither models the fuselage's interference or a flexible wing.",
                if aircraft.stabiliser.is_some() {
                    "the stabiliser's place in the wake (downwash) "
                } else {
                    ""
                },
                if aircraft.stabiliser.is_some() {
                    " with a simple downwash formula"
                } else {
                    ""
                }
            ),
            WingModel::LiftingLine => "The lifting line puts each strip's lift on its quarter-chord line, which places \
                 the neutral point of a swept or low-aspect-ratio surface too far aft; the closed form \
                 reduces the wing to a straight equivalent wing."
                .to_string(),
        };
        let advice = if diff > 0.0 {
            format!(
                "Until a glide test confirms the balance, keep the CG ahead of {:.0} mm, the aft end \
                 of the band measured from the closed-form neutral point (the more forward, safer one).",
                1000.0 * (est.neutral_point_x_m - aircraft.margin_limits.min_static_margin * mac_m)
            )
        } else {
            "The band is measured from the more forward of the two, the safer one.".to_string()
        };
        cautions.push(Caution::new(
            Level::Note,
            "models-disagree",
            format!(
                "The {model} neutral point lies {:.0} mm {} of the closed-form estimate ({:.1} % of MAC). \
                 {why} {advice}",
                (diff * mac_m * 1000.0).abs(),
                if diff > 0.0 { "aft" } else { "forward" },
                100.0 * diff.abs(),
            ),
        ));
    }
}
