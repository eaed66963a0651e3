//! The report's chart series: the spanwise loading, the trim speed against CG and the
//! glide polar cases.

use super::*;

/// Local lift coefficient and local section cl_max at one station of the half-span.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct SpanPoint {
    /// Spanwise station 2y/b, 0 at the root, 1 at the tip.
    pub eta: f64,
    /// Local lift coefficient.
    pub cl: f64,
    /// Local section maximum lift coefficient.
    pub cl_max: f64,
}

/// One loading case for the spanwise chart.
#[derive(Debug, Clone, PartialEq)]
pub struct SpanCase {
    /// Legend text ("at trim, CL 0.52").
    pub label: String,
    /// Points from root to tip.
    pub points: Vec<SpanPoint>,
}

/// Spanwise lift against local cl_max, at trim and near stall.
#[derive(Debug, Clone, PartialEq)]
pub struct SpanwiseData {
    /// How the cl values were obtained, printed under the chart.
    pub method: String,
    /// At trim (absent when there is no trim).
    pub trim: Option<SpanCase>,
    /// Near stall.
    pub near_stall: Option<SpanCase>,
    /// Station where stall begins, 2y/b, when the method can tell.
    pub stall_onset_eta: Option<f64>,
}

/// Trim speed at CG positions across (and a little beyond) the recommended band.
#[derive(Debug, Clone, PartialEq)]
pub struct TrimSweep {
    /// (CG mm aft of the wing root leading edge, trim speed m/s or `None` where it does not trim).
    pub points: Vec<(f64, Option<f64>)>,
    /// Recommended band, mm aft of the wing root leading edge (forward, aft).
    pub band_mm: (f64, f64),
    /// Present CG, mm aft of the wing root leading edge.
    pub cg_mm: f64,
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
    /// How the speeds were obtained.
    pub method: String,
}

/// One configuration's glide polar for the sink chart.
#[derive(Debug, Clone, PartialEq)]
pub struct GlideCase {
    /// Legend label.
    pub label: String,
    /// (airspeed m/s, sink m/s) of the points that trim within the throws, rising speed.
    pub points: Vec<(f64, f64)>,
    /// Minimum sink (speed, sink).
    pub min_sink: (f64, f64),
    /// Best glide (speed, sink) and its glide ratio.
    pub best_glide: (f64, f64, f64),
    /// Stall speed, m/s.
    pub stall_speed_m_s: f64,
}

/// The sink chart: this configuration first, then the ballast cases of the file.
#[derive(Debug, Clone, PartialEq)]
pub struct GlideChart {
    /// The cases.
    pub cases: Vec<GlideCase>,
    /// How the polar was obtained.
    pub method: String,
}

/// The glide case of a polar, labelled `label`.
fn case_of(p: &crate::analysis::glide::GlidePolar, label: String) -> GlideCase {
    GlideCase {
        label,
        points: p
            .points
            .iter()
            .filter(|q| q.flyable)
            .map(|q| (q.speed_m_s, q.sink_m_s))
            .collect(),
        min_sink: (p.min_sink.point.speed_m_s, p.min_sink.point.sink_m_s),
        best_glide: (
            p.best_glide.point.speed_m_s,
            p.best_glide.point.sink_m_s,
            p.best_glide.point.glide_ratio,
        ),
        stall_speed_m_s: p.stall_speed_m_s,
    }
}

/// The glide case of an analysed configuration, labelled `label`.
pub fn glide_case(a: &Analysis, label: &str) -> Option<GlideCase> {
    a.glide_polar
        .as_ref()
        .map(|p| case_of(p, label.to_string()))
}

/// Most curves on the sink chart (the configuration, its flap settings, ballast cases).
pub const MAX_GLIDE_CASES: usize = 4;

/// The sink chart of `a`: its polar, then its flap settings' polars, then the `ballast`
/// cases (label, analysis), at most [`MAX_GLIDE_CASES`] curves in all.
pub fn glide_chart(a: &Analysis, ballast: &[(String, Analysis)]) -> Option<GlideChart> {
    let mass = |x: &Analysis| fmt(1000.0 * x.mass.total_kg, 0);
    let flapped = !a.flap_polars.is_empty();
    let first_label = if flapped {
        format!("{} g, flaps neutral", mass(a))
    } else {
        format!("{} g", mass(a))
    };
    let mut cases = vec![glide_case(a, &first_label)?];
    for s in &a.flap_polars {
        if let Ok(p) = &s.polar {
            cases.push(case_of(
                p,
                format!("flaps {}", crate::printable::printable(&s.name)),
            ));
        }
    }
    for (name, b) in ballast {
        if let Some(c) = glide_case(b, &format!("{name}: {} g", mass(b))) {
            cases.push(c);
        }
    }
    cases.truncate(MAX_GLIDE_CASES);
    Some(GlideChart {
        cases,
        method: "Trimmed at each speed; section drag from viscous polars at each strip's \
                 Reynolds number, induced drag from the wake, fuselage by flat-plate build-up. \
                 Still air."
            .to_string(),
    })
}

/// Number of points along the half-span for the spanwise chart.
const SPAN_POINTS: usize = 41;

/// Number of CG positions in the trim-speed sweep.
const SWEEP_POINTS: usize = 41;

/// The spanwise chart from the lifting-line solution: the wing's local cl against its local
/// cl_max at trim and at the critical-section stall, with the station where stall begins.
pub fn lifting_line_spanwise(a: &Analysis) -> Option<SpanwiseData> {
    use crate::stability::trim::wing_starboard;
    let f = a.full.as_ref()?;
    let stall = f.stall.as_ref()?;
    let half_b = 0.5 * a.wing_geometry.span_m;
    if half_b <= 0.0 {
        return None;
    }
    let case = |label: String, r: &crate::lifting_line::LiftingLineResult| SpanCase {
        label,
        points: wing_starboard(r)
            .into_iter()
            .map(|st| SpanPoint {
                eta: st.y_m / half_b,
                cl: st.cl,
                cl_max: if st.cl_ratio > 0.0 {
                    st.cl / st.cl_ratio
                } else {
                    f64::NAN
                },
            })
            .filter(|p| p.cl_max.is_finite())
            .collect(),
    };
    let onset = a
        .headline
        .stall_location
        .as_ref()
        .filter(|l| l.surface == 0)
        .map(|l| l.percent_semispan / 100.0);
    Some(SpanwiseData {
        method: format!(
            "All surfaces together: {}; stall where the first section reaches its cl max \
             (critical-section method, conservative).",
            crate::output::wing_model_method(&a.numerics)
        ),
        trim: f
            .trim
            .as_ref()
            .map(|t| case(format!("at trim, CL {}", fmt(t.cl, 2)), &t.result)),
        near_stall: Some(case(
            format!("at stall, CL max {}", fmt(stall.cl_max, 2)),
            &stall.result,
        )),
        stall_onset_eta: onset,
    })
}

/// The spanwise chart fed from the strip estimate: local section cl_max along the span from
/// the wing's airfoils, and a uniform cl equal to the aircraft CL at trim and at CL_max. This
/// is a stand-in until the lifting-line loading is available; it cannot say where stall
/// begins, so `stall_onset_eta` is `None`.
pub fn strip_spanwise(aircraft: &Aircraft, a: &Analysis) -> SpanwiseData {
    let wing = &aircraft.wing;
    let total = planform::half_span_length_m(wing);
    let half_b = 0.5 * a.wing_geometry.span_m;
    let stations: Vec<(f64, f64)> = (0..SPAN_POINTS)
        .map(|i| {
            let s = total * i as f64 / (SPAN_POINTS - 1) as f64;
            let st = planform::station_at(wing, s);
            let sec = classical::section_at(&a.sections, &st);
            let eta = if half_b > 0.0 { st.y_m / half_b } else { 0.0 };
            (eta, sec.cl_max)
        })
        .collect();
    let case = |label: String, cl: f64| SpanCase {
        label,
        points: stations
            .iter()
            .map(|&(eta, cl_max)| SpanPoint { eta, cl, cl_max })
            .collect(),
    };
    let est = &a.classical;
    SpanwiseData {
        method: "Strip estimate: uniform cl equal to the aircraft CL (no spanwise loading model \
                 yet), so the stall station is not predicted."
            .to_string(),
        trim: est
            .trim
            .map(|t| case(format!("strip estimate at trim, CL {}", fmt(t.cl, 2)), t.cl)),
        near_stall: Some(case(
            format!("strip estimate near stall, CL max {}", fmt(est.cl_max, 2)),
            est.cl_max,
        )),
        stall_onset_eta: None,
    }
}

/// Trim speed against CG position across the recommended band ([`trim_sweep_with`] gives the
/// range): from the lifting-line model when it solved, else from the closed-form estimate.
pub fn trim_sweep(aircraft: &Aircraft, a: &Analysis) -> TrimSweep {
    let fuselage = crate::analysis::fuselage_cm_alpha(aircraft, &a.wing);
    if a.full.is_some() {
        let input = crate::analysis::trim_input(
            aircraft,
            &a.sections,
            &a.mass,
            &a.air,
            fuselage,
            &crate::analysis::AnalysisOptions::default(),
        );
        if let Ok(sweeper) = crate::stability::trim::TrimSweeper::new(input) {
            return trim_sweep_with(
                aircraft,
                a,
                |cg_x_m| sweeper.trim_speed_m_s(cg_x_m),
                &format!(
                    "{} re-trimmed at each CG position, same mass and incidences, {} neutral.",
                    capitalised(crate::output::wing_model_name(&a.numerics)),
                    aircraft.pitch_control_name()
                ),
            );
        }
    }
    let place = aircraft.stabiliser.as_ref().map(|s| match s.role {
        StabiliserRole::Tail => StabiliserPlace::Tail,
        StabiliserRole::Canard => StabiliserPlace::Canard,
    });
    trim_sweep_with(
        aircraft,
        a,
        |cg_x_m| {
            classical::estimate(&EstimateInput {
                wing: &a.wing,
                stabiliser: a.stabiliser.as_ref().zip(place),
                mass_kg: a.mass.total_kg,
                cg_x_m,
                density_kg_m3: a.air.density_kg_m3,
                fuselage_cm_alpha_per_rad: fuselage,
                stabiliser_dynamic_pressure_ratio: aircraft
                    .stabiliser
                    .as_ref()
                    .map_or(1.0, |s| s.dynamic_pressure_ratio),
                downwash_factor: 1.0,
            })
            .trim
            .map(|t| t.speed_m_s)
        },
        "Closed-form estimate re-run at each CG position, same mass and incidences.",
    )
}

/// Trim speed against CG position with any trim solver: `speed_at(cg_x_m)` gives the trim
/// speed (m/s) with the CG at `cg_x_m` (m aft of the datum), or `None` where the aircraft does
/// not trim. The CG runs over the recommended band, extended by a quarter of its width each
/// side and far enough to include the present CG. Non-finite speeds are dropped.
pub fn trim_sweep_with(
    aircraft: &Aircraft,
    a: &Analysis,
    speed_at: impl Fn(f64) -> Option<f64>,
    method: &str,
) -> TrimSweep {
    let root_le = aircraft.wing.root_le_x_m;
    let (fwd, aft) = (a.band.forward_x_m, a.band.aft_x_m);
    let width = (aft - fwd).abs().max(1e-3);
    let lo = (fwd - 0.25 * width).min(a.mass.cg_x_m - 0.05 * width);
    let hi = (aft + 0.25 * width).max(a.mass.cg_x_m + 0.05 * width);
    let points = (0..SWEEP_POINTS)
        .map(|i| {
            let x = lo + (hi - lo) * i as f64 / (SWEEP_POINTS - 1) as f64;
            let v = speed_at(x).filter(|v| v.is_finite());
            ((x - root_le) * 1000.0, v)
        })
        .collect();
    TrimSweep {
        points,
        band_mm: ((fwd - root_le) * 1000.0, (aft - root_le) * 1000.0),
        cg_mm: (a.mass.cg_x_m - root_le) * 1000.0,
        stall_speed_m_s: a.headline.stall_speed_m_s,
        method: method.to_string(),
    }
}
