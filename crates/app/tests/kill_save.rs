#![allow(clippy::unwrap_used)] // test helpers: a panic here is a failed test
//! Saves and autosaves survive being killed at any moment: the plan on disk
//! is always the whole old plan or the whole new one, never a mix.
//!
//! The test binary runs itself again as the saving process (the ignored
//! test `save_drill_child` with `PITCHFRAME_SAVE_DRILL` set), lets it save
//! a large plan over and over, kills it with SIGKILL at a random moment,
//! and reads what is left.

#[allow(dead_code)]
#[path = "../src/storage.rs"]
mod storage;

use std::io::{BufRead, BufReader};
use std::path::{Path, PathBuf};
use std::process::{Command, Stdio};
use std::sync::mpsc;
use std::time::{Duration, Instant};

use pitchframe_geometry::{Length, Plan, PlanWall, demo_plan};

/// The environment variable that turns the child test into the saver.
const DRILL_ENV: &str = "PITCHFRAME_SAVE_DRILL";
/// The number of kills in each drill.
const KILLS: usize = 100;
/// Corners in the drill plan: large enough that a save takes a while
/// (about 300 KB of TOML), within the plan limits.
const DRILL_CORNERS: usize = 6_000;

/// A large plan whose version number is written into its roof overhang, so
/// the version on disk can be read back.
fn drill_plan(version: u64) -> Plan {
    let mut plan = demo_plan().unwrap();
    // A many-pointed star: a valid simple outline with every corner distinct.
    plan.walls = (0..DRILL_CORNERS)
        .map(|i| {
            let a = i as f64 / DRILL_CORNERS as f64 * std::f64::consts::TAU;
            let r = if i % 2 == 0 { 6000.0 } else { 5900.0 };
            PlanWall {
                at: [Length::from_inches(r * a.cos()), Length::from_inches(r * a.sin())],
                pitch: None,
                gable: false,
                overhang: None,
            }
        })
        .collect();
    plan.courtyards.clear();
    plan.default_overhang = Length::from_inches(version as f64);
    plan
}

fn version_of(plan: &Plan) -> u64 {
    plan.default_overhang.inches() as u64
}

/// A small xorshift generator: the kill moments need no more.
struct Xorshift(u64);

impl Xorshift {
    fn below(&mut self, n: u64) -> u64 {
        self.0 ^= self.0 << 13;
        self.0 ^= self.0 >> 7;
        self.0 ^= self.0 << 17;
        self.0 % n
    }
}

fn scratch_dir(name: &str) -> PathBuf {
    let dir = Path::new(env!("CARGO_TARGET_TMPDIR")).join(format!("kill-save-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

/// What the saver reported before it died: the last save it began and
/// the last one it finished.
#[derive(Debug, Default, Clone, Copy)]
struct Progress {
    started: Option<u64>,
    done: Option<u64>,
}

/// Runs the saver on `plan_path` in `mode`, kills it at a random moment
/// after its first save has begun, and returns what it had reported.
fn run_and_kill(mode: &str, plan_path: &Path, first_version: u64, rng: &mut Xorshift) -> Progress {
    let mut child = Command::new(std::env::current_exe().unwrap())
        .args(["save_drill_child", "--exact", "--ignored", "--nocapture", "--test-threads=1"])
        .env(DRILL_ENV, format!("{mode}:{first_version}:{}", plan_path.display()))
        .stdout(Stdio::piped())
        .stderr(Stdio::null())
        .spawn()
        .unwrap();
    let stdout = child.stdout.take().unwrap();
    let (tx, rx) = mpsc::channel();
    let reader = std::thread::spawn(move || {
        for line in BufReader::new(stdout).lines().map_while(Result::ok) {
            if tx.send(line).is_err() {
                break;
            }
        }
    });
    let mut progress = Progress::default();
    let note = |line: &str, progress: &mut Progress| {
        // The test harness may print its own words before ours on a line.
        if let Some((_, v)) = line.rsplit_once("start ") {
            progress.started = v.trim().parse().ok();
        } else if let Some((_, v)) = line.rsplit_once("done ") {
            progress.done = v.trim().parse().ok();
        }
    };
    // Wait for the first save to begin, then kill somewhere within the next
    // few saves (a save of this plan takes some milliseconds).
    let deadline = Instant::now() + Duration::from_secs(60);
    while progress.started.is_none() {
        let line = rx.recv_timeout(deadline.saturating_duration_since(Instant::now())).unwrap();
        note(&line, &mut progress);
    }
    std::thread::sleep(Duration::from_micros(rng.below(60_000)));
    child.kill().unwrap();
    child.wait().unwrap();
    reader.join().unwrap();
    for line in rx.try_iter() {
        note(&line, &mut progress);
    }
    progress
}

/// The versions the file may hold after the kill: the last finished save,
/// or the one under way (its rename may have happened just before the kill).
fn allowed_versions(progress: Progress, before: u64) -> Vec<u64> {
    let mut allowed = vec![progress.done.unwrap_or(before)];
    allowed.extend(progress.started);
    allowed
}

#[test]
fn a_killed_save_leaves_the_old_plan_or_the_new_one() {
    let dir = scratch_dir("save");
    let path = dir.join("big house.toml");
    storage::save_plan_atomically(&path, &drill_plan(0)).unwrap();
    let mut rng = Xorshift(0x9e37_79b9_7f4a_7c15);
    let mut on_disk = 0;
    let mut mid_save_kills = 0;
    for round in 0..KILLS {
        let first = on_disk + 1;
        let progress = run_and_kill("save", &path, first, &mut rng);
        let plan = storage::load_plan_file(&path)
            .unwrap_or_else(|e| panic!("round {round}: the plan is damaged after a kill: {e}"));
        let version = version_of(&plan);
        let allowed = allowed_versions(progress, on_disk);
        assert!(
            allowed.contains(&version),
            "round {round}: version {version} on disk, expected one of {allowed:?}"
        );
        // Whole, not merely parseable: equal to the plan that was saved.
        assert_eq!(plan, drill_plan(version), "round {round}");
        if progress.started != progress.done {
            mid_save_kills += 1;
        }
        on_disk = version;
    }
    // Most kills land inside a save (the saver does little else); if none
    // did, the drill tested nothing.
    assert!(mid_save_kills > KILLS / 4, "only {mid_save_kills} of {KILLS} kills fell inside a save");
    eprintln!("{KILLS} kills, {mid_save_kills} during a save, last version {on_disk}");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn an_autosave_killed_mid_write_is_recovered_whole() {
    let dir = scratch_dir("autosave");
    let path = dir.join("house.toml");
    storage::save_plan_atomically(&path, &drill_plan(0)).unwrap();
    let mut rng = Xorshift(0x2545_f491_4f6c_dd1d);
    let mut on_disk = 0;
    for round in 0..KILLS / 2 {
        let progress = run_and_kill("autosave", &path, on_disk + 1, &mut rng);
        let recovered = storage::read_autosave(Some(&path))
            .unwrap_or_else(|e| panic!("round {round}: the autosave is damaged after a kill: {e}"));
        match recovered {
            Some(r) => {
                let version = version_of(&r.plan);
                let allowed = allowed_versions(progress, on_disk);
                assert!(
                    allowed.contains(&version),
                    "round {round}: autosave {version}, expected {allowed:?}"
                );
                assert_eq!(r.plan, drill_plan(version), "round {round}");
                assert!(r.newer_than_plan, "round {round}: the autosave postdates the plan");
                on_disk = version;
            }
            None => assert!(progress.done.is_none(), "round {round}: a finished autosave vanished"),
        }
    }
    // The plan itself was never touched by autosaving.
    assert_eq!(version_of(&storage::load_plan_file(&path).unwrap()), 0);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn save_then_load_gives_the_same_plan_and_replaces_the_old_one() {
    let dir = scratch_dir("plain");
    let path = dir.join("house.toml");
    let demo = demo_plan().unwrap();
    storage::save_plan_atomically(&path, &demo).unwrap();
    assert_eq!(storage::load_plan_file(&path).unwrap(), demo);
    let big = drill_plan(7);
    storage::save_plan_atomically(&path, &big).unwrap();
    assert_eq!(storage::load_plan_file(&path).unwrap(), big);
    // No temporary file is left behind by a save that finished.
    let names: Vec<_> = std::fs::read_dir(&dir).unwrap().map(|e| e.unwrap().file_name()).collect();
    assert_eq!(names, vec![std::ffi::OsString::from("house.toml")]);
    let _ = std::fs::remove_dir_all(&dir);
}

#[cfg(unix)]
#[test]
fn a_save_keeps_the_plan_permissions_and_writes_through_a_link() {
    use std::os::unix::fs::{PermissionsExt, symlink};
    let dir = scratch_dir("perms");
    let real = dir.join("real.toml");
    let demo = demo_plan().unwrap();
    storage::save_plan_atomically(&real, &demo).unwrap();
    std::fs::set_permissions(&real, std::fs::Permissions::from_mode(0o640)).unwrap();
    let link = dir.join("link.toml");
    symlink(&real, &link).unwrap();
    storage::save_plan_atomically(&link, &drill_plan(3)).unwrap();
    assert!(std::fs::symlink_metadata(&link).unwrap().file_type().is_symlink());
    assert_eq!(version_of(&storage::load_plan_file(&real).unwrap()), 3);
    assert_eq!(std::fs::metadata(&real).unwrap().permissions().mode() & 0o777, 0o640);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn a_failed_save_leaves_the_old_plan_and_no_temporary_file() {
    let dir = scratch_dir("fail");
    let path = dir.join("house.toml");
    let demo = demo_plan().unwrap();
    storage::save_plan_atomically(&path, &demo).unwrap();
    // A directory where the plan should go: the rename fails.
    let blocked = dir.join("blocked.toml");
    std::fs::create_dir(&blocked).unwrap();
    std::fs::write(blocked.join("keep"), b"x").unwrap();
    assert!(storage::save_plan_atomically(&blocked, &demo).is_err());
    let names: Vec<_> = std::fs::read_dir(&dir).unwrap().map(|e| e.unwrap().file_name()).collect();
    assert_eq!(names.len(), 2, "{names:?}");
    assert_eq!(storage::load_plan_file(&path).unwrap(), demo);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn loading_refuses_an_oversized_file_without_reading_it_all() {
    let dir = scratch_dir("big");
    let path = dir.join("huge.toml");
    let file = std::fs::File::create(&path).unwrap();
    // A sparse file: 8 GB on paper, no disk used.
    file.set_len(8 << 30).unwrap();
    let e = storage::load_plan_file(&path).unwrap_err();
    assert!(e.to_string().contains("larger than"), "{e}");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn a_plan_without_autosave_reports_none_and_a_stale_one_is_marked() {
    let dir = scratch_dir("stale");
    let path = dir.join("house.toml");
    assert!(storage::read_autosave(Some(&path)).unwrap().is_none());
    let demo = demo_plan().unwrap();
    storage::write_autosave(Some(&path), &demo).unwrap();
    // Saving the plan afterwards makes the autosave stale.
    std::thread::sleep(Duration::from_millis(20));
    storage::save_plan_atomically(&path, &demo).unwrap();
    let r = storage::read_autosave(Some(&path)).unwrap().unwrap();
    assert!(!r.newer_than_plan);
    storage::remove_autosave(Some(&path)).unwrap();
    assert!(storage::read_autosave(Some(&path)).unwrap().is_none());
    storage::remove_autosave(Some(&path)).unwrap();
    // A damaged autosave is an error naming it, not a panic or a silent loss.
    std::fs::write(storage::autosave_path(Some(&path)), b"format = [[[").unwrap();
    let e = storage::read_autosave(Some(&path)).unwrap_err();
    assert!(e.to_string().contains(".house.toml.autosave"), "{e}");
    let _ = std::fs::remove_dir_all(&dir);
}

/// The saving half of the drills: only does anything when run by them.
#[test]
#[ignore = "the saving process of the kill drills, run by them with PITCHFRAME_SAVE_DRILL set"]
fn save_drill_child() {
    let Ok(spec) = std::env::var(DRILL_ENV) else { return };
    let mut parts = spec.splitn(3, ':');
    let mode = parts.next().unwrap().to_string();
    let first: u64 = parts.next().unwrap().parse().unwrap();
    let path = PathBuf::from(parts.next().unwrap());
    let plans = [drill_plan(first), drill_plan(first + 1)];
    use std::io::Write;
    let mut out = std::io::stdout().lock();
    for version in first.. {
        // Two plans alternate in memory so the loop spends its time saving.
        let mut plan = plans[(version - first) as usize % 2].clone();
        plan.default_overhang = Length::from_inches(version as f64);
        writeln!(out, "start {version}").unwrap();
        out.flush().unwrap();
        match mode.as_str() {
            "save" => storage::save_plan_atomically(&path, &plan).unwrap(),
            _ => {
                storage::write_autosave(Some(&path), &plan).unwrap();
            }
        }
        writeln!(out, "done {version}").unwrap();
        out.flush().unwrap();
    }
}
