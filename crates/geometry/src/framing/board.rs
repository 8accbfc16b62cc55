//! A board placed in the roof, and the convex parts its cuts leave.

use glam::{DVec2, DVec3};

use super::corners::{PartsScratch, corners, corners_of_parts};
use super::solid::FaceScratch;
use super::{BoardSize, ConvexPart, CutEnd, FaceTag, HalfSpace, MemberKind, Solid};

/// A board's frame: its top edge's centre line and three unit directions.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct BoardFrame {
    /// A point on the top edge's centre line (for seated members, over the
    /// wall line or the corner).
    pub origin: DVec3,
    /// Up the member, along its edge.
    pub along: DVec3,
    /// Square to the top edge, upward.
    pub up: DVec3,
    /// Horizontal, square to the member, to its left looking up it.
    pub side: DVec3,
}

impl BoardFrame {
    /// A board rising at `slope` along plan direction `plan_dir`, its top
    /// centre line passing through `origin`.
    pub fn new(origin: DVec3, plan_dir: DVec2, slope: f64) -> Option<Self> {
        let plan_dir = plan_dir.try_normalize()?;
        let along = plan_dir.extend(slope).try_normalize()?;
        let side = plan_dir.perp().extend(0.0);
        let up = along.cross(side);
        Some(Self { origin, along, up, side })
    }

    /// Coordinate of `p` along the member from the origin.
    pub fn along_of(&self, p: DVec3) -> f64 {
        (p - self.origin).dot(self.along)
    }

    /// The four long faces of a `size` board: top, bottom, left, right.
    pub fn box_planes(&self, size: BoardSize) -> Vec<HalfSpace> {
        let o = self.origin;
        let half = size.thickness_in / 2.0;
        [
            HalfSpace::through(o, self.up, FaceTag::Top, None),
            HalfSpace::through(o - self.up * size.depth_in, -self.up, FaceTag::Bottom, None),
            HalfSpace::through(o + self.side * half, self.side, FaceTag::Side, None),
            HalfSpace::through(o - self.side * half, -self.side, FaceTag::Side, None),
        ]
        .into_iter()
        .flatten()
        .collect()
    }

    /// The vertical plane through the centre line keeping the left
    /// (`left` true) or right half.
    pub fn centre_half(&self, left: bool) -> Option<HalfSpace> {
        let n = if left { -self.side } else { self.side };
        HalfSpace::through(self.origin, n, FaceTag::Interior, None)
    }
}

/// Buffers reused while cutting many pieces' solids.
#[derive(Debug, Default)]
pub struct SolidScratch {
    /// The board's planes and cuts.
    base: Vec<HalfSpace>,
    /// Those and one half's own planes.
    half: Vec<HalfSpace>,
    /// One part's planes.
    planes: Vec<HalfSpace>,
    /// Each part's corners.
    corners: Vec<Vec<DVec3>>,
    /// For the corner search.
    parts_scratch: PartsScratch,
    /// For the face builder.
    faces: FaceScratch,
}

/// The wall a seated member bears on, for one half of it.
#[derive(Debug, Clone, PartialEq)]
pub struct SeatWall {
    /// Keeps the side inside the wall line (outward normal).
    pub inside: HalfSpace,
    /// Cuts for this half alone (a valley's tail at its own fascia).
    pub half_cuts: Vec<HalfSpace>,
    /// The plate's inner face (outward normal toward the wall line), for
    /// members over a corner: the seat is cut only over the plate, and
    /// past it the hip or valley keeps its full depth and hangs below the
    /// plate inside the walls.
    pub plate_inner: Option<HalfSpace>,
}

/// Everything needed to cut one piece's solid.
#[derive(Debug, Clone, PartialEq)]
pub struct PieceSpec {
    /// What the piece is.
    pub kind: MemberKind,
    /// Board size.
    pub size: BoardSize,
    /// The board's frame.
    pub frame: BoardFrame,
    /// Theoretical plan line, lower end first.
    pub plan_line: [DVec2; 2],
    /// Rise per unit run along the member.
    pub slope: f64,
    /// Planes that cut the top besides the board's own top (backing).
    pub top_planes: Vec<HalfSpace>,
    /// Cuts at the upper end (or a level member's far end).
    pub upper_cuts: Vec<HalfSpace>,
    /// Where the top cut steps with the faces it bears on (a hip's top on
    /// a ridge's side running on past its end, beside the next ridge's
    /// side): none for most pieces.
    pub upper_step: Option<TopStep>,
    /// Cuts at the lower end: tail and soffit, or a bottom cheek.
    pub lower_cuts: Vec<HalfSpace>,
    /// The wall(s) the member seats on: none, one, or one per half (left,
    /// right) for hips and valleys over a corner.
    pub seat: Vec<SeatWall>,
    /// Whether the member runs past its wall line to a tail.
    pub has_tail: bool,
    /// Drop on the seat (hips).
    pub drop_in: f64,
    /// The framing-square figures for the member's own plumb and level
    /// lines, run arm first: 12 and the rise per foot for commons and
    /// jacks; the hip's or valley's unit run and a common's rise for hips
    /// and valleys (17 and 6 for a regular hip at 6/12).
    pub plumb_square: [f64; 2],
}

/// A top cut in two steps: the face it bears on steps aside at a board's
/// end (a ridge butted end to end by the next ridge, in line with it but
/// less than its thickness aside), and the cut steps with it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct TopStep {
    /// The cut on the near side of the step, one of the upper cuts.
    pub near: HalfSpace,
    /// The step's plane (the end the near face stops at), keeping the near
    /// side: it cuts the step's own face where the cut runs on deeper.
    pub at: HalfSpace,
    /// The cut past the step, parallel to `near`.
    pub far: HalfSpace,
}

impl TopStep {
    /// The step's depth, inches: how far past the step the cut runs on
    /// beyond `near`'s plane (negative where it stops short of it).
    pub fn depth_in(&self) -> f64 {
        // Parallel planes: far's offset less near's, along near's normal.
        self.far.offset * self.far.normal.dot(self.near.normal) - self.near.offset
    }
}

impl PieceSpec {
    /// Cuts the solid: the board less everything its cuts remove, split
    /// into convex parts at the seat.
    pub fn solid(&self) -> Solid {
        self.solid_with(&mut SolidScratch::default())
    }

    /// As [`PieceSpec::solid`], reusing `scratch` from piece to piece.
    pub fn solid_with(&self, scratch: &mut SolidScratch) -> Solid {
        match &self.upper_step {
            Some(step) => self.stepped_solid(step, scratch),
            None => self.plain_solid(scratch),
        }
    }

    /// The solid of a top cut in two steps: the board cut with the looser
    /// of the two cuts (the one keeping more wood), each part then split at
    /// the step's plane into the part cut to the tighter cut on its side,
    /// the part beside it past the step as deep, and the strip between the
    /// two cuts past the step, whose face on the step's plane is the step's
    /// own face. The faces where parts meet are interior.
    fn stepped_solid(&self, step: &TopStep, scratch: &mut SolidScratch) -> Solid {
        let flip = |h: HalfSpace| HalfSpace { normal: -h.normal, offset: -h.offset, ..h };
        let interior = |h: HalfSpace| HalfSpace { tag: FaceTag::Interior, end: None, ..h };
        let near_side = step.at;
        let far_side = flip(step.at);
        let (tight, loose, tight_side, loose_side) = if step.depth_in() > 0.0 {
            (step.near, step.far, near_side, far_side)
        } else {
            (step.far, step.near, far_side, near_side)
        };
        let mut plain = self.clone();
        plain.upper_step = None;
        for cut in &mut plain.upper_cuts {
            if *cut == step.near {
                *cut = loose;
            }
        }
        let base = plain.plain_solid(scratch);
        let mut parts = Vec::with_capacity(3 * base.parts.len());
        for part in &base.parts {
            let with = |extra: [HalfSpace; 2]| {
                let planes: Vec<HalfSpace> = part.planes.iter().copied().chain(extra).collect();
                ConvexPart::from_half_spaces(&planes)
            };
            parts.extend(with([interior(tight_side), tight]));
            parts.extend(with([interior(loose_side), interior(tight)]));
            parts.extend(with([loose_side, interior(flip(tight))]));
        }
        Solid { parts }
    }

    /// The solid of a piece with no step in its top cut.
    fn plain_solid(&self, scratch: &mut SolidScratch) -> Solid {
        let SolidScratch { base, half, planes, corners: corner_lists, parts_scratch, faces } = scratch;
        base.clear();
        // Cuts first, so a cut flush with a board face keeps its tag.
        base.extend(self.upper_cuts.iter().copied());
        base.extend(self.lower_cuts.iter().copied());
        base.extend(self.top_planes.iter().copied());
        base.extend(self.frame.box_planes(self.size));
        let mut parts = Vec::with_capacity(if self.has_tail { 3 } else { 1 } * self.seat.len().max(1));
        let halves: [Option<(Option<bool>, Option<&SeatWall>)>; 2] = match self.seat.as_slice() {
            [] => [Some((None, None)), None],
            [wall] => [Some((None, Some(wall))), None],
            [left, right] => [Some((Some(true), Some(left))), Some((Some(false), Some(right)))],
            _ => [None, None],
        };
        for (centre, wall) in halves.into_iter().flatten() {
            half.clear();
            half.extend(base.iter().copied());
            if let Some(is_left) = centre {
                half.extend(self.frame.centre_half(is_left));
            }
            let Some(wall) = wall else {
                let vertices = corners(half);
                parts.extend(ConvexPart::from_corners(half, vertices, faces));
                continue;
            };
            let inside = wall.inside;
            half.extend(wall.half_cuts.iter().copied());
            let outside = HalfSpace {
                normal: -inside.normal,
                offset: -inside.offset,
                tag: FaceTag::Interior,
                end: None,
            };
            let above_plate =
                |tag| HalfSpace { normal: -DVec3::Z, offset: 0.0, tag, end: Some(CutEnd::Seat) };
            let below_plate = HalfSpace { normal: DVec3::Z, offset: 0.0, tag: FaceTag::Interior, end: None };
            let inside_tag = if self.has_tail { FaceTag::Interior } else { FaceTag::Tail };
            let inside_end = if self.has_tail { None } else { Some(CutEnd::Tail) };
            // Each part is the half's planes and two or three more: past
            // the plate above and below it (over a corner), the body, and
            // the tail's top and bottom.
            let plate = wall.plate_inner.unwrap_or(inside);
            let inside_plate =
                HalfSpace { normal: -plate.normal, offset: -plate.offset, tag: FaceTag::Interior, end: None };
            let past_above = [
                HalfSpace { tag: FaceTag::Interior, end: None, ..plate },
                HalfSpace { end: None, ..above_plate(FaceTag::Interior) },
            ];
            // The notch's inner plumb cut bears on the plate's inner face.
            let past_below =
                [HalfSpace { tag: FaceTag::Heel, end: Some(CutEnd::Seat), ..plate }, below_plate];
            let body_planes = [
                HalfSpace { tag: inside_tag, end: inside_end, ..inside },
                above_plate(FaceTag::Seat),
                inside_plate,
            ];
            let body = if wall.plate_inner.is_some() { &body_planes[..] } else { &body_planes[..2] };
            let tail_top = [outside, HalfSpace { end: None, ..above_plate(FaceTag::Interior) }];
            let tail_bottom =
                [HalfSpace { tag: FaceTag::Heel, end: Some(CutEnd::Seat), ..outside }, below_plate];
            let all: [&[HalfSpace]; 5] = [&past_above, &past_below, body, &tail_top, &tail_bottom];
            let extras = match (wall.plate_inner.is_some(), self.has_tail) {
                (true, true) => &all[..],
                (true, false) => &all[..3],
                (false, true) => &all[2..],
                (false, false) => &all[2..3],
            };
            corner_lists.clear();
            corners_of_parts(half, extras, parts_scratch, corner_lists);
            for (more, vertices) in extras.iter().zip(corner_lists.drain(..)) {
                planes.clear();
                planes.extend(half.iter().copied());
                planes.extend(more.iter().copied());
                parts.extend(ConvexPart::from_corners(planes, vertices, faces));
            }
        }
        Solid { parts }
    }
}
