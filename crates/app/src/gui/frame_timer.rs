//! A frame-time run: with `PITCHFRAME_FRAME_TIMES=N` the window draws N
//! frames as fast as it can, moving corner 1 back and forth each frame
//! (so the roof is solved, framed and uploaded every frame) unless the
//! value ends in `:still`, then prints the times and closes.

use std::time::Instant;

use glam::DVec2;

use super::app::AppState;
use super::command::Command;
use super::edit::{PlanEdit, corner_in};

/// Environment variable asking for a frame-time run.
pub const FRAME_TIMES_VARIABLE: &str = "PITCHFRAME_FRAME_TIMES";

/// How far corner 1 is moved each frame, in inches: enough to change
/// every plane touching it, little enough to keep any plan valid.
const NUDGE_IN: f64 = 3.0;

/// Frames drawn before timing starts, while the first uploads settle.
const WARM_UP_FRAMES: usize = 5;

/// A frame-time run under way.
#[derive(Debug)]
pub struct FrameTimer {
    frames: usize,
    moving: bool,
    start_corner: Option<DVec2>,
    last: Option<Instant>,
    times_ms: Vec<f64>,
    seen: usize,
}

impl FrameTimer {
    /// The run asked for by the environment, if any.
    pub fn from_env() -> Option<Self> {
        let value = std::env::var(FRAME_TIMES_VARIABLE).ok()?;
        let (count, still) = match value.split_once(':') {
            Some((count, mode)) => (count, mode == "still"),
            None => (value.as_str(), false),
        };
        let frames = count.trim().parse().ok().filter(|&n: &usize| n > 0)?;
        Some(Self { frames, moving: !still, start_corner: None, last: None, times_ms: Vec::new(), seen: 0 })
    }

    /// Called once per frame, before the window is laid out.
    pub fn on_frame(&mut self, state: &mut AppState, ctx: &egui::Context) {
        let now = Instant::now();
        self.seen += 1;
        if self.times_ms.len() >= self.frames {
            // Reported already; the window is closing.
            return;
        }
        if self.seen > WARM_UP_FRAMES
            && let Some(last) = self.last
        {
            self.times_ms.push(now.duration_since(last).as_secs_f64() * 1000.0);
        }
        self.last = Some(now);
        if self.times_ms.len() == self.frames {
            self.report(state);
            ctx.send_viewport_cmd(egui::ViewportCommand::Close);
            return;
        }
        if self.moving {
            let start = *self
                .start_corner
                .get_or_insert_with(|| state.document.plan.walls.first().map(corner_in).unwrap_or_default());
            let offset =
                if self.seen.is_multiple_of(2) { DVec2::ZERO } else { DVec2::new(-NUDGE_IN, -NUDGE_IN) };
            state.push(Command::Edit {
                edit: PlanEdit::MoveCorner { wall: 0, to_in: start + offset },
                group: Some(0),
            });
        }
        ctx.request_repaint();
    }

    fn report(&self, state: &AppState) {
        let mut sorted = self.times_ms.clone();
        sorted.sort_by(f64::total_cmp);
        let mean = sorted.iter().sum::<f64>() / sorted.len().max(1) as f64;
        let median = sorted.get(sorted.len() / 2).copied().unwrap_or(0.0);
        let slowest = sorted.last().copied().unwrap_or(0.0);
        let scene = &state.derived.scene;
        println!(
            "{} frames ({}), {} members in {} pieces: median {median:.1} ms, mean {mean:.1} ms, slowest {slowest:.1} ms a frame",
            sorted.len(),
            if self.moving { "corner 1 moving every frame" } else { "nothing changing" },
            scene.frame.as_ref().map_or(0, |frame| frame.members.len()),
            scene.pieces.len(),
        );
    }
}
