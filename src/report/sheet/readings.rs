//! The readings table of the winding sheet: for every reading `turnstack verify` checks, the
//! expected value and the band a good part falls in, and a cell to write the reading in (filled
//! when the build's `[measured]` table already holds it), so the paper and the file carry the
//! same checks. The figures come from `engine::verify::predictions`.

use crate::engine::Evaluation;
use crate::engine::verify::{Prediction, Quantity, predictions};
use crate::model::Build;
use crate::report::verify::value;
use std::fmt::Write as _;

/// One row: what, expected, accepted band, and the reading when the file has it.
#[derive(Debug, Clone, PartialEq)]
pub struct ReadingRow {
    /// Short label, e.g. `DCR P`, `L leakage P (S shorted)`, `ratio S/P`.
    pub what: String,
    pub expected: String,
    /// `low-high` of the tolerance band.
    pub accept: String,
    /// The `[measured]` value in words, or `None` for an empty cell to write in.
    pub measured: Option<String>,
}

fn label(q: &Quantity) -> String {
    match q {
        Quantity::Dcr { winding } => format!("DCR {winding}"),
        Quantity::Magnetising { primary } => format!("L magnetising {primary}"),
        Quantity::Leakage { primary, secondary } => {
            format!("L leakage {primary} ({secondary} shorted)")
        }
        Quantity::Ratio { winding, primary } => format!("ratio {winding}/{primary}"),
    }
}

fn recorded(build: &Build, q: &Quantity, measure_at_c: f64) -> Option<String> {
    let m = build.measured.as_ref()?;
    let find = |pairs: &[(crate::model::Name, f64)], name: &str| {
        pairs.iter().find(|(n, _)| **n == *name).map(|(_, x)| *x)
    };
    let x = match q {
        Quantity::Dcr { winding } => find(&m.dcr_ohm, winding)?,
        Quantity::Magnetising { .. } => m.magnetising_uh?,
        Quantity::Leakage { .. } => m.leakage_uh?,
        Quantity::Ratio { winding, .. } => find(&m.ratio, winding)?,
    };
    let at = m.reading_temperature_c();
    Some(match q {
        Quantity::Dcr { .. } if (at - measure_at_c).abs() >= 0.05 => {
            format!("{} at {at:.0} C", value(q, x))
        }
        _ => value(q, x),
    })
}

/// The rows, resistances expected at `measure_at_c`.
pub fn rows(build: &Build, eval: &Evaluation, measure_at_c: f64) -> Vec<ReadingRow> {
    predictions(build, eval, measure_at_c)
        .iter()
        .map(|p: &Prediction| ReadingRow {
            what: label(&p.quantity),
            expected: value(&p.quantity, p.expected),
            accept: format!(
                "{}-{}",
                value(&p.quantity, p.low),
                value(&p.quantity, p.high)
            ),
            measured: recorded(build, &p.quantity, measure_at_c),
        })
        .collect()
}

const BLANK: &str = "__________";

/// The text block (80 columns): a heading, then one line a reading.
pub fn text_block(rows: &[ReadingRow], measure_at_c: f64) -> Vec<String> {
    let title = "Readings (write each in; `turnstack verify` checks the same)";
    let mut o = vec![title.to_string(), "-".repeat(title.len())];
    o.push(format!(
        "  resistances at {measure_at_c:.0} C; out of the band: see `turnstack verify`"
    ));
    o.push(format!(
        "  {:<23} {:>11}  {:<22} {}",
        "reading", "expected", "accept", "measured"
    ));
    for r in rows {
        o.push(format!(
            "  {:<23} {:>11}  {:<22} {}",
            crate::report::text::truncate(&r.what, 23),
            r.expected,
            r.accept,
            r.measured.as_deref().unwrap_or(BLANK)
        ));
    }
    o
}

/// The HTML table, appended to `o`; `e` escapes text.
pub fn html_table(o: &mut String, rows: &[ReadingRow], measure_at_c: f64, e: fn(&str) -> String) {
    let _ = write!(
        o,
        "<h2>Readings</h2><p>Write each reading in (resistances at {measure_at_c:.0} C); \
         <code>turnstack verify</code> checks the same from the file's [measured] table.</p>\
         <table class=\"checks\"><tr><th>reading</th><th>expected</th><th>accept</th>\
         <th>measured</th></tr>"
    );
    for r in rows {
        let _ = write!(
            o,
            "<tr><td>{}</td><td>{}</td><td>{}</td><td>{}</td></tr>",
            e(&r.what),
            e(&r.expected),
            e(&r.accept),
            r.measured.as_deref().map_or(String::from("&nbsp;"), e)
        );
    }
    o.push_str("</table>");
}
