//! Roof framing: lays out and cuts every member of a solved roof.
//!
//! Each piece is built as a solid (convex parts of its board cut by its
//! end, cheek, seat, heel and backing planes) and every length and angle is
//! read off that solid, so the numbers and the 3D view come from one
//! geometry.

mod bearing_stretch;
mod board;
mod builders;
mod checks;
mod copies;
mod corners;
mod cuts;
mod error;
mod frame;
mod joints;
mod labels;
mod layout;
mod measure;
mod member;
mod piece;
mod plane_frame;
mod settings;
mod solid;
mod warning;

pub use cuts::{Cut, CutFace, MiterSetup};
pub use error::FramingError;
pub use frame::{Frame, frame_roof};
pub use joints::{JOINT_FIT_IN, Joint};
pub use member::{Hand, Hands, Member, MemberKind};
pub use piece::PlacedPiece;
pub use settings::{BoardSize, FramingSettings, Heel, HipTop, LayoutStart, Saws, TailCut};
pub use solid::{ConvexPart, CutEnd, Face, FaceTag, HalfSpace, Solid};
pub use warning::{FramingWarning, SawKind};
