//! `[airfoils]`: each airfoil's shape (NACA digits, Joukowski, Karman-Trefftz, a coordinate
//! file), its section method, and the Reynolds number a viscous section is computed at.

use super::*;

impl Ctx<'_> {
    pub(super) fn airfoils(
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
    pub(super) fn airfoil(
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
    pub(super) fn naca_shape(
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
    pub(super) fn joukowski_shape(
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
    pub(super) fn airfoil_method(
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
    pub(super) fn karman_trefftz(
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

    pub(super) fn coordinates_shape(
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
            crate::input::file::read_input_file(&path, crate::input::file::COORDINATES_FILE).map_err(|e| {
                self.err(
                    &span,
                    field,
                    // The file reader's own accepted range speaks of standard input, which an
                    // aircraft file cannot name: this error gives its own.
                    format!(
                        "cannot use the coordinates file: {}",
                        e.to_string()
                            .split(" (accepted:")
                            .next()
                            .unwrap_or_default()
                    ),
                    Some(
                        "a path relative to the aircraft file, naming a regular file of at most 1 MB"
                            .into(),
                    ),
                )
            })?;
        let (title, points) =
            crate::input::coordinates::parse_coordinates(&text, &path.display().to_string())?;
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

    pub(super) fn airfoil_ref(
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

    /// The Reynolds number of each viscous airfoil that has none in the file: from the target
    /// trim speed and the mean of the chords at the panel ends that use the airfoil (wing and
    /// stabiliser), in the file's air. Without a target trim speed the file must give it.
    pub(super) fn viscous_reynolds(
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
}

/// Exactly one shape is checked above; this keeps the match total without a panic.
pub(super) fn unreachable_shape() -> AirfoilShape {
    AirfoilShape::Naca("0012".into())
}
