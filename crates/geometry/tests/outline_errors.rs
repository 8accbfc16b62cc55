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

/// A rectangular courtyard 100 in long (x) and `width` in wide (y) in the
/// 40 ft by 30 ft rectangle, every wall overhanging `overhang_in`.
fn strip_courtyard(width: f64, overhang_in: f64) -> Vec<Wall> {
    let mut court = walls(&[(100.0, 100.0), (200.0, 100.0), (200.0, 100.0 + width), (100.0, 100.0 + width)]);
    for wall in &mut court {
        wall.overhang_in = overhang_in;
    }
    court
}

#[test]
fn a_courtyard_just_wide_enough_for_its_overhangs() {
    // 16 in overhangs each side need 16 + 16 = 32 in across (arithmetic);
    // 32 1/4 in leaves a quarter inch between the fascias.
    assert!(Outline::new(rectangle(), vec![strip_courtyard(32.25, 16.0)]).is_ok());
    // Overhangs of 0 into a courtyard need no room at all.
    assert!(Outline::new(rectangle(), vec![strip_courtyard(2.0, 0.0)]).is_ok());
}

#[test]
fn a_courtyard_too_narrow_for_its_overhangs() {
    // 30 in across with 16 in overhangs each side: 32 in of overhang
    // (arithmetic), 2 in more than the room. Walls 1-4 are outer; the
    // courtyard's walls 5 (its bottom) and 7 (its top) face each other.
    assert_eq!(
        message(rectangle(), vec![strip_courtyard(30.0, 16.0)]),
        "courtyard 1 is too small for the overhangs into it: wall 5 (corner 1 to corner 2) and wall 7 \
         (corner 3 to corner 4) overhang 16 in and 16 in, 32 in together, but there is room for only \
         30 in, 2 in short; shorten those overhangs or widen the courtyard"
    );
    // Fascias that exactly meet leave no room for the fascia boards.
    let got = message(rectangle(), vec![strip_courtyard(32.0, 16.0)]);
    assert!(got.starts_with("courtyard 1 is too small for the overhangs into it"), "{got}");
    // The same given clockwise, as the second of two courtyards.
    let first = strip_courtyard(100.0, 16.0);
    let mut second = strip_courtyard(30.0, 16.0);
    second.reverse();
    for wall in &mut second {
        wall.corner.y += 150.0;
    }
    match Outline::new(rectangle(), vec![first, second]) {
        Err(OutlineError::CourtyardTooSmallForOverhangs { courtyard, wall, other, shortfall }) => {
            assert_eq!(courtyard, 1);
            // Walls 9-12 are the second courtyard: given reversed, its
            // bottom runs from its corner 3 to corner 4 (wall 11), its top
            // from corner 1 to corner 2 (wall 9); numbered from 0 here.
            assert_eq!((wall.wall, other.wall), (8, 10));
            assert_eq!(shortfall.overhangs_in, [16.0, 16.0]);
            // Room: 30 in less the 0.0048 in tolerance (1e-5 of 480 in).
            assert!((shortfall.room_in - (30.0 - 0.0048)).abs() < 1e-9, "{shortfall:?}");
            assert!((shortfall.short_in() - 2.0048).abs() < 1e-9, "{shortfall:?}");
        }
        other => panic!("unexpected {other:?}"),
    }
}

#[test]
fn a_gable_into_a_courtyard_overhangs_by_its_rake() {
    // A gable's rake overhangs into the courtyard as an eave does: 20 in
    // across with a 12 in rake on one side and a 12 in eave on the other
    // is 24 in of overhang (arithmetic), 4 in more than the room.
    let mut court = strip_courtyard(20.0, 12.0);
    court[0].roof = WallRoof::Gable;
    let got = message(rectangle(), vec![court]);
    assert!(got.contains("wall 5 (corner 1 to corner 2) and wall 7 (corner 3 to corner 4)"), "{got}");
    assert!(got.contains("room for only 20 in, 4 in short"), "{got}");
}

#[test]
fn one_overhang_into_a_courtyard_against_a_bare_wall() {
    // 20 in across: a 24 in overhang on one side with none on the other
    // runs 4 in into the far wall (arithmetic); 18 in fits.
    let mut court = strip_courtyard(20.0, 0.0);
    court[0].overhang_in = 24.0;
    let got = message(rectangle(), vec![court.clone()]);
    assert!(
        got.contains("overhang 24 in and 0 in, 24 in together, but there is room for only 20 in, 4 in short"),
        "{got}"
    );
    court[0].overhang_in = 18.0;
    assert!(Outline::new(rectangle(), vec![court]).is_ok());
}

#[test]
fn an_l_shaped_courtyard_with_a_thin_arm() {
    // An L: an arm 150 in long and 20 in wide along the bottom, and one
    // 30 in wide up the left side. With 12 in overhangs the wide arm has
    // 30 - 24 = 6 in to spare and the thin one is 24 - 20 = 4 in short
    // (arithmetic): walls 5 (the arm's bottom) and 7 (its top) are named.
    let l_shape = walls(&[
        (100.0, 100.0),
        (250.0, 100.0),
        (250.0, 120.0),
        (130.0, 120.0),
        (130.0, 250.0),
        (100.0, 250.0),
    ]);
    let court = l_shape.clone();
    assert_eq!(
        message(rectangle(), vec![court]),
        "courtyard 1 is too small for the overhangs into it: wall 5 (corner 1 to corner 2) and wall 7 \
         (corner 3 to corner 4) overhang 12 in and 12 in, 24 in together, but there is room for only \
         20 in, 4 in short; shorten those overhangs or widen the courtyard"
    );
    // With 9 in overhangs (18 in across the thin arm) it fits.
    let mut court = l_shape;
    for wall in &mut court {
        wall.overhang_in = 9.0;
    }
    assert!(Outline::new(rectangle(), vec![court]).is_ok());
}

/// Two 100 in square courtyard rooms joined by a neck 60 in long and
/// `neck` in wide, counter-clockwise from the first room's bottom left.
fn waisted_courtyard(neck: f64) -> Vec<Wall> {
    let (lo, hi) = (150.0 - neck / 2.0, 150.0 + neck / 2.0);
    walls(&[
        (100.0, 100.0),
        (200.0, 100.0),
        (200.0, lo),
        (260.0, lo),
        (260.0, 100.0),
        (360.0, 100.0),
        (360.0, 200.0),
        (260.0, 200.0),
        (260.0, hi),
        (200.0, hi),
        (200.0, 200.0),
        (100.0, 200.0),
    ])
}

#[test]
fn a_courtyard_with_a_thin_neck() {
    // The neck's walls have room to spare at both ends, so no fascia turns
    // round; the fascias of the neck's two sides cross in its middle. With
    // 12 in overhangs a 20 in neck is 24 - 20 = 4 in short (arithmetic).
    // Its bottom is the courtyard's wall 3 (wall 7 counting the 4 outer
    // walls), its top wall 9 (wall 13).
    assert_eq!(
        message(rectangle(), vec![waisted_courtyard(20.0)]),
        "courtyard 1 is too small for the overhangs into it: wall 7 (corner 3 to corner 4) and wall 13 \
         (corner 9 to corner 10) overhang 12 in and 12 in, 24 in together, but there is room for only \
         20 in, 4 in short; shorten those overhangs or widen the courtyard"
    );
    assert!(Outline::new(rectangle(), vec![waisted_courtyard(25.0)]).is_ok());
}

/// A round courtyard of `corners` corners on a circle of `radius_in`
/// round (240, 180), every wall overhanging `overhang_in`.
fn round_courtyard(corners: usize, radius_in: f64, overhang_in: f64) -> Vec<Wall> {
    (0..corners)
        .map(|i| {
            let angle = i as f64 / corners as f64 * std::f64::consts::TAU;
            let mut wall = pitched(240.0 + radius_in * angle.cos(), 180.0 + radius_in * angle.sin());
            wall.overhang_in = overhang_in;
            wall
        })
        .collect()
}

#[test]
fn a_round_courtyard_of_many_corners() {
    // 400 corners on a circle of 100 in radius with 12 in overhangs: each
    // wall's fascia is 2 * 12 * tan(180 / 400 degrees) = 0.19 in shorter
    // than the 1.57 in wall (arithmetic), so the ring holds.
    assert!(Outline::new(rectangle(), vec![round_courtyard(400, 100.0, 12.0)]).is_ok());
    // On a 20 in radius, 24 in overhangs close the ring once they reach
    // the walls' distance from the centre, 20 * cos(180 / 400 degrees)
    // = 19.9995 in, less half the 0.0048 in tolerance: room for twice
    // that, 39.994 in, across; 48 - 39.994 = 8.006 in short (arithmetic,
    // shown to three digits).
    let got = message(rectangle(), vec![round_courtyard(400, 20.0, 24.0)]);
    assert!(got.contains("48 in together, but there is room for only 40 in, 8.01 in short"), "{got}");
}

#[test]
fn the_walls_are_named_lower_number_first() {
    // The strip courtyard given from its top left corner: its first wall
    // is the short one on the left, whose fascia turns round between the
    // second wall (the bottom) and the last (the top).
    let mut court = strip_courtyard(30.0, 16.0);
    court.rotate_right(1);
    let got = message(rectangle(), vec![court]);
    assert!(
        got.contains(": wall 6 (corner 2 to corner 3) and wall 8 (corner 4 to corner 1) overhang"),
        "{got}"
    );
}
