//! The planner's edits of a winding's conductor: change its kind (round wire, foil, litz)
//! and set the keys of a foil or a litz. Plain changes to the model that keep its reading of
//! `wire` (a foil's thickness, a litz's strand; see `model::Conductor`); no figures.

use super::edit::Refusal;
use crate::engine::layout::usable_width_mm;
use crate::engine::resistance::area_mm2;
use crate::library::wires::catalogue;
use crate::model::{Build, Conductor, Foil, Insulation, Litz, WireSize};

/// The kinds in the order the planner cycles them.
pub const KINDS: [&str; 3] = ["round", "foil", "litz"];

/// Strand diameter a winding turned into litz starts with (mm): 0.1 mm, a common litz
/// strand for 100 to 300 kHz (common practice).
pub const LITZ_START_STRAND_MM: f64 = 0.1;

/// Foil thickness a winding turned into foil starts from, when its copper would ask for
/// less (mm).
const FOIL_START_MIN_MM: f64 = 0.05;

/// Copper section of one turn of winding k as it is now (mm^2), from the model's keys.
fn copper_mm2(b: &Build, k: usize) -> f64 {
    let w = &b.windings[k];
    match w.conductor {
        Conductor::Round => {
            let d = crate::library::wires::resolve(&w.wire, w.insulation).bare_mm;
            f64::from(w.strands.max(1)) * area_mm2(d)
        }
        Conductor::Foil(f) => f.thickness_mm * f.width_on(usable_width_mm(b)).max(0.0),
        Conductor::Litz(l) => {
            f64::from(w.strands.max(1)) * f64::from(l.strands) * area_mm2(l.strand_mm)
        }
    }
}

/// Change winding k to conductor `kind` ("round", "foil" or "litz"), keeping its copper
/// section near what it was: a round wire of the catalogue's nearest area (no wider than a
/// quarter of the breadth), a foil as wide as the default across the breadth, rounded to
/// 0.05 mm, or a litz of 0.1 mm strands.
pub fn set_kind(b: &mut Build, k: usize, kind: &str) -> Result<(), Refusal> {
    if k >= b.windings.len() {
        return Err("no winding selected".into());
    }
    let area = copper_mm2(b, k);
    let breadth = usable_width_mm(b);
    let w = &mut b.windings[k];
    match kind {
        "round" => {
            let size = catalogue()
                .into_iter()
                .filter(|r| matches!(r.size, WireSize::Metric { .. }))
                .filter(|r| r.od_mm[1] <= breadth / 4.0)
                .min_by(|a, c| {
                    let da = (area_mm2(a.bare_mm) - area).abs();
                    let dc = (area_mm2(c.bare_mm) - area).abs();
                    da.total_cmp(&dc)
                })
                .map(|r| r.size)
                .ok_or("the breadth is too narrow for any round wire of the catalogue")?;
            w.conductor = Conductor::Round;
            w.wire = size;
            w.strands = 1;
        }
        "foil" => {
            let f = Foil::of(1.0);
            let width = f.width_on(breadth);
            let t = if width > 0.0 { area / width } else { 0.0 };
            let t = ((t / 0.05).round() * 0.05).clamp(FOIL_START_MIN_MM, 0.5);
            let t = (t * 1000.0).round() / 1000.0;
            w.conductor = Conductor::Foil(Foil::of(t));
            w.wire = WireSize::Metric { bare_mm: t };
            w.strands = 1;
            // Foil has no enamel; the interleaf insulates its turns.
            w.insulation = Insulation::Grade2;
        }
        "litz" => {
            let d = LITZ_START_STRAND_MM;
            let n = (area / area_mm2(d)).round().clamp(2.0, 5000.0) as u32;
            w.conductor = Conductor::Litz(Litz::of(n, d));
            w.wire = WireSize::Metric { bare_mm: d };
            w.strands = 1;
        }
        other => {
            return Err(format!(
                "\"{other}\" is not a conductor: round, foil or litz"
            ));
        }
    }
    Ok(())
}

/// The foil of winding k, for a foil edit.
pub fn foil_mut(b: &mut Build, k: usize) -> Result<&mut Foil, Refusal> {
    match b.windings.get_mut(k).map(|w| &mut w.conductor) {
        Some(Conductor::Foil(f)) => Ok(f),
        _ => Err("this winding is not foil".into()),
    }
}

/// The litz of winding k, for a litz edit.
pub fn litz_mut(b: &mut Build, k: usize) -> Result<&mut Litz, Refusal> {
    match b.windings.get_mut(k).map(|w| &mut w.conductor) {
        Some(Conductor::Litz(l)) => Ok(l),
        _ => Err("this winding is not litz".into()),
    }
}

/// Set a foil's thickness (and the `wire` that mirrors it).
pub fn set_foil_mm(b: &mut Build, k: usize, t: f64) -> Result<(), Refusal> {
    foil_mut(b, k)?.thickness_mm = t;
    b.windings[k].wire = WireSize::Metric { bare_mm: t };
    Ok(())
}

/// Set a litz's strand diameter (and the `wire` that mirrors it).
pub fn set_strand_mm(b: &mut Build, k: usize, d: f64) -> Result<(), Refusal> {
    litz_mut(b, k)?.strand_mm = d;
    b.windings[k].wire = WireSize::Metric { bare_mm: d };
    Ok(())
}
