//! Lengths: inches inside, feet-inches-sixteenths or millimetres at the edges.
//!
//! Parsing accepts what framers type (`24' 6-3/8"`, `6-3/8`, `600 mm`,
//! `2.4m`); formatting rounds only for display.

use std::fmt;
use std::ops::{Add, Div, Mul, Neg, Sub};

use serde::{Deserialize, Serialize};

use crate::shown::shown;
use thiserror::Error;

/// Millimetres in one inch, exact by definition (1959 international inch).
const MM_PER_INCH: f64 = 25.4;

/// Sixteenths in one foot.
const SIXTEENTHS_PER_FOOT: f64 = 192.0;

/// The unit a plain number (one with no mark such as `'`, `"` or `mm`) is
/// read in.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum LengthUnit {
    /// Plain numbers are inches.
    Inch,
    /// Plain numbers are millimetres.
    Millimetre,
}

/// How a length is written for people.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum LengthStyle {
    /// Feet, inches and sixteenths: `24' 6-3/8"`.
    FeetInches,
    /// Inches and sixteenths: `294-3/8"`.
    Inches,
    /// Inches to three decimals: `294.375"`.
    DecimalInches,
    /// Whole millimetres: `7477 mm`.
    Millimetres,
}

/// A length, stored in inches at full precision.
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Default, Serialize, Deserialize)]
#[serde(transparent)]
pub struct Length {
    inches: f64,
}

/// Why a text could not be read as a length.
#[derive(Debug, Clone, PartialEq, Eq, Error)]
pub enum LengthError {
    /// Nothing but blanks was given.
    #[error("no length was given (the text is empty)")]
    Empty,
    /// The text does not follow any length pattern.
    #[error("\"{text}\" is not a length: {problem}; write it like 24' 6-3/8\", 6-3/8\", 294.375 or 600 mm")]
    Unreadable {
        /// The text as given.
        text: String,
        /// What is wrong, in words.
        problem: String,
    },
    /// A fraction such as `3/0`.
    #[error("\"{text}\" has a zero denominator")]
    ZeroDenominator {
        /// The text as given.
        text: String,
    },
    /// A whole number followed by a fraction of one or more, such as `6-9/8`.
    #[error(
        "\"{text}\" has the fraction {fraction} after a whole number; the fraction must be under 1, like 6-3/8"
    )]
    ImproperFraction {
        /// The text as given.
        text: String,
        /// The offending fraction as written.
        fraction: String,
    },
    /// Twelve or more inches after a feet figure, such as `24' 14"`.
    #[error("\"{text}\" has {inches} inches after the feet; inches after feet must be under 12")]
    TooManyInches {
        /// The text as given.
        text: String,
        /// The inches figure as read.
        inches: String,
    },
    /// A fraction used with a metric unit.
    #[error(
        "\"{text}\" puts a fraction on a metric length; fractions are for inches (mark them with \") and metric lengths take decimals, like 6.5 mm"
    )]
    FractionInMetric {
        /// The text as given.
        text: String,
    },
    /// A magnitude beyond any building, or beyond what f64 holds.
    #[error("\"{text}\" is too large to be a length on a building")]
    TooLarge {
        /// The text as given.
        text: String,
    },
}

impl Length {
    /// Zero length.
    pub const ZERO: Length = Length { inches: 0.0 };

    /// The largest magnitude [`Length::parse`] accepts, in inches (about
    /// 1,578 miles): anything bigger is a typing slip, and keeping well
    /// inside f64's exact-integer range keeps sixteenth rounding exact.
    pub const MAX_PARSED_INCHES: f64 = 1.0e8;

    /// A length of `inches` inches; `inches` should be finite.
    pub const fn from_inches(inches: f64) -> Self {
        Self { inches }
    }

    /// A length of `feet` feet.
    pub fn from_feet(feet: f64) -> Self {
        Self { inches: feet * 12.0 }
    }

    /// A length of `mm` millimetres.
    pub fn from_mm(mm: f64) -> Self {
        Self { inches: mm / MM_PER_INCH }
    }

    /// The length in inches.
    pub const fn inches(self) -> f64 {
        self.inches
    }

    /// The length in feet.
    pub fn feet(self) -> f64 {
        self.inches / 12.0
    }

    /// The length in millimetres.
    pub fn mm(self) -> f64 {
        self.inches * MM_PER_INCH
    }

    /// The magnitude of the length.
    pub fn abs(self) -> Self {
        Self { inches: self.inches.abs() }
    }

    /// The smallest step `style` shows, in inches; a displayed value is
    /// within half of this of the true value.
    pub fn display_step_inches(style: LengthStyle) -> f64 {
        match style {
            LengthStyle::FeetInches | LengthStyle::Inches => 1.0 / 16.0,
            LengthStyle::DecimalInches => 0.001,
            LengthStyle::Millimetres => 1.0 / MM_PER_INCH,
        }
    }

    /// Reads a length as a framer types it.
    ///
    /// Feet are marked `'` (or `ft`), inches `"` (or `in`, `''`); metric
    /// lengths carry `mm`, `cm` or `m`. A number with no mark at all is read
    /// in `plain_unit`. Fractions (`6-3/8`, `6 3/8`, `3/4`) are inches only.
    /// A leading minus makes the whole length negative.
    ///
    /// ```
    /// use pitchframe_geometry::{Length, LengthUnit};
    /// let l = Length::parse("24' 6-3/8\"", LengthUnit::Inch).unwrap();
    /// assert_eq!(l.inches(), 294.375);
    /// let m = Length::parse("600 mm", LengthUnit::Inch).unwrap();
    /// assert!((m.mm() - 600.0).abs() < 1e-9);
    /// ```
    pub fn parse(text: &str, plain_unit: LengthUnit) -> Result<Length, LengthError> {
        let trimmed = text.trim();
        if trimmed.is_empty() {
            return Err(LengthError::Empty);
        }
        let lower = trimmed.to_lowercase();
        let inches = parse_inches(&lower, plain_unit).map_err(|fault| fault.into_error(trimmed))?;
        if !inches.is_finite() || inches.abs() > Self::MAX_PARSED_INCHES {
            return Err(LengthError::TooLarge { text: shown(trimmed) });
        }
        Ok(Length { inches })
    }

    /// Writes the length for people in `style`, rounding only here.
    ///
    /// ```
    /// use pitchframe_geometry::{Length, LengthStyle};
    /// let l = Length::from_inches(294.375);
    /// assert_eq!(l.format(LengthStyle::FeetInches), "24' 6-3/8\"");
    /// assert_eq!(l.format(LengthStyle::Inches), "294-3/8\"");
    /// assert_eq!(l.format(LengthStyle::DecimalInches), "294.375\"");
    /// assert_eq!(l.format(LengthStyle::Millimetres), "7477 mm");
    /// ```
    pub fn format(self, style: LengthStyle) -> String {
        if !self.inches.is_finite() {
            return format!("{}\"", self.inches);
        }
        match style {
            LengthStyle::FeetInches => format_sixteenths(self.inches, true),
            LengthStyle::Inches => format_sixteenths(self.inches, false),
            LengthStyle::DecimalInches => {
                let rounded = (self.inches * 1000.0).round() / 1000.0;
                // Adding 0.0 turns a rounded -0.0 into 0.0 so tiny negatives print as 0.
                format!("{:.3}\"", rounded + 0.0)
            }
            LengthStyle::Millimetres => format!("{:.0} mm", self.mm().round() + 0.0),
        }
    }
}

/// Writes `inches` in sixteenths, as feet-inches or as inches alone.
fn format_sixteenths(inches: f64, with_feet: bool) -> String {
    // Round the whole length to sixteenths first, then split: rounding the
    // parts separately would print 11-15/16" + 1/32 as 12" instead of 1'.
    let total = (inches.abs() * 16.0).round();
    if total == 0.0 {
        return "0\"".to_string();
    }
    let sign = if inches < 0.0 { "-" } else { "" };
    let (feet, rest) = if with_feet {
        let feet = (total / SIXTEENTHS_PER_FOOT).floor();
        (feet, total - feet * SIXTEENTHS_PER_FOOT)
    } else {
        (0.0, total)
    };
    let whole_inches = (rest / 16.0).floor();
    // `rest - whole * 16` is an exact small integer in 0..16.
    let sixteenths = (rest - whole_inches * 16.0) as u32;
    // After feet, zero inches are written out (`1' 0-5/8"`) so the fraction
    // cannot be misread as whole inches.
    let inch_text = match (whole_inches == 0.0 && feet == 0.0, reduced_fraction(sixteenths)) {
        (_, None) => format!("{whole_inches:.0}\""),
        (true, Some(fraction)) => format!("{fraction}\""),
        (false, Some(fraction)) => format!("{whole_inches:.0}-{fraction}\""),
    };
    if feet > 0.0 { format!("{sign}{feet:.0}' {inch_text}") } else { format!("{sign}{inch_text}") }
}

/// `n/16` in lowest terms, or `None` when `n` is zero.
fn reduced_fraction(sixteenths: u32) -> Option<String> {
    if sixteenths == 0 {
        return None;
    }
    let mut numerator = sixteenths;
    let mut denominator = 16;
    while numerator.is_multiple_of(2) {
        numerator /= 2;
        denominator /= 2;
    }
    Some(format!("{numerator}/{denominator}"))
}

impl fmt::Display for Length {
    /// Feet, inches and sixteenths, as on a cut list.
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        f.write_str(&self.format(LengthStyle::FeetInches))
    }
}

impl Add for Length {
    type Output = Length;
    fn add(self, other: Length) -> Length {
        Length { inches: self.inches + other.inches }
    }
}

impl Sub for Length {
    type Output = Length;
    fn sub(self, other: Length) -> Length {
        Length { inches: self.inches - other.inches }
    }
}

impl Neg for Length {
    type Output = Length;
    fn neg(self) -> Length {
        Length { inches: -self.inches }
    }
}

impl Mul<f64> for Length {
    type Output = Length;
    fn mul(self, factor: f64) -> Length {
        Length { inches: self.inches * factor }
    }
}

impl Div<f64> for Length {
    type Output = Length;
    fn div(self, divisor: f64) -> Length {
        Length { inches: self.inches / divisor }
    }
}

/// What went wrong inside the parser, before the input text is attached.
enum Fault {
    Unreadable(String),
    ZeroDenominator,
    ImproperFraction(String),
    TooManyInches(String),
    FractionInMetric,
    TooLarge,
}

impl Fault {
    fn into_error(self, text: &str) -> LengthError {
        let text = shown(text);
        match self {
            Fault::Unreadable(problem) => LengthError::Unreadable { text, problem },
            Fault::ZeroDenominator => LengthError::ZeroDenominator { text },
            Fault::ImproperFraction(fraction) => LengthError::ImproperFraction { text, fraction },
            Fault::TooManyInches(inches) => LengthError::TooManyInches { text, inches },
            Fault::FractionInMetric => LengthError::FractionInMetric { text },
            Fault::TooLarge => LengthError::TooLarge { text },
        }
    }
}

/// A number as typed: a decimal, a fraction, or a whole number and a fraction.
struct Amount {
    value: f64,
    has_fraction: bool,
}

/// Marks that end a feet figure; longer spellings first.
const FEET_MARKS: [&str; 5] = ["feet", "foot", "ft", "'", "\u{2032}"];
/// Marks that end an inches figure; they are tried before the feet marks so
/// that `''` is not read as a feet mark.
const INCH_MARKS: [&str; 6] = ["inches", "inch", "in", "\"", "''", "\u{2033}"];

/// Parses lower-cased, trimmed text into inches.
fn parse_inches(text: &str, plain_unit: LengthUnit) -> Result<f64, Fault> {
    let mut cursor = Cursor { rest: text };
    let negative = if cursor.eat("-") || cursor.eat("\u{2212}") {
        true
    } else {
        cursor.eat("+");
        false
    };
    cursor.skip_blanks();
    let Some(first) = cursor.amount()? else {
        return Err(Fault::Unreadable(if cursor.rest.is_empty() {
            "there is no number after the sign".to_string()
        } else {
            format!("expected a number at \"{}\"", shown(cursor.rest))
        }));
    };
    cursor.skip_blanks();
    let magnitude = if let Some(mm_per_unit) = cursor.metric_unit() {
        if first.has_fraction {
            return Err(Fault::FractionInMetric);
        }
        cursor.expect_end()?;
        first.value * mm_per_unit / MM_PER_INCH
    } else if cursor.eat_mark(&INCH_MARKS) {
        cursor.expect_end()?;
        first.value
    } else if cursor.eat_mark(&FEET_MARKS) {
        feet_then_inches(&mut cursor, first.value)?
    } else {
        cursor.expect_end()?;
        match plain_unit {
            LengthUnit::Inch => first.value,
            LengthUnit::Millimetre if first.has_fraction => return Err(Fault::FractionInMetric),
            LengthUnit::Millimetre => first.value / MM_PER_INCH,
        }
    };
    Ok(if negative { -magnitude } else { magnitude })
}

/// Reads what may follow a feet figure: nothing, or an inches figure.
fn feet_then_inches(cursor: &mut Cursor<'_>, feet: f64) -> Result<f64, Fault> {
    cursor.skip_blanks();
    // `24'-6"`: the dash after the feet mark only separates.
    let dashed = cursor.eat("-");
    cursor.skip_blanks();
    if cursor.rest.is_empty() {
        if dashed {
            return Err(Fault::Unreadable("there is nothing after the dash".to_string()));
        }
        return Ok(feet * 12.0);
    }
    let Some(inches) = cursor.amount()? else {
        return Err(Fault::Unreadable(format!("expected inches at \"{}\"", shown(cursor.rest))));
    };
    cursor.skip_blanks();
    cursor.eat_mark(&INCH_MARKS);
    cursor.expect_end()?;
    if inches.value >= 12.0 {
        return Err(Fault::TooManyInches(trim_number(inches.value)));
    }
    Ok(feet * 12.0 + inches.value)
}

/// Writes a parsed figure back without float noise, for messages.
fn trim_number(value: f64) -> String {
    let text = format!("{value:.4}");
    text.trim_end_matches('0').trim_end_matches('.').to_string()
}

/// A read position in the text; every step is a checked prefix strip, so
/// no index can fall outside the text.
#[derive(Clone, Copy)]
struct Cursor<'a> {
    rest: &'a str,
}

impl<'a> Cursor<'a> {
    fn eat(&mut self, prefix: &str) -> bool {
        match self.rest.strip_prefix(prefix) {
            Some(rest) => {
                self.rest = rest;
                true
            }
            None => false,
        }
    }

    /// Eats one of `marks`, but a word mark (`in`, `ft`) only when no
    /// letter follows it, so `inx` stays unread.
    fn eat_mark(&mut self, marks: &[&str]) -> bool {
        for mark in marks {
            if let Some(rest) = self.rest.strip_prefix(mark) {
                let word = mark.chars().all(|c| c.is_alphabetic());
                if word && rest.chars().next().is_some_and(char::is_alphabetic) {
                    continue;
                }
                self.rest = rest;
                return true;
            }
        }
        false
    }

    /// Eats a metric unit and returns millimetres per unit.
    fn metric_unit(&mut self) -> Option<f64> {
        for (unit, mm) in [("mm", 1.0), ("cm", 10.0), ("m", 1000.0)] {
            let mut probe = *self;
            if probe.eat(unit) && !probe.rest.chars().next().is_some_and(char::is_alphabetic) {
                *self = probe;
                return Some(mm);
            }
        }
        None
    }

    fn skip_blanks(&mut self) -> bool {
        let before = self.rest.len();
        self.rest = self.rest.trim_start();
        self.rest.len() != before
    }

    fn expect_end(&self) -> Result<(), Fault> {
        if self.rest.trim().is_empty() {
            Ok(())
        } else {
            Err(Fault::Unreadable(format!("unexpected \"{}\"", shown(self.rest.trim()))))
        }
    }

    /// Eats ASCII digits; `None` when there are none.
    fn digits(&mut self) -> Option<&'a str> {
        let end = self.rest.find(|c: char| !c.is_ascii_digit()).unwrap_or(self.rest.len());
        if end == 0 {
            return None;
        }
        let (digits, rest) = self.rest.split_at(end);
        self.rest = rest;
        Some(digits)
    }

    /// Eats `12`, `12.5` or `.5`, returning the text eaten.
    fn decimal(&mut self) -> Option<&'a str> {
        let start = self.rest;
        let whole = self.digits();
        let mut probe = *self;
        if probe.eat(".") {
            let fraction = probe.digits();
            if whole.is_some() || fraction.is_some() {
                *self = probe;
            }
        }
        let used = start.len() - self.rest.len();
        if used == 0 { None } else { start.get(..used) }
    }

    /// Eats a number: `6`, `6.5`, `3/8`, `6-3/8` or `6 3/8`.
    fn amount(&mut self) -> Result<Option<Amount>, Fault> {
        let Some(first_text) = self.decimal() else {
            return Ok(None);
        };
        let first = parse_decimal(first_text)?;
        let is_whole = !first_text.contains('.');
        if self.eat("/") {
            let Some(denominator_text) = self.digits() else {
                return Err(Fault::Unreadable(format!(
                    "the fraction {}/ has no denominator",
                    shown(first_text)
                )));
            };
            if !is_whole {
                return Err(Fault::Unreadable(format!(
                    "the fraction {first_text}/{denominator_text} has a decimal numerator"
                )));
            }
            let denominator = parse_decimal(denominator_text)?;
            if denominator == 0.0 {
                return Err(Fault::ZeroDenominator);
            }
            return Ok(Some(Amount { value: first / denominator, has_fraction: true }));
        }
        // A whole number, then a blank or dash, then `n/d`.
        let mut probe = *self;
        let blank = probe.skip_blanks();
        let dash = probe.eat("-");
        probe.skip_blanks();
        if is_whole
            && (blank || dash)
            && let Some(numerator_text) = probe.digits()
            && probe.eat("/")
        {
            let Some(denominator_text) = probe.digits() else {
                return Err(Fault::Unreadable(format!(
                    "the fraction {}/ has no denominator",
                    shown(numerator_text)
                )));
            };
            let numerator = parse_decimal(numerator_text)?;
            let denominator = parse_decimal(denominator_text)?;
            if denominator == 0.0 {
                return Err(Fault::ZeroDenominator);
            }
            if numerator >= denominator {
                return Err(Fault::ImproperFraction(format!("{numerator_text}/{denominator_text}")));
            }
            *self = probe;
            return Ok(Some(Amount { value: first + numerator / denominator, has_fraction: true }));
        }
        Ok(Some(Amount { value: first, has_fraction: false }))
    }
}

/// Reads a run of digits with an optional point (already checked by the
/// cursor), refusing anything that does not fit in an f64.
fn parse_decimal(text: &str) -> Result<f64, Fault> {
    match text.parse::<f64>() {
        Ok(value) if value.is_finite() => Ok(value),
        _ => Err(Fault::TooLarge),
    }
}

/// Reads a plain decimal such as `6`, `-9.5` or `.5` (no exponent, no
/// `inf` or `NaN`), for other parsers in this crate.
pub(crate) fn parse_plain_decimal(text: &str) -> Option<f64> {
    let text = text.trim();
    let (negative, body) = match text.strip_prefix('-').or_else(|| text.strip_prefix('\u{2212}')) {
        Some(body) => (true, body),
        None => (false, text.strip_prefix('+').unwrap_or(text)),
    };
    let mut cursor = Cursor { rest: body };
    let digits = cursor.decimal()?;
    if !cursor.rest.is_empty() {
        return None;
    }
    let value = digits.parse::<f64>().ok().filter(|v| v.is_finite())?;
    Some(if negative { -value } else { value })
}

#[cfg(test)]
mod tests {
    use super::*;

    fn inches(text: &str) -> f64 {
        Length::parse(text, LengthUnit::Inch).map(Length::inches).unwrap_or(f64::NAN)
    }

    #[test]
    fn reads_feet_inches_forms() {
        assert_eq!(inches("24'"), 288.0);
        assert_eq!(inches("24' 6-3/8\""), 294.375);
        assert_eq!(inches("24'-6 3/8\""), 294.375);
        assert_eq!(inches("24' 6\""), 294.0);
        assert_eq!(inches("24 ft 6 in"), 294.0);
        assert_eq!(inches("6-3/8"), 6.375);
        assert_eq!(inches("6 3/8\""), 6.375);
        assert_eq!(inches("3/4\""), 0.75);
        assert_eq!(inches("294.375"), 294.375);
        assert_eq!(inches("-6-3/8\""), -6.375);
        assert_eq!(inches("-24' 6\""), -294.0);
        assert_eq!(inches("6''"), 6.0);
    }

    #[test]
    fn reads_metric_forms() {
        let mm = |t: &str| Length::parse(t, LengthUnit::Inch).map(Length::mm).unwrap_or(f64::NAN);
        approx::assert_relative_eq!(mm("7.2 m"), 7200.0, max_relative = 1e-12);
        approx::assert_relative_eq!(mm("600 mm"), 600.0, max_relative = 1e-12);
        approx::assert_relative_eq!(mm("600mm"), 600.0, max_relative = 1e-12);
        approx::assert_relative_eq!(mm("2.4m"), 2400.0, max_relative = 1e-12);
        approx::assert_relative_eq!(mm("45 cm"), 450.0, max_relative = 1e-12);
        let plain = Length::parse("600", LengthUnit::Millimetre).map(Length::mm);
        approx::assert_relative_eq!(plain.unwrap_or(f64::NAN), 600.0, max_relative = 1e-12);
    }

    #[test]
    fn rejects_with_reasons() {
        let err = |t: &str| Length::parse(t, LengthUnit::Inch).err().map(|e| e.to_string());
        assert_eq!(err("6-3/0").as_deref(), Some("\"6-3/0\" has a zero denominator"));
        assert!(matches!(Length::parse("", LengthUnit::Inch), Err(LengthError::Empty)));
        assert!(matches!(Length::parse("NaN", LengthUnit::Inch), Err(LengthError::Unreadable { .. })));
        assert!(matches!(Length::parse("inf", LengthUnit::Inch), Err(LengthError::Unreadable { .. })));
        assert!(matches!(
            Length::parse("24' 14\"", LengthUnit::Inch),
            Err(LengthError::TooManyInches { .. })
        ));
        assert!(matches!(
            Length::parse("6-9/8", LengthUnit::Inch),
            Err(LengthError::ImproperFraction { .. })
        ));
        assert!(matches!(
            Length::parse("3/8 mm", LengthUnit::Inch),
            Err(LengthError::FractionInMetric { .. })
        ));
        assert!(matches!(
            Length::parse("3/8", LengthUnit::Millimetre),
            Err(LengthError::FractionInMetric { .. })
        ));
        assert!(matches!(Length::parse("1e400", LengthUnit::Inch), Err(LengthError::Unreadable { .. })));
        let huge = "9".repeat(400);
        assert!(matches!(Length::parse(&huge, LengthUnit::Inch), Err(LengthError::TooLarge { .. })));
        assert!(err("12 apples").is_some_and(|m| m.contains("12 apples")));
    }

    #[test]
    fn formats_with_carry_and_sign() {
        let f = |i: f64| Length::from_inches(i).format(LengthStyle::FeetInches);
        assert_eq!(f(0.0), "0\"");
        assert_eq!(f(-0.01), "0\"");
        assert_eq!(f(11.99), "1' 0\"");
        assert_eq!(f(23.97), "2' 0\"");
        assert_eq!(f(12.0 + 11.0 + 15.5 / 16.0), "2' 0\"");
        assert_eq!(f(5.97), "6\"");
        assert_eq!(f(-294.375), "-24' 6-3/8\"");
        assert_eq!(f(0.5), "1/2\"");
        assert_eq!(f(24.5), "2' 0-1/2\"");
        assert_eq!(Length::from_inches(-0.0001).format(LengthStyle::DecimalInches), "0.000\"");
        assert_eq!(Length::from_inches(-0.001).format(LengthStyle::Millimetres), "0 mm");
    }
}
