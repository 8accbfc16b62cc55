//! The toolbar and the keyboard shortcuts: both only record commands.

use super::ViewPreset;
use super::command::Command;

/// Keys that turn the camera to each preset.
const VIEW_KEYS: [(egui::Key, ViewPreset); 6] = [
    (egui::Key::C, ViewPreset::Corner),
    (egui::Key::T, ViewPreset::Top),
    (egui::Key::F, ViewPreset::Front),
    (egui::Key::B, ViewPreset::Back),
    (egui::Key::L, ViewPreset::Left),
    (egui::Key::R, ViewPreset::Right),
];

/// The row of view buttons above the 3D view.
pub fn toolbar_ui(ui: &mut egui::Ui, picked: bool, client_view: bool, commands: &mut Vec<Command>) {
    ui.horizontal(|ui| {
        ui.label("View:");
        for view in ViewPreset::ALL {
            let key = VIEW_KEYS.iter().find(|(_, v)| *v == view).map(|(key, _)| key.name());
            let button = ui.button(view.label());
            let button = match key {
                Some(key) => button.on_hover_text(format!("Key: {key}")),
                None => button,
            };
            if button.clicked() {
                commands.push(Command::SetView(view));
            }
        }
        let focus = ui.add_enabled(picked, egui::Button::new("Zoom to picked"));
        if focus.on_hover_text("Key: Z").clicked() {
            commands.push(Command::FocusPicked);
        }
        ui.separator();
        let mut client_view = client_view;
        if ui
            .toggle_value(&mut client_view, "Client view")
            .on_hover_text("Walls and a solid roof, no frame or labels (key: V)")
            .changed()
        {
            commands.push(Command::SetClientView(client_view));
        }
    });
}

/// The keys: presets, zoom to picked, client view.
pub fn shortcuts(ctx: &egui::Context, client_view: bool, commands: &mut Vec<Command>) {
    // Typing in a text field must not turn the camera.
    if ctx.egui_wants_keyboard_input() {
        return;
    }
    if ctx.input(|input| input.key_pressed(egui::Key::Z)) {
        commands.push(Command::FocusPicked);
    }
    if ctx.input(|input| input.key_pressed(egui::Key::V)) {
        commands.push(Command::SetClientView(!client_view));
    }
    for (key, view) in VIEW_KEYS {
        if ctx.input(|input| input.key_pressed(key)) {
            commands.push(Command::SetView(view));
        }
    }
}

#[cfg(test)]
mod tests {
    use egui_kittest::Harness;
    use egui_kittest::kittest::Queryable as _;

    use super::*;

    fn run_toolbar(picked: bool, client_view: bool, click: &str) -> Vec<Command> {
        let mut commands = Vec::new();
        {
            let mut harness = Harness::new_ui(|ui| toolbar_ui(ui, picked, client_view, &mut commands));
            harness.get_by_label(click).click();
            harness.run();
        }
        commands
    }

    #[test]
    fn view_buttons_ask_for_their_view() {
        assert!(run_toolbar(false, false, "Top").contains(&Command::SetView(ViewPreset::Top)));
        assert!(run_toolbar(false, false, "Left").contains(&Command::SetView(ViewPreset::Left)));
    }

    #[test]
    fn client_view_toggle_flips_the_view() {
        assert!(run_toolbar(false, false, "Client view").contains(&Command::SetClientView(true)));
        assert!(run_toolbar(false, true, "Client view").contains(&Command::SetClientView(false)));
    }

    #[test]
    fn zoom_to_picked_needs_a_pick() {
        assert!(run_toolbar(true, false, "Zoom to picked").contains(&Command::FocusPicked));
        assert!(!run_toolbar(false, false, "Zoom to picked").contains(&Command::FocusPicked));
    }
}
