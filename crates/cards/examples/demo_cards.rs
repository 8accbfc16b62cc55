//! Writes the demo house's cut cards to a PDF, to look at them.
//!
//! `cargo run -p pitchframe-cards --example demo_cards -- [per_page] [letter|a4] [out.pdf] [template labels...]`

use std::process::ExitCode;

use pitchframe_cards::{
    CardOptions, OrderSettings, Paper, StockSeries, card_deck, length_style, order_lumber, order_pieces,
    render_cards,
};
use pitchframe_geometry::{FramingSettings, Roof, demo_plan, frame_roof};

fn main() -> ExitCode {
    let args: Vec<String> = std::env::args().skip(1).collect();
    let per_page = args.first().and_then(|a| a.parse().ok()).unwrap_or(2);
    let paper = match args.get(1).map(String::as_str) {
        Some("a4") => Paper::A4,
        _ => Paper::Letter,
    };
    let out = args.get(2).cloned().unwrap_or_else(|| "/tmp/cards.pdf".into());
    let templates = args.iter().skip(3).cloned().collect();
    match run(per_page, paper, &out, templates) {
        Ok(()) => ExitCode::SUCCESS,
        Err(message) => {
            eprintln!("demo_cards: {message}");
            ExitCode::from(2)
        }
    }
}

fn run(per_page: u8, paper: Paper, out: &str, templates: Vec<String>) -> Result<(), String> {
    let plan = demo_plan().map_err(|e| e.to_string())?;
    let outline = plan.outline().map_err(|e| e.to_string())?;
    let roof = Roof::solve(&outline).map_err(|e| e.to_string())?;
    let frame = frame_roof(&outline, &roof, &FramingSettings::default()).map_err(|e| e.to_string())?;
    let pieces = order_pieces(&frame, length_style(&plan));
    let order = order_lumber(&pieces, &OrderSettings::for_series(StockSeries::Feet)).ok();
    let deck = card_deck("Demo house", &plan, &outline, &roof, &frame, order);
    for member in &deck.members {
        println!("{} {} x{} cuts {}", member.label, member.kind, member.count, member.cuts.len());
    }
    let pdf = render_cards(&deck, &CardOptions { paper, per_page, templates }).map_err(|e| e.to_string())?;
    std::fs::write(out, pdf).map_err(|e| e.to_string())?;
    Ok(())
}
