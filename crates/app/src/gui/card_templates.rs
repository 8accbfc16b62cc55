//! The members a full-size end template can be printed for: those with a
//! plumb or cheek cut at an end, whose line is quicker traced from a
//! pattern held on the board than laid out with the square on every one.

use pitchframe_cards::{CardDeck, CutFace, card_deck};
use pitchframe_geometry::Plan;

use super::scene::Scene;

/// A member offered for a full-size template.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct TemplateMember {
    /// Its label on the cards ("H1").
    pub label: String,
    /// Its kind in words ("hip").
    pub kind: String,
}

/// The members of `deck` with a plumb or cheek end, in the cards' order.
pub fn template_members(deck: &CardDeck) -> Vec<TemplateMember> {
    deck.members
        .iter()
        .filter(|member| {
            member.cuts.iter().any(|cut| {
                matches!(
                    cut.face,
                    CutFace::TopPlumb | CutFace::BottomPlumb | CutFace::TailPlumb | CutFace::Cheek
                )
            })
        })
        .map(|member| TemplateMember { label: member.label.clone(), kind: member.kind.clone() })
        .collect()
}

/// The template members of the frame on screen, or none when `plan` and
/// `scene` do not make one (the cards cannot be printed then either).
pub fn scene_template_members(plan: &Plan, scene: &Scene) -> Vec<TemplateMember> {
    let (Ok(outline), Some(roof), Some(frame)) = (plan.outline(), &scene.roof, &scene.frame) else {
        return Vec::new();
    };
    // The labels come from the same deck the cards are printed from; the
    // lumber order only adds the stock lengths, which labels do not use.
    template_members(&card_deck("", plan, &outline, roof, frame, None))
}

#[cfg(test)]
mod tests {
    use pitchframe_geometry::demo_plan;

    use super::super::derived::{WALL_HEIGHT_IN, WALL_THICKNESS_IN};
    use super::*;

    #[test]
    fn the_demo_offers_its_rafters_and_not_its_ridge_boards() {
        let plan = demo_plan().unwrap();
        let outline = plan.outline().unwrap();
        let settings = plan.framing_settings().unwrap();
        let scene = Scene::build(&outline, Some(&settings), WALL_HEIGHT_IN, WALL_THICKNESS_IN);
        let offered = scene_template_members(&plan, &scene);
        let deck =
            card_deck("", &plan, &outline, scene.roof.as_ref().unwrap(), scene.frame.as_ref().unwrap(), None);
        // Every rafter meets the ridge, a hip or a valley with a plumb cut
        // (square across on a common, with cheeks on a hip, valley or jack)
        // and ends at the fascia with a tail plumb cut; a ridge board is
        // cut square at its ends (common practice, no source; trade.md
        // section 6 for the hip tail's double cheek).
        for member in &deck.members {
            let is_offered = offered.iter().any(|offer| offer.label == member.label);
            assert_eq!(is_offered, member.kind != "ridge board", "{} {}", member.label, member.kind);
        }
        assert!(offered.iter().any(|member| member.kind == "common rafter"), "{offered:?}");
        assert!(deck.members.iter().any(|member| member.kind == "ridge board"), "the demo has a ridge");
    }
}
