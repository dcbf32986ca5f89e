//! The core-material form, `[material]`: one row to add it while the build has none.

use super::{Ctx, Enter, FieldSpec, num_text, number, opt, optional};
use crate::library::materials::{self, FERRITES};
use crate::model::{Build, Material, Steinmetz};
use crate::tui::app::App;
use crate::tui::edit::Refusal;

/// A bundled ferrite's typical figures as a material, with the gap given.
pub(crate) fn ferrite_material(id: &str, gap_mm: Option<f64>) -> Option<Material> {
    let g = materials::find(id)?;
    Some(Material {
        ferrite: Some(g.id.to_string()),
        bsat_mt: g.bsat_mt,
        br_mt: g.br_mt,
        mu_i: Some(g.mu_i),
        steinmetz: Some(g.steinmetz),
        gap_mm,
    })
}

fn mat<'a>(c: &Ctx<'a>) -> Option<&'a Material> {
    c.build.material.as_ref()
}

fn mat_mut(b: &mut Build) -> Result<&mut Material, Refusal> {
    b.material.as_mut().ok_or_else(|| "no material".into())
}

/// The material form's fields.
pub static FIELDS: &[FieldSpec] = &[
    FieldSpec {
        label: "core material",
        hint: "",
        read: |c| {
            mat(c)
                .is_none()
                .then(|| format!("none: Enter adds {}", FERRITES[0].id))
        },
        enter: Enter::Act(|app, _| {
            app.edit(format!("add material {}", FERRITES[0].id), |b| {
                b.material = ferrite_material(FERRITES[0].id, None);
                Ok(())
            });
        }),
    },
    FieldSpec {
        label: "grade",
        hint: "",
        read: |c| mat(c).map(|m| m.ferrite.clone().unwrap_or_else(|| "own figures".into())),
        enter: Enter::Act(|app, _| app.open_ferrite_picker()),
    },
    FieldSpec {
        label: "saturation flux",
        hint: "",
        read: |c| mat(c).map(|m| format!("{} mT", m.bsat_mt)),
        enter: Enter::Type {
            text: |c| Ok(num_text(mat(c).map(|m| m.bsat_mt))),
            write: |b, _, t| {
                let v = number(t)?;
                mat_mut(b)?.bsat_mt = v;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "remanent flux",
        hint: "",
        read: |c| mat(c).map(|m| format!("{} mT", m.br_mt)),
        enter: Enter::Type {
            text: |c| Ok(num_text(mat(c).map(|m| m.br_mt))),
            write: |b, _, t| {
                let v = number(t)?;
                mat_mut(b)?.br_mt = v;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "initial permeability",
        hint: "a number; empty: none",
        read: |c| mat(c).map(|m| m.mu_i.map_or("none".into(), |v| v.to_string())),
        enter: Enter::Type {
            text: |c| Ok(num_text(mat(c).and_then(|m| m.mu_i))),
            write: |b, _, t| {
                let v = optional(t)?;
                mat_mut(b)?.mu_i = v;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "loss coefficients",
        hint: "k alpha beta (P in kW/m3, f in kHz, B in T), e.g. 40 1.4 2.6",
        read: |c| {
            mat(c).map(|m| {
                m.steinmetz.map_or("none".into(), |s| {
                    format!("k {} alpha {} beta {}", s.k, s.alpha, s.beta)
                })
            })
        },
        enter: Enter::Type {
            text: |c| {
                Ok(mat(c)
                    .and_then(|m| m.steinmetz)
                    .map(|s| format!("{} {} {}", s.k, s.alpha, s.beta))
                    .unwrap_or_default())
            },
            write: |b, _, t| {
                let st = steinmetz(t)?;
                mat_mut(b)?.steinmetz = st;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "air gap in the path",
        hint: "a number; empty: none",
        read: |c| mat(c).map(|m| opt(m.gap_mm, "mm")),
        enter: Enter::Type {
            text: |c| Ok(num_text(mat(c).and_then(|m| m.gap_mm))),
            write: |b, _, t| {
                let v = optional(t)?;
                mat_mut(b)?.gap_mm = v;
                Ok(())
            },
        },
    },
    FieldSpec {
        label: "remove [material]",
        hint: "",
        read: |c| mat(c).map(|_| "Enter: no flux headroom or core loss".into()),
        enter: Enter::Act(|app: &mut App, _| {
            app.edit("remove the material", |b| {
                b.material = None;
                Ok(())
            });
            app.clamp_form();
        }),
    },
];

/// Three loss coefficients, or none for an empty value.
fn steinmetz(t: &str) -> Result<Option<Steinmetz>, Refusal> {
    let nums: Vec<Option<f64>> = t
        .split(|c: char| c.is_whitespace() || c == ',')
        .filter(|s| !s.is_empty())
        .map(|s| s.parse::<f64>().ok().filter(|v| v.is_finite()))
        .collect();
    match nums.as_slice() {
        [] => Ok(None),
        [Some(k), Some(alpha), Some(beta)] => Ok(Some(Steinmetz {
            k: *k,
            alpha: *alpha,
            beta: *beta,
        })),
        _ => Err(format!("\"{t}\" is not three numbers: k alpha beta")),
    }
}

impl App {
    /// A bundled ferrite sets its typical figures (the gap stays); none keeps the figures.
    pub(crate) fn set_ferrite(&mut self, ferrite: Option<String>) {
        let label = match &ferrite {
            Some(g) => format!("grade {g}"),
            None => "material: own figures".into(),
        };
        self.edit(label, |b| {
            let m = mat_mut(b)?;
            match &ferrite {
                Some(id) => {
                    *m = ferrite_material(id, m.gap_mm).ok_or("unknown grade")?;
                }
                None => m.ferrite = None,
            }
            Ok(())
        });
    }
}
