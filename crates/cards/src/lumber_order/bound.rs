//! A lower bound on the stock length any packing must buy.
//!
//! Packing units as in the parent module: item widths include one kerf,
//! a board of stock `S` holds `S + kerf`.
//!
//! Derivation. Let `r = S_min / (S_min + kerf)`: every board costs at least
//! `r` times its capacity, since `S / (S + kerf)` grows with `S`. Items wider
//! than half the longest board's capacity ("big" items) never share a board,
//! so each sits on its own board costing at least `s_i`, the shortest stock
//! that holds it. Let `X` be the cost of those boards (`X >= X0 = sum s_i`)
//! and `M` the total item width. The other boards must hold whatever the big
//! boards' capacity `X + n_big * kerf` does not, so
//! `cost >= X + r * max(0, M - X - n_big * kerf)`, which does not decrease
//! with `X` (its slope is `1 - r` or `1`): the bound is its value at `X0`.
//! With no big items this is the plain material bound `r * M`.

use super::Stock;

/// A lower bound on the total stock length for items of these widths.
pub(crate) fn lower_bound(widths_in: &[f64], stock: &Stock) -> f64 {
    let total_in: f64 = widths_in.iter().sum();
    let ratio = stock.min_cost_per_capacity();
    let half_capacity_in = stock.max_capacity_in() / 2.0;
    let mut big_cost_in = 0.0;
    let mut big_count = 0.0;
    for &width in widths_in.iter().filter(|&&width| width > half_capacity_in) {
        big_cost_in += stock.shortest_holding(width).unwrap_or(0.0);
        big_count += 1.0;
    }
    let rest_in = (total_in - big_cost_in - big_count * stock.kerf_in).max(0.0);
    (big_cost_in + ratio * rest_in).max(ratio * total_in)
}
