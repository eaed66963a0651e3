//! The accepted range of every value of an aircraft file ([`Bounds`], in the field's default
//! unit) and the wording of a refusal: the range, the units a string may carry, a hint at a
//! unit slip or a missing unit. The ranges are common practice (see each one's comment).

use super::*;

/// An accepted interval, in the field's default unit (mm, g, deg, ...).
#[derive(Clone, Copy)]
pub(super) struct Bounds {
    pub(super) min: f64,
    pub(super) min_inclusive: bool,
    pub(super) max: f64,
    pub(super) max_inclusive: bool,
}

impl Bounds {
    pub(super) const fn closed(min: f64, max: f64) -> Self {
        Bounds {
            min,
            min_inclusive: true,
            max,
            max_inclusive: true,
        }
    }
    pub(super) const fn positive(max: f64) -> Self {
        Bounds {
            min: 0.0,
            min_inclusive: false,
            max,
            max_inclusive: true,
        }
    }
    pub(super) fn contains(&self, v: f64) -> bool {
        let lo = if self.min_inclusive {
            v >= self.min
        } else {
            v > self.min
        };
        let hi = if self.max_inclusive {
            v <= self.max
        } else {
            v < self.max
        };
        lo && hi
    }
    pub(super) fn describe(&self, dim: Dimension) -> String {
        let unit = dim.default_unit();
        let sep = if unit.is_empty() || unit == "%" {
            ""
        } else {
            " "
        };
        let lo = if self.min_inclusive { "" } else { "more than " };
        let hi = if self.max_inclusive { "" } else { "less than " };
        format!(
            "{lo}{}{sep}{unit} to {hi}{}{sep}{unit}",
            fmt_num(self.min),
            fmt_num(self.max)
        )
    }
}

pub(super) fn fmt_num(v: f64) -> String {
    if v.fract().abs() < 1e-12 && v.abs() < 1e15 {
        format!("{}", v as i64)
    } else {
        format!("{v}")
    }
}

// Accepted ranges, in the default units (mm, g, deg, percent). Chosen to cover models and
// small full-size aircraft while catching slips such as metres typed for millimetres.
// Where they come from (common practice, from memory, no single published table): the
// largest sailplanes span about 30 m, so 30 000 mm of span (per panel) and positions within
// 50 m of the datum cover every light aircraft; the smallest flying models (indoor, micro)
// have chords of a few cm, so 5 mm is a floor that still catches "0.2" typed for metres;
// 1 000 000 g (1 t) per mass item covers a light aircraft's heaviest item; sweep beyond
// 60 deg, dihedral beyond 45 deg and twist or incidence beyond 15 deg are outside what a
// lifting line means anything for. Values possible but unusual get a caution instead
// (`crate::plausibility`), and the wing loading is checked below (`MAX_WING_LOADING_KG_M2`).
pub(super) const POSITION_MM: Bounds = Bounds::closed(-50_000.0, 50_000.0);
pub(super) const SPAN_MM: Bounds = Bounds::closed(5.0, 30_000.0);
pub(super) const CHORD_MM: Bounds = Bounds::closed(5.0, 10_000.0);
pub(super) const TIP_CHORD_MM: Bounds = Bounds::closed(0.0, 10_000.0);
pub(super) const SWEEP_DEG: Bounds = Bounds::closed(-60.0, 60.0);
pub(super) const DIHEDRAL_DEG: Bounds = Bounds::closed(-45.0, 45.0);
/// A stabiliser may be a V-tail: up to 60 deg each side (V-tails of sailplanes and models lie
/// between about 30 and 50 deg; common practice).
pub(super) const STABILISER_DIHEDRAL_DEG: Bounds = Bounds::closed(-60.0, 60.0);
pub(super) const TWIST_DEG: Bounds = Bounds::closed(-15.0, 15.0);
pub(super) const INCIDENCE_DEG: Bounds = Bounds::closed(-15.0, 15.0);
pub(super) const MASS_G: Bounds = Bounds::closed(0.0, 1_000_000.0);
pub(super) const BALLAST_MAX_G: Bounds = Bounds::positive(1_000_000.0);
pub(super) const CL_MAX: Bounds = Bounds::closed(0.3, 3.0);
// The viscous section method's accepted ranges (src/section/viscous.rs).
pub(super) const REYNOLDS: Bounds = Bounds::closed(1e4, 1e7);
pub(super) const TRANSITION_N: Bounds = Bounds::closed(1.0, 14.0);
// Joukowski and Karman-Trefftz sections: what the circle-map shape solution accepts (less than
// 40 % and 15 %), and no thinner than it is checked for (0.1 %; thinner is a sheet).
pub(super) const THICKNESS_PCT: Bounds = Bounds {
    min: 100.0 * crate::section::circle_map::MIN_RELIABLE_THICKNESS_RATIO,
    min_inclusive: true,
    max: 100.0 * crate::section::circle_map::MAX_THICKNESS_RATIO,
    max_inclusive: false,
};
pub(super) const CAMBER_PCT: Bounds = Bounds {
    min: 0.0,
    min_inclusive: true,
    max: 100.0 * crate::section::circle_map::MAX_CAMBER_RATIO,
    max_inclusive: false,
};
pub(super) const TE_ANGLE_DEG: Bounds = Bounds::closed(0.0, 30.0);
pub(super) const ELEVATOR_PCT: Bounds = Bounds {
    min: 0.0,
    min_inclusive: true,
    max: 100.0,
    max_inclusive: false,
};
pub(super) const ELEVATOR_THROW_DEG: Bounds = Bounds::closed(0.0, 45.0);
/// Tail efficiency: 0.5 (deep in a wake) to 1.2 (in a propeller's slipstream).
pub(super) const DYNAMIC_PRESSURE_RATIO: Bounds = Bounds::closed(0.5, 1.2);
pub(super) const ELEVON_CHORD_PCT: Bounds = Bounds {
    min: 0.0,
    min_inclusive: false,
    max: 100.0,
    max_inclusive: false,
};
pub(super) const SEMISPAN_PCT: Bounds = Bounds::closed(0.0, 100.0);
// Static margins, % of MAC: 0 to 40 covers every stable model and light aircraft (common
// practice: 5 to 20 % with a tail, 3 to 10 % tailless; 40 % is far forward of any usual
// forward limit, where the elevator runs out of authority at low speed). Below 0 the aircraft is unstable: accepted only with
// `limits.negative_margin_intended = true`, down to -20 %, and then a danger caution.
pub(super) const MARGIN_PCT: Bounds = Bounds::closed(0.0, 40.0);
pub(super) const MARGIN_INTENDED_PCT: Bounds = Bounds::closed(-20.0, 40.0);
pub(super) const SPEED_M_S: Bounds = Bounds::positive(150.0);
pub(super) const ALTITUDE_M: Bounds = Bounds::closed(-500.0, 11_000.0);
pub(super) const TEMP_OFFSET_K: Bounds = Bounds::closed(-60.0, 60.0);
pub(super) const DENSITY: Bounds = Bounds::closed(0.3, 1.5);
pub(super) const FUSELAGE_MM: Bounds = Bounds::positive(30_000.0);
/// The builder's tolerance of one weighed mass (one standard deviation), g: 0 (sure) to
/// 10 kg, the most a light aircraft's item could be in doubt (common practice: a kitchen
/// scale reads to 1 g, a platform scale to 0.1 kg).
pub(super) const MASS_TOLERANCE_G: Bounds = Bounds::closed(0.0, 10_000.0);
/// The builder's tolerance of one position (one standard deviation), mm: 0 to 1000 mm; a
/// doubt of a metre is no longer a tolerance (common practice).
pub(super) const POSITION_TOLERANCE_MM: Bounds = Bounds::closed(0.0, 1_000.0);
/// Fin height, mm: as a span (5 mm to 30 m).
pub(super) const FIN_HEIGHT_MM: Bounds = SPAN_MM;
/// Surfaces overlapping in the top view closer than this many chords (vertically) intersect.
pub(super) const INTERSECTING_GAP_CHORDS: f64 = 0.1;
/// Strips per half-span of the wing (four times the default; the lifting line's own limit is
/// higher).
pub(super) const STRIPS: Bounds = Bounds::closed(4.0, 100.0);
/// Chordwise lattice panels per strip.
pub(super) const CHORDWISE: Bounds = Bounds::closed(1.0, 20.0);
/// Lattice panels on each half of the wing that the file may ask for (four times the
/// default's 144): with the tail's share the worst accepted file still finishes `check` in
/// about a second on a laptop core.
pub(super) const MAX_WING_HALF_PANELS: usize = 600;

/// "; did you mean 2 m?" when a bare number out of range would be in range in the unit a
/// thousand times larger (metres typed for millimetres, kilograms for grams).
pub(super) fn unit_slip_hint(v: f64, dim: Dimension, bounds: Bounds) -> String {
    let bigger = match dim {
        Dimension::Length => "m",
        Dimension::Mass => "kg",
        _ => return String::new(),
    };
    if v > 0.0 && bounds.contains(1000.0 * v) {
        format!(
            "; did you mean {} {bigger}? A bare number is in {}",
            fmt_num_short(v),
            dim.default_unit()
        )
    } else {
        String::new()
    }
}

/// For a quoted number without a unit (`"0.15"`), which is read in the default unit: a hint
/// that the unit is missing, naming the units accepted; empty for any other text.
pub(super) fn missing_unit_hint(text: &str, dim: Dimension) -> String {
    let t = text.trim();
    if matches!(dim, Dimension::Plain) || t.parse::<f64>().is_err() {
        return String::new();
    }
    format!(
        "; \"{t}\" has no unit, so it is read in {}: write the unit inside the quotes, one \
         of {} (e.g. \"{}\")",
        dim.default_unit(),
        dim.accepted_units(),
        example_for(dim)
    )
}

/// For a length or mass written with a unit that is out of range (`"2000 m"` for a chord,
/// `"2 mm"` for a span): "; did you mean "2000 mm"?" when the same number would be in range
/// in the default unit (mm, g) or in the unit a thousand times larger (m, kg). A quoted bare
/// number gets [`missing_unit_hint`] instead; other text gets nothing.
pub(super) fn unit_in_text_hint(text: &str, dim: Dimension, bounds: Bounds) -> String {
    let missing = missing_unit_hint(text, dim);
    if !missing.is_empty() {
        return missing;
    }
    let bigger = match dim {
        Dimension::Length => "m",
        Dimension::Mass => "kg",
        _ => return String::new(),
    };
    let t = text.trim();
    let number_end = t
        .find(|c: char| !(c.is_ascii_digit() || matches!(c, '.' | '-' | '+' | 'e' | 'E')))
        .unwrap_or(t.len());
    let Ok(n) = t[..number_end].trim().parse::<f64>() else {
        return String::new();
    };
    let written_unit = t[number_end..].trim();
    let suggest = if bounds.contains(n) && written_unit != dim.default_unit() {
        Some(dim.default_unit())
    } else if n > 0.0 && bounds.contains(1000.0 * n) && written_unit != bigger {
        Some(bigger)
    } else {
        None
    };
    match suggest {
        Some(unit) => format!("; did you mean \"{} {unit}\"?", fmt_num_short(n)),
        None => String::new(),
    }
}

/// "one of: a, b, c" for the accepted names of an error message.
pub(super) fn one_of<S: AsRef<str>>(names: &[S]) -> String {
    format!("one of: {}", crate::printable::name_list(names))
}

/// What a quantity accepts: its range in the default unit, and the units a string may carry.
pub(super) fn accepted_quantity(dim: Dimension, bounds: Bounds) -> String {
    let units = if matches!(dim, Dimension::Plain) {
        " (a bare number)".to_string()
    } else {
        format!(
            "; or a string with a unit ({}), e.g. \"{}\"",
            dim.accepted_units(),
            example_for(dim)
        )
    };
    format!("{}{units}", bounds.describe(dim))
}

/// " in every [[mass]] entry", " in [fuselage]", " in the karman_trefftz table" for a missing
/// key's message, from its table's path (`mass[2]`, `fuselage`, `airfoils.a.karman_trefftz`).
pub(super) fn in_table(table: &str) -> String {
    match table.rsplit_once('[') {
        Some((array, _)) => format!(" in every [[{array}]] entry"),
        None => match table.rsplit_once('.') {
            Some((_, last)) if matches!(last, "joukowski" | "karman_trefftz") => {
                format!(" in `{last} = {{ ... }}`")
            }
            _ => format!(" in [{table}]"),
        },
    }
}

pub(super) fn example_for(dim: Dimension) -> &'static str {
    match dim {
        Dimension::Length => "48 in",
        Dimension::Altitude => "1500 ft",
        Dimension::Mass => "12.5 oz",
        Dimension::Angle => "0.05 rad",
        Dimension::Speed => "36 km/h",
        Dimension::Percent => "10 %",
        Dimension::TemperatureDifference => "5 K",
        Dimension::Density => "1.1 kg/m^3",
        Dimension::Plain => "",
    }
}

/// A value for a message: up to 4 decimals, `-0` shown as `0`, and very large or very small
/// magnitudes in exponent form (`1.000e300`), so a message never runs to hundreds of digits.
pub(super) fn fmt_num_short(v: f64) -> String {
    let v = v + 0.0;
    if v != 0.0 && !(1e-4..1e9).contains(&v.abs()) {
        return format!("{v:.3e}");
    }
    let s = format!("{v:.4}");
    let s = s.trim_end_matches('0').trim_end_matches('.');
    s.to_string()
}
