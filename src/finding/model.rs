//! Findings that only the full model raises: which surface stalls first and where, the pitch
//! control's authority over the speed range, the tailplane's negative stall within it, the
//! trim of a tailless wing, and the full model against the closed form.

use crate::caution::Level;
use crate::model::{StabiliserRole, WingModel};

use super::Control;

/// How the stabiliser stalls before the wing.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum TailStall {
    /// Downwards: slowing down with the elevator, it reaches its negative cl limit (cl_min).
    Downwards {
        /// Whether it is a tailplane or a canard.
        role: StabiliserRole,
        /// Speed at which it reaches cl_min (the stall speed shown), m/s.
        speed_m_s: f64,
        /// Speed at which the wing would stall, m/s.
        wing_stall_speed_m_s: f64,
    },
    /// A tailplane at its cl_max before the wing, trimmed near the stall.
    AtClMax {
        /// The static margin is zero or negative.
        unstable: bool,
        /// The tailplane carries an upload at the stall (a forward CG relieves it).
        tail_uploaded: bool,
    },
}

/// What the elevons of a tailless wing can do for its trim at the design CL (deflections rad,
/// trailing edge down positive).
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum ElevonTrim {
    /// The wing has no elevons.
    NoElevons,
    /// They trim it with this deflection, within their throws.
    Within {
        /// Deflection, rad.
        deflection_rad: f64,
    },
    /// They would need this deflection, beyond their throws.
    Beyond {
        /// Deflection, rad.
        deflection_rad: f64,
    },
    /// No deflection trims it there.
    Cannot,
}

/// One finding of the full model (lengths m aft of the datum, angles rad).
#[derive(Debug, Clone, PartialEq)]
pub enum ModelFinding {
    /// `tail-stalls-first`.
    TailStallsFirst {
        /// Where along the stabiliser's semispan the stall begins, %.
        percent_semispan: f64,
        /// How it stalls.
        stall: TailStall,
    },
    /// `canard-stall-order`: the wing reaches its cl_max before the canard.
    CanardStallOrder {
        /// Where along the wing's semispan the stall begins, %.
        percent_semispan: f64,
        /// The recommended band leaves room to move the CG forward.
        room_forward: bool,
    },
    /// `tip-stall`: the wing's stall begins outboard of mid-semispan.
    TipStall {
        /// Where along the wing's semispan the stall begins, %.
        percent_semispan: f64,
    },
    /// `elevator-authority`: the first speed of the elevator schedule that needs more throw
    /// than the pitch control has.
    ElevatorAuthority {
        /// Speed, m/s.
        speed_m_s: f64,
        /// Deflection needed to trim there, rad (negative: up, trailing edge up).
        elevator_rad: f64,
        /// Throw available in that direction, rad.
        available_rad: f64,
        /// The aircraft's pitch control.
        control: Control,
    },
    /// `tail-stall-in-range`: the first speed of the elevator schedule where the tailplane is
    /// at its negative cl limit.
    TailStallInRange {
        /// Speed, m/s.
        speed_m_s: f64,
        /// Elevator deflection that trims there, rad.
        elevator_rad: f64,
    },
    /// `tailless-trim`: a tailless wing that does not trim at its design CL with its elevons
    /// neutral.
    TaillessTrim {
        /// The design CL.
        design_cl: f64,
        /// Cm about the CG at the design CL.
        cm_at_design: f64,
        /// Cm about the CG at zero lift.
        cm_zero_lift: f64,
        /// What the elevons can do.
        elevons: ElevonTrim,
        /// Tip washout change that would trim it, rad (negative: more washout), when it is
        /// within what is worth suggesting (`MAX_USEFUL_WASHOUT_CHANGE_DEG`).
        washout_change_rad: Option<f64>,
        /// Rise of every section's cm_ac (reflex) that would trim it.
        reflex_cm_change: f64,
        /// Moving the CG aft within the band would help: it is ahead of the band's aft end
        /// and the moment at zero lift is positive.
        cg_aft_helps: bool,
    },
    /// `models-disagree`: the full model's neutral point and the closed form's differ by more
    /// than `MODELS_DISAGREE` of the MAC.
    ModelsDisagree {
        /// The full model used.
        wing_model: WingModel,
        /// The aircraft has a stabiliser.
        has_stabiliser: bool,
        /// The full model's neutral point, m.
        neutral_point_x_m: f64,
        /// The closed form's neutral point, m.
        closed_form_neutral_point_x_m: f64,
        /// Wing MAC, m.
        mac_m: f64,
        /// The band's aft end measured from the closed-form neutral point, m.
        closed_form_band_aft_x_m: f64,
    },
}

impl ModelFinding {
    /// Its level.
    pub fn level(&self) -> Level {
        use ModelFinding::*;
        match self {
            TailStallsFirst { .. } | CanardStallOrder { .. } => Level::Danger,
            TipStall { .. } | ElevatorAuthority { .. } | TailStallInRange { .. } => Level::Warning,
            TaillessTrim {
                elevons,
                cm_zero_lift,
                ..
            } => match elevons {
                // Flying on the elevons within their throws is a note.
                ElevonTrim::Within { .. } => Level::Note,
                // A moment at zero lift that is not positive trims at no positive lift.
                _ if *cm_zero_lift <= 0.0 => Level::Danger,
                _ => Level::Warning,
            },
            ModelsDisagree { .. } => Level::Note,
        }
    }

    /// Its stable code.
    pub fn code(&self) -> &'static str {
        use ModelFinding::*;
        match self {
            TailStallsFirst { .. } => "tail-stalls-first",
            CanardStallOrder { .. } => "canard-stall-order",
            TipStall { .. } => "tip-stall",
            ElevatorAuthority { .. } => "elevator-authority",
            TailStallInRange { .. } => "tail-stall-in-range",
            TaillessTrim { .. } => "tailless-trim",
            ModelsDisagree { .. } => "models-disagree",
        }
    }
}
