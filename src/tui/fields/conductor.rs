//! Reading and parsing the keys of a foil or a litz for the winding form's rows: each row
//! shows only for the conductor it belongs to (`None` otherwise), and a typed value that is
//! not a number in range is refused here with what was expected; the engine's validation
//! (`engine::conductor::check`) has the last word.

use super::{Ctx, number, parse_u32};
use crate::engine::layout::usable_width_mm;
use crate::model::trim_mm;
use crate::model::{Conductor, FOIL_MAX_MM, FOIL_MIN_MM, Foil, LITZ_STRAND_MM, LITZ_STRANDS, Litz};
use crate::tui::edit::Refusal;

/// The foil of the form's winding, when it is foil.
pub fn foil(c: &Ctx) -> Option<Foil> {
    match c.build.windings.get(c.k)?.conductor {
        Conductor::Foil(f) => Some(f),
        _ => None,
    }
}

/// The litz of the form's winding, when it is litz.
pub fn litz(c: &Ctx) -> Option<Litz> {
    match c.build.windings.get(c.k)?.conductor {
        Conductor::Litz(l) => Some(l),
        _ => None,
    }
}

/// The form's winding is round wire.
pub fn is_round(c: &Ctx) -> bool {
    c.build
        .windings
        .get(c.k)
        .is_some_and(|w| w.conductor == Conductor::Round)
}

/// A key of the file: its value in millimetres, or "default" with the value it stands for.
pub fn mm_or_default(v: Option<f64>, default_mm: f64) -> String {
    match v {
        Some(v) => format!("{} mm", trim_mm(v)),
        None => format!("default, {} mm", trim_mm(default_mm)),
    }
}

/// A plain factor of the file, or "default" with the value it stands for.
pub fn factor_or_default(v: Option<f64>, default: f64) -> String {
    match v {
        Some(v) => format!("{v}"),
        None => format!("default, {default}"),
    }
}

/// The foil width as shown: given, or the default the breadth leaves.
pub fn width_shown(c: &Ctx, f: &Foil) -> String {
    match f.width_mm {
        Some(w) => format!("{} mm", trim_mm(w)),
        None => format!(
            "default, {} mm (breadth less {} mm a side)",
            trim_mm(f.width_on(usable_width_mm(c.build))),
            trim_mm(f.overhang())
        ),
    }
}

/// An optional value as the text to edit (empty for the default).
pub fn text_of(v: Option<f64>) -> String {
    v.map(|v| v.to_string()).unwrap_or_default()
}

/// A number within `range`, or the refusal that names the key and the range.
fn within(t: &str, key: &str, lo: f64, hi: f64, unit: &str) -> Result<f64, Refusal> {
    let v = number(t)?;
    if (lo..=hi).contains(&v) {
        Ok(v)
    } else {
        Err(format!("{key} must be from {lo} to {hi}{unit}, got {v}"))
    }
}

/// The foil thickness typed (`foil_mm`).
pub fn parse_foil_mm(t: &str) -> Result<f64, Refusal> {
    within(t, "foil thickness", FOIL_MIN_MM, FOIL_MAX_MM, " mm")
}

/// An optional millimetre key typed: empty or "default" leaves it to the default.
pub fn parse_optional_mm(t: &str, key: &str, lo: f64, hi: f64) -> Result<Option<f64>, Refusal> {
    let t = t.trim();
    if t.is_empty() || t == "default" || t == "none" {
        return Ok(None);
    }
    within(t, key, lo, hi, " mm").map(Some)
}

/// An optional factor typed: empty or "default" leaves it to the default.
pub fn parse_optional_factor(t: &str, key: &str, lo: f64, hi: f64) -> Result<Option<f64>, Refusal> {
    let t = t.trim();
    if t.is_empty() || t == "default" || t == "none" {
        return Ok(None);
    }
    within(t, key, lo, hi, "").map(Some)
}

/// The litz strand count typed.
pub fn parse_litz_strands(t: &str) -> Result<u32, Refusal> {
    let (lo, hi) = (*LITZ_STRANDS.start(), *LITZ_STRANDS.end());
    match parse_u32(t) {
        Some(n) if (lo..=hi).contains(&n) => Ok(n),
        _ => Err(format!(
            "\"{t}\" is not a strand count: a whole number from {lo} to {hi}"
        )),
    }
}

/// The litz strand diameter typed.
pub fn parse_strand_mm(t: &str) -> Result<f64, Refusal> {
    within(
        t,
        "strand diameter",
        *LITZ_STRAND_MM.start(),
        *LITZ_STRAND_MM.end(),
        " mm",
    )
}
