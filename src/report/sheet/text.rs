//! The winding sheet as plain text: 80 columns, in blocks that are never split across a page.

use super::Sheet;
use crate::report::text::WIDTH;
use crate::report::wrap;
use unicode_width::UnicodeWidthStr;

/// Lines on a printed page at 6 lines an inch inside the margins of A4 or Letter.
pub const PAGE_LINES: usize = 60;

fn block_title(o: &mut Vec<String>, t: &str) {
    o.push(t.to_string());
    o.push("-".repeat(t.len().min(WIDTH)));
}

/// `label  text`, the text wrapped under itself.
fn labelled(o: &mut Vec<String>, label: &str, text: &str, label_w: usize) {
    let indent = " ".repeat(label_w + 4);
    for (k, l) in wrap(text, WIDTH - label_w - 4, "").into_iter().enumerate() {
        if k == 0 {
            o.push(format!("  {label:<label_w$}  {l}"));
        } else {
            o.push(format!("{indent}{l}"));
        }
    }
}

fn para(o: &mut Vec<String>, text: &str, first: &str, rest: &str) {
    // Wrapped for the wider of the two indents, so no line passes the width.
    let room = WIDTH - first.width().max(rest.width());
    for (k, l) in wrap(text, room, "").into_iter().enumerate() {
        o.push(format!("{}{l}", if k == 0 { first } else { rest }));
    }
}

/// The head: title, build id, bobbin, core, the plan's verdict and, when it does not fit,
/// the refusal to wind.
fn head_block(s: &Sheet) -> Vec<String> {
    let mut head = Vec::new();
    para(&mut head, &format!("WINDING SHEET: {}", s.title), "", "  ");
    head.push(format!(
        "Build id {}  (match it to the file: turnstack sheet FILE)",
        s.build_id
    ));
    para(&mut head, &format!("Bobbin {}", s.bobbin), "", "  ");
    if let Some(c) = &s.core {
        para(&mut head, &format!("Core {c}"), "", "  ");
    }
    para(&mut head, &s.verdict, "", "  ");
    if !s.fits {
        head.push("DO NOT WIND: the plan does not fit this bobbin. See `turnstack fit`.".into());
    }
    head
}

/// The bill of materials: each winding's wire, strands, turns, wound length (m) and cut
/// lengths (mm), how the cuts are reckoned, then the other materials.
fn bom_block(s: &Sheet) -> Vec<String> {
    let mut bom = Vec::new();
    block_title(&mut bom, "Bill of materials");
    bom.push(format!(
        "  {:<6} {:<10} {:<15} {:>7} {:>5} {:>8} {:>10} {:>10}",
        "wind.", "role", "wire", "strands", "turns", "wound m", "cut each", "cut total"
    ));
    for w in &s.wires {
        bom.push(format!(
            "  {:<6} {:<10} {:<15} {:>7} {:>5} {:>8.3} {:>7.0} mm {:>7.0} mm",
            crate::report::text::truncate(&w.winding, 6),
            w.role.key(),
            crate::report::text::truncate(&format!("{} {}", w.wire, w.grade), 15),
            w.strands,
            w.turns,
            w.length_m,
            w.cut_each_mm,
            w.cut_total_mm
        ));
    }
    para(
        &mut bom,
        &format!(
            "Cut each strand to its winding length plus {:.0} mm at each end for the lead \
             (and {:.0} mm more wherever a winding is parked between sections), rounded up to \
             {:.0} mm.",
            super::LEAD_ALLOWANCE_MM,
            super::LEAD_ALLOWANCE_MM,
            super::CUT_ROUND_MM
        ),
        "  ",
        "  ",
    );
    for (k, v) in &s.materials {
        labelled(&mut bom, k, v, 15);
    }
    bom
}

/// The pin map: each winding's start and finish pins (blanks to fill in), and the convention.
fn pins_block(s: &Sheet) -> Vec<String> {
    let mut pins = Vec::new();
    block_title(&mut pins, "Pin map");
    pins.push(format!(
        "  {:<10} {:<10} {:<8} {:<8}",
        "winding", "role", "start", "finish"
    ));
    for p in &s.pins {
        pins.push(format!(
            "  {:<10} {:<10} {:<8} {:<8}",
            crate::report::text::truncate(&p.winding, 10),
            p.role.key(),
            p.start.as_deref().unwrap_or("____"),
            p.finish.as_deref().unwrap_or("____")
        ));
    }
    para(
        &mut pins,
        &format!("Convention: {}", s.convention),
        "  ",
        "  ",
    );
    pins
}

/// The blocks of the sheet, each kept on one page.
pub fn blocks(s: &Sheet) -> Vec<Vec<String>> {
    let mut out = Vec::new();

    out.push(head_block(s));

    out.push(bom_block(s));

    out.push(pins_block(s));

    let mut first = true;
    for step in &s.steps {
        let mut b = Vec::new();
        if first {
            block_title(&mut b, "Steps, from the tube outward");
            first = false;
        }
        b.push(format!("STEP {}  {}   [ ] done", step.number, step.heading));
        for (k, v) in &step.lines {
            labelled(&mut b, k, v, 9);
        }
        out.push(b);
    }

    let mut checks = Vec::new();
    block_title(&mut checks, "Checks after winding");
    for c in &s.checks {
        checks.push(format!("  [ ] {}", c.what));
        labelled(&mut checks, "  expect", &c.expected, 8);
        labelled(&mut checks, "  how", &c.how, 8);
    }
    out.push(checks);
    out.push(super::readings::text_block(&s.readings, s.measure_at_c));

    let mut safety = Vec::new();
    block_title(&mut safety, "Safety");
    for c in &s.cautions {
        para(&mut safety, c, "  ! ", "    ");
    }
    out.push(safety);

    if !s.warnings.is_empty() || !s.notes.is_empty() {
        let mut w = Vec::new();
        block_title(&mut w, "Warnings from the plan");
        for x in &s.warnings {
            para(&mut w, x, "  ! ", "    ");
        }
        for x in &s.notes {
            para(&mut w, &format!("note: {x}"), "  ", "    ");
        }
        out.push(w);
    }
    out
}

/// The sheet as text. With `page_lines` > 0 it is cut into pages of at most that many lines,
/// separated by a form feed, each ending with the build id and the page number; a block never
/// straddles two pages unless it is longer than a page.
pub fn render(s: &Sheet, page_lines: usize) -> String {
    let blocks = blocks(s);
    if page_lines == 0 {
        let mut o = String::new();
        for b in blocks {
            for l in b {
                o.push_str(&l);
                o.push('\n');
            }
            o.push('\n');
        }
        return o;
    }
    // Room for the footer and the blank line above it.
    let room = page_lines.saturating_sub(2).max(1);
    let mut pages: Vec<Vec<String>> = vec![Vec::new()];
    for b in blocks {
        let page = pages.last_mut().expect("one page at least");
        let need = b.len() + usize::from(!page.is_empty());
        if !page.is_empty() && page.len() + need > room {
            pages.push(Vec::new());
        }
        for l in b {
            let page = pages.last_mut().expect("one page at least");
            if page.len() >= room {
                pages.push(Vec::new());
            }
            pages.last_mut().expect("one page at least").push(l);
        }
        let page = pages.last_mut().expect("one page at least");
        if page.len() < room {
            page.push(String::new());
        }
    }
    let n = pages.len();
    let mut o = String::new();
    for (k, mut p) in pages.into_iter().enumerate() {
        while p.last().is_some_and(String::is_empty) {
            p.pop();
        }
        for l in p {
            o.push_str(&l);
            o.push('\n');
        }
        o.push('\n');
        o.push_str(&format!("build {}  page {} of {n}\n", s.build_id, k + 1));
        if k + 1 < n {
            o.push('\x0c');
        }
    }
    o
}
