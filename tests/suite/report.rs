//! The PDF trim report read back: one valid page, the figures of the library's own analysis
//! appear as text, the standing safety caution is printed, and a failing analysis writes no
//! file and leaves an existing one untouched.
//!
//! Expected numbers are computed here from `analysis::analyse` (the values the page must show,
//! rounded to whole millimetres and grams), never copied from a generated report.

use std::path::{Path, PathBuf};
use std::process::Command;
use trimline::analysis::{analyse, AnalysisOptions};
use trimline::input::parse_aircraft;
use trimline::model::Aircraft;
use trimline::output::cautions::SAFETY_MESSAGE;
use trimline::output::pdf::Paper;
use trimline::output::report::ReportSource;
use trimline::output::report_file::{report_pdf, write_report, ReportError};

const DEMO: &str = include_str!("../../aircraft/larkspire-2000.toml");

fn demo() -> Aircraft {
    parse_aircraft(DEMO, "larkspire-2000.toml", None).expect("the demo parses")
}

fn source() -> ReportSource {
    ReportSource {
        file_name: "larkspire-2000.toml".to_string(),
        content_hash: "0123456789abcdef".to_string(),
        date: "2026-01-02".to_string(),
    }
}

/// A fresh, empty folder for one test under Cargo's scratch directory.
fn scratch(name: &str) -> PathBuf {
    let dir = Path::new(env!("CARGO_TARGET_TMPDIR"))
        .join("report-tests")
        .join(name);
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

/// Page count and the page's text with runs of whitespace collapsed, read with lopdf.
fn read_back(bytes: &[u8]) -> (usize, String) {
    assert!(bytes.starts_with(b"%PDF-"), "no PDF header");
    let doc = lopdf::Document::load_mem(bytes).expect("lopdf reads the report");
    let pages = doc.get_pages();
    let text = doc.extract_text(&[1]).expect("text of page 1");
    (
        pages.len(),
        text.split_whitespace().collect::<Vec<_>>().join(" "),
    )
}

fn squash(s: &str) -> String {
    s.split_whitespace().collect::<Vec<_>>().join(" ")
}

#[test]
fn demo_report_is_one_page_with_the_analysis_figures() {
    let aircraft = demo();
    let a = analyse(&aircraft, &AnalysisOptions::default()).unwrap();
    let bytes = report_pdf(&aircraft, source(), Paper::A4).unwrap();
    let (pages, text) = read_back(&bytes);
    assert_eq!(pages, 1);
    let root = aircraft.wing.root_le_x_m;
    let cg_mm = (a.mass.cg_x_m - root) * 1000.0;
    let expected = [
        aircraft.name.clone(),
        format!("{cg_mm:.0} mm"),
        format!("CG {cg_mm:.0}"),
        format!(
            "Recommended {:.0} to {:.0} mm",
            (a.band.forward_x_m - root) * 1000.0,
            (a.band.aft_x_m - root) * 1000.0
        ),
        format!(
            "neutral point {:.0}",
            (a.headline.neutral_point_x_m - root) * 1000.0
        ),
        format!("{:.0} g", a.mass.total_kg * 1000.0),
        format!("{:.1} % MAC", 100.0 * a.headline.static_margin),
        format!("{:.1} m/s", a.headline.stall_speed_m_s),
        format!("{:.1} at", a.glide_figures().unwrap().best_glide_ratio),
        "0123456789abcdef".to_string(),
        "2026-01-02".to_string(),
        format!("trimline {}", env!("CARGO_PKG_VERSION")),
        "Nose up".to_string(),
    ];
    for e in &expected {
        assert!(text.contains(e.as_str()), "missing {e:?} in:\n{text}");
    }
    let t = a.headline.trim.expect("the demo trims");
    {
        assert!(text.contains(&format!("{:.1} m/s", t.speed_m_s)));
    }
    assert!(
        text.contains(&squash(SAFETY_MESSAGE)),
        "the safety caution is not printed in full"
    );
    for c in &a.cautions {
        assert!(
            text.contains(&squash(&trimline::output::cautions::message(c))),
            "caution {} missing",
            c.code
        );
    }
}

#[test]
fn every_example_aircraft_gives_one_clean_page() {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("aircraft");
    let mut n = 0;
    for entry in std::fs::read_dir(dir).unwrap() {
        let path = entry.unwrap().path();
        if path.extension().and_then(|e| e.to_str()) != Some("toml") {
            continue;
        }
        let text = std::fs::read_to_string(&path).unwrap();
        let aircraft = parse_aircraft(&text, &path.display().to_string(), path.parent()).unwrap();
        for paper in [Paper::A4, Paper::Letter] {
            let bytes = report_pdf(&aircraft, source(), paper).unwrap();
            let (pages, page_text) = read_back(&bytes);
            assert_eq!(pages, 1, "{}", path.display());
            assert!(page_text.contains(&aircraft.name));
            for bad in ["NaN", "inf ", "-inf"] {
                assert!(
                    !page_text.contains(bad),
                    "{bad} printed for {}",
                    path.display()
                );
            }
        }
        n += 1;
    }
    assert!(n >= 3, "only {n} example aircraft found");
}

#[test]
fn letter_paper_has_the_letter_media_box() {
    let bytes = report_pdf(&demo(), source(), Paper::Letter).unwrap();
    let doc = lopdf::Document::load_mem(&bytes).unwrap();
    let (_, page_id) = doc.get_pages().into_iter().next().unwrap();
    let page = doc.get_dictionary(page_id).unwrap();
    let media = page.get(b"MediaBox").unwrap().as_array().unwrap();
    let w = media[2].as_float().unwrap();
    let h = media[3].as_float().unwrap();
    // US Letter is 8.5 x 11 in = 612 x 792 pt.
    assert!(
        (w - 612.0).abs() < 0.5 && (h - 792.0).abs() < 0.5,
        "{w} x {h}"
    );
}

#[test]
fn failing_analysis_writes_nothing_and_keeps_the_old_file() {
    let mut aircraft = demo();
    for m in &mut aircraft.masses {
        m.mass_kg = 0.0;
    }
    let dir = scratch("failing-analysis");
    let old = dir.join("old.pdf");
    std::fs::write(&old, b"previous report").unwrap();
    let err = write_report(&aircraft, source(), Paper::A4, &old).unwrap_err();
    assert!(matches!(err, ReportError::Analysis(_)), "{err}");
    assert_eq!(std::fs::read(&old).unwrap(), b"previous report");
    let fresh = dir.join("fresh.pdf");
    assert!(write_report(&aircraft, source(), Paper::A4, &fresh).is_err());
    assert!(!fresh.exists());
    let names: Vec<_> = std::fs::read_dir(&dir)
        .unwrap()
        .map(|e| e.unwrap().file_name())
        .collect();
    assert_eq!(names.len(), 1, "stray files: {names:?}");
}

#[test]
fn successful_write_replaces_the_old_file_and_leaves_no_temporary() {
    let dir = scratch("replace");
    let path = dir.join("sub").join("demo.pdf");
    std::fs::create_dir_all(path.parent().unwrap()).unwrap();
    std::fs::write(&path, b"previous report").unwrap();
    write_report(&demo(), source(), Paper::A4, &path).unwrap();
    let (pages, _) = read_back(&std::fs::read(&path).unwrap());
    assert_eq!(pages, 1);
    let names: Vec<_> = std::fs::read_dir(path.parent().unwrap())
        .unwrap()
        .map(|e| e.unwrap().file_name())
        .collect();
    assert_eq!(names.len(), 1, "stray files: {names:?}");
}

fn trimline(args: &[&str], dir: &Path) -> std::process::Output {
    Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(args)
        .current_dir(dir)
        .env("SOURCE_DATE_EPOCH", "86400")
        .output()
        .expect("the binary runs")
}

#[test]
fn command_writes_the_demo_to_its_default_path() {
    let dir = scratch("cli-default");
    let out = trimline(&["report"], &dir);
    assert!(
        out.status.success(),
        "{}",
        String::from_utf8_lossy(&out.stderr)
    );
    let path = dir.join("reports").join("larkspire-2000.pdf");
    let stdout = String::from_utf8_lossy(&out.stdout);
    assert!(stdout.contains("reports/larkspire-2000.pdf"), "{stdout}");
    let (pages, text) = read_back(&std::fs::read(path).unwrap());
    assert_eq!(pages, 1);
    assert!(
        text.contains("1970-01-02"),
        "SOURCE_DATE_EPOCH date not used"
    );
    assert!(text.contains("built-in demo"));
}

#[test]
fn command_with_a_bad_file_fails_and_keeps_the_old_report() {
    let dir = scratch("cli-bad");
    let bad = dir.join("bad.toml");
    std::fs::write(
        &bad,
        DEMO.replace("name = \"Larkspire 2000\"", "nmae = \"x\""),
    )
    .unwrap();
    let out_path = dir.join("bad.pdf");
    std::fs::write(&out_path, b"previous report").unwrap();
    let out = trimline(&["report", "bad.toml", "-o", "bad.pdf", "--letter"], &dir);
    assert_eq!(out.status.code(), Some(1));
    assert_eq!(std::fs::read(&out_path).unwrap(), b"previous report");
    let names: Vec<_> = std::fs::read_dir(&dir)
        .unwrap()
        .map(|e| e.unwrap().file_name())
        .collect();
    assert_eq!(names.len(), 2, "stray files: {names:?}");
}

/// Golden file: the demo page's text as lopdf extracts it, one line per text run, compared
/// with `tests/data/report-larkspire-2000.expected`. Refresh after an intended change with
/// `UPDATE_EXPECT=1 cargo test --test report`.
#[test]
fn demo_page_text_matches_the_golden_file() {
    let bytes = report_pdf(&demo(), source(), Paper::A4).unwrap();
    let doc = lopdf::Document::load_mem(&bytes).unwrap();
    let got: String = doc
        .extract_text(&[1])
        .unwrap()
        .lines()
        .map(str::trim_end)
        .filter(|l| !l.is_empty())
        .map(|l| format!("{l}\n"))
        .collect();
    let path =
        Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/data/report-larkspire-2000.expected");
    if std::env::var_os("UPDATE_EXPECT").is_some() {
        std::fs::write(&path, &got).unwrap();
        return;
    }
    let want = std::fs::read_to_string(&path).unwrap_or_default();
    if want != got {
        let mut diff = String::new();
        for (i, (w, g)) in want.lines().zip(got.lines()).enumerate() {
            if w != g {
                diff.push_str(&format!(
                    "line {}:\n  expected: {w}\n  got:      {g}\n",
                    i + 1
                ));
            }
        }
        panic!(
            "report text differs from {} ({} expected lines, {} got):\n{diff}\
             Run with UPDATE_EXPECT=1 to accept.",
            path.display(),
            want.lines().count(),
            got.lines().count()
        );
    }
}

/// A filled polygon of the page: its fill grey and its points, pt.
type FilledPolygon = (f64, Vec<(f64, f64)>);

/// The filled polygons of page 1 with their fill grey, and the white box drawn just before
/// the text run that starts with `label` (its ground), in pt, read with lopdf.
fn polygons_and_ground_of(bytes: &[u8], label: &str) -> (Vec<FilledPolygon>, [f64; 4]) {
    let doc = lopdf::Document::load_mem(bytes).unwrap();
    let page = *doc.get_pages().get(&1).unwrap();
    let content = lopdf::content::Content::decode(&doc.get_page_content(page)).unwrap();
    let num = |o: &lopdf::Object| o.as_float().map(f64::from).unwrap_or(0.0);
    let (mut grey, mut path, mut polys) = (0.0, Vec::new(), Vec::new());
    let mut ground = None;
    for op in &content.operations {
        match op.operator.as_str() {
            "g" => grey = num(&op.operands[0]),
            "m" => path = vec![(num(&op.operands[0]), num(&op.operands[1]))],
            "l" => path.push((num(&op.operands[0]), num(&op.operands[1]))),
            "f" | "F" | "b" | "B" | "f*" | "b*" | "B*" if path.len() >= 3 => {
                polys.push((grey, std::mem::take(&mut path)));
            }
            "Tj" => {
                let bytes = op.operands[0].as_str().unwrap_or_default();
                if String::from_utf8_lossy(bytes).starts_with(label) {
                    let (_, p) = polys.last().expect("a ground before the label");
                    let xs = p.iter().map(|q| q.0);
                    let ys = p.iter().map(|q| q.1);
                    ground = Some([
                        xs.clone().fold(f64::INFINITY, f64::min),
                        ys.clone().fold(f64::INFINITY, f64::min),
                        xs.fold(f64::NEG_INFINITY, f64::max),
                        ys.fold(f64::NEG_INFINITY, f64::max),
                    ]);
                }
            }
            _ => {}
        }
    }
    (polys, ground.expect("the label was drawn"))
}

/// Even-odd rule: `p` inside the closed polygon `poly`.
fn inside(p: (f64, f64), poly: &[(f64, f64)]) -> bool {
    let n = poly.len();
    (0..n).fold(false, |odd, i| {
        let (a, b) = (poly[i], poly[(i + n - 1) % n]);
        let crosses =
            (a.1 > p.1) != (b.1 > p.1) && p.0 < a.0 + (p.1 - a.1) * (b.0 - a.0) / (b.1 - a.1);
        odd != crosses
    })
}

// The MAC label of the top view lies outside every surface outline (the wing and tail drawn
// in grey 0.95), so it covers no part of the planform (drawing practice: a label beside
// the drawing, not on it; common practice). Checked on the box's corners and centre and on
// every outline point inside the box.
#[test]
fn mac_label_lies_outside_the_planform() {
    for file in [
        "larkspire-2000.toml",
        "merrowtail-1700.toml",
        "skerrywing-900.toml",
        "wrenfield-1400.toml",
    ] {
        let text = std::fs::read_to_string(
            Path::new(env!("CARGO_MANIFEST_DIR"))
                .join("aircraft")
                .join(file),
        )
        .unwrap();
        let aircraft = parse_aircraft(&text, file, None).unwrap();
        let bytes = report_pdf(&aircraft, source(), Paper::A4).unwrap();
        let (polys, [x0, y0, x1, y1]) = polygons_and_ground_of(&bytes, "MAC ");
        let probes = [
            (x0, y0),
            (x1, y0),
            (x0, y1),
            (x1, y1),
            (0.5 * (x0 + x1), 0.5 * (y0 + y1)),
        ];
        for (grey, poly) in polys.iter().filter(|(g, _)| (g - 0.95).abs() < 1e-3) {
            assert!(
                probes.iter().all(|&p| !inside(p, poly)),
                "{file}: the MAC label covers an outline (grey {grey})"
            );
            assert!(
                poly.iter()
                    .all(|&(x, y)| !(x > x0 && x < x1 && y > y0 && y < y1)),
                "{file}: an outline runs through the MAC label"
            );
        }
    }
}

// A V-tail sailplane with flaps has a glide polar, so its page has a sink chart (docs/report.md,
// item 7). On a crowded page the notes give way before the chart; when the chart must go
// too, the page says in words that it is not drawn and why, instead of only counting notes.
#[test]
fn v_tail_report_draws_the_sink_chart_or_says_why() {
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("aircraft/merrowtail-1700.toml");
    let base = std::fs::read_to_string(&path).unwrap();
    let chart = "Sink rate against airspeed";
    let why = "notes are left out: the page has no room for them.";
    let page = |text: &str, paper: Paper| {
        let aircraft = parse_aircraft(text, "vee.toml", None).unwrap();
        assert!(aircraft.flap_settings.len() >= 2);
        read_back(&report_pdf(&aircraft, source(), paper).unwrap()).1
    };
    for paper in [Paper::A4, Paper::Letter] {
        let t = page(&base, paper);
        assert!(t.contains(chart), "{paper:?}: no sink chart in:\n{t}");
        assert!(!t.contains("The sink chart"), "{paper:?}");
    }
    // Twelve more mass items crowd the Letter page past what the notes free.
    let mut crowded = base.clone();
    for k in 0..12 {
        crowded.push_str(&format!(
            "\n[[mass]]\nname = \"extra {k}\"\nmass = 1\nx = 60\n"
        ));
    }
    let t = page(&crowded, Paper::Letter);
    assert!(!t.contains(chart), "expected a crowded page:\n{t}");
    assert!(
        t.contains("The sink chart and "),
        "no reason given in:\n{t}"
    );
    assert!(t.contains(why), "no reason given in:\n{t}");
}
