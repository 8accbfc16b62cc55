//! The heuristic packing for jobs too large to solve exactly.
//!
//! Two constructions, keeping the cheaper:
//! - **First-fit decreasing:** longest item first, onto the first open board
//!   (of the longest stock) with room, else a new board.
//! - **Minimum slack:** board after board, for every stock length find the
//!   fullest fill that includes the longest item left (a depth-first search
//!   over the distinct widths, largest counts first, with a node limit), and
//!   keep the stock length and fill with the least waste per length bought.
//!
//! Every board is then cut down to the shortest stock that still holds it.
//! Last, an improvement pass re-packs small groups of the emptiest boards
//! with the exact search and keeps any cheaper result.

use super::exact::{self, ExactOutcome};
use super::{FIT_TOLERANCE_IN, Packing, Stock, packing_cost};

/// Items the improvement pass hands the exact search at once.
const REPACK_MAX_ITEMS: usize = 12;
/// Re-pack attempts per job.
const REPACK_ATTEMPTS: usize = 24;
/// Nodes per re-pack attempt.
const REPACK_NODE_LIMIT: u64 = 20_000;

/// Packs items (widths sorted longest first) onto stock boards.
pub(crate) fn pack(widths_in: &[f64], stock: &Stock, fill_node_limit: u64) -> Packing {
    let first_fit = shrink(first_fit_decreasing(widths_in, stock.max_capacity_in()), widths_in, stock);
    let min_slack = min_slack(widths_in, stock, fill_node_limit.max(64));
    let mut packing = if packing_cost(&min_slack) < packing_cost(&first_fit) - FIT_TOLERANCE_IN {
        min_slack
    } else {
        first_fit
    };
    improve(&mut packing, widths_in, stock);
    packing
}

fn content_in(items: &[usize], widths_in: &[f64]) -> f64 {
    items.iter().filter_map(|&index| widths_in.get(index)).sum()
}

fn first_fit_decreasing(widths_in: &[f64], capacity_in: f64) -> Vec<Vec<usize>> {
    let mut boards: Vec<(f64, Vec<usize>)> = Vec::new();
    for (index, &width) in widths_in.iter().enumerate() {
        match boards.iter_mut().find(|(content, _)| content + width <= capacity_in + FIT_TOLERANCE_IN) {
            Some((content, items)) => {
                *content += width;
                items.push(index);
            }
            None => boards.push((width, vec![index])),
        }
    }
    boards.into_iter().map(|(_, items)| items).collect()
}

fn shrink(boards: Vec<Vec<usize>>, widths_in: &[f64], stock: &Stock) -> Packing {
    boards
        .into_iter()
        .map(|items| (stock.shortest_holding(content_in(&items, widths_in)).unwrap_or(f64::INFINITY), items))
        .collect()
}

/// Items of one width still to place.
struct Group {
    width_in: f64,
    items: Vec<usize>,
}

struct Fill<'a> {
    groups: &'a [Group],
    taken: Vec<usize>,
    best_taken: Vec<usize>,
    best_in: f64,
    capacity_in: f64,
    smallest_in: f64,
    nodes: u64,
    node_limit: u64,
}

impl Fill<'_> {
    fn search(&mut self, from: usize, room_in: f64) {
        self.nodes += 1;
        let used_in = self.capacity_in - room_in;
        if used_in > self.best_in + FIT_TOLERANCE_IN {
            self.best_in = used_in;
            self.best_taken.clone_from(&self.taken);
        }
        if self.nodes > self.node_limit
            || room_in < self.smallest_in - FIT_TOLERANCE_IN
            || self.best_in >= self.capacity_in - FIT_TOLERANCE_IN
        {
            return;
        }
        for group in from..self.groups.len() {
            let Group { width_in, items } = &self.groups[group];
            let free = items.len() - self.taken[group];
            if free == 0 || *width_in > room_in + FIT_TOLERANCE_IN {
                continue;
            }
            let most = free.min(((room_in + FIT_TOLERANCE_IN) / width_in).floor() as usize);
            for count in (1..=most).rev() {
                self.taken[group] += count;
                self.search(group + 1, room_in - count as f64 * width_in);
                self.taken[group] -= count;
                if self.nodes > self.node_limit || self.best_in >= self.capacity_in - FIT_TOLERANCE_IN {
                    return;
                }
            }
        }
    }
}

fn min_slack(widths_in: &[f64], stock: &Stock, node_limit: u64) -> Packing {
    let mut groups: Vec<Group> = Vec::new();
    for (index, &width_in) in widths_in.iter().enumerate() {
        match groups.last_mut() {
            Some(group) if group.width_in == width_in => group.items.push(index),
            _ => groups.push(Group { width_in, items: vec![index] }),
        }
    }
    let mut packing = Packing::new();
    loop {
        groups.retain(|group| !group.items.is_empty());
        let (Some(first), Some(last)) = (groups.first(), groups.last()) else {
            break;
        };
        let (largest_in, smallest_in) = (first.width_in, last.width_in);
        let mut best: Option<(f64, f64, Vec<usize>)> = None;
        for &length_in in &stock.lengths_in {
            let capacity_in = length_in + stock.kerf_in;
            if largest_in > capacity_in + FIT_TOLERANCE_IN {
                continue;
            }
            let mut taken = vec![0; groups.len()];
            taken[0] = 1;
            let mut fill = Fill {
                groups: &groups,
                taken,
                best_taken: Vec::new(),
                best_in: 0.0,
                capacity_in,
                smallest_in,
                nodes: 0,
                node_limit,
            };
            fill.search(0, capacity_in - largest_in);
            let waste_per_length = (capacity_in - fill.best_in) / length_in;
            let better = best.as_ref().is_none_or(|(best_waste, _, _)| waste_per_length < best_waste - 1e-12);
            if better {
                best = Some((waste_per_length, length_in, fill.best_taken));
            }
        }
        let Some((_, length_in, taken)) = best else {
            break;
        };
        let mut board = Vec::new();
        for (group, count) in groups.iter_mut().zip(taken) {
            for _ in 0..count {
                if let Some(item) = group.items.pop() {
                    board.push(item);
                }
            }
        }
        let length_in = stock.shortest_holding(content_in(&board, widths_in)).unwrap_or(length_in);
        packing.push((length_in, board));
    }
    packing
}

/// Re-packs groups of the emptiest boards exactly, keeping cheaper results.
fn improve(packing: &mut Packing, widths_in: &[f64], stock: &Stock) {
    for attempt in 0..REPACK_ATTEMPTS {
        let mut order: Vec<usize> = (0..packing.len()).collect();
        let fullness = |board: usize| {
            packing.get(board).map_or(1.0, |(length_in, items)| content_in(items, widths_in) / length_in)
        };
        order.sort_by(|&a, &b| fullness(a).total_cmp(&fullness(b)));
        // Each attempt starts one board further along the emptiest-first
        // order, so a window that cannot improve is not retried.
        let skip = attempt % order.len().max(1);
        let mut chosen = Vec::new();
        let mut items = Vec::new();
        for &board in order.iter().skip(skip) {
            let Some((_, on_board)) = packing.get(board) else { continue };
            if items.len() + on_board.len() > REPACK_MAX_ITEMS {
                break;
            }
            chosen.push(board);
            items.extend(on_board.iter().copied());
        }
        if chosen.len() < 2 {
            if skip == 0 {
                return;
            }
            continue;
        }
        let current_in: f64 =
            chosen.iter().filter_map(|&board| packing.get(board)).map(|(length, _)| length).sum();
        if let ExactOutcome::Improved(better) =
            exact::pack(widths_in, &items, stock, current_in, REPACK_NODE_LIMIT)
        {
            chosen.sort_unstable();
            for &board in chosen.iter().rev() {
                packing.swap_remove(board);
            }
            packing.extend(better);
        }
    }
}
