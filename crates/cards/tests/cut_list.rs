//! The cut list as CSV and as a terminal table.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

mod common;

use pitchframe_cards::{cut_list_csv, cut_list_table};
use pitchframe_geometry::LengthStyle;

#[test]
fn csv_has_a_row_per_member_with_its_lengths() {
    let deck = common::sample_deck();
    let csv_text = cut_list_csv(&deck.members, LengthStyle::FeetInches).unwrap();
    let mut reader = csv::Reader::from_reader(csv_text.as_bytes());
    let headers = reader.headers().unwrap().clone();
    assert_eq!(&headers[0], "label");
    assert_eq!(&headers[8], "overall");
    let rows: Vec<csv::StringRecord> = reader.records().map(|r| r.unwrap()).collect();
    assert_eq!(rows.len(), deck.members.len());
    for (row, member) in rows.iter().zip(&deck.members) {
        assert_eq!(&row[0], member.label);
        assert_eq!(row[2].parse::<u32>().unwrap(), member.count);
        let overall: f64 = row[10].parse().unwrap();
        assert!((overall - member.lengths.overall_in).abs() < 1e-4);
    }
    // 6 in 12 common: 167.25 in of run at 13.416 per foot (trade.md
    // section 2, line 1: sqrt(144 + 36) = 13.416) is 186.99 in = 15' 7".
    assert_eq!(&rows[0][6], "15' 7\"");
}

#[test]
fn table_snapshot() {
    let deck = common::sample_deck();
    insta::assert_snapshot!(cut_list_table(&deck.members, LengthStyle::FeetInches));
}

#[test]
fn a_joint_that_does_not_fit_is_told_with_both_members_and_its_fit() {
    // A hip's top 1.1418 in short of the king it bears on (as the joint
    // check measures on an irregular plan). Misfits from 1/64 in up are
    // printed to thousandths of an inch or tenths of a millimetre, as
    // sixteenths would round the smaller ones to nothing:
    // 1.1418 x 25.4 = 29.0 mm. Derivation.
    let warning = pitchframe_geometry::framing::FramingWarning::JointDoesNotFit {
        label: "H7".to_string(),
        bears_on: "KC4".to_string(),
        gap_in: 1.1418,
        overlap_in: 0.0,
    };
    let inches = pitchframe_cards::warning_words(&warning, LengthStyle::FeetInches);
    assert!(inches.contains("KC4"), "{inches}");
    assert!(inches.contains("1.142\"") && inches.contains("0.000\""), "{inches}");
    let mm = pitchframe_cards::warning_words(&warning, LengthStyle::Millimetres);
    assert!(mm.contains("29.0 mm") && mm.contains("0.0 mm"), "{mm}");
}

#[test]
fn a_jack_moved_off_the_layout_is_told_with_the_ridge_and_how_far() {
    // A valley jack moved 1.0959 in clear of a ridge's end: to the
    // nearest 1/16 in that is 1-1/8" (17.53 sixteenths), and 1.0959 x 25.4
    // = 27.8 mm, 28 mm. Derivation.
    let warning = pitchframe_geometry::framing::FramingWarning::JackMovedOffLayout {
        label: "VJ1".to_string(),
        ridge: "R3".to_string(),
        by_in: 1.0959,
    };
    let inches = pitchframe_cards::warning_words(&warning, LengthStyle::FeetInches);
    assert!(
        inches.contains("R3") && inches.contains("1-1/8\"") && inches.contains("off the layout"),
        "{inches}"
    );
    let mm = pitchframe_cards::warning_words(&warning, LengthStyle::Millimetres);
    assert!(mm.contains("28 mm"), "{mm}");
    let left_out = pitchframe_geometry::framing::FramingWarning::JackLeftOutAtRidgeEnd {
        label: "R3".to_string(),
        count: 2,
    };
    let words = pitchframe_cards::warning_words(&left_out, LengthStyle::FeetInches);
    assert!(words.contains("2 valley jacks") && words.contains("carries the sheathing"), "{words}");
}
