//! Everything shown that is worked out from the plan: the checked outline,
//! the roof, the frame and their triangles. Recomputed whenever the plan
//! changes; the window never computes geometry of its own.

use std::sync::Arc;
use std::time::Duration;

use pitchframe_geometry::framing::FramingSettings;
use pitchframe_geometry::{CornerName, Outline, OutlineError, Plan, PlanError, Roof, RoofError, WallName};

use super::framer::{Framed, Framer};
use super::retire::retire;
use super::scene::Scene;

/// Floor to the top of the top plate, in inches: the plan gives heights
/// from the wall line, so the walls are drawn at a usual 8 ft.
pub const WALL_HEIGHT_IN: f64 = 96.0;
/// Wall thickness drawn, in inches: a 2x6 stud wall with sheathing.
pub const WALL_THICKNESS_IN: f64 = 6.0;

/// Why the plan as it stands cannot be roofed, and the walls at fault.
#[derive(Debug, Clone, PartialEq)]
pub struct Problem {
    /// The geometry crate's message, in the user's words.
    pub message: String,
    /// Global indices of the walls the message is about.
    pub walls: Vec<usize>,
}

/// How long the window waits for a drag's frame before drawing without it,
/// when the last one came in about that time: a frame that quick is shown
/// in the window's next frame, a slow one whenever it arrives.
const QUICK_FRAME: Duration = Duration::from_millis(12);

/// What the window shows for the current plan.
#[derive(Debug, Clone)]
pub struct Derived {
    /// The last scene that was worked out from a plan that could be
    /// roofed: an invalid edit leaves the last good roof on screen. While a
    /// drag's frame is being laid out this is the last whole scene, of an
    /// earlier plan (see [`Derived::frame_pending`]).
    pub scene: Arc<Scene>,
    /// Why the current plan cannot be roofed, when it cannot.
    pub problem: Option<Problem>,
    /// Why the plan's `[framing]` table cannot be used, when it cannot.
    pub settings_error: Option<String>,
    /// The walls and roof of the plan being dragged, ahead of its frame.
    live: Option<Arc<Scene>>,
    /// The plan handed to the framing thread last, kept to frame here
    /// should that thread fail.
    live_plan: Option<Plan>,
    /// The framing thread, started by the first drag.
    framer: Option<Arc<Framer>>,
    /// The number given to the last plan worked out or handed over.
    last_number: u64,
    /// The number of the plan `scene` is of, or of a later one worked out
    /// on this thread: anything framed before it is out of date.
    shown_number: u64,
    /// The plan handed to the framing thread whose scene is not shown yet.
    waiting_for: Option<u64>,
    /// How long the framing thread took over the last scene.
    last_took: Duration,
}

impl Derived {
    /// Works everything out for `plan`.
    pub fn new(plan: &Plan) -> Self {
        let mut derived = Self {
            scene: Arc::new(Scene::empty()),
            problem: None,
            settings_error: None,
            live: None,
            live_plan: None,
            framer: None,
            last_number: 0,
            shown_number: 0,
            waiting_for: None,
            last_took: Duration::ZERO,
        };
        derived.update(plan);
        derived
    }

    /// Works everything out again for a changed `plan`, on this thread.
    pub fn update(&mut self, plan: &Plan) {
        // Whatever a drag left to come is of an earlier plan than this.
        self.waiting_for = None;
        self.live = None;
        self.live_plan = None;
        self.last_number += 1;
        self.shown_number = self.last_number;
        let Some((outline, settings)) = self.outline_and_settings(plan) else { return };
        let scene = Scene::build(&outline, settings.as_ref().ok(), WALL_HEIGHT_IN, WALL_THICKNESS_IN);
        let problem =
            scene.roof_error.as_ref().map(|err| Problem { message: err.to_string(), walls: roof_walls(err) });
        // A roof that does not solve leaves the last one that did on screen.
        if problem.is_none() || self.scene.roof.is_none() {
            self.show(Arc::new(scene));
        }
        self.problem = problem;
    }

    /// Works out `plan` as a drag does: the roof at once, on this thread,
    /// and the frame on the framing thread, shown when it arrives (a
    /// later [`Derived::poll`]). Falls back to [`Derived::update`] where no
    /// thread can be started.
    pub fn update_live(&mut self, plan: &Plan) {
        if self.framer.is_none() {
            self.framer = Framer::start().map(Arc::new);
        }
        let Some(framer) = self.framer.clone() else {
            self.update(plan);
            return;
        };
        let Some((outline, settings)) = self.outline_and_settings(plan) else { return };
        match Roof::solve(&outline) {
            Ok(roof) => {
                self.problem = None;
                self.live =
                    Some(Arc::new(Scene::roof_only(&outline, roof, WALL_HEIGHT_IN, WALL_THICKNESS_IN)));
                self.last_number += 1;
                self.waiting_for = Some(self.last_number);
                self.live_plan = Some(plan.clone());
                framer.submit(self.last_number, outline, settings.ok(), WALL_HEIGHT_IN, WALL_THICKNESS_IN);
            }
            // As in `update`, the last roof that solved stays on screen.
            Err(err) => self.problem = Some(Problem { message: err.to_string(), walls: roof_walls(&err) }),
        }
    }

    /// The plan's outline and framing settings, noting what is wrong with
    /// either; `None` when the outline itself is at fault.
    fn outline_and_settings(&mut self, plan: &Plan) -> Option<(Outline, Result<FramingSettings, PlanError>)> {
        let outline = match plan.outline() {
            Ok(outline) => outline,
            Err(err) => {
                self.problem = Some(Problem { walls: outline_walls(plan, &err), message: err.to_string() });
                return None;
            }
        };
        let settings = plan.framing_settings();
        self.settings_error = settings.as_ref().err().map(ToString::to_string);
        Some((outline, settings))
    }

    /// Takes in what the framing thread has finished. When the frame of a
    /// drag's last plan came quickly before, waits a little for this one,
    /// so the members keep within a frame of the roof.
    pub fn poll(&mut self) {
        let (Some(framer), Some(number)) = (self.framer.clone(), self.waiting_for) else { return };
        let framed =
            if self.last_took <= QUICK_FRAME { framer.wait_for(number, QUICK_FRAME) } else { framer.take() };
        if let Some(framed) = framed {
            self.take_framed(framed);
        }
    }

    /// Waits for the frame of the plan last handed over, so the scene is
    /// the current plan's (for printing, or once a drag is over).
    pub fn settle(&mut self) {
        let (Some(framer), Some(number)) = (self.framer.clone(), self.waiting_for) else { return };
        while self.waiting_for.is_some() {
            match framer.wait_for(number, Duration::from_secs(1)) {
                Some(framed) => self.take_framed(framed),
                None if !framer.running() => {
                    // The thread failed: frame here from now on.
                    self.framer = None;
                    if let Some(plan) = self.live_plan.take() {
                        self.update(&plan);
                    }
                    return;
                }
                None => {}
            }
        }
    }

    fn take_framed(&mut self, framed: Framed) {
        // Older than what is shown: a plan worked out since on this thread.
        if framed.number <= self.shown_number {
            return;
        }
        self.last_took = framed.took;
        if self.waiting_for == Some(framed.number) {
            self.waiting_for = None;
            self.live = None;
            self.live_plan = None;
        }
        self.shown_number = framed.number;
        self.show(framed.scene);
    }

    /// Puts `scene` on screen; the one it replaces is freed off this thread.
    fn show(&mut self, scene: Arc<Scene>) {
        retire(std::mem::replace(&mut self.scene, scene));
    }

    /// Whether the frame on screen is of an earlier plan than the one
    /// being dragged (its numbers are shown as such).
    pub fn frame_pending(&self) -> bool {
        self.waiting_for.is_some()
    }

    /// The scene whose walls and roof are shown: the dragged plan's own
    /// while its frame is laid out, else the whole scene.
    pub fn roof_scene(&self) -> &Arc<Scene> {
        self.live.as_ref().unwrap_or(&self.scene)
    }

    /// Whether the scene shown is from an earlier plan than the current one.
    pub fn stale(&self) -> bool {
        self.problem.is_some()
    }

    /// What the window shows of the roof while there is a problem, in words.
    pub fn shown_instead(&self) -> &'static str {
        if self.roof_scene().roof.is_some() {
            "the roof shown is the last one that solved"
        } else {
            "no roof can be shown until it is fixed"
        }
    }
}

/// The walls a roof solve error is about.
fn roof_walls(error: &RoofError) -> Vec<usize> {
    match error {
        RoofError::PitchNotPositive { wall, .. }
        | RoofError::NotFinite { wall }
        | RoofError::WallHasNoLength { wall } => vec![*wall],
        RoofError::GableInLineWithPitched { gable, wall } => vec![*gable, *wall],
        RoofError::GablesOnly { walls } => walls.clone(),
        RoofError::CourtyardTooSmall { .. } | RoofError::Unsolvable { .. } => Vec::new(),
    }
}

/// The global index of a named corner's wall (the wall starting there).
fn corner_wall(plan: &Plan, corner: &CornerName) -> usize {
    match corner.courtyard {
        None => corner.corner,
        Some(c) => {
            plan.walls.len() + plan.courtyards.iter().take(c).map(Vec::len).sum::<usize>() + corner.corner
        }
    }
}

/// The walls an outline error is about.
fn outline_walls(plan: &Plan, error: &OutlineError) -> Vec<usize> {
    let wall = |name: &WallName| name.wall;
    match error {
        OutlineError::CornerNotFinite { corner, .. } => vec![corner_wall(plan, corner)],
        OutlineError::PitchNotPositive { wall: w, .. }
        | OutlineError::OverhangInvalid { wall: w, .. }
        | OutlineError::WallTooShort { wall: w, .. }
        | OutlineError::CourtyardCrossesOutline { wall: w, .. }
        | OutlineError::CourtyardsCross { wall: w, .. } => vec![wall(w)],
        OutlineError::CornerRepeats { corner, earlier } => {
            vec![corner_wall(plan, corner), corner_wall(plan, earlier)]
        }
        OutlineError::WallsCross { wall: w, other } | OutlineError::WallsTouch { wall: w, other } => {
            vec![wall(w), wall(other)]
        }
        OutlineError::CornerTooCloseToWall { corner, wall: w, .. } => {
            vec![corner_wall(plan, corner), wall(w)]
        }
        OutlineError::StraightCornerRoofChanges { wall: w, next, .. } => vec![wall(w), wall(next)],
        OutlineError::GableNearlyInLine { gable, wall: w, .. } => vec![wall(gable), wall(w)],
        OutlineError::CourtyardTooSmallForOverhangs { wall: w, other, .. } => vec![wall(w), wall(other)],
        // About the whole outline or a whole courtyard, not one wall.
        OutlineError::TooFewCorners { .. }
        | OutlineError::CourtyardTooFewCorners { .. }
        | OutlineError::TooManyCorners { .. }
        | OutlineError::NoPitchedWall
        | OutlineError::OutlineHasNoArea
        | OutlineError::CourtyardHasNoArea { .. }
        | OutlineError::CourtyardOutside { .. }
        | OutlineError::CourtyardInsideCourtyard { .. } => Vec::new(),
    }
}

#[cfg(test)]
mod tests {
    use glam::DVec2;
    use pitchframe_geometry::demo_plan;

    use super::super::edit::PlanEdit;
    use super::*;

    #[test]
    fn walls_that_cross_are_named_and_the_last_roof_stays() {
        let plan = demo_plan().unwrap();
        let mut derived = Derived::new(&plan);
        assert!(derived.problem.is_none());
        let before = Arc::clone(&derived.scene);
        assert!(before.roof.is_some() && before.frame.is_some());
        // Drag the demo's corner 3 far past the far side of the house, so
        // its walls cross the ones opposite.
        let far = DVec2::new(-2000.0, -2000.0);
        let crossed = PlanEdit::MoveCorner { wall: 2, to_in: far }.apply(&plan).unwrap();
        derived.update(&crossed);
        let problem = derived.problem.clone().unwrap();
        assert!(problem.message.contains("crosses"), "{}", problem.message);
        assert!(!problem.walls.is_empty());
        assert!(Arc::ptr_eq(&derived.scene, &before), "the last good roof is no longer shown");
        derived.update(&plan);
        assert!(derived.problem.is_none());
    }

    #[test]
    fn a_gable_nearly_in_line_with_a_pitched_wall_marks_both_walls() {
        // A gable (wall 2) running on a quarter of an inch off straight over
        // 20 ft from the pitched wall 1: refused by the outline's own check.
        let text = "format = 1\nunits = \"in\"\n[roof]\npitch = \"6/12\"\n\
                    [[wall]]\nat = [0, 0]\n[[wall]]\nat = [240, 0]\ngable = true\n\
                    [[wall]]\nat = [480, 0.25]\n[[wall]]\nat = [480, 240]\n[[wall]]\nat = [0, 240]\n";
        let plan = Plan::from_toml(text).unwrap();
        let derived = Derived::new(&plan);
        let problem = derived.problem.clone().unwrap();
        assert!(problem.message.contains("degrees off a straight line"), "{}", problem.message);
        assert_eq!(problem.walls, vec![1, 0]);
    }

    #[test]
    fn a_courtyard_too_small_for_its_overhangs_marks_the_two_walls() {
        // A courtyard 30 in across with 16 in overhangs each side: 32 in
        // of overhang (arithmetic). Its bottom and top are walls 4 and 6
        // counting from 0 (the 4 outer walls first).
        let text = "format = 1\nunits = \"in\"\n[roof]\npitch = \"6/12\"\noverhang = 16\n\
                    [[wall]]\nat = [0, 0]\n[[wall]]\nat = [480, 0]\n[[wall]]\nat = [480, 288]\n\
                    [[wall]]\nat = [0, 288]\n[[courtyard]]\n[[courtyard.wall]]\nat = [120, 120]\n\
                    [[courtyard.wall]]\nat = [240, 120]\n[[courtyard.wall]]\nat = [240, 150]\n\
                    [[courtyard.wall]]\nat = [120, 150]\n";
        let plan = Plan::from_toml(text).unwrap();
        let derived = Derived::new(&plan);
        let problem = derived.problem.clone().unwrap();
        assert!(problem.message.contains("too small for the overhangs into it"), "{}", problem.message);
        assert_eq!(problem.walls, vec![4, 6]);
    }

    #[test]
    fn a_dragged_corner_shows_its_roof_at_once_and_its_frame_when_laid_out() {
        let plan = demo_plan().unwrap();
        let mut derived = Derived::new(&plan);
        let before = Arc::clone(&derived.scene);
        let moved = PlanEdit::MoveCorner { wall: 0, to_in: DVec2::new(-24.0, -12.0) }.apply(&plan).unwrap();
        derived.update_live(&moved);
        // Derivation: the same plan worked out on this thread, which the
        // drag's roof and, once it arrives, its frame must equal.
        let at_once = Derived::new(&moved);
        assert_eq!(derived.roof_scene().roof, at_once.scene.roof);
        assert_ne!(derived.roof_scene().roof, before.roof, "the moved corner changes the roof");
        derived.settle();
        assert!(!derived.frame_pending());
        assert!(Arc::ptr_eq(derived.roof_scene(), &derived.scene));
        assert_eq!(derived.scene.frame, at_once.scene.frame);
        assert_eq!(derived.scene.parts, at_once.scene.parts);
        assert!(derived.scene.frame.is_some());
    }

    #[test]
    fn a_plan_worked_out_at_once_wins_over_a_drags_frame_still_coming() {
        let plan = demo_plan().unwrap();
        let mut derived = Derived::new(&plan);
        let moved = PlanEdit::MoveCorner { wall: 0, to_in: DVec2::new(-24.0, -12.0) }.apply(&plan).unwrap();
        derived.update_live(&moved);
        // An undo, say, before the drag's frame is in.
        derived.update(&plan);
        assert!(!derived.frame_pending());
        let undone = Arc::clone(&derived.scene);
        // A second drag: only its own frame may be shown at the end.
        let again = PlanEdit::MoveCorner { wall: 0, to_in: DVec2::new(12.0, -36.0) }.apply(&plan).unwrap();
        derived.update_live(&again);
        derived.settle();
        assert!(!Arc::ptr_eq(&derived.scene, &undone));
        assert_eq!(derived.scene.frame, Derived::new(&again).scene.frame);
    }

    #[test]
    fn a_drag_past_a_roof_that_solves_keeps_the_last_roof_and_names_the_walls() {
        let plan = demo_plan().unwrap();
        let mut derived = Derived::new(&plan);
        let moved = PlanEdit::MoveCorner { wall: 0, to_in: DVec2::new(-24.0, -12.0) }.apply(&plan).unwrap();
        derived.update_live(&moved);
        let live_roof = Arc::clone(derived.roof_scene());
        // As in the test above: corner 3 far past the far side of the house.
        let crossed =
            PlanEdit::MoveCorner { wall: 2, to_in: DVec2::new(-2000.0, -2000.0) }.apply(&moved).unwrap();
        derived.update_live(&crossed);
        assert!(derived.problem.as_ref().is_some_and(|problem| !problem.walls.is_empty()));
        assert!(Arc::ptr_eq(derived.roof_scene(), &live_roof), "the last roof that solved is not shown");
        derived.settle();
        assert_eq!(derived.scene.frame, Derived::new(&moved).scene.frame);
    }
}
