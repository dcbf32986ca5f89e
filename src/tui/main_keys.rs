//! The main screen's keys, when no overlay is open: the file and the document, moving in
//! the lists, the stack's edits and the windings' edits.

use super::action::Action;
use super::app::{App, Effect};
use super::edit;
use super::fields::{FormKind, winding};
use super::overlay::{Form, Overlay, PickPurpose, PromptPurpose, Question};
use super::ui::Focus;
use crate::model::{Conductor, Section};

impl App {
    /// A key on the main screen.
    pub(crate) fn main_key(&mut self, action: Action) -> Option<Effect> {
        match action {
            Action::Quit
            | Action::Help
            | Action::Save
            | Action::SaveAs
            | Action::Open
            | Action::NewBuild
            | Action::Search
            | Action::Sheet => return self.file_key(action),
            Action::SwitchPanel => {
                self.ui.focus = match self.ui.focus {
                    Focus::Stack => Focus::Windings,
                    Focus::Windings => Focus::Stack,
                }
            }
            Action::Up | Action::Down => self.move_selection(action == Action::Up),
            Action::Undo => match self.doc.undo() {
                Some(label) => self.undone(format!("undid: {label}")),
                None => self.info("nothing to undo"),
            },
            Action::Redo => match self.doc.redo() {
                Some(label) => self.undone(format!("redid: {label}")),
                None => self.info("nothing to redo"),
            },
            Action::Pin => {
                if self.doc.toggle_pin() {
                    self.info("pinned these figures: the check panel now compares against them");
                } else {
                    self.info("unpinned: comparing with the figures before the last edit");
                }
            }
            Action::Bobbin => self.open_bobbin_picker(PickPurpose::Bobbin),
            Action::Setup => self.open_form(FormKind::Setup),
            Action::Operating => self.open_form(FormKind::Operating),
            Action::Material => self.open_form(FormKind::Material),
            Action::Isolation => self.open_form(FormKind::Isolation),
            Action::Readings => self.open_form(FormKind::Readings),
            Action::ResetRatio => self.ui.overlays.push(Overlay::ResetRatio),
            Action::More | Action::Less => self.more_or_less(action == Action::More),
            Action::EditSection
            | Action::AddSection
            | Action::DeleteSection
            | Action::MoveOut
            | Action::MoveIn
            | Action::Split
            | Action::Partner
            | Action::Spread => self.stack_key(action),
            _ => self.winding_key(action),
        }
        None
    }

    /// Quit, help, the file, the search and the sheet.
    fn file_key(&mut self, action: Action) -> Option<Effect> {
        match action {
            Action::Quit if self.doc.dirty() => self.ask(Question::Quit),
            Action::Quit => return Some(Effect::Quit),
            Action::Help => self.ui.overlays.push(Overlay::Help { scroll: 0 }),
            Action::Save => match self.doc.path.clone() {
                Some(p) => return Some(Effect::Save(p)),
                None => self.ask_save_path(false),
            },
            Action::SaveAs => self.ask_save_path(false),
            Action::Open if self.doc.dirty() => self.ask(Question::DiscardForOpen),
            Action::Open => self.prompt("open build file", "", PromptPurpose::OpenPath),
            Action::NewBuild => self.open_new_chooser(),
            Action::Search => {
                self.info("searching... (wires, strands and section orders on this bobbin)");
                return Some(Effect::Search);
            }
            Action::Sheet => {
                let suggestion = match &self.doc.path {
                    Some(p) => p.with_extension("sheet.txt").display().to_string(),
                    None => "winding-sheet.txt".into(),
                };
                self.prompt(
                    "write the winding sheet to",
                    suggestion,
                    PromptPurpose::SheetPath,
                );
            }
            _ => {}
        }
        None
    }

    fn ask(&mut self, q: Question) {
        self.ui.overlays.push(Overlay::Question(q));
    }

    /// The stack list shows the outermost section on top, like the drawing: up goes out.
    fn move_selection(&mut self, up: bool) {
        let (i, k) = (self.ui.stack_sel, self.ui.winding_sel);
        let b = &self.doc.build;
        match (self.ui.focus, up) {
            (Focus::Stack, true) => {
                self.ui.stack_sel = (i + 1).min(b.stack.len().saturating_sub(1))
            }
            (Focus::Stack, false) => self.ui.stack_sel = i.saturating_sub(1),
            (Focus::Windings, true) => self.ui.winding_sel = k.saturating_sub(1),
            (Focus::Windings, false) => {
                self.ui.winding_sel = (k + 1).min(b.windings.len().saturating_sub(1))
            }
        }
    }

    /// + and -: tape wraps of the selected section, or strands of the selected winding.
    fn more_or_less(&mut self, up: bool) {
        let (i, k) = (self.ui.stack_sel, self.ui.winding_sel);
        match self.ui.focus {
            Focus::Stack => {
                let now = edit::wraps_of(&self.doc.build, i);
                let n = if up { now + 1 } else { now.saturating_sub(1) };
                let what = match self.doc.build.stack.get(i) {
                    Some(Section::Tape { .. }) => "tape wraps",
                    _ => "tape between layers",
                };
                let name = self.section_name(i);
                self.edit(format!("{what} of {name}: {n}"), |b| {
                    if !up && now == 0 {
                        return Err("there is no tape between its layers".into());
                    }
                    edit::set_wraps(b, i, n)
                });
            }
            Focus::Windings => {
                let Some(now) = self.doc.build.windings.get(k).map(|w| w.strands) else {
                    return;
                };
                let n = if up { now + 1 } else { now.saturating_sub(1) };
                let name = self.winding_name();
                self.edit(format!("strands of {name}: {n}"), |b| {
                    if n == 0 {
                        return Err("a winding needs at least one strand".into());
                    }
                    b.windings[k].strands = n;
                    Ok(())
                });
            }
        }
    }

    /// The stack's own keys: edit, add, delete, move, split, partner, spread.
    fn stack_key(&mut self, action: Action) {
        let i = self.ui.stack_sel;
        match action {
            Action::EditSection => self.edit_section(i),
            Action::AddSection => self.open_add_picker(),
            Action::DeleteSection => {
                let name = self.section_name(i);
                self.edit_stack(format!("delete {name}"), |b| edit::delete_section(b, i));
            }
            Action::MoveOut | Action::MoveIn => {
                let out = action == Action::MoveOut;
                let name = self.section_name(i);
                let word = if out { "outward" } else { "inward" };
                self.edit_stack(format!("move {name} {word}"), |b| {
                    edit::move_section(b, i, out)
                });
            }
            Action::Split => self.open_split_picker(),
            Action::Partner => self.open_partner_picker(),
            Action::Spread => self.toggle_spread(i),
            _ => {}
        }
    }

    /// `e`: the selected winding section's last layer spaced across the width, or
    /// close-wound again; the status says what the layer holds.
    fn toggle_spread(&mut self, i: usize) {
        let now = match self.doc.build.stack.get(i) {
            Some(Section::Winding(ws)) => ws.spread,
            Some(Section::Tape { .. }) => {
                self.refuse("spacing is for a winding section's last layer; this is tape");
                return;
            }
            None => {
                self.refuse("no section selected");
                return;
            }
        };
        let name = self.section_name(i);
        let word = if now {
            "close-wound"
        } else {
            "spaced across the width"
        };
        let done = self.edit(format!("last layer of {name} {word}"), |b| {
            edit::set_spread(b, i, !now)
        });
        if done.is_none() {
            return;
        }
        let layer = self.doc.eval.sections.get(i).and_then(|s| match &s.kind {
            crate::engine::SectionKind::Winding {
                turns_per_layer,
                last_layer_turns,
                ..
            } => Some((*last_layer_turns, *turns_per_layer)),
            _ => None,
        });
        if !now
            && let Some((last, per)) = layer
            && last >= per
        {
            self.info(format!(
                "last layer of {name} spaced across the width; it is full ({last} of {per}), \
                 so this changes nothing until its turns change"
            ));
        }
    }

    /// Ask for a winding section's turns or a tape section's wraps.
    fn edit_section(&mut self, i: usize) {
        match self.doc.build.stack.get(i) {
            Some(Section::Winding(_)) => {
                let t = self.doc.build.section_turns()[i];
                let name = self.section_name(i);
                self.prompt(
                    format!("turns of section {name}"),
                    t.to_string(),
                    PromptPurpose::SectionTurns(i),
                );
            }
            Some(Section::Tape { wraps }) => {
                let w = *wraps;
                self.prompt(
                    format!("wraps of tape in section #{}", i + 1),
                    w.to_string(),
                    PromptPurpose::Wraps(i),
                );
            }
            None => {}
        }
    }

    /// The windings' own keys: the form, a field of it at once, add, delete.
    fn winding_key(&mut self, action: Action) {
        let k = self.ui.winding_sel;
        let field = |f| (FormKind::Winding(k), f);
        let (kind, f) = match action {
            Action::EditWinding if k < self.doc.build.windings.len() => {
                self.ui.overlays.push(Overlay::Form(Form {
                    kind: FormKind::Winding(k),
                    selected: 0,
                }));
                return;
            }
            Action::WindingTurns => field(winding::TURNS),
            Action::Rename => field(winding::NAME),
            Action::Role => field(winding::ROLE),
            // The conductor's own first key: the wire list for round wire, the thickness
            // of a foil, the strand count of a litz.
            Action::Wire => field(match self.doc.build.windings.get(k).map(|w| w.conductor) {
                Some(Conductor::Foil(_)) => winding::FOIL_MM,
                Some(Conductor::Litz(_)) => winding::LITZ_STRANDS,
                _ => winding::WIRE,
            }),
            Action::Grade
                if matches!(
                    self.doc.build.windings.get(k).map(|w| w.conductor),
                    Some(Conductor::Foil(_))
                ) =>
            {
                self.refuse("foil has no enamel: the interleaf insulates its turns");
                return;
            }
            Action::Grade => field(winding::GRADE),
            Action::Current => field(winding::CURRENT),
            Action::Pins => field(winding::PINS),
            Action::AddWinding => {
                if let Some(k) = self.edit("add a winding", edit::add_winding) {
                    self.ui.winding_sel = k;
                }
                return;
            }
            Action::DeleteWinding => {
                let name = self.winding_name();
                if let Some(k) = self.edit(format!("delete winding {name}"), |b| {
                    edit::delete_winding(b, k)
                }) {
                    self.ui.winding_sel = k;
                }
                return;
            }
            _ => return,
        };
        // A winding's fields edit the build; none hands the loop an effect.
        let _ = self.activate(kind, f);
    }
}
