//! The operating-point form, `[operating]`: one row to add it while the build has none.

use super::{Ctx, Enter, FieldSpec, num_text, number, opt, opt_or_default, optional, parse_u32};
use crate::model::{Build, Operating, ResetSide, Role};
use crate::tui::app::App;
use crate::tui::edit::{self, Refusal};

/// Starting figures for a new operating point: a 24 V rail giving 5 V, to be edited.
fn starting_operating() -> Operating {
    Operating {
        reset_side: ResetSide::Primary,
        vin_min_v: 20.0,
        vin_max_v: 28.0,
        vout_v: 5.0,
        iout_a: 1.0,
        rectifier_drop_v: 0.5,
        duty_limit: Some(0.45),
        rise_limit_c: None,
        surface_area_cm2: None,
        switch_drop_v: 0.0,
        ambient_c: None,
        switch_rating_v: None,
        outputs: Vec::new(),
    }
}

fn op<'a>(c: &Ctx<'a>) -> Option<&'a Operating> {
    c.build.operating.as_ref()
}

fn op_mut(b: &mut Build) -> Result<&mut Operating, Refusal> {
    b.operating
        .as_mut()
        .ok_or_else(|| "no operating point".into())
}

/// The reset winding (the first of role reset).
pub(crate) fn reset_winding(b: &Build) -> Option<usize> {
    b.windings.iter().position(|w| w.role == Role::Reset)
}

const NO_RESET: &str = "the build has no winding of role \"reset\"";

/// A required figure of `[operating]`: its label, unit, and where it lives.
macro_rules! required {
    ($label:expr, $unit:expr, $field:ident) => {
        FieldSpec {
            label: $label,
            hint: "",
            read: |c| op(c).map(|o| format!("{} {}", o.$field, $unit)),
            enter: Enter::Type {
                text: |c| Ok(num_text(op(c).map(|o| o.$field))),
                write: |b, _, t| {
                    let v = number(t)?;
                    let o = op_mut(b)?;
                    o.$field = v;
                    // The regulated output's figures live in the first [[output]] too.
                    o.sync_outputs();
                    Ok(())
                },
            },
        }
    };
}

/// An optional figure of `[operating]`: empty or "none" clears it.
macro_rules! optional_field {
    ($label:expr, $hint:expr, $show:expr, $field:ident) => {
        FieldSpec {
            label: $label,
            hint: $hint,
            read: |c| op(c).map(|o| $show(o.$field)),
            enter: Enter::Type {
                text: |c| Ok(num_text(op(c).and_then(|o| o.$field))),
                write: |b, _, t| {
                    let v = optional(t)?;
                    op_mut(b)?.$field = v;
                    Ok(())
                },
            },
        }
    };
}

/// The operating-point form's fields.
pub static FIELDS: &[FieldSpec] = &[
    FieldSpec {
        label: "operating point",
        hint: "",
        read: |c| {
            op(c)
                .is_none()
                .then(|| "none: Enter adds one to edit".into())
        },
        enter: Enter::Act(|app, _| {
            app.edit("add an operating point", |b| {
                b.operating = Some(starting_operating());
                Ok(())
            });
        }),
    },
    FieldSpec {
        label: "reset side",
        hint: "",
        read: |c| {
            op(c).map(|o| {
                match o.reset_side {
                    ResetSide::Primary => "primary (clamps to the input)",
                    ResetSide::Secondary => "secondary (returns it to the output)",
                }
                .into()
            })
        },
        enter: Enter::Act(|app, _| {
            app.edit("reset side", |b| {
                let op = op_mut(b)?;
                op.reset_side = match op.reset_side {
                    ResetSide::Primary => ResetSide::Secondary,
                    ResetSide::Secondary => ResetSide::Primary,
                };
                Ok(())
            });
        }),
    },
    FieldSpec {
        label: "reset winding turns",
        hint: "whole turns; the difference goes to its outermost section",
        read: |c| {
            op(c)?;
            Some(match reset_winding(c.build) {
                Some(k) => format!(
                    "{} turns ({})",
                    c.build.windings[k].turns, c.build.windings[k].name
                ),
                None => "no reset winding".into(),
            })
        },
        enter: Enter::Type {
            text: |c| match reset_winding(c.build) {
                Some(k) => Ok(c.build.windings[k].turns.to_string()),
                None => Err(NO_RESET.into()),
            },
            write: |b, _, t| {
                let k = reset_winding(b).ok_or(NO_RESET)?;
                let n = parse_u32(t)
                    .ok_or_else(|| format!("\"{t}\" is not a whole number of turns"))?;
                edit::set_winding_turns(b, k, n)
            },
        },
    },
    required!("input voltage, lowest", "V", vin_min_v),
    required!("input voltage, highest", "V", vin_max_v),
    required!("output voltage", "V", vout_v),
    required!("output current", "A", iout_a),
    required!("rectifier drop", "V", rectifier_drop_v),
    optional_field!(
        "controller duty limit",
        "a fraction between 0 and 1, e.g. 0.45; empty: none",
        |d: Option<f64>| d.map_or("none".into(), |d| d.to_string()),
        duty_limit
    ),
    optional_field!(
        "switch voltage rating",
        "the switch's rated off-state voltage in V; empty: none",
        |v| opt(v, "V"),
        switch_rating_v
    ),
    optional_field!(
        "temperature rise allowed",
        "a number in C; empty: the default",
        |v| opt_or_default(v, "C", crate::engine::thermal::DEFAULT_RISE_LIMIT_C),
        rise_limit_c
    ),
    optional_field!(
        "ambient air",
        "the air around the part in C; empty: the default",
        |v| opt_or_default(v, "C", crate::engine::thermal::DEFAULT_AMBIENT_C),
        ambient_c
    ),
    optional_field!(
        "outer surface (else estimated)",
        "a number; empty: none",
        |v| opt(v, "cm2"),
        surface_area_cm2
    ),
    FieldSpec {
        label: "remove [operating]",
        hint: "",
        read: |c| op(c).map(|_| "Enter: the build then has no converter figures".into()),
        enter: Enter::Act(|app: &mut App, _| {
            app.edit("remove the operating point", |b| {
                b.operating = None;
                Ok(())
            });
            app.clamp_form();
        }),
    },
];
