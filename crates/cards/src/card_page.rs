//! One member's cut card, laid out at sizes a crew can read at the saw.
//!
//! Text never shrinks to fit: a card is a column of blocks (lengths, side
//! view, the square held for each cut, the cuts in words, where the piece
//! goes, cautions) measured at fixed type sizes, and a card too tall for
//! its slot is given more room (see `card_sheets`), continuing onto further
//! pages when even a page is not enough.

use glam::DVec2;
use pitchframe_geometry::LengthStyle;

use crate::drawing::{
    Area, Fit, SquareHold, bounds, dimension, framing_square, length_text, member_view, member_view_avoiding,
    roof_plan, square_figures, square_hold,
};
use crate::pdf_page::{BLACK, Forms, GREY, Page, RED, text_width, wrap};
use crate::square_figure::{
    SquareUse, degrees_text, figure_unit_in, square_figure_text, square_pair_text, square_setting,
};
use crate::{CardCut, CardDeck, CutAngles, CutFace, MemberCard, MemberView};
use pitchframe_geometry::MarkAlong;

/// The smallest type printed anywhere on the cards, points: about the
/// smallest a framer reads at arm's length in daylight (common practice,
/// no source).
pub const MIN_TEXT_PT: f64 = 7.0;
/// Body text: cut settings and notes.
const BODY_PT: f64 = 7.5;
/// A cut's heading.
const HEADING_PT: f64 = 8.0;
/// The lengths, the figures a crew measures with.
const VALUE_PT: f64 = 14.0;
/// The member's label.
const LABEL_PT: f64 = 20.0;
/// Line height over type size.
const LEADING: f64 = 1.2;
/// Space between blocks, points.
const GAP: f64 = 5.0;
/// Padding inside the card's frame, points.
pub(crate) const PAD: f64 = 6.0;
/// Header row height: the label and, beside it, the lengths.
const SIDE_VIEW_H: f64 = 70.0;
/// Height of one square close-up.
const CLOSE_UP_H: f64 = 84.0;
/// Narrowest square close-up, points.
const CLOSE_UP_MIN_W: f64 = 100.0;

/// The short cautions printed on every card; the cover sheet has them all.
pub const CARD_CAUTION: &str = "Test-cut a pair before cutting the run. Measure the real building: \
     walls out of square or level change every number. Local codes and licensed professionals govern \
     member sizes, spans and connections.";

/// One laid-out line of text.
#[derive(Debug, Clone)]
pub(crate) struct Line {
    text: String,
    size: f64,
    bold: bool,
    colour: [f32; 3],
    indent: f64,
}

/// Wraps a paragraph into lines no wider than `width`.
fn para(text: &str, size: f64, bold: bool, colour: [f32; 3], indent: f64, width: f64) -> Vec<Line> {
    wrap(text, width - indent, size, bold)
        .into_iter()
        .map(|text| Line { text, size, bold, colour, indent })
        .collect()
}

/// Draws lines from `top` down, left edge `x`; returns the height used.
fn draw_lines(page: &mut Page, lines: &[Line], x: f64, top: f64) -> f64 {
    let mut y = top;
    for line in lines {
        y -= line.size * LEADING;
        if line.text.is_empty() {
            continue;
        }
        page.fill_colour(line.colour);
        page.text(DVec2::new(x + line.indent, y + line.size * 0.25), line.size, line.bold, &line.text);
    }
    top - y
}

/// The lengths a framer reads, as (caption, value) pairs.
fn length_cells(member: &MemberCard, style: LengthStyle) -> Vec<(String, String)> {
    let lengths = &member.lengths;
    [
        ("LONG POINT", lengths.long_point_in),
        ("SHORT POINT", lengths.short_point_in),
        ("SEAT TO TOP CUT", lengths.seat_to_top_cut_in),
        ("TAIL", lengths.tail_in),
        ("OVERALL STOCK", Some(lengths.overall_in)),
    ]
    .into_iter()
    .filter_map(|(caption, value)| Some((caption.to_string(), length_text(value?, style))))
    .collect()
}

fn cell_width(caption: &str, value: &str) -> f64 {
    text_width(caption, MIN_TEXT_PT, true).max(text_width(value, VALUE_PT, true)) + 12.0
}

/// The square held for a cut, on the side face or on the top edge.
struct Hold<'a> {
    cut: &'a CardCut,
    hold: SquareHold,
    on_top: bool,
}

fn holds(member: &MemberCard, style: LengthStyle) -> Vec<Hold<'_>> {
    let unit_in = figure_unit_in(style);
    member
        .cuts
        .iter()
        .filter_map(|cut| {
            let square = cut.square.as_ref()?;
            if let Some(mark) = &cut.mark {
                return Some(Hold { cut, hold: square_hold(mark, square, unit_in)?, on_top: false });
            }
            member.top_view.as_ref()?;
            let mark = cut.top_mark.as_ref()?;
            Some(Hold { cut, hold: square_hold(mark, square, unit_in)?, on_top: true })
        })
        .collect()
}

fn same_angles(a: &CutAngles, b: &CutAngles) -> bool {
    let close = |x: f64, y: f64| (x - y).abs() < 0.05;
    close(a.side_line_deg, b.side_line_deg)
        && close(a.top_line_deg, b.top_line_deg)
        && close(a.circular_on_face_bevel_deg, b.circular_on_face_bevel_deg)
        && close(a.circular_on_edge_bevel_deg, b.circular_on_edge_bevel_deg)
        && close(a.miter_flat_deg[0], b.miter_flat_deg[0])
        && close(a.miter_flat_deg[1], b.miter_flat_deg[1])
        && close(a.miter_on_edge_deg[0], b.miter_on_edge_deg[0])
        && close(a.miter_on_edge_deg[1], b.miter_on_edge_deg[1])
}

/// Every cut in words at fixed sizes, `width` points wide: one group of
/// lines per cut.
fn cut_chunks(member: &MemberCard, width: f64, style: LengthStyle) -> Vec<Vec<Line>> {
    let drawn: Vec<*const CardCut> =
        holds(member, style).iter().map(|hold| hold.cut as *const CardCut).collect();
    let mut chunks = Vec::new();
    for (index, cut) in member.cuts.iter().enumerate() {
        let mut out = Vec::new();
        let mut heading = format!("[{}] {} - {}", cut.face.tag(), cut.face.name().to_uppercase(), cut.place);
        let has_close_up = drawn.contains(&(cut as *const CardCut));
        if let Some(square) = &cut.square
            && !has_close_up
        {
            let (mark, other) = match square.mark_along {
                pitchframe_geometry::MarkAlong::Figure => (square.figure, square.against),
                pitchframe_geometry::MarkAlong::Against => (square.against, square.figure),
            };
            heading.push_str(&format!(
                ": square {}, mark along the {} arm",
                square_pair_text(other, mark, style),
                square_figure_text(mark, style)
            ));
        }
        out.extend(para(&heading, HEADING_PT, true, BLACK, 0.0, width));
        let body =
            |text: &str, out: &mut Vec<Line>| out.extend(para(text, BODY_PT, false, BLACK, 8.0, width));
        if let Some(square) = &cut.square
            && !has_close_up
        {
            body(&format!("square: {}", square.setup), &mut out);
        }
        match &cut.angles {
            Some(angles) => {
                let earlier = member.cuts.iter().take(index).find(|other| {
                    other.face != cut.face
                        && other.angles.as_ref().is_some_and(|theirs| same_angles(theirs, angles))
                });
                match earlier {
                    Some(other) => {
                        body(
                            &format!("saws: set as for [{}] {}", other.face.tag(), other.face.name()),
                            &mut out,
                        );
                    }
                    None => {
                        let deg = degrees_text;
                        let mut line_words =
                            format!("lines: on the side face {} from square", deg(angles.side_line_deg));
                        if angles.top_line_deg > 0.05 {
                            line_words.push_str(&format!(
                                "; across the top edge {} from square (a line, not a saw bevel)",
                                deg(angles.top_line_deg)
                            ));
                        }
                        body(&line_words, &mut out);
                        body(
                            &format!(
                                "circular saw: on the side face bevel {}; riding the top edge bevel {}",
                                deg(angles.circular_on_face_bevel_deg),
                                deg(angles.circular_on_edge_bevel_deg)
                            ),
                            &mut out,
                        );
                        body(
                            &format!(
                                "miter saw: flat, miter {} bevel {}; on edge, miter {} bevel {}",
                                deg(angles.miter_flat_deg[0]),
                                deg(angles.miter_flat_deg[1]),
                                deg(angles.miter_on_edge_deg[0]),
                                deg(angles.miter_on_edge_deg[1])
                            ),
                            &mut out,
                        );
                    }
                }
            }
            None => {
                for setting in &cut.settings {
                    body(&setting.setup, &mut out);
                }
            }
        }
        for note in &cut.notes {
            body(note, &mut out);
        }
        chunks.push(out);
    }
    chunks
}

fn warning_and_caution_lines(member: &MemberCard, width: f64) -> Vec<Line> {
    let mut out = Vec::new();
    for warning in &member.warnings {
        out.extend(para(&format!("WARNING: {warning}"), HEADING_PT, true, RED, 0.0, width));
    }
    out.extend(para(&format!("CAUTION: {CARD_CAUTION}"), MIN_TEXT_PT, false, BLACK, 0.0, width));
    out
}

/// One cell of a row of figures.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Cell {
    /// The square close-up of one hold (an index into the card's holds).
    Hold(usize),
    /// Where the member goes on the roof plan.
    Plan,
}

/// One block of a card, with its height at the card's width.
enum Block {
    /// The side elevation with its dimensions.
    Side,
    /// A row of figures: square close-ups and the roof plan.
    Figures(Vec<Cell>),
    /// The cuts in words, in side-by-side columns.
    Columns(Vec<Vec<Line>>),
    /// Text lines across the full width.
    Lines(Vec<Line>),
}

/// A card measured at one width: the header's height and its blocks.
pub(crate) struct CardLayout {
    header_h: f64,
    blocks: Vec<(Block, f64)>,
}

impl CardLayout {
    /// The whole card's height in one piece, frame padding included.
    pub fn height(&self) -> f64 {
        2.0 * PAD + self.header_h + self.blocks.iter().map(|(_, h)| h + GAP).sum::<f64>()
    }
}

/// Gap between columns of words, points.
const COLUMN_GAP: f64 = 12.0;
/// Tallest block of words; a card continuing onto another page breaks
/// between blocks.
const WORDS_BLOCK_MAX_H: f64 = 260.0;
/// Narrowest card that sets its words in two columns.
const TWO_COLUMNS_MIN_W: f64 = 480.0;

fn chunk_height(chunk: &[Line]) -> f64 {
    chunk.iter().map(|line| line.size * LEADING).sum::<f64>() + 3.0
}

/// Splits chunks (kept in order) into `columns` columns of about equal
/// height.
fn balance(chunks: Vec<Vec<Line>>, columns: usize) -> Vec<Vec<Line>> {
    if columns < 2 || chunks.len() < 2 {
        return vec![chunks.into_iter().flatten().collect()];
    }
    let heights: Vec<f64> = chunks.iter().map(|chunk| chunk_height(chunk)).collect();
    let total: f64 = heights.iter().sum();
    let split = (1..chunks.len())
        .min_by(|&a, &b| {
            let tallest = |at: usize| {
                let left: f64 = heights.iter().take(at).sum();
                left.max(total - left)
            };
            tallest(a).total_cmp(&tallest(b))
        })
        .unwrap_or(1);
    let mut left = Vec::new();
    let mut right = Vec::new();
    for (index, chunk) in chunks.into_iter().enumerate() {
        let column = if index < split { &mut left } else { &mut right };
        if !column.is_empty() {
            column.push(Line { text: String::new(), size: 2.5, bold: false, colour: BLACK, indent: 0.0 });
        }
        column.extend(chunk);
    }
    vec![left, right]
}

fn column_height(column: &[Line]) -> f64 {
    column.iter().map(|line| line.size * LEADING).sum()
}

/// Figure cells a row of `width` holds.
fn cells_per_row(width: f64) -> usize {
    (((width + GAP) / (CLOSE_UP_MIN_W + GAP)).floor() as usize).max(1)
}

/// Type size of the line naming the member beside its label.
const SUMMARY_PT: f64 = 9.0;

/// The line naming the member, wrapped to the room beside the label
/// (the numbering's corner kept clear).
fn summary_lines(member: &MemberCard, width: f64, continued: bool, style: LengthStyle) -> Vec<String> {
    let label_w = text_width(&member.label, LABEL_PT, true) + 10.0;
    let summary = if continued {
        format!("{} (continued)", member.kind)
    } else {
        format!(
            "{} - cut {} - {} - pitch {} - lengths along the top edge",
            member.kind,
            member.count,
            member.size,
            pitch_words(member, style)
        )
    };
    let room = width - label_w - text_width("card 00 of 00", MIN_TEXT_PT, false) - 6.0;
    wrap(&summary, room.max(60.0), SUMMARY_PT, true)
}

/// A member's pitch as the square reads it on inch plans ("6 in 12", a
/// regular hip "6 in 17"), with its angle; on metric plans the angle.
fn pitch_words(member: &MemberCard, style: LengthStyle) -> String {
    let degrees = degrees_text(member.pitch_rad.to_degrees());
    if style == LengthStyle::Millimetres || member.pitch_rad.abs() < 1e-9 {
        return degrees;
    }
    let use_ =
        if member.kind == "hip" || member.kind == "valley" { SquareUse::HipPlumb } else { SquareUse::Plain };
    let square =
        square_setting([12.0, 12.0 * member.pitch_rad.tan()], MarkAlong::Figure, use_, style, |_, _, _| {
            String::new()
        });
    format!(
        "{} in {} ({degrees})",
        square_figure_text(square.figure, style),
        square_figure_text(square.against, style)
    )
}

/// Where the label and the length cells go in the header, and its height.
fn header_cells(member: &MemberCard, style: LengthStyle, width: f64) -> (Vec<(DVec2, String, String)>, f64) {
    let label_w = text_width(&member.label, LABEL_PT, true) + 10.0;
    let row_h = MIN_TEXT_PT * LEADING + VALUE_PT * 1.1 + 2.0;
    let top_line = summary_lines(member, width, false, style).len() as f64 * SUMMARY_PT * LEADING + 2.0;
    let mut x = label_w;
    let mut y = top_line;
    let mut placed = Vec::new();
    for (caption, value) in length_cells(member, style) {
        let w = cell_width(&caption, &value);
        if x + w > width && x > label_w {
            x = label_w;
            y += row_h;
        }
        placed.push((DVec2::new(x, y), caption, value));
        x += w;
    }
    (placed, (y + row_h).max(LABEL_PT + 4.0))
}

/// Lays a card out `width` points wide (inside its frame).
pub(crate) fn layout(member: &MemberCard, deck: &CardDeck, width: f64) -> CardLayout {
    let (_, header_h) = header_cells(member, deck.length_style, width);
    let mut blocks = vec![(Block::Side, SIDE_VIEW_H)];
    let cells: Vec<Cell> =
        (0..holds(member, deck.length_style).len()).map(Cell::Hold).chain([Cell::Plan]).collect();
    for row in cells.chunks(cells_per_row(width)) {
        blocks.push((Block::Figures(row.to_vec()), CLOSE_UP_H));
    }
    let columns = if width >= TWO_COLUMNS_MIN_W { 2 } else { 1 };
    let column_w = (width - (columns as f64 - 1.0) * COLUMN_GAP) / columns as f64;
    let mut group: Vec<Vec<Line>> = Vec::new();
    let mut group_h = 0.0;
    let flush = |group: &mut Vec<Vec<Line>>, blocks: &mut Vec<(Block, f64)>| {
        if group.is_empty() {
            return;
        }
        let laid = balance(std::mem::take(group), columns);
        let height = laid.iter().map(|column| column_height(column)).fold(0.0, f64::max);
        blocks.push((Block::Columns(laid), height));
    };
    for chunk in cut_chunks(member, column_w, deck.length_style) {
        let height = chunk_height(&chunk);
        if group_h + height > WORDS_BLOCK_MAX_H * columns as f64 && !group.is_empty() {
            flush(&mut group, &mut blocks);
            group_h = 0.0;
        }
        group_h += height;
        group.push(chunk);
    }
    flush(&mut group, &mut blocks);
    let lines = warning_and_caution_lines(member, width);
    let height = column_height(&lines);
    blocks.push((Block::Lines(lines), height));
    CardLayout { header_h, blocks }
}

/// Draws the card's header in `inner` and returns the height it took.
pub(crate) fn draw_header(
    page: &mut Page,
    member: &MemberCard,
    style: LengthStyle,
    inner: Area,
    numbering: &str,
    continued: bool,
) -> f64 {
    let top = inner.top();
    page.fill_colour(BLACK);
    page.text(DVec2::new(inner.corner.x, top - LABEL_PT * 0.8), LABEL_PT, true, &member.label);
    page.fill_colour(GREY);
    let numbering_w = text_width(numbering, MIN_TEXT_PT, false);
    page.text(
        DVec2::new(inner.corner.x + inner.size.x - numbering_w, top - MIN_TEXT_PT),
        MIN_TEXT_PT,
        false,
        numbering,
    );
    let label_w = text_width(&member.label, LABEL_PT, true) + 10.0;
    page.fill_colour(BLACK);
    let summary = summary_lines(member, inner.size.x, continued, style);
    for (index, line) in summary.iter().enumerate() {
        let y = top - SUMMARY_PT - index as f64 * SUMMARY_PT * LEADING;
        page.text(DVec2::new(inner.corner.x + label_w, y), SUMMARY_PT, true, line);
    }
    if continued {
        return (summary.len() as f64 * SUMMARY_PT * LEADING).max(LABEL_PT) + 4.0;
    }
    let (cells, height) = header_cells(member, style, inner.size.x);
    for (at, caption, value) in cells {
        let x = inner.corner.x + at.x;
        let y = top - at.y;
        page.fill_colour(BLACK);
        page.text(DVec2::new(x, y - MIN_TEXT_PT), MIN_TEXT_PT, true, &caption);
        page.text(DVec2::new(x, y - MIN_TEXT_PT * LEADING - VALUE_PT * 0.9), VALUE_PT, true, &value);
    }
    height
}

/// Draws one block in `area`.
pub(crate) fn draw_block(
    page: &mut Page,
    forms: &mut Forms,
    deck: &CardDeck,
    member: &MemberCard,
    layout: &CardLayout,
    block: usize,
    area: Area,
) {
    let Some((block, _)) = layout.blocks.get(block) else { return };
    match block {
        Block::Side => side_elevation(page, member, area, deck.length_style),
        Block::Figures(cells) => {
            let all = holds(member, deck.length_style);
            let per_row = cells_per_row(area.size.x) as f64;
            let w = (area.size.x - (per_row - 1.0) * GAP) / per_row;
            let mut x = area.corner.x;
            for (slot, cell) in cells.iter().enumerate() {
                // The plan, last in its row, takes what the row leaves.
                let left = area.corner.x + area.size.x - x;
                let cell_w =
                    if *cell == Cell::Plan && slot + 1 == cells.len() { left.min(2.0 * w) } else { w };
                let cell_area = Area::new(x, area.corner.y, cell_w, area.size.y);
                match cell {
                    Cell::Hold(index) => {
                        if let Some(hold) = all.get(*index) {
                            square_close_up(page, member, hold, cell_area, deck.length_style);
                        }
                    }
                    Cell::Plan => plan_box(page, forms, deck, member, cell_area),
                }
                x += cell_w + GAP;
            }
        }
        Block::Columns(columns) => {
            let count = columns.len().max(1) as f64;
            let column_w = (area.size.x - (count - 1.0) * COLUMN_GAP) / count;
            for (index, column) in columns.iter().enumerate() {
                draw_lines(page, column, area.corner.x + index as f64 * (column_w + COLUMN_GAP), area.top());
            }
        }
        Block::Lines(lines) => {
            draw_lines(page, lines, area.corner.x, area.top());
        }
    }
}

/// How many blocks the layout has, and each one's height.
pub(crate) fn block_heights(layout: &CardLayout) -> Vec<f64> {
    layout.blocks.iter().map(|(_, h)| *h).collect()
}

/// The gap between blocks, points.
pub(crate) const BLOCK_GAP: f64 = GAP;

fn plan_box(page: &mut Page, forms: &mut Forms, deck: &CardDeck, member: &MemberCard, area: Area) {
    page.fill_colour(BLACK);
    page.text(
        DVec2::new(area.corner.x, area.top() - HEADING_PT),
        HEADING_PT,
        true,
        &format!("Where {} goes (red)", member.label),
    );
    let plan =
        Area::new(area.corner.x, area.corner.y, area.size.x, area.size.y - HEADING_PT * 1.5).inset(2.0);
    roof_plan(page, Some(forms), deck, plan, Some(member), false);
}

fn side_elevation(page: &mut Page, member: &MemberCard, area: Area, style: LengthStyle) {
    let base = BODY_PT;
    let view = &member.side_view;
    let Some((low, high)) = bounds(&view.outline) else { return };
    page.fill_colour(BLACK);
    page.text(
        DVec2::new(area.corner.x, area.top() - HEADING_PT),
        HEADING_PT,
        true,
        "Side view (lower end left)",
    );
    // Room above for the seat-to-top-cut and tail dimensions, below for
    // the overall.
    let drawing = Area::new(
        area.corner.x + base,
        area.corner.y + base * 2.8,
        area.size.x - 2.0 * base,
        area.size.y - base * 2.8 - HEADING_PT * 1.3 - base * 3.2,
    );
    let fit = Fit::into_area(low, high, drawing);
    let bottom = fit.at(low).y;
    let top_y = fit.at(DVec2::new(0.0, member.depth_in)).y.max(fit.at(high).y);
    // Tags stay off the bands above and below the board where the
    // dimensions are written.
    let right = area.corner.x + area.size.x;
    let far = 1e4;
    let blocked = vec![
        (DVec2::new(area.corner.x, top_y + 0.5), DVec2::new(right, area.top())),
        (area.corner, DVec2::new(right, bottom - 0.5)),
        // Outside the block altogether.
        (DVec2::new(-far, area.top()), DVec2::splat(far)),
        (DVec2::splat(-far), DVec2::new(far, area.corner.y)),
        (DVec2::splat(-far), DVec2::new(area.corner.x, far)),
        (DVec2::new(right, -far), DVec2::splat(far)),
    ];
    member_view_avoiding(page, view, fit, MIN_TEXT_PT, blocked);
    dimension(
        page,
        DVec2::new(fit.at(low).x, bottom),
        DVec2::new(fit.at(high).x, bottom),
        -base * 1.6,
        &format!("overall stock {}", length_text(member.lengths.overall_in, style)),
        base,
    );
    // Where each marked line crosses the top edge, for dimensions along it.
    let top_edge = member.depth_in;
    let on_top = |face: CutFace| {
        let cut = member.cuts.iter().find(|cut| cut.face == face)?;
        let mark = cut.mark?;
        if mark.into_board.y.abs() < 1e-9 {
            return None;
        }
        let t = (top_edge - mark.edge_point.y) / mark.into_board.y;
        Some(fit.at(mark.edge_point + mark.into_board * t).x)
    };
    let Some(heel_x) = on_top(CutFace::Heel) else { return };
    if let (Some(top_x), Some(seat_to_top)) = (on_top(CutFace::TopPlumb), member.lengths.seat_to_top_cut_in) {
        dimension(
            page,
            DVec2::new(heel_x, top_y),
            DVec2::new(top_x, top_y),
            base * 1.4,
            &format!("seat to top cut {}", length_text(seat_to_top, style)),
            base,
        );
    }
    if let (Some(tail_x), Some(tail)) = (on_top(CutFace::TailPlumb), member.lengths.tail_in) {
        let text = format!("tail {}", length_text(tail, style));
        if heel_x - tail_x < text_width(&text, base, false) + base {
            // Too short to hold its words: the line bare, the words above
            // it clear of the seat-to-top dimension.
            dimension(page, DVec2::new(tail_x, top_y), DVec2::new(heel_x, top_y), base * 1.4, "", base);
            page.fill_colour(BLACK);
            page.text(DVec2::new(heel_x + base * 0.6, top_y + base * 1.4 + 2.0), base, false, &text);
        } else {
            dimension(page, DVec2::new(tail_x, top_y), DVec2::new(heel_x, top_y), base * 1.4, &text, base);
        }
    }
}

/// The square held for one cut, close up: the board around it with the
/// edge it is held on drawn bold and named, the square with both figures
/// where they meet that edge, and the marked arm in red.
fn square_close_up(page: &mut Page, member: &MemberCard, hold: &Hold<'_>, area: Area, style: LengthStyle) {
    page.line_width(0.4);
    page.stroke_colour(GREY);
    page.rect(area.corner, area.size, None, true);
    let face = hold.cut.face;
    let name = format!("[{}] {}:", face.tag(), face.name());
    let pair = square_pair_text(hold.hold.other_figure, hold.hold.mark_figure, style);
    let text_w = area.size.x - 4.0;
    // The figures stay together: on the name's line when they fit, else
    // on their own line below it.
    let one_line = format!("{name} {pair}");
    let top_lines = if text_width(&one_line, HEADING_PT, true) <= text_w {
        para(&one_line, HEADING_PT, true, BLACK, 0.0, text_w)
    } else {
        let mut lines = para(&name, HEADING_PT, true, BLACK, 0.0, text_w);
        lines.extend(para(&pair, HEADING_PT, true, BLACK, 0.0, text_w));
        lines
    };
    let top_h = draw_lines(page, &top_lines, area.corner.x + 2.0, area.top() - 1.0);
    let h = &hold.hold;
    let edge_words = if hold.on_top {
        "on the top edge, from above"
    } else if h.mark_point.y > 0.5 * member.depth_in {
        "held on the top edge (bold)"
    } else {
        "held on the bottom edge (bold)"
    };
    let hint = format!("mark along the {} arm (red)", square_figure_text(h.mark_figure, style));
    let mut bottom_lines = para(edge_words, MIN_TEXT_PT, true, BLACK, 0.0, text_w);
    bottom_lines.extend(para(&hint, MIN_TEXT_PT, false, BLACK, 0.0, text_w));
    let bottom_h = column_height(&bottom_lines);
    draw_lines(page, &bottom_lines, area.corner.x + 2.0, area.corner.y + 1.0 + bottom_h);
    let view: &MemberView = if hold.on_top {
        match &member.top_view {
            Some(top) => top,
            None => return,
        }
    } else {
        &member.side_view
    };
    let drawing = Area::new(
        area.corner.x + 2.0,
        area.corner.y + bottom_h + 2.0,
        area.size.x - 4.0,
        (area.size.y - bottom_h - top_h - 4.0).max(1.0),
    );
    let fit = if hold.on_top {
        top_close_up_fit(view, h, drawing)
    } else {
        let Some((low, high)) = bounds(&[h.heel, h.mark_point, h.other_point]) else { return };
        let pad = DVec2::splat(2.5);
        Fit::into_area(low - pad, high + pad, drawing)
    };
    page.save();
    page.clip_rect(drawing.corner, drawing.size);
    // The stock runs on past the cut until it is made: its edges dashed
    // right across, so the square's figures are seen to sit on an edge.
    page.line_width(0.4);
    page.stroke_colour(GREY);
    page.dash(&[2.0, 1.5]);
    for y in [view_low_y(view), view_high_y(view)] {
        let y = fit.at(DVec2::new(0.0, y)).y;
        page.line(DVec2::new(drawing.corner.x, y), DVec2::new(drawing.corner.x + drawing.size.x, y));
    }
    page.dash(&[]);
    // No face tags here: the caption names the cut, and tags would crowd
    // the square's figures.
    member_view(page, view, fit, 0.0);
    // The edge the square is held on, bold.
    let edge_y = fit.at(h.mark_point).y;
    page.line_width(1.8);
    page.stroke_colour(BLACK);
    page.line(DVec2::new(drawing.corner.x, edge_y), DVec2::new(drawing.corner.x + drawing.size.x, edge_y));
    framing_square(page, h, fit, hold.on_top);
    let (low_y, high_y) = (view_low_y(view), view_high_y(view));
    if hold.on_top || h.heel.y < low_y || h.heel.y > high_y {
        // With the heel off the board, the line is drawn on along the
        // arm's edge across the board: the cheek line across the top, or a
        // tail's plumb line down the side.
        let middle_y = 0.5 * (low_y + high_y);
        let across = if (middle_y - h.mark_point.y) * h.mark_arm.y > 0.0 { h.mark_arm } else { -h.mark_arm };
        if across.y.abs() > 1e-6 {
            let far = h.mark_point + across * ((high_y - low_y) / across.y.abs());
            page.line_width(1.2);
            page.stroke_colour(RED);
            page.line(fit.at(h.mark_point), fit.at(far));
        }
    }
    page.restore();
    // The figures inside the drawing's box, where their arms leave it when
    // the figure's end lies beyond.
    let off_board = if hold.on_top {
        let middle_y = 0.5 * (view_low_y(view) + view_high_y(view));
        if h.mark_point.y >= middle_y { DVec2::Y } else { -DVec2::Y }
    } else if h.mark_point.y > 0.5 * member.depth_in {
        DVec2::Y
    } else {
        -DVec2::Y
    };
    square_figures(page, h, fit, HEADING_PT, style, drawing, off_board);
}

/// How many times the member's width the top close-up shows across: the
/// 1-1/2 in top face then takes a third of the box's height, so the cheek
/// line's angle reads; the square's arms run on out of the box.
const TOP_CLOSE_UP_WIDTHS: f64 = 3.0;

/// The fit for a cheek cut's close-up from above: centred on the cheek
/// line across the top face, the face a third of the box's height.
fn top_close_up_fit(view: &MemberView, hold: &SquareHold, drawing: Area) -> Fit {
    let (low_y, high_y) = (view_low_y(view), view_high_y(view));
    let width = (high_y - low_y).max(1e-6);
    let into = -hold.mark_arm;
    // Where the marked line crosses the middle of the top face.
    let across =
        if into.y.abs() > 1e-6 { (0.5 * (low_y + high_y) - hold.mark_point.y) / into.y } else { 0.0 };
    let centre = DVec2::new((hold.mark_point + into * across).x, 0.5 * (low_y + high_y));
    let shown_h = width * TOP_CLOSE_UP_WIDTHS;
    let shown_w = shown_h * drawing.size.x / drawing.size.y.max(1e-6);
    let half = DVec2::new(shown_w, shown_h) * 0.5;
    Fit::into_area(centre - half, centre + half, drawing)
}

fn view_low_y(view: &MemberView) -> f64 {
    view.outline.iter().map(|p| p.y).fold(f64::INFINITY, f64::min)
}

fn view_high_y(view: &MemberView) -> f64 {
    view.outline.iter().map(|p| p.y).fold(f64::NEG_INFINITY, f64::max)
}

#[cfg(test)]
mod tests {
    use super::*;
    use crate::ViewFace;

    #[test]
    fn a_cheek_seen_from_above_fills_a_third_of_its_close_up() {
        // A 1-1/2 in top face, 100 in long, its cheek line at the upper end
        // 46.7 deg from square (a regular hip's at 6 in 12, trade.md
        // section 2).
        let top = MemberView {
            outline: vec![
                DVec2::new(0.0, -0.75),
                DVec2::new(100.0, -0.75),
                DVec2::new(100.0, 0.75),
                DVec2::new(0.0, 0.75),
            ],
            parts: vec![],
            faces: vec![ViewFace {
                face: CutFace::Cheek,
                outline: vec![DVec2::new(99.0, 0.75), DVec2::new(100.0, -0.75)],
            }],
        };
        let from_axis = (90.0_f64 - 46.7).to_radians();
        let into = DVec2::new(from_axis.cos(), -from_axis.sin());
        let hold = SquareHold {
            heel: DVec2::new(99.0, 0.75) + into * 12.0,
            mark_point: DVec2::new(99.0, 0.75),
            other_point: DVec2::new(99.0 + 16.5, 0.75),
            mark_arm: -into,
            other_arm: into.perp(),
            mark_figure: 12.0,
            other_figure: 11.3125,
        };
        let drawing = Area::new(0.0, 0.0, 96.0, 50.0);
        let fit = top_close_up_fit(&top, &hold, drawing);
        // The top face drawn a third of the box's height: 16.7 pt, where
        // fitting the whole square (16.5 in across) drew it under 5 pt.
        assert!((fit.scale * 1.5 - 50.0 / 3.0).abs() < 1e-6, "top face {} pt", fit.scale * 1.5);
        // Centred on where the cheek line crosses the face's middle.
        let crossing = fit.at(DVec2::new(99.0 + 0.75 * from_axis.cos() / from_axis.sin(), 0.0));
        assert!((crossing - DVec2::new(48.0, 25.0)).length() < 1e-6, "{crossing}");
    }
}
