//! The plan file: a wall outline, pitches and framing settings, as TOML.
//!
//! The format is our own and documented in the README. A plan is parsed
//! once here into a [`Plan`] whose values are already checked (lengths and
//! pitches parsed, limits applied); everything else is derived from it.
//!
//! ```toml
//! format = 1
//! units = "in"            # "in" or "mm": the unit of plain numbers
//! [roof]
//! pitch = "6/12"          # default for every wall
//! overhang = 16           # horizontal, beyond the wall line
//! [[wall]]                # one per corner, in order
//! at = [0, 0]
//! [[wall]]
//! at = ["40'", 0]
//! pitch = "8/12"          # per-wall override
//! [[wall]]
//! at = ["40'", "24'"]
//! gable = true
//! [[wall]]
//! at = [0, "24'"]
//! ```

use std::fmt;

use glam::DVec2;
use serde::Deserialize;
use serde::de::{self, Visitor};
use thiserror::Error;

use crate::framing::{BoardSize, FramingSettings, Heel, HipTop, TailCut};
use crate::shown::shown;
use crate::{Length, LengthError, LengthStyle, LengthUnit, Outline, OutlineError, Pitch, PitchError};
use crate::{MemberSize, Wall, WallRoof};

/// Plumb cut on a rafter tail above a level soffit cut, when the plan
/// asks for "plumb+level" without `tail_plumb`: 3-1/2 in, a common fascia
/// backing depth (common practice, no source).
const DEFAULT_TAIL_PLUMB_IN: f64 = 3.5;

/// Metric stock lengths, 2.4 m to 6.0 m in 0.3 m steps (common practice
/// in metric timber supply, no source), in inches.
fn metric_stock_lengths_in() -> Vec<f64> {
    (8..=20).map(|step| Length::from_mm(f64::from(step) * 300.0).inches()).collect()
}

/// The only plan format version this build reads and writes.
pub const PLAN_FORMAT: u32 = 1;

/// Largest plan file accepted, in bytes. Real plans are a few kilobytes;
/// the cap keeps a wrong file (a video, a log) from being read whole.
pub const MAX_PLAN_BYTES: usize = 4 * 1024 * 1024;

/// Most corners accepted in one plan, all outlines together.
pub const MAX_PLAN_CORNERS: usize = 20_000;

/// Most courtyards (inner outlines) accepted in one plan.
pub const MAX_COURTYARDS: usize = 200;

/// A checked plan: the document the app edits and the commands read.
#[derive(Debug, Clone, PartialEq)]
pub struct Plan {
    /// The unit of plain numbers in the file, and the unit shown by default.
    pub units: LengthUnit,
    /// Pitch used by every wall that does not give its own.
    pub default_pitch: Pitch,
    /// Overhang used by every wall that does not give its own.
    pub default_overhang: Length,
    /// The outer walls, one per corner, in order.
    pub walls: Vec<PlanWall>,
    /// Inner outlines (open courtyards), each its own ring of walls.
    pub courtyards: Vec<Vec<PlanWall>>,
    /// The `[framing]` table as written, checked for keys and types.
    pub framing: FramingInput,
}

/// One wall of a plan: it starts at `at` and runs to the next wall's corner.
#[derive(Debug, Clone, PartialEq)]
pub struct PlanWall {
    /// The starting corner on the wall line.
    pub at: [Length; 2],
    /// This wall's own pitch, if it differs from the roof's.
    pub pitch: Option<Pitch>,
    /// Whether the wall is a gable end (no roof plane rises from it).
    pub gable: bool,
    /// This wall's own overhang, if it differs from the roof's.
    pub overhang: Option<Length>,
}

/// The `[framing]` table: every key optional, defaults applied by framing.
#[derive(Debug, Clone, PartialEq, Default)]
pub struct FramingInput {
    /// Rafter layout spacing on centre.
    pub spacing: Option<Length>,
    /// Corner the layout is measured from.
    pub layout_from: Option<usize>,
    /// Whether commons are centred on the layout start rather than edged.
    pub centre_commons: Option<bool>,
    /// Rafter size as written (`"2x8"`, `"45x195"`).
    pub rafter: Option<String>,
    /// Hip size as written.
    pub hip: Option<String>,
    /// Valley size as written.
    pub valley: Option<String>,
    /// Ridge board size as written.
    pub ridge: Option<String>,
    /// Seat cut width (the plate width).
    pub seat: Option<Length>,
    /// Heel height measured plumb at the wall line; `None` means from the seat.
    pub heel: Option<Length>,
    /// Tail end: `"plumb"`, `"square"` or `"plumb+level"`.
    pub tail: Option<String>,
    /// With `"plumb+level"`: the plumb cut's height above the soffit cut.
    pub tail_plumb: Option<Length>,
    /// Hip treatment: `"backed"` or `"dropped"`.
    pub hips: Option<String>,
    /// Deepest birdsmouth notch allowed before a warning, as a fraction of depth.
    pub notch_limit: Option<f64>,
    /// Largest bevel the saw can cut, in degrees.
    pub max_bevel_deg: Option<f64>,
    /// Stock lengths on hand.
    pub stock: Option<Vec<Length>>,
    /// Saw kerf, for the lumber order.
    pub kerf: Option<Length>,
    /// Trim allowance per piece, for the lumber order.
    pub trim: Option<Length>,
}

/// Why a plan file could not be read.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum PlanError {
    /// The file is larger than [`MAX_PLAN_BYTES`].
    #[error("the plan file is {bytes} bytes; plans are limited to {MAX_PLAN_BYTES} bytes")]
    TooLarge {
        /// Size of the rejected file.
        bytes: usize,
    },
    /// The text is not TOML, or a key or type is wrong. The message comes
    /// from the TOML reader and names the line.
    #[error("the plan file is not a valid plan: {message}")]
    Syntax {
        /// What the TOML reader said, with the line and column.
        message: String,
    },
    /// `format` names a version this build does not read.
    #[error("the plan says format = {found}; this version of Pitchframe reads format = {PLAN_FORMAT}")]
    UnknownFormat {
        /// The version in the file.
        found: i64,
    },
    /// `units` is neither "in" nor "mm".
    #[error("units = \"{found}\" is not known; use \"in\" or \"mm\"")]
    UnknownUnits {
        /// The text in the file.
        found: String,
    },
    /// A length could not be read.
    #[error("{place}: {source}")]
    BadLength {
        /// Where in the plan, in words ("wall 3, corner x").
        place: String,
        /// What was wrong with it.
        source: LengthError,
    },
    /// A pitch could not be read.
    #[error("{place}: {source}")]
    BadPitch {
        /// Where in the plan.
        place: String,
        /// What was wrong with it.
        source: PitchError,
    },
    /// A value is out of its allowed range.
    #[error("{place}: {reason}")]
    OutOfRange {
        /// Where in the plan.
        place: String,
        /// Why the value is refused.
        reason: String,
    },
    /// Too many corners or courtyards.
    #[error("the plan has {found} {what}; at most {limit} are accepted")]
    TooMany {
        /// "corners" or "courtyards".
        what: &'static str,
        /// How many the file has.
        found: usize,
        /// The cap.
        limit: usize,
    },
}

impl Plan {
    /// Reads a plan from TOML text.
    ///
    /// ```
    /// let plan = pitchframe_geometry::Plan::from_toml(r#"
    ///     format = 1
    ///     units = "in"
    ///     [roof]
    ///     pitch = "6/12"
    ///     [[wall]]
    ///     at = [0, 0]
    ///     [[wall]]
    ///     at = ["40'", 0]
    ///     [[wall]]
    ///     at = ["40'", "24'"]
    ///     [[wall]]
    ///     at = [0, "24'"]
    /// "#).unwrap();
    /// assert_eq!(plan.walls.len(), 4);
    /// ```
    pub fn from_toml(text: &str) -> Result<Self, PlanError> {
        if text.len() > MAX_PLAN_BYTES {
            return Err(PlanError::TooLarge { bytes: text.len() });
        }
        let raw: RawPlan =
            toml::from_str(text).map_err(|e| PlanError::Syntax { message: one_line(text, &e) })?;
        raw.into_plan()
    }

    /// The outline the roof solver reads, with every wall's pitch and
    /// overhang resolved.
    pub fn outline(&self) -> Result<Outline, OutlineError> {
        let ring = |walls: &[PlanWall]| -> Vec<Wall> {
            walls
                .iter()
                .map(|w| Wall {
                    corner: DVec2::new(w.at[0].inches(), w.at[1].inches()),
                    roof: if w.gable {
                        WallRoof::Gable
                    } else {
                        WallRoof::Pitched {
                            rise_per_run: w.pitch.unwrap_or(self.default_pitch).rise_per_run(),
                        }
                    },
                    overhang_in: w.overhang.unwrap_or(self.default_overhang).inches(),
                })
                .collect()
        };
        Outline::new(ring(&self.walls), self.courtyards.iter().map(|c| ring(c)).collect())
    }

    /// The pitch of outer wall `index` (the roof default when it has none).
    pub fn wall_pitch(&self, index: usize) -> Option<Pitch> {
        self.walls.get(index).map(|w| w.pitch.unwrap_or(self.default_pitch))
    }

    /// Writes the plan as TOML that [`Plan::from_toml`] reads back to an
    /// equal plan. Lengths are written in inches or millimetres as plain
    /// numbers at full precision so nothing is lost to rounding.
    pub fn to_toml(&self) -> String {
        let mut out = String::new();
        let unit = match self.units {
            LengthUnit::Inch => "in",
            LengthUnit::Millimetre => "mm",
        };
        out.push_str(&format!("format = {PLAN_FORMAT}\nunits = \"{unit}\"\n\n[roof]\n"));
        out.push_str(&format!("pitch = \"{}\"\n", pitch_text(self.default_pitch)));
        out.push_str(&format!("overhang = {}\n", self.number(self.default_overhang)));
        write_framing(&mut out, &self.framing, self);
        for wall in &self.walls {
            out.push_str("\n[[wall]]\n");
            self.write_wall(&mut out, wall);
        }
        for ring in &self.courtyards {
            out.push_str("\n[[courtyard]]\n");
            for wall in ring {
                out.push_str("[[courtyard.wall]]\n");
                self.write_wall(&mut out, wall);
            }
        }
        out
    }

    fn write_wall(&self, out: &mut String, wall: &PlanWall) {
        out.push_str(&format!("at = [{}, {}]\n", self.number(wall.at[0]), self.number(wall.at[1])));
        if let Some(p) = wall.pitch {
            out.push_str(&format!("pitch = \"{}\"\n", pitch_text(p)));
        }
        if wall.gable {
            out.push_str("gable = true\n");
        }
        if let Some(o) = wall.overhang {
            out.push_str(&format!("overhang = {}\n", self.number(o)));
        }
    }

    /// A length as a plain number in the plan's unit, at full precision;
    /// in a millimetre plan a length that millimetres cannot carry exactly
    /// (one typed in inches) is written in inches, so nothing is lost.
    fn number(&self, length: Length) -> String {
        match self.units {
            LengthUnit::Inch => format!("{:?}", length.inches()),
            LengthUnit::Millimetre if Length::from_mm(length.mm()) == length => format!("{:?}", length.mm()),
            LengthUnit::Millimetre => format!("\"{}\\\"\"", length.inches()),
        }
    }

    /// The framing settings: the plan's `[framing]` table over the defaults.
    ///
    /// Sizes are parsed here (`"2x8"`, `"45x195"` in a millimetre plan) and
    /// the layout corner is checked against the outline, so framing gets
    /// settings that are already valid.
    pub fn framing_settings(&self) -> Result<FramingSettings, PlanError> {
        let f = &self.framing;
        let mut settings = FramingSettings::default();
        if let Some(spacing) = f.spacing {
            settings.spacing_in = spacing.inches();
        }
        if let Some(corner) = f.layout_from {
            if corner >= self.walls.len() {
                return Err(PlanError::OutOfRange {
                    place: "[framing] layout_from".into(),
                    reason: format!(
                        "corner {corner} does not exist; the outline has corners 0 to {}",
                        self.walls.len().saturating_sub(1)
                    ),
                });
            }
            settings.layout_start.corner = corner;
        }
        if let Some(centred) = f.centre_commons {
            settings.layout_start.centred = centred;
        }
        let size = |text: &Option<String>, name: &str, default: BoardSize| -> Result<BoardSize, PlanError> {
            match text {
                None => Ok(default),
                Some(t) => MemberSize::parse(t, self.units).map(|s| BoardSize::from(&s)).map_err(|e| {
                    PlanError::OutOfRange { place: format!("[framing] {name}"), reason: e.to_string() }
                }),
            }
        };
        settings.rafter = size(&f.rafter, "rafter", settings.rafter)?;
        settings.hip = size(&f.hip, "hip", settings.hip)?;
        settings.valley = size(&f.valley, "valley", settings.valley)?;
        settings.ridge = size(&f.ridge, "ridge", settings.ridge)?;
        if let Some(seat) = f.seat {
            settings.seat_width_in = seat.inches();
        }
        if let Some(heel) = f.heel {
            settings.heel = Heel::Plumb { height_in: heel.inches() };
        }
        settings.tail = match f.tail.as_deref() {
            None | Some("plumb") => TailCut::Plumb,
            Some("square") => TailCut::Square,
            Some(_) => TailCut::PlumbAndLevel {
                plumb_height_in: f.tail_plumb.map_or(DEFAULT_TAIL_PLUMB_IN, |l| l.inches()),
            },
        };
        settings.hip_top = match f.hips.as_deref() {
            Some("dropped") => HipTop::Dropped,
            _ => HipTop::Backed,
        };
        if let Some(limit) = f.notch_limit {
            settings.notch_limit = limit;
        }
        if let Some(bevel) = f.max_bevel_deg {
            settings.saws.max_bevel_deg = bevel;
        }
        if let Some(stock) = &f.stock {
            let mut lengths: Vec<f64> = stock.iter().map(|l| l.inches()).collect();
            lengths.sort_by(f64::total_cmp);
            settings.stock_lengths_in = lengths;
        } else if self.units == LengthUnit::Millimetre {
            settings.stock_lengths_in = metric_stock_lengths_in();
        }
        Ok(settings)
    }

    /// A length in the plan's usual display style.
    pub fn display_length(&self, length: Length) -> String {
        match self.units {
            LengthUnit::Inch => length.format(LengthStyle::FeetInches),
            LengthUnit::Millimetre => length.format(LengthStyle::Millimetres),
        }
    }
}

/// The TOML reader's message on one line, led by the line and column.
fn one_line(text: &str, error: &toml::de::Error) -> String {
    let message = error.message().split_whitespace().collect::<Vec<_>>().join(" ");
    match error.span() {
        Some(span) => {
            let before = text.get(..span.start).unwrap_or(text);
            let line = before.matches('\n').count() + 1;
            let column = before.rsplit('\n').next().map_or(0, |l| l.chars().count()) + 1;
            format!("line {line}, column {column}: {message}")
        }
        None => message,
    }
}

/// A pitch as text that reads back to exactly the same slope: the
/// simplest of "x/12", degrees, or the full-precision rise per run.
fn pitch_text(pitch: Pitch) -> String {
    let short = |v: f64| {
        let rounded = (v * 1e9).round() / 1e9;
        format!("{rounded}")
    };
    let candidates = [
        format!("{}/12", short(pitch.rise_in_12())),
        format!("{}deg", short(pitch.degrees())),
        format!("{}:1", pitch.rise_per_run()),
    ];
    for text in &candidates {
        if Pitch::parse(text).is_ok_and(|p| p == pitch) {
            return text.clone();
        }
    }
    // Display of an f64 is the shortest text that reads back to it.
    format!("{}:1", pitch.rise_per_run())
}

fn write_framing(out: &mut String, f: &FramingInput, plan: &Plan) {
    if *f == FramingInput::default() {
        return;
    }
    out.push_str("\n[framing]\n");
    let len = |name: &str, v: &Option<Length>, out: &mut String| {
        if let Some(v) = v {
            out.push_str(&format!("{name} = {}\n", plan.number(*v)));
        }
    };
    let text = |name: &str, v: &Option<String>, out: &mut String| {
        if let Some(v) = v {
            out.push_str(&format!("{name} = {}\n", toml_string(v)));
        }
    };
    len("spacing", &f.spacing, out);
    if let Some(v) = f.layout_from {
        out.push_str(&format!("layout_from = {v}\n"));
    }
    if let Some(v) = f.centre_commons {
        out.push_str(&format!("centre_commons = {v}\n"));
    }
    text("rafter", &f.rafter, out);
    text("hip", &f.hip, out);
    text("valley", &f.valley, out);
    text("ridge", &f.ridge, out);
    len("seat", &f.seat, out);
    if let Some(h) = f.heel {
        out.push_str(&format!("heel = {}\n", plan.number(h)));
    }
    text("tail", &f.tail, out);
    len("tail_plumb", &f.tail_plumb, out);
    text("hips", &f.hips, out);
    if let Some(v) = f.notch_limit {
        out.push_str(&format!("notch_limit = {v:?}\n"));
    }
    if let Some(v) = f.max_bevel_deg {
        out.push_str(&format!("max_bevel = {v:?}\n"));
    }
    if let Some(stock) = &f.stock {
        let items: Vec<String> = stock.iter().map(|s| plan.number(*s)).collect();
        out.push_str(&format!("stock = [{}]\n", items.join(", ")));
    }
    len("kerf", &f.kerf, out);
    len("trim", &f.trim, out);
}

/// A TOML basic string with the characters TOML needs escaped.
fn toml_string(text: &str) -> String {
    let mut s = String::with_capacity(text.len() + 2);
    s.push('"');
    for c in text.chars() {
        match c {
            '"' => s.push_str("\\\""),
            '\\' => s.push_str("\\\\"),
            '\n' => s.push_str("\\n"),
            '\t' => s.push_str("\\t"),
            c if c.is_control() => s.push_str(&format!("\\u{:04X}", c as u32)),
            c => s.push(c),
        }
    }
    s.push('"');
    s
}

// ---- The file as written: every key and type checked by serde ----

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawPlan {
    format: Option<i64>,
    units: Option<String>,
    roof: Option<RawRoof>,
    #[serde(default)]
    wall: Vec<RawWall>,
    #[serde(default)]
    courtyard: Vec<RawCourtyard>,
    framing: Option<RawFraming>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawRoof {
    pitch: Option<String>,
    overhang: Option<RawLength>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawWall {
    at: Vec<RawLength>,
    pitch: Option<String>,
    gable: Option<bool>,
    overhang: Option<RawLength>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawCourtyard {
    #[serde(default)]
    wall: Vec<RawWall>,
}

#[derive(Deserialize)]
#[serde(deny_unknown_fields)]
struct RawFraming {
    spacing: Option<RawLength>,
    layout_from: Option<i64>,
    centre_commons: Option<bool>,
    rafter: Option<RawSize>,
    hip: Option<RawSize>,
    valley: Option<RawSize>,
    ridge: Option<RawSize>,
    seat: Option<RawLength>,
    heel: Option<RawLength>,
    tail: Option<String>,
    tail_plumb: Option<RawLength>,
    hips: Option<String>,
    notch_limit: Option<f64>,
    max_bevel: Option<f64>,
    stock: Option<Vec<RawLength>>,
    kerf: Option<RawLength>,
    trim: Option<RawLength>,
}

/// A length as written: a plain number in the plan's unit, or text.
enum RawLength {
    Number(f64),
    Text(String),
}

impl<'de> Deserialize<'de> for RawLength {
    fn deserialize<D: de::Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        struct LengthVisitor;
        impl Visitor<'_> for LengthVisitor {
            type Value = RawLength;
            fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
                f.write_str(
                    "a length: a number in the plan's units, or text such as \"24' 6-3/8\\\"\" or \"7.2 m\"",
                )
            }
            fn visit_i64<E: de::Error>(self, v: i64) -> Result<RawLength, E> {
                Ok(RawLength::Number(v as f64))
            }
            fn visit_u64<E: de::Error>(self, v: u64) -> Result<RawLength, E> {
                Ok(RawLength::Number(v as f64))
            }
            fn visit_f64<E: de::Error>(self, v: f64) -> Result<RawLength, E> {
                Ok(RawLength::Number(v))
            }
            fn visit_str<E: de::Error>(self, v: &str) -> Result<RawLength, E> {
                Ok(RawLength::Text(v.to_string()))
            }
        }
        deserializer.deserialize_any(LengthVisitor)
    }
}

/// A member size as written: text (`"2x8"`) or `[thickness, depth]`.
enum RawSize {
    Text(String),
    Pair(RawLength, RawLength),
}

impl<'de> Deserialize<'de> for RawSize {
    fn deserialize<D: de::Deserializer<'de>>(deserializer: D) -> Result<Self, D::Error> {
        struct SizeVisitor;
        impl<'de> Visitor<'de> for SizeVisitor {
            type Value = RawSize;
            fn expecting(&self, f: &mut fmt::Formatter) -> fmt::Result {
                f.write_str("a member size: text such as \"2x8\" or \"45x195\", or [thickness, depth]")
            }
            fn visit_str<E: de::Error>(self, v: &str) -> Result<RawSize, E> {
                Ok(RawSize::Text(v.to_string()))
            }
            fn visit_seq<A: de::SeqAccess<'de>>(self, mut seq: A) -> Result<RawSize, A::Error> {
                let t: RawLength = seq.next_element()?.ok_or_else(|| de::Error::invalid_length(0, &self))?;
                let d: RawLength = seq.next_element()?.ok_or_else(|| de::Error::invalid_length(1, &self))?;
                if seq.next_element::<RawLength>()?.is_some() {
                    return Err(de::Error::invalid_length(3, &self));
                }
                Ok(RawSize::Pair(t, d))
            }
        }
        deserializer.deserialize_any(SizeVisitor)
    }
}

impl RawPlan {
    fn into_plan(self) -> Result<Plan, PlanError> {
        let format = self.format.unwrap_or(i64::from(PLAN_FORMAT));
        if format != i64::from(PLAN_FORMAT) {
            return Err(PlanError::UnknownFormat { found: format });
        }
        let units = match self.units.as_deref() {
            None | Some("in") => LengthUnit::Inch,
            Some("mm") => LengthUnit::Millimetre,
            Some(other) => return Err(PlanError::UnknownUnits { found: shown(other) }),
        };
        let corners = self.wall.len() + self.courtyard.iter().map(|c| c.wall.len()).sum::<usize>();
        if corners > MAX_PLAN_CORNERS {
            return Err(PlanError::TooMany { what: "corners", found: corners, limit: MAX_PLAN_CORNERS });
        }
        if self.courtyard.len() > MAX_COURTYARDS {
            return Err(PlanError::TooMany {
                what: "courtyards",
                found: self.courtyard.len(),
                limit: MAX_COURTYARDS,
            });
        }
        let roof = self.roof.unwrap_or(RawRoof { pitch: None, overhang: None });
        let default_pitch = match roof.pitch {
            Some(text) => parse_pitch(&text, "[roof] pitch")?,
            None => {
                return Err(PlanError::OutOfRange {
                    place: "[roof]".into(),
                    reason: "no pitch given; add for example pitch = \"6/12\"".into(),
                });
            }
        };
        let default_overhang = match roof.overhang {
            Some(raw) => non_negative_length(&raw, units, "[roof] overhang")?,
            None => Length::from_inches(0.0),
        };
        let walls = convert_walls(self.wall, units, "wall")?;
        let mut courtyards = Vec::with_capacity(self.courtyard.len());
        for (i, c) in self.courtyard.into_iter().enumerate() {
            courtyards.push(convert_walls(c.wall, units, &format!("courtyard {} wall", i + 1))?);
        }
        let framing = match self.framing {
            Some(f) => f.convert(units)?,
            None => FramingInput::default(),
        };
        Ok(Plan { units, default_pitch, default_overhang, walls, courtyards, framing })
    }
}

fn convert_walls(raw: Vec<RawWall>, units: LengthUnit, what: &str) -> Result<Vec<PlanWall>, PlanError> {
    raw.into_iter()
        .enumerate()
        .map(|(i, w)| {
            let place = format!("{what} {}", i + 1);
            let [x, y] = w.at.as_slice() else {
                return Err(PlanError::OutOfRange {
                    place: format!("{place}, at"),
                    reason: format!(
                        "a corner is two numbers [x, y], but {} {} given",
                        w.at.len(),
                        if w.at.len() == 1 { "was" } else { "were" }
                    ),
                });
            };
            let x = parse_length(x, units, &format!("{place}, corner x"))?;
            let y = parse_length(y, units, &format!("{place}, corner y"))?;
            let pitch = match w.pitch {
                Some(text) => Some(parse_pitch(&text, &format!("{place} pitch"))?),
                None => None,
            };
            let overhang = match w.overhang {
                Some(raw) => Some(non_negative_length(&raw, units, &format!("{place} overhang"))?),
                None => None,
            };
            Ok(PlanWall { at: [x, y], pitch, gable: w.gable.unwrap_or(false), overhang })
        })
        .collect()
}

/// Coordinates beyond this (about 1.6 miles) are refused: no roof is that
/// big, and it keeps the solver's tolerances meaningful.
const MAX_COORDINATE_IN: f64 = 100_000.0;

fn parse_length(raw: &RawLength, units: LengthUnit, place: &str) -> Result<Length, PlanError> {
    let length = match raw {
        RawLength::Number(v) => {
            if !v.is_finite() {
                return Err(PlanError::OutOfRange {
                    place: place.into(),
                    reason: format!("{v} is not a finite number"),
                });
            }
            match units {
                LengthUnit::Inch => Length::from_inches(*v),
                LengthUnit::Millimetre => Length::from_mm(*v),
            }
        }
        RawLength::Text(text) => Length::parse(text, units)
            .map_err(|source| PlanError::BadLength { place: place.into(), source })?,
    };
    if !length.inches().is_finite() || length.inches().abs() > MAX_COORDINATE_IN {
        // Past a few miles the feet-and-inches display would run to hundreds
        // of digits; a rough figure in the plan's units says enough.
        let given = if length.inches().abs() < 1.0e7 {
            length.to_string()
        } else {
            match units {
                LengthUnit::Inch => format!("about {:.1e} in", length.inches()),
                LengthUnit::Millimetre => format!("about {:.1e} mm", length.mm()),
            }
        };
        return Err(PlanError::OutOfRange {
            place: place.into(),
            reason: format!(
                "{given} is beyond the largest accepted size of {}",
                Length::from_inches(MAX_COORDINATE_IN)
            ),
        });
    }
    Ok(length)
}

fn positive_length(raw: &RawLength, units: LengthUnit, place: &str) -> Result<Length, PlanError> {
    let length = parse_length(raw, units, place)?;
    if length.inches() <= 0.0 {
        return Err(PlanError::OutOfRange {
            place: place.into(),
            reason: format!("{length} must be more than zero"),
        });
    }
    Ok(length)
}

fn non_negative_length(raw: &RawLength, units: LengthUnit, place: &str) -> Result<Length, PlanError> {
    let length = parse_length(raw, units, place)?;
    if length.inches() < 0.0 {
        return Err(PlanError::OutOfRange { place: place.into(), reason: format!("{length} is negative") });
    }
    Ok(length)
}

fn parse_pitch(text: &str, place: &str) -> Result<Pitch, PlanError> {
    Pitch::parse(text).map_err(|source| PlanError::BadPitch { place: place.into(), source })
}

fn size_text(raw: Option<RawSize>, units: LengthUnit, place: &str) -> Result<Option<String>, PlanError> {
    Ok(match raw {
        None => None,
        Some(RawSize::Text(t)) => Some(t),
        Some(RawSize::Pair(t, d)) => {
            let t = positive_length(&t, units, &format!("{place} thickness"))?;
            let d = positive_length(&d, units, &format!("{place} depth"))?;
            Some(match units {
                LengthUnit::Inch => format!("{:?}x{:?}", t.inches(), d.inches()),
                LengthUnit::Millimetre => format!("{:?}x{:?}", t.mm(), d.mm()),
            })
        }
    })
}

impl RawFraming {
    fn convert(self, units: LengthUnit) -> Result<FramingInput, PlanError> {
        let opt_len = |raw: &Option<RawLength>, place: &str| -> Result<Option<Length>, PlanError> {
            raw.as_ref().map(|r| positive_length(r, units, place)).transpose()
        };
        let layout_from = match self.layout_from {
            Some(v) if v < 0 => {
                return Err(PlanError::OutOfRange {
                    place: "[framing] layout_from".into(),
                    reason: format!("{v} is not a corner number (corners count from 0)"),
                });
            }
            Some(v) => Some(usize::try_from(v).unwrap_or(usize::MAX)),
            None => None,
        };
        if let Some(limit) = self.notch_limit
            && !(limit > 0.0 && limit < 1.0)
        {
            return Err(PlanError::OutOfRange {
                place: "[framing] notch_limit".into(),
                reason: format!("{limit} must be a fraction of the depth between 0 and 1"),
            });
        }
        if let Some(bevel) = self.max_bevel
            && !(bevel > 0.0 && bevel < 90.0)
        {
            return Err(PlanError::OutOfRange {
                place: "[framing] max_bevel".into(),
                reason: format!("{bevel} must be an angle in degrees between 0 and 90"),
            });
        }
        for (name, value, allowed) in [
            ("tail", &self.tail, &["plumb", "square", "plumb+level"][..]),
            ("hips", &self.hips, &["backed", "dropped"][..]),
        ] {
            if let Some(v) = value
                && !allowed.contains(&v.as_str())
            {
                return Err(PlanError::OutOfRange {
                    place: format!("[framing] {name}"),
                    reason: format!("\"{}\" is not one of {}", shown(v), allowed.join(", ")),
                });
            }
        }
        let stock = match &self.stock {
            None => None,
            Some(list) if list.is_empty() => {
                return Err(PlanError::OutOfRange {
                    place: "[framing] stock".into(),
                    reason: "the list of stock lengths is empty".into(),
                });
            }
            Some(list) => Some(
                list.iter()
                    .enumerate()
                    .map(|(i, r)| positive_length(r, units, &format!("[framing] stock length {}", i + 1)))
                    .collect::<Result<Vec<_>, _>>()?,
            ),
        };
        Ok(FramingInput {
            spacing: opt_len(&self.spacing, "[framing] spacing")?,
            layout_from,
            centre_commons: self.centre_commons,
            rafter: size_text(self.rafter, units, "[framing] rafter")?,
            hip: size_text(self.hip, units, "[framing] hip")?,
            valley: size_text(self.valley, units, "[framing] valley")?,
            ridge: size_text(self.ridge, units, "[framing] ridge")?,
            seat: opt_len(&self.seat, "[framing] seat")?,
            heel: match &self.heel {
                Some(RawLength::Text(t)) if t.trim() == "auto" => None,
                other => opt_len(other, "[framing] heel")?,
            },
            tail: self.tail,
            tail_plumb: opt_len(&self.tail_plumb, "[framing] tail_plumb")?,
            hips: self.hips,
            notch_limit: self.notch_limit,
            max_bevel_deg: self.max_bevel,
            stock,
            kerf: self.kerf.as_ref().map(|r| non_negative_length(r, units, "[framing] kerf")).transpose()?,
            trim: self.trim.as_ref().map(|r| non_negative_length(r, units, "[framing] trim")).transpose()?,
        })
    }
}
