//! The "from requirements" form: what a user knows of the converter before any turns (one
//! or two outputs; a converter with more goes in a requirements file), then a row that runs
//! the design over the planner's bobbin library.

use super::{Ctx, Enter, FieldSpec, num_text, number, opt, opt_or_default, optional};
use crate::library::materials::FERRITES;
use crate::model::{Operating, Output, Requirements};
use crate::tui::app::{App, Effect};
use crate::tui::edit::Refusal;

fn needs<'a>(c: &Ctx<'a>) -> Option<&'a Requirements> {
    c.needs
}

/// A number above zero, or the refusal.
fn positive(t: &str) -> Result<f64, Refusal> {
    let v = number(t)?;
    if v > 0.0 {
        Ok(v)
    } else {
        Err(format!("expected a number above 0, got {v}"))
    }
}

/// A share between 0 and 1 (`top_ok`: 1 itself allowed).
fn share(t: &str, top_ok: bool) -> Result<f64, Refusal> {
    let v = number(t)?;
    if v > 0.0 && (v < 1.0 || (top_ok && v == 1.0)) {
        Ok(v)
    } else {
        Err(format!("expected a fraction between 0 and 1, got {v}"))
    }
}

/// A typed figure of the requirements: label, hint, how it shows, the text to edit, and how
/// it is written.
macro_rules! need {
    ($label:expr, $hint:expr, $show:expr, $text:expr, $write:expr) => {
        FieldSpec {
            label: $label,
            hint: $hint,
            read: |c| needs(c).map($show),
            enter: Enter::Need {
                text: $text,
                write: $write,
            },
        }
    };
}

/// A second output of `vout_v`: the one-output shorthand becomes two `[[output]]`s (the
/// regulated one on S, the new one on S2, at a tenth of the regulated current until the
/// user types its own); with two already, the second takes the voltage.
fn set_second_output(op: &mut Operating, vout_v: f64) {
    if let Some(o) = op.outputs.get_mut(1) {
        o.vout_v = vout_v;
        return;
    }
    if op.outputs.is_empty() {
        op.outputs.push(Output {
            winding: "S".into(),
            vout_v: op.vout_v,
            iout_a: op.iout_a,
            rectifier_drop_v: None,
        });
    }
    let taken = |n: &str| op.outputs.iter().any(|o| o.winding == n);
    let name = ["S2", "S3", "SEC2"]
        .into_iter()
        .find(|n| !taken(n))
        .unwrap_or("S2");
    op.outputs.push(Output {
        winding: name.into(),
        vout_v,
        iout_a: 0.1 * op.iout_a,
        rectifier_drop_v: None,
    });
}

/// No second output: it goes, and a lone regulated output made by the form (on S, with
/// the shared rectifier drop) turns back into the one-output shorthand.
fn drop_second_output(op: &mut Operating) {
    if op.outputs.len() > 1 {
        op.outputs.remove(1);
    }
    if let [o] = op.outputs.as_slice()
        && o.winding == "S"
        && o.rectifier_drop_v.is_none()
    {
        op.outputs.clear();
    }
}

/// The next bundled ferrite after the one the requirements name.
fn next_ferrite(app: &mut App, _: usize) {
    let Some(r) = app.ui.needs.as_mut() else {
        return;
    };
    let now = FERRITES
        .iter()
        .position(|g| r.material.ferrite.as_deref() == Some(g.id));
    let next = &FERRITES[now.map_or(0, |i| (i + 1) % FERRITES.len())];
    if let Some(m) = super::material::ferrite_material(next.id, None) {
        r.material = m;
    }
    app.ui.design_note = None;
}

/// The requirements form's fields.
pub static FIELDS: &[FieldSpec] = &[
    need!(
        "input voltage, lowest",
        "V; where the duty is highest",
        |r| format!("{} V", r.operating.vin_min_v),
        |r| r.operating.vin_min_v.to_string(),
        |r, t| {
            r.operating.vin_min_v = positive(t)?;
            Ok(())
        }
    ),
    need!(
        "input voltage, highest",
        "V; where the switch sees the most",
        |r| format!("{} V", r.operating.vin_max_v),
        |r| r.operating.vin_max_v.to_string(),
        |r, t| {
            r.operating.vin_max_v = positive(t)?;
            Ok(())
        }
    ),
    need!(
        "output voltage",
        "V; the regulated output",
        |r| format!("{} V", r.operating.vout_v),
        |r| r.operating.vout_v.to_string(),
        |r, t| {
            let v = positive(t)?;
            let i = r.operating.iout_a;
            r.operating.set_regulated(v, i);
            Ok(())
        }
    ),
    need!(
        "output current",
        "A, the full load",
        |r| format!("{} A", r.operating.iout_a),
        |r| r.operating.iout_a.to_string(),
        |r, t| {
            let i = positive(t)?;
            let v = r.operating.vout_v;
            r.operating.set_regulated(v, i);
            Ok(())
        }
    ),
    need!(
        "second output voltage",
        "V, its own secondary S2; empty: one output (more: a requirements file)",
        |r| opt(r.operating.outputs.get(1).map(|o| o.vout_v), "V"),
        |r| num_text(r.operating.outputs.get(1).map(|o| o.vout_v)),
        |r, t| {
            match optional(t)? {
                Some(v) if v > 0.0 => set_second_output(&mut r.operating, v),
                Some(v) => return Err(format!("expected a number above 0, got {v}")),
                None => drop_second_output(&mut r.operating),
            }
            Ok(())
        }
    ),
    need!(
        "second output current",
        "A, the second output's full load",
        |r| opt(r.operating.outputs.get(1).map(|o| o.iout_a), "A"),
        |r| num_text(r.operating.outputs.get(1).map(|o| o.iout_a)),
        |r, t| {
            let i = positive(t)?;
            match r.operating.outputs.get_mut(1) {
                Some(o) => o.iout_a = i,
                None => return Err("give the second output's voltage first".into()),
            }
            Ok(())
        }
    ),
    need!(
        "rectifier drop",
        "V; about 0.5 for Schottky rectifiers",
        |r| format!("{} V", r.operating.rectifier_drop_v),
        |r| r.operating.rectifier_drop_v.to_string(),
        |r, t| {
            let v = number(t)?;
            if v < 0.0 {
                return Err(format!("a drop cannot be negative, got {v}"));
            }
            r.operating.rectifier_drop_v = v;
            Ok(())
        }
    ),
    need!(
        "switching frequency",
        "kHz",
        |r| opt(r.setup.frequency_khz, "kHz"),
        |r| r
            .setup
            .frequency_khz
            .map(|f| f.to_string())
            .unwrap_or_default(),
        |r, t| {
            r.setup.frequency_khz = Some(positive(t)?);
            Ok(())
        }
    ),
    need!(
        "controller duty limit",
        "the controller's largest duty, a fraction, e.g. 0.45",
        |r| r
            .operating
            .duty_limit
            .map_or("none".into(), |d| d.to_string()),
        |r| r
            .operating
            .duty_limit
            .map(|d| d.to_string())
            .unwrap_or_default(),
        |r, t| {
            r.operating.duty_limit = Some(share(t, false)?);
            Ok(())
        }
    ),
    need!(
        "switch voltage rating",
        "V, the switch's rated off-state voltage",
        |r| format!("{} V", r.switch.voltage_rating_v),
        |r| r.switch.voltage_rating_v.to_string(),
        |r, t| {
            let v = positive(t)?;
            r.switch.voltage_rating_v = v;
            r.operating.switch_rating_v = Some(v);
            Ok(())
        }
    ),
    need!(
        "switch derating",
        "share of the rating the off-state voltage may use before the spike; 0.8 is usual",
        |r| format!("{}", r.switch.derating),
        |r| r.switch.derating.to_string(),
        |r, t| {
            r.switch.derating = share(t, true)?;
            Ok(())
        }
    ),
    FieldSpec {
        label: "core material",
        hint: "",
        read: |c| {
            needs(c).map(|r| {
                format!(
                    "{} (Enter: next grade)",
                    r.material.ferrite.as_deref().unwrap_or("own figures")
                )
            })
        },
        enter: Enter::Act(next_ferrite),
    },
    need!(
        "temperature rise allowed",
        "C; empty: the engine's default",
        |r| opt_or_default(
            r.operating.rise_limit_c,
            "C",
            crate::engine::thermal::DEFAULT_RISE_LIMIT_C
        ),
        |r| r
            .operating
            .rise_limit_c
            .map(|v| v.to_string())
            .unwrap_or_default(),
        |r, t| {
            r.operating.rise_limit_c = optional(t)?;
            Ok(())
        }
    ),
    need!(
        "ambient",
        "C, the air around the part; empty: the engine's default",
        |r| opt_or_default(
            r.operating.ambient_c,
            "C",
            crate::engine::thermal::DEFAULT_AMBIENT_C
        ),
        |r| r
            .operating
            .ambient_c
            .map(|v| v.to_string())
            .unwrap_or_default(),
        |r, t| {
            r.operating.ambient_c = optional(t)?;
            Ok(())
        }
    ),
    need!(
        "bobbins to try",
        "ids separated by commas; empty: every bobbin with core figures",
        |r| r
            .bobbins
            .as_ref()
            .map_or("every one with core figures".into(), |b| b.join(", ")),
        |r| r.bobbins.as_ref().map(|b| b.join(", ")).unwrap_or_default(),
        |r, t| {
            let ids: Vec<String> = t
                .split([',', ' '])
                .filter(|s| !s.is_empty())
                .map(String::from)
                .collect();
            r.bobbins = (!ids.is_empty()).then_some(ids);
            Ok(())
        }
    ),
    FieldSpec {
        label: "design",
        hint: "",
        read: |c| needs(c).map(|_| "Enter: design on these requirements".into()),
        enter: Enter::Start(|app| app.ask_design()),
    },
];

impl App {
    /// The design row: the requirements as typed, checked, for the loop to start the design.
    pub(crate) fn ask_design(&mut self) -> Option<Effect> {
        let req = self.ui.needs.clone()?;
        if let Some(p) = crate::files::requirements_problems(&req).first() {
            self.refuse(p.clone());
            return None;
        }
        if req.operating.vin_min_v > req.operating.vin_max_v {
            self.refuse("the lowest input is above the highest");
            return None;
        }
        Some(Effect::Design(Box::new(req)))
    }
}
