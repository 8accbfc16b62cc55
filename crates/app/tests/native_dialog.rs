//! Opens and saves a plan through the desktop's own file dialog, as a user
//! would: the real window under a virtual X display, keys sent with
//! xdotool, and the dialog that rfd shows there (GTK's file chooser, by
//! zenity, where no desktop portal runs).
#![allow(clippy::expect_used, reason = "in a test a failed expectation is a failed test")]

mod common;

use std::path::{Path, PathBuf};
use std::process::{Child, Command, Stdio};
use std::time::{Duration, Instant};

use common::VirtualDisplay;

/// How long the debug build under software GL may take for each step.
const PATIENCE: Duration = Duration::from_secs(120);

/// The app's window, killed when dropped.
struct RunningApp {
    child: Child,
    display: String,
}

impl Drop for RunningApp {
    fn drop(&mut self) {
        let _ = self.child.kill();
        let _ = self.child.wait();
        // The dialog is the app's child process; it must not outlive the test.
        let _ = Command::new("pkill").args(["-f", "zenity --no-markup --file-selection"]).status();
    }
}

fn needs(program: &str, package: &str) {
    let found = Command::new("sh")
        .args(["-c", &format!("command -v {program}")])
        .stdout(Stdio::null())
        .status()
        .is_ok_and(|status| status.success());
    assert!(
        found,
        "this test needs {program}: install the `{package}` package (scripts/install-test-packages)"
    );
}

fn scratch(name: &str) -> PathBuf {
    let dir = std::env::temp_dir().join(format!("pitchframe-native-dialog-{name}-{}", std::process::id()));
    let _ = std::fs::remove_dir_all(&dir);
    std::fs::create_dir_all(&dir).expect("cannot create a scratch folder");
    dir
}

/// Runs `xdotool` on `display`; its standard output, trimmed.
fn xdotool(display: &str, args: &[&str]) -> Option<String> {
    let out =
        Command::new("xdotool").args(args).env("DISPLAY", display).stderr(Stdio::null()).output().ok()?;
    out.status.success().then(|| String::from_utf8_lossy(&out.stdout).trim().to_owned())
}

/// Waits until `found` gives a value, or fails naming `what`.
fn wait_for<T>(what: &str, mut found: impl FnMut() -> Option<T>) -> T {
    let started = Instant::now();
    loop {
        if let Some(value) = found() {
            return value;
        }
        assert!(started.elapsed() < PATIENCE, "waited {} s for {what}", PATIENCE.as_secs());
        std::thread::sleep(Duration::from_millis(250));
    }
}

/// The first window whose `kind` (`--name` or `--class`) matches `pattern`.
fn window(display: &str, kind: &str, pattern: &str) -> Option<String> {
    xdotool(display, &["search", "--onlyvisible", kind, pattern])?.lines().last().map(str::to_owned)
}

fn window_name(display: &str, window: &str) -> String {
    xdotool(display, &["getwindowname", window]).unwrap_or_default()
}

/// Starts the app on the demo with its settings in `home` (the cautions marked
/// as shown so no first-start dialog is in the way) and no session bus, so
/// rfd shows its dialog through zenity.
/// `None` when the app could not reach the display (a virtual display that
/// went away under it, seen on a machine running many at once), so the
/// caller can try a fresh one.
fn start_app(display: &VirtualDisplay, home: &Path) -> Option<(RunningApp, String)> {
    let config = home.join("config");
    std::fs::create_dir_all(config.join("pitchframe")).expect("cannot create the settings folder");
    std::fs::write(config.join("pitchframe/safety-shown"), "shown\n").expect("cannot write the settings");
    let mut command = Command::new(env!("CARGO_BIN_EXE_pitchframe"));
    command
        .env("DISPLAY", &display.display)
        .env("HOME", home)
        .env("XDG_CONFIG_HOME", &config)
        .env("XDG_STATE_HOME", home.join("state"))
        .env("LIBGL_ALWAYS_SOFTWARE", "1")
        .env_remove("WAYLAND_DISPLAY")
        .env_remove("DBUS_SESSION_BUS_ADDRESS")
        .stdout(Stdio::null())
        .stderr(std::fs::File::create(home.join("app.log")).expect("cannot create the app's log"));
    let mut app = RunningApp {
        child: command.spawn().expect("cannot start pitchframe"),
        display: display.display.clone(),
    };
    let log = || std::fs::read_to_string(home.join("app.log")).unwrap_or_default();
    let started = Instant::now();
    let main = loop {
        if let Some(main) = window(&app.display, "--name", "Pitchframe") {
            break main;
        }
        if let Ok(Some(status)) = app.child.try_wait() {
            if log().contains("Failed to open connection to X server") {
                return None;
            }
            panic!("pitchframe exited ({status}) before its window showed:\n{}", log());
        }
        if started.elapsed() > PATIENCE {
            let windows = xdotool(&app.display, &["search", "--name", "."]).unwrap_or_default();
            let names: Vec<String> = windows.lines().map(|w| window_name(&app.display, w)).collect();
            panic!(
                "no Pitchframe window in {} s; windows: {names:?}; the app's log:\n{}",
                PATIENCE.as_secs(),
                log()
            );
        }
        std::thread::sleep(Duration::from_millis(250));
    };
    Some((app, main))
}

/// A virtual display with the app running in it, trying a fresh display
/// when the app could not connect to the first.
fn start_on_a_display(home: &Path) -> (VirtualDisplay, RunningApp, String) {
    for _ in 0..3 {
        let display = VirtualDisplay::start();
        if let Some((app, main)) = start_app(&display, home) {
            return (display, app, main);
        }
    }
    panic!("pitchframe could not connect to any of three virtual displays");
}

/// Sends `keys` to the app's window, waits for the file dialog and types
/// `path` into it (Ctrl+L opens the chooser's location field; in a save
/// dialog the name field takes a whole path) with Return, until `done`.
/// GTK's chooser shows its window before it takes keys, and under load
/// that can be seconds, so an answer that did not land is typed again.
fn answer_dialog(app: &RunningApp, main: &str, keys: &str, path: &Path, done: impl Fn() -> bool) {
    let display = app.display.as_str();
    let path = path.to_str().expect("the scratch path is UTF-8");
    // Let the first frames settle so the key reaches a running event loop.
    std::thread::sleep(Duration::from_secs(2));
    xdotool(display, &["windowfocus", "--sync", main]);
    xdotool(display, &["key", "--window", main, keys]);
    let started = Instant::now();
    while started.elapsed() < PATIENCE {
        let Some(dialog) = window(display, "--class", "zenity") else {
            if done() {
                return;
            }
            std::thread::sleep(Duration::from_millis(250));
            continue;
        };
        std::thread::sleep(Duration::from_secs(2));
        xdotool(display, &["windowfocus", "--sync", &dialog]);
        xdotool(display, &["key", "ctrl+l"]);
        std::thread::sleep(Duration::from_millis(300));
        xdotool(display, &["key", "ctrl+a"]);
        xdotool(display, &["type", "--delay", "20", path]);
        std::thread::sleep(Duration::from_millis(300));
        xdotool(display, &["key", "Return"]);
        let typed = Instant::now();
        while typed.elapsed() < Duration::from_secs(15) {
            if done() {
                return;
            }
            std::thread::sleep(Duration::from_millis(250));
        }
    }
    panic!("the dialog opened with {keys} did not take the path {path} within {} s", PATIENCE.as_secs());
}

#[test]
fn a_plan_opens_and_saves_through_the_native_file_dialog() {
    needs("xdotool", "xdotool");
    needs("zenity", "zenity");
    let home = scratch("home");
    let example = Path::new(env!("CARGO_MANIFEST_DIR")).join("../../examples/hillside-cottage.toml");
    let chosen = home.join("cottage-to-open.toml");
    std::fs::copy(&example, &chosen).expect("cannot copy the example plan");

    // Open: the app starts on the demo, Ctrl+O, the dialog is given the path.
    let (display, app, main) = start_on_a_display(&home);
    answer_dialog(&app, &main, "ctrl+o", &chosen, || {
        window_name(&app.display, &main).contains("cottage-to-open.toml")
    });

    // Save as: Ctrl+Shift+S, a new name without `.toml`, which the app adds.
    let saved = home.join("cottage-saved");
    let saved_as = saved.with_extension("toml");
    answer_dialog(&app, &main, "ctrl+shift+s", &saved, || saved_as.is_file());
    let saved = saved_as;
    wait_for("the window to show the new name", || {
        window_name(&app.display, &main).contains("cottage-saved.toml").then_some(())
    });
    drop(app);
    drop(display);

    // The saved file is the opened plan, read back by the geometry crate.
    let opened =
        pitchframe_geometry::Plan::from_toml(&std::fs::read_to_string(&chosen).expect("the opened plan"))
            .expect("the example plan loads");
    let written = std::fs::read_to_string(&saved).expect("the saved plan");
    let reread = pitchframe_geometry::Plan::from_toml(&written).expect("the saved plan loads");
    assert_eq!(reread, opened, "the plan saved through the dialog differs from the one opened");
    let _ = std::fs::remove_dir_all(&home);
}
