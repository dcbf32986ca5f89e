//! The bench readings against the plan: each reading with what it is, the value measured,
//! the value expected, the band a good part falls in and a word (within / OUT), then what a
//! reading out of its band most likely means. Reads `engine::verify`; the words are
//! `report::verify`'s.

use super::super::app::App;
use super::super::theme::Theme;
use super::wrap;
use crate::engine::verify::{self, Quantity, ReadingCheck, Verification};
use crate::report::verify::{finding_words, value, what};
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{Block, Clear, Paragraph};

/// Width of the result word's column.
const WORD_W: usize = 8;

/// The result of one reading in a word: never colour alone.
pub fn result_word(c: &ReadingCheck) -> &'static str {
    match c.within() {
        Some(true) => "within",
        Some(false) => "OUT",
        None => "n/p",
    }
}

/// Every line of the view, for drawing and for tests.
pub fn lines(app: &App, width: usize) -> Vec<Line<'static>> {
    let t = app.ui.theme;
    let Some(v) = verify::verify(&app.doc.build, &app.doc.eval) else {
        return vec![Line::from(
            "The build has no bench readings: R opens the form.",
        )];
    };
    let mut out = head_lines(&v, width, t);
    for c in &v.checks {
        out.push(Line::from(""));
        out.extend(check_lines(c, width, t));
    }
    out.extend(closing_lines(&v, width, t));
    out
}

/// The temperature the resistances are compared at, and the verdict over every reading.
fn head_lines(v: &Verification, width: usize, t: Theme) -> Vec<Line<'static>> {
    let mut out: Vec<Line<'static>> = Vec::new();
    let head = format!(
        "Resistances compared at {:.1} C{}{}.",
        v.reading_c,
        if v.reading_c_assumed {
            " (no part temperature given: the bench's 20 C)"
        } else {
            ""
        },
        v.frequency_khz
            .map_or(String::new(), |f| format!("; inductances read at {f} kHz"))
    );
    out.extend(
        wrap(&head, width)
            .into_iter()
            .map(|l| Line::from(l).style(t.dim())),
    );
    let off: Vec<String> = v.out_of_tolerance().map(|c| what(&c.quantity)).collect();
    let verdict = if v.checks.is_empty() {
        "No reading to check yet.".to_string()
    } else if off.is_empty() {
        "Every reading is within its band: the part is as planned.".to_string()
    } else {
        format!(
            "{} of {} readings OUT of their band: {}.",
            off.len(),
            v.checks.len(),
            off.join("; ")
        )
    };
    let style = if off.is_empty() { t.good() } else { t.bad() };
    out.extend(
        wrap(&verdict, width)
            .into_iter()
            .map(|l| Line::from(l).style(style)),
    );
    out
}

/// One reading: its word and deviation, its figures, then what an OUT most likely means.
fn check_lines(c: &ReadingCheck, width: usize, t: Theme) -> Vec<Line<'static>> {
    let indent = " ".repeat(WORD_W);
    let body_w = width.saturating_sub(WORD_W).max(10);
    let mut out: Vec<Line<'static>> = Vec::new();
    let word = result_word(c);
    let word_style = match c.within() {
        Some(true) => t.good(),
        Some(false) => t.bad(),
        None => t.dim(),
    };
    let dev = c.deviation().map_or(String::new(), |d| match c.quantity {
        Quantity::Ratio { .. } => format!("  ({:+.2} %)", d * 100.0),
        _ => format!("  ({:+.1} %)", d * 100.0),
    });
    out.push(Line::from(vec![
        Span::styled(format!("{word:<WORD_W$}"), word_style),
        Span::styled(format!("{}{dev}", what(&c.quantity)), t.title()),
    ]));
    let figures = match &c.prediction {
        Some(p) => format!(
            "measured {} · expected {} · band {} to {}",
            value(&c.quantity, c.measured),
            value(&c.quantity, p.expected),
            value(&c.quantity, p.low),
            value(&c.quantity, p.high)
        ),
        None => format!(
            "measured {} · not predicted: the plan lacks the core figures",
            value(&c.quantity, c.measured)
        ),
    };
    for l in wrap(&figures, body_w) {
        out.push(Line::from(format!("{indent}{l}")));
    }
    for f in &c.findings {
        for (i, l) in wrap(&finding_words(f), body_w.saturating_sub(2))
            .into_iter()
            .enumerate()
        {
            let mark = if i == 0 { "- " } else { "  " };
            out.push(Line::from(format!("{indent}{mark}{l}")).style(t.dim()));
        }
    }
    out
}

/// The hipot record with its caution, and the user's note.
fn closing_lines(v: &Verification, width: usize, t: Theme) -> Vec<Line<'static>> {
    let mut out: Vec<Line<'static>> = Vec::new();
    if let Some(h) = &v.hipot {
        out.push(Line::from(""));
        let text = format!(
            "Hipot (recorded, not judged): {h}. The test voltage and time are set by the \
             applicable standard and local codes; this tool certifies nothing."
        );
        out.extend(
            wrap(&text, width)
                .into_iter()
                .map(|l| Line::from(l).style(t.warn())),
        );
    }
    if let Some(n) = &v.note {
        out.push(Line::from(""));
        out.extend(
            wrap(&format!("Note: {n}"), width)
                .into_iter()
                .map(Line::from),
        );
    }
    out
}

pub fn draw(app: &App, frame: &mut Frame, area: Rect, scroll: u16) {
    let rect = area.inner(ratatui::layout::Margin {
        horizontal: 1,
        vertical: 1,
    });
    frame.render_widget(Clear, rect);
    let block = Block::bordered().title(
        Line::from(" Readings against the plan (↑↓ scroll, Esc back) ").style(app.ui.theme.title()),
    );
    let inner = block.inner(rect);
    frame.render_widget(block, rect);
    let all = lines(app, inner.width as usize);
    let max_scroll = (all.len() as u16).saturating_sub(inner.height);
    frame.render_widget(
        Paragraph::new(all).scroll((scroll.min(max_scroll), 0)),
        inner,
    );
}
