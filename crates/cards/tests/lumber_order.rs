//! The lumber order against hand-worked cases, a brute-force optimum on
//! small jobs and its lower bound on large ones.

use pitchframe_cards::{
    LumberOrder, LumberOrderError, OrderPiece, OrderSettings, PackingMethod, StockSeries, order_lumber,
};
use proptest::prelude::*;

fn piece(label: &str, length_in: f64, count: u32) -> OrderPiece {
    OrderPiece { label: label.into(), size: "2x8".into(), length_in, count }
}

fn feet_settings(kerf_in: f64, trim_in: f64) -> OrderSettings {
    OrderSettings { kerf_in, trim_in, ..OrderSettings::for_series(StockSeries::Feet) }
}

/// Checks what must hold for every order: each piece on exactly one board
/// (or on the splice list), no board over its length counting trim and
/// kerf, offcuts and totals consistent, the bound below the result.
fn check_order(pieces: &[OrderPiece], settings: &OrderSettings, order: &LumberOrder) {
    let mut expanded: Vec<(String, u64)> = Vec::new();
    for p in pieces {
        for _ in 0..p.count {
            expanded.push((p.label.clone(), p.length_in.to_bits()));
        }
    }
    let mut placed: Vec<(String, u64)> = Vec::new();
    for size in &order.sizes {
        let mut bought = 0.0;
        for board in &size.boards {
            assert!(settings.stock_lengths_in.contains(&board.stock_in), "board of a length not on offer");
            assert!(!board.pieces.is_empty(), "an empty board is bought");
            let used: f64 = board.pieces.iter().map(|p| p.length_in + settings.trim_in).sum::<f64>()
                + settings.kerf_in * (board.pieces.len() - 1) as f64;
            assert!(used <= board.stock_in + 1e-6, "board {} holds {used}", board.stock_in);
            let offcut = (board.stock_in - used - settings.kerf_in).max(0.0);
            assert!((board.offcut_in - offcut).abs() < 1e-6);
            bought += board.stock_in;
            placed.extend(board.pieces.iter().map(|p| (p.label.clone(), p.length_in.to_bits())));
        }
        let by_count: usize = size.stock_counts.iter().map(|s| s.count).sum();
        assert_eq!(by_count, size.boards.len());
        assert!((bought - size.bought_in).abs() < 1e-6);
        assert!(
            size.lower_bound_in <= size.bought_in + 1e-6,
            "bound {} above result {}",
            size.lower_bound_in,
            size.bought_in
        );
    }
    for splice in &order.needs_splice {
        for _ in 0..splice.count {
            placed.push((splice.label.clone(), splice.length_in.to_bits()));
        }
    }
    expanded.sort();
    placed.sort();
    assert_eq!(expanded, placed, "every piece placed exactly once");
}

/// The cheapest total stock length by trying every way of grouping the
/// pieces onto boards (set partitions as restricted growth strings).
fn brute_force_optimum(lengths_in: &[f64], settings: &OrderSettings) -> f64 {
    let n = lengths_in.len();
    let mut stocks = settings.stock_lengths_in.clone();
    stocks.sort_by(f64::total_cmp);
    let block_cost = |block: &[f64]| -> Option<f64> {
        let used: f64 = block.iter().map(|l| l + settings.trim_in).sum::<f64>()
            + settings.kerf_in * (block.len() as f64 - 1.0);
        stocks.iter().copied().find(|s| used <= s + 1e-9)
    };
    let mut best = f64::INFINITY;
    let mut labels = vec![0usize; n];
    loop {
        let blocks = labels.iter().max().map_or(0, |m| m + 1);
        let mut total = 0.0;
        for b in 0..blocks {
            let block: Vec<f64> = (0..n).filter(|&i| labels[i] == b).map(|i| lengths_in[i]).collect();
            match block_cost(&block) {
                Some(cost) => total += cost,
                None => {
                    total = f64::INFINITY;
                    break;
                }
            }
        }
        best = best.min(total);
        // Next restricted growth string.
        let mut i = n;
        loop {
            if i <= 1 {
                return best;
            }
            i -= 1;
            let prefix_max = labels[..i].iter().copied().max().unwrap_or(0);
            if labels[i] <= prefix_max {
                labels[i] += 1;
                for label in labels.iter_mut().skip(i + 1) {
                    *label = 0;
                }
                break;
            }
        }
    }
}

#[test]
fn four_six_foot_pieces_with_kerf() {
    // Derivation by hand: with a 1/8 in kerf a 72 in piece leaves
    // floor((S + 1/8) / 72.125) on a board of S: one on 8'-12', two on
    // 14'-18' (three need 216.25 in), three on 20'-24' (four need 288.375).
    // Cost per piece is least at 20' (80 in) and 14' (84 in), so four pieces
    // cost at least 336 in: 20' + 8' or 14' + 14'.
    let settings = feet_settings(0.125, 0.0);
    let pieces = [piece("C1", 72.0, 4)];
    let order = order_lumber(&pieces, &settings).unwrap();
    check_order(&pieces, &settings, &order);
    assert_eq!(order.sizes[0].bought_in, 336.0);
    assert_eq!(order.sizes[0].method, PackingMethod::Exact);
}

#[test]
fn without_kerf_four_six_foot_pieces_fill_a_24_foot_board() {
    // Derivation: 4 x 72 = 288 in = 24 ft exactly, no waste; 2 x 12 ft is as
    // cheap, so only the total is fixed.
    let settings = feet_settings(0.0, 0.0);
    let pieces = [piece("C1", 72.0, 4)];
    let order = order_lumber(&pieces, &settings).unwrap();
    check_order(&pieces, &settings, &order);
    assert_eq!(order.sizes[0].bought_in, 288.0);
    assert_eq!(order.waste_percent(), 0.0);
}

#[test]
fn trim_pushes_a_piece_to_the_next_stock_length() {
    // Derivation: a 96 in piece plus 1 in trim does not fit an 8 ft board,
    // so it is cut from a 10 ft (120 in) board.
    let settings = feet_settings(0.125, 1.0);
    let pieces = [piece("R1", 96.0, 1)];
    let order = order_lumber(&pieces, &settings).unwrap();
    assert_eq!(order.sizes[0].boards[0].stock_in, 120.0);
}

#[test]
fn a_piece_longer_than_any_stock_needs_a_splice() {
    let settings = feet_settings(0.125, 1.0);
    let pieces = [piece("H1", 30.0 * 12.0, 2), piece("C1", 100.0, 1)];
    let order = order_lumber(&pieces, &settings).unwrap();
    check_order(&pieces, &settings, &order);
    assert_eq!(order.needs_splice.len(), 1);
    assert_eq!(order.needs_splice[0].label, "H1");
    assert_eq!(order.needs_splice[0].count, 2);
    assert_eq!(order.needs_splice[0].longest_stock_in, 288.0);
}

#[test]
fn sizes_never_share_a_board() {
    let settings = feet_settings(0.125, 0.0);
    let mut hip = piece("H1", 40.0, 1);
    hip.size = "2x10".into();
    let pieces = [piece("C1", 40.0, 1), hip];
    let order = order_lumber(&pieces, &settings).unwrap();
    assert_eq!(order.sizes.len(), 2);
    assert!(order.sizes.iter().all(|size| size.boards.len() == 1));
}

#[test]
fn metric_series_runs_from_2_4_to_6_metres() {
    // From the stated series: 2.4 m to 6.0 m in 0.3 m steps is 13 lengths.
    let lengths = StockSeries::Metric.lengths_in();
    assert_eq!(lengths.len(), 13);
    assert!((lengths[0] * 25.4 - 2400.0).abs() < 1e-9);
    assert!((lengths[12] * 25.4 - 6000.0).abs() < 1e-9);
    let feet = StockSeries::Feet.lengths_in();
    assert_eq!(feet, vec![96.0, 120.0, 144.0, 168.0, 192.0, 216.0, 240.0, 264.0, 288.0]);
}

#[test]
fn bad_input_is_refused_by_name() {
    let settings = feet_settings(0.125, 0.0);
    let err = order_lumber(&[piece("J3", -2.0, 1)], &settings).unwrap_err();
    assert!(matches!(err, LumberOrderError::PieceLengthNotPositive { .. }));
    assert!(err.to_string().contains("J3"));
    let empty = OrderSettings { stock_lengths_in: vec![], ..settings.clone() };
    assert_eq!(order_lumber(&[], &empty).unwrap_err(), LumberOrderError::NoStockLengths);
    let bad_kerf = OrderSettings { kerf_in: f64::NAN, ..settings };
    assert!(matches!(order_lumber(&[], &bad_kerf).unwrap_err(), LumberOrderError::AllowanceNegative { .. }));
}

fn small_job() -> impl Strategy<Value = (Vec<f64>, f64, f64)> {
    (
        prop::collection::vec(prop_oneof![12.0..100.0f64, 100.0..288.0f64, Just(72.0), Just(96.0)], 1..=7),
        prop_oneof![Just(0.0), Just(0.125), 0.0..0.25f64],
        prop_oneof![Just(0.0), Just(1.0)],
    )
}

proptest! {
    #![proptest_config(ProptestConfig::with_cases(200))]

    #[test]
    fn small_jobs_reach_the_brute_force_optimum((lengths, kerf, trim) in small_job()) {
        let settings = feet_settings(kerf, trim);
        let lengths: Vec<f64> = lengths.into_iter().filter(|l| l + trim <= 288.0).collect();
        let pieces: Vec<OrderPiece> =
            lengths.iter().enumerate().map(|(i, &l)| piece(&format!("P{i}"), l, 1)).collect();
        let order = order_lumber(&pieces, &settings).unwrap();
        check_order(&pieces, &settings, &order);
        let best = brute_force_optimum(&lengths, &settings);
        let bought = order.bought_in();
        prop_assert!((bought - if lengths.is_empty() { 0.0 } else { best }).abs() < 1e-6,
            "bought {bought}, optimum {best}");

        // The heuristic alone never beats the optimum and keeps every rule.
        let heuristic_only = OrderSettings { exact_max_pieces: 0, ..settings.clone() };
        let order = order_lumber(&pieces, &heuristic_only).unwrap();
        check_order(&pieces, &heuristic_only, &order);
        prop_assert!(order.bought_in() >= bought - 1e-6);
    }

    #[test]
    fn large_jobs_stay_near_the_lower_bound(
        kinds in prop::collection::vec((6.0..260.0f64, 1u32..12), 30..200),
        kerf in prop_oneof![Just(0.0), Just(0.125)],
    ) {
        let settings = feet_settings(kerf, 1.0);
        let pieces: Vec<OrderPiece> =
            kinds.iter().enumerate().map(|(i, &(l, n))| piece(&format!("P{i}"), l, n)).collect();
        let order = order_lumber(&pieces, &settings).unwrap();
        check_order(&pieces, &settings, &order);
        let size = &order.sizes[0];
        // Margin, common practice, no source: decreasing-first heuristics
        // stay within a few percent of the material bound on many mixed
        // pieces; allow 8 % plus one longest board for the last, part-used
        // board.
        prop_assert!(size.bought_in <= 1.08 * size.lower_bound_in + 288.0,
            "bought {} bound {}", size.bought_in, size.lower_bound_in);
    }

    #[test]
    fn every_piece_is_placed_once_with_splices(
        kinds in prop::collection::vec((1.0..400.0f64, 0u32..4, 0usize..3), 0..40),
        kerf in 0.0..0.3f64,
        trim in 0.0..2.0f64,
        stocks in prop::collection::vec(24.0..300.0f64, 1..5),
    ) {
        let settings = OrderSettings { stock_lengths_in: stocks, kerf_in: kerf, trim_in: trim, ..OrderSettings::for_series(StockSeries::Feet) };
        let pieces: Vec<OrderPiece> = kinds.iter().enumerate().map(|(i, &(l, n, s))| OrderPiece {
            label: format!("P{i}"), size: ["2x6", "2x8", "2x10"][s].into(), length_in: l, count: n,
        }).collect();
        let order = order_lumber(&pieces, &settings).unwrap();
        check_order(&pieces, &settings, &order);
    }
}
