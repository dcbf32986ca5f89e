//! The wire choices the search tries for each winding: sizes of the series with strands in
//! parallel, foil and litz where they suit, or the winding's own wire where none is chosen.

use super::WireChoice;
use crate::engine::conductor;
use crate::engine::layout::usable_width_mm;
use crate::engine::resistance::area_mm2;
use crate::engine::search::{SearchNote, Series, Settings};
use crate::library::wires::{self, AWG_RANGE};
use crate::model::{Build, Conductor, Role, Winding, WireSize};

/// The wire choices of every winding, and which of them are chosen from the series (false:
/// held as they are). A winding the search leaves (`others`), one without a current and one
/// no wire suits keeps its own wire; the last two leave a note in `notes`.
pub(super) fn wire_choices(
    base: &Build,
    settings: &Settings,
    others: &[usize],
    currents: &[Option<f64>],
    notes: &mut Vec<SearchNote>,
) -> (Vec<Vec<WireChoice>>, Vec<bool>) {
    let w_u = usable_width_mm(base);
    let sizes = series_sizes(settings.series);
    let mut sized = vec![false; base.windings.len()];
    let choices: Vec<Vec<WireChoice>> = base
        .windings
        .iter()
        .enumerate()
        .map(|(k, w)| {
            if others.contains(&k) {
                return own_choice(w, w_u);
            }
            let Some(i) = currents[k].filter(|&i| i > 0.0) else {
                notes.push(SearchNote::NoCurrent {
                    winding: w.name.clone(),
                });
                return own_choice(w, w_u);
            };
            let out = sized_choices(base, settings, &sizes, k, i, w_u);
            if out.is_empty() {
                notes.push(SearchNote::NoWireSuits {
                    winding: w.name.clone(),
                    current_a: i,
                });
                return own_choice(w, w_u);
            }
            sized[k] = true;
            out
        })
        .collect();
    (choices, sized)
}

/// The winding's own wire as the one choice it has, on a usable width `w_u`.
fn own_choice(w: &Winding, w_u: f64) -> Vec<WireChoice> {
    let rw = conductor::resolve(w);
    vec![WireChoice {
        size: w.wire,
        strands: w.strands,
        copper_area_mm2: conductor::copper_area_mm2(w, &rw, w_u),
        od_mm: rw.od_mm,
        conductor: w.conductor,
    }]
}

/// The choices for winding `k` carrying `i` A RMS on a usable width `w_u`: round wire of
/// `sizes` with strands in parallel, then foil and litz, each with its current density in a
/// range around the band.
fn sized_choices(
    base: &Build,
    settings: &Settings,
    sizes: &[WireSize],
    k: usize,
    i: f64,
    w_u: f64,
) -> Vec<WireChoice> {
    let w = &base.windings[k];
    // A range around the band: the brute-force search sees these too, and the
    // band itself is a constraint (pruned before evaluation when pruning is on).
    let (lo, hi) = (settings.j_min_a_mm2 / 2.0, settings.j_max_a_mm2 * 2.0);
    let mut out = Vec::new();
    for size in sizes {
        let rw = wires::resolve(size, w.insulation);
        if rw.bare_mm + 1e-9 < settings.min_wire_mm {
            continue;
        }
        let most = if rw.bare_mm + 1e-9 >= settings.min_strand_mm {
            settings.max_strands.max(1)
        } else {
            1
        };
        for strands in 1..=most {
            let a = f64::from(strands) * area_mm2(rw.bare_mm);
            let j = i / a;
            // More strands only lower the density and widen the turn: past
            // the band's low end or the usable width, no more strands will do.
            if j < lo || f64::from(strands) * rw.od_mm > w_u {
                break;
            }
            if j > hi {
                continue;
            }
            out.push(WireChoice {
                size: *size,
                strands,
                copper_area_mm2: a,
                od_mm: rw.od_mm,
                conductor: Conductor::Round,
            });
        }
    }
    out.extend(conductor_choices(base, k, i, (lo, hi)));
    out
}

/// Foil is proposed for a secondary of at least this RMS current (common practice: below
/// it round wire or a few strands wind as well)...
pub const FOIL_FROM_A: f64 = 5.0;
/// ...and of at most this many turns (one turn a layer stacks up fast).
pub const FOIL_MOST_TURNS: u32 = 12;
/// Litz is proposed at and above this switching frequency (common practice: below it a few
/// round strands under two skin depths do as well).
pub const LITZ_FROM_KHZ: f64 = 200.0;

/// The foil and litz choices for winding `k` carrying `i` A RMS, with their current density
/// within `(lo, hi)`: foil of the table's thicknesses (default width and interleaf) for a
/// high-current secondary of few turns in a build without basic or reinforced isolation, litz of the table's constructions at high frequency.
fn conductor_choices(base: &Build, k: usize, i: f64, (lo, hi): (f64, f64)) -> Vec<WireChoice> {
    use crate::library::conductors::{FOIL_THICKNESSES_MM, LITZ_CONSTRUCTIONS};
    use crate::model::{Foil, Litz};
    let w = &base.windings[k];
    let w_u = usable_width_mm(base);
    let mut candidates = Vec::new();
    // Not where the build declares protection against shock: a foil's cut edges against
    // the margin tape and the isolation need a judgement the search cannot make.
    let shock = base
        .isolation
        .as_ref()
        .is_some_and(|iso| iso.class != crate::model::IsolationClass::Functional);
    if w.role == Role::Secondary && i >= FOIL_FROM_A && w.turns <= FOIL_MOST_TURNS && !shock {
        candidates.extend(FOIL_THICKNESSES_MM.map(|t| Conductor::Foil(Foil::of(t))));
    }
    if base.setup.frequency_khz.is_some_and(|f| f >= LITZ_FROM_KHZ) {
        candidates
            .extend(LITZ_CONSTRUCTIONS.map(|c| Conductor::Litz(Litz::of(c.strands, c.strand_mm))));
    }
    candidates
        .into_iter()
        .filter_map(|conductor| {
            let mut trial = w.clone();
            trial.conductor = conductor;
            trial.strands = 1;
            trial.wire = WireSize::Metric {
                bare_mm: match conductor {
                    Conductor::Foil(f) => f.thickness_mm,
                    Conductor::Litz(l) => l.strand_mm,
                    Conductor::Round => return None,
                },
            };
            let rw = conductor::resolve(&trial);
            let a = conductor::copper_area_mm2(&trial, &rw, w_u);
            let j = i / a;
            (a > 0.0 && j >= lo && j <= hi).then_some(WireChoice {
                size: trial.wire,
                strands: 1,
                copper_area_mm2: a,
                od_mm: rw.od_mm,
                conductor,
            })
        })
        .collect()
}

/// Every size of a wire series, in the order the library lists them.
fn series_sizes(series: Series) -> Vec<WireSize> {
    match series {
        Series::Metric => wires::metric_rows()
            .iter()
            .map(|r| WireSize::Metric {
                bare_mm: r.nominal_mm,
            })
            .collect(),
        Series::Awg => AWG_RANGE.map(WireSize::Awg).collect(),
    }
}
