//! The readings form: what the bench measured on the wound part, the build's `[measured]`
//! table. Each value is checked as the file loader checks it (a number above 0; the leakage
//! below the magnetising inductance) and written as one edit; an empty entry clears that
//! reading, and clearing the last one drops the table. The last row shows the readings
//! against the plan.

use super::{Ctx, Enter, FieldSpec, num_text, opt, optional};
use crate::model::{Build, Measured, Name, Role};
use crate::tui::edit::Refusal;
use crate::tui::overlay::Overlay;

/// The part's temperature the loader accepts (C), as `files::measured` does.
const READING_C_RANGE: (f64, f64) = (-40.0, 200.0);

/// Index of the first DC-resistance row in `FIELDS`.
pub const FIRST_DCR: usize = 2;
/// Index of the magnetising-inductance row.
pub const MAGNETISING: usize = FIRST_DCR + SLOTS;
/// Index of the leakage-inductance row.
pub const LEAKAGE: usize = MAGNETISING + 1;
/// Index of the first ratio row.
pub const FIRST_RATIO: usize = LEAKAGE + 1;
/// Windings the form has a resistance and a ratio row for (the first eight).
pub const SLOTS: usize = 8;

fn m<'a>(c: &Ctx<'a>) -> Option<&'a Measured> {
    c.build.measured.as_ref()
}

/// The first primary: inductances and ratios are read at it.
fn first_primary(b: &Build) -> Option<usize> {
    b.windings.iter().position(|w| w.role == Role::Primary)
}

fn first_secondary(b: &Build) -> Option<usize> {
    b.windings.iter().position(|w| w.role == Role::Secondary)
}

/// Change the build's readings; a table left with nothing in it is dropped.
fn with(
    b: &mut Build,
    f: impl FnOnce(&Build, &mut Measured) -> Result<(), Refusal>,
) -> Result<(), Refusal> {
    let mut m = b.measured.clone().unwrap_or_default();
    f(b, &mut m)?;
    b.measured = (m != Measured::default()).then_some(m);
    Ok(())
}

/// A reading as typed: empty or "none" clears it; else a number above 0.
fn positive(t: &str) -> Result<Option<f64>, Refusal> {
    match optional(t)? {
        Some(v) if v <= 0.0 => Err(format!("must be a number above 0, not {v}")),
        v => Ok(v),
    }
}

fn leakage_not_below(l: f64, lm: f64) -> Refusal {
    format!(
        "{l} uH is not below the magnetising inductance ({lm} uH): with the secondary \
         shorted the primary reads far less; were the two swapped?"
    )
}

/// A reading by winding name.
fn by_name(v: &[(Name, f64)], name: &str) -> Option<f64> {
    v.iter().find(|(n, _)| n.as_str() == name).map(|(_, x)| *x)
}

/// Set or clear the reading of winding `i`, keeping the build's winding order.
fn set_by_winding(b: &Build, v: &mut Vec<(Name, f64)>, i: usize, x: Option<f64>) {
    let name = b.windings[i].name.clone();
    v.retain(|(n, _)| *n != name);
    if let Some(x) = x {
        v.push((name, x));
    }
    let order = |n: &Name| b.windings.iter().position(|w| w.name == *n);
    v.sort_by_key(|(n, _)| order(n));
}

/// The resistance row of winding `$i`.
macro_rules! dcr {
    ($i:expr) => {
        FieldSpec {
            label: "DC resistance",
            hint: "ohm at the reading temperature; empty: none",
            read: |c| {
                let w = c.build.windings.get($i)?;
                let r = m(c).and_then(|m| by_name(&m.dcr_ohm, &w.name));
                Some(format!("{}: {}", w.name, opt(r, "ohm")))
            },
            enter: Enter::Type {
                text: |c| {
                    let w = c.build.windings.get($i).ok_or("no such winding")?;
                    Ok(num_text(m(c).and_then(|m| by_name(&m.dcr_ohm, &w.name))))
                },
                write: |b, _, t| {
                    if $i >= b.windings.len() {
                        return Err("no such winding".into());
                    }
                    let x = positive(t)?;
                    with(b, |b, m| {
                        set_by_winding(b, &mut m.dcr_ohm, $i, x);
                        Ok(())
                    })
                },
            },
        }
    };
}

/// The ratio row of winding `$i`, left out for the first primary.
macro_rules! ratio {
    ($i:expr) => {
        FieldSpec {
            label: "voltage ratio",
            hint: "the winding's open-circuit voltage over the first primary's; empty: none",
            read: |c| {
                let w = c.build.windings.get($i)?;
                let p = first_primary(c.build)?;
                if p == $i {
                    return None;
                }
                let r = m(c).and_then(|m| by_name(&m.ratio, &w.name));
                Some(format!(
                    "{} / {}: {}",
                    w.name,
                    c.build.windings[p].name,
                    r.map_or("none".into(), |r| r.to_string())
                ))
            },
            enter: Enter::Type {
                text: |c| {
                    let w = c.build.windings.get($i).ok_or("no such winding")?;
                    Ok(num_text(m(c).and_then(|m| by_name(&m.ratio, &w.name))))
                },
                write: |b, _, t| {
                    if $i >= b.windings.len() || first_primary(b).is_none_or(|p| p == $i) {
                        return Err("the ratio is read against the first primary".into());
                    }
                    let x = positive(t)?;
                    with(b, |b, m| {
                        set_by_winding(b, &mut m.ratio, $i, x);
                        Ok(())
                    })
                },
            },
        }
    };
}

/// The readings form's fields; the constants above index it.
pub static FIELDS: &[FieldSpec] = &[
    FieldSpec {
        label: "part temperature",
        hint: "C when the resistances were read; empty: 20 C (the bench)",
        read: |c| Some(opt(m(c).and_then(|m| m.reading_c), "C")),
        enter: Enter::Type {
            text: |c| Ok(num_text(m(c).and_then(|m| m.reading_c))),
            write: |b, _, t| {
                let v = optional(t)?;
                if let Some(c) = v
                    && !(READING_C_RANGE.0..=READING_C_RANGE.1).contains(&c)
                {
                    return Err(format!(
                        "the part's temperature must be between {:.0} and {:.0} C, not {c}",
                        READING_C_RANGE.0, READING_C_RANGE.1
                    ));
                }
                with(b, |_, m| {
                    m.reading_c = v;
                    Ok(())
                })
            },
        },
    },
    FieldSpec {
        label: "test frequency",
        hint: "kHz the inductances were read at; empty: none",
        read: |c| Some(opt(m(c).and_then(|m| m.frequency_khz), "kHz")),
        enter: Enter::Type {
            text: |c| Ok(num_text(m(c).and_then(|m| m.frequency_khz))),
            write: |b, _, t| {
                let v = positive(t)?;
                with(b, |_, m| {
                    m.frequency_khz = v;
                    Ok(())
                })
            },
        },
    },
    dcr!(0),
    dcr!(1),
    dcr!(2),
    dcr!(3),
    dcr!(4),
    dcr!(5),
    dcr!(6),
    dcr!(7),
    FieldSpec {
        label: "magnetising inductance",
        hint: "uH at the first primary, the others open; empty: none",
        read: |c| {
            first_primary(c.build)?;
            Some(opt(m(c).and_then(|m| m.magnetising_uh), "uH"))
        },
        enter: Enter::Type {
            text: |c| Ok(num_text(m(c).and_then(|m| m.magnetising_uh))),
            write: |b, _, t| {
                first_primary(b).ok_or("the build has no primary winding")?;
                let v = positive(t)?;
                if let (Some(lm), Some(l)) = (v, b.measured.as_ref().and_then(|m| m.leakage_uh))
                    && l >= lm
                {
                    return Err(leakage_not_below(l, lm));
                }
                with(b, |_, m| {
                    m.magnetising_uh = v;
                    Ok(())
                })
            },
        },
    },
    FieldSpec {
        label: "leakage inductance",
        hint: "uH at the first primary, the first secondary shorted; empty: none",
        read: |c| {
            first_primary(c.build)?;
            first_secondary(c.build)?;
            Some(opt(m(c).and_then(|m| m.leakage_uh), "uH"))
        },
        enter: Enter::Type {
            text: |c| Ok(num_text(m(c).and_then(|m| m.leakage_uh))),
            write: |b, _, t| {
                if first_primary(b).is_none() || first_secondary(b).is_none() {
                    return Err("the leakage is read at the first primary with the first \
                                secondary shorted; the build needs both"
                        .into());
                }
                let v = positive(t)?;
                if let (Some(l), Some(lm)) = (v, b.measured.as_ref().and_then(|m| m.magnetising_uh))
                    && l >= lm
                {
                    return Err(leakage_not_below(l, lm));
                }
                with(b, |_, m| {
                    m.leakage_uh = v;
                    Ok(())
                })
            },
        },
    },
    ratio!(0),
    ratio!(1),
    ratio!(2),
    ratio!(3),
    ratio!(4),
    ratio!(5),
    ratio!(6),
    ratio!(7),
    FieldSpec {
        label: "hipot result",
        hint: "in words, kept as a note (not judged); empty: none",
        read: |c| {
            Some(
                m(c).and_then(|m| m.hipot.clone())
                    .unwrap_or_else(|| "none".into()),
            )
        },
        enter: Enter::Type {
            text: |c| Ok(m(c).and_then(|m| m.hipot.clone()).unwrap_or_default()),
            write: |b, _, t| {
                let t = t.trim();
                with(b, |_, m| {
                    m.hipot = (!t.is_empty()).then(|| t.to_string());
                    Ok(())
                })
            },
        },
    },
    FieldSpec {
        label: "note",
        hint: "anything else written down at the bench; empty: none",
        read: |c| {
            Some(
                m(c).and_then(|m| m.note.clone())
                    .unwrap_or_else(|| "none".into()),
            )
        },
        enter: Enter::Type {
            text: |c| Ok(m(c).and_then(|m| m.note.clone()).unwrap_or_default()),
            write: |b, _, t| {
                let t = t.trim();
                with(b, |_, m| {
                    m.note = (!t.is_empty()).then(|| t.to_string());
                    Ok(())
                })
            },
        },
    },
    FieldSpec {
        label: "against the plan",
        hint: "",
        read: |c| {
            Some(if m(c).is_some_and(|m| !m.has_no_reading()) {
                "Enter: predicted vs measured".into()
            } else {
                "no reading to compare yet".into()
            })
        },
        enter: Enter::Act(|app, _| {
            if app
                .doc
                .build
                .measured
                .as_ref()
                .is_some_and(|m| !m.has_no_reading())
            {
                app.ui.overlays.push(Overlay::Readings { scroll: 0 });
            } else {
                app.info("no reading to compare yet: enter one above");
            }
        }),
    },
];

/// What an edit of field `field` is called in the status line and the undo history: the
/// per-winding rows name their winding.
pub fn edit_label(field: usize, b: &Build) -> String {
    let label = FIELDS.get(field).map_or("", |f| f.label);
    let name = |i: usize| b.windings.get(i).map(|w| w.name.to_string());
    if (FIRST_DCR..FIRST_DCR + SLOTS).contains(&field)
        && let Some(n) = name(field - FIRST_DCR)
    {
        format!("DC resistance of {n}")
    } else if (FIRST_RATIO..FIRST_RATIO + SLOTS).contains(&field)
        && let (Some(n), Some(p)) = (name(field - FIRST_RATIO), first_primary(b).and_then(name))
    {
        format!("voltage ratio {n} / {p}")
    } else {
        label.to_string()
    }
}
