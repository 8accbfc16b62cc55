//! The frame as a glTF 2.0 binary (.glb) model: one named node per placed
//! piece, one mesh per distinct member solid, materials by member kind and
//! cut faces in their cut colours; optionally the roof surfaces and walls.
//!
//! glTF is in metres with Y up; we are in inches with Z up. A plan point
//! (x, y, z) becomes (x, z, -y) metres times 0.0254, a proper rotation, so
//! handedness and face winding are kept.

use std::collections::BTreeMap;

use glam::{DMat3, DQuat, DVec2, DVec3};
use gltf_json as json;
use json::validation::{Checked, USize64};
use serde::Serialize;
use thiserror::Error;

use crate::CutFace;
use crate::polygon_triangles::polygon_triangles;

/// Metres per inch, exact by definition.
const M_PER_IN: f64 = 0.0254;
/// Two pieces share a mesh when their solids, each in its own member frame,
/// agree to within this (inches).
const SAME_SOLID_IN: f64 = 1e-4;
/// How far the walls are drawn below the wall line, inches (a storey).
const WALL_HEIGHT_IN: f64 = 96.0;

/// One face of a piece's solid, in plan coordinates (inches, Z up).
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ModelFace {
    /// Corners of the flat, convex face, counter-clockwise seen from outside.
    pub vertices: Vec<DVec3>,
    /// The cut that made the face, or `None` for a face of the board itself.
    pub cut: Option<CutFace>,
}

/// One placed piece.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct ModelPiece {
    /// The label written on the piece; the node's name.
    pub label: String,
    /// The member kind in words; sets the material.
    pub kind: String,
    /// The piece's axis from its lower end to its upper end, inches.
    pub axis: [DVec3; 2],
    /// The faces of its solid.
    pub faces: Vec<ModelFace>,
}

/// What goes into the model.
#[derive(Debug, Clone, PartialEq, Serialize, Default)]
pub struct ModelScene {
    /// Every placed piece.
    pub pieces: Vec<ModelPiece>,
    /// Roof surfaces (each plane's outline out to the fascia), inches.
    pub roof_surfaces: Vec<Vec<DVec3>>,
    /// Wall-line rings, inches; walls are drawn a storey down from them.
    pub walls: Vec<Vec<DVec2>>,
}

/// Why the model could not be written.
#[derive(Debug, Error)]
pub enum GltfError {
    /// The glTF JSON could not be written.
    #[error("the 3D model could not be written: {0}")]
    Json(#[from] json::Error),
    /// A piece has a point that is not a finite number.
    #[error("piece {label} has a position that is not a finite number, so it cannot be placed in the model")]
    PieceNotFinite {
        /// The piece's label.
        label: String,
    },
    /// The model is larger than a .glb file can hold (4 GiB).
    #[error("the 3D model is too large for a .glb file")]
    TooLarge,
}

/// A solid's faces in its member frame: each face's cut and corners.
type LocalSolid = Vec<(Option<CutFace>, Vec<DVec3>)>;

/// Plan inches (Z up) to glTF metres (Y up).
fn to_gltf(point: DVec3) -> DVec3 {
    DVec3::new(point.x, point.z, -point.y) * M_PER_IN
}

/// The axis swap alone, as a rotation matrix (columns are the images of
/// plan x, y, z).
fn swap_axes() -> DMat3 {
    DMat3::from_cols(DVec3::X, -DVec3::Z, DVec3::Y)
}

/// A piece's own frame: origin at its lower end, x along its axis, z as
/// near to plumb as the axis allows, y completing a right-handed frame.
fn member_frame(axis: [DVec3; 2]) -> (DVec3, DMat3) {
    let along = (axis[1] - axis[0]).try_normalize().unwrap_or(DVec3::X);
    let up_hint = if along.z.abs() > 0.99 { DVec3::Y } else { DVec3::Z };
    let up = (up_hint - along * up_hint.dot(along)).normalize_or(DVec3::Z);
    let side = up.cross(along);
    (axis[0], DMat3::from_cols(along, side, up))
}

fn material(name: &str, colour: [f32; 3], alpha: f32) -> json::Material {
    json::Material {
        name: Some(name.to_string()),
        alpha_mode: Checked::Valid(if alpha < 1.0 {
            json::material::AlphaMode::Blend
        } else {
            json::material::AlphaMode::Opaque
        }),
        double_sided: alpha < 1.0,
        pbr_metallic_roughness: json::material::PbrMetallicRoughness {
            base_color_factor: json::material::PbrBaseColorFactor([colour[0], colour[1], colour[2], alpha]),
            metallic_factor: json::material::StrengthFactor(0.0),
            roughness_factor: json::material::StrengthFactor(0.8),
            ..Default::default()
        },
        ..Default::default()
    }
}

/// Colours of our own for member kinds, picked by the kind's trade word.
fn kind_colour(kind: &str) -> [f32; 3] {
    let kind = kind.to_lowercase();
    if kind.contains("valley") {
        [0.55, 0.60, 0.78]
    } else if kind.contains("hip") && !kind.contains("jack") {
        [0.78, 0.52, 0.38]
    } else if kind.contains("jack") || kind.contains("cripple") {
        [0.86, 0.78, 0.55]
    } else if kind.contains("ridge") {
        [0.62, 0.42, 0.30]
    } else {
        [0.90, 0.74, 0.50]
    }
}

/// Triangles with flat normals, in some frame, for one material.
#[derive(Default)]
struct TriangleSoup {
    positions: Vec<[f32; 3]>,
    normals: Vec<[f32; 3]>,
}

impl TriangleSoup {
    fn push(&mut self, a: DVec3, b: DVec3, c: DVec3) {
        let normal = (b - a).cross(c - a).normalize_or_zero();
        if normal == DVec3::ZERO {
            return;
        }
        for p in [a, b, c] {
            self.positions.push(p.as_vec3().to_array());
            self.normals.push(normal.as_vec3().to_array());
        }
    }
}

struct Builder {
    root: json::Root,
    bin: Vec<u8>,
    buffer: json::Index<json::Buffer>,
}

impl Builder {
    fn view(&mut self, bytes: &[u8]) -> json::Index<json::buffer::View> {
        while !self.bin.len().is_multiple_of(4) {
            self.bin.push(0);
        }
        let offset = self.bin.len();
        self.bin.extend_from_slice(bytes);
        self.root.push(json::buffer::View {
            buffer: self.buffer,
            byte_length: USize64(bytes.len() as u64),
            byte_offset: Some(USize64(offset as u64)),
            byte_stride: None,
            name: None,
            target: Some(Checked::Valid(json::buffer::Target::ArrayBuffer)),
            extensions: None,
            extras: Default::default(),
        })
    }

    fn vec3_accessor(&mut self, values: &[[f32; 3]], bounds: bool) -> json::Index<json::Accessor> {
        let bytes: Vec<u8> = values.iter().flatten().flat_map(|v| v.to_le_bytes()).collect();
        let view = self.view(&bytes);
        let (min, max) = if bounds {
            let mut low = [f32::INFINITY; 3];
            let mut high = [f32::NEG_INFINITY; 3];
            for v in values {
                for k in 0..3 {
                    low[k] = low[k].min(v[k]);
                    high[k] = high[k].max(v[k]);
                }
            }
            (Some(json::Value::from(low.to_vec())), Some(json::Value::from(high.to_vec())))
        } else {
            (None, None)
        };
        self.root.push(json::Accessor {
            buffer_view: Some(view),
            byte_offset: None,
            count: USize64(values.len() as u64),
            component_type: Checked::Valid(json::accessor::GenericComponentType(
                json::accessor::ComponentType::F32,
            )),
            extensions: None,
            extras: Default::default(),
            type_: Checked::Valid(json::accessor::Type::Vec3),
            min,
            max,
            name: None,
            normalized: false,
            sparse: None,
        })
    }

    fn mesh(
        &mut self,
        name: &str,
        soups: Vec<(json::Index<json::Material>, TriangleSoup)>,
    ) -> Option<json::Index<json::Mesh>> {
        let mut primitives = Vec::new();
        for (material, soup) in soups {
            if soup.positions.is_empty() {
                continue;
            }
            let positions = self.vec3_accessor(&soup.positions, true);
            let normals = self.vec3_accessor(&soup.normals, false);
            let mut attributes = BTreeMap::new();
            attributes.insert(Checked::Valid(json::mesh::Semantic::Positions), positions);
            attributes.insert(Checked::Valid(json::mesh::Semantic::Normals), normals);
            primitives.push(json::mesh::Primitive {
                attributes,
                extensions: None,
                extras: Default::default(),
                indices: None,
                material: Some(material),
                mode: Checked::Valid(json::mesh::Mode::Triangles),
                targets: None,
            });
        }
        if primitives.is_empty() {
            return None;
        }
        Some(self.root.push(json::Mesh {
            extensions: None,
            extras: Default::default(),
            name: Some(name.to_string()),
            primitives,
            weights: None,
        }))
    }
}

/// A solid's faces in its member frame, inches.
fn local_faces(piece: &ModelPiece, origin: DVec3, frame: DMat3) -> LocalSolid {
    let inverse = frame.transpose();
    piece
        .faces
        .iter()
        .map(|face| (face.cut, face.vertices.iter().map(|v| inverse * (*v - origin)).collect()))
        .collect()
}

fn same_solid(a: &LocalSolid, b: &LocalSolid) -> bool {
    a.len() == b.len()
        && a.iter().zip(b).all(|((cut_a, va), (cut_b, vb))| {
            cut_a == cut_b
                && va.len() == vb.len()
                && va.iter().zip(vb).all(|(p, q)| p.distance(*q) <= SAME_SOLID_IN)
        })
}

/// Writes the model as a .glb file.
pub fn frame_glb(scene: &ModelScene) -> Result<Vec<u8>, GltfError> {
    let mut root = json::Root {
        asset: json::Asset {
            generator: Some("Pitchframe".into()),
            version: "2.0".into(),
            ..Default::default()
        },
        ..Default::default()
    };
    let buffer = root.push(json::Buffer {
        byte_length: USize64(0),
        name: None,
        uri: None,
        extensions: None,
        extras: Default::default(),
    });
    let mut builder = Builder { root, bin: Vec::new(), buffer };

    let mut kind_materials: BTreeMap<String, json::Index<json::Material>> = BTreeMap::new();
    let mut cut_materials: BTreeMap<&'static str, json::Index<json::Material>> = BTreeMap::new();
    for face in CutFace::ALL {
        let index = builder.root.push(material(face.name(), face.colour(), 1.0));
        cut_materials.insert(face.name(), index);
    }
    // Meshes by label: each with the solid in its member frame, to match
    // the next piece against.
    let mut meshes: Vec<(String, LocalSolid, Option<json::Index<json::Mesh>>)> = Vec::new();
    let mut nodes = Vec::new();
    for piece in &scene.pieces {
        let finite = piece.axis.iter().all(|p| p.is_finite())
            && piece.faces.iter().flat_map(|face| &face.vertices).all(|p| p.is_finite());
        if !finite {
            return Err(GltfError::PieceNotFinite { label: piece.label.clone() });
        }
        let (origin, frame) = member_frame(piece.axis);
        let local = local_faces(piece, origin, frame);
        let found = meshes
            .iter()
            .find(|(label, solid, _)| label == &piece.label && same_solid(solid, &local))
            .map(|m| m.2);
        let mesh = match found {
            Some(mesh) => mesh,
            None => {
                let kind_material = match kind_materials.get(&piece.kind) {
                    Some(index) => *index,
                    None => {
                        let index = builder.root.push(material(&piece.kind, kind_colour(&piece.kind), 1.0));
                        kind_materials.insert(piece.kind.clone(), index);
                        index
                    }
                };
                let mut soups: BTreeMap<u32, (json::Index<json::Material>, TriangleSoup)> = BTreeMap::new();
                for (cut, vertices) in &local {
                    let material =
                        cut.and_then(|c| cut_materials.get(c.name()).copied()).unwrap_or(kind_material);
                    let soup = &mut soups
                        .entry(material.value() as u32)
                        .or_insert_with(|| (material, TriangleSoup::default()))
                        .1;
                    let metres: Vec<DVec3> = vertices.iter().map(|v| *v * M_PER_IN).collect();
                    if let Some((&first, rest)) = metres.split_first() {
                        for pair in rest.windows(2) {
                            soup.push(first, pair[0], pair[1]);
                        }
                    }
                }
                let mesh = builder.mesh(&piece.label, soups.into_values().collect());
                meshes.push((piece.label.clone(), local, mesh));
                mesh
            }
        };
        let rotation = DQuat::from_mat3(&(swap_axes() * frame)).normalize();
        let translation = to_gltf(origin);
        nodes.push(builder.root.push(json::Node {
            mesh,
            name: Some(piece.label.clone()),
            rotation: Some(json::scene::UnitQuaternion(rotation.as_quat().to_array())),
            translation: Some(translation.as_vec3().to_array()),
            ..Default::default()
        }));
    }

    if !scene.roof_surfaces.is_empty() {
        let roof_material = builder.root.push(material("roof surface", [0.55, 0.62, 0.70], 0.35));
        let mut soup = TriangleSoup::default();
        for surface in &scene.roof_surfaces {
            let plan: Vec<DVec2> = surface.iter().map(|p| p.truncate()).collect();
            for [a, b, c] in polygon_triangles(&plan) {
                if let (Some(a), Some(b), Some(c)) = (surface.get(a), surface.get(b), surface.get(c)) {
                    soup.push(to_gltf(*a), to_gltf(*b), to_gltf(*c));
                }
            }
        }
        if let Some(mesh) = builder.mesh("roof surfaces", vec![(roof_material, soup)]) {
            nodes.push(builder.root.push(json::Node {
                mesh: Some(mesh),
                name: Some("roof surfaces".into()),
                ..Default::default()
            }));
        }
    }
    if !scene.walls.is_empty() {
        let wall_material = builder.root.push(material("walls", [0.80, 0.80, 0.78], 0.6));
        let mut soup = TriangleSoup::default();
        for ring in &scene.walls {
            for (a, b) in ring.iter().zip(ring.iter().cycle().skip(1)) {
                let (top_a, top_b) = (a.extend(0.0), b.extend(0.0));
                let (low_a, low_b) = (a.extend(-WALL_HEIGHT_IN), b.extend(-WALL_HEIGHT_IN));
                soup.push(to_gltf(low_a), to_gltf(low_b), to_gltf(top_b));
                soup.push(to_gltf(low_a), to_gltf(top_b), to_gltf(top_a));
            }
        }
        if let Some(mesh) = builder.mesh("walls", vec![(wall_material, soup)]) {
            nodes.push(builder.root.push(json::Node {
                mesh: Some(mesh),
                name: Some("walls".into()),
                ..Default::default()
            }));
        }
    }

    let Builder { mut root, mut bin, buffer } = builder;
    let scene_index = root.push(json::Scene {
        extensions: None,
        extras: Default::default(),
        name: Some("frame".into()),
        nodes,
    });
    root.scene = Some(scene_index);
    if let Some(entry) = root.buffers.get_mut(buffer.value()) {
        entry.byte_length = USize64(bin.len() as u64);
    }
    if bin.is_empty() {
        root.buffers.clear();
    }
    let mut json_bytes = root.to_vec()?;
    while !json_bytes.len().is_multiple_of(4) {
        json_bytes.push(b' ');
    }
    while !bin.len().is_multiple_of(4) {
        bin.push(0);
    }
    let bin_chunk = if bin.is_empty() { 0 } else { 8 + bin.len() };
    let total = 12 + 8 + json_bytes.len() + bin_chunk;
    let total32 = u32::try_from(total).map_err(|_| GltfError::TooLarge)?;
    let mut out = Vec::with_capacity(total);
    out.extend_from_slice(b"glTF");
    out.extend_from_slice(&2u32.to_le_bytes());
    out.extend_from_slice(&total32.to_le_bytes());
    out.extend_from_slice(&(json_bytes.len() as u32).to_le_bytes());
    out.extend_from_slice(b"JSON");
    out.extend_from_slice(&json_bytes);
    if !bin.is_empty() {
        out.extend_from_slice(&(bin.len() as u32).to_le_bytes());
        out.extend_from_slice(b"BIN\0");
        out.extend_from_slice(&bin);
    }
    Ok(out)
}
