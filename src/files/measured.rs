//! The `[measured]` table: its file shape and its conversion to `model::Measured`, with every
//! problem pointed at its line and column like the rest of the build file.

use super::LoadError;
use crate::model::{Measured, Name, Role, Winding};
use serde::Deserialize;
use std::collections::BTreeMap;
use std::path::Path;
use toml::Spanned;

/// `[measured]` as written.
#[derive(Debug, Deserialize)]
#[serde(deny_unknown_fields)]
pub struct MeasuredTable {
    pub reading_c: Option<Spanned<f64>>,
    pub frequency_khz: Option<Spanned<f64>>,
    pub dcr_ohm: Option<Spanned<BTreeMap<String, Spanned<f64>>>>,
    pub magnetising_uh: Option<Spanned<f64>>,
    pub leakage_uh: Option<Spanned<f64>>,
    pub ratio: Option<Spanned<BTreeMap<String, Spanned<f64>>>>,
    pub hipot: Option<String>,
    pub note: Option<String>,
}

/// Lowest and highest part temperature accepted for a reading (C): a bench, a hot part.
const READING_C_RANGE: (f64, f64) = (-40.0, 200.0);

/// The table into the model, after the windings are known (names are checked against them).
pub(super) fn convert(
    text: &str,
    path: Option<&Path>,
    table: Option<Spanned<MeasuredTable>>,
    windings: &[Winding],
) -> Result<Option<Measured>, LoadError> {
    let Some(table) = table else {
        return Ok(None);
    };
    let t = table.into_inner();
    let err = |span: std::ops::Range<usize>, key: &str, message: String| {
        LoadError::at(text, path, Some(span), Some(key.to_string()), message)
    };
    let positive = |v: &Option<Spanned<f64>>, key: &str| -> Result<Option<f64>, LoadError> {
        match v {
            Some(x) if !(x.get_ref().is_finite() && *x.get_ref() > 0.0) => Err(err(
                x.span(),
                key,
                format!("must be a number above 0, not {}", x.get_ref()),
            )),
            Some(x) => Ok(Some(*x.get_ref())),
            None => Ok(None),
        }
    };
    if let Some(r) = &t.reading_c {
        let c = *r.get_ref();
        if !(c.is_finite() && c >= READING_C_RANGE.0 && c <= READING_C_RANGE.1) {
            return Err(err(
                r.span(),
                "measured.reading_c",
                format!(
                    "the part's temperature must be between {:.0} and {:.0} C, not {c}",
                    READING_C_RANGE.0, READING_C_RANGE.1
                ),
            ));
        }
    }
    let frequency_khz = positive(&t.frequency_khz, "measured.frequency_khz")?;
    let magnetising_uh = positive(&t.magnetising_uh, "measured.magnetising_uh")?;
    let leakage_uh = positive(&t.leakage_uh, "measured.leakage_uh")?;
    check_inductances(text, path, &t, magnetising_uh, windings)?;

    let dcr_ohm = by_winding(text, path, windings, t.dcr_ohm, "measured.dcr_ohm", false)?;
    let ratio = by_winding(text, path, windings, t.ratio, "measured.ratio", true)?;
    Ok(Some(Measured {
        reading_c: t.reading_c.map(Spanned::into_inner),
        frequency_khz,
        dcr_ohm,
        magnetising_uh,
        leakage_uh,
        ratio,
        hipot: t.hipot,
        note: t.note,
    }))
}

/// The bench inductances against the windings: magnetising needs a primary, leakage a
/// primary and a secondary, and leakage (uH) must read below magnetising (uH).
fn check_inductances(
    text: &str,
    path: Option<&Path>,
    t: &MeasuredTable,
    magnetising_uh: Option<f64>,
    windings: &[Winding],
) -> Result<(), LoadError> {
    let err = |span: std::ops::Range<usize>, key: &str, message: String| {
        LoadError::at(text, path, Some(span), Some(key.to_string()), message)
    };
    let primary = windings.iter().find(|w| w.role == Role::Primary);
    let secondary = windings.iter().find(|w| w.role == Role::Secondary);
    if let (Some(m), None) = (&t.magnetising_uh, primary) {
        return Err(err(
            m.span(),
            "measured.magnetising_uh",
            "is read at the first primary, and the build has no primary winding".into(),
        ));
    }
    if let Some(l) = &t.leakage_uh {
        if primary.is_none() || secondary.is_none() {
            return Err(err(
                l.span(),
                "measured.leakage_uh",
                "is read at the first primary with the first secondary shorted; the build \
                 needs both"
                    .into(),
            ));
        }
        if let Some(m) = magnetising_uh
            && *l.get_ref() >= m
        {
            return Err(err(
                l.span(),
                "measured.leakage_uh",
                format!(
                    "{} uH is not below the magnetising inductance ({m} uH): with the \
                     secondary shorted the primary reads far less; were the two swapped?",
                    l.get_ref()
                ),
            ));
        }
    }
    Ok(())
}

/// A table of one figure per winding (`dcr_ohm`, `ratio`) as (winding, value) in the
/// windings' order; refuses an unknown name, a value not above 0 and, with
/// `refuse_primary`, the first primary itself.
fn by_winding(
    text: &str,
    path: Option<&Path>,
    windings: &[Winding],
    map: Option<Spanned<BTreeMap<String, Spanned<f64>>>>,
    key: &str,
    refuse_primary: bool,
) -> Result<Vec<(Name, f64)>, LoadError> {
    let err = |span: std::ops::Range<usize>, key: &str, message: String| {
        LoadError::at(text, path, Some(span), Some(key.to_string()), message)
    };
    let names = windings
        .iter()
        .map(|w| w.name.to_string())
        .collect::<Vec<_>>()
        .join(", ");
    let primary = windings.iter().find(|w| w.role == Role::Primary);
    let Some(map) = map else {
        return Ok(Vec::new());
    };
    let mut out: Vec<(usize, Name, f64)> = Vec::new();
    for (name, v) in map.into_inner() {
        let place = format!("{key}.{name}");
        let Some(i) = windings.iter().position(|w| *w.name == *name) else {
            return Err(err(
                v.span(),
                &place,
                format!("unknown winding \"{name}\"; the windings are {names}"),
            ));
        };
        if refuse_primary && primary.is_some_and(|p| p.name == windings[i].name) {
            return Err(err(
                v.span(),
                &place,
                format!(
                    "the ratio is a winding's voltage over the first primary's ({name}); \
                     give it for the other windings"
                ),
            ));
        }
        let x = *v.get_ref();
        if !(x.is_finite() && x > 0.0) {
            return Err(err(
                v.span(),
                &place,
                format!("must be a number above 0, not {x}"),
            ));
        }
        out.push((i, windings[i].name.clone(), x));
    }
    out.sort_by_key(|(i, _, _)| *i);
    Ok(out.into_iter().map(|(_, n, x)| (n, x)).collect())
}
