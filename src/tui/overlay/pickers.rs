//! The planner's pick lists as they open: bobbins (plain, or ranked by fit), wires, the
//! section to split around, the bifilar partner, the section to add and the bundled ferrite.

use super::{Overlay, PickItem, PickPurpose, PickValue, Picker};
use crate::files::BobbinOrigin;
use crate::library::materials::FERRITES;
use crate::library::wires::catalogue;
use crate::model::{Bobbin, BobbinSource, Section};
use crate::tui::app::App;

impl App {
    fn push_picker(&mut self, p: Picker) {
        self.ui.overlays.push(Overlay::Picker(p));
    }

    /// The readable bobbins of the library the loop read: id, where from, the bobbin.
    fn readable(&self) -> impl Iterator<Item = (&str, &BobbinOrigin, &Bobbin)> {
        self.library
            .iter()
            .filter_map(|e| Some((e.id.as_str(), &e.origin, e.bobbin.as_ref().ok()?)))
    }

    /// The current bobbin's id, `None` for a measured (inline) one.
    fn bobbin_id(&self) -> Option<String> {
        match &self.doc.build.bobbin_source {
            BobbinSource::Id(id) => Some(id.clone()),
            BobbinSource::Inline => None,
        }
    }

    /// A list of bobbins: ranked by fit to change the build's, plain for a new build.
    pub(crate) fn open_bobbin_picker(&mut self, purpose: PickPurpose) {
        if purpose == PickPurpose::Bobbin {
            self.open_ranked_bobbin_picker();
            return;
        }
        let items: Vec<PickItem> = self
            .readable()
            .map(|(id, origin, b)| PickItem {
                label: format!(
                    "{:<10} {:>5.2} x {:<5.2} {:<9} {}",
                    id,
                    b.window.width_mm,
                    b.window.height_mm,
                    origin.label(),
                    b.name
                ),
                value: PickValue::Bobbin {
                    id: id.to_string(),
                    bobbin: Box::new(b.clone()),
                },
            })
            .collect();
        let selected = match self.bobbin_id() {
            Some(id) => items
                .iter()
                .position(|it| it.value.bobbin_id() == Some(id.as_str()))
                .unwrap_or(0),
            None => items.len().saturating_sub(1),
        };
        let header = format!(
            "{:<10} {:>5} x {:<5} {:<9} name",
            "id", "width", "height", "from"
        );
        let title = "start a new build on which bobbin?";
        self.push_picker(Picker::new(title, header, purpose, items, selected));
    }

    /// The library ranked by how this build's windings and stack fit each bobbin
    /// (`report::fit::rank`), the current bobbin marked, a measured one last.
    fn open_ranked_bobbin_picker(&mut self) {
        let bobbins: Vec<(String, Bobbin)> = self
            .readable()
            .map(|(id, _, b)| (id.to_string(), b.clone()))
            .collect();
        let current = self.bobbin_id();
        let mut items: Vec<PickItem> = crate::report::fit::rank(&self.doc.build, &bobbins)
            .into_iter()
            .filter_map(|r| {
                let bobbin = bobbins.iter().find(|(id, _)| *id == r.bobbin)?.1.clone();
                let mark = if current.as_deref() == Some(r.bobbin.as_str()) {
                    '*'
                } else {
                    ' '
                };
                let (fits, spare) = match (r.fits, r.valid) {
                    (true, _) => ("yes", format!("{:>6.2}", r.spare_height_mm)),
                    (false, true) => ("no", format!("{:>6.2}", r.spare_height_mm)),
                    (false, false) => ("no", format!("{:>6}", "-")),
                };
                let why = r.reasons.first().cloned().unwrap_or(r.name);
                Some(PickItem {
                    label: format!(
                        "{mark}{:<10} {fits:<4} {spare} {:>5.2}  {why}",
                        r.bobbin, r.fill_factor
                    ),
                    value: PickValue::Bobbin {
                        id: r.bobbin,
                        bobbin: Box::new(bobbin),
                    },
                })
            })
            .collect();
        items.push(PickItem {
            label: " measured: type your own bobbin's figures".into(),
            value: PickValue::MeasuredBobbin,
        });
        let selected = match &current {
            Some(id) => items
                .iter()
                .position(|it| it.value.bobbin_id() == Some(id.as_str()))
                .unwrap_or(0),
            None => items.len() - 1,
        };
        let header = format!(
            " {:<10} {:<4} {:>6} {:>5}  why not, or name",
            "id", "fits", "spare", "fill"
        );
        let title = "bobbin: fitting first, most spare first (* now)";
        self.push_picker(Picker::new(
            title,
            header,
            PickPurpose::Bobbin,
            items,
            selected,
        ));
    }

    /// The wire catalogue for winding k, its wire selected, a measured wire last.
    pub(crate) fn open_wire_picker(&mut self, k: usize) {
        let Some(w) = self.doc.build.windings.get(k) else {
            return;
        };
        let current = w.wire;
        let mut items: Vec<PickItem> = catalogue()
            .into_iter()
            .map(|r| PickItem {
                label: format!(
                    "{:<8} {:>6.3}  {:>6.3} {:>6.3} {:>6.3} {:>6.3}  {:>8.4}",
                    r.size.key().unwrap_or_default(),
                    r.bare_mm,
                    r.od_mm[0],
                    r.od_mm[1],
                    r.od_mm[2],
                    r.od_mm[3],
                    crate::engine::resistance::ohm_per_m(r.bare_mm, 1, 20.0)
                ),
                value: PickValue::Wire(r.size),
            })
            .collect();
        items.push(PickItem {
            label: "measured: type the bare and overall diameters".into(),
            value: PickValue::MeasuredWire,
        });
        let selected = items
            .iter()
            .position(|it| it.value == PickValue::Wire(current))
            .unwrap_or(items.len() - 1);
        let title = format!("wire for {} (now {}; type to filter)", w.name, w.wire);
        let header = format!(
            "{:<8} {:>6}  {:>6} {:>6} {:>6} {:>6}  {:>8}",
            "wire", "bare", "od g1", "od g2", "od g3", "od TIW", "ohm/m 20C"
        );
        self.push_picker(Picker::new(
            title,
            header,
            PickPurpose::Wire(k),
            items,
            selected,
        ));
    }

    /// The sections of other windings the selected one can be split around, nearest first.
    pub(crate) fn open_split_picker(&mut self) {
        let x = self.ui.stack_sel;
        let b = &self.doc.build;
        let Some(Section::Winding(me)) = b.stack.get(x).cloned() else {
            self.refuse("select a winding section to split");
            return;
        };
        let turns = b.section_turns();
        let mut cands: Vec<usize> = (0..b.stack.len())
            .filter(|&j| match &b.stack[j] {
                Section::Winding(o) => {
                    o.winding != me.winding && Some(&o.winding) != me.partner.as_ref()
                }
                _ => false,
            })
            .collect();
        if cands.is_empty() {
            self.refuse("there is no section of another winding to split around");
            return;
        }
        cands.sort_by_key(|&j| (j.abs_diff(x), j));
        let items = cands
            .iter()
            .map(|&j| PickItem {
                label: format!("{} ({} turns)", self.section_name(j), turns[j]),
                value: PickValue::Section(j),
            })
            .collect();
        let title = format!(
            "split {} into halves around which section?",
            self.section_name(x)
        );
        let purpose = PickPurpose::SplitAround(x);
        self.push_picker(Picker::new(title, "nearest first", purpose, items, 0));
    }

    /// The windings the selected section can be wound bifilar with, or alone.
    pub(crate) fn open_partner_picker(&mut self) {
        let i = self.ui.stack_sel;
        let Some(Section::Winding(me)) = self.doc.build.stack.get(i).cloned() else {
            self.refuse("select a winding section to wind bifilar");
            return;
        };
        let mut items = vec![PickItem {
            label: format!("{} alone (no bifilar partner)", me.winding),
            value: PickValue::Partner(None),
        }];
        for w in self
            .doc
            .build
            .windings
            .iter()
            .filter(|w| w.name != me.winding)
        {
            items.push(PickItem {
                label: format!(
                    "{} with {} ({}, {}, {} turns)",
                    me.winding,
                    w.name,
                    w.role.key(),
                    w.wire,
                    w.turns
                ),
                value: PickValue::Partner(Some(w.name.to_string())),
            });
        }
        let selected = items
            .iter()
            .position(|it| it.value == PickValue::Partner(me.partner.clone()))
            .unwrap_or(0);
        let title = format!("wind section {} bifilar with", self.section_name(i));
        let header = "the partner's turns come from its own sections";
        self.push_picker(Picker::new(
            title,
            header,
            PickPurpose::Partner(i),
            items,
            selected,
        ));
    }

    /// What can be added above the selected section: tape, or a share of a winding.
    pub(crate) fn open_add_picker(&mut self) {
        let at = (self.ui.stack_sel + 1).min(self.doc.build.stack.len());
        let mut items = vec![PickItem {
            label: "tape, 1 wrap".into(),
            value: PickValue::AddTape,
        }];
        for w in &self.doc.build.windings {
            items.push(PickItem {
                label: format!("a share of {} (half of its outermost section)", w.name),
                value: PickValue::AddShare(w.name.to_string()),
            });
        }
        let title = "add a section above the selected one";
        self.push_picker(Picker::new(
            title,
            "",
            PickPurpose::AddSection(at),
            items,
            0,
        ));
    }

    /// The bundled ferrites, the material's selected, own figures last.
    pub(crate) fn open_ferrite_picker(&mut self) {
        let now = self
            .doc
            .build
            .material
            .as_ref()
            .and_then(|m| m.ferrite.clone());
        let mut items: Vec<PickItem> = FERRITES
            .iter()
            .map(|g| PickItem {
                label: format!(
                    "{:<16} {:>4} {:>4} {:>5}  {}",
                    g.id, g.bsat_mt, g.br_mt, g.mu_i, g.description
                ),
                value: PickValue::Ferrite(Some(g.id.to_string())),
            })
            .collect();
        items.push(PickItem {
            label: "own figures: keep the values, no grade".into(),
            value: PickValue::Ferrite(None),
        });
        let selected = items
            .iter()
            .position(|it| it.value == PickValue::Ferrite(now.clone()))
            .unwrap_or(0);
        let title = "ferrite grade (typical figures, from memory)";
        let header = format!(
            "{:<16} {:>4} {:>4} {:>5}  about",
            "grade", "Bsat", "Br", "mu_i"
        );
        self.push_picker(Picker::new(
            title,
            header,
            PickPurpose::Ferrite,
            items,
            selected,
        ));
    }
}
