#![allow(clippy::unwrap_used)] // test helpers: a panic here is a failed test
//! The command line: output shapes, exit codes and messages.

use std::process::{Command, Output};

use serde_json::Value;

fn pitchframe(args: &[&str]) -> Output {
    Command::new(env!("CARGO_BIN_EXE_pitchframe")).args(args).output().unwrap()
}

fn stdout_json(out: &Output) -> Value {
    assert!(out.status.success(), "stderr: {}", String::from_utf8_lossy(&out.stderr));
    serde_json::from_slice(&out.stdout).unwrap()
}

fn one_line_error(out: &Output) -> String {
    assert_eq!(out.status.code(), Some(2), "stdout: {}", String::from_utf8_lossy(&out.stdout));
    let text = String::from_utf8_lossy(&out.stderr).trim_end().to_string();
    assert_eq!(text.lines().count(), 1, "one line expected: {text}");
    text
}

#[test]
fn table_json_has_the_rafter_table_lines_at_full_precision() {
    let table = stdout_json(&pitchframe(&["table", "4/12", "--json"]));
    // Common practice (the 4 in 12 column of a framing square's rafter
    // table): 12.65, 17.44, 16-7/8, 25-5/16, 11-3/8, 11-11/16.
    let expect = [
        ("common_per_foot", 12.65, 0.005),
        ("hip_per_foot", 17.44, 0.005),
        ("jack_diff_16", 16.875, 1.0 / 32.0),
        ("jack_diff_24", 25.3125, 1.0 / 32.0),
        ("jack_side_cut", 11.375, 1.0 / 32.0),
        ("hip_side_cut", 11.6875, 1.0 / 32.0),
    ];
    for (key, value, tol) in expect {
        let got = table[key].as_f64().unwrap_or_else(|| panic!("{key} missing"));
        assert!((got - value).abs() <= tol, "{key}: {got} vs {value}");
    }
    // Full precision, not rounded: sqrt(144 + 16) exactly.
    let common = table["common_per_foot"].as_f64().unwrap();
    assert!((common - 160f64.sqrt()).abs() < 1e-12);
    // 4 in 12 is atan(4/12) = 18.43 deg (trigonometry).
    let deg = table["pitch_deg"].as_f64().unwrap();
    assert!((deg - (4.0f64 / 12.0).atan().to_degrees()).abs() < 1e-9);
}

#[test]
fn table_text_is_readable() {
    let out = pitchframe(&["table", "7/12"]);
    assert!(out.status.success());
    let text = String::from_utf8_lossy(&out.stdout);
    // US Navy NAVEDTRA 14044, rafter chapter: 7/12 common 13.89 per foot.
    assert!(text.contains("13.89"), "{text}");
}

#[test]
fn table_refuses_a_bad_pitch_in_one_line() {
    for bad in ["0/12", "-3/12", "abc", "90deg", "nan/12"] {
        let message = one_line_error(&pitchframe(&["table", bad]));
        assert!(message.starts_with("pitchframe: "), "{message}");
    }
}

#[test]
fn solve_json_has_units_planes_and_lines() {
    let roof = stdout_json(&pitchframe(&["solve", "demo", "--json"]));
    assert_eq!(roof["units"], "in");
    let planes = roof["planes"].as_array().unwrap();
    // The demo has six walls, one of them a gable: five planes.
    assert_eq!(planes.len(), 5);
    for plane in planes {
        assert!(plane["wall"].as_u64().is_some());
        let outline = plane["outline"].as_array().unwrap();
        assert!(outline.len() >= 3);
        assert_eq!(outline[0].as_array().unwrap().len(), 3);
    }
    let kinds: Vec<&str> =
        roof["lines"].as_array().unwrap().iter().map(|l| l["kind"].as_str().unwrap()).collect();
    for kind in ["ridge", "hip", "valley"] {
        assert!(kinds.contains(&kind), "{kind} in {kinds:?}");
    }
}

#[test]
fn solve_refuses_a_missing_file_in_one_line() {
    let message = one_line_error(&pitchframe(&["solve", "/nonexistent/plan.toml"]));
    assert!(message.contains("/nonexistent/plan.toml"), "{message}");
}

#[test]
fn solve_refuses_a_file_that_is_not_a_plan() {
    let dir = std::env::temp_dir().join(format!("pitchframe-cli-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    let path = dir.join("bad.toml");
    std::fs::write(&path, "[roof]\npitch = \"6/12\"\n[[wall]]\nat = [0, 0]\n[[wall]]\nat = [10, 0]\n")
        .unwrap();
    let message = one_line_error(&pitchframe(&["solve", path.to_str().unwrap()]));
    assert!(message.contains("corners"), "{message}");
    std::fs::remove_dir_all(&dir).ok();
}

fn temp_dir(name: &str) -> std::path::PathBuf {
    let dir = std::env::temp_dir().join(format!("pitchframe-cli-{name}-{}", std::process::id()));
    std::fs::create_dir_all(&dir).unwrap();
    dir
}

#[test]
fn list_prints_every_member_label_and_the_caution() {
    let out = pitchframe(&["list", "demo"]);
    assert!(out.status.success(), "{}", String::from_utf8_lossy(&out.stderr));
    let text = String::from_utf8_lossy(&out.stdout);
    let roof = stdout_json(&pitchframe(&["solve", "demo", "--json"]));
    for member in roof["members"].as_array().unwrap() {
        let label = member["label"].as_str().unwrap();
        assert!(text.lines().any(|l| l.starts_with(&format!("{label} "))), "{label} missing:\n{text}");
    }
    assert!(text.contains("local codes"), "{text}");
}

#[test]
fn list_writes_a_csv_with_a_row_per_member() {
    let dir = temp_dir("csv");
    let csv = dir.join("cuts.csv");
    let out = pitchframe(&["list", "demo", "--csv", csv.to_str().unwrap()]);
    assert!(out.status.success());
    let text = std::fs::read_to_string(&csv).unwrap();
    let roof = stdout_json(&pitchframe(&["solve", "demo", "--json"]));
    let members = roof["members"].as_array().unwrap().len();
    assert_eq!(text.lines().count(), members + 1, "{text}");
    assert!(text.lines().next().unwrap().starts_with("label"));
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn order_places_every_piece_and_reports_the_bound() {
    let out = pitchframe(&["order", "demo"]);
    assert!(out.status.success(), "{}", String::from_utf8_lossy(&out.stderr));
    let text = String::from_utf8_lossy(&out.stdout);
    assert!(text.contains("no order can buy less than"), "{text}");
    assert!(text.contains("Total:"), "{text}");
    // Every piece of the frame is on exactly one board (or a splice line).
    let roof = stdout_json(&pitchframe(&["solve", "demo", "--json"]));
    let pieces: u64 = roof["members"].as_array().unwrap().iter().map(|m| m["count"].as_u64().unwrap()).sum();
    let on_boards: usize = text
        .lines()
        .filter(|l| l.trim_start().starts_with("board "))
        .map(|l| l.split(':').nth(1).unwrap().split(';').next().unwrap().split(", ").count())
        .sum();
    let spliced: u64 = text
        .lines()
        .filter(|l| l.contains("needs a splice"))
        .map(|l| l.split(" x ").next().unwrap().trim().parse::<u64>().unwrap())
        .sum();
    assert_eq!(on_boards as u64 + spliced, pieces, "{text}");
}

#[test]
fn cards_write_a_pdf_and_export_writes_a_glb() {
    let dir = temp_dir("files");
    let pdf = dir.join("cards.pdf");
    let out = pitchframe(&["cards", "demo", "-o", pdf.to_str().unwrap(), "--paper", "a4", "--per-page", "2"]);
    assert!(out.status.success(), "{}", String::from_utf8_lossy(&out.stderr));
    assert!(std::fs::read(&pdf).unwrap().starts_with(b"%PDF-"));
    let glb = dir.join("frame.glb");
    let out = pitchframe(&["export", "demo", "-o", glb.to_str().unwrap()]);
    assert!(out.status.success(), "{}", String::from_utf8_lossy(&out.stderr));
    // glTF 2.0 binary files open with the magic "glTF" and version 2
    // (Khronos glTF 2.0 specification, section "Binary glTF Layout").
    let bytes = std::fs::read(&glb).unwrap();
    assert_eq!(&bytes[..4], b"glTF");
    assert_eq!(u32::from_le_bytes([bytes[4], bytes[5], bytes[6], bytes[7]]), 2);
    std::fs::remove_dir_all(&dir).ok();
}

#[test]
fn cards_refuse_an_unknown_template_label() {
    let dir = temp_dir("templates");
    let pdf = dir.join("cards.pdf");
    let message =
        one_line_error(&pitchframe(&["cards", "demo", "-o", pdf.to_str().unwrap(), "--templates", "ZZ9"]));
    assert!(message.contains("ZZ9"), "{message}");
    std::fs::remove_dir_all(&dir).ok();
}
