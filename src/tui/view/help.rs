//! The help screen: every binding of the key map, grouped by where it applies.

use super::super::app::App;
use super::super::keymap::{BINDINGS, Context, keys_label};
use super::{pad, wrap};
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Block, Clear, Paragraph};

const ORDER: [Context; 10] = [
    Context::Main,
    Context::Stack,
    Context::Windings,
    Context::List,
    Context::Prompt,
    Context::Question,
    Context::HelpScreen,
    Context::Readings,
    Context::ResetRatio,
    Context::Job,
];

/// Every line of the help, for drawing and for tests.
pub fn lines(app: &App, width: usize) -> Vec<Line<'static>> {
    let t = &app.ui.theme;
    let key_w = 20.min(width / 3);
    let mut out: Vec<Line<'static>> = [
        "turnstack edits the build; every figure comes from the engine and updates at once.",
        "In the drawing each winding is its letter (case alternates turn by turn where a turn \
         is wide enough), ═ is tape, ─ tape between layers, ░ margin, · empty width.",
    ]
    .iter()
    .flat_map(|p| wrap(p, width))
    .map(|l| Line::from(l).style(t.dim()))
    .collect();
    let desc_w = width.saturating_sub(key_w + 2).max(10);
    for c in ORDER {
        out.push(Line::from(""));
        out.push(Line::from(Span::styled(c.title().to_string(), t.title())));
        for bd in BINDINGS.iter().filter(|bd| bd.context == c) {
            for (i, part) in wrap(bd.help, desc_w).into_iter().enumerate() {
                let keys = if i == 0 {
                    keys_label(bd)
                } else {
                    String::new()
                };
                out.push(Line::from(vec![
                    Span::styled(format!("  {}", pad(&keys, key_w)), t.key()),
                    Span::raw(part),
                ]));
            }
        }
    }
    out
}

pub fn draw(app: &App, frame: &mut Frame, area: Rect, scroll: u16) {
    let rect = area.inner(ratatui::layout::Margin {
        horizontal: 2,
        vertical: 1,
    });
    frame.render_widget(Clear, rect);
    let block = Block::bordered()
        .title(Line::from(" Help: every key (↑↓ scroll, Esc closes) ").style(app.ui.theme.title()));
    let inner = block.inner(rect);
    frame.render_widget(block, rect);
    let all = lines(app, inner.width as usize);
    let max_scroll = (all.len() as u16).saturating_sub(inner.height);
    frame.render_widget(
        Paragraph::new(all).scroll((scroll.min(max_scroll), 0)),
        inner,
    );
}
