//! Reads a piece's lengths and cuts off its solid.

use glam::DVec3;

use super::board::PieceSpec;
use super::solid::ON_PLANE_IN;
use super::{Cut, CutEnd, CutFace, FaceTag, FramingSettings, HalfSpace, Hand, MemberKind, Solid};

/// What is read off one piece.
#[derive(Debug, Clone, PartialEq)]
pub struct Measured {
    /// Plan run between the theoretical ends.
    pub run: f64,
    /// Theoretical length.
    pub theoretical_length: f64,
    /// To the top cut's long point along the top edge.
    pub long_point_length: f64,
    /// To the top cut's short point along the top edge.
    pub short_point_length: f64,
    /// Heel plumb line (or lower cut) to top cut, on the centre line.
    pub seat_to_top_cut: f64,
    /// Heel plumb line to the tail's end on the centre line.
    pub tail_length: f64,
    /// Whole extent along the board.
    pub overall_length: f64,
    /// The cuts.
    pub cuts: Vec<Cut>,
    /// Which hand the piece is.
    pub hand: Option<Hand>,
    /// Notch depth square to the edge, if seated.
    pub notch_depth_in: Option<f64>,
    /// The top edge's centre line between the end cuts.
    pub axis: [DVec3; 2],
}

/// Tolerance for "this vertex is on that plane" when reading the solid.
const READ_TOL_IN: f64 = ON_PLANE_IN * 100.0;

/// Parameter along the centre line (from the frame origin) where it meets
/// the plane `h`, if it crosses it.
fn centre_line_hit(spec: &PieceSpec, h: &HalfSpace) -> Option<f64> {
    let denom = h.normal.dot(spec.frame.along);
    (denom.abs() > 1e-12).then(|| (h.offset - h.normal.dot(spec.frame.origin)) / denom)
}

/// The cut planes of `cuts` that left a face with `end` on the solid.
fn faces_of<'a>(solid: &'a Solid, end: CutEnd, tags: &[FaceTag]) -> Vec<&'a super::Face> {
    solid.faces().filter(|f| f.end == Some(end) && tags.contains(&f.tag)).collect()
}

/// Distinct planes among faces (faces of several convex parts may share a
/// plane).
fn distinct_normals(faces: &[&super::Face]) -> Vec<DVec3> {
    let mut normals: Vec<DVec3> = Vec::new();
    for f in faces {
        if !normals.iter().any(|n| n.dot(f.normal) > 1.0 - 1e-9) {
            normals.push(f.normal);
        }
    }
    normals
}

/// Reads a piece's numbers and cuts off its solid.
pub fn measure(spec: &PieceSpec, solid: &Solid, settings: &FramingSettings) -> Measured {
    let fr = &spec.frame;
    let face_of = |n: DVec3| CutFace::from_normal(n, fr.along, fr.up, fr.side);
    let run = spec.plan_line[0].distance(spec.plan_line[1]);
    let per_run = (1.0 + spec.slope * spec.slope).sqrt();
    let theoretical_length = run * per_run;
    let seated = !spec.seat.is_empty();

    let top_vertices: Vec<DVec3> = solid
        .faces()
        .filter(|f| matches!(f.tag, FaceTag::Top | FaceTag::Backing))
        .flat_map(|f| f.vertices.iter().copied())
        .collect();
    let on_any = |p: DVec3, planes: &[HalfSpace]| planes.iter().any(|h| h.distance(p).abs() < READ_TOL_IN);
    let along = |p: DVec3| fr.along_of(p);
    let extent = |planes: &[HalfSpace]| {
        top_vertices
            .iter()
            .copied()
            .filter(|p| on_any(*p, planes))
            .map(along)
            .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), s| (lo.min(s), hi.max(s)))
    };
    // A top cut in two steps ends at the step's faces too.
    let upper_planes: Vec<HalfSpace> =
        spec.upper_cuts.iter().copied().chain(spec.upper_step.iter().flat_map(|s| [s.at, s.far])).collect();
    let (upper_lo, upper_hi) = extent(&upper_planes);
    let s_top = spec
        .upper_cuts
        .iter()
        .filter(|h| h.normal.dot(fr.along) > 1e-12)
        .filter_map(|h| {
            let s = centre_line_hit(spec, h)?;
            // Past a step, the centre line meets the cut beyond it.
            match &spec.upper_step {
                Some(step) if *h == step.near && step.at.distance(fr.origin + fr.along * s) > 0.0 => {
                    centre_line_hit(spec, &step.far)
                }
                _ => Some(s),
            }
        })
        .fold(f64::INFINITY, f64::min);
    // A valley over an inside corner carries its tail cuts on each seat
    // half rather than as lower cuts; both end the member below.
    let seat_half_cuts = spec.seat.iter().flat_map(|s| s.half_cuts.iter());
    let s_low_cuts = spec
        .lower_cuts
        .iter()
        .chain(seat_half_cuts)
        .filter(|h| h.normal.dot(fr.along) < -1e-12)
        .filter_map(|h| centre_line_hit(spec, h))
        .fold(f64::NEG_INFINITY, f64::max);
    let (s_bottom, long_point_length, short_point_length) = if seated {
        (0.0, upper_hi, upper_lo)
    } else {
        let (lower_lo, lower_hi) = extent(&spec.lower_cuts);
        (s_low_cuts, upper_hi - lower_lo, upper_lo - lower_hi)
    };
    let seat_to_top_cut = s_top - s_bottom;
    let tail_length = if seated && spec.has_tail { -s_low_cuts } else { 0.0 };
    let (along_lo, along_hi) = solid
        .vertices()
        .map(along)
        .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), s| (lo.min(s), hi.max(s)));
    let overall_length = along_hi - along_lo;
    let axis =
        [fr.origin + fr.along * if seated { -tail_length } else { s_bottom }, fr.origin + fr.along * s_top];

    let mut cuts = Vec::new();
    let mut hand = None;
    let plan_dir = (spec.plan_line[1] - spec.plan_line[0]).normalize_or_zero();
    let deduction_at = |s: f64, theoretical_end: glam::DVec2| {
        let p = (fr.origin + fr.along * s).truncate();
        let plan = (p - theoretical_end).dot(plan_dir).abs();
        (plan * per_run, plan)
    };

    if spec.kind == MemberKind::Ridge {
        cuts.push(Cut::SquareEnd { end: CutEnd::Start });
        cuts.push(Cut::SquareEnd { end: CutEnd::End });
        cuts.extend(plate_level(spec, solid, plan_dir));
    } else {
        // The upper end.
        let upper_faces = faces_of(solid, CutEnd::Top, &[FaceTag::Plumb, FaceTag::Cheek]);
        let (deduction_in, plan_deduction_in) = deduction_at(s_top, spec.plan_line[1]);
        let stepped = spec.upper_step.as_ref().and_then(|step| {
            stepped_cheek(step, &upper_faces, &top_vertices, spec, deduction_in, plan_deduction_in, &face_of)
        });
        let (cut, cut_hand) = match stepped {
            Some((cut, hand)) => (Some(cut), Some(hand)),
            None => end_cut(
                CutEnd::Top,
                &upper_faces,
                &top_vertices,
                spec,
                deduction_in,
                plan_deduction_in,
                &face_of,
            ),
        };
        cuts.extend(cut);
        hand = hand.or(cut_hand);
        if seated {
            cuts.push(seat_cut(spec, solid));
            if spec.has_tail {
                let tail_faces = faces_of(solid, CutEnd::Tail, &[FaceTag::Tail]);
                let normals = distinct_normals(&tail_faces);
                let faces: Vec<CutFace> = normals.iter().map(|n| face_of(*n)).collect();
                let style = settings.tail;
                if let Some(first) = faces.first() {
                    cuts.push(Cut::Tail {
                        end: CutEnd::Tail,
                        style,
                        square: own_plumb(spec, first.plumb_square),
                        faces,
                    });
                }
                let soffit: Vec<DVec3> = faces_of(solid, CutEnd::Tail, &[FaceTag::Soffit])
                    .iter()
                    .flat_map(|f| f.vertices.iter().copied())
                    .collect();
                if !soffit.is_empty() {
                    let level: Vec<f64> = soffit.iter().map(|p| p.truncate().dot(plan_dir)).collect();
                    let length_in = level.iter().copied().fold(f64::NEG_INFINITY, f64::max)
                        - level.iter().copied().fold(f64::INFINITY, f64::min);
                    cuts.push(Cut::Soffit { end: CutEnd::Tail, square: spec.plumb_square, length_in });
                }
            }
        } else {
            let lower_faces = faces_of(solid, CutEnd::Bottom, &[FaceTag::Plumb, FaceTag::Cheek]);
            let (deduction_in, plan_deduction_in) = deduction_at(s_low_cuts, spec.plan_line[0]);
            let (cut, cut_hand) = end_cut(
                CutEnd::Bottom,
                &lower_faces,
                &top_vertices,
                spec,
                deduction_in,
                plan_deduction_in,
                &face_of,
            );
            cuts.extend(cut);
            hand = hand.or(cut_hand);
            cuts.extend(plate_level(spec, solid, plan_dir));
        }
        let backing: Vec<&super::Face> = solid.faces().filter(|f| f.tag == FaceTag::Backing).collect();
        let normals = distinct_normals(&backing);
        if !normals.is_empty() {
            let bevel = |left: bool| {
                normals
                    .iter()
                    .find(|n| (n.dot(fr.side) > 0.0) == left)
                    .map_or(0.0, |n| n.dot(fr.up).clamp(-1.0, 1.0).acos().to_degrees())
            };
            cuts.push(Cut::Backing {
                end: CutEnd::FullLength,
                left_deg: bevel(true),
                right_deg: bevel(false),
            });
        }
    }

    let notch_depth_in = seated.then(|| notch_depth(spec));
    Measured {
        run,
        theoretical_length,
        long_point_length,
        short_point_length,
        seat_to_top_cut,
        tail_length,
        overall_length,
        cuts,
        hand,
        notch_depth_in,
        axis,
    }
}

/// The cut at one end from the faces it left: plumb, cheek or double cheek.
fn end_cut(
    end: CutEnd,
    faces: &[&super::Face],
    top_vertices: &[DVec3],
    spec: &PieceSpec,
    deduction_in: f64,
    plan_deduction_in: f64,
    face_of: &dyn Fn(DVec3) -> CutFace,
) -> (Option<Cut>, Option<Hand>) {
    let fr = &spec.frame;
    let normals = distinct_normals(faces);
    match normals.as_slice() {
        [] => (None, None),
        [n] => {
            let face = face_of(*n);
            if n.dot(fr.side).abs() < 1e-9 {
                let cut = Cut::Plumb {
                    end,
                    square: own_plumb(spec, face.plumb_square),
                    face,
                    deduction_in,
                    plan_deduction_in,
                };
                return (Some(cut), None);
            }
            // The long point is the top corner farthest along at the top,
            // nearest the start at the bottom.
            let on_face: Vec<DVec3> = top_vertices
                .iter()
                .copied()
                .filter(|p| faces.iter().any(|f| (f.normal.dot(*p - f.vertices[0])).abs() < READ_TOL_IN))
                .collect();
            let sign = if end == CutEnd::Top { 1.0 } else { -1.0 };
            let long = on_face
                .iter()
                .copied()
                .max_by(|a, b| (sign * fr.along_of(*a)).total_cmp(&(sign * fr.along_of(*b))));
            let long_point = match long {
                Some(p) if (p - fr.origin).dot(fr.side) > 0.0 => Hand::Left,
                _ => Hand::Right,
            };
            let cut = Cut::Cheek {
                end,
                square: face.top_edge_square.unwrap_or([12.0, f64::INFINITY]),
                top_edge_angle_deg: face.top_edge_angle_deg,
                face_bevel_deg: face.face_bevel_deg,
                edge_bevel_deg: face.edge_bevel_deg,
                long_point,
                face,
                deduction_in,
                plan_deduction_in,
            };
            (Some(cut), Some(long_point))
        }
        [a, b, ..] => {
            let (left, right) = if a.dot(fr.side) >= b.dot(fr.side) { (a, b) } else { (b, a) };
            let cut = Cut::DoubleCheek {
                end,
                left: face_of(*left),
                right: face_of(*right),
                deduction_in,
                plan_deduction_in,
            };
            (Some(cut), None)
        }
    }
}

/// A top cut in two steps ([`super::board::TopStep`]) read from the faces
/// it left: the cheek, the step's face, how deep the step is and where it
/// is along the cheek's line on the top edge; `None` where the solid kept
/// no face on both sides of the step (the step then cut nothing).
fn stepped_cheek(
    step: &super::board::TopStep,
    faces: &[&super::Face],
    top_vertices: &[DVec3],
    spec: &PieceSpec,
    deduction_in: f64,
    plan_deduction_in: f64,
    face_of: &dyn Fn(DVec3) -> CutFace,
) -> Option<(Cut, Hand)> {
    let fr = &spec.frame;
    let on = |h: &HalfSpace, f: &super::Face| {
        f.normal.dot(h.normal) > 1.0 - 1e-9 && f.vertices.iter().all(|&v| h.distance(v).abs() < READ_TOL_IN)
    };
    if !faces.iter().any(|f| on(&step.near, f)) || !faces.iter().any(|f| on(&step.far, f)) {
        return None;
    }
    let cheek_top: Vec<DVec3> = top_vertices
        .iter()
        .copied()
        .filter(|&p| [&step.near, &step.far].iter().any(|h| h.distance(p).abs() < READ_TOL_IN))
        .collect();
    let long = cheek_top.iter().copied().max_by(|a, b| fr.along_of(*a).total_cmp(&fr.along_of(*b)))?;
    let long_point = if (long - fr.origin).dot(fr.side) > 0.0 { Hand::Left } else { Hand::Right };
    // The step's corner on the top edge, on the cheek's line before the
    // step, and that line's other end, on the board's side.
    let near_top: Vec<DVec3> =
        top_vertices.iter().copied().filter(|&p| step.near.distance(p).abs() < READ_TOL_IN).collect();
    let step_corner = near_top.iter().copied().find(|&p| step.at.distance(p).abs() < READ_TOL_IN)?;
    let side_corner = near_top
        .iter()
        .copied()
        .max_by(|a, b| a.distance(step_corner).total_cmp(&b.distance(step_corner)))?;
    let step_from = if (side_corner - fr.origin).dot(fr.side) > 0.0 { Hand::Left } else { Hand::Right };
    let face = face_of(step.near.normal);
    // The step's face, read as a cut face either way round.
    let step_face = face_of(step.at.normal);
    let cut = Cut::SteppedCheek {
        end: CutEnd::Top,
        square: face.top_edge_square.unwrap_or([12.0, f64::INFINITY]),
        long_point,
        face,
        step: step_face,
        step_in: step.depth_in(),
        step_from,
        step_from_side_in: (step_corner - side_corner).truncate().length(),
        deduction_in,
        plan_deduction_in,
    };
    Some((cut, long_point))
}

/// The member's own square figures where `square` (12 and x) marks its
/// plumb line; any other line keeps its 12-and-x figures.
fn own_plumb(spec: &PieceSpec, square: [f64; 2]) -> [f64; 2] {
    let plumb = (square[1] / square[0] - spec.slope).abs() < 1e-9;
    if plumb { spec.plumb_square } else { square }
}

/// The birdsmouth, read from the seat faces.
/// The level cut at the plate of a member with no seat, where its solid
/// has one (the cut took something off).
fn plate_level(spec: &PieceSpec, solid: &Solid, plan_dir: glam::DVec2) -> Option<Cut> {
    let depth_off_in = plate_level_depth(spec)?;
    let along: Vec<f64> = faces_of(solid, CutEnd::Seat, &[FaceTag::Seat])
        .iter()
        .flat_map(|f| f.vertices.iter().map(|p| p.truncate().dot(plan_dir)))
        .collect();
    if along.is_empty() {
        return None;
    }
    let (lo, hi) =
        along.iter().fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), a| (lo.min(*a), hi.max(*a)));
    Some(Cut::PlateLevel { end: CutEnd::Seat, square: spec.plumb_square, length_in: hi - lo, depth_off_in })
}

/// How much of its depth, plumb, a member with no seat loses to a level
/// cut at the top of plate (at its lower end, where it is lowest), where
/// its lower cuts have one.
pub(super) fn plate_level_depth(spec: &PieceSpec) -> Option<f64> {
    let level = spec.seat.is_empty()
        && spec.lower_cuts.iter().any(|h| h.tag == FaceTag::Seat && h.normal.z < -1.0 + 1e-12);
    if !level || spec.frame.up.z <= 1e-9 {
        return None;
    }
    let plumb_depth = spec.size.depth_in / spec.frame.up.z;
    Some((plumb_depth - spec.frame.origin.z).max(0.0))
}

fn seat_cut(spec: &PieceSpec, solid: &Solid) -> Cut {
    let fr = &spec.frame;
    let plan_dir = fr.along.truncate().normalize_or_zero();
    // Measured along lines parallel to the member (where a framer marks
    // it, on a side face or the centre line): over a corner the heel is a
    // V, so the seat's ends sit further along at the sides than at the
    // centre, and its whole plan extent would overstate the width.
    let seat: Vec<(f64, f64)> = solid
        .faces()
        .filter(|f| f.tag == FaceTag::Seat)
        .flat_map(|f| f.vertices.iter().map(|p| ((*p - fr.origin).dot(fr.side), p.truncate().dot(plan_dir))))
        .collect();
    let seat_width_in = seat
        .iter()
        .map(|(side, _)| {
            let on_line = seat.iter().filter(|(s, _)| (s - side).abs() < READ_TOL_IN).map(|(_, a)| *a);
            let (lo, hi) =
                on_line.fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), a| (lo.min(a), hi.max(a)));
            hi - lo
        })
        .fold(0.0, f64::max);
    Cut::Seat {
        end: CutEnd::Seat,
        square: spec.plumb_square,
        seat_width_in,
        heel_height_in: fr.origin.z,
        notch_depth_in: notch_depth(spec),
        drop_in: spec.drop_in,
    }
}

/// Depth of the birdsmouth square to the bottom edge: from the heel's
/// corner on the plate to the bottom face.
fn notch_depth(spec: &PieceSpec) -> f64 {
    let fr = &spec.frame;
    let corner = fr.origin.truncate().extend(0.0);
    ((corner - fr.origin).dot(fr.up) + spec.size.depth_in).max(0.0)
}
