//! Chaining the traced boundary arcs of each wall's face into one polygon.

use glam::DVec2;

use super::wavefront::NodeId;

/// A face's boundary: the outer walk and any inner loops.
pub(crate) type FaceBoundary = (Vec<NodeId>, Vec<Vec<NodeId>>);

/// Space kept from one face to the next by [`chain_face`].
#[derive(Debug, Default)]
pub(crate) struct ChainScratch {
    /// For each node, its place in the face's list of nodes left by an
    /// arc, or `NO_SLOT`; set back to `NO_SLOT` once a face is done.
    slot: Vec<u32>,
    /// The arcs as unordered pairs, with `+1` for low to high and `-1` back.
    pairs: Vec<(NodeId, NodeId, i64)>,
    /// The arcs left once opposite ones cancel, with how many times each is walked.
    arcs: Vec<((NodeId, NodeId), i64)>,
}

/// A node left by no arc of the face being chained.
const NO_SLOT: u32 = u32::MAX;

/// Chains `arcs` (face on the left) into one closed walk starting with the
/// arc `first`, plus closed loops for what is left: a low-pitch plane can
/// flow all round a courtyard's island of steeper planes, so its face has
/// holes. Opposite arcs within the face cancel (they are the two sides of a
/// square line between two pieces of the same wall line). Returns the nodes
/// of each walk in order (without repeating the first), or `None` if the
/// arcs do not close into boundaries.
pub(crate) fn chain_face(
    first: (NodeId, NodeId),
    arcs: &[(NodeId, NodeId)],
    scratch: &mut ChainScratch,
) -> Option<FaceBoundary> {
    // Opposite arcs cancel one for one, so what is left of each pair of
    // nodes is the difference of the two ways' counts, whatever the order
    // the arcs came in: summed over the arcs sorted by their pair of nodes.
    let pairs = &mut scratch.pairs;
    pairs.clear();
    for &(a, b) in std::iter::once(&first).chain(arcs) {
        match a.cmp(&b) {
            std::cmp::Ordering::Less => pairs.push((a, b, 1)),
            std::cmp::Ordering::Greater => pairs.push((b, a, -1)),
            std::cmp::Ordering::Equal => {}
        }
    }
    pairs.sort_unstable_by_key(|&(a, b, _)| (a, b));
    let left = &mut scratch.arcs;
    left.clear();
    let mut i = 0;
    while let Some(&(a, b, _)) = pairs.get(i) {
        let mut net = 0;
        while let Some(&(c, d, s)) = pairs.get(i)
            && (c, d) == (a, b)
        {
            net += s;
            i += 1;
        }
        match net.cmp(&0) {
            std::cmp::Ordering::Greater => left.push(((a, b), net)),
            std::cmp::Ordering::Less => left.push(((b, a), -net)),
            std::cmp::Ordering::Equal => {}
        }
    }
    left.sort_unstable_by_key(|&(arc, _)| arc);
    let mut out = Outgoing::from_sorted(left, &mut scratch.slot);
    let walked = chain_walks(first, &mut out);
    out.release();
    walked
}

/// Hierholzer's walks over `out`, the wall's arc `first` first.
fn chain_walks(first: (NodeId, NodeId), out: &mut Outgoing<'_>) -> Option<FaceBoundary> {
    let total = out.targets.len();
    // The wall arc must survive; take it out first so the walk begins with it.
    out.take(first)?;
    // Hierholzer's walk, so a face touching itself at a point still comes
    // out as one boundary.
    let mut stack: Vec<NodeId> = Vec::with_capacity(total + 2);
    stack.extend([first.0, first.1]);
    let mut walk: Vec<NodeId> = Vec::with_capacity(total + 1);
    while let Some(&top) = stack.last() {
        match out.pop(top) {
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
        let start = out.lowest_left()?;
        stack.clear();
        stack.push(start);
        let mut lp: Vec<NodeId> = Vec::new();
        while let Some(&top) = stack.last() {
            match out.pop(top) {
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

/// The arcs still to walk, by the node they leave: one flat list in arc
/// order and each node's stretch of it, so a face of thousands of nodes
/// needs no list of its own per node.
struct Outgoing<'a> {
    /// Arc ends, grouped by the node the arc leaves, in arc order.
    targets: Vec<NodeId>,
    /// For each node of `order`, its stretch of `targets` not yet walked.
    stretch: Vec<(usize, usize)>,
    /// The nodes left by an arc, lowest first.
    order: Vec<NodeId>,
    /// For each node, its place in `order` or `NO_SLOT`.
    slot: &'a mut Vec<u32>,
    /// Nodes of `order` before this one have no arc left.
    cursor: usize,
}

impl<'a> Outgoing<'a> {
    /// From arcs sorted by their nodes, each with how many times it is
    /// walked; `slot` holds `NO_SLOT` for every node.
    fn from_sorted(arcs: &[((NodeId, NodeId), i64)], slot: &'a mut Vec<u32>) -> Self {
        let mut targets = Vec::with_capacity(arcs.len());
        let mut stretch: Vec<(usize, usize)> = Vec::with_capacity(arcs.len());
        let mut order = Vec::with_capacity(arcs.len());
        for &((a, b), c) in arcs {
            if order.last() != Some(&a) {
                if slot.len() <= a {
                    slot.resize(a + 1, NO_SLOT);
                }
                if let Some(s) = slot.get_mut(a) {
                    *s = order.len() as u32;
                }
                order.push(a);
                stretch.push((targets.len(), targets.len()));
            }
            for _ in 0..c {
                targets.push(b);
            }
            if let Some(s) = stretch.last_mut() {
                s.1 = targets.len();
            }
        }
        Self { targets, stretch, order, slot, cursor: 0 }
    }

    /// Sets `slot` back to `NO_SLOT` for this face's nodes.
    fn release(self) {
        for &n in &self.order {
            if let Some(s) = self.slot.get_mut(n) {
                *s = NO_SLOT;
            }
        }
    }

    /// The stretch of `from`, if it leaves any arc.
    fn stretch_of(&mut self, from: NodeId) -> Option<&mut (usize, usize)> {
        let k = *self.slot.get(from)?;
        if k == NO_SLOT {
            return None;
        }
        self.stretch.get_mut(k as usize)
    }

    /// Takes the last arc left leaving `from`.
    fn pop(&mut self, from: NodeId) -> Option<NodeId> {
        let s = self.stretch_of(from)?;
        if s.1 <= s.0 {
            return None;
        }
        s.1 -= 1;
        let end = s.1;
        self.targets.get(end).copied()
    }

    /// Takes out the arc `arc`, the last arc of its node moving into its place.
    fn take(&mut self, arc: (NodeId, NodeId)) -> Option<()> {
        let &mut (start, end) = self.stretch_of(arc.0)?;
        let pos = (start..end).find(|&i| self.targets.get(i) == Some(&arc.1))?;
        self.targets.swap(pos, end - 1);
        if let Some(s) = self.stretch_of(arc.0) {
            s.1 = end - 1;
        }
        Some(())
    }

    /// The lowest node with an arc left.
    fn lowest_left(&mut self) -> Option<NodeId> {
        while let Some(&(start, end)) = self.stretch.get(self.cursor) {
            if end > start {
                return self.order.get(self.cursor).copied();
            }
            self.cursor += 1;
        }
        None
    }
}

/// Which ring of which face: `(wall, 0)` the outer walk, `(wall, k)` hole `k - 1`.
type RingId = (usize, usize);

/// What to do about one fold.
enum Fix {
    /// Close up the tip: these nodes, within the tolerance of each other,
    /// become the first of them.
    Merge(Vec<NodeId>),
    /// Cut node `index` out of ring `ring`; give the neighbour's ring
    /// (ring, index, node) the node where the fold turned back.
    Cut { ring: RingId, index: usize, insert: Option<(RingId, usize, NodeId)> },
}

/// Clears the faces of folds narrower than `tol`.
///
/// Where a plane is squeezed out between two others along a stretch (a
/// low-pitch plane crept along walls bent by a hair), its face can come
/// back along its own edge, a hair over on the wrong side: a ring crossing
/// itself however thin. Each such fold's tip is cut off (first closing up
/// nodes at the tip within `tol` of each other in plan and in height, the
/// lower-numbered node kept), and the neighbour across the longer of the
/// fold's two edges gets the node where the fold turned back, so the
/// planes on either side of it share that stretch edge to edge. A face is
/// never cut below three nodes, the wall's own edge (the first two nodes
/// of a face) is never cut, and gable faces (`gable[wall]`), vertical and
/// so flat in plan, are only ever given nodes.
pub(crate) fn remove_slivers(
    positions: &[DVec2],
    heights: &[f64],
    gable: &[bool],
    faces: &mut [Vec<NodeId>],
    holes: &mut [Vec<Vec<NodeId>>],
    tol: f64,
) {
    let pos = |n: NodeId| positions.get(n).copied().unwrap_or(DVec2::ZERO);
    let height = |n: NodeId| heights.get(n).copied().unwrap_or(0.0);
    let limit = 4 * (faces.iter().map(Vec::len).sum::<usize>() + 1);
    for _ in 0..limit {
        match find_fold(&pos, &height, gable, faces, holes, tol) {
            None => break,
            Some(Fix::Merge(nodes)) => {
                let Some(&keep) = nodes.iter().min() else { break };
                for ring in faces.iter_mut().chain(holes.iter_mut().flatten()) {
                    for n in ring.iter_mut() {
                        if nodes.contains(n) {
                            *n = keep;
                        }
                    }
                    ring.dedup();
                    while ring.len() > 1 && ring.first() == ring.last() {
                        ring.pop();
                    }
                }
            }
            Some(Fix::Cut { ring, index, insert }) => {
                if let Some(r) = ring_mut(faces, holes, ring) {
                    r.remove(index);
                }
                if let Some((owner, j, node)) = insert
                    && let Some(r) = ring_mut(faces, holes, owner)
                {
                    r.insert(j, node);
                }
            }
        }
    }
}

/// The ring `id`, if it exists.
fn ring_mut<'a>(
    faces: &'a mut [Vec<NodeId>],
    holes: &'a mut [Vec<Vec<NodeId>>],
    id: RingId,
) -> Option<&'a mut Vec<NodeId>> {
    match id.1 {
        0 => faces.get_mut(id.0),
        k => holes.get_mut(id.0)?.get_mut(k - 1),
    }
}

/// Every ring with its id.
fn rings<'a>(
    faces: &'a [Vec<NodeId>],
    holes: &'a [Vec<Vec<NodeId>>],
) -> impl Iterator<Item = (RingId, &'a Vec<NodeId>)> + 'a {
    let outer = faces.iter().enumerate().map(|(w, r)| ((w, 0), r));
    let inner =
        holes.iter().enumerate().flat_map(|(w, hs)| hs.iter().enumerate().map(move |(k, r)| ((w, k + 1), r)));
    outer.chain(inner)
}

/// The first fold of a pitched face and how to clear it.
fn find_fold(
    pos: &impl Fn(NodeId) -> DVec2,
    height: &impl Fn(NodeId) -> f64,
    gable: &[bool],
    faces: &[Vec<NodeId>],
    holes: &[Vec<Vec<NodeId>>],
    tol: f64,
) -> Option<Fix> {
    let near = |a: NodeId, b: NodeId| pos(a).distance(pos(b)) <= tol && (height(a) - height(b)).abs() <= tol;
    for (id, ring) in rings(faces, holes) {
        let k = ring.len();
        if k <= 3 || gable.get(id.0).copied().unwrap_or(true) {
            continue;
        }
        let at = |i: usize| ring.get(i % k).copied();
        for i in 0..k {
            let Some(cur) = at(i) else { continue };
            // The tip: `cur` and the nodes next to it within the tolerance.
            let Some(back) = (1..k).find(|&d| at(i + k - d).is_some_and(|n| !near(n, cur))) else { continue };
            let Some(ahead) = (1..k).find(|&d| at(i + d).is_some_and(|n| !near(n, cur))) else { continue };
            if back + ahead > k {
                continue;
            }
            let (Some(prev), Some(next)) = (at(i + k - back), at(i + ahead)) else { continue };
            let (u, v) = (pos(cur) - pos(prev), pos(next) - pos(cur));
            let long = u.length().max(v.length());
            // A turn right by nearly half a turn folds the ring back over
            // itself; nearly half a turn left is the tip of a thin wedge,
            // which is a shape of its own and stays.
            if u.dot(v) >= 0.0 || u.perp_dot(v) > 0.0 || -u.perp_dot(v) > tol * long {
                continue;
            }
            let tip: Vec<usize> = (i + k + 1 - back..=i + k + ahead - 1).map(|j| j % k).collect();
            // The wall's own edge stays whole, and the face keeps three nodes.
            if (id.1 == 0 && tip.iter().any(|&j| j < 2)) || k - tip.len() < 3 {
                continue;
            }
            if tip.len() > 1 {
                let nodes: Vec<NodeId> = tip.iter().filter_map(|&j| at(j)).collect();
                let shrinks = rings(faces, holes).any(|(_, r)| {
                    let left = r.iter().filter(|n| !nodes.contains(n)).count();
                    left < r.len() && left + 1 < 3
                });
                if shrinks {
                    continue;
                }
                return Some(Fix::Merge(nodes));
            }
            // The neighbour across the longer edge gets the shorter edge's far end.
            let (edge, node) =
                if u.length() >= v.length() { ((cur, prev), next) } else { ((next, cur), prev) };
            let insert = rings(faces, holes).find_map(|(other, r)| {
                let m = r.len();
                (0..m).find_map(|j| {
                    let (a, b) = (*r.get(j)?, *r.get((j + 1) % m)?);
                    ((a, b) == edge && !r.contains(&node)).then_some((other, j + 1, node))
                })
            });
            return Some(Fix::Cut { ring: id, index: i, insert });
        }
    }
    None
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn square_face_chains_in_order() {
        let arcs = [(2, 3), (3, 0), (1, 2)];
        assert_eq!(chain_face((0, 1), &arcs, &mut ChainScratch::default()), Some((vec![0, 1, 2, 3], vec![])));
    }

    #[test]
    fn opposite_arcs_cancel() {
        let arcs = [(1, 2), (2, 5), (5, 2), (2, 0)];
        assert_eq!(chain_face((0, 1), &arcs, &mut ChainScratch::default()), Some((vec![0, 1, 2], vec![])));
    }

    #[test]
    fn a_loop_left_over_is_a_hole() {
        let arcs = [(1, 2), (2, 0), (5, 7), (7, 6), (6, 5)];
        assert_eq!(
            chain_face((0, 1), &arcs, &mut ChainScratch::default()),
            Some((vec![0, 1, 2], vec![vec![5, 7, 6]]))
        );
    }

    #[test]
    fn open_chain_is_refused() {
        assert_eq!(chain_face((0, 1), &[(1, 2)], &mut ChainScratch::default()), None);
    }
}
