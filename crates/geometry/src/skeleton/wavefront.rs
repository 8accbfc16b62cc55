//! The wavefront: cycles of moving vertices joined by pieces of wall lines.

use glam::DVec2;

use super::lines::WallLine;
use super::split_search::LineBlocks;
use super::tolerance::Tolerance;
use crate::quick_hash::QuickMap;

/// Index of a wavefront vertex.
pub(crate) type VertexId = usize;
/// Index of a wavefront edge piece.
pub(crate) type EdgeId = usize;
/// Index of a skeleton node.
pub(crate) type NodeId = usize;

/// A point of the skeleton: where wavefront vertices start or stop.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Node {
    /// Plan position.
    pub pos: DVec2,
    /// Height (the time at which the wavefront passed here).
    pub time: f64,
}

/// How a vertex's two wall lines meet.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Corner {
    /// The wavefront turns left: the vertex runs along a hip (or rake).
    Convex,
    /// The wavefront turns right: the vertex runs along a valley and may split an edge.
    Reflex,
    /// The two lines are parallel and run the same way: the vertex moves
    /// square to them.
    Straight,
    /// The two lines are parallel, run the same way and have just come into
    /// line at different speeds: the faster (lower-pitch) line overtakes
    /// and takes over the slower one's piece at once (the clean-up does it).
    Overtake,
    /// The two lines are parallel and run opposite ways: a sliver of zero
    /// width that the clean-up removes at once.
    Spike,
}

/// A wavefront vertex: the moving crossing of two wall lines.
#[derive(Debug, Clone, PartialEq)]
pub(crate) struct Vertex {
    /// Wall line arriving at the vertex.
    pub in_line: usize,
    /// Wall line leaving the vertex.
    pub out_line: usize,
    /// Edge piece arriving at the vertex.
    pub in_edge: EdgeId,
    /// Edge piece leaving the vertex.
    pub out_edge: EdgeId,
    /// Previous vertex in the cycle.
    pub prev: VertexId,
    /// Next vertex in the cycle.
    pub next: VertexId,
    /// Node where the vertex started.
    pub node: NodeId,
    /// Plan position at `t0`.
    pub anchor: DVec2,
    /// Height at which the vertex started.
    pub t0: f64,
    /// Plan velocity per unit of height.
    pub vel: DVec2,
    /// Kind of corner.
    pub corner: Corner,
    /// Still part of the wavefront.
    pub alive: bool,
    /// Pending split candidates `(height, line)` of the full search, latest
    /// first, so the next candidate is popped from the end.
    pub splits: Vec<(f64, usize)>,
    /// Whether candidates later than the last one in `splits` were left out.
    pub splits_truncated: bool,
}

/// A piece of a wall line between two consecutive wavefront vertices.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct EdgePiece {
    /// Wall line the piece lies on.
    pub line: usize,
    /// Vertex at the piece's start.
    pub start: VertexId,
    /// Vertex at the piece's end.
    pub end: VertexId,
    /// Still part of the wavefront.
    pub alive: bool,
}

/// The whole moving wavefront plus what it has traced so far.
#[derive(Debug, Clone)]
pub(crate) struct Wavefront {
    /// Wall lines, indexed by global wall index.
    pub lines: Vec<WallLine>,
    /// Each line's `[normal.x, normal.y, offset, speed]`, packed for the split search.
    pub packed_lines: Vec<[f64; 4]>,
    /// All vertices ever created.
    pub vertices: Vec<Vertex>,
    /// All edge pieces ever created.
    pub edges: Vec<EdgePiece>,
    /// Skeleton nodes.
    pub nodes: Vec<Node>,
    /// Edge pieces created on each line (dead ones are pruned lazily).
    pub pieces_by_line: Vec<Vec<EdgeId>>,
    /// Boundary arcs traced for each wall's face, face on the left.
    pub arcs: Vec<Vec<(NodeId, NodeId)>>,
    /// Node of each wall's start corner, by global wall index.
    pub wall_start_node: Vec<NodeId>,
    /// Node of each wall's end corner, by global wall index.
    pub wall_end_node: Vec<NodeId>,
    /// Nodes made during the current batch of events, so two vertices
    /// stopping at one point share one node.
    pub batch_nodes: Vec<NodeId>,
    /// The batch's nodes by plan cell, so finding one near a point does
    /// not search them all: the place in `batch_nodes` of the cell's
    /// latest node, the others reached through `batch_links`.
    pub batch_cells: QuickMap<(i64, i64), usize>,
    /// For each place in `batch_nodes`, the place of the node before it in
    /// the same cell, or `usize::MAX`.
    pub batch_links: Vec<usize>,
    /// Tolerances.
    pub tol: Tolerance,
    /// Edge pieces added or given a new end since the split index last
    /// looked, so it can enter them again.
    pub changed_edges: Vec<EdgeId>,
    /// Scratch space for the full split search, kept between calls.
    pub split_scratch: Vec<(f64, usize)>,
    /// The lines in blocks for the full split search, made at its first use.
    pub line_blocks: Option<LineBlocks>,
}

/// Velocity and corner kind of the crossing of lines `a` (arriving) and `b` (leaving).
pub(crate) fn vertex_motion(a: &WallLine, b: &WallLine, tol: &Tolerance) -> (DVec2, Corner) {
    let det = a.normal.perp_dot(b.normal);
    if det.abs() > tol.angle {
        let vel = DVec2::new(
            a.speed * b.normal.y - b.speed * a.normal.y,
            a.normal.x * b.speed - b.normal.x * a.speed,
        ) / det;
        let corner = if det > 0.0 { Corner::Convex } else { Corner::Reflex };
        (vel, corner)
    } else if a.dir.dot(b.dir) > 0.0 {
        if (a.speed - b.speed).abs() <= 1e-12 * a.speed.max(b.speed) {
            // One plane on both sides: the shared corner moves square to them.
            (a.normal * a.speed, Corner::Straight)
        } else {
            (DVec2::ZERO, Corner::Overtake)
        }
    } else {
        (DVec2::ZERO, Corner::Spike)
    }
}

impl Wavefront {
    /// Position of vertex `v` at height `t`.
    pub fn pos(&self, v: VertexId, t: f64) -> DVec2 {
        match self.vertices.get(v) {
            Some(vx) => vx.anchor + vx.vel * (t - vx.t0),
            None => DVec2::ZERO,
        }
    }

    /// Adds a skeleton node, or returns the one already made in this batch
    /// at the same point and height.
    pub fn add_node(&mut self, pos: DVec2, time: f64) -> NodeId {
        let near = 4.0 * self.tol.point;
        if self.batch_nodes.is_empty() && !self.batch_cells.is_empty() {
            self.batch_cells.clear();
            self.batch_links.clear();
        }
        // A node within `near` lies in one of the nine cells round `pos`
        // (cells of side `2 * near`, so rounding cannot push it further);
        // the earliest of them is the one a search in order finds.
        let cell = 2.0 * near;
        let key = |p: DVec2| ((p.x / cell).floor() as i64, (p.y / cell).floor() as i64);
        let (cx, cy) = key(pos);
        let mut found: Option<NodeId> = None;
        for dx in -1i64..=1 {
            for dy in -1i64..=1 {
                let mut k = self.batch_cells.get(&(cx.wrapping_add(dx), cy.wrapping_add(dy))).copied();
                while let Some(at) = k {
                    let Some(&n) = self.batch_nodes.get(at) else { break };
                    let hit = found.is_none_or(|f| n < f)
                        && self.nodes.get(n).is_some_and(|x| {
                            (x.pos - pos).length() <= near && (x.time - time).abs() <= self.tol.time
                        });
                    if hit {
                        found = Some(n);
                    }
                    k = self.batch_links.get(at).copied().filter(|&b| b != usize::MAX);
                }
            }
        }
        if let Some(n) = found {
            return n;
        }
        // Adding zero turns -0.0 into 0.0: a roof point at x = -0.0 is the
        // same point, but some polygon code (geo's sweep, used as the
        // outside reference in the tests) trips over the sign.
        let pos = pos + DVec2::ZERO;
        self.nodes.push(Node { pos, time: time + 0.0 });
        let id = self.nodes.len() - 1;
        if time > 0.0 {
            let at = self.batch_nodes.len();
            self.batch_nodes.push(id);
            let before = self.batch_cells.insert(key(pos), at);
            self.batch_links.push(before.unwrap_or(usize::MAX));
        }
        id
    }

    /// Adds an edge piece on `line` (links are set by the caller).
    pub fn add_edge(&mut self, line: usize, start: VertexId, end: VertexId) -> EdgeId {
        self.edges.push(EdgePiece { line, start, end, alive: true });
        let id = self.edges.len() - 1;
        if let Some(list) = self.pieces_by_line.get_mut(line) {
            list.push(id);
        }
        self.changed_edges.push(id);
        id
    }

    /// Line of edge piece `e`.
    pub fn edge_line(&self, e: EdgeId) -> usize {
        self.edges.get(e).map_or(0, |x| x.line)
    }

    /// Adds a vertex at `node` between edge pieces `in_edge` and `out_edge`
    /// (cycle links are set by the caller).
    pub fn add_vertex(&mut self, in_edge: EdgeId, out_edge: EdgeId, node: NodeId) -> VertexId {
        let in_line = self.edge_line(in_edge);
        let out_line = self.edge_line(out_edge);
        let (vel, corner) = match (self.lines.get(in_line), self.lines.get(out_line)) {
            (Some(a), Some(b)) => vertex_motion(a, b, &self.tol),
            _ => (DVec2::ZERO, Corner::Spike),
        };
        let (anchor, t0) = self.nodes.get(node).map_or((DVec2::ZERO, 0.0), |n| (n.pos, n.time));
        self.vertices.push(Vertex {
            in_line,
            out_line,
            in_edge,
            out_edge,
            prev: 0,
            next: 0,
            node,
            anchor,
            t0,
            vel,
            corner,
            alive: true,
            splits: Vec::new(),
            splits_truncated: false,
        });
        self.vertices.len() - 1
    }

    /// Ends vertex `v` at `node`, recording its trail on both faces it bounds.
    pub fn retire(&mut self, v: VertexId, node: NodeId) {
        let Some(vx) = self.vertices.get_mut(v) else {
            return;
        };
        if !vx.alive {
            return;
        }
        vx.alive = false;
        vx.splits = Vec::new();
        let (start, a, b) = (vx.node, vx.in_line, vx.out_line);
        if start != node {
            self.add_arc(a, start, node);
            self.add_arc(b, node, start);
        }
    }

    /// Records a boundary arc of `line`'s face (face on the left).
    pub fn add_arc(&mut self, line: usize, from: NodeId, to: NodeId) {
        if from == to {
            return;
        }
        if let Some(list) = self.arcs.get_mut(line) {
            list.push((from, to));
        }
    }

    /// Node where vertex `v` stands at height `t`: its own start node if it
    /// has not moved, else a new node.
    pub fn node_at(&mut self, v: VertexId, t: f64) -> NodeId {
        let p = self.pos(v, t);
        let Some(vx) = self.vertices.get(v) else {
            return self.add_node(p, t);
        };
        if (p - vx.anchor).length() <= self.tol.point && (t - vx.t0).abs() <= self.tol.time {
            return vx.node;
        }
        let p = self.onto_gables(p, &[vx.in_line, vx.out_line]);
        self.add_node(p, t)
    }

    /// `p` moved onto the gable lines among `lines` that pass within a few
    /// tolerances of it (onto their crossing if two cross there).
    ///
    /// A gable's line never moves, so every node on it belongs exactly on
    /// the wall line, where the gable's vertical face stands. Computed from
    /// moving lines, such a node lands a few units of the last place off
    /// it, and half of the time on the outside: the plane beside it then
    /// reaches outside the outline by that much, which an exact test of
    /// the outline (a point on the wall counts as outside) sees.
    pub fn onto_gables(&self, p: DVec2, lines: &[usize]) -> DVec2 {
        let near = 4.0 * self.tol.point;
        let mut fixed = lines
            .iter()
            .filter_map(|&i| self.lines.get(i))
            .filter(|l| l.speed == 0.0 && l.distance_at(p, 0.0).abs() <= near);
        let Some(a) = fixed.next() else {
            return p;
        };
        let on_a = p - a.normal * a.distance_at(p, 0.0);
        for b in fixed {
            let det = a.normal.perp_dot(b.normal);
            if det.abs() <= self.tol.angle {
                continue;
            }
            // Two gables meeting at their shared corner: the corner itself,
            // not a crossing recomputed with its own rounding.
            if let Some(&c) = [a.start, a.end].iter().find(|&&c| c == b.start || c == b.end)
                && (c - p).length() <= near
            {
                return c;
            }
            let q = DVec2::new(
                a.offset * b.normal.y - b.offset * a.normal.y,
                a.normal.x * b.offset - b.normal.x * a.offset,
            ) / det;
            if q.is_finite() && (q - p).length() <= near {
                return q;
            }
        }
        on_a
    }

    /// Makes `v` the vertex after `u` in its cycle.
    pub fn link(&mut self, u: VertexId, v: VertexId) {
        if let Some(x) = self.vertices.get_mut(u) {
            x.next = v;
        }
        if let Some(x) = self.vertices.get_mut(v) {
            x.prev = u;
        }
    }

    /// Sets the end vertex of edge `e`.
    pub fn set_edge_end(&mut self, e: EdgeId, v: VertexId) {
        if let Some(x) = self.edges.get_mut(e) {
            x.end = v;
        }
        self.changed_edges.push(e);
        if let Some(x) = self.vertices.get_mut(v) {
            x.in_edge = e;
        }
    }

    /// Sets the start vertex of edge `e`.
    pub fn set_edge_start(&mut self, e: EdgeId, v: VertexId) {
        if let Some(x) = self.edges.get_mut(e) {
            x.start = v;
        }
        self.changed_edges.push(e);
        if let Some(x) = self.vertices.get_mut(v) {
            x.out_edge = e;
        }
    }

    /// Marks edge `e` as gone from the wavefront.
    pub fn kill_edge(&mut self, e: EdgeId) {
        if let Some(x) = self.edges.get_mut(e) {
            x.alive = false;
        }
    }

    /// Whether vertex `v` is alive.
    pub fn alive(&self, v: VertexId) -> bool {
        self.vertices.get(v).is_some_and(|x| x.alive)
    }

    /// Next vertex of `v` in its cycle.
    pub fn next(&self, v: VertexId) -> VertexId {
        self.vertices.get(v).map_or(v, |x| x.next)
    }

    /// Previous vertex of `v` in its cycle.
    pub fn prev(&self, v: VertexId) -> VertexId {
        self.vertices.get(v).map_or(v, |x| x.prev)
    }
}
