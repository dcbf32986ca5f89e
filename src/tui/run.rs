//! The terminal loop: draw, read a key, update, carry out the file I/O the update asks for.
//! Key releases and repeats are dropped here, at the one place keys come in. `ratatui::run`
//! restores the terminal on every exit path and installs a panic hook that does too.

use super::app::{App, Effect};
use super::view;
use crate::files::{
    BobbinEntry, BobbinLibrary, build_text, discard_recovery, load_build, parse_build,
    read_recovery, recovery_path, save_build_keeping, write_atomic, write_recovery,
};
use crate::model::Build;
use ratatui::DefaultTerminal;
use ratatui::crossterm::event::{self, Event, KeyEventKind};
use std::io::{BufRead, Write};
use std::path::{Path, PathBuf};

/// How often the loop redraws a job's progress while no key comes.
const JOB_TICK: std::time::Duration = std::time::Duration::from_millis(100);

/// Run the planner until the user quits.
pub fn run(mut app: App) -> std::io::Result<()> {
    if app.library.is_empty() {
        app.library = read_library(app.doc.path.as_deref());
    }
    ratatui::run(|terminal| {
        // With NO_COLOR set, crossterm would write a bare SGR reset for every colour change,
        // wiping reverse and bold; the theme drops colours itself instead.
        ratatui::crossterm::style::Colored::set_ansi_color_disabled(false);
        event_loop(terminal, &mut app)
    })
}

fn event_loop(terminal: &mut DefaultTerminal, app: &mut App) -> std::io::Result<()> {
    let mut recovery = Recovery::new(crate::files::recovery_dir());
    loop {
        app.poll_job();
        recovery.update(app);
        terminal.draw(|f| view::draw(app, f))?;
        // While a job runs, wake every tick to redraw its progress and take its result.
        if app.job.is_some() && !event::poll(JOB_TICK)? {
            continue;
        }
        // A resize needs nothing: the next draw takes the new size.
        if let Event::Key(key) = event::read()?
            && key.kind == KeyEventKind::Press
            && let Some(effect) = app.handle_key(&key)
        {
            if effect == Effect::Quit {
                recovery.quit(app);
            }
            if perform(app, effect) {
                recovery.update(app);
                return Ok(());
            }
        }
    }
}

/// Carry out an effect; true when the planner should stop. A write over an existing file
/// (other than saving the document to its own file) asks first, unless the effect is the
/// user's yes to that question.
pub fn perform(app: &mut App, effect: Effect) -> bool {
    let effect = match effect {
        Effect::Confirmed(e) => *e,
        e => {
            if e.replaces(app.doc.path.as_deref())
                .is_some_and(Path::exists)
            {
                app.ask_overwrite(e);
                return false;
            }
            e
        }
    };
    match effect {
        Effect::Quit => true,
        Effect::Save(p) => {
            save(app, &p);
            false
        }
        Effect::SaveThenQuit(p) => save(app, &p),
        Effect::Search => {
            app.start_search();
            false
        }
        Effect::Design(req) => {
            app.start_design(*req);
            false
        }
        Effect::WriteSheet(p) => {
            let page = app.sheet_page(&p);
            let result = write_atomic(&p, &page.text);
            app.wrote_sheet(&p, &page, result);
            false
        }
        Effect::SaveBobbin { path, text } => {
            let result = path
                .parent()
                .map_or(Ok(()), std::fs::create_dir_all)
                .and_then(|()| write_atomic(&path, &text));
            app.wrote_bobbin(&path, result);
            refresh_library(app);
            false
        }
        Effect::Open(p) => {
            match load_build(&p) {
                Ok(b) => {
                    app.opened(b, p);
                    refresh_library(app);
                }
                Err(e) => app.error(format!("cannot open: {e}")),
            }
            false
        }
        // A yes to a yes: carry out the write inside.
        Effect::Confirmed(e) => perform(app, Effect::Confirmed(e)),
    }
}

/// The bobbins a build at `path` can use: bundled, the user's folder, and the `bobbins/`
/// folder beside the file (the demo, with no file, has the first two).
pub fn read_library(path: Option<&Path>) -> Vec<BobbinEntry> {
    match path {
        Some(p) => BobbinLibrary::for_build(p),
        None => BobbinLibrary::standard(),
    }
    .entries()
}

/// Read the library again for the document's file (after it changed, or a bobbin was saved).
pub fn refresh_library(app: &mut App) {
    app.library = read_library(app.doc.path.as_deref());
}

/// Save onto the text of the file the build was read from, so its comments and layout stay.
fn save(app: &mut App, path: &Path) -> bool {
    match save_build_keeping(path, app.doc.path.as_deref(), &app.doc.build) {
        Ok(saved) => {
            // The bobbin may have been written inline: the planner holds what the file says.
            app.doc.build = saved.build.clone();
            app.saved_to(path.to_path_buf());
            refresh_library(app);
            let note = saved.note();
            if !note.is_empty() {
                app.info(format!("saved {}; {note}", path.display()));
            }
            true
        }
        Err(e) => {
            app.error(format!("cannot save {}: {e}", path.display()));
            false
        }
    }
}

/// Keeps the recovery copy in step with the document: written when the build differs from
/// the file, removed when it no longer does (saved, or edits undone).
pub struct Recovery {
    /// The recovery folder (`None`: the platform has none, and nothing is kept).
    dir: Option<PathBuf>,
    /// The file and the build last written as its recovery copy.
    last: Option<(PathBuf, Build)>,
}

impl Recovery {
    pub fn new(dir: Option<PathBuf>) -> Self {
        Recovery { dir, last: None }
    }

    /// Call after every key: writes the copy only when the build changed since the last one.
    pub fn update(&mut self, app: &App) {
        let (Some(path), Some(dir)) = (app.doc.path.clone(), self.dir.clone()) else {
            return;
        };
        if let Some((old, _)) = &self.last
            && *old != path
        {
            discard_recovery(&dir, old);
            self.last = None;
        }
        if !app.dirty() {
            if self.last.take().is_some() {
                discard_recovery(&dir, &path);
            }
            return;
        }
        if self.last.as_ref().is_some_and(|(_, b)| *b == app.doc.build) {
            return;
        }
        // The text a save would write, so a restored copy keeps the file's comments.
        let base = std::fs::read_to_string(&path).ok();
        let (text, _) = build_text(&app.doc.build, base.as_deref(), &path);
        if write_recovery(&dir, &path, &text).is_ok() {
            self.last = Some((path, app.doc.build.clone()));
        }
    }

    /// The user quits without saving: that discards the edits, and their copy.
    pub fn quit(&mut self, app: &App) {
        if let (Some(path), Some(dir)) = (&app.doc.path, &self.dir) {
            discard_recovery(dir, path);
        }
        self.last = None;
    }
}

/// What the user answered to the recovery offer.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Offer {
    /// No copy, or none that reads as a build.
    Nothing,
    Restored,
    Kept,
    Discarded,
}

/// Before the planner starts: when an earlier session left unsaved edits of this file, ask
/// on `out` whether to restore them, keep the copy for later, or discard it (a line read from
/// `input`: y, n or d). End of input keeps the copy. `dir` is the recovery folder.
pub fn offer_recovery(
    app: &mut App,
    dir: &Path,
    input: &mut dyn BufRead,
    out: &mut dyn Write,
) -> Offer {
    let Some(path) = app.doc.path.clone() else {
        return Offer::Nothing;
    };
    let Some(text) = read_recovery(dir, &path) else {
        return Offer::Nothing;
    };
    let copy = recovery_path(dir, &path).unwrap_or_default();
    let recovered = match parse_build(&text, Some(&path), &BobbinLibrary::for_build(&path)) {
        Ok(b) => b,
        Err(e) => {
            let _ = writeln!(
                out,
                "turnstack: a recovery copy of {} cannot be read ({}); it is left at {}",
                path.display(),
                e.message,
                copy.display()
            );
            return Offer::Nothing;
        }
    };
    if recovered == app.doc.build {
        discard_recovery(dir, &path);
        return Offer::Nothing;
    }
    let age = std::fs::metadata(&copy)
        .ok()
        .and_then(|m| m.modified().ok())
        .and_then(|t| t.elapsed().ok())
        .map_or_else(String::new, |d| format!(" ({} min ago)", d.as_secs() / 60));
    let _ = write!(
        out,
        "turnstack: {} has unsaved edits from an earlier session{age}.\n\
         Restore them? y = restore, n = not now (keep the copy), d = discard the copy: ",
        path.display()
    );
    let _ = out.flush();
    let mut line = String::new();
    let _ = input.read_line(&mut line);
    match line.trim().to_ascii_lowercase().as_str() {
        "y" | "yes" => {
            let original = app.doc.build.clone();
            let theme = app.ui.theme;
            *app = App::new(recovered, Some(path));
            app.ui.theme = theme;
            app.doc.saved = Some(original);
            app.info("restored the unsaved edits of an earlier session: W saves them, u cannot undo past them");
            Offer::Restored
        }
        "d" | "discard" => {
            discard_recovery(dir, &path);
            let _ = writeln!(out, "turnstack: the recovery copy is discarded");
            Offer::Discarded
        }
        _ => {
            let _ = writeln!(
                out,
                "turnstack: the recovery copy is kept at {}; it is offered again next time",
                copy.display()
            );
            Offer::Kept
        }
    }
}
