//! The colours of the 3D view, as 8-bit sRGB, in one place so the view,
//! the legend and the window tests agree.

use pitchframe_geometry::framing::FaceTag;
use pitchframe_geometry::{MemberKind, RoofLineKind};

use super::scene::PartKind;

/// The 3D view's background: a pale blue-grey sky that no lit part nears.
pub const BACKGROUND: [u8; 3] = [206, 218, 232];

/// The picked piece's body: a magenta that no member kind uses, lit.
pub const HIGHLIGHT: [u8; 3] = [240, 0, 200];

/// The other pieces of the picked member: a pale version of the highlight.
pub const SAME_MEMBER: [u8; 3] = [245, 160, 225];

/// The colour a part is drawn in before lighting.
pub fn part(kind: PartKind) -> [u8; 3] {
    match kind {
        // Warm tan: plainly "building" and far from the sky colour.
        PartKind::Walls | PartKind::Gables => [214, 178, 128],
        // A dark clay red, so the roof stands apart from walls and sky.
        PartKind::RoofPlanes => [150, 84, 66],
        PartKind::RoofLines(RoofLineKind::Ridge) => [200, 40, 40],
        PartKind::RoofLines(RoofLineKind::Hip) => [30, 110, 200],
        PartKind::RoofLines(RoofLineKind::Valley) => [40, 160, 70],
        PartKind::Members(kind) => member(kind),
    }
}

/// One colour per member kind; sloped members that carry others are
/// strong, the jacks they carry are paler versions of the same hue.
pub fn member(kind: MemberKind) -> [u8; 3] {
    match kind {
        MemberKind::Ridge => [110, 70, 150],
        MemberKind::Common => [226, 196, 120],
        MemberKind::KingCommon => [220, 140, 50],
        MemberKind::Hip => [40, 90, 190],
        MemberKind::HipJack => [130, 170, 225],
        MemberKind::Valley => [30, 130, 70],
        MemberKind::ValleyJack => [130, 200, 140],
        MemberKind::CrippleJack => [150, 150, 150],
    }
}

/// The colour of a cut face on the picked piece, by what made it. Drawn
/// unlit, so the colour reads the same whichever way the face turns.
pub fn cut(tag: FaceTag) -> [u8; 3] {
    match tag {
        FaceTag::Plumb => [255, 40, 40],
        FaceTag::Cheek => [255, 150, 0],
        FaceTag::Seat => [0, 220, 255],
        FaceTag::Heel => [0, 80, 255],
        FaceTag::Tail => [255, 235, 0],
        FaceTag::Soffit => [150, 255, 0],
        FaceTag::Backing => [140, 0, 255],
        FaceTag::End => [255, 255, 255],
        // Board faces are not cuts; they take the highlight.
        FaceTag::Side | FaceTag::Top | FaceTag::Bottom | FaceTag::Interior => HIGHLIGHT,
    }
}

/// Every cut kind, in legend order.
pub const CUT_TAGS: [FaceTag; 8] = [
    FaceTag::Plumb,
    FaceTag::Cheek,
    FaceTag::Seat,
    FaceTag::Heel,
    FaceTag::Tail,
    FaceTag::Soffit,
    FaceTag::Backing,
    FaceTag::End,
];

/// Every member kind, in legend order.
pub const MEMBER_KINDS: [MemberKind; 8] = [
    MemberKind::Ridge,
    MemberKind::Common,
    MemberKind::KingCommon,
    MemberKind::Hip,
    MemberKind::HipJack,
    MemberKind::Valley,
    MemberKind::ValleyJack,
    MemberKind::CrippleJack,
];

/// The cut kind's name in the trade's words.
pub fn cut_name(tag: FaceTag) -> &'static str {
    match tag {
        FaceTag::Plumb => "Plumb cut",
        FaceTag::Cheek => "Cheek cut",
        FaceTag::Seat => "Seat cut",
        FaceTag::Heel => "Heel cut",
        FaceTag::Tail => "Tail cut",
        FaceTag::Soffit => "Soffit cut",
        FaceTag::Backing => "Backing",
        FaceTag::End => "Square end",
        FaceTag::Side => "Side",
        FaceTag::Top => "Top edge",
        FaceTag::Bottom => "Bottom edge",
        FaceTag::Interior => "Inside the piece",
    }
}

/// The member kind's name in the trade's words.
pub fn member_name(kind: MemberKind) -> &'static str {
    match kind {
        MemberKind::Ridge => "Ridge board",
        MemberKind::Common => "Common rafter",
        MemberKind::KingCommon => "King common",
        MemberKind::Hip => "Hip rafter",
        MemberKind::HipJack => "Hip jack",
        MemberKind::Valley => "Valley rafter",
        MemberKind::ValleyJack => "Valley jack",
        MemberKind::CrippleJack => "Cripple jack",
    }
}

/// The fill behind wall numbers in the plan view: a deep slate that white
/// text reads on in both light and dark colours.
pub const WALL_BADGE: egui::Color32 = egui::Color32::from_rgb(60, 80, 110);

/// The glow behind a selected wall or corner in the plan view.
pub fn selection(dark: bool) -> egui::Color32 {
    if dark { egui::Color32::from_rgb(40, 120, 200) } else { egui::Color32::from_rgb(120, 190, 255) }
}
