//! Resolving everything that happens at one point at one height: edge
//! events, split events and vertex events alike, by re-pairing the wall
//! lines that meet there in angular order.

use glam::DVec2;

use super::wavefront::{EdgeId, VertexId, Wavefront};
use crate::quick_hash::QuickSet;

/// One wall-line ray at the event point: an edge arriving or leaving.
#[derive(Debug, Clone, Copy)]
struct Ray {
    /// Angle of the ray's direction, pointing away from the event point.
    angle: f64,
    /// True for an edge leaving the point, false for one arriving.
    leaving: bool,
    /// The edge piece.
    edge: EdgeId,
    /// Index into the list of edges passing through the point, if the ray is
    /// one half of such an edge.
    through: Option<usize>,
}

/// Everything met at one event point.
#[derive(Debug, Clone, Default)]
pub(crate) struct Site {
    /// Plan point.
    pub pos: DVec2,
    /// Height.
    pub time: f64,
    /// Vertices known to be there.
    pub vertices: Vec<VertexId>,
    /// Lines of edges known to pass through the point.
    pub through_lines: Vec<usize>,
}

/// Lists and sets [`resolve_site`] works in, kept from one site to the
/// next: most sites are a few vertices, and making a dozen small lists
/// for each cost more than resolving it.
#[derive(Debug, Default)]
pub(crate) struct ResolveScratch {
    /// The vertices standing at the point.
    members: QuickSet<VertexId>,
    /// Vertices still to look at.
    stack: Vec<VertexId>,
    /// Edges passing through the point.
    through: Vec<EdgeId>,
    /// Lines still to look for a piece through the point on.
    pending_lines: Vec<usize>,
    /// The rays at the point.
    rays: Vec<Ray>,
    /// Members already in a run.
    seen: QuickSet<VertexId>,
    /// The members in order.
    sorted: Vec<VertexId>,
    /// Edges ending between two members.
    dead_edges: Vec<EdgeId>,
    /// The lines met at the point.
    met: Vec<usize>,
    /// The two halves of each through edge that is split.
    halves: Vec<Option<(EdgeId, EdgeId)>>,
    /// The rays paired.
    pairs: Vec<(usize, usize)>,
    /// Which rays are paired.
    used: Vec<bool>,
}

/// Empties `set`, dropping its table if a large site left it large (a
/// cleared table still costs its whole size to clear again).
fn reset(set: &mut QuickSet<VertexId>) {
    if set.capacity() > 256 {
        *set = QuickSet::default();
    } else {
        set.clear();
    }
}

/// Resolves one event site; appends the vertices created to `created`.
pub(crate) fn resolve_site(
    wf: &mut Wavefront,
    site: &Site,
    scratch: &mut ResolveScratch,
    created: &mut Vec<VertexId>,
) {
    let (p, t) = (site.pos, site.time);
    let near = 4.0 * wf.tol.point;
    let at_p = |wf: &Wavefront, v: VertexId| wf.alive(v) && (wf.pos(v, t) - p).length() <= near;
    let ResolveScratch {
        members,
        stack,
        through,
        pending_lines,
        rays,
        seen,
        sorted,
        dead_edges,
        met,
        halves,
        pairs,
        used,
    } = scratch;
    reset(members);
    reset(seen);
    for list in [&mut *through, &mut *dead_edges, &mut *met] {
        list.clear();
    }
    rays.clear();
    sorted.clear();

    // Gather the vertices standing at the point, walking along their cycles.
    stack.clear();
    stack.extend(site.vertices.iter().copied().filter(|&v| at_p(wf, v)));
    pending_lines.clear();
    pending_lines.extend_from_slice(&site.through_lines);
    loop {
        while let Some(v) = stack.pop() {
            if !members.insert(v) {
                continue;
            }
            for w in [wf.prev(v), wf.next(v)] {
                if !members.contains(&w) && at_p(wf, w) {
                    stack.push(w);
                }
            }
        }
        // Edges through the point: an end standing at the point makes it an
        // ordinary member instead.
        let mut grew = false;
        for line in pending_lines.drain(..) {
            let Some(e) = piece_through(wf, line, p, t, near) else {
                continue;
            };
            let Some(edge) = wf.edges.get(e).copied() else {
                continue;
            };
            let mut end_here = false;
            for v in [edge.start, edge.end] {
                if members.contains(&v) {
                    end_here = true;
                } else if at_p(wf, v) {
                    stack.push(v);
                    end_here = true;
                    grew = true;
                }
            }
            if !end_here && !through.contains(&e) {
                through.push(e);
            }
        }
        if !grew {
            break;
        }
    }
    through.retain(|&e| {
        wf.edges.get(e).is_some_and(|x| !members.contains(&x.start) && !members.contains(&x.end))
    });
    if members.is_empty() && through.len() < 2 {
        return;
    }

    // Runs of consecutive members; each leaves one arriving and one leaving edge.
    sorted.extend(members.iter().copied());
    sorted.sort_unstable();
    for &v in sorted.iter() {
        if seen.contains(&v) {
            continue;
        }
        let mut first = v;
        let mut whole_cycle = false;
        // Runs are at most the whole member set long; the bound only guards
        // against a broken cycle.
        let bound = members.len() + 1;
        for _ in 0..bound {
            let pv = wf.prev(first);
            if !members.contains(&pv) {
                break;
            }
            if pv == v {
                whole_cycle = true;
                break;
            }
            first = pv;
        }
        let mut last = first;
        seen.insert(first);
        for _ in 0..bound {
            let nv = wf.next(last);
            if whole_cycle && nv == first {
                if let Some(x) = wf.vertices.get(last) {
                    dead_edges.push(x.out_edge);
                }
                break;
            }
            if !members.contains(&nv) {
                break;
            }
            if let Some(x) = wf.vertices.get(last) {
                dead_edges.push(x.out_edge);
            }
            seen.insert(nv);
            last = nv;
        }
        if whole_cycle {
            continue;
        }
        let (Some(fx), Some(lx)) = (wf.vertices.get(first), wf.vertices.get(last)) else {
            continue;
        };
        let (a, b) = (fx.in_edge, lx.out_edge);
        let (Some(la), Some(lb)) = (wf.lines.get(wf.edge_line(a)), wf.lines.get(wf.edge_line(b))) else {
            continue;
        };
        rays.push(Ray { angle: angle_of(-la.dir), leaving: false, edge: a, through: None });
        rays.push(Ray { angle: angle_of(lb.dir), leaving: true, edge: b, through: None });
    }
    for (i, &e) in through.iter().enumerate() {
        let Some(l) = wf.lines.get(wf.edge_line(e)) else {
            continue;
        };
        rays.push(Ray { angle: angle_of(-l.dir), leaving: false, edge: e, through: Some(i) });
        rays.push(Ray { angle: angle_of(l.dir), leaving: true, edge: e, through: Some(i) });
    }

    // Retire the members at one node, placed where the lines met there
    // cross best (least squares), which is closer than the events' mean.
    for &v in sorted.iter() {
        if let Some(x) = wf.vertices.get(v) {
            met.push(x.in_line);
            met.push(x.out_line);
        }
    }
    met.extend(through.iter().map(|&e| wf.edge_line(e)));
    met.sort_unstable();
    met.dedup();
    // Only when the mean misses a line noticeably: refining a point that
    // already sits on every line would only add rounding.
    let residual =
        met.iter().filter_map(|&i| wf.lines.get(i)).map(|l| l.distance_at(p, t).abs()).fold(0.0, f64::max);
    let (p, t) = if residual > 1e-3 * wf.tol.point {
        refine_in_time(wf, met, p, t, near).unwrap_or((refine(wf, met, p, t, near), t))
    } else {
        (p, t)
    };
    let p = wf.onto_gables(p, met);
    let node = wf.add_node(p, t);
    for &v in sorted.iter() {
        wf.retire(v, node);
    }
    for &e in dead_edges.iter() {
        wf.kill_edge(e);
    }

    pair_rays(rays, 1e-9, pairs, used);

    // Split the through edges whose halves go separate ways.
    halves.clear();
    halves.resize(through.len(), None);
    for &(arr, lea) in pairs.iter() {
        let (Some(ra), Some(rl)) = (rays.get(arr), rays.get(lea)) else {
            continue;
        };
        if ra.through.is_some() && ra.through == rl.through {
            continue;
        }
        for i in [ra.through, rl.through].into_iter().flatten() {
            if halves.get(i).is_some_and(Option::is_none) {
                let Some(&e) = through.get(i) else { continue };
                let Some(edge) = wf.edges.get(e).copied() else {
                    continue;
                };
                let first = wf.add_edge(edge.line, edge.start, edge.end);
                let second = wf.add_edge(edge.line, edge.start, edge.end);
                wf.kill_edge(e);
                wf.set_edge_start(first, edge.start);
                wf.set_edge_end(second, edge.end);
                if let Some(h) = halves.get_mut(i) {
                    *h = Some((first, second));
                }
            }
        }
    }

    for &(arr, lea) in pairs.iter() {
        let (Some(ra), Some(rl)) = (rays.get(arr).copied(), rays.get(lea).copied()) else {
            continue;
        };
        if ra.through.is_some() && ra.through == rl.through {
            continue;
        }
        let a = match ra.through.and_then(|i| halves.get(i).copied().flatten()) {
            Some((first, _)) => first,
            None => ra.edge,
        };
        let b = match rl.through.and_then(|i| halves.get(i).copied().flatten()) {
            Some((_, second)) => second,
            None => rl.edge,
        };
        let (Some(ea), Some(eb)) = (wf.edges.get(a).copied(), wf.edges.get(b).copied()) else {
            continue;
        };
        let w = wf.add_vertex(a, b, node);
        wf.link(ea.start, w);
        wf.link(w, eb.end);
        wf.set_edge_end(a, w);
        wf.set_edge_start(b, w);
        created.push(w);
    }
}

/// The plan point and height nearest, in least squares, to all `lines`
/// (each `normal . p - speed * t = offset`), if they fix both well and the
/// answer stays within `near` of `p` and a little of `t`.
fn refine_in_time(wf: &Wavefront, lines: &[usize], p: DVec2, t: f64, near: f64) -> Option<(DVec2, f64)> {
    if lines.len() < 3 {
        return None;
    }
    let mut m = [[0.0f64; 3]; 3];
    let mut r = [0.0f64; 3];
    for l in lines.iter().filter_map(|&i| wf.lines.get(i)) {
        let row = [l.normal.x, l.normal.y, -l.speed];
        for (i, &ri) in row.iter().enumerate() {
            for (j, &rj) in row.iter().enumerate() {
                m[i][j] += ri * rj;
            }
            r[i] += ri * l.offset;
        }
    }
    let det3 = |a: [[f64; 3]; 3]| {
        a[0][0] * (a[1][1] * a[2][2] - a[1][2] * a[2][1]) - a[0][1] * (a[1][0] * a[2][2] - a[1][2] * a[2][0])
            + a[0][2] * (a[1][0] * a[2][1] - a[1][1] * a[2][0])
    };
    let d = det3(m);
    let scale = m[0][0] + m[1][1] + m[2][2];
    if d.is_nan() || d.abs() <= 1e-6 * scale * scale * scale {
        return None;
    }
    let mut x = [0.0f64; 3];
    for (k, xk) in x.iter_mut().enumerate() {
        let mut mk = m;
        for (row, &rv) in mk.iter_mut().zip(&r) {
            row[k] = rv;
        }
        *xk = det3(mk) / d;
    }
    let q = DVec2::new(x[0], x[1]);
    let ok = q.is_finite()
        && x[2].is_finite()
        && (q - p).length() <= near
        && (x[2] - t).abs() <= 4.0 * wf.tol.time;
    ok.then_some((q, x[2]))
}

/// The point nearest, in least squares, to all `lines` at height `t`; `p`
/// itself if the lines do not fix a point or the answer strays beyond `near`.
fn refine(wf: &Wavefront, lines: &[usize], p: DVec2, t: f64, near: f64) -> DVec2 {
    let (mut a, mut b, mut c, mut r1, mut r2) = (0.0, 0.0, 0.0, 0.0, 0.0);
    for l in lines.iter().filter_map(|&i| wf.lines.get(i)) {
        let rhs = l.offset + l.speed * t;
        a += l.normal.x * l.normal.x;
        b += l.normal.x * l.normal.y;
        c += l.normal.y * l.normal.y;
        r1 += l.normal.x * rhs;
        r2 += l.normal.y * rhs;
    }
    let det = a * c - b * b;
    if det <= 1e-6 * (a + c) * (a + c) {
        return p;
    }
    let q = DVec2::new(c * r1 - b * r2, a * r2 - b * r1) / det;
    if q.is_finite() && (q - p).length() <= near { q } else { p }
}

/// The live piece of `line` whose segment holds `p` at height `t`.
fn piece_through(wf: &Wavefront, line: usize, p: DVec2, t: f64, near: f64) -> Option<EdgeId> {
    let l = wf.lines.get(line)?;
    if l.distance_at(p, t).abs() > near {
        return None;
    }
    wf.pieces_by_line.get(line)?.iter().copied().find(|&e| {
        wf.edges.get(e).is_some_and(|x| {
            x.alive && l.dir.dot(p - wf.pos(x.start, t)) >= -near && l.dir.dot(wf.pos(x.end, t) - p) >= -near
        })
    })
}

/// Angle of `d` in `[0, 2 pi)`.
fn angle_of(d: DVec2) -> f64 {
    let a = d.y.atan2(d.x);
    if a < 0.0 { a + std::f64::consts::TAU } else { a }
}

/// Pairs each leaving ray with the next arriving ray counter-clockwise
/// (the region between them is what is left to roof). Rays at the same
/// angle put the leaving one first, so two opposite lines that meet give a
/// zero-width pair that the clean-up removes. Returns `(arriving, leaving)`
/// index pairs into `rays` (which is sorted in place) in `pairs`; `used`
/// is space to work in.
fn pair_rays(rays: &mut [Ray], tie: f64, pairs: &mut Vec<(usize, usize)>, used: &mut Vec<bool>) {
    pairs.clear();
    rays.sort_by(|a, b| a.angle.total_cmp(&b.angle));
    let n = rays.len();
    if n < 2 {
        return;
    }
    for _ in 0..n {
        let mut swapped = false;
        for i in 0..n {
            let j = (i + 1) % n;
            let (Some(ri), Some(rj)) = (rays.get(i).copied(), rays.get(j).copied()) else {
                continue;
            };
            let gap = (rj.angle - ri.angle).rem_euclid(std::f64::consts::TAU);
            if !ri.leaving && rj.leaving && gap <= tie && i != j {
                rays.swap(i, j);
                swapped = true;
            }
        }
        if !swapped {
            break;
        }
    }
    used.clear();
    used.resize(n, false);
    for i in 0..n {
        if !rays.get(i).is_some_and(|r| r.leaving) {
            continue;
        }
        for k in 1..n {
            let j = (i + k) % n;
            if rays.get(j).is_some_and(|r| !r.leaving) && used.get(j) == Some(&false) {
                if let Some(u) = used.get_mut(j) {
                    *u = true;
                }
                pairs.push((j, i));
                break;
            }
        }
    }
}
