//! Members of the frame: one entry per distinct piece, with its count.

use serde::Serialize;

use super::{BoardSize, Cut, FramingWarning};

/// What a member is in the frame.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, PartialOrd, Ord, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum MemberKind {
    /// A level ridge board.
    Ridge,
    /// A common rafter: wall plate to ridge.
    Common,
    /// A common rafter meeting the end of a ridge where hips meet.
    KingCommon,
    /// A hip rafter.
    Hip,
    /// A valley rafter.
    Valley,
    /// A jack from the wall plate to a hip.
    HipJack,
    /// A jack from a valley to the ridge.
    ValleyJack,
    /// A jack between a valley and a hip or another valley.
    CrippleJack,
}

impl MemberKind {
    /// The label prefix of this kind ("C" for commons, "HJ" for hip jacks).
    pub fn label_prefix(self) -> &'static str {
        match self {
            Self::Ridge => "R",
            Self::Common => "C",
            Self::KingCommon => "KC",
            Self::Hip => "H",
            Self::Valley => "V",
            Self::HipJack => "HJ",
            Self::ValleyJack => "VJ",
            Self::CrippleJack => "CJ",
        }
    }
}

/// Which side a piece's cheek (its long point) is on, looking up the member
/// from its lower end.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Hand {
    /// Long point on the left.
    Left,
    /// Long point on the right.
    Right,
}

/// How many of a member are cut each hand.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Default)]
pub struct Hands {
    /// Pieces with the long point on the left.
    pub left: usize,
    /// Pieces with the long point on the right.
    pub right: usize,
}

/// One distinct member: identical pieces share a label and a count.
///
/// Lengths are in inches along the member: `long_point_length` and
/// `short_point_length` run along the top edge from the heel plumb line
/// (on the wall line) to the top cut's long and short points; members with
/// no seat measure from the lower cut's long (or short) point instead.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Member {
    /// Our label ("C1", "HJ3").
    pub label: String,
    /// What the member is.
    pub kind: MemberKind,
    /// How many identical pieces are cut (both hands together).
    pub count: usize,
    /// Left and right hands, for pieces whose mirror images differ.
    pub hands: Option<Hands>,
    /// The board size.
    pub size: BoardSize,
    /// Rise per unit run along the member (its own pitch).
    pub rise_per_run: f64,
    /// Plan run between the theoretical ends.
    pub run: f64,
    /// Theoretical length: run times length per unit run, before deductions.
    pub theoretical_length: f64,
    /// Along the top edge to the top cut's long point.
    pub long_point_length: f64,
    /// Along the top edge to the top cut's short point.
    pub short_point_length: f64,
    /// Along the top edge's centre line from the heel plumb line (or the
    /// lower cut) to the top cut.
    pub seat_to_top_cut: f64,
    /// Along the top edge from the heel plumb line to the tail cut's far
    /// point (0 with no tail).
    pub tail_length: f64,
    /// The stock length the piece is cut from (its whole extent along the
    /// board).
    pub overall_length: f64,
    /// Every cut, each with its setup.
    pub cuts: Vec<Cut>,
    /// What to look out for on this member.
    pub warnings: Vec<FramingWarning>,
}
