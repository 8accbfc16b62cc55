//! Uses the geometry crate the way a framer's quick question would: for a
//! building span and a pitch, the common rafter's theoretical length and
//! the jack differences, then the ridges, hips and valleys of an example
//! plan.
//!
//! Run with `cargo run --example rafter_lengths [SPAN] [PITCH]`, e.g.
//! `cargo run --example rafter_lengths "16'" 7/12`.

use pitchframe_geometry::{Length, LengthStyle, LengthUnit, Pitch, Plan, RafterTable, Roof};

/// The report this example prints, for a span and pitch as a framer types them.
fn report(span_text: &str, pitch_text: &str) -> Result<String, String> {
    let span = Length::parse(span_text, LengthUnit::Inch).map_err(|e| e.to_string())?;
    let pitch = Pitch::parse(pitch_text).map_err(|e| e.to_string())?;
    let table = RafterTable::for_pitch(pitch);
    // Theoretical length: run in feet times the length per foot of run.
    let run_ft = span.inches() / 2.0 / 12.0;
    let common = Length::from_inches(run_ft * table.common_per_foot);
    let mut out = format!(
        "span {} at {pitch}: run {}, common rafter {} (theoretical, before the ridge deduction)\n",
        span.format(LengthStyle::FeetInches),
        Length::from_inches(span.inches() / 2.0).format(LengthStyle::FeetInches),
        common.format(LengthStyle::FeetInches),
    );
    out.push_str(&format!(
        "jack differences: {} at 16 in centres, {} at 24 in centres\n",
        Length::from_inches(table.jack_diff_16).format(LengthStyle::Inches),
        Length::from_inches(table.jack_diff_24).format(LengthStyle::Inches),
    ));
    let plan = Plan::from_toml(include_str!("hillside-cottage.toml")).map_err(|e| e.to_string())?;
    let outline = plan.outline().map_err(|e| e.to_string())?;
    match Roof::solve(&outline) {
        Ok(roof) => out.push_str(&format!(
            "hillside cottage: {} roof planes, {} ridges, hips and valleys\n",
            roof.planes.len(),
            roof.lines.len()
        )),
        Err(e) => out.push_str(&format!("hillside cottage: {e}\n")),
    }
    Ok(out)
}

fn main() {
    let args: Vec<String> = std::env::args().skip(1).collect();
    let span = args.first().map_or("16'", String::as_str);
    let pitch = args.get(1).map_or("7/12", String::as_str);
    match report(span, pitch) {
        Ok(text) => print!("{text}"),
        Err(message) => {
            eprintln!("rafter_lengths: {message}");
            std::process::exit(2);
        }
    }
}

#[cfg(test)]
mod tests {
    use super::report;

    #[test]
    fn the_example_runs_and_gives_the_manual_length() {
        let text = report("16'", "7/12").unwrap();
        // NAVEDTRA 14044, Builder 3 & 2 Vol. 2, rafter chapter: 7/12 at a
        // 16 ft span gives 13.89 x 8 = 111-1/8 in = 9' 3-1/8".
        assert!(text.contains("common rafter 9' 3-1/8\""), "{text}");
        assert!(text.contains("hillside cottage"), "{text}");
    }

    #[test]
    fn the_example_refuses_a_bad_pitch() {
        assert!(report("16'", "7/0").is_err());
    }
}
