//! Roof solve speed: a small house, and random comb and star plans of
//! 100, 1,000 and 10,000 corners.

// A benchmark may unwrap: its plans are built to be valid.
#![allow(clippy::unwrap_used)]

use std::hint::black_box;

use criterion::{BenchmarkId, Criterion, criterion_group, criterion_main};
use glam::DVec2;
use pitchframe_geometry::{Outline, Roof, Wall, WallRoof};

/// A small deterministic random source (a 64-bit LCG).
struct Lcg(u64);

impl Lcg {
    fn next(&mut self) -> f64 {
        self.0 = self.0.wrapping_mul(6364136223846793005).wrapping_add(1442695040888963407);
        (self.0 >> 11) as f64 / (1u64 << 53) as f64
    }
}

fn walls(points: &[(f64, f64)]) -> Vec<Wall> {
    points
        .iter()
        .map(|&(x, y)| Wall {
            corner: DVec2::new(x, y),
            roof: WallRoof::Pitched { rise_per_run: 0.5 },
            overhang_in: 12.0,
        })
        .collect()
}

/// A star-shaped plan: `n` corners at equal angles, random radii.
fn star(n: usize, seed: u64) -> Outline {
    let mut rng = Lcg(seed);
    let pts: Vec<(f64, f64)> = (0..n)
        .map(|i| {
            let a = std::f64::consts::TAU * i as f64 / n as f64;
            let r = 3000.0 + 3000.0 * rng.next();
            (r * a.cos(), r * a.sin())
        })
        .collect();
    Outline::new(walls(&pts), vec![]).unwrap()
}

/// An orthogonal comb of about `n` corners: a spine with teeth of random depth.
fn comb(n: usize, seed: u64) -> Outline {
    let mut rng = Lcg(seed);
    let teeth = (n.saturating_sub(2) / 4).max(1);
    let w = 48.0;
    let mut pts = vec![(0.0, 0.0), (2.0 * w * teeth as f64, 0.0)];
    for i in (0..teeth).rev() {
        let depth = 100.0 + (300.0 * rng.next()).round();
        let x0 = 2.0 * w * i as f64;
        pts.push((x0 + 2.0 * w, 100.0 + depth));
        pts.push((x0 + w, 100.0 + depth));
        pts.push((x0 + w, 100.0));
        pts.push((x0, 100.0));
    }
    Outline::new(walls(&pts), vec![]).unwrap()
}

/// A small house: an L with a bay and one gable end.
fn house() -> Outline {
    let mut w = walls(&[
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
    ]);
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
