//! The solved roof: one plane per pitched wall, and the lines where they meet.
//!
//! [`Roof::solve`] raises every pitched wall's plane at its pitch and finds
//! where the planes meet with a weighted straight skeleton of the outline
//! (see the `skeleton` module): the height of the roof over a plan point is
//! the height at which the wall lines, moving inward at `1 / rise_per_run`
//! each, reach it. Gable walls do not move; their roof surface is vertical.

use glam::DVec3;
use serde::Serialize;
use thiserror::Error;

use glam::DVec2;

// The skeleton has a folder of its own beside this file; it is declared
// here, as only the roof solve uses it.
#[path = "skeleton/mod.rs"]
mod skeleton;

use crate::outline::{Meeting, segments_meet};
use crate::quick_hash::QuickMap;
use crate::{Outline, Wall, WallRoof};
use skeleton::eaves::{EdgeSide, eave_outline};
use skeleton::lines::WallLine;
use skeleton::tolerance::Tolerance;
use skeleton::{Ring, Skeleton, SkeletonError};

/// The kind of line where two roof planes meet.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum RoofLineKind {
    /// Level line between two planes (the top of the roof).
    Ridge,
    /// Sloping outside corner: the planes fall away on both sides.
    Hip,
    /// Sloping inside corner: water runs towards it.
    Valley,
}

/// A line where two roof planes meet.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RoofLine {
    /// Ridge, hip or valley.
    pub kind: RoofLineKind,
    /// Lower end (for a ridge, either end).
    pub from: DVec3,
    /// Upper end.
    pub to: DVec3,
    /// The walls whose planes meet here (global wall indices).
    pub walls: [usize; 2],
}

/// One roof plane: the part of the roof that drains to one wall.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RoofPlane {
    /// Global wall index (outer walls first, then courtyard walls, each in
    /// file order).
    pub wall: usize,
    /// Rise per unit run.
    pub rise_per_run: f64,
    /// The plane's outline at the wall line (no overhang), counter-clockwise
    /// seen from above, starting at the wall's first corner; z is height
    /// above the wall line.
    pub outline: Vec<DVec3>,
    /// The same plane carried out to the fascia line (the overhang),
    /// counter-clockwise from above, starting where the fascia line starts;
    /// z is negative beyond the wall line.
    pub eave_outline: Vec<DVec3>,
    /// The lowest wall index among the walls whose roof plane is this same
    /// plane (in line with this wall and at the same pitch); `wall` itself
    /// when no other wall shares it. Each wall keeps its own part, divided
    /// from its neighbour's along a line square to the wall line through
    /// their shared corner; no ridge, hip or valley is reported between
    /// them. [`Roof::coplanar_walls`] lists a plane's partners.
    pub plane_group: usize,
}

impl RoofPlane {
    /// Whether `other` is another wall's part of this same plane.
    pub fn shares_plane_with(&self, other: &RoofPlane) -> bool {
        self.wall != other.wall && self.plane_group == other.plane_group
    }
}

/// The vertical triangle or trapezoid above a gable wall.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct GableFace {
    /// Global wall index.
    pub wall: usize,
    /// The face's outline; the first two points are the wall's ends at z = 0.
    pub outline: Vec<DVec3>,
}

/// A solved roof.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Roof {
    /// One plane per pitched wall.
    pub planes: Vec<RoofPlane>,
    /// Ridges, hips and valleys.
    pub lines: Vec<RoofLine>,
    /// Gable end faces.
    pub gables: Vec<GableFace>,
}

/// Why a roof could not be solved.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum RoofError {
    /// A wall's pitch is zero, negative or not a number.
    #[error("wall {} has a pitch of {rise_per_run}; a pitched wall needs a rise above 0", .wall + 1)]
    PitchNotPositive {
        /// Global wall index.
        wall: usize,
        /// The rise per unit run given.
        rise_per_run: f64,
    },
    /// A corner or overhang is not a finite number.
    #[error("wall {} has a corner or overhang that is not a finite number", .wall + 1)]
    NotFinite {
        /// Global wall index.
        wall: usize,
    },
    /// A wall has (next to) no length.
    #[error("wall {} has no length", .wall + 1)]
    WallHasNoLength {
        /// Global wall index.
        wall: usize,
    },
    /// A courtyard has fewer than three corners.
    #[error("courtyard {} has {count} corners; it needs at least 3", .courtyard + 1)]
    CourtyardTooSmall {
        /// Courtyard index in the user's order.
        courtyard: usize,
        /// How many corners it has.
        count: usize,
    },
    /// A gable wall runs on in line with a pitched wall.
    #[error("wall {} is a gable in line with pitched wall {}; make both gables or both pitched", .gable + 1, .wall + 1)]
    GableInLineWithPitched {
        /// The gable wall (global index).
        gable: usize,
        /// The pitched wall in line with it (global index).
        wall: usize,
    },
    /// Part of the plan is ringed by gable walls only, so no roof plane reaches it.
    #[error("walls {} are all gables round part of the plan that no roof plane reaches; make one of them pitched", list_walls(.walls))]
    GablesOnly {
        /// The gable walls round the unroofed part (global indices).
        walls: Vec<usize>,
    },
    /// The solver met a configuration it could not resolve.
    #[error("the roof could not be solved: {reason}")]
    Unsolvable {
        /// What went wrong, in words.
        reason: String,
    },
}

impl Roof {
    /// Solves the roof over a validated outline (simple rings, courtyards
    /// inside the outer ring, either orientation).
    ///
    /// Wall indices in the result are global: outer walls `0..n` in the
    /// user's order, then each courtyard's walls continuing the count.
    ///
    /// Rules where the planes alone leave a choice:
    /// - **Parallel walls of different pitch that come into line** during
    ///   the solve (a step between them has closed): the lower-pitch plane
    ///   (the faster line in plan) wins. From that height on it is the
    ///   lower plane over the whole shared stretch, so it takes over the
    ///   steeper plane's remaining edge at once and the two meet in a level
    ///   line (reported as a ridge, or as a valley where the roof is the
    ///   higher of the two planes). Walls given in line with different
    ///   pitches never reach the solve: outline validation refuses them.
    /// - **Walls in line at one pitch** share one plane: each wall keeps its
    ///   own part, divided along the line square to the wall at their shared
    ///   corner; [`RoofPlane::plane_group`] names the lowest of them, and their
    ///   ridges, hips and valleys are reported once, under the
    ///   lowest-numbered of them.
    /// - **A gable at an inside corner** keeps its vertical face running on
    ///   along its line past the corner until the planes either side meet:
    ///   the plane beyond the corner starts at height 0 there, the one over
    ///   the gable does not, so the roof steps at a vertical face. Some
    ///   step from that corner inward is unavoidable (no other wall's plane
    ///   is at height 0 there, and the pitched wall's own plane is below the
    ///   wall line on the gable's side); carried on along the gable's line
    ///   it is the gable wall framed up above the lower roof, as where a
    ///   wing's roof dies into a gable end.
    /// - **Part of the plan ringed by gables only** gets no plane:
    ///   [`RoofError::GablesOnly`].
    ///
    /// ```
    /// use glam::DVec2;
    /// use pitchframe_geometry::{Outline, Roof, Wall, WallRoof};
    /// let wall = |x, y| Wall {
    ///     corner: DVec2::new(x, y),
    ///     roof: WallRoof::Pitched { rise_per_run: 0.5 },
    ///     overhang_in: 12.0,
    /// };
    /// let outline = Outline::new(
    ///     vec![wall(0.0, 0.0), wall(480.0, 0.0), wall(480.0, 240.0), wall(0.0, 240.0)],
    ///     vec![],
    /// )
    /// .unwrap();
    /// let roof = Roof::solve(&outline).unwrap();
    /// assert_eq!(roof.planes.len(), 4);
    /// ```
    pub fn solve(outline: &Outline) -> Result<Self, RoofError> {
        let walls: Vec<Wall> =
            outline.outer().iter().chain(outline.courtyards().iter().flatten()).copied().collect();
        check_walls(&walls)?;
        let mut ring_walls: Vec<Vec<usize>> = vec![(0..outline.outer().len()).collect()];
        let mut first = outline.outer().len();
        for (c, ring) in outline.courtyards().iter().enumerate() {
            if ring.len() < 3 {
                return Err(RoofError::CourtyardTooSmall { courtyard: c, count: ring.len() });
            }
            ring_walls.push((first..first + ring.len()).collect());
            first += ring.len();
        }

        // Orient every ring so the roofed region lies on the left.
        let mut lines: Vec<Option<WallLine>> = vec![None; walls.len()];
        let mut rings = Vec::new();
        for (r, idx) in ring_walls.iter().enumerate() {
            let corners: Vec<DVec2> = idx.iter().filter_map(|&i| walls.get(i).map(|w| w.corner)).collect();
            let ccw = signed_area(&corners) > 0.0;
            let keep = if r == 0 { ccw } else { !ccw };
            let k = idx.len();
            let mut order = Vec::with_capacity(k);
            for j in 0..k {
                let (Some(&w), Some(&a), Some(&b)) = (idx.get(j), corners.get(j), corners.get((j + 1) % k))
                else {
                    continue;
                };
                let Some(wall) = walls.get(w) else { continue };
                let (start, end) = if keep { (a, b) } else { (b, a) };
                let rise = match wall.roof {
                    WallRoof::Pitched { rise_per_run } => Some(rise_per_run),
                    WallRoof::Gable => None,
                };
                if let Some(slot) = lines.get_mut(w) {
                    *slot = Some(WallLine::new(w, start, end, rise, wall.overhang_in));
                }
                order.push(w);
            }
            if !keep {
                order.reverse();
            }
            rings.push(Ring { walls: order });
        }
        let lines: Vec<WallLine> = lines.into_iter().flatten().collect();
        if lines.len() != walls.len() {
            return Err(RoofError::Unsolvable { reason: "a wall could not be read".into() });
        }
        check_in_line(&lines, &rings)?;

        let (mut lo, mut hi) = (DVec2::splat(f64::INFINITY), DVec2::splat(f64::NEG_INFINITY));
        for w in &walls {
            lo = lo.min(w.corner);
            hi = hi.max(w.corner);
        }
        let size = (hi - lo).max_element();
        let min_rise = lines.iter().filter_map(|l| l.rise).fold(f64::INFINITY, f64::min);
        let tol = Tolerance::for_outline(size, if min_rise.is_finite() { min_rise } else { 1.0 });
        for (i, l) in lines.iter().enumerate() {
            if (l.end - l.start).length() <= tol.point {
                return Err(RoofError::WallHasNoLength { wall: i });
            }
        }

        let sk = skeleton::solve(lines, &rings, tol).map_err(|e| match e {
            SkeletonError::Unroofed { walls } => RoofError::GablesOnly { walls },
            SkeletonError::FaceOpen { wall } => RoofError::Unsolvable {
                reason: format!("the roof plane over wall {} does not close", wall + 1),
            },
            SkeletonError::TooManyEvents => {
                RoofError::Unsolvable { reason: "the solve did not settle (too many events)".into() }
            }
        })?;
        // Nodes within the outline's tolerance are one node where face
        // edges are paired into lines (see `join_close_nodes`).
        Ok(build_roof(&sk, &tol, crate::outline::TOLERANCE_PER_SIZE * size))
    }

    /// The walls other than plane `plane`'s own whose roof plane is the
    /// same plane (in line with it, at the same pitch), in wall order.
    /// It looks through every plane; to compare two planes, use
    /// [`RoofPlane::shares_plane_with`].
    pub fn coplanar_walls(&self, plane: usize) -> Vec<usize> {
        let Some(own) = self.planes.get(plane) else { return Vec::new() };
        let mut walls: Vec<usize> =
            self.planes.iter().filter(|p| own.shares_plane_with(p)).map(|p| p.wall).collect();
        walls.sort_unstable();
        walls
    }
}

/// Wall numbers as people count them: "1, 2 and 3".
fn list_walls(walls: &[usize]) -> String {
    let names: Vec<String> = walls.iter().map(|w| (w + 1).to_string()).collect();
    match names.split_last() {
        Some((last, rest)) if !rest.is_empty() => format!("{} and {last}", rest.join(", ")),
        Some((last, _)) => last.clone(),
        None => String::new(),
    }
}

/// Rejects pitches and numbers the solve cannot use.
fn check_walls(walls: &[Wall]) -> Result<(), RoofError> {
    for (i, w) in walls.iter().enumerate() {
        if !w.corner.is_finite() || !w.overhang_in.is_finite() {
            return Err(RoofError::NotFinite { wall: i });
        }
        if let WallRoof::Pitched { rise_per_run } = w.roof
            && !(rise_per_run > 0.0 && rise_per_run.is_finite())
        {
            return Err(RoofError::PitchNotPositive { wall: i, rise_per_run });
        }
    }
    Ok(())
}

/// Rejects a gable running on in line with a pitched wall: the gable's
/// vertical face and the plane would have no line to meet along.
fn check_in_line(lines: &[WallLine], rings: &[Ring]) -> Result<(), RoofError> {
    for ring in rings {
        let k = ring.walls.len();
        for j in 0..k {
            let (Some(&a), Some(&b)) = (ring.walls.get(j), ring.walls.get((j + 1) % k)) else {
                continue;
            };
            let (Some(la), Some(lb)) = (lines.get(a), lines.get(b)) else {
                continue;
            };
            let turn = robust::orient2d(coord(la.start), coord(la.end), coord(lb.end));
            if turn == 0.0 && la.rise.is_some() != lb.rise.is_some() {
                let (gable, wall) = if la.rise.is_none() { (a, b) } else { (b, a) };
                return Err(RoofError::GableInLineWithPitched { gable, wall });
            }
        }
    }
    Ok(())
}

/// A plan point as a `robust` coordinate.
fn coord(p: DVec2) -> robust::Coord<f64> {
    robust::Coord { x: p.x, y: p.y }
}

/// Twice-signed area of a ring (positive counter-clockwise), by the shoelace formula.
fn signed_area(corners: &[DVec2]) -> f64 {
    let k = corners.len();
    (0..k).filter_map(|i| Some(corners.get(i)?.perp_dot(*corners.get((i + 1) % k)?))).sum::<f64>()
}

/// Whether walls `a` and `b` carry one and the same plane.
fn coplanar(a: &WallLine, b: &WallLine, tol: &Tolerance) -> bool {
    match (a.rise, b.rise) {
        (Some(ra), Some(rb)) => {
            (ra - rb).abs() <= 1e-12 * ra.max(rb)
                && a.normal.dot(b.normal) > 1.0 - 1e-12
                && (a.offset - b.offset).abs() <= tol.point
        }
        _ => false,
    }
}

/// For each wall, the lowest-numbered wall carrying the same plane.
///
/// Walls are sorted by the direction of their line (in bins of 1e-9 rad,
/// far finer than any two distinct walls of a building differ) and then by
/// the line's offset, so walls sharing a plane sit next to each other.
fn plane_groups(lines: &[WallLine], tol: &Tolerance) -> Vec<usize> {
    let mut group: Vec<usize> = (0..lines.len()).collect();
    let bins: Vec<i64> = lines.iter().map(|l| (l.normal.y.atan2(l.normal.x) * 1e9).round() as i64).collect();
    let bin = |i: usize| bins.get(i).copied().unwrap_or(0);
    let offset = |i: usize| lines.get(i).map_or(0.0, |l| l.offset);
    let mut order: Vec<usize> =
        (0..lines.len()).filter(|&i| lines.get(i).is_some_and(|l| l.rise.is_some())).collect();
    order.sort_by(|&a, &b| bin(a).cmp(&bin(b)).then(offset(a).total_cmp(&offset(b))));
    // Two walls whose line, pitch and direction bin are the same to the bit.
    let same = |a: usize, b: usize| match (lines.get(a), lines.get(b)) {
        (Some(x), Some(y)) => {
            bin(a) == bin(b)
                && x.offset.to_bits() == y.offset.to_bits()
                && x.normal.x.to_bits() == y.normal.x.to_bits()
                && x.normal.y.to_bits() == y.normal.y.to_bits()
                && x.rise.map(f64::to_bits) == y.rise.map(f64::to_bits)
        }
        _ => false,
    };
    // Whether `b`, after `a` in the order, is among the walls `a` is tested against.
    let reaches = |a: usize, b: usize| match (lines.get(a), lines.get(b)) {
        (Some(x), Some(y)) => bin(b) == bin(a) && y.offset - x.offset <= tol.point,
        _ => false,
    };
    let mut k = 0;
    while let Some(&a) = order.get(k) {
        let Some(la) = lines.get(a) else {
            k += 1;
            continue;
        };
        // A run of walls on one line at one pitch (a comb's thousands of
        // gaps between teeth) that no wall before or after reaches: every
        // pair is coplanar, and the pairwise pass below would give each of
        // them the run's lowest wall, at a cost growing with the square of
        // the run. The run's own labels are still untouched here.
        let mut end = k + 1;
        while order.get(end).is_some_and(|&b| same(a, b)) {
            end += 1;
        }
        let reached_from_before = k > 0 && order.get(k - 1).is_some_and(|&p| reaches(p, a));
        let reaches_after = order.get(end).is_some_and(|&b| reaches(a, b));
        if end - k > 1 && !reached_from_before && !reaches_after && coplanar(la, la, tol) {
            let run = order.get(k..end).unwrap_or_default();
            let low = run.iter().copied().min().unwrap_or(a);
            for &b in run {
                if let Some(x) = group.get_mut(b) {
                    *x = low;
                }
            }
            k = end;
            continue;
        }
        for &b in order.iter().skip(k + 1) {
            let Some(lb) = lines.get(b) else { break };
            if bin(b) != bin(a) || lb.offset - la.offset > tol.point {
                break;
            }
            if coplanar(la, lb, tol) {
                let g = group.get(a).copied().unwrap_or(a).min(group.get(b).copied().unwrap_or(b));
                if let Some(x) = group.get_mut(a) {
                    *x = g;
                }
                if let Some(x) = group.get_mut(b) {
                    *x = g;
                }
            }
        }
        k += 1;
    }
    // Settle chains so every wall names its group's lowest wall.
    for i in 0..group.len() {
        let mut g = group.get(i).copied().unwrap_or(i);
        while let Some(&h) = group.get(g) {
            if h == g {
                break;
            }
            g = h;
        }
        if let Some(x) = group.get_mut(i) {
            *x = g;
        }
    }
    group
}

/// Drops points lying on the straight line between their neighbours,
/// keeping the first two (the wall's ends, which must stay even when the
/// next wall runs on nearly in line).
fn drop_collinear(points: Vec<DVec3>, tol: f64) -> Vec<DVec3> {
    let straight = |a: DVec3, b: DVec3, c: DVec3| {
        let (ab, bc) = (b - a, c - b);
        ab.length() <= tol
            || (ab.cross(bc).length() <= tol * (ab.length() + bc.length()) && ab.dot(bc) >= 0.0)
    };
    // One pass with a stack: a point is dropped when it lies straight
    // between the last point kept and the next one.
    let mut out: Vec<DVec3> = Vec::with_capacity(points.len());
    for p in points {
        while out.len() > 2 {
            let (Some(&a), Some(&b)) = (out.get(out.len() - 2), out.last()) else { break };
            if straight(a, b, p) {
                out.pop();
            } else {
                break;
            }
        }
        out.push(p);
    }
    // The last point against the first closes the ring.
    while out.len() > 3 {
        let (Some(&a), Some(&b), Some(&c)) = (out.get(out.len() - 2), out.last(), out.first()) else { break };
        if straight(a, b, c) {
            out.pop();
        } else {
            break;
        }
    }
    out
}

/// For each skeleton node, the node it is taken as when faces are joined
/// into lines: the first node (in node order) within `join` of it in plan
/// and within `join` times (1 + the steepest rise) in height, or itself.
///
/// Two events a hair apart can each leave a node where the planes meet in
/// one point: beside a sliver plane (a wall a hair long, or a low pitch
/// squeezed between walls nearly in line) one face's edge ends at one node
/// and its neighbour's at the other, 0.003 in away on a 100 ft plan, so
/// the two edges are not each other's twin and no line would be reported
/// between the planes. A framer cannot tell such points apart; taken as
/// one, the edges pair up. Each node is taken only as a node that stands
/// for itself, so no chain of close nodes drifts farther than `join`.
/// Nodes above one another (the two ends of a gable face's plumb edge)
/// differ in height and stay apart.
fn join_close_nodes(sk: &Skeleton, join: f64) -> Vec<usize> {
    let steepest = sk.lines.iter().filter_map(|l| l.rise).fold(0.0, f64::max);
    let join_height = join * (1.0 + steepest);
    let cell = |p: DVec2| ((p.x / join).floor() as i64, (p.y / join).floor() as i64);
    let mut kept: QuickMap<(i64, i64), Vec<usize>> = QuickMap::default();
    let mut rep = Vec::with_capacity(sk.nodes.len());
    for (i, node) in sk.nodes.iter().enumerate() {
        let (cx, cy) = cell(node.pos);
        let near = (-1..=1).flat_map(|dx| (-1..=1).map(move |dy| (cx + dx, cy + dy))).find_map(|c| {
            kept.get(&c)?.iter().copied().find(|&k| {
                sk.nodes.get(k).is_some_and(|o| {
                    o.pos.distance(node.pos) <= join && (o.time - node.time).abs() <= join_height
                })
            })
        });
        match near {
            Some(k) => rep.push(k),
            None => {
                kept.entry((cx, cy)).or_default().push(i);
                rep.push(i);
            }
        }
    }
    rep
}

/// Turns the skeleton's faces into planes, roof lines and gable faces;
/// nodes within `join` of each other count as one where face edges are
/// paired into lines (see `join_close_nodes`).
fn build_roof(sk: &Skeleton, tol: &Tolerance, join: f64) -> Roof {
    let edges: usize = sk.faces.iter().chain(sk.holes.iter().flatten()).map(Vec::len).sum();
    let face_edges = || {
        sk.faces.iter().enumerate().flat_map(move |(w, face)| {
            std::iter::once(face).chain(sk.holes.get(w).into_iter().flatten()).flat_map(move |lp| {
                let k = lp.len();
                (0..k).filter_map(move |i| Some(((*lp.get(i)?, *lp.get((i + 1) % k)?), w)))
            })
        })
    };
    // Each face edge by its nodes, and, built only once some edge has no
    // exact twin (rare: beside slivers), by the nodes they are taken as:
    // such an edge is paired with one whose ends are within `join` of its
    // own.
    let mut owner: QuickMap<(usize, usize), usize> =
        QuickMap::with_capacity_and_hasher(edges, Default::default());
    owner.extend(face_edges());
    let near = std::cell::OnceCell::new();
    let near_owner = || {
        near.get_or_init(|| {
            let rep = join_close_nodes(sk, join);
            let joined = move |a: usize, b: usize| {
                (rep.get(a).copied().unwrap_or(a), rep.get(b).copied().unwrap_or(b))
            };
            let mut by_joined: QuickMap<(usize, usize), usize> =
                QuickMap::with_capacity_and_hasher(edges, Default::default());
            for ((a, b), w) in face_edges() {
                let (ja, jb) = joined(a, b);
                if ja != jb {
                    by_joined.entry((ja, jb)).or_insert(w);
                }
            }
            (joined, by_joined)
        })
    };
    let twin_owner = |a: usize, b: usize| {
        owner.get(&(b, a)).or_else(|| {
            let (joined, by_joined) = near_owner();
            let (ja, jb) = joined(a, b);
            by_joined.get(&(jb, ja))
        })
    };
    let node_pos = |n: usize| sk.nodes.get(n).map_or(DVec2::ZERO, |x| x.pos);
    let node_time = |n: usize| sk.nodes.get(n).map_or(0.0, |x| x.time);
    let group = plane_groups(&sk.lines, tol);
    let canonical = |w: usize| group.get(w).copied().unwrap_or(w);
    let mut planes = Vec::new();
    let mut gables = Vec::new();
    let mut segments: QuickMap<(usize, usize), Vec<(usize, usize)>> = QuickMap::default();
    for (w, face) in sk.faces.iter().enumerate() {
        let Some(line) = sk.lines.get(w) else {
            continue;
        };
        let k = face.len();
        if line.rise.is_none() {
            let outline = face.iter().map(|&n| node_pos(n).extend(node_time(n))).collect();
            gables.push(GableFace { wall: w, outline: drop_collinear(outline, tol.point) });
            continue;
        }
        let mut sides = Vec::with_capacity(k);
        for i in 0..k {
            let (Some(&a), Some(&b)) = (face.get(i), face.get((i + 1) % k)) else {
                continue;
            };
            let side = if i == 0 {
                EdgeSide::OwnWall
            } else {
                match twin_owner(a, b).and_then(|&o| sk.lines.get(o)) {
                    Some(other) if other.rise.is_none() => EdgeSide::Gable(other.wall),
                    Some(other) => {
                        // Walls sharing one plane report their lines once,
                        // under the lowest-numbered of them.
                        let (cw, co) = (canonical(w), canonical(other.wall));
                        if co > cw {
                            segments.entry((cw, co)).or_default().push((a, b));
                        }
                        EdgeSide::Plane(other.wall)
                    }
                    None => EdgeSide::Other,
                }
            };
            sides.push(side);
        }
        let holes = sk.holes.get(w).map(Vec::as_slice).unwrap_or_default();
        for lp in holes {
            let k = lp.len();
            for i in 0..k {
                let (Some(&a), Some(&b)) = (lp.get(i), lp.get((i + 1) % k)) else { continue };
                if let Some(other) = twin_owner(a, b).and_then(|&o| sk.lines.get(o))
                    && other.rise.is_some()
                {
                    let (cw, co) = (canonical(w), canonical(other.wall));
                    if co > cw {
                        segments.entry((cw, co)).or_default().push((a, b));
                    }
                }
            }
        }
        let to_3d = |lp: &[usize]| -> Vec<DVec3> {
            lp.iter().map(|&n| node_pos(n).extend(line.plane_height(node_pos(n)))).collect()
        };
        let outline = to_3d(&with_holes(face, holes, &node_pos));
        let eave = eave_outline(w, &sk.lines, &sk.nodes, face, &sides);
        planes.push(RoofPlane {
            wall: w,
            rise_per_run: line.rise.unwrap_or(0.0),
            outline: drop_collinear(outline, tol.point),
            eave_outline: drop_collinear(eave, tol.point),
            plane_group: canonical(w),
        });
    }
    let mut keys: Vec<_> = segments.keys().copied().collect();
    keys.sort_unstable();
    let mut lines = Vec::new();
    for key in keys {
        let Some(segs) = segments.get(&key) else {
            continue;
        };
        let (Some(la), Some(lb)) = (sk.lines.get(key.0), sk.lines.get(key.1)) else {
            continue;
        };
        for (a, b) in merge_segments(segs, &node_pos, tol.point) {
            let (pa, pb) = (node_pos(a), node_pos(b));
            let (za, zb) = (node_time(a), node_time(b));
            // Two nodes closer than the point tolerance are one point: a
            // "line" between them has no length to lay out and no
            // direction to tell its kind by (0.0003 in between two nodes
            // of a 500 ft star).
            if pa.distance(pb) <= tol.point && (za - zb).abs() <= tol.point {
                continue;
            }
            // The planes' difference grows into face `key.0` (on the left of
            // a -> b): if that face is the lower plane there, the roof is
            // the lower of the two (a convex line).
            let left = (pb - pa).perp();
            let grad_a = la.normal * la.rise.unwrap_or(0.0);
            let grad_b = lb.normal * lb.rise.unwrap_or(0.0);
            let convex = (grad_a - grad_b).dot(left) < 0.0;
            // Level by its ends, or because the two planes cross in a level
            // line (walls in parallel): a short crease between two such
            // planes can have ends whose heights differ by rounding far
            // more than `tol.time`, yet it is a ridge. Ends of equal height
            // do not make a ridge of a crossing that rises: two points of
            // one crossing a plan length `L` apart differ in height by
            // `slope * L`, so where the planes' crossing rises 1 in 1,000
            // or more (facing walls 0.11 degree or more from parallel at
            // 12/12, 1.4 degrees at 1/12, see `crossing_slope`) equal ends
            // are two nodes of one event placed at one height, not a level
            // line. Such a piece is the top of a hip between two nearly
            // facing walls, a hair long, the rest of which is reported as
            // a hip.
            let ends_level = (za - zb).abs() <= tol.time.max(1e-9 * (za.abs() + zb.abs()));
            let level = crossing_is_level(la, lb) || (ends_level && crossing_slope(la, lb) < SLOPED_CROSSING);
            let kind = match (level, convex) {
                (true, true) => RoofLineKind::Ridge,
                (_, false) => RoofLineKind::Valley,
                (false, true) => RoofLineKind::Hip,
            };
            let (from, to) =
                if za <= zb { (pa.extend(za), pb.extend(zb)) } else { (pb.extend(zb), pa.extend(za)) };
            lines.push(RoofLine { kind, from, to, walls: [key.0, key.1] });
        }
    }
    Roof { planes, lines, gables }
}

/// Whether the planes of `a` and `b` cross in a line rising less than
/// 1e-9 per unit run, as the roof check reckons a ridge.
fn crossing_is_level(a: &WallLine, b: &WallLine) -> bool {
    let d = crossing_direction(a, b);
    d.z.abs() <= 1e-9 * d.truncate().length()
}

/// A crossing rising this much per unit run or more is a hip or valley
/// whatever the heights of a piece's ends (the roof check's bound for a
/// line that must be called a hip).
const SLOPED_CROSSING: f64 = 1e-3;

/// The rise per unit run of the line where the planes of `a` and `b`
/// cross. For two walls of rise `r` facing each other `delta` from
/// parallel the crossing runs along their bisector, where each plane's
/// height grows by `r * sin(delta / 2)` per unit run: 1e-3 is reached at
/// delta = 0.11 degrees for 12/12 and 1.4 degrees for 1/12.
fn crossing_slope(a: &WallLine, b: &WallLine) -> f64 {
    let d = crossing_direction(a, b);
    d.z.abs() / d.truncate().length().max(f64::MIN_POSITIVE)
}

/// The direction of the line where the planes of `a` and `b` cross (the
/// cross product of their normals; zero for parallel planes).
fn crossing_direction(a: &WallLine, b: &WallLine) -> DVec3 {
    let normal = |l: &WallLine| {
        let r = l.rise.unwrap_or(0.0);
        DVec3::new(-r * l.normal.x, -r * l.normal.y, 1.0)
    };
    normal(a).cross(normal(b))
}

/// The face's outer walk with each inner loop joined in by a cut: from an
/// outer node to a node of the loop, round the loop, and back along the
/// cut. Such a plane (a low-pitch plane flowing all round a courtyard's
/// island of steeper planes) stays one outline whose shoelace area is
/// right.
///
/// The cut joins the nearest pair of nodes whose straight line meets no
/// edge of the face but at its own two ends. The nearest pair alone can
/// cut across the island: a corner of the island near the outer walk but
/// round the island's far side from it (long-run seed 1023338, plane 6:
/// the nearest pair, 41.7 in apart, ran through two island planes, so the
/// outline crossed itself and overlapped them; the nearest clear pair is
/// 42.6 in apart). Should no pair be clear (another inner loop in the way
/// of every one), the nearest pair is taken.
fn with_holes(face: &[usize], holes: &[Vec<usize>], pos: &dyn Fn(usize) -> DVec2) -> Vec<usize> {
    let mut out = face.to_vec();
    for (h, lp) in holes.iter().enumerate() {
        let mut best: Option<(f64, usize, usize)> = None;
        // Never cut from the wall's own two corners, which lead the outline.
        for (i, &a) in out.iter().enumerate().skip(2) {
            for (j, &b) in lp.iter().enumerate() {
                let d = pos(a).distance_squared(pos(b));
                if best.is_none_or(|x| d < x.0) {
                    best = Some((d, i, j));
                }
            }
        }
        let clear = |&(_, i, j): &(f64, usize, usize)| match (out.get(i), lp.get(j)) {
            (Some(&a), Some(&b)) => {
                let rest = holes.get(h..).unwrap_or_default();
                cut_is_clear(pos(a), pos(b), std::iter::once(&out).chain(rest), pos)
            }
            _ => false,
        };
        // Most nearest pairs are clear; only when one is not are the
        // others ranked (a stable sort, so of pairs equally near the first
        // found wins, as above).
        if let Some(nearest) = best
            && !clear(&nearest)
        {
            let mut pairs: Vec<(f64, usize, usize)> = (2..out.len())
                .flat_map(|i| (0..lp.len()).map(move |j| (i, j)))
                .filter_map(|(i, j)| Some((pos(*out.get(i)?).distance_squared(pos(*lp.get(j)?)), i, j)))
                .collect();
            pairs.sort_by(|x, y| x.0.total_cmp(&y.0));
            best = pairs.into_iter().find(|p| clear(p)).or(best);
        }
        let Some((_, i, j)) = best else { continue };
        let Some(&at) = out.get(i) else { continue };
        let k = lp.len();
        let mut insert: Vec<usize> = (0..=k).filter_map(|m| lp.get((j + m) % k).copied()).collect();
        insert.push(at);
        out.splice(i + 1..i + 1, insert);
    }
    out
}

/// Whether the plan segment `p q` meets no edge of the closed walks
/// `rings` (node lists) but at `p` or `q` themselves: an edge with an end
/// at either point is passed over, any other edge touching the segment
/// blocks it (exact predicates).
fn cut_is_clear<'a>(
    p: DVec2,
    q: DVec2,
    mut rings: impl Iterator<Item = &'a Vec<usize>>,
    pos: &dyn Fn(usize) -> DVec2,
) -> bool {
    rings.all(|ring| {
        let k = ring.len();
        (0..k).all(|m| {
            let (Some(&c), Some(&d)) = (ring.get(m), ring.get((m + 1) % k)) else { return true };
            let (c, d) = (pos(c), pos(d));
            [c, d].iter().any(|&x| x == p || x == q) || segments_meet(p, q, c, d) == Meeting::Apart
        })
    })
}

/// Joins segments (node pairs) that continue each other in a straight line.
fn merge_segments(segs: &[(usize, usize)], pos: &dyn Fn(usize) -> DVec2, tol: f64) -> Vec<(usize, usize)> {
    // The merges are those of scanning the list from its start for the
    // first segment with a later piece (the first such piece in the list),
    // joining the two in the first one's place and scanning again from the
    // start: that order decides which pieces join where three or more meet
    // at a node, and how long each is when the next is tested. Pieces are
    // marked gone rather than taken out (taking one out of a list of
    // thousands moved the rest each time), found by the node they start
    // at, and the scan goes back only as far as a merge can have changed
    // anything: to the segment itself, whose end moved, or to an earlier
    // one ending where it starts, whose later piece it now is.
    if segs.len() <= SHORT_SEGMENT_LIST {
        merge_few_segments(segs, pos, tol)
    } else {
        merge_many_segments(segs, pos, tol)
    }
}

/// [`merge_segments`] for a long list (a comb's ridge, broken at every
/// tooth).
fn merge_many_segments(
    segs: &[(usize, usize)],
    pos: &dyn Fn(usize) -> DVec2,
    tol: f64,
) -> Vec<(usize, usize)> {
    let mut out: Vec<Option<(usize, usize)>> = segs.iter().copied().map(Some).collect();
    let mut by_start: QuickMap<usize, Vec<usize>> = QuickMap::default();
    let mut by_end: QuickMap<usize, Vec<usize>> = QuickMap::default();
    for (k, &(a, b)) in segs.iter().enumerate() {
        by_start.entry(a).or_default().push(k);
        by_end.entry(b).or_default().push(k);
    }
    let joins = |(a, b): (usize, usize), (c, d): (usize, usize)| {
        let (u, v) = (pos(b) - pos(a), pos(d) - pos(c));
        u.perp_dot(v).abs() <= tol * (u.length() + v.length()) && u.dot(v) > 0.0
    };
    let mut i = 0;
    while let Some(slot) = out.get(i) {
        let Some((a, b)) = *slot else {
            i += 1;
            continue;
        };
        let next = by_start.get(&b).and_then(|list| {
            list.iter()
                .copied()
                .find(|&j| j != i && out.get(j).copied().flatten().is_some_and(|s| joins((a, b), s)))
        });
        let Some(j) = next else {
            i += 1;
            continue;
        };
        let Some((c, d)) = out.get(j).copied().flatten() else { break };
        if let Some(x) = out.get_mut(i) {
            *x = Some((a, d));
        }
        if let Some(x) = out.get_mut(j) {
            *x = None;
        }
        if let Some(list) = by_start.get_mut(&c) {
            list.retain(|&k| k != j);
        }
        if let Some(list) = by_end.get_mut(&d) {
            list.retain(|&k| k != j);
        }
        if let Some(list) = by_end.get_mut(&b) {
            list.retain(|&k| k != i);
        }
        let list = by_end.entry(d).or_default();
        let at = list.partition_point(|&k| k < i);
        list.insert(at, i);
        let earlier = by_end.get(&a).and_then(|list| {
            list.iter().copied().find(|&k| k < i && out.get(k).is_some_and(Option::is_some))
        });
        i = earlier.unwrap_or(i);
    }
    out.into_iter().flatten().collect()
}

/// Lists of segments up to this long are merged by [`merge_few_segments`]:
/// nearly every pair of planes meets in one to three, where the maps of
/// the long way cost more than the scan they save.
const SHORT_SEGMENT_LIST: usize = 16;

/// [`merge_segments`] the plain way: the same scan and merges, each piece
/// taken out of the list when joined.
fn merge_few_segments(
    segs: &[(usize, usize)],
    pos: &dyn Fn(usize) -> DVec2,
    tol: f64,
) -> Vec<(usize, usize)> {
    let mut out: Vec<(usize, usize)> = segs.to_vec();
    let mut merged = true;
    while merged {
        merged = false;
        'outer: for i in 0..out.len() {
            for j in 0..out.len() {
                let (Some(&(a, b)), Some(&(c, d))) = (out.get(i), out.get(j)) else {
                    continue;
                };
                if i == j || b != c {
                    continue;
                }
                let (u, v) = (pos(b) - pos(a), pos(d) - pos(c));
                if u.perp_dot(v).abs() <= tol * (u.length() + v.length()) && u.dot(v) > 0.0 {
                    if let Some(x) = out.get_mut(i) {
                        *x = (a, d);
                    }
                    out.remove(j);
                    merged = true;
                    break 'outer;
                }
            }
        }
    }
    out
}

#[cfg(test)]
mod tests {
    use super::*;

    proptest::proptest! {
        #![proptest_config(proptest::prelude::ProptestConfig::with_cases(4096))]
        /// The long way of merging segments joins exactly what the plain
        /// way joins, in the same places, on lists with nodes where three
        /// or more pieces meet, pieces running back, repeats, and nodes a
        /// hair off the line (where which pieces join first decides what
        /// else can join).
        #[test]
        fn segments_merge_the_same_the_long_way_and_the_plain_way(
            offsets in proptest::collection::vec(-4e-7f64..4e-7, 12),
            segs in proptest::collection::vec((0usize..12, 0usize..12), 0..60),
        ) {
            // Twelve nodes 10 in apart along a line at 30 degrees, each a
            // little off it: about as far as decides, at this tolerance,
            // whether two pieces 10 in long are taken as one line.
            let dir = DVec2::new(30f64.to_radians().cos(), 30f64.to_radians().sin());
            let points: Vec<DVec2> =
                offsets.iter().enumerate().map(|(i, o)| dir * (10.0 * i as f64) + dir.perp() * *o).collect();
            let pos = |n: usize| points[n];
            let tol = 1e-7;
            proptest::prop_assert_eq!(merge_many_segments(&segs, &pos, tol), merge_few_segments(&segs, &pos, tol));
        }
    }

    #[test]
    fn a_hole_is_cut_in_from_the_nearest_corner_it_can_be_reached_from_straight() {
        // A 200 in square with a node on its north side at (100, 200), and
        // a hole below it shaped like a trapezoid, 80 in wide along y = 180
        // and 20 in wide along y = 170 (clockwise, as holes are). The
        // narrow side's corners are the nearest to the node (31.6 in), but
        // seen from it they lie behind the wide side; the wide side's
        // corners are 44.7 in from it, in plain sight (derived here).
        let points = [
            DVec2::new(0.0, 0.0),
            DVec2::new(200.0, 0.0),
            DVec2::new(200.0, 200.0),
            DVec2::new(100.0, 200.0),
            DVec2::new(0.0, 200.0),
            DVec2::new(60.0, 180.0),
            DVec2::new(140.0, 180.0),
            DVec2::new(110.0, 170.0),
            DVec2::new(90.0, 170.0),
        ];
        let pos = |n: usize| points[n];
        let joined = with_holes(&[0, 1, 2, 3, 4], &[vec![5, 6, 7, 8]], &pos);
        assert_eq!(joined, vec![0, 1, 2, 3, 5, 6, 7, 8, 5, 3, 4]);
    }
}
