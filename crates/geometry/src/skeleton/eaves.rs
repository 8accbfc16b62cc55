//! Carrying a roof plane out past its wall line to the fascia.
//!
//! The fascia outline is the wall outline offset outward by each wall's own
//! horizontal overhang. A plane's eave outline is its face with the wall
//! line moved out to its fascia line and every hip or valley leaving a wall
//! corner extended down along the two planes' crossing until it meets a
//! fascia line. With overhangs in the ratio of the pitches (the only case
//! in which both fascias are level at the same height) the extension ends
//! exactly at the fascia corner; otherwise it meets one of the two fascia
//! lines first, and the plane on the other side also covers the short
//! stretch of that fascia line up to the fascia corner. Over a gable wall
//! the rake is carried out to the gable's fascia (barge) line.

use glam::{DVec2, DVec3};

use super::lines::WallLine;
use super::wavefront::Node;

/// What a face edge lies against.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) enum EdgeSide {
    /// The face's own wall line.
    OwnWall,
    /// The rake over a gable wall (global wall index).
    Gable(usize),
    /// A hip, valley or ridge towards another pitched wall (global index).
    Plane(usize),
    /// Nothing known.
    Other,
}

/// Where a line `p + s d` meets the line `{q : normal . q = offset}`.
fn meet(p: DVec2, d: DVec2, normal: DVec2, offset: f64) -> Option<(f64, DVec2)> {
    let den = normal.dot(d);
    if den.abs() < 1e-12 * d.length().max(1e-300) {
        return None;
    }
    let s = (offset - normal.dot(p)) / den;
    s.is_finite().then_some((s, p + d * s))
}

/// The fascia line of `line`: `(normal, offset)` with the same normal.
fn fascia(line: &WallLine) -> (DVec2, f64) {
    (line.normal, line.offset - line.overhang)
}

/// Crossing of two fascia lines, or the foot of `fallback` on the first when parallel.
fn fascia_corner(a: &WallLine, b: &WallLine, fallback: DVec2) -> DVec2 {
    let (na, ca) = fascia(a);
    let (nb, cb) = fascia(b);
    let det = na.perp_dot(nb);
    if det.abs() < 1e-12 {
        return fallback - na * (na.dot(fallback) - ca);
    }
    DVec2::new(ca * nb.y - cb * na.y, na.x * cb - nb.x * ca) / det
}

/// Up to two eave points at one face node, in the face's order.
#[derive(Debug, Clone, Copy)]
struct NodePoints {
    /// The points; only the first `len` count.
    pts: [DVec2; 2],
    /// How many there are.
    len: usize,
}

impl NodePoints {
    /// No point.
    const NONE: Self = Self { pts: [DVec2::ZERO; 2], len: 0 };

    /// One point.
    fn one(p: DVec2) -> Self {
        Self { pts: [p, DVec2::ZERO], len: 1 }
    }

    /// Two points, in order.
    fn two(a: DVec2, b: DVec2) -> Self {
        Self { pts: [a, b], len: 2 }
    }

    /// The points, in order.
    fn as_slice(&self) -> &[DVec2] {
        self.pts.get(..self.len).unwrap_or(&[])
    }
}

/// Eave points at an outline corner `c` between the fascia of `own` and a
/// face edge running from `c` towards `inner` against the pitched wall
/// `other`; `own_first` when the fascia edge comes before the hip edge in
/// the face's order. Returned in the face's order.
fn corner_points(own: &WallLine, other: &WallLine, c: DVec2, inner: DVec2, own_first: bool) -> NodePoints {
    let d = c - inner;
    let (na, ca) = fascia(own);
    let (nb, cb) = fascia(other);
    let hit_a = meet(c, d, na, ca).filter(|h| h.0 >= 0.0);
    let hit_b = meet(c, d, nb, cb).filter(|h| h.0 >= 0.0);
    match (hit_a, hit_b) {
        (Some(a), Some(b)) if b.0 < a.0 => {
            let f = fascia_corner(own, other, c);
            if own_first { NodePoints::two(f, b.1) } else { NodePoints::two(b.1, f) }
        }
        (Some(a), _) => NodePoints::one(a.1),
        (None, Some(_)) | (None, None) => NodePoints::one(fascia_corner(own, other, c)),
    }
}

/// The eave outline of the face of `wall`: its `nodes` (face order, first
/// two on the wall line) with the side each edge `i -> i+1` lies against.
pub(crate) fn eave_outline(
    wall: usize,
    lines: &[WallLine],
    nodes: &[Node],
    face: &[usize],
    sides: &[EdgeSide],
) -> Vec<DVec3> {
    let Some(own) = lines.get(wall) else {
        return Vec::new();
    };
    let k = face.len();
    if k == 0 {
        return Vec::new();
    }
    let pos = |i: usize| face.get(i % k).and_then(|&n| nodes.get(n)).map_or(DVec2::ZERO, |n| n.pos);
    let side = |i: usize| sides.get(i % k).copied().unwrap_or(EdgeSide::Other);
    let support = |s: EdgeSide| -> Option<&WallLine> {
        match s {
            EdgeSide::OwnWall => Some(own),
            EdgeSide::Gable(g) => lines.get(g),
            _ => None,
        }
    };
    let at = |i: usize| {
        let (before, after) = (side(i + k - 1), side(i));
        let here = pos(i);
        match (support(before), support(after)) {
            (Some(x), Some(y)) if x.wall == y.wall => NodePoints::NONE,
            (Some(x), Some(y)) => NodePoints::one(fascia_corner(x, y, here)),
            (Some(x), None) => {
                let towards = pos(i + 1);
                match (before, after) {
                    (EdgeSide::OwnWall, EdgeSide::Plane(b)) => match lines.get(b) {
                        Some(other) => corner_points(x, other, here, towards, true),
                        None => NodePoints::one(here),
                    },
                    _ => {
                        let (n, c) = fascia(x);
                        NodePoints::one(
                            meet(here, here - towards, n, c).map_or(here - n * x.overhang, |h| h.1),
                        )
                    }
                }
            }
            (None, Some(y)) => {
                let from = pos(i + k - 1);
                match (before, after) {
                    (EdgeSide::Plane(b), EdgeSide::OwnWall) => match lines.get(b) {
                        Some(other) => corner_points(y, other, here, from, false),
                        None => NodePoints::one(here),
                    },
                    _ => {
                        let (n, c) = fascia(y);
                        NodePoints::one(meet(here, here - from, n, c).map_or(here - n * y.overhang, |h| h.1))
                    }
                }
            }
            (None, None) => NodePoints::one(here),
        }
    };
    // Start where the fascia edge starts: the last point at the wall's first corner.
    let lift = |p: DVec2| p.extend(own.plane_height(p));
    let first = at(0);
    let first = first.as_slice();
    let mut out: Vec<DVec3> = Vec::with_capacity(k + 2);
    if let Some(&p) = first.last() {
        out.push(lift(p));
    }
    for i in 1..k {
        out.extend(at(i).as_slice().iter().map(|&p| lift(p)));
    }
    out.extend(first.iter().take(first.len().saturating_sub(1)).map(|&p| lift(p)));
    out
}
