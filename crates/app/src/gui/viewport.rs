//! The 3D view: three-d draws the scene inside an egui paint callback.
//!
//! GL resources live in [`Renderer`], made once with the window's GL
//! context and shared with the paint callback through a mutex. The
//! document never holds GL objects; the renderer re-uploads meshes only
//! when it is handed a scene (or a pick) it has not seen, and draws the
//! scene again only when the scene, the camera, the style, the pick or the
//! view's size changed: other frames copy the last drawing.

use std::sync::{Arc, Mutex};

use egui::{PointerButton, Sense};
use glam::{DVec2, DVec3};
use three_d::{
    Blend, Camera, ClearState, ColorMaterial, ColorTexture, Context, CopyEffect, CpuMaterial, CpuMesh,
    DepthTest, DepthTexture, DepthTexture2D, Gm, Indices, Interpolation, Mesh, Object, Positions,
    RenderStates, RenderTarget, ScissorBox, Srgba, Texture2D, Vec3, Viewport, Wrapping, WriteMask, degrees,
};

use super::camera::OrbitCamera;
use super::export::{MAX_PICTURE_SIDE_PX, Pixels};
use super::joints::joint_at;
use super::palette;
use super::pick::pick;
use super::retire::retire;
use super::scene::{PartKind, Scene, ScenePiece, Triangles, is_cut_face};
use super::shading::ShadedMaterial;

/// Opacity of the roof planes in the framing view: enough to see the
/// planes' shape, little enough to see the frame through them.
const FRAMING_VIEW_ROOF_ALPHA: u8 = 60;

/// How far the picked piece's overlay stands off its faces, in inches:
/// enough to win the depth test over the piece itself at any zoom the
/// camera allows, far too little to see.
const OVERLAY_STANDOFF_IN: f64 = 0.05;

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
    gm: Gm<Mesh, ShadedMaterial>,
}

/// The picked piece drawn over itself: a lit highlight for its board
/// faces and an unlit colour per cut kind for its cut faces.
struct Highlight {
    /// Which scene and piece this was built for.
    scene: Arc<Scene>,
    piece: usize,
    body: Option<Gm<Mesh, ShadedMaterial>>,
    cuts: Vec<Gm<Mesh, ColorMaterial>>,
    /// The other pieces cut to the same member, so the framer sees where
    /// each one goes.
    siblings: Option<Gm<Mesh, ShadedMaterial>>,
}

/// GL-side state for the 3D view, created once per window.
pub struct Renderer {
    context: Context,
    /// The scenes the uploaded walls and roof, and the uploaded members,
    /// came from, to spot a new one. While a corner is dragged the roof is
    /// the dragged plan's and the members come a few frames later, so the
    /// two are uploaded on their own.
    uploaded: [Option<Arc<Scene>>; 2],
    /// The walls and roof, then the members.
    models: [Vec<Model>; 2],
    highlight: Option<Highlight>,
    /// The last drawing of the view.
    drawn: Option<DrawnView>,
    /// The last drawing of a large frame's members alone, with their
    /// depths (its key's walls-and-roof scene is 0).
    members_drawn: Option<DrawnView>,
    /// How many triangles the uploaded members have.
    member_triangles: usize,
}

impl Renderer {
    /// Wraps the window's GL context.
    pub fn new(gl: Arc<three_d::context::Context>) -> Result<Self, three_d::CoreError> {
        Ok(Self {
            context: Context::from_gl_context(gl)?,
            uploaded: [None, None],
            models: [Vec::new(), Vec::new()],
            highlight: None,
            drawn: None,
            members_drawn: None,
            member_triangles: 0,
        })
    }

    /// Uploads the walls and roof of `roof_scene` and the members of
    /// `frame_scene`, each unless already on the GPU.
    fn upload(&mut self, [roof_scene, frame_scene]: [&Arc<Scene>; 2]) {
        for (slot, scene) in [roof_scene, frame_scene].into_iter().enumerate() {
            if self.uploaded[slot].as_ref().is_some_and(|uploaded| Arc::ptr_eq(uploaded, scene)) {
                continue;
            }
            let mut models = Vec::new();
            let wanted = |kind: PartKind| matches!(kind, PartKind::Members(_)) == (slot == 1);
            for part in scene.parts.iter().filter(|part| wanted(part.kind) && part.triangles.len() > 0) {
                let cpu = cpu_mesh(&part.triangles);
                let rgb = palette::part(part.kind);
                let (alpha, shown_in) = match part.kind {
                    PartKind::RoofPlanes => {
                        models.push(self.lit_model(&cpu, rgb, FRAMING_VIEW_ROOF_ALPHA, ShownIn::FramingView));
                        (255, ShownIn::ClientView)
                    }
                    PartKind::RoofLines(_) | PartKind::Members(_) => (255, ShownIn::FramingView),
                    PartKind::Walls | PartKind::Gables => (255, ShownIn::Both),
                };
                let mut model = self.lit_model(&cpu, rgb, alpha, shown_in);
                model.gm.material.cull_back = matches!(part.kind, PartKind::Members(_));
                models.push(model);
            }
            if slot == 1 {
                self.member_triangles = scene
                    .parts
                    .iter()
                    .filter(|part| wanted(part.kind))
                    .map(|part| part.triangles.len())
                    .sum();
            }
            self.models[slot] = models;
            // The renderer often holds a scene last: let it go elsewhere.
            if let Some(old) = self.uploaded[slot].replace(Arc::clone(scene)) {
                retire(old);
            }
        }
    }

    fn lit_model(&self, cpu: &CpuMesh, rgb: [u8; 3], alpha: u8, shown_in: ShownIn) -> Model {
        Model { shown_in, gm: Gm::new(Mesh::new(&self.context, cpu), self.lit_material(rgb, alpha)) }
    }

    fn lit_material(&self, [r, g, b]: [u8; 3], alpha: u8) -> ShadedMaterial {
        ShadedMaterial::new(Srgba::new(r, g, b, alpha))
    }

    /// Points every lit material's light along `direction`.
    fn set_light(&mut self, direction: Vec3) {
        let highlight =
            self.highlight.iter_mut().flat_map(|h| h.body.iter_mut().chain(h.siblings.iter_mut()));
        for gm in self.models.iter_mut().flatten().map(|model| &mut model.gm).chain(highlight) {
            gm.material.light_direction = direction;
        }
    }

    /// Builds the overlay for the picked piece unless it is already built.
    fn update_highlight(&mut self, scene: &Arc<Scene>, picked: Option<usize>) {
        let current = self.highlight.as_ref().map(|h| (Arc::as_ptr(&h.scene), h.piece));
        let wanted = picked.map(|piece| (Arc::as_ptr(scene), piece));
        if current == wanted {
            return;
        }
        let old = self.highlight.take();
        self.highlight = picked.and_then(|index| scene.pieces.get(index).map(|piece| (index, piece))).map(
            |(index, piece)| {
                let body = overlay_triangles(piece, |tag| !is_cut_face(tag));
                let body = (body.len() > 0).then(|| {
                    let mut material = self.lit_material(palette::HIGHLIGHT, 255);
                    // Glow a little so the pick stands out even in shadow.
                    let [r, g, b] = palette::HIGHLIGHT.map(|c| c / 3);
                    material.emissive = Srgba::new(r, g, b, 255);
                    Gm::new(Mesh::new(&self.context, &cpu_mesh(&body)), material)
                });
                let cuts = palette::CUT_TAGS
                    .iter()
                    .filter_map(|&tag| {
                        let faces = overlay_triangles(piece, |face_tag| face_tag == tag);
                        (faces.len() > 0).then(|| {
                            let [r, g, b] = palette::cut(tag);
                            let material = ColorMaterial {
                                color: Srgba::new(r, g, b, 255),
                                ..ColorMaterial::new_opaque(&self.context, &CpuMaterial::default())
                            };
                            Gm::new(Mesh::new(&self.context, &cpu_mesh(&faces)), material)
                        })
                    })
                    .collect();
                let mut siblings = Triangles::default();
                let same_member = scene
                    .pieces
                    .iter()
                    .enumerate()
                    .filter(|&(other, p)| other != index && p.label == piece.label);
                for (_, sibling) in same_member {
                    let faces = overlay_triangles(sibling, |_| true);
                    siblings.corners.extend(faces.corners);
                    siblings.normals.extend(faces.normals);
                }
                let siblings = (siblings.len() > 0).then(|| {
                    Gm::new(
                        Mesh::new(&self.context, &cpu_mesh(&siblings)),
                        self.lit_material(palette::SAME_MEMBER, 255),
                    )
                });
                Highlight { scene: Arc::clone(scene), piece: index, body, cuts, siblings }
            },
        );
        if let Some(old) = old {
            retire(old.scene);
        }
    }

    /// What decides the drawing of `frame` in a view of `size_px`, with its
    /// meshes and overlay uploaded.
    fn prepare(&mut self, frame: &FrameInput, size_px: [u32; 2]) -> ViewKey {
        self.upload([&frame.roof_scene, &frame.scene]);
        let picked = if frame.style.client_view { None } else { frame.picked };
        self.update_highlight(&frame.scene, picked);
        ViewKey {
            scenes: [Arc::as_ptr(&frame.roof_scene) as usize, Arc::as_ptr(&frame.scene) as usize],
            camera: frame.camera,
            style: frame.style,
            picked,
            size_px,
        }
    }

    /// Draws the view's texture while the window is still being laid out
    /// (the window's GL context is current then), so that software GL's
    /// rasterizer threads fill it while this thread lays out and hands over
    /// the rest of the window, rather than after; the paint callback then
    /// finds it drawn and copies it.
    fn draw_ahead(&mut self, frame: &FrameInput, size_px: [u32; 2]) {
        let key = self.prepare(frame, size_px);
        self.drawn = match self.drawn.take() {
            Some(drawn) if drawn.key == key => Some(drawn),
            earlier => {
                let drawn = self.draw_view(key, earlier);
                // GL takes up a change of framebuffer at the next draw: a
                // clear of one pixel of the window's depths (which nothing
                // reads; egui clears the window before painting it) sends
                // the view's drawing to the rasterizer threads now.
                let pixel = ScissorBox { x: 0, y: 0, width: 1, height: 1 };
                RenderTarget::screen(&self.context, 1, 1).clear_partially(pixel, ClearState::depth(1.0));
                Some(drawn)
            }
        };
    }

    /// Draws the scene into the part of the window egui gave the view.
    fn paint(&mut self, info: &egui::PaintCallbackInfo, painter: &egui_glow::Painter, frame: &FrameInput) {
        let target = window_target(&self.context, info, painter);
        let view_px = info.viewport_in_pixels();
        let viewport = Viewport {
            x: view_px.left_px,
            y: view_px.from_bottom_px,
            width: px(view_px.width_px),
            height: px(view_px.height_px),
        };
        let scissor = clip_scissor(info);
        let key = self.prepare(frame, [viewport.width, viewport.height]);
        let drawn = match self.drawn.take() {
            Some(drawn) if drawn.key == key => drawn,
            earlier => self.draw_view(key, earlier),
        };
        // Software GL spends most of a frame on the scene's triangles; a
        // frame where only the panels changed copies the last drawing.
        let three_d_camera = three_d_camera(&frame.camera, viewport);
        let copy = CopyEffect { write_mask: WriteMask::COLOR, blend: Blend::Disabled };
        target.apply_screen_effect_partially(
            scissor,
            &copy,
            &three_d_camera,
            &[],
            Some(ColorTexture::Single(&drawn.colour)),
            None,
        );
        self.drawn = Some(drawn);
        // The framebuffer belongs to egui: hand it back rather than let the
        // render target delete it.
        let _egui_framebuffer = target.into_framebuffer();
    }

    /// Draws the scene as `key` says into a texture of the view's size,
    /// reusing `earlier`'s textures when the size is the same.
    fn draw_view(&mut self, key: ViewKey, earlier: Option<DrawnView>) -> DrawnView {
        let [width, height] = key.size_px.map(|side| side.max(1));
        let (colour, depth) = match earlier {
            Some(drawn) if drawn.key.size_px == key.size_px => (drawn.colour, drawn.depth),
            _ => view_textures(&self.context, width, height),
        };
        self.set_light(light_direction(&key.camera));
        let camera = three_d_camera(&key.camera, Viewport::new_at_origo(width, height));
        if key.style.client_view || self.member_triangles < LAYERED_FROM_TRIANGLES {
            RenderTarget::new(colour.as_color_target(None), depth.as_depth_target())
                .clear(clear_state())
                .render(&camera, self.objects(key.style), &[]);
            self.members_drawn = None;
            return DrawnView { key, colour, depth };
        }
        // A drag changes the roof every frame and a large frame's members
        // only when the framing thread has laid them out again: the members
        // are drawn into a layer of their own, with its depths, and the
        // walls and roof go over a copy of it. Opaque faces meet by depth
        // and the see-through roof planes go last either way, so the
        // drawing is the one a single pass makes.
        let layer_key = ViewKey { scenes: [0, key.scenes[1]], ..key };
        let layer = match self.members_drawn.take() {
            Some(layer) if layer.key == layer_key => layer,
            earlier => {
                let (layer_colour, layer_depth) = match earlier {
                    Some(layer) if layer.key.size_px == key.size_px => (layer.colour, layer.depth),
                    _ => view_textures(&self.context, width, height),
                };
                RenderTarget::new(layer_colour.as_color_target(None), layer_depth.as_depth_target())
                    .clear(clear_state())
                    .render(&camera, self.member_objects(key.style), &[]);
                DrawnView { key: layer_key, colour: layer_colour, depth: layer_depth }
            }
        };
        let copy = CopyEffect { write_mask: WriteMask::COLOR_AND_DEPTH, blend: Blend::Disabled };
        RenderTarget::new(colour.as_color_target(None), depth.as_depth_target())
            .apply_screen_effect(
                &copy,
                &camera,
                &[],
                Some(ColorTexture::Single(&layer.colour)),
                Some(DepthTexture::Single(&layer.depth)),
            )
            .render(&camera, self.roof_objects(key.style), &[]);
        self.members_drawn = Some(layer);
        DrawnView { key, colour, depth }
    }
}

/// The members' triangle count from which the 3D view draws them in a
/// layer of their own (see `Renderer::draw_view`): below it a second pass
/// and a copy cost more than drawing the members again each time. The
/// demo house's members have about 2,800; the twenty-wing plan's about
/// 77,000.
const LAYERED_FROM_TRIANGLES: usize = 20_000;

/// Everything that decides what the 3D view's drawing looks like.
#[derive(Debug, Clone, Copy, PartialEq)]
struct ViewKey {
    /// The scenes drawn, walls and roof then members (their addresses: a
    /// new scene is a new `Arc`).
    scenes: [usize; 2],
    camera: OrbitCamera,
    style: ViewStyle,
    picked: Option<usize>,
    size_px: [u32; 2],
}

/// The last drawing of the 3D view, kept to copy while nothing in it changes.
struct DrawnView {
    key: ViewKey,
    colour: Texture2D,
    depth: DepthTexture2D,
}

impl Renderer {
    /// The walls and roof shown in `style`.
    fn roof_objects(&self, style: ViewStyle) -> Vec<&dyn Object> {
        let models = self.models[0].iter().filter(|model| model.shown_in.includes(style));
        models.map(|model| &model.gm as &dyn Object).collect()
    }

    /// The members shown in `style`, with the picked piece's overlay.
    fn member_objects(&self, style: ViewStyle) -> Vec<&dyn Object> {
        let models = self.models[1].iter().filter(|model| model.shown_in.includes(style));
        let mut objects: Vec<&dyn Object> = models.map(|model| &model.gm as &dyn Object).collect();
        if let Some(highlight) = &self.highlight {
            objects.extend(highlight.body.iter().map(|gm| gm as &dyn Object));
            objects.extend(highlight.cuts.iter().map(|gm| gm as &dyn Object));
            objects.extend(highlight.siblings.iter().map(|gm| gm as &dyn Object));
        }
        objects
    }

    /// The models shown in `style`, with the picked piece's overlay.
    fn objects(&self, style: ViewStyle) -> Vec<&dyn Object> {
        let mut objects: Vec<&dyn Object> = self
            .models
            .iter()
            .flatten()
            .filter(|model| model.shown_in.includes(style))
            .map(|model| &model.gm as &dyn Object)
            .collect();
        if let Some(highlight) = &self.highlight {
            objects.extend(highlight.body.iter().map(|gm| gm as &dyn Object));
            objects.extend(highlight.cuts.iter().map(|gm| gm as &dyn Object));
            objects.extend(highlight.siblings.iter().map(|gm| gm as &dyn Object));
        }
        objects
    }

    /// Draws the view as `camera` sees it into a picture of `size_px`
    /// (width, height), off screen, with the same models and lights as the
    /// window. Needs the window's GL context to be current, as it is while
    /// the app builds a frame.
    pub fn picture(
        &mut self,
        scene: &Arc<Scene>,
        camera: &OrbitCamera,
        style: ViewStyle,
        picked: Option<usize>,
        size_px: [u32; 2],
    ) -> Result<Pixels, String> {
        let [width, height] = size_px;
        if width == 0 || height == 0 || width > MAX_PICTURE_SIDE_PX || height > MAX_PICTURE_SIDE_PX {
            return Err(format!("{width} x {height} pixels is outside 1 to {MAX_PICTURE_SIDE_PX} a side"));
        }
        self.upload([scene, scene]);
        let picked = if style.client_view { None } else { picked };
        self.update_highlight(scene, picked);
        let (colour, depth) = view_textures(&self.context, width, height);
        self.set_light(light_direction(camera));
        let three_d_camera = three_d_camera(camera, Viewport::new_at_origo(width, height));
        let rgba: Vec<[u8; 4]> = RenderTarget::new(colour.as_color_target(None), depth.as_depth_target())
            .clear(clear_state())
            .render(&three_d_camera, self.objects(style), &[])
            .read_color();
        Ok(Pixels { width, height, rgba: rgba.into_iter().flatten().collect() })
    }
}

/// A colour and a depth texture of `width` x `height` pixels to draw the
/// view into off screen.
fn view_textures(context: &Context, width: u32, height: u32) -> (Texture2D, DepthTexture2D) {
    let colour = Texture2D::new_empty::<[u8; 4]>(
        context,
        width,
        height,
        Interpolation::Nearest,
        Interpolation::Nearest,
        None,
        Wrapping::ClampToEdge,
        Wrapping::ClampToEdge,
    );
    let depth =
        DepthTexture2D::new::<f32>(context, width, height, Wrapping::ClampToEdge, Wrapping::ClampToEdge);
    (colour, depth)
}

/// The direction the view's light travels: from over the viewer's left
/// shoulder, so the two wall faces seen from a corner view shade differently.
fn light_direction(camera: &OrbitCamera) -> Vec3 {
    vec3(-camera.right() * 0.5 - camera.up() * 0.3 - DVec3::Z * 0.8)
}

/// The background colour and a cleared depth buffer.
fn clear_state() -> ClearState {
    let [r, g, b] = palette::BACKGROUND.map(|c| f32::from(c) / 255.0);
    ClearState::color_and_depth(r, g, b, 1.0, 1.0)
}

/// three-d's camera for the orbit camera drawing into `viewport`.
fn three_d_camera(camera: &OrbitCamera, viewport: Viewport) -> Camera {
    let (near, far) = camera.clip_range_in();
    let size = DVec2::new(f64::from(viewport.width), f64::from(viewport.height));
    Camera::new_perspective(
        viewport,
        vec3(camera.eye()),
        vec3(camera.target),
        vec3(camera.up()),
        degrees(camera.fov_y_for(size).to_degrees() as f32),
        near as f32,
        far as f32,
    )
}

/// The piece's triangles whose face tag passes `keep`, stood off their
/// faces so they draw over the piece.
fn overlay_triangles(
    piece: &ScenePiece,
    keep: impl Fn(pitchframe_geometry::framing::FaceTag) -> bool,
) -> Triangles {
    let mut out = Triangles::default();
    let source = &piece.triangles;
    for ((corners, normal), tag) in source.corners.chunks_exact(3).zip(&source.normals).zip(&piece.face_tags)
    {
        if keep(*tag) {
            out.corners.extend(corners.iter().map(|&p| p + *normal * OVERLAY_STANDOFF_IN));
            out.normals.push(*normal);
        }
    }
    out
}

/// A pixel count from egui (never negative for a visible rect).
fn px(value: i32) -> u32 {
    u32::try_from(value).unwrap_or(0)
}

/// The edge between the f64 geometry and three-d's f32 vectors.
fn vec3(v: DVec3) -> Vec3 {
    Vec3::new(v.x as f32, v.y as f32, v.z as f32)
}

/// The triangles as an indexed mesh. A face of `n` corners is drawn as a
/// fan of `n - 2` triangles, each sharing two corners and the normal with
/// the one before it: those corners are sent once, so software OpenGL runs
/// the vertex shader `n` times a face rather than `3 (n - 2)`. The triangles
/// and their order are unchanged.
fn cpu_mesh(triangles: &Triangles) -> CpuMesh {
    if u32::try_from(triangles.corners.len()).is_err() {
        return unindexed_mesh(triangles);
    }
    let mut positions: Vec<Vec3> = Vec::with_capacity(triangles.corners.len());
    let mut normals: Vec<Vec3> = Vec::with_capacity(triangles.corners.len());
    let mut indices: Vec<u32> = Vec::with_capacity(triangles.corners.len());
    let mut previous: Option<(Vec3, [u32; 3])> = None;
    for (corners, &normal) in triangles.corners.chunks_exact(3).zip(&triangles.normals) {
        let normal = vec3(normal);
        let mut these = [0; 3];
        for (slot, &corner) in these.iter_mut().zip(corners) {
            let corner = vec3(corner);
            let shared = previous.filter(|&(n, _)| n == normal).and_then(|(_, before)| {
                before.into_iter().find(|&index| positions[index as usize] == corner)
            });
            *slot = shared.unwrap_or_else(|| {
                positions.push(corner);
                normals.push(normal);
                // Fewer corners than u32 holds: checked above.
                (positions.len() - 1) as u32
            });
        }
        indices.extend_from_slice(&these);
        previous = Some((normal, these));
    }
    CpuMesh {
        positions: Positions::F32(positions),
        indices: Indices::U32(indices),
        normals: Some(normals),
        ..Default::default()
    }
}

/// The triangles as a mesh of three corners each, for one too large to index.
fn unindexed_mesh(triangles: &Triangles) -> CpuMesh {
    let positions = triangles.corners.iter().map(|&p| vec3(p)).collect();
    let normals = triangles.normals.iter().flat_map(|&n| [vec3(n); 3]).collect();
    CpuMesh {
        positions: Positions::F32(positions),
        indices: Indices::None,
        normals: Some(normals),
        ..Default::default()
    }
}

/// Everything one draw needs, handed to the paint callback.
struct FrameInput {
    /// The scene whose walls and roof are drawn.
    roof_scene: Arc<Scene>,
    /// The scene whose members are drawn and picked.
    scene: Arc<Scene>,
    camera: OrbitCamera,
    style: ViewStyle,
    picked: Option<usize>,
}

/// The joints marked over the 3D view.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct JointMarks {
    /// Indices into the scene's joints of those marked.
    pub shown: Vec<usize>,
    /// The picked joint, drawn larger.
    pub picked: Option<usize>,
}

/// What the user did in the 3D view this frame.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct ViewportInput {
    /// Where a click landed, from the view's top-left, in points.
    pub clicked_at: Option<DVec2>,
    /// Whether the user turned, moved or zoomed the camera.
    pub moved_camera: bool,
    /// The view's size, in points.
    pub view_size: DVec2,
}

/// Shows the 3D view filling `ui`, moves the camera by mouse input, and
/// queues the draw of the walls and roof of the first scene and the
/// members of the second; `picked` is the piece to highlight.
pub fn viewport_ui(
    ui: &mut egui::Ui,
    renderer: &Arc<Mutex<Renderer>>,
    [roof_scene, scene]: [&Arc<Scene>; 2],
    camera: &mut OrbitCamera,
    style: ViewStyle,
    picked: Option<usize>,
    marks: &JointMarks,
) -> ViewportInput {
    let (rect, response) = ui.allocate_exact_size(ui.available_size(), Sense::click_and_drag());
    let delta = response.drag_delta();
    let delta = DVec2::new(f64::from(delta.x), f64::from(delta.y));
    let mut moved_camera = false;
    if response.dragged_by(PointerButton::Primary) {
        camera.orbit(delta);
        moved_camera = true;
    } else if response.dragged_by(PointerButton::Secondary) || response.dragged_by(PointerButton::Middle) {
        camera.pan(delta, f64::from(rect.height()));
        moved_camera = true;
    }
    if response.hovered() {
        let scroll = ui.input(|input| input.smooth_scroll_delta.y);
        if scroll != 0.0 {
            camera.zoom(f64::from(scroll));
            moved_camera = true;
        }
    }
    let clicked_at = response
        .clicked()
        .then(|| response.interact_pointer_pos())
        .flatten()
        .map(|pos| DVec2::new(f64::from(pos.x - rect.left()), f64::from(pos.y - rect.top())));

    // Name the member under the pointer, so a framer can find one before
    // picking it.
    let hovered = response
        .hover_pos()
        .filter(|_| !style.client_view && !response.dragged())
        .and_then(|pos| {
            let at = DVec2::new(f64::from(pos.x - rect.left()), f64::from(pos.y - rect.top()));
            let size = DVec2::new(f64::from(rect.width()), f64::from(rect.height()));
            pick(scene, &camera.ray(at, size))
        })
        .and_then(|hit| scene.pieces.get(hit.piece));
    // A joint's mark under the pointer says which joint a click checks.
    let hovered_joint =
        response.hover_pos().filter(|_| !style.client_view && !response.dragged()).and_then(|pos| {
            let at = DVec2::new(f64::from(pos.x - rect.left()), f64::from(pos.y - rect.top()));
            let size = DVec2::new(f64::from(rect.width()), f64::from(rect.height()));
            joint_at(scene.joints(), &marks.shown, camera, at, size)
                .and_then(|index| scene.joints().get(index))
        });
    if let Some(joint) = hovered_joint {
        let [cut, bearing] = &joint.joint.members;
        let fit = if joint.tight() { "fits within 1/64 in" } else { "off by more than 1/64 in" };
        response
            .clone()
            .on_hover_text_at_pointer(format!("Joint {cut} on {bearing}, {fit}: click to check it"));
    } else if let Some(piece) = hovered {
        let text = format!("{}  {}", piece.label, palette::member_name(piece.kind));
        response.clone().on_hover_text_at_pointer(text);
    }

    let frame = FrameInput {
        roof_scene: Arc::clone(roof_scene),
        scene: Arc::clone(scene),
        camera: *camera,
        style,
        picked,
    };
    // The size the paint callback will be given, worked out as egui does;
    // should it differ after all, the callback draws the view itself.
    let ppp = ui.ctx().pixels_per_point();
    let span = |low: f32, high: f32| px((ppp * high).round() as i32 - (ppp * low).round() as i32);
    let size_px = [span(rect.min.x, rect.max.x), span(rect.min.y, rect.max.y)];
    if let Ok(mut renderer) = renderer.lock() {
        renderer.draw_ahead(&frame, size_px);
    }
    let renderer = Arc::clone(renderer);
    let callback = egui_glow::CallbackFn::new(move |info, painter| {
        // A poisoned lock means an earlier draw panicked; skipping the draw
        // keeps the rest of the window usable.
        if let Ok(mut renderer) = renderer.lock() {
            renderer.paint(&info, painter, &frame);
        }
    });
    ui.painter().add(egui::PaintCallback { rect, callback: Arc::new(callback) });
    if !style.client_view {
        labels_ui(ui, rect, scene, camera, picked);
        joint_marks_ui(ui, rect, scene, camera, marks);
    }
    let view_size = DVec2::new(f64::from(rect.width()), f64::from(rect.height()));
    ViewportInput { clicked_at, moved_camera, view_size }
}

/// Lines one pixel wide across a backdrop, by pixel column and row from
/// the window's top left, in one opaque colour.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct PixelGrid {
    /// The columns holding a line from top to bottom.
    pub columns: Vec<i32>,
    /// The rows holding a line from side to side.
    pub rows: Vec<i32>,
    /// The lines' colour.
    pub colour: egui::Color32,
}

/// Fills `rect` with the opaque `colour` by clearing that part of the
/// window rather than drawing a shape, then draws `grid` over it in one
/// unblended draw: software GL shades and blends every pixel of a filled
/// shape, where a clear only writes it (the plan view's background, about
/// a quarter of the window, cost 2 to 3 ms of the rasterizer's time a
/// frame as a shape; its grid lines 7 % of the rasterizer's work as egui's
/// lines).
pub fn fill_by_clearing(
    painter: &egui::Painter,
    renderer: &Arc<Mutex<Renderer>>,
    rect: egui::Rect,
    colour: egui::Color32,
    grid: PixelGrid,
) {
    let renderer = Arc::clone(renderer);
    let [r, g, b, a] = colour.to_normalized_gamma_f32();
    let callback = egui_glow::CallbackFn::new(move |info, painter| {
        let Ok(renderer) = renderer.lock() else { return };
        let [screen_w, screen_h] = info.screen_size_px;
        let target = window_target(&renderer.context, &info, painter);
        let clip_px = info.clip_rect_in_pixels();
        let scissor = clip_scissor(&info);
        target.clear_partially(scissor, ClearState::color(r, g, b, a));
        if let Some(lines) = grid_model(&renderer.context, &grid, [screen_w, screen_h], clip_px) {
            let [w, h] = [screen_w as f32, screen_h as f32];
            let camera = Camera::new_orthographic(
                Viewport::new_at_origo(screen_w, screen_h),
                Vec3::new(w / 2.0, h / 2.0, 1.0),
                Vec3::new(w / 2.0, h / 2.0, 0.0),
                Vec3::new(0.0, 1.0, 0.0),
                h,
                0.5,
                1.5,
            );
            target.render_partially(scissor, &camera, &lines, &[]);
        }
        let _egui_framebuffer = target.into_framebuffer();
    });
    painter.add(egui::PaintCallback { rect, callback: Arc::new(callback) });
}

/// The grid's lines as one opaque mesh in window pixels (y up), each a
/// quad one pixel across running the length of `clip_px`; `None` when
/// there are none.
fn grid_model(
    context: &Context,
    grid: &PixelGrid,
    [_, screen_h]: [u32; 2],
    clip_px: egui::epaint::ViewportInPixels,
) -> Option<Gm<Mesh, ColorMaterial>> {
    if grid.columns.is_empty() && grid.rows.is_empty() {
        return None;
    }
    let screen_h = screen_h as f32;
    let (left, right) = (clip_px.left_px as f32, (clip_px.left_px + clip_px.width_px) as f32);
    let (top, bottom) = (clip_px.top_px as f32, (clip_px.top_px + clip_px.height_px) as f32);
    let mut positions = Vec::new();
    // A quad between pixel edges covers exactly the pixels whose centres it holds.
    let mut quad = |x0: f32, x1: f32, y0: f32, y1: f32| {
        let (low, high) = (screen_h - y1, screen_h - y0);
        positions.extend([
            Vec3::new(x0, low, 0.0),
            Vec3::new(x1, low, 0.0),
            Vec3::new(x1, high, 0.0),
            Vec3::new(x0, low, 0.0),
            Vec3::new(x1, high, 0.0),
            Vec3::new(x0, high, 0.0),
        ]);
    };
    for &column in &grid.columns {
        quad(column as f32, column as f32 + 1.0, top, bottom);
    }
    for &row in &grid.rows {
        quad(left, right, row as f32, row as f32 + 1.0);
    }
    let mesh = CpuMesh { positions: Positions::F32(positions), indices: Indices::None, ..Default::default() };
    let [r, g, b, a] = grid.colour.to_array();
    let material = ColorMaterial {
        color: Srgba::new(r, g, b, a),
        render_states: RenderStates {
            depth_test: DepthTest::Always,
            write_mask: WriteMask::COLOR,
            ..Default::default()
        },
        ..ColorMaterial::new_opaque(context, &CpuMaterial::default())
    };
    Some(Gm::new(Mesh::new(context, &mesh), material))
}

/// A ring at each marked joint: green when it fits within 1/64 in, red
/// when not; the picked joint larger.
fn joint_marks_ui(ui: &egui::Ui, rect: egui::Rect, scene: &Scene, camera: &OrbitCamera, marks: &JointMarks) {
    let size = DVec2::new(f64::from(rect.width()), f64::from(rect.height()));
    let painter = ui.painter_at(rect);
    for &index in &marks.shown {
        let Some(joint) = scene.joints().get(index) else { continue };
        let Some(at) = camera.project(joint.at, size) else { continue };
        let centre = rect.min + egui::vec2(at.x as f32, at.y as f32);
        let fill = if joint.tight() {
            egui::Color32::from_rgb(20, 150, 50)
        } else {
            egui::Color32::from_rgb(220, 30, 30)
        };
        let radius = if marks.picked == Some(index) { 9.0 } else { 6.0 };
        painter.circle(centre, radius, fill, egui::Stroke::new(2.0, egui::Color32::WHITE));
    }
}

/// Member labels over the 3D view, skipping any that would overlap one
/// already placed (the picked piece's label goes first).
fn labels_ui(ui: &egui::Ui, rect: egui::Rect, scene: &Scene, camera: &OrbitCamera, picked: Option<usize>) {
    let size = DVec2::new(f64::from(rect.width()), f64::from(rect.height()));
    let painter = ui.painter_at(rect);
    let font = egui::FontId::proportional(12.0);
    let order = picked.into_iter().chain((0..scene.pieces.len()).filter(|&i| Some(i) != picked));
    let mut placed: Vec<egui::Rect> = Vec::new();
    for index in order {
        let Some(piece) = scene.pieces.get(index) else { continue };
        let Some(at) = camera.project(piece.label_at, size) else { continue };
        let centre = rect.min + egui::vec2(at.x as f32, at.y as f32);
        // A label centred off the view or on one already placed cannot be
        // shown: skip laying it out (most of a large frame's labels).
        if !rect.contains(centre) || placed.iter().any(|other| other.contains(centre)) {
            continue;
        }
        let galley = painter.layout_no_wrap(piece.label.clone(), font.clone(), egui::Color32::PLACEHOLDER);
        let label_rect = egui::Rect::from_center_size(centre, galley.size()).expand(2.0);
        if !rect.contains_rect(label_rect) || placed.iter().any(|other| other.intersects(label_rect)) {
            continue;
        }
        // The picked label is white on black, not in the highlight colour,
        // so only the 3D highlight shows that colour.
        let (fill, text) = if Some(index) == picked {
            (egui::Color32::WHITE, egui::Color32::BLACK)
        } else {
            (egui::Color32::from_black_alpha(170), egui::Color32::WHITE)
        };
        painter.rect_filled(label_rect, 3.0, fill);
        painter.galley(label_rect.min + egui::vec2(2.0, 2.0), galley, text);
        placed.push(label_rect);
    }
}

/// The window egui paints into (its offscreen buffer where it has one).
fn window_target(
    context: &Context,
    info: &egui::PaintCallbackInfo,
    painter: &egui_glow::Painter,
) -> RenderTarget<'static> {
    let [screen_w, screen_h] = info.screen_size_px;
    match painter.intermediate_fbo() {
        Some(fbo) => RenderTarget::from_framebuffer(context, screen_w, screen_h, fbo),
        None => RenderTarget::screen(context, screen_w, screen_h),
    }
}

/// The part of the window a paint callback may draw in.
fn clip_scissor(info: &egui::PaintCallbackInfo) -> ScissorBox {
    let clip_px = info.clip_rect_in_pixels();
    ScissorBox {
        x: clip_px.left_px,
        y: clip_px.from_bottom_px,
        width: px(clip_px.width_px),
        height: px(clip_px.height_px),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    /// The corners the mesh draws, three per triangle, in drawing order.
    fn drawn_corners(mesh: &CpuMesh) -> Vec<(Vec3, Vec3)> {
        let (Positions::F32(positions), Some(normals)) = (&mesh.positions, &mesh.normals) else {
            return Vec::new();
        };
        match &mesh.indices {
            Indices::U32(indices) => {
                indices.iter().map(|&i| (positions[i as usize], normals[i as usize])).collect()
            }
            _ => positions.iter().copied().zip(normals.iter().copied()).collect(),
        }
    }

    #[test]
    fn an_indexed_mesh_draws_the_same_triangles_with_a_corner_sent_once_a_face() {
        // A board's end: a pentagon fanned into three triangles, and a
        // square bar of four quads (common practice, no source: a flat face
        // of n corners needs n vertices).
        let mut triangles = Triangles::default();
        let pentagon = [
            DVec3::new(0.0, 0.0, 0.0),
            DVec3::new(4.0, 0.0, 0.0),
            DVec3::new(5.0, 3.0, 0.0),
            DVec3::new(2.0, 5.0, 0.0),
            DVec3::new(-1.0, 3.0, 0.0),
        ];
        triangles.push_convex_polygon(&pentagon, DVec3::Z, DVec3::ZERO);
        triangles.push_bar(DVec3::new(0.0, 0.0, 1.0), DVec3::new(10.0, 0.0, 1.0), 1.5);
        let indexed = cpu_mesh(&triangles);
        let unindexed = unindexed_mesh(&triangles);
        assert_eq!(drawn_corners(&indexed), drawn_corners(&unindexed));
        let Positions::F32(positions) = &indexed.positions else { panic!("f32 positions") };
        assert_eq!(positions.len(), 5 + 4 * 4);
        assert_eq!(triangles.len(), 3 + 4 * 2);
    }
}
