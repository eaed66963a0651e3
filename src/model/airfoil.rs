//! Airfoil descriptions as the aircraft file gives them.

/// Index of an airfoil in [`crate::model::Aircraft::airfoils`].
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord)]
pub struct AirfoilId(pub usize);

/// Which 2-D method turns an airfoil's shape into a section model.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum SectionMethod {
    /// Exact conformal-map solution (Joukowski or Karman-Trefftz airfoils only).
    Exact,
    /// Thin-airfoil theory on the mean line.
    Thin,
    /// Linear-strength vortex panel method on the coordinates.
    Panel,
    /// The panel method with an integral boundary layer at a Reynolds number (a polar).
    Viscous,
}

impl SectionMethod {
    /// Lower-case name used in files, tables and JSON.
    pub fn as_str(self) -> &'static str {
        match self {
            SectionMethod::Exact => "exact",
            SectionMethod::Thin => "thin",
            SectionMethod::Panel => "panel",
            SectionMethod::Viscous => "viscous",
        }
    }
}

/// The shape of an airfoil.
#[derive(Debug, Clone, PartialEq)]
pub enum AirfoilShape {
    /// A NACA designation, normalised to upper case without spaces ("2412", "23012").
    Naca(String),
    /// A Joukowski airfoil by thickness and camber ratio (fractions of chord).
    Joukowski {
        /// Greatest thickness / chord (0 < t/c < 0.4).
        thickness_ratio: f64,
        /// Greatest camber / chord (0 <= f/c < 0.15).
        camber_ratio: f64,
    },
    /// A Karman-Trefftz airfoil: Joukowski-like with a finite trailing-edge angle.
    KarmanTrefftz {
        /// Greatest thickness / chord.
        thickness_ratio: f64,
        /// Greatest camber / chord.
        camber_ratio: f64,
        /// Trailing-edge included angle, rad.
        trailing_edge_angle_rad: f64,
    },
    /// Coordinates read from a file, in chord fractions as the file gives them
    /// (a closed loop trailing edge -> one surface -> leading edge -> other surface).
    Coordinates {
        /// Title line of the file, or the file stem.
        title: String,
        /// Points (x, y), as read.
        points: Vec<[f64; 2]>,
    },
}

/// An airfoil with its builder-given options.
#[derive(Debug, Clone, PartialEq)]
pub struct Airfoil {
    /// Name used in the aircraft file to refer to it.
    pub name: String,
    /// The shape.
    pub shape: AirfoilShape,
    /// Section maximum lift coefficient, when the builder gives one.
    pub cl_max: Option<f64>,
    /// Method requested; `None` chooses the default for the shape.
    pub method: Option<SectionMethod>,
    /// Chord Reynolds number for the viscous method, when the builder gives one.
    pub reynolds: Option<f64>,
    /// Transition setting for the viscous method (critical amplification factor N), when
    /// given; 9 otherwise.
    pub transition_n: Option<f64>,
}
