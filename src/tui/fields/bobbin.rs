//! The measured-bobbin form: the bobbin's window and tube (edits of the build) and the
//! core's readings (kept in the draft until applied).

use super::{Ctx, Enter, FieldSpec, number};
use crate::model::Tube;
use crate::tui::app::App;
use crate::tui::core_form::{CoreDraft, LegShape};

/// A draft reading with its unit, or "-".
fn reading(v: Option<f64>, unit: &str) -> String {
    v.map_or("-".to_string(), |v| format!("{v} {unit}"))
}

/// A draft reading as the text to edit.
fn reading_text(v: Option<f64>) -> String {
    v.map(|v| v.to_string()).unwrap_or_default()
}

/// A positive reading; empty clears it.
fn positive(t: &str) -> Result<Option<f64>, String> {
    match t.parse::<f64>() {
        _ if t.is_empty() => Ok(None),
        Ok(v) if v.is_finite() && v > 0.0 => Ok(Some(v)),
        _ => Err(format!("\"{t}\" is not a positive number")),
    }
}

/// The rectangular tube's width, depth and corner radius.
fn rect(c: &Ctx) -> Option<(f64, f64, f64)> {
    match c.build.bobbin.tube {
        Tube::Rect {
            width_mm,
            depth_mm,
            corner_radius_mm,
        } => Some((width_mm, depth_mm, corner_radius_mm)),
        Tube::Round { .. } => None,
    }
}

/// The round tube's diameter.
fn round(c: &Ctx) -> Option<f64> {
    match c.build.bobbin.tube {
        Tube::Round { diameter_mm } => Some(diameter_mm),
        Tube::Rect { .. } => None,
    }
}

/// Set one figure of a rectangular tube (the tube is not rectangular: no change).
fn set_rect(
    b: &mut crate::model::Build,
    t: &str,
    which: fn(&mut Tube) -> Option<&mut f64>,
) -> Result<(), String> {
    let v = number(t)?;
    if let Some(slot) = which(&mut b.bobbin.tube) {
        *slot = v;
    }
    Ok(())
}

/// The measured-bobbin form's fields.
pub static FIELDS: &[FieldSpec] = &[
    FieldSpec {
        label: "name",
        hint: "",
        read: |c| Some(c.build.bobbin.name.clone()),
        enter: Enter::Type {
            text: |c| Ok(c.build.bobbin.name.clone()),
            write: |b, _, t| {
                b.bobbin.name = t.to_string();
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "window width (flange to flange)",
        hint: "",
        read: |c| Some(format!("{} mm", c.build.bobbin.window.width_mm)),
        enter: Enter::Type {
            text: |c| Ok(c.build.bobbin.window.width_mm.to_string()),
            write: |b, _, t| {
                b.bobbin.window.width_mm = number(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "window height (tube to limit)",
        hint: "",
        read: |c| Some(format!("{} mm", c.build.bobbin.window.height_mm)),
        enter: Enter::Type {
            text: |c| Ok(c.build.bobbin.window.height_mm.to_string()),
            write: |b, _, t| {
                b.bobbin.window.height_mm = number(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "tube shape",
        hint: "",
        read: |c| {
            Some(
                if rect(c).is_some() {
                    "rectangular"
                } else {
                    "round"
                }
                .into(),
            )
        },
        enter: Enter::Act(toggle_tube),
    },
    FieldSpec {
        label: "tube width",
        hint: "",
        read: |c| rect(c).map(|(w, _, _)| format!("{w} mm")),
        enter: Enter::Type {
            text: |c| Ok(rect(c).map(|(w, _, _)| w.to_string()).unwrap_or_default()),
            write: |b, _, t| {
                set_rect(b, t, |tube| match tube {
                    Tube::Rect { width_mm, .. } => Some(width_mm),
                    Tube::Round { .. } => None,
                })
            },
        },
    },
    FieldSpec {
        label: "tube depth",
        hint: "",
        read: |c| rect(c).map(|(_, d, _)| format!("{d} mm")),
        enter: Enter::Type {
            text: |c| Ok(rect(c).map(|(_, d, _)| d.to_string()).unwrap_or_default()),
            write: |b, _, t| {
                set_rect(b, t, |tube| match tube {
                    Tube::Rect { depth_mm, .. } => Some(depth_mm),
                    Tube::Round { .. } => None,
                })
            },
        },
    },
    FieldSpec {
        label: "tube corner radius",
        hint: "",
        read: |c| rect(c).map(|(_, _, r)| format!("{r} mm")),
        enter: Enter::Type {
            text: |c| Ok(rect(c).map(|(_, _, r)| r.to_string()).unwrap_or_default()),
            write: |b, _, t| {
                set_rect(b, t, |tube| match tube {
                    Tube::Rect {
                        corner_radius_mm, ..
                    } => Some(corner_radius_mm),
                    Tube::Round { .. } => None,
                })
            },
        },
    },
    FieldSpec {
        label: "tube diameter",
        hint: "",
        read: |c| round(c).map(|d| format!("{d} mm")),
        enter: Enter::Type {
            text: |c| Ok(round(c).map(|d| d.to_string()).unwrap_or_default()),
            write: |b, _, t| {
                let v = number(t)?;
                if let Tube::Round { diameter_mm } = &mut b.bobbin.tube {
                    *diameter_mm = v;
                }
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "centre leg",
        hint: "",
        read: |c| {
            Some(
                match c.draft.leg_shape {
                    LegShape::NotGiven => "not measured (Enter: rectangular, round)",
                    LegShape::Rect => "rectangular",
                    LegShape::Round => "round",
                }
                .into(),
            )
        },
        enter: Enter::Act(|app, _| {
            let d = &mut app.ui.core_draft;
            d.leg_shape = match d.leg_shape {
                LegShape::NotGiven => LegShape::Rect,
                LegShape::Rect => LegShape::Round,
                LegShape::Round => LegShape::NotGiven,
            };
        }),
    },
    FieldSpec {
        label: "leg width",
        hint: "",
        read: |c| {
            (c.draft.leg_shape == LegShape::Rect).then(|| reading(c.draft.leg_width_mm, "mm"))
        },
        enter: Enter::Draft {
            text: |d| reading_text(d.leg_width_mm),
            write: |d, t| {
                d.leg_width_mm = positive(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "leg depth",
        hint: "",
        read: |c| {
            (c.draft.leg_shape == LegShape::Rect).then(|| reading(c.draft.leg_depth_mm, "mm"))
        },
        enter: Enter::Draft {
            text: |d| reading_text(d.leg_depth_mm),
            write: |d, t| {
                d.leg_depth_mm = positive(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "leg diameter",
        hint: "",
        read: |c| {
            (c.draft.leg_shape == LegShape::Round).then(|| reading(c.draft.leg_diameter_mm, "mm"))
        },
        enter: Enter::Draft {
            text: |d| reading_text(d.leg_diameter_mm),
            write: |d, t| {
                d.leg_diameter_mm = positive(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "le, magnetic path",
        hint: "",
        read: |c| Some(reading(c.draft.le_mm, "mm")),
        enter: Enter::Draft {
            text: |d| reading_text(d.le_mm),
            write: |d, t| {
                d.le_mm = positive(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "test winding turns N",
        hint: "",
        read: |c| Some(c.draft.test_turns.map_or("-".into(), |n| n.to_string())),
        enter: Enter::Draft {
            text: |d| d.test_turns.map(|n| n.to_string()).unwrap_or_default(),
            write: |d: &mut CoreDraft, t| {
                d.test_turns = match t.parse::<u32>() {
                    _ if t.is_empty() => None,
                    Ok(n) if n > 0 => Some(n),
                    _ => {
                        return Err(format!(
                            "\"{t}\" is not a whole number of turns (1 or more)"
                        ));
                    }
                };
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "test winding measured L",
        hint: "",
        read: |c| Some(reading(c.draft.test_uh, "uH")),
        enter: Enter::Draft {
            text: |d| reading_text(d.test_uh),
            write: |d, t| {
                d.test_uh = positive(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "material mu_i",
        hint: "",
        read: |c| Some(c.draft.mu_i.map_or("-".into(), |v| v.to_string())),
        enter: Enter::Draft {
            text: |d| reading_text(d.mu_i),
            write: |d, t| {
                d.mu_i = positive(t)?;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "apply the core to the bobbin",
        hint: "",
        read: |_| Some("Enter (u undoes)".into()),
        enter: Enter::Act(|app, _| app.apply_core()),
    },
    FieldSpec {
        label: "save the bobbin to your folder",
        hint: "",
        read: |_| Some("Enter: asks for its id".into()),
        enter: Enter::Act(|app, _| app.ask_bobbin_id()),
    },
];

fn toggle_tube(app: &mut App, _: usize) {
    let tube = match app.doc.build.bobbin.tube {
        Tube::Rect { width_mm, .. } => Tube::Round {
            diameter_mm: width_mm,
        },
        Tube::Round { diameter_mm } => Tube::Rect {
            width_mm: diameter_mm,
            depth_mm: diameter_mm,
            corner_radius_mm: 0.0,
        },
    };
    app.edit("tube shape", |b| {
        b.bobbin.tube = tube;
        Ok(())
    });
}
