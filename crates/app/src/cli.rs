//! The command line: the subcommands that print or write and exit.

use std::path::{Path, PathBuf};

use clap::{Parser, Subcommand};
use pitchframe_geometry::{LengthUnit, Pitch, Plan, RafterTable, Roof, RoofLineKind, demo_plan};
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
        /// The plan file (TOML).
        plan: PathBuf,
        /// Print JSON instead of a summary.
        #[arg(long)]
        json: bool,
    },
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
        Command::Solve { plan, json } => solve(plan, *json),
    }
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

fn solve(path: &Path, json: bool) -> Result<String, UserError> {
    let plan = load_plan(path)?;
    let outline = plan.outline().map_err(|e| UserError(format!("{}: {e}", path.display())))?;
    let roof = Roof::solve(&outline).map_err(|e| UserError(format!("{}: {e}", path.display())))?;
    if json {
        Ok(serde_json::to_string_pretty(&roof_json(&plan, &roof))?)
    } else {
        Ok(roof_summary(&plan, &roof))
    }
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
