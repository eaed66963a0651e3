//! What gives way on a crowded report page: the notes first, then the sink chart, each with a
//! line in the cautions box saying so in words.

use crate::caution::{Caution, Level};
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
    let notes = two
        .cautions
        .iter()
        .find(|c| c.code == "notes-left-out")
        .and_then(|c| c.message.split(' ').next()?.parse::<usize>().ok());
    two.cautions.retain(|c| c.code != "notes-left-out");
    let message = match notes {
        Some(n) => format!(
            "The sink chart and {n} notes are left out: the page has no room for them. \
             `trimline check` prints the glide table and every note."
        ),
        None => "The sink chart is left out: the page has no room for a third chart. \
                 `trimline check` prints the glide table."
            .to_string(),
    };
    two.cautions
        .push(Caution::new(Level::Note, "sink-chart-left-out", message));
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
    lean.cautions.push(Caution::new(
        Level::Note,
        "notes-left-out",
        format!("{notes} notes are left out of this page for room; `trimline check` prints them."),
    ));
    lean
}
