//! The document: the plan being edited, the file it came from, and the
//! plan as last saved, so the window knows whether there is unsaved work.

use std::path::{Path, PathBuf};

use anyhow::Context as _;
use pitchframe_geometry::{Plan, demo_plan};

use crate::storage;

/// A plan for New: a 40 ft x 24 ft box hipped at 6 in 12 with a 16 in
/// overhang, a plain start that any plan can be dragged from.
const NEW_PLAN_TOML: &str = "format = 1\nunits = \"in\"\n\n[roof]\npitch = \"6/12\"\noverhang = 16\n\n\
[[wall]]\nat = [0, 0]\n[[wall]]\nat = [480, 0]\n[[wall]]\nat = [480, 288]\n[[wall]]\nat = [0, 288]\n";

/// What the user edits; everything drawn is derived from `plan`.
#[derive(Debug, Clone, PartialEq)]
pub struct Document {
    /// The plan as it stands.
    pub plan: Plan,
    /// The file the plan is saved in, if any.
    pub path: Option<PathBuf>,
    /// The plan as last opened or saved; `None` when it never was.
    pub saved: Option<Plan>,
    /// What to call a plan with no file.
    untitled_name: String,
}

impl Document {
    /// The built-in demo house.
    pub fn demo() -> anyhow::Result<Self> {
        let plan = demo_plan().context("the built-in demo plan")?;
        Ok(Self { saved: Some(plan.clone()), plan, path: None, untitled_name: "Demo house".to_owned() })
    }

    /// A new plain plan.
    pub fn new_plan() -> anyhow::Result<Self> {
        let plan = Plan::from_toml(NEW_PLAN_TOML).context("the new plan")?;
        Ok(Self { saved: Some(plan.clone()), plan, path: None, untitled_name: "New plan".to_owned() })
    }

    /// Reads the plan file at `path`.
    pub fn open(path: &Path) -> anyhow::Result<Self> {
        let text =
            std::fs::read_to_string(path).with_context(|| format!("cannot read {}", path.display()))?;
        let plan = Plan::from_toml(&text).with_context(|| format!("cannot open {}", path.display()))?;
        Ok(Self {
            saved: Some(plan.clone()),
            plan,
            path: Some(path.to_path_buf()),
            untitled_name: String::new(),
        })
    }

    /// A plan recovered from an autosave: it is unsaved work for `path`.
    pub fn recovered(plan: Plan, path: Option<PathBuf>) -> Self {
        let saved = path.as_deref().and_then(|path| Document::open(path).ok()).map(|document| document.plan);
        Self { plan, path, saved, untitled_name: "Recovered plan".to_owned() }
    }

    /// Writes the plan to `path` (atomically) and makes that its file.
    pub fn save_to(&mut self, path: &Path) -> anyhow::Result<()> {
        storage::save_plan_atomically(path, &self.plan)
            .with_context(|| format!("cannot save {}", path.display()))?;
        self.path = Some(path.to_path_buf());
        self.saved = Some(self.plan.clone());
        Ok(())
    }

    /// Whether the plan has changes not in its file.
    pub fn unsaved(&self) -> bool {
        self.saved.as_ref() != Some(&self.plan)
    }

    /// The file's name, or what the plan is called without one.
    pub fn title(&self) -> String {
        match &self.path {
            Some(path) => path
                .file_name()
                .map_or_else(|| path.display().to_string(), |name| name.to_string_lossy().into_owned()),
            None => self.untitled_name.clone(),
        }
    }
}

#[cfg(test)]
mod tests {
    use super::super::files::tests::TempFolder;
    use super::*;

    #[test]
    fn a_saved_plan_reads_back_equal_and_clean() {
        let folder = TempFolder::new("document");
        let mut document = Document::demo().unwrap();
        document.plan.walls[0].gable = true;
        assert!(document.unsaved());
        let path = folder.0.join("house.toml");
        document.save_to(&path).unwrap();
        assert!(!document.unsaved());
        assert_eq!(document.title(), "house.toml");
        let reopened = Document::open(&path).unwrap();
        assert_eq!(reopened.plan, document.plan);
    }

    #[test]
    fn a_bad_file_says_which_file_and_what_is_wrong() {
        let folder = TempFolder::new("bad");
        let path = folder.0.join("broken.toml");
        std::fs::write(&path, "format = 1\nunits = \"furlongs\"\n").unwrap();
        let message = format!("{:#}", Document::open(&path).unwrap_err());
        assert!(message.contains("broken.toml") && message.contains("furlongs"), "{message}");
    }
}
