//! The side panel: the numbers a framer reads for the document's pitch,
//! the picked member's lengths and cuts, and the colour legend.

use egui::{Color32, RichText};
use pitchframe_geometry::framing::{Cut, CutEnd, FramingWarning, Hand, MemberKind, SawKind};
use pitchframe_geometry::{Length, Member, Pitch, Plan, RafterTable};

use super::derived::{Derived, WALL_HEIGHT_IN, WALL_THICKNESS_IN};
use super::document::Document;
use super::palette;
use super::scene::{Scene, ScenePiece};
use super::units::DisplayUnits;

/// Size of the figures a framer reads off the panel, in points: large
/// enough to read at arm's length from a laptop on a sawhorse.
const FIGURE_SIZE: f32 = 22.0;

/// Shows the house, what `joint_ui` shows of the picked joint, the picked
/// member, what `joints_ui` shows of its joints, the rafter table and the
/// legend.
pub fn side_panel_ui(
    ui: &mut egui::Ui,
    document: &Document,
    derived: &Derived,
    units: DisplayUnits,
    picked: Option<&ScenePiece>,
    joint_ui: impl FnOnce(&mut egui::Ui),
    joints_ui: impl FnOnce(&mut egui::Ui),
) {
    let scene = &derived.scene;
    egui::ScrollArea::vertical().show(ui, |ui| {
        ui.heading(document.title());
        ui.label(format!(
            "Walls drawn {} high, {} thick",
            units.format(Length::from_inches(WALL_HEIGHT_IN)),
            units.format_small(Length::from_inches(WALL_THICKNESS_IN))
        ));
        if let Some(problem) = &derived.problem {
            ui.colored_label(
                ui.visuals().warn_fg_color,
                format!("{} ({})", problem.message, derived.shown_instead()),
            );
        }
        if derived.frame_pending() {
            ui.colored_label(
                ui.visuals().warn_fg_color,
                "The frame is being laid out again for the corner being moved; \
                 the numbers below are of the plan a moment ago.",
            );
        }
        if let Some(error) = &derived.settings_error {
            ui.colored_label(ui.visuals().warn_fg_color, format!("No frame: {error}"));
        }
        if let Some(error) = &scene.frame_error {
            ui.colored_label(ui.visuals().warn_fg_color, error);
        }
        if let Some(frame) = scene.frame.as_ref().filter(|frame| !frame.warnings.is_empty()) {
            ui.colored_label(
                ui.visuals().warn_fg_color,
                format!(
                    "{} things to check before cutting; pick a member to see its own.",
                    frame.warnings.len()
                ),
            );
        }
        ui.separator();
        joint_ui(ui);
        match picked {
            Some(piece) => {
                let member = scene
                    .frame
                    .as_ref()
                    .and_then(|frame| frame.members.iter().find(|m| m.label == piece.label));
                picked_ui(ui, units, piece, member);
                let warnings = scene.frame.iter().flat_map(|frame| &frame.warnings);
                for warning in warnings.filter(|warning| warning.label() == piece.label) {
                    ui.colored_label(ui.visuals().warn_fg_color, warning_text(units, warning));
                }
            }
            None => {
                ui.heading("Picked member");
                ui.label("Click a member in the 3D view to see its lengths and cuts.");
            }
        }
        ui.separator();
        joints_ui(ui);
        for (index, pitch) in pitches_in(&document.plan).into_iter().enumerate() {
            let table = RafterTable::for_pitch(pitch);
            let title =
                format!("Rafter table, {} in 12 ({:.2}°)", trimmed(table.rise_in_12), table.pitch_deg);
            egui::CollapsingHeader::new(RichText::new(title).heading())
                .default_open(index == 0)
                .show(ui, |ui| rafter_table_ui(ui, units, &table));
        }
        ui.separator();
        legend_ui(ui, scene);
    });
}

/// The picked member's numbers in large type.
fn picked_ui(ui: &mut egui::Ui, units: DisplayUnits, piece: &ScenePiece, member: Option<&Member>) {
    ui.label(
        RichText::new(format!("{}  {}", piece.label, palette::member_name(piece.kind)))
            .size(FIGURE_SIZE)
            .strong(),
    );
    let Some(member) = member else {
        ui.label("This member's numbers are not in the frame.");
        return;
    };
    let pieces = if member.count == 1 { "1 piece".to_owned() } else { format!("{} pieces", member.count) };
    let hands = member
        .hands
        .map(|hands| format!(" ({} long point left, {} right)", hands.left, hands.right))
        .unwrap_or_default();
    ui.label(format!(
        "{pieces}{hands}, each from {} x {} stock",
        inches_text(units, member.size.thickness_in),
        inches_text(units, member.size.depth_in)
    ));
    let lengths = [
        ("Long point length", member.long_point_length),
        ("Short point length", member.short_point_length),
        ("Seat to top cut", member.seat_to_top_cut),
        ("Tail", member.tail_length),
        ("Overall (stock) length", member.overall_length),
    ];
    for (name, inches) in lengths.into_iter().filter(|&(_, inches)| inches > 0.0) {
        ui.label(name);
        ui.label(RichText::new(units.format(Length::from_inches(inches))).size(FIGURE_SIZE).strong());
    }
    ui.add_space(4.0);
    ui.label(RichText::new("Cuts").strong());
    for cut in &member.cuts {
        ui.label(cut_text(units, cut));
    }
}

/// One line saying where a cut is and how it is set up.
fn cut_text(units: DisplayUnits, cut: &Cut) -> String {
    let at = end_name(cut.end());
    match cut {
        Cut::Plumb { square, .. } => {
            format!("Plumb cut at the {at}: square {} and {}", figure(square[0]), figure(square[1]))
        }
        Cut::Cheek { square, face_bevel_deg, .. } => format!(
            "Cheek cut at the {at}: {} and {} across the top edge; saw on the face, bevel {face_bevel_deg:.1}°",
            figure(square[0]),
            figure(square[1])
        ),
        Cut::SteppedCheek { square, face, step_in, step_from, step_from_side_in, .. } => format!(
            "Stepped cheek at the {at}: {} and {} across the top edge; saw on the face, bevel {:.1}°; \
             stepped {} from the {} side, {} square to the cheek",
            figure(square[0]),
            figure(square[1]),
            face.face_bevel_deg,
            inches_text(units, *step_from_side_in),
            if *step_from == Hand::Left { "left" } else { "right" },
            inches_text(units, step_in.abs())
        ),
        Cut::DoubleCheek { left, right, .. } => format!(
            "Double cheek at the {at}: saw on the face, bevel {:.1}° left, {:.1}° right",
            left.face_bevel_deg, right.face_bevel_deg
        ),
        Cut::Seat { seat_width_in, heel_height_in, notch_depth_in, .. } => format!(
            "Birdsmouth: seat {}, heel {}, notch {} deep",
            inches_text(units, *seat_width_in),
            inches_text(units, *heel_height_in),
            inches_text(units, *notch_depth_in)
        ),
        Cut::Tail { square, .. } => {
            format!("Tail cut: square {} and {}", figure(square[0]), figure(square[1]))
        }
        Cut::Soffit { length_in, .. } => {
            format!("Soffit cut, level, {} long", inches_text(units, *length_in))
        }
        Cut::PlateLevel { length_in, depth_off_in, .. } => format!(
            "Level cut at the plate: {} long, up to {} off the depth",
            inches_text(units, *length_in),
            inches_text(units, *depth_off_in)
        ),
        Cut::Backing { left_deg, right_deg, .. } => {
            format!("Backing: {left_deg:.1}° left, {right_deg:.1}° right")
        }
        Cut::SquareEnd { .. } => format!("Square cut at the {at}"),
    }
}

/// A framing warning in words.
fn warning_text(units: DisplayUnits, warning: &FramingWarning) -> String {
    match warning {
        FramingWarning::NotchTooDeep { notch_depth_in, limit_in, .. } => format!(
            "Birdsmouth notch {} deep is past the limit of {}",
            inches_text(units, *notch_depth_in),
            inches_text(units, *limit_in)
        ),
        FramingWarning::BevelBeyondSaw { end, saw, bevel_deg, max_deg, .. } => {
            let saw = match saw {
                SawKind::Circular => "circular saw",
                SawKind::Miter => "miter saw",
            };
            format!(
                "The cut at the {} needs a {bevel_deg:.1}° bevel, past the {saw}'s {max_deg:.0}°: cut the \
                 complement and recut, or use another saw",
                end_name(*end)
            )
        }
        FramingWarning::HipTooShallow { hip, short_by_in, .. } => {
            format!("{hip} is too shallow for this jack's cheek cut by {}", inches_text(units, *short_by_in))
        }
        FramingWarning::RidgeTooShallow { ridge, short_by_in, .. } => {
            format!(
                "{ridge} is too shallow for this rafter's plumb cut by {}",
                inches_text(units, *short_by_in)
            )
        }
        FramingWarning::StockLengthExceeded { length_in, longest_stock_in, .. } => format!(
            "{} long, past the longest stock of {}",
            length_text(units, *length_in),
            length_text(units, *longest_stock_in)
        ),
        FramingWarning::HipsMeetWithoutRidge { .. } => {
            "Hips meet with no ridge: the tops are cut plumb at the peak and need a fitted block".to_owned()
        }
        FramingWarning::ShortMemberLeftOut { left_out, length_in, .. } => format!(
            "A {} only {} long between two nodes is left out: fit this end there by hand, with a block where needed",
            if *left_out == MemberKind::Valley { "valley" } else { "hip" },
            inches_text(units, *length_in)
        ),
        FramingWarning::RidgeBesideLeftOut { label, ridge, length_in, apart_in } => {
            if label == ridge {
                format!(
                    "A ridge {} long running {} beside this one is left out, since the two boards would \
                     overlap: the members on its side are cut to this ridge instead",
                    length_text(units, *length_in),
                    inches_text(units, *apart_in)
                )
            } else {
                format!(
                    "Cut to {ridge} in place of a ridge {} long running {} beside it, left out since the \
                     two boards would overlap",
                    length_text(units, *length_in),
                    inches_text(units, *apart_in)
                )
            }
        }
        FramingWarning::JointDoesNotFit { bears_on, gap_in, overlap_in, .. } => format!(
            "Does not fit {bears_on} as framed (gap {}, overlap {}): fit this joint in place, with a \
             block or a cut by hand, before cutting the run",
            pitchframe_cards::misfit_text(*gap_in, units.style()),
            pitchframe_cards::misfit_text(*overlap_in, units.style())
        ),
        FramingWarning::HipCutLevelAtPlate { cut_in, .. } => format!(
            "Runs so low beside a wall it would go into the plate: its lower edge is cut level with the \
             top of plate, up to {} off its depth; walls nearly in line often cause this",
            inches_text(units, *cut_in)
        ),
        FramingWarning::TailsLeftOut { count, .. } => format!(
            "Cut at the wall line (no overhang on one side), with the other side's jacks meeting it only \
             outside the wall line: {count} such {} left out, so that stretch of overhang has no rafter tails; \
             frame it with lookouts or blocking fixed to the wall",
            if *count == 1 { "jack is" } else { "jacks are" }
        ),
        FramingWarning::JackMovedOffLayout { ridge, by_in, .. } => format!(
            "Moved {} off the layout along its wall to clear the end of {ridge}: mark its place off the \
             layout on the valley and the ridge",
            inches_text(units, *by_in)
        ),
        FramingWarning::JackLeftOutAtRidgeEnd { count, .. } => format!(
            "{count} valley {} on the layout would hold this ridge's end and {} no room clear of it: left \
             out, so this ridge's end carries the sheathing there",
            if *count == 1 { "jack" } else { "jacks" },
            if *count == 1 { "has" } else { "have" }
        ),
    }
}

/// Where on a member a cut is, in words.
fn end_name(end: CutEnd) -> &'static str {
    match end {
        CutEnd::Top => "top",
        CutEnd::Bottom => "bottom",
        CutEnd::Seat => "seat",
        CutEnd::Tail => "tail",
        CutEnd::Start => "start",
        CutEnd::End => "far end",
        CutEnd::FullLength => "full length",
    }
}

/// The six lines of the rafter table, each with its setup on hover.
fn rafter_table_ui(ui: &mut egui::Ui, units: DisplayUnits, table: &RafterTable) {
    let lines: [(&str, String, &str); 6] = [
        (
            "Common, length per foot of run",
            figure(table.common_per_foot),
            "inches of rafter per 12 in of run, along the top edge",
        ),
        (
            "Hip or valley, length per foot of run",
            figure(table.hip_per_foot),
            "inches of hip or valley per 12 in of common run",
        ),
        (
            "Jacks at 16 in centres differ by",
            inches_text(units, table.jack_diff_16),
            "each jack is this much shorter",
        ),
        (
            "Jacks at 24 in centres differ by",
            inches_text(units, table.jack_diff_24),
            "each jack is this much shorter",
        ),
        ("Side cut of jacks: 12 and", figure(table.jack_side_cut.figure), &table.jack_side_cut.setup),
        ("Side cut of hip or valley: 12 and", figure(table.hip_side_cut.figure), &table.hip_side_cut.setup),
    ];
    for (name, value, setup) in lines {
        ui.label(name);
        ui.label(RichText::new(value).size(FIGURE_SIZE).strong()).on_hover_text(setup);
    }
}

/// The plan's pitches, the roof's own first, each once.
fn pitches_in(plan: &Plan) -> Vec<Pitch> {
    let walls = plan.walls.iter().chain(plan.courtyards.iter().flatten());
    let mut pitches = vec![plan.default_pitch];
    for pitch in walls.filter(|wall| !wall.gable).filter_map(|wall| wall.pitch) {
        if !pitches.contains(&pitch) {
            pitches.push(pitch);
        }
    }
    pitches
}

/// What each colour in the 3D view means.
fn legend_ui(ui: &mut egui::Ui, scene: &Scene) {
    ui.heading("Colours");
    let present = |kind| scene.pieces.iter().any(|piece| piece.kind == kind);
    for kind in palette::MEMBER_KINDS.into_iter().filter(|&kind| present(kind)) {
        swatch(ui, palette::member(kind), palette::member_name(kind));
    }
    swatch(ui, palette::HIGHLIGHT, "Picked piece");
    swatch(ui, palette::SAME_MEMBER, "Other pieces of the picked member");
    for tag in palette::CUT_TAGS {
        swatch(ui, palette::cut(tag), palette::cut_name(tag));
    }
}

fn swatch(ui: &mut egui::Ui, [r, g, b]: [u8; 3], name: &str) {
    ui.horizontal(|ui| {
        let (rect, _) = ui.allocate_exact_size(egui::vec2(14.0, 14.0), egui::Sense::hover());
        ui.painter().rect_filled(rect, 2.0, Color32::from_rgb(r, g, b));
        ui.label(name);
    });
}

/// A building length in the units shown.
fn length_text(units: DisplayUnits, inches: f64) -> String {
    units.format(Length::from_inches(inches))
}

/// A small length (inches and sixteenths, or millimetres), as rafter
/// tables print jack differences.
fn inches_text(units: DisplayUnits, inches: f64) -> String {
    units.format_small(Length::from_inches(inches))
}

/// A framing-square figure, to two places as squares are read.
fn figure(value: f64) -> String {
    format!("{value:.2}")
}

/// A number to two places with trailing zeros dropped.
fn trimmed(value: f64) -> String {
    let text = format!("{value:.2}");
    text.trim_end_matches('0').trim_end_matches('.').to_owned()
}

#[cfg(test)]
mod tests {
    use egui_kittest::Harness;
    use egui_kittest::kittest::Queryable as _;

    use super::*;

    #[test]
    fn the_six_rafter_table_lines_read_as_on_a_square_at_six_in_twelve() {
        let document = Document::demo().unwrap();
        // The demo's roof pitch (its west end is steeper, at 9 in 12).
        assert_eq!(document.plan.default_pitch.rise_in_12(), 6.0);
        let derived = Derived::new(&document.plan);
        let harness = Harness::new_ui(|ui| {
            side_panel_ui(ui, &document, &derived, DisplayUnits::FeetInches, None, |_| {}, |_| {})
        });
        // Common practice (the rafter table stamped on a framing square,
        // 6 in 12 column): 13.42, 18.00, 17-7/8, 26-13/16, 10-3/4, 11-5/16;
        // the side cuts show to two places, 10.73 and 11.31.
        for figure in ["13.42", "18.00", "17-7/8\"", "26-13/16\"", "10.73", "11.31"] {
            let _ = harness.get_by_label(figure);
        }
        // The steeper west end's table is listed too, folded.
        let _ = harness.get_by_label_contains("9 in 12");
    }

    #[test]
    fn a_picked_member_shows_its_label_lengths_and_cuts() {
        let document = Document::demo().unwrap();
        let derived = Derived::new(&document.plan);
        let piece = derived.scene.pieces.iter().find(|piece| piece.label == "HJ1").unwrap();
        let harness = Harness::new_ui(|ui| {
            side_panel_ui(ui, &document, &derived, DisplayUnits::FeetInches, Some(piece), |_| {}, |_| {});
        });
        let _ = harness.get_by_label("HJ1  Hip jack");
        let _ = harness.get_by_label("Long point length");
        let _ = harness.get_by_label("Cuts");
        // A jack meets its hip with a cheek cut and sits on the plate.
        let _ = harness.get_by_label_contains("Cheek cut at the top");
        let _ = harness.get_by_label_contains("Birdsmouth");
    }
}
