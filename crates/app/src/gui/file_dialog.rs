//! The desktop's own file dialogs, through rfd. Where the desktop has no
//! dialog to offer (no desktop portal and no zenity, as under a bare
//! virtual display), the window asks for a path in a text field instead.

use std::path::{Path, PathBuf};

use super::export::{ExportKind, with_extension};

/// Why no native dialog could be shown.
pub const NO_DIALOG_MESSAGE: &str = "This desktop offers no file dialog (no desktop portal and no zenity \
                                     were found); type the file's path here instead.";

/// Whether rfd has a dialog to show on this desktop. rfd reports a
/// missing dialog as a cancel, so the check is made before asking.
pub fn native_dialog_available() -> bool {
    if !cfg!(target_os = "linux") {
        return true;
    }
    let session_bus = std::env::var_os("DBUS_SESSION_BUS_ADDRESS").is_some_and(|value| !value.is_empty());
    let zenity = std::env::var_os("PATH")
        .is_some_and(|paths| std::env::split_paths(&paths).any(|dir| dir.join("zenity").is_file()));
    session_bus || zenity
}

fn plan_dialog(start_in: Option<&Path>) -> rfd::FileDialog {
    let dialog = rfd::FileDialog::new().add_filter("Pitchframe plan", &["toml"]);
    match start_in.and_then(Path::parent).filter(|dir| dir.is_dir()) {
        Some(dir) => dialog.set_directory(dir),
        None => dialog,
    }
}

/// Asks for a plan to open; `None` if the user cancels.
pub fn choose_plan_to_open(near: Option<&Path>) -> Option<PathBuf> {
    plan_dialog(near).set_title("Open a plan").pick_file()
}

/// Asks where to save the plan; `None` if the user cancels. A name
/// without `.toml` gets it.
pub fn choose_plan_to_save(near: Option<&Path>, name: &str) -> Option<PathBuf> {
    let path = plan_dialog(near).set_title("Save the plan").set_file_name(name).save_file()?;
    Some(with_toml_extension(path))
}

/// Asks where to write an exported file; `None` if the user cancels. A
/// name without the kind's ending gets it.
pub fn choose_export_path(kind: ExportKind, near: Option<&Path>, name: &str) -> Option<PathBuf> {
    let dialog = rfd::FileDialog::new()
        .add_filter(kind.filter_name(), &[kind.extension()])
        .set_title(format!("Write the {}", kind.noun()))
        .set_file_name(name);
    let dialog = match near.and_then(Path::parent).filter(|dir| dir.is_dir()) {
        Some(dir) => dialog.set_directory(dir),
        None => dialog,
    };
    Some(with_extension(dialog.save_file()?, kind.extension()))
}

/// `path` ending in `.toml`.
pub fn with_toml_extension(path: PathBuf) -> PathBuf {
    if path.extension().is_some_and(|ext| ext.eq_ignore_ascii_case("toml")) {
        path
    } else {
        let mut name = path.into_os_string();
        name.push(".toml");
        PathBuf::from(name)
    }
}

#[cfg(test)]
mod tests {
    use super::*;

    #[test]
    fn saved_plans_end_in_toml() {
        assert_eq!(with_toml_extension(PathBuf::from("/a/house")), PathBuf::from("/a/house.toml"));
        assert_eq!(with_toml_extension(PathBuf::from("/a/house.TOML")), PathBuf::from("/a/house.TOML"));
    }
}
