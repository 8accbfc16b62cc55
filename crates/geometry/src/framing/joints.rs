//! Where two pieces meet: the gap and overlap between their mating faces.

use serde::Serialize;

use super::{ConvexPart, HalfSpace, Solid};

/// A joint fits when neither its gap nor its overlap reaches this, inches:
/// 1/64 in, finer than a pencil line (common practice, no source).
pub const JOINT_FIT_IN: f64 = 1.0 / 64.0;

/// A joint between two placed pieces.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct Joint {
    /// The members' labels: the piece that is cut to fit, then the piece it
    /// bears on.
    pub members: [String; 2],
    /// Indices of the two pieces in the frame's placed pieces.
    pub pieces: [usize; 2],
    /// Largest gap between the mating faces, inches.
    pub max_gap: f64,
    /// Largest overlap (interpenetration) of the two solids, inches.
    pub max_overlap: f64,
}

/// What a joint check finds.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct JointFit {
    /// Largest gap between the mating faces.
    pub max_gap: f64,
    /// Largest interpenetration.
    pub max_overlap: f64,
    /// How far the cut face hangs past the face it bears on (a bearing
    /// member too shallow for the cut).
    pub max_hang: f64,
}

/// Checks the fit of `cut` (whose face in `mating` should bear on `bearing`).
///
/// Each corner of the cut face is measured square to the mating plane
/// (gap outside, overlap inside) where its foot lands on the bearing solid;
/// a foot off the bearing solid is a hang, and so is one the line square to
/// the mating face reaches only through a face of the bearing turned more
/// than 60 degrees from it (past the bearing face's edge, beside another),
/// and so is one whose line runs along a face of the bearing with the cut
/// face beside the corner off the bearing (the two meet only along an
/// edge). Overlap also takes every corner of either solid found inside the
/// other.
///
/// A corner above `bearing_top` (the bearing member's top through its
/// centre line) that misses it is not a hang: the top planes of a valley's
/// jacks rise past the valley's edges.
///
/// `bearing_bounds` are the corner-wise bounds of each of `bearing`'s parts
/// ([`part_bounds`]), worked out once for a solid met by many joints.
pub fn check_fit(
    cut: &Solid,
    mating: &HalfSpace,
    bearing: &Solid,
    bearing_bounds: &[(glam::DVec3, glam::DVec3)],
    bearing_top: Option<&HalfSpace>,
) -> JointFit {
    let tol = 1e-6;
    // Only the bearing's parts near the cut piece matter (a rafter against
    // a long ridge meets one short stretch of it).
    let (lo, hi) = bounds(cut.vertices());
    let near: Vec<&ConvexPart> = bearing
        .parts
        .iter()
        .zip(bearing_bounds)
        .filter(|(_, (plo, phi))| plo.cmple(hi + NEAR_IN).all() && phi.cmpge(lo - NEAR_IN).all())
        .map(|(part, _)| part)
        .collect();
    let near_depth =
        |p: glam::DVec3| near.iter().map(|part| part.depth_of(p)).fold(f64::NEG_INFINITY, f64::max);
    let mut fit = JointFit { max_gap: 0.0, max_overlap: 0.0, max_hang: 0.0 };
    // Each corner of the cut face with a point of the face just in from
    // it, toward the face's centre.
    let mating_corners = cut
        .faces()
        .filter(|f| f.normal.dot(mating.normal) > 1.0 - 1e-9 && mating.distance(f.vertices[0]).abs() < 1e-5)
        .flat_map(|f| {
            let centre = f.vertices.iter().copied().sum::<glam::DVec3>() / f.vertices.len().max(1) as f64;
            f.vertices.iter().map(move |&p| {
                let to_centre = centre - p;
                let step = (to_centre.length() / 2.0).min(INSIDE_FACE_IN);
                (p, p + to_centre.normalize_or_zero() * step)
            })
        });
    for (p, just_in) in mating_corners {
        // Outward from the cut piece is toward the bearing piece: the
        // bearing face should be met right at the corner.
        // How far back the line runs inside the cut piece.
        let back = cut
            .parts
            .iter()
            .filter_map(|part| chord(&part.planes, p, mating.normal, tol))
            .map(|(enter, _)| enter)
            .fold(0.0, f64::min);
        let entry = near
            .iter()
            .filter_map(|part| {
                // A corner touching the part (a corner of the cut face on a
                // corner of the bearing board's, each worked out from its own
                // planes) meets it there, whatever the line square to the
                // mating face does next: it may graze a face a hair off
                // parallel to it and read as entering far along.
                let depth = part.depth_of(p);
                if depth > -TOUCH_IN {
                    return Some(-depth.max(0.0));
                }
                let (enter, exit) = chord(&part.planes, p, mating.normal, tol)?;
                if enter >= -tol {
                    // A line that only grazes the part (through a corner or
                    // along an edge of it, in and out within a touch) does
                    // not land on it: the corner hangs past the bearing
                    // face's edge (a hip's cheek running on past a king's
                    // end cut on the slant). Nor does one entering through
                    // a face turned away from the corner, which it runs
                    // nearly along: the corner is past the edge of the face
                    // it should meet, beside that other face (a hip's foot,
                    // deeper plumb than the valley top it butts against,
                    // below the valley's bottom edge, whose line runs on
                    // under the valley's bottom and enters it only where
                    // the bottom has dropped to it, an inch on).
                    let facing = entering_plane(&part.planes, p, mating.normal, tol)
                        .is_some_and(|h| h.normal.dot(mating.normal) < -FACING_COS);
                    // Nor does one running along a face of the part, the
                    // corner on that face's plane, where the cut face
                    // beside the corner lies off the part: the cut piece
                    // meets the board only along that edge (a rafter flush
                    // with one ridge's end, the corner of its face on that
                    // end, the other ridge's side beyond it).
                    let face_meets = chord(&part.planes, just_in, mating.normal, tol).is_some();
                    // Nor is a line entering one part of the bearing from
                    // inside another (across the face two halves of a
                    // seated hip share) entering its wood there: it went
                    // into the wood before, through whatever face it met
                    // first (a hip's backing, past which the corner stands
                    // above the hip's top).
                    let before = p + mating.normal * (enter - INSIDE_FACE_IN);
                    let from_wood = near
                        .iter()
                        .any(|other| !std::ptr::eq(*other, *part) && other.depth_of(before) > TOUCH_IN);
                    (facing && face_meets && !from_wood && exit - enter > TOUCH_IN).then_some(enter)
                } else if exit >= -tol {
                    // The corner is inside the part: it overlaps by its
                    // depth there. The line's entry may lie far behind,
                    // along a board that runs square to the mating face
                    // (a ridge the corner has run into from its side).
                    Some(-part.depth_of(p).max(0.0))
                } else if exit >= back - tol {
                    // The part lies behind the corner, where the cut
                    // piece also is: the piece passes through it, unless
                    // the line only runs along the part's face (a corner
                    // on the side of a board the line follows).
                    let mid = p + mating.normal * ((enter.max(back) + exit) / 2.0);
                    (part.depth_of(mid) > tol).then_some(enter)
                } else {
                    // Met only past where the line has left the cut
                    // piece: another board the piece never reaches.
                    None
                }
            })
            .min_by(|a, b| a.abs().total_cmp(&b.abs()));
        match entry {
            Some(t) => {
                fit.max_gap = fit.max_gap.max(t);
                fit.max_overlap = fit.max_overlap.max(-t);
            }
            None if bearing_top.is_some_and(|t| t.distance(p) > 0.0) => {}
            None => fit.max_hang = fit.max_hang.max(-near_depth(p)),
        }
    }
    // Only depths above the overlap so far can raise it: a part is left
    // as soon as one plane puts the corner below that (most corners lie
    // well outside most planes), and the rest are measured in full.
    // Neighbouring corners are mostly ruled out by the same plane: the
    // plane that last ruled one out is tried first.
    let mut first = 0;
    for p in cut.vertices() {
        let floor = fit.max_overlap;
        let depth = near
            .iter()
            .filter_map(|part| depth_above(part, p, floor, &mut first))
            .fold(f64::NEG_INFINITY, f64::max);
        fit.max_overlap = fit.max_overlap.max(depth);
    }
    for p in near.iter().flat_map(|part| part.vertices.iter().copied()) {
        let floor = fit.max_overlap;
        let depth = cut
            .parts
            .iter()
            .filter_map(|part| depth_above(part, p, floor, &mut first))
            .fold(f64::NEG_INFINITY, f64::max);
        fit.max_overlap = fit.max_overlap.max(depth);
    }
    fit
}

/// `part`'s depth at `p` as [`ConvexPart::depth_of`] gives it, or `None`
/// where some plane puts it below `floor`.
///
/// Leaving out a part whose depth lies below `floor` changes nothing in the
/// largest depth over parts once that is taken with `floor` itself (which
/// is how the overlap is gathered): every part left out is strictly below
/// it, so neither the larger value nor the sign of a zero can change.
///
/// Plane `first` is tried first, and set to the plane that rules `p` out;
/// whether some plane does is the same in any order, and a depth is taken
/// over every plane in the part's order, as `depth_of` takes it, so the
/// answer does not depend on `first`.
fn depth_above(part: &ConvexPart, p: glam::DVec3, floor: f64, first: &mut usize) -> Option<f64> {
    if part.planes.get(*first).is_some_and(|h| -h.distance(p) < floor) {
        return None;
    }
    let mut depth = f64::INFINITY;
    for (m, h) in part.planes.iter().enumerate() {
        let d = -h.distance(p);
        if d < floor {
            *first = m;
            return None;
        }
        depth = depth.min(d);
    }
    Some(depth)
}

/// How near a corner of a cut face must lie to a bearing part to touch it,
/// inches: a thousandth of the 1/64 in a joint may be off, and a hundred
/// times the rounding of corners worked out from planes (common practice,
/// no source).
const TOUCH_IN: f64 = 1e-5;

/// How far in from a corner of a cut face, toward the face's centre, the
/// face is probed for whether it faces a bearing part at all, inches: ten
/// times [`TOUCH_IN`], a hundred times the tolerance lines are traced with
/// (so a face the line runs along within that tolerance is left), and far
/// finer than any face a joint is cut to (common practice, no source).
const INSIDE_FACE_IN: f64 = 1e-4;

/// How far past the cut piece's box a bearing part may lie and still be
/// checked, inches.
const NEAR_IN: f64 = 1.0;

/// How squarely the face a corner's line enters a bearing part through
/// must face the corner for the way in to be a gap to close: the cosine of
/// 60 degrees between the face's outward normal and the line, reversed. A
/// face turned further away runs within 30 degrees of the line, which
/// meets it only as far on as the corner lies off it, doubled or more: not
/// a gap across the joint (common practice, no source).
const FACING_COS: f64 = 0.5;

/// The plane of `planes` through which the line `p + t u` enters their
/// convex region grown by `tol` (as [`chord`] finds it), if it does.
fn entering_plane(planes: &[HalfSpace], p: glam::DVec3, u: glam::DVec3, tol: f64) -> Option<&HalfSpace> {
    let mut enter = f64::NEG_INFINITY;
    let mut by = None;
    for h in planes {
        let nu = h.normal.dot(u);
        let room = h.offset - h.normal.dot(p) + tol;
        if nu < -1e-12 && room / nu > enter {
            enter = room / nu;
            by = Some(h);
        }
    }
    by
}

/// The corner-wise bounds of each part of a solid.
pub fn part_bounds(solid: &Solid) -> Vec<(glam::DVec3, glam::DVec3)> {
    solid.parts.iter().map(|part| bounds(part.vertices.iter().copied())).collect()
}

/// The corner-wise bounds of some points.
fn bounds(points: impl Iterator<Item = glam::DVec3>) -> (glam::DVec3, glam::DVec3) {
    points.fold((glam::DVec3::splat(f64::INFINITY), glam::DVec3::splat(f64::NEG_INFINITY)), |(lo, hi), p| {
        (lo.min(p), hi.max(p))
    })
}

/// Where the line `p + t u` enters and leaves the convex region of
/// `planes` grown by `tol` (the smallest and largest `t` inside), if it
/// passes through it.
///
/// Grown, because a plane the line runs nearly along must not stop it
/// where `p` is within `tol` of that plane: a king's top cut to a ridge's
/// side a few 1e-7 rad off square to the king (as round-off leaves a
/// ridge's end) makes such a plane for the hip cheek bearing on the king's
/// side, and a corner of that cheek 3e-7 in outside it would, read against
/// the plane itself, enter the king only where the two cross, 3/4 in on.
/// Against the grown plane it enters at the king's side face, as it should.
fn chord(planes: &[HalfSpace], p: glam::DVec3, u: glam::DVec3, tol: f64) -> Option<(f64, f64)> {
    let mut enter = f64::NEG_INFINITY;
    let mut exit = f64::INFINITY;
    for h in planes {
        let nu = h.normal.dot(u);
        // How far `p` may move along the plane's normal and stay inside.
        let room = h.offset - h.normal.dot(p) + tol;
        if nu.abs() < 1e-12 {
            if room < 0.0 {
                return None;
            }
        } else if nu > 0.0 {
            exit = exit.min(room / nu);
        } else {
            enter = enter.max(room / nu);
        }
    }
    (enter <= exit && enter.is_finite()).then_some((enter, exit))
}

#[cfg(test)]
mod tests {
    use glam::DVec3;

    use super::*;
    use crate::framing::FaceTag;

    #[test]
    fn a_plane_the_line_nearly_runs_along_does_not_stop_it_within_tolerance() {
        // A board 1.5 in thick (x from 0 to 1.5) whose end is the plane
        // y + eps (x - 0.75) <= 0, eps = 4e-7 rad off square: at x = 1.5
        // it lies 3e-7 in below y = 0. From the corner (1.5, 0, 0), 3e-7 in
        // outside it, the line along -x meets the plane itself only at
        // x = 0.75, where y + eps (x - 0.75) = 0: 0.75 in on. Within the
        // 1e-6 in tolerance the corner is on the board, and the line
        // enters at once, through the side x = 1.5. Derivation.
        let eps = 4e-7;
        let planes: Vec<HalfSpace> = [
            (DVec3::new(1.5, 0.0, 0.0), DVec3::X),
            (DVec3::ZERO, -DVec3::X),
            (DVec3::new(0.75, 0.0, 0.0), DVec3::new(eps, 1.0, 0.0)),
            (DVec3::new(0.0, -10.0, 0.0), -DVec3::Y),
            (DVec3::new(0.0, 0.0, 1.0), DVec3::Z),
            (DVec3::new(0.0, 0.0, -1.0), -DVec3::Z),
        ]
        .iter()
        .filter_map(|&(p, n)| HalfSpace::through(p, n, FaceTag::Side, None))
        .collect();
        let corner = DVec3::new(1.5, 0.0, 0.0);
        assert!((planes[2].distance(corner) - 3e-7).abs() < 1e-12);
        let (enter, exit) =
            chord(&planes, corner, -DVec3::X, 1e-6).expect("the line passes through the board");
        assert!(enter.abs() < 2e-6, "enters {enter} in on");
        assert!((exit - 1.5).abs() < 2e-6, "leaves {exit} in on");
        // 1e-3 in outside the end, the corner is off the board: the line
        // comes within the tolerance of the end plane only about
        // (1e-3 - 1e-6) / eps = 2,500 in on, far past the board's far side
        // 1.5 in on, so it misses.
        let off = corner + DVec3::Y * 1e-3;
        assert!(chord(&planes, off, -DVec3::X, 1e-6).is_none());
    }

    /// Half-spaces through each point with its outward normal.
    fn planes_of(rows: &[(DVec3, DVec3)]) -> Vec<HalfSpace> {
        rows.iter().filter_map(|&(p, n)| HalfSpace::through(p, n, FaceTag::Side, None)).collect()
    }

    /// A one-part solid of the half-spaces.
    fn solid(planes: &[HalfSpace]) -> Solid {
        Solid { parts: ConvexPart::from_half_spaces(planes).into_iter().collect() }
    }

    /// A bearing board 1.5 in thick (x 0 to 1.5, z -1 to 1) from y = -10
    /// to its end, the plane through `end_at` facing `end_normal`.
    fn board_ending_at(end_at: DVec3, end_normal: DVec3) -> Solid {
        solid(&planes_of(&[
            (DVec3::new(1.5, 0.0, 0.0), DVec3::X),
            (DVec3::ZERO, -DVec3::X),
            (end_at, end_normal),
            (DVec3::new(0.0, -10.0, 0.0), -DVec3::Y),
            (DVec3::new(0.0, 0.0, 1.0), DVec3::Z),
            (DVec3::new(0.0, 0.0, -1.0), -DVec3::Z),
        ]))
    }

    /// A piece cut to the plane x = `face` (facing -x, toward the board),
    /// running to x = 3, from y = -2 to y = `top`, z -1 to 1, and its fit
    /// on `bearing` there.
    fn fit_of_piece_cut_at(face: f64, top: f64, bearing: &Solid) -> JointFit {
        let mating = HalfSpace::through(DVec3::new(face, 0.0, 0.0), -DVec3::X, FaceTag::Cheek, None);
        let Some(mating) = mating else { panic!("the mating plane") };
        let mut planes = planes_of(&[
            (DVec3::new(3.0, 0.0, 0.0), DVec3::X),
            (DVec3::new(0.0, top, 0.0), DVec3::Y),
            (DVec3::new(0.0, -2.0, 0.0), -DVec3::Y),
            (DVec3::new(0.0, 0.0, 1.0), DVec3::Z),
            (DVec3::new(0.0, 0.0, -1.0), -DVec3::Z),
        ]);
        planes.push(mating);
        check_fit(&solid(&planes), &mating, bearing, &part_bounds(bearing), None)
    }

    #[test]
    fn a_corner_touching_the_bearing_board_a_hair_outside_its_end_reads_no_gap() {
        // The bearing board of the test above, its end y + eps (x - 0.75)
        // <= 0 now eps = 4.67e-7 rad off square, as a king's end cut to a
        // ridge a hair off square came out in seed 13610 of the long run.
        // A piece cut to its side x = 1.5 has a corner at y0, 1.3e-6 in
        // outside the end: the line along -x from it first comes within
        // the 1e-6 in tolerance of the end plane about (1.3e-6 - 1e-6) /
        // eps = 0.64 in on, and so read 0.64 in of gap. The corner touches
        // the board; the gap is nil. Derivation.
        let eps = 4.67e-7;
        let bearing = board_ending_at(DVec3::new(0.75, 0.0, 0.0), DVec3::new(eps, 1.0, 0.0));
        let y0 = -eps * 0.75 + 1.3e-6;
        assert!((bearing.depth_of(DVec3::new(1.5, y0, 1.0)) + 1.3e-6).abs() < 1e-9);
        let fit = fit_of_piece_cut_at(1.5, y0, &bearing);
        assert!(fit.max_gap < 1e-5, "gap {}", fit.max_gap);
        assert!(fit.max_overlap < 1e-5, "overlap {}", fit.max_overlap);
        // 1e-3 in short of the side, the gap is read as it is.
        let fit = fit_of_piece_cut_at(1.501, -1.0, &bearing);
        assert!((fit.max_gap - 1e-3).abs() < 2e-6, "gap {}", fit.max_gap);
    }

    #[test]
    fn a_cut_face_running_on_past_a_slanting_end_hangs_and_reads_no_gap() {
        // The bearing board (x 0 to 1.5, z -1 to 1) ends at x + y <= 1.5, a
        // 45 degree end: y = 0 at its side x = 1.5, y = 1.5 at x = 0. A piece
        // cut to its side x = 1.5 runs on from y = -2 to y = 1.5, past the
        // end. The line along -x from its corner at y = 1.5 meets the board
        // only at the board's far corner (0, 1.5), 1.5 in on, grazing it:
        // that corner hangs past the end, 1.5 / sqrt 2 = 1.061 in outside
        // the end plane, and there is no gap. Derivation (seed 13856 of the
        // long run: a hip's cheek past a king's end cut to a ridge at 45
        // degrees in plan read 1.5 in of gap).
        let bearing = board_ending_at(DVec3::new(1.5, 0.0, 0.0), DVec3::new(1.0, 1.0, 0.0));
        let fit = fit_of_piece_cut_at(1.5, 1.5, &bearing);
        assert!(fit.max_gap < 1e-5, "gap {}", fit.max_gap);
        assert!(fit.max_overlap < 1e-5, "overlap {}", fit.max_overlap);
        assert!((fit.max_hang - 1.5 / 2f64.sqrt()).abs() < 1e-5, "hang {}", fit.max_hang);
    }

    #[test]
    fn a_face_meeting_a_board_only_along_its_end_reads_no_gap() {
        // A bearing board ends at x = 0 (it lies at x <= 0, from its side
        // y = 0.5 to y = 2, z -1 to 1). A piece from x = 0 to 1.5 is cut
        // to y = 0, facing +y: its face lies beside the board's end, half
        // an inch short of the board's side. The line along +y from its
        // corner at x = 0 runs along the board's end face and enters the
        // board at its side 0.5 in on, but the face meets the board only
        // along that corner's edge: no gap, and the face's corners hang
        // (the far ones 1.5 in off the board's end). Reaching
        // 0.01 in past the end, the face does face the board's side, 0.5
        // in off. Derivation (seed 21566 of the long run: a gable-end
        // rafter flush with one ridge's end read 0.89 in of gap to the
        // side of the ridge stepping on from that end).
        let bearing = solid(&planes_of(&[
            (DVec3::ZERO, DVec3::X),
            (DVec3::new(-10.0, 0.0, 0.0), -DVec3::X),
            (DVec3::new(0.0, 0.5, 0.0), -DVec3::Y),
            (DVec3::new(0.0, 2.0, 0.0), DVec3::Y),
            (DVec3::new(0.0, 0.0, 1.0), DVec3::Z),
            (DVec3::new(0.0, 0.0, -1.0), -DVec3::Z),
        ]));
        let cut_from = |x0: f64| {
            let mating = HalfSpace::through(DVec3::ZERO, DVec3::Y, FaceTag::Plumb, None);
            let Some(mating) = mating else { panic!("the mating plane") };
            let mut planes = planes_of(&[
                (DVec3::new(x0, 0.0, 0.0), -DVec3::X),
                (DVec3::new(1.5, 0.0, 0.0), DVec3::X),
                (DVec3::new(0.0, -3.0, 0.0), -DVec3::Y),
                (DVec3::new(0.0, 0.0, 1.0), DVec3::Z),
                (DVec3::new(0.0, 0.0, -1.0), -DVec3::Z),
            ]);
            planes.push(mating);
            check_fit(&solid(&planes), &mating, &bearing, &part_bounds(&bearing), None)
        };
        let fit = cut_from(0.0);
        assert!(fit.max_gap < 1e-5, "gap {}", fit.max_gap);
        assert!(fit.max_overlap < 1e-5, "overlap {}", fit.max_overlap);
        assert!((fit.max_hang - 1.5).abs() < 1e-5, "hang {}", fit.max_hang);
        let fit = cut_from(-0.01);
        assert!((fit.max_gap - 0.5).abs() < 1e-5, "gap {}", fit.max_gap);
    }

    #[test]
    fn a_line_crossing_from_one_part_of_the_bearing_into_the_next_is_no_gap() {
        // A backed bearing board in two halves, x from -1.5 to 0, split on
        // its centre line x = -0.75 and each half's top falling from 1.05
        // there to 0.9 at its side (z = 0.9 - 0.2 x on the near half,
        // z = 1.2 + 0.2 x on the far one), its bottom z = -1. A piece
        // beside it (x 0 to 1.5, y 0 to 1, z -1 to 1) is cut to its side
        // x = 0: its top corners stand 0.1 in above the near half's side.
        // The line along -x from one runs into the near half through its
        // top 0.5 in on (a face turned 79 degrees from it: no gap there)
        // and on, inside that half, into the far one at the centre line
        // 0.75 in on. That is no way into the board's wood: no gap, the
        // lower corners on the side. With the near half gone the far
        // half's face 0.75 in off is a gap. Derivation (seed 3808 of the
        // long run: a valley's top cut to a backed hip's side read the
        // half's 0.75 in thickness).
        let half = |near: bool| {
            let (lo, hi) = if near { (-0.75, 0.0) } else { (-1.5, -0.75) };
            let top = if near {
                (DVec3::new(0.0, 0.0, 0.9), DVec3::new(0.2, 0.0, 1.0))
            } else {
                (DVec3::new(-1.5, 0.0, 0.9), DVec3::new(-0.2, 0.0, 1.0))
            };
            ConvexPart::from_half_spaces(&planes_of(&[
                (DVec3::new(hi, 0.0, 0.0), DVec3::X),
                (DVec3::new(lo, 0.0, 0.0), -DVec3::X),
                (DVec3::new(0.0, 2.0, 0.0), DVec3::Y),
                (DVec3::new(0.0, -1.0, 0.0), -DVec3::Y),
                top,
                (DVec3::new(0.0, 0.0, -1.0), -DVec3::Z),
            ]))
        };
        let mating = HalfSpace::through(DVec3::ZERO, -DVec3::X, FaceTag::Cheek, None);
        let Some(mating) = mating else { panic!("the mating plane") };
        let mut planes = planes_of(&[
            (DVec3::new(1.5, 0.0, 0.0), DVec3::X),
            (DVec3::new(0.0, 1.0, 0.0), DVec3::Y),
            (DVec3::ZERO, -DVec3::Y),
            (DVec3::new(0.0, 0.0, 1.0), DVec3::Z),
            (DVec3::new(0.0, 0.0, -1.0), -DVec3::Z),
        ]);
        planes.push(mating);
        let cut = solid(&planes);
        let both = Solid { parts: [half(true), half(false)].into_iter().flatten().collect() };
        assert_eq!(both.parts.len(), 2);
        let fit = check_fit(&cut, &mating, &both, &part_bounds(&both), None);
        assert!(fit.max_gap < 1e-5, "gap {}", fit.max_gap);
        assert!(fit.max_overlap < 1e-5, "overlap {}", fit.max_overlap);
        let far = Solid { parts: half(false).into_iter().collect() };
        let fit = check_fit(&cut, &mating, &far, &part_bounds(&far), None);
        assert!((fit.max_gap - 0.75).abs() < 1e-5, "gap {}", fit.max_gap);
    }

    #[test]
    fn a_corner_below_the_bearing_boards_sloping_bottom_hangs_and_reads_no_gap() {
        // A bearing board with its end face x = 1.5 (x from -10 to 1.5, y
        // -2 to 2, top z = 1), its bottom z = -1 + 0.1 (x - 1.5) dropping
        // 1 in 10 away from the end. A piece cut to the end (x 1.5 to 3,
        // y -1 to 1) reaches 0.05 in lower, to z = -1.05: its lower corners
        // are past the end face's bottom edge. The line along -x from one
        // runs under the bottom and enters it 0.5 in on, where the bottom
        // has dropped 0.05 in, through a face turned 84 degrees from the
        // corner. That is no gap across the joint: those corners hang,
        // 0.05 / sqrt(1.01) = 0.0498 in outside the bottom, and the upper
        // ones, on the end face, touch it. Derivation (seed 36779 of the
        // long run: a hip's foot deeper plumb than the valley top it butts
        // against read 1.02 in of gap).
        let slope = 0.1;
        let bearing = solid(&planes_of(&[
            (DVec3::new(1.5, 0.0, 0.0), DVec3::X),
            (DVec3::new(-10.0, 0.0, 0.0), -DVec3::X),
            (DVec3::new(0.0, 2.0, 0.0), DVec3::Y),
            (DVec3::new(0.0, -2.0, 0.0), -DVec3::Y),
            (DVec3::new(0.0, 0.0, 1.0), DVec3::Z),
            (DVec3::new(1.5, 0.0, -1.0), DVec3::new(slope, 0.0, -1.0)),
        ]));
        let cut_at = |face: f64, bottom: f64| {
            let mating = HalfSpace::through(DVec3::new(face, 0.0, 0.0), -DVec3::X, FaceTag::Plumb, None);
            let Some(mating) = mating else { panic!("the mating plane") };
            let mut planes = planes_of(&[
                (DVec3::new(3.0, 0.0, 0.0), DVec3::X),
                (DVec3::new(0.0, 1.0, 0.0), DVec3::Y),
                (DVec3::new(0.0, -1.0, 0.0), -DVec3::Y),
                (DVec3::new(0.0, 0.0, 1.0), DVec3::Z),
                (DVec3::new(0.0, 0.0, bottom), -DVec3::Z),
            ]);
            planes.push(mating);
            check_fit(&solid(&planes), &mating, &bearing, &part_bounds(&bearing), None)
        };
        let fit = cut_at(1.5, -1.05);
        assert!(fit.max_gap < 1e-5, "gap {}", fit.max_gap);
        assert!(fit.max_overlap < 1e-5, "overlap {}", fit.max_overlap);
        assert!((fit.max_hang - 0.05 / 1.01f64.sqrt()).abs() < 1e-5, "hang {}", fit.max_hang);
        // Cut 0.01 in short of the end, within its depth, the piece's face
        // is read 0.01 in off it where it faces it.
        let fit = cut_at(1.51, -0.9);
        assert!((fit.max_gap - 0.01).abs() < 2e-6, "gap {}", fit.max_gap);
    }
}
