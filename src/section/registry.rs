//! What each section method needs and what it returns, in one table.
//!
//! Adding a method means a row here and its solver file; callers ask the registry instead of
//! matching over the methods themselves (which shapes a method accepts, whether it needs a
//! Reynolds number, how to cite it).

use crate::model::{AirfoilShape, SectionMethod};

/// What a method needs from the airfoil.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Needs {
    /// A Joukowski or Karman-Trefftz map (the exact solution).
    ConformalMap,
    /// A mean line (NACA designation or one measured from coordinates).
    MeanLine,
    /// Surface coordinates (any shape can be turned into them).
    Coordinates,
    /// Surface coordinates and a chord Reynolds number (and the transition setting N).
    CoordinatesAndReynolds,
}

/// What a method returns.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Returns {
    /// A linear lift curve and a moment, valid at every angle (potential flow).
    LinearLiftCurve,
    /// A polar over angle of attack at one Reynolds number: cl, cd and cm.
    Polar,
}

/// One row of the registry.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct MethodInfo {
    /// The method.
    pub method: SectionMethod,
    /// Name in files, tables and JSON.
    pub name: &'static str,
    /// What it needs.
    pub needs: Needs,
    /// What it returns.
    pub returns: Returns,
    /// The method and its source in a few words, for reports.
    pub described_as: &'static str,
}

/// The methods, in the order they are offered.
pub const METHODS: [MethodInfo; 4] = [
    MethodInfo {
        method: SectionMethod::Exact,
        name: "exact",
        needs: Needs::ConformalMap,
        returns: Returns::LinearLiftCurve,
        described_as: "exact conformal mapping (Milne-Thomson, Theoretical Aerodynamics)",
    },
    MethodInfo {
        method: SectionMethod::Thin,
        name: "thin",
        needs: Needs::MeanLine,
        returns: Returns::LinearLiftCurve,
        described_as:
            "thin-airfoil theory (Abbott and von Doenhoff, Theory of Wing Sections, 1959, ch. 4)",
    },
    MethodInfo {
        method: SectionMethod::Panel,
        name: "panel",
        needs: Needs::Coordinates,
        returns: Returns::LinearLiftCurve,
        described_as:
            "linear-strength vortex panels (Katz and Plotkin, Low-Speed Aerodynamics, 2nd ed., 2001)",
    },
    MethodInfo {
        method: SectionMethod::Viscous,
        name: "viscous",
        needs: Needs::CoordinatesAndReynolds,
        returns: Returns::Polar,
        described_as: "vortex panels with an integral boundary layer (Thwaites 1949; Drela and \
                       Giles 1987 e^N; Head 1958; Squire and Young 1937)",
    },
];

/// The registry row of `method`.
pub fn info(method: SectionMethod) -> &'static MethodInfo {
    METHODS
        .iter()
        .find(|m| m.method == method)
        .unwrap_or(&METHODS[0])
}

/// The method named `name` (lower case), if any.
pub fn by_name(name: &str) -> Option<&'static MethodInfo> {
    METHODS.iter().find(|m| m.name == name)
}

/// The accepted names, comma separated (for error messages).
pub fn names() -> String {
    METHODS
        .iter()
        .map(|m| m.name)
        .collect::<Vec<_>>()
        .join(", ")
}

/// Whether `method` can treat `shape`.
pub fn accepts(method: SectionMethod, shape: &AirfoilShape) -> bool {
    match info(method).needs {
        Needs::ConformalMap => matches!(
            shape,
            AirfoilShape::Joukowski { .. } | AirfoilShape::KarmanTrefftz { .. }
        ),
        Needs::MeanLine | Needs::Coordinates | Needs::CoordinatesAndReynolds => true,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn every_method_has_one_row_and_its_own_name() {
        for m in [
            SectionMethod::Exact,
            SectionMethod::Thin,
            SectionMethod::Panel,
            SectionMethod::Viscous,
        ] {
            assert_eq!(info(m).method, m);
            assert_eq!(info(m).name, m.as_str());
            assert_eq!(by_name(m.as_str()).map(|i| i.method), Some(m));
        }
        assert!(!accepts(
            SectionMethod::Exact,
            &AirfoilShape::Naca("0012".into())
        ));
        assert_eq!(names(), "exact, thin, panel, viscous");
    }
}
