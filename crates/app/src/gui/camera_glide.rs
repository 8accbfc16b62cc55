//! The camera moving smoothly from one aim to another (closing in on a
//! joint), so the framer keeps track of where in the house the view went.

use super::camera::OrbitCamera;

/// How long a glide takes, in seconds: long enough to follow, short
/// enough not to wait for.
pub const GLIDE_S: f64 = 0.45;

/// A camera on its way from `from` to `to`.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct CameraGlide {
    from: OrbitCamera,
    to: OrbitCamera,
    start_s: f64,
}

impl CameraGlide {
    /// A glide starting now (`now_s`, the window's clock).
    pub fn new(from: OrbitCamera, to: OrbitCamera, now_s: f64) -> Self {
        Self { from, to, start_s: now_s }
    }

    /// Where the camera is at `now_s`, and whether it has arrived.
    pub fn at(&self, now_s: f64) -> (OrbitCamera, bool) {
        let t = ((now_s - self.start_s) / GLIDE_S).clamp(0.0, 1.0);
        // Smoothstep: starts and stops gently.
        let eased = t * t * (3.0 - 2.0 * t);
        let mut camera = self.to;
        camera.target = self.from.target.lerp(self.to.target, eased);
        // Distance blends in its logarithm, so a close-up slows as it
        // nears, as a zoom does.
        let (near, far) = (self.from.distance_in.ln(), self.to.distance_in.ln());
        camera.distance_in = (near + (far - near) * eased).exp();
        (camera, t >= 1.0)
    }
}

#[cfg(test)]
mod tests {
    use glam::DVec3;

    use super::super::ViewPreset;
    use super::*;

    #[test]
    fn a_glide_starts_at_its_start_and_ends_at_its_goal() {
        let from = OrbitCamera::framing(DVec3::ZERO, DVec3::splat(400.0), ViewPreset::Corner);
        let mut to = from;
        to.focus(DVec3::splat(90.0), DVec3::splat(110.0));
        let glide = CameraGlide::new(from, to, 10.0);
        let (start, done) = glide.at(10.0);
        assert!(!done);
        assert_eq!(start.target, from.target);
        assert!((start.distance_in - from.distance_in).abs() < 1e-9);
        let (middle, done) = glide.at(10.0 + GLIDE_S / 2.0);
        assert!(!done);
        // Derivation: smoothstep(1/2) = 1/2, so the aim is half way.
        assert!((middle.target - (from.target + to.target) / 2.0).length() < 1e-9);
        let (end, done) = glide.at(10.0 + GLIDE_S * 2.0);
        assert!(done);
        assert!((end.target - to.target).length() < 1e-9);
        assert!((end.distance_in - to.distance_in).abs() < 1e-9);
    }
}
