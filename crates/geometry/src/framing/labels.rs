//! Identical pieces grouped under one label.

use super::MemberKind;
use super::board::PieceSpec;
use super::measure::Measured;

/// Labels and groups of identical pieces.
pub struct Labels {
    /// Each piece's label.
    pub labels: Vec<String>,
    /// Pieces of each member, longest members of a kind first.
    pub groups: Vec<Vec<usize>>,
}

/// Groups identical pieces (mirror images together) and labels each group
/// by kind, longest first.
pub fn label_pieces(specs: &[PieceSpec], measured: &[Measured]) -> Labels {
    let key = |i: usize| -> (MemberKind, Vec<i64>) {
        let m = &measured[i];
        let s = &specs[i];
        let q = |x: f64| (x * 1e4).round() as i64;
        let mut k = vec![
            q(s.size.thickness_in),
            q(s.size.depth_in),
            q(s.slope),
            q(m.theoretical_length),
            q(m.long_point_length),
            q(m.short_point_length),
            q(m.seat_to_top_cut),
            q(m.tail_length),
            q(m.overall_length),
        ];
        let mut cut_keys: Vec<i64> = Vec::new();
        let json = serde_json_like(&m.cuts);
        cut_keys.extend(json);
        cut_keys.sort_unstable();
        k.extend(cut_keys);
        (s.kind, k)
    };
    let keys: Vec<(MemberKind, Vec<i64>)> = (0..specs.len()).map(key).collect();
    let mut groups: Vec<Vec<usize>> = Vec::new();
    let mut group_of: std::collections::HashMap<&(MemberKind, Vec<i64>), usize> =
        std::collections::HashMap::with_capacity(keys.len());
    for (i, key) in keys.iter().enumerate() {
        match group_of.get(key) {
            Some(&g) => groups[g].push(i),
            None => {
                group_of.insert(key, groups.len());
                groups.push(vec![i]);
            }
        }
    }
    groups.sort_by(|a, b| {
        let (ka, kb) = (specs[a[0]].kind, specs[b[0]].kind);
        ka.cmp(&kb).then(measured[b[0]].overall_length.total_cmp(&measured[a[0]].overall_length))
    });
    let mut labels = vec![String::new(); specs.len()];
    let mut counter: std::collections::HashMap<MemberKind, usize> = std::collections::HashMap::new();
    for g in &groups {
        let kind = specs[g[0]].kind;
        let n = counter.entry(kind).or_insert(0);
        *n += 1;
        let label = format!("{}{}", kind.label_prefix(), n);
        for &i in g {
            labels[i] = label.clone();
        }
    }
    Labels { labels, groups }
}

/// The numbers of a cut list, rounded, hand-free.
fn serde_json_like(cuts: &[super::Cut]) -> Vec<i64> {
    use super::Cut;
    let q = |x: f64| (x * 1e3).round() as i64;
    let face = |f: &super::CutFace| {
        [q(f.side_angle_deg), q(f.top_edge_angle_deg), q(f.face_bevel_deg), q(f.edge_bevel_deg)]
    };
    let mut out = Vec::new();
    for c in cuts {
        match c {
            Cut::Plumb { face: f, deduction_in, .. } | Cut::Cheek { face: f, deduction_in, .. } => {
                out.extend(face(f));
                out.push(q(*deduction_in));
            }
            Cut::DoubleCheek { left, right, deduction_in, .. } => {
                out.extend(face(left));
                out.extend(face(right));
                out.push(q(*deduction_in));
            }
            Cut::Seat { seat_width_in, heel_height_in, notch_depth_in, drop_in, .. } => {
                out.extend([q(*seat_width_in), q(*heel_height_in), q(*notch_depth_in), q(*drop_in)]);
            }
            Cut::Tail { faces, .. } => out.extend(faces.iter().flat_map(face)),
            Cut::Soffit { length_in, .. } => out.push(q(*length_in)),
            Cut::PlateLevel { length_in, depth_off_in, .. } => out.extend([q(*length_in), q(*depth_off_in)]),
            Cut::Backing { left_deg, right_deg, .. } => out.extend([q(*left_deg), q(*right_deg)]),
            Cut::SquareEnd { .. } => {}
        }
    }
    out
}
