//! Flat-shaded triangle lists in f64 inches, the form every drawn part
//! takes before the viewport converts it for the GPU.

use glam::DVec3;

use super::triangulate::{newell_normal, triangulate};

/// Flat-shaded triangles: three corners per triangle and one normal each.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct Triangles {
    /// Triangle corners, three per triangle, in inches.
    pub corners: Vec<DVec3>,
    /// One outward unit normal per triangle.
    pub normals: Vec<DVec3>,
}

impl Triangles {
    /// Adds the flat polygon `points` (counter-clockwise seen from the side
    /// its normal should face).
    pub fn push_polygon(&mut self, points: &[DVec3]) {
        let normal = newell_normal(points).normalize_or_zero();
        for [a, b, c] in triangulate(points) {
            self.corners.extend_from_slice(&[points[a], points[b], points[c]]);
            self.normals.push(normal);
        }
    }

    /// Adds the flat convex polygon `points` moved by `offset`, as a fan
    /// from its first corner, wound counter-clockwise seen from the side
    /// `outward` points to (whichever way round `points` run), so the view
    /// can leave out the far faces of a closed solid. A face of a convex
    /// solid needs no ear clipping, and a fan costs nothing to find.
    pub fn push_convex_polygon(&mut self, points: &[DVec3], outward: DVec3, offset: DVec3) {
        let normal = newell_normal(points).normalize_or_zero();
        if normal == DVec3::ZERO {
            return;
        }
        let flip = normal.dot(outward) < 0.0;
        let normal = if flip { -normal } else { normal };
        let Some((&first, rest)) = points.split_first() else { return };
        for pair in rest.windows(2) {
            let (b, c) = if flip { (pair[1], pair[0]) } else { (pair[0], pair[1]) };
            self.corners.extend_from_slice(&[first + offset, b + offset, c + offset]);
            self.normals.push(normal);
        }
    }

    /// Adds a square bar of `width` along `from..to`.
    pub fn push_bar(&mut self, from: DVec3, to: DVec3, width: f64) {
        let along = (to - from).normalize_or_zero();
        if along == DVec3::ZERO {
            return;
        }
        let side = along.cross(DVec3::Z).try_normalize().unwrap_or(DVec3::X) * (width / 2.0);
        let up = side.cross(along).normalize_or_zero() * (width / 2.0);
        let corners = [side + up, -side + up, -side - up, side - up];
        for k in 0..4 {
            let (p, q) = (corners[k], corners[(k + 1) % 4]);
            self.push_quad(from + q, from + p, to + p, to + q);
        }
    }

    /// Adds the planar quad `a b c d` (counter-clockwise seen from outside).
    pub fn push_quad(&mut self, a: DVec3, b: DVec3, c: DVec3, d: DVec3) {
        let normal = (b - a).cross(d - a).normalize_or_zero();
        self.corners.extend_from_slice(&[a, b, c, a, c, d]);
        self.normals.extend_from_slice(&[normal, normal]);
    }

    /// The box round every corner, `None` when there are none.
    pub fn bounds(&self) -> Option<(DVec3, DVec3)> {
        let mut corners = self.corners.iter().copied();
        let first = corners.next()?;
        Some(corners.fold((first, first), |(min, max), p| (min.min(p), max.max(p))))
    }

    /// Number of triangles.
    pub fn len(&self) -> usize {
        self.normals.len()
    }
}

#[cfg(test)]
mod convex_tests {
    use super::*;

    #[test]
    fn a_convex_face_makes_the_same_area_as_ear_clipping() {
        // A regular hexagon tilted out of level, seen from +Z.
        let points: Vec<DVec3> = (0..6)
            .map(|k| {
                let angle = f64::from(k) * std::f64::consts::PI / 3.0;
                DVec3::new(angle.cos(), angle.sin(), 0.3 * angle.cos())
            })
            .collect();
        let area = |t: &Triangles| -> f64 {
            t.corners.chunks_exact(3).map(|c| (c[1] - c[0]).cross(c[2] - c[0]).length() / 2.0).sum()
        };
        let mut fan = Triangles::default();
        fan.push_convex_polygon(&points, DVec3::Z, DVec3::ZERO);
        let mut clipped = Triangles::default();
        clipped.push_polygon(&points);
        assert_eq!(fan.len(), 4);
        // Derivation: both cover the same hexagon, so the areas agree.
        assert!((area(&fan) - area(&clipped)).abs() < 1e-12);
        assert!((fan.normals[0] - clipped.normals[0]).length() < 1e-12);
    }

    #[test]
    fn a_face_given_clockwise_is_wound_counter_clockwise_seen_from_outside() {
        // A unit square in the level plane, corners clockwise seen from +Z.
        let square = [DVec3::ZERO, DVec3::Y, DVec3::new(1.0, 1.0, 0.0), DVec3::X];
        let mut fan = Triangles::default();
        fan.push_convex_polygon(&square, DVec3::Z, DVec3::ZERO);
        assert_eq!(fan.len(), 2);
        // Derivation: a triangle is counter-clockwise seen from +Z when
        // (b - a) x (c - a) points up; its normal then points up as well.
        for (corners, normal) in fan.corners.chunks_exact(3).zip(&fan.normals) {
            assert!((corners[1] - corners[0]).cross(corners[2] - corners[0]).z > 0.0);
            assert_eq!(*normal, DVec3::Z);
        }
    }
}
