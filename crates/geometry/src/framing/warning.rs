//! What the framer should look out for.

use serde::Serialize;

use super::CutEnd;

/// Which saw a bevel warning is about.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum SawKind {
    /// Circular saw along the marked plumb line.
    Circular,
    /// Miter saw, with the board flat or on edge, whichever tilts less.
    Miter,
}

/// Something in the frame to check before cutting.
#[derive(Debug, Clone, PartialEq, Serialize)]
#[serde(tag = "kind", rename_all = "snake_case")]
pub enum FramingWarning {
    /// A birdsmouth notch is deeper than the notch limit.
    NotchTooDeep {
        /// The member.
        label: String,
        /// Notch depth square to the edge, inches.
        notch_depth_in: f64,
        /// The limit, inches.
        limit_in: f64,
    },
    /// A cut needs more bevel than the saw tilts to: cut the complement and
    /// recut, or use another saw.
    BevelBeyondSaw {
        /// The member.
        label: String,
        /// Which cut.
        end: CutEnd,
        /// Which saw.
        saw: SawKind,
        /// The bevel needed, degrees.
        bevel_deg: f64,
        /// The saw's limit, degrees.
        max_deg: f64,
    },
    /// A hip or valley is not deep enough to take a jack's whole cheek cut.
    HipTooShallow {
        /// The hip or valley.
        hip: String,
        /// The jack.
        jack: String,
        /// How far the jack's cheek hangs below it, inches.
        short_by_in: f64,
    },
    /// A ridge board is not deep enough to take a rafter's whole plumb cut.
    RidgeTooShallow {
        /// The ridge piece.
        ridge: String,
        /// The rafter.
        rafter: String,
        /// How far the rafter's cut hangs below it, inches.
        short_by_in: f64,
    },
    /// A member is longer than the longest stock on hand.
    StockLengthExceeded {
        /// The member.
        label: String,
        /// Its overall length, inches.
        length_in: f64,
        /// The longest stock, inches.
        longest_stock_in: f64,
    },
    /// Hips meet at a point with no ridge (a peak, or where two hips merge
    /// into one on an irregular plan): the ends there are cut plumb, square
    /// to the hip, at the theoretical point, and need a fitted block or hub.
    HipsMeetWithoutRidge {
        /// The hip.
        label: String,
    },
}

impl FramingWarning {
    /// The label of the member the warning is mainly about.
    pub fn label(&self) -> &str {
        match self {
            Self::NotchTooDeep { label, .. }
            | Self::BevelBeyondSaw { label, .. }
            | Self::StockLengthExceeded { label, .. }
            | Self::HipsMeetWithoutRidge { label } => label,
            Self::HipTooShallow { jack, .. } => jack,
            Self::RidgeTooShallow { rafter, .. } => rafter,
        }
    }
}
