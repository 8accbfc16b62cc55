//! The built-in demo: an invented house that shows every member kind.
//!
//! An L-shaped single-storey house: a 44 ft x 28 ft main block with a
//! 14 ft wide wing running 12 ft north off its east end. The main block is
//! hipped at 6 in 12 with a steeper 9 in 12 west end; the wing ends in a
//! gable. Its roof has commons, king commons, hips (one of them between the
//! main roof and the wing), a valley, hip jacks, valley jacks and cripple
//! jacks, so every member kind appears.

use crate::{Plan, PlanError};

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
