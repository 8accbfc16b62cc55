//! The cut cards' layout on the demo house and both example plans, at
//! every paper and cards-a-page setting: no text runs over other text, and
//! pages are filled in order without blank slots left behind.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

mod plans;

use pitchframe_cards::{CardOptions, Paper, render_cards};

fn layouts() -> Vec<CardOptions> {
    let mut out = Vec::new();
    for paper in [Paper::Letter, Paper::A4] {
        for per_page in [1, 2, 4] {
            out.push(CardOptions { paper, per_page, templates: vec![] });
        }
    }
    out
}

/// Writes each rendered deck to `PITCHFRAME_CARDS_DIR` when it is set, to
/// look at the pages.
fn keep(title: &str, options: &CardOptions, pdf: &[u8]) {
    if let Ok(dir) = std::env::var("PITCHFRAME_CARDS_DIR") {
        let name = format!("{dir}/{title}-{:?}-{}.pdf", options.paper, options.per_page);
        std::fs::write(name, pdf).unwrap();
    }
}

#[test]
fn no_text_runs_over_other_text() {
    let mut faults = Vec::new();
    for deck in plans::all_decks() {
        // Full-size templates too, of the first two members cut with cheeks.
        let templates: Vec<String> =
            deck.members.iter().filter(|m| m.top_view.is_some()).take(2).map(|m| m.label.clone()).collect();
        for mut options in layouts() {
            if options.per_page == 2 {
                options.templates = templates.clone();
            }
            let pdf = render_cards(&deck, &options).unwrap();
            keep(&deck.title, &options, &pdf);
            for (page, runs) in plans::text_runs(&pdf).iter().enumerate() {
                for (index, a) in runs.iter().enumerate() {
                    for b in runs.iter().skip(index + 1) {
                        // A quarter point of slack: touching lines of one
                        // paragraph are not an overlap.
                        if plans::overlap(&a.corners, &b.corners, 0.25) {
                            faults.push(format!(
                                "{} {:?} {} a page, page {}: {:?} over {:?}",
                                deck.title,
                                options.paper,
                                options.per_page,
                                page + 1,
                                a.text,
                                b.text
                            ));
                        }
                    }
                }
            }
        }
    }
    assert!(faults.is_empty(), "{} overlaps:\n{}", faults.len(), faults[..faults.len().min(400)].join("\n"));
}

#[test]
fn the_cover_plan_labels_every_member() {
    for deck in plans::all_decks() {
        for options in layouts() {
            let pdf = render_cards(&deck, &options).unwrap();
            let pages = plans::text_runs(&pdf);
            let cover = pages.first().unwrap();
            for member in &deck.members {
                // The plan writes each label alone along its piece; the
                // member list below writes "C1: common rafter ...".
                assert!(
                    cover.iter().any(|run| run.text == member.label),
                    "{} {:?} {}: {} is not labelled on the plan",
                    deck.title,
                    options.paper,
                    options.per_page,
                    member.label
                );
            }
        }
    }
}

#[test]
fn no_card_page_is_left_with_room_a_later_card_could_use() {
    for deck in plans::all_decks() {
        for options in layouts() {
            let pdf = render_cards(&deck, &options).unwrap();
            let paper = options.paper.size_pt();
            // The card area inside the margins (30 pt, and 10 pt more at
            // the foot for the footer line).
            let usable = (paper.x - 60.0) * (paper.y - 70.0);
            let frames = plans::card_frames(&pdf);
            let card_pages: Vec<&Vec<(f64, f64)>> =
                frames.iter().filter(|frames| !frames.is_empty()).collect();
            assert!(!card_pages.is_empty());
            for (index, page) in card_pages.iter().enumerate() {
                let filled = page.iter().map(|(w, h)| w * h).sum::<f64>() / usable;
                // Slots leave 8 pt gaps between them: 4 a page on letter
                // fill 97 % of the area. A page less full is only right
                // when no card after it is small enough for its room.
                let room = usable * (1.0 - filled);
                let smallest_later = card_pages
                    .iter()
                    .skip(index + 1)
                    .flat_map(|frames| frames.iter().map(|(w, h)| w * h))
                    .fold(f64::INFINITY, f64::min);
                assert!(
                    filled > 0.95 || smallest_later > room,
                    "{} {:?} {} a page: card page {} only {:.0} % filled, and a later card would fit",
                    deck.title,
                    options.paper,
                    options.per_page,
                    index + 1,
                    filled * 100.0
                );
            }
        }
    }
}

#[test]
fn every_text_on_a_card_page_stays_inside_its_card() {
    let mut faults = Vec::new();
    for deck in plans::all_decks() {
        for options in layouts() {
            let pdf = render_cards(&deck, &options).unwrap();
            let frames = plans::card_frame_boxes(&pdf);
            for (page, (runs, frames)) in plans::text_runs(&pdf).iter().zip(&frames).enumerate() {
                if frames.is_empty() {
                    continue;
                }
                for run in runs {
                    // The footer line under the cards is the one text
                    // outside them.
                    if run.text.starts_with(&deck.title) {
                        continue;
                    }
                    let inside = frames.iter().any(|[x, y, w, h]| {
                        run.corners.iter().all(|c| {
                            c.x >= x - 0.25 && c.x <= x + w + 0.25 && c.y >= y - 0.25 && c.y <= y + h + 0.25
                        })
                    });
                    if !inside {
                        faults.push(format!(
                            "{} {:?} {} a page, page {}: {:?}",
                            deck.title,
                            options.paper,
                            options.per_page,
                            page + 1,
                            run.text
                        ));
                    }
                }
            }
        }
    }
    assert!(
        faults.is_empty(),
        "{} texts outside their card:\n{}",
        faults.len(),
        faults[..faults.len().min(30)].join("\n")
    );
}
