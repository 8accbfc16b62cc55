//! The orbit camera: it circles a target point, in plan inches, Z up.

use std::f64::consts::{FRAC_PI_2, PI};

use glam::{DVec2, DVec3};

use super::ViewPreset;

/// Radians of turn per pixel dragged.
const ORBIT_RAD_PER_PX: f64 = 0.008;
/// Highest and lowest elevation; straight up or down would leave no
/// horizontal direction to turn about, so the limits stop just short of
/// the poles except for the top view, which sets the pole exactly.
const MAX_ELEVATION_RAD: f64 = FRAC_PI_2;
const MIN_ELEVATION_RAD: f64 = -FRAC_PI_2 + 0.05;
/// Closest and farthest the camera may come, as multiples of the scene's
/// radius, so zoom can neither pass through the target nor lose the house.
const MIN_DISTANCE_RADII: f64 = 0.05;
const MAX_DISTANCE_RADII: f64 = 20.0;

/// A camera that orbits `target` at `distance`, looking at it.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct OrbitCamera {
    /// The point looked at, in inches.
    pub target: DVec3,
    /// From the target to the eye, in inches.
    pub distance_in: f64,
    /// Plan angle of the eye seen from the target, from +X towards +Y.
    pub azimuth_rad: f64,
    /// Angle of the eye above the level plane through the target.
    pub elevation_rad: f64,
    /// Vertical field of view.
    pub fov_y_rad: f64,
    /// Radius of the sphere holding the scene, which scales zoom limits.
    scene_radius_in: f64,
    /// Centre of that sphere, where preset views aim.
    scene_centre: DVec3,
}

/// A ray from the eye through a point on the screen.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct Ray {
    /// Where the ray starts (the eye), in inches.
    pub origin: DVec3,
    /// Unit direction.
    pub direction: DVec3,
}

impl OrbitCamera {
    /// A camera framing the box `min..max` from the given preset.
    pub fn framing(min: DVec3, max: DVec3, view: ViewPreset) -> Self {
        let fov_y_rad = 35f64.to_radians();
        let scene_radius_in = ((max - min).length() / 2.0).max(1.0);
        let mut camera = Self {
            target: (min + max) / 2.0,
            distance_in: 0.0,
            azimuth_rad: 0.0,
            elevation_rad: 0.0,
            fov_y_rad,
            scene_radius_in,
            scene_centre: (min + max) / 2.0,
        };
        camera.set_view(view);
        camera
    }

    /// Turns the camera to a preset direction, aimed at the middle of the
    /// scene and far enough back to see all of it.
    pub fn set_view(&mut self, view: ViewPreset) {
        self.target = self.scene_centre;
        let (azimuth_deg, elevation_deg) = match view {
            ViewPreset::Corner => (-60.0, 28.0),
            ViewPreset::Top => (-90.0, 90.0),
            ViewPreset::Front => (-90.0, 0.0),
            ViewPreset::Back => (90.0, 0.0),
            ViewPreset::Left => (180.0, 0.0),
            ViewPreset::Right => (0.0, 0.0),
        };
        self.azimuth_rad = f64::to_radians(azimuth_deg);
        self.elevation_rad = f64::to_radians(elevation_deg);
        // The scene's bounding sphere just fits the narrower half-angle of
        // the view; 1.15 leaves a margin round it.
        self.distance_in = 1.15 * self.scene_radius_in / (self.fov_y_rad / 2.0).sin();
    }

    /// Aims at the box `min..max` from the current direction and comes
    /// close enough for it to fill the view.
    pub fn focus(&mut self, min: DVec3, max: DVec3) {
        let radius = ((max - min).length() / 2.0).max(1.0);
        self.target = (min + max) / 2.0;
        self.distance_in = (1.15 * radius / (self.fov_y_rad / 2.0).sin())
            .clamp(MIN_DISTANCE_RADII * self.scene_radius_in, MAX_DISTANCE_RADII * self.scene_radius_in);
    }

    /// Unit vector from the target towards the eye.
    fn backward(&self) -> DVec3 {
        let (sin_el, cos_el) = self.elevation_rad.sin_cos();
        let (sin_az, cos_az) = self.azimuth_rad.sin_cos();
        DVec3::new(cos_el * cos_az, cos_el * sin_az, sin_el)
    }

    /// The eye position, in inches.
    pub fn eye(&self) -> DVec3 {
        self.target + self.distance_in * self.backward()
    }

    /// The screen's up direction in the world: the derivative of the eye
    /// direction with elevation, so it stays defined when looking straight
    /// down.
    pub fn up(&self) -> DVec3 {
        let (sin_el, cos_el) = self.elevation_rad.sin_cos();
        let (sin_az, cos_az) = self.azimuth_rad.sin_cos();
        DVec3::new(-sin_el * cos_az, -sin_el * sin_az, cos_el)
    }

    /// The screen's right direction in the world.
    pub fn right(&self) -> DVec3 {
        (-self.backward()).cross(self.up())
    }

    /// Near and far clip distances that hold the whole scene.
    pub fn clip_range_in(&self) -> (f64, f64) {
        let near = (self.distance_in - 2.0 * self.scene_radius_in).max(self.distance_in * 0.01);
        let far = self.distance_in + 2.0 * self.scene_radius_in;
        (near, far)
    }

    /// Turns the camera by a mouse drag of `delta_px` (right and down positive).
    pub fn orbit(&mut self, delta_px: DVec2) {
        self.azimuth_rad = (self.azimuth_rad - delta_px.x * ORBIT_RAD_PER_PX).rem_euclid(2.0 * PI);
        self.elevation_rad =
            (self.elevation_rad + delta_px.y * ORBIT_RAD_PER_PX).clamp(MIN_ELEVATION_RAD, MAX_ELEVATION_RAD);
    }

    /// Slides the target so the scene follows a drag of `delta_px` in a
    /// view `viewport_height_px` tall.
    pub fn pan(&mut self, delta_px: DVec2, viewport_height_px: f64) {
        let in_per_px = 2.0 * self.distance_in * (self.fov_y_rad / 2.0).tan() / viewport_height_px.max(1.0);
        self.target += in_per_px * (-delta_px.x * self.right() + delta_px.y * self.up());
    }

    /// Moves towards the target for positive `scroll_px`, away for negative.
    pub fn zoom(&mut self, scroll_px: f64) {
        let distance = self.distance_in * (-scroll_px * 0.002).exp();
        self.distance_in = distance
            .clamp(MIN_DISTANCE_RADII * self.scene_radius_in, MAX_DISTANCE_RADII * self.scene_radius_in);
    }

    /// The tangent of half the vertical view angle for a view of
    /// `size_px`: a view taller than wide widens its vertical angle so the
    /// horizontal one stays the camera's, and the house still fits across.
    fn half_height(&self, size_px: DVec2) -> f64 {
        let base = (self.fov_y_rad / 2.0).tan();
        let aspect = size_px.x / size_px.y.max(1.0);
        if aspect > 0.0 && aspect < 1.0 { base / aspect } else { base }
    }

    /// The vertical view angle drawn in a view of `size_px`.
    pub fn fov_y_for(&self, size_px: DVec2) -> f64 {
        2.0 * self.half_height(size_px).atan()
    }

    /// Where `point` shows in a view of `size_px`, from its top-left;
    /// `None` when it lies behind the eye.
    pub fn project(&self, point: DVec3, size_px: DVec2) -> Option<DVec2> {
        let relative = point - self.eye();
        let depth = relative.dot(-self.backward());
        if depth <= 0.0 {
            return None;
        }
        let half_height = self.half_height(size_px);
        let aspect = size_px.x / size_px.y.max(1.0);
        let ndc_x = relative.dot(self.right()) / (depth * half_height * aspect);
        let ndc_y = relative.dot(self.up()) / (depth * half_height);
        Some(DVec2::new((ndc_x + 1.0) / 2.0 * size_px.x, (1.0 - ndc_y) / 2.0 * size_px.y))
    }

    /// The ray through `pixel` (from the top-left of a view of `size_px`).
    pub fn ray(&self, pixel: DVec2, size_px: DVec2) -> Ray {
        let half_height = self.half_height(size_px);
        let aspect = size_px.x / size_px.y.max(1.0);
        // Normalised device coordinates: -1..1, y up.
        let ndc_x = 2.0 * pixel.x / size_px.x.max(1.0) - 1.0;
        let ndc_y = 1.0 - 2.0 * pixel.y / size_px.y.max(1.0);
        let direction =
            -self.backward() + ndc_x * half_height * aspect * self.right() + ndc_y * half_height * self.up();
        Ray { origin: self.eye(), direction: direction.normalize() }
    }
}

#[cfg(test)]
mod tests {
    use approx::assert_abs_diff_eq;

    use super::*;

    fn camera(view: ViewPreset) -> OrbitCamera {
        OrbitCamera::framing(DVec3::ZERO, DVec3::new(480.0, 288.0, 96.0), view)
    }

    #[test]
    fn front_view_looks_along_plus_y() {
        // Derivation: front is the low-Y side, so the eye sits at -Y.
        let cam = camera(ViewPreset::Front);
        let forward = (cam.target - cam.eye()).normalize();
        assert_abs_diff_eq!(forward.y, 1.0, epsilon = 1e-12);
        assert_abs_diff_eq!(cam.up().z, 1.0, epsilon = 1e-12);
    }

    #[test]
    fn top_view_has_plan_y_up_on_screen() {
        // Derivation: looking straight down with azimuth -90 deg, the
        // screen's up is the plan's +Y, so the plan reads as drawn.
        let cam = camera(ViewPreset::Top);
        assert_abs_diff_eq!((cam.target - cam.eye()).normalize().z, -1.0, epsilon = 1e-12);
        assert_abs_diff_eq!(cam.up().y, 1.0, epsilon = 1e-12);
        assert_abs_diff_eq!(cam.right().x, 1.0, epsilon = 1e-12);
    }

    #[test]
    fn centre_ray_hits_target_and_corner_rays_spread() {
        let cam = camera(ViewPreset::Corner);
        let size = DVec2::new(800.0, 600.0);
        let ray = cam.ray(size / 2.0, size);
        let to_target = (cam.target - ray.origin).normalize();
        assert_abs_diff_eq!(ray.direction.dot(to_target), 1.0, epsilon = 1e-12);
        // The top edge's ray makes half the vertical field of view with
        // the centre ray.
        let top = cam.ray(DVec2::new(400.0, 0.0), size);
        let angle = top.direction.dot(ray.direction).acos();
        assert_abs_diff_eq!(angle, cam.fov_y_rad / 2.0, epsilon = 1e-9);
    }

    #[test]
    fn a_view_taller_than_wide_keeps_the_horizontal_angle() {
        let cam = camera(ViewPreset::Corner);
        let tall = DVec2::new(400.0, 800.0);
        let left = cam.ray(DVec2::new(0.0, 400.0), tall);
        let centre = cam.ray(DVec2::new(200.0, 400.0), tall);
        // Derivation: across a view half as wide as tall, the half-angle
        // across is the camera's half vertical angle, as in a square view.
        assert_abs_diff_eq!(left.direction.dot(centre.direction).acos(), cam.fov_y_rad / 2.0, epsilon = 1e-9);
        let back = cam.project(left.origin + left.direction * 300.0, tall).unwrap();
        assert_abs_diff_eq!(back.x, 0.0, epsilon = 1e-9);
    }

    #[test]
    fn projecting_a_point_on_a_pixel_ray_gives_that_pixel_back() {
        let cam = camera(ViewPreset::Corner);
        let size = DVec2::new(800.0, 600.0);
        for pixel in [DVec2::new(10.0, 20.0), DVec2::new(400.0, 300.0), DVec2::new(790.0, 555.0)] {
            let ray = cam.ray(pixel, size);
            let back = cam.project(ray.origin + ray.direction * 500.0, size).unwrap();
            assert_abs_diff_eq!(back.x, pixel.x, epsilon = 1e-9);
            assert_abs_diff_eq!(back.y, pixel.y, epsilon = 1e-9);
        }
        // Behind the eye there is nothing to show.
        assert_eq!(cam.project(cam.eye() + (cam.eye() - cam.target), size), None);
    }

    #[test]
    fn focus_brings_a_small_box_to_the_middle_of_the_view() {
        let mut cam = camera(ViewPreset::Corner);
        let (min, max) = (DVec3::new(100.0, 10.0, 96.0), DVec3::new(110.0, 12.0, 104.0));
        cam.focus(min, max);
        let size = DVec2::new(800.0, 600.0);
        let centre = cam.project((min + max) / 2.0, size).unwrap();
        assert_abs_diff_eq!(centre.x, 400.0, epsilon = 1e-9);
        assert_abs_diff_eq!(centre.y, 300.0, epsilon = 1e-9);
        // Every corner of the box stays inside the view.
        for corner in [min, max, DVec3::new(min.x, max.y, min.z), DVec3::new(max.x, min.y, max.z)] {
            let at = cam.project(corner, size).unwrap();
            assert!(at.x > 0.0 && at.x < 800.0 && at.y > 0.0 && at.y < 600.0, "{at:?} outside the view");
        }
    }

    #[test]
    fn a_preset_view_after_a_focus_shows_the_whole_scene_again() {
        let mut cam = camera(ViewPreset::Corner);
        let before = cam;
        cam.focus(DVec3::new(100.0, 10.0, 96.0), DVec3::new(110.0, 12.0, 104.0));
        cam.set_view(ViewPreset::Corner);
        assert_eq!(cam, before);
    }

    #[test]
    fn orbit_stops_at_the_poles_and_zoom_stays_in_range() {
        let mut cam = camera(ViewPreset::Corner);
        cam.orbit(DVec2::new(0.0, 1.0e6));
        assert!(cam.elevation_rad <= MAX_ELEVATION_RAD);
        cam.orbit(DVec2::new(0.0, -1.0e6));
        assert!(cam.elevation_rad >= MIN_ELEVATION_RAD);
        cam.zoom(1.0e6);
        assert!(cam.distance_in > 0.0);
        let near = cam.distance_in;
        cam.zoom(-1.0e6);
        assert!(cam.distance_in > near);
    }

    #[test]
    fn pan_moves_the_target_by_the_dragged_amount_at_the_target() {
        let mut cam = camera(ViewPreset::Front);
        let before = cam.target;
        let height_px = 600.0;
        cam.pan(DVec2::new(100.0, 0.0), height_px);
        // Derivation: at the target, the view is 2 d tan(fov/2) tall, so
        // 100 px moves the target that many sixhundredths of it, leftwards
        // in the world (the scene follows the mouse to the right).
        let expected = 100.0 * 2.0 * cam.distance_in * (cam.fov_y_rad / 2.0).tan() / height_px;
        assert_abs_diff_eq!(before.x - cam.target.x, expected, epsilon = 1e-9);
    }
}
