//! The plan loader on any text: it answers, never panics, and a plan it
//! accepts saves to text that loads back to the same plan and yields an
//! outline or a message.
#![no_main]

use libfuzzer_sys::fuzz_target;
use pitchframe_geometry::Plan;

fuzz_target!(|data: &[u8]| {
    let Ok(text) = std::str::from_utf8(data) else { return };
    let Ok(plan) = Plan::from_toml(text) else { return };
    let saved = plan.to_toml();
    let again = Plan::from_toml(&saved)
        .unwrap_or_else(|e| panic!("a loaded plan saves to text that does not load: {e}\n{saved}"));
    assert_eq!(again, plan, "a loaded plan saved and loaded again differs\n{saved}");
    let _ = plan.outline();
});
