//! Framing-square figures as the square is marked and read: inches to the
//! nearest sixteenth on an inch square, whole millimetres on a metric one.
//!
//! The framing reads every square setting as `[12, x]` in inches. Printed
//! output turns that into the pair a framer holds: 12 and x for inch plans
//! (17 and the common's rise for a regular hip or valley's plumb and seat
//! lines, as the trade holds them), 300 and x in millimetres for metric
//! plans (metric practice, trade.md section 7).

use pitchframe_geometry::{Length, LengthStyle, MarkAlong, SquareSetting};

/// The figure an inch square is read against for a regular hip or valley:
/// the hip's run per foot of common run, 12 x sqrt 2 = 16.97, held at 17
/// (trade.md section 2, common practice).
const HIP_RUN_FIGURE: f64 = 17.0;
/// The figure a metric square is read against, millimetres (TRADA edge
/// cuts "300:269", trade.md section 7).
const METRIC_AGAINST_MM: f64 = 300.0;
/// How close to a whole sixteenth a regular hip's common rise must come to
/// be held as 17 and that rise: a thousandth of an inch, well inside what
/// a square can be read to.
const SIXTEENTH_TOLERANCE_IN: f64 = 1e-3;

/// Inches per unit of a square figure: 1 on an inch square, 1/25.4 on a
/// metric one (figures in millimetres).
pub(crate) fn figure_unit_in(style: LengthStyle) -> f64 {
    if style == LengthStyle::Millimetres { 1.0 / 25.4 } else { 1.0 }
}

/// A framing-square figure in words as the square is marked: on an inch
/// square to the nearest sixteenth with no trailing zeros ("6", "6-1/8",
/// "11-5/16"), on a metric square in whole millimetres ("173"); a figure
/// no square can show (not finite) as "-".
pub fn square_figure_text(figure: f64, style: LengthStyle) -> String {
    if !figure.is_finite() {
        return "-".to_string();
    }
    if style == LengthStyle::Millimetres {
        return format!("{:.0}", figure.round() + 0.0);
    }
    Length::from_inches(figure).format(LengthStyle::Inches).trim_end_matches('"').to_string()
}

/// An angle in degrees as a saw's scale is read: to a tenth, a whole
/// degree without its ".0" ("45 deg", "26.6 deg").
pub(crate) fn degrees_text(degrees: f64) -> String {
    let tenths = (degrees * 10.0).round() + 0.0;
    if tenths % 10.0 == 0.0 {
        format!("{:.0} deg", tenths / 10.0)
    } else {
        format!("{:.1} deg", tenths / 10.0)
    }
}

/// A square setting's two figures as "other & marked" ("12 & 6"; metric
/// "300 & 173 mm").
pub(crate) fn square_pair_text(other: f64, mark: f64, style: LengthStyle) -> String {
    let unit = if style == LengthStyle::Millimetres { " mm" } else { "" };
    format!("{} & {}{unit}", square_figure_text(other, style), square_figure_text(mark, style))
}

/// Whether a square figure pair is held as the trade holds a regular hip
/// or valley's plumb line.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub(crate) enum SquareUse {
    /// Any line: 12 (or 300) and the figure.
    Plain,
    /// A hip or valley's plumb or level line on its side face: 17 and the
    /// commons' rise where the hip is regular.
    HipPlumb,
}

/// The square setting a framer holds for the framing's `[12, x]` figures
/// (inches), in the plan's units, with its setup in words.
pub(crate) fn square_setting(
    square: [f64; 2],
    mark_along: MarkAlong,
    use_: SquareUse,
    style: LengthStyle,
    setup: impl Fn(&str, &str, &str) -> String,
) -> SquareSetting {
    let [against_in, figure_in] = square;
    let ratio = if against_in.abs() > 1e-12 { figure_in / against_in } else { f64::INFINITY };
    let (against, figure) = if style == LengthStyle::Millimetres {
        (METRIC_AGAINST_MM, METRIC_AGAINST_MM * ratio)
    } else {
        let hip_rise = 12.0 * std::f64::consts::SQRT_2 * ratio;
        let on_sixteenth = ((hip_rise * 16.0).round() / 16.0 - hip_rise).abs() < SIXTEENTH_TOLERANCE_IN;
        if use_ == SquareUse::HipPlumb && on_sixteenth && hip_rise > 0.0 {
            (HIP_RUN_FIGURE, hip_rise)
        } else {
            (against_in, figure_in)
        }
    };
    let (mark, other) = match mark_along {
        MarkAlong::Figure => (figure, against),
        MarkAlong::Against => (against, figure),
    };
    let unit = if style == LengthStyle::Millimetres { " mm" } else { "" };
    let text = |value: f64| format!("{}{unit}", square_figure_text(value, style));
    SquareSetting {
        figure,
        against,
        mark_along,
        setup: setup(&text(against), &text(figure), &text(mark)).replace("{other}", &text(other)),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn inch_figures_read_to_the_sixteenth_without_trailing_zeros() {
        let f = |x: f64| square_figure_text(x, LengthStyle::FeetInches);
        // 6 in 12: 12 and 6 (trade.md section 2, common practice).
        assert_eq!(f(6.0), "6");
        assert_eq!(f(12.0), "12");
        // Hip side cut at 6 in 12: 12 x 16.97 / 18 = 11.314 (trade.md
        // section 2, line 6) reads 11-5/16 on the square.
        assert_eq!(f(11.314), "11-5/16");
        // Jack side cut at 6 in 12: 144 / 13.416 = 10.733 (line 5), 10-3/4.
        assert_eq!(f(10.733), "10-3/4");
        // 4.243 (a hip's rise per 12 of its own run at 6 in 12) to 4-1/4.
        assert_eq!(f(4.243), "4-1/4");
        assert_eq!(f(f64::INFINITY), "-");
    }

    #[test]
    fn degrees_drop_a_trailing_zero() {
        assert_eq!(degrees_text(45.0), "45 deg");
        assert_eq!(degrees_text(0.02), "0 deg");
        assert_eq!(degrees_text(26.565), "26.6 deg");
        assert_eq!(degrees_text(19.96), "20 deg");
    }

    #[test]
    fn metric_figures_read_in_whole_millimetres_against_300() {
        // TRADA Timber 2020 Yearbook p. 169 (35 deg): hip edge cut 300:269.
        // The hip's top-edge figure against 12 is 12 x 16.97 / Lh with
        // Lh = sqrt(288 + (12 tan 35)^2) (trade.md section 2, line 6).
        let r = 12.0 * 35f64.to_radians().tan();
        let hip = 12.0 * 12.0 * std::f64::consts::SQRT_2 / (288.0 + r * r).sqrt();
        let s = square_setting(
            [12.0, hip],
            MarkAlong::Against,
            SquareUse::Plain,
            LengthStyle::Millimetres,
            |a, b, _| format!("{a} and {b}"),
        );
        assert_eq!(s.against, 300.0);
        assert_eq!(square_figure_text(s.figure, LengthStyle::Millimetres), "269");
        assert_eq!(s.setup, "300 mm and 269 mm");
    }

    #[test]
    fn a_regular_hip_plumb_line_is_held_at_17_and_the_common_rise() {
        // 6 in 12: the hip rises 6 per 16.97 of run, held 17 and 6 (trade.md
        // section 2, common practice); the framing gives 12 and 4.243.
        let x = 12.0 * 6.0 / (12.0 * std::f64::consts::SQRT_2);
        let s = square_setting(
            [12.0, x],
            MarkAlong::Figure,
            SquareUse::HipPlumb,
            LengthStyle::FeetInches,
            |a, b, m| format!("hold {a} and {b}; mark along the {m} arm, not {{other}}"),
        );
        assert_eq!((s.against, square_figure_text(s.figure, LengthStyle::FeetInches).as_str()), (17.0, "6"));
        assert_eq!(s.setup, "hold 17 and 6; mark along the 6 arm, not 17");
        // An irregular hip's figure is not a clean common rise: left at 12.
        let s = square_setting(
            [12.0, 4.992],
            MarkAlong::Figure,
            SquareUse::HipPlumb,
            LengthStyle::FeetInches,
            |a, b, _| format!("{a} {b}"),
        );
        assert_eq!(s.setup, "12 5");
    }
}
