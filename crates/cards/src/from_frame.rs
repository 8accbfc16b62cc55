//! Printed-output input read off the framing: member cards (views from each
//! member's solid), the lumber order's pieces and the 3D model's pieces.

use glam::{DVec2, DVec3};
use pitchframe_geometry::framing::{
    Cut, CutEnd, CutFace as FaceAngles, FaceTag, FramingWarning, Hand, PlacedPiece, SawKind, TailCut,
};
use pitchframe_geometry::{
    AngleSetting, Frame, Length, LengthStyle, LengthUnit, MarkAlong, Member, MemberKind, Outline, Plan, Roof,
    SquareSetting,
};

use crate::square_figure::{SquareUse, degrees_text, figure_unit_in, square_setting};
use crate::{
    CardCut, CardDeck, CutAngles, CutFace, CutMark, LumberOrder, MemberCard, MemberLengths, MemberView,
    ModelFace, ModelPiece, ModelScene, OrderPiece, ViewFace,
};

/// The trade's words for a member kind.
pub fn kind_words(kind: MemberKind) -> &'static str {
    match kind {
        MemberKind::Ridge => "ridge board",
        MemberKind::Common => "common rafter",
        MemberKind::KingCommon => "king common",
        MemberKind::Hip => "hip",
        MemberKind::Valley => "valley",
        MemberKind::HipJack => "hip jack",
        MemberKind::ValleyJack => "valley jack",
        MemberKind::CrippleJack => "cripple jack",
    }
}

/// How a plan's lengths are written: feet-inches for inch plans,
/// millimetres for metric ones.
pub fn length_style(plan: &Plan) -> LengthStyle {
    match plan.units {
        LengthUnit::Inch => LengthStyle::FeetInches,
        LengthUnit::Millimetre => LengthStyle::Millimetres,
    }
}

/// A board size in words: "2x8" for the dressed US 2x sizes, thickness by
/// depth otherwise.
pub fn size_words(thickness_in: f64, depth_in: f64, style: LengthStyle) -> String {
    let nominal = [(3.5, 4), (5.5, 6), (7.25, 8), (9.25, 10), (11.25, 12)];
    if (thickness_in - 1.5).abs() < 1e-6
        && let Some((_, depth)) = nominal.iter().find(|(dressed, _)| (dressed - depth_in).abs() < 1e-6)
    {
        return format!("2x{depth}");
    }
    let short =
        if style == LengthStyle::Millimetres { LengthStyle::Millimetres } else { LengthStyle::Inches };
    format!(
        "{} x {}",
        Length::from_inches(thickness_in).format(short),
        Length::from_inches(depth_in).format(short)
    )
}

/// A joint's gap or overlap, `inches`, in `style`'s units: thousandths of
/// an inch or tenths of a millimetre, since misfits from 1/64 in up would
/// round to nothing in sixteenths or whole millimetres.
pub fn misfit_text(inches: f64, style: LengthStyle) -> String {
    if style == LengthStyle::Millimetres {
        format!("{:.1} mm", inches * 25.4)
    } else {
        Length::from_inches(inches).format(LengthStyle::DecimalInches)
    }
}

/// A framing warning in words, for the member it is on.
pub fn warning_words(warning: &FramingWarning, style: LengthStyle) -> String {
    let length = |inches: f64| Length::from_inches(inches).format(style);
    match warning {
        FramingWarning::NotchTooDeep { notch_depth_in, limit_in, .. } => format!(
            "birdsmouth notch {} deep, past the notch limit of {}: check with whoever sized the member",
            length(*notch_depth_in),
            length(*limit_in)
        ),
        FramingWarning::BevelBeyondSaw { end, saw, bevel_deg, max_deg, .. } => format!(
            "the {} cut needs a {} bevel on the {}, past its {}: cut the \
             complement and recut, or use the other saw",
            end_words(*end),
            degrees_text(*bevel_deg),
            match saw {
                SawKind::Circular => "circular saw",
                SawKind::Miter => "miter saw",
            },
            degrees_text(*max_deg)
        ),
        FramingWarning::HipTooShallow { hip, short_by_in, .. } => format!(
            "its cheek cut hangs {} below {hip}: use a deeper {hip} or block under the jack",
            length(*short_by_in)
        ),
        FramingWarning::RidgeTooShallow { ridge, short_by_in, .. } => format!(
            "its plumb cut hangs {} below the ridge {ridge}: use a deeper ridge",
            length(*short_by_in)
        ),
        FramingWarning::StockLengthExceeded { length_in, longest_stock_in, .. } => format!(
            "{} long, more than the longest stock ({}): splice over a support or order special",
            length(*length_in),
            length(*longest_stock_in)
        ),
        FramingWarning::HipsMeetWithoutRidge { .. } => {
            "hips meet at a point with no ridge: their tops need a fitted block or hub".to_string()
        }
        FramingWarning::ShortMemberLeftOut { left_out, length_in, .. } => format!(
            "a {} only {} long between two nodes is left out: fit this end there by hand, with a block where needed",
            if *left_out == MemberKind::Valley { "valley" } else { "hip" },
            length(*length_in)
        ),
        FramingWarning::RidgeBesideLeftOut { label, ridge, length_in, apart_in } => {
            if label == ridge {
                format!(
                    "a ridge {} long running {} beside this one is left out, since the two boards would \
                     overlap: the members on its side are cut to this ridge instead",
                    length(*length_in),
                    length(*apart_in)
                )
            } else {
                format!(
                    "cut to {ridge} in place of a ridge {} long running {} beside it, left out since the \
                     two boards would overlap",
                    length(*length_in),
                    length(*apart_in)
                )
            }
        }
        FramingWarning::JointDoesNotFit { bears_on, gap_in, overlap_in, .. } => format!(
            "does not fit {bears_on} as framed (gap {}, overlap {}): fit this joint in place, with a \
             block or a cut by hand, before cutting the run",
            misfit_text(*gap_in, style),
            misfit_text(*overlap_in, style)
        ),
        FramingWarning::HipCutLevelAtPlate { cut_in, .. } => format!(
            "runs so low beside a wall it would go into the plate: cut its lower edge level with the top \
             of plate, up to {} off its depth; walls nearly in line often cause this",
            length(*cut_in)
        ),
        FramingWarning::TailsLeftOut { count, .. } => format!(
            "cut at the wall line (no overhang on one side), with the other side's jacks meeting it only \
             outside the wall line: {count} such {} left out, so that stretch of overhang has no rafter tails; \
             frame it with lookouts or blocking fixed to the wall",
            if *count == 1 { "jack is" } else { "jacks are" }
        ),
        FramingWarning::JackMovedOffLayout { ridge, by_in, .. } => format!(
            "moved {} off the layout along its wall to clear the end of {ridge}: mark its place off the \
             layout on the valley and the ridge",
            length(*by_in)
        ),
        FramingWarning::JackLeftOutAtRidgeEnd { count, .. } => format!(
            "{count} valley {} on the layout would hold this ridge's end and {} no room clear of it: left \
             out, so this ridge's end carries the sheathing there",
            if *count == 1 { "jack" } else { "jacks" },
            if *count == 1 { "has" } else { "have" }
        ),
    }
}

fn end_words(end: CutEnd) -> &'static str {
    match end {
        CutEnd::Top => "upper end",
        CutEnd::Bottom => "lower end",
        CutEnd::Seat => "birdsmouth",
        CutEnd::Tail => "tail",
        CutEnd::Start => "start end",
        CutEnd::End => "far end",
        CutEnd::FullLength => "full length",
    }
}

fn face_kind(tag: FaceTag, end: Option<CutEnd>) -> Option<CutFace> {
    match tag {
        FaceTag::Plumb => Some(match end {
            Some(CutEnd::Tail) => CutFace::TailPlumb,
            Some(CutEnd::Bottom) => CutFace::BottomPlumb,
            _ => CutFace::TopPlumb,
        }),
        FaceTag::Seat => Some(CutFace::Seat),
        FaceTag::Heel => Some(CutFace::Heel),
        FaceTag::Cheek => Some(CutFace::Cheek),
        FaceTag::Tail => Some(CutFace::TailPlumb),
        FaceTag::Soffit => Some(CutFace::TailLevel),
        FaceTag::Backing => Some(CutFace::Backing),
        FaceTag::End => Some(CutFace::SquareEnd),
        _ => None,
    }
}

/// A piece's own frame: x up its axis, up square to it in the plumb plane,
/// side completing the frame (pointing left looking up the member).
fn piece_frame(piece: &PlacedPiece) -> (DVec3, DVec3, DVec3, DVec3) {
    let origin = piece.axis[0];
    let along = (piece.axis[1] - piece.axis[0]).try_normalize().unwrap_or(DVec3::X);
    let up = (DVec3::Z - along * along.z).try_normalize().unwrap_or(DVec3::Y);
    (origin, along, up, up.cross(along))
}

fn convex_hull(points: &[DVec2]) -> Vec<DVec2> {
    let mut sorted = points.to_vec();
    sorted.sort_by(|a, b| a.x.total_cmp(&b.x).then(a.y.total_cmp(&b.y)));
    sorted.dedup_by(|a, b| a.distance(*b) < 1e-9);
    if sorted.len() < 3 {
        return sorted;
    }
    let mut hull: Vec<DVec2> = Vec::new();
    for pass in 0..2 {
        let start = hull.len();
        let iter: Box<dyn Iterator<Item = &DVec2>> =
            if pass == 0 { Box::new(sorted.iter()) } else { Box::new(sorted.iter().rev()) };
        for &p in iter {
            while hull.len() >= start + 2 {
                let (a, b) = (hull[hull.len() - 2], hull[hull.len() - 1]);
                if (b - a).perp_dot(p - b) <= 0.0 {
                    hull.pop();
                } else {
                    break;
                }
            }
            hull.push(p);
        }
        hull.pop();
    }
    hull
}

/// The side view (x along, y up from the bottom edge) and top view (x
/// along, y across) of a piece.
fn views(piece: &PlacedPiece, depth_in: f64, with_top: bool) -> (MemberView, Option<MemberView>) {
    let (origin, along, up, side) = piece_frame(piece);
    let side_point = |v: DVec3| DVec2::new((v - origin).dot(along), (v - origin).dot(up) + depth_in);
    let top_point = |v: DVec3| DVec2::new((v - origin).dot(along), (v - origin).dot(side));
    let mut side_view = MemberView::default();
    let mut top_view = MemberView::default();
    let mut all_side = Vec::new();
    let mut all_top = Vec::new();
    for part in &piece.solid.parts {
        let projected: Vec<DVec2> = part.vertices.iter().map(|v| side_point(*v)).collect();
        all_side.extend(projected.iter().copied());
        side_view.parts.push(convex_hull(&projected));
        let projected: Vec<DVec2> = part.vertices.iter().map(|v| top_point(*v)).collect();
        all_top.extend(projected.iter().copied());
        top_view.parts.push(convex_hull(&projected));
        for face in &part.faces {
            let Some(kind) = face_kind(face.tag, face.end) else { continue };
            // Side view: faces seen from the near side or edge-on; top view:
            // faces seen from above.
            if face.normal.dot(side) <= 1e-6 && kind != CutFace::Backing {
                side_view.faces.push(ViewFace {
                    face: kind,
                    outline: face.vertices.iter().map(|v| side_point(*v)).collect(),
                });
            }
            if kind == CutFace::Backing && face.normal.dot(up) >= -1e-6 {
                top_view.faces.push(ViewFace {
                    face: kind,
                    outline: face.vertices.iter().map(|v| top_point(*v)).collect(),
                });
            } else if matches!(
                kind,
                CutFace::Cheek | CutFace::TopPlumb | CutFace::BottomPlumb | CutFace::TailPlumb
            ) {
                // A plumb cut on a sloped member hides under the top when
                // seen square to it; what the top view shows, and what is
                // marked there, is the line the cut leaves on the top:
                // the face's corners in the upper half of the depth.
                let on_top: Vec<DVec2> = face
                    .vertices
                    .iter()
                    .filter(|v| (**v - origin).dot(up) > -0.5 * depth_in)
                    .map(|v| top_point(*v))
                    .collect();
                if on_top.len() >= 2 {
                    top_view.faces.push(ViewFace { face: kind, outline: on_top });
                }
            }
        }
    }
    side_view.outline = convex_hull(&all_side);
    top_view.outline = convex_hull(&all_top);
    (side_view, with_top.then_some(top_view))
}

/// The two points of a face outline farthest apart: its ends when the
/// face is seen edge-on.
fn face_ends(outline: &[DVec2]) -> Option<(DVec2, DVec2)> {
    let mut best: Option<(f64, DVec2, DVec2)> = None;
    for (index, a) in outline.iter().enumerate() {
        for b in outline.iter().skip(index + 1) {
            let distance = a.distance_squared(*b);
            if best.is_none_or(|(far, _, _)| distance > far) {
                best = Some((distance, *a, *b));
            }
        }
    }
    best.filter(|(far, _, _)| *far > 1e-12).map(|(_, a, b)| (a, b))
}

/// Where the line a cut leaves on the side face meets the edge the square
/// is held on (the top edge at `edge_y` = depth, the bottom at 0), and its
/// direction into the board.
fn edge_mark(view: &MemberView, face: CutFace, edge_y: f64) -> Option<CutMark> {
    let outline = &view.faces.iter().find(|f| f.face == face)?.outline;
    let (a, b) = face_ends(outline)?;
    let (on_edge, other) = if (a.y - edge_y).abs() <= (b.y - edge_y).abs() { (a, b) } else { (b, a) };
    Some(CutMark {
        edge_point: on_edge,
        into_board: (other - on_edge).try_normalize()?,
        edge_along: DVec2::X,
    })
}

/// A cheek cut's notes: how far it is shortened, then what its mark on
/// the top drawing says, if anything.
fn cheek_notes(
    deduction_in: f64,
    top_mark: Option<(CutMark, Option<String>)>,
    style: LengthStyle,
) -> Vec<String> {
    let shortened = Length::from_inches(deduction_in).format(style);
    std::iter::once(format!("shortened {shortened} from the theoretical end"))
        .chain(top_mark.and_then(|(_, note)| note))
        .collect()
}

/// Where a cheek cut's line is marked on the top view: on the arris it
/// meets, running across the top, with the square's other figure landing
/// on the stock (the face of `square`'s cut nearest `top_line_deg` at the
/// right end, not yet used by another cut). On a piece too short for the
/// square's whole figures, `square` is changed to half or a quarter of
/// each, with words saying so.
fn cheek_top_mark(
    top: &MemberView,
    upper: bool,
    top_line_deg: f64,
    square: &mut SquareSetting,
    left: Option<bool>,
    used: &mut Vec<usize>,
    style: LengthStyle,
) -> Option<(CutMark, Option<String>)> {
    let (low, high) = crate::drawing::bounds(&top.outline)?;
    let middle_x = 0.5 * (low.x + high.x);
    let on_arris = |p: DVec2| (p.y - low.y).abs() < 0.05 || (p.y - high.y).abs() < 0.05;
    let (index, (a, b)) = top
        .faces
        .iter()
        .enumerate()
        .filter(|(index, face)| face.face == CutFace::Cheek && !used.contains(index))
        .filter_map(|(index, face)| Some((index, face_ends(&face.outline)?)))
        .filter(|(_, (a, b))| (0.5 * (a.x + b.x) > middle_x) == upper)
        .min_by(|(_, x), (_, y)| {
            // The side frame's left is +y in the top view.
            let off = |(a, b): &(DVec2, DVec2)| {
                let d = *b - *a;
                let wrong_hand = left.is_some_and(|left| (a.y + b.y > 0.0) != left);
                (d.x.abs().atan2(d.y.abs()).to_degrees() - top_line_deg).abs()
                    + if wrong_hand { 90.0 } else { 0.0 }
            };
            off(x).total_cmp(&off(y))
        })?;
    used.push(index);
    // Of the ends on an arris, and of the square's heel across the board or
    // off the near side (the marked arm's line is the cheek line either
    // way), the one that lands the other figure on the stock rather than
    // past the member's end: a figure is read where its arm crosses wood.
    let candidates: Vec<CutMark> = [(a, b), (b, a)]
        .into_iter()
        .filter(|(edge, _)| on_arris(*edge))
        .map(|(edge, other)| (edge, along_square(other - edge, square)))
        .flat_map(|(edge, line)| [(edge, line), (edge, -line)])
        .filter_map(|(edge, toward_heel)| {
            Some(CutMark { edge_point: edge, into_board: toward_heel.try_normalize()?, edge_along: DVec2::X })
        })
        .collect();
    marks_on_stock(&candidates, square, low.x, high.x, style)
}

/// Of `candidates` (ways to hold `square` for one line), the first that
/// lands both figures on the stock (x within `low_x..high_x`): at the whole
/// figures, else at half or a quarter of each (the same line), changing
/// `square` and returning a note that says so; else the one that lands
/// nearest.
fn marks_on_stock(
    candidates: &[CutMark],
    square: &mut SquareSetting,
    low_x: f64,
    high_x: f64,
    style: LengthStyle,
) -> Option<(CutMark, Option<String>)> {
    let unit_in = figure_unit_in(style);
    let best = |square: &SquareSetting| {
        candidates
            .iter()
            .filter_map(|mark| {
                let hold = crate::drawing::square_hold(mark, square, unit_in)?;
                let past = (low_x - hold.other_point.x).max(hold.other_point.x - high_x).max(0.0);
                Some((past, *mark))
            })
            .min_by(|x, y| x.0.total_cmp(&y.0))
    };
    for (scale, words) in [(1.0, ""), (0.5, "half"), (0.25, "a quarter")] {
        let scaled = SquareSetting {
            figure: square.figure * scale,
            against: square.against * scale,
            mark_along: square.mark_along,
            setup: square.setup.clone(),
        };
        if let Some((past, mark)) = best(&scaled)
            && past < 1e-6
        {
            if scale < 1.0 {
                let mark_figure = match scaled.mark_along {
                    MarkAlong::Figure => scaled.figure,
                    MarkAlong::Against => scaled.against,
                };
                let unit = if style == LengthStyle::Millimetres { " mm" } else { "" };
                let text = |value: f64| format!("{}{unit}", crate::square_figure_text(value, style));
                let note = format!(
                    "square too long for this short piece at {} and {}: hold {words} of each, {} and {}, mark \
                     along the {} arm",
                    text(square.against),
                    text(square.figure),
                    text(scaled.against),
                    text(scaled.figure),
                    text(mark_figure)
                );
                square.figure = scaled.figure;
                square.against = scaled.against;
                return Some((mark, Some(note)));
            }
            return Some((mark, None));
        }
    }
    best(square).map(|(_, mark)| (mark, None))
}

/// A side-face mark held so both of the square's figures meet the edge on
/// the stock: the heel on the board as first drawn, or else off the edge
/// (the marked arm runs on past its figure over the board, where the line
/// is drawn along it; a tail plumb line held the first way puts its other
/// figure past the tail's end), at half or a quarter of the figures on a
/// piece too short for the whole ones (see `marks_on_stock`).
fn side_mark_on_stock(
    mark: CutMark,
    square: &mut SquareSetting,
    side: &MemberView,
    style: LengthStyle,
) -> (CutMark, Option<String>) {
    let Some((low, high)) = crate::drawing::bounds(&side.outline) else { return (mark, None) };
    let flipped = CutMark { into_board: -mark.into_board, ..mark };
    marks_on_stock(&[mark, flipped], square, low.x, high.x, style).unwrap_or((mark, None))
}

/// The direction of the line `square` marks, in the quadrant of `line`
/// (the cut's line seen from above): the marked arm meets the edge at
/// tan = other figure / marked figure, exactly, where the drawn face's
/// corners give it only roughly.
fn along_square(line: DVec2, square: &SquareSetting) -> DVec2 {
    let (mark, other) = match square.mark_along {
        MarkAlong::Figure => (square.figure, square.against),
        MarkAlong::Against => (square.against, square.figure),
    };
    let angle = other.atan2(mark);
    DVec2::new(angle.cos() * line.x.signum(), angle.sin() * line.y.signum())
}

/// Which side of the member (looking up it) each of a double-cheek tail's
/// two faces lies on, from the tail lines seen from above: the pairing of
/// faces to sides whose lines' angles from square best match the faces'
/// top-edge angles (the top view's +y side is the left). Faces cut alike
/// (a regular hip's) pair either way. `None` when the top view does not
/// show a tail line on each side.
fn tail_face_hands(top: &MemberView, faces: &[FaceAngles]) -> Option<[Hand; 2]> {
    let lines: Vec<(f64, bool)> = top
        .faces
        .iter()
        .filter(|view_face| view_face.face == CutFace::TailPlumb)
        .filter_map(|view_face| {
            let (a, b) = face_ends(&view_face.outline)?;
            let d = b - a;
            Some((d.x.abs().atan2(d.y.abs()).to_degrees(), a.y + b.y > 0.0))
        })
        .collect();
    let [first, second] = faces else { return None };
    let cost = |face: &FaceAngles, left: bool| {
        lines
            .iter()
            .filter(|(_, on_left)| *on_left == left)
            .map(|(angle, _)| (angle - face.top_edge_angle_deg).abs())
            .fold(f64::INFINITY, f64::min)
    };
    let first_left = cost(first, true) + cost(second, false);
    let first_right = cost(first, false) + cost(second, true);
    if !first_left.is_finite() && !first_right.is_finite() {
        return None;
    }
    Some(if first_left <= first_right { [Hand::Left, Hand::Right] } else { [Hand::Right, Hand::Left] })
}

fn cut_angles(face: &FaceAngles) -> CutAngles {
    CutAngles {
        side_line_deg: face.side_angle_deg,
        top_line_deg: face.top_edge_angle_deg,
        circular_on_face_bevel_deg: face.face_bevel_deg,
        circular_on_edge_bevel_deg: face.edge_bevel_deg,
        miter_flat_deg: [face.miter_flat.miter_deg, face.miter_flat.bevel_deg],
        miter_on_edge_deg: [face.miter_on_edge.miter_deg, face.miter_on_edge.bevel_deg],
    }
}

/// The square held on a member's side face for a plumb line (marked along
/// the figure's arm) or a level line (`mark_along` the other arm).
fn side_square(
    square: [f64; 2],
    mark_along: MarkAlong,
    member: &Member,
    style: LengthStyle,
) -> SquareSetting {
    let use_ = if matches!(member.kind, MemberKind::Hip | MemberKind::Valley) {
        SquareUse::HipPlumb
    } else {
        SquareUse::Plain
    };
    let words = kind_words(member.kind);
    square_setting(square, mark_along, use_, style, |against, figure, mark| {
        format!(
            "on the {words}'s side hold {against} and {figure} on the same edge; mark along the {mark} arm"
        )
    })
}

fn angle_settings(face: &FaceAngles) -> Vec<AngleSetting> {
    let deg = degrees_text;
    let mut out = vec![AngleSetting {
        degrees: face.side_angle_deg,
        setup: format!("line on the side face {} from square to the edge", deg(face.side_angle_deg)),
    }];
    if face.top_edge_angle_deg > 1e-6 {
        out.push(AngleSetting {
            degrees: face.top_edge_angle_deg,
            setup: format!(
                "line across the top edge {} from square (a line angle, not a saw bevel)",
                deg(face.top_edge_angle_deg)
            ),
        });
    }
    out.extend([
        AngleSetting {
            degrees: face.face_bevel_deg,
            setup: format!(
                "circular saw on the side face along that line: bevel {}",
                deg(face.face_bevel_deg)
            ),
        },
        AngleSetting {
            degrees: face.edge_bevel_deg,
            setup: format!("circular saw riding the top edge: bevel {}", deg(face.edge_bevel_deg)),
        },
        AngleSetting {
            degrees: face.miter_flat.miter_deg,
            setup: format!(
                "miter saw, board flat: miter {}, bevel {}",
                deg(face.miter_flat.miter_deg),
                deg(face.miter_flat.bevel_deg)
            ),
        },
        AngleSetting {
            degrees: face.miter_on_edge.miter_deg,
            setup: format!(
                "miter saw, board on edge: miter {}, bevel {}",
                deg(face.miter_on_edge.miter_deg),
                deg(face.miter_on_edge.bevel_deg)
            ),
        },
    ]);
    out
}

fn card_cuts(
    member: &Member,
    side: &MemberView,
    top: Option<&MemberView>,
    style: LengthStyle,
) -> Vec<CardCut> {
    let depth_in = member.size.depth_in;
    let mut used = Vec::new();
    let length = |inches: f64| Length::from_inches(inches).format(style);
    let mut cuts = Vec::new();
    for cut in &member.cuts {
        let place = end_words(cut.end()).to_string();
        match cut {
            Cut::Plumb { end, square, face, deduction_in, .. } => {
                let kind = match end {
                    CutEnd::Tail => CutFace::TailPlumb,
                    CutEnd::Bottom => CutFace::BottomPlumb,
                    _ => CutFace::TopPlumb,
                };
                cuts.push(CardCut {
                    face: kind,
                    place,
                    square: Some(side_square(*square, MarkAlong::Figure, member, style)),
                    settings: angle_settings(face),
                    angles: Some(cut_angles(face)),
                    mark: edge_mark(side, kind, depth_in),
                    top_mark: None,
                    notes: vec![format!(
                        "shortened {} from the theoretical end, along the top edge",
                        length(*deduction_in)
                    )],
                });
            }
            Cut::Cheek { end, square, face, long_point, deduction_in, .. } => {
                let square = square_setting(
                    *square,
                    MarkAlong::Against,
                    SquareUse::Plain,
                    style,
                    |against, figure, mark| {
                        format!(
                            "on the top edge hold {against} and {figure} on the same edge; mark along the {mark} \
                             arm for the cheek line"
                        )
                    },
                );
                let mut square = square;
                let top_mark = top.and_then(|top| {
                    cheek_top_mark(
                        top,
                        *end != CutEnd::Tail && *end != CutEnd::Bottom,
                        face.top_edge_angle_deg,
                        &mut square,
                        None,
                        &mut used,
                        style,
                    )
                });
                cuts.push(CardCut {
                    face: CutFace::Cheek,
                    place: format!(
                        "{place}, long point on the {}",
                        if *long_point == Hand::Left { "left" } else { "right" }
                    ),
                    square: Some(square),
                    settings: angle_settings(face),
                    angles: Some(cut_angles(face)),
                    mark: None,
                    top_mark: top_mark.as_ref().map(|(mark, _)| *mark),
                    notes: cheek_notes(*deduction_in, top_mark, style),
                });
            }
            Cut::SteppedCheek {
                end,
                square,
                face,
                step,
                long_point,
                step_in,
                step_from,
                step_from_side_in,
                deduction_in,
                ..
            } => {
                let square = square_setting(
                    *square,
                    MarkAlong::Against,
                    SquareUse::Plain,
                    style,
                    |against, figure, mark| {
                        format!(
                            "on the top edge hold {against} and {figure} on the same edge; mark along the {mark} \
                             arm for the cheek line"
                        )
                    },
                );
                let mut square = square;
                let top_mark = top.and_then(|top| {
                    cheek_top_mark(
                        top,
                        *end != CutEnd::Tail && *end != CutEnd::Bottom,
                        face.top_edge_angle_deg,
                        &mut square,
                        None,
                        &mut used,
                        style,
                    )
                });
                let mut notes = cheek_notes(*deduction_in, top_mark.clone(), style);
                let way = if *step_in >= 0.0 { "deeper" } else { "back" };
                notes.push(format!(
                    "stepped {} from the {} side along the cheek line: past the step the cheek is cut {} {way}, \
                     square to it",
                    length(*step_from_side_in),
                    if *step_from == Hand::Left { "left" } else { "right" },
                    length(step_in.abs())
                ));
                cuts.push(CardCut {
                    face: CutFace::Cheek,
                    place: format!(
                        "{place}, stepped cheek, long point on the {}",
                        if *long_point == Hand::Left { "left" } else { "right" }
                    ),
                    square: Some(square),
                    settings: angle_settings(face),
                    angles: Some(cut_angles(face)),
                    mark: None,
                    top_mark: top_mark.as_ref().map(|(mark, _)| *mark),
                    notes,
                });
                cuts.push(CardCut {
                    face: CutFace::Cheek,
                    place: format!("{place}, the step of the stepped cheek"),
                    square: None,
                    settings: angle_settings(step),
                    angles: Some(cut_angles(step)),
                    mark: None,
                    top_mark: None,
                    notes: vec![format!("{} deep, square to the cheek", length(step_in.abs()))],
                });
            }
            Cut::DoubleCheek { end, left, right, deduction_in, .. } => {
                for (hand, face) in [("left", left), ("right", right)] {
                    let square = face.top_edge_square.map(|square| {
                        square_setting(square, MarkAlong::Against, SquareUse::Plain, style, |against, figure, mark| {
                            format!(
                                "on the top edge hold {against} and {figure} on the same edge; mark along the \
                                 {mark} arm for the cheek line"
                            )
                        })
                    });
                    let mut square = square;
                    let top_mark = top.zip(square.as_mut()).and_then(|(top, square)| {
                        cheek_top_mark(
                            top,
                            *end != CutEnd::Tail && *end != CutEnd::Bottom,
                            face.top_edge_angle_deg,
                            square,
                            Some(hand == "left"),
                            &mut used,
                            style,
                        )
                    });
                    cuts.push(CardCut {
                        face: CutFace::Cheek,
                        place: format!("{place}, {hand} cheek of a double cheek"),
                        square,
                        settings: angle_settings(face),
                        angles: Some(cut_angles(face)),
                        mark: None,
                        top_mark: top_mark.as_ref().map(|(mark, _)| *mark),
                        notes: cheek_notes(*deduction_in, top_mark, style),
                    });
                }
            }
            Cut::Seat { square, seat_width_in, heel_height_in, notch_depth_in, drop_in, .. } => {
                cuts.push(CardCut {
                    face: CutFace::Heel,
                    place: "birdsmouth, plumb on the wall line".into(),
                    square: Some(side_square(*square, MarkAlong::Figure, member, style)),
                    settings: vec![],
                    angles: None,
                    mark: edge_mark(side, CutFace::Heel, 0.0),
                    top_mark: None,
                    notes: vec![format!("height above plate {}", length(*heel_height_in))],
                });
                let mut notes = vec![
                    format!("seat {} wide, level", length(*seat_width_in)),
                    format!("notch depth {} square to the bottom edge", length(*notch_depth_in)),
                ];
                if *drop_in > 0.0 {
                    notes.push(format!("dropped {} on its seat", length(*drop_in)));
                }
                cuts.push(CardCut {
                    face: CutFace::Seat,
                    place: "birdsmouth, level on the plate".into(),
                    square: Some(side_square(*square, MarkAlong::Against, member, style)),
                    settings: vec![],
                    angles: None,
                    mark: edge_mark(side, CutFace::Seat, 0.0),
                    top_mark: None,
                    notes,
                });
            }
            Cut::Tail { style: tail_style, square, faces, .. } => {
                let place = match tail_style {
                    TailCut::Square => "tail, square to the edge".to_string(),
                    _ => "tail, plumb on the fascia line".to_string(),
                };
                if faces.len() < 2 {
                    cuts.push(CardCut {
                        face: CutFace::TailPlumb,
                        place,
                        square: Some(side_square(*square, MarkAlong::Figure, member, style)),
                        settings: faces.first().map(angle_settings).unwrap_or_default(),
                        angles: faces.first().map(cut_angles),
                        mark: edge_mark(side, CutFace::TailPlumb, depth_in),
                        top_mark: None,
                        notes: vec![],
                    });
                } else {
                    // A hip's tail: a double cheek, one face parallel to each
                    // fascia, each with its own saw settings. The first
                    // face's card carries the square's close-up.
                    let hands = top.and_then(|top| tail_face_hands(top, faces));
                    for (index, face) in faces.iter().enumerate() {
                        let which = match hands.as_ref().and_then(|hands| hands.get(index)) {
                            Some(Hand::Left) => "left face".to_string(),
                            Some(Hand::Right) => "right face".to_string(),
                            None => format!("face {} of {}", index + 1, faces.len()),
                        };
                        cuts.push(CardCut {
                            face: CutFace::TailPlumb,
                            place: format!("{place}, {which} of a double cheek"),
                            square: Some(side_square(face.plumb_square, MarkAlong::Figure, member, style)),
                            settings: angle_settings(face),
                            angles: Some(cut_angles(face)),
                            mark: if index == 0 {
                                edge_mark(side, CutFace::TailPlumb, depth_in)
                            } else {
                                None
                            },
                            top_mark: None,
                            notes: vec![],
                        });
                    }
                }
            }
            Cut::Soffit { square, length_in, .. } => cuts.push(CardCut {
                face: CutFace::TailLevel,
                place: "tail, level soffit cut".into(),
                square: Some(side_square(*square, MarkAlong::Against, member, style)),
                settings: vec![],
                angles: None,
                mark: edge_mark(side, CutFace::TailLevel, 0.0),
                top_mark: None,
                notes: vec![format!("{} long on the side face", length(*length_in))],
            }),
            Cut::PlateLevel { square, length_in, depth_off_in, .. } => cuts.push(CardCut {
                face: CutFace::Seat,
                place: "lower edge, level on the top of plate".into(),
                square: Some(side_square(*square, MarkAlong::Against, member, style)),
                settings: vec![],
                angles: None,
                mark: edge_mark(side, CutFace::Seat, 0.0),
                top_mark: None,
                notes: vec![
                    format!("{} long on the side face", length(*length_in)),
                    format!("takes up to {} off the depth, plumb", length(*depth_off_in)),
                ],
            }),
            Cut::Backing { left_deg, right_deg, .. } => cuts.push(CardCut {
                face: CutFace::Backing,
                place: "full length, top edge".into(),
                square: None,
                settings: vec![
                    AngleSetting {
                        degrees: *left_deg,
                        setup: format!(
                            "left side of the top: bevel {} from level across the top",
                            degrees_text(*left_deg)
                        ),
                    },
                    AngleSetting {
                        degrees: *right_deg,
                        setup: format!(
                            "right side of the top: bevel {} from level across the top",
                            degrees_text(*right_deg)
                        ),
                    },
                ],
                angles: None,
                mark: None,
                top_mark: None,
                notes: vec![],
            }),
            Cut::SquareEnd { .. } => cuts.push(CardCut {
                face: CutFace::SquareEnd,
                place,
                square: None,
                settings: vec![],
                angles: None,
                mark: None,
                top_mark: None,
                notes: vec!["square across".into()],
            }),
        }
    }
    for cut in &mut cuts {
        if let (Some(mark), Some(square)) = (cut.mark, cut.square.as_mut()) {
            let (mark, note) = side_mark_on_stock(mark, square, side, style);
            cut.mark = Some(mark);
            cut.notes.extend(note);
        }
    }
    cuts
}

/// One member's card, its views read off its first placed piece.
pub fn member_card(member: &Member, pieces: &[PlacedPiece], style: LengthStyle) -> MemberCard {
    let mine: Vec<&PlacedPiece> = pieces.iter().filter(|piece| piece.label == member.label).collect();
    let has_cheek = member
        .cuts
        .iter()
        .any(|cut| matches!(cut, Cut::Cheek { .. } | Cut::SteppedCheek { .. } | Cut::DoubleCheek { .. }));
    // A piece whose placement is not finite cannot be drawn; the views come
    // from the first one that can.
    let (side_view, top_view) = mine
        .iter()
        .find(|piece| {
            piece.axis.iter().all(|p| p.is_finite()) && piece.solid.vertices().all(|p| p.is_finite())
        })
        .map(|piece| views(piece, member.size.depth_in, has_cheek))
        .unwrap_or_default();
    let has_seat = member.cuts.iter().any(|cut| matches!(cut, Cut::Seat { .. }));
    let sloped = member.kind != MemberKind::Ridge;
    MemberCard {
        label: member.label.clone(),
        kind: kind_words(member.kind).to_string(),
        count: u32::try_from(member.count).unwrap_or(u32::MAX),
        size: size_words(member.size.thickness_in, member.size.depth_in, style),
        thickness_in: member.size.thickness_in,
        depth_in: member.size.depth_in,
        pitch_rad: member.rise_per_run.atan(),
        lengths: MemberLengths {
            long_point_in: (sloped && has_cheek).then_some(member.long_point_length),
            short_point_in: (sloped && has_cheek).then_some(member.short_point_length),
            seat_to_top_cut_in: (sloped && has_seat).then_some(member.seat_to_top_cut),
            tail_in: (member.tail_length > 0.0).then_some(member.tail_length),
            overall_in: member.overall_length,
        },
        cuts: card_cuts(member, &side_view, top_view.as_ref(), style),
        warnings: member.warnings.iter().map(|warning| warning_words(warning, style)).collect(),
        side_view,
        top_view,
        places: mine.iter().map(|piece| piece.plan_line).collect(),
    }
}

/// The lumber order's pieces: one per member, at its overall length.
pub fn order_pieces(frame: &Frame, style: LengthStyle) -> Vec<OrderPiece> {
    frame
        .members
        .iter()
        .map(|member| OrderPiece {
            label: member.label.clone(),
            size: size_words(member.size.thickness_in, member.size.depth_in, style),
            length_in: member.overall_length,
            count: u32::try_from(member.count).unwrap_or(u32::MAX),
        })
        .collect()
}

/// The wall-line rings of an outline, outer first.
pub fn outline_rings(outline: &Outline) -> Vec<Vec<DVec2>> {
    std::iter::once(outline.outer())
        .chain(outline.courtyards().iter().map(Vec::as_slice))
        .map(|ring| ring.iter().map(|wall| wall.corner).collect())
        .collect()
}

/// Everything the cut cards need, from a framed plan.
pub fn card_deck(
    title: &str,
    plan: &Plan,
    outline: &Outline,
    roof: &Roof,
    frame: &Frame,
    lumber: Option<LumberOrder>,
) -> CardDeck {
    let style = length_style(plan);
    CardDeck {
        title: title.to_string(),
        length_style: style,
        outline: outline_rings(outline),
        roof: roof.clone(),
        members: frame.members.iter().map(|member| member_card(member, &frame.pieces, style)).collect(),
        warnings: frame
            .warnings
            .iter()
            .map(|warning| format!("{}: {}", warning.label(), warning_words(warning, style)))
            .collect(),
        lumber,
    }
}

/// The 3D model's pieces (and optionally the roof surfaces and walls).
pub fn model_scene(
    outline: &Outline,
    roof: &Roof,
    frame: &Frame,
    roof_surfaces: bool,
    walls: bool,
) -> ModelScene {
    ModelScene {
        pieces: frame
            .pieces
            .iter()
            .map(|piece| ModelPiece {
                label: piece.label.clone(),
                kind: kind_words(piece.kind).to_string(),
                axis: piece.axis,
                faces: piece
                    .solid
                    .faces()
                    .filter(|face| face.tag != FaceTag::Interior)
                    .map(|face| ModelFace {
                        vertices: face.vertices.clone(),
                        cut: face_kind(face.tag, face.end),
                    })
                    .collect(),
            })
            .collect(),
        roof_surfaces: if roof_surfaces {
            roof.planes.iter().map(|plane| plane.eave_outline.clone()).collect()
        } else {
            vec![]
        },
        walls: if walls { outline_rings(outline) } else { vec![] },
    }
}
