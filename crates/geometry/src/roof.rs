//! The solved roof: one plane per pitched wall, and the lines where they meet.

use glam::DVec3;
use serde::Serialize;
use thiserror::Error;

use crate::Outline;

/// The kind of line where two roof planes meet.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum RoofLineKind {
    /// Level line between two planes (the top of the roof).
    Ridge,
    /// Sloping outside corner: the planes fall away on both sides.
    Hip,
    /// Sloping inside corner: water runs towards it.
    Valley,
}

/// A line where two roof planes meet.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RoofLine {
    /// Ridge, hip or valley.
    pub kind: RoofLineKind,
    /// Lower end (for a ridge, either end).
    pub from: DVec3,
    /// Upper end.
    pub to: DVec3,
    /// The walls whose planes meet here (global wall indices).
    pub walls: [usize; 2],
}

/// One roof plane: the part of the roof that drains to one wall.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct RoofPlane {
    /// Global wall index (outer walls first, then courtyard walls, each in
    /// file order).
    pub wall: usize,
    /// Rise per unit run.
    pub rise_per_run: f64,
    /// The plane's outline at the wall line (no overhang), counter-clockwise
    /// seen from above, starting at the wall's first corner; z is height
    /// above the wall line.
    pub outline: Vec<DVec3>,
    /// The same plane carried out to the fascia line (the overhang).
    pub eave_outline: Vec<DVec3>,
}

/// The vertical triangle or trapezoid above a gable wall.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct GableFace {
    /// Global wall index.
    pub wall: usize,
    /// The face's outline; the first two points are the wall's ends at z = 0.
    pub outline: Vec<DVec3>,
}

/// A solved roof.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Roof {
    /// One plane per pitched wall.
    pub planes: Vec<RoofPlane>,
    /// Ridges, hips and valleys.
    pub lines: Vec<RoofLine>,
    /// Gable end faces.
    pub gables: Vec<GableFace>,
}

/// Why a roof could not be solved.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum RoofError {
    /// The solver met a configuration it could not resolve.
    #[error("the roof could not be solved: {reason}")]
    Unsolvable {
        /// What went wrong, in words.
        reason: String,
    },
}

impl Roof {
    /// Solves the roof over a validated outline.
    pub fn solve(outline: &Outline) -> Result<Self, RoofError> {
        let _ = outline;
        Err(RoofError::Unsolvable { reason: "the roof solver is not written yet".into() })
    }
}
