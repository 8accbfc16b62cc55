//! A long random run: solves and frames many seeded random outlines of
//! mixed kinds (orthogonal and star outlines with collinear runs, tiny
//! edges, near-parallel walls, mixed pitches, gables and courtyards drawn
//! from the seed), checks every solved roof with the independent roof
//! checker and every frame's joints, catches panics, and counts each
//! outcome.
//!
//! Run with `scripts/long-run COUNT [FIRST_SEED] [MAX_SECONDS]` or
//! `cargo run --release -p pitchframe-checks --example long_run -- COUNT
//! [FIRST_SEED] [MAX_SECONDS]`; it stops after COUNT outlines or
//! MAX_SECONDS, whichever comes first, and prints the figures so far every
//! ten minutes.
//! Seed `s` is an orthogonal outline when `s` is even and a star when odd,
//! with `OutlineFeatures::from_seed(s)`, so any seed it reports can be
//! replayed alone with `-- 1 s`.
//!
//! With `LONG_RUN_FAILURES=FILE` set, every outline that fails an invariant
//! or panics is also written to FILE, one line each (seed, a tab, the
//! message), so the failing seeds of two builds can be compared.
//!
//! With `LONG_RUN_INTERFERENCE=1` set, every pair of a frame's pieces,
//! joined or not, is also checked for wood shared (parry's contact depth
//! between their solids, the measure of the interference tests), and a
//! depth of 1/64 in or more is an invariant failure. It reads what the
//! joint check never does (boards side by side or crossing with no joint
//! between them); it is not yet part of the default run because random
//! outlines fail it far more often than the joint check (see
//! RELIABILITY.md, "Pieces sharing wood").

use std::collections::HashMap;
use std::io::Write;
use std::panic::{AssertUnwindSafe, catch_unwind};
use std::sync::Mutex;
use std::time::Instant;

use pitchframe_geometry::{
    FramingSettings, OutlineFeatures, OutlineShape, Roof, check_roof, frame_roof, random_outline_or_refusal,
};

// Parry's reading of the pieces' solids, shared with the framing tests.
#[allow(dead_code)]
#[path = "../crates/geometry/tests/framing_support/parry_fit.rs"]
mod parry_fit;

// The allocator the app runs with, so the outlines a second are the app's.
#[global_allocator]
static ALLOCATOR: mimalloc::MiMalloc = mimalloc::MiMalloc;

/// A joint fits when neither its gap nor its overlap reaches this, inches:
/// 1/64 in, finer than a pencil line (common practice, no source).
const JOINT_TOLERANCE_IN: f64 = 1.0 / 64.0;

/// How many failing seeds of each kind are kept for the report.
const SEEDS_KEPT: usize = 10;

/// The last panic's message, set by the panic hook and read after
/// `catch_unwind`; the hook keeps panics off the terminal.
static LAST_PANIC: Mutex<String> = Mutex::new(String::new());

/// What happened to one outline.
enum Outcome {
    /// Solved, checked clean, framed with every joint within tolerance.
    Ok,
    /// The solver or the framing refused it with a message.
    Rejected(String),
    /// The solver or the framing answered, but the answer is wrong.
    Invariant(String),
    /// Something panicked.
    Panic(String),
}

/// The shape of seed `seed`: orthogonal and star outlines alternate.
fn shape_of(seed: u64) -> OutlineShape {
    if seed.is_multiple_of(2) { OutlineShape::Orthogonal } else { OutlineShape::Star }
}

/// Digits replaced by `#` so that messages differing only in a wall
/// number or a length count as one kind.
fn kind_of(message: &str) -> String {
    let mut out = String::with_capacity(message.len());
    let mut in_number = false;
    for c in message.chars() {
        // A minus sign starts the number it stands before.
        let digit = c.is_ascii_digit() || c == '-' || (in_number && (c == '.' || c == 'e'));
        if digit {
            if !in_number {
                out.push('#');
            }
            in_number = true;
        } else {
            in_number = false;
            out.push(c);
        }
    }
    out.replace("#-", "#").replace("-#", "#")
}

/// The names of the details switched on in `f`.
fn feature_names(f: OutlineFeatures) -> Vec<&'static str> {
    let all = [
        (f.collinear_runs, "collinear runs"),
        (f.tiny_edges, "tiny edges"),
        (f.near_parallel, "near-parallel walls"),
        (f.mixed_pitches, "mixed pitches"),
        (f.gables, "gables"),
        (f.courtyard, "courtyard"),
    ];
    all.iter().filter(|(on, _)| *on).map(|(_, name)| *name).collect()
}

fn run_one(seed: u64, settings: &FramingSettings, interference: bool) -> Outcome {
    // A draw the outline check refuses as a person's plan would be (a gable
    // nearly in line with a pitched wall) counts as refused, with its message.
    let outline = match random_outline_or_refusal(shape_of(seed), seed, OutlineFeatures::from_seed(seed)) {
        Ok(outline) => outline,
        Err(e) => return Outcome::Rejected(format!("outline: {e}")),
    };
    let roof = match Roof::solve(&outline) {
        Ok(roof) => roof,
        Err(e) => return Outcome::Rejected(format!("solve: {e}")),
    };
    let defects = check_roof(&outline, &roof);
    if let Some(first) = defects.first() {
        return Outcome::Invariant(format!("roof: {first}"));
    }
    let frame = match frame_roof(&outline, &roof, settings) {
        Ok(frame) => frame,
        Err(e) => return Outcome::Rejected(format!("frame: {e}")),
    };
    let worst_gap = frame.joints.iter().map(|j| j.max_gap).fold(0.0, f64::max);
    let worst_overlap = frame.joints.iter().map(|j| j.max_overlap).fold(0.0, f64::max);
    // A NaN fit is a failure too: `!(x < tol)` catches it.
    let bad =
        frame.joints.iter().find(|j| !(j.max_gap < JOINT_TOLERANCE_IN && j.max_overlap < JOINT_TOLERANCE_IN));
    if let Some(j) = bad {
        return Outcome::Invariant(format!(
            "joint {} on {}: gap {:.4} in, overlap {:.4} in (worst in frame {worst_gap:.4} / {worst_overlap:.4})",
            j.members[0], j.members[1], j.max_gap, j.max_overlap
        ));
    }
    // Two boards sharing wood, joined or not (a king laid across a hip,
    // ridges side by side): what the joint check alone never reads.
    if interference {
        let (depth, a, b, _unhulled) = parry_fit::interference_where_measurable(&frame, |_, _| false);
        // A NaN depth fails too.
        if depth >= JOINT_TOLERANCE_IN || depth.is_nan() {
            return Outcome::Invariant(format!("pieces {a} and {b} overlap by {depth:.4} in"));
        }
    }
    Outcome::Ok
}

/// Counts of one outcome by message kind, with a few seeds for each.
#[derive(Default)]
struct Tally {
    total: u64,
    kinds: HashMap<String, (u64, Vec<u64>, String)>,
}

impl Tally {
    fn add(&mut self, seed: u64, message: &str) {
        self.total += 1;
        let entry =
            self.kinds.entry(kind_of(message)).or_insert_with(|| (0, Vec::new(), message.to_string()));
        entry.0 += 1;
        if entry.1.len() < SEEDS_KEPT {
            entry.1.push(seed);
        }
    }

    fn report(&self, title: &str) {
        println!("{title}: {}", self.total);
        let mut kinds: Vec<_> = self.kinds.iter().collect();
        kinds.sort_by(|a, b| b.1.0.cmp(&a.1.0).then(a.0.cmp(b.0)));
        for (kind, (n, seeds, example)) in &kinds {
            println!("  {n:>9}  {kind}\n             seeds {seeds:?}; first: {example}");
        }
    }
}

/// Per detail (and per shape): outlines drawn with it, and how many of
/// those failed an invariant or panicked.
#[derive(Default)]
struct ByDetail(Vec<(&'static str, u64, u64)>);

impl ByDetail {
    fn add(&mut self, name: &'static str, failed: bool) {
        match self.0.iter_mut().find(|(n, _, _)| *n == name) {
            Some(row) => {
                row.1 += 1;
                row.2 += u64::from(failed);
            }
            None => self.0.push((name, 1, u64::from(failed))),
        }
    }

    fn report(&self) {
        println!("failures by shape and detail (an outline counts under each detail it has):");
        for (name, n, failed) in &self.0 {
            println!(
                "  {name:<22} {failed:>9} of {n:>9} ({:.1} %)",
                100.0 * *failed as f64 / (*n).max(1) as f64
            );
        }
    }
}

/// Every figure of the run so far.
struct Figures {
    first: u64,
    ok: u64,
    rejected: Tally,
    invariant: Tally,
    panicked: Tally,
    by_detail: ByDetail,
    slowest: (f64, u64),
}

impl Figures {
    fn done(&self) -> u64 {
        self.ok + self.rejected.total + self.invariant.total + self.panicked.total
    }

    fn report(&self, elapsed: f64) {
        let done = self.done();
        println!(
            "outlines: {done} (seeds {}..{}), {elapsed:.1} s, {:.0} per second",
            self.first,
            self.first + done,
            done as f64 / elapsed.max(1e-9)
        );
        println!("slowest: seed {} in {:.3} s", self.slowest.1, self.slowest.0);
        println!("ok: {}", self.ok);
        self.rejected.report("rejected with a message");
        self.invariant.report("invariant failures");
        self.panicked.report("panics");
        self.by_detail.report();
        println!();
    }
}

fn main() {
    let mut args = std::env::args().skip(1);
    let count: u64 = args.next().and_then(|a| a.parse().ok()).unwrap_or(10_000);
    let first: u64 = args.next().and_then(|a| a.parse().ok()).unwrap_or(0);
    let max_seconds: f64 = args.next().and_then(|a| a.parse().ok()).unwrap_or(f64::INFINITY);
    std::panic::set_hook(Box::new(|info| {
        let place = info.location().map(|l| format!(" at {}:{}", l.file(), l.line())).unwrap_or_default();
        let text = info
            .payload()
            .downcast_ref::<&str>()
            .map(|s| s.to_string())
            .or_else(|| info.payload().downcast_ref::<String>().cloned())
            .unwrap_or_default();
        if let Ok(mut last) = LAST_PANIC.lock() {
            *last = format!("{text}{place}");
        }
    }));
    let settings = FramingSettings::default();
    let interference = std::env::var_os("LONG_RUN_INTERFERENCE").is_some_and(|v| v == "1");
    let mut figures = Figures {
        first,
        ok: 0,
        rejected: Tally::default(),
        invariant: Tally::default(),
        panicked: Tally::default(),
        by_detail: ByDetail::default(),
        slowest: (0.0, first),
    };
    let mut failure_list = match std::env::var_os("LONG_RUN_FAILURES") {
        Some(path) => match std::fs::File::create(&path) {
            Ok(file) => Some(std::io::BufWriter::new(file)),
            Err(e) => {
                eprintln!("LONG_RUN_FAILURES: cannot write {}: {e}", path.to_string_lossy());
                std::process::exit(2);
            }
        },
        None => None,
    };
    let started = Instant::now();
    let mut last_note = Instant::now();
    let mut last_report = Instant::now();
    for seed in first..first.saturating_add(count) {
        if started.elapsed().as_secs_f64() > max_seconds {
            break;
        }
        let t = Instant::now();
        let outcome = catch_unwind(AssertUnwindSafe(|| run_one(seed, &settings, interference)))
            .unwrap_or_else(|_| Outcome::Panic(LAST_PANIC.lock().map(|s| s.clone()).unwrap_or_default()));
        let seconds = t.elapsed().as_secs_f64();
        if seconds > figures.slowest.0 {
            figures.slowest = (seconds, seed);
        }
        let failed = matches!(outcome, Outcome::Invariant(_) | Outcome::Panic(_));
        let shape = match shape_of(seed) {
            OutlineShape::Orthogonal => "orthogonal",
            OutlineShape::Star => "star",
        };
        figures.by_detail.add(shape, failed);
        let features = OutlineFeatures::from_seed(seed);
        if features == OutlineFeatures::PLAIN {
            figures.by_detail.add("no details", failed);
        }
        for name in feature_names(features) {
            figures.by_detail.add(name, failed);
        }
        if let (Some(list), Outcome::Invariant(m) | Outcome::Panic(m)) = (failure_list.as_mut(), &outcome)
            && let Err(e) = writeln!(list, "{seed}\t{m}")
        {
            eprintln!("LONG_RUN_FAILURES: {e}");
            std::process::exit(2);
        }
        match outcome {
            Outcome::Ok => figures.ok += 1,
            Outcome::Rejected(m) => figures.rejected.add(seed, &m),
            Outcome::Invariant(m) => figures.invariant.add(seed, &m),
            Outcome::Panic(m) => figures.panicked.add(seed, &m),
        }
        if last_note.elapsed().as_secs() >= 60 {
            last_note = Instant::now();
            eprintln!(
                "seed {seed}: {} done in {:.0} s, {} ok, {} rejected, {} invariant failures, {} panics",
                figures.done(),
                started.elapsed().as_secs_f64(),
                figures.ok,
                figures.rejected.total,
                figures.invariant.total,
                figures.panicked.total
            );
        }
        if last_report.elapsed().as_secs() >= 600 {
            last_report = Instant::now();
            figures.report(started.elapsed().as_secs_f64());
        }
    }
    if let Some(Err(e)) = failure_list.as_mut().map(std::io::Write::flush) {
        eprintln!("LONG_RUN_FAILURES: {e}");
        std::process::exit(2);
    }
    figures.report(started.elapsed().as_secs_f64());
    if figures.invariant.total + figures.panicked.total > 0 {
        std::process::exit(1);
    }
}
