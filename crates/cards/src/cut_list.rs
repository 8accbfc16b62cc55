//! The cut list: one row per distinct member, as CSV for a spreadsheet and
//! as a fixed-width table for the terminal.

use pitchframe_geometry::{Length, LengthStyle};
use thiserror::Error;

use crate::{CardCut, MemberCard};

/// Why the cut list could not be written.
#[derive(Debug, Error)]
pub enum CutListError {
    /// The CSV writer failed.
    #[error("the cut list could not be written as CSV: {0}")]
    Csv(#[from] csv::Error),
    /// The CSV text was not UTF-8 (cannot happen with UTF-8 labels).
    #[error("the cut list CSV is not valid text")]
    NotText,
}

/// The column headings, shared by the CSV and the table.
const HEADINGS: [&str; 10] = [
    "label",
    "kind",
    "count",
    "size",
    "long point",
    "short point",
    "seat to top cut",
    "tail",
    "overall",
    "cuts",
];

fn length_text(length_in: Option<f64>, style: LengthStyle) -> String {
    length_in.map_or_else(|| "-".to_string(), |inches| Length::from_inches(inches).format(style))
}

/// One cut in words: its name and place, the square setting and every saw
/// setting, each with its setup.
pub fn cut_text(cut: &CardCut) -> String {
    let mut parts = vec![format!("{} ({})", cut.face.name(), cut.place)];
    if let Some(square) = &cut.square {
        parts.push(format!("square {}", square.setup));
    }
    parts.extend(cut.settings.iter().map(|setting| setting.setup.clone()));
    parts.extend(cut.notes.iter().cloned());
    parts.join("; ")
}

fn row(member: &MemberCard, style: LengthStyle) -> [String; 10] {
    let lengths = &member.lengths;
    [
        member.label.clone(),
        member.kind.clone(),
        member.count.to_string(),
        member.size.clone(),
        length_text(lengths.long_point_in, style),
        length_text(lengths.short_point_in, style),
        length_text(lengths.seat_to_top_cut_in, style),
        length_text(lengths.tail_in, style),
        length_text(Some(lengths.overall_in), style),
        member.cuts.iter().map(cut_text).collect::<Vec<_>>().join(" | "),
    ]
}

/// The cut list as CSV: a heading row, then one row per member; the
/// `overall (in)` column repeats the overall length as a plain number.
pub fn cut_list_csv(members: &[MemberCard], style: LengthStyle) -> Result<String, CutListError> {
    let mut writer = csv::Writer::from_writer(Vec::new());
    let mut headings: Vec<&str> = HEADINGS.to_vec();
    headings.push("overall (in)");
    writer.write_record(&headings)?;
    for member in members {
        let mut record: Vec<String> = row(member, style).to_vec();
        record.push(format!("{:.4}", member.lengths.overall_in));
        writer.write_record(&record)?;
    }
    let bytes = writer.into_inner().map_err(|error| CutListError::Csv(error.into_error().into()))?;
    String::from_utf8(bytes).map_err(|_| CutListError::NotText)
}

/// The cut list as a fixed-width table: the numbers in aligned columns,
/// then each member's cuts on indented lines beneath it.
pub fn cut_list_table(members: &[MemberCard], style: LengthStyle) -> String {
    let rows: Vec<[String; 10]> = members.iter().map(|member| row(member, style)).collect();
    let mut widths = [0usize; 9];
    for (column, width) in widths.iter_mut().enumerate() {
        let cells = rows.iter().filter_map(|row| row.get(column)).map(|cell| cell.chars().count());
        *width = cells.chain(HEADINGS.get(column).map(|heading| heading.len())).max().unwrap_or(0);
    }
    let line = |cells: &[String]| {
        let mut text = String::new();
        for (column, (cell, width)) in cells.iter().zip(widths).enumerate() {
            if column > 0 {
                text.push_str("  ");
            }
            // Counts and lengths line up on the right, words on the left.
            if column >= 2 && column != 3 {
                text.push_str(&format!("{cell:>width$}"));
            } else {
                text.push_str(&format!("{cell:<width$}"));
            }
        }
        text.trim_end().to_string()
    };
    let headings: Vec<String> = HEADINGS.iter().take(9).map(|heading| heading.to_string()).collect();
    let mut out = line(&headings);
    out.push('\n');
    out.push_str(&"-".repeat(widths.iter().sum::<usize>() + 2 * (widths.len() - 1)));
    out.push('\n');
    for (member, cells) in members.iter().zip(&rows) {
        out.push_str(&line(&cells[..9]));
        out.push('\n');
        for cut in &member.cuts {
            out.push_str("    ");
            out.push_str(&cut_text(cut));
            out.push('\n');
        }
        for warning in &member.warnings {
            out.push_str("    WARNING: ");
            out.push_str(warning);
            out.push('\n');
        }
    }
    out
}
