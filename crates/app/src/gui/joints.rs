//! Where the frame's joints are in the 3D view, and which one a click is
//! on. The fit of each joint (its largest gap and overlap) is the geometry
//! crate's own check on the two solids; this file only places it.

use glam::{DVec2, DVec3};
use pitchframe_geometry::Frame;
use pitchframe_geometry::framing::Joint;

use super::camera::OrbitCamera;

/// The fit a joint must be within to count as tight: 1/64 in, the finest
/// mark on a framing square's inch and well inside what a framer's saw
/// holds (common practice, no source).
pub const JOINT_TOLERANCE_IN: f64 = 1.0 / 64.0;

/// How close a corner of the cut piece must lie to the piece it bears on
/// to count as part of the joint, in inches: a hair over the tolerance, so
/// a joint with a small gap still finds its faces.
const JOINT_FACE_IN: f64 = 0.25;

/// How far round the joint the camera frames when it closes in, in
/// inches: enough to see the two members meet.
const JOINT_VIEW_RADIUS_IN: f64 = 16.0;

/// How near a click must land to a joint's mark to pick it, in points.
pub const JOINT_PICK_RADIUS_PT: f64 = 12.0;

/// One joint, placed in the 3D view.
#[derive(Debug, Clone, PartialEq)]
pub struct SceneJoint {
    /// The geometry crate's joint: the two members and their fit.
    pub joint: Joint,
    /// The middle of the faces where the two pieces meet, in the view's
    /// inches (the frame lifted onto the walls).
    pub at: DVec3,
}

impl SceneJoint {
    /// Whether both the gap and the overlap are within 1/64 in.
    pub fn tight(&self) -> bool {
        self.joint.max_gap <= JOINT_TOLERANCE_IN && self.joint.max_overlap <= JOINT_TOLERANCE_IN
    }

    /// Whether `label` is one of the joint's two members.
    pub fn involves(&self, label: &str) -> bool {
        self.joint.members.iter().any(|member| member == label)
    }

    /// The box the camera frames to show the joint close up.
    pub fn view_box(&self) -> (DVec3, DVec3) {
        let margin = DVec3::splat(JOINT_VIEW_RADIUS_IN);
        (self.at - margin, self.at + margin)
    }
}

/// Places every joint of `frame`, lifted by `lift` as the pieces are.
pub fn scene_joints(frame: &Frame, lift: DVec3) -> Vec<SceneJoint> {
    frame
        .joints
        .iter()
        .filter_map(|joint| {
            let [cut, bearing] = joint.pieces;
            let cut = frame.pieces.get(cut)?;
            let bearing = frame.pieces.get(bearing)?;
            let touching: Vec<DVec3> =
                cut.solid.vertices().filter(|&p| bearing.solid.depth_of(p) > -JOINT_FACE_IN).collect();
            let at = if touching.is_empty() {
                // No corner close enough (a joint with a wide gap): the
                // cut piece's corner nearest the bearing piece stands in.
                cut.solid
                    .vertices()
                    .max_by(|a, b| bearing.solid.depth_of(*a).total_cmp(&bearing.solid.depth_of(*b)))?
            } else {
                touching.iter().copied().sum::<DVec3>() / touching.len() as f64
            };
            Some(SceneJoint { joint: joint.clone(), at: at + lift })
        })
        .collect()
}

/// The joint among `shown` (indices into `joints`) whose mark is nearest
/// the point `at` on a view of `size_px`, if any lies within the pick
/// radius.
pub fn joint_at(
    joints: &[SceneJoint],
    shown: &[usize],
    camera: &OrbitCamera,
    at: DVec2,
    size_px: DVec2,
) -> Option<usize> {
    shown
        .iter()
        .filter_map(|&index| {
            let joint = joints.get(index)?;
            let on_screen = camera.project(joint.at, size_px)?;
            let distance = on_screen.distance(at);
            (distance <= JOINT_PICK_RADIUS_PT).then_some((index, distance))
        })
        .min_by(|a, b| a.1.total_cmp(&b.1))
        .map(|(index, _)| index)
}

#[cfg(test)]
mod tests {
    use pitchframe_geometry::{Roof, demo_plan, frame_roof};

    use super::*;

    #[test]
    fn every_joint_is_placed_where_its_two_pieces_meet() {
        let plan = demo_plan().unwrap();
        let outline = plan.outline().unwrap();
        let roof = Roof::solve(&outline).unwrap();
        let frame = frame_roof(&outline, &roof, &plan.framing_settings().unwrap()).unwrap();
        let joints = scene_joints(&frame, DVec3::ZERO);
        assert_eq!(joints.len(), frame.joints.len());
        for joint in &joints {
            let [cut, bearing] = joint.joint.pieces;
            // Derivation: the mark is the mean of corners each within
            // JOINT_FACE_IN of the bearing piece, so on a tight joint it
            // lies within that of both pieces' solids (both are convex
            // near the joint, and the corners lie on the cut piece).
            let near = |piece: usize| frame.pieces[piece].solid.depth_of(joint.at) > -2.0 * JOINT_FACE_IN;
            if joint.tight() {
                assert!(near(bearing), "{:?} is not at {}", joint.at, joint.joint.members[1]);
                assert!(near(cut), "{:?} is not at {}", joint.at, joint.joint.members[0]);
            }
        }
    }
}
