//! Whether each courtyard has room for the overhangs hung into it.
//!
//! A courtyard wall's overhang reaches into the courtyard, so its fascia
//! line is the wall line moved into the courtyard by that wall's own
//! overhang (a gable's rake the same: its barge line, as the roof's eaves
//! carry it). The fascia ring is those lines joined where neighbours cross
//! (stepped across where two walls run on in one straight line). The
//! rafter, hip and valley tails at each corner run from the wall corner to
//! the fascia corner, so the courtyard is too small for its overhangs when
//! that ring collapses:
//!
//! - a fascia edge points the other way from its wall, or has no length:
//!   the tails hung from its two ends cross each other (in a narrow
//!   courtyard, the short walls' edges turn round once the long walls'
//!   fascias have passed each other);
//! - two fascia edges that are not neighbours cross or touch: the eaves
//!   from two sides run into each other (a thin neck in an L-shaped or
//!   waisted courtyard);
//! - the ring encloses no area.
//!
//! The check is in plan only: pitches do not enter it.
//!
//! # Tolerance
//! Every positive overhang is taken half the outline's tolerance longer,
//! so two fascias closer than the tolerance count as meeting: at that
//! size the tails' ends are one line to the saw, and a roof whose fascias
//! exactly meet leaves no room for the fascia boards.

use glam::DVec2;

use super::{
    CourtyardShortfall, Meeting, Outline, OutlineError, STRAIGHT_CORNER_SINE, SegmentGrid,
    distance_to_segment, segments_meet, signed_area,
};

/// Halvings of the overhangs' scale when measuring how far short a
/// refused courtyard falls: 2^-50 of the overhangs is far below the
/// 1/16 in a message shows.
const SCALE_HALVINGS: u32 = 50;

/// One edge of a courtyard's fascia ring.
#[derive(Debug, Clone, Copy)]
struct FasciaEdge {
    a: DVec2,
    b: DVec2,
    /// The wall (within its ring) the edge belongs to: the wall it is the
    /// fascia of, or for a step where two walls run on in line, the wall
    /// after the step.
    wall: usize,
    /// Whether it is a wall's fascia (as against a step between two).
    of_wall: bool,
}

/// What makes a fascia ring collapse, named by the two walls it is about
/// (local indices within the courtyard).
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
struct Collapse {
    wall: usize,
    other: usize,
}

/// A courtyard's walls as the check reads them, in the user's order.
struct Courtyard {
    corners: Vec<DVec2>,
    overhangs_in: Vec<f64>,
    /// Unit direction of each wall, corner `i` to corner `i + 1`.
    directions: Vec<DVec2>,
    /// Unit normal of each wall pointing into the courtyard.
    inward: Vec<DVec2>,
}

impl Courtyard {
    fn new(corners: Vec<DVec2>, overhangs_in: Vec<f64>) -> Self {
        let n = corners.len();
        let interior_on_left = signed_area(&corners) > 0.0;
        let mut directions = Vec::with_capacity(n);
        let mut inward = Vec::with_capacity(n);
        for (i, &a) in corners.iter().enumerate() {
            let b = corners.get((i + 1) % n).copied().unwrap_or(a);
            let u = (b - a).normalize_or_zero();
            directions.push(u);
            inward.push(if interior_on_left { u.perp() } else { -u.perp() });
        }
        Self { corners, overhangs_in, directions, inward }
    }

    fn len(&self) -> usize {
        self.corners.len()
    }

    /// How far wall `i`'s fascia stands off its wall line with the
    /// overhangs scaled by `scale`, the tolerance allowance included.
    fn offset(&self, i: usize, scale: f64, allowance: f64) -> f64 {
        let o = self.overhangs_in.get(i).copied().unwrap_or(0.0);
        if o > 0.0 { o * scale + allowance } else { 0.0 }
    }

    /// The fascia ring with the overhangs scaled by `scale`.
    fn fascia_ring(&self, scale: f64, allowance: f64) -> Vec<FasciaEdge> {
        let n = self.len();
        let vec_at = |v: &[DVec2], i: usize| v.get(i).copied().unwrap_or(DVec2::ZERO);
        // The fascia corners at each wall corner: one where the two fascia
        // lines cross, two where the walls run on in line (a step).
        let mut at_corner: Vec<(DVec2, DVec2)> = Vec::with_capacity(n);
        for i in 0..n {
            let prev = (i + n - 1) % n;
            let p = vec_at(&self.corners, i);
            let (u1, u2) = (vec_at(&self.directions, prev), vec_at(&self.directions, i));
            let off1 = vec_at(&self.inward, prev) * self.offset(prev, scale, allowance);
            let off2 = vec_at(&self.inward, i) * self.offset(i, scale, allowance);
            let sine = u1.perp_dot(u2);
            if sine.abs() <= STRAIGHT_CORNER_SINE {
                at_corner.push((p + off1, p + off2));
            } else {
                // The line p + off1 + s u1 meets p + off2 + r u2.
                let s = (off2 - off1).perp_dot(u2) / sine;
                let m = p + off1 + u1 * s;
                at_corner.push((m, m));
            }
        }
        let mut ring = Vec::with_capacity(2 * n);
        for i in 0..n {
            let (first, second) = at_corner.get(i).copied().unwrap_or_default();
            if first != second {
                ring.push(FasciaEdge { a: first, b: second, wall: i, of_wall: false });
            }
            let (next, _) = at_corner.get((i + 1) % n).copied().unwrap_or_default();
            ring.push(FasciaEdge { a: second, b: next, wall: i, of_wall: true });
        }
        ring
    }

    /// The first collapse of the fascia ring at `scale`, if any: the
    /// lowest-numbered wall whose fascia turns round, else the
    /// lowest-numbered pair of fascia edges that meet, else (for a ring
    /// that is otherwise whole but encloses no area) its two longest
    /// overhangs.
    fn collapse(&self, scale: f64, allowance: f64, tolerance: f64) -> Option<Collapse> {
        let n = self.len();
        let ring = self.fascia_ring(scale, allowance);
        for edge in ring.iter().filter(|e| e.of_wall) {
            let u = self.directions.get(edge.wall).copied().unwrap_or(DVec2::ZERO);
            if (edge.b - edge.a).dot(u) <= 0.0 {
                // The tails at its two ends cross: it is the walls either
                // side whose fascias have come too close.
                let (prev, next) = ((edge.wall + n - 1) % n, (edge.wall + 1) % n);
                return Some(Collapse { wall: prev.min(next), other: prev.max(next) });
            }
        }
        let m = ring.len();
        let ends: Vec<(DVec2, DVec2)> = ring.iter().map(|e| (e.a, e.b)).collect();
        let grid = SegmentGrid::new(&ends, tolerance);
        let mut first: Option<(usize, usize)> = None;
        grid.for_each_candidate_pair(|i, j| {
            let (i, j) = (i.min(j), i.max(j));
            if j == i + 1 || (i == 0 && j + 1 == m) || first.is_some_and(|f| f <= (i, j)) {
                return;
            }
            let (Some(s), Some(t)) = (ring.get(i), ring.get(j)) else {
                return;
            };
            if segments_meet(s.a, s.b, t.a, t.b) != Meeting::Apart {
                first = Some((i, j));
            }
        });
        if let Some((i, j)) = first {
            return Some(self.facing_pair(&ring, i, j));
        }
        let points: Vec<DVec2> = ring.iter().map(|e| e.a).collect();
        let area = signed_area(&points) * if signed_area(&self.corners) > 0.0 { 1.0 } else { -1.0 };
        if area <= 0.0 {
            let mut by_overhang: Vec<usize> = (0..n).collect();
            by_overhang.sort_by(|&a, &b| {
                let (oa, ob) = (self.overhangs_in.get(a), self.overhangs_in.get(b));
                ob.partial_cmp(&oa).unwrap_or(std::cmp::Ordering::Equal).then(a.cmp(&b))
            });
            let (a, b) =
                (by_overhang.first().copied().unwrap_or(0), by_overhang.get(1).copied().unwrap_or(0));
            return Some(Collapse { wall: a.min(b), other: a.max(b) });
        }
        None
    }
}

impl Courtyard {
    /// The two walls to name for fascia edges `i` and `j` of `ring` that
    /// meet. Where a fascia corner has passed the other edge, the wall on
    /// the far side of that corner may be the one that faces it (in a
    /// neck between two parallel walls, the fascia that crosses is the
    /// wall's beside the neck, at the neck's corner). Of the walls of
    /// each edge and of the edges beyond its passed ends, the pair that
    /// faces each other most squarely across the least distance is named;
    /// neighbouring walls are never a pair.
    fn facing_pair(&self, ring: &[FasciaEdge], i: usize, j: usize) -> Collapse {
        let n = self.len();
        let m = ring.len();
        let wall_of = |k: usize| ring.get(k % m.max(1)).filter(|e| e.of_wall).map(|e| e.wall);
        let inward = |w: usize| self.inward.get(w).copied().unwrap_or(DVec2::ZERO);
        // The walls of edge `k` and of the edges beyond those of its ends
        // that lie on or past the fascia line of edge `across`.
        let candidates = |k: usize, across: usize| -> Vec<usize> {
            let mut walls: Vec<usize> = wall_of(k).into_iter().collect();
            if let (Some(edge), Some(line), Some(x)) = (ring.get(k), ring.get(across), wall_of(across)) {
                // Reaching the line counts: the bisection's last scale
                // may put the corner on it exactly.
                let passed = |p: DVec2| (p - line.a).dot(inward(x)) <= 0.0;
                if passed(edge.a) {
                    walls.extend(wall_of(k + m - 1));
                }
                if passed(edge.b) {
                    walls.extend(wall_of(k + 1));
                }
            }
            walls
        };
        let from_i = candidates(i, j);
        let from_j = candidates(j, i);
        let mut best: Option<(f64, usize, usize)> = None;
        for &x in &from_i {
            for &y in &from_j {
                let neighbours = x == y || (x + 1) % n == y || (y + 1) % n == x;
                let facing = -inward(x).dot(inward(y));
                if neighbours || facing <= 0.0 {
                    continue;
                }
                let gap = self.wall_distance(x, y) / facing;
                if best.is_none_or(|(g, _, _)| gap < g) {
                    best = Some((gap, x.min(y), x.max(y)));
                }
            }
        }
        let (x, y) = match best {
            Some((_, x, y)) => (x, y),
            None => {
                let wall = |k: usize| ring.get(k).map_or(0, |e| e.wall);
                let (a, b) = (wall(i), wall(j));
                (a.min(b), a.max(b))
            }
        };
        Collapse { wall: x, other: y }
    }

    /// The least distance between walls `x` and `y` on the plan.
    fn wall_distance(&self, x: usize, y: usize) -> f64 {
        let n = self.len();
        let ends = |w: usize| {
            let a = self.corners.get(w).copied().unwrap_or(DVec2::ZERO);
            (a, self.corners.get((w + 1) % n).copied().unwrap_or(a))
        };
        let ((a, b), (c, d)) = (ends(x), ends(y));
        if segments_meet(a, b, c, d) != Meeting::Apart {
            return 0.0;
        }
        [
            distance_to_segment(a, c, d),
            distance_to_segment(b, c, d),
            distance_to_segment(c, a, b),
            distance_to_segment(d, a, b),
        ]
        .into_iter()
        .fold(f64::INFINITY, f64::min)
    }
}

impl Outline {
    /// Refuses the first courtyard whose fascia ring collapses (see the
    /// module documentation). Needs the rings checked for crossings and
    /// placement first.
    pub(super) fn check_courtyard_eaves(&self) -> Result<(), OutlineError> {
        let allowance = self.tolerance / 2.0;
        for (c, walls) in self.courtyards.iter().enumerate() {
            if walls.iter().all(|w| w.overhang_in <= 0.0) {
                continue;
            }
            let court = Courtyard::new(
                walls.iter().map(|w| w.corner).collect(),
                walls.iter().map(|w| w.overhang_in).collect(),
            );
            let Some(mut found) = court.collapse(1.0, allowance, self.tolerance) else {
                continue;
            };
            // The largest scale of the overhangs the courtyard has room
            // for, found by halving: below `lo` the ring holds, at `hi` it
            // collapses between the walls `found` names.
            let (mut lo, mut hi) = (0.0_f64, 1.0_f64);
            if let Some(at_zero) = court.collapse(0.0, allowance, self.tolerance) {
                found = at_zero;
                hi = 0.0;
            }
            for _ in 0..SCALE_HALVINGS {
                if hi <= lo {
                    break;
                }
                let mid = (lo + hi) / 2.0;
                match court.collapse(mid, allowance, self.tolerance) {
                    Some(at_mid) => {
                        found = at_mid;
                        hi = mid;
                    }
                    None => lo = mid,
                }
            }
            let overhang = |i: usize| walls.get(i).map_or(0.0, |w| w.overhang_in);
            let overhangs_in = [overhang(found.wall), overhang(found.other)];
            let total = overhangs_in[0] + overhangs_in[1];
            return Err(OutlineError::CourtyardTooSmallForOverhangs {
                courtyard: c,
                wall: self.name_wall(c + 1, found.wall),
                other: self.name_wall(c + 1, found.other),
                shortfall: CourtyardShortfall { overhangs_in, room_in: total * hi },
            });
        }
        Ok(())
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn court(points: &[(f64, f64)], overhang_in: f64) -> Courtyard {
        let corners: Vec<DVec2> = points.iter().map(|&(x, y)| DVec2::new(x, y)).collect();
        let overhangs = vec![overhang_in; corners.len()];
        Courtyard::new(corners, overhangs)
    }

    #[test]
    fn a_square_shrinks_by_its_overhang() {
        // A 100 in square with 10 in overhangs: its fascia ring is the
        // square from 10 to 90 (arithmetic), whichever way it is given.
        for points in [
            [(0.0, 0.0), (100.0, 0.0), (100.0, 100.0), (0.0, 100.0)],
            [(0.0, 100.0), (100.0, 100.0), (100.0, 0.0), (0.0, 0.0)],
        ] {
            let ring = court(&points, 10.0).fascia_ring(1.0, 0.0);
            assert_eq!(ring.len(), 4);
            for edge in &ring {
                for p in [edge.a, edge.b] {
                    assert!((p.x - 10.0).abs() < 1e-12 || (p.x - 90.0).abs() < 1e-12, "{p}");
                    assert!((p.y - 10.0).abs() < 1e-12 || (p.y - 90.0).abs() < 1e-12, "{p}");
                }
            }
            assert_eq!(court(&points, 10.0).collapse(1.0, 0.0, 0.001), None);
            assert!(court(&points, 50.0).collapse(1.0, 0.0, 0.001).is_some());
        }
    }

    #[test]
    fn walls_in_line_with_different_overhangs_step() {
        // The bottom wall in two halves overhanging 10 and 20 in: a step
        // edge joins the two fascias at x = 50.
        let corners: Vec<DVec2> =
            [(0.0, 0.0), (50.0, 0.0), (100.0, 0.0), (100.0, 100.0), (0.0, 100.0)].map(DVec2::from).to_vec();
        let court = Courtyard::new(corners, vec![10.0, 20.0, 10.0, 10.0, 10.0]);
        let ring = court.fascia_ring(1.0, 0.0);
        let step = ring.iter().find(|e| !e.of_wall).unwrap();
        assert_eq!((step.a, step.b), (DVec2::new(50.0, 10.0), DVec2::new(50.0, 20.0)));
        assert_eq!(court.collapse(1.0, 0.0, 0.001), None);
    }
}
