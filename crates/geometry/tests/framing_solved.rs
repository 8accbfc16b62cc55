//! Framing roofs from the roof solver.

mod framing_support;

use approx::assert_abs_diff_eq;
use framing_support::{assert_joints_fit, of_kind, outline, per_run, spaced};
use glam::dvec2;
use pitchframe_geometry::Roof;
use pitchframe_geometry::framing::{MemberKind, frame_roof};

#[test]
fn solved_rectangle_hip_roof_frames_like_the_hand_built_one() {
    let r = 6.0 / 12.0;
    let o =
        outline(&[dvec2(0.0, 0.0), dvec2(720.0, 0.0), dvec2(720.0, 300.0), dvec2(0.0, 300.0)], &[r; 4], 16.0);
    let roof = Roof::solve(&o).unwrap();
    let frame = frame_roof(&o, &roof, &spaced(16.0)).unwrap();
    let common = of_kind(&frame, MemberKind::Common)[0];
    // Derivation: half the 300 in span at the common's factor.
    assert_abs_diff_eq!(common.theoretical_length, 150.0 * per_run(r), epsilon = 1e-6);
    let hip = of_kind(&frame, MemberKind::Hip)[0];
    assert_eq!(hip.count, 4);
    assert_abs_diff_eq!(hip.theoretical_length, 12.5 * (288.0f64 + 36.0).sqrt(), epsilon = 1e-6);
    assert!(of_kind(&frame, MemberKind::KingCommon).iter().map(|m| m.count).sum::<usize>() == 6);
    assert_joints_fit(&frame);
}

#[test]
fn solved_l_roof_frames_with_a_valley() {
    let r = 8.0 / 12.0;
    let w = 288.0;
    let corners = [
        dvec2(0.0, 0.0),
        dvec2(2.0 * w, 0.0),
        dvec2(2.0 * w, w),
        dvec2(w, w),
        dvec2(w, 2.0 * w),
        dvec2(0.0, 2.0 * w),
    ];
    let o = outline(&corners, &[r; 6], 12.0);
    let roof = Roof::solve(&o).unwrap();
    let frame = frame_roof(&o, &roof, &spaced(16.0)).unwrap();
    assert_eq!(of_kind(&frame, MemberKind::Valley).len(), 1);
    assert!(!of_kind(&frame, MemberKind::ValleyJack).is_empty());
    assert_joints_fit(&frame);
}
