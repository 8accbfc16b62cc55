//! Frees scenes off the window's thread. A large frame's scene holds
//! thousands of solids and triangle lists, and freeing them one by one
//! took a noticeable share of a drag's frame on the window's thread.

use std::sync::mpsc::{Sender, channel};
use std::sync::{Arc, Mutex, OnceLock};

use super::scene::Scene;

/// The freeing thread's inbox, `None` where no thread could be started.
static INBOX: OnceLock<Option<Mutex<Sender<Arc<Scene>>>>> = OnceLock::new();

/// Lets go of `scene` on the freeing thread (here, where there is none):
/// if this was the last hold on it, that is where it is freed.
pub fn retire(scene: Arc<Scene>) {
    let inbox = INBOX.get_or_init(|| {
        let (sender, receiver) = channel::<Arc<Scene>>();
        let started = std::thread::Builder::new().name("freeing".to_owned()).spawn(move || {
            // Each scene is dropped as it arrives; the loop ends when the
            // program does.
            for scene in receiver {
                drop(scene);
            }
        });
        started.ok().map(|_| Mutex::new(sender))
    });
    let sent = inbox.as_ref().and_then(|sender| sender.lock().ok()).map(|sender| sender.send(scene));
    // A send fails only when the thread has gone, and hands the scene
    // back: it is then freed here.
    drop(sent);
}
