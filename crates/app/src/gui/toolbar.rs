//! The toolbar: large buttons for the commands used most. It only records
//! commands; their keys come from the one command table.

use super::ViewPreset;
use super::command::{Command, Layout, key_text};

/// What the toolbar needs to know to show its buttons' states.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct ToolbarState {
    /// Whether a member is picked in the 3D view.
    pub picked: bool,
    /// Whether the client view is on.
    pub client_view: bool,
    /// Whether there is a change to undo.
    pub can_undo: bool,
    /// Whether there is an undone change to redo.
    pub can_redo: bool,
    /// How the middle of the window is shared.
    pub layout: Layout,
}

/// The row of buttons under the menu bar.
pub fn toolbar_ui(ui: &mut egui::Ui, state: ToolbarState, commands: &mut Vec<Command>) {
    let ctx = ui.ctx().clone();
    let hover = |command: &Command, what: &str| match key_text(&ctx, command) {
        Some(key) => format!("{what} (key: {key})"),
        None => what.to_owned(),
    };
    ui.horizontal_wrapped(|ui| {
        for (label, command, enabled) in
            [("Undo", Command::Undo, state.can_undo), ("Redo", Command::Redo, state.can_redo)]
        {
            let button = ui.add_enabled(enabled, egui::Button::new(label));
            if button.on_hover_text(hover(&command, label)).clicked() {
                commands.push(command);
            }
        }
        ui.separator();
        for (label, layout) in [("Plan and 3D", Layout::Both), ("Plan", Layout::Plan), ("3D", Layout::ThreeD)]
        {
            let command = Command::SetLayout(layout);
            let tip = hover(&command, "Show");
            if ui.selectable_label(state.layout == layout, label).on_hover_text(tip).clicked() {
                commands.push(command);
            }
        }
        ui.separator();
        ui.label("View:");
        for view in ViewPreset::ALL {
            let command = Command::SetView(view);
            if ui.button(view.label()).on_hover_text(hover(&command, "Turn the 3D view")).clicked() {
                commands.push(command);
            }
        }
        let focus = ui.add_enabled(state.picked, egui::Button::new("Zoom to picked"));
        if focus.on_hover_text(hover(&Command::FocusPicked, "Zoom to the picked member")).clicked() {
            commands.push(Command::FocusPicked);
        }
        let mut client_view = state.client_view;
        let tip = hover(&Command::ToggleClientView, "Walls and a solid roof, no frame or labels");
        if ui.toggle_value(&mut client_view, "Client view").on_hover_text(tip).changed() {
            commands.push(Command::SetClientView(client_view));
        }
    });
}

#[cfg(test)]
mod tests {
    use egui_kittest::Harness;
    use egui_kittest::kittest::Queryable as _;

    use super::*;

    fn run_toolbar(state: ToolbarState, click: &str) -> Vec<Command> {
        let mut commands = Vec::new();
        {
            let mut harness = Harness::new_ui(|ui| toolbar_ui(ui, state, &mut commands));
            harness.get_by_label(click).click();
            harness.run();
        }
        commands
    }

    const IDLE: ToolbarState = ToolbarState {
        picked: false,
        client_view: false,
        can_undo: false,
        can_redo: false,
        layout: Layout::Both,
    };

    #[test]
    fn view_buttons_ask_for_their_view() {
        assert!(run_toolbar(IDLE, "Top").contains(&Command::SetView(ViewPreset::Top)));
        assert!(run_toolbar(IDLE, "Left").contains(&Command::SetView(ViewPreset::Left)));
    }

    #[test]
    fn client_view_toggle_flips_the_view() {
        assert!(run_toolbar(IDLE, "Client view").contains(&Command::SetClientView(true)));
        let on = ToolbarState { client_view: true, ..IDLE };
        assert!(run_toolbar(on, "Client view").contains(&Command::SetClientView(false)));
    }

    #[test]
    fn zoom_to_picked_needs_a_pick_and_undo_a_change() {
        let picked = ToolbarState { picked: true, can_undo: true, ..IDLE };
        assert!(run_toolbar(picked, "Zoom to picked").contains(&Command::FocusPicked));
        assert!(!run_toolbar(IDLE, "Zoom to picked").contains(&Command::FocusPicked));
        assert!(run_toolbar(picked, "Undo").contains(&Command::Undo));
        assert!(!run_toolbar(IDLE, "Undo").contains(&Command::Undo));
    }
}
