//! The wall outline: corners on the wall line, and what roofs each wall.

use glam::DVec2;
use thiserror::Error;

/// What a wall carries: a roof plane rising at a slope, or a gable end.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum WallRoof {
    /// A roof plane rising inward from this wall's wall line.
    Pitched {
        /// Rise per unit of run (`tan` of the pitch angle); 6 in 12 is 0.5.
        rise_per_run: f64,
    },
    /// A gable: the wall goes up vertically; no roof plane starts here.
    Gable,
}

/// One wall: it starts at `corner` and runs to the next wall's corner.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Wall {
    /// The wall's starting corner on the wall line, in inches.
    pub corner: DVec2,
    /// What roofs this wall.
    pub roof: WallRoof,
    /// Horizontal overhang beyond the wall line, in inches (eave or rake).
    pub overhang_in: f64,
}

/// A validated outline: an outer ring of walls and any courtyard rings.
#[derive(Debug, Clone, PartialEq)]
pub struct Outline {
    outer: Vec<Wall>,
    courtyards: Vec<Vec<Wall>>,
}

/// Why an outline cannot be roofed.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum OutlineError {
    /// Fewer than three corners.
    #[error("the outline has {count} corners; a roof needs at least 3")]
    TooFewCorners {
        /// How many corners were given.
        count: usize,
    },
}

impl Outline {
    /// Builds an outline from the outer walls and the courtyard walls, in
    /// the user's order.
    pub fn new(outer: Vec<Wall>, courtyards: Vec<Vec<Wall>>) -> Result<Self, OutlineError> {
        if outer.len() < 3 {
            return Err(OutlineError::TooFewCorners { count: outer.len() });
        }
        Ok(Self { outer, courtyards })
    }

    /// The outer walls in the user's order.
    pub fn outer(&self) -> &[Wall] {
        &self.outer
    }

    /// The courtyard rings in the user's order.
    pub fn courtyards(&self) -> &[Vec<Wall>] {
        &self.courtyards
    }
}
