//! The line editor: a label, a hint, the text typed; Enter hands the text to what it was
//! opened for (a field, a section's turns, a file name).

use super::Overlay;
use crate::model::WireSize;
use crate::tui::action::Action;
use crate::tui::app::{App, Effect};
use crate::tui::edit;
use crate::tui::fields::{FormKind, parse_f64, parse_u32};
use std::path::PathBuf;

/// What the typed text is for.
#[derive(Debug, Clone, PartialEq)]
pub enum PromptPurpose {
    /// The turns of section i.
    SectionTurns(usize),
    /// The wraps of tape section i.
    Wraps(usize),
    /// Field `field` (index into its table) of a form.
    Field { kind: FormKind, field: usize },
    /// The measured wire of winding k.
    MeasuredWire(usize),
    /// The file to save the build to (then quit, after a save from the quit question).
    SavePath { then_quit: bool },
    /// The build file to open.
    OpenPath,
    /// The file to write the winding sheet to.
    SheetPath,
    /// The id to save the bobbin under in the user's folder.
    BobbinId,
}

impl PromptPurpose {
    /// What the line editor says under the text.
    fn hint(&self) -> &'static str {
        match self {
            PromptPurpose::MeasuredWire(_) => "bare and overall diameter in mm, e.g. 0.40 0.452",
            PromptPurpose::SavePath { .. } | PromptPurpose::OpenPath => "a file path",
            PromptPurpose::SheetPath => {
                "a file path; a name ending in .html gives a printable page"
            }
            PromptPurpose::BobbinId => {
                "letters, digits, - _ . (the file name in your bobbin folder)"
            }
            PromptPurpose::Field { kind, field } => {
                kind.fields().get(*field).map_or("", |f| f.hint)
            }
            PromptPurpose::SectionTurns(_) | PromptPurpose::Wraps(_) => "",
        }
    }
}

/// The open line editor.
#[derive(Debug, Clone, PartialEq)]
pub struct Prompt {
    /// What is asked for.
    pub label: String,
    /// The hint under the text.
    pub hint: String,
    /// The text typed so far.
    pub text: String,
    /// What the text is for.
    pub purpose: PromptPurpose,
    /// The text is the value as it was, not yet touched: the first character typed replaces
    /// it (as a selected field does), Backspace starts editing it instead.
    pub fresh: bool,
}

impl App {
    /// Open the line editor on `text`.
    pub(crate) fn prompt(
        &mut self,
        label: impl Into<String>,
        text: impl Into<String>,
        purpose: PromptPurpose,
    ) {
        let text = text.into();
        self.ui.overlays.push(Overlay::Prompt(Prompt {
            label: label.into(),
            hint: purpose.hint().into(),
            fresh: !text.is_empty(),
            text,
            purpose,
        }));
    }

    /// A key in the line editor: type, erase, submit or close.
    pub(crate) fn prompt_key(&mut self, action: Action, mut p: Prompt) -> Option<Effect> {
        let top = self.ui.overlays.len() - 1;
        match action {
            Action::Input(c) => {
                if p.fresh {
                    p.text.clear();
                }
                p.fresh = false;
                p.text.push(c);
            }
            Action::Backspace => {
                p.fresh = false;
                p.text.pop();
            }
            Action::Cancel => {
                self.ui.overlays.pop();
                return None;
            }
            Action::Confirm => {
                self.ui.overlays.pop();
                return self.submit(p.purpose, p.text.trim());
            }
            _ => {}
        }
        self.ui.overlays[top] = Overlay::Prompt(p);
        None
    }

    /// A typed value: parse it, then edit (or hand the file name to the loop).
    fn submit(&mut self, purpose: PromptPurpose, t: &str) -> Option<Effect> {
        let path = |app: &mut App| {
            if t.is_empty() {
                app.refuse("no file name given");
                return None;
            }
            Some(PathBuf::from(t))
        };
        match purpose {
            PromptPurpose::SavePath { then_quit } => {
                let p = path(self)?;
                return Some(if then_quit {
                    Effect::SaveThenQuit(p)
                } else {
                    Effect::Save(p)
                });
            }
            PromptPurpose::OpenPath => {
                return (!t.is_empty()).then(|| Effect::Open(PathBuf::from(t)));
            }
            PromptPurpose::SheetPath => return path(self).map(Effect::WriteSheet),
            PromptPurpose::BobbinId => return self.save_bobbin_as(t),
            PromptPurpose::SectionTurns(i) => match parse_u32(t) {
                Some(n) => {
                    let name = self.section_name(i);
                    self.edit(format!("turns of {name}: {n}"), |b| {
                        edit::set_section_turns(b, i, n)
                    });
                }
                None => self.refuse(format!("\"{t}\" is not a whole number of turns")),
            },
            PromptPurpose::Wraps(i) => match parse_u32(t) {
                Some(n) => {
                    self.edit(format!("tape wraps of #{}: {n}", i + 1), |b| {
                        edit::set_wraps(b, i, n)
                    });
                }
                None => self.refuse(format!("\"{t}\" is not a whole number of wraps")),
            },
            PromptPurpose::MeasuredWire(k) => self.submit_measured_wire(k, t),
            PromptPurpose::Field { kind, field } => self.submit_field(kind, field, t),
        }
        None
    }

    fn submit_measured_wire(&mut self, k: usize, t: &str) {
        let nums: Vec<Option<f64>> = t
            .split(|c: char| c.is_whitespace() || c == ',' || c == '/')
            .filter(|s| !s.is_empty())
            .map(parse_f64)
            .collect();
        match nums.as_slice() {
            [Some(bare_mm), Some(od_mm)] => {
                let (bare_mm, od_mm) = (*bare_mm, *od_mm);
                let name = self.doc.build.windings[k].name.clone();
                self.edit(format!("measured wire of {name}"), |b| {
                    b.windings[k].wire = WireSize::Measured { bare_mm, od_mm };
                    Ok(())
                });
            }
            _ => self.refuse(format!(
                "\"{t}\" is not two diameters in mm (bare, then overall)"
            )),
        }
    }
}
