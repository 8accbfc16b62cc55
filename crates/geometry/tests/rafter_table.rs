//! The rafter table against published check values.

use approx::assert_abs_diff_eq;
use glam::DVec3;
use pitchframe_geometry::{CompoundCut, Length, MarkAlong, Pitch, RafterTable};

fn table(text: &str) -> RafterTable {
    match Pitch::parse(text) {
        Ok(pitch) => RafterTable::for_pitch(pitch),
        Err(error) => panic!("{text}: {error}"),
    }
}

/// A sixteenth: the tolerance for values a source prints to the nearest 1/16.
const SIXTEENTH: f64 = 1.0 / 16.0;

/// True when `value` rounds to `printed` at the nearest 1/16.
fn rounds_to_sixteenth(value: f64, printed: f64) -> bool {
    (value * 16.0).round() == printed * 16.0
}

#[test]
fn four_in_twelve_matches_the_six_table_lines() {
    // Common practice (the six lines of a steel square's rafter table at
    // 4 in 12, also listed in trade.md section 2): 12.65, 17.44, 16 7/8,
    // 25 5/16, 11 3/8 and 11 11/16.
    let t = table("4/12");
    assert_abs_diff_eq!(t.common_per_foot, 12.65, epsilon = 0.005);
    assert_abs_diff_eq!(t.hip_per_foot, 17.44, epsilon = 0.005);
    assert!(rounds_to_sixteenth(t.jack_diff_16, 16.875), "{}", t.jack_diff_16);
    assert!(rounds_to_sixteenth(t.jack_diff_24, 25.3125), "{}", t.jack_diff_24);
    assert!(rounds_to_sixteenth(t.jack_side_cut.figure, 11.375), "{}", t.jack_side_cut.figure);
    assert!(rounds_to_sixteenth(t.hip_side_cut.figure, 11.6875), "{}", t.hip_side_cut.figure);
    assert_eq!(t.jack_side_cut.against, 12.0);
    assert_eq!(t.hip_side_cut.against, 12.0);
}

#[test]
fn navedtra_builder_values() {
    // US Navy NAVEDTRA 14044, Builder 3 & 2 Vol. 2 (1994), rafter chapter:
    // 7/12 at 16 ft span: 13.89 x 8 = 111-1/8 in of common rafter.
    let seven = table("7/12");
    assert_abs_diff_eq!(seven.common_per_foot, 13.89, epsilon = 0.005);
    let common = seven.common_per_foot * 8.0;
    assert!(rounds_to_sixteenth(common, 111.125), "{common}");
    // 8/12 with 15 ft run: hip run 21.21 ft, hip length 23.45 ft.
    let eight = table("8/12");
    let hip_run_ft = 15.0 * 2f64.sqrt();
    assert_abs_diff_eq!(hip_run_ft, 21.21, epsilon = 0.005);
    assert_abs_diff_eq!(eight.hip_per_foot * 15.0 / 12.0, 23.45, epsilon = 0.005);
    // Jacks at 8/12, 16 in centres: 19-1/4 (19.23).
    assert_abs_diff_eq!(eight.jack_diff_16, 19.23, epsilon = 0.005);
    assert!((eight.jack_diff_16 - 19.25).abs() < SIXTEENTH / 2.0);
    assert_abs_diff_eq!(
        eight.jack_diff(Length::from_inches(16.0)).inches(),
        eight.jack_diff_16,
        epsilon = 1e-12
    );
}

#[test]
fn army_en0069_values() {
    // US Army EN0069, Frame Structures: 13/12 line 17.69, 16/12 line 20.00;
    // 20 ft 8 in span at 13/12: 17.69 x 10-1/3 = 182.8 in.
    let thirteen = table("13/12");
    assert_abs_diff_eq!(thirteen.common_per_foot, 17.69, epsilon = 0.005);
    assert_abs_diff_eq!(table("16/12").common_per_foot, 20.00, epsilon = 0.005);
    let run_ft = (20.0 + 8.0 / 12.0) / 2.0;
    assert_abs_diff_eq!(thirteen.common_per_foot * run_ft, 182.8, epsilon = 0.05);
}

#[test]
fn trada_35_degree_reckoner() {
    // TRADA Timber 2020 Yearbook p. 169, 35-degree reckoner: rafter 1.2206
    // and hip 1.5779 per metre of run; 4 m run: 4.8826 m and 6.3118 m; jack
    // differences 488 / 549 / 732 mm at 400 / 450 / 600 mm; edge cuts hip
    // 300:269, jack 300:245. The printed figures agree with a rise of 0.700
    // per metre (34.99 deg) cut off at 4 places; exact 35 deg gives
    // 1.2208 and 1.5781. Tolerances cover that: 0.0003 per metre, 2 mm on
    // the 4 m lengths, 1 mm on jack differences, 1 on the edge figures.
    let t = RafterTable::for_pitch(Pitch::from_degrees(35.0).unwrap());
    let m = &t.metric;
    assert_abs_diff_eq!(m.common_per_m_run, 1.2206, epsilon = 0.0003);
    assert_abs_diff_eq!(m.hip_per_m_run, 1.5779, epsilon = 0.0003);
    assert_abs_diff_eq!(4000.0 * m.common_per_m_run, 4882.6, epsilon = 2.0);
    assert_abs_diff_eq!(4000.0 * m.hip_per_m_run, 6311.8, epsilon = 2.0);
    assert_abs_diff_eq!(m.jack_diff_400_mm, 488.0, epsilon = 1.0);
    assert_abs_diff_eq!(m.jack_diff_450_mm, 549.0, epsilon = 1.0);
    assert_abs_diff_eq!(m.jack_diff_600_mm, 732.0, epsilon = 1.0);
    assert_abs_diff_eq!(m.hip_edge_cut_300.figure, 269.0, epsilon = 1.0);
    assert_abs_diff_eq!(m.jack_edge_cut_300.figure, 245.0, epsilon = 1.0);
    assert_eq!(m.jack_edge_cut_300.against, 300.0);
    // The same page at its own rounding: a rise of 0.700 truncated to 4 places.
    let seventy = RafterTable::for_pitch(Pitch::from_rise_per_run(0.7).unwrap());
    let truncated = |v: f64| (v * 10_000.0).floor() / 10_000.0;
    assert_eq!(truncated(seventy.metric.common_per_m_run), 1.2206);
    assert_eq!(truncated(seventy.metric.hip_per_m_run), 1.5779);
    // The jack difference for any spacing agrees with the metric lines.
    assert_abs_diff_eq!(t.jack_diff(Length::from_mm(450.0)).mm(), m.jack_diff_450_mm, epsilon = 1e-9);
}

#[test]
fn australian_22_5_degree_values() {
    // Australian pattern-rafter training material, 22.5 deg: true length
    // 1.082 per metre of run; half span 2150 mm -> 2.327 m; creeper
    // difference at 450 mm centres 487 mm; half-mitre thickness of a 35 mm
    // hip 24.75 mm.
    let t = RafterTable::for_pitch(Pitch::from_degrees(22.5).unwrap());
    assert_abs_diff_eq!(t.metric.common_per_m_run, 1.082, epsilon = 0.0005);
    assert_abs_diff_eq!(2150.0 * t.metric.common_per_m_run, 2327.0, epsilon = 0.5);
    assert_abs_diff_eq!(t.metric.jack_diff_450_mm, 487.0, epsilon = 0.5);
    let half_mitre = RafterTable::jack_shortening_plan(Length::from_mm(35.0)).mm();
    assert_abs_diff_eq!(half_mitre, 24.75, epsilon = 0.005);
    // trade.md section 6: 1.06 in of plan shortening for a 1-1/2 in hip.
    let shortening = RafterTable::jack_shortening_plan(Length::from_inches(1.5)).inches();
    assert_abs_diff_eq!(shortening, 1.06, epsilon = 0.005);
}

#[test]
fn old_text_square_settings_at_nine_in_twelve() {
    // Old carpentry texts (public domain): at 9 in 12 jacks use 12 and 15,
    // hips 17 and 19-1/4 (figures to the nearest 1/4).
    let t = table("9/12");
    let jack = &t.jack_side_cut_by_length;
    assert_eq!((jack.against, jack.mark_along), (12.0, MarkAlong::Figure));
    assert_abs_diff_eq!(jack.figure, 15.0, epsilon = 1e-12);
    let hip = &t.hip_side_cut_by_length;
    assert_abs_diff_eq!(hip.against, 17.0, epsilon = 0.125);
    assert_abs_diff_eq!(hip.figure, 19.25, epsilon = 0.125);
    // Plumb and level on the common and hip: 12 and 9, 17 and 9.
    assert_eq!((t.common_plumb.against, t.common_plumb.figure), (12.0, 9.0));
    assert_eq!(t.common_plumb.mark_along, MarkAlong::Figure);
    assert_eq!(t.common_level.mark_along, MarkAlong::Against);
    assert_abs_diff_eq!(t.hip_plumb.against, 17.0, epsilon = 0.05);
    assert_eq!(t.hip_plumb.figure, 9.0);
}

#[test]
fn side_cut_setups_draw_the_cheek_line() {
    // Derivation: with two figures held on the same edge, the line along
    // the arm holding `a` makes atan(b / a) with that edge (b the other
    // figure). The cheek line across the top edge lies phi from square, so
    // 90 deg - phi from the edge (CompoundCut, checked there by vectors).
    for rise in [2.0, 4.0, 6.0, 9.0, 12.0, 18.0] {
        let t = RafterTable::for_pitch(Pitch::from_rise_per_run(rise / 12.0).unwrap());
        let from_edge = |s: &pitchframe_geometry::SquareSetting| match s.mark_along {
            MarkAlong::Figure => (s.against / s.figure).atan(),
            MarkAlong::Against => (s.figure / s.against).atan(),
        };
        let jack = CompoundCut::new(t.pitch.angle_rad(), 45f64.to_radians()).unwrap();
        let hip = CompoundCut::new(t.hip_pitch_deg.to_radians(), 45f64.to_radians()).unwrap();
        let jack_from_edge = 90f64.to_radians() - jack.top_edge_line_from_square_rad();
        let hip_from_edge = 90f64.to_radians() - hip.top_edge_line_from_square_rad();
        assert_abs_diff_eq!(from_edge(&t.jack_side_cut), jack_from_edge, epsilon = 1e-12);
        assert_abs_diff_eq!(from_edge(&t.jack_side_cut_by_length), jack_from_edge, epsilon = 1e-12);
        assert_abs_diff_eq!(from_edge(&t.hip_side_cut), hip_from_edge, epsilon = 1e-12);
        assert_abs_diff_eq!(from_edge(&t.hip_side_cut_by_length), hip_from_edge, epsilon = 1e-12);
        assert_abs_diff_eq!(from_edge(&t.metric.jack_edge_cut_300), jack_from_edge, epsilon = 1e-12);
        assert_abs_diff_eq!(from_edge(&t.metric.hip_edge_cut_300), hip_from_edge, epsilon = 1e-12);
        // A plumb line lies (90 deg - pitch) from the rafter's edge.
        assert_abs_diff_eq!(
            from_edge(&t.common_plumb),
            90f64.to_radians() - t.pitch.angle_rad(),
            epsilon = 1e-12
        );
        assert_abs_diff_eq!(
            t.jack_top_edge.degrees,
            jack.top_edge_line_from_square_rad().to_degrees(),
            epsilon = 1e-9
        );
        assert_abs_diff_eq!(t.jack_edge_bevel.degrees, jack.edge_bevel_rad().to_degrees(), epsilon = 1e-9);
        assert_abs_diff_eq!(t.hip_edge_bevel.degrees, hip.edge_bevel_rad().to_degrees(), epsilon = 1e-9);
    }
    // trade.md section 3: the jack's top-edge angle at 4 in 12 is 46.5 deg.
    assert_abs_diff_eq!(table("4/12").jack_top_edge.degrees, 46.5, epsilon = 0.05);
}

#[test]
fn hip_backing_and_drop() {
    // trade.md section 4: regular hip backing 12.92 deg at 4/12; a 1-1/2 in
    // hip drops 0.265 in at 6/12 and 0.354 in at 8/12.
    assert_abs_diff_eq!(table("4/12").hip_backing.degrees, 12.92, epsilon = 0.005);
    let drop = |p: &str| table(p).hip_drop(Length::from_inches(1.5)).inches();
    assert_abs_diff_eq!(drop("6/12"), 0.265, epsilon = 0.0005);
    assert_abs_diff_eq!(drop("8/12"), 0.354, epsilon = 0.0005);
}

#[test]
fn backing_and_drop_agree_with_the_roof_planes() {
    // Derivation by vectors: two planes rising from walls along x and y
    // meet in the hip line h = (12, 12, R). The backing is the angle, in a
    // section square to the hip, between level and the roof plane; the
    // drop puts the hip's side-face top corner (t/2 off the centre line,
    // level and square to the hip in plan) onto the roof plane.
    for rise in [3.0, 4.0, 6.0, 8.0, 12.0, 16.0] {
        let t = table(&format!("{rise}/12"));
        let hip = DVec3::new(12.0, 12.0, rise);
        // Plane rising in +y from the wall along x: z = y * rise / 12.
        let plane_normal = DVec3::new(0.0, -rise, 12.0);
        let level_across = hip.cross(DVec3::Z).normalize();
        let roof_across = plane_normal.cross(hip).normalize();
        let backing = level_across.cross(roof_across).length().atan2(level_across.dot(roof_across).abs());
        assert_abs_diff_eq!(backing.to_degrees(), t.hip_backing.degrees, epsilon = 1e-9);
        // Side corner at half a 1-1/2 in thickness: its height below the
        // hip's centre line is the plane's fall over the plan offset.
        let offset = level_across * 0.75;
        let fall = -offset.y * rise / 12.0;
        assert_abs_diff_eq!(fall.abs(), t.hip_drop(Length::from_inches(1.5)).inches(), epsilon = 1e-12);
    }
}

#[test]
fn json_has_flat_numeric_keys() {
    let t = table("4/12");
    let json: serde_json::Value = serde_json::to_value(&t).unwrap();
    for key in [
        "common_per_foot",
        "hip_per_foot",
        "jack_diff_16",
        "jack_diff_24",
        "jack_side_cut",
        "hip_side_cut",
        "pitch_deg",
        "hip_pitch_deg",
        "hip_backing_deg",
        "hip_drop_per_in_thickness",
        "common_per_m_run",
        "hip_per_m_run",
        "jack_diff_400_mm",
        "jack_diff_450_mm",
        "jack_diff_600_mm",
        "jack_edge_cut_300",
        "hip_edge_cut_300",
    ] {
        assert!(json[key].is_f64(), "{key} is {:?}", json[key]);
    }
    assert_eq!(json["common_per_foot"].as_f64(), Some(t.common_per_foot));
    assert_eq!(json["jack_side_cut"].as_f64(), Some(t.jack_side_cut.figure));
    assert_eq!(json["common_plumb"], serde_json::json!([12.0, 4.0]));
    assert_eq!(json["pitch"], "4/12");
    assert!(json["setups"]["jack_side_cut"].as_str().unwrap().contains("mark along the 12 arm"));
}

#[test]
fn text_reads_at_the_saw() {
    let text = table("4/12").to_text();
    // 12.649 in is 1' 0-5/8" to the nearest sixteenth; 16.865 in is 1' 4-7/8".
    assert!(text.contains("1' 0-5/8\""), "{text}");
    assert!(text.contains("1' 4-7/8\""), "{text}");
    assert!(text.contains("12 and 11-3/8"), "{text}");
    assert!(text.contains("12.9 deg"), "{text}");
    assert!(text.contains("46.5 deg"), "{text}");
    // Every angle line is followed by its setup.
    let lines: Vec<&str> = text.lines().collect();
    for (i, line) in lines.iter().enumerate() {
        if line.trim_end().ends_with(" deg") && line.starts_with("  ") && !line.starts_with("      ") {
            let next = lines.get(i + 1).copied().unwrap_or("");
            assert!(next.starts_with("      "), "no setup under {line:?}");
        }
    }
}
