//! Findings on balance and trim: the static margin, the CG against the recommended band and
//! the neutral point's range, the trim point against the stall.

use crate::analysis::CgBand;
use crate::caution::Level;

use super::Control;

/// What the rigging or the CG could change to make the aircraft trim faster.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct FasterTrim {
    /// The aircraft has a stabiliser (the decalage is the rigging to change); otherwise the
    /// washout or reflex of a tailless wing.
    pub has_stabiliser: bool,
    /// The band leaves room to move the CG forward.
    pub room_forward: bool,
}

/// One finding on balance and trim (lengths m aft of the datum, margins as fractions of MAC).
#[derive(Debug, Clone, PartialEq)]
pub enum BalanceFinding {
    /// `static-margin-negative`: the CG lies behind the neutral point.
    StaticMarginNegative {
        /// CG minus neutral point, m.
        cg_behind_neutral_point_m: f64,
        /// Static margin (negative).
        static_margin: f64,
    },
    /// `static-margin-low`: between 0 and the least margin.
    StaticMarginLow {
        /// Static margin.
        static_margin: f64,
    },
    /// `cg-behind-neutral-point-range`: a positive margin, but the CG lies behind the forward
    /// end of the neutral point's range or behind the closed-form neutral point.
    CgBehindNeutralPointRange {
        /// CG, m.
        cg_x_m: f64,
        /// The nearer forward estimate of the neutral point, m.
        limit_x_m: f64,
        /// The headline neutral point, m.
        neutral_point_x_m: f64,
        /// True when the limit is the closed-form neutral point, false when it is the
        /// forward end of the uncertainty range.
        closed_form: bool,
        /// The recommended band's aft end, m.
        band_aft_x_m: f64,
    },
    /// `cg-aft-of-band`.
    CgAftOfBand {
        /// CG, m.
        cg_x_m: f64,
        /// The band.
        band: CgBand,
    },
    /// `cg-forward-of-band`.
    CgForwardOfBand {
        /// CG, m.
        cg_x_m: f64,
        /// The band.
        band: CgBand,
        /// The aircraft's pitch control.
        control: Control,
    },
    /// `cg-aft-of-uncertain-limit`: a CG inside the band whose tolerance range reaches aft of
    /// the band's aft end; a danger when it reaches the neutral point itself.
    CgAftOfUncertainLimit {
        /// CG, m.
        cg_x_m: f64,
        /// Two standard deviations of the CG from the builder's tolerances, m.
        cg_spread_m: f64,
        /// The headline neutral point, m.
        neutral_point_x_m: f64,
        /// Two standard deviations of the neutral point, m.
        neutral_point_spread_m: f64,
        /// The band's forward end, m.
        band_forward_x_m: f64,
        /// The band's aft end, m.
        band_aft_x_m: f64,
    },
    /// `cg-band-empty`: full nose-up control cannot hold the stall even at the band's aft end.
    CgBandEmpty {
        /// The band's aft end, m.
        aft_x_m: f64,
        /// The least static margin of the band.
        min_static_margin: f64,
        /// The aircraft's pitch control.
        control: Control,
    },
    /// `trim-beyond-stall`.
    TrimBeyondStall {
        /// Trim CL.
        cl: f64,
        /// The aircraft's CL max.
        cl_max: f64,
        /// What would trim it faster.
        faster: FasterTrim,
    },
    /// `trim-near-stall`: trim speed below the near-stall factor times the stall speed.
    TrimNearStall {
        /// Trim speed, m/s.
        speed_m_s: f64,
        /// Stall speed, m/s.
        stall_speed_m_s: f64,
        /// What would trim it faster.
        faster: FasterTrim,
    },
    /// `target-speed-near-stall`: the file's target trim speed lies below the stall speed (a
    /// danger: the decalage solved for it would trim the aircraft stalled) or within the
    /// near-stall factor of it (a warning).
    TargetSpeedNearStall {
        /// The target trim speed, m/s.
        target_speed_m_s: f64,
        /// Stall speed, m/s.
        stall_speed_m_s: f64,
        /// The near-stall factor (1.2).
        factor: f64,
        /// The aircraft has a stabiliser (a decalage is solved for the target); a tailless
        /// wing gets the CG for it only.
        has_stabiliser: bool,
    },
    /// `no-trim`: a stable aircraft finds no trim at positive lift.
    NoTrim {
        /// The aircraft has a stabiliser.
        has_stabiliser: bool,
    },
    /// `band-defaults`: the band uses the common-practice margins.
    BandDefaults {
        /// Least static margin.
        min_static_margin: f64,
        /// Greatest static margin.
        max_static_margin: f64,
        /// Wing MAC, m.
        mac_m: f64,
    },
}

impl BalanceFinding {
    /// Its level.
    pub fn level(&self) -> Level {
        use BalanceFinding::*;
        match self {
            StaticMarginNegative { .. }
            | CgBehindNeutralPointRange { .. }
            | CgBandEmpty { .. }
            | TrimBeyondStall { .. }
            | NoTrim { .. } => Level::Danger,
            CgAftOfUncertainLimit {
                cg_x_m,
                cg_spread_m,
                neutral_point_x_m,
                neutral_point_spread_m,
                ..
            } => {
                // A CG range that reaches behind the forward end of the neutral point's range
                // may be unstable (the bar of `cg-behind-neutral-point-range` for the CG).
                if cg_x_m + cg_spread_m >= neutral_point_x_m - neutral_point_spread_m {
                    Level::Danger
                } else {
                    Level::Warning
                }
            }
            TargetSpeedNearStall {
                target_speed_m_s,
                stall_speed_m_s,
                ..
            } => {
                if target_speed_m_s < stall_speed_m_s {
                    Level::Danger
                } else {
                    Level::Warning
                }
            }
            StaticMarginLow { .. }
            | CgAftOfBand { .. }
            | CgForwardOfBand { .. }
            | TrimNearStall { .. } => Level::Warning,
            BandDefaults { .. } => Level::Note,
        }
    }

    /// Its stable code.
    pub fn code(&self) -> &'static str {
        use BalanceFinding::*;
        match self {
            StaticMarginNegative { .. } => "static-margin-negative",
            StaticMarginLow { .. } => "static-margin-low",
            CgBehindNeutralPointRange { .. } => "cg-behind-neutral-point-range",
            CgAftOfBand { .. } => "cg-aft-of-band",
            CgForwardOfBand { .. } => "cg-forward-of-band",
            CgAftOfUncertainLimit { .. } => "cg-aft-of-uncertain-limit",
            CgBandEmpty { .. } => "cg-band-empty",
            TrimBeyondStall { .. } => "trim-beyond-stall",
            TrimNearStall { .. } => "trim-near-stall",
            TargetSpeedNearStall { .. } => "target-speed-near-stall",
            NoTrim { .. } => "no-trim",
            BandDefaults { .. } => "band-defaults",
        }
    }
}
