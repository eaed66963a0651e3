//! The edge where results meet people and programs: terminal tables (comfy-table) and JSON
//! (serde mirror types). The core types carry no serde; this module copies them into output
//! shapes with units in every field name.

pub mod compare;
pub mod json;
pub mod section;
pub mod tables;
