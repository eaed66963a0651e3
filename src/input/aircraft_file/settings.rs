//! `[targets]`, `[air]`, `[numerics]` and `[limits]`: the figures the analysis is asked
//! for, the air it flies in, the wing model's counts and the static-margin limits.

use super::*;

impl Ctx<'_> {
    /// The `[targets]`: static margin within `margin_bounds` (percent), trim and top speeds.
    pub(super) fn targets(
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

    pub(super) fn air(&self, raw: Option<&raw::RawAir>) -> Result<Air, InputError> {
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

    pub(super) fn numerics(&self, raw: Option<&raw::RawNumerics>) -> Result<Numerics, InputError> {
        let mut out = Numerics::default();
        let Some(n) = raw else {
            return Ok(out);
        };
        if let Some(m) = &n.wing_model {
            out.wing_model = self.wing_model(m)?;
        }
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
        if let Some(v) = self.whole_count(
            n.spanwise_strips.as_ref(),
            "numerics.spanwise_strips",
            STRIPS,
        )? {
            out.strips_per_half_span = v;
        }
        if let Some(v) = self.whole_count(
            n.chordwise_panels.as_ref(),
            "numerics.chordwise_panels",
            CHORDWISE,
        )? {
            out.chordwise_panels = v;
        }
        self.lattice_size(n, &out)?;
        Ok(out)
    }

    /// `numerics.wing_model`: one of the two wing models, by name.
    fn wing_model(&self, m: &Spanned<String>) -> Result<WingModel, InputError> {
        match m.get_ref().trim().to_ascii_lowercase().as_str() {
            "vortex-lattice" => Ok(WingModel::VortexLattice),
            "lifting-line" => Ok(WingModel::LiftingLine),
            other => Err(self.err(
                &m.span(),
                "numerics.wing_model",
                format!("unknown wing model `{other}`"),
                Some("vortex-lattice, lifting-line".into()),
            )),
        }
    }

    /// An optional whole-number count within `bounds` (strips, panels).
    fn whole_count(
        &self,
        q: Option<&Quantity>,
        field: &str,
        bounds: Bounds,
    ) -> Result<Option<usize>, InputError> {
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
    }

    /// The vortex lattice on each half of the wing stays within its panel limit.
    fn lattice_size(&self, n: &raw::RawNumerics, out: &Numerics) -> Result<(), InputError> {
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
        Ok(())
    }

    /// A static margin (limit or target): 0 to 40 %, or down to -20 % when the file says a
    /// negative margin is meant; a negative one without that gets an error saying how.
    pub(super) fn margin(
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

    pub(super) fn limits(
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
