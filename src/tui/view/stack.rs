//! The stack panel: every section, outermost on top as in the drawing, with its figures.

use super::super::app::{App, Focus};
use super::{fit, pad, panel};
use crate::engine::{SectionKind, WarningAt};
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{List, ListItem, ListState};

pub fn draw(app: &App, frame: &mut Frame, area: Rect) {
    let t = &app.ui.theme;
    let block = panel(
        app,
        "Stack, outermost on top".into(),
        app.ui.focus == Focus::Stack,
    )
    .title_bottom(Line::from(" tube ").centered());
    let inner = block.inner(area);
    frame.render_widget(block, area);
    if inner.height < 2 {
        return;
    }
    let wide = inner.width >= 64;
    let head = if wide {
        format!(
            " {:>2} {:<8}{:>6}{:>7}{:>5}{:>5}{:>6}{:>9}{:>7}{:>7}",
            "#", "section", "turns", "/layer", "lyrs", "last", "tape", "from mm", "h mm", "MLT"
        )
    } else {
        format!(
            " {:>2} {:<6}{:>5}{:>5}{:>4}{:>5}{:>7}{:>6}",
            "#", "what", "N", "/ly", "lyr", "tape", "h mm", "MLT"
        )
    };
    frame.render_widget(
        Line::from(fit(&head, inner.width as usize)).style(t.dim()),
        Rect { height: 1, ..inner },
    );
    let list_area = Rect {
        y: inner.y + 1,
        height: inner.height - 1,
        ..inner
    };
    let n = app.doc.eval.sections.len();
    let items: Vec<ListItem> = (0..n)
        .rev()
        .map(|i| ListItem::new(row(app, i, wide, inner.width as usize)))
        .collect();
    let mut state = ListState::default();
    if n > 0 {
        state.select(Some(n - 1 - app.ui.stack_sel.min(n - 1)));
    }
    let list = List::new(items).highlight_style(if app.ui.focus == Focus::Stack {
        t.selected()
    } else {
        t.title()
    });
    frame.render_stateful_widget(list, list_area, &mut state);
}

fn row(app: &App, i: usize, wide: bool, width: usize) -> Line<'static> {
    let t = &app.ui.theme;
    let s = &app.doc.eval.sections[i];
    let warned = app
        .doc
        .eval
        .warnings
        .iter()
        .any(|w| w.at == WarningAt::Section(i));
    let mark = if s.past_window {
        Span::styled("^", t.bad())
    } else if warned {
        Span::styled("!", t.warn())
    } else {
        Span::raw(" ")
    };
    let num = format!("{:>2} ", i + 1);
    let mut spans = vec![mark, Span::raw(num)];
    let lw = if wide { 8 } else { 6 };
    let (label, style, cols) = columns(app, i);
    spans.push(Span::styled(pad(&label, lw), style));
    let [n, per, lyr, last, tape, from, h, mlt] = cols;
    let rest = if wide {
        format!("{n:>6}{per:>7}{lyr:>5}{last:>5}{tape:>6}{from:>9}{h:>7}{mlt:>7}")
    } else {
        format!("{n:>5}{per:>5}{lyr:>4}{tape:>5}{h:>7}{mlt:>6}")
    };
    spans.push(Span::raw(fit(&rest, width.saturating_sub(4 + lw))));
    Line::from(spans)
}

/// A section's label, its style and its figures' columns (turns, per layer, layers, last
/// layer, tape, from, height, MLT).
fn columns(app: &App, i: usize) -> (String, ratatui::style::Style, [String; 8]) {
    let t = &app.ui.theme;
    let s = &app.doc.eval.sections[i];
    match &s.kind {
        SectionKind::Tape { wraps } => (
            "tape".into(),
            t.tape(),
            [
                String::new(),
                String::new(),
                String::new(),
                String::new(),
                format!("x{wraps}"),
                format!("{:.3}", s.y_mm),
                format!("{:.3}", s.height_mm),
                String::new(),
            ],
        ),
        SectionKind::Winding {
            winding,
            partner,
            turns,
            turns_per_layer,
            layer_count,
            last_layer_turns,
            layer_tape,
            mlt_mm,
            spread,
            ..
        } => {
            let k = app.doc.build.winding_index(winding).unwrap_or(0);
            // A spaced last layer: `~` after the layers (and after the last layer's turns).
            let spaced = if *spread { "~" } else { "" };
            let name = match partner {
                Some(w) => format!("{winding}+{w}"),
                None => winding.to_string(),
            };
            let tape = if *layer_tape > 0 {
                format!("{layer_tape}/ly")
            } else {
                String::new()
            };
            (
                name,
                t.winding(k),
                [
                    turns.to_string(),
                    turns_per_layer.to_string(),
                    format!("{layer_count}{spaced}"),
                    format!("{last_layer_turns}{spaced}"),
                    tape,
                    format!("{:.3}", s.y_mm),
                    format!("{:.3}", s.height_mm),
                    format!("{mlt_mm:.1}"),
                ],
            )
        }
    }
}
