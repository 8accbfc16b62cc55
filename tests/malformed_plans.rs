#![allow(clippy::unwrap_used)] // test helpers: a panic here is a failed test
//! The malformed plan corpus (`tests/malformed/`) through the geometry
//! crate alone: loading, outlining and solving each file gives an error,
//! never a panic, and the error holds the text in the file's `.expect`.
//! A file with a `NAME.open` beside it is a known fault not yet fixed: its
//! `.open` says what is wrong, and the case must still fail (when it
//! passes, the marker is stale and the test says so).
//! The command line's own handling of the same files is checked in
//! `crates/app/tests/malformed_plans.rs`.

use std::panic::{AssertUnwindSafe, catch_unwind};
use std::path::{Path, PathBuf};

use pitchframe_geometry::{Plan, Roof};

/// The first error in reading, outlining and solving a plan file's bytes.
fn first_error(bytes: Vec<u8>) -> Option<String> {
    let Ok(text) = String::from_utf8(bytes) else {
        // The library takes text; the command line says this for non-UTF-8 files.
        return Some("the file is not UTF-8 text, so it is not a plan".to_string());
    };
    let plan = match Plan::from_toml(&text) {
        Ok(plan) => plan,
        Err(e) => return Some(e.to_string()),
    };
    let outline = match plan.outline() {
        Ok(outline) => outline,
        Err(e) => return Some(e.to_string()),
    };
    Roof::solve(&outline).err().map(|e| e.to_string())
}

#[test]
fn every_malformed_plan_is_an_error_not_a_panic() {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("tests/malformed");
    let mut files: Vec<PathBuf> = std::fs::read_dir(&dir)
        .unwrap()
        .map(|e| e.unwrap().path())
        .filter(|p| p.extension().is_some_and(|e| e == "toml"))
        .collect();
    files.sort();
    assert!(files.len() >= 50, "the corpus has {} plans", files.len());
    let mut failures = Vec::new();
    for file in &files {
        let name = file.file_name().unwrap().to_string_lossy().to_string();
        let expect = std::fs::read_to_string(file.with_extension("expect")).unwrap().trim_end().to_string();
        let bytes = std::fs::read(file).unwrap();
        let problem = match catch_unwind(AssertUnwindSafe(|| first_error(bytes))) {
            Err(_) => Some("panicked".to_string()),
            Ok(None) => Some("accepted".to_string()),
            Ok(Some(message)) if !message.contains(&expect) => {
                Some(format!("expected {expect:?} in {message:?}"))
            }
            Ok(Some(_)) => None,
        };
        let open = std::fs::read_to_string(file.with_extension("open")).ok();
        match (problem, open) {
            (Some(problem), None) => failures.push(format!("{name}: {problem}")),
            (None, Some(_)) => failures.push(format!("{name}: now passes; remove its .open marker")),
            (Some(problem), Some(reason)) => eprintln!("known fault {name}: {problem} ({})", reason.trim()),
            (None, None) => {}
        }
    }
    assert!(failures.is_empty(), "{} of {} plans:\n{}", failures.len(), files.len(), failures.join("\n"));
}
