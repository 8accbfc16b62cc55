//! The rafter table for one pitch: lengths per foot (and per metre) of run,
//! jack differences, framing-square settings and saw angles, each angle with
//! the setup it belongs to.
//!
//! Regular roof only: the hip or valley runs at 45 degrees in plan between
//! two planes of the same pitch. Lengths are inches at full precision.

use std::f64::consts::{FRAC_1_SQRT_2, SQRT_2};
use std::fmt::Write as _;

use serde::Serialize;
use serde::ser::{SerializeMap, Serializer};

use crate::{Length, LengthStyle, Pitch};

/// The hip's run per 12 of common run: 12 * sqrt(2), the trade's "16.97" or "17".
const HIP_RUN_PER_FOOT: f64 = 12.0 * SQRT_2;

/// Which arm of the square to draw the line along.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum MarkAlong {
    /// Along the arm holding the setting's `figure`.
    Figure,
    /// Along the arm holding the setting's `against` figure.
    Against,
}

/// A framing-square setting: two figures held on the same edge of the
/// board, and the arm to mark along.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct SquareSetting {
    /// The figure this setting is known by (the rafter-table figure).
    pub figure: f64,
    /// The figure on the other arm (12 for inches, 300 for metric).
    pub against: f64,
    /// Which arm gives the line.
    pub mark_along: MarkAlong,
    /// How to set it up, in plain words.
    pub setup: String,
}

/// An angle with the setup it belongs to; an angle alone is ambiguous.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct AngleSetting {
    /// The angle in degrees.
    pub degrees: f64,
    /// What the angle is measured from, and on which tool.
    pub setup: String,
}

/// Metric practice: factors per metre of run, differences in millimetres
/// and edge cuts as figures against 300.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct MetricRafterTable {
    /// Common rafter length per metre of run (metres per metre).
    pub common_per_m_run: f64,
    /// Hip or valley length per metre of common run (metres per metre).
    pub hip_per_m_run: f64,
    /// Jack length difference at 400 mm centres, in mm.
    pub jack_diff_400_mm: f64,
    /// Jack length difference at 450 mm centres, in mm.
    pub jack_diff_450_mm: f64,
    /// Jack length difference at 600 mm centres, in mm.
    pub jack_diff_600_mm: f64,
    /// Jack edge (side) cut as a figure against 300.
    pub jack_edge_cut_300: SquareSetting,
    /// Hip or valley edge (side) cut as a figure against 300.
    pub hip_edge_cut_300: SquareSetting,
}

/// Everything a framer reads off a rafter table, for one pitch.
#[derive(Debug, Clone, PartialEq)]
pub struct RafterTable {
    /// The pitch the table is for.
    pub pitch: Pitch,
    /// The roof's slope above level, in degrees (not a saw setting).
    pub pitch_deg: f64,
    /// Rise per 12 of run.
    pub rise_in_12: f64,
    /// Common rafter length per foot (12 in) of run, in inches.
    pub common_per_foot: f64,
    /// Hip or valley length per foot of common run, in inches.
    pub hip_per_foot: f64,
    /// Difference in length of jacks at 16 in centres, in inches.
    pub jack_diff_16: f64,
    /// Difference in length of jacks at 24 in centres, in inches.
    pub jack_diff_24: f64,
    /// Jack side (cheek) cut on the top edge: 12 and this figure.
    pub jack_side_cut: SquareSetting,
    /// Hip or valley side (cheek) cut on the top edge: 12 and this figure.
    pub hip_side_cut: SquareSetting,
    /// The jack side cut laid out the older way: 12 and the length per foot.
    pub jack_side_cut_by_length: SquareSetting,
    /// The hip side cut laid out the older way: 17 and the hip length per foot.
    pub hip_side_cut_by_length: SquareSetting,
    /// The hip's slope above level along its own run, in degrees.
    pub hip_pitch_deg: f64,
    /// Common plumb line (ridge and heel): 12 and the rise.
    pub common_plumb: SquareSetting,
    /// Common level line (seat): 12 and the rise.
    pub common_level: SquareSetting,
    /// Hip plumb line: 17 (16.97) and the rise.
    pub hip_plumb: SquareSetting,
    /// Hip level line (seat): 17 (16.97) and the rise.
    pub hip_level: SquareSetting,
    /// Angle of the jack's cheek line across its top edge, from square.
    pub jack_top_edge: AngleSetting,
    /// Circular-saw bevel for the jack cheek cut, saw riding the side face.
    pub jack_face_bevel: AngleSetting,
    /// Circular-saw bevel for the jack cheek cut, saw riding the top edge.
    pub jack_edge_bevel: AngleSetting,
    /// Angle of the hip's cheek line across its top edge, from square.
    pub hip_top_edge: AngleSetting,
    /// Circular-saw bevel for the hip cheek cut, saw riding the side face.
    pub hip_face_bevel: AngleSetting,
    /// Circular-saw bevel for the hip cheek cut, saw riding the top edge.
    pub hip_edge_bevel: AngleSetting,
    /// Hip backing angle.
    pub hip_backing: AngleSetting,
    /// Hip drop per inch of hip thickness, measured plumb on the side face.
    pub hip_drop_per_in_thickness: f64,
    /// The same table in metric practice.
    pub metric: MetricRafterTable,
}

impl RafterTable {
    /// Works out the whole table for `pitch`.
    ///
    /// ```
    /// use pitchframe_geometry::{Pitch, RafterTable};
    /// let table = RafterTable::for_pitch(Pitch::parse("4/12").unwrap());
    /// assert!((table.common_per_foot - 12.65).abs() < 0.005);
    /// ```
    pub fn for_pitch(pitch: Pitch) -> RafterTable {
        let rise = pitch.rise_in_12();
        let common = rise.hypot(12.0);
        let hip = rise.hypot(HIP_RUN_PER_FOOT);
        let theta = pitch.angle_rad();
        let hip_theta = rise.atan2(HIP_RUN_PER_FOOT);

        let jack_figure = 144.0 / common;
        let hip_figure = 12.0 * HIP_RUN_PER_FOOT / hip;
        let rise_text = inch_figure(rise);
        let backing_deg = rise.atan2(hip).to_degrees();
        let drop_per_in = 0.5 * rise / HIP_RUN_PER_FOOT;

        let jack_side_cut = SquareSetting {
            figure: jack_figure,
            against: 12.0,
            mark_along: MarkAlong::Against,
            setup: format!(
                "on the jack's top edge hold 12 on one arm and {} on the other, both on the same \
                 edge of the board; mark along the 12 arm for the cheek line at the hip or valley",
                inch_figure(jack_figure)
            ),
        };
        let hip_side_cut = SquareSetting {
            figure: hip_figure,
            against: 12.0,
            mark_along: MarkAlong::Against,
            setup: format!(
                "on the hip's top edge hold 12 on one arm and {} on the other, both on the same \
                 edge; mark along the 12 arm for each cheek line at the ridge",
                inch_figure(hip_figure)
            ),
        };
        let jack_side_cut_by_length = SquareSetting {
            figure: common,
            against: 12.0,
            mark_along: MarkAlong::Figure,
            setup: format!(
                "the same jack cheek line another way: hold 12 and {} (the length per foot) on the \
                 same edge of the top; mark along the {} arm",
                inch_figure(common),
                inch_figure(common)
            ),
        };
        let hip_side_cut_by_length = SquareSetting {
            figure: hip,
            against: HIP_RUN_PER_FOOT,
            mark_along: MarkAlong::Figure,
            setup: format!(
                "the same hip cheek line another way: hold 16.97 (17) and {} (the hip length per \
                 foot) on the same edge of the top; mark along the {} arm",
                inch_figure(hip),
                inch_figure(hip)
            ),
        };
        let common_plumb = SquareSetting {
            figure: rise,
            against: 12.0,
            mark_along: MarkAlong::Figure,
            setup: format!(
                "on the rafter's side hold 12 and {rise_text} on the same edge; mark along the \
                 {rise_text} arm for plumb lines (ridge cut, heel of the birdsmouth, tail)"
            ),
        };
        let common_level = SquareSetting {
            mark_along: MarkAlong::Against,
            setup: format!(
                "on the rafter's side hold 12 and {rise_text} on the same edge; mark along the 12 \
                 arm for level lines (seat of the birdsmouth, level tail cut)"
            ),
            ..common_plumb.clone()
        };
        let hip_plumb = SquareSetting {
            figure: rise,
            against: HIP_RUN_PER_FOOT,
            mark_along: MarkAlong::Figure,
            setup: format!(
                "on the hip's side hold 16.97 (17) and {rise_text} on the same edge; mark along \
                 the {rise_text} arm for plumb lines"
            ),
        };
        let hip_level = SquareSetting {
            mark_along: MarkAlong::Against,
            setup: format!(
                "on the hip's side hold 16.97 (17) and {rise_text} on the same edge; mark along \
                 the 17 arm for level lines (seat)"
            ),
            ..hip_plumb.clone()
        };

        // The cheek cuts of a regular hip roof meet plumb faces at 45 degrees
        // in plan; see compound_cut.rs for the general derivation.
        let top_edge_deg = |member_theta: f64| (1.0 / member_theta.cos()).atan().to_degrees();
        let edge_bevel_deg = |member_theta: f64| (FRAC_1_SQRT_2 * member_theta.sin()).asin().to_degrees();
        let jack_top_edge_deg = top_edge_deg(theta);
        let hip_top_edge_deg = top_edge_deg(hip_theta);
        let jack_edge_bevel_deg = edge_bevel_deg(theta);
        let hip_edge_bevel_deg = edge_bevel_deg(hip_theta);

        let metric_common = common / 12.0;
        let metric_hip = hip / 12.0;
        let jack_300 = 300.0 * 12.0 / common;
        let hip_300 = 300.0 * HIP_RUN_PER_FOOT / hip;

        RafterTable {
            pitch,
            pitch_deg: theta.to_degrees(),
            rise_in_12: rise,
            common_per_foot: common,
            hip_per_foot: hip,
            jack_diff_16: 16.0 * common / 12.0,
            jack_diff_24: 24.0 * common / 12.0,
            jack_side_cut,
            hip_side_cut,
            jack_side_cut_by_length,
            hip_side_cut_by_length,
            hip_pitch_deg: hip_theta.to_degrees(),
            common_plumb,
            common_level,
            hip_plumb,
            hip_level,
            jack_top_edge: AngleSetting {
                degrees: jack_top_edge_deg,
                setup: format!(
                    "the jack's cheek line across its top edge lies {} from square; this is a \
                     line angle for a protractor, not a saw bevel",
                    degrees_text(jack_top_edge_deg)
                ),
            },
            jack_face_bevel: AngleSetting {
                degrees: 45.0,
                setup: "circular saw riding the jack's side face, cutting along the plumb line: \
                        bevel 45 deg at every pitch"
                    .to_string(),
            },
            jack_edge_bevel: AngleSetting {
                degrees: jack_edge_bevel_deg,
                setup: format!(
                    "circular saw riding the jack's top edge, cutting along the cheek line: \
                     bevel {}",
                    degrees_text(jack_edge_bevel_deg)
                ),
            },
            hip_top_edge: AngleSetting {
                degrees: hip_top_edge_deg,
                setup: format!(
                    "the hip's cheek lines across its top edge lie {} from square; a line angle \
                     for a protractor, not a saw bevel",
                    degrees_text(hip_top_edge_deg)
                ),
            },
            hip_face_bevel: AngleSetting {
                degrees: 45.0,
                setup: "circular saw riding the hip's side face, cutting along the plumb line: \
                        bevel 45 deg at every pitch"
                    .to_string(),
            },
            hip_edge_bevel: AngleSetting {
                degrees: hip_edge_bevel_deg,
                setup: format!(
                    "circular saw riding the hip's top edge, cutting along a cheek line: bevel {}",
                    degrees_text(hip_edge_bevel_deg)
                ),
            },
            hip_backing: AngleSetting {
                degrees: backing_deg,
                setup: format!(
                    "bevel each half of the hip's top edge down {} from square across the edge, \
                     from the centre line to each side face (table saw: side face on the table, \
                     blade tilted {} from square)",
                    degrees_text(backing_deg),
                    degrees_text(backing_deg)
                ),
            },
            hip_drop_per_in_thickness: drop_per_in,
            metric: MetricRafterTable {
                common_per_m_run: metric_common,
                hip_per_m_run: metric_hip,
                jack_diff_400_mm: 400.0 * metric_common,
                jack_diff_450_mm: 450.0 * metric_common,
                jack_diff_600_mm: 600.0 * metric_common,
                jack_edge_cut_300: SquareSetting {
                    figure: jack_300,
                    against: 300.0,
                    mark_along: MarkAlong::Against,
                    setup: format!(
                        "on the jack's top edge set out 300 along one arm and {:.0} on the other, \
                         both on the same edge; mark along the 300 arm",
                        jack_300
                    ),
                },
                hip_edge_cut_300: SquareSetting {
                    figure: hip_300,
                    against: 300.0,
                    mark_along: MarkAlong::Against,
                    setup: format!(
                        "on the hip's top edge set out 300 along one arm and {:.0} on the other, \
                         both on the same edge; mark along the 300 arm",
                        hip_300
                    ),
                },
            },
        }
    }

    /// Difference in length between neighbouring jacks at `spacing` centres.
    pub fn jack_diff(&self, spacing: Length) -> Length {
        spacing * (self.common_per_foot / 12.0)
    }

    /// How far a regular hip of `thickness` is dropped (plumb, at the heel)
    /// so its top corners lie in the roof planes.
    pub fn hip_drop(&self, thickness: Length) -> Length {
        thickness * self.hip_drop_per_in_thickness
    }

    /// Plan shortening of a jack at a regular hip or valley of
    /// `hip_thickness`: half the hip's thickness measured at 45 degrees.
    /// It does not depend on the pitch; divide by cos(pitch) for the length
    /// along the jack.
    pub fn jack_shortening_plan(hip_thickness: Length) -> Length {
        hip_thickness * FRAC_1_SQRT_2
    }

    /// The table as text to read at the saw: lengths in feet-inches to 1/16
    /// (and decimal inches), angles to 0.1 deg, each with its setup.
    pub fn to_text(&self) -> String {
        let mut text =
            format!("Rafter table for {} ({} above level)\n", self.pitch, degrees_text(self.pitch_deg));
        let mut section = "";
        for entry in self.entries() {
            if entry.section != section {
                section = entry.section;
                let _ = writeln!(text, "\n{section}");
            }
            let shown = match entry.value {
                Value::Inches(inches) => format!(
                    "{}  ({inches:.3} in)",
                    Length::from_inches(inches).format(LengthStyle::FeetInches)
                ),
                Value::Factor(factor) => format!("{factor:.4}"),
                Value::Plain(number) => {
                    let fixed = format!("{number:.3}");
                    fixed.trim_end_matches('0').trim_end_matches('.').to_string()
                }
                Value::Millimetres(mm) => format!("{mm:.0} mm"),
                Value::Degrees(degrees) => degrees_text(degrees),
                Value::Figure(setting) | Value::Pair(setting) => {
                    if setting.against == 300.0 {
                        format!("300 and {:.0}", setting.figure)
                    } else {
                        format!("{} and {}", inch_figure(setting.against), inch_figure(setting.figure))
                    }
                }
                Value::Pitch => self.pitch.to_string(),
            };
            let _ = writeln!(text, "  {:<44} {shown}", entry.label);
            if let Some(setup) = entry.setup {
                let _ = writeln!(text, "      {setup}");
            }
        }
        text.push_str(
            "\nMeasure the real building: walls out of square or level change every number. \
             Test-cut a pair before cutting the set.\n",
        );
        text
    }

    /// Every line of the table in display order, shared by the text and
    /// the JSON so the two cannot drift apart.
    fn entries(&self) -> Vec<Entry<'_>> {
        let lengths = "Lengths";
        let square = "Framing square (both figures on the same edge of the board)";
        let saw = "Angles";
        let metric = "Metric practice";
        let m = &self.metric;
        let entry = |section, key, label, value, setup: Option<&'static str>| {
            Entry::new(section, key, label, value, setup.map(str::to_string))
        };
        let with = |section, key, label, value, setup: &str| {
            Entry::new(section, key, label, value, Some(setup.to_string()))
        };
        let figure = |s: &SquareSetting| s.setup.clone();
        vec![
            entry(lengths, "pitch", "Pitch", Value::Pitch, None),
            entry(
                lengths,
                "pitch_deg",
                "Roof slope",
                Value::Degrees(self.pitch_deg),
                Some("the roof's angle above level; not a saw setting"),
            ),
            entry(lengths, "rise_in_12", "Rise per 12 of run", Value::Plain(self.rise_in_12), None),
            entry(
                lengths,
                "common_per_foot",
                "Common, length per foot of run",
                Value::Inches(self.common_per_foot),
                None,
            ),
            entry(
                lengths,
                "hip_per_foot",
                "Hip or valley, length per foot of run",
                Value::Inches(self.hip_per_foot),
                Some("per foot of the common run; the hip runs 16.97 in plan for each 12"),
            ),
            entry(
                lengths,
                "jack_diff_16",
                "Jack difference, 16 in centres",
                Value::Inches(self.jack_diff_16),
                None,
            ),
            entry(
                lengths,
                "jack_diff_24",
                "Jack difference, 24 in centres",
                Value::Inches(self.jack_diff_24),
                None,
            ),
            with(
                lengths,
                "hip_drop_per_in_thickness",
                "Hip drop per inch of hip thickness",
                Value::Factor(self.hip_drop_per_in_thickness),
                &format!(
                    "lower the hip's seat by this times its thickness, measured plumb (1-1/2 in hip: {:.3} in)",
                    1.5 * self.hip_drop_per_in_thickness
                ),
            ),
            with(
                square,
                "common_plumb",
                "Common plumb line",
                Value::Pair(&self.common_plumb),
                &figure(&self.common_plumb),
            ),
            with(
                square,
                "common_level",
                "Common level (seat) line",
                Value::Pair(&self.common_level),
                &figure(&self.common_level),
            ),
            with(
                square,
                "hip_plumb",
                "Hip plumb line",
                Value::Pair(&self.hip_plumb),
                &figure(&self.hip_plumb),
            ),
            with(
                square,
                "hip_level",
                "Hip level (seat) line",
                Value::Pair(&self.hip_level),
                &figure(&self.hip_level),
            ),
            with(
                square,
                "jack_side_cut",
                "Jack side cut",
                Value::Figure(&self.jack_side_cut),
                &figure(&self.jack_side_cut),
            ),
            with(
                square,
                "jack_side_cut_by_length",
                "Jack side cut, by length per foot",
                Value::Figure(&self.jack_side_cut_by_length),
                &figure(&self.jack_side_cut_by_length),
            ),
            with(
                square,
                "hip_side_cut",
                "Hip or valley side cut",
                Value::Figure(&self.hip_side_cut),
                &figure(&self.hip_side_cut),
            ),
            with(
                square,
                "hip_side_cut_by_length",
                "Hip side cut, by length per foot",
                Value::Figure(&self.hip_side_cut_by_length),
                &figure(&self.hip_side_cut_by_length),
            ),
            entry(
                saw,
                "hip_pitch_deg",
                "Hip slope",
                Value::Degrees(self.hip_pitch_deg),
                Some("the hip's angle above level along its own run; not a saw setting"),
            ),
            with(
                saw,
                "jack_top_edge_deg",
                "Jack cheek line on top edge",
                Value::Degrees(self.jack_top_edge.degrees),
                &self.jack_top_edge.setup,
            ),
            with(
                saw,
                "jack_face_bevel_deg",
                "Jack cheek, saw on the side face",
                Value::Degrees(self.jack_face_bevel.degrees),
                &self.jack_face_bevel.setup,
            ),
            with(
                saw,
                "jack_edge_bevel_deg",
                "Jack cheek, saw on the top edge",
                Value::Degrees(self.jack_edge_bevel.degrees),
                &self.jack_edge_bevel.setup,
            ),
            with(
                saw,
                "hip_top_edge_deg",
                "Hip cheek line on top edge",
                Value::Degrees(self.hip_top_edge.degrees),
                &self.hip_top_edge.setup,
            ),
            with(
                saw,
                "hip_face_bevel_deg",
                "Hip cheek, saw on the side face",
                Value::Degrees(self.hip_face_bevel.degrees),
                &self.hip_face_bevel.setup,
            ),
            with(
                saw,
                "hip_edge_bevel_deg",
                "Hip cheek, saw on the top edge",
                Value::Degrees(self.hip_edge_bevel.degrees),
                &self.hip_edge_bevel.setup,
            ),
            with(
                saw,
                "hip_backing_deg",
                "Hip backing",
                Value::Degrees(self.hip_backing.degrees),
                &self.hip_backing.setup,
            ),
            entry(
                metric,
                "common_per_m_run",
                "Rafter, length per metre of run",
                Value::Factor(m.common_per_m_run),
                None,
            ),
            entry(
                metric,
                "hip_per_m_run",
                "Hip or valley, length per metre of run",
                Value::Factor(m.hip_per_m_run),
                Some("per metre of the common run"),
            ),
            entry(
                metric,
                "jack_diff_400_mm",
                "Jack difference, 400 mm centres",
                Value::Millimetres(m.jack_diff_400_mm),
                None,
            ),
            entry(
                metric,
                "jack_diff_450_mm",
                "Jack difference, 450 mm centres",
                Value::Millimetres(m.jack_diff_450_mm),
                None,
            ),
            entry(
                metric,
                "jack_diff_600_mm",
                "Jack difference, 600 mm centres",
                Value::Millimetres(m.jack_diff_600_mm),
                None,
            ),
            with(
                metric,
                "jack_edge_cut_300",
                "Jack edge cut",
                Value::Figure(&m.jack_edge_cut_300),
                &figure(&m.jack_edge_cut_300),
            ),
            with(
                metric,
                "hip_edge_cut_300",
                "Hip or valley edge cut",
                Value::Figure(&m.hip_edge_cut_300),
                &figure(&m.hip_edge_cut_300),
            ),
        ]
    }
}

impl Serialize for RafterTable {
    /// Flat keys with plain numbers (pairs as `[against, figure]`), then a
    /// `setups` map from key to the words that go with it.
    fn serialize<S: Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        let entries = self.entries();
        let mut map = serializer.serialize_map(Some(entries.len() + 1))?;
        for entry in &entries {
            match entry.value {
                Value::Inches(v)
                | Value::Factor(v)
                | Value::Plain(v)
                | Value::Millimetres(v)
                | Value::Degrees(v) => {
                    map.serialize_entry(entry.key, &v)?;
                }
                Value::Figure(setting) => map.serialize_entry(entry.key, &setting.figure)?,
                Value::Pair(setting) => {
                    map.serialize_entry(entry.key, &[setting.against, setting.figure])?;
                }
                Value::Pitch => map.serialize_entry(entry.key, &self.pitch.to_string())?,
            }
        }
        let setups: Vec<(&str, &str)> = entries
            .iter()
            .filter_map(|entry| entry.setup.as_deref().map(|setup| (entry.key, setup)))
            .collect();
        map.serialize_entry("setups", &SetupMap(&setups))?;
        map.end()
    }
}

/// Serialises key-setup pairs as a JSON object in table order.
struct SetupMap<'a>(&'a [(&'a str, &'a str)]);

impl Serialize for SetupMap<'_> {
    fn serialize<S: Serializer>(&self, serializer: S) -> Result<S::Ok, S::Error> {
        let mut map = serializer.serialize_map(Some(self.0.len()))?;
        for (key, setup) in self.0 {
            map.serialize_entry(key, setup)?;
        }
        map.end()
    }
}

/// One line of the table.
struct Entry<'a> {
    section: &'static str,
    key: &'static str,
    label: &'static str,
    value: Value<'a>,
    setup: Option<String>,
}

impl<'a> Entry<'a> {
    fn new(
        section: &'static str,
        key: &'static str,
        label: &'static str,
        value: Value<'a>,
        setup: Option<String>,
    ) -> Entry<'a> {
        Entry { section, key, label, value, setup }
    }
}

/// What a line shows and how it is written.
enum Value<'a> {
    /// A length in inches.
    Inches(f64),
    /// A factor or ratio, shown to four places.
    Factor(f64),
    /// A plain number, shown to at most three places.
    Plain(f64),
    /// A length in millimetres.
    Millimetres(f64),
    /// An angle in degrees.
    Degrees(f64),
    /// A square setting known by its single figure.
    Figure(&'a SquareSetting),
    /// A square setting known by both figures.
    Pair(&'a SquareSetting),
    /// The table's pitch, written as "x in 12".
    Pitch,
}

/// A square figure in inches to 1/16, without the inch mark: `11-3/8`.
fn inch_figure(inches: f64) -> String {
    Length::from_inches(inches).format(LengthStyle::Inches).trim_end_matches('"').to_string()
}

/// An angle to 0.1 deg.
fn degrees_text(degrees: f64) -> String {
    format!("{degrees:.1} deg")
}
