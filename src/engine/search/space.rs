//! The space the search walks: a wire choice per winding times an arrangement of sections,
//! numbered by a mixed radix so that any combination can be built from its index alone.

use super::{Binding, LeastHeight, SearchNote, Series, Settings};
use crate::engine::Evaluation;
use crate::engine::isolation::{Side, side_of};
use crate::engine::layout::{turns_per_layer, usable_width_mm};
use crate::engine::resistance::area_mm2;
use crate::library::wires::{self, AWG_RANGE};
use crate::model::{Build, Name, Role, Section, WindingSection, WireSize};

/// A wire for one winding: size and strands in parallel.
#[derive(Debug, Clone, Copy, PartialEq)]
pub struct WireChoice {
    pub size: WireSize,
    pub strands: u32,
    pub copper_area_mm2: f64,
    pub od_mm: f64,
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

#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub struct Arrangement {
    pub split: Split,
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
                    let rw = wires::resolve(&w.wire, w.insulation);
                    vec![WireChoice {
                        size: w.wire,
                        strands: w.strands,
                        copper_area_mm2: f64::from(w.strands) * area_mm2(rw.bare_mm),
                        od_mm: rw.od_mm,
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
                        });
                    }
                }
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

    /// Combinations in the space.
    pub fn len(&self) -> usize {
        // Saturating: a space too large to count is refused by the caller, never wrapped.
        self.choices
            .iter()
            .map(Vec::len)
            .fold(self.arrangements.len(), usize::saturating_mul)
    }

    /// True where the winding's wire is chosen from the series (false: held as it is).
    pub fn sized(&self) -> &[bool] {
        &self.sized
    }

    pub fn notes(&self) -> Vec<SearchNote> {
        self.notes.clone()
    }

    /// Decode an index into `combo`: the windings' wire choices are the fastest digits, in
    /// winding order, and the arrangement the slowest, so consecutive indices share a stack.
    pub fn decode(&self, mut index: usize, combo: &mut Combo) {
        combo.choice.clear();
        for c in &self.choices {
            combo.choice.push(index % c.len());
            index /= c.len();
        }
        combo.arrangement = index;
    }

    fn in_band(&self, k: usize, c: &WireChoice) -> bool {
        match self.currents[k] {
            Some(i) if self.sized[k] => {
                let j = i / c.copper_area_mm2;
                j >= self.j_band.0 - 1e-12 && j <= self.j_band.1 + 1e-12
            }
            _ => true,
        }
    }

    /// A lower bound on a combination's height: every winding needs at least
    /// ceil(turns / turns per layer) layers of its own wire, and the tape of the arrangement
    /// is known exactly.
    /// Every winding sized from the series runs inside the current-density band.
    pub fn in_band_all(&self, combo: &Combo) -> bool {
        combo
            .choice
            .iter()
            .enumerate()
            .all(|(k, &c)| self.in_band(k, &self.choices[k][c]))
    }

    /// The windings none of whose wire choices falls inside the band.
    pub fn out_of_band_windings(&self) -> Vec<Name> {
        (0..self.choices.len())
            .filter(|&k| !self.choices[k].iter().any(|c| self.in_band(k, c)))
            .map(|k| self.base.windings[k].name.clone())
            .collect()
    }

    /// False when the combination cannot fit, found without evaluating it (see above).
    pub fn may_fit(&self, combo: &Combo, reasons: &mut Reasons) -> bool {
        let w_u = usable_width_mm(self.base);
        let (_, pieces) = &self.arrangements[combo.arrangement];
        let bifilar_partner: Vec<usize> = pieces.iter().filter_map(|p| p.2).collect();
        let mut height = 0.0;
        for (k, &c) in combo.choice.iter().enumerate() {
            if bifilar_partner.contains(&k) {
                continue;
            }
            let ch = &self.choices[k][c];
            let n_l = turns_per_layer(w_u, f64::from(ch.strands) * ch.od_mm);
            if n_l == 0 {
                return false;
            }
            height += f64::from(self.base.windings[k].turns.div_ceil(n_l)) * ch.od_mm;
        }
        height += f64::from(self.tape_wraps(pieces)) * self.base.setup.tape_mm;
        let with_allowance = height * self.base.setup.bulge;
        if reasons.least_bound_mm.is_none_or(|l| with_allowance < l) {
            reasons.least_bound_mm = Some(with_allowance);
        }
        with_allowance <= self.base.bobbin.window.height_mm + 1e-9
    }

    fn tape_wraps(&self, pieces: &[Piece]) -> u32 {
        let sides: Vec<bool> = self
            .order(pieces)
            .iter()
            .map(|&(k, _, _)| primary_side(self.base, k))
            .collect();
        let between: u32 = sides
            .windows(2)
            .map(|w| {
                if w[0] != w[1] {
                    self.iso_wraps
                } else {
                    self.section_wraps
                }
            })
            .sum();
        between + self.outer_wraps
    }

    /// The pieces with the windings held fixed appended outermost.
    fn order(&self, pieces: &[Piece]) -> Vec<Piece> {
        let mut all = pieces.to_vec();
        all.extend(
            self.others
                .iter()
                .map(|&k| (k, self.base.windings[k].turns, None)),
        );
        all
    }

    /// Put a combination's wires on a candidate build.
    pub fn set_wires(&self, b: &mut Build, combo: &Combo) {
        for (k, &c) in combo.choice.iter().enumerate() {
            let ch = &self.choices[k][c];
            b.windings[k].wire = ch.size;
            b.windings[k].strands = ch.strands;
        }
    }

    /// Lay an arrangement's stack on a candidate build.
    pub fn set_stack(&self, b: &mut Build, arrangement: usize) {
        let (_, pieces) = &self.arrangements[arrangement];
        let order = self.order(pieces);
        b.stack.clear();
        for (n, &(k, turns, with)) in order.iter().enumerate() {
            if n > 0 {
                let cross = primary_side(self.base, order[n - 1].0) != primary_side(self.base, k);
                let wraps = if cross {
                    self.iso_wraps
                } else {
                    self.section_wraps
                };
                if wraps > 0 {
                    b.stack.push(Section::Tape { wraps });
                }
            }
            b.stack.push(Section::Winding(WindingSection {
                winding: self.base.windings[k].name.to_string(),
                turns: Some(turns),
                with: with.map(|w| self.base.windings[w].name.to_string()),
                layer_tape: 0,
            }));
        }
        if self.outer_wraps > 0 {
            b.stack.push(Section::Tape {
                wraps: self.outer_wraps,
            });
        }
    }

    /// A short description: "P 2x0.4 mm split around S 3x0.5 mm, R 0.25 mm bifilar with P".
    pub fn describe(&self, combo: &Combo) -> String {
        let name = |k: usize| self.base.windings[k].name.as_str();
        let wire = |k: usize| {
            let ch = &self.choices[k][combo.choice[k]];
            let size = ch.size.to_string();
            if ch.strands > 1 {
                format!("{}x{size}", ch.strands)
            } else {
                size
            }
        };
        let (a, _) = &self.arrangements[combo.arrangement];
        let (p, s) = (self.p, self.s);
        let mut d = match a.split {
            Split::PrimaryFirst => format!("{} {} then {} {}", name(p), wire(p), name(s), wire(s)),
            Split::SecondaryFirst => {
                format!("{} {} then {} {}", name(s), wire(s), name(p), wire(p))
            }
            Split::PrimaryAround => format!(
                "{} {} split around {} {}",
                name(p),
                wire(p),
                name(s),
                wire(s)
            ),
            Split::SecondaryAround => format!(
                "{} {} split around {} {}",
                name(s),
                wire(s),
                name(p),
                wire(p)
            ),
        };
        if let (Some(r), Some(place)) = (self.r, a.reset) {
            let where_ = match place {
                ResetPlace::BifilarWithPrimary => format!("bifilar with {}", name(p)),
                ResetPlace::Inside => "innermost".to_string(),
                ResetPlace::BesidePrimary => format!("just inside {}", name(p)),
                ResetPlace::Outside => "outermost".to_string(),
            };
            d.push_str(&format!(", {} {} {where_}", name(r), wire(r)));
        }
        d
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
    let with = if bifilar { r } else { None };
    let (p1, p2) = (np / 2, np - np / 2);
    let (s1, s2) = (ns / 2, ns - ns / 2);
    let mut pieces: Vec<Piece> = match a.split {
        Split::PrimaryFirst => vec![(p, np, with), (s, ns, None)],
        Split::SecondaryFirst => vec![(s, ns, None), (p, np, with)],
        Split::PrimaryAround => vec![(p, p1, with), (s, ns, None), (p, p2, with)],
        Split::SecondaryAround => vec![(s, s1, None), (p, np, with), (s, s2, None)],
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

/// Counts of why evaluated candidates were turned down, for the "nothing fits" answer.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct Reasons {
    pub too_tall: usize,
    pub out_of_band: usize,
    pub leakage: usize,
    pub temperature: usize,
    pub invalid: usize,
    /// The least height with allowance seen, and the window height.
    pub least_height_mm: Option<(f64, f64)>,
    /// The least lower bound on the height with allowance among in-band combinations.
    pub least_bound_mm: Option<f64>,
    /// Combinations whose wires all run inside the band.
    pub in_band: usize,
    /// Of those, evaluated ones that fit the window.
    pub in_band_fit: usize,
}

impl Reasons {
    /// Does the evaluated candidate meet every constraint? Counts the reason when not.
    pub fn accept(&mut self, eval: &Evaluation, settings: &Settings, sized: &[bool]) -> bool {
        if eval.warnings.iter().any(|w| w.code() == "invalid") {
            self.invalid += 1;
            return false;
        }
        let band = settings.j_min_a_mm2 - 1e-12..=settings.j_max_a_mm2 + 1e-12;
        let outside = eval.windings.iter().zip(sized).any(|(w, &sized)| {
            sized && w.current_density_a_mm2.is_some_and(|j| !band.contains(&j))
        });
        if outside {
            self.out_of_band += 1;
            return false;
        }
        let h = eval.height_with_allowance_mm;
        if self.least_height_mm.is_none_or(|(l, _)| h < l) {
            self.least_height_mm = Some((h, eval.window_height_mm));
        }
        if !eval.fits {
            self.too_tall += 1;
            return false;
        }
        self.in_band_fit += 1;
        if let Some(max) = settings.max_leakage_uh
            && eval.leakage.iter().any(|l| l.uh > max)
        {
            self.leakage += 1;
            return false;
        }
        if let Some(l) = &eval.losses
            && let Some(rise) = l.temperature_rise_c
            && rise > settings.max_rise_c.unwrap_or(l.rise_limit_c)
        {
            self.temperature += 1;
            return false;
        }
        true
    }

    pub fn merge(&mut self, o: &Reasons) {
        self.too_tall += o.too_tall;
        self.out_of_band += o.out_of_band;
        self.leakage += o.leakage;
        self.temperature += o.temperature;
        self.invalid += o.invalid;
        if let Some((h, w)) = o.least_height_mm
            && self.least_height_mm.is_none_or(|(l, _)| h < l)
        {
            self.least_height_mm = Some((h, w));
        }
        if let Some(b) = o.least_bound_mm
            && self.least_bound_mm.is_none_or(|l| b < l)
        {
            self.least_bound_mm = Some(b);
        }
        self.in_band += o.in_band;
        self.in_band_fit += o.in_band_fit;
    }

    /// The constraint that binds when nothing survived. The same answer with or without
    /// pruning: first the band, then the window, then leakage and temperature.
    pub fn binding(
        &self,
        space: usize,
        settings: &Settings,
        window_mm: f64,
        out_of_band: Vec<Name>,
    ) -> Binding {
        let (j_min_a_mm2, j_max_a_mm2) = (settings.j_min_a_mm2, settings.j_max_a_mm2);
        if space == 0 {
            return Binding::EmptySpace;
        }
        if self.in_band == 0 {
            return Binding::CurrentBand {
                j_min_a_mm2,
                j_max_a_mm2,
                windings: out_of_band,
            };
        }
        if self.in_band_fit == 0 {
            let least = match (self.least_height_mm, self.least_bound_mm) {
                (Some((height_mm, window_mm)), _) => Some(LeastHeight::Evaluated {
                    height_mm,
                    window_mm,
                }),
                (None, Some(height_mm)) => Some(LeastHeight::Bound {
                    height_mm,
                    window_mm,
                }),
                _ => None,
            };
            return Binding::WindowHeight {
                j_min_a_mm2,
                j_max_a_mm2,
                in_band: self.in_band,
                least,
            };
        }
        if self.temperature >= self.leakage {
            Binding::TemperatureRise
        } else {
            Binding::Leakage
        }
    }
}
