//! Why a roof could not be framed.

use thiserror::Error;

/// Why a roof could not be framed. Walls are numbered from 1 in messages.
#[derive(Debug, Clone, PartialEq, Error)]
pub enum FramingError {
    /// The rafter spacing is zero, negative or not a number.
    #[error("the rafter spacing must be a positive length, not {spacing_in} in")]
    SpacingNotPositive {
        /// The spacing given, in inches.
        spacing_in: f64,
    },
    /// The layout start names a corner the outline does not have.
    #[error("layout starts at corner {}, but the outline has {corners} corners", corner + 1)]
    LayoutCornerMissing {
        /// The corner given (0-based).
        corner: usize,
        /// How many corners the outer outline has.
        corners: usize,
    },
    /// A board size is not positive.
    #[error("the {member} size must have a positive thickness and depth")]
    BoardSizeNotPositive {
        /// Which members the size is for ("rafter", "hip", ...).
        member: &'static str,
    },
    /// The seat width is not positive.
    #[error("the seat width must be a positive length, not {seat_width_in} in")]
    SeatWidthNotPositive {
        /// The width given, in inches.
        seat_width_in: f64,
    },
    /// The notch limit is not a fraction between 0 and 1.
    #[error("the notch limit must be a fraction of the depth between 0 and 1, not {notch_limit}")]
    NotchLimitOutOfRange {
        /// The limit given.
        notch_limit: f64,
    },
    /// The heel given is too high for the rafter: no seat would be left.
    #[error("a heel of {height_in} in leaves no seat on wall {}'s rafters (plumb depth {plumb_depth_in:.3} in)", wall + 1)]
    HeelLeavesNoSeat {
        /// The heel height given, in inches.
        height_in: f64,
        /// The wall (0-based).
        wall: usize,
        /// The rafter's plumb depth there.
        plumb_depth_in: f64,
    },
    /// A tail setting is not positive.
    #[error("the tail's plumb cut must be a positive length, not {plumb_height_in} in")]
    TailPlumbNotPositive {
        /// The plumb height given.
        plumb_height_in: f64,
    },
    /// A roof plane names a wall the outline does not have.
    #[error("a roof plane belongs to wall {}, which the outline does not have", wall + 1)]
    PlaneWallMissing {
        /// The wall named (0-based).
        wall: usize,
    },
    /// A roof plane is level or slopes the wrong way.
    #[error("wall {}'s roof plane has a pitch of {rise_per_run}; framing needs a rising pitch", wall + 1)]
    PlaneNotRising {
        /// The wall (0-based).
        wall: usize,
        /// Its rise per run.
        rise_per_run: f64,
    },
    /// A roof plane's outline does not start along its wall.
    #[error("wall {}'s roof plane outline does not start with the wall line", wall + 1)]
    PlaneOutlineMalformed {
        /// The wall (0-based).
        wall: usize,
    },
    /// A roof line names walls that have no roof plane.
    #[error("a {kind} line joins walls {} and {}, which do not both have roof planes", walls[0] + 1, walls[1] + 1)]
    LineWithoutPlanes {
        /// Ridge, hip or valley.
        kind: &'static str,
        /// The walls named (0-based).
        walls: [usize; 2],
    },
}
