//! Speed of the cut cards: 500 distinct members to one PDF.

#[path = "../tests/common/mod.rs"]
mod common;

use criterion::{Criterion, criterion_group, criterion_main};
use pitchframe_cards::{CardOptions, Paper, render_cards};
use std::hint::black_box;

fn bench(c: &mut Criterion) {
    let mut deck = common::sample_deck();
    let originals = deck.members.clone();
    deck.members = (0..500)
        .map(|i| {
            let mut member = originals[i % originals.len()].clone();
            member.label = format!("M{i}");
            member
        })
        .collect();
    let options = CardOptions { paper: Paper::Letter, per_page: 2, templates: vec![] };
    let mut group = c.benchmark_group("cut cards");
    group.sample_size(10);
    group.bench_function("500 cards to PDF", |b| {
        b.iter(|| render_cards(black_box(&deck), black_box(&options)))
    });
    group.finish();
}

criterion_group!(benches, bench);
criterion_main!(benches);
