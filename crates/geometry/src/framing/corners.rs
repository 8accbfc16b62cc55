//! The corners of an intersection of half-spaces.
//!
//! A corner is the point where three of the planes meet that lies inside
//! every plane (within [`CORNER_TOL_IN`]); points closer than
//! [`SAME_CORNER_IN`] are one corner, the first found in the order of the
//! plane triples (`i < j < k`, lexicographic). A member's part has 6 to
//! 14 planes (mostly 8 or 9), so there are at most a few hundred triples; each is made cheap
//! rather than avoided: the cross products of every pair of normals are
//! worked out once (each triple's point is then three scaled sums), a pair
//! of parallel planes skips its whole row of triples, and the plane that
//! last ruled a point out is tried first. The parts of one piece share most
//! of their planes ([`corners_of_parts`]): each shared triple is worked out
//! and tested against the shared planes once for all of them.
//!
//! Clipping a large box by each plane in turn was tried as well: it
//! finds where the corners lie, and trying only the triples of planes
//! that pass near a clipped corner gives these same points to the bit,
//! but at 8 to 14 planes its edge bookkeeping cost more (about 19,000
//! instructions a part against about 14,000 here).

use glam::DVec3;

use super::HalfSpace;
use super::solid::ON_PLANE_IN;

/// A point within this (inches) outside a plane still counts as inside it.
pub const CORNER_TOL_IN: f64 = ON_PLANE_IN * 10.0;

/// Corners closer than this (inches) are the same corner.
const SAME_CORNER_IN: f64 = 1e-6;

/// Plane triples whose normals' triple product is below this meet in no
/// single point.
const PARALLEL_DET: f64 = 1e-12;

/// The corners of the intersection of `planes`, in triple order.
pub fn corners(planes: &[HalfSpace]) -> Vec<DVec3> {
    let n = planes.len();
    // A member's part has 8 to 16 corners.
    let mut vertices: Vec<DVec3> = Vec::with_capacity(16);
    // crosses[x * n + y] is normal x cross normal y, computed exactly as
    // `three_plane_point` computes it, so the points are the same to the bit.
    let mut crosses: Vec<DVec3> = Vec::with_capacity(n * n);
    for a in planes {
        crosses.extend(planes.iter().map(|b| a.normal.cross(b.normal)));
    }
    let cross = |x: usize, y: usize| crosses.get(x * n + y).copied().unwrap_or(DVec3::ZERO);
    let longest_normal = planes.iter().map(|h| h.normal.length()).fold(0.0, f64::max);
    let mut last_out = 0;
    for i in 0..n {
        for j in i + 1..n {
            let ab = cross(i, j);
            // Every triple with a and b has |det| <= |a x b| |c| (up to
            // round-off near 1e-16), below PARALLEL_DET: none meets.
            if ab.length() * longest_normal < PARALLEL_DET * 0.1 {
                continue;
            }
            for k in j + 1..n {
                let Some(p) = triple_point(planes, i, j, k, cross) else { continue };
                // NaN counts as outside, as a failed comparison.
                let inside = |h: &HalfSpace| h.distance(p) <= CORNER_TOL_IN;
                if planes.get(last_out).is_some_and(|h| !inside(h)) {
                    continue;
                }
                if let Some(out) = planes.iter().position(|h| !inside(h)) {
                    last_out = out;
                    continue;
                }
                if !vertices.iter().any(|v| v.distance_squared(p) < SAME_CORNER_IN * SAME_CORNER_IN) {
                    vertices.push(p);
                }
            }
        }
    }
    vertices
}

/// The point where planes `i < j < k` meet, if they meet in one finite
/// point, worked out as [`corners`] does; `cross(x, y)` is normal x cross
/// normal y.
fn triple_point(
    planes: &[HalfSpace],
    i: usize,
    j: usize,
    k: usize,
    cross: impl Fn(usize, usize) -> DVec3,
) -> Option<DVec3> {
    let (a, b, c) = (planes.get(i)?, planes.get(j)?, planes.get(k)?);
    let bc = cross(j, k);
    let det = a.normal.dot(bc);
    if det.abs() < PARALLEL_DET {
        return None;
    }
    let p = (bc * a.offset + cross(k, i) * b.offset + cross(i, j) * c.offset) / det;
    p.is_finite().then_some(p)
}

/// The corners of several parts cut by mostly the same planes: part `p`
/// is the intersection of `common` and `extras[p]`, and gets exactly what
/// [`corners`] gives for `common` followed by `extras[p]`. The corners are
/// pushed onto `out`, one list per part in order.
///
/// The parts of one piece share its board's faces and end cuts and differ
/// in two or three planes at the seat. Each triple of planes any part has
/// is worked out once, and tested once against the common planes: the
/// extra planes of every part are put in one list that keeps each part's
/// order, so a part's triples, in its own order, are the shared list's
/// triples it has, in the shared order. A part whose extra planes cannot
/// keep their order in that list is searched on its own.
pub fn corners_of_parts(
    common: &[HalfSpace],
    extras: &[&[HalfSpace]],
    scratch: &mut PartsScratch,
    out: &mut Vec<Vec<DVec3>>,
) {
    let PartsScratch { shared_extras, planes, has, bit_of, crosses, candidates } = scratch;
    // The extra planes, distinct to the bit, in an order every part keeps
    // where it can: a plane new to the list goes right after the part's
    // plane before it.
    shared_extras.clear();
    for part in extras {
        let mut after: Option<usize> = None;
        for h in *part {
            let at = match shared_extras.iter().position(|e| same_plane(e, h)) {
                Some(at) => at,
                None => {
                    let at = after.map_or(0, |a| a + 1);
                    shared_extras.insert(at, *h);
                    at
                }
            };
            after = Some(at);
        }
    }
    planes.clear();
    planes.extend(common.iter().chain(shared_extras.iter()).copied());
    let n = planes.len();
    // Which parts have each plane, as bits; a part gets a bit when its
    // planes are in increasing order in the shared list, else it is
    // searched alone.
    has.clear();
    has.resize(n, 0);
    bit_of.clear();
    let mut bits = 0u32;
    for part in extras {
        let mut last = common.len().checked_sub(1);
        let mut in_order = bits < 64;
        for h in *part {
            let at = shared_extras.iter().position(|e| same_plane(e, h)).map(|e| e + common.len());
            match at {
                Some(at) if last.is_none_or(|l| at > l) => last = Some(at),
                _ => in_order = false,
            }
        }
        if !in_order {
            bit_of.push(None);
            continue;
        }
        bit_of.push(Some(bits));
        for h in has.iter_mut().take(common.len()) {
            *h |= 1 << bits;
        }
        for e in *part {
            let at = shared_extras.iter().position(|x| same_plane(x, e)).map(|e| e + common.len());
            if let Some(h) = at.and_then(|at| has.get_mut(at)) {
                *h |= 1 << bits;
            }
        }
        bits += 1;
    }
    crosses.clear();
    for a in planes.iter() {
        crosses.extend(planes.iter().map(|b| a.normal.cross(b.normal)));
    }
    let cross = |x: usize, y: usize| crosses.get(x * n + y).copied().unwrap_or(DVec3::ZERO);
    // Every triple some part has whose point lies inside the common planes,
    // in triple order, with the parts that have it.
    candidates.clear();
    let longest_normal = planes.iter().map(|h| h.normal.length()).fold(0.0, f64::max);
    let mut last_out = 0;
    for (i, a) in planes.iter().enumerate() {
        let with_a = has.get(i).copied().unwrap_or(0);
        for (j, b) in planes.iter().enumerate().skip(i + 1) {
            let with_ab = with_a & has.get(j).copied().unwrap_or(0);
            if with_ab == 0 {
                continue;
            }
            let ab = a.normal.cross(b.normal);
            // As in `corners`: no triple of this row meets.
            if ab.length() * longest_normal < PARALLEL_DET * 0.1 {
                continue;
            }
            for k in j + 1..n {
                let with_abc = with_ab & has.get(k).copied().unwrap_or(0);
                if with_abc == 0 {
                    continue;
                }
                let Some(p) = triple_point(planes, i, j, k, cross) else { continue };
                let inside = |h: &HalfSpace| h.distance(p) <= CORNER_TOL_IN;
                if common.get(last_out).is_some_and(|h| !inside(h)) {
                    continue;
                }
                if let Some(out) = common.iter().position(|h| !inside(h)) {
                    last_out = out;
                    continue;
                }
                candidates.push((p, with_abc));
            }
        }
    }
    for (part, bit) in extras.iter().zip(bit_of.iter()) {
        let Some(bit) = *bit else {
            out.push(corners(&with_common(common, part)));
            continue;
        };
        let mut vertices: Vec<DVec3> = Vec::with_capacity(16);
        for &(p, parts) in candidates.iter() {
            // NaN counts as outside, as a failed comparison.
            let inside = |h: &HalfSpace| h.distance(p) <= CORNER_TOL_IN;
            if parts & (1 << bit) == 0 || part.iter().any(|h| !inside(h)) {
                continue;
            }
            if !vertices.iter().any(|v| v.distance_squared(p) < SAME_CORNER_IN * SAME_CORNER_IN) {
                vertices.push(p);
            }
        }
        out.push(vertices);
    }
}

/// Buffers [`corners_of_parts`] reuses from one piece to the next.
#[derive(Debug, Default)]
pub struct PartsScratch {
    /// The parts' extra planes, distinct, in the shared order.
    shared_extras: Vec<HalfSpace>,
    /// The common planes, then those.
    planes: Vec<HalfSpace>,
    /// Which parts have each plane, as bits.
    has: Vec<u64>,
    /// Each part's bit, or none for a part searched alone.
    bit_of: Vec<Option<u32>>,
    /// Normal x cross normal y, at x * planes + y.
    crosses: Vec<DVec3>,
    /// The triples' points inside the common planes, with the parts that
    /// have the triple.
    candidates: Vec<(DVec3, u64)>,
}

/// `common` followed by `extra`.
fn with_common(common: &[HalfSpace], extra: &[HalfSpace]) -> Vec<HalfSpace> {
    common.iter().chain(extra).copied().collect()
}

/// Whether two planes are the same plane to the bit (their tags aside).
fn same_plane(a: &HalfSpace, b: &HalfSpace) -> bool {
    a.offset.to_bits() == b.offset.to_bits()
        && a.normal.to_array().map(f64::to_bits) == b.normal.to_array().map(f64::to_bits)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::framing::FaceTag;

    /// Every triple tried the plain way: the definition the fast search
    /// must match to the bit.
    fn corners_by_every_triple(planes: &[HalfSpace]) -> Vec<DVec3> {
        let mut vertices: Vec<DVec3> = Vec::new();
        let n = planes.len();
        for i in 0..n {
            for j in i + 1..n {
                for k in j + 1..n {
                    let (a, b, c) = (&planes[i], &planes[j], &planes[k]);
                    let bc = b.normal.cross(c.normal);
                    let det = a.normal.dot(bc);
                    if det.abs() < PARALLEL_DET {
                        continue;
                    }
                    let p = (bc * a.offset
                        + c.normal.cross(a.normal) * b.offset
                        + a.normal.cross(b.normal) * c.offset)
                        / det;
                    if !p.is_finite() || !planes.iter().all(|h| h.distance(p) <= CORNER_TOL_IN) {
                        continue;
                    }
                    if !vertices.iter().any(|v| v.distance_squared(p) < 1e-12) {
                        vertices.push(p);
                    }
                }
            }
        }
        vertices
    }

    fn plane(point: DVec3, normal: DVec3) -> HalfSpace {
        HalfSpace::through(point, normal, FaceTag::Cheek, None).unwrap()
    }

    /// A small fixed generator, so every run draws the same cases.
    struct Lcg(u64);

    impl Lcg {
        fn unit(&mut self) -> f64 {
            self.0 = self.0.wrapping_mul(6364136223846793005).wrapping_add(1442695040888963407);
            (self.0 >> 11) as f64 / (1u64 << 53) as f64
        }
        fn range(&mut self, lo: f64, hi: f64) -> f64 {
            lo + (hi - lo) * self.unit()
        }
    }

    /// A sloped 2x8 board 300 in long cut by a few random planes, some
    /// through a corner of the board or flush with its top, as cuts often
    /// are.
    fn cut_board(rng: &mut Lcg) -> Vec<HalfSpace> {
        let along = DVec3::new(2.0, 1.0, 1.0).normalize();
        let side = DVec3::new(-1.0, 2.0, 0.0).normalize();
        let up = along.cross(side);
        let o = DVec3::new(rng.range(-3e3, 3e3), rng.range(-3e3, 3e3), rng.range(0.0, 200.0));
        let mut planes = vec![
            plane(o + along * 300.0, along),
            plane(o, -along),
            plane(o, up),
            plane(o - up * 7.25, -up),
            plane(o + side * 0.75, side),
            plane(o - side * 0.75, -side),
        ];
        for _ in 0..(rng.unit() * 8.0) as usize {
            let normal = DVec3::new(rng.range(-1.0, 1.0), rng.range(-1.0, 1.0), rng.range(-1.0, 1.0));
            let through = match (rng.unit() * 3.0) as u32 {
                0 => {
                    o + along * rng.range(0.0, 300.0) + side * 0.75 * rng.range(-1.0, 1.0).signum()
                        - up * if rng.unit() < 0.5 { 0.0 } else { 7.25 }
                }
                1 => o + along * rng.range(0.0, 300.0) - up * rng.range(0.0, 7.25),
                _ => {
                    planes.push(plane(o + along * rng.range(0.0, 300.0), up));
                    continue;
                }
            };
            planes.push(plane(through, normal));
        }
        planes
    }

    #[test]
    fn the_fast_search_finds_every_triples_corners_to_the_bit() {
        let mut rng = Lcg(20261201);
        for case in 0..3000 {
            let planes = cut_board(&mut rng);
            let expected = corners_by_every_triple(&planes);
            let found = corners(&planes);
            let bits = |v: &[DVec3]| v.iter().map(|p| p.to_array().map(f64::to_bits)).collect::<Vec<_>>();
            assert_eq!(bits(&found), bits(&expected), "case {case}: {planes:?}");
        }
    }

    #[test]
    fn parts_sharing_planes_get_each_parts_own_corners_to_the_bit() {
        let mut rng = Lcg(20261202);
        let bits = |v: &[DVec3]| v.iter().map(|p| p.to_array().map(f64::to_bits)).collect::<Vec<_>>();
        for case in 0..1000 {
            let common = cut_board(&mut rng);
            // A pool of seat-like planes, some level through the board, some
            // square to it, one the very same as a board face, and the
            // reverse of some of them (as inside and outside a wall are).
            let along = common[0].normal;
            let mut pool: Vec<HalfSpace> = Vec::new();
            for _ in 0..4 {
                let through = common[1].normal * -common[1].offset + along * rng.range(0.0, 300.0);
                let normal = match (rng.unit() * 3.0) as u32 {
                    0 => DVec3::Z,
                    1 => along,
                    _ => DVec3::new(rng.range(-1.0, 1.0), rng.range(-1.0, 1.0), rng.range(-1.0, 1.0)),
                };
                let h = plane(through, normal);
                pool.push(h);
                pool.push(HalfSpace { normal: -h.normal, offset: -h.offset, ..h });
            }
            pool.push(common[2]);
            let parts: Vec<Vec<HalfSpace>> = (0..1 + (rng.unit() * 5.0) as usize)
                .map(|_| {
                    (0..(rng.unit() * 4.0) as usize)
                        .filter_map(|_| pool.get((rng.unit() * pool.len() as f64) as usize).copied())
                        .collect()
                })
                .collect();
            let extras: Vec<&[HalfSpace]> = parts.iter().map(Vec::as_slice).collect();
            let mut found = Vec::new();
            corners_of_parts(&common, &extras, &mut PartsScratch::default(), &mut found);
            assert_eq!(found.len(), parts.len());
            for (part, got) in parts.iter().zip(&found) {
                let planes: Vec<HalfSpace> = common.iter().chain(part).copied().collect();
                assert_eq!(bits(got), bits(&corners(&planes)), "case {case}: {planes:?}");
            }
        }
    }

    #[test]
    fn a_cube_has_eight_corners() {
        let mut planes = Vec::new();
        for axis in [DVec3::X, DVec3::Y, DVec3::Z] {
            planes.push(plane(axis, axis));
            planes.push(plane(DVec3::ZERO, -axis));
        }
        // Derivation: a cube has 8 corners.
        assert_eq!(corners(&planes).len(), 8);
    }
}
