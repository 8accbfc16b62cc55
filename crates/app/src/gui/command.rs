//! What the user asks for during a frame, applied in one place after it.

use glam::DVec2;

use super::ViewPreset;

/// A change asked for during a frame, applied after it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum Command {
    /// Turn the camera to a preset direction.
    SetView(ViewPreset),
    /// Bring the picked member to the middle of the view, close up.
    FocusPicked,
    /// Switch between the framing view and the client view.
    SetClientView(bool),
    /// Select what lies under a click in the 3D view (nothing if empty),
    /// given from the view's top-left in points, with the view's size.
    PickAt {
        /// The click position.
        at: DVec2,
        /// The view's size.
        view_size: DVec2,
    },
}
