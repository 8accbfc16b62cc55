//! The command line: the subcommands that print or write and exit.

use std::path::{Path, PathBuf};

use clap::{Parser, Subcommand};
use pitchframe_cards::{
    CardOptions, LumberOrder, OrderSettings, Paper, StockSeries, card_deck, cut_list_csv, cut_list_table,
    frame_glb, model_scene, order_lumber, order_pieces, render_cards, size_words,
};
use pitchframe_geometry::{
    Frame, Length, LengthStyle, LengthUnit, Outline, Pitch, Plan, RafterTable, Roof, RoofLineKind, demo_plan,
    frame_roof,
};
use serde_json::{Value, json};

use crate::gui::ViewPreset;

/// Pitchframe: lay out a roof frame from a wall plan and pitches.
#[derive(Debug, Parser)]
#[command(name = "pitchframe", version, about, args_conflicts_with_subcommands = true)]
pub struct Cli {
    /// Plan file to open in the app (the built-in demo when left out).
    pub plan: Option<PathBuf>,
    /// Render the 3D view to this PNG picture and exit (needs a display).
    #[arg(long, value_name = "OUT.png")]
    pub picture: Option<PathBuf>,
    /// The view for --picture.
    #[arg(long, value_enum, default_value = "corner")]
    pub view: ViewPreset,
    /// A command that prints or writes and exits.
    #[command(subcommand)]
    pub command: Option<Command>,
}

/// The subcommands.
#[derive(Debug, Subcommand)]
pub enum Command {
    /// Print the rafter-table lines for a pitch, e.g. `pitchframe table 7/12`.
    Table {
        /// The pitch: "7/12", "7 in 12", "30deg", "1:2".
        #[arg(allow_hyphen_values = true)]
        pitch: String,
        /// Print full-precision numbers as JSON.
        #[arg(long)]
        json: bool,
    },
    /// Solve the roof over a plan and print its planes, ridges, hips and valleys.
    Solve {
        /// The plan file (TOML), or `demo`.
        plan: PathBuf,
        /// Print JSON (roof, members, cuts and joints) instead of a summary.
        #[arg(long)]
        json: bool,
        /// With --json: give each member's solid (vertices and faces).
        #[arg(long, requires = "json")]
        solids: bool,
    },
    /// Print the cut list a framer reads at the saw.
    List {
        /// The plan file (TOML), or `demo`.
        plan: PathBuf,
        /// Also write the cut list as CSV to this file.
        #[arg(long, value_name = "FILE")]
        csv: Option<PathBuf>,
    },
    /// Print the lumber order: boards per size, each board's pieces and offcut.
    Order {
        /// The plan file (TOML), or `demo`.
        plan: PathBuf,
        /// Also write the cut list as CSV to this file.
        #[arg(long, value_name = "FILE")]
        csv: Option<PathBuf>,
    },
    /// Write the printed cut cards as a PDF.
    Cards {
        /// The plan file (TOML), or `demo`.
        plan: PathBuf,
        /// Where to write the PDF.
        #[arg(short, long, value_name = "cards.pdf")]
        output: PathBuf,
        /// Paper size.
        #[arg(long, value_enum, default_value = "letter")]
        paper: PaperChoice,
        /// Cards per page: 1, 2 or 4.
        #[arg(long, default_value_t = 1, value_parser = clap::value_parser!(u8).range(1..=4))]
        per_page: u8,
        /// Members whose cut ends are also printed full size, e.g. HJ1,C1.
        #[arg(long, value_delimiter = ',', value_name = "LABEL,...")]
        templates: Vec<String>,
    },
    /// Write the frame as a 3D model (glTF 2.0 binary, .glb).
    Export {
        /// The plan file (TOML), or `demo`.
        plan: PathBuf,
        /// Where to write the model.
        #[arg(short, long, value_name = "frame.glb")]
        output: PathBuf,
        /// Leave out the roof surfaces and walls; the frame alone.
        #[arg(long)]
        frame_only: bool,
    },
}

/// Paper sizes for the cut cards.
#[derive(Debug, Clone, Copy, clap::ValueEnum)]
pub enum PaperChoice {
    /// US Letter, 8-1/2 x 11 in.
    Letter,
    /// ISO A4, 210 x 297 mm.
    A4,
}

/// A failure the user can act on: printed as one line, exit code 2.
#[derive(Debug)]
pub struct UserError(pub String);

impl<E: std::fmt::Display> From<E> for UserError {
    fn from(e: E) -> Self {
        Self(e.to_string())
    }
}

/// Runs a subcommand, returning what to print.
pub fn run(command: &Command) -> Result<String, UserError> {
    match command {
        Command::Table { pitch, json } => table(pitch, *json),
        Command::Solve { plan, json, solids } => solve(plan, *json, *solids),
        Command::List { plan, csv } => list(plan, csv.as_deref()),
        Command::Order { plan, csv } => order(plan, csv.as_deref()),
        Command::Cards { plan, output, paper, per_page, templates } => {
            cards(plan, output, *paper, *per_page, templates)
        }
        Command::Export { plan, output, frame_only } => export(plan, output, *frame_only),
    }
}

/// A plan with everything derived from it, or the message naming what
/// stopped the way.
pub struct Framed {
    /// The plan as read.
    pub plan: Plan,
    /// Its validated outline.
    pub outline: Outline,
    /// The solved roof.
    pub roof: Roof,
    /// The frame laid out on it.
    pub frame: Frame,
}

/// Reads, solves and frames a plan.
pub fn frame_plan(path: &Path) -> Result<Framed, UserError> {
    let plan = load_plan(path)?;
    frame_loaded(plan).map_err(|UserError(e)| UserError(format!("{}: {e}", path.display())))
}

/// Solves and frames a plan already read (the window's plan).
pub fn frame_loaded(plan: Plan) -> Result<Framed, UserError> {
    let outline = plan.outline()?;
    let roof = Roof::solve(&outline)?;
    let settings = plan.framing_settings()?;
    let frame = frame_roof(&outline, &roof, &settings)?;
    Ok(Framed { plan, outline, roof, frame })
}

fn style(plan: &Plan) -> LengthStyle {
    pitchframe_cards::length_style(plan)
}

/// The lumber order settings from the plan's `[framing]` table.
fn order_settings(plan: &Plan) -> OrderSettings {
    let series = match plan.units {
        LengthUnit::Inch => StockSeries::Feet,
        LengthUnit::Millimetre => StockSeries::Metric,
    };
    let mut settings = OrderSettings::for_series(series);
    if let Some(stock) = &plan.framing.stock {
        settings.stock_lengths_in = stock.iter().map(|l| l.inches()).collect();
    }
    if let Some(kerf) = plan.framing.kerf {
        settings.kerf_in = kerf.inches();
    }
    if let Some(trim) = plan.framing.trim {
        settings.trim_in = trim.inches();
    }
    settings
}

/// The lumber order for a framed plan.
pub fn lumber_order(framed: &Framed) -> Result<LumberOrder, UserError> {
    let pieces = order_pieces(&framed.frame, style(&framed.plan));
    Ok(order_lumber(&pieces, &order_settings(&framed.plan))?)
}

fn write_file(path: &Path, bytes: &[u8]) -> Result<(), UserError> {
    std::fs::write(path, bytes).map_err(|e| UserError(format!("cannot write {}: {e}", path.display())))
}

fn deck(path: &Path, framed: &Framed) -> Result<pitchframe_cards::CardDeck, UserError> {
    let title = path.file_stem().map_or_else(|| "plan".to_string(), |s| s.to_string_lossy().into_owned());
    titled_deck(&title, framed)
}

/// The cut cards of a framed plan, headed `title`, with its lumber order.
pub fn titled_deck(title: &str, framed: &Framed) -> Result<pitchframe_cards::CardDeck, UserError> {
    let lumber = lumber_order(framed)?;
    Ok(card_deck(title, &framed.plan, &framed.outline, &framed.roof, &framed.frame, Some(lumber)))
}

fn list(path: &Path, csv: Option<&Path>) -> Result<String, UserError> {
    let framed = frame_plan(path)?;
    let deck = deck(path, &framed)?;
    let style = style(&framed.plan);
    if let Some(csv) = csv {
        write_file(csv, cut_list_csv(&deck.members, style)?.as_bytes())?;
    }
    let mut out = cut_list_table(&deck.members, style);
    if !deck.warnings.is_empty() {
        out.push_str("\nWarnings:\n");
        for w in &deck.warnings {
            out.push_str(&format!("  {w}\n"));
        }
    }
    out.push_str(&format!("\n{CAUTION_LINE}\n"));
    Ok(out)
}

/// The short caution printed under every list and order.
const CAUTION_LINE: &str = "Geometry only: member sizes, spans, connections and notch limits are set by \
local codes, engineered designs and licensed professionals. Measure the real building and test-cut a pair first.";

fn order(path: &Path, csv: Option<&Path>) -> Result<String, UserError> {
    let framed = frame_plan(path)?;
    let style = style(&framed.plan);
    if let Some(csv) = csv {
        let deck = deck(path, &framed)?;
        write_file(csv, cut_list_csv(&deck.members, style)?.as_bytes())?;
    }
    let order = lumber_order(&framed)?;
    let len = |inches: f64| Length::from_inches(inches).format(style);
    let mut out = String::new();
    for size in &order.sizes {
        out.push_str(&format!(
            "{}: {} boards, {} bought for {} of pieces, waste {:.1}% (no order can buy less than {})\n",
            size.size,
            size.boards.len(),
            len(size.bought_in),
            len(size.pieces_in),
            size.waste_percent(),
            len(size.lower_bound_in),
        ));
        for count in &size.stock_counts {
            out.push_str(&format!("  {} x {}\n", count.count, len(count.stock_in)));
        }
        for (i, board) in size.boards.iter().enumerate() {
            let pieces: Vec<String> =
                board.pieces.iter().map(|p| format!("{} {}", p.label, len(p.length_in))).collect();
            out.push_str(&format!(
                "    board {:>3} ({}): {}; offcut {}\n",
                i + 1,
                len(board.stock_in),
                pieces.join(", "),
                len(board.offcut_in)
            ));
        }
    }
    for splice in &order.needs_splice {
        out.push_str(&format!(
            "{} x {} {} at {} is longer than the longest stock ({}): needs a splice or a special order\n",
            splice.count,
            splice.label,
            splice.size,
            len(splice.length_in),
            len(splice.longest_stock_in)
        ));
    }
    out.push_str(&format!(
        "Total: {} bought, waste {:.1}% (kerf {}, trim {} a piece)\n",
        len(order.bought_in()),
        order.waste_percent(),
        len(order.settings.kerf_in),
        len(order.settings.trim_in)
    ));
    out.push_str(&format!("\n{CAUTION_LINE}\n"));
    Ok(out)
}

fn cards(
    path: &Path,
    output: &Path,
    paper: PaperChoice,
    per_page: u8,
    templates: &[String],
) -> Result<String, UserError> {
    let framed = frame_plan(path)?;
    let deck = deck(path, &framed)?;
    let options = CardOptions {
        paper: match paper {
            PaperChoice::Letter => Paper::Letter,
            PaperChoice::A4 => Paper::A4,
        },
        per_page,
        templates: templates.to_vec(),
    };
    let pdf = render_cards(&deck, &options)?;
    write_file(output, &pdf)?;
    Ok(format!("wrote {} cut cards to {}", deck.members.len(), output.display()))
}

fn export(path: &Path, output: &Path, frame_only: bool) -> Result<String, UserError> {
    let framed = frame_plan(path)?;
    let scene = model_scene(&framed.outline, &framed.roof, &framed.frame, !frame_only, !frame_only);
    let glb = frame_glb(&scene)?;
    write_file(output, &glb)?;
    Ok(format!("wrote {} pieces to {}", framed.frame.pieces.len(), output.display()))
}

fn table(text: &str, json: bool) -> Result<String, UserError> {
    let pitch = Pitch::parse(text)?;
    let table = RafterTable::for_pitch(pitch);
    if json { Ok(serde_json::to_string_pretty(&table)?) } else { Ok(table.to_text()) }
}

/// Reads and parses a plan file, or the demo for the name `demo`.
pub fn load_plan(path: &Path) -> Result<Plan, UserError> {
    if path.as_os_str() == "demo" {
        return Ok(demo_plan()?);
    }
    let meta =
        std::fs::metadata(path).map_err(|e| UserError(format!("cannot read {}: {e}", path.display())))?;
    if meta.len() > pitchframe_geometry::plan::MAX_PLAN_BYTES as u64 {
        return Err(UserError(format!(
            "{}: the file is {} bytes; plans are limited to {} bytes",
            path.display(),
            meta.len(),
            pitchframe_geometry::plan::MAX_PLAN_BYTES
        )));
    }
    let bytes = std::fs::read(path).map_err(|e| UserError(format!("cannot read {}: {e}", path.display())))?;
    let text = String::from_utf8(bytes).map_err(|_| {
        UserError(format!("{}: the file is not UTF-8 text, so it is not a plan", path.display()))
    })?;
    Plan::from_toml(&text).map_err(|e| UserError(format!("{}: {e}", path.display())))
}

fn solve(path: &Path, json: bool, solids: bool) -> Result<String, UserError> {
    let framed = frame_plan(path)?;
    if json {
        let mut value = roof_json(&framed.plan, &framed.roof);
        if let Value::Object(map) = &mut value {
            map.insert("member_units".into(), json!("in"));
            map.insert("members".into(), members_json(&framed, solids)?);
            map.insert("joints".into(), serde_json::to_value(&framed.frame.joints)?);
        }
        Ok(serde_json::to_string_pretty(&value)?)
    } else {
        let mut out = roof_summary(&framed.plan, &framed.roof);
        let pieces: usize = framed.frame.members.iter().map(|m| m.count).sum();
        out.push_str(&format!(
            "Members: {} kinds of piece, {} pieces; joints checked: {}, widest gap {}, deepest overlap {}\n",
            framed.frame.members.len(),
            pieces,
            framed.frame.joints.len(),
            Length::from_inches(framed.frame.joints.iter().map(|j| j.max_gap).fold(0.0, f64::max))
                .format(LengthStyle::DecimalInches),
            Length::from_inches(framed.frame.joints.iter().map(|j| j.max_overlap).fold(0.0, f64::max))
                .format(LengthStyle::DecimalInches),
        ));
        Ok(out)
    }
}

/// Each member as JSON: its numbers in inches, its size in words, and with
/// `solids` the solid of its first piece as vertices and index faces.
fn members_json(framed: &Framed, solids: bool) -> Result<Value, UserError> {
    let style = style(&framed.plan);
    let mut out = Vec::with_capacity(framed.frame.members.len());
    for member in &framed.frame.members {
        let mut value = serde_json::to_value(member)?;
        if let Value::Object(map) = &mut value {
            map.insert("size_in".into(), serde_json::to_value(member.size)?);
            map.insert(
                "size".into(),
                json!(size_words(member.size.thickness_in, member.size.depth_in, style)),
            );
            if solids && let Some(piece) = framed.frame.pieces.iter().find(|p| p.label == member.label) {
                map.insert("solid".into(), solid_json(&piece.solid));
            }
        }
        out.push(value);
    }
    Ok(Value::Array(out))
}

/// A solid as shared vertices and faces of vertex indices, each face with
/// the cut that made it.
fn solid_json(solid: &pitchframe_geometry::framing::Solid) -> Value {
    let mut vertices: Vec<glam::DVec3> = Vec::new();
    let mut index_of = |p: glam::DVec3| -> usize {
        // Vertices shared by faces are the same point up to rounding.
        if let Some(i) = vertices.iter().position(|v| v.distance(p) < 1e-9) {
            return i;
        }
        vertices.push(p);
        vertices.len() - 1
    };
    let faces: Vec<Value> = solid
        .faces()
        .map(|f| {
            let indices: Vec<usize> = f.vertices.iter().map(|p| index_of(*p)).collect();
            json!({ "vertices": indices, "tag": f.tag, "end": f.end })
        })
        .collect();
    json!({
        "vertices": vertices.iter().map(|v| json!([v.x, v.y, v.z])).collect::<Vec<_>>(),
        "faces": faces,
    })
}

/// A factor from inches to the plan's unit.
fn unit_factor(units: LengthUnit) -> f64 {
    match units {
        LengthUnit::Inch => 1.0,
        LengthUnit::Millimetre => 25.4,
    }
}

fn point_json(p: glam::DVec3, k: f64) -> Value {
    json!([p.x * k, p.y * k, p.z * k])
}

/// The roof as JSON, in the plan's units.
pub fn roof_json(plan: &Plan, roof: &Roof) -> Value {
    let k = unit_factor(plan.units);
    let ring = |pts: &[glam::DVec3]| Value::Array(pts.iter().map(|p| point_json(*p, k)).collect());
    json!({
        "units": match plan.units { LengthUnit::Inch => "in", LengthUnit::Millimetre => "mm" },
        "about": "planes[].outline is each roof plane at the wall line (no overhang); \
                  planes[].eave_outline is the same plane carried out to the fascia line; \
                  z is height above the wall line; walls are numbered from 0 in file order",
        "planes": roof.planes.iter().map(|p| json!({
            "wall": p.wall,
            "rise_per_run": p.rise_per_run,
            "outline": ring(&p.outline),
            "eave_outline": ring(&p.eave_outline),
        })).collect::<Vec<_>>(),
        "lines": roof.lines.iter().map(|l| json!({
            "kind": l.kind,
            "from": point_json(l.from, k),
            "to": point_json(l.to, k),
            "walls": l.walls,
        })).collect::<Vec<_>>(),
        "gables": roof.gables.iter().map(|g| json!({
            "wall": g.wall,
            "outline": ring(&g.outline),
        })).collect::<Vec<_>>(),
    })
}

/// A readable summary of the solved roof.
pub fn roof_summary(plan: &Plan, roof: &Roof) -> String {
    let len = |inches: f64| plan.display_length(pitchframe_geometry::Length::from_inches(inches));
    let mut out = String::new();
    out.push_str(&format!("Roof planes: {}\n", roof.planes.len()));
    for p in &roof.planes {
        let pitch = Pitch::from_rise_per_run(p.rise_per_run)
            .map(|p| match plan.units {
                LengthUnit::Inch => p.to_string(),
                LengthUnit::Millimetre => p.degrees_text(),
            })
            .unwrap_or_default();
        let top = p.outline.iter().map(|v| v.z).fold(0.0, f64::max);
        out.push_str(&format!("  wall {:>3}  pitch {:>8}  top {}\n", p.wall + 1, pitch, len(top)));
    }
    for (kind, title) in
        [(RoofLineKind::Ridge, "Ridges"), (RoofLineKind::Hip, "Hips"), (RoofLineKind::Valley, "Valleys")]
    {
        let lines: Vec<_> = roof.lines.iter().filter(|l| l.kind == kind).collect();
        out.push_str(&format!("{title}: {}\n", lines.len()));
        for l in lines {
            let plan_run = (l.to - l.from).truncate().length();
            let true_len = (l.to - l.from).length();
            out.push_str(&format!(
                "  walls {:>3} & {:<3}  plan {}  true length {}  from height {} to {}\n",
                l.walls[0] + 1,
                l.walls[1] + 1,
                len(plan_run),
                len(true_len),
                len(l.from.z),
                len(l.to.z)
            ));
        }
    }
    if !roof.gables.is_empty() {
        out.push_str(&format!("Gable ends: {}\n", roof.gables.len()));
        for g in &roof.gables {
            let top = g.outline.iter().map(|v| v.z).fold(0.0, f64::max);
            out.push_str(&format!("  wall {:>3}  peak {}\n", g.wall + 1, len(top)));
        }
    }
    out
}
