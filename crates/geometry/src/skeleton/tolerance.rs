//! Tolerances of the skeleton, scaled to the size of the outline.

/// Distances, heights and angles below which two skeleton quantities count as equal.
///
/// The skeleton works in `f64`; every event point is the solution of a small
/// linear system, so its rounding error grows with the size of the outline.
/// The tolerances are therefore relative to the outline's extent `size` (the
/// larger side of its bounding box):
/// - `point = 1e-7 * size`: two plan points closer than this are one point
///   (for a 100 ft building about 0.0001 in, far below anything a saw cuts);
/// - `time = 1e-4 * point * min_rise`: two events whose heights differ by
///   less than this happen together. A wall line at the fastest plan speed
///   `1 / min_rise` travels a ten-thousandth of `point` in that height, so
///   even a sharp corner moving thousands of times faster than its walls
///   stays within `point` of where the batch places it; truly simultaneous
///   events (a square's apex) agree far more closely than this;
/// - `angle = 1e-10` rad: two wall lines closer than this to parallel are
///   treated as parallel, since their crossing would lie farther away than
///   `size / angle`, outside any real building.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Tolerance {
    /// Plan distance below which two points are the same point.
    pub point: f64,
    /// Height below which two events are simultaneous.
    pub time: f64,
    /// Sine of the angle below which two directions are parallel.
    pub angle: f64,
}

impl Tolerance {
    /// Tolerances for an outline of extent `size` whose lowest pitch is `min_rise`.
    pub fn for_outline(size: f64, min_rise: f64) -> Self {
        let point = 1e-7 * size.max(f64::MIN_POSITIVE);
        Self { point, time: 1e-4 * point * min_rise.clamp(1e-3, 1e3), angle: 1e-10 }
    }
}
