//! Each form of the planner as one table of field specs: the label, the hint the line editor
//! shows, how the value reads in the form, and what Enter does (type a value and write it,
//! or act at once). Adding a field is adding one row to its form's table.

mod bobbin;
mod conductor;
mod isolation;
mod material;
mod operating;
pub mod readings;
pub mod requirements;
mod setup;
pub mod winding;

pub use isolation::{NO_SUBSTITUTE, isolation_caution};

use super::app::{App, Effect};
use super::core_form::CoreDraft;
use super::edit::Refusal;
use crate::model::{Build, Requirements};

/// What a field's row reads from: the build, the winding the form is about (its index; 0 for
/// the forms that are not about one) and the measured core being typed in.
pub struct Ctx<'a> {
    /// The build as it stands.
    pub build: &'a Build,
    /// The winding of a winding form.
    pub k: usize,
    /// The measured core of the bobbin form, not yet applied.
    pub draft: &'a CoreDraft,
    /// The requirements being typed in for a design, once the form has been opened.
    pub needs: Option<&'a Requirements>,
}

/// What Enter on a field does.
pub enum Enter {
    /// Ask for a value in the line editor, then write it to the build as one edit. `text` is
    /// the value to start editing from, or why the field cannot be edited now.
    Type {
        text: fn(&Ctx) -> Result<String, Refusal>,
        write: fn(&mut Build, usize, &str) -> Result<(), Refusal>,
    },
    /// Ask for a reading of the measured core, then keep it in the draft.
    Draft {
        text: fn(&CoreDraft) -> String,
        write: fn(&mut CoreDraft, &str) -> Result<(), Refusal>,
    },
    /// Ask for a value of the requirements being typed in, then keep it there.
    Need {
        text: fn(&Requirements) -> String,
        write: fn(&mut Requirements, &str) -> Result<(), Refusal>,
    },
    /// Act at once: cycle the value, add or remove a table, open a list.
    Act(fn(&mut App, usize)),
    /// Act, and hand the run loop what it must carry out (start the design).
    Start(fn(&mut App) -> Option<Effect>),
}

/// One row of a form.
pub struct FieldSpec {
    /// The row's label, also the line editor's and the edit's.
    pub label: &'static str,
    /// What the line editor says under a typed value.
    pub hint: &'static str,
    /// The value as the form shows it; `None` leaves the row out (a field the build or the
    /// draft has not got, such as a round tube's width).
    pub read: fn(&Ctx) -> Option<String>,
    /// What Enter does.
    pub enter: Enter,
}

/// Which form a table belongs to.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum FormKind {
    /// `[setup]` and the title.
    Setup,
    /// One winding, by index into `build.windings`.
    Winding(usize),
    /// The measured bobbin and its core.
    Bobbin,
    /// `[operating]`.
    Operating,
    /// `[material]`.
    Material,
    /// `[isolation]`.
    Isolation,
    /// `[measured]`: the bench readings of the wound part.
    Readings,
    /// The requirements of a new build designed from them.
    Requirements,
}

impl FormKind {
    /// The form's table of fields, in the order shown.
    pub fn fields(self) -> &'static [FieldSpec] {
        match self {
            FormKind::Setup => setup::FIELDS,
            FormKind::Winding(_) => winding::FIELDS,
            FormKind::Bobbin => bobbin::FIELDS,
            FormKind::Operating => operating::FIELDS,
            FormKind::Material => material::FIELDS,
            FormKind::Isolation => isolation::FIELDS,
            FormKind::Readings => readings::FIELDS,
            FormKind::Requirements => requirements::FIELDS,
        }
    }

    /// The winding a winding form is about; 0 for the others.
    pub fn winding(self) -> usize {
        match self {
            FormKind::Winding(k) => k,
            _ => 0,
        }
    }
}

/// A shown row of a form: its index in the table, its label and its value.
pub struct Row {
    /// Index into the form's `fields()`.
    pub field: usize,
    /// The label.
    pub label: &'static str,
    /// The value as text.
    pub value: String,
}

/// The rows a form shows now.
pub fn rows(kind: FormKind, cx: &Ctx) -> Vec<Row> {
    kind.fields()
        .iter()
        .enumerate()
        .filter_map(|(field, f)| {
            (f.read)(cx).map(|value| Row {
                field,
                label: f.label,
                value,
            })
        })
        .collect()
}

/// A number as typed: finite, or none.
pub fn parse_f64(s: &str) -> Option<f64> {
    let v: f64 = s.trim().parse().ok()?;
    v.is_finite().then_some(v)
}

/// A whole number as typed, or none.
pub fn parse_u32(s: &str) -> Option<u32> {
    s.trim().parse().ok()
}

/// A value a user leaves out: empty, or the word "none".
fn is_none(t: &str) -> bool {
    t.is_empty() || t == "none"
}

/// A required number, or the refusal that it is not one.
fn number(t: &str) -> Result<f64, Refusal> {
    parse_f64(t).ok_or_else(|| format!("\"{t}\" is not a number"))
}

/// An optional number: empty or "none" clears it.
fn optional(t: &str) -> Result<Option<f64>, Refusal> {
    if is_none(t) {
        Ok(None)
    } else {
        number(t).map(Some)
    }
}

/// A value with its unit, or "none".
fn opt(v: Option<f64>, unit: &str) -> String {
    v.map_or("none".to_string(), |v| format!("{v} {unit}"))
}

/// An optional value the engine takes a default for when none is given: `40 C`, or
/// `none: 40 C taken`.
fn opt_or_default(v: Option<f64>, unit: &str, default: f64) -> String {
    v.map_or(format!("none: {default} {unit} taken"), |v| {
        format!("{v} {unit}")
    })
}

/// An optional number as the text to edit (empty for none).
fn num_text(v: Option<f64>) -> String {
    v.map(|v| v.to_string()).unwrap_or_default()
}
