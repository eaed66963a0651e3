//! What gives way on a crowded report page: the notes first, then the sink chart, each with a
//! line in the cautions box saying so in words.

use crate::caution::{Caution, Level};
use crate::finding::{Finding, PageFinding};
use crate::output::report::ReportData;

/// On a crowded page (`crowded`: the charts would be shorter than legible) what gives way:
/// the notes first (background, and `check` prints them), then the sink chart, with a line
/// saying why; `None` when nothing (more) can.
pub(super) fn make_room(data: &ReportData, crowded: bool) -> Option<ReportData> {
    if !crowded {
        return None;
    }
    let notes = data
        .cautions
        .iter()
        .filter(|c| c.level == Level::Note && !is_page_note(c.code))
        .count();
    if notes > 1 {
        return Some(without_notes(data, notes));
    }
    data.glide.is_some().then(|| without_sink_chart(data))
}

/// The page too crowded for a third chart: the two balance charts stay (the glide figures
/// stay in the key figures and in `check`), with one line saying so and why. When the notes
/// have given way already, that line says both, so the box grows by no line.
fn without_sink_chart(data: &ReportData) -> ReportData {
    let mut two = ReportData {
        glide: None,
        ..data.clone()
    };
    let notes = two.cautions.iter().find_map(|c| match c.finding {
        Finding::Page(PageFinding::NotesLeftOut { notes }) => Some(notes),
        _ => None,
    });
    two.cautions.retain(|c| c.code != "notes-left-out");
    two.cautions
        .push(Caution::of(Finding::Page(PageFinding::SinkChartLeftOut {
            notes,
        })));
    two
}

/// True for the lines about the page itself, which stay when notes give way.
fn is_page_note(code: &str) -> bool {
    code == "sink-chart-left-out" || code == "notes-left-out"
}

/// Too crowded: the `notes` notes give way (warnings, dangers and the lines about the page
/// always stay), with one line saying where to read them (it starts with the count, which
/// [`without_sink_chart`] reads back).
fn without_notes(data: &ReportData, notes: usize) -> ReportData {
    let mut lean = data.clone();
    lean.cautions
        .retain(|c| c.level != Level::Note || is_page_note(c.code));
    lean.cautions
        .push(Caution::of(Finding::Page(PageFinding::NotesLeftOut {
            notes,
        })));
    lean
}
