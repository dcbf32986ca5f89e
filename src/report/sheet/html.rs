//! The winding sheet as one self-contained, printable HTML page: inline style and inline SVG,
//! no scripts, no external files. Written as well-formed XML-style markup.

use super::Sheet;
use super::svg::escape;
use std::fmt::Write as _;

/// The page's style. The content column is 180 mm, which fits inside 15 mm margins on both A4
/// (210 mm) and Letter (216 mm); the page size is the printer's choice.
const STYLE: &str = "
@page { margin: 14mm 15mm; }
@page :first { margin-top: 12mm; }
* { box-sizing: border-box; }
body { font-family: 'DejaVu Sans', Arial, sans-serif; font-size: 10pt; color: #000;
       max-width: 180mm; margin: 0 auto; line-height: 1.3; }
h1 { font-size: 15pt; margin: 0 0 2mm 0; }
h2 { font-size: 12pt; margin: 5mm 0 2mm 0; border-bottom: 0.3mm solid #000; }
.id { font-family: 'DejaVu Sans Mono', monospace; font-size: 11pt; border: 0.3mm solid #000;
      padding: 0.5mm 2mm; }
table { border-collapse: collapse; width: 100%; }
th, td { border: 0.2mm solid #888; padding: 0.8mm 1.5mm; text-align: left; vertical-align: top; }
td.n { text-align: right; font-variant-numeric: tabular-nums; }
.step { border: 0.3mm solid #000; margin: 2mm 0; padding: 1.5mm 2mm; break-inside: avoid;
        page-break-inside: avoid; }
.step h3 { font-size: 11pt; margin: 0 0 1mm 0; }
.step dl { display: grid; grid-template-columns: 22mm 1fr; margin: 0; gap: 0.4mm 2mm; }
.step dt { font-weight: bold; }
.step dd { margin: 0; }
.box { width: 4mm; height: 4mm; border: 0.3mm solid #000; display: inline-block;
       vertical-align: middle; margin-right: 2mm; }
.caution { border: 0.6mm solid #000; padding: 2mm; break-inside: avoid; }
.caution li { margin-bottom: 1mm; }
.nofit { border: 0.6mm solid #b00; padding: 1.5mm; font-weight: bold; }
figure { margin: 2mm 0; break-inside: avoid; }
figcaption { font-size: 9pt; }
.checks tr, .bom tr { break-inside: avoid; }
@media print { a { color: #000; text-decoration: none; } h2 { break-after: avoid; } }
";

/// What the caption adds for the foil and litz the drawing holds (nothing for round wire, so
/// the sheets of round-wire builds stay as they were).
fn conductor_caption(svg: &str) -> String {
    let mut o = String::new();
    if svg.contains("class=\"foil\"") {
        o.push_str(" A foil turn is a strip across the breadth, on its interleaf (white).");
    }
    if svg.contains("class=\"strand\"") {
        o.push_str(" A litz bundle is a circle with dots for its strands.");
    }
    o
}

/// The page. `svg` is the cross-section (see `svg::cross_section`).
pub fn render(s: &Sheet, svg: &str, scale: f64) -> String {
    let mut o = String::new();
    header(&mut o, s);
    let _ = write!(
        o,
        "<figure>{svg}<figcaption>Cross-section of one side of the window, drawn to scale ({scale:.1} : 1): the tube at the bottom, the flanges at the sides, one band per stack section numbered as the steps. Filled circles are the section's winding, open circles its bifilar partner; the hatched area is past the window.{}</figcaption></figure>",
        conductor_caption(svg)
    );

    if let Some(r) = &s.reset {
        super::reset_chart::html_section(&mut o, r);
    }
    bill_of_materials(&mut o, s);
    pin_map(&mut o, s);
    steps(&mut o, s);
    checks(&mut o, s);
    super::readings::html_table(&mut o, &s.readings, s.measure_at_c, escape);
    safety_and_warnings(&mut o, s);
    o.push_str("</body></html>\n");
    o
}

/// The document's head and the page's top: title, build id, bobbin, core, verdict, and the
/// refusal when the plan does not fit.
fn header(o: &mut String, s: &Sheet) {
    let e = escape;
    o.push_str("<!DOCTYPE html>\n<html lang=\"en\"><head><meta charset=\"utf-8\"/>");
    let _ = write!(o, "<title>Winding sheet: {}</title>", e(&s.title));
    let _ = write!(o, "<style>{STYLE}</style></head><body>");
    let _ = write!(
        o,
        "<h1>Winding sheet: {}</h1><p>Build id <span class=\"id\">{}</span> (match it to the file: <code>turnstack sheet FILE</code> prints the same id)</p>",
        e(&s.title),
        e(&s.build_id)
    );
    let _ = write!(o, "<p>Bobbin {}</p>", e(&s.bobbin));
    if let Some(c) = &s.core {
        let _ = write!(o, "<p>Core {}</p>", e(c));
    }
    let _ = write!(o, "<p>{}</p>", e(&s.verdict));
    if !s.fits {
        o.push_str("<p class=\"nofit\">DO NOT WIND: the plan does not fit this bobbin. See <code>turnstack fit</code>.</p>");
    }
}

/// The wires with their cut lengths, the lead allowance, and the other materials.
fn bill_of_materials(o: &mut String, s: &Sheet) {
    let e = escape;
    o.push_str("<h2>Bill of materials</h2><table class=\"bom\"><tr><th>winding</th><th>role</th><th>wire</th><th>strands</th><th>turns</th><th>wound length</th><th>cut each strand</th><th>cut in all</th></tr>");
    for w in &s.wires {
        let _ = write!(
            o,
            "<tr><td>{}</td><td>{}</td><td>{} {}</td><td class=\"n\">{}</td><td class=\"n\">{}</td><td class=\"n\">{:.3} m</td><td class=\"n\">{:.0} mm</td><td class=\"n\">{:.0} mm</td></tr>",
            e(&w.winding),
            w.role.key(),
            e(&w.wire),
            e(&w.grade),
            w.strands,
            w.turns,
            w.length_m,
            w.cut_each_mm,
            w.cut_total_mm
        );
    }
    let _ = write!(
        o,
        "</table><p>Cut each strand to its wound length plus {:.0} mm at each end for the lead (and {:.0} mm more wherever a winding is parked between sections), rounded up to {:.0} mm.</p><table>",
        super::LEAD_ALLOWANCE_MM,
        super::LEAD_ALLOWANCE_MM,
        super::CUT_ROUND_MM
    );
    for (k, v) in &s.materials {
        let _ = write!(o, "<tr><th>{}</th><td>{}</td></tr>", e(k), e(v));
    }
    o.push_str("</table>");
}

/// Each winding's start and finish pins (blanks to fill in), and the dot convention.
fn pin_map(o: &mut String, s: &Sheet) {
    let e = escape;
    o.push_str("<h2>Pin map</h2><table><tr><th>winding</th><th>role</th><th>start (dot)</th><th>finish</th></tr>");
    for p in &s.pins {
        let _ = write!(
            o,
            "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>",
            e(&p.winding),
            p.role.key(),
            e(p.start.as_deref().unwrap_or("____")),
            e(p.finish.as_deref().unwrap_or("____"))
        );
    }
    let _ = write!(o, "</table><p><b>Convention.</b> {}</p>", e(&s.convention));
}

/// One box a step, from the tube outward, each with its lines.
fn steps(o: &mut String, s: &Sheet) {
    let e = escape;
    o.push_str("<h2>Steps, from the tube outward</h2>");
    for st in &s.steps {
        let _ = write!(
            o,
            "<div class=\"step\" data-section=\"{}\"><h3><span class=\"box\"></span>Step {}: {}</h3><dl>",
            st.section + 1,
            st.number,
            e(&st.heading)
        );
        for (k, v) in &st.lines {
            let _ = write!(o, "<dt>{}</dt><dd>{}</dd>", e(k), e(v));
        }
        o.push_str("</dl></div>");
    }
}

/// The checks after winding, one box a check.
fn checks(o: &mut String, s: &Sheet) {
    let e = escape;
    let _ = write!(
        o,
        "<h2>Checks after winding</h2><table class=\"checks\"><tr><th>check</th><th>expect</th><th>how</th></tr>"
    );
    for c in &s.checks {
        let _ = write!(
            o,
            "<tr><td><span class=\"box\"></span>{}</td><td>{}</td><td>{}</td></tr>",
            e(&c.what),
            e(&c.expected),
            e(&c.how)
        );
    }
    o.push_str("</table>");
}

/// The safety cautions, then the plan's warnings and notes when it has any.
fn safety_and_warnings(o: &mut String, s: &Sheet) {
    let e = escape;
    o.push_str("<h2>Safety</h2><div class=\"caution\"><ul>");
    for c in &s.cautions {
        let _ = write!(o, "<li>{}</li>", e(c));
    }
    o.push_str("</ul></div>");
    if !s.warnings.is_empty() || !s.notes.is_empty() {
        o.push_str("<h2>Warnings from the plan</h2><ul>");
        for w in &s.warnings {
            let _ = write!(o, "<li>{}</li>", e(w));
        }
        for n in &s.notes {
            let _ = write!(o, "<li>note: {}</li>", e(n));
        }
        o.push_str("</ul>");
    }
}
