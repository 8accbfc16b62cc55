//! The pitch parser on any text: it answers, never panics, and what it
//! accepts is a finite slope above level and below plumb whose display
//! reads back.
#![no_main]

use libfuzzer_sys::fuzz_target;
use pitchframe_geometry::Pitch;

fuzz_target!(|data: &[u8]| {
    let Ok(text) = std::str::from_utf8(data) else { return };
    let Ok(pitch) = Pitch::parse(text) else { return };
    let slope = pitch.rise_per_run();
    assert!(slope.is_finite() && slope > 0.0, "{text:?} gave slope {slope}");
    assert!(pitch.angle_rad() < std::f64::consts::FRAC_PI_2, "{text:?} is plumb");
    let shown = pitch.to_string();
    let back = Pitch::parse(&shown)
        .unwrap_or_else(|e| panic!("{text:?} shows as {shown:?}, which does not read back: {e}"));
    // Three decimals of rise in 12, or the exact shortest form for tiny rises.
    let rise = slope * 12.0;
    let tolerance = if rise < 0.0005 { 1e-12 * rise } else { 0.0005 + 1e-12 * rise };
    assert!((back.rise_per_run() * 12.0 - rise).abs() <= tolerance, "{text:?} shows as {shown:?}");
});
