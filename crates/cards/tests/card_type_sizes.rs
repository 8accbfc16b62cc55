//! The demo house's cut cards at every layout: no type below the smallest
//! readable size, the cautions on every card and in full on the cover, and
//! the framing square drawn for every kind of cut it marks.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

use lopdf::content::Content;
use lopdf::{Document, Object};
use pitchframe_cards::{
    CARD_CAUTION, CAUTIONS, CardDeck, CardOptions, MIN_TEXT_PT, Paper, card_deck, render_cards,
};
use pitchframe_geometry::{FramingSettings, Roof, demo_plan, frame_roof};

fn demo_deck() -> CardDeck {
    let plan = demo_plan().unwrap();
    let outline = plan.outline().unwrap();
    let roof = Roof::solve(&outline).unwrap();
    let frame = frame_roof(&outline, &roof, &FramingSettings::default()).unwrap();
    card_deck("Demo", &plan, &outline, &roof, &frame, None)
}

/// Every content stream in the file: the pages' and the shared forms'.
fn streams(doc: &Document) -> Vec<Vec<u8>> {
    doc.objects
        .values()
        .filter_map(|object| match object {
            Object::Stream(stream) => stream.decompressed_content().ok(),
            _ => None,
        })
        .collect()
}

/// The type sizes set by every `Tf` in every stream.
fn type_sizes(pdf: &[u8]) -> Vec<f64> {
    let doc = Document::load_mem(pdf).unwrap();
    let mut sizes = Vec::new();
    for bytes in streams(&doc) {
        let Ok(content) = Content::decode(&bytes) else { continue };
        for op in content.operations.iter().filter(|op| op.operator == "Tf") {
            if let Some(size) = op.operands.get(1).and_then(|o| o.as_float().ok()) {
                sizes.push(f64::from(size));
            }
        }
    }
    sizes
}

/// The text shown on each page, one string per text operator.
fn page_texts(pdf: &[u8]) -> Vec<Vec<String>> {
    let doc = Document::load_mem(pdf).unwrap();
    doc.get_pages()
        .values()
        .map(|&page| {
            let content = Content::decode(&doc.get_page_content(page)).unwrap();
            content
                .operations
                .iter()
                .filter(|op| op.operator == "Tj")
                .filter_map(|op| match op.operands.first() {
                    Some(Object::String(bytes, _)) => Some(bytes.iter().map(|&b| b as char).collect()),
                    _ => None,
                })
                .collect()
        })
        .collect()
}

fn layouts() -> Vec<CardOptions> {
    [Paper::Letter, Paper::A4]
        .into_iter()
        .flat_map(|paper| [1, 2, 4].map(|per_page| CardOptions { paper, per_page, templates: vec![] }))
        .collect()
}

#[test]
fn no_type_is_smaller_than_the_readable_minimum() {
    let deck = demo_deck();
    for options in layouts() {
        let sizes = type_sizes(&render_cards(&deck, &options).unwrap());
        assert!(sizes.len() > 100, "{options:?}: only {} text runs", sizes.len());
        let smallest = sizes.iter().copied().fold(f64::INFINITY, f64::min);
        // Written to two decimals in the file.
        assert!(smallest >= MIN_TEXT_PT - 0.005, "{options:?}: type as small as {smallest} pt");
    }
}

#[test]
fn every_card_page_carries_the_short_cautions_and_the_cover_the_full_list() {
    let deck = demo_deck();
    for options in layouts() {
        let pages = page_texts(&render_cards(&deck, &options).unwrap());
        let joined: Vec<String> = pages.iter().map(|lines| lines.join(" ")).collect();
        let first_card = joined.iter().position(|text| text.contains("card 1 of")).unwrap();
        let cover = joined.iter().take(first_card).cloned().collect::<Vec<_>>().join(" ");
        for caution in CAUTIONS {
            // The cover wraps its lines; compare the words.
            let words: Vec<&str> = caution.split_whitespace().collect();
            assert!(cover.contains(&words.join(" ")), "{options:?}: cover lacks {caution:?}");
        }
        let card_pages: Vec<&String> = joined.iter().filter(|text| text.contains(" of ")).collect();
        assert!(!card_pages.is_empty());
        let opening: String = CARD_CAUTION.split_whitespace().take(5).collect::<Vec<_>>().join(" ");
        for (index, page) in joined.iter().enumerate().skip(first_card) {
            let cards = page.matches("card ").count();
            let cautions = page.matches(&opening).count();
            // Each card, or the last part of a continuing one, ends with them.
            assert!(cards == 0 || cautions >= 1, "{options:?}: page {} has no cautions", index + 1);
        }
        for caution in ["Test-cut a pair", "Measure the real building", "licensed professionals"] {
            assert!(CARD_CAUTION.contains(caution));
        }
    }
}

#[test]
fn the_square_is_drawn_for_seat_and_cheek_cuts_with_the_published_figures() {
    let deck = demo_deck();
    let pdf = render_cards(&deck, &CardOptions::default()).unwrap();
    let all = page_texts(&pdf).concat().join("\n");
    // 6 in 12: the seat is marked along the 12 arm of the 12-and-6 square
    // (trade.md section 2, common practice).
    assert!(all.contains("[S] seat cut: 6 & 12"), "common seat close-up");
    // Side cuts at 6 in 12 (trade.md section 2, lines 5 and 6): jacks
    // 12 x 12 / 13.42 = 10.73, hips 12 x 16.97 / 18 = 11.31, each against 12,
    // read on the square to the sixteenth: 10-3/4 and 11-5/16.
    // A caption too wide for its box puts the figures on their own line.
    assert!(all.contains("[C] cheek cut:") && all.contains("10-3/4 & 12"), "jack cheek close-up");
    assert!(all.contains("11-5/16 & 12"), "hip cheek close-up");
    assert!(all.contains("on the top edge, from above"));
    assert!(all.contains("held on the bottom edge"));
}
