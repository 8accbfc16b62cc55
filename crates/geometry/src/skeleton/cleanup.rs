//! Clean-up after an event: cycles that have closed to a line or a point,
//! and zero-width spikes where two opposite lines have met.

use super::wavefront::{Corner, NodeId, VertexId, Wavefront};

/// Longest cycle checked for zero area on every spike; longer cycles with a
/// spike are thinned one spike at a time instead.
const AREA_CHECK_LIMIT: usize = 64;

/// Cleans up around the given new vertices at height `t`; returns every
/// vertex created or changed, for event scheduling.
pub(crate) fn clean_up(wf: &mut Wavefront, start: Vec<VertexId>, t: f64) -> Vec<VertexId> {
    let mut work = start;
    let mut touched = Vec::new();
    let mut guard = 0usize;
    while let Some(v) = work.pop() {
        guard += 1;
        if guard > 100_000 + 10 * wf.vertices.len() {
            break;
        }
        if !wf.alive(v) {
            continue;
        }
        touched.push(v);
        let n1 = wf.next(v);
        let short = n1 == v || wf.next(n1) == v;
        let corner = wf.vertices.get(v).map(|x| x.corner);
        let spike = corner == Some(Corner::Spike);
        if short {
            collapse_cycle(wf, v, t);
            continue;
        }
        if corner == Some(Corner::Overtake) {
            if let Some(w) = overtake(wf, v, t) {
                work.push(w);
                work.push(wf.prev(w));
                work.push(wf.next(w));
            }
            continue;
        }
        if !spike {
            continue;
        }
        if cycle_is_flat(wf, v, t) {
            collapse_cycle(wf, v, t);
            continue;
        }
        if let Some(w) = remove_spike(wf, v, t) {
            work.push(w);
            work.push(wf.prev(w));
            work.push(wf.next(w));
        }
    }
    touched.retain(|&v| wf.alive(v));
    touched
}

/// Whether the cycle through `v` has (next to) no area at height `t`.
fn cycle_is_flat(wf: &Wavefront, v: VertexId, t: f64) -> bool {
    let mut area = 0.0;
    let mut perimeter = 0.0;
    let mut u = v;
    for _ in 0..AREA_CHECK_LIMIT {
        let w = wf.next(u);
        let (a, b) = (wf.pos(u, t), wf.pos(w, t));
        area += a.perp_dot(b);
        perimeter += (b - a).length();
        u = w;
        if u == v {
            return area.abs() * 0.5 <= wf.tol.point * perimeter.max(wf.tol.point);
        }
    }
    false
}

/// Ends the whole cycle through `v` at height `t`: its pieces close the
/// faces along the line (or point) the cycle has shrunk to.
fn collapse_cycle(wf: &mut Wavefront, v: VertexId, t: f64) {
    let mut cycle = vec![v];
    let mut u = wf.next(v);
    while u != v && cycle.len() <= wf.vertices.len() {
        cycle.push(u);
        u = wf.next(u);
    }
    let nodes: Vec<NodeId> = cycle.iter().map(|&x| wf.node_at(x, t)).collect();
    for (&x, &n) in cycle.iter().zip(&nodes) {
        wf.retire(x, n);
    }
    let count = cycle.len();
    for i in 0..count {
        let (Some(&x), Some(&ns), Some(&ne)) = (cycle.get(i), nodes.get(i), nodes.get((i + 1) % count))
        else {
            continue;
        };
        let Some(vx) = wf.vertices.get(x) else {
            continue;
        };
        let (e, line) = (vx.out_edge, vx.out_line);
        wf.kill_edge(e);
        // The piece's top runs from its end back to its start; split it at
        // the cycle's other nodes lying on it, so the face on the far side
        // shares the same nodes.
        let (Some(a), Some(b)) = (wf.nodes.get(ne).copied(), wf.nodes.get(ns).copied()) else {
            continue;
        };
        let seg = b.pos - a.pos;
        let len2 = seg.length_squared();
        let mut inner: Vec<(f64, NodeId)> = Vec::new();
        if len2 > 0.0 {
            for &m in &nodes {
                if m == ns || m == ne || inner.iter().any(|x| x.1 == m) {
                    continue;
                }
                let Some(mp) = wf.nodes.get(m).map(|x| x.pos) else {
                    continue;
                };
                let s = (mp - a.pos).dot(seg) / len2;
                let off = (mp - a.pos).perp_dot(seg).abs() / len2.sqrt();
                if s > 0.0 && s < 1.0 && off <= 4.0 * wf.tol.point {
                    inner.push((s, m));
                }
            }
        }
        inner.sort_by(|p, q| p.0.total_cmp(&q.0));
        let mut from = ne;
        for (_, m) in inner {
            wf.add_arc(line, from, m);
            from = m;
        }
        wf.add_arc(line, from, ns);
    }
}

/// Removes the spike at `v` (its two lines run opposite ways and coincide):
/// the shorter of its two pieces is wholly covered by the longer one.
/// Returns the vertex that replaces the far end of the shorter piece.
fn remove_spike(wf: &mut Wavefront, v: VertexId, t: f64) -> Option<VertexId> {
    let vx = wf.vertices.get(v)?.clone();
    let (p, q) = (vx.prev, vx.next);
    let dir = wf.lines.get(vx.out_line)?.dir;
    let here = wf.pos(v, t);
    let dp = dir.dot(wf.pos(p, t) - here);
    let dq = dir.dot(wf.pos(q, t) - here);
    let nv = wf.node_at(v, t);
    wf.retire(v, nv);
    if dp <= dq {
        // The arriving piece (p -> v) lies on the leaving one.
        let px = wf.vertices.get(p)?.clone();
        let np = wf.node_at(p, t);
        wf.retire(p, np);
        wf.add_arc(vx.in_line, nv, np);
        wf.add_arc(vx.out_line, np, nv);
        wf.kill_edge(vx.in_edge);
        let w = wf.add_vertex(px.in_edge, vx.out_edge, np);
        wf.link(px.prev, w);
        wf.link(w, q);
        wf.set_edge_end(px.in_edge, w);
        wf.set_edge_start(vx.out_edge, w);
        Some(w)
    } else {
        let qx = wf.vertices.get(q)?.clone();
        let nq = wf.node_at(q, t);
        wf.retire(q, nq);
        wf.add_arc(vx.out_line, nq, nv);
        wf.add_arc(vx.in_line, nv, nq);
        wf.kill_edge(vx.out_edge);
        let w = wf.add_vertex(vx.in_edge, qx.out_edge, nq);
        wf.link(p, w);
        wf.link(w, qx.next);
        wf.set_edge_end(vx.in_edge, w);
        wf.set_edge_start(qx.out_edge, w);
        Some(w)
    }
}

/// At `v`, two parallel lines running the same way have come into line at
/// different speeds. From here the faster line is ahead, and its plane is
/// the lower along the whole shared stretch, so it takes over the slower
/// line's piece at once: the two planes meet in a level line along that
/// piece, and the faster line runs on to the slower piece's far end.
/// Returns the vertex that replaces that far end.
fn overtake(wf: &mut Wavefront, v: VertexId, t: f64) -> Option<VertexId> {
    let vx = wf.vertices.get(v)?.clone();
    let speed = |line: usize| wf.lines.get(line).map_or(0.0, |l| l.speed);
    let in_is_faster = speed(vx.in_line) >= speed(vx.out_line);
    let nv = wf.node_at(v, t);
    wf.retire(v, nv);
    if in_is_faster {
        // The leaving piece (v -> q) is taken over.
        let q = vx.next;
        let qx = wf.vertices.get(q)?.clone();
        let nq = wf.node_at(q, t);
        wf.retire(q, nq);
        wf.add_arc(vx.out_line, nq, nv);
        wf.add_arc(vx.in_line, nv, nq);
        wf.kill_edge(vx.out_edge);
        let w = wf.add_vertex(vx.in_edge, qx.out_edge, nq);
        wf.link(vx.prev, w);
        wf.link(w, qx.next);
        wf.set_edge_end(vx.in_edge, w);
        wf.set_edge_start(qx.out_edge, w);
        Some(w)
    } else {
        // The arriving piece (p -> v) is taken over.
        let p = vx.prev;
        let px = wf.vertices.get(p)?.clone();
        let np = wf.node_at(p, t);
        wf.retire(p, np);
        wf.add_arc(vx.in_line, nv, np);
        wf.add_arc(vx.out_line, np, nv);
        wf.kill_edge(vx.in_edge);
        let w = wf.add_vertex(px.in_edge, vx.out_edge, np);
        wf.link(px.prev, w);
        wf.link(w, vx.next);
        wf.set_edge_end(px.in_edge, w);
        wf.set_edge_start(vx.out_edge, w);
        Some(w)
    }
}
