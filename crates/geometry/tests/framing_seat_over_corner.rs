//! Hips and valleys seated over a wall corner: the seat is cut only over
//! the plates, and past the plates the member keeps its full depth.

mod framing_support;

use approx::assert_abs_diff_eq;
use framing_support::{l_hip, of_kind, rect_hip, spaced};
use pitchframe_geometry::framing::{Cut, FaceTag, FramingSettings, HipTop, MemberKind, frame_roof};

/// The seat cut of the first member of `kind`: (width, heel, notch depth).
fn seat_of(frame: &pitchframe_geometry::Frame, kind: MemberKind) -> (f64, f64, f64) {
    let m = of_kind(frame, kind)[0];
    let Some(Cut::Seat { seat_width_in, heel_height_in, notch_depth_in, .. }) =
        m.cuts.iter().find(|c| matches!(c, Cut::Seat { .. }))
    else {
        panic!("{} has no seat: {:?}", m.label, m.cuts)
    };
    (*seat_width_in, *heel_height_in, *notch_depth_in)
}

#[test]
fn regular_hip_seat_spans_the_plate_diagonal() {
    for hip_top in [HipTop::Backed, HipTop::Dropped] {
        let settings = FramingSettings { hip_top, ..Default::default() };
        let (outline, roof) = rect_hip(720.0, 300.0, 0.5, 0.5, 16.0);
        let frame = frame_roof(&outline, &roof, &settings).unwrap();
        let (width, heel, notch) = seat_of(&frame, MemberKind::Hip);
        // Derivation: a 3-1/2 in plate crossed at 45 degrees is 3.5 / sin 45
        // = 3.5 x sqrt(2) = 4.95 in along the hip, in plan.
        assert_abs_diff_eq!(width, 3.5 * 2f64.sqrt(), epsilon = 1e-6);
        // trade.md section 6: the common's heel (2x8 at 6/12, d / cos - w R
        // / 12), less the drop (t/2) R / 16.97 when dropped (section 4).
        let drop = if hip_top == HipTop::Dropped { 0.75 * 6.0 / 288f64.sqrt() } else { 0.0 };
        let common_heel = 7.25 * 1.25f64.sqrt() - 1.75;
        assert_abs_diff_eq!(heel, common_heel - drop, epsilon = 1e-9);
        // Derivation: at the heel the notch reaches from the plate's top to
        // the bottom edge, d - heel x cos(hip pitch), hip pitch 6 in 16.97.
        let cos_hip = 288f64.sqrt() / 324f64.sqrt();
        assert_abs_diff_eq!(notch, 9.25 - heel * cos_hip, epsilon = 1e-6);
    }
}

#[test]
fn hip_hangs_below_the_plate_inside_the_walls() {
    let (outline, roof) = rect_hip(720.0, 300.0, 0.5, 0.5, 16.0);
    let frame = frame_roof(&outline, &roof, &FramingSettings::default()).unwrap();
    let piece = frame.pieces.iter().find(|p| p.kind == MemberKind::Hip).unwrap();
    let corner = piece.plan_line[0];
    let dir = (piece.plan_line[1] - corner).normalize();
    let lowest_past_plate = piece
        .solid
        .vertices()
        .filter(|p| (p.truncate() - corner).dot(dir) >= 3.5 * 2f64.sqrt() - 1e-6)
        .map(|p| p.z)
        .fold(f64::INFINITY, f64::min);
    // Derivation: the 2x10 hip's bottom at the plate's inner corner is
    // heel - d / cos + 4.95 x 6 / 16.97 below the plate's top; nothing is
    // cut away there (the old seat ran level to 9-3/4 in).
    let cos_hip = 288f64.sqrt() / 324f64.sqrt();
    let heel = 7.25 * 1.25f64.sqrt() - 1.75;
    let bottom = heel - 9.25 / cos_hip + 3.5 * 2f64.sqrt() * 6.0 / 288f64.sqrt();
    assert!(bottom < -1.0);
    assert_abs_diff_eq!(lowest_past_plate, bottom, epsilon = 1e-6);
    // The notch's inner plumb cut bears on the plate's inner face.
    assert!(piece.solid.faces().any(|f| f.tag == FaceTag::Heel && f.vertices.iter().all(|p| p.z <= 1e-6)));
}

#[test]
fn valley_seat_spans_the_plate_diagonal_over_the_inside_corner() {
    for rise in [4.0, 6.0, 9.0, 12.0] {
        let (outline, roof) = l_hip(288.0, rise / 12.0, 12.0);
        let frame = frame_roof(&outline, &roof, &spaced(16.0)).unwrap();
        let (width, _, _) = seat_of(&frame, MemberKind::Valley);
        // Derivation: 3.5 / sin 45 = 4.95 in along the valley, in plan.
        assert_abs_diff_eq!(width, 3.5 * 2f64.sqrt(), epsilon = 1e-6);
    }
}
