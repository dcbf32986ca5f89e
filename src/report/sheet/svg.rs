//! The window cross-section as inline SVG, to scale: one band (a `<g class="band">`) per stack
//! section, the turns as circles, margins, the window limit and the limit with the allowance.

use crate::engine::conductor::ConductorFigures;
use crate::engine::{Evaluation, SectionEval, SectionKind};
use crate::model::{Build, Conductor};
use std::fmt::Write as _;

/// Width of the drawing on paper (mm); the window is scaled to fit `WINDOW_PAPER_MM` of it.
pub const DRAWING_MM: f64 = 170.0;
const WINDOW_PAPER_MM: f64 = 110.0;
const LEFT_MM: f64 = 8.0;
/// More turns than this in a layer are drawn as a filled band rather than one by one.
const MAX_CIRCLES: u32 = 120;
/// Least vertical distance between two labels on paper (mm).
const LABEL_GAP: f64 = 3.0;

pub fn escape(s: &str) -> String {
    s.replace('&', "&amp;")
        .replace('<', "&lt;")
        .replace('>', "&gt;")
        .replace('"', "&quot;")
        .replace('\'', "&#39;")
}

/// Fills that also differ without colour: winding sections alternate a hatch direction.
const FILLS: [&str; 4] = ["#c8742a", "#2a6fc8", "#4a9a3a", "#9a3a8a"];

/// The labels at the right of the bands, pushed apart so that thin bands keep readable
/// labels; a leader line runs from each band (at paper y) to its label.
fn draw_labels(o: &mut String, labels: &[(f64, String)], edge: f64) {
    let mut placed: Vec<f64> = labels.iter().map(|l| l.0).collect();
    for i in 1..placed.len() {
        // Stack order is bottom-up on paper, so each label sits above the previous one.
        if placed[i] > placed[i - 1] - LABEL_GAP {
            placed[i] = placed[i - 1] - LABEL_GAP;
        }
    }
    let lx = edge + 6.0;
    for ((cy, label), ly) in labels.iter().zip(&placed) {
        let _ = write!(
            o,
            "<polyline points=\"{edge:.2},{cy:.3} {:.2},{cy:.3} {:.2},{ly:.3} {lx:.2},{ly:.3}\" fill=\"none\" stroke=\"#555\" stroke-width=\"0.15\"/>",
            edge + 1.5,
            edge + 4.0
        );
        let _ = write!(
            o,
            "<text x=\"{:.2}\" y=\"{:.3}\" font-size=\"2.4\">{}</text>",
            lx + 0.5,
            ly + 0.8,
            escape(label)
        );
    }
}

/// The label of a band: the section number and what it is.
fn band_label(i: usize, s: &SectionEval) -> String {
    match &s.kind {
        SectionKind::Tape { wraps } => format!("{} tape x{wraps}", i + 1),
        SectionKind::Winding {
            winding,
            partner,
            turns,
            ..
        } => match partner {
            Some(b) => format!("{} {winding}+{b} bifilar, {turns} t", i + 1),
            None => format!("{} {winding}, {turns} t", i + 1),
        },
    }
}

/// The window limit, the limit the allowance leaves for the bare build, and the caption.
fn draw_limits(o: &mut String, build: &Build, paper: &Paper, h_win: f64, flange: f64, tube: f64) {
    let (w, k, y_base) = (paper.w, paper.k, paper.y_base);
    let x = |mm: f64| paper.x(mm);
    let y = |mm: f64| paper.y(mm);
    let _ = write!(
        o,
        "<line class=\"limit\" x1=\"{:.2}\" y1=\"{:.3}\" x2=\"{:.2}\" y2=\"{:.3}\" stroke=\"#000\" stroke-width=\"0.3\"/>",
        x(0.0) - flange,
        y(h_win),
        x(w) + flange,
        y(h_win)
    );
    let bare_limit = h_win / build.setup.allowance_factor;
    let _ = write!(
        o,
        "<line class=\"allowance\" x1=\"{:.2}\" y1=\"{:.3}\" x2=\"{:.2}\" y2=\"{:.3}\" stroke=\"#000\" stroke-width=\"0.2\" stroke-dasharray=\"1,1\"/>",
        x(0.0),
        y(bare_limit),
        x(w),
        y(bare_limit)
    );
    let _ = write!(
        o,
        "<text x=\"{:.2}\" y=\"{:.2}\" font-size=\"2.4\">tube at the bottom; {w:.2} mm between flanges; solid line: window {h_win:.2} mm; dashed: window / allowance {:.2}; scale {k:.1} : 1</text>",
        x(0.0) - flange,
        y_base + tube + 4.0,
        build.setup.allowance_factor
    );
}

/// One tape section's band.
fn draw_tape(o: &mut String, paper: &Paper, i: usize, s: &SectionEval, wraps: u32) {
    let (w, k) = (paper.w, paper.k);
    let x = |mm: f64| paper.x(mm);
    let (y_top, hgt) = (paper.y(s.y_mm + s.height_mm), s.height_mm * k);
    let _ = write!(
        o,
        "<g class=\"band tape\" data-section=\"{}\"><rect x=\"{:.2}\" y=\"{y_top:.3}\" width=\"{:.2}\" height=\"{hgt:.3}\" fill=\"#f3e27a\" stroke=\"#7a6a10\" stroke-width=\"0.1\"/><title>stack #{}: tape, {wraps} wraps</title></g>",
        i + 1,
        x(0.0),
        w * k,
        i + 1
    );
}

/// The paper transform of the drawing: window millimetres to paper millimetres.
struct Paper {
    /// Paper x of the window's left flange face.
    x0: f64,
    /// Paper y of the tube surface.
    y_base: f64,
    /// Paper mm per window mm.
    k: f64,
    /// Window width and the build's margin (window mm).
    w: f64,
    margin: f64,
}

impl Paper {
    fn x(&self, mm: f64) -> f64 {
        self.x0 + mm * self.k
    }
    fn y(&self, mm: f64) -> f64 {
        self.y_base - mm * self.k
    }
}

/// Each turn of each layer of a winding section, one circle per strand (the partner's
/// hollow); a filled strip where a layer has too many turns to draw. `wires` holds the
/// strands and overall diameter of the winding and of its bifilar partner (0 strands: none).
fn draw_turns(
    o: &mut String,
    paper: &Paper,
    s: &SectionEval,
    pitch_mm: f64,
    fill: &str,
    wires: [(u32, f64); 2],
    bundles: [bool; 2],
) {
    let (k, margin) = (paper.k, paper.margin);
    for layer in &s.layers {
        let cy_mm = layer.y_mm + layer.height_mm / 2.0;
        if layer.turns > MAX_CIRCLES {
            let _ = write!(
                o,
                "<rect x=\"{:.2}\" y=\"{:.3}\" width=\"{:.2}\" height=\"{:.3}\" fill=\"{fill}\"/>",
                paper.x(margin),
                paper.y(layer.y_mm + layer.height_mm),
                f64::from(layer.turns) * pitch_mm * k,
                layer.height_mm * k
            );
            continue;
        }
        for t in 0..layer.turns {
            let mut xm = margin + f64::from(t) * pitch_mm;
            for (((n, od), hollow), bundle) in wires.into_iter().zip([false, true]).zip(bundles) {
                for _ in 0..n {
                    let (fc, sc) = if hollow {
                        ("#fff", fill)
                    } else {
                        (fill, "#333")
                    };
                    let _ = write!(
                        o,
                        "<circle cx=\"{:.3}\" cy=\"{:.3}\" r=\"{:.3}\" fill=\"{fc}\" stroke=\"{sc}\" stroke-width=\"0.12\"/>",
                        paper.x(xm + od / 2.0),
                        paper.y(cy_mm),
                        od / 2.0 * k
                    );
                    if bundle {
                        // Dots in the circle's contrast: white on filled, the fill on hollow.
                        let dots = if hollow { fill } else { "#fff" };
                        let at = (paper.x(xm + od / 2.0), paper.y(cy_mm));
                        litz_strands(o, at, od / 2.0 * k, dots);
                    }
                    xm += od;
                }
            }
        }
    }
}

/// The strands of a litz bundle drawn as a symbol: seven dots, one in the middle and six
/// round it, inside the bundle's circle (centre and radius in paper mm).
fn litz_strands(o: &mut String, (cx, cy): (f64, f64), r: f64, dots: &str) {
    let dot = r * 0.2;
    let at = std::iter::once((0.0, 0.0)).chain((0..6).map(|i| {
        let a = f64::from(i) * std::f64::consts::PI / 3.0;
        (0.55 * r * a.cos(), 0.55 * r * a.sin())
    }));
    for (dx, dy) in at {
        let _ = write!(
            o,
            "<circle class=\"strand\" cx=\"{:.3}\" cy=\"{:.3}\" r=\"{dot:.3}\" fill=\"{dots}\"/>",
            cx + dx,
            cy + dy
        );
    }
}

/// A foil winding's copper width and the copper's share of its layer height.
fn foil_of(eval: &Evaluation, winding: &str) -> Option<(f64, f64)> {
    eval.windings
        .iter()
        .find(|w| w.name == winding)
        .and_then(|w| match w.conductor {
            ConductorFigures::Foil {
                width_mm,
                thickness_mm,
                layer_height_mm,
                ..
            } => Some((width_mm, thickness_mm / layer_height_mm.max(1e-9))),
            _ => None,
        })
}

/// Each foil turn of a section: a copper strip of the foil's width centred in the breadth,
/// on the interleaf film that lies under it across the layer's breadth, to scale.
/// `foil` holds the copper's width and its share of the layer height.
fn draw_foil(o: &mut String, paper: &Paper, s: &SectionEval, foil: (f64, f64), fill: &str) {
    let (width_mm, share) = foil;
    let (w, k, margin) = (paper.w, paper.k, paper.margin);
    let breadth = w - 2.0 * margin;
    let x_foil = margin + (breadth - width_mm).max(0.0) / 2.0;
    for layer in &s.layers {
        let _ = write!(
            o,
            "<rect class=\"interleaf\" x=\"{:.2}\" y=\"{:.3}\" width=\"{:.2}\" height=\"{:.3}\" fill=\"#fff\" stroke=\"#777\" stroke-width=\"0.05\"/>",
            paper.x(margin),
            paper.y(layer.y_mm + layer.height_mm),
            breadth * k,
            layer.height_mm * k
        );
        let _ = write!(
            o,
            "<rect class=\"foil\" x=\"{:.2}\" y=\"{:.3}\" width=\"{:.2}\" height=\"{:.3}\" fill=\"{fill}\"/>",
            paper.x(x_foil),
            paper.y(layer.y_mm + layer.height_mm),
            width_mm * k,
            layer.height_mm * share * k
        );
    }
}

/// One winding section's band: its margins, its outline and each turn of each layer (a
/// filled strip where a layer has too many turns to draw).
fn winding_band(
    o: &mut String,
    build: &Build,
    eval: &Evaluation,
    i: usize,
    s: &SectionEval,
    paper: &Paper,
    fill: &str,
) {
    let SectionKind::Winding {
        winding,
        partner,
        pitch_mm,
        ..
    } = &s.kind
    else {
        return;
    };
    let (w, k, margin) = (paper.w, paper.k, paper.margin);
    let (y_top, hgt) = (paper.y(s.y_mm + s.height_mm), s.height_mm * k);
    let name = match partner {
        Some(b) => format!("{winding}+{b}"),
        None => winding.to_string(),
    };
    let _ = write!(
        o,
        "<g class=\"band winding\" data-section=\"{}\"><title>stack #{}: {}</title>",
        i + 1,
        i + 1,
        escape(&name)
    );
    if margin > 0.0 {
        for mx in [0.0, w - margin] {
            let _ = write!(
                o,
                "<rect class=\"margin\" x=\"{:.2}\" y=\"{y_top:.3}\" width=\"{:.2}\" height=\"{hgt:.3}\" fill=\"#e8e0c8\" stroke=\"#777\" stroke-width=\"0.1\"/>",
                paper.x(mx),
                margin * k
            );
        }
    }
    let _ = write!(
        o,
        "<rect x=\"{:.2}\" y=\"{y_top:.3}\" width=\"{:.2}\" height=\"{hgt:.3}\" fill=\"{fill}\" fill-opacity=\"0.18\" stroke=\"{fill}\" stroke-width=\"0.15\"/>",
        paper.x(margin),
        (w - 2.0 * margin) * k
    );
    let strands_a = build.winding(winding).map_or(1, |w| w.strands.max(1));
    let strands_b = partner
        .as_ref()
        .and_then(|n| build.winding(n))
        .map_or(0, |w| w.strands.max(1));
    let od_of = |n: &str| {
        eval.windings
            .iter()
            .find(|w| w.name == n)
            .map_or(0.0, |w| w.od_mm)
    };
    let od_a = od_of(winding);
    let od_b = partner.as_deref().map_or(0.0, od_of);
    let conductor = |n: &str| build.winding(n).map(|w| w.conductor);
    let is_litz = |n: &str| matches!(conductor(n), Some(Conductor::Litz(_)));
    if let Some(Conductor::Foil(_)) = conductor(winding) {
        let foil = foil_of(eval, winding).unwrap_or((w - 2.0 * margin, 1.0));
        draw_foil(o, paper, s, foil, fill);
    } else {
        draw_turns(
            o,
            paper,
            s,
            *pitch_mm,
            fill,
            [(strands_a, od_a), (strands_b, od_b)],
            [is_litz(winding), partner.as_deref().is_some_and(is_litz)],
        );
    }
    o.push_str("</g>");
}

/// The scale factor used (paper mm per window mm) and the SVG text.
pub fn cross_section(build: &Build, eval: &Evaluation) -> (f64, String) {
    let w = eval.window_width_mm;
    let h_win = eval.window_height_mm;
    let top = eval
        .build_height_mm
        .max(eval.height_with_allowance_mm)
        .max(h_win);
    let mut k = WINDOW_PAPER_MM / w;
    // Keep a very tall build on the page: at most 120 mm of drawing height.
    if top * k > 120.0 {
        k = 120.0 / top;
    }
    let flange = 2.0;
    let tube = 3.0;
    // Room above the window for labels pushed up from thin bands.
    let pad_top = (eval.sections.len() as f64 * LABEL_GAP + 4.0 - top * k).max(8.0);
    let height = pad_top + top * k + tube + 10.0;
    let x0 = LEFT_MM + flange;
    let y_base = pad_top + top * k; // paper y of the tube surface
    let y = |mm: f64| y_base - mm * k;
    let x = |mm: f64| x0 + mm * k;
    let paper = Paper {
        x0,
        y_base,
        k,
        w,
        margin: build.setup.margin_mm,
    };
    let mut o = String::new();
    let _ = write!(
        o,
        "<svg class=\"xsec\" width=\"{DRAWING_MM}mm\" height=\"{height:.1}mm\" viewBox=\"0 0 {DRAWING_MM} {height:.1}\" role=\"img\" aria-label=\"Cross-section of the winding window, to scale\">"
    );
    o.push_str("<defs><pattern id=\"hatch\" width=\"1.2\" height=\"1.2\" patternUnits=\"userSpaceOnUse\" patternTransform=\"rotate(45)\"><line x1=\"0\" y1=\"0\" x2=\"0\" y2=\"1.2\" stroke=\"#b00\" stroke-width=\"0.4\"/></pattern></defs>");
    // Tube and flanges.
    let _ = write!(
        o,
        "<rect class=\"tube\" x=\"{:.2}\" y=\"{:.2}\" width=\"{:.2}\" height=\"{tube}\" fill=\"#999\"/>",
        x0 - flange,
        y_base,
        w * k + 2.0 * flange
    );
    for fx in [x0 - flange, x0 + w * k] {
        let _ = write!(
            o,
            "<rect class=\"flange\" x=\"{fx:.2}\" y=\"{:.2}\" width=\"{flange}\" height=\"{:.2}\" fill=\"#999\"/>",
            y(h_win),
            h_win * k
        );
    }
    // Overflow past the window, hatched.
    if eval.build_height_mm > h_win {
        let _ = write!(
            o,
            "<rect class=\"overflow\" x=\"{:.2}\" y=\"{:.2}\" width=\"{:.2}\" height=\"{:.2}\" fill=\"url(#hatch)\" stroke=\"#b00\" stroke-width=\"0.3\"/>",
            x(0.0),
            y(eval.build_height_mm),
            w * k,
            (eval.build_height_mm - h_win) * k
        );
    }
    let mut colour = 0;
    let mut labels: Vec<(f64, String)> = Vec::new();
    for (i, s) in eval.sections.iter().enumerate() {
        match &s.kind {
            SectionKind::Tape { wraps } => draw_tape(&mut o, &paper, i, s, *wraps),
            SectionKind::Winding { .. } => {
                let fill = FILLS[colour % FILLS.len()];
                colour += 1;
                winding_band(&mut o, build, eval, i, s, &paper, fill);
            }
        }
        labels.push((y(s.y_mm + s.height_mm / 2.0), band_label(i, s)));
    }
    let edge = x(w) + flange;
    draw_labels(&mut o, &labels, edge);
    draw_limits(&mut o, build, &paper, h_win, flange, tube);
    o.push_str("</svg>");
    (k, o)
}
