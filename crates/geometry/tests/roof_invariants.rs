//! Properties every solved roof must have, over thousands of random
//! outlines, judged twice: by this crate's independent checker
//! (`check_roof`) and by the `geo` crate as an outside reference for plan
//! areas, polygon validity and point-in-polygon.
//!
//! `PITCHFRAME_ROOF_CASES` sets the number of outlines per property (the
//! default keeps the file well under a minute in a debug build); the long
//! random runs raise it. The random outlines are drawn from a fixed seed so
//! every run (and CI) checks the same ones; `PITCHFRAME_ROOF_SEED` picks
//! another seed, or `random` for a fresh draw each run, to explore.

#![allow(clippy::unwrap_used, reason = "a panic in a test helper is a failed test")]

use geo::{Area, Contains, Coord, InteriorPoint, LineString, Polygon, Validation};
use glam::{DVec2, DVec3};
use pitchframe_geometry::{
    GableFace, Outline, OutlineFeatures, OutlineShape, Roof, RoofLine, RoofLineKind, RoofPlane, Wall,
    WallRoof, check_roof, random_outline, random_outline_with,
};
use proptest::prelude::*;
use proptest::test_runner::{RngSeed, TestCaseError};

fn cases(default: u32) -> u32 {
    std::env::var("PITCHFRAME_ROOF_CASES").ok().and_then(|v| v.parse().ok()).unwrap_or(default)
}

/// The seed the solver's random outlines are drawn from.
fn rng_seed() -> RngSeed {
    match std::env::var("PITCHFRAME_ROOF_SEED").ok().as_deref() {
        Some("random") => RngSeed::Random,
        Some(text) => RngSeed::Fixed(text.parse().unwrap_or_else(|_| panic!("PITCHFRAME_ROOF_SEED={text}"))),
        None => RngSeed::Fixed(20_261_201),
    }
}

fn ring(points: impl IntoIterator<Item = DVec2>) -> LineString<f64> {
    let mut coords: Vec<Coord<f64>> = points.into_iter().map(|p| Coord { x: p.x, y: p.y }).collect();
    if let Some(&first) = coords.first() {
        coords.push(first);
    }
    LineString::new(coords)
}

fn outline_polygon(outline: &Outline) -> Polygon<f64> {
    Polygon::new(
        ring(outline.outer().iter().map(|w| w.corner)),
        outline.courtyards().iter().map(|c| ring(c.iter().map(|w| w.corner))).collect(),
    )
}

/// The plane as a geo polygon. A plane that flows all round a courtyard's
/// island of steeper planes comes as one outline with each inner loop
/// joined in by a cut (out from a point, round the loop, back to the same
/// point); each such loop becomes a hole here, as geo counts a cut as the
/// outline touching itself.
fn plane_polygon(plane: &RoofPlane) -> Polygon<f64> {
    let mut outer: Vec<DVec2> = plane.outline.iter().map(|p| p.truncate()).collect();
    let mut holes = Vec::new();
    // A cut: point `a` again at `c`, with the loop's first point at `a + 1`
    // and again at `c - 1`.
    while let Some((a, c)) = (0..outer.len()).find_map(|a| {
        let c = (a + 3..outer.len()).find(|&c| outer[c] == outer[a] && outer[c - 1] == outer[a + 1])?;
        Some((a, c))
    }) {
        holes.push(ring(outer[a + 1..c - 1].iter().copied()));
        outer.drain(a + 1..=c);
    }
    Polygon::new(ring(outer), holes)
}

/// The outline as Rust, ready to paste into a regression test.
fn describe(outline: &Outline) -> String {
    let ring_text = |walls: &[Wall]| {
        walls
            .iter()
            .map(|w| {
                let roof = match w.roof {
                    WallRoof::Pitched { rise_per_run } => format!("Some({rise_per_run:?})"),
                    WallRoof::Gable => "None".to_string(),
                };
                format!("    ({:?}, {:?}, {roof}),\n", w.corner.x, w.corner.y)
            })
            .collect::<String>()
    };
    let mut text = format!("outer:\n{}", ring_text(outline.outer()));
    for (i, c) in outline.courtyards().iter().enumerate() {
        text += &format!("courtyard {}:\n{}", i + 1, ring_text(c));
    }
    text
}

/// Asserts the checker finds nothing and geo agrees on areas, validity
/// and placement.
fn assert_roof_sound(outline: &Outline, roof: &Roof) -> Result<(), TestCaseError> {
    let defects = check_roof(outline, roof);
    prop_assert!(defects.is_empty(), "defects {defects:#?}\nin\n{}", describe(outline));

    let whole = outline_polygon(outline);
    let faces: Vec<Polygon<f64>> = roof.planes.iter().map(plane_polygon).collect();
    for (i, face) in faces.iter().enumerate() {
        prop_assert!(
            face.is_valid(),
            "plane {i} invalid per geo: {:?}\nin\n{}",
            face.validation_errors(),
            describe(outline)
        );
    }
    let perimeter: f64 =
        (0..outline.wall_count()).filter_map(|i| outline.wall(i)).map(|(a, b)| a.distance(b)).sum();
    let planes_area: f64 = faces.iter().map(|f| f.unsigned_area()).sum();
    let outline_area = whole.unsigned_area();
    // A sliver one tolerance wide along every wall.
    prop_assert!(
        (planes_area - outline_area).abs() <= outline.tolerance() * perimeter,
        "geo areas: planes {planes_area}, outline {outline_area}\nin\n{}",
        describe(outline)
    );
    // Each face's interior point lies in the outline and in no other face.
    for (i, face) in faces.iter().enumerate() {
        let Some(inside) = face.interior_point() else { continue };
        prop_assert!(whole.contains(&inside), "plane {i} outside the outline\nin\n{}", describe(outline));
        for (j, other) in faces.iter().enumerate() {
            prop_assert!(
                i == j || !other.contains(&inside),
                "planes {i} and {j} overlap\nin\n{}",
                describe(outline)
            );
        }
    }
    Ok(())
}

// ---------------------------------------------------------------------------
// Hand-worked roofs: these check the checks themselves, on roofs whose
// answer is known in closed form, before and apart from the solver.

/// A rectangle of `long` by `short` (long > short) centred on `centre`,
/// long side along `axis`, at one pitch, given either way round; gables on
/// the short ends if asked.
#[derive(Debug, Clone, Copy)]
struct Rectangle {
    long: f64,
    short: f64,
    slope: f64,
    centre: DVec2,
    axis: DVec2,
    clockwise: bool,
    gable_ends: bool,
}

impl Rectangle {
    fn corners(&self) -> Vec<DVec2> {
        let (u, v) = (self.axis, self.axis.perp());
        let (l, s) = (self.long / 2.0, self.short / 2.0);
        let mut c = vec![
            self.centre - u * l - v * s,
            self.centre + u * l - v * s,
            self.centre + u * l + v * s,
            self.centre - u * l + v * s,
        ];
        if self.clockwise {
            c.reverse();
        }
        c
    }

    fn outline(&self) -> Outline {
        let corners = self.corners();
        let walls = (0..4)
            .map(|i| {
                let long_wall = (corners[(i + 1) % 4] - corners[i]).length() > (self.long + self.short) / 2.0;
                Wall {
                    corner: corners[i],
                    roof: if self.gable_ends && !long_wall {
                        WallRoof::Gable
                    } else {
                        WallRoof::Pitched { rise_per_run: self.slope }
                    },
                    overhang_in: 12.0,
                }
            })
            .collect();
        Outline::new(walls, vec![]).unwrap()
    }

    /// The roof worked by hand. Hip roof: each hip runs from a corner at
    /// 45 degrees in plan to the ridge, which lies on the long centre line,
    /// `short / 2` in from each end, at height `slope * short / 2`. Gable
    /// roof: the ridge runs the full length on the centre line.
    fn roof(&self, outline: &Outline) -> Roof {
        let (u, s) = (self.axis, self.short / 2.0);
        let inset = if self.gable_ends { self.long / 2.0 } else { self.long / 2.0 - s };
        let ridge = [self.centre - u * inset, self.centre + u * inset];
        let top = self.slope * s;
        let lift = |p: DVec2| DVec3::new(p.x, p.y, top);
        let flat = |p: DVec2| DVec3::new(p.x, p.y, 0.0);
        let nearest =
            |p: DVec2| if p.distance(ridge[0]) < p.distance(ridge[1]) { ridge[0] } else { ridge[1] };
        let is_long = |a: DVec2, b: DVec2| a.distance(b) > (self.long + self.short) / 2.0;
        let mut roof = Roof { planes: vec![], lines: vec![], gables: vec![] };
        for wall in 0..4 {
            let (a, b) = outline.wall_roof_on_left(wall).unwrap();
            if is_long(a, b) {
                let outline = vec![flat(a), flat(b), lift(nearest(b)), lift(nearest(a))];
                roof.planes.push(RoofPlane {
                    wall,
                    rise_per_run: self.slope,
                    eave_outline: outline.clone(),
                    outline,
                    plane_group: wall,
                });
            } else if self.gable_ends {
                let outline = vec![flat(a), flat(b), lift(nearest((a + b) / 2.0))];
                roof.gables.push(GableFace { wall, outline });
            } else {
                let outline = vec![flat(a), flat(b), lift(nearest((a + b) / 2.0))];
                roof.planes.push(RoofPlane {
                    wall,
                    rise_per_run: self.slope,
                    eave_outline: outline.clone(),
                    outline,
                    plane_group: wall,
                });
            }
        }
        let long_walls: Vec<usize> =
            (0..4).filter(|&w| outline.wall(w).is_some_and(|(a, b)| is_long(a, b))).collect();
        roof.lines.push(RoofLine {
            kind: RoofLineKind::Ridge,
            from: lift(ridge[0]),
            to: lift(ridge[1]),
            walls: [long_walls[0], long_walls[1]],
        });
        if !self.gable_ends {
            for wall in 0..4 {
                let (corner, _) = outline.wall(wall).unwrap();
                let previous = (wall + 3) % 4;
                roof.lines.push(RoofLine {
                    kind: RoofLineKind::Hip,
                    from: flat(corner),
                    to: lift(nearest(corner)),
                    walls: [previous, wall],
                });
            }
        }
        roof
    }
}

fn rectangle() -> impl Strategy<Value = Rectangle> {
    (
        60.0..1200.0f64,
        0.05..0.95f64,
        2u32..=18,
        -1e4..1e4f64,
        -1e4..1e4f64,
        0.0..std::f64::consts::TAU,
        any::<bool>(),
        any::<bool>(),
    )
        .prop_map(|(long, ratio, rise, x, y, angle, clockwise, gable_ends)| Rectangle {
            long,
            short: long * ratio,
            // 2 in 12 to 18 in 12 as rise per unit run.
            slope: rise as f64 / 12.0,
            centre: DVec2::new(x, y),
            axis: DVec2::from_angle(angle),
            clockwise,
            gable_ends,
        })
}

proptest! {
    #![proptest_config(ProptestConfig { cases: cases(2000), ..ProptestConfig::default() })]

    /// Rectangles anywhere, at any angle, either way round, hipped or gabled.
    #[test]
    fn hand_worked_rectangle_roofs_pass(rect in rectangle()) {
        let outline = rect.outline();
        let roof = rect.roof(&outline);
        assert_roof_sound(&outline, &roof)?;
    }

    /// The same roofs with the ridge raised a little are caught.
    #[test]
    fn a_raised_ridge_is_always_caught(rect in rectangle(), lift in 0.25..5.0f64) {
        let outline = rect.outline();
        let mut roof = rect.roof(&outline);
        for plane in &mut roof.planes {
            for p in &mut plane.outline {
                if p.z > 0.0 {
                    p.z += lift;
                }
            }
        }
        prop_assert!(!check_roof(&outline, &roof).is_empty());
    }

    /// A hip roof's ridge shifted along its length is caught.
    #[test]
    fn a_shifted_ridge_is_always_caught(rect in rectangle(), shift in 2.0..20.0f64) {
        let rect = Rectangle { gable_ends: false, ..rect };
        let outline = rect.outline();
        let mut roof = rect.roof(&outline);
        let along = rect.axis * shift;
        for plane in &mut roof.planes {
            for p in &mut plane.outline {
                if p.z > 0.0 {
                    p.x += along.x;
                    p.y += along.y;
                }
            }
        }
        prop_assert!(!check_roof(&outline, &roof).is_empty());
    }
}

// ---------------------------------------------------------------------------
// The solver over random outlines.

fn solve_and_check(outline: &Outline) -> Result<(), TestCaseError> {
    let roof =
        Roof::solve(outline).map_err(|e| TestCaseError::fail(format!("{e}\nin\n{}", describe(outline))))?;
    assert_roof_sound(outline, &roof)
}

proptest! {
    #![proptest_config(ProptestConfig { cases: cases(1500), rng_seed: rng_seed(), ..ProptestConfig::default() })]

    #[test]
    fn plain_orthogonal_roofs_pass(seed in any::<u64>()) {
        solve_and_check(&random_outline_with(OutlineShape::Orthogonal, seed, OutlineFeatures::PLAIN))?;
    }

    #[test]
    fn plain_star_roofs_pass(seed in any::<u64>()) {
        solve_and_check(&random_outline_with(OutlineShape::Star, seed, OutlineFeatures::PLAIN))?;
    }

    #[test]
    fn orthogonal_roofs_pass(seed in any::<u64>()) {
        solve_and_check(&random_outline(OutlineShape::Orthogonal, seed))?;
    }

    #[test]

    fn star_roofs_pass(seed in any::<u64>()) {
        solve_and_check(&random_outline(OutlineShape::Star, seed))?;
    }
}

/// An outline from an orthogonal draw (20 corners, unequal pitches, two
/// gables, walls bent by a fraction of an inch; seed 14348934082233127294
/// before gables nearly in line with a pitched wall were refused, with its
/// corner 7 moved 2.2 in so the gable there turns by 3.8 degrees). Its
/// gable at the head of a notch lies on the outline's midline, where geo
/// looks for each plane's interior point. The nodes on the gable's line
/// were computed 6e-13 in off it, on the outside, so the plane over the
/// gable reached outside the outline by that much and geo's interior point,
/// on the wall itself, counted as outside.
#[test]
fn a_gable_on_the_midline_keeps_its_plane_inside_the_outline() {
    let pitched = |rise_per_run| WallRoof::Pitched { rise_per_run };
    let corners: [(f64, f64, WallRoof); 20] = [
        (219.64728362557256, 335.4845621644055, pitched(0.16666666666666666)),
        (314.17141961977916, 335.65150088350555, pitched(1.25)),
        (413.8583622358312, 335.4845621644055, pitched(0.75)),
        (413.61229361915076, 405.5064773755553, pitched(0.75)),
        (413.8583622358312, 503.2268432466082, WallRoof::Gable),
        (620.0819642434436, 503.2268432466082, WallRoof::Gable),
        (622.5, 388.7057068211659, pitched(0.16666666666666666)),
        (620.0819642434436, 335.4845621644055, pitched(0.5833333333333334)),
        (837.9959362412897, 335.4845621644055, pitched(0.9166666666666666)),
        (837.9959362412897, 167.74228108220274, pitched(1.4166666666666667)),
        (884.0320271154027, 167.74228108220274, pitched(1.4166666666666667)),
        (920.2377250925675, 167.74228108220274, pitched(1.4166666666666667)),
        (965.4343943433158, 167.74228108220274, pitched(1.4166666666666667)),
        (965.817844049732, 414.11454758388805, pitched(0.9166666666666666)),
        (965.4343943433158, 670.969124328811, pitched(0.5833333333333334)),
        (670.4635947454412, 671.0580148460524, pitched(0.75)),
        (413.8583622358312, 670.969124328811, pitched(0.4166666666666667)),
        (355.70010947319724, 670.969124328811, pitched(0.4166666666666667)),
        (279.69467213191797, 670.969124328811, pitched(0.4166666666666667)),
        (219.64728362557256, 670.969124328811, pitched(0.25)),
    ];
    let walls = corners
        .iter()
        .map(|&(x, y, roof)| Wall { corner: DVec2::new(x, y), roof, overhang_in: 12.0 })
        .collect();
    solve_and_check(&Outline::new(walls, vec![]).unwrap()).unwrap();
}

/// A generated orthogonal outline (three gables in a row at the head of a
/// wing) whose solve gave a plane a corner at x = -0.0. The plane was
/// right, but geo's sweep (interior points, validity) panicked on the
/// signed zero; the solve now gives plain zeros. Found by drawing this
/// property from seed 1.
#[test]
fn orthogonal_seed_3337481814657898043_solves_with_plain_zeros() {
    let outline = random_outline(OutlineShape::Orthogonal, 3_337_481_814_657_898_043);
    let roof = Roof::solve(&outline).unwrap();
    let signed_zero = roof
        .planes
        .iter()
        .flat_map(|p| &p.outline)
        .any(|p| (p.x == 0.0 && p.x.is_sign_negative()) || (p.y == 0.0 && p.y.is_sign_negative()));
    assert!(!signed_zero, "a plane has a corner at -0.0");
    solve_and_check(&outline).unwrap();
}

/// A generated star outline (94 corners with a courtyard, runs of walls
/// bent by a hair at unequal pitches) whose low-pitch wall (index 27) was squeezed
/// between its neighbours' planes: its face came back along its own edge
/// by 0.0003 in and crossed itself. The face is now cut back to where it
/// turns, and the planes either side share the stretch. Found by drawing
/// `star_roofs_pass` with fresh seeds.
#[test]
fn star_seed_405384574561628889_has_no_folded_plane() {
    solve_and_check(&random_outline(OutlineShape::Star, 405_384_574_561_628_889)).unwrap();
}
