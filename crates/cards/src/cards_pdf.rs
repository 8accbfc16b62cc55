//! The cut cards as a PDF: a cover sheet, one card per distinct member, and
//! full-size end templates on request.

use glam::DVec2;
use pitchframe_geometry::LengthStyle;
use serde::Serialize;
use thiserror::Error;

use crate::drawing::{
    Area, Fit, bounds, dimension, figure_text, framing_square, length_text, member_view, roof_plan,
    square_hold, tag,
};
use crate::pdf_page::{BLACK, Forms, GREY, Page, RED, text_width, wrap, write_document};
use crate::{CardDeck, CutFace, MemberCard};

/// Paper size.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Serialize)]
#[serde(rename_all = "snake_case")]
pub enum Paper {
    /// US Letter, 8-1/2 x 11 in.
    Letter,
    /// ISO A4, 210 x 297 mm.
    A4,
}

impl Paper {
    /// Width and height in points, portrait.
    pub fn size_pt(self) -> DVec2 {
        match self {
            Paper::Letter => DVec2::new(612.0, 792.0),
            Paper::A4 => DVec2::new(210.0, 297.0) * POINTS_PER_MM,
        }
    }
}

/// Points per inch: the PDF unit is 1/72 in.
pub const POINTS_PER_IN: f64 = 72.0;
/// Points per millimetre.
pub const POINTS_PER_MM: f64 = 72.0 / 25.4;

/// How the cards are printed.
#[derive(Debug, Clone, PartialEq, Serialize)]
pub struct CardOptions {
    /// Paper size.
    pub paper: Paper,
    /// Cards per page: 1, 2 or 4.
    pub per_page: u8,
    /// Labels of the members whose ends are also printed full size.
    pub templates: Vec<String>,
}

impl Default for CardOptions {
    fn default() -> Self {
        Self { paper: Paper::Letter, per_page: 2, templates: Vec::new() }
    }
}

/// Why the cards could not be made.
#[derive(Debug, Error)]
pub enum CardsError {
    /// Cards per page other than 1, 2 or 4.
    #[error("cards per page must be 1, 2 or 4, not {per_page}")]
    PerPage {
        /// What was asked for.
        per_page: u8,
    },
    /// A template was asked for a member that is not in the frame.
    #[error("no member is labelled {label}, so its full-size template cannot be printed")]
    TemplateMemberMissing {
        /// The label asked for.
        label: String,
    },
    /// Writing the PDF failed.
    #[error("the cut cards PDF could not be written: {0}")]
    Pdf(#[from] std::io::Error),
}

/// The cautions printed on every cover sheet.
pub const CAUTIONS: [&str; 5] = [
    "Work at height needs fall protection, and the frame needs temporary bracing until the roof is sheathed.",
    "Steep bevels and short offcuts kick back: support and clamp the work, and test-cut a pair before cutting the run.",
    "Measure the real building: walls out of square, out of level or off their drawn size change every number here.",
    "Member sizes, spans, ridge beams on low slopes, connections and notch limits are set by local codes, \
     engineered designs and licensed professionals, and they govern.",
    "This tool gives geometry only; it does not size members or design connections.",
];

const MARGIN: f64 = 30.0;

/// Renders the cover sheet, one card per distinct member and any full-size
/// templates into one PDF.
pub fn render_cards(deck: &CardDeck, options: &CardOptions) -> Result<Vec<u8>, CardsError> {
    if !matches!(options.per_page, 1 | 2 | 4) {
        return Err(CardsError::PerPage { per_page: options.per_page });
    }
    let template_members: Vec<&MemberCard> = options
        .templates
        .iter()
        .map(|label| {
            deck.members
                .iter()
                .find(|member| &member.label == label)
                .ok_or_else(|| CardsError::TemplateMemberMissing { label: label.clone() })
        })
        .collect::<Result<_, _>>()?;
    let paper = options.paper.size_pt();
    let mut pages = cover_pages(deck, paper);
    let mut forms = Forms::default();
    let total_cards = deck.members.len();
    for (page_index, chunk) in deck.members.chunks(usize::from(options.per_page)).enumerate() {
        let mut page = Page::new(paper.x, paper.y);
        let slots = card_slots(paper, options.per_page);
        for (slot, (member, area)) in chunk.iter().zip(slots).enumerate() {
            let number = page_index * usize::from(options.per_page) + slot + 1;
            card(&mut page, &mut forms, deck, member, area, &format!("card {number} of {total_cards}"));
        }
        footer(&mut page, deck);
        pages.push(page);
    }
    for member in template_members {
        pages.extend(template_pages(deck, member, paper));
    }
    Ok(write_document(pages, forms, &deck.title)?)
}

fn card_slots(paper: DVec2, per_page: u8) -> Vec<Area> {
    let (width, height) = (paper.x - 2.0 * MARGIN, paper.y - 2.0 * MARGIN - 10.0);
    let bottom = MARGIN + 10.0;
    match per_page {
        1 => vec![Area::new(MARGIN, bottom, width, height)],
        2 => {
            let half = (height - 8.0) / 2.0;
            vec![Area::new(MARGIN, bottom + half + 8.0, width, half), Area::new(MARGIN, bottom, width, half)]
        }
        _ => {
            let (half_w, half_h) = ((width - 8.0) / 2.0, (height - 8.0) / 2.0);
            vec![
                Area::new(MARGIN, bottom + half_h + 8.0, half_w, half_h),
                Area::new(MARGIN + half_w + 8.0, bottom + half_h + 8.0, half_w, half_h),
                Area::new(MARGIN, bottom, half_w, half_h),
                Area::new(MARGIN + half_w + 8.0, bottom, half_w, half_h),
            ]
        }
    }
}

fn footer(page: &mut Page, deck: &CardDeck) {
    page.fill_colour(GREY);
    page.text(
        DVec2::new(MARGIN, MARGIN - 8.0),
        6.5,
        false,
        &format!("{} - Pitchframe gives geometry; local codes and licensed professionals govern sizing and connections.", deck.title),
    );
}

/// A paragraph of the text column: its text, size relative to the base,
/// weight and colour.
struct Paragraph {
    text: String,
    relative: f64,
    bold: bool,
    colour: [f32; 3],
    indent: f64,
}

fn paragraph(text: impl Into<String>, relative: f64, bold: bool) -> Paragraph {
    Paragraph { text: text.into(), relative, bold, colour: BLACK, indent: 0.0 }
}

/// Lays paragraphs into `area` at the largest base size up to `base` that
/// fits, and returns the size used.
fn text_column(page: &mut Page, paragraphs: &[Paragraph], area: Area, base: f64) -> f64 {
    let mut size = base;
    let layout = |size: f64| -> (f64, Vec<(f64, Vec<String>)>) {
        let mut height = 0.0;
        let mut laid = Vec::new();
        for paragraph in paragraphs {
            let text_size = size * paragraph.relative;
            let lines =
                wrap(&paragraph.text, area.size.x - paragraph.indent * size, text_size, paragraph.bold);
            height += lines.len() as f64 * text_size * 1.2 + size * 0.25;
            laid.push((text_size, lines));
        }
        (height, laid)
    };
    let (mut height, mut laid) = layout(size);
    while height > area.size.y && size > 3.0 {
        size *= 0.93;
        (height, laid) = layout(size);
    }
    let mut y = area.top();
    for (paragraph, (text_size, lines)) in paragraphs.iter().zip(laid) {
        for line in lines {
            y -= text_size * 1.2;
            if y < area.corner.y - 1.0 {
                return size;
            }
            page.fill_colour(paragraph.colour);
            page.text(
                DVec2::new(area.corner.x + paragraph.indent * size, y + text_size * 0.2),
                text_size,
                paragraph.bold,
                &line,
            );
        }
        y -= size * 0.25;
    }
    size
}

fn member_paragraphs(member: &MemberCard, style: LengthStyle) -> Vec<Paragraph> {
    let lengths = &member.lengths;
    let mut out = vec![paragraph("LENGTHS (along the top edge)", 1.0, true)];
    let named = [
        ("long point", lengths.long_point_in),
        ("short point", lengths.short_point_in),
        ("seat to top cut", lengths.seat_to_top_cut_in),
        ("tail", lengths.tail_in),
        ("overall stock", Some(lengths.overall_in)),
    ];
    for (name, value) in named {
        if let Some(inches) = value {
            let mut p =
                paragraph(format!("{name}: {}", length_text(inches, style)), 1.15, name == "overall stock");
            p.indent = 1.0;
            out.push(p);
        }
    }
    out.push(paragraph("CUTS (from the lower end)", 1.0, true));
    for cut in &member.cuts {
        let mut head =
            paragraph(format!("[{}] {} - {}", cut.face.tag(), cut.face.name(), cut.place), 1.0, true);
        head.indent = 0.5;
        out.push(head);
        if let Some(square) = &cut.square {
            let mut p = paragraph(
                format!(
                    "Square {} & {}: {}",
                    figure_text(square.against),
                    figure_text(square.figure),
                    square.setup
                ),
                0.92,
                false,
            );
            p.indent = 1.5;
            out.push(p);
        }
        for setting in &cut.settings {
            let mut p = paragraph(format!("\u{2022} {}", setting.setup), 0.92, false);
            p.indent = 1.5;
            out.push(p);
        }
        for note in &cut.notes {
            let mut p = paragraph(note.clone(), 0.92, false);
            p.indent = 1.5;
            out.push(p);
        }
    }
    if !member.warnings.is_empty() {
        let mut head = paragraph("WARNINGS", 1.0, true);
        head.colour = RED;
        out.push(head);
        for warning in &member.warnings {
            let mut p = paragraph(format!("WARNING: {warning}"), 1.0, true);
            p.colour = RED;
            p.indent = 0.5;
            out.push(p);
        }
    }
    out
}

/// One card in its slot.
fn card(
    page: &mut Page,
    forms: &mut Forms,
    deck: &CardDeck,
    member: &MemberCard,
    area: Area,
    numbering: &str,
) {
    let style = deck.length_style;
    let base = (area.size.x / 540.0 * 8.5).clamp(5.0, 8.5);
    page.line_width(0.8);
    page.stroke_colour(BLACK);
    page.rect(area.corner, area.size, None, true);
    let inner = area.inset(6.0);

    // Header: label large, then what it is, how many and its size.
    let header_h = base * 2.6;
    let label_size = base * 2.2;
    page.fill_colour(BLACK);
    let header_y = inner.top() - label_size;
    page.text(DVec2::new(inner.corner.x, header_y), label_size, true, &member.label);
    let label_w = text_width(&member.label, label_size, true);
    let summary = format!(
        "{} - cut {} - {} - pitch {:.2} deg",
        member.kind,
        member.count,
        member.size,
        member.pitch_rad.to_degrees()
    );
    page.text(DVec2::new(inner.corner.x + label_w + base, header_y), base * 1.2, true, &summary);
    page.fill_colour(GREY);
    let numbering_w = text_width(numbering, base * 0.9, false);
    page.text(
        DVec2::new(inner.corner.x + inner.size.x - numbering_w, inner.top() - base),
        base * 0.9,
        false,
        numbering,
    );

    // Side elevation across the full width, with its dimensions.
    let side_h = inner.size.y * 0.24;
    let side_area = Area::new(inner.corner.x, inner.top() - header_h - side_h, inner.size.x, side_h);
    side_elevation(page, member, side_area, base, style);

    // The square held for each cut, in small close-ups.
    let holds: Vec<_> = member
        .cuts
        .iter()
        .filter_map(|cut| Some((cut, square_hold(cut.mark.as_ref()?, cut.square.as_ref()?)?)))
        .collect();
    let inset_h = if holds.is_empty() { 0.0 } else { inner.size.y * 0.17 };
    let inset_top = side_area.corner.y - base * 0.6;
    if !holds.is_empty() {
        let count = holds.len() as f64;
        let inset_w = (inner.size.x - (count - 1.0) * 4.0) / count;
        for (index, (cut, hold)) in holds.iter().enumerate() {
            let box_area = Area::new(
                inner.corner.x + index as f64 * (inset_w + 4.0),
                inset_top - inset_h,
                inset_w,
                inset_h,
            );
            square_inset(page, member, cut.face, hold, box_area, base);
        }
    }

    // Below: the words on the left, the top view and the roof plan on the right.
    let lower_top = inset_top - inset_h - base * 0.6;
    let lower_h = lower_top - inner.corner.y;
    let text_w = inner.size.x * 0.6;
    let text_area = Area::new(inner.corner.x, inner.corner.y, text_w - 6.0, lower_h);
    text_column(page, &member_paragraphs(member, style), text_area, base);
    let right = Area::new(inner.corner.x + text_w, inner.corner.y, inner.size.x - text_w, lower_h);
    let mut plan_area = right;
    if let Some(top) = &member.top_view {
        let top_h = right.size.y * 0.35;
        let top_area = Area::new(right.corner.x, right.top() - top_h, right.size.x, top_h);
        page.fill_colour(BLACK);
        page.text(DVec2::new(top_area.corner.x, top_area.top() - base), base, true, "Top view (cheek cuts)");
        if let Some((low, high)) = bounds(&top.outline) {
            let fit = Fit::into_area(
                low,
                high,
                Area::new(
                    top_area.corner.x,
                    top_area.corner.y,
                    top_area.size.x,
                    top_area.size.y - base * 1.6,
                )
                .inset(3.0),
            );
            member_view(page, top, fit, base * 0.8);
        }
        plan_area = Area::new(right.corner.x, right.corner.y, right.size.x, right.size.y - top_h - base);
    }
    page.fill_colour(BLACK);
    page.text(
        DVec2::new(plan_area.corner.x, plan_area.top() - base),
        base,
        true,
        &format!("Where {} goes (red)", member.label),
    );
    roof_plan(
        page,
        Some(forms),
        deck,
        Area::new(plan_area.corner.x, plan_area.corner.y, plan_area.size.x, plan_area.size.y - base * 1.6)
            .inset(2.0),
        Some(member),
        false,
    );
}

fn side_elevation(page: &mut Page, member: &MemberCard, area: Area, base: f64, style: LengthStyle) {
    let view = &member.side_view;
    let Some((low, high)) = bounds(&view.outline) else { return };
    page.fill_colour(BLACK);
    page.text(DVec2::new(area.corner.x, area.top() - base), base, true, "Side view (lower end left)");
    // Room above for the seat-to-top-cut dimension, below for the overall.
    let drawing = Area::new(
        area.corner.x + base,
        area.corner.y + base * 2.8,
        area.size.x - 2.0 * base,
        area.size.y - base * 6.0,
    );
    let fit = Fit::into_area(low, high, drawing);
    member_view(page, view, fit, base * 0.85);
    let bottom = fit.at(DVec2::new(low.x, low.y)).y;
    dimension(
        page,
        DVec2::new(fit.at(low).x, bottom),
        DVec2::new(fit.at(high).x, bottom),
        -base * 1.6,
        &format!("overall stock {}", length_text(member.lengths.overall_in, style)),
        base,
    );
    let mark_of = |face: CutFace| member.cuts.iter().find(|cut| cut.face == face).and_then(|cut| cut.mark);
    let top_y = fit.at(high).y;
    if let (Some(heel), Some(top_cut), Some(seat_to_top)) =
        (mark_of(CutFace::Heel), mark_of(CutFace::TopPlumb), member.lengths.seat_to_top_cut_in)
    {
        dimension(
            page,
            DVec2::new(fit.at(heel.edge_point).x, top_y),
            DVec2::new(fit.at(top_cut.edge_point).x, top_y),
            base * 1.4,
            &format!("seat to top cut {}", length_text(seat_to_top, style)),
            base,
        );
        if let (Some(tail_mark), Some(tail)) = (mark_of(CutFace::TailPlumb), member.lengths.tail_in) {
            let text = format!("tail {}", length_text(tail, style));
            let (from, to) = (fit.at(tail_mark.edge_point).x, fit.at(heel.edge_point).x);
            if to - from < text_width(&text, base, false) + base {
                // Too short to hold its words: draw the line bare and write
                // the words just past the heel, clear of the heading.
                dimension(page, DVec2::new(from, top_y), DVec2::new(to, top_y), base * 1.4, "", base);
                page.text(DVec2::new(to + base * 0.5, top_y + base * 1.6), base, false, &text);
            } else {
                dimension(page, DVec2::new(from, top_y), DVec2::new(to, top_y), base * 1.4, &text, base);
            }
        }
    }
}

fn square_inset(
    page: &mut Page,
    member: &MemberCard,
    face: CutFace,
    hold: &crate::drawing::SquareHold,
    area: Area,
    base: f64,
) {
    page.line_width(0.4);
    page.stroke_colour(GREY);
    page.rect(area.corner, area.size, None, true);
    let caption = format!(
        "[{}] {}: {} & {}",
        face.tag(),
        face.name(),
        figure_text(hold.mark_figure),
        figure_text(hold.other_figure)
    );
    page.fill_colour(BLACK);
    let caption_size = (base * 0.9).min(area.size.x / text_width(&caption, 1.0, true).max(1.0));
    page.text(DVec2::new(area.corner.x + 2.0, area.top() - caption_size - 1.0), caption_size, true, &caption);
    page.fill_colour(GREY);
    let hint = format!("mark along the {} arm (red)", figure_text(hold.mark_figure));
    page.text(DVec2::new(area.corner.x + 2.0, area.corner.y + 2.0), caption_size * 0.85, false, &hint);
    // Show the board around the square: the square and the edge points.
    let square_reach = [hold.heel, hold.mark_point, hold.other_point];
    let Some((low, high)) = bounds(&square_reach) else { return };
    let pad = DVec2::splat(2.5);
    let drawing = Area::new(
        area.corner.x + 2.0,
        area.corner.y + caption_size * 1.4,
        area.size.x - 4.0,
        area.size.y - caption_size * 3.0,
    );
    let fit = Fit::into_area(low - pad, high + pad, drawing);
    page.save();
    page.clip_rect(drawing.corner, drawing.size);
    member_view(page, &member.side_view, fit, base * 0.7);
    framing_square(page, hold, fit, base * 0.85);
    page.restore();
}

/// The cover sheet and, when it runs over, its following pages.
fn cover_pages(deck: &CardDeck, paper: DVec2) -> Vec<Page> {
    let style = deck.length_style;
    let mut page = Page::new(paper.x, paper.y);
    let width = paper.x - 2.0 * MARGIN;
    page.fill_colour(BLACK);
    page.text(
        DVec2::new(MARGIN, paper.y - MARGIN - 16.0),
        16.0,
        true,
        &format!("{} - cut cards", deck.title),
    );
    let plan_h = paper.y * 0.42;
    let plan_area = Area::new(MARGIN, paper.y - MARGIN - 24.0 - plan_h, width, plan_h);
    page.line_width(0.5);
    page.stroke_colour(GREY);
    page.rect(plan_area.corner, plan_area.size, None, true);
    roof_plan(&mut page, None, deck, plan_area.inset(8.0), None, true);
    page.fill_colour(GREY);
    page.text(
        DVec2::new(plan_area.corner.x + 4.0, plan_area.corner.y + 4.0),
        6.5,
        false,
        "Plan: wall lines bold, eaves grey, ridges solid, hips dashed, valleys dotted; every piece with its label.",
    );

    let mut lines: Vec<Paragraph> = Vec::new();
    let summary = deck.roof_summary();
    lines.push(paragraph("ROOF", 1.2, true));
    lines.push(paragraph(
        format!(
            "{} planes, {} hips, {} valleys, {} ridges; {} pieces in {} distinct members.",
            summary.planes.len(),
            summary.line_counts[0],
            summary.line_counts[1],
            summary.line_counts[2],
            summary.piece_count,
            deck.members.len()
        ),
        1.0,
        false,
    ));
    let total_area: f64 = summary.planes.iter().map(|plane| plane.eave_area_sq_in).sum();
    for plane in &summary.planes {
        lines.push(paragraph(
            format!(
                "Plane on wall {}: {} in 12, {:.1} sq ft to the wall line, {:.1} sq ft with the overhang",
                plane.wall_number,
                figure_text(plane.rise_in_12),
                plane.area_sq_in / 144.0,
                plane.eave_area_sq_in / 144.0
            ),
            1.0,
            false,
        ));
    }
    lines.push(paragraph(
        format!("Roof area with overhangs: {:.1} sq ft (sloped).", total_area / 144.0),
        1.0,
        false,
    ));
    for (index, height) in summary.ridge_heights_in.iter().enumerate() {
        lines.push(paragraph(
            format!(
                "Ridge {}: {} above the wall line (theoretical, at the centre line).",
                index + 1,
                length_text(*height, style)
            ),
            1.0,
            false,
        ));
    }
    lines.push(paragraph("MEMBERS", 1.2, true));
    for member in &deck.members {
        lines.push(paragraph(
            format!(
                "{}: {} x{}, {}, overall {}",
                member.label,
                member.kind,
                member.count,
                member.size,
                length_text(member.lengths.overall_in, style)
            ),
            1.0,
            false,
        ));
    }
    let warnings: Vec<String> = deck
        .warnings
        .iter()
        .cloned()
        .chain(
            deck.members
                .iter()
                .flat_map(|member| member.warnings.iter().map(move |w| format!("{}: {w}", member.label))),
        )
        .collect();
    let mut head = paragraph("WARNINGS", 1.2, true);
    head.colour = RED;
    lines.push(head);
    if warnings.is_empty() {
        lines.push(paragraph("None.", 1.0, false));
    }
    for warning in warnings {
        let mut p = paragraph(format!("WARNING: {warning}"), 1.0, true);
        p.colour = RED;
        lines.push(p);
    }
    lines.push(paragraph("LUMBER ORDER", 1.2, true));
    match &deck.lumber {
        None => lines.push(paragraph("No lumber order was made.", 1.0, false)),
        Some(order) => {
            for size in &order.sizes {
                let counts: Vec<String> = size
                    .stock_counts
                    .iter()
                    .map(|count| format!("{} x {}", count.count, length_text(count.stock_in, style)))
                    .collect();
                lines.push(paragraph(
                    format!(
                        "{}: {} ({} boards); waste {:.1} %, no order could waste less than {:.1} % ({}).",
                        size.size,
                        counts.join(", "),
                        size.boards.len(),
                        size.waste_percent(),
                        size.lower_bound_waste_percent(),
                        match size.method {
                            crate::PackingMethod::Exact => "proven best",
                            crate::PackingMethod::Heuristic => "heuristic",
                        }
                    ),
                    1.0,
                    false,
                ));
            }
            for splice in &order.needs_splice {
                let mut p = paragraph(
                    format!(
                        "NEEDS A SPLICE OR SPECIAL ORDER: {} ({} x {}) at {} is longer than the longest stock, {}.",
                        splice.label,
                        splice.count,
                        splice.size,
                        length_text(splice.length_in, style),
                        length_text(splice.longest_stock_in, style)
                    ),
                    1.0,
                    true,
                );
                p.colour = RED;
                lines.push(p);
            }
            lines.push(paragraph(
                format!(
                    "Allowing a {} saw kerf and {} trim on every piece.",
                    length_text(order.settings.kerf_in, LengthStyle::Inches),
                    length_text(order.settings.trim_in, LengthStyle::Inches)
                ),
                1.0,
                false,
            ));
        }
    }
    lines.push(paragraph("CAUTIONS", 1.2, true));
    for caution in CAUTIONS {
        lines.push(paragraph(format!("\u{2022} {caution}"), 1.0, false));
    }

    // Flow the words under the plan, then onto as many pages as they need.
    let mut pages = Vec::new();
    let mut area = Area::new(MARGIN, MARGIN + 10.0, width, plan_area.corner.y - 8.0 - MARGIN - 10.0);
    let size = 8.0;
    let mut y = area.top();
    for line in &lines {
        let text_size = size * line.relative;
        for text in wrap(&line.text, area.size.x, text_size, line.bold) {
            if y - text_size * 1.25 < area.corner.y {
                footer(&mut page, deck);
                pages.push(std::mem::replace(&mut page, Page::new(paper.x, paper.y)));
                area = Area::new(MARGIN, MARGIN + 10.0, width, paper.y - 2.0 * MARGIN - 10.0);
                y = area.top();
            }
            y -= text_size * 1.25;
            page.fill_colour(line.colour);
            page.text(DVec2::new(area.corner.x, y), text_size, line.bold, &text);
        }
        y -= 2.0;
    }
    footer(&mut page, deck);
    pages.push(page);
    pages
}

/// The exact printed length of the scale bar on templates, points, and its
/// words: 6 in on inch plans, 150 mm on metric ones.
pub fn scale_bar_pt(style: LengthStyle) -> (f64, &'static str) {
    match style {
        LengthStyle::Millimetres => (150.0 * POINTS_PER_MM, "150 mm"),
        _ => (6.0 * POINTS_PER_IN, "6 in"),
    }
}

fn scale_bar(page: &mut Page, style: LengthStyle, at: DVec2) {
    let (length, words) = scale_bar_pt(style);
    let (ticks, step) = match style {
        LengthStyle::Millimetres => (15, 10.0 * POINTS_PER_MM),
        _ => (6, POINTS_PER_IN),
    };
    page.line_width(0.5);
    page.stroke_colour(BLACK);
    page.rect(at, DVec2::new(length, 8.0), None, true);
    for tick in 0..ticks {
        if tick % 2 == 0 {
            page.rect(
                at + DVec2::new(f64::from(tick) * step, 0.0),
                DVec2::new(step, 8.0),
                Some(BLACK),
                false,
            );
        }
    }
    page.fill_colour(BLACK);
    page.text(
        at + DVec2::new(0.0, 12.0),
        8.0,
        true,
        &format!("SCALE CHECK: this bar must measure exactly {words}. If it does not, print again at actual size (100 %, no fit to page)."),
    );
}

/// Full-size pages for one member: its upper end seen from the side and,
/// where it has cheek cuts, from the top; each with a scale bar.
fn template_pages(deck: &CardDeck, member: &MemberCard, paper: DVec2) -> Vec<Page> {
    let mut pages = Vec::new();
    let mut views = vec![("side face", &member.side_view)];
    if let Some(top) = &member.top_view {
        views.push(("top face, cheek cuts", top));
    }
    for (which_end, upper) in [("upper end", true), ("lower end", false)] {
        for (face_name, view) in &views {
            let Some((low, high)) = bounds(&view.outline) else { continue };
            let mut page = Page::new(paper.x, paper.y);
            let window =
                Area::new(MARGIN, MARGIN + 60.0, paper.x - 2.0 * MARGIN, paper.y - 2.0 * MARGIN - 100.0);
            let window_in = window.size / POINTS_PER_IN;
            // The end sits against the window's outer side at 1:1.
            let origin_x = if upper { high.x + 0.5 - window_in.x } else { low.x - 0.5 };
            let origin_y = low.y - 0.5 * (window_in.y - (high.y - low.y)).max(0.0);
            let fit = Fit {
                scale: POINTS_PER_IN,
                origin: window.corner - DVec2::new(origin_x, origin_y) * POINTS_PER_IN,
            };
            page.save();
            page.clip_rect(window.corner, window.size);
            member_view(&mut page, view, fit, 10.0);
            page.restore();
            page.fill_colour(BLACK);
            page.text(
                DVec2::new(MARGIN, paper.y - MARGIN - 14.0),
                14.0,
                true,
                &format!("{} {} - {}, {} - FULL SIZE (1:1)", member.label, member.kind, which_end, face_name),
            );
            page.text(
                DVec2::new(MARGIN, paper.y - MARGIN - 28.0),
                8.0,
                false,
                "Cut out along the bold outline and hold it on the member to mark the cut. Tags name each cut face.",
            );
            let mut y = paper.y - MARGIN - 40.0;
            for face in CutFace::ALL.iter().filter(|face| view.faces.iter().any(|f| f.face == **face)) {
                tag(&mut page, DVec2::new(MARGIN + 8.0, y + 2.5), 7.0, face.tag());
                page.fill_colour(BLACK);
                page.text(DVec2::new(MARGIN + 18.0, y), 7.0, false, face.name());
                y -= 10.0;
            }
            scale_bar(&mut page, deck.length_style, DVec2::new(MARGIN, MARGIN + 16.0));
            footer(&mut page, deck);
            pages.push(page);
        }
    }
    pages
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn a4_is_210_by_297_mm() {
        // ISO 216: A4 is 210 x 297 mm; 1 in = 25.4 mm = 72 pt.
        let size = Paper::A4.size_pt();
        assert!((size.x - 595.2756).abs() < 1e-3 && (size.y - 841.8898).abs() < 1e-3);
    }

    #[test]
    fn scale_bar_is_six_inches_or_150_mm() {
        assert_eq!(scale_bar_pt(LengthStyle::FeetInches).0, 432.0);
        assert!((scale_bar_pt(LengthStyle::Millimetres).0 - 425.1969).abs() < 1e-3);
    }
}
