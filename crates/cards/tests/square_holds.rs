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
