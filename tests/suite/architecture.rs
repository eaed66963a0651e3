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
    "numeric",
    "balance",
    "stability",
    "performance",
    "atmosphere.rs",
    "analysis",
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

/// Every caution code the library can raise: the codes that `src/finding/` gives its findings
/// (each string after a `=>` there, such as `Foo { .. } => "static-margin-low",`).
fn caution_codes() -> Vec<String> {
    let mut files = Vec::new();
    rust_files(&src().join("finding"), &mut files);
    let mut codes = Vec::new();
    for f in files {
        let text = std::fs::read_to_string(&f).unwrap();
        let body = text.split("#[cfg(test)]").next().unwrap_or("");
        for part in body.split("=>").skip(1) {
            let Some(rest) = part.trim_start().strip_prefix('"') else {
                continue;
            };
            let code: String = rest.chars().take_while(|&c| c != '"').collect();
            if code.chars().all(|c| c.is_ascii_lowercase() || c == '-') && !code.is_empty() {
                codes.push(code);
            }
        }
    }
    assert!(
        codes.len() > 40,
        "caution codes not found in the source ({})",
        codes.len()
    );
    codes
}

fn cautions_doc() -> String {
    std::fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join("docs/cautions.md")).unwrap()
}

// docs/cautions.md explains every caution code the library can raise: each must appear there
// in backticks.
#[test]
fn every_caution_code_is_documented() {
    let doc = cautions_doc();
    let missing: Vec<String> = caution_codes()
        .into_iter()
        .filter(|code| !doc.contains(&format!("`{code}`")))
        .collect();
    assert!(
        missing.is_empty(),
        "caution codes missing from docs/cautions.md: {missing:?}"
    );
}

// The summary table of docs/cautions.md has a row for every code, not only the sections
// further down.
#[test]
fn every_caution_code_has_a_summary_row() {
    let doc = cautions_doc();
    let start = doc.find("## Summary").expect("a summary");
    let len = doc[start + 1..].find("\n## ").expect("a section after it");
    let summary = &doc[start..start + 1 + len];
    let mut missing: Vec<String> = caution_codes()
        .into_iter()
        .filter(|code| !summary.contains(&format!("\n| `{code}` |")))
        .collect();
    missing.dedup();
    assert!(
        missing.is_empty(),
        "caution codes missing from the summary of docs/cautions.md: {missing:?}"
    );
}
