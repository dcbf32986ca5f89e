//! The setup form: the title and `[setup]`.

use super::{Enter, FieldSpec, num_text, number, opt, optional};

/// The setup form's fields.
pub static FIELDS: &[FieldSpec] = &[
    FieldSpec {
        label: "title",
        hint: "",
        read: |c| Some(c.build.title.clone()),
        enter: Enter::Type {
            text: |c| Ok(c.build.title.clone()),
            write: |b, _, t| {
                b.title = t.to_string();
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "winding temperature",
        hint: "",
        read: |c| {
            Some(if c.build.setup.temperature_given {
                format!("{} C", c.build.setup.temperature_c)
            } else {
                "ambient + rise".into()
            })
        },
        enter: Enter::Type {
            text: |c| Ok(c.build.setup.temperature_c.to_string()),
            write: |b, _, t| {
                b.setup.temperature_c = number(t)?;
                // A temperature typed in wins over the one solved from ambient + rise.
                b.setup.temperature_given = true;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "hand-winding allowance",
        hint: "",
        read: |c| Some(format!("x {}", c.build.setup.allowance_factor)),
        enter: Enter::Type {
            text: |c| Ok(c.build.setup.allowance_factor.to_string()),
            write: |b, _, t| {
                b.setup.allowance_factor = number(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "margin tape at each flange",
        hint: "",
        read: |c| Some(format!("{} mm", c.build.setup.margin_mm)),
        enter: Enter::Type {
            text: |c| Ok(c.build.setup.margin_mm.to_string()),
            write: |b, _, t| {
                b.setup.margin_mm = number(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "tape thickness per wrap",
        hint: "",
        read: |c| Some(format!("{} mm", c.build.setup.tape_mm)),
        enter: Enter::Type {
            text: |c| Ok(c.build.setup.tape_mm.to_string()),
            write: |b, _, t| {
                b.setup.tape_mm = number(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "switching frequency",
        hint: "a number; empty: none",
        read: |c| Some(opt(c.build.setup.frequency_khz, "kHz")),
        enter: Enter::Type {
            text: |c| Ok(num_text(c.build.setup.frequency_khz)),
            write: |b, _, t| {
                b.setup.frequency_khz = optional(t)?;
                Ok(())
            },
        },
    },
];
