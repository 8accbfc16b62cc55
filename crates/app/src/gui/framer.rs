//! Framing off the window's thread. While a corner is dragged the window
//! solves the roof itself (a millisecond or so) and hands the plan here to
//! be framed, which on a large plan takes many frames' time: the window
//! keeps drawing at its own pace and shows each frame as it arrives. Only
//! the newest plan waiting is framed; older ones are passed over.

use std::sync::{Arc, Condvar, Mutex, MutexGuard};
use std::time::{Duration, Instant};

use pitchframe_geometry::{FramingSettings, Outline};

use super::scene::Scene;

/// A plan to frame: its checked outline and framing settings, numbered in
/// the order they were handed over.
struct Job {
    number: u64,
    outline: Outline,
    settings: Option<FramingSettings>,
    wall_height_in: f64,
    wall_thickness_in: f64,
}

/// A framed scene, with its job's number and how long it took.
pub struct Framed {
    /// The job's number.
    pub number: u64,
    /// The whole scene of that plan.
    pub scene: Arc<Scene>,
    /// How long it took to build.
    pub took: Duration,
}

#[derive(Default)]
struct Slots {
    job: Option<Job>,
    done: Option<Framed>,
    closed: bool,
}

#[derive(Default)]
struct Shared {
    slots: Mutex<Slots>,
    /// Signalled when a job is handed over, or on close.
    work: Condvar,
    /// Signalled when a scene is done.
    done: Condvar,
}

impl Shared {
    fn slots(&self) -> MutexGuard<'_, Slots> {
        // A panic while framing poisons the lock; the slots themselves are
        // always whole, so carry on with them.
        self.slots.lock().unwrap_or_else(std::sync::PoisonError::into_inner)
    }
}

/// The framing thread, stopped when this is dropped.
pub struct Framer {
    shared: Arc<Shared>,
    worker: std::thread::JoinHandle<()>,
}

impl std::fmt::Debug for Framer {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        f.debug_struct("Framer").finish_non_exhaustive()
    }
}

impl Framer {
    /// Starts the thread; `None` if the system will not start one (the
    /// window then frames on its own thread, as it always can).
    pub fn start() -> Option<Self> {
        let shared = Arc::new(Shared::default());
        let for_worker = Arc::clone(&shared);
        let worker =
            std::thread::Builder::new().name("framing".to_owned()).spawn(move || work(&for_worker)).ok()?;
        Some(Self { shared, worker })
    }

    /// Whether the thread is still there to frame (it ends only by a panic
    /// before this is dropped).
    pub fn running(&self) -> bool {
        !self.worker.is_finished()
    }

    /// Hands over a plan to frame, in place of any still waiting.
    pub fn submit(
        &self,
        number: u64,
        outline: Outline,
        settings: Option<FramingSettings>,
        wall_height_in: f64,
        wall_thickness_in: f64,
    ) {
        let mut slots = self.shared.slots();
        slots.job = Some(Job { number, outline, settings, wall_height_in, wall_thickness_in });
        self.shared.work.notify_one();
    }

    /// The scene last framed, if one is done and not yet taken.
    pub fn take(&self) -> Option<Framed> {
        self.shared.slots().done.take()
    }

    /// Waits up to `timeout` for job `number` (or a later one) to be done,
    /// then takes what is done.
    pub fn wait_for(&self, number: u64, timeout: Duration) -> Option<Framed> {
        let deadline = Instant::now() + timeout;
        let mut slots = self.shared.slots();
        loop {
            if slots.done.as_ref().is_some_and(|done| done.number >= number) {
                return slots.done.take();
            }
            let left = deadline.saturating_duration_since(Instant::now());
            if left.is_zero() {
                return slots.done.take();
            }
            slots = self
                .shared
                .done
                .wait_timeout(slots, left)
                .unwrap_or_else(std::sync::PoisonError::into_inner)
                .0;
        }
    }
}

impl Drop for Framer {
    fn drop(&mut self) {
        self.shared.slots().closed = true;
        self.shared.work.notify_one();
    }
}

/// The thread's loop: frame the newest job.
fn work(shared: &Shared) {
    loop {
        let job = {
            let mut slots = shared.slots();
            while slots.job.is_none() && !slots.closed {
                slots = shared.work.wait(slots).unwrap_or_else(std::sync::PoisonError::into_inner);
            }
            if slots.closed {
                return;
            }
            slots.job.take()
        };
        let Some(job) = job else { continue };
        let started = Instant::now();
        let scene =
            Scene::build(&job.outline, job.settings.as_ref(), job.wall_height_in, job.wall_thickness_in);
        let framed = Framed { number: job.number, scene: Arc::new(scene), took: started.elapsed() };
        let mut slots = shared.slots();
        // A later job's scene replaces an earlier one not yet taken.
        if slots.done.as_ref().is_none_or(|done| done.number < framed.number) {
            slots.done = Some(framed);
        }
        shared.done.notify_all();
    }
}
