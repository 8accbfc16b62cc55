//! Frames a solved roof: lays out, cuts and checks every piece.

use glam::{DVec2, DVec3};
use serde::Serialize;

use super::board::{BoardFrame, PieceSpec, SeatWall};
use super::joints::{Joint, check_fit};
use super::layout::{EdgeKind, King, PlanLine, RafterLine, rafter_lines};
use super::measure::{Measured, measure};
use super::plane_frame::{PLAN_TOL_IN, PlaneFrame};
use super::{
    CutEnd, FaceTag, FramingError, FramingSettings, FramingWarning, HalfSpace, Heel, HipTop, Member,
    MemberKind, PlacedPiece, SawKind, Solid, TailCut,
};
use crate::{Outline, Roof, RoofLineKind};

/// Lengths within this of a stock length fit it: layouts in whole spaces
/// land splices exactly on stock lengths, and round-off must not tip them.
const STOCK_TOL_IN: f64 = 1e-6;

/// A framed roof.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Frame {
    /// One entry per distinct member, with its count.
    pub members: Vec<Member>,
    /// Every piece where it sits.
    pub pieces: Vec<PlacedPiece>,
    /// Every joint, checked on the solids.
    pub joints: Vec<Joint>,
    /// Everything to look out for, over all members.
    pub warnings: Vec<FramingWarning>,
}

/// What a piece bears on, as known while pieces are still being built.
#[derive(Debug, Clone, Copy, PartialEq)]
enum Bearing {
    /// A piece already built, by index.
    Piece(usize),
    /// The member built on a roof line, by line index (a ridge line may
    /// have several pieces; the nearest is taken).
    Line(usize),
}

/// A joint recorded while pieces are built: `cut` was cut by `mating` to
/// bear on `bearing`.
struct JointSpec {
    cut: usize,
    bearing: Bearing,
    mating: HalfSpace,
}

/// A joint with both pieces known.
struct ResolvedJoint {
    cut: usize,
    bearing: usize,
    mating: HalfSpace,
}

/// Frames a solved roof over its outline.
///
/// Lays rafter lines square to each wall at the spacing, builds every piece
/// as a solid and reads its lengths and cuts off it, groups identical
/// pieces under one label, and checks the fit of every joint.
///
/// ```
/// use glam::dvec2;
/// use pitchframe_geometry::framing::{FramingSettings, MemberKind, frame_roof};
/// use pitchframe_geometry::{Outline, Roof, Wall, WallRoof};
///
/// // A 40 ft x 24 ft house hipped all round at 6 in 12, 16 in overhangs.
/// let corners = [dvec2(0.0, 0.0), dvec2(480.0, 0.0), dvec2(480.0, 288.0), dvec2(0.0, 288.0)];
/// let walls = corners
///     .iter()
///     .map(|&corner| Wall { corner, roof: WallRoof::Pitched { rise_per_run: 0.5 }, overhang_in: 16.0 })
///     .collect();
/// let outline = Outline::new(walls, Vec::new()).unwrap();
/// let roof = Roof::solve(&outline).unwrap();
/// let frame = frame_roof(&outline, &roof, &FramingSettings::default()).unwrap();
/// let common = frame.members.iter().find(|m| m.kind == MemberKind::Common).unwrap();
/// // 12 ft of run at 13.42 in per foot: 161.0 in.
/// assert!((common.theoretical_length - 144.0 * 1.25f64.sqrt()).abs() < 1e-6);
/// assert!(frame.joints.iter().all(|j| j.max_gap < 1.0 / 64.0 && j.max_overlap < 1.0 / 64.0));
/// ```
pub fn frame_roof(outline: &Outline, roof: &Roof, settings: &FramingSettings) -> Result<Frame, FramingError> {
    validate(outline, settings)?;
    let planes: Vec<PlaneFrame> =
        roof.planes.iter().map(|p| PlaneFrame::new(p, outline)).collect::<Result<_, _>>()?;
    let heel = heel_height(&planes, settings)?;
    let plane_of_wall = |w: usize| planes.iter().position(|p| p.wall == w);
    let mut lines = Vec::with_capacity(roof.lines.len());
    for l in &roof.lines {
        let kind_name = match l.kind {
            RoofLineKind::Ridge => "ridge",
            RoofLineKind::Hip => "hip",
            RoofLineKind::Valley => "valley",
        };
        let (Some(a), Some(b)) = (plane_of_wall(l.walls[0]), plane_of_wall(l.walls[1])) else {
            return Err(FramingError::LineWithoutPlanes { kind: kind_name, walls: l.walls });
        };
        let (from, to) =
            if l.kind != RoofLineKind::Ridge && l.from.z > l.to.z { (l.to, l.from) } else { (l.from, l.to) };
        lines.push(PlanLine {
            kind: l.kind,
            from: from.truncate(),
            to: to.truncate(),
            from_z: from.z,
            to_z: to.z,
            planes: [a, b],
        });
    }

    // Hip ends of ridges: where a hip's top meets a ridge's end.
    let mut kings: Vec<(DVec2, usize)> = Vec::new();
    for (ri, ridge) in lines.iter().enumerate().filter(|(_, l)| l.kind == RoofLineKind::Ridge) {
        for node in [ridge.from, ridge.to] {
            let hip_here =
                lines.iter().any(|l| l.kind == RoofLineKind::Hip && l.to.distance(node) < PLAN_TOL_IN * 1e3);
            if hip_here {
                kings.push((node, ri));
            }
        }
    }

    let origin = outline.outer().get(settings.layout_start.corner).map_or(DVec2::ZERO, |w| w.corner);
    let mut rafters: Vec<RafterLine> = Vec::new();
    for (i, p) in planes.iter().enumerate() {
        rafters.extend(rafter_lines(i, p, &planes, &lines, &kings, origin, settings));
    }

    let ctx = Ctx { planes: &planes, lines: &lines, rafters: &rafters, heel, settings };
    let mut specs: Vec<PieceSpec> = Vec::new();
    let mut joint_specs: Vec<JointSpec> = Vec::new();
    let mut warnings_extra: Vec<(usize, FramingWarning)> = Vec::new();

    // Ridges, split at stock lengths.
    let mut ridge_pieces: Vec<Vec<usize>> = vec![Vec::new(); lines.len()];
    for (li, line) in lines.iter().enumerate().filter(|(_, l)| l.kind == RoofLineKind::Ridge) {
        let pieces = ctx.ridge_specs(li, line);
        let first = specs.len();
        for (k, spec) in pieces.into_iter().enumerate() {
            if k > 0
                && let Some(mating) = spec.upper_cuts.first().copied()
            {
                // The splice: the earlier piece's end face against this one.
                let flipped = HalfSpace { normal: -mating.normal, offset: -mating.offset, ..mating };
                joint_specs.push(JointSpec {
                    cut: first + k - 1,
                    bearing: Bearing::Piece(first + k),
                    mating: flipped,
                });
            }
            ridge_pieces[li].push(specs.len());
            specs.push(spec);
        }
    }
    let ridge_piece_at = |li: usize, p: DVec2, specs: &[PieceSpec]| -> Option<usize> {
        let line = lines.get(li)?;
        let dir = (line.to - line.from).try_normalize()?;
        // The piece whose stretch of the ridge is nearest the point (a
        // butted ridge stops short of the node it is framed to).
        let t = (p - line.from).dot(dir);
        let off = |i: usize| {
            let s = &specs[i];
            let a = (s.plan_line[0] - line.from).dot(dir);
            let b = (s.plan_line[1] - line.from).dot(dir);
            (a.min(b) - t).max(t - a.max(b)).max(0.0)
        };
        ridge_pieces.get(li)?.iter().copied().min_by(|&x, &y| off(x).total_cmp(&off(y)))
    };

    // Rafters, and the side faces they bear on.
    let mut rafter_piece: Vec<Option<usize>> = vec![None; rafters.len()];
    for (ri, r) in rafters.iter().enumerate() {
        let Some(kind) = r.kind(&lines) else { continue };
        let Some((spec, upper_bearing, lower_bearing, also_bearing)) = ctx.rafter_spec(r, kind) else {
            continue;
        };
        let index = specs.len();
        rafter_piece[ri] = Some(index);
        if let Some((li, mating)) = upper_bearing {
            joint_specs.push(JointSpec { cut: index, bearing: Bearing::Line(li), mating });
        }
        if let Some((li, mating)) = also_bearing {
            joint_specs.push(JointSpec { cut: index, bearing: Bearing::Line(li), mating });
        }
        if let Some((li, mating)) = lower_bearing {
            joint_specs.push(JointSpec { cut: index, bearing: Bearing::Line(li), mating });
        }
        specs.push(spec);
    }

    // Hips and valleys.
    let mut line_piece: Vec<Option<usize>> = vec![None; lines.len()];
    for (li, line) in lines.iter().enumerate() {
        let built = match line.kind {
            RoofLineKind::Hip => ctx.hip_spec(line, &rafter_piece),
            RoofLineKind::Valley => ctx.valley_spec(line),
            RoofLineKind::Ridge => None,
        };
        let Some((spec, bearings, peak_without_ridge)) = built else {
            continue;
        };
        let index = specs.len();
        line_piece[li] = Some(index);
        for (bearing, mating) in bearings {
            joint_specs.push(JointSpec { cut: index, bearing, mating });
        }
        if peak_without_ridge {
            warnings_extra.push((index, FramingWarning::HipsMeetWithoutRidge { label: String::new() }));
        }
        specs.push(spec);
    }

    // Bearings named by roof line become pieces now that all are built.
    let joint_specs: Vec<ResolvedJoint> = joint_specs
        .into_iter()
        .filter_map(|j| {
            let bearing = match j.bearing {
                Bearing::Piece(i) => Some(i),
                Bearing::Line(li) => match lines.get(li).map(|l| l.kind) {
                    Some(RoofLineKind::Ridge) => {
                        let end = if j.mating.end == Some(CutEnd::Bottom) { 0 } else { 1 };
                        let cut_point = specs.get(j.cut)?.plan_line[end];
                        ridge_piece_at(li, cut_point, &specs)
                    }
                    Some(_) => line_piece.get(li).copied().flatten(),
                    None => None,
                },
            }?;
            (bearing < specs.len() && j.cut < specs.len()).then_some(ResolvedJoint {
                cut: j.cut,
                bearing,
                mating: j.mating,
            })
        })
        .collect();

    let solids: Vec<_> = specs.iter().map(PieceSpec::solid).collect();
    let measured: Vec<Measured> =
        specs.iter().zip(&solids).map(|(s, solid)| measure(s, solid, settings)).collect();
    // A piece its cuts leave nothing of (a layout line squeezed out at a
    // crowded node) is not cut at all: drop it and the joints naming it.
    let usable = |i: usize| {
        solids[i].volume() > 1e-6
            && [measured[i].overall_length, measured[i].long_point_length, measured[i].short_point_length]
                .iter()
                .all(|x| x.is_finite())
    };
    let kept: Vec<usize> = (0..specs.len()).filter(|&i| usable(i)).collect();
    let (specs, solids, measured, joint_specs, warnings_extra) = if kept.len() == specs.len() {
        (specs, solids, measured, joint_specs, warnings_extra)
    } else {
        let mut new_index = vec![None; specs.len()];
        for (n, &i) in kept.iter().enumerate() {
            new_index[i] = Some(n);
        }
        let joints = joint_specs
            .into_iter()
            .filter_map(|j| {
                Some(ResolvedJoint {
                    cut: new_index[j.cut]?,
                    bearing: new_index[j.bearing]?,
                    mating: j.mating,
                })
            })
            .collect();
        let extra = warnings_extra.into_iter().filter_map(|(i, w)| Some((new_index[i]?, w))).collect();
        (
            kept_only(specs, &new_index),
            kept_only(solids, &new_index),
            kept_only(measured, &new_index),
            joints,
            extra,
        )
    };
    let labels = label_pieces(&specs, &measured);

    // A rafter on a ridge splice bears on both pieces: check ridges whole.
    // Ridges meeting at a node bear on each other's ends and sides: check
    // against every ridge board together.
    let all_ridges = Solid {
        parts: specs
            .iter()
            .zip(&solids)
            .filter(|(s, _)| s.kind == MemberKind::Ridge)
            .flat_map(|(_, solid)| solid.parts.iter().cloned())
            .collect(),
    };
    let joints: Vec<(Joint, f64)> = joint_specs
        .iter()
        .map(|j| {
            let splice = specs[j.cut].kind == MemberKind::Ridge;
            let bearing = if specs[j.bearing].kind == MemberKind::Ridge && !splice {
                &all_ridges
            } else {
                &solids[j.bearing]
            };
            let b = &specs[j.bearing].frame;
            let top = HalfSpace::through(b.origin, b.up, FaceTag::Top, None);
            let fit = check_fit(&solids[j.cut], &j.mating, bearing, top.as_ref());
            let joint = Joint {
                members: [labels.labels[j.cut].clone(), labels.labels[j.bearing].clone()],
                pieces: [j.cut, j.bearing],
                max_gap: fit.max_gap,
                max_overlap: fit.max_overlap,
            };
            (joint, fit.max_hang)
        })
        .collect();

    // Warnings, per piece, then gathered per member.
    let mut piece_warnings: Vec<Vec<FramingWarning>> = vec![Vec::new(); specs.len()];
    for (i, m) in measured.iter().enumerate() {
        piece_warnings[i].extend(piece_checks(&labels.labels[i], &specs[i], m, settings));
    }
    for (i, w) in warnings_extra {
        let w = match w {
            FramingWarning::HipsMeetWithoutRidge { .. } => {
                FramingWarning::HipsMeetWithoutRidge { label: labels.labels[i].clone() }
            }
            other => other,
        };
        piece_warnings[i].push(w);
    }
    for (joint, hang) in &joints {
        if *hang <= 1.0 / 64.0 {
            continue;
        }
        let [a, b] = joint.pieces;
        let jack =
            matches!(specs[a].kind, MemberKind::HipJack | MemberKind::ValleyJack | MemberKind::CrippleJack);
        let rafter = jack || matches!(specs[a].kind, MemberKind::Common | MemberKind::KingCommon);
        let w = if specs[b].kind == MemberKind::Ridge && rafter {
            FramingWarning::RidgeTooShallow {
                ridge: joint.members[1].clone(),
                rafter: joint.members[0].clone(),
                short_by_in: *hang,
            }
        } else if jack && matches!(specs[b].kind, MemberKind::Hip | MemberKind::Valley) {
            FramingWarning::HipTooShallow {
                hip: joint.members[1].clone(),
                jack: joint.members[0].clone(),
                short_by_in: *hang,
            }
        } else {
            continue;
        };
        piece_warnings[a].push(w);
    }

    let mut members: Vec<Member> = Vec::new();
    for group in &labels.groups {
        let Some(&rep) = group.first() else { continue };
        let m = &measured[rep];
        let mut hands = super::Hands::default();
        let mut handed = false;
        for &i in group {
            match measured[i].hand {
                Some(super::Hand::Left) => {
                    hands.left += 1;
                    handed = true;
                }
                Some(super::Hand::Right) => {
                    hands.right += 1;
                    handed = true;
                }
                None => {}
            }
        }
        let mut warnings: Vec<FramingWarning> = Vec::new();
        for &i in group {
            for w in &piece_warnings[i] {
                if !warnings.contains(w) {
                    warnings.push(w.clone());
                }
            }
        }
        members.push(Member {
            label: labels.labels[rep].clone(),
            kind: specs[rep].kind,
            count: group.len(),
            hands: handed.then_some(hands),
            size: specs[rep].size,
            rise_per_run: specs[rep].slope,
            run: m.run,
            theoretical_length: m.theoretical_length,
            long_point_length: m.long_point_length,
            short_point_length: m.short_point_length,
            seat_to_top_cut: m.seat_to_top_cut,
            tail_length: m.tail_length,
            overall_length: m.overall_length,
            cuts: m.cuts.clone(),
            warnings,
        });
    }
    let mut warnings: Vec<FramingWarning> = Vec::new();
    for m in &members {
        for w in &m.warnings {
            if !warnings.contains(w) {
                warnings.push(w.clone());
            }
        }
    }
    let pieces = specs
        .iter()
        .zip(solids)
        .zip(&measured)
        .enumerate()
        .map(|(i, ((s, solid), m))| PlacedPiece {
            label: labels.labels[i].clone(),
            kind: s.kind,
            hand: m.hand,
            plan_line: s.plan_line,
            axis: m.axis,
            solid,
        })
        .collect();
    Ok(Frame { members, pieces, joints: joints.into_iter().map(|(j, _)| j).collect(), warnings })
}

/// The items whose index maps to a new one.
fn kept_only<T>(items: Vec<T>, new_index: &[Option<usize>]) -> Vec<T> {
    items.into_iter().zip(new_index).filter(|(_, n)| n.is_some()).map(|(x, _)| x).collect()
}

/// Checks the settings once, at the boundary.
fn validate(outline: &Outline, s: &FramingSettings) -> Result<(), FramingError> {
    if !(s.spacing_in > 0.0 && s.spacing_in.is_finite()) {
        return Err(FramingError::SpacingNotPositive { spacing_in: s.spacing_in });
    }
    let corners = outline.outer().len();
    if s.layout_start.corner >= corners {
        return Err(FramingError::LayoutCornerMissing { corner: s.layout_start.corner, corners });
    }
    for (member, size) in [("rafter", s.rafter), ("hip", s.hip), ("valley", s.valley), ("ridge", s.ridge)] {
        if !(size.thickness_in > 0.0
            && size.depth_in > 0.0
            && size.thickness_in.is_finite()
            && size.depth_in.is_finite())
        {
            return Err(FramingError::BoardSizeNotPositive { member });
        }
    }
    if !(s.seat_width_in > 0.0 && s.seat_width_in.is_finite()) {
        return Err(FramingError::SeatWidthNotPositive { seat_width_in: s.seat_width_in });
    }
    if !(s.notch_limit > 0.0 && s.notch_limit < 1.0) {
        return Err(FramingError::NotchLimitOutOfRange { notch_limit: s.notch_limit });
    }
    if let TailCut::PlumbAndLevel { plumb_height_in } = s.tail
        && !(plumb_height_in > 0.0 && plumb_height_in.is_finite())
    {
        return Err(FramingError::TailPlumbNotPositive { plumb_height_in });
    }
    Ok(())
}

/// The roof's one heel height (height above plate at the wall line).
fn heel_height(planes: &[PlaneFrame], s: &FramingSettings) -> Result<f64, FramingError> {
    let plumb_depth = |p: &PlaneFrame| s.rafter.depth_in * (1.0 + p.slope * p.slope).sqrt();
    match s.heel {
        Heel::Auto => Ok(planes
            .iter()
            .map(|p| plumb_depth(p) - s.seat_width_in * p.slope)
            .fold(f64::INFINITY, f64::min)
            .max(0.0)),
        Heel::Plumb { height_in } => {
            for p in planes {
                if !(height_in > 0.0 && height_in < plumb_depth(p)) {
                    return Err(FramingError::HeelLeavesNoSeat {
                        height_in,
                        wall: p.wall,
                        plumb_depth_in: plumb_depth(p),
                    });
                }
            }
            Ok(height_in)
        }
    }
}

/// The vertical plane `thickness / 2` from a line's centre toward `toward`,
/// keeping `toward`'s side.
fn side_face(
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
fn cut_tag(h: &HalfSpace, frame: &BoardFrame) -> FaceTag {
    if h.normal.dot(frame.side).abs() < 1e-9 { FaceTag::Plumb } else { FaceTag::Cheek }
}

/// What every builder needs.
struct Ctx<'a> {
    planes: &'a [PlaneFrame],
    lines: &'a [PlanLine],
    rafters: &'a [RafterLine],
    heel: f64,
    settings: &'a FramingSettings,
}

/// A hip or valley: its spec, the pieces it bears on with the mating
/// planes, and whether its top met no ridge.
type Built = (PieceSpec, Vec<(Bearing, HalfSpace)>, bool);

/// A bearing named by roof line (resolved to a piece later) with the
/// mating plane.
type LineBearing = Option<(usize, HalfSpace)>;

impl Ctx<'_> {
    /// The tail cuts of a rafter in plane `p` on board `frame`.
    fn tail_cuts(&self, p: &PlaneFrame, frame: &BoardFrame) -> Vec<HalfSpace> {
        let o = p.overhang_in;
        let mut cuts = Vec::new();
        match self.settings.tail {
            TailCut::Plumb => cuts.extend(p.wall_side(o, true, FaceTag::Tail, Some(CutEnd::Tail))),
            TailCut::Square => {
                let top = frame.origin + frame.along * (-o * (1.0 + p.slope * p.slope).sqrt());
                cuts.extend(HalfSpace::through(top, -frame.along, FaceTag::Tail, Some(CutEnd::Tail)));
            }
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

    /// The ridge's height at its top: flush with the rafters' tops at its
    /// side faces (the lower side where pitches differ).
    fn ridge_top(&self, line: &PlanLine) -> f64 {
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

    /// The ridge's pieces, split so none is longer than the longest stock,
    /// splices on common-rafter lines where they fall right.
    fn ridge_specs(&self, li: usize, line: &PlanLine) -> Vec<PieceSpec> {
        let Some(dir) = (line.to - line.from).try_normalize() else {
            return Vec::new();
        };
        let len = line.from.distance(line.to);
        let half_rafter = self.settings.rafter.thickness_in / 2.0;
        let hip_end = |node: DVec2| {
            self.lines.iter().any(|l| l.kind == RoofLineKind::Hip && l.to.distance(node) < PLAN_TOL_IN * 1e3)
        };
        // Where an earlier ridge meets this one at an angle, this one butts
        // against its side; otherwise a hip end runs half a rafter past the
        // node, flush with the side kings' faces.
        let butt = |node: DVec2| -> Option<f64> {
            self.lines.iter().take(li).filter(|l| l.kind == RoofLineKind::Ridge && l.touches(node)).find_map(
                |l| {
                    let other = (l.to - l.from).try_normalize()?;
                    let sin = other.perp_dot(dir).abs();
                    (sin > 1e-6).then(|| self.settings.ridge.thickness_in / 2.0 / sin)
                },
            )
        };
        let end_offset = |node: DVec2| match butt(node) {
            Some(back) => -back,
            None if hip_end(node) => half_rafter,
            None => 0.0,
        };
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
        cuts_at
            .windows(2)
            .filter_map(|w| {
                let (a, b) = (w[0], w[1]);
                let pa = line.from + dir * a;
                let pb = line.from + dir * b;
                let lo =
                    HalfSpace::through(pa.extend(top), -frame0.along, FaceTag::End, Some(CutEnd::Start))?;
                let hi = HalfSpace::through(pb.extend(top), frame0.along, FaceTag::End, Some(CutEnd::End))?;
                Some(PieceSpec {
                    kind: MemberKind::Ridge,
                    size: self.settings.ridge,
                    frame: BoardFrame { origin: pa.extend(top), ..frame0 },
                    plan_line: [pa, pb],
                    slope: 0.0,
                    top_planes: Vec::new(),
                    upper_cuts: vec![hi],
                    lower_cuts: vec![lo],
                    seat: Vec::new(),
                    has_tail: false,
                    drop_in: 0.0,
                })
            })
            .collect()
    }

    /// A common, king or jack, with the roof lines it bears on.
    fn rafter_spec(
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
            });
            if has_tail {
                lower_cuts.extend(self.tail_cuts(p, &frame));
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
            lower_cuts,
            seat,
            has_tail,
            drop_in: 0.0,
        };
        Some((spec, Some((upper_line, upper_cut)), lower_bearing, also))
    }

    /// Whether planes `a` and `b` are one roof plane (the same, or parts of
    /// coplanar walls: a roof line may name either wall).
    fn same_group(&self, a: usize, b: usize) -> bool {
        a == b
            || match (self.planes.get(a), self.planes.get(b)) {
                (Some(pa), Some(pb)) => pa.coplanar_walls.contains(&pb.wall),
                _ => false,
            }
    }

    /// Whether plan point `p` lies on plane `a` or a part coplanar with it.
    fn group_contains(&self, a: usize, p: DVec2) -> bool {
        (0..self.planes.len()).any(|j| self.same_group(a, j) && self.planes[j].contains(p))
    }

    /// Cuts for a hip top at a peak where hips meet with no ridge: for each
    /// other hip there, the vertical plane halving the plan angle between
    /// the two, so the hips share the space round the peak without
    /// overlapping. `far` is this hip's other end. None where a hip also
    /// rises on from the node.
    fn hub_cuts(&self, node: DVec2, far: DVec2, end: CutEnd, frame: &BoardFrame) -> Vec<HalfSpace> {
        let near = |p: DVec2| p.distance(node) < PLAN_TOL_IN * 1e3;
        let Some(mine) = (far - node).try_normalize() else { return Vec::new() };
        // Where hips merge into one rising on (irregular plans) the node
        // is left to a fitted block: the ends are cut plumb and flagged.
        if self.lines.iter().any(|l| l.kind == RoofLineKind::Hip && near(l.from)) {
            return Vec::new();
        }
        self.lines
            .iter()
            .enumerate()
            .filter(|(_, l)| l.kind == RoofLineKind::Hip)
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

    /// The plane of a hip or valley on its left and right, looking up it.
    fn sides(&self, line: &PlanLine) -> Option<(usize, usize)> {
        let dir = (line.to - line.from).try_normalize()?;
        let mid = (line.from + line.to) / 2.0;
        let probe = mid + dir.perp() * (line.from.distance(line.to) * 1e-3).min(1.0);
        let [a, b] = line.planes;
        let a_left = self.group_contains(a, probe);
        Some(if a_left { (a, b) } else { (b, a) })
    }

    /// A hip: seated over its corner, backed or dropped, its top double
    /// cheek against the king commons at the ridge end.
    fn hip_spec(&self, line: &PlanLine, rafter_piece: &[Option<usize>]) -> Option<Built> {
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
        let mut upper_cuts = Vec::new();
        let mut bearings = Vec::new();
        let mut peak_without_ridge = false;
        // A hip that starts up on the roof (where a valley and a ridge end)
        // has no seat: it sits against what is framed there first.
        let seated = line.from_z.abs() < 1e-6;
        let mut foot_without_ridge = false;
        let mut foot_cuts = Vec::new();
        if !seated {
            for (k, other) in self.lines.iter().enumerate() {
                // Hips meeting hips with no ridge are flagged for a fitted
                // block instead (below).
                let meets = match other.kind {
                    RoofLineKind::Ridge => other.touches(line.from),
                    RoofLineKind::Valley => {
                        other.to.distance(line.from) < PLAN_TOL_IN * 1e3
                            && other.from.distance(line.from) > PLAN_TOL_IN * 1e3
                    }
                    RoofLineKind::Hip => false,
                };
                if !meets || std::ptr::eq(other, line) {
                    continue;
                }
                let thickness = match other.kind {
                    RoofLineKind::Ridge => self.settings.ridge.thickness_in,
                    RoofLineKind::Hip => self.settings.hip.thickness_in,
                    RoofLineKind::Valley => self.settings.valley.thickness_in,
                };
                let Some(mut h) =
                    side_face(other.from, other.to, thickness, mid, FaceTag::Cheek, CutEnd::Bottom)
                else {
                    continue;
                };
                h.tag = cut_tag(&h, &frame);
                foot_cuts.push(h);
                bearings.push((Bearing::Line(k), h));
            }
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
        for &pi in &[left, right] {
            // The king in this plane at the hip's top, if any.
            let king = self.rafters.iter().enumerate().find(|(_, r)| {
                self.same_group(r.plane, pi)
                    && r.king.is_some()
                    && r.upper.distance(line.to) < PLAN_TOL_IN * 1e3
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
                    if let Some(Some(piece)) = rafter_piece.get(ki) {
                        bearings.push((Bearing::Piece(*piece), h));
                    }
                }
                None => peak_without_ridge = true,
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
        if has_tail {
            lower_cuts.extend(pl.wall_side(pl.overhang_in, true, FaceTag::Tail, Some(CutEnd::Tail)));
            lower_cuts.extend(pr.wall_side(pr.overhang_in, true, FaceTag::Tail, Some(CutEnd::Tail)));
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
                SeatWall { inside: pl.wall_side(0.0, true, FaceTag::Interior, None)?, half_cuts: Vec::new() },
                SeatWall { inside: pr.wall_side(0.0, true, FaceTag::Interior, None)?, half_cuts: Vec::new() },
            ]
        } else {
            Vec::new()
        };
        let spec = PieceSpec {
            kind: MemberKind::Hip,
            size,
            frame,
            plan_line: [line.from, line.to],
            slope,
            top_planes,
            upper_cuts,
            lower_cuts,
            seat,
            has_tail,
            drop_in,
        };
        Some((spec, bearings, peak_without_ridge || foot_without_ridge))
    }

    /// A valley: its centre line in both planes, seated over the inside
    /// corner, its top against the ridge boards it meets.
    fn valley_spec(&self, line: &PlanLine) -> Option<Built> {
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
        for (ri, r) in self.lines.iter().enumerate() {
            if r.kind != RoofLineKind::Ridge || !r.touches(line.to) {
                continue;
            }
            let mut h =
                side_face(r.from, r.to, self.settings.ridge.thickness_in, mid, FaceTag::Cheek, CutEnd::Top)?;
            h.tag = cut_tag(&h, &frame);
            upper_cuts.push(h);
            ridges.push((ri, h));
        }
        if upper_cuts.is_empty() {
            upper_cuts.extend(HalfSpace::through(
                line.to.extend(line.to_z),
                (line.to - line.from).extend(0.0),
                FaceTag::Plumb,
                Some(CutEnd::Top),
            ));
        }
        let has_tail = pl.overhang_in > 0.0 && pr.overhang_in > 0.0;
        // Over an inside corner each half ends at its own side's fascia.
        let half = |p: &PlaneFrame| -> Option<SeatWall> {
            let mut half_cuts = Vec::new();
            if has_tail {
                half_cuts.extend(p.wall_side(p.overhang_in, true, FaceTag::Tail, Some(CutEnd::Tail)));
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
            Some(SeatWall { inside: p.wall_side(0.0, true, FaceTag::Interior, None)?, half_cuts })
        };
        let seat = vec![half(pl)?, half(pr)?];
        let spec = PieceSpec {
            kind: MemberKind::Valley,
            size,
            frame,
            plan_line: [line.from, line.to],
            slope,
            top_planes: Vec::new(),
            upper_cuts,
            lower_cuts: Vec::new(),
            seat,
            has_tail,
            drop_in: 0.0,
        };
        // Ridge bearings are resolved to pieces by the caller.
        let bearings = ridges.into_iter().map(|(ri, h)| (Bearing::Line(ri), h)).collect();
        Some((spec, bearings, false))
    }
}

/// Labels and groups of identical pieces.
struct Labels {
    labels: Vec<String>,
    groups: Vec<Vec<usize>>,
}

/// Groups identical pieces (mirror images together) and labels each group
/// by kind, longest first.
fn label_pieces(specs: &[PieceSpec], measured: &[Measured]) -> Labels {
    let key = |i: usize| -> (MemberKind, Vec<i64>) {
        let m = &measured[i];
        let s = &specs[i];
        let q = |x: f64| (x * 1e4).round() as i64;
        let mut k = vec![
            q(s.size.thickness_in),
            q(s.size.depth_in),
            q(s.slope),
            q(m.theoretical_length),
            q(m.long_point_length),
            q(m.short_point_length),
            q(m.seat_to_top_cut),
            q(m.tail_length),
            q(m.overall_length),
        ];
        let mut cut_keys: Vec<i64> = Vec::new();
        let json = serde_json_like(&m.cuts);
        cut_keys.extend(json);
        cut_keys.sort_unstable();
        k.extend(cut_keys);
        (s.kind, k)
    };
    let keys: Vec<(MemberKind, Vec<i64>)> = (0..specs.len()).map(key).collect();
    let mut groups: Vec<Vec<usize>> = Vec::new();
    for i in 0..specs.len() {
        match groups.iter_mut().find(|g| keys[g[0]] == keys[i]) {
            Some(g) => g.push(i),
            None => groups.push(vec![i]),
        }
    }
    groups.sort_by(|a, b| {
        let (ka, kb) = (specs[a[0]].kind, specs[b[0]].kind);
        ka.cmp(&kb).then(measured[b[0]].overall_length.total_cmp(&measured[a[0]].overall_length))
    });
    let mut labels = vec![String::new(); specs.len()];
    let mut counter: std::collections::HashMap<MemberKind, usize> = std::collections::HashMap::new();
    for g in &groups {
        let kind = specs[g[0]].kind;
        let n = counter.entry(kind).or_insert(0);
        *n += 1;
        let label = format!("{}{}", kind.label_prefix(), n);
        for &i in g {
            labels[i] = label.clone();
        }
    }
    Labels { labels, groups }
}

/// The numbers of a cut list, rounded, hand-free.
fn serde_json_like(cuts: &[super::Cut]) -> Vec<i64> {
    use super::Cut;
    let q = |x: f64| (x * 1e3).round() as i64;
    let face = |f: &super::CutFace| {
        [q(f.side_angle_deg), q(f.top_edge_angle_deg), q(f.face_bevel_deg), q(f.edge_bevel_deg)]
    };
    let mut out = Vec::new();
    for c in cuts {
        match c {
            Cut::Plumb { face: f, deduction_in, .. } | Cut::Cheek { face: f, deduction_in, .. } => {
                out.extend(face(f));
                out.push(q(*deduction_in));
            }
            Cut::DoubleCheek { left, right, deduction_in, .. } => {
                out.extend(face(left));
                out.extend(face(right));
                out.push(q(*deduction_in));
            }
            Cut::Seat { seat_width_in, heel_height_in, notch_depth_in, drop_in, .. } => {
                out.extend([q(*seat_width_in), q(*heel_height_in), q(*notch_depth_in), q(*drop_in)]);
            }
            Cut::Tail { faces, .. } => out.extend(faces.iter().flat_map(face)),
            Cut::Soffit { length_in, .. } => out.push(q(*length_in)),
            Cut::Backing { left_deg, right_deg, .. } => out.extend([q(*left_deg), q(*right_deg)]),
            Cut::SquareEnd { .. } => {}
        }
    }
    out
}

/// The checks on one piece's own numbers.
fn piece_checks(label: &str, spec: &PieceSpec, m: &Measured, s: &FramingSettings) -> Vec<FramingWarning> {
    let mut out = Vec::new();
    if let Some(depth) = m.notch_depth_in {
        let limit = s.notch_limit * spec.size.depth_in;
        if depth > limit + 1e-9 {
            out.push(FramingWarning::NotchTooDeep {
                label: label.to_owned(),
                notch_depth_in: depth,
                limit_in: limit,
            });
        }
    }
    let max = s.saws.max_bevel_deg;
    for c in &m.cuts {
        let faces: Vec<&super::CutFace> = match c {
            super::Cut::Plumb { face, .. } | super::Cut::Cheek { face, .. } => vec![face],
            super::Cut::DoubleCheek { left, right, .. } => vec![left, right],
            super::Cut::Tail { faces, .. } => faces.iter().collect(),
            _ => Vec::new(),
        };
        for f in faces {
            if s.saws.circular && f.face_bevel_deg > max + 1e-9 {
                out.push(FramingWarning::BevelBeyondSaw {
                    label: label.to_owned(),
                    end: c.end(),
                    saw: SawKind::Circular,
                    bevel_deg: f.face_bevel_deg,
                    max_deg: max,
                });
            }
            let miter_bevel = f.miter_flat.bevel_deg.min(f.miter_on_edge.bevel_deg);
            if s.saws.miter && miter_bevel > max + 1e-9 {
                out.push(FramingWarning::BevelBeyondSaw {
                    label: label.to_owned(),
                    end: c.end(),
                    saw: SawKind::Miter,
                    bevel_deg: miter_bevel,
                    max_deg: max,
                });
            }
        }
    }
    if let Some(longest) = s.longest_stock_in()
        && m.overall_length > longest + STOCK_TOL_IN
    {
        out.push(FramingWarning::StockLengthExceeded {
            label: label.to_owned(),
            length_in: m.overall_length,
            longest_stock_in: longest,
        });
    }
    out
}
