//! The words of every caution: the sentence, units and rounding of each [`Finding`]. The
//! analysis finds, this module says.

use crate::caution::Caution;
use crate::finding::{Control, Finding, PageFinding};

mod balance;
mod glide;
mod inputs;
mod model;

/// The standing safety caution carried by every analysis and report.
pub const SAFETY_MESSAGE: &str = "These figures are estimates from a simplified aerodynamic model. \
They do not replace the designer's stated balance point, a careful hand-glide or first-flight test, \
or the safety code of your model-flying association. For a full-size aircraft, the flight manual, \
the weighing report and licensed airworthiness practice always take precedence.";

/// The sentence the builder reads for `c`.
pub fn message(c: &Caution) -> String {
    match &c.finding {
        Finding::SafetyEstimateOnly => SAFETY_MESSAGE.to_string(),
        Finding::Balance(f) => balance::message(f),
        Finding::Input(f) => inputs::message(f),
        Finding::Page(PageFinding::NotesLeftOut { notes }) => {
            format!(
                "{notes} notes are left out of this page for room; `trimline check` prints them."
            )
        }
        Finding::Page(PageFinding::SinkChartLeftOut { notes: Some(n) }) => format!(
            "The sink chart and {n} notes are left out: the page has no room for them. \
             `trimline check` prints the glide table and every note."
        ),
        Finding::Page(PageFinding::SinkChartLeftOut { notes: None }) => {
            "The sink chart is left out: the page has no room for a third chart. \
             `trimline check` prints the glide table."
                .to_string()
        }
        Finding::Model(f) => model::message(f),
        Finding::Glide(f) => glide::message(f),
    }
}

/// The pitch control's name ("full up elevator").
fn control_name(c: Control) -> &'static str {
    match c {
        Control::Elevons => "elevons",
        Control::Elevator | Control::CanardElevator | Control::Reflex => "elevator",
    }
}

/// What gives nose-up pitch, in the builder's words.
pub fn nose_up_control(c: Control) -> &'static str {
    match c {
        Control::CanardElevator => "nose-up canard elevator (trailing edge down)",
        Control::Elevator => "up elevator",
        Control::Elevons => "up elevon",
        Control::Reflex => "nose-up trim (reflex)",
    }
}

/// A Reynolds number as a builder reads it: three significant figures with thousands
/// separators (105,416 becomes "105,000"; 45,123 becomes "45,100"); the figures behind it are
/// not known better than that (common practice).
pub fn reynolds_text(re: f64) -> String {
    if !re.is_finite() || re <= 0.0 {
        return "0".to_string();
    }
    let magnitude = re.log10().floor() as i32;
    let scale = 10f64.powi((magnitude - 2).max(0));
    let rounded = ((re / scale).round() * scale) as u64;
    let digits = rounded.to_string();
    let mut out = String::new();
    for (i, ch) in digits.chars().enumerate() {
        if i > 0 && (digits.len() - i) % 3 == 0 {
            out.push(',');
        }
        out.push(ch);
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn reynolds_numbers_read_to_three_figures() {
        assert_eq!(reynolds_text(105_416.0), "105,000");
        assert_eq!(reynolds_text(138_456.0), "138,000");
        assert_eq!(reynolds_text(45_123.0), "45,100");
        assert_eq!(reynolds_text(1_234_567.0), "1,230,000");
        assert_eq!(reynolds_text(987.0), "987");
        assert_eq!(reynolds_text(f64::NAN), "0");
    }
}
