//! The isolation form, `[isolation]`, with the cautions shown under it: one row to declare
//! it while the build has none.

use super::{Ctx, Enter, FieldSpec, num_text, opt, optional};
use crate::model::{Build, Isolation, IsolationClass};
use crate::tui::app::App;
use crate::tui::edit::Refusal;

/// The caution shown with an isolation class that protects against shock.
pub fn isolation_caution(class: IsolationClass) -> Option<&'static str> {
    match class {
        IsolationClass::Functional => None,
        IsolationClass::Basic => Some(
            "Caution: basic isolation is one level of protection against shock. Put tape \
             between the primary and the secondary side (enamel alone is not relied on), \
             keep margins at the flanges for the creepage distance, sleeve the leads that \
             cross a winding, and hipot test every part.",
        ),
        IsolationClass::Reinforced => Some(
            "Caution: mains isolation can kill. Reinforced isolation wants three layers of \
             tape between primary and secondary (any two passing the electric-strength \
             test), margin tape at both flanges for the creepage distance, sleeving on every \
             lead that crosses a winding, and a hipot test of every part.",
        ),
    }
}

/// Said under every isolation form: the plan certifies nothing.
pub const NO_SUBSTITUTE: &str = "This plan is no substitute for the applicable safety \
    standard, local codes and a qualified person's approval.";

fn iso<'a>(c: &Ctx<'a>) -> Option<&'a Isolation> {
    c.build.isolation.as_ref()
}

/// A positive figure, or none. The engine does not read these figures, so their sign is
/// checked here.
fn positive<'a>(b: &'a mut Build, t: &str) -> Result<(&'a mut Isolation, Option<f64>), Refusal> {
    let v = optional(t)?;
    if v.is_some_and(|v| v <= 0.0) {
        return Err("the working voltage and the creepage must be positive".into());
    }
    let iso = b.isolation.as_mut().ok_or("no isolation declared")?;
    Ok((iso, v))
}

/// The isolation form's fields.
pub static FIELDS: &[FieldSpec] = &[
    FieldSpec {
        label: "isolation",
        hint: "",
        read: |c| {
            iso(c)
                .is_none()
                .then(|| "none declared: Enter declares functional".into())
        },
        enter: Enter::Act(|app, _| {
            app.edit("declare isolation: functional", |b| {
                b.isolation = Some(Isolation {
                    class: IsolationClass::Functional,
                    working_voltage_v: None,
                    creepage_mm: None,
                });
                Ok(())
            });
        }),
    },
    FieldSpec {
        label: "class",
        hint: "",
        read: |c| iso(c).map(|i| i.class.key().into()),
        enter: Enter::Act(next_class),
    },
    FieldSpec {
        label: "working voltage (yours)",
        hint: "a positive number; empty: none",
        read: |c| iso(c).map(|i| opt(i.working_voltage_v, "V")),
        enter: Enter::Type {
            text: |c| Ok(num_text(iso(c).and_then(|i| i.working_voltage_v))),
            write: |b, _, t| {
                let (iso, v) = positive(b, t)?;
                iso.working_voltage_v = v;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "creepage (from the standard)",
        hint: "a positive number; empty: none",
        read: |c| iso(c).map(|i| opt(i.creepage_mm, "mm")),
        enter: Enter::Type {
            text: |c| Ok(num_text(iso(c).and_then(|i| i.creepage_mm))),
            write: |b, _, t| {
                let (iso, v) = positive(b, t)?;
                iso.creepage_mm = v;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "remove [isolation]",
        hint: "",
        read: |c| iso(c).map(|_| "Enter: no isolation checks".into()),
        enter: Enter::Act(|app: &mut App, _| {
            app.edit("remove the isolation declaration", |b| {
                b.isolation = None;
                Ok(())
            });
            app.clamp_form();
        }),
    },
];

fn next_class(app: &mut App, _: usize) {
    let Some(iso) = &app.doc.build.isolation else {
        return;
    };
    let all = IsolationClass::ALL;
    let i = all.iter().position(|&c| c == iso.class).unwrap_or(0);
    let next = all[(i + 1) % all.len()];
    app.edit(format!("isolation class: {}", next.key()), |b| {
        if let Some(iso) = &mut b.isolation {
            iso.class = next;
        }
        Ok(())
    });
}
