//! Drawing the planner: pure functions of the App into a Frame, one file per panel. Every
//! figure shown is read from the Evaluation; nothing here computes one.

mod check;
mod help;
mod popup;
pub mod readings;
pub mod reset_ratio;
mod stack;
mod status;
mod warnings;
mod windings;
pub mod window;

use super::app::{App, Overlay};
use ratatui::Frame;
use ratatui::layout::{Constraint, Layout, Rect};
use ratatui::text::Line;
use ratatui::widgets::{Block, Paragraph, Wrap};
use unicode_width::UnicodeWidthStr;

/// The smallest terminal the planner draws itself in.
pub const MIN_WIDTH: u16 = 80;
pub const MIN_HEIGHT: u16 = 24;

pub fn draw(app: &App, frame: &mut Frame) {
    let area = frame.area();
    if area.width < MIN_WIDTH || area.height < MIN_HEIGHT {
        too_small(frame, area);
        return;
    }
    let [header, body, status_row] = Layout::vertical([
        Constraint::Length(1),
        Constraint::Fill(1),
        Constraint::Length(1),
    ])
    .areas(area);
    status::header(app, frame, header);
    status::status_line(app, frame, status_row);

    let left_w = (area.width * 11 / 20).max(44);
    let [left, right] =
        Layout::horizontal([Constraint::Length(left_w), Constraint::Fill(1)]).areas(body);

    // Left: the stack, the windings, the warnings.
    let h = left.height;
    let wind_h = (app.doc.build.windings.len() as u16 + 3).min(h / 3).max(4);
    let warn_min = 4;
    let stack_h = (app.doc.build.stack.len() as u16 + 3)
        .max(6)
        .min(h.saturating_sub(wind_h + warn_min));
    let [stack_area, wind_area, warn_area] = Layout::vertical([
        Constraint::Length(stack_h),
        Constraint::Length(wind_h),
        Constraint::Fill(1),
    ])
    .areas(left);
    stack::draw(app, frame, stack_area);
    windings::draw(app, frame, wind_area);
    warnings::draw(app, frame, warn_area);

    // Right: the window drawing over the check figures.
    let rows = check::rows(app, right.width.saturating_sub(2));
    // The drawing first: it needs a row for every layer, tape and marker.
    let window_need = window::rows_wanted(app) + 2;
    let check_h = (rows.len() as u16 + 2)
        .min(right.height.saturating_sub(window_need))
        .max(8);
    let [window_area, check_area] =
        Layout::vertical([Constraint::Fill(1), Constraint::Length(check_h)]).areas(right);
    frame.render_widget(window::WindowView { app }, window_area);
    check::draw(app, frame, check_area, rows);

    for o in &app.ui.overlays {
        match o {
            Overlay::Help { scroll } => help::draw(app, frame, area, *scroll),
            Overlay::Readings { scroll } => readings::draw(app, frame, area, *scroll),
            Overlay::ResetRatio => reset_ratio::draw(app, frame, area),
            Overlay::Picker(p) => popup::picker(app, frame, area, p),
            Overlay::Form(f) => popup::form(app, frame, area, f),
            Overlay::Prompt(p) => popup::prompt(app, frame, area, p),
            Overlay::Question(q) => popup::question(app, frame, area, q),
        }
    }
}

fn too_small(frame: &mut Frame, area: Rect) {
    let msg = format!(
        "make the terminal at least {MIN_WIDTH}x{MIN_HEIGHT} (now {}x{})",
        area.width, area.height
    );
    let lines = (msg.width() as u16).div_ceil(area.width.max(1)).max(1);
    let y = area.y + area.height.saturating_sub(lines) / 2;
    let rect = Rect::new(area.x, y, area.width, lines.min(area.height));
    frame.render_widget(
        Paragraph::new(Line::from(msg).centered()).wrap(Wrap { trim: true }),
        rect,
    );
}

/// A bordered panel; the focused one says so in its title, not only by colour.
pub(crate) fn panel<'a>(app: &App, title: String, focused: bool) -> Block<'a> {
    let t = &app.ui.theme;
    let (mark, style) = if focused {
        ("▶ ", t.focused_border())
    } else {
        ("", t.border())
    };
    Block::bordered()
        .border_style(style)
        .title(Line::from(format!(" {mark}{title} ")).style(t.title()))
}

/// Cut text to a display width.
pub(crate) fn fit(s: &str, width: usize) -> String {
    crate::report::text::truncate(s, width)
}

/// Pad or cut text to exactly a display width.
pub(crate) fn pad(s: &str, width: usize) -> String {
    crate::report::textfmt::pad(s, width)
}

/// Word-wrap text to a display width (a word longer than the width is cut).
pub(crate) fn wrap(text: &str, width: usize) -> Vec<String> {
    crate::report::textfmt::wrap_cut(text, width)
}
