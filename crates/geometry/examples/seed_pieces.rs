//! Prints what the long run frames for one seed, to find where a joint
//! misfits: the outline's walls (as rows to paste into a test, with
//! `--rows`), the roof's lines, the pieces named (every piece with none
//! named), each with its plan line and axis, and their joints with the gap
//! and overlap the frame's check reads. With `--faces` each piece's faces
//! follow it: the tag, the outward normal and the corners.
//!
//! Run with `cargo run --release -p pitchframe-geometry --example
//! seed_pieces -- SEED [--rows] [--faces] [LABEL ...]`; the draw is the
//! long run's (orthogonal for even seeds, star for odd, features from the
//! seed, default framing settings).

use pitchframe_geometry::framing::{FramingSettings, frame_roof};
use pitchframe_geometry::{OutlineFeatures, OutlineShape, Roof, Wall, WallRoof, random_outline_or_refusal};

/// One wall as a test's row: corner, rise per run (0 for a gable), overhang.
fn row(w: &Wall) -> String {
    let slope = match w.roof {
        WallRoof::Pitched { rise_per_run } => rise_per_run,
        WallRoof::Gable => 0.0,
    };
    format!("    ({:?}, {:?}, {:?}, {:?}),", w.corner.x, w.corner.y, slope, w.overhang_in)
}

fn main() -> Result<(), String> {
    let args: Vec<String> = std::env::args().skip(1).collect();
    let seed: u64 = args
        .first()
        .and_then(|s| s.parse().ok())
        .ok_or("usage: seed_pieces SEED [--rows] [--faces] [LABEL ...]")?;
    let rows = args.iter().any(|a| a == "--rows");
    let faces = args.iter().any(|a| a == "--faces");
    let wanted: Vec<&String> = args.iter().skip(1).filter(|a| !a.starts_with("--")).collect();
    let shape = if seed.is_multiple_of(2) { OutlineShape::Orthogonal } else { OutlineShape::Star };
    let outline = random_outline_or_refusal(shape, seed, OutlineFeatures::from_seed(seed))
        .map_err(|e| format!("outline: {e}"))?;
    if rows {
        println!("outer, {} walls:", outline.outer().len());
        outline.outer().iter().for_each(|w| println!("{}", row(w)));
        for (i, ring) in outline.courtyards().iter().enumerate() {
            println!("courtyard {}, {} walls:", i + 1, ring.len());
            ring.iter().for_each(|w| println!("{}", row(w)));
        }
    }
    let roof = Roof::solve(&outline).map_err(|e| format!("solve: {e}"))?;
    for (i, l) in roof.lines.iter().enumerate() {
        println!("line {i}: {:?} {:?} -> {:?}, walls {:?}", l.kind, l.from, l.to, l.walls);
    }
    let frame =
        frame_roof(&outline, &roof, &FramingSettings::default()).map_err(|e| format!("frame: {e}"))?;
    let named = |label: &String| wanted.is_empty() || wanted.contains(&label);
    for p in frame.pieces.iter().filter(|p| named(&p.label)) {
        println!("piece {} {:?}: plan {:?}, axis {:?}", p.label, p.kind, p.plan_line, p.axis);
        if !faces {
            continue;
        }
        for (k, part) in p.solid.parts.iter().enumerate() {
            for f in &part.faces {
                let corners: Vec<String> =
                    f.vertices.iter().map(|v| format!("({:.3}, {:.3}, {:.3})", v.x, v.y, v.z)).collect();
                let n = f.normal;
                println!(
                    "  part {k} {:?} n = ({:.3}, {:.3}, {:.3}): {}",
                    f.tag,
                    n.x,
                    n.y,
                    n.z,
                    corners.join(" ")
                );
            }
        }
    }
    for j in frame.joints.iter().filter(|j| j.members.iter().any(named)) {
        println!(
            "joint {} on {} (pieces {} and {}): gap {:.4} in, overlap {:.4} in",
            j.members[0], j.members[1], j.pieces[0], j.pieces[1], j.max_gap, j.max_overlap
        );
    }
    for w in frame.warnings.iter().filter(|w| named(&w.label().to_string())) {
        println!("warning {w:?}");
    }
    Ok(())
}
