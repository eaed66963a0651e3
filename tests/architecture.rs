//! The architecture's invariants, checked on the source text (DEVELOPERS.md, "Invariants"):
//! the numerical core never names an edge crate or touches files, and every source file
//! starts with a `//!` line saying what it is for.

use std::path::{Path, PathBuf};

fn rust_files(dir: &Path, out: &mut Vec<PathBuf>) {
    for entry in std::fs::read_dir(dir).unwrap() {
        let path = entry.unwrap().path();
        if path.is_dir() {
            rust_files(&path, out);
        } else if path.extension().and_then(|e| e.to_str()) == Some("rs") {
            out.push(path);
        }
    }
}

fn src() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("src")
}

/// The core: everything between `input/` and `output/`.
const CORE: &[&str] = &[
    "model",
    "section",
    "planform",
    "lifting_line",
    "balance",
    "stability",
    "performance",
    "atmosphere.rs",
    "analysis.rs",
    "caution.rs",
];

#[test]
fn core_never_names_an_edge_crate_or_does_io() {
    let forbidden = [
        "comfy_table",
        "printpdf",
        "toml::",
        "clap::",
        "serde::",
        "Serialize",
        "Deserialize",
        "std::fs",
        "println!",
        "eprintln!",
    ];
    let mut files = Vec::new();
    for part in CORE {
        let p = src().join(part);
        if p.is_dir() {
            rust_files(&p, &mut files);
        } else {
            files.push(p);
        }
    }
    assert!(files.len() > 20, "core files not found");
    for f in files {
        let text = std::fs::read_to_string(&f).unwrap();
        for word in forbidden {
            assert!(
                !text.contains(word),
                "{} names `{word}`, which belongs at the edges",
                f.display()
            );
        }
    }
}

#[test]
fn every_source_file_says_what_it_is_for() {
    let mut files = Vec::new();
    rust_files(&src(), &mut files);
    for dir in ["tests", "benches"] {
        rust_files(&Path::new(env!("CARGO_MANIFEST_DIR")).join(dir), &mut files);
    }
    for f in files {
        let text = std::fs::read_to_string(&f).unwrap();
        assert!(
            text.starts_with("//!"),
            "{} does not start with a //! line",
            f.display()
        );
    }
}
