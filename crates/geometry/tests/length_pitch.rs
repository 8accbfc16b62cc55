//! Lengths and pitches as framers type them, and the round trips through
//! display text that the cut list relies on.

use approx::assert_abs_diff_eq;
use pitchframe_geometry::{Length, LengthError, LengthStyle, LengthUnit, Pitch, PitchError};
use proptest::prelude::*;

const ALL_STYLES: [LengthStyle; 4] =
    [LengthStyle::FeetInches, LengthStyle::Inches, LengthStyle::DecimalInches, LengthStyle::Millimetres];

fn inches(text: &str) -> f64 {
    match Length::parse(text, LengthUnit::Inch) {
        Ok(length) => length.inches(),
        Err(error) => panic!("{text}: {error}"),
    }
}

#[test]
fn framer_forms_read_as_inches() {
    // Each expected value is arithmetic on the text: 24 ft = 288 in.
    assert_eq!(inches("24'"), 288.0);
    assert_eq!(inches("24' 6-3/8\""), 294.375);
    assert_eq!(inches("24'-6 3/8\""), 294.375);
    assert_eq!(inches("24' 6\""), 294.0);
    assert_eq!(inches("6-3/8"), 6.375);
    assert_eq!(inches("6 3/8\""), 6.375);
    assert_eq!(inches("3/4\""), 0.75);
    assert_eq!(inches("294.375"), 294.375);
    assert_eq!(inches("-24' 6-3/8\""), -294.375);
    assert_eq!(inches("-3/4\""), -0.75);
}

#[test]
fn metric_forms_read_in_millimetres() {
    // 1 in = 25.4 mm exactly (international inch, 1959).
    for (text, mm) in [
        ("7.2 m", 7200.0),
        ("600 mm", 600.0),
        ("600mm", 600.0),
        ("2.4m", 2400.0),
        ("45 cm", 450.0),
        ("-600 mm", -600.0),
    ] {
        assert_abs_diff_eq!(Length::parse(text, LengthUnit::Inch).unwrap().mm(), mm, epsilon = 1e-9);
    }
    assert_abs_diff_eq!(Length::parse("600", LengthUnit::Millimetre).unwrap().mm(), 600.0, epsilon = 1e-9);
    assert_abs_diff_eq!(Length::parse("600", LengthUnit::Inch).unwrap().inches(), 600.0, epsilon = 1e-12);
    // An explicit inch mark wins over a millimetre plan unit.
    assert_eq!(Length::parse("6 3/8\"", LengthUnit::Millimetre).unwrap().inches(), 6.375);
}

#[test]
fn bad_lengths_name_the_input_and_the_fault() {
    let message = |t: &str| Length::parse(t, LengthUnit::Inch).unwrap_err().to_string();
    assert_eq!(message("6-3/0"), "\"6-3/0\" has a zero denominator");
    assert!(message("NaN").starts_with("\"NaN\" is not a length"));
    assert!(message("inf").starts_with("\"inf\" is not a length"));
    assert!(message("24' 6-3/8\" and a bit").contains("and a bit"));
    assert!(message("24' 13\"").contains("under 12"));
    assert!(message("1e999").contains("1e999"));
    assert_eq!(Length::parse("   ", LengthUnit::Inch), Err(LengthError::Empty));
    let long = "9".repeat(320);
    assert!(matches!(Length::parse(&long, LengthUnit::Inch), Err(LengthError::TooLarge { .. })));
    assert!(matches!(Length::parse("999999999'", LengthUnit::Inch), Err(LengthError::TooLarge { .. })));
}

#[test]
fn formats_match_the_cut_list_forms() {
    let l = Length::from_inches(294.375);
    assert_eq!(l.format(LengthStyle::FeetInches), "24' 6-3/8\"");
    assert_eq!(l.to_string(), "24' 6-3/8\"");
    assert_eq!(l.format(LengthStyle::Inches), "294-3/8\"");
    assert_eq!(l.format(LengthStyle::DecimalInches), "294.375\"");
    // 294.375 * 25.4 = 7477.125 mm.
    assert_eq!(l.format(LengthStyle::Millimetres), "7477 mm");
    // 11-31/32 rounds up to a whole foot, not to 0' 12".
    assert_eq!(Length::from_inches(11.0 + 31.0 / 32.0).to_string(), "1' 0\"");
    assert_eq!(Length::from_inches(35.0 + 63.0 / 64.0).to_string(), "3' 0\"");
    assert_eq!(Length::from_inches(-(35.0 + 63.0 / 64.0)).to_string(), "-3' 0\"");
    assert_eq!(Length::from_inches(6.0 + 4.0 / 16.0).to_string(), "6-1/4\"");
    assert_eq!(Length::from_inches(0.01).to_string(), "0\"");
    assert_eq!(Length::from_inches(-0.01).to_string(), "0\"");
    assert_eq!(Length::from_inches(-294.375).format(LengthStyle::Inches), "-294-3/8\"");
}

#[test]
fn pitch_forms_and_values() {
    let p = |t: &str| Pitch::parse(t).unwrap();
    for text in ["6/12", "6 in 12", "6:12", "1:2", "500/1000"] {
        assert_eq!(p(text).rise_per_run(), 0.5, "{text}");
    }
    assert_eq!(p("9.5/12").rise_in_12(), 9.5);
    assert_eq!(p("9.5/12").to_string(), "9.5/12");
    // atan(6/12) = 26.565 deg: "26.57deg" is 6 in 12 to two decimals.
    assert_abs_diff_eq!(p("26.57deg").rise_in_12(), 6.0, epsilon = 0.002);
    assert_abs_diff_eq!(p("26.57 deg").rise_in_12(), 6.0, epsilon = 0.002);
    // tan 30 deg = 1/sqrt(3), so 30 deg is 6.928 in 12.
    assert_abs_diff_eq!(p("30°").rise_in_12(), 12.0 / 3f64.sqrt(), epsilon = 1e-12);
    assert_abs_diff_eq!(p("6/12").degrees(), 26.565_051, epsilon = 1e-6);
}

#[test]
fn bad_pitches_name_the_input_and_the_fault() {
    let e = |t: &str| Pitch::parse(t).unwrap_err();
    assert!(matches!(e("30"), PitchError::BareNumber { .. }));
    let bare = e("30").to_string();
    assert!(bare.contains("\"30\"") && bare.contains("30deg") && bare.contains("/12"));
    assert!(matches!(e("0/12"), PitchError::Flat { .. }));
    assert!(matches!(e("0deg"), PitchError::Flat { .. }));
    assert!(matches!(e("-6/12"), PitchError::Negative { .. }));
    assert!(matches!(e("-30deg"), PitchError::Negative { .. }));
    assert!(matches!(e("90deg"), PitchError::TooSteep { .. }));
    assert!(matches!(e("95°"), PitchError::TooSteep { .. }));
    assert!(matches!(e("6/0"), PitchError::ZeroRun { .. }));
    assert!(matches!(e("NaN/12"), PitchError::Unreadable { .. }));
    assert!(matches!(e("steep"), PitchError::Unreadable { .. }));
    assert!(e("90deg").to_string().contains("\"90deg\""));
    assert!(matches!(Pitch::from_degrees(f64::NAN), Err(PitchError::NotFinite { .. })));
    assert!(matches!(Pitch::from_degrees(f64::INFINITY), Err(PitchError::NotFinite { .. })));
    assert!(matches!(Pitch::from_rise_per_run(-0.5), Err(PitchError::Negative { .. })));
    assert!(matches!(Pitch::from_rise_per_run(f64::INFINITY), Err(PitchError::TooSteep { .. })));
    assert!(matches!(Pitch::from_rise_per_run(1e300), Err(PitchError::TooSteep { .. })));
}

proptest! {
    #[test]
    fn length_display_round_trips_within_half_a_step(
        inches in -200_000.0f64..200_000.0,
        unit in prop_oneof![Just(LengthUnit::Inch), Just(LengthUnit::Millimetre)],
    ) {
        let length = Length::from_inches(inches);
        for style in ALL_STYLES {
            let text = length.format(style);
            let back = Length::parse(&text, unit);
            prop_assert!(back.is_ok(), "{text} did not parse: {back:?}");
            let back = back.unwrap_or(Length::ZERO);
            let half_step = Length::display_step_inches(style) / 2.0;
            // The slack above half a step is float noise in the rounding.
            prop_assert!(
                (back.inches() - inches).abs() <= half_step * (1.0 + 1e-9) + 1e-9,
                "{inches} -> {text} -> {}", back.inches()
            );
        }
    }

    #[test]
    fn feet_inches_text_parses_to_exact_sixteenths(feet in 0u32..500, sixteenths in 0u32..192) {
        let exact = f64::from(feet) * 12.0 + f64::from(sixteenths) / 16.0;
        let text = Length::from_inches(exact).to_string();
        prop_assert_eq!(Length::parse(&text, LengthUnit::Inch).map(Length::inches), Ok(exact));
        let negative = Length::from_inches(-exact).to_string();
        prop_assert_eq!(Length::parse(&negative, LengthUnit::Inch).map(Length::inches), Ok(-exact));
    }

    #[test]
    fn length_parse_never_panics(text in any::<String>()) {
        let _ = Length::parse(&text, LengthUnit::Inch);
        let _ = Length::parse(&text, LengthUnit::Millimetre);
    }

    #[test]
    fn length_parse_never_panics_on_near_misses(text in "[-+ 0-9./'\"x mcinft\u{2032}\u{2033}]{0,16}") {
        if let Ok(length) = Length::parse(&text, LengthUnit::Inch) {
            prop_assert!(length.inches().is_finite());
        }
    }

    #[test]
    fn pitch_parse_never_panics(text in any::<String>()) {
        if let Ok(pitch) = Pitch::parse(&text) {
            prop_assert!(pitch.rise_per_run() > 0.0 && pitch.degrees() < 90.0);
        }
    }

    #[test]
    fn pitch_parse_never_panics_on_near_misses(text in "[-+ 0-9./:in\u{b0}deg]{0,12}") {
        if let Ok(pitch) = Pitch::parse(&text) {
            prop_assert!(pitch.rise_per_run() > 0.0 && pitch.degrees() < 90.0);
        }
    }

    #[test]
    fn pitch_display_round_trips(rise_in_12 in 1e-6f64..200.0) {
        let pitch = Pitch::from_rise_per_run(rise_in_12 / 12.0).unwrap();
        let text = pitch.to_string();
        let back = Pitch::parse(&text);
        prop_assert!(back.is_ok(), "{text}: {back:?}");
        // Display keeps three decimals of the rise in 12.
        let back = back.map(Pitch::rise_in_12).unwrap_or(f64::NAN);
        prop_assert!((back - rise_in_12).abs() <= 0.0005 + 1e-9, "{rise_in_12} -> {text} -> {back}");
        prop_assert!(back > 0.0);
    }

    #[test]
    fn pitch_text_in_thousandths_survives_exactly(thousandths in 1u32..100_000) {
        let rise = f64::from(thousandths) / 1000.0;
        let text = format!("{rise}/12");
        let pitch = Pitch::parse(&text).unwrap();
        prop_assert_eq!(Pitch::parse(&pitch.to_string()), Ok(pitch));
    }
}
