//! The safety cautions, word for word as the README's Safety section has
//! them, shown at first start and from the Help menu.

/// The opening paragraph.
pub const SAFETY_INTRO: &str = "Pitchframe lays out geometry. It does not size members, check spans, design \
connections or decide notch limits: those are set by your local building code, by engineered designs and \
by licensed professionals, and they govern.";

/// The cautions, one per point.
pub const SAFETY_POINTS: [&str; 4] = [
    "Work at height needs fall protection, and the frame needs temporary bracing until the roof is sheathed.",
    "Steep bevels and short offcuts kick back: support and clamp the work, and test-cut a pair before \
     cutting the run.",
    "Measure the real building. Walls that are out of square, out of level or off their drawn size change \
     every number here.",
    "Member sizes, spans, ridge beams on low slopes, connections and notch limits come from local codes, \
     engineered designs and licensed professionals, never from this tool.",
];

/// Shows the cautions in large type.
pub fn safety_ui(ui: &mut egui::Ui) {
    ui.label(egui::RichText::new(SAFETY_INTRO).size(18.0));
    ui.add_space(6.0);
    for point in SAFETY_POINTS {
        ui.horizontal_wrapped(|ui| {
            ui.label(egui::RichText::new("•").size(18.0).strong());
            ui.label(egui::RichText::new(point).size(18.0));
        });
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    fn words(text: &str) -> String {
        text.split_whitespace().collect::<Vec<_>>().join(" ")
    }

    #[test]
    fn the_cautions_are_the_readmes_word_for_word() {
        let readme = include_str!("../../../../README.md");
        let section = readme.split("## Safety").nth(1).unwrap().split("\n## ").next().unwrap();
        let mut expected = vec![SAFETY_INTRO.to_owned()];
        expected.extend(SAFETY_POINTS.iter().map(|point| format!("- {point}")));
        assert_eq!(words(section), words(&expected.join(" ")));
    }
}
