//! The edge where results meet people and programs: terminal tables (comfy-table), JSON
//! (serde mirror types) and the printed report (content in [`report`], PDF in [`pdf`], the
//! only module that knows printpdf). The core types carry no serde; this module copies them
//! into output shapes with units in every field name.

pub mod cautions;
pub mod compare;
pub mod fs;
pub mod json;
pub mod pdf;
pub mod report;
pub mod report_file;
pub mod section;
pub mod study;
pub mod tables;
pub mod units;

/// The wing model in a few words for table notes: "vortex-lattice model", "lifting-line model".
pub fn wing_model_name(n: &crate::model::Numerics) -> &'static str {
    match n.wing_model {
        crate::model::WingModel::VortexLattice => "vortex-lattice model",
        crate::model::WingModel::LiftingLine => "lifting-line model",
    }
}

/// The wing model with its resolution and sources, for the methods footer and the spanwise
/// chart.
pub fn wing_model_method(n: &crate::model::Numerics) -> String {
    match n.wing_model {
        crate::model::WingModel::VortexLattice => format!(
            "vortex lattice, {} strips x {} chordwise panels on each half-wing (Katz and Plotkin, \
             Low-Speed Aerodynamics, ch. 12), each strip's lift from its section's lift curve \
             (decambering, Mukherjee and Gopalarathnam, J. Aircraft 43(3), 2006)",
            n.strips_per_half_span, n.chordwise_panels
        ),
        crate::model::WingModel::LiftingLine => format!(
            "numerical lifting line, {} stations on each half-wing (Phillips and Snyder, \
             J. Aircraft 37(4), 2000)",
            n.strips_per_half_span
        ),
    }
}

/// "12 mm aft of" or "12 mm ahead of" for a distance `dx_m` along x (positive aft), rounded to
/// whole millimetres, for sentences such as "... the wing root leading edge".
pub fn mm_aft_or_ahead(dx_m: f64) -> String {
    let mm = (dx_m * 1000.0).round();
    if mm < 0.0 {
        format!("{} mm ahead of", -mm)
    } else {
        format!("{} mm aft of", mm.abs())
    }
}

#[cfg(test)]
mod tests {
    #[test]
    fn distances_read_as_aft_or_ahead() {
        assert_eq!(super::mm_aft_or_ahead(0.0784), "78 mm aft of");
        assert_eq!(super::mm_aft_or_ahead(-0.005), "5 mm ahead of");
        assert_eq!(super::mm_aft_or_ahead(-0.0002), "0 mm aft of");
    }
}
