//! The demo house and the two example plans as card decks, and the text of
//! a rendered PDF read back with where each run of text sits.

// Test helpers may unwrap: a panic there is a failed test.
#![allow(clippy::unwrap_used, clippy::expect_used)]
#![allow(dead_code)]

use glam::DVec2;
use lopdf::content::Content;
use lopdf::{Document, Object};
use pitchframe_cards::{
    CardDeck, OrderSettings, StockSeries, card_deck, length_style, order_lumber, order_pieces, text_width,
};
use pitchframe_geometry::{LengthUnit, Plan, Roof, demo_plan, frame_roof};

/// A plan framed into a card deck with its lumber order, as the command
/// line makes it.
pub fn deck_of(title: &str, plan: Plan) -> CardDeck {
    let outline = plan.outline().unwrap();
    let roof = Roof::solve(&outline).unwrap();
    let frame = frame_roof(&outline, &roof, &plan.framing_settings().unwrap()).unwrap();
    let series = match plan.units {
        LengthUnit::Inch => StockSeries::Feet,
        LengthUnit::Millimetre => StockSeries::Metric,
    };
    let pieces = order_pieces(&frame, length_style(&plan));
    let order = order_lumber(&pieces, &OrderSettings::for_series(series)).ok();
    card_deck(title, &plan, &outline, &roof, &frame, order)
}

/// The demo house, the hillside cottage (inches) and the metric bungalow.
pub fn all_decks() -> Vec<CardDeck> {
    vec![
        deck_of("demo", demo_plan().unwrap()),
        deck_of(
            "hillside-cottage",
            Plan::from_toml(include_str!("../../../../examples/hillside-cottage.toml")).unwrap(),
        ),
        deck_of(
            "metric-bungalow",
            Plan::from_toml(include_str!("../../../../examples/metric-bungalow.toml")).unwrap(),
        ),
    ]
}

/// One run of text on a page: its words, size, and the four corners of
/// its box (baseline start, along the baseline, and up by its height).
#[derive(Debug, Clone)]
pub struct TextRun {
    pub text: String,
    pub size: f64,
    pub corners: [DVec2; 4],
}

fn number(object: &Object) -> f64 {
    object.as_float().map(f64::from).unwrap_or(0.0)
}

/// Every page's text runs, each boxed from the baseline's descender depth
/// (0.21 em) to the capital height (0.72 em), Helvetica's published
/// metrics, and its width from the same metrics the cards use.
pub fn text_runs(pdf: &[u8]) -> Vec<Vec<TextRun>> {
    let doc = Document::load_mem(pdf).expect("the PDF parses");
    doc.get_pages()
        .values()
        .map(|&page| {
            let content = Content::decode(&doc.get_page_content(page)).unwrap();
            let (mut size, mut bold) = (0.0, false);
            let mut matrix = [1.0, 0.0, 0.0, 1.0, 0.0, 0.0];
            let mut runs = Vec::new();
            for op in &content.operations {
                match op.operator.as_str() {
                    "Tf" => {
                        bold = op.operands.first().and_then(|o| o.as_name().ok()) == Some(b"F2".as_slice());
                        size = op.operands.get(1).map_or(0.0, number);
                    }
                    "Tm" => {
                        for (slot, operand) in matrix.iter_mut().zip(&op.operands) {
                            *slot = number(operand);
                        }
                    }
                    "Tj" => {
                        let Some(Object::String(bytes, _)) = op.operands.first() else { continue };
                        let text: String = bytes.iter().map(|&b| b as char).collect();
                        let along = DVec2::new(matrix[0], matrix[1]);
                        let up = DVec2::new(matrix[2], matrix[3]);
                        let start = DVec2::new(matrix[4], matrix[5]);
                        let width = text_width(&text, size, bold);
                        let low = start - up * (0.21 * size);
                        let high = start + up * (0.72 * size);
                        runs.push(TextRun {
                            text,
                            size,
                            corners: [low, low + along * width, high + along * width, high],
                        });
                    }
                    _ => {}
                }
            }
            runs
        })
        .collect()
}

/// Whether two convex quadrilaterals overlap by more than `slack` points
/// (separating axis test on their edge normals).
pub fn overlap(a: &[DVec2; 4], b: &[DVec2; 4], slack: f64) -> bool {
    let axes = a.iter().zip(a.iter().cycle().skip(1)).chain(b.iter().zip(b.iter().cycle().skip(1)));
    for (p, q) in axes {
        let Some(axis) = (*q - *p).perp().try_normalize() else { continue };
        let span = |quad: &[DVec2; 4]| {
            quad.iter()
                .map(|c| c.dot(axis))
                .fold((f64::INFINITY, f64::NEG_INFINITY), |(lo, hi), v| (lo.min(v), hi.max(v)))
        };
        let ((a_lo, a_hi), (b_lo, b_hi)) = (span(a), span(b));
        if a_hi - slack <= b_lo || b_hi - slack <= a_lo {
            return false;
        }
    }
    true
}

/// Every page's card frames: the rectangles stroked 0.8 pt wide, the
/// width the cards' frames are drawn at (close-ups and the plan's box are
/// thinner), as (width, height) in points.
pub fn card_frames(pdf: &[u8]) -> Vec<Vec<(f64, f64)>> {
    card_frame_boxes(pdf)
        .into_iter()
        .map(|frames| frames.into_iter().map(|[_, _, w, h]| (w, h)).collect())
        .collect()
}

/// Every page's card frames as `[x, y, width, height]`, points.
pub fn card_frame_boxes(pdf: &[u8]) -> Vec<Vec<[f64; 4]>> {
    let doc = Document::load_mem(pdf).expect("the PDF parses");
    doc.get_pages()
        .values()
        .map(|&page| {
            let content = Content::decode(&doc.get_page_content(page)).unwrap();
            let mut width = 1.0;
            let mut frames = Vec::new();
            for op in &content.operations {
                match op.operator.as_str() {
                    "w" => width = op.operands.first().map_or(1.0, number),
                    "re" if (width - 0.8).abs() < 1e-6 => {
                        let at = |index: usize| op.operands.get(index).map_or(0.0, number);
                        frames.push([at(0), at(1), at(2), at(3)]);
                    }
                    _ => {}
                }
            }
            frames
        })
        .collect()
}
