//! The length parser on any text: it answers, never panics, and what it
//! accepts is finite, within its limit, and reads back from its own display.
#![no_main]

use libfuzzer_sys::fuzz_target;
use pitchframe_geometry::{Length, LengthStyle, LengthUnit};

fuzz_target!(|data: &[u8]| {
    let Ok(text) = std::str::from_utf8(data) else { return };
    for unit in [LengthUnit::Inch, LengthUnit::Millimetre] {
        let Ok(length) = Length::parse(text, unit) else { continue };
        let inches = length.inches();
        assert!(inches.is_finite(), "{text:?} gave {inches}");
        assert!(inches.abs() <= Length::MAX_PARSED_INCHES, "{text:?} gave {inches}");
        for style in [
            LengthStyle::FeetInches,
            LengthStyle::Inches,
            LengthStyle::DecimalInches,
            LengthStyle::Millimetres,
        ] {
            let shown = length.format(style);
            // The coarsest display rounds to 1/16 in, so reading any display
            // back lands within 1/32 in of the length (plus float noise).
            let back = Length::parse(&shown, LengthUnit::Inch).unwrap_or_else(|e| {
                panic!("{text:?} shows as {shown:?} ({style:?}), which does not read back: {e}")
            });
            let diff = (back.inches() - inches).abs();
            assert!(
                diff <= 1.0 / 32.0 + 1e-9 * inches.abs(),
                "{text:?} shows as {shown:?}, read back {} in, was {inches} in",
                back.inches()
            );
        }
    }
});
