//! Chaining the traced boundary arcs of each wall's face into one polygon.

use std::collections::HashMap;

use super::wavefront::NodeId;

/// Chains `arcs` (face on the left) into one closed walk starting with the
/// arc `first`. Opposite arcs within the face cancel (they are the two sides
/// of a square line between two pieces of the same wall line). Returns the
/// nodes in order (without repeating the first), or `None` if the arcs do
/// not close into one boundary.
pub(crate) fn chain_face(first: (NodeId, NodeId), arcs: &[(NodeId, NodeId)]) -> Option<Vec<NodeId>> {
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
    if walk.len() != total + 1 || walk.first() != walk.last() || walk.first() != Some(&first.0) {
        return None;
    }
    walk.pop();
    Some(walk)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn square_face_chains_in_order() {
        let arcs = [(2, 3), (3, 0), (1, 2)];
        assert_eq!(chain_face((0, 1), &arcs), Some(vec![0, 1, 2, 3]));
    }

    #[test]
    fn opposite_arcs_cancel() {
        let arcs = [(1, 2), (2, 5), (5, 2), (2, 0)];
        assert_eq!(chain_face((0, 1), &arcs), Some(vec![0, 1, 2]));
    }

    #[test]
    fn open_chain_is_refused() {
        assert_eq!(chain_face((0, 1), &[(1, 2)]), None);
    }
}
