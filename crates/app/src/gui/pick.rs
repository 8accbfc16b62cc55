//! Picking: which drawn part a click lands on, by a ray against the
//! scene's triangles.

use glam::DVec3;

use super::camera::Ray;
use super::scene::{PartKind, Scene, Triangles};

/// Where a ray first meets a framing piece.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Hit {
    /// Index of the piece hit, in [`Scene::pieces`].
    pub piece: usize,
    /// Index of the triangle hit within that piece.
    pub triangle: usize,
    /// Distance from the ray's origin, in inches.
    pub distance_in: f64,
}

/// The nearest framing piece the ray meets, if any, unless a wall stands
/// in front of it.
pub fn pick(scene: &Scene, ray: &Ray) -> Option<Hit> {
    let hit = scene
        .pieces
        .iter()
        .enumerate()
        .filter_map(|(piece, scene_piece)| {
            nearest_triangle(&scene_piece.triangles, ray).map(|(triangle, distance_in)| Hit {
                piece,
                triangle,
                distance_in,
            })
        })
        .min_by(|a, b| a.distance_in.total_cmp(&b.distance_in))?;
    let wall_in_front = scene
        .parts
        .iter()
        .filter(|part| part.kind == PartKind::Walls)
        .filter_map(|part| nearest_triangle(&part.triangles, ray))
        .any(|(_, distance_in)| distance_in < hit.distance_in);
    (!wall_in_front).then_some(hit)
}

/// The nearest triangle the ray meets, with its distance.
fn nearest_triangle(triangles: &Triangles, ray: &Ray) -> Option<(usize, f64)> {
    triangles
        .corners
        .chunks_exact(3)
        .enumerate()
        .filter_map(|(index, corners)| match corners {
            [a, b, c] => ray_triangle(ray, *a, *b, *c).map(|distance| (index, distance)),
            _ => None,
        })
        .min_by(|a, b| a.1.total_cmp(&b.1))
}

/// Distance along the ray to the triangle `a b c` (either side), by the
/// Moller-Trumbore method: solve origin + t dir = a + u (b - a) + v (c - a).
fn ray_triangle(ray: &Ray, a: DVec3, b: DVec3, c: DVec3) -> Option<f64> {
    let edge1 = b - a;
    let edge2 = c - a;
    let p = ray.direction.cross(edge2);
    let determinant = edge1.dot(p);
    // A ray in the triangle's plane (or a degenerate triangle) meets no area.
    if determinant.abs() < 1e-12 * edge1.length() * edge2.length() {
        return None;
    }
    let to_origin = ray.origin - a;
    let u = to_origin.dot(p) / determinant;
    if !(0.0..=1.0).contains(&u) {
        return None;
    }
    let q = to_origin.cross(edge1);
    let v = ray.direction.dot(q) / determinant;
    if v < 0.0 || u + v > 1.0 {
        return None;
    }
    let t = edge2.dot(q) / determinant;
    (t > 0.0).then_some(t)
}

#[cfg(test)]
mod tests {
    use approx::assert_abs_diff_eq;
    use glam::DVec2;

    use super::*;

    fn down_from(x: f64, y: f64) -> Ray {
        Ray { origin: DVec3::new(x, y, 100.0), direction: DVec3::NEG_Z }
    }

    #[test]
    fn ray_meets_a_triangle_inside_and_misses_outside() {
        let (a, b, c) = (DVec3::ZERO, DVec3::X * 10.0, DVec3::Y * 10.0);
        // Derivation: the triangle lies in z = 0, 100 below the origin.
        assert_abs_diff_eq!(ray_triangle(&down_from(2.0, 2.0), a, b, c).unwrap(), 100.0, epsilon = 1e-12);
        assert_eq!(ray_triangle(&down_from(6.0, 6.0), a, b, c), None);
        // Behind the origin does not count.
        let up = Ray { origin: DVec3::new(2.0, 2.0, 100.0), direction: DVec3::Z };
        assert_eq!(ray_triangle(&up, a, b, c), None);
    }

    /// A scene holding two level boxes, one above the other, as pieces.
    fn two_boxes() -> Scene {
        use pitchframe_geometry::MemberKind;
        use pitchframe_geometry::framing::FaceTag;

        use super::super::scene::ScenePiece;
        let boxed = |label: &str, z: f64| {
            let mut triangles = Triangles::default();
            let (lo, hi) = (DVec3::new(0.0, 0.0, z), DVec3::new(10.0, 1.5, z + 5.5));
            triangles.corners = [
                [lo, DVec3::new(hi.x, lo.y, lo.z), DVec3::new(hi.x, hi.y, lo.z)],
                [DVec3::new(lo.x, lo.y, hi.z), DVec3::new(hi.x, lo.y, hi.z), hi],
                [DVec3::new(lo.x, lo.y, hi.z), hi, DVec3::new(lo.x, hi.y, hi.z)],
            ]
            .concat();
            triangles.normals = vec![DVec3::NEG_Z, DVec3::Z, DVec3::Z];
            ScenePiece {
                label: label.to_owned(),
                kind: MemberKind::Common,
                triangles,
                face_tags: vec![FaceTag::Bottom, FaceTag::Top, FaceTag::Top],
                label_at: hi,
            }
        };
        let mut scene = Scene::empty();
        scene.pieces = vec![boxed("LOW", 0.0), boxed("HIGH", 20.0)];
        scene.max = DVec3::ONE;
        scene
    }

    #[test]
    fn pick_takes_the_nearest_piece_along_the_ray() {
        let scene = two_boxes();
        let hit = pick(&scene, &down_from(5.0, 0.5)).unwrap();
        assert_eq!(scene.pieces[hit.piece].label, "HIGH");
        // Derivation: the upper box's top is at z = 25.5, the ray starts at 100.
        assert_abs_diff_eq!(hit.distance_in, 74.5, epsilon = 1e-9);
        // Beside both boxes there is nothing to pick.
        assert_eq!(pick(&scene, &down_from(20.0, 0.5)), None);
    }

    #[test]
    fn a_wall_in_front_of_a_piece_blocks_the_pick() {
        use super::super::scene::ScenePart;
        let mut scene = two_boxes();
        // A level sheet above both boxes, standing in for a wall face.
        let wall = Triangles {
            corners: vec![
                DVec3::new(-5.0, -5.0, 50.0),
                DVec3::new(20.0, -5.0, 50.0),
                DVec3::new(-5.0, 20.0, 50.0),
            ],
            normals: vec![DVec3::Z],
        };
        scene.parts.push(ScenePart { kind: PartKind::Walls, triangles: wall });
        assert_eq!(pick(&scene, &down_from(5.0, 0.5)), None);
    }

    #[test]
    fn clicking_a_demo_member_where_its_label_sits_picks_that_member() {
        use super::super::ViewPreset;
        use super::super::camera::OrbitCamera;
        let outline = pitchframe_geometry::demo_plan().unwrap().outline().unwrap();
        let scene = Scene::build(&outline, Some(&Default::default()), 96.0, 6.0);
        assert!(scene.pieces.len() > 50, "the demo frame has {} pieces", scene.pieces.len());
        let camera = OrbitCamera::framing(scene.min, scene.max, ViewPreset::Top);
        let size = DVec2::new(1000.0, 800.0);
        let picked_itself = scene
            .pieces
            .iter()
            .enumerate()
            .filter(|(index, piece)| {
                let at = camera.project(piece.label_at, size).unwrap();
                pick(&scene, &camera.ray(at, size))
                    .is_some_and(|hit| hit.piece == *index || scene.pieces[hit.piece].label == piece.label)
            })
            .count();
        // From straight above, a member's top edge is only hidden where
        // another member crosses over it; walls never cover it.
        assert!(
            picked_itself * 10 >= scene.pieces.len() * 9,
            "only {picked_itself} of {} members pick themselves from above",
            scene.pieces.len()
        );
    }
}
