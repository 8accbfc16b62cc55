//! The framing-square figures printed for hips and valleys: the trade
//! holds a hip's plumb and seat lines on its own unit run, not on 12.

mod framing_support;

use framing_support::{l_hip, of_kind, rect_hip, spaced};
use pitchframe_geometry::framing::{Cut, MemberKind, frame_roof};
use pitchframe_geometry::{Frame, Member};

/// Every plumb-line square a member's cuts give (seat, plumb ends, tails).
fn plumb_squares(m: &Member) -> Vec<[f64; 2]> {
    m.cuts
        .iter()
        .filter_map(|c| match c {
            Cut::Seat { square, .. } | Cut::Plumb { square, .. } | Cut::Tail { square, .. } => Some(*square),
            _ => None,
        })
        .collect()
}

fn frame_of(o: &pitchframe_geometry::Outline, roof: &pitchframe_geometry::Roof) -> Frame {
    frame_roof(o, roof, &spaced(16.0)).unwrap_or_else(|e| panic!("frame: {e}"))
}

#[test]
fn a_regular_hip_is_held_at_17_and_the_common_rise() {
    let (o, roof) = rect_hip(480.0, 288.0, 0.5, 0.5, 16.0);
    let frame = frame_of(&o, &roof);
    let hips = of_kind(&frame, MemberKind::Hip);
    assert!(!hips.is_empty());
    for hip in hips {
        let squares = plumb_squares(hip);
        // Seat and tail at least.
        assert!(squares.len() >= 2, "{}: {:?}", hip.label, hip.cuts);
        for square in squares {
            // A regular hip runs 12 sqrt 2 = 16.97 for each 12 of common
            // run (trade.md section 2), held at 17 on the square, against
            // the common's rise of 6 at 6/12: 17 and 6 (common practice, no
            // source).
            assert_eq!(square, [17.0, 6.0], "{}", hip.label);
        }
    }
    // Commons keep 12 and their rise per foot.
    for c in of_kind(&frame, MemberKind::Common) {
        for square in plumb_squares(c) {
            assert_eq!(square, [12.0, 6.0], "{}", c.label);
        }
    }
}

#[test]
fn a_regular_valley_is_held_at_17_and_the_common_rise() {
    // 8/12 all round: 17 and 8.
    let (o, roof) = l_hip(288.0, 8.0 / 12.0, 16.0);
    let frame = frame_of(&o, &roof);
    let valleys = of_kind(&frame, MemberKind::Valley);
    assert!(!valleys.is_empty());
    for v in valleys {
        let squares = plumb_squares(v);
        assert!(!squares.is_empty(), "{}: {:?}", v.label, v.cuts);
        for square in squares {
            // Derivation as for the hip: 16.97 read as 17, rise 8.
            assert_eq!(square[0], 17.0, "{}", v.label);
            assert!((square[1] - 8.0).abs() < 1e-9, "{}: {square:?}", v.label);
        }
    }
}

#[test]
fn an_irregular_hip_is_held_on_its_unit_run_for_the_flatter_common() {
    // Long sides 8/12, ends 12/12.
    let (o, roof) = rect_hip(480.0, 288.0, 8.0 / 12.0, 1.0, 16.0);
    let frame = frame_of(&o, &roof);
    let hips = of_kind(&frame, MemberKind::Hip);
    assert!(!hips.is_empty());
    for hip in hips {
        assert!(!plumb_squares(hip).is_empty(), "{}", hip.label);
        for square in plumb_squares(hip) {
            // Derivation: while the 8/12 common runs 12 and rises 8, the
            // 12/12 common rises the same 8 in a run of 8, so the hip's plan
            // run for that rise is the diagonal sqrt(12^2 + 8^2) = 14.42,
            // read on the square to the nearest sixteenth as 14-7/16,
            // against the 8/12 common's rise of 8.
            assert_eq!(square, [14.0 + 7.0 / 16.0, 8.0], "{}", hip.label);
            // The same line as the hip's pitch (trade.md section 5:
            // tan = (8 x 12 / 12) / sqrt(8^2 + 12^2) = 0.5547), within the
            // sixteenth the figure is read to.
            let pitch = 8.0 / (12.0f64 * 12.0 + 8.0 * 8.0).sqrt();
            assert!((square[1] / square[0] - pitch).abs() < 0.002, "{square:?}");
            assert!((hip.rise_per_run - pitch).abs() < 1e-9);
        }
    }
}
