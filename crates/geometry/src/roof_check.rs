//! An independent check of a solved roof against its outline.
//!
//! [`check_roof`] knows nothing of how a roof was solved: it recomputes
//! every height from the outline's wall lines and pitches and tests the
//! properties every correct roof has:
//!
//! - one plane per pitched wall, none for a gable, each at its wall's pitch;
//! - each plane's plan outline is a simple counter-clockwise polygon inside
//!   the outline that starts with its own wall line at height 0, and every
//!   point on it has height `pitch * distance to the wall line`;
//! - the planes cover the outline's area exactly, without overlapping;
//! - neighbouring planes have equal heights along their shared edges, and
//!   each reported ridge, hip or valley lies on both its planes, along
//!   their shared edge, is of the kind its shape says, and runs upward;
//! - no other wall's plane is lower at a point of a plane where that wall's
//!   wavefront is known to arrive first (the lower-envelope property; see
//!   [`RoofDefect::PointLowerOnOtherPlane`] for where this is decided);
//! - every gable wall has a vertical face standing on it. Where a gable
//!   meets a pitched wall at an inside corner the face may run on along
//!   the gable's line past the corner, over the roof beside it (no roof of
//!   the wall planes can close there otherwise, see
//!   [`RoofDefect::StepBetweenPlanes`]); a step between two planes is
//!   accepted only where such a face stands and spans it, and two planes
//!   on either side of a face need no ridge, hip or valley between them.
//!
//! Plan lengths are compared within [`Outline::tolerance`]; heights within
//! that tolerance times (1 + the steepest pitch), four times over, since a
//! height is a plan distance times a slope.

use std::collections::{HashMap, HashSet};

use glam::{DVec2, DVec3};
use thiserror::Error;

use crate::outline::{Meeting, SegmentGrid, distance_to_segment, orient, ring_contains, segments_meet};
use crate::{Outline, Roof, RoofLineKind};

/// Outlines with more walls than this skip the visibility-based
/// lower-envelope test, whose cost grows with the cube of the walls.
const ENVELOPE_WALL_LIMIT: usize = 120;

/// Convex outlines with more walls than this skip the lower-envelope test,
/// whose cost there grows with the square of the walls.
const CONVEX_ENVELOPE_WALL_LIMIT: usize = 1000;

/// A line between two shedding planes rising less than this per unit run
/// is a ridge.
const LEVEL_SLOPE: f64 = 1e-9;

/// A line between two shedding planes rising more than this per unit run
/// (0.1 in over 100 in) is a hip; in between, where walls are nearly
/// parallel, either name is accepted.
const SLOPED_SLOPE: f64 = 1e-3;

/// One way a solved roof is wrong.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum RoofDefect {
    /// A plane names a wall the outline does not have.
    #[error("plane {plane} names wall {wall}, which the outline does not have")]
    PlaneForUnknownWall {
        /// Index into `Roof::planes`.
        plane: usize,
        /// The wall index it gives.
        wall: usize,
    },
    /// A plane rises from a gable wall.
    #[error("plane {plane} rises from wall {wall}, which is a gable")]
    PlaneForGableWall {
        /// Index into `Roof::planes`.
        plane: usize,
        /// Global wall index.
        wall: usize,
    },
    /// A pitched wall has no plane.
    #[error("pitched wall {wall} has no roof plane")]
    WallWithoutPlane {
        /// Global wall index.
        wall: usize,
    },
    /// A wall has more than one plane.
    #[error("wall {wall} has planes {plane} and {other}")]
    WallWithManyPlanes {
        /// Global wall index.
        wall: usize,
        /// The first plane.
        plane: usize,
        /// The second plane.
        other: usize,
    },
    /// A plane's recorded slope differs from its wall's pitch.
    #[error("plane {plane} has slope {found}, but wall {wall} is pitched {expected}")]
    PlaneSlopeWrong {
        /// Index into `Roof::planes`.
        plane: usize,
        /// Global wall index.
        wall: usize,
        /// The wall's rise per run.
        expected: f64,
        /// The plane's rise per run.
        found: f64,
    },
    /// A plane's outline has fewer than 3 points, a point that is not
    /// finite, or no counter-clockwise area.
    #[error("plane {plane}'s outline is not a counter-clockwise polygon with area")]
    PlaneOutlineDegenerate {
        /// Index into `Roof::planes`.
        plane: usize,
    },
    /// Two edges of one plane's outline cross.
    #[error("plane {plane}'s outline crosses itself")]
    PlaneCrossesItself {
        /// Index into `Roof::planes`.
        plane: usize,
    },
    /// A plane's outline does not run along its wall line at height 0.
    #[error("plane {plane} does not run along the line of wall {wall} at height 0")]
    PlaneMissesItsWallLine {
        /// Index into `Roof::planes`.
        plane: usize,
        /// Global wall index.
        wall: usize,
    },
    /// A plane's outline runs along its wall but does not start at the
    /// wall's first corner (the one a counter-clockwise outline starts it at).
    #[error("plane {plane}'s outline does not start at wall {wall}'s first corner")]
    PlaneOutlineStartsElsewhere {
        /// Index into `Roof::planes`.
        plane: usize,
        /// Global wall index.
        wall: usize,
    },
    /// A point of a plane is not at `pitch * distance to the wall line`.
    #[error("point {point} of plane {plane} is at height {found}, not {expected}")]
    PointAtWrongHeight {
        /// Index into `Roof::planes`.
        plane: usize,
        /// Index into the plane's outline.
        point: usize,
        /// The height its wall line and pitch give.
        expected: f64,
        /// The height recorded.
        found: f64,
    },
    /// A point of a plane lies outside the outline.
    #[error("point {point} of plane {plane} lies outside the outline")]
    PlaneOutsideOutline {
        /// Index into `Roof::planes`.
        plane: usize,
        /// Index into the plane's outline.
        point: usize,
    },
    /// The planes' plan areas do not add up to the outline's area.
    #[error("the planes cover {planes_area} square inches of an outline of {outline_area}")]
    PlanesDoNotCoverOutline {
        /// The outline's roofed area.
        outline_area: f64,
        /// The sum of the planes' plan areas.
        planes_area: f64,
    },
    /// Two planes share some area in plan.
    #[error("planes {plane} and {other} overlap")]
    PlanesOverlap {
        /// Index into `Roof::planes`.
        plane: usize,
        /// Index into `Roof::planes`.
        other: usize,
    },
    /// Where two planes meet, their heights differ, and the gable faces
    /// standing there (if any) do not fill the step.
    ///
    /// A step is right in one place only: beside a gable at an inside
    /// corner. There the pitched wall's plane is at height 0 at the corner,
    /// while the plane over the gable's top next to the corner is not (the
    /// corner lies on no other pitched wall's line, and the pitched wall's
    /// own plane is below the wall line on the gable's side of the corner,
    /// since the corner is an inside one). So every roof made of the wall
    /// planes steps somewhere from that corner inward, and it does so at
    /// the gable's vertical face carried on along the gable's line.
    #[error("planes {plane} and {other} meet at {point} with heights {height} and {other_height}")]
    StepBetweenPlanes {
        /// Index into `Roof::planes`.
        plane: usize,
        /// Index into `Roof::planes`.
        other: usize,
        /// The plan point where they meet.
        point: DVec2,
        /// `plane`'s height there.
        height: f64,
        /// `other`'s height there.
        other_height: f64,
    },
    /// A point of a plane lies above the plane of another wall whose
    /// wavefront reaches it first. Decided for every wall when the outline
    /// is convex (the roof is then the lower envelope of all planes), and
    /// otherwise for walls of the steepest pitch seen straight along their
    /// normal (a roof can rise no faster than its steepest plane, so no
    /// point is higher than such a wall's plane).
    #[error("plane {plane} is at height {height} at {point}, where wall {wall}'s plane is lower at {lower}")]
    PointLowerOnOtherPlane {
        /// Index into `Roof::planes`.
        plane: usize,
        /// The wall whose plane is lower.
        wall: usize,
        /// The plan point.
        point: DVec2,
        /// `plane`'s height there.
        height: f64,
        /// The other wall's plane's height there.
        lower: f64,
    },
    /// A reported line does not lie along the shared edge of its planes.
    #[error("line {line} does not lie on the edge of wall {wall}'s plane")]
    LineNotOnBothPlanes {
        /// Index into `Roof::lines`.
        line: usize,
        /// The wall whose plane it misses.
        wall: usize,
    },
    /// A line reported as the wrong kind.
    #[error("line {line} is reported as a {found:?} but its planes make a {expected:?}")]
    LineKindWrong {
        /// Index into `Roof::lines`.
        line: usize,
        /// The kind reported.
        found: RoofLineKind,
        /// The kind its planes make.
        expected: RoofLineKind,
    },
    /// A line whose `from` end is higher than its `to` end.
    #[error("line {line} runs downward from its first end")]
    LineEndsReversed {
        /// Index into `Roof::lines`.
        line: usize,
    },
    /// Two planes that meet along an edge with no line reported there
    /// (and no gable face standing between them, nor a plane narrower than
    /// the tolerance with a line to each).
    #[error("planes {plane} and {other} meet with no ridge, hip or valley reported")]
    PlanesMeetWithoutLine {
        /// Index into `Roof::planes`.
        plane: usize,
        /// Index into `Roof::planes`.
        other: usize,
    },
    /// A gable wall without a gable face.
    #[error("gable wall {wall} has no gable face")]
    GableWithoutFace {
        /// Global wall index.
        wall: usize,
    },
    /// A gable face that does not stand on its wall: its first two points
    /// are not the wall's ends at height 0, a point is off the wall's line
    /// or below the wall line, or a point carried on past the wall's ends
    /// is outside the outline or not on the edge of a roof plane at that
    /// plane's height.
    #[error("gable face {face} does not stand on wall {wall}")]
    GableFaceOffWall {
        /// Index into `Roof::gables`.
        face: usize,
        /// The wall it names.
        wall: usize,
    },
}

/// A plane with everything the checks need worked out once.
struct Face {
    plane: usize,
    wall: usize,
    points: Vec<DVec2>,
    heights: Vec<f64>,
    /// The wall line, roofed area to its left.
    start: DVec2,
    end: DVec2,
    /// Unit normal pointing into the roofed area.
    inward: DVec2,
    slope: f64,
    min: DVec2,
    max: DVec2,
    /// A point strictly inside the plane's plan outline.
    interior: Option<DVec2>,
}

impl Face {
    fn height_at(&self, p: DVec2) -> f64 {
        self.slope * self.inward.dot(p - self.start)
    }

    fn edges(&self) -> impl Iterator<Item = (usize, DVec2, DVec2)> + '_ {
        let n = self.points.len();
        self.points
            .iter()
            .enumerate()
            .filter_map(move |(i, &a)| self.points.get((i + 1) % n).map(|&b| (i, a, b)))
    }

    /// The distance from `p` to the outline edge nearest it, and that
    /// edge's direction.
    fn nearest_edge(&self, p: DVec2) -> Option<(f64, DVec2)> {
        self.edges().map(|(_, a, b)| (distance_to_segment(p, a, b), b - a)).min_by(|x, y| x.0.total_cmp(&y.0))
    }

    fn on_boundary(&self, p: DVec2, tol: f64) -> bool {
        self.nearest_edge(p).is_some_and(|(d, _)| d <= tol)
    }

    /// Whether `p` is inside by more than `tol`.
    fn deeply_contains(&self, p: DVec2, tol: f64) -> bool {
        p.cmpge(self.min).all()
            && p.cmple(self.max).all()
            && ring_contains(&self.points, p)
            && !self.on_boundary(p, tol)
    }
}

/// A gable face seen from the side: where it stands in plan along its
/// wall's line, and its outline in that vertical plane.
struct GableSpan {
    /// The wall's first corner and unit direction along the wall.
    origin: DVec2,
    unit: DVec2,
    /// The face's plan extent along the line, from `origin`.
    lo: f64,
    hi: f64,
    /// The face's outline as (distance along the line, height).
    profile: Vec<(f64, f64)>,
}

impl GableSpan {
    /// The span of a gable face whose points all lie on its wall's line.
    fn new(outline: &[DVec3], a: DVec2, b: DVec2, tol: f64) -> Option<Self> {
        let unit = (b - a).normalize_or_zero();
        if unit == DVec2::ZERO || outline.len() < 3 {
            return None;
        }
        let mut profile = Vec::with_capacity(outline.len());
        for p in outline {
            if !p.is_finite() || distance_to_line(p.truncate(), a, unit) > tol {
                return None;
            }
            profile.push(((p.truncate() - a).dot(unit), p.z));
        }
        let lo = profile.iter().map(|q| q.0).fold(f64::INFINITY, f64::min);
        let hi = profile.iter().map(|q| q.0).fold(f64::NEG_INFINITY, f64::max);
        Some(Self { origin: a, unit, lo, hi, profile })
    }

    /// Where the face stands along its line, or `None` if `p` is off it.
    fn along(&self, p: DVec2, tol: f64) -> Option<f64> {
        let s = (p - self.origin).dot(self.unit);
        (distance_to_line(p, self.origin, self.unit) <= tol && s >= self.lo - tol && s <= self.hi + tol)
            .then_some(s)
    }

    /// The stretches of the plumb line at `s` that the face covers: its
    /// plumb edges there, and, a tolerance to either side (clear of any
    /// corner on the line itself), the stretches between its edges'
    /// crossings of the line taken in pairs.
    fn heights_at(&self, s: f64, tol: f64) -> Vec<(f64, f64)> {
        let n = self.profile.len();
        let edges = || (0..n).filter_map(|i| Some((*self.profile.get(i)?, *self.profile.get((i + 1) % n)?)));
        let mut covered: Vec<(f64, f64)> = edges()
            .filter(|&((s0, _), (s1, _))| (s0 - s).abs() <= tol && (s1 - s).abs() <= tol)
            .map(|((_, z0), (_, z1))| (z0.min(z1), z0.max(z1)))
            .collect();
        for side in [s - tol, s + tol] {
            let mut crossings: Vec<f64> = edges()
                .filter(|&((s0, _), (s1, _))| (s0 <= side && side < s1) || (s1 <= side && side < s0))
                .map(|((s0, z0), (s1, z1))| z0 + (z1 - z0) * (side - s0) / (s1 - s0))
                .collect();
            crossings.sort_by(f64::total_cmp);
            covered.extend(crossings.chunks_exact(2).map(|c| (c[0], c[1])));
        }
        covered
    }

    /// The heights the face covers on the plumb line at `p`, if it stands there.
    fn span_at(&self, p: DVec2, tol: f64) -> Vec<(f64, f64)> {
        self.along(p, tol).map(|s| self.heights_at(s, tol)).unwrap_or_default()
    }

    /// The part of the plan segment `p -> p + unit * [lo, hi]` (a stretch
    /// of a plane's edge) that the face stands on, as a length.
    fn covered(&self, p: DVec2, unit: DVec2, lo: f64, hi: f64, tol: f64) -> Option<(f64, f64)> {
        let (u, v) = (p + unit * lo, p + unit * hi);
        let (su, sv) = (self.along_line(u, tol)?, self.along_line(v, tol)?);
        // Parameter on the plane's edge of the face's two ends.
        let to_edge = |s: f64| lo + (s - su) / (sv - su) * (hi - lo);
        if (sv - su).abs() <= f64::MIN_POSITIVE {
            return None;
        }
        let (a, b) = (to_edge(self.lo), to_edge(self.hi));
        let (a, b) = (a.min(b).max(lo), a.max(b).min(hi));
        (b > a).then_some((a, b))
    }

    /// Distance along the line of a point on the line (anywhere on it).
    fn along_line(&self, p: DVec2, tol: f64) -> Option<f64> {
        (distance_to_line(p, self.origin, self.unit) <= tol).then(|| (p - self.origin).dot(self.unit))
    }

    /// The face's plan segment.
    fn segment(&self) -> (DVec2, DVec2) {
        (self.origin + self.unit * self.lo, self.origin + self.unit * self.hi)
    }
}

/// Whether the gable faces standing at `p` together fill the plumb line
/// between heights `z1` and `z2` (two faces in one vertical plane may
/// stand one above the other, where two gables' lines meet).
fn step_filled(spans: &[GableSpan], p: DVec2, z1: f64, z2: f64, tol: f64, height_tol: f64) -> bool {
    let mut ranges: Vec<(f64, f64)> = spans.iter().flat_map(|g| g.span_at(p, tol)).collect();
    ranges.sort_by(|a, b| a.0.total_cmp(&b.0));
    let (lo, hi) = (z1.min(z2), z1.max(z2));
    // Filled from `lo` up to `reach` so far.
    let mut reach = lo;
    for (a, b) in ranges {
        if a > reach + height_tol {
            break;
        }
        reach = reach.max(b);
    }
    reach >= hi - height_tol
}

/// Twice-halved shoelace area, positive when counter-clockwise.
fn signed_area(points: &[DVec2]) -> f64 {
    let Some(&origin) = points.first() else { return 0.0 };
    let n = points.len();
    let twice: f64 = (0..n)
        .filter_map(|i| Some((points.get(i)?, points.get((i + 1) % n)?)))
        .map(|(&p, &q)| (p - origin).perp_dot(q - origin))
        .sum();
    twice / 2.0
}

/// A point strictly inside a simple polygon: the middle of the widest
/// span of a horizontal line across it.
fn interior_point(points: &[DVec2], min: DVec2, max: DVec2) -> Option<DVec2> {
    // An odd fraction keeps the line off the vertices of ordinary outlines.
    let y = min.y + (max.y - min.y) * 0.512_345_678_9;
    let n = points.len();
    let mut xs: Vec<f64> = (0..n)
        .filter_map(|i| Some((*points.get(i)?, *points.get((i + 1) % n)?)))
        .filter(|(a, b)| (a.y > y) != (b.y > y))
        .map(|(a, b)| a.x + (y - a.y) / (b.y - a.y) * (b.x - a.x))
        .collect();
    xs.sort_by(f64::total_cmp);
    xs.chunks_exact(2)
        .max_by(|p, q| (p[1] - p[0]).total_cmp(&(q[1] - q[0])))
        .map(|span| DVec2::new((span[0] + span[1]) / 2.0, y))
}

/// The outline's walls for the checks, roofed area to the left.
struct Walls {
    lines: Vec<Option<(DVec2, DVec2)>>,
    slopes: Vec<Option<f64>>,
    rings: Vec<Vec<DVec2>>,
    grid: SegmentGrid,
    segments: Vec<(DVec2, DVec2)>,
}

impl Walls {
    fn new(outline: &Outline) -> Self {
        let count = outline.wall_count();
        let lines: Vec<Option<(DVec2, DVec2)>> = (0..count).map(|i| outline.wall_roof_on_left(i)).collect();
        let slopes = (0..count).map(|i| outline.wall_data(i).and_then(|w| w.roof.rise_per_run())).collect();
        let rings = std::iter::once(outline.outer())
            .chain(outline.courtyards().iter().map(Vec::as_slice))
            .map(|ring| ring.iter().map(|w| w.corner).collect())
            .collect();
        let segments: Vec<(DVec2, DVec2)> = (0..count).filter_map(|i| outline.wall(i)).collect();
        let grid = SegmentGrid::new(&segments, outline.tolerance());
        Self { lines, slopes, rings, grid, segments }
    }

    fn near_boundary(&self, p: DVec2, tol: f64) -> bool {
        let mut near = false;
        self.grid.for_each_near(p, |i| {
            if let Some(&(a, b)) = self.segments.get(i) {
                near |= distance_to_segment(p, a, b) <= tol;
            }
        });
        near
    }

    /// Exact point-in-roofed-area test: the ray to +x crosses the walls
    /// an odd number of times (courtyards lie inside the outer ring and
    /// apart, so this holds whichever way each ring was given).
    fn contains(&self, p: DVec2) -> bool {
        let mut odd = false;
        for i in self.grid.right_of(p) {
            let Some(&(a, b)) = self.segments.get(i) else { continue };
            if (a.y > p.y) != (b.y > p.y) {
                let (low, high) = if a.y < b.y { (a, b) } else { (b, a) };
                odd ^= orient(low, high, p) > 0.0;
            }
        }
        odd
    }

    /// Whether the segment from `q` on wall `from_wall` to `p` stays clear
    /// of every other wall.
    fn sees(&self, from_wall: usize, q: DVec2, p: DVec2) -> bool {
        self.segments
            .iter()
            .enumerate()
            .all(|(i, &(a, b))| i == from_wall || segments_meet(q, p, a, b) == Meeting::Apart)
    }

    /// Whether the outline is one ring turning the same way at every corner.
    fn convex(&self) -> bool {
        let [ring] = &self.rings[..] else { return false };
        let n = ring.len();
        let turns = (0..n)
            .filter_map(|i| Some(orient(*ring.get(i)?, *ring.get((i + 1) % n)?, *ring.get((i + 2) % n)?)));
        let (mut left, mut right) = (false, false);
        for turn in turns {
            left |= turn > 0.0;
            right |= turn < 0.0;
        }
        !(left && right)
    }
}

/// Checks a solved roof against its outline and lists every defect found
/// (empty for a correct roof).
pub fn check_roof(outline: &Outline, roof: &Roof) -> Vec<RoofDefect> {
    let mut defects = Vec::new();
    let tol = outline.tolerance();
    let walls = Walls::new(outline);
    let steepest = walls.slopes.iter().flatten().fold(0.0f64, |m, &s| m.max(s));
    let height_tol = 4.0 * tol * (1.0 + steepest);

    let faces = build_faces(roof, &walls, tol, height_tol, &mut defects);
    check_walls_have_planes(roof, &walls, &mut defects);
    check_coverage(outline, &faces, tol, &mut defects);
    let spans = check_gables(roof, &walls, &faces, tol, height_tol, &mut defects);
    let neighbours = check_pairs(&faces, &spans, tol, height_tol, &mut defects);
    check_lines(roof, &faces, &neighbours, tol, height_tol, &mut defects);
    check_envelope(&faces, &walls, &spans, steepest, tol, height_tol, &mut defects);
    defects
}

fn build_faces(
    roof: &Roof,
    walls: &Walls,
    tol: f64,
    height_tol: f64,
    defects: &mut Vec<RoofDefect>,
) -> Vec<Face> {
    let mut faces = Vec::with_capacity(roof.planes.len());
    for (plane, p) in roof.planes.iter().enumerate() {
        let wall = p.wall;
        let Some(&Some((start, end))) = walls.lines.get(wall) else {
            defects.push(RoofDefect::PlaneForUnknownWall { plane, wall });
            continue;
        };
        let Some(&Some(slope)) = walls.slopes.get(wall) else {
            defects.push(RoofDefect::PlaneForGableWall { plane, wall });
            continue;
        };
        if (p.rise_per_run - slope).abs() > 1e-9 * slope {
            defects.push(RoofDefect::PlaneSlopeWrong { plane, wall, expected: slope, found: p.rise_per_run });
        }
        let points: Vec<DVec2> = p.outline.iter().map(|q| q.truncate()).collect();
        let heights: Vec<f64> = p.outline.iter().map(|q| q.z).collect();
        let finite = p.outline.iter().all(|q| q.is_finite());
        if points.len() < 3 || !finite || signed_area(&points) <= 0.0 {
            defects.push(RoofDefect::PlaneOutlineDegenerate { plane });
            continue;
        }
        let (min, max) = points.iter().fold((points[0], points[0]), |(lo, hi), &q| (lo.min(q), hi.max(q)));
        let inward = (end - start).perp().normalize_or_zero();
        let interior = interior_point(&points, min, max);
        let face = Face { plane, wall, points, heights, start, end, inward, slope, min, max, interior };
        if crosses_itself(&face.points, tol) {
            defects.push(RoofDefect::PlaneCrossesItself { plane });
        }
        check_wall_line(&face, tol, height_tol, defects);
        for (point, (&q, &z)) in face.points.iter().zip(&face.heights).enumerate() {
            let expected = face.height_at(q);
            if (z - expected).abs() > height_tol {
                defects.push(RoofDefect::PointAtWrongHeight { plane, point, expected, found: z });
            }
            if !walls.near_boundary(q, tol) && !walls.contains(q) {
                defects.push(RoofDefect::PlaneOutsideOutline { plane, point });
            }
        }
        faces.push(face);
    }
    faces
}

/// Whether two edges of a polygon cross properly, each end of either edge
/// more than `tol` off the other's line (touching is left to the area and
/// overlap checks, since solvers may repeat collinear points; a crossing
/// shallower than the tolerance is a sliver's rounding, not a fold).
fn crosses_itself(points: &[DVec2], tol: f64) -> bool {
    let n = points.len();
    let edges: Vec<(DVec2, DVec2)> =
        (0..n).filter_map(|i| Some((*points.get(i)?, *points.get((i + 1) % n)?))).collect();
    let grid = SegmentGrid::new(&edges, 0.0);
    let mut crossed = false;
    grid.for_each_candidate_pair(|i, j| {
        if crossed || j == i + 1 || (i == 0 && j == n - 1) {
            return;
        }
        if let (Some(&(a, b)), Some(&(c, d))) = (edges.get(i), edges.get(j)) {
            crossed = segments_meet(a, b, c, d) == Meeting::Cross && cross_clearly(a, b, c, d, tol);
        }
    });
    crossed
}

fn check_wall_line(face: &Face, tol: f64, height_tol: f64, defects: &mut Vec<RoofDefect>) {
    let (plane, wall) = (face.plane, face.wall);
    let n = face.points.len();
    let at = |i: usize, target: DVec2| {
        face.points.get(i % n).is_some_and(|&p| p.distance(target) <= tol)
            && face.heights.get(i % n).is_some_and(|z| z.abs() <= height_tol)
    };
    let Some(first) = (0..n).find(|&i| at(i, face.start)) else {
        defects.push(RoofDefect::PlaneMissesItsWallLine { plane, wall });
        return;
    };
    // From the wall's first corner the outline must run along the wall,
    // through any points on it, to the wall's last corner.
    let mut reached = false;
    for step in 1..n {
        let i = first + step;
        if at(i, face.end) {
            reached = true;
            break;
        }
        let on_wall =
            face.points.get(i % n).is_some_and(|&p| distance_to_segment(p, face.start, face.end) <= tol)
                && face.heights.get(i % n).is_some_and(|z| z.abs() <= height_tol);
        if !on_wall {
            break;
        }
    }
    if !reached {
        defects.push(RoofDefect::PlaneMissesItsWallLine { plane, wall });
    } else if first != 0 {
        defects.push(RoofDefect::PlaneOutlineStartsElsewhere { plane, wall });
    }
}

fn check_walls_have_planes(roof: &Roof, walls: &Walls, defects: &mut Vec<RoofDefect>) {
    let mut owner: Vec<Option<usize>> = vec![None; walls.lines.len()];
    for (plane, p) in roof.planes.iter().enumerate() {
        if let Some(slot) = owner.get_mut(p.wall) {
            match *slot {
                Some(first) => {
                    defects.push(RoofDefect::WallWithManyPlanes { wall: p.wall, plane: first, other: plane })
                }
                None => *slot = Some(plane),
            }
        }
    }
    for (wall, (slot, slope)) in owner.iter().zip(&walls.slopes).enumerate() {
        if slot.is_none() && slope.is_some() {
            defects.push(RoofDefect::WallWithoutPlane { wall });
        }
    }
}

fn check_coverage(outline: &Outline, faces: &[Face], tol: f64, defects: &mut Vec<RoofDefect>) {
    let perimeter: f64 =
        (0..outline.wall_count()).filter_map(|i| outline.wall(i)).map(|(a, b)| a.distance(b)).sum();
    let outline_area = outline.area();
    let planes_area: f64 = faces.iter().map(|f| signed_area(&f.points)).sum();
    // A sliver one tolerance wide around every wall.
    if (planes_area - outline_area).abs() > tol * perimeter + 1e-9 * outline_area {
        defects.push(RoofDefect::PlanesDoNotCoverOutline { outline_area, planes_area });
    }
}

/// Two planes that share plan edge, with the stretches they share.
struct Neighbours {
    /// Indices into `Roof::planes`.
    planes: (usize, usize),
    /// The shared stretches in plan.
    stretches: Vec<(DVec2, DVec2)>,
}

/// Tests every pair of planes whose boxes meet; returns the pairs that
/// share an edge of positive length and are not one plane.
fn check_pairs(
    faces: &[Face],
    spans: &[GableSpan],
    tol: f64,
    height_tol: f64,
    defects: &mut Vec<RoofDefect>,
) -> Vec<Neighbours> {
    let mut order: Vec<usize> = (0..faces.len()).collect();
    order.sort_by(|&i, &j| faces[i].min.x.total_cmp(&faces[j].min.x));
    let mut neighbours = Vec::new();
    for (k, &i) in order.iter().enumerate() {
        let a = &faces[i];
        for &j in order.iter().skip(k + 1) {
            let b = &faces[j];
            if b.min.x > a.max.x + tol {
                break;
            }
            if b.min.y > a.max.y + tol || a.min.y > b.max.y + tol {
                continue;
            }
            check_pair(a, b, spans, tol, height_tol, defects, &mut neighbours);
        }
    }
    neighbours
}

fn check_pair(
    a: &Face,
    b: &Face,
    spans: &[GableSpan],
    tol: f64,
    height_tol: f64,
    defects: &mut Vec<RoofDefect>,
    neighbours: &mut Vec<Neighbours>,
) {
    let overlap = a.interior.is_some_and(|p| b.deeply_contains(p, tol))
        || b.interior.is_some_and(|p| a.deeply_contains(p, tol))
        || a.points.iter().any(|&p| b.deeply_contains(p, tol))
        || b.points.iter().any(|&p| a.deeply_contains(p, tol))
        || edges_cross_clearly(a, b, tol);
    if overlap {
        defects.push(RoofDefect::PlanesOverlap { plane: a.plane, other: b.plane });
    }
    // Heights must agree wherever one plane's point lies on the other's
    // edge, unless a gable face stands there spanning the step.
    let mut stepped = false;
    for (x, y) in [(a, b), (b, a)] {
        for (&p, &z) in x.points.iter().zip(&x.heights) {
            if stepped || !y.on_boundary(p, tol) {
                continue;
            }
            let other_height = y.height_at(p);
            if (z - other_height).abs() > height_tol
                && !step_filled(spans, p, z, other_height, tol, height_tol)
            {
                defects.push(RoofDefect::StepBetweenPlanes {
                    plane: x.plane,
                    other: y.plane,
                    point: p,
                    height: z,
                    other_height,
                });
                stepped = true;
            }
        }
    }
    if !same_plane(a, b, height_tol) {
        let stretches = shared_stretches(a, b, spans, tol);
        let length: f64 = stretches.iter().map(|(u, v)| u.distance(*v)).sum();
        if length > 2.0 * tol {
            neighbours.push(Neighbours { planes: (a.plane, b.plane), stretches });
        }
    }
}

/// Whether an edge of `a` crosses an edge of `b` with both more than `tol`
/// from the crossing on each side.
fn edges_cross_clearly(a: &Face, b: &Face, tol: f64) -> bool {
    a.edges().any(|(_, p, q)| b.edges().any(|(_, r, s)| cross_clearly(p, q, r, s, tol)))
}

/// Whether segments `p q` and `r s` cross with both ends of each more than
/// `tol` from the other's line.
fn cross_clearly(p: DVec2, q: DVec2, r: DVec2, s: DVec2, tol: f64) -> bool {
    let side =
        |u: DVec2, v: DVec2, w: DVec2| (v - u).perp_dot(w - u) / (v - u).length().max(f64::MIN_POSITIVE);
    let (d1, d2) = (side(p, q, r), side(p, q, s));
    let (d3, d4) = (side(r, s, p), side(r, s, q));
    d1 * d2 < 0.0 && d3 * d4 < 0.0 && d1.abs().min(d2.abs()) > tol && d3.abs().min(d4.abs()) > tol
}

/// The stretches along which an edge of `a` runs on an edge of `b` with
/// no gable face standing between them.
fn shared_stretches(a: &Face, b: &Face, spans: &[GableSpan], tol: f64) -> Vec<(DVec2, DVec2)> {
    let mut out = Vec::new();
    for (_, p, q) in a.edges() {
        let dir = q - p;
        let len = dir.length();
        if len <= tol {
            continue;
        }
        let unit = dir / len;
        for (_, r, s) in b.edges() {
            if distance_to_line(r, p, unit) > tol || distance_to_line(s, p, unit) > tol {
                continue;
            }
            let (t0, t1) = ((r - p).dot(unit), (s - p).dot(unit));
            let lo = t0.min(t1).max(0.0);
            let hi = t0.max(t1).min(len);
            if hi <= lo {
                continue;
            }
            let mut covered: Vec<(f64, f64)> =
                spans.iter().filter_map(|g| g.covered(p, unit, lo, hi, tol)).collect();
            covered.sort_by(|x, y| x.0.total_cmp(&y.0));
            let mut reach = lo;
            for (c0, c1) in covered {
                if c0 > reach {
                    out.push((p + unit * reach, p + unit * c0));
                }
                reach = reach.max(c1);
            }
            if hi > reach {
                out.push((p + unit * reach, p + unit * hi));
            }
        }
    }
    out
}

fn distance_to_line(p: DVec2, origin: DVec2, unit: DVec2) -> f64 {
    unit.perp_dot(p - origin).abs()
}

/// Whether two faces lie in one plane (walls in line at one pitch).
fn same_plane(a: &Face, b: &Face, height_tol: f64) -> bool {
    (a.inward * a.slope - b.inward * b.slope).length() <= 1e-9 * (a.slope + b.slope)
        && a.height_at(b.start).abs() <= height_tol
}

fn check_lines(
    roof: &Roof,
    faces: &[Face],
    neighbours: &[Neighbours],
    tol: f64,
    height_tol: f64,
    defects: &mut Vec<RoofDefect>,
) {
    let by_wall: HashMap<usize, &Face> = faces.iter().map(|f| (f.wall, f)).collect();
    // A line may name any wall of a plane shared by walls in line; the
    // solver gives them one `plane_group`, and each is confirmed here.
    let group_of = |face: &Face| roof.planes.get(face.plane).map_or(face.wall, |p| p.plane_group);
    let mut by_group: HashMap<usize, Vec<&Face>> = HashMap::new();
    for face in faces {
        by_group.entry(group_of(face)).or_default().push(face);
    }
    for members in by_group.values_mut() {
        members.sort_by_key(|f| f.wall);
    }
    let group = |wall: usize| -> Vec<&Face> {
        let Some(&face) = by_wall.get(&wall) else { return Vec::new() };
        let shared = by_group.get(&group_of(face)).map_or(&[][..], Vec::as_slice);
        std::iter::once(face)
            .chain(shared.iter().copied().filter(|f| f.wall != face.wall && same_plane(face, f, height_tol)))
            .collect()
    };
    let mut reported: HashSet<(usize, usize)> = HashSet::new();
    for (index, line) in roof.lines.iter().enumerate() {
        if line.from.z > line.to.z + height_tol {
            defects.push(RoofDefect::LineEndsReversed { line: index });
        }
        let mid = (line.from + line.to) / 2.0;
        let mut sides = Vec::with_capacity(2);
        let mut groups = Vec::with_capacity(2);
        for wall in line.walls {
            let members = group(wall);
            let on = !members.is_empty()
                && [line.from, line.to, mid].iter().all(|p| {
                    members.iter().any(|face| {
                        face.on_boundary(p.truncate(), tol)
                            && (face.height_at(p.truncate()) - p.z).abs() <= height_tol
                    })
                });
            if !on {
                defects.push(RoofDefect::LineNotOnBothPlanes { line: index, wall });
                continue;
            }
            // The face lies to the left of its own edge along the line;
            // the line's middle may be a corner of other edges too. Of the
            // edges along it, the nearest: a plane narrower than the
            // tolerance has edges on both sides of the line within it.
            //
            // An edge runs along the line where it turns from it by no more
            // than the tolerance over their common length: an edge of
            // length `e` at angle `a` to a line of plan length `l` moves
            // `min(e, l) * sin(a)` off it. A fixed angle bound would drop
            // the very edge a sliver shares with the line when that edge
            // ends a hair (under the tolerance) from the line's end, so a
            // long line leaves it more than the angle, and keep only the
            // sliver's far edge, on the wrong side of the line: the kind
            // would then be judged from the wrong plane.
            let along_line = (line.to - line.from).truncate();
            let along = along_line.normalize_or_zero();
            let ends = [line.from.truncate(), line.to.truncate(), mid.truncate()];
            let edge = members
                .iter()
                .flat_map(|f| f.edges().map(move |(_, a, b)| (*f, a, b)))
                .filter(|&(_, a, b)| {
                    let dir = (b - a).normalize_or_zero();
                    let common = (b - a).length().min(along_line.length());
                    dir.perp_dot(along).abs() * common <= tol
                        && distance_to_segment(mid.truncate(), a, b) <= tol
                })
                .map(|(f, a, b)| {
                    let off: f64 = ends.iter().map(|&x| distance_to_segment(x, a, b)).sum();
                    (off, f, (b - a).perp())
                })
                .min_by(|x, y| x.0.total_cmp(&y.0));
            if let Some((off, face, into)) = edge {
                sides.push((face, into, off));
            }
            groups.push(members);
        }
        if let [group_a, group_b] = &groups[..] {
            for x in group_a {
                for y in group_b {
                    reported.insert((x.plane.min(y.plane), x.plane.max(y.plane)));
                }
            }
        }
        if let [(fa, into_a, off_a), (fb, into_b, off_b)] = &sides[..] {
            // Which side of the line plane `fa` lies on, read from the
            // plane whose edge fits the line more closely. On a line not
            // much longer than the tolerance one plane's edge may be the
            // line itself while the other plane wraps the line's end
            // within the tolerance: at the tip of a thin wedge both edges
            // of the wedge run within the tolerance of the line, the line
            // may lie between them, and the nearer of the two can be the
            // one on the far side (long-run seed 1029986: plane 14's tip
            // round a valley 0.017 in long to plane 16, whose edge is the
            // valley to the bit; plane 14's outline drops the valley's
            // upper end, 5e-5 in off its edge). The other plane lies on
            // the far side of its own edge along the line.
            let into_a = if off_a <= off_b { *into_a } else { -*into_b };
            let rise_into_a = (fa.inward * fa.slope - fb.inward * fb.slope).dot(into_a.normalize_or_zero());
            // The planes' line of intersection, from their normals: its
            // slope tells a ridge (level) from a hip, whatever the ends say.
            let normal = |f: &Face| DVec3::new(-f.slope * f.inward.x, -f.slope * f.inward.y, 1.0);
            let direction = normal(fa).cross(normal(fb));
            let line_slope = direction.z.abs() / direction.truncate().length().max(f64::MIN_POSITIVE);
            // Below the other plane on its own side: the crease sheds water.
            let expected = if rise_into_a.abs() <= 1e-9 * (fa.slope + fb.slope) {
                None
            } else if rise_into_a > 0.0 {
                Some(RoofLineKind::Valley)
            } else if line_slope <= LEVEL_SLOPE {
                Some(RoofLineKind::Ridge)
            } else if line_slope >= SLOPED_SLOPE {
                Some(RoofLineKind::Hip)
            } else {
                // Between the two a solver may call it either.
                matches!(line.kind, RoofLineKind::Valley).then_some(RoofLineKind::Hip)
            };
            if let Some(expected) = expected
                && expected != line.kind
            {
                defects.push(RoofDefect::LineKindWrong { line: index, found: line.kind, expected });
            }
        }
    }
    let known = |x: usize, y: usize| reported.contains(&(x.min(y), x.max(y)));
    for n in neighbours {
        let (p, q) = n.planes;
        if known(p, q) {
            continue;
        }
        // Two planes within the tolerance of each other along a stretch
        // where others run too, joined to both by lines: slivers narrower
        // than the tolerance lie between them, side by side where walls
        // a hair long follow one another nearly in line, and their lines
        // stand for the one the two planes would have (a stretch may pass
        // from one such sliver to the next). A sliver counts when lines
        // lead from it to each of the two planes through planes along the
        // stretch.
        let samples = |&(u, v): &(DVec2, DVec2)| [u, v, (u + v) / 2.0];
        let along: Vec<&Face> = faces
            .iter()
            .filter(|c| c.plane != p && c.plane != q)
            .filter(|c| n.stretches.iter().flat_map(samples).any(|x| c.on_boundary(x, tol)))
            .collect();
        let reached_from = |start: usize| {
            let mut seen: HashSet<usize> = HashSet::new();
            let mut work = vec![start];
            while let Some(x) = work.pop() {
                for c in &along {
                    if known(x, c.plane) && seen.insert(c.plane) {
                        work.push(c.plane);
                    }
                }
            }
            seen
        };
        let (from_p, from_q) = (reached_from(p), reached_from(q));
        let between: Vec<&Face> = along
            .iter()
            .copied()
            .filter(|c| from_p.contains(&c.plane) && from_q.contains(&c.plane))
            .collect();
        let sliver =
            n.stretches.iter().flat_map(samples).all(|x| between.iter().any(|c| c.on_boundary(x, tol)));
        if !sliver {
            defects.push(RoofDefect::PlanesMeetWithoutLine { plane: p.min(q), other: p.max(q) });
        }
    }
}

fn check_envelope(
    faces: &[Face],
    walls: &Walls,
    spans: &[GableSpan],
    steepest: f64,
    tol: f64,
    height_tol: f64,
    defects: &mut Vec<RoofDefect>,
) {
    let convex = walls.convex();
    let limit = if convex { CONVEX_ENVELOPE_WALL_LIMIT } else { ENVELOPE_WALL_LIMIT };
    if walls.lines.len() > limit {
        return;
    }
    for face in faces {
        let n = face.points.len();
        let samples = face
            .points
            .iter()
            .copied()
            .chain((0..n).filter_map(|i| Some((*face.points.get(i)? + *face.points.get((i + 1) % n)?) / 2.0)))
            .chain(face.interior);
        'samples: for p in samples {
            let height = face.height_at(p);
            for (wall, (line, slope)) in walls.lines.iter().zip(&walls.slopes).enumerate() {
                let (Some((a, b)), Some(slope)) = (line, slope) else { continue };
                if wall == face.wall || (!convex && *slope < steepest) {
                    continue;
                }
                let dir = *b - *a;
                let inward = dir.perp().normalize_or_zero();
                let lower = slope * inward.dot(p - *a);
                if lower >= height - height_tol {
                    continue;
                }
                if !convex {
                    let t = (p - *a).dot(dir) / dir.length_squared();
                    let foot = *a + dir * t;
                    // The roof may jump up at a gable face, so the bound
                    // holds only along a path that keeps clear of every one.
                    let clear = walls.sees(wall, foot, p)
                        && spans.iter().all(|g| {
                            let (c, d) = g.segment();
                            segments_meet(foot, p, c, d) == Meeting::Apart
                                && distance_to_segment(p, c, d) > tol
                                && distance_to_segment(foot, c, d) > tol
                                && distance_to_segment(c, foot, p) > tol
                                && distance_to_segment(d, foot, p) > tol
                        });
                    if !(t > 0.0 && t < 1.0) || lower <= 0.0 || !clear {
                        continue;
                    }
                }
                defects.push(RoofDefect::PointLowerOnOtherPlane {
                    plane: face.plane,
                    wall,
                    point: p,
                    height,
                    lower,
                });
                break 'samples;
            }
        }
    }
}

/// Checks that every gable wall has a face standing on it; returns the
/// faces that do, for the checks of steps and neighbours.
fn check_gables(
    roof: &Roof,
    walls: &Walls,
    faces: &[Face],
    tol: f64,
    height_tol: f64,
    defects: &mut Vec<RoofDefect>,
) -> Vec<GableSpan> {
    for (wall, (line, slope)) in walls.lines.iter().zip(&walls.slopes).enumerate() {
        if slope.is_none() && line.is_some() && !roof.gables.iter().any(|g| g.wall == wall) {
            defects.push(RoofDefect::GableWithoutFace { wall });
        }
    }
    let mut spans = Vec::new();
    for (face, gable) in roof.gables.iter().enumerate() {
        let off = || RoofDefect::GableFaceOffWall { face, wall: gable.wall };
        let Some(&Some((a, b))) = walls.lines.get(gable.wall) else {
            defects.push(off());
            continue;
        };
        let at = |p: Option<&DVec3>, q: DVec2| {
            p.is_some_and(|p| p.truncate().distance(q) <= tol && p.z.abs() <= height_tol)
        };
        let (first, second) = (gable.outline.first(), gable.outline.get(1));
        let ends = (at(first, a) && at(second, b)) || (at(first, b) && at(second, a));
        // Past the wall's ends the face stands on the roof beside it: inside
        // the outline, each corner on the edge of a plane at its height.
        let standing = gable.outline.iter().all(|p| {
            let q = p.truncate();
            if p.z < -height_tol {
                return false;
            }
            if distance_to_segment(q, a, b) <= tol {
                return true;
            }
            (walls.near_boundary(q, tol) || walls.contains(q))
                && faces.iter().any(|f| f.on_boundary(q, tol) && (f.height_at(q) - p.z).abs() <= height_tol)
        });
        match GableSpan::new(&gable.outline, a, b, tol) {
            Some(span) if ends && standing => spans.push(span),
            _ => defects.push(off()),
        }
    }
    spans
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::{GableFace, RoofLine, RoofPlane, Wall, WallRoof};

    /// 6 in 12, common practice, no source.
    const PITCH: f64 = 0.5;

    fn outline(points: &[(f64, f64)], gables: &[usize]) -> Outline {
        let walls = points
            .iter()
            .enumerate()
            .map(|(i, &(x, y))| Wall {
                corner: DVec2::new(x, y),
                roof: if gables.contains(&i) {
                    WallRoof::Gable
                } else {
                    WallRoof::Pitched { rise_per_run: PITCH }
                },
                overhang_in: 0.0,
            })
            .collect();
        Outline::new(walls, vec![]).unwrap()
    }

    fn plane(wall: usize, points: &[(f64, f64, f64)]) -> RoofPlane {
        let outline: Vec<DVec3> = points.iter().map(|&(x, y, z)| DVec3::new(x, y, z)).collect();
        RoofPlane { wall, rise_per_run: PITCH, eave_outline: outline.clone(), outline, plane_group: wall }
    }

    fn line(kind: RoofLineKind, from: (f64, f64, f64), to: (f64, f64, f64), walls: [usize; 2]) -> RoofLine {
        RoofLine { kind, from: DVec3::new(from.0, from.1, from.2), to: DVec3::new(to.0, to.1, to.2), walls }
    }

    /// A 40 x 30 ft hip roof at 6 in 12, worked by hand: the hips run at
    /// 45 degrees in plan from each corner, meeting the ridge 180 in in
    /// from each end wall at y = 180, height 0.5 * 180 = 90.
    fn hip_rectangle() -> (Outline, Roof) {
        let outline = outline(&[(0.0, 0.0), (480.0, 0.0), (480.0, 360.0), (0.0, 360.0)], &[]);
        let roof = Roof {
            planes: vec![
                plane(0, &[(0.0, 0.0, 0.0), (480.0, 0.0, 0.0), (300.0, 180.0, 90.0), (180.0, 180.0, 90.0)]),
                plane(1, &[(480.0, 0.0, 0.0), (480.0, 360.0, 0.0), (300.0, 180.0, 90.0)]),
                plane(
                    2,
                    &[(480.0, 360.0, 0.0), (0.0, 360.0, 0.0), (180.0, 180.0, 90.0), (300.0, 180.0, 90.0)],
                ),
                plane(3, &[(0.0, 360.0, 0.0), (0.0, 0.0, 0.0), (180.0, 180.0, 90.0)]),
            ],
            lines: vec![
                line(RoofLineKind::Hip, (0.0, 0.0, 0.0), (180.0, 180.0, 90.0), [3, 0]),
                line(RoofLineKind::Hip, (480.0, 0.0, 0.0), (300.0, 180.0, 90.0), [0, 1]),
                line(RoofLineKind::Hip, (480.0, 360.0, 0.0), (300.0, 180.0, 90.0), [1, 2]),
                line(RoofLineKind::Hip, (0.0, 360.0, 0.0), (180.0, 180.0, 90.0), [2, 3]),
                line(RoofLineKind::Ridge, (180.0, 180.0, 90.0), (300.0, 180.0, 90.0), [0, 2]),
            ],
            gables: vec![],
        };
        (outline, roof)
    }

    /// The same rectangle with gables on the 30 ft ends: two planes meet at
    /// a ridge over the middle, 90 in up (derivation as above).
    fn gable_rectangle() -> (Outline, Roof) {
        let outline = outline(&[(0.0, 0.0), (480.0, 0.0), (480.0, 360.0), (0.0, 360.0)], &[1, 3]);
        let roof = Roof {
            planes: vec![
                plane(0, &[(0.0, 0.0, 0.0), (480.0, 0.0, 0.0), (480.0, 180.0, 90.0), (0.0, 180.0, 90.0)]),
                plane(2, &[(480.0, 360.0, 0.0), (0.0, 360.0, 0.0), (0.0, 180.0, 90.0), (480.0, 180.0, 90.0)]),
            ],
            lines: vec![line(RoofLineKind::Ridge, (0.0, 180.0, 90.0), (480.0, 180.0, 90.0), [0, 2])],
            gables: vec![
                GableFace {
                    wall: 1,
                    outline: vec![
                        DVec3::new(480.0, 0.0, 0.0),
                        DVec3::new(480.0, 360.0, 0.0),
                        DVec3::new(480.0, 180.0, 90.0),
                    ],
                },
                GableFace {
                    wall: 3,
                    outline: vec![
                        DVec3::new(0.0, 360.0, 0.0),
                        DVec3::new(0.0, 0.0, 0.0),
                        DVec3::new(0.0, 180.0, 90.0),
                    ],
                },
            ],
        };
        (outline, roof)
    }

    /// An L of two 200 in wide arms at 6 in 12, worked by hand: ridges on
    /// each arm's centre line 100 in in (height 50), a valley from the
    /// inside corner (200, 200) to where they meet at (100, 100).
    fn hip_l() -> (Outline, Roof) {
        let outline = outline(
            &[(0.0, 0.0), (400.0, 0.0), (400.0, 200.0), (200.0, 200.0), (200.0, 400.0), (0.0, 400.0)],
            &[],
        );
        let roof = Roof {
            planes: vec![
                plane(0, &[(0.0, 0.0, 0.0), (400.0, 0.0, 0.0), (300.0, 100.0, 50.0), (100.0, 100.0, 50.0)]),
                plane(1, &[(400.0, 0.0, 0.0), (400.0, 200.0, 0.0), (300.0, 100.0, 50.0)]),
                plane(
                    2,
                    &[(400.0, 200.0, 0.0), (200.0, 200.0, 0.0), (100.0, 100.0, 50.0), (300.0, 100.0, 50.0)],
                ),
                plane(
                    3,
                    &[(200.0, 200.0, 0.0), (200.0, 400.0, 0.0), (100.0, 300.0, 50.0), (100.0, 100.0, 50.0)],
                ),
                plane(4, &[(200.0, 400.0, 0.0), (0.0, 400.0, 0.0), (100.0, 300.0, 50.0)]),
                plane(5, &[(0.0, 400.0, 0.0), (0.0, 0.0, 0.0), (100.0, 100.0, 50.0), (100.0, 300.0, 50.0)]),
            ],
            lines: vec![
                line(RoofLineKind::Hip, (0.0, 0.0, 0.0), (100.0, 100.0, 50.0), [5, 0]),
                line(RoofLineKind::Hip, (400.0, 0.0, 0.0), (300.0, 100.0, 50.0), [0, 1]),
                line(RoofLineKind::Hip, (400.0, 200.0, 0.0), (300.0, 100.0, 50.0), [1, 2]),
                line(RoofLineKind::Valley, (200.0, 200.0, 0.0), (100.0, 100.0, 50.0), [2, 3]),
                line(RoofLineKind::Hip, (200.0, 400.0, 0.0), (100.0, 300.0, 50.0), [3, 4]),
                line(RoofLineKind::Hip, (0.0, 400.0, 0.0), (100.0, 300.0, 50.0), [4, 5]),
                line(RoofLineKind::Ridge, (100.0, 100.0, 50.0), (300.0, 100.0, 50.0), [0, 2]),
                line(RoofLineKind::Ridge, (100.0, 100.0, 50.0), (100.0, 300.0, 50.0), [3, 5]),
            ],
            gables: vec![],
        };
        (outline, roof)
    }

    /// A 240 x 200 in house with gable ends (walls 1, 5 and 7) and an
    /// 80 in wide wing on its right-hand gable end, 120 in long with a
    /// gable end of its own (wall 3), all pitched walls at 6 in 12, worked
    /// by hand. The main ridge runs along y = 100 at 0.5 * 100 = 50; the
    /// wing's along y = 100 at 0.5 * 40 = 20. The wing's planes start at
    /// height 0 at the inside corners (240, 60) and (240, 140), where the
    /// main planes are 0.5 * 60 = 30 high, so the main gable face carries
    /// on along x = 240 above the wing's planes to the wing's ridge: a wing
    /// whose roof dies into the gable wall.
    fn gable_wing() -> (Outline, Roof) {
        let outline = outline(
            &[
                (0.0, 0.0),
                (240.0, 0.0),
                (240.0, 60.0),
                (360.0, 60.0),
                (360.0, 140.0),
                (240.0, 140.0),
                (240.0, 200.0),
                (0.0, 200.0),
            ],
            &[1, 3, 5, 7],
        );
        let face = |wall, points: &[(f64, f64, f64)]| GableFace {
            wall,
            outline: points.iter().map(|&(x, y, z)| DVec3::new(x, y, z)).collect(),
        };
        let roof = Roof {
            planes: vec![
                plane(0, &[(0.0, 0.0, 0.0), (240.0, 0.0, 0.0), (240.0, 100.0, 50.0), (0.0, 100.0, 50.0)]),
                plane(
                    2,
                    &[(240.0, 60.0, 0.0), (360.0, 60.0, 0.0), (360.0, 100.0, 20.0), (240.0, 100.0, 20.0)],
                ),
                plane(
                    4,
                    &[(360.0, 140.0, 0.0), (240.0, 140.0, 0.0), (240.0, 100.0, 20.0), (360.0, 100.0, 20.0)],
                ),
                plane(6, &[(240.0, 200.0, 0.0), (0.0, 200.0, 0.0), (0.0, 100.0, 50.0), (240.0, 100.0, 50.0)]),
            ],
            lines: vec![
                line(RoofLineKind::Ridge, (0.0, 100.0, 50.0), (240.0, 100.0, 50.0), [0, 6]),
                line(RoofLineKind::Ridge, (240.0, 100.0, 20.0), (360.0, 100.0, 20.0), [2, 4]),
            ],
            gables: vec![
                face(1, &[(240.0, 0.0, 0.0), (240.0, 60.0, 0.0), (240.0, 100.0, 20.0), (240.0, 100.0, 50.0)]),
                face(3, &[(360.0, 60.0, 0.0), (360.0, 140.0, 0.0), (360.0, 100.0, 20.0)]),
                face(
                    5,
                    &[(240.0, 140.0, 0.0), (240.0, 200.0, 0.0), (240.0, 100.0, 50.0), (240.0, 100.0, 20.0)],
                ),
                face(7, &[(0.0, 200.0, 0.0), (0.0, 0.0, 0.0), (0.0, 100.0, 50.0)]),
            ],
        };
        (outline, roof)
    }

    #[test]
    fn a_wing_dying_into_a_gable_face_passes() {
        let (outline, roof) = gable_wing();
        assert_eq!(check_roof(&outline, &roof), vec![]);
    }

    #[test]
    fn a_step_with_no_gable_face_over_it_is_found() {
        // The main gable faces cut back to their walls: nothing stands over
        // the step between the main planes (30 to 50 in) and the wing's
        // (0 to 20 in) along x = 240, so the planes neither meet nor close.
        let (outline, mut roof) = gable_wing();
        roof.gables[0].outline =
            vec![DVec3::new(240.0, 0.0, 0.0), DVec3::new(240.0, 60.0, 0.0), DVec3::new(240.0, 60.0, 30.0)];
        roof.gables[2].outline = vec![
            DVec3::new(240.0, 140.0, 0.0),
            DVec3::new(240.0, 200.0, 0.0),
            DVec3::new(240.0, 140.0, 30.0),
        ];
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::StepBetweenPlanes { .. })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlanesMeetWithoutLine { .. })));
    }

    #[test]
    fn a_gable_face_too_short_for_its_step_is_found() {
        // The face over the wing stops at 40 in, below the main plane's
        // 50 in at the wing's ridge, and its corner there is on no plane.
        let (outline, mut roof) = gable_wing();
        roof.gables[0].outline[3].z = 40.0;
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::GableFaceOffWall { face: 0, wall: 1 })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::StepBetweenPlanes { .. })));
    }

    #[test]
    fn a_gable_face_carried_past_an_outside_corner_is_found() {
        // Wall 7's face carried on 20 in past corner 0, outside the house.
        let (outline, mut roof) = gable_wing();
        roof.gables[3].outline.insert(2, DVec3::new(0.0, -20.0, 10.0));
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::GableFaceOffWall { face: 3, wall: 7 })));
    }

    #[test]
    fn two_gable_faces_one_above_the_other_fill_a_step() {
        // Two faces on the line y = 0, seen from the side: one from 0 to
        // 40 in high at x = 50, the other from 38 to 100 in.
        let face = |points: &[(f64, f64)]| -> Vec<DVec3> {
            points.iter().map(|&(x, z)| DVec3::new(x, 0.0, z)).collect()
        };
        let (a, b) = (DVec2::new(0.0, 0.0), DVec2::new(100.0, 0.0));
        let low = GableSpan::new(&face(&[(0.0, 0.0), (100.0, 0.0), (100.0, 40.0), (0.0, 40.0)]), a, b, 1e-3);
        let high =
            GableSpan::new(&face(&[(0.0, 38.0), (100.0, 38.0), (100.0, 100.0), (0.0, 100.0)]), a, b, 1e-3);
        let gap =
            GableSpan::new(&face(&[(0.0, 45.0), (100.0, 45.0), (100.0, 100.0), (0.0, 100.0)]), a, b, 1e-3);
        let (low, high, gap) = (low.unwrap(), high.unwrap(), gap.unwrap());
        let p = DVec2::new(50.0, 0.0);
        assert!(step_filled(&[low, high], p, 10.0, 90.0, 1e-3, 1e-3));
        let low = GableSpan::new(&face(&[(0.0, 0.0), (100.0, 0.0), (100.0, 40.0), (0.0, 40.0)]), a, b, 1e-3);
        // 40 to 45 in is left open, and a point off the faces' line stands on neither.
        assert!(!step_filled(&[low.unwrap(), gap], p, 10.0, 90.0, 1e-3, 1e-3));
        let low =
            GableSpan::new(&face(&[(0.0, 0.0), (100.0, 0.0), (100.0, 100.0), (0.0, 100.0)]), a, b, 1e-3);
        assert!(!step_filled(&[low.unwrap()], DVec2::new(50.0, 1.0), 10.0, 90.0, 1e-3, 1e-3));
    }

    #[test]
    fn a_gable_face_with_a_gap_on_the_plumb_line_does_not_fill_a_step_across_it() {
        // A face shaped like a C on the line y = 0: at x = 50 it covers 0
        // to 30 in and 60 to 90 in, not the 30 in between.
        let c = [
            (0.0, 0.0),
            (100.0, 0.0),
            (100.0, 30.0),
            (20.0, 30.0),
            (20.0, 60.0),
            (100.0, 60.0),
            (100.0, 90.0),
            (0.0, 90.0),
        ];
        let outline: Vec<DVec3> = c.iter().map(|&(x, z)| DVec3::new(x, 0.0, z)).collect();
        let span = || GableSpan::new(&outline, DVec2::ZERO, DVec2::new(100.0, 0.0), 1e-3).unwrap();
        let p = DVec2::new(50.0, 0.0);
        assert!(step_filled(&[span()], p, 10.0, 25.0, 1e-3, 1e-3));
        assert!(step_filled(&[span()], p, 65.0, 85.0, 1e-3, 1e-3));
        assert!(!step_filled(&[span()], p, 10.0, 80.0, 1e-3, 1e-3));
        // At x = 20 the face's plumb edge joins the two.
        assert!(step_filled(&[span()], DVec2::new(20.0, 0.0), 10.0, 80.0, 1e-3, 1e-3));
    }

    /// Long-run seed 790: planes 0 and 2 lie within the tolerance of each
    /// other, with plane 1 between them as a sliver about 0.002 in wide.
    fn sliver_roof() -> (Outline, Roof) {
        let outline = crate::random_outline(crate::OutlineShape::Orthogonal, 790);
        let roof = Roof::solve(&outline).unwrap();
        (outline, roof)
    }

    #[test]
    fn a_sliver_with_its_lines_stands_between_two_planes() {
        let (outline, roof) = sliver_roof();
        assert_eq!(check_roof(&outline, &roof), vec![]);
    }

    #[test]
    fn a_sliver_without_its_lines_leaves_planes_meeting_without_one() {
        let (outline, mut roof) = sliver_roof();
        // Every line of plane 2, gone: now nothing with a line to plane 2
        // stands between it and plane 0.
        roof.lines.retain(|l| !l.walls.contains(&2));
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlanesMeetWithoutLine { plane: 0, other: 2 })));
    }

    #[test]
    fn the_kind_of_a_line_along_a_sliver_is_still_checked() {
        // Seed 9079259970648893793: plane 1 is a sliver 0.00004 in wide
        // along the valley between walls 1 and 2 (a valley: corner 2 is an
        // inside corner). Its far edge runs within the tolerance of the
        // line too; the check reads the kind from the nearer edge.
        let outline = crate::random_outline(crate::OutlineShape::Orthogonal, 9_079_259_970_648_893_793);
        let mut roof = Roof::solve(&outline).unwrap();
        assert_eq!(check_roof(&outline, &roof), vec![]);
        let valley = roof.lines.iter().position(|l| l.walls == [1, 2]).unwrap();
        assert_eq!(roof.lines[valley].kind, RoofLineKind::Valley);
        roof.lines[valley].kind = RoofLineKind::Hip;
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(
            d,
            RoofDefect::LineKindWrong { found: RoofLineKind::Hip, expected: RoofLineKind::Valley, .. }
        )));
    }

    fn has(defects: &[RoofDefect], pick: impl Fn(&RoofDefect) -> bool) -> bool {
        defects.iter().any(pick)
    }

    #[test]
    fn hand_worked_roofs_pass() {
        for (outline, roof) in [hip_rectangle(), gable_rectangle(), hip_l(), gable_wing()] {
            assert_eq!(check_roof(&outline, &roof), vec![]);
        }
    }

    #[test]
    fn a_clockwise_outline_keeps_the_roof_valid() {
        let (_, roof) = hip_rectangle();
        // The same rectangle given clockwise: wall 0 now runs (0,0)-(0,360).
        let cw = outline(&[(0.0, 0.0), (0.0, 360.0), (480.0, 360.0), (480.0, 0.0)], &[]);
        // Wall i of the clockwise ring is wall (3 - i) of the other, reversed.
        let mut renumbered = roof.clone();
        for p in &mut renumbered.planes {
            p.wall = 3 - p.wall;
        }
        for l in &mut renumbered.lines {
            l.walls = [3 - l.walls[0], 3 - l.walls[1]];
        }
        assert_eq!(check_roof(&cw, &renumbered), vec![]);
    }

    #[test]
    fn a_missing_plane_is_found() {
        let (outline, mut roof) = hip_rectangle();
        roof.planes.remove(1);
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::WallWithoutPlane { wall: 1 })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlanesDoNotCoverOutline { .. })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::LineNotOnBothPlanes { wall: 1, .. })));
    }

    #[test]
    fn a_raised_ridge_is_found() {
        let (outline, mut roof) = hip_rectangle();
        roof.planes[0].outline[2].z = 100.0;
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::PointAtWrongHeight { plane: 0, point: 2, .. })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::StepBetweenPlanes { .. })));
    }

    #[test]
    fn a_wrong_slope_is_found() {
        let (outline, mut roof) = hip_rectangle();
        roof.planes[3].rise_per_run = 0.75;
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlaneSlopeWrong { plane: 3, wall: 3, .. })));
    }

    #[test]
    fn wrong_line_kinds_and_directions_are_found() {
        let (outline, mut roof) = hip_l();
        roof.lines[3].kind = RoofLineKind::Hip;
        roof.lines[6].kind = RoofLineKind::Hip;
        let hip = &mut roof.lines[0];
        std::mem::swap(&mut hip.from, &mut hip.to);
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(
            d,
            RoofDefect::LineKindWrong { line: 3, expected: RoofLineKind::Valley, .. }
        )));
        assert!(has(&defects, |d| matches!(
            d,
            RoofDefect::LineKindWrong { line: 6, expected: RoofLineKind::Ridge, .. }
        )));
        assert!(has(&defects, |d| matches!(d, RoofDefect::LineEndsReversed { line: 0 })));
    }

    #[test]
    fn a_line_on_the_wrong_planes_or_none_is_found() {
        let (outline, mut roof) = hip_rectangle();
        roof.lines[4].walls = [0, 1];
        roof.lines.remove(0);
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::LineNotOnBothPlanes { line: 3, wall: 1 })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlanesMeetWithoutLine { plane: 0, other: 3 })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlanesMeetWithoutLine { plane: 0, other: 2 })));
    }

    #[test]
    fn a_plane_pushed_into_its_neighbours_overlaps() {
        let (outline, mut roof) = hip_rectangle();
        // The end triangle's apex moved 50 in along the ridge, at the
        // height its own plane gives there: 0.5 * (480 - 250) = 115.
        roof.planes[1].outline[2] = DVec3::new(250.0, 180.0, 115.0);
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlanesOverlap { .. })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlanesDoNotCoverOutline { .. })));
    }

    #[test]
    fn outlines_that_miss_their_wall_or_start_elsewhere() {
        let (outline, mut roof) = hip_rectangle();
        roof.planes[1].outline.rotate_left(1);
        roof.planes[3].outline.reverse();
        roof.planes[0].outline[1].x = 470.0;
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlaneOutlineStartsElsewhere { plane: 1, .. })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlaneOutlineDegenerate { plane: 3 })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlaneMissesItsWallLine { plane: 0, .. })));
    }

    #[test]
    fn a_gable_roof_over_a_hip_outline_is_above_the_end_planes() {
        // The gable roof's planes laid over an outline whose ends are pitched.
        let (_, gable_roof) = gable_rectangle();
        let (hip_outline, _) = hip_rectangle();
        let defects = check_roof(&hip_outline, &gable_roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::PointLowerOnOtherPlane { wall: 1 | 3, .. })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::WallWithoutPlane { wall: 1 })));
    }

    #[test]
    fn a_plane_for_a_gable_and_a_missing_gable_face() {
        let (outline, mut roof) = gable_rectangle();
        roof.gables.remove(0);
        roof.planes.push(plane(3, &[(0.0, 360.0, 0.0), (0.0, 0.0, 0.0), (10.0, 180.0, 5.0)]));
        roof.gables[0].outline[1].x = 5.0;
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::GableWithoutFace { wall: 1 })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlaneForGableWall { plane: 2, wall: 3 })));
        assert!(has(&defects, |d| matches!(d, RoofDefect::GableFaceOffWall { face: 0, wall: 3 })));
    }

    #[test]
    fn a_plane_outside_the_outline_is_found() {
        let (outline, mut roof) = hip_l();
        // Plane 2's ridge end pulled out past the end wall.
        roof.planes[2].outline[3] = DVec3::new(450.0, 100.0, 50.0);
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::PlaneOutsideOutline { plane: 2, point: 3 })));
    }

    #[test]
    fn the_steepest_wall_bounds_a_non_convex_roof() {
        // Plane 0 of the L stretched to (350, 150), at its own height there
        // (0.5 * 150 = 75): wall 2's plane, seen straight across from
        // (400, 150), is only 0.5 * 50 = 25 high at that point.
        let (outline, mut roof) = hip_l();
        roof.planes[0].outline[2] = DVec3::new(350.0, 150.0, 75.0);
        let defects = check_roof(&outline, &roof);
        assert!(has(&defects, |d| matches!(d, RoofDefect::PointLowerOnOtherPlane { plane: 0, wall: 1, .. })));
    }
}
