//! Inputs the fuzz targets (`fuzz/`) found to break an invariant, kept as
//! tests. A case the code does not yet handle is ignored with the reason;
//! run those with `cargo test -p pitchframe-geometry --test
//! fuzz_regressions -- --ignored`.

use glam::DVec2;
use pitchframe_geometry::{Outline, Roof, Wall, WallRoof, check_roof};

fn wall(x: f64, y: f64, roof: WallRoof, overhang_in: f64) -> Wall {
    Wall { corner: DVec2::new(x, y), roof, overhang_in }
}

/// Found by the `solve_frame` target with `PITCHFRAME_FUZZ_STRICT=1`: a thin
/// arrowhead of four walls, two of them gables, accepted as an outline.
/// The roof checker found a step between the two planes, planes meeting
/// without a roof line, and a gable face off its wall: gable wall 4
/// (counted from 1) meets wall 1 at an inside corner, (36, 96), and its
/// face carries on along its line above wall 1's plane (the rule in
/// `Roof::solve`), which the check had not allowed for.
#[test]
fn two_gable_arrowhead_solves_to_a_sound_roof() {
    let outline = Outline::new(
        vec![
            wall(36.0, 96.0, WallRoof::Pitched { rise_per_run: 5.0 / 12.0 }, 0.0),
            wall(72.0, 192.0, WallRoof::Gable, 16.0),
            wall(36.0, 90.0, WallRoof::Pitched { rise_per_run: 4.0 / 12.0 }, 17.0),
            wall(-444.0, 90.0, WallRoof::Gable, 18.0),
        ],
        Vec::new(),
    )
    .unwrap();
    let roof = Roof::solve(&outline).unwrap();
    let defects = check_roof(&outline, &roof);
    assert!(defects.is_empty(), "{defects:?}");
}
