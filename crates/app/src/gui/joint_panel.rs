//! The joints in the side panel: the picked joint's fit in large type, and
//! the picked member's joints, one row for each member it meets.

use egui::{Color32, RichText};

use super::command::Command;
use super::joints::{JOINT_TOLERANCE_IN, SceneJoint};
use super::palette;
use super::scene::Scene;
use super::units::DisplayUnits;

/// Size of the joint's figures, in points, as the member's lengths.
const FIGURE_SIZE: f32 = 22.0;
/// The green of a tight joint and the red of one that is not.
const TIGHT: Color32 = Color32::from_rgb(20, 130, 40);
const LOOSE: Color32 = Color32::from_rgb(220, 30, 30);

/// A gap or overlap in the units shown: thousandths of an inch or
/// hundredths of a millimetre, fine enough to read against 1/64 in.
pub fn fit_text(units: DisplayUnits, inches: f64) -> String {
    match units {
        DisplayUnits::FeetInches | DisplayUnits::Inches => format!("{inches:.3} in"),
        DisplayUnits::Millimetres => format!("{:.2} mm", inches * 25.4),
    }
}

/// The tolerance in the units shown.
fn tolerance_text(units: DisplayUnits) -> String {
    match units {
        DisplayUnits::FeetInches | DisplayUnits::Inches => "1/64 in".to_owned(),
        DisplayUnits::Millimetres => format!("1/64 in ({:.2} mm)", JOINT_TOLERANCE_IN * 25.4),
    }
}

/// A member's name with what it is ("C1 (common rafter)").
fn member_words(scene: &Scene, label: &str) -> String {
    match scene.pieces.iter().find(|piece| piece.label == label) {
        Some(piece) => format!("{label} ({})", palette::member_name(piece.kind).to_lowercase()),
        None => label.to_owned(),
    }
}

/// The picked joint in large type, if one is picked; `bring_into_view`
/// scrolls the panel to it (it was just picked, maybe from a row below).
pub fn picked_joint_ui(
    ui: &mut egui::Ui,
    scene: &Scene,
    units: DisplayUnits,
    picked_joint: Option<usize>,
    bring_into_view: bool,
) {
    if let Some(joint) = picked_joint.and_then(|index| scene.joints().get(index)) {
        let top = egui::Rect::from_min_size(ui.cursor().min, egui::vec2(ui.available_width().max(1.0), 1.0));
        joint_ui(ui, scene, units, joint);
        if bring_into_view {
            ui.scroll_to_rect(top, Some(egui::Align::TOP));
        }
        ui.separator();
    }
}

/// The joints of the picked member, one row for each member it meets.
pub fn member_joints_ui(
    ui: &mut egui::Ui,
    scene: &Scene,
    units: DisplayUnits,
    picked_label: Option<&str>,
    picked_joint: Option<usize>,
    commands: &mut Vec<Command>,
) {
    let Some(label) = picked_label else { return };
    // One row for each member the picked one meets, standing for all its
    // pieces' joints there: the worst of them, which a click goes to.
    let mut rows: Vec<(String, String, usize, usize)> = Vec::new();
    for (index, joint) in scene.joints().iter().enumerate().filter(|(_, joint)| joint.involves(label)) {
        let [cut, bearing] = &joint.joint.members;
        match rows.iter_mut().find(|row| &row.0 == cut && &row.1 == bearing) {
            Some(row) => {
                row.3 += 1;
                if badness(joint) > scene.joints().get(row.2).map_or(f64::NEG_INFINITY, badness) {
                    row.2 = index;
                }
            }
            None => rows.push((cut.clone(), bearing.clone(), index, 1)),
        }
    }
    if rows.is_empty() {
        return;
    }
    ui.label(RichText::new(format!("Joints of {label}")).strong());
    ui.label(
        RichText::new("Each row gives the worst of those joints. Click one (or a mark in the 3D view) to see it close up.")
            .weak(),
    );
    for (cut, bearing, worst, count) in rows {
        let Some(joint) = scene.joints().get(worst) else { continue };
        ui.horizontal(|ui| {
            let name = format!("{cut} on {bearing}");
            let button =
                egui::Button::selectable(picked_joint == Some(worst), RichText::new(&name).size(18.0));
            if ui.add(button).clicked() {
                commands.push(Command::PickJoint(worst));
            }
            let times = if count > 1 { format!("{count} joints: ") } else { String::new() };
            let (mark, colour) = if joint.tight() { ("fits", TIGHT) } else { ("check", LOOSE) };
            ui.label(format!(
                "{times}gap {}, overlap {}",
                fit_text(units, joint.joint.max_gap),
                fit_text(units, joint.joint.max_overlap)
            ));
            ui.label(RichText::new(mark).color(colour).strong());
        });
    }
}

/// How far a joint is from perfect, for picking the worst of a group.
fn badness(joint: &SceneJoint) -> f64 {
    joint.joint.max_gap.max(joint.joint.max_overlap)
}

fn joint_ui(ui: &mut egui::Ui, scene: &Scene, units: DisplayUnits, joint: &SceneJoint) {
    let [cut, bearing] = &joint.joint.members;
    ui.label(RichText::new(format!("Joint: {cut} on {bearing}")).size(FIGURE_SIZE).strong());
    ui.label(format!("{} is cut to bear on {}.", member_words(scene, cut), member_words(scene, bearing)));
    egui::Grid::new("joint fit").num_columns(2).show(ui, |ui| {
        ui.label("Largest gap");
        ui.label(RichText::new(fit_text(units, joint.joint.max_gap)).size(FIGURE_SIZE).strong());
        ui.end_row();
        ui.label("Largest overlap");
        ui.label(RichText::new(fit_text(units, joint.joint.max_overlap)).size(FIGURE_SIZE).strong());
        ui.end_row();
    });
    let tolerance = tolerance_text(units);
    if joint.tight() {
        ui.label(RichText::new(format!("Within {tolerance}")).size(FIGURE_SIZE).color(TIGHT).strong());
    } else {
        ui.label(
            RichText::new(format!("Off by more than {tolerance}: check this joint before cutting"))
                .size(FIGURE_SIZE)
                .color(LOOSE)
                .strong(),
        );
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn fits_read_in_thousandths_of_an_inch_or_hundredths_of_a_millimetre() {
        // Derivation: 1/64 in = 0.015625 in = 0.396875 mm (25.4 mm to the inch, exact).
        assert_eq!(fit_text(DisplayUnits::FeetInches, JOINT_TOLERANCE_IN), "0.016 in");
        assert_eq!(fit_text(DisplayUnits::Millimetres, JOINT_TOLERANCE_IN), "0.40 mm");
        assert_eq!(tolerance_text(DisplayUnits::Millimetres), "1/64 in (0.40 mm)");
    }
}
