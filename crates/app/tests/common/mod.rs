//! What the window tests share: a virtual X display to run the app in.
#![allow(clippy::expect_used, reason = "in a test a failed expectation is a failed test")]

use std::io::Read;
use std::process::{Child, Command, Stdio};

/// A virtual X display, stopped when dropped.
pub struct VirtualDisplay {
    server: Child,
    /// The `DISPLAY` value that reaches it.
    pub display: String,
}

impl VirtualDisplay {
    /// Starts Xvfb on a free display number, which it reports on a pipe.
    pub fn start() -> Self {
        match Command::new("Xvfb").arg("-version").stdout(Stdio::null()).stderr(Stdio::null()).status() {
            Ok(_) => {}
            Err(err) if err.kind() == std::io::ErrorKind::NotFound => panic!(
                "the window tests need Xvfb, a virtual X server: install the `xvfb` package \
                 (apt-get install xvfb)"
            ),
            Err(err) => panic!("cannot run Xvfb: {err}"),
        }
        // `-displayfd 3` makes Xvfb pick a free display and write its number
        // to descriptor 3, which the shell points at our pipe; `exec` makes
        // the child's id Xvfb's own, so dropping this kills the server.
        let mut server = Command::new("sh")
            .args(["-c", "exec Xvfb -displayfd 3 -screen 0 1280x800x24 -nolisten tcp 3>&1 1>/dev/null 2>&1"])
            .stdout(Stdio::piped())
            .stderr(Stdio::null())
            .spawn()
            .expect("cannot start Xvfb");
        let mut reader = server.stdout.take().expect("Xvfb's pipe");
        let mut number = String::new();
        let mut byte = [0u8; 1];
        while reader.read(&mut byte).expect("cannot read from Xvfb") == 1 && byte[0] != b'\n' {
            number.push(char::from(byte[0]));
        }
        assert!(!number.trim().is_empty(), "Xvfb exited without reporting a display number");
        Self { server, display: format!(":{}", number.trim()) }
    }
}

impl Drop for VirtualDisplay {
    fn drop(&mut self) {
        let _ = self.server.kill();
        let _ = self.server.wait();
    }
}
