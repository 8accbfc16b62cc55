//! Everything shown that is worked out from the plan: the checked outline,
//! the roof, the frame and their triangles. Recomputed whenever the plan
//! changes; the window never computes geometry of its own.

use std::sync::Arc;

use pitchframe_geometry::{CornerName, OutlineError, Plan, RoofError, WallName};

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

/// What the window shows for the current plan.
#[derive(Debug, Clone)]
pub struct Derived {
    /// The last scene that was worked out from a plan that could be
    /// roofed: an invalid edit leaves the last good roof on screen.
    pub scene: Arc<Scene>,
    /// Why the current plan cannot be roofed, when it cannot.
    pub problem: Option<Problem>,
    /// Why the plan's `[framing]` table cannot be used, when it cannot.
    pub settings_error: Option<String>,
}

impl Derived {
    /// Works everything out for `plan`.
    pub fn new(plan: &Plan) -> Self {
        let mut derived = Self { scene: Arc::new(Scene::empty()), problem: None, settings_error: None };
        derived.update(plan);
        derived
    }

    /// Works everything out again for a changed `plan`.
    pub fn update(&mut self, plan: &Plan) {
        let outline = match plan.outline() {
            Ok(outline) => outline,
            Err(err) => {
                self.problem = Some(Problem { walls: outline_walls(plan, &err), message: err.to_string() });
                return;
            }
        };
        let settings = plan.framing_settings();
        self.settings_error = settings.as_ref().err().map(ToString::to_string);
        let scene = Scene::build(&outline, settings.as_ref().ok(), WALL_HEIGHT_IN, WALL_THICKNESS_IN);
        let problem =
            scene.roof_error.as_ref().map(|err| Problem { message: err.to_string(), walls: roof_walls(err) });
        // A roof that does not solve leaves the last one that did on screen.
        if problem.is_none() || self.scene.roof.is_none() {
            self.scene = Arc::new(scene);
        }
        self.problem = problem;
    }

    /// Whether the scene shown is from an earlier plan than the current one.
    pub fn stale(&self) -> bool {
        self.problem.is_some()
    }

    /// What the window shows of the roof while there is a problem, in words.
    pub fn shown_instead(&self) -> &'static str {
        if self.scene.roof.is_some() {
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
        _ => Vec::new(),
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
        _ => Vec::new(),
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
}
