//! Polars computed once per run: a cache keyed by the section's geometry, the Reynolds
//! number, the transition setting and the method settings (panels, angles).
//!
//! `check`, `compare` and `report` may each ask for the same airfoil at the same conditions;
//! the cache hands back the same shared polar. The key holds the exact bits of every input
//! number, so two requests share a polar only when they would compute the same one. The cache
//! does no I/O; it lives as long as its owner (one command run).

use crate::model::{Airfoil, AirfoilShape};
use crate::section::polar::Polar;
use crate::section::viscous::ViscousSettings;
use crate::section::{viscous_polar, SectionError, SectionSolution, SolutionFigures};
use std::collections::HashMap;
use std::sync::{Arc, Mutex};

/// What a polar depends on, as exact bits (public so that a store at the edges can keep
/// polars between runs).
#[derive(Debug, Clone, PartialEq, Eq, Hash)]
pub struct PolarKey {
    /// The section's shape: a kind tag, then its numbers' bits (a NACA designation as its
    /// characters).
    pub shape: Vec<u64>,
    /// Reynolds number bits.
    pub reynolds: u64,
    /// Critical amplification factor bits.
    pub n_crit: u64,
    /// Panels.
    pub panels: usize,
    /// Angles of attack, rad, as bits.
    pub alphas: Vec<u64>,
}

fn shape_bits(shape: &AirfoilShape) -> Vec<u64> {
    match shape {
        AirfoilShape::Naca(d) => std::iter::once(0).chain(d.chars().map(u64::from)).collect(),
        AirfoilShape::Joukowski {
            thickness_ratio,
            camber_ratio,
        } => vec![1, thickness_ratio.to_bits(), camber_ratio.to_bits()],
        AirfoilShape::KarmanTrefftz {
            thickness_ratio,
            camber_ratio,
            trailing_edge_angle_rad,
        } => vec![
            2,
            thickness_ratio.to_bits(),
            camber_ratio.to_bits(),
            trailing_edge_angle_rad.to_bits(),
        ],
        AirfoilShape::Coordinates { points, .. } => std::iter::once(3)
            .chain(points.iter().flat_map(|p| [p[0].to_bits(), p[1].to_bits()]))
            .collect(),
    }
}

/// A cache of viscous polars (thread-safe; interior mutability so that it can be shared by
/// reference).
#[derive(Debug, Default)]
pub struct PolarCache {
    polars: Mutex<HashMap<PolarKey, Arc<Polar>>>,
    computed: Mutex<usize>,
}

impl PolarCache {
    /// An empty cache.
    pub fn new() -> PolarCache {
        PolarCache::default()
    }

    /// The polar of `airfoil` at `settings` over `alphas_rad`, computed on the first request
    /// and shared afterwards. Errors are not cached.
    pub fn polar(
        &self,
        airfoil: &Airfoil,
        settings: ViscousSettings,
        alphas_rad: &[f64],
    ) -> Result<Arc<Polar>, SectionError> {
        let key = PolarKey {
            shape: shape_bits(&airfoil.shape),
            reynolds: settings.reynolds.to_bits(),
            n_crit: settings.n_crit.to_bits(),
            panels: settings.panels,
            alphas: alphas_rad.iter().map(|a| a.to_bits()).collect(),
        };
        if let Some(p) = self.lock().get(&key) {
            return Ok(p.clone());
        }
        let polar = Arc::new(viscous_polar(airfoil, settings, alphas_rad)?);
        if let Ok(mut n) = self.computed.lock() {
            *n += 1;
        }
        Ok(self.lock().entry(key).or_insert(polar).clone())
    }

    /// The cache shared by every caller in this process (one command run): `check`,
    /// `compare` and `report` reach the section models through the analysis, which has no
    /// cache of its own to pass on.
    pub fn shared() -> &'static PolarCache {
        static SHARED: std::sync::OnceLock<PolarCache> = std::sync::OnceLock::new();
        SHARED.get_or_init(PolarCache::new)
    }

    /// Every polar held, with its key (for a store that keeps them between runs).
    pub fn snapshot(&self) -> Vec<(PolarKey, Arc<Polar>)> {
        self.lock()
            .iter()
            .map(|(k, p)| (k.clone(), p.clone()))
            .collect()
    }

    /// Put polars computed earlier (by this same build, read back from a store) into the
    /// cache; entries already held are kept.
    pub fn preload(&self, entries: Vec<(PolarKey, Polar)>) {
        let mut map = self.lock();
        for (k, p) in entries {
            map.entry(k).or_insert_with(|| Arc::new(p));
        }
    }

    /// How many polars were computed (not taken from the cache) so far.
    pub fn computed(&self) -> usize {
        self.computed.lock().map_or(0, |n| *n)
    }

    fn lock(&self) -> std::sync::MutexGuard<'_, HashMap<PolarKey, Arc<Polar>>> {
        // A poisoned lock only means another thread panicked while inserting; the map is
        // still consistent (insertions are single calls).
        self.polars.lock().unwrap_or_else(|e| e.into_inner())
    }
}

/// What the figures of a panel solution depend on, as exact bits: the section's shape (as in
/// [`PolarKey::shape`]) and the number of panels.
#[derive(Debug, Clone, PartialEq, Eq, Hash)]
pub struct FigureKey {
    /// The section's shape.
    pub shape: Vec<u64>,
    /// Panels.
    pub panels: usize,
}

/// A cache of the panel method's [`SolutionFigures`] (thread-safe, shared by reference like
/// [`PolarCache`]): a section model made again from them is the same model, so the section
/// need not be solved again.
#[derive(Debug, Default)]
pub struct FigureCache {
    figures: Mutex<HashMap<FigureKey, SolutionFigures>>,
    computed: Mutex<usize>,
}

impl FigureCache {
    /// The figures of the panel solution of `airfoil` at `panels`: from the cache, or from
    /// `solve` (which must solve that section by the panel method) on the first request.
    /// Errors are not cached.
    pub fn panel_figures(
        &self,
        airfoil: &Airfoil,
        panels: usize,
        solve: impl FnOnce() -> Result<SectionSolution, SectionError>,
    ) -> Result<SolutionFigures, SectionError> {
        let key = FigureKey {
            shape: shape_bits(&airfoil.shape),
            panels,
        };
        if let Some(f) = self.lock().get(&key) {
            return Ok(*f);
        }
        let figures = SolutionFigures::of(&solve()?);
        if let Ok(mut n) = self.computed.lock() {
            *n += 1;
        }
        Ok(*self.lock().entry(key).or_insert(figures))
    }

    /// The cache shared by every caller in this process (see [`PolarCache::shared`]).
    pub fn shared() -> &'static FigureCache {
        static SHARED: std::sync::OnceLock<FigureCache> = std::sync::OnceLock::new();
        SHARED.get_or_init(FigureCache::default)
    }

    /// Every entry held (for a store that keeps them between runs).
    pub fn snapshot(&self) -> Vec<(FigureKey, SolutionFigures)> {
        self.lock().iter().map(|(k, f)| (k.clone(), *f)).collect()
    }

    /// Put figures computed earlier by this same build into the cache; entries already held
    /// are kept.
    pub fn preload(&self, entries: Vec<(FigureKey, SolutionFigures)>) {
        let mut map = self.lock();
        for (k, f) in entries {
            map.entry(k).or_insert(f);
        }
    }

    /// How many figures were computed (not taken from the cache) so far.
    pub fn computed(&self) -> usize {
        self.computed.lock().map_or(0, |n| *n)
    }

    fn lock(&self) -> std::sync::MutexGuard<'_, HashMap<FigureKey, SolutionFigures>> {
        self.figures.lock().unwrap_or_else(|e| e.into_inner())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn second_request_is_served_from_the_cache() {
        let airfoil = Airfoil {
            name: "t".into(),
            shape: AirfoilShape::Naca("0012".into()),
            cl_max: None,
            method: None,
            reynolds: None,
            transition_n: None,
        };
        let cache = PolarCache::new();
        let s = ViscousSettings {
            reynolds: 1e6,
            n_crit: 9.0,
            panels: 100,
        };
        let a = cache.polar(&airfoil, s, &[0.0]).unwrap();
        let b = cache.polar(&airfoil, s, &[0.0]).unwrap();
        assert!(Arc::ptr_eq(&a, &b));
        assert_eq!(cache.computed(), 1);
        let c = cache
            .polar(&airfoil, ViscousSettings { reynolds: 2e6, ..s }, &[0.0])
            .unwrap();
        assert!(!Arc::ptr_eq(&a, &c));
        assert_eq!(cache.computed(), 2);
    }
}
