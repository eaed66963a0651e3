//! Second stage of reading an aircraft file: check every value and build the
//! [`crate::model::Aircraft`], or return an [`InputError`] naming file, line, column, key and
//! the accepted range.

use super::error::{InputError, Location};
use super::limits::*;
use super::raw::{self, Quantity, RawAircraft, RawEllipse, RawPanel, RawSurface};
use super::units::{parse_quantity, Dimension};
use crate::model::{
    Air, Aircraft, Airfoil, AirfoilId, AirfoilShape, BallastBay, Change, EllipticShape, Fin,
    Fuselage, ItemTolerance, MarginLimits, MassItem, Numerics, Panel, PitchControl, SectionMethod,
    Setup, Stabiliser, StabiliserRole, Surface, SurfaceShape, Targets, Tolerances, WeighingSupport,
    WingModel,
};
use crate::printable::{printable, token};
use crate::section::registry;
use std::collections::BTreeMap;
use std::ops::Range;
use std::path::{Path, PathBuf};
use toml::Spanned;

/// A trailing-edge control's chord and span range, fractions (of the local chord and of the
/// semispan).
struct ControlSpan {
    chord_fraction: f64,
    inboard_fraction: f64,
    outboard_fraction: f64,
}

mod airfoils;
mod bounds;
mod flaps;
mod masses;
mod settings;
mod setups;
mod surfaces;

use bounds::*;

/// Smallest recommended static margin when the file gives none, fraction of MAC
/// (common practice for models with a tail: 5 %).
pub const DEFAULT_MIN_STATIC_MARGIN_TAIL: f64 = 0.05;
/// Largest recommended static margin with a tail, fraction of MAC (common practice: 20 %).
pub const DEFAULT_MAX_STATIC_MARGIN_TAIL: f64 = 0.20;
/// Smallest recommended static margin for tailless aircraft (common practice: 3 %).
pub const DEFAULT_MIN_STATIC_MARGIN_TAILLESS: f64 = 0.03;
/// Largest recommended static margin for tailless aircraft (common practice: 10 %).
pub const DEFAULT_MAX_STATIC_MARGIN_TAILLESS: f64 = 0.10;
/// Smallest recommended static margin for canards (common practice: 5 %).
pub const DEFAULT_MIN_STATIC_MARGIN_CANARD: f64 = 0.05;
/// Largest recommended static margin for canards (common practice: 15 %).
pub const DEFAULT_MAX_STATIC_MARGIN_CANARD: f64 = 0.15;
/// Default greatest elevator deflection each way, deg (common practice for models).
pub const DEFAULT_ELEVATOR_THROW_DEG: f64 = 15.0;
/// Largest wing loading accepted, kg/m^2. Models fly at about 2 to 15 kg/m^2 (thermal
/// gliders 2 to 4, sport models 4 to 10, jets up to about 15) and light aircraft at about 40
/// to 150 kg/m^2 (a four-seat tourer about 70) (from memory: common values in model and
/// light-aircraft design practice); past 400 kg/m^2 the stall speed leaves this tool's
/// speed range, so such a file is almost certainly a unit slip.
pub const MAX_WING_LOADING_KG_M2: f64 = 400.0;

/// Read an aircraft file from disk (`-`: standard input) through [`super::file`]. Coordinate
/// files named in it are read relative to its folder (the current folder for standard input).
pub fn load_aircraft_file(path: &Path) -> Result<Aircraft, InputError> {
    let (text, file, base) = read_aircraft_text(path)?;
    parse_aircraft(&text, &file, Some(&base))
}

/// The text of an aircraft file (`-`: standard input), the name to show for it, and the
/// folder its coordinate files are read from.
pub fn read_aircraft_text(path: &Path) -> Result<(String, String, PathBuf), InputError> {
    let text = super::file::read_input_file(path, super::file::AIRCRAFT_FILE)?;
    if path.as_os_str() == "-" {
        return Ok((text, super::file::STDIN_NAME.to_string(), PathBuf::new()));
    }
    let base = path.parent().map(Path::to_path_buf).unwrap_or_default();
    Ok((
        text,
        printable(&path.display().to_string()).into_owned(),
        base,
    ))
}

/// Parse aircraft-file text. `file` names it in errors; `base_dir` is where relative coordinate
/// file paths are resolved (`None`: coordinate files are refused, as for the built-in demo).
pub fn parse_aircraft(
    text: &str,
    file: &str,
    base_dir: Option<&Path>,
) -> Result<Aircraft, InputError> {
    let ctx = Ctx {
        file,
        text,
        base_dir,
    };
    let raw: RawAircraft = match toml::from_str(text) {
        Ok(raw) => raw,
        Err(e) => return Err(with_field_range(ctx.toml_error(&e), text, file, base_dir)),
    };
    ctx.aircraft(raw)
}

/// The accepted static-margin range, %: negative margins only where the file says a
/// negative margin is intended (`[limits] negative_margin_intended = true`).
fn margin_bounds_pct(raw: &RawAircraft) -> bounds::Bounds {
    let intended = raw
        .limits
        .as_ref()
        .and_then(|l| l.negative_margin_intended.as_ref())
        .is_some_and(|b| *b.get_ref());
    if intended {
        MARGIN_INTENDED_PCT
    } else {
        MARGIN_PCT
    }
}

/// A number too large for the TOML reader (`1e400`) is refused before any field is looked
/// at, so its error cannot name the field's range. Read the file again with that number
/// replaced by one as long that the reader takes but no field accepts (`9e300`, the exponent
/// padded with zeros): when the field's own check then refuses it at the same place, its
/// accepted range joins the first error. Any other error is returned as it is.
fn with_field_range(
    err: InputError,
    text: &str,
    file: &str,
    base_dir: Option<&Path>,
) -> InputError {
    if !err.problem.ends_with("is not a number (too large)") || err.accepted.is_none() {
        return err;
    }
    let Some(start) = offset_of(text, err.location.line, err.location.column) else {
        return err;
    };
    let token_len = text[start..]
        .find(|c: char| !(c.is_ascii_alphanumeric() || matches!(c, '.' | '_' | '+' | '-')))
        .unwrap_or(text.len() - start);
    let digits_at = start + usize::from(text[start..].starts_with(['+', '-']));
    let digits_len = start + token_len - digits_at;
    // "9e" + zeros + "300": a finite number of the same length, so every place stays put.
    let Some(zeros) = digits_len.checked_sub(5) else {
        return err;
    };
    let stand_in = format!("9e{}300", "0".repeat(zeros));
    let mut again = String::with_capacity(text.len());
    again.push_str(&text[..digits_at]);
    again.push_str(&stand_in);
    again.push_str(&text[start + token_len..]);
    match parse_aircraft(&again, file, base_dir) {
        Err(e) if e.location == err.location && e.field == err.field && e.accepted.is_some() => {
            InputError {
                accepted: e.accepted,
                ..err
            }
        }
        _ => err,
    }
}

/// The byte offset of 1-based `line` and `column` (in characters) in `text`.
fn offset_of(text: &str, line: usize, column: usize) -> Option<usize> {
    let line_start = if line <= 1 {
        0
    } else {
        text.match_indices('\n').nth(line - 2)?.0 + 1
    };
    let rest = &text[line_start..];
    rest.char_indices()
        .nth(column.checked_sub(1)?)
        .map(|(i, _)| line_start + i)
}

struct Ctx<'a> {
    file: &'a str,
    text: &'a str,
    base_dir: Option<&'a Path>,
}

impl Ctx<'_> {
    fn location(&self, span: &Range<usize>) -> Location {
        super::toml_error::location(self.text, self.file, span.start)
    }

    fn whole_file(&self) -> Location {
        Location {
            file: self.file.to_string(),
            line: 0,
            column: 0,
        }
    }

    fn toml_error(&self, e: &toml::de::Error) -> InputError {
        super::toml_error::translate(self.text, self.file, e)
    }

    fn err(
        &self,
        span: &Range<usize>,

        field: &str,
        problem: impl Into<String>,
        accepted: Option<String>,
    ) -> InputError {
        InputError::new(self.location(span), field, problem, accepted)
    }

    /// A required quantity of the table at `table_span` (path `table`), or an error there naming
    /// `table.key` and what it accepts.
    fn required<'q>(
        &self,
        q: Option<&'q Quantity>,
        table_span: &Range<usize>,
        table: &str,
        key: &str,
        dim: Dimension,
        bounds: Bounds,
    ) -> Result<&'q Quantity, InputError> {
        q.ok_or_else(|| {
            self.err(
                table_span,
                &format!("{table}.{key}"),
                format!("missing: `{key}` is required{}", in_table(table)),
                Some(accepted_quantity(dim, bounds)),
            )
        })
    }

    /// A required quantity `table.key`, in SI, checked against `bounds`.
    fn required_quantity(
        &self,
        q: Option<&Quantity>,
        table_span: &Range<usize>,
        table: &str,
        key: &str,
        dim: Dimension,
        bounds: Bounds,
    ) -> Result<f64, InputError> {
        let q = self.required(q, table_span, table, key, dim, bounds)?;
        self.quantity(q, &format!("{table}.{key}"), dim, bounds)
    }

    /// A required, non-empty name of the table at `table_span` (path `table`), trimmed.
    fn required_name(
        &self,
        name: Option<&Spanned<String>>,
        table_span: &Range<usize>,
        table: &str,
    ) -> Result<String, InputError> {
        let field = format!("{table}.name");
        let accepted = || Some("any text in quotes, e.g. name = \"nose\"".to_string());
        let Some(name) = name else {
            return Err(self.err(
                table_span,
                &field,
                format!("missing: `name` is required{}", in_table(table)),
                accepted(),
            ));
        };
        let text = name.get_ref().trim().to_string();
        if text.is_empty() {
            return Err(self.err(&name.span(), &field, "must not be empty", accepted()));
        }
        self.check_name_length(&text, &name.span(), &field)?;
        Ok(printable(&text).into_owned())
    }

    /// Refuses a name longer than [`MAX_NAME_CHARS`].
    fn check_name_length(
        &self,
        text: &str,
        span: &Range<usize>,
        field: &str,
    ) -> Result<(), InputError> {
        let n = text.chars().count();
        if n > MAX_NAME_CHARS {
            return Err(self.err(
                span,
                field,
                format!("the name is {n} characters long"),
                Some(format!("at most {MAX_NAME_CHARS} characters")),
            ));
        }
        Ok(())
    }

    /// Refuses an entry of the list `table` (`mass`, `ballast`, `setup`) whose name an earlier
    /// entry already has, at the second name. Names are compared as read (trimmed).
    fn unique_names<'n>(
        &self,
        names: impl Iterator<Item = Option<&'n Spanned<String>>>,
        table: &str,
        why: &str,
    ) -> Result<(), InputError> {
        let mut seen: Vec<(&str, usize, Range<usize>)> = Vec::new();
        for (i, name) in names.enumerate() {
            let Some(name) = name else { continue };
            let text = name.get_ref().trim();
            if let Some((_, j, first)) = seen.iter().find(|(s, _, _)| *s == text) {
                return Err(self.err(
                    &name.span(),
                    &format!("{table}[{i}].name"),
                    format!(
                        "`{}` is already the name of {table}[{j}] (line {}); {why}",
                        token(text),
                        self.location(first).line
                    ),
                    Some(format!("a name that no other [[{table}]] entry has")),
                ));
            }
            seen.push((text, i, name.span()));
        }
        Ok(())
    }

    /// A quantity in SI, checked against `bounds` (given in the default unit).
    fn quantity(
        &self,
        q: &Quantity,
        field: &str,
        dim: Dimension,
        bounds: Bounds,
    ) -> Result<f64, InputError> {
        let span = q.span();
        let accepted = || Some(accepted_quantity(dim, bounds));
        let si = match q.get_ref() {
            toml::Value::Integer(i) => super::units::from_default_unit(*i as f64, dim),
            toml::Value::Float(f) => {
                if !f.is_finite() {
                    return Err(self.err(&span, field, "must be a finite number", accepted()));
                }
                super::units::from_default_unit(*f, dim)
            }
            toml::Value::String(s) if !matches!(dim, Dimension::Plain) => {
                parse_quantity(s, dim).map_err(|p| self.err(&span, field, p, accepted()))?
            }
            other => {
                return Err(self.err(
                    &span,
                    field,
                    format!("expected a number, found {}", other.type_str()),
                    accepted(),
                ))
            }
        };
        let in_default = si / super::units::from_default_unit(1.0, dim);
        if !bounds.contains(in_default) {
            let hint = match q.get_ref() {
                toml::Value::Integer(_) | toml::Value::Float(_) => {
                    unit_slip_hint(in_default, dim, bounds)
                }
                toml::Value::String(text) => unit_in_text_hint(text, dim, bounds),
                _ => String::new(),
            };
            return Err(self.err(
                &span,
                field,
                format!(
                    "{} is out of range{hint}",
                    format!("{} {}", fmt_num_short(in_default), dim.default_unit()).trim_end(),
                ),
                accepted(),
            ));
        }
        Ok(si)
    }

    fn opt_quantity(
        &self,
        q: Option<&Quantity>,
        field: &str,
        dim: Dimension,
        bounds: Bounds,
    ) -> Result<Option<f64>, InputError> {
        q.map(|q| self.quantity(q, field, dim, bounds)).transpose()
    }

    /// Refuses a list longer than `limit`, at its first entry past the limit.
    fn count_limit<T>(
        &self,
        list: &[Spanned<T>],
        limit: usize,
        field: &str,
        what: &str,
    ) -> Result<(), InputError> {
        match list.get(limit) {
            None => Ok(()),
            Some(extra) => Err(self.err(
                &extra.span(),
                &format!("{field}[{limit}]"),
                format!("{} {what} given; the limit is {limit}", list.len()),
                Some(format!("at most {limit} {what} (README.md, Limits)")),
            )),
        }
    }

    /// Every count limit of [`super::limits`], checked before any value is looked at, so a
    /// huge file costs no more than reading it.
    fn counts(&self, raw: &RawAircraft) -> Result<(), InputError> {
        self.count_limit(&raw.mass, MAX_MASS_ITEMS, "mass", "[[mass]] items")?;
        self.count_limit(
            &raw.ballast,
            MAX_BALLAST_BAYS,
            "ballast",
            "[[ballast]] bays",
        )?;
        self.count_limit(&raw.setup, MAX_SETUPS, "setup", "[[setup]] tables")?;
        for (path, surface) in [("wing", &raw.wing), ("stabiliser", &raw.stabiliser)] {
            if let Some(s) = surface {
                self.count_limit(
                    &s.get_ref().panel,
                    MAX_PANELS_PER_SURFACE,
                    &format!("{path}.panel"),
                    &format!("[[{path}.panel]] entries"),
                )?;
            }
        }
        if let Some((name, a)) = raw.airfoils.iter().nth(MAX_AIRFOILS) {
            return Err(self.err(
                &a.span(),
                &format!("airfoils.{}", token(name)),
                format!(
                    "{} airfoils given; the limit is {MAX_AIRFOILS}",
                    raw.airfoils.len()
                ),
                Some(format!(
                    "at most {MAX_AIRFOILS} [airfoils.NAME] tables (README.md, Limits)"
                )),
            ));
        }
        for (key, text) in [("notes", &raw.notes), ("datum", &raw.datum)] {
            let n = text.as_ref().map_or(0, |t| t.chars().count());
            if n > MAX_TEXT_CHARS {
                return Err(InputError::new(
                    self.whole_file(),
                    key,
                    format!("the text is {n} characters long"),
                    Some(format!("at most {MAX_TEXT_CHARS} characters")),
                ));
            }
        }
        Ok(())
    }

    fn aircraft(&self, raw: RawAircraft) -> Result<Aircraft, InputError> {
        self.counts(&raw)?;
        let name = self.aircraft_name(raw.name.as_ref())?;
        let air = self.air(raw.air.as_ref())?;
        let (airfoils, ids) = self.airfoils(&raw.airfoils)?;
        let raw_wing = self.required_wing(&raw)?;
        let wing = self.wing(raw_wing, &ids)?;
        let (stabiliser, elevons) =
            self.stabiliser_and_elevons(raw_wing, raw.stabiliser.as_ref(), &ids)?;
        self.no_stabiliser_flaps(&raw)?;
        let wing_flaps = self.wing_flaps(&raw_wing.get_ref().flap, elevons.as_ref())?;
        let flap_settings = self.flap_settings(&raw.flap_setting, &wing_flaps)?;
        let fuselage = raw
            .fuselage
            .as_ref()
            .map(|f| self.fuselage(f))
            .transpose()?;
        let masses = self.masses(&raw.mass, &wing)?;
        let tolerances = self.tolerances(raw.tolerances.as_ref())?;
        let fin = raw.fin.as_ref().map(|f| self.fin(f, &masses)).transpose()?;
        let ballast_bays = self.ballast_bays(&raw.ballast)?;
        let margin_bounds = margin_bounds_pct(&raw);
        let targets = self.targets(raw.targets.as_ref(), margin_bounds)?;
        let margin_limits = self.limits(raw.limits.as_ref(), stabiliser.as_ref(), margin_bounds)?;
        let numerics = self.numerics(raw.numerics.as_ref())?;
        if let Some(s) = &stabiliser {
            self.stabiliser_place(raw.stabiliser.as_ref(), s, &wing)?;
        }
        let weighing = self.weighing(&raw.weighing, "weighing")?;

        let setups = self.setups(
            &raw.setup,
            &masses,
            &ballast_bays,
            &ids,
            stabiliser.is_some(),
        )?;
        let mut airfoils = airfoils;
        self.viscous_reynolds(
            &raw.airfoils,
            &mut airfoils,
            &wing,
            stabiliser.as_ref().map(|s| &s.surface),
            &air,
            &targets,
        )?;
        Ok(Aircraft {
            name,
            notes: printable(&raw.notes.unwrap_or_default()).into_owned(),
            datum: printable(&raw.datum.unwrap_or_else(|| "wing root leading edge".into()))
                .into_owned(),
            air,
            airfoils,
            wing,
            stabiliser,
            elevons,
            wing_flaps,
            flap_settings,
            fuselage,
            fin,
            tolerances,
            masses,
            ballast_bays,
            targets,
            margin_limits,
            numerics,
            setups,
            weighing,
        })
    }

    /// The `[wing]` table, which every aircraft needs.
    fn required_wing<'r>(
        &self,
        raw: &'r RawAircraft,
    ) -> Result<&'r Spanned<RawSurface>, InputError> {
        raw.wing.as_ref().ok_or_else(|| {
            InputError::new(
                self.whole_file(),
                "wing",
                "missing: there is no [wing] table",
                Some(
                    "a [wing] table with root_chord, airfoil and [[wing.panel]] or [wing.ellipse]"
                        .into(),
                ),
            )
        })
    }

    /// Camber flaps are a wing's: a `[[stabiliser.flap]]` is refused at its place.
    fn no_stabiliser_flaps(&self, raw: &RawAircraft) -> Result<(), InputError> {
        match raw
            .stabiliser
            .as_ref()
            .and_then(|st| st.get_ref().flap.first())
        {
            Some(f) => Err(self.err(
                &f.span(),
                "stabiliser.flap",
                "camber flaps belong to the wing",
                Some("[[wing.flap]]".into()),
            )),
            None => Ok(()),
        }
    }

    /// The aircraft's `name`: required, trimmed, not empty, within the name length limit,
    /// with unprintable characters replaced.
    fn aircraft_name(&self, raw_name: Option<&Spanned<String>>) -> Result<String, InputError> {
        let accepted_name = || Some("any text in quotes, e.g. name = \"My glider\"".into());
        let Some(raw_name) = raw_name else {
            return Err(InputError::new(
                self.whole_file(),
                "name",
                "missing: the aircraft needs a `name` at the top of the file, before any [table]",
                accepted_name(),
            ));
        };
        let name = raw_name.get_ref().trim().to_string();
        if name.is_empty() {
            return Err(self.err(
                &raw_name.span(),
                "name",
                "must not be empty",
                accepted_name(),
            ));
        }
        self.check_name_length(&name, &raw_name.span(), "name")?;
        Ok(printable(&name).into_owned())
    }
}
