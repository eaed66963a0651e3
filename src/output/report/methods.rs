//! The report's methods footer: each method used and its source, one line each.

use crate::analysis::Analysis;
use crate::model::{Aircraft, SectionMethod, StabiliserRole};

/// Methods and their sources, one line each (the report's footer; `check` prints them too).
pub fn methods(aircraft: &Aircraft, a: &Analysis) -> Vec<String> {
    let mut out = vec![sections_method(a)];
    out.push(
        "Planform area, span and MAC: exact integrals (Raymer, Aircraft Design: A Conceptual Approach, 6th ed., sec. 7.3)."
            .to_string(),
    );
    out.push(stability_method(aircraft, a));
    out.extend([
        "Stall: first section to reach its cl max, or a stabiliser section its negative cl limit, on the trimmed path (critical-section method); stall speed from W = 1/2 rho V\u{b2} S CLmax (Anderson, Introduction to Flight, ch. 5). Cross-check: Helmbold lift slope and the closed-form neutral point (McCormick, Aerodynamics, Aeronautics and Flight Mechanics, ch. 8-9).",
        "Glide: trimmed polar, viscous strip drag, wake induced drag (Raymer, ch. 12). Air: ISA (US Standard Atmosphere, 1976).",
    ]
    .iter()
    .map(|s| s.to_string()));
    if let Some(line) = fin_method(a) {
        out.push(line);
    }
    if let Some(line) = neutral_point_range_method(a) {
        out.push(line);
    }
    if a.cg_spread.sigma_m > 0.0 {
        out.push(
            "CG range: your mass and position tolerances as standard deviations, propagated to first order (ISO Guide to the Expression of Uncertainty in Measurement, sec. 5.1)."
                .to_string(),
        );
    }
    out
}

/// The methods line of the neutral point's range: the spread of each input that moves it
/// (those with no share, like a tail's on a tailless wing, are left out).
fn neutral_point_range_method(a: &Analysis) -> Option<String> {
    use crate::stability::uncertainty::{COMMON_SPREADS as S, INPUT_NAMES};
    let spread = a.neutral_point_spread;
    if !(spread.sigma_m.is_finite() && spread.sigma_m > 0.0) {
        return None;
    }
    let values = [
        format!("{:.2}", S.dynamic_pressure_ratio),
        format!("{:.0} %", 100.0 * S.downwash_gradient),
        format!("{:.0} %", 100.0 * S.fuselage),
        format!("{:.0} %", 100.0 * S.wing_section_slope),
        format!("{:.0} %", 100.0 * S.stabiliser_section_slope),
        format!("{:.1} % of the MAC", 100.0 * S.wing_aerodynamic_centre_mac),
    ];
    let items: Vec<String> = INPUT_NAMES
        .iter()
        .zip(values)
        .zip(spread.contributions_m)
        .filter(|(_, share)| share.abs() > 0.0)
        .map(|((name, value), _)| format!("{name} {value}"))
        .collect();
    Some(format!(
        "Neutral-point range: 2 standard deviations of assumed spreads (judgements, common practice), to first order (ISO GUM sec. 5.1): {}.",
        items.join(", ")
    ))
}

/// The methods line of the airfoil sections used.
fn sections_method(a: &Analysis) -> String {
    let mut used: Vec<SectionMethod> = a.sections.iter().map(|s| s.method).collect();
    used.sort_by_key(|m| m.as_str());
    used.dedup();
    let sections: Vec<&str> = used
        .iter()
        .map(|m| crate::section::registry::info(*m).described_as)
        .collect();
    format!(
        "Airfoil sections: {}; section cl max as given in the file or a default.",
        sections.join("; ")
    )
}

/// The methods line of the wing model, neutral point and trim, with the moment reference, the
/// stabiliser's dynamic-pressure ratio, the pitch control and the fuselage.
fn stability_method(aircraft: &Aircraft, a: &Analysis) -> String {
    let surfaces = surfaces_method(aircraft);
    let pitch = pitch_control_method(aircraft);
    let eta = dynamic_pressure_method(aircraft);
    let fuselage = if aircraft.fuselage.is_some() {
        "; fuselage by Gilruth and White (NACA Report 711)"
    } else {
        ""
    };
    let reference_height = match a.mass.cg_z_m {
        Some(z) => format!(
            "; moment reference at the CG's height z = {:.0} mm",
            z * 1000.0
        ),
        None => "; moment reference at the wing root's height (not every mass has a z)".to_string(),
    };
    format!(
        "{surfaces}; neutral point where dCm/dCL = 0, static margin, trim from Cm = 0 about the CG (Etkin and Reid, Dynamics of Flight, 3rd ed., ch. 2){reference_height}{eta}{pitch}{fuselage}."
    )
}

/// Which surfaces the wing model holds together, and the model.
fn surfaces_method(aircraft: &Aircraft) -> String {
    match aircraft.stabiliser.as_ref().map(|s| s.role) {
        Some(StabiliserRole::Tail) => format!(
            "Wing and tail together: {}, tail in the wing's wake",
            crate::output::wing_model_method(&aircraft.numerics)
        ),
        Some(StabiliserRole::Canard) => format!(
            "Canard and wing together: {}, wing in the canard's wake",
            crate::output::wing_model_method(&aircraft.numerics)
        ),
        None => format!(
            "Tailless wing: {}",
            crate::output::wing_model_method(&aircraft.numerics)
        ),
    }
}

/// The pitch control's method (empty without one).
fn pitch_control_method(aircraft: &Aircraft) -> String {
    match aircraft.pitch_control() {
        Some(p) if p.chord_fraction > 0.0 => format!(
            "; {} by Glauert's plain-flap theory (Houghton and Carpenter, Aerodynamics for Engineering Students) with the hinge-gap loss of 15 % (Raymer, Aircraft Design, 6th ed., sec. 16.3); the further loss at deflections beyond about 12 deg is not modelled, so the forward CG limit from full up throw is somewhat optimistic",
            aircraft.pitch_control_name()
        ),
        Some(_) => "; all-moving stabiliser turned as a whole".to_string(),
        None => String::new(),
    }
}

/// The stabiliser's dynamic-pressure ratio (empty without a stabiliser).
fn dynamic_pressure_method(aircraft: &Aircraft) -> String {
    match &aircraft.stabiliser {
        Some(s) => format!(
            "; {} dynamic-pressure ratio {:.2}{}",
            if s.role == StabiliserRole::Canard {
                "canard"
            } else {
                "tail"
            },
            s.dynamic_pressure_ratio,
            if s.role == StabiliserRole::Tail
                && (s.dynamic_pressure_ratio - crate::model::DEFAULT_TAIL_DYNAMIC_PRESSURE_RATIO)
                    .abs()
                    < 1e-12
            {
                " (default; Etkin and Reid, Raymer)"
            } else {
                ""
            }
        ),
        None => String::new(),
    }
}

/// The fin's methods line, when the aircraft has a fin or a V-tail.
fn fin_method(a: &Analysis) -> Option<String> {
    let note = a.fin.as_ref()?;
    let mut parts = Vec::new();
    if let Some(f) = &note.fin {
        parts.push(format!(
            "fin volume coefficient S_v l_v / (S b) {:.3} (typical 0.02 to 0.09, Raymer, Aircraft Design, sec. 6.4)",
            f.volume_coefficient
        ));
    }
    if let Some(v) = &note.vee_tail {
        parts.push(format!(
            "the V-tail is the fin: side area x sin\u{b2} of the dihedral (Purser and Campbell, NACA Report 823), volume coefficient {:.3}, no fin caution",
            v.volume_coefficient
        ));
    }
    Some(format!(
        "Fin: {}; a lateral note only, it does not enter the pitch figures.",
        parts.join("; ")
    ))
}
