//! The weighted straight skeleton of the wall outline, with gables.
//!
//! Every wall line moves inward at its own plan speed `1 / rise_per_run`
//! per unit of height (a gable wall does not move), so the height at which
//! the wavefront passes a plan point is the roof's height there. The
//! wavefront is simulated event by event from a priority queue:
//! - an **edge event**: a piece of wall line shrinks to a point;
//! - a **split event**: a reflex vertex runs into another wall line;
//! - everything that happens at one point at one height (a square's four
//!   hips, equal wings, a valley running into a ridge) is resolved as one
//!   site by re-pairing the lines met there in angular order
//!   ([`resolve::resolve_site`]);
//! - opposite lines that meet (a level ridge) leave zero-width spikes and
//!   flat cycles that [`cleanup::clean_up`] closes;
//! - once the faces are chained, a face folded back over itself by less
//!   than the tolerance is cut at the fold ([`faces::remove_slivers`]).
//!
//! Topology decisions about the outline's corners use exact orientation
//! predicates; event heights and points use `f64` with the tolerances of
//! [`tolerance::Tolerance`].

mod cleanup;
pub(crate) mod eaves;
mod events;
mod faces;
pub(crate) mod lines;
mod resolve;
mod split_search;
mod sweep_index;
pub(crate) mod tolerance;
mod wavefront;

use std::collections::BinaryHeap;

use glam::DVec2;

use crate::quick_hash::QuickMap;
use events::{Event, EventKind};
use lines::WallLine;
use resolve::Site;
use sweep_index::SweepIndex;
use tolerance::Tolerance;
pub(crate) use wavefront::Node;
use wavefront::{EdgeId, VertexId, Wavefront};

/// One closed ring of the outline, counter-clockwise around the roofed
/// region (holes therefore clockwise): global wall indices in ring order.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Ring {
    /// Global wall indices; wall `k` runs from corner `k` to corner `k + 1`.
    pub walls: Vec<usize>,
}

/// The solved skeleton: nodes and one face polygon per wall.
#[derive(Debug, Clone)]
pub(crate) struct Skeleton {
    /// Skeleton nodes (plan point and height).
    pub nodes: Vec<Node>,
    /// For each global wall index, its face as nodes counter-clockwise,
    /// starting with the wall's start and end corners.
    pub faces: Vec<Vec<usize>>,
    /// For each global wall index, the inner loops of its face (nodes with
    /// the face on the left, so clockwise from above).
    pub holes: Vec<Vec<Vec<usize>>>,
    /// The wall lines, by global wall index.
    pub lines: Vec<WallLine>,
}

/// Why the skeleton could not be completed.
#[derive(Debug, Clone, PartialEq, Eq)]
pub(crate) enum SkeletonError {
    /// Part of the plan is ringed by gable walls only (global indices):
    /// no roof plane ever reaches it.
    Unroofed {
        /// The gable walls round it.
        walls: Vec<usize>,
    },
    /// The face over a wall did not close into one outline (a solver fault).
    FaceOpen {
        /// Global wall index.
        wall: usize,
    },
    /// The event count ran past its bound (a solver fault).
    TooManyEvents,
}

/// Computes the skeleton of `rings` (the first the outer ring) over the
/// wall `lines` (indexed by global wall index).
pub(crate) fn solve(lines: Vec<WallLine>, rings: &[Ring], tol: Tolerance) -> Result<Skeleton, SkeletonError> {
    let n = lines.len();
    let packed_lines: Vec<[f64; 4]> =
        lines.iter().map(|l| [l.normal.x, l.normal.y, l.offset, l.speed]).collect();
    let mut wf = Wavefront {
        lines,
        packed_lines,
        vertices: Vec::new(),
        edges: Vec::new(),
        nodes: Vec::new(),
        pieces_by_line: vec![Vec::new(); n],
        arcs: vec![Vec::new(); n],
        wall_start_node: vec![0; n],
        wall_end_node: vec![0; n],
        batch_nodes: Vec::new(),
        batch_cells: QuickMap::default(),
        batch_links: Vec::new(),
        tol,
        changed_edges: Vec::new(),
        split_scratch: Vec::new(),
        line_blocks: None,
    };
    let mut index = SweepIndex::new(&wf);
    let mut heap: BinaryHeap<Event> = BinaryHeap::new();
    let mut all_new: Vec<VertexId> = Vec::new();
    for ring in rings {
        let k = ring.walls.len();
        let first_node = wf.nodes.len();
        for &w in &ring.walls {
            let start = wf.lines.get(w).map_or(DVec2::ZERO, |l| l.start);
            let node = wf.add_node(start, 0.0);
            if let Some(s) = wf.wall_start_node.get_mut(w) {
                *s = node;
            }
        }
        let first_edge = wf.edges.len();
        for &w in &ring.walls {
            wf.add_edge(w, 0, 0);
        }
        let first_vertex = wf.vertices.len();
        for i in 0..k {
            let prev_edge = first_edge + (i + k - 1) % k;
            let v = wf.add_vertex(prev_edge, first_edge + i, first_node + i);
            all_new.push(v);
        }
        for i in 0..k {
            let v = first_vertex + i;
            wf.link(v, first_vertex + (i + 1) % k);
            wf.set_edge_start(first_edge + i, v);
            wf.set_edge_end(first_edge + (i + k - 1) % k, v);
            if let Some(&w) = ring.walls.get((i + k - 1) % k)
                && let Some(e) = wf.wall_end_node.get_mut(w)
            {
                *e = first_node + i;
            }
        }
    }
    schedule(&mut wf, &mut heap, &mut index, &all_new, 0.0);

    let limit = 200 * (wf.vertices.len() + 10);
    let mut steps = 0usize;
    // One list for every batch: most batches are a few events.
    let mut batch = Vec::new();
    let mut resolve_scratch = resolve::ResolveScratch::default();
    while let Some(first) = pop_valid(&mut wf, &mut heap, &mut index, f64::INFINITY) {
        steps += 1;
        if steps > limit {
            return Err(SkeletonError::TooManyEvents);
        }
        let t0 = first.0.time;
        batch.clear();
        batch.push(first);
        let batch_end = t0 + wf.tol.time;
        while let Some(next) = pop_valid(&mut wf, &mut heap, &mut index, batch_end) {
            batch.push(next);
        }
        let sites = cluster(&wf, &batch);
        wf.batch_nodes.clear();

        let mut created = Vec::new();
        for site in &sites {
            resolve::resolve_site(&mut wf, site, &mut resolve_scratch, &mut created);
        }
        let t_batch = sites.iter().map(|s| s.time).fold(t0, f64::max);
        let touched = cleanup::clean_up(&mut wf, created, t_batch);
        index.passed_height(batch_end);
        schedule(&mut wf, &mut heap, &mut index, &touched, t0);
    }

    if let Some(v) = wf.vertices.iter().position(|v| v.alive) {
        // What is left is ringed by walls that no longer move: gables only.
        let mut walls = Vec::new();
        let mut u = v;
        for _ in 0..wf.vertices.len() {
            if let Some(x) = wf.vertices.get(u) {
                walls.push(x.out_line);
            }
            u = wf.next(u);
            if u == v {
                break;
            }
        }
        walls.sort_unstable();
        walls.dedup();
        return Err(SkeletonError::Unroofed { walls });
    }

    let mut faces = vec![Vec::new(); n];
    let mut holes = vec![Vec::new(); n];
    let mut chain_scratch = faces::ChainScratch::default();
    for (w, (face, hole)) in faces.iter_mut().zip(holes.iter_mut()).enumerate() {
        let (Some(&s), Some(&e), Some(arcs)) =
            (wf.wall_start_node.get(w), wf.wall_end_node.get(w), wf.arcs.get(w))
        else {
            continue;
        };
        match faces::chain_face((s, e), arcs, &mut chain_scratch) {
            Some((chain, inner)) => {
                *face = chain;
                *hole = inner;
            }
            None => {
                return Err(SkeletonError::FaceOpen { wall: w });
            }
        }
    }
    let positions: Vec<DVec2> = wf.nodes.iter().map(|x| x.pos).collect();
    let heights: Vec<f64> = wf.nodes.iter().map(|x| x.time).collect();
    let gable: Vec<bool> = wf.lines.iter().map(|l| l.speed == 0.0).collect();
    faces::remove_slivers(&positions, &heights, &gable, &mut faces, &mut holes, wf.tol.point);
    Ok(Skeleton { nodes: wf.nodes, faces, holes, lines: wf.lines })
}

/// Pushes edge events for the pieces at `vertices`, and split candidates
/// for the new reflex ones and for those the changed pieces may now meet.
fn schedule(
    wf: &mut Wavefront,
    heap: &mut BinaryHeap<Event>,
    index: &mut SweepIndex,
    vertices: &[VertexId],
    now: f64,
) {
    index.update(wf, heap, vertices, now);
    let mut edges: Vec<EdgeId> = Vec::new();
    for &v in vertices {
        let Some(x) = wf.vertices.get(v) else {
            continue;
        };
        if !x.alive {
            continue;
        }
        edges.push(x.in_edge);
        edges.push(x.out_edge);
    }
    edges.sort_unstable();
    edges.dedup();
    for e in edges {
        if let Some(ev) = events::edge_collapse(wf, e, now) {
            heap.push(ev);
        }
    }
}

/// Pops events no later than `limit` until one is still valid; split
/// events name the edge piece hit.
fn pop_valid(
    wf: &mut Wavefront,
    heap: &mut BinaryHeap<Event>,
    index: &mut SweepIndex,
    limit: f64,
) -> Option<(Event, Option<EdgeId>)> {
    loop {
        // Split candidates must be in the queue before it passes their height.
        index.renew(wf, heap);
        if !heap.peek().is_some_and(|e| e.time <= limit) {
            return None;
        }
        let ev = heap.pop()?;
        index.passed_event(&ev);
        match ev.kind {
            EventKind::Edge { edge, start, end } => {
                if wf.edges.get(edge).is_some_and(|e| e.alive && e.start == start && e.end == end) {
                    return Some((ev, None));
                }
            }
            EventKind::Split { vertex, line } => {
                if !wf.alive(vertex) {
                    continue;
                }
                if index.chained()
                    && let Some(next) = events::next_split(wf, vertex, ev.time)
                {
                    heap.push(next);
                }
                if let Some(hit) = events::split_target(wf, vertex, line, ev.time) {
                    return Some((ev, Some(hit)));
                }
            }
        }
    }
}

/// Groups a batch of simultaneous events into sites by plan point.
fn cluster(wf: &Wavefront, batch: &[(Event, Option<EdgeId>)]) -> Vec<Site> {
    let near = 2.0 * wf.tol.point;
    // Each event's point, height and place in the batch.
    let mut raw: Vec<(DVec2, f64, usize)> = Vec::with_capacity(batch.len());
    for (k, (ev, _)) in batch.iter().enumerate() {
        let t = ev.time;
        let pos = match ev.kind {
            EventKind::Edge { start, end, .. } => (wf.pos(start, t) + wf.pos(end, t)) * 0.5,
            EventKind::Split { vertex, .. } => wf.pos(vertex, t),
        };
        raw.push((pos, t, k));
    }
    // Sort along x so only neighbours in x need comparing (a stable sort:
    // events at one x stay in batch order).
    raw.sort_by(|a, b| a.0.x.total_cmp(&b.0.x));
    let mut parent: Vec<usize> = (0..raw.len()).collect();
    fn root(parent: &mut [usize], mut i: usize) -> usize {
        while let Some(&p) = parent.get(i) {
            if p == i {
                break;
            }
            let gp = parent.get(p).copied().unwrap_or(p);
            if let Some(x) = parent.get_mut(i) {
                *x = gp;
            }
            i = p;
        }
        i
    }
    for i in 0..raw.len() {
        for j in i + 1..raw.len() {
            let (Some(a), Some(b)) = (raw.get(i), raw.get(j)) else {
                break;
            };
            if b.0.x - a.0.x > near {
                break;
            }
            if (a.0 - b.0).length() <= near {
                let (ri, rj) = (root(&mut parent, i), root(&mut parent, j));
                if let Some(x) = parent.get_mut(ri) {
                    *x = rj;
                }
            }
        }
    }
    // The groups by their root, lowest first, each with its members in order.
    let mut grouped: Vec<(usize, usize)> = (0..raw.len()).map(|i| (root(&mut parent, i), i)).collect();
    grouped.sort_unstable();
    let mut sites = Vec::new();
    let mut g = 0;
    while let Some(&(r, _)) = grouped.get(g) {
        let mut site = Site::default();
        let mut count = 0.0;
        while let Some(&(q, i)) = grouped.get(g)
            && q == r
        {
            g += 1;
            let Some(&(pos, time, k)) = raw.get(i) else { continue };
            site.pos += pos;
            site.time += time;
            count += 1.0;
            match batch.get(k) {
                Some((Event { kind: EventKind::Edge { start, end, .. }, .. }, _)) => {
                    site.vertices.extend([*start, *end]);
                }
                Some((Event { kind: EventKind::Split { vertex, .. }, .. }, hit)) => {
                    site.vertices.push(*vertex);
                    site.through_lines.extend(hit.map(|e| wf.edge_line(e)));
                }
                None => {}
            }
        }
        if count > 0.0 {
            site.pos /= count;
            site.time /= count;
        }
        sites.push(site);
    }
    sites
}
