//! Building each piece's spec: the board, where it sits, and the planes
//! that cut it (ridges, commons and jacks, hips, valleys).

use glam::{DVec2, DVec3};

use super::board::{BoardFrame, PieceSpec, SeatWall};
use super::joints::{JOINT_FIT_IN, check_fit, part_bounds};
use super::layout::{EdgeKind, King, PlanLine, RafterLine};
use super::plane_frame::{PLAN_TOL_IN, PlaneFrame, distance_to_segment};
use super::{
    BoardSize, ConvexPart, CutEnd, FaceTag, FramingSettings, HalfSpace, HipTop, MemberKind, Solid, TailCut,
};
use crate::RoofLineKind;

/// Lengths within this of a stock length fit it: layouts in whole spaces
/// land splices exactly on stock lengths, and round-off must not tip them.
pub const STOCK_TOL_IN: f64 = 1e-6;

/// Two pieces' solids meet without running into each other while neither
/// has a corner deeper than this inside the other, inches: far finer than
/// the 1/64 in a joint is held to, coarser than round-off.
const OVERLAP_TOL_IN: f64 = 1e-6;

/// How far from a ridge's hip end, inches, a hip or valley must end for the
/// ridge's end to be cut back to it as to a line passing by (common
/// practice, no source: a foot, well past the few inches a member's end is
/// cut back from its node at a crowded node).
const HIP_END_REACH_IN: f64 = 12.0;

/// Two plan directions within 10 degrees of each other count as in line
/// for a hip carrying a valley's line on past its top: the valley's side
/// would cut such a hip along a cheek over 8 in long, the hip's 1-1/2 in
/// thickness over sin 10 degrees (common practice, no source).
const IN_LINE_COS: f64 = 0.984_807_753_012_208; // cos 10 degrees

/// What a piece bears on, as known while pieces are still being built.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Bearing {
    /// A piece already built, by index.
    Piece(usize),
    /// The member built on a roof line, by line index (a ridge line may
    /// have several pieces; the nearest is taken).
    Line(usize),
}

/// The vertical plane `thickness / 2` from a line's centre toward `toward`,
/// keeping `toward`'s side.
pub fn side_face(
    a: DVec2,
    b: DVec2,
    thickness: f64,
    toward: DVec2,
    tag: FaceTag,
    end: CutEnd,
) -> Option<HalfSpace> {
    let dir = (b - a).try_normalize()?;
    let n = dir.perp();
    let sign = if n.dot(toward - a) >= 0.0 { 1.0 } else { -1.0 };
    let point = a + n * (sign * thickness / 2.0);
    HalfSpace::through(point.extend(0.0), (-n * sign).extend(0.0), tag, Some(end))
}

/// Plumb when square across the member, cheek otherwise.
pub fn cut_tag(h: &HalfSpace, frame: &BoardFrame) -> FaceTag {
    if h.normal.dot(frame.side).abs() < 1e-9 { FaceTag::Plumb } else { FaceTag::Cheek }
}

/// The framer's square for a hip or valley of rise per run `slope`
/// between planes `a` and `b`: its unit run (its plan run while the
/// flatter side's common runs 12), to the nearest sixteenth as the square
/// is read, against that common's rise per foot.
///
/// A common rises R per 12 of its run, and the hip rises the same R over
/// its own plan run u = R / slope (trade.md section 2: 16.97 for a regular
/// hip, which the square reads as 17). The flatter side gives the smaller
/// unit run, so both figures fit the square's arms.
pub fn hip_square(slope: f64, a: &PlaneFrame, b: &PlaneFrame) -> [f64; 2] {
    let rise = 12.0 * a.slope.min(b.slope);
    if !(slope > 0.0 && slope.is_finite() && rise > 0.0) {
        return [12.0, 12.0 * slope];
    }
    [(rise / slope * 16.0).round() / 16.0, rise]
}

/// What every builder needs.
pub struct Ctx<'a> {
    /// Every roof plane with its wall's frame.
    pub planes: &'a [PlaneFrame],
    /// Every ridge, hip and valley in plan.
    pub lines: &'a [PlanLine],
    /// Every rafter line laid out.
    pub rafters: &'a [RafterLine],
    /// The roof's heel height.
    pub heel: f64,
    /// The settings.
    pub settings: &'a FramingSettings,
    /// For each roof line, whether it is a hip or valley left out
    /// ([`left_out_lines`]).
    pub left_out: &'a [bool],
    /// For each roof line, the ridge kept in its place where it is a ridge
    /// left out beside a longer one ([`super::layout::ridges_beside`]).
    pub kept_ridge: &'a [Option<usize>],
}

/// Which roof lines are hips or valleys too short to cut, left out of the
/// frame and fitted by hand at their nodes (with a block where one is
/// needed): one shorter in plan than its own thickness (a wedge of a
/// fraction of an inch), and a hip shorter in plan than its own depth that
/// runs from one ridge's end to another's (where a ridge steps sideways
/// or up by a few inches, as uneven wings make it), whose cheek cuts
/// at both ends would leave a block, not a rafter.
pub fn left_out_lines(lines: &[PlanLine], settings: &FramingSettings) -> Vec<bool> {
    let ridge_ends_at = |p: DVec2| {
        lines.iter().any(|l| {
            l.kind == RoofLineKind::Ridge
                && (l.from.distance(p) < PLAN_TOL_IN * 1e3 || l.to.distance(p) < PLAN_TOL_IN * 1e3)
        })
    };
    lines
        .iter()
        .map(|l| {
            let run = l.from.distance(l.to);
            match l.kind {
                RoofLineKind::Hip => {
                    run < settings.hip.thickness_in
                        || (run < settings.hip.depth_in && ridge_ends_at(l.from) && ridge_ends_at(l.to))
                }
                RoofLineKind::Valley => run < settings.valley.thickness_in,
                RoofLineKind::Ridge => false,
            }
        })
        .collect()
}

/// A hip or valley: its spec, the pieces it bears on with the mating
/// planes, and whether its top met no ridge.
pub type Built = (PieceSpec, Vec<(Bearing, HalfSpace)>, bool);

/// A bearing named by roof line (resolved to a piece later) with the
/// mating plane.
pub type LineBearing = Option<(usize, HalfSpace)>;

impl Ctx<'_> {
    /// Whether roof line `k` is a ridge left out beside a longer one.
    pub fn ridge_left_out(&self, k: usize) -> bool {
        self.kept_ridge.get(k).is_some_and(Option::is_some)
    }

    /// Ridge `k`, or the ridge kept in its place where it is left out.
    pub fn ridge_framed(&self, k: usize) -> usize {
        self.kept_ridge.get(k).copied().flatten().unwrap_or(k)
    }

    /// The ridges framed at `node`, in line order, once each: those that
    /// touch it, each left-out one by the ridge kept in its place (which
    /// passes beside the node, less than a board's thickness off).
    pub fn ridges_at(&self, node: DVec2) -> Vec<usize> {
        let mut out = Vec::new();
        for (k, l) in self.lines.iter().enumerate() {
            if l.kind == RoofLineKind::Ridge && l.touches(node) {
                let k = self.ridge_framed(k);
                if !out.contains(&k) {
                    out.push(k);
                }
            }
        }
        out
    }

    /// Whether `node` is an end of a ridge left out beside another.
    pub fn at_left_out_ridge(&self, node: DVec2) -> bool {
        self.lines.iter().enumerate().any(|(k, l)| self.ridge_left_out(k) && l.touches(node))
    }

    /// The tail cuts of a rafter in plane `p`.
    pub fn tail_cuts(&self, p: &PlaneFrame) -> Vec<HalfSpace> {
        let o = p.overhang_in;
        let mut cuts = Vec::new();
        match self.settings.tail {
            TailCut::Plumb => cuts.extend(p.wall_side(o, true, FaceTag::Tail, Some(CutEnd::Tail))),
            TailCut::Square => cuts.extend(self.square_tail(p)),
            TailCut::PlumbAndLevel { plumb_height_in } => {
                cuts.extend(p.wall_side(o, true, FaceTag::Tail, Some(CutEnd::Tail)));
                let z = self.heel - p.slope * o - plumb_height_in;
                cuts.extend(HalfSpace::through(
                    DVec3::new(0.0, 0.0, z),
                    -DVec3::Z,
                    FaceTag::Soffit,
                    Some(CutEnd::Tail),
                ));
            }
        }
        cuts
    }

    /// Plane `p`'s square tail cut: square to the rafters' edges, through
    /// the fascia line at their top. Every common of the plane ends on
    /// this one plane, so a hip or valley cut to it on that side ends flush
    /// with them.
    pub fn square_tail(&self, p: &PlaneFrame) -> Option<HalfSpace> {
        let o = p.overhang_in;
        let top = (p.start - p.inward * o).extend(self.heel - p.slope * o);
        let up_slope = p.inward.extend(p.slope);
        HalfSpace::through(top, -up_slope, FaceTag::Tail, Some(CutEnd::Tail))
    }

    /// The tail cut of plane `p`'s side of a hip or valley: plumb on the
    /// fascia line, or square to that plane's rafters where the tails are
    /// cut square, so it meets the fascia as that plane's commons do.
    pub fn fascia_side_tail(&self, p: &PlaneFrame) -> Option<HalfSpace> {
        match self.settings.tail {
            TailCut::Square => self.square_tail(p),
            TailCut::Plumb | TailCut::PlumbAndLevel { .. } => {
                p.wall_side(p.overhang_in, true, FaceTag::Tail, Some(CutEnd::Tail))
            }
        }
    }

    /// The inner face of plane `p`'s wall plate, one seat width in from
    /// its wall line (outward normal).
    pub fn plate_inner(&self, p: &PlaneFrame) -> Option<HalfSpace> {
        p.wall_side(-self.settings.seat_width_in, true, FaceTag::Heel, Some(CutEnd::Seat))
    }

    /// The ridge's height at its top: flush with the rafters' tops at its
    /// side faces (the lower side where pitches differ).
    pub fn ridge_top(&self, line: &PlanLine) -> f64 {
        let t = self.settings.ridge.thickness_in;
        let dir = (line.to - line.from).normalize_or_zero();
        line.planes
            .iter()
            .filter_map(|&pi| self.planes.get(pi))
            .map(|p| {
                let n = dir.perp();
                let sign = if n.dot(p.inward) < 0.0 { 1.0 } else { -1.0 };
                self.heel + p.height(line.from + n * (sign * t / 2.0))
            })
            .fold(f64::INFINITY, f64::min)
    }

    /// How far ridge `li` (unit direction `dir`) runs past its end at
    /// `node`: negative where it butts against an earlier ridge's side.
    ///
    /// Where an earlier ridge meets this one at an angle, this one butts
    /// against its side; otherwise a hip end runs half a rafter past the
    /// node, flush with the side kings' faces.
    pub fn ridge_end_offset(&self, li: usize, dir: DVec2, node: DVec2) -> f64 {
        let hip_end =
            self.lines.iter().any(|l| l.kind == RoofLineKind::Hip && l.to.distance(node) < PLAN_TOL_IN * 1e3);
        let butt = self
            .lines
            .iter()
            .enumerate()
            .take(li)
            .filter(|(k, l)| l.kind == RoofLineKind::Ridge && l.touches(node) && !self.ridge_left_out(*k))
            .find_map(|(_, l)| {
                let other = (l.to - l.from).try_normalize()?;
                let sin = other.perp_dot(dir).abs();
                (sin > 1e-6).then(|| self.settings.ridge.thickness_in / 2.0 / sin)
            });
        match butt {
            Some(back) => -back,
            None if hip_end => self.settings.rafter.thickness_in / 2.0,
            None => 0.0,
        }
    }

    /// The face of ridge `li` that a hip or valley leaving `node` along
    /// unit plan direction `away` bears on, keeping the member's side
    /// (`toward` is a point of it). Where the ridge ends at the node and the
    /// member leaves it behind, that is the ridge's end; otherwise its side.
    pub fn ridge_face_at(
        &self,
        li: usize,
        node: DVec2,
        away: DVec2,
        toward: DVec2,
        end: CutEnd,
    ) -> Option<HalfSpace> {
        let ridge = self.lines.get(li)?;
        let t = self.settings.ridge.thickness_in;
        let dir = (ridge.to - ridge.from).try_normalize()?;
        let near = |p: DVec2| p.distance(node) < PLAN_TOL_IN * 1e3;
        let into = if near(ridge.from) {
            Some(dir)
        } else if near(ridge.to) {
            Some(-dir)
        } else {
            None
        };
        let side = || side_face(ridge.from, ridge.to, t, toward, FaceTag::Cheek, end);
        let Some(into) = into else { return side() };
        let leaving = away.dot(into);
        if leaving >= -1e-9 {
            return side();
        }
        // The member's centre line leaves the ridge's box through the face
        // it crosses first: the end (at s_end) or the side (at s_side).
        let e = self.ridge_end_offset(li, dir, node);
        let s_end = -e / leaving;
        let across = away.perp_dot(dir).abs();
        let s_side = if across > 1e-12 { t / 2.0 / across } else { f64::INFINITY };
        if e > 0.0 && s_end > s_side {
            return side();
        }
        HalfSpace::through((node - into * e).extend(0.0), into.extend(0.0), FaceTag::Cheek, Some(end))
    }

    /// The side faces of hips and valleys that a ridge's ends run into
    /// without meeting them at a node (a ridge the solve ends a hair short
    /// of a valley passing by), each with the line's index and whether it
    /// is at the ridge's start: that end is cut back to the face and bears
    /// on it. Not at a hip end, where kings bear on the ridge's end.
    pub fn ridge_end_clearances(&self, li: usize, line: &PlanLine) -> Vec<(usize, HalfSpace, bool)> {
        let Some(dir) = (line.to - line.from).try_normalize() else {
            return Vec::new();
        };
        let t = self.settings.ridge.thickness_in;
        let top = self.ridge_top(line);
        let bottom = top - self.settings.ridge.depth_in;
        let len = line.from.distance(line.to);
        let mut out = Vec::new();
        for (node, out_dir, at_start) in [(line.from, -dir, true), (line.to, dir, false)] {
            // A hip end's kings bear on the ridge's end where it is: left.
            let hip_end = self
                .lines
                .iter()
                .any(|l| l.kind == RoofLineKind::Hip && l.to.distance(node) < PLAN_TOL_IN * 1e3);
            // At a node of a hip or valley too short to cut (left out and
            // fitted by hand), the end is also cut to the ridges at the
            // short line's other end; a hip or valley passing by is still
            // cleared below (the members at that other end run on past
            // this end as they would past any other).
            let short_here =
                self.lines.iter().zip(self.left_out).any(|(l, &left_out)| left_out && l.touches(node));
            // Far enough back along the ridge to be clear of the member.
            let inside = node - out_dir * (len / 2.0).min(12.0);
            if short_here && !hip_end {
                out.extend(self.ridge_end_across_short_line(li, line, node, out_dir, at_start));
            }
            // A hip end runs on past its node (half a rafter, flush with
            // the side kings): a hip or valley passing just beyond it is
            // cleared where the end's corners are, the kings keeping the
            // rest of the end.
            let end =
                if hip_end { node + out_dir * self.ridge_end_offset(li, dir, node).max(0.0) } else { node };
            for (k, other) in self.lines.iter().enumerate() {
                let (ot, od) = match other.kind {
                    RoofLineKind::Hip => (self.settings.hip.thickness_in, self.settings.hip.depth_in),
                    RoofLineKind::Valley => {
                        (self.settings.valley.thickness_in, self.settings.valley.depth_in)
                    }
                    RoofLineKind::Ridge => continue,
                };
                if other.touches(node) || self.left_out.get(k).copied().unwrap_or(false) {
                    continue;
                }
                // At a hip end, only a line passing by, a foot or more from
                // its own ends: one ending near the node meets the members
                // framed there (a ridge in line a fraction of an inch aside,
                // across a hip left out), and its end is cut to them, back
                // from its node by up to a few inches.
                if hip_end
                    && (other.from.distance(node) < HIP_END_REACH_IN
                        || other.to.distance(node) < HIP_END_REACH_IN)
                {
                    continue;
                }
                let Some(odir) = (other.to - other.from).try_normalize() else { continue };
                let corners = [end + dir.perp() * (t / 2.0), end - dir.perp() * (t / 2.0)];
                let run = other.from.distance(other.to);
                let runs_in = corners.iter().any(|&c| {
                    if distance_to_segment(c, other.from, other.to) >= ot / 2.0 - OVERLAP_TOL_IN {
                        return false;
                    }
                    // Only beside the member's length: near its ends it is
                    // cut to what it meets there, which this end may be.
                    let along = (c - other.from).dot(odir);
                    if along < ot || along > run - ot {
                        return false;
                    }
                    // Only where the boards are at one height there.
                    let f = (along / run).clamp(0.0, 1.0);
                    let o_top = self.heel + other.from_z + f * (other.to_z - other.from_z);
                    let o_bottom = o_top - od * (1.0 + ((other.to_z - other.from_z) / run).powi(2)).sqrt();
                    o_bottom < top && o_top > bottom
                });
                if !runs_in || distance_to_segment(inside, other.from, other.to) < ot / 2.0 {
                    continue;
                }
                let end_tag = if at_start { CutEnd::Start } else { CutEnd::End };
                if let Some(mut h) = side_face(other.from, other.to, ot, inside, FaceTag::Cheek, end_tag) {
                    if h.normal.truncate().dot(dir).abs() > 1.0 - 1e-9 {
                        h.tag = FaceTag::End;
                    }
                    out.push((k, h, at_start));
                }
            }
        }
        out
    }

    /// The other ends of the hips and valleys too short to cut (left out)
    /// that start or end at `node`, and on through any further short lines
    /// meeting those ends: the nodes that would be one with `node` were
    /// the short lines not there (seed 3072 of the long run: two ridges
    /// meeting at an L whose ends are joined through a node by two short
    /// hips, 0.17 and 0.73 in).
    fn across_short_lines(&self, node: DVec2) -> Vec<DVec2> {
        let same = |a: DVec2, b: DVec2| a.distance(b) < PLAN_TOL_IN * 1e3;
        let mut reached: Vec<DVec2> = vec![node];
        let mut next = 0;
        while let Some(&at) = reached.get(next) {
            next += 1;
            for (l, _) in self.lines.iter().zip(self.left_out).filter(|(_, left_out)| **left_out) {
                let far = if same(l.from, at) {
                    l.to
                } else if same(l.to, at) {
                    l.from
                } else {
                    continue;
                };
                if !reached.iter().any(|&r| same(r, far)) {
                    reached.push(far);
                }
            }
        }
        reached.remove(0);
        reached
    }

    /// Where ridge `li` ends at `node`, one end of a hip or valley too
    /// short to cut, with no hip end of its own there (no kings bear on
    /// its end), and another ridge meets the short line's other end: were
    /// the short line not there, the two would meet at one node and this
    /// end would butt against the other ridge's side, or against its end
    /// where the two are in line (the ridge stepping sideways by less than
    /// its thickness). It is cut back to that face wherever its end would
    /// run into the other ridge as that one is laid out, and bears on it,
    /// unless a rafter bearing on the end would lose its bearing.
    fn ridge_end_across_short_line(
        &self,
        li: usize,
        line: &PlanLine,
        node: DVec2,
        out_dir: DVec2,
        at_start: bool,
    ) -> Vec<(usize, HalfSpace, bool)> {
        let t = self.settings.ridge.thickness_in;
        let top = self.ridge_top(line);
        let bottom = top - self.settings.ridge.depth_in;
        let len = line.from.distance(line.to);
        let inside = node - out_dir * (len / 2.0).min(12.0);
        let end = node + out_dir * self.ridge_end_offset(li, -out_dir, node);
        let corners = [end + out_dir.perp() * (t / 2.0), end - out_dir.perp() * (t / 2.0)];
        let hip_end_at = |p: DVec2| {
            self.lines.iter().any(|l| l.kind == RoofLineKind::Hip && l.to.distance(p) < PLAN_TOL_IN * 1e3)
        };
        let mut out = Vec::new();
        for far in self.across_short_lines(node) {
            for (k, other) in self.lines.iter().enumerate() {
                // A ridge left out beside another is not there to cut to.
                if k == li
                    || other.kind != RoofLineKind::Ridge
                    || !other.touches(far)
                    || other.touches(node)
                    || self.ridge_left_out(k)
                {
                    continue;
                }
                let Some(odir) = (other.to - other.from).try_normalize() else { continue };
                // A ridge in line with this one, a little to one side (the
                // ridge steps sideways there by less than its thickness), is
                // butted end to end; one at an angle, against its side.
                let in_line = odir.perp_dot(out_dir).abs() <= 1e-6;
                // Where two ridges both end there with no hip end, the
                // earlier keeps its end and the later is cut to it.
                let other_ends_here = other.from.distance(far) < PLAN_TOL_IN * 1e3
                    || other.to.distance(far) < PLAN_TOL_IN * 1e3;
                if other_ends_here && !hip_end_at(far) && k > li {
                    continue;
                }
                // The other ridge as laid out: its ends run past (or stop
                // short of) its nodes by its own end offsets.
                let o_start = -self.ridge_end_offset(k, odir, other.from);
                let o_end = other.from.distance(other.to) + self.ridge_end_offset(k, odir, other.to);
                let o_top = self.ridge_top(other);
                let o_bottom = o_top - self.settings.ridge.depth_in;
                if !(o_bottom < top && o_top > bottom) {
                    continue;
                }
                let runs_in = corners.iter().any(|&c| {
                    let along = (c - other.from).dot(odir);
                    let across = (c - other.from).perp_dot(odir).abs();
                    across < t / 2.0 - OVERLAP_TOL_IN
                        && along > o_start + OVERLAP_TOL_IN
                        && along < o_end - OVERLAP_TOL_IN
                });
                if !runs_in || distance_to_segment(inside, other.from, other.to) < t / 2.0 {
                    continue;
                }
                let end_tag = if at_start { CutEnd::Start } else { CutEnd::End };
                let face = if in_line {
                    // The other's laid-out end in the node's cluster, and
                    // the direction from it into that ridge.
                    let (at, into) = if other.from.distance(far) < other.to.distance(far) {
                        (other.from + odir * o_start, odir)
                    } else {
                        (other.from + odir * o_end, -odir)
                    };
                    HalfSpace::through(at.extend(0.0), into.extend(0.0), FaceTag::End, Some(end_tag))
                } else {
                    side_face(other.from, other.to, t, inside, FaceTag::Cheek, end_tag)
                };
                let Some(mut h) = face else {
                    continue;
                };
                if h.normal.truncate().dot(out_dir).abs() > 1.0 - 1e-9 {
                    h.tag = FaceTag::End;
                }
                if self.rafter_loses_ridge_end(li, node, out_dir, &h, top) {
                    continue;
                }
                out.push((k, h, at_start));
            }
        }
        out
    }

    /// The king commons that ridge `li`'s ends run into (a king at another
    /// ridge's hip end passing this ridge's end, where a hip too short to
    /// cut is left out between the two ridges or a ridge ends beside the
    /// king's line), each by rafter line with the king's side face the end
    /// is cut back to and whether it is at the ridge's start: the king runs
    /// on past the end, which bears on its side. At a hip end (whose kings
    /// bear on the end) only a king standing in for the end's own king in
    /// its plane ([`super::layout::king_standing_in`]); not a king at less
    /// than 30 degrees to the ridge (the end would be cut back along its
    /// length: left to a fitted block), and not where a rafter bearing on
    /// the end would lose its bearing.
    pub fn ridge_end_king_clearances(&self, li: usize, line: &PlanLine) -> Vec<(usize, HalfSpace, bool)> {
        let Some(dir) = (line.to - line.from).try_normalize() else {
            return Vec::new();
        };
        let t = self.settings.ridge.thickness_in;
        let tr = self.settings.rafter.thickness_in;
        let top = self.ridge_top(line);
        let len = line.from.distance(line.to);
        let Some(frame) = BoardFrame::new(line.from.extend(top), dir, 0.0) else {
            return Vec::new();
        };
        let mut out = Vec::new();
        for (node, out_dir, at_start) in [(line.from, -dir, true), (line.to, dir, false)] {
            let hip_end = self
                .lines
                .iter()
                .any(|l| l.kind == RoofLineKind::Hip && l.to.distance(node) < PLAN_TOL_IN * 1e3);
            let standing_in =
                |r: &RafterLine| r.stands_in_for.is_some_and(|n| n.distance(node) < PLAN_TOL_IN * 1e3);
            if hip_end && !self.rafters.iter().any(standing_in) {
                continue;
            }
            let end = node + out_dir * self.ridge_end_offset(li, -out_dir, node);
            let inside = node - out_dir * (len / 2.0).min(12.0);
            // The ridge's last stretch, as long as a king crossing square to
            // it and the ridge's own thickness: a king further in crosses
            // the ridge, it does not meet its end.
            let reach = 2.0 * (tr + t);
            let mut end_box = frame.box_planes(self.settings.ridge);
            end_box.extend(HalfSpace::through(end.extend(top), out_dir.extend(0.0), FaceTag::End, None));
            end_box.extend(HalfSpace::through(
                (end - out_dir * reach).extend(top),
                -out_dir.extend(0.0),
                FaceTag::End,
                None,
            ));
            let Some(end_part) = ConvexPart::from_half_spaces(&end_box) else { continue };
            let end_solid = Solid { parts: vec![end_part] };
            for (ri, r) in self.rafters.iter().enumerate() {
                if r.king.is_none() || r.upper_edge == EdgeKind::Line(li) || (hip_end && !standing_in(r)) {
                    continue;
                }
                let Some(kd) = (r.upper - r.lower).try_normalize() else { continue };
                if kd.perp_dot(out_dir).abs() < 0.5
                    || distance_to_segment(end, r.lower, r.upper) > tr / 2.0 + t
                {
                    continue;
                }
                if distance_to_segment(inside, r.lower, r.upper) < tr / 2.0 {
                    continue;
                }
                let Some((king, ..)) = self.rafter_spec(r, MemberKind::KingCommon) else { continue };
                if !runs_into(&king.solid(), &end_solid) {
                    continue;
                }
                let end_tag = if at_start { CutEnd::Start } else { CutEnd::End };
                let Some(mut h) = side_face(r.lower, r.upper, tr, inside, FaceTag::Cheek, end_tag) else {
                    continue;
                };
                if h.normal.truncate().dot(out_dir).abs() > 1.0 - 1e-9 {
                    h.tag = FaceTag::End;
                }
                if self.rafter_loses_ridge_end(li, node, out_dir, &h, top) {
                    continue;
                }
                out.push((ri, h, at_start));
            }
        }
        out
    }

    /// Cuts the end (`end`) of `spec` at plan node `node` back to the side
    /// of each king common whose board it would otherwise run into there
    /// (a king passing a node where a hip too short to cut is left out, or
    /// a ridge ends beside the king's line), bearing on the king:
    /// `rafter_piece` gives each rafter line's piece. `toward` is a point of
    /// the member. Kings ending at the node are left: what ends there bears
    /// on them by its own cuts. At a node of a ridge left out beside
    /// another, a face the end is already cut to is not cut again.
    pub fn clear_kings_at(
        &self,
        node: DVec2,
        spec: &mut PieceSpec,
        bearings: &mut Vec<(Bearing, HalfSpace)>,
        toward: DVec2,
        end: CutEnd,
        rafter_piece: &[Option<usize>],
    ) {
        let tr = self.settings.rafter.thickness_in;
        let reach = tr / 2.0 + spec.size.thickness_in + spec.size.depth_in;
        // At a node of a ridge left out beside another, the kings moved
        // onto the kept ridge run on past the node and can cross the end
        // with no corner of either inside the other: read the wood the two
        // share there.
        let crossings = self.at_left_out_ridge(node);
        for (ri, r) in self.rafters.iter().enumerate() {
            if r.king.is_none()
                || r.upper.distance(node) < PLAN_TOL_IN * 1e3
                || distance_to_segment(node, r.lower, r.upper) > reach
                || distance_to_segment(toward, r.lower, r.upper) < tr / 2.0
            {
                continue;
            }
            let Some(Some(piece)) = rafter_piece.get(ri) else { continue };
            let Some((king, ..)) = self.rafter_spec(r, MemberKind::KingCommon) else { continue };
            let (king, member) = (king.solid(), spec.solid());
            let meets = runs_into(&king, &member) || (crossings && share_wood(&king, &member));
            if !meets {
                continue;
            }
            let Some(mut h) = side_face(r.lower, r.upper, tr, toward, FaceTag::Cheek, end) else { continue };
            h.tag = cut_tag(&h, &spec.frame);
            let same =
                |c: &HalfSpace| c.normal.dot(h.normal) > 1.0 - 1e-12 && (c.offset - h.offset).abs() < 1e-9;
            if crossings && spec.upper_cuts.iter().chain(&spec.lower_cuts).any(same) {
                continue;
            }
            if end == CutEnd::Bottom {
                spec.lower_cuts.push(h);
            } else {
                spec.upper_cuts.push(h);
            }
            bearings.push((Bearing::Piece(*piece), h));
        }
    }

    /// Whether cutting ridge `li`'s end at `node` (outward `out_dir`) back
    /// to `h` would leave part of a rafter bearing on that end with nothing
    /// behind it: the end is then left as it is.
    fn rafter_loses_ridge_end(
        &self,
        li: usize,
        node: DVec2,
        out_dir: DVec2,
        h: &HalfSpace,
        top: f64,
    ) -> bool {
        let t = self.settings.ridge.thickness_in;
        // How far in from the node the cut crosses each side of the ridge.
        let cut_back = [1.0, -1.0]
            .iter()
            .filter_map(|&sign| {
                let side = node + out_dir.perp() * (sign * t / 2.0);
                let d0 = h.distance(side.extend(top));
                let d1 = h.distance((side - out_dir).extend(top));
                ((d0 - d1).abs() > 1e-12).then(|| d0 / (d0 - d1))
            })
            .fold(f64::NEG_INFINITY, f64::max);
        if !cut_back.is_finite() || cut_back <= 0.0 {
            return false;
        }
        let half = self.settings.rafter.thickness_in / 2.0;
        // A rafter whose centre line is shorter in plan than a rafter is
        // thick between the sides of the lines it bears on (a jack's stub
        // between a valley and the ridge at a crowded node) is no board to
        // keep a bearing for: its cheek finds no valley to land on and it
        // is left out, or it is a wedge of wood a tenth of an inch long
        // (seed 24280 of the long run: a jack 2.2 in long between centre
        // lines, -0.1 in between the faces, kept a ridge's end running
        // 0.24 in into a king).
        self.rafters.iter().any(|r| {
            r.upper_edge == EdgeKind::Line(li)
                && self.clear_run(r) >= 2.0 * half
                && (r.upper - node).dot(-out_dir) - half < cut_back + OVERLAP_TOL_IN
        })
    }

    /// The plan length of rafter line `r`'s centre line between the side
    /// faces of the roof lines at its ends (from the wall line at an eave),
    /// each half that line's thickness off it, measured along the rafter.
    fn clear_run(&self, r: &RafterLine) -> f64 {
        let Some(up) = (r.upper - r.lower).try_normalize() else { return 0.0 };
        let back = |edge: EdgeKind| {
            let EdgeKind::Line(li) = edge else { return 0.0 };
            let Some(line) = self.lines.get(li) else { return 0.0 };
            let Some(dir) = (line.to - line.from).try_normalize() else { return 0.0 };
            let t = match line.kind {
                RoofLineKind::Ridge => self.settings.ridge.thickness_in,
                RoofLineKind::Hip => self.settings.hip.thickness_in,
                RoofLineKind::Valley => self.settings.valley.thickness_in,
            };
            t / 2.0 / up.perp_dot(dir).abs().max(1e-9)
        };
        r.lower.distance(r.upper) - back(r.lower_edge) - back(r.upper_edge)
    }

    /// The ridge's pieces, split so none is longer than the longest stock,
    /// splices on common-rafter lines where they fall right.
    pub fn ridge_specs(&self, li: usize, line: &PlanLine) -> Vec<PieceSpec> {
        let Some(dir) = (line.to - line.from).try_normalize() else {
            return Vec::new();
        };
        let len = line.from.distance(line.to);
        let end_offset = |node: DVec2| self.ridge_end_offset(li, dir, node);
        let start = -end_offset(line.from);
        let end = len + end_offset(line.to);
        let top = self.ridge_top(line);
        let commons: Vec<f64> = self
            .rafters
            .iter()
            .filter(|r| r.upper_edge == EdgeKind::Line(li) && r.king.is_none())
            .map(|r| (r.upper - line.from).dot(dir))
            .collect();
        // As few pieces as the stock allows, each splice on the common
        // nearest an even split that keeps every piece within the stock.
        let longest = self.settings.longest_stock_in().unwrap_or(f64::INFINITY);
        let total = end - start;
        let pieces = if longest.is_finite() && longest > 0.0 {
            ((total - STOCK_TOL_IN) / longest).ceil().max(1.0) as usize
        } else {
            1
        };
        let mut cuts_at = vec![start];
        for k in 1..pieces {
            let prev = cuts_at.last().copied().unwrap_or(start);
            let target = start + total * k as f64 / pieces as f64;
            let fits = |c: f64| {
                c - prev <= longest + STOCK_TOL_IN && end - c <= (pieces - k) as f64 * longest + STOCK_TOL_IN
            };
            let splice = commons
                .iter()
                .copied()
                .filter(|c| *c > prev && fits(*c))
                .min_by(|a, b| (a - target).abs().total_cmp(&(b - target).abs()));
            cuts_at.push(splice.unwrap_or(target));
        }
        cuts_at.push(end);
        let Some(frame0) = BoardFrame::new(line.from.extend(top), dir, 0.0) else {
            return Vec::new();
        };
        let mut clearances = self.ridge_end_clearances(li, line);
        clearances.extend(self.ridge_end_king_clearances(li, line));
        // A ridge so low near a wall (a narrow plane beside it) that its
        // lower edge would run down into the wall's plate is cut level
        // with the plate's top, as a hip there is, and bears on it.
        let sides: Vec<&PlaneFrame> = line.planes.iter().filter_map(|&pi| self.planes.get(pi)).collect();
        let plate_level = match sides.as_slice() {
            [a, b] => self.hangs_into_plate(&frame0, self.settings.ridge, len, [a, b]),
            _ => false,
        };
        let last = cuts_at.len().saturating_sub(2);
        cuts_at
            .windows(2)
            .enumerate()
            .filter_map(|(k, w)| {
                let (a, b) = (w[0], w[1]);
                let pa = line.from + dir * a;
                let pb = line.from + dir * b;
                let lo =
                    HalfSpace::through(pa.extend(top), -frame0.along, FaceTag::End, Some(CutEnd::Start))?;
                let hi = HalfSpace::through(pb.extend(top), frame0.along, FaceTag::End, Some(CutEnd::End))?;
                let mut upper_cuts = vec![hi];
                let mut lower_cuts = vec![lo];
                if plate_level {
                    lower_cuts.extend(HalfSpace::through(
                        DVec3::ZERO,
                        -DVec3::Z,
                        FaceTag::Seat,
                        Some(CutEnd::Seat),
                    ));
                }
                for (_, h, at_start) in &clearances {
                    match (*at_start, k == 0, k == last) {
                        (true, true, _) => lower_cuts.push(*h),
                        (false, _, true) => upper_cuts.push(*h),
                        _ => {}
                    }
                }
                Some(PieceSpec {
                    kind: MemberKind::Ridge,
                    size: self.settings.ridge,
                    frame: BoardFrame { origin: pa.extend(top), ..frame0 },
                    plan_line: [pa, pb],
                    slope: 0.0,
                    top_planes: Vec::new(),
                    upper_cuts,
                    upper_step: None,
                    lower_cuts,
                    seat: Vec::new(),
                    has_tail: false,
                    drop_in: 0.0,
                    plumb_square: [12.0, 0.0],
                })
            })
            .collect()
    }

    /// A common, king or jack, with the roof lines it bears on.
    pub fn rafter_spec(
        &self,
        r: &RafterLine,
        kind: MemberKind,
    ) -> Option<(PieceSpec, LineBearing, LineBearing, LineBearing)> {
        let p = self.planes.get(r.plane)?;
        let size = self.settings.rafter;
        let seated = r.lower_edge == EdgeKind::Eave;
        let origin = r.lower.extend(self.heel + p.height(r.lower));
        let frame = BoardFrame::new(origin, r.upper - r.lower, p.slope)?;
        let mid = (r.lower + r.upper) / 2.0;
        let line_face = |edge: EdgeKind, end: CutEnd| -> Option<(usize, HalfSpace)> {
            let EdgeKind::Line(li) = edge else {
                return None;
            };
            let line = self.lines.get(li)?;
            let t = match line.kind {
                RoofLineKind::Ridge => self.settings.ridge.thickness_in,
                RoofLineKind::Hip => self.settings.hip.thickness_in,
                RoofLineKind::Valley => self.settings.valley.thickness_in,
            };
            let mut h = side_face(line.from, line.to, t, mid, FaceTag::Cheek, end)?;
            h.tag = cut_tag(&h, &frame);
            Some((li, h))
        };
        let upper = match r.king {
            Some(King::End { ridge }) => {
                let line = self.lines.get(ridge)?;
                // The ridge runs half a rafter thickness past its hip end,
                // flush with the side kings' faces.
                let out = if line.from.distance(r.upper) < line.to.distance(r.upper) {
                    (line.from - line.to).try_normalize()?
                } else {
                    (line.to - line.from).try_normalize()?
                };
                let face = r.upper + out * (size.thickness_in / 2.0);
                let mut h = HalfSpace::through(
                    face.extend(0.0),
                    (-out).extend(0.0),
                    FaceTag::Plumb,
                    Some(CutEnd::Top),
                )?;
                h.tag = cut_tag(&h, &frame);
                Some((ridge, h))
            }
            _ => line_face(r.upper_edge, CutEnd::Top),
        };
        let (upper_line, upper_cut) = upper?;
        // Into a corner of two hips: a double cheek, one against each.
        let not_ridge = |e: EdgeKind| match e {
            EdgeKind::Line(li) => self.lines.get(li).is_some_and(|l| l.kind != RoofLineKind::Ridge),
            _ => false,
        };
        let also = r
            .upper_also
            .filter(|e| not_ridge(*e) && not_ridge(r.upper_edge))
            .and_then(|e| line_face(e, CutEnd::Top));
        let mut lower_cuts = Vec::new();
        let mut lower_bearing = None;
        let mut seat = Vec::new();
        let has_tail = seated && p.overhang_in > 0.0;
        if seated {
            seat.push(SeatWall {
                inside: p.wall_side(0.0, true, FaceTag::Interior, None)?,
                half_cuts: Vec::new(),
                plate_inner: None,
            });
            if has_tail {
                lower_cuts.extend(self.tail_cuts(p));
                // Tails fan in over an inside corner: near it they are cut
                // back to the side of the valley's tail.
                for l in self.lines.iter().filter(|l| l.kind == RoofLineKind::Valley) {
                    let at_wall_end = [p.start, p.end].iter().any(|c| c.distance(l.from) < PLAN_TOL_IN * 1e3);
                    if at_wall_end {
                        lower_cuts.extend(side_face(
                            l.from,
                            l.to,
                            self.settings.valley.thickness_in,
                            mid,
                            FaceTag::Tail,
                            CutEnd::Tail,
                        ));
                    }
                }
            }
        } else {
            let (li, h) = line_face(r.lower_edge, CutEnd::Bottom)?;
            lower_cuts.push(h);
            lower_bearing = Some((li, h));
        }
        let spec = PieceSpec {
            kind,
            size,
            frame,
            plan_line: [r.lower, r.upper],
            slope: p.slope,
            top_planes: Vec::new(),
            upper_cuts: std::iter::once(upper_cut).chain(also.map(|(_, h)| h)).collect(),
            upper_step: None,
            lower_cuts,
            seat,
            has_tail,
            drop_in: 0.0,
            plumb_square: [12.0, 12.0 * p.slope],
        };
        Some((spec, Some((upper_line, upper_cut)), lower_bearing, also))
    }

    /// Whether planes `a` and `b` are one roof plane (the same, or parts of
    /// coplanar walls: a roof line may name either wall).
    pub fn same_group(&self, a: usize, b: usize) -> bool {
        a == b
            || match (self.planes.get(a), self.planes.get(b)) {
                (Some(pa), Some(pb)) => pa.plane_group == pb.plane_group,
                _ => false,
            }
    }

    /// Whether plan point `p` lies on plane `a` or a part coplanar with it.
    pub fn group_contains(&self, a: usize, p: DVec2) -> bool {
        (0..self.planes.len()).any(|j| self.same_group(a, j) && self.planes[j].contains(p))
    }

    /// Cuts for a hip's end at a node where hips meet with no king between
    /// them (a peak with no ridge, hips merging into one rising on from the
    /// node, or hips either side of a king-less plane at a ridge's end):
    /// for each other hip there (left-out ones aside), the vertical plane
    /// halving the plan angle between the two, so the hips share the space
    /// round the node without overlapping. `far` is this hip's other end.
    /// Before, hips merging into one were cut plumb at the point and ran
    /// into each other by up to an inch round it.
    pub fn hub_cuts(&self, node: DVec2, far: DVec2, end: CutEnd, frame: &BoardFrame) -> Vec<HalfSpace> {
        self.hub_cuts_against(node, far, end, frame, |_| true)
    }

    /// As [`Ctx::hub_cuts`], against only the other hips `against` keeps.
    fn hub_cuts_against(
        &self,
        node: DVec2,
        far: DVec2,
        end: CutEnd,
        frame: &BoardFrame,
        against: impl Fn(&PlanLine) -> bool,
    ) -> Vec<HalfSpace> {
        let near = |p: DVec2| p.distance(node) < PLAN_TOL_IN * 1e3;
        let Some(mine) = (far - node).try_normalize() else { return Vec::new() };
        self.lines
            .iter()
            .enumerate()
            // A hip too short to cut (left out) takes no share of the node.
            .filter(|(i, l)| {
                l.kind == RoofLineKind::Hip && against(l) && !self.left_out.get(*i).copied().unwrap_or(false)
            })
            .filter_map(|(_, l)| {
                let other_far = if near(l.to) {
                    l.from
                } else if near(l.from) {
                    l.to
                } else {
                    return None;
                };
                if other_far.distance(far) < PLAN_TOL_IN * 1e3 {
                    return None;
                }
                let theirs = (other_far - node).try_normalize()?;
                // Nearer this hip's line: (p - node) . (mine - theirs) >= 0.
                let h = HalfSpace::through(
                    node.extend(0.0),
                    (theirs - mine).extend(0.0),
                    FaceTag::Cheek,
                    Some(end),
                )?;
                Some(HalfSpace { tag: cut_tag(&h, frame), ..h })
            })
            .collect()
    }

    /// Whether a member on `frame` (plan run `run`) dips below the plates'
    /// top where it is over the plate of either plane's wall: between the
    /// wall line and the plate's inner face, one seat width in.
    pub fn hangs_into_plate(
        &self,
        frame: &BoardFrame,
        size: BoardSize,
        run: f64,
        sides: [&PlaneFrame; 2],
    ) -> bool {
        // Plan distance per unit length along the member.
        let plan_per_length = frame.along.truncate().length();
        if !(plan_per_length > 1e-9 && run.is_finite()) {
            return false;
        }
        // The lower edge's centre drops `depth / up.z` plumb below the top.
        let plumb_depth = if frame.up.z > 1e-9 { size.depth_in / frame.up.z } else { return false };
        // Sampled every inch or less of plan, finer than any plate band.
        let samples = (run.ceil() as usize).clamp(1, 100_000);
        (0..=samples).any(|k| {
            let s = run * k as f64 / samples as f64 / plan_per_length;
            let p = frame.origin + frame.along * s;
            let below = p.z - plumb_depth < -PLAN_TOL_IN;
            below
                && sides.iter().any(|w| {
                    let d = w.dist_in(p.truncate());
                    // The lower edge's sides lie `half` nearer and farther
                    // from the wall line than its centre: the one nearer
                    // may be over the plate with the centre past its inner
                    // face (seed 25797 of the long run: a hip's centre
                    // 3.51 in in, its side 3.07 in, 1.3 in below the top).
                    let half = size.thickness_in / 2.0 * frame.side.truncate().dot(w.inward).abs();
                    (-size.thickness_in / 2.0..=self.settings.seat_width_in + half).contains(&d)
                })
        })
    }

    /// The plane of a hip or valley on its left and right, looking up it.
    pub fn sides(&self, line: &PlanLine) -> Option<(usize, usize)> {
        let dir = (line.to - line.from).try_normalize()?;
        let mid = (line.from + line.to) / 2.0;
        let probe = mid + dir.perp() * (line.from.distance(line.to) * 1e-3).min(1.0);
        let [a, b] = line.planes;
        let a_left = self.group_contains(a, probe);
        Some(if a_left { (a, b) } else { (b, a) })
    }

    /// A hip: seated over its corner, backed or dropped, its top double
    /// cheek against the king commons at the ridge end.
    pub fn hip_spec(&self, line: &PlanLine, rafter_piece: &[Option<usize>]) -> Option<Built> {
        let (left, right) = self.sides(line)?;
        let (pl, pr) = (self.planes.get(left)?, self.planes.get(right)?);
        let size = self.settings.hip;
        let run = line.from.distance(line.to);
        let slope = (line.to_z - line.from_z) / run;
        let probe = BoardFrame::new(line.from.extend(self.heel), line.to - line.from, slope)?;
        let half = size.thickness_in / 2.0;
        let corner_drop = |p: &PlaneFrame, sign: f64| {
            let at = line.from + probe.side.truncate() * (sign * half);
            (line.from_z - p.height(at)).max(0.0)
        };
        let (drop_in, top_planes) = match self.settings.hip_top {
            HipTop::Dropped => (corner_drop(pl, 1.0).max(corner_drop(pr, -1.0)), Vec::new()),
            HipTop::Backed => (
                0.0,
                [pl, pr]
                    .iter()
                    .filter_map(|p| p.below_top(self.heel, FaceTag::Backing, Some(CutEnd::FullLength)))
                    .collect(),
            ),
        };
        let frame = BoardFrame { origin: line.from.extend(line.from_z + self.heel - drop_in), ..probe };
        let mid = (line.from + line.to) / 2.0;
        let up_dir = probe.along.truncate().normalize_or_zero();
        let mut upper_cuts = Vec::new();
        let mut bearings = Vec::new();
        let mut peak_without_ridge = false;
        // A hip that starts up on the roof (where a valley and a ridge end)
        // has no seat: it sits against what is framed there first.
        let seated = line.from_z.abs() < 1e-6;
        let mut foot_without_ridge = false;
        let mut foot_cuts = Vec::new();
        if !seated {
            foot_cuts = self.foot_on_roof(line, up_dir, mid, &frame, &mut bearings, true);
            if foot_cuts.is_empty() {
                foot_without_ridge = true;
                foot_cuts.extend(self.hub_cuts(line.from, line.to, CutEnd::Bottom, &probe));
            }
            if foot_cuts.is_empty() {
                foot_cuts.extend(HalfSpace::through(
                    line.from.extend(line.from_z),
                    (line.from - line.to).extend(0.0),
                    FaceTag::Plumb,
                    Some(CutEnd::Bottom),
                ));
            }
        }
        let mut kingless = Vec::new();
        let mut king_cuts = Vec::new();
        for &pi in &[left, right] {
            // The king in this plane at the hip's top, if any, or the king
            // standing in for it (running on past the node less than a
            // rafter's thickness off): the cheek bears on its side.
            let king = self.rafters.iter().enumerate().find(|(_, r)| {
                self.same_group(r.plane, pi)
                    && r.king.is_some()
                    && (r.upper.distance(line.to) < PLAN_TOL_IN * 1e3
                        || r.stands_in_for.is_some_and(|n| n.distance(line.to) < PLAN_TOL_IN * 1e3))
            });
            match king {
                Some((ki, r)) => {
                    let mut h = side_face(
                        r.lower,
                        r.upper,
                        self.settings.rafter.thickness_in,
                        mid,
                        FaceTag::Cheek,
                        CutEnd::Top,
                    )?;
                    h.tag = cut_tag(&h, &frame);
                    upper_cuts.push(h);
                    king_cuts.push((ki, h));
                    if let Some(Some(piece)) = rafter_piece.get(ki) {
                        bearings.push((Bearing::Piece(*piece), h));
                    }
                }
                None => {
                    peak_without_ridge = true;
                    kingless.push(pi);
                }
            }
        }
        let king_missing = peak_without_ridge;
        if upper_cuts.is_empty() {
            // A ridge starting where this hip ends (another hip rising on
            // from the node): the top keeps clear of it and bears on it.
            for k in self.ridges_at(line.to) {
                if let Some(mut h) = self.ridge_face_at(k, line.to, -up_dir, mid, CutEnd::Top) {
                    h.tag = cut_tag(&h, &frame);
                    upper_cuts.push(h);
                    bearings.push((Bearing::Line(k), h));
                }
            }
            if !upper_cuts.is_empty() {
                // With no king on either side, nothing stands between this
                // hip and another ending at the ridge's end beside it: the
                // two share the space in front of the end as hips at a
                // peak do, each keeping the plan angle nearer its own
                // line, or they would run into each other there.
                upper_cuts.extend(self.hub_cuts(line.to, line.from, CutEnd::Top, &frame));
            }
        }
        if upper_cuts.is_empty() {
            // Hips meeting at a peak with no ridge: each keeps the plan
            // angle nearer its own line than any other's.
            let hub = self.hub_cuts(line.to, line.from, CutEnd::Top, &frame);
            if hub.is_empty() {
                upper_cuts.extend(HalfSpace::through(
                    line.to.extend(line.to_z),
                    (line.to - line.from).extend(0.0),
                    FaceTag::Plumb,
                    Some(CutEnd::Top),
                ));
            }
            // No joint is claimed at a hub: it needs a fitted block.
            upper_cuts.extend(hub);
        } else {
            peak_without_ridge = false;
        }
        let has_tail = seated && pl.overhang_in > 0.0 && pr.overhang_in > 0.0;
        let mut lower_cuts = foot_cuts;
        if !seated && self.hangs_into_plate(&frame, size, run, [pl, pr]) {
            // A hip up on the roof so low near a wall that its lower edge
            // would run down into the wall's plate (a long narrow plane
            // beside the wall): cut level with the plate's top, as the
            // hips and valleys seated there are notched, and flagged.
            lower_cuts.extend(HalfSpace::through(DVec3::ZERO, -DVec3::Z, FaceTag::Seat, Some(CutEnd::Seat)));
        }
        if has_tail {
            lower_cuts.extend(self.fascia_side_tail(pl));
            lower_cuts.extend(self.fascia_side_tail(pr));
            if let TailCut::PlumbAndLevel { plumb_height_in } = self.settings.tail {
                let z = [pl, pr]
                    .iter()
                    .map(|p| self.heel - p.slope * p.overhang_in - plumb_height_in)
                    .fold(f64::INFINITY, f64::min);
                lower_cuts.extend(HalfSpace::through(
                    DVec3::new(0.0, 0.0, z),
                    -DVec3::Z,
                    FaceTag::Soffit,
                    Some(CutEnd::Tail),
                ));
            }
        }
        let seat = if seated {
            vec![
                SeatWall {
                    inside: pl.wall_side(0.0, true, FaceTag::Interior, None)?,
                    half_cuts: Vec::new(),
                    plate_inner: self.plate_inner(pl),
                },
                SeatWall {
                    inside: pr.wall_side(0.0, true, FaceTag::Interior, None)?,
                    half_cuts: Vec::new(),
                    plate_inner: self.plate_inner(pr),
                },
            ]
        } else {
            Vec::new()
        };
        let mut spec = PieceSpec {
            kind: MemberKind::Hip,
            size,
            frame,
            plan_line: [line.from, line.to],
            slope,
            top_planes,
            upper_cuts,
            upper_step: None,
            lower_cuts,
            seat,
            has_tail,
            drop_in,
            plumb_square: hip_square(slope, pl, pr),
        };
        if !seated {
            // A foot at one end of a hip or valley too short to cut is also
            // cut to the ridges at its other end, as if they met at one node.
            let across = self.ridges_across_short_lines(line.from);
            if !across.is_empty() {
                self.clear_ridges_at(&across, &mut spec, &mut bearings, up_dir, mid, CutEnd::Bottom);
            }
        }
        if !seated {
            self.clear_kings_at(line.from, &mut spec, &mut bearings, mid, CutEnd::Bottom, rafter_piece);
            self.cut_foot_with_valley_tops(line, &mut spec, &mut bearings, rafter_piece);
        }
        if king_missing && !peak_without_ridge {
            // One side's king is there, the other side has none (a valley
            // comes up to the node on that side): the ridge running on
            // from the node is beside the king, and the top is cut to it
            // too wherever it would run into it.
            self.clear_ridges_at_top(line, &mut spec, &mut bearings, -up_dir, mid);
            // Nor does anything stand between this hip and another hip of
            // the plane with no king ending at the node (the two sides of
            // a plane topping out there): they share the space in front of
            // the kings' ends as hips at a peak do, or they would run into
            // each other there.
            let beside =
                |l: &PlanLine| l.planes.iter().any(|&p| kingless.iter().any(|&k| self.same_group(p, k)));
            spec.upper_cuts.extend(self.hub_cuts_against(
                line.to,
                line.from,
                CutEnd::Top,
                &spec.frame,
                beside,
            ));
        }
        if self.drop_king_cuts_not_met(&mut spec, &mut bearings, &king_cuts) {
            // With a king's cut taken off, the top may now run into the
            // ridge it stopped short of: cut to it where it does.
            self.clear_ridges_at_top(line, &mut spec, &mut bearings, -up_dir, mid);
        }
        // A top at one end of a hip too short to cut (left out) is also cut
        // to the ridges at its other end wherever it would run into them,
        // as a foot there is, as if they met at one node.
        let across = self.ridges_across_short_lines(line.to);
        if !across.is_empty() {
            self.clear_ridges_at(&across, &mut spec, &mut bearings, -up_dir, mid, CutEnd::Top);
        }
        if self.at_left_out_ridge(line.to) {
            // At a node of a ridge left out beside another, the kings moved
            // onto the kept ridge, and the kept ridge's own kings, run on
            // past the node: the top is cut back to any it would run into.
            self.clear_kings_at(line.to, &mut spec, &mut bearings, mid, CutEnd::Top, rafter_piece);
        }
        self.step_at_ridge_end(line, &mut spec, &mut bearings, mid);
        Some((spec, bearings, peak_without_ridge || foot_without_ridge))
    }

    /// Steps a hip's top (`spec`) where it is cut to the side of a ridge
    /// ending at its top node and its cheek there runs on past the ridge's
    /// end, beside the next ridge: one in line with the first, butted
    /// against its end across a hip too short to cut (left out), its side
    /// less than a ridge's thickness aside of the first one's. Past the
    /// end the cheek is cut to the next ridge's side and bears on it, the
    /// step's face on the end's plane. `toward` is a point of the hip.
    ///
    /// Cut to the first ridge's side alone, that part of the cheek stood
    /// off the next ridge's side by the step (seed 4164 of the long run:
    /// 0.58 in) or ran into it. Left unstepped where the stepped top would
    /// run into either ridge or would not reach the next one's side.
    fn step_at_ridge_end(
        &self,
        line: &PlanLine,
        spec: &mut PieceSpec,
        bearings: &mut Vec<(Bearing, HalfSpace)>,
        toward: DVec2,
    ) {
        let across = self.ridges_across_short_lines(line.to);
        if across.is_empty() || spec.upper_cuts.len() != 1 {
            return;
        }
        let t = self.settings.ridge.thickness_in;
        let near_node = |p: DVec2| p.distance(line.to) < PLAN_TOL_IN * 1e3;
        let same = |a: &HalfSpace, b: &HalfSpace| {
            a.normal.dot(b.normal) > 1.0 - 1e-12 && (a.offset - b.offset).abs() < 1e-9
        };
        for k in self.ridges_at(line.to) {
            let Some(ridge) = self.lines.get(k) else { continue };
            let Some(dir) = (ridge.to - ridge.from).try_normalize() else { continue };
            let out = if near_node(ridge.from) {
                -dir
            } else if near_node(ridge.to) {
                dir
            } else {
                continue;
            };
            let Some(side) = side_face(ridge.from, ridge.to, t, toward, FaceTag::Cheek, CutEnd::Top) else {
                continue;
            };
            let Some(&near) = spec.upper_cuts.iter().find(|c| same(c, &side)) else { continue };
            let end = line.to + out * self.ridge_end_offset(k, dir, line.to);
            let Some(at) =
                HalfSpace::through(end.extend(0.0), out.extend(0.0), FaceTag::Cheek, Some(CutEnd::Top))
            else {
                continue;
            };
            let solid = spec.solid();
            let runs_past = solid
                .faces()
                .filter(|f| {
                    f.normal.dot(near.normal) > 1.0 - 1e-9
                        && f.vertices.first().is_some_and(|&v| near.distance(v).abs() < 1e-5)
                })
                .flat_map(|f| f.vertices.iter())
                .any(|&v| at.distance(v) > OVERLAP_TOL_IN);
            if !runs_past {
                continue;
            }
            for &(j, far_node) in &across {
                let Some(next) = self.lines.get(j) else { continue };
                let Some(next_dir) = (next.to - next.from).try_normalize() else { continue };
                // In line, and running on beyond the end.
                let beyond = if next.from.distance(far_node) < next.to.distance(far_node) {
                    next.to
                } else {
                    next.from
                };
                if next_dir.perp_dot(dir).abs() > 1e-6 || (beyond - line.to).dot(out) <= 0.0 {
                    continue;
                }
                let Some(far) = side_face(next.from, next.to, t, toward, FaceTag::Cheek, CutEnd::Top) else {
                    continue;
                };
                if far.normal.dot(near.normal) < 1.0 - 1e-9 {
                    continue;
                }
                let step = super::board::TopStep {
                    near,
                    at: HalfSpace { tag: cut_tag(&at, &spec.frame), ..at },
                    far: HalfSpace { tag: near.tag, ..far },
                };
                if !(step.depth_in().abs() > OVERLAP_TOL_IN && step.depth_in().abs() < t) {
                    continue;
                }
                let mut stepped = spec.clone();
                stepped.upper_step = Some(step);
                let cut = stepped.solid();
                // A hip meeting the ridge at a slant may leave past the end
                // only a wedge its side cuts off short of the next ridge:
                // nothing there to bear on, so no step.
                let bears_both =
                    [&near, &step.far].iter().all(|h| face_area_on(&cut, h) > SEAT_AREA_MIN_SQ_IN);
                if !bears_both {
                    continue;
                }
                let into = [k, j].iter().any(|&r| {
                    self.lines.get(r).is_some_and(|l| {
                        self.ridge_specs(r, l).iter().any(|p| cut.runs_into(&p.solid(), OVERLAP_TOL_IN))
                    })
                });
                if into {
                    continue;
                }
                *spec = stepped;
                bearings.push((Bearing::Line(j), step.far));
                return;
            }
        }
    }

    /// Takes off a hip's top each cut to a king's side (`king_cuts`, by
    /// rafter line) where the king's side is not there to bear on and the
    /// hip would not run into the king without it, with its bearing.
    ///
    /// A king is cut at its top to what it meets there; where the ridge
    /// runs off the node at a slant to the king (a ridge at 45 degrees in
    /// plan, the king square to its wall), the king's top is cut back
    /// along the ridge's end and its side stops short of the hip, whose
    /// top meets the ridge's side instead. Cut to the king's side all the
    /// same, the hip's face there met nothing (seed 2504 of the long run:
    /// 1.14 in of gap).
    fn drop_king_cuts_not_met(
        &self,
        spec: &mut PieceSpec,
        bearings: &mut Vec<(Bearing, HalfSpace)>,
        king_cuts: &[(usize, HalfSpace)],
    ) -> bool {
        let mut dropped = false;
        for &(ki, h) in king_cuts {
            let Some(r) = self.rafters.get(ki) else { continue };
            // A king's top cut square or along it (a ridge at the node in
            // line with it or square to it) leaves its sides their full
            // length to the top; a king running on past the node has its
            // side there whatever its top is cut to.
            let Some(up) = (r.upper - r.lower).try_normalize() else { continue };
            let slanting = self.lines.iter().any(|l| {
                let dir = (l.to - l.from).try_normalize().unwrap_or(up);
                l.kind == RoofLineKind::Ridge
                    && l.touches(r.upper)
                    && dir.perp_dot(up).abs() > 1e-9
                    && dir.dot(up).abs() > 1e-9
            });
            if !slanting || r.stands_in_for.is_some() {
                continue;
            }
            let Some((king, ..)) = self.rafter_spec(r, MemberKind::KingCommon) else { continue };
            let king = king.solid();
            let solid = spec.solid();
            let on_plane = |v: DVec3| h.distance(v).abs() < 1e-5;
            let lands = solid
                .faces()
                .filter(|f| f.normal.dot(h.normal) > 1.0 - 1e-9 && f.vertices.iter().all(|&v| on_plane(v)))
                .flat_map(|f| f.vertices.iter().copied())
                .all(|v| king.depth_of(v) > -OVERLAP_TOL_IN);
            if lands {
                continue;
            }
            let mut without = spec.clone();
            without.upper_cuts.retain(|c| c != &h);
            if without.solid().runs_into(&king, OVERLAP_TOL_IN) {
                continue;
            }
            *spec = without;
            bearings.retain(|(_, m)| m != &h);
            dropped = true;
        }
        dropped
    }

    /// The cuts of a hip's or valley's foot where it starts up on the roof,
    /// against the ridges and the tops of the valleys ending there, each
    /// added to `bearings`. `up_dir` is its plan direction up from the
    /// node, `toward` a point of it; valleys' tops only `on_valleys` (a
    /// hip running back beside the valley it starts on). Hips meeting hips
    /// there are left to the caller (a fitted block).
    fn foot_on_roof(
        &self,
        line: &PlanLine,
        up_dir: DVec2,
        toward: DVec2,
        frame: &BoardFrame,
        bearings: &mut Vec<(Bearing, HalfSpace)>,
        on_valleys: bool,
    ) -> Vec<HalfSpace> {
        let mut cuts = Vec::new();
        let mut ridges_done: Vec<usize> = Vec::new();
        for (k, other) in self.lines.iter().enumerate() {
            let meets = match other.kind {
                RoofLineKind::Ridge => other.touches(line.from),
                RoofLineKind::Valley if on_valleys => {
                    other.to.distance(line.from) < PLAN_TOL_IN * 1e3
                        && other.from.distance(line.from) > PLAN_TOL_IN * 1e3
                }
                RoofLineKind::Valley | RoofLineKind::Hip => false,
            };
            if !meets || std::ptr::eq(other, line) {
                continue;
            }
            // A ridge left out beside another is met as the ridge kept in
            // its place, once.
            let k = if other.kind == RoofLineKind::Ridge { self.ridge_framed(k) } else { k };
            if other.kind == RoofLineKind::Ridge {
                if ridges_done.contains(&k) {
                    continue;
                }
                ridges_done.push(k);
            }
            // A hip running on within 10 degrees of the valley's line past
            // its top (a hip of almost no rise carrying the valley's line
            // on) butts against that top, cut plumb at the node: the
            // valley's side runs along the hip there. Any other crosses
            // the valley's side and is cut to it.
            let valley_dir = (other.to - other.from).try_normalize();
            let Some(mut h) = (match (other.kind, valley_dir) {
                (RoofLineKind::Ridge, _) => self.ridge_face_at(k, line.from, up_dir, toward, CutEnd::Bottom),
                (_, Some(vd)) if vd.dot(up_dir) > IN_LINE_COS => HalfSpace::through(
                    line.from.extend(0.0),
                    (-vd).extend(0.0),
                    FaceTag::Cheek,
                    Some(CutEnd::Bottom),
                ),
                _ => side_face(
                    other.from,
                    other.to,
                    self.settings.valley.thickness_in,
                    toward,
                    FaceTag::Cheek,
                    CutEnd::Bottom,
                ),
            }) else {
                continue;
            };
            h.tag = cut_tag(&h, frame);
            cuts.push(h);
            bearings.push((Bearing::Line(k), h));
        }
        cuts
    }

    /// Cuts a hip's top (`spec`) to the face of each ridge at its top node
    /// that its body would otherwise run into, bearing on it there. `down`
    /// is the hip's plan direction from the node, `toward` a point of it.
    fn clear_ridges_at_top(
        &self,
        line: &PlanLine,
        spec: &mut PieceSpec,
        bearings: &mut Vec<(Bearing, HalfSpace)>,
        down: DVec2,
        toward: DVec2,
    ) {
        let at_node: Vec<(usize, DVec2)> =
            self.ridges_at(line.to).into_iter().map(|k| (k, line.to)).collect();
        self.clear_ridges_at(&at_node, spec, bearings, down, toward, CutEnd::Top);
    }

    /// The ridges meeting the other end of a hip or valley too short to
    /// cut that ends at `node`, but not `node` itself, each with the point
    /// where it meets that end: were the short line not there, they would
    /// meet at `node`.
    fn ridges_across_short_lines(&self, node: DVec2) -> Vec<(usize, DVec2)> {
        let mut out = Vec::new();
        let own = self.ridges_at(node);
        for far in self.across_short_lines(node) {
            for (k, other) in self.lines.iter().enumerate() {
                // A ridge left out beside another is met as the one kept.
                let k = self.ridge_framed(k);
                let new = !out.iter().any(|(j, _)| *j == k) && !own.contains(&k);
                if other.kind == RoofLineKind::Ridge && other.touches(far) && !other.touches(node) && new {
                    out.push((k, far));
                }
            }
        }
        out
    }

    /// Cuts a hip's or valley's top (`CutEnd::Top`) or foot (`CutEnd::Bottom`)
    /// of `spec` to the face of each ridge of `ridges_at` (by line, with the
    /// node where it is met) that its body would otherwise run into, bearing
    /// on it there. `away` is the member's plan direction from the node,
    /// `toward` a point of it.
    fn clear_ridges_at(
        &self,
        ridges_at: &[(usize, DVec2)],
        spec: &mut PieceSpec,
        bearings: &mut Vec<(Bearing, HalfSpace)>,
        away: DVec2,
        toward: DVec2,
        end: CutEnd,
    ) {
        for &(k, node) in ridges_at {
            let Some(other) = self.lines.get(k) else { continue };
            let solid = spec.solid();
            let ridges: Vec<_> = self.ridge_specs(k, other).iter().map(PieceSpec::solid).collect();
            let met: Vec<&Solid> = ridges.iter().filter(|r| solid.runs_into(r, OVERLAP_TOL_IN)).collect();
            if met.is_empty() {
                continue;
            }
            if let Some(mut h) = self.ridge_face_at(k, node, away, toward, end) {
                h.tag = cut_tag(&h, &spec.frame);
                let mut cut = spec.clone();
                if end == CutEnd::Bottom {
                    cut.lower_cuts.push(h);
                } else {
                    cut.upper_cuts.push(h);
                }
                // A top reaching the ridge only at a corner of its end, the
                // end cut back across further short lines (seed 3072 of the
                // long run: a hip in line with one ridge's end, another
                // ridge's end cut back to that ridge's side 0.12 in past the
                // node), is not cut to a face that is not there where the
                // cheek would be: its bearing would read the gap.
                let cut_solid = cut.solid();
                let fits = met.iter().all(|r| {
                    let fit = check_fit(&cut_solid, &h, r, &part_bounds(r), None);
                    fit.max_gap < JOINT_FIT_IN && fit.max_overlap < JOINT_FIT_IN
                });
                if end == CutEnd::Top && !fits {
                    continue;
                }
                *spec = cut;
                bearings.push((Bearing::Line(k), h));
            }
        }
    }

    /// A valley: its centre line in both planes, seated over the inside
    /// corner, its top against the ridge boards it meets.
    pub fn valley_spec(&self, line: &PlanLine, rafter_piece: &[Option<usize>]) -> Option<Built> {
        let (left, right) = self.sides(line)?;
        let (pl, pr) = (self.planes.get(left)?, self.planes.get(right)?);
        let size = self.settings.valley;
        let run = line.from.distance(line.to);
        let slope = (line.to_z - line.from_z) / run;
        let frame = BoardFrame::new(line.from.extend(self.heel), line.to - line.from, slope)?;
        let mid = (line.from + line.to) / 2.0;
        // The top bears on the side of each ridge board at the node.
        let mut upper_cuts = Vec::new();
        let mut ridges = Vec::new();
        for ri in self.ridges_at(line.to) {
            let down = (line.from - line.to).normalize_or_zero();
            let Some(mut h) = self.ridge_face_at(ri, line.to, down, mid, CutEnd::Top) else { continue };
            h.tag = cut_tag(&h, &frame);
            upper_cuts.push(h);
            ridges.push((ri, h));
        }
        // Nothing to butt into: cut plumb and square at the node (`reach`
        // 0), or on past it as far as the hips starting there need to bear
        // on its sides their feet's full width.
        let dir = (line.to - line.from).normalize_or_zero();
        let plumb_top = |reach: f64| {
            HalfSpace::through(
                (line.to + dir * reach).extend(line.to_z),
                dir.extend(0.0),
                FaceTag::Plumb,
                Some(CutEnd::Top),
            )
        };
        let plumb_only = upper_cuts.is_empty();
        if plumb_only {
            upper_cuts.extend(plumb_top(0.0));
        }
        // A valley that starts up on the roof (where a ridge ends beside
        // another valley's top) has no seat: its foot is cut to what is
        // framed there, as a hip's is, or plumb at the node.
        let seated = line.from_z.abs() < 1e-6;
        let mut foot_bearings = Vec::new();
        let (lower_cuts, seat, has_tail) = if seated {
            let has_tail = pl.overhang_in > 0.0 && pr.overhang_in > 0.0;
            // Over an inside corner each half ends at its own side's fascia.
            let half = |p: &PlaneFrame| -> Option<SeatWall> {
                let mut half_cuts = Vec::new();
                if has_tail {
                    half_cuts.extend(self.fascia_side_tail(p));
                    if let TailCut::PlumbAndLevel { plumb_height_in } = self.settings.tail {
                        let z = self.heel - p.slope * p.overhang_in - plumb_height_in;
                        half_cuts.extend(HalfSpace::through(
                            DVec3::new(0.0, 0.0, z),
                            -DVec3::Z,
                            FaceTag::Soffit,
                            Some(CutEnd::Tail),
                        ));
                    }
                }
                Some(SeatWall {
                    inside: p.wall_side(0.0, true, FaceTag::Interior, None)?,
                    half_cuts,
                    plate_inner: self.plate_inner(p),
                })
            };
            (Vec::new(), vec![half(pl)?, half(pr)?], has_tail)
        } else {
            let up_dir = (line.to - line.from).normalize_or_zero();
            let mut lower_cuts = self.foot_on_roof(line, up_dir, mid, &frame, &mut foot_bearings, false);
            if lower_cuts.is_empty() {
                lower_cuts.extend(HalfSpace::through(
                    line.from.extend(line.from_z),
                    (line.from - line.to).extend(0.0),
                    FaceTag::Plumb,
                    Some(CutEnd::Bottom),
                ));
            }
            (lower_cuts, Vec::new(), false)
        };
        let mut spec = PieceSpec {
            kind: MemberKind::Valley,
            size,
            frame,
            plan_line: [line.from, line.to],
            slope,
            top_planes: Vec::new(),
            upper_cuts,
            upper_step: None,
            lower_cuts,
            seat,
            has_tail,
            drop_in: 0.0,
            plumb_square: hip_square(slope, pl, pr),
        };
        // A top against a ridge at one end of a hip or valley too short to
        // cut is also cut to the ridges at the short line's other end, as
        // if they all met at one node. (A top meeting no ridge at its node
        // is left: what starts there, a hip's foot, bears on it.)
        let across = if ridges.is_empty() { Vec::new() } else { self.ridges_across_short_lines(line.to) };
        let own: Vec<HalfSpace> = ridges.iter().map(|&(_, h)| h).collect();
        let own_ridges: Vec<usize> = ridges.iter().map(|&(ri, _)| ri).collect();
        // Ridge bearings are resolved to pieces by the caller; a foot up on
        // the roof bears on what it was cut to there.
        let mut bearings: Vec<(Bearing, HalfSpace)> =
            ridges.into_iter().map(|(ri, h)| (Bearing::Line(ri), h)).chain(foot_bearings).collect();
        let down = (line.from - line.to).normalize_or_zero();
        self.clear_lines_cutting_ridge_ends(line.to, &own_ridges, &mut spec, &mut bearings, mid);
        if !across.is_empty() {
            self.clear_ridges_across_valley_top(&across, &own, &mut spec, &mut bearings, down, mid);
        }
        let passing = self.ridges_passing(line.to, size);
        if !passing.is_empty() {
            self.clear_ridges_at(&passing, &mut spec, &mut bearings, down, mid, CutEnd::Top);
        }
        self.clear_kings_at(line.to, &mut spec, &mut bearings, mid, CutEnd::Top, rafter_piece);
        let reach = if plumb_only && spec.upper_cuts.len() == 1 { self.hip_feet_reach(line) } else { 0.0 };
        if let Some(longer) = plumb_top(reach).filter(|_| reach > 0.0) {
            // Run on only where the longer top meets nothing the top at the
            // node kept clear of: a ridge passing by or a king beside it.
            let mut trial = spec.clone();
            trial.upper_cuts = vec![longer];
            let mut trial_bearings = Vec::new();
            if !passing.is_empty() {
                self.clear_ridges_at(&passing, &mut trial, &mut trial_bearings, down, mid, CutEnd::Top);
            }
            self.clear_kings_at(line.to, &mut trial, &mut trial_bearings, mid, CutEnd::Top, rafter_piece);
            if trial.upper_cuts.len() == 1 {
                spec = trial;
            }
        }
        Some((spec, bearings, false))
    }

    /// How far past its top node, in plan along its line, valley `line`
    /// must run for every hip starting at the node with its foot cut to
    /// the valley's side ([`Ctx::foot_on_roof`]) to bear on that side its
    /// foot's full width: 0 where none reaches past the node, or where a
    /// hip carries the valley's line on and butts against its top there.
    ///
    /// A hip leaving the node at plan angle `a` from the valley's line
    /// has its foot cut to the valley's side, half the valley's
    /// thickness `tv` off the line; the hip's sides, half its thickness
    /// `th` off its own line, cross that side `(±th/2 + (tv/2) cos a) /
    /// sin a` on from the node (derived in plan: the side line is
    /// `node + s u + (tv/2) v`, with `u` along the valley and `v` square to
    /// it toward the hip). At a right angle the foot reaches `th/2` past
    /// the node; a hip turned back beside the valley, less (seed 25797 of
    /// the long run: 0.27 in at 140.7 degrees, which a top cut plumb at
    /// the node left hanging in the air).
    fn hip_feet_reach(&self, line: &PlanLine) -> f64 {
        let Some(u) = (line.to - line.from).try_normalize() else { return 0.0 };
        let near = |p: DVec2| p.distance(line.to) < PLAN_TOL_IN * 1e3;
        let tv = self.settings.valley.thickness_in;
        let th = self.settings.hip.thickness_in;
        let mut reach: f64 = 0.0;
        for (k, l) in self.lines.iter().enumerate() {
            let left_out = self.left_out.get(k).copied().unwrap_or(false);
            if l.kind != RoofLineKind::Hip || !near(l.from) || near(l.to) || l.from_z.abs() < 1e-6 || left_out
            {
                continue;
            }
            let Some(d) = (l.to - l.from).try_normalize() else { continue };
            let (cos_a, sin_a) = (u.dot(d), u.perp_dot(d).abs());
            if cos_a > IN_LINE_COS {
                return 0.0;
            }
            if sin_a < 1e-9 {
                continue;
            }
            reach = reach.max((th / 2.0 + (tv / 2.0) * cos_a) / sin_a);
        }
        reach
    }

    /// Cuts a valley's top (`spec`, seated on the ridges `own` at its top
    /// node `node`) back to the side of each hip or valley passing by that
    /// the end of one of those ridges at the node is cut back to
    /// ([`Ctx::ridge_end_clearances`]), where the top runs on past that
    /// side, bearing on that member there. Past the side the ridge's end
    /// is cut away: the top's cheek would face the ridge's cut end across a
    /// gap, and its corner run into the member (seed 38662: a hip passing
    /// 0.11 in from the node where two valleys meet a ridge's end left a
    /// 0.22 in gap). `toward` is a point of the valley; only a face
    /// keeping it, as it keeps the ridge, and one leaving the top a seat on
    /// every ridge it is seated on, is cut to; nothing where a hip starts
    /// at the node, its foot cut to the top's sides.
    fn clear_lines_cutting_ridge_ends(
        &self,
        node: DVec2,
        own: &[usize],
        spec: &mut PieceSpec,
        bearings: &mut Vec<(Bearing, HalfSpace)>,
        toward: DVec2,
    ) {
        let near = |p: DVec2| p.distance(node) < PLAN_TOL_IN * 1e3;
        // A hip starting at the node has its foot cut to the top's sides:
        // the top keeps its length for it to bear on.
        let feet_here =
            self.lines.iter().zip(self.left_out).any(|(l, &left_out)| {
                l.kind == RoofLineKind::Hip && !left_out && near(l.from) && !near(l.to)
            });
        if feet_here {
            return;
        }
        let seats: Vec<HalfSpace> = spec.upper_cuts.clone();
        for &ri in own {
            let Some(ridge) = self.lines.get(ri) else { continue };
            for (k, h, at_start) in self.ridge_end_clearances(ri, ridge) {
                let end_node = if at_start { ridge.from } else { ridge.to };
                let passing = self.lines.get(k).is_some_and(|l| l.kind != RoofLineKind::Ridge);
                if !near(end_node) || !passing || h.distance(toward.extend(0.0)) > 0.0 {
                    continue;
                }
                if !spec.solid().vertices().any(|v| h.distance(v) > OVERLAP_TOL_IN) {
                    continue;
                }
                let cut = HalfSpace { tag: cut_tag(&h, &spec.frame), end: Some(CutEnd::Top), ..h };
                let mut trial = spec.clone();
                trial.upper_cuts.push(cut);
                let trial_solid = trial.solid();
                if !seats.iter().all(|o| face_area_on(&trial_solid, o) > SEAT_AREA_MIN_SQ_IN) {
                    continue;
                }
                spec.upper_cuts.push(cut);
                bearings.push((Bearing::Line(k), cut));
            }
        }
    }

    /// Cuts a valley's top (`spec`) to the ridges across a hip or valley
    /// too short to cut at its node (`across`, each with the node where it
    /// is met) that its body would otherwise run into, as
    /// [`Ctx::clear_ridges_at`] does, bearing on each there.
    ///
    /// The top is seated first on the ridges at its own node (`own`, the
    /// cuts against them). The ridge across the short line stands a
    /// fraction of an inch off that node, so the face its own node would
    /// give (its side, or its end run half a rafter past that node) can lie
    /// wholly beyond the own ridge's face and take the seat off it: the
    /// top then stops short of the ridge it was seated on (seed 5340: 1.0
    /// in short, cut to the side of a ridge whose end is north of the
    /// top). Where it would, the top is cut to the other face of that
    /// ridge instead (its end for its side, its side for its end), which
    /// clears the ridge all the same, as any face of its board does, and
    /// leaves the seat: a framer seats the valley on its own ridge and
    /// trims the corner of the other one's end out of the way.
    fn clear_ridges_across_valley_top(
        &self,
        across: &[(usize, DVec2)],
        own: &[HalfSpace],
        spec: &mut PieceSpec,
        bearings: &mut Vec<(Bearing, HalfSpace)>,
        down: DVec2,
        toward: DVec2,
    ) {
        for &(k, node) in across {
            let Some(other) = self.lines.get(k) else { continue };
            let solid = spec.solid();
            // The top can cross the other ridge's end with no corner of
            // either inside the other (a valley's corner on that end's
            // plane, the end cut back to its own ridge's side): read the
            // wood the two share.
            let runs_in = self.ridge_specs(k, other).iter().any(|r| {
                let ridge = r.solid();
                runs_into(&solid, &ridge) || share_wood(&solid, &ridge)
            });
            if !runs_in {
                continue;
            }
            let Some(first) = self.ridge_face_at(k, node, down, toward, CutEnd::Top) else { continue };
            let seated = |h: HalfSpace| {
                let mut trial = spec.clone();
                trial.upper_cuts.push(h);
                let cut = trial.solid();
                own.iter().all(|o| face_area_on(&cut, o) > SEAT_AREA_MIN_SQ_IN)
            };
            let chosen = if seated(first) {
                first
            } else {
                self.ridge_other_face(k, node, &first, toward, CutEnd::Top)
                    .filter(|&h| seated(h))
                    .unwrap_or(first)
            };
            let h = HalfSpace { tag: cut_tag(&chosen, &spec.frame), ..chosen };
            spec.upper_cuts.push(h);
            bearings.push((Bearing::Line(k), h));
        }
    }

    /// Of ridge `li`'s end at `node` and its side toward `toward`, the one
    /// that is not `face`; `None` where the ridge does not end at `node`.
    fn ridge_other_face(
        &self,
        li: usize,
        node: DVec2,
        face: &HalfSpace,
        toward: DVec2,
        end: CutEnd,
    ) -> Option<HalfSpace> {
        let ridge = self.lines.get(li)?;
        let dir = (ridge.to - ridge.from).try_normalize()?;
        let near = |p: DVec2| p.distance(node) < PLAN_TOL_IN * 1e3;
        let into = if near(ridge.from) {
            dir
        } else if near(ridge.to) {
            -dir
        } else {
            return None;
        };
        let e = self.ridge_end_offset(li, dir, node);
        let end_face =
            HalfSpace::through((node - into * e).extend(0.0), into.extend(0.0), FaceTag::Cheek, Some(end))?;
        let side =
            side_face(ridge.from, ridge.to, self.settings.ridge.thickness_in, toward, FaceTag::Cheek, end)?;
        let same = |a: &HalfSpace, b: &HalfSpace| {
            a.normal.dot(b.normal) > 1.0 - 1e-12 && (a.offset - b.offset).abs() < 1e-9
        };
        if same(face, &side) {
            Some(end_face)
        } else if same(face, &end_face) {
            Some(side)
        } else {
            None
        }
    }

    /// The ridges that pass beside `node` without meeting it, near enough
    /// that a `size` member ending there could run into their side (wing
    /// valleys meeting a fraction of an inch short of the main ridge),
    /// each with `node`: only where the node is beside the ridge's length,
    /// whose side face is then the one met.
    fn ridges_passing(&self, node: DVec2, size: BoardSize) -> Vec<(usize, DVec2)> {
        let reach = self.settings.ridge.thickness_in / 2.0 + size.thickness_in + size.depth_in;
        // Ridges framed at the node (a kept one in a left-out one's place)
        // are met there already; a left-out one is not there.
        let own = self.ridges_at(node);
        self.lines
            .iter()
            .enumerate()
            .filter(|(k, l)| {
                let Some(dir) = (l.to - l.from).try_normalize() else { return false };
                let along = (node - l.from).dot(dir);
                l.kind == RoofLineKind::Ridge
                    && !l.touches(node)
                    && !own.contains(k)
                    && !self.ridge_left_out(*k)
                    && along > 0.0
                    && along < l.from.distance(l.to)
                    && distance_to_segment(node, l.from, l.to) < reach
            })
            .map(|(k, _)| (k, node))
            .collect()
    }

    /// A hip starting up on the roof at the top of a valley, its foot cut
    /// to the valley's side: where the valley's top is cut back to the side
    /// of a ridge passing the node, the foot is cut back to it too (past
    /// it there is no valley to bear on), and bears on the ridge where it
    /// runs into it.
    fn cut_foot_with_valley_tops(
        &self,
        line: &PlanLine,
        spec: &mut PieceSpec,
        bearings: &mut Vec<(Bearing, HalfSpace)>,
        rafter_piece: &[Option<usize>],
    ) {
        let near = |p: DVec2| p.distance(line.from) < PLAN_TOL_IN * 1e3;
        for (vi, valley) in self.lines.iter().enumerate() {
            if valley.kind != RoofLineKind::Valley
                || !near(valley.to)
                || near(valley.from)
                || self.left_out.get(vi).copied().unwrap_or(false)
            {
                continue;
            }
            let passing = self.ridges_passing(valley.to, self.settings.valley);
            if passing.is_empty() {
                continue;
            }
            let Some((valley_spec, ..)) = self.valley_spec(valley, rafter_piece) else { continue };
            let down = (valley.from - valley.to).normalize_or_zero();
            let valley_mid = (valley.from + valley.to) / 2.0;
            for &(k, node) in &passing {
                let Some(face) = self.ridge_face_at(k, node, down, valley_mid, CutEnd::Bottom) else {
                    continue;
                };
                let valley_cut = valley_spec.upper_cuts.iter().any(|h| {
                    h.normal.dot(face.normal) > 1.0 - 1e-12 && (h.offset - face.offset).abs() < 1e-9
                });
                let solid = spec.solid();
                if !valley_cut || !solid.vertices().any(|v| face.distance(v) > OVERLAP_TOL_IN) {
                    continue;
                }
                let Some(ridge) = self.lines.get(k) else { continue };
                let runs_in = self.ridge_specs(k, ridge).iter().any(|r| runs_into(&solid, &r.solid()));
                let h = HalfSpace { tag: cut_tag(&face, &spec.frame), ..face };
                spec.lower_cuts.push(h);
                if runs_in {
                    bearings.push((Bearing::Line(k), h));
                }
            }
        }
    }
}

/// The least area, square inches, of a valley top's face on the ridge at
/// its own node for the top to count as seated there: a face smaller than
/// a tenth of an inch square is a sliver, not a seat (common practice, no
/// source).
const SEAT_AREA_MIN_SQ_IN: f64 = 0.01;

/// The area of `solid`'s faces lying on the plane of cut `h`, facing as it
/// does, square inches.
fn face_area_on(solid: &Solid, h: &HalfSpace) -> f64 {
    solid
        .faces()
        .filter(|f| {
            f.normal.dot(h.normal) > 1.0 - 1e-9
                && f.vertices.first().is_some_and(|&v| h.distance(v).abs() < 1e-5)
        })
        .map(|f| f.area())
        .sum()
}

/// Two solids share wood (for [`share_wood`]) where their common part
/// holds more than this, cubic inches: a tenth of an inch each way, far
/// more than two boards flush against each other leave in round-off
/// (common practice, no source).
const SHARED_VOLUME_MIN_CU_IN: f64 = 1e-3;

/// Whether two solids share wood, read from the volume common to any part
/// of each: unlike [`runs_into`], this finds two boards crossing each
/// other with no corner of either inside the other.
fn share_wood(a: &Solid, b: &Solid) -> bool {
    a.parts.iter().any(|pa| {
        b.parts.iter().any(|pb| {
            let planes: Vec<HalfSpace> = pa.planes.iter().chain(&pb.planes).copied().collect();
            ConvexPart::from_half_spaces(&planes)
                .is_some_and(|common| common.volume() > SHARED_VOLUME_MIN_CU_IN)
        })
    })
}

/// Whether two solids run into each other: a corner of either deeper than
/// [`OVERLAP_TOL_IN`] inside the other.
fn runs_into(a: &Solid, b: &Solid) -> bool {
    a.vertices().any(|v| b.depth_of(v) > OVERLAP_TOL_IN)
        || b.vertices().any(|v| a.depth_of(v) > OVERLAP_TOL_IN)
}
