//! The cut cards PDF: it parses, holds every member's label and figures,
//! renders to non-blank pages, and its scale bar has its exact length.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

mod common;

use lopdf::content::Content;
use lopdf::{Document, Object};
use pitchframe_cards::{CardOptions, CardsError, Paper, render_cards, render_cards_with_progress};

/// Every string shown by a text operator on each page, decoded from WinAnsi
/// (ASCII is the same in both).
fn page_texts(pdf: &[u8]) -> Vec<String> {
    let doc = Document::load_mem(pdf).expect("the PDF parses");
    doc.get_pages()
        .values()
        .map(|&page| {
            let content = Content::decode(&doc.get_page_content(page)).unwrap();
            let mut text = String::new();
            for op in content.operations {
                if op.operator == "Tj"
                    && let Some(Object::String(bytes, _)) = op.operands.first()
                {
                    text.extend(bytes.iter().map(|&b| b as char));
                    text.push('\n');
                }
            }
            text
        })
        .collect()
}

fn rect_widths(pdf: &[u8]) -> Vec<f64> {
    let doc = Document::load_mem(pdf).unwrap();
    let mut widths = Vec::new();
    for &page in doc.get_pages().values() {
        let content = Content::decode(&doc.get_page_content(page)).unwrap();
        for op in content.operations.iter().filter(|op| op.operator == "re") {
            if let Some(width) = op.operands.get(2).and_then(|o| o.as_float().ok()) {
                widths.push(f64::from(width));
            }
        }
    }
    widths
}

#[test]
fn every_card_holds_its_label_lengths_and_square_figures() {
    let deck = common::sample_deck();
    for per_page in [1, 2, 4] {
        let options = CardOptions { paper: Paper::Letter, per_page, templates: vec![] };
        let pdf = render_cards(&deck, &options).unwrap();
        let texts = page_texts(&pdf);
        let all = texts.join("\n");
        for member in &deck.members {
            assert!(all.contains(&member.label), "label {}", member.label);
            let overall = pitchframe_geometry::Length::from_inches(member.lengths.overall_in)
                .format(pitchframe_geometry::LengthStyle::FeetInches);
            assert!(all.contains(&overall), "overall {overall} of {}", member.label);
        }
        // The 6 in 12 plumb line is set 12 and 6 on the square (trade.md
        // section 2, common practice); the hip's plumb 16.97 and 6, read 17 and 6.
        assert!(all.contains("top plumb cut: 12 & 6"), "common plumb figures");
        assert!(all.contains("17 & 6"), "hip plumb figures");
        assert!(all.contains("WARNING: seat notch"));
        assert!(all.contains("licensed professionals"));
        // Cover (one page for this small job), then each card at least in
        // its own slot; a card too full for its slot takes more room.
        assert!(texts.len() > deck.members.len().div_ceil(per_page as usize));
        for number in 1..=deck.members.len() {
            assert!(all.contains(&format!("card {number} of {}", deck.members.len())), "card {number}");
        }
    }
}

#[test]
fn template_scale_bar_prints_six_inches() {
    let deck = common::sample_deck();
    let options = CardOptions { paper: Paper::A4, per_page: 2, templates: vec!["H1".into()] };
    let pdf = render_cards(&deck, &options).unwrap();
    // 6 in at 72 points per inch (the PDF unit, ISO 32000-1 section 8.3.2.3).
    let bars = rect_widths(&pdf).into_iter().filter(|w| (w - 432.0).abs() < 1e-3).count();
    // Upper and lower ends, side and top views: four template pages.
    assert_eq!(bars, 4);
    assert!(page_texts(&pdf).join("\n").contains("must measure exactly 6 in"));
}

#[test]
fn unknown_template_member_is_named() {
    let deck = common::sample_deck();
    let options = CardOptions { templates: vec!["Z9".into()], ..CardOptions::default() };
    let err = render_cards(&deck, &options).unwrap_err();
    assert!(matches!(err, CardsError::TemplateMemberMissing { .. }));
    assert!(err.to_string().contains("Z9"));
    let err = render_cards(&deck, &CardOptions { per_page: 3, ..CardOptions::default() }).unwrap_err();
    assert!(err.to_string().contains('3'));
}

#[test]
fn pages_render_and_are_not_blank() {
    let Ok(status) = std::process::Command::new("pdftoppm").arg("-v").output() else {
        panic!("pdftoppm (poppler-utils) is needed: scripts/install-test-packages installs it");
    };
    let _ = status;
    let deck = common::sample_deck();
    for per_page in [1, 2, 4] {
        let options = CardOptions { paper: Paper::Letter, per_page, templates: vec!["C1".into()] };
        pages_are_not_blank(&render_cards(&deck, &options).unwrap(), per_page);
    }
}

fn pages_are_not_blank(pdf: &[u8], per_page: u8) {
    let dir = std::env::temp_dir().join(format!("pitchframe-cards-{}-{per_page}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let file = dir.join("cards.pdf");
    std::fs::write(&file, pdf).unwrap();
    let out = std::process::Command::new("pdftoppm")
        .args(["-r", "30", "-gray"])
        .arg(&file)
        .arg(dir.join("page"))
        .output()
        .unwrap();
    assert!(out.status.success(), "{}", String::from_utf8_lossy(&out.stderr));
    let mut pages: Vec<_> = std::fs::read_dir(&dir)
        .unwrap()
        .filter_map(|e| e.ok())
        .map(|e| e.path())
        .filter(|p| p.extension().is_some_and(|x| x == "pgm"))
        .collect();
    pages.sort();
    assert_eq!(pages.len(), page_texts(pdf).len());
    for page in &pages {
        // A PGM: header of three lines, then one byte per pixel; a blank page
        // is all 255.
        let bytes = std::fs::read(page).unwrap();
        // Past the header; a page may be half empty where the next card
        // needed a whole page, so the whole page is looked at.
        let body = &bytes[64.min(bytes.len())..];
        let dark = body.iter().filter(|&&b| b < 128).count();
        assert!(dark > body.len() / 500, "{} looks blank ({dark} dark pixels)", page.display());
    }
    std::fs::remove_dir_all(&dir).unwrap();
}

#[test]
fn progress_counts_up_to_the_whole_job_and_the_file_is_the_same() {
    let deck = common::sample_deck();
    let label = deck.members.first().unwrap().label.clone();
    let options = CardOptions { paper: Paper::A4, per_page: 2, templates: vec![label] };
    let seen = std::cell::RefCell::new(Vec::new());
    let pdf =
        render_cards_with_progress(&deck, &options, &|done, total| seen.borrow_mut().push((done, total)))
            .unwrap();
    let seen = seen.into_inner();
    // The cover, each card, the one template and the writing of the file.
    let steps = 1 + deck.members.len() + 1 + 1;
    assert_eq!(seen.len(), steps);
    assert!(seen.iter().all(|&(_, total)| total == steps));
    assert!(seen.windows(2).all(|pair| pair[1].0 == pair[0].0 + 1), "{seen:?}");
    assert_eq!(seen.last(), Some(&(steps, steps)));
    assert_eq!(pdf, render_cards(&deck, &options).unwrap());
}
