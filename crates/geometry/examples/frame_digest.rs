//! Prints a digest of every frame over a fixed set of plans, one line per
//! plan and settings, so two builds of the framing can be compared frame
//! by frame with `diff`: the same line means the same `{:?}` text of the
//! `frame_roof` result (every field, every float to the bit), to the byte.
//!
//! The plans: the demo house (with its own settings and with the frame
//! benchmark's, default settings at 16 in centres), the plans in the top
//! level's `examples/` (their own settings and the default ones), the frame
//! benchmark's 200 ft x 120 ft plan with many wings (its settings, 12 in
//! centres), `crates/app/benches/many-wings.toml` (its own settings), and
//! the long run's draws for seeds `0..SEEDS` (orthogonal for even seeds,
//! star for odd, features from the seed, default settings; a refused draw
//! or a refused solve prints its message's digest all the same). A frame
//! that panics prints `panic` and the panic's message.
//!
//! Run with `cargo run --release -p pitchframe-geometry --example
//! frame_digest -- [SEEDS]` (default 3,000). `-- full NAME` prints the
//! whole `{:#?}` text of one of the fixed plans (`demo`, `demo-bench`,
//! `large`, ...) instead, to find where two builds differ. `-- once demo
//! N` (or `large`) frames the benchmark's plan N times after one solve,
//! for counting the framing's instructions under `valgrind
//! --tool=callgrind` as the difference between N and 0.

use std::collections::hash_map::DefaultHasher;
use std::fmt::Write as _;
use std::hash::Hasher;
use std::io::Write as _;
use std::panic::{AssertUnwindSafe, catch_unwind};

use pitchframe_geometry::framing::{FramingSettings, frame_roof};

// The allocator the app runs with, so the figures are the app's.
#[global_allocator]
static ALLOCATOR: mimalloc::MiMalloc = mimalloc::MiMalloc;
use pitchframe_geometry::{
    Outline, OutlineFeatures, OutlineShape, Plan, Roof, demo_plan, many_wings, random_outline_or_refusal,
};

/// Feeds formatted text straight into a hasher, so a large frame's text
/// is never held whole.
struct HashWriter(DefaultHasher);

impl std::fmt::Write for HashWriter {
    fn write_str(&mut self, s: &str) -> std::fmt::Result {
        self.0.write(s.as_bytes());
        Ok(())
    }
}

/// The digest of a value's `{:#?}` text.
fn digest_of(value: &impl std::fmt::Debug) -> u64 {
    let mut w = HashWriter(DefaultHasher::new());
    // Writing into a hasher cannot fail.
    let _ = write!(w, "{value:?}");
    w.0.finish()
}

/// The frame benchmark's settings for the demo house.
fn bench_settings() -> FramingSettings {
    FramingSettings { spacing_in: 16.0, ..FramingSettings::default() }
}

/// A plan file beside the workspace, read and checked.
fn plan_file(relative: &str) -> Option<Plan> {
    let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("../..").join(relative);
    std::fs::read_to_string(path).ok().and_then(|t| Plan::from_toml(&t).ok())
}

/// The fixed plans, each with its label, outline and settings.
fn fixed_cases() -> Vec<(String, Outline, FramingSettings)> {
    let mut cases = Vec::new();
    if let Ok(plan) = demo_plan()
        && let (Ok(o), Ok(s)) = (plan.outline(), plan.framing_settings())
    {
        cases.push(("demo".to_string(), o.clone(), s));
        cases.push(("demo-bench".to_string(), o, bench_settings()));
    }
    let mut names: Vec<String> =
        std::fs::read_dir(std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("../../examples"))
            .map(|dir| {
                dir.filter_map(Result::ok)
                    .map(|e| e.file_name().to_string_lossy().into_owned())
                    .filter(|n| n.ends_with(".toml"))
                    .collect()
            })
            .unwrap_or_default();
    names.sort();
    for name in names {
        if let Some(plan) = plan_file(&format!("examples/{name}"))
            && let (Ok(o), Ok(s)) = (plan.outline(), plan.framing_settings())
        {
            cases.push((name.clone(), o.clone(), s));
            cases.push((format!("{name}-default"), o, FramingSettings::default()));
        }
    }
    if let Ok(o) = many_wings(0.5) {
        cases.push(("large".to_string(), o, FramingSettings { spacing_in: 12.0, ..bench_settings() }));
    }
    if let Some(plan) = plan_file("crates/app/benches/many-wings.toml")
        && let (Ok(o), Ok(s)) = (plan.outline(), plan.framing_settings())
    {
        cases.push(("many-wings.toml".to_string(), o, s));
    }
    cases
}

/// The digest of one frame (or of the solve's refusal), or the panic's
/// message.
fn frame_digest(outline: &Outline, settings: &FramingSettings) -> String {
    let run = catch_unwind(AssertUnwindSafe(|| match Roof::solve(outline) {
        Ok(roof) => digest_of(&frame_roof(outline, &roof, settings)),
        Err(e) => digest_of(&e),
    }));
    match run {
        Ok(h) => format!("{h:016x}"),
        Err(payload) => {
            let text = payload
                .downcast_ref::<&str>()
                .map(|s| s.to_string())
                .or_else(|| payload.downcast_ref::<String>().cloned())
                .unwrap_or_default();
            format!("panic {text}")
        }
    }
}

fn main() {
    let words: Vec<String> = std::env::args().skip(1).collect();
    match words.first().map(String::as_str) {
        Some("once") => {
            let n: usize = words.get(2).and_then(|w| w.parse().ok()).unwrap_or(1);
            let (outline, settings) = match words.get(1).map(String::as_str) {
                Some("large") => {
                    (many_wings(0.5).ok(), FramingSettings { spacing_in: 12.0, ..bench_settings() })
                }
                _ => (demo_plan().ok().and_then(|p| p.outline().ok()), bench_settings()),
            };
            let Some(outline) = outline else { return };
            let Ok(roof) = Roof::solve(&outline) else { return };
            let mut members = 0;
            for _ in 0..n {
                members += frame_roof(&outline, &roof, &settings).map_or(0, |f| f.members.len());
            }
            println!("{members}");
            return;
        }
        Some("full") => {
            let name = words.get(1).cloned().unwrap_or_default();
            for (label, outline, settings) in fixed_cases() {
                if label == name {
                    match Roof::solve(&outline) {
                        Ok(roof) => println!("{:#?}", frame_roof(&outline, &roof, &settings)),
                        Err(e) => println!("{e:#?}"),
                    }
                }
            }
            return;
        }
        _ => {}
    }
    // Panics are reported in the digest line, not on the terminal.
    std::panic::set_hook(Box::new(|_| {}));
    let seeds: u64 = words.first().and_then(|w| w.parse().ok()).unwrap_or(3_000);
    let out = std::io::stdout();
    let mut out = out.lock();
    let mut emit = |label: &str, digest: String| {
        // A closed pipe ends the run; nothing else can fail here.
        if writeln!(out, "{label} {digest}").is_err() {
            std::process::exit(0);
        }
    };
    for (label, outline, settings) in fixed_cases() {
        emit(&label, frame_digest(&outline, &settings));
    }
    let settings = FramingSettings::default();
    for seed in 0..seeds {
        let shape = if seed % 2 == 0 { OutlineShape::Orthogonal } else { OutlineShape::Star };
        let label = format!("seed {seed}");
        match random_outline_or_refusal(shape, seed, OutlineFeatures::from_seed(seed)) {
            Ok(o) => emit(&label, frame_digest(&o, &settings)),
            Err(e) => emit(&label, format!("refused {:016x}", digest_of(&e))),
        }
    }
}
