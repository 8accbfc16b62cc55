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
