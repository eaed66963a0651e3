//! Benchmarks of the multi-surface lifting line: a wing and a tail at 80 stations each
//! (40 per half-span), first solve (build, factor, unit solutions, one solve) and further
//! solves on the same geometry (trim, moment balance, a full solve).

use std::f64::consts::PI;
use std::hint::black_box;

use criterion::{criterion_group, criterion_main, Criterion};
use trimline::lifting_line::TrimControl;
use trimline::lifting_line::{
    ElevatorEffect, LiftingLineOptions, MultiSurfaceSystem, Reference, SurfaceInput, WingModel,
};
use trimline::model::{AirfoilId, Panel, SectionMethod, Surface, SurfaceShape};
use trimline::section::{ClMaxSource, SectionModel};

fn section(alpha0_rad: f64, cm_ac: f64) -> SectionModel {
    SectionModel {
        method: SectionMethod::Thin,
        alpha_zero_lift_rad: alpha0_rad,
        cl_alpha_per_rad: 2.0 * PI,
        cm_ac,
        x_ac_c: 0.25,
        cl_max: 1.2,
        cl_min: -1.0,
        cl_max_source: ClMaxSource::Given,
        reynolds_number: None,
        polar: None,
    }
}

fn panel(span_m: f64, root: f64, tip: f64, sweep_deg: f64, airfoil: usize) -> Panel {
    Panel {
        span_m,
        root_chord_m: root,
        tip_chord_m: tip,
        sweep_le_rad: sweep_deg.to_radians(),
        dihedral_rad: 2f64.to_radians(),
        tip_twist_rad: -2f64.to_radians(),
        root_airfoil: AirfoilId(airfoil),
        tip_airfoil: AirfoilId(airfoil),
    }
}

fn surfaces() -> (Surface, Surface) {
    let wing = Surface {
        name: "wing".into(),
        root_le_x_m: 0.0,
        root_le_z_m: 0.0,
        incidence_rad: 2f64.to_radians(),
        shape: SurfaceShape::Panels(vec![
            panel(0.5, 0.25, 0.22, 1.0, 0),
            panel(0.5, 0.22, 0.14, 4.0, 0),
        ]),
    };
    let tail = Surface {
        name: "tail".into(),
        root_le_x_m: 0.9,
        root_le_z_m: 0.08,
        incidence_rad: 0.0,
        shape: SurfaceShape::Panels(vec![panel(0.3, 0.13, 0.09, 8.0, 1)]),
    };
    (wing, tail)
}

fn bench(c: &mut Criterion) {
    let sections = [section(-0.04, -0.08), section(0.0, 0.0)];
    let (wing, tail) = surfaces();
    let elevator = ElevatorEffect::full_span(-0.6090, -0.6495);
    let inputs = [
        SurfaceInput {
            surface: &wing,
            sections: &sections,
            elevator: None,
        },
        SurfaceInput {
            surface: &tail,
            sections: &sections,
            elevator: Some(elevator),
        },
    ];
    let reference = Reference::of_surface(&wing);
    let options = LiftingLineOptions::default();
    // Target (lifting-surface issue): build and factor the default lattice for wing and tail
    // in under 20 ms on one core.
    c.bench_function(
        "vortex lattice: build, factor, solve (default: 24 strips x 6 panels a half-wing, tail at the wing's strip width)",
        |b| {
            b.iter(|| {
                let sys = MultiSurfaceSystem::new(black_box(&inputs), reference, options).unwrap();
                sys.solve(&sys.condition(black_box(0.05))).unwrap().cl
            })
        },
    );
    let ll = LiftingLineOptions {
        model: WingModel::LiftingLine,
        ..options
    };
    c.bench_function(
        "lifting line: build, factor, solve (2 x 80 stations)",
        |b| {
            b.iter(|| {
                let sys = MultiSurfaceSystem::new(black_box(&inputs), reference, ll).unwrap();
                sys.solve(&sys.condition(black_box(0.05))).unwrap().cl
            })
        },
    );
    let sys = MultiSurfaceSystem::new(&inputs, reference, options).unwrap();
    c.bench_function("trim: alpha and elevator for C_L 0.6, C_m 0", |b| {
        b.iter(|| {
            sys.trim_for_cl(
                &sys.condition(0.0),
                TrimControl::Elevator,
                black_box(0.6),
                black_box(0.07),
                0.0,
            )
            .unwrap()
        })
    });
    c.bench_function("neutral point", |b| {
        b.iter(|| {
            sys.neutral_point_x_m(&sys.condition(black_box(0.05)), 0.0)
                .unwrap()
        })
    });
    c.bench_function("full solve with spanwise table (same geometry)", |b| {
        b.iter(|| sys.solve(&sys.condition(black_box(0.05))).unwrap().cl)
    });
    c.bench_function("stalled solve (Newton, same geometry)", |b| {
        b.iter(|| sys.solve(&sys.condition(black_box(0.25))).unwrap().cl)
    });
}

criterion_group!(benches, bench);
criterion_main!(benches);
