//! A rectangle hip roof framed and checked against published rafter-table
//! values and the closed-form trade formulas.

mod framing_support;

use approx::assert_abs_diff_eq;
use framing_support::{of_kind, per_run, rect_hip, spaced};
use pitchframe_geometry::framing::{Cut, CutEnd, FramingSettings, FramingWarning, MemberKind, frame_roof};

const SIXTEENTH: f64 = 1.0 / 16.0;

#[test]
fn navedtra_common_at_7_in_12_on_16_ft_span() {
    let (outline, roof) = rect_hip(480.0, 192.0, 7.0 / 12.0, 7.0 / 12.0, 12.0);
    let frame = frame_roof(&outline, &roof, &FramingSettings::default()).unwrap();
    let common = of_kind(&frame, MemberKind::Common)[0];
    // NAVEDTRA 14044 Builder 3 & 2 Vol. 2, rafters: 13.89 x 8 = 111-1/8 in.
    assert_abs_diff_eq!(common.theoretical_length, 111.125, epsilon = SIXTEENTH);
}

#[test]
fn en0069_common_at_13_in_12_on_20_ft_8_in_span() {
    let (outline, roof) = rect_hip(600.0, 248.0, 13.0 / 12.0, 13.0 / 12.0, 12.0);
    let frame = frame_roof(&outline, &roof, &FramingSettings::default()).unwrap();
    let common = of_kind(&frame, MemberKind::Common)[0];
    // US Army EN0069 Frame Structures: 17.69 x 10-1/3 = 182.8 in.
    assert_abs_diff_eq!(common.theoretical_length, 182.8, epsilon = 0.05);
}

#[test]
fn navedtra_hip_at_8_in_12_with_15_ft_run_and_jacks_at_16_in() {
    let (outline, roof) = rect_hip(720.0, 360.0, 8.0 / 12.0, 8.0 / 12.0, 12.0);
    let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
    let hips = of_kind(&frame, MemberKind::Hip);
    assert_eq!(hips.len(), 1, "the four hips of a regular roof are one member");
    assert_eq!(hips[0].count, 4);
    // NAVEDTRA 14044: hip run 21.21 ft, hip length 23.45 ft.
    assert_abs_diff_eq!(hips[0].run / 12.0, 21.21, epsilon = 0.005);
    assert_abs_diff_eq!(hips[0].theoretical_length / 12.0, 23.45, epsilon = 0.005);
    // NAVEDTRA 14044: jacks at 8/12 on 16 in centres differ by 19-1/4
    // (19.23) in.
    // The jacks on wall 1 between corner 1 and the first hip.
    let length_of = |label: &str| frame.members.iter().find(|m| m.label == label).unwrap().theoretical_length;
    let mut jacks: Vec<f64> = frame
        .pieces
        .iter()
        .filter(|p| {
            p.kind == MemberKind::HipJack && p.plan_line[0].y.abs() < 1e-9 && p.plan_line[0].x < 180.0
        })
        .map(|p| length_of(&p.label))
        .collect();
    jacks.sort_by(f64::total_cmp);
    assert!(jacks.len() >= 5);
    for pair in jacks.windows(2) {
        assert_abs_diff_eq!(pair[1] - pair[0], 19.23, epsilon = 0.005);
    }
}

#[test]
fn regular_jacks_cut_at_45_on_the_face_at_every_pitch() {
    for rise in [3.0, 4.0, 6.0, 8.0, 12.0, 18.0] {
        let slope = rise / 12.0;
        let (outline, roof) = rect_hip(600.0, 300.0, slope, slope, 12.0);
        let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
        for jack in of_kind(&frame, MemberKind::HipJack) {
            let Some(Cut::Cheek { face_bevel_deg, .. }) = jack.cuts.iter().find(|c| c.end() == CutEnd::Top)
            else {
                panic!("{} has no cheek cut at the top", jack.label);
            };
            // trade.md section 3: the circular-saw bevel along the plumb
            // line equals the plan angle, 45 deg for a regular hip.
            assert_abs_diff_eq!(*face_bevel_deg, 45.0, epsilon = 1e-9);
        }
    }
}

#[test]
fn side_cut_figures_at_4_in_12() {
    let slope = 4.0 / 12.0;
    let (outline, roof) = rect_hip(600.0, 300.0, slope, slope, 12.0);
    let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
    let jack = of_kind(&frame, MemberKind::HipJack)[0];
    let Some(Cut::Cheek { square, .. }) = jack.cuts.iter().find(|c| c.end() == CutEnd::Top) else { panic!() };
    // Common practice, no source: the 4 in 12 jack side cut reads 11 3/8.
    assert_abs_diff_eq!(square[1], 11.375, epsilon = SIXTEENTH / 2.0);
    let hip = of_kind(&frame, MemberKind::Hip)[0];
    let Some(Cut::DoubleCheek { left, right, .. }) = hip.cuts.iter().find(|c| c.end() == CutEnd::Top) else {
        panic!("hip top is not a double cheek: {:?}", hip.cuts)
    };
    // Common practice, no source: the 4 in 12 hip side cut reads 11 11/16.
    for face in [left, right] {
        let sq = face.top_edge_square.unwrap();
        assert_abs_diff_eq!(sq[1], 11.0 + 11.0 / 16.0, epsilon = SIXTEENTH / 2.0);
    }
}

#[test]
fn numbers_read_off_the_solids_match_the_closed_form_formulas() {
    for rise in [4.0, 6.0, 8.0, 12.0] {
        let r = rise / 12.0;
        let settings = FramingSettings::default();
        let (outline, roof) = rect_hip(720.0, 300.0, r, r, 16.0);
        let frame = frame_roof(&outline, &roof, &settings).unwrap();
        let lc = per_run(r);
        let cos = 1.0 / lc;
        let d = settings.rafter.depth_in;
        let w = settings.seat_width_in;
        // trade.md section 6: HAP = d / cos(theta) - w R / 12; notch square
        // to the edge = w sin(theta).
        let hap = d / cos - w * r;
        let common = of_kind(&frame, MemberKind::Common)[0];
        let Some(Cut::Seat { heel_height_in, notch_depth_in, seat_width_in, .. }) =
            common.cuts.iter().find(|c| matches!(c, Cut::Seat { .. }))
        else {
            panic!()
        };
        assert_abs_diff_eq!(*heel_height_in, hap, epsilon = 1e-9);
        assert_abs_diff_eq!(*notch_depth_in, w * r / lc, epsilon = 1e-9);
        assert_abs_diff_eq!(*seat_width_in, w, epsilon = 1e-9);
        // Run 150 in; deduction at the ridge half the ridge thickness in plan.
        assert_abs_diff_eq!(common.theoretical_length, 150.0 * lc, epsilon = 1e-9);
        assert_abs_diff_eq!(common.seat_to_top_cut, (150.0 - 0.75) * lc, epsilon = 1e-9);
        assert_abs_diff_eq!(common.long_point_length, common.short_point_length, epsilon = 1e-9);
        // Tail: 16 in overhang at the common's length per run.
        assert_abs_diff_eq!(common.tail_length, 16.0 * lc, epsilon = 1e-9);
        let Some(Cut::Plumb { square, .. }) = common.cuts.iter().find(|c| c.end() == CutEnd::Top) else {
            panic!()
        };
        assert_abs_diff_eq!(square[1], rise, epsilon = 1e-9);

        // Jacks: the cheek's plan deduction is half the hip's 45-degree
        // thickness, 1.06 in for a 1-1/2 in hip; top-edge line
        // tan(phi) = tan(45) / cos(theta); edge bevel sin B = cos 45 sin theta.
        for jack in of_kind(&frame, MemberKind::HipJack) {
            let Some(Cut::Cheek { plan_deduction_in, top_edge_angle_deg, edge_bevel_deg, square, .. }) =
                jack.cuts.iter().find(|c| c.end() == CutEnd::Top)
            else {
                panic!()
            };
            assert_abs_diff_eq!(*plan_deduction_in, 0.75 * 2f64.sqrt(), epsilon = 1e-9);
            assert_abs_diff_eq!(top_edge_angle_deg.to_radians().tan(), lc, epsilon = 1e-9);
            assert_abs_diff_eq!(edge_bevel_deg.to_radians().sin(), (r / lc) / 2f64.sqrt(), epsilon = 1e-9);
            // trade.md section 2 line 5: side cut figure 12 * 12 / Lc.
            assert_abs_diff_eq!(square[1], 12.0 / lc, epsilon = 1e-9);
            // The cheek spans the board: long minus short point is the
            // thickness times the top-edge line's slope.
            assert_abs_diff_eq!(
                jack.long_point_length - jack.short_point_length,
                1.5 * top_edge_angle_deg.to_radians().tan(),
                epsilon = 1e-9
            );
        }

        // Hip: length per foot of common run Lh = sqrt(288 + R^2); backing
        // tan b = R / Lh; its top against the king commons a plan deduction of
        // half the common's 45-degree thickness; heel equals the commons'.
        let hip = of_kind(&frame, MemberKind::Hip)[0];
        let lh = (288.0 + rise * rise).sqrt();
        assert_abs_diff_eq!(hip.theoretical_length, 150.0 * lh / 12.0, epsilon = 1e-9);
        let Some(Cut::Backing { left_deg, right_deg, .. }) =
            hip.cuts.iter().find(|c| matches!(c, Cut::Backing { .. }))
        else {
            panic!()
        };
        let backing = (rise / lh).atan().to_degrees();
        assert_abs_diff_eq!(*left_deg, backing, epsilon = 1e-9);
        assert_abs_diff_eq!(*right_deg, backing, epsilon = 1e-9);
        let Some(Cut::DoubleCheek { plan_deduction_in, left, .. }) =
            hip.cuts.iter().find(|c| c.end() == CutEnd::Top)
        else {
            panic!()
        };
        assert_abs_diff_eq!(*plan_deduction_in, 0.75 * 2f64.sqrt(), epsilon = 1e-9);
        // trade.md section 2 line 6: hip side cut figure 12 * 16.97 / Lh.
        assert_abs_diff_eq!(left.top_edge_square.unwrap()[1], 12.0 * 288f64.sqrt() / lh, epsilon = 1e-9);
        let Some(Cut::Seat { heel_height_in, .. }) = hip.cuts.iter().find(|c| matches!(c, Cut::Seat { .. }))
        else {
            panic!()
        };
        assert_abs_diff_eq!(*heel_height_in, hap, epsilon = 1e-9);

        // End king: half the rafter thickness off its run at the ridge end.
        let kings = of_kind(&frame, MemberKind::KingCommon);
        assert!(!kings.is_empty());
        for king in kings {
            let Some(Cut::Plumb { plan_deduction_in, .. }) =
                king.cuts.iter().find(|c| c.end() == CutEnd::Top)
            else {
                panic!()
            };
            assert_abs_diff_eq!(*plan_deduction_in, 0.75, epsilon = 1e-9);
        }
    }
}

#[test]
fn dropped_hip_drops_by_the_trade_formula() {
    for (rise, published) in [(6.0, 0.265), (8.0, 0.354)] {
        let r = rise / 12.0;
        let settings =
            FramingSettings { hip_top: pitchframe_geometry::framing::HipTop::Dropped, ..Default::default() };
        let (outline, roof) = rect_hip(720.0, 300.0, r, r, 16.0);
        let frame = frame_roof(&outline, &roof, &settings).unwrap();
        let hip = of_kind(&frame, MemberKind::Hip)[0];
        let Some(Cut::Seat { drop_in, .. }) = hip.cuts.iter().find(|c| matches!(c, Cut::Seat { .. })) else {
            panic!()
        };
        // trade.md section 4: (t/2) R / 16.97; a 1-1/2 in hip drops 0.265 in
        // at 6/12 and 0.354 in at 8/12.
        assert_abs_diff_eq!(*drop_in, 0.75 * rise / 288f64.sqrt(), epsilon = 1e-9);
        assert_abs_diff_eq!(*drop_in, published, epsilon = 0.0005);
    }
}

#[test]
fn every_joint_of_a_hip_roof_fits_within_a_64th() {
    let (outline, roof) = rect_hip(720.0, 300.0, 0.5, 0.5, 16.0);
    let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
    assert!(frame.joints.len() > 20);
    for j in &frame.joints {
        assert!(j.max_gap < 1.0 / 64.0 && j.max_overlap < 1.0 / 64.0, "{j:?}");
    }
    // The 2x10 hip seated at the 2x8 commons' heel notches deeper than a
    // third of its depth; nothing else is flagged.
    assert!(
        frame
            .warnings
            .iter()
            .all(|w| matches!(w, FramingWarning::NotchTooDeep { label, .. } if label == "H1")),
        "{:?}",
        frame.warnings
    );
}

#[test]
fn the_parry_check_sees_a_jack_moved_off_its_hip() {
    // The independent check must fail a bad joint: move one jack 1/8 in
    // back from the hip and it reads a 1/8 in gap; push it 1/8 in in and it
    // reads a 1/8 in overlap.
    let (outline, roof) = rect_hip(720.0, 300.0, 0.5, 0.5, 16.0);
    let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
    let joint = frame.joints.iter().find(|j| frame.pieces[j.pieces[0]].kind == MemberKind::HipJack).unwrap();
    let (gap, overlap, _) = framing_support::parry_fit::fit(&frame, joint.pieces[0], joint.pieces[1]);
    assert!(gap < 1e-6 && overlap < 1e-6);
    let cheek = frame.pieces[joint.pieces[0]]
        .solid
        .faces()
        .find(|f| f.tag == pitchframe_geometry::framing::FaceTag::Cheek)
        .unwrap()
        .normal;
    for (shift, want_gap, want_overlap) in [(-0.125, 0.125, 0.0), (0.125, 0.0, 0.125)] {
        let mut moved = frame.clone();
        for part in &mut moved.pieces[joint.pieces[0]].solid.parts {
            for v in &mut part.vertices {
                *v += cheek * shift;
            }
            for f in &mut part.faces {
                for v in &mut f.vertices {
                    *v += cheek * shift;
                }
            }
        }
        let (gap, overlap, _) = framing_support::parry_fit::fit(&moved, joint.pieces[0], joint.pieces[1]);
        assert_abs_diff_eq!(gap, want_gap, epsilon = 1e-6);
        assert_abs_diff_eq!(overlap, want_overlap, epsilon = 1e-6);
    }
}

#[test]
fn hip_tail_runs_at_the_hip_factor_to_the_fascia_corner() {
    for rise in [4.0, 6.0, 9.0, 12.0] {
        let r = rise / 12.0;
        let (outline, roof) = rect_hip(720.0, 300.0, r, r, 16.0);
        let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
        let hip = of_kind(&frame, MemberKind::Hip)[0];
        // trade.md section 6: the tail is the horizontal overhang at the
        // member's own factor; a regular hip's runs 16 in of common run at
        // Lh / 12 per inch to the corner where the fascias meet, ending in a
        // double cheek square to each fascia (45 deg on the face).
        let lh = (288.0 + rise * rise).sqrt();
        assert_abs_diff_eq!(hip.tail_length, 16.0 * lh / 12.0, epsilon = 1e-9);
        let Some(Cut::Tail { faces, .. }) = hip.cuts.iter().find(|c| matches!(c, Cut::Tail { .. })) else {
            panic!()
        };
        assert_eq!(faces.len(), 2);
        for f in faces {
            assert_abs_diff_eq!(f.face_bevel_deg, 45.0, epsilon = 1e-9);
        }
    }
}
