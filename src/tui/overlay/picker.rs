//! A pick list: items with a typed filter; Enter hands the chosen item's value to what the
//! list was opened for. Each item carries what choosing it takes (a bobbin carries the
//! bobbin read from its folder, a candidate its build), so choosing needs no second lookup.

use super::Overlay;
use crate::engine::search::Candidate;
use crate::model::{Bobbin, BobbinSource, WireSize, trim_mm};
use crate::tui::action::Action;
use crate::tui::app::App;
use crate::tui::edit;
use crate::tui::fields::FormKind;
use crate::tui::overlay::PromptPurpose;

/// What an item stands for.
#[derive(Debug, Clone, PartialEq)]
pub enum PickValue {
    /// A wire of the catalogue.
    Wire(WireSize),
    /// Type a measured wire's diameters.
    MeasuredWire,
    /// A bobbin of the library the list was made from (bundled, the user's, or beside the
    /// build), carried whole.
    Bobbin { id: String, bobbin: Box<Bobbin> },
    /// Type a measured bobbin's figures.
    MeasuredBobbin,
    /// A section, by index into the stack.
    Section(usize),
    /// A bifilar partner, or none.
    Partner(Option<String>),
    /// Add a section of tape.
    AddTape,
    /// Add a share of the named winding.
    AddShare(String),
    /// The search's candidate `n` (counted from 0), carried whole.
    Candidate { n: usize, candidate: Box<Candidate> },
    /// A bundled ferrite, or `None` for the user's own figures.
    Ferrite(Option<String>),
    /// Start a new build on a bobbin of the library.
    NewFromBobbin,
    /// Start a new build from requirements (the form, then the designs).
    NewFromRequirements,
    /// The design `n` (counted from 0) of the ranked list, carried whole.
    Design {
        n: usize,
        design: Box<crate::engine::design::Design>,
    },
}

impl PickValue {
    /// The id of a bobbin item, `None` for any other item.
    pub fn bobbin_id(&self) -> Option<&str> {
        match self {
            PickValue::Bobbin { id, .. } => Some(id),
            _ => None,
        }
    }
}

/// What a list was opened for.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum PickPurpose {
    /// The wire of winding k.
    Wire(usize),
    /// The build's bobbin.
    Bobbin,
    /// The bobbin of a new build.
    NewBuild,
    /// Split section x around the chosen one.
    SplitAround(usize),
    /// The bifilar partner of section i.
    Partner(usize),
    /// Add a section at this index.
    AddSection(usize),
    /// Take a search candidate.
    Search,
    /// The core's bundled ferrite.
    Ferrite,
    /// How to start a new build.
    NewStart,
    /// Open one of the designs from requirements.
    Design,
}

/// One line of a list.
#[derive(Debug, Clone, PartialEq)]
pub struct PickItem {
    /// The line shown (and filtered on).
    pub label: String,
    /// What choosing it takes.
    pub value: PickValue,
}

/// A pick list.
#[derive(Debug, Clone, PartialEq)]
pub struct Picker {
    /// The frame's title.
    pub title: String,
    /// The column headings over the items.
    pub header: String,
    /// What the list was opened for.
    pub purpose: PickPurpose,
    /// Every item, filtered or not.
    pub items: Vec<PickItem>,
    /// Index into `visible()`.
    pub selected: usize,
    /// The filter typed so far.
    pub filter: String,
}

impl Picker {
    /// A list with the given selection and no filter.
    pub fn new(
        title: impl Into<String>,
        header: impl Into<String>,
        purpose: PickPurpose,
        items: Vec<PickItem>,
        selected: usize,
    ) -> Self {
        Picker {
            title: title.into(),
            header: header.into(),
            purpose,
            items,
            selected,
            filter: String::new(),
        }
    }

    /// Items that match the typed filter (case-insensitive, anywhere in the label).
    pub fn visible(&self) -> Vec<&PickItem> {
        let f = self.filter.to_lowercase();
        self.items
            .iter()
            .filter(|it| f.is_empty() || it.label.to_lowercase().contains(&f))
            .collect()
    }
}

impl App {
    /// A key in a pick list: move, filter, choose or close.
    pub(crate) fn picker_key(&mut self, action: Action, mut p: Picker) {
        let top = self.ui.overlays.len() - 1;
        let n = p.visible().len();
        match action {
            Action::Up => p.selected = p.selected.saturating_sub(1),
            Action::Down => p.selected = (p.selected + 1).min(n.saturating_sub(1)),
            Action::PageUp => p.selected = p.selected.saturating_sub(10),
            Action::PageDown => p.selected = (p.selected + 10).min(n.saturating_sub(1)),
            Action::Input(c) => {
                p.filter.push(c);
                p.selected = 0;
            }
            Action::Backspace => {
                p.filter.pop();
                p.selected = 0;
            }
            Action::Cancel => {
                self.ui.overlays.pop();
                return;
            }
            Action::Confirm => {
                let Some(value) = p.visible().get(p.selected).map(|it| it.value.clone()) else {
                    self.refuse("nothing matches the filter");
                    return;
                };
                self.ui.overlays.pop();
                self.choose(p.purpose, value);
                return;
            }
            _ => {}
        }
        self.ui.overlays[top] = Overlay::Picker(p);
    }

    /// Do what the list was opened for with the chosen value.
    fn choose(&mut self, purpose: PickPurpose, value: PickValue) {
        match (purpose, value) {
            (PickPurpose::Wire(k), PickValue::Wire(w)) => {
                let name = self.doc.build.windings[k].name.clone();
                self.edit(format!("wire of {name}: {w}"), |b| {
                    b.windings[k].wire = w;
                    Ok(())
                });
            }
            (PickPurpose::Wire(k), PickValue::MeasuredWire) => self.ask_measured_wire(k),
            (PickPurpose::Bobbin, PickValue::Bobbin { id, bobbin }) => {
                self.edit(format!("bobbin {id}"), |b| {
                    b.bobbin_source = BobbinSource::Id(id.clone());
                    b.bobbin = *bobbin;
                    Ok(())
                });
            }
            (PickPurpose::Bobbin, PickValue::MeasuredBobbin) => self.start_measured_bobbin(),
            (PickPurpose::NewBuild, PickValue::Bobbin { id, bobbin }) => {
                self.start_new_build(&id, *bobbin)
            }
            (PickPurpose::SplitAround(x), PickValue::Section(y)) => {
                let a = self.section_name(x);
                let c = self.section_name(y);
                self.edit_stack(format!("split {a} around {c}"), |b| {
                    edit::split_around(b, x, y)
                });
            }
            (PickPurpose::Partner(i), PickValue::Partner(p)) => {
                let name = self.section_name(i);
                let label = match &p {
                    Some(p) => format!("wind {name} bifilar with {p}"),
                    None => format!("wind {name} alone"),
                };
                self.edit_stack(label, |b| edit::set_partner(b, i, p.as_deref()));
            }
            (PickPurpose::AddSection(at), PickValue::AddTape) => {
                self.edit_stack("add a tape section", |b| edit::add_tape(b, at));
            }
            (PickPurpose::AddSection(at), PickValue::AddShare(w)) => {
                self.edit_stack(format!("add a section of {w}"), |b| {
                    edit::add_share(b, at, &w)
                });
            }
            (PickPurpose::Search, PickValue::Candidate { n, candidate }) => {
                self.take_candidate(n, *candidate)
            }
            (PickPurpose::Ferrite, PickValue::Ferrite(f)) => self.set_ferrite(f),
            (PickPurpose::NewStart, PickValue::NewFromBobbin) => self.new_from_bobbin(),
            (PickPurpose::NewStart, PickValue::NewFromRequirements) => {
                self.open_requirements_form()
            }
            (PickPurpose::Design, PickValue::Design { n, design }) => self.open_design(n, *design),
            _ => {}
        }
    }

    /// Ask for a measured wire's two diameters, starting from the ones it has.
    fn ask_measured_wire(&mut self, k: usize) {
        let text = match self.doc.build.windings[k].wire {
            WireSize::Measured { bare_mm, od_mm } => {
                format!("{} {}", trim_mm(bare_mm), trim_mm(od_mm))
            }
            _ => String::new(),
        };
        let name = self.doc.build.windings[k].name.clone();
        self.prompt(
            format!("measured wire of {name}"),
            text,
            PromptPurpose::MeasuredWire(k),
        );
    }

    /// The bobbin becomes the build's own (inline) and its form opens.
    fn start_measured_bobbin(&mut self) {
        let ok = self.edit("measured bobbin", |b| {
            if b.bobbin_source != BobbinSource::Inline {
                b.bobbin_source = BobbinSource::Inline;
                b.bobbin.origin = "measured".into();
                b.bobbin.name = format!("measured, started from {}", b.bobbin.name);
            }
            Ok(())
        });
        if ok.is_some() {
            self.start_core_draft();
            self.open_form(FormKind::Bobbin);
        }
    }

    /// A new build on the chosen bobbin, with a fresh history; a file not yet written keeps
    /// its path.
    fn start_new_build(&mut self, id: &str, bobbin: Bobbin) {
        let path = if self.doc.saved.is_none() {
            self.doc.path.clone()
        } else {
            None
        };
        let theme = self.ui.theme;
        let library = std::mem::take(&mut self.library);
        *self = App::new(edit::new_build(id, bobbin), path);
        self.doc.saved = None;
        self.ui.theme = theme;
        self.library = library;
        self.info(format!(
            "new build on {id}: a primary and a secondary to start from; W saves"
        ));
    }
}
