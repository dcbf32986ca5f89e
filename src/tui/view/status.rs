//! The header line (title, file, verdict) and the status line (last message, or key hints
//! taken from the key map).

use super::super::app::{App, StatusKind};
use super::super::keymap;
use super::fit;
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use unicode_width::UnicodeWidthStr;

pub fn header(app: &App, frame: &mut Frame, area: Rect) {
    let t = &app.ui.theme;
    let e = &app.doc.eval;
    // A build that fits can still break a limit (rise, saturation, ...): say which, as
    // `check` does on its last line.
    let failing: Vec<&str> = e.failures().iter().map(|c| c.key()).collect();
    let verdict = if e.fits && failing.is_empty() {
        Span::styled(
            format!(
                " FITS {:.2} of {:.2} mm ",
                e.height_with_allowance_mm, e.window_height_mm
            ),
            t.good(),
        )
    } else if e.fits {
        Span::styled(
            format!(
                " FITS {:.2}/{:.2} mm, FAILS {} ",
                e.height_with_allowance_mm,
                e.window_height_mm,
                failing.join(", ")
            ),
            t.bad(),
        )
    } else {
        Span::styled(
            format!(" DOES NOT FIT: {:.2} mm too tall ", -e.spare_height_mm),
            t.bad(),
        )
    };
    let modified = if app.dirty() { " [modified]" } else { "" };
    let left_w = (area.width as usize).saturating_sub(verdict.content.width() + 1);
    let left = fit(
        &format!(
            " turnstack · {}{modified} · {}",
            app.file_label(),
            app.doc.build.title
        ),
        left_w,
    );
    let gap = left_w.saturating_sub(left.width()) + 1;
    frame.render_widget(
        Line::from(vec![
            Span::styled(left, t.title()),
            Span::raw(" ".repeat(gap)),
            verdict,
        ]),
        area,
    );
}

pub fn status_line(app: &App, frame: &mut Frame, area: Rect) {
    let t = &app.ui.theme;
    let width = area.width as usize;
    if let Some(job) = &app.job {
        frame.render_widget(
            Line::from(Span::styled(fit(&job.words(), width), t.key())),
            area,
        );
        return;
    }
    if let Some(s) = &app.ui.status {
        let style = match s.kind {
            StatusKind::Info => t.base(),
            StatusKind::Refused | StatusKind::Error => t.refused(),
        };
        let help = "  ? help";
        let text = fit(&s.text, width.saturating_sub(help.width()));
        let gap = width.saturating_sub(text.width() + help.width());
        frame.render_widget(
            Line::from(vec![
                Span::styled(text, style),
                Span::raw(" ".repeat(gap)),
                Span::styled(help, t.dim()),
            ]),
            area,
        );
        return;
    }
    let mut spans = Vec::new();
    let mut used = 0;
    for (key, hint) in keymap::hints(&app.contexts()) {
        let w = key.width() + hint.width() + 3;
        if used + w > width {
            break;
        }
        used += w;
        spans.push(Span::styled(format!(" {key}"), t.key()));
        spans.push(Span::styled(format!(" {hint} "), t.dim()));
    }
    frame.render_widget(Line::from(spans), area);
}
