//! Chaining the traced boundary arcs of each wall's face into one polygon.

use std::collections::HashMap;

use super::wavefront::NodeId;

/// A face's boundary: the outer walk and any inner loops.
pub(crate) type FaceBoundary = (Vec<NodeId>, Vec<Vec<NodeId>>);

/// Chains `arcs` (face on the left) into one closed walk starting with the
/// arc `first`, plus closed loops for what is left: a low-pitch plane can
/// flow all round a courtyard's island of steeper planes, so its face has
/// holes. Opposite arcs within the face cancel (they are the two sides of a
/// square line between two pieces of the same wall line). Returns the nodes
/// of each walk in order (without repeating the first), or `None` if the
/// arcs do not close into boundaries.
pub(crate) fn chain_face(first: (NodeId, NodeId), arcs: &[(NodeId, NodeId)]) -> Option<FaceBoundary> {
    let mut count: HashMap<(NodeId, NodeId), i64> = HashMap::new();
    for &arc in std::iter::once(&first).chain(arcs) {
        if arc.0 == arc.1 {
            continue;
        }
        let back = (arc.1, arc.0);
        match count.get_mut(&back) {
            Some(c) if *c > 0 => *c -= 1,
            _ => *count.entry(arc).or_insert(0) += 1,
        }
    }
    let mut out: HashMap<NodeId, Vec<NodeId>> = HashMap::new();
    let mut total = 0usize;
    let mut keys: Vec<_> = count.iter().filter(|(_, c)| **c > 0).map(|(k, c)| (*k, *c)).collect();
    keys.sort_unstable();
    for ((a, b), c) in keys {
        for _ in 0..c {
            out.entry(a).or_default().push(b);
            total += 1;
        }
    }
    // The wall arc must survive; take it out first so the walk begins with it.
    let list = out.get_mut(&first.0)?;
    let pos = list.iter().position(|&b| b == first.1)?;
    list.swap_remove(pos);
    // Hierholzer's walk, so a face touching itself at a point still comes
    // out as one boundary.
    let mut stack = vec![first.0, first.1];
    let mut walk: Vec<NodeId> = Vec::new();
    while let Some(&top) = stack.last() {
        match out.get_mut(&top).and_then(Vec::pop) {
            Some(next) => stack.push(next),
            None => {
                walk.push(top);
                stack.pop();
            }
        }
    }
    walk.reverse();
    if walk.first() != walk.last() || walk.first() != Some(&first.0) {
        return None;
    }
    walk.pop();
    let mut used = walk.len();
    let mut holes = Vec::new();
    while used < total {
        let mut keys: Vec<NodeId> = out.iter().filter(|(_, v)| !v.is_empty()).map(|(k, _)| *k).collect();
        keys.sort_unstable();
        let start = *keys.first()?;
        let mut stack = vec![start];
        let mut lp: Vec<NodeId> = Vec::new();
        while let Some(&top) = stack.last() {
            match out.get_mut(&top).and_then(Vec::pop) {
                Some(next) => stack.push(next),
                None => {
                    lp.push(top);
                    stack.pop();
                }
            }
        }
        lp.reverse();
        if lp.len() < 2 || lp.first() != lp.last() {
            return None;
        }
        lp.pop();
        used += lp.len();
        holes.push(lp);
    }
    Some((walk, holes))
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn square_face_chains_in_order() {
        let arcs = [(2, 3), (3, 0), (1, 2)];
        assert_eq!(chain_face((0, 1), &arcs), Some((vec![0, 1, 2, 3], vec![])));
    }

    #[test]
    fn opposite_arcs_cancel() {
        let arcs = [(1, 2), (2, 5), (5, 2), (2, 0)];
        assert_eq!(chain_face((0, 1), &arcs), Some((vec![0, 1, 2], vec![])));
    }

    #[test]
    fn a_loop_left_over_is_a_hole() {
        let arcs = [(1, 2), (2, 0), (5, 7), (7, 6), (6, 5)];
        assert_eq!(chain_face((0, 1), &arcs), Some((vec![0, 1, 2], vec![vec![5, 7, 6]])));
    }

    #[test]
    fn open_chain_is_refused() {
        assert_eq!(chain_face((0, 1), &[(1, 2)]), None);
    }
}
