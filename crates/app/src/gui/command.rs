//! What the user asks for during a frame, applied in one place after it,
//! and the one table of named commands that feeds both the menus and the
//! keyboard shortcuts.

use std::path::PathBuf;

use egui::{Key, KeyboardShortcut, Modifiers};
use glam::DVec2;

use super::ViewPreset;
use super::dialogs::Answer;
use super::edit::PlanEdit;
use super::export::ExportKind;
use super::units::DisplayUnits;

/// How the middle of the window is shared between the two views.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum Layout {
    /// The plan view beside the 3D view.
    #[default]
    Both,
    /// The plan view alone.
    Plan,
    /// The 3D view alone.
    ThreeD,
}

/// A change asked for during a frame, applied after it.
#[derive(Debug, Clone, PartialEq)]
pub enum Command {
    /// Start a new plan.
    New,
    /// Choose a plan file to open.
    Open,
    /// Open this plan file.
    OpenPath(PathBuf),
    /// Save the plan to its file (choosing one if it has none).
    Save,
    /// Save the plan to a file chosen now.
    SaveAs,
    /// Close the window.
    Quit,
    /// Go back one change to the plan.
    Undo,
    /// Redo the change last undone.
    Redo,
    /// Change the plan; changes in one `group` (one drag) undo together.
    Edit {
        /// The change.
        edit: PlanEdit,
        /// The drag it belongs to, if any.
        group: Option<u64>,
    },
    /// Delete the selected corner.
    DeleteSelectedCorner,
    /// Select a wall (by global index), or none.
    SelectWall(Option<usize>),
    /// Select the corner a wall starts at, or none.
    SelectCorner(Option<usize>),
    /// Turn the camera to a preset direction.
    SetView(ViewPreset),
    /// Bring the picked member to the middle of the view, close up.
    FocusPicked,
    /// Switch between the framing view and the client view.
    SetClientView(bool),
    /// Flip the client view on or off.
    ToggleClientView,
    /// Select what lies under a click in the 3D view (nothing if empty),
    /// given from the view's top-left in points, with the view's size.
    PickAt {
        /// The click position.
        at: DVec2,
        /// The view's size.
        view_size: DVec2,
    },
    /// Pick this joint (an index into the scene's joints) and close in on it.
    PickJoint(usize),
    /// Share the middle of the window this way.
    SetLayout(Layout),
    /// Show lengths in these units.
    SetUnits(DisplayUnits),
    /// Use the light or dark colours.
    SetTheme(egui::Theme),
    /// Show the safety cautions.
    ShowSafety,
    /// Show the list of keys.
    ShowKeys,
    /// Show what the program is.
    ShowAbout,
    /// The user's answer to the dialog in front.
    Answer(Answer),
    /// Write a file from the plan or the view, asking first what and where.
    Export(ExportKind),
    /// Open a written file or a folder with the desktop's own program.
    OpenInDesktop(PathBuf),
}

/// The menus of the menu bar.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Menu {
    /// New, Open, Save...
    File,
    /// Undo, redo, delete.
    Edit,
    /// Views, units, colours.
    View,
    /// Cut cards, lists, the model and pictures.
    Export,
    /// Safety, keys, about.
    Help,
}

/// A named command: its menu entry and its keys.
#[derive(Debug, Clone, PartialEq)]
pub struct MenuEntry {
    /// What it does.
    pub command: Command,
    /// Its name in the menu.
    pub label: &'static str,
    /// The menu it is in.
    pub menu: Menu,
    /// Its keys; the first is the one the menu shows.
    pub keys: &'static [KeyboardShortcut],
    /// Whether a separator comes before it in its menu.
    pub separated: bool,
}

const CTRL: Modifiers = Modifiers::COMMAND;
const CTRL_SHIFT: Modifiers = Modifiers::COMMAND.plus(Modifiers::SHIFT);
const fn key(modifiers: Modifiers, key: Key) -> KeyboardShortcut {
    KeyboardShortcut::new(modifiers, key)
}
const fn plain(key: Key) -> KeyboardShortcut {
    KeyboardShortcut::new(Modifiers::NONE, key)
}

const fn entry(
    menu: Menu,
    label: &'static str,
    command: Command,
    keys: &'static [KeyboardShortcut],
) -> MenuEntry {
    MenuEntry { command, label, menu, keys, separated: false }
}

/// An entry with a separator before it.
const fn after_separator(
    menu: Menu,
    label: &'static str,
    command: Command,
    keys: &'static [KeyboardShortcut],
) -> MenuEntry {
    MenuEntry { command, label, menu, keys, separated: true }
}

/// Every named command, in menu order.
pub const MENU_ENTRIES: &[MenuEntry] = &[
    entry(Menu::File, "New", Command::New, &[key(CTRL, Key::N)]),
    entry(Menu::File, "Open…", Command::Open, &[key(CTRL, Key::O)]),
    entry(Menu::File, "Save", Command::Save, &[key(CTRL, Key::S)]),
    entry(Menu::File, "Save as…", Command::SaveAs, &[key(CTRL_SHIFT, Key::S)]),
    after_separator(Menu::File, "Quit", Command::Quit, &[key(CTRL, Key::Q)]),
    entry(Menu::Edit, "Undo", Command::Undo, &[key(CTRL, Key::Z)]),
    entry(Menu::Edit, "Redo", Command::Redo, &[key(CTRL_SHIFT, Key::Z), key(CTRL, Key::Y)]),
    after_separator(
        Menu::Edit,
        "Delete corner",
        Command::DeleteSelectedCorner,
        &[plain(Key::Delete), plain(Key::Backspace)],
    ),
    entry(Menu::View, "Plan and 3D", Command::SetLayout(Layout::Both), &[plain(Key::Num1)]),
    entry(Menu::View, "Plan only", Command::SetLayout(Layout::Plan), &[plain(Key::Num2)]),
    entry(Menu::View, "3D only", Command::SetLayout(Layout::ThreeD), &[plain(Key::Num3)]),
    after_separator(Menu::View, "Corner view", Command::SetView(ViewPreset::Corner), &[plain(Key::C)]),
    entry(Menu::View, "Top view", Command::SetView(ViewPreset::Top), &[plain(Key::T)]),
    entry(Menu::View, "Front view", Command::SetView(ViewPreset::Front), &[plain(Key::F)]),
    entry(Menu::View, "Back view", Command::SetView(ViewPreset::Back), &[plain(Key::B)]),
    entry(Menu::View, "Left view", Command::SetView(ViewPreset::Left), &[plain(Key::L)]),
    entry(Menu::View, "Right view", Command::SetView(ViewPreset::Right), &[plain(Key::R)]),
    entry(Menu::View, "Zoom to picked", Command::FocusPicked, &[plain(Key::Z)]),
    entry(Menu::View, "Client view", Command::ToggleClientView, &[plain(Key::V)]),
    after_separator(Menu::View, "Feet and inches", Command::SetUnits(DisplayUnits::FeetInches), &[]),
    entry(Menu::View, "Inches", Command::SetUnits(DisplayUnits::Inches), &[]),
    entry(Menu::View, "Millimetres", Command::SetUnits(DisplayUnits::Millimetres), &[]),
    after_separator(Menu::View, "Light colours", Command::SetTheme(egui::Theme::Light), &[]),
    entry(Menu::View, "Dark colours", Command::SetTheme(egui::Theme::Dark), &[]),
    entry(Menu::Export, "Cut cards (PDF)…", Command::Export(ExportKind::Cards), &[key(CTRL, Key::P)]),
    entry(Menu::Export, "Cut list (CSV)…", Command::Export(ExportKind::CutList), &[]),
    entry(Menu::Export, "Lumber order (CSV)…", Command::Export(ExportKind::LumberOrder), &[]),
    entry(Menu::Export, "3D frame (glTF .glb)…", Command::Export(ExportKind::Model), &[]),
    after_separator(
        Menu::Export,
        "Picture of this view (PNG)…",
        Command::Export(ExportKind::Picture),
        &[key(CTRL_SHIFT, Key::P)],
    ),
    entry(Menu::Help, "Safety", Command::ShowSafety, &[key(Modifiers::NONE, Key::F1)]),
    entry(Menu::Help, "Keys", Command::ShowKeys, &[]),
    entry(Menu::Help, "About Pitchframe", Command::ShowAbout, &[]),
];

/// The keys of `command` as people read them ("Ctrl+Z"), if it has any.
pub fn key_text(ctx: &egui::Context, command: &Command) -> Option<String> {
    let entry = MENU_ENTRIES.iter().find(|entry| entry.command == *command)?;
    entry.keys.first().map(|shortcut| ctx.format_shortcut(shortcut))
}

/// The commands whose keys were pressed this frame. Keys with more
/// modifiers are tried first, so Ctrl+Shift+Z is never taken for Ctrl+Z,
/// nor Ctrl+Z for plain Z.
pub fn shortcut_commands(ctx: &egui::Context) -> Vec<Command> {
    // Typing in a text field must not undo the plan or turn the camera;
    // the field has its own keys.
    if ctx.egui_wants_keyboard_input() {
        return Vec::new();
    }
    let mut keyed: Vec<(&KeyboardShortcut, &Command)> = MENU_ENTRIES
        .iter()
        .flat_map(|entry| entry.keys.iter().map(move |shortcut| (shortcut, &entry.command)))
        .collect();
    let modifier_count = |m: Modifiers| usize::from(m.command) + usize::from(m.shift) + usize::from(m.alt);
    keyed.sort_by_key(|(shortcut, _)| std::cmp::Reverse(modifier_count(shortcut.modifiers)));
    let mut commands = Vec::new();
    ctx.input_mut(|input| {
        for (shortcut, command) in keyed {
            if input.consume_shortcut(shortcut) {
                commands.push(command.clone());
            }
        }
    });
    commands
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn no_two_commands_share_a_key() {
        let keys: Vec<_> = MENU_ENTRIES.iter().flat_map(|entry| entry.keys.iter()).collect();
        for (index, shortcut) in keys.iter().enumerate() {
            assert!(!keys[index + 1..].contains(shortcut), "{shortcut:?} is given to two commands");
        }
    }

    #[test]
    fn ctrl_shift_z_redoes_and_ctrl_z_undoes() {
        let press = |modifiers: Modifiers| {
            let mut commands = Vec::new();
            {
                let mut harness =
                    egui_kittest::Harness::new_ui(|ui| commands.extend(shortcut_commands(ui.ctx())));
                harness.key_press_modifiers(modifiers, Key::Z);
                harness.run();
            }
            commands
        };
        assert_eq!(press(CTRL_SHIFT), vec![Command::Redo]);
        assert_eq!(press(CTRL), vec![Command::Undo]);
        assert_eq!(press(Modifiers::NONE), vec![Command::FocusPicked]);
    }
}
