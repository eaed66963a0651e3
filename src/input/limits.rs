//! Every count limit of the input files, in one place: the file reader refuses a file past
//! any of them with an error that names the list, the count and the limit.
//!
//! The limits are far above any real model or light aircraft (the counts there are common
//! practice, from memory: 1 to 10 panels per half-wing, 5 to 60 mass items, up to a dozen
//! setups and airfoils) and low enough that the worst file accepted finishes `trimline check`
//! in about 2 s on a 2-core machine (measured with a generated file at every limit; see
//! README.md, "Limits").

/// Most characters in a name (aircraft, mass item, ballast bay, setup).
pub const MAX_NAME_CHARS: usize = 100;
/// Most characters in `notes` or `datum`.
pub const MAX_TEXT_CHARS: usize = 2_000;
/// Most `[[wing.panel]]` (or `[[stabiliser.panel]]`) entries on one surface.
pub const MAX_PANELS_PER_SURFACE: usize = 20;
/// Most `[airfoils.NAME]` tables.
pub const MAX_AIRFOILS: usize = 20;
/// Most `[[mass]]` items.
pub const MAX_MASS_ITEMS: usize = 500;
/// Most `[[ballast]]` bays.
pub const MAX_BALLAST_BAYS: usize = 20;
/// Most `[[setup]]` tables.
pub const MAX_SETUPS: usize = 20;
/// Fewest and most `[[weighing]]` supports (two or three wheels or scales).
pub const WEIGHING_SUPPORTS: (usize, usize) = (2, 3);
