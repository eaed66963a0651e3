//! The one way trimline writes a file (reports, comparison pages, CSV tables, new aircraft
//! files): atomically and without following planted links.
//!
//! 1. The target is looked at without following links (`symlink_metadata`). Anything that
//!    is not a regular file (a directory, a device such as `/dev/null`, a FIFO, a socket) is
//!    refused, so the tool never replaces a device node or blocks on a pipe. A symbolic link
//!    is refused unless the caller asks for it ([`WriteOptions::follow_link`]); then the
//!    file the link points to is the target, and it must be a regular file too.
//! 2. The bytes go to a temporary file created exclusively (`O_EXCL`) in the target's own
//!    folder, with an unpredictable name (the `tempfile` crate): nobody can plant a link or
//!    a file under that name beforehand. It is flushed to the disk (`fsync`).
//! 3. The temporary file is renamed over the target (or linked to it without replacing
//!    anything, for [`Replace::Never`]), and the folder is flushed. A reader sees the old
//!    file or the new one, never a part of either.
//!
//! Any failure (no room, a read-only folder, a file-size limit) is an error naming the
//! target, and the temporary file is removed; the old file is unchanged. A process killed
//! with SIGKILL between steps 2 and 3 leaves the old file intact and may leave one
//! temporary file `.trimline-*.tmp` in the folder (nothing can remove it; its name says
//! what it is).

use std::io::Write as _;
use std::path::{Path, PathBuf};
use thiserror::Error;

/// Prefix of the temporary files, so a stray one (after SIGKILL) can be recognised.
pub const TEMP_PREFIX: &str = ".trimline-";

/// Whether an existing file may be replaced.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Replace {
    /// Replace an existing regular file (reports, CSV tables).
    IfRegularFile,
    /// Never replace anything (`trimline new`).
    Never,
}

/// How to write one file.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct WriteOptions {
    /// Write through a symbolic link at the target to the file it points to (refused
    /// otherwise). Set by the command-line option `--follow-link`.
    pub follow_link: bool,
    /// Whether an existing file may be replaced.
    pub replace: Replace,
    /// Create missing folders above the target.
    pub create_folders: bool,
    /// Replace an existing file only if it starts with these bytes (e.g. `%PDF-` for a PDF
    /// the tool wrote before): an aircraft file given by mistake as the output is refused.
    pub replace_only_if_starts_with: Option<&'static [u8]>,
}

impl Default for WriteOptions {
    fn default() -> Self {
        WriteOptions {
            follow_link: false,
            replace: Replace::IfRegularFile,
            create_folders: true,
            replace_only_if_starts_with: None,
        }
    }
}

/// Why a file was not written. In every case nothing at the target was changed.
#[derive(Debug, Error)]
pub enum WriteError {
    /// The target is a symbolic link and the caller did not ask to follow it.
    #[error(
        "{path} is a symbolic link (to {target}); not written. Give the real file's path, or \
         add --follow-link to write to the file the link points to"
    )]
    SymbolicLink {
        /// Target as given.
        path: PathBuf,
        /// Where the link points, as stored in it.
        target: PathBuf,
    },
    /// The target exists and is not a regular file.
    #[error("{path} is {kind}, not a regular file; not written (accepted: a regular file or a new file name)")]
    NotRegularFile {
        /// Target (after following a link, when asked).
        path: PathBuf,
        /// "a directory", "a character device", ...
        kind: &'static str,
    },
    /// The target exists and [`Replace::Never`] was asked for.
    #[error("{path} already exists; not written (accepted: a name that is not taken)")]
    Exists {
        /// Target.
        path: PathBuf,
    },
    /// The target exists and does not look like the kind of file being written.
    #[error(
        "{path} exists and is not {what}; not replaced (is it an input file given as the \
         output?). Accepted: a new file name, or an existing file that is {what}"
    )]
    WrongKind {
        /// Target.
        path: PathBuf,
        /// "a PDF", ...
        what: &'static str,
    },
    /// An I/O step failed; the temporary file was removed.
    #[error("cannot write {path}: {action} failed: {source}")]
    Io {
        /// Target.
        path: PathBuf,
        /// Which step: "creating the folder", "creating a temporary file", "writing", ...
        action: &'static str,
        /// The operating system's error.
        #[source]
        source: std::io::Error,
    },
}

/// Where to write when `path` is given: the path itself, or the file a link there points to
/// (when allowed); checks that whatever is there is a regular file. Returns the real target
/// and its metadata when it exists.
fn resolve(
    path: &Path,
    options: &WriteOptions,
) -> Result<(PathBuf, Option<std::fs::Metadata>), WriteError> {
    let io = |action, source| WriteError::Io {
        path: path.to_path_buf(),
        action,
        source,
    };
    let meta = match std::fs::symlink_metadata(path) {
        Ok(m) => m,
        Err(e) if e.kind() == std::io::ErrorKind::NotFound => {
            return Ok((path.to_path_buf(), None))
        }
        Err(e) => return Err(io("looking at the target", e)),
    };
    if meta.file_type().is_symlink() {
        let target = std::fs::read_link(path).unwrap_or_default();
        if !options.follow_link || options.replace == Replace::Never {
            return Err(WriteError::SymbolicLink {
                path: path.to_path_buf(),
                target,
            });
        }
        // The link's final target; it must exist (a dangling link is not followed).
        let real = std::fs::canonicalize(path).map_err(|e| io("following the link", e))?;
        let real_meta = std::fs::metadata(&real).map_err(|e| io("following the link", e))?;
        if !real_meta.is_file() {
            return Err(WriteError::NotRegularFile {
                path: real,
                kind: crate::input::file::kind_of(&real_meta),
            });
        }
        return Ok((real, Some(real_meta)));
    }
    if !meta.is_file() {
        return Err(WriteError::NotRegularFile {
            path: path.to_path_buf(),
            kind: crate::input::file::kind_of(&meta),
        });
    }
    if options.replace == Replace::Never {
        return Err(WriteError::Exists {
            path: path.to_path_buf(),
        });
    }
    Ok((path.to_path_buf(), Some(meta)))
}

/// Write `bytes` to `path` as described in the module documentation.
pub fn write_file(path: &Path, bytes: &[u8], options: &WriteOptions) -> Result<(), WriteError> {
    let io = |action, source| WriteError::Io {
        path: path.to_path_buf(),
        action,
        source,
    };
    if path.file_name().is_none() {
        return Err(WriteError::NotRegularFile {
            path: path.to_path_buf(),
            kind: "a folder name",
        });
    }
    let (target, existing) = resolve(path, options)?;
    if let (Some(magic), Some(_)) = (options.replace_only_if_starts_with, existing.as_ref()) {
        use std::io::Read as _;
        let mut head = vec![0u8; magic.len()];
        let starts = std::fs::File::open(&target)
            .and_then(|mut f| f.read_exact(&mut head))
            .is_ok()
            && head == magic;
        if !starts {
            return Err(WriteError::WrongKind {
                path: path.to_path_buf(),
                what: if magic == b"%PDF-" {
                    "a PDF"
                } else {
                    "a CSV file this command wrote"
                },
            });
        }
    }
    let dir = match target.parent() {
        Some(p) if !p.as_os_str().is_empty() => p.to_path_buf(),
        _ => PathBuf::from("."),
    };
    if options.create_folders {
        std::fs::create_dir_all(&dir).map_err(|e| io("creating the folder", e))?;
    }
    let mut builder = tempfile::Builder::new();
    builder.prefix(TEMP_PREFIX).suffix(".tmp");
    #[cfg(unix)]
    {
        use std::os::unix::fs::PermissionsExt as _;
        // A replaced file keeps its permissions; a new one gets the usual 0666 less umask.
        let mode = existing
            .as_ref()
            .map_or(0o666, |m| m.permissions().mode() & 0o7777);
        builder.permissions(std::fs::Permissions::from_mode(mode));
    }
    #[cfg(not(unix))]
    let _ = &existing;
    // Dropping `tmp` on any early return removes the temporary file.
    let mut tmp = builder
        .tempfile_in(&dir)
        .map_err(|e| io("creating a temporary file", e))?;
    tmp.write_all(bytes).map_err(|e| io("writing", e))?;
    tmp.flush().map_err(|e| io("writing", e))?;
    tmp.as_file()
        .sync_all()
        .map_err(|e| io("flushing to disk", e))?;
    match options.replace {
        Replace::IfRegularFile => {
            tmp.persist(&target)
                .map_err(|e| io("renaming into place", e.error))?;
        }
        Replace::Never => {
            tmp.persist_noclobber(&target).map_err(|e| {
                if e.error.kind() == std::io::ErrorKind::AlreadyExists {
                    WriteError::Exists {
                        path: path.to_path_buf(),
                    }
                } else {
                    io("linking into place", e.error)
                }
            })?;
        }
    }
    // Make the rename itself durable; a folder that cannot be opened or flushed (some
    // file systems) does not undo a write that has already happened.
    if let Ok(d) = std::fs::File::open(&dir) {
        let _ = d.sync_all();
    }
    Ok(())
}

#[cfg(test)]
mod tests {
    use super::*;

    fn scratch(name: &str) -> PathBuf {
        let dir = std::env::temp_dir().join(format!("trimline-fs-{name}-{}", std::process::id()));
        let _ = std::fs::remove_dir_all(&dir);
        std::fs::create_dir_all(&dir).unwrap();
        dir
    }

    fn leftovers(dir: &Path) -> Vec<String> {
        std::fs::read_dir(dir)
            .unwrap()
            .filter_map(|e| e.ok())
            .map(|e| e.file_name().to_string_lossy().into_owned())
            .filter(|n| n.starts_with(TEMP_PREFIX))
            .collect()
    }

    #[test]
    fn writes_replaces_and_leaves_no_temporary_file() {
        let dir = scratch("replace");
        let p = dir.join("a.txt");
        write_file(&p, b"one", &WriteOptions::default()).unwrap();
        write_file(&p, b"two", &WriteOptions::default()).unwrap();
        assert_eq!(std::fs::read(&p).unwrap(), b"two");
        assert!(leftovers(&dir).is_empty());
        let never = WriteOptions {
            replace: Replace::Never,
            ..WriteOptions::default()
        };
        assert!(matches!(
            write_file(&p, b"three", &never),
            Err(WriteError::Exists { .. })
        ));
        assert_eq!(std::fs::read(&p).unwrap(), b"two");
        let _ = std::fs::remove_dir_all(&dir);
    }

    #[cfg(unix)]
    #[test]
    fn links_are_refused_unless_asked_and_then_the_link_stays() {
        let dir = scratch("link");
        let real = dir.join("real.txt");
        std::fs::write(&real, b"old").unwrap();
        let link = dir.join("link.txt");
        std::os::unix::fs::symlink(&real, &link).unwrap();
        let e = write_file(&link, b"new", &WriteOptions::default()).unwrap_err();
        assert!(matches!(e, WriteError::SymbolicLink { .. }), "{e}");
        assert!(e.to_string().contains("--follow-link"), "{e}");
        assert_eq!(std::fs::read(&real).unwrap(), b"old");
        let follow = WriteOptions {
            follow_link: true,
            ..WriteOptions::default()
        };
        write_file(&link, b"new", &follow).unwrap();
        assert_eq!(std::fs::read(&real).unwrap(), b"new");
        assert!(std::fs::symlink_metadata(&link)
            .unwrap()
            .file_type()
            .is_symlink());
        let _ = std::fs::remove_dir_all(&dir);
    }

    #[test]
    fn a_directory_is_not_a_file() {
        let dir = scratch("dir");
        let e = write_file(&dir, b"x", &WriteOptions::default()).unwrap_err();
        assert!(e.to_string().contains("a directory"), "{e}");
        let _ = std::fs::remove_dir_all(&dir);
    }
}
