//! The app's state: the document, its history, what is derived from it,
//! and the window's own settings. Commands recorded during a frame are
//! applied here, in one place, after it. Nothing here touches GL, so the
//! whole window (less the 3D drawing) runs under test.

use std::path::{Path, PathBuf};
use std::sync::mpsc::{Receiver, Sender, channel};
use std::sync::{Arc, Mutex};
use std::time::Duration;

use pitchframe_geometry::Plan;

use super::ViewPreset;
use super::camera::OrbitCamera;
use super::camera_glide::CameraGlide;
use super::card_templates::scene_template_members;
use super::command::{Command, Layout, shortcut_commands};
use super::derived::Derived;
use super::desktop_open::{desktop_opener, open_in_desktop};
use super::dialogs::{Answer, Dialog, PathPurpose, Pending, dialog_ui};
use super::document::Document;
use super::edit::{EditError, PlanEdit, wall_count};
use super::export::{
    CardChoice, ExportJob, ExportKind, ExportSpec, ExportWork, JobOutcome, PictureRequest, Pixels,
    parse_picture_side, with_extension,
};
use super::file_dialog::{
    choose_export_path, choose_plan_to_open, choose_plan_to_save, native_dialog_available,
    with_toml_extension,
};
use super::files::ConfigDir;
use super::framing_panel::{FramingPanelState, framing_panel_ui};
use super::history::History;
use super::joint_panel::{member_joints_ui, picked_joint_ui};
use super::joints::joint_at;
use super::menu::{MenuState, menu_bar_ui};
use super::pick::pick;
use super::plan_view::{PlanViewInput, PlanViewState, plan_view_ui};
use super::side_panel::side_panel_ui;
use super::toolbar::{ToolbarState, toolbar_ui};
use super::units::DisplayUnits;
use super::viewport::{JointMarks, Renderer, ViewStyle, viewport_ui};
use super::wall_list::{WallListState, wall_list_ui};

/// Seconds between autosaves while there are unsaved changes.
pub const AUTOSAVE_EVERY_S: f64 = 30.0;

/// How soon the window looks again for a drag's frame not yet arrived.
const FRAME_POLL: Duration = Duration::from_millis(5);

/// Text size of the window's ordinary words, in points: larger than
/// egui's default so the window reads at arm's length.
const BODY_SIZE: f32 = 16.0;

/// Which list the left panel shows.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub enum SideTab {
    /// The roof and the wall list.
    #[default]
    Walls,
    /// The framing settings.
    Framing,
    /// The picked member's numbers, the rafter tables and the colours.
    Numbers,
}

/// A message shown across the window until dismissed.
#[derive(Debug, Clone, PartialEq)]
pub enum Notice {
    /// Something failed: the user must know.
    Error(String),
    /// Something worth saying (a file was saved).
    Info(String),
    /// A file was written: the message, and the file to open.
    Written {
        /// What was written where.
        text: String,
        /// The file.
        path: PathBuf,
    },
}

/// Everything the window holds but the GL renderer.
pub struct AppState {
    /// The plan being edited and its file.
    pub document: Document,
    /// Earlier and later plans.
    pub history: History,
    /// What is worked out from the plan.
    pub derived: Derived,
    /// The 3D view's camera.
    pub camera: OrbitCamera,
    /// How the 3D view draws.
    pub style: ViewStyle,
    /// The label of the member picked in the 3D view.
    pub picked: Option<String>,
    /// The joint picked (an index into the scene's joints).
    pub picked_joint: Option<usize>,
    /// The camera on its way to a new aim.
    pub glide: Option<CameraGlide>,
    /// Whether the side panel is to scroll to the picked joint.
    scroll_to_joint: bool,
    /// The selected wall (global index).
    pub selected_wall: Option<usize>,
    /// The selected corner (the wall starting there).
    pub selected_corner: Option<usize>,
    /// How the middle of the window is shared.
    pub layout: Layout,
    /// How lengths are shown.
    pub units: DisplayUnits,
    /// Light or dark colours.
    pub theme: egui::Theme,
    /// What the left panel shows.
    pub side_tab: SideTab,
    /// The plan view's snapping and drag.
    pub plan_view: PlanViewState,
    /// Text typed into the wall list.
    pub wall_list: WallListState,
    /// Text typed into the framing settings.
    pub framing_panel: FramingPanelState,
    /// Dialogs waiting, the first in front.
    pub dialogs: Vec<Dialog>,
    /// The message across the window.
    pub notice: Option<Notice>,
    /// The folder of the window's own files; `None` keeps nothing (as for
    /// `--picture`).
    pub config: Option<ConfigDir>,
    /// The recent files, newest first, as last read from the config folder
    /// (read when they change, not every frame).
    recent: Vec<PathBuf>,
    /// Whether the desktop's file dialogs are used (else paths are typed).
    pub native_dialogs: bool,
    /// Files being written on their own threads.
    pub jobs: Vec<ExportJob>,
    /// A picture of the 3D view for the renderer to draw after this frame.
    pub picture_request: Option<PictureRequest>,
    /// The 3D view's size on screen in pixels, from the last frame.
    pub view_px: [u32; 2],
    /// The program that opens written files and folders.
    pub opener: String,
    /// Messages from the desktop's file opener, which may fail late.
    open_failures: (Sender<String>, Receiver<String>),
    commands: Vec<Command>,
    /// Set once the user has agreed to close.
    close_now: bool,
    close_allowed: bool,
    next_autosave_s: Option<f64>,
    autosaved: Option<Plan>,
    style_set: bool,
    /// The window title last sent, so it is only sent when it changes.
    title: String,
    /// Whether the last frame's commands moved a corner by a drag, whose
    /// frame is laid out on the framing thread.
    dragged_last_frame: bool,
    /// How many frames were drawn with the members of an earlier plan than
    /// the roof's, because the framing thread had not finished (for the
    /// frame-time run).
    pub frames_behind: u64,
}

impl AppState {
    /// The window's state on `document`, its own files in `config`. A
    /// leftover autosave is offered back; the safety cautions show at the
    /// first start.
    pub fn new(document: Document, config: Option<ConfigDir>, view: ViewPreset) -> Self {
        let derived = Derived::new(&document.plan);
        let camera = OrbitCamera::framing(derived.scene.min, derived.scene.max, view);
        let mut dialogs = Vec::new();
        if let Some(config) = &config {
            if let Some(leftover) = config.leftover_autosave(document.path.as_deref()) {
                dialogs.push(Dialog::Restore {
                    plan: Box::new(leftover.plan),
                    source: leftover.source,
                    autosave: leftover.autosave,
                });
            }
            if !config.safety_shown() {
                dialogs.push(Dialog::Safety);
                // Shown once: a failure to note it only means it shows again.
                let _ = config.mark_safety_shown();
            }
        }
        let recent = config.as_ref().map(ConfigDir::recent).unwrap_or_default();
        Self {
            units: DisplayUnits::for_plan_unit(document.plan.units),
            document,
            history: History::default(),
            derived,
            camera,
            style: ViewStyle::default(),
            picked: None,
            picked_joint: None,
            glide: None,
            scroll_to_joint: false,
            selected_wall: None,
            selected_corner: None,
            layout: Layout::default(),
            theme: egui::Theme::Light,
            side_tab: SideTab::default(),
            plan_view: PlanViewState::default(),
            wall_list: WallListState::default(),
            framing_panel: FramingPanelState::default(),
            dialogs,
            notice: None,
            config,
            recent,
            native_dialogs: native_dialog_available(),
            jobs: Vec::new(),
            picture_request: None,
            view_px: [1280, 800],
            opener: desktop_opener().to_owned(),
            open_failures: channel(),
            commands: Vec::new(),
            close_now: false,
            close_allowed: false,
            next_autosave_s: None,
            autosaved: None,
            style_set: false,
            title: String::new(),
            dragged_last_frame: false,
            frames_behind: 0,
        }
    }

    /// Queues a command as if the user had asked for it.
    pub fn push(&mut self, command: Command) {
        self.commands.push(command);
    }

    /// The index of the picked member's first piece in the scene.
    pub fn picked_piece(&self) -> Option<usize> {
        let label = self.picked.as_deref()?;
        self.derived.scene.pieces.iter().position(|piece| piece.label == label)
    }

    /// The joints marked in the 3D view: those of the picked member (in
    /// the framing view only).
    pub fn shown_joints(&self) -> Vec<usize> {
        let Some(label) = self.picked.as_deref().filter(|_| !self.style.client_view) else {
            return Vec::new();
        };
        let joints = self.derived.scene.joints().iter().enumerate();
        joints.filter(|(_, joint)| joint.involves(label)).map(|(index, _)| index).collect()
    }

    /// The whole window for one frame; the 3D view is drawn when a
    /// renderer is given, else a plain note stands in its place.
    pub fn ui(&mut self, ui: &mut egui::Ui, renderer: Option<&Arc<Mutex<Renderer>>>) {
        let ctx = ui.ctx().clone();
        if !self.style_set {
            self.style_set = true;
            set_style(&ctx, self.theme);
        }
        self.take_frame(&ctx);
        self.commands.extend(shortcut_commands(&ctx));
        if let Some(glide) = self.glide {
            let (camera, arrived) = glide.at(ctx.input(|input| input.time));
            self.camera = camera;
            if arrived {
                self.glide = None;
            } else {
                ctx.request_repaint();
            }
        }
        self.watch_close(&ctx);
        let unsaved_mark = if self.document.unsaved() { " (unsaved)" } else { "" };
        let title = format!("{}{unsaved_mark} - Pitchframe", self.document.title());
        if title != self.title {
            ctx.send_viewport_cmd(egui::ViewportCommand::Title(title.clone()));
            self.title = title;
        }

        let menu_state = MenuState {
            can_undo: self.history.can_undo(),
            can_redo: self.history.can_redo(),
            corner_selected: self.selected_corner.is_some(),
            picked: self.picked.is_some(),
            client_view: self.style.client_view,
            layout: self.layout,
            units: self.units,
            theme: self.theme,
            recent: self.recent.clone(),
        };
        egui::Panel::top("menu")
            .frame(bare_panel(ui))
            .show(ui, |ui| menu_bar_ui(ui, &menu_state, &mut self.commands));
        egui::Panel::top("toolbar").frame(bare_panel(ui)).show(ui, |ui| {
            let state = ToolbarState {
                picked: self.picked.is_some(),
                client_view: self.style.client_view,
                can_undo: self.history.can_undo(),
                can_redo: self.history.can_redo(),
                layout: self.layout,
            };
            toolbar_ui(ui, state, &mut self.commands);
        });
        self.poll_jobs(&ctx);
        if !self.jobs.is_empty() {
            egui::Panel::top("jobs").frame(bare_panel(ui)).show(ui, |ui| jobs_ui(ui, &self.jobs));
        }
        if let Some(notice) = self.notice.clone() {
            egui::Panel::top("notice")
                .frame(bare_panel(ui))
                .show(ui, |ui| notice_ui(ui, &notice, &mut self.notice, &mut self.commands));
        }
        egui::Panel::bottom("status").frame(bare_panel(ui)).show(ui, |ui| {
            let unsaved = if self.document.unsaved() { "  (unsaved changes)" } else { "" };
            ui.label(format!("{}{unsaved}", self.document.title()));
        });
        egui::Panel::left("lists").frame(bare_panel(ui)).default_size(440.0).show(ui, |ui| self.side_ui(ui));
        egui::CentralPanel::default()
            .frame(egui::Frame::central_panel(ui.style()).fill(egui::Color32::TRANSPARENT))
            .show(ui, |ui| self.middle_ui(ui, renderer));

        if let Some(dialog) = self.dialogs.first_mut()
            && let Some(answer) = dialog_ui(&ctx, dialog)
        {
            self.commands.push(Command::Answer(answer));
        }
        self.apply_commands(&ctx);
        self.autosave_when_due(&ctx);
        if self.close_now {
            ctx.send_viewport_cmd(egui::ViewportCommand::Close);
        }
    }

    /// Takes in a drag's frame from the framing thread. Once the drag has
    /// stopped moving the frame is waited for, so what stays on screen is
    /// the current plan's; until then the window draws on and looks again.
    fn take_frame(&mut self, ctx: &egui::Context) {
        if !self.derived.frame_pending() {
            return;
        }
        if std::mem::take(&mut self.dragged_last_frame) {
            self.derived.poll();
        } else {
            self.derived.settle();
        }
        if self.derived.frame_pending() {
            self.frames_behind += 1;
            ctx.request_repaint_after(FRAME_POLL);
        }
    }

    /// Waits for any drag's frame to arrive: printing and pictures are of
    /// the plan as it stands.
    pub fn settle(&mut self) {
        self.derived.settle();
    }

    fn side_ui(&mut self, ui: &mut egui::Ui) {
        ui.horizontal(|ui| {
            for (tab, label) in
                [(SideTab::Walls, "Walls"), (SideTab::Framing, "Framing"), (SideTab::Numbers, "Numbers")]
            {
                let text = egui::RichText::new(label).size(18.0);
                if ui.selectable_label(self.side_tab == tab, text).clicked() {
                    self.side_tab = tab;
                }
            }
        });
        ui.separator();
        match self.side_tab {
            SideTab::Walls => wall_list_ui(
                ui,
                &self.document.plan,
                &self.derived,
                self.units,
                self.selected_wall,
                &mut self.wall_list,
                &mut self.commands,
            ),
            SideTab::Framing => framing_panel_ui(
                ui,
                &self.document.plan,
                self.units,
                self.derived.scene.frame_error.as_deref().or(self.derived.settings_error.as_deref()),
                &mut self.framing_panel,
                &mut self.commands,
            ),
            SideTab::Numbers => {
                let picked = self.picked_piece().and_then(|index| self.derived.scene.pieces.get(index));
                let scene = Arc::clone(&self.derived.scene);
                let (units, picked_joint) = (self.units, self.picked_joint);
                let scroll = std::mem::take(&mut self.scroll_to_joint);
                let label = self.picked.clone();
                let commands = &mut self.commands;
                side_panel_ui(
                    ui,
                    &self.document,
                    &self.derived,
                    units,
                    picked,
                    |ui| picked_joint_ui(ui, &scene, units, picked_joint, scroll),
                    |ui| member_joints_ui(ui, &scene, units, label.as_deref(), picked_joint, commands),
                );
            }
        }
    }

    fn middle_ui(&mut self, ui: &mut egui::Ui, renderer: Option<&Arc<Mutex<Renderer>>>) {
        let rect = ui.available_rect_before_wrap();
        let (plan_rect, view_rect) = match self.layout {
            Layout::Both => {
                let (left, right) = rect.split_left_right_at_fraction(0.5);
                (Some(left.shrink2(egui::vec2(2.0, 0.0))), Some(right))
            }
            Layout::Plan => (Some(rect), None),
            Layout::ThreeD => (None, Some(rect)),
        };
        if let Some(plan_rect) = plan_rect {
            let mut plan_ui = ui.new_child(egui::UiBuilder::new().max_rect(plan_rect).id_salt("plan view"));
            plan_ui.set_clip_rect(plan_rect);
            let input = PlanViewInput {
                plan: &self.document.plan,
                derived: &self.derived,
                units: self.units,
                selected_wall: self.selected_wall,
                selected_corner: self.selected_corner,
                renderer,
            };
            plan_view_ui(&mut plan_ui, &input, &mut self.plan_view, &mut self.commands);
        }
        if let Some(view_rect) = view_rect {
            let pixels = |points: f32| (points * ui.ctx().pixels_per_point()).round().max(1.0) as u32;
            self.view_px = [pixels(view_rect.width()), pixels(view_rect.height())];
            let mut view_ui = ui.new_child(egui::UiBuilder::new().max_rect(view_rect).id_salt("3d view"));
            // The 3D view clears what its clip rect covers: keep it to its half.
            view_ui.set_clip_rect(view_rect);
            match renderer {
                Some(renderer) => {
                    let picked = self.picked_piece();
                    let scene = Arc::clone(&self.derived.scene);
                    let roof_scene = Arc::clone(self.derived.roof_scene());
                    let marks = JointMarks { shown: self.shown_joints(), picked: self.picked_joint };
                    let input = viewport_ui(
                        &mut view_ui,
                        renderer,
                        [&roof_scene, &scene],
                        &mut self.camera,
                        self.style,
                        picked,
                        &marks,
                    );
                    if input.moved_camera {
                        // The user took the camera: stop gliding it.
                        self.glide = None;
                    }
                    // The client view hides the frame, so there is nothing to pick.
                    if let Some(at) = input.clicked_at.filter(|_| !self.style.client_view) {
                        self.commands.push(Command::PickAt { at, view_size: input.view_size });
                    }
                }
                None => {
                    view_ui.label("The 3D view draws here.");
                }
            }
        }
        ui.allocate_rect(rect, egui::Sense::hover());
    }

    /// Applies every command recorded this frame, in order.
    fn apply_commands(&mut self, ctx: &egui::Context) {
        if !self.commands.is_empty() {
            // The frame was drawn before these changes: draw the next one.
            ctx.request_repaint();
        }
        let mut commands = std::mem::take(&mut self.commands).into_iter().peekable();
        while let Some(command) = commands.next() {
            // A corner moved twice in one frame by the same drag lands
            // where the second move puts it: the roof is worked out once.
            if let (Command::Edit { edit: PlanEdit::MoveCorner { wall, .. }, group: Some(group) }, Some(next)) =
                (&command, commands.peek())
                && matches!(next, Command::Edit { edit: PlanEdit::MoveCorner { wall: w, .. }, group: Some(g) }
                    if w == wall && g == group)
            {
                continue;
            }
            self.apply(ctx, command);
        }
    }

    fn apply(&mut self, ctx: &egui::Context, command: Command) {
        match command {
            Command::New => self.unless_unsaved(Pending::New),
            Command::Open => self.unless_unsaved(Pending::Open),
            Command::OpenPath(path) => self.unless_unsaved(Pending::OpenPath(path)),
            Command::Save => self.save(None),
            Command::SaveAs => self.save_as(None),
            Command::Quit => ctx.send_viewport_cmd(egui::ViewportCommand::Close),
            Command::Undo => {
                if let Some(plan) = self.history.undo(&self.document.plan) {
                    self.replace_plan(plan);
                }
            }
            Command::Redo => {
                if let Some(plan) = self.history.redo(&self.document.plan) {
                    self.replace_plan(plan);
                }
            }
            Command::Edit { edit, group } => self.edit(&edit, group),
            Command::DeleteSelectedCorner => match self.selected_corner {
                Some(wall) => {
                    self.edit(&PlanEdit::DeleteCorner { wall }, None);
                    self.selected_corner = None;
                }
                None => self.notice = Some(Notice::Info("Click a corner in the plan first.".to_owned())),
            },
            Command::SelectWall(wall) => {
                self.selected_wall = wall;
                if wall.is_some() {
                    self.side_tab = SideTab::Walls;
                }
            }
            Command::SelectCorner(corner) => self.selected_corner = corner,
            Command::SetView(view) => {
                self.glide = None;
                self.camera.set_view(view);
            }
            Command::FocusPicked => {
                let piece = self.picked_piece().and_then(|index| self.derived.scene.pieces.get(index));
                if let Some((min, max)) = piece.and_then(|piece| piece.triangles.bounds()) {
                    self.glide = None;
                    self.camera.focus(min, max);
                }
            }
            Command::SetClientView(on) => self.style.client_view = on,
            Command::ToggleClientView => self.style.client_view = !self.style.client_view,
            Command::PickJoint(index) => self.pick_joint(ctx, index),
            Command::PickAt { at, view_size } => {
                let shown = self.shown_joints();
                if let Some(index) =
                    joint_at(self.derived.scene.joints(), &shown, &self.camera, at, view_size)
                {
                    self.pick_joint(ctx, index);
                    return;
                }
                self.picked_joint = None;
                let ray = self.camera.ray(at, view_size);
                let scene = &self.derived.scene;
                self.picked =
                    pick(scene, &ray).and_then(|hit| scene.pieces.get(hit.piece)).map(|p| p.label.clone());
                if self.picked.is_some() {
                    self.side_tab = SideTab::Numbers;
                }
            }
            Command::SetLayout(layout) => self.layout = layout,
            Command::SetUnits(units) => {
                self.units = units;
                self.wall_list.clear();
            }
            Command::SetTheme(theme) => {
                self.theme = theme;
                ctx.set_theme(theme);
            }
            Command::ShowSafety => self.dialogs.push(Dialog::Safety),
            Command::ShowKeys => self.dialogs.push(Dialog::Keys),
            Command::ShowAbout => self.dialogs.push(Dialog::About),
            Command::Answer(answer) => self.answer(answer),
            Command::Export(kind) => self.ask_export(kind),
            Command::OpenInDesktop(path) => {
                if let Err(message) = open_in_desktop(&self.opener, &path, self.open_failures.0.clone()) {
                    self.notice = Some(Notice::Error(message));
                }
            }
        }
    }

    /// Picks a joint: its cut member is picked too, and the camera glides
    /// in close on it.
    fn pick_joint(&mut self, ctx: &egui::Context, index: usize) {
        let Some(joint) = self.derived.scene.joints().get(index) else { return };
        self.picked_joint = Some(index);
        self.scroll_to_joint = true;
        self.picked = Some(joint.joint.members[0].clone());
        self.side_tab = SideTab::Numbers;
        let (min, max) = joint.view_box();
        let mut goal = self.camera;
        goal.focus(min, max);
        self.glide = Some(CameraGlide::new(self.camera, goal, ctx.input(|input| input.time)));
    }

    /// Acts on the answer to the dialog in front, and closes it.
    fn answer(&mut self, answer: Answer) {
        if self.dialogs.is_empty() {
            return;
        }
        let dialog = self.dialogs.remove(0);
        match (dialog, answer) {
            (Dialog::Unsaved(pending), Answer::Save) => self.save(Some(pending)),
            (Dialog::Unsaved(pending), Answer::Discard) => self.proceed(pending),
            (Dialog::Restore { plan, source, .. }, Answer::Restore) => {
                let document = Document::recovered(*plan, source);
                self.load(document);
            }
            (Dialog::Restore { source, .. }, Answer::Discard) => {
                if let Some(config) = &self.config {
                    config.clear_autosave(source.as_deref());
                }
            }
            (Dialog::CardOptions { choice: cards, .. }, Answer::Continue) => {
                let spec = ExportSpec { kind: ExportKind::Cards, cards, picture_px: self.view_px };
                self.choose_export_path(spec);
            }
            (Dialog::PictureSize { width, height, window_px, .. }, Answer::Continue) => {
                let size = parse_picture_side(&width, "width")
                    .and_then(|w| parse_picture_side(&height, "height").map(|h| [w, h]));
                match size {
                    Ok(picture_px) => {
                        let cards = CardChoice::for_plan(&self.document.plan);
                        self.choose_export_path(ExportSpec { kind: ExportKind::Picture, cards, picture_px });
                    }
                    Err(message) => self
                        .dialogs
                        .insert(0, Dialog::PictureSize { width, height, window_px, error: Some(message) }),
                }
            }
            (Dialog::TypePath { purpose, text, then }, Answer::PathTyped) => {
                let path = PathBuf::from(text.trim());
                match purpose {
                    PathPurpose::Export(spec) => {
                        let extension = spec.kind.extension();
                        self.start_export(spec, with_extension(path, extension));
                    }
                    PathPurpose::Open => {
                        self.open_path(&path);
                    }
                    PathPurpose::SaveAs => {
                        if self.save_to_path(&with_toml_extension(path))
                            && let Some(pending) = then
                        {
                            self.proceed(pending);
                        }
                    }
                }
            }
            _ => {}
        }
    }

    /// Does `pending` now, or first asks about unsaved changes.
    fn unless_unsaved(&mut self, pending: Pending) {
        if self.document.unsaved() {
            self.dialogs.insert(0, Dialog::Unsaved(pending));
        } else {
            self.proceed(pending);
        }
    }

    /// Does `pending`, unsaved changes or not.
    fn proceed(&mut self, pending: Pending) {
        match pending {
            Pending::New => match Document::new_plan() {
                Ok(document) => self.load(document),
                Err(err) => self.notice = Some(Notice::Error(format!("{err:#}"))),
            },
            Pending::Open => {
                if self.native_dialogs {
                    if let Some(path) = choose_plan_to_open(self.document.path.as_deref()) {
                        self.open_path(&path);
                    }
                } else {
                    self.dialogs.insert(
                        0,
                        Dialog::TypePath { purpose: PathPurpose::Open, text: String::new(), then: None },
                    );
                }
            }
            Pending::OpenPath(path) => {
                self.open_path(&path);
            }
            Pending::Quit => {
                self.close_allowed = true;
                self.close_now = true;
                if let Some(config) = &self.config {
                    config.clear_autosave(self.document.path.as_deref());
                }
            }
        }
    }

    /// Saves to the plan's file, or asks for one; then does `then`.
    fn save(&mut self, then: Option<Pending>) {
        match self.document.path.clone() {
            Some(path) => {
                if self.save_to_path(&path)
                    && let Some(pending) = then
                {
                    self.proceed(pending);
                }
            }
            None => self.save_as(then),
        }
    }

    /// Asks for a file and saves there; then does `then`.
    fn save_as(&mut self, then: Option<Pending>) {
        if !self.native_dialogs {
            let text = self.document.path.as_ref().map(|p| p.display().to_string()).unwrap_or_default();
            self.dialogs.insert(0, Dialog::TypePath { purpose: PathPurpose::SaveAs, text, then });
            return;
        }
        let name = format!("{}.toml", self.document.title().trim_end_matches(".toml"));
        if let Some(path) = choose_plan_to_save(self.document.path.as_deref(), &name)
            && self.save_to_path(&path)
            && let Some(pending) = then
        {
            self.proceed(pending);
        }
    }

    /// Saves the plan to `path`; says in the window whether it worked.
    pub fn save_to_path(&mut self, path: &Path) -> bool {
        let before = self.document.path.clone();
        match self.document.save_to(path) {
            Ok(()) => {
                if let Some(config) = &self.config {
                    // The work is in its file: the autosave it was kept in
                    // (beside the old file, or untitled) is done with.
                    config.clear_autosave(before.as_deref());
                    config.clear_autosave(Some(path));
                    let _ = config.add_recent(path);
                    self.recent = config.recent();
                }
                self.autosaved = None;
                self.notice = Some(Notice::Info(format!("Saved {}", path.display())));
                true
            }
            Err(err) => {
                self.notice = Some(Notice::Error(format!("The plan was not saved: {err:#}")));
                false
            }
        }
    }

    /// Opens the plan at `path` in place of the current one; says in the
    /// window if it cannot be read.
    pub fn open_path(&mut self, path: &Path) -> bool {
        match Document::open(path) {
            Ok(document) => {
                if let Some(config) = &self.config {
                    let _ = config.add_recent(path);
                    self.recent = config.recent();
                }
                self.load(document);
                self.notice = None;
                true
            }
            Err(err) => {
                self.notice = Some(Notice::Error(format!("{err:#}")));
                false
            }
        }
    }

    /// Puts `document` in place of the current one, with a fresh history.
    fn load(&mut self, document: Document) {
        self.units = DisplayUnits::for_plan_unit(document.plan.units);
        self.document = document;
        self.history.clear();
        self.derived = Derived::new(&self.document.plan);
        self.camera =
            OrbitCamera::framing(self.derived.scene.min, self.derived.scene.max, ViewPreset::Corner);
        self.picked = None;
        self.picked_joint = None;
        self.glide = None;
        self.selected_wall = None;
        self.selected_corner = None;
        self.wall_list.clear();
        self.framing_panel.clear();
        self.autosaved = None;
    }

    /// Makes `edit`, recording the plan before it for undo. A framing
    /// setting the frame cannot be laid out with is turned away, so the
    /// frame on screen and the plan stay as they were.
    fn edit(&mut self, edit: &PlanEdit, group: Option<u64>) {
        let field = match edit {
            PlanEdit::SetFraming { field, .. } => Some(*field),
            _ => None,
        };
        let rejected = |state: &mut Self, err: EditError| {
            let message = err.to_string();
            if let EditError::FramingRejected { field, .. } = &err {
                state.framing_panel.reject(*field, message.clone());
            }
            state.notice = Some(Notice::Error(message));
        };
        match edit.apply(&self.document.plan) {
            Ok(plan) if plan == self.document.plan => {
                if let Some(field) = field {
                    self.framing_panel.accept(field);
                }
            }
            Ok(plan) => {
                let Some(field) = field else {
                    self.history.record(&self.document.plan, group);
                    if matches!(edit, PlanEdit::MoveCorner { .. }) && group.is_some() {
                        self.set_plan_live(plan);
                    } else {
                        self.set_plan(plan);
                    }
                    return;
                };
                // A framing setting is tried on the plan as it stands.
                self.derived.settle();
                let mut trial = self.derived.clone();
                trial.update(&plan);
                let failed_now =
                    trial.scene.frame_error.clone().filter(|_| self.derived.scene.frame_error.is_none());
                if let Some(reason) = failed_now {
                    rejected(self, EditError::FramingRejected { field, reason });
                    return;
                }
                self.framing_panel.accept(field);
                self.history.record(&self.document.plan, group);
                self.derived = trial;
                self.set_plan_worked_out(plan);
            }
            Err(err) => rejected(self, err),
        }
    }

    /// A plan from undo or redo: typed text no longer matches it.
    fn replace_plan(&mut self, plan: Plan) {
        self.wall_list.clear();
        self.framing_panel.clear();
        self.set_plan(plan);
    }

    fn set_plan(&mut self, plan: Plan) {
        let had_nothing = self.derived.scene.parts.is_empty();
        self.derived.update(&plan);
        self.after_new_plan(plan, had_nothing);
    }

    /// A plan from a drag: its roof is shown at once and its frame as soon
    /// as the framing thread has laid it out.
    fn set_plan_live(&mut self, plan: Plan) {
        let had_nothing = self.derived.roof_scene().parts.is_empty();
        self.derived.update_live(&plan);
        self.dragged_last_frame = true;
        self.after_new_plan(plan, had_nothing);
    }

    /// A plan whose derived state is already in `self.derived`.
    fn set_plan_worked_out(&mut self, plan: Plan) {
        self.after_new_plan(plan, false);
    }

    fn after_new_plan(&mut self, plan: Plan, had_nothing: bool) {
        self.document.plan = plan;
        // The joints are numbered afresh with the new frame.
        self.picked_joint = None;
        let shown = self.derived.roof_scene();
        if had_nothing && !shown.parts.is_empty() {
            // A plan opened invalid has just been fixed: aim at the house.
            self.camera = OrbitCamera::framing(shown.min, shown.max, ViewPreset::Corner);
        }
        let walls = wall_count(&self.document.plan);
        self.selected_wall = self.selected_wall.filter(|&wall| wall < walls);
        self.selected_corner = self.selected_corner.filter(|&wall| wall < walls);
    }

    /// Starts an export: the cards ask for paper first, a picture for its
    /// size; the rest go straight to asking where.
    fn ask_export(&mut self, kind: ExportKind) {
        self.settle();
        if kind.needs_frame() {
            let reason = match (
                &self.derived.problem,
                &self.derived.settings_error,
                &self.derived.scene.frame_error,
            ) {
                (Some(problem), _, _) => Some(problem.message.clone()),
                (None, Some(error), _) | (None, None, Some(error)) => Some(error.clone()),
                (None, None, None) => None,
            };
            if let Some(reason) = reason {
                self.notice = Some(Notice::Error(format!(
                    "The {} cannot be made until the plan frames: {reason}",
                    kind.noun()
                )));
                return;
            }
        }
        let cards = CardChoice::for_plan(&self.document.plan);
        match kind {
            ExportKind::Cards => {
                let members = scene_template_members(&self.document.plan, &self.derived.scene);
                self.dialogs.insert(0, Dialog::CardOptions { choice: cards, members });
            }
            ExportKind::Picture => self.dialogs.insert(
                0,
                Dialog::PictureSize {
                    width: self.view_px[0].to_string(),
                    height: self.view_px[1].to_string(),
                    window_px: self.view_px,
                    error: None,
                },
            ),
            _ => self.choose_export_path(ExportSpec { kind, cards, picture_px: self.view_px }),
        }
    }

    /// Asks where the file goes (the desktop's dialog, or a typed path).
    fn choose_export_path(&mut self, spec: ExportSpec) {
        let name = spec.kind.file_name(&self.document.title());
        let near = self.document.path.as_deref();
        if self.native_dialogs {
            if let Some(path) = choose_export_path(spec.kind, near, &name) {
                self.start_export(spec, path);
            }
            return;
        }
        let folder = near
            .and_then(Path::parent)
            .filter(|dir| !dir.as_os_str().is_empty())
            .map(Path::to_path_buf)
            .or_else(|| std::env::current_dir().ok())
            .unwrap_or_default();
        let text = folder.join(name).display().to_string();
        self.dialogs.insert(0, Dialog::TypePath { purpose: PathPurpose::Export(spec), text, then: None });
    }

    /// Starts writing the file at `path` on its own thread (a picture waits
    /// for the renderer to draw it after this frame).
    fn start_export(&mut self, spec: ExportSpec, path: PathBuf) {
        if spec.kind == ExportKind::Picture {
            self.picture_request = Some(PictureRequest { path, size_px: spec.picture_px });
            return;
        }
        let work = ExportWork::FromPlan {
            kind: spec.kind,
            plan: Box::new(self.document.plan.clone()),
            title: self.document.title().trim_end_matches(".toml").to_owned(),
            cards: spec.cards,
        };
        self.jobs.push(ExportJob::start(work, path));
    }

    /// Hands the picture the renderer drew to a thread that writes it.
    pub fn write_picture(&mut self, path: PathBuf, pixels: Result<Pixels, String>) {
        match pixels {
            Ok(pixels) => self.jobs.push(ExportJob::start(ExportWork::Picture(pixels), path)),
            Err(reason) => {
                self.notice = Some(Notice::Error(format!(
                    "The picture was not written to {}: {reason}",
                    path.display()
                )));
            }
        }
    }

    /// Collects the jobs that have ended and says how each went.
    fn poll_jobs(&mut self, ctx: &egui::Context) {
        let mut running = Vec::new();
        for job in std::mem::take(&mut self.jobs) {
            match job.poll() {
                None => running.push(job),
                Some(JobOutcome::Written(summary)) => {
                    self.notice = Some(Notice::Written {
                        text: format!("Wrote the {} ({summary}) to {}", job.kind.noun(), job.path.display()),
                        path: job.path,
                    });
                }
                Some(JobOutcome::Failed(reason)) => {
                    self.notice = Some(Notice::Error(format!(
                        "The {} was not written to {}: {reason}",
                        job.kind.noun(),
                        job.path.display()
                    )));
                }
            }
        }
        self.jobs = running;
        if let Ok(message) = self.open_failures.1.try_recv() {
            self.notice = Some(Notice::Error(message));
        }
        if !self.jobs.is_empty() {
            // Nothing else wakes the window when a job ends.
            ctx.request_repaint_after(Duration::from_millis(100));
        }
    }

    /// Asks first when the window is closed with unsaved changes.
    fn watch_close(&mut self, ctx: &egui::Context) {
        if !ctx.input(|input| input.viewport().close_requested()) {
            return;
        }
        if self.document.unsaved() && !self.close_allowed {
            ctx.send_viewport_cmd(egui::ViewportCommand::CancelClose);
            if !self.dialogs.iter().any(|dialog| matches!(dialog, Dialog::Unsaved(_))) {
                self.dialogs.insert(0, Dialog::Unsaved(Pending::Quit));
            }
        } else if let Some(config) = self.config.as_ref().filter(|_| !self.document.unsaved()) {
            // Closing with everything saved: no autosave is needed.
            config.clear_autosave(self.document.path.as_deref());
        }
    }

    /// Writes the autosave every half minute while there are unsaved changes.
    fn autosave_when_due(&mut self, ctx: &egui::Context) {
        if self.config.is_none() || !self.document.unsaved() {
            self.next_autosave_s = None;
            return;
        }
        let now = ctx.input(|input| input.time);
        let due = *self.next_autosave_s.get_or_insert(now + AUTOSAVE_EVERY_S);
        if now >= due {
            self.autosave_now();
            self.next_autosave_s = Some(now + AUTOSAVE_EVERY_S);
        }
        let wait = (self.next_autosave_s.unwrap_or(now) - now).max(0.1);
        ctx.request_repaint_after(Duration::from_secs_f64(wait));
    }

    /// Writes the autosave now, unless this plan is already in it.
    pub fn autosave_now(&mut self) {
        let Some(config) = &self.config else { return };
        if self.autosaved.as_ref() == Some(&self.document.plan) {
            return;
        }
        match config.write_autosave(&self.document.plan, self.document.path.as_deref()) {
            Ok(()) => self.autosaved = Some(self.document.plan.clone()),
            Err(err) => self.notice = Some(Notice::Error(format!("The autosave failed: {err:#}"))),
        }
    }
}

/// The message across the top of the window, with a button to dismiss it
/// (and, for a written file, buttons to open it or its folder).
fn notice_ui(ui: &mut egui::Ui, notice: &Notice, slot: &mut Option<Notice>, commands: &mut Vec<Command>) {
    ui.horizontal_wrapped(|ui| {
        let (text, colour) = match notice {
            Notice::Error(text) => (text.as_str(), egui::Color32::from_rgb(220, 30, 30)),
            Notice::Info(text) | Notice::Written { text, .. } => {
                (text.as_str(), ui.visuals().strong_text_color())
            }
        };
        if ui.button("Dismiss").clicked() {
            *slot = None;
        }
        if let Notice::Written { path, .. } = notice {
            if ui.button("Open file").clicked() {
                commands.push(Command::OpenInDesktop(path.clone()));
            }
            let folder = path.parent().filter(|dir| !dir.as_os_str().is_empty());
            if let Some(folder) = folder
                && ui.button("Open folder").clicked()
            {
                commands.push(Command::OpenInDesktop(folder.to_path_buf()));
            }
        }
        ui.label(egui::RichText::new(text).color(colour).strong().size(18.0));
    });
}

/// The files being written, each with a progress bar (or a spinner where
/// the job cannot tell how far it is) and the seconds so far.
fn jobs_ui(ui: &mut egui::Ui, jobs: &[ExportJob]) {
    for job in jobs {
        ui.horizontal(|ui| {
            match job.fraction() {
                Some(fraction) => {
                    ui.add(egui::ProgressBar::new(fraction).desired_width(160.0).show_percentage());
                }
                None => {
                    ui.add(egui::Spinner::new().size(20.0));
                }
            }
            let seconds = job.started.elapsed().as_secs();
            let text = format!("Writing the {} to {}… {seconds} s", job.kind.noun(), job.path.display());
            ui.label(egui::RichText::new(text).size(18.0));
        });
    }
}

/// A panel's usual frame without its fill: the window is cleared to the
/// panels' colour before egui draws (see `PitchframeApp::clear_color`),
/// and software OpenGL pays for every pixel filled again: with every panel
/// filling its own background, nearly half the rasterizer's time on a
/// still frame.
fn bare_panel(ui: &egui::Ui) -> egui::Frame {
    egui::Frame::side_top_panel(ui.style()).fill(egui::Color32::TRANSPARENT)
}

/// Larger text and buttons than egui's defaults, for reading at arm's
/// length and hitting with a thumb.
fn set_style(ctx: &egui::Context, theme: egui::Theme) {
    ctx.set_theme(theme);
    ctx.all_styles_mut(|style| {
        use egui::{FontId, TextStyle};
        style.text_styles.insert(TextStyle::Body, FontId::proportional(BODY_SIZE));
        style.text_styles.insert(TextStyle::Button, FontId::proportional(BODY_SIZE));
        style.text_styles.insert(TextStyle::Monospace, FontId::monospace(BODY_SIZE - 1.0));
        style.text_styles.insert(TextStyle::Heading, FontId::proportional(22.0));
        style.text_styles.insert(TextStyle::Small, FontId::proportional(13.0));
        style.spacing.interact_size.y = 26.0;
        style.spacing.button_padding = egui::vec2(8.0, 4.0);
        style.spacing.item_spacing = egui::vec2(8.0, 6.0);
    });
}
