//! Hand-built roofs for the framing tests: the planes and lines of simple
//! plans worked out by hand, so framing is tested apart from the solver.
#![allow(dead_code)]

use glam::{DVec2, DVec3, dvec2, dvec3};
use pitchframe_geometry::framing::{Frame, FramingSettings, MemberKind};
use pitchframe_geometry::{Outline, Roof, RoofLine, RoofLineKind, RoofPlane, Wall, WallRoof};

/// An outline from corners, each wall pitched at its slope (0 = gable).
pub fn outline(corners: &[DVec2], slopes: &[f64], overhang_in: f64) -> Outline {
    let walls = corners
        .iter()
        .zip(slopes)
        .map(|(c, s)| Wall {
            corner: *c,
            roof: if *s > 0.0 { WallRoof::Pitched { rise_per_run: *s } } else { WallRoof::Gable },
            overhang_in,
        })
        .collect();
    Outline::new(walls, Vec::new()).unwrap_or_else(|e| panic!("test outline: {e}"))
}

/// A plane with its eave outline taken as the wall-line outline (framing
/// reads overhangs from the walls, not from the eave outline).
fn plane(wall: usize, slope: f64, pts: &[DVec3]) -> RoofPlane {
    RoofPlane {
        wall,
        rise_per_run: slope,
        outline: pts.to_vec(),
        eave_outline: pts.to_vec(),
        plane_group: wall,
    }
}

/// A rectangle `length` along x by `width` along y, hipped all round: the
/// long walls (0 and 2) at `side`, the ends (1 and 3) at `end` rise per
/// run. Corners (0,0), (L,0), (L,W), (0,W).
///
/// Derivation: the ridge stands at h = side * W / 2; each hip end sits
/// where the end plane reaches h, at h / end from the end wall.
pub fn rect_hip(length: f64, width: f64, side: f64, end: f64, overhang_in: f64) -> (Outline, Roof) {
    let c = [dvec2(0.0, 0.0), dvec2(length, 0.0), dvec2(length, width), dvec2(0.0, width)];
    let o = outline(&c, &[side, end, side, end], overhang_in);
    let h = side * width / 2.0;
    let n1 = dvec3(h / end, width / 2.0, h);
    let n2 = dvec3(length - h / end, width / 2.0, h);
    let p = |v: DVec2| v.extend(0.0);
    let planes = vec![
        plane(0, side, &[p(c[0]), p(c[1]), n2, n1]),
        plane(1, end, &[p(c[1]), p(c[2]), n2]),
        plane(2, side, &[p(c[2]), p(c[3]), n1, n2]),
        plane(3, end, &[p(c[3]), p(c[0]), n1]),
    ];
    let line = |kind, from, to, walls| RoofLine { kind, from, to, walls };
    let lines = vec![
        line(RoofLineKind::Ridge, n1, n2, [0, 2]),
        line(RoofLineKind::Hip, p(c[0]), n1, [3, 0]),
        line(RoofLineKind::Hip, p(c[1]), n2, [0, 1]),
        line(RoofLineKind::Hip, p(c[2]), n2, [1, 2]),
        line(RoofLineKind::Hip, p(c[3]), n1, [2, 3]),
    ];
    (o, Roof { planes, lines, gables: Vec::new() })
}

/// A rectangle with gables on the ends (walls 1 and 3) and both long walls
/// at `slope`.
pub fn rect_gable(length: f64, width: f64, slope: f64, overhang_in: f64) -> (Outline, Roof) {
    let c = [dvec2(0.0, 0.0), dvec2(length, 0.0), dvec2(length, width), dvec2(0.0, width)];
    let o = outline(&c, &[slope, 0.0, slope, 0.0], overhang_in);
    let h = slope * width / 2.0;
    let r1 = dvec3(0.0, width / 2.0, h);
    let r2 = dvec3(length, width / 2.0, h);
    let p = |v: DVec2| v.extend(0.0);
    let planes =
        vec![plane(0, slope, &[p(c[0]), p(c[1]), r2, r1]), plane(2, slope, &[p(c[2]), p(c[3]), r1, r2])];
    let lines = vec![RoofLine { kind: RoofLineKind::Ridge, from: r1, to: r2, walls: [0, 2] }];
    (o, Roof { planes, lines, gables: Vec::new() })
}

/// The members of one kind.
pub fn of_kind(frame: &Frame, kind: MemberKind) -> Vec<&pitchframe_geometry::Member> {
    frame.members.iter().filter(|m| m.kind == kind).collect()
}

/// Settings with a given spacing and otherwise the defaults.
pub fn spaced(spacing_in: f64) -> FramingSettings {
    FramingSettings { spacing_in, ..FramingSettings::default() }
}

/// Length per unit run of a slope.
pub fn per_run(slope: f64) -> f64 {
    (1.0 + slope * slope).sqrt()
}

pub mod parry_fit;

/// Asserts every joint of a frame fits within 1/64 in, by the frame's own
/// check and by parry on the solids, and that each joint has a mating face.
pub fn assert_joints_fit(frame: &Frame) {
    assert!(!frame.joints.is_empty());
    for j in &frame.joints {
        assert!(j.max_gap < 1.0 / 64.0 && j.max_overlap < 1.0 / 64.0, "own check: {j:?}");
        let (gap, overlap, mating) = parry_fit::fit(frame, j.pieces[0], j.pieces[1]);
        assert!(mating >= 1, "no mating face found by parry for {:?}", j.members);
        assert!(gap < 1.0 / 64.0, "parry gap {gap} at {:?}", j.members);
        assert!(overlap < 1.0 / 64.0, "parry overlap {overlap} at {:?}", j.members);
    }
}

/// An L of two wings `width` wide, hipped all round at one slope: corners
/// (0,0), (2W,0), (2W,W), (W,W), (W,2W), (0,2W).
///
/// Derivation (equal pitches, equal wings): both ridges stand at
/// h = slope * W / 2 and meet at (W/2, W/2), where the hip from the outer
/// corner and the valley from the inside corner (W,W) also end; each wing
/// ends in a hip end W/2 in from its end wall.
pub fn l_hip(width: f64, slope: f64, overhang_in: f64) -> (Outline, Roof) {
    let w = width;
    let c = [
        dvec2(0.0, 0.0),
        dvec2(2.0 * w, 0.0),
        dvec2(2.0 * w, w),
        dvec2(w, w),
        dvec2(w, 2.0 * w),
        dvec2(0.0, 2.0 * w),
    ];
    let o = outline(&c, &[slope; 6], overhang_in);
    let h = slope * w / 2.0;
    let a = dvec3(w / 2.0, w / 2.0, h);
    let e = dvec3(1.5 * w, w / 2.0, h);
    let n = dvec3(w / 2.0, 1.5 * w, h);
    let p = |v: DVec2| v.extend(0.0);
    let planes = vec![
        plane(0, slope, &[p(c[0]), p(c[1]), e, a]),
        plane(1, slope, &[p(c[1]), p(c[2]), e]),
        plane(2, slope, &[p(c[2]), p(c[3]), a, e]),
        plane(3, slope, &[p(c[3]), p(c[4]), n, a]),
        plane(4, slope, &[p(c[4]), p(c[5]), n]),
        plane(5, slope, &[p(c[5]), p(c[0]), a, n]),
    ];
    let line = |kind, from, to, walls| RoofLine { kind, from, to, walls };
    let lines = vec![
        line(RoofLineKind::Ridge, a, e, [0, 2]),
        line(RoofLineKind::Ridge, a, n, [3, 5]),
        line(RoofLineKind::Hip, p(c[0]), a, [5, 0]),
        line(RoofLineKind::Valley, p(c[3]), a, [2, 3]),
        line(RoofLineKind::Hip, p(c[1]), e, [0, 1]),
        line(RoofLineKind::Hip, p(c[2]), e, [1, 2]),
        line(RoofLineKind::Hip, p(c[4]), n, [3, 4]),
        line(RoofLineKind::Hip, p(c[5]), n, [4, 5]),
    ];
    (o, Roof { planes, lines, gables: Vec::new() })
}
