//! The built-in demo house framed end to end.

mod framing_support;

use framing_support::assert_joints_fit;
use pitchframe_geometry::framing::{FramingSettings, FramingWarning, MemberKind, frame_roof};
use pitchframe_geometry::{Roof, demo_plan};

#[test]
fn demo_house_frames_every_member_kind_and_every_joint_fits() {
    let plan = demo_plan().unwrap();
    let outline = plan.outline().unwrap();
    let roof = Roof::solve(&outline).unwrap();
    let frame = frame_roof(&outline, &roof, &FramingSettings::default()).unwrap();
    let kinds: Vec<MemberKind> = frame.members.iter().map(|m| m.kind).collect();
    for kind in [
        MemberKind::Ridge,
        MemberKind::Common,
        MemberKind::KingCommon,
        MemberKind::Hip,
        MemberKind::Valley,
        MemberKind::HipJack,
        MemberKind::ValleyJack,
        MemberKind::CrippleJack,
    ] {
        assert!(kinds.contains(&kind), "no {kind:?} in {kinds:?}");
    }
    assert_joints_fit(&frame);
    // Derivation: a 2x10 hip seated at a 2x8 common's heel notches past a
    // third of its depth; the 6/12 jacks meet the hips of the 9/12 end at
    // atan(9 / 6) = 56.31 deg in plan (trade.md section 5), past a 45 deg
    // saw. Both are flagged.
    assert!(
        frame
            .warnings
            .iter()
            .any(|w| matches!(w, FramingWarning::NotchTooDeep { label, .. } if label.starts_with('H')))
    );
    assert!(frame.warnings.iter().any(|w| matches!(w, FramingWarning::BevelBeyondSaw { bevel_deg, .. } if (*bevel_deg - 56.30993).abs() < 1e-4)));
}
