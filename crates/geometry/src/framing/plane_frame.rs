//! A roof plane seen from its wall: wall line, up-slope direction, polygon.

use glam::{DVec2, DVec3};

use super::{CutEnd, FaceTag, FramingError, HalfSpace};
use crate::{Outline, RoofPlane, WallRoof};

/// Plan tolerance (inches) for matching points of the solved roof.
pub const PLAN_TOL_IN: f64 = 1e-6;

/// A roof plane with its wall's frame worked out.
#[derive(Debug, Clone, PartialEq)]
pub struct PlaneFrame {
    /// Global wall index.
    pub wall: usize,
    /// The wall line's first corner.
    pub start: DVec2,
    /// The wall line's second corner.
    pub end: DVec2,
    /// Unit direction along the wall, start to end.
    pub along: DVec2,
    /// Unit direction square to the wall, into the building (up the slope).
    pub inward: DVec2,
    /// Rise per unit run.
    pub slope: f64,
    /// Horizontal overhang beyond the wall line.
    pub overhang_in: f64,
    /// The plane's plan polygon at the wall line, counter-clockwise.
    pub polygon: Vec<DVec2>,
    /// The lowest wall whose roof plane is this same plane (in line, same
    /// pitch); `wall` when no other wall shares it.
    pub plane_group: usize,
}

impl PlaneFrame {
    /// Works out a plane's frame from the solved plane and its wall.
    pub fn new(plane: &RoofPlane, outline: &Outline) -> Result<Self, FramingError> {
        let wall_index = plane.wall;
        let wall =
            outline.wall_data(wall_index).ok_or(FramingError::PlaneWallMissing { wall: wall_index })?;
        if !(plane.rise_per_run > 0.0 && plane.rise_per_run.is_finite()) {
            return Err(FramingError::PlaneNotRising { wall: wall_index, rise_per_run: plane.rise_per_run });
        }
        if let WallRoof::Gable = wall.roof {
            return Err(FramingError::PlaneOutlineMalformed { wall: wall_index });
        }
        let malformed = FramingError::PlaneOutlineMalformed { wall: wall_index };
        let (Some(a), Some(b)) = (plane.outline.first(), plane.outline.get(1)) else {
            return Err(malformed);
        };
        if a.z.abs() > 1e-6 || b.z.abs() > 1e-6 || plane.outline.len() < 3 {
            return Err(malformed);
        }
        let start = a.truncate();
        let end = b.truncate();
        let along = (end - start).try_normalize().ok_or(malformed.clone())?;
        let inward = along.perp();
        let polygon: Vec<DVec2> = plane.outline.iter().map(|p| p.truncate()).collect();
        let frame = Self {
            wall: wall_index,
            start,
            end,
            along,
            inward,
            slope: plane.rise_per_run,
            overhang_in: wall.overhang_in.max(0.0),
            polygon,
            plane_group: plane.plane_group,
        };
        // Every corner must sit on the plane the wall line and pitch make.
        let consistent =
            plane.outline.iter().all(|p| (frame.height(p.truncate()) - p.z).abs() < 1e-4 * (1.0 + p.z.abs()));
        if !consistent {
            return Err(malformed);
        }
        Ok(frame)
    }

    /// Plan distance of `p` inside the wall line (negative outside).
    pub fn dist_in(&self, p: DVec2) -> f64 {
        (p - self.start).dot(self.inward)
    }

    /// The plane's theoretical height at plan point `p`.
    pub fn height(&self, p: DVec2) -> f64 {
        self.slope * self.dist_in(p)
    }

    /// The half-space below the rafters' top plane, raised `heel_in` above
    /// the theoretical plane.
    pub fn below_top(&self, heel_in: f64, tag: FaceTag, end: Option<CutEnd>) -> Option<HalfSpace> {
        let point = self.start.extend(heel_in);
        let normal = DVec3::new(-self.slope * self.inward.x, -self.slope * self.inward.y, 1.0);
        HalfSpace::through(point, normal, tag, end)
    }

    /// The vertical half-space inside (`inside` true) or outside a line
    /// parallel to the wall, `offset_out_in` outside the wall line.
    pub fn wall_side(
        &self,
        offset_out_in: f64,
        inside: bool,
        tag: FaceTag,
        end: Option<CutEnd>,
    ) -> Option<HalfSpace> {
        let point = (self.start - self.inward * offset_out_in).extend(0.0);
        let out = (-self.inward).extend(0.0);
        HalfSpace::through(point, if inside { out } else { -out }, tag, end)
    }

    /// Whether plan point `p` lies inside the plane's polygon (boundary
    /// points count as inside).
    pub fn contains(&self, p: DVec2) -> bool {
        point_in_polygon(p, &self.polygon)
    }

    /// Whether `p` is one of the polygon's corners.
    pub fn has_corner(&self, p: DVec2) -> bool {
        self.polygon.iter().any(|c| c.distance(p) < PLAN_TOL_IN * 1e3)
    }
}

/// Even-odd point-in-polygon test, with points on an edge counted inside.
pub fn point_in_polygon(p: DVec2, polygon: &[DVec2]) -> bool {
    let n = polygon.len();
    let mut inside = false;
    for i in 0..n {
        let a = polygon[i];
        let b = polygon[(i + 1) % n];
        if distance_to_segment(p, a, b) < PLAN_TOL_IN {
            return true;
        }
        if (a.y > p.y) != (b.y > p.y) {
            let x = a.x + (p.y - a.y) * (b.x - a.x) / (b.y - a.y);
            if p.x < x {
                inside = !inside;
            }
        }
    }
    inside
}

/// Plan distance from `p` to the segment `a`-`b`.
pub fn distance_to_segment(p: DVec2, a: DVec2, b: DVec2) -> f64 {
    let ab = b - a;
    let len2 = ab.length_squared();
    if len2 == 0.0 {
        return p.distance(a);
    }
    let t = ((p - a).dot(ab) / len2).clamp(0.0, 1.0);
    p.distance(a + ab * t)
}
