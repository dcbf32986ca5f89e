//! The terminal loop: draw, read a key, update, carry out the file I/O the update asks for.
//! Key releases and repeats are dropped here, at the one place keys come in. `ratatui::run`
//! restores the terminal on every exit path and installs a panic hook that does too.

use super::app::{App, Effect};
use super::view;
use crate::files::{BobbinEntry, BobbinLibrary, load_build, save_build, write_atomic};
use ratatui::DefaultTerminal;
use ratatui::crossterm::event::{self, Event, KeyEventKind};
use std::path::Path;

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
    loop {
        terminal.draw(|f| view::draw(app, f))?;
        // A resize needs nothing: the next draw takes the new size.
        if let Event::Key(key) = event::read()?
            && key.kind == KeyEventKind::Press
            && let Some(effect) = app.handle_key(&key)
        {
            // A search takes a moment: show its "searching..." before it starts.
            if effect == Effect::Search {
                terminal.draw(|f| view::draw(app, f))?;
            }
            if perform(app, effect) {
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
            app.run_search();
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

fn save(app: &mut App, path: &Path) -> bool {
    match save_build(path, &app.doc.build) {
        Ok(()) => {
            app.saved_to(path.to_path_buf());
            refresh_library(app);
            true
        }
        Err(e) => {
            app.error(format!("cannot save {}: {e}", path.display()));
            false
        }
    }
}
