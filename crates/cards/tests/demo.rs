//! The built-in demo house through the framing into every printed output.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

use pitchframe_cards::{
    CardOptions, GltfError, OrderSettings, Paper, StockSeries, card_deck, cut_list_csv, cut_list_table,
    frame_glb, length_style, model_scene, order_lumber, order_pieces, render_cards,
};
use pitchframe_geometry::{FramingSettings, Roof, demo_plan, frame_roof};

struct Demo {
    plan: pitchframe_geometry::Plan,
    outline: pitchframe_geometry::Outline,
    roof: Roof,
    frame: pitchframe_geometry::Frame,
}

fn demo() -> Demo {
    let plan = demo_plan().unwrap();
    let outline = plan.outline().unwrap();
    let roof = Roof::solve(&outline).unwrap();
    let frame = frame_roof(&outline, &roof, &FramingSettings::default()).unwrap();
    Demo { plan, outline, roof, frame }
}

#[test]
fn demo_cut_list_snapshot() {
    let d = demo();
    let deck = card_deck("Demo", &d.plan, &d.outline, &d.roof, &d.frame, None);
    insta::assert_snapshot!(cut_list_table(&deck.members, length_style(&d.plan)));
    let csv = cut_list_csv(&deck.members, length_style(&d.plan)).unwrap();
    assert_eq!(csv.lines().count(), d.frame.members.len() + 1);
}

#[test]
fn demo_lumber_order_places_every_piece() {
    let d = demo();
    let pieces = order_pieces(&d.frame, length_style(&d.plan));
    let order = order_lumber(&pieces, &OrderSettings::for_series(StockSeries::Feet)).unwrap();
    let placed: usize = order.sizes.iter().flat_map(|s| &s.boards).map(|b| b.pieces.len()).sum::<usize>()
        + order.needs_splice.iter().map(|s| s.count as usize).sum::<usize>();
    assert_eq!(placed, d.frame.members.iter().map(|m| m.count).sum::<usize>());
}

#[test]
fn demo_model_has_a_node_per_piece() {
    let d = demo();
    let scene = model_scene(&d.outline, &d.roof, &d.frame, true, true);
    let bad = d.frame.pieces.iter().find(|p| !(p.axis[0].is_finite() && p.axis[1].is_finite()));
    // Every demo piece is placed (the valley's tail once gave an infinite axis).
    assert!(bad.is_none(), "unplaced piece {:?}", bad.map(|p| &p.label));
    match (frame_glb(&scene), bad) {
        // A piece the framing could not place is refused by name, never
        // written as a broken model.
        (Err(GltfError::PieceNotFinite { label }), Some(piece)) => assert_eq!(label, piece.label),
        (Ok(glb), None) => {
            let gltf = gltf::Gltf::from_slice(&glb).unwrap();
            assert_eq!(gltf.nodes().count(), d.frame.pieces.len() + 2);
        }
        (result, bad) => {
            panic!("model {:?} with unplaced piece {:?}", result.map(|b| b.len()), bad.map(|p| &p.label))
        }
    }
}

#[test]
fn demo_cards_hold_every_label() {
    let d = demo();
    let pieces = order_pieces(&d.frame, length_style(&d.plan));
    let order = order_lumber(&pieces, &OrderSettings::for_series(StockSeries::Feet)).ok();
    let deck = card_deck("Demo", &d.plan, &d.outline, &d.roof, &d.frame, order);
    let first = deck.members.first().unwrap().label.clone();
    let pdf = render_cards(&deck, &CardOptions { paper: Paper::Letter, per_page: 2, templates: vec![first] })
        .unwrap();
    if let Ok(path) = std::env::var("PITCHFRAME_CARDS_OUT") {
        std::fs::write(path, &pdf).unwrap();
    }
    let doc = lopdf::Document::load_mem(&pdf).unwrap();
    let mut text = String::new();
    for &page in doc.get_pages().values() {
        let content = lopdf::content::Content::decode(&doc.get_page_content(page)).unwrap();
        for op in content.operations.iter().filter(|op| op.operator == "Tj") {
            if let Some(lopdf::Object::String(bytes, _)) = op.operands.first() {
                text.extend(bytes.iter().map(|&b| b as char));
                text.push('\n');
            }
        }
    }
    for member in &deck.members {
        assert!(text.contains(&member.label), "{}", member.label);
    }
}
