//! Printed and exported output for Pitchframe: the lumber order, the cut
//! list, the cut cards (PDF) and the frame as a 3D model (glTF).
//!
//! This crate reads the geometry crate's plan, roof and frame and writes
//! files; the geometry crate knows nothing of it.
//!
//! # Conventions
//! - **Units:** every length is in inches, as in the geometry crate; output
//!   converts at the edge (feet-inches and sixteenths, millimetres, or
//!   metres in glTF).
//! - **Axes:** plan X and Y level, Z up, as in the geometry crate; glTF
//!   output turns this into glTF's Y up.
//! - **Angles:** radians inside; degrees and "x in 12" only on paper, each
//!   angle with its setup named.

mod lumber_order;

pub use lumber_order::{
    Board, BoardPiece, FIT_TOLERANCE_IN, LumberOrder, LumberOrderError, OrderPiece, OrderSettings,
    PackingMethod, SizeOrder, SplicePiece, StockCount, StockSeries, order_lumber,
};
