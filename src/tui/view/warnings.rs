//! The warnings panel: every warning of the engine, each labelled with what it is about;
//! those about the selected section or winding come first, marked.

use super::super::app::{App, Focus};
use super::panel;
use crate::engine::WarningAt;
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Paragraph, Wrap};

pub fn draw(app: &App, frame: &mut Frame, area: Rect) {
    let t = &app.ui.theme;
    let e = &app.doc.eval;
    let selected = match app.ui.focus {
        Focus::Stack => WarningAt::Section(app.ui.stack_sel),
        Focus::Windings => WarningAt::Winding(app.ui.winding_sel),
    };
    let mut list: Vec<_> = e.warnings.iter().collect();
    list.sort_by_key(|w| w.at != selected);
    let here = list.iter().filter(|w| w.at == selected).count();
    let title = if e.warnings.is_empty() {
        "Warnings: none".to_string()
    } else if here > 0 {
        format!(
            "Warnings ({}, {here} about the selection)",
            e.warnings.len()
        )
    } else {
        format!("Warnings ({})", e.warnings.len())
    };
    let block = panel(app, title, false);
    let inner = block.inner(area);
    frame.render_widget(block, area);
    let mut lines = Vec::new();
    for w in list {
        let about = match &w.at {
            WarningAt::Build => "build".to_string(),
            WarningAt::Section(i) => format!("#{}", i + 1),
            WarningAt::Winding(k) => app
                .doc
                .build
                .windings
                .get(*k)
                .map_or("winding".into(), |w| w.name.to_string()),
            WarningAt::Converter => "converter".into(),
        };
        let mark = if w.at == selected { "▶" } else { "!" };
        lines.push(Line::from(vec![
            Span::styled(format!("{mark} {about}: "), t.warn()),
            Span::raw(w.message()),
        ]));
    }
    for n in &e.notes {
        lines.push(Line::from(vec![
            Span::styled("note: ", t.dim()),
            Span::styled(n.to_string(), t.dim()),
        ]));
    }
    if lines.is_empty() {
        lines.push(Line::from(Span::styled("nothing to warn about", t.dim())));
    }
    frame.render_widget(Paragraph::new(lines).wrap(Wrap { trim: true }), inner);
}
