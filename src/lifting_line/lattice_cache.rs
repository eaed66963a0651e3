//! Condensed lattices computed once: a cache keyed by the exact bits of everything
//! [`lattice::condense`] reads (every station's geometry, the mirror map, the chordwise panel
//! count, the wake direction and the core radii).
//!
//! Building and condensing the vortex lattice is most of the cost of making a wing system;
//! two systems with the same geometry (the same file checked again, another CG or mass case)
//! share one. The cache does no I/O: a store at the edges may hand it a [`LatticeLoader`]
//! that looks for a lattice kept by an earlier run, and may write out the ones this run
//! computed ([`LatticeCache::computed_entries`]). A lattice read back is the same numbers, so a
//! system built on it is the same system.

use std::collections::HashMap;
use std::sync::{Arc, Mutex, OnceLock};

use nalgebra::DMatrix;

use super::lattice::{self, Condensed, Cores};
use super::multi_surface::Station;
use super::vortex::Vec3;
use super::LiftingLineError;

/// What a condensed lattice depends on, as exact bits (see the module doc).
#[derive(Debug, Clone, PartialEq, Eq, Hash)]
pub struct LatticeKey(pub Vec<u64>);

/// A condensed lattice, as plain numbers (column-major `n x n` matrices).
#[derive(Debug, Clone, PartialEq)]
pub struct CondensedLattice {
    /// Stations.
    pub n: usize,
    /// Effective induced-angle matrix, column-major.
    pub induced: Vec<f64>,
    /// x-moment offsets of the strips' lift, m, column-major.
    pub lift_x_offset: Vec<f64>,
}

impl CondensedLattice {
    fn of(c: &Condensed) -> CondensedLattice {
        CondensedLattice {
            n: c.induced.nrows(),
            induced: c.induced.as_slice().to_vec(),
            lift_x_offset: c.lift_x_offset.as_slice().to_vec(),
        }
    }

    /// The matrices; `None` when the sizes do not agree with `n`.
    fn condensed(&self) -> Option<Condensed> {
        let n = self.n;
        if self.induced.len() != n * n || self.lift_x_offset.len() != n * n {
            return None;
        }
        Some(Condensed {
            induced: DMatrix::from_column_slice(n, n, &self.induced),
            lift_x_offset: DMatrix::from_column_slice(n, n, &self.lift_x_offset),
        })
    }
}

/// Looks for a lattice kept by an earlier run (must give back only one stored under exactly
/// this key).
pub type LatticeLoader = Box<dyn Fn(&LatticeKey) -> Option<CondensedLattice> + Send + Sync>;

/// A cache of condensed lattices (thread-safe, shared by reference).
#[derive(Default)]
pub struct LatticeCache {
    lattices: Mutex<HashMap<LatticeKey, Arc<CondensedLattice>>>,
    computed: Mutex<Vec<LatticeKey>>,
    loader: OnceLock<LatticeLoader>,
}

impl std::fmt::Debug for LatticeCache {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("LatticeCache")
            .field("held", &self.lock().len())
            .finish_non_exhaustive()
    }
}

impl LatticeCache {
    /// The cache shared by every caller in this process (one command run).
    pub fn shared() -> &'static LatticeCache {
        static SHARED: OnceLock<LatticeCache> = OnceLock::new();
        SHARED.get_or_init(LatticeCache::default)
    }

    /// Give the cache a loader for lattices kept by earlier runs (the first one given stays).
    pub fn set_loader(&self, loader: LatticeLoader) {
        let _ = self.loader.set(loader);
    }

    /// The lattices this cache computed (not found held or by the loader), with their keys.
    pub fn computed_entries(&self) -> Vec<(LatticeKey, Arc<CondensedLattice>)> {
        let keys = self.computed.lock().map(|k| k.clone()).unwrap_or_default();
        let map = self.lock();
        keys.into_iter()
            .filter_map(|k| map.get(&k).map(|c| (k.clone(), c.clone())))
            .collect()
    }

    /// [`lattice::condense`] of these inputs, from the cache (or the loader) when held.
    /// Errors are not cached.
    pub(crate) fn condense(
        &self,
        stations: &[Station],
        mirror: &[usize],
        n_c: usize,
        wake: &Vec3,
        cores: Cores,
    ) -> Result<Condensed, LiftingLineError> {
        let key = key_of(stations, mirror, n_c, wake, cores);
        let held = self.lock().get(&key).cloned();
        let found = held.or_else(|| {
            let loaded = Arc::new(self.loader.get()?(&key)?);
            self.lock().insert(key.clone(), loaded.clone());
            Some(loaded)
        });
        if let Some(c) = found.and_then(|c| c.condensed()) {
            return Ok(c);
        }
        let c = lattice::condense(stations, mirror, n_c, wake, cores)?;
        self.lock()
            .insert(key.clone(), Arc::new(CondensedLattice::of(&c)));
        if let Ok(mut k) = self.computed.lock() {
            k.push(key);
        }
        Ok(c)
    }

    fn lock(&self) -> std::sync::MutexGuard<'_, HashMap<LatticeKey, Arc<CondensedLattice>>> {
        self.lattices.lock().unwrap_or_else(|e| e.into_inner())
    }
}

/// The key of a lattice: every number of every station but its section model (which the
/// lattice does not read), then the mirror map, the panel count, the wake and the cores.
fn key_of(
    stations: &[Station],
    mirror: &[usize],
    n_c: usize,
    wake: &Vec3,
    cores: Cores,
) -> LatticeKey {
    let mut k: Vec<u64> = vec![stations.len() as u64, n_c as u64];
    let v3 = |k: &mut Vec<u64>, v: &Vec3| k.extend(v.iter().map(|x| x.to_bits()));
    for st in stations {
        // Every field by name, so that a new one must be placed here or left out knowingly.
        let Station {
            surface,
            s_m,
            y_m,
            x_m,
            z_m,
            chord_m,
            dy_m,
            width_m,
            geometric_angle_rad,
            normal_z,
            percent_semispan,
            section: _,
            control_share,
            node_a,
            node_b,
            control,
            normal,
            le_a,
            le_b,
            chord_a_m,
            chord_b_m,
            control_t,
        } = st;
        k.push(*surface as u64);
        k.extend(
            [
                s_m,
                y_m,
                x_m,
                z_m,
                chord_m,
                dy_m,
                width_m,
                geometric_angle_rad,
                normal_z,
                percent_semispan,
                control_share,
                chord_a_m,
                chord_b_m,
                control_t,
            ]
            .iter()
            .map(|x| x.to_bits()),
        );
        for v in [node_a, node_b, control, normal, le_a, le_b] {
            v3(&mut k, v);
        }
    }
    k.extend(mirror.iter().map(|&m| m as u64));
    v3(&mut k, wake);
    k.push(cores.self_fraction.to_bits());
    k.push(cores.wake_fraction.to_bits());
    LatticeKey(k)
}
