//! The app: the document, what is derived from it, and the commands that
//! change either.

use std::sync::{Arc, Mutex};

use std::path::Path;

use anyhow::Context as _;
use pitchframe_geometry::{Outline, Plan, demo_plan};

use super::ViewPreset;
use super::camera::OrbitCamera;
use super::command::Command;
use super::pick::pick;
use super::picture::PictureJob;
use super::scene::Scene;
use super::side_panel::side_panel_ui;
use super::toolbar::{shortcuts, toolbar_ui};
use super::viewport::{Renderer, ViewStyle, viewport_ui};

/// Floor to the top of the top plate, in inches: the plan gives heights
/// from the wall line, so the walls are drawn at a usual 8 ft.
const WALL_HEIGHT_IN: f64 = 96.0;
/// Wall thickness drawn, in inches: a 2x6 stud wall with sheathing.
const WALL_THICKNESS_IN: f64 = 6.0;

/// What the user edits; everything drawn is derived from it.
#[derive(Debug, Clone, PartialEq)]
pub struct Document {
    /// What the side panel calls the plan (its file name, or the demo).
    pub title: String,
    /// The plan as read.
    pub plan: Plan,
    /// The plan's outline, checked once when the plan was opened.
    pub outline: Outline,
    /// Floor to the top of the top plate, in inches.
    pub wall_height_in: f64,
    /// Wall thickness, in inches.
    pub wall_thickness_in: f64,
}

impl Document {
    /// The built-in demo house.
    pub fn demo() -> anyhow::Result<Self> {
        Self::from_plan("Demo house".to_owned(), demo_plan().context("the built-in demo plan")?)
    }

    /// Reads the plan file at `path`.
    pub fn open(path: &Path) -> anyhow::Result<Self> {
        let text =
            std::fs::read_to_string(path).with_context(|| format!("cannot read {}", path.display()))?;
        let plan = Plan::from_toml(&text).with_context(|| format!("cannot open {}", path.display()))?;
        let title = path
            .file_name()
            .map_or_else(|| path.display().to_string(), |name| name.to_string_lossy().into_owned());
        Self::from_plan(title, plan).with_context(|| format!("cannot open {}", path.display()))
    }

    fn from_plan(title: String, plan: Plan) -> anyhow::Result<Self> {
        let outline = plan.outline()?;
        Ok(Self {
            title,
            plan,
            outline,
            wall_height_in: WALL_HEIGHT_IN,
            wall_thickness_in: WALL_THICKNESS_IN,
        })
    }
}

/// What the user has picked in the 3D view.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Selection {
    /// Index into the scene's framing pieces.
    pub piece: usize,
}

/// The running window.
pub struct PitchframeApp {
    document: Document,
    scene: Arc<Scene>,
    camera: OrbitCamera,
    renderer: Arc<Mutex<Renderer>>,
    picture: Option<PictureJob>,
    selection: Option<Selection>,
    style: ViewStyle,
    commands: Vec<Command>,
}

impl PitchframeApp {
    /// Sets up the app on the window's GL context.
    pub fn new(
        gl: Arc<three_d::context::Context>,
        document: Document,
        view: ViewPreset,
        picture: Option<PictureJob>,
        pick_label: Option<&str>,
    ) -> anyhow::Result<Self> {
        let renderer = Renderer::new(gl).context("three-d could not use the window's GL context")?;
        let scene = Arc::new(scene_for(&document));
        let selection = pick_label
            .and_then(|label| scene.pieces.iter().position(|piece| piece.label == label))
            .map(|piece| Selection { piece });
        let camera = OrbitCamera::framing(scene.min, scene.max, view);
        Ok(Self {
            document,
            scene,
            camera,
            renderer: Arc::new(Mutex::new(renderer)),
            picture,
            selection,
            style: ViewStyle::default(),
            // Opening on a pick (as tests do) shows it close up.
            commands: selection.map(|_| Command::FocusPicked).into_iter().collect(),
        })
    }

    fn apply_commands(&mut self) {
        for command in std::mem::take(&mut self.commands) {
            match command {
                Command::SetView(view) => self.camera.set_view(view),
                Command::SetClientView(on) => self.style.client_view = on,
                Command::FocusPicked => {
                    let picked = self.selection.and_then(|selection| self.scene.pieces.get(selection.piece));
                    if let Some((min, max)) = picked.and_then(|piece| piece.triangles.bounds()) {
                        self.camera.focus(min, max);
                    }
                }
                Command::PickAt { at, view_size } => {
                    let ray = self.camera.ray(at, view_size);
                    self.selection = pick(&self.scene, &ray).map(|hit| Selection { piece: hit.piece });
                }
            }
        }
    }
}

/// Everything drawn, derived from the document.
pub fn scene_for(document: &Document) -> Scene {
    Scene::build(&document.outline, document.wall_height_in, document.wall_thickness_in)
}

impl eframe::App for PitchframeApp {
    fn ui(&mut self, ui: &mut egui::Ui, _frame: &mut eframe::Frame) {
        let ctx = ui.ctx().clone();
        shortcuts(&ctx, self.style.client_view, &mut self.commands);
        egui::Panel::top("toolbar").show(ui, |ui| {
            toolbar_ui(ui, self.selection.is_some(), self.style.client_view, &mut self.commands);
        });
        egui::Panel::left("numbers").default_size(280.0).show(ui, |ui| {
            let selected = self.selection.and_then(|selection| self.scene.pieces.get(selection.piece));
            side_panel_ui(ui, &self.document, &self.scene, selected);
        });
        egui::CentralPanel::no_frame().show(ui, |ui| {
            let input = viewport_ui(
                ui,
                &self.renderer,
                &self.scene,
                &mut self.camera,
                self.style,
                self.selection.map(|selection| selection.piece),
            );
            // The client view hides the frame, so there is nothing to pick.
            if let Some(at) = input.clicked_at.filter(|_| !self.style.client_view) {
                self.commands.push(Command::PickAt { at, view_size: input.view_size });
            }
        });
        self.apply_commands();
        if let Some(picture) = &mut self.picture {
            picture.on_frame(&ctx);
        }
    }
}
