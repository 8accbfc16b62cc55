//! Where the framing square is held for a cheek cut marked from above:
//! both figures must meet the edge on the stock, since a figure is read
//! where its arm crosses wood.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

mod plans;

use pitchframe_geometry::{LengthStyle, MarkAlong};

#[test]
fn both_figures_of_a_cheek_cut_land_on_the_stock() {
    let mut checked = 0;
    for deck in plans::all_decks() {
        let unit_in = if deck.length_style == LengthStyle::Millimetres { 1.0 / 25.4 } else { 1.0 };
        for member in &deck.members {
            let Some(top) = &member.top_view else { continue };
            let low_x = top.outline.iter().map(|p| p.x).fold(f64::INFINITY, f64::min);
            let high_x = top.outline.iter().map(|p| p.x).fold(f64::NEG_INFINITY, f64::max);
            for cut in &member.cuts {
                let (Some(mark), Some(square)) = (&cut.top_mark, &cut.square) else { continue };
                let (mark_figure, other_figure) = match square.mark_along {
                    MarkAlong::Figure => (square.figure, square.against),
                    MarkAlong::Against => (square.against, square.figure),
                };
                // Derivation: the marked arm runs from the edge point to
                // the heel along the cheek line; the other arm, square to
                // it, returns to the same edge line y = edge_point.y.
                let heel = mark.edge_point + mark.into_board * mark_figure * unit_in;
                let off_edge =
                    |arm: glam::DVec2| ((heel + arm * other_figure * unit_in).y - mark.edge_point.y).abs();
                let perp = mark.into_board.perp();
                let other_arm = if off_edge(perp) <= off_edge(-perp) { perp } else { -perp };
                let other = heel + other_arm * other_figure * unit_in;
                assert!(
                    (other.y - mark.edge_point.y).abs() < 1e-3,
                    "{} {}: the other figure is off the edge: {mark:?} {square:?} {other:?}",
                    deck.title,
                    member.label
                );
                assert!(
                    other.x >= low_x - 1e-6 && other.x <= high_x + 1e-6,
                    "{} {} {}: the other figure lands at x = {:.2}, off the stock ({low_x:.2}..{high_x:.2})",
                    deck.title,
                    member.label,
                    cut.place,
                    other.x
                );
                checked += 1;
            }
        }
    }
    assert!(checked > 10, "only {checked} cheek cuts checked");
}

#[test]
fn both_figures_of_a_side_face_cut_land_on_the_stock() {
    let mut faults = Vec::new();
    let mut checked = 0;
    for deck in plans::all_decks() {
        let unit_in = if deck.length_style == LengthStyle::Millimetres { 1.0 / 25.4 } else { 1.0 };
        for member in &deck.members {
            let outline = &member.side_view.outline;
            let low_x = outline.iter().map(|p| p.x).fold(f64::INFINITY, f64::min);
            let high_x = outline.iter().map(|p| p.x).fold(f64::NEG_INFINITY, f64::max);
            for cut in &member.cuts {
                let (Some(mark), Some(square)) = (&cut.mark, &cut.square) else { continue };
                let (mark_figure, other_figure) = match square.mark_along {
                    MarkAlong::Figure => (square.figure, square.against),
                    MarkAlong::Against => (square.against, square.figure),
                };
                // The same derivation as for cheek cuts, on the side face.
                let heel = mark.edge_point + mark.into_board * mark_figure * unit_in;
                let off_edge =
                    |arm: glam::DVec2| ((heel + arm * other_figure * unit_in).y - mark.edge_point.y).abs();
                let perp = mark.into_board.perp();
                let other_arm = if off_edge(perp) <= off_edge(-perp) { perp } else { -perp };
                let other = heel + other_arm * other_figure * unit_in;
                checked += 1;
                if other.x < low_x - 1e-6 || other.x > high_x + 1e-6 {
                    faults.push(format!(
                        "{} {} {}: x = {:.2} off {low_x:.2}..{high_x:.2}",
                        deck.title,
                        member.label,
                        cut.face.name(),
                        other.x
                    ));
                }
            }
        }
    }
    assert!(checked > 10);
    assert!(faults.is_empty(), "{}", faults.join("\n"));
}

#[test]
fn a_piece_too_short_for_the_whole_figures_is_told_to_hold_half() {
    let deck = plans::all_decks().remove(0);
    let vj3 = deck.members.iter().find(|m| m.label == "VJ3").unwrap();
    // 12 and 10-3/4 meet the edge sqrt(12^2 + 10.73^2) = 16.1 in apart
    // (derivation), more than this piece's top.
    assert!(vj3.lengths.overall_in < 16.1, "VJ3 is {} in", vj3.lengths.overall_in);
    let notes: Vec<&String> = vj3.cuts.iter().flat_map(|cut| &cut.notes).collect();
    assert!(
        notes.iter().any(|n| n.contains(
            "square too long for this short piece at 12 and 10-3/4: hold half of each, 6 and 5-3/8"
        )),
        "{notes:?}"
    );
}
