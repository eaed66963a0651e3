//! `[wing]` and `[stabiliser]`: the lifting surfaces (straight panels or an ellipse), their
//! control spans (elevator, elevons) and the stabiliser's place ahead of or behind the wing.

use super::*;

impl Ctx<'_> {
    /// The stabiliser (from its table) and the elevons (from `[wing.elevons]`), refusing
    /// elevons on an aircraft that has a stabiliser.
    pub(super) fn stabiliser_and_elevons(
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

    /// The main wing, refusing the keys that only a stabiliser has.
    pub(super) fn wing(
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

    pub(super) fn surface(
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
        let shape = self.shape(path, &table_span, raw, root_chord, root_airfoil, ids)?;
        Ok(Surface {
            name: path.to_string(),
            root_le_x_m: x,
            root_le_z_m: z,
            incidence_rad: incidence,
            shape,
        })
    }

    /// A surface's planform: its `[[path.panel]]` tables in order from the root (each
    /// continuing the chord, twist and airfoil of the one before), or one `[path.ellipse]`.
    fn shape(
        &self,
        path: &str,
        table_span: &Range<usize>,
        raw: &raw::RawSurface,
        root_chord: f64,
        root_airfoil: AirfoilId,
        ids: &BTreeMap<String, AirfoilId>,
    ) -> Result<SurfaceShape, InputError> {
        match (raw.panel.is_empty(), raw.ellipse.as_ref()) {
            (false, Some(e)) => Err(self.err(
                &e.span(),
                &format!("{path}.ellipse"),
                "a surface is either panels or an ellipse, not both",
                Some(format!(
                    "[[{path}.panel]] tables or one [{path}.ellipse] table"
                )),
            )),
            (true, None) => Err(self.err(
                table_span,
                &format!("{path}.panel"),
                "no planform given",
                Some(
                    "one or more [[{path}.panel]] tables, or one [{path}.ellipse] table"
                        .replace("{path}", path),
                ),
            )),
            (true, Some(e)) => Ok(SurfaceShape::Elliptic(self.ellipse(
                path,
                e,
                root_chord,
                root_airfoil,
                ids,
            )?)),
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

                Ok(SurfaceShape::Panels(panels))
            }
        }
    }

    pub(super) fn panel(
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

    pub(super) fn ellipse(
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
    pub(super) fn control_span(
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

    pub(super) fn elevons(&self, e: &Spanned<raw::RawElevons>) -> Result<PitchControl, InputError> {
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

    pub(super) fn stabiliser(
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

    /// A tail behind the wing, a canard ahead of it: a stabiliser whose root leading edge is
    /// on the wrong side of the wing's is a slip in `x` or a missing `role`.
    pub(super) fn stabiliser_place(
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
}
