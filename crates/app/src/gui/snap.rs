//! Where a dragged corner lands: on the grid, and square (or at 45
//! degrees) to its neighbouring corners when the pointer is near that.

use std::f64::consts::FRAC_PI_4;

use glam::DVec2;

/// How near, in radians, the pointer's direction from a neighbouring
/// corner must come to a multiple of 45 degrees to be pulled onto it:
/// 4 degrees, wide enough to catch by hand, narrow enough to let an
/// angled wall be drawn at 40 or 50 degrees.
const DIRECTION_PULL_RAD: f64 = 4.0 * std::f64::consts::PI / 180.0;

/// How a dragged corner snaps.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Snap {
    /// Grid step in inches; `None` places the corner where the pointer is.
    pub grid_in: Option<f64>,
    /// Whether walls snap to 0, 45, 90 ... degree directions from the
    /// neighbouring corners.
    pub directions: bool,
}

impl Snap {
    /// Where a corner dragged to `pointer_in` lands, given its neighbouring
    /// corners (all in plan inches).
    pub fn corner(&self, pointer_in: DVec2, neighbours: [DVec2; 2]) -> DVec2 {
        let on_grid = |p: DVec2| match self.grid_in.filter(|step| *step > 0.0) {
            Some(step) => (p / step).round() * step,
            None => p,
        };
        let gridded = on_grid(pointer_in);
        if !self.directions {
            return gridded;
        }
        let lines: Vec<(DVec2, DVec2)> = neighbours
            .iter()
            .filter_map(|&from| square_direction(pointer_in - from).map(|along| (from, along)))
            .collect();
        match lines.as_slice() {
            [] => gridded,
            [(from, along)] => {
                // Along one square line, the distance from the neighbour
                // snaps to the grid step, so the wall's length is round.
                let distance = (pointer_in - *from).dot(*along);
                let distance = match self.grid_in.filter(|step| *step > 0.0) {
                    Some(step) => (distance / step).round() * step,
                    None => distance,
                };
                *from + *along * distance
            }
            [(a, da), (b, db), ..] => match crossing(*a, *da, *b, *db) {
                Some(point) => point,
                None => *a + *da * (pointer_in - *a).dot(*da),
            },
        }
    }
}

/// The multiple of 45 degrees `offset` points near, as a unit vector, if
/// it is within the pull.
fn square_direction(offset: DVec2) -> Option<DVec2> {
    if offset.length_squared() == 0.0 {
        return None;
    }
    let angle = offset.y.atan2(offset.x);
    let nearest = (angle / FRAC_PI_4).round() * FRAC_PI_4;
    ((angle - nearest).abs() <= DIRECTION_PULL_RAD).then(|| DVec2::from_angle(nearest))
}

/// Where the lines `a + s da` and `b + t db` cross, unless parallel.
fn crossing(a: DVec2, da: DVec2, b: DVec2, db: DVec2) -> Option<DVec2> {
    let denominator = da.perp_dot(db);
    if denominator.abs() < 1e-9 {
        return None;
    }
    let s = (b - a).perp_dot(db) / denominator;
    Some(a + da * s)
}

#[cfg(test)]
mod tests {
    use approx::assert_abs_diff_eq;

    use super::*;

    const FAR: [DVec2; 2] = [DVec2::new(-1000.0, 333.0), DVec2::new(1000.0, -777.0)];

    #[test]
    fn the_grid_rounds_each_coordinate_to_its_step() {
        let snap = Snap { grid_in: Some(12.0), directions: false };
        // Derivation: 100 / 12 = 8.33 rounds to 8 (96 in); 17 / 12 to 1.
        assert_eq!(snap.corner(DVec2::new(100.0, 17.0), FAR), DVec2::new(96.0, 12.0));
        let free = Snap { grid_in: None, directions: false };
        assert_eq!(free.corner(DVec2::new(100.3, 17.1), FAR), DVec2::new(100.3, 17.1));
    }

    #[test]
    fn a_nearly_square_wall_comes_square_with_a_round_length() {
        let snap = Snap { grid_in: Some(1.0), directions: true };
        let from = DVec2::new(10.0, 10.0);
        // 2 degrees off level from `from`, 200.4 in away along it.
        let pointer = from + DVec2::from_angle(2f64.to_radians()) * 200.4;
        let landed = snap.corner(pointer, [from, DVec2::new(5000.0, 2000.0)]);
        // Derivation: level from (10, 10); 200.4 cos 2 deg = 200.28 rounds to 200.
        assert_abs_diff_eq!(landed.y, 10.0, epsilon = 1e-9);
        assert_abs_diff_eq!(landed.x, 210.0, epsilon = 1e-9);
    }

    #[test]
    fn near_square_to_both_neighbours_lands_on_their_crossing() {
        let snap = Snap { grid_in: None, directions: true };
        // A rectangle's corner: from (0, 0) level, from (100, 60) plumb on plan.
        let landed = snap.corner(DVec2::new(101.0, 2.0), [DVec2::ZERO, DVec2::new(100.0, 60.0)]);
        assert_abs_diff_eq!(landed.x, 100.0, epsilon = 1e-9);
        assert_abs_diff_eq!(landed.y, 0.0, epsilon = 1e-9);
    }

    #[test]
    fn forty_five_degrees_pulls_and_forty_does_not() {
        let snap = Snap { grid_in: None, directions: true };
        let at_44 = DVec2::from_angle(44f64.to_radians()) * 100.0;
        let landed = snap.corner(at_44, [DVec2::ZERO, DVec2::new(9000.0, -7000.0)]);
        assert_abs_diff_eq!(landed.x, landed.y, epsilon = 1e-9);
        let at_40 = DVec2::from_angle(40f64.to_radians()) * 100.0;
        assert_eq!(snap.corner(at_40, [DVec2::ZERO, DVec2::new(9000.0, -7000.0)]), at_40);
    }
}
