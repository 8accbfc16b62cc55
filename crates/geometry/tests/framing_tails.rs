//! Hip and valley tails follow the tail setting as the commons do.

mod framing_support;

use framing_support::{assert_joints_fit, l_hip, of_kind, rect_hip, spaced};
use glam::DVec3;
use pitchframe_geometry::framing::{Cut, FaceTag, FramingSettings, MemberKind, TailCut, frame_roof};
use pitchframe_geometry::{Frame, Outline, Roof};

fn framed(o: &Outline, roof: &Roof, tail: TailCut) -> Frame {
    let settings = FramingSettings { tail, ..spaced(16.0) };
    frame_roof(o, roof, &settings).unwrap_or_else(|e| panic!("frame: {e}"))
}

/// Outward normals of the tail faces of every piece of `kind`.
fn tail_normals(frame: &Frame, kind: MemberKind) -> Vec<DVec3> {
    frame
        .pieces
        .iter()
        .filter(|p| p.kind == kind)
        .flat_map(|p| p.solid.faces().filter(|f| f.tag == FaceTag::Tail).map(|f| f.normal))
        .collect()
}

fn tail_style(m: &pitchframe_geometry::Member) -> Option<TailCut> {
    m.cuts.iter().find_map(|c| match c {
        Cut::Tail { style, .. } => Some(*style),
        _ => None,
    })
}

/// Every tail face of `kind` lies square to some rafter's tail: the
/// commons (kings, jacks) of one plane all end on one plane square to their
/// edges through the fascia line, and a hip or valley side ends on the
/// same one.
fn ends_flush_with_the_commons(frame: &Frame, kind: MemberKind) {
    let commons: Vec<DVec3> = [MemberKind::Common, MemberKind::KingCommon, MemberKind::HipJack]
        .into_iter()
        .flat_map(|k| tail_normals(frame, k))
        .collect();
    let ends = tail_normals(frame, kind);
    assert!(!ends.is_empty());
    for n in ends {
        assert!(
            commons.iter().any(|c| c.dot(n) > 1.0 - 1e-9),
            "{kind:?} tail face {n:?} matches no common's"
        );
    }
}

#[test]
fn a_hips_tail_is_cut_square_when_the_commons_are() {
    let (o, roof) = rect_hip(480.0, 288.0, 0.5, 0.5, 16.0);
    let square = framed(&o, &roof, TailCut::Square);
    let plumb = framed(&o, &roof, TailCut::Plumb);
    assert_joints_fit(&square);
    for hip in of_kind(&square, MemberKind::Hip) {
        assert_eq!(tail_style(hip), Some(TailCut::Square), "{}", hip.label);
        // Derivation: each side's square tail plane passes through that
        // side's fascia line at the rafters' top, as the plumb fascia plane
        // does, so on the hip's top centre line both meet at the fascia
        // corner: a plan run of 16 sqrt 2 at sqrt(1 + (6 / 16.97)^2) per
        // unit run, 16 x 1.5 = 24 in.
        approx::assert_abs_diff_eq!(hip.tail_length, 24.0, epsilon = 1e-9);
    }
    ends_flush_with_the_commons(&square, MemberKind::Hip);
    // Derivation: from the same top corner a plumb line runs down and out
    // along the falling member, so it meets the bottom edge further out
    // than a cut square to the edge: square tails take shorter stock.
    let long = |f: &Frame| of_kind(f, MemberKind::Hip).iter().map(|m| m.overall_length).fold(0.0, f64::max);
    assert!(long(&square) < long(&plumb) - 0.5, "{} vs {}", long(&square), long(&plumb));
    // With plumb tails the hip stays plumb.
    for hip in of_kind(&plumb, MemberKind::Hip) {
        assert_eq!(tail_style(hip), Some(TailCut::Plumb), "{}", hip.label);
    }
}

#[test]
fn a_valleys_tail_is_cut_square_when_the_commons_are() {
    let (o, roof) = l_hip(288.0, 0.5, 16.0);
    let frame = framed(&o, &roof, TailCut::Square);
    assert_joints_fit(&frame);
    let valleys = of_kind(&frame, MemberKind::Valley);
    assert!(!valleys.is_empty());
    for v in valleys {
        assert_eq!(tail_style(v), Some(TailCut::Square), "{}", v.label);
    }
    ends_flush_with_the_commons(&frame, MemberKind::Valley);
}

#[test]
fn a_hips_tail_gets_the_soffit_cut_with_plumb_and_level_tails() {
    let (o, roof) = rect_hip(480.0, 288.0, 0.5, 0.5, 16.0);
    let frame = framed(&o, &roof, TailCut::PlumbAndLevel { plumb_height_in: 4.0 });
    for hip in of_kind(&frame, MemberKind::Hip) {
        assert_eq!(tail_style(hip), Some(TailCut::PlumbAndLevel { plumb_height_in: 4.0 }), "{}", hip.label);
        assert!(hip.cuts.iter().any(|c| matches!(c, Cut::Soffit { .. })), "{}", hip.label);
    }
}
