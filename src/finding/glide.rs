//! Findings on the glide polar and the flap settings' polars: why a polar is missing, the
//! least sink near the stall, early separation, the section drag's source and range, and the
//! speeds the pitch control cannot trim.

use crate::analysis::glide::EarlySeparation;
use crate::caution::Level;
use crate::performance::flight_polar::FlightPolarError;

use super::Control;

/// Why the configuration has no glide polar, as the cautions tell it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum PolarMissing {
    /// Without a pitch control or a tailplane the aircraft flies at one trimmed speed only.
    NoTrimControl,
    /// Unstable in pitch (negative static margin): no trimmed glide to compute.
    Unstable,
    /// The polar itself failed.
    Failed(FlightPolarError),
    /// The wake solution's span efficiency is beyond what any lifting system of these
    /// proportions reaches: its induced drag, and every glide figure, cannot be trusted.
    ImplausibleInducedDrag {
        /// The greatest finite span efficiency over the polar's speeds (None when one was not
        /// finite).
        span_efficiency: Option<f64>,
    },
}

/// One finding on the glide polars (speeds m/s).
#[derive(Debug, Clone, PartialEq)]
pub enum GlideFinding {
    /// `no-flight-polar`: a note when there is no trim control, a warning when the polar
    /// failed.
    NoFlightPolar {
        /// Why.
        why: PolarMissing,
    },
    /// `min-sink-near-stall`: the least sink lies at the stall or within `margin_factor`
    /// times the stall speed.
    MinSinkNearStall {
        /// Speed of the least sink, m/s.
        speed_m_s: f64,
        /// The least sink lies at the stall itself.
        at_stall: bool,
        /// Stall speed, m/s.
        stall_speed_m_s: f64,
        /// The margin kept on the stall speed (a factor above 1).
        margin_factor: f64,
    },
    /// `section-separates-early`: at the stall a strip flies beyond the cl at which its
    /// viscous polar separates.
    SectionSeparatesEarly {
        /// The strip and its numbers.
        separation: EarlySeparation,
        /// Stall speed, m/s.
        stall_speed_m_s: f64,
    },
    /// `profile-drag-estimated`: an airfoil's section drag is the flat-plate estimate.
    ProfileDragEstimated {
        /// Airfoil name (from the file).
        airfoil: String,
        /// Why the flat-plate estimate was used, as the drag source gives it.
        reason: String,
    },
    /// `polar-drag-extrapolated`: some flyable point's drag is continued beyond its section
    /// polar between these speeds.
    PolarDragExtrapolated {
        /// Slowest such speed, m/s.
        low_m_s: f64,
        /// Fastest such speed, m/s.
        high_m_s: f64,
    },
    /// `polar-control-runs-out`: the pitch control cannot trim between these speeds.
    PolarControlRunsOut {
        /// Slowest untrimmed speed, m/s.
        low_m_s: f64,
        /// Fastest untrimmed speed, m/s.
        high_m_s: f64,
        /// The aircraft's pitch control.
        control: Control,
    },
    /// `flap-settings-estimated`: how the flap settings' polars are estimated.
    FlapSettingsEstimated,
    /// `flap-setting-no-polar`.
    FlapSettingNoPolar {
        /// The setting's name (from the file).
        setting: String,
        /// The polar's failure; `None` when no trimmed stall or trim was found.
        error: Option<FlightPolarError>,
    },
    /// `flap-setting-control-runs-out`: with the setting, the pitch control cannot trim
    /// between these speeds.
    FlapSettingControlRunsOut {
        /// The setting's name (from the file).
        setting: String,
        /// Slowest untrimmed speed, m/s.
        low_m_s: f64,
        /// Fastest untrimmed speed, m/s.
        high_m_s: f64,
        /// The aircraft's pitch control.
        control: Control,
    },
}

impl GlideFinding {
    /// Its level.
    pub fn level(&self) -> Level {
        use GlideFinding::*;
        match self {
            NoFlightPolar {
                why: PolarMissing::NoTrimControl | PolarMissing::Unstable,
            }
            | PolarDragExtrapolated { .. }
            | FlapSettingsEstimated => Level::Note,
            NoFlightPolar {
                why: PolarMissing::Failed(_) | PolarMissing::ImplausibleInducedDrag { .. },
            }
            | MinSinkNearStall { .. }
            | SectionSeparatesEarly { .. }
            | ProfileDragEstimated { .. }
            | PolarControlRunsOut { .. }
            | FlapSettingNoPolar { .. }
            | FlapSettingControlRunsOut { .. } => Level::Warning,
        }
    }

    /// Its stable code.
    pub fn code(&self) -> &'static str {
        use GlideFinding::*;
        match self {
            NoFlightPolar { .. } => "no-flight-polar",
            MinSinkNearStall { .. } => "min-sink-near-stall",
            SectionSeparatesEarly { .. } => "section-separates-early",
            ProfileDragEstimated { .. } => "profile-drag-estimated",
            PolarDragExtrapolated { .. } => "polar-drag-extrapolated",
            PolarControlRunsOut { .. } => "polar-control-runs-out",
            FlapSettingsEstimated => "flap-settings-estimated",
            FlapSettingNoPolar { .. } => "flap-setting-no-polar",
            FlapSettingControlRunsOut { .. } => "flap-setting-control-runs-out",
        }
    }
}
