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

/// Two warnings whose numbers differ by less than this (inches, or
/// degrees) say the same thing: the same cut on pieces of one shape at
/// different places in a plan comes out a few billionths apart.
const REPEAT_TOL: f64 = 1e-6;

impl FramingWarning {
    /// Whether `other` says what this warning says: the same kind about
    /// the same members, every number within [`REPEAT_TOL`].
    pub fn repeats(&self, other: &Self) -> bool {
        use FramingWarning as W;
        let close = |a: &f64, b: &f64| (a - b).abs() <= REPEAT_TOL;
        match (self, other) {
            (
                W::NotchTooDeep { label: a, notch_depth_in: da, limit_in: la },
                W::NotchTooDeep { label: b, notch_depth_in: db, limit_in: lb },
            ) => a == b && close(da, db) && close(la, lb),
            (
                W::BevelBeyondSaw { label: a, end: ea, saw: sa, bevel_deg: ba, max_deg: ma },
                W::BevelBeyondSaw { label: b, end: eb, saw: sb, bevel_deg: bb, max_deg: mb },
            ) => a == b && ea == eb && sa == sb && close(ba, bb) && close(ma, mb),
            (
                W::HipTooShallow { hip: ha, jack: ja, short_by_in: sa },
                W::HipTooShallow { hip: hb, jack: jb, short_by_in: sb },
            ) => ha == hb && ja == jb && close(sa, sb),
            (
                W::RidgeTooShallow { ridge: ra, rafter: fa, short_by_in: sa },
                W::RidgeTooShallow { ridge: rb, rafter: fb, short_by_in: sb },
            ) => ra == rb && fa == fb && close(sa, sb),
            (
                W::StockLengthExceeded { label: a, length_in: la, longest_stock_in: sa },
                W::StockLengthExceeded { label: b, length_in: lb, longest_stock_in: sb },
            ) => a == b && close(la, lb) && close(sa, sb),
            (
                W::HipCutLevelAtPlate { label: a, cut_in: ca },
                W::HipCutLevelAtPlate { label: b, cut_in: cb },
            ) => a == b && close(ca, cb),
            (
                W::ShortMemberLeftOut { label: a, left_out: ka, length_in: la },
                W::ShortMemberLeftOut { label: b, left_out: kb, length_in: lb },
            ) => a == b && ka == kb && close(la, lb),
            (
                W::RidgeBesideLeftOut { label: a, ridge: ra, length_in: la, apart_in: pa },
                W::RidgeBesideLeftOut { label: b, ridge: rb, length_in: lb, apart_in: pb },
            ) => a == b && ra == rb && close(la, lb) && close(pa, pb),
            (
                W::JointDoesNotFit { label: a, bears_on: ba, gap_in: ga, overlap_in: oa },
                W::JointDoesNotFit { label: b, bears_on: bb, gap_in: gb, overlap_in: ob },
            ) => a == b && ba == bb && close(ga, gb) && close(oa, ob),
            (
                W::JackMovedOffLayout { label: a, ridge: ra, by_in: ba },
                W::JackMovedOffLayout { label: b, ridge: rb, by_in: bb },
            ) => a == b && ra == rb && close(ba, bb),
            (
                W::JackLeftOutAtRidgeEnd { label: a, count: ca },
                W::JackLeftOutAtRidgeEnd { label: b, count: cb },
            ) => a == b && ca == cb,
            (W::TailsLeftOut { label: a, count: ca }, W::TailsLeftOut { label: b, count: cb }) => {
                a == b && ca == cb
            }
            (W::HipsMeetWithoutRidge { label: a }, W::HipsMeetWithoutRidge { label: b }) => a == b,
            _ => false,
        }
    }

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
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn warnings_a_hair_apart_repeat_and_others_do_not() {
        // Derivation: 1e-9 in is round-off at a plan's size, 1/1000 in
        // is a real difference (common practice, no source).
        let notch = |depth: f64| FramingWarning::NotchTooDeep {
            label: "C1".into(),
            notch_depth_in: depth,
            limit_in: 2.4,
        };
        assert!(notch(2.5).repeats(&notch(2.5 + 1e-9)));
        assert!(!notch(2.5).repeats(&notch(2.501)));
        let other = FramingWarning::NotchTooDeep { label: "C2".into(), notch_depth_in: 2.5, limit_in: 2.4 };
        assert!(!notch(2.5).repeats(&other));
        let hub = FramingWarning::HipsMeetWithoutRidge { label: "C1".into() };
        assert!(!notch(2.5).repeats(&hub) && hub.repeats(&hub.clone()));
    }

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
