//! The checks on one piece's own numbers: notch depth, saw bevels, stock.

use super::board::PieceSpec;
use super::builders::STOCK_TOL_IN;
use super::measure::Measured;
use super::{FramingSettings, FramingWarning, SawKind};

/// The checks on one piece's own numbers.
pub fn piece_checks(label: &str, spec: &PieceSpec, m: &Measured, s: &FramingSettings) -> Vec<FramingWarning> {
    let mut out = Vec::new();
    if let Some(depth) = m.notch_depth_in {
        let limit = s.notch_limit * spec.size.depth_in;
        if depth > limit + 1e-9 {
            out.push(FramingWarning::NotchTooDeep {
                label: label.to_owned(),
                notch_depth_in: depth,
                limit_in: limit,
            });
        }
    }
    let max = s.saws.max_bevel_deg;
    for c in &m.cuts {
        let faces: Vec<&super::CutFace> = match c {
            super::Cut::Plumb { face, .. } | super::Cut::Cheek { face, .. } => vec![face],
            super::Cut::DoubleCheek { left, right, .. } => vec![left, right],
            super::Cut::SteppedCheek { face, step, .. } => vec![face, step],
            super::Cut::Tail { faces, .. } => faces.iter().collect(),
            _ => Vec::new(),
        };
        for f in faces {
            if s.saws.circular && f.face_bevel_deg > max + 1e-9 {
                out.push(FramingWarning::BevelBeyondSaw {
                    label: label.to_owned(),
                    end: c.end(),
                    saw: SawKind::Circular,
                    bevel_deg: f.face_bevel_deg,
                    max_deg: max,
                });
            }
            let miter_bevel = f.miter_flat.bevel_deg.min(f.miter_on_edge.bevel_deg);
            if s.saws.miter && miter_bevel > max + 1e-9 {
                out.push(FramingWarning::BevelBeyondSaw {
                    label: label.to_owned(),
                    end: c.end(),
                    saw: SawKind::Miter,
                    bevel_deg: miter_bevel,
                    max_deg: max,
                });
            }
        }
    }
    if let Some(longest) = s.longest_stock_in()
        && m.overall_length > longest + STOCK_TOL_IN
    {
        out.push(FramingWarning::StockLengthExceeded {
            label: label.to_owned(),
            length_in: m.overall_length,
            longest_stock_in: longest,
        });
    }
    out
}
