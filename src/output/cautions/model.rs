//! The words of the findings only the full model raises.

use crate::finding::{Control, ElevonTrim, ModelFinding, TailStall};
use crate::model::{StabiliserRole, WingModel};

use super::control_name;

/// The sentence of `f` (lengths in mm from the datum, angles in deg).
pub(super) fn message(f: &ModelFinding) -> String {
    use ModelFinding::*;
    match *f {
        TailStallsFirst {
            percent_semispan,
            stall,
        } => tail_stalls_first_message(percent_semispan, stall),
        CanardStallOrder {
            percent_semispan,
            room_forward,
        } => format!(
            "The wing reaches its cl_max before the canard (at {percent_semispan:.0} % of its \
             semispan): a canard aircraft must stall on the canard first so that the nose drops. \
             Give the canard a higher loading (more incidence relative to the wing){}",
            if room_forward {
                ", or move the CG forward within the recommended band, which loads the canard more."
            } else {
                "; the CG is already at or ahead of the recommended band, so do not move it further \
                 forward."
            }
        ),
        TipStall { percent_semispan } => format!(
            "Stall begins at {percent_semispan:.0} % of the semispan, outboard of mid-span: expect a \
             wing to drop at the stall. More washout, a tip airfoil with a higher cl_max, or less \
             taper move it inboard."
        ),
        ElevatorAuthority {
            speed_m_s,
            elevator_rad,
            available_rad,
            control,
        } => elevator_authority_message(speed_m_s, elevator_rad, available_rad, control),
        TailStallInRange {
            speed_m_s,
            elevator_rad,
        } => format!(
            "At {speed_m_s:.1} m/s, trimmed with {:.1} deg of elevator, the tailplane is at its \
             negative cl limit (cl_min): within the speed range it would stall downwards and pitch \
             control would be lost. Move the CG aft within the band or enlarge the tailplane.",
            elevator_rad.to_degrees()
        ),
        TaillessTrim { .. } => tailless_trim_message(f),
        ModelsDisagree {
            wing_model,
            has_stabiliser,
            neutral_point_x_m,
            closed_form_neutral_point_x_m,
            mac_m,
            closed_form_band_aft_x_m,
        } => models_disagree_message(
            wing_model,
            has_stabiliser,
            (neutral_point_x_m - closed_form_neutral_point_x_m) / mac_m,
            mac_m,
            closed_form_band_aft_x_m,
        ),
    }
}

/// `x` with a sign and `decimals` decimals, never "-0.000".
fn signed(x: f64, decimals: usize) -> String {
    let s = format!("{x:+.decimals$}");
    if s[1..].chars().all(|c| c == '0' || c == '.') {
        s[1..].to_string()
    } else {
        s
    }
}

/// The direction of an elevon deflection `d` (rad, trailing edge down positive).
fn up_or_down(d: f64) -> &'static str {
    if d < 0.0 {
        "up"
    } else {
        "down"
    }
}

/// The sentence of `tail-stalls-first`.
fn tail_stalls_first_message(percent_semispan: f64, stall: TailStall) -> String {
    match stall {
        TailStall::Downwards {
            role,
            speed_m_s,
            wing_stall_speed_m_s,
        } => {
            let surface = match role {
                StabiliserRole::Canard => "canard",
                StabiliserRole::Tail => "tailplane",
            };
            format!(
                "The {surface} stalls first, downwards: slowing down with the elevator, it \
                 reaches its negative cl limit (cl_min, at {percent_semispan:.0} % of its \
                 semispan) at {speed_m_s:.1} m/s, before the wing would stall at \
                 {wing_stall_speed_m_s:.1} m/s. Below {speed_m_s:.1} m/s pitch control would be \
                 lost, so that is the stall speed shown. Move the CG aft within the \
                 recommended band (less download needed), or give the {surface} more area or \
                 a section with a larger negative cl limit (or camber it for download)."
            )
        }
        TailStall::AtClMax {
            unstable,
            tail_uploaded,
        } => {
            format!(
            "The tailplane reaches its cl_max before the wing (at {percent_semispan:.0} % of its \
             semispan) when trimmed near the stall: pitch control would be lost. {}",
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
        )
        }
    }
}

/// The sentence of `elevator-authority` (angles rad).
fn elevator_authority_message(
    speed_m_s: f64,
    elevator_rad: f64,
    available_rad: f64,
    control: Control,
) -> String {
    let need = match (elevator_rad < 0.0, control == Control::CanardElevator) {
        (true, false) => "up",
        (false, false) => "down",
        (true, true) => "trailing edge up (nose down)",
        (false, true) => "trailing edge down (nose up)",
    };
    let rigging = match control {
        Control::Elevator | Control::CanardElevator => "the decalage",
        Control::Elevons | Control::Reflex => "the washout and reflex",
    };
    let name = control_name(control);
    format!(
        "At {speed_m_s:.1} m/s the {name} need{} {:.1} deg {need} to trim, more than the {:.1} deg \
         available: the speed range is limited by the {name}. Check the CG and {rigging}.",
        if control == Control::Elevons { "" } else { "s" },
        elevator_rad.abs().to_degrees(),
        available_rad.to_degrees()
    )
}

/// The sentence of `tailless-trim`.
fn tailless_trim_message(f: &ModelFinding) -> String {
    let ModelFinding::TaillessTrim {
        design_cl,
        cm_at_design,
        cm_zero_lift,
        elevons,
        washout_change_rad,
        reflex_cm_change,
        cg_aft_helps,
    } = *f
    else {
        return String::new();
    };
    let (cm_design, cm_zero) = (signed(cm_at_design, 3), signed(cm_zero_lift, 3));
    let elevons = match elevons {
        ElevonTrim::Within { deflection_rad: d } => {
            // The wing lacks nose-up moment at the design CL (a stable wing's moment falls
            // with CL), so the fixes are more washout where it helps, or reflex.
            let washout = washout_change_rad
                .map(f64::to_degrees)
                .filter(|w| *w < 0.0)
                .map(|w| format!("About {:.1} deg more tip washout, or airfoils", w.abs()))
                .unwrap_or_else(|| "Airfoils".to_string());
            return format!(
                "With the elevons neutral this tailless wing does not trim at its design CL \
                 {design_cl:.2} (pitching moment {cm_design} there, {cm_zero} at zero lift). It \
                 trims there with about {:.1} deg of {} elevon, within the throws; that much \
                 throw is then not available for control. {washout} with about \
                 {reflex_cm_change:.3} more reflex (cm_ac) would trim it with the elevons neutral.",
                d.abs().to_degrees(),
                up_or_down(d),
            );
        }
        ElevonTrim::Beyond { deflection_rad: d } => format!(
            "; the elevons would need {:.1} deg {}, beyond their throws",
            d.abs().to_degrees(),
            up_or_down(d)
        ),
        ElevonTrim::Cannot => "; the elevons cannot trim it there".to_string(),
        ElevonTrim::NoElevons => String::new(),
    };
    let remedies = tailless_remedies(washout_change_rad, reflex_cm_change, cg_aft_helps);
    format!(
        "This tailless wing does not trim at its design CL {design_cl:.2} with this CG (pitching \
         moment {cm_design} there, {cm_zero} at zero lift; it must be positive at zero \
         lift){elevons}. It needs {remedies}."
    )
}

/// The remedies for a tailless wing that does not trim, in words: the washout change
/// `washout_change_rad` (when worth suggesting), reflex, and a CG further aft when that helps.
fn tailless_remedies(
    washout_change_rad: Option<f64>,
    reflex_cm_change: f64,
    cg_aft_helps: bool,
) -> String {
    let mut remedies = Vec::new();
    if let Some(w) = washout_change_rad {
        let deg = w.to_degrees();
        remedies.push(format!(
            "about {:.1} deg {} tip washout",
            deg.abs(),
            if deg < 0.0 { "more" } else { "less" }
        ));
    }
    remedies.push(format!(
        "airfoils with about {reflex_cm_change:.3} more reflex (cm_ac)"
    ));
    if cg_aft_helps {
        remedies.push("the CG moved aft within the recommended band".to_string());
    }
    let last = remedies.pop().unwrap_or_default();
    if remedies.is_empty() {
        last
    } else {
        format!("{}, or {last}", remedies.join(", "))
    }
}

/// The sentence of `models-disagree`: the full model's neutral point lies `diff` (fraction of
/// the MAC `mac_m`, positive aft) from the closed form's.
fn models_disagree_message(
    wing_model: WingModel,
    has_stabiliser: bool,
    diff: f64,
    mac_m: f64,
    closed_form_band_aft_x_m: f64,
) -> String {
    let model = match wing_model {
        WingModel::VortexLattice => "vortex-lattice",
        WingModel::LiftingLine => "lifting-line",
    };
    let why = match wing_model {
        WingModel::VortexLattice => format!(
            "The lattice models sweep, taper, twist, {}and where along the chord each strip \
             carries its lift; the closed form reduces the wing to a straight equivalent wing{}. \
             Neither models the fuselage's interference or a flexible wing.",
            if has_stabiliser {
                "the stabiliser's place in the wake (downwash) "
            } else {
                ""
            },
            if has_stabiliser {
                " with a simple downwash formula"
            } else {
                ""
            }
        ),
        WingModel::LiftingLine => "The lifting line puts each strip's lift on its quarter-chord \
             line, which places the neutral point of a swept or low-aspect-ratio surface too far \
             aft; the closed form reduces the wing to a straight equivalent wing."
            .to_string(),
    };
    let advice = if diff > 0.0 {
        format!(
            "Until a glide test confirms the balance, keep the CG ahead of {:.0} mm, the aft end \
             of the band measured from the closed-form neutral point (the more forward, safer one).",
            1000.0 * closed_form_band_aft_x_m
        )
    } else {
        "The band is measured from the more forward of the two, the safer one.".to_string()
    };
    format!(
        "The {model} neutral point lies {:.0} mm {} of the closed-form estimate ({:.1} % of MAC). \
         {why} {advice}",
        (diff * mac_m * 1000.0).abs(),
        if diff > 0.0 { "aft" } else { "forward" },
        100.0 * diff.abs(),
    )
}
