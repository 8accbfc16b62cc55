//! Framing speed: the demo house, and a 200 ft x 120 ft plan with many
//! wings (about two thousand members).

use criterion::{Criterion, criterion_group, criterion_main};
use glam::{DVec2, dvec2};
use pitchframe_geometry::framing::{FramingSettings, frame_roof};
use pitchframe_geometry::{Outline, Roof, Wall, WallRoof, demo_plan};

/// A 200 ft x 40 ft main block with ten 16 ft wide wings running 40 ft
/// out on each side: 200 ft x 120 ft overall, hipped all round at 6/12.
fn many_wings() -> Outline {
    let ft = 12.0;
    let (len, depth, wing, reach) = (200.0 * ft, 40.0 * ft, 16.0 * ft, 40.0 * ft);
    let starts: Vec<f64> = (0..10).map(|i| (2.0 + 20.0 * f64::from(i)) * ft).collect();
    let mut corners: Vec<DVec2> = vec![dvec2(0.0, 0.0)];
    // South side, west to east, wings reaching down.
    for &x in &starts {
        corners.extend([dvec2(x, 0.0), dvec2(x, -reach), dvec2(x + wing, -reach), dvec2(x + wing, 0.0)]);
    }
    corners.push(dvec2(len, 0.0));
    corners.push(dvec2(len, depth));
    // North side, east to west, wings reaching up.
    for &x in starts.iter().rev() {
        corners.extend([
            dvec2(x + wing, depth),
            dvec2(x + wing, depth + reach),
            dvec2(x, depth + reach),
            dvec2(x, depth),
        ]);
    }
    corners.push(dvec2(0.0, depth));
    let walls = corners
        .into_iter()
        .map(|corner| Wall { corner, roof: WallRoof::Pitched { rise_per_run: 0.5 }, overhang_in: 16.0 })
        .collect();
    Outline::new(walls, Vec::new()).unwrap_or_else(|e| panic!("bench outline: {e}"))
}

fn bench(c: &mut Criterion) {
    let settings = FramingSettings { spacing_in: 16.0, ..FramingSettings::default() };
    let plan = demo_plan().unwrap_or_else(|e| panic!("demo plan: {e}"));
    let demo = plan.outline().unwrap_or_else(|e| panic!("demo outline: {e}"));
    let demo_roof = Roof::solve(&demo).unwrap_or_else(|e| panic!("demo roof: {e}"));
    c.bench_function("frame demo house", |b| b.iter(|| frame_roof(&demo, &demo_roof, &settings)));

    // Rafters at 12 in centres on the large plan, for a frame of well over
    // a thousand pieces.
    let settings = FramingSettings { spacing_in: 12.0, ..settings };
    let big = many_wings();
    let big_roof = Roof::solve(&big).unwrap_or_else(|e| panic!("big roof: {e}"));
    let frame = frame_roof(&big, &big_roof, &settings).unwrap_or_else(|e| panic!("big frame: {e}"));
    eprintln!(
        "200 ft x 120 ft, many wings: {} pieces, {} members, {} joints",
        frame.pieces.len(),
        frame.members.len(),
        frame.joints.len()
    );
    let mut group = c.benchmark_group("frame 200 ft x 120 ft many wings");
    group.sample_size(10);
    group.bench_function("frame", |b| b.iter(|| frame_roof(&big, &big_roof, &settings)));
    group.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
