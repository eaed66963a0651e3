//! The lifting-line system of an aircraft for balance and trim: the stabiliser referred to the
//! free stream by its dynamic-pressure ratio, the pitch control's lift-equivalent deflection
//! (plain-flap correction) and the real deflection that gives it back.

use super::*;

/// A section's data referred to the free stream's dynamic pressure for a surface working at
/// `eta` times it, on a surface of aspect ratio `aspect_ratio` (see the module doc): cl limits
/// and cm_ac times eta, the lift slope lowered so that the surface's finite-span slope is eta
/// times its own. eta = 1 returns the section unchanged.
pub fn referred_to_free_stream(
    section: &SectionModel,
    eta: f64,
    aspect_ratio: f64,
) -> SectionModel {
    let a0 = section.cl_alpha_per_rad;
    let a = if aspect_ratio > 0.0 && a0 > 0.0 && eta > 0.0 {
        1.0 / (1.0 / (eta * a0) + (1.0 / eta - 1.0) / (std::f64::consts::PI * aspect_ratio))
    } else {
        eta * a0
    };
    SectionModel {
        cl_alpha_per_rad: a,
        cm_ac: eta * section.cm_ac,
        cl_max: eta * section.cl_max,
        cl_min: eta * section.cl_min,
        ..section.clone()
    }
}

/// The deflection the linear model uses for a real pitch-control deflection (the correction
/// applied); an all-moving surface is not corrected.
pub fn model_deflection_rad(control: &PitchControl, real_rad: f64) -> f64 {
    if control.chord_fraction > 0.0 {
        flap_correction::effective_deflection_rad(control.chord_fraction, real_rad)
    } else {
        real_rad
    }
}

/// The real deflection that gives the linear model's deflection `model_rad` (the smallest
/// one); beyond the chart's 60 deg its last factor is held.
pub fn real_deflection_rad(control: &PitchControl, model_rad: f64) -> f64 {
    if control.chord_fraction > 0.0 {
        flap_correction::deflection_for_effective_rad(control.chord_fraction, model_rad)
            .unwrap_or_else(|| {
                let top = flap_correction::CHART_MAX_DEFLECTION_DEG.to_radians();
                model_rad / flap_correction::lift_effectiveness_factor(control.chord_fraction, top)
            })
    } else {
        model_rad
    }
}

/// The largest trailing-edge-up deflection of the linear model that full up throw gives, rad
/// (a negative number).
pub(super) fn model_full_up_rad(control: &PitchControl) -> f64 {
    if control.chord_fraction > 0.0 {
        -flap_correction::max_effective_deflection_rad(control.chord_fraction, control.max_up_rad)
    } else {
        -control.max_up_rad
    }
}

/// Build the lifting-line system of an aircraft with its pitch control, the stabiliser's
/// elevator or a tailless wing's elevons (Glauert plain flap per radian of lift-equivalent
/// deflection; the flap theory moment is about the quarter chord, which is where the section
/// models carry it), and the stabiliser referred to the free stream by its dynamic-pressure
/// ratio.
pub fn build_system(
    aircraft: &Aircraft,
    sections: &[SectionModel],
    options: LiftingLineOptions,
) -> Result<MultiSurfaceSystem, LiftingLineError> {
    let elevator = aircraft.pitch_control().and_then(|p| {
        let effect = if p.chord_fraction > 0.0 {
            let f = crate::section::flap_effectiveness(p.chord_fraction).ok()?;
            ElevatorEffect::full_span(-f.tau, f.dcm_quarter_chord_ddelta_per_rad)
        } else {
            // An all-moving surface: the control turns the whole section.
            ElevatorEffect::full_span(-1.0, 0.0)
        };
        Some(ElevatorEffect {
            inboard_fraction: p.inboard_fraction,
            outboard_fraction: p.outboard_fraction,
            ..effect
        })
    });
    let stabiliser_sections: Vec<SectionModel> = match &aircraft.stabiliser {
        Some(stab) => {
            let aspect_ratio = crate::planform::geometry(&stab.surface).aspect_ratio;
            sections
                .iter()
                .map(|s| referred_to_free_stream(s, stab.dynamic_pressure_ratio, aspect_ratio))
                .collect()
        }
        None => Vec::new(),
    };
    let mut inputs = vec![SurfaceInput::wing_of(aircraft, sections, elevator)];
    if let Some(stab) = &aircraft.stabiliser {
        let eta = stab.dynamic_pressure_ratio;
        inputs.push(SurfaceInput {
            surface: &stab.surface,
            sections: &stabiliser_sections,
            elevator: elevator.map(|e| ElevatorEffect {
                dcm_ac_per_rad_deflection: eta * e.dcm_ac_per_rad_deflection,
                ..e
            }),
        });
    }
    MultiSurfaceSystem::new(&inputs, Reference::of_surface(&aircraft.wing), options)
}
