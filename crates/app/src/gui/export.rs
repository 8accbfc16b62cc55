//! Files written from the window: the cut cards, the cut list, the lumber
//! order, the frame as a 3D model and a picture of the 3D view. Each is
//! made from a copy of the plan (or of the picture's pixels) on a thread of
//! its own, so the window keeps drawing while a large plan is framed; the
//! outcome comes back through a channel. The cards, lists and model come
//! from the same functions as `pitchframe cards`, `list`, `order` and
//! `export`.

use std::path::{Path, PathBuf};
use std::sync::Arc;
use std::sync::atomic::{AtomicUsize, Ordering};
use std::sync::mpsc::{Receiver, TryRecvError, channel};
use std::time::Instant;

use pitchframe_cards::{
    CardOptions, LumberOrder, Paper, cut_list_csv, frame_glb, model_scene, render_cards_with_progress,
};
use pitchframe_geometry::{Length, LengthStyle, LengthUnit, Plan};

use crate::cli::{frame_loaded, lumber_order, titled_deck};
use crate::storage::write_atomically;

/// Largest picture side, in pixels: more than a 4K screen, little enough
/// that the GL texture and the PNG fit in memory on any machine that runs
/// the window.
pub const MAX_PICTURE_SIDE_PX: u32 = 8192;

/// What can be written from the window.
#[derive(Debug, Clone, Copy, PartialEq, Eq, Hash)]
pub enum ExportKind {
    /// The printed cut cards.
    Cards,
    /// The cut list as CSV.
    CutList,
    /// The lumber order as CSV.
    LumberOrder,
    /// The frame (with walls and roof) as a binary glTF model.
    Model,
    /// A PNG of the 3D view as it stands.
    Picture,
}

impl ExportKind {
    /// What the file holds, in the words of a message ("the cut cards").
    pub fn noun(self) -> &'static str {
        match self {
            ExportKind::Cards => "cut cards",
            ExportKind::CutList => "cut list",
            ExportKind::LumberOrder => "lumber order",
            ExportKind::Model => "3D frame",
            ExportKind::Picture => "picture",
        }
    }

    /// The file name's ending, without the dot.
    pub fn extension(self) -> &'static str {
        match self {
            ExportKind::Cards => "pdf",
            ExportKind::CutList | ExportKind::LumberOrder => "csv",
            ExportKind::Model => "glb",
            ExportKind::Picture => "png",
        }
    }

    /// The name of the file type in a file dialog's filter.
    pub fn filter_name(self) -> &'static str {
        match self {
            ExportKind::Cards => "PDF document",
            ExportKind::CutList | ExportKind::LumberOrder => "CSV table",
            ExportKind::Model => "glTF binary model",
            ExportKind::Picture => "PNG picture",
        }
    }

    /// A file name for the plan titled `title` ("house cut cards.pdf").
    pub fn file_name(self, title: &str) -> String {
        let stem = title.trim_end_matches(".toml");
        let what = match self {
            ExportKind::Cards => "cut cards",
            ExportKind::CutList => "cut list",
            ExportKind::LumberOrder => "lumber order",
            ExportKind::Model => "frame",
            ExportKind::Picture => "view",
        };
        format!("{stem} {what}.{}", self.extension())
    }

    /// Whether the plan must frame for this file (a picture needs only
    /// what is on screen).
    pub fn needs_frame(self) -> bool {
        self != ExportKind::Picture
    }
}

/// `path` ending in `.extension` (any case), adding it when missing.
pub fn with_extension(path: PathBuf, extension: &str) -> PathBuf {
    if path.extension().is_some_and(|ext| ext.eq_ignore_ascii_case(extension)) {
        path
    } else {
        let mut name = path.into_os_string();
        name.push(".");
        name.push(extension);
        PathBuf::from(name)
    }
}

/// How the cut cards are printed.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct CardChoice {
    /// Paper size.
    pub paper: Paper,
    /// Cards on a page: 1, 2 or 4.
    pub per_page: u8,
    /// Labels of the members whose ends are also printed full size, in
    /// the cards' order.
    pub templates: Vec<String>,
}

impl CardChoice {
    /// Letter for a plan in inches, A4 for one in millimetres, two cards a
    /// page (large enough to read the figures at the saw).
    pub fn for_plan(plan: &Plan) -> Self {
        let paper = match plan.units {
            LengthUnit::Inch => Paper::Letter,
            LengthUnit::Millimetre => Paper::A4,
        };
        Self { paper, per_page: 2, templates: Vec::new() }
    }
}

/// Everything chosen for one file before its name is asked.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct ExportSpec {
    /// Which file.
    pub kind: ExportKind,
    /// How cards are printed (cards only).
    pub cards: CardChoice,
    /// A picture's width and height in pixels (pictures only).
    pub picture_px: [u32; 2],
}

/// A picture of the 3D view waiting to be drawn by the window's renderer.
#[derive(Debug, Clone, PartialEq, Eq)]
pub struct PictureRequest {
    /// Where it goes.
    pub path: PathBuf,
    /// Width and height in pixels.
    pub size_px: [u32; 2],
}

/// Reads a picture side typed in pixels.
pub fn parse_picture_side(text: &str, name: &str) -> Result<u32, String> {
    let trimmed = text.trim().trim_end_matches("px").trim();
    match trimmed.parse::<u32>() {
        Ok(side) if (1..=MAX_PICTURE_SIDE_PX).contains(&side) => Ok(side),
        Ok(side) => Err(format!("Picture {name}: {side} pixels is outside 1 to {MAX_PICTURE_SIDE_PX}")),
        Err(_) => Err(format!("Picture {name}: \"{}\" is not a whole number of pixels", text.trim())),
    }
}

/// A picture's pixels, top row first, four bytes (RGBA) a pixel.
#[derive(Debug, Clone, PartialEq)]
pub struct Pixels {
    /// Width in pixels.
    pub width: u32,
    /// Height in pixels.
    pub height: u32,
    /// The bytes.
    pub rgba: Vec<u8>,
}

/// What a job is to make.
#[derive(Debug, Clone)]
pub enum ExportWork {
    /// A file worked out from the plan.
    FromPlan {
        /// Which file.
        kind: ExportKind,
        /// A copy of the plan as it stood when asked.
        plan: Box<Plan>,
        /// The plan's name, for the cards' heading.
        title: String,
        /// How the cards are printed (cards only).
        cards: CardChoice,
    },
    /// A picture already drawn.
    Picture(Pixels),
}

impl ExportWork {
    /// Which file this makes.
    pub fn kind(&self) -> ExportKind {
        match self {
            ExportWork::FromPlan { kind, .. } => *kind,
            ExportWork::Picture(_) => ExportKind::Picture,
        }
    }
}

/// The file's bytes and a short account of what is in it ("14 members").
pub fn make_bytes(work: ExportWork, progress: &dyn Fn(usize, usize)) -> Result<(Vec<u8>, String), String> {
    match work {
        ExportWork::FromPlan { kind, plan, title, cards } => plan_bytes(kind, *plan, &title, cards, progress),
        ExportWork::Picture(pixels) => {
            let summary = format!("{} x {} pixels", pixels.width, pixels.height);
            png_bytes(pixels).map(|bytes| (bytes, summary))
        }
    }
}

fn plan_bytes(
    kind: ExportKind,
    plan: Plan,
    title: &str,
    cards: CardChoice,
    progress: &dyn Fn(usize, usize),
) -> Result<(Vec<u8>, String), String> {
    let style = pitchframe_cards::length_style(&plan);
    let framed = frame_loaded(plan).map_err(|err| err.0)?;
    let pieces = framed.frame.pieces.len();
    match kind {
        ExportKind::Cards => {
            let deck = titled_deck(title, &framed).map_err(|err| err.0)?;
            let options =
                CardOptions { paper: cards.paper, per_page: cards.per_page, templates: cards.templates };
            let pdf = render_cards_with_progress(&deck, &options, progress).map_err(|err| err.to_string())?;
            Ok((pdf, format!("{} members", deck.members.len())))
        }
        ExportKind::CutList => {
            let deck = titled_deck(title, &framed).map_err(|err| err.0)?;
            let csv = cut_list_csv(&deck.members, style).map_err(|err| err.to_string())?;
            Ok((csv.into_bytes(), format!("{} members", deck.members.len())))
        }
        ExportKind::LumberOrder => {
            let order = lumber_order(&framed).map_err(|err| err.0)?;
            let boards: usize = order.sizes.iter().map(|size| size.boards.len()).sum();
            Ok((lumber_order_csv(&order, style)?.into_bytes(), format!("{boards} boards")))
        }
        ExportKind::Model => {
            let scene = model_scene(&framed.outline, &framed.roof, &framed.frame, true, true);
            let glb = frame_glb(&scene).map_err(|err| err.to_string())?;
            Ok((glb, format!("{pieces} pieces")))
        }
        ExportKind::Picture => Err("a picture is drawn from the 3D view, not from the plan".to_owned()),
    }
}

/// The lumber order as CSV: one row per board to buy (its size, stock
/// length and the pieces cut from it, with the offcut), then one row per
/// piece too long for any stock. Lengths are written as the plan shows
/// them, then repeated as plain inches for a spreadsheet.
pub fn lumber_order_csv(order: &LumberOrder, style: LengthStyle) -> Result<String, String> {
    let len = |inches: f64| Length::from_inches(inches).format(style);
    let mut writer = csv::Writer::from_writer(Vec::new());
    let fail = |err: csv::Error| format!("the lumber order table could not be made: {err}");
    writer
        .write_record(["size", "board", "stock", "pieces", "offcut", "stock (in)", "offcut (in)"])
        .map_err(fail)?;
    for size in &order.sizes {
        for (index, board) in size.boards.iter().enumerate() {
            let pieces: Vec<String> = board
                .pieces
                .iter()
                .map(|piece| format!("{} {}", piece.label, len(piece.length_in)))
                .collect();
            writer
                .write_record([
                    size.size.clone(),
                    (index + 1).to_string(),
                    len(board.stock_in),
                    pieces.join("; "),
                    len(board.offcut_in),
                    format!("{:.4}", board.stock_in),
                    format!("{:.4}", board.offcut_in),
                ])
                .map_err(fail)?;
        }
    }
    for splice in &order.needs_splice {
        let pieces =
            format!("{} x {} {} (needs a splice)", splice.count, splice.label, len(splice.length_in));
        writer
            .write_record([
                splice.size.clone(),
                String::new(),
                String::new(),
                pieces,
                String::new(),
                String::new(),
                String::new(),
            ])
            .map_err(fail)?;
    }
    let bytes =
        writer.into_inner().map_err(|err| format!("the lumber order table could not be made: {err}"))?;
    String::from_utf8(bytes).map_err(|_| "the lumber order table is not text".to_owned())
}

/// The picture as PNG bytes.
fn png_bytes(pixels: Pixels) -> Result<Vec<u8>, String> {
    let Pixels { width, height, rgba } = pixels;
    let image = image::RgbaImage::from_raw(width, height, rgba)
        .ok_or_else(|| "the picture's pixel count does not match its size".to_owned())?;
    let mut bytes = std::io::Cursor::new(Vec::new());
    image
        .write_to(&mut bytes, image::ImageFormat::Png)
        .map_err(|err| format!("the picture could not be encoded: {err}"))?;
    Ok(bytes.into_inner())
}

/// Writes `bytes` to `path` whole or not at all: a file already there is
/// left as it was when the write fails.
pub fn write_export(path: &Path, bytes: &[u8]) -> Result<(), String> {
    write_atomically(path, bytes).map_err(|err| format!("cannot write {}: {err}", path.display()))
}

/// How a job ended: the message for the window.
#[derive(Debug, Clone, PartialEq)]
pub enum JobOutcome {
    /// The file was written; what is in it.
    Written(String),
    /// Nothing was written; why.
    Failed(String),
}

/// A file being made on its own thread.
pub struct ExportJob {
    /// Which file.
    pub kind: ExportKind,
    /// Where it goes.
    pub path: PathBuf,
    /// When it was started.
    pub started: Instant,
    receiver: Receiver<JobOutcome>,
    progress: Arc<JobProgress>,
}

/// How far a job has gone, written by its thread and read by the window:
/// steps done of a total, the total 0 while the job cannot tell.
#[derive(Debug, Default)]
struct JobProgress {
    done: AtomicUsize,
    total: AtomicUsize,
}

impl ExportJob {
    /// Starts making `work` into the file at `path`.
    pub fn start(work: ExportWork, path: PathBuf) -> Self {
        let kind = work.kind();
        let (sender, receiver) = channel();
        let target = path.clone();
        let progress = Arc::new(JobProgress::default());
        let report = Arc::clone(&progress);
        std::thread::spawn(move || {
            let tell = |done: usize, total: usize| {
                report.total.store(total, Ordering::Relaxed);
                report.done.store(done, Ordering::Relaxed);
            };
            let outcome = match make_bytes(work, &tell) {
                Ok((bytes, summary)) => match write_export(&target, &bytes) {
                    Ok(()) => JobOutcome::Written(summary),
                    Err(message) => JobOutcome::Failed(message),
                },
                Err(message) => JobOutcome::Failed(message),
            };
            // The window may have closed; then nobody waits for the answer.
            let _ = sender.send(outcome);
        });
        Self { kind, path, started: Instant::now(), receiver, progress }
    }

    /// The share of the job done, from 0 to 1, for jobs that can tell
    /// (the cut cards, card by card).
    pub fn fraction(&self) -> Option<f32> {
        let total = self.progress.total.load(Ordering::Relaxed);
        let done = self.progress.done.load(Ordering::Relaxed).min(total);
        (total > 0).then(|| done as f32 / total as f32)
    }

    /// The outcome once the job has ended.
    pub fn poll(&self) -> Option<JobOutcome> {
        match self.receiver.try_recv() {
            Ok(outcome) => Some(outcome),
            Err(TryRecvError::Empty) => None,
            Err(TryRecvError::Disconnected) => {
                Some(JobOutcome::Failed("the job stopped before it finished (an internal fault)".to_owned()))
            }
        }
    }

    /// Waits for the job to end (for tests and for closing).
    #[cfg(test)]
    pub fn wait(&self) -> JobOutcome {
        self.receiver
            .recv()
            .unwrap_or_else(|_| JobOutcome::Failed("the job stopped before it finished".to_owned()))
    }
}

#[cfg(test)]
mod tests {
    use pitchframe_geometry::demo_plan;

    use super::super::files::tests::TempFolder;
    use super::*;

    fn demo_work(kind: ExportKind) -> ExportWork {
        let plan = demo_plan().unwrap();
        let cards = CardChoice::for_plan(&plan);
        ExportWork::FromPlan { kind, plan: Box::new(plan), title: "Demo house".to_owned(), cards }
    }

    #[test]
    fn every_plan_file_is_the_kind_its_name_says() {
        let (pdf, _) = make_bytes(demo_work(ExportKind::Cards), &|_, _| {}).unwrap();
        // PDF files open with "%PDF-" (ISO 32000-1, section 7.5.2).
        assert!(pdf.starts_with(b"%PDF-"));
        let (glb, _) = make_bytes(demo_work(ExportKind::Model), &|_, _| {}).unwrap();
        // A binary glTF opens with the magic "glTF" (glTF 2.0 spec, section 4.4.2).
        assert!(glb.starts_with(b"glTF"));
        let (csv, summary) = make_bytes(demo_work(ExportKind::CutList), &|_, _| {}).unwrap();
        let csv = String::from_utf8(csv).unwrap();
        assert!(csv.lines().count() > 5, "{csv}");
        assert!(summary.ends_with("members"));
    }

    #[test]
    fn the_lumber_order_csv_lists_every_piece_of_the_order() {
        let plan = demo_plan().unwrap();
        let style = pitchframe_cards::length_style(&plan);
        let framed = frame_loaded(plan).unwrap();
        let order = lumber_order(&framed).unwrap();
        let text = lumber_order_csv(&order, style).unwrap();
        let mut reader = csv::Reader::from_reader(text.as_bytes());
        let rows: Vec<csv::StringRecord> = reader.records().map(Result::unwrap).collect();
        let boards: usize = order.sizes.iter().map(|s| s.boards.len()).sum();
        assert_eq!(rows.len(), boards + order.needs_splice.len());
        // Every piece the order cuts is named once on its board's row:
        // count the "; "-separated entries against the order's own pieces.
        let pieces_in_order: usize = order.sizes.iter().flat_map(|s| &s.boards).map(|b| b.pieces.len()).sum();
        let pieces_in_csv: usize =
            rows.iter().filter(|row| !row[1].is_empty()).map(|row| row[3].split("; ").count()).sum();
        assert_eq!(pieces_in_csv, pieces_in_order);
        // Derivation: the plain-inch stock column adds up to what the order buys.
        let bought: f64 =
            rows.iter().filter(|r| !r[5].is_empty()).map(|r| r[5].parse::<f64>().unwrap()).sum();
        assert!((bought - order.bought_in()).abs() < 1e-3 * rows.len() as f64);
    }

    #[test]
    fn a_card_job_counts_its_cards_to_the_end_and_a_picture_job_cannot_tell() {
        let folder = TempFolder::new("export-progress");
        let job = ExportJob::start(demo_work(ExportKind::Cards), folder.0.join("cards.pdf"));
        assert!(matches!(job.wait(), JobOutcome::Written(_)));
        assert_eq!(job.fraction(), Some(1.0));
        let pixels = Pixels { width: 1, height: 1, rgba: vec![0, 0, 0, 255] };
        let job = ExportJob::start(ExportWork::Picture(pixels), folder.0.join("view.png"));
        assert!(matches!(job.wait(), JobOutcome::Written(_)));
        assert_eq!(job.fraction(), None);
    }

    #[test]
    fn a_failed_write_names_the_path_and_the_reason() {
        let folder = TempFolder::new("export-fail");
        let path = folder.0.join("missing folder").join("cards.pdf");
        let job = ExportJob::start(demo_work(ExportKind::Cards), path.clone());
        let JobOutcome::Failed(message) = job.wait() else {
            panic!("the write into a missing folder worked")
        };
        assert!(message.contains(&path.display().to_string()), "{message}");
        // The reason is the system's own words for a missing folder.
        assert!(message.contains("No such file or directory"), "{message}");
        assert!(!path.exists());
    }

    #[test]
    fn a_picture_is_written_as_png_of_its_size() {
        let folder = TempFolder::new("export-png");
        let path = folder.0.join("view.png");
        let pixels = Pixels { width: 3, height: 2, rgba: [10u8, 20, 30, 255].repeat(6) };
        let job = ExportJob::start(ExportWork::Picture(pixels), path.clone());
        assert_eq!(job.wait(), JobOutcome::Written("3 x 2 pixels".to_owned()));
        let image = image::open(&path).unwrap().to_rgba8();
        assert_eq!(image.dimensions(), (3, 2));
        assert_eq!(image.get_pixel(2, 1).0, [10, 20, 30, 255]);
    }

    #[test]
    fn names_get_their_ending() {
        assert_eq!(with_extension(PathBuf::from("/a/cards"), "pdf"), PathBuf::from("/a/cards.pdf"));
        assert_eq!(with_extension(PathBuf::from("/a/cards.PDF"), "pdf"), PathBuf::from("/a/cards.PDF"));
        assert_eq!(ExportKind::Cards.file_name("house.toml"), "house cut cards.pdf");
    }
}
