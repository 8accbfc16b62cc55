//! Roof framing geometry for Pitchframe.
//!
//! This crate is pure computation: it knows nothing of screens, paper or
//! files on disk beyond parsing the plan text it is handed.
//!
//! # Conventions
//! - **Axes:** plan X and Y are level, Z is up; right-handed. Seen from
//!   above, the outer wall outline is stored counter-clockwise whatever
//!   order the user gave (indices still follow the user's file order).
//! - **Base unit:** every length inside this crate is in inches, as `f64`.
//!   Millimetres and feet exist only at the edges ([`Length`] parsing and
//!   formatting).
//! - **Wall line:** outline corners lie on the outside face of the wall
//!   framing at the top of the top plate. Roof planes have height 0 along
//!   their wall line and rise inward at their pitch.
//! - **Angles:** radians inside; degrees and "x in 12" only at the edges.
//! - **Slopes:** a pitch is stored as rise per unit run (`tan` of the pitch
//!   angle); 6 in 12 is `0.5`.
//! - **Indices:** walls and corners are numbered in file order from 0 in
//!   data (JSON, structs) and from 1 in messages meant for people.
//! - **Rounding:** numbers are rounded only when displayed, never inside a
//!   calculation.

pub mod compound_cut;
pub mod framing;
pub mod length;
pub mod member_size;
pub mod outline;
pub mod pitch;
mod quick_hash;
pub mod rafter_table;
pub mod random_outline;
pub mod roof;
pub mod roof_check;
pub mod shown;

pub use compound_cut::{CompoundCut, CutAngles, CutWarning, MiterSetting, SquareFigures};
pub use framing::{Frame, FramingError, FramingSettings, Member, MemberKind, frame_roof};
pub use length::{Length, LengthError, LengthStyle, LengthUnit};
pub use member_size::{MemberSize, MemberSizeError};
pub use outline::{
    CornerName, CourtyardShortfall, GABLE_TURN_MIN_DEG, Outline, OutlineError, Wall, WallName, WallRoof,
};
pub use pitch::{Pitch, PitchError};
pub use rafter_table::{AngleSetting, MarkAlong, MetricRafterTable, RafterTable, SquareSetting};
pub use random_outline::{
    OutlineFeatures, OutlineShape, comb_corners, random_outline, random_outline_or_refusal,
    random_outline_with, star_corners,
};
pub use roof::{GableFace, Roof, RoofError, RoofLine, RoofLineKind, RoofPlane};
pub use roof_check::{RoofDefect, check_roof};
pub mod demo;
pub mod plan;

pub use demo::{DEMO_PLAN_TOML, demo_plan, many_wings};
pub use plan::{FramingInput, Plan, PlanError, PlanWall};
