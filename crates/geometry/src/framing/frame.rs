//! Frames a solved roof: lays out, cuts and checks every piece.

use glam::DVec2;
use serde::Serialize;

use super::bearing_stretch::{cheek_past_cut_wall_line, lands_on_bearing};
use super::board::PieceSpec;
use super::builders::{Bearing, Ctx, left_out_lines};
use super::checks::piece_checks;
use super::copies::solids_of;
use super::joints::{JOINT_FIT_IN, Joint, check_fit, part_bounds};
use super::labels::label_pieces;
use super::layout::{
    JackAtRidgeEnd, PlanLine, RafterLine, jacks_clear_of_ridge_ends, rafter_lines, rafters_onto_kept_ridges,
    ridges_beside,
};
use super::measure::{Measured, measure};
use super::plane_frame::{PLAN_TOL_IN, PlaneFrame, distance_to_segment};
use super::{
    CutEnd, FaceTag, FramingError, FramingSettings, FramingWarning, HalfSpace, Heel, Member, MemberKind,
    PlacedPiece, Solid, TailCut,
};
use crate::{Outline, Roof, RoofLineKind};

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
    // Two ridges side by side closer than a board's thickness: one board,
    // the longer, with everything on the other moved onto it.
    let beside = ridges_beside(&lines, settings);
    let mut moved_from =
        rafters_onto_kept_ridges(&mut rafters, &lines, &beside, &planes, settings.rafter.thickness_in);
    // A valley jack on the spacing where a ridge's end would lie in its
    // board: moved clear along its wall, or left out.
    let (at_ridge_end, jacks_left_out) =
        jacks_clear_of_ridge_ends(&mut rafters, &mut moved_from, &planes, &lines, &beside, settings);
    let kept_ridge: Vec<Option<usize>> = beside.iter().map(|b| b.map(|(kept, _)| kept)).collect();

    let left_out_line = left_out_lines(&lines, settings);
    let ctx = Ctx {
        planes: &planes,
        lines: &lines,
        rafters: &rafters,
        heel,
        settings,
        left_out: &left_out_line,
        kept_ridge: &kept_ridge,
    };
    let mut specs: Vec<PieceSpec> = Vec::new();
    let mut joint_specs: Vec<JointSpec> = Vec::new();
    let mut warnings_extra: Vec<(usize, FramingWarning)> = Vec::new();

    // Ridges, split at stock lengths.
    let mut ridge_pieces: Vec<Vec<usize>> = vec![Vec::new(); lines.len()];
    let framed_ridges = || {
        lines.iter().enumerate().filter(|(li, l)| l.kind == RoofLineKind::Ridge && kept_ridge[*li].is_none())
    };
    for (li, line) in framed_ridges() {
        let pieces = ctx.ridge_specs(li, line);
        let first = specs.len();
        for (k, spec) in pieces.into_iter().enumerate() {
            if k > 0
                && let Some(mating) = spec.lower_cuts.first().copied()
            {
                // The splice: the earlier piece's end face against this one.
                let flipped = HalfSpace { normal: -mating.normal, offset: -mating.offset, ..mating };
                joint_specs.push(JointSpec {
                    cut: first + k - 1,
                    bearing: Bearing::Piece(first + k),
                    mating: flipped,
                });
            }
            if let Some(cut_in) = super::measure::plate_level_depth(&spec) {
                let w = FramingWarning::HipCutLevelAtPlate { label: String::new(), cut_in };
                warnings_extra.push((specs.len(), w));
            }
            ridge_pieces[li].push(specs.len());
            specs.push(spec);
        }
        // An end cut back to a hip or valley passing by bears on it.
        for (k, mating, at_start) in ctx.ridge_end_clearances(li, line) {
            let piece = if at_start { ridge_pieces[li].first() } else { ridge_pieces[li].last() };
            if let Some(&cut) = piece {
                joint_specs.push(JointSpec { cut, bearing: Bearing::Line(k), mating });
            }
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

    // Each jack moved clear of a ridge's end, with that ridge's piece
    // there: (jack piece, ridge piece, how far moved); and each ridge
    // piece whose end stands where jacks were left out, with how many.
    let mut jack_moves: Vec<(usize, usize, f64)> = Vec::new();
    for (ri, d) in at_ridge_end.iter().enumerate() {
        if let (Some(JackAtRidgeEnd::Moved { ridge, node, by_in }), Some(Some(piece))) =
            (d, rafter_piece.get(ri))
            && let Some(ridge_piece) = ridge_piece_at(*ridge, *node, &specs)
        {
            jack_moves.push((*piece, ridge_piece, *by_in));
        }
    }
    let mut left_out_at_ridge_end: Vec<(usize, usize)> = Vec::new();
    for d in &jacks_left_out {
        let JackAtRidgeEnd::LeftOut { ridge, node } = d else { continue };
        let Some(ridge_piece) = ridge_piece_at(*ridge, *node, &specs) else { continue };
        match left_out_at_ridge_end.iter_mut().find(|(p, _)| *p == ridge_piece) {
            Some((_, count)) => *count += 1,
            None => left_out_at_ridge_end.push((ridge_piece, 1)),
        }
    }
    for (piece, count) in left_out_at_ridge_end {
        warnings_extra.push((piece, FramingWarning::JackLeftOutAtRidgeEnd { label: String::new(), count }));
    }

    // A ridge's end cut back to a king common passing it bears on the king.
    for (li, line) in framed_ridges() {
        for (ri, mating, at_start) in ctx.ridge_end_king_clearances(li, line) {
            let piece = if at_start { ridge_pieces[li].first() } else { ridge_pieces[li].last() };
            if let (Some(&cut), Some(Some(king))) = (piece, rafter_piece.get(ri)) {
                joint_specs.push(JointSpec { cut, bearing: Bearing::Piece(*king), mating });
            }
        }
    }

    // Hips and valleys.
    let mut line_piece: Vec<Option<usize>> = vec![None; lines.len()];
    // A hip or valley too short to cut is not cut, and the members
    // meeting it are flagged to be fitted at the node by hand.
    let mut left_out: Vec<Option<(MemberKind, f64)>> = vec![None; lines.len()];
    for (li, line) in lines.iter().enumerate() {
        let kind = match line.kind {
            RoofLineKind::Hip => MemberKind::Hip,
            RoofLineKind::Valley => MemberKind::Valley,
            RoofLineKind::Ridge => continue,
        };
        if left_out_line[li] {
            left_out[li] = Some((kind, line.from.distance(line.to)));
        }
    }
    for (li, line) in lines.iter().enumerate() {
        if left_out[li].is_some() {
            continue;
        }
        let built = match line.kind {
            RoofLineKind::Hip => ctx.hip_spec(line, &rafter_piece),
            RoofLineKind::Valley => ctx.valley_spec(line, &rafter_piece),
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
        if let Some(cut_in) = super::measure::plate_level_depth(&spec) {
            warnings_extra.push((index, FramingWarning::HipCutLevelAtPlate { label: String::new(), cut_in }));
        }
        specs.push(spec);
    }

    // Flag every piece cut against a left-out line, or ending (a ridge:
    // running) at either of its nodes.
    for (li, line) in lines.iter().enumerate() {
        let Some((kind, length_in)) = left_out[li] else { continue };
        let at_node =
            |p: DVec2| p.distance(line.from) < PLAN_TOL_IN * 1e3 || p.distance(line.to) < PLAN_TOL_IN * 1e3;
        for (i, spec) in specs.iter().enumerate() {
            let [a, b] = spec.plan_line;
            let meets = at_node(a)
                || at_node(b)
                || (spec.kind == MemberKind::Ridge
                    && [line.from, line.to]
                        .iter()
                        .any(|n| distance_to_segment(*n, a, b) < PLAN_TOL_IN * 1e3))
                || joint_specs.iter().any(|j| j.cut == i && j.bearing == Bearing::Line(li));
            let w = FramingWarning::ShortMemberLeftOut { label: String::new(), left_out: kind, length_in };
            if meets && !warnings_extra.iter().any(|(k, x)| *k == i && *x == w) {
                warnings_extra.push((i, w));
            }
        }
    }
    // Flag the kept ridge beside each left-out one (where the two run
    // side by side) and every piece moved onto it, with the kept ridge's
    // piece there: (piece, ridge piece, left-out length, apart).
    let mut beside_flags: Vec<(usize, usize, f64, f64)> = Vec::new();
    for (li, line) in lines.iter().enumerate() {
        let Some((kept, apart_in)) = beside[li] else { continue };
        let length_in = line.from.distance(line.to);
        let Some(kept_line) = lines.get(kept) else { continue };
        let Some(dir) = (kept_line.to - kept_line.from).try_normalize() else { continue };
        let along = |p: DVec2| (p - kept_line.from).dot(dir);
        let (lo, hi) = (along(line.from).min(along(line.to)), along(line.from).max(along(line.to)));
        for &piece in &ridge_pieces[kept] {
            let [a, b] = specs[piece].plan_line;
            if along(a).max(along(b)) > lo && along(a).min(along(b)) < hi {
                beside_flags.push((piece, piece, length_in, apart_in));
            }
        }
        let at_node =
            |p: DVec2| p.distance(line.from) < PLAN_TOL_IN * 1e3 || p.distance(line.to) < PLAN_TOL_IN * 1e3;
        let moved = rafter_piece
            .iter()
            .zip(&moved_from)
            .filter(|(_, from)| **from == Some(li))
            .filter_map(|(piece, _)| *piece)
            .map(|piece| (piece, specs[piece].plan_line[1]));
        let hips_valleys = line_piece.iter().flatten().filter_map(|&piece| {
            specs[piece].plan_line.into_iter().find(|&p| at_node(p)).map(|p| (piece, p))
        });
        for (piece, p) in moved.chain(hips_valleys).collect::<Vec<_>>() {
            if let Some(ridge) = ridge_piece_at(kept, p, &specs) {
                beside_flags.push((piece, ridge, length_in, apart_in));
            }
        }
    }
    // Bearings named by roof line become pieces now that all are built.
    let joint_specs: Vec<ResolvedJoint> = joint_specs
        .into_iter()
        .filter_map(|j| {
            let bearing = match j.bearing {
                Bearing::Piece(i) => Some(i),
                Bearing::Line(li) => match lines.get(li).map(|l| l.kind) {
                    Some(RoofLineKind::Ridge) => {
                        // A ridge left out beside another: the one kept.
                        let li = kept_ridge[li].unwrap_or(li);
                        let end =
                            if matches!(j.mating.end, Some(CutEnd::Bottom | CutEnd::Start)) { 0 } else { 1 };
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

    let solids = solids_of(&specs);
    let measured: Vec<Measured> =
        specs.iter().zip(&solids).map(|(s, solid)| measure(s, solid, settings)).collect();
    // A piece its cuts leave nothing of (a layout line squeezed out at a
    // crowded node) is not cut at all: drop it and the joints naming it.
    // A jack whose cheek falls where its hip or valley is cut away at a
    // node or notched over a plate has nothing to bear on: left out.
    // Jacks left out as only tails past a hip's or valley's cut wall line
    // leave that overhang without tails: counted on the hip or valley.
    let mut off_bearing = vec![false; specs.len()];
    let mut tails_left_out = vec![0usize; specs.len()];
    for j in &joint_specs {
        let jack = matches!(
            specs[j.cut].kind,
            MemberKind::HipJack | MemberKind::ValleyJack | MemberKind::CrippleJack
        );
        let on_line = matches!(specs[j.bearing].kind, MemberKind::Hip | MemberKind::Valley);
        if jack
            && on_line
            && !off_bearing[j.cut]
            && !lands_on_bearing(&solids[j.cut], &j.mating, &specs[j.bearing])
        {
            off_bearing[j.cut] = true;
            if cheek_past_cut_wall_line(&solids[j.cut], &j.mating, &specs[j.bearing]) {
                tails_left_out[j.bearing] += 1;
            }
        }
    }
    for (i, &count) in tails_left_out.iter().enumerate().filter(|(_, c)| **c > 0) {
        warnings_extra.push((i, FramingWarning::TailsLeftOut { label: String::new(), count }));
    }
    let usable = |i: usize| {
        !off_bearing[i]
            && solids[i].volume() > 1e-6
            && [measured[i].overall_length, measured[i].long_point_length, measured[i].short_point_length]
                .iter()
                .all(|x| x.is_finite())
    };
    let kept: Vec<usize> = (0..specs.len()).filter(|&i| usable(i)).collect();
    let (specs, solids, measured, joint_specs, warnings_extra, beside_flags, jack_moves) =
        if kept.len() == specs.len() {
            (specs, solids, measured, joint_specs, warnings_extra, beside_flags, jack_moves)
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
            let flags = beside_flags
                .into_iter()
                .filter_map(|(i, ridge, length_in, apart_in)| {
                    Some((new_index[i]?, new_index[ridge]?, length_in, apart_in))
                })
                .collect();
            let moves = jack_moves
                .into_iter()
                .filter_map(|(i, ridge, by_in)| Some((new_index[i]?, new_index[ridge]?, by_in)))
                .collect();
            (
                kept_only(specs, &new_index),
                kept_only(solids, &new_index),
                kept_only(measured, &new_index),
                joints,
                extra,
                flags,
                moves,
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
    let all_ridges_bounds = part_bounds(&all_ridges);
    // A cut another cut overrides leaves no face (a hip's foot cut back
    // past a ridge's end by the valley beside it): no joint there.
    let has_face = |j: &ResolvedJoint| {
        solids[j.cut].faces().any(|f| {
            f.normal.dot(j.mating.normal) > 1.0 - 1e-9 && j.mating.distance(f.vertices[0]).abs() < 1e-5
        })
    };
    let joints: Vec<(Joint, f64)> = joint_specs
        .iter()
        .filter(|j| has_face(j))
        .map(|j| {
            let splice = specs[j.cut].kind == MemberKind::Ridge;
            let own_bounds;
            let (bearing, bounds) = if specs[j.bearing].kind == MemberKind::Ridge && !splice {
                (&all_ridges, all_ridges_bounds.as_slice())
            } else {
                own_bounds = part_bounds(&solids[j.bearing]);
                (&solids[j.bearing], own_bounds.as_slice())
            };
            let b = &specs[j.bearing].frame;
            let top = HalfSpace::through(b.origin, b.up, FaceTag::Top, None);
            let fit = check_fit(&solids[j.cut], &j.mating, bearing, bounds, top.as_ref());
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
            FramingWarning::ShortMemberLeftOut { left_out, length_in, .. } => {
                FramingWarning::ShortMemberLeftOut { label: labels.labels[i].clone(), left_out, length_in }
            }
            FramingWarning::HipCutLevelAtPlate { cut_in, .. } => {
                FramingWarning::HipCutLevelAtPlate { label: labels.labels[i].clone(), cut_in }
            }
            FramingWarning::TailsLeftOut { count, .. } => {
                FramingWarning::TailsLeftOut { label: labels.labels[i].clone(), count }
            }
            FramingWarning::JackLeftOutAtRidgeEnd { count, .. } => {
                FramingWarning::JackLeftOutAtRidgeEnd { label: labels.labels[i].clone(), count }
            }
            other => other,
        };
        piece_warnings[i].push(w);
    }
    for (i, ridge, length_in, apart_in) in beside_flags {
        piece_warnings[i].push(FramingWarning::RidgeBesideLeftOut {
            label: labels.labels[i].clone(),
            ridge: labels.labels[ridge].clone(),
            length_in,
            apart_in,
        });
    }
    for (i, ridge, by_in) in jack_moves {
        piece_warnings[i].push(FramingWarning::JackMovedOffLayout {
            label: labels.labels[i].clone(),
            ridge: labels.labels[ridge].clone(),
            by_in,
        });
    }
    for (joint, _) in &joints {
        // A NaN reading is no fit either.
        if !(joint.max_gap < JOINT_FIT_IN && joint.max_overlap < JOINT_FIT_IN) {
            piece_warnings[joint.pieces[0]].push(FramingWarning::JointDoesNotFit {
                label: joint.members[0].clone(),
                bears_on: joint.members[1].clone(),
                gap_in: joint.max_gap,
                overlap_in: joint.max_overlap,
            });
        }
    }
    for (joint, hang) in &joints {
        if *hang <= JOINT_FIT_IN {
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
                if !warnings.iter().any(|seen| seen.repeats(w)) {
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
            if !warnings.iter().any(|seen| seen.repeats(w)) {
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
