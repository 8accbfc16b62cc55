//! A hip's top cut in two steps, where the ridge side it bears on steps
//! aside at the ridge's end: the card and the cut list give the cheek with
//! its square and saw settings, where the step is and how deep, and the
//! step's own face with its settings.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

use glam::dvec2;
use pitchframe_cards::{CutFace, cut_text, member_card};
use pitchframe_geometry::framing::{Cut, FramingSettings};
use pitchframe_geometry::{LengthStyle, Outline, Roof, Wall, WallRoof, frame_roof};

/// Seed 9260 of the long random run, corner by corner: first corner, rise
/// per run (0 for a gable), overhang. A ridge there steps 0.0675 in aside
/// at a hip's top, across a hip too short to cut.
#[rustfmt::skip]
const SEED_9260: [(f64, f64, f64, f64); 17] = [
    (0.0, 131.604605058143, 1.3135104620266818, 12.0),
    (207.54637503652404, 131.604605058143, 0.3333333333333333, 14.0),
    (207.54637503652404, 0.0, 0.4166666666666667, 14.0),
    (415.0927500730481, 0.0, 1.3333333333333333, 9.0),
    (415.0927500730481, 131.604605058143, 0.8333333333333334, 7.0),
    (622.6391251095721, 131.604605058143, 0.9173881695691938, 17.0),
    (622.6391251095721, 397.52735171752204, 1.0833333333333333, 8.0),
    (415.0927500730481, 397.52735171752204, 1.297639789359674, 13.0),
    (415.092750073048, 507.87107842222406, 1.297639789359674, 21.0),
    (415.0927500730481, 557.0567839408894, 1.297639789359674, 10.0),
    (415.0927500730481, 676.6003386448165, 0.0, 7.0),
    (207.54637503652404, 676.6003386448165, 1.25, 22.0),
    (207.54637503652404, 397.52735171752204, 1.084444540760518, 8.0),
    (117.48153286732361, 397.52735171752204, 1.084444540760518, 19.0),
    (0.0, 397.52735171752204, 0.0, 1.0),
    (0.0, 312.04203925055975, 0.0, 1.0),
    (0.0, 196.14336335503975, 0.0, 9.0),
];

#[test]
fn a_stepped_cheek_has_the_cheek_the_step_and_the_steps_face_on_its_card() {
    let walls = SEED_9260
        .iter()
        .map(|&(x, y, slope, overhang_in)| Wall {
            corner: dvec2(x, y),
            roof: if slope > 0.0 { WallRoof::Pitched { rise_per_run: slope } } else { WallRoof::Gable },
            overhang_in,
        })
        .collect();
    let outline = Outline::new(walls, Vec::new()).unwrap();
    let roof = Roof::solve(&outline).unwrap();
    let frame = frame_roof(&outline, &roof, &FramingSettings::default()).unwrap();
    let stepped: Vec<_> = frame
        .members
        .iter()
        .filter_map(|m| {
            m.cuts.iter().find_map(|c| match c {
                Cut::SteppedCheek { face, step, step_in, .. } => Some((m, *face, *step, *step_in)),
                _ => None,
            })
        })
        .collect();
    assert_eq!(stepped.len(), 1, "one hip's top is stepped");
    let (member, face, step, step_in) = stepped[0];
    let style = LengthStyle::FeetInches;
    let card = member_card(member, &frame.pieces, style);
    let cheek = card.cuts.iter().find(|c| c.place.contains("stepped cheek")).unwrap();
    let step_cut = card.cuts.iter().find(|c| c.place.contains("the step of")).unwrap();
    assert_eq!(cheek.face, CutFace::Cheek);
    assert!(cheek.square.is_some(), "the cheek's line has its square");
    // Each face's angles as the framing read them off its plane.
    for (cut, f) in [(cheek, face), (step_cut, step)] {
        let a = cut.angles.unwrap();
        assert!((a.top_line_deg - f.top_edge_angle_deg).abs() < 1e-9, "{}", cut.place);
        assert!((a.circular_on_face_bevel_deg - f.face_bevel_deg).abs() < 1e-9, "{}", cut.place);
    }
    // The step is the two ridges' offset square to their line, 0.0675 in
    // (derivation from the nodes of the solve, y = 251.865 and 251.797).
    let offset = 251.864_772_802_582_22 - 251.797_241_768_700_7;
    assert!((step_in - offset).abs() < 1e-9, "step {step_in}, offset {offset}");
    let text = cut_text(cheek);
    assert!(text.contains("stepped") && text.contains("deeper"), "{text}");
    assert!(cut_text(step_cut).contains("square to the cheek"), "{}", cut_text(step_cut));
}
