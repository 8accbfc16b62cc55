#![allow(clippy::unwrap_used)] // test helpers: a panic here is a failed test
//! The example plans in `examples/` and the built-in demo: each reads,
//! validates and solves, and survives a save and reload unchanged.

use std::path::PathBuf;

use pitchframe_geometry::{Plan, Roof, RoofLineKind, demo_plan};

fn example(name: &str) -> Plan {
    let path = PathBuf::from(env!("CARGO_MANIFEST_DIR")).join("examples").join(name);
    let text = std::fs::read_to_string(&path).unwrap();
    Plan::from_toml(&text).unwrap_or_else(|e| panic!("{}: {e}", path.display()))
}

fn all_plans() -> Vec<(&'static str, Plan)> {
    vec![
        ("demo", demo_plan().unwrap()),
        ("hillside-cottage", example("hillside-cottage.toml")),
        ("metric-bungalow", example("metric-bungalow.toml")),
    ]
}

#[test]
fn every_example_round_trips() {
    for (name, plan) in all_plans() {
        let again = Plan::from_toml(&plan.to_toml()).unwrap();
        assert_eq!(again, plan, "{name}");
    }
}

#[test]
fn every_example_solves() {
    for (name, plan) in all_plans() {
        let outline = plan.outline().unwrap_or_else(|e| panic!("{name}: {e}"));
        let roof = Roof::solve(&outline).unwrap_or_else(|e| panic!("{name}: {e}"));
        let pitched = plan.walls.iter().filter(|w| !w.gable).count();
        assert_eq!(roof.planes.len(), pitched, "{name}: one plane per pitched wall");
        assert!(roof.lines.iter().any(|l| l.kind == RoofLineKind::Hip), "{name} has hips");
    }
}

#[test]
fn the_metric_bungalow_ridge_follows_from_its_pitches() {
    // Rectangle 12 m x 8 m, long sides 30 deg, ends 35 deg. The ridge is at
    // the height of the long sides' planes at the middle: 4 m x tan 30 deg
    // (plane geometry, trade.md section 5 method; no published source).
    let plan = example("metric-bungalow.toml");
    let roof = Roof::solve(&plan.outline().unwrap()).unwrap();
    let ridges: Vec<_> = roof.lines.iter().filter(|l| l.kind == RoofLineKind::Ridge).collect();
    assert_eq!(ridges.len(), 1);
    let height_mm = ridges[0].from.z * 25.4;
    let expected_mm = 4000.0 * 30f64.to_radians().tan();
    assert!((height_mm - expected_mm).abs() < 0.01, "{height_mm} vs {expected_mm}");
    // Each end's hips reach the ridge where the end plane (35 deg) is as
    // high as the sides: 2309.4 mm / tan 35 deg = 3298.1 mm in from the end.
    let length_mm = (ridges[0].to - ridges[0].from).length() * 25.4;
    let expected_len = 12000.0 - 2.0 * expected_mm / 35f64.to_radians().tan();
    assert!((length_mm - expected_len).abs() < 0.01, "{length_mm} vs {expected_len}");
}

#[test]
fn every_example_frames_with_finite_numbers_and_tight_joints() {
    use pitchframe_geometry::frame_roof;
    for (name, plan) in all_plans() {
        let outline = plan.outline().unwrap();
        let roof = Roof::solve(&outline).unwrap();
        let frame = frame_roof(&outline, &roof, &plan.framing_settings().unwrap())
            .unwrap_or_else(|e| panic!("{name}: {e}"));
        assert!(!frame.members.is_empty(), "{name}");
        for m in &frame.members {
            for (what, v) in [
                ("theoretical", m.theoretical_length),
                ("long point", m.long_point_length),
                ("short point", m.short_point_length),
                ("overall", m.overall_length),
                ("seat to top cut", m.seat_to_top_cut),
                ("tail", m.tail_length),
            ] {
                assert!(v.is_finite() && v >= 0.0, "{name} {}: {what} length {v}", m.label);
            }
        }
        for p in &frame.pieces {
            assert!(p.axis.iter().all(|a| a.is_finite()), "{name} {}: axis {:?}", p.label, p.axis);
        }
        // A correct frame's mating faces meet within 1/64 in (the joint
        // check's own standard; common practice for a tight cut).
        for j in &frame.joints {
            assert!(j.max_gap < 1.0 / 64.0 && j.max_overlap < 1.0 / 64.0, "{name} {:?}", j);
        }
    }
}
