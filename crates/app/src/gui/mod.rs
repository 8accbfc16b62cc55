//! The desktop window: the plan a framer edits, the 3D view of the house
//! and its roof frame, and the numbers a framer reads beside them.
//!
//! Layout of this module: `document` is the plan being edited, `history`
//! its undo stack, `edit` the changes a user can make to it and `derived`
//! everything worked out from it (through the geometry crate; the window
//! computes no geometry of its own; while a corner is dragged, `framer`
//! lays the frame out on a thread of its own, and `retire` frees old
//! scenes on another). `app` holds all of that with the
//! window's settings and applies the commands (`command`) that the menus
//! (`menu`), the toolbar, the keys, the plan view (`plan_view`, with
//! `snap`), the wall list (`wall_list`) and the dialogs (`dialogs`) record.
//! `files` keeps saves, recent files and the autosave; `file_dialog` asks
//! the desktop for file names. `camera` is the orbit camera (plain f64
//! maths, no GL), `scene` turns the geometry into triangle lists,
//! `viewport` draws those with three-d inside an egui paint callback,
//! `side_panel` shows the numbers, `window` is the eframe app holding the
//! GL renderer, and `picture` saves a screenshot for `--picture`.
//! `framing_panel` edits the plan's `[framing]` settings. `joints` places the frame's joints in the 3D view (the fit is the
//! geometry crate's check), `joint_panel` shows them, and `camera_glide`
//! closes the camera in on a picked one. `export` writes the cut cards (`card_templates` offers the members
//! whose ends can be printed full size), lists, model and pictures of the view on
//! threads of their own; `desktop_open` opens what was written, and
//! `view_picture_run` makes a picture of the view without a person (for
//! the window tests).

mod app;
mod camera;
mod camera_glide;
mod card_templates;
mod choice_button;
mod command;
mod derived;
mod desktop_open;
mod dialogs;
mod document;
mod edit;
mod export;
mod file_dialog;
mod files;
mod frame_timer;
mod framer;
mod framing_panel;
mod history;
mod joint_panel;
mod joints;
mod menu;
mod palette;
mod pick;
mod picture;
mod plan_view;
mod retire;
mod safety;
mod scene;
mod shading;
mod side_panel;
mod snap;
mod toolbar;
mod triangles;
mod triangulate;
mod typed_field;
mod units;
mod view_picture_run;
mod viewport;
mod wall_list;
mod walls;
mod window;
#[cfg(test)]
mod window_tests;

use std::path::PathBuf;
use std::sync::{Arc, Mutex};

use anyhow::{Context as _, anyhow};

use app::AppState;
use document::Document;
use files::ConfigDir;
use picture::PictureJob;
use window::PitchframeApp;

/// What the window is asked to do when it starts.
#[derive(Debug, Clone, Default)]
pub struct GuiOptions {
    /// The plan file to open; the built-in demo house when `None`.
    pub plan_path: Option<PathBuf>,
    /// Save a PNG of the first full frame here, then exit.
    pub picture: Option<PathBuf>,
    /// The camera direction the window opens with.
    pub view: ViewPreset,
}

/// A preset camera direction for the 3D view.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default, clap::ValueEnum)]
pub enum ViewPreset {
    /// From above a front corner, looking down at the house.
    #[default]
    Corner,
    /// Straight down on the plan.
    Top,
    /// From the front (the low-Y side of the plan).
    Front,
    /// From the back (the high-Y side of the plan).
    Back,
    /// From the left (the low-X side of the plan).
    Left,
    /// From the right (the high-X side of the plan).
    Right,
}

impl ViewPreset {
    /// Every preset, in toolbar order.
    pub const ALL: [ViewPreset; 6] = [
        ViewPreset::Corner,
        ViewPreset::Top,
        ViewPreset::Front,
        ViewPreset::Back,
        ViewPreset::Left,
        ViewPreset::Right,
    ];

    /// The preset's name on its toolbar button.
    pub fn label(self) -> &'static str {
        match self {
            ViewPreset::Corner => "Corner",
            ViewPreset::Top => "Top",
            ViewPreset::Front => "Front",
            ViewPreset::Back => "Back",
            ViewPreset::Left => "Left",
            ViewPreset::Right => "Right",
        }
    }
}

/// Environment variable naming a member label to pick when the window
/// opens, as if it had been clicked.
pub const PICK_VARIABLE: &str = "PITCHFRAME_PICK";

/// The start of the message shown when no OpenGL context can be made.
const NO_GL_MESSAGE: &str = "Pitchframe needs OpenGL 3.3 or software OpenGL (Mesa llvmpipe); \
                             could not create a GL context";

/// Opens the Pitchframe window and runs it until it is closed (or, with
/// `picture`, until the picture is saved).
pub fn run(options: GuiOptions) -> anyhow::Result<()> {
    // A plan that cannot be read is the user's to fix: say so before any
    // window opens.
    let document = match &options.plan_path {
        Some(path) => Document::open(path)?,
        None => Document::demo()?,
    };
    // A picture keeps no files of the window's own: no recent files, no
    // autosave, no first-start dialog in front of the view.
    let config = if options.picture.is_some() { None } else { ConfigDir::from_env() };
    let picture = options.picture.clone().map(PictureJob::new);
    let picture_outcome = picture.as_ref().map(PictureJob::outcome);

    let native_options = eframe::NativeOptions {
        viewport: egui::ViewportBuilder::default().with_title("Pitchframe").with_inner_size([1200.0, 760.0]),
        renderer: eframe::Renderer::Glow,
        // The 3D view needs a depth buffer; egui alone draws without one.
        depth_buffer: 24,
        // Dithering hides banding in gradients, which the window has none
        // of; software OpenGL pays for it on every pixel of every frame
        // (about a sixth of the drawing time, measured with the frame-time run).
        dithering: false,
        ..Default::default()
    };

    // The app creator cannot hand back a typed error, so a missing GL
    // context is recorded here and reported after the event loop ends.
    let gl_failure: Arc<Mutex<Option<String>>> = Arc::default();
    let gl_failure_in_creator = Arc::clone(&gl_failure);
    let view = options.view;
    // Tests pick a member by label this way, since a click needs a person
    // (or a pointer robot) at the right place on the screen.
    let pick_label = std::env::var(PICK_VARIABLE).ok().filter(|label| !label.is_empty());
    let result = eframe::run_native(
        "Pitchframe",
        native_options,
        Box::new(move |cc| {
            let Some(gl) = cc.gl.clone() else {
                let reason = "the window has no OpenGL context".to_owned();
                record(&gl_failure_in_creator, reason.clone());
                return Err(reason.into());
            };
            let state = AppState::new(document, config, view);
            match PitchframeApp::new(gl, state, picture, pick_label.as_deref()) {
                Ok(app) => Ok(Box::new(app)),
                Err(err) => {
                    record(&gl_failure_in_creator, format!("{err:#}"));
                    Err(err.into())
                }
            }
        }),
    );

    if let Some(reason) = gl_failure.lock().ok().and_then(|mut slot| slot.take()) {
        return Err(anyhow!("{NO_GL_MESSAGE}: {reason}"));
    }
    // Every error eframe returns before the first frame is about making the
    // window or its GL context.
    result.map_err(|err| anyhow!("{NO_GL_MESSAGE}: {err}"))?;
    if let Some(outcome) = picture_outcome {
        outcome.finish().context("the picture was not saved")?;
    }
    Ok(())
}

/// Keeps the first failure reason; later ones add nothing.
fn record(slot: &Mutex<Option<String>>, reason: String) {
    if let Ok(mut slot) = slot.lock() {
        slot.get_or_insert(reason);
    }
}
