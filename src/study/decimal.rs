//! Axis values as the builder wrote them: a value built as `start + i * step` or converted
//! from mm, g or degrees carries binary round-off (0.30000000000000004, 0.5740000000000001);
//! rounding it to the decimals written gives the number the builder meant, and it prints
//! that way.

/// Most decimals an axis value is rounded to; beyond this an f64 holds no exact decimal of
/// the usual magnitudes and the value is left as it is.
pub const MAX_DECIMALS: u32 = 15;

/// The decimals of a number as written (`"0.05"`: 2, `"60"`: 0, `"2.5e-2"`: 3, `"1e3"`: 0),
/// or `None` when the text is not a plain decimal number.
pub fn decimals_written(text: &str) -> Option<u32> {
    let t = text.trim();
    let (mantissa, exponent) = match t.find(['e', 'E']) {
        Some(i) => (&t[..i], t[i + 1..].parse::<i32>().ok()?),
        None => (t, 0),
    };
    let mantissa = mantissa.trim_start_matches(['+', '-']);
    let fraction = match mantissa.split_once('.') {
        Some((whole, frac)) => {
            if !(whole.chars().all(|c| c.is_ascii_digit())
                && frac.chars().all(|c| c.is_ascii_digit()))
            {
                return None;
            }
            frac.len()
        }
        None if mantissa.chars().all(|c| c.is_ascii_digit()) && !mantissa.is_empty() => 0,
        None => return None,
    };
    let d = i64::try_from(fraction).ok()? - i64::from(exponent);
    u32::try_from(d.max(0)).ok()
}

/// `x` rounded to `decimals` decimals: the f64 nearest the decimal number, so that it prints
/// as written. Left as it is when `decimals` exceeds [`MAX_DECIMALS`] or `x` is too large for
/// the scaled value to be a whole number held exactly.
pub fn round_to_decimals(x: f64, decimals: u32) -> f64 {
    if !x.is_finite() || decimals > MAX_DECIMALS {
        return x;
    }
    // 10^decimals is exact in an f64 for decimals <= 22.
    let scale = 10f64.powi(decimals as i32);
    let scaled = (x * scale).round();
    if scaled.abs() >= 2f64.powi(53) {
        return x;
    }
    // An exact whole number over an exact power of ten: one correctly rounded division.
    let r = scaled / scale;
    if r == 0.0 {
        0.0
    } else {
        r
    }
}

/// `x` without the round-off of a unit conversion: the nearest number of 12 significant
/// figures when `x` lies within a few units in the last place of it (a degree value that went
/// to radians and back), else `x` unchanged.
pub fn without_noise(x: f64) -> f64 {
    if !x.is_finite() || x == 0.0 {
        return x;
    }
    let Ok(short) = format!("{x:.11e}").parse::<f64>() else {
        return x;
    };
    if (short - x).abs() <= 8.0 * f64::EPSILON * x.abs() {
        short
    } else {
        x
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    // Binary fractions: 0.1 has no exact f64, so 0.1 + 0.2 is 0.30000000000000004 (IEEE 754
    // double arithmetic, common practice); rounding to the decimal written gives 0.3 back.
    #[test]
    fn values_as_written() {
        assert_eq!(decimals_written("0.05"), Some(2));
        assert_eq!(decimals_written("60"), Some(0));
        assert_eq!(decimals_written("-2.5e-2"), Some(3));
        assert_eq!(decimals_written("1.5e3"), Some(0));
        assert_eq!(decimals_written("abc"), None);
        assert_eq!(round_to_decimals(0.1 + 0.2, 1).to_string(), "0.3");
        assert_eq!(round_to_decimals(574.0 / 1000.0, 3).to_string(), "0.574");
        assert_eq!(
            without_noise(0.3f64.to_radians().to_degrees()).to_string(),
            "0.3"
        );
        // A value with more figures than 12 is not touched.
        let pi = std::f64::consts::PI;
        assert_eq!(without_noise(pi).to_bits(), pi.to_bits());
    }
}
