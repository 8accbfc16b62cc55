//! A placed piece: one member where it sits in the roof.

use glam::{DVec2, DVec3};
use serde::Serialize;

use super::{Hand, MemberKind, Solid};

/// One piece in place, for the 3D view and the printed plan.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct PlacedPiece {
    /// The member it is an instance of.
    pub label: String,
    /// What the piece is.
    pub kind: MemberKind,
    /// Which hand it is, where mirror images differ.
    pub hand: Option<Hand>,
    /// The theoretical plan line, lower end first (for a ridge, either end).
    pub plan_line: [DVec2; 2],
    /// The top edge's centre line between the piece's end cuts, lower end
    /// first.
    pub axis: [DVec3; 2],
    /// The piece's solid, every face tagged with the cut that made it.
    pub solid: Solid,
}
