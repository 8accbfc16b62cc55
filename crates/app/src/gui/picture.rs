//! `--picture`: save a PNG of the first full frame, then close the window.

use std::path::{Path, PathBuf};
use std::sync::{Arc, Mutex};

use anyhow::{Context as _, anyhow};

/// Frames drawn before the screenshot is asked for: egui lays out panels
/// from the previous frame's sizes, so the first frame can be off.
const SETTLE_FRAMES: u64 = 3;
/// Frames after which a screenshot that never arrived counts as failed.
const GIVE_UP_FRAMES: u64 = 600;

/// Where the picture job stands, shared with the screenshot callback.
type Outcome = Arc<Mutex<Option<anyhow::Result<()>>>>;

/// A request to save one screenshot and exit.
pub struct PictureJob {
    path: PathBuf,
    requested: bool,
    outcome: Outcome,
}

/// The result of a picture job, read after the window has closed.
pub struct PictureOutcome(Outcome);

impl PictureOutcome {
    /// Whether the picture was saved; an error if not, or if the window
    /// closed before it was taken.
    pub fn finish(self) -> anyhow::Result<()> {
        let taken = self.0.lock().map_err(|_| anyhow!("the screenshot callback panicked"))?.take();
        taken.unwrap_or_else(|| Err(anyhow!("the window closed before the screenshot was taken")))
    }
}

impl PictureJob {
    /// A job saving to `path`.
    pub fn new(path: PathBuf) -> Self {
        Self { path, requested: false, outcome: Arc::default() }
    }

    /// A handle to read the result once the window has closed.
    pub fn outcome(&self) -> PictureOutcome {
        PictureOutcome(Arc::clone(&self.outcome))
    }

    /// Called once per frame: asks for the screenshot when the frame has
    /// settled and closes the window once the picture is saved.
    pub fn on_frame(&mut self, ctx: &egui::Context) {
        let frame = ctx.cumulative_frame_nr();
        if !self.requested && frame >= SETTLE_FRAMES {
            self.requested = true;
            let path = self.path.clone();
            let outcome = Arc::clone(&self.outcome);
            let ctx_for_reply = ctx.clone();
            ctx.request_screenshot(move |image| {
                let saved = save_png(&path, &image);
                if let Ok(mut slot) = outcome.lock() {
                    *slot = Some(saved);
                }
                ctx_for_reply.send_viewport_cmd(egui::ViewportCommand::Close);
            });
        }
        if frame >= GIVE_UP_FRAMES {
            if let Ok(mut slot) = self.outcome.lock() {
                slot.get_or_insert_with(|| {
                    Err(anyhow!("no screenshot arrived after {GIVE_UP_FRAMES} frames"))
                });
            }
            ctx.send_viewport_cmd(egui::ViewportCommand::Close);
        }
        // Keep frames coming: nothing else will ask for one under a
        // virtual display with no input.
        ctx.request_repaint();
    }
}

/// Writes the screenshot as an RGBA PNG.
fn save_png(path: &Path, image: &egui::ColorImage) -> anyhow::Result<()> {
    let [width, height] = image.size;
    let bytes: Vec<u8> = image.pixels.iter().flat_map(|pixel| pixel.to_srgba_unmultiplied()).collect();
    let width = u32::try_from(width).context("the screenshot is too wide")?;
    let height = u32::try_from(height).context("the screenshot is too tall")?;
    let buffer = image::RgbaImage::from_raw(width, height, bytes)
        .context("the screenshot's pixel count does not match its size")?;
    if let Some(parent) = path.parent().filter(|parent| !parent.as_os_str().is_empty()) {
        std::fs::create_dir_all(parent)
            .with_context(|| format!("cannot create the folder {}", parent.display()))?;
    }
    buffer.save(path).with_context(|| format!("cannot write the picture {}", path.display()))
}
