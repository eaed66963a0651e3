//! Shared builders for the lifting-line validation tests: plain surfaces and section models.
#![allow(dead_code)]

use trimline::model::{AirfoilId, EllipticShape, Panel, SectionMethod, Surface, SurfaceShape};
use trimline::section::{ClMaxSource, SectionModel};

/// A thin-airfoil-like section: lift slope `a0` per rad, zero-lift angle `alpha0_rad`,
/// cm_ac zero, ac at the quarter chord, stall limits +-`cl_max`.
pub fn section(a0: f64, alpha0_rad: f64, cl_max: f64) -> SectionModel {
    SectionModel {
        method: SectionMethod::Thin,
        alpha_zero_lift_rad: alpha0_rad,
        cl_alpha_per_rad: a0,
        cm_ac: 0.0,
        x_ac_c: 0.25,
        cl_max,
        cl_min: -cl_max,
        cl_max_source: ClMaxSource::Given,
        reynolds_number: None,
        polar: None,
    }
}

/// Thin-airfoil flat plate (2 pi per rad) that never stalls in the tests' range.
pub fn flat_plate() -> SectionModel {
    section(2.0 * std::f64::consts::PI, 0.0, 10.0)
}

/// One trapezoidal panel with airfoil 0 at both ends.
pub fn panel(span_m: f64, root_chord_m: f64, tip_chord_m: f64, sweep_le_deg: f64) -> Panel {
    Panel {
        span_m,
        root_chord_m,
        tip_chord_m,
        sweep_le_rad: sweep_le_deg.to_radians(),
        dihedral_rad: 0.0,
        tip_twist_rad: 0.0,
        root_airfoil: AirfoilId(0),
        tip_airfoil: AirfoilId(0),
    }
}

/// A surface of panels with its root leading edge at (x, z) and zero incidence.
pub fn surface(name: &str, x_m: f64, z_m: f64, panels: Vec<Panel>) -> Surface {
    Surface {
        name: name.into(),
        root_le_x_m: x_m,
        root_le_z_m: z_m,
        incidence_rad: 0.0,
        shape: SurfaceShape::Panels(panels),
    }
}

/// A straight tapered wing of aspect ratio `aspect_ratio`, taper `taper`, span `span_m`,
/// unswept quarter-chord line.
pub fn tapered_wing(aspect_ratio: f64, taper: f64, span_m: f64) -> Surface {
    let area = span_m * span_m / aspect_ratio;
    let root = 2.0 * area / (span_m * (1.0 + taper));
    let tip = taper * root;
    let half = 0.5 * span_m;
    // Leading-edge sweep that keeps the quarter chord straight: tan = (c_r - c_t) / (4 y).
    let sweep = ((root - tip) / (4.0 * half)).atan().to_degrees();
    surface("wing", 0.0, 0.0, vec![panel(half, root, tip, sweep)])
}

/// An elliptic wing of aspect ratio `aspect_ratio` and span `span_m`.
pub fn elliptic_wing(aspect_ratio: f64, span_m: f64) -> Surface {
    let area = span_m * span_m / aspect_ratio;
    let root = 4.0 * area / (std::f64::consts::PI * span_m);
    Surface {
        name: "wing".into(),
        root_le_x_m: 0.0,
        root_le_z_m: 0.0,
        incidence_rad: 0.0,
        shape: SurfaceShape::Elliptic(EllipticShape {
            semispan_m: 0.5 * span_m,
            root_chord_m: root,
            dihedral_rad: 0.0,
            tip_twist_rad: 0.0,
            root_airfoil: AirfoilId(0),
            tip_airfoil: AirfoilId(0),
        }),
    }
}

/// Options that select the Phillips-Snyder lifting line (for the tests that check it against
/// Glauert's classical solution), with the default discretisation otherwise.
pub fn lifting_line_options() -> trimline::lifting_line::LiftingLineOptions {
    trimline::lifting_line::LiftingLineOptions {
        model: trimline::lifting_line::WingModel::LiftingLine,
        stations_per_half_span: trimline::model::DEFAULT_LIFTING_LINE_STATIONS,
        ..trimline::lifting_line::LiftingLineOptions::default()
    }
}

/// The system of `surfaces` together (the first is the wing and gives the reference), each with
/// `sections` and no elevator.
pub fn system_of(
    surfaces: &[&Surface],
    sections: &[SectionModel],
    options: trimline::lifting_line::LiftingLineOptions,
) -> trimline::lifting_line::MultiSurfaceSystem {
    use trimline::lifting_line::{MultiSurfaceSystem, Reference, SurfaceInput};
    let inputs: Vec<SurfaceInput<'_>> = surfaces
        .iter()
        .map(|s| SurfaceInput {
            surface: s,
            sections,
            elevator: None,
        })
        .collect();
    MultiSurfaceSystem::new(&inputs, Reference::of_surface(surfaces[0]), options).unwrap()
}

/// An empty scratch folder `group/name` under Cargo's temporary folder for tests.
pub fn scratch_in(group: &str, name: &str) -> std::path::PathBuf {
    let dir = std::path::Path::new(env!("CARGO_TARGET_TMPDIR"))
        .join(group)
        .join(name);
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

/// Run the trimline binary with `args` in `dir` (report dates fixed by SOURCE_DATE_EPOCH).
pub fn run_trimline(args: &[&str], dir: &std::path::Path) -> std::process::Output {
    std::process::Command::new(env!("CARGO_BIN_EXE_trimline"))
        .args(args)
        .current_dir(dir)
        .env("SOURCE_DATE_EPOCH", "86400")
        .output()
        .expect("the binary runs")
}

/// The suite's small test glider as aircraft-file text (a `&'static str`, so a module can keep
/// it in a `const`): airfoils `w` (NACA 2412, cl_max 1.2) and `t` (NACA 0009, cl_max 0.9); a
/// wing of 200 mm root chord at 2 deg incidence with one panel of 1000 mm; a stabiliser of
/// one panel. Each argument is literal text, lines ending in a newline: `top` after the name
/// (e.g. a datum), `wing` before the wing's root chord (e.g. its x), `wing_panel` after the
/// panel's span (its tip chord, or nothing for a rectangular wing), `stabiliser` its keys
/// before its airfoil (place, incidences, root chord), `stabiliser_panel` its panel, `rest`
/// what follows (masses, ballast, targets).
#[macro_export]
macro_rules! small_glider {
    (
        name: $name:literal,
        top: $top:literal,
        wing: $wing:literal,
        wing_panel: $wing_panel:literal,
        stabiliser: $stab:literal,
        stabiliser_panel: $stab_panel:literal,
        rest: $rest:literal $(,)?
    ) => {
        concat!(
            "name = \"",
            $name,
            "\"\n",
            $top,
            "[airfoils.w]\nnaca = \"2412\"\ncl_max = 1.2\n",
            "[airfoils.t]\nnaca = \"0009\"\ncl_max = 0.9\n",
            "[wing]\n",
            $wing,
            "root_chord = 200\nincidence = 2\nairfoil = \"w\"\n",
            "[[wing.panel]]\nspan = 1000\n",
            $wing_panel,
            "[stabiliser]\n",
            $stab,
            "airfoil = \"t\"\n",
            "[[stabiliser.panel]]\n",
            $stab_panel,
            $rest
        )
    };
}
