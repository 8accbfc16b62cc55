//! Framing speed, and solving and framing together: the demo house, and a
//! 200 ft x 120 ft plan with many wings (about two thousand members).

use criterion::{Criterion, criterion_group, criterion_main};
use pitchframe_geometry::framing::{FramingSettings, frame_roof};
use pitchframe_geometry::{Roof, demo_plan, many_wings};

// The allocator the app runs with, so the figures are the app's.
#[global_allocator]
static ALLOCATOR: mimalloc::MiMalloc = mimalloc::MiMalloc;

fn bench(c: &mut Criterion) {
    let settings = FramingSettings { spacing_in: 16.0, ..FramingSettings::default() };
    let plan = demo_plan().unwrap_or_else(|e| panic!("demo plan: {e}"));
    let demo = plan.outline().unwrap_or_else(|e| panic!("demo outline: {e}"));
    let demo_roof = Roof::solve(&demo).unwrap_or_else(|e| panic!("demo roof: {e}"));
    c.bench_function("frame demo house", |b| b.iter(|| frame_roof(&demo, &demo_roof, &settings)));
    // Solving and framing together, as the app does on every change, at
    // 16 in centres and with the demo's own framing settings.
    c.bench_function("solve and frame demo house", |b| {
        b.iter(|| Roof::solve(&demo).map(|roof| frame_roof(&demo, &roof, &settings)))
    });
    let own = plan.framing_settings().unwrap_or_else(|e| panic!("demo framing: {e}"));
    c.bench_function("solve and frame demo house, its own framing", |b| {
        b.iter(|| Roof::solve(&demo).map(|roof| frame_roof(&demo, &roof, &own)))
    });

    // Rafters at 12 in centres on the large plan, for a frame of well over
    // a thousand pieces.
    let settings = FramingSettings { spacing_in: 12.0, ..settings };
    let big = many_wings(0.5).unwrap_or_else(|e| panic!("bench outline: {e}"));
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
    group.bench_function("solve and frame", |b| {
        b.iter(|| Roof::solve(&big).map(|roof| frame_roof(&big, &roof, &settings)))
    });
    group.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
