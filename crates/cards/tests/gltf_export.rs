//! The frame model: it parses back as glTF 2.0, one named node per piece,
//! one mesh per distinct solid, and positions in metres with Y up.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

mod common;

use glam::DVec3;
use pitchframe_cards::{CutFace, ModelFace, ModelPiece, ModelScene, frame_glb};

/// A straight board from `from` to `to` (its bottom edge's centre line),
/// `t` thick and `d` deep, square ends; its upper end tagged as a plumb cut.
fn board(label: &str, kind: &str, from: DVec3, to: DVec3, t: f64, d: f64) -> ModelPiece {
    let along = (to - from).normalize();
    let side = DVec3::Z.cross(along).normalize();
    let up = along.cross(side);
    let corner = |end: DVec3, s: f64, u: f64| end + side * (s * t / 2.0) + up * (u * d);
    let (a0, a1, a2, a3) =
        (corner(from, -1.0, 0.0), corner(from, 1.0, 0.0), corner(from, 1.0, 1.0), corner(from, -1.0, 1.0));
    let (b0, b1, b2, b3) =
        (corner(to, -1.0, 0.0), corner(to, 1.0, 0.0), corner(to, 1.0, 1.0), corner(to, -1.0, 1.0));
    let face = |vertices: Vec<DVec3>, cut| ModelFace { vertices, cut };
    ModelPiece {
        label: label.into(),
        kind: kind.into(),
        axis: [from, to],
        faces: vec![
            face(vec![a0, a3, a2, a1], Some(CutFace::TailPlumb)),
            face(vec![b0, b1, b2, b3], Some(CutFace::TopPlumb)),
            face(vec![a0, a1, b1, b0], None),
            face(vec![a3, b3, b2, a2], None),
            face(vec![a1, a2, b2, b1], None),
            face(vec![a0, b0, b3, a3], None),
        ],
    }
}

fn sample_scene() -> ModelScene {
    let deck = common::sample_deck();
    let mut pieces = Vec::new();
    for member in &deck.members {
        for place in &member.places {
            let run = place[0].distance(place[1]);
            let rise = run * member.pitch_rad.tan();
            pieces.push(board(
                &member.label,
                &member.kind,
                place[0].extend(0.0),
                place[1].extend(rise),
                member.thickness_in,
                member.depth_in,
            ));
        }
    }
    ModelScene {
        pieces,
        roof_surfaces: deck.roof.planes.iter().map(|p| p.eave_outline.clone()).collect(),
        walls: deck.outline.clone(),
    }
}

#[test]
fn glb_parses_with_a_node_per_piece() {
    let scene = sample_scene();
    let glb = frame_glb(&scene).unwrap();
    let gltf = gltf::Gltf::from_slice(&glb).expect("a valid glTF binary");
    let piece_nodes: Vec<_> = gltf
        .nodes()
        .filter(|n| n.name().is_some_and(|name| name != "roof surfaces" && name != "walls"))
        .collect();
    assert_eq!(piece_nodes.len(), scene.pieces.len());
    assert_eq!(gltf.nodes().count(), scene.pieces.len() + 2);
    // Every common is the same board, every hip too: one mesh per member
    // plus the roof and the walls.
    assert_eq!(gltf.meshes().count(), 2 + 2);
    for (node, piece) in piece_nodes.iter().zip(&scene.pieces) {
        assert_eq!(node.name(), Some(piece.label.as_str()));
    }
}

#[test]
fn positions_are_metres_with_y_up() {
    // A board starting 100 in east and 50 in north of the origin at the
    // wall line: in glTF (ISO/IEC 12113, Y up, metres) its node sits at
    // x = 2.54 m, y = 0, z = -1.27 m.
    let piece =
        board("C9", "common rafter", DVec3::new(100.0, 50.0, 0.0), DVec3::new(100.0, 150.0, 50.0), 1.5, 7.25);
    let glb = frame_glb(&ModelScene { pieces: vec![piece.clone()], ..Default::default() }).unwrap();
    let document = gltf::Gltf::from_slice(&glb).unwrap();
    let blob = document.blob.clone().unwrap();
    let node = document.nodes().next().unwrap();
    let (translation, rotation, _) = node.transform().decomposed();
    assert!(
        (translation[0] - 2.54).abs() < 1e-6
            && translation[1].abs() < 1e-6
            && (translation[2] + 1.27).abs() < 1e-6
    );
    // Every mesh vertex, carried by the node's transform, lands on a corner
    // of the board converted by hand.
    let q = glam::Quat::from_array(rotation).as_dquat();
    let t = glam::Vec3::from_array(translation).as_dvec3();
    let corners: Vec<DVec3> = piece
        .faces
        .iter()
        .flat_map(|f| f.vertices.clone())
        .map(|p| DVec3::new(p.x, p.z, -p.y) * 0.0254)
        .collect();
    let mesh = node.mesh().unwrap();
    let mut checked = 0;
    for primitive in mesh.primitives() {
        let reader = primitive.reader(|_| Some(blob.as_slice()));
        for p in reader.read_positions().unwrap() {
            let world = q * glam::Vec3::from_array(p).as_dvec3() + t;
            assert!(corners.iter().any(|c| c.distance(world) < 1e-6), "vertex {world} is not a board corner");
            checked += 1;
        }
    }
    // Six faces of two triangles.
    assert_eq!(checked, 36);
}
