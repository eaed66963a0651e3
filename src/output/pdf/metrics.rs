//! Text measurement for the PDF's built-in Helvetica faces, and word wrapping by measured width.
//!
//! printpdf has no text-measuring call for the 14 built-in fonts; their advance widths are
//! fixed and published, so we carry them here.
//!
//! # References
//! - Adobe Systems, Core 14 AFM files, `Helvetica.afm` and `Helvetica-Bold.afm` (1989-1997),
//!   `WX` advance widths in 1/1000 em for the printable ASCII range and the few WinAnsi
//!   characters used in the report (degree, plus-minus, middle dot, en dash, superscript two).

/// The two faces the report uses.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Face {
    /// Helvetica.
    Regular,
    /// Helvetica-Bold.
    Bold,
}

/// Helvetica advance widths, 1/1000 em, for ASCII 32..=126 (Adobe `Helvetica.afm`).
const REGULAR: [u16; 95] = [
    278, 278, 355, 556, 556, 889, 667, 191, 333, 333, 389, 584, 278, 333, 278,
    278, // space../
    556, 556, 556, 556, 556, 556, 556, 556, 556, 556, 278, 278, 584, 584, 584, 556, // 0..?
    1015, 667, 667, 722, 722, 667, 611, 778, 722, 278, 500, 667, 556, 833, 722, 778, // @..O
    667, 778, 722, 667, 611, 722, 667, 944, 667, 667, 611, 278, 278, 278, 469, 556, // P.._
    333, 556, 556, 500, 556, 556, 278, 556, 556, 222, 222, 500, 222, 833, 556, 556, // `..o
    556, 556, 333, 500, 278, 556, 500, 722, 500, 500, 500, 334, 260, 334, 584, // p..~
];

/// Helvetica-Bold advance widths, 1/1000 em, for ASCII 32..=126 (Adobe `Helvetica-Bold.afm`).
const BOLD: [u16; 95] = [
    278, 333, 474, 556, 556, 889, 722, 238, 333, 333, 389, 584, 278, 333, 278,
    278, // space../
    556, 556, 556, 556, 556, 556, 556, 556, 556, 556, 333, 333, 584, 584, 584, 611, // 0..?
    975, 722, 722, 722, 722, 667, 611, 778, 722, 278, 556, 722, 611, 833, 722, 778, // @..O
    667, 778, 722, 667, 611, 722, 667, 944, 667, 667, 611, 333, 278, 333, 584, 556, // P.._
    333, 556, 611, 556, 611, 556, 333, 611, 611, 278, 278, 556, 278, 889, 611, 611, // `..o
    611, 611, 389, 556, 333, 611, 556, 778, 556, 556, 500, 389, 280, 389, 584, // p..~
];

/// Width of one character, 1/1000 em. Characters outside the table are charged as an `M`
/// (833), wider than almost every glyph, so text measured too wide rather than too narrow.
fn char_width(face: Face, c: char) -> u16 {
    let code = c as u32;
    if (32..=126).contains(&code) {
        let i = (code - 32) as usize;
        return match face {
            Face::Regular => REGULAR[i],
            Face::Bold => BOLD[i],
        };
    }
    match c {
        '\u{b0}' => 400,                       // degree
        '\u{b1}' | '\u{d7}' => 584,            // plus-minus, multiplication sign
        '\u{b7}' => 278,                       // middle dot (periodcentered)
        '\u{b2}' => 333,                       // superscript two
        '\u{2013}' => 556,                     // en dash
        '\u{2014}' => 1000,                    // em dash
        '\u{2022}' => 350,                     // bullet
        '\u{e9}' | '\u{e8}' | '\u{e4}' => 556, // e acute, e grave, a diaeresis
        _ => 833,
    }
}

/// Width of `text` set in `face` at `size_pt`, in mm.
pub fn text_width_mm(text: &str, face: Face, size_pt: f64) -> f64 {
    let units: u32 = text.chars().map(|c| u32::from(char_width(face, c))).sum();
    f64::from(units) / 1000.0 * size_pt * super::MM_PER_PT
}

/// Break `text` into lines no wider than `width_mm` at word boundaries. A single word wider
/// than the line is broken between characters so nothing runs past the edge.
pub fn wrap(text: &str, face: Face, size_pt: f64, width_mm: f64) -> Vec<String> {
    let mut lines = Vec::new();
    let mut line = String::new();
    for word in text.split_whitespace() {
        let candidate = if line.is_empty() {
            word.to_string()
        } else {
            format!("{line} {word}")
        };
        if text_width_mm(&candidate, face, size_pt) <= width_mm {
            line = candidate;
            continue;
        }
        if !line.is_empty() {
            lines.push(std::mem::take(&mut line));
        }
        // The word alone: break it if it does not fit on a line of its own.
        for c in word.chars() {
            let mut next = line.clone();
            next.push(c);
            if !line.is_empty() && text_width_mm(&next, face, size_pt) > width_mm {
                lines.push(std::mem::take(&mut line));
                line.push(c);
            } else {
                line = next;
            }
        }
    }
    if !line.is_empty() {
        lines.push(line);
    }
    lines
}

/// `text` if it fits in `width_mm`; otherwise `text` with characters removed from its end
/// (`middle` false) or its middle (`middle` true, to keep both ends of a file name) and "..."
/// put in their place, so it fits.
pub fn shorten(text: &str, face: Face, size_pt: f64, width_mm: f64, middle: bool) -> String {
    if text_width_mm(text, face, size_pt) <= width_mm {
        return text.to_string();
    }
    let chars: Vec<char> = text.chars().collect();
    for keep in (0..chars.len()).rev() {
        let candidate: String = if middle {
            let head = keep.div_ceil(2);
            let tail = keep - head;
            let mut s: String = chars[..head].iter().collect();
            s.push_str("...");
            s.extend(&chars[chars.len() - tail..]);
            s
        } else {
            let mut s: String = chars[..keep].iter().collect();
            s.push_str("...");
            s
        };
        if text_width_mm(&candidate, face, size_pt) <= width_mm {
            return candidate;
        }
    }
    String::new()
}

#[cfg(test)]
mod tests {
    use super::*;
    use approx::assert_relative_eq;

    // Helvetica.afm: "0" is 556, "i" is 222, "W" is 944; 1000 units at 10 pt are 10 pt.
    #[test]
    fn widths_follow_the_afm() {
        let mm = text_width_mm("0iW", Face::Regular, 10.0);
        assert_relative_eq!(
            mm,
            (556.0 + 222.0 + 944.0) / 100.0 * 25.4 / 72.0,
            epsilon = 1e-9
        );
        assert!(text_width_mm("m", Face::Bold, 10.0) > text_width_mm("m", Face::Regular, 10.0));
    }

    #[test]
    fn shortened_text_fits_and_keeps_its_ends() {
        let name = "a-very-long-aircraft-file-name-for-the-winter-project.toml";
        let s = shorten(name, Face::Regular, 7.0, 30.0, true);
        assert!(text_width_mm(&s, Face::Regular, 7.0) <= 30.0);
        assert!(s.starts_with("a-very") && s.ends_with(".toml") && s.contains("..."));
        let e = shorten(name, Face::Bold, 7.0, 30.0, false);
        assert!(e.starts_with("a-very") && e.ends_with("..."));
        assert_eq!(shorten("short", Face::Regular, 7.0, 30.0, true), "short");
    }

    #[test]
    fn wrapped_lines_fit_and_keep_every_word() {
        let text = "The CG is 12 mm aft of the recommended band; move the battery forward \
                    or add nose weight. Averyveryverylongwordthatcannotfitonanylineatall.";
        let lines = wrap(text, Face::Regular, 8.0, 30.0);
        assert!(lines.len() > 3);
        for l in &lines {
            assert!(text_width_mm(l, Face::Regular, 8.0) <= 30.0 + 1e-9, "{l}");
        }
        let joined: String = lines
            .concat()
            .chars()
            .filter(|c| !c.is_whitespace())
            .collect();
        let original: String = text.chars().filter(|c| !c.is_whitespace()).collect();
        assert_eq!(joined, original);
    }
}
