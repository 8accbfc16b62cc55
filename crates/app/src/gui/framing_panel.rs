//! The framing settings a framer changes while looking at the frame:
//! spacing and where layout starts, member sizes, the seat and heel, the
//! tails, backed or dropped hips, and the roof's overhang. Each change is
//! one undoable edit of the plan's `[framing]` table and the frame is laid
//! out again at once; text that does not read, or a setting the frame
//! cannot use, leaves the plan alone and says why beside the field.

use std::collections::HashMap;

use egui::RichText;
use pitchframe_geometry::{FramingInput, Length, MemberSize, Plan};

use super::choice_button::choice_button;
use super::command::Command;
use super::edit::{FramingField, PlanEdit};
use super::typed_field::{ERROR, typed_text_field};
use super::units::DisplayUnits;

/// Width of a text field, in points.
const FIELD_WIDTH: f32 = 110.0;
/// The settings' own defaults, as the frame uses them when a plan leaves
/// them out (the geometry crate's `FramingSettings::default`).
const DEFAULT_SPACING_IN: f64 = 24.0;
const DEFAULT_SEAT_IN: f64 = 3.5;
const DEFAULT_TAIL_PLUMB_IN: f64 = 3.5;

/// Text being typed into the settings, and what was wrong with it.
#[derive(Debug, Clone, Default)]
pub struct FramingPanelState {
    typed: HashMap<FramingField, String>,
    errors: HashMap<FramingField, String>,
    /// The overhang's text and error (it is the roof's, not `[framing]`'s).
    overhang_typed: Option<String>,
    overhang_error: Option<String>,
}

impl FramingPanelState {
    /// Forgets typed text (the plan was replaced by undo, or another file).
    pub fn clear(&mut self) {
        *self = Self::default();
    }

    /// The change to `field` was made: its text is the plan's again.
    pub fn accept(&mut self, field: FramingField) {
        self.typed.remove(&field);
        self.errors.remove(&field);
    }

    /// The change to `field` was turned away: keep what was typed and say why.
    pub fn reject(&mut self, field: FramingField, message: String) {
        self.errors.insert(field, message);
    }

    /// Whether any setting shows an error.
    #[cfg(test)]
    pub fn has_errors(&self) -> bool {
        !self.errors.is_empty() || self.overhang_error.is_some()
    }
}

/// A setting's edit: the table with `change` made to a copy.
fn framing_edit(plan: &Plan, field: FramingField, change: impl FnOnce(&mut FramingInput)) -> Command {
    let mut framing = plan.framing.clone();
    change(&mut framing);
    Command::Edit { edit: PlanEdit::SetFraming { field, framing: Box::new(framing) }, group: None }
}

/// Reads a length that must be above zero; empty text means "the default".
fn positive_length(units: DisplayUnits, field: FramingField, text: &str) -> Result<Option<Length>, String> {
    if text.trim().is_empty() {
        return Ok(None);
    }
    let length = units.parse(text).map_err(|err| format!("{}: {err}", field.name()))?;
    if length.inches() > 0.0 && length.inches().is_finite() {
        Ok(Some(length))
    } else {
        Err(format!("{}: {} must be more than zero", field.name(), text.trim()))
    }
}

/// The settings panel, recording what the user changes as commands.
pub fn framing_panel_ui(
    ui: &mut egui::Ui,
    plan: &Plan,
    units: DisplayUnits,
    frame_error: Option<&str>,
    state: &mut FramingPanelState,
    commands: &mut Vec<Command>,
) {
    let framing = &plan.framing;
    egui::ScrollArea::vertical().auto_shrink([false, true]).show(ui, |ui| {
        ui.heading("Framing");
        ui.label(
            RichText::new("Each change lays the frame out again; Undo takes it back. Leave a field empty for the usual value shown in grey; an empty heel is worked out from the seat.")
                .weak(),
        );
        if let Some(error) = frame_error {
            ui.label(RichText::new(format!("No frame: {error}")).color(ERROR).strong());
        }
        ui.separator();
        ui.label(RichText::new("Layout").strong());
        egui::Grid::new("framing layout").num_columns(2).show(ui, |ui| {
            let spacing = framing.spacing.map(|s| units.format_small(s)).unwrap_or_default();
            let hint = units.format_small(Length::from_inches(DEFAULT_SPACING_IN));
            length_row(ui, state, FramingField::Spacing, &spacing, &hint, commands, |text| {
                let spacing = positive_length(units, FramingField::Spacing, text)?;
                Ok(framing_edit(plan, FramingField::Spacing, |f| f.spacing = spacing))
            });
            ui.label(FramingField::LayoutFrom.name());
            let corner = framing.layout_from.unwrap_or(0);
            let combo = egui::ComboBox::from_id_salt("layout from")
                .selected_text(RichText::new(format!("Corner {}", corner + 1)).size(18.0))
                .show_ui(ui, |ui| {
                    for choice in 0..plan.walls.len() {
                        let text = format!("Corner {}", choice + 1);
                        if ui.selectable_label(choice == corner, text).clicked() && choice != corner {
                            commands.push(framing_edit(plan, FramingField::LayoutFrom, |f| {
                                f.layout_from = Some(choice);
                            }));
                        }
                    }
                });
            ui.ctx().accesskit_node_builder(combo.response.id, |node| {
                node.set_label(FramingField::LayoutFrom.name());
            });
            ui.end_row();
        });
        let mut centred = framing.centre_commons.unwrap_or(false);
        if ui.checkbox(&mut centred, "Centre commons between the layout marks").changed() {
            commands.push(framing_edit(plan, FramingField::CentreCommons, |f| f.centre_commons = Some(centred)));
        }
        errors_ui(ui, state, &[FramingField::Spacing, FramingField::LayoutFrom, FramingField::CentreCommons]);
        ui.separator();

        ui.label(RichText::new("Member sizes").strong());
        egui::Grid::new("framing sizes").num_columns(2).show(ui, |ui| {
            let sizes = [
                (FramingField::Rafter, &framing.rafter, "2x8"),
                (FramingField::Hip, &framing.hip, "2x10"),
                (FramingField::Valley, &framing.valley, "2x10"),
                (FramingField::Ridge, &framing.ridge, "2x10"),
            ];
            for (field, current, default) in sizes {
                let text = current.clone().unwrap_or_default();
                let hint = match plan.units {
                    pitchframe_geometry::LengthUnit::Inch => default.to_owned(),
                    pitchframe_geometry::LengthUnit::Millimetre => String::new(),
                };
                length_row(ui, state, field, &text, &hint, commands, |text| {
                    let size = if text.trim().is_empty() {
                        None
                    } else {
                        MemberSize::parse(text, plan.units).map_err(|err| format!("{}: {err}", field.name()))?;
                        Some(text.trim().to_owned())
                    };
                    Ok(framing_edit(plan, field, |f| match field {
                        FramingField::Rafter => f.rafter = size,
                        FramingField::Hip => f.hip = size,
                        FramingField::Valley => f.valley = size,
                        _ => f.ridge = size,
                    }))
                });
            }
        });
        errors_ui(ui, state, &[FramingField::Rafter, FramingField::Hip, FramingField::Valley, FramingField::Ridge]);
        ui.separator();

        ui.label(RichText::new("Seat, heel and tail").strong());
        egui::Grid::new("framing seat").num_columns(2).show(ui, |ui| {
            let seat = framing.seat.map(|s| units.format_small(s)).unwrap_or_default();
            let hint = units.format_small(Length::from_inches(DEFAULT_SEAT_IN));
            length_row(ui, state, FramingField::Seat, &seat, &hint, commands, |text| {
                let seat = positive_length(units, FramingField::Seat, text)?;
                Ok(framing_edit(plan, FramingField::Seat, |f| f.seat = seat))
            });
            let heel = framing.heel.map(|h| units.format_small(h)).unwrap_or_default();
            length_row(ui, state, FramingField::Heel, &heel, "auto", commands, |text| {
                let heel = positive_length(units, FramingField::Heel, text)?;
                Ok(framing_edit(plan, FramingField::Heel, |f| f.heel = heel))
            });
            let overhang = units.format(plan.default_overhang);
            ui.label("Overhang");
            let mut text = state.overhang_typed.clone().unwrap_or_else(|| overhang.clone());
            let mut edit = egui::TextEdit::singleline(&mut text).desired_width(FIELD_WIDTH);
            if state.overhang_error.is_some() {
                edit = edit.text_color(ERROR);
            }
            let response = ui.add(edit);
            ui.ctx().accesskit_node_builder(response.id, |node| node.set_label("Framing overhang"));
            if response.has_focus() || response.changed() {
                state.overhang_typed = Some(text.clone());
            }
            if response.lost_focus() {
                if text == overhang && state.overhang_error.is_none() {
                    state.overhang_typed = None;
                } else {
                    match units.parse(&text) {
                        Ok(length) if length.inches() >= 0.0 => {
                            state.overhang_typed = None;
                            state.overhang_error = None;
                            commands.push(Command::Edit { edit: PlanEdit::SetRoofOverhang(length), group: None });
                        }
                        Ok(_) => state.overhang_error = Some(format!("Overhang: {} must be 0 or more", text.trim())),
                        Err(err) => state.overhang_error = Some(format!("Overhang: {err}")),
                    }
                }
            }
            ui.end_row();
        });
        ui.label(RichText::new("The overhang is the roof's, for every wall without its own (set those in Walls).").weak());
        if let Some(error) = &state.overhang_error {
            ui.label(RichText::new(error).color(ERROR));
        }
        ui.horizontal(|ui| {
            ui.label(FramingField::Tail.name());
            let tail = framing.tail.as_deref().unwrap_or("plumb");
            for (value, name) in [("plumb", "Plumb"), ("square", "Square"), ("plumb+level", "Plumb and level")] {
                if choice_button(ui, tail == value, name).clicked() && tail != value {
                    commands.push(framing_edit(plan, FramingField::Tail, |f| f.tail = Some(value.to_owned())));
                }
            }
        });
        if framing.tail.as_deref() == Some("plumb+level") {
            egui::Grid::new("framing tail").num_columns(2).show(ui, |ui| {
                let plumb = framing.tail_plumb.map(|p| units.format_small(p)).unwrap_or_default();
                let hint = units.format_small(Length::from_inches(DEFAULT_TAIL_PLUMB_IN));
                length_row(ui, state, FramingField::TailPlumb, &plumb, &hint, commands, |text| {
                    let plumb = positive_length(units, FramingField::TailPlumb, text)?;
                    Ok(framing_edit(plan, FramingField::TailPlumb, |f| f.tail_plumb = plumb))
                });
            });
        }
        ui.horizontal(|ui| {
            ui.label(FramingField::Hips.name());
            let hips = framing.hips.as_deref().unwrap_or("backed");
            for (value, name) in [("backed", "Backed"), ("dropped", "Dropped")] {
                if choice_button(ui, hips == value, name).clicked() && hips != value {
                    commands.push(framing_edit(plan, FramingField::Hips, |f| f.hips = Some(value.to_owned())));
                }
            }
        });
        errors_ui(
            ui,
            state,
            &[FramingField::Seat, FramingField::Heel, FramingField::Tail, FramingField::TailPlumb, FramingField::Hips],
        );
    });
}

/// The messages of any of `fields` that were turned away.
fn errors_ui(ui: &mut egui::Ui, state: &FramingPanelState, fields: &[FramingField]) {
    for field in fields {
        if let Some(error) = state.errors.get(field) {
            ui.label(RichText::new(error).color(ERROR).strong());
        }
    }
}

/// One labelled text field in a grid row. While it has the keyboard the
/// typed text is kept; when the user presses Enter or leaves it, the text
/// is read into a command, or its message is kept beside the field. The
/// typed text stays until the app says the change was made.
fn length_row(
    ui: &mut egui::Ui,
    state: &mut FramingPanelState,
    field: FramingField,
    current: &str,
    hint: &str,
    commands: &mut Vec<Command>,
    read: impl FnOnce(&str) -> Result<Command, String>,
) {
    ui.label(field.shown());
    let typed = typed_text_field(
        ui,
        &mut state.typed,
        &state.errors,
        field,
        field.name(),
        current,
        hint,
        FIELD_WIDTH,
    );
    if let Some(text) = typed {
        match read(&text) {
            Ok(command) => commands.push(command),
            Err(message) => {
                state.errors.insert(field, message);
            }
        }
    }
    ui.end_row();
}
