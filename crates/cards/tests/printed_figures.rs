//! Every figure printed for the crew reads as it is measured: square
//! figures and lengths in sixteenths (or whole millimetres), with decimals
//! only on angles in degrees and on areas and percentages.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

mod plans;

use pitchframe_cards::{CardOptions, Paper, cut_list_csv, cut_list_table, render_cards};

/// Each number written with a decimal point in `text`, with the words
/// that follow it.
fn decimals(text: &str) -> Vec<(String, String)> {
    let chars: Vec<char> = text.chars().collect();
    let mut found = Vec::new();
    let mut index = 0;
    while index < chars.len() {
        if chars[index].is_ascii_digit() && (index == 0 || !chars[index - 1].is_ascii_alphanumeric()) {
            let start = index;
            while index < chars.len() && (chars[index].is_ascii_digit() || chars[index] == '.') {
                index += 1;
            }
            let number: String = chars[start..index].iter().collect();
            let number = number.trim_end_matches('.').to_string();
            if number.contains('.') {
                let after: String = chars[index..].iter().take(8).collect();
                found.push((number, after));
            }
        } else {
            index += 1;
        }
    }
    found
}

/// Decimals are for angles, areas and percentages; a length or a square
/// figure with a decimal point ("6.000", "11.31") is misread at the saw.
fn misread_figures(text: &str) -> Vec<String> {
    decimals(text)
        .into_iter()
        .filter(|(_, after)| {
            !(after.starts_with(" deg")
                || after.starts_with(" sq ft")
                || after.starts_with(" %")
                || after.starts_with(" sq m"))
        })
        .map(|(number, after)| format!("{number}{after}"))
        .collect()
}

#[test]
fn square_figures_and_lengths_carry_no_decimals_on_cards_and_cut_lists() {
    for deck in plans::all_decks() {
        let pdf = render_cards(&deck, &CardOptions { paper: Paper::Letter, per_page: 2, templates: vec![] })
            .unwrap();
        let mut texts: Vec<String> =
            plans::text_runs(&pdf).into_iter().flatten().map(|run| run.text).collect();
        texts.push(cut_list_table(&deck.members, deck.length_style));
        let csv = cut_list_csv(&deck.members, deck.length_style).unwrap();
        // The last column repeats the overall length as a plain number for
        // spreadsheets; every other cell is for people.
        let mut reader = csv::Reader::from_reader(csv.as_bytes());
        for record in reader.records() {
            let record = record.unwrap();
            texts.extend(record.iter().take(record.len() - 1).map(str::to_string));
        }
        let bad: Vec<String> = texts.iter().flat_map(|text| misread_figures(text)).collect();
        assert!(
            bad.is_empty(),
            "{}: {} figures with decimals, first {:?}",
            deck.title,
            bad.len(),
            &bad[..bad.len().min(8)]
        );
    }
}

#[test]
fn demo_squares_read_as_the_trade_holds_them() {
    let deck = plans::all_decks().remove(0);
    let table = cut_list_table(&deck.members, deck.length_style);
    // 6 in 12 commons: 12 and 6 (trade.md section 2, common practice).
    assert!(table.contains("hold 12 and 6 on the same edge; mark along the 6 arm"), "common plumb");
    // Regular hip at 6 in 12: 17 and 6 (trade.md section 2, common practice:
    // the hip runs 16.97, held at 17, per foot of common run).
    assert!(table.contains("on the hip's side hold 17 and 6 on the same edge"), "hip plumb");
    // Hip side cut 12 x 16.97 / 18 = 11.31 against 12 (trade.md section 2,
    // line 6), 11-5/16 on the square.
    assert!(table.contains("on the top edge hold 12 and 11-5/16"), "hip cheek");
}

#[test]
fn metric_squares_read_in_millimetres_against_300() {
    let deck = plans::all_decks().remove(2);
    let table = cut_list_table(&deck.members, deck.length_style);
    // The bungalow's commons are at 30 deg: 300 tan 30 = 173.2 mm against
    // 300 (derivation; metric practice reads squares against 300, TRADA
    // Timber 2020 Yearbook p. 169 gives edge cuts as 300:269).
    assert!(table.contains("hold 300 mm and 173 mm on the same edge; mark along the 173 mm arm"), "{table}");
}

#[test]
fn cards_give_the_pitch_as_the_square_reads_it() {
    let decks = plans::all_decks();
    let words = |deck: &pitchframe_cards::CardDeck| {
        let pdf = render_cards(deck, &CardOptions::default()).unwrap();
        plans::text_runs(&pdf).into_iter().flatten().map(|run| run.text).collect::<Vec<_>>().join(" ")
    };
    let demo = words(&decks[0]);
    // 6 in 12 is atan(6/12) = 26.57 deg; a regular hip rises 6 in 16.97,
    // held 6 in 17, atan(6/16.97) = 19.47 deg (trade.md section 2).
    assert!(demo.contains("pitch 6 in 12 (26.6 deg)"), "common pitch");
    assert!(demo.contains("pitch 6 in 17 (19.5 deg)"), "hip pitch");
    // Metric plans give the angle (the bungalow's commons are at 30 deg).
    assert!(words(&decks[2]).contains("pitch 30 deg"), "metric pitch");
}

#[test]
fn a_plumb_cut_at_a_lower_end_is_not_called_a_top_plumb_cut() {
    let mut lower = 0;
    for deck in plans::all_decks() {
        for member in &deck.members {
            for cut in member.cuts.iter().filter(|cut| cut.place.starts_with("lower end")) {
                assert_ne!(cut.face, pitchframe_cards::CutFace::TopPlumb, "{} {}", member.label, cut.place);
                lower += usize::from(cut.face == pitchframe_cards::CutFace::BottomPlumb);
            }
        }
    }
    // The demo's hip H3 ends in a plumb cut at its foot.
    assert!(lower > 0);
}
