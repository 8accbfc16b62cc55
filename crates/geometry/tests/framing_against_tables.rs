//! The numbers read off the solids agree with the closed-form rafter table
//! and compound-cut formulas, computed independently.

mod framing_support;

use approx::assert_abs_diff_eq;
use framing_support::{of_kind, rect_hip, spaced};
use pitchframe_geometry::framing::{Cut, CutEnd, CutFace, FramingSettings, HipTop, MemberKind, frame_roof};
use pitchframe_geometry::{CompoundCut, Length, Pitch, RafterTable};

fn same_angles(face: &CutFace, cut: &CompoundCut) {
    let c = cut.closed_form();
    assert_abs_diff_eq!(face.side_angle_deg, c.plumb_line_from_square_rad.to_degrees(), epsilon = 1e-9);
    assert_abs_diff_eq!(
        face.top_edge_angle_deg,
        c.top_edge_line_from_square_rad.to_degrees(),
        epsilon = 1e-9
    );
    assert_abs_diff_eq!(face.face_bevel_deg, c.face_bevel_rad.to_degrees(), epsilon = 1e-9);
    assert_abs_diff_eq!(face.edge_bevel_deg, c.edge_bevel_rad.to_degrees(), epsilon = 1e-9);
    let flat = cut.miter_saw_flat();
    let on_edge = cut.miter_saw_on_edge();
    assert_abs_diff_eq!(face.miter_flat.miter_deg, flat.miter_rad.to_degrees(), epsilon = 1e-9);
    assert_abs_diff_eq!(face.miter_flat.bevel_deg, flat.bevel_rad.to_degrees(), epsilon = 1e-9);
    assert_abs_diff_eq!(face.miter_on_edge.miter_deg, on_edge.miter_rad.to_degrees(), epsilon = 1e-9);
    assert_abs_diff_eq!(face.miter_on_edge.bevel_deg, on_edge.bevel_rad.to_degrees(), epsilon = 1e-9);
}

#[test]
fn regular_hip_roof_agrees_with_the_rafter_table_and_compound_cuts() {
    for rise in [3.0, 4.0, 5.0, 6.0, 7.0, 8.0, 9.0, 10.0, 12.0, 14.0, 16.0] {
        let pitch = Pitch::from_rise_per_run(rise / 12.0).unwrap();
        let table = RafterTable::for_pitch(pitch);
        let r = rise / 12.0;
        let (outline, roof) = rect_hip(720.0, 288.0, r, r, 16.0);
        let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
        let theta = r.atan();

        let common = of_kind(&frame, MemberKind::Common)[0];
        // Run 144 in = 12 ft.
        assert_abs_diff_eq!(common.theoretical_length, 12.0 * table.common_per_foot, epsilon = 1e-9);
        let hip = of_kind(&frame, MemberKind::Hip)[0];
        assert_abs_diff_eq!(hip.theoretical_length, 12.0 * table.hip_per_foot, epsilon = 1e-9);
        assert_abs_diff_eq!(hip.rise_per_run.atan().to_degrees(), table.hip_pitch_deg, epsilon = 1e-9);
        let Some(Cut::Backing { left_deg, .. }) = hip.cuts.iter().find(|c| matches!(c, Cut::Backing { .. }))
        else {
            panic!()
        };
        assert_abs_diff_eq!(*left_deg, table.hip_backing.degrees, epsilon = 1e-9);

        let jack_lengths: Vec<f64> = {
            let mut v: Vec<f64> = frame
                .pieces
                .iter()
                .filter(|p| {
                    p.kind == MemberKind::HipJack && p.plan_line[0].y.abs() < 1e-9 && p.plan_line[0].x < 144.0
                })
                .map(|p| frame.members.iter().find(|m| m.label == p.label).unwrap().theoretical_length)
                .collect();
            v.sort_by(f64::total_cmp);
            v
        };
        for w in jack_lengths.windows(2) {
            assert_abs_diff_eq!(w[1] - w[0], table.jack_diff_16, epsilon = 1e-9);
        }

        let jack = of_kind(&frame, MemberKind::HipJack)[0];
        let Some(Cut::Cheek { face, square, plan_deduction_in, .. }) =
            jack.cuts.iter().find(|c| c.end() == CutEnd::Top)
        else {
            panic!()
        };
        same_angles(face, &CompoundCut::new(theta, 45f64.to_radians()).unwrap());
        assert_abs_diff_eq!(square[1], table.jack_side_cut.figure, epsilon = 1e-9);
        let shortening = RafterTable::jack_shortening_plan(Length::from_inches(1.5)).inches();
        assert_abs_diff_eq!(*plan_deduction_in, shortening, epsilon = 1e-9);

        let Some(Cut::Plumb { face, .. }) = common.cuts.iter().find(|c| c.end() == CutEnd::Top) else {
            panic!()
        };
        same_angles(face, &CompoundCut::new(theta, 0.0).unwrap());

        let Some(Cut::DoubleCheek { left, right, .. }) = hip.cuts.iter().find(|c| c.end() == CutEnd::Top)
        else {
            panic!()
        };
        let hip_cut = CompoundCut::new(hip.rise_per_run.atan(), 45f64.to_radians()).unwrap();
        same_angles(left, &hip_cut);
        same_angles(right, &hip_cut);
        assert_abs_diff_eq!(left.top_edge_square.unwrap()[1], table.hip_side_cut.figure, epsilon = 1e-9);

        let dropped =
            frame_roof(&outline, &roof, &FramingSettings { hip_top: HipTop::Dropped, ..spaced(16.0) })
                .unwrap();
        let hip = of_kind(&dropped, MemberKind::Hip)[0];
        let Some(Cut::Seat { drop_in, .. }) = hip.cuts.iter().find(|c| matches!(c, Cut::Seat { .. })) else {
            panic!()
        };
        assert_abs_diff_eq!(*drop_in, table.hip_drop(Length::from_inches(1.5)).inches(), epsilon = 1e-9);
    }
}
