//! The space the search walks: a wire choice per winding times an arrangement of sections,
//! numbered by a mixed radix so that any combination can be built from its index alone.

use super::{Binding, LeastHeight, SearchNote, Settings};
use crate::engine::Evaluation;
use crate::engine::isolation::{Side, side_of};
use crate::engine::layout::{turns_per_layer, usable_width_mm};
use crate::model::{Build, Conductor, Name, Role, Section, WindingSection, WireSize};

mod choices;
mod reasons;
mod walk;

use choices::wire_choices;
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
    /// Round wire, or a foil or litz the search proposes (see `choices::conductor_choices`).
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
    /// Per winding: the tape between layers the build gives it (the most of its sections),
    /// kept in every candidate's sections of it.
    layer_tape: Vec<u32>,
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
        let currents = super::winding_currents(&crate::engine::evaluate(base));
        let (choices, sized) = wire_choices(base, settings, &others, &currents, &mut notes);

        let iso_wraps = settings
            .isolation_wraps
            .unwrap_or_else(|| isolation_wraps_of(base))
            .max(1);
        let outer_wraps = match base.stack.last() {
            Some(Section::Tape { wraps }) => *wraps,
            _ => 0,
        };
        let arrangements = arrangements_of(base, p, s, r, &mut notes);
        let mut layer_tape = vec![0u32; base.windings.len()];
        for sec in &base.stack {
            if let Section::Winding(ws) = sec {
                for name in std::iter::once(&ws.winding).chain(&ws.partner) {
                    if let Some(k) = base.winding_index(name) {
                        layer_tape[k] = layer_tape[k].max(ws.layer_tape);
                    }
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
            layer_tape,
            notes,
            currents,
            sized,
            j_band: (settings.j_min_a_mm2, settings.j_max_a_mm2),
        }
    }
}

/// The places the reset winding `r` is tried in (`[None]` without one): bifilar with the
/// primary only where it has the primary's `np` turns, else with a note saying so.
fn reset_places(
    base: &Build,
    r: Option<usize>,
    np: u32,
    notes: &mut Vec<SearchNote>,
) -> Vec<Option<ResetPlace>> {
    match r {
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
    }
}

/// Every arrangement of primary `p`, secondary `s` and reset `r` with its sections, of those
/// giving the same sections only the first: a split around a winding needs two turns of it.
fn arrangements_of(
    base: &Build,
    p: usize,
    s: usize,
    r: Option<usize>,
    notes: &mut Vec<SearchNote>,
) -> Vec<(Arrangement, Vec<Piece>)> {
    let np = base.windings[p].turns;
    let mut arrangements: Vec<(Arrangement, Vec<Piece>)> = Vec::new();
    let resets = reset_places(base, r, np, notes);
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
    arrangements
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
