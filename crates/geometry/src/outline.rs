//! The wall outline: corners on the wall line, and what roofs each wall.
//!
//! [`Outline::new`] is the one place an outline is checked; everything that
//! holds an [`Outline`] may rely on the rules below.
//!
//! # What a valid outline is
//! - An outer ring of 3 or more walls and any number of courtyard rings of
//!   3 or more walls, at most [`MAX_CORNERS`] corners in all.
//! - Every coordinate is finite; every pitch is a finite slope above 0;
//!   every overhang is finite and 0 or more; at least one wall is pitched.
//! - No corner repeats another; no wall is shorter than the tolerance.
//! - No wall crosses or touches another (except neighbours at their shared
//!   corner), and no corner comes within the tolerance of a wall it is not
//!   an end of. The crossing tests use exact orientation predicates.
//! - Neither the outer ring nor a courtyard has all its corners on one line.
//! - Where two walls meet in a straight line, both are gables or both are
//!   pitched at the same slope; a gable and a pitched wall turn by at
//!   least [`GABLE_TURN_MIN_DEG`] where they meet.
//! - Every courtyard lies inside the outer ring and outside every other
//!   courtyard.
//! - Every courtyard has room for the overhangs into it: its fascia lines
//!   (each wall line moved into it by its own overhang) still enclose it
//!   without crossing or closing up (see [`OutlineError::CourtyardTooSmallForOverhangs`]).
//!
//! # Tolerance
//! [`Outline::tolerance`] is [`TOLERANCE_PER_SIZE`] times the larger side
//! of the outline's bounding box. A roof solve intersects lines in `f64`
//! and loses several of its 16 significant digits where walls are nearly
//! parallel; features a hundred thousand times smaller than the building
//! would be lost in that noise, while at house size (100 ft) the tolerance
//! is 0.012 in, below anything a framer lays out.

use std::collections::HashMap;
use std::fmt;

use glam::DVec2;
use robust::{Coord, orient2d};
use thiserror::Error;

mod courtyard_eaves;
mod segment_grid;

pub(crate) use segment_grid::SegmentGrid;

/// The most corners an outline may have (outer ring and courtyards together).
pub const MAX_CORNERS: usize = 100_000;

/// The tolerance as a fraction of the outline's larger bounding-box side.
pub const TOLERANCE_PER_SIZE: f64 = 1e-5;

/// Two walls whose directions differ by less than this sine of an angle
/// meet "in a straight line" for the pitch rule.
const STRAIGHT_CORNER_SINE: f64 = 1e-9;

/// A gable and a pitched wall whose directions differ by less than this
/// many degrees are refused as nearly in line: see
/// [`OutlineError::GableNearlyInLine`].
pub const GABLE_TURN_MIN_DEG: f64 = 1.0;

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

impl WallRoof {
    /// The slope if the wall is pitched.
    pub fn rise_per_run(self) -> Option<f64> {
        match self {
            Self::Pitched { rise_per_run } => Some(rise_per_run),
            Self::Gable => None,
        }
    }
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
///
/// Walls have global indices: the outer walls `0..n` in the user's order,
/// then each courtyard's walls in turn. Wall `i` of a ring runs from its
/// corner `i` to corner `i + 1` (the last back to the first).
#[derive(Debug, Clone, PartialEq)]
pub struct Outline {
    outer: Vec<Wall>,
    courtyards: Vec<Vec<Wall>>,
    /// Global index of each ring's first wall, outer ring first.
    ring_starts: Vec<usize>,
    /// Signed area of each ring in the user's order (positive when
    /// counter-clockwise).
    ring_signed_areas: Vec<f64>,
    min: DVec2,
    max: DVec2,
    tolerance: f64,
}

/// A corner named as a person counts it: from 1, per ring.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct CornerName {
    /// The courtyard (from 0) or `None` for the outer ring.
    pub courtyard: Option<usize>,
    /// The corner within its ring, from 0.
    pub corner: usize,
}

impl fmt::Display for CornerName {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        match self.courtyard {
            None => write!(f, "corner {}", self.corner + 1),
            Some(c) => write!(f, "courtyard {} corner {}", c + 1, self.corner + 1),
        }
    }
}

/// A wall named as a person counts it, with the corners it runs between.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct WallName {
    /// Global wall index, from 0.
    pub wall: usize,
    /// The courtyard (from 0) or `None` for the outer ring.
    pub courtyard: Option<usize>,
    /// Its first corner within its ring, from 0.
    pub from_corner: usize,
    /// Its second corner within its ring, from 0.
    pub to_corner: usize,
}

impl WallName {
    /// Just "wall 7", for a second mention in one sentence.
    pub fn short(&self) -> String {
        format!("wall {}", self.wall + 1)
    }
}

impl fmt::Display for WallName {
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let (from, to) = (self.from_corner + 1, self.to_corner + 1);
        match self.courtyard {
            None => write!(f, "wall {} (corner {from} to corner {to})", self.wall + 1),
            Some(c) => {
                write!(f, "wall {} (courtyard {}, corner {from} to corner {to})", self.wall + 1, c + 1)
            }
        }
    }
}

/// Why an outline cannot be roofed.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum OutlineError {
    /// The outer ring has fewer than three corners.
    #[error("the outline has {count} corners; a roof needs at least 3")]
    TooFewCorners {
        /// How many corners were given.
        count: usize,
    },
    /// A courtyard has fewer than three corners.
    #[error("courtyard {} has {count} corners; it needs at least 3", courtyard + 1)]
    CourtyardTooFewCorners {
        /// The courtyard, from 0.
        courtyard: usize,
        /// How many corners it has.
        count: usize,
    },
    /// More corners than the solver is built for.
    #[error("the outline has more than {MAX_CORNERS} corners ({count} given)")]
    TooManyCorners {
        /// How many corners were given, courtyards included.
        count: usize,
    },
    /// A corner coordinate is infinite or not a number.
    #[error("{corner} is not a finite point ({x}, {y})")]
    CornerNotFinite {
        /// The corner at fault.
        corner: CornerName,
        /// Its x as given.
        x: f64,
        /// Its y as given.
        y: f64,
    },
    /// A pitch that is not a finite slope above 0.
    #[error("{} has a pitch of {rise_per_run} rise per unit run; a pitch must be a finite slope above 0", wall.short())]
    PitchNotPositive {
        /// The wall at fault.
        wall: WallName,
        /// The slope as given.
        rise_per_run: f64,
    },
    /// An overhang that is negative or not finite.
    #[error("{} has an overhang of {overhang_in} in; an overhang must be a finite length of 0 or more", wall.short())]
    OverhangInvalid {
        /// The wall at fault.
        wall: WallName,
        /// The overhang as given, in inches.
        overhang_in: f64,
    },
    /// Every wall is a gable, so nothing carries a roof plane.
    #[error("every wall is a gable, so there is no roof; give at least one wall a pitch")]
    NoPitchedWall,
    /// Two corners of the same ring at exactly the same point.
    #[error("{corner} repeats {earlier}")]
    CornerRepeats {
        /// The later corner.
        corner: CornerName,
        /// The earlier corner it repeats.
        earlier: CornerName,
    },
    /// A wall shorter than the outline's tolerance.
    #[error("{} is shorter than the {} in tolerance ({} in long)", wall.short(), fmt_in(*tolerance_in), fmt_in(*length_in))]
    WallTooShort {
        /// The wall at fault.
        wall: WallName,
        /// Its length in inches.
        length_in: f64,
        /// The outline's tolerance in inches.
        tolerance_in: f64,
    },
    /// All corners of the outer ring on one line.
    #[error("the outline's corners all lie on one line, so it encloses no area")]
    OutlineHasNoArea,
    /// All corners of a courtyard on one line.
    #[error("courtyard {}'s corners all lie on one line, so it encloses no area", courtyard + 1)]
    CourtyardHasNoArea {
        /// The courtyard, from 0.
        courtyard: usize,
    },
    /// Two walls of one ring cross.
    #[error("{wall} crosses {}", other.short())]
    WallsCross {
        /// The wall with the lower number.
        wall: WallName,
        /// The other wall.
        other: WallName,
    },
    /// Two walls of one ring touch or overlap without crossing.
    #[error("{wall} touches {}", other.short())]
    WallsTouch {
        /// The wall with the lower number.
        wall: WallName,
        /// The other wall.
        other: WallName,
    },
    /// A corner closer than the tolerance to a wall it does not end.
    #[error("{corner} is within the {} in tolerance of {}", fmt_in(*tolerance_in), wall.short())]
    CornerTooCloseToWall {
        /// The corner at fault.
        corner: CornerName,
        /// The wall it comes too close to.
        wall: WallName,
        /// The outline's tolerance in inches.
        tolerance_in: f64,
    },
    /// Two walls in a straight line with different roofs: their planes
    /// would meet only along the wall line itself.
    #[error("{} and {} meet in a straight line at {corner} but are roofed differently; give them the same pitch, or make both gables", wall.short(), next.short())]
    StraightCornerRoofChanges {
        /// The wall ending at the corner.
        wall: WallName,
        /// The wall starting there.
        next: WallName,
        /// The corner between them.
        corner: CornerName,
    },
    /// A gable and a pitched wall meeting at a corner that turns by less
    /// than [`GABLE_TURN_MIN_DEG`].
    ///
    /// Beside the corner the pitched wall's plane starts at the wall line
    /// while the roof over the gable's top does not, so the gable's
    /// vertical face carries on past the corner (at an inside corner, over
    /// the roof) or the plane eats the gable down to a sliver (at an
    /// outside one). How far it carries on grows as one over the sine of
    /// the turn: at a quarter of a degree it stands some ten feet tall
    /// over the roof for longer than the wall itself. No plan means that;
    /// it is a straight wall drawn a hair crooked, and exactly in line it
    /// is refused already ([`OutlineError::StraightCornerRoofChanges`]).
    #[error("{} is a gable and {} is pitched, but they meet at {corner} only {angle_deg:.2} degrees off a straight line; make them one straight wall with one roof, or turn the corner by at least {GABLE_TURN_MIN_DEG} degree", gable.short(), wall.short())]
    GableNearlyInLine {
        /// The gable wall.
        gable: WallName,
        /// The pitched wall beside it.
        wall: WallName,
        /// The corner between them.
        corner: CornerName,
        /// How far the corner turns, degrees.
        angle_deg: f64,
    },
    /// A courtyard outside the outer ring.
    #[error("courtyard {} is not inside the outline", courtyard + 1)]
    CourtyardOutside {
        /// The courtyard, from 0.
        courtyard: usize,
    },
    /// A courtyard wall crossing, touching or too near an outer wall.
    #[error("courtyard {} crosses the outline at {}", courtyard + 1, wall.short())]
    CourtyardCrossesOutline {
        /// The courtyard, from 0.
        courtyard: usize,
        /// The outer wall it meets.
        wall: WallName,
    },
    /// Two courtyards crossing, touching or too near each other.
    #[error("courtyard {} crosses courtyard {} at {}", courtyard + 1, other + 1, wall.short())]
    CourtyardsCross {
        /// The later courtyard, from 0.
        courtyard: usize,
        /// The earlier courtyard, from 0.
        other: usize,
        /// The earlier courtyard's wall it meets.
        wall: WallName,
    },
    /// A courtyard inside another courtyard.
    #[error("courtyard {} lies inside courtyard {}", courtyard + 1, other + 1)]
    CourtyardInsideCourtyard {
        /// The courtyard inside, from 0.
        courtyard: usize,
        /// The courtyard around it, from 0.
        other: usize,
    },
    /// A courtyard narrower than the overhangs hung into it: the fascia
    /// lines of its walls cross or close up, so the rafter, hip and valley
    /// tails from its sides would cross each other and run into the
    /// members beyond. No framer builds that.
    #[error(
        "courtyard {} is too small for the overhangs into it: {} (corner {} to corner {}) and {} (corner {} to corner {}) overhang {} in and {} in, {} in together, but there is room for only {} in, {} in short; shorten those overhangs or widen the courtyard",
        courtyard + 1,
        wall.short(), wall.from_corner + 1, wall.to_corner + 1,
        other.short(), other.from_corner + 1, other.to_corner + 1,
        fmt_in(shortfall.overhangs_in[0]), fmt_in(shortfall.overhangs_in[1]),
        fmt_in(shortfall.overhangs_total_in()), fmt_in(shortfall.room_in), fmt_in(shortfall.short_in())
    )]
    CourtyardTooSmallForOverhangs {
        /// The courtyard, from 0.
        courtyard: usize,
        /// The lower-numbered of the two walls whose overhangs meet.
        wall: WallName,
        /// The other wall.
        other: WallName,
        /// How far the courtyard falls short.
        shortfall: CourtyardShortfall,
    },
}

/// How far a courtyard falls short of the overhangs of two of its walls.
///
/// `room_in` is how much of the two overhangs together the courtyard has
/// room for: with each overhang scaled down by `room_in / (sum of the
/// two)` (and every other overhang into the courtyard by the same
/// fraction) the fascias just stop meeting. For two facing walls in line
/// with each other that is the clear width between them, less the
/// outline's tolerance; for walls at an angle it is the same measure taken
/// along their overhangs.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CourtyardShortfall {
    /// The two walls' overhangs, in inches, in the order the error names
    /// the walls.
    pub overhangs_in: [f64; 2],
    /// How much of their sum the courtyard has room for, in inches.
    pub room_in: f64,
}

impl CourtyardShortfall {
    /// The two overhangs together, in inches.
    pub fn overhangs_total_in(&self) -> f64 {
        self.overhangs_in[0] + self.overhangs_in[1]
    }

    /// By how much the overhangs exceed the room for them, in inches.
    pub fn short_in(&self) -> f64 {
        self.overhangs_total_in() - self.room_in
    }
}

/// A length in inches with three significant digits, for messages.
fn fmt_in(value: f64) -> String {
    if !value.is_finite() || value == 0.0 {
        return format!("{value}");
    }
    let digits = (2 - value.abs().log10().floor() as i32).clamp(0, 12) as usize;
    let text = format!("{value:.digits$}");
    if text.contains('.') { text.trim_end_matches('0').trim_end_matches('.').to_string() } else { text }
}

fn coord(p: DVec2) -> Coord<f64> {
    Coord { x: p.x, y: p.y }
}

/// Exact orientation: positive when a, b, c turn counter-clockwise.
pub(crate) fn orient(a: DVec2, b: DVec2, c: DVec2) -> f64 {
    orient2d(coord(a), coord(b), coord(c))
}

/// How two segments meet, decided exactly.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum Meeting {
    Apart,
    Cross,
    Touch,
}

/// Whether `p`, known to be on the line a-b, lies within the segment.
fn within_box(a: DVec2, b: DVec2, p: DVec2) -> bool {
    p.x >= a.x.min(b.x) && p.x <= a.x.max(b.x) && p.y >= a.y.min(b.y) && p.y <= a.y.max(b.y)
}

/// Exact test of segments a-b and c-d.
pub(crate) fn segments_meet(a: DVec2, b: DVec2, c: DVec2, d: DVec2) -> Meeting {
    let o1 = orient(a, b, c);
    let o2 = orient(a, b, d);
    let o3 = orient(c, d, a);
    let o4 = orient(c, d, b);
    if o1 * o2 < 0.0 && o3 * o4 < 0.0 {
        return Meeting::Cross;
    }
    let touches = (o1 == 0.0 && within_box(a, b, c))
        || (o2 == 0.0 && within_box(a, b, d))
        || (o3 == 0.0 && within_box(c, d, a))
        || (o4 == 0.0 && within_box(c, d, b));
    if touches { Meeting::Touch } else { Meeting::Apart }
}

/// Distance from `p` to segment a-b.
pub(crate) fn distance_to_segment(p: DVec2, a: DVec2, b: DVec2) -> f64 {
    let ab = b - a;
    let len2 = ab.length_squared();
    let t = if len2 > 0.0 { ((p - a).dot(ab) / len2).clamp(0.0, 1.0) } else { 0.0 };
    (a + ab * t).distance(p)
}

/// Twice the signed area of a ring, measured from its first corner to
/// keep the products small.
fn signed_area(points: &[DVec2]) -> f64 {
    let Some(&origin) = points.first() else {
        return 0.0;
    };
    let mut twice = 0.0;
    for (i, &p) in points.iter().enumerate() {
        let q = points.get(i + 1).copied().unwrap_or(origin);
        twice += (p - origin).perp_dot(q - origin);
    }
    twice / 2.0
}

/// Exact winding-number test; `p` must not lie on the ring.
pub(crate) fn ring_contains(points: &[DVec2], p: DVec2) -> bool {
    let mut winding = 0i64;
    for (i, &a) in points.iter().enumerate() {
        let Some(&b) = points.get((i + 1) % points.len()) else {
            continue;
        };
        if a.y <= p.y {
            if b.y > p.y && orient(a, b, p) > 0.0 {
                winding += 1;
            }
        } else if b.y <= p.y && orient(a, b, p) < 0.0 {
            winding -= 1;
        }
    }
    winding != 0
}

/// One wall of the outline as the checks see it.
struct Segment {
    ring: usize,
    local: usize,
    a: DVec2,
    b: DVec2,
}

impl Outline {
    /// Builds an outline from the outer walls and the courtyard walls, in
    /// the user's order (either way round), checking every rule listed in
    /// the module documentation.
    pub fn new(outer: Vec<Wall>, courtyards: Vec<Vec<Wall>>) -> Result<Self, OutlineError> {
        let count = outer.len() + courtyards.iter().map(Vec::len).sum::<usize>();
        if count > MAX_CORNERS {
            return Err(OutlineError::TooManyCorners { count });
        }
        if outer.len() < 3 {
            return Err(OutlineError::TooFewCorners { count: outer.len() });
        }
        if let Some((courtyard, ring)) = courtyards.iter().enumerate().find(|(_, r)| r.len() < 3) {
            return Err(OutlineError::CourtyardTooFewCorners { courtyard, count: ring.len() });
        }
        let mut ring_starts = Vec::with_capacity(courtyards.len() + 1);
        let mut start = 0;
        for ring in std::iter::once(&outer).chain(courtyards.iter()) {
            ring_starts.push(start);
            start += ring.len();
        }
        let mut outline = Self {
            outer,
            courtyards,
            ring_starts,
            ring_signed_areas: Vec::new(),
            min: DVec2::ZERO,
            max: DVec2::ZERO,
            tolerance: 0.0,
        };
        outline.check_values()?;
        let (min, max) = outline
            .ring_points(0)
            .fold((DVec2::splat(f64::INFINITY), DVec2::splat(f64::NEG_INFINITY)), |(lo, hi), p| {
                (lo.min(p), hi.max(p))
            });
        outline.min = min;
        outline.max = max;
        outline.tolerance = TOLERANCE_PER_SIZE * (max - min).max_element();
        outline.check_repeats_and_lengths()?;
        outline.check_collinear_rings()?;
        outline.check_straight_corners()?;
        outline.check_crossings()?;
        outline.check_courtyard_placement()?;
        outline.ring_signed_areas = (0..outline.ring_count())
            .map(|r| signed_area(&outline.ring_points(r).collect::<Vec<_>>()))
            .collect();
        outline.check_courtyard_eaves()?;
        Ok(outline)
    }

    /// The outer walls in the user's order.
    pub fn outer(&self) -> &[Wall] {
        &self.outer
    }

    /// The courtyard rings in the user's order.
    pub fn courtyards(&self) -> &[Vec<Wall>] {
        &self.courtyards
    }

    /// How many walls there are, courtyards included.
    pub fn wall_count(&self) -> usize {
        self.outer.len() + self.courtyards.iter().map(Vec::len).sum::<usize>()
    }

    /// The wall with global index `i` (outer walls first, then courtyards).
    pub fn wall_data(&self, i: usize) -> Option<&Wall> {
        let (ring, local) = self.locate(i)?;
        self.ring(ring)?.get(local)
    }

    /// The start and end corners of wall `i` in the user's order.
    pub fn wall(&self, i: usize) -> Option<(DVec2, DVec2)> {
        let (ring, local) = self.locate(i)?;
        let walls = self.ring(ring)?;
        let a = walls.get(local)?.corner;
        let b = walls.get((local + 1) % walls.len())?.corner;
        Some((a, b))
    }

    /// The ends of wall `i` ordered so the roofed area lies on their left
    /// (the order a counter-clockwise outer ring would give).
    pub fn wall_roof_on_left(&self, i: usize) -> Option<(DVec2, DVec2)> {
        let (ring, _) = self.locate(i)?;
        let (a, b) = self.wall(i)?;
        let counter_clockwise = self.ring_signed_areas.get(ring).copied().unwrap_or(0.0) > 0.0;
        let keep = if ring == 0 { counter_clockwise } else { !counter_clockwise };
        Some(if keep { (a, b) } else { (b, a) })
    }

    /// A person's name for wall `i`: "wall 3 (corner 3 to corner 4)".
    pub fn wall_name(&self, i: usize) -> Option<WallName> {
        let (ring, local) = self.locate(i)?;
        Some(self.name_wall(ring, local))
    }

    /// The roofed area in square inches: the outer ring less the courtyards.
    pub fn area(&self) -> f64 {
        let mut areas = self.ring_signed_areas.iter().map(|a| a.abs());
        let outer = areas.next().unwrap_or(0.0);
        outer - areas.sum::<f64>()
    }

    /// Whether the user gave the outer corners counter-clockwise (seen
    /// from above, x to the right and y up).
    pub fn is_counter_clockwise(&self) -> bool {
        self.ring_signed_areas.first().is_some_and(|&a| a > 0.0)
    }

    /// Whether the user gave courtyard `c`'s corners counter-clockwise.
    pub fn courtyard_is_counter_clockwise(&self, c: usize) -> Option<bool> {
        self.ring_signed_areas.get(c + 1).map(|&a| a > 0.0)
    }

    /// The lowest x and y of the outline's corners.
    pub fn min_corner(&self) -> DVec2 {
        self.min
    }

    /// The width (x) and depth (y) of the outline's bounding box, in inches.
    pub fn size(&self) -> DVec2 {
        self.max - self.min
    }

    /// The length below which two points count as one, in inches (see the
    /// module documentation).
    pub fn tolerance(&self) -> f64 {
        self.tolerance
    }

    /// Whether `p` lies in the roofed area (inside the outer ring and
    /// outside every courtyard). Points on a wall may go either way.
    pub fn contains(&self, p: DVec2) -> bool {
        let inside = |ring: usize| ring_contains(&self.ring_points(ring).collect::<Vec<_>>(), p);
        inside(0) && !(1..self.ring_count()).any(inside)
    }

    fn ring_count(&self) -> usize {
        1 + self.courtyards.len()
    }

    fn ring(&self, ring: usize) -> Option<&[Wall]> {
        if ring == 0 { Some(&self.outer) } else { self.courtyards.get(ring - 1).map(Vec::as_slice) }
    }

    fn ring_points(&self, ring: usize) -> impl Iterator<Item = DVec2> + '_ {
        self.ring(ring).unwrap_or(&[]).iter().map(|w| w.corner)
    }

    fn locate(&self, i: usize) -> Option<(usize, usize)> {
        let ring = self.ring_starts.partition_point(|&s| s <= i).checked_sub(1)?;
        let local = i - self.ring_starts.get(ring)?;
        (local < self.ring(ring)?.len()).then_some((ring, local))
    }

    fn corner_name(ring: usize, corner: usize) -> CornerName {
        CornerName { courtyard: ring.checked_sub(1), corner }
    }

    fn name_wall(&self, ring: usize, local: usize) -> WallName {
        let len = self.ring(ring).map_or(1, <[Wall]>::len).max(1);
        WallName {
            wall: self.ring_starts.get(ring).copied().unwrap_or(0) + local,
            courtyard: ring.checked_sub(1),
            from_corner: local,
            to_corner: (local + 1) % len,
        }
    }

    fn check_values(&self) -> Result<(), OutlineError> {
        let mut any_pitched = false;
        for ring in 0..self.ring_count() {
            for (local, wall) in self.ring(ring).unwrap_or(&[]).iter().enumerate() {
                if !wall.corner.is_finite() {
                    return Err(OutlineError::CornerNotFinite {
                        corner: Self::corner_name(ring, local),
                        x: wall.corner.x,
                        y: wall.corner.y,
                    });
                }
                if let WallRoof::Pitched { rise_per_run } = wall.roof {
                    if !(rise_per_run.is_finite() && rise_per_run > 0.0) {
                        return Err(OutlineError::PitchNotPositive {
                            wall: self.name_wall(ring, local),
                            rise_per_run,
                        });
                    }
                    any_pitched = true;
                }
                if !(wall.overhang_in.is_finite() && wall.overhang_in >= 0.0) {
                    return Err(OutlineError::OverhangInvalid {
                        wall: self.name_wall(ring, local),
                        overhang_in: wall.overhang_in,
                    });
                }
            }
        }
        if any_pitched { Ok(()) } else { Err(OutlineError::NoPitchedWall) }
    }

    fn check_repeats_and_lengths(&self) -> Result<(), OutlineError> {
        for ring in 0..self.ring_count() {
            let points: Vec<DVec2> = self.ring_points(ring).collect();
            // Bit patterns find exact repeats; adding 0.0 folds -0 into +0.
            let mut seen: HashMap<(u64, u64), usize> = HashMap::with_capacity(points.len());
            for (i, p) in points.iter().enumerate() {
                let key = ((p.x + 0.0).to_bits(), (p.y + 0.0).to_bits());
                if let Some(&earlier) = seen.get(&key) {
                    return Err(OutlineError::CornerRepeats {
                        corner: Self::corner_name(ring, i),
                        earlier: Self::corner_name(ring, earlier),
                    });
                }
                seen.insert(key, i);
            }
            for (i, &a) in points.iter().enumerate() {
                let b = points.get((i + 1) % points.len()).copied().unwrap_or(a);
                let length_in = a.distance(b);
                if length_in < self.tolerance {
                    return Err(OutlineError::WallTooShort {
                        wall: self.name_wall(ring, i),
                        length_in,
                        tolerance_in: self.tolerance,
                    });
                }
            }
        }
        Ok(())
    }

    fn check_collinear_rings(&self) -> Result<(), OutlineError> {
        for ring in 0..self.ring_count() {
            let points: Vec<DVec2> = self.ring_points(ring).collect();
            let (Some(&a), Some(&b)) = (points.first(), points.get(1)) else {
                continue;
            };
            if points.iter().all(|&p| orient(a, b, p) == 0.0) {
                return Err(match ring {
                    0 => OutlineError::OutlineHasNoArea,
                    r => OutlineError::CourtyardHasNoArea { courtyard: r - 1 },
                });
            }
        }
        Ok(())
    }

    fn check_straight_corners(&self) -> Result<(), OutlineError> {
        for ring in 0..self.ring_count() {
            let walls = self.ring(ring).unwrap_or(&[]);
            let n = walls.len();
            for (i, wall) in walls.iter().enumerate() {
                let (Some(prev), Some(next)) = (walls.get((i + n - 1) % n), walls.get((i + 1) % n)) else {
                    continue;
                };
                let into = wall.corner - prev.corner;
                let out = next.corner - wall.corner;
                let sine = into.perp_dot(out).abs() / (into.length() * out.length());
                let ahead = into.dot(out) > 0.0;
                if ahead && sine <= STRAIGHT_CORNER_SINE && !same_roof(prev.roof, wall.roof) {
                    return Err(OutlineError::StraightCornerRoofChanges {
                        wall: self.name_wall(ring, (i + n - 1) % n),
                        next: self.name_wall(ring, i),
                        corner: Self::corner_name(ring, i),
                    });
                }
                let one_gable = (prev.roof == WallRoof::Gable) != (wall.roof == WallRoof::Gable);
                if ahead && one_gable && sine < GABLE_TURN_MIN_DEG.to_radians().sin() {
                    let (before, after) = (self.name_wall(ring, (i + n - 1) % n), self.name_wall(ring, i));
                    let (gable, pitched) =
                        if prev.roof == WallRoof::Gable { (before, after) } else { (after, before) };
                    return Err(OutlineError::GableNearlyInLine {
                        gable,
                        wall: pitched,
                        corner: Self::corner_name(ring, i),
                        angle_deg: sine.asin().to_degrees(),
                    });
                }
            }
        }
        Ok(())
    }

    fn segments(&self) -> Vec<Segment> {
        let mut segments = Vec::with_capacity(self.wall_count());
        for ring in 0..self.ring_count() {
            let points: Vec<DVec2> = self.ring_points(ring).collect();
            for (local, &a) in points.iter().enumerate() {
                let b = points.get((local + 1) % points.len()).copied().unwrap_or(a);
                segments.push(Segment { ring, local, a, b });
            }
        }
        segments
    }

    /// Finds the lowest-numbered pair of walls that cross, touch or come
    /// within the tolerance, and names it.
    fn check_crossings(&self) -> Result<(), OutlineError> {
        let segments = self.segments();
        let ends: Vec<(DVec2, DVec2)> = segments.iter().map(|s| (s.a, s.b)).collect();
        let grid = SegmentGrid::new(&ends, self.tolerance);
        // The fault with the lowest wall numbers wins, so the message does
        // not depend on how the grid happens to visit pairs.
        let mut worst: Option<(usize, usize, Fault)> = None;
        grid.for_each_candidate_pair(|i, j| {
            if worst.is_some_and(|(wi, wj, _)| (wi, wj) <= (i, j)) {
                return;
            }
            let (Some(s), Some(t)) = (segments.get(i), segments.get(j)) else {
                return;
            };
            if let Some(fault) = self.pair_fault(s, t) {
                worst = Some((i, j, fault));
            }
        });
        let Some((i, j, fault)) = worst else {
            return Ok(());
        };
        let (Some(s), Some(t)) = (segments.get(i), segments.get(j)) else {
            return Ok(());
        };
        let wall = self.name_wall(s.ring, s.local);
        let other = self.name_wall(t.ring, t.local);
        // Segments are listed ring by ring, so `s` is never in a later ring than `t`.
        Err(if s.ring == t.ring {
            match fault {
                Fault::Cross => OutlineError::WallsCross { wall, other },
                Fault::Touch => OutlineError::WallsTouch { wall, other },
                Fault::Close { corner_ring, corner, wall_is_first } => OutlineError::CornerTooCloseToWall {
                    corner: Self::corner_name(corner_ring, corner),
                    wall: if wall_is_first { wall } else { other },
                    tolerance_in: self.tolerance,
                },
            }
        } else if s.ring == 0 {
            OutlineError::CourtyardCrossesOutline { courtyard: t.ring - 1, wall }
        } else {
            OutlineError::CourtyardsCross { courtyard: t.ring - 1, other: s.ring - 1, wall }
        })
    }

    /// What is wrong between two walls, if anything.
    fn pair_fault(&self, s: &Segment, t: &Segment) -> Option<Fault> {
        let tol = self.tolerance;
        let len = self.ring(s.ring).map_or(0, <[Wall]>::len);
        let neighbours =
            s.ring == t.ring && ((s.local + 1) % len == t.local || (t.local + 1) % len == s.local);
        if neighbours {
            // Shared corner b; the walls fold back on each other if the far
            // ends lie on one line on the same side of it.
            let (a, b, c) = if s.b == t.a { (s.a, s.b, t.b) } else { (t.a, t.b, s.b) };
            if orient(a, b, c) == 0.0 && (a - b).dot(c - b) > 0.0 {
                return Some(Fault::Touch);
            }
            // Only the far ends can come too near the other wall.
            let (far_s, far_t) = if s.b == t.a { (s.a, t.b) } else { (s.b, t.a) };
            return self.close_fault(s, t, &[(far_s, false), (far_t, true)], tol);
        }
        match segments_meet(s.a, s.b, t.a, t.b) {
            Meeting::Cross => Some(Fault::Cross),
            Meeting::Touch => Some(Fault::Touch),
            Meeting::Apart => {
                self.close_fault(s, t, &[(s.a, false), (s.b, false), (t.a, true), (t.b, true)], tol)
            }
        }
    }

    /// A corner of one wall within `tol` of the other wall; `of_t` says
    /// the corner belongs to wall `t`.
    fn close_fault(&self, s: &Segment, t: &Segment, corners: &[(DVec2, bool)], tol: f64) -> Option<Fault> {
        for &(p, of_t) in corners {
            let (owner, (a, b)) = if of_t { (t, (s.a, s.b)) } else { (s, (t.a, t.b)) };
            if distance_to_segment(p, a, b) < tol {
                let len = self.ring(owner.ring).map_or(1, <[Wall]>::len).max(1);
                let corner = if p == owner.a { owner.local } else { (owner.local + 1) % len };
                return Some(Fault::Close { corner_ring: owner.ring, corner, wall_is_first: of_t });
            }
        }
        None
    }

    fn check_courtyard_placement(&self) -> Result<(), OutlineError> {
        let outer: Vec<DVec2> = self.ring_points(0).collect();
        let rings: Vec<Vec<DVec2>> = (1..self.ring_count()).map(|r| self.ring_points(r).collect()).collect();
        for (c, ring) in rings.iter().enumerate() {
            // No walls cross, so one corner decides for the whole ring.
            let Some(&probe) = ring.first() else { continue };
            if !ring_contains(&outer, probe) {
                return Err(OutlineError::CourtyardOutside { courtyard: c });
            }
            for (d, other) in rings.iter().enumerate() {
                if d != c && ring_contains(other, probe) {
                    return Err(OutlineError::CourtyardInsideCourtyard { courtyard: c, other: d });
                }
            }
        }
        Ok(())
    }
}

/// Whether two neighbouring walls in one straight line may share it.
fn same_roof(a: WallRoof, b: WallRoof) -> bool {
    match (a, b) {
        (WallRoof::Gable, WallRoof::Gable) => true,
        (WallRoof::Pitched { rise_per_run: r }, WallRoof::Pitched { rise_per_run: s }) => {
            (r - s).abs() <= 1e-12 * r.abs().max(s.abs())
        }
        _ => false,
    }
}

/// A fault between two walls found by the crossing search.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Fault {
    Cross,
    Touch,
    Close {
        corner_ring: usize,
        corner: usize,
        /// The wall too near the corner is the lower-numbered one.
        wall_is_first: bool,
    },
}

#[cfg(test)]
mod tests {
    use super::*;

    fn pitched(points: &[(f64, f64)]) -> Vec<Wall> {
        points
            .iter()
            .map(|&(x, y)| Wall {
                corner: DVec2::new(x, y),
                roof: WallRoof::Pitched { rise_per_run: 0.5 },
                overhang_in: 0.0,
            })
            .collect()
    }

    fn clockwise_l() -> Outline {
        // An L of 600 x 400 with a 300 x 200 notch, given clockwise.
        let outer = pitched(&[
            (0.0, 0.0),
            (0.0, 400.0),
            (300.0, 400.0),
            (300.0, 200.0),
            (600.0, 200.0),
            (600.0, 0.0),
        ]);
        let court = pitched(&[(50.0, 50.0), (150.0, 50.0), (150.0, 150.0), (50.0, 150.0)]);
        Outline::new(outer, vec![court]).unwrap()
    }

    #[test]
    fn area_subtracts_courtyards_whatever_the_order() {
        let outline = clockwise_l();
        // Derivation: 600 * 200 + 300 * 200 - 100 * 100.
        assert_eq!(outline.area(), 170_000.0);
        assert!(!outline.is_counter_clockwise());
        assert_eq!(outline.courtyard_is_counter_clockwise(0), Some(true));
    }

    #[test]
    fn walls_are_numbered_outer_first() {
        let outline = clockwise_l();
        assert_eq!(outline.wall_count(), 10);
        assert_eq!(outline.wall(5), Some((DVec2::new(600.0, 0.0), DVec2::new(0.0, 0.0))));
        assert_eq!(outline.wall(6), Some((DVec2::new(50.0, 50.0), DVec2::new(150.0, 50.0))));
        assert_eq!(outline.wall(10), None);
        let name = outline.wall_name(7).unwrap();
        assert_eq!(name.to_string(), "wall 8 (courtyard 1, corner 2 to corner 3)");
    }

    #[test]
    fn roof_lies_left_of_every_wall() {
        let outline = clockwise_l();
        for i in 0..outline.wall_count() {
            let (a, b) = outline.wall_roof_on_left(i).unwrap();
            let mid = (a + b) / 2.0;
            let left = (b - a).perp().normalize();
            assert!(outline.contains(mid + left), "wall {i}");
            assert!(!outline.contains(mid - left), "wall {i}");
        }
    }

    #[test]
    fn tolerance_follows_the_larger_side() {
        let outline = clockwise_l();
        assert_eq!(outline.size(), DVec2::new(600.0, 400.0));
        assert_eq!(outline.min_corner(), DVec2::ZERO);
        // Derivation: 1e-5 * 600 in.
        assert!((outline.tolerance() - 0.006).abs() < 1e-15);
    }

    #[test]
    fn each_error_is_detected() {
        let square = pitched(&[(0.0, 0.0), (100.0, 0.0), (100.0, 100.0), (0.0, 100.0)]);
        let check = |outer: Vec<Wall>, courts: Vec<Vec<Wall>>| Outline::new(outer, courts).unwrap_err();
        assert!(matches!(check(square[..2].to_vec(), vec![]), OutlineError::TooFewCorners { count: 2 }));
        let mut bad = square.clone();
        bad[1].corner.x = f64::NAN;
        assert!(matches!(check(bad, vec![]), OutlineError::CornerNotFinite { .. }));
        let mut bad = square.clone();
        bad[1].roof = WallRoof::Pitched { rise_per_run: f64::NAN };
        assert!(matches!(check(bad, vec![]), OutlineError::PitchNotPositive { .. }));
        let mut bad = square.clone();
        bad[1].overhang_in = -1.0;
        assert!(matches!(check(bad, vec![]), OutlineError::OverhangInvalid { .. }));
        let gables = square.iter().map(|w| Wall { roof: WallRoof::Gable, ..*w }).collect();
        assert!(matches!(check(gables, vec![]), OutlineError::NoPitchedWall));
        let mut bad = square.clone();
        bad.insert(2, bad[2]);
        assert!(matches!(check(bad, vec![]), OutlineError::CornerRepeats { .. }));
        let mut bad = square.clone();
        bad.insert(2, Wall { corner: DVec2::new(100.0, 100.0005), ..bad[2] });
        assert!(matches!(check(bad, vec![]), OutlineError::WallTooShort { .. }));
        let bowtie = pitched(&[(0.0, 0.0), (100.0, 100.0), (100.0, 0.0), (0.0, 100.0)]);
        assert!(matches!(check(bowtie, vec![]), OutlineError::WallsCross { .. }));
        let line = pitched(&[(0.0, 0.0), (1.0, 1.0), (2.0, 2.0)]);
        assert!(matches!(check(line, vec![]), OutlineError::OutlineHasNoArea));
        let outside = pitched(&[(200.0, 0.0), (300.0, 0.0), (300.0, 100.0)]);
        assert!(matches!(
            check(square.clone(), vec![outside]),
            OutlineError::CourtyardOutside { courtyard: 0 }
        ));
        let across = pitched(&[(50.0, 50.0), (150.0, 50.0), (150.0, 60.0)]);
        assert!(matches!(check(square, vec![across]), OutlineError::CourtyardCrossesOutline { .. }));
    }

    #[test]
    fn message_lengths_keep_three_digits() {
        assert_eq!(fmt_in(0.0123456), "0.0123");
        assert_eq!(fmt_in(0.01), "0.01");
        assert_eq!(fmt_in(12.5), "12.5");
        assert_eq!(fmt_in(480.0), "480");
    }
}
