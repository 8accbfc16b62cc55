//! The cover sheet: the cautions first, the roof in figures in the plan's
//! units, each warning once with every member it is on, and the lumber
//! order.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

mod plans;

use pitchframe_cards::{CAUTIONS, CardDeck, CardOptions, render_cards};
use pitchframe_geometry::LengthStyle;

/// The cover's words (every page before the first card), wrapped lines
/// joined with a space.
fn cover_text(deck: &CardDeck) -> String {
    let pdf = render_cards(deck, &CardOptions::default()).unwrap();
    let pages: Vec<String> = plans::text_runs(&pdf)
        .into_iter()
        .map(|runs| runs.into_iter().map(|run| run.text).collect::<Vec<_>>().join(" "))
        .collect();
    let first_card = pages.iter().position(|page| page.contains("card 1 of")).unwrap();
    pages[..first_card].join(" ")
}

#[test]
fn the_cover_opens_with_the_cautions_and_defers_to_codes_and_professionals() {
    for deck in plans::all_decks() {
        let cover = cover_text(&deck);
        let cautions = cover.find("CAUTIONS").unwrap();
        assert!(cautions < cover.find("ROOF").unwrap(), "{}: cautions come first", deck.title);
        for caution in CAUTIONS {
            assert!(cover.contains(caution), "{}: {caution}", deck.title);
        }
        // trade.md section 8: sizes, spans and connections are set by local
        // codes, engineered designs and licensed professionals.
        assert!(cover.contains("local codes, engineered designs and licensed professionals"));
        assert!(cover.contains("fall protection") && cover.contains("temporary bracing"));
    }
}

#[test]
fn each_warning_is_written_once_with_every_member_it_is_on() {
    for deck in plans::all_decks() {
        let cover = cover_text(&deck);
        for member in &deck.members {
            for warning in &member.warnings {
                let count = cover.matches(warning.as_str()).count();
                assert_eq!(count, 1, "{}: {warning:?} written {count} times", deck.title);
                // The one line names this member among those it is on.
                let line_start = cover[..cover.find(warning.as_str()).unwrap()].rfind("WARNING: ").unwrap();
                let labels = &cover[line_start..cover.find(warning.as_str()).unwrap()];
                assert!(
                    labels.split([' ', ',', ':']).any(|word| word == member.label),
                    "{}: {} missing from {labels:?}",
                    deck.title,
                    member.label
                );
            }
        }
    }
}

#[test]
fn the_roof_and_the_order_are_in_the_plans_units() {
    for deck in plans::all_decks() {
        let cover = cover_text(&deck);
        let order = deck.lumber.as_ref().unwrap();
        for size in &order.sizes {
            assert!(cover.contains(&format!("{}: ", size.size)), "{}: order for {}", deck.title, size.size);
        }
        if deck.length_style == LengthStyle::Millimetres {
            assert!(
                !cover.contains("sq ft") && cover.contains("sq m"),
                "{}: areas in square metres",
                deck.title
            );
            assert!(!cover.contains('"'), "{}: no inch marks on a metric plan", deck.title);
        } else {
            assert!(cover.contains("sq ft") && !cover.contains("sq m"), "{}", deck.title);
        }
    }
}
