//! No two pieces of a frame occupy the same wood: every pair of pieces,
//! joined or not, is checked by parry for interpenetration.

mod framing_support;

use framing_support::parry_fit::worst_interference;
use framing_support::{l_hip, outline, rect_gable, rect_hip, spaced};
use glam::dvec2;
use pitchframe_geometry::framing::frame_roof;
use pitchframe_geometry::{Roof, demo_plan};

fn check(name: &str, frame: &pitchframe_geometry::Frame) {
    let (depth, a, b) = worst_interference(frame);
    assert!(depth < 1.0 / 64.0, "{name}: {a} and {b} overlap by {depth} in");
}

#[test]
fn hand_built_roofs_have_no_interference() {
    let (o, r) = rect_hip(720.0, 300.0, 0.5, 0.5, 16.0);
    check("hip", &frame_roof(&o, &r, &spaced(16.0)).unwrap());
    let (o, r) = rect_hip(720.0, 360.0, 8.0 / 12.0, 14.0 / 12.0, 12.0);
    check("unequal hip", &frame_roof(&o, &r, &spaced(16.0)).unwrap());
    let (o, r) = l_hip(288.0, 0.5, 12.0);
    check("L", &frame_roof(&o, &r, &spaced(16.0)).unwrap());
    let (o, r) = rect_gable(480.0, 240.0, 5.0 / 12.0, 12.0);
    check("gable", &frame_roof(&o, &r, &spaced(16.0)).unwrap());
}

#[test]
fn solved_roofs_have_no_interference() {
    let plan = demo_plan().unwrap();
    let o = plan.outline().unwrap();
    let r = Roof::solve(&o).unwrap();
    check("demo", &frame_roof(&o, &r, &spaced(24.0)).unwrap());
    let t = [
        dvec2(0.0, 0.0),
        dvec2(600.0, 0.0),
        dvec2(600.0, 288.0),
        dvec2(396.0, 288.0),
        dvec2(396.0, 528.0),
        dvec2(204.0, 528.0),
        dvec2(204.0, 288.0),
        dvec2(0.0, 288.0),
    ];
    let o = outline(&t, &[0.5; 8], 12.0);
    let r = Roof::solve(&o).unwrap();
    check("T", &frame_roof(&o, &r, &spaced(16.0)).unwrap());
}

#[test]
fn a_pyramid_and_a_plan_of_many_wings_have_no_interference() {
    // A square hipped to a point: four hips meet with no ridge and are
    // mitred to each other (flagged for a fitted block).
    let o = outline(
        &[dvec2(0.0, 0.0), dvec2(300.0, 0.0), dvec2(300.0, 300.0), dvec2(0.0, 300.0)],
        &[0.5; 4],
        12.0,
    );
    let r = Roof::solve(&o).unwrap();
    let frame = frame_roof(&o, &r, &spaced(16.0)).unwrap();
    assert!(
        frame
            .warnings
            .iter()
            .any(|w| matches!(w, pitchframe_geometry::framing::FramingWarning::HipsMeetWithoutRidge { .. }))
    );
    framing_support::assert_joints_fit(&frame);
    check("pyramid", &frame);

    let o = pitchframe_geometry::many_wings(0.5).unwrap_or_else(|e| panic!("test outline: {e}"));
    let r = Roof::solve(&o).unwrap();
    let frame = frame_roof(&o, &r, &spaced(16.0)).unwrap();
    assert!(frame.pieces.len() > 900);
    assert!(frame.joints.iter().all(|j| j.max_gap < 1.0 / 64.0 && j.max_overlap < 1.0 / 64.0));
    check("many wings", &frame);
}
