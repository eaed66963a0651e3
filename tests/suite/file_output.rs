//! Every file the commands write (report -o, compare --pdf, section --csv, new) goes through
//! one atomic, link-safe writer: a planted symbolic link or a device is refused, a failed or
//! killed write leaves the old file as it was, and a failure exits 1.
//!
//! Source of the expectations: the POSIX semantics of rename(2) (atomic replacement of the
//! directory entry) and of RLIMIT_FSIZE (a write past the limit fails with EFBIG, or the
//! process is killed by SIGXFSZ when that signal is not ignored), The Open Group Base
//! Specifications Issue 7, rename() and setrlimit(); the refusals are our own rules (issue
//! 14), no outside figure.

#![cfg(unix)]

use std::os::unix::fs::FileTypeExt as _;
use std::path::{Path, PathBuf};
use std::process::{Command, Output};

fn scratch(name: &str) -> PathBuf {
    crate::common::scratch_in("file-output-tests", name)
}

fn trimline(args: &[&str], dir: &Path) -> Output {
    crate::common::run_trimline(args, dir)
}

fn stderr(o: &Output) -> String {
    String::from_utf8_lossy(&o.stderr).into_owned()
}

/// Names in `dir` that start like our temporary files.
fn temporaries(dir: &Path) -> Vec<String> {
    std::fs::read_dir(dir)
        .unwrap()
        .map(|e| e.unwrap().file_name().to_string_lossy().into_owned())
        .filter(|n| n.starts_with(trimline::output::fs::TEMP_PREFIX))
        .collect()
}

#[test]
fn a_planted_link_is_refused_by_every_writer_and_its_target_is_untouched() {
    let dir = scratch("planted-link");
    let victim = dir.join("victim.txt");
    std::fs::write(&victim, b"precious").unwrap();
    let cases: [&[&str]; 4] = [
        &["report", "-o", "link"],
        &["compare", "--pdf", "link"],
        &["section", "naca2412", "--csv", "link"],
        &["new", "link"],
    ];
    for args in cases {
        let _ = std::fs::remove_file(dir.join("link"));
        std::os::unix::fs::symlink(&victim, dir.join("link")).unwrap();
        let out = trimline(args, &dir);
        assert_eq!(out.status.code(), Some(1), "{args:?}: {}", stderr(&out));
        assert_eq!(std::fs::read(&victim).unwrap(), b"precious", "{args:?}");
        assert!(
            std::fs::symlink_metadata(dir.join("link"))
                .unwrap()
                .file_type()
                .is_symlink(),
            "{args:?}"
        );
        assert!(temporaries(&dir).is_empty(), "{args:?}");
    }
    // Asked for, the link is followed: the file it points to gets the report, the link stays
    // (a PDF replaces only a file that is already a PDF, so the target is one here).
    std::fs::write(&victim, b"%PDF-1.3 an older report").unwrap();
    let out = trimline(&["report", "-o", "link", "--follow-link"], &dir);
    assert_eq!(out.status.code(), Some(0), "{}", stderr(&out));
    assert!(std::fs::read(&victim).unwrap().starts_with(b"%PDF-"));
    assert!(std::fs::symlink_metadata(dir.join("link"))
        .unwrap()
        .file_type()
        .is_symlink());
}

#[test]
fn a_dangling_link_is_not_created_through() {
    let dir = scratch("dangling-link");
    std::os::unix::fs::symlink(dir.join("nowhere.pdf"), dir.join("link.pdf")).unwrap();
    for args in [&["report", "-o", "link.pdf"][..], &["new", "link.pdf"][..]] {
        let out = trimline(args, &dir);
        assert_eq!(out.status.code(), Some(1), "{args:?}");
        assert!(!dir.join("nowhere.pdf").exists(), "{args:?}");
    }
}

#[test]
fn dev_null_and_dev_full_are_refused_and_stay_devices() {
    let dir = scratch("devices");
    for dev in ["/dev/null", "/dev/full"] {
        if !Path::new(dev).exists() {
            continue;
        }
        for args in [
            &["report", "-o", dev][..],
            &["compare", "--pdf", dev][..],
            &["section", "naca2412", "--csv", dev][..],
        ] {
            let out = trimline(args, &dir);
            assert_eq!(out.status.code(), Some(1), "{args:?}");
            let e = stderr(&out);
            assert!(e.contains("character device"), "{args:?}: {e}");
            assert!(e.contains("not a regular file"), "{args:?}: {e}");
            let t = std::fs::symlink_metadata(dev).unwrap().file_type();
            assert!(t.is_char_device(), "{dev} is no longer a device");
        }
    }
    // Nothing was left in /dev by a refused write.
    assert!(temporaries(Path::new("/dev")).is_empty());
}

#[test]
fn a_fifo_or_a_directory_as_output_is_refused_without_blocking() {
    let dir = scratch("fifo-out");
    let fifo = dir.join("pipe");
    let made = Command::new("mkfifo").arg(&fifo).status();
    if made.map(|s| s.success()).unwrap_or(false) {
        // Opening a FIFO for writing would block until a reader comes; the check looks at
        // the type first, so this returns at once.
        let out = trimline(&["section", "naca2412", "--csv", "pipe"], &dir);
        assert_eq!(out.status.code(), Some(1));
        assert!(stderr(&out).contains("FIFO"), "{}", stderr(&out));
    }
    std::fs::create_dir_all(dir.join("folder")).unwrap();
    let out = trimline(&["report", "-o", "folder"], &dir);
    assert_eq!(out.status.code(), Some(1));
    assert!(stderr(&out).contains("a directory"), "{}", stderr(&out));
}

/// `report -o old.pdf` under a shell with a file-size limit of a few KB (a PDF is larger).
fn report_under_size_limit(dir: &Path, ignore_signal: bool) -> Output {
    let trap = if ignore_signal { "trap '' XFSZ; " } else { "" };
    Command::new("sh")
        .arg("-c")
        .arg(format!(
            "{trap}ulimit -f 4 && exec \"$0\" report -o old.pdf"
        ))
        .arg(env!("CARGO_BIN_EXE_trimline"))
        .current_dir(dir)
        .env("SOURCE_DATE_EPOCH", "86400")
        .output()
        .expect("sh runs")
}

#[test]
fn a_failed_write_exits_1_keeps_the_old_file_and_leaves_nothing() {
    let dir = scratch("failed-write");
    std::fs::write(dir.join("old.pdf"), b"previous report").unwrap();
    let out = report_under_size_limit(&dir, true);
    assert_eq!(out.status.code(), Some(1), "{}", stderr(&out));
    assert!(stderr(&out).contains("old.pdf"), "{}", stderr(&out));
    assert_eq!(
        std::fs::read(dir.join("old.pdf")).unwrap(),
        b"previous report"
    );
    assert!(temporaries(&dir).is_empty(), "{:?}", temporaries(&dir));
}

#[test]
fn a_write_killed_midway_leaves_the_old_file_intact() {
    use std::os::unix::process::ExitStatusExt as _;
    let dir = scratch("killed-write");
    std::fs::write(dir.join("old.pdf"), b"previous report").unwrap();
    // SIGXFSZ not ignored: the kernel kills the process in the middle of writing.
    let out = report_under_size_limit(&dir, false);
    assert!(out.status.signal().is_some() || out.status.code() != Some(0));
    assert_eq!(
        std::fs::read(dir.join("old.pdf")).unwrap(),
        b"previous report"
    );
}

#[test]
fn new_never_overwrites_and_a_read_write_cycle_leaves_no_temporary() {
    let dir = scratch("new");
    let out = trimline(&["new", "plane.toml"], &dir);
    assert_eq!(out.status.code(), Some(0), "{}", stderr(&out));
    let first = std::fs::read(dir.join("plane.toml")).unwrap();
    let out = trimline(&["new", "plane.toml", "--from", "wing"], &dir);
    assert_eq!(out.status.code(), Some(1));
    assert_eq!(std::fs::read(dir.join("plane.toml")).unwrap(), first);
    assert!(temporaries(&dir).is_empty());
}

#[test]
fn an_aircraft_file_given_as_the_pdf_output_is_not_replaced() {
    // Found by a new-user trial: `compare --pdf FILE.toml` took the aircraft file as the PDF's
    // path (the option's value is optional) and replaced it with the PDF. A PDF output now
    // replaces only a file that is already a PDF; the aircraft file stays as it was, exit 1.
    let dir = tempfile::tempdir().unwrap();
    let toml = dir.path().join("k.toml");
    let text = std::fs::read_to_string("aircraft/larkspire-2000.toml").unwrap();
    std::fs::write(&toml, &text).unwrap();
    let bin = env!("CARGO_BIN_EXE_trimline");
    let out = std::process::Command::new(bin)
        .args(["compare", "--pdf"])
        .arg(&toml)
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(1));
    assert!(String::from_utf8_lossy(&out.stderr).contains("is not a PDF"));
    assert_eq!(std::fs::read_to_string(&toml).unwrap(), text);
    let out = std::process::Command::new(bin)
        .arg("report")
        .arg(&toml)
        .arg("-o")
        .arg(&toml)
        .output()
        .unwrap();
    assert_eq!(out.status.code(), Some(1));
    assert_eq!(std::fs::read_to_string(&toml).unwrap(), text);
    // An existing PDF is replaced as before.
    let pdf = dir.path().join("k.pdf");
    for _ in 0..2 {
        let out = std::process::Command::new(bin)
            .arg("report")
            .arg(&toml)
            .arg("-o")
            .arg(&pdf)
            .output()
            .unwrap();
        assert!(out.status.success());
    }
}
