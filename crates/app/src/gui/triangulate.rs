//! Cuts a flat polygon (a roof plane, a gable, a member face) into
//! triangles for drawing, by ear clipping.

use glam::{DVec2, DVec3};

/// Triangles covering the flat simple polygon `points`, as index triples
/// into it, each wound the same way as the polygon. Empty when the
/// polygon has no area.
pub fn triangulate(points: &[DVec3]) -> Vec<[usize; 3]> {
    let normal = newell_normal(points);
    if normal.length_squared() <= f64::EPSILON * f64::EPSILON {
        return Vec::new();
    }
    // In a basis (u, v) of the plane with u x v along the polygon's own
    // normal, the polygon always runs counter-clockwise, and triangles
    // clipped counter-clockwise there keep the polygon's winding in 3D.
    let normal = normal.normalize();
    let u = normal.any_orthonormal_vector();
    let v = normal.cross(u);
    let flat: Vec<DVec2> = points.iter().map(|p| DVec2::new(p.dot(u), p.dot(v))).collect();
    let mut remaining: Vec<usize> = (0..points.len()).collect();
    let mut triangles = Vec::with_capacity(points.len().saturating_sub(2));
    let mut misses = 0;
    let mut i = 0;
    while remaining.len() > 3 {
        let count = remaining.len();
        let (prev, here, next) =
            (remaining[(i + count - 1) % count], remaining[i % count], remaining[(i + 1) % count]);
        if is_ear(&flat, &remaining, prev, here, next) {
            triangles.push([prev, here, next]);
            remaining.remove(i % count);
            misses = 0;
        } else {
            i += 1;
            misses += 1;
            // A full lap without an ear means the polygon is not simple
            // (or is numerically degenerate): draw what was found.
            if misses > count {
                break;
            }
        }
        i %= remaining.len().max(1);
    }
    if let [a, b, c] = remaining[..] {
        triangles.push([a, b, c]);
    }
    triangles
}

/// The polygon's area vector (Newell's method): normal times twice the area.
pub fn newell_normal(points: &[DVec3]) -> DVec3 {
    let count = points.len();
    (0..count).map(|i| points[i].cross(points[(i + 1) % count])).sum()
}

/// Whether `prev here next` is a convex corner with no other vertex inside.
fn is_ear(flat: &[DVec2], ring: &[usize], prev: usize, here: usize, next: usize) -> bool {
    let (a, b, c) = (flat[prev], flat[here], flat[next]);
    if (b - a).perp_dot(c - b) <= 0.0 {
        return false;
    }
    ring.iter()
        .filter(|&&k| k != prev && k != here && k != next)
        .all(|&k| !inside_triangle(flat[k], a, b, c) || flat[k] == a || flat[k] == b || flat[k] == c)
}

fn inside_triangle(p: DVec2, a: DVec2, b: DVec2, c: DVec2) -> bool {
    (b - a).perp_dot(p - a) >= 0.0 && (c - b).perp_dot(p - b) >= 0.0 && (a - c).perp_dot(p - c) >= 0.0
}

#[cfg(test)]
mod tests {
    use approx::assert_abs_diff_eq;

    use super::*;

    fn area(points: &[DVec3], triangles: &[[usize; 3]]) -> f64 {
        triangles
            .iter()
            .map(|&[a, b, c]| (points[b] - points[a]).cross(points[c] - points[a]).length() / 2.0)
            .sum()
    }

    #[test]
    fn an_l_shape_is_covered_exactly_and_keeps_its_winding() {
        let ft = |x: f64, y: f64| DVec3::new(x, y, 0.0);
        let l = [ft(0.0, 0.0), ft(40.0, 0.0), ft(40.0, 24.0), ft(16.0, 24.0), ft(16.0, 38.0), ft(0.0, 38.0)];
        let triangles = triangulate(&l);
        assert_eq!(triangles.len(), 4);
        // Derivation: 40 x 24 + 16 x 14.
        assert_abs_diff_eq!(area(&l, &triangles), 960.0 + 224.0, epsilon = 1e-9);
        for &[a, b, c] in &triangles {
            assert!((l[b] - l[a]).cross(l[c] - l[a]).z > 0.0, "triangle turned over");
        }
    }

    #[test]
    fn a_sloped_and_a_vertical_polygon_both_triangulate() {
        // A hip-roof end triangle rising at 6 in 12 and a vertical gable.
        let sloped = [DVec3::new(0.0, 0.0, 0.0), DVec3::new(288.0, 0.0, 0.0), DVec3::new(144.0, 144.0, 72.0)];
        assert_eq!(triangulate(&sloped).len(), 1);
        let gable = [DVec3::new(0.0, 0.0, 0.0), DVec3::new(0.0, 288.0, 0.0), DVec3::new(0.0, 144.0, 72.0)];
        let triangles = triangulate(&gable);
        // Derivation: half of 288 x 72.
        assert_abs_diff_eq!(area(&gable, &triangles), 10368.0, epsilon = 1e-9);
        // Clockwise input comes back clockwise.
        let mut reversed = gable;
        reversed.reverse();
        let back = triangulate(&reversed);
        let n = |t: [usize; 3]| (reversed[t[1]] - reversed[t[0]]).cross(reversed[t[2]] - reversed[t[0]]);
        assert!(n(back[0]).dot(newell_normal(&reversed)) > 0.0);
    }

    #[test]
    fn a_degenerate_polygon_gives_nothing() {
        let line = [DVec3::ZERO, DVec3::X, DVec3::X * 2.0];
        assert!(triangulate(&line).is_empty());
    }
}
