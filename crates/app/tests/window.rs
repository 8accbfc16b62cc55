//! Runs the real window under a virtual X display with software OpenGL and
//! checks what it drew, from the PNG it saves with `--picture`.
#![allow(clippy::expect_used, reason = "in a test a failed expectation is a failed test")]

use std::path::{Path, PathBuf};
use std::process::{Command, Stdio};
use std::time::{Duration, Instant};

/// The 3D view's background, as drawn (must match the app's clear colour).
const BACKGROUND_RGB: [u8; 3] = [206, 218, 232];

mod common;
use common::VirtualDisplay;

/// Where the test pictures are kept for people to look at.
fn artifact(name: &str) -> PathBuf {
    let dir = Path::new(env!("CARGO_MANIFEST_DIR")).join("../../tests/artifacts");
    std::fs::create_dir_all(&dir).expect("cannot create tests/artifacts");
    dir.join(name)
}

/// Runs the app with `args` plus `--picture out`, waits for it, returns the picture.
fn picture(display: &VirtualDisplay, name: &str, args: &[&str], pick: Option<&str>) -> image::RgbaImage {
    let out = artifact(name);
    let _ = std::fs::remove_file(&out);
    let mut child = Command::new(env!("CARGO_BIN_EXE_pitchframe"))
        .args(args)
        .arg("--picture")
        .arg(&out)
        .env("DISPLAY", &display.display)
        .env("LIBGL_ALWAYS_SOFTWARE", "1")
        .env_remove("WAYLAND_DISPLAY")
        .env("PITCHFRAME_PICK", pick.unwrap_or(""))
        .stdout(Stdio::piped())
        .stderr(Stdio::piped())
        .spawn()
        .expect("cannot start pitchframe");
    let started = Instant::now();
    let status = loop {
        if let Some(status) = child.try_wait().expect("cannot wait for pitchframe") {
            break status;
        }
        if started.elapsed() > Duration::from_secs(120) {
            let _ = child.kill();
            panic!("pitchframe did not exit within 120 s of being asked for a picture");
        }
        std::thread::sleep(Duration::from_millis(100));
    };
    let output = child.wait_with_output().expect("cannot read pitchframe's output");
    assert!(
        status.success(),
        "pitchframe --picture failed ({status}):\n{}",
        String::from_utf8_lossy(&output.stderr)
    );
    image::open(&out).expect("cannot read the saved picture").to_rgba8()
}

/// The bounding box of pixels within `tolerance` of `rgb`: (x0, y0, x1, y1).
fn bounding_box_of(picture: &image::RgbaImage, rgb: [u8; 3], tolerance: u8) -> Option<(u32, u32, u32, u32)> {
    let mut found: Option<(u32, u32, u32, u32)> = None;
    for (x, y, pixel) in picture.enumerate_pixels() {
        if close(pixel.0, rgb, tolerance) {
            found = Some(match found {
                None => (x, y, x, y),
                Some((x0, y0, x1, y1)) => (x0.min(x), y0.min(y), x1.max(x), y1.max(y)),
            });
        }
    }
    found
}

fn close(pixel: [u8; 4], rgb: [u8; 3], tolerance: u8) -> bool {
    pixel[..3].iter().zip(rgb).all(|(&a, b)| a.abs_diff(b) <= tolerance)
}

/// Pixels inside the box for which `test` holds.
fn count_in(picture: &image::RgbaImage, bbox: (u32, u32, u32, u32), test: impl Fn([u8; 4]) -> bool) -> usize {
    let (x0, y0, x1, y1) = bbox;
    (y0..=y1)
        .flat_map(|y| (x0..=x1).map(move |x| (x, y)))
        .filter(|&(x, y)| test(picture.get_pixel(x, y).0))
        .count()
}

/// The picked piece's lit highlight (a magenta no member kind uses, must
/// match the app's palette): strong red and blue, little green.
fn highlight_coloured(pixel: [u8; 4]) -> bool {
    let [r, g, b, _] = pixel;
    r > 150 && b > 120 && g < 90
}

/// Cut-face colours, drawn unlit so they arrive exactly (must match the
/// app's palette). Only those with a zero channel are listed: lit colours
/// never reach zero in any channel because the ambient light lifts them.
const CUT_FACE_RGB: [[u8; 3]; 6] =
    [[255, 150, 0], [0, 220, 255], [0, 80, 255], [255, 235, 0], [150, 255, 0], [140, 0, 255]];

/// The 3D view's box in the picture: the one large area cleared to the
/// background colour.
fn view_box(picture: &image::RgbaImage) -> (u32, u32, u32, u32) {
    bounding_box_of(picture, BACKGROUND_RGB, 2)
        .expect("no pixel of the 3D view's background colour: the view was not drawn")
}

/// Warm tan, as the lit walls are drawn: clearly more red than blue, far
/// from both the blue-grey background and egui's neutral greys.
fn wall_coloured(pixel: [u8; 4]) -> bool {
    let [r, g, b, _] = pixel.map(i32::from);
    r - b > 30 && r >= g && g > b
}

#[test]
fn window_draws_the_demo_walls_in_the_3d_view() {
    let display = VirtualDisplay::start();
    let picture = picture(&display, "window.png", &[], None);

    let view = view_box(&picture);
    let (x0, y0, x1, y1) = view;
    let (view_w, view_h) = (x1 - x0 + 1, y1 - y0 + 1);
    assert!(
        view_w > picture.width() / 2 && view_h > picture.height() / 2,
        "the 3D view covers only {view_w} x {view_h} of a {} x {} window",
        picture.width(),
        picture.height()
    );

    // Walls: a good share of the view shows the lit wall colour (the house
    // is framed to fill the view; its walls are a thin L seen from above a
    // corner, so a few percent of the view is already plenty).
    let view_pixels = (view_w * view_h) as usize;
    let walls = count_in(&picture, view, wall_coloured);
    assert!(walls * 100 > view_pixels * 2, "only {walls} of {view_pixels} view pixels show the wall colour");
    // And the walls sit in the view's middle, where the camera aims.
    let middle = (x0 + view_w / 4, y0 + view_h / 4, x1 - view_w / 4, y1 - view_h / 4);
    assert!(count_in(&picture, middle, wall_coloured) > 500, "no walls in the middle of the view");
    // The lit walls show more than one shade: the light is directional.
    let shades: std::collections::BTreeSet<[u8; 3]> = (y0..=y1)
        .flat_map(|y| (x0..=x1).map(move |x| (x, y)))
        .map(|(x, y)| picture.get_pixel(x, y).0)
        .filter(|&p| wall_coloured(p))
        .map(|p| [p[0] / 16, p[1] / 16, p[2] / 16])
        .collect();
    assert!(shades.len() >= 2, "the walls show a single flat shade: {shades:?}");
    // Nothing is picked, so the highlight colour is nowhere in the view.
    assert_eq!(count_in(&picture, view, highlight_coloured), 0, "a highlight shows with nothing picked");
}

#[test]
fn picking_a_member_highlights_it_and_colours_its_cut_faces() {
    let display = VirtualDisplay::start();
    // HJ1: the demo's first hip jack, short enough that its cut faces show
    // large when the view zooms to it.
    let picture = picture(&display, "window-pick.png", &[], Some("HJ1"));
    let view = view_box(&picture);
    let highlighted = count_in(&picture, view, highlight_coloured);
    assert!(highlighted > 2000, "only {highlighted} view pixels show the highlight colour");
    let cut_faces = count_in(&picture, view, |p| CUT_FACE_RGB.iter().any(|&rgb| close(p, rgb, 3)));
    assert!(cut_faces > 30, "only {cut_faces} view pixels show a cut-face colour");
}

#[test]
fn no_display_is_reported_in_words_not_a_panic() {
    let output = Command::new(env!("CARGO_BIN_EXE_pitchframe"))
        .env_remove("DISPLAY")
        .env_remove("WAYLAND_DISPLAY")
        .env_remove("WAYLAND_SOCKET")
        .output()
        .expect("cannot start pitchframe");
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert!(!output.status.success(), "pitchframe with no display exited successfully");
    assert!(stderr.contains("could not create a GL context"), "unexpected message:\n{stderr}");
    assert!(!stderr.contains("panicked"), "pitchframe panicked:\n{stderr}");
}

#[test]
fn a_picture_of_the_view_is_drawn_off_screen_at_the_size_asked() {
    let display = VirtualDisplay::start();
    let out = artifact("view-picture.png");
    let _ = std::fs::remove_file(&out);
    // The window's own files (the first-start cautions, recent files) go
    // in a folder of the test's, not the user's.
    let config = std::env::temp_dir().join(format!("pitchframe-view-picture-{}", std::process::id()));
    let output = Command::new(env!("CARGO_BIN_EXE_pitchframe"))
        .env("DISPLAY", &display.display)
        .env("LIBGL_ALWAYS_SOFTWARE", "1")
        .env_remove("WAYLAND_DISPLAY")
        .env("XDG_CONFIG_HOME", &config)
        .env("PITCHFRAME_VIEW_PICTURE", &out)
        .env("PITCHFRAME_VIEW_PICTURE_SIZE", "640x480")
        .output()
        .expect("cannot start pitchframe");
    let _ = std::fs::remove_dir_all(&config);
    let stderr = String::from_utf8_lossy(&output.stderr);
    assert!(output.status.success(), "pitchframe failed:\n{stderr}");
    assert!(stderr.contains("Wrote the picture (640 x 480 pixels)"), "{stderr}");
    let picture = image::open(&out).expect("cannot read the picture").to_rgba8();
    assert_eq!(picture.dimensions(), (640, 480));
    // The corners are the view's background, exactly as the window clears
    // it: the picture is drawn with the window's colours.
    for (x, y) in [(0, 0), (639, 0), (0, 479), (639, 479)] {
        assert!(
            close(picture.get_pixel(x, y).0, BACKGROUND_RGB, 2),
            "corner {x},{y}: {:?}",
            picture.get_pixel(x, y)
        );
    }
    // The house fills the middle, lit in more than one shade.
    let middle = (160, 120, 480, 360);
    let walls = count_in(&picture, middle, wall_coloured);
    assert!(walls > 2000, "only {walls} pixels in the middle show the wall colour");
}
