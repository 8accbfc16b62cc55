//! How the roof is to be framed: spacing, sizes, seat, tails, hips, saws.

use serde::{Deserialize, Serialize};

/// A board's actual (dressed) cross-section, in inches.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct BoardSize {
    /// Thickness across the board's wide faces (1-1/2 for a 2x).
    pub thickness_in: f64,
    /// Depth from top edge to bottom edge (7-1/4 for a 2x8).
    pub depth_in: f64,
}

impl BoardSize {
    /// A dressed 2x of the given nominal depth (2x4 .. 2x12), with the
    /// usual dressed sizes: 1-1/2 thick, 1/2 in off up to 2x6, 3/4 in off
    /// from 2x8 up.
    pub fn two_by(nominal_depth: u32) -> Self {
        let depth_in =
            if nominal_depth <= 6 { f64::from(nominal_depth) - 0.5 } else { f64::from(nominal_depth) - 0.75 };
        Self { thickness_in: 1.5, depth_in }
    }
}

impl From<&crate::MemberSize> for BoardSize {
    fn from(size: &crate::MemberSize) -> Self {
        Self { thickness_in: size.thickness().inches(), depth_in: size.depth().inches() }
    }
}

/// Where rafter layout is measured from.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct LayoutStart {
    /// Outline corner (0-based, file order) the spacing is measured from, on
    /// every wall: rafter lines lie at whole multiples of the spacing from
    /// this corner, measured along each wall's own direction, so commons on
    /// parallel walls line up across the ridge.
    pub corner: usize,
    /// When true the lines are shifted half a space, so rafters sit centred
    /// between the marks of an uncentred layout (no rafter on the start
    /// corner's own line).
    pub centred: bool,
}

/// How the heel (height above plate at the wall line) is chosen.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum Heel {
    /// From the seat width: each plane's heel is d / cos(theta) - w R / 12;
    /// the roof uses the smallest of these so every common seats on at
    /// least the full seat width and all top planes meet above the hips
    /// and valleys.
    Auto,
    /// This height, measured plumb at the wall line from the top of the
    /// plate to the rafters' top edge, for every plane.
    Plumb {
        /// Height above plate in inches.
        height_in: f64,
    },
}

/// How rafter tails are cut at the fascia.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum TailCut {
    /// A plumb cut on the fascia line.
    Plumb,
    /// A cut square to the rafter's edge, its top corner on the fascia line.
    Square,
    /// A plumb cut on the fascia line and a level soffit cut below it.
    PlumbAndLevel {
        /// Length of the plumb cut, measured plumb down from the top edge.
        plumb_height_in: f64,
    },
}

/// How hip tops are made to meet the roof planes.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize, Deserialize)]
#[serde(rename_all = "snake_case")]
pub enum HipTop {
    /// Both top edges bevelled (backed) into the two roof planes.
    Backed,
    /// The hip lowered on its seat so its top corners do not stand above
    /// the roof planes (by the larger side's drop on irregular hips).
    Dropped,
}

/// The saws the cut settings are given for.
#[derive(Debug, Clone, Copy, PartialEq, Serialize, Deserialize)]
pub struct Saws {
    /// Give circular-saw settings (bevel along the marked line).
    pub circular: bool,
    /// Give miter-saw settings (miter and bevel, board flat and on edge).
    pub miter: bool,
    /// The largest bevel the saws tilt to, in degrees (45 for most circular
    /// saws; miter saws often reach 45-50).
    pub max_bevel_deg: f64,
}

/// Everything that decides how a solved roof is framed.
///
/// The plan file's `[framing]` table maps onto this struct field by field.
#[derive(Debug, Clone, PartialEq, Serialize, Deserialize)]
pub struct FramingSettings {
    /// Rafter spacing, centre to centre, in inches (24 by default).
    pub spacing_in: f64,
    /// Where layout is measured from.
    pub layout_start: LayoutStart,
    /// Commons, jacks and king commons (2x8 by default).
    pub rafter: BoardSize,
    /// Hips (2x10 by default).
    pub hip: BoardSize,
    /// Valleys (2x10 by default).
    pub valley: BoardSize,
    /// Ridge boards (2x10 by default).
    pub ridge: BoardSize,
    /// Birdsmouth seat width: the plate width, in inches (3-1/2 by default).
    pub seat_width_in: f64,
    /// How the heel height is chosen.
    pub heel: Heel,
    /// How tails are cut at the fascia.
    pub tail: TailCut,
    /// Backed or dropped hips.
    pub hip_top: HipTop,
    /// The deepest allowed birdsmouth notch, as a fraction of the member's
    /// depth, measured square to its edge (1/3 by default; some codes ask
    /// 1/4 at member ends).
    pub notch_limit: f64,
    /// The saws the cut settings are given for.
    pub saws: Saws,
    /// Stock lengths on hand, in inches, shortest first (8 to 24 ft in
    /// 2 ft steps by default): ridges are split to fit, and any member
    /// longer than the longest is flagged.
    pub stock_lengths_in: Vec<f64>,
}

impl Default for FramingSettings {
    fn default() -> Self {
        Self {
            spacing_in: 24.0,
            layout_start: LayoutStart { corner: 0, centred: false },
            rafter: BoardSize::two_by(8),
            hip: BoardSize::two_by(10),
            valley: BoardSize::two_by(10),
            ridge: BoardSize::two_by(10),
            seat_width_in: 3.5,
            heel: Heel::Auto,
            tail: TailCut::Plumb,
            hip_top: HipTop::Backed,
            notch_limit: 1.0 / 3.0,
            saws: Saws { circular: true, miter: true, max_bevel_deg: 45.0 },
            stock_lengths_in: (4..=12).map(|half_ft| f64::from(half_ft) * 24.0).collect(),
        }
    }
}

impl FramingSettings {
    /// The longest stock length on hand, if any were given.
    pub fn longest_stock_in(&self) -> Option<f64> {
        self.stock_lengths_in.iter().copied().filter(|l| l.is_finite()).reduce(f64::max)
    }
}
