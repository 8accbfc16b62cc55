//! The eframe app: the state, the GL renderer made once for the window,
//! the `--picture` job, and pictures of the 3D view drawn off screen.

use std::sync::{Arc, Mutex};

use anyhow::Context as _;

use super::app::{AppState, SideTab};
use super::command::{Command, Layout};
use super::frame_timer::FrameTimer;
use super::picture::PictureJob;
use super::view_picture_run::ViewPictureRun;
use super::viewport::Renderer;

/// The running window.
pub struct PitchframeApp {
    state: AppState,
    renderer: Arc<Mutex<Renderer>>,
    picture: Option<PictureJob>,
    frame_timer: Option<FrameTimer>,
    view_picture: Option<ViewPictureRun>,
}

impl PitchframeApp {
    /// Sets up the app on the window's GL context. `pick_label` picks a
    /// member as if it had been clicked.
    pub fn new(
        gl: Arc<three_d::context::Context>,
        mut state: AppState,
        picture: Option<PictureJob>,
        pick_label: Option<&str>,
    ) -> anyhow::Result<Self> {
        let renderer = Renderer::new(gl).context("three-d could not use the window's GL context")?;
        if picture.is_some() {
            // A picture is of the 3D view.
            state.layout = Layout::ThreeD;
        }
        if let Some(label) = pick_label {
            state.picked = Some(label.to_owned());
            state.side_tab = SideTab::Numbers;
            // Opening on a pick (as tests do) shows it close up.
            state.push(Command::FocusPicked);
        }
        let frame_timer = FrameTimer::from_env();
        let view_picture = ViewPictureRun::from_env();
        Ok(Self { state, renderer: Arc::new(Mutex::new(renderer)), picture, frame_timer, view_picture })
    }
}

impl eframe::App for PitchframeApp {
    /// The panels' own colour: they draw no background of their own.
    fn clear_color(&self, visuals: &egui::Visuals) -> [f32; 4] {
        visuals.panel_fill.to_normalized_gamma_f32()
    }

    fn ui(&mut self, ui: &mut egui::Ui, _frame: &mut eframe::Frame) {
        let ctx = ui.ctx().clone();
        if let Some(timer) = &mut self.frame_timer {
            timer.on_frame(&mut self.state, &ctx);
        }
        self.state.ui(ui, Some(&self.renderer));
        if let Some(run) = &mut self.view_picture {
            run.on_frame(&mut self.state, &ctx);
        }
        if let Some(request) = self.state.picture_request.take() {
            self.state.settle();
            // The window's GL context is current while the frame is built.
            let pixels = match self.renderer.lock() {
                Ok(mut renderer) => {
                    let scene = Arc::clone(&self.state.derived.scene);
                    let picked = self.state.picked_piece();
                    renderer.picture(&scene, &self.state.camera, self.state.style, picked, request.size_px)
                }
                Err(_) => Err("the 3D view failed earlier and cannot draw".to_owned()),
            };
            self.state.write_picture(request.path, pixels);
        }
        if let Some(picture) = &mut self.picture {
            picture.on_frame(&ctx);
        }
    }
}
