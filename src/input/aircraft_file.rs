//! Second stage of reading an aircraft file: check every value and build the
//! [`crate::model::Aircraft`], or return an [`InputError`] naming file, line, column, key and
//! the accepted range.

use super::error::{InputError, Location};
use super::limits::*;
use super::raw::{self, Quantity, RawAircraft, RawEllipse, RawPanel};
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

mod flaps;

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

/// An accepted interval, in the field's default unit (mm, g, deg, ...).
#[derive(Clone, Copy)]
struct Bounds {
    min: f64,
    min_inclusive: bool,
    max: f64,
    max_inclusive: bool,
}

impl Bounds {
    const fn closed(min: f64, max: f64) -> Self {
        Bounds {
            min,
            min_inclusive: true,
            max,
            max_inclusive: true,
        }
    }
    const fn positive(max: f64) -> Self {
        Bounds {
            min: 0.0,
            min_inclusive: false,
            max,
            max_inclusive: true,
        }
    }
    fn contains(&self, v: f64) -> bool {
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
    fn describe(&self, dim: Dimension) -> String {
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

fn fmt_num(v: f64) -> String {
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
// (`crate::plausibility`), and the wing loading is checked below (MAX_WING_LOADING_KG_M2).
const POSITION_MM: Bounds = Bounds::closed(-50_000.0, 50_000.0);
const SPAN_MM: Bounds = Bounds::closed(5.0, 30_000.0);
const CHORD_MM: Bounds = Bounds::closed(5.0, 10_000.0);
const TIP_CHORD_MM: Bounds = Bounds::closed(0.0, 10_000.0);
const SWEEP_DEG: Bounds = Bounds::closed(-60.0, 60.0);
const DIHEDRAL_DEG: Bounds = Bounds::closed(-45.0, 45.0);
/// A stabiliser may be a V-tail: up to 60 deg each side (V-tails of sailplanes and models lie
/// between about 30 and 50 deg; common practice).
const STABILISER_DIHEDRAL_DEG: Bounds = Bounds::closed(-60.0, 60.0);
const TWIST_DEG: Bounds = Bounds::closed(-15.0, 15.0);
const INCIDENCE_DEG: Bounds = Bounds::closed(-15.0, 15.0);
const MASS_G: Bounds = Bounds::closed(0.0, 1_000_000.0);
const BALLAST_MAX_G: Bounds = Bounds::positive(1_000_000.0);
const CL_MAX: Bounds = Bounds::closed(0.3, 3.0);
// The viscous section method's accepted ranges (src/section/viscous.rs).
const REYNOLDS: Bounds = Bounds::closed(1e4, 1e7);
const TRANSITION_N: Bounds = Bounds::closed(1.0, 14.0);
// Joukowski and Karman-Trefftz sections: what the circle-map shape solution accepts (less than
// 40 % and 15 %), and no thinner than it is checked for (0.1 %; thinner is a sheet).
const THICKNESS_PCT: Bounds = Bounds {
    min: 100.0 * crate::section::circle_map::MIN_RELIABLE_THICKNESS_RATIO,
    min_inclusive: true,
    max: 100.0 * crate::section::circle_map::MAX_THICKNESS_RATIO,
    max_inclusive: false,
};
const CAMBER_PCT: Bounds = Bounds {
    min: 0.0,
    min_inclusive: true,
    max: 100.0 * crate::section::circle_map::MAX_CAMBER_RATIO,
    max_inclusive: false,
};
const TE_ANGLE_DEG: Bounds = Bounds::closed(0.0, 30.0);
const ELEVATOR_PCT: Bounds = Bounds {
    min: 0.0,
    min_inclusive: true,
    max: 100.0,
    max_inclusive: false,
};
const ELEVATOR_THROW_DEG: Bounds = Bounds::closed(0.0, 45.0);
/// Tail efficiency: 0.5 (deep in a wake) to 1.2 (in a propeller's slipstream).
const DYNAMIC_PRESSURE_RATIO: Bounds = Bounds::closed(0.5, 1.2);
const ELEVON_CHORD_PCT: Bounds = Bounds {
    min: 0.0,
    min_inclusive: false,
    max: 100.0,
    max_inclusive: false,
};
const SEMISPAN_PCT: Bounds = Bounds::closed(0.0, 100.0);
// Static margins, % of MAC: 0 to 40 covers every stable model and light aircraft (common
// practice: 5 to 20 % with a tail, 3 to 10 % tailless; 40 % is far forward of any usual
// forward limit, where the elevator runs out of authority at low speed). Below 0 the aircraft is unstable: accepted only with
// `limits.negative_margin_intended = true`, down to -20 %, and then a danger caution.
const MARGIN_PCT: Bounds = Bounds::closed(0.0, 40.0);
const MARGIN_INTENDED_PCT: Bounds = Bounds::closed(-20.0, 40.0);
/// Largest wing loading accepted, kg/m^2. Models fly at about 2 to 15 kg/m^2 (thermal
/// gliders 2 to 4, sport models 4 to 10, jets up to about 15) and light aircraft at about 40
/// to 150 kg/m^2 (a four-seat tourer about 70) (from memory: common values in model and
/// light-aircraft design practice); past 400 kg/m^2 the stall speed leaves this tool's
/// speed range, so such a file is almost certainly a unit slip.
pub const MAX_WING_LOADING_KG_M2: f64 = 400.0;
const SPEED_M_S: Bounds = Bounds::positive(150.0);
const ALTITUDE_M: Bounds = Bounds::closed(-500.0, 11_000.0);
const TEMP_OFFSET_K: Bounds = Bounds::closed(-60.0, 60.0);
const DENSITY: Bounds = Bounds::closed(0.3, 1.5);
const FUSELAGE_MM: Bounds = Bounds::positive(30_000.0);
/// The builder's tolerance of one weighed mass (one standard deviation), g: 0 (sure) to
/// 10 kg, the most a light aircraft's item could be in doubt (common practice: a kitchen
/// scale reads to 1 g, a platform scale to 0.1 kg).
const MASS_TOLERANCE_G: Bounds = Bounds::closed(0.0, 10_000.0);
/// The builder's tolerance of one position (one standard deviation), mm: 0 to 1000 mm; a
/// doubt of a metre is no longer a tolerance (common practice).
const POSITION_TOLERANCE_MM: Bounds = Bounds::closed(0.0, 1_000.0);
/// Fin height, mm: as a span (5 mm to 30 m).
const FIN_HEIGHT_MM: Bounds = SPAN_MM;
/// Surfaces overlapping in the top view closer than this many chords (vertically) intersect.
const INTERSECTING_GAP_CHORDS: f64 = 0.1;
/// Strips per half-span of the wing (four times the default; the lifting line's own limit is
/// higher).
const STRIPS: Bounds = Bounds::closed(4.0, 100.0);
/// Chordwise lattice panels per strip.
const CHORDWISE: Bounds = Bounds::closed(1.0, 20.0);
/// Lattice panels on each half of the wing that the file may ask for (four times the
/// default's 144): with the tail's share the worst accepted file still finishes `check` in
/// about a second on a laptop core.
const MAX_WING_HALF_PANELS: usize = 600;

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
                toml::Value::String(text) => missing_unit_hint(text, dim),
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
        let Some(raw_wing) = &raw.wing else {
            return Err(InputError::new(
                self.whole_file(),
                "wing",
                "missing: there is no [wing] table",
                Some(
                    "a [wing] table with root_chord, airfoil and [[wing.panel]] or [wing.ellipse]"
                        .into(),
                ),
            ));
        };
        let wing = self.wing(raw_wing, &ids)?;
        let (stabiliser, elevons) =
            self.stabiliser_and_elevons(raw_wing, raw.stabiliser.as_ref(), &ids)?;
        if let Some(f) = raw
            .stabiliser
            .as_ref()
            .and_then(|st| st.get_ref().flap.first())
        {
            return Err(self.err(
                &f.span(),
                "stabiliser.flap",
                "camber flaps belong to the wing",
                Some("[[wing.flap]]".into()),
            ));
        }
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
        let intended = raw
            .limits
            .as_ref()
            .and_then(|l| l.negative_margin_intended.as_ref())
            .is_some_and(|b| *b.get_ref());
        let margin_bounds = if intended {
            MARGIN_INTENDED_PCT
        } else {
            MARGIN_PCT
        };
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

    /// The stabiliser (from its table) and the elevons (from `[wing.elevons]`), refusing
    /// elevons on an aircraft that has a stabiliser.
    fn stabiliser_and_elevons(
        &self,
        raw_wing: &Spanned<raw::RawSurface>,
        raw_stabiliser: Option<&Spanned<raw::RawSurface>>,
        ids: &BTreeMap<String, AirfoilId>,
    ) -> Result<(Option<Stabiliser>, Option<PitchControl>), InputError> {
        let stabiliser = match raw_stabiliser {
            None => None,
            Some(s) => {
                let span = s.span();
                Some(self.stabiliser(span, s.get_ref(), ids)?)
            }
        };
        let elevons = match (&raw_wing.get_ref().elevons, &stabiliser) {
            (None, _) => None,
            (Some(e), Some(_)) => return Err(self.err(
                &e.span(),
                "wing.elevons",
                "elevons are modelled on a tailless wing only; this aircraft has a [stabiliser], \
                     whose elevator does the pitching",
                Some(
                    "remove [wing.elevons], or set stabiliser.elevator_chord, elevator_up and \
                         elevator_down"
                        .into(),
                ),
            )),
            (Some(e), None) => Some(self.elevons(e)?),
        };
        Ok((stabiliser, elevons))
    }

    /// The `[[mass]]` items: at least one, names unique, a total above zero and a wing loading
    /// on `wing` within `MAX_WING_LOADING_KG_M2`.
    fn masses(
        &self,
        raw_masses: &[Spanned<raw::RawMass>],
        wing: &Surface,
    ) -> Result<Vec<MassItem>, InputError> {
        if raw_masses.is_empty() {
            return Err(InputError::new(
                self.whole_file(),
                "mass",
                "no mass items: the CG needs at least one [[mass]] entry",
                Some("one or more [[mass]] tables with name, mass, x".into()),
            ));
        }
        let masses = raw_masses
            .iter()
            .enumerate()
            .map(|(i, m)| self.mass_item(i, m))
            .collect::<Result<Vec<_>, _>>()?;
        self.unique_names(
            raw_masses.iter().map(|m| m.get_ref().name.as_ref()),
            "mass",
            "setups refer to mass items by name",
        )?;
        let total: f64 = masses.iter().map(|m| m.mass_kg).sum();
        if total <= 0.0 {
            return Err(self.err(
                &raw_masses[0].span(),
                "mass",
                "the masses add up to zero",
                Some("a total mass above 0 g".into()),
            ));
        }
        let area_m2 = crate::planform::geometry(wing).area_m2;
        if area_m2 > 0.0 && total / area_m2 > MAX_WING_LOADING_KG_M2 {
            return Err(self.err(
                &raw_masses[0].span(),
                "mass",
                format!(
                    "the masses add up to {} g on a wing of {} dm^2: a wing loading of {} \
                     kg/m^2, more than any aircraft this tool is for",
                    fmt_num_short(1000.0 * total),
                    fmt_num_short(100.0 * area_m2),
                    fmt_num_short(total / area_m2)
                ),
                Some(format!(
                    "a wing loading up to {} kg/m^2 (light aircraft reach about 150); bare \
                     masses are in g and bare lengths in mm",
                    fmt_num(MAX_WING_LOADING_KG_M2)
                )),
            ));
        }
        Ok(masses)
    }

    /// The `[[ballast]]` bays, names unique.
    fn ballast_bays(
        &self,
        raw_ballast: &[Spanned<raw::RawBallast>],
    ) -> Result<Vec<BallastBay>, InputError> {
        let ballast_bays = raw_ballast
            .iter()
            .enumerate()
            .map(|(i, b)| self.ballast(i, b))
            .collect::<Result<Vec<_>, _>>()?;
        self.unique_names(
            raw_ballast.iter().map(|b| b.get_ref().name.as_ref()),
            "ballast",
            "setups refer to ballast bays by name",
        )?;
        Ok(ballast_bays)
    }

    /// The `[targets]`: static margin within `margin_bounds` (percent), trim and top speeds.
    fn targets(
        &self,
        raw_targets: Option<&raw::RawTargets>,
        margin_bounds: Bounds,
    ) -> Result<Targets, InputError> {
        let targets = match raw_targets {
            None => Targets::default(),
            Some(t) => Targets {
                static_margin: self.margin(
                    t.static_margin.as_ref(),
                    "targets.static_margin",
                    margin_bounds,
                )?,
                trim_speed_m_s: self.opt_quantity(
                    t.trim_speed.as_ref(),
                    "targets.trim_speed",
                    Dimension::Speed,
                    SPEED_M_S,
                )?,
                top_speed_m_s: self.opt_quantity(
                    t.top_speed.as_ref(),
                    "targets.top_speed",
                    Dimension::Speed,
                    SPEED_M_S,
                )?,
            },
        };
        Ok(targets)
    }

    /// The `[[setup]]` tables, names unique.
    fn setups(
        &self,
        raw_setups: &[Spanned<raw::RawSetup>],
        masses: &[MassItem],
        bays: &[BallastBay],
        ids: &BTreeMap<String, AirfoilId>,
        has_stabiliser: bool,
    ) -> Result<Vec<Setup>, InputError> {
        let setups = raw_setups
            .iter()
            .enumerate()
            .map(|(i, s)| self.setup(i, s, masses, bays, ids, has_stabiliser))
            .collect::<Result<Vec<_>, _>>()?;
        self.unique_names(
            raw_setups.iter().map(|s| s.get_ref().name.as_ref()),
            "setup",
            "`--setup NAME` could not choose the second one",
        )?;
        Ok(setups)
    }

    /// The Reynolds number of each viscous airfoil that has none in the file: from the target
    /// trim speed and the mean of the chords at the panel ends that use the airfoil (wing and
    /// stabiliser), in the file's air. Without a target trim speed the file must give it.
    fn viscous_reynolds(
        &self,
        raw: &BTreeMap<String, Spanned<raw::RawAirfoil>>,
        airfoils: &mut [Airfoil],
        wing: &Surface,
        stabiliser: Option<&Surface>,
        air: &Air,
        targets: &Targets,
    ) -> Result<(), InputError> {
        for (index, airfoil) in airfoils.iter_mut().enumerate() {
            if airfoil.method != Some(SectionMethod::Viscous) || airfoil.reynolds.is_some() {
                continue;
            }
            let id = AirfoilId(index);
            let mut chords = Vec::new();
            for surface in std::iter::once(wing).chain(stabiliser) {
                match &surface.shape {
                    SurfaceShape::Panels(panels) => {
                        for p in panels {
                            if p.root_airfoil == id {
                                chords.push(p.root_chord_m);
                            }
                            if p.tip_airfoil == id {
                                chords.push(p.tip_chord_m);
                            }
                        }
                    }
                    SurfaceShape::Elliptic(e) => {
                        if e.root_airfoil == id || e.tip_airfoil == id {
                            chords.push(e.root_chord_m);
                        }
                    }
                }
            }
            let field = format!("airfoils.{}.reynolds", airfoil.name);
            let span = raw
                .get(&airfoil.name)
                .and_then(|a| a.get_ref().method.as_ref().map(|m| m.span()))
                .unwrap_or_default();
            let (Some(speed), false) = (targets.trim_speed_m_s, chords.is_empty()) else {
                return Err(self.err(
                    &span,
                    &field,
                    "the viscous method needs the section's chord Reynolds number: give \
                     reynolds, or a [targets] trim_speed and use the airfoil on a surface",
                    Some("1e4 to 1e7, e.g. reynolds = 150000".into()),
                ));
            };
            let chord_m = chords.iter().sum::<f64>() / chords.len() as f64;
            let re = crate::atmosphere::air_state(air).reynolds(speed, chord_m);
            if !(REYNOLDS.contains(re)) {
                return Err(self.err(
                    &span,
                    &field,
                    format!(
                        "the Reynolds number from the trim speed and the chord, {re:.0}, is \
                         outside the range of the viscous method"
                    ),
                    Some("1e4 to 1e7; give reynolds for this airfoil".into()),
                ));
            }
            airfoil.reynolds = Some(re);
        }
        Ok(())
    }

    fn air(&self, raw: Option<&raw::RawAir>) -> Result<Air, InputError> {
        let Some(a) = raw else {
            return Ok(Air::Standard {
                altitude_m: 0.0,
                temperature_offset_k: 0.0,
            });
        };
        if let Some(d) = &a.density {
            if a.altitude.is_some() || a.temperature_offset.is_some() {
                return Err(self.err(
                    &d.span(),
                    "air.density",
                    "give either a density or an altitude and temperature offset, not both",
                    Some("density alone, or altitude and temperature_offset".into()),
                ));
            }
            let rho = self.quantity(d, "air.density", Dimension::Density, DENSITY)?;
            return Ok(Air::Density { density_kg_m3: rho });
        }
        Ok(Air::Standard {
            altitude_m: self
                .opt_quantity(
                    a.altitude.as_ref(),
                    "air.altitude",
                    Dimension::Altitude,
                    ALTITUDE_M,
                )?
                .unwrap_or(0.0),
            temperature_offset_k: self
                .opt_quantity(
                    a.temperature_offset.as_ref(),
                    "air.temperature_offset",
                    Dimension::TemperatureDifference,
                    TEMP_OFFSET_K,
                )?
                .unwrap_or(0.0),
        })
    }

    fn airfoils(
        &self,
        raw: &BTreeMap<String, Spanned<raw::RawAirfoil>>,
    ) -> Result<(Vec<Airfoil>, BTreeMap<String, AirfoilId>), InputError> {
        let mut list = Vec::new();
        let mut ids = BTreeMap::new();
        for (name, spanned) in raw {
            let airfoil = self.airfoil(name, spanned)?;
            ids.insert(name.clone(), AirfoilId(list.len()));
            list.push(airfoil);
        }
        Ok((list, ids))
    }

    /// One `[airfoils.NAME]` table: exactly one shape, then cl_max, method, Reynolds number
    /// and transition N.
    fn airfoil(
        &self,
        name: &str,
        spanned: &Spanned<raw::RawAirfoil>,
    ) -> Result<Airfoil, InputError> {
        let field = format!("airfoils.{name}");
        let a = spanned.get_ref();
        let span = spanned.span();
        let count = [
            a.naca.is_some(),
            a.joukowski.is_some(),
            a.karman_trefftz.is_some(),
            a.coordinates.is_some(),
        ]
        .iter()
        .filter(|b| **b)
        .count();
        if count != 1 {
            return Err(self.err(
                &span,
                &field,
                if count == 0 {
                    "no shape given"
                } else {
                    "more than one shape given"
                },
                Some("exactly one of naca, joukowski, karman_trefftz, coordinates".into()),
            ));
        }
        let shape = if let Some(n) = &a.naca {
            self.naca_shape(n, &field)?
        } else if let Some(j) = &a.joukowski {
            self.joukowski_shape(j, &field)?
        } else if let Some(k) = &a.karman_trefftz {
            self.karman_trefftz(k, &format!("{field}.karman_trefftz"))?
        } else if let Some(c) = &a.coordinates {
            self.coordinates_shape(c, &format!("{field}.coordinates"))?
        } else {
            unreachable_shape()
        };
        let cl_max = self.opt_quantity(
            a.cl_max.as_ref(),
            &format!("{field}.cl_max"),
            Dimension::Plain,
            CL_MAX,
        )?;
        let method = self.airfoil_method(a.method.as_ref(), &shape, &field)?;
        let reynolds = self.opt_quantity(
            a.reynolds.as_ref(),
            &format!("{field}.reynolds"),
            Dimension::Plain,
            REYNOLDS,
        )?;
        let transition_n = self.opt_quantity(
            a.transition_n.as_ref(),
            &format!("{field}.transition_n"),
            Dimension::Plain,
            TRANSITION_N,
        )?;
        Ok(Airfoil {
            name: printable(name).into_owned(),
            shape,
            cl_max,
            method,
            reynolds,
            transition_n,
        })
    }

    /// `naca = "2412"` (or an integer): the designation without a leading "NACA", checked by
    /// the NACA parser.
    fn naca_shape(
        &self,
        n: &Spanned<toml::Value>,
        field: &str,
    ) -> Result<AirfoilShape, InputError> {
        let text = match n.get_ref() {
            toml::Value::String(s) => s.clone(),
            toml::Value::Integer(i) => format!("{i:04}"),
            other => {
                return Err(self.err(
                    &n.span(),
                    &format!("{field}.naca"),
                    format!("expected a designation, found {}", other.type_str()),
                    Some("a 4- or 5-digit designation such as \"2412\" or \"23012\"".into()),
                ));
            }
        };
        let designation: String = text
            .trim()
            .trim_start_matches(|c: char| {
                c.eq_ignore_ascii_case(&'n')
                    || c.eq_ignore_ascii_case(&'a')
                    || c.eq_ignore_ascii_case(&'c')
            })
            .trim()
            .to_string();
        crate::section::naca::NacaProfile::parse(&designation).map_err(|e| {
            self.err(
                &n.span(),
                &format!("{field}.naca"),
                e.to_string(),
                Some("a 4-digit (\"2412\") or 5-digit 2x0 series (\"23012\") designation".into()),
            )
        })?;
        Ok(AirfoilShape::Naca(designation))
    }

    /// `joukowski = { thickness, camber }` as ratios of the chord (camber 0 when not given).
    fn joukowski_shape(
        &self,
        j: &Spanned<raw::RawJoukowski>,
        field: &str,
    ) -> Result<AirfoilShape, InputError> {
        let table_span = j.span();
        let j = j.get_ref();
        let path = format!("{field}.joukowski");
        Ok(AirfoilShape::Joukowski {
            thickness_ratio: self.quantity(
                self.required(
                    j.thickness.as_ref(),
                    &table_span,
                    &path,
                    "thickness",
                    Dimension::Percent,
                    THICKNESS_PCT,
                )?,
                &format!("{path}.thickness"),
                Dimension::Percent,
                THICKNESS_PCT,
            )?,
            camber_ratio: self
                .opt_quantity(
                    j.camber.as_ref(),
                    &format!("{field}.joukowski.camber"),
                    Dimension::Percent,
                    CAMBER_PCT,
                )?
                .unwrap_or(0.0),
        })
    }

    /// The airfoil's `method`, by name from the registry, refused when it does not accept
    /// `shape`.
    fn airfoil_method(
        &self,
        m: Option<&Spanned<String>>,
        shape: &AirfoilShape,
        field: &str,
    ) -> Result<Option<SectionMethod>, InputError> {
        Ok(match m {
            None => None,
            Some(m) => {
                let text = m.get_ref().trim().to_ascii_lowercase();
                let Some(info) = registry::by_name(&text) else {
                    return Err(self.err(
                        &m.span(),
                        &format!("{field}.method"),
                        format!("unknown method `{}`", token(&text)),
                        Some(registry::names()),
                    ));
                };
                if !registry::accepts(info.method, shape) {
                    return Err(self.err(
                        &m.span(),
                        &format!("{field}.method"),
                        "the exact method needs a joukowski or karman_trefftz airfoil",
                        Some("thin, panel, viscous".into()),
                    ));
                }
                Some(info.method)
            }
        })
    }

    /// `karman_trefftz = { thickness, camber, trailing_edge_angle }`. The largest angle depends
    /// on thickness and camber: no Karman-Trefftz section is thinner than the two circular arcs
    /// meeting at its trailing-edge angle (see [`crate::section::karman_trefftz`]).
    fn karman_trefftz(
        &self,
        k: &Spanned<raw::RawKarmanTrefftz>,
        path: &str,
    ) -> Result<AirfoilShape, InputError> {
        let table_span = k.span();
        let k = k.get_ref();
        let thickness_ratio = self.quantity(
            self.required(
                k.thickness.as_ref(),
                &table_span,
                path,
                "thickness",
                Dimension::Percent,
                THICKNESS_PCT,
            )?,
            &format!("{path}.thickness"),
            Dimension::Percent,
            THICKNESS_PCT,
        )?;
        let camber_ratio = self
            .opt_quantity(
                k.camber.as_ref(),
                &format!("{path}.camber"),
                Dimension::Percent,
                CAMBER_PCT,
            )?
            .unwrap_or(0.0);
        let angle_q = self.required(
            k.trailing_edge_angle.as_ref(),
            &table_span,
            path,
            "trailing_edge_angle",
            Dimension::Angle,
            TE_ANGLE_DEG,
        )?;
        let angle_field = format!("{path}.trailing_edge_angle");
        let angle = self.quantity(angle_q, &angle_field, Dimension::Angle, TE_ANGLE_DEG)?;
        let limit_deg = crate::section::karman_trefftz::max_trailing_edge_angle_rad(
            thickness_ratio,
            camber_ratio,
        )
        .to_degrees()
        .min(TE_ANGLE_DEG.max);
        // Shown to 0.1 deg, rounded down, so that every value up to the one shown is accepted.
        let shown_deg = (limit_deg * 10.0).floor() / 10.0;
        if angle.to_degrees() > limit_deg {
            return Err(self.err(
                &angle_q.span(),
                &angle_field,
                format!(
                    "{} deg is too large for a section {} % thick with {} % camber: a \
                     Karman-Trefftz section this thin cannot have so wide a trailing edge",
                    fmt_num_short(angle.to_degrees()),
                    fmt_num_short(100.0 * thickness_ratio),
                    fmt_num_short(100.0 * camber_ratio)
                ),
                Some(format!(
                    "0 deg to {} deg for this thickness and camber; a thicker section allows \
                     more (about 2 deg per % of thickness), up to {} deg",
                    fmt_num(shown_deg),
                    fmt_num(TE_ANGLE_DEG.max)
                )),
            ));
        }
        Ok(AirfoilShape::KarmanTrefftz {
            thickness_ratio,
            camber_ratio,
            trailing_edge_angle_rad: angle,
        })
    }

    fn coordinates_shape(
        &self,
        c: &Spanned<String>,
        field: &str,
    ) -> Result<AirfoilShape, InputError> {
        let span = c.span();
        let Some(base) = self.base_dir else {
            return Err(self.err(
                &span,
                field,
                "coordinate files cannot be used from built-in text",
                Some("naca, joukowski or karman_trefftz".into()),
            ));
        };
        let path: PathBuf = base.join(c.get_ref());
        let text =
            super::file::read_input_file(&path, super::file::COORDINATES_FILE).map_err(|e| {
                self.err(
                    &span,
                    field,
                    format!("cannot use the coordinates file: {e}"),
                    Some(
                        "a path relative to the aircraft file, naming a regular file of at most 1 MB"
                            .into(),
                    ),
                )
            })?;
        let (title, points) =
            super::coordinates::parse_coordinates(&text, &path.display().to_string())?;
        // Check the shape now, so that a bad file is reported at the key that names it.
        crate::section::geometry::Contour::new(&points).map_err(|e| {
            self.err(
                &span,
                field,
                format!("`{}`: {e}", path.display()),
                Some(
                    "a closed loop of distinct points, trailing edge to leading edge and back"
                        .into(),
                ),
            )
        })?;
        let title = title.unwrap_or_else(|| {
            path.file_stem()
                .map(|s| printable(&s.to_string_lossy()).into_owned())
                .unwrap_or_default()
        });
        Ok(AirfoilShape::Coordinates { title, points })
    }

    fn airfoil_ref(
        &self,
        name: Option<&Spanned<String>>,
        fallback: Option<AirfoilId>,
        field: &str,
        ids: &BTreeMap<String, AirfoilId>,
        table_span: &Range<usize>,
    ) -> Result<AirfoilId, InputError> {
        match name {
            Some(n) => ids.get(n.get_ref().trim()).copied().ok_or_else(|| {
                let known: Vec<&str> = ids.keys().map(String::as_str).collect();
                self.err(
                    &n.span(),
                    field,
                    format!("no airfoil named `{}`", token(n.get_ref())),
                    Some(if known.is_empty() {
                        "define it in an [airfoils.NAME] table".to_string()
                    } else {
                        one_of(&known)
                    }),
                )
            }),
            None => fallback.ok_or_else(|| {
                self.err(
                    table_span,
                    field,
                    "missing airfoil",
                    Some("the name of an [airfoils.NAME] table".into()),
                )
            }),
        }
    }

    /// The main wing, refusing the keys that only a stabiliser has.
    fn wing(
        &self,
        w: &Spanned<raw::RawSurface>,
        ids: &BTreeMap<String, AirfoilId>,
    ) -> Result<Surface, InputError> {
        let r = w.get_ref();
        let stabiliser_only = [
            ("role", r.role.as_ref().map(|v| v.span())),
            (
                "elevator_chord",
                r.elevator_chord.as_ref().map(|v| v.span()),
            ),
            ("elevator_up", r.elevator_up.as_ref().map(|v| v.span())),
            ("elevator_down", r.elevator_down.as_ref().map(|v| v.span())),
            (
                "dynamic_pressure_ratio",
                r.dynamic_pressure_ratio.as_ref().map(|v| v.span()),
            ),
        ];
        if let Some((key, Some(span))) = stabiliser_only.into_iter().find(|(_, s)| s.is_some()) {
            return Err(self.err(
                &span,
                &format!("wing.{key}"),
                "this key belongs in [stabiliser], not [wing]",
                Some("x, z, incidence, root_chord, airfoil, panel, ellipse".into()),
            ));
        }
        self.surface("wing", w.span(), r, ids)
    }

    fn surface(
        &self,
        path: &str,
        table_span: Range<usize>,
        raw: &raw::RawSurface,
        ids: &BTreeMap<String, AirfoilId>,
    ) -> Result<Surface, InputError> {
        let x = self
            .opt_quantity(
                raw.x.as_ref(),
                &format!("{path}.x"),
                Dimension::Length,
                POSITION_MM,
            )?
            .unwrap_or(0.0);
        let z = self
            .opt_quantity(
                raw.z.as_ref(),
                &format!("{path}.z"),
                Dimension::Length,
                POSITION_MM,
            )?
            .unwrap_or(0.0);
        let incidence = self
            .opt_quantity(
                raw.incidence.as_ref(),
                &format!("{path}.incidence"),
                Dimension::Angle,
                INCIDENCE_DEG,
            )?
            .unwrap_or(0.0);
        let root_chord_q = self.required(
            raw.root_chord.as_ref(),
            &table_span,
            path,
            "root_chord",
            Dimension::Length,
            CHORD_MM,
        )?;
        let root_chord = self.quantity(
            root_chord_q,
            &format!("{path}.root_chord"),
            Dimension::Length,
            CHORD_MM,
        )?;
        let root_airfoil = self.airfoil_ref(
            raw.airfoil.as_ref(),
            None,
            &format!("{path}.airfoil"),
            ids,
            &table_span,
        )?;
        let shape = match (raw.panel.is_empty(), raw.ellipse.as_ref()) {
            (false, Some(e)) => {
                return Err(self.err(
                    &e.span(),
                    &format!("{path}.ellipse"),
                    "a surface is either panels or an ellipse, not both",
                    Some(format!(
                        "[[{path}.panel]] tables or one [{path}.ellipse] table"
                    )),
                ))
            }
            (true, None) => {
                return Err(self.err(
                    &table_span,
                    &format!("{path}.panel"),
                    "no planform given",
                    Some(
                        "one or more [[{path}.panel]] tables, or one [{path}.ellipse] table"
                            .replace("{path}", path),
                    ),
                ))
            }
            (true, Some(e)) => {
                SurfaceShape::Elliptic(self.ellipse(path, e, root_chord, root_airfoil, ids)?)
            }
            (false, None) => {
                let mut panels = Vec::with_capacity(raw.panel.len());
                let mut chord = root_chord;
                let mut twist = 0.0;
                let mut airfoil = root_airfoil;
                for (i, p) in raw.panel.iter().enumerate() {
                    let panel =
                        self.panel(&format!("{path}.panel[{i}]"), p, chord, twist, airfoil, ids)?;
                    chord = panel.tip_chord_m;
                    twist = panel.tip_twist_rad;
                    airfoil = panel.tip_airfoil;
                    panels.push(panel);
                }

                SurfaceShape::Panels(panels)
            }
        };
        Ok(Surface {
            name: path.to_string(),
            root_le_x_m: x,
            root_le_z_m: z,
            incidence_rad: incidence,
            shape,
        })
    }

    fn panel(
        &self,
        path: &str,
        p: &Spanned<RawPanel>,
        prev_chord: f64,
        prev_twist: f64,
        prev_airfoil: AirfoilId,
        ids: &BTreeMap<String, AirfoilId>,
    ) -> Result<Panel, InputError> {
        let span = p.span();
        let p = p.get_ref();
        let root_chord = self
            .opt_quantity(
                p.root_chord.as_ref(),
                &format!("{path}.root_chord"),
                Dimension::Length,
                CHORD_MM,
            )?
            .unwrap_or(prev_chord);
        let tip_chord = self
            .opt_quantity(
                p.tip_chord.as_ref(),
                &format!("{path}.tip_chord"),
                Dimension::Length,
                TIP_CHORD_MM,
            )?
            .unwrap_or(root_chord);
        let panel_span = self.required(
            p.span.as_ref(),
            &span,
            path,
            "span",
            Dimension::Length,
            SPAN_MM,
        )?;
        Ok(Panel {
            span_m: self.quantity(
                panel_span,
                &format!("{path}.span"),
                Dimension::Length,
                SPAN_MM,
            )?,
            root_chord_m: root_chord,
            tip_chord_m: tip_chord,
            sweep_le_rad: self
                .opt_quantity(
                    p.sweep.as_ref(),
                    &format!("{path}.sweep"),
                    Dimension::Angle,
                    SWEEP_DEG,
                )?
                .unwrap_or(0.0),
            dihedral_rad: self
                .opt_quantity(
                    p.dihedral.as_ref(),
                    &format!("{path}.dihedral"),
                    Dimension::Angle,
                    if path.starts_with("stabiliser") {
                        STABILISER_DIHEDRAL_DEG
                    } else {
                        DIHEDRAL_DEG
                    },
                )?
                .unwrap_or(0.0),
            tip_twist_rad: self
                .opt_quantity(
                    p.twist.as_ref(),
                    &format!("{path}.twist"),
                    Dimension::Angle,
                    TWIST_DEG,
                )?
                .unwrap_or(prev_twist),
            root_airfoil: prev_airfoil,
            tip_airfoil: self.airfoil_ref(
                p.tip_airfoil.as_ref(),
                Some(prev_airfoil),
                &format!("{path}.tip_airfoil"),
                ids,
                &span,
            )?,
        })
    }

    fn ellipse(
        &self,
        path: &str,
        e: &Spanned<RawEllipse>,
        root_chord: f64,
        root_airfoil: AirfoilId,
        ids: &BTreeMap<String, AirfoilId>,
    ) -> Result<EllipticShape, InputError> {
        let span = e.span();
        let e = e.get_ref();
        let semispan = self.required(
            e.span.as_ref(),
            &span,
            &format!("{path}.ellipse"),
            "span",
            Dimension::Length,
            SPAN_MM,
        )?;
        Ok(EllipticShape {
            semispan_m: self.quantity(
                semispan,
                &format!("{path}.ellipse.span"),
                Dimension::Length,
                SPAN_MM,
            )?,
            root_chord_m: root_chord,
            dihedral_rad: self
                .opt_quantity(
                    e.dihedral.as_ref(),
                    &format!("{path}.ellipse.dihedral"),
                    Dimension::Angle,
                    DIHEDRAL_DEG,
                )?
                .unwrap_or(0.0),
            tip_twist_rad: self
                .opt_quantity(
                    e.twist.as_ref(),
                    &format!("{path}.ellipse.twist"),
                    Dimension::Angle,
                    TWIST_DEG,
                )?
                .unwrap_or(0.0),
            root_airfoil,
            tip_airfoil: self.airfoil_ref(
                e.tip_airfoil.as_ref(),
                Some(root_airfoil),
                &format!("{path}.ellipse.tip_airfoil"),
                ids,
                &span,
            )?,
        })
    }

    /// `[wing.elevons]`.
    /// A trailing-edge control's chord (`chord`, % of the local chord) and its span range
    /// (`inboard` to `outboard`, % of the semispan, the outboard end outboard of the inboard
    /// end), all three required in the table `path` at `table_span`: the elevons' and each
    /// camber flap's.
    fn control_span(
        &self,
        (chord, inboard, outboard): (Option<&Quantity>, Option<&Quantity>, Option<&Quantity>),
        table_span: &Range<usize>,
        path: &str,
    ) -> Result<ControlSpan, InputError> {
        let chord_fraction = self.required_quantity(
            chord,
            table_span,
            path,
            "chord",
            Dimension::Percent,
            ELEVON_CHORD_PCT,
        )?;
        let inboard_fraction = self.required_quantity(
            inboard,
            table_span,
            path,
            "inboard",
            Dimension::Percent,
            SEMISPAN_PCT,
        )?;
        let outboard_q = self.required(
            outboard,
            table_span,
            path,
            "outboard",
            Dimension::Percent,
            SEMISPAN_PCT,
        )?;
        let field = format!("{path}.outboard");
        let outboard_fraction =
            self.quantity(outboard_q, &field, Dimension::Percent, SEMISPAN_PCT)?;
        if outboard_fraction <= inboard_fraction {
            return Err(self.err(
                &outboard_q.span(),
                &field,
                format!(
                    "the outboard end ({} %) must lie outboard of the inboard end ({} %)",
                    fmt_num(100.0 * outboard_fraction),
                    fmt_num(100.0 * inboard_fraction)
                ),
                Some(format!(
                    "more than {} % to 100 % of the semispan",
                    fmt_num(100.0 * inboard_fraction)
                )),
            ));
        }
        Ok(ControlSpan {
            chord_fraction,
            inboard_fraction,
            outboard_fraction,
        })
    }

    fn elevons(&self, e: &Spanned<raw::RawElevons>) -> Result<PitchControl, InputError> {
        let path = "wing.elevons";
        let span = e.span();
        let e = e.get_ref();
        let ControlSpan {
            chord_fraction,
            inboard_fraction,
            outboard_fraction,
        } = self.control_span(
            (e.chord.as_ref(), e.inboard.as_ref(), e.outboard.as_ref()),
            &span,
            path,
        )?;
        let throw = DEFAULT_ELEVATOR_THROW_DEG.to_radians();
        Ok(PitchControl {
            chord_fraction,
            inboard_fraction,
            outboard_fraction,
            max_up_rad: self
                .opt_quantity(
                    e.up.as_ref(),
                    "wing.elevons.up",
                    Dimension::Angle,
                    ELEVATOR_THROW_DEG,
                )?
                .unwrap_or(throw),
            max_down_rad: self
                .opt_quantity(
                    e.down.as_ref(),
                    "wing.elevons.down",
                    Dimension::Angle,
                    ELEVATOR_THROW_DEG,
                )?
                .unwrap_or(throw),
        })
    }

    fn stabiliser(
        &self,
        span: Range<usize>,
        s: &raw::RawSurface,
        ids: &BTreeMap<String, AirfoilId>,
    ) -> Result<Stabiliser, InputError> {
        if let Some(e) = &s.elevons {
            return Err(self.err(
                &e.span(),
                "stabiliser.elevons",
                "elevons belong to a tailless wing, not to the stabiliser",
                Some("elevator_chord, elevator_up, elevator_down".into()),
            ));
        }
        let role = match &s.role {
            None => StabiliserRole::Tail,
            Some(r) => match r.get_ref().trim().to_ascii_lowercase().as_str() {
                "tail" => StabiliserRole::Tail,
                "canard" => StabiliserRole::Canard,
                other => {
                    return Err(self.err(
                        &r.span(),
                        "stabiliser.role",
                        format!("unknown role `{}`", token(other)),
                        Some("tail, canard".into()),
                    ))
                }
            },
        };
        let surface = self.surface("stabiliser", span.clone(), s, ids)?;
        if s.x.is_none() {
            return Err(self.err(
                &span,
                "stabiliser.x",
                "missing: `x` is required in [stabiliser] (where is its root leading edge?)",
                Some(accepted_quantity(Dimension::Length, POSITION_MM)),
            ));
        }
        let throw = DEFAULT_ELEVATOR_THROW_DEG.to_radians();
        let elevator = PitchControl::full_span(
            self.opt_quantity(
                s.elevator_chord.as_ref(),
                "stabiliser.elevator_chord",
                Dimension::Percent,
                ELEVATOR_PCT,
            )?
            .unwrap_or(0.3),
            self.opt_quantity(
                s.elevator_up.as_ref(),
                "stabiliser.elevator_up",
                Dimension::Angle,
                ELEVATOR_THROW_DEG,
            )?
            .unwrap_or(throw),
            self.opt_quantity(
                s.elevator_down.as_ref(),
                "stabiliser.elevator_down",
                Dimension::Angle,
                ELEVATOR_THROW_DEG,
            )?
            .unwrap_or(throw),
        );
        let dynamic_pressure_ratio = self
            .opt_quantity(
                s.dynamic_pressure_ratio.as_ref(),
                "stabiliser.dynamic_pressure_ratio",
                Dimension::Plain,
                DYNAMIC_PRESSURE_RATIO,
            )?
            .unwrap_or(match role {
                StabiliserRole::Tail => crate::model::DEFAULT_TAIL_DYNAMIC_PRESSURE_RATIO,
                StabiliserRole::Canard => crate::model::DEFAULT_CANARD_DYNAMIC_PRESSURE_RATIO,
            });
        Ok(Stabiliser {
            role,
            surface,
            elevator,
            dynamic_pressure_ratio,
        })
    }

    /// The supports of a weighing at `path` (`weighing`, or `setup[i].weighing`): none, or 2 or
    /// 3 with readings adding up to more than zero.
    fn weighing(
        &self,
        supports: &[Spanned<raw::RawSupport>],
        path: &str,
    ) -> Result<Vec<WeighingSupport>, InputError> {
        let weighing = supports
            .iter()
            .enumerate()
            .map(|(i, s)| {
                let path = format!("{path}[{i}]");
                let span = s.span();
                let s = s.get_ref();
                Ok(WeighingSupport {
                    x_m: self.required_quantity(
                        s.x.as_ref(),
                        &span,
                        &path,
                        "x",
                        Dimension::Length,
                        POSITION_MM,
                    )?,
                    reading_kg: self.required_quantity(
                        s.reading.as_ref(),
                        &span,
                        &path,
                        "reading",
                        Dimension::Mass,
                        MASS_G,
                    )?,
                })
            })
            .collect::<Result<Vec<_>, InputError>>()?;
        if weighing.len() == 1 || weighing.len() > 3 {
            let span = supports[weighing.len() - 1].span();
            return Err(self.err(
                &span,
                path,
                match weighing.len() {
                    1 => "1 support given".to_string(),
                    n => format!("{n} supports given"),
                },
                Some(format!("2 or 3 [[{path}]] supports")),
            ));
        }
        if !weighing.is_empty() && weighing.iter().map(|s| s.reading_kg).sum::<f64>() <= 0.0 {
            return Err(self.err(
                &supports[0].span(),
                path,
                "the readings add up to zero",
                Some("readings above 0 g".into()),
            ));
        }
        Ok(weighing)
    }

    fn setup(
        &self,
        i: usize,
        s: &Spanned<raw::RawSetup>,
        masses: &[MassItem],
        bays: &[BallastBay],
        ids: &BTreeMap<String, AirfoilId>,
        has_stabiliser: bool,
    ) -> Result<Setup, InputError> {
        let path = format!("setup[{i}]");
        let span = s.span();
        let s = s.get_ref();
        let name = self.required_name(s.name.as_ref(), &span, &path)?;
        let mut changes = Vec::new();
        self.setup_ballast(&path, &s.ballast, bays, &mut changes)?;
        self.setup_masses(&path, s, masses, &mut changes)?;
        self.setup_incidences(&path, s, has_stabiliser, &mut changes)?;
        self.setup_airfoils(&path, &s.airfoils, ids, &mut changes)?;
        if changes.is_empty() {
            return Err(self.err(&span, &path, "the setup changes nothing", Some("one or more of ballast, mass_x, mass, wing_incidence, stabiliser_incidence, airfoils".into())));
        }
        let weighing = if s.weighing.is_empty() {
            None
        } else {
            Some(self.weighing(&s.weighing, &format!("{path}.weighing"))?)
        };
        Ok(Setup {
            name,
            changes,
            weighing,
        })
    }

    /// A setup's `ballast` changes: each bay by name, its mass up to the bay's maximum.
    fn setup_ballast(
        &self,
        path: &str,
        ballast: &BTreeMap<String, Quantity>,
        bays: &[BallastBay],
        changes: &mut Vec<Change>,
    ) -> Result<(), InputError> {
        for (bay_name, q) in ballast {
            let bay = bays
                .iter()
                .position(|b| b.name == printable(bay_name.trim()))
                .ok_or_else(|| {
                    let names: Vec<&str> = bays.iter().map(|b| b.name.as_str()).collect();
                    self.err(
                        &q.span(),
                        &format!("{path}.ballast"),
                        format!("no ballast bay named `{}`", token(bay_name)),
                        Some(if names.is_empty() {
                            "define a [[ballast]] bay first".into()
                        } else {
                            one_of(&names)
                        }),
                    )
                })?;
            let max_g = bays[bay].max_mass_kg * 1000.0;
            let mass_kg = self.quantity(
                q,
                &format!("{path}.ballast.{bay_name}"),
                Dimension::Mass,
                Bounds::closed(0.0, max_g),
            )?;
            changes.push(Change::Ballast { bay, mass_kg });
        }
        Ok(())
    }

    /// A setup's `mass_x` (position) then `mass` changes, each mass item by name.
    fn setup_masses(
        &self,
        path: &str,
        s: &raw::RawSetup,
        masses: &[MassItem],
        changes: &mut Vec<Change>,
    ) -> Result<(), InputError> {
        let find_item = |key: &str, table: &str, q: &Quantity| {
            masses
                .iter()
                .position(|m| m.name == printable(key.trim()))
                .ok_or_else(|| {
                    let names: Vec<&str> = masses.iter().map(|m| m.name.as_str()).collect();
                    self.err(
                        &q.span(),
                        &format!("{path}.{table}"),
                        format!("no mass item named `{}`", token(key)),
                        Some(one_of(&names)),
                    )
                })
        };
        for (item_name, q) in &s.mass_x {
            let item = find_item(item_name, "mass_x", q)?;
            let x_m = self.quantity(
                q,
                &format!("{path}.mass_x.{item_name}"),
                Dimension::Length,
                POSITION_MM,
            )?;
            changes.push(Change::MoveItem { item, x_m });
        }
        for (item_name, q) in &s.mass {
            let item = find_item(item_name, "mass", q)?;
            let mass_kg = self.quantity(
                q,
                &format!("{path}.mass.{item_name}"),
                Dimension::Mass,
                MASS_G,
            )?;
            changes.push(Change::ItemMass { item, mass_kg });
        }
        Ok(())
    }

    /// A setup's `wing_incidence` and `stabiliser_incidence` changes (the latter refused
    /// without a stabiliser).
    fn setup_incidences(
        &self,
        path: &str,
        s: &raw::RawSetup,
        has_stabiliser: bool,
        changes: &mut Vec<Change>,
    ) -> Result<(), InputError> {
        if let Some(q) = &s.wing_incidence {
            changes.push(Change::WingIncidence(self.quantity(
                q,
                &format!("{path}.wing_incidence"),
                Dimension::Angle,
                INCIDENCE_DEG,
            )?));
        }
        if let Some(q) = &s.stabiliser_incidence {
            if !has_stabiliser {
                return Err(self.err(
                    &q.span(),
                    &format!("{path}.stabiliser_incidence"),
                    "this aircraft has no stabiliser",
                    Some(
                        "no stabiliser_incidence in a setup of an aircraft without [stabiliser]"
                            .into(),
                    ),
                ));
            }
            changes.push(Change::StabiliserIncidence(self.quantity(
                q,
                &format!("{path}.stabiliser_incidence"),
                Dimension::Angle,
                INCIDENCE_DEG,
            )?));
        }
        Ok(())
    }

    /// A setup's `airfoils` swaps, both names among the file's airfoils.
    fn setup_airfoils(
        &self,
        path: &str,
        airfoils: &BTreeMap<String, Spanned<String>>,
        ids: &BTreeMap<String, AirfoilId>,
        changes: &mut Vec<Change>,
    ) -> Result<(), InputError> {
        for (from, to) in airfoils {
            let known = || {
                let names: Vec<&str> = ids.keys().map(String::as_str).collect();
                Some(one_of(&names))
            };
            let from_id = *ids.get(from).ok_or_else(|| {
                self.err(
                    &to.span(),
                    &format!("{path}.airfoils"),
                    format!("no airfoil named `{}`", token(from)),
                    known(),
                )
            })?;
            let to_id = *ids.get(to.get_ref().trim()).ok_or_else(|| {
                self.err(
                    &to.span(),
                    &format!("{path}.airfoils.{from}"),
                    format!("no airfoil named `{}`", token(to.get_ref())),
                    known(),
                )
            })?;
            changes.push(Change::SwapAirfoil {
                from: from_id,
                to: to_id,
            });
        }
        Ok(())
    }

    fn fuselage(&self, f: &Spanned<raw::RawFuselage>) -> Result<Fuselage, InputError> {
        let span = f.span();
        let f = f.get_ref();
        let get = |q: Option<&Quantity>, key: &str, bounds: Bounds| {
            self.required_quantity(q, &span, "fuselage", key, Dimension::Length, bounds)
        };
        Ok(Fuselage {
            nose_x_m: get(f.nose_x.as_ref(), "nose_x", POSITION_MM)?,
            length_m: get(f.length.as_ref(), "length", FUSELAGE_MM)?,
            max_width_m: get(f.width.as_ref(), "width", FUSELAGE_MM)?,
        })
    }

    fn mass_item(&self, i: usize, m: &Spanned<raw::RawMass>) -> Result<MassItem, InputError> {
        let path = format!("mass[{i}]");
        let span = m.span();
        let m = m.get_ref();
        let name = self.required_name(m.name.as_ref(), &span, &path)?;
        Ok(MassItem {
            name,
            mass_kg: self.required_quantity(
                m.mass.as_ref(),
                &span,
                &path,
                "mass",
                Dimension::Mass,
                MASS_G,
            )?,
            x_m: self.required_quantity(
                m.x.as_ref(),
                &span,
                &path,
                "x",
                Dimension::Length,
                POSITION_MM,
            )?,
            z_m: self.opt_quantity(
                m.z.as_ref(),
                &format!("{path}.z"),
                Dimension::Length,
                POSITION_MM,
            )?,
            tolerance: ItemTolerance {
                mass_kg: self.opt_quantity(
                    m.mass_tolerance.as_ref(),
                    &format!("{path}.mass_tolerance"),
                    Dimension::Mass,
                    MASS_TOLERANCE_G,
                )?,
                x_m: self.opt_quantity(
                    m.x_tolerance.as_ref(),
                    &format!("{path}.x_tolerance"),
                    Dimension::Length,
                    POSITION_TOLERANCE_MM,
                )?,
            },
        })
    }

    /// `[tolerances]`: zero (no uncertainty claimed) where the file says nothing.
    fn tolerances(
        &self,
        t: Option<&Spanned<raw::RawTolerances>>,
    ) -> Result<Tolerances, InputError> {
        let Some(t) = t else {
            return Ok(Tolerances::default());
        };
        let t = t.get_ref();
        Ok(Tolerances {
            mass_kg: self
                .opt_quantity(
                    t.mass.as_ref(),
                    "tolerances.mass",
                    Dimension::Mass,
                    MASS_TOLERANCE_G,
                )?
                .unwrap_or(0.0),
            position_m: self
                .opt_quantity(
                    t.position.as_ref(),
                    "tolerances.position",
                    Dimension::Length,
                    POSITION_TOLERANCE_MM,
                )?
                .unwrap_or(0.0),
        })
    }

    /// `[fin]`: its geometry, and the listed mass item that is the fin (when named), which
    /// must exist.
    fn fin(&self, f: &Spanned<raw::RawFin>, masses: &[MassItem]) -> Result<Fin, InputError> {
        let span = f.span();
        let f = f.get_ref();
        let get = |q: Option<&Quantity>, key: &str, bounds: Bounds| {
            self.required_quantity(q, &span, "fin", key, Dimension::Length, bounds)
        };
        let mass_item = match &f.mass_item {
            None => None,
            Some(n) => {
                let wanted = n.get_ref().trim();
                match masses.iter().find(|m| m.name == printable(wanted)) {
                    Some(m) => Some(m.name.clone()),
                    None => {
                        return Err(self.err(
                            &n.span(),
                            "fin.mass_item",
                            format!("no mass item named `{}`", token(wanted)),
                            Some(format!(
                                "the name of the [[mass]] entry that is the fin: {}",
                                one_of(&masses.iter().map(|m| m.name.as_str()).collect::<Vec<_>>())
                            )),
                        ))
                    }
                }
            }
        };
        Ok(Fin {
            root_le_x_m: get(f.x.as_ref(), "x", POSITION_MM)?,
            root_z_m: get(f.z.as_ref(), "z", POSITION_MM)?,
            root_chord_m: get(f.root_chord.as_ref(), "root_chord", CHORD_MM)?,
            tip_chord_m: self
                .opt_quantity(
                    f.tip_chord.as_ref(),
                    "fin.tip_chord",
                    Dimension::Length,
                    TIP_CHORD_MM,
                )?
                .unwrap_or(0.0),
            height_m: get(f.height.as_ref(), "height", FIN_HEIGHT_MM)?,
            sweep_le_rad: self
                .opt_quantity(f.sweep.as_ref(), "fin.sweep", Dimension::Angle, SWEEP_DEG)?
                .unwrap_or(0.0),
            mass_item,
        })
    }

    fn ballast(&self, i: usize, b: &Spanned<raw::RawBallast>) -> Result<BallastBay, InputError> {
        let path = format!("ballast[{i}]");
        let span = b.span();
        let b = b.get_ref();
        let name = self.required_name(b.name.as_ref(), &span, &path)?;
        let x_m = self.required_quantity(
            b.x.as_ref(),
            &span,
            &path,
            "x",
            Dimension::Length,
            POSITION_MM,
        )?;
        let max_mass_kg = self.required_quantity(
            b.max.as_ref(),
            &span,
            &path,
            "max",
            Dimension::Mass,
            BALLAST_MAX_G,
        )?;
        Ok(BallastBay {
            name,
            x_m,
            z_m: self.opt_quantity(
                b.z.as_ref(),
                &format!("{path}.z"),
                Dimension::Length,
                POSITION_MM,
            )?,
            max_mass_kg,
        })
    }

    fn numerics(&self, raw: Option<&raw::RawNumerics>) -> Result<Numerics, InputError> {
        let mut out = Numerics::default();
        let Some(n) = raw else {
            return Ok(out);
        };
        if let Some(m) = &n.wing_model {
            out.wing_model = match m.get_ref().trim().to_ascii_lowercase().as_str() {
                "vortex-lattice" => WingModel::VortexLattice,
                "lifting-line" => WingModel::LiftingLine,
                other => {
                    return Err(self.err(
                        &m.span(),
                        "numerics.wing_model",
                        format!("unknown wing model `{other}`"),
                        Some("vortex-lattice, lifting-line".into()),
                    ))
                }
            };
        }
        let count = |q: Option<&Quantity>,
                     field: &str,
                     bounds: Bounds|
         -> Result<Option<usize>, InputError> {
            let Some(q) = q else { return Ok(None) };
            let v = self
                .opt_quantity(Some(q), field, Dimension::Plain, bounds)?
                .unwrap_or_default();
            if v.fract() != 0.0 {
                return Err(self.err(
                    &q.span(),
                    field,
                    format!("{v} is not a whole number"),
                    Some(accepted_quantity(Dimension::Plain, bounds)),
                ));
            }
            Ok(Some(v as usize))
        };
        if out.wing_model == WingModel::LiftingLine {
            out.strips_per_half_span = crate::model::DEFAULT_LIFTING_LINE_STATIONS;
            if let Some(q) = &n.chordwise_panels {
                return Err(self.err(
                    &q.span(),
                    "numerics.chordwise_panels",
                    "chordwise panels belong to the vortex lattice; the lifting line has one \
                     vortex per strip",
                    Some("leave it out, or wing_model = \"vortex-lattice\"".into()),
                ));
            }
        }
        if let Some(v) = count(
            n.spanwise_strips.as_ref(),
            "numerics.spanwise_strips",
            STRIPS,
        )? {
            out.strips_per_half_span = v;
        }
        if let Some(v) = count(
            n.chordwise_panels.as_ref(),
            "numerics.chordwise_panels",
            CHORDWISE,
        )? {
            out.chordwise_panels = v;
        }
        let half_panels = out.strips_per_half_span * out.chordwise_panels;
        if out.wing_model == WingModel::VortexLattice && half_panels > MAX_WING_HALF_PANELS {
            let span = n
                .chordwise_panels
                .as_ref()
                .or(n.spanwise_strips.as_ref())
                .map_or(0..0, |q| q.span());
            return Err(self.err(
                &span,
                "numerics",
                format!(
                    "{} strips x {} chordwise panels = {half_panels} lattice panels on each half of the wing is too many",
                    out.strips_per_half_span, out.chordwise_panels
                ),
                Some(format!(
                    "strips x chordwise panels at most {MAX_WING_HALF_PANELS} on each half of the wing"
                )),
            ));
        }
        Ok(out)
    }

    /// A static margin (limit or target): 0 to 40 %, or down to -20 % when the file says a
    /// negative margin is meant; a negative one without that gets an error saying how.
    fn margin(
        &self,
        q: Option<&Quantity>,
        field: &str,
        bounds: Bounds,
    ) -> Result<Option<f64>, InputError> {
        let Some(q) = q else { return Ok(None) };
        let any = Bounds::closed(-1e12, 1e12);
        match self.quantity(q, field, Dimension::Percent, any) {
            Ok(v) if v < 0.0 && bounds.min >= 0.0 => Err(self.err(
                &q.span(),
                field,
                format!(
                    "{} % is a negative static margin: the CG behind the neutral point, an \
                     unstable aircraft",
                    fmt_num_short(100.0 * v)
                ),
                Some(format!(
                    "{}; below 0 only with `negative_margin_intended = true` in [limits] \
                     (for an unstable design flown with a stabilising system)",
                    accepted_quantity(Dimension::Percent, MARGIN_PCT)
                )),
            )),
            _ => self
                .quantity(q, field, Dimension::Percent, bounds)
                .map(Some),
        }
    }

    /// A tail behind the wing, a canard ahead of it: a stabiliser whose root leading edge is
    /// on the wrong side of the wing's is a slip in `x` or a missing `role`.
    fn stabiliser_place(
        &self,
        raw: Option<&Spanned<raw::RawSurface>>,
        s: &Stabiliser,
        wing: &Surface,
    ) -> Result<(), InputError> {
        let (wing_x, stab_x) = (wing.root_le_x_m, s.surface.root_le_x_m);
        let wrong = match s.role {
            StabiliserRole::Tail => stab_x <= wing_x,
            StabiliserRole::Canard => stab_x >= wing_x,
        };
        let span = raw
            .and_then(|r| r.get_ref().x.as_ref().map(|q| q.span()))
            .or_else(|| raw.map(|r| r.span()))
            .unwrap_or(0..0);
        if !wrong {
            // Surfaces that overlap in the top view with less than a tenth of the chord
            // between them intersect (or as good as): neither the wing model nor a real
            // aircraft works like that.
            return match crate::planform::plan_overlap(wing, &s.surface) {
                Some(o) if o.gap_m < INTERSECTING_GAP_CHORDS * o.chord_m => Err(self.err(
                    &span,
                    "stabiliser.x",
                    format!(
                        "the stabiliser overlaps the wing in the top view {:.0} mm from the \
                         centre line with only {:.1} mm between them: the two surfaces intersect",
                        1000.0 * o.y_m,
                        1000.0 * o.gap_m
                    ),
                    Some(format!(
                        "a stabiliser clear of the wing's chord in the top view, or at least \
                         {:.0} mm (a tenth of the chord there) above or below it (stabiliser.z)",
                        (1000.0 * INTERSECTING_GAP_CHORDS * o.chord_m).ceil()
                    )),
                )),
                _ => Ok(()),
            };
        }
        let (problem, accepted) = match s.role {
            StabiliserRole::Tail => (
                format!(
                    "the tail's root leading edge ({} mm) is not behind the wing's ({} mm); a \
                     surface ahead of the wing is a canard",
                    fmt_num_short(1000.0 * stab_x),
                    fmt_num_short(1000.0 * wing_x)
                ),
                format!(
                    "x more than wing.x ({} mm), or role = \"canard\" for a foreplane",
                    fmt_num_short(1000.0 * wing_x)
                ),
            ),
            StabiliserRole::Canard => (
                format!(
                    "the canard's root leading edge ({} mm) is not ahead of the wing's ({} mm)",
                    fmt_num_short(1000.0 * stab_x),
                    fmt_num_short(1000.0 * wing_x)
                ),
                format!(
                    "x less than wing.x ({} mm), or role = \"tail\" for a tailplane",
                    fmt_num_short(1000.0 * wing_x)
                ),
            ),
        };
        Err(self.err(&span, "stabiliser.x", problem, Some(accepted)))
    }

    fn limits(
        &self,
        raw: Option<&raw::RawLimits>,
        stab: Option<&Stabiliser>,
        bounds: Bounds,
    ) -> Result<MarginLimits, InputError> {
        let (dmin, dmax) = match stab.map(|s| s.role) {
            Some(StabiliserRole::Tail) => (
                DEFAULT_MIN_STATIC_MARGIN_TAIL,
                DEFAULT_MAX_STATIC_MARGIN_TAIL,
            ),
            Some(StabiliserRole::Canard) => (
                DEFAULT_MIN_STATIC_MARGIN_CANARD,
                DEFAULT_MAX_STATIC_MARGIN_CANARD,
            ),
            None => (
                DEFAULT_MIN_STATIC_MARGIN_TAILLESS,
                DEFAULT_MAX_STATIC_MARGIN_TAILLESS,
            ),
        };
        let Some(l) = raw else {
            return Ok(MarginLimits {
                min_static_margin: dmin,
                max_static_margin: dmax,
                from_defaults: true,
            });
        };
        let min = self.margin(
            l.min_static_margin.as_ref(),
            "limits.min_static_margin",
            bounds,
        )?;
        let max = self.margin(
            l.max_static_margin.as_ref(),
            "limits.max_static_margin",
            bounds,
        )?;
        let out = MarginLimits {
            min_static_margin: min.unwrap_or(dmin),
            max_static_margin: max.unwrap_or(dmax),
            from_defaults: min.is_none() && max.is_none(),
        };
        if out.max_static_margin <= out.min_static_margin {
            // Both absent means the defaults, which are ordered, so one of them is given here.
            let (field, span, accepted) = match (&l.max_static_margin, &l.min_static_margin) {
                (Some(q), _) => (
                    "limits.max_static_margin",
                    q.span(),
                    format!(
                        "more than the minimum, {:.1} %",
                        100.0 * out.min_static_margin
                    ),
                ),
                (None, Some(q)) => (
                    "limits.min_static_margin",
                    q.span(),
                    format!(
                        "less than the maximum, {:.1} %",
                        100.0 * out.max_static_margin
                    ),
                ),
                (None, None) => ("limits", 0..0, String::new()),
            };
            return Err(self.err(
                &span,
                field,
                "the smallest static margin must be less than the largest",
                Some(accepted),
            ));
        }
        Ok(out)
    }
}

/// "; did you mean 2 m?" when a bare number out of range would be in range in the unit a
/// thousand times larger (metres typed for millimetres, kilograms for grams).
fn unit_slip_hint(v: f64, dim: Dimension, bounds: Bounds) -> String {
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
fn missing_unit_hint(text: &str, dim: Dimension) -> String {
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

/// "one of: a, b, c" for the accepted names of an error message.
fn one_of<S: AsRef<str>>(names: &[S]) -> String {
    format!("one of: {}", crate::printable::name_list(names))
}

/// What a quantity accepts: its range in the default unit, and the units a string may carry.
fn accepted_quantity(dim: Dimension, bounds: Bounds) -> String {
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
fn in_table(table: &str) -> String {
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

fn example_for(dim: Dimension) -> &'static str {
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
fn fmt_num_short(v: f64) -> String {
    let v = v + 0.0;
    if v != 0.0 && !(1e-4..1e9).contains(&v.abs()) {
        return format!("{v:.3e}");
    }
    let s = format!("{v:.4}");
    let s = s.trim_end_matches('0').trim_end_matches('.');
    s.to_string()
}

/// Exactly one shape is checked above; this keeps the match total without a panic.
fn unreachable_shape() -> AirfoilShape {
    AirfoilShape::Naca("0012".into())
}
