//! The space the search walks: a wire choice per winding times an arrangement of sections,
//! numbered by a mixed radix so that any combination can be built from its index alone.

use super::{Binding, LeastHeight, SearchNote, Series, Settings};
use crate::engine::Evaluation;
use crate::engine::conductor;
use crate::engine::isolation::{Side, side_of};
use crate::engine::layout::{turns_per_layer, usable_width_mm};
use crate::engine::resistance::area_mm2;
use crate::library::wires::{self, AWG_RANGE};
use crate::model::{Build, Conductor, Name, Role, Section, WindingSection, WireSize};

mod reasons;
mod walk;

pub use reasons::Reasons;

/// A wire for one winding: size and strands in parallel.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct WireChoice {
    /// The wire size.
    pub size: WireSize,
    /// Strands in parallel.
    pub strands: u32,
    /// Copper area of all the strands together (mm2).
    pub copper_area_mm2: f64,
    /// Overall diameter of one strand (mm).
    pub od_mm: f64,
    /// Round wire, or a foil or litz the search proposes (see `conductor_choices`).
    pub conductor: Conductor,
}

impl WireChoice {
    /// Width one turn takes on a breadth `w_u`: the breadth for foil, `strands x od` else.
    pub fn pitch_mm(&self, w_u: f64) -> f64 {
        match self.conductor {
            Conductor::Foil(_) => w_u,
            _ => f64::from(self.strands) * self.od_mm,
        }
    }
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

/// How the primary and secondary are ordered and split.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Split {
    /// Primary, then secondary.
    PrimaryFirst,
    /// Secondary, then primary.
    SecondaryFirst,
    /// Half the primary, the secondary, the other half.
    PrimaryAround,
    /// Half the secondary, the primary, the other half.
    SecondaryAround,
}

/// Where the reset winding goes.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum ResetPlace {
    /// Bifilar with every primary section (needs as many reset turns as primary turns).
    BifilarWithPrimary,
    /// Its own section, innermost.
    Inside,
    /// Its own section, just before the first primary section.
    BesidePrimary,
    /// Its own section, outermost of the main windings.
    Outside,
}

/// The order of the sections: the primary-secondary split and the reset's place.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Arrangement {
    /// How the primary and secondary are ordered and split.
    pub split: Split,
    /// Where the reset winding goes (`None` without one).
    pub reset: Option<ResetPlace>,
}

/// One winding section of a planned stack: (winding index, turns, bifilar partner).
type Piece = (usize, u32, Option<usize>);

pub struct Space<'a> {
    base: &'a Build,
    p: usize,
    s: usize,
    r: Option<usize>,
    /// Windings the search leaves as they are, wound outermost in file order.
    others: Vec<usize>,
    choices: Vec<Vec<WireChoice>>,
    arrangements: Vec<(Arrangement, Vec<Piece>)>,
    iso_wraps: u32,
    section_wraps: u32,
    outer_wraps: u32,
    notes: Vec<SearchNote>,
    currents: Vec<Option<f64>>,
    /// True where the winding's wire is chosen from the series (false: held as it is).
    sized: Vec<bool>,
    j_band: (f64, f64),
}

/// An index decoded: the arrangement and one choice per winding.
#[derive(Debug, Clone, Default, PartialEq, Eq)]
pub struct Combo {
    pub arrangement: usize,
    pub choice: Vec<usize>,
}

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

/// Which side of the isolation a winding sits on, as the isolation checks see it.
fn primary_side(build: &Build, k: usize) -> bool {
    side_of(build, build.windings[k].role) == Side::Primary
}

impl<'a> Space<'a> {
    pub fn new(base: &'a Build, settings: &Settings) -> Self {
        let p = base
            .windings
            .iter()
            .position(|w| w.role == Role::Primary)
            .unwrap_or(0);
        let s = base
            .windings
            .iter()
            .position(|w| w.role == Role::Secondary)
            .unwrap_or(0);
        let r = base.windings.iter().position(|w| w.role == Role::Reset);
        let others: Vec<usize> = (0..base.windings.len())
            .filter(|&k| k != p && k != s && Some(k) != r)
            .collect();
        let mut notes = Vec::new();
        let w_u = usable_width_mm(base);
        let currents = super::winding_currents(&crate::engine::evaluate(base));

        let sizes = series_sizes(settings.series);
        let mut sized = vec![false; base.windings.len()];
        let choices: Vec<Vec<WireChoice>> = base
            .windings
            .iter()
            .enumerate()
            .map(|(k, w)| {
                let own = || {
                    let rw = conductor::resolve(w);
                    vec![WireChoice {
                        size: w.wire,
                        strands: w.strands,
                        copper_area_mm2: conductor::copper_area_mm2(w, &rw, w_u),
                        od_mm: rw.od_mm,
                        conductor: w.conductor,
                    }]
                };
                if others.contains(&k) {
                    return own();
                }
                let Some(i) = currents[k].filter(|&i| i > 0.0) else {
                    notes.push(SearchNote::NoCurrent {
                        winding: w.name.clone(),
                    });
                    return own();
                };
                // A range around the band: the brute-force search sees these too, and the
                // band itself is a constraint (pruned before evaluation when pruning is on).
                let (lo, hi) = (settings.j_min_a_mm2 / 2.0, settings.j_max_a_mm2 * 2.0);
                let mut out = Vec::new();
                for size in &sizes {
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
                if out.is_empty() {
                    notes.push(SearchNote::NoWireSuits {
                        winding: w.name.clone(),
                        current_a: i,
                    });
                    return own();
                }
                sized[k] = true;
                out
            })
            .collect();

        let iso_wraps = settings
            .isolation_wraps
            .unwrap_or_else(|| isolation_wraps_of(base))
            .max(1);
        let outer_wraps = match base.stack.last() {
            Some(Section::Tape { wraps }) => *wraps,
            _ => 0,
        };
        let np = base.windings[p].turns;
        let mut arrangements: Vec<(Arrangement, Vec<Piece>)> = Vec::new();
        let resets: Vec<Option<ResetPlace>> = match r {
            None => vec![None],
            Some(r) => {
                let mut v = vec![
                    Some(ResetPlace::Inside),
                    Some(ResetPlace::BesidePrimary),
                    Some(ResetPlace::Outside),
                ];
                if base.windings[r].turns == np {
                    v.insert(0, Some(ResetPlace::BifilarWithPrimary));
                } else {
                    notes.push(SearchNote::ResetTurnsDiffer);
                }
                v
            }
        };
        for split in [
            Split::PrimaryFirst,
            Split::SecondaryFirst,
            Split::PrimaryAround,
            Split::SecondaryAround,
        ] {
            let needs_two = |n: u32| n >= 2;
            if split == Split::PrimaryAround && !needs_two(np)
                || split == Split::SecondaryAround && !needs_two(base.windings[s].turns)
            {
                continue;
            }
            for reset in &resets {
                let arrangement = Arrangement {
                    split,
                    reset: *reset,
                };
                let pieces = pieces_of(base, p, s, r, arrangement);
                if !arrangements.iter().any(|(_, q)| *q == pieces) {
                    arrangements.push((arrangement, pieces));
                }
            }
        }
        Space {
            base,
            p,
            s,
            r,
            others,
            choices,
            arrangements,
            iso_wraps,
            section_wraps: settings.section_wraps,
            outer_wraps,
            notes,
            currents,
            sized,
            j_band: (settings.j_min_a_mm2, settings.j_max_a_mm2),
        }
    }
}

/// The most tape wraps the build has between a primary-side and a secondary-side section.
fn isolation_wraps_of(build: &Build) -> u32 {
    let mut best = 0;
    let mut last_side: Option<bool> = None;
    let mut wraps_since = 0;
    for s in &build.stack {
        match s {
            Section::Tape { wraps } => wraps_since += wraps,
            Section::Winding(ws) => {
                let side = build
                    .winding_index(&ws.winding)
                    .map(|k| primary_side(build, k));
                if let (Some(a), Some(b)) = (last_side, side)
                    && a != b
                {
                    best = best.max(wraps_since);
                }
                last_side = side.or(last_side);
                wraps_since = 0;
            }
        }
    }
    best
}

fn pieces_of(build: &Build, p: usize, s: usize, r: Option<usize>, a: Arrangement) -> Vec<Piece> {
    let np = build.windings[p].turns;
    let ns = build.windings[s].turns;
    let bifilar = a.reset == Some(ResetPlace::BifilarWithPrimary);
    let partner = if bifilar { r } else { None };
    let (p1, p2) = (np / 2, np - np / 2);
    let (s1, s2) = (ns / 2, ns - ns / 2);
    let mut pieces: Vec<Piece> = match a.split {
        Split::PrimaryFirst => vec![(p, np, partner), (s, ns, None)],
        Split::SecondaryFirst => vec![(s, ns, None), (p, np, partner)],
        Split::PrimaryAround => vec![(p, p1, partner), (s, ns, None), (p, p2, partner)],
        Split::SecondaryAround => vec![(s, s1, None), (p, np, partner), (s, s2, None)],
    };
    if let (Some(r), Some(place)) = (r, a.reset) {
        let nr = build.windings[r].turns;
        match place {
            ResetPlace::BifilarWithPrimary => {}
            ResetPlace::Inside => pieces.insert(0, (r, nr, None)),
            ResetPlace::BesidePrimary => {
                let at = pieces.iter().position(|q| q.0 == p).unwrap_or(0);
                pieces.insert(at, (r, nr, None));
            }
            ResetPlace::Outside => pieces.push((r, nr, None)),
        }
    }
    pieces
}
