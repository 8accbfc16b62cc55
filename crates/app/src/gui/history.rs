//! Undo and redo: a stack of whole plans. A plan is a few kilobytes, so
//! keeping copies is simpler and safer than inverting each edit.

use pitchframe_geometry::Plan;

/// Most undo steps kept; the oldest are dropped past this.
const MAX_UNDO_STEPS: usize = 500;

/// Earlier and later plans around the one being edited.
#[derive(Debug, Clone, Default)]
pub struct History {
    undo: Vec<Plan>,
    redo: Vec<Plan>,
    /// The group the last recorded change belonged to: the changes of one
    /// corner drag make one undo step.
    last_group: Option<u64>,
}

impl History {
    /// Records that the plan is about to change from `before`. A change in
    /// the same `group` as the one before it joins that undo step.
    pub fn record(&mut self, before: &Plan, group: Option<u64>) {
        self.redo.clear();
        if group.is_some() && group == self.last_group {
            return;
        }
        self.last_group = group;
        self.undo.push(before.clone());
        if self.undo.len() > MAX_UNDO_STEPS {
            self.undo.remove(0);
        }
    }

    /// The plan before the last change, with `current` kept for redo.
    pub fn undo(&mut self, current: &Plan) -> Option<Plan> {
        let earlier = self.undo.pop()?;
        self.redo.push(current.clone());
        self.last_group = None;
        Some(earlier)
    }

    /// The plan the last undo went back from, with `current` kept for undo.
    pub fn redo(&mut self, current: &Plan) -> Option<Plan> {
        let later = self.redo.pop()?;
        self.undo.push(current.clone());
        self.last_group = None;
        Some(later)
    }

    /// Whether there is a change to undo.
    pub fn can_undo(&self) -> bool {
        !self.undo.is_empty()
    }

    /// Whether there is an undone change to redo.
    pub fn can_redo(&self) -> bool {
        !self.redo.is_empty()
    }

    /// Forgets everything (a new or opened plan starts its own history).
    pub fn clear(&mut self) {
        *self = Self::default();
    }
}

#[cfg(test)]
mod tests {
    use pitchframe_geometry::{Length, demo_plan};

    use super::*;

    fn with_overhang(inches: f64) -> Plan {
        let mut plan = demo_plan().unwrap();
        plan.default_overhang = Length::from_inches(inches);
        plan
    }

    #[test]
    fn undo_and_redo_walk_the_plans_in_order() {
        let (a, b, c) = (with_overhang(10.0), with_overhang(11.0), with_overhang(12.0));
        let mut history = History::default();
        history.record(&a, None);
        history.record(&b, None);
        assert_eq!(history.undo(&c), Some(b.clone()));
        assert_eq!(history.undo(&b), Some(a.clone()));
        assert_eq!(history.undo(&a), None);
        assert_eq!(history.redo(&a), Some(b.clone()));
        assert_eq!(history.redo(&b), Some(c.clone()));
        assert!(!history.can_redo());
    }

    #[test]
    fn one_drag_is_one_undo_step_and_a_new_change_drops_redo() {
        let (a, b, c) = (with_overhang(10.0), with_overhang(11.0), with_overhang(12.0));
        let mut history = History::default();
        history.record(&a, Some(7));
        history.record(&b, Some(7));
        assert_eq!(history.undo(&c), Some(a.clone()));
        assert!(!history.can_undo());
        history.record(&a, None);
        assert!(!history.can_redo());
    }
}
