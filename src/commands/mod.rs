//! One module per subcommand: argument struct and the glue from arguments to library calls.

pub mod check;
pub mod compare;
pub mod new;
pub mod report;
pub mod section;
