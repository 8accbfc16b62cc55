//! The plan file format: what it reads, what it refuses, and round trips.

use pitchframe_geometry::{LengthUnit, Pitch, Plan, PlanError, demo_plan};

const SQUARE: &str = r#"
format = 1
units = "in"
[roof]
pitch = "6/12"
overhang = 16
[[wall]]
at = [0, 0]
[[wall]]
at = ["40'", 0]
pitch = "8/12"
[[wall]]
at = ["40'", "24'"]
gable = true
[[wall]]
at = [0, "24'"]
"#;

fn error(text: &str) -> String {
    match Plan::from_toml(text) {
        Ok(_) => panic!("expected the plan to be refused:\n{text}"),
        Err(e) => e.to_string(),
    }
}

#[test]
fn reads_the_documented_example() {
    let plan = Plan::from_toml(SQUARE).unwrap();
    assert_eq!(plan.units, LengthUnit::Inch);
    assert_eq!(plan.walls.len(), 4);
    // 40' = 480 in (definition of the foot).
    assert_eq!(plan.walls[1].at[0].inches(), 480.0);
    assert_eq!(plan.walls[2].at[1].inches(), 288.0);
    assert!(plan.walls[2].gable);
    assert_eq!(plan.wall_pitch(1), Some(Pitch::parse("8/12").unwrap()));
    assert_eq!(plan.wall_pitch(0), Some(Pitch::parse("6/12").unwrap()));
    assert_eq!(plan.default_overhang.inches(), 16.0);
}

#[test]
fn plain_numbers_take_the_plan_unit() {
    let text = SQUARE.replace("units = \"in\"", "units = \"mm\"");
    let plan = Plan::from_toml(&text).unwrap();
    // 16 mm overhang, 25.4 mm to the inch (international inch, 1959).
    assert!((plan.default_overhang.inches() - 16.0 / 25.4).abs() < 1e-12);
    // Text with its own unit keeps it: 40' is still 480 in.
    assert_eq!(plan.walls[1].at[0].inches(), 480.0);
}

#[test]
fn round_trips_through_toml() {
    for plan in [Plan::from_toml(SQUARE).unwrap(), demo_plan().unwrap()] {
        let again = Plan::from_toml(&plan.to_toml()).unwrap();
        assert_eq!(again, plan);
    }
}

#[test]
fn refuses_unknown_keys_with_their_name() {
    let message = error(&SQUARE.replace("overhang = 16", "overhange = 16"));
    assert!(message.contains("overhange"), "{message}");
}

#[test]
fn refuses_wrong_types() {
    let message = error(&SQUARE.replace("gable = true", "gable = \"yes\""));
    assert!(message.contains("gable") || message.contains("bool"), "{message}");
}

#[test]
fn refuses_text_that_is_not_toml() {
    assert!(matches!(Plan::from_toml("this is not [ toml"), Err(PlanError::Syntax { .. })));
}

#[test]
fn names_the_wall_with_a_bad_pitch() {
    let message = error(&SQUARE.replace("\"8/12\"", "\"0/12\""));
    assert!(message.starts_with("wall 2 pitch"), "{message}");
}

#[test]
fn names_the_wall_with_a_bad_length() {
    let message = error(&SQUARE.replace("[\"40'\", 0]", "[\"40'x\", 0]"));
    assert!(message.starts_with("wall 2, corner x"), "{message}");
}

#[test]
fn refuses_non_finite_and_huge_numbers() {
    let message = error(&SQUARE.replace("at = [0, 0]", "at = [nan, 0]"));
    assert!(message.contains("wall 1, corner x"), "{message}");
    let message = error(&SQUARE.replace("at = [0, 0]", "at = [1e300, 0]"));
    assert!(message.contains("beyond the largest"), "{message}");
}

#[test]
fn refuses_unknown_format_and_units() {
    assert!(matches!(
        Plan::from_toml(&SQUARE.replace("format = 1", "format = 7")),
        Err(PlanError::UnknownFormat { found: 7 })
    ));
    assert!(matches!(
        Plan::from_toml(&SQUARE.replace("units = \"in\"", "units = \"cubits\"")),
        Err(PlanError::UnknownUnits { .. })
    ));
}

#[test]
fn refuses_a_plan_without_a_pitch() {
    let message = error(&SQUARE.replace("pitch = \"6/12\"\n", ""));
    assert!(message.contains("no pitch"), "{message}");
}

#[test]
fn caps_the_file_size() {
    let text = format!("{SQUARE}\n#{}", "x".repeat(pitchframe_geometry::plan::MAX_PLAN_BYTES));
    assert!(matches!(Plan::from_toml(&text), Err(PlanError::TooLarge { .. })));
}

#[test]
fn caps_the_corner_count() {
    let mut text = String::from("[roof]\npitch = \"6/12\"\n");
    for i in 0..=pitchframe_geometry::plan::MAX_PLAN_CORNERS {
        text.push_str(&format!("[[wall]]\nat = [{i}, 0]\n"));
    }
    assert!(matches!(Plan::from_toml(&text), Err(PlanError::TooMany { what: "corners", .. })));
}

#[test]
fn reads_framing_settings() {
    let text = format!(
        "{SQUARE}\n[framing]\nspacing = 16\nrafter = [1.5, 7.25]\nheel = \"auto\"\ntail = \"square\"\nstock = [\"8'\", \"16'\"]\n"
    );
    let plan = Plan::from_toml(&text).unwrap();
    assert_eq!(plan.framing.spacing.map(|s| s.inches()), Some(16.0));
    assert_eq!(plan.framing.rafter.as_deref(), Some("1.5x7.25"));
    assert_eq!(plan.framing.heel, None);
    assert_eq!(plan.framing.stock.as_ref().map(Vec::len), Some(2));
    let message = error(&format!("{SQUARE}\n[framing]\ntail = \"curly\"\n"));
    assert!(message.contains("[framing] tail"), "{message}");
    let message = error(&format!("{SQUARE}\n[framing]\nnotch_limit = 2\n"));
    assert!(message.contains("notch_limit"), "{message}");
}

#[test]
fn reads_courtyards() {
    let text = format!(
        "{SQUARE}\n[[courtyard]]\n[[courtyard.wall]]\nat = [100, 100]\n[[courtyard.wall]]\nat = [200, 100]\n[[courtyard.wall]]\nat = [200, 200]\n"
    );
    let plan = Plan::from_toml(&text).unwrap();
    assert_eq!(plan.courtyards.len(), 1);
    assert_eq!(plan.courtyards[0].len(), 3);
}

mod round_trip {
    use pitchframe_geometry::{Length, Pitch, Plan, PlanWall, demo_plan};
    use proptest::prelude::*;

    proptest! {
        /// Saving and reopening never changes a plan, whatever its numbers.
        #[test]
        fn any_pitch_and_corner_survive_a_save(
            degrees in 0.01f64..89.99,
            rise_in_12 in 0.01f64..100.0,
            x in -10_000.0f64..10_000.0,
            y in -10_000.0f64..10_000.0,
            metric in any::<bool>(),
        ) {
            let mut plan = demo_plan().unwrap();
            if metric {
                plan.units = pitchframe_geometry::LengthUnit::Millimetre;
            }
            plan.default_pitch = Pitch::from_degrees(degrees).unwrap();
            plan.walls.push(PlanWall {
                at: [Length::from_inches(x), Length::from_mm(y)],
                pitch: Some(Pitch::from_rise_per_run(rise_in_12 / 12.0).unwrap()),
                gable: false,
                overhang: Some(Length::from_mm(y.abs())),
            });
            let again = Plan::from_toml(&plan.to_toml()).unwrap();
            prop_assert_eq!(again, plan);
        }
    }
}

mod framing_settings {
    use pitchframe_geometry::framing::{Heel, HipTop, TailCut};
    use pitchframe_geometry::{Plan, demo_plan};

    const METRIC: &str = include_str!("../../../examples/metric-bungalow.toml");
    const COTTAGE: &str = include_str!("../../../examples/hillside-cottage.toml");

    #[test]
    fn the_demo_table_becomes_settings() {
        let settings = demo_plan().unwrap().framing_settings().unwrap();
        assert_eq!(settings.spacing_in, 24.0);
        // US dressed lumber: a 2x8 is 1-1/2 x 7-1/4, a 2x10 1-1/2 x 9-1/4
        // (American Softwood Lumber Standard PS 20 dry sizes, from memory).
        assert_eq!((settings.rafter.thickness_in, settings.rafter.depth_in), (1.5, 7.25));
        assert_eq!((settings.hip.thickness_in, settings.hip.depth_in), (1.5, 9.25));
        assert_eq!(settings.seat_width_in, 3.5);
        assert_eq!(settings.heel, Heel::Auto);
        assert_eq!(settings.tail, TailCut::Plumb);
        assert_eq!(settings.hip_top, HipTop::Backed);
    }

    #[test]
    fn metric_sizes_and_stock_are_read_in_millimetres() {
        let settings = Plan::from_toml(METRIC).unwrap().framing_settings().unwrap();
        // 45 x 195 mm is the plan's own size; 25.4 mm to the inch.
        assert!((settings.rafter.thickness_in * 25.4 - 45.0).abs() < 1e-9);
        assert!((settings.rafter.depth_in * 25.4 - 195.0).abs() < 1e-9);
        assert!((settings.spacing_in * 25.4 - 600.0).abs() < 1e-9);
        assert_eq!(settings.stock_lengths_in.len(), 7);
        assert!((settings.longest_stock_in().unwrap() * 25.4 - 6000.0).abs() < 1e-9);
    }

    #[test]
    fn tail_and_hip_choices_are_read() {
        let settings = Plan::from_toml(COTTAGE).unwrap().framing_settings().unwrap();
        assert_eq!(settings.spacing_in, 16.0);
        assert!(matches!(settings.tail, TailCut::PlumbAndLevel { .. }));
        assert_eq!(settings.hip_top, HipTop::Dropped);
    }

    #[test]
    fn a_layout_corner_that_does_not_exist_is_named() {
        let text = COTTAGE.replace("layout_from = 0", "layout_from = 8");
        let message = Plan::from_toml(&text).unwrap().framing_settings().unwrap_err().to_string();
        assert!(message.contains("[framing] layout_from") && message.contains("corner 8"), "{message}");
    }

    #[test]
    fn a_bad_size_is_named() {
        let text = COTTAGE.replace("rafter = \"2x8\"", "rafter = \"2x\"");
        let message = Plan::from_toml(&text).unwrap().framing_settings().unwrap_err().to_string();
        assert!(message.starts_with("[framing] rafter"), "{message}");
    }
}
