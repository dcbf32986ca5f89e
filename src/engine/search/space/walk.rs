//! Walking the space: decoding an index, the quick fit test, and building the candidate.

use super::*;

impl<'a> Space<'a> {
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

    /// False when the combination cannot fit, found without evaluating it, from a lower bound
    /// on its height: every winding needs at least ceil(turns / turns per layer) layers of
    /// its own wire, and the tape between the arrangement's sections is known exactly (the
    /// tape between layers, which only adds height, is left out).
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
            let n_l = turns_per_layer(w_u, ch.pitch_mm(w_u));
            if n_l == 0 {
                return false;
            }
            height += f64::from(self.base.windings[k].turns.div_ceil(n_l)) * ch.od_mm;
        }
        height += f64::from(self.tape_wraps(pieces)) * self.base.setup.tape_mm;
        let with_allowance = height * self.base.setup.allowance_factor;
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
            b.windings[k].conductor = ch.conductor;
        }
    }

    /// Lay an arrangement's stack on a candidate build.
    pub fn set_stack(&self, b: &mut Build, arrangement: usize) {
        let (_, pieces) = &self.arrangements[arrangement];
        let order = self.order(pieces);
        b.stack.clear();
        for (n, &(k, turns, partner)) in order.iter().enumerate() {
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
                partner: partner.map(|w| self.base.windings[w].name.to_string()),
                layer_tape: partner.map_or(self.layer_tape[k], |w| {
                    self.layer_tape[k].max(self.layer_tape[w])
                }),
                spread: false,
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
            let size = match ch.conductor {
                Conductor::Round => ch.size.to_string(),
                Conductor::Foil(f) => format!("foil {} mm", crate::model::trim_mm(f.thickness_mm)),
                Conductor::Litz(l) => {
                    format!("litz {}x{}", l.strands, crate::model::trim_mm(l.strand_mm))
                }
            };
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
