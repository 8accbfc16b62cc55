//! Roof solve speed: a small house, and random comb and star plans of
//! 100, 1,000 and 10,000 corners.

// A benchmark may unwrap: its plans are built to be valid.
#![allow(clippy::unwrap_used)]

use std::hint::black_box;

use criterion::{BenchmarkId, Criterion, criterion_group, criterion_main};
use glam::DVec2;
use pitchframe_geometry::{Outline, Roof, Wall, WallRoof, comb_corners, star_corners};

// The allocator the app runs with, so the figures are the app's.
#[global_allocator]
static ALLOCATOR: mimalloc::MiMalloc = mimalloc::MiMalloc;

fn walls(points: &[DVec2]) -> Vec<Wall> {
    points
        .iter()
        .map(|&corner| Wall { corner, roof: WallRoof::Pitched { rise_per_run: 0.5 }, overhang_in: 12.0 })
        .collect()
}

/// A star-shaped plan: `n` corners at equal angles, radii random between
/// 3,000 and 6,000 in.
fn star(n: usize, seed: u64) -> Outline {
    Outline::new(walls(&star_corners(n, seed, 3000.0)), vec![]).unwrap()
}

/// An orthogonal comb of about `n` corners: a spine with teeth of random depth.
fn comb(n: usize, seed: u64) -> Outline {
    let teeth = (n.saturating_sub(2) / 4).max(1);
    Outline::new(walls(&comb_corners(teeth, seed)), vec![]).unwrap()
}

/// A small house: an L with a bay and one gable end.
fn house() -> Outline {
    let corners = [
        (0.0, 0.0),
        (180.0, 0.0),
        (210.0, -30.0),
        (270.0, -30.0),
        (300.0, 0.0),
        (480.0, 0.0),
        (480.0, 288.0),
        (300.0, 288.0),
        (300.0, 500.0),
        (0.0, 500.0),
    ];
    let mut w = walls(&corners.map(|(x, y)| DVec2::new(x, y)));
    w[8].roof = WallRoof::Gable;
    Outline::new(w, vec![]).unwrap()
}

fn bench_solve(c: &mut Criterion) {
    let mut group = c.benchmark_group("roof_solve");
    let h = house();
    group.bench_function("house", |b| b.iter(|| Roof::solve(black_box(&h)).unwrap()));
    for n in [100usize, 1_000, 10_000] {
        let s = star(n, 7);
        group.bench_with_input(BenchmarkId::new("star", n), &s, |b, o| {
            b.iter(|| Roof::solve(black_box(o)).unwrap())
        });
        let k = comb(n, 7);
        group.bench_with_input(BenchmarkId::new("comb", n), &k, |b, o| {
            b.iter(|| Roof::solve(black_box(o)).unwrap())
        });
    }
    group.finish();
}

criterion_group! {
    name = benches;
    config = Criterion::default().sample_size(10);
    targets = bench_solve
}
criterion_main!(benches);
