//! The 3D view: three-d draws the scene inside an egui paint callback.
//!
//! GL resources live in [`Renderer`], made once with the window's GL
//! context and shared with the paint callback through a mutex. The
//! document never holds GL objects; the renderer re-uploads meshes only
//! when it is handed a scene it has not seen.

use std::sync::{Arc, Mutex};

use egui::{PointerButton, Sense};
use glam::{DVec2, DVec3};
use three_d::{
    AmbientLight, Camera, ClearState, Context, CpuMaterial, CpuMesh, DirectionalLight, Gm, Indices, Mesh,
    PhysicalMaterial, Positions, RenderTarget, ScissorBox, Srgba, Vec3, Viewport, degrees,
};

use super::camera::OrbitCamera;
use pitchframe_geometry::RoofLineKind;

use super::scene::{PartKind, Scene};

/// The 3D view's background, as 8-bit sRGB (a pale blue-grey sky that no
/// lit wall colour comes near).
pub const BACKGROUND_RGB: [u8; 3] = [206, 218, 232];

/// The colour a part is drawn in before lighting, as 8-bit sRGB.
pub fn part_rgb(kind: PartKind) -> [u8; 3] {
    match kind {
        // Warm tan: plainly "building" and far from the sky colour.
        PartKind::Walls | PartKind::Gables => [214, 178, 128],
        // A dark clay red, so the roof stands apart from walls and sky.
        PartKind::RoofPlanes => [150, 84, 66],
        PartKind::RoofLines(RoofLineKind::Ridge) => [200, 40, 40],
        PartKind::RoofLines(RoofLineKind::Hip) => [30, 110, 200],
        PartKind::RoofLines(RoofLineKind::Valley) => [40, 160, 70],
    }
}

/// Opacity of the roof planes in the framing view: enough to see the
/// planes' shape, little enough to see the frame through them.
const FRAMING_VIEW_ROOF_ALPHA: u8 = 60;

/// How the scene is shown this frame.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Default)]
pub struct ViewStyle {
    /// The client view: walls and a solid roof, no frame and no labels.
    pub client_view: bool,
}

/// Which view styles show a model.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum ShownIn {
    Both,
    FramingView,
    ClientView,
}

impl ShownIn {
    fn includes(self, style: ViewStyle) -> bool {
        match self {
            ShownIn::Both => true,
            ShownIn::FramingView => !style.client_view,
            ShownIn::ClientView => style.client_view,
        }
    }
}

/// One uploaded mesh with its material.
struct Model {
    shown_in: ShownIn,
    gm: Gm<Mesh, PhysicalMaterial>,
}

/// GL-side state for the 3D view, created once per window.
pub struct Renderer {
    context: Context,
    /// The scene the uploaded meshes came from, to spot a new one.
    uploaded: Option<Arc<Scene>>,
    models: Vec<Model>,
}

impl Renderer {
    /// Wraps the window's GL context.
    pub fn new(gl: Arc<three_d::context::Context>) -> Result<Self, three_d::CoreError> {
        Ok(Self { context: Context::from_gl_context(gl)?, uploaded: None, models: Vec::new() })
    }

    /// Uploads the scene's meshes unless they are already on the GPU.
    fn upload(&mut self, scene: &Arc<Scene>) {
        if self.uploaded.as_ref().is_some_and(|uploaded| Arc::ptr_eq(uploaded, scene)) {
            return;
        }
        self.models.clear();
        for part in scene.parts.iter().filter(|part| part.triangles.len() > 0) {
            let cpu = cpu_mesh(&part.triangles);
            let rgb = part_rgb(part.kind);
            match part.kind {
                PartKind::RoofPlanes => {
                    self.add_model(&cpu, rgb, 255, ShownIn::ClientView);
                    self.add_model(&cpu, rgb, FRAMING_VIEW_ROOF_ALPHA, ShownIn::FramingView);
                }
                PartKind::RoofLines(_) => self.add_model(&cpu, rgb, 255, ShownIn::FramingView),
                PartKind::Walls | PartKind::Gables => self.add_model(&cpu, rgb, 255, ShownIn::Both),
            }
        }
        self.uploaded = Some(Arc::clone(scene));
    }

    fn add_model(&mut self, cpu: &CpuMesh, [r, g, b]: [u8; 3], alpha: u8, shown_in: ShownIn) {
        let description = CpuMaterial {
            albedo: Srgba::new(r, g, b, alpha),
            // Fully rough, not metal: plain diffuse shading, which reads
            // best for painted or timber surfaces.
            roughness: 1.0,
            metallic: 0.0,
            ..Default::default()
        };
        let material = if alpha == 255 {
            PhysicalMaterial::new_opaque(&self.context, &description)
        } else {
            PhysicalMaterial::new_transparent(&self.context, &description)
        };
        let gm = Gm::new(Mesh::new(&self.context, cpu), material);
        self.models.push(Model { shown_in, gm });
    }

    /// Draws the scene into the part of the window egui gave the view.
    fn paint(
        &mut self,
        info: &egui::PaintCallbackInfo,
        painter: &egui_glow::Painter,
        scene: &Arc<Scene>,
        camera: &OrbitCamera,
        style: ViewStyle,
    ) {
        self.upload(scene);
        let [screen_w, screen_h] = info.screen_size_px;
        let target = match painter.intermediate_fbo() {
            Some(fbo) => RenderTarget::from_framebuffer(&self.context, screen_w, screen_h, fbo),
            None => RenderTarget::screen(&self.context, screen_w, screen_h),
        };
        let view_px = info.viewport_in_pixels();
        let viewport = Viewport {
            x: view_px.left_px,
            y: view_px.from_bottom_px,
            width: px(view_px.width_px),
            height: px(view_px.height_px),
        };
        let clip_px = info.clip_rect_in_pixels();
        let scissor = ScissorBox {
            x: clip_px.left_px,
            y: clip_px.from_bottom_px,
            width: px(clip_px.width_px),
            height: px(clip_px.height_px),
        };
        let (near, far) = camera.clip_range_in();
        let three_d_camera = Camera::new_perspective(
            viewport,
            vec3(camera.eye()),
            vec3(camera.target),
            vec3(camera.up()),
            degrees(camera.fov_y_rad.to_degrees() as f32),
            near as f32,
            far as f32,
        );
        // Light from over the viewer's left shoulder, so the two wall faces
        // seen from a corner view shade differently.
        let light_dir = vec3(-camera.right() * 0.5 - camera.up() * 0.3 - DVec3::Z * 0.8);
        let sun = DirectionalLight::new(&self.context, 2.2, Srgba::WHITE, light_dir);
        let sky = AmbientLight::new(&self.context, 0.45, Srgba::WHITE);
        let [r, g, b] = BACKGROUND_RGB.map(|c| f32::from(c) / 255.0);
        target.clear_partially(scissor, ClearState::color_and_depth(r, g, b, 1.0, 1.0)).render_partially(
            scissor,
            &three_d_camera,
            self.models.iter().filter(|model| model.shown_in.includes(style)).map(|model| &model.gm),
            &[&sun, &sky],
        );
        // The framebuffer belongs to egui: hand it back rather than let the
        // render target delete it.
        let _egui_framebuffer = target.into_framebuffer();
    }
}

/// A pixel count from egui (never negative for a visible rect).
fn px(value: i32) -> u32 {
    u32::try_from(value).unwrap_or(0)
}

/// The edge between the f64 geometry and three-d's f32 vectors.
fn vec3(v: DVec3) -> Vec3 {
    Vec3::new(v.x as f32, v.y as f32, v.z as f32)
}

fn cpu_mesh(triangles: &super::scene::Triangles) -> CpuMesh {
    let positions = triangles.corners.iter().map(|&p| vec3(p)).collect();
    let normals = triangles.normals.iter().flat_map(|&n| [vec3(n); 3]).collect();
    CpuMesh {
        positions: Positions::F32(positions),
        indices: Indices::None,
        normals: Some(normals),
        ..Default::default()
    }
}

/// What the user did in the 3D view this frame.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ViewportInput {
    /// Where a click landed, from the view's top-left, in points.
    pub clicked_at: Option<DVec2>,
    /// The view's size, in points.
    pub view_size: DVec2,
}

/// Shows the 3D view filling `ui`, moves the camera by mouse input, and
/// queues the draw.
pub fn viewport_ui(
    ui: &mut egui::Ui,
    renderer: &Arc<Mutex<Renderer>>,
    scene: &Arc<Scene>,
    camera: &mut OrbitCamera,
    style: ViewStyle,
) -> ViewportInput {
    let (rect, response) = ui.allocate_exact_size(ui.available_size(), Sense::click_and_drag());
    let delta = response.drag_delta();
    let delta = DVec2::new(f64::from(delta.x), f64::from(delta.y));
    if response.dragged_by(PointerButton::Primary) {
        camera.orbit(delta);
    } else if response.dragged_by(PointerButton::Secondary) || response.dragged_by(PointerButton::Middle) {
        camera.pan(delta, f64::from(rect.height()));
    }
    if response.hovered() {
        let scroll = ui.input(|input| input.smooth_scroll_delta.y);
        if scroll != 0.0 {
            camera.zoom(f64::from(scroll));
        }
    }
    let clicked_at = response
        .clicked()
        .then(|| response.interact_pointer_pos())
        .flatten()
        .map(|pos| DVec2::new(f64::from(pos.x - rect.left()), f64::from(pos.y - rect.top())));

    let renderer = Arc::clone(renderer);
    let scene = Arc::clone(scene);
    let camera = *camera;
    let callback = egui_glow::CallbackFn::new(move |info, painter| {
        // A poisoned lock means an earlier draw panicked; skipping the draw
        // keeps the rest of the window usable.
        if let Ok(mut renderer) = renderer.lock() {
            renderer.paint(&info, painter, &scene, &camera, style);
        }
    });
    ui.painter().add(egui::PaintCallback { rect, callback: Arc::new(callback) });
    ViewportInput { clicked_at, view_size: DVec2::new(f64::from(rect.width()), f64::from(rect.height())) }
}
