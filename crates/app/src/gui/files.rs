//! Files the window keeps: plan saves written atomically, the recent-files
//! list, the autosave and the note that the safety cautions were shown.
//!
//! Everything but the plans themselves lives in one folder,
//! `$XDG_CONFIG_HOME/pitchframe` (or `~/.config/pitchframe`).

use std::path::{Path, PathBuf};

use anyhow::Context as _;
use pitchframe_geometry::Plan;

use crate::storage;

/// Most files the recent list keeps.
const MAX_RECENT: usize = 8;

/// The note naming the plan whose autosave is waiting: its path, or an
/// empty line for a plan never saved.
const AUTOSAVE_NOTE: &str = "autosave-of.txt";

/// Writes `text` to `path` so that a crash or a full disk never leaves a
/// half-written file (the storage module's temporary file and rename).
pub fn save_atomically(path: &Path, text: &str) -> anyhow::Result<()> {
    storage::write_atomically(path, text.as_bytes())
        .with_context(|| format!("cannot write {}", path.display()))
}

/// A plan left in an autosave by a window that did not close cleanly.
#[derive(Debug, Clone, PartialEq)]
pub struct Leftover {
    /// The autosaved plan.
    pub plan: Plan,
    /// The file the plan was being edited for, if it had one.
    pub source: Option<PathBuf>,
    /// Where the autosave lies.
    pub autosave: PathBuf,
}

/// The folder of the window's own files.
#[derive(Debug, Clone, PartialEq)]
pub struct ConfigDir {
    folder: PathBuf,
}

impl ConfigDir {
    /// The user's folder: `$XDG_CONFIG_HOME/pitchframe`, else
    /// `$HOME/.config/pitchframe`; `None` when neither is set.
    pub fn from_env() -> Option<Self> {
        let base = std::env::var_os("XDG_CONFIG_HOME")
            .filter(|value| !value.is_empty())
            .map(PathBuf::from)
            .or_else(|| {
            std::env::var_os("HOME").filter(|h| !h.is_empty()).map(|h| PathBuf::from(h).join(".config"))
        })?;
        Some(Self::at(base.join("pitchframe")))
    }

    /// The folder `folder` (tests use a temporary one).
    pub fn at(folder: PathBuf) -> Self {
        Self { folder }
    }

    fn file(&self, name: &str) -> PathBuf {
        self.folder.join(name)
    }

    fn write(&self, name: &str, text: &str) -> anyhow::Result<()> {
        std::fs::create_dir_all(&self.folder)
            .with_context(|| format!("cannot create the folder {}", self.folder.display()))?;
        save_atomically(&self.file(name), text)
    }

    /// The recent files, newest first (an unreadable list is an empty one).
    pub fn recent(&self) -> Vec<PathBuf> {
        std::fs::read_to_string(self.file("recent.txt"))
            .unwrap_or_default()
            .lines()
            .filter(|line| !line.trim().is_empty())
            .map(PathBuf::from)
            .collect()
    }

    /// Puts `path` at the top of the recent files.
    pub fn add_recent(&self, path: &Path) -> anyhow::Result<()> {
        let path = std::path::absolute(path).unwrap_or_else(|_| path.to_path_buf());
        let mut list = self.recent();
        list.retain(|other| *other != path);
        list.insert(0, path);
        list.truncate(MAX_RECENT);
        let text: String = list.iter().map(|p| format!("{}\n", p.display())).collect();
        self.write("recent.txt", &text)
    }

    /// Whether the safety cautions have been shown on this machine.
    pub fn safety_shown(&self) -> bool {
        self.file("safety-shown").exists()
    }

    /// Notes that the safety cautions have been shown.
    pub fn mark_safety_shown(&self) -> anyhow::Result<()> {
        self.write("safety-shown", "The safety cautions were shown at first start.\n")
    }

    /// Keeps a copy of unsaved work (beside its file, or in the user's
    /// state folder for a plan never saved) and notes which plan it is for,
    /// so the next start finds it whatever it opens.
    pub fn write_autosave(&self, plan: &Plan, source: Option<&Path>) -> anyhow::Result<()> {
        let source = source.map(|path| std::path::absolute(path).unwrap_or_else(|_| path.to_path_buf()));
        storage::write_autosave(source.as_deref(), plan).context("cannot write the autosave")?;
        let note = source.map(|path| format!("{}\n", path.display())).unwrap_or_else(|| "\n".to_owned());
        self.write(AUTOSAVE_NOTE, &note)
    }

    /// Drops the autosave of `source` and the note: the work is saved, or
    /// the user let it go.
    pub fn clear_autosave(&self, source: Option<&Path>) {
        let noted = self.noted_source();
        for plan in [source.map(Path::to_path_buf), noted.flatten()] {
            let _ = storage::remove_autosave(plan.as_deref());
        }
        let _ = std::fs::remove_file(self.file(AUTOSAVE_NOTE));
    }

    /// The plan the note names: `Some(None)` for a plan never saved.
    fn noted_source(&self) -> Option<Option<PathBuf>> {
        let text = std::fs::read_to_string(self.file(AUTOSAVE_NOTE)).ok()?;
        let line = text.lines().next().map(str::trim).unwrap_or_default();
        Some((!line.is_empty()).then(|| PathBuf::from(line)))
    }

    /// An autosave newer than its saved file (or of a plan never saved):
    /// the one the note names, else the one beside `opened`.
    pub fn leftover_autosave(&self, opened: Option<&Path>) -> Option<Leftover> {
        let mut candidates: Vec<Option<PathBuf>> = self.noted_source().into_iter().collect();
        if let Some(opened) = opened {
            candidates.push(Some(std::path::absolute(opened).unwrap_or_else(|_| opened.to_path_buf())));
        }
        candidates.into_iter().find_map(|source| {
            let found = storage::read_autosave(source.as_deref()).ok().flatten()?;
            found.newer_than_plan.then_some(Leftover { plan: found.plan, source, autosave: found.path })
        })
    }
}

#[cfg(test)]
pub mod tests {
    use super::*;

    /// An empty folder under the system's temporary folder, removed when dropped.
    pub struct TempFolder(pub PathBuf);

    impl TempFolder {
        /// A fresh folder named after `name`.
        pub fn new(name: &str) -> Self {
            use std::sync::atomic::{AtomicUsize, Ordering};
            static COUNT: AtomicUsize = AtomicUsize::new(0);
            let count = COUNT.fetch_add(1, Ordering::Relaxed);
            let path = std::env::temp_dir().join(format!("pitchframe-{name}-{}-{count}", std::process::id()));
            let _ = std::fs::remove_dir_all(&path);
            std::fs::create_dir_all(&path).unwrap();
            Self(path)
        }
    }

    impl Drop for TempFolder {
        fn drop(&mut self) {
            let _ = std::fs::remove_dir_all(&self.0);
        }
    }

    #[test]
    fn an_atomic_save_replaces_the_file_and_leaves_nothing_beside_it() {
        let folder = TempFolder::new("atomic");
        let path = folder.0.join("house.toml");
        save_atomically(&path, "first").unwrap();
        save_atomically(&path, "second").unwrap();
        assert_eq!(std::fs::read_to_string(&path).unwrap(), "second");
        let names: Vec<_> = std::fs::read_dir(&folder.0).unwrap().map(|e| e.unwrap().file_name()).collect();
        assert_eq!(names, vec![std::ffi::OsString::from("house.toml")]);
    }

    #[test]
    fn a_save_into_a_missing_folder_fails_with_the_file_named() {
        let folder = TempFolder::new("missing");
        let path = folder.0.join("no-such-folder").join("house.toml");
        let message = format!("{:#}", save_atomically(&path, "x").unwrap_err());
        assert!(message.contains("house.toml"), "{message}");
    }

    #[test]
    fn recent_files_come_newest_first_without_repeats() {
        let folder = TempFolder::new("recent");
        let config = ConfigDir::at(folder.0.join("config"));
        assert!(config.recent().is_empty());
        let (a, b) = (folder.0.join("a.toml"), folder.0.join("b.toml"));
        config.add_recent(&a).unwrap();
        config.add_recent(&b).unwrap();
        config.add_recent(&a).unwrap();
        assert_eq!(config.recent(), vec![a, b]);
    }

    #[test]
    fn an_autosave_older_than_its_saved_file_is_not_offered() {
        let folder = TempFolder::new("autosave");
        let config = ConfigDir::at(folder.0.join("config"));
        let plan_path = folder.0.join("house.toml");
        let mut plan = pitchframe_geometry::demo_plan().unwrap();
        std::fs::write(&plan_path, plan.to_toml()).unwrap();
        std::thread::sleep(std::time::Duration::from_millis(20));
        plan.walls[0].gable = true;
        config.write_autosave(&plan, Some(&plan_path)).unwrap();
        // Found from the note, whatever the next start opens.
        let leftover = config.leftover_autosave(None).unwrap();
        assert_eq!(leftover.plan, plan);
        assert_eq!(leftover.source.as_deref(), Some(plan_path.as_path()));
        assert_eq!(leftover.autosave.parent(), plan_path.parent());
        std::thread::sleep(std::time::Duration::from_millis(20));
        std::fs::write(&plan_path, "saved again").unwrap();
        assert_eq!(config.leftover_autosave(Some(&plan_path)), None);
        config.clear_autosave(Some(&plan_path));
        assert!(!storage::autosave_path(Some(&plan_path)).exists());
        assert_eq!(config.leftover_autosave(Some(&plan_path)), None);
    }
}
