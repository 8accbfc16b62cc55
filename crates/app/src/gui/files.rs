//! Files the window keeps: plan saves written atomically, the recent-files
//! list, the autosave and the note that the safety cautions were shown.
//!
//! Everything but the plans themselves lives in one folder,
//! `$XDG_CONFIG_HOME/pitchframe` (or `~/.config/pitchframe`).

use std::io::Write as _;
use std::path::{Path, PathBuf};
use std::time::SystemTime;

use anyhow::Context as _;

/// Most files the recent list keeps.
const MAX_RECENT: usize = 8;

/// Writes `text` to `path` so that a crash or a full disk never leaves a
/// half-written plan: the text goes to a temporary file in the same
/// folder, is flushed to the disk, and is then renamed over `path`.
pub fn save_atomically(path: &Path, text: &str) -> anyhow::Result<()> {
    let folder = path.parent().filter(|parent| !parent.as_os_str().is_empty()).unwrap_or(Path::new("."));
    let name = path.file_name().with_context(|| format!("{} is not a file name", path.display()))?;
    let mut temporary_name = std::ffi::OsString::from(".");
    temporary_name.push(name);
    temporary_name.push(format!(".{}.saving", std::process::id()));
    let temporary = folder.join(temporary_name);
    let written = (|| -> std::io::Result<()> {
        let mut file = std::fs::File::create(&temporary)?;
        file.write_all(text.as_bytes())?;
        file.sync_all()
    })();
    if let Err(err) = written {
        let _ = std::fs::remove_file(&temporary);
        return Err(err).with_context(|| format!("cannot write {}", path.display()));
    }
    std::fs::rename(&temporary, path).map_err(|err| {
        let _ = std::fs::remove_file(&temporary);
        anyhow::Error::new(err).context(format!("cannot replace {}", path.display()))
    })
}

/// A plan left in the autosave by a window that did not close cleanly.
#[derive(Debug, Clone, PartialEq)]
pub struct Leftover {
    /// The autosaved plan text.
    pub text: String,
    /// The file the plan was being edited for, if it had one.
    pub source: Option<PathBuf>,
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

    /// Keeps a copy of unsaved work, with the file it belongs to.
    pub fn write_autosave(&self, plan_text: &str, source: Option<&Path>) -> anyhow::Result<()> {
        let source = source.map(|path| std::path::absolute(path).unwrap_or_else(|_| path.to_path_buf()));
        let source_line = source.map(|path| format!("{}\n", path.display())).unwrap_or_default();
        self.write("autosave-source.txt", &source_line)?;
        self.write("autosave.toml", plan_text)
    }

    /// Drops the autosave: the work is saved, or the user let it go.
    pub fn clear_autosave(&self) {
        let _ = std::fs::remove_file(self.file("autosave.toml"));
        let _ = std::fs::remove_file(self.file("autosave-source.txt"));
    }

    /// The autosave, when one is left that is newer than the file it
    /// belongs to (or belongs to no file, or its file is gone).
    pub fn leftover_autosave(&self) -> Option<Leftover> {
        let autosave = self.file("autosave.toml");
        let text = std::fs::read_to_string(&autosave).ok()?;
        let source = std::fs::read_to_string(self.file("autosave-source.txt"))
            .ok()
            .and_then(|text| text.lines().next().map(str::trim).filter(|l| !l.is_empty()).map(PathBuf::from));
        let modified = |path: &Path| std::fs::metadata(path).and_then(|meta| meta.modified()).ok();
        let autosaved = modified(&autosave).unwrap_or(SystemTime::UNIX_EPOCH);
        let newer = match source.as_deref().map(modified) {
            None | Some(None) => true,
            Some(Some(saved)) => autosaved > saved,
        };
        newer.then_some(Leftover { text, source })
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
        std::fs::write(&plan_path, "saved").unwrap();
        std::thread::sleep(std::time::Duration::from_millis(20));
        config.write_autosave("newer", Some(&plan_path)).unwrap();
        let leftover = config.leftover_autosave().unwrap();
        assert_eq!(leftover.text, "newer");
        assert_eq!(leftover.source.as_deref(), Some(plan_path.as_path()));
        std::thread::sleep(std::time::Duration::from_millis(20));
        std::fs::write(&plan_path, "saved again").unwrap();
        assert_eq!(config.leftover_autosave(), None);
        config.clear_autosave();
        std::fs::remove_file(&plan_path).unwrap();
        assert_eq!(config.leftover_autosave(), None);
    }
}
