//! The units lengths are shown in, chosen by the user for display only:
//! the plan keeps its own unit for plain numbers in the file.

use pitchframe_geometry::{Length, LengthStyle, LengthUnit};

/// How lengths are shown in the window, and how plain numbers typed into
/// a length field are read.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum DisplayUnits {
    /// Feet, inches and sixteenths: `24' 6-3/8"`.
    #[default]
    FeetInches,
    /// Inches and sixteenths: `294-3/8"`.
    Inches,
    /// Whole millimetres: `7477 mm`.
    Millimetres,
}

impl DisplayUnits {
    /// The units a plan opens in: its own unit, feet-inches for inch plans.
    pub fn for_plan_unit(unit: LengthUnit) -> Self {
        match unit {
            LengthUnit::Inch => DisplayUnits::FeetInches,
            LengthUnit::Millimetre => DisplayUnits::Millimetres,
        }
    }

    /// A length for people: a building dimension.
    pub fn format(self, length: Length) -> String {
        length.format(self.style())
    }

    /// A small length (a board size, a notch depth): inches and sixteenths
    /// rather than feet, or millimetres.
    pub fn format_small(self, length: Length) -> String {
        match self {
            DisplayUnits::FeetInches | DisplayUnits::Inches => length.format(LengthStyle::Inches),
            DisplayUnits::Millimetres => length.format(LengthStyle::Millimetres),
        }
    }

    /// The unit a typed number with no mark (`'`, `"`, `mm`) is read in.
    pub fn plain_unit(self) -> LengthUnit {
        match self {
            DisplayUnits::FeetInches | DisplayUnits::Inches => LengthUnit::Inch,
            DisplayUnits::Millimetres => LengthUnit::Millimetre,
        }
    }

    /// A typed length, read as [`Length::parse`] reads it with plain
    /// numbers in these units; the parser's message on failure.
    pub fn parse(self, text: &str) -> Result<Length, String> {
        Length::parse(text, self.plain_unit()).map_err(|err| err.to_string())
    }

    /// How lengths are written in these units.
    pub fn style(self) -> LengthStyle {
        match self {
            DisplayUnits::FeetInches => LengthStyle::FeetInches,
            DisplayUnits::Inches => LengthStyle::Inches,
            DisplayUnits::Millimetres => LengthStyle::Millimetres,
        }
    }

    /// The two snapping steps offered in the plan view, fine then coarse,
    /// in inches: 1 in and 1 ft, or 10 mm and 100 mm.
    pub fn snap_steps_in(self) -> [f64; 2] {
        match self {
            DisplayUnits::FeetInches | DisplayUnits::Inches => [1.0, 12.0],
            DisplayUnits::Millimetres => [10.0 / 25.4, 100.0 / 25.4],
        }
    }

    /// The snapping steps' names, as the plan view's buttons show them.
    pub fn snap_step_labels(self) -> [&'static str; 2] {
        match self {
            DisplayUnits::FeetInches | DisplayUnits::Inches => ["1 in", "1 ft"],
            DisplayUnits::Millimetres => ["10 mm", "100 mm"],
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn plain_numbers_are_read_in_the_units_shown() {
        // Derivation: 25.4 mm to the inch, exact.
        let mm = DisplayUnits::Millimetres.parse("254").unwrap();
        assert!((mm.inches() - 10.0).abs() < 1e-12);
        let inches = DisplayUnits::FeetInches.parse("254").unwrap();
        assert_eq!(inches.inches(), 254.0);
        // Marked lengths read the same whatever is shown.
        assert_eq!(DisplayUnits::Millimetres.parse("2'").unwrap().inches(), 24.0);
    }

    #[test]
    fn bad_text_gives_the_parsers_message() {
        let message = DisplayUnits::FeetInches.parse("six feet").unwrap_err();
        assert!(message.contains("is not a length"), "{message}");
    }

    #[test]
    fn small_lengths_show_without_feet() {
        let notch = Length::from_inches(17.875);
        assert_eq!(DisplayUnits::FeetInches.format(notch), "1' 5-7/8\"");
        assert_eq!(DisplayUnits::FeetInches.format_small(notch), "17-7/8\"");
        assert_eq!(DisplayUnits::Millimetres.format_small(notch), "454 mm");
    }
}
