//! Member solids: unions of convex polyhedra cut from a board by planes.

use glam::DVec3;
use serde::Serialize;

use super::corners::corners;

/// Points closer than this (inches) to a plane count as on it. Members are
/// at most a few hundred inches long, so this is far below any cut tolerance
/// and far above f64 round-off at that size.
pub const ON_PLANE_IN: f64 = 1e-7;

/// Faces smaller than this (square inches) are edge-on touches, not faces.
const MIN_FACE_AREA_SQ_IN: f64 = 1e-9;

/// Which end or place of a member a cut belongs to.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum CutEnd {
    /// The upper end of a sloped member.
    Top,
    /// The lower end of a sloped member that has no seat (valley jacks,
    /// cripples).
    Bottom,
    /// The birdsmouth where the member sits on the wall plate.
    Seat,
    /// The tail end at the fascia.
    Tail,
    /// The start end of a level member (ridge).
    Start,
    /// The far end of a level member (ridge).
    End,
    /// Along the whole length (backing).
    FullLength,
}

/// What made a face of a member's solid.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum FaceTag {
    /// A plumb cut square across the board.
    Plumb,
    /// A level seat cut of a birdsmouth.
    Seat,
    /// The plumb heel cut of a birdsmouth, on the wall line.
    Heel,
    /// A cheek (side) cut against a hip, valley or king common.
    Cheek,
    /// The tail cut at the fascia.
    Tail,
    /// A level soffit cut under the tail.
    Soffit,
    /// A hip's top bevelled into a roof plane.
    Backing,
    /// One of the board's wide faces.
    Side,
    /// The board's top edge.
    Top,
    /// The board's bottom edge.
    Bottom,
    /// A square end of a level member.
    End,
    /// The boundary between two convex parts of one member: not a cut.
    Interior,
}

/// One bounding plane: points `p` with `normal . p <= offset` are kept.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct HalfSpace {
    /// Unit outward normal of the face this plane makes.
    pub normal: DVec3,
    /// Plane offset along the normal, in inches.
    pub offset: f64,
    /// What the face is.
    pub tag: FaceTag,
    /// Which end of the member the face belongs to, for cuts.
    pub end: Option<CutEnd>,
}

impl HalfSpace {
    /// The half-space bounded by the plane through `point` with outward
    /// `normal` (normalised here; `None` for a zero normal).
    pub fn through(point: DVec3, normal: DVec3, tag: FaceTag, end: Option<CutEnd>) -> Option<Self> {
        let normal = normal.try_normalize()?;
        Some(Self { normal, offset: normal.dot(point), tag, end })
    }

    /// Signed distance of `p` outside the plane (negative inside).
    pub fn distance(&self, p: DVec3) -> f64 {
        self.normal.dot(p) - self.offset
    }
}

/// A planar face of a convex part, counter-clockwise seen from outside.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Face {
    /// The face's corners in order.
    pub vertices: Vec<DVec3>,
    /// Unit outward normal.
    pub normal: DVec3,
    /// What made the face.
    pub tag: FaceTag,
    /// The cut end the face belongs to, if it is a cut.
    pub end: Option<CutEnd>,
}

impl Face {
    /// The face's area in square inches.
    pub fn area(&self) -> f64 {
        polygon_area(&self.vertices, self.normal)
    }
}

/// A convex polyhedron: the intersection of its half-spaces.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ConvexPart {
    /// The polyhedron's corners.
    pub vertices: Vec<DVec3>,
    /// Its faces.
    pub faces: Vec<Face>,
    /// The planes it was cut by (kept to test points against it).
    #[serde(skip)]
    pub planes: Vec<HalfSpace>,
}

impl ConvexPart {
    /// Intersects the half-spaces; `None` when the result has no volume or
    /// is unbounded (no corners on some side).
    pub fn from_half_spaces(planes: &[HalfSpace]) -> Option<Self> {
        Self::from_corners(planes, corners(planes), &mut FaceScratch::default())
    }

    /// As [`ConvexPart::from_half_spaces`], given the corners of `planes`
    /// and scratch buffers to reuse.
    pub(crate) fn from_corners(
        planes: &[HalfSpace],
        vertices: Vec<DVec3>,
        scratch: &mut FaceScratch,
    ) -> Option<Self> {
        if vertices.len() < 4 {
            return None;
        }
        let mut faces: Vec<Face> = Vec::with_capacity(planes.len());
        let mut kept = Vec::with_capacity(planes.len());
        let FaceScratch { on, keyed, ordered } = scratch;
        for plane in planes {
            on.clear();
            on.extend(vertices.iter().copied().filter(|v| plane.distance(*v).abs() <= ON_PLANE_IN * 10.0));
            if on.len() < 3 {
                continue;
            }
            order_around(on, plane.normal, keyed, ordered);
            if polygon_area(ordered, plane.normal) < MIN_FACE_AREA_SQ_IN {
                continue;
            }
            // Two planes may coincide (a cut flush with a box face); keep
            // the first and let the cut's tag win by putting cuts first.
            if faces.iter().any(|f: &Face| {
                f.normal.dot(plane.normal) > 1.0 - 1e-12
                    && f.vertices
                        .first()
                        .is_some_and(|v| (f.normal.dot(*v) - plane.offset).abs() < ON_PLANE_IN * 10.0)
            }) {
                continue;
            }
            faces.push(Face {
                vertices: ordered.clone(),
                normal: plane.normal,
                tag: plane.tag,
                end: plane.end,
            });
            kept.push(*plane);
        }
        if faces.len() < 4 {
            return None;
        }
        Some(Self { vertices, faces, planes: kept })
    }

    /// Signed depth of `p` inside the part: positive inside, the distance
    /// to the nearest face; negative outside.
    pub fn depth_of(&self, p: DVec3) -> f64 {
        self.planes.iter().map(|h| -h.distance(p)).fold(f64::INFINITY, f64::min)
    }

    /// The part's volume in cubic inches.
    pub fn volume(&self) -> f64 {
        let Some(origin) = self.vertices.first().copied() else {
            return 0.0;
        };
        self.faces
            .iter()
            .map(|f| polygon_area(&f.vertices, f.normal) * f.normal.dot(f.vertices[0] - origin) / 3.0)
            .sum()
    }
}

/// Buffers reused while building the faces of many parts: only the faces
/// kept allocate.
#[derive(Debug, Default)]
pub(crate) struct FaceScratch {
    /// The corners on one plane.
    on: Vec<DVec3>,
    /// Those corners with their sort keys.
    keyed: Vec<(f64, DVec3)>,
    /// Those corners in order round the face.
    ordered: Vec<DVec3>,
}

/// A member's solid: a union of convex parts meeting face to face.
#[derive(Debug, Clone, PartialEq, Serialize, Default)]
pub struct Solid {
    /// The convex parts.
    pub parts: Vec<ConvexPart>,
}

impl Solid {
    /// Every non-interior face of every part.
    pub fn faces(&self) -> impl Iterator<Item = &Face> {
        self.parts.iter().flat_map(|p| p.faces.iter()).filter(|f| f.tag != FaceTag::Interior)
    }

    /// Every corner of every part.
    pub fn vertices(&self) -> impl Iterator<Item = DVec3> + '_ {
        self.parts.iter().flat_map(|p| p.vertices.iter().copied())
    }

    /// Total volume in cubic inches.
    pub fn volume(&self) -> f64 {
        self.parts.iter().map(ConvexPart::volume).sum()
    }

    /// How deep `p` lies inside the solid (largest over the parts).
    pub fn depth_of(&self, p: DVec3) -> f64 {
        self.parts.iter().map(|part| part.depth_of(p)).fold(f64::NEG_INFINITY, f64::max)
    }

    /// Whether this solid and `other` share wood deeper than `tol`: a
    /// corner of either inside the other, or an edge of either passing
    /// through the other with no corner inside (a board's end run through
    /// the side of another at a slant).
    ///
    /// Two convex polyhedra sharing volume have a corner of one inside the
    /// other or an edge of one crossing the other, so between them the
    /// corners and edges of both find every overlap. Only parts whose boxes
    /// overlap are compared.
    pub fn runs_into(&self, other: &Solid, tol: f64) -> bool {
        let (mine, theirs) = (super::joints::part_bounds(self), super::joints::part_bounds(other));
        self.parts.iter().zip(&mine).any(|(a, (alo, ahi))| {
            other.parts.iter().zip(&theirs).any(|(b, (blo, bhi))| {
                let apart = (*alo + tol).cmpgt(*bhi).any() || (*blo + tol).cmpgt(*ahi).any();
                !apart && a.meets(b, tol)
            })
        })
    }
}

impl ConvexPart {
    /// Whether this part and `other` share a point deeper than `depth`
    /// inside both: a corner of either, or a point of an edge of either.
    fn meets(&self, other: &ConvexPart, depth: f64) -> bool {
        let corner_in = |a: &ConvexPart, b: &ConvexPart| a.vertices.iter().any(|&v| b.depth_of(v) > depth);
        let edge_in = |a: &ConvexPart, b: &ConvexPart| a.edges().any(|(p, q)| b.segment_reaches(p, q, depth));
        corner_in(self, other) || corner_in(other, self) || edge_in(self, other) || edge_in(other, self)
    }

    /// The part's edges, each once per face it bounds (twice in all).
    pub fn edges(&self) -> impl Iterator<Item = (DVec3, DVec3)> + '_ {
        self.faces.iter().flat_map(|f| {
            let n = f.vertices.len();
            (0..n).map(move |i| (f.vertices[i], f.vertices[(i + 1) % n]))
        })
    }

    /// Whether some point of segment `p`-`q` lies deeper than `depth`
    /// inside the part: whether the segment, clipped to the part's planes
    /// each moved `depth` inward, keeps some length.
    pub fn segment_reaches(&self, p: DVec3, q: DVec3, depth: f64) -> bool {
        let u = q - p;
        let (mut lo, mut hi) = (0.0_f64, 1.0_f64);
        for h in &self.planes {
            let nu = h.normal.dot(u);
            let room = h.offset - h.normal.dot(p) - depth;
            if nu.abs() < 1e-15 {
                if room <= 0.0 {
                    return false;
                }
            } else if nu > 0.0 {
                hi = hi.min(room / nu);
            } else {
                lo = lo.max(room / nu);
            }
            if lo >= hi {
                return false;
            }
        }
        true
    }
}

/// Orders coplanar points of a convex polygon counter-clockwise about
/// `normal` into `ordered`, using `keyed` as scratch.
fn order_around(points: &[DVec3], normal: DVec3, keyed: &mut Vec<(f64, DVec3)>, ordered: &mut Vec<DVec3>) {
    let centre = points.iter().copied().sum::<DVec3>() / points.len() as f64;
    let u = normal.any_orthonormal_vector();
    let w = normal.cross(u);
    keyed.clear();
    keyed.extend(points.iter().map(|p| {
        let d = *p - centre;
        (turn_key(d.dot(u), d.dot(w)), *p)
    }));
    // A face has a handful of corners: an insertion sort, stable like
    // `sort_by` and so giving the same order, without its scratch buffer.
    for i in 1..keyed.len() {
        let mut j = i;
        while j > 0 && keyed[j - 1].0.total_cmp(&keyed[j].0).is_gt() {
            keyed.swap(j - 1, j);
            j -= 1;
        }
    }
    ordered.clear();
    ordered.extend(keyed.iter().map(|(_, p)| *p));
}

/// A key that sorts directions `(x, y)` as `y.atan2(x)` does (from just
/// past -pi round to pi) without the arctangent: the "diamond angle" of
/// the opposite direction, 0 to 4, which grows with the angle.
fn turn_key(x: f64, y: f64) -> f64 {
    // On the -x axis atan2 gives +pi (the very last) for a positive zero
    // y and -pi (the very first) for a negative one; at the origin it gives
    // 0 for a positive zero x.
    if y == 0.0 && (x < 0.0 || x.is_sign_negative()) {
        return if y.is_sign_positive() { 4.0 } else { 0.0 };
    }
    if x == 0.0 && y == 0.0 {
        return 2.0;
    }
    let (x, y) = (-x, -y);
    let sum = x.abs() + y.abs();
    if y >= 0.0 {
        if x >= 0.0 { y / sum } else { 1.0 - x / sum }
    } else if x < 0.0 {
        2.0 - y / sum
    } else {
        3.0 + x / sum
    }
}

/// Area of a planar polygon with the given normal.
fn polygon_area(points: &[DVec3], normal: DVec3) -> f64 {
    let Some(first) = points.first().copied() else {
        return 0.0;
    };
    let mut sum = DVec3::ZERO;
    for pair in points.windows(2) {
        sum += (pair[0] - first).cross(pair[1] - first);
    }
    0.5 * sum.dot(normal).abs()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn cube() -> Vec<HalfSpace> {
        let mut planes = Vec::new();
        for axis in [DVec3::X, DVec3::Y, DVec3::Z] {
            planes.push(HalfSpace::through(axis, axis, FaceTag::Side, None).unwrap());
            planes.push(HalfSpace::through(DVec3::ZERO, -axis, FaceTag::Side, None).unwrap());
        }
        planes
    }

    #[test]
    fn unit_cube_has_six_faces_and_unit_volume() {
        let part = ConvexPart::from_half_spaces(&cube()).unwrap();
        assert_eq!(part.vertices.len(), 8);
        assert_eq!(part.faces.len(), 6);
        approx::assert_relative_eq!(part.volume(), 1.0, epsilon = 1e-12);
    }

    #[test]
    fn cutting_a_corner_off_leaves_seven_faces() {
        let mut planes = cube();
        // Derivation: the plane x + y + z = 2.5 cuts a corner tetrahedron of
        // legs 1/2, volume (1/2)^3 / 6.
        planes.push(HalfSpace::through(DVec3::splat(2.5 / 3.0), DVec3::ONE, FaceTag::Cheek, None).unwrap());
        let part = ConvexPart::from_half_spaces(&planes).unwrap();
        assert_eq!(part.faces.len(), 7);
        approx::assert_relative_eq!(part.volume(), 1.0 - 0.125 / 6.0, epsilon = 1e-12);
    }

    /// A box from `lo` to `hi` as a one-part solid.
    fn block(lo: DVec3, hi: DVec3) -> Solid {
        let mut planes = Vec::new();
        for axis in [DVec3::X, DVec3::Y, DVec3::Z] {
            planes.push(HalfSpace::through(hi, axis, FaceTag::Side, None).unwrap());
            planes.push(HalfSpace::through(lo, -axis, FaceTag::Side, None).unwrap());
        }
        Solid { parts: vec![ConvexPart::from_half_spaces(&planes).unwrap()] }
    }

    #[test]
    fn boards_crossing_with_no_corner_inside_either_run_into_each_other() {
        // Derivation: a board along x (y 4 to 6, z 0 to 1) through one
        // along y (x 4 to 6, z -1 to 2); every corner of each lies outside
        // the other, and the first board's edge along y = 4, z = 0 passes
        // 1 in deep through the second at x = 5 (1 in from its sides x = 4
        // and x = 6 and from its bottom z = -1).
        let a = block(DVec3::new(0.0, 4.0, 0.0), DVec3::new(10.0, 6.0, 1.0));
        let b = block(DVec3::new(4.0, 0.0, -1.0), DVec3::new(6.0, 10.0, 2.0));
        assert!(!a.vertices().any(|v| b.depth_of(v) > 0.0) && !b.vertices().any(|v| a.depth_of(v) > 0.0));
        assert!(a.runs_into(&b, 0.99) && b.runs_into(&a, 0.99));
        assert!(!a.runs_into(&b, 1.01));
        let edge = (DVec3::new(0.0, 4.0, 0.0), DVec3::new(10.0, 4.0, 0.0));
        assert!(b.parts[0].segment_reaches(edge.0, edge.1, 0.99));
        assert!(!b.parts[0].segment_reaches(edge.0, edge.1, 1.01));
    }

    #[test]
    fn boards_side_by_side_do_not_run_into_each_other() {
        // Derivation: two boards touching face to face at x = 1.5 share no
        // wood; one 0.1 in off shares none either; one 0.1 in into the
        // other shares 0.1 in.
        let a = block(DVec3::ZERO, DVec3::new(1.5, 10.0, 7.25));
        let b = block(DVec3::new(1.5, 0.0, 0.0), DVec3::new(3.0, 10.0, 7.25));
        let c = block(DVec3::new(1.6, 2.0, 1.0), DVec3::new(3.1, 8.0, 5.0));
        let d = block(DVec3::new(1.4, 2.0, 1.0), DVec3::new(2.9, 8.0, 5.0));
        assert!(!a.runs_into(&b, 1e-6) && !a.runs_into(&c, 1e-6) && !c.runs_into(&a, 1e-6));
        assert!(a.runs_into(&d, 0.09) && !a.runs_into(&d, 0.11));
    }

    #[test]
    fn disjoint_half_spaces_give_no_part() {
        let mut planes = cube();
        planes.push(HalfSpace::through(DVec3::new(0.0, 0.0, -1.0), DVec3::Z, FaceTag::Top, None).unwrap());
        assert!(ConvexPart::from_half_spaces(&planes).is_none());
    }
}
