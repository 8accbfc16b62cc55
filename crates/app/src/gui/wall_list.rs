//! The wall list: every wall's length, direction, pitch, gable and
//! overhang as text a framer types, and the roof's own pitch and overhang.
//! Text that does not read leaves the plan alone and shows the reader's
//! message beside the field.

use std::collections::HashMap;

use egui::RichText;
use pitchframe_geometry::{Length, Pitch, Plan, PlanWall};

use super::command::Command;
use super::derived::Derived;
use super::edit::{PlanEdit, locate, ring, wall_count, wall_ends_in};
use super::typed_field::{ERROR, typed_text_field};
use super::units::DisplayUnits;

/// From how many walls the list lays out only the rows in view: fewer
/// are cheap to lay out every frame, and every field stays reachable by
/// its label (as the window tests find them).
const LAID_OUT_IN_VIEW_FROM_WALLS: usize = 24;

/// Width of a length or pitch field, in points.
const FIELD_WIDTH: f32 = 96.0;

/// One text field of the list.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum Field {
    /// The roof's pitch.
    RoofPitch,
    /// The roof's overhang.
    RoofOverhang,
    /// A wall's length.
    Length(usize),
    /// A wall's direction.
    Direction(usize),
    /// A wall's own pitch.
    Pitch(usize),
    /// A wall's own overhang.
    Overhang(usize),
}

/// Text being typed into the fields, and what was wrong with it.
#[derive(Debug, Clone, Default)]
pub struct WallListState {
    typed: HashMap<Field, String>,
    errors: HashMap<Field, String>,
    /// How far each wall's row moved the list down when last laid out, in
    /// points, so a long list can step over the rows out of view.
    row_heights: Vec<f32>,
}

impl WallListState {
    /// Forgets typed text (the plan was replaced by undo, or another file).
    pub fn clear(&mut self) {
        self.typed.clear();
        self.errors.clear();
    }
}

/// A wall's direction on the plan in degrees, 0 along +X, 90 along +Y.
fn direction_deg(plan: &Plan, wall: usize) -> Option<f64> {
    let (a, b) = wall_ends_in(plan, wall)?;
    let d = b - a;
    (d.length_squared() > 0.0).then(|| d.y.atan2(d.x).to_degrees().rem_euclid(360.0))
}

/// Reads a direction typed in degrees: `90`, `90°`, `90 deg`, `-45`.
pub fn parse_direction_deg(text: &str) -> Result<f64, String> {
    let trimmed = text.trim();
    let number = trimmed.trim_end_matches('°').trim_end_matches("degrees").trim_end_matches("deg").trim();
    match number.parse::<f64>() {
        Ok(value) if value.is_finite() => Ok(value),
        _ if trimmed.is_empty() => Err("no direction was given (the text is empty)".to_owned()),
        _ => Err(format!("\"{trimmed}\" is not a direction; write it in degrees, like 90 or 45°")),
    }
}

/// A pitch as it is shown in a field: "6/12" when the rise in 12 is a
/// round number, else the angle.
fn pitch_text(pitch: Pitch) -> String {
    let rise = pitch.rise_in_12();
    if (rise * 8.0 - (rise * 8.0).round()).abs() < 1e-9 {
        let text = format!("{:.3}", rise);
        format!("{}/12", text.trim_end_matches('0').trim_end_matches('.'))
    } else {
        format!("{:.2}°", pitch.degrees())
    }
}

/// The list, recording what the user changes as commands.
pub fn wall_list_ui(
    ui: &mut egui::Ui,
    plan: &Plan,
    derived: &Derived,
    units: DisplayUnits,
    selected_wall: Option<usize>,
    state: &mut WallListState,
    commands: &mut Vec<Command>,
) {
    ui.heading("Roof");
    ui.horizontal(|ui| {
        let text = pitch_text(plan.default_pitch);
        field_ui(ui, state, Field::RoofPitch, "Pitch", "Roof pitch", &text, "", commands, |text| {
            Pitch::parse(text).map(PlanEdit::SetRoofPitch).map_err(|err| err.to_string())
        });
        let text = units.format(plan.default_overhang);
        field_ui(ui, state, Field::RoofOverhang, "Overhang", "Roof overhang", &text, "", commands, |text| {
            units.parse(text).map(PlanEdit::SetRoofOverhang)
        });
    });
    errors_ui(ui, state, &[Field::RoofPitch, Field::RoofOverhang]);
    if let Some(problem) = &derived.problem {
        ui.label(RichText::new(&problem.message).color(ERROR).strong());
        ui.label(format!("Fix the walls in red: {}.", derived.shown_instead()));
    }
    if let Some(error) = &derived.settings_error {
        ui.label(RichText::new(format!("No frame: {error}")).color(ERROR).strong());
    }
    ui.separator();
    ui.heading("Walls");
    ui.label(RichText::new("Length and direction move the wall's far corner. Leave pitch or overhang empty to use the roof's.").weak());
    let faults = derived.problem.as_ref().map(|p| p.walls.clone()).unwrap_or_default();
    let walls = wall_count(plan);
    state.row_heights.resize(walls, 0.0);
    egui::ScrollArea::vertical().auto_shrink([false, true]).show_viewport(ui, |ui, viewport| {
        let origin = ui.max_rect().top();
        for wall in 0..walls {
            let Some(plan_wall) = locate(plan, wall).and_then(|(r, i)| ring(plan, r).and_then(|w| w.get(i)))
            else {
                continue;
            };
            // A long list lays out only the rows in view (a drag redraws
            // the window every frame, and a large plan's hundreds of
            // fields took much of it); a row being typed in, at fault or
            // selected is always laid out.
            let top = ui.cursor().top() - origin;
            let height = state.row_heights.get(wall).copied().unwrap_or(0.0);
            let out_of_view = top > viewport.bottom() + height || top + height < viewport.top() - height;
            let busy = selected_wall == Some(wall)
                || faults.contains(&wall)
                || [Field::Length(wall), Field::Direction(wall), Field::Pitch(wall), Field::Overhang(wall)]
                    .iter()
                    .any(|field| state.typed.contains_key(field) || state.errors.contains_key(field));
            if walls >= LAID_OUT_IN_VIEW_FROM_WALLS && height > 0.0 && out_of_view && !busy {
                ui.add_space(height);
                continue;
            }
            let before = ui.cursor().top();
            ui.push_id(wall, |ui| {
                wall_row_ui(
                    ui,
                    plan,
                    plan_wall,
                    wall,
                    units,
                    selected_wall,
                    faults.contains(&wall),
                    state,
                    commands,
                );
            });
            if let Some(slot) = state.row_heights.get_mut(wall) {
                *slot = ui.cursor().top() - before;
            }
        }
    });
}

#[allow(clippy::too_many_arguments, reason = "one row reads the plan, the display and the list's state")]
fn wall_row_ui(
    ui: &mut egui::Ui,
    plan: &Plan,
    plan_wall: &PlanWall,
    wall: usize,
    units: DisplayUnits,
    selected_wall: Option<usize>,
    at_fault: bool,
    state: &mut WallListState,
    commands: &mut Vec<Command>,
) {
    let name = match locate(plan, wall) {
        Some((Some(courtyard), _)) => format!("Wall {} (courtyard {})", wall + 1, courtyard + 1),
        _ => format!("Wall {}", wall + 1),
    };
    let title =
        if at_fault { RichText::new(&name).color(ERROR).strong() } else { RichText::new(&name).strong() };
    ui.horizontal(|ui| {
        if ui.selectable_label(selected_wall == Some(wall), title).clicked() {
            commands.push(Command::SelectWall(Some(wall)));
        }
        let mut gable = plan_wall.gable;
        if ui.checkbox(&mut gable, "Gable").changed() {
            commands.push(Command::Edit { edit: PlanEdit::SetGable { wall, gable }, group: None });
        }
    });
    let length_in = wall_ends_in(plan, wall).map_or(0.0, |(a, b)| (b - a).length());
    ui.horizontal(|ui| {
        let text = units.format(Length::from_inches(length_in));
        let label = format!("{name} length");
        field_ui(ui, state, Field::Length(wall), "Length", &label, &text, "", commands, |text| {
            units.parse(text).map(|length| PlanEdit::SetLength { wall, length })
        });
        let text = direction_deg(plan, wall).map(|deg| format!("{deg:.1}°")).unwrap_or_default();
        let label = format!("{name} direction");
        field_ui(ui, state, Field::Direction(wall), "Direction", &label, &text, "", commands, |text| {
            parse_direction_deg(text)
                .map(|deg| PlanEdit::SetDirection { wall, direction_rad: deg.to_radians() })
        });
    });
    ui.horizontal(|ui| {
        let text = plan_wall.pitch.map(pitch_text).unwrap_or_default();
        let hint = pitch_text(plan.default_pitch);
        let label = format!("{name} pitch");
        field_ui(ui, state, Field::Pitch(wall), "Pitch", &label, &text, &hint, commands, |text| {
            if text.trim().is_empty() {
                return Ok(PlanEdit::SetPitch { wall, pitch: None });
            }
            Pitch::parse(text)
                .map(|pitch| PlanEdit::SetPitch { wall, pitch: Some(pitch) })
                .map_err(|e| e.to_string())
        });
        let text = plan_wall.overhang.map(|o| units.format(o)).unwrap_or_default();
        let hint = units.format(plan.default_overhang);
        let label = format!("{name} overhang");
        field_ui(ui, state, Field::Overhang(wall), "Overhang", &label, &text, &hint, commands, |text| {
            if text.trim().is_empty() {
                return Ok(PlanEdit::SetOverhang { wall, overhang: None });
            }
            units.parse(text).map(|overhang| PlanEdit::SetOverhang { wall, overhang: Some(overhang) })
        });
    });
    errors_ui(
        ui,
        state,
        &[Field::Length(wall), Field::Direction(wall), Field::Pitch(wall), Field::Overhang(wall)],
    );
    ui.separator();
}

/// The messages of any of `fields` whose text did not read.
fn errors_ui(ui: &mut egui::Ui, state: &WallListState, fields: &[Field]) {
    for field in fields {
        if let Some(error) = state.errors.get(field) {
            ui.label(RichText::new(error).color(ERROR));
        }
    }
}

/// One labelled text field. While it has the keyboard the typed text is
/// kept; when the user presses Enter or leaves it, the text is read and
/// becomes an edit, or its error is kept beside the field.
#[allow(clippy::too_many_arguments, reason = "a field needs its place, its words and its reader")]
fn field_ui(
    ui: &mut egui::Ui,
    state: &mut WallListState,
    field: Field,
    shown_label: &str,
    accessible_label: &str,
    current: &str,
    hint: &str,
    commands: &mut Vec<Command>,
    read: impl FnOnce(&str) -> Result<PlanEdit, String>,
) {
    ui.label(shown_label);
    let typed = typed_text_field(
        ui,
        &mut state.typed,
        &state.errors,
        field,
        accessible_label,
        current,
        hint,
        FIELD_WIDTH,
    );
    if let Some(text) = typed {
        match read(&text) {
            Ok(edit) => {
                state.typed.remove(&field);
                state.errors.remove(&field);
                commands.push(Command::Edit { edit, group: None });
            }
            Err(message) => {
                state.errors.insert(field, message);
            }
        }
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn directions_read_in_degrees_with_or_without_the_mark() {
        assert_eq!(parse_direction_deg("90"), Ok(90.0));
        assert_eq!(parse_direction_deg(" 45° "), Ok(45.0));
        assert_eq!(parse_direction_deg("-30 deg"), Ok(-30.0));
        assert!(parse_direction_deg("north").unwrap_err().contains("not a direction"));
    }

    #[test]
    fn pitches_show_in_twelve_when_round() {
        assert_eq!(pitch_text(Pitch::parse("6/12").unwrap()), "6/12");
        assert_eq!(pitch_text(Pitch::parse("7.5/12").unwrap()), "7.5/12");
        // Derivation: tan 30 deg x 12 = 6.928, not a round eighth.
        assert_eq!(pitch_text(Pitch::parse("30deg").unwrap()), "30.00°");
    }
}
