//! The side panel: the numbers a framer reads for the document's pitch,
//! and what is picked in the 3D view.

use egui::RichText;
use pitchframe_geometry::{Length, LengthStyle, RafterTable, RoofLineKind};

use super::app::Document;
use super::scene::{PartKind, Scene, ScenePart};

/// Size of the figures a framer reads off the panel, in points: large
/// enough to read at arm's length from a laptop on a sawhorse.
const FIGURE_SIZE: f32 = 22.0;

/// Shows the pitch, the six rafter-table lines for it, and the pick.
pub fn side_panel_ui(ui: &mut egui::Ui, document: &Document, scene: &Scene, selected: Option<&ScenePart>) {
    ui.heading("Demo house");
    ui.label(format!(
        "Walls {} high, {} thick",
        length_text(document.wall_height_in),
        length_text(document.wall_thickness_in)
    ));
    if let Some(error) = &scene.roof_error {
        ui.colored_label(ui.visuals().warn_fg_color, format!("No roof drawn: {error}"));
    }
    ui.separator();
    rafter_table_ui(ui, &RafterTable::for_pitch(document.pitch));
    ui.separator();
    ui.heading("Picked");
    match selected {
        Some(part) => ui.label(RichText::new(part_name(part.kind)).size(FIGURE_SIZE)),
        None => ui.label("Click a part in the 3D view."),
    };
}

/// The six lines of the rafter table, each with its setup on hover.
fn rafter_table_ui(ui: &mut egui::Ui, table: &RafterTable) {
    ui.heading(format!("Pitch {} in 12 ({:.2}°)", trimmed(table.rise_in_12), table.pitch_deg));
    let lines: [(&str, String, &str); 6] = [
        (
            "Common, length per foot of run",
            format!("{:.2}", table.common_per_foot),
            "inches of rafter per 12 in of run, along the top edge",
        ),
        (
            "Hip or valley, length per foot of run",
            format!("{:.2}", table.hip_per_foot),
            "inches of hip or valley per 12 in of common run",
        ),
        (
            "Jacks at 16 in centres differ by",
            inches_text(table.jack_diff_16),
            "each jack is this much shorter",
        ),
        (
            "Jacks at 24 in centres differ by",
            inches_text(table.jack_diff_24),
            "each jack is this much shorter",
        ),
        (
            "Side cut of jacks: 12 and",
            format!("{:.2}", table.jack_side_cut.figure),
            &table.jack_side_cut.setup,
        ),
        (
            "Side cut of hip or valley: 12 and",
            format!("{:.2}", table.hip_side_cut.figure),
            &table.hip_side_cut.setup,
        ),
    ];
    egui::Grid::new("rafter_table").num_columns(1).show(ui, |ui| {
        for (name, figure, setup) in lines {
            ui.vertical(|ui| {
                ui.label(name);
                ui.label(RichText::new(figure).size(FIGURE_SIZE).strong()).on_hover_text(setup);
            });
            ui.end_row();
        }
    });
}

/// The part's name in the trade's words.
fn part_name(kind: PartKind) -> &'static str {
    match kind {
        PartKind::Walls => "Wall",
        PartKind::Gables => "Gable end",
        PartKind::RoofPlanes => "Roof plane",
        PartKind::RoofLines(RoofLineKind::Ridge) => "Ridge line",
        PartKind::RoofLines(RoofLineKind::Hip) => "Hip line",
        PartKind::RoofLines(RoofLineKind::Valley) => "Valley line",
    }
}

/// A length as a framer reads it: feet, inches and sixteenths.
fn length_text(inches: f64) -> String {
    Length::from_inches(inches).format(LengthStyle::FeetInches)
}

/// A length in inches and sixteenths, as rafter tables print jack differences.
fn inches_text(inches: f64) -> String {
    Length::from_inches(inches).format(LengthStyle::Inches)
}

/// A number to two places with trailing zeros dropped.
fn trimmed(value: f64) -> String {
    let text = format!("{value:.2}");
    text.trim_end_matches('0').trim_end_matches('.').to_owned()
}
