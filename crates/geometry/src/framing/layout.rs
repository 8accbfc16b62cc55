//! Rafter layout: lines square to each wall at the spacing, clipped to the
//! roof plane and sorted by what bounds their ends.

use glam::DVec2;

use super::plane_frame::{PLAN_TOL_IN, PlaneFrame, distance_to_segment};
use super::{FramingSettings, MemberKind};
use crate::RoofLineKind;

/// A roof line in plan, with the planes on its two sides.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct PlanLine {
    /// Ridge, hip or valley.
    pub kind: RoofLineKind,
    /// Lower end in plan (either end for a ridge).
    pub from: DVec2,
    /// Upper end in plan.
    pub to: DVec2,
    /// Height of the lower end.
    pub from_z: f64,
    /// Height of the upper end.
    pub to_z: f64,
    /// Indices into the roof's planes.
    pub planes: [usize; 2],
}

impl PlanLine {
    /// Whether plan point `p` lies on this line's segment.
    pub fn touches(&self, p: DVec2) -> bool {
        distance_to_segment(p, self.from, self.to) < PLAN_TOL_IN * 1e3
    }
}

/// What bounds one end of a rafter line.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum EdgeKind {
    /// The plane's wall line (eave).
    Eave,
    /// A roof line, by index.
    Line(usize),
    /// Any other edge (a gable rake).
    Other,
}

/// How a king common meets the hip end of a ridge.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum King {
    /// In a plane beside the ridge: bears on the ridge's side.
    Side {
        /// The ridge line.
        ridge: usize,
    },
    /// In the end plane: bears on the ridge's end.
    End {
        /// The ridge line.
        ridge: usize,
    },
}

/// One rafter's plan line in one plane.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct RafterLine {
    /// Index into the roof's planes.
    pub plane: usize,
    /// Lower theoretical end in plan.
    pub lower: DVec2,
    /// Upper theoretical end in plan.
    pub upper: DVec2,
    /// What bounds the lower end.
    pub lower_edge: EdgeKind,
    /// What bounds the upper end.
    pub upper_edge: EdgeKind,
    /// A second roof line at the upper end, when the line runs into a
    /// corner where two hips (or a hip and a valley) meet.
    pub upper_also: Option<EdgeKind>,
    /// Set for king commons.
    pub king: Option<King>,
    /// For a king common running on past another ridge's hip end less
    /// than a rafter's thickness from that node, at 30 degrees or more to
    /// that ridge: the node. Its own king in this plane is left out (the two boards
    /// would overlap) and this one stands in for it
    /// ([`king_standing_in`]).
    pub stands_in_for: Option<DVec2>,
}

impl RafterLine {
    /// The member this line makes, if it is one we frame.
    pub fn kind(&self, lines: &[PlanLine]) -> Option<MemberKind> {
        let line_kind = |e: EdgeKind| match e {
            EdgeKind::Line(i) => lines.get(i).map(|l| l.kind),
            _ => None,
        };
        if self.king.is_some() {
            return Some(MemberKind::KingCommon);
        }
        match (self.lower_edge, line_kind(self.lower_edge), line_kind(self.upper_edge)) {
            (EdgeKind::Eave, _, Some(RoofLineKind::Ridge)) => Some(MemberKind::Common),
            (EdgeKind::Eave, _, Some(RoofLineKind::Hip)) => Some(MemberKind::HipJack),
            (_, Some(RoofLineKind::Valley), Some(RoofLineKind::Ridge)) => Some(MemberKind::ValleyJack),
            (_, Some(RoofLineKind::Valley), Some(RoofLineKind::Hip | RoofLineKind::Valley)) => {
                Some(MemberKind::CrippleJack)
            }
            _ => None,
        }
    }
}

/// Classifies each edge of a plane's polygon.
///
/// A roof line may name any wall of a shared plane, so a line of a plane
/// coplanar with this one counts as this plane's.
pub fn edge_kinds(
    plane_index: usize,
    frame: &PlaneFrame,
    all_planes: &[PlaneFrame],
    lines: &[PlanLine],
) -> Vec<EdgeKind> {
    let ours =
        |p: usize| p == plane_index || all_planes.get(p).is_some_and(|o| o.plane_group == frame.plane_group);
    let n = frame.polygon.len();
    (0..n)
        .map(|i| {
            let a = frame.polygon[i];
            let b = frame.polygon[(i + 1) % n];
            if frame.dist_in(a).abs() < PLAN_TOL_IN * 1e3 && frame.dist_in(b).abs() < PLAN_TOL_IN * 1e3 {
                return EdgeKind::Eave;
            }
            lines
                .iter()
                .position(|l| l.planes.iter().any(|&p| ours(p)) && l.touches(a) && l.touches(b))
                .map_or(EdgeKind::Other, EdgeKind::Line)
        })
        .collect()
}

/// Lays out one plane's rafter lines.
///
/// `origin` is the layout start corner; `kings` are (node, ridge line)
/// pairs at the hip ends of ridges.
pub fn rafter_lines(
    plane_index: usize,
    frame: &PlaneFrame,
    all_planes: &[PlaneFrame],
    lines: &[PlanLine],
    kings: &[(DVec2, usize)],
    origin: DVec2,
    settings: &FramingSettings,
) -> Vec<RafterLine> {
    let edges = edge_kinds(plane_index, frame, all_planes, lines);
    let n = frame.polygon.len();
    let tau = |p: DVec2| (p - origin).dot(frame.along);
    let taus: Vec<f64> = frame.polygon.iter().map(|p| tau(*p)).collect();
    let tau_min = taus.iter().copied().fold(f64::INFINITY, f64::min);
    let tau_max = taus.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    let thickness = settings.rafter.thickness_in;
    let mut out = Vec::new();
    let mut reserved: Vec<f64> = Vec::new();

    // King commons: square to the wall through each hip end of a ridge
    // that is a corner of this plane.
    let wall_len = frame.start.distance(frame.end);
    let mut nodes_done: Vec<DVec2> = Vec::new();
    // A plane whose ridge edge reaches the node gets a side king for that
    // ridge; otherwise an end king. One king per node and plane.
    let mut ordered: Vec<(DVec2, usize)> = kings.to_vec();
    ordered.sort_by_key(|(_, ridge)| !edges.contains(&EdgeKind::Line(*ridge)));
    for (node, ridge) in ordered {
        if !frame.has_corner(node) || nodes_done.iter().any(|n| n.distance(node) < PLAN_TOL_IN * 1e3) {
            continue;
        }
        nodes_done.push(node);
        let foot_along = (node - frame.start).dot(frame.along);
        if foot_along <= thickness / 2.0 || foot_along >= wall_len - thickness / 2.0 {
            continue;
        }
        let has_ridge_edge = edges.contains(&EdgeKind::Line(ridge));
        let king = if has_ridge_edge { King::Side { ridge } } else { King::End { ridge } };
        out.push(RafterLine {
            plane: plane_index,
            lower: frame.start + frame.along * foot_along,
            upper: node,
            lower_edge: EdgeKind::Eave,
            upper_edge: EdgeKind::Line(ridge),
            upper_also: None,
            king: Some(king),
            stands_in_for: None,
        });
        reserved.push(tau(node));
    }
    // Two kings in one plane less than a rafter's thickness apart cannot
    // both be cut: the one running on past the other's node stands in for
    // it, and that one is left out.
    let kings_here = out.clone();
    out.retain(|a| !kings_here.iter().any(|b| king_standing_in(b, a, lines, thickness)));
    for b in &mut out {
        b.stands_in_for =
            kings_here.iter().find(|a| king_standing_in(b, a, lines, thickness)).map(|a| a.upper);
    }

    // Gable-end rafters: flush inside each rake edge running up the slope.
    let mut taus_to_clip: Vec<f64> = Vec::new();
    for (i, edge) in edges.iter().enumerate() {
        if *edge != EdgeKind::Other {
            continue;
        }
        let a = frame.polygon[i];
        let b = frame.polygon[(i + 1) % n];
        let Some(dir) = (b - a).try_normalize() else {
            continue;
        };
        if dir.dot(frame.along).abs() > 1e-9 {
            continue;
        }
        // A plane round a courtyard is one polygon whose outer ring and
        // hole are joined by a slit: an edge run both ways. No rake there.
        let slit = (0..n).any(|k| {
            k != i
                && frame.polygon[k].distance(b) < PLAN_TOL_IN * 1e3
                && frame.polygon[(k + 1) % n].distance(a) < PLAN_TOL_IN * 1e3
        });
        if slit {
            continue;
        }
        // An edge shared with another plane divides coplanar walls' parts:
        // no rake there.
        let shared = all_planes
            .iter()
            .enumerate()
            .any(|(j, other)| j != plane_index && other.has_corner(a) && other.has_corner(b));
        if shared {
            continue;
        }
        let t_edge = tau(a);
        let inward = if (t_edge - tau_min).abs() < (t_edge - tau_max).abs() { 1.0 } else { -1.0 };
        let t = t_edge + inward * thickness / 2.0;
        taus_to_clip.push(t);
        reserved.push(t);
    }

    // Near a wall's end, where a hip or valley starts, a rafter would run
    // into that member's side: keep lines a rafter's half thickness plus
    // the member's half thickness (measured along the wall) away.
    let mut corner_margins: Vec<(f64, f64)> = Vec::new();
    for corner in [frame.start, frame.end] {
        for l in lines
            .iter()
            .filter(|l| l.kind != RoofLineKind::Ridge && l.from.distance(corner) < PLAN_TOL_IN * 1e3)
        {
            let Some(dir) = (l.to - l.from).try_normalize() else { continue };
            let sin = dir.perp_dot(frame.along).abs().max(1e-6);
            let t_line = match l.kind {
                RoofLineKind::Valley => settings.valley.thickness_in,
                _ => settings.hip.thickness_in,
            };
            corner_margins.push((tau(corner), thickness / 2.0 + t_line / 2.0 / sin));
        }
    }

    let s = settings.spacing_in;
    let shift = if settings.layout_start.centred { s / 2.0 } else { 0.0 };
    let k_first = ((tau_min - shift) / s).ceil() as i64;
    let k_last = ((tau_max - shift) / s).floor() as i64;
    for k in k_first..=k_last {
        let t = k as f64 * s + shift;
        if t - tau_min < thickness / 2.0 || tau_max - t < thickness / 2.0 {
            continue;
        }
        if reserved.iter().any(|r| (r - t).abs() < thickness)
            || corner_margins.iter().any(|(c, margin)| (c - t).abs() < *margin + 1e-9)
        {
            continue;
        }
        taus_to_clip.push(t);
    }

    for t in taus_to_clip {
        let base = origin + frame.along * t;
        out.extend(clip(base, frame, &edges).into_iter().map(
            |(lower, lower_edge, upper, upper_edge, upper_also)| RafterLine {
                plane: plane_index,
                lower,
                upper,
                lower_edge,
                upper_edge,
                upper_also,
                king: None,
                stands_in_for: None,
            },
        ));
    }
    out
}

/// Whether king `b` stands in for king `a` of the same plane (both square
/// to its wall, `thickness` thick): `b`'s line passes `a`'s node less than
/// a thickness off, so the two boards would overlap, and runs on past it
/// by more than a thickness to a ridge further up. A framer cuts the one
/// that runs on and leaves the other out: `a`'s ridge end is then cut back
/// to `b`'s side and the hip at `a`'s node bears on `b` (`b` cannot be
/// cut short without losing its own ridge). Only where `a`'s ridge runs
/// from the node away from `b`'s line, not across it, at 30 degrees or
/// more to the kings (the end then butts against `b`'s side): a ridge
/// running along the kings' line is another case (two ridges side by
/// side), left as it is.
pub fn king_standing_in(b: &RafterLine, a: &RafterLine, lines: &[PlanLine], thickness: f64) -> bool {
    let (Some(King::Side { ridge } | King::End { ridge }), Some(_)) = (a.king, b.king) else {
        return false;
    };
    let Some(up) = (b.upper - b.lower).try_normalize() else { return false };
    let Some(ridge_line) = lines.get(ridge) else { return false };
    let into = if ridge_line.from.distance(a.upper) < ridge_line.to.distance(a.upper) {
        ridge_line.to - ridge_line.from
    } else {
        ridge_line.from - ridge_line.to
    };
    let Some(into) = into.try_normalize() else { return false };
    let rel = a.upper - b.lower;
    // Across the kings' line from `b`'s centre line to `a`'s node.
    let across = rel.perp_dot(up);
    let runs_on = (b.upper - b.lower).dot(up) - rel.dot(up);
    a.upper.distance(b.upper) > PLAN_TOL_IN * 1e3
        && across.abs() < thickness
        && runs_on > thickness
        && rel.dot(up) > 0.0
        && into.perp_dot(up).abs() >= 0.5
        // The ridge runs from the node away from `b`'s line (the node on
        // `b`'s line counts either way).
        && (across.abs() < PLAN_TOL_IN * 1e3 || into.perp_dot(up) * across >= 0.0)
}

/// Two ridges count as parallel for [`ridges_beside`] within 1 degree in
/// plan (sine 0.0175): the solve gives such pairs exactly parallel (a
/// sine of 1e-15 in seeds 0 to 19,999), and over a stretch of 100 in a
/// degree would open the two a further 1.7 in apart, past a board's
/// thickness, which the distance test catches anyway (common practice,
/// no source).
const BESIDE_SIN_MAX: f64 = 0.017_452_406_437_283_51; // sin 1 degree

/// For each roof line, where it is a ridge left out beside a longer one:
/// that ridge's index and the plan distance between their centre lines.
///
/// Two ridges side by side closer than a ridge board's thickness (the
/// solve leaving a sliver of a plane between them) would be two boards
/// overlapping along their whole common length, where a framer frames one
/// ridge. A ridge is left out beside another when the two are parallel
/// (within [`BESIDE_SIN_MAX`]), both of its ends lie less than a board's
/// thickness from the other's centre line and no more than a thickness
/// past the other's ends (it lies along the other, not running on past
/// it), it is shorter, and the two share at least twice the thickness of
/// their length (two ridges merely meeting end to end, a hip of an inch
/// between them, share less). The longer one is kept. A ridge beside a
/// ridge that is itself left out is kept.
pub fn ridges_beside(lines: &[PlanLine], settings: &FramingSettings) -> Vec<Option<(usize, f64)>> {
    let t = settings.ridge.thickness_in;
    let length = |l: &PlanLine| l.from.distance(l.to);
    // The longer ridge `long` that ridge `short` lies beside, and how far apart.
    let beside = |short: &PlanLine, long: &PlanLine| -> Option<f64> {
        let dir = (long.to - long.from).try_normalize()?;
        let own = (short.to - short.from).try_normalize()?;
        if own.perp_dot(dir).abs() > BESIDE_SIN_MAX {
            return None;
        }
        let len = length(long);
        let along = [short.from, short.to].map(|p| (p - long.from).dot(dir));
        let across = [short.from, short.to].map(|p| (p - long.from).perp_dot(dir).abs());
        let lo = along[0].min(along[1]);
        let hi = along[0].max(along[1]);
        let common = hi.min(len) - lo.max(0.0);
        (across.iter().all(|&a| a < t) && lo > -t && hi < len + t && common >= 2.0 * t)
            .then(|| ((short.from + short.to) / 2.0 - long.from).perp_dot(dir).abs())
    };
    let ridge = |i: usize| lines.get(i).filter(|l| l.kind == RoofLineKind::Ridge);
    let longer = |a: usize, b: usize| match (ridge(a), ridge(b)) {
        (Some(la), Some(lb)) => length(la) > length(lb) || (length(la) == length(lb) && a < b),
        _ => false,
    };
    let candidates: Vec<Option<(usize, f64)>> = (0..lines.len())
        .map(|i| {
            let short = ridge(i)?;
            (0..lines.len())
                .filter(|&k| k != i && longer(k, i))
                .filter_map(|k| Some((k, beside(short, ridge(k)?)?)))
                .max_by(|a, b| {
                    let (la, lb) = (ridge(a.0).map_or(0.0, length), ridge(b.0).map_or(0.0, length));
                    la.total_cmp(&lb).then(b.0.cmp(&a.0))
                })
        })
        .collect();
    candidates
        .iter()
        .map(|c| c.filter(|(kept, _)| candidates.get(*kept).is_some_and(Option::is_none)))
        .collect()
}

/// Re-points every rafter line that ends at a ridge left out beside a
/// longer one ([`ridges_beside`]) to the ridge kept in its place, and
/// gives the left-out ridge's kings that would overlap the kept ridge's
/// way; returns, for each rafter line kept, the left-out ridge it was
/// moved from.
///
/// A line bearing on the left-out ridge (a common, a jack, a king) comes
/// from the side away from the kept ridge, so it runs on up its plane
/// across the sliver between the two to the kept ridge's side: its upper
/// end moves to the kept ridge's centre line, and it is cut to that
/// ridge's side. A king so moved stays the king of the hips at its old
/// node ([`RafterLine::stands_in_for`]). A king of the left-out ridge
/// lying in one plane with a king of the kept ridge, square to the same
/// wall, less than a rafter's `thickness` off it (the end kings of two
/// ridge ends a fraction of an inch apart, along the ridges' line or
/// across it) is left out, since the two boards would overlap: the kept
/// ridge's king stands in for it (unless that king already stands in for
/// another, when neither changes). A line that would meet the kept ridge
/// at less than 30 degrees, or a king already standing in for another
/// king, is left as it was. (In seeds 0 to 39,999 neither case comes up.)
pub fn rafters_onto_kept_ridges(
    rafters: &mut Vec<RafterLine>,
    lines: &[PlanLine],
    beside: &[Option<(usize, f64)>],
    planes: &[PlaneFrame],
    thickness: f64,
) -> Vec<Option<usize>> {
    let left_out_of = |r: &RafterLine| match r.upper_edge {
        EdgeKind::Line(k) => beside.get(k).copied().flatten().map(|(kept, _)| (k, kept)),
        _ => None,
    };
    if !rafters.iter().any(|r| left_out_of(r).is_some()) {
        return vec![None; rafters.len()];
    }
    let group = |p: usize| planes.get(p).map(|f| f.plane_group);
    // Two kings of one plane whose boards would overlap: parallel, less
    // than a thickness apart, over a common stretch.
    let overlapping = |a: &RafterLine, b: &RafterLine| {
        let (Some(da), Some(db)) = ((a.upper - a.lower).try_normalize(), (b.upper - b.lower).try_normalize())
        else {
            return false;
        };
        let along = |p: DVec2| (p - a.lower).dot(da);
        let (b0, b1) = (along(b.lower), along(b.upper));
        da.perp_dot(db).abs() < 1e-6
            && (b.lower - a.lower).perp_dot(da).abs() < thickness
            && b0.max(b1) > 0.0
            && b0.min(b1) < a.lower.distance(a.upper)
    };
    let before = rafters.clone();
    let mut gives_way = vec![false; before.len()];
    for (i, r) in before.iter().enumerate() {
        let Some((_, kept)) = left_out_of(r) else { continue };
        if r.king.is_none() {
            continue;
        }
        let kept_king = before.iter().position(|q| {
            q.king.is_some()
                && q.upper_edge == EdgeKind::Line(kept)
                && group(q.plane) == group(r.plane)
                && overlapping(q, r)
        });
        if let Some(j) = kept_king
            && rafters[j].stands_in_for.is_none()
        {
            gives_way[i] = true;
            rafters[j].stands_in_for = Some(r.upper);
        }
    }
    let mut moved_from = vec![None; before.len()];
    for (i, r) in rafters.iter_mut().enumerate() {
        let Some((left, kept)) = left_out_of(r) else { continue };
        let (Some(line), Some(up)) = (lines.get(kept), (r.upper - r.lower).try_normalize()) else {
            continue;
        };
        let Some(dir) = (line.to - line.from).try_normalize() else { continue };
        let crossing = up.perp_dot(dir);
        if gives_way[i] || crossing.abs() < 0.5 || (r.king.is_some() && r.stands_in_for.is_some()) {
            continue;
        }
        let node = r.upper;
        r.upper = node - up * ((node - line.from).perp_dot(dir) / crossing);
        r.upper_edge = EdgeKind::Line(kept);
        if r.king.is_some() {
            r.king = Some(King::Side { ridge: kept });
            r.stands_in_for = Some(node);
        }
        moved_from[i] = Some(left);
    }
    let mut keep = gives_way.iter().map(|g| !g);
    rafters.retain(|_| keep.next().unwrap_or(true));
    moved_from.into_iter().zip(&gives_way).filter(|(_, g)| !**g).map(|(m, _)| m).collect()
}

/// Clips the line through `base` up the slope to the plane's polygon: the
/// inside stretches with the edges at their ends.
fn clip(
    base: DVec2,
    frame: &PlaneFrame,
    edges: &[EdgeKind],
) -> Vec<(DVec2, EdgeKind, DVec2, EdgeKind, Option<EdgeKind>)> {
    let dir = frame.inward;
    let n = frame.polygon.len();
    let mut hits: Vec<(f64, EdgeKind)> = Vec::new();
    for i in 0..n {
        let a = frame.polygon[i];
        let d = frame.polygon[(i + 1) % n] - a;
        let denom = dir.perp_dot(d);
        if denom.abs() < 1e-12 {
            continue;
        }
        let r = (a - base).perp_dot(d) / denom;
        let s = (a - base).perp_dot(dir) / denom;
        if (-1e-9..=1.0 + 1e-9).contains(&s) {
            hits.push((r, edges.get(i).copied().unwrap_or(EdgeKind::Other)));
        }
    }
    hits.sort_by(|a, b| a.0.total_cmp(&b.0));
    // A line through a corner hits both edges there; keep one, preferring
    // a roof line over the eave or a rake.
    let mut merged: Vec<(f64, EdgeKind, Option<EdgeKind>)> = Vec::new();
    for (r, e) in hits {
        match merged.last_mut() {
            Some(last) if (last.0 - r).abs() < 1e-7 => {
                if matches!(e, EdgeKind::Line(_)) {
                    if matches!(last.1, EdgeKind::Line(_)) {
                        last.2 = Some(e);
                    } else {
                        last.1 = e;
                    }
                }
            }
            _ => merged.push((r, e, None)),
        }
    }
    let mut out = Vec::new();
    for pair in merged.windows(2) {
        let (r0, e0, _) = pair[0];
        let (r1, e1, also) = pair[1];
        if r1 - r0 < 1e-3 {
            continue;
        }
        let mid = base + dir * ((r0 + r1) / 2.0);
        if frame.contains(mid) {
            out.push((base + dir * r0, e0, base + dir * r1, e1, also));
        }
    }
    out
}

/// How far a valley jack moved off the layout is set clear of a ridge
/// board's end, inches: 1/16 in, a saw kerf's width, so the two boards do
/// not bind when set (common practice, no source).
pub const RIDGE_END_CLEARANCE_IN: f64 = 1.0 / 16.0;

/// What became of a valley jack laid out where a ridge's end would lie in
/// its board ([`jacks_clear_of_ridge_ends`]).
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum JackAtRidgeEnd {
    /// Moved off the layout along its wall by `by_in` (plan inches, the
    /// least that clears), still in its plane between the same lines.
    Moved {
        /// The ridge line whose end it clears.
        ridge: usize,
        /// The ridge's end in plan.
        node: DVec2,
        /// How far it moved, plan inches (never negative).
        by_in: f64,
    },
    /// No place clear of the ridge's end (a neighbouring rafter or the
    /// plane's edge in the way): left out.
    LeftOut {
        /// The ridge line whose end is in the way.
        ridge: usize,
        /// The ridge's end in plan.
        node: DVec2,
    },
}

/// One end of a framed ridge board, in plan, for [`ridge_end_in_jack`].
#[derive(Debug, Clone, Copy)]
pub struct RidgeEnd {
    /// The ridge line.
    pub line: usize,
    /// The end of its centre line.
    pub node: DVec2,
    /// Unit plan direction out past the end.
    pub out: DVec2,
    /// How far the board runs on past the node (half a rafter at a hip
    /// end, where it is flush with the kings' faces; never less than 0).
    pub past_in: f64,
    /// The board's plan length back from the node to its other end.
    pub length_in: f64,
    /// Height of the ridge's line at the node.
    pub z: f64,
}

/// The ends of the ridges framed (those not left out beside another).
pub fn ridge_ends(
    lines: &[PlanLine],
    beside: &[Option<(usize, f64)>],
    settings: &FramingSettings,
) -> Vec<RidgeEnd> {
    let mut out = Vec::new();
    for (li, l) in lines.iter().enumerate() {
        if l.kind != RoofLineKind::Ridge || beside.get(li).is_some_and(Option::is_some) {
            continue;
        }
        let Some(dir) = (l.to - l.from).try_normalize() else { continue };
        let length_in = l.from.distance(l.to);
        for (node, out_dir, z) in [(l.from, -dir, l.from_z), (l.to, dir, l.to_z)] {
            let hip_end =
                lines.iter().any(|h| h.kind == RoofLineKind::Hip && h.to.distance(node) < PLAN_TOL_IN * 1e3);
            let past_in = if hip_end { settings.rafter.thickness_in / 2.0 } else { 0.0 };
            out.push(RidgeEnd { line: li, node, out: out_dir, past_in, length_in, z });
        }
    }
    out
}

/// Where ridge end `end`'s board would share wood with valley jack `r`
/// (in plane `frame`) by more than a thousandth of an inch (boards that
/// only touch are left), the least moves of the jack along its wall that
/// clear it by [`RIDGE_END_CLEARANCE_IN`]: one toward each side, plan
/// inches across the jack (positive along the jack's left, `up.perp()`),
/// either `None` where that side cannot clear (the ridge runs on that
/// way). `None` when the board clears the jack as laid out.
///
/// The cheap tests come first: the end's plan distance from the jack's
/// line against both half thicknesses, the board's run past the end and
/// the clearance; then the two boards' height ranges at the end. Only then
/// is the ridge board's plan outline cut to the stretch of the jack between
/// its bearing faces (the lower line's side, the upper line's side) and
/// laid across the jack.
pub fn ridge_end_in_jack(
    r: &RafterLine,
    frame: &PlaneFrame,
    lines: &[PlanLine],
    end: &RidgeEnd,
    settings: &FramingSettings,
) -> Option<(Option<f64>, Option<f64>)> {
    let w_jack = settings.rafter.thickness_in / 2.0 + RIDGE_END_CLEARANCE_IN;
    let w_ridge = settings.ridge.thickness_in / 2.0;
    let reach = w_jack + w_ridge + end.past_in;
    if distance_to_segment(end.node, r.lower, r.upper) >= reach {
        return None;
    }
    // Heights at the end: the jack's board hangs its plumb depth below its
    // plane, the ridge's below its line.
    let jack_top = frame.height(end.node);
    let jack_plumb = settings.rafter.depth_in * (1.0 + frame.slope * frame.slope).sqrt();
    if end.z - settings.ridge.depth_in >= jack_top || end.z <= jack_top - jack_plumb {
        return None;
    }
    let up = (r.upper - r.lower).try_normalize()?;
    let left = up.perp();
    // The ridge board's plan outline.
    let n = end.out.perp() * w_ridge;
    let tip = end.node + end.out * end.past_in;
    let back = end.node - end.out * end.length_in;
    // Cut to the jack's stretch between the sides of the lines it bears on.
    let outline = clip_to_jack_stretch(vec![tip - n, tip + n, back + n, back - n], r, lines, settings);
    if outline.is_empty() {
        return None;
    }
    let across: Vec<f64> = outline.iter().map(|p| (*p - r.lower).dot(left)).collect();
    let lo = across.iter().copied().fold(f64::INFINITY, f64::min);
    let hi = across.iter().copied().fold(f64::NEG_INFINITY, f64::max);
    // Boards that only touch, or share less than a thousandth of an inch
    // (the plan tolerance roof points are matched to), are left where they
    // are: the check is for wood shared, the clearance only for the move.
    let w_board = settings.rafter.thickness_in / 2.0 - PLAN_TOL_IN * 1e3;
    if !(lo < w_board && hi > -w_board) {
        return None;
    }
    // A side is open where the board ends short of the jack's whole
    // stretch that way; the ridge running on along the jack's length shuts
    // neither, a ridge running across it shuts the side it runs to.
    let reach_limit = settings.spacing_in;
    let to_left = hi + w_jack;
    let to_right = lo - w_jack;
    Some(((to_left < reach_limit).then_some(to_left), (-to_right < reach_limit).then_some(to_right)))
}

/// Where valley jack `r`, framed to ridge end `end`'s own ridge, sits so
/// close to that end that part of its board runs on past the ridge's
/// board (its top cut would bear on nothing there) or into the board of a
/// hip or valley ending there, the least move along its wall, plan inches
/// across the jack (positive along its left, `up.perp()`), that brings the
/// whole board onto the ridge clear of them with [`RIDGE_END_CLEARANCE_IN`]
/// to spare. `None` when the board bears on the ridge over its whole
/// thickness and clear of the boards at the end by more than a
/// thousandth of an inch, or when the jack runs along the ridge rather
/// than into it.
///
/// The ridge board's corner at the end, on the jack's side, is taken from
/// the board's plan outline (its end square across the ridge, `past_in`
/// beyond the node); a hip's or valley's from its board's plan outline
/// back from the node, cut to the jack's stretch as in
/// [`ridge_end_in_jack`].
pub fn jack_past_own_ridge_end(
    r: &RafterLine,
    lines: &[PlanLine],
    end: &RidgeEnd,
    settings: &FramingSettings,
) -> Option<f64> {
    let up = (r.upper - r.lower).try_normalize()?;
    let left = up.perp();
    // How the ridge runs on from its end, across the jack: the ridge's wood
    // lies on this side of the end's corner.
    let inward = -end.out.dot(left);
    if inward.abs() < 1e-6 {
        return None;
    }
    let s = inward.signum();
    let w_jack = settings.rafter.thickness_in / 2.0;
    let w_ridge = settings.ridge.thickness_in / 2.0;
    // Only an end at the jack's top: the node within reach of its upper end.
    if end.node.distance(r.upper) >= w_jack + w_ridge + end.past_in + settings.ridge.thickness_in {
        return None;
    }
    let mut side = end.out.perp();
    if (r.lower - end.node).dot(side) < 0.0 {
        side = -side;
    }
    let corner = end.node + end.out * end.past_in + side * w_ridge;
    // Places across the jack, measured toward the ridge's wood: the board
    // must lie wholly beyond the ridge's corner and every board at the end.
    let mut need = (corner - r.lower).dot(left) * s;
    // Hips and valleys ending at the node or within a ridge's thickness of
    // it (past a hip too short to frame, say).
    let near = settings.ridge.thickness_in;
    for (li, l) in lines.iter().enumerate() {
        if li == end.line || l.kind == RoofLineKind::Ridge {
            continue;
        }
        let (top, far) = if l.from.distance(end.node) <= l.to.distance(end.node) {
            (l.from, l.to)
        } else {
            (l.to, l.from)
        };
        if top.distance(end.node) >= near {
            continue;
        }
        let t = if l.kind == RoofLineKind::Hip {
            settings.hip.thickness_in
        } else {
            settings.valley.thickness_in
        };
        let Some(back) = (far - top).try_normalize() else { continue };
        let n = back.perp() * (t / 2.0);
        let board = clip_to_jack_stretch(vec![top - n, top + n, far + n, far - n], r, lines, settings);
        for p in board {
            need = need.max((p - r.lower).dot(left) * s);
        }
    }
    // The board spans -w_jack..w_jack across; the part below `need` is in
    // the way.
    let hangs = need + w_jack;
    if hangs <= PLAN_TOL_IN * 1e3 || need >= w_jack {
        return None;
    }
    Some(s * (hangs + RIDGE_END_CLEARANCE_IN))
}

/// The part of plan outline `outline` within jack `r`'s stretch between
/// its bearing faces: on its side of the side faces of the lines at its
/// two ends. Empty when none is.
fn clip_to_jack_stretch(
    mut outline: Vec<DVec2>,
    r: &RafterLine,
    lines: &[PlanLine],
    settings: &FramingSettings,
) -> Vec<DVec2> {
    let mid = (r.lower + r.upper) / 2.0;
    for edge in [r.lower_edge, r.upper_edge] {
        let EdgeKind::Line(li) = edge else { continue };
        let Some(line) = lines.get(li) else { continue };
        let t = match line.kind {
            RoofLineKind::Ridge => settings.ridge.thickness_in,
            RoofLineKind::Hip => settings.hip.thickness_in,
            RoofLineKind::Valley => settings.valley.thickness_in,
        };
        let Some(dir) = (line.to - line.from).try_normalize() else { continue };
        let mut normal = dir.perp();
        if (mid - line.from).dot(normal) < 0.0 {
            normal = -normal;
        }
        // Keep the points on the jack's side of that line's side face.
        outline = clip_to_half_plane(&outline, |p| t / 2.0 - (p - line.from).dot(normal));
        if outline.is_empty() {
            break;
        }
    }
    outline
}

/// Moves every valley jack whose board would contain a framed ridge's end
/// ([`ridge_end_in_jack`]) clear of it: along its wall, by the least
/// distance, to the nearer side where the moved line still runs in its
/// plane from the same valley to the same ridge, clear of every ridge end
/// and no closer than a rafter's thickness to another rafter of the
/// plane; the farther side if the nearer cannot be had; left out where
/// neither can (the ridge's end then carries the sheathing there).
/// Returns, for each rafter line kept (in order), what was done to it,
/// and the jacks left out; `keep` (a list aligned with `rafters`) is
/// trimmed alongside.
pub fn jacks_clear_of_ridge_ends<T>(
    rafters: &mut Vec<RafterLine>,
    keep: &mut Vec<T>,
    planes: &[PlaneFrame],
    lines: &[PlanLine],
    beside: &[Option<(usize, f64)>],
    settings: &FramingSettings,
) -> (Vec<Option<JackAtRidgeEnd>>, Vec<JackAtRidgeEnd>) {
    let ends = ridge_ends(lines, beside, settings);
    let mut done: Vec<Option<JackAtRidgeEnd>> = vec![None; rafters.len()];
    let bears_on = |r: &RafterLine, li: usize| {
        r.upper_edge == EdgeKind::Line(li) || r.upper_also == Some(EdgeKind::Line(li))
    };
    // The first ridge end in jack `r`'s board, or past which its board
    // runs on the ridge it is framed to, with the moves that clear it.
    let first_hit = |r: &RafterLine, frame: &PlaneFrame| {
        ends.iter().find_map(|e| {
            if !bears_on(r, e.line) {
                ridge_end_in_jack(r, frame, lines, e, settings).map(|moves| (e, moves))
            } else if r.upper_also.is_none() {
                jack_past_own_ridge_end(r, lines, e, settings).map(|by| (e, (Some(by), None)))
            } else {
                None
            }
        })
    };
    for i in 0..rafters.len() {
        let r = rafters[i];
        if r.kind(lines) != Some(MemberKind::ValleyJack) {
            continue;
        }
        let Some(frame) = planes.get(r.plane) else { continue };
        let Some((end, (to_left, to_right))) = first_hit(&r, frame) else { continue };
        let Some(up) = (r.upper - r.lower).try_normalize() else { continue };
        let left = up.perp();
        let mut moves: Vec<f64> = [to_left, to_right].into_iter().flatten().collect();
        moves.sort_by(|a, b| a.abs().total_cmp(&b.abs()));
        let edges = edge_kinds(r.plane, frame, planes, lines);
        let thickness = settings.rafter.thickness_in;
        // A move that clears one end can bring the board onto another
        // (the end of the ridge it bears on, say): the moves then add up,
        // the same way, a few times at most.
        let place = |by: f64| {
            clip(r.lower + left * by, frame, &edges).into_iter().find_map(
                |(lower, lower_edge, upper, upper_edge, upper_also)| {
                    (lower_edge == r.lower_edge && upper_edge == r.upper_edge).then_some(RafterLine {
                        lower,
                        upper,
                        upper_also,
                        ..r
                    })
                },
            )
        };
        let placed = moves.iter().find_map(|&first| {
            let mut by = first;
            for _ in 0..4 {
                let moved = place(by)?;
                let len = moved.lower.distance(moved.upper);
                let crowds = rafters.iter().enumerate().any(|(k, q)| {
                    if k == i
                        || q.plane != r.plane
                        || done.get(k).is_some_and(|d| matches!(d, Some(JackAtRidgeEnd::LeftOut { .. })))
                    {
                        return false;
                    }
                    let Some(q_up) = (q.upper - q.lower).try_normalize() else { return false };
                    let along = |p: DVec2| (p - moved.lower).dot(up);
                    let (a, b) = (along(q.lower), along(q.upper));
                    q_up.perp_dot(up).abs() < 1e-6
                        && (q.lower - moved.lower).dot(left).abs() < thickness
                        && a.max(b) > 0.0
                        && a.min(b) < len
                });
                if crowds {
                    return None;
                }
                match first_hit(&moved, frame) {
                    None => return Some((moved, by)),
                    Some((_, (to_left, to_right))) => {
                        let more = [to_left, to_right].into_iter().flatten().find(|m| m * first > 0.0)?;
                        by += more;
                    }
                }
            }
            None
        });
        match placed {
            Some((moved, by)) => {
                rafters[i] = moved;
                done[i] = Some(JackAtRidgeEnd::Moved { ridge: end.line, node: end.node, by_in: by.abs() });
            }
            None => done[i] = Some(JackAtRidgeEnd::LeftOut { ridge: end.line, node: end.node }),
        }
    }
    let left_out: Vec<JackAtRidgeEnd> =
        done.iter().flatten().copied().filter(|d| matches!(d, JackAtRidgeEnd::LeftOut { .. })).collect();
    if !left_out.is_empty() {
        let gone = |d: &Option<JackAtRidgeEnd>| matches!(d, Some(JackAtRidgeEnd::LeftOut { .. }));
        let mut flags = done.iter().map(|d| !gone(d));
        rafters.retain(|_| flags.next().unwrap_or(true));
        let mut flags = done.iter().map(|d| !gone(d));
        keep.retain(|_| flags.next().unwrap_or(true));
        done.retain(|d| !gone(d));
    }
    (done, left_out)
}

/// The part of convex polygon `polygon` where `outside(p) <= 0`.
fn clip_to_half_plane(polygon: &[DVec2], outside: impl Fn(DVec2) -> f64) -> Vec<DVec2> {
    let mut out = Vec::with_capacity(polygon.len() + 1);
    for (k, &a) in polygon.iter().enumerate() {
        let b = polygon[(k + 1) % polygon.len()];
        let (fa, fb) = (outside(a), outside(b));
        if fa <= 0.0 {
            out.push(a);
        }
        if (fa < 0.0 && fb > 0.0) || (fa > 0.0 && fb < 0.0) {
            out.push(a + (b - a) * (fa / (fa - fb)));
        }
    }
    out
}
