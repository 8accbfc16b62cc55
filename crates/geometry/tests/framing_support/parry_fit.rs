//! Joint fits measured by parry3d on the pieces' solids, apart from the
//! framing code's own joint check.

use parry3d_f64::math::{Pose, Vector};
use parry3d_f64::query::{Ray, RayCast, contact};
use parry3d_f64::shape::ConvexPolyhedron;
use pitchframe_geometry::framing::{FaceTag, Frame, MemberKind, PlacedPiece};

fn v(p: glam::DVec3) -> Vector {
    Vector::new(p.x, p.y, p.z)
}

fn hulls(piece: &PlacedPiece) -> Vec<ConvexPolyhedron> {
    try_hulls(piece).unwrap_or_else(|| panic!("{} part is not a hull", piece.label))
}

/// Each part's hull, or `None` where parry cannot make one (a wedge
/// thinner than its round-off, beside a wall a hair out of line).
fn try_hulls(piece: &PlacedPiece) -> Option<Vec<ConvexPolyhedron>> {
    piece
        .solid
        .parts
        .iter()
        .map(|part| {
            let pts: Vec<Vector> = part.vertices.iter().map(|p| v(*p)).collect();
            ConvexPolyhedron::from_convex_hull(&pts)
        })
        .collect()
}

/// Whether parry can make a hull of every part of both pieces, so that
/// [`fit`] can measure their joint.
pub fn measurable(frame: &Frame, cut: usize, bearing: usize) -> bool {
    try_hulls(&frame.pieces[cut]).is_some() && try_hulls(&frame.pieces[bearing]).is_some()
}

/// Largest gap and overlap of one joint, and how many mating faces were
/// found, measured by parry: overlap by contact depth between every pair
/// of convex parts; gap by casting from points just inside each corner of the cut
/// piece's end faces along the face normal onto the bearing piece.
pub fn fit(frame: &Frame, cut: usize, bearing: usize) -> (f64, f64, usize) {
    let a = &frame.pieces[cut];
    // A rafter on a ridge splice bears on both ridge pieces.
    let bearing_pieces: Vec<&PlacedPiece> =
        if frame.pieces[bearing].kind == MemberKind::Ridge && a.kind != MemberKind::Ridge {
            frame.pieces.iter().filter(|p| p.kind == MemberKind::Ridge).collect()
        } else {
            vec![&frame.pieces[bearing]]
        };
    let ha = hulls(a);
    let hb: Vec<ConvexPolyhedron> = bearing_pieces.iter().flat_map(|p| hulls(p)).collect();
    let id = Pose::identity();
    let mut overlap: f64 = 0.0;
    for x in &ha {
        for y in &hb {
            if let Ok(Some(c)) = contact(&id, x, &id, y, 0.0) {
                overlap = overlap.max(-c.dist);
            }
        }
    }
    let mut gap: f64 = 0.0;
    let mut mating = 0;
    let back = 0.05;
    for face in a.solid.faces().filter(|f| matches!(f.tag, FaceTag::Plumb | FaceTag::Cheek | FaceTag::End)) {
        let mut hit_any = false;
        // Corners of a flush cut graze the bearing piece's edges, where a
        // ray may slip past: sample just inside the face instead.
        let centre = face.vertices.iter().copied().sum::<glam::DVec3>() / face.vertices.len() as f64;
        let samples: Vec<glam::DVec3> = std::iter::once(centre)
            .chain(face.vertices.iter().map(|p| centre + (*p - centre) * 0.98))
            .collect();
        for p in &samples {
            let ray = Ray::new(v(*p - face.normal * back), v(face.normal));
            let toi =
                hb.iter().filter_map(|h| h.cast_ray(&id, &ray, 0.2, false)).fold(f64::INFINITY, f64::min);
            if toi.is_finite() {
                hit_any = true;
                // A corner on an edge of the bearing piece grazes it at the
                // start; interpenetration is measured by contact above.
                gap = gap.max(toi - back);
            }
        }
        if hit_any {
            mating += 1;
        }
    }
    (gap, overlap, mating)
}

/// The deepest interpenetration between any two pieces of a frame, with
/// their labels, measured by parry contact between their convex parts.
pub fn worst_interference(frame: &Frame) -> (f64, String, String) {
    worst_interference_except(frame, |_, _| false)
}

/// As [`worst_interference`], leaving out the pairs of pieces `skip`
/// names (by index). Panics where parry cannot hull a part.
pub fn worst_interference_except(
    frame: &Frame,
    skip: impl Fn(usize, usize) -> bool,
) -> (f64, String, String) {
    let (depth, a, b, unhulled) = interference_where_measurable(frame, skip);
    if let Some(label) = unhulled.first() {
        panic!("{label} part is not a hull");
    }
    (depth, a, b)
}

/// The deepest interpenetration between any two pieces of a frame (but
/// the pairs `skip` names), with their labels, over the parts parry can
/// hull, and the labels of pieces with a part it cannot (a wedge thinner
/// than its round-off, beside a wall a hair out of line), left out.
pub fn interference_where_measurable(
    frame: &Frame,
    skip: impl Fn(usize, usize) -> bool,
) -> (f64, String, String, Vec<String>) {
    let id = Pose::identity();
    let mut unhulled = Vec::new();
    let hulls: Vec<Vec<(ConvexPolyhedron, glam::DVec3, glam::DVec3)>> = frame
        .pieces
        .iter()
        .map(|p| {
            let bounded = p.solid.parts.iter().filter_map(|part| {
                let pts: Vec<Vector> = part.vertices.iter().map(|x| v(*x)).collect();
                let hull = ConvexPolyhedron::from_convex_hull(&pts);
                if hull.is_none() {
                    unhulled.push(p.label.clone());
                }
                let lo =
                    part.vertices.iter().copied().fold(glam::DVec3::splat(f64::INFINITY), glam::DVec3::min);
                let hi = part
                    .vertices
                    .iter()
                    .copied()
                    .fold(glam::DVec3::splat(f64::NEG_INFINITY), glam::DVec3::max);
                Some((hull?, lo, hi))
            });
            bounded.collect()
        })
        .collect();
    let mut worst = (0.0, String::new(), String::new());
    for i in 0..hulls.len() {
        for j in i + 1..hulls.len() {
            if skip(i, j) {
                continue;
            }
            for (a, alo, ahi) in &hulls[i] {
                for (b, blo, bhi) in &hulls[j] {
                    if alo.cmpgt(*bhi).any() || blo.cmpgt(*ahi).any() {
                        continue;
                    }
                    if let Ok(Some(c)) = contact(&id, a, &id, b, 0.0)
                        && -c.dist > worst.0
                    {
                        worst = (-c.dist, frame.pieces[i].label.clone(), frame.pieces[j].label.clone());
                    }
                }
            }
        }
    }
    (worst.0, worst.1, worst.2, unhulled)
}
