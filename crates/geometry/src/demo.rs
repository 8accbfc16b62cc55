//! The built-in demo: an invented house that shows every member kind.
//!
//! An L-shaped single-storey house: a 44 ft x 28 ft main block with a
//! 14 ft wide wing running 12 ft north off its east end. The main block is
//! hipped at 6 in 12 with a steeper 9 in 12 west end; the wing ends in a
//! gable. Its roof has commons, king commons, hips (one of them between the
//! main roof and the wing), a valley, hip jacks, valley jacks and cripple
//! jacks, so every member kind appears.

use glam::{DVec2, dvec2};

use crate::{Outline, OutlineError, Plan, PlanError, Wall, WallRoof};

/// The demo plan as TOML, exactly as a user would write it.
pub const DEMO_PLAN_TOML: &str = r#"# Pitchframe demo: an invented L-shaped house.
format = 1
units = "in"

[roof]
pitch = "6/12"
overhang = 16

[framing]
spacing = 24
layout_from = 0
rafter = "2x8"
hip = "2x10"
valley = "2x10"
ridge = "2x10"
seat = "3-1/2"
heel = "auto"
tail = "plumb"
hips = "backed"
notch_limit = 0.333

[[wall]]          # 1: south, the long eave
at = [0, 0]
[[wall]]          # 2: east, main block end and wing side in one
at = ["44'", 0]
[[wall]]          # 3: wing gable end
at = ["44'", "40'"]
gable = true
[[wall]]          # 4: wing west side
at = ["30'", "40'"]
[[wall]]          # 5: north eave of the main block
at = ["30'", "28'"]
[[wall]]          # 6: west end, steeper
at = [0, "28'"]
pitch = "9/12"
"#;

/// The demo plan, parsed.
pub fn demo_plan() -> Result<Plan, PlanError> {
    Plan::from_toml(DEMO_PLAN_TOML)
}

/// A large invented plan for benchmarks and tests: a 200 ft x 40 ft block
/// with ten 16 ft wide wings running 40 ft out on each side (200 ft x
/// 120 ft overall), every wall pitched at `rise_per_run` with a 16 in
/// overhang. Hipped at 6/12 and framed at 12 in centres it has about two
/// thousand members.
pub fn many_wings(rise_per_run: f64) -> Result<Outline, OutlineError> {
    let ft = 12.0;
    let (len, depth, wing, reach) = (200.0 * ft, 40.0 * ft, 16.0 * ft, 40.0 * ft);
    let starts: Vec<f64> = (0..10).map(|i| (2.0 + 20.0 * f64::from(i)) * ft).collect();
    let mut corners: Vec<DVec2> = vec![dvec2(0.0, 0.0)];
    // South side, west to east, wings reaching down.
    for &x in &starts {
        corners.extend([dvec2(x, 0.0), dvec2(x, -reach), dvec2(x + wing, -reach), dvec2(x + wing, 0.0)]);
    }
    corners.push(dvec2(len, 0.0));
    corners.push(dvec2(len, depth));
    // North side, east to west, wings reaching up.
    for &x in starts.iter().rev() {
        corners.extend([
            dvec2(x + wing, depth),
            dvec2(x + wing, depth + reach),
            dvec2(x, depth + reach),
            dvec2(x, depth),
        ]);
    }
    corners.push(dvec2(0.0, depth));
    let walls = corners
        .into_iter()
        .map(|corner| Wall { corner, roof: WallRoof::Pitched { rise_per_run }, overhang_in: 16.0 })
        .collect();
    Outline::new(walls, Vec::new())
}
