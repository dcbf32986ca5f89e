//! A form: the rows of one table of field specs (`tui::fields`), a selection, and Enter to
//! change the selected field as its spec says.

use super::{Overlay, PromptPurpose};
use crate::library::materials;
use crate::tui::action::Action;
use crate::tui::app::{App, Effect};
use crate::tui::fields::{self, Ctx, Enter, FormKind, NO_SUBSTITUTE, Row, isolation_caution};

/// An open form.
#[derive(Debug, Clone, PartialEq)]
pub struct Form {
    /// Which form.
    pub kind: FormKind,
    /// Index into the rows shown.
    pub selected: usize,
}

impl App {
    fn ctx(&self, kind: FormKind) -> Ctx<'_> {
        Ctx {
            build: &self.doc.build,
            k: kind.winding(),
            draft: &self.ui.core_draft,
            needs: self.ui.needs.as_ref(),
        }
    }

    /// The rows of a form as shown now.
    pub fn form_rows(&self, kind: FormKind) -> Vec<Row> {
        fields::rows(kind, &self.ctx(kind))
    }

    /// Open a form on its first row.
    pub(crate) fn open_form(&mut self, kind: FormKind) {
        self.ui
            .overlays
            .push(Overlay::Form(Form { kind, selected: 0 }));
    }

    /// A key in a form: move, change the selected field, or close.
    pub(crate) fn form_key(&mut self, action: Action, mut f: Form) -> Option<Effect> {
        let top = self.ui.overlays.len() - 1;
        let rows = self.form_rows(f.kind);
        match action {
            Action::Up => f.selected = f.selected.saturating_sub(1),
            Action::Down => f.selected = (f.selected + 1).min(rows.len().saturating_sub(1)),
            Action::Cancel => {
                self.ui.overlays.pop();
                return None;
            }
            Action::Confirm => {
                self.ui.overlays[top] = Overlay::Form(f.clone());
                return rows
                    .get(f.selected)
                    .and_then(|row| self.activate(f.kind, row.field));
            }
            _ => {}
        }
        self.ui.overlays[top] = Overlay::Form(f);
        None
    }

    /// Change field `field` of form `kind`: act at once, or ask for its value. A field whose
    /// row is not shown (a winding gone, a table the build has not got) does nothing.
    pub(crate) fn activate(&mut self, kind: FormKind, field: usize) -> Option<Effect> {
        let spec = kind.fields().get(field)?;
        let cx = self.ctx(kind);
        (spec.read)(&cx)?;
        let text = match &spec.enter {
            Enter::Act(act) => {
                act(self, kind.winding());
                return None;
            }
            Enter::Start(start) => return start(self),
            Enter::Type { text, .. } => text(&cx),
            Enter::Draft { text, .. } => Ok(text(cx.draft)),
            Enter::Need { text, .. } => Ok(cx.needs.map(text).unwrap_or_default()),
        };
        match text {
            Ok(text) => self.prompt(spec.label, text, PromptPurpose::Field { kind, field }),
            Err(why) => self.refuse(why),
        }
        None
    }

    /// A typed value for field `field` of form `kind`: written as its spec says.
    pub(crate) fn submit_field(&mut self, kind: FormKind, field: usize, t: &str) {
        let Some(spec) = kind.fields().get(field) else {
            return;
        };
        match &spec.enter {
            Enter::Type { write, .. } => {
                let shown = if t.is_empty() { "none" } else { t };
                let k = kind.winding();
                let what = match kind {
                    FormKind::Readings => fields::readings::edit_label(field, &self.doc.build),
                    _ => spec.label.to_string(),
                };
                self.edit(format!("{what}: {shown}"), |b| write(b, k, t));
            }
            Enter::Draft { write, .. } => {
                if let Err(why) = write(&mut self.ui.core_draft, t) {
                    self.refuse(why);
                }
            }
            Enter::Need { write, .. } => {
                let Some(r) = self.ui.needs.as_mut() else {
                    return;
                };
                match write(r, t) {
                    Ok(()) => self.ui.design_note = None,
                    Err(why) => self.refuse(why),
                }
            }
            Enter::Act(_) | Enter::Start(_) => {}
        }
    }

    /// The selection of the open form stays on a row after rows went away.
    pub(crate) fn clamp_form(&mut self) {
        if let Some(Overlay::Form(f)) = self.ui.overlays.last().cloned() {
            let n = self.form_rows(f.kind).len();
            if let Some(Overlay::Form(g)) = self.ui.overlays.last_mut() {
                g.selected = f.selected.min(n.saturating_sub(1));
            }
        }
    }

    /// Lines under a form: what the table changes, read from the Evaluation, and cautions.
    pub fn form_notes(&self, kind: FormKind) -> Vec<String> {
        let b = &self.doc.build;
        match kind {
            FormKind::Operating => match (&b.operating, &self.doc.eval.converter) {
                (None, _) => vec![
                    "It needs a switching frequency in the setup and a primary, a secondary \
                     and a reset winding."
                        .into(),
                ],
                (Some(_), Some(c)) => vec![format!(
                    "now: reset duty limit {:.1} %, switch voltage {:.1} V, duty needed at \
                     the lowest input {:.1} %",
                    c.reset_duty_limit * 100.0,
                    c.switch_voltage_v,
                    c.duty_needed_at_vin_min * 100.0
                )],
                (Some(_), None) => vec!["no converter figures for this build".into()],
            },
            FormKind::Material => b
                .material
                .as_ref()
                .and_then(|m| m.ferrite.as_deref())
                .and_then(materials::find)
                .map(|g| vec![g.description.to_string()])
                .unwrap_or_default(),
            FormKind::Isolation => {
                let mut v = Vec::new();
                if let Some(c) = b
                    .isolation
                    .as_ref()
                    .and_then(|i| isolation_caution(i.class))
                {
                    v.push(c.to_string());
                }
                v.push(NO_SUBSTITUTE.to_string());
                v
            }
            FormKind::Bobbin => self.core_notes(),
            FormKind::Readings => vec![
                "Resistances at the part's temperature; inductances and ratios at the first \
                 primary. An empty entry clears a reading."
                    .into(),
            ],
            FormKind::Requirements => self.requirements_notes(),
            FormKind::Setup | FormKind::Winding(_) => Vec::new(),
        }
    }
}
