//! The reset-ratio view: for the build's primary turns, the engine's sweep of reset turns
//! (`engine::reset_sweep`) as two stacked plots against Nr, the reset duty limit over the
//! controller's duty limit and the off-state switch voltage under the switch rating, with
//! the build's Nr marked, the allowed range on the axis and the limit that binds in words.
//! Every figure is the sweep's; this module only places them on the screen.

use super::super::app::App;
use super::super::theme::Theme;
use super::wrap;
use crate::engine::reset_sweep::{ResetLimit, ResetSweep, reset_sweep};
use crate::model::{ResetSide, Role};
use ratatui::Frame;
use ratatui::buffer::Buffer;
use ratatui::layout::{Margin, Rect};
use ratatui::style::{Color, Style};
use ratatui::symbols::Marker;
use ratatui::text::Line;
use ratatui::widgets::canvas::{Canvas, Line as Segment};
use ratatui::widgets::{Block, Clear, Paragraph, Widget};

/// Columns left of the plots for the value labels and the axis.
const GUTTER: u16 = 6;

/// The symbols that tell the lines apart without colour.
const LIMIT_CELL: &str = "╌";
const NR_CELL: &str = "┊";
const POINT_CELL: &str = "●";

/// Why the build has no sweep, in words a user can act on.
pub fn missing_reason(app: &App) -> String {
    let b = &app.doc.build;
    if b.operating.is_none() {
        return "The build has no operating point, so there is no reset ratio to show: \
                V opens the operating point (its first row adds one)."
            .into();
    }
    if b.first_of(Role::Reset).is_none() {
        return "The build has no reset winding (a winding of role \"reset\"): add one in \
                the windings panel (a, then r sets its role)."
            .into();
    }
    "The reset ratio needs a primary, a secondary and a reset winding, each with at least \
     one turn."
        .into()
}

/// The title: the primary turns and how the reset winding returns its energy.
fn title(r: &ResetSweep) -> String {
    let side = match r.inputs.reset_side {
        ResetSide::Primary => "reset to the input",
        ResetSide::Secondary => "reset to the output",
    };
    format!(
        " Reset ratio for Np {} · {side} · at {:.4} V in (highest) ",
        r.inputs.np, r.inputs.vin_max_v
    )
    .replace(".0000 V", " V")
}

/// A figure with as many decimals as a duty or a voltage needs.
fn duty(d: f64) -> String {
    format!("{d:.2}")
}

fn volts(v: f64) -> String {
    format!("{v:.0} V")
}

/// The room a limit leaves, or how far it is missed.
fn room(r: f64) -> String {
    if r >= 0.0 {
        format!("{:.0} % room", r * 100.0)
    } else {
        format!("short by {:.0} %", -r * 100.0)
    }
}

/// The lines under the plots: the allowed range, then the build's Nr and what binds.
pub fn legend(r: &ResetSweep) -> Vec<String> {
    let range = match r.allowed {
        Some((lo, Some(hi))) => format!("━ allowed: Nr {lo} to {hi} meets both limits"),
        Some((lo, None)) => format!("━ allowed: Nr {lo} or more meets both limits"),
        None => "no whole number of reset turns meets both limits".into(),
    };
    let c = &r.current;
    let bind = match r.binding {
        Some(ResetLimit::Duty) => "the controller's duty limit binds",
        Some(ResetLimit::SwitchVoltage) => "the switch rating binds",
        None => "no duty limit and no switch rating given (V: operating point)",
    };
    let d = match (r.inputs.duty_limit, r.duty_room) {
        (Some(l), Some(x)) => format!(
            "duty {} against {} ({})",
            duty(c.reset_duty_limit),
            duty(l),
            room(x)
        ),
        _ => format!("duty {}", duty(c.reset_duty_limit)),
    };
    let v = match (r.switch_allowed_v, r.voltage_room) {
        (Some(a), Some(x)) => format!(
            "switch {} against {} ({})",
            volts(c.switch_voltage_v),
            volts(a),
            room(x)
        ),
        _ => format!("switch {}", volts(c.switch_voltage_v)),
    };
    vec![
        range,
        format!("● this build, Nr {}: {bind}", r.inputs.nr),
        format!("{d} · {v}"),
    ]
}

/// A value axis from 0 to a round figure above `v`.
fn round_top(v: f64) -> f64 {
    if v <= 0.0 || !v.is_finite() {
        return 1.0;
    }
    let step = 10f64.powf(v.log10().floor()) / 5.0;
    (v / step).ceil() * step
}

/// One plot: the curve, its limit, and how to label its values.
struct Plot<'a> {
    sweep: &'a ResetSweep,
    values: Vec<f64>,
    /// The value at the build's Nr.
    now: f64,
    y_max: f64,
    limit: Option<f64>,
    label: fn(f64) -> String,
    theme: Theme,
}

/// Where a value falls: the same rounding as the canvas's braille grid, so the marks
/// land on the curve's cells.
fn cell(v: f64, lo: f64, hi: f64, cells: u16, dots: f64) -> u16 {
    let span = (hi - lo).max(f64::MIN_POSITIVE);
    let dot = ((v - lo).clamp(0.0, span) * (f64::from(cells) * dots - 1.0) / span).round();
    (dot / dots) as u16
}

impl Plot<'_> {
    fn x_range(&self) -> (f64, f64) {
        let p = &self.sweep.points;
        let lo = f64::from(p.first().map_or(1, |p| p.nr));
        let hi = f64::from(p.last().map_or(1, |p| p.nr));
        (lo, hi.max(lo + 1.0))
    }

    fn column(&self, nr: u32, width: u16) -> u16 {
        let (lo, hi) = self.x_range();
        cell(f64::from(nr), lo, hi, width, 2.0)
    }

    /// The row of a value, counted from the top.
    fn row(&self, v: f64, height: u16) -> u16 {
        height - 1 - cell(v, 0.0, self.y_max, height, 4.0).min(height - 1)
    }

    /// The curve as braille over `area`, then the build's Nr as a column, the limit as a
    /// row and the build's point, each only where the curve leaves the cell empty.
    fn draw_curve(&self, area: Rect, buf: &mut Buffer) {
        let (lo, hi) = self.x_range();
        let pts: Vec<(f64, f64)> = self
            .sweep
            .points
            .iter()
            .zip(&self.values)
            .map(|(p, v)| (f64::from(p.nr), *v))
            .collect();
        Canvas::default()
            .x_bounds([lo, hi])
            .y_bounds([0.0, self.y_max])
            .marker(Marker::Braille)
            .paint(|ctx| {
                for w in pts.windows(2) {
                    ctx.draw(&Segment::new(w[0].0, w[0].1, w[1].0, w[1].1, Color::Reset));
                }
            })
            .render(area, buf);
        let t = self.theme;
        let x = area.x + self.column(self.sweep.inputs.nr, area.width);
        for y in area.top()..area.bottom() {
            put_if_blank(buf, x, y, NR_CELL, t.dim());
        }
        if let Some(l) = self.limit {
            let y = area.y + self.row(l, area.height);
            for x in area.left()..area.right() {
                if matches!(buf[(x, y)].symbol(), " " | NR_CELL) {
                    buf[(x, y)].set_symbol(LIMIT_CELL).set_style(t.limit());
                }
            }
        }
        let y = area.y + self.row(self.now, area.height);
        buf[(x, y)].set_symbol(POINT_CELL).set_style(t.key());
    }

    /// The value labels left of the plot: the top, the limit and 0 on the axis row.
    fn draw_gutter(&self, plot: Rect, buf: &mut Buffer) {
        let t = self.theme;
        let gx = plot.x - GUTTER;
        let limit_row = self.limit.map(|l| self.row(l, plot.height));
        for r in 0..plot.height {
            let (text, axis) = match limit_row {
                Some(lr) if lr == r => ((self.label)(self.limit.unwrap_or(0.0)), "┤"),
                _ if r == 0 => ((self.label)(self.y_max), "┤"),
                _ => (String::new(), "│"),
            };
            buf.set_string(gx, plot.y + r, format!("{text:>5}"), t.dim());
            buf.set_string(gx + GUTTER - 1, plot.y + r, axis, t.dim());
        }
    }

    /// The axis under the plot: heavy over the allowed reset turns, the build's Nr marked.
    fn draw_base(&self, plot: Rect, buf: &mut Buffer) {
        let t = self.theme;
        let y = plot.bottom();
        buf.set_string(plot.x - GUTTER, y, "    0└", t.dim());
        let (lo, hi) = self.x_range();
        let allowed = self.sweep.allowed.and_then(|(a, b)| {
            let b = b.map_or(hi, f64::from);
            (f64::from(a) <= hi && b >= lo).then(|| {
                (
                    self.column(a.max(lo as u32), plot.width),
                    self.column(b.min(hi) as u32, plot.width),
                )
            })
        });
        let nr = self.column(self.sweep.inputs.nr, plot.width);
        for c in 0..plot.width {
            let heavy = allowed.is_some_and(|(a, b)| (a..=b).contains(&c));
            let s = match (c == nr, heavy) {
                (true, true) => "┷",
                (true, false) => "┴",
                (false, true) => "━",
                (false, false) => "─",
            };
            buf.set_string(plot.x + c, y, s, if heavy { t.good() } else { t.dim() });
        }
    }
}

fn put_if_blank(buf: &mut Buffer, x: u16, y: u16, s: &str, style: Style) {
    if buf[(x, y)].symbol() == " " {
        buf[(x, y)].set_symbol(s).set_style(style);
    }
}

/// The row of reset-turn labels under the lower plot: the build's Nr first, then the
/// sweep's ends and the allowed range's, each where it does not run into another.
fn nr_labels(plot: &Plot, x: u16, width: u16, y: u16, buf: &mut Buffer) {
    let s = plot.sweep;
    let mut taken: Vec<(u16, u16)> = Vec::new();
    let mut wanted = vec![(s.inputs.nr, format!("▲{}", s.inputs.nr))];
    let first = s.points.first().map_or(1, |p| p.nr);
    let last = s.points.last().map_or(1, |p| p.nr);
    wanted.push((first, first.to_string()));
    wanted.push((last, last.to_string()));
    if let Some((a, b)) = s.allowed {
        wanted.extend(
            [Some(a), b]
                .into_iter()
                .flatten()
                .filter(|n| (first..=last).contains(n))
                .map(|n| (n, n.to_string())),
        );
    }
    buf.set_string(x - GUTTER, y, "   Nr", plot.theme.dim());
    for (n, text) in wanted {
        let w = text.chars().count() as u16;
        let c = plot.column(n, width);
        // The build's ▲ sits under its column; the figures are centred on theirs.
        let back = if text.starts_with('▲') { 0 } else { w / 2 };
        let start = c.saturating_sub(back).min(width.saturating_sub(w));
        let (a, b) = (start, start + w);
        if taken.iter().any(|&(ta, tb)| a <= tb && ta <= b) {
            continue;
        }
        taken.push((a, b));
        buf.set_string(x + start, y, &text, plot.theme.base());
    }
}

/// One plot with its caption row above and its axis row below.
fn draw_plot(plot: &Plot, caption: &str, area: Rect, buf: &mut Buffer) {
    buf.set_string(area.x, area.y, caption, plot.theme.title());
    let inner = Rect {
        x: area.x + GUTTER,
        y: area.y + 1,
        width: area.width.saturating_sub(GUTTER + 1),
        height: area.height.saturating_sub(2),
    };
    if inner.height == 0 || inner.width < 2 {
        return;
    }
    plot.draw_curve(inner, buf);
    plot.draw_gutter(inner, buf);
    plot.draw_base(inner, buf);
}

fn captions(r: &ResetSweep) -> (String, String) {
    let d = match r.inputs.duty_limit {
        Some(l) => format!("reset duty limit   ╌ controller's duty limit {}", duty(l)),
        None => "reset duty limit   (no controller duty limit given)".into(),
    };
    let v = match r.switch_allowed_v {
        Some(a) if (r.inputs.derating - 1.0).abs() < 1e-9 => format!(
            "switch off-state voltage, V, before the spike   ╌ switch rating {}",
            volts(a)
        ),
        Some(a) => format!(
            "switch off-state voltage, V, before the spike   ╌ {:.0} % of the rating: {}",
            r.inputs.derating * 100.0,
            volts(a)
        ),
        None => "switch off-state voltage, V, before the spike   (no switch rating given)".into(),
    };
    (d, v)
}

/// The two plots and the legend in `inner`.
fn draw_sweep(r: &ResetSweep, t: Theme, inner: Rect, buf: &mut Buffer) {
    let legend: Vec<String> = legend(r)
        .iter()
        .flat_map(|l| wrap(l, inner.width as usize))
        .collect();
    let legend_h = legend.len() as u16;
    let plots_h = inner.height.saturating_sub(legend_h + 1);
    let each = plots_h / 2;
    let (cd, cv) = captions(r);
    let top_v = r
        .points
        .iter()
        .map(|p| p.switch_voltage_v)
        .chain(r.switch_allowed_v)
        .fold(0.0_f64, f64::max)
        * 1.1;
    let duty_plot = Plot {
        sweep: r,
        values: r.points.iter().map(|p| p.reset_duty_limit).collect(),
        now: r.current.reset_duty_limit,
        y_max: 1.0,
        limit: r.inputs.duty_limit,
        label: duty,
        theme: t,
    };
    let volt_plot = Plot {
        sweep: r,
        values: r.points.iter().map(|p| p.switch_voltage_v).collect(),
        now: r.current.switch_voltage_v,
        y_max: round_top(top_v),
        limit: r.switch_allowed_v,
        label: |v| format!("{v:.0}"),
        theme: t,
    };
    let a = Rect {
        height: each,
        ..inner
    };
    draw_plot(&duty_plot, &cd, a, buf);
    let b = Rect {
        y: inner.y + each,
        height: each,
        ..inner
    };
    draw_plot(&volt_plot, &cv, b, buf);
    let plot_w = inner.width.saturating_sub(GUTTER + 1);
    nr_labels(
        &volt_plot,
        inner.x + GUTTER,
        plot_w,
        inner.y + 2 * each,
        buf,
    );
    let ly = inner.y + 2 * each + 1;
    for (i, l) in legend.iter().enumerate() {
        buf.set_string(inner.x, ly + i as u16, l, t.base());
    }
}

/// The view over the whole body, the header and the status line left in sight.
pub fn draw(app: &App, frame: &mut Frame, area: Rect) {
    let t = app.ui.theme;
    let rect = area.inner(Margin {
        horizontal: 0,
        vertical: 1,
    });
    frame.render_widget(Clear, rect);
    let sweep = reset_sweep(&app.doc.build);
    let head = sweep.as_ref().map_or(" Reset ratio ".into(), title);
    let block = Block::bordered()
        .title(Line::from(head).style(t.title()))
        .title_bottom(Line::from(" Esc or D closes ").style(t.dim()));
    let inner = block.inner(rect);
    frame.render_widget(block, rect);
    match sweep {
        Some(r) => draw_sweep(&r, t, inner, frame.buffer_mut()),
        None => {
            let lines: Vec<Line> = wrap(&missing_reason(app), inner.width as usize)
                .into_iter()
                .map(Line::from)
                .collect();
            frame.render_widget(Paragraph::new(lines), inner);
        }
    }
}
