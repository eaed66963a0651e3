//! Quantities with units, as builders write them: bare numbers in the default unit of the
//! field (mm, g, deg, m/s), or strings with a unit ("1.2 m", "48 in", "12.5 oz", "3 deg").
//!
//! Every quantity is converted to SI (m, kg, rad, m/s) here, at the edge; the core never sees
//! a builder's unit. Conversion factors are exact by definition (1 in = 25.4 mm,
//! 1 lb = 0.45359237 kg, 1 oz = 1/16 lb, 1 ft = 0.3048 m, 1 kn = 1852 m / 3600 s).

/// The kind of a quantity, which fixes its default unit and the units accepted.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Dimension {
    /// Lengths on the aircraft; default mm.
    Length,
    /// Altitude; default m.
    Altitude,
    /// Masses; default g.
    Mass,
    /// Angles; default degrees.
    Angle,
    /// Speeds; default m/s.
    Speed,
    /// A plain number, no unit.
    Plain,
    /// A percentage; default percent ("10" is 10 %, stored as the fraction 0.10).
    Percent,
    /// Temperature difference; default K (a difference in deg C is the same number).
    TemperatureDifference,
    /// Air density; default kg/m^3.
    Density,
}

impl Dimension {
    /// The default unit's name, for messages.
    pub fn default_unit(self) -> &'static str {
        match self {
            Dimension::Length => "mm",
            Dimension::Altitude => "m",
            Dimension::Mass => "g",
            Dimension::Angle => "deg",
            Dimension::Speed => "m/s",
            Dimension::Plain => "",
            Dimension::Percent => "%",
            Dimension::TemperatureDifference => "K",
            Dimension::Density => "kg/m^3",
        }
    }

    /// The units accepted in strings, for messages.
    pub fn accepted_units(self) -> &'static str {
        match self {
            Dimension::Length => "mm, cm, m, in, ft",
            Dimension::Altitude => "m, ft",
            Dimension::Mass => "g, kg, oz, lb",
            Dimension::Angle => "deg, rad",
            Dimension::Speed => "m/s, km/h, mph, kn",
            Dimension::Plain => "no unit",
            Dimension::Percent => "%",
            Dimension::TemperatureDifference => "K, C",
            Dimension::Density => "kg/m^3",
        }
    }

    /// Factor from the default unit to SI.
    fn default_factor(self) -> f64 {
        match self {
            Dimension::Length => 1e-3,
            Dimension::Mass => 1e-3,
            Dimension::Angle => std::f64::consts::PI / 180.0,
            Dimension::Percent => 0.01,
            _ => 1.0,
        }
    }

    /// Factor from the named unit to SI, or `None` when the unit does not fit this dimension.
    fn unit_factor(self, unit: &str) -> Option<f64> {
        let u = unit.trim().to_ascii_lowercase();
        let u = u.as_str();
        match self {
            Dimension::Altitude => match u {
                "m" => Some(1.0),
                "ft" | "feet" | "foot" => Some(0.3048),
                _ => None,
            },
            Dimension::Length => match u {
                "mm" => Some(1e-3),
                "cm" => Some(1e-2),
                "m" => Some(1.0),
                "in" | "inch" | "inches" | "\"" => Some(0.0254),
                "ft" | "feet" | "foot" | "'" => Some(0.3048),
                _ => None,
            },
            Dimension::Mass => match u {
                "g" => Some(1e-3),
                "kg" => Some(1.0),
                "oz" => Some(0.453_592_37 / 16.0),
                "lb" | "lbs" => Some(0.453_592_37),
                _ => None,
            },
            Dimension::Angle => match u {
                "deg" | "degree" | "degrees" | "\u{b0}" => Some(std::f64::consts::PI / 180.0),
                "rad" => Some(1.0),
                _ => None,
            },
            Dimension::Speed => match u {
                "m/s" => Some(1.0),
                "km/h" | "kmh" | "kph" => Some(1.0 / 3.6),
                "mph" => Some(0.447_04),
                "kn" | "kt" | "kts" | "knots" => Some(1852.0 / 3600.0),
                _ => None,
            },
            Dimension::Percent => match u {
                "%" => Some(0.01),
                _ => None,
            },
            Dimension::TemperatureDifference => match u {
                "k" | "c" | "\u{b0}c" | "degc" => Some(1.0),
                _ => None,
            },
            Dimension::Density => match u {
                "kg/m^3" | "kg/m3" | "kg/m\u{b3}" => Some(1.0),
                _ => None,
            },
            Dimension::Plain => None,
        }
    }
}

/// Convert a number written in the field's default unit to SI.
pub fn from_default_unit(value: f64, dim: Dimension) -> f64 {
    value * dim.default_factor()
}

/// Parse a string such as "1.2 m", "48in", "12.5 oz", "3 deg" or "3°" into SI.
///
/// A string with no unit is read in the default unit. The error is a sentence for the builder.
pub fn parse_quantity(text: &str, dim: Dimension) -> Result<f64, String> {
    let t = text.trim();
    if t.is_empty() {
        return Err("empty value".into());
    }
    // Split at the end of the numeric part.
    let split = t
        .char_indices()
        .find(|&(i, c)| {
            !(c.is_ascii_digit()
                || c == '.'
                || ((c == '-' || c == '+')
                    && (i == 0 || t[..i].ends_with('e') || t[..i].ends_with('E')))
                || ((c == 'e' || c == 'E')
                    && i > 0
                    && t[i + 1..]
                        .starts_with(|n: char| n.is_ascii_digit() || n == '-' || n == '+')))
        })
        .map(|(i, _)| i)
        .unwrap_or(t.len());
    let (num, unit) = t.split_at(split);
    let value: f64 = num
        .trim()
        .parse()
        .map_err(|_| format!("`{text}` does not start with a number"))?;
    if !value.is_finite() {
        return Err(format!("`{text}` is not a finite number"));
    }
    let unit = unit.trim();
    if unit.is_empty() {
        return Ok(from_default_unit(value, dim));
    }
    match dim.unit_factor(unit) {
        Some(f) => Ok(value * f),
        // "95,5": a decimal comma, not a unit.
        None if unit.starts_with(',') && unit[1..].starts_with(|c: char| c.is_ascii_digit()) => {
            Err(format!(
                "`{text}` has a decimal comma: write a decimal point (`{}.{}`)",
                num.trim(),
                &unit[1..]
            ))
        }
        None => Err(format!("unit `{unit}` is not accepted here")),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // A decimal comma (common in much of Europe) is named as such, with the number as it
    // should be written, instead of being read as a unit ",5".
    #[test]
    fn a_decimal_comma_is_named() {
        let e = parse_quantity("95,5", Dimension::Mass).unwrap_err();
        assert!(e.contains("decimal comma") && e.contains("`95.5`"), "{e}");
        let e = parse_quantity("12 furlongs", Dimension::Mass).unwrap_err();
        assert!(e.contains("unit `furlongs`"), "{e}");
    }
    use approx::assert_relative_eq;

    // Conversion factors are exact by definition (international inch, pound and knot).
    #[test]
    fn units_convert_to_si() {
        assert_relative_eq!(
            parse_quantity("48 in", Dimension::Length).unwrap(),
            1.2192,
            epsilon = 1e-12
        );
        assert_relative_eq!(
            parse_quantity("1.2 m", Dimension::Length).unwrap(),
            1.2,
            epsilon = 1e-12
        );
        assert_relative_eq!(
            parse_quantity("350", Dimension::Length).unwrap(),
            0.35,
            epsilon = 1e-12
        );
        assert_relative_eq!(
            parse_quantity("12.5 oz", Dimension::Mass).unwrap(),
            0.354_369_039_062_5,
            epsilon = 1e-12
        );
        assert_relative_eq!(
            parse_quantity("350 g", Dimension::Mass).unwrap(),
            0.35,
            epsilon = 1e-12
        );
        assert_relative_eq!(
            parse_quantity("3 deg", Dimension::Angle).unwrap(),
            3f64.to_radians(),
            epsilon = 1e-15
        );
        assert_relative_eq!(
            parse_quantity("3°", Dimension::Angle).unwrap(),
            3f64.to_radians(),
            epsilon = 1e-15
        );
        assert_relative_eq!(
            parse_quantity("-1.5e1 mm", Dimension::Length).unwrap(),
            -0.015,
            epsilon = 1e-15
        );
        assert_relative_eq!(
            parse_quantity("36 km/h", Dimension::Speed).unwrap(),
            10.0,
            epsilon = 1e-12
        );
        assert_relative_eq!(
            parse_quantity("1000 ft", Dimension::Altitude).unwrap(),
            304.8,
            epsilon = 1e-9
        );
    }

    #[test]
    fn wrong_units_and_junk_are_refused() {
        assert!(parse_quantity("3 kg", Dimension::Length).is_err());
        assert!(parse_quantity("abc", Dimension::Length).is_err());
        assert!(parse_quantity("", Dimension::Mass).is_err());
        assert!(parse_quantity("nan", Dimension::Mass).is_err());
        assert!(parse_quantity("inf m", Dimension::Length).is_err());
    }
}
