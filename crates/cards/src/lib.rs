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
mod card_deck;
mod card_page;
mod cards_pdf;
mod cut_list;
mod drawing;
mod from_frame;
mod gltf_export;
mod member_card;
mod pdf_page;
mod polygon_triangles;
mod square_figure;

pub use card_deck::{CardDeck, PlaneSummary, RoofSummary};
pub use card_page::{CARD_CAUTION, MIN_TEXT_PT};
pub use cards_pdf::{
    CAUTIONS, CardOptions, CardsError, POINTS_PER_IN, POINTS_PER_MM, Paper, render_cards,
    render_cards_with_progress, scale_bar_pt,
};
pub use cut_list::{CutListError, cut_list_csv, cut_list_table, cut_text};
pub use from_frame::{
    card_deck, kind_words, length_style, member_card, misfit_text, model_scene, order_pieces, outline_rings,
    size_words, warning_words,
};
pub use gltf_export::{GltfError, ModelFace, ModelPiece, ModelScene, frame_glb};
pub use member_card::{
    CardCut, CutAngles, CutFace, CutMark, MemberCard, MemberLengths, MemberView, ViewFace,
};
pub use pdf_page::text_width;
pub use square_figure::square_figure_text;
