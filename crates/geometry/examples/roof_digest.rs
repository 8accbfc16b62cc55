//! Prints a digest of every solved roof over a fixed set of outlines, one
//! line per outline, so two builds of the solver can be compared roof by
//! roof with `diff`: the same line means the same `Debug` text of the
//! `Roof::solve` result, to the byte.
//!
//! The outlines: for each seed `0..SEEDS`, the long run's draw (orthogonal
//! for even seeds, star for odd, features from the seed; refusals are left
//! out), the other shape with the seed's features and the seed's shape with
//! every feature; `DRAWS` property-style draws each of plain orthogonal,
//! plain star and each shape with its seed's features (seeds from a fixed
//! random source); the demo plan and the example plans; and large star and
//! comb plans built as the solve benchmark builds them, with 50 to 2,549
//! corners at one pitch and at seven mixed pitches, and the benchmark's own
//! six (seed 7).
//!
//! Run with `cargo run --release -p pitchframe-geometry --example roof_digest
//! -- [SEEDS] [DRAWS] [LARGE]` (defaults 20,000, 3,000 and 120: 72,489
//! outlines); with `ROOF_DIGEST_CHECK` set every roof is also checked with
//! `check_roof` and a line ends in `UNSOUND` where it fails. `-- once star
//! N` (or `comb`) solves the benchmark's plan of N corners once, for
//! counting instructions with `valgrind --tool=callgrind
//! --toggle-collect='*Roof*solve*'`.

use std::collections::hash_map::DefaultHasher;
use std::hash::Hasher;
use std::io::Write;

use glam::DVec2;
use pitchframe_geometry::{
    Outline, OutlineFeatures, OutlineShape, Plan, Roof, Wall, WallRoof, check_roof, comb_corners, demo_plan,
    random_outline_or_refusal, random_outline_with, star_corners,
};

// The allocator the app runs with, so the figures are the app's.
#[global_allocator]
static ALLOCATOR: mimalloc::MiMalloc = mimalloc::MiMalloc;

/// A small deterministic random source (a 64-bit LCG, as `star_corners` uses).
struct Lcg(u64);

impl Lcg {
    fn next(&mut self) -> f64 {
        self.0 = self.0.wrapping_mul(6364136223846793005).wrapping_add(1442695040888963407);
        (self.0 >> 11) as f64 / (1u64 << 53) as f64
    }

    fn next_u64(&mut self) -> u64 {
        self.0 = self.0.wrapping_mul(6364136223846793005).wrapping_add(1442695040888963407);
        self.0
    }
}

/// The seven pitches of the mixed-pitch large plans, rise per run.
const PITCHES: [f64; 7] = [0.25, 0.333, 0.5, 0.5833, 0.75, 1.0, 1.5];

fn walls(points: &[DVec2], mixed: bool) -> Vec<Wall> {
    points
        .iter()
        .enumerate()
        .map(|(i, &corner)| Wall {
            corner,
            roof: WallRoof::Pitched {
                rise_per_run: if mixed {
                    PITCHES.get(i % PITCHES.len()).copied().unwrap_or(0.5)
                } else {
                    0.5
                },
            },
            overhang_in: 12.0,
        })
        .collect()
}

/// The solve benchmark's star: `n` corners at equal angles, random radii.
fn star(n: usize, seed: u64, mixed: bool) -> Option<Outline> {
    Outline::new(walls(&star_corners(n, seed, 3000.0), mixed), vec![]).ok()
}

/// The solve benchmark's comb of about `n` corners.
fn comb(n: usize, seed: u64, mixed: bool) -> Option<Outline> {
    let teeth = (n.saturating_sub(2) / 4).max(1);
    Outline::new(walls(&comb_corners(teeth, seed), mixed), vec![]).ok()
}

/// The digest of one solve, and whether the roof passes the checker.
fn digest(outline: &Outline) -> (u64, bool) {
    let solved = Roof::solve(outline);
    let text = format!("{solved:?}");
    let mut h = DefaultHasher::new();
    h.write(text.as_bytes());
    let sound = match &solved {
        Ok(roof) => check_roof(outline, roof).is_empty(),
        Err(_) => true,
    };
    (h.finish(), sound)
}

fn main() {
    // `once star N` or `once comb N`: one solve of the benchmark's plan
    // (seed 7), for counting its instructions.
    let words: Vec<String> = std::env::args().skip(1).collect();
    if words.first().map(String::as_str) == Some("once") {
        let n: usize = words.get(2).and_then(|w| w.parse().ok()).unwrap_or(10_000);
        let outline = match words.get(1).map(String::as_str) {
            Some("comb") => comb(n, 7, false),
            _ => star(n, 7, false),
        };
        if let Some(o) = outline {
            let roof = Roof::solve(&o);
            println!("{}", roof.map_or(0, |r| r.planes.len()));
        }
        return;
    }
    let args: Vec<u64> = std::env::args().skip(1).filter_map(|a| a.parse().ok()).collect();
    let seeds = args.first().copied().unwrap_or(20_000);
    let draws = args.get(1).copied().unwrap_or(3_000);
    let large = args.get(2).copied().unwrap_or(120);
    let check = std::env::var_os("ROOF_DIGEST_CHECK").is_some();
    let out = std::io::stdout();
    let mut out = out.lock();
    let mut emit = |label: String, outline: &Outline| {
        let (h, sound) = if check {
            digest(outline)
        } else {
            let text = format!("{:?}", Roof::solve(outline));
            let mut h = DefaultHasher::new();
            h.write(text.as_bytes());
            (h.finish(), true)
        };
        let mark = if sound { "" } else { " UNSOUND" };
        // A closed pipe ends the run; nothing else can fail here.
        if writeln!(out, "{label} {h:016x}{mark}").is_err() {
            std::process::exit(0);
        }
    };
    let shapes = [OutlineShape::Orthogonal, OutlineShape::Star];
    for seed in 0..seeds {
        let own = shapes[(seed % 2) as usize];
        let other = shapes[1 - (seed % 2) as usize];
        let features = OutlineFeatures::from_seed(seed);
        if let Ok(o) = random_outline_or_refusal(own, seed, features) {
            emit(format!("seed {seed}"), &o);
        }
        emit(format!("seed {seed} other"), &random_outline_with(other, seed, features));
        emit(format!("seed {seed} all"), &random_outline_with(own, seed, OutlineFeatures::ALL));
    }
    let mut rng = Lcg(0x0DD5_EED5);
    for i in 0..draws {
        for (k, (shape, plain)) in [
            (OutlineShape::Orthogonal, true),
            (OutlineShape::Star, true),
            (OutlineShape::Orthogonal, false),
            (OutlineShape::Star, false),
        ]
        .into_iter()
        .enumerate()
        {
            let seed = rng.next_u64();
            let features = if plain { OutlineFeatures::PLAIN } else { OutlineFeatures::from_seed(seed) };
            emit(format!("draw {i} kind {k} seed {seed}"), &random_outline_with(shape, seed, features));
        }
    }
    if let Ok(o) = demo_plan().map_err(|_| ()).and_then(|p| p.outline().map_err(|_| ())) {
        emit("demo".to_string(), &o);
    }
    for name in ["hillside-cottage.toml", "metric-bungalow.toml"] {
        let path = std::path::Path::new(env!("CARGO_MANIFEST_DIR")).join("../../examples").join(name);
        let plan = std::fs::read_to_string(path).ok().and_then(|t| Plan::from_toml(&t).ok());
        if let Some(o) = plan.and_then(|p| p.outline().ok()) {
            emit(name.to_string(), &o);
        }
    }
    for n in [100usize, 1_000, 10_000] {
        if let Some(o) = star(n, 7, false) {
            emit(format!("bench star {n}"), &o);
        }
        if let Some(o) = comb(n, 7, false) {
            emit(format!("bench comb {n}"), &o);
        }
    }
    let mut sizes = Lcg(0x51_2E5);
    for i in 0..large {
        let n = 50 + (sizes.next() * 2_500.0) as usize;
        let seed = 1_000 + i;
        for mixed in [false, true] {
            if let Some(o) = star(n, seed, mixed) {
                emit(format!("large star {n} seed {seed} mixed {mixed}"), &o);
            }
            if let Some(o) = comb(n, seed, mixed) {
                emit(format!("large comb {n} seed {seed} mixed {mixed}"), &o);
            }
        }
    }
}
