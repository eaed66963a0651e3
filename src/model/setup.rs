//! Named setups: variations of one aircraft (ballast added, items moved, incidences changed,
//! airfoils swapped) that builders compare before deciding.

use super::{Aircraft, AirfoilId, SurfaceShape};

/// One change a setup makes to the base aircraft. Indices refer to the base aircraft's lists
/// and were checked when the file was read.
#[derive(Debug, Clone, PartialEq)]
pub enum Change {
    /// Add ballast in a bay (index into `ballast_bays`), kg.
    Ballast {
        /// Bay index.
        bay: usize,
        /// Mass, kg.
        mass_kg: f64,
    },
    /// Move a mass item (index into `masses`) to a new x, m.
    MoveItem {
        /// Item index.
        item: usize,
        /// New x, m.
        x_m: f64,
    },
    /// Change a mass item's mass, kg.
    ItemMass {
        /// Item index.
        item: usize,
        /// New mass, kg.
        mass_kg: f64,
    },
    /// Set the wing incidence, rad.
    WingIncidence(f64),
    /// Set the stabiliser incidence, rad.
    StabiliserIncidence(f64),
    /// Use airfoil `to` wherever `from` appears on any surface.
    SwapAirfoil {
        /// Airfoil replaced.
        from: AirfoilId,
        /// Airfoil used instead.
        to: AirfoilId,
    },
}

/// A named setup.
#[derive(Debug, Clone, PartialEq)]
pub struct Setup {
    /// Name shown in comparisons.
    pub name: String,
    /// Changes, applied in order.
    pub changes: Vec<Change>,
    /// A weighing of this setup (2 or 3 supports), when the builder weighed it. Without one,
    /// a setup that changes the masses has no weighing (the base aircraft's weighing is of
    /// other masses); a setup that changes only incidences or airfoils keeps the base's.
    pub weighing: Option<Vec<super::WeighingSupport>>,
}

impl Setup {
    /// The aircraft with this setup's changes applied; its name gets the setup's name appended.
    pub fn apply(&self, base: &Aircraft) -> Aircraft {
        let mut a = base.clone();
        a.name = format!("{} / {}", base.name, self.name);
        a.setups.clear();
        let changes_masses = self.changes.iter().any(|c| {
            matches!(
                c,
                Change::Ballast { .. } | Change::MoveItem { .. } | Change::ItemMass { .. }
            )
        });
        match &self.weighing {
            Some(w) => a.weighing = w.clone(),
            None if changes_masses => a.weighing.clear(),
            None => {}
        }
        for change in &self.changes {
            match *change {
                Change::Ballast { bay, mass_kg } => {
                    if let Some(b) = base.ballast_bays.get(bay) {
                        a.masses.push(super::MassItem {
                            name: format!("ballast in {}", b.name),
                            mass_kg,
                            x_m: b.x_m,
                            z_m: b.z_m,
                            tolerance: Default::default(),
                        });
                    }
                }
                Change::MoveItem { item, x_m } => {
                    if let Some(m) = a.masses.get_mut(item) {
                        m.x_m = x_m;
                    }
                }
                Change::ItemMass { item, mass_kg } => {
                    if let Some(m) = a.masses.get_mut(item) {
                        m.mass_kg = mass_kg;
                    }
                }
                Change::WingIncidence(i) => a.wing.incidence_rad = i,
                Change::StabiliserIncidence(i) => {
                    if let Some(s) = a.stabiliser.as_mut() {
                        s.surface.incidence_rad = i;
                    }
                }
                Change::SwapAirfoil { from, to } => {
                    let swap = |id: &mut AirfoilId| {
                        if *id == from {
                            *id = to;
                        }
                    };
                    let mut surfaces = vec![&mut a.wing];
                    if let Some(s) = a.stabiliser.as_mut() {
                        surfaces.push(&mut s.surface);
                    }
                    for s in surfaces {
                        match &mut s.shape {
                            SurfaceShape::Panels(panels) => {
                                for p in panels {
                                    swap(&mut p.root_airfoil);
                                    swap(&mut p.tip_airfoil);
                                }
                            }
                            SurfaceShape::Elliptic(e) => {
                                swap(&mut e.root_airfoil);
                                swap(&mut e.tip_airfoil);
                            }
                        }
                    }
                }
            }
        }
        a
    }
}
