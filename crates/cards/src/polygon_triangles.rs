//! Triangles of a simple polygon by ear clipping, for roof surfaces that
//! need not be convex.

use glam::DVec2;

/// Twice the signed area (positive counter-clockwise).
fn twice_area(points: &[DVec2]) -> f64 {
    points.iter().zip(points.iter().cycle().skip(1)).map(|(a, b)| a.perp_dot(*b)).sum()
}

fn inside_triangle(p: DVec2, a: DVec2, b: DVec2, c: DVec2) -> bool {
    let (d1, d2, d3) = ((b - a).perp_dot(p - a), (c - b).perp_dot(p - b), (a - c).perp_dot(p - c));
    d1 >= 0.0 && d2 >= 0.0 && d3 >= 0.0
}

/// Index triples covering a simple polygon (either winding), each triple
/// counter-clockwise. A polygon it cannot clip (self-crossing) gives as many
/// triangles as it managed.
pub(crate) fn polygon_triangles(points: &[DVec2]) -> Vec<[usize; 3]> {
    let mut ring: Vec<usize> = (0..points.len()).collect();
    if twice_area(points) < 0.0 {
        ring.reverse();
    }
    let mut triangles = Vec::new();
    let mut guard = 0;
    while ring.len() > 3 && guard < 4 * points.len() * points.len() + 8 {
        guard += 1;
        let n = ring.len();
        let mut clipped = false;
        for i in 0..n {
            let (ia, ib, ic) = (ring[(i + n - 1) % n], ring[i], ring[(i + 1) % n]);
            let (a, b, c) = (points[ia], points[ib], points[ic]);
            if (b - a).perp_dot(c - b) <= 1e-12 {
                continue;
            }
            let blocked = ring
                .iter()
                .filter(|&&j| j != ia && j != ib && j != ic)
                .any(|&j| inside_triangle(points[j], a, b, c));
            if !blocked {
                triangles.push([ia, ib, ic]);
                ring.remove(i);
                clipped = true;
                break;
            }
        }
        if !clipped {
            break;
        }
    }
    if let [a, b, c] = ring[..]
        && (points[b] - points[a]).perp_dot(points[c] - points[b]) > 0.0
    {
        triangles.push([a, b, c]);
    }
    triangles
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn an_l_shape_is_covered_by_four_triangles_of_its_area() {
        // Derivation: an L of six corners has 6 - 2 = 4 triangles, area 3.
        let l = [
            DVec2::new(0.0, 0.0),
            DVec2::new(2.0, 0.0),
            DVec2::new(2.0, 1.0),
            DVec2::new(1.0, 1.0),
            DVec2::new(1.0, 2.0),
            DVec2::new(0.0, 2.0),
        ];
        let triangles = polygon_triangles(&l);
        assert_eq!(triangles.len(), 4);
        let area: f64 = triangles.iter().map(|t| 0.5 * (l[t[1]] - l[t[0]]).perp_dot(l[t[2]] - l[t[0]])).sum();
        assert!((area - 3.0).abs() < 1e-12);
    }
}
