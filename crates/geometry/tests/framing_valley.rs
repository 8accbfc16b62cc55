//! An L-shaped hip roof: a valley, valley jacks and ridges meeting.

mod framing_support;

use approx::assert_abs_diff_eq;
use framing_support::{assert_joints_fit, l_hip, of_kind, per_run, spaced};
use pitchframe_geometry::framing::{Cut, CutEnd, FramingWarning, MemberKind, frame_roof};

#[test]
fn l_roof_has_a_valley_and_valley_jacks_that_fit() {
    for rise in [4.0, 6.0, 9.0, 12.0] {
        let r = rise / 12.0;
        let (outline, roof) = l_hip(288.0, r, 12.0);
        let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
        let valleys = of_kind(&frame, MemberKind::Valley);
        assert_eq!(valleys.len(), 1);
        let valley = valleys[0];
        // Derivation: the valley runs 144 in of common run at 45 degrees, so
        // its theoretical length is 12 ft of run at the hip/valley factor
        // sqrt(288 + R^2) per foot (trade.md section 2).
        assert_abs_diff_eq!(valley.theoretical_length, 12.0 * (288.0 + rise * rise).sqrt(), epsilon = 1e-9);
        // Its top bears on both ridge boards: a double cheek.
        assert!(matches!(valley.cuts.iter().find(|c| c.end() == CutEnd::Top), Some(Cut::DoubleCheek { .. })));

        // Valley jacks run from the valley to the ridge; at 16 in centres they
        // differ by 16 in of run at the common's factor (trade.md section 2,
        // line 3), and their lower cheek is cut 45 deg on the face.
        let jacks = of_kind(&frame, MemberKind::ValleyJack);
        assert!(jacks.len() >= 3, "{} valley jacks", jacks.len());
        let mut lengths: Vec<f64> = jacks.iter().map(|j| j.theoretical_length).collect();
        lengths.sort_by(f64::total_cmp);
        lengths.dedup_by(|a, b| (*a - *b).abs() < 1e-6);
        for w in lengths.windows(2) {
            assert_abs_diff_eq!(w[1] - w[0], 16.0 * per_run(r), epsilon = 1e-9);
        }
        for j in &jacks {
            let Some(Cut::Cheek { face_bevel_deg, plan_deduction_in, .. }) =
                j.cuts.iter().find(|c| c.end() == CutEnd::Bottom)
            else {
                panic!("{} has no cheek at the valley: {:?}", j.label, j.cuts)
            };
            assert_abs_diff_eq!(*face_bevel_deg, 45.0, epsilon = 1e-9);
            // Half the valley's 45-degree thickness (trade.md section 6).
            assert_abs_diff_eq!(*plan_deduction_in, 0.75 * 2f64.sqrt(), epsilon = 1e-9);
        }
        assert_joints_fit(&frame);
        // A 2x8's plumb cut, 7-1/4 / cos(theta), is deeper than the 2x10
        // ridge (9-1/4) from about 10.2 in 12 up: then and only then the
        // ridge is flagged as too shallow.
        let plumb_cut = 7.25 * per_run(r);
        let flagged = frame.warnings.iter().any(|w| matches!(w, FramingWarning::RidgeTooShallow { .. }));
        assert_eq!(flagged, plumb_cut > 9.25, "{:?}", frame.warnings);
        assert!(
            frame.warnings.iter().all(|w| matches!(
                w,
                FramingWarning::NotchTooDeep { .. }
                    | FramingWarning::BevelBeyondSaw { .. }
                    | FramingWarning::RidgeTooShallow { .. }
            )),
            "{:?}",
            frame.warnings
        );
    }
}

#[test]
fn valley_sits_at_the_commons_heel_undropped() {
    let r = 0.5;
    let (outline, roof) = l_hip(288.0, r, 12.0);
    let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
    let heel_of = |kind| {
        of_kind(&frame, kind)[0]
            .cuts
            .iter()
            .find_map(|c| match c {
                Cut::Seat { heel_height_in, drop_in, .. } => Some((*heel_height_in, *drop_in)),
                _ => None,
            })
            .unwrap()
    };
    // trade.md sections 4 and 6: a valley's centre line lies in both
    // planes, so it seats at the commons' heel with no drop.
    let (common_heel, _) = heel_of(MemberKind::Common);
    let (valley_heel, valley_drop) = heel_of(MemberKind::Valley);
    assert_abs_diff_eq!(valley_heel, common_heel, epsilon = 1e-9);
    assert_abs_diff_eq!(valley_drop, 0.0, epsilon = 1e-12);
}
