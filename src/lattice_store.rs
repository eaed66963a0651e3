//! Condensed vortex lattices kept between runs, one binary file each in the store folder of
//! [`crate::polar_store`] (`lattice-<build>-<hash of the key>.bin`), so that a second `check`
//! of the same aircraft does not build and condense its lattice again.
//!
//! A file holds its lattice's whole key and its numbers as the little-endian bits of each
//! u64 and f64: a lattice is handed back only under exactly its key (a hash collision in the
//! name only costs a recomputation) and reads back exactly as it was computed. Files of other
//! builds are removed when this build writes; at most [`MAX_LATTICES`] are kept (the newest).
//! A file that cannot be read or does not decode is ignored.

use std::hash::{Hash, Hasher};
use std::path::{Path, PathBuf};

use crate::lifting_line::lattice_cache::{CondensedLattice, LatticeCache, LatticeKey};

/// First bytes of a lattice file.
const MAGIC: &[u8] = b"trimline lattice 1\n";
/// Most lattice files of one build kept in the folder.
pub const MAX_LATTICES: usize = 64;
/// Largest station count read back (a lattice file larger than this is not ours).
const MAX_STATIONS: usize = 4000;

/// The file of `key` in `dir` for the build `stamp`.
fn file_of(dir: &Path, stamp: &str, key: &LatticeKey) -> PathBuf {
    let mut h = std::collections::hash_map::DefaultHasher::new();
    key.hash(&mut h);
    dir.join(format!("lattice-{stamp}-{:016x}.bin", h.finish()))
}

/// Let `cache` look for lattices kept in `dir` by earlier runs of this build.
pub fn install(dir: &Path, cache: &LatticeCache) {
    let Some(stamp) = crate::polar_store::build_stamp() else {
        return;
    };
    let dir = dir.to_path_buf();
    cache.set_loader(Box::new(move |key| {
        let bytes = std::fs::read(file_of(&dir, &stamp, key)).ok()?;
        decode(&bytes, key)
    }));
}

/// Write the lattices `cache` computed in this run to `dir`, then remove the files of other
/// builds and all but the newest [`MAX_LATTICES`] of this one.
pub fn save_computed(
    dir: &Path,
    cache: &LatticeCache,
) -> Result<(), crate::output::fs::WriteError> {
    let entries = cache.computed_entries();
    if entries.is_empty() {
        return Ok(());
    }
    let Some(stamp) = crate::polar_store::build_stamp() else {
        return Ok(());
    };
    let _ = std::fs::create_dir_all(dir);
    for (key, lattice) in &entries {
        crate::output::fs::write_file(
            &file_of(dir, &stamp, key),
            &encode(key, lattice),
            &Default::default(),
        )?;
    }
    prune(dir, &format!("lattice-{stamp}-"));
    Ok(())
}

/// Remove lattice files not starting with `own` and the oldest beyond [`MAX_LATTICES`].
fn prune(dir: &Path, own: &str) {
    let Ok(list) = std::fs::read_dir(dir) else {
        return;
    };
    let mut mine = Vec::new();
    for e in list.flatten() {
        let name = e.file_name().to_string_lossy().into_owned();
        if !(name.starts_with("lattice-") && name.ends_with(".bin")) {
            continue;
        }
        if name.starts_with(own) {
            let t = e.metadata().and_then(|m| m.modified()).ok();
            mine.push((t, e.path()));
        } else {
            let _ = std::fs::remove_file(e.path());
        }
    }
    mine.sort_by_key(|e| std::cmp::Reverse(e.0));
    for (_, p) in mine.into_iter().skip(MAX_LATTICES) {
        let _ = std::fs::remove_file(p);
    }
}

/// The bytes of a lattice file.
fn encode(key: &LatticeKey, c: &CondensedLattice) -> Vec<u8> {
    let mut out = MAGIC.to_vec();
    out.reserve(8 * (2 + key.0.len() + 2 * c.induced.len()));
    out.extend((key.0.len() as u64).to_le_bytes());
    for w in &key.0 {
        out.extend(w.to_le_bytes());
    }
    out.extend((c.n as u64).to_le_bytes());
    for v in c.induced.iter().chain(&c.lift_x_offset) {
        out.extend(v.to_bits().to_le_bytes());
    }
    out
}

/// The lattice of a file's bytes when they hold exactly `key`; `None` otherwise.
fn decode(bytes: &[u8], key: &LatticeKey) -> Option<CondensedLattice> {
    let body = bytes.strip_prefix(MAGIC)?;
    if body.len() % 8 != 0 {
        return None;
    }
    let mut words = body
        .chunks_exact(8)
        .map(|c| u64::from_le_bytes(c.try_into().unwrap_or([0; 8])));
    let k = usize::try_from(words.next()?).ok()?;
    if k != key.0.len() || !key.0.iter().all(|w| words.next() == Some(*w)) {
        return None;
    }
    let n = usize::try_from(words.next()?).ok()?;
    if n > MAX_STATIONS || words.len() != 2 * n * n {
        return None;
    }
    let induced: Vec<f64> = words.by_ref().take(n * n).map(f64::from_bits).collect();
    let lift_x_offset: Vec<f64> = words.map(f64::from_bits).collect();
    Some(CondensedLattice {
        n,
        induced,
        lift_x_offset,
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a_file_reads_back_only_under_its_own_key() {
        let key = LatticeKey(vec![3, 1, 4, 1, 5]);
        let c = CondensedLattice {
            n: 2,
            induced: vec![1.0, -2.5, 0.1, 7.0],
            lift_x_offset: vec![0.0, -0.0, 1e-300, 3.0],
        };
        let bytes = encode(&key, &c);
        let back = decode(&bytes, &key).unwrap();
        assert_eq!(back, c);
        assert!(back.lift_x_offset[1].is_sign_negative());
        assert_eq!(decode(&bytes, &LatticeKey(vec![3, 1, 4, 1, 6])), None);
        assert_eq!(decode(&bytes[..bytes.len() - 8], &key), None);
        assert_eq!(decode(b"nonsense", &key), None);
    }
}
