//! Which lifting surface of the aircraft a strip, a result or an incidence belongs to.
//!
//! The strip system takes any number of surfaces
//! ([`MultiSurfaceSystem::new`](super::MultiSurfaceSystem::new)) and numbers them in the order
//! given, so its tables keep that plain index (`surface: usize`).
//! [`MultiSurfaceSystem::from_aircraft`](super::MultiSurfaceSystem::from_aircraft), the one way
//! the analysis builds it, gives the wing first and the stabiliser (tail or canard), when there
//! is one, second: [`SurfaceRole`] names those two places, so that code about the aircraft asks
//! for "the stabiliser" instead of the number 1.

use super::multi_surface::Station;
use super::results::{LiftingLineResult, StationResult, SurfaceResult};

/// The place of a surface in a system built from an aircraft.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum SurfaceRole {
    /// The main wing (of a tailless aircraft, the only surface).
    Wing,
    /// The stabiliser: a tail behind the wing or a canard ahead of it.
    Stabiliser,
}

impl SurfaceRole {
    /// The surface index of this role in a system built by
    /// [`MultiSurfaceSystem::from_aircraft`](super::MultiSurfaceSystem::from_aircraft).
    pub const fn index(self) -> usize {
        match self {
            SurfaceRole::Wing => 0,
            SurfaceRole::Stabiliser => 1,
        }
    }

    /// The role of surface `index` in such a system (`None` past the stabiliser).
    pub const fn of_index(index: usize) -> Option<SurfaceRole> {
        match index {
            0 => Some(SurfaceRole::Wing),
            1 => Some(SurfaceRole::Stabiliser),
            _ => None,
        }
    }
}

impl Station {
    /// True when this station belongs to the surface of `role`.
    pub fn is_on(&self, role: SurfaceRole) -> bool {
        self.surface == role.index()
    }
}

impl StationResult {
    /// True when this station belongs to the surface of `role`.
    pub fn is_on(&self, role: SurfaceRole) -> bool {
        self.surface == role.index()
    }
}

impl LiftingLineResult {
    /// The results of the surface of `role` (`None`: the system has no such surface).
    pub fn surface(&self, role: SurfaceRole) -> Option<&SurfaceResult> {
        self.surfaces.get(role.index())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn index_and_role_are_inverse() {
        for role in [SurfaceRole::Wing, SurfaceRole::Stabiliser] {
            assert_eq!(SurfaceRole::of_index(role.index()), Some(role));
        }
        assert_eq!(SurfaceRole::of_index(2), None);
    }
}
