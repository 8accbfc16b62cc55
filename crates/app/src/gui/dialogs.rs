//! The dialogs in front of the window: unsaved changes, restoring an
//! autosave, typing a path where no file dialog exists, the safety
//! cautions, the keys, and what the program is. Each only reports the
//! user's answer; the app acts on it.

use std::path::PathBuf;

use egui::RichText;
use pitchframe_geometry::Plan;

use super::command::MENU_ENTRIES;
use super::file_dialog::NO_DIALOG_MESSAGE;
use super::safety::safety_ui;

/// What waits on the answer about unsaved changes.
#[derive(Debug, Clone, PartialEq)]
pub enum Pending {
    /// Starting a new plan.
    New,
    /// Choosing a plan to open.
    Open,
    /// Opening this plan.
    OpenPath(PathBuf),
    /// Closing the window.
    Quit,
}

/// What a typed path is for.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum PathPurpose {
    /// A plan to open.
    Open,
    /// Where to save the plan.
    SaveAs,
}

/// A dialog waiting for the user.
#[derive(Debug, Clone, PartialEq)]
pub enum Dialog {
    /// The plan has unsaved changes: save them first?
    Unsaved(Pending),
    /// An autosave was left by a window that did not close cleanly.
    Restore {
        /// The plan in the autosave.
        plan: Box<Plan>,
        /// The file it was being edited for.
        source: Option<PathBuf>,
        /// Where the autosave lies.
        autosave: PathBuf,
    },
    /// No file dialog: the path is typed.
    TypePath {
        /// What the path is for.
        purpose: PathPurpose,
        /// The text typed so far.
        text: String,
        /// What to do after a save.
        then: Option<Pending>,
    },
    /// The safety cautions.
    Safety,
    /// Every key and what it does.
    Keys,
    /// What the program is.
    About,
}

/// The user's answer to the dialog in front.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Answer {
    /// Save the changes (then carry on).
    Save,
    /// Let them go, or the autosave (then carry on).
    Discard,
    /// Take the autosaved plan back.
    Restore,
    /// Use the path typed.
    PathTyped,
    /// Close the dialog and do nothing.
    Close,
}

/// Shows `dialog` in front of the window; the answer once given.
pub fn dialog_ui(ctx: &egui::Context, dialog: &mut Dialog) -> Option<Answer> {
    let mut answer = None;
    egui::Modal::new(egui::Id::unique("pitchframe dialog")).show(ctx, |ui| {
        ui.set_max_width(620.0);
        match dialog {
            Dialog::Unsaved(pending) => {
                let doing = match pending {
                    Pending::New => "starting a new plan",
                    Pending::Open | Pending::OpenPath(_) => "opening another plan",
                    Pending::Quit => "closing",
                };
                ui.heading("Unsaved changes");
                ui.label(format!("The plan has changes that are not saved. Save them before {doing}?"));
                ui.horizontal(|ui| {
                    if ui.button("Save").clicked() {
                        answer = Some(Answer::Save);
                    }
                    if ui.button("Don't save").clicked() {
                        answer = Some(Answer::Discard);
                    }
                    if ui.button("Cancel").clicked() {
                        answer = Some(Answer::Close);
                    }
                });
            }
            Dialog::Restore { source, autosave, .. } => {
                ui.heading("Restore unsaved work?");
                let of = match source {
                    Some(path) => format!("for {}", path.display()),
                    None => "for a plan that was never saved".to_owned(),
                };
                ui.label(format!(
                    "Pitchframe last closed without saving its changes. An autosave {of} is newer than the saved file."
                ));
                ui.label(egui::RichText::new(format!("Autosave: {}", autosave.display())).weak());
                ui.horizontal(|ui| {
                    if ui.button("Restore").clicked() {
                        answer = Some(Answer::Restore);
                    }
                    if ui.button("Discard it").clicked() {
                        answer = Some(Answer::Discard);
                    }
                });
            }
            Dialog::TypePath { purpose, text, .. } => {
                let (title, action) = match purpose {
                    PathPurpose::Open => ("Open a plan", "Open"),
                    PathPurpose::SaveAs => ("Save the plan", "Save"),
                };
                ui.heading(title);
                ui.label(NO_DIALOG_MESSAGE);
                let field = ui.add(egui::TextEdit::singleline(text).desired_width(560.0).hint_text("/home/me/plans/house.toml"));
                ui.ctx().accesskit_node_builder(field.id, |node| node.set_label("File path"));
                let entered = field.lost_focus() && ui.input(|input| input.key_pressed(egui::Key::Enter));
                ui.horizontal(|ui| {
                    let ready = !text.trim().is_empty();
                    if (ui.add_enabled(ready, egui::Button::new(action)).clicked() || entered) && ready {
                        answer = Some(Answer::PathTyped);
                    }
                    if ui.button("Cancel").clicked() {
                        answer = Some(Answer::Close);
                    }
                });
            }
            Dialog::Safety => {
                ui.heading("Safety");
                safety_ui(ui);
                if ui.button(RichText::new("I understand").size(18.0)).clicked() {
                    answer = Some(Answer::Close);
                }
            }
            Dialog::Keys => {
                ui.heading("Keys");
                egui::Grid::new("keys").striped(true).show(ui, |ui| {
                    for entry in MENU_ENTRIES.iter().filter(|entry| !entry.keys.is_empty()) {
                        let keys: Vec<String> = entry.keys.iter().map(|key| ui.ctx().format_shortcut(key)).collect();
                        ui.label(entry.label);
                        ui.label(RichText::new(keys.join(" or ")).strong());
                        ui.end_row();
                    }
                });
                if ui.button("Close").clicked() {
                    answer = Some(Answer::Close);
                }
            }
            Dialog::About => {
                ui.heading("Pitchframe");
                ui.label(format!("Version {}", env!("CARGO_PKG_VERSION")));
                ui.label("Lays out a roof frame from a wall plan and pitches: every ridge, hip and valley, every member and every cut.");
                if ui.button("Close").clicked() {
                    answer = Some(Answer::Close);
                }
            }
        }
    });
    answer
}
