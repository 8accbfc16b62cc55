//! Wavefront events: when an edge piece shrinks to nothing, and when a reflex
//! vertex runs into a wall line.

use std::cmp::Ordering;

use super::split_search::{LineBlocks, Ray};
use super::wavefront::{Corner, EdgeId, VertexId, Wavefront};

/// What happens at an event.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum EventKind {
    /// Edge piece `edge`, running from `start` to `end`, shrinks to a point.
    Edge {
        /// The shrinking piece.
        edge: EdgeId,
        /// Its start vertex when the event was computed.
        start: VertexId,
        /// Its end vertex when the event was computed.
        end: VertexId,
    },
    /// Reflex vertex `vertex` reaches the moving line `line`.
    Split {
        /// The reflex vertex.
        vertex: VertexId,
        /// The wall line it reaches.
        line: usize,
    },
}

/// An event at a height, ordered so the lowest comes first out of a max-heap.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Event {
    /// Height at which it happens.
    pub time: f64,
    /// What happens.
    pub kind: EventKind,
}

impl Eq for Event {}

impl PartialOrd for Event {
    fn partial_cmp(&self, other: &Self) -> Option<Ordering> {
        Some(self.cmp(other))
    }
}

impl Event {
    /// What orders events at one height: edge events first, then by the
    /// pieces and vertices they name, so the order never depends on the
    /// queue's history (which events happened to be pushed before).
    pub(crate) fn tie_key(&self) -> (u8, usize, usize, usize) {
        match self.kind {
            EventKind::Edge { edge, start, end } => (0, edge, start, end),
            EventKind::Split { vertex, line } => (1, vertex, line, 0),
        }
    }
}

impl Ord for Event {
    fn cmp(&self, other: &Self) -> Ordering {
        other.time.total_cmp(&self.time).then_with(|| other.tie_key().cmp(&self.tie_key()))
    }
}

/// Height at which edge piece `e` shrinks to a point, if it shrinks at all.
pub(crate) fn edge_collapse(wf: &Wavefront, e: EdgeId, now: f64) -> Option<Event> {
    let edge = wf.edges.get(e)?;
    if !edge.alive {
        return None;
    }
    let (s, f) = (wf.vertices.get(edge.start)?, wf.vertices.get(edge.end)?);
    let dir = wf.lines.get(edge.line)?.dir;
    let rate = dir.dot(f.vel - s.vel);
    let t_ref = s.t0.max(f.t0);
    let length = dir.dot(wf.pos(edge.end, t_ref) - wf.pos(edge.start, t_ref));
    if rate >= 0.0 {
        // A piece that is not shrinking but already has no length is
        // resolved at once; otherwise it never collapses.
        if length.abs() <= wf.tol.point && edge.start != edge.end {
            return Some(Event {
                time: now,
                kind: EventKind::Edge { edge: e, start: edge.start, end: edge.end },
            });
        }
        return None;
    }
    let time = (t_ref - length / rate).max(now);
    time.is_finite()
        .then_some(Event { time, kind: EventKind::Edge { edge: e, start: edge.start, end: edge.end } })
}

/// Height at which reflex vertex `v` reaches the moving `line`, if it does
/// so at or after height `after` from the line's inner side.
pub(crate) fn split_time(wf: &Wavefront, v: VertexId, line: usize, after: f64) -> Option<f64> {
    let vx = wf.vertices.get(v)?;
    if vx.corner != Corner::Reflex || !vx.alive {
        return None;
    }
    let (anchor, vel, t0) = (vx.anchor, vx.vel, vx.t0);
    let &[nx, ny, offset, speed] = wf.packed_lines.get(line)?;
    let d0 = nx * anchor.x + ny * anchor.y - offset - speed * t0;
    let rate = nx * vel.x + ny * vel.y - speed;
    // A vertex born at an event on a line that passes through its birth
    // point has already been resolved against it there.
    let born_on_line = t0 > 0.0 && d0 <= wf.tol.point;
    if d0 < -wf.tol.point || rate >= 0.0 || line == vx.in_line || line == vx.out_line || born_on_line {
        return None;
    }
    let t = t0 + d0.max(0.0) / -rate;
    (t.is_finite() && t >= after).then_some(t)
}

/// Computes the split candidates of reflex vertex `v` later than `after`
/// (or at `after` if `inclusive`), keeping the earliest few.
pub(crate) fn compute_splits(wf: &mut Wavefront, v: VertexId, after: f64, inclusive: bool) {
    let Some(vx) = wf.vertices.get(v) else { return };
    if vx.corner != Corner::Reflex || !vx.alive {
        return;
    }
    let ray = Ray { anchor: vx.anchor, vel: vx.vel, t0: vx.t0, after, tol: wf.tol.point };
    let own = [vx.in_line, vx.out_line];
    // One buffer for every call: a fresh one as long as the wall count
    // each time cost more in allocation than the search itself.
    let mut found = std::mem::take(&mut wf.split_scratch);
    found.clear();
    let blocks = wf.line_blocks.get_or_insert_with(|| LineBlocks::new(&wf.lines));
    // The search is made in four kinds, so that what holds for the whole
    // search (whether the vertex was born at an event, whether a height
    // equal to `after` counts) is not tested again for every line.
    let truncated = match (ray.t0 > 0.0, inclusive) {
        (true, true) => blocks.search::<true, true>(&ray, own, &mut found),
        (true, false) => blocks.search::<true, false>(&ray, own, &mut found),
        (false, true) => blocks.search::<false, true>(&ray, own, &mut found),
        (false, false) => blocks.search::<false, false>(&ray, own, &mut found),
    };
    if let Some(vx) = wf.vertices.get_mut(v) {
        vx.splits = found.clone();
        vx.splits_truncated = truncated;
    }
    wf.split_scratch = found;
}

/// The next split candidate of `v` as an event, recomputing when the kept
/// ones have run out.
pub(crate) fn next_split(wf: &mut Wavefront, v: VertexId, last: f64) -> Option<Event> {
    let needs_more = wf.vertices.get(v).is_some_and(|x| x.alive && x.splits.is_empty() && x.splits_truncated);
    if needs_more {
        compute_splits(wf, v, last, false);
    }
    let vx = wf.vertices.get_mut(v)?;
    if !vx.alive {
        return None;
    }
    let (time, line) = vx.splits.pop()?;
    Some(Event { time, kind: EventKind::Split { vertex: v, line } })
}

/// The live edge piece of `line` that reflex vertex `v` touches at height `t`, if any.
pub(crate) fn split_target(wf: &Wavefront, v: VertexId, line: usize, t: f64) -> Option<EdgeId> {
    let p = wf.pos(v, t);
    let l = wf.lines.get(line)?;
    if l.distance_at(p, t).abs() > 10.0 * wf.tol.point {
        return None;
    }
    let pieces = wf.pieces_by_line.get(line)?;
    let tol = wf.tol.point;
    pieces.iter().copied().find(|&e| {
        let Some(edge) = wf.edges.get(e) else {
            return false;
        };
        if !edge.alive || edge.start == v || edge.end == v {
            return false;
        }
        let a = l.dir.dot(p - wf.pos(edge.start, t));
        let b = l.dir.dot(wf.pos(edge.end, t) - p);
        a >= -tol && b >= -tol
    })
}
