//! Wings off a main block, solved by the roof solver: T and L plans with
//! narrower wings, mixed pitches and a gable wing.

mod framing_support;

use framing_support::{assert_joints_fit, of_kind, outline, spaced};
use glam::{DVec2, dvec2};
use pitchframe_geometry::Roof;
use pitchframe_geometry::framing::{MemberKind, frame_roof};

fn t_plan() -> Vec<DVec2> {
    // Invented: a 50 ft x 24 ft block, a 16 ft wing 20 ft out from the
    // middle of its north side.
    vec![
        dvec2(0.0, 0.0),
        dvec2(600.0, 0.0),
        dvec2(600.0, 288.0),
        dvec2(396.0, 288.0),
        dvec2(396.0, 528.0),
        dvec2(204.0, 528.0),
        dvec2(204.0, 288.0),
        dvec2(0.0, 288.0),
    ]
}

fn frames(corners: &[DVec2], slopes: &[f64]) -> pitchframe_geometry::Frame {
    let o = outline(corners, slopes, 12.0);
    let roof = Roof::solve(&o).unwrap_or_else(|e| panic!("solve: {e}"));
    let frame = frame_roof(&o, &roof, &spaced(16.0)).unwrap_or_else(|e| panic!("frame: {e}"));
    for p in &frame.pieces {
        assert!(!p.solid.parts.is_empty(), "{} has no solid", p.label);
    }
    assert_joints_fit(&frame);
    let (depth, a, b) = framing_support::parry_fit::worst_interference(&frame);
    assert!(depth < 1.0 / 64.0, "{a} and {b} overlap by {depth} in");
    frame
}

#[test]
fn t_plan_with_a_narrower_hipped_wing() {
    let frame = frames(&t_plan(), &[0.5; 8]);
    assert_eq!(of_kind(&frame, MemberKind::Valley).iter().map(|m| m.count).sum::<usize>(), 2);
    assert!(!of_kind(&frame, MemberKind::ValleyJack).is_empty());
}

#[test]
fn t_plan_with_a_gable_wing() {
    let mut slopes = [0.5; 8];
    slopes[4] = 0.0;
    let frame = frames(&t_plan(), &slopes);
    assert_eq!(of_kind(&frame, MemberKind::Valley).iter().map(|m| m.count).sum::<usize>(), 2);
}

#[test]
fn l_plan_with_a_narrower_wing_has_cripples() {
    let corners = [
        dvec2(0.0, 0.0),
        dvec2(600.0, 0.0),
        dvec2(600.0, 336.0),
        dvec2(408.0, 336.0),
        dvec2(408.0, 600.0),
        dvec2(0.0, 600.0),
    ];
    let frame = frames(&corners, &[0.5; 6]);
    assert!(!of_kind(&frame, MemberKind::CrippleJack).is_empty());
}

#[test]
fn l_plan_with_steeper_ends() {
    let corners = [
        dvec2(0.0, 0.0),
        dvec2(600.0, 0.0),
        dvec2(600.0, 288.0),
        dvec2(288.0, 288.0),
        dvec2(288.0, 576.0),
        dvec2(0.0, 576.0),
    ];
    let frame = frames(&corners, &[0.5, 0.75, 0.5, 0.5, 0.75, 0.5]);
    assert!(!of_kind(&frame, MemberKind::Valley).is_empty());
}

#[test]
fn square_plan_round_a_courtyard() {
    // Invented: a 60 ft square with a 20 ft courtyard in the middle; the
    // roof is a ring of ridges, hips at the outer corners and valleys at
    // the courtyard's.
    let w = |x: f64, y: f64| pitchframe_geometry::Wall {
        corner: dvec2(x, y),
        roof: pitchframe_geometry::WallRoof::Pitched { rise_per_run: 0.5 },
        overhang_in: 12.0,
    };
    let outer = vec![w(0.0, 0.0), w(720.0, 0.0), w(720.0, 720.0), w(0.0, 720.0)];
    let court = vec![w(240.0, 240.0), w(240.0, 480.0), w(480.0, 480.0), w(480.0, 240.0)];
    let o = pitchframe_geometry::Outline::new(outer, vec![court]).unwrap_or_else(|e| panic!("{e}"));
    let roof = Roof::solve(&o).unwrap_or_else(|e| panic!("solve: {e}"));
    let frame = frame_roof(&o, &roof, &spaced(16.0)).unwrap_or_else(|e| panic!("frame: {e}"));
    assert_eq!(of_kind(&frame, MemberKind::Hip).iter().map(|m| m.count).sum::<usize>(), 4);
    assert_eq!(of_kind(&frame, MemberKind::Valley).iter().map(|m| m.count).sum::<usize>(), 4);
    assert!(!of_kind(&frame, MemberKind::ValleyJack).is_empty());
    assert_joints_fit(&frame);
    let (depth, a, b) = framing_support::parry_fit::worst_interference(&frame);
    assert!(depth < 1.0 / 64.0, "{a} and {b} overlap by {depth} in");
}
