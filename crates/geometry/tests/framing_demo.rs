//! The built-in demo house framed end to end.

mod framing_support;

use framing_support::assert_joints_fit;
use pitchframe_geometry::framing::{FramingSettings, FramingWarning, MemberKind, frame_roof};
use pitchframe_geometry::{Plan, Roof, demo_plan};

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

#[test]
fn demo_house_cripples_shorten_by_two_spaces() {
    let plan = demo_plan().unwrap();
    let outline = plan.outline().unwrap();
    let roof = Roof::solve(&outline).unwrap();
    let settings = FramingSettings::default();
    let frame = frame_roof(&outline, &roof, &settings).unwrap();
    let mut cripples: Vec<&pitchframe_geometry::Member> =
        frame.members.iter().filter(|m| m.kind == MemberKind::CrippleJack).collect();
    assert!(cripples.len() >= 2);
    cripples.sort_by(|a, b| a.run.total_cmp(&b.run));
    // Derivation: the cripples run square to the 6/12 north eave between
    // a valley and a hip that are square to each other at 45 degrees, so
    // each space along the wall takes a space off both ends: consecutive
    // runs differ by twice the spacing, lengths by that at the common's
    // factor sqrt(1 + 0.5^2); both cheeks are cut 45 deg on the face.
    for w in cripples.windows(2) {
        approx::assert_abs_diff_eq!(w[1].run - w[0].run, 2.0 * settings.spacing_in, epsilon = 1e-9);
    }
    for c in cripples {
        approx::assert_abs_diff_eq!(c.theoretical_length, c.run * 1.25f64.sqrt(), epsilon = 1e-9);
        let cheeks: Vec<f64> = c
            .cuts
            .iter()
            .filter_map(|cut| match cut {
                pitchframe_geometry::framing::Cut::Cheek { face_bevel_deg, .. } => Some(*face_bevel_deg),
                _ => None,
            })
            .collect();
        assert_eq!(cheeks.len(), 2, "{}: {:?}", c.label, c.cuts);
        for b in cheeks {
            approx::assert_abs_diff_eq!(b, 45.0, epsilon = 1e-9);
        }
    }
}

/// The demo house and the example plans have no ridge end in any valley
/// jack's board: no jack is moved off the layout or left out for one (the
/// check must not fire where the layout is clear), and their joints fit.
#[test]
fn no_jack_is_moved_off_the_layout_where_no_ridge_end_is_in_the_way() {
    let plans = [
        ("demo", demo_plan().unwrap()),
        (
            "hillside cottage",
            Plan::from_toml(include_str!("../../../examples/hillside-cottage.toml")).unwrap(),
        ),
        ("metric bungalow", Plan::from_toml(include_str!("../../../examples/metric-bungalow.toml")).unwrap()),
    ];
    for (name, plan) in plans {
        let outline = plan.outline().unwrap();
        let roof = Roof::solve(&outline).unwrap();
        let frame = frame_roof(&outline, &roof, &plan.framing_settings().unwrap()).unwrap();
        let moved: Vec<_> = frame
            .warnings
            .iter()
            .filter(|w| {
                matches!(
                    w,
                    FramingWarning::JackMovedOffLayout { .. } | FramingWarning::JackLeftOutAtRidgeEnd { .. }
                )
            })
            .collect();
        assert!(moved.is_empty(), "{name}: {moved:?}");
        assert!(frame.members.iter().any(|m| m.kind == MemberKind::ValleyJack) || name != "demo");
        assert_joints_fit(&frame);
    }
}
