//! The words of the glide-polar findings.

use crate::finding::{Control, GlideFinding, PolarMissing};

use super::{control_name, reynolds_text};

/// The sentence of `f` (speeds in m/s).
pub(super) fn message(f: &GlideFinding) -> String {
    use GlideFinding::*;
    match f {
        NoFlightPolar {
            why: PolarMissing::NoTrimControl,
        } => "Without a pitch control or a tailplane the aircraft flies at one trimmed speed \
             only, so no glide polar over speed is computed."
            .to_string(),
        NoFlightPolar {
            why: PolarMissing::Unstable,
        } => "At this CG the aircraft is unstable in pitch (negative static margin): it cannot \
             hold a trimmed glide, so no glide figures are given."
            .to_string(),
        NoFlightPolar {
            why: PolarMissing::ImplausibleInducedDrag { span_efficiency },
        } => format!(
            "The wake solution gives a span efficiency {}, beyond the about \
             1.2 that no model's wing and stabiliser together exceed: its induced drag cannot \
             be trusted (this happens when the stabiliser or canard lies in the wing's plane, so \
             that their trailing vortices cross the other surface), so no sink or glide figures \
             are given. Give the stabiliser a height (z) a few percent of the span away from the \
             wing's.",
            span_efficiency.map_or_else(
                || "that is not finite".to_string(),
                |e| format!("of {e:.2}")
            )
        ),
        NoFlightPolar {
            why: PolarMissing::Failed(e),
        } => format!(
            "The glide polar could not be computed ({e}); no sink or glide figures are given."
        ),
        MinSinkNearStall {
            speed_m_s,
            at_stall,
            stall_speed_m_s,
            margin_factor,
        } => format!(
            "The least sink comes out at {speed_m_s:.1} m/s, {} the stall speed \
             {stall_speed_m_s:.1} m/s. Do not fly that slowly: near the stall the drag rise and \
             a wing drop are not in this model. Keep above {:.1} m/s ({margin_factor:.1} times \
             the stall speed).",
            if *at_stall { "at" } else { "close to" },
            margin_factor * stall_speed_m_s,
        ),
        SectionSeparatesEarly {
            separation: e,
            stall_speed_m_s,
        } => format!(
            "At the stall speed the {} flies airfoil '{}' at Reynolds number {} up to cl {:.2}, \
             but its viscous polars there (interpolated between the nearest computed Reynolds \
             numbers, on a 1.5 deg grid of angles: `trimline section` at one Reynolds number \
             may differ) separate at cl {:.2}: the stall may come at a \
             higher speed than {stall_speed_m_s:.1} m/s. Give that airfoil a cl_max for this \
             Reynolds number, and fly the first flights well above the stall speed shown.",
            if e.surface == 0 { "wing" } else { "stabiliser" },
            e.airfoil,
            reynolds_text(e.reynolds),
            e.cl_at_stall,
            e.separation_cl,
        ),
        ProfileDragEstimated { airfoil, reason } => format!(
            "Airfoil '{airfoil}': its section drag comes from a flat-plate estimate ({reason}), \
             which has no rise of drag with lift; sink and glide are optimistic at slow speed."
        ),
        PolarDragExtrapolated { low_m_s, high_m_s } => format!(
            "{} some strips fly at a lift coefficient or \
             Reynolds number beyond their section polar's converged points; their drag is \
             continued from the polar's last points there.",
            speed_range(*low_m_s, *high_m_s)
        ),
        PolarControlRunsOut {
            low_m_s,
            high_m_s,
            control,
        } => control_runs_out(*low_m_s, *high_m_s, *control),
        FlapSettingsEstimated | FlapSettingNoPolar { .. } | FlapSettingControlRunsOut { .. } => {
            flap_message(f)
        }
    }
}

/// The sentences of the flap settings' findings.
fn flap_message(f: &GlideFinding) -> String {
    use GlideFinding::*;
    match f {
        FlapSettingsEstimated => "Flap settings: each deflection shifts the flapped strips' \
             zero-lift angle and moment by Glauert's plain-flap theory with the hinge-gap loss; \
             their section drag is the plain section's at the lift it would have without the \
             flap, without the hinge's own drag; section cl_max stays as without the flap (a \
             higher stall speed than the flap really gives: the safe side). Compare the settings \
             with each other rather than trusting the absolute sink."
            .to_string(),
        FlapSettingNoPolar {
            setting,
            error: Some(e),
        } => format!("Flap setting '{setting}': no glide polar ({e})."),
        FlapSettingNoPolar {
            setting,
            error: None,
        } => format!(
            "Flap setting '{setting}': no trimmed stall or trim was found, so no glide polar."
        ),
        FlapSettingControlRunsOut {
            setting,
            low_m_s,
            high_m_s,
            control,
        } => format!(
            "Flap setting '{setting}': between {low_m_s:.1} and {high_m_s:.1} m/s the {} needs \
             more than its throws to trim; the setting is not usable there.",
            control_name(*control)
        ),
        // The others are worded by `message`.
        _ => message(f),
    }
}

/// "Between 7.2 and 9.0 m/s", or "At 7.2 m/s" when the two print alike.
fn speed_range(low_m_s: f64, high_m_s: f64) -> String {
    let (low, high) = (format!("{low_m_s:.1}"), format!("{high_m_s:.1}"));
    if low == high {
        format!("At {low} m/s")
    } else {
        format!("Between {low} and {high} m/s")
    }
}

/// The sentence of `polar-control-runs-out`.
fn control_runs_out(low_m_s: f64, high_m_s: f64, control: Control) -> String {
    format!(
        "{} of the glide range the {} cannot trim \
             within {} throws. Those speeds are marked in the glide table; least sink, best \
             glide and the speeds to fly use only the speeds {}.",
        speed_range(low_m_s, high_m_s),
        control_name(control),
        if control == Control::Elevons {
            "their"
        } else {
            "its"
        },
        if control == Control::Elevons {
            "they trim"
        } else {
            "it trims"
        }
    )
}
