//! Outlines that stress the roof solver, most found by the random runs in
//! `roof_invariants.rs` and reduced to a few corners. Each must solve and
//! pass `check_roof`; the outlines are invented.

#![allow(clippy::unwrap_used, reason = "a panic in a test helper is a failed test")]

use glam::DVec2;
use pitchframe_geometry::{Outline, OutlineError, Roof, Wall, WallRoof, check_roof};

fn walls(points: &[(f64, f64)], rise_per_run: f64) -> Vec<Wall> {
    points
        .iter()
        .map(|&(x, y)| Wall {
            corner: DVec2::new(x, y),
            roof: WallRoof::Pitched { rise_per_run },
            overhang_in: 12.0,
        })
        .collect()
}

fn assert_solves_cleanly(outline: &Outline) {
    let roof = match Roof::solve(outline) {
        Ok(roof) => roof,
        Err(e) => panic!("the solve failed: {e}"),
    };
    let defects = check_roof(outline, &roof);
    assert!(defects.is_empty(), "{defects:#?}");
}

/// A plus-shaped outline, arms 200 in wide and 200 in long, at 6 in 12:
/// the two end walls of each arm lie in line with each other, so their
/// planes are one plane, and the ridges across the middle must still be
/// reported between the planes that meet there.
#[test]
fn plus_shape_reports_its_ridges() {
    let outer = walls(
        &[
            (200.0, 0.0),
            (400.0, 0.0),
            (400.0, 200.0),
            (600.0, 200.0),
            (600.0, 400.0),
            (400.0, 400.0),
            (400.0, 600.0),
            (200.0, 600.0),
            (200.0, 400.0),
            (0.0, 400.0),
            (0.0, 200.0),
            (200.0, 200.0),
        ],
        0.5,
    );
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// A cross with unequal arms (the shape the random runs first found).
#[test]
fn uneven_cross_reports_its_ridges() {
    let outer = walls(
        &[
            (0.0, 214.0),
            (180.0, 214.0),
            (180.0, 0.0),
            (360.0, 0.0),
            (360.0, 214.0),
            (540.0, 214.0),
            (540.0, 318.0),
            (360.0, 318.0),
            (360.0, 468.0),
            (180.0, 468.0),
            (180.0, 318.0),
            (0.0, 318.0),
        ],
        1.0,
    );
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// A T on its side: the stem's two walls at x = 180 lie in line, on either
/// side of the arm, with one pitch.
#[test]
fn sideways_t_reports_its_ridges() {
    let outer = walls(
        &[
            (0.0, 214.0),
            (180.0, 214.0),
            (180.0, 0.0),
            (360.0, 0.0),
            (360.0, 468.0),
            (180.0, 468.0),
            (180.0, 318.0),
            (0.0, 318.0),
        ],
        1.0,
    );
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// A four-wall outline with a gable on wall 1 and a short wall 2 beside it
/// at an inside corner (6 in 12 elsewhere). Wall 2's plane starts at height
/// 0 at corner 2, where wall 4's plane is about 8 in up: the gable's face
/// carries on along its line above wall 2's plane until the two planes
/// meet (the rule in `Roof::solve`), and the check accepts the step only
/// where that face stands and spans it.
#[test]
fn gable_beside_a_short_wall() {
    let mut outer = walls(&[(-37.5, 53.7), (-79.7, 26.2), (-96.6, 19.6), (-86.1, -7.8)], 0.5);
    outer[0].roof = WallRoof::Gable;
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// Five walls with their own pitches and a wall only 0.02 in long (about
/// four times the tolerance): the plane of the long wall beside it must
/// keep that wall's far corner.
#[test]
fn a_tiny_wall_keeps_its_neighbours_corner() {
    let corners = [
        (213.38633956135962, 240.7729189174382, 1.25),
        (213.40094332598866, 240.758786449822, 0.6666666666666666),
        (266.3579250579743, 189.34002654894516, 1.0),
        (-215.7482826678756, 336.61861072939297, 0.25),
        (169.6260479260716, 282.98026299118305, 0.6666666666666666),
    ];
    let outer = corners
        .iter()
        .map(|&(x, y, rise_per_run)| Wall {
            corner: DVec2::new(x, y),
            roof: WallRoof::Pitched { rise_per_run },
            overhang_in: 12.0,
        })
        .collect();
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// An L of five walls, each pitched on its own (15/12, 12/12, 7/12, 15/12
/// and about 17.5/12): a valid outline the solve must close.
#[test]
fn an_l_with_mixed_pitches_closes() {
    let corners = [
        (218.8325680485475, 456.64761761382636, 1.25),
        (218.8325680485475, 228.32380880691318, 1.0),
        (291.77675739806335, 228.32380880691318, 0.5833333333333334),
        (291.77675739806335, 0.0, 1.25),
        (0.0, 0.0, 1.4597134066979394),
    ];
    let outer = corners
        .iter()
        .map(|&(x, y, rise_per_run)| Wall {
            corner: DVec2::new(x, y),
            roof: WallRoof::Pitched { rise_per_run },
            overhang_in: 12.0,
        })
        .collect();
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// Four walls at 6 in 12 with a gable on wall 1, whose neighbour wall 2
/// turns off at an inside corner of about 205 degrees: the gable's face
/// carries on past corner 2 above wall 2's plane, as in
/// `gable_beside_a_short_wall`.
#[test]
fn gable_at_an_obtuse_corner() {
    let mut outer = walls(&[(457.1, 182.5), (457.1, 365.0), (543.9, 547.5), (0.0, 547.5)], 0.5);
    outer[0].roof = WallRoof::Gable;
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// The wall of a pitched outline as the long run writes it: corner, rise
/// per run (`None` for a gable) and overhang.
type RunWall = (f64, f64, Option<f64>, f64);

/// Asserts the outline is refused as a gable nearly in line with a
/// pitched wall, naming them (`walls`) and the turn in degrees (`angle`).
fn assert_refused_nearly_in_line(outline: Result<Outline, OutlineError>, walls: &str, angle: &str) {
    match outline {
        Ok(_) => panic!("the outline was accepted"),
        Err(e @ OutlineError::GableNearlyInLine { .. }) => {
            let text = e.to_string();
            assert!(text.contains(walls) && text.contains(&format!("only {angle} degrees")), "{text}");
        }
        Err(e) => panic!("refused for another reason: {e}"),
    }
}

fn run_walls(corners: &[RunWall]) -> Vec<Wall> {
    corners
        .iter()
        .map(|&(x, y, rise, overhang_in)| Wall {
            corner: DVec2::new(x, y),
            roof: rise.map_or(WallRoof::Gable, |rise_per_run| WallRoof::Pitched { rise_per_run }),
            overhang_in,
        })
        .collect()
}

/// A 240 x 200 in house with gable ends and an 80 in wide wing, 120 in
/// long with a gable end, on its right-hand end, all at 6 in 12. Worked by
/// hand (the same roof `roof_check`'s own tests check): main ridge along
/// y = 100 at 0.5 * 100 = 50 in, wing ridge along y = 100 at 0.5 * 40 =
/// 20 in, and the main gable face carried on along x = 240 from the inside
/// corner (240, 60) up over the wing's planes to the wing's ridge end
/// (240, 100, 20), where the main plane is at 50 in.
#[test]
fn a_wing_on_a_gable_end_dies_into_the_gable_face() {
    let pitched = Some(0.5);
    let outline = Outline::new(
        run_walls(&[
            (0.0, 0.0, pitched, 12.0),
            (240.0, 0.0, None, 12.0),
            (240.0, 60.0, pitched, 12.0),
            (360.0, 60.0, None, 12.0),
            (360.0, 140.0, pitched, 12.0),
            (240.0, 140.0, None, 12.0),
            (240.0, 200.0, pitched, 12.0),
            (0.0, 200.0, None, 12.0),
        ]),
        vec![],
    )
    .unwrap();
    let roof = Roof::solve(&outline).unwrap();
    assert_eq!(check_roof(&outline, &roof), vec![]);
    let near = |a: glam::DVec3, b: (f64, f64, f64)| a.distance(glam::DVec3::new(b.0, b.1, b.2)) < 1e-6;
    let face = roof.gables.iter().find(|g| g.wall == 1).unwrap();
    let expected = [(240.0, 0.0, 0.0), (240.0, 60.0, 0.0), (240.0, 100.0, 20.0), (240.0, 100.0, 50.0)];
    assert_eq!(face.outline.len(), expected.len(), "{:?}", face.outline);
    for e in expected {
        assert!(face.outline.iter().any(|&p| near(p, e)), "{e:?} not in {:?}", face.outline);
    }
    let wing = roof.planes.iter().find(|p| p.wall == 2).unwrap();
    for e in [(240.0, 60.0, 0.0), (360.0, 60.0, 0.0), (360.0, 100.0, 20.0), (240.0, 100.0, 20.0)] {
        assert!(wing.outline.iter().any(|&p| near(p, e)), "{e:?} not in {:?}", wing.outline);
    }
    let ridges: Vec<_> =
        roof.lines.iter().filter(|l| l.kind == pitchframe_geometry::RoofLineKind::Ridge).collect();
    assert_eq!(ridges.len(), 2);
    assert!(ridges.iter().any(|l| near(l.from, (0.0, 100.0, 50.0)) || near(l.to, (0.0, 100.0, 50.0))));
    assert!(ridges.iter().any(|l| near(l.from, (360.0, 100.0, 20.0)) || near(l.to, (360.0, 100.0, 20.0))));
}

/// Long-run seed 1 (a star of ten walls, mixed pitches, gables on walls 3
/// and 9): the check found "planes 1 and 0 meet at (276.9, 543.6) with
/// heights 0 and 93.8". Corner 3 is an inside corner beside gable wall 3;
/// wall 2's plane starts there at 0 while wall 1's plane, over the gable's
/// top beside the corner, is at 0.4167 * 225.2 = 93.8 (its distance from
/// wall 1's line times its pitch, by hand). The solve carries the gable
/// face on past the corner over wall 2's plane; the check now accepts the
/// step where that face spans it.
#[test]
fn long_run_seed_1_gable_beside_an_inside_corner() {
    let outer = run_walls(&[
        (-272.89590084567027, 640.3891739967203, Some(0.4166666666666667), 3.0),
        (189.67757078083156, 754.0259024556372, Some(0.3333333333333333), 8.0),
        (276.91457793172094, 543.5655104942502, None, 23.0),
        (770.1684227970999, 359.4200436491653, Some(1.0833333333333333), 9.0),
        (726.2804472920795, -413.49228327992887, Some(0.25), 2.0),
        (430.43575983297575, -619.2797437658228, Some(1.058097954138982), 15.0),
        (12.911081124508172, -761.4580985831761, Some(1.1109056673111115), 4.0),
        (-366.36900077365715, -644.9888356511227, Some(0.4166666666666667), 23.0),
        (-666.5764873881443, -198.71035730997875, None, 21.0),
        (-904.1927761030192, 200.34459984662064, Some(0.9166666666666666), 13.0),
    ]);
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// Long-run seed 148 (orthogonal, near-parallel walls, mixed pitches, a
/// gable and a courtyard): "gable face 0 does not stand on wall 6" (wall 7
/// counted from 1). Gable wall 7 meets wall 8 at a square inside corner;
/// its face runs on 0.05 in past that corner, above wall 8's narrow plane,
/// to where the planes either side meet 0.04 in up, which the check had
/// taken for a face off its wall.
/// Since gables nearly in line with a pitched wall are refused (this one
/// turns by 0.10 degrees), the outline is refused with a message naming
/// the two walls; its roof had solved soundly.
#[test]
fn long_run_seed_148_gable_face_past_a_nearly_straight_corner() {
    let outer = run_walls(&[
        (0.0, 567.2999685302617, Some(1.0), 6.0),
        (415.1028415518428, 567.2999685302617, Some(0.9166666666666666), 4.0),
        (415.1028415518428, 0.0, Some(0.4166666666666667), 18.0),
        (270.5053758557519, 0.1758672751897749, Some(1.5), 1.0),
        (138.36761385061428, 0.0, Some(0.25), 22.0),
        (138.36761385061428, 94.54999475504363, Some(0.9166666666666666), 10.0),
        (91.4218319150921, 94.52337273421632, None, 24.0),
        (69.18380692530714, 94.54999475504363, Some(0.6666666666666666), 4.0),
        (69.33932413850403, 63.86490310471821, Some(0.9166666666666666), 12.0),
        (69.18380692530714, 0.0, Some(1.2243907874664939), 16.0),
        (0.0, 0.0, Some(0.9229199362574266), 14.0),
    ]);
    let courtyard = run_walls(&[
        (172.15273307927177, 92.7651149799706, Some(1.268387177030937), 24.0),
        (262.47667519420975, 92.7651149799706, Some(0.3333333333333333), 23.0),
        (262.47667519420975, 181.21172991133884, Some(0.8244253477841411), 17.0),
        (172.15273307927177, 181.21172991133884, Some(0.8333333333333334), 7.0),
    ]);
    assert_refused_nearly_in_line(
        Outline::new(outer, vec![courtyard]),
        "wall 7 is a gable and wall 6 is pitched",
        "0.10",
    );
}

/// Long-run seed 409 (a star of 23 walls with three gables and a
/// courtyard): "planes 10 and 11 meet with no ridge, hip or valley
/// reported". The two planes lie either side of gable wall 14's face,
/// carried on past the inside corner at (-73.4, -98.4); a vertical face
/// stands between them, so no roof line is due there.
/// Since gables nearly in line with a pitched wall are refused (this one
/// turns by 0.38 degrees), the outline is refused with a message naming
/// the two walls; its roof had solved soundly.
#[test]
fn long_run_seed_409_planes_either_side_of_a_gable_face() {
    let outer = run_walls(&[
        (101.11001701512303, 20.19312425377849, Some(0.3333333333333333), 17.0),
        (83.5973294590794, 109.29743994396594, Some(1.4166666666666667), 17.0),
        (47.04114563299544, 108.58487962618885, Some(0.47602777137702335), 9.0),
        (27.451712280418313, 108.3609347210962, Some(0.9166666666666666), 9.0),
        (-10.5694795772131, 114.83698869634773, None, 9.0),
        (-39.6219199396151, 119.58707568382655, Some(0.5833333333333334), 14.0),
        (-56.36174463761568, 108.39659420345198, Some(0.5), 16.0),
        (-77.65930472363621, 94.36862167938375, Some(1.4166666666666667), 21.0),
        (-107.17810444096753, 74.79791519772792, Some(1.5), 12.0),
        (-133.1785682097862, -3.0851063078501584, Some(0.25), 5.0),
        (-123.80761836780583, -33.01992272751439, Some(0.6886463083532174), 5.0),
        (-117.45972589532107, -53.394595288142156, None, 19.0),
        (-105.36309817798731, -92.11087901114017, Some(1.4166666666666667), 21.0),
        (-83.48046567912601, -96.42240582995197, None, 20.0),
        (-73.3689804541948, -98.40788879278385, Some(0.5833333333333334), 18.0),
        (-68.08880118327781, -99.45501967398818, Some(0.4166666666666667), 6.0),
        (-55.90311139121056, -104.00254966555879, Some(1.1666666666666667), 4.0),
        (-40.696899415050325, -109.7482239558396, Some(1.0848797738276839), 16.0),
        (-17.76989448862775, -118.36362960658614, Some(1.0848797738276839), 11.0),
        (14.505032880797879, -130.49175504330762, Some(1.0), 2.0),
        (31.348273454772826, -117.44087050926397, Some(0.6666666666666666), 21.0),
        (65.93087651424487, -90.4168347048922, Some(1.1666666666666667), 21.0),
        (100.46061632630338, -13.91556592006868, Some(0.25), 0.0),
    ]);
    let courtyard = run_walls(&[
        (43.45334746806225, -43.690284278421885, Some(0.6666666666666666), 20.0),
        (53.67708049567393, -8.321401773767953, Some(0.9166666666666666), 14.0),
        (22.659506897806466, 0.6445414274956676, Some(1.25), 0.0),
        (12.435773870194787, -34.724341077158265, Some(1.4171386550852028), 20.0),
    ]);
    assert_refused_nearly_in_line(
        Outline::new(outer, vec![courtyard]),
        "wall 5 is a gable and wall 4 is pitched",
        "0.38",
    );
}

/// Long-run seed 790 (orthogonal, walls in line, tiny walls, walls bent by
/// a hair, mixed pitches): "planes 1 and 3 meet with no ridge, hip or
/// valley reported" (counted from 1). Walls 1 to 6 run within 0.11 in of
/// x = 60.853; wall 2's plane lies between wall 1's and wall 3's as a
/// sliver about 0.002 in wide, under the outline's tolerance (1e-5 of its
/// 281 in size, 0.0028 in), so the check took planes 1 and 3 for
/// neighbours. The solve reports the lines from the sliver to each; the
/// check now takes those for theirs.
#[test]
fn long_run_seed_790_a_sliver_under_the_tolerance_between_two_planes() {
    let outer = run_walls(&[
        (60.85299927697625, 34.14723420229146, Some(0.31699672722976563), 17.0),
        (60.85299927697625, 99.55984670842, Some(1.4166666666666667), 4.0),
        (60.85999769179745, 125.12377902889818, Some(0.25), 7.0),
        (60.8599972009931, 125.12930710671552, Some(1.306063757495141), 17.0),
        (60.85300038774313, 140.63199227211769, Some(0.4166666666666667), 9.0),
        (60.85300382162712, 140.63691447164499, Some(1.3333333333333333), 21.0),
        (60.95410726664488, 195.38819733517767, Some(1.1666666666666667), 19.0),
        (60.85299927697625, 281.26890674770806, Some(0.75), 23.0),
        (121.7059985539525, 281.26890674770806, Some(0.5833333333333334), 6.0),
        (121.7059985539525, 0.0, Some(1.25), 16.0),
        (60.857584299648856, 0.0, Some(1.0), 18.0),
        (60.85299927697625, 0.004585022672610282, Some(0.31699672722976563), 2.0),
    ]);
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// Long-run seed 8168 (orthogonal, 24 walls, five gables): "planes 13 and
/// 4 meet at (459.67, 952.12) with heights 0.30 and 158.69" (counted from
/// 1). Gable walls 16 and 23 lie within 0.45 in of one line, y = 952.12;
/// both faces run on past their inside corners to x = 459.7, where wall
/// 23's face spans 38.3 to 158.7 in and wall 16's 0.3 to 38.3 in, one
/// above the other. The step is filled, but by two faces, which the check
/// had not allowed for.
/// Since gables nearly in line with a pitched wall are refused (this one
/// turns by 0.43 degrees), the outline is refused with a message naming
/// the two walls; its roof had solved soundly.
#[test]
fn long_run_seed_8168_a_step_filled_by_two_gable_faces() {
    let outer = run_walls(&[
        (0.0, 238.029980320794, Some(0.5019127577474926), 14.0),
        (71.29021858243823, 238.44754038364724, Some(1.3333333333333333), 23.0),
        (229.9733916216978, 238.029980320794, Some(0.3333333333333333), 22.0),
        (229.9733916216978, 0.0, Some(0.16666666666666666), 10.0),
        (919.8935664867912, 0.0, None, 22.0),
        (920.3362208515862, 135.6538577978622, Some(0.3333333333333333), 21.0),
        (919.8935664867912, 238.029980320794, None, 17.0),
        (919.8115861740062, 281.98311566406073, Some(0.9166666666666666), 15.0),
        (919.8935664867913, 309.0332987470832, None, 5.0),
        (919.8935664867912, 415.887121533087, Some(0.5), 21.0),
        (919.9009867809737, 442.45851205594425, Some(1.5), 3.0),
        (919.8935664867912, 476.059960641588, Some(1.4166666666666667), 22.0),
        (689.9201748650934, 476.059960641588, Some(1.3333333333333333), 20.0),
        (689.9201748650934, 666.8858043965295, Some(1.3333333333333333), 14.0),
        (689.9201748650934, 952.119921283176, Some(0.25), 23.0),
        (582.5794965006978, 951.6825823317797, None, 19.0),
        (459.9467832433956, 952.119921283176, Some(1.0833333333333333), 4.0),
        (459.7813056094132, 1045.6486585749194, None, 5.0),
        (459.9467832433956, 1190.14990160397, Some(0.72914087838869), 1.0),
        (229.9733916216978, 1190.14990160397, Some(0.16666666666666666), 2.0),
        (229.9733916216978, 1126.892491953626, Some(0.16666666666666666), 17.0),
        (229.9733916216978, 1011.2163940175989, Some(0.16666666666666666), 18.0),
        (229.9733916216978, 952.119921283176, None, 9.0),
        (0.0, 952.119921283176, Some(0.4166666666666667), 2.0),
    ]);
    assert_refused_nearly_in_line(
        Outline::new(outer, vec![]),
        "wall 5 is a gable and wall 6 is pitched",
        "0.43",
    );
}

/// Property-test seed 1492184159618700917 (orthogonal, walls in line and
/// bent by a hair, mixed pitches): "planes 2 and 4 meet with no ridge,
/// hip or valley reported". Walls 3 to 5 (counted from 1) lie within 0.04
/// in of x = 55.39; wall 4's plane runs between walls 3's and 5's as a
/// sliver under the tolerance (0.0065 in), with a line to each.
#[test]
fn property_seed_1492184159618700917_a_sliver_between_two_planes() {
    let outer = run_walls(&[
        (0.0, 50.679627756896295, Some(0.4166666666666667), 13.0),
        (55.391602889623876, 50.679627756896295, Some(0.8333333333333334), 24.0),
        (55.391602889623876, 29.957467869049218, Some(0.3333333333333333), 13.0),
        (55.38576470028402, 25.45573368923281, Some(0.8932106292263532), 1.0),
        (55.391602889623876, 21.848032414524493, Some(1.1452821024909603), 3.0),
        (55.42739795951157, 12.093574695626918, Some(0.28285398676840706), 23.0),
        (55.391602889623876, 0.0, Some(0.16666666666666666), 4.0),
        (200.67110240069215, -0.07171087939623082, Some(0.25), 22.0),
        (294.26434146060996, 0.0, Some(1.0833333333333333), 23.0),
        (294.26434146060996, 92.31893287091508, Some(1.0833333333333333), 21.0),
        (294.26434146060996, 192.46521627557502, Some(1.0833333333333333), 2.0),
        (294.26434146060996, 286.0099175991595, Some(1.0833333333333333), 3.0),
        (294.26434146060996, 409.0616352700662, Some(1.0833333333333333), 17.0),
        (294.26434146060996, 645.7539317624328, Some(1.3333333333333333), 5.0),
        (264.7544762529504, 645.7477171909586, Some(0.25), 13.0),
        (242.41824536305438, 645.7539317624328, Some(1.3512114948811842), 16.0),
        (242.41824536305438, 409.0616352700662, Some(1.2205393684775492), 2.0),
        (55.391602889623876, 409.0616352700662, Some(0.7368416583797194), 2.0),
        (55.391602889623876, 338.45300081143336, Some(0.7368416583797194), 4.0),
        (55.39160288962388, 272.85031875322704, Some(0.7368416583797194), 18.0),
        (55.391602889623876, 192.46521627557502, Some(1.0833333333333333), 15.0),
        (0.0, 192.46521627557502, Some(1.1666666666666667), 2.0),
        (-0.12818778172644282, 147.99151479894277, Some(0.25), 16.0),
    ]);
    assert_solves_cleanly(&Outline::new(outer, vec![]).unwrap());
}

/// Property-test seed 9079259970648893793 (orthogonal with a courtyard,
/// tiny walls, walls bent by a hair): "line 7 is reported as a Valley but
/// its planes make a Hip". Corner 3 (counted from 1) is an inside corner,
/// so the line its walls' planes meet in runs from it as a valley (at an
/// inside corner the roof is the higher of the two planes: derivation).
/// Wall 2's plane along that valley is 0.00004 in wide; the check had read
/// the plane's side from its far edge.
#[test]
fn property_seed_9079259970648893793_a_valley_along_a_sliver() {
    let outer = run_walls(&[
        (273.40476621700213, 529.1990701727234, Some(1.25), 17.0),
        (356.14638891192334, 528.948898902843, Some(0.4166666666666667), 18.0),
        (356.154028014084, 528.9489050644087, Some(0.25), 4.0),
        (410.1071493255032, 529.1990701727234, Some(0.980623663010819), 22.0),
        (522.7213633333915, 529.6143744419053, Some(0.6666666666666666), 24.0),
        (522.7326191929594, 529.6143806592446, Some(0.16666666666666666), 12.0),
        (683.5119155425053, 529.1990701727234, Some(1.0833333333333333), 20.0),
        (683.5119155425053, 264.57658726947136, Some(0.6847235503196134), 5.0),
        (683.5064531868958, 264.5711249138618, Some(0.6666666666666666), 1.0),
        (273.40476621700213, 264.5711249138618, Some(1.1666666666666667), 15.0),
    ]);
    let courtyard = run_walls(&[
        (448.34169927203453, 379.1370224377597, Some(0.16666666666666666), 17.0),
        (503.2993854728434, 379.1370224377597, Some(0.4166666666666667), 8.0),
        (503.2993854728434, 325.1313021445284, Some(1.0833333333333333), 0.0),
        (448.34169927203453, 325.1313021445284, Some(1.3333333333333333), 22.0),
    ]);
    let outline = Outline::new(outer, vec![courtyard]).unwrap();
    assert_solves_cleanly(&outline);
    let roof = Roof::solve(&outline).unwrap();
    let line = roof.lines.iter().find(|l| l.walls == [1, 2]).unwrap();
    assert_eq!(line.kind, pitchframe_geometry::RoofLineKind::Valley);
    // It starts at corner 3, at the wall line.
    assert!(line.from.truncate().distance(DVec2::new(356.154028014084, 528.9489050644087)) < 1e-6);
}

/// Property-test seed 8584108819368480866 (a star of 31 walls, tiny walls,
/// walls bent by a hair, a gable): "planes 26 and 29 meet with no ridge,
/// hip or valley reported"; the planes between them along that stretch are
/// narrower than the tolerance, each with a line to both.
/// Since gables nearly in line with a pitched wall are refused (this one
/// turns by 0.37 degrees), the outline is refused with a message naming
/// the two walls; its roof had solved soundly.
#[test]
fn property_seed_8584108819368480866_slivers_between_two_planes() {
    let outer = run_walls(&[
        (172.96071957213573, 53.00127188167519, Some(1.4166666666666667), 7.0),
        (172.95810459067977, 53.009240338494294, Some(0.8333333333333334), 4.0),
        (171.0412605267208, 78.69949629616316, Some(0.16666666666666666), 7.0),
        (171.0403740502484, 78.71156861807755, Some(1.25), 23.0),
        (169.4264442593485, 101.0504652244653, Some(0.5), 16.0),
        (85.77495929874232, 196.0182956477613, Some(1.1666666666666667), 16.0),
        (-43.522114239070284, 231.89404950981645, Some(0.6666666666666666), 18.0),
        (-43.53344309602202, 231.89236781713208, Some(1.3333333333333333), 8.0),
        (-83.23276263037056, 206.70361999179778, Some(1.4166666666666667), 18.0),
        (-103.93396963714503, 193.48114174669226, Some(0.5), 19.0),
        (-175.3573007515292, 131.31025176509715, Some(1.457920992861079), 18.0),
        (-177.70776672236792, 98.88966849514004, Some(1.457920992861079), 3.0),
        (-179.26784385025985, 77.3711223600821, Some(1.457920992861079), 17.0),
        (-181.64992993335233, 44.514394727668154, Some(0.3333333333333333), 15.0),
        (-217.71451769065268, -49.56838302501884, Some(0.8333333333333334), 1.0),
        (-217.71171576244325, -49.581734421850065, Some(0.4166666666666667), 13.0),
        (-110.36354917126418, -158.1453410491284, Some(1.0), 2.0),
        (-89.85700555879725, -196.53449134454053, Some(1.0), 12.0),
        (-69.59462302311158, -234.46656138059848, Some(0.3333333333333333), 23.0),
        (-59.48954469408232, -253.36766429714888, Some(0.5261911565946039), 22.0),
        (-52.52591431712268, -266.41992140612996, Some(0.28853049790155955), 7.0),
        (-52.51141692532167, -266.42318385581325, Some(0.4166666666666667), 20.0),
        (32.77734289015899, -203.18737663174144, None, 5.0),
        (131.62475303727132, -192.82220622337158, Some(0.4166666666666667), 22.0),
        (177.80058447573992, -187.67943807294995, Some(0.75), 12.0),
        (259.14568215564987, -84.56474793005972, Some(0.5), 18.0),
        (259.14621359363525, -84.5550318622376, Some(0.25), 20.0),
        (243.2446389655875, -59.114743457542964, Some(1.25), 18.0),
        (230.4353508739057, -38.7310854163039, Some(1.4855653692962356), 18.0),
        (220.22074176138116, -22.408172875269866, Some(0.25), 15.0),
        (206.45928785605605, -0.4641017134521448, Some(1.4166666666666667), 13.0),
    ]);
    assert_refused_nearly_in_line(
        Outline::new(outer, vec![]),
        "wall 23 is a gable and wall 24 is pitched",
        "0.37",
    );
}
