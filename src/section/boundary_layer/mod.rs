//! Integral boundary layer on a prescribed surface speed: one published method per file and the
//! march that strings them together along one surface.
//!
//! Lengths are fractions of the chord and speeds fractions of the free-stream speed; the
//! kinematic viscosity is then `1 / Re` with `Re` the chord Reynolds number.
//!
//! - [`thwaites`]: laminar momentum thickness and Thwaites' correlations (Cebeci-Bradshaw fit).
//! - [`envelope`]: growth of the amplification factor N (Drela-Giles approximate envelope).
//! - [`michel`]: Michel's transition criterion, reported beside the envelope result.
//! - [`head`]: turbulent momentum thickness and shape factor by Head's entrainment method.
//! - [`squire_young`]: profile drag from the trailing-edge state.
//! - [`march`]: laminar -> transition (or laminar separation with turbulent reattachment) ->
//!   turbulent, station by station.

pub mod envelope;
pub mod head;
pub mod march;
pub mod michel;
pub mod squire_young;
pub mod thwaites;

pub use march::{march_surface, LayerState, Regime, Station, SurfaceLayer, TransitionCause};
