//! Whole-window tests: the app state driven through its widgets with
//! egui_kittest (found by role and label, clicked and typed into), the 3D
//! drawing left out.

use egui::{Key, Modifiers, Pos2};
use egui_kittest::Harness;
use egui_kittest::kittest::Queryable as _;
use glam::DVec2;
use pitchframe_geometry::Plan;

use super::ViewPreset;
use super::app::AppState;
use super::command::Command;
use super::dialogs::Dialog;
use super::document::Document;
use super::edit::{PlanEdit, corner_in};
use super::files::ConfigDir;
use super::files::tests::TempFolder;

/// The window on the demo house, with its own files in `folder` and the
/// first-start cautions already seen.
fn demo_window(folder: &TempFolder) -> Harness<'static, AppState> {
    let config = ConfigDir::at(folder.0.join("config"));
    config.mark_safety_shown().unwrap();
    window(AppState::new(Document::demo().unwrap(), Some(config), ViewPreset::Corner))
}

fn window(state: AppState) -> Harness<'static, AppState> {
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 900.0))
        // A sixtieth of a second a frame, as on a screen, so two clicks
        // a frame apart make a double-click.
        .with_step_dt(1.0 / 60.0)
        .build_ui_state(|ui, state: &mut AppState| state.ui(ui, None), state);
    harness.run();
    harness
}

/// The slope of the roof plane rising from global wall `wall`.
fn plane_slope(state: &AppState, wall: usize) -> f64 {
    let roof = state.derived.scene.roof.as_ref().expect("the roof solved");
    roof.planes.iter().find(|plane| plane.wall == wall).expect("the wall has a plane").rise_per_run
}

fn centre_of(harness: &Harness<'_, AppState>, label: &str) -> Pos2 {
    harness.get_by_label(label).rect().center()
}

fn type_into(harness: &mut Harness<'_, AppState>, label: &str, text: &str) {
    harness.get_by_label(label).click();
    harness.run();
    // Select what the field holds so the typing replaces it.
    harness.key_press_modifiers(Modifiers::COMMAND, Key::A);
    harness.get_by_label(label).type_text(text);
    harness.run();
    harness.key_press(Key::Enter);
    harness.run();
}

#[test]
fn a_walls_pitch_typed_in_resolves_the_roof_and_undo_restores_it() {
    let folder = TempFolder::new("pitch");
    let mut harness = demo_window(&folder);
    harness.get_by_label("Wall 2").click();
    harness.run();
    assert_eq!(harness.state().selected_wall, Some(1));
    // The demo's east wall rises at the roof's 6 in 12 (0.5 rise per run).
    assert!((plane_slope(harness.state(), 1) - 0.5).abs() < 1e-12);

    type_into(&mut harness, "Wall 2 pitch", "8/12");
    // Derivation: 8 in 12 is 8 / 12 rise per unit run.
    assert!((plane_slope(harness.state(), 1) - 8.0 / 12.0).abs() < 1e-12);
    assert!(harness.state().document.unsaved());

    harness.key_press_modifiers(Modifiers::COMMAND, Key::Z);
    harness.run();
    assert!((plane_slope(harness.state(), 1) - 0.5).abs() < 1e-12);
    assert!(!harness.state().document.unsaved(), "undo back to the opened plan leaves nothing unsaved");

    harness.key_press_modifiers(Modifiers::COMMAND, Key::Y);
    harness.run();
    assert!((plane_slope(harness.state(), 1) - 8.0 / 12.0).abs() < 1e-12);
}

#[test]
fn text_that_does_not_read_shows_the_parsers_message_and_changes_nothing() {
    let folder = TempFolder::new("bad-text");
    let mut harness = demo_window(&folder);
    let before = harness.state().document.plan.clone();
    type_into(&mut harness, "Wall 1 pitch", "steep");
    assert_eq!(harness.state().document.plan, before);
    let message = pitchframe_geometry::Pitch::parse("steep").unwrap_err().to_string();
    let _ = harness.get_by_label(&message);
    type_into(&mut harness, "Wall 1 length", "44 yards");
    assert_eq!(harness.state().document.plan, before);
    let _ = harness.get_by_label_contains("\"44 yards\" is not a length");
}

#[test]
fn a_wall_length_typed_in_feet_and_inches_moves_its_far_corner() {
    let folder = TempFolder::new("length");
    let mut harness = demo_window(&folder);
    type_into(&mut harness, "Wall 1 length", "46' 6-1/2\"");
    // Derivation: wall 1 runs along +X from (0, 0); 46 ft 6-1/2 in is 558.5 in.
    let corner = corner_in(&harness.state().document.plan.walls[1]);
    assert_eq!(corner, DVec2::new(558.5, 0.0));
}

/// A double-click: two clicks in successive frames.
fn double_click_at(harness: &mut Harness<'_, AppState>, pos: Pos2) {
    harness.hover_at(pos);
    harness.step();
    for _ in 0..2 {
        for pressed in [true, false] {
            harness.event(egui::Event::PointerButton {
                pos,
                button: egui::PointerButton::Primary,
                pressed,
                modifiers: Modifiers::NONE,
            });
        }
        harness.step();
    }
    harness.run();
}

/// A drag from `from` to `to` over a few frames, as a hand makes it.
fn drag(harness: &mut Harness<'_, AppState>, from: Pos2, to: Pos2) {
    harness.hover_at(from);
    harness.step();
    harness.drag_at(from);
    harness.step();
    for step in 1..=5 {
        harness.hover_at(from + (to - from) * (step as f32 / 5.0));
        harness.step();
    }
    harness.drop_at(to);
    harness.run();
}

#[test]
fn a_double_click_on_a_wall_adds_a_corner_that_drags_on_the_grid() {
    let folder = TempFolder::new("corner");
    let mut harness = demo_window(&folder);
    let opened = harness.state().document.plan.clone();
    let (a, b) = (centre_of(&harness, "Corner 1"), centre_of(&harness, "Corner 2"));
    double_click_at(&mut harness, a + (b - a) * 0.4);
    let split = harness.state().document.plan.clone();
    assert_eq!(split.walls.len(), opened.walls.len() + 1, "no corner was added");
    let added = corner_in(&split.walls[1]);
    // On wall 1 (y = 0, from x = 0 to 528 in), about 0.4 of the way along,
    // on the 1 in grid.
    assert_eq!(added.y, 0.0);
    assert!((added.x - 0.4 * 528.0).abs() < 12.0, "added at {added}");
    assert_eq!(added.x, added.x.round());
    assert_eq!(harness.state().selected_corner, Some(1));

    // Drag the new corner out, a little off square: it moves and lands on
    // the grid, and the whole drag is one undo step.
    let from = centre_of(&harness, "Corner 2");
    drag(&mut harness, from, from + egui::vec2(7.0, 60.0));
    let dragged = harness.state().document.plan.clone();
    let moved = corner_in(&dragged.walls[1]);
    assert!(moved.y < -10.0, "the corner did not move out of the wall: {moved}");
    assert_eq!(moved, moved.round(), "the corner is off the 1 in grid");
    assert!(harness.state().derived.problem.is_none());

    harness.key_press_modifiers(Modifiers::COMMAND, Key::Z);
    harness.run();
    assert_eq!(harness.state().document.plan, split);

    // Delete the corner again from the keyboard.
    harness.get_by_label("Corner 2").click();
    harness.run();
    harness.key_press(Key::Delete);
    harness.run();
    assert_eq!(harness.state().document.plan, opened);
}

#[test]
fn a_corner_dragged_across_the_house_names_the_crossing_and_keeps_the_last_roof() {
    let folder = TempFolder::new("crossing");
    let mut harness = demo_window(&folder);
    let good_roof = harness.state().derived.scene.roof.clone();
    let (from, across) = (centre_of(&harness, "Corner 3"), centre_of(&harness, "Corner 1"));
    drag(&mut harness, from, across + (across - from) * 0.3);
    let problem = harness.state().derived.problem.clone().expect("the outline should be invalid");
    assert!(problem.message.contains("crosses"), "{}", problem.message);
    assert!(!problem.walls.is_empty(), "no wall is marked at fault");
    let _ = harness.get_by_label_contains(&problem.message);
    // The roof on screen is one that solved (from part-way through the
    // drag), and further bad edits leave it alone.
    let shown = std::sync::Arc::clone(&harness.state().derived.scene);
    assert!(shown.roof.is_some() && good_roof.is_some());
    let wall = 2;
    let to_in = DVec2::new(-5000.0, -5000.0);
    harness.state_mut().push(Command::Edit { edit: PlanEdit::MoveCorner { wall, to_in }, group: None });
    harness.run();
    assert!(harness.state().derived.problem.is_some());
    assert!(std::sync::Arc::ptr_eq(&shown, &harness.state().derived.scene));
}

#[test]
fn a_saved_plan_reopens_the_same_and_joins_the_recent_files() {
    let folder = TempFolder::new("save");
    let mut harness = demo_window(&folder);
    type_into(&mut harness, "Wall 3 pitch", "10/12");
    let edited = harness.state().document.plan.clone();
    let path = folder.0.join("house.toml");
    assert!(harness.state_mut().save_to_path(&path));
    harness.run();
    assert!(!harness.state().document.unsaved());

    harness.state_mut().push(Command::New);
    harness.run();
    assert_ne!(harness.state().document.plan, edited);
    assert!(harness.state_mut().open_path(&path));
    harness.run();
    assert_eq!(harness.state().document.plan, edited);
    assert_eq!(harness.state().document.title(), "house.toml");
    let recent = harness.state().config.as_ref().unwrap().recent();
    assert_eq!(recent.first().and_then(|p| p.file_name()), path.file_name());
}

#[test]
fn a_file_that_is_not_a_plan_gets_a_message_in_the_window() {
    let folder = TempFolder::new("bad-file");
    let mut harness = demo_window(&folder);
    let path = folder.0.join("notes.toml");
    std::fs::write(&path, "this is not a plan").unwrap();
    let before = harness.state().document.plan.clone();
    assert!(!harness.state_mut().open_path(&path));
    harness.run();
    assert_eq!(harness.state().document.plan, before);
    let _ = harness.get_by_label_contains("notes.toml");
}

#[test]
fn new_asks_before_losing_unsaved_changes() {
    let folder = TempFolder::new("unsaved");
    let mut harness = demo_window(&folder);
    type_into(&mut harness, "Wall 1 pitch", "7/12");
    let edited = harness.state().document.plan.clone();
    harness.get_by_label("File").click();
    harness.run();
    harness.get_by_role_and_label(egui::Role::Button, "New Ctrl+N").click();
    harness.run();
    assert!(matches!(harness.state().dialogs.first(), Some(Dialog::Unsaved(_))));
    harness.get_by_label("Cancel").click();
    harness.run();
    assert_eq!(harness.state().document.plan, edited);

    harness.key_press_modifiers(Modifiers::COMMAND, Key::N);
    harness.run();
    harness.get_by_label("Don't save").click();
    harness.run();
    assert_eq!(harness.state().document.plan.walls.len(), 4, "the new plan is a plain box");
}

#[test]
fn an_autosave_left_by_a_crash_is_offered_back_at_the_next_start() {
    let folder = TempFolder::new("recover");
    let path = folder.0.join("house.toml");
    let edited = {
        let mut harness = demo_window(&folder);
        assert!(harness.state_mut().save_to_path(&path));
        // The autosave must be newer than the saved file.
        std::thread::sleep(std::time::Duration::from_millis(20));
        type_into(&mut harness, "Wall 4 pitch", "12/12");
        harness.state_mut().autosave_now();
        harness.state().document.plan.clone()
        // Dropped without closing, as a crash leaves it.
    };
    // The next start opens the demo, not the plan: the note finds the autosave.
    let config = ConfigDir::at(folder.0.join("config"));
    let state = AppState::new(Document::demo().unwrap(), Some(config), ViewPreset::Corner);
    let mut harness = window(state);
    let _ = harness.get_by_label("Restore unsaved work?");
    harness.get_by_label("Restore").click();
    harness.run();
    let restored: &Plan = &harness.state().document.plan;
    assert_eq!(*restored, edited);
    assert!(harness.state().document.unsaved(), "restored work is still unsaved");
    assert_eq!(harness.state().document.path.as_deref(), Some(path.as_path()));
    // Saving it puts the work in its file and the autosave away.
    assert!(harness.state_mut().save_to_path(&path));
    let config = ConfigDir::at(folder.0.join("config"));
    assert_eq!(config.leftover_autosave(Some(&path)), None);
}

#[test]
fn the_safety_cautions_show_at_the_first_start_only() {
    let folder = TempFolder::new("first-start");
    let config = ConfigDir::at(folder.0.join("config"));
    let mut harness =
        window(AppState::new(Document::demo().unwrap(), Some(config.clone()), ViewPreset::Corner));
    let _ = harness.get_by_label_contains("Work at height needs fall protection");
    harness.get_by_label("I understand").click();
    harness.run();
    assert!(harness.state().dialogs.is_empty());
    let again = AppState::new(Document::demo().unwrap(), Some(config), ViewPreset::Corner);
    assert!(again.dialogs.is_empty());
}

#[test]
fn millimetres_show_the_walls_in_millimetres() {
    let folder = TempFolder::new("units");
    let mut harness = demo_window(&folder);
    harness.get_by_label("View").click();
    harness.run();
    harness.get_by_label("Millimetres").click();
    harness.run();
    // Derivation: the demo's wall 1 is 44 ft = 528 in x 25.4 = 13411.2 mm.
    assert!(harness.query_all_by_value("13411 mm").next().is_some(), "no field shows 13411 mm");
}

#[test]
fn unsaved_work_is_autosaved_within_half_a_minute() {
    let folder = TempFolder::new("autosave-clock");
    let config = ConfigDir::at(folder.0.join("config"));
    config.mark_safety_shown().unwrap();
    let path = folder.0.join("house.toml");
    let mut state = AppState::new(Document::demo().unwrap(), Some(config.clone()), ViewPreset::Corner);
    assert!(state.save_to_path(&path));
    // One second a frame, so half a minute passes in thirty frames.
    let mut harness = Harness::builder()
        .with_size(egui::vec2(1400.0, 900.0))
        .with_step_dt(1.0)
        .build_ui_state(|ui, state: &mut AppState| state.ui(ui, None), state);
    harness.run();
    std::thread::sleep(std::time::Duration::from_millis(20));
    harness
        .state_mut()
        .push(Command::Edit { edit: PlanEdit::SetGable { wall: 0, gable: true }, group: None });
    harness.run_steps(5);
    assert_eq!(config.leftover_autosave(Some(&path)), None, "autosaved before the half minute");
    harness.run_steps(30);
    let leftover = config.leftover_autosave(Some(&path)).expect("no autosave after half a minute");
    assert_eq!(leftover.plan, harness.state().document.plan);
}

#[test]
fn the_recent_files_are_in_the_file_menu_and_colours_in_the_view_menu() {
    let folder = TempFolder::new("menus");
    let mut harness = demo_window(&folder);
    let path = folder.0.join("cabin.toml");
    assert!(harness.state_mut().save_to_path(&path));
    harness.run();
    harness.get_by_label("File").click();
    harness.run();
    harness.get_by_label("Open recent").click();
    harness.run();
    harness.get_by_role_and_label(egui::Role::Button, "cabin.toml").click();
    harness.run();
    assert!(harness.state().notice.is_none(), "{:?}", harness.state().notice);
    assert_eq!(harness.state().document.title(), "cabin.toml");

    harness.get_by_label("View").click();
    harness.run();
    harness.get_by_label("Dark colours").click();
    harness.run();
    assert_eq!(harness.state().theme, egui::Theme::Dark);
    assert_eq!(harness.ctx.theme(), egui::Theme::Dark);
}

#[test]
fn closing_with_unsaved_changes_asks_first() {
    let folder = TempFolder::new("close");
    let mut harness = demo_window(&folder);
    harness
        .state_mut()
        .push(Command::Edit { edit: PlanEdit::SetGable { wall: 0, gable: true }, group: None });
    harness.run();
    harness
        .input_mut()
        .viewports
        .entry(egui::ViewportId::ROOT)
        .or_default()
        .events
        .push(egui::ViewportEvent::Close);
    harness.step();
    assert!(matches!(harness.state().dialogs.first(), Some(Dialog::Unsaved(_))));
    let cancelled_close = harness
        .output()
        .viewport_output
        .values()
        .any(|output| output.commands.contains(&egui::ViewportCommand::CancelClose));
    assert!(cancelled_close, "the window closed without asking");
    harness.run();
    harness.get_by_label("Don't save").click();
    // The window keeps asking to close from here on, so it never settles.
    harness.run_steps(2);
    assert!(harness.state().dialogs.is_empty());
    let closing = harness
        .output()
        .viewport_output
        .values()
        .any(|output| output.commands.contains(&egui::ViewportCommand::Close));
    assert!(closing, "the window did not close after \"Don't save\"");
}

/// Lets the window run until every file it is writing is done.
fn wait_for_jobs(harness: &mut Harness<'_, AppState>) {
    let start = std::time::Instant::now();
    while !harness.state().jobs.is_empty() {
        assert!(start.elapsed().as_secs() < 120, "an export has not finished in two minutes");
        std::thread::sleep(std::time::Duration::from_millis(20));
        harness.step();
    }
    harness.run();
}

/// The demo window with typed paths in place of the desktop's dialogs.
fn demo_window_typing_paths(folder: &TempFolder) -> Harness<'static, AppState> {
    let mut harness = demo_window(folder);
    harness.state_mut().native_dialogs = false;
    harness
}

/// Types `path` into the typed-path dialog and presses its Write button.
/// Steps rather than runs once the file is asked for: the window keeps
/// drawing its spinner while the file is written.
fn write_to(harness: &mut Harness<'_, AppState>, path: &std::path::Path) {
    harness.get_by_label("File path").click();
    harness.run();
    harness.key_press_modifiers(Modifiers::COMMAND, Key::A);
    harness.get_by_label("File path").type_text(&path.display().to_string());
    harness.run();
    harness.get_by_role_and_label(egui::Role::Button, "Write").click();
    harness.step();
    harness.step();
}

#[test]
fn cut_cards_from_the_export_menu_print_on_the_paper_chosen_and_open_from_the_message() {
    let folder = TempFolder::new("export-cards");
    let mut harness = demo_window_typing_paths(&folder);
    harness.get_by_label("Export").click();
    harness.run();
    harness.get_by_role_and_label(egui::Role::Button, "Cut cards (PDF)… Ctrl+P").click();
    harness.run();
    harness.get_by_label("A4").click();
    harness.get_by_label("4").click();
    harness.run();
    harness.get_by_label("Choose where to save…").click();
    harness.run();
    let path = folder.0.join("demo cards.pdf");
    write_to(&mut harness, &path);
    wait_for_jobs(&mut harness);

    let pdf = std::fs::read(&path).unwrap();
    // PDF files open with "%PDF-" (ISO 32000-1, section 7.5.2).
    assert!(pdf.starts_with(b"%PDF-"));
    let text = String::from_utf8_lossy(&pdf);
    // A4 is 210 x 297 mm (ISO 216) = 595.28 x 841.89 pt at 72 pt an inch.
    assert!(text.contains("/MediaBox [0 0 595.27") || text.contains("/MediaBox[0 0 595.27"), "not A4");
    let _ = harness.get_by_label_contains("Wrote the cut cards");
    let _ = harness.get_by_label_contains(&path.display().to_string());

    // An opener that cannot start is a message, not a crash.
    harness.state_mut().opener = folder.0.join("no such opener").display().to_string();
    harness.get_by_label("Open folder").click();
    harness.run();
    let _ = harness.get_by_label_contains("no such opener did not start");
}

#[test]
fn cut_cards_with_one_member_ticked_print_its_full_size_templates_and_no_others() {
    let folder = TempFolder::new("export-templates");
    let mut harness = demo_window_typing_paths(&folder);
    harness.key_press_modifiers(Modifiers::COMMAND, Key::P);
    harness.run();
    // Nothing is printed full size unless asked for.
    let _ = harness.get_by_label("None chosen");
    let members = match harness.state().dialogs.first() {
        Some(Dialog::CardOptions { choice, members }) => {
            assert!(choice.templates.is_empty());
            members.clone()
        }
        other => panic!("the card dialog is not in front: {other:?}"),
    };
    // A hip: cheek cuts at both ends, so side and top views are printed.
    let hip = members.iter().find(|member| member.kind == "hip").expect("the demo house has hips");
    // Ticking two and clearing them leaves none, then one is ticked.
    let common = members.iter().find(|member| member.kind == "common rafter").expect("the demo has commons");
    harness.get_by_label(&format!("{} {}", common.label, common.kind)).click();
    harness.get_by_label(&format!("{} {}", hip.label, hip.kind)).click();
    harness.run();
    let _ = harness.get_by_label("2 members chosen");
    harness.get_by_label("None").click();
    harness.run();
    let _ = harness.get_by_label("None chosen");
    harness.get_by_label(&format!("{} {}", hip.label, hip.kind)).click();
    harness.run();
    let _ = harness.get_by_label("1 member chosen");
    harness.get_by_label("Choose where to save…").click();
    harness.run();
    let path = folder.0.join("demo cards with a template.pdf");
    write_to(&mut harness, &path);
    wait_for_jobs(&mut harness);
    let _ = harness.get_by_label_contains("Wrote the cut cards");

    let headings: Vec<String> = pdf_page_texts(&std::fs::read(&path).unwrap())
        .into_iter()
        .filter(|text| text.contains("FULL SIZE"))
        .collect();
    // Upper and lower end, each as the side face and the top face with its
    // cheek cuts: four pages, as the card crate's template pages are laid out.
    assert_eq!(headings.len(), 4, "{headings:?}");
    for (end, face) in [
        ("upper end", "side face"),
        ("upper end", "top face"),
        ("lower end", "side face"),
        ("lower end", "top face"),
    ] {
        let heading = format!("{} {} - {end}, {face}", hip.label, hip.kind);
        assert!(headings.iter().any(|text| text.contains(&heading)), "no page \"{heading}\" in {headings:?}");
    }
}

/// Each page's text, read from its content stream.
fn pdf_page_texts(pdf: &[u8]) -> Vec<String> {
    use lopdf::content::Content;
    let document = lopdf::Document::load_mem(pdf).unwrap();
    document
        .get_pages()
        .values()
        .map(|&page| {
            let content = Content::decode(&document.get_page_content(page)).unwrap();
            let mut text = String::new();
            for operation in content.operations.iter().filter(|operation| operation.operator == "Tj") {
                if let Some(lopdf::Object::String(bytes, _)) = operation.operands.first() {
                    text.extend(bytes.iter().map(|&byte| byte as char));
                    text.push('\n');
                }
            }
            text
        })
        .collect()
}

#[test]
fn the_cut_list_lumber_order_and_model_are_written_where_typed() {
    let folder = TempFolder::new("export-files");
    let mut harness = demo_window_typing_paths(&folder);
    for (label, name) in
        [("Cut list (CSV)…", "list"), ("Lumber order (CSV)…", "order"), ("3D frame (glTF .glb)…", "frame")]
    {
        harness.get_by_label("Export").click();
        harness.run();
        harness.get_by_role_and_label(egui::Role::Button, label).click();
        harness.run();
        // A name without its ending gets it.
        write_to(&mut harness, &folder.0.join(name));
        wait_for_jobs(&mut harness);
    }
    let list = std::fs::read_to_string(folder.0.join("list.csv")).unwrap();
    assert!(list.starts_with("label,"), "{list}");
    let order = std::fs::read_to_string(folder.0.join("order.csv")).unwrap();
    assert!(order.starts_with("size,board,stock,pieces,offcut"), "{order}");
    let glb = std::fs::read(folder.0.join("frame.glb")).unwrap();
    // A binary glTF opens with the magic "glTF" (glTF 2.0 spec, section 4.4.2).
    assert!(glb.starts_with(b"glTF"));
    assert!(!harness.state().document.unsaved(), "writing files changes nothing in the plan");
}

#[test]
fn a_file_that_cannot_be_written_names_the_path_and_the_reason_and_loses_nothing() {
    let folder = TempFolder::new("export-bad");
    let mut harness = demo_window_typing_paths(&folder);
    type_into(&mut harness, "Wall 1 pitch", "7/12");
    let edited = harness.state().document.plan.clone();
    harness.key_press_modifiers(Modifiers::COMMAND, Key::P);
    harness.run();
    harness.get_by_label("Choose where to save…").click();
    harness.run();
    let path = folder.0.join("no folder here").join("cards.pdf");
    write_to(&mut harness, &path);
    wait_for_jobs(&mut harness);
    let _ = harness.get_by_label_contains(&format!("The cut cards was not written to {}", path.display()));
    // The system's reason for a missing folder.
    let _ = harness.get_by_label_contains("No such file or directory");
    assert_eq!(harness.state().document.plan, edited);
    assert!(harness.state().document.unsaved());
    assert!(!path.exists());
}

#[test]
fn a_picture_of_the_view_asks_its_size_and_rejects_one_that_is_not_a_number() {
    let folder = TempFolder::new("export-picture");
    let mut harness = demo_window_typing_paths(&folder);
    harness.state_mut().push(Command::Export(super::export::ExportKind::Picture));
    harness.run();
    type_into(&mut harness, "Picture width", "wide");
    harness.get_by_label("Choose where to save…").click();
    harness.run();
    let _ = harness.get_by_label("Picture width: \"wide\" is not a whole number of pixels");
    assert!(harness.state().picture_request.is_none());
    harness.get_by_label("1920 x 1080").click();
    harness.run();
    harness.get_by_label("Choose where to save…").click();
    harness.run();
    let path = folder.0.join("view.png");
    write_to(&mut harness, &path);
    let request = harness.state().picture_request.clone().expect("a picture was asked for");
    assert_eq!(request.size_px, [1920, 1080]);
    assert_eq!(request.path, path);
}

/// Frames enough for the camera's glide (under half a second) to end.
fn let_the_camera_glide(harness: &mut Harness<'_, AppState>) {
    harness.run_steps(40);
    harness.run();
}

/// The demo window with `label` picked and the numbers showing.
fn demo_window_picking(folder: &TempFolder, label: &str) -> Harness<'static, AppState> {
    let mut harness = demo_window(folder);
    harness.state_mut().picked = Some(label.to_owned());
    harness.state_mut().side_tab = super::app::SideTab::Numbers;
    harness.run();
    harness
}

#[test]
fn a_joint_clicked_in_the_side_panel_brings_the_camera_in_and_shows_its_fit() {
    let folder = TempFolder::new("joint-panel");
    let scene = Document::demo().map(|d| super::derived::Derived::new(&d.plan)).unwrap().scene;
    // The geometry crate's joint check on the demo frame: take its first
    // joint and the members it joins.
    let first = scene.joints().first().expect("the demo frame has joints").clone();
    let [cut, bearing] = first.joint.members.clone();
    let mut harness = demo_window_picking(&folder, &cut);
    let far = harness.state().camera.distance_in;

    harness.get_by_label(&format!("{cut} on {bearing}")).click();
    let_the_camera_glide(&mut harness);
    let picked = harness.state().picked_joint.expect("a joint is picked");
    let joint = harness.state().derived.scene.joints()[picked].clone();
    assert_eq!(joint.joint.members, [cut.clone(), bearing.clone()]);
    // The worst of that pair's joints is the one shown.
    let worst = scene
        .joints()
        .iter()
        .filter(|j| j.joint.members == joint.joint.members)
        .map(|j| j.joint.max_gap.max(j.joint.max_overlap))
        .fold(0.0, f64::max);
    assert_eq!(joint.joint.max_gap.max(joint.joint.max_overlap), worst);
    // The camera has glided in on the joint.
    assert!(harness.state().glide.is_none(), "the glide ended");
    assert!((harness.state().camera.target - joint.at).length() < 1e-9);
    assert!(harness.state().camera.distance_in < far / 4.0);

    let _ = harness.get_by_label(&format!("Joint: {cut} on {bearing}"));
    let gap = super::joint_panel::fit_text(harness.state().units, joint.joint.max_gap);
    let overlap = super::joint_panel::fit_text(harness.state().units, joint.joint.max_overlap);
    assert!(!harness.query_all_by_label(&gap).collect::<Vec<_>>().is_empty(), "{gap} is not shown");
    assert!(!harness.query_all_by_label(&overlap).collect::<Vec<_>>().is_empty(), "{overlap} is not shown");
    // 1/64 in is the joint tolerance (common practice, no source).
    let tight = joint.joint.max_gap <= 1.0 / 64.0 && joint.joint.max_overlap <= 1.0 / 64.0;
    assert_eq!(harness.query_by_label("Within 1/64 in").is_some(), tight);
}

#[test]
fn a_click_on_a_joints_mark_in_the_3d_view_picks_that_joint() {
    let folder = TempFolder::new("joint-mark");
    let scene = Document::demo().map(|d| super::derived::Derived::new(&d.plan)).unwrap().scene;
    let last = scene.joints().last().expect("the demo frame has joints").clone();
    let mut harness = demo_window_picking(&folder, &last.joint.members[1]);
    let view_size = DVec2::new(700.0, 780.0);
    let camera = harness.state().camera;
    let at = camera.project(last.at, view_size).expect("the joint is in view");
    let shown = harness.state().shown_joints();
    // A click a few points off the mark still finds it.
    let click = at + DVec2::new(3.0, -2.0);
    harness.state_mut().push(Command::PickAt { at: click, view_size });
    let_the_camera_glide(&mut harness);
    let picked = harness.state().picked_joint.expect("the click picked a joint");
    let joints = harness.state().derived.scene.joints();
    // Measured from the camera the click was made with: the picked mark is
    // within the 12 pt pick radius, and no other marked joint is nearer.
    let distance = |index: usize| camera.project(joints[index].at, view_size).unwrap().distance(click);
    assert!(distance(picked) <= 12.0);
    assert!(shown.contains(&picked));
    assert!(shown.iter().all(|&other| distance(other) >= distance(picked)));
    assert_eq!(harness.state().picked.as_deref(), Some(joints[picked].joint.members[0].as_str()));
    let _ = harness.get_by_label("Largest gap");
}

#[test]
fn a_joint_open_by_more_than_a_64th_says_so_in_red() {
    let folder = TempFolder::new("joint-open");
    let mut harness = demo_window(&folder);
    let scene = (*harness.state().derived.scene).clone();
    let mut joints = scene.joints().to_vec();
    let label = joints[0].joint.members[0].clone();
    // 0.05 in is over 1/64 in = 0.0156 in.
    joints[0].joint.max_gap = 0.05;
    harness.state_mut().derived.scene = std::sync::Arc::new(scene.with_joints(joints));
    harness.state_mut().picked = Some(label);
    harness.state_mut().push(Command::PickJoint(0));
    let_the_camera_glide(&mut harness);
    let _ = harness.get_by_label("Off by more than 1/64 in: check this joint before cutting");
    let _ = harness.get_by_label("0.050 in");
}

/// The demo window showing its framing settings.
fn framing_window(folder: &TempFolder) -> Harness<'static, AppState> {
    let mut harness = demo_window(folder);
    harness.get_by_label("Framing").click();
    harness.run();
    harness
}

fn pieces_of(state: &AppState, kind: pitchframe_geometry::MemberKind) -> usize {
    let frame = state.derived.scene.frame.as_ref().expect("the plan frames");
    frame.pieces.iter().filter(|piece| piece.kind == kind).count()
}

#[test]
fn rafter_spacing_typed_in_lays_the_frame_out_again_and_undo_takes_it_back() {
    use pitchframe_geometry::MemberKind;
    let folder = TempFolder::new("framing-spacing");
    let mut harness = framing_window(&folder);
    let commons_at_24 = pieces_of(harness.state(), MemberKind::Common);
    let spacing_before = harness.state().document.plan.framing.spacing;
    assert_eq!(harness.state().document.plan.framing_settings().unwrap().spacing_in, 24.0);
    type_into(&mut harness, "Rafter spacing", "16");
    let plan = harness.state().document.plan.clone();
    assert_eq!(plan.framing.spacing.map(|s| s.inches()), Some(16.0));
    // The frame on screen is the geometry crate's frame for the new settings.
    let settings = plan.framing_settings().unwrap();
    assert_eq!(settings.spacing_in, 16.0);
    let outline = plan.outline().unwrap();
    let roof = pitchframe_geometry::Roof::solve(&outline).unwrap();
    let expected = pitchframe_geometry::frame_roof(&outline, &roof, &settings).unwrap();
    assert_eq!(harness.state().derived.scene.frame.as_ref().unwrap().pieces.len(), expected.pieces.len());
    // Derivation: commons along a wall number about its length over the
    // spacing, so 16 in gives about 24/16 = 1.5 times those at 24 in.
    let commons_at_16 = pieces_of(harness.state(), MemberKind::Common);
    let ratio = commons_at_16 as f64 / commons_at_24 as f64;
    assert!((1.3..1.7).contains(&ratio), "{commons_at_24} commons became {commons_at_16}");

    harness.key_press_modifiers(Modifiers::COMMAND, Key::Z);
    harness.run();
    assert_eq!(harness.state().document.plan.framing.spacing, spacing_before);
    assert_eq!(pieces_of(harness.state(), MemberKind::Common), commons_at_24);
    harness.key_press_modifiers(Modifiers::COMMAND, Key::Y);
    harness.run();
    assert_eq!(pieces_of(harness.state(), MemberKind::Common), commons_at_16);
}

#[test]
fn a_framing_value_that_cannot_be_used_names_its_field_and_changes_nothing() {
    let folder = TempFolder::new("framing-bad");
    let mut harness = framing_window(&folder);
    let before = harness.state().document.plan.clone();
    let frame_before = harness.state().derived.scene.frame.clone();

    type_into(&mut harness, "Rafter spacing", "0");
    let _ = harness.get_by_label("Rafter spacing: 0 must be more than zero");
    type_into(&mut harness, "Rafter size", "two by eight");
    let _ = harness.get_by_label_contains("Rafter size: ");
    // Derivation: a 2x8 at 6 in 12 stands 7-1/4 / cos(26.57 deg) = 8.1 in
    // plumb, so a 40 in heel leaves it no seat on the plate.
    type_into(&mut harness, "Heel height", "40");
    // Said beside the field and across the window.
    let said = harness.query_all_by_label_contains("Heel height: a heel of 40 in leaves no seat").count();
    assert!(said >= 1);

    assert_eq!(harness.state().document.plan, before);
    assert_eq!(harness.state().derived.scene.frame, frame_before, "the frame on screen stays");
    assert!(!harness.state().history.can_undo(), "nothing was changed, so there is nothing to undo");
    assert!(harness.state().framing_panel.has_errors());
    // The typed text stays in its field for the framer to correct.
    let field = harness.get_by_label("Heel height");
    assert_eq!(field.value().as_deref(), Some("40"));
}

#[test]
fn member_sizes_hips_tails_and_overhang_change_the_frame() {
    use pitchframe_geometry::MemberKind;
    use pitchframe_geometry::framing::{HipTop, TailCut};
    let folder = TempFolder::new("framing-sizes");
    let mut harness = framing_window(&folder);
    type_into(&mut harness, "Hip size", "2x12");
    let frame = harness.state().derived.scene.frame.clone().unwrap();
    let hip = frame.members.iter().find(|m| m.kind == MemberKind::Hip).expect("the demo has hips");
    // A dressed 2x12 is 1-1/2 x 11-1/4 in (American Softwood Lumber
    // Standard PS 20, dry sizes).
    assert_eq!((hip.size.thickness_in, hip.size.depth_in), (1.5, 11.25));

    harness.get_by_label("Dropped").click();
    harness.run();
    harness.get_by_label("Plumb and level").click();
    harness.run();
    type_into(&mut harness, "Tail plumb cut", "4");
    type_into(&mut harness, "Framing overhang", "1' 0\"");
    let plan = &harness.state().document.plan;
    let settings = plan.framing_settings().unwrap();
    assert_eq!(settings.hip_top, HipTop::Dropped);
    assert_eq!(settings.tail, TailCut::PlumbAndLevel { plumb_height_in: 4.0 });
    assert_eq!(plan.default_overhang.inches(), 12.0);
    // Five changes, five undos back to the demo as opened.
    for _ in 0..5 {
        harness.key_press_modifiers(Modifiers::COMMAND, Key::Z);
        harness.run();
    }
    assert!(!harness.state().document.unsaved());
}

#[test]
fn a_plan_that_does_not_frame_says_why_before_asking_where_to_write() {
    let folder = TempFolder::new("export-invalid");
    let mut harness = demo_window_typing_paths(&folder);
    // Corner 3 far past the house: its walls cross the ones opposite.
    let to_in = DVec2::new(-5000.0, -5000.0);
    harness.state_mut().push(Command::Edit { edit: PlanEdit::MoveCorner { wall: 2, to_in }, group: None });
    harness.run();
    let problem = harness.state().derived.problem.clone().expect("the outline is invalid");
    harness.key_press_modifiers(Modifiers::COMMAND, Key::P);
    harness.run();
    assert!(harness.state().dialogs.is_empty(), "no dialog asks where to write cards that cannot be made");
    let _ = harness
        .get_by_label(&format!("The cut cards cannot be made until the plan frames: {}", problem.message));
    // A picture of what is on screen needs no frame.
    harness.state_mut().push(Command::Export(super::export::ExportKind::Picture));
    harness.run();
    assert!(matches!(harness.state().dialogs.first(), Some(Dialog::PictureSize { .. })));
}

#[test]
fn a_millimetre_plan_takes_its_framing_in_millimetres() {
    let folder = TempFolder::new("framing-mm");
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("../../examples/metric-bungalow.toml");
    let config = ConfigDir::at(folder.0.join("config"));
    config.mark_safety_shown().unwrap();
    let mut harness = window(AppState::new(Document::open(&path).unwrap(), Some(config), ViewPreset::Corner));
    harness.get_by_label("Framing").click();
    harness.run();
    type_into(&mut harness, "Rafter spacing", "400");
    type_into(&mut harness, "Rafter size", "45x170");
    let settings = harness.state().document.plan.framing_settings().unwrap();
    // Derivation: plain numbers on a millimetre plan are millimetres;
    // 400 mm / 25.4 = 15.748 in, 45 mm = 1.772 in, 170 mm = 6.693 in.
    assert!((settings.spacing_in - 400.0 / 25.4).abs() < 1e-9);
    assert!((settings.rafter.thickness_in - 45.0 / 25.4).abs() < 1e-9);
    assert!((settings.rafter.depth_in - 170.0 / 25.4).abs() < 1e-9);
    assert!(harness.state().derived.scene.frame.is_some(), "the bungalow frames at 400 mm centres");
}

#[test]
fn the_window_keeps_working_while_a_file_is_written_and_the_file_is_of_the_plan_as_asked() {
    use super::export::{CardChoice, ExportKind, ExportWork, make_bytes};
    let folder = TempFolder::new("export-busy");
    let mut harness = demo_window_typing_paths(&folder);
    let asked = harness.state().document.plan.clone();
    harness.get_by_label("Export").click();
    harness.run();
    harness.get_by_role_and_label(egui::Role::Button, "Cut list (CSV)…").click();
    harness.run();
    let path = folder.0.join("list.csv");
    write_to(&mut harness, &path);
    if !harness.state().jobs.is_empty() {
        // Still being written: the window says so and goes on drawing.
        let _ = harness.get_by_label_contains("Writing the cut list to");
    }
    // The plan changes while (or after) the file is made ...
    type_into_while_busy(&mut harness, "Roof pitch", "12/12");
    assert_ne!(harness.state().document.plan, asked);
    wait_for_jobs(&mut harness);
    // ... and the file is of the plan as it stood when it was asked for.
    let cards = CardChoice::for_plan(&asked);
    let work = ExportWork::FromPlan {
        kind: ExportKind::CutList,
        plan: Box::new(asked),
        title: "Demo house".to_owned(),
        cards,
    };
    let (expected, _) = make_bytes(work, &|_, _| {}).unwrap();
    assert_eq!(std::fs::read(&path).unwrap(), expected);
}

/// Types into a field with frames stepped, not run to rest (a spinner may
/// be turning).
fn type_into_while_busy(harness: &mut Harness<'_, AppState>, label: &str, text: &str) {
    harness.get_by_label(label).click();
    harness.step();
    harness.key_press_modifiers(Modifiers::COMMAND, Key::A);
    harness.get_by_label(label).type_text(text);
    harness.step();
    harness.key_press(Key::Enter);
    harness.step();
    harness.step();
}

#[test]
fn a_long_wall_list_lays_out_the_rows_in_view_and_the_selected_one() {
    let folder = TempFolder::new("long-list");
    let config = ConfigDir::at(folder.0.join("config"));
    config.mark_safety_shown().unwrap();
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("benches/many-wings.toml");
    let document = Document::open(&path).unwrap();
    let walls = document.plan.walls.len();
    assert!(walls >= 80, "the twenty-wing plan has {walls} walls");
    let mut harness = window(AppState::new(document, Some(config), ViewPreset::Corner));
    // Every row is laid out in the first frame, before the list knows the
    // rows' heights; from then on only those in view (the 900 point high
    // window shows the first few walls), and the selected wall's.
    let _ = harness.get_by_label("Wall 1 length");
    assert!(harness.query_by_label("Wall 80 length").is_none(), "a row far out of view is laid out");
    harness.state_mut().push(Command::SelectWall(Some(79)));
    harness.run();
    let _ = harness.get_by_label("Wall 80 length");
    harness.state_mut().push(Command::SelectWall(None));
    harness.run();
    assert!(harness.query_by_label("Wall 80 length").is_none(), "the row stays laid out once let go");
}
