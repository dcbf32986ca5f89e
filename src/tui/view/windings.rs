//! The windings panel: each winding's wire and figures (length, MLT, DCR, AC resistance).

use super::super::app::{App, Focus};
use super::{fit, pad, panel};
use crate::engine::WarningAt;
use crate::model::Insulation;
use crate::report::text::wire_label;
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{List, ListItem, ListState};

fn grade_short(g: Insulation) -> &'static str {
    match g {
        Insulation::Grade1 => "g1",
        Insulation::Grade2 => "g2",
        Insulation::Grade3 => "g3",
        Insulation::Tiw => "TIW",
    }
}

pub fn draw(app: &App, frame: &mut Frame, area: Rect) {
    let t = &app.theme;
    let temp = app.eval.temperature_c;
    let block = panel(
        app,
        // The fill factor rides here: at 80x24 the check panel has no row left for it.
        format!(
            "Windings, DCR at {temp} C, fill {:.3}",
            app.eval.fill_factor
        ),
        app.focus == Focus::Windings,
    );
    let inner = block.inner(area);
    frame.render_widget(block, area);
    if inner.height < 2 {
        return;
    }
    let wide = inner.width >= 63;
    let dense = inner.width >= 68;
    let head = if wide {
        format!(
            " {:<4} {:<4}{:>6} {:<11} {:<3}{:>8}{:>7}{:>8}{:>8}{}",
            "name",
            "role",
            "turns",
            "wire",
            "ins",
            "length m",
            "MLT",
            "DCR ohm",
            "Rac ohm",
            if dense { " A/mm2" } else { "" }
        )
    } else {
        format!(
            " {:<4} {:<3}{:>5} {:<9} {:<3}{:>6}{:>8}",
            "name", "rol", "N", "wire", "ins", "len m", "DCR ohm"
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
    let items: Vec<ListItem> = app
        .build
        .windings
        .iter()
        .enumerate()
        .map(|(k, w)| {
            let e = app.eval.windings.get(k);
            let warned = app
                .eval
                .warnings
                .iter()
                .any(|x| x.at == WarningAt::Winding(k));
            let mark = if warned {
                Span::styled("!", t.warn())
            } else {
                Span::raw(" ")
            };
            let role = if wide {
                w.role.key()[..4].to_string()
            } else {
                w.role.key()[..3].to_string()
            };
            let (len, mlt, dcr, rac, j) = match e {
                Some(e) => (
                    format!("{:.3}", e.length_m),
                    format!("{:.1}", e.mlt_mm),
                    format!("{:.4}", e.dcr_ohm),
                    e.ac.as_ref()
                        .map_or("-".into(), |a| format!("{:.4}", a.rac_ohm)),
                    e.current_density_a_mm2
                        .map_or("-".into(), |j| format!("{j:.1}")),
                ),
                None => Default::default(),
            };
            let wire = wire_label(&w.wire, w.strands);
            let ins = grade_short(w.insulation);
            let n = w.turns;
            let rest = if wide {
                let j = if dense {
                    format!("{j:>6}")
                } else {
                    String::new()
                };
                format!(
                    " {role:<4}{n:>6} {} {ins:<3}{len:>8}{mlt:>7}{dcr:>8}{rac:>8}{j}",
                    pad(&wire, 11)
                )
            } else {
                // The wire column ends in a space even when the label fills it.
                format!(
                    " {role:<3}{n:>5} {} {ins:<3}{len:>6}{dcr:>8}",
                    pad(&wire, 9)
                )
            };
            ListItem::new(Line::from(vec![
                mark,
                Span::styled(pad(&w.name, 4), t.winding(k)),
                Span::raw(rest),
            ]))
        })
        .collect();
    let mut state = ListState::default();
    if !app.build.windings.is_empty() {
        state.select(Some(app.winding_sel));
    }
    let list = List::new(items).highlight_style(if app.focus == Focus::Windings {
        t.selected()
    } else {
        t.title()
    });
    frame.render_stateful_widget(list, list_area, &mut state);
}
