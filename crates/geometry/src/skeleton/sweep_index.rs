//! Where the wavefront will be over the next stretch of height: a uniform
//! grid over the plan holding, for a window of heights ahead, the region
//! each live edge piece sweeps and the path each reflex vertex runs. A
//! reflex vertex is tested for a split only against the wall lines whose
//! pieces share a grid cell with its path, instead of against every line.
//!
//! The index changes no event: it leaves out only split candidates that
//! could not be kept when their height came (no live piece of their line
//! near the vertex then), and pushes the rest as the full search would have.
//! Why that holds:
//! - a candidate is kept when, at its height `t`, the vertex stands on a
//!   live piece of its line. That piece, with its present end vertices,
//!   came into being at some event, and both it and the vertex have a
//!   window covering `t` in the grid; whichever of the two windows was
//!   put in last met the other in the cell holding the vertex's point at
//!   `t`, and tested the pair;
//! - windows are put in when a piece or reflex vertex appears (a piece
//!   "appears" again whenever one of its ends changes) and renewed, twice
//!   as long, before the queue reaches the height where they run out;
//! - the events a vertex would have met are pushed all at once rather than
//!   one after another, which gives the same order since [`Event`] orders
//!   events at one height by what they name, whatever the queue's history;
//! - a pair found after its height has already been passed is dropped: the
//!   full search tested it then, against pieces none of which held it.

use std::cmp::Ordering;
use std::collections::BinaryHeap;

use glam::DVec2;

use super::events::{self, Event, EventKind};
use super::wavefront::{Corner, EdgeId, VertexId, Wavefront};

/// Cells per wall line, about: enough that a piece's region covers few cells.
const CELLS_PER_LINE: f64 = 1.0;

/// Mean wall length, in cells, beyond which the grid costs more than
/// testing every line (the star benchmarks, whose walls run about 1,000 in through cells of 130 to 400 in, are past it; the combs, about 1.6, are not).
const LONG_WALLS: f64 = 2.0;

/// What a grid entry stands for.
#[derive(Debug, Clone, Copy, PartialEq, Eq, PartialOrd, Ord)]
enum Mover {
    /// An edge piece, as it was at the given change count.
    Piece(EdgeId, u32),
    /// A reflex vertex.
    Vertex(VertexId),
}

/// One window of a mover, entered in every cell its region touches.
#[derive(Debug, Clone, Copy)]
struct Entry {
    /// The piece or vertex.
    mover: Mover,
    /// Height at which the window opens.
    from: f64,
    /// Height at which the window runs out.
    to: f64,
    /// Where it goes in that window: for a vertex, its path's two ends; for
    /// a piece, its line's normal and the ranges across and along the line
    /// that its region covers.
    shape: [f64; 6],
}

impl Entry {
    /// Whether a vertex path and a piece region can meet (a test on the
    /// piece line's two axes, so a long piece beside a path is ruled out).
    fn can_meet(path: &[f64; 6], piece: &[f64; 6]) -> bool {
        let [ax, ay, bx, by, _, _] = *path;
        let [nx, ny, across_lo, across_hi, along_lo, along_hi] = *piece;
        let (sa, sb) = (nx * ax + ny * ay, nx * bx + ny * by);
        let (ta, tb) = (ny * ax - nx * ay, ny * bx - nx * by);
        sa.max(sb) >= across_lo && sa.min(sb) <= across_hi && ta.max(tb) >= along_lo && ta.min(tb) <= along_hi
    }
}

/// A window to renew when the queue reaches height `to`.
#[derive(Debug, Clone, Copy, PartialEq)]
struct Renewal {
    /// Height at which the present window runs out.
    to: f64,
    /// Length in height of the present window.
    span: f64,
    /// The piece or vertex.
    mover: Mover,
}

impl Eq for Renewal {}

impl PartialOrd for Renewal {
    fn partial_cmp(&self, other: &Self) -> Option<Ordering> {
        Some(self.cmp(other))
    }
}

impl Ord for Renewal {
    fn cmp(&self, other: &Self) -> Ordering {
        // Lowest first out of the max-heap.
        other.to.total_cmp(&self.to).then_with(|| other.mover.cmp(&self.mover))
    }
}

/// Which candidates found now the full search would still have tested.
#[derive(Debug, Clone, Copy)]
enum Keep {
    /// A vertex searched for the first time at an event at this height: every
    /// candidate from this height on, as the full search pushed them all then.
    From(f64),
    /// Only those the queue has not yet passed.
    Unpassed,
}

/// The grid of the wavefront's coming regions, with the bookkeeping that
/// keeps it in step with the wavefront.
#[derive(Debug, Clone)]
pub(crate) struct SweepIndex {
    /// Lower left corner of the grid.
    min: DVec2,
    /// Side of a square cell.
    cell: f64,
    /// Cells across.
    cols: usize,
    /// Cells up.
    rows: usize,
    /// Piece entries by cell, row by row, then one last cell for all that
    /// reaches outside the grid.
    pieces: Vec<Vec<Entry>>,
    /// Vertex entries, laid out as `pieces`.
    paths: Vec<Vec<Entry>>,
    /// How many times each edge piece has changed (its entries name the count).
    versions: Vec<u32>,
    /// Whether each vertex has been searched for splits.
    searched: Vec<bool>,
    /// The height at which each vertex was first searched.
    floor: Vec<f64>,
    /// The step at which each vertex was last searched.
    generation: Vec<u64>,
    /// Updates so far.
    step: u64,
    /// Lines each vertex already has a candidate on.
    accepted: Vec<Vec<usize>>,
    /// Windows waiting to be renewed.
    renewals: BinaryHeap<Renewal>,
    /// The latest event taken from the queue, or every event up to a
    /// height: candidates at or before it were tested already.
    passed: (f64, (u8, usize, usize, usize)),
    /// Plan slack round every region, well beyond the point tolerance.
    pad: f64,
    /// Height slack at the ends of every window.
    slack: f64,
    /// A height no event can reach; a vertex still searching past it falls
    /// back on testing every line.
    ceiling: f64,
    /// Whether the outline's walls are so long against the cells (a star
    /// of thin spikes) that every piece would fill many crowded cells: then
    /// each reflex vertex is tested against every line, its candidates
    /// taken a few at a time, and the grid stays empty.
    full_search: bool,
    /// Pairs met in the cells scanned, tested once the scan is done.
    met: Vec<(VertexId, EdgeId)>,
    /// For each piece, the last scan that met it (so a pair met in several
    /// cells is tested once).
    piece_seen: Vec<u64>,
    /// For each vertex, the last scan that met it.
    vertex_seen: Vec<u64>,
    /// Scans so far.
    scans: u64,
}

impl SweepIndex {
    /// An empty index over the wall lines of `wf`.
    pub fn new(wf: &Wavefront) -> Self {
        let mut lo = DVec2::splat(f64::INFINITY);
        let mut hi = DVec2::splat(f64::NEG_INFINITY);
        let mut slowest = f64::INFINITY;
        for l in &wf.lines {
            lo = lo.min(l.start).min(l.end);
            hi = hi.max(l.start).max(l.end);
            if l.speed > 0.0 {
                slowest = slowest.min(l.speed);
            }
        }
        if !(lo.is_finite() && hi.is_finite()) {
            lo = DVec2::ZERO;
            hi = DVec2::ONE;
        }
        // The margin on each axis follows the outline's own extent there: one
        // taken from the longer side alone made a long thin outline's grid
        // mostly margin (a 240,000 in by 500 in comb got cells 800 in
        // square, each holding some 30 of its wall lines).
        let margin = 0.05 * (hi - lo) + DVec2::splat(100.0 * wf.tol.point);
        lo -= margin;
        hi += margin;
        let extent = hi - lo;
        let n = wf.lines.len().max(1) as f64;
        let cell = (extent.x * extent.y / (CELLS_PER_LINE * n)).sqrt().max(extent.max_element() / 4096.0);
        let cols = ((extent.x / cell).ceil() as usize).clamp(1, 4096);
        let rows = ((extent.y / cell).ceil() as usize).clamp(1, 4096);
        // Every point of the wavefront lies inside the outline, where no wall
        // line is farther than the outline's diagonal.
        let wall_length: f64 = wf.lines.iter().map(|l| (l.end - l.start).length()).sum();
        let full_search = wall_length > LONG_WALLS * cell * n;
        let ceiling = if slowest.is_finite() { 4.0 * (extent.length() + 1.0) / slowest } else { 0.0 };
        Self {
            min: lo,
            cell,
            cols,
            rows,
            pieces: vec![Vec::new(); if full_search { 0 } else { cols * rows + 1 }],
            paths: vec![Vec::new(); if full_search { 0 } else { cols * rows + 1 }],
            full_search,
            versions: Vec::new(),
            searched: Vec::new(),
            floor: Vec::new(),
            accepted: Vec::new(),
            generation: Vec::new(),
            step: 0,
            renewals: BinaryHeap::new(),
            passed: (f64::NEG_INFINITY, (0, 0, 0, 0)),
            pad: 16.0 * wf.tol.point,
            slack: 4.0 * wf.tol.time,
            ceiling,
            met: Vec::new(),
            piece_seen: Vec::new(),
            vertex_seen: Vec::new(),
            scans: 0,
        }
    }

    /// Whether split candidates come from the full search, one after another
    /// (the queue then asks for each vertex's next as it takes one).
    pub fn chained(&self) -> bool {
        self.full_search
    }

    /// Records that every event up to `height` has been taken from the queue.
    pub fn passed_height(&mut self, height: f64) {
        let mark = (height, (u8::MAX, usize::MAX, usize::MAX, usize::MAX));
        if later(mark, self.passed) {
            self.passed = mark;
        }
    }

    /// Records that `ev` has been taken from the queue.
    pub fn passed_event(&mut self, ev: &Event) {
        let mark = (ev.time, ev.tie_key());
        if later(mark, self.passed) {
            self.passed = mark;
        }
    }

    /// After the events at height `now`: enters the pieces that appeared or
    /// changed, then searches the `vertices` not searched before.
    pub fn update(
        &mut self,
        wf: &mut Wavefront,
        heap: &mut BinaryHeap<Event>,
        vertices: &[VertexId],
        now: f64,
    ) {
        if self.full_search {
            wf.changed_edges.clear();
            for &v in vertices {
                let fresh =
                    wf.vertices.get(v).is_some_and(|x| x.alive && x.splits.is_empty() && !x.splits_truncated);
                if fresh {
                    events::compute_splits(wf, v, now, true);
                    if let Some(ev) = events::next_split(wf, v, now) {
                        heap.push(ev);
                    }
                }
            }
            return;
        }
        let mut changed = std::mem::take(&mut wf.changed_edges);
        changed.sort_unstable();
        changed.dedup();
        if self.versions.len() < wf.edges.len() {
            self.versions.resize(wf.edges.len(), 0);
        }
        for &e in &changed {
            if !wf.edges.get(e).is_some_and(|x| x.alive) {
                continue;
            }
            let Some(version) = self.versions.get_mut(e) else {
                continue;
            };
            *version = version.wrapping_add(1);
            let mover = Mover::Piece(e, *version);
            let from = now - self.slack;
            let span = self.first_span(wf, mover);
            self.enter(wf, heap, mover, from, span, Keep::Unpassed);
        }
        changed.clear();
        wf.changed_edges = changed;

        let count = wf.vertices.len();
        if self.searched.len() < count {
            self.searched.resize(count, false);
            self.floor.resize(count, f64::NAN);
            self.accepted.resize_with(count, Vec::new);
            self.generation.resize(count, 0);
        }
        self.step += 1;
        for &v in vertices {
            let Some(x) = wf.vertices.get(v) else { continue };
            if !x.alive || x.corner != Corner::Reflex {
                continue;
            }
            let Some(&searched) = self.searched.get(v) else { continue };
            if searched && !self.exhausted(wf, v) {
                continue;
            }
            // A vertex met again once all but its last candidate have been
            // tested is searched afresh from this height, as the full search
            // did (retesting what this batch tested before it was resolved).
            if let Some(s) = self.searched.get_mut(v) {
                *s = true;
            }
            if let Some(f) = self.floor.get_mut(v) {
                *f = now;
            }
            if let Some(g) = self.generation.get_mut(v) {
                *g = self.step;
            }
            if let Some(a) = self.accepted.get_mut(v) {
                a.clear();
            }
            let mover = Mover::Vertex(v);
            let span = self.first_span(wf, mover);
            self.enter(wf, heap, mover, now - self.slack, span, Keep::From(now));
        }
    }

    /// Whether at most one of the split candidates of searched vertex `v`,
    /// over every line, is still to be tested.
    fn exhausted(&self, wf: &Wavefront, v: VertexId) -> bool {
        let floor = self.floor.get(v).copied().unwrap_or(f64::NAN);
        let this_step = self.generation.get(v) == Some(&self.step);
        let mut left = 0;
        for line in 0..wf.lines.len() {
            let Some(time) = events::split_time(wf, v, line, floor) else {
                continue;
            };
            let tie = Event { time, kind: EventKind::Split { vertex: v, line } }.tie_key();
            // Searched in this very step, none of its candidates has been
            // tested yet; otherwise those up to the last event taken have.
            if this_step || later((time, tie), self.passed) {
                left += 1;
                if left > 1 {
                    return false;
                }
            }
        }
        true
    }

    /// Renews the windows that run out before the queue's next event; with
    /// the queue empty, renews the earliest one. Returns whether it renewed any.
    pub fn renew(&mut self, wf: &Wavefront, heap: &mut BinaryHeap<Event>) -> bool {
        let mut any = false;
        loop {
            let Some(r) = self.renewals.peek().copied() else {
                return any;
            };
            let due = match heap.peek() {
                Some(ev) => r.to <= ev.time + 2.0 * self.slack,
                None => true,
            };
            if !due {
                return any;
            }
            self.renewals.pop();
            any = true;
            if !self.live(wf, r.mover) {
                continue;
            }
            if r.to > self.ceiling {
                // Past any height an event can have: only a fault brings a
                // vertex here, and the full search keeps the result the same.
                if let Mover::Vertex(v) = r.mover {
                    for line in 0..wf.lines.len() {
                        self.try_line(wf, heap, v, line, None, Keep::Unpassed);
                    }
                }
                continue;
            }
            self.enter(wf, heap, r.mover, r.to, 2.0 * r.span, Keep::Unpassed);
        }
    }

    /// Whether the mover is still part of the wavefront as entered.
    fn live(&self, wf: &Wavefront, mover: Mover) -> bool {
        match mover {
            Mover::Piece(e, version) => {
                self.versions.get(e) == Some(&version) && wf.edges.get(e).is_some_and(|x| x.alive)
            }
            Mover::Vertex(v) => wf.alive(v),
        }
    }

    /// A first window short enough that the mover crosses about one cell in it.
    fn first_span(&self, wf: &Wavefront, mover: Mover) -> f64 {
        let speed = match mover {
            Mover::Piece(e, _) => wf.edges.get(e).map_or(0.0, |x| {
                let s = wf.vertices.get(x.start).map_or(0.0, |v| v.vel.length());
                let f = wf.vertices.get(x.end).map_or(0.0, |v| v.vel.length());
                s.max(f)
            }),
            Mover::Vertex(v) => wf.vertices.get(v).map_or(0.0, |x| x.vel.length()),
        };
        let span = if speed > 0.0 { self.cell / speed } else { self.ceiling };
        span.max(4.0 * self.slack)
    }

    /// The plan points whose convex hull the mover covers between heights
    /// `from` and `to`, and how many of them there are.
    fn corners(wf: &Wavefront, mover: Mover, from: f64, to: f64) -> ([DVec2; 4], usize) {
        let mut pts = [DVec2::ZERO; 4];
        match mover {
            Mover::Piece(e, _) => {
                let Some(x) = wf.edges.get(e) else {
                    return (pts, 0);
                };
                pts = [wf.pos(x.start, from), wf.pos(x.end, from), wf.pos(x.start, to), wf.pos(x.end, to)];
                (pts, 4)
            }
            Mover::Vertex(v) => {
                pts[0] = wf.pos(v, from);
                pts[1] = wf.pos(v, to);
                (pts, 2)
            }
        }
    }

    /// Puts the mover's window from `from` for `span` into the grid, testing
    /// it against every entry of the other kind it meets, and books its renewal.
    fn enter(
        &mut self,
        wf: &Wavefront,
        heap: &mut BinaryHeap<Event>,
        mover: Mover,
        from: f64,
        span: f64,
        keep: Keep,
    ) {
        let to = from + span;
        let to = if to > self.passed.0 + 2.0 * self.slack { to } else { self.passed.0 + 2.0 * self.slack };
        let (pts, count) = Self::corners(wf, mover, from, to + self.slack);
        let pts = pts.get(..count).unwrap_or(&[]);
        let shape = match mover {
            Mover::Vertex(_) => match pts {
                [a, b, ..] => [a.x, a.y, b.x, b.y, 0.0, 0.0],
                _ => [0.0; 6],
            },
            Mover::Piece(e, _) => {
                let n = wf.edges.get(e).and_then(|x| wf.lines.get(x.line)).map_or(DVec2::ZERO, |l| l.normal);
                let (mut s0, mut s1, mut a0, mut a1) =
                    (f64::INFINITY, f64::NEG_INFINITY, f64::INFINITY, f64::NEG_INFINITY);
                for p in pts {
                    let (s, a) = (n.dot(*p), n.y * p.x - n.x * p.y);
                    s0 = s0.min(s);
                    s1 = s1.max(s);
                    a0 = a0.min(a);
                    a1 = a1.max(a);
                }
                let pad = 2.0 * self.pad;
                [n.x, n.y, s0 - pad, s1 + pad, a0 - pad, a1 + pad]
            }
        };
        let entry = Entry { mover, from, to, shape };
        let expired = self.passed.0 - self.slack;
        let is_vertex = matches!(mover, Mover::Vertex(_));
        let mut met = std::mem::take(&mut self.met);
        met.clear();
        // Two windows can hold one split only if their heights overlap.
        let (open, close) = (from - self.slack, to + self.slack);
        let versions = &self.versions;
        let mut visit = |own: &mut Vec<Entry>, other: &mut Vec<Entry>| {
            let mut gone = 0usize;
            for x in other.iter() {
                if x.to < expired {
                    gone += 1;
                    continue;
                }
                if x.to < open || x.from > close {
                    continue;
                }
                match (x.mover, mover) {
                    (Mover::Piece(e, version), Mover::Vertex(v))
                        if Entry::can_meet(&shape, &x.shape) && versions.get(e) == Some(&version) =>
                    {
                        met.push((v, e));
                    }
                    (Mover::Vertex(v), Mover::Piece(e, _))
                        if Entry::can_meet(&x.shape, &shape) && wf.alive(v) =>
                    {
                        met.push((v, e));
                    }
                    _ => {}
                }
            }
            // Dropping run-out windows only once they are many keeps the
            // scan a plain read.
            if gone > 8 && 2 * gone > other.len() {
                other.retain(|x| x.to >= expired);
            }
            own.push(entry);
        };
        let (gmin, cell, cols, rows) = (self.min, self.cell, self.cols, self.rows);
        let (own_cells, other_cells) =
            if is_vertex { (&mut self.paths, &mut self.pieces) } else { (&mut self.pieces, &mut self.paths) };
        let mut lo = DVec2::splat(f64::INFINITY);
        let mut hi = DVec2::splat(f64::NEG_INFINITY);
        for &p in pts {
            lo = lo.min(p);
            hi = hi.max(p);
        }
        let pad = self.pad;
        let inside = lo.is_finite() && hi.is_finite();
        let (r0, r1) = span_of(lo.y - pad, hi.y + pad, gmin.y, rows, cell);
        if inside {
            for r in r0..=r1 {
                // The hull's reach across this row of cells: its edges all
                // lie on the segments between its corners.
                let y0 = gmin.y + cell * r as f64 - pad;
                let y1 = y0 + cell + 2.0 * pad;
                let (mut x0, mut x1) = (f64::INFINITY, f64::NEG_INFINITY);
                for (i, &p) in pts.iter().enumerate() {
                    for &q in pts.get(i..).unwrap_or(&[]) {
                        if let Some((a, b)) = slab_reach(p, q, y0, y1) {
                            x0 = x0.min(a);
                            x1 = x1.max(b);
                        }
                    }
                }
                let (c0, c1) = span_of(x0 - pad, x1 + pad, gmin.x, cols, cell);
                if c1 < c0 {
                    continue;
                }
                for c in c0..=c1 {
                    let k = r * cols + c;
                    if let (Some(own), Some(other)) = (own_cells.get_mut(k), other_cells.get_mut(k)) {
                        visit(own, other);
                    }
                }
            }
        }
        let grid_hi = gmin + cell * DVec2::new(cols as f64, rows as f64);
        let outside = !inside
            || lo.x - pad < gmin.x
            || lo.y - pad < gmin.y
            || hi.x + pad > grid_hi.x
            || hi.y + pad > grid_hi.y;
        if outside && let (Some(own), Some(other)) = (own_cells.last_mut(), other_cells.last_mut()) {
            visit(own, other);
        }
        // Each pair once. The order the pairs are tried in changes nothing:
        // whether a line's candidate is pushed depends only on whether some
        // piece met on it passes, and the queue orders what it holds by
        // what the events name.
        self.scans += 1;
        let scan = self.scans;
        let seen = if is_vertex { &mut self.piece_seen } else { &mut self.vertex_seen };
        met.retain(|&(v, e)| {
            let other = if is_vertex { e } else { v };
            if seen.len() <= other {
                seen.resize(other + 1, 0);
            }
            match seen.get_mut(other) {
                Some(s) if *s == scan => false,
                Some(s) => {
                    *s = scan;
                    true
                }
                None => true,
            }
        });
        for &(v, e) in &met {
            let line = wf.edges.get(e).filter(|x| x.alive).map(|x| x.line);
            if let Some(line) = line {
                self.try_line(wf, heap, v, line, Some(e), keep);
            }
        }
        self.met = met;
        self.renewals.push(Renewal { to, span: to - from, mover });
    }

    /// Tests vertex `v` against `line` (near `piece` if given) and pushes
    /// the split candidate if it may be kept.
    fn try_line(
        &mut self,
        wf: &Wavefront,
        heap: &mut BinaryHeap<Event>,
        v: VertexId,
        line: usize,
        piece: Option<EdgeId>,
        keep: Keep,
    ) {
        if self.accepted.get(v).is_none_or(|a| a.contains(&line)) {
            return;
        }
        let floor = self.floor.get(v).copied().unwrap_or(f64::NAN);
        let Some(time) = events::split_time(wf, v, line, floor) else {
            return;
        };
        let ev = Event { time, kind: EventKind::Split { vertex: v, line } };
        let fresh = match keep {
            Keep::From(now) => time >= now,
            Keep::Unpassed => later((time, ev.tie_key()), self.passed),
        };
        if !fresh {
            return;
        }
        if let Some(e) = piece {
            // The same test as when the event comes, with room to spare: a
            // piece that misses the vertex by more is of no use to it.
            let (Some(x), Some(l)) = (wf.edges.get(e), wf.lines.get(line)) else {
                return;
            };
            let p = wf.pos(v, time);
            let slack = 2.0 * wf.tol.point;
            let a = l.dir.dot(p - wf.pos(x.start, time));
            let b = l.dir.dot(wf.pos(x.end, time) - p);
            if a < -slack || b < -slack {
                return;
            }
        }
        if let Some(a) = self.accepted.get_mut(v) {
            a.push(line);
        }
        heap.push(ev);
    }
}

/// The cells (first, last) of side `cell` along one axis from `origin`
/// that `lo..hi` reaches, of `count` in all; (1, 0) for none.
fn span_of(lo: f64, hi: f64, origin: f64, count: usize, cell: f64) -> (usize, usize) {
    let a = ((lo - origin) / cell).floor().max(0.0);
    let b = ((hi - origin) / cell).floor().min(count as f64 - 1.0);
    if !(a.is_finite() && b.is_finite()) || b < a {
        return (1, 0);
    }
    (a as usize, b as usize)
}

/// The x range of segment `p`-`q` between heights `y0` and `y1` of the plan, if it reaches there.
fn slab_reach(p: DVec2, q: DVec2, y0: f64, y1: f64) -> Option<(f64, f64)> {
    let d = q - p;
    let (mut s0, mut s1) = (0.0f64, 1.0f64);
    if d.y == 0.0 {
        if p.y < y0 || p.y > y1 {
            return None;
        }
    } else {
        let (a, b) = ((y0 - p.y) / d.y, (y1 - p.y) / d.y);
        s0 = s0.max(a.min(b));
        s1 = s1.min(a.max(b));
        if s0 > s1 {
            return None;
        }
    }
    let (xa, xb) = (p.x + d.x * s0, p.x + d.x * s1);
    Some((xa.min(xb), xa.max(xb)))
}

/// Whether queue position `a` comes after `b`.
fn later(a: (f64, (u8, usize, usize, usize)), b: (f64, (u8, usize, usize, usize))) -> bool {
    a.0.total_cmp(&b.0).then_with(|| a.1.cmp(&b.1)) == Ordering::Greater
}
