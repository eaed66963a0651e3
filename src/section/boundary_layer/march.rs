//! The boundary-layer march along one surface, from the stagnation point to the trailing edge.
//!
//! Laminar flow by Thwaites' method while the amplification factor of the envelope method
//! stays below N_crit; transition where it reaches N_crit, or earlier where a trip is set.
//! Where the laminar layer separates first (`lambda = -0.09`), the model is the turbulent
//! reattachment one: the separated shear layer is taken to turn turbulent at once, and the
//! turbulent march starts there with the shape factor of a separated layer
//! ([`BUBBLE_START_H`]); whether it reattaches is left to the entrainment equation (a layer
//! that cannot bring H below separation again is a burst bubble and shows as turbulent
//! separation). After a natural transition the turbulent march starts with `H =`
//! [`TRANSITION_START_H`]. The momentum thickness is continuous across the switch.
//!
//! Michel's criterion is evaluated on the laminar part as a cross-check and reported; it does
//! not move the transition.
//!
//! Stations are given as distance from the stagnation point `s` (chord fractions) and edge
//! speed `ue` (fraction of the free-stream speed); `Ue` is taken as linear between stations
//! and zero at the stagnation point.
//!
//! # References
//! - Thwaites (1949), Drela & Giles (1987), Michel (1951), Head (1958): see the method files.
//! - Cebeci, T., Bradshaw, P. (1977). Momentum Transfer in Boundary Layers, sec. 6.2 (starting
//!   the turbulent calculation at transition with theta continuous, H about 1.4).
//! - Horton, H. P. (1968). Laminar separation bubbles in two and three dimensional
//!   incompressible flow. PhD thesis, Queen Mary College, London (the separated layer
//!   turning turbulent and reattaching; the start value of H here is a judgement).

use super::{envelope, head, michel, thwaites};

/// Shape factor with which the turbulent march starts after natural transition (common
/// practice: 1.4, Cebeci & Bradshaw sec. 6.2).
pub const TRANSITION_START_H: f64 = 1.4;
/// Shape factor with which the turbulent march starts at a laminar separation (a judgement:
/// between the separated laminar value, about 3.5, and turbulent separation, 2.4; a value near
/// turbulent separation lets the entrainment equation decide whether the layer reattaches).
pub const BUBBLE_START_H: f64 = 2.2;

/// One station of the march: distance from the stagnation point and edge speed.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Station {
    /// Distance from the stagnation point along the surface, chord fractions (> 0, rising).
    pub s: f64,
    /// Edge speed, fraction of the free-stream speed (> 0).
    pub ue: f64,
}

/// State of the layer.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Regime {
    /// Laminar.
    Laminar,
    /// Turbulent, attached.
    Turbulent,
    /// Turbulent, past the separation criterion.
    Separated,
}

/// The boundary layer at one station.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct LayerState {
    /// Momentum thickness, chord fractions.
    pub theta: f64,
    /// Displacement thickness, chord fractions.
    pub delta_star: f64,
    /// Shape factor delta*/theta.
    pub h: f64,
    /// Skin friction coefficient on the edge speed, `tau_w / (rho Ue^2 / 2)`.
    pub cf: f64,
    /// Amplification factor (laminar part; N_crit held after transition).
    pub n: f64,
    /// Regime.
    pub regime: Regime,
}

/// What ended the laminar flow.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum TransitionCause {
    /// The amplification factor reached N_crit.
    Amplification,
    /// The laminar layer separated first (bubble, turbulent reattachment).
    LaminarSeparation,
    /// A trip set by the caller.
    Trip,
}

/// The layer along one surface.
#[derive(Debug, Clone, PartialEq)]
pub struct SurfaceLayer {
    /// State at each station.
    pub states: Vec<LayerState>,
    /// Transition: distance from the stagnation point and cause; `None` if laminar to the end.
    pub transition: Option<(f64, TransitionCause)>,
    /// Where Michel's criterion is first met on the laminar part, if it is.
    pub michel_s: Option<f64>,
    /// Where the turbulent layer first reaches the separation criterion, if it does.
    pub separation_s: Option<f64>,
}

/// Settings of the march.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct MarchSettings {
    /// Kinematic viscosity in chord-and-free-stream units, `1 / Re`.
    pub nu: f64,
    /// Critical amplification factor.
    pub n_crit: f64,
    /// Forced transition at this distance from the stagnation point, if any.
    pub trip_s: Option<f64>,
}

fn turbulent_steps(ds: f64, theta: f64) -> usize {
    ((ds / (20.0 * theta.max(1e-9))).ceil() as usize).clamp(2, 40)
}

fn record(t: head::TurbulentState, ue: f64, nu: f64) -> LayerState {
    let separated = t.h >= head::H_SEPARATION;
    LayerState {
        theta: t.theta,
        delta_star: t.h * t.theta,
        h: t.h,
        cf: if separated {
            0.0
        } else {
            head::skin_friction(t.h, ue * t.theta / nu)
        },
        n: 0.0,
        regime: if separated {
            Regime::Separated
        } else {
            Regime::Turbulent
        },
    }
}

/// Edge-velocity gradient due/ds at station `st`: a central difference on the uneven stations
/// with the previous point (`s_prev`, `ue_prev`) and `next`, or the backward difference over
/// `ds` at the last station.
fn edge_gradient(st: &Station, next: Option<&Station>, s_prev: f64, ue_prev: f64, ds: f64) -> f64 {
    match next {
        Some(nx) => {
            let (h1, h2) = (st.s - s_prev, nx.s - st.s);
            ((nx.ue - st.ue) * h1 * h1 + (st.ue - ue_prev) * h2 * h2) / (h1 * h2 * (h1 + h2))
        }
        None => (st.ue - ue_prev) / ds,
    }
}

/// Where the laminar flow ends in the interval from the previous station, if it does: the
/// fraction of the interval and the cause. `(lambda, lambda_prev)` is Thwaites' parameter here
/// and at the previous laminar station, `(n, n_prev)` the amplification factor here and there,
/// `trip_fraction` the trip's place in the interval when it lies in or before it. Of causes
/// at the same place, the trip outranks amplification, which outranks laminar separation.
fn laminar_end(
    (lambda, lambda_prev): (f64, Option<f64>),
    (n, n_prev): (f64, f64),
    n_crit: f64,
    trip_fraction: Option<f64>,
) -> Option<(f64, TransitionCause)> {
    let mut end: Option<(f64, TransitionCause)> = None;
    if lambda < thwaites::LAMBDA_SEPARATION {
        let f = match lambda_prev {
            Some(l0) if l0 > thwaites::LAMBDA_SEPARATION => {
                (l0 - thwaites::LAMBDA_SEPARATION) / (l0 - lambda)
            }
            _ => 1.0,
        };
        end = Some((f, TransitionCause::LaminarSeparation));
    }
    if n >= n_crit {
        let f = if n > n_prev {
            ((n_crit - n_prev) / (n - n_prev)).clamp(0.0, 1.0)
        } else {
            1.0
        };
        if end.is_none_or(|(fs, _)| f <= fs) {
            end = Some((f, TransitionCause::Amplification));
        }
    }
    if let Some(f) = trip_fraction {
        if end.is_none_or(|(fe, _)| f <= fe) {
            end = Some((f, TransitionCause::Trip));
        }
    }
    end
}

/// The turbulent layer at the end of the interval in which the laminar flow ended for `cause`:
/// started at the transition point (momentum thickness `theta_tr`, edge velocity `ue_tr` of
/// `(ue_tr, ue)`) with the start shape factor of its cause, and marched over the `rest` of the
/// interval to the station's edge velocity `ue`.
fn turbulent_from_transition(
    cause: TransitionCause,
    theta_tr: f64,
    (ue_tr, ue): (f64, f64),
    rest: f64,
    nu: f64,
) -> head::TurbulentState {
    let h0 = if cause == TransitionCause::LaminarSeparation {
        BUBBLE_START_H
    } else {
        TRANSITION_START_H
    };
    let start = head::TurbulentState {
        theta: theta_tr.max(1e-9),
        h: h0,
    };
    if ue_tr > 0.0 {
        head::step(start, ue_tr, ue, rest, nu, turbulent_steps(rest, theta_tr))
    } else {
        start
    }
}

/// Records the turbulent (or separated) state `t` at station `st`, and the separation point
/// if it is the first separated one.
fn push_turbulent(
    states: &mut Vec<LayerState>,
    separation_s: &mut Option<f64>,
    t: head::TurbulentState,
    st: &Station,
    settings: &MarchSettings,
) {
    if separation_s.is_none() && t.h >= head::H_SEPARATION {
        *separation_s = Some(st.s);
    }
    states.push(LayerState {
        n: settings.n_crit,
        ..record(t, st.ue, settings.nu)
    });
}

/// Michel's margin (re_theta less its transition value) at the laminar station `st`, and
/// Michel's point `michel_s` once the margin reaches zero, interpolated in the interval
/// (`s_prev`, `ds`) on the margin at the previous laminar station of `lam_prev` (theta,
/// lambda, margin). The margin is needed only until the point is found (a `powf` a station):
/// zero after.
fn michel_step(
    michel_s: &mut Option<f64>,
    re_theta: f64,
    st: &Station,
    (s_prev, ds): (f64, f64),
    lam_prev: Option<(f64, f64, f64)>,
    nu: f64,
) -> f64 {
    let michel_margin = if michel_s.is_none() {
        re_theta - michel::re_theta_transition(st.ue * st.s / nu)
    } else {
        0.0
    };
    if michel_s.is_none() && michel_margin >= 0.0 {
        *michel_s = Some(match lam_prev {
            Some((_, _, m0)) if m0 < 0.0 => s_prev + ds * (-m0 / (michel_margin - m0)),
            _ => st.s,
        });
    }
    michel_margin
}

/// Marches the layer over `stations` (see the module documentation).
pub fn march_surface(stations: &[Station], settings: &MarchSettings) -> SurfaceLayer {
    let nu = settings.nu;
    let mut states = Vec::with_capacity(stations.len());
    let mut transition = None;
    let mut michel_s = None;
    let mut separation_s = None;
    let mut int_ue5 = 0.0;
    let (mut s_prev, mut ue_prev) = (0.0, 0.0);
    let mut n_prev = 0.0;
    let mut dn_prev = 0.0;
    let mut lam_prev: Option<(f64, f64, f64)> = None; // (theta, lambda, re_theta margin)
    let mut turb: Option<head::TurbulentState> = None;
    for (i, st) in stations.iter().enumerate() {
        let ds = (st.s - s_prev).max(1e-12);
        if let Some(t) = turb {
            let t = head::step(t, ue_prev, st.ue, ds, nu, turbulent_steps(ds, t.theta));
            push_turbulent(&mut states, &mut separation_s, t, st, settings);
            turb = Some(t);
            s_prev = st.s;
            ue_prev = st.ue;
            continue;
        }
        // Laminar: Thwaites.
        int_ue5 += thwaites::ue5_integral(ue_prev, st.ue, ds);
        let theta = thwaites::momentum_thickness(int_ue5, st.ue, nu);
        let due = edge_gradient(st, stations.get(i + 1), s_prev, ue_prev, ds);
        let lambda = theta * theta * due / nu;
        let h = thwaites::shape_factor(lambda);
        let re_theta = st.ue * theta / nu;
        let dn = envelope::dn_ds(h, theta, re_theta);
        let n = n_prev + 0.5 * (dn + dn_prev) * ds;
        let michel_margin = michel_step(&mut michel_s, re_theta, st, (s_prev, ds), lam_prev, nu);
        let trip_fraction = settings
            .trip_s
            .filter(|trip| *trip <= st.s)
            .map(|trip| ((trip - s_prev) / ds).clamp(0.0, 1.0));
        let end = laminar_end(
            (lambda, lam_prev.map(|p| p.1)),
            (n, n_prev),
            settings.n_crit,
            trip_fraction,
        );
        if let Some((f, cause)) = end {
            let s_tr = s_prev + f * ds;
            let theta0 = lam_prev.map_or(theta, |p| p.0);
            let theta_tr = if i == 0 {
                theta
            } else {
                theta0 + f * (theta - theta0)
            };
            let ue_tr = ue_prev + f * (st.ue - ue_prev);
            let rest = (st.s - s_tr).max(1e-12);
            let t = turbulent_from_transition(cause, theta_tr, (ue_tr, st.ue), rest, nu);
            transition = Some((s_tr, cause));
            push_turbulent(&mut states, &mut separation_s, t, st, settings);
            turb = Some(t);
        } else {
            states.push(LayerState {
                theta,
                delta_star: h * theta,
                h,
                cf: 2.0 * thwaites::shear(lambda) / re_theta.max(1e-9),
                n,
                regime: Regime::Laminar,
            });
            lam_prev = Some((theta, lambda, michel_margin));
        }
        n_prev = n;
        dn_prev = dn;
        s_prev = st.s;
        ue_prev = st.ue;
    }
    SurfaceLayer {
        states,
        transition,
        michel_s,
        separation_s,
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn plate(n: usize) -> Vec<Station> {
        (1..=n)
            .map(|i| Station {
                s: i as f64 / n as f64,
                ue: 1.0,
            })
            .collect()
    }

    #[test]
    fn flat_plate_stays_laminar_at_low_reynolds_number() {
        // Re 1e5: Re_theta at the end is 0.671 sqrt(1e5) = 212, about critical; N stays far
        // below 9 (transition on plates needs Re_x of a few million).
        let l = march_surface(
            &plate(200),
            &MarchSettings {
                nu: 1e-5,
                n_crit: 9.0,
                trip_s: None,
            },
        );
        assert!(l.transition.is_none());
        assert!(l.states.iter().all(|s| s.regime == Regime::Laminar));
    }

    #[test]
    fn adverse_gradient_separates_the_laminar_layer() {
        // Howarth's retarded flow Ue = 1 - x/8 separates at x = 0.96 (exact 0.959, Thwaites
        // gives about 0.96: Cebeci & Bradshaw sec. 4.4, from memory); Re low enough to stay
        // below N_crit, so the laminar separation ends the laminar march.
        let st: Vec<Station> = (1..=400)
            .map(|i| {
                let x = 1.2 * i as f64 / 400.0;
                Station {
                    s: x,
                    ue: 1.0 - x / 8.0,
                }
            })
            .collect();
        let l = march_surface(
            &st,
            &MarchSettings {
                nu: 1e-4,
                n_crit: 9.0,
                trip_s: None,
            },
        );
        let (s, cause) = l.transition.unwrap();
        assert_eq!(cause, TransitionCause::LaminarSeparation);
        assert!((s - 0.96).abs() < 0.05, "{s}");
    }
}
