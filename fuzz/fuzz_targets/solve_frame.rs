//! The roof solve and the framing on outlines made from the fuzzer's bytes:
//! neither panics. With `PITCHFRAME_FUZZ_STRICT=1` a solved roof must also
//! pass the independent roof check and a frame's joints fit within 1/64 in
//! (off by default: the long random run counts those failures, and a
//! fuzzer stopping at the first one would look for panics no further).
//!
//! Bytes are read in groups of four per corner: x and y as signed 8-bit
//! steps on a 6 in grid from the last corner (so outlines stay small and
//! often valid), a pitch byte (0 is a gable, else n/12 for n in 1..=24) and
//! an overhang byte (0 to 31 in). A first byte over 200 asks for a
//! courtyard made of the last corners.
#![no_main]

use glam::DVec2;
use libfuzzer_sys::fuzz_target;
use pitchframe_geometry::{FramingSettings, Outline, Roof, Wall, WallRoof, check_roof, frame_roof};

/// Largest outline tried, corners: keeps each run fast.
const MAX_FUZZ_CORNERS: usize = 48;

fn walls(data: &[u8]) -> Vec<Wall> {
    let mut at = DVec2::ZERO;
    data.chunks_exact(4)
        .take(MAX_FUZZ_CORNERS)
        .map(|c| {
            at += DVec2::new(f64::from(c[0] as i8), f64::from(c[1] as i8)) * 6.0;
            let roof = match c[2] % 25 {
                0 => WallRoof::Gable,
                n => WallRoof::Pitched { rise_per_run: f64::from(n) / 12.0 },
            };
            Wall { corner: at, roof, overhang_in: f64::from(c[3] % 32) }
        })
        .collect()
}

fuzz_target!(|data: &[u8]| {
    let Some((&head, rest)) = data.split_first() else { return };
    let mut outer = walls(rest);
    let courtyards = if head > 200 && outer.len() >= 8 {
        let inner = outer.split_off(outer.len() - 4);
        vec![inner]
    } else {
        Vec::new()
    };
    let Ok(outline) = Outline::new(outer, courtyards) else { return };
    let Ok(roof) = Roof::solve(&outline) else { return };
    let strict = std::env::var_os("PITCHFRAME_FUZZ_STRICT").is_some_and(|v| v == "1");
    let defects = check_roof(&outline, &roof);
    assert!(!strict || defects.is_empty(), "roof check: {defects:?}\noutline: {outline:?}");
    let Ok(frame) = frame_roof(&outline, &roof, &FramingSettings::default()) else { return };
    for j in frame.joints.iter().filter(|_| strict) {
        assert!(
            j.max_gap < 1.0 / 64.0 && j.max_overlap < 1.0 / 64.0,
            "joint {:?}: gap {} overlap {}\noutline: {outline:?}",
            j.members,
            j.max_gap,
            j.max_overlap
        );
    }
});
