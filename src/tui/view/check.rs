//! The check panel: the fit verdict, height used against allowed, leakage, the reset duty
//! limit and switch voltage, fill and DC resistance, now and against a reference (before the last edit, or
//! figures the user pinned) with the change beside each.

use super::super::app::App;
use super::{fit, panel};
use crate::engine::Evaluation;
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::Paragraph;

/// (label, value) pairs of the figures compared; same labels in both evaluations line up.
fn figures(e: &Evaluation) -> Vec<(String, f64, usize)> {
    // At 80x24 only the first four rows show: the height, the first leakage pair (primary to
    // secondary), and the reset duty limit and switch voltage that the reset turns move.
    let mut v = vec![("height mm".to_string(), e.height_with_allowance_mm, 3)];
    let leak = |l: &crate::engine::LeakageEval| (format!("L {}-{} uH", l.from, l.to), l.uh, 3);
    v.extend(e.leakage.iter().take(1).map(leak));
    if let Some(c) = &e.converter {
        v.push(("reset %".into(), c.reset_duty_limit * 100.0, 1));
        v.push(("switch V".into(), c.switch_voltage_v, 1));
        // With several outputs, the voltage each further one's turns make.
        for o in c.outputs.iter().filter(|o| !o.regulated) {
            v.push((format!("{} V", o.winding), o.vout_from_turns_v, 2));
        }
    }
    v.extend(e.leakage.iter().skip(1).map(leak));
    if let Some(w) = e.converter.as_ref().and_then(|c| c.clamp_loss_w) {
        v.push(("clamp W".into(), w, 3));
    }
    if let Some(l) = &e.losses
        && let Some(hot) = l.hot_spot_c
    {
        v.push(("hot spot C".into(), hot, 1));
    }
    v.push(("winding C".into(), e.temperature_c, 1));
    v.push(("C P-S pF".into(), e.capacitance.primary_secondary_pf, 1));
    if let Some(worst) = e
        .windings
        .iter()
        .filter_map(|w| w.layer_voltage_v)
        .reduce(f64::max)
    {
        v.push(("layer V max".into(), worst, 0));
    }
    v.push(("fill".to_string(), e.fill_factor, 3));
    for w in &e.windings {
        v.push((format!("DCR {} ohm", w.name), w.dcr_ohm, 4));
    }
    v
}

pub fn rows(app: &App, width: u16) -> Vec<Line<'static>> {
    let t = &app.ui.theme;
    let e = &app.doc.eval;
    let w = width as usize;
    let mut out = Vec::new();
    let verdict = if e.fits {
        Line::from(vec![
            Span::styled(" FITS ", t.good()),
            Span::raw(fit(
                &format!(
                    " {:.2} of {:.2} mm, {:.2} spare",
                    e.height_with_allowance_mm, e.window_height_mm, e.spare_height_mm
                ),
                w.saturating_sub(6),
            )),
        ])
    } else {
        Line::from(vec![
            Span::styled(" DOES NOT FIT ", t.bad()),
            Span::raw(fit(
                &format!(
                    " {:.2} of {:.2} mm, over by {:.2}",
                    e.height_with_allowance_mm, e.window_height_mm, -e.spare_height_mm
                ),
                w.saturating_sub(14),
            )),
        ])
    };
    out.push(verdict);
    let reference = app.reference();
    let ref_figs = reference.as_ref().map(|(r, _)| figures(r));
    let lw = w.saturating_sub(24).clamp(8, 14);
    out.push(
        Line::from(fit(
            &match &reference {
                Some((_, _)) => format!("{:<lw$} {:>7} {:>7} {:>7}", "", "ref", "now", "change"),
                None => format!("{:<lw$} {:>7}", "", "now"),
            },
            w,
        ))
        .style(t.dim()),
    );
    for (label, now, dp) in figures(e) {
        let label_s = fit(&label, lw);
        let mut spans = vec![Span::raw(format!("{label_s:<lw$} "))];
        match ref_figs
            .as_ref()
            .and_then(|f| f.iter().find(|(l, _, _)| *l == label))
        {
            Some((_, was, _)) => {
                let d = now - was;
                let tiny = 0.5 * 10f64.powi(-(dp as i32));
                let change = if d.abs() < tiny {
                    "same".to_string()
                } else if d > 0.0 {
                    format!("+{d:.dp$}")
                } else {
                    format!("{d:.dp$}")
                };
                spans.push(Span::styled(format!("{was:>7.dp$} "), t.dim()));
                spans.push(Span::raw(format!("{now:>7.dp$} ")));
                let style = if change == "same" { t.dim() } else { t.title() };
                spans.push(Span::styled(format!("{change:>7}"), style));
            }
            None => {
                if reference.is_some() {
                    spans.push(Span::styled(format!("{:>7} ", "-"), t.dim()));
                }
                spans.push(Span::raw(format!("{now:>7.dp$}")));
            }
        }
        out.push(Line::from(spans));
    }
    out
}

pub fn draw(app: &App, frame: &mut Frame, area: Rect, rows: Vec<Line<'static>>) {
    let title = match app.reference() {
        Some((_, what)) => format!("Check: now vs {what}"),
        None => "Check (p pins a reference)".into(),
    };
    let title = fit(&title, area.width.saturating_sub(6) as usize);
    let block = panel(app, title, false);
    let inner = block.inner(area);
    frame.render_widget(block, area);
    frame.render_widget(Paragraph::new(rows), inner);
}
