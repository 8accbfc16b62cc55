//! Every way an outline can be refused, with the message a person reads.
//!
//! The outlines are invented; the expected messages are this project's own
//! wording (no outside source): each names the wall or corner at fault,
//! counted from 1.

use glam::DVec2;
use pitchframe_geometry::{Outline, OutlineError, Wall, WallRoof};

/// 6 in 12, common practice for a house roof, no source.
const SIX_TWELVE: f64 = 0.5;

fn pitched(x: f64, y: f64) -> Wall {
    Wall { corner: DVec2::new(x, y), roof: WallRoof::Pitched { rise_per_run: SIX_TWELVE }, overhang_in: 12.0 }
}

fn walls(points: &[(f64, f64)]) -> Vec<Wall> {
    points.iter().map(|&(x, y)| pitched(x, y)).collect()
}

/// A 40 ft by 30 ft rectangle, counter-clockwise.
fn rectangle() -> Vec<Wall> {
    walls(&[(0.0, 0.0), (480.0, 0.0), (480.0, 360.0), (0.0, 360.0)])
}

fn message(outer: Vec<Wall>, courtyards: Vec<Vec<Wall>>) -> String {
    match Outline::new(outer, courtyards) {
        Ok(_) => panic!("the outline was accepted"),
        Err(e) => e.to_string(),
    }
}

#[test]
fn a_plain_rectangle_is_accepted() {
    let outline = Outline::new(rectangle(), vec![]).unwrap();
    // Derivation: 480 * 360 square inches.
    assert_eq!(outline.area(), 172_800.0);
    assert_eq!(outline.wall_count(), 4);
}

#[test]
fn fewer_than_three_corners() {
    let got = message(walls(&[(0.0, 0.0), (10.0, 0.0)]), vec![]);
    assert_eq!(got, "the outline has 2 corners; a roof needs at least 3");
}

#[test]
fn a_courtyard_with_two_corners() {
    let got = message(rectangle(), vec![walls(&[(100.0, 100.0), (200.0, 100.0)])]);
    assert_eq!(got, "courtyard 1 has 2 corners; it needs at least 3");
}

#[test]
fn more_than_the_corner_cap() {
    let many: Vec<Wall> = (0..100_001)
        .map(|i| {
            let angle = i as f64 / 100_001.0 * std::f64::consts::TAU;
            pitched(1000.0 * angle.cos(), 1000.0 * angle.sin())
        })
        .collect();
    let got = message(many, vec![]);
    assert_eq!(got, "the outline has more than 100000 corners (100001 given)");
}

#[test]
fn a_corner_that_is_not_a_number() {
    let mut outer = rectangle();
    outer[2].corner.y = f64::NAN;
    assert_eq!(message(outer, vec![]), "corner 3 is not a finite point (480, NaN)");
}

#[test]
fn an_infinite_courtyard_corner() {
    let mut court = walls(&[(100.0, 100.0), (200.0, 100.0), (200.0, 200.0)]);
    court[1].corner.x = f64::INFINITY;
    let got = message(rectangle(), vec![court]);
    assert_eq!(got, "courtyard 1 corner 2 is not a finite point (inf, 100)");
}

#[test]
fn a_zero_pitch() {
    let mut outer = rectangle();
    outer[1].roof = WallRoof::Pitched { rise_per_run: 0.0 };
    assert_eq!(
        message(outer, vec![]),
        "wall 2 has a pitch of 0 rise per unit run; a pitch must be a finite slope above 0"
    );
}

#[test]
fn a_negative_or_infinite_pitch() {
    let mut outer = rectangle();
    outer[3].roof = WallRoof::Pitched { rise_per_run: -0.5 };
    assert!(message(outer.clone(), vec![]).starts_with("wall 4 has a pitch of -0.5 rise per unit run"));
    outer[3].roof = WallRoof::Pitched { rise_per_run: f64::INFINITY };
    assert!(message(outer, vec![]).starts_with("wall 4 has a pitch of inf rise per unit run"));
}

#[test]
fn a_negative_overhang() {
    let mut outer = rectangle();
    outer[0].overhang_in = -3.0;
    assert_eq!(
        message(outer, vec![]),
        "wall 1 has an overhang of -3 in; an overhang must be a finite length of 0 or more"
    );
}

#[test]
fn a_non_finite_overhang() {
    let mut outer = rectangle();
    outer[2].overhang_in = f64::NAN;
    assert!(message(outer, vec![]).starts_with("wall 3 has an overhang of NaN in"));
}

#[test]
fn every_wall_a_gable() {
    let mut outer = rectangle();
    for wall in &mut outer {
        wall.roof = WallRoof::Gable;
    }
    assert_eq!(
        message(outer, vec![]),
        "every wall is a gable, so there is no roof; give at least one wall a pitch"
    );
}

#[test]
fn a_corner_repeated_next_to_itself() {
    let outer = walls(&[(0.0, 0.0), (480.0, 0.0), (480.0, 360.0), (480.0, 360.0), (0.0, 360.0)]);
    assert_eq!(message(outer, vec![]), "corner 4 repeats corner 3");
}

#[test]
fn a_corner_repeated_further_on() {
    let outer =
        walls(&[(0.0, 0.0), (480.0, 0.0), (240.0, 180.0), (480.0, 360.0), (0.0, 360.0), (240.0, 180.0)]);
    assert_eq!(message(outer, vec![]), "corner 6 repeats corner 3");
}

#[test]
fn a_wall_shorter_than_the_tolerance() {
    // Tolerance: 1e-5 of the 1000 in width is 0.01 in; the wall is 0.004 in.
    let outer = walls(&[(0.0, 0.0), (1000.0, 0.0), (1000.004, 0.0), (1000.0, 500.0), (0.0, 500.0)]);
    assert_eq!(message(outer, vec![]), "wall 2 is shorter than the 0.01 in tolerance (0.004 in long)");
}

#[test]
fn corners_on_one_line() {
    let outer = walls(&[(0.0, 0.0), (100.0, 0.0), (300.0, 0.0)]);
    assert_eq!(message(outer, vec![]), "the outline's corners all lie on one line, so it encloses no area");
}

#[test]
fn a_courtyard_on_one_line() {
    let court = walls(&[(100.0, 100.0), (200.0, 100.0), (150.0, 100.0)]);
    assert_eq!(
        message(rectangle(), vec![court]),
        "courtyard 1's corners all lie on one line, so it encloses no area"
    );
}

#[test]
fn a_bow_tie_crosses_itself() {
    let outer = walls(&[(0.0, 0.0), (480.0, 360.0), (480.0, 0.0), (0.0, 360.0)]);
    assert_eq!(message(outer, vec![]), "wall 1 (corner 1 to corner 2) crosses wall 3");
}

#[test]
fn a_long_outline_crosses_far_along() {
    // A comb whose corner 12 is pulled in so walls 11 and 12 cut through the teeth.
    let outer = walls(&[
        (0.0, 0.0),
        (600.0, 0.0),
        (600.0, 300.0),
        (500.0, 300.0),
        (500.0, 100.0),
        (400.0, 100.0),
        (400.0, 300.0),
        (300.0, 300.0),
        (300.0, 100.0),
        (200.0, 100.0),
        (200.0, 300.0),
        (700.0, 200.0),
        (0.0, 300.0),
    ]);
    assert_eq!(message(outer, vec![]), "wall 2 (corner 2 to corner 3) crosses wall 11");
}

#[test]
fn a_corner_touching_another_wall() {
    // Corner 5 lies exactly on wall 1.
    let outer =
        walls(&[(0.0, 0.0), (480.0, 0.0), (480.0, 360.0), (240.0, 360.0), (240.0, 0.0), (0.0, 360.0)]);
    assert_eq!(message(outer, vec![]), "wall 1 (corner 1 to corner 2) touches wall 4");
}

#[test]
fn a_wall_doubling_back() {
    // Wall 2 runs out along x and wall 3 comes back over it.
    let outer = walls(&[(0.0, 0.0), (480.0, 0.0), (480.0, 360.0), (480.0, 200.0), (0.0, 360.0)]);
    assert_eq!(message(outer, vec![]), "wall 2 (corner 2 to corner 3) touches wall 3");
}

#[test]
fn a_corner_within_the_tolerance_of_a_wall() {
    // The tolerance is 0.0048 in (1e-5 of 480 in); corner 5 is 0.001 in above wall 1.
    let outer =
        walls(&[(0.0, 0.0), (480.0, 0.0), (480.0, 360.0), (240.0, 360.0), (240.0, 0.001), (0.0, 360.0)]);
    assert_eq!(message(outer, vec![]), "corner 5 is within the 0.0048 in tolerance of wall 1");
}

#[test]
fn a_straight_corner_with_a_pitch_change() {
    let mut outer = walls(&[(0.0, 0.0), (240.0, 0.0), (480.0, 0.0), (480.0, 360.0), (0.0, 360.0)]);
    outer[1].roof = WallRoof::Pitched { rise_per_run: 0.75 };
    assert_eq!(
        message(outer, vec![]),
        "wall 1 and wall 2 meet in a straight line at corner 2 but are roofed differently; \
         give them the same pitch, or make both gables"
    );
}

/// A rectangle whose bottom wall is bent at corner 2 by `rise` inches over
/// 240 in, with wall 2 (from the bend on) a gable.
fn bent_gable(rise: f64) -> Vec<Wall> {
    let mut outer = walls(&[(0.0, 0.0), (240.0, 0.0), (480.0, rise), (480.0, 360.0), (0.0, 360.0)]);
    outer[1].roof = WallRoof::Gable;
    outer
}

#[test]
fn a_gable_nearly_in_line_with_a_pitched_wall() {
    // Derivation: a bend of 1 in over 240 in turns by atan(1 / 240) = 0.24 degrees.
    assert_eq!(
        message(bent_gable(1.0), vec![]),
        "wall 2 is a gable and wall 1 is pitched, but they meet at corner 2 only 0.24 degrees off a \
         straight line; make them one straight wall with one roof, or turn the corner by at least 1 degree"
    );
    // Bent the other way (an inside corner) the same.
    let got = message(bent_gable(-1.0), vec![]);
    assert!(got.contains("wall 2 is a gable and wall 1 is pitched") && got.contains("0.24 degrees"), "{got}");
    // Just under and just over the 1 degree limit: tan(1 deg) * 240 in = 4.189 in.
    assert!(message(bent_gable(4.15), vec![]).contains("0.99 degrees"));
    assert!(Outline::new(bent_gable(4.25), vec![]).is_ok());
}

#[test]
fn two_walls_nearly_in_line_with_one_roof_are_accepted() {
    let outer = walls(&[(0.0, 0.0), (240.0, 0.0), (480.0, 1.0), (480.0, 360.0), (0.0, 360.0)]);
    assert!(Outline::new(outer, vec![]).is_ok());
}

#[test]
fn a_straight_corner_with_one_pitch_is_accepted() {
    let outer = walls(&[(0.0, 0.0), (240.0, 0.0), (480.0, 0.0), (480.0, 360.0), (0.0, 360.0)]);
    assert!(Outline::new(outer, vec![]).is_ok());
}

#[test]
fn a_courtyard_outside() {
    let court = walls(&[(600.0, 100.0), (700.0, 100.0), (700.0, 200.0)]);
    assert_eq!(message(rectangle(), vec![court]), "courtyard 1 is not inside the outline");
}

#[test]
fn a_courtyard_crossing_the_outline() {
    let court = walls(&[(400.0, 100.0), (560.0, 100.0), (560.0, 200.0), (400.0, 200.0)]);
    assert_eq!(message(rectangle(), vec![court]), "courtyard 1 crosses the outline at wall 2");
}

#[test]
fn a_courtyard_crossing_another() {
    let first = walls(&[(100.0, 100.0), (200.0, 100.0), (200.0, 200.0), (100.0, 200.0)]);
    let second = walls(&[(150.0, 150.0), (250.0, 150.0), (250.0, 250.0), (150.0, 250.0)]);
    // Walls 1-4 are outer, 5-8 the first courtyard; its wall 6 runs up x = 200.
    assert_eq!(message(rectangle(), vec![first, second]), "courtyard 2 crosses courtyard 1 at wall 6");
}

#[test]
fn a_courtyard_inside_another() {
    let first = walls(&[(100.0, 100.0), (300.0, 100.0), (300.0, 300.0), (100.0, 300.0)]);
    let second = walls(&[(150.0, 150.0), (250.0, 150.0), (250.0, 250.0), (150.0, 250.0)]);
    assert_eq!(message(rectangle(), vec![first, second]), "courtyard 2 lies inside courtyard 1");
}

#[test]
fn a_courtyard_wall_crossing_itself() {
    let court = walls(&[(100.0, 100.0), (200.0, 200.0), (200.0, 100.0), (100.0, 200.0)]);
    assert_eq!(
        message(rectangle(), vec![court]),
        "wall 5 (courtyard 1, corner 1 to corner 2) crosses wall 7"
    );
}

#[test]
fn errors_carry_zero_based_indices() {
    let outer = walls(&[(0.0, 0.0), (480.0, 360.0), (480.0, 0.0), (0.0, 360.0)]);
    match Outline::new(outer, vec![]) {
        Err(OutlineError::WallsCross { wall, other }) => {
            assert_eq!((wall.wall, other.wall), (0, 2));
        }
        other => panic!("unexpected {other:?}"),
    }
}

#[test]
fn ten_thousand_corners_are_checked() {
    // A 10,000-corner star outline; then the same with one corner pushed
    // across the far side so two walls cross.
    let n = 10_000;
    let star: Vec<Wall> = (0..n)
        .map(|i| {
            let angle = i as f64 / n as f64 * std::f64::consts::TAU;
            let radius = if i % 2 == 0 { 1000.0 } else { 900.0 };
            pitched(radius * angle.cos(), radius * angle.sin())
        })
        .collect();
    assert!(Outline::new(star.clone(), vec![]).is_ok());
    let mut crossed = star;
    crossed[5000].corner = DVec2::new(1100.0, 0.5);
    let got = message(crossed, vec![]);
    assert!(got.contains("crosses"), "{got}");
}
