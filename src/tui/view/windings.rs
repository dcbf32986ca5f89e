//! The windings panel: each winding's wire and figures (length, MLT, DCR, AC resistance).

use super::super::app::{App, Focus};
use super::{fit, pad, panel};
use crate::engine::WarningAt;
use crate::model::Insulation;
use crate::report::textfmt::{foil_litz_label, wire_label};
use ratatui::Frame;
use ratatui::layout::Rect;
use ratatui::text::{Line, Span};
use ratatui::widgets::{List, ListItem, ListState};
use unicode_width::UnicodeWidthStr;

fn grade_short(g: Insulation) -> &'static str {
    match g {
        Insulation::Grade1 => "g1",
        Insulation::Grade2 => "g2",
        Insulation::Grade3 => "g3",
        Insulation::Tiw => "TIW",
    }
}

/// Draw the windings panel: a heading and one row per winding, as wide as the panel allows.
pub fn draw(app: &App, frame: &mut Frame, area: Rect) {
    let t = &app.ui.theme;
    let temp = app.doc.eval.temperature_c;
    let block = panel(
        app,
        // The fill factor rides here: at 80x24 the check panel has no row left for it.
        format!(
            "Windings, DCR at {temp:.0} C, fill {:.3}",
            app.doc.eval.fill_factor
        ),
        app.ui.focus == Focus::Windings,
    );
    let inner = block.inner(area);
    frame.render_widget(block, area);
    if inner.height < 2 {
        return;
    }
    // Wide: the roles in full and a space between every two headings (64 columns, the
    // panel's inside at 120 columns); dense adds the current density.
    let wide = inner.width >= 64;
    let dense = inner.width >= 70;
    frame.render_widget(
        Line::from(fit(&heading(wide, dense), inner.width as usize)).style(t.dim()),
        Rect { height: 1, ..inner },
    );
    let list_area = Rect {
        y: inner.y + 1,
        height: inner.height - 1,
        ..inner
    };
    let items: Vec<ListItem> = (0..app.doc.build.windings.len())
        .map(|k| ListItem::new(row(app, k, wide, dense)))
        .collect();
    let mut state = ListState::default();
    if !app.doc.build.windings.is_empty() {
        state.select(Some(app.ui.winding_sel));
    }
    let list = List::new(items).highlight_style(if app.ui.focus == Focus::Windings {
        t.selected()
    } else {
        t.title()
    });
    frame.render_stateful_widget(list, list_area, &mut state);
}

/// The column headings.
fn heading(wide: bool, dense: bool) -> String {
    if wide {
        format!(
            " {:<4} {:<9}{:>5} {:<11} {:<3}{:>6}{:>6}{:>8}{:>8}{}",
            "name",
            "role",
            "turns",
            "wire",
            "ins",
            "len m",
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
    }
}

/// Winding k's row: a warning mark, its name in its colour, then its figures.
fn row(app: &App, k: usize, wide: bool, dense: bool) -> Line<'static> {
    let t = &app.ui.theme;
    let w = &app.doc.build.windings[k];
    let warned = app
        .doc
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
        w.role.key()
    } else {
        &w.role.key()[..3]
    };
    let (len, mlt, dcr, rac, j) = match app.doc.eval.windings.get(k) {
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
    // Round wire fills the wire and insulation columns; a foil or litz label takes both
    // (a foil has no enamel, a litz's strand enamel is in the form).
    let fig = app.doc.eval.windings.get(k).map(|e| &e.conductor);
    let wire_ins = |wire_w: usize| match foil_litz_label(w, fig) {
        // Where the label would be cut, it drops its unit first: "litz 40x0.1".
        Some(label) if label.width() > wire_w + 4 => pad(label.trim_end_matches(" mm"), wire_w + 4),
        Some(label) => pad(&label, wire_w + 4),
        None => format!(
            "{} {:<3}",
            pad(&wire_label(&w.wire, w.strands), wire_w),
            grade_short(w.insulation)
        ),
    };
    let n = w.turns;
    let rest = if wide {
        let j = if dense {
            format!("{j:>6}")
        } else {
            String::new()
        };
        format!(
            " {role:<9}{n:>5} {}{len:>6}{mlt:>6}{dcr:>8}{rac:>8}{j}",
            wire_ins(11)
        )
    } else {
        // The wire column ends in a space even when the label fills it.
        format!(" {role:<3}{n:>5} {}{len:>6}{dcr:>8}", wire_ins(9))
    };
    Line::from(vec![
        mark,
        Span::styled(pad(&w.name, 4), t.winding(k)),
        Span::raw(rest),
    ])
}
