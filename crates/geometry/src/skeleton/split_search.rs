//! The full split search: the earliest wall lines a reflex vertex's path
//! runs into, found in a tree of the lines so that most of them are ruled
//! out a node at a time.
//!
//! Each node of the tree holds a set of lines, with a cone holding their
//! normals and the ranges of their speeds and of their offsets measured
//! from the outline's middle; from these and the vertex's path the search
//! works out a height below which no line of the node can be met (see
//! [`LineBlocks::bound`]). A node is halved across the normals' angles or
//! across the offsets, whichever spread is the wider, down to leaves of
//! [`LEAF`] lines. The search goes down the tree nearer half first and,
//! once the earliest few candidates are known, passes over every node
//! whose bound is past the last of them. On a star outline a reflex
//! vertex runs towards the middle and crosses nearly every line there, at
//! nearly one height: the bound at the middle tells the lines apart by
//! their offsets, and near the vertex by their angles.
//!
//! What the search keeps, and whether it says later candidates were left
//! out, are exactly those of testing every line, to the bit: each height
//! comes from the same expression ([`split_heights`]), the bound has
//! margins far beyond any rounding, ties are kept in the lines' order, and
//! when nothing else shows that a later candidate exists, the nodes passed
//! over are tested until one is found.

use glam::DVec2;

use super::lines::WallLine;

/// How many split candidates a reflex vertex keeps at a time; the rest are
/// recomputed only if all of these turn out not to happen.
pub(crate) const SPLIT_CANDIDATES_KEPT: usize = 16;

/// Relative margin on the bound's terms, a million times any rounding of
/// the heights and of the bound itself.
const MARGIN: f64 = 1e-9;

/// A reflex vertex's path as the full split search reads it.
#[derive(Debug, Clone, Copy)]
pub(crate) struct Ray {
    /// Plan position at `t0`.
    pub anchor: DVec2,
    /// Plan velocity per unit of height.
    pub vel: DVec2,
    /// Height at which the vertex started.
    pub t0: f64,
    /// Candidates before this height are not wanted.
    pub after: f64,
    /// The point tolerance.
    pub tol: f64,
}

/// Writes into `times` the height at which `ray` meets each line of
/// `columns` (normal x, normal y, offset, speed), or infinity for a line it
/// does not meet from the inner side at or after `ray.after`; `BORN` says
/// the vertex was born at an event (above height 0), `INCLUSIVE` whether a
/// height equal to `ray.after` counts.
///
/// The same expressions as [`super::events::split_time`], each test written
/// so that it gives what the test it stands for gives for every value, not
/// a number (NaN) included, given a finite `ray.after`.
fn split_heights<const BORN: bool, const INCLUSIVE: bool>(
    ray: &Ray,
    columns: [&[f64]; 4],
    times: &mut Vec<f64>,
) {
    let Ray { anchor, vel, t0, after, tol } = *ray;
    let [nxs, nys, offsets, speeds] = columns;
    let lines = nxs.iter().zip(nys).zip(offsets).zip(speeds);
    times.extend(lines.map(|(((&nx, &ny), &offset), &speed)| {
        let d0 = nx * anchor.x + ny * anchor.y - offset - speed * t0;
        let rate = nx * vel.x + ny * vel.y - speed;
        let t = t0 + d0.max(0.0) / -rate;
        // A vertex born at an event on a line that passes through its birth
        // point has already been resolved against it there: then the line
        // must lie beyond the tolerance, otherwise only not behind it.
        let behind = if BORN { d0 <= tol } else { d0 < -tol };
        let meets = !(behind | (rate >= 0.0));
        // Finite and not before `after` (nor at it unless `INCLUSIVE`):
        // `after` is always a finite height, so a height at or past it is
        // neither NaN nor minus infinity.
        let in_range = (t < f64::INFINITY) & if INCLUSIVE { t >= after } else { t > after };
        if meets & in_range { t } else { f64::INFINITY }
    }));
}

/// A node of the tree of lines: its lines sit at positions `start..end`;
/// a cone holds their normals, and the ranges of their offsets from the
/// middle and of their speeds are known.
#[derive(Debug, Clone, Copy)]
struct Node {
    /// First position of the node's lines.
    start: usize,
    /// One past its last position.
    end: usize,
    /// The two halves, or none for a leaf.
    children: Option<(usize, usize)>,
    /// Unit axis of the cone of normals.
    axis: DVec2,
    /// Cosine of the cone's half angle, made a little smaller.
    cos: f64,
    /// Sine of the cone's half angle, made a little larger.
    sin: f64,
    /// Whether the cone is narrower than a half plane and every range
    /// finite, so the bound holds.
    bounded: bool,
    /// Lowest `offset - normal . middle` of the node's lines.
    residual_lo: f64,
    /// Highest `offset - normal . middle`.
    residual_hi: f64,
    /// Lowest speed.
    speed_lo: f64,
    /// Highest speed.
    speed_hi: f64,
}

/// A node waiting in the search, with its bound.
#[derive(Debug, Clone, Copy, PartialEq)]
struct Pending(f64, usize);

/// What the bound reads of a ray, worked out once per search.
struct RayTerms {
    /// The ray's start, from the middle.
    from_middle: DVec2,
    /// Its velocity.
    vel: DVec2,
    /// Its start height.
    t0: f64,
    /// The point tolerance.
    tol: f64,
    /// Margin on a distance.
    slack_distance: f64,
    /// Margin on a rate.
    slack_rate: f64,
    /// How long after the start candidates begin to count, a little less,
    /// or 0.
    wait: f64,
}

/// The wall lines in a tree for the full split search, with its scratch
/// space.
#[derive(Debug, Clone)]
pub(crate) struct LineBlocks {
    /// The outline's middle (its box's centre), offsets are measured from.
    middle: DVec2,
    /// Largest `|offset - normal . middle|` of any line.
    residual_abs: f64,
    /// Line index at each position.
    order: Vec<usize>,
    /// The lines' normal x, normal y, offset and speed, by position.
    columns: [Vec<f64>; 4],
    /// The tree's nodes, the root first.
    nodes: Vec<Node>,
    /// The nodes waiting in a search, kept between searches.
    pending: Vec<Pending>,
    /// The nodes passed over in a search, kept between searches.
    skipped: Vec<usize>,
    /// One leaf's heights, kept between searches.
    times: Vec<f64>,
}

/// Lines per leaf at most (8, 16, 32 and 64 measured 850, 760, 713 and
/// 715 M instructions for the 10,000-corner star's solve).
const LEAF: usize = 32;

impl LineBlocks {
    /// Builds the tree over `lines`.
    pub fn new(lines: &[WallLine]) -> Self {
        let (mut lo, mut hi) = (DVec2::splat(f64::INFINITY), DVec2::splat(f64::NEG_INFINITY));
        for l in lines {
            lo = lo.min(l.start.min(l.end));
            hi = hi.max(l.start.max(l.end));
        }
        let finite = lo.is_finite() && hi.is_finite();
        let middle = if finite { (lo + hi) * 0.5 } else { DVec2::ZERO };
        let reach = if finite { (hi - lo).length() * 0.5 } else { 1.0 };
        let residual = |l: &WallLine| l.offset - l.normal.dot(middle);
        let residual_abs = lines.iter().map(|l| residual(l).abs()).fold(0.0, f64::max);
        let keys: Vec<(f64, f64)> =
            lines.iter().map(|l| (l.normal.y.atan2(l.normal.x), residual(l))).collect();
        let mut order: Vec<usize> = (0..lines.len()).collect();
        let mut nodes = Vec::new();
        build(&mut order, 0, &keys, reach, &mut nodes, lines, middle);
        let sorted: Vec<&WallLine> = order.iter().filter_map(|&i| lines.get(i)).collect();
        let columns = [
            sorted.iter().map(|l| l.normal.x).collect(),
            sorted.iter().map(|l| l.normal.y).collect(),
            sorted.iter().map(|l| l.offset).collect(),
            sorted.iter().map(|l| l.speed).collect(),
        ];
        Self {
            middle,
            residual_abs,
            order,
            columns,
            nodes,
            pending: Vec::new(),
            skipped: Vec::new(),
            times: Vec::new(),
        }
    }

    /// A height no line of `node` is met below by the ray (minus infinity
    /// when the node cannot be bounded), or infinity when no line of it can
    /// be met at all.
    ///
    /// Line `L` is reached at the first `tau` at which `n . (a + w tau) -
    /// r - s (t0 + tau)` falls to 0 (`a` the start from the middle, `w`
    /// the velocity, `r` the line's offset from the middle, `s` its speed).
    /// Over a cone of normals `n . q` is at least `min(cos x, x) - sin |y|`,
    /// with `x` and `y` the parts of `q` along and across the axis: the
    /// least of four straight functions of `tau`, each below every line's,
    /// so the first zero of any of them comes no later than any line's.
    fn bound(&self, node: &Node, ray: &RayTerms) -> f64 {
        if !node.bounded {
            return f64::NEG_INFINITY;
        }
        let m = node.axis;
        let (x0, y0) = (m.dot(ray.from_middle), m.perp_dot(ray.from_middle));
        let (xw, yw) = (m.dot(ray.vel), m.perp_dot(ray.vel));
        // Every line behind the vertex by more than the tolerance.
        let ahead_hi =
            x0.max(node.cos * x0) + node.sin * y0.abs() - node.residual_lo - node.speed_lo * ray.t0
                + ray.slack_distance;
        if ahead_hi < -ray.tol {
            return f64::INFINITY;
        }
        // Every line met before `after`, if that is past the start: above
        // the line at the start or not, the vertex is beyond it by then.
        if ray.wait > 0.0 {
            let q = ray.from_middle + ray.vel * ray.wait;
            let (x, y) = (m.dot(q), m.perp_dot(q));
            let ahead_then = x.max(node.cos * x) + node.sin * y.abs()
                - node.residual_lo
                - node.speed_lo * (ray.t0 + ray.wait)
                + ray.slack_distance
                + ray.slack_rate * ray.wait;
            if ahead_then < 0.0 {
                return f64::INFINITY;
            }
        }
        let base = -node.speed_hi * ray.t0 - node.residual_hi - ray.slack_distance;
        let drift = -node.speed_hi - ray.slack_rate;
        let mut tau = f64::INFINITY;
        let mut falls = false;
        for k in [node.cos, 1.0] {
            for side in [node.sin, -node.sin] {
                let at_start = k * x0 + side * y0 + base;
                let rate = k * xw + side * yw + drift;
                if at_start.is_nan() || at_start <= 0.0 {
                    return ray.t0 - MARGIN * (ray.t0 + 1.0);
                }
                if rate < 0.0 {
                    falls = true;
                    tau = tau.min(at_start / -rate);
                }
            }
        }
        if !falls {
            return f64::INFINITY;
        }
        let t = ray.t0 + tau;
        (t - MARGIN * (t + 1.0)).min(f64::MAX)
    }

    /// Writes into `found` every line `ray` meets no later than the
    /// [`SPLIT_CANDIDATES_KEPT`]-th earliest, as `(height, line)`, latest
    /// first and ties in falling line order, leaving out the lines `own`;
    /// returns whether a later one was left out. `BORN` and `INCLUSIVE` are
    /// those of [`split_heights`].
    pub fn search<const BORN: bool, const INCLUSIVE: bool>(
        &mut self,
        ray: &Ray,
        own: [usize; 2],
        found: &mut Vec<(f64, usize)>,
    ) -> bool {
        let mut pending = std::mem::take(&mut self.pending);
        let mut times = std::mem::take(&mut self.times);
        let mut skipped = std::mem::take(&mut self.skipped);
        pending.clear();
        skipped.clear();
        let usable = ray.anchor.is_finite() && ray.vel.is_finite() && ray.t0.is_finite() && ray.t0 >= 0.0;
        let terms = RayTerms {
            from_middle: ray.anchor - self.middle,
            vel: ray.vel,
            t0: ray.t0,
            tol: ray.tol,
            slack_distance: MARGIN * (ray.anchor.length() + self.middle.length() + self.residual_abs + 1.0)
                + MARGIN * self.nodes.first().map_or(0.0, |n| n.speed_hi) * ray.t0,
            slack_rate: MARGIN * (ray.vel.length() + self.nodes.first().map_or(0.0, |n| n.speed_hi) + 1.0),
            wait: (ray.after - ray.t0 - MARGIN * (ray.after.abs() + 1.0)).max(0.0),
        };
        let bound = |node: &Node| if usable { self.bound(node, &terms) } else { f64::NEG_INFINITY };
        if let Some(root) = self.nodes.first() {
            let b = bound(root);
            if b != f64::INFINITY {
                pending.push(Pending(b, 0));
            }
        }
        // The earliest few heights so far, in order: a candidate later than
        // the last of them can never be kept, so it is not even stored.
        let mut earliest = [f64::INFINITY; SPLIT_CANDIDATES_KEPT];
        // Whether some candidate was passed over as later than all those kept.
        let mut passed_over = false;
        while let Some(Pending(b, k)) = pending.pop() {
            // Every height in this node is past the few earliest already
            // found (none when fewer are found).
            if b > earliest[SPLIT_CANDIDATES_KEPT - 1] {
                skipped.push(k);
                continue;
            }
            let Some(node) = self.nodes.get(k) else { continue };
            if let Some((left, right)) = node.children {
                let lb = self.nodes.get(left).map_or(f64::INFINITY, &bound);
                let rb = self.nodes.get(right).map_or(f64::INFINITY, &bound);
                // The nearer half is searched first.
                let (near, far) = if rb < lb { ((rb, right), (lb, left)) } else { ((lb, left), (rb, right)) };
                for (cb, child) in [far, near] {
                    if cb != f64::INFINITY {
                        pending.push(Pending(cb.max(b), child));
                    }
                }
                continue;
            }
            self.heights::<BORN, INCLUSIVE>(node.start..node.end, ray, &mut times);
            for (&t, &line) in times.iter().zip(self.order.get(node.start..).unwrap_or(&[])) {
                if t == f64::INFINITY || own.contains(&line) {
                    continue;
                }
                if t > earliest[SPLIT_CANDIDATES_KEPT - 1] {
                    passed_over = true;
                    continue;
                }
                found.push((t, line));
                let mut j = SPLIT_CANDIDATES_KEPT - 1;
                earliest[j] = t;
                while j > 0 && earliest[j - 1] > t {
                    earliest.swap(j - 1, j);
                    j -= 1;
                }
            }
        }
        // Keep the earliest few plus every candidate tied with the last one
        // kept, so a recompute "strictly later" never skips one.
        let limit = earliest[SPLIT_CANDIDATES_KEPT - 1];
        let stored = found.len();
        found.retain(|c| c.0 <= limit);
        let mut truncated = passed_over || found.len() < stored;
        // Whether a node passed over holds any candidate at all: it is
        // then later than those kept.
        if !truncated {
            for &k in &skipped {
                let Some(node) = self.nodes.get(k) else { continue };
                self.heights::<BORN, INCLUSIVE>(node.start..node.end, ray, &mut times);
                let lines = self.order.get(node.start..).unwrap_or(&[]);
                if times.iter().zip(lines).any(|(&t, line)| t != f64::INFINITY && !own.contains(line)) {
                    truncated = true;
                    break;
                }
            }
        }
        // Latest first, ties in falling line order, as the next candidate
        // is taken from the end.
        found.sort_unstable_by(|a, b| b.0.total_cmp(&a.0).then(b.1.cmp(&a.1)));
        self.pending = pending;
        self.skipped = skipped;
        self.times = times;
        truncated
    }

    /// Writes into `times` the heights of the lines at positions `span`.
    fn heights<const BORN: bool, const INCLUSIVE: bool>(
        &self,
        span: std::ops::Range<usize>,
        ray: &Ray,
        times: &mut Vec<f64>,
    ) {
        times.clear();
        let [nx, ny, offset, speed] = &self.columns;
        let (Some(nx), Some(ny), Some(offset), Some(speed)) =
            (nx.get(span.clone()), ny.get(span.clone()), offset.get(span.clone()), speed.get(span))
        else {
            return;
        };
        split_heights::<BORN, INCLUSIVE>(ray, [nx, ny, offset, speed], times);
    }
}

/// Builds the node over `items` (line indices, which sit from position
/// `start` on) and its subtree, sorting `items` so every node's lines are
/// contiguous; returns the node's index. A node is halved across the
/// normals' angles or across the offsets from the middle, whichever spread
/// is the wider once the angle is scaled by `scale` (about the outline's
/// half diagonal, where a narrow cone matters most).
fn build(
    items: &mut [usize],
    start: usize,
    keys: &[(f64, f64)],
    scale: f64,
    nodes: &mut Vec<Node>,
    lines: &[WallLine],
    middle: DVec2,
) -> usize {
    let chosen = || items.iter().filter_map(|&i| lines.get(i));
    let axis = chosen().map(|l| l.normal).sum::<DVec2>().normalize_or_zero();
    let cos = chosen().map(|l| axis.dot(l.normal)).fold(1.0, f64::min) - 1e-12;
    let sin = (1.0 - cos * cos).max(0.0).sqrt() + 1e-12;
    let widen = |(lo, hi): (f64, f64), x: f64| (lo.min(x), hi.max(x));
    let none = (f64::INFINITY, f64::NEG_INFINITY);
    let (residual_lo, residual_hi) = chosen().fold(none, |r, l| widen(r, l.offset - l.normal.dot(middle)));
    let (speed_lo, speed_hi) = chosen().fold(none, |r, l| widen(r, l.speed));
    let finite = [residual_lo, residual_hi, speed_lo, speed_hi, cos, sin].iter().all(|x| x.is_finite());
    let index = nodes.len();
    nodes.push(Node {
        start,
        end: start + items.len(),
        children: None,
        axis,
        cos,
        sin,
        bounded: finite && cos > 0.0 && speed_lo >= 0.0,
        residual_lo,
        residual_hi,
        speed_lo,
        speed_hi,
    });
    if items.len() <= LEAF {
        return index;
    }
    let key = |i: &usize| keys.get(*i).copied().unwrap_or((0.0, 0.0));
    let (a_lo, a_hi) = items.iter().fold(none, |r, i| widen(r, key(i).0));
    let by_angle = (a_hi - a_lo) * scale >= residual_hi - residual_lo;
    // Only which lines fall in which half matters (a search sorts what it
    // keeps), so each half is chosen without sorting either.
    let half = items.len() / 2;
    if by_angle {
        items.select_nth_unstable_by(half, |a, b| key(a).0.total_cmp(&key(b).0).then(a.cmp(b)));
    } else {
        items.select_nth_unstable_by(half, |a, b| key(a).1.total_cmp(&key(b).1).then(a.cmp(b)));
    }
    let (low, high) = items.split_at_mut(half);
    let left = build(low, start, keys, scale, nodes, lines, middle);
    let right = build(high, start + half, keys, scale, nodes, lines, middle);
    if let Some(n) = nodes.get_mut(index) {
        n.children = Some((left, right));
    }
    index
}
