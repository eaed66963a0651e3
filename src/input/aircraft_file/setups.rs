//! `[[setup]]`: named configurations that change ballast, masses, incidences or airfoils of
//! the base aircraft.

use super::*;

impl Ctx<'_> {
    /// The `[[setup]]` tables, names unique.
    pub(super) fn setups(
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

    pub(super) fn setup(
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
    pub(super) fn setup_ballast(
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
    pub(super) fn setup_masses(
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
    pub(super) fn setup_incidences(
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
    pub(super) fn setup_airfoils(
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
}
