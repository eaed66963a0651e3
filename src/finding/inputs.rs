//! Findings on the inputs and on how the analysis ran: values the reader accepts but that look
//! like a slip, weighing against the mass list, low Reynolds numbers, the fin, a model that
//! could not be solved, defaults assumed.

use crate::analysis::LOW_REYNOLDS_WARNING;
use crate::caution::Level;
use crate::lifting_line::LiftingLineError;
use crate::model::StabiliserRole;

/// Which static margin of the file a finding is about.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum MarginSetting {
    /// `[targets] static_margin`.
    Target,
    /// `[limits] min_static_margin`.
    LeastLimit,
}

/// One finding on the inputs (lengths m, masses kg, margins as fractions of MAC).
#[derive(Debug, Clone, PartialEq)]
pub enum InputFinding {
    /// `vertical-cg-partial`: some masses have a height, some do not.
    VerticalCgPartial {
        /// Masses with a height.
        with_height: usize,
        /// All masses.
        masses: usize,
    },
    /// `weighing-differs`: the weighing and the mass list disagree.
    WeighingDiffers {
        /// CG from the weighing, m.
        weighed_cg_x_m: f64,
        /// Mass from the weighing, kg.
        weighed_kg: f64,
        /// CG from the mass list, m.
        listed_cg_x_m: f64,
        /// Mass from the mass list, kg.
        listed_kg: f64,
    },
    /// `reynolds-low`: a warning below [`LOW_REYNOLDS_WARNING`], a note below
    /// [`crate::analysis::LOW_REYNOLDS_NOTE`] (the lower of the two Reynolds numbers decides).
    ReynoldsLow {
        /// On the MAC at `speed_m_s`.
        reynolds_mac: f64,
        /// Trim speed (or stall speed without a trim), m/s.
        speed_m_s: f64,
        /// Near the tip at the stall speed.
        reynolds_tip_at_stall: f64,
        /// The chord there, m.
        tip_chord_m: f64,
        /// Fraction of the semispan of that station.
        tip_station: f64,
        /// Stall speed, m/s.
        stall_speed_m_s: f64,
    },
    /// `tolerances-too-large`: the CG's four-sigma range exceeds the MAC.
    TolerancesTooLarge {
        /// Four standard deviations of the CG, m.
        cg_range_m: f64,
        /// Wing MAC, m.
        mac_m: f64,
    },
    /// `fin-ahead-of-wing`.
    FinAheadOfWing {
        /// How far the fin's quarter chord lies ahead of the wing's, m.
        ahead_m: f64,
    },
    /// `fin-volume-outside-range`.
    FinVolumeOutsideRange {
        /// S_v l_v / (S b).
        volume_coefficient: f64,
        /// The typical range.
        range: (f64, f64),
    },
    /// `fin-mass-away-from-fin`: the fin's mass item lies outside the fin.
    FinMassAwayFromFin {
        /// The mass item's name, as the file gives it.
        item: String,
        /// Its x, m.
        item_x_m: f64,
        /// The fin's extent in x, m.
        fin_x_m: (f64, f64),
    },
    /// `static-margin-limit-negative`: the file asks for a negative margin.
    StaticMarginLimitNegative {
        /// Which setting.
        setting: MarginSetting,
        /// The margin asked for.
        static_margin: f64,
    },
    /// `margin-looks-like-a-fraction`: a margin between 0 and 1 % of MAC.
    MarginLooksLikeAFraction {
        /// Which setting.
        setting: MarginSetting,
        /// The margin as read.
        static_margin: f64,
    },
    /// `surfaces-overlap`: the stabiliser overlaps the wing in the top view.
    SurfacesOverlap {
        /// Tail or canard.
        role: StabiliserRole,
        /// Distance from the centre line of the overlap, m.
        y_m: f64,
        /// Vertical gap there, m.
        gap_m: f64,
    },
    /// `canard-wake-on-wing`: a canard nearly in the wing's plane.
    CanardWakeOnWing {
        /// Height of the canard's root leading edge above the wing's, m (either sign).
        gap_m: f64,
        /// Wing span, m.
        span_m: f64,
    },
    /// `wing-loading-unusual`.
    WingLoadingUnusual {
        /// kg/m^2.
        loading_kg_m2: f64,
        /// The usual range, kg/m^2.
        usual_kg_m2: (f64, f64),
    },
    /// `proportions-unusual`: a fuselage long for the span.
    FuselageLong {
        /// Fuselage length, m.
        length_m: f64,
        /// Wing span, m.
        span_m: f64,
        /// Usual greatest length per span.
        usual_max: f64,
    },
    /// `proportions-unusual`: a stabiliser far from the wing for the span.
    TailArmLong {
        /// From the wing's root leading edge to the stabiliser's, m.
        arm_m: f64,
        /// Wing span, m.
        span_m: f64,
        /// Usual greatest arm per span.
        usual_max: f64,
    },
    /// `proportions-unusual`: a wing of unusual aspect ratio.
    AspectRatioUnusual {
        /// b^2 / S.
        aspect_ratio: f64,
        /// Wing span, m.
        span_m: f64,
        /// The usual range.
        usual: (f64, f64),
    },
    /// `lifting-line-failed`: the full model could not be solved.
    LiftingLineFailed {
        /// Why.
        error: LiftingLineError,
    },
    /// `section-too-thin-for-panels`.
    SectionTooThinForPanels {
        /// The airfoil's name.
        airfoil: String,
        /// Its thickness, fraction of chord.
        thickness: f64,
        /// The panel method's limit, fraction of chord.
        limit: f64,
    },
    /// `cl-max-default`: an airfoil without cl_max gets the default.
    ClMaxDefault {
        /// The airfoil's name.
        airfoil: String,
        /// The default assumed.
        default: f64,
    },
}

impl InputFinding {
    /// Its level.
    pub fn level(&self) -> Level {
        use InputFinding::*;
        match self {
            StaticMarginLimitNegative { .. } => Level::Danger,
            ReynoldsLow {
                reynolds_mac,
                reynolds_tip_at_stall,
                ..
            } => {
                // (Raised only below the note threshold.)
                if reynolds_mac.min(*reynolds_tip_at_stall) < LOW_REYNOLDS_WARNING {
                    Level::Warning
                } else {
                    Level::Note
                }
            }
            WeighingDiffers { .. }
            | TolerancesTooLarge { .. }
            | FinAheadOfWing { .. }
            | MarginLooksLikeAFraction { .. }
            | SurfacesOverlap { .. }
            | CanardWakeOnWing { .. }
            | WingLoadingUnusual { .. }
            | FuselageLong { .. }
            | TailArmLong { .. }
            | AspectRatioUnusual { .. }
            | LiftingLineFailed { .. }
            | SectionTooThinForPanels { .. }
            | ClMaxDefault { .. } => Level::Warning,
            VerticalCgPartial { .. } | FinVolumeOutsideRange { .. } | FinMassAwayFromFin { .. } => {
                Level::Note
            }
        }
    }

    /// Its stable code.
    pub fn code(&self) -> &'static str {
        use InputFinding::*;
        match self {
            VerticalCgPartial { .. } => "vertical-cg-partial",
            WeighingDiffers { .. } => "weighing-differs",
            ReynoldsLow { .. } => "reynolds-low",
            TolerancesTooLarge { .. } => "tolerances-too-large",
            FinAheadOfWing { .. } => "fin-ahead-of-wing",
            FinVolumeOutsideRange { .. } => "fin-volume-outside-range",
            FinMassAwayFromFin { .. } => "fin-mass-away-from-fin",
            StaticMarginLimitNegative { .. } => "static-margin-limit-negative",
            MarginLooksLikeAFraction { .. } => "margin-looks-like-a-fraction",
            SurfacesOverlap { .. } => "surfaces-overlap",
            CanardWakeOnWing { .. } => "canard-wake-on-wing",
            WingLoadingUnusual { .. } => "wing-loading-unusual",
            FuselageLong { .. } | TailArmLong { .. } | AspectRatioUnusual { .. } => {
                "proportions-unusual"
            }
            LiftingLineFailed { .. } => "lifting-line-failed",
            SectionTooThinForPanels { .. } => "section-too-thin-for-panels",
            ClMaxDefault { .. } => "cl-max-default",
        }
    }
}
