//! Pop-ups over the main screen: pick lists, forms, the line editor and questions.

use super::super::app::{App, Effect, Form, FormKind, Picker, Prompt, Question};
use super::{fit, pad, wrap};
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Block, Clear, List, ListItem, ListState, Paragraph, Wrap};
use unicode_width::UnicodeWidthStr;

fn centred(area: Rect, w: u16, h: u16) -> Rect {
    let w = w.min(area.width);
    let h = h.min(area.height);
    Rect::new(
        area.x + (area.width - w) / 2,
        area.y + (area.height - h) / 2,
        w,
        h,
    )
}

fn frame_box(app: &App, frame: &mut Frame, rect: Rect, title: &str, foot: &str) -> Rect {
    frame.render_widget(Clear, rect);
    let t = &app.ui.theme;
    let w = rect.width.saturating_sub(4) as usize;
    let block = Block::bordered()
        .title(Line::from(format!(" {} ", fit(title, w))).style(t.title()))
        .title_bottom(Line::from(format!(" {} ", fit(foot, w))).style(t.dim()));
    let inner = block.inner(rect);
    frame.render_widget(block, rect);
    inner
}

/// A pick list: title, filter, headings and the visible items, the selection marked.
pub fn picker(app: &App, frame: &mut Frame, area: Rect, p: &Picker) {
    let t = &app.ui.theme;
    let visible = p.visible();
    let longest = p
        .items
        .iter()
        .map(|i| i.label.width())
        .chain([p.header.width(), p.title.width()])
        .max()
        .unwrap_or(20) as u16;
    let rect = centred(
        area,
        (longest + 6).max(40),
        (visible.len() as u16 + 5)
            .max(8)
            .min(area.height.saturating_sub(2)),
    );
    let inner = frame_box(
        app,
        frame,
        rect,
        &p.title,
        "↑↓ move · Enter choose · Esc close · type to filter",
    );
    if inner.height < 3 {
        return;
    }
    let w = inner.width as usize;
    frame.render_widget(
        Line::from(fit(&format!("  {}", p.header), w)).style(t.dim()),
        Rect { height: 1, ..inner },
    );
    let filter = if p.filter.is_empty() {
        Line::from(Span::styled("filter: (type)", t.dim()))
    } else {
        Line::from(vec![
            Span::styled("filter: ", t.dim()),
            Span::styled(p.filter.clone(), t.key()),
            Span::raw(format!("  {} match", visible.len())),
        ])
    };
    frame.render_widget(
        filter,
        Rect {
            y: inner.bottom() - 1,
            height: 1,
            ..inner
        },
    );
    let list_area = Rect {
        y: inner.y + 1,
        height: inner.height - 2,
        ..inner
    };
    let items: Vec<ListItem> = visible
        .iter()
        .map(|it| ListItem::new(fit(&it.label, w.saturating_sub(2))))
        .collect();
    let mut state = ListState::default();
    if !visible.is_empty() {
        state.select(Some(p.selected.min(visible.len() - 1)));
    }
    frame.render_stateful_widget(
        List::new(items)
            .highlight_style(t.selected())
            .highlight_symbol("▶ "),
        list_area,
        &mut state,
    );
}

/// A form's title: what it edits, and the file's table where it has one.
fn form_title(app: &App, kind: FormKind) -> String {
    match kind {
        FormKind::Setup => "Setup".to_string(),
        FormKind::Winding(k) => format!(
            "Winding {}",
            app.doc
                .build
                .windings
                .get(k)
                .map_or("", |w| w.name.as_str())
        ),
        FormKind::Bobbin => "Measured bobbin and core".to_string(),
        FormKind::Operating => "Operating point [operating]".to_string(),
        FormKind::Material => "Core material [material]".to_string(),
        FormKind::Isolation => "Isolation [isolation]".to_string(),
        FormKind::Readings => "Bench readings [measured]".to_string(),
        FormKind::Requirements => "New build from requirements".to_string(),
    }
}

/// A form: its rows (label, value), the selection marked, and its notes below.
pub fn form(app: &App, frame: &mut Frame, area: Rect, f: &Form) {
    let t = &app.ui.theme;
    let rows = app.form_rows(f.kind);
    let title = form_title(app, f.kind);
    let width = 72u16.min(area.width);
    let notes: Vec<String> = app
        .form_notes(f.kind)
        .iter()
        .flat_map(|n| wrap(n, width.saturating_sub(4) as usize))
        .collect();
    let extra = if notes.is_empty() {
        0
    } else {
        notes.len() as u16 + 1
    };
    let rect = centred(area, width, rows.len() as u16 + 2 + extra);
    let inner = frame_box(
        app,
        frame,
        rect,
        &title,
        "↑↓ move · Enter change · Esc close",
    );
    // The rows keep at least three lines; the notes take what is left below them.
    let list_h = inner
        .height
        .saturating_sub(extra)
        .min(rows.len() as u16)
        .max(inner.height.min(3).min(rows.len() as u16));
    let notes_area = Rect {
        y: inner.y + list_h,
        height: inner.height - list_h,
        ..inner
    };
    let inner = Rect {
        height: list_h,
        ..inner
    };
    let lw = 32.min(inner.width as usize / 2);
    let items: Vec<ListItem> = rows
        .iter()
        .map(|row| {
            ListItem::new(Line::from(vec![
                Span::styled(pad(row.label, lw), t.dim()),
                Span::raw(fit(
                    &row.value,
                    (inner.width as usize).saturating_sub(lw + 2),
                )),
            ]))
        })
        .collect();
    let mut state = ListState::default();
    state.select(Some(f.selected.min(rows.len().saturating_sub(1))));
    frame.render_stateful_widget(
        List::new(items)
            .highlight_style(t.selected())
            .highlight_symbol("▶ "),
        inner,
        &mut state,
    );
    if notes_area.height > 1 {
        let mut lines = vec![Line::from("")];
        lines.extend(notes.into_iter().map(|n| Line::from(n).style(t.dim())));
        frame.render_widget(Paragraph::new(lines), notes_area);
    }
}

/// The line editor: what is asked, the text typed and the hint.
pub fn prompt(app: &App, frame: &mut Frame, area: Rect, p: &Prompt) {
    let t = &app.ui.theme;
    let rect = centred(area, 64, 6);
    let inner = frame_box(app, frame, rect, &p.label, "Enter accept · Esc cancel");
    let w = inner.width as usize;
    // Keep the end of a long value (where the cursor is) in view.
    let mut shown = p.text.clone();
    while shown.width() + 2 > w && !shown.is_empty() {
        shown.remove(0);
    }
    // The untouched value shows inverted and says so: typing replaces it.
    let (style, second) = if p.fresh {
        (
            t.selected(),
            "typing replaces this value; Backspace edits it",
        )
    } else {
        (t.key(), "")
    };
    let lines = vec![
        Line::from(vec![
            Span::raw("> "),
            Span::styled(shown, style),
            Span::styled("█", t.base()),
        ]),
        Line::from(Span::styled(fit(second, w), t.dim())),
        Line::from(Span::styled(fit(&p.hint, w), t.dim())),
    ];
    frame.render_widget(Paragraph::new(lines), inner);
}

/// A question with the keys that answer it.
pub fn question(app: &App, frame: &mut Frame, area: Rect, q: &Question) {
    let t = &app.ui.theme;
    let replaced;
    let (title, text, keys) = match q {
        Question::Quit => (
            "Unsaved edits",
            "The build has edits that are not saved.",
            "y quit without saving · s save, then quit · n / Esc stay",
        ),
        Question::DiscardForOpen => (
            "Unsaved edits",
            "Open another file and drop the unsaved edits?",
            "y yes, open · n / Esc stay",
        ),
        Question::DiscardForNew => (
            "Unsaved edits",
            "Start a new build and drop the unsaved edits?",
            "y yes, start anew · n / Esc stay",
        ),
        Question::Overwrite(e) => match &**e {
            Effect::SaveBobbin { .. } => (
                "Bobbin file exists",
                "Your bobbin folder already has a file of that id. Replace it?",
                "y yes, replace it · n / Esc keep it",
            ),
            other => {
                let name = other
                    .replaces(None)
                    .and_then(|p| p.file_name())
                    .map_or(String::new(), |n| n.to_string_lossy().into_owned());
                let what = match other {
                    Effect::WriteSheet(_) => "the winding sheet",
                    _ => "the build",
                };
                replaced = format!("{name} exists. Write {what} over it?");
                (
                    "File exists",
                    replaced.as_str(),
                    "y yes, overwrite · n / Esc cancel",
                )
            }
        },
    };
    let rect = centred(area, 62, 6);
    let inner = frame_box(app, frame, rect, title, "");
    frame.render_widget(
        Paragraph::new(vec![
            Line::from(text),
            Line::from(""),
            Line::from(Span::styled(keys, t.key())),
        ])
        .wrap(Wrap { trim: true }),
        inner,
    );
}
