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
