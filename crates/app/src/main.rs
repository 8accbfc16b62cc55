//! Pitchframe: the desktop app and its command line.

mod cli;
mod gui;
mod storage;

use std::io::Write;
use std::process::ExitCode;

use clap::Parser;

// Every re-frame builds thousands of small lists (faces, corners, cuts);
// mimalloc serves them in about a third of the system allocator's
// instructions (BENCHMARKS.md, "Framing").
#[global_allocator]
static ALLOCATOR: mimalloc::MiMalloc = mimalloc::MiMalloc;

fn main() -> ExitCode {
    let args = cli::Cli::parse();
    if let Some(command) = &args.command {
        return match cli::run(command) {
            Ok(text) => {
                // A closed pipe (`pitchframe table 7/12 | head`) is not an error.
                let mut out = std::io::stdout().lock();
                let _ = writeln!(out, "{}", text.trim_end());
                ExitCode::SUCCESS
            }
            Err(cli::UserError(message)) => {
                // A file name holding a newline or a terminal escape is written
                // escaped rather than breaking or recolouring the terminal.
                eprintln!("pitchframe: {}", pitchframe_geometry::shown::escaped(&message));
                ExitCode::from(2)
            }
        };
    }
    let options = gui::GuiOptions { plan_path: args.plan, picture: args.picture, view: args.view };
    match gui::run(options) {
        Ok(()) => ExitCode::SUCCESS,
        Err(e) => {
            eprintln!("pitchframe: {e:#}");
            ExitCode::from(1)
        }
    }
}
