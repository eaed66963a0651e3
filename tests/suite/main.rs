//! The integration tests in one binary (one link instead of one per topic): each module is one
//! topic and names its outside sources.

mod architecture;
mod atmosphere;
mod balance;
mod balance_trim;
mod cli_check;
mod cli_compare;
mod common;
mod flap_correction;
mod fuselage;
mod geometry;
mod input_errors;
mod input_file;
mod lifting_line_classical;
mod lifting_line_downwash;
mod lifting_line_multi;
mod lifting_line_stall;
mod lifting_line_sweep;
mod np_uncertainty;
mod performance;
mod report;
mod section_bad_input;
mod section_cli;
mod section_joukowski;
mod section_panel;
mod section_thin;
mod setups_and_datums;
mod stability_classical;
mod tail_efficiency;
mod tail_stall;
mod wording;
