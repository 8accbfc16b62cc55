//! The moving wall line: a wall's line carried inward as the roof rises.

use glam::DVec2;

/// A wall line moving inward at its plan speed as the height (the skeleton's
/// time) grows.
///
/// At height `t` the line is `{p : normal . p = offset + speed * t}`; the
/// region still to be roofed lies on the `normal` side.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct WallLine {
    /// Global wall index.
    pub wall: usize,
    /// Unit direction along the wall, counter-clockwise around the roofed region.
    pub dir: DVec2,
    /// Unit normal pointing into the roofed region (left of `dir`).
    pub normal: DVec2,
    /// `normal . p` for any point `p` on the wall line.
    pub offset: f64,
    /// Plan distance travelled per unit of height: `1 / rise_per_run`, or 0
    /// for a gable wall, which does not move.
    pub speed: f64,
    /// Rise per unit run, `None` for a gable.
    pub rise: Option<f64>,
    /// Wall start on the wall line (counter-clockwise sense).
    pub start: DVec2,
    /// Wall end on the wall line (counter-clockwise sense).
    pub end: DVec2,
    /// Horizontal overhang beyond the wall line.
    pub overhang: f64,
}

impl WallLine {
    /// The line through `start` and `end` (distinct points), moving at `speed`.
    pub fn new(wall: usize, start: DVec2, end: DVec2, rise: Option<f64>, overhang: f64) -> Self {
        let dir = (end - start).normalize_or_zero();
        let normal = dir.perp();
        let speed = rise.map_or(0.0, |r| 1.0 / r);
        Self { wall, dir, normal, offset: normal.dot(start), speed, rise, start, end, overhang }
    }

    /// Signed plan distance from `p` to the moving line at height `t`,
    /// positive on the side still to be roofed.
    pub fn distance_at(&self, p: DVec2, t: f64) -> f64 {
        self.normal.dot(p) - self.offset - self.speed * t
    }

    /// Height of this wall's roof plane above the plan point `p` (negative
    /// outside the wall line); 0 for a gable.
    pub fn plane_height(&self, p: DVec2) -> f64 {
        self.rise.map_or(0.0, |r| r * (self.normal.dot(p) - self.offset))
    }
}
