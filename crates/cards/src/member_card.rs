//! What printed output knows about one distinct member: its numbers, its
//! cuts with their setups, and its outline seen from the side (and from the
//! top where it has cheek cuts).
//!
//! These are plain data, filled from the framing (see `from_frame`) or by
//! hand in tests. Lengths are inches; view coordinates are inches in the
//! member's own frame: x along the member from its lower (tail) end, y up
//! square to its bottom edge in the side view, across its top face in the
//! top view.

use glam::DVec2;
use pitchframe_geometry::{AngleSetting, SquareSetting};
use serde::Serialize;

/// The kind of face a cut leaves; sets its name, colour and hatching.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum CutFace {
    /// Plumb cut at the upper end (ridge, hip or valley).
    TopPlumb,
    /// Plumb cut at the lower end of a member that has no tail (a hip
    /// whose foot meets another member).
    BottomPlumb,
    /// Level seat of a birdsmouth, bearing on the plate.
    Seat,
    /// Plumb heel of a birdsmouth, against the outside of the plate.
    Heel,
    /// Plumb cut at the tail (fascia).
    TailPlumb,
    /// Level cut at the tail (soffit).
    TailLevel,
    /// Cheek (side) cut: a plumb cut at an angle across the member.
    Cheek,
    /// Bevel planed along a hip's top edges.
    Backing,
    /// Square-cut end (ridge boards, blocking).
    SquareEnd,
}

impl CutFace {
    /// Every cut face kind, in legend order.
    pub const ALL: [CutFace; 9] = [
        CutFace::TopPlumb,
        CutFace::BottomPlumb,
        CutFace::Seat,
        CutFace::Heel,
        CutFace::TailPlumb,
        CutFace::TailLevel,
        CutFace::Cheek,
        CutFace::Backing,
        CutFace::SquareEnd,
    ];

    /// The trade's name for the cut.
    pub fn name(self) -> &'static str {
        match self {
            CutFace::TopPlumb => "top plumb cut",
            CutFace::BottomPlumb => "lower plumb cut",
            CutFace::Seat => "seat cut",
            CutFace::Heel => "heel cut",
            CutFace::TailPlumb => "tail plumb cut",
            CutFace::TailLevel => "tail level cut",
            CutFace::Cheek => "cheek cut",
            CutFace::Backing => "backing",
            CutFace::SquareEnd => "square end",
        }
    }

    /// A one- or two-letter tag printed on the face so the card reads in
    /// black and white.
    pub fn tag(self) -> &'static str {
        match self {
            CutFace::TopPlumb => "P",
            CutFace::BottomPlumb => "LP",
            CutFace::Seat => "S",
            CutFace::Heel => "H",
            CutFace::TailPlumb => "T",
            CutFace::TailLevel => "TL",
            CutFace::Cheek => "C",
            CutFace::Backing => "B",
            CutFace::SquareEnd => "E",
        }
    }

    /// The colour of the face on cards and in the 3D model, as RGB in 0..1.
    /// Chosen to stay apart for common colour blindness and to print as
    /// distinct greys.
    pub fn colour(self) -> [f32; 3] {
        match self {
            CutFace::TopPlumb => [0.85, 0.33, 0.10],
            // A plumb cut like the top one, a shade darker.
            CutFace::BottomPlumb => [0.65, 0.25, 0.08],
            CutFace::Seat => [0.00, 0.45, 0.70],
            CutFace::Heel => [0.34, 0.71, 0.91],
            CutFace::TailPlumb => [0.80, 0.47, 0.65],
            CutFace::TailLevel => [0.60, 0.30, 0.55],
            CutFace::Cheek => [0.90, 0.62, 0.00],
            CutFace::Backing => [0.00, 0.62, 0.45],
            CutFace::SquareEnd => [0.45, 0.45, 0.45],
        }
    }

    /// The angle of this face's hatch lines on paper, degrees from level;
    /// each kind gets its own so faces differ without colour.
    pub fn hatch_deg(self) -> f64 {
        match self {
            CutFace::TopPlumb => 45.0,
            CutFace::BottomPlumb => 15.0,
            CutFace::Seat => 0.0,
            CutFace::Heel => 90.0,
            CutFace::TailPlumb => -45.0,
            CutFace::TailLevel => 30.0,
            CutFace::Cheek => 60.0,
            CutFace::Backing => -60.0,
            CutFace::SquareEnd => -30.0,
        }
    }
}

/// The lengths a framer reads off a member, in inches; `None` where the
/// member has no such length (a ridge board has no seat).
#[derive(Debug, Clone, PartialEq, Serialize, Default)]
pub struct MemberLengths {
    /// Along the top edge to the long point of the upper cut.
    pub long_point_in: Option<f64>,
    /// Along the top edge to the short point of the upper cut.
    pub short_point_in: Option<f64>,
    /// From the seat's heel plumb line to the top cut, along the top edge.
    pub seat_to_top_cut_in: Option<f64>,
    /// The tail beyond the heel plumb line, along the top edge.
    pub tail_in: Option<f64>,
    /// The stock length the piece is cut from, tail included.
    pub overall_in: f64,
}

/// Where a cut's line is marked on the side view, for drawing the framing
/// square where it is held.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CutMark {
    /// Where the marked line meets the edge the square is held on.
    pub edge_point: DVec2,
    /// Unit direction of the marked line from the edge toward the square's
    /// heel: into the board, or (on a cheek marked from above, where only
    /// that way lands the other figure on the stock) away from it.
    pub into_board: DVec2,
    /// Unit direction of the edge the square is held on.
    pub edge_along: DVec2,
}

/// A compound cut's angles grouped by tool, so a card can print them in a
/// few short lines; each still names its setup when printed.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CutAngles {
    /// The line on the side face, degrees from square to the edge.
    pub side_line_deg: f64,
    /// The line across the top edge, degrees from square (a line angle,
    /// not a saw bevel); zero where the cut is square across.
    pub top_line_deg: f64,
    /// Circular saw on the side face, cutting along the side-face line:
    /// blade bevel, degrees.
    pub circular_on_face_bevel_deg: f64,
    /// Circular saw riding the top edge along the top-edge line: blade
    /// bevel, degrees.
    pub circular_on_edge_bevel_deg: f64,
    /// Miter saw with the board flat: miter and bevel, degrees.
    pub miter_flat_deg: [f64; 2],
    /// Miter saw with the board on edge: miter and bevel, degrees.
    pub miter_on_edge_deg: [f64; 2],
}

/// One cut on a member, with every figure and setting to make it.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CardCut {
    /// What kind of face the cut leaves.
    pub face: CutFace,
    /// Where on the member, in words ("upper end, against the hip").
    pub place: String,
    /// The framing-square setting for the line, with its setup.
    pub square: Option<SquareSetting>,
    /// Saw settings, each with its setup named.
    pub settings: Vec<AngleSetting>,
    /// The same angles grouped by tool, where the cut has them.
    pub angles: Option<CutAngles>,
    /// Where the line is marked on the side view, when the square is held
    /// on the side face for it.
    pub mark: Option<CutMark>,
    /// Where the line is marked on the top view, when the square is held
    /// on the top edge for it (cheek cuts).
    pub top_mark: Option<CutMark>,
    /// A measured figure for the cut, with what it measures
    /// ("notch depth 1-9/16\" square to the edge").
    pub notes: Vec<String>,
}

/// A cut face as seen in a view.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ViewFace {
    /// The kind of cut that made the face.
    pub face: CutFace,
    /// The face's outline in view coordinates; two points when the face is
    /// seen edge-on.
    pub outline: Vec<DVec2>,
}

/// A member drawn in one view: its outline and its cut faces.
#[derive(Debug, Clone, PartialEq, Serialize, Default)]
pub struct MemberView {
    /// The outline, in view coordinates (inches); for a solid of several
    /// convex parts, the hull of them all (used for fitting the view).
    pub outline: Vec<DVec2>,
    /// The solid's convex parts, each as its outline in the view; when
    /// given, these are drawn instead of `outline` so notches show.
    pub parts: Vec<Vec<DVec2>>,
    /// The cut faces, each tagged by its cut.
    pub faces: Vec<ViewFace>,
}

/// One distinct member, as the cut cards and the cut list show it.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct MemberCard {
    /// The label written on the piece ("C1", "H2").
    pub label: String,
    /// The member kind in the trade's words ("common rafter", "hip").
    pub kind: String,
    /// How many identical pieces.
    pub count: u32,
    /// The lumber size ("2x8").
    pub size: String,
    /// Member thickness, inches.
    pub thickness_in: f64,
    /// Member depth, inches.
    pub depth_in: f64,
    /// The member's pitch (its own slope), radians.
    pub pitch_rad: f64,
    /// The lengths a framer reads.
    pub lengths: MemberLengths,
    /// Every cut, in order from the lower end.
    pub cuts: Vec<CardCut>,
    /// Warnings on this member, in words.
    pub warnings: Vec<String>,
    /// The side elevation.
    pub side_view: MemberView,
    /// The top view, for members with cheek cuts.
    pub top_view: Option<MemberView>,
    /// Where each piece lies in plan: from its lower end to its upper end
    /// at the wall-line height, inches.
    pub places: Vec<[DVec2; 2]>,
}
