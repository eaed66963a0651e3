//! The printed trim report as PDF: the only module that knows printpdf.
//!
//! - [`metrics`]: Helvetica advance widths, text measurement and wrapping;
//! - [`canvas`]: our drawing layer on printpdf operations (pens, dashes, polygons, hatching,
//!   markers, aligned text), in mm from the page's bottom-left corner;
//! - [`chart`]: axes with nice ticks, clipped series, bands and legends;
//! - [`charts`]: the spanwise-lift and trim-speed charts, fed with plain data;
//! - [`planform`]: the to-scale top view with the balance marks;
//! - [`trim_page`]: the one-page layout;
//! - [`compare_page`]: the one-page comparison of setups.
//!
//! Text uses the PDF's built-in Helvetica (WinAnsi: degree sign, superscript two and
//! plus-minus are available; Greek letters are spelled out), so nothing is embedded, files
//! stay small and every figure can be read back as text.

pub mod canvas;
pub mod chart;
pub mod charts;
pub mod compare_page;
pub mod metrics;
pub mod planform;
pub mod trim_page;

use crate::output::report::ReportData;
use printpdf::{Mm, PdfDocument, PdfPage, PdfSaveOptions};

/// Millimetres per PostScript point (25.4 / 72).
pub const MM_PER_PT: f64 = 25.4 / 72.0;

/// Paper size.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Paper {
    /// ISO A4, 210 x 297 mm.
    #[default]
    A4,
    /// US Letter, 8.5 x 11 in (215.9 x 279.4 mm).
    Letter,
}

impl Paper {
    /// Width and height, mm, portrait.
    pub fn size_mm(self) -> (f64, f64) {
        match self {
            Paper::A4 => (210.0, 297.0),
            Paper::Letter => (215.9, 279.4),
        }
    }
}

/// A one-page PDF document holding `pages` (each a finished canvas), as bytes.
fn document(title: &str, pages: Vec<canvas::Canvas>, paper: Paper) -> Vec<u8> {
    let (w, h) = paper.size_mm();
    let mut doc = PdfDocument::new(title);
    let pages = pages
        .into_iter()
        .map(|c| PdfPage::new(Mm(w as f32), Mm(h as f32), c.into_ops()))
        .collect();
    doc.with_pages(pages);
    let mut warnings = Vec::new();
    doc.save(&PdfSaveOptions::default(), &mut warnings)
}

/// The trim report for `data` as PDF bytes: exactly one page of `paper`.
pub fn trim_report(data: &ReportData, paper: Paper) -> Vec<u8> {
    let page = trim_page::draw(data, paper);
    document(&format!("{}: trim report", data.name), vec![page], paper)
}

/// The comparison of setups as PDF bytes: exactly one page of `paper`.
pub fn comparison_report(data: &compare_page::CompareData, paper: Paper) -> Vec<u8> {
    let page = compare_page::draw(data, paper);
    document("trimline: setup comparison", vec![page], paper)
}
