//! The "from requirements" form: what a user knows of the converter before any turns (one
//! output; a converter with several goes in a requirements file), then a row that runs the
//! design over the planner's bobbin library.

use super::{Ctx, Enter, FieldSpec, number, opt, optional};
use crate::library::materials::FERRITES;
use crate::model::Requirements;
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
        "V; one output here (several: a requirements file)",
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
        |r| opt(r.operating.rise_limit_c, "C"),
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
        |r| opt(r.operating.ambient_c, "C"),
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
