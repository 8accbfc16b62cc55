//! Cuts and how to set up for them, read from a cut face's plane.

use glam::DVec3;
use serde::Serialize;

use super::{CutEnd, TailCut};

/// A miter-saw setting.
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct MiterSetup {
    /// Table (miter) angle from square, degrees.
    pub miter_deg: f64,
    /// Blade bevel from square, degrees.
    pub bevel_deg: f64,
}

/// One plane cut's angles, each with the setup it belongs to.
///
/// Square figures are `[12, x]`, 12 on one arm and x on the other, both on
/// the board's edge: for the plumb line (on a side face) the line follows
/// the x arm (x = 12 tan of the plumb line's angle from square, so a common
/// reads `[12, R]`); for the top-edge line of a cheek it follows the 12 arm
/// (x = 12 tan of the line's angle from the member's axis, the trade's side
/// cut figure).
#[derive(Debug, Clone, Copy, PartialEq, Serialize)]
pub struct CutFace {
    /// Square figure of the line the cut leaves on a side face.
    pub plumb_square: [f64; 2],
    /// That line's angle from square to the edge, degrees.
    pub side_angle_deg: f64,
    /// Square figure of the line on the top edge (`None` where it is square
    /// across).
    pub top_edge_square: Option<[f64; 2]>,
    /// The top-edge line's angle from square across the edge, degrees.
    pub top_edge_angle_deg: f64,
    /// Circular saw on the side face, cutting along the side-face line:
    /// blade bevel, degrees.
    pub face_bevel_deg: f64,
    /// Circular saw riding on the top edge along the top-edge line: blade
    /// bevel, degrees.
    pub edge_bevel_deg: f64,
    /// Miter saw, board flat on a side face.
    pub miter_flat: MiterSetup,
    /// Miter saw, board on its edge.
    pub miter_on_edge: MiterSetup,
}

impl CutFace {
    /// Reads the angles of a cut plane with outward normal `normal` on a
    /// board whose axis is `along` (up the member), top-edge normal `up`
    /// and side normal `side` (all unit, mutually square).
    pub fn from_normal(normal: DVec3, along: DVec3, up: DVec3, side: DVec3) -> Self {
        let a1 = normal.dot(along).abs();
        let a2 = normal.dot(up).abs();
        let a3 = normal.dot(side).abs();
        // The line on a face is square to the normal's part in that face.
        let side_angle = a2.atan2(a1);
        let top_angle = a3.atan2(a1);
        // Zero-bevel blade planes contain the marked line and the face
        // normal; the bevel is the tilt from there to the cut plane.
        let face_bevel = a3.atan2(a1.hypot(a2));
        let edge_bevel = a2.atan2(a1.hypot(a3));
        let top_edge_square =
            (top_angle > 1e-9).then(|| [12.0, 12.0 * (std::f64::consts::FRAC_PI_2 - top_angle).tan()]);
        Self {
            plumb_square: [12.0, 12.0 * side_angle.tan()],
            side_angle_deg: side_angle.to_degrees(),
            top_edge_square,
            top_edge_angle_deg: top_angle.to_degrees(),
            face_bevel_deg: face_bevel.to_degrees(),
            edge_bevel_deg: edge_bevel.to_degrees(),
            miter_flat: MiterSetup { miter_deg: side_angle.to_degrees(), bevel_deg: face_bevel.to_degrees() },
            miter_on_edge: MiterSetup {
                miter_deg: top_angle.to_degrees(),
                bevel_deg: edge_bevel.to_degrees(),
            },
        }
    }
}

/// A cut on a member, with where it is and how to make it.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum Cut {
    /// A plumb cut square across the board (against a ridge, or a plumb
    /// tail).
    Plumb {
        /// Which end.
        end: CutEnd,
        /// Square figures of the plumb line on the side face, run arm
        /// first (12 and the rise; a hip's or valley's unit run and a
        /// common's rise where the line is its own plumb line, 17 and 6 on a
        /// regular hip at 6/12).
        square: [f64; 2],
        /// The cut's angles and saw setups.
        face: CutFace,
        /// Shortening from the theoretical end, along the top edge.
        deduction_in: f64,
        /// The same, in plan.
        plan_deduction_in: f64,
    },
    /// A single cheek cut against a hip, valley or other member's side.
    Cheek {
        /// Which end.
        end: CutEnd,
        /// Square figure of the line across the top edge.
        square: [f64; 2],
        /// Top-edge line's angle from square, degrees.
        top_edge_angle_deg: f64,
        /// Circular saw along the plumb line on the face: bevel, degrees.
        face_bevel_deg: f64,
        /// Circular saw on the top edge: bevel, degrees.
        edge_bevel_deg: f64,
        /// Which side the long point is on, looking up the member.
        long_point: super::Hand,
        /// All angles and saw setups.
        face: CutFace,
        /// Shortening from the theoretical end along the top edge's centre.
        deduction_in: f64,
        /// The same, in plan.
        plan_deduction_in: f64,
    },
    /// A cheek cut in two steps, where the face it bears on steps aside at
    /// a board's end (a hip's top on a ridge's side running on past the
    /// ridge's end, beside the next ridge butted against it a little
    /// aside): the cheek as a single cheek up to the step, and past it the
    /// same cheek moved `step_in` square to itself, the step's own face
    /// between the two.
    SteppedCheek {
        /// Which end.
        end: CutEnd,
        /// Square figure of the cheek's line across the top edge.
        square: [f64; 2],
        /// Which side the long point is on, looking up the member.
        long_point: super::Hand,
        /// The cheek's angles and saw setups (both steps).
        face: CutFace,
        /// The step's own face: its angles and saw setups.
        step: CutFace,
        /// How far past the step the cheek stands from its line before it,
        /// square to the cheek, inches: deeper (toward what it bears on)
        /// where positive, back where negative.
        step_in: f64,
        /// The side of the board the cheek's line before the step starts
        /// at, looking up the member.
        step_from: super::Hand,
        /// From that side to the step, along the cheek's line across the
        /// top edge (in plan), inches.
        step_from_side_in: f64,
        /// Shortening from the theoretical end along the top edge's centre.
        deduction_in: f64,
        /// The same, in plan.
        plan_deduction_in: f64,
    },
    /// Two cheek cuts meeting at a point (hip or valley tops, hip tails).
    DoubleCheek {
        /// Which end.
        end: CutEnd,
        /// The cheek on the left, looking up the member.
        left: CutFace,
        /// The cheek on the right.
        right: CutFace,
        /// Shortening from the theoretical end along the top edge's centre.
        deduction_in: f64,
        /// The same, in plan.
        plan_deduction_in: f64,
    },
    /// The birdsmouth: a level seat cut and a plumb heel cut.
    Seat {
        /// Always the seat.
        end: CutEnd,
        /// Square figures of the heel's plumb line (the seat is square to
        /// it), run arm first, as for a plumb cut.
        square: [f64; 2],
        /// Seat cut width, level, along the member's plan line.
        seat_width_in: f64,
        /// Height above plate at the wall line, plumb, to the top edge.
        heel_height_in: f64,
        /// Notch depth measured square to the bottom edge.
        notch_depth_in: f64,
        /// How far the member is dropped on its seat (hips only).
        drop_in: f64,
    },
    /// The tail cut at the fascia.
    Tail {
        /// Always the tail.
        end: CutEnd,
        /// How the tail is cut.
        style: TailCut,
        /// Square figures of the line on the side face, run arm first, as
        /// for a plumb cut.
        square: [f64; 2],
        /// All angles and saw setups (one face per fascia side).
        faces: Vec<CutFace>,
    },
    /// A level soffit cut under the tail.
    Soffit {
        /// Always the tail.
        end: CutEnd,
        /// Square figures of the level line on the side face, as for the
        /// seat.
        square: [f64; 2],
        /// Length of the level cut along the side face.
        length_in: f64,
    },
    /// A level cut along the lower edge of a hip up on the roof, or of a
    /// ridge, that would otherwise run down into a wall's plate: it bears
    /// on the plate there.
    PlateLevel {
        /// Always the seat (where the member bears on the plate).
        end: CutEnd,
        /// Square figures of the level line on the side face, as for the
        /// seat.
        square: [f64; 2],
        /// Length of the level cut along the side face.
        length_in: f64,
        /// The most it takes off the member's depth, plumb.
        depth_off_in: f64,
    },
    /// Backing: the hip's top bevelled into each roof plane.
    Backing {
        /// Along the whole length.
        end: CutEnd,
        /// Bevel on the left side, degrees from level across the top.
        left_deg: f64,
        /// Bevel on the right side.
        right_deg: f64,
    },
    /// A square end of a ridge board.
    SquareEnd {
        /// Which end.
        end: CutEnd,
    },
}

impl Cut {
    /// Which end or place of the member the cut belongs to.
    pub fn end(&self) -> CutEnd {
        match self {
            Self::Plumb { end, .. }
            | Self::Cheek { end, .. }
            | Self::SteppedCheek { end, .. }
            | Self::DoubleCheek { end, .. }
            | Self::Seat { end, .. }
            | Self::Tail { end, .. }
            | Self::Soffit { end, .. }
            | Self::PlateLevel { end, .. }
            | Self::Backing { end, .. }
            | Self::SquareEnd { end } => *end,
        }
    }
}
