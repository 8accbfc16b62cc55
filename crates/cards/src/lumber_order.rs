//! The lumber order: which stock boards to buy and which pieces to cut from
//! each (one-dimensional cutting stock, one problem per lumber size).
//!
//! # Model
//! A piece of length `L` takes `L + trim` of board (the trim allowance
//! squares up a factory end or covers a recut). Neighbouring pieces on a
//! board are separated by one saw kerf; the last piece may end at the board's
//! end. So a board of stock length `S` holds pieces `p_1..p_n` when
//! `sum(p_i + trim) + kerf * (n - 1) <= S`. Adding one kerf to every piece
//! and to every stock length turns this into plain bin packing:
//! `sum(p_i + trim + kerf) <= S + kerf`.
//!
//! The cost of a board is its stock length (lumber is priced by length), so
//! the order minimises the total length bought; among equal totals the
//! search prefers fewer boards.
//!
//! # Methods
//! - **Exact** (jobs of up to [`OrderSettings::exact_max_pieces`] pieces per
//!   size): branch and bound over "which board does the next longest piece
//!   go on", see [`exact`]. Its answer is a proven optimum.
//! - **Heuristic** (larger jobs, or when the exact search hits its node
//!   limit): the cheaper of first-fit decreasing and a minimum-slack fill,
//!   each board then shrunk to the shortest stock that still holds it,
//!   followed by an exact re-pack of the emptiest boards, see [`heuristic`].
//!
//! Beside every result stands a lower bound on the length that must be
//! bought ([`bound`]), so a reader sees how far from the best possible the
//! order can at most be.

mod bound;
mod exact;
mod heuristic;

use serde::Serialize;
use thiserror::Error;

/// Lengths closer than this (inches) count as equal when checking that
/// pieces fit a board: far below the 1/16 in a framer reads, far above the
/// rounding noise of adding a few hundred `f64` lengths.
pub const FIT_TOLERANCE_IN: f64 = 1e-6;

/// Millimetres per inch, for the metric stock series.
const MM_PER_IN: f64 = 25.4;

/// One kind of piece to cut: its label, lumber size, length and how many.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OrderPiece {
    /// The member label printed on the cut list ("C1", "H2").
    pub label: String,
    /// The lumber size the piece is cut from ("2x8"); pieces of different
    /// sizes never share a board.
    pub size: String,
    /// Overall length of the piece as cut, in inches.
    pub length_in: f64,
    /// How many of this piece.
    pub count: u32,
}

/// Which series of stock lengths a plan buys from.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum StockSeries {
    /// 8 ft to 24 ft in 2 ft steps.
    Feet,
    /// 2.4 m to 6.0 m in 0.3 m steps.
    Metric,
}

impl StockSeries {
    /// The usual stock lengths of this series, in inches, shortest first.
    pub fn lengths_in(self) -> Vec<f64> {
        match self {
            Self::Feet => (4..=12).map(|half_feet| f64::from(half_feet) * 24.0).collect(),
            Self::Metric => (8..=20).map(|steps| f64::from(steps) * 300.0 / MM_PER_IN).collect(),
        }
    }
}

/// How the order is made: stock lengths on offer, kerf, trim, search limits.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct OrderSettings {
    /// Stock lengths that can be bought, in inches (any order).
    pub stock_lengths_in: Vec<f64>,
    /// Width of the saw cut, in inches.
    pub kerf_in: f64,
    /// Extra length allowed on every piece, in inches.
    pub trim_in: f64,
    /// Sizes with at most this many pieces are solved exactly.
    pub exact_max_pieces: usize,
    /// Search nodes the exact method may visit before it gives up and the
    /// heuristic answer stands.
    pub exact_node_limit: u64,
}

impl OrderSettings {
    /// Default settings for a series: its stock lengths, 1/8 in kerf and
    /// 1 in trim (common practice, no source).
    pub fn for_series(series: StockSeries) -> Self {
        Self {
            stock_lengths_in: series.lengths_in(),
            kerf_in: 0.125,
            trim_in: 1.0,
            exact_max_pieces: 14,
            exact_node_limit: 2_000_000,
        }
    }
}

/// Why a lumber order could not be made.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum LumberOrderError {
    /// No stock length was given.
    #[error("the lumber order has no stock lengths to buy from")]
    NoStockLengths,
    /// A stock length is zero, negative or not a number.
    #[error("stock length {length_in} in is not a usable board length")]
    StockLengthNotPositive {
        /// The length given.
        length_in: f64,
    },
    /// The kerf or the trim is negative or not a number.
    #[error("the {what} of {value_in} in must be zero or more")]
    AllowanceNegative {
        /// "saw kerf" or "trim allowance".
        what: &'static str,
        /// The value given.
        value_in: f64,
    },
    /// A piece's length is zero, negative or not a number.
    #[error("piece {label} has length {length_in} in; a piece needs a positive length")]
    PieceLengthNotPositive {
        /// The piece's label.
        label: String,
        /// The length given.
        length_in: f64,
    },
}

/// One piece as it lies on a board.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct BoardPiece {
    /// The piece's label.
    pub label: String,
    /// Overall length of the piece as cut (without trim), in inches.
    pub length_in: f64,
}

/// One stock board and the pieces cut from it, in cutting order.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Board {
    /// The stock length to buy, in inches.
    pub stock_in: f64,
    /// The pieces, longest first, each taking its length plus trim and
    /// separated by one kerf.
    pub pieces: Vec<BoardPiece>,
    /// What is left after the last piece and its kerf, in inches.
    pub offcut_in: f64,
}

/// How many boards of one stock length to buy.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct StockCount {
    /// The stock length, in inches.
    pub stock_in: f64,
    /// How many boards of it.
    pub count: usize,
}

/// Which method produced an order.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum PackingMethod {
    /// A proven optimum (branch and bound finished).
    Exact,
    /// The heuristic; the lower bound says how close it is at worst.
    Heuristic,
}

/// The order for one lumber size.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SizeOrder {
    /// The lumber size ("2x8").
    pub size: String,
    /// Every board, with its pieces.
    pub boards: Vec<Board>,
    /// Boards per stock length, shortest first.
    pub stock_counts: Vec<StockCount>,
    /// Total stock length bought, in inches.
    pub bought_in: f64,
    /// Total length of the pieces (without trim or kerf), in inches.
    pub pieces_in: f64,
    /// No order for these pieces can buy less than this, in inches.
    pub lower_bound_in: f64,
    /// How the boards were found.
    pub method: PackingMethod,
}

impl SizeOrder {
    /// Waste (offcuts, kerf and trim) as a percentage of what is bought.
    pub fn waste_percent(&self) -> f64 {
        waste_percent(self.bought_in, self.pieces_in)
    }

    /// The waste the lower bound would leave: no order can waste less.
    pub fn lower_bound_waste_percent(&self) -> f64 {
        waste_percent(self.lower_bound_in, self.pieces_in)
    }
}

/// A piece longer than the longest stock board: it needs a splice or a
/// special order and is not on any board.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SplicePiece {
    /// The piece's label.
    pub label: String,
    /// Its lumber size.
    pub size: String,
    /// Its length, in inches.
    pub length_in: f64,
    /// How many of it.
    pub count: u32,
    /// The longest stock length on offer, in inches.
    pub longest_stock_in: f64,
}

/// The whole lumber order.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct LumberOrder {
    /// One order per lumber size, in the order sizes first appear.
    pub sizes: Vec<SizeOrder>,
    /// Pieces no stock board can hold: they need a splice or a special order.
    pub needs_splice: Vec<SplicePiece>,
    /// The settings the order was made with.
    pub settings: OrderSettings,
}

impl LumberOrder {
    /// Total stock length bought over all sizes, in inches.
    pub fn bought_in(&self) -> f64 {
        self.sizes.iter().map(|size| size.bought_in).sum()
    }

    /// Waste over all sizes, as a percentage of what is bought.
    pub fn waste_percent(&self) -> f64 {
        waste_percent(self.bought_in(), self.sizes.iter().map(|size| size.pieces_in).sum())
    }
}

fn waste_percent(bought_in: f64, pieces_in: f64) -> f64 {
    if bought_in > 0.0 { 100.0 * (bought_in - pieces_in) / bought_in } else { 0.0 }
}

/// A piece in packing units: its length plus trim plus one kerf.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Item {
    /// Index into the caller's piece list.
    pub piece: usize,
    /// Length plus trim plus kerf, in inches.
    pub width_in: f64,
}

/// The stock on offer in packing units, shared by the methods.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Stock {
    /// Stock lengths, shortest first, without repeats.
    pub lengths_in: Vec<f64>,
    /// The kerf added to every stock length to give its capacity.
    pub kerf_in: f64,
}

impl Stock {
    /// The capacity of the longest board.
    pub fn max_capacity_in(&self) -> f64 {
        self.lengths_in.last().map_or(0.0, |length| length + self.kerf_in)
    }

    /// The shortest stock length whose board holds `content_in` of items.
    pub fn shortest_holding(&self, content_in: f64) -> Option<f64> {
        self.lengths_in.iter().copied().find(|length| content_in <= length + self.kerf_in + FIT_TOLERANCE_IN)
    }

    /// The smallest ratio of cost to capacity over all stock lengths: the
    /// shortest board's, since `S / (S + kerf)` grows with `S`.
    pub fn min_cost_per_capacity(&self) -> f64 {
        self.lengths_in.first().map_or(1.0, |length| length / (length + self.kerf_in))
    }
}

/// Boards as lists of item indices, with their stock length.
pub(crate) type Packing = Vec<(f64, Vec<usize>)>;

/// The total stock length of a packing.
pub(crate) fn packing_cost(packing: &Packing) -> f64 {
    packing.iter().map(|(stock, _)| stock).sum()
}

/// Makes the lumber order for a list of pieces.
///
/// Pieces of each lumber size are packed separately. Pieces that no stock
/// board can hold are listed in [`LumberOrder::needs_splice`], never dropped.
pub fn order_lumber(
    pieces: &[OrderPiece],
    settings: &OrderSettings,
) -> Result<LumberOrder, LumberOrderError> {
    let stock = checked_stock(settings)?;
    let longest_stock_in = stock.lengths_in.last().copied().unwrap_or(0.0);
    let mut size_names: Vec<&str> = Vec::new();
    let mut needs_splice = Vec::new();
    for piece in pieces {
        if !(piece.length_in.is_finite() && piece.length_in > 0.0) {
            return Err(LumberOrderError::PieceLengthNotPositive {
                label: piece.label.clone(),
                length_in: piece.length_in,
            });
        }
        if !size_names.contains(&piece.size.as_str()) {
            size_names.push(&piece.size);
        }
        if piece.count > 0 && piece.length_in + settings.trim_in > longest_stock_in + FIT_TOLERANCE_IN {
            needs_splice.push(SplicePiece {
                label: piece.label.clone(),
                size: piece.size.clone(),
                length_in: piece.length_in,
                count: piece.count,
                longest_stock_in,
            });
        }
    }

    let mut sizes = Vec::new();
    for size in size_names {
        let mut items = Vec::new();
        for (index, piece) in pieces.iter().enumerate() {
            let fits = piece.length_in + settings.trim_in <= longest_stock_in + FIT_TOLERANCE_IN;
            if piece.size == size && fits {
                let width_in = piece.length_in + settings.trim_in + settings.kerf_in;
                items.extend((0..piece.count).map(|_| Item { piece: index, width_in }));
            }
        }
        if items.is_empty() {
            continue;
        }
        sizes.push(order_one_size(size, pieces, &items, &stock, settings));
    }
    Ok(LumberOrder { sizes, needs_splice, settings: settings.clone() })
}

fn checked_stock(settings: &OrderSettings) -> Result<Stock, LumberOrderError> {
    if settings.stock_lengths_in.is_empty() {
        return Err(LumberOrderError::NoStockLengths);
    }
    for &length_in in &settings.stock_lengths_in {
        if !(length_in.is_finite() && length_in > 0.0) {
            return Err(LumberOrderError::StockLengthNotPositive { length_in });
        }
    }
    for (what, value_in) in [("saw kerf", settings.kerf_in), ("trim allowance", settings.trim_in)] {
        if !(value_in.is_finite() && value_in >= 0.0) {
            return Err(LumberOrderError::AllowanceNegative { what, value_in });
        }
    }
    let mut lengths_in = settings.stock_lengths_in.clone();
    lengths_in.sort_by(f64::total_cmp);
    lengths_in.dedup_by(|a, b| (*a - *b).abs() <= FIT_TOLERANCE_IN);
    Ok(Stock { lengths_in, kerf_in: settings.kerf_in })
}

fn order_one_size(
    size: &str,
    pieces: &[OrderPiece],
    items: &[Item],
    stock: &Stock,
    settings: &OrderSettings,
) -> SizeOrder {
    let mut items = items.to_vec();
    items.sort_by(|a, b| b.width_in.total_cmp(&a.width_in));
    let widths: Vec<f64> = items.iter().map(|item| item.width_in).collect();

    let mut packing = heuristic::pack(&widths, stock, settings.exact_node_limit / 40);
    let mut method = PackingMethod::Heuristic;
    if items.len() <= settings.exact_max_pieces {
        let all: Vec<usize> = (0..widths.len()).collect();
        match exact::pack(&widths, &all, stock, packing_cost(&packing), settings.exact_node_limit) {
            exact::ExactOutcome::Improved(best) => {
                packing = best;
                method = PackingMethod::Exact;
            }
            exact::ExactOutcome::IncumbentOptimal => method = PackingMethod::Exact,
            exact::ExactOutcome::NodeLimit => {}
        }
    }

    let lower_bound_in = bound::lower_bound(&widths, stock);
    let boards: Vec<Board> = packing
        .iter()
        .map(|(stock_in, members)| {
            let mut on_board: Vec<BoardPiece> = members
                .iter()
                .filter_map(|&index| items.get(index))
                .filter_map(|item| pieces.get(item.piece))
                .map(|piece| BoardPiece { label: piece.label.clone(), length_in: piece.length_in })
                .collect();
            on_board.sort_by(|a, b| b.length_in.total_cmp(&a.length_in).then_with(|| a.label.cmp(&b.label)));
            let used_in: f64 =
                on_board.iter().map(|piece| piece.length_in + settings.trim_in + settings.kerf_in).sum();
            Board { stock_in: *stock_in, pieces: on_board, offcut_in: (stock_in - used_in).max(0.0) }
        })
        .collect();
    let mut boards = boards;
    boards.sort_by(|a, b| b.stock_in.total_cmp(&a.stock_in));

    let mut stock_counts: Vec<StockCount> = Vec::new();
    for board in &boards {
        match stock_counts.iter_mut().find(|entry| entry.stock_in == board.stock_in) {
            Some(entry) => entry.count += 1,
            None => stock_counts.push(StockCount { stock_in: board.stock_in, count: 1 }),
        }
    }
    stock_counts.sort_by(|a, b| a.stock_in.total_cmp(&b.stock_in));
    let bought_in = boards.iter().map(|board| board.stock_in).sum();
    let pieces_in = items.iter().filter_map(|item| pieces.get(item.piece)).map(|piece| piece.length_in).sum();
    SizeOrder { size: size.to_string(), boards, stock_counts, bought_in, pieces_in, lower_bound_in, method }
}
