//! Wavefront events: when an edge piece shrinks to nothing, and when a reflex
//! vertex runs into a wall line.

use std::cmp::Ordering;

use glam::DVec2;

use super::wavefront::{Corner, EdgeId, VertexId, Wavefront};

/// How many split candidates a reflex vertex keeps at a time in the full
/// search; the rest are recomputed only if all of these turn out not to happen.
const SPLIT_CANDIDATES_KEPT: usize = 16;

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

/// Heights scanned together in the full search's second pass: a run whose
/// lowest height cannot be kept is passed over at once.
const SCAN_CHUNK: usize = 32;

/// The lowest of `heights` (none of them NaN), four lanes at a time so the
/// compiler can take two at once.
#[inline]
fn lowest_of(heights: &[f64]) -> f64 {
    let mut lanes = [f64::INFINITY; 4];
    let quads = heights.chunks_exact(4);
    let rest = quads.remainder();
    for quad in quads {
        for (m, &t) in lanes.iter_mut().zip(quad) {
            *m = if t < *m { t } else { *m };
        }
    }
    let lowest = rest.iter().fold(f64::INFINITY, |m, &t| if t < m { t } else { m });
    lanes.iter().fold(lowest, |m, &t| if t < m { t } else { m })
}

/// A reflex vertex's path as the full split search reads it.
struct Ray {
    /// Plan position at `t0`.
    anchor: DVec2,
    /// Plan velocity per unit of height.
    vel: DVec2,
    /// Height at which the vertex started.
    t0: f64,
    /// Candidates before this height are not wanted.
    after: f64,
    /// The point tolerance.
    tol: f64,
}

/// Writes into `times` the height at which `ray` meets each line of
/// `columns` (normal x, normal y, offset, speed), or infinity for a line it
/// does not meet from the inner side at or after `ray.after`; `BORN` says
/// the vertex was born at an event (above height 0), `INCLUSIVE` whether a
/// height equal to `ray.after` counts.
///
/// The same expressions as [`split_time`], each test written so that it
/// gives what the test it stands for gives for every value, not a number
/// (NaN) included, given a finite `ray.after`.
fn split_heights<const BORN: bool, const INCLUSIVE: bool>(
    ray: &Ray,
    columns: &[Vec<f64>; 4],
    times: &mut Vec<f64>,
) {
    let Ray { anchor, vel, t0, after, tol } = *ray;
    let [nxs, nys, offsets, speeds] = columns;
    let lines = nxs.iter().zip(nys).zip(offsets).zip(speeds);
    times.extend(lines.map(|(((&nx, &ny), &offset), &speed)| {
        let d0 = nx * anchor.x + ny * anchor.y - offset - speed * t0;
        let rate = nx * vel.x + ny * vel.y - speed;
        let t = t0 + d0.max(0.0) / -rate;
        // A vertex born at an event on a line that passes through its birth
        // point has already been resolved against it there: then the line
        // must lie beyond the tolerance, otherwise only not behind it.
        let behind = if BORN { d0 <= tol } else { d0 < -tol };
        let meets = !(behind | (rate >= 0.0));
        // Finite and not before `after` (nor at it unless `INCLUSIVE`):
        // `after` is always a finite height, so a height at or past it is
        // neither NaN nor minus infinity.
        let in_range = (t < f64::INFINITY) & if INCLUSIVE { t >= after } else { t > after };
        if meets & in_range { t } else { f64::INFINITY }
    }));
}

/// Computes the split candidates of reflex vertex `v` later than `after`
/// (or at `after` if `inclusive`), keeping the earliest few.
pub(crate) fn compute_splits(wf: &mut Wavefront, v: VertexId, after: f64, inclusive: bool) {
    let Some(vx) = wf.vertices.get(v) else { return };
    if vx.corner != Corner::Reflex || !vx.alive {
        return;
    }
    let (anchor, vel, t0, own) = (vx.anchor, vx.vel, vx.t0, [vx.in_line, vx.out_line]);
    // One buffer for every call: a fresh one as long as the wall count
    // each time cost more in allocation than the search itself.
    let mut found = std::mem::take(&mut wf.split_scratch);
    found.clear();
    // The earliest few heights so far, in order: a candidate later than
    // the last of them can never be kept, so it is not even stored.
    let mut earliest = [f64::INFINITY; SPLIT_CANDIDATES_KEPT];
    // First every line's height, in a loop with no branches that the
    // compiler can run two lines at a time, as infinity for a line ruled
    // out; then a quick pass for the few worth keeping. The heights and
    // the tests are those of one loop doing both, to the bit.
    let mut times = std::mem::take(&mut wf.split_times);
    times.clear();
    let tol = wf.tol.point;
    // The loop is made in four kinds, so that what holds for the whole
    // search (whether the vertex was born at an event, whether a height
    // equal to `after` counts) is not tested again for every line.
    let from = Ray { anchor, vel, t0, after, tol };
    match (t0 > 0.0, inclusive) {
        (true, true) => split_heights::<true, true>(&from, &wf.line_columns, &mut times),
        (true, false) => split_heights::<true, false>(&from, &wf.line_columns, &mut times),
        (false, true) => split_heights::<false, true>(&from, &wf.line_columns, &mut times),
        (false, false) => split_heights::<false, false>(&from, &wf.line_columns, &mut times),
    }
    for i in own {
        if let Some(t) = times.get_mut(i) {
            *t = f64::INFINITY;
        }
    }
    // Each run's lowest height first. The few-th lowest of those is a bound
    // no candidate that can be kept is above: at least the few runs' lowest
    // heights are no later than it.
    let mut lows = std::mem::take(&mut wf.split_lows);
    lows.clear();
    lows.extend(times.chunks(SCAN_CHUNK).map(lowest_of));
    let mut lowest_runs = [f64::INFINITY; SPLIT_CANDIDATES_KEPT];
    for &low in &lows {
        if low < lowest_runs[SPLIT_CANDIDATES_KEPT - 1] {
            let mut k = SPLIT_CANDIDATES_KEPT - 1;
            lowest_runs[k] = low;
            while k > 0 && lowest_runs[k - 1] > low {
                lowest_runs.swap(k - 1, k);
                k -= 1;
            }
        }
    }
    let few_th = lowest_runs[SPLIT_CANDIDATES_KEPT - 1];
    let first_bound = if few_th == f64::INFINITY { f64::MAX } else { few_th };
    // A height above `bound` cannot be kept: the latest kept so far, or
    // the first bound while fewer than the few have been found.
    let bound = |earliest: &[f64; SPLIT_CANDIDATES_KEPT]| {
        let last = earliest[SPLIT_CANDIDATES_KEPT - 1];
        if last == f64::INFINITY { first_bound } else { last.min(first_bound) }
    };
    let mut above = bound(&earliest);
    // Whether some candidate was passed over as later than all those kept.
    let mut passed_over = false;
    for ((c, chunk), &lowest) in times.chunks(SCAN_CHUNK).enumerate().zip(&lows) {
        // A run of heights all above the bound is passed over whole; the
        // bound only falls, so nothing in it could have been kept.
        if lowest > above {
            passed_over |= lowest != f64::INFINITY;
            continue;
        }
        for (k, &t) in chunk.iter().enumerate() {
            if t > above {
                passed_over |= t != f64::INFINITY;
                continue;
            }
            found.push((t, c * SCAN_CHUNK + k));
            let mut k = SPLIT_CANDIDATES_KEPT - 1;
            earliest[k] = t;
            while k > 0 && earliest[k - 1] > t {
                earliest.swap(k - 1, k);
                k -= 1;
            }
            above = bound(&earliest);
        }
    }
    wf.split_lows = lows;
    wf.split_times = times;
    // Every candidate is either stored or passed over, and one is passed
    // over only once the few are known to be no later (found, or the first
    // bound's runs): so there are more candidates than the few exactly when
    // more were stored or any passed over.
    let stored = found.len();
    let mut truncated = false;
    if stored > SPLIT_CANDIDATES_KEPT || passed_over {
        // Keep the earliest few plus every candidate tied with the last one
        // kept, so a recompute "strictly later" never skips one.
        let limit = earliest[SPLIT_CANDIDATES_KEPT - 1];
        found.retain(|c| c.0 <= limit);
        truncated = passed_over || found.len() < stored;
    }
    // Ties in height keep the lines' order, whatever the search kept.
    found.sort_by(|a, b| a.0.total_cmp(&b.0));
    found.reverse();
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
