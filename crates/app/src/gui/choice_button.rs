//! A large button for one of a few choices (paper size, tail cut), sized
//! to hit with a thumb on a laptop at the saw.

use egui::RichText;

/// Smallest size of a choice button, in points.
const MIN_SIZE_PT: egui::Vec2 = egui::vec2(64.0, 34.0);

/// A selectable button showing `text`, lit when `selected`.
pub fn choice_button(ui: &mut egui::Ui, selected: bool, text: &str) -> egui::Response {
    ui.add(egui::Button::selectable(selected, RichText::new(text).size(18.0)).min_size(MIN_SIZE_PT))
}
