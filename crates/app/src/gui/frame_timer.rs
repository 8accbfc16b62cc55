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

/// The window's size for a run, in points.
const RUN_SIZE_PT: [f32; 2] = [1280.0, 800.0];

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
    /// Each thread's CPU time when timing began.
    cpu_at_start: Vec<(String, f64)>,
    /// How long after the process started the first frame had been drawn.
    first_frame_ms: Option<f64>,
    /// The app's count of frames drawn with the members behind the roof,
    /// when timing began.
    behind_at_start: u64,
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
        Some(Self {
            frames,
            moving: !still,
            start_corner: None,
            last: None,
            times_ms: Vec::new(),
            seen: 0,
            cpu_at_start: Vec::new(),
            first_frame_ms: None,
            behind_at_start: 0,
        })
    }

    /// Called once per frame, before the window is laid out.
    pub fn on_frame(&mut self, state: &mut AppState, ctx: &egui::Context) {
        let now = Instant::now();
        self.seen += 1;
        if self.seen == 1 {
            // Every run at one size, a common laptop screen's, whatever
            // the window opened at.
            ctx.send_viewport_cmd(egui::ViewportCommand::InnerSize(egui::vec2(
                RUN_SIZE_PT[0],
                RUN_SIZE_PT[1],
            )));
        }
        if self.times_ms.len() >= self.frames {
            // Reported already; the window is closing.
            return;
        }
        if self.seen == 2 {
            // The second frame begins once the first has been drawn.
            self.first_frame_ms = since_process_start_ms();
        }
        if self.seen == WARM_UP_FRAMES {
            self.cpu_at_start = thread_cpu_ms();
            self.behind_at_start = state.frames_behind;
        }
        if self.seen > WARM_UP_FRAMES
            && let Some(last) = self.last
        {
            self.times_ms.push(now.duration_since(last).as_secs_f64() * 1000.0);
        }
        self.last = Some(now);
        if self.times_ms.len() == self.frames {
            state.settle();
            self.report(state, ctx);
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

    fn report(&self, state: &AppState, ctx: &egui::Context) {
        let inner =
            ctx.input(|input| input.viewport().inner_rect).map_or(egui::Vec2::ZERO, |rect| rect.size());
        let window = [inner.x.round() as u32, inner.y.round() as u32];
        let mut sorted = self.times_ms.clone();
        sorted.sort_by(f64::total_cmp);
        let mean = sorted.iter().sum::<f64>() / sorted.len().max(1) as f64;
        let median = sorted.get(sorted.len() / 2).copied().unwrap_or(0.0);
        let slowest = sorted.last().copied().unwrap_or(0.0);
        let scene = &state.derived.scene;
        println!(
            "{} frames at {} x {} ({}), {} members in {} pieces ({} triangles): median {median:.1} ms, mean {mean:.1} ms, slowest {slowest:.1} ms a frame",
            sorted.len(),
            window[0],
            window[1],
            if self.moving { "corner 1 moving every frame" } else { "nothing changing" },
            scene.frame.as_ref().map_or(0, |frame| frame.members.len()),
            scene.pieces.len(),
            scene.pieces.iter().map(|piece| piece.triangles.len()).sum::<usize>(),
        );
        if self.moving {
            // A drag's members come from the framing thread: how often
            // they were not yet in when the frame was drawn.
            let behind = state.frames_behind - self.behind_at_start;
            println!("members of an earlier plan than the roof in {behind} of {} frames", sorted.len());
        }
        match self.first_frame_ms {
            Some(ms) => println!("first frame drawn {ms:.0} ms after the program started"),
            None => println!("first frame drawn: time since start not measured on this system"),
        }
        // Wall-clock frame times depend on what else the machine runs; the
        // CPU each frame took does not, so it is reported beside them.
        let frames = sorted.len().max(1) as f64;
        let used = cpu_used_ms(&self.cpu_at_start, &thread_cpu_ms());
        if used.is_empty() {
            println!("CPU time per frame: not measured on this system");
        } else {
            let total: f64 = used.iter().map(|(_, ms)| ms).sum();
            let parts: Vec<String> =
                used.iter().map(|(group, ms)| format!("{group} {:.1} ms", ms / frames)).collect();
            println!("CPU time per frame: {:.1} ms in all ({})", total / frames, parts.join(", "));
        }
    }
}

/// Clock ticks a second in `/proc` times (USER_HZ, 100 on Linux).
const TICKS_PER_SECOND: f64 = 100.0;

/// CPU time (user and system) used so far by each thread of this process,
/// in milliseconds, with the thread's name; empty where `/proc` is missing.
fn thread_cpu_ms() -> Vec<(String, f64)> {
    let Ok(tasks) = std::fs::read_dir("/proc/self/task") else { return Vec::new() };
    tasks
        .filter_map(|task| {
            let stat = std::fs::read_to_string(task.ok()?.path().join("stat")).ok()?;
            // "tid (name) state ppid ...": the name may hold spaces or
            // brackets, so the fields start after the last ')'.
            let (head, rest) = stat.rsplit_once(')')?;
            let name = head.split_once('(')?.1.to_string();
            let fields: Vec<&str> = rest.split_whitespace().collect();
            let utime: f64 = fields.get(11)?.parse().ok()?;
            let stime: f64 = fields.get(12)?.parse().ok()?;
            Some((name, (utime + stime) / TICKS_PER_SECOND * 1000.0))
        })
        .collect()
}

/// Time since this process started, from `/proc` (to 10 ms).
fn since_process_start_ms() -> Option<f64> {
    let stat = std::fs::read_to_string("/proc/self/stat").ok()?;
    let fields: Vec<&str> = stat.rsplit_once(')')?.1.split_whitespace().collect();
    // Field 22 of the whole line, the start time in ticks after boot.
    let started_ticks: f64 = fields.get(19)?.parse().ok()?;
    let uptime = std::fs::read_to_string("/proc/uptime").ok()?;
    let up_s: f64 = uptime.split_whitespace().next()?.parse().ok()?;
    Some((up_s - started_ticks / TICKS_PER_SECOND) * 1000.0)
}

/// CPU time used between two readings, summed by kind of thread: the
/// software rasterizer's threads, the window's own thread, and the rest.
fn cpu_used_ms(before: &[(String, f64)], after: &[(String, f64)]) -> Vec<(&'static str, f64)> {
    let mut groups: Vec<(&'static str, f64)> = Vec::new();
    for (name, ms) in after {
        let earlier: f64 = before.iter().filter(|(n, _)| n == name).map(|(_, ms)| ms).sum();
        let group = if name.starts_with("llvmpipe") {
            "rasterizer threads"
        } else if name.starts_with("pitchframe") {
            "window thread"
        } else {
            "other threads"
        };
        let used = (ms - earlier).max(0.0);
        match groups.iter_mut().find(|(g, _)| *g == group) {
            Some((_, total)) => *total += used,
            None => groups.push((group, used)),
        }
    }
    groups
}
