//! Pieces of one shape cut once.
//!
//! Most pieces of a frame repeat: the commons of one plane, the two hands
//! of a regular hip's jacks, the boards of a long ridge. A piece's solid
//! depends only on its cutting planes as its own board sees them (along
//! it, square up from its top edge and to its side, measured from the
//! origin of its top edge's centre line) and, for a seated piece, on where
//! the plate's top lies, so a piece whose planes seen that way are those of
//! a piece already cut is that piece's solid turned and carried into place,
//! or mirrored across the board's centre plane for the other hand.
//! Cutting is most of framing's time; carrying a solid is a few multiplies
//! a corner.

use std::hash::Hasher;

use glam::{DMat3, DVec3};

use super::board::{BoardFrame, PieceSpec, SolidScratch};
use super::{ConvexPart, Face, FaceTag, HalfSpace, Solid};
use crate::quick_hash::{QuickHasher, QuickMap};

/// Two planes seen from their boards are one when their normals'
/// components agree this closely ...
const SAME_NORMAL: f64 = 1e-12;

/// ... and their offsets from the boards' origins this closely (inches):
/// far below any cut tolerance, far above the round-off of planes computed
/// at different places in a plan a few hundred feet across.
const SAME_OFFSET_IN: f64 = 1e-9;

/// Steps the hash key rounds normals' components and offsets to. Two
/// shapes a hair apart may round to different keys; then the second is
/// cut afresh, which changes nothing but the time.
const NORMAL_STEP: f64 = 1e-9;
const OFFSET_STEP_IN: f64 = 1e-6;

#[cfg(test)]
thread_local! {
    /// Set by tests to cut every piece, to compare against carrying.
    pub(crate) static CUT_EVERY_PIECE: std::cell::Cell<bool> = const { std::cell::Cell::new(false) };
    /// How many solids were carried instead of cut, for tests.
    pub(crate) static CARRIED: std::cell::Cell<usize> = const { std::cell::Cell::new(0) };
}

/// Each piece's solid, cutting only the first piece of each shape and
/// carrying that solid to the others.
pub(crate) fn solids_of(specs: &[PieceSpec]) -> Vec<Solid> {
    let mut scratch = SolidScratch::default();
    // Shapes cut so far, by key, each with the piece it was cut for.
    let mut cut: QuickMap<u64, Vec<(Shape, usize)>> = QuickMap::default();
    let mut solids: Vec<Solid> = Vec::with_capacity(specs.len());
    for spec in specs {
        #[cfg(test)]
        if CUT_EVERY_PIECE.with(std::cell::Cell::get) {
            solids.push(spec.solid_with(&mut scratch));
            continue;
        }
        let shape = Shape::of(spec, false);
        let cut_before = |wanted: &Shape| {
            let (_, piece) = cut.get(&wanted.key())?.iter().find(|(shape, _)| shape.matches(wanted))?;
            Some(*piece)
        };
        // The other hand's shape is worked out only when this one is new.
        let found = cut_before(&shape).map(|piece| (piece, false)).or_else(|| {
            (spec.seat.len() <= 1)
                .then(|| Shape::of(spec, true))
                .and_then(|m| cut_before(&m))
                .map(|piece| (piece, true))
        });
        match found {
            Some((piece, mirror)) => {
                let carry = Carry::between(&specs[piece].frame, &spec.frame, mirror);
                let solid = carry.solid(&solids[piece]);
                solids.push(solid);
                #[cfg(test)]
                CARRIED.with(|c| c.set(c.get() + 1));
            }
            None => {
                let index = solids.len();
                solids.push(spec.solid_with(&mut scratch));
                cut.entry(shape.key()).or_default().push((shape, index));
            }
        }
    }
    solids
}

/// A piece's cutting planes as its own board sees them.
#[derive(Debug, Clone, PartialEq)]
struct Shape {
    /// The whole-number facts: how many planes of each kind, each plane's
    /// tag and end, the tail, the seats.
    layout: Vec<u32>,
    /// The planes' normals on the board's along, up and side directions,
    /// and for a seated piece the plate's top's normal (straight up).
    normals: Vec<DVec3>,
    /// The planes' offsets from the board's origin, then the board's
    /// thickness and depth.
    offsets: Vec<f64>,
}

impl Shape {
    /// `spec`'s shape, or with `mirror` its other hand's: every side
    /// component turned round.
    fn of(spec: &PieceSpec, mirror: bool) -> Self {
        let frame = &spec.frame;
        let capacity =
            spec.upper_cuts.len() + spec.lower_cuts.len() + spec.top_planes.len() + 3 * spec.seat.len() + 4;
        let mut shape = Self {
            layout: Vec::with_capacity(capacity + 8),
            normals: Vec::with_capacity(capacity),
            offsets: Vec::with_capacity(capacity + 2),
        };
        let add_all = |shape: &mut Self, planes: &[HalfSpace]| {
            shape.layout.push(planes.len() as u32);
            for plane in planes {
                shape.add(frame, plane, mirror);
            }
        };
        add_all(&mut shape, &spec.upper_cuts);
        shape.layout.push(u32::from(spec.upper_step.is_some()));
        if let Some(step) = &spec.upper_step {
            for plane in [&step.near, &step.at, &step.far] {
                shape.add(frame, plane, mirror);
            }
        }
        add_all(&mut shape, &spec.lower_cuts);
        add_all(&mut shape, &spec.top_planes);
        shape.layout.push(u32::from(spec.has_tail));
        shape.layout.push(spec.seat.len() as u32);
        for wall in &spec.seat {
            shape.add(frame, &wall.inside, mirror);
            add_all(&mut shape, &wall.half_cuts);
            shape.layout.push(u32::from(wall.plate_inner.is_some()));
            if let Some(plate) = &wall.plate_inner {
                shape.add(frame, plate, mirror);
            }
        }
        if !spec.seat.is_empty() {
            // The seat is cut at the plate's top, z = 0.
            let plate_top = HalfSpace { normal: DVec3::Z, offset: 0.0, tag: FaceTag::Seat, end: None };
            shape.add(frame, &plate_top, mirror);
        }
        shape.offsets.push(spec.size.thickness_in);
        shape.offsets.push(spec.size.depth_in);
        shape
    }

    /// Adds one plane as `frame` sees it.
    fn add(&mut self, frame: &BoardFrame, plane: &HalfSpace, mirror: bool) {
        let n = plane.normal;
        let side = n.dot(frame.side);
        self.normals.push(DVec3::new(n.dot(frame.along), n.dot(frame.up), if mirror { -side } else { side }));
        self.offsets.push(plane.offset - n.dot(frame.origin));
        self.layout.push(plane.tag as u32);
        self.layout.push(plane.end.map_or(u32::MAX, |end| end as u32));
    }

    /// A hash of the layout and of the numbers rounded to their steps.
    fn key(&self) -> u64 {
        let mut h = QuickHasher::default();
        for &word in &self.layout {
            h.write_u32(word);
        }
        for n in &self.normals {
            for c in n.to_array() {
                h.write_i64((c / NORMAL_STEP).round() as i64);
            }
        }
        for &d in &self.offsets {
            h.write_i64((d / OFFSET_STEP_IN).round() as i64);
        }
        h.finish()
    }

    /// Whether `other` is this shape within the tolerances.
    fn matches(&self, other: &Shape) -> bool {
        self.layout == other.layout
            && self.normals.len() == other.normals.len()
            && self.offsets.len() == other.offsets.len()
            && self
                .normals
                .iter()
                .zip(&other.normals)
                .all(|(a, b)| (*a - *b).abs().max_element() <= SAME_NORMAL)
            && self.offsets.iter().zip(&other.offsets).all(|(a, b)| (a - b).abs() <= SAME_OFFSET_IN)
    }
}

/// The rigid motion taking one board's frame onto another's, mirrored
/// across the board's centre plane for the other hand.
#[derive(Debug, Clone, Copy)]
struct Carry {
    /// Turns (and mirrors) directions.
    turn: DMat3,
    /// The first board's origin.
    from: DVec3,
    /// The second board's origin.
    to: DVec3,
    /// Whether the motion mirrors, turning every face inside out.
    mirror: bool,
}

impl Carry {
    /// The motion taking frame `a` to frame `b`; with `mirror`, `a`'s
    /// side direction goes to the opposite of `b`'s.
    fn between(a: &BoardFrame, b: &BoardFrame, mirror: bool) -> Self {
        let side = if mirror { -b.side } else { b.side };
        let onto = DMat3::from_cols(b.along, b.up, side);
        let from = DMat3::from_cols(a.along, a.up, a.side);
        // Both frames are orthonormal, so the inverse is the transpose.
        Self { turn: onto * from.transpose(), from: a.origin, to: b.origin, mirror }
    }

    fn point(&self, p: DVec3) -> DVec3 {
        self.to + self.turn * (p - self.from)
    }

    fn plane(&self, h: &HalfSpace) -> HalfSpace {
        let normal = self.turn * h.normal;
        HalfSpace { normal, offset: h.offset - h.normal.dot(self.from) + normal.dot(self.to), ..*h }
    }

    /// `solid` carried. A mirrored solid's faces are reversed to stay
    /// counter-clockwise seen from outside, and its two side faces change
    /// places in each part, as cutting the other hand would order them.
    fn solid(&self, solid: &Solid) -> Solid {
        Solid { parts: solid.parts.iter().map(|part| self.part(part)).collect() }
    }

    fn part(&self, part: &ConvexPart) -> ConvexPart {
        let mut faces: Vec<Face> = part
            .faces
            .iter()
            .map(|f| {
                let mut vertices: Vec<DVec3> = f.vertices.iter().map(|&v| self.point(v)).collect();
                if self.mirror {
                    vertices.reverse();
                }
                Face { vertices, normal: self.turn * f.normal, ..*f }
            })
            .collect();
        let mut planes: Vec<HalfSpace> = part.planes.iter().map(|h| self.plane(h)).collect();
        if self.mirror {
            swap_sides(&mut faces, |f| f.tag);
            swap_sides(&mut planes, |h| h.tag);
        }
        ConvexPart { vertices: part.vertices.iter().map(|&v| self.point(v)).collect(), faces, planes }
    }
}

/// Swaps the first two items tagged as a board's side, if there are two.
fn swap_sides<T>(items: &mut [T], tag: impl Fn(&T) -> FaceTag) {
    let mut sides = items.iter().enumerate().filter(|(_, item)| tag(item) == FaceTag::Side).map(|(i, _)| i);
    if let (Some(a), Some(b)) = (sides.next(), sides.next()) {
        items.swap(a, b);
    }
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::framing::{Frame, FramingSettings, frame_roof};
    use crate::random_outline::{OutlineFeatures, OutlineShape, random_outline_or_refusal};
    use crate::{Outline, Roof};

    /// Frames `outline` twice, carrying solids and cutting every piece,
    /// and returns both and how many solids were carried.
    fn both_ways(outline: &Outline, settings: &FramingSettings) -> Option<(Frame, Frame, usize)> {
        let roof = Roof::solve(outline).ok()?;
        CARRIED.with(|c| c.set(0));
        let carried = frame_roof(outline, &roof, settings);
        let count = CARRIED.with(std::cell::Cell::get);
        CUT_EVERY_PIECE.with(|c| c.set(true));
        let cut = frame_roof(outline, &roof, settings);
        CUT_EVERY_PIECE.with(|c| c.set(false));
        match (carried, cut) {
            (Ok(a), Ok(b)) => Some((a, b, count)),
            (Err(a), Err(b)) => {
                assert_eq!(a.to_string(), b.to_string());
                None
            }
            (a, b) => panic!("carried {:?}, cut {:?}", a.err(), b.err()),
        }
    }

    /// Whether two faces are one: same tag, end and normal, and the same
    /// corners in the same turn from some starting corner.
    fn same_face(a: &Face, b: &Face) -> bool {
        let close = |p: DVec3, q: DVec3| p.distance(q) < 1e-8;
        let n = a.vertices.len();
        a.tag == b.tag
            && a.end == b.end
            && close(a.normal, b.normal)
            && n == b.vertices.len()
            && (0..n).any(|shift| (0..n).all(|i| close(a.vertices[i], b.vertices[(i + shift) % n])))
    }

    /// Checks that carrying gave every piece the solid and numbers that
    /// cutting it gives.
    fn assert_same(carried: &Frame, cut: &Frame, name: &str) {
        assert_eq!(carried.pieces.len(), cut.pieces.len(), "{name}: piece count");
        for (a, b) in carried.pieces.iter().zip(&cut.pieces) {
            assert_eq!(a.solid.parts.len(), b.solid.parts.len(), "{name} {}: parts", a.label);
            for (pa, pb) in a.solid.parts.iter().zip(&b.solid.parts) {
                assert_eq!(pa.faces.len(), pb.faces.len(), "{name} {}: faces", a.label);
                for (fa, fb) in pa.faces.iter().zip(&pb.faces) {
                    assert!(same_face(fa, fb), "{name} {}: face {fa:?} against {fb:?}", a.label);
                }
                assert!((pa.volume() - pb.volume()).abs() < 1e-7, "{name} {}: volume", a.label);
            }
        }
        for (a, b) in carried.pieces.iter().zip(&cut.pieces) {
            assert_eq!(a.label, b.label, "{name}");
        }
        assert_eq!(carried.members.len(), cut.members.len(), "{name}: member count");
        for (a, b) in carried.members.iter().zip(&cut.members) {
            assert_eq!((&a.label, a.count), (&b.label, b.count), "{name}");
            let lengths = |m: &crate::Member| {
                [m.theoretical_length, m.long_point_length, m.short_point_length, m.overall_length]
            };
            for (x, y) in lengths(a).into_iter().zip(lengths(b)) {
                assert!(
                    (x - y).abs() < 1e-7,
                    "{name} {}: lengths {:?} against {:?}",
                    a.label,
                    lengths(a),
                    lengths(b)
                );
            }
            assert_eq!(a.cuts.len(), b.cuts.len(), "{name} {}: cuts", a.label);
            assert_eq!(a.warnings.len(), b.warnings.len(), "{name} {}: warnings", a.label);
        }
        assert_eq!(carried.joints.len(), cut.joints.len(), "{name}: joints");
        for (a, b) in carried.joints.iter().zip(&cut.joints) {
            assert_eq!(a.members, b.members, "{name}");
            assert!((a.max_gap - b.max_gap).abs() < 1e-7, "{name} {:?}: gap", a.members);
            assert!((a.max_overlap - b.max_overlap).abs() < 1e-7, "{name} {:?}: overlap", a.members);
        }
    }

    #[test]
    fn a_shape_cut_once_is_the_shape_cut_again() {
        // Derivation: carrying a solid by the motion between two boards
        // whose cutting planes agree as the boards see them gives the
        // solid cutting would give, so every face, length and joint must
        // come out as when every piece is cut (common practice, no source).
        let demo = crate::demo::demo_plan().expect("the demo plan loads");
        let demo_settings = demo.framing_settings().expect("the demo's framing reads");
        let demo_outline = demo.outline().expect("the demo's outline is valid");
        let (a, b, carried) = both_ways(&demo_outline, &demo_settings).expect("the demo frames");
        assert_same(&a, &b, "demo");
        // The demo's commons and jacks repeat (at least its two hands of
        // hip jacks), so some solids must have been carried.
        assert!(carried * 3 > a.pieces.len(), "only {carried} of {} carried", a.pieces.len());

        let wings = crate::demo::many_wings(0.5).expect("the many-wings outline is valid");
        let twelve_in = FramingSettings { spacing_in: 12.0, ..FramingSettings::default() };
        let (a, b, carried) = both_ways(&wings, &twelve_in).expect("many wings frame");
        assert_same(&a, &b, "many wings");
        assert!(carried * 2 > a.pieces.len(), "only {carried} of {} carried", a.pieces.len());

        let mut framed = 0;
        for seed in 0..60 {
            for shape in [OutlineShape::Orthogonal, OutlineShape::Star] {
                let Ok(outline) = random_outline_or_refusal(shape, seed, OutlineFeatures::from_seed(seed))
                else {
                    continue;
                };
                if let Some((a, b, _)) = both_ways(&outline, &FramingSettings::default()) {
                    assert_same(&a, &b, &format!("seed {seed} {shape:?}"));
                    framed += 1;
                }
            }
        }
        assert!(framed > 100, "only {framed} random plans framed");
    }
}
