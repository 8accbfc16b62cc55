//! A hip's or valley's tail ends in a double cheek, one face parallel to
//! each fascia (trade.md section 6): the cut list and the card give each
//! face its own saw settings, and name its side.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]

mod plans;

use pitchframe_cards::{CardOptions, CutFace, length_style, member_card, render_cards};
use pitchframe_geometry::framing::Cut;
use pitchframe_geometry::{Plan, Roof, demo_plan, frame_roof};

fn plans() -> Vec<Plan> {
    vec![
        demo_plan().unwrap(),
        Plan::from_toml(include_str!("../../../examples/hillside-cottage.toml")).unwrap(),
        Plan::from_toml(include_str!("../../../examples/metric-bungalow.toml")).unwrap(),
    ]
}

#[test]
fn each_face_of_a_double_cheek_tail_has_its_own_settings() {
    let mut double_tails = 0;
    for plan in plans() {
        let outline = plan.outline().unwrap();
        let roof = Roof::solve(&outline).unwrap();
        let frame = frame_roof(&outline, &roof, &plan.framing_settings().unwrap()).unwrap();
        for member in &frame.members {
            let Some(faces) = member.cuts.iter().find_map(|cut| match cut {
                Cut::Tail { faces, .. } if faces.len() == 2 => Some(faces),
                _ => None,
            }) else {
                continue;
            };
            double_tails += 1;
            let card = member_card(member, &frame.pieces, length_style(&plan));
            let tails: Vec<_> = card.cuts.iter().filter(|cut| cut.face == CutFace::TailPlumb).collect();
            assert_eq!(tails.len(), 2, "{}: one tail cut per face", member.label);
            let places: Vec<&str> = tails.iter().map(|cut| cut.place.as_str()).collect();
            assert!(places.iter().any(|p| p.contains("left face")), "{}: {places:?}", member.label);
            assert!(places.iter().any(|p| p.contains("right face")), "{}: {places:?}", member.label);
            // Each face's angles, as the framing read them off its plane,
            // are on one of the two cuts.
            for face in faces {
                assert!(
                    tails.iter().any(|cut| cut.angles.is_some_and(|a| (a.top_line_deg
                        - face.top_edge_angle_deg)
                        .abs()
                        < 1e-9
                        && (a.circular_on_face_bevel_deg - face.face_bevel_deg).abs() < 1e-9
                        && (a.circular_on_edge_bevel_deg - face.edge_bevel_deg).abs() < 1e-9)),
                    "{}: a tail face's settings are missing",
                    member.label
                );
            }
        }
    }
    assert!(double_tails > 0, "the plans have hips with double-cheek tails");
}

#[test]
fn the_demo_hip_card_shows_both_tail_faces() {
    let deck = plans::all_decks().remove(0);
    let pdf = render_cards(&deck, &CardOptions::default()).unwrap();
    let text: String =
        plans::text_runs(&pdf).into_iter().flatten().map(|run| run.text).collect::<Vec<_>>().join(" ");
    // The regular hip H1 and valley V1: each tail face under its own
    // heading naming its side (trade.md section 6: a hip's tail ends in a
    // double cheek parallel to the fascias). Wrapped lines are joined with
    // a space.
    assert!(text.contains("left face of a double cheek"), "left tail face");
    assert!(text.contains("right face of a double cheek"), "right tail face");
}
