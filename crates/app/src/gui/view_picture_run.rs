//! A picture-of-the-view run, as the Export menu's "Picture of this view"
//! makes one but without a person: with `PITCHFRAME_VIEW_PICTURE=PATH`
//! (and optionally `PITCHFRAME_VIEW_PICTURE_SIZE=WxH`) the window asks for
//! the picture once it has settled, waits for it to be written, says how
//! it went on standard error, and closes. The window tests use it to check
//! the off-screen drawing against what the window shows.

use std::path::PathBuf;

use super::app::{AppState, Notice};
use super::export::{PictureRequest, parse_picture_side};

/// Environment variable naming where the picture goes.
pub const VIEW_PICTURE_VARIABLE: &str = "PITCHFRAME_VIEW_PICTURE";
/// Environment variable giving its size, `WxH` in pixels.
pub const VIEW_PICTURE_SIZE_VARIABLE: &str = "PITCHFRAME_VIEW_PICTURE_SIZE";

/// Frames drawn first, so the panels have their sizes.
const SETTLE_FRAMES: u64 = 3;

/// A run under way.
#[derive(Debug)]
pub struct ViewPictureRun {
    path: PathBuf,
    size_px: Option<[u32; 2]>,
    asked: bool,
}

impl ViewPictureRun {
    /// The run asked for by the environment, if any; a size that does not
    /// read is said on standard error and the view's own size used.
    pub fn from_env() -> Option<Self> {
        let path = std::env::var_os(VIEW_PICTURE_VARIABLE).filter(|path| !path.is_empty())?;
        let size_px = std::env::var(VIEW_PICTURE_SIZE_VARIABLE).ok().and_then(|text| {
            let read = text
                .split_once(['x', 'X'])
                .ok_or_else(|| format!("\"{text}\" is not WxH"))
                .and_then(|(w, h)| Ok([parse_picture_side(w, "width")?, parse_picture_side(h, "height")?]));
            read.map_err(|message| eprintln!("pitchframe: {VIEW_PICTURE_SIZE_VARIABLE}: {message}")).ok()
        });
        Some(Self { path: PathBuf::from(path), size_px, asked: false })
    }

    /// Called once per frame, after the window is laid out.
    pub fn on_frame(&mut self, state: &mut AppState, ctx: &egui::Context) {
        if !self.asked {
            if ctx.cumulative_frame_nr() >= SETTLE_FRAMES {
                self.asked = true;
                let size_px = self.size_px.unwrap_or(state.view_px);
                state.picture_request = Some(PictureRequest { path: self.path.clone(), size_px });
            }
        } else if state.picture_request.is_none() && state.jobs.is_empty() {
            match &state.notice {
                Some(Notice::Written { text, .. }) => eprintln!("pitchframe: {text}"),
                Some(Notice::Error(text) | Notice::Info(text)) => eprintln!("pitchframe: {text}"),
                None => eprintln!("pitchframe: the picture was not written"),
            }
            ctx.send_viewport_cmd(egui::ViewportCommand::Close);
        }
        // Nothing else asks for frames under a virtual display with no input.
        ctx.request_repaint();
    }
}
