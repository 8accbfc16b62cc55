#![allow(clippy::unwrap_used)] // test helpers: a panic here is a failed test
//! Malformed and hostile plan files: `pitchframe solve FILE` refuses each
//! with exit code 2 and one short line naming what is wrong, and never
//! panics.
//!
//! The corpus is `tests/malformed/` at the top of the repository: each
//! `NAME.toml` has a `NAME.expect` holding text the message must contain.
//! The expected texts were written from what a person needs to hear about
//! each file (the place at fault, or the kind of fault), not copied from
//! the program's output. A file with a `NAME.open` beside it is a known
//! fault not yet fixed (the `.open` says what), and `NAME.open-cli` one in
//! how the command line shows the message: it must still fail, and the test
//! says when it no longer does. Files too big to keep in the repository are made
//! here in a scratch directory.

use std::path::{Path, PathBuf};
use std::process::Command;

/// Longest message accepted, in characters: one line a terminal shows
/// whole (common practice, no source), however long the bad value.
const MAX_MESSAGE_CHARS: usize = 400;

fn corpus_dir() -> PathBuf {
    Path::new(env!("CARGO_MANIFEST_DIR")).join("../../tests/malformed")
}

/// Runs `pitchframe solve PATH` and returns the failure message, after
/// checking the exit code, that stdout is empty and the message is one
/// short line with no control characters.
fn refusal(path: &Path) -> Result<String, String> {
    let out = Command::new(env!("CARGO_BIN_EXE_pitchframe"))
        .arg("solve")
        .arg(path)
        .output()
        .map_err(|e| format!("cannot run pitchframe: {e}"))?;
    let stderr = String::from_utf8_lossy(&out.stderr).to_string();
    if stderr.contains("panicked") {
        return Err(format!("panicked: {stderr}"));
    }
    if out.status.code() != Some(2) {
        return Err(format!("exit {:?} (expected 2), stderr: {stderr}", out.status.code()));
    }
    if !out.stdout.is_empty() {
        return Err(format!("printed to stdout: {}", String::from_utf8_lossy(&out.stdout)));
    }
    let message = stderr.strip_suffix('\n').unwrap_or(&stderr).to_string();
    if message.lines().count() != 1 {
        return Err(format!("{} lines instead of one: {message:?}", message.lines().count()));
    }
    if message.chars().count() > MAX_MESSAGE_CHARS {
        return Err(format!("{} characters, more than {MAX_MESSAGE_CHARS}", message.chars().count()));
    }
    if message.chars().any(|c| c.is_control()) {
        return Err(format!("control characters in {message:?}"));
    }
    Ok(message)
}

#[test]
fn every_malformed_plan_is_refused_with_its_message() {
    let mut files: Vec<PathBuf> = std::fs::read_dir(corpus_dir())
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|e| e == "toml"))
        .collect();
    files.sort();
    assert!(files.len() >= 50, "the corpus has {} plans", files.len());
    let mut failures = Vec::new();
    for file in &files {
        let expect_path = file.with_extension("expect");
        let expect = std::fs::read_to_string(&expect_path)
            .unwrap_or_else(|e| panic!("{}: {e}", expect_path.display()))
            .trim_end()
            .to_string();
        assert!(!expect.is_empty(), "{} is empty", expect_path.display());
        let name = file.file_name().unwrap().to_string_lossy().to_string();
        let problem = match refusal(file) {
            Ok(message) if message.contains(&expect) => None,
            Ok(message) => Some(format!("expected {expect:?} in {message:?}")),
            Err(problem) => Some(problem),
        };
        let open = std::fs::read_to_string(file.with_extension("open"))
            .or_else(|_| std::fs::read_to_string(file.with_extension("open-cli")))
            .ok();
        match (problem, open) {
            (Some(problem), None) => failures.push(format!("{name}: {problem}")),
            (None, Some(_)) => failures.push(format!("{name}: now passes; remove its .open marker")),
            (Some(problem), Some(reason)) => eprintln!("known fault {name}: {problem} ({})", reason.trim()),
            (None, None) => {}
        }
    }
    assert!(failures.is_empty(), "{} of {} plans:\n{}", failures.len(), files.len(), failures.join("\n"));
}

/// A scratch directory for the files made here.
fn scratch(name: &str) -> PathBuf {
    let dir = Path::new(env!("CARGO_TARGET_TMPDIR")).join(format!("malformed-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

#[test]
fn a_fifty_megabyte_plan_is_refused_by_its_size() {
    let dir = scratch("huge");
    let path = dir.join("huge.toml");
    // A plan that is valid TOML all the way down, so only the size can stop it.
    let mut text = String::from("format = 1\nunits = \"in\"\n[roof]\npitch = \"6/12\"\n");
    let wall = "[[wall]]\nat = [0, 0]\n";
    while text.len() < 50 * 1024 * 1024 {
        text.push_str(wall);
    }
    std::fs::write(&path, &text).unwrap();
    let message = refusal(&path).unwrap();
    // The loader's limit is 4 MiB (README, "Plan files").
    assert!(message.contains("limited to 4194304 bytes"), "{message}");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn a_plan_with_too_many_corners_is_refused() {
    let dir = scratch("corners");
    let path = dir.join("corners.toml");
    let mut text = String::from("format = 1\nunits = \"in\"\n[roof]\npitch = \"6/12\"\n");
    // 20,001 corners round a circle: one more than the README's limit.
    for i in 0..20_001 {
        let a = f64::from(i) / 20_001.0 * std::f64::consts::TAU;
        text.push_str(&format!("[[wall]]\nat = [{}, {}]\n", 5000.0 * a.cos(), 5000.0 * a.sin()));
    }
    std::fs::write(&path, &text).unwrap();
    let message = refusal(&path).unwrap();
    assert!(message.contains("20001 corners"), "{message}");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn a_plan_with_too_many_courtyards_is_refused() {
    let dir = scratch("courtyards");
    let path = dir.join("courtyards.toml");
    let mut text = String::from("format = 1\nunits = \"in\"\n[roof]\npitch = \"6/12\"\n");
    for (x, y) in [(0, 0), (100_000, 0), (100_000, 100_000), (0, 100_000)] {
        text.push_str(&format!("[[wall]]\nat = [{x}, {y}]\n"));
    }
    // 201 small square courtyards: one more than the limit of 200.
    for i in 0..201 {
        let (x, y) = (1000 + (i % 20) * 2000, 1000 + (i / 20) * 2000);
        text.push_str("[[courtyard]]\n");
        for (dx, dy) in [(0, 0), (500, 0), (500, 500), (0, 500)] {
            text.push_str(&format!("[[courtyard.wall]]\nat = [{}, {}]\n", x + dx, y + dy));
        }
    }
    std::fs::write(&path, &text).unwrap();
    let message = refusal(&path).unwrap();
    assert!(message.contains("201 courtyards"), "{message}");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn a_missing_file_and_a_directory_are_refused_by_name() {
    let dir = scratch("missing");
    let missing = dir.join("no such plan.toml");
    let message = refusal(&missing).unwrap();
    assert!(message.contains("no such plan.toml"), "{message}");
    let message = refusal(&dir).unwrap();
    assert!(message.contains("cannot read"), "{message}");
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn a_file_name_holding_a_newline_and_an_escape_stays_on_one_line() {
    let dir = scratch("name");
    // A name a downloaded or renamed file can carry; `refusal` checks the
    // message is one line with no control characters.
    let path = dir.join("plan\n\u{1b}[31mred.toml");
    std::fs::write(&path, "format = 1\nunits = \"yards\"\n").unwrap();
    let message = refusal(&path).unwrap();
    assert!(message.contains("plan\\n\\u{1b}[31mred.toml"), "{message}");
    assert!(message.contains("units = \"yards\" is not known"), "{message}");
    let _ = std::fs::remove_dir_all(&dir);
}
