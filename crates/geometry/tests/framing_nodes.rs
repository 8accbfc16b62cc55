//! Crowded nodes, solved by the roof solver: jacks that would land where a
//! hip or valley is cut back at one of its ends, or notched over a plate.

mod framing_support;

use framing_support::{assert_joints_fit, outline};
use glam::dvec2;
use pitchframe_geometry::framing::{FramingSettings, FramingWarning, MemberKind, frame_roof};
use pitchframe_geometry::{Roof, check_roof};

/// Invented: a U of a 45 ft x 14 ft 1 in block with a 12 ft wing up its
/// west end and a 16 ft wing up its east end, both reaching 42 ft 8 in from
/// the block's south wall, the whole east side a gable, all else 12/12.
fn u_plan() -> pitchframe_geometry::Outline {
    let corners = [
        dvec2(0.0, 0.0),
        dvec2(540.0, 0.0),
        dvec2(540.0, 512.0),
        dvec2(348.0, 512.0),
        dvec2(348.0, 169.0),
        dvec2(144.0, 169.0),
        dvec2(144.0, 512.0),
        dvec2(0.0, 512.0),
    ];
    outline(&corners, &[1.0, 0.0, 1.0, 1.0, 1.0, 1.0, 1.0, 1.0], 12.0)
}

#[test]
fn no_jack_lands_where_a_hip_foot_is_cut_back() {
    let o = u_plan();
    let roof = Roof::solve(&o).unwrap_or_else(|e| panic!("solve: {e}"));
    assert!(check_roof(&o, &roof).is_empty());
    // The west wing's ridge (x = 72, half the 144 in wing) ends where the
    // valley from the inside corner (144, 169) meets it at 45 degrees:
    // (72, 169 - 72) = (72, 97). From there a hip rises at 45 degrees to
    // the block's ridge (y = 169 / 2) at (84.5, 84.5). Derivation.
    let foot = roof
        .lines
        .iter()
        .find(|l| {
            let (lo, hi) = if l.from.z < l.to.z { (l.from, l.to) } else { (l.to, l.from) };
            lo.truncate().distance(dvec2(72.0, 97.0)) < 1e-6
                && hi.truncate().distance(dvec2(84.5, 84.5)) < 1e-6
        })
        .map(|l| l.kind);
    assert_eq!(foot, Some(pitchframe_geometry::RoofLineKind::Hip));

    let frame = frame_roof(&o, &roof, &FramingSettings::default()).unwrap_or_else(|e| panic!("frame: {e}"));
    assert_joints_fit(&frame);
    let (depth, a, b) = framing_support::parry_fit::worst_interference(&frame);
    assert!(depth < 1.0 / 64.0, "{a} and {b} overlap by {depth} in");
    // Jacks off the west wall (x = 0) lie at whole 24 in spaces from
    // corner 0: y = 96 and y = 72 reach that hip. Derivation of the cut
    // back: the valley meets the hip square, so the hip's foot is cut
    // square to it at the valley's side face, 3/4 in along the hip from the
    // node (1-1/2 in valley). The hip's face toward the west wall runs 3/4
    // in off its centre line, so that face starts at
    // y = 97 - 0.75 sin 45 - 0.75 sin 45 = 95.94. A jack at y = 96 spans
    // y 95.25 to 96.75: its cheek's upper part would hang past the hip's
    // foot with nothing to bear on (flagged as a hip too shallow), so it is
    // left out. The jack at y = 72 bears on
    // the hip's full face and stays.
    let jacks_at = |y: f64| {
        frame
            .pieces
            .iter()
            .filter(|p| p.kind == MemberKind::HipJack)
            .filter(|p| p.plan_line[0].x.abs() < 1e-6 && (p.plan_line[0].y - y).abs() < 1e-6)
            .count()
    };
    assert_eq!(jacks_at(96.0), 0);
    assert!(!frame.warnings.iter().any(|w| matches!(w, FramingWarning::HipTooShallow { .. })));
    assert_eq!(jacks_at(72.0), 1);
}
