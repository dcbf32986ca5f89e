//! The window cross-section drawn to scale: flange to flange across, tube (bottom) to the
//! window limit (a marked line) and beyond, every layer, tape wrap and margin in its place.
//! Positions are read from the Evaluation's sections and layers; each winding has a letter
//! (upper and lower case alternate turn by turn where a turn is two cells wide or more), tape is a line pattern, margins are shaded,
//! so it reads without colour. Layers thinner than a text row are widened to one row, and
//! the rest of the height shares what is left in proportion.

use super::super::app::{App, Focus};
use super::panel;
use crate::engine::SectionKind;
use crate::engine::conductor::ConductorFigures;
use crate::engine::constants::FIT_TOLERANCE_MM;
use crate::model::Conductor;
use ratatui::buffer::Buffer;
use ratatui::layout::Rect;
use ratatui::style::Style;
use ratatui::widgets::Widget;
use unicode_width::UnicodeWidthStr;

pub struct WindowView<'a> {
    pub app: &'a App,
}

#[derive(Debug, Clone, Copy, PartialEq)]
enum Item {
    /// Layer `l` of section `s`.
    Layer { s: usize, l: usize, top_mm: f64 },
    /// A tape section.
    Tape { s: usize, top_mm: f64 },
    /// Tape between two layers of a winding section.
    LayerTape { s: usize, top_mm: f64 },
    /// Empty height.
    Gap,
    /// The window limit line.
    Limit,
    /// Where the build reaches with the hand-winding allowance.
    Allowance,
}

/// An item of the drawing from the tube up, with its height (weight) and the least rows it
/// takes.
struct Piece {
    item: Item,
    height_mm: f64,
    min_rows: u16,
}

/// Every tape section, layer and tape between layers, with the height it starts at.
fn bands(e: &crate::engine::Evaluation) -> Vec<(f64, Piece)> {
    let mut bands: Vec<(f64, Piece)> = Vec::new();
    for (s, sec) in e.sections.iter().enumerate() {
        match &sec.kind {
            SectionKind::Tape { .. } => bands.push((
                sec.y_mm,
                Piece {
                    item: Item::Tape {
                        s,
                        top_mm: sec.y_mm + sec.height_mm,
                    },
                    height_mm: sec.height_mm,
                    min_rows: 1,
                },
            )),
            SectionKind::Winding { .. } => {
                for (l, ly) in sec.layers.iter().enumerate() {
                    if l > 0 {
                        let prev = &sec.layers[l - 1];
                        let gap = ly.y_mm - (prev.y_mm + prev.height_mm);
                        if gap > 1e-9 {
                            bands.push((
                                prev.y_mm + prev.height_mm,
                                Piece {
                                    item: Item::LayerTape { s, top_mm: ly.y_mm },
                                    height_mm: gap,
                                    min_rows: 1,
                                },
                            ));
                        }
                    }
                    bands.push((
                        ly.y_mm,
                        Piece {
                            item: Item::Layer {
                                s,
                                l,
                                top_mm: ly.y_mm + ly.height_mm,
                            },
                            height_mm: ly.height_mm,
                            min_rows: 1,
                        },
                    ));
                }
            }
        }
    }
    bands
}

fn pieces(app: &App) -> Vec<Piece> {
    let e = &app.doc.eval;
    let limit_mm = e.window_height_mm;
    let mut bands = bands(e);
    bands.sort_by(|a, b| a.0.total_cmp(&b.0));
    let mut out = Vec::new();
    let mut limit_done = false;
    let marker = |item| Piece {
        item,
        height_mm: 0.0,
        min_rows: 1,
    };
    for (_, p) in bands {
        let top = match p.item {
            Item::Layer { top_mm, .. }
            | Item::Tape { top_mm, .. }
            | Item::LayerTape { top_mm, .. } => top_mm,
            _ => 0.0,
        };
        if !limit_done && top > limit_mm + FIT_TOLERANCE_MM {
            out.push(marker(Item::Limit));
            limit_done = true;
        }
        out.push(p);
    }
    // Above the build: the allowance line and the limit, in height order, with the empty
    // height between them.
    let mut marks: Vec<(f64, Item)> = Vec::new();
    if e.height_with_allowance_mm > e.build_height_mm + 1e-9 {
        marks.push((e.height_with_allowance_mm, Item::Allowance));
    }
    if !limit_done {
        marks.push((limit_mm, Item::Limit));
    }
    marks.sort_by(|a, b| a.0.total_cmp(&b.0));
    let mut y = e.build_height_mm;
    for (at, item) in marks {
        if at > y {
            out.push(Piece {
                item: Item::Gap,
                height_mm: at - y,
                min_rows: 0,
            });
            y = at;
        }
        out.push(marker(item));
    }
    // Headroom, so that an overflow has somewhere to show.
    out.push(Piece {
        item: Item::Gap,
        height_mm: 0.08 * y.max(limit_mm),
        min_rows: 0,
    });
    out
}

/// Rows the drawing needs to show every layer, tape and marker on a row of its own.
pub fn rows_wanted(app: &App) -> u16 {
    pieces(app).iter().map(|p| p.min_rows).sum::<u16>() + 1
}

/// Rows per piece: each its least, the rest shared in proportion to height (largest
/// remainders first). `None` when even the least does not fit.
fn allot(pieces: &[Piece], rows: u16) -> Option<Vec<u16>> {
    let least: u16 = pieces.iter().map(|p| p.min_rows).sum();
    if least > rows {
        return None;
    }
    let spare = f64::from(rows - least);
    let total: f64 = pieces.iter().map(|p| p.height_mm).sum();
    let mut got: Vec<u16> = pieces.iter().map(|p| p.min_rows).collect();
    if total <= 0.0 {
        return Some(got);
    }
    let ideal: Vec<f64> = pieces.iter().map(|p| p.height_mm / total * spare).collect();
    for (g, i) in got.iter_mut().zip(&ideal) {
        *g += i.floor() as u16;
    }
    let mut left = rows - got.iter().sum::<u16>();
    let mut order: Vec<usize> = (0..pieces.len()).collect();
    order.sort_by(|&a, &b| (ideal[b] - ideal[b].floor()).total_cmp(&(ideal[a] - ideal[a].floor())));
    for i in order {
        if left == 0 {
            break;
        }
        got[i] += 1;
        left -= 1;
    }
    Some(got)
}

/// The letter that stands for winding `k` in the drawing.
pub fn letter(app: &App, k: usize) -> char {
    app.doc
        .build
        .windings
        .get(k)
        .and_then(|w| w.name.chars().find(|c| c.is_alphanumeric()))
        .map_or('?', |c| c.to_ascii_uppercase())
}

impl Widget for WindowView<'_> {
    fn render(self, area: Rect, buf: &mut Buffer) {
        let app = self.app;
        let t = &app.ui.theme;
        let e = &app.doc.eval;
        let all = pieces(app);
        let block = panel(
            app,
            format!(
                "Window to scale, {:.1} x {:.1} mm",
                e.window_width_mm, e.window_height_mm
            ),
            false,
        )
        .title_bottom(ratatui::text::Line::from(" tube ").centered());
        let inner = block.inner(area);
        block.render(area, buf);
        // Gutter for section numbers, then a flange each side.
        let gutter: u16 = 3;
        if inner.width < gutter + 6 || inner.height < 3 {
            return;
        }
        let cols = inner.width - gutter - 2;
        let x0 = inner.x + gutter + 1;
        let rows = inner.height;
        let (alloc, squeezed) = match allot(&all, rows) {
            Some(a) => (a, false),
            None => (squeeze(&all, rows), true),
        };
        // Row 0 is the bottom (next to the tube).
        let mut r: u16 = 0;
        let ww = e.window_width_mm.max(1e-9);
        let margin = app.doc.build.setup.margin_mm;
        let cell_mm = ww / f64::from(cols);
        let sel = if app.ui.focus == Focus::Stack {
            Some(app.ui.stack_sel)
        } else {
            None
        };
        for (p, &n) in all.iter().zip(&alloc) {
            for _ in 0..n {
                if r >= rows {
                    break;
                }
                let y = inner.bottom() - 1 - r;
                let flange = Style::new();
                buf.set_string(inner.x + gutter, y, "┃", flange);
                buf.set_string(x0 + cols, y, "┃", flange);
                let at = RowAt {
                    x0,
                    y,
                    cols,
                    cell_mm,
                    margin,
                };
                self.draw_row(buf, p.item, at);
                r += 1;
            }
            // Section number in the gutter on the piece's first (lowest) row.
            let s = match p.item {
                Item::Layer { s, l: 0, .. } | Item::Tape { s, .. } => Some(s),
                _ => None,
            };
            if let Some(s) = s
                && n > 0
                && r >= n
            {
                let y = inner.bottom() - (r - n) - 1;
                let mark = if sel == Some(s) { "▶" } else { " " };
                let label = format!("{:>2}{mark}", s + 1);
                let style = if sel == Some(s) { t.title() } else { t.dim() };
                buf.set_string(inner.x, y, label, style);
            }
        }
        if squeezed {
            let note = " squeezed ";
            if (note.width() as u16) < area.width {
                buf.set_string(area.x + 1, area.bottom() - 1, note, t.dim());
            }
        }
    }
}

impl WindowView<'_> {
    fn draw_row(&self, buf: &mut Buffer, item: Item, at: RowAt) {
        let RowAt { x0, y, cols, .. } = at;
        let app = self.app;
        let t = &app.ui.theme;
        let e = &app.doc.eval;
        let past = |top: f64| top > e.window_height_mm + FIT_TOLERANCE_MM;
        match item {
            Item::Layer { s, l, top_mm } => self.draw_layer(buf, (s, l, top_mm), at),
            Item::Tape { s, top_mm } | Item::LayerTape { s, top_mm } => {
                let thick = matches!(item, Item::Tape { .. });
                let ch = if thick { "═" } else { "─" };
                let style = if past(top_mm) { t.bad() } else { t.tape() };
                for c in 0..cols {
                    buf.set_string(x0 + c, y, ch, style);
                }
                if thick && let SectionKind::Tape { wraps } = e.sections[s].kind {
                    let label = format!(" tape x{wraps} ");
                    let w = label.width() as u16;
                    if w + 4 <= cols {
                        buf.set_string(x0 + (cols - w) / 2, y, label, style);
                    }
                }
            }
            Item::Gap => {}
            Item::Limit => {
                let style = t.limit();
                for c in 0..cols {
                    buf.set_string(x0 + c, y, "━", style);
                }
                let label = if e.fits {
                    format!(" limit {:.2} mm ", e.window_height_mm)
                } else {
                    format!(
                        " LIMIT {:.2}: over by {:.2} mm ",
                        e.window_height_mm, -e.spare_height_mm
                    )
                };
                let label = super::fit(&label, cols as usize);
                let w = label.width() as u16;
                let style = if e.fits { style } else { t.bad() };
                buf.set_string(x0 + cols.saturating_sub(w) / 2, y, label, style);
            }
            Item::Allowance => {
                let over = !e.fits;
                let style = if over { t.bad() } else { t.dim() };
                for c in 0..cols {
                    buf.set_string(x0 + c, y, "┄", t.dim());
                }
                let label = format!(
                    " x{} allowance {:.2} mm ",
                    app.doc.build.setup.allowance_factor, e.height_with_allowance_mm
                );
                let label = super::fit(&label, cols as usize);
                let w = label.width() as u16;
                buf.set_string(x0 + cols.saturating_sub(w) / 2, y, label, style);
            }
        }
    }

    /// Layer l of section s, each cell the letter of the winding whose turn it crosses.
    fn draw_layer(&self, buf: &mut Buffer, (s, l, top_mm): (usize, usize, f64), at: RowAt) {
        let RowAt {
            x0,
            y,
            cols,
            cell_mm,
            margin,
        } = at;
        let app = self.app;
        let t = &app.ui.theme;
        let e = &app.doc.eval;
        let centre = |c: u16| (f64::from(c) + 0.5) * cell_mm;
        let in_margin = |x: f64| margin > 0.0 && (x < margin || x > e.window_width_mm - margin);
        let sec = &e.sections[s];
        let SectionKind::Winding {
            winding,
            partner,
            pitch_mm,
            turns_per_layer,
            spread,
            ..
        } = &sec.kind
        else {
            return;
        };
        let ly = &sec.layers[l];
        let a = app.doc.build.winding_index(winding).unwrap_or(0);
        if let Some(width_mm) = self.foil_width(a) {
            let over = top_mm > e.window_height_mm + FIT_TOLERANCE_MM;
            self.draw_foil(buf, a, width_mm, over, at);
            return;
        }
        let b = partner
            .as_ref()
            .and_then(|w| app.doc.build.winding_index(w));
        let over = top_mm > e.window_height_mm + FIT_TOLERANCE_MM;
        // The first winding's share of each bifilar turn's width.
        let share_a = self.turn_width_mm(a) / pitch_mm.max(1e-9);
        let pitch = pitch_mm.max(1e-9);
        // A spaced partial layer: each turn in the middle of its share of the usable width.
        let slot = (*spread && ly.turns > 0 && ly.turns < *turns_per_layer)
            .then(|| e.usable_width_mm / f64::from(ly.turns));
        let turn_of = |c: u16| {
            let x = centre(c);
            if in_margin(x) {
                return None;
            }
            let along = x - margin;
            let turn = match slot {
                Some(w) => {
                    let k = (along / w).floor();
                    let off = along - (k + 0.5) * w;
                    // At least the cell over the turn's centre, however coarse the cells.
                    if off.abs() > 0.5 * pitch.max(cell_mm) {
                        return None;
                    }
                    k
                }
                None => (along / pitch).floor(),
            };
            (turn >= 0.0 && (turn as u32) < ly.turns).then_some(turn as u32)
        };
        let mut c = 0;
        while c < cols {
            let x = centre(c);
            let Some(turn) = turn_of(c) else {
                let ch = if in_margin(x) { "░" } else { "·" };
                buf.set_string(x0 + c, y, ch, t.dim());
                c += 1;
                continue;
            };
            // The cells of this turn: a bifilar turn shows both letters, the first
            // winding's in proportion to its share of the pitch.
            let mut n = 1;
            while c + n < cols && turn_of(c + n) == Some(turn) {
                n += 1;
            }
            let first = match b {
                Some(_) if n >= 2 => ((f64::from(n) * share_a).round() as u16).clamp(1, n - 1),
                Some(_) if turn % 2 == 1 => 0,
                _ => n,
            };
            for j in 0..n {
                // The winding of this cell, and the cells of its share of the turn: a litz
                // bundle is bracketed within its own share.
                let (k, share) = match b {
                    Some(b) if j >= first => (b, (j - first, n - first)),
                    _ => (a, (j, first)),
                };
                let style = if over { t.bad() } else { t.winding(k) };
                let cell = (turn, share.0, share.1);
                let ch = turn_cell(
                    letter(app, k),
                    cell,
                    self.is_litz(k),
                    pitch >= 2.0 * cell_mm,
                );
                buf.set_string(x0 + c + j, y, ch, style);
            }
            c += n;
        }
    }
}

impl WindowView<'_> {
    /// The copper width of winding k when it is foil (the Evaluation's).
    fn foil_width(&self, k: usize) -> Option<f64> {
        match self.app.doc.eval.windings.get(k).map(|w| &w.conductor) {
            Some(ConductorFigures::Foil { width_mm, .. }) => Some(*width_mm),
            _ => None,
        }
    }

    /// Winding k is litz.
    fn is_litz(&self, k: usize) -> bool {
        matches!(
            self.app.doc.build.windings.get(k).map(|w| w.conductor),
            Some(Conductor::Litz(_))
        )
    }

    /// The width one turn of winding k takes: its strands (or bundles) side by side.
    fn turn_width_mm(&self, k: usize) -> f64 {
        self.app
            .doc
            .eval
            .windings
            .get(k)
            .map_or(0.0, |w| f64::from(w.strands.max(1)) * w.od_mm)
    }

    /// A foil turn: one band across the breadth, the copper (`▬`, the winding's letter at
    /// each edge) centred in the breadth, the interleaf's overhang shown as empty breadth.
    fn draw_foil(&self, buf: &mut Buffer, k: usize, width_mm: f64, over: bool, at: RowAt) {
        let RowAt {
            x0,
            y,
            cols,
            cell_mm,
            margin,
        } = at;
        let app = self.app;
        let t = &app.ui.theme;
        let ww = app.doc.eval.window_width_mm;
        let breadth = ww - 2.0 * margin;
        let from = margin + (breadth - width_mm).max(0.0) / 2.0;
        let to = from + width_mm;
        let cells: Vec<u16> = (0..cols)
            .filter(|&c| {
                let x = (f64::from(c) + 0.5) * cell_mm;
                x >= from && x <= to
            })
            .collect();
        let (first, last) = (cells.first().copied(), cells.last().copied());
        let style = if over { t.bad() } else { t.winding(k) };
        let letter = letter(app, k).to_string();
        for c in 0..cols {
            let x = (f64::from(c) + 0.5) * cell_mm;
            let (ch, st) = if Some(c) == first || Some(c) == last {
                (letter.as_str(), style)
            } else if x >= from && x <= to {
                ("▬", style)
            } else if x < margin || x > ww - margin {
                ("░", t.dim())
            } else {
                ("·", t.dim())
            };
            buf.set_string(x0 + c, y, ch, st);
        }
    }
}

/// Cell `j` of the `n` cells of turn `turn`: the winding's letter, lower case on odd turns
/// where a turn spans two cells or more (`wide`) so turns tell apart; a litz turn three
/// cells wide or more reads as a bundle, `(SSS)`.
fn turn_cell(letter: char, (turn, j, n): (u32, u16, u16), litz: bool, wide: bool) -> String {
    if litz && n >= 3 && (j == 0 || j == n - 1) {
        return if j == 0 { "(" } else { ")" }.to_string();
    }
    if turn % 2 == 1 && wide {
        letter.to_ascii_lowercase().to_string()
    } else {
        letter.to_string()
    }
}

/// Where a row of the drawing goes: its first column and line, its width in cells, the
/// millimetres a cell stands for and the margin tape's width.
#[derive(Clone, Copy)]
struct RowAt {
    x0: u16,
    y: u16,
    cols: u16,
    cell_mm: f64,
    margin: f64,
}

/// Too many pieces for the rows: every layer and tape at its plain-scale row (later ones
/// drawn over earlier), the markers kept.
fn squeeze(all: &[Piece], rows: u16) -> Vec<u16> {
    // Give rows to markers first, then to the thickest pieces, one each, in height order.
    let mut got = vec![0u16; all.len()];
    let mut left = rows;
    for (i, p) in all.iter().enumerate() {
        if matches!(p.item, Item::Limit | Item::Allowance) && left > 0 {
            got[i] = 1;
            left -= 1;
        }
    }
    let mut order: Vec<usize> = (0..all.len())
        .filter(|&i| all[i].min_rows > 0 && got[i] == 0)
        .collect();
    order.sort_by(|&a, &b| all[b].height_mm.total_cmp(&all[a].height_mm));
    for i in order {
        if left == 0 {
            break;
        }
        got[i] = 1;
        left -= 1;
    }
    got
}
