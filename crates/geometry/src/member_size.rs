//! Lumber sizes: nominal US sizes mapped to their dressed sizes, metric
//! sizes in millimetres, and explicit sizes.

use serde::Serialize;
use thiserror::Error;

use crate::shown::shown;
use crate::{Length, LengthError, LengthStyle, LengthUnit};

/// A member's cross-section: thickness (the narrow face) and depth.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct MemberSize {
    thickness: Length,
    depth: Length,
    name: String,
}

/// Why a text is not a member size.
#[derive(Debug, Clone, PartialEq, Eq, Error)]
pub enum MemberSizeError {
    /// Nothing but blanks was given.
    #[error("no member size was given (the text is empty)")]
    Empty,
    /// No `x` between thickness and depth.
    #[error("\"{text}\" is not a member size: write thickness x depth, like 2x8, 45x195 mm or 1.5x7.25")]
    NoSeparator {
        /// The text as given.
        text: String,
    },
    /// Whole numbers that are not a nominal size this table knows.
    #[error(
        "\"{text}\" is not a nominal lumber size known here (1x, 2x, 3x or 4x by 2 to 14); give the \
         dressed size in inches like 1.5x7.25, or millimetres like 45x195 mm"
    )]
    UnknownNominal {
        /// The text as given.
        text: String,
    },
    /// One side could not be read as a length.
    #[error("\"{text}\": the {side} could not be read: {source}")]
    Side {
        /// The text as given.
        text: String,
        /// `thickness` or `depth`.
        side: &'static str,
        /// Why the side was refused.
        source: LengthError,
    },
    /// A side of zero or less.
    #[error("\"{text}\": the {side} must be more than zero")]
    NotPositive {
        /// The text as given.
        text: String,
        /// `thickness` or `depth`.
        side: &'static str,
    },
    /// Thickness given larger than depth, probably swapped.
    #[error("\"{text}\": the thickness is larger than the depth; give the thickness first, like 2x8")]
    ThicknessOverDepth {
        /// The text as given.
        text: String,
    },
}

/// Nominal inches to dressed (dry) inches for dimension lumber, from the
/// US softwood lumber standard, PS 20 (from memory): 1 -> 3/4, 2 -> 1-1/2,
/// 3 -> 2-1/2, 4 -> 3-1/2, 6 -> 5-1/2, then 8 and up lose 3/4.
fn dressed_inches(nominal: u32) -> Option<f64> {
    match nominal {
        1 => Some(0.75),
        2 => Some(1.5),
        3 => Some(2.5),
        4 => Some(3.5),
        6 => Some(5.5),
        8 => Some(7.25),
        10 => Some(9.25),
        12 => Some(11.25),
        14 => Some(13.25),
        _ => None,
    }
}

/// Signs written between thickness and depth.
const SEPARATORS: [char; 4] = ['x', 'X', '\u{d7}', '*'];

impl MemberSize {
    /// Reads a member size: nominal `2x8` (dressed to 1-1/2 x 7-1/4),
    /// metric `45x195 mm` (or `45x195` when `plan_unit` is millimetres),
    /// or explicit `1.5x7.25`, `1-1/2 x 7-1/4"`, each side in any form
    /// [`Length::parse`] reads.
    ///
    /// ```
    /// use pitchframe_geometry::{LengthUnit, MemberSize};
    /// let size = MemberSize::parse("2x10", LengthUnit::Inch).unwrap();
    /// assert_eq!(size.depth().inches(), 9.25);
    /// ```
    pub fn parse(text: &str, plan_unit: LengthUnit) -> Result<MemberSize, MemberSizeError> {
        let trimmed = text.trim();
        if trimmed.is_empty() {
            return Err(MemberSizeError::Empty);
        }
        let Some((thickness_text, depth_text)) = trimmed.split_once(SEPARATORS) else {
            return Err(MemberSizeError::NoSeparator { text: shown(trimmed) });
        };
        let (thickness_text, depth_text) = (thickness_text.trim(), depth_text.trim());
        let whole = |s: &str| !s.is_empty() && s.chars().all(|c| c.is_ascii_digit());

        if whole(thickness_text) && whole(depth_text) {
            let nominal = (thickness_text.parse::<u32>().ok(), depth_text.parse::<u32>().ok());
            if let (Some(t), Some(d)) = nominal {
                // Nominal thicknesses stop at 4x: bigger sections are timbers,
                // dressed differently.
                let dressed = (t <= 4 && t <= d).then(|| dressed_inches(t).zip(dressed_inches(d))).flatten();
                if let Some((thickness_in, depth_in)) = dressed {
                    return Ok(MemberSize {
                        thickness: Length::from_inches(thickness_in),
                        depth: Length::from_inches(depth_in),
                        name: format!("{t}x{d}"),
                    });
                }
            }
            if plan_unit == LengthUnit::Inch {
                return Err(MemberSizeError::UnknownNominal { text: shown(trimmed) });
            }
        }

        // `45x195 mm` and `1.5x7.25"`: a unit after the depth covers both
        // sides when the thickness has none of its own.
        let depth_unit = trailing_unit(depth_text);
        let thickness_owned;
        let thickness_text = if !depth_unit.is_empty() && trailing_unit(thickness_text).is_empty() {
            thickness_owned = format!("{thickness_text} {depth_unit}");
            thickness_owned.as_str()
        } else {
            thickness_text
        };
        let side = |side: &'static str, part: &str| {
            Length::parse(part, plan_unit).map_err(|source| MemberSizeError::Side {
                text: shown(trimmed),
                side,
                source,
            })
        };
        // The depth first: its unit is borrowed by the thickness, so a fault
        // there is the one to report.
        let depth = side("depth", depth_text)?;
        let thickness = side("thickness", thickness_text)?;
        let metric =
            depth_unit.ends_with('m') || (depth_unit.is_empty() && plan_unit == LengthUnit::Millimetre);
        Self::checked(thickness, depth, trimmed, metric)
    }

    /// A size from explicit thickness and depth (both above zero,
    /// thickness not over depth).
    pub fn custom(thickness: Length, depth: Length) -> Result<MemberSize, MemberSizeError> {
        let text =
            format!("{} x {}", thickness.format(LengthStyle::Inches), depth.format(LengthStyle::Inches));
        Self::checked(thickness, depth, &text, false)
    }

    fn checked(
        thickness: Length,
        depth: Length,
        text: &str,
        metric: bool,
    ) -> Result<MemberSize, MemberSizeError> {
        for (side, value) in [("thickness", thickness), ("depth", depth)] {
            let usable = value.inches().is_finite() && value.inches() > 0.0;
            if !usable {
                return Err(MemberSizeError::NotPositive { text: shown(text), side });
            }
        }
        if thickness > depth {
            return Err(MemberSizeError::ThicknessOverDepth { text: shown(text) });
        }
        let name = if metric {
            format!("{:.0}x{:.0} mm", thickness.mm(), depth.mm())
        } else {
            format!("{} x {}", thickness.format(LengthStyle::Inches), depth.format(LengthStyle::Inches))
        };
        Ok(MemberSize { thickness, depth, name })
    }

    /// Thickness: the member's narrow dimension.
    pub fn thickness(&self) -> Length {
        self.thickness
    }

    /// Depth: the member's wide dimension, measured square to its edge.
    pub fn depth(&self) -> Length {
        self.depth
    }

    /// The size as people call it: `2x8`, `45x195 mm`, `1-1/2" x 7-1/4"`.
    pub fn name(&self) -> &str {
        &self.name
    }
}

/// The unit word or mark at the end of a side, lower-cased: `mm`, `"`, or
/// empty when the side ends in a digit.
fn trailing_unit(text: &str) -> String {
    let start = text.trim_end().rfind(|c: char| c.is_ascii_digit()).map_or(0, |i| i + 1);
    text.get(start..).unwrap_or("").trim().to_lowercase()
}

#[cfg(test)]
mod tests {
    use super::*;

    fn size(text: &str, unit: LengthUnit) -> (f64, f64) {
        MemberSize::parse(text, unit)
            .map(|s| (s.thickness().inches(), s.depth().inches()))
            .unwrap_or((f64::NAN, f64::NAN))
    }

    #[test]
    fn nominal_sizes_are_dressed() {
        // US PS 20 dressed (dry) sizes, from memory.
        assert_eq!(size("2x4", LengthUnit::Inch), (1.5, 3.5));
        assert_eq!(size("2x6", LengthUnit::Inch), (1.5, 5.5));
        assert_eq!(size("2x8", LengthUnit::Inch), (1.5, 7.25));
        assert_eq!(size("2 x 10", LengthUnit::Inch), (1.5, 9.25));
        assert_eq!(size("2X12", LengthUnit::Inch), (1.5, 11.25));
        assert_eq!(size("4x12", LengthUnit::Millimetre), (3.5, 11.25));
        assert_eq!(size("1x8", LengthUnit::Inch), (0.75, 7.25));
    }

    #[test]
    fn metric_and_explicit_sizes() {
        let (t, d) = size("45x195 mm", LengthUnit::Inch);
        assert!((t * 25.4 - 45.0).abs() < 1e-9 && (d * 25.4 - 195.0).abs() < 1e-9);
        let (t, d) = size("45x195", LengthUnit::Millimetre);
        assert!((t * 25.4 - 45.0).abs() < 1e-9 && (d * 25.4 - 195.0).abs() < 1e-9);
        assert_eq!(size("1.5x7.25", LengthUnit::Inch), (1.5, 7.25));
        assert_eq!(size("1-1/2 x 7-1/4\"", LengthUnit::Millimetre), (1.5, 7.25));
        let name = MemberSize::parse("45x195mm", LengthUnit::Inch).map(|s| s.name().to_string());
        assert_eq!(name.as_deref(), Ok("45x195 mm"));
    }

    #[test]
    fn refuses_with_reasons() {
        let e = |t: &str| MemberSize::parse(t, LengthUnit::Inch).err();
        assert!(matches!(e("45x195"), Some(MemberSizeError::UnknownNominal { .. })));
        assert!(matches!(e("2by8"), Some(MemberSizeError::NoSeparator { .. })));
        assert!(matches!(e("1.5x0"), Some(MemberSizeError::NotPositive { .. })));
        assert!(matches!(e("7.25x1.5"), Some(MemberSizeError::ThicknessOverDepth { .. })));
        assert!(matches!(e("1.5xabc"), Some(MemberSizeError::Side { side: "depth", .. })));
        assert!(matches!(e(""), Some(MemberSizeError::Empty)));
        assert!(MemberSize::custom(Length::from_inches(f64::NAN), Length::from_inches(3.0)).is_err());
    }

    proptest::proptest! {
        #[test]
        fn parse_never_panics(text in "\\PC{0,24}") {
            let _ = MemberSize::parse(&text, LengthUnit::Inch);
            let _ = MemberSize::parse(&text, LengthUnit::Millimetre);
        }

        #[test]
        fn parsed_sizes_are_positive(text in "[0-9 ./x\"m-]{0,14}") {
            if let Ok(size) = MemberSize::parse(&text, LengthUnit::Inch) {
                proptest::prop_assert!(size.thickness().inches() > 0.0);
                proptest::prop_assert!(size.thickness() <= size.depth());
            }
        }
    }
}
