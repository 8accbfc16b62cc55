//! The menu bar: File, Edit, View and Help, built from the one command
//! table so each entry shows the key that does the same.

use std::path::PathBuf;

use super::command::{Command, Layout, MENU_ENTRIES, Menu, MenuEntry};
use super::units::DisplayUnits;

/// What the menus need to know to show which entries are on or usable.
#[derive(Debug, Clone, PartialEq)]
pub struct MenuState {
    /// Whether there is a change to undo.
    pub can_undo: bool,
    /// Whether there is an undone change to redo.
    pub can_redo: bool,
    /// Whether a corner is selected in the plan view.
    pub corner_selected: bool,
    /// Whether a member is picked.
    pub picked: bool,
    /// Whether the client view is on.
    pub client_view: bool,
    /// How the middle of the window is shared.
    pub layout: Layout,
    /// How lengths are shown.
    pub units: DisplayUnits,
    /// Light or dark colours.
    pub theme: egui::Theme,
    /// The recent files, newest first.
    pub recent: Vec<PathBuf>,
}

impl MenuState {
    fn enabled(&self, command: &Command) -> bool {
        match command {
            Command::Undo => self.can_undo,
            Command::Redo => self.can_redo,
            Command::DeleteSelectedCorner => self.corner_selected,
            Command::FocusPicked => self.picked,
            _ => true,
        }
    }

    /// Whether a choice among several is the one in force.
    fn chosen(&self, command: &Command) -> Option<bool> {
        match command {
            Command::SetLayout(layout) => Some(*layout == self.layout),
            Command::SetUnits(units) => Some(*units == self.units),
            Command::SetTheme(theme) => Some(*theme == self.theme),
            Command::ToggleClientView => Some(self.client_view),
            _ => None,
        }
    }
}

/// The menu bar.
pub fn menu_bar_ui(ui: &mut egui::Ui, state: &MenuState, commands: &mut Vec<Command>) {
    egui::MenuBar::new().ui(ui, |ui| {
        for (menu, name) in [
            (Menu::File, "File"),
            (Menu::Edit, "Edit"),
            (Menu::View, "View"),
            (Menu::Export, "Export"),
            (Menu::Help, "Help"),
        ] {
            ui.menu_button(name, |ui| {
                for entry in MENU_ENTRIES.iter().filter(|entry| entry.menu == menu) {
                    if entry.separated {
                        ui.separator();
                    }
                    entry_ui(ui, entry, state, commands);
                    if entry.command == Command::Open {
                        recent_ui(ui, &state.recent, commands);
                    }
                }
            });
        }
    });
}

fn entry_ui(ui: &mut egui::Ui, entry: &MenuEntry, state: &MenuState, commands: &mut Vec<Command>) {
    let button = match state.chosen(&entry.command) {
        Some(chosen) => egui::Button::selectable(chosen, entry.label),
        None => egui::Button::new(entry.label),
    };
    let button = match entry.keys.first() {
        Some(key) => button.shortcut_text(ui.ctx().format_shortcut(key)),
        None => button,
    };
    if ui.add_enabled(state.enabled(&entry.command), button).clicked() {
        commands.push(entry.command.clone());
    }
}

fn recent_ui(ui: &mut egui::Ui, recent: &[PathBuf], commands: &mut Vec<Command>) {
    ui.add_enabled_ui(!recent.is_empty(), |ui| {
        ui.menu_button("Open recent", |ui| {
            for path in recent {
                let name = path
                    .file_name()
                    .map_or_else(|| path.display().to_string(), |n| n.to_string_lossy().into_owned());
                if ui.button(name).on_hover_text(path.display().to_string()).clicked() {
                    commands.push(Command::OpenPath(path.clone()));
                }
            }
        });
    });
}
