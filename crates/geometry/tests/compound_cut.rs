//! Compound cuts: the closed-form trade formulas against an independent
//! vector computation, and the trade facts they must reproduce.

use std::f64::consts::FRAC_PI_2;

use approx::assert_abs_diff_eq;
use pitchframe_geometry::{CompoundCut, CutAngles, CutWarning};
use proptest::prelude::*;

fn deg(d: f64) -> f64 {
    d.to_radians()
}

fn assert_agree(a: CutAngles, b: CutAngles, tolerance: f64) {
    assert_abs_diff_eq!(a.plumb_line_from_square_rad, b.plumb_line_from_square_rad, epsilon = tolerance);
    assert_abs_diff_eq!(
        a.top_edge_line_from_square_rad,
        b.top_edge_line_from_square_rad,
        epsilon = tolerance
    );
    assert_abs_diff_eq!(a.face_bevel_rad, b.face_bevel_rad, epsilon = tolerance);
    assert_abs_diff_eq!(a.edge_bevel_rad, b.edge_bevel_rad, epsilon = tolerance);
}

#[test]
fn regular_hip_jack_face_bevel_is_45_at_every_pitch() {
    // trade.md section 3 (common practice): the cut plane and the
    // unbevelled blade both contain the plumb line, so the pitch drops out.
    for rise in 1..=24 {
        let theta = (f64::from(rise) / 12.0).atan();
        let cut = CompoundCut::new(theta, deg(45.0)).unwrap();
        assert_abs_diff_eq!(cut.face_bevel_rad(), deg(45.0), epsilon = 1e-15);
        assert_abs_diff_eq!(cut.by_vectors().face_bevel_rad, deg(45.0), epsilon = 1e-12);
    }
}

#[test]
fn four_in_twelve_jack() {
    // trade.md section 3: at 4 in 12 the jack's top-edge line is 46.5 deg
    // from square (not a saw bevel); the side-cut figure is 11-3/8 against
    // 12 (common practice, rafter table line 5).
    let cut = CompoundCut::new((4.0f64 / 12.0).atan(), deg(45.0)).unwrap();
    assert_abs_diff_eq!(cut.top_edge_line_from_square_rad().to_degrees(), 46.5, epsilon = 0.05);
    let figures = cut.top_edge_square_figures().unwrap();
    assert_eq!(figures.figure, 12.0);
    assert!((figures.against * 16.0).round() == 11.375 * 16.0, "{}", figures.against);
    let plumb = cut.plumb_square_figures();
    assert_abs_diff_eq!(plumb.figure, 4.0, epsilon = 1e-12);
    // Derivation: sin B = cos 45 sin(18.43 deg) = 0.2236, B = 12.92 deg.
    assert_abs_diff_eq!(cut.edge_bevel_rad().to_degrees(), 12.92, epsilon = 0.005);
    let flat = cut.miter_saw_flat();
    assert_abs_diff_eq!(flat.miter_rad, (4.0f64 / 12.0).atan(), epsilon = 1e-15);
    assert_abs_diff_eq!(flat.bevel_rad, deg(45.0), epsilon = 1e-15);
    let on_edge = cut.miter_saw_on_edge();
    assert_eq!(on_edge.miter_rad, cut.top_edge_line_from_square_rad());
    assert_eq!(on_edge.bevel_rad, cut.edge_bevel_rad());
}

#[test]
fn every_angle_comes_with_its_setup() {
    let cut = CompoundCut::new((4.0f64 / 12.0).atan(), deg(45.0)).unwrap();
    let settings = cut.settings();
    assert_eq!(settings.len(), 6);
    for setting in &settings {
        // Each setup names its tool or face and repeats the number it goes with.
        assert!(setting.setup.contains(&format!("{:.1} deg", setting.degrees)), "{}", setting.setup);
    }
    assert!(settings[1].setup.contains("not a saw bevel"));
}

#[test]
fn warnings_flag_bevels_past_the_saw() {
    // A 60 deg plan angle at 12/12: face bevel 60, edge bevel
    // asin(cos 60 sin 45) = 20.7 deg (derivation).
    let cut = CompoundCut::new(deg(45.0), deg(60.0)).unwrap();
    let warnings = cut.warnings(deg(45.0));
    assert_eq!(warnings.len(), 1);
    assert!(matches!(warnings[0], CutWarning::FaceBevelBeyondSaw { .. }));
    let message = warnings[0].to_string();
    assert!(message.contains("60.0 deg") && message.contains("20.7 deg"), "{message}");
    assert!(cut.warnings(deg(60.0)).is_empty());
    // A regular jack at 45 deg on a 45 deg saw is not flagged.
    assert!(CompoundCut::new(deg(30.0), deg(45.0)).unwrap().warnings(deg(45.0)).is_empty());
    // Both past a 10 deg saw: the message says neither setup reaches it.
    let both = CompoundCut::new(deg(45.0), deg(30.0)).unwrap().warnings(deg(10.0));
    assert_eq!(both.len(), 2);
    assert!(both[0].to_string().contains("neither"));
}

#[test]
fn degenerate_cuts_are_refused() {
    assert!(CompoundCut::new(0.4, FRAC_PI_2).is_none());
    assert!(CompoundCut::new(FRAC_PI_2, 0.4).is_none());
    assert!(CompoundCut::new(f64::NAN, 0.4).is_none());
    assert!(CompoundCut::new(0.4, f64::NAN).is_none());
}

proptest! {
    #[test]
    fn closed_form_and_vectors_agree(theta_deg in 0.0f64..85.0, gamma_deg in -85.0f64..85.0) {
        let cut = CompoundCut::new(deg(theta_deg), deg(gamma_deg)).unwrap();
        let closed = cut.closed_form();
        let vectors = cut.by_vectors();
        for (name, a, b) in [
            ("plumb", closed.plumb_line_from_square_rad, vectors.plumb_line_from_square_rad),
            ("top edge", closed.top_edge_line_from_square_rad, vectors.top_edge_line_from_square_rad),
            ("face bevel", closed.face_bevel_rad, vectors.face_bevel_rad),
            ("edge bevel", closed.edge_bevel_rad, vectors.edge_bevel_rad),
        ] {
            prop_assert!((a - b).abs() < 1e-9, "{name}: {a} vs {b} at {theta_deg}, {gamma_deg}");
        }
    }

    #[test]
    fn jack_face_bevel_is_45_whatever_the_pitch(theta_deg in 0.0f64..89.0) {
        let cut = CompoundCut::new(deg(theta_deg), deg(45.0)).unwrap();
        prop_assert!((cut.by_vectors().face_bevel_rad - deg(45.0)).abs() < 1e-9);
    }
}

#[test]
fn closed_form_and_vectors_agree_on_a_grid() {
    for theta in (0..90).step_by(5) {
        for gamma in (0..90).step_by(5) {
            let cut = CompoundCut::new(deg(f64::from(theta)), deg(f64::from(gamma))).unwrap();
            assert_agree(cut.closed_form(), cut.by_vectors(), 1e-9);
        }
    }
}
