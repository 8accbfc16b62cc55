//! A small vector page: lines, filled and hatched shapes and Helvetica
//! text, written as a PDF content stream, and the document around pages.
//!
//! Coordinates are PDF points (1/72 in) from the page's lower left corner.
//! Text uses the standard Helvetica fonts every PDF reader carries, so no
//! font file ships with the program; text is encoded as WinAnsi.

use std::fmt::Write as _;

use glam::DVec2;
use lopdf::{Dictionary, Document, Object, Stream, dictionary};

/// Helvetica advance widths (1/1000 em) for ASCII 32..=126, from Adobe's
/// published core-font metrics.
const HELVETICA_WIDTHS: [u16; 95] = [
    278, 278, 355, 556, 556, 889, 667, 191, 333, 333, 389, 584, 278, 333, 278, 278, 556, 556, 556, 556, 556,
    556, 556, 556, 556, 556, 278, 278, 584, 584, 584, 556, 1015, 667, 667, 722, 722, 667, 611, 778, 722, 278,
    500, 667, 556, 833, 722, 778, 667, 778, 722, 667, 611, 722, 667, 944, 667, 667, 611, 278, 278, 278, 469,
    556, 333, 556, 556, 500, 556, 556, 278, 556, 556, 222, 222, 500, 222, 833, 556, 556, 556, 556, 333, 500,
    278, 556, 500, 722, 500, 500, 500, 334, 260, 334, 584,
];

/// Helvetica-Bold runs wider than Helvetica; measuring it 10 % wide keeps
/// bold text inside its box without a second table.
const BOLD_WIDTH_FACTOR: f64 = 1.1;

/// A character in WinAnsi and its Helvetica width, or `None` for a
/// character the standard fonts cannot show.
fn win_ansi(character: char) -> Option<(u8, u16)> {
    let code = character as u32;
    if (32..=126).contains(&code) {
        let index = (code - 32) as usize;
        return HELVETICA_WIDTHS.get(index).map(|&width| (code as u8, width));
    }
    match character {
        '\u{b0}' => Some((0xB0, 400)),
        '\u{d7}' => Some((0xD7, 584)),
        '\u{bd}' => Some((0xBD, 834)),
        '\u{bc}' => Some((0xBC, 834)),
        '\u{be}' => Some((0xBE, 834)),
        '\u{2013}' => Some((0x96, 556)),
        '\u{2014}' => Some((0x97, 1000)),
        '\u{2019}' => Some((0x92, 222)),
        '\u{2022}' => Some((0x95, 350)),
        _ => None,
    }
}

/// The width of `text` in points at `size` as the cards set it (Helvetica,
/// or Helvetica-Bold measured 10 % wide).
pub fn text_width(text: &str, size: f64, bold: bool) -> f64 {
    let thousandths: u32 =
        text.chars().map(|character| u32::from(win_ansi(character).map_or(556, |(_, width)| width))).sum();
    let factor = if bold { BOLD_WIDTH_FACTOR } else { 1.0 };
    f64::from(thousandths) * size / 1000.0 * factor
}

/// Unit words kept on the line of the number before them.
const UNITS: [&str; 3] = ["deg", "mm", "%"];

/// Breaks `text` into lines no wider than `width` points at `size`.
pub(crate) fn wrap(text: &str, width: f64, size: f64, bold: bool) -> Vec<String> {
    let mut lines = Vec::new();
    let mut line = String::new();
    // A unit stays on the line of its number ("26.6 deg", "173 mm").
    let mut words: Vec<String> = Vec::new();
    for word in text.split_whitespace() {
        match words.last_mut() {
            Some(last)
                if UNITS.iter().any(|unit| word.trim_end_matches([',', ';', ')', '.', ':']) == *unit) =>
            {
                last.push(' ');
                last.push_str(word);
            }
            _ => words.push(word.to_string()),
        }
    }
    for word in &words {
        let candidate = if line.is_empty() { word.to_string() } else { format!("{line} {word}") };
        if text_width(&candidate, size, bold) <= width || line.is_empty() {
            line = candidate;
        } else {
            lines.push(std::mem::take(&mut line));
            line = word.to_string();
        }
    }
    if !line.is_empty() {
        lines.push(line);
    }
    lines
}

/// Appends `value` to a content stream with at most `places` decimals
/// (trailing zeros dropped). Hand-rolled because the standard float
/// formatting dominated the time to write a deck of cards.
fn push_num(out: &mut String, value: f64, places: u32) {
    let scale = 10_i64.pow(places);
    let scaled = if value.is_finite() { (value * scale as f64).round() as i64 } else { 0 };
    if scaled < 0 {
        out.push('-');
    }
    let magnitude = scaled.unsigned_abs();
    let (whole, mut fraction) = (magnitude / scale as u64, magnitude % scale as u64);
    let _ = write!(out, "{whole}");
    if fraction != 0 {
        let mut digits = places;
        while fraction % 10 == 0 {
            fraction /= 10;
            digits -= 1;
        }
        let _ = write!(out, ".{fraction:0width$}", width = digits as usize);
    }
}

/// An RGB colour, each part 0..1.
pub(crate) type Rgb = [f32; 3];

/// Black ink.
pub(crate) const BLACK: Rgb = [0.0, 0.0, 0.0];
/// Mid grey for construction lines and the framing square.
pub(crate) const GREY: Rgb = [0.55, 0.55, 0.55];
/// Warning red (always printed beside the word WARNING, so it reads in
/// black and white too).
pub(crate) const RED: Rgb = [0.75, 0.05, 0.05];

/// One page being drawn (or one shared drawing, see [`Forms`]).
pub(crate) struct Page {
    /// Page width, points.
    pub width: f64,
    /// Page height, points.
    pub height: f64,
    ops: String,
}

/// A PDF string literal, still as `char`s: characters the fonts lack become
/// `?`, and WinAnsi bytes are made when the stream is written.
fn push_literal(out: &mut String, text: &str) {
    out.push('(');
    for character in text.chars() {
        let shown = if win_ansi(character).is_some() { character } else { '?' };
        if matches!(shown, '(' | ')' | '\\') {
            out.push('\\');
        }
        out.push(shown);
    }
    out.push(')');
}

impl Page {
    /// A blank page of the given size in points.
    pub fn new(width: f64, height: f64) -> Self {
        Self { width, height, ops: String::with_capacity(16 * 1024) }
    }

    fn op(&mut self, text: &str) {
        self.ops.push_str(text);
        self.ops.push('\n');
    }

    /// Writes numbers then an operator; `places` decimals for each number.
    fn numbers_op(&mut self, numbers: &[f64], places: u32, operator: &str) {
        for number in numbers {
            push_num(&mut self.ops, *number, places);
            self.ops.push(' ');
        }
        self.op(operator);
    }

    /// Sets the stroke colour.
    pub fn stroke_colour(&mut self, colour: Rgb) {
        self.numbers_op(&colour.map(f64::from), 3, "RG");
    }

    /// Sets the fill colour (also the text colour).
    pub fn fill_colour(&mut self, colour: Rgb) {
        self.numbers_op(&colour.map(f64::from), 3, "rg");
    }

    /// Sets the line width in points.
    pub fn line_width(&mut self, width: f64) {
        self.numbers_op(&[width], 3, "w");
    }

    /// Sets a dash pattern (empty for solid lines).
    pub fn dash(&mut self, pattern: &[f64]) {
        self.ops.push('[');
        for (index, part) in pattern.iter().enumerate() {
            if index > 0 {
                self.ops.push(' ');
            }
            push_num(&mut self.ops, *part, 2);
        }
        self.op("] 0 d");
    }

    fn path(&mut self, points: &[DVec2], close: bool) -> bool {
        let Some(first) = points.first() else { return false };
        self.numbers_op(&[first.x, first.y], 2, "m");
        for point in points.iter().skip(1) {
            self.numbers_op(&[point.x, point.y], 2, "l");
        }
        if close {
            self.op("h");
        }
        true
    }

    /// A straight line.
    pub fn line(&mut self, from: DVec2, to: DVec2) {
        self.polyline(&[from, to]);
    }

    /// An open polyline.
    pub fn polyline(&mut self, points: &[DVec2]) {
        if self.path(points, false) {
            self.op("S");
        }
    }

    /// A closed polygon, filled and/or outlined.
    pub fn polygon(&mut self, points: &[DVec2], fill: Option<Rgb>, stroke: bool) {
        if points.len() < 2 {
            return;
        }
        if let Some(colour) = fill {
            self.fill_colour(colour);
        }
        self.path(points, true);
        self.op(match (fill.is_some(), stroke) {
            (true, true) => "B",
            (true, false) => "f",
            (false, true) => "S",
            (false, false) => "n",
        });
    }

    /// An axis-aligned rectangle from its lower left corner, with the
    /// rectangle operator so its exact size can be read back from the file.
    pub fn rect(&mut self, corner: DVec2, size: DVec2, fill: Option<Rgb>, stroke: bool) {
        if let Some(colour) = fill {
            self.fill_colour(colour);
        }
        self.numbers_op(&[corner.x, corner.y, size.x, size.y], 4, "re");
        self.op(match (fill.is_some(), stroke) {
            (true, true) => "B",
            (true, false) => "f",
            (false, true) => "S",
            (false, false) => "n",
        });
    }

    /// Parallel lines `spacing` points apart at `angle_deg` from level,
    /// clipped to the polygon.
    pub fn hatch(&mut self, points: &[DVec2], angle_deg: f64, spacing: f64) {
        if points.len() < 3 || spacing <= 0.0 {
            return;
        }
        self.op("q");
        self.path(points, true);
        self.op("W n");
        let (mut low, mut high) = (DVec2::splat(f64::INFINITY), DVec2::splat(f64::NEG_INFINITY));
        for point in points {
            low = low.min(*point);
            high = high.max(*point);
        }
        // Only the part on the page is hatched: a full-size template shows
        // a few inches of a member many feet long.
        low = low.max(DVec2::ZERO);
        high = high.min(DVec2::new(self.width, self.height));
        if low.x >= high.x || low.y >= high.y {
            self.op("Q");
            return;
        }
        let centre = 0.5 * (low + high);
        let reach = 0.5 * (high - low).length() + spacing;
        let along = DVec2::from_angle(angle_deg.to_radians());
        let across = along.perp();
        let steps = (reach / spacing).ceil() as i64;
        for step in -steps..=steps {
            let offset = centre + across * (step as f64 * spacing);
            let (from, to) = (offset - along * reach, offset + along * reach);
            self.numbers_op(&[from.x, from.y], 2, "m");
            self.numbers_op(&[to.x, to.y], 2, "l");
        }
        self.op("S Q");
    }

    /// Text with its baseline starting at `at`.
    pub fn text(&mut self, at: DVec2, size: f64, bold: bool, text: &str) {
        self.text_rotated(at, size, bold, text, 0.0);
    }

    /// Text rotated `angle_rad` counter-clockwise about its start.
    pub fn text_rotated(&mut self, at: DVec2, size: f64, bold: bool, text: &str, angle_rad: f64) {
        let font = if bold { "BT /F2 " } else { "BT /F1 " };
        self.ops.push_str(font);
        self.numbers_op(&[size], 2, "Tf");
        let (sin, cos) = angle_rad.sin_cos();
        self.numbers_op(&[cos, sin, -sin, cos, at.x, at.y], 4, "Tm");
        push_literal(&mut self.ops, text);
        self.op(" Tj ET");
    }

    /// Text centred on `at` horizontally.
    pub fn text_centred(&mut self, at: DVec2, size: f64, bold: bool, text: &str) {
        let width = text_width(text, size, bold);
        self.text(DVec2::new(at.x - width / 2.0, at.y), size, bold, text);
    }

    /// Saves the graphics state.
    pub fn save(&mut self) {
        self.op("q");
    }

    /// Restores the graphics state.
    pub fn restore(&mut self) {
        self.op("Q");
    }

    /// Clips what follows (until `restore`) to a rectangle.
    pub fn clip_rect(&mut self, corner: DVec2, size: DVec2) {
        self.numbers_op(&[corner.x, corner.y, size.x, size.y], 2, "re W n");
    }

    /// Draws shared drawing number `form` (from [`Forms`]) with its lower
    /// left corner at `at`.
    pub fn form(&mut self, form: usize, at: DVec2) {
        self.numbers_op(&[1.0, 0.0, 0.0, 1.0, at.x, at.y], 3, "cm");
        let _ = writeln!(self.ops, "/Fm{form} Do");
    }

    /// The content stream written so far, for tests to read.
    #[cfg(test)]
    pub fn ops(&self) -> &str {
        &self.ops
    }

    fn into_content(self) -> Vec<u8> {
        // Text keeps its characters until here; the fonts read WinAnsi bytes.
        let mut bytes = Vec::with_capacity(self.ops.len());
        for character in self.ops.chars() {
            match win_ansi(character) {
                Some((code, _)) if !character.is_ascii() => bytes.push(code),
                _ if character.is_ascii() => bytes.push(character as u8),
                _ => bytes.push(b'?'),
            }
        }
        bytes
    }
}

/// Drawings repeated on many pages (the roof plan behind every card),
/// written once into the file as form objects and placed by reference.
#[derive(Default)]
pub(crate) struct Forms {
    forms: Vec<Page>,
    keys: std::collections::HashMap<String, usize>,
}

impl Forms {
    /// The form known by `key`, drawn by `draw` into a box of `size`
    /// points the first time it is asked for.
    pub fn get_or_draw(&mut self, key: String, size: DVec2, draw: impl FnOnce(&mut Page)) -> usize {
        if let Some(&index) = self.keys.get(&key) {
            return index;
        }
        let mut page = Page::new(size.x, size.y);
        draw(&mut page);
        self.forms.push(page);
        let index = self.forms.len() - 1;
        self.keys.insert(key, index);
        index
    }
}

/// A content stream, deflated.
fn deflated_stream(dict: Dictionary, content: Vec<u8>) -> Stream {
    let mut stream = Stream::new(dict, content);
    // A stream that will not deflate is written as it is.
    let _ = stream.compress();
    stream.allows_compression = false;
    stream
}

/// Writes pages and the forms they place into one PDF file.
pub(crate) fn write_document(pages: Vec<Page>, forms: Forms, title: &str) -> Result<Vec<u8>, std::io::Error> {
    let mut doc = Document::with_version("1.5");
    let pages_id = doc.new_object_id();
    let font = |name: &str| {
        dictionary! {
            "Type" => "Font",
            "Subtype" => "Type1",
            "BaseFont" => Object::Name(name.as_bytes().to_vec()),
            "Encoding" => "WinAnsiEncoding",
        }
    };
    let regular = doc.add_object(font("Helvetica"));
    let bold = doc.add_object(font("Helvetica-Bold"));
    let fonts = doc.add_object(dictionary! { "F1" => regular, "F2" => bold });
    let form_resources = doc.add_object(dictionary! { "Font" => fonts });
    let mut xobjects = Dictionary::new();
    for (index, form) in forms.forms.into_iter().enumerate() {
        let (width, height) = (form.width, form.height);
        let dict = dictionary! {
            "Type" => "XObject",
            "Subtype" => "Form",
            "BBox" => vec![0.into(), 0.into(), Object::Real(width as f32), Object::Real(height as f32)],
            "Resources" => form_resources,
        };
        let id = doc.add_object(deflated_stream(dict, form.into_content()));
        xobjects.set(format!("Fm{index}"), id);
    }
    let resources = doc.add_object(dictionary! { "Font" => fonts, "XObject" => xobjects });
    let mut kids = Vec::with_capacity(pages.len());
    for page in pages {
        let (width, height) = (page.width, page.height);
        let content = doc.add_object(deflated_stream(Dictionary::new(), page.into_content()));
        let page_id = doc.add_object(dictionary! {
            "Type" => "Page",
            "Parent" => pages_id,
            "Contents" => content,
            "Resources" => resources,
            "MediaBox" => vec![0.into(), 0.into(), Object::Real(width as f32), Object::Real(height as f32)],
        });
        kids.push(Object::Reference(page_id));
    }
    let count = kids.len() as i64;
    doc.objects.insert(
        pages_id,
        Object::Dictionary(dictionary! { "Type" => "Pages", "Kids" => kids, "Count" => count }),
    );
    let catalog = doc.add_object(dictionary! { "Type" => "Catalog", "Pages" => pages_id });
    doc.trailer.set("Root", catalog);
    let info = doc.add_object(dictionary! {
        "Title" => Object::string_literal(title),
        "Producer" => Object::string_literal("Pitchframe"),
    });
    doc.trailer.set("Info", info);
    let mut bytes = Vec::new();
    doc.save_to(&mut bytes)?;
    Ok(bytes)
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn numbers_are_written_short_and_exact_to_their_places() {
        let mut out = String::new();
        for (value, places) in [(12.0, 2), (-0.004, 2), (1.23456, 3), (-2.5, 2), (0.125, 2), (f64::NAN, 2)] {
            push_num(&mut out, value, places);
            out.push(' ');
        }
        // Rounded half away from zero, as f64::round does.
        assert_eq!(out, "12 0 1.235 -2.5 0.13 0 ");
    }
}
