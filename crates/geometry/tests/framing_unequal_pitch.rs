//! Hip roofs with unequal pitches: published irregular-hip values and the
//! general vector formulas.

mod framing_support;

use approx::assert_abs_diff_eq;
use framing_support::{assert_joints_fit, of_kind, per_run, rect_hip, spaced};
use pitchframe_geometry::framing::{Cut, FramingSettings, MemberKind, frame_roof};

#[test]
fn irregular_8_and_14_in_12_hip_pitch_and_jack_differences() {
    let (ra, rb) = (8.0 / 12.0, 14.0 / 12.0);
    let (outline, roof) = rect_hip(720.0, 360.0, ra, rb, 12.0);
    let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
    let hip = of_kind(&frame, MemberKind::Hip)[0];
    // Published framing-geometry notes, irregular 8/12 with 14/12: hip
    // pitch 30.0635 deg.
    assert_abs_diff_eq!(hip.rise_per_run.atan().to_degrees(), 30.0635, epsilon = 1e-4);
    assert_eq!(hip.count, 4, "the four hips are mirror images: one member");

    let length_of = |label: &str| frame.members.iter().find(|m| m.label == label).unwrap().theoretical_length;
    let diffs = |on_wall_a: bool| {
        let mut lengths: Vec<f64> = frame
            .pieces
            .iter()
            .filter(|p| p.kind == MemberKind::HipJack)
            .filter(|p| {
                let s = p.plan_line[0];
                if on_wall_a { s.y.abs() < 1e-9 && s.x < 200.0 } else { s.x.abs() < 1e-9 && s.y < 180.0 }
            })
            .map(|p| length_of(&p.label))
            .collect();
        lengths.sort_by(f64::total_cmp);
        lengths.windows(2).map(|w| w[1] - w[0]).collect::<Vec<f64>>()
    };
    // Same notes: jack differences at 16 in centres 2.80432 ft (33.65 in)
    // on the 8/12 side and 1.17074 ft (14.05 in) on the 14/12 side.
    let a = diffs(true);
    let b = diffs(false);
    assert!(a.len() >= 3 && b.len() >= 3);
    for d in a {
        assert_abs_diff_eq!(d, 2.80432 * 12.0, epsilon = 1e-3);
    }
    for d in b {
        assert_abs_diff_eq!(d, 1.17074 * 12.0, epsilon = 1e-3);
    }
}

#[test]
fn unequal_pitch_hip_follows_the_vector_formulas() {
    for (rise_a, rise_b) in [(8.0, 14.0), (6.0, 9.0), (12.0, 5.0)] {
        let (ra, rb) = (rise_a / 12.0, rise_b / 12.0);
        let (outline, roof) = rect_hip(720.0, 300.0, ra, rb, 12.0);
        let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
        let piece = frame
            .pieces
            .iter()
            .find(|p| p.kind == MemberKind::Hip && p.plan_line[0].length() < 1e-9)
            .unwrap();
        let dir = piece.plan_line[1] - piece.plan_line[0];
        // trade.md section 5: plan angle from the A plate tan(beta_A) = R_b / R_a.
        assert_abs_diff_eq!(dir.y / dir.x, rb / ra, epsilon = 1e-9);
        // Hip pitch tan = (R_a R_b / 12) / sqrt(R_a^2 + R_b^2), in rise per run.
        let hip = frame.members.iter().find(|m| m.label == piece.label).unwrap();
        assert_abs_diff_eq!(hip.rise_per_run, ra * rb / (ra * ra + rb * rb).sqrt(), epsilon = 1e-9);
        // trade.md section 4: each side backed at sin b = sin(theta) cos(beta),
        // beta the plan angle between the hip and that side's plate.
        let beta_a = dir.y.atan2(dir.x);
        let beta_b = std::f64::consts::FRAC_PI_2 - beta_a;
        let Some(Cut::Backing { left_deg, right_deg, .. }) =
            hip.cuts.iter().find(|c| matches!(c, Cut::Backing { .. }))
        else {
            panic!()
        };
        let sin_theta = |r: f64| r / per_run(r);
        let expect_a = (sin_theta(ra) * beta_a.cos()).asin().to_degrees();
        let expect_b = (sin_theta(rb) * beta_b.cos()).asin().to_degrees();
        let mut got = [*left_deg, *right_deg];
        let mut want = [expect_a, expect_b];
        got.sort_by(f64::total_cmp);
        want.sort_by(f64::total_cmp);
        assert_abs_diff_eq!(got[0], want[0], epsilon = 1e-9);
        assert_abs_diff_eq!(got[1], want[1], epsilon = 1e-9);
        // Jacks on the A side meet the hip's face at beta_a from their square
        // line, so the face bevel is beta_a (trade.md section 3).
        let jack = frame
            .pieces
            .iter()
            .find(|p| {
                p.kind == MemberKind::HipJack && p.plan_line[0].y.abs() < 1e-9 && p.plan_line[0].x < 100.0
            })
            .unwrap();
        let jack = frame.members.iter().find(|m| m.label == jack.label).unwrap();
        let Some(Cut::Cheek { face_bevel_deg, .. }) =
            jack.cuts.iter().find(|c| matches!(c, Cut::Cheek { .. }))
        else {
            panic!()
        };
        assert_abs_diff_eq!(*face_bevel_deg, beta_a.to_degrees(), epsilon = 1e-9);
        assert_joints_fit(&frame);
    }
}

#[test]
fn regular_hip_roof_joints_fit_by_parry() {
    for (r, settings) in [
        (0.5, spaced(16.0)),
        (8.0 / 12.0, FramingSettings::default()),
        (
            1.0,
            FramingSettings {
                hip_top: pitchframe_geometry::framing::HipTop::Dropped,
                ..FramingSettings::default()
            },
        ),
    ] {
        let (outline, roof) = rect_hip(720.0, 300.0, r, r, 16.0);
        let frame = frame_roof(&outline, &roof, &settings).unwrap();
        assert_joints_fit(&frame);
    }
}

#[test]
fn irregular_hip_drops_by_the_larger_side() {
    let (ra, rb) = (8.0 / 12.0, 14.0 / 12.0);
    let settings = FramingSettings {
        hip_top: pitchframe_geometry::framing::HipTop::Dropped,
        ..FramingSettings::default()
    };
    let (outline, roof) = rect_hip(720.0, 360.0, ra, rb, 12.0);
    let frame = frame_roof(&outline, &roof, &settings).unwrap();
    let hip = of_kind(&frame, MemberKind::Hip)[0];
    let Some(Cut::Seat { drop_in, .. }) = hip.cuts.iter().find(|c| matches!(c, Cut::Seat { .. })) else {
        panic!()
    };
    // trade.md section 4: each side drops (t/2) tan(theta) cos(beta), beta
    // the plan angle between the hip and that side's plate
    // (tan beta_A = R_b / R_a); a dropped irregular hip takes the larger.
    let beta_a = (rb / ra).atan();
    let beta_b = std::f64::consts::FRAC_PI_2 - beta_a;
    let larger = (0.75 * ra * beta_a.cos()).max(0.75 * rb * beta_b.cos());
    assert_abs_diff_eq!(*drop_in, larger, epsilon = 1e-9);
    assert_joints_fit(&frame);
}
