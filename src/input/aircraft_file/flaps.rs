//! `[[wing.flap]]` and `[[flap_setting]]`: the wing's camber flaps and the named settings
//! that deflect them.

use super::{fmt_num, one_of, Bounds, ControlSpan, Ctx};
use crate::input::error::InputError;
use crate::input::raw;
use crate::input::units::Dimension;
use crate::model::{FlapSetting, PitchControl, WingFlap};
use toml::Spanned;

/// Flap deflection accepted, deg (trailing edge down positive): Glauert's linear theory is
/// used, which holds to about 15-20 deg of a plain flap (Abbott & von Doenhoff, Theory of Wing
/// Sections, sec. 8.5, from memory); camber settings of sailplanes lie within -10 to +15 deg
/// (common practice).
const FLAP_DEFLECTION_DEG: Bounds = Bounds::closed(-15.0, 20.0);
/// Most flaps and most settings in a file.
const MAX_FLAPS: usize = 6;
const MAX_SETTINGS: usize = 8;
/// Longest name, characters.
const MAX_NAME_CHARS: usize = 40;

impl Ctx<'_> {
    fn flap_name(
        &self,
        name: Option<&Spanned<String>>,
        table_span: &std::ops::Range<usize>,
        field: &str,
    ) -> Result<String, InputError> {
        let Some(n) = name else {
            return Err(self.err(
                table_span,
                field,
                "a name is needed",
                Some(format!("a name of 1 to {MAX_NAME_CHARS} characters")),
            ));
        };
        let text = n.get_ref().trim();
        if text.is_empty()
            || text.chars().count() > MAX_NAME_CHARS
            || text.chars().any(char::is_control)
        {
            return Err(self.err(
                &n.span(),
                field,
                "the name is empty, too long or has control characters",
                Some(format!(
                    "a name of 1 to {MAX_NAME_CHARS} printable characters"
                )),
            ));
        }
        Ok(text.to_string())
    }

    /// The wing's camber flaps; they may not overlap each other nor the elevons.
    pub(super) fn wing_flaps(
        &self,
        raw: &[Spanned<raw::RawFlap>],
        elevons: Option<&PitchControl>,
    ) -> Result<Vec<WingFlap>, InputError> {
        if let Some(extra) = raw.get(MAX_FLAPS) {
            return Err(self.err(
                &extra.span(),
                "wing.flap",
                format!("more than {MAX_FLAPS} flaps"),
                Some(format!("at most {MAX_FLAPS} [[wing.flap]] tables")),
            ));
        }
        let mut out: Vec<WingFlap> = Vec::with_capacity(raw.len());
        for f in raw {
            let span = f.span();
            let r = f.get_ref();
            let path = "wing.flap";
            let name = self.flap_name(r.name.as_ref(), &span, "wing.flap.name")?;
            if out.iter().any(|o| o.name == name) {
                return Err(self.err(
                    &span,
                    "wing.flap.name",
                    format!("a second flap named '{name}'"),
                    Some("a name no other flap has".into()),
                ));
            }
            let ControlSpan {
                chord_fraction,
                inboard_fraction: inboard,
                outboard_fraction: outboard,
            } = self.control_span(
                (r.chord.as_ref(), r.inboard.as_ref(), r.outboard.as_ref()),
                &span,
                path,
            )?;
            let overlaps = |a: f64, b: f64| inboard < b - 1e-9 && a < outboard - 1e-9;
            let clash = out
                .iter()
                .find(|o| overlaps(o.inboard_fraction, o.outboard_fraction))
                .map(|o| format!("flap '{}'", o.name))
                .or_else(|| {
                    elevons
                        .filter(|e| overlaps(e.inboard_fraction, e.outboard_fraction))
                        .map(|_| "the elevons".to_string())
                });
            if let Some(other) = clash {
                return Err(self.err(
                    &span,
                    "wing.flap.inboard",
                    format!(
                        "this flap ({} to {} % of the semispan) overlaps {other}",
                        fmt_num(100.0 * inboard),
                        fmt_num(100.0 * outboard)
                    ),
                    Some("a span range no other trailing-edge surface covers".into()),
                ));
            }
            out.push(WingFlap {
                name,
                chord_fraction,
                inboard_fraction: inboard,
                outboard_fraction: outboard,
            });
        }
        Ok(out)
    }

    /// The named flap settings; each names flaps of `[[wing.flap]]` with a deflection.
    pub(super) fn flap_settings(
        &self,
        raw: &[Spanned<raw::RawFlapSetting>],
        flaps: &[WingFlap],
    ) -> Result<Vec<FlapSetting>, InputError> {
        if let Some(extra) = raw.get(MAX_SETTINGS) {
            return Err(self.err(
                &extra.span(),
                "flap_setting",
                format!("more than {MAX_SETTINGS} flap settings"),
                Some(format!("at most {MAX_SETTINGS} [[flap_setting]] tables")),
            ));
        }
        let names: Vec<&str> = flaps.iter().map(|f| f.name.as_str()).collect();
        let mut out: Vec<FlapSetting> = Vec::with_capacity(raw.len());
        for s in raw {
            let span = s.span();
            let r = s.get_ref();
            let name = self.flap_name(r.name.as_ref(), &span, "flap_setting.name")?;
            if out.iter().any(|o| o.name == name) {
                return Err(self.err(
                    &span,
                    "flap_setting.name",
                    format!("a second flap setting named '{name}'"),
                    Some("a name no other setting has".into()),
                ));
            }
            if flaps.is_empty() {
                return Err(self.err(
                    &span,
                    "flap_setting",
                    "a flap setting needs the wing's flaps, and the wing has none",
                    Some("[[wing.flap]] tables with name, chord, inboard and outboard".into()),
                ));
            }
            let mut deflections = Vec::with_capacity(r.deflect.len());
            for (flap, q) in &r.deflect {
                let Some(i) = names.iter().position(|n| n == flap) else {
                    return Err(self.err(
                        &q.span(),
                        &format!("flap_setting.deflect.{}", crate::printable::token(flap)),
                        format!("no flap named '{}'", crate::printable::token(flap)),
                        Some(one_of(&names)),
                    ));
                };
                let d = self.quantity(
                    q,
                    &format!("flap_setting.deflect.{flap}"),
                    Dimension::Angle,
                    FLAP_DEFLECTION_DEG,
                )?;
                deflections.push((i, d));
            }
            out.push(FlapSetting { name, deflections });
        }
        Ok(out)
    }
}
