//! The dialogs in front of the window: unsaved changes, restoring an
//! autosave, typing a path where no file dialog exists, the safety
//! cautions, the keys, and what the program is. Each only reports the
//! user's answer; the app acts on it.

use std::path::PathBuf;

use egui::RichText;
use pitchframe_cards::Paper;
use pitchframe_geometry::Plan;

use super::card_templates::TemplateMember;
use super::choice_button::choice_button;
use super::command::MENU_ENTRIES;
use super::export::{CardChoice, ExportSpec, MAX_PICTURE_SIDE_PX};
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
#[derive(Debug, Clone, PartialEq, Eq)]
pub enum PathPurpose {
    /// A plan to open.
    Open,
    /// Where to save the plan.
    SaveAs,
    /// Where to write an exported file.
    Export(ExportSpec),
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
    /// Paper, cards a page and full-size templates for the cut cards.
    CardOptions {
        /// What is chosen so far.
        choice: CardChoice,
        /// The members a template can be printed for.
        members: Vec<TemplateMember>,
    },
    /// The size of a picture of the 3D view, typed in pixels.
    PictureSize {
        /// Width as typed.
        width: String,
        /// Height as typed.
        height: String,
        /// The 3D view's own size on screen, in pixels.
        window_px: [u32; 2],
        /// Why the last size given could not be used.
        error: Option<String>,
    },
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
    /// Go on with what was chosen in the dialog.
    Continue,
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
                    PathPurpose::Open => ("Open a plan".to_owned(), "Open"),
                    PathPurpose::SaveAs => ("Save the plan".to_owned(), "Save"),
                    PathPurpose::Export(spec) => (format!("Write the {}", spec.kind.noun()), "Write"),
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
            Dialog::CardOptions { choice, members } => {
                ui.heading("Print cut cards");
                ui.label("One card for each member, with a cover sheet of the roof and the cautions.");
                ui.horizontal(|ui| {
                    ui.label(RichText::new("Paper").strong());
                    for (paper, name) in [(Paper::Letter, "Letter"), (Paper::A4, "A4")] {
                        if choice_button(ui, choice.paper == paper, name).clicked() {
                            choice.paper = paper;
                        }
                    }
                });
                ui.horizontal(|ui| {
                    ui.label(RichText::new("Cards a page").strong());
                    for per_page in [1u8, 2, 4] {
                        if choice_button(ui, choice.per_page == per_page, &per_page.to_string()).clicked() {
                            choice.per_page = per_page;
                        }
                    }
                });
                templates_ui(ui, choice, members);
                ui.horizontal(|ui| {
                    if ui.button(RichText::new("Choose where to save…").size(18.0)).clicked() {
                        answer = Some(Answer::Continue);
                    }
                    if ui.button("Cancel").clicked() {
                        answer = Some(Answer::Close);
                    }
                });
            }
            Dialog::PictureSize { width, height, window_px, error } => {
                ui.heading("Picture of this view");
                ui.label(format!(
                    "Draws the 3D view as it is now into a PNG. The view on screen is {} x {} pixels; \
                     up to {MAX_PICTURE_SIDE_PX} a side.",
                    window_px[0], window_px[1]
                ));
                ui.horizontal(|ui| {
                    for (text, shown, name) in
                        [(&mut *width, "Width", "Picture width"), (&mut *height, "Height", "Picture height")]
                    {
                        ui.label(shown);
                        let field = ui.add(egui::TextEdit::singleline(text).desired_width(80.0));
                        ui.ctx().accesskit_node_builder(field.id, |node| node.set_label(name));
                    }
                    ui.label("pixels");
                });
                ui.horizontal(|ui| {
                    if ui.button("Same as the view").clicked() {
                        *width = window_px[0].to_string();
                        *height = window_px[1].to_string();
                    }
                    for [w, h] in [[1920u32, 1080u32], [3840, 2160]] {
                        if ui.button(format!("{w} x {h}")).clicked() {
                            *width = w.to_string();
                            *height = h.to_string();
                        }
                    }
                });
                if let Some(error) = error {
                    ui.label(RichText::new(error.as_str()).color(egui::Color32::from_rgb(220, 30, 30)).strong());
                }
                ui.horizontal(|ui| {
                    if ui.button(RichText::new("Choose where to save…").size(18.0)).clicked() {
                        answer = Some(Answer::Continue);
                    }
                    if ui.button("Cancel").clicked() {
                        answer = Some(Answer::Close);
                    }
                });
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

/// Height of the template members' list before it scrolls, in points.
const TEMPLATE_LIST_HEIGHT_PT: f32 = 180.0;

/// The choice of members whose ends are printed full size after the cards.
fn templates_ui(ui: &mut egui::Ui, choice: &mut CardChoice, members: &[TemplateMember]) {
    ui.add_space(6.0);
    ui.label(RichText::new("Full-size end templates").strong());
    if members.is_empty() {
        ui.label("No member of this frame has a plumb or cheek cut at an end.");
        return;
    }
    ui.label(
        "Each member ticked gets its ends printed at 1:1 after the cards (two to four pages), \
         to cut out and hold on the board to mark the cuts. Check the 6 in scale bar on the \
         print before using one.",
    );
    ui.horizontal(|ui| {
        let chosen = match choice.templates.len() {
            0 => "None chosen".to_owned(),
            1 => "1 member chosen".to_owned(),
            n => format!("{n} members chosen"),
        };
        ui.label(RichText::new(chosen).weak());
        if ui.add_enabled(!choice.templates.is_empty(), egui::Button::new("None")).clicked() {
            choice.templates.clear();
        }
    });
    let mut ticked: Vec<bool> =
        members.iter().map(|member| choice.templates.contains(&member.label)).collect();
    let mut changed = false;
    // A long frame's list runs past its box: the bar is drawn solid and
    // always, not only under the pointer, so the list plainly scrolls.
    let overflows = ui.scope(|ui| {
        ui.spacing_mut().scroll = egui::style::ScrollStyle::solid();
        egui::Frame::group(ui.style())
            .show(ui, |ui| {
                let list = egui::ScrollArea::vertical()
                    .id_salt("template members")
                    .max_height(TEMPLATE_LIST_HEIGHT_PT)
                    .auto_shrink([false, true])
                    .scroll_bar_visibility(egui::scroll_area::ScrollBarVisibility::AlwaysVisible)
                    .show(ui, |ui| {
                        ui.horizontal_wrapped(|ui| {
                            for (member, on) in members.iter().zip(ticked.iter_mut()) {
                                changed |=
                                    ui.checkbox(on, format!("{} {}", member.label, member.kind)).changed();
                            }
                        });
                    });
                list.content_size.y > list.inner_rect.height() + 1.0
            })
            .inner
    });
    if overflows.inner {
        let text = format!("{} members in all: scroll the list for the rest", members.len());
        ui.label(RichText::new(text).weak());
    }
    if changed {
        // Kept in the cards' order, whatever order they were ticked in.
        choice.templates = members
            .iter()
            .zip(&ticked)
            .filter(|(_, on)| **on)
            .map(|(member, _)| member.label.clone())
            .collect();
    }
}
