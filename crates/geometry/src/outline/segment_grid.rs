//! A uniform grid over plan segments, for finding the pairs of segments that
//! may touch without testing every pair.
//!
//! Each segment is entered in every cell its padded band crosses, so two
//! segments closer than the padding always share a cell. The work is about
//! linear in the number of segments for outlines whose walls are spread
//! over the plan; a cell crowded with segments costs the square of its
//! count, which only very unusual outlines produce.

use glam::DVec2;

/// Inputs at or below this size are searched pair by pair: building a grid
/// costs more than it saves.
const BRUTE_FORCE_LIMIT: usize = 48;

/// Most cells along one axis, so a long thin outline does not ask for a
/// huge grid.
const MAX_CELLS_PER_AXIS: usize = 2048;

/// Segments entered in a uniform grid.
pub(crate) struct SegmentGrid {
    min: DVec2,
    cell: DVec2,
    cols: usize,
    rows: usize,
    /// Segment indices per cell, row-major; empty when searching pair by pair.
    cells: Vec<Vec<u32>>,
    count: usize,
}

impl SegmentGrid {
    /// Enters the segments; `pad_in` is how close two segments must come
    /// to be reported as a candidate pair.
    pub(crate) fn new(segments: &[(DVec2, DVec2)], pad_in: f64) -> Self {
        let count = segments.len();
        let mut min = DVec2::splat(f64::INFINITY);
        let mut max = DVec2::splat(f64::NEG_INFINITY);
        for &(a, b) in segments {
            min = min.min(a.min(b));
            max = max.max(a.max(b));
        }
        let pad = pad_in.max(0.0);
        min -= DVec2::splat(pad);
        max += DVec2::splat(pad);
        let span = (max - min).max(DVec2::splat(f64::MIN_POSITIVE));
        if count <= BRUTE_FORCE_LIMIT || !span.is_finite() {
            return Self { min, cell: span, cols: 1, rows: 1, cells: Vec::new(), count };
        }
        // About one cell per segment, square where the plan allows it.
        let side = (span.x * span.y / count as f64).sqrt().max(span.max_element() / count as f64);
        let cols = ((span.x / side).ceil() as usize).clamp(1, MAX_CELLS_PER_AXIS);
        let rows = ((span.y / side).ceil() as usize).clamp(1, MAX_CELLS_PER_AXIS);
        let cell = DVec2::new(span.x / cols as f64, span.y / rows as f64);
        let mut grid = Self { min, cell, cols, rows, cells: vec![Vec::new(); cols * rows], count };
        for (index, &(a, b)) in segments.iter().enumerate() {
            let id = index as u32;
            grid.for_cells_of(a, b, pad, |cell| cell.push(id));
        }
        grid
    }

    fn col_of(&self, x: f64) -> usize {
        (((x - self.min.x) / self.cell.x).floor().max(0.0) as usize).min(self.cols - 1)
    }

    fn row_of(&self, y: f64) -> usize {
        (((y - self.min.y) / self.cell.y).floor().max(0.0) as usize).min(self.rows - 1)
    }

    /// Calls `visit` on every cell the segment, widened by `pad`, crosses.
    fn for_cells_of(&mut self, a: DVec2, b: DVec2, pad: f64, mut visit: impl FnMut(&mut Vec<u32>)) {
        let row_lo = self.row_of(a.y.min(b.y) - pad);
        let row_hi = self.row_of(a.y.max(b.y) + pad);
        for row in row_lo..=row_hi {
            let band_lo = self.min.y + row as f64 * self.cell.y - pad;
            let band_hi = band_lo + self.cell.y + 2.0 * pad;
            let (x_lo, x_hi) = x_range_in_band(a, b, band_lo, band_hi);
            let col_lo = self.col_of(x_lo - pad);
            let col_hi = self.col_of(x_hi + pad);
            for col in col_lo..=col_hi {
                if let Some(cell) = self.cells.get_mut(row * self.cols + col) {
                    visit(cell);
                }
            }
        }
    }

    /// Calls `visit(i, j)` with `i < j` for every pair of segments that
    /// share a cell (some pairs more than once).
    pub(crate) fn for_each_candidate_pair(&self, mut visit: impl FnMut(usize, usize)) {
        if self.cells.is_empty() {
            for i in 0..self.count {
                for j in i + 1..self.count {
                    visit(i, j);
                }
            }
            return;
        }
        for cell in &self.cells {
            for (k, &i) in cell.iter().enumerate() {
                for &j in cell.iter().skip(k + 1) {
                    visit(i.min(j) as usize, i.max(j) as usize);
                }
            }
        }
    }

    /// Calls `visit(i)` for every segment that may come within the padding
    /// of the point (some more than once).
    pub(crate) fn for_each_near(&self, point: DVec2, mut visit: impl FnMut(usize)) {
        if self.cells.is_empty() {
            (0..self.count).for_each(visit);
            return;
        }
        let index = self.row_of(point.y) * self.cols + self.col_of(point.x);
        for &i in self.cells.get(index).map_or(&[][..], Vec::as_slice) {
            visit(i as usize);
        }
    }

    /// Every segment that may cross the horizontal ray from `point` towards
    /// +x, each once: the segments entered in the point's row of cells from
    /// its column on.
    pub(crate) fn right_of(&self, point: DVec2) -> Vec<usize> {
        if self.cells.is_empty() {
            return (0..self.count).collect();
        }
        let row = self.row_of(point.y);
        let mut found: Vec<usize> = (self.col_of(point.x)..self.cols)
            .filter_map(|col| self.cells.get(row * self.cols + col))
            .flatten()
            .map(|&i| i as usize)
            .collect();
        found.sort_unstable();
        found.dedup();
        found
    }
}

/// The x extent of the part of segment a-b whose y lies in `[lo, hi]`.
fn x_range_in_band(a: DVec2, b: DVec2, lo: f64, hi: f64) -> (f64, f64) {
    let dy = b.y - a.y;
    if dy.abs() <= f64::EPSILON * (a.y.abs() + b.y.abs()) {
        return (a.x.min(b.x), a.x.max(b.x));
    }
    let t0 = ((lo - a.y) / dy).clamp(0.0, 1.0);
    let t1 = ((hi - a.y) / dy).clamp(0.0, 1.0);
    let x0 = a.x + (b.x - a.x) * t0;
    let x1 = a.x + (b.x - a.x) * t1;
    (x0.min(x1), x0.max(x1))
}

#[cfg(test)]
mod tests {
    use super::*;

    fn ring(n: usize) -> Vec<(DVec2, DVec2)> {
        let points: Vec<DVec2> = (0..n)
            .map(|i| {
                let angle = i as f64 / n as f64 * std::f64::consts::TAU;
                DVec2::new(angle.cos(), angle.sin()) * 100.0
            })
            .collect();
        (0..n).map(|i| (points[i], points[(i + 1) % n])).collect()
    }

    #[test]
    fn neighbours_on_a_ring_share_a_cell() {
        let segments = ring(500);
        let grid = SegmentGrid::new(&segments, 0.01);
        let mut found = vec![false; segments.len()];
        grid.for_each_candidate_pair(|i, j| {
            if j == i + 1 {
                found[i] = true;
            }
        });
        assert!(found[..segments.len() - 1].iter().all(|&f| f));
    }

    #[test]
    fn far_segments_are_not_paired() {
        let segments = ring(500);
        let grid = SegmentGrid::new(&segments, 0.01);
        let mut pairs = 0usize;
        grid.for_each_candidate_pair(|_, _| pairs += 1);
        // A ring's walls spread over the grid: far fewer than all n^2 / 2 pairs.
        assert!(pairs < 500 * 20, "{pairs} candidate pairs");
    }
}
