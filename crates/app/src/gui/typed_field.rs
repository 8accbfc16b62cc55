//! A text field whose typed text outlives the frame: the wall list and the
//! framing settings both keep what the user typed while the field has the
//! keyboard, and read it only when the user presses Enter or leaves.

use std::collections::HashMap;
use std::hash::Hash;

use egui::Color32;

/// The colour of refused text and of the message beside it.
pub const ERROR: Color32 = Color32::from_rgb(220, 30, 30);

/// Draws one single-line field showing `typed[field]` (or `current` when
/// nothing is typed), red while `errors` holds a message for it. Returns
/// the text to read when the user has just left the field with text that
/// differs from `current` or was refused before; text left as it was is
/// forgotten.
#[allow(clippy::too_many_arguments, reason = "a field needs its place, its words and its state")]
pub fn typed_text_field<K: Copy + Eq + Hash>(
    ui: &mut egui::Ui,
    typed: &mut HashMap<K, String>,
    errors: &HashMap<K, String>,
    field: K,
    accessible_label: &str,
    current: &str,
    hint: &str,
    width: f32,
) -> Option<String> {
    let mut text = typed.get(&field).cloned().unwrap_or_else(|| current.to_owned());
    let has_error = errors.contains_key(&field);
    let mut edit = egui::TextEdit::singleline(&mut text).desired_width(width).hint_text(hint);
    if has_error {
        edit = edit.text_color(ERROR);
    }
    let response = ui.add(edit);
    ui.ctx().accesskit_node_builder(response.id, |node| node.set_label(accessible_label));
    if response.has_focus() || response.changed() {
        typed.insert(field, text.clone());
    }
    if !response.lost_focus() {
        return None;
    }
    if text == current && !has_error {
        typed.remove(&field);
        return None;
    }
    Some(text)
}
