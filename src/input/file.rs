//! The one way trimline reads an input file (aircraft files, coordinate files): regular files
//! only (or `-` for standard input), a size limit stated in the error, UTF-8 checked with the
//! byte offset of the first bad byte.
//!
//! The file's type is looked at before it is opened, so a FIFO (which would block in `open`
//! until a writer comes) or a device such as `/dev/zero` (endless) is refused at once; the
//! file is then read through a bounded `take`, so even a file that grows while it is read, or
//! standard input, never costs more memory than the limit.

use super::error::{InputError, Location};
use std::io::Read as _;
use std::path::Path;

/// Largest aircraft file accepted, bytes (1 MB: the largest example is about 6 KB; a file
/// with every list at its count limit stays well below this).
pub const MAX_AIRCRAFT_FILE_BYTES: u64 = 1_000_000;
/// Largest coordinates file accepted, bytes (1 MB: a 10,000-point file is about 250 KB).
pub const MAX_COORDINATES_FILE_BYTES: u64 = 1_000_000;

/// What is being read, for messages ("aircraft file", "coordinates file") and its limit.
#[derive(Debug, Clone, Copy)]
pub struct FileKind {
    /// Words for the file in messages, with the article ("an aircraft file").
    pub what: &'static str,
    /// Largest size accepted, bytes.
    pub max_bytes: u64,
}

/// An aircraft file (TOML).
pub const AIRCRAFT_FILE: FileKind = FileKind {
    what: "an aircraft file",
    max_bytes: MAX_AIRCRAFT_FILE_BYTES,
};
/// An airfoil coordinates file.
pub const COORDINATES_FILE: FileKind = FileKind {
    what: "a coordinates file",
    max_bytes: MAX_COORDINATES_FILE_BYTES,
};

/// The name standard input goes by in messages.
pub const STDIN_NAME: &str = "<standard input>";

/// "1 MB" or "250000 bytes".
fn describe_bytes(n: u64) -> String {
    if n % 1_000_000 == 0 {
        format!("{} MB", n / 1_000_000)
    } else {
        format!("{n} bytes")
    }
}

fn whole_file(file: &str) -> Location {
    Location {
        file: file.to_string(),
        line: 0,
        column: 0,
    }
}

/// What kind of file system object `meta` describes, for messages such as "... is a
/// character device, not a regular file" (reading here, writing in `output/fs.rs`).
pub(crate) fn kind_of(meta: &std::fs::Metadata) -> &'static str {
    let t = meta.file_type();
    if t.is_dir() {
        return "a directory";
    }
    if t.is_symlink() {
        return "a symbolic link";
    }
    #[cfg(unix)]
    {
        use std::os::unix::fs::FileTypeExt as _;
        if t.is_char_device() {
            return "a character device";
        }
        if t.is_block_device() {
            return "a block device";
        }
        if t.is_fifo() {
            return "a named pipe (FIFO)";
        }
        if t.is_socket() {
            return "a socket";
        }
    }
    if t.is_file() {
        "a regular file"
    } else {
        "a special file"
    }
}

/// Read the file at `path` (`-`: standard input) as text, or an [`InputError`] naming it
/// (field `file`) with the limit or the position of the problem.
pub fn read_input_file(path: &Path, kind: FileKind) -> Result<String, InputError> {
    if path.as_os_str() == "-" {
        return read_limited(std::io::stdin().lock(), STDIN_NAME, kind);
    }
    let name = path.display().to_string();
    let refuse = |problem: String, accepted: String| {
        InputError::new(whole_file(&name), "file", problem, Some(accepted))
    };
    let accepted_kind = || {
        format!(
            "{} that is a regular file of at most {}, or - for standard input",
            kind.what,
            describe_bytes(kind.max_bytes)
        )
    };
    // Follows links: a link to a regular file is fine to read.
    let meta = std::fs::metadata(path)
        .map_err(|e| refuse(format!("cannot be read: {e}"), accepted_kind()))?;
    if !meta.is_file() {
        return Err(refuse(
            format!("is {}, not a regular file; not read", kind_of(&meta)),
            accepted_kind(),
        ));
    }
    if meta.len() > kind.max_bytes {
        return Err(refuse(
            format!(
                "is {} bytes long, more than the limit of {} for {}",
                meta.len(),
                describe_bytes(kind.max_bytes),
                kind.what
            ),
            accepted_kind(),
        ));
    }
    let file = std::fs::File::open(path)
        .map_err(|e| refuse(format!("cannot be read: {e}"), accepted_kind()))?;
    // The file opened is checked again, in case something else was put at the path
    // between the look and the open.
    match file.metadata() {
        Ok(m) if m.is_file() => {}
        Ok(m) => {
            return Err(refuse(
                format!("is {}, not a regular file; not read", kind_of(&m)),
                accepted_kind(),
            ))
        }
        Err(e) => return Err(refuse(format!("cannot be read: {e}"), accepted_kind())),
    }
    read_limited(file, &name, kind)
}

/// Read at most `kind.max_bytes` (one more to tell that there is more), then check UTF-8.
fn read_limited(
    reader: impl std::io::Read,
    name: &str,
    kind: FileKind,
) -> Result<String, InputError> {
    let mut bytes = Vec::new();
    reader
        .take(kind.max_bytes + 1)
        .read_to_end(&mut bytes)
        .map_err(|e| {
            InputError::new(
                whole_file(name),
                "file",
                format!("cannot be read: {e}"),
                None,
            )
        })?;
    if bytes.len() as u64 > kind.max_bytes {
        return Err(InputError::new(
            whole_file(name),
            "file",
            format!(
                "is longer than the limit of {} for {}; reading stopped there",
                describe_bytes(kind.max_bytes),
                kind.what
            ),
            Some(format!("at most {}", describe_bytes(kind.max_bytes))),
        ));
    }
    String::from_utf8(bytes).map_err(|e| {
        let good = e.utf8_error().valid_up_to();
        let text = String::from_utf8_lossy(&e.as_bytes()[..good]);
        let line = text.matches('\n').count() + 1;
        let column = text.rsplit('\n').next().map_or(0, |l| l.chars().count()) + 1;
        let byte = e.as_bytes()[good];
        InputError::new(
            Location {
                file: name.to_string(),
                line,
                column,
            },
            "file",
            format!(
                "is not UTF-8 text: byte {good} (0x{byte:02x}) does not begin or continue a \
                 UTF-8 character"
            ),
            Some(format!(
                "{} saved as UTF-8 (plain ASCII is UTF-8)",
                kind.what
            )),
        )
    })
}

#[cfg(test)]
mod tests {
    use super::*;

    const SMALL: FileKind = FileKind {
        what: "a test file",
        max_bytes: 8,
    };

    #[test]
    fn limits_and_utf8_are_checked_in_memory() {
        assert_eq!(read_limited(&b"ab\ncd"[..], "t", SMALL).unwrap(), "ab\ncd");
        let e = read_limited(&b"123456789"[..], "t", SMALL).unwrap_err();
        assert!(e.to_string().contains("8 bytes"), "{e}");
        let e = read_limited(&b"ab\nc\xffd"[..], "t", SMALL).unwrap_err();
        assert_eq!((e.location.line, e.location.column), (2, 2));
        assert!(e.to_string().contains("byte 4 (0xff)"), "{e}");
    }

    #[test]
    fn devices_and_folders_are_refused_before_opening() {
        if Path::new("/dev/zero").exists() {
            let e = read_input_file(Path::new("/dev/zero"), AIRCRAFT_FILE).unwrap_err();
            assert!(e.to_string().contains("character device"), "{e}");
            assert!(e.to_string().contains("1 MB"), "{e}");
        }
        let e = read_input_file(&std::env::temp_dir(), AIRCRAFT_FILE).unwrap_err();
        assert!(e.to_string().contains("a directory"), "{e}");
    }
}
