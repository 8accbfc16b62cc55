//! Plan files on disk: atomic saves, capped loads and autosave.
//!
//! A save never leaves a half-written plan behind: the text goes to a
//! temporary file in the same directory, is flushed to the disk, and is
//! then renamed over the plan in one step, so a crash, a kill or a power
//! cut at any moment leaves either the old plan or the new one. The
//! directory is flushed too, so the rename itself survives a power cut.
//!
//! Autosaves are ordinary plan files written the same way beside the plan
//! (or in the user's state directory for a plan never saved), so recovering
//! one is just loading a plan.

use std::ffi::OsString;
use std::fs::{self, File, OpenOptions};
use std::io::{self, Read, Write};
use std::path::{Path, PathBuf};
use std::sync::atomic::{AtomicU64, Ordering};
use std::time::SystemTime;

use pitchframe_geometry::Plan;
use pitchframe_geometry::plan::MAX_PLAN_BYTES;

/// The file name an autosave of a never-saved plan is kept under.
const UNTITLED_AUTOSAVE: &str = "untitled.autosave.toml";

/// Tells apart temporary files made by one process at the same moment.
static TEMP_COUNTER: AtomicU64 = AtomicU64::new(0);

/// Writes `plan` to `path` so that `path` always holds either its old
/// contents or the whole new plan, whatever happens during the save.
pub fn save_plan_atomically(path: &Path, plan: &Plan) -> io::Result<()> {
    write_atomically(path, plan.to_toml().as_bytes())
}

/// Writes `bytes` to `path` atomically: a temporary file in the same
/// directory, flushed, renamed over `path`, and the directory flushed.
pub fn write_atomically(path: &Path, bytes: &[u8]) -> io::Result<()> {
    let target = resolve_symlink(path)?;
    let file_name = target.file_name().ok_or_else(|| {
        io::Error::new(io::ErrorKind::InvalidInput, format!("{} is not a file name", path.display()))
    })?;
    let dir = parent_dir(&target);
    let temp = dir.join(temp_name(file_name));
    let result = write_and_rename(&temp, &target, &dir, bytes);
    if result.is_err() {
        // The temporary file is ours alone; a failure to remove it leaves
        // only a stray hidden `.tmp` file, never a damaged plan.
        let _ = fs::remove_file(&temp);
    }
    result
}

fn write_and_rename(temp: &Path, target: &Path, dir: &Path, bytes: &[u8]) -> io::Result<()> {
    let mut file = OpenOptions::new().write(true).create_new(true).open(temp)?;
    // Keep the permissions a user gave the plan (a shared, read-only-group file).
    if let Ok(meta) = fs::metadata(target) {
        file.set_permissions(meta.permissions())?;
    }
    file.write_all(bytes)?;
    file.sync_all()?;
    drop(file);
    fs::rename(temp, target)?;
    sync_dir(dir)
}

/// Saves go to the file a symbolic link points at, so the link stays a link.
fn resolve_symlink(path: &Path) -> io::Result<PathBuf> {
    match fs::symlink_metadata(path) {
        Ok(meta) if meta.file_type().is_symlink() => fs::canonicalize(path),
        _ => Ok(path.to_path_buf()),
    }
}

/// The directory holding `path` (`.` for a bare file name).
fn parent_dir(path: &Path) -> PathBuf {
    match path.parent() {
        Some(p) if !p.as_os_str().is_empty() => p.to_path_buf(),
        _ => PathBuf::from("."),
    }
}

/// A hidden name, unique to this process and call, that names the plan it
/// stands in for so a stray one left by a crash is recognisable.
fn temp_name(file_name: &std::ffi::OsStr) -> OsString {
    let n = TEMP_COUNTER.fetch_add(1, Ordering::Relaxed);
    let mut name = OsString::from(".");
    name.push(file_name);
    name.push(format!(".{}.{n}.tmp", std::process::id()));
    name
}

/// Flushes a directory so a rename in it survives a power cut.
#[cfg(unix)]
fn sync_dir(dir: &Path) -> io::Result<()> {
    File::open(dir)?.sync_all()
}

/// Windows flushes renames with the file; a directory cannot be opened to sync.
#[cfg(not(unix))]
fn sync_dir(_dir: &Path) -> io::Result<()> {
    Ok(())
}

/// Reads a plan file, refusing more than the plan size limit before reading
/// it all (a device or a file that grows while read cannot exhaust memory).
pub fn load_plan_file(path: &Path) -> io::Result<Plan> {
    let file = File::open(path)?;
    let mut bytes = Vec::new();
    file.take(MAX_PLAN_BYTES as u64 + 1).read_to_end(&mut bytes)?;
    if bytes.len() > MAX_PLAN_BYTES {
        return Err(invalid_data(format!(
            "{}: the file is larger than {MAX_PLAN_BYTES} bytes, the limit for a plan",
            path.display()
        )));
    }
    let text = String::from_utf8(bytes).map_err(|_| {
        invalid_data(format!("{}: the file is not UTF-8 text, so it is not a plan", path.display()))
    })?;
    Plan::from_toml(&text).map_err(|e| invalid_data(format!("{}: {e}", path.display())))
}

fn invalid_data(message: String) -> io::Error {
    io::Error::new(io::ErrorKind::InvalidData, message)
}

/// Where the autosave of the plan at `plan_path` is kept: a hidden file
/// beside it (`.house.toml.autosave`), or `untitled.autosave.toml` in the
/// user's state directory for a plan not yet saved.
pub fn autosave_path(plan_path: Option<&Path>) -> PathBuf {
    match plan_path.and_then(|p| p.file_name().map(|name| (p, name))) {
        Some((p, name)) => {
            let mut hidden = OsString::from(".");
            hidden.push(name);
            hidden.push(".autosave");
            parent_dir(p).join(hidden)
        }
        None => state_dir().join(UNTITLED_AUTOSAVE),
    }
}

/// The per-user directory for files the app keeps between runs.
fn state_dir() -> PathBuf {
    if let Some(dir) = std::env::var_os("XDG_STATE_HOME").filter(|d| !d.is_empty()) {
        return PathBuf::from(dir).join("pitchframe");
    }
    if let Some(home) = std::env::var_os("HOME").filter(|d| !d.is_empty()) {
        return PathBuf::from(home).join(".local").join("state").join("pitchframe");
    }
    if let Some(dir) = std::env::var_os("LOCALAPPDATA").filter(|d| !d.is_empty()) {
        return PathBuf::from(dir).join("pitchframe");
    }
    std::env::temp_dir().join("pitchframe")
}

/// Writes the autosave of the plan at `plan_path` (see [`autosave_path`])
/// atomically, and returns where it went.
pub fn write_autosave(plan_path: Option<&Path>, plan: &Plan) -> io::Result<PathBuf> {
    let path = autosave_path(plan_path);
    if let Some(dir) = path.parent() {
        fs::create_dir_all(dir)?;
    }
    save_plan_atomically(&path, plan)?;
    Ok(path)
}

/// An autosave found on disk.
#[derive(Debug, Clone)]
pub struct RecoveredAutosave {
    /// Where the autosave lies.
    pub path: PathBuf,
    /// The plan it holds.
    pub plan: Plan,
    /// True when the autosave was written after the plan file was last
    /// saved (or there is no plan file): it holds work the plan lacks.
    pub newer_than_plan: bool,
}

/// The autosave of the plan at `plan_path`, if one exists; an autosave
/// that is not a readable plan is an `InvalidData` error naming it.
pub fn read_autosave(plan_path: Option<&Path>) -> io::Result<Option<RecoveredAutosave>> {
    let path = autosave_path(plan_path);
    let autosaved = match fs::metadata(&path) {
        Ok(meta) => meta.modified().unwrap_or(SystemTime::UNIX_EPOCH),
        Err(e) if e.kind() == io::ErrorKind::NotFound => return Ok(None),
        Err(e) => return Err(e),
    };
    let plan = load_plan_file(&path)?;
    let newer_than_plan = match plan_path.map(fs::metadata) {
        Some(Ok(meta)) => meta.modified().map(|saved| autosaved >= saved).unwrap_or(true),
        _ => true,
    };
    Ok(Some(RecoveredAutosave { path, plan, newer_than_plan }))
}

/// Removes the autosave of the plan at `plan_path` (after a save or when
/// the user discards it); a missing autosave is not an error.
pub fn remove_autosave(plan_path: Option<&Path>) -> io::Result<()> {
    match fs::remove_file(autosave_path(plan_path)) {
        Err(e) if e.kind() != io::ErrorKind::NotFound => Err(e),
        _ => Ok(()),
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn autosave_sits_hidden_beside_the_plan() {
        let p = autosave_path(Some(Path::new("/jobs/house.toml")));
        assert_eq!(p, PathBuf::from("/jobs/.house.toml.autosave"));
        let bare = autosave_path(Some(Path::new("house.toml")));
        assert_eq!(bare, PathBuf::from("./.house.toml.autosave"));
    }

    #[test]
    fn untitled_autosave_goes_to_the_state_directory() {
        let p = autosave_path(None);
        assert!(p.ends_with(Path::new("pitchframe").join(UNTITLED_AUTOSAVE)), "{}", p.display());
    }
}
