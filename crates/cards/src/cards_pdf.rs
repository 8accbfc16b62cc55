//! The cut cards as a PDF: a cover sheet, one card per distinct member, and
//! full-size end templates on request.

use glam::DVec2;
use pitchframe_geometry::LengthStyle;
use serde::Serialize;
use thiserror::Error;

use crate::card_page::{self, MIN_TEXT_PT};
use crate::drawing::{Area, Fit, bounds, length_text, member_view, roof_plan, tag};
use crate::pdf_page::{BLACK, Forms, GREY, Page, RED, wrap, write_document};
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
    render_cards_with_progress(deck, options, &|_, _| {})
}

/// [`render_cards`], telling `progress(done, total)` after each card and
/// template and once more when the file is written, so a window can show
/// how far a large job has gone.
pub fn render_cards_with_progress(
    deck: &CardDeck,
    options: &CardOptions,
    progress: &dyn Fn(usize, usize),
) -> Result<Vec<u8>, CardsError> {
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
    let mut sheets = Sheets::new(paper, options.per_page);
    let total_cards = deck.members.len();
    // The cover, each card, each template and the writing of the file.
    let steps = 1 + total_cards + template_members.len() + 1;
    progress(1, steps);
    for (index, member) in deck.members.iter().enumerate() {
        place_card(&mut sheets, &mut forms, deck, member, &format!("card {} of {total_cards}", index + 1));
        progress(2 + index, steps);
    }
    pages.extend(sheets.finish(deck));
    for (index, member) in template_members.into_iter().enumerate() {
        pages.extend(template_pages(deck, member, paper));
        progress(2 + total_cards + index, steps);
    }
    let pdf = write_document(pages, forms, &deck.title)?;
    progress(steps, steps);
    Ok(pdf)
}

/// How much of a page a card is given.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
enum Span {
    /// One slot.
    One,
    /// Two slots one above the other (four a page only).
    Column,
    /// The whole page.
    Page,
}

/// The card pages being filled, slot by slot. Every page stays open: a
/// card goes into the first page with room for it, so a card that needs a
/// whole page does not leave the slots before it blank (the cards after it
/// fill them; each card keeps its number).
struct Sheets {
    paper: DVec2,
    slots: Vec<Area>,
    pages: Vec<Page>,
    used: Vec<Vec<bool>>,
    /// The page being drawn on.
    current: usize,
}

impl Sheets {
    fn new(paper: DVec2, per_page: u8) -> Self {
        let slots = card_slots(paper, per_page);
        Self { paper, slots, pages: Vec::new(), used: Vec::new(), current: 0 }
    }

    /// The spans worth trying, smallest first.
    fn spans(&self) -> &'static [Span] {
        match self.slots.len() {
            1 => &[Span::Page],
            2 => &[Span::One, Span::Page],
            _ => &[Span::One, Span::Column, Span::Page],
        }
    }

    fn full_page(&self) -> Area {
        Area::new(MARGIN, MARGIN + 10.0, self.paper.x - 2.0 * MARGIN, self.paper.y - 2.0 * MARGIN - 10.0)
    }

    /// The area a span would take (the first one of its shape).
    fn shape(&self, span: Span) -> Area {
        match (span, self.slots.as_slice()) {
            (Span::One, [first, ..]) => *first,
            (Span::Column, [top, _, bottom, ..]) => {
                Area::new(bottom.corner.x, bottom.corner.y, top.size.x, top.top() - bottom.corner.y)
            }
            _ => self.full_page(),
        }
    }

    /// The first free area of the span's shape on a page whose slots are
    /// `used`, and the slots it covers.
    fn free(&self, used: &[bool], span: Span) -> Option<(Vec<usize>, Area)> {
        match span {
            Span::One => {
                // Down the left column first, so single cards leave a whole
                // column free for a card that needs two slots.
                let order: &[usize] = if used.len() == 4 { &[0, 2, 1, 3] } else { &[0, 1] };
                let slot = order.iter().copied().find(|&slot| used.get(slot) == Some(&false))?;
                Some((vec![slot], *self.slots.get(slot)?))
            }
            Span::Column => (0..2).find_map(|column| {
                let (top, bottom) = (column, column + 2);
                let both_free = !*used.get(top)? && !*used.get(bottom)?;
                let (a, b) = (self.slots.get(top)?, self.slots.get(bottom)?);
                both_free.then(|| {
                    (vec![top, bottom], Area::new(b.corner.x, b.corner.y, a.size.x, a.top() - b.corner.y))
                })
            }),
            Span::Page => {
                used.iter().all(|used| !used).then(|| ((0..used.len()).collect(), self.full_page()))
            }
        }
    }

    /// Takes the first free area of the span's shape on the earliest page
    /// with room (from page `from` on), starting a new page when none has;
    /// makes that page the one drawn on.
    fn take_from(&mut self, span: Span, from: usize) -> Area {
        let found = self
            .used
            .iter()
            .enumerate()
            .skip(from)
            .find_map(|(index, used)| self.free(used, span).map(|(taken, area)| (index, taken, area)));
        let (index, taken, area) = match found {
            Some(found) => found,
            None => {
                self.pages.push(Page::new(self.paper.x, self.paper.y));
                self.used.push(vec![false; self.slots.len()]);
                let index = self.pages.len() - 1;
                let (taken, area) = self
                    .free(&vec![false; self.slots.len()], span)
                    .unwrap_or_else(|| (vec![], self.full_page()));
                (index, taken, area)
            }
        };
        if let Some(used) = self.used.get_mut(index) {
            for slot in taken {
                if let Some(used) = used.get_mut(slot) {
                    *used = true;
                }
            }
        }
        self.current = index;
        area
    }

    /// A new whole page right after the current one, for a card's
    /// continuation.
    fn take_next_page(&mut self) -> Area {
        let at = (self.current + 1).min(self.pages.len());
        self.pages.insert(at, Page::new(self.paper.x, self.paper.y));
        self.used.insert(at, vec![true; self.slots.len()]);
        self.current = at;
        self.full_page()
    }

    /// The page being drawn on.
    fn page(&mut self) -> &mut Page {
        if self.pages.is_empty() {
            self.pages.push(Page::new(self.paper.x, self.paper.y));
            self.used.push(vec![false; self.slots.len()]);
        }
        let last = self.pages.len() - 1;
        let index = self.current.min(last);
        &mut self.pages[index]
    }

    fn finish(mut self, deck: &CardDeck) -> Vec<Page> {
        for page in &mut self.pages {
            footer(page, deck);
        }
        self.pages
    }
}

/// Starts a card (or its continuation) in a fresh area: the frame and the
/// header; returns the area inside the frame and the height below the
/// header.
fn start_card_part(
    sheets: &mut Sheets,
    span: Span,
    member: &MemberCard,
    deck: &CardDeck,
    numbering: &str,
    continued: bool,
) -> (Area, f64) {
    let area = if continued { sheets.take_next_page() } else { sheets.take_from(span, 0) };
    let page = sheets.page();
    page.line_width(0.8);
    page.stroke_colour(BLACK);
    page.rect(area.corner, area.size, None, true);
    let inner = area.inset(card_page::PAD);
    let header = card_page::draw_header(page, member, deck.length_style, inner, numbering, continued);
    (inner, inner.top() - header - card_page::BLOCK_GAP)
}

/// Lays one card into the smallest span it fits at full type size,
/// continuing onto further pages when a page is not enough.
fn place_card(sheets: &mut Sheets, forms: &mut Forms, deck: &CardDeck, member: &MemberCard, numbering: &str) {
    let full = sheets.full_page();
    let chosen = sheets.spans().iter().find_map(|&span| {
        let area = sheets.shape(span);
        let layout = card_page::layout(member, deck, area.size.x - 2.0 * card_page::PAD);
        (layout.height() <= area.size.y).then_some((span, layout))
    });
    let (span, layout) = chosen
        .unwrap_or_else(|| (Span::Page, card_page::layout(member, deck, full.size.x - 2.0 * card_page::PAD)));
    let (mut inner, mut y) = start_card_part(sheets, span, member, deck, numbering, false);
    let mut in_this_part = 0;
    for (index, height) in card_page::block_heights(&layout).into_iter().enumerate() {
        if y - height < inner.corner.y - 0.5 && in_this_part > 0 {
            (inner, y) = start_card_part(sheets, Span::Page, member, deck, numbering, true);
            in_this_part = 0;
        }
        let area = Area::new(inner.corner.x, y - height, inner.size.x, height);
        card_page::draw_block(sheets.page(), forms, deck, member, &layout, index, area);
        y -= height + card_page::BLOCK_GAP;
        in_this_part += 1;
    }
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
        MIN_TEXT_PT,
        false,
        &format!("{} - Pitchframe gives geometry; local codes and licensed professionals govern sizing and connections.", deck.title),
    );
}

/// A paragraph of the cover sheet: its text, size relative to the base,
/// weight and colour.
struct Paragraph {
    text: String,
    relative: f64,
    bold: bool,
    colour: [f32; 3],
}

fn paragraph(text: impl Into<String>, relative: f64, bold: bool) -> Paragraph {
    Paragraph { text: text.into(), relative, bold, colour: BLACK }
}

/// An area for people: square feet on inch plans, square metres on
/// metric ones.
fn area_text(sq_in: f64, style: LengthStyle) -> String {
    if style == LengthStyle::Millimetres {
        format!("{:.1} sq m", sq_in * 0.0254 * 0.0254)
    } else {
        format!("{:.1} sq ft", sq_in / 144.0)
    }
}

/// The frame's and the members' warnings, each written once with every
/// label it is on ("HJ1, HJ4: the upper end cut needs ..."), in the order
/// they first appear.
fn grouped_warnings(deck: &CardDeck) -> Vec<String> {
    let mut groups: Vec<(String, Vec<String>)> = Vec::new();
    let mut add = |label: &str, text: &str| match groups.iter_mut().find(|(words, _)| words == text) {
        Some((_, labels)) => {
            if !labels.iter().any(|known| known == label) {
                labels.push(label.to_string());
            }
        }
        None => groups.push((text.to_string(), vec![label.to_string()])),
    };
    for warning in &deck.warnings {
        // Frame warnings are written "LABEL: words".
        match warning.split_once(": ") {
            Some((label, text)) if !label.contains(' ') => add(label, text),
            _ => add("", warning),
        }
    }
    for member in &deck.members {
        for warning in &member.warnings {
            add(&member.label, warning);
        }
    }
    groups
        .into_iter()
        .map(|(text, labels)| {
            let labels: Vec<String> = labels.into_iter().filter(|label| !label.is_empty()).collect();
            if labels.is_empty() { text } else { format!("{}: {text}", labels.join(", ")) }
        })
        .collect()
}

/// The cover sheet and, when it runs over, its following pages.
fn cover_pages(deck: &CardDeck, paper: DVec2) -> Vec<Page> {
    let style = deck.length_style;
    // Short lengths (kerf, trim) in inches alone, or millimetres.
    let short_style = if style == LengthStyle::Millimetres { style } else { LengthStyle::Inches };
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
    // The key runs along the box's foot, below the drawing.
    let drawing = plan_area.inset(8.0);
    let key_h = MIN_TEXT_PT * 1.6;
    let drawing =
        Area::new(drawing.corner.x, drawing.corner.y + key_h, drawing.size.x, drawing.size.y - key_h);
    roof_plan(&mut page, None, deck, drawing, None, true);
    page.fill_colour(GREY);
    page.text(
        DVec2::new(plan_area.corner.x + 4.0, plan_area.corner.y + 4.0),
        MIN_TEXT_PT,
        false,
        "Plan: wall lines bold, eaves grey, ridges solid, hips dashed, valleys dotted; every piece with its label.",
    );

    // The cautions first, where every crew member reads them.
    let mut lines: Vec<Paragraph> = vec![paragraph("CAUTIONS", 1.2, true)];
    for caution in CAUTIONS {
        lines.push(paragraph(format!("\u{2022} {caution}"), 1.0, false));
    }
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
    let area = |sq_in: f64| area_text(sq_in, style);
    for plane in &summary.planes {
        let pitch = if style == LengthStyle::Millimetres {
            crate::square_figure::degrees_text(plane.rise_in_12.atan2(12.0).to_degrees())
        } else {
            format!("{} in 12", crate::square_figure_text(plane.rise_in_12, style))
        };
        lines.push(paragraph(
            format!(
                "Plane on wall {}: {pitch}, {} to the wall line, {} with the overhang",
                plane.wall_number,
                area(plane.area_sq_in),
                area(plane.eave_area_sq_in)
            ),
            1.0,
            false,
        ));
    }
    lines.push(paragraph(format!("Roof area with overhangs: {} (sloped).", area(total_area)), 1.0, false));
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
    let mut head = paragraph("WARNINGS", 1.2, true);
    head.colour = RED;
    lines.push(head);
    let warnings = grouped_warnings(deck);
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
                        "{}: {} ({} board{}); waste {:.1} %, no order could waste less than {:.1} % ({}).",
                        size.size,
                        counts.join(", "),
                        size.boards.len(),
                        if size.boards.len() == 1 { "" } else { "s" },
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
                    length_text(order.settings.kerf_in, short_style),
                    length_text(order.settings.trim_in, short_style)
                ),
                1.0,
                false,
            ));
        }
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
                Area::new(MARGIN, MARGIN + 60.0, paper.x - 2.0 * MARGIN, paper.y - 2.0 * MARGIN - 112.0);
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
            // The tags' key in one row above the window, clear of the drawing.
            let y = paper.y - MARGIN - 44.0;
            let mut x = MARGIN + 6.0;
            for face in CutFace::ALL.iter().filter(|face| view.faces.iter().any(|f| f.face == **face)) {
                tag(&mut page, DVec2::new(x, y + 2.5), 8.0, face.tag());
                page.fill_colour(BLACK);
                page.text(DVec2::new(x + 10.0, y), 8.0, false, face.name());
                x += 24.0 + crate::pdf_page::text_width(face.name(), 8.0, false);
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
