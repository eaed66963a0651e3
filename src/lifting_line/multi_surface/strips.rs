//! The strips of every surface: each surface cut spanwise over both halves, cosine spacing
//! with panel joints and control ends as break points, and the inputs checked first
//! (Phillips and Snyder 2000, cosine clustering).
//!
//! # Swept wings
//! At the root of a swept (or dihedral) wing the bound vortex is kinked, and the velocity the
//! other half's bound vortex induces near the kink grows without bound as the control point
//! approaches it. The discrete solution of a swept wing therefore changes slowly with the
//! number of stations (lift slope about -4 % per doubling at 30 deg sweep, aspect ratio 8),
//! where a straight wing converges to 0.01 %; even a model wing with about 2 deg of
//! quarter-chord sweep at the root drifts by about 0.25 % per doubling from 40 stations per
//! half-span (its neutral point by about 0.2 % of the MAC). Dihedral alone does not do this:
//! an unswept bound vortex induces no normal velocity on the other half. This is a property of the lifting-line model at a
//! kink, not of the solver; the default station count gives lift slopes within about 5 % of
//! the Helmbold-Diederich formula up to 30 deg of sweep (tests/suite/lifting_line_sweep.rs; 16 % high
//! at 45 deg). The loading dips at the kink, so the Trefftz-plane span efficiency of a swept
//! wing comes out low (about 0.57 at 30 deg, aspect ratio 8; the same wing unswept gives 0.94):
//! treat induced drag of strongly swept wings as unreliable. Stations are not clustered at a
//! kinked root unless asked, because clustering strengthens the dependence.

use super::*;

pub(super) fn check_options(
    o: &LiftingLineOptions,
    r: &Reference,
    surface_count: usize,
) -> Result<(), LiftingLineError> {
    let invalid = |parameter, value, range| {
        Err(LiftingLineError::InvalidInput {
            parameter,
            value,
            range,
        })
    };
    if !(2..=500).contains(&o.stations_per_half_span) {
        return invalid(
            "stations_per_half_span",
            o.stations_per_half_span as f64,
            "2 to 500",
        );
    }
    if !(1..=40).contains(&o.chordwise_panels) {
        return invalid("chordwise_panels", o.chordwise_panels as f64, "1 to 40");
    }
    if !(o.wake_angle_rad.is_finite() && o.wake_angle_rad.abs() < 1.5) {
        return invalid("wake_angle_rad", o.wake_angle_rad, "|angle| < 1.5 rad");
    }
    if !(o.self_core_fraction.is_finite() && o.self_core_fraction > 0.0) {
        return invalid("self_core_fraction", o.self_core_fraction, "finite and > 0");
    }
    if !(o.wake_core_fraction.is_finite() && o.wake_core_fraction > 0.0) {
        return invalid("wake_core_fraction", o.wake_core_fraction, "finite and > 0");
    }
    if !(o.newton_relative_tolerance.is_finite() && o.newton_relative_tolerance > 0.0) {
        return invalid(
            "newton_relative_tolerance",
            o.newton_relative_tolerance,
            "finite and > 0",
        );
    }
    for (parameter, value) in [
        ("reference area_m2", r.area_m2),
        ("reference mac_m", r.mac_m),
        ("reference span_m", r.span_m),
    ] {
        if !(value.is_finite() && value > 0.0) {
            return invalid(parameter, value, "finite and > 0");
        }
    }
    if surface_count == 0 {
        return Err(LiftingLineError::SurfaceCount {
            what: "surfaces given",
            got: 0,
            expected: 1,
        });
    }
    Ok(())
}

/// Refuse an elevator with non-finite effects or span fractions outside
/// 0 <= inboard < outboard <= 1.
pub(super) fn check_elevators(inputs: &[SurfaceInput<'_>]) -> Result<(), LiftingLineError> {
    for e in inputs.iter().filter_map(|i| i.elevator) {
        let ok = e.dalpha0_per_rad_deflection.is_finite()
            && e.dcm_ac_per_rad_deflection.is_finite()
            && (0.0..1.0).contains(&e.inboard_fraction)
            && e.outboard_fraction > e.inboard_fraction
            && e.outboard_fraction <= 1.0;
        if !ok {
            return Err(LiftingLineError::InvalidInput {
                parameter: "elevator span fractions",
                value: e.outboard_fraction - e.inboard_fraction,
                range: "finite effects, 0 <= inboard < outboard <= 1",
            });
        }
    }
    Ok(())
}

/// Refuse a surface whose panels name an airfoil index beyond the section models given.
pub(super) fn check_section_ids(input: &SurfaceInput<'_>) -> Result<(), LiftingLineError> {
    let surface = input.surface;
    let check_id = |index: usize| {
        if index < input.sections.len() {
            Ok(())
        } else {
            Err(LiftingLineError::MissingSection {
                surface: surface.name.clone(),
                index,
                available: input.sections.len(),
            })
        }
    };
    match &surface.shape {
        SurfaceShape::Panels(panels) => {
            for p in panels {
                check_id(p.root_airfoil.0)?;
                check_id(p.tip_airfoil.0)?;
            }
        }
        SurfaceShape::Elliptic(e) => {
            check_id(e.root_airfoil.0)?;
            check_id(e.tip_airfoil.0)?;
        }
    }
    Ok(())
}

/// Cut every surface into its stations (in input order) and describe each surface: name, range
/// of stations, area, aspect ratio and elevator.
pub(super) fn discretise_surfaces(
    inputs: &[SurfaceInput<'_>],
    options: &LiftingLineOptions,
) -> Result<(Vec<Station>, Vec<SurfaceInfo>), LiftingLineError> {
    let mut stations = Vec::new();
    let mut surfaces = Vec::with_capacity(inputs.len());
    for (index, input) in inputs.iter().enumerate() {
        let start = stations.len();
        let per_half = strips_per_half(options, input.surface, inputs[0].surface);
        discretise(input, index, options, per_half, &mut stations)?;
        let g = planform::geometry(input.surface);
        surfaces.push(SurfaceInfo {
            name: input.surface.name.clone(),
            range: start..stations.len(),
            area_m2: g.area_m2,
            aspect_ratio: g.aspect_ratio,
            elevator: input.elevator,
        });
    }
    Ok((stations, surfaces))
}

/// The mirror image about y = 0 of every station: `start + end - 1 - i` on its own surface.
pub(super) fn mirror_stations(stations: &[Station], surfaces: &[SurfaceInfo]) -> Vec<usize> {
    stations
        .iter()
        .enumerate()
        .map(|(i, st)| {
            let r = &surfaces[st.surface].range;
            r.start + r.end - 1 - i
        })
        .collect()
}

/// Quarter-chord point at signed in-plane distance `s` (negative to port).
pub(super) fn quarter_chord_point(surface: &Surface, s: f64) -> Vec3 {
    let st = station_at(surface, s.abs());
    let sign = if s < 0.0 { -1.0 } else { 1.0 };
    Vec3::new(st.x_le_m + 0.25 * st.chord_m, sign * st.y_m, st.z_m)
}

/// Strips per half-span of `surface`. The lifting line gives every surface the same count
/// (its tail stations then line up with the wing's trailing legs, see the module
/// documentation). The vortex lattice keeps the strip width of the first surface (normally
/// the wing) on the others, with at least 8 strips (or the requested count, if smaller):
/// a tail of a third of the wing's span then costs a third of the panels, and the lattice
/// has no line vortices to line up.
pub(super) fn strips_per_half(
    options: &LiftingLineOptions,
    surface: &Surface,
    first: &Surface,
) -> usize {
    let n = options.stations_per_half_span;
    match options.model {
        WingModel::LiftingLine => n,
        WingModel::VortexLattice => {
            let ratio = half_span_length_m(surface) / half_span_length_m(first);
            let scaled = (n as f64 * ratio).round();
            if scaled.is_finite() {
                (scaled as usize).clamp(n.min(8), n)
            } else {
                n
            }
        }
    }
}

/// Leading-edge point and streamwise chord at signed in-plane distance `s` (negative to port).
pub(super) fn leading_edge_point(surface: &Surface, s: f64) -> (Vec3, f64) {
    let st = station_at(surface, s.abs());
    let sign = if s < 0.0 { -1.0 } else { 1.0 };
    (Vec3::new(st.x_le_m, sign * st.y_m, st.z_m), st.chord_m)
}

/// True when the quarter-chord line has a kink at the root (sweep or dihedral there).
pub(super) fn root_is_kinked(surface: &Surface) -> bool {
    let total = half_span_length_m(surface);
    let eps = 1e-6 * total;
    let d = quarter_chord_point(surface, eps) - quarter_chord_point(surface, 0.0);
    let len = d.norm();
    len > 0.0 && (d.x.abs() + d.z.abs()) / len > 1e-9
}

/// The segments of one surface, port tip to starboard tip, as (start, end, control point) in
/// the signed in-plane span coordinate, m. Nodes follow a cosine distribution over the whole
/// span (clustered at the tips), or over each half when the root is kinked and is to be
/// clustered at. Interior break points (panel joints, control ends) are not clustered at: the
/// nearest node is moved onto each, because stations crowded against a kink of the bound
/// vortex line (a change of dihedral or sweep at a joint) pick up a spurious local peak of
/// lift that would be taken for the start of the stall. Control points sit at the cosine
/// parameter's midpoint of each segment. Built for the starboard half and mirrored, so the
/// layout is exactly symmetric.
pub(super) fn segments(
    total: f64,
    half_breaks: &[f64],
    split_at_root: bool,
    per_half: usize,
    uniform: bool,
) -> Vec<(f64, f64, f64)> {
    use std::f64::consts::PI;
    // Cosine map of the starboard half: parameter t to span s, and back.
    let (t0, m) = if split_at_root {
        (0.0, per_half.max(2))
    } else {
        (0.5, per_half.max(1))
    };
    let at = |t: f64| match (uniform, split_at_root) {
        (true, true) => total * t,
        (true, false) => total * (2.0 * t - 1.0),
        (false, true) => total * 0.5 * (1.0 - (PI * t).cos()),
        (false, false) => -total * (PI * t).cos(),
    };
    let param = |s: f64| match (uniform, split_at_root) {
        (true, true) => (s / total).clamp(0.0, 1.0),
        (true, false) => (0.5 * (s / total + 1.0)).clamp(0.5, 1.0),
        (false, true) => (1.0 - 2.0 * s / total).clamp(-1.0, 1.0).acos() / PI,
        (false, false) => (-s / total).clamp(-1.0, 1.0).acos() / PI,
    };
    let mut nodes: Vec<f64> = (0..=m)
        .map(|k| at(t0 + (1.0 - t0) * k as f64 / m as f64))
        .collect();
    nodes[0] = 0.0;
    nodes[m] = total;
    let mut fixed = vec![false; m + 1];
    fixed[0] = true;
    fixed[m] = true;
    let mut extra = Vec::new();
    for &b in half_breaks.iter().filter(|b| **b < total * (1.0 - 1e-9)) {
        let nearest = (1..m).min_by(|&i, &j| (nodes[i] - b).abs().total_cmp(&(nodes[j] - b).abs()));
        match nearest {
            Some(k) if !fixed[k] => {
                nodes[k] = b;
                fixed[k] = true;
            }
            _ => extra.push(b),
        }
    }
    nodes.extend(extra);
    nodes.sort_by(f64::total_cmp);
    nodes.dedup_by(|a, b| (*a - *b).abs() <= 1e-9 * total);
    let starboard: Vec<(f64, f64, f64)> = nodes
        .windows(2)
        .map(|w| (w[0], w[1], at(0.5 * (param(w[0]) + param(w[1])))))
        .collect();
    starboard
        .iter()
        .rev()
        .map(|&(a, b, c)| (-b, -a, -c))
        .chain(starboard.iter().copied())
        .collect()
}

/// Append the stations of one surface, port tip to starboard tip.
pub(super) fn discretise(
    input: &SurfaceInput<'_>,
    surface_index: usize,
    options: &LiftingLineOptions,
    per_half: usize,
    out: &mut Vec<Station>,
) -> Result<(), LiftingLineError> {
    let surface = input.surface;
    let total = half_span_length_m(surface);
    if !(total.is_finite() && total > 0.0) {
        return Err(LiftingLineError::InvalidInput {
            parameter: "half-span length_m",
            value: total,
            range: "finite and > 0",
        });
    }
    check_section_ids(input)?;
    let half_breaks = station_break_points_m(input, total);
    let semispan_y = station_at(surface, total).y_m;
    let cluster = match options.model {
        WingModel::LiftingLine => options.cluster_at_kinked_root,
        WingModel::VortexLattice => true,
    };
    let split_at_root = cluster && root_is_kinked(surface);
    for segment in segments(
        total,
        &half_breaks,
        split_at_root,
        per_half,
        options.uniform_spacing,
    ) {
        out.push(strip_station(
            input,
            surface_index,
            total,
            semispan_y,
            segment,
        )?);
    }
    Ok(())
}

/// The break points of one half of the surface along its span line, m (`total_m` its length):
/// panel joints and the ends of a part-span control, sorted.
pub(super) fn station_break_points_m(input: &SurfaceInput<'_>, total_m: f64) -> Vec<f64> {
    let surface = input.surface;
    // Signed break points, port tip to starboard tip.
    let half_breaks: Vec<f64> = break_points_m(surface)
        .into_iter()
        .filter(|b| *b > 1e-12 * total_m)
        .collect();
    // The ends of a part-span control are break points too, so that no segment straddles one.
    let mut half_breaks = half_breaks;
    if let Some(e) = &input.elevator {
        for f in [e.inboard_fraction, e.outboard_fraction] {
            let s = f * total_m;
            if s > 1e-9 * total_m
                && s < (1.0 - 1e-9) * total_m
                && half_breaks.iter().all(|b| (b - s).abs() > 1e-6 * total_m)
            {
                half_breaks.push(s);
            }
        }
        half_breaks.sort_by(f64::total_cmp);
    }
    half_breaks
}

/// The station of one strip of the surface, from the strip's ends `s0`, `s1` and control point
/// `s_cp` along the span line (m, negative to port); `total` is the half-span length and
/// `semispan_y` the tip's y, m.
pub(super) fn strip_station(
    input: &SurfaceInput<'_>,
    surface_index: usize,
    total: f64,
    semispan_y: f64,
    (s0, s1, s_cp): (f64, f64, f64),
) -> Result<Station, LiftingLineError> {
    let surface = input.surface;
    let a = quarter_chord_point(surface, s0);
    let b = quarter_chord_point(surface, s1);
    let (le_a, chord_a_m) = leading_edge_point(surface, s0);
    let (le_b, chord_b_m) = leading_edge_point(surface, s1);
    let t = (s_cp - s0) / (s1 - s0);
    let control = a + (b - a) * t;
    let st = station_at(surface, s_cp.abs());
    let dl = b - a;
    let width_m = (dl.y * dl.y + dl.z * dl.z).sqrt();
    if !(width_m > 0.0 && st.chord_m > 0.0 && dl.y > 0.0) {
        return Err(LiftingLineError::InvalidInput {
            parameter: "station chord_m or width_m",
            value: st.chord_m.min(width_m),
            range: "> 0 at every control point (surface must have area and span)",
        });
    }
    let normal = Vec3::new(0.0, -dl.z, dl.y) / width_m;
    let control_share = input.elevator.map_or(0.0, |e| {
        let (lo, hi) = (s0.abs().min(s1.abs()), s0.abs().max(s1.abs()));
        let covered =
            (hi.min(e.outboard_fraction * total) - lo.max(e.inboard_fraction * total)).max(0.0);
        (covered / (hi - lo)).clamp(0.0, 1.0)
    });
    let section = input.sections[st.airfoil_inboard.0]
        .blend(&input.sections[st.airfoil_outboard.0], st.airfoil_weight);
    if !(section.cl_alpha_per_rad.is_finite() && section.cl_alpha_per_rad > 0.0) {
        return Err(LiftingLineError::InvalidInput {
            parameter: "section cl_alpha_per_rad",
            value: section.cl_alpha_per_rad,
            range: "finite and > 0",
        });
    }
    Ok(Station {
        surface: surface_index,
        s_m: s_cp,
        y_m: control.y,
        x_m: control.x,
        z_m: control.z,
        chord_m: st.chord_m,
        dy_m: dl.y,
        width_m,
        geometric_angle_rad: surface.incidence_rad + st.twist_rad,
        normal_z: normal.z,
        percent_semispan: 100.0 * control.y.abs() / semispan_y,
        section,
        control_share,
        node_a: a,
        node_b: b,
        control,
        normal,
        le_a,
        le_b,
        chord_a_m,
        chord_b_m,
        control_t: t,
    })
}
