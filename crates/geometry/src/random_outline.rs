//! Seeded outline generators for property tests, fuzzing and long runs.
//!
//! The same shape, seed and features always give the same outline, on
//! every machine: the generator uses its own small random source
//! (splitmix64) and only basic `f64` arithmetic. Every outline returned has
//! passed [`Outline::new`]; a draw that fails validation is thrown away and
//! drawn again ([`random_outline_or_refusal`] hands back a gable drawn
//! nearly in line with a pitched wall as the refusal it is).

use glam::DVec2;

use crate::{GABLE_TURN_MIN_DEG, Outline, OutlineError, Wall, WallRoof};

/// Which family of outlines to draw from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum OutlineShape {
    /// Rectilinear outlines: a set of cells of an uneven grid, or a comb.
    Orthogonal,
    /// Star-shaped outlines: corners at increasing angles round a centre.
    Star,
}

/// The awkward details a generated outline may carry.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct OutlineFeatures {
    /// Walls split into two or three in one straight line (same pitch).
    pub collinear_runs: bool,
    /// Corners cut off by a wall just above the tolerance long.
    pub tiny_edges: bool,
    /// Walls bent by a hair, so two neighbours are nearly parallel.
    pub near_parallel: bool,
    /// A pitch of its own for each wall (2/12 to 18/12) instead of one for all.
    pub mixed_pitches: bool,
    /// Some walls gables (never all).
    pub gables: bool,
    /// A square-ish courtyard, where one fits.
    pub courtyard: bool,
}

impl OutlineFeatures {
    /// No awkward details: one pitch, no gables, no courtyard.
    pub const PLAIN: Self = Self {
        collinear_runs: false,
        tiny_edges: false,
        near_parallel: false,
        mixed_pitches: false,
        gables: false,
        courtyard: false,
    };

    /// Every detail switched on.
    pub const ALL: Self = Self {
        collinear_runs: true,
        tiny_edges: true,
        near_parallel: true,
        mixed_pitches: true,
        gables: true,
        courtyard: true,
    };

    /// Each detail on or off by a fair draw from the seed.
    pub fn from_seed(seed: u64) -> Self {
        let mut rng = SplitMix64::new(seed ^ 0x5EED_F0F0_1234_ABCD);
        Self {
            collinear_runs: rng.chance(0.5),
            tiny_edges: rng.chance(0.3),
            near_parallel: rng.chance(0.3),
            mixed_pitches: rng.chance(0.5),
            gables: rng.chance(0.3),
            courtyard: rng.chance(0.2),
        }
    }
}

/// An outline of the given shape with details drawn from the seed.
pub fn random_outline(shape: OutlineShape, seed: u64) -> Outline {
    random_outline_with(shape, seed, OutlineFeatures::from_seed(seed))
}

/// An outline of the given shape and details from the seed.
pub fn random_outline_with(shape: OutlineShape, seed: u64, features: OutlineFeatures) -> Outline {
    let mut rng = SplitMix64::new(seed);
    let mut attempt = 0u32;
    // A plain outline of either shape is valid by construction, so after
    // enough failed draws with the details the loop ends on the next.
    loop {
        let use_features = if attempt < 64 { features } else { OutlineFeatures::PLAIN };
        attempt += 1;
        if let Ok(outline) = draw(shape, use_features, &mut rng) {
            return outline;
        }
    }
}

/// As [`random_outline_with`], but the first draw refused for what a
/// person could have drawn (a gable nearly in line with a pitched wall,
/// [`OutlineError::GableNearlyInLine`], or a courtyard too small for its
/// overhangs, [`OutlineError::CourtyardTooSmallForOverhangs`]) is handed
/// back with its message instead of drawn again, so a long run can count
/// such plans as refused.
pub fn random_outline_or_refusal(
    shape: OutlineShape,
    seed: u64,
    features: OutlineFeatures,
) -> Result<Outline, OutlineError> {
    let mut rng = SplitMix64::new(seed);
    let mut attempt = 0u32;
    loop {
        let use_features = if attempt < 64 { features } else { OutlineFeatures::PLAIN };
        attempt += 1;
        match draw(shape, use_features, &mut rng) {
            Ok(outline) => return Ok(outline),
            Err(
                e @ (OutlineError::GableNearlyInLine { .. }
                | OutlineError::CourtyardTooSmallForOverhangs { .. }),
            ) => return Err(e),
            Err(_) => {}
        }
    }
}

/// The corners of a star for speed measurements and tests: `n` corners
/// at equal angles round the origin (anticlockwise from the +x axis), each
/// at a radius drawn between `radius` and twice it. About half of them are
/// inside corners. The draws come from a plain 64-bit linear congruential
/// generator seeded with `seed`, so the solve benchmark's plans stay the
/// same whatever the other generators here do.
pub fn star_corners(n: usize, seed: u64, radius: f64) -> Vec<DVec2> {
    let mut rng = Lcg(seed);
    (0..n)
        .map(|i| {
            let a = std::f64::consts::TAU * i as f64 / n as f64;
            let r = radius + radius * rng.next();
            DVec2::new(r * a.cos(), r * a.sin())
        })
        .collect()
}

/// The corners of an orthogonal comb for speed measurements and tests: a
/// spine 100 in deep along the x axis with `teeth` teeth 48 in wide and 48
/// in apart, each of a depth from 100 to 400 in, whole inches, drawn as
/// [`star_corners`] draws (many teeth share a depth, so many events of the
/// solve fall at one height). `4 * teeth + 2` corners, anticlockwise.
pub fn comb_corners(teeth: usize, seed: u64) -> Vec<DVec2> {
    let mut rng = Lcg(seed);
    let w = 48.0;
    let mut points = vec![DVec2::new(0.0, 0.0), DVec2::new(2.0 * w * teeth as f64, 0.0)];
    for i in (0..teeth).rev() {
        let depth = 100.0 + (300.0 * rng.next()).round();
        let x0 = 2.0 * w * i as f64;
        points.push(DVec2::new(x0 + 2.0 * w, 100.0 + depth));
        points.push(DVec2::new(x0 + w, 100.0 + depth));
        points.push(DVec2::new(x0 + w, 100.0));
        points.push(DVec2::new(x0, 100.0));
    }
    points
}

/// The 64-bit linear congruential generator of [`star_corners`] and
/// [`comb_corners`] (Knuth's MMIX constants), giving numbers in [0, 1).
struct Lcg(u64);

impl Lcg {
    fn next(&mut self) -> f64 {
        self.0 = self.0.wrapping_mul(6364136223846793005).wrapping_add(1442695040888963407);
        (self.0 >> 11) as f64 / (1u64 << 53) as f64
    }
}

fn draw(
    shape: OutlineShape,
    features: OutlineFeatures,
    rng: &mut SplitMix64,
) -> Result<Outline, OutlineError> {
    let mut points = match shape {
        // A grid draw that gives no outline is a draw to throw away, like
        // any other refused here; the error's kind is never shown.
        OutlineShape::Orthogonal => {
            orthogonal_points(rng, features.collinear_runs).ok_or(OutlineError::OutlineHasNoArea)?
        }
        OutlineShape::Star => star_points(rng),
    };
    let (min, max) = bounds(&points);
    let tolerance = crate::outline::TOLERANCE_PER_SIZE * (max - min).max_element();
    if features.collinear_runs {
        points = split_walls(&points, rng);
    }
    if features.near_parallel {
        points = bend_walls(&points, rng);
    }
    if features.tiny_edges {
        points = cut_corners(&points, tolerance, rng);
    }
    if rng.chance(0.3) {
        points.reverse();
    }
    let outer = roof_walls(&points, features, rng);
    let mut courtyards = Vec::new();
    if features.courtyard {
        // Keep the first courtyard that fits; without one, the outline
        // stands alone. One too small for its overhangs is kept: a person
        // could draw it, and it is refused with its message.
        for _ in 0..20 {
            let ring = courtyard_points(min, max, shape, rng);
            let walls = roof_walls(&ring, OutlineFeatures { gables: false, ..features }, rng);
            match Outline::new(outer.clone(), vec![walls.clone()]) {
                Ok(_) | Err(OutlineError::CourtyardTooSmallForOverhangs { .. }) => {
                    courtyards.push(walls);
                    break;
                }
                Err(_) => {}
            }
        }
    }
    Outline::new(outer, courtyards)
}

fn bounds(points: &[DVec2]) -> (DVec2, DVec2) {
    points.iter().fold((DVec2::splat(f64::INFINITY), DVec2::splat(f64::NEG_INFINITY)), |(lo, hi), &p| {
        (lo.min(p), hi.max(p))
    })
}

/// Grid lines: even spacing or each gap drawn on its own.
fn grid_lines(count: usize, rng: &mut SplitMix64) -> Vec<f64> {
    let even = rng.chance(0.3);
    let step = rng.range(60.0, 240.0);
    let mut lines = vec![0.0];
    let mut at = 0.0;
    for _ in 0..count {
        at += if even { step } else { rng.range(40.0, 300.0) };
        lines.push(at);
    }
    lines
}

/// A rectilinear outline: a connected set of grid cells without holes or
/// corner-only contacts, traced counter-clockwise.
fn orthogonal_points(rng: &mut SplitMix64, keep_straight_corners: bool) -> Option<Vec<DVec2>> {
    let cols = 2 + rng.below(5);
    let rows = 2 + rng.below(5);
    let mut filled = vec![false; cols * rows];
    if rng.chance(0.3) {
        // A comb: a full bottom row with teeth of random height.
        for c in 0..cols {
            let height = if c % 2 == 0 { 1 + rng.below(rows) } else { 1 };
            for r in 0..height {
                filled[r * cols + c] = true;
            }
        }
    } else {
        let target = 1 + rng.below(cols * rows);
        let start = rng.below(cols * rows);
        filled[start] = true;
        let mut count = 1;
        let mut tries = 0;
        while count < target && tries < 1000 {
            tries += 1;
            let cell = rng.below(cols * rows);
            if filled[cell] {
                continue;
            }
            let (c, r) = (cell % cols, cell / cols);
            let touches = (c > 0 && filled[cell - 1])
                || (c + 1 < cols && filled[cell + 1])
                || (r > 0 && filled[cell - cols])
                || (r + 1 < rows && filled[cell + cols]);
            if touches {
                filled[cell] = true;
                count += 1;
            }
        }
    }
    if has_hole_or_pinch(&filled, cols, rows) {
        return None;
    }
    let xs = grid_lines(cols, rng);
    let ys = grid_lines(rows, rng);
    trace_cells(&filled, cols, rows, &xs, &ys, keep_straight_corners, rng)
}

fn has_hole_or_pinch(filled: &[bool], cols: usize, rows: usize) -> bool {
    let at = |c: isize, r: isize| {
        c >= 0
            && r >= 0
            && (c as usize) < cols
            && (r as usize) < rows
            && filled[r as usize * cols + c as usize]
    };
    for r in -1..rows as isize {
        for c in -1..cols as isize {
            let (a, b, d, e) = (at(c, r), at(c + 1, r), at(c, r + 1), at(c + 1, r + 1));
            if (a && e && !b && !d) || (b && d && !a && !e) {
                return true;
            }
        }
    }
    // Flood the empty cells from outside a one-cell border; any left
    // unreached form a hole.
    let (w, h) = (cols + 2, rows + 2);
    let mut seen = vec![false; w * h];
    let mut stack = vec![0usize];
    seen[0] = true;
    while let Some(i) = stack.pop() {
        let (c, r) = ((i % w) as isize - 1, (i / w) as isize - 1);
        for (dc, dr) in [(1, 0), (-1, 0), (0, 1), (0, -1)] {
            let (nc, nr) = (c + dc, r + dr);
            if nc < -1 || nr < -1 || nc > cols as isize || nr > rows as isize || at(nc, nr) {
                continue;
            }
            let j = (nr + 1) as usize * w + (nc + 1) as usize;
            if !seen[j] {
                seen[j] = true;
                stack.push(j);
            }
        }
    }
    (0..rows).any(|r| (0..cols).any(|c| !filled[r * cols + c] && !seen[(r + 1) * w + c + 1]))
}

fn trace_cells(
    filled: &[bool],
    cols: usize,
    rows: usize,
    xs: &[f64],
    ys: &[f64],
    keep_straight_corners: bool,
    rng: &mut SplitMix64,
) -> Option<Vec<DVec2>> {
    // Boundary edges of the cell set, each cell's sides counter-clockwise,
    // keyed by their start on the grid.
    let mut next: std::collections::HashMap<(usize, usize), (usize, usize)> = Default::default();
    let inside = |c: isize, r: isize| {
        c >= 0
            && r >= 0
            && (c as usize) < cols
            && (r as usize) < rows
            && filled[r as usize * cols + c as usize]
    };
    for r in 0..rows {
        for c in 0..cols {
            if !filled[r * cols + c] {
                continue;
            }
            let (ci, ri) = (c as isize, r as isize);
            if !inside(ci, ri - 1) {
                next.insert((c, r), (c + 1, r));
            }
            if !inside(ci + 1, ri) {
                next.insert((c + 1, r), (c + 1, r + 1));
            }
            if !inside(ci, ri + 1) {
                next.insert((c + 1, r + 1), (c, r + 1));
            }
            if !inside(ci - 1, ri) {
                next.insert((c, r + 1), (c, r));
            }
        }
    }
    let start = *next.keys().min()?;
    let mut ring = vec![start];
    let mut at = *next.get(&start)?;
    while at != start {
        ring.push(at);
        at = *next.get(&at)?;
        if ring.len() > next.len() {
            return None;
        }
    }
    if ring.len() != next.len() {
        return None;
    }
    let n = ring.len();
    let mut points = Vec::with_capacity(n);
    for (i, &(c, r)) in ring.iter().enumerate() {
        let (pc, pr) = ring[(i + n - 1) % n];
        let (nc, nr) = ring[(i + 1) % n];
        let straight = (pc == c && c == nc) || (pr == r && r == nr);
        if !straight || (keep_straight_corners && rng.chance(0.3)) {
            points.push(DVec2::new(*xs.get(c)?, *ys.get(r)?));
        }
    }
    Some(points)
}

/// A star-shaped outline round the origin, counter-clockwise.
fn star_points(rng: &mut SplitMix64) -> Vec<DVec2> {
    let n = if rng.chance(0.2) { 3 + rng.below(60) } else { 3 + rng.below(14) };
    let radius = rng.range(100.0, 1000.0);
    let spiky = rng.chance(0.3);
    let turn = rng.range(0.0, std::f64::consts::TAU);
    let step = std::f64::consts::TAU / n as f64;
    (0..n)
        .map(|i| {
            let angle = turn + step * (i as f64 + rng.range(-0.4, 0.4));
            let r = if spiky && i % 2 == 1 { rng.range(0.3, 0.6) } else { rng.range(0.6, 1.0) } * radius;
            DVec2::new(angle.cos(), angle.sin()) * r
        })
        .collect()
}

/// Splits some walls into two or three pieces along the same line.
fn split_walls(points: &[DVec2], rng: &mut SplitMix64) -> Vec<DVec2> {
    let n = points.len();
    let mut out = Vec::with_capacity(n * 2);
    for (i, &a) in points.iter().enumerate() {
        out.push(a);
        if rng.chance(0.25) {
            let b = points[(i + 1) % n];
            let pieces = 2 + rng.below(2);
            for k in 1..pieces {
                out.push(a.lerp(b, k as f64 / pieces as f64 + rng.range(-0.1, 0.1)));
            }
        }
    }
    out
}

/// Bends some walls at their middle by a hair, in or out.
fn bend_walls(points: &[DVec2], rng: &mut SplitMix64) -> Vec<DVec2> {
    let n = points.len();
    let mut out = Vec::with_capacity(n * 2);
    for (i, &a) in points.iter().enumerate() {
        out.push(a);
        if rng.chance(0.25) {
            let b = points[(i + 1) % n];
            let side = if rng.chance(0.5) { 1.0 } else { -1.0 };
            // Bends of 1e-4 to 2e-3 of the wall length: angles far above
            // the straight-corner test and far below anything drawn on purpose.
            let offset = (b - a).perp() * side * rng.range(1e-4, 2e-3);
            out.push(a.lerp(b, rng.range(0.3, 0.7)) + offset);
        }
    }
    out
}

/// Cuts some corners off with a wall 1.5 to 3 tolerances long.
fn cut_corners(points: &[DVec2], tolerance: f64, rng: &mut SplitMix64) -> Vec<DVec2> {
    let n = points.len();
    let mut out = Vec::with_capacity(n * 2);
    for (i, &c) in points.iter().enumerate() {
        if !rng.chance(0.2) {
            out.push(c);
            continue;
        }
        let before = (c - points[(i + n - 1) % n]).normalize_or_zero();
        let after = (points[(i + 1) % n] - c).normalize_or_zero();
        let spread = (before + after).length().max(0.2);
        let back = rng.range(1.5, 3.0) * tolerance / spread;
        out.push(c - before * back);
        out.push(c + after * back);
    }
    out
}

/// A square-ish ring somewhere in the box, given either way round.
fn courtyard_points(min: DVec2, max: DVec2, shape: OutlineShape, rng: &mut SplitMix64) -> Vec<DVec2> {
    let size = max - min;
    let side = size.min_element() * rng.range(0.05, 0.25);
    let centre = min + size * DVec2::new(rng.range(0.2, 0.8), rng.range(0.2, 0.8));
    let half = DVec2::new(side, side * rng.range(0.7, 1.3)) / 2.0;
    let angle = if shape == OutlineShape::Orthogonal { 0.0 } else { rng.range(0.0, 1.5) };
    let (s, c) = angle.sin_cos();
    let mut ring: Vec<DVec2> = [(-1.0, -1.0), (1.0, -1.0), (1.0, 1.0), (-1.0, 1.0)]
        .iter()
        .map(|&(x, y)| {
            let p = DVec2::new(x * half.x, y * half.y);
            centre + DVec2::new(c * p.x - s * p.y, s * p.x + c * p.y)
        })
        .collect();
    if rng.chance(0.5) {
        ring.reverse();
    }
    ring
}

/// Walls on the ring with pitches, gables and overhangs; walls in one
/// straight line share their roof, as validation requires.
fn roof_walls(points: &[DVec2], features: OutlineFeatures, rng: &mut SplitMix64) -> Vec<Wall> {
    let n = points.len();
    let common = pitch(rng);
    let mut roofs: Vec<WallRoof> = (0..n)
        .map(|_| WallRoof::Pitched { rise_per_run: if features.mixed_pitches { pitch(rng) } else { common } })
        .collect();
    if features.gables && n > 1 {
        let count = 1 + rng.below((n / 4).max(1));
        for _ in 0..count {
            roofs[rng.below(n)] = WallRoof::Gable;
        }
    }
    // Carry each roof along straight runs, starting from a real corner so
    // a run is never split by the ring's seam.
    let straight = |i: usize| {
        let into = points[i] - points[(i + n - 1) % n];
        let out = points[(i + 1) % n] - points[i];
        into.dot(out) > 0.0 && into.perp_dot(out).abs() <= 1e-6 * into.length() * out.length()
    };
    if let Some(first) = (0..n).find(|&i| !straight(i)) {
        for k in 1..n {
            let i = (first + k) % n;
            if straight(i) {
                roofs[i] = roofs[(i + n - 1) % n];
            }
        }
    }
    if features.gables {
        carry_gables_round_slight_turns(points, &mut roofs);
    }
    if roofs.iter().all(|r| *r == WallRoof::Gable) {
        roofs = vec![WallRoof::Pitched { rise_per_run: common }; n];
    }
    points
        .iter()
        .zip(roofs)
        .map(|(&corner, roof)| Wall { corner, roof, overhang_in: rng.range(0.0, 24.0).round() })
        .collect()
}

/// Makes a gable's neighbour a gable too where the two walls turn by less
/// than [`GABLE_TURN_MIN_DEG`]: a wall bent by a hair is one wall to the
/// person drawing it, who gives both halves the gable, where a gable beside
/// a pitched wall so nearly in line is refused by [`Outline::new`].
fn carry_gables_round_slight_turns(points: &[DVec2], roofs: &mut [WallRoof]) {
    let n = points.len();
    let slight = |i: usize| {
        let into = points[i] - points[(i + n - 1) % n];
        let out = points[(i + 1) % n] - points[i];
        let sine = into.perp_dot(out).abs() / (into.length() * out.length());
        into.dot(out) > 0.0 && sine < GABLE_TURN_MIN_DEG.to_radians().sin()
    };
    // Corner i joins wall i - 1 to wall i; each pass carries a gable one
    // wall further along a run of slight turns, so n passes settle it.
    for _ in 0..n {
        let mut changed = false;
        for i in 0..n {
            let before = (i + n - 1) % n;
            let one_gable = (roofs[before] == WallRoof::Gable) != (roofs[i] == WallRoof::Gable);
            if one_gable && slight(i) {
                roofs[before] = WallRoof::Gable;
                roofs[i] = WallRoof::Gable;
                changed = true;
            }
        }
        if !changed {
            break;
        }
    }
}

/// A pitch from 2 in 12 to 18 in 12, mostly whole inches of rise.
fn pitch(rng: &mut SplitMix64) -> f64 {
    let rise = if rng.chance(0.8) { (2 + rng.below(17)) as f64 } else { rng.range(2.0, 18.0) };
    rise / 12.0
}

/// The splitmix64 generator: tiny, fast and the same everywhere.
struct SplitMix64 {
    state: u64,
}

impl SplitMix64 {
    fn new(seed: u64) -> Self {
        Self { state: seed }
    }

    fn next_u64(&mut self) -> u64 {
        self.state = self.state.wrapping_add(0x9E37_79B9_7F4A_7C15);
        let mut z = self.state;
        z = (z ^ (z >> 30)).wrapping_mul(0xBF58_476D_1CE4_E5B9);
        z = (z ^ (z >> 27)).wrapping_mul(0x94D0_49BB_1331_11EB);
        z ^ (z >> 31)
    }

    /// Uniform in [0, 1).
    fn unit(&mut self) -> f64 {
        (self.next_u64() >> 11) as f64 / (1u64 << 53) as f64
    }

    fn range(&mut self, lo: f64, hi: f64) -> f64 {
        lo + (hi - lo) * self.unit()
    }

    fn chance(&mut self, p: f64) -> bool {
        self.unit() < p
    }

    /// Uniform in `0..n`; 0 when `n` is 0.
    fn below(&mut self, n: usize) -> usize {
        if n == 0 { 0 } else { (self.next_u64() % n as u64) as usize }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn the_same_seed_gives_the_same_outline() {
        for shape in [OutlineShape::Orthogonal, OutlineShape::Star] {
            for seed in 0..50 {
                assert_eq!(random_outline(shape, seed), random_outline(shape, seed));
            }
        }
    }

    #[test]
    fn orthogonal_outlines_have_only_square_corners() {
        for seed in 0..200 {
            let outline = random_outline_with(OutlineShape::Orthogonal, seed, OutlineFeatures::PLAIN);
            for i in 0..outline.wall_count() {
                let (a, b) = outline.wall(i).unwrap();
                assert!(a.x == b.x || a.y == b.y, "seed {seed} wall {i}");
            }
        }
    }

    #[test]
    fn details_appear_across_seeds() {
        let (mut gables, mut courtyards, mut clockwise, mut mixed) = (0, 0, 0, 0);
        for seed in 0..300 {
            let outline = random_outline_with(OutlineShape::Star, seed, OutlineFeatures::ALL);
            let walls: Vec<_> =
                (0..outline.wall_count()).map(|i| outline.wall_data(i).unwrap().roof).collect();
            gables += walls.contains(&WallRoof::Gable) as usize;
            assert!(walls.iter().any(|r| *r != WallRoof::Gable));
            courtyards += !outline.courtyards().is_empty() as usize;
            clockwise += !outline.is_counter_clockwise() as usize;
            mixed += walls.windows(2).any(|w| w[0] != w[1]) as usize;
        }
        assert!(
            gables > 100 && courtyards > 30 && clockwise > 30 && mixed > 100,
            "{gables} {courtyards} {clockwise} {mixed}"
        );
    }

    #[test]
    fn tiny_edges_sit_just_above_the_tolerance() {
        let mut shortest_ratio = f64::INFINITY;
        for seed in 0..200 {
            let features = OutlineFeatures { tiny_edges: true, ..OutlineFeatures::PLAIN };
            let outline = random_outline_with(OutlineShape::Orthogonal, seed, features);
            for i in 0..outline.wall_count() {
                let (a, b) = outline.wall(i).unwrap();
                shortest_ratio = shortest_ratio.min(a.distance(b) / outline.tolerance());
            }
        }
        assert!((1.0..4.0).contains(&shortest_ratio), "{shortest_ratio}");
    }

    #[test]
    fn bent_walls_with_gables_are_drawn_as_a_person_would() {
        // A gable beside a pitched wall turned by less than a degree is
        // refused by `Outline::new`; the generator gives both halves of a
        // bent wall the gable instead, so such draws are neither refused
        // nor thrown away, while gables next to bent walls still appear.
        let features = OutlineFeatures { near_parallel: true, gables: true, ..OutlineFeatures::PLAIN };
        let mut gabled_bends = 0;
        for seed in 0..400 {
            for shape in [OutlineShape::Orthogonal, OutlineShape::Star] {
                let outline = random_outline_or_refusal(shape, seed, features)
                    .unwrap_or_else(|e| panic!("seed {seed} {shape:?}: {e}"));
                let walls = outline.outer();
                let n = walls.len();
                for i in 0..n {
                    let (prev, wall, next) = (&walls[(i + n - 1) % n], &walls[i], &walls[(i + 1) % n]);
                    let (into, out) = (wall.corner - prev.corner, next.corner - wall.corner);
                    let sine = into.perp_dot(out).abs() / (into.length() * out.length());
                    let both_gables = prev.roof == WallRoof::Gable && wall.roof == WallRoof::Gable;
                    if into.dot(out) > 0.0 && sine > 1e-6 && sine < 0.01 && both_gables {
                        gabled_bends += 1;
                    }
                }
            }
        }
        assert!(gabled_bends > 20, "{gabled_bends}");
    }
}
