//! The edge where results meet people and programs: terminal tables (comfy-table), JSON
//! (serde mirror types) and the printed report (content in [`report`], PDF in [`pdf`], the
//! only module that knows printpdf). The core types carry no serde; this module copies them
//! into output shapes with units in every field name.

pub mod compare;
pub mod json;
pub mod pdf;
pub mod report;
pub mod report_file;
pub mod section;
pub mod tables;
pub mod units;

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
