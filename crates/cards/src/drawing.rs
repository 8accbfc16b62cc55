//! Drawing pieces shared by the cut cards: a view fitted into a box, a
//! member's outline with its cut faces, the framing square where it is
//! held, dimensions and the small roof plan.

use glam::DVec2;
use pitchframe_geometry::{Length, LengthStyle, MarkAlong, RoofLineKind, SquareSetting};

use crate::pdf_page::{BLACK, Forms, GREY, Page, RED, text_width};
use crate::{CardDeck, CutMark, MemberCard, MemberView};

/// A box on the page, points.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Area {
    /// Lower left corner.
    pub corner: DVec2,
    /// Width and height.
    pub size: DVec2,
}

impl Area {
    /// A box from its lower left corner and size.
    pub fn new(x: f64, y: f64, width: f64, height: f64) -> Self {
        Self { corner: DVec2::new(x, y), size: DVec2::new(width, height) }
    }

    /// The top edge's height.
    pub fn top(&self) -> f64 {
        self.corner.y + self.size.y
    }

    /// The same box shrunk by `by` points on every side.
    pub fn inset(&self, by: f64) -> Self {
        Self {
            corner: self.corner + DVec2::splat(by),
            size: (self.size - DVec2::splat(2.0 * by)).max(DVec2::ZERO),
        }
    }
}

/// A uniform scale and shift from drawing units to page points.
#[derive(Debug, Clone, Copy, PartialEq)]
pub(crate) struct Fit {
    /// Points per drawing unit.
    pub scale: f64,
    /// Page point of the drawing origin.
    pub origin: DVec2,
}

impl Fit {
    /// The largest fit of the bounding box `low..high` centred in `area`.
    pub fn into_area(low: DVec2, high: DVec2, area: Area) -> Self {
        let extent = (high - low).max(DVec2::splat(1e-9));
        let scale = (area.size.x / extent.x).min(area.size.y / extent.y).max(0.0);
        let used = extent * scale;
        let corner = area.corner + 0.5 * (area.size - used);
        Self { scale, origin: corner - low * scale }
    }

    /// A drawing point on the page.
    pub fn at(&self, point: DVec2) -> DVec2 {
        self.origin + point * self.scale
    }

    /// Many drawing points on the page.
    pub fn all(&self, points: &[DVec2]) -> Vec<DVec2> {
        points.iter().map(|point| self.at(*point)).collect()
    }
}

/// The bounding box of some points, or `None` when there are none.
pub(crate) fn bounds<'a>(points: impl IntoIterator<Item = &'a DVec2>) -> Option<(DVec2, DVec2)> {
    let mut iter = points.into_iter();
    let first = *iter.next()?;
    Some(iter.fold((first, first), |(low, high), point| (low.min(*point), high.max(*point))))
}

/// Twice the signed area of a polygon (positive counter-clockwise).
fn twice_area(points: &[DVec2]) -> f64 {
    points.iter().zip(points.iter().cycle().skip(1)).map(|(a, b)| a.perp_dot(*b)).sum()
}

/// Writes a length for people in the deck's style.
pub(crate) fn length_text(length_in: f64, style: LengthStyle) -> String {
    Length::from_inches(length_in).format(style)
}

/// A tag in a small white box, so a face's kind reads without colour.
pub(crate) fn tag(page: &mut Page, at: DVec2, size: f64, text: &str) {
    let width = text_width(text, size, true) + size * 0.5;
    let corner = at - DVec2::new(width / 2.0, size * 0.45);
    page.line_width(0.4);
    page.stroke_colour(BLACK);
    page.rect(corner, DVec2::new(width, size * 1.15), Some([1.0, 1.0, 1.0]), true);
    page.fill_colour(BLACK);
    page.text_centred(at - DVec2::new(0.0, size * 0.3), size, true, text);
}

/// Draws a member view fitted by `fit`: outline, then each cut face filled
/// in its colour, hatched and tagged (edge-on faces as a thick coloured
/// line with its tag); no tags when `tag_size` is zero.
pub(crate) fn member_view(page: &mut Page, view: &MemberView, fit: Fit, tag_size: f64) {
    member_view_avoiding(page, view, fit, tag_size, Vec::new());
}

/// As [`member_view`], with tags kept off the boxes in `blocked` (page
/// points, low and high corners) where another place near their face is
/// clear: the room kept for dimensions.
pub(crate) fn member_view_avoiding(
    page: &mut Page,
    view: &MemberView,
    fit: Fit,
    tag_size: f64,
    blocked: Vec<(DVec2, DVec2)>,
) {
    let wood = [0.97, 0.94, 0.86];
    if view.parts.is_empty() {
        page.line_width(0.9);
        page.stroke_colour(BLACK);
        page.polygon(&fit.all(&view.outline), Some(wood), true);
    } else {
        // Fill every part, then draw only the edges no two parts share,
        // so the joins between parts do not read as cuts.
        let parts: Vec<Vec<DVec2>> = view.parts.iter().map(|part| fit.all(part)).collect();
        for part in &parts {
            page.polygon(part, Some(wood), false);
        }
        page.line_width(0.9);
        page.stroke_colour(BLACK);
        let edges: Vec<(DVec2, DVec2)> = parts
            .iter()
            .flat_map(|part| part.iter().zip(part.iter().cycle().skip(1)).map(|(a, b)| (*a, *b)))
            .collect();
        // An edge is inside the solid when another part lies along it on
        // the other side; parts lying on the same side (the two halves of
        // a backed hip seen from the side) leave it an outline edge.
        let centroids: Vec<DVec2> =
            parts.iter().map(|part| part.iter().copied().sum::<DVec2>() / part.len().max(1) as f64).collect();
        let owner: Vec<usize> = parts
            .iter()
            .enumerate()
            .flat_map(|(index, part)| std::iter::repeat_n(index, part.len()))
            .collect();
        for (index, &(a, b)) in edges.iter().enumerate() {
            let Some(direction) = (b - a).try_normalize() else { continue };
            let (Some(&mine), middle) = (owner.get(index), 0.5 * (a + b)) else { continue };
            let side_of = |point: DVec2| direction.perp_dot(point - a);
            let my_side = centroids.get(mine).map_or(0.0, |c| side_of(*c));
            let inside = edges.iter().zip(&owner).any(|(&(c, d), &theirs)| {
                if theirs == mine {
                    return false;
                }
                let Some(along) = (d - c).try_normalize() else { return false };
                let t = (middle - c).dot(along).clamp(0.0, c.distance(d));
                let on_it = (c + along * t).distance(middle) < 0.3 && along.perp_dot(direction).abs() < 0.03;
                on_it && centroids.get(theirs).is_some_and(|centre| side_of(*centre) * my_side < 0.0)
            });
            if !inside {
                page.line(a, b);
            }
        }
    }
    let mut tags = blocked;
    let mut anchors = Vec::new();
    let view_middle_y = bounds(&view.outline).map_or(0.0, |(low, high)| fit.at(0.5 * (low + high)).y);
    for face in &view.faces {
        let points = fit.all(&face.outline);
        let colour = face.face.colour();
        let Some((low, high)) = bounds(&points) else { continue };
        let centre = 0.5 * (low + high);
        let area_pt2 = 0.5 * twice_area(&points).abs();
        if points.len() >= 3 && area_pt2 > 4.0 {
            // A light tint and thin lines in the face's own darker shade:
            // faces tell apart by the hatching's angle in black and white
            // without a large face (a hip's backing) printing near black.
            page.polygon(&points, Some(tint(colour, FACE_TINT)), false);
            page.line_width(0.25);
            page.stroke_colour(shade(colour, 0.55));
            let spacing = if area_pt2 > LARGE_FACE_PT2 { 4.5 } else { 2.5 };
            let dashed = lower_backing(face, &points, view_middle_y);
            if dashed {
                page.dash(&[1.5, 1.5]);
            }
            page.hatch(&points, face.face.hatch_deg(), spacing);
            if dashed {
                page.dash(&[]);
            }
            page.line_width(0.5);
            page.stroke_colour(BLACK);
            page.polygon(&points, None, true);
        } else {
            page.line_width(2.6);
            page.stroke_colour(colour);
            page.polyline(&points);
            page.line_width(0.5);
            page.stroke_colour(BLACK);
            page.dash(&[1.5, 1.0]);
            page.polyline(&points);
            page.dash(&[]);
        }
        // One tag for the faces of one cut seen together (a solid's parts
        // each carry their piece of the face).
        let seen = anchors.iter().any(|(kind, anchor): &(crate::CutFace, DVec2)| {
            *kind == face.face && anchor.distance(centre) < 3.0 * tag_size
        });
        if tag_size > 0.0 && !seen {
            anchors.push((face.face, centre));
            place_tag(page, &mut tags, centre, tag_size, face.face.tag());
        }
    }
}

/// How much of a face's colour is mixed into white for its fill.
const FACE_TINT: f32 = 0.45;
/// A face larger than this (square points) is hatched more openly.
const LARGE_FACE_PT2: f64 = 400.0;

/// `colour` mixed into white: `amount` 1 is the colour, 0 white.
fn tint(colour: [f32; 3], amount: f32) -> [f32; 3] {
    colour.map(|part| 1.0 - amount * (1.0 - part))
}

/// `colour` darkened: `amount` 1 is the colour, 0 black.
fn shade(colour: [f32; 3], amount: f32) -> [f32; 3] {
    colour.map(|part| part * amount)
}

/// Whether a face is the lower-in-view of a hip's two backed sides; its
/// hatching is dashed so the two sides read as two faces.
fn lower_backing(face: &crate::ViewFace, points: &[DVec2], middle_y_pt: f64) -> bool {
    let centre_y = points.iter().map(|p| p.y).sum::<f64>() / points.len().max(1) as f64;
    face.face == crate::CutFace::Backing && centre_y < middle_y_pt
}

/// A tag at `at`, or nudged clear of the tags already placed (with a
/// leader back to its face) where faces sit close, as on short spans.
fn place_tag(page: &mut Page, placed: &mut Vec<(DVec2, DVec2)>, at: DVec2, size: f64, text: &str) {
    let half = DVec2::new((text_width(text, size, true) + size * 0.5) / 2.0 + 1.0, size * 0.65);
    let clear = |centre: DVec2, placed: &[(DVec2, DVec2)]| {
        placed.iter().all(|(low, high)| {
            centre.x + half.x <= low.x
                || centre.x - half.x >= high.x
                || centre.y + half.y <= low.y
                || centre.y - half.y >= high.y
        })
    };
    let step = DVec2::new(2.0 * half.x + 1.0, 2.0 * half.y + 1.0);
    // Places on a grid around the face, nearest first.
    let mut offsets: Vec<DVec2> = (-4..=4_i32)
        .flat_map(|i| (-3..=3_i32).map(move |j| DVec2::new(f64::from(i) * step.x, f64::from(j) * step.y)))
        .collect();
    offsets.sort_by(|a, b| a.length_squared().total_cmp(&b.length_squared()));
    // With no clear place the tag is left off: the face's colour and
    // hatching still name it, and a tag over a tag reads as neither.
    let Some(chosen) = offsets.into_iter().map(|offset| at + offset).find(|centre| clear(*centre, placed))
    else {
        return;
    };
    if chosen.distance(at) > 0.5 {
        page.line_width(0.4);
        page.stroke_colour(BLACK);
        page.line(at, chosen);
    }
    placed.push((chosen - half, chosen + half));
    tag(page, chosen, size, text);
}

/// A dimension line between two page points, offset square to them by
/// `offset` points, with its text.
pub(crate) fn dimension(page: &mut Page, from: DVec2, to: DVec2, offset: f64, text: &str, size: f64) {
    let along = (to - from).normalize_or_zero();
    let normal = along.perp();
    let (a, b) = (from + normal * offset, to + normal * offset);
    page.line_width(0.4);
    page.stroke_colour(BLACK);
    page.line(from + normal * offset.signum() * 1.5, a + normal * offset.signum() * 2.5);
    page.line(to + normal * offset.signum() * 1.5, b + normal * offset.signum() * 2.5);
    page.line(a, b);
    for (end, direction) in [(a, along), (b, -along)] {
        let tick = (direction + normal).normalize_or_zero() * 2.5;
        page.line(end - tick, end + tick);
    }
    let middle = 0.5 * (a + b);
    let angle = along.y.atan2(along.x);
    let width = text_width(text, size, false);
    let start = middle - along * (width / 2.0) + normal * offset.signum() * 1.5 + normal * (size * 0.2);
    page.fill_colour(BLACK);
    page.text_rotated(start, size, false, text, angle);
}

/// The framing square as it is held for one cut: its heel, and the unit
/// directions of the arm marked along and of the other arm.
pub(crate) struct SquareHold {
    /// The square's heel (outside corner).
    pub heel: DVec2,
    /// Where the marked arm's figure meets the edge.
    pub mark_point: DVec2,
    /// Where the other arm's figure meets the edge.
    pub other_point: DVec2,
    /// Unit direction of the marked arm, heel to edge.
    pub mark_arm: DVec2,
    /// Unit direction of the other arm, heel to edge.
    pub other_arm: DVec2,
    /// The figure on the marked arm.
    pub mark_figure: f64,
    /// The figure on the other arm.
    pub other_figure: f64,
}

/// Where the square sits for a cut marked at `mark` with `square`, in view
/// coordinates: the marked arm runs along the cut line from the edge to the
/// heel, the other arm square to it back to the same edge. `unit_in` is the
/// inches per unit of the square's figures (see `figure_unit_in`).
pub(crate) fn square_hold(mark: &CutMark, square: &SquareSetting, unit_in: f64) -> Option<SquareHold> {
    let (mark_figure, other_figure) = match square.mark_along {
        MarkAlong::Figure => (square.figure, square.against),
        MarkAlong::Against => (square.against, square.figure),
    };
    if !(mark_figure.is_finite() && other_figure.is_finite()) {
        return None;
    }
    let into = mark.into_board.try_normalize()?;
    let (mark_in, other_in) = (mark_figure * unit_in, other_figure * unit_in);
    let heel = mark.edge_point + into * mark_in;
    let mark_arm = -into;
    // Of the two arms square to the marked one, the one whose figure lands
    // back on the edge the square is held on.
    let edge = mark.edge_along.try_normalize()?;
    let off_edge = |arm: DVec2| (heel + arm * other_in - mark.edge_point).perp_dot(edge).abs();
    let other_arm = [mark_arm.perp(), -mark_arm.perp()]
        .into_iter()
        .min_by(|a, b| off_edge(*a).total_cmp(&off_edge(*b)))?;
    let other_point = heel + other_arm * other_in;
    Some(SquareHold {
        heel,
        mark_point: mark.edge_point,
        other_point,
        mark_arm,
        other_arm,
        mark_figure,
        other_figure,
    })
}

/// Draws the square held for a cut (in view coordinates mapped by `fit`)
/// with its two figures written where they meet the edge.
/// With `see_through` the square is drawn in outline only, so the board it
/// lies on shows through.
pub(crate) fn framing_square(page: &mut Page, hold: &SquareHold, fit: Fit, see_through: bool) {
    // A steel square: body 24 x 2 in, tongue 16 x 1-1/2 in; the body carries
    // the larger figure.
    let (mark_len, mark_width, other_len, other_width) =
        if hold.mark_figure >= hold.other_figure { (24.0, 2.0, 16.0, 1.5) } else { (16.0, 1.5, 24.0, 2.0) };
    let (h, a1, a2) = (hold.heel, hold.mark_arm, hold.other_arm);
    let shape = [
        h - a1 * other_width - a2 * mark_width,
        h + a1 * mark_len - a2 * mark_width,
        h + a1 * mark_len,
        h,
        h + a2 * other_len,
        h + a2 * other_len - a1 * other_width,
    ];
    page.line_width(0.5);
    page.stroke_colour(GREY);
    let fill = if see_through { None } else { Some([0.82, 0.84, 0.88]) };
    page.polygon(&fit.all(&shape), fill, true);
    page.stroke_colour(RED);
    page.line_width(1.2);
    page.line(fit.at(hold.mark_point), fit.at(h));
    for point in [hold.mark_point, hold.other_point] {
        page.polygon(&circle(fit.at(point), 1.8), Some(RED), false);
    }
}

/// The two figures of a held square, written beside the points where they
/// meet the edge, off the board (`off_board`, a unit page direction square
/// to the edge) and apart from each other, each kept
/// inside `window` (page points): where a figure's point lies outside, at
/// the place its arm leaves the window.
pub(crate) fn square_figures(
    page: &mut Page,
    hold: &SquareHold,
    fit: Fit,
    text_size: f64,
    style: LengthStyle,
    window: Area,
    off_board: DVec2,
) {
    let heel = fit.at(hold.heel);
    let (low, high) = (window.corner, window.corner + window.size);
    let figures = [
        (hold.mark_point, hold.mark_figure, hold.other_point),
        (hold.other_point, hold.other_figure, hold.mark_point),
    ];
    for (point, figure, other) in figures {
        let end = fit.at(point);
        let inside = |p: DVec2| p.cmpge(low).all() && p.cmple(high).all();
        // Beyond the box: where the arm leaves it, or else where the edge
        // the figures sit on leaves it on the way to the figure's point.
        let mark = fit.at(hold.mark_point);
        let at = if inside(end) {
            end
        } else {
            match last_inside(heel, end, low, high).or_else(|| last_inside(mark, end, low, high)) {
                Some(at) => at,
                None => continue,
            }
        };
        // Off the board, beside the edge, and away from the other figure.
        let apart = (end - fit.at(other)).try_normalize().unwrap_or(DVec2::ZERO);
        let away = (off_board + apart * 0.6).try_normalize().unwrap_or(DVec2::Y);
        let words = crate::square_figure_text(figure, style);
        let width = text_width(&words, text_size, true);
        let half = DVec2::new(width / 2.0 + 1.0, text_size * 0.55);
        let centre = at + away * (text_size * 0.9 + 0.25 * width);
        let centre = centre.clamp(low + half, (high - half).max(low + half));
        page.rect(
            centre - half + DVec2::new(0.0, 0.05 * text_size),
            half * 2.0 - DVec2::new(0.0, 0.1 * text_size),
            Some([1.0, 1.0, 1.0]),
            false,
        );
        page.fill_colour(BLACK);
        page.text_centred(centre - DVec2::new(0.0, text_size * 0.35), text_size, true, &words);
    }
}

/// The point of the segment `from`..`to` nearest `to` that lies inside the
/// box `low`..`high`, or `None` when the segment misses the box.
fn last_inside(from: DVec2, to: DVec2, low: DVec2, high: DVec2) -> Option<DVec2> {
    // Clip the segment's parameter range to each slab of the box.
    let d = to - from;
    let (mut t0, mut t1) = (0.0_f64, 1.0_f64);
    for axis in 0..2 {
        let (start, delta, lo, hi) = (from[axis], d[axis], low[axis], high[axis]);
        if delta.abs() < 1e-12 {
            if start < lo || start > hi {
                return None;
            }
            continue;
        }
        let (a, b) = ((lo - start) / delta, (hi - start) / delta);
        t0 = t0.max(a.min(b));
        t1 = t1.min(a.max(b));
    }
    (t0 <= t1).then(|| from + d * t1)
}

fn circle(centre: DVec2, radius: f64) -> Vec<DVec2> {
    (0..12)
        .map(|step| centre + DVec2::from_angle(f64::from(step) * std::f64::consts::TAU / 12.0) * radius)
        .collect()
}

/// The small roof plan: walls, ridges, hips and valleys, every piece faint,
/// and the highlighted member's pieces bold in red; labels for every piece
/// when `label_all`. With `forms`, the part shared by every card (all but
/// the highlight) is written once and placed by reference.
pub(crate) fn roof_plan(
    page: &mut Page,
    forms: Option<&mut Forms>,
    deck: &CardDeck,
    area: Area,
    highlight: Option<&MemberCard>,
    label_all: bool,
) {
    let mut points: Vec<DVec2> = deck.outline.iter().flatten().copied().collect();
    points.extend(deck.roof.planes.iter().flat_map(|plane| plane.eave_outline.iter().map(|p| p.truncate())));
    let Some((low, high)) = bounds(&points) else { return };
    let label_size = crate::MIN_TEXT_PT;
    match forms {
        Some(forms) => {
            let local = Fit::into_area(low, high, Area::new(0.0, 0.0, area.size.x, area.size.y));
            let key = format!("plan {:.2} {:.2} {label_all}", area.size.x, area.size.y);
            let form = forms.get_or_draw(key, area.size, |form| {
                plan_background(form, deck, local, label_all, label_size);
            });
            page.save();
            page.form(form, area.corner);
            page.restore();
        }
        None => plan_background(page, deck, Fit::into_area(low, high, area), label_all, label_size),
    }
    let fit = Fit::into_area(low, high, area);
    if let Some(member) = highlight {
        page.line_width(1.8);
        page.stroke_colour(RED);
        for place in &member.places {
            page.line(fit.at(place[0]), fit.at(place[1]));
        }
        // One label, on a white ground, at the middle piece: a label on
        // every piece would pile up where pieces run close.
        if let Some(place) = member.places.get(member.places.len() / 2) {
            let middle = fit.at(0.5 * (place[0] + place[1]));
            let size = label_size.max(7.0);
            let width = text_width(&member.label, size, true) + 3.0;
            page.rect(
                middle - DVec2::new(width / 2.0, size * 0.3),
                DVec2::new(width, size * 1.1),
                Some([1.0, 1.0, 1.0]),
                false,
            );
            page.fill_colour(RED);
            page.text_centred(middle, size, true, &member.label);
        }
    }
}

fn plan_background(page: &mut Page, deck: &CardDeck, fit: Fit, label_all: bool, label_size: f64) {
    for plane in &deck.roof.planes {
        let eave: Vec<DVec2> = plane.eave_outline.iter().map(|p| fit.at(p.truncate())).collect();
        page.line_width(0.3);
        page.stroke_colour(GREY);
        page.polygon(&eave, None, true);
    }
    page.line_width(0.9);
    page.stroke_colour(BLACK);
    for ring in &deck.outline {
        page.polygon(&fit.all(ring), None, true);
    }
    for line in &deck.roof.lines {
        let (dash, width): (&[f64], f64) = match line.kind {
            RoofLineKind::Ridge => (&[], 1.2),
            RoofLineKind::Hip => (&[4.0, 2.0], 0.8),
            RoofLineKind::Valley => (&[1.0, 1.5], 0.8),
        };
        page.dash(dash);
        page.line_width(width);
        page.line(fit.at(line.from.truncate()), fit.at(line.to.truncate()));
    }
    page.dash(&[]);
    page.line_width(0.3);
    page.stroke_colour([0.6, 0.45, 0.25]);
    for member in &deck.members {
        for place in &member.places {
            page.line(fit.at(place[0]), fit.at(place[1]));
        }
    }
    if label_all {
        // Each label runs along its piece, reading left to right or bottom
        // to top, so labels of close parallel pieces stay apart; a label
        // that would run into one already written slides along its piece,
        // and is left off a piece only where no place on it is clear (the
        // member's other pieces carry it).
        page.fill_colour(BLACK);
        let mut placed: Vec<[DVec2; 4]> = Vec::new();
        for member in &deck.members {
            for place in &member.places {
                let (from, to) = (fit.at(place[0]), fit.at(place[1]));
                let mut along = (to - from).try_normalize().unwrap_or(DVec2::X);
                if along.x < -1e-9 || (along.x.abs() <= 1e-9 && along.y < 0.0) {
                    along = -along;
                }
                let width = text_width(&member.label, label_size, false);
                let label_box = |start: DVec2| {
                    let (low, high) = (
                        start - along.perp() * (0.21 * label_size),
                        start + along.perp() * (0.72 * label_size),
                    );
                    [low, low + along * width, high + along * width, high]
                };
                let chosen = [0.5, 0.35, 0.65, 0.2, 0.8].into_iter().find_map(|t| {
                    let start = from.lerp(to, t) - along * (width / 2.0) - along.perp() * (label_size * 0.35);
                    let corners = label_box(start);
                    placed.iter().all(|other| !quads_overlap(&corners, other)).then_some((start, corners))
                });
                if let Some((start, corners)) = chosen {
                    placed.push(corners);
                    // On a white ground, so the piece's line under it does
                    // not strike the label through.
                    page.polygon(&corners, Some([1.0, 1.0, 1.0]), false);
                    page.fill_colour(BLACK);
                    page.text_rotated(start, label_size, false, &member.label, along.y.atan2(along.x));
                }
            }
        }
    }
}

/// Whether two convex quadrilaterals (page points) overlap, by the
/// separating axis test on their edges' normals.
fn quads_overlap(a: &[DVec2; 4], b: &[DVec2; 4]) -> bool {
    let edges = a.iter().zip(a.iter().cycle().skip(1)).chain(b.iter().zip(b.iter().cycle().skip(1)));
    for (p, q) in edges {
        let Some(axis) = (*q - *p).perp().try_normalize() else { continue };
        let span = |quad: &[DVec2; 4]| {
            quad.iter()
                .map(|corner| corner.dot(axis))
                .fold((f64::INFINITY, f64::NEG_INFINITY), |(low, high), v| (low.min(v), high.max(v)))
        };
        let ((a_low, a_high), (b_low, b_high)) = (span(a), span(b));
        if a_high <= b_low || b_high <= a_low {
            return false;
        }
    }
    true
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::{CutFace, ViewFace};

    /// The grey a colour prints as (ITU-R BT.601 luma weights, the usual
    /// conversion of RGB to grey).
    fn grey(colour: [f64; 3]) -> f64 {
        0.299 * colour[0] + 0.587 * colour[1] + 0.114 * colour[2]
    }

    fn numbers_before(ops: &str, operator: &str) -> Vec<Vec<f64>> {
        ops.lines()
            .filter(|line| line.ends_with(operator) && line.len() > operator.len())
            .map(|line| line.split_whitespace().filter_map(|word| word.parse().ok()).collect())
            .collect()
    }

    /// A backed hip's top seen from above: two backing faces, one each side
    /// of the top's centre line, 100 x 10 points each.
    fn backed_top() -> MemberView {
        let rect = |y0: f64, y1: f64| {
            vec![DVec2::new(0.0, y0), DVec2::new(100.0, y0), DVec2::new(100.0, y1), DVec2::new(0.0, y1)]
        };
        MemberView {
            outline: rect(-10.0, 10.0),
            parts: vec![],
            faces: vec![
                ViewFace { face: CutFace::Backing, outline: rect(0.0, 10.0) },
                ViewFace { face: CutFace::Backing, outline: rect(-10.0, 0.0) },
            ],
        }
    }

    #[test]
    fn faces_print_as_light_greys_with_open_coloured_hatching() {
        for face in CutFace::ALL {
            let fill = tint(face.colour(), FACE_TINT).map(f64::from);
            // Light enough that black text and lines read over it in black
            // and white (common practice, no source: 60 % grey or lighter).
            assert!(grey(fill) >= 0.6, "{face:?} fill prints at {:.2}", grey(fill));
        }
        let mut page = Page::new(200.0, 100.0);
        let fit = Fit { scale: 1.0, origin: DVec2::new(50.0, 50.0) };
        member_view(&mut page, &backed_top(), fit, 0.0);
        let ops = page.ops();
        // Hatch lines in the face's own darker shade, never black.
        let strokes = numbers_before(ops, " RG");
        let shade = shade(CutFace::Backing.colour(), 0.55).map(f64::from);
        assert!(strokes.iter().any(|c| c.iter().zip(shade).all(|(a, b)| (a - b).abs() < 1e-3)));
        // Large faces hatched 4.5 pt apart: a 100 x 10 face takes no more
        // than (100 + 10) / 4.5 + 3 lines each way round (derivation).
        let lines = ops.lines().filter(|line| line.ends_with(" m")).count();
        assert!(lines <= 2 * 30 + 8, "{lines} hatch lines");
        // The two backed sides tell apart: one hatched dashed.
        assert_eq!(ops.matches("[1.5 1.5] 0 d").count(), 1);
    }
}
