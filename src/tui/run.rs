//! The terminal loop: draw, read a key, update, carry out the file I/O the update asks for.
//! Key releases and repeats are dropped here, at the one place keys come in. `ratatui::run`
//! restores the terminal on every exit path and installs a panic hook that does too.

use super::app::{App, Effect};
use super::view;
use crate::files::{load_build, save_build_keeping};
use ratatui::DefaultTerminal;
use ratatui::crossterm::event::{self, Event, KeyEventKind};
use std::path::Path;

/// Run the planner until the user quits.
pub fn run(mut app: App) -> std::io::Result<()> {
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

/// Carry out an effect; true when the planner should stop.
pub fn perform(app: &mut App, effect: Effect) -> bool {
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
            app.write_sheet(&p);
            false
        }
        Effect::SaveBobbin { path, text } => {
            app.save_bobbin_file(&path, &text);
            false
        }
        Effect::Open(p) => {
            match load_build(&p) {
                Ok(b) => app.opened(b, p),
                Err(e) => app.error(format!("cannot open: {e}")),
            }
            false
        }
    }
}

/// Save onto the text of the file the build was read from, so its comments and layout stay.
fn save(app: &mut App, path: &Path) -> bool {
    match save_build_keeping(path, app.path.as_deref(), &app.build) {
        Ok(saved) => {
            // The bobbin may have been written inline: the planner holds what the file says.
            app.build = saved.build.clone();
            app.saved_to(path.to_path_buf());
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
