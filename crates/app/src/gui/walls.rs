//! The house walls as solids: each ring of the outline stood up to the
//! wall height, its outside face on the wall line.

use glam::{DVec2, DVec3};
use pitchframe_geometry::{Outline, Wall};

use super::triangles::Triangles;

/// Walls stood on every ring of the outline: outside face on the wall line,
/// inside face `thickness` in, tops level at `height`.
pub fn wall_triangles(outline: &Outline, height_in: f64, thickness_in: f64) -> Triangles {
    let mut triangles = Triangles::default();
    let corners = |ring: &[Wall]| ring.iter().map(|wall| wall.corner).collect::<Vec<_>>();
    // The building lies inside the outer ring and outside each courtyard
    // ring; each ring is turned so the building is on its left.
    let mut outer = corners(outline.outer());
    if signed_area(&outer) < 0.0 {
        outer.reverse();
    }
    add_ring(&mut triangles, &outer, height_in, thickness_in);
    for ring in outline.courtyards() {
        let mut ring = corners(ring);
        if signed_area(&ring) > 0.0 {
            ring.reverse();
        }
        add_ring(&mut triangles, &ring, height_in, thickness_in);
    }
    triangles
}

/// The signed area of a ring, positive when counter-clockwise.
fn signed_area(ring: &[DVec2]) -> f64 {
    let count = ring.len();
    (0..count).map(|i| ring[i].perp_dot(ring[(i + 1) % count])).sum::<f64>() / 2.0
}

/// One closed ring of wall whose building side is on the ring's left.
fn add_ring(triangles: &mut Triangles, outer: &[DVec2], height_in: f64, thickness_in: f64) {
    let Some(inner) = inset_ring(outer, thickness_in) else {
        return;
    };
    let up = DVec3::Z * height_in;
    let count = outer.len();
    for i in 0..count {
        let j = (i + 1) % count;
        let (o0, o1) = (outer[i].extend(0.0), outer[j].extend(0.0));
        let (i0, i1) = (inner[i].extend(0.0), inner[j].extend(0.0));
        // Outside face, seen from outside: bottom left to right, then up.
        triangles.push_quad(o0, o1, o1 + up, o0 + up);
        // Inside face, seen from the room.
        triangles.push_quad(i1, i0, i0 + up, i1 + up);
        // Top of the wall.
        triangles.push_quad(o0 + up, o1 + up, i1 + up, i0 + up);
    }
}

/// The ring offset `inset_in` to the left of each edge, corners mitred.
/// `None` when two neighbouring edges fold back on each other (no mitre).
fn inset_ring(ring: &[DVec2], inset_in: f64) -> Option<Vec<DVec2>> {
    let count = ring.len();
    let left_normal = |from: DVec2, to: DVec2| (to - from).normalize_or_zero().perp();
    (0..count)
        .map(|i| {
            let prev = ring[(i + count - 1) % count];
            let here = ring[i];
            let next = ring[(i + 1) % count];
            let n_in = left_normal(prev, here);
            let n_out = left_normal(here, next);
            // The mitre point lies inset from both edges: p . n_k = inset
            // for both normals, solved as p = inset (n1 + n2) / (1 + n1.n2).
            let denominator = 1.0 + n_in.dot(n_out);
            (denominator > 1e-9).then(|| here + inset_in * (n_in + n_out) / denominator)
        })
        .collect()
}

#[cfg(test)]
mod tests {
    use approx::assert_abs_diff_eq;

    use super::*;

    #[test]
    fn inset_of_a_square_is_a_smaller_square() {
        let square =
            [DVec2::new(0.0, 0.0), DVec2::new(10.0, 0.0), DVec2::new(10.0, 10.0), DVec2::new(0.0, 10.0)];
        let inner = inset_ring(&square, 1.0).unwrap();
        // Derivation: a counter-clockwise square inset by 1 on every side.
        assert_abs_diff_eq!(inner[0].x, 1.0, epsilon = 1e-12);
        assert_abs_diff_eq!(inner[0].y, 1.0, epsilon = 1e-12);
        assert_abs_diff_eq!(inner[2].x, 9.0, epsilon = 1e-12);
        assert_abs_diff_eq!(inner[2].y, 9.0, epsilon = 1e-12);
    }

    #[test]
    fn a_courtyard_wall_stands_on_the_building_side_of_its_line() {
        use pitchframe_geometry::WallRoof;
        let ring = |corners: &[(f64, f64)]| {
            corners
                .iter()
                .map(|&(x, y)| Wall {
                    corner: DVec2::new(x, y),
                    roof: WallRoof::Pitched { rise_per_run: 0.5 },
                    overhang_in: 0.0,
                })
                .collect::<Vec<_>>()
        };
        let outer = ring(&[(0.0, 0.0), (200.0, 0.0), (200.0, 200.0), (0.0, 200.0)]);
        // Given clockwise, as a courtyard usually is; either way must work.
        let court = ring(&[(50.0, 50.0), (50.0, 150.0), (150.0, 150.0), (150.0, 50.0)]);
        let outline = Outline::new(outer, vec![court]).unwrap();
        let walls = wall_triangles(&outline, 96.0, 6.0);
        let top_area: f64 = walls
            .corners
            .chunks(3)
            .zip(&walls.normals)
            .filter(|(_, n)| n.z > 0.5)
            .map(|(c, _)| (c[1] - c[0]).cross(c[2] - c[0]).length() / 2.0)
            .sum();
        // Derivation: the outer band is P t - 4 t^2 = 800 x 6 - 144; the
        // courtyard's band lies outside its line, P t + 4 t^2 = 400 x 6 + 144.
        assert_abs_diff_eq!(top_area, (4800.0 - 144.0) + (2400.0 + 144.0), epsilon = 1e-6);
        // No wall top reaches into the open courtyard.
        let inside_court =
            |p: &DVec3| p.x > 50.0 + 1e-9 && p.x < 150.0 - 1e-9 && p.y > 50.0 + 1e-9 && p.y < 150.0 - 1e-9;
        assert!(!walls.corners.iter().any(inside_court));
    }
}
