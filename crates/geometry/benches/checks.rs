//! Speed of outline validation and of the roof checker.
//!
//! The checker drives long random runs, so it should manage thousands of
//! small roofs a second; validation must stay near-linear for outlines of
//! 10,000 corners and more.

use criterion::{Criterion, criterion_group, criterion_main};
use glam::{DVec2, DVec3};
use pitchframe_geometry::{Outline, Roof, RoofLine, RoofLineKind, RoofPlane, Wall, WallRoof, check_roof};
use std::hint::black_box;

fn wall(x: f64, y: f64) -> Wall {
    Wall { corner: DVec2::new(x, y), roof: WallRoof::Pitched { rise_per_run: 0.5 }, overhang_in: 12.0 }
}

fn star(n: usize) -> Vec<Wall> {
    (0..n)
        .map(|i| {
            let angle = i as f64 / n as f64 * std::f64::consts::TAU;
            let radius = if i % 2 == 0 { 1000.0 } else { 900.0 };
            wall(radius * angle.cos(), radius * angle.sin())
        })
        .collect()
}

/// The hand-worked 40 x 30 ft hip roof at 6 in 12 (see the checker's tests).
fn hip_rectangle() -> (Outline, Roof) {
    let p = |x: f64, y: f64, z: f64| DVec3::new(x, y, z);
    let plane = |wall: usize, outline: Vec<DVec3>| RoofPlane {
        wall,
        rise_per_run: 0.5,
        eave_outline: outline.clone(),
        outline,
        plane_group: wall,
    };
    let line = |kind, from, to, walls| RoofLine { kind, from, to, walls };
    let outline =
        Outline::new(vec![wall(0.0, 0.0), wall(480.0, 0.0), wall(480.0, 360.0), wall(0.0, 360.0)], vec![])
            .unwrap_or_else(|e| panic!("{e}"));
    let roof = Roof {
        planes: vec![
            plane(
                0,
                vec![p(0.0, 0.0, 0.0), p(480.0, 0.0, 0.0), p(300.0, 180.0, 90.0), p(180.0, 180.0, 90.0)],
            ),
            plane(1, vec![p(480.0, 0.0, 0.0), p(480.0, 360.0, 0.0), p(300.0, 180.0, 90.0)]),
            plane(
                2,
                vec![p(480.0, 360.0, 0.0), p(0.0, 360.0, 0.0), p(180.0, 180.0, 90.0), p(300.0, 180.0, 90.0)],
            ),
            plane(3, vec![p(0.0, 360.0, 0.0), p(0.0, 0.0, 0.0), p(180.0, 180.0, 90.0)]),
        ],
        lines: vec![
            line(RoofLineKind::Hip, p(0.0, 0.0, 0.0), p(180.0, 180.0, 90.0), [3, 0]),
            line(RoofLineKind::Hip, p(480.0, 0.0, 0.0), p(300.0, 180.0, 90.0), [0, 1]),
            line(RoofLineKind::Hip, p(480.0, 360.0, 0.0), p(300.0, 180.0, 90.0), [1, 2]),
            line(RoofLineKind::Hip, p(0.0, 360.0, 0.0), p(180.0, 180.0, 90.0), [2, 3]),
            line(RoofLineKind::Ridge, p(180.0, 180.0, 90.0), p(300.0, 180.0, 90.0), [0, 2]),
        ],
        gables: vec![],
    };
    (outline, roof)
}

fn benches(c: &mut Criterion) {
    let small = star(16);
    c.bench_function("validate a 16-corner outline", |b| {
        b.iter(|| Outline::new(black_box(small.clone()), vec![]).is_ok())
    });
    let big = star(10_000);
    c.bench_function("validate a 10,000-corner outline", |b| {
        b.iter(|| Outline::new(black_box(big.clone()), vec![]).is_ok())
    });
    let (outline, roof) = hip_rectangle();
    c.bench_function("check a hip roof over a rectangle", |b| {
        b.iter(|| check_roof(black_box(&outline), black_box(&roof)).len())
    });
}

criterion_group!(checks, benches);
criterion_main!(checks);
