//! Speed of the lumber order on a large job: 2,000 pieces.

use criterion::{Criterion, criterion_group, criterion_main};
use pitchframe_cards::{OrderPiece, OrderSettings, StockSeries, order_lumber};
use std::hint::black_box;

/// 2,000 pieces in 400 kinds of 5, lengths 18 in to 22 ft, two sizes, from
/// a fixed linear congruential sequence so every run sees the same job.
fn large_job() -> Vec<OrderPiece> {
    let mut state: u64 = 0x2545_f491_4f6c_dd1d;
    (0..400)
        .map(|kind| {
            state = state.wrapping_mul(6_364_136_223_846_793_005).wrapping_add(1_442_695_040_888_963_407);
            let unit = (state >> 11) as f64 / (1u64 << 53) as f64;
            OrderPiece {
                label: format!("P{kind}"),
                size: if kind % 3 == 0 { "2x10".into() } else { "2x8".into() },
                length_in: 18.0 + unit * (264.0 - 18.0),
                count: 5,
            }
        })
        .collect()
}

fn bench(c: &mut Criterion) {
    let pieces = large_job();
    let settings = OrderSettings::for_series(StockSeries::Feet);
    c.bench_function("lumber order, 2000 pieces", |b| {
        b.iter(|| order_lumber(black_box(&pieces), black_box(&settings)))
    });
}

criterion_group!(benches, bench);
criterion_main!(benches);
