//! TEMPORARY until the section branch merges.
#![allow(missing_docs, dead_code)]
use super::*;
use crate::caution::Caution;
use crate::model::{Airfoil, SectionMethod};
pub fn section_model(a: &Airfoil) -> (SectionModel, Vec<Caution>) {
    (
        SectionModel {
            method: SectionMethod::Thin,
            alpha_zero_lift_rad: -0.036,
            cl_alpha_per_rad: 2.0 * std::f64::consts::PI,
            cm_ac: -0.05,
            x_ac_c: 0.25,
            cl_max: a.cl_max.unwrap_or(DEFAULT_CL_MAX),
            cl_min: -0.8,
            cl_max_source: if a.cl_max.is_some() {
                ClMaxSource::Given
            } else {
                ClMaxSource::Default
            },
        },
        vec![],
    )
}
