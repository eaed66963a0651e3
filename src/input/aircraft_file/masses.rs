//! `[[mass]]`, `[[ballast]]`, `[weighing]`, `[fuselage]`, `[fin]` and `[tolerances]`: what
//! the aircraft weighs and where, and the builder's own tolerances of it.

use super::*;

impl Ctx<'_> {
    /// The `[[mass]]` items: at least one, names unique, a total above zero and a wing loading
    /// on `wing` within `MAX_WING_LOADING_KG_M2`.
    pub(super) fn masses(
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
            // The heaviest item is the likely slip (a mass in kg written bare, read as g).
            let k = (0..masses.len())
                .max_by(|&a, &b| masses[a].mass_kg.total_cmp(&masses[b].mass_kg))
                .unwrap_or(0);
            let span = raw_masses[k]
                .get_ref()
                .mass
                .as_ref()
                .map_or_else(|| raw_masses[k].span(), |m| m.span());
            return Err(self.err(
                &span,
                &format!("mass[{k}].mass"),
                format!(
                    "the masses add up to {} g on a wing of {} dm^2: a wing loading of {:.0} \
                     kg/m^2, more than any aircraft this tool is for; the heaviest item, '{}', \
                     is {} g",
                    fmt_num_short(1000.0 * total),
                    fmt_num_short(100.0 * area_m2),
                    total / area_m2,
                    crate::printable::printable(&masses[k].name),
                    fmt_num_short(1000.0 * masses[k].mass_kg)
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
    pub(super) fn ballast_bays(
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

    pub(super) fn mass_item(
        &self,
        i: usize,
        m: &Spanned<raw::RawMass>,
    ) -> Result<MassItem, InputError> {
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

    pub(super) fn ballast(
        &self,
        i: usize,
        b: &Spanned<raw::RawBallast>,
    ) -> Result<BallastBay, InputError> {
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

    /// The supports of a weighing at `path` (`weighing`, or `setup[i].weighing`): none, or 2 or
    /// 3 with readings adding up to more than zero.
    pub(super) fn weighing(
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

    pub(super) fn fuselage(&self, f: &Spanned<raw::RawFuselage>) -> Result<Fuselage, InputError> {
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

    /// `[fin]`: its geometry, and the listed mass item that is the fin (when named), which
    /// must exist.
    pub(super) fn fin(
        &self,
        f: &Spanned<raw::RawFin>,
        masses: &[MassItem],
    ) -> Result<Fin, InputError> {
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

    /// `[tolerances]`: zero (no uncertainty claimed) where the file says nothing.
    pub(super) fn tolerances(
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
}
