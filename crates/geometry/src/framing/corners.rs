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
//! last ruled a point out is tried first.
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
    for (i, a) in planes.iter().enumerate() {
        for (j, b) in planes.iter().enumerate().skip(i + 1) {
            let ab = cross(i, j);
            // Every triple with a and b has |det| <= |a x b| |c| (up to
            // round-off near 1e-16), below PARALLEL_DET: none meets.
            if ab.length() * longest_normal < PARALLEL_DET * 0.1 {
                continue;
            }
            for (k, c) in planes.iter().enumerate().skip(j + 1) {
                let bc = cross(j, k);
                let det = a.normal.dot(bc);
                if det.abs() < PARALLEL_DET {
                    continue;
                }
                let p = (bc * a.offset + cross(k, i) * b.offset + ab * c.offset) / det;
                if !p.is_finite() {
                    continue;
                }
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
