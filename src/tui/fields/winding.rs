//! The winding form: one winding's name, role, turns, wire, insulation, strands, current
//! and pins. The main screen's shortcuts (r, t, w, ...) open the same fields by index.

use super::{Ctx, Enter, FieldSpec, num_text, opt, optional, parse_u32};
use crate::model::Winding;
use crate::tui::app::App;
use crate::tui::edit;

/// The winding of the form, when it still exists.
fn w<'a>(c: &Ctx<'a>) -> Option<&'a Winding> {
    c.build.windings.get(c.k)
}

/// Index of the name field in `FIELDS`.
pub const NAME: usize = 0;
/// Index of the role field.
pub const ROLE: usize = 1;
/// Index of the turns field.
pub const TURNS: usize = 2;
/// Index of the wire field.
pub const WIRE: usize = 3;
/// Index of the insulation field.
pub const GRADE: usize = 4;
/// Index of the RMS current field.
pub const CURRENT: usize = 6;
/// Index of the pins field.
pub const PINS: usize = 7;

/// The winding form's fields; the constants above index it.
pub static FIELDS: &[FieldSpec] = &[
    FieldSpec {
        label: "name",
        hint: "",
        read: |c| w(c).map(|w| w.name.to_string()),
        enter: Enter::Type {
            text: |c| Ok(w(c).map(|w| w.name.to_string()).unwrap_or_default()),
            write: |b, k, t| edit::rename(b, k, t),
        },
    },
    FieldSpec {
        label: "role",
        hint: "",
        read: |c| w(c).map(|w| w.role.key().to_string()),
        enter: Enter::Act(cycle_role),
    },
    FieldSpec {
        label: "turns",
        hint: "",
        read: |c| w(c).map(|w| w.turns.to_string()),
        enter: Enter::Type {
            text: |c| Ok(w(c).map(|w| w.turns.to_string()).unwrap_or_default()),
            write: |b, k, t| {
                let n = parse_u32(t)
                    .ok_or_else(|| format!("\"{t}\" is not a whole number of turns"))?;
                edit::set_winding_turns(b, k, n)
            },
        },
    },
    FieldSpec {
        label: "wire",
        hint: "",
        read: |c| w(c).map(|w| w.wire.to_string()),
        enter: Enter::Act(|app, k| app.open_wire_picker(k)),
    },
    FieldSpec {
        label: "insulation",
        hint: "",
        read: |c| w(c).map(|w| w.insulation.to_string()),
        enter: Enter::Act(cycle_grade),
    },
    FieldSpec {
        label: "strands in parallel",
        hint: "",
        read: |c| w(c).map(|w| w.strands.to_string()),
        enter: Enter::Type {
            text: |c| Ok(w(c).map(|w| w.strands.to_string()).unwrap_or_default()),
            write: |b, k, t| match parse_u32(t) {
                Some(n) if n > 0 => {
                    b.windings[k].strands = n;
                    Ok(())
                }
                _ => Err(format!(
                    "\"{t}\" is not a whole number of strands (1 or more)"
                )),
            },
        },
    },
    FieldSpec {
        label: "RMS current",
        hint: "a number; empty: none",
        read: |c| w(c).map(|w| opt(w.current_rms_a, "A")),
        enter: Enter::Type {
            text: |c| Ok(num_text(w(c).and_then(|w| w.current_rms_a))),
            write: |b, k, t| {
                b.windings[k].current_rms_a = optional(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "pins (start, finish)",
        hint: "start and finish pin, e.g. 1 2 (empty: none)",
        read: |c| {
            w(c).map(|w| {
                format!(
                    "{} to {}",
                    w.start_pin.as_deref().unwrap_or("-"),
                    w.finish_pin.as_deref().unwrap_or("-")
                )
            })
        },
        enter: Enter::Type {
            text: |c| {
                Ok(w(c).map_or(String::new(), |w| {
                    format!(
                        "{} {}",
                        w.start_pin.as_deref().unwrap_or(""),
                        w.finish_pin.as_deref().unwrap_or("")
                    )
                    .trim()
                    .to_string()
                }))
            },
            write: |b, k, t| {
                let mut it = t.split(|c: char| c.is_whitespace() || c == ',');
                let mut next = || it.find(|s| !s.is_empty()).map(str::to_string);
                let (s, f) = (next(), next());
                b.windings[k].start_pin = s;
                b.windings[k].finish_pin = f;
                Ok(())
            },
        },
    },
];

fn cycle_role(app: &mut App, k: usize) {
    let Some(w) = app.doc.build.windings.get(k) else {
        return;
    };
    let r = edit::next_role(w.role);
    let name = w.name.clone();
    app.edit(format!("role of {name}: {}", r.key()), |b| {
        b.windings[k].role = r;
        Ok(())
    });
}

fn cycle_grade(app: &mut App, k: usize) {
    let Some(w) = app.doc.build.windings.get(k) else {
        return;
    };
    let g = edit::next_grade(w.insulation);
    let name = w.name.clone();
    app.edit(format!("insulation of {name}: {g}"), |b| {
        b.windings[k].insulation = g;
        Ok(())
    });
}
