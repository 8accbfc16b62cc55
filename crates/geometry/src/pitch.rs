//! Roof pitch: stored as rise per unit run, read and written as "x in 12",
//! degrees or a metric rise-to-run ratio.

use std::f64::consts::FRAC_PI_2;
use std::fmt;

use serde::{Deserialize, Serialize};

use crate::shown::shown;
use thiserror::Error;

use crate::length::parse_plain_decimal;

/// A roof pitch strictly between flat and vertical.
#[derive(Debug, Clone, Copy, PartialEq, PartialOrd, Serialize, Deserialize)]
#[serde(transparent)]
pub struct Pitch {
    rise_per_run: f64,
}

/// Why a text or number is not a usable pitch.
#[derive(Debug, Clone, PartialEq, Eq, Error)]
pub enum PitchError {
    /// Nothing but blanks was given.
    #[error("no pitch was given (the text is empty)")]
    Empty,
    /// A number with no `/12`, `:` or `deg`, which could mean either.
    #[error(
        "\"{text}\" is a bare number, which could be degrees or a rise in 12; write {text}deg for degrees or {text}/12 for a rise in 12"
    )]
    BareNumber {
        /// The text as given.
        text: String,
    },
    /// The text follows no pitch pattern.
    #[error("\"{text}\" is not a pitch: {problem}; write it like 6/12, 6 in 12, 1:2, 500/1000 or 26.57deg")]
    Unreadable {
        /// The text as given.
        text: String,
        /// What is wrong, in words.
        problem: String,
    },
    /// A ratio with a zero run, such as `6/0`.
    #[error("\"{text}\" has a run of zero; the run (after the / or :) must be more than 0")]
    ZeroRun {
        /// The text as given.
        text: String,
    },
    /// No rise: a flat roof has no pitch to frame.
    #[error("\"{text}\" is flat (zero rise); a pitched roof needs a rise above 0")]
    Flat {
        /// The text as given.
        text: String,
    },
    /// A negative rise, run or angle.
    #[error("\"{text}\" is negative; a pitch rises inward from the wall, so give it as a positive number")]
    Negative {
        /// The text as given.
        text: String,
    },
    /// Vertical or past vertical.
    #[error("\"{text}\" is 90 degrees or steeper; a roof pitch must be under 90 degrees")]
    TooSteep {
        /// The text as given.
        text: String,
    },
    /// NaN or an infinity.
    #[error("\"{text}\" is not a finite number")]
    NotFinite {
        /// The value as written.
        text: String,
    },
}

/// Words and signs that mark a number as degrees; longer spellings first.
const DEGREE_MARKS: [&str; 5] = ["degrees", "degree", "deg", "\u{b0}", "\u{ba}"];

impl Pitch {
    /// A pitch from rise per unit run (`0.5` is 6 in 12).
    ///
    /// ```
    /// use pitchframe_geometry::Pitch;
    /// assert_eq!(Pitch::from_rise_per_run(0.5).unwrap().to_string(), "6/12");
    /// assert!(Pitch::from_rise_per_run(0.0).is_err());
    /// ```
    pub fn from_rise_per_run(rise_per_run: f64) -> Result<Pitch, PitchError> {
        Self::checked_ratio(rise_per_run, &rise_per_run.to_string())
    }

    /// A pitch from its angle above level, in degrees.
    pub fn from_degrees(degrees: f64) -> Result<Pitch, PitchError> {
        Self::checked_degrees(degrees, &format!("{degrees} deg"))
    }

    /// Reads a pitch: `6/12`, `6 in 12`, `6:12`, `9.5/12`, `1:2`,
    /// `500/1000` (rise then run, any unit as long as both match),
    /// `26.57deg`, `26.57 deg` or `30°`.
    ///
    /// A bare number is refused: `30` could be degrees or a rise in 12.
    ///
    /// ```
    /// use pitchframe_geometry::Pitch;
    /// let p = Pitch::parse("6 in 12").unwrap();
    /// assert_eq!(p.rise_per_run(), 0.5);
    /// assert!(Pitch::parse("30").is_err());
    /// ```
    pub fn parse(text: &str) -> Result<Pitch, PitchError> {
        let trimmed = text.trim();
        if trimmed.is_empty() {
            return Err(PitchError::Empty);
        }
        let lower = trimmed.to_lowercase();
        for mark in DEGREE_MARKS {
            if let Some(number) = lower.strip_suffix(mark) {
                let Some(degrees) = parse_plain_decimal(number) else {
                    return Err(unreadable(trimmed, "expected a number of degrees before the mark"));
                };
                return Self::checked_degrees(degrees, trimmed);
            }
        }
        for separator in ["/", ":", "in"] {
            if let Some((rise_text, run_text)) = lower.split_once(separator) {
                let (Some(rise), Some(run)) = (parse_plain_decimal(rise_text), parse_plain_decimal(run_text))
                else {
                    return Err(unreadable(
                        trimmed,
                        &format!("expected a number on each side of \"{}\"", separator.trim()),
                    ));
                };
                if rise < 0.0 || run < 0.0 {
                    return Err(PitchError::Negative { text: shown(trimmed) });
                }
                if run == 0.0 {
                    return Err(PitchError::ZeroRun { text: shown(trimmed) });
                }
                return Self::checked_ratio(rise / run, trimmed);
            }
        }
        if parse_plain_decimal(&lower).is_some() {
            return Err(PitchError::BareNumber { text: shown(trimmed) });
        }
        Err(unreadable(trimmed, "no / , : , in or deg was found"))
    }

    fn checked_ratio(rise_per_run: f64, text: &str) -> Result<Pitch, PitchError> {
        let text = shown(text);
        if !rise_per_run.is_finite() {
            return Err(if rise_per_run == f64::INFINITY {
                PitchError::TooSteep { text }
            } else {
                PitchError::NotFinite { text }
            });
        }
        if rise_per_run < 0.0 {
            return Err(PitchError::Negative { text });
        }
        if rise_per_run == 0.0 {
            return Err(PitchError::Flat { text });
        }
        // A ratio so steep that its angle rounds to 90 degrees is vertical
        // for every purpose downstream (cos would be 0).
        if rise_per_run.atan() >= FRAC_PI_2 {
            return Err(PitchError::TooSteep { text });
        }
        Ok(Pitch { rise_per_run })
    }

    fn checked_degrees(degrees: f64, text: &str) -> Result<Pitch, PitchError> {
        let owned = shown(text);
        if !degrees.is_finite() {
            return Err(PitchError::NotFinite { text: owned });
        }
        if degrees < 0.0 {
            return Err(PitchError::Negative { text: owned });
        }
        if degrees == 0.0 {
            return Err(PitchError::Flat { text: owned });
        }
        if degrees >= 90.0 {
            return Err(PitchError::TooSteep { text: owned });
        }
        Self::checked_ratio(degrees.to_radians().tan(), text)
    }

    /// Rise per unit run (`tan` of the pitch angle).
    pub fn rise_per_run(self) -> f64 {
        self.rise_per_run
    }

    /// The pitch angle above level, in radians.
    pub fn angle_rad(self) -> f64 {
        self.rise_per_run.atan()
    }

    /// The pitch angle above level, in degrees.
    pub fn degrees(self) -> f64 {
        self.angle_rad().to_degrees()
    }

    /// Rise in inches per 12 inches of run (the "x in 12" figure).
    pub fn rise_in_12(self) -> f64 {
        self.rise_per_run * 12.0
    }

    /// Rafter length per unit of run (`sec` of the pitch angle).
    pub fn length_per_run(self) -> f64 {
        self.rise_per_run.hypot(1.0)
    }

    /// The angle written for people, to two decimals: `26.57 deg`.
    pub fn degrees_text(self) -> String {
        format!("{} deg", trimmed_decimals(self.degrees(), 2))
    }
}

impl fmt::Display for Pitch {
    /// The "x in 12" form with up to three decimals, trailing zeros
    /// dropped: `6/12`, `9.5/12` (more decimals only for a rise too small
    /// to show in three).
    fn fmt(&self, f: &mut fmt::Formatter<'_>) -> fmt::Result {
        let rise = self.rise_in_12();
        if rise < 0.0005 {
            // Three decimals would print 0/12, which is no pitch at all;
            // write the shortest text that reads back exactly instead.
            return write!(f, "{rise}/12");
        }
        write!(f, "{}/12", trimmed_decimals(rise, 3))
    }
}

/// `value` to at most `places` decimals with trailing zeros dropped.
fn trimmed_decimals(value: f64, places: usize) -> String {
    let text = format!("{value:.places$}");
    if text.contains('.') { text.trim_end_matches('0').trim_end_matches('.').to_string() } else { text }
}

fn unreadable(text: &str, problem: &str) -> PitchError {
    PitchError::Unreadable { text: shown(text), problem: problem.to_string() }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn ratio(text: &str) -> f64 {
        Pitch::parse(text).map(Pitch::rise_per_run).unwrap_or(f64::NAN)
    }

    #[test]
    fn reads_every_written_form() {
        for text in ["6/12", "6 in 12", "6:12", "6in12", " 6 / 12 ", "1:2", "500/1000"] {
            assert_eq!(ratio(text), 0.5, "{text}");
        }
        assert_eq!(ratio("9.5/12"), 9.5 / 12.0);
        approx::assert_relative_eq!(ratio("30°"), 30f64.to_radians().tan(), max_relative = 1e-12);
        approx::assert_relative_eq!(ratio("26.57 deg"), 0.5, epsilon = 1e-3);
        approx::assert_relative_eq!(ratio("26.57deg"), 0.5, epsilon = 1e-3);
    }

    #[test]
    fn refuses_with_reasons() {
        let refused = |t: &str| Pitch::parse(t).err();
        assert!(matches!(refused("30"), Some(PitchError::BareNumber { .. })));
        assert!(refused("30").is_some_and(|e| e.to_string().contains("30deg")));
        assert!(matches!(refused("0/12"), Some(PitchError::Flat { .. })));
        assert!(matches!(refused("-6/12"), Some(PitchError::Negative { .. })));
        assert!(matches!(refused("6/0"), Some(PitchError::ZeroRun { .. })));
        assert!(matches!(refused("90deg"), Some(PitchError::TooSteep { .. })));
        assert!(matches!(refused("nan/12"), Some(PitchError::Unreadable { .. })));
        assert!(matches!(refused("inf deg"), Some(PitchError::Unreadable { .. })));
        assert!(matches!(refused(""), Some(PitchError::Empty)));
        assert!(matches!(Pitch::from_rise_per_run(f64::NAN), Err(PitchError::NotFinite { .. })));
        assert!(matches!(Pitch::from_rise_per_run(f64::INFINITY), Err(PitchError::TooSteep { .. })));
        assert!(matches!(Pitch::from_degrees(-3.0), Err(PitchError::Negative { .. })));
    }

    #[test]
    fn displays_in_12() {
        let shown = |t: &str| Pitch::parse(t).map(|p| p.to_string()).unwrap_or_default();
        assert_eq!(shown("6/12"), "6/12");
        assert_eq!(shown("9.5/12"), "9.5/12");
        assert_eq!(shown("1:2"), "6/12");
        assert_eq!(shown("45deg"), "12/12");
    }
}
