//! Changes to the plan a user can ask for, each applied to a plan to give
//! the next one. Walls are named by their global index (outer walls first,
//! then each courtyard's, in file order); wall `i` starts at corner `i`.

use glam::DVec2;
use pitchframe_geometry::{FramingInput, Length, LengthUnit, Pitch, Plan, PlanWall};

/// A ring of walls needs at least this many corners.
const MIN_RING_CORNERS: usize = 3;

/// One change to the plan.
#[derive(Debug, Clone, PartialEq)]
pub enum PlanEdit {
    /// Move the corner wall `wall` starts at to `to_in` (plan inches).
    MoveCorner {
        /// The wall whose starting corner moves.
        wall: usize,
        /// Where it goes, in inches.
        to_in: DVec2,
    },
    /// Split wall `wall` with a new corner at `at_in`; both halves keep
    /// the wall's roof.
    InsertCorner {
        /// The wall split.
        wall: usize,
        /// Where the new corner goes, in inches.
        at_in: DVec2,
    },
    /// Remove the corner wall `wall` starts at; its neighbours join.
    DeleteCorner {
        /// The wall whose starting corner goes.
        wall: usize,
    },
    /// Make wall `wall` this long by moving its far corner along it.
    SetLength {
        /// The wall.
        wall: usize,
        /// Its new length.
        length: Length,
    },
    /// Turn wall `wall` about its starting corner to this plan direction
    /// (radians from +X towards +Y), keeping its length.
    SetDirection {
        /// The wall.
        wall: usize,
        /// Its new direction.
        direction_rad: f64,
    },
    /// Give wall `wall` its own pitch, or the roof's when `None`.
    SetPitch {
        /// The wall.
        wall: usize,
        /// Its pitch.
        pitch: Option<Pitch>,
    },
    /// Make wall `wall` a gable end or a pitched wall.
    SetGable {
        /// The wall.
        wall: usize,
        /// Whether it is a gable.
        gable: bool,
    },
    /// Give wall `wall` its own overhang, or the roof's when `None`.
    SetOverhang {
        /// The wall.
        wall: usize,
        /// Its overhang.
        overhang: Option<Length>,
    },
    /// The pitch of every wall without its own.
    SetRoofPitch(Pitch),
    /// The overhang of every wall without its own.
    SetRoofOverhang(Length),
    /// The `[framing]` table, changed in one setting.
    SetFraming {
        /// The setting changed, named in messages.
        field: FramingField,
        /// The whole table with the change.
        framing: Box<FramingInput>,
    },
}

/// One framing setting, as the window names it.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum FramingField {
    /// Rafter spacing on centre.
    Spacing,
    /// The corner layout is measured from.
    LayoutFrom,
    /// Commons centred on the layout lines.
    CentreCommons,
    /// Rafter (common and jack) size.
    Rafter,
    /// Hip size.
    Hip,
    /// Valley size.
    Valley,
    /// Ridge board size.
    Ridge,
    /// Seat cut width.
    Seat,
    /// Heel height.
    Heel,
    /// How tails are cut.
    Tail,
    /// The plumb cut above a level soffit cut.
    TailPlumb,
    /// Backed or dropped hips.
    Hips,
}

impl FramingField {
    /// The setting's name as the window shows it.
    pub fn name(self) -> &'static str {
        match self {
            FramingField::Spacing => "Rafter spacing",
            FramingField::LayoutFrom => "Layout from corner",
            FramingField::CentreCommons => "Centre commons on the layout",
            FramingField::Rafter => "Rafter size",
            FramingField::Hip => "Hip size",
            FramingField::Valley => "Valley size",
            FramingField::Ridge => "Ridge size",
            FramingField::Seat => "Seat width",
            FramingField::Heel => "Heel height",
            FramingField::Tail => "Tail cut",
            FramingField::TailPlumb => "Tail plumb cut",
            FramingField::Hips => "Hips",
        }
    }

    /// The shorter words beside the setting's field (its full name is the
    /// field's own, for screen readers and messages).
    pub fn shown(self) -> &'static str {
        match self {
            FramingField::Spacing => "Spacing on centre",
            FramingField::Rafter => "Commons and jacks",
            FramingField::Hip => "Hip",
            FramingField::Valley => "Valley",
            FramingField::Ridge => "Ridge board",
            FramingField::Seat => "Seat (plate width)",
            FramingField::Heel => "Heel, plumb at the wall",
            FramingField::TailPlumb => "Plumb cut above the soffit",
            other => other.name(),
        }
    }
}

/// Why an edit could not be made.
#[derive(Debug, Clone, PartialEq)]
pub enum EditError {
    /// The wall named is not in the plan (the plan changed under the edit).
    NoSuchWall(usize),
    /// Deleting would leave a ring with fewer than three corners.
    RingTooSmall(usize),
    /// A length of zero or less for a wall.
    LengthNotPositive,
    /// An overhang below zero.
    OverhangNegative,
    /// A wall of no length has no direction to keep or turn.
    NoDirection(usize),
    /// A framing setting the frame cannot use, and why.
    FramingRejected {
        /// The setting.
        field: FramingField,
        /// Why, in the geometry crate's words.
        reason: String,
    },
}

// Written out rather than derived: the app crate does without thiserror.
impl std::fmt::Display for EditError {
    fn fmt(&self, f: &mut std::fmt::Formatter<'_>) -> std::fmt::Result {
        match self {
            EditError::NoSuchWall(wall) => write!(f, "wall {} is not in the plan", wall + 1),
            EditError::RingTooSmall(wall) => write!(
                f,
                "wall {} is in a ring of {MIN_RING_CORNERS} corners; a ring needs at least \
                 {MIN_RING_CORNERS}, so none of its corners can be deleted",
                wall + 1
            ),
            EditError::LengthNotPositive => write!(f, "a wall's length must be above zero"),
            EditError::OverhangNegative => write!(f, "an overhang must be 0 or more"),
            EditError::NoDirection(wall) => {
                write!(f, "wall {} has no length, so it has no direction to change", wall + 1)
            }
            EditError::FramingRejected { field, reason } => {
                write!(f, "{}: {reason}; the setting was left as it was", field.name())
            }
        }
    }
}

impl std::error::Error for EditError {}

/// How many walls the plan has, courtyards included.
pub fn wall_count(plan: &Plan) -> usize {
    plan.walls.len() + plan.courtyards.iter().map(Vec::len).sum::<usize>()
}

/// Where wall `wall` lies: its ring (`None` for the outer walls, else the
/// courtyard) and its place in that ring.
pub fn locate(plan: &Plan, wall: usize) -> Option<(Option<usize>, usize)> {
    if wall < plan.walls.len() {
        return Some((None, wall));
    }
    let mut first = plan.walls.len();
    for (courtyard, ring) in plan.courtyards.iter().enumerate() {
        if wall < first + ring.len() {
            return Some((Some(courtyard), wall - first));
        }
        first += ring.len();
    }
    None
}

/// The walls of a ring.
pub fn ring(plan: &Plan, ring: Option<usize>) -> Option<&[PlanWall]> {
    match ring {
        None => Some(&plan.walls),
        Some(courtyard) => plan.courtyards.get(courtyard).map(Vec::as_slice),
    }
}

fn ring_mut(plan: &mut Plan, ring: Option<usize>) -> Option<&mut Vec<PlanWall>> {
    match ring {
        None => Some(&mut plan.walls),
        Some(courtyard) => plan.courtyards.get_mut(courtyard),
    }
}

/// A corner's point in inches.
pub fn corner_in(wall: &PlanWall) -> DVec2 {
    DVec2::new(wall.at[0].inches(), wall.at[1].inches())
}

/// Wall `wall`'s two ends in inches: its corner and the next one.
pub fn wall_ends_in(plan: &Plan, wall: usize) -> Option<(DVec2, DVec2)> {
    let (ring_index, index) = locate(plan, wall)?;
    let walls = ring(plan, ring_index)?;
    let start = walls.get(index)?;
    let end = walls.get((index + 1) % walls.len())?;
    Some((corner_in(start), corner_in(end)))
}

/// The global indices of the walls before and after `wall` in its ring.
pub fn neighbours(plan: &Plan, wall: usize) -> Option<(usize, usize)> {
    let (ring_index, index) = locate(plan, wall)?;
    let count = ring(plan, ring_index)?.len();
    let first = wall - index;
    Some((first + (index + count - 1) % count, first + (index + 1) % count))
}

/// A point as the plan stores it. A millimetre plan gets millimetres to
/// the micrometre, so its file keeps plain millimetre numbers; the
/// rounding is far below anything on a building.
fn point(plan: &Plan, at_in: DVec2) -> [Length; 2] {
    let length = |inches: f64| match plan.units {
        LengthUnit::Inch => Length::from_inches(inches),
        LengthUnit::Millimetre => {
            Length::from_mm((Length::from_inches(inches).mm() * 1000.0).round() / 1000.0)
        }
    };
    [length(at_in.x), length(at_in.y)]
}

impl PlanEdit {
    /// The plan after this edit. The outline may come out invalid (walls
    /// crossing, say): the window shows why and the user fixes it.
    pub fn apply(&self, plan: &Plan) -> Result<Plan, EditError> {
        let mut next = plan.clone();
        match *self {
            PlanEdit::MoveCorner { wall, to_in } => {
                let at = point(plan, to_in);
                wall_mut(&mut next, wall)?.at = at;
            }
            PlanEdit::InsertCorner { wall, at_in } => {
                let (ring_index, index) = locate(plan, wall).ok_or(EditError::NoSuchWall(wall))?;
                let at = point(plan, at_in);
                let walls = ring_mut(&mut next, ring_index).ok_or(EditError::NoSuchWall(wall))?;
                let split = walls.get(index).cloned().ok_or(EditError::NoSuchWall(wall))?;
                walls.insert(index + 1, PlanWall { at, ..split });
                if ring_index.is_none() {
                    shift_layout_corner(&mut next, index + 1, true);
                }
            }
            PlanEdit::DeleteCorner { wall } => {
                let (ring_index, index) = locate(plan, wall).ok_or(EditError::NoSuchWall(wall))?;
                let walls = ring_mut(&mut next, ring_index).ok_or(EditError::NoSuchWall(wall))?;
                if walls.len() <= MIN_RING_CORNERS {
                    return Err(EditError::RingTooSmall(wall));
                }
                walls.remove(index);
                if ring_index.is_none() {
                    shift_layout_corner(&mut next, index, false);
                }
            }
            PlanEdit::SetLength { wall, length } => {
                if length.inches() <= 0.0 || !length.inches().is_finite() {
                    return Err(EditError::LengthNotPositive);
                }
                let (start, end) = wall_ends_in(plan, wall).ok_or(EditError::NoSuchWall(wall))?;
                let along = (end - start).try_normalize().ok_or(EditError::NoDirection(wall))?;
                let (_, after) = neighbours(plan, wall).ok_or(EditError::NoSuchWall(wall))?;
                let at = point(plan, start + along * length.inches());
                wall_mut(&mut next, after)?.at = at;
            }
            PlanEdit::SetDirection { wall, direction_rad } => {
                let (start, end) = wall_ends_in(plan, wall).ok_or(EditError::NoSuchWall(wall))?;
                let length_in = (end - start).length();
                if length_in <= 0.0 {
                    return Err(EditError::NoDirection(wall));
                }
                let (_, after) = neighbours(plan, wall).ok_or(EditError::NoSuchWall(wall))?;
                let at = point(plan, start + DVec2::from_angle(direction_rad) * length_in);
                wall_mut(&mut next, after)?.at = at;
            }
            PlanEdit::SetPitch { wall, pitch } => wall_mut(&mut next, wall)?.pitch = pitch,
            PlanEdit::SetGable { wall, gable } => wall_mut(&mut next, wall)?.gable = gable,
            PlanEdit::SetOverhang { wall, overhang } => {
                if overhang.is_some_and(|o| o.inches() < 0.0) {
                    return Err(EditError::OverhangNegative);
                }
                wall_mut(&mut next, wall)?.overhang = overhang;
            }
            PlanEdit::SetRoofPitch(pitch) => next.default_pitch = pitch,
            PlanEdit::SetRoofOverhang(overhang) => {
                if overhang.inches() < 0.0 {
                    return Err(EditError::OverhangNegative);
                }
                next.default_overhang = overhang;
            }
            PlanEdit::SetFraming { field, ref framing } => {
                next.framing = (**framing).clone();
                // The plan's own reader of the table, so the window accepts
                // exactly what a plan file may hold.
                if let Err(err) = next.framing_settings() {
                    return Err(EditError::FramingRejected { field, reason: err.to_string() });
                }
            }
        }
        Ok(next)
    }
}

fn wall_mut(plan: &mut Plan, wall: usize) -> Result<&mut PlanWall, EditError> {
    let (ring_index, index) = locate(plan, wall).ok_or(EditError::NoSuchWall(wall))?;
    ring_mut(plan, ring_index).and_then(|walls| walls.get_mut(index)).ok_or(EditError::NoSuchWall(wall))
}

/// Keeps the framing layout's starting corner on the same corner when a
/// corner is inserted or deleted before it (or moves it to the next corner
/// when its own corner goes).
fn shift_layout_corner(plan: &mut Plan, changed: usize, inserted: bool) {
    let corners = plan.walls.len();
    if let Some(corner) = plan.framing.layout_from.as_mut() {
        if inserted && *corner >= changed {
            *corner += 1;
        } else if !inserted && *corner > changed {
            *corner -= 1;
        }
        if *corner >= corners {
            *corner = 0;
        }
    }
}

#[cfg(test)]
mod tests {
    use approx::assert_abs_diff_eq;
    use pitchframe_geometry::demo_plan;

    use super::*;

    /// A 40 ft x 24 ft rectangle, corners counter-clockwise from the origin.
    fn rectangle() -> Plan {
        Plan::from_toml(
            "format = 1\nunits = \"in\"\n[roof]\npitch = \"6/12\"\noverhang = 12\n\
             [[wall]]\nat = [0, 0]\n[[wall]]\nat = [480, 0]\n[[wall]]\nat = [480, 288]\n[[wall]]\nat = [0, 288]\n",
        )
        .unwrap()
    }

    #[test]
    fn setting_a_length_moves_the_far_corner_along_the_wall() {
        let plan = rectangle();
        let next = PlanEdit::SetLength { wall: 0, length: Length::from_feet(44.0) }.apply(&plan).unwrap();
        // Derivation: wall 1 runs along +X from the origin, so its far
        // corner goes to x = 44 ft = 528 in and stays at y = 0.
        assert_eq!(corner_in(&next.walls[1]), DVec2::new(528.0, 0.0));
        assert_eq!(next.walls[2], plan.walls[2]);
    }

    #[test]
    fn setting_a_direction_turns_the_wall_about_its_first_corner() {
        let plan = rectangle();
        let next =
            PlanEdit::SetDirection { wall: 0, direction_rad: 30f64.to_radians() }.apply(&plan).unwrap();
        let end = corner_in(&next.walls[1]);
        // Derivation: 480 in at 30 degrees is (480 cos 30, 480 sin 30).
        assert_abs_diff_eq!(end.x, 480.0 * 3f64.sqrt() / 2.0, epsilon = 1e-9);
        assert_abs_diff_eq!(end.y, 240.0, epsilon = 1e-9);
    }

    #[test]
    fn inserting_then_deleting_a_corner_gives_the_plan_back() {
        let plan = rectangle();
        let split = PlanEdit::InsertCorner { wall: 1, at_in: DVec2::new(480.0, 100.0) }.apply(&plan).unwrap();
        assert_eq!(split.walls.len(), 5);
        assert_eq!(corner_in(&split.walls[2]), DVec2::new(480.0, 100.0));
        assert_eq!(PlanEdit::DeleteCorner { wall: 2 }.apply(&split).unwrap(), plan);
    }

    #[test]
    fn a_triangle_keeps_its_corners() {
        let mut plan = rectangle();
        plan.walls.pop();
        assert_eq!(PlanEdit::DeleteCorner { wall: 0 }.apply(&plan), Err(EditError::RingTooSmall(0)));
    }

    #[test]
    fn courtyard_walls_follow_the_outer_walls_in_numbering() {
        let mut plan = demo_plan().unwrap();
        let outer = plan.walls.len();
        plan.courtyards.push(rectangle().walls);
        assert_eq!(locate(&plan, outer + 2), Some((Some(0), 2)));
        assert_eq!(neighbours(&plan, outer), Some((outer + 3, outer + 1)));
        assert_eq!(locate(&plan, outer + 4), None);
        let next = PlanEdit::SetGable { wall: outer + 1, gable: true }.apply(&plan).unwrap();
        assert!(next.courtyards[0][1].gable);
    }

    #[test]
    fn the_layout_corner_stays_on_its_corner() {
        let mut plan = rectangle();
        plan.framing.layout_from = Some(2);
        let split = PlanEdit::InsertCorner { wall: 0, at_in: DVec2::new(240.0, 0.0) }.apply(&plan).unwrap();
        assert_eq!(split.framing.layout_from, Some(3));
        let back = PlanEdit::DeleteCorner { wall: 1 }.apply(&split).unwrap();
        assert_eq!(back.framing.layout_from, Some(2));
    }

    #[test]
    fn millimetre_plans_keep_millimetre_numbers() {
        let mut plan = rectangle();
        plan.units = LengthUnit::Millimetre;
        let to_in = DVec2::new(Length::from_mm(1234.0).inches(), 0.0);
        let next = PlanEdit::MoveCorner { wall: 1, to_in }.apply(&plan).unwrap();
        assert_eq!(next.walls[1].at[0], Length::from_mm(1234.0));
    }
}
