//! Identical pieces grouped under one label.

use std::collections::HashMap;
use std::hash::{BuildHasherDefault, Hasher};

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
        // The piece's numbers, then its cuts' numbers sorted, in one list.
        let mut k = Vec::with_capacity(PIECE_NUMBERS + 9 * m.cuts.len());
        k.extend([
            q(s.size.thickness_in),
            q(s.size.depth_in),
            q(s.slope),
            q(m.theoretical_length),
            q(m.long_point_length),
            q(m.short_point_length),
            q(m.seat_to_top_cut),
            q(m.tail_length),
            q(m.overall_length),
        ]);
        cut_numbers(&m.cuts, &mut k);
        if let Some(cut_keys) = k.get_mut(PIECE_NUMBERS..) {
            cut_keys.sort_unstable();
        }
        (s.kind, k)
    };
    let keys: Vec<(MemberKind, Vec<i64>)> = (0..specs.len()).map(key).collect();
    let mut groups: Vec<Vec<usize>> = Vec::new();
    // The groups come out in the order of their first pieces whatever the
    // hasher: a plain multiply-and-rotate one is enough for these keys.
    let mut group_of: HashMap<&(MemberKind, Vec<i64>), usize, BuildHasherDefault<KeyHasher>> =
        HashMap::with_capacity_and_hasher(keys.len(), BuildHasherDefault::default());
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
    let mut counter: HashMap<MemberKind, usize> = HashMap::new();
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

/// How many of a piece's own numbers open its key, before its cuts'.
const PIECE_NUMBERS: usize = 9;

/// A fast hasher for the grouping keys (lists of whole numbers); nothing
/// here is an attacker's input.
#[derive(Default)]
struct KeyHasher(u64);

impl KeyHasher {
    fn add(&mut self, x: u64) {
        self.0 = (self.0.rotate_left(5) ^ x).wrapping_mul(0x517c_c1b7_2722_0a95);
    }
}

impl Hasher for KeyHasher {
    fn finish(&self) -> u64 {
        self.0
    }

    fn write(&mut self, bytes: &[u8]) {
        let mut words = bytes.chunks_exact(8);
        for w in &mut words {
            let mut word = [0u8; 8];
            word.copy_from_slice(w);
            self.add(u64::from_le_bytes(word));
        }
        for b in words.remainder() {
            self.add(u64::from(*b));
        }
    }

    fn write_u64(&mut self, x: u64) {
        self.add(x);
    }

    fn write_usize(&mut self, x: usize) {
        self.add(x as u64);
    }
}

/// The numbers of a cut list, rounded, hand-free, pushed onto `out`.
fn cut_numbers(cuts: &[super::Cut], out: &mut Vec<i64>) {
    use super::Cut;
    let q = |x: f64| (x * 1e3).round() as i64;
    let face = |f: &super::CutFace| {
        [q(f.side_angle_deg), q(f.top_edge_angle_deg), q(f.face_bevel_deg), q(f.edge_bevel_deg)]
    };
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
}
