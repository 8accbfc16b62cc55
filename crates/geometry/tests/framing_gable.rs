//! Gable roofs: commons only, gable-end rafters flush with the end walls.

mod framing_support;

use approx::assert_abs_diff_eq;
use framing_support::{assert_joints_fit, of_kind, outline, per_run, rect_gable, spaced};
use glam::dvec2;
use pitchframe_geometry::Roof;
use pitchframe_geometry::framing::{MemberKind, frame_roof};

#[test]
fn gable_roof_is_commons_on_a_ridge() {
    let r = 5.0 / 12.0;
    let (o, roof) = rect_gable(480.0, 240.0, r, 12.0);
    let frame = frame_roof(&o, &roof, &spaced(16.0)).unwrap();
    let kinds: Vec<MemberKind> = frame.members.iter().map(|m| m.kind).collect();
    assert!(kinds.iter().all(|k| matches!(k, MemberKind::Common | MemberKind::Ridge)), "{kinds:?}");
    let commons = of_kind(&frame, MemberKind::Common);
    assert_eq!(commons.len(), 1, "every common is the same piece");
    // Derivation: 120 in run at the common's factor; the layout from corner
    // 1 puts lines at 16 in steps strictly inside the 480 in wall (29 of
    // them), plus a gable-end rafter flush inside each end wall; two sides.
    assert_abs_diff_eq!(commons[0].theoretical_length, 120.0 * per_run(r), epsilon = 1e-9);
    assert_eq!(commons[0].count, 2 * (29 + 2));
    let xs: Vec<f64> =
        frame.pieces.iter().filter(|p| p.kind == MemberKind::Common).map(|p| p.plan_line[0].x).collect();
    assert!(xs.iter().any(|x| (x - 0.75).abs() < 1e-9) && xs.iter().any(|x| (x - 479.25).abs() < 1e-9));
    // The ridge runs wall line to wall line, split in two within 24 ft stock.
    let ridge_total: f64 =
        of_kind(&frame, MemberKind::Ridge).iter().map(|m| m.overall_length * m.count as f64).sum();
    assert_abs_diff_eq!(ridge_total, 480.0, epsilon = 1e-9);
    assert_joints_fit(&frame);
}

#[test]
fn solved_gable_roof_frames_the_same() {
    let r = 5.0 / 12.0;
    let o = outline(
        &[dvec2(0.0, 0.0), dvec2(480.0, 0.0), dvec2(480.0, 240.0), dvec2(0.0, 240.0)],
        &[r, 0.0, r, 0.0],
        12.0,
    );
    let roof = Roof::solve(&o).unwrap();
    let solved = frame_roof(&o, &roof, &spaced(16.0)).unwrap();
    let (o2, hand) = rect_gable(480.0, 240.0, r, 12.0);
    let by_hand = frame_roof(&o2, &hand, &spaced(16.0)).unwrap();
    assert_eq!(solved.members.len(), by_hand.members.len());
    for (a, b) in solved.members.iter().zip(&by_hand.members) {
        assert_eq!(a.label, b.label);
        assert_eq!(a.count, b.count);
        assert_abs_diff_eq!(a.overall_length, b.overall_length, epsilon = 1e-6);
    }
    assert_joints_fit(&solved);
}
