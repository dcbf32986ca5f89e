//! The forms of the tables a build may leave out: `[operating]`, `[material]` and
//! `[isolation]`. Rows, edits and the notes under each form; every edit goes through
//! `App::edit`, so the engine's validation has the last word. No figure is computed here.

use super::app::{App, Field, FormKind, Overlay, PickItem, PickPurpose, PickValue, Picker};
use super::edit;
use crate::library::materials::{self, GRADES};
use crate::model::{
    Build, Isolation, IsolationClass, Material, Operating, ResetSide, Role, Steinmetz,
};

type Rows = Vec<(Field, &'static str, String)>;

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
    }
}

fn grade_material(id: &str, gap_mm: Option<f64>) -> Option<Material> {
    let g = materials::find(id)?;
    Some(Material {
        grade: Some(g.id.to_string()),
        bsat_mt: g.bsat_mt,
        br_mt: g.br_mt,
        mu_i: Some(g.mu_i),
        steinmetz: Some(g.steinmetz),
        gap_mm,
    })
}

fn opt(v: Option<f64>, unit: &str) -> String {
    v.map_or("none".to_string(), |v| format!("{v} {unit}"))
}

/// What the line editor says under a field of these forms.
pub fn hint(f: Field) -> &'static str {
    match f {
        Field::OpDuty => "a fraction between 0 and 1, e.g. 0.45; empty: none",
        Field::OpRise | Field::OpSurface | Field::MatMuI | Field::MatGap => "a number; empty: none",
        Field::IsoVolts | Field::IsoCreepage => "a positive number; empty: none",
        Field::MatSteinmetz => "k alpha beta (P in kW/m3, f in kHz, B in T), e.g. 40 1.4 2.6",
        Field::OpResetTurns => "whole turns; the difference goes to its outermost section",
        _ => "",
    }
}

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

impl App {
    fn reset_winding(&self) -> Option<usize> {
        self.build
            .windings
            .iter()
            .position(|w| w.role == Role::Reset)
    }

    pub(super) fn operating_rows(&self) -> Rows {
        let Some(op) = &self.build.operating else {
            return vec![(
                Field::OpAdd,
                "operating point",
                "none: Enter adds one to edit".into(),
            )];
        };
        let side = match op.reset_side {
            ResetSide::Primary => "primary (clamps to the input)",
            ResetSide::Secondary => "secondary (returns it to the output)",
        };
        let reset = match self.reset_winding() {
            Some(k) => format!(
                "{} turns ({})",
                self.build.windings[k].turns, self.build.windings[k].name
            ),
            None => "no reset winding".into(),
        };
        vec![
            (Field::OpResetSide, "reset side", side.into()),
            (Field::OpResetTurns, "reset winding turns", reset),
            (
                Field::OpVinMin,
                "input voltage, lowest",
                format!("{} V", op.vin_min_v),
            ),
            (
                Field::OpVinMax,
                "input voltage, highest",
                format!("{} V", op.vin_max_v),
            ),
            (Field::OpVout, "output voltage", format!("{} V", op.vout_v)),
            (Field::OpIout, "output current", format!("{} A", op.iout_a)),
            (
                Field::OpDrop,
                "rectifier drop",
                format!("{} V", op.rectifier_drop_v),
            ),
            (
                Field::OpDuty,
                "controller duty limit",
                op.duty_limit.map_or("none".into(), |d| d.to_string()),
            ),
            (
                Field::OpRise,
                "temperature rise allowed",
                opt(op.rise_limit_c, "C"),
            ),
            (
                Field::OpSurface,
                "outer surface (else estimated)",
                opt(op.surface_area_cm2, "cm2"),
            ),
            (
                Field::OpRemove,
                "remove [operating]",
                "Enter: the build then has no converter figures".into(),
            ),
        ]
    }

    pub(super) fn material_rows(&self) -> Rows {
        let Some(m) = &self.build.material else {
            return vec![(
                Field::MatAdd,
                "core material",
                format!("none: Enter adds {}", GRADES[0].id),
            )];
        };
        let st = m.steinmetz.map_or("none".into(), |s| {
            format!("k {} alpha {} beta {}", s.k, s.alpha, s.beta)
        });
        vec![
            (
                Field::MatGrade,
                "grade",
                m.grade.clone().unwrap_or_else(|| "own figures".into()),
            ),
            (
                Field::MatBsat,
                "saturation flux",
                format!("{} mT", m.bsat_mt),
            ),
            (Field::MatBr, "remanent flux", format!("{} mT", m.br_mt)),
            (
                Field::MatMuI,
                "initial permeability",
                m.mu_i.map_or("none".into(), |v| v.to_string()),
            ),
            (Field::MatSteinmetz, "loss coefficients", st),
            (Field::MatGap, "air gap in the path", opt(m.gap_mm, "mm")),
            (
                Field::MatRemove,
                "remove [material]",
                "Enter: no flux headroom or core loss".into(),
            ),
        ]
    }

    pub(super) fn isolation_rows(&self) -> Rows {
        let Some(iso) = &self.build.isolation else {
            return vec![(
                Field::IsoAdd,
                "isolation",
                "none declared: Enter declares functional".into(),
            )];
        };
        vec![
            (Field::IsoClass, "class", iso.class.key().into()),
            (
                Field::IsoVolts,
                "working voltage (yours)",
                opt(iso.working_voltage_v, "V"),
            ),
            (
                Field::IsoCreepage,
                "creepage (from the standard)",
                opt(iso.creepage_mm, "mm"),
            ),
            (
                Field::IsoRemove,
                "remove [isolation]",
                "Enter: no isolation checks".into(),
            ),
        ]
    }

    /// Lines under a form: what the table changes, read from the Evaluation, and cautions.
    pub fn form_notes(&self, kind: FormKind) -> Vec<String> {
        match kind {
            FormKind::Operating => match (&self.build.operating, &self.eval.converter) {
                (None, _) => vec![
                    "It needs a switching frequency in the setup and a primary, a secondary \
                     and a reset winding."
                        .into(),
                ],
                (Some(_), Some(c)) => vec![format!(
                    "now: reset duty limit {:.1} %, switch voltage {:.1} V, duty needed at \
                     the lowest input {:.1} %",
                    c.reset_duty_limit * 100.0,
                    c.switch_voltage_v,
                    c.duty_needed_at_vin_min * 100.0
                )],
                (Some(_), None) => vec!["no converter figures for this build".into()],
            },
            FormKind::Material => self
                .build
                .material
                .as_ref()
                .and_then(|m| m.grade.as_deref())
                .and_then(materials::find)
                .map(|g| vec![g.description.to_string()])
                .unwrap_or_default(),
            FormKind::Isolation => {
                let mut v = Vec::new();
                if let Some(c) = self
                    .build
                    .isolation
                    .as_ref()
                    .and_then(|i| isolation_caution(i.class))
                {
                    v.push(c.to_string());
                }
                v.push(NO_SUBSTITUTE.to_string());
                v
            }
            FormKind::Bobbin => self.core_notes(),
            _ => Vec::new(),
        }
    }

    /// Fields these forms change without typing (add, remove, cycle, pick); true when done.
    pub(super) fn activate_more(&mut self, field: Field) -> bool {
        match field {
            Field::OpAdd => {
                self.edit("add an operating point", |b| {
                    b.operating = Some(starting_operating());
                    Ok(())
                });
            }
            Field::OpRemove => {
                self.edit("remove the operating point", |b| {
                    b.operating = None;
                    Ok(())
                });
                self.clamp_form();
            }
            Field::OpResetSide => {
                self.edit("reset side", |b| {
                    let op = b.operating.as_mut().ok_or("no operating point")?;
                    op.reset_side = match op.reset_side {
                        ResetSide::Primary => ResetSide::Secondary,
                        ResetSide::Secondary => ResetSide::Primary,
                    };
                    Ok(())
                });
            }
            Field::OpResetTurns if self.reset_winding().is_none() => {
                self.refuse("the build has no winding of role \"reset\"");
            }
            Field::MatAdd => {
                self.edit(format!("add material {}", GRADES[0].id), |b| {
                    b.material = grade_material(GRADES[0].id, None);
                    Ok(())
                });
            }
            Field::MatRemove => {
                self.edit("remove the material", |b| {
                    b.material = None;
                    Ok(())
                });
                self.clamp_form();
            }
            Field::MatGrade => self.open_grade_picker(),
            Field::IsoAdd => {
                self.edit("declare isolation: functional", |b| {
                    b.isolation = Some(Isolation {
                        class: IsolationClass::Functional,
                        working_voltage_v: None,
                        creepage_mm: None,
                    });
                    Ok(())
                });
            }
            Field::IsoRemove => {
                self.edit("remove the isolation declaration", |b| {
                    b.isolation = None;
                    Ok(())
                });
                self.clamp_form();
            }
            Field::IsoClass => {
                let Some(iso) = &self.build.isolation else {
                    return true;
                };
                let all = IsolationClass::ALL;
                let i = all.iter().position(|&c| c == iso.class).unwrap_or(0);
                let next = all[(i + 1) % all.len()];
                self.edit(format!("isolation class: {}", next.key()), |b| {
                    if let Some(iso) = &mut b.isolation {
                        iso.class = next;
                    }
                    Ok(())
                });
            }
            _ => return self.activate_core(field),
        }
        true
    }

    /// The selection of the open form stays on a row after rows went away.
    fn clamp_form(&mut self) {
        if let Some(Overlay::Form(f)) = self.overlays.last().cloned() {
            let n = self.form_rows(f.kind).len();
            if let Some(Overlay::Form(g)) = self.overlays.last_mut() {
                g.selected = f.selected.min(n.saturating_sub(1));
            }
        }
    }

    fn open_grade_picker(&mut self) {
        let now = self.build.material.as_ref().and_then(|m| m.grade.clone());
        let mut items: Vec<PickItem> = GRADES
            .iter()
            .map(|g| PickItem {
                label: format!(
                    "{:<16} {:>4} {:>4} {:>5}  {}",
                    g.id, g.bsat_mt, g.br_mt, g.mu_i, g.description
                ),
                value: PickValue::Grade(Some(g.id.to_string())),
            })
            .collect();
        items.push(PickItem {
            label: "own figures: keep the values, no grade".into(),
            value: PickValue::Grade(None),
        });
        let selected = items
            .iter()
            .position(|it| it.value == PickValue::Grade(now.clone()))
            .unwrap_or(0);
        self.overlays.push(Overlay::Picker(Picker {
            title: "ferrite grade (typical figures, from memory)".into(),
            header: format!(
                "{:<16} {:>4} {:>4} {:>5}  about",
                "grade", "Bsat", "Br", "mu_i"
            ),
            purpose: PickPurpose::Grade,
            items,
            selected,
            filter: String::new(),
        }));
    }

    /// A grade sets its typical figures (the gap stays); no grade keeps the figures.
    pub(super) fn set_grade(&mut self, grade: Option<String>) {
        let label = match &grade {
            Some(g) => format!("grade {g}"),
            None => "material: own figures".into(),
        };
        self.edit(label, |b| {
            let m = b.material.as_mut().ok_or("no material")?;
            match &grade {
                Some(id) => {
                    *m = grade_material(id, m.gap_mm).ok_or("unknown grade")?;
                }
                None => m.grade = None,
            }
            Ok(())
        });
    }

    pub(super) fn field_text_more(&self, field: Field) -> String {
        let b = &self.build;
        let num = |v: Option<f64>| v.map(|v| v.to_string()).unwrap_or_default();
        let op = b.operating.as_ref();
        let m = b.material.as_ref();
        let iso = b.isolation.as_ref();
        match field {
            Field::OpVinMin => num(op.map(|o| o.vin_min_v)),
            Field::OpVinMax => num(op.map(|o| o.vin_max_v)),
            Field::OpVout => num(op.map(|o| o.vout_v)),
            Field::OpIout => num(op.map(|o| o.iout_a)),
            Field::OpDrop => num(op.map(|o| o.rectifier_drop_v)),
            Field::OpDuty => num(op.and_then(|o| o.duty_limit)),
            Field::OpRise => num(op.and_then(|o| o.rise_limit_c)),
            Field::OpSurface => num(op.and_then(|o| o.surface_area_cm2)),
            Field::OpResetTurns => self
                .reset_winding()
                .map(|k| b.windings[k].turns.to_string())
                .unwrap_or_default(),
            Field::MatBsat => num(m.map(|m| m.bsat_mt)),
            Field::MatBr => num(m.map(|m| m.br_mt)),
            Field::MatMuI => num(m.and_then(|m| m.mu_i)),
            Field::MatGap => num(m.and_then(|m| m.gap_mm)),
            Field::MatSteinmetz => m
                .and_then(|m| m.steinmetz)
                .map(|s| format!("{} {} {}", s.k, s.alpha, s.beta))
                .unwrap_or_default(),
            Field::IsoVolts => num(iso.and_then(|i| i.working_voltage_v)),
            Field::IsoCreepage => num(iso.and_then(|i| i.creepage_mm)),
            _ => self.core_text(field),
        }
    }

    /// A typed value for a field of these forms; true when the field is one of theirs.
    pub(super) fn submit_more(&mut self, field: Field, t: &str) -> bool {
        let label = self
            .form_rows(field.form())
            .into_iter()
            .find(|(f, _, _)| *f == field)
            .map_or("value", |(_, l, _)| l);
        let none = t.is_empty() || t == "none";
        let number = t.trim().parse::<f64>().ok().filter(|v| v.is_finite());
        let shown = if none { "none" } else { t };
        let label = format!("{label}: {shown}");
        match field {
            Field::OpResetTurns => {
                let Some(k) = self.reset_winding() else {
                    self.refuse("the build has no winding of role \"reset\"");
                    return true;
                };
                match t.trim().parse::<u32>() {
                    Ok(n) => {
                        self.edit(label, |b| edit::set_winding_turns(b, k, n));
                    }
                    Err(_) => self.refuse(format!("\"{t}\" is not a whole number of turns")),
                }
            }
            Field::MatSteinmetz => {
                let nums: Vec<Option<f64>> = t
                    .split(|c: char| c.is_whitespace() || c == ',')
                    .filter(|s| !s.is_empty())
                    .map(|s| s.parse::<f64>().ok().filter(|v| v.is_finite()))
                    .collect();
                let st = match nums.as_slice() {
                    [] => None,
                    [Some(k), Some(alpha), Some(beta)] => Some(Steinmetz {
                        k: *k,
                        alpha: *alpha,
                        beta: *beta,
                    }),
                    _ => {
                        self.refuse(format!("\"{t}\" is not three numbers: k alpha beta"));
                        return true;
                    }
                };
                self.edit(label, |b| {
                    b.material.as_mut().ok_or("no material")?.steinmetz = st;
                    Ok(())
                });
            }
            Field::OpDuty
            | Field::OpRise
            | Field::OpSurface
            | Field::MatMuI
            | Field::MatGap
            | Field::IsoVolts
            | Field::IsoCreepage
                if none =>
            {
                self.edit(label, |b| set_optional(b, field, None));
            }
            Field::OpVinMin
            | Field::OpVinMax
            | Field::OpVout
            | Field::OpIout
            | Field::OpDrop
            | Field::OpDuty
            | Field::OpRise
            | Field::OpSurface
            | Field::MatBsat
            | Field::MatBr
            | Field::MatMuI
            | Field::MatGap
            | Field::IsoVolts
            | Field::IsoCreepage => match number {
                Some(v) => {
                    self.edit(label, |b| set_optional(b, field, Some(v)));
                }
                None => self.refuse(format!("\"{t}\" is not a number")),
            },
            _ => return self.submit_core(field, t),
        }
        true
    }
}

/// Set a figure of `[operating]`, `[material]` or `[isolation]` (`None` clears an optional
/// one). The engine checks the ranges of the first two; it does not read the isolation
/// figures, so their sign is checked here.
fn set_optional(b: &mut Build, field: Field, v: Option<f64>) -> Result<(), edit::Refusal> {
    if matches!(field, Field::IsoVolts | Field::IsoCreepage) {
        if v.is_some_and(|v| v <= 0.0) {
            return Err("the working voltage and the creepage must be positive".into());
        }
        let iso = b.isolation.as_mut().ok_or("no isolation declared")?;
        match field {
            Field::IsoVolts => iso.working_voltage_v = v,
            _ => iso.creepage_mm = v,
        }
        return Ok(());
    }
    if field.form() == FormKind::Material {
        let m = b.material.as_mut().ok_or("no material")?;
        match field {
            Field::MatBsat => m.bsat_mt = v.unwrap_or(m.bsat_mt),
            Field::MatBr => m.br_mt = v.unwrap_or(m.br_mt),
            Field::MatMuI => m.mu_i = v,
            _ => m.gap_mm = v,
        }
        return Ok(());
    }
    let op = b.operating.as_mut().ok_or("no operating point")?;
    let req = |old: f64| v.unwrap_or(old);
    match field {
        Field::OpVinMin => op.vin_min_v = req(op.vin_min_v),
        Field::OpVinMax => op.vin_max_v = req(op.vin_max_v),
        Field::OpVout => op.vout_v = req(op.vout_v),
        Field::OpIout => op.iout_a = req(op.iout_a),
        Field::OpDrop => op.rectifier_drop_v = req(op.rectifier_drop_v),
        Field::OpDuty => op.duty_limit = v,
        Field::OpRise => op.rise_limit_c = v,
        _ => op.surface_area_cm2 = v,
    }
    Ok(())
}
