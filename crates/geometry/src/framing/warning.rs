//! What the framer should look out for.

use serde::Serialize;

use super::{CutEnd, MemberKind};

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
    /// A hip starting up on the roof, or a ridge, runs so low beside a
    /// wall (a long narrow roof plane along it) that its lower edge would
    /// go down into the wall's plate: it is cut level with the top of plate
    /// along its length, losing up to `cut_in` of its depth there, and
    /// bears on the plate. Check the plan: walls nearly in line often make
    /// such planes.
    HipCutLevelAtPlate {
        /// The hip.
        label: String,
        /// The most the level cut takes off, plumb, inches.
        cut_in: f64,
    },
    /// A hip or valley between two nodes closer together than its own
    /// thickness (a fraction of an inch on an irregular plan), or a hip
    /// shorter than its own depth from one ridge's end to another's, is
    /// not cut: this member's end there was cut to where that piece would
    /// be, and is fitted at the node by hand, with a block where the gap
    /// needs one.
    ShortMemberLeftOut {
        /// The member whose end meets the left-out piece.
        label: String,
        /// What the left-out piece would have been.
        left_out: MemberKind,
        /// Its plan length, inches.
        length_in: f64,
    },
    /// Two ridges run side by side closer than a ridge board's thickness
    /// (the roof's planes leave a sliver between them), so their two boards
    /// would overlap along their whole common length: the shorter is left
    /// out and one ridge board is framed, the longer. Every member that
    /// would bear on the left-out ridge runs on across the sliver and is
    /// cut to the kept ridge's side instead. On the kept ridge, and on
    /// each member moved onto it.
    RidgeBesideLeftOut {
        /// The member: the kept ridge, or a member cut to it in the
        /// left-out ridge's place.
        label: String,
        /// The kept ridge.
        ridge: String,
        /// The left-out ridge's plan length, inches.
        length_in: f64,
        /// Plan distance between the two ridges' centre lines, inches.
        apart_in: f64,
    },
    /// Two pieces meet with a gap or an overlap of 1/64 in or more, as the
    /// joint check measures their solids: the geometry there needs a
    /// fitted block or a cut by hand (a node where lines of an irregular
    /// plan crowd together). Fit this joint in place before cutting the
    /// run.
    JointDoesNotFit {
        /// The member cut to fit.
        label: String,
        /// The member it bears on.
        bears_on: String,
        /// Largest gap between the mating faces, inches.
        gap_in: f64,
        /// Largest overlap of the two pieces, inches.
        overlap_in: f64,
    },
    /// A hip or valley with no tail (a side with no overhang) is cut plumb
    /// along its wall lines, and the other side's jacks that would meet it
    /// only outside the wall line, tails with nothing to bear on, are left
    /// out: a hip running along its wall a hair inside the line, where walls
    /// meet nearly in line. That stretch of overhang has no rafter tails;
    /// frame it with lookouts or blocking fixed to the wall.
    TailsLeftOut {
        /// The hip or valley.
        label: String,
        /// How many jacks are left out.
        count: usize,
    },
    /// A valley jack laid out on the spacing would have held a lower
    /// ridge's end in its board (the two would share wood): it is moved
    /// off the layout along its wall by `by_in`, the least that clears the
    /// ridge board, to the nearer side it can go. Mark its place off the
    /// layout.
    JackMovedOffLayout {
        /// The jack.
        label: String,
        /// The ridge whose end it clears.
        ridge: String,
        /// How far it is moved off the layout, plan inches.
        by_in: f64,
    },
    /// Valley jacks laid out on the spacing would have held this ridge's
    /// end in their boards, with no place clear of it beside (a
    /// neighbouring rafter or the plane's edge in the way): they are left
    /// out, and the ridge's end carries the sheathing there.
    JackLeftOutAtRidgeEnd {
        /// The ridge.
        label: String,
        /// How many jacks are left out.
        count: usize,
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
            | Self::HipsMeetWithoutRidge { label }
            | Self::HipCutLevelAtPlate { label, .. }
            | Self::ShortMemberLeftOut { label, .. }
            | Self::RidgeBesideLeftOut { label, .. }
            | Self::TailsLeftOut { label, .. }
            | Self::JackMovedOffLayout { label, .. }
            | Self::JackLeftOutAtRidgeEnd { label, .. }
            | Self::JointDoesNotFit { label, .. } => label,
            Self::HipTooShallow { jack, .. } => jack,
            Self::RidgeTooShallow { rafter, .. } => rafter,
        }
    }

    /// Whether `other` says the same as this warning, to list once: equal,
    /// or a jack moved off the layout by the same amount within
    /// [`REPEAT_TOL_IN`] (pieces of one member moved by amounts that differ
    /// only in the last bits of a float).
    pub fn repeats(&self, other: &Self) -> bool {
        match (self, other) {
            (
                Self::JackMovedOffLayout { label, ridge, by_in },
                Self::JackMovedOffLayout { label: other_label, ridge: other_ridge, by_in: other_by_in },
            ) => label == other_label && ridge == other_ridge && (by_in - other_by_in).abs() <= REPEAT_TOL_IN,
            _ => self == other,
        }
    }
}

/// Two readings of one length closer than this (inches) are one warning:
/// a millionth of an inch, far below the 1/16 in lengths are shown to
/// (common practice, no source).
pub const REPEAT_TOL_IN: f64 = 1e-6;

#[cfg(test)]
mod tests {
    use super::FramingWarning;

    fn moved(by_in: f64) -> FramingWarning {
        FramingWarning::JackMovedOffLayout { label: "VJ1".into(), ridge: "R3".into(), by_in }
    }

    #[test]
    fn jacks_moved_by_amounts_a_float_rounding_apart_are_one_warning() {
        // 1e-12 in is rounding in the last bits; 1/64 in is a real difference
        // (common practice, no source).
        assert!(moved(1.0958640810346196).repeats(&moved(1.0958640810346196 + 1e-12)));
        assert!(!moved(1.0958640810346196).repeats(&moved(1.0958640810346196 + 1.0 / 64.0)));
        let other_ridge =
            FramingWarning::JackMovedOffLayout { label: "VJ1".into(), ridge: "R4".into(), by_in: 1.0 };
        assert!(!moved(1.0).repeats(&other_ridge));
        let tails = FramingWarning::TailsLeftOut { label: "V1".into(), count: 2 };
        assert!(tails.repeats(&tails.clone()) && !tails.repeats(&moved(1.0)));
    }
}
