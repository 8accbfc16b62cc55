//! Exact packing by branch and bound, for small jobs and for re-packing a
//! few boards of a larger one.
//!
//! Items are taken longest first; each goes on one of the boards opened so
//! far or on a new board. A board's cost is the shortest stock that holds
//! what is on it, so the cost of a partial packing never falls as items are
//! added. A branch is cut when its cost so far plus the cheapest way to hold
//! the items still to place (their width beyond the spare room of the open
//! boards, at the lowest cost per unit capacity) cannot beat the best found.
//! Two symmetries are cut too: an item as long as the one before it goes on
//! that item's board or a later one, and boards holding exactly the same
//! width are tried once.

use super::{FIT_TOLERANCE_IN, Packing, Stock};

/// The result of an exact search.
#[derive(Debug, Clone, PartialEq)]
pub(crate) enum ExactOutcome {
    /// A packing cheaper than the incumbent, proven optimal.
    Improved(Packing),
    /// The search finished and found nothing cheaper: the incumbent is optimal.
    IncumbentOptimal,
    /// The search stopped at its node limit; nothing is proven.
    NodeLimit,
}

struct Search<'a> {
    widths_in: Vec<f64>,
    remaining_in: Vec<f64>,
    stock: &'a Stock,
    max_capacity_in: f64,
    cost_per_capacity: f64,
    contents_in: Vec<f64>,
    board_of: Vec<usize>,
    cost_in: f64,
    best_cost_in: f64,
    best: Option<Vec<usize>>,
    nodes: u64,
    node_limit: u64,
}

/// Packs the items `subset` (indices into `widths_in`) at least cost, or
/// says the incumbent cost `incumbent_in` cannot be beaten.
pub(crate) fn pack(
    widths_in: &[f64],
    subset: &[usize],
    stock: &Stock,
    incumbent_in: f64,
    node_limit: u64,
) -> ExactOutcome {
    let mut order: Vec<usize> = subset.iter().copied().filter(|&index| index < widths_in.len()).collect();
    order.sort_by(|&a, &b| widths_in[b].total_cmp(&widths_in[a]));
    let widths: Vec<f64> = order.iter().map(|&index| widths_in[index]).collect();
    let mut remaining_in = vec![0.0; widths.len() + 1];
    for i in (0..widths.len()).rev() {
        remaining_in[i] = remaining_in[i + 1] + widths[i];
    }
    let mut search = Search {
        widths_in: widths,
        remaining_in,
        stock,
        max_capacity_in: stock.max_capacity_in(),
        cost_per_capacity: stock.min_cost_per_capacity(),
        contents_in: Vec::new(),
        board_of: Vec::new(),
        cost_in: 0.0,
        best_cost_in: incumbent_in - FIT_TOLERANCE_IN,
        best: None,
        nodes: 0,
        node_limit,
    };
    search.place(0);
    if search.nodes > search.node_limit {
        return ExactOutcome::NodeLimit;
    }
    let Some(assignment) = search.best else {
        return ExactOutcome::IncumbentOptimal;
    };
    let board_count = assignment.iter().max().map_or(0, |last| last + 1);
    let mut boards: Vec<Vec<usize>> = vec![Vec::new(); board_count];
    let mut contents = vec![0.0; board_count];
    for (position, &board) in assignment.iter().enumerate() {
        boards[board].push(order[position]);
        contents[board] += search.widths_in[position];
    }
    let packing = boards
        .into_iter()
        .zip(contents)
        .map(|(items, content)| (stock.shortest_holding(content).unwrap_or(f64::INFINITY), items))
        .collect();
    ExactOutcome::Improved(packing)
}

impl Search<'_> {
    fn board_cost(&self, content_in: f64) -> f64 {
        self.stock.shortest_holding(content_in).unwrap_or(f64::INFINITY)
    }

    fn place(&mut self, position: usize) {
        self.nodes += 1;
        if self.nodes > self.node_limit {
            return;
        }
        let Some(&width) = self.widths_in.get(position) else {
            if self.cost_in < self.best_cost_in {
                self.best_cost_in = self.cost_in - FIT_TOLERANCE_IN;
                self.best = Some(self.board_of.clone());
            }
            return;
        };
        let spare_in: f64 = self.contents_in.iter().map(|content| self.max_capacity_in - content).sum();
        let still_in = self.remaining_in[position];
        let bound_in = self.cost_in + self.cost_per_capacity * (still_in - spare_in).max(0.0);
        if bound_in >= self.best_cost_in {
            return;
        }
        let first_board = match position.checked_sub(1) {
            Some(before) if self.widths_in[before] == width => self.board_of[before],
            _ => 0,
        };
        let mut tried: Vec<f64> = Vec::new();
        for board in first_board..self.contents_in.len() {
            let content = self.contents_in[board];
            if content + width > self.max_capacity_in + FIT_TOLERANCE_IN
                || tried.iter().any(|seen| (seen - content).abs() <= FIT_TOLERANCE_IN)
            {
                continue;
            }
            tried.push(content);
            let added_in = self.board_cost(content + width) - self.board_cost(content);
            self.contents_in[board] += width;
            self.cost_in += added_in;
            self.board_of.push(board);
            self.place(position + 1);
            self.board_of.pop();
            self.cost_in -= added_in;
            self.contents_in[board] = content;
            if self.nodes > self.node_limit {
                return;
            }
        }
        let added_in = self.board_cost(width);
        self.contents_in.push(width);
        self.cost_in += added_in;
        self.board_of.push(self.contents_in.len() - 1);
        self.place(position + 1);
        self.board_of.pop();
        self.cost_in -= added_in;
        self.contents_in.pop();
    }
}
