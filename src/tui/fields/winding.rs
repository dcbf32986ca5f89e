//! The winding form: one winding's name, role, turns, conductor kind, then the keys of its
//! conductor (round wire: wire, insulation, strands; foil: thickness, width, interleaf,
//! overhang, tab; litz: strands, strand diameter, enamel, bundles, serving, packing, lay),
//! current and pins. A row shows only for the conductor it belongs to. The main screen's
//! shortcuts (r, t, w, ...) open the same fields by index.

use super::conductor::{
    factor_or_default, foil, is_round, litz, mm_or_default, parse_foil_mm, parse_litz_strands,
    parse_optional_factor, parse_optional_mm, parse_strand_mm, text_of, width_shown,
};
use super::{Ctx, Enter, FieldSpec, num_text, opt, optional, parse_u32};
use crate::model::{
    Conductor, FOIL_INTERLEAF_MM, FOIL_OVERHANG_MM, FOIL_TAB_MM, LITZ_LAY_FACTOR, LITZ_PACKING,
    LITZ_SERVING_MM, Winding, trim_mm,
};
use crate::tui::app::App;
use crate::tui::conductor_edit::{self as ce, KINDS};
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
/// Index of the conductor kind field.
pub const KIND: usize = 3;
/// Index of the wire field (round wire).
pub const WIRE: usize = 4;
/// Index of the insulation field (round wire and litz strands).
pub const GRADE: usize = 5;
/// Index of the foil thickness field.
pub const FOIL_MM: usize = 7;
/// Index of the litz strand count field.
pub const LITZ_STRANDS: usize = 12;
/// Index of the RMS current field.
pub const CURRENT: usize = 18;
/// Index of the pins field.
pub const PINS: usize = 19;

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
        label: "conductor",
        hint: "",
        read: |c| w(c).map(|w| w.conductor.kind_key().to_string()),
        enter: Enter::Act(cycle_conductor),
    },
    FieldSpec {
        label: "wire",
        hint: "",
        read: |c| w(c).filter(|_| is_round(c)).map(|w| w.wire.to_string()),
        enter: Enter::Act(|app, k| app.open_wire_picker(k)),
    },
    FieldSpec {
        label: "insulation",
        hint: "",
        read: |c| {
            w(c).filter(|w| !matches!(w.conductor, Conductor::Foil(_)))
                .map(|w| w.insulation.to_string())
        },
        enter: Enter::Act(cycle_grade),
    },
    FieldSpec {
        label: "strands in parallel",
        hint: "",
        read: |c| w(c).filter(|_| is_round(c)).map(|w| w.strands.to_string()),
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
        label: "foil thickness",
        hint: "copper thickness in mm, e.g. 0.2",
        read: |c| foil(c).map(|f| format!("{} mm", trim_mm(f.thickness_mm))),
        enter: Enter::Type {
            text: |c| {
                Ok(foil(c)
                    .map(|f| f.thickness_mm.to_string())
                    .unwrap_or_default())
            },
            write: |b, k, t| ce::set_foil_mm(b, k, parse_foil_mm(t)?),
        },
    },
    FieldSpec {
        label: "foil width",
        hint: "copper width across the breadth, mm; empty: the breadth less the overhang",
        read: |c| foil(c).map(|f| width_shown(c, &f)),
        enter: Enter::Type {
            text: |c| Ok(text_of(foil(c).and_then(|f| f.width_mm))),
            write: |b, k, t| {
                ce::foil_mut(b, k)?.width_mm = parse_optional_mm(t, "foil width", 0.5, 500.0)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "interleaf",
        hint: "film under each turn, mm; empty: the default",
        read: |c| foil(c).map(|f| mm_or_default(f.interleaf_mm, FOIL_INTERLEAF_MM)),
        enter: Enter::Type {
            text: |c| Ok(text_of(foil(c).and_then(|f| f.interleaf_mm))),
            write: |b, k, t| {
                let lo = crate::engine::conductor::INTERLEAF_MIN_MM;
                ce::foil_mut(b, k)?.interleaf_mm = parse_optional_mm(t, "interleaf", lo, 1.0)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "interleaf overhang",
        hint: "film past each foil edge, mm; empty: the default",
        read: |c| foil(c).map(|f| mm_or_default(f.overhang_mm, FOIL_OVERHANG_MM)),
        enter: Enter::Type {
            text: |c| Ok(text_of(foil(c).and_then(|f| f.overhang_mm))),
            write: |b, k, t| {
                ce::foil_mut(b, k)?.overhang_mm = parse_optional_mm(t, "overhang", 0.0, 10.0)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "lead tab length",
        hint: "each tab from the winding to its pin, mm; empty: the default",
        read: |c| foil(c).map(|f| mm_or_default(f.tab_mm, FOIL_TAB_MM)),
        enter: Enter::Type {
            text: |c| Ok(text_of(foil(c).and_then(|f| f.tab_mm))),
            write: |b, k, t| {
                ce::foil_mut(b, k)?.tab_mm = parse_optional_mm(t, "tab length", 0.0, 200.0)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "litz strands",
        hint: "strands in the bundle, e.g. 60",
        read: |c| litz(c).map(|l| l.strands.to_string()),
        enter: Enter::Type {
            text: |c| Ok(litz(c).map(|l| l.strands.to_string()).unwrap_or_default()),
            write: |b, k, t| {
                ce::litz_mut(b, k)?.strands = parse_litz_strands(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "strand diameter",
        hint: "bare diameter of one strand, mm, e.g. 0.1",
        read: |c| litz(c).map(|l| format!("{} mm", trim_mm(l.strand_mm))),
        enter: Enter::Type {
            text: |c| Ok(litz(c).map(|l| l.strand_mm.to_string()).unwrap_or_default()),
            write: |b, k, t| ce::set_strand_mm(b, k, parse_strand_mm(t)?),
        },
    },
    FieldSpec {
        label: "bundles in parallel",
        hint: "litz bundles wound side by side as one turn; usually 1",
        read: |c| litz(c).and(w(c)).map(|w| w.strands.to_string()),
        enter: Enter::Type {
            text: |c| Ok(w(c).map(|w| w.strands.to_string()).unwrap_or_default()),
            write: |b, k, t| match parse_u32(t) {
                Some(n) if n > 0 => {
                    ce::litz_mut(b, k)?;
                    b.windings[k].strands = n;
                    Ok(())
                }
                _ => Err(format!(
                    "\"{t}\" is not a whole number of bundles (1 or more)"
                )),
            },
        },
    },
    FieldSpec {
        label: "serving",
        hint: "build of the serving on the bundle, mm; empty: the default",
        read: |c| litz(c).map(|l| mm_or_default(l.serving_mm, LITZ_SERVING_MM)),
        enter: Enter::Type {
            text: |c| Ok(text_of(litz(c).and_then(|l| l.serving_mm))),
            write: |b, k, t| {
                ce::litz_mut(b, k)?.serving_mm = parse_optional_mm(t, "serving", 0.0, 1.0)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "packing factor",
        hint: "strands' area over the bundle's circle; empty: the default",
        read: |c| litz(c).map(|l| factor_or_default(l.packing, LITZ_PACKING)),
        enter: Enter::Type {
            text: |c| Ok(text_of(litz(c).and_then(|l| l.packing))),
            write: |b, k, t| {
                let r = crate::engine::conductor::PACKING_RANGE;
                ce::litz_mut(b, k)?.packing =
                    parse_optional_factor(t, "packing factor", *r.start(), *r.end())?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "lay factor",
        hint: "strand length over bundle length; empty: the default",
        read: |c| litz(c).map(|l| factor_or_default(l.lay_factor, LITZ_LAY_FACTOR)),
        enter: Enter::Type {
            text: |c| Ok(text_of(litz(c).and_then(|l| l.lay_factor))),
            write: |b, k, t| {
                let r = crate::engine::conductor::LAY_RANGE;
                ce::litz_mut(b, k)?.lay_factor =
                    parse_optional_factor(t, "lay factor", *r.start(), *r.end())?;
                Ok(())
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

/// The next conductor kind the engine accepts for winding k: round, foil, litz, round, ...;
/// a kind it refuses is skipped, and the status says why.
fn cycle_conductor(app: &mut App, k: usize) {
    let Some(w) = app.doc.build.windings.get(k) else {
        return;
    };
    let name = w.name.clone();
    let now = KINDS
        .iter()
        .position(|&x| x == w.conductor.kind_key())
        .unwrap_or(0);
    let mut skipped: Vec<String> = Vec::new();
    for step in 1..KINDS.len() {
        let kind = KINDS[(now + step) % KINDS.len()];
        let mut next = app.doc.build.clone();
        let why = match ce::set_kind(&mut next, k, kind) {
            Ok(()) => crate::engine::validate(&next)
                .first()
                .map(ToString::to_string),
            Err(e) => Some(e),
        };
        match why {
            None => {
                let also = if skipped.is_empty() {
                    String::new()
                } else {
                    format!(" ({})", skipped.join("; "))
                };
                app.edit(format!("conductor of {name}: {kind}{also}"), |b| {
                    ce::set_kind(b, k, kind)
                });
                return;
            }
            Some(why) => skipped.push(format!("{kind} refused: {why}")),
        }
    }
    app.refuse(skipped.join("; "));
}
