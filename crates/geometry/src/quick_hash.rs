//! A quick hash for the solver's maps and sets, whose keys are its own
//! node, vertex and wall numbers and plan cells, and for framing's table
//! of the piece shapes already cut.
//!
//! The standard library's hash guards against keys chosen to collide,
//! which numbers the solver makes never are, and on a large comb it cost
//! more than the lookups it served. Nothing reads these maps in hash
//! order (every walk over one sorts its keys first; the standard hash is
//! seeded afresh on every run, so nothing could), so the hash changes no
//! result.

use std::collections::{HashMap, HashSet};
use std::hash::{BuildHasherDefault, Hasher};

/// A map keyed by the solver's own numbers.
pub(crate) type QuickMap<K, V> = HashMap<K, V, BuildHasherDefault<QuickHasher>>;

/// A set of the solver's own numbers.
pub(crate) type QuickSet<K> = HashSet<K, BuildHasherDefault<QuickHasher>>;

/// Odd multiplier with well mixed bits (the one the Rust compiler's own
/// hasher uses for the same add-multiply scheme).
const MULTIPLIER: u64 = 0xf135_7aea_2e62_a9c5;

/// Add-multiply hashing of whole words, its high bits rotated down at the
/// end because the table picks buckets by the low bits.
#[derive(Debug, Default, Clone, Copy)]
pub(crate) struct QuickHasher(u64);

impl QuickHasher {
    /// Mixes in one word.
    fn add(&mut self, word: u64) {
        self.0 = self.0.wrapping_add(word).wrapping_mul(MULTIPLIER);
    }
}

impl Hasher for QuickHasher {
    fn write(&mut self, bytes: &[u8]) {
        for chunk in bytes.chunks(8) {
            let mut word = [0u8; 8];
            for (w, b) in word.iter_mut().zip(chunk) {
                *w = *b;
            }
            self.add(u64::from_le_bytes(word));
        }
    }

    fn write_u8(&mut self, i: u8) {
        self.add(u64::from(i));
    }

    fn write_u32(&mut self, i: u32) {
        self.add(u64::from(i));
    }

    fn write_u64(&mut self, i: u64) {
        self.add(i);
    }

    fn write_usize(&mut self, i: usize) {
        self.add(i as u64);
    }

    fn write_i64(&mut self, i: i64) {
        self.add(i as u64);
    }

    fn finish(&self) -> u64 {
        self.0.rotate_left(26)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn sequential_keys_spread_over_the_low_bits() {
        // Consecutive node numbers must not share their low bits, or the
        // table would put them all in a few buckets (derivation: the
        // table's bucket is the hash's low bits).
        let mut low: QuickSet<u64> = QuickSet::default();
        for n in 0..1024usize {
            let mut h = QuickHasher::default();
            h.write_usize(n);
            low.insert(h.finish() & 1023);
        }
        assert!(low.len() > 600, "only {} of 1024 buckets used", low.len());
    }

    #[test]
    fn a_map_finds_what_it_holds() {
        let mut m: QuickMap<(usize, usize), usize> = QuickMap::default();
        for a in 0..100 {
            m.insert((a, a + 1), a);
        }
        assert_eq!(m.get(&(41, 42)), Some(&41));
        assert_eq!(m.get(&(42, 41)), None);
    }
}
