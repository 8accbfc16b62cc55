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
    if let Ok(label) = std::env::var("DEBUG_MEMBER") {
        debug_member(&deck, &label);
    }
    let pdf = render_cards(&deck, &CardOptions { paper, per_page, templates }).map_err(|e| e.to_string())?;
    std::fs::write(out, pdf).map_err(|e| e.to_string())?;
    Ok(())
}

#[allow(dead_code)]
fn debug_member(deck: &pitchframe_cards::CardDeck, label: &str) {
    let Some(m) = deck.members.iter().find(|m| m.label == label) else { return };
    for (i, part) in m.side_view.parts.iter().enumerate() {
        let p: Vec<String> = part.iter().map(|p| format!("({:.1},{:.1})", p.x, p.y)).collect();
        println!("side part {i}: {}", p.join(" "));
    }
    for f in &m.side_view.faces {
        let p: Vec<String> = f.outline.iter().map(|p| format!("({:.2},{:.2})", p.x, p.y)).collect();
        println!("side face {:?}: {}", f.face, p.join(" "));
    }
    if let Some(top) = &m.top_view {
        let p: Vec<String> = top.outline.iter().map(|p| format!("({:.2},{:.2})", p.x, p.y)).collect();
        println!("top outline: {}", p.join(" "));
        for f in &top.faces {
            let p: Vec<String> = f.outline.iter().map(|p| format!("({:.2},{:.2})", p.x, p.y)).collect();
            println!("top face {:?}: {}", f.face, p.join(" "));
        }
    }
    for c in &m.cuts {
        println!(
            "cut {:?} {} mark {:?} top {:?}",
            c.face,
            c.place,
            c.mark.map(|m| m.edge_point),
            c.top_mark.map(|m| m.edge_point)
        );
    }
}
