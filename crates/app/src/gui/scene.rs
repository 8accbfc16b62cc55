//! Turns the geometry crate's outline, roof and members into triangle lists
//! the viewport can draw and the picker can hit. Lengths stay in f64 inches
//! here; the viewport converts to f32 when it uploads.

use std::sync::OnceLock;

use glam::DVec3;
use pitchframe_geometry::framing::{FaceTag, PlacedPiece};
use pitchframe_geometry::{
    Frame, FramingSettings, MemberKind, Outline, Roof, RoofError, RoofLineKind, frame_roof,
};

use super::joints::{SceneJoint, scene_joints};
pub use super::triangles::Triangles;
use super::walls::wall_triangles;

/// Width of the square bar drawn along a ridge, hip or valley line, in
/// inches: about a board's thickness, so lines read at house scale.
const ROOF_LINE_WIDTH_IN: f64 = 2.0;

/// What a group of triangles shows, which sets its colour.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum PartKind {
    /// The house walls, from floor to the top of the top plate.
    Walls,
    /// The roof planes carried out to the fascia.
    RoofPlanes,
    /// The vertical faces above gable walls.
    Gables,
    /// The ridges, hips or valleys, as thin bars.
    RoofLines(RoofLineKind),
    /// Every framing piece of one kind.
    Members(MemberKind),
}

/// One framing piece where it sits, ready to draw and pick.
#[derive(Debug, Clone, PartialEq)]
pub struct ScenePiece {
    /// The member's label ("C1").
    pub label: String,
    /// What the member is.
    pub kind: MemberKind,
    /// The piece's faces as triangles.
    pub triangles: Triangles,
    /// For each triangle, what made the face it belongs to.
    pub face_tags: Vec<FaceTag>,
    /// Where its label goes: the middle of its top edge, in inches.
    pub label_at: DVec3,
}

/// Whether a face was made by a saw cut (rather than being a face of the
/// board as it came from the yard).
pub fn is_cut_face(tag: FaceTag) -> bool {
    !matches!(tag, FaceTag::Side | FaceTag::Top | FaceTag::Bottom | FaceTag::Interior)
}

/// One drawable group of triangles.
#[derive(Debug, Clone, PartialEq)]
pub struct ScenePart {
    /// What it shows.
    pub kind: PartKind,
    /// Its triangles.
    pub triangles: Triangles,
}

/// Everything the 3D view draws, derived from the document.
#[derive(Debug, Clone, PartialEq)]
pub struct Scene {
    /// Drawable groups.
    pub parts: Vec<ScenePart>,
    /// The solved roof, when it could be solved.
    pub roof: Option<Roof>,
    /// Why the roof could not be solved.
    pub roof_error: Option<RoofError>,
    /// The framed roof, when it could be framed.
    pub frame: Option<Frame>,
    /// Why the roof could not be framed, in the user's words.
    pub frame_error: Option<String>,
    /// Every framing piece, in the frame's order.
    pub pieces: Vec<ScenePiece>,
    /// Every joint of the frame, placed in the view when first asked for
    /// (a drag re-frames every frame and seldom needs them).
    joints: OnceLock<Vec<SceneJoint>>,
    /// How far the frame is raised onto the walls.
    lift: DVec3,
    /// Lowest corner of the box holding every part.
    pub min: DVec3,
    /// Highest corner of that box.
    pub max: DVec3,
}

impl Scene {
    /// Builds the scene for an outline with walls of the given height and
    /// thickness, framed with `settings` (no frame when `None`: the plan's
    /// framing settings could not be read).
    pub fn build(
        outline: &Outline,
        settings: Option<&FramingSettings>,
        wall_height_in: f64,
        wall_thickness_in: f64,
    ) -> Self {
        let walls = wall_triangles(outline, wall_height_in, wall_thickness_in);
        let mut parts = vec![ScenePart { kind: PartKind::Walls, triangles: walls }];
        // Roof heights are measured from the wall line at the top of the
        // plate, which stands at the wall height.
        let lift = DVec3::Z * wall_height_in;
        let (mut roof_error, mut frame, mut frame_error) = (None, None, None);
        let roof = match Roof::solve(outline) {
            Ok(roof) => {
                parts.extend(roof_parts(&roof, lift));
                if let Some(settings) = settings {
                    match frame_roof(outline, &roof, settings) {
                        Ok(framed) => frame = Some(framed),
                        Err(err) => frame_error = Some(err.to_string()),
                    }
                }
                Some(roof)
            }
            Err(err) => {
                roof_error = Some(err);
                None
            }
        };
        let pieces: Vec<ScenePiece> =
            frame.iter().flat_map(|frame| &frame.pieces).map(|piece| scene_piece(piece, lift)).collect();
        parts.extend(member_parts(&pieces));
        let (min, max) = bounds(&parts);
        Self { parts, roof, roof_error, frame, frame_error, pieces, joints: OnceLock::new(), lift, min, max }
    }

    /// The walls and the solved `roof` over `outline` with no frame: what a
    /// drag shows at once while the frame is laid out on another thread.
    pub fn roof_only(outline: &Outline, roof: Roof, wall_height_in: f64, wall_thickness_in: f64) -> Self {
        let walls = wall_triangles(outline, wall_height_in, wall_thickness_in);
        let lift = DVec3::Z * wall_height_in;
        let mut parts = vec![ScenePart { kind: PartKind::Walls, triangles: walls }];
        parts.extend(roof_parts(&roof, lift));
        let (min, max) = bounds(&parts);
        Self {
            parts,
            roof: Some(roof),
            roof_error: None,
            frame: None,
            frame_error: None,
            pieces: Vec::new(),
            joints: OnceLock::new(),
            lift,
            min,
            max,
        }
    }

    /// A scene with nothing in it, for a plan whose outline never checked.
    pub fn empty() -> Self {
        Self {
            parts: Vec::new(),
            roof: None,
            roof_error: None,
            frame: None,
            frame_error: None,
            pieces: Vec::new(),
            joints: OnceLock::new(),
            lift: DVec3::ZERO,
            min: DVec3::ZERO,
            max: DVec3::splat(1.0),
        }
    }
}

impl Scene {
    /// Every joint of the frame, placed in the view.
    pub fn joints(&self) -> &[SceneJoint] {
        self.joints.get_or_init(|| {
            self.frame.as_ref().map(|frame| scene_joints(frame, self.lift)).unwrap_or_default()
        })
    }

    /// The scene with these joints in place of the frame's (for tests of
    /// how a joint is shown).
    #[cfg(test)]
    pub fn with_joints(mut self, joints: Vec<SceneJoint>) -> Self {
        self.joints = OnceLock::from(joints);
        self
    }
}

/// A piece's solid as tagged triangles, raised by `lift`.
fn scene_piece(piece: &PlacedPiece, lift: DVec3) -> ScenePiece {
    let mut triangles = Triangles::default();
    let mut face_tags = Vec::new();
    // Faces between a piece's convex parts lie inside it: nothing to see.
    for face in piece.solid.faces().filter(|face| face.tag != FaceTag::Interior) {
        let before = triangles.len();
        // Every face of a convex part is convex.
        triangles.push_convex_polygon(&face.vertices, face.normal, lift);
        face_tags.extend(std::iter::repeat_n(face.tag, triangles.len() - before));
    }
    let [low, high] = piece.axis;
    ScenePiece {
        label: piece.label.clone(),
        kind: piece.kind,
        triangles,
        face_tags,
        label_at: (low + high) / 2.0 + lift,
    }
}

/// One drawable group per member kind, holding every piece of that kind.
fn member_parts(pieces: &[ScenePiece]) -> Vec<ScenePart> {
    let mut parts: Vec<ScenePart> = Vec::new();
    for piece in pieces {
        let part = match parts.iter_mut().position(|part| part.kind == PartKind::Members(piece.kind)) {
            Some(index) => &mut parts[index],
            None => {
                parts
                    .push(ScenePart { kind: PartKind::Members(piece.kind), triangles: Triangles::default() });
                let last = parts.len() - 1;
                &mut parts[last]
            }
        };
        part.triangles.corners.extend_from_slice(&piece.triangles.corners);
        part.triangles.normals.extend_from_slice(&piece.triangles.normals);
    }
    parts.sort_by_key(|part| match part.kind {
        PartKind::Members(kind) => Some(kind),
        _ => None,
    });
    parts
}

/// The roof's planes, gables and lines, raised by `lift`.
fn roof_parts(roof: &Roof, lift: DVec3) -> Vec<ScenePart> {
    let raised = |points: &[DVec3]| points.iter().map(|&p| p + lift).collect::<Vec<_>>();
    let mut planes = Triangles::default();
    for plane in &roof.planes {
        planes.push_polygon(&raised(&plane.eave_outline));
    }
    let mut gables = Triangles::default();
    for gable in &roof.gables {
        gables.push_polygon(&raised(&gable.outline));
    }
    let mut parts = vec![
        ScenePart { kind: PartKind::RoofPlanes, triangles: planes },
        ScenePart { kind: PartKind::Gables, triangles: gables },
    ];
    for kind in [RoofLineKind::Ridge, RoofLineKind::Hip, RoofLineKind::Valley] {
        let mut bars = Triangles::default();
        for line in roof.lines.iter().filter(|line| line.kind == kind) {
            bars.push_bar(line.from + lift, line.to + lift, ROOF_LINE_WIDTH_IN);
        }
        parts.push(ScenePart { kind: PartKind::RoofLines(kind), triangles: bars });
    }
    parts.retain(|part| part.triangles.len() > 0);
    parts
}

/// The box round every triangle corner; a unit box at the origin when empty.
fn bounds(parts: &[ScenePart]) -> (DVec3, DVec3) {
    let mut corners = parts.iter().flat_map(|part| part.triangles.corners.iter().copied());
    let Some(first) = corners.next() else {
        return (DVec3::ZERO, DVec3::ONE);
    };
    corners.fold((first, first), |(min, max), p| (min.min(p), max.max(p)))
}

#[cfg(test)]
mod tests {
    use approx::assert_abs_diff_eq;

    use super::*;

    /// Walls 8 ft high and 6 in thick round the built-in demo's outline.
    fn demo_scene() -> Scene {
        let outline = pitchframe_geometry::demo_plan().unwrap().outline().unwrap();
        Scene::build(&outline, Some(&FramingSettings::default()), 96.0, 6.0)
    }

    #[test]
    fn demo_walls_fill_the_plan_and_stand_eight_feet() {
        let scene = demo_scene();
        let (min, max) = scene.parts[0].triangles.bounds().unwrap();
        assert_eq!(scene.parts[0].kind, PartKind::Walls);
        // Derivation: the demo's L spans 44 ft by 40 ft (28 + 12) in plan.
        assert_abs_diff_eq!(max.x - min.x, 528.0, epsilon = 1e-9);
        assert_abs_diff_eq!(max.y - min.y, 480.0, epsilon = 1e-9);
        assert_abs_diff_eq!(max.z, 96.0, epsilon = 1e-9);
        // Six walls, three quads each, two triangles per quad.
        assert_eq!(scene.parts[0].triangles.len(), 6 * 3 * 2);
    }

    #[test]
    fn wall_top_area_is_perimeter_times_thickness_less_corners() {
        let scene = demo_scene();
        let tris = &scene.parts[0].triangles;
        let top_area: f64 = tris
            .corners
            .chunks(3)
            .zip(&tris.normals)
            .filter(|(_, n)| n.z > 0.5)
            .map(|(c, _)| (c[1] - c[0]).cross(c[2] - c[0]).length() / 2.0)
            .sum();
        // Derivation: area between the outline and its 6 in inset equals
        // perimeter x t - t^2 x (convex corners - reflex corners) for a
        // right-angled ring; the demo's L has 5 convex corners and 1 reflex,
        // and a perimeter of 2 x (44 + 40) ft = 2016 in.
        let expected = 2016.0 * 6.0 - 36.0 * (5.0 - 1.0);
        assert_abs_diff_eq!(top_area, expected, epsilon = 1e-6);
        // Every top triangle faces up, every side one is level.
        assert!(tris.normals.iter().all(|n| n.z.abs() < 1e-12 || (n.z - 1.0).abs() < 1e-12));
    }

    #[test]
    fn outside_faces_point_away_from_the_house() {
        let scene = demo_scene();
        let tris = &scene.parts[0].triangles;
        // The front wall's outside face lies on y = 0; it must face -Y.
        let front = tris
            .corners
            .chunks(3)
            .zip(&tris.normals)
            .find(|(c, n)| n.z.abs() < 1e-12 && c.iter().all(|p| p.y.abs() < 1e-12))
            .map(|(_, n)| *n)
            .unwrap();
        assert_abs_diff_eq!(front.y, -1.0, epsilon = 1e-12);
    }
}
