//! Whether a jack's cheek lands where its hip or valley is still whole.
//!
//! A hip or valley is cut back at its ends (against a ridge's side where a
//! hip starts on the roof, against the kings or the other hips at its top,
//! against the ridges at a valley's top) and notched over the plate at a
//! seated foot. A jack laid so close to such an end that part of its cheek
//! falls where the member has been cut away has nothing to bear on there:
//! it is left out of the layout, as lines crowding a wall corner are.

use glam::DVec3;

use super::board::PieceSpec;
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
    let corners = cut
        .faces()
        .filter(|f| f.normal.dot(mating.normal) > 1.0 - 1e-9 && mating.distance(f.vertices[0]).abs() < 1e-5)
        .flat_map(|f| f.vertices.iter().copied());
    let mut any = false;
    for p in corners {
        any = true;
        if end_cuts.iter().any(|h| h.distance(p) > LAND_TOL_IN) || in_seat_notch(bearing, p) {
            return false;
        }
    }
    any
}

/// Whether `p` lies where a seated member is notched: below the plate's
/// top, inside the wall line, short of the plate's inner face, on the
/// half of the member seated on that wall.
fn in_seat_notch(bearing: &PieceSpec, p: DVec3) -> bool {
    if p.z >= -LAND_TOL_IN {
        return false;
    }
    let fr = &bearing.frame;
    let wall = match bearing.seat.as_slice() {
        [] => return false,
        [one] => one,
        [left, right] => {
            if (p - fr.origin).dot(fr.side) >= 0.0 {
                left
            } else {
                right
            }
        }
        _ => return false,
    };
    let Some(plate) = wall.plate_inner else {
        return false;
    };
    wall.inside.distance(p) < -LAND_TOL_IN && plate.distance(p) > LAND_TOL_IN
}
