//! Opening a written file, or the folder it is in, with the desktop's own
//! program for it (`xdg-open` on Linux, `open` on macOS, `explorer` on
//! Windows). A failure comes back as a message; it never stops the window.

use std::path::Path;
use std::process::{Command, Stdio};
use std::sync::mpsc::Sender;

/// The desktop's program that opens a file or folder with its usual app.
pub fn desktop_opener() -> &'static str {
    if cfg!(target_os = "macos") {
        "open"
    } else if cfg!(target_os = "windows") {
        "explorer"
    } else {
        "xdg-open"
    }
}

/// Asks `program` (the desktop's opener) to open `path`. A program that
/// cannot be started is reported at once; one that starts and then fails
/// is reported on `later`, from a thread that waits for it.
pub fn open_in_desktop(program: &str, path: &Path, later: Sender<String>) -> Result<(), String> {
    let program = program.to_owned();
    let mut child = Command::new(&program)
        .arg(path)
        .stdin(Stdio::null())
        .stdout(Stdio::null())
        .stderr(Stdio::null())
        .spawn()
        .map_err(|err| format!("Could not open {}: {program} did not start ({err})", path.display()))?;
    let shown = path.display().to_string();
    std::thread::spawn(move || {
        // `explorer` reports failure for folders it did open, so only a
        // program that says it failed on the other desktops is reported.
        match child.wait() {
            Ok(status) if status.success() || cfg!(target_os = "windows") => {}
            Ok(status) => {
                let _ = later.send(format!("Could not open {shown}: {program} ended with {status}"));
            }
            Err(err) => {
                let _ = later.send(format!("Could not open {shown}: {err}"));
            }
        }
    });
    Ok(())
}
