//! A solved section (exact conformal map, thin-airfoil theory or panel method), able to give
//! cl, cm and the surface pressures at any angle of attack.

use super::*;

/// An exact conformal-map solution.
#[derive(Debug, Clone, PartialEq)]
pub enum ExactSolution {
    /// Joukowski section.
    Joukowski(JoukowskiAirfoil),
    /// Karman-Trefftz section.
    KarmanTrefftz(KarmanTrefftzAirfoil),
}

/// A solved airfoil, able to give cl and cm at any angle of attack (rad, from the chord line).
#[derive(Debug, Clone, PartialEq)]
pub enum SectionSolution {
    /// Exact solution.
    Exact(ExactSolution),
    /// Thin-airfoil theory.
    Thin(ThinAirfoil),
    /// Vortex panel method.
    Panel(PanelSolution),
}

/// One surface point with its pressure coefficient (chord fractions).
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SurfacePressure {
    /// x/c.
    pub x_c: f64,
    /// y/c.
    pub y_c: f64,
    /// Pressure coefficient.
    pub cp: f64,
}

/// Surface points used for the exact solution's pressure output.
const EXACT_SURFACE_POINTS: usize = 200;

impl SectionSolution {
    /// The method.
    pub fn method(&self) -> SectionMethod {
        match self {
            SectionSolution::Exact(_) => SectionMethod::Exact,
            SectionSolution::Thin(_) => SectionMethod::Thin,
            SectionSolution::Panel(_) => SectionMethod::Panel,
        }
    }

    /// Lift coefficient at `alpha_rad` (no stall).
    pub fn cl(&self, alpha_rad: f64) -> f64 {
        match self {
            SectionSolution::Exact(ExactSolution::Joukowski(j)) => j.cl(alpha_rad),
            SectionSolution::Exact(ExactSolution::KarmanTrefftz(k)) => k.cl(alpha_rad),
            SectionSolution::Thin(t) => t.cl(alpha_rad),
            SectionSolution::Panel(p) => p.cl(alpha_rad),
        }
    }

    /// Moment coefficient about the quarter chord at `alpha_rad`, positive nose up.
    pub fn cm_quarter_chord(&self, alpha_rad: f64) -> f64 {
        match self {
            SectionSolution::Exact(ExactSolution::Joukowski(j)) => j.cm_quarter_chord(alpha_rad),
            SectionSolution::Exact(ExactSolution::KarmanTrefftz(k)) => {
                k.cm_quarter_chord(alpha_rad)
            }
            SectionSolution::Thin(t) => t.cm_quarter_chord(),
            SectionSolution::Panel(p) => p.cm_quarter_chord(alpha_rad),
        }
    }

    /// Zero-lift angle, rad.
    pub fn alpha_zero_lift_rad(&self) -> f64 {
        match self {
            SectionSolution::Exact(ExactSolution::Joukowski(j)) => j.alpha_zero_lift_rad(),
            SectionSolution::Exact(ExactSolution::KarmanTrefftz(k)) => k.alpha_zero_lift_rad(),
            SectionSolution::Thin(t) => t.alpha_zero_lift_rad(),
            SectionSolution::Panel(p) => p.alpha_zero_lift_rad(),
        }
    }

    /// Lift slope at zero lift, per rad.
    pub fn cl_alpha_per_rad(&self) -> f64 {
        match self {
            SectionSolution::Exact(ExactSolution::Joukowski(j)) => j.cl_alpha_per_rad(),
            SectionSolution::Exact(ExactSolution::KarmanTrefftz(k)) => k.cl_alpha_per_rad(),
            SectionSolution::Thin(t) => t.cl_alpha_per_rad(),
            SectionSolution::Panel(p) => p.cl_alpha_per_rad(),
        }
    }

    /// Surface pressure at `alpha_rad`, from the trailing edge over the upper surface; `None`
    /// for thin-airfoil theory, which has no surface.
    pub fn surface(&self, alpha_rad: f64) -> Option<Vec<SurfacePressure>> {
        let from_circle = |v: Vec<circle_map::SurfacePoint>| {
            v.into_iter()
                .map(|p| SurfacePressure {
                    x_c: p.x_c,
                    y_c: p.y_c,
                    cp: p.cp,
                })
                .collect()
        };
        match self {
            SectionSolution::Exact(ExactSolution::Joukowski(j)) => {
                Some(from_circle(j.surface(EXACT_SURFACE_POINTS, alpha_rad)))
            }
            SectionSolution::Exact(ExactSolution::KarmanTrefftz(k)) => {
                Some(from_circle(k.surface(EXACT_SURFACE_POINTS, alpha_rad)))
            }
            SectionSolution::Thin(_) => None,
            SectionSolution::Panel(p) => Some(
                p.surface(alpha_rad)
                    .into_iter()
                    .map(|q| SurfacePressure {
                        x_c: q.x_c,
                        y_c: q.y_c,
                        cp: q.cp,
                    })
                    .collect(),
            ),
        }
    }
}

/// The few numbers of a solution that its section model is made from (see
/// [`model_from_figures`]): kept so that a section model can be made again without solving
/// the section again.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SolutionFigures {
    /// Method of the solution.
    pub method: SectionMethod,
    /// Zero-lift angle, rad.
    pub alpha_zero_lift_rad: f64,
    /// Lift slope at zero lift, per rad.
    pub cl_alpha_per_rad: f64,
    /// cl at the zero-lift angle less and plus [`AC_STEP_RAD`].
    pub cl_either_side: (f64, f64),
    /// Moment about the quarter chord at the same two angles.
    pub cm_either_side: (f64, f64),
    /// Moment about the quarter chord at the zero-lift angle.
    pub cm_zero_lift: f64,
}

impl SolutionFigures {
    /// The figures of `solution`.
    pub fn of(solution: &SectionSolution) -> SolutionFigures {
        let alpha0 = solution.alpha_zero_lift_rad();
        let (a1, a2) = (alpha0 - AC_STEP_RAD, alpha0 + AC_STEP_RAD);
        SolutionFigures {
            method: solution.method(),
            alpha_zero_lift_rad: alpha0,
            cl_alpha_per_rad: solution.cl_alpha_per_rad(),
            cl_either_side: (solution.cl(a1), solution.cl(a2)),
            cm_either_side: (solution.cm_quarter_chord(a1), solution.cm_quarter_chord(a2)),
            cm_zero_lift: solution.cm_quarter_chord(alpha0),
        }
    }
}
