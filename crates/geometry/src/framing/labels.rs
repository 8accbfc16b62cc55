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
        let q = |x: f64| step(x, 1e4);
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
    // Longest first; lengths the same to a ten-thousandth of an inch (two
    // hands of one jack, say, a hair apart) keep the order of their first
    // pieces, so round-off never reorders labels.
    groups.sort_by(|a, b| {
        let (ka, kb) = (specs[a[0]].kind, specs[b[0]].kind);
        let length = |g: &[usize]| step(measured[g[0]].overall_length, 1e4);
        ka.cmp(&kb).then(length(b).cmp(&length(a))).then(a[0].cmp(&b[0]))
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

/// `x` in steps of `1 / per`, for grouping: whole steps counted from an
/// offset of about 0.38 of a step, so that the values plans are made of
/// (sixteenths and thirty-seconds of an inch, whole millimetres, round
/// degrees), which land on half steps of a thousandth, never sit on a
/// step's edge where round-off would put two identical pieces on either
/// side of it.
fn step(x: f64, per: f64) -> i64 {
    (x * per + STEP_OFFSET).floor() as i64
}

/// Where a grouping step starts, in steps: the golden section, far from
/// every simple fraction.
const STEP_OFFSET: f64 = 0.381_966_011_250_105;

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

/// The numbers of a cut list in steps, hand-free, pushed onto `out`.
fn cut_numbers(cuts: &[super::Cut], out: &mut Vec<i64>) {
    use super::Cut;
    let q = |x: f64| step(x, 1e3);
    let face = |f: &super::CutFace| {
        [q(f.side_angle_deg), q(f.top_edge_angle_deg), q(f.face_bevel_deg), q(f.edge_bevel_deg)]
    };
    for c in cuts {
        match c {
            Cut::Plumb { face: f, deduction_in, .. } | Cut::Cheek { face: f, deduction_in, .. } => {
                out.extend(face(f));
                out.push(q(*deduction_in));
            }
            Cut::SteppedCheek { face: f, step: g, step_in, step_from_side_in, deduction_in, .. } => {
                out.extend(face(f));
                out.extend(face(g));
                out.extend([q(*step_in), q(*step_from_side_in), q(*deduction_in)]);
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

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn round_off_never_splits_the_values_plans_are_made_of() {
        // Every sixteenth and thirty-second of an inch up to 24 in, and
        // every whole millimetre (in inches) up to 600 mm, must fall in the
        // same step as itself a few round-offs either side, at both steps
        // the grouping uses (derivation: 7/16 in = 0.4375, 437.5
        // thousandths, sits on a half step, where rounding to the nearest
        // step would split it; common practice, no source).
        let sixteenths = (0..=768).map(|k| f64::from(k) / 32.0);
        let millimetres = (0..=600).map(|k| f64::from(k) / 25.4);
        for x in sixteenths.chain(millimetres) {
            for per in [1e3, 1e4] {
                let wobble = x.abs().max(1.0) * 1e-12;
                assert_eq!(step(x - wobble, per), step(x + wobble, per), "{x} at 1/{per}");
            }
        }
        // And the steps still tell apart what a framer would.
        assert_ne!(step(6.4375, 1e3), step(6.4385, 1e3));
        assert_ne!(step(187.7971, 1e4), step(187.7973, 1e4));
    }
}
