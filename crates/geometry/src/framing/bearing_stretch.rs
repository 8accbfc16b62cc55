//! Whether a jack's cheek lands where its hip or valley is still whole.
//!
//! A hip or valley is cut back at its ends (against a ridge's side where a
//! hip starts on the roof, against the kings or the other hips at its top,
//! against the ridges at a valley's top) and notched over the plate at a
//! seated foot. A jack laid so close to such an end that part of its cheek
//! falls where the member has been cut away has nothing to bear on there:
//! it is left out of the layout, as lines crowding a wall corner are.

use glam::DVec3;

use super::board::{PieceSpec, SeatWall};
use super::{CutEnd, FaceTag, HalfSpace, Solid};

/// How far (inches) a cheek corner may stand past a cut end or into a
/// seat notch and still count as bearing: round-off only.
const LAND_TOL_IN: f64 = 1e-6;

/// Whether every corner of `cut`'s face in the plane `mating` lies on the
/// part of `bearing` that its end cuts and seat notch leave whole.
pub fn lands_on_bearing(cut: &Solid, mating: &HalfSpace, bearing: &PieceSpec) -> bool {
    let end_cuts: Vec<&HalfSpace> = bearing
        .upper_cuts
        .iter()
        .chain(&bearing.lower_cuts)
        .filter(|h| {
            matches!(h.end, Some(CutEnd::Top | CutEnd::Bottom))
                && matches!(h.tag, FaceTag::Cheek | FaceTag::Plumb)
                && h.normal.z.abs() < 1e-9
        })
        .collect();
    let mut any = false;
    for p in mating_corners(cut, mating) {
        any = true;
        if end_cuts.iter().any(|h| h.distance(p) > LAND_TOL_IN)
            || in_seat_notch(bearing, p)
            || past_cut_wall_line(bearing, p)
        {
            return false;
        }
    }
    any
}

/// Whether some corner of `cut`'s face in the plane `mating` lies outside
/// the wall line along which `bearing`, a hip or valley with no tail, is
/// cut (see [`past_cut_wall_line`]).
pub fn cheek_past_cut_wall_line(cut: &Solid, mating: &HalfSpace, bearing: &PieceSpec) -> bool {
    mating_corners(cut, mating).any(|p| past_cut_wall_line(bearing, p))
}

/// The corners of `cut`'s faces lying in the plane `mating`.
fn mating_corners<'a>(cut: &'a Solid, mating: &'a HalfSpace) -> impl Iterator<Item = DVec3> + 'a {
    cut.faces()
        .filter(|f| f.normal.dot(mating.normal) > 1.0 - 1e-9 && mating.distance(f.vertices[0]).abs() < 1e-5)
        .flat_map(|f| f.vertices.iter().copied())
}

/// The wall a seated member bears on at `p`: its one wall, or the wall
/// under the half of the member (left or right of its centre line) that
/// `p` lies on.
fn seat_wall_at(bearing: &PieceSpec, p: DVec3) -> Option<&SeatWall> {
    let fr = &bearing.frame;
    match bearing.seat.as_slice() {
        [one] => Some(one),
        [left, right] => Some(if (p - fr.origin).dot(fr.side) >= 0.0 { left } else { right }),
        _ => None,
    }
}

/// Whether `p` lies past the wall line of a seated member with no tail:
/// such a hip or valley (a side with no overhang) is cut plumb along its
/// wall lines, and nothing of it is left outside them. A jack of the other
/// side, whose tail runs out over that side's overhang, has nothing to
/// bear on where its cheek falls out there: a hip running along its wall
/// a hair inside the wall line, where walls meet nearly in line, leaves
/// jacks that are only tails, their cheeks wholly outside the wall line.
fn past_cut_wall_line(bearing: &PieceSpec, p: DVec3) -> bool {
    !bearing.has_tail && seat_wall_at(bearing, p).is_some_and(|wall| wall.inside.distance(p) > LAND_TOL_IN)
}

/// Whether `p` lies where a seated member is notched: below the plate's
/// top, inside the wall line, short of the plate's inner face, on the
/// half of the member seated on that wall.
fn in_seat_notch(bearing: &PieceSpec, p: DVec3) -> bool {
    if p.z >= -LAND_TOL_IN {
        return false;
    }
    let Some(wall) = seat_wall_at(bearing, p) else {
        return false;
    };
    let Some(plate) = wall.plate_inner else {
        return false;
    };
    wall.inside.distance(p) < -LAND_TOL_IN && plate.distance(p) > LAND_TOL_IN
}
