//! The measured bobbin's core in its form: centre leg, le and a test winding, kept as a draft
//! until applied to the build's bobbin (one undoable edit) or saved to the user's folder.
//! The figures shown (Ae, AL, mu_e, the equivalent gap) come from `engine::core_test`.

use super::app::{App, Effect, Field, Overlay, PromptPurpose, Question};
use crate::engine::measured_core::{self as core_test, GapReading, Leg, Measured};
use crate::files::bobbin_to_toml;
use crate::model::BobbinSource;

#[derive(Debug, Clone, Copy, Default, PartialEq, Eq)]
pub enum LegShape {
    #[default]
    NotGiven,
    Rect,
    Round,
}

/// Readings typed in, before they become the bobbin's core.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct CoreDraft {
    pub leg_shape: LegShape,
    pub leg_width_mm: Option<f64>,
    pub leg_depth_mm: Option<f64>,
    pub leg_diameter_mm: Option<f64>,
    pub le_mm: Option<f64>,
    pub test_turns: Option<u32>,
    pub test_uh: Option<f64>,
    pub mu_i: Option<f64>,
}

impl CoreDraft {
    pub fn leg(&self) -> Option<Leg> {
        match self.leg_shape {
            LegShape::NotGiven => None,
            LegShape::Rect => Some(Leg::Rect {
                width_mm: self.leg_width_mm?,
                depth_mm: self.leg_depth_mm?,
            }),
            LegShape::Round => Some(Leg::Round {
                diameter_mm: self.leg_diameter_mm?,
            }),
        }
    }

    pub fn al_nh(&self) -> Option<f64> {
        Some(core_test::al_nh(self.test_uh?, self.test_turns?))
    }
}

fn num(v: Option<f64>, unit: &str) -> String {
    v.map_or("-".to_string(), |v| format!("{v} {unit}"))
}

/// Usable as a file name in the bobbin folder (the same rule as `measure bobbin --id`).
fn id_ok(id: &str) -> bool {
    !id.is_empty()
        && !id.starts_with('.')
        && id
            .chars()
            .all(|c| c.is_ascii_alphanumeric() || matches!(c, '-' | '_' | '.'))
}

impl App {
    /// A fresh draft for the measured-bobbin form: le from the bobbin's core, mu_i from the
    /// build's material, so only what was measured needs typing.
    pub(super) fn start_core_draft(&mut self) {
        self.core_draft = CoreDraft {
            le_mm: self.build.bobbin.core.as_ref().map(|c| c.le_mm),
            mu_i: self.build.material.as_ref().and_then(|m| m.mu_i),
            ..CoreDraft::default()
        };
    }

    pub(super) fn core_rows(&self) -> Vec<(Field, &'static str, String)> {
        let d = &self.core_draft;
        let mut rows = vec![(
            Field::CLegShape,
            "centre leg",
            match d.leg_shape {
                LegShape::NotGiven => "not measured (Enter: rectangular, round)".into(),
                LegShape::Rect => "rectangular".into(),
                LegShape::Round => "round".into(),
            },
        )];
        match d.leg_shape {
            LegShape::NotGiven => {}
            LegShape::Rect => {
                rows.push((Field::CLegWidth, "leg width", num(d.leg_width_mm, "mm")));
                rows.push((Field::CLegDepth, "leg depth", num(d.leg_depth_mm, "mm")));
            }
            LegShape::Round => {
                rows.push((
                    Field::CLegDiameter,
                    "leg diameter",
                    num(d.leg_diameter_mm, "mm"),
                ));
            }
        }
        rows.extend([
            (Field::CLe, "le, magnetic path", num(d.le_mm, "mm")),
            (
                Field::CTestTurns,
                "test winding turns N",
                d.test_turns.map_or("-".into(), |n| n.to_string()),
            ),
            (
                Field::CTestUh,
                "test winding measured L",
                num(d.test_uh, "uH"),
            ),
            (
                Field::CMuI,
                "material mu_i",
                d.mu_i.map_or("-".into(), |v| v.to_string()),
            ),
            (
                Field::CApply,
                "apply the core to the bobbin",
                "Enter (u undoes)".into(),
            ),
            (
                Field::CSave,
                "save the bobbin to your folder",
                "Enter: asks for its id".into(),
            ),
        ]);
        rows
    }

    /// The core figures of the draft, from `engine::core_test`, and what the gap says.
    pub(super) fn core_notes(&self) -> Vec<String> {
        let d = &self.core_draft;
        let leg = d.leg();
        let ae = leg.map(Leg::area_mm2);
        let al = d.al_nh();
        let mut figs = vec![
            format!("Ae {}", ae.map_or("-".into(), |a| format!("{a:.2} mm2"))),
            format!(
                "AL = L/N^2 {}",
                al.map_or("-".into(), |a| format!("{a:.0} nH"))
            ),
        ];
        let mut out = Vec::new();
        if let (Some(al), Some(ae), Some(le)) = (al, ae, d.le_mm) {
            let mu_e = core_test::mu_e(al, le, ae);
            figs.push(format!("mu_e {mu_e:.0}"));
            if let Some(mu_i) = d.mu_i {
                let gap = core_test::equivalent_gap_mm(mu_e, mu_i, le);
                figs.push(format!("gap {gap:.3} mm"));
                out.push(figs.join(" · "));
                out.push(match core_test::read_gap(gap) {
                    GapReading::Negative => "mu_e is above the mu_i given: the material's \
                            permeability is higher, or le or Ae is off."
                        .to_string(),
                    GapReading::Clean => format!(
                        "under {:.0} um: clean, ground mating faces.",
                        core_test::CLEAN_FACE_GAP_MM * 1000.0
                    ),
                    GapReading::Gapped => "a gap: gapped on purpose, or dirty, glued or \
                            chipped mating faces (glue and grit show up as a gap). Clean the \
                            faces and measure again before trusting AL."
                        .to_string(),
                });
                return out;
            }
        }
        out.push(figs.join(" · "));
        out.push("Give the leg, le, N, L and mu_i for mu_e and the equivalent gap.".into());
        out
    }

    pub(super) fn core_text(&self, field: Field) -> String {
        let d = &self.core_draft;
        let f = |v: Option<f64>| v.map(|v| v.to_string()).unwrap_or_default();
        match field {
            Field::CLegWidth => f(d.leg_width_mm),
            Field::CLegDepth => f(d.leg_depth_mm),
            Field::CLegDiameter => f(d.leg_diameter_mm),
            Field::CLe => f(d.le_mm),
            Field::CTestTurns => d.test_turns.map(|n| n.to_string()).unwrap_or_default(),
            Field::CTestUh => f(d.test_uh),
            Field::CMuI => f(d.mu_i),
            _ => String::new(),
        }
    }

    pub(super) fn activate_core(&mut self, field: Field) -> bool {
        match field {
            Field::CLegShape => {
                self.core_draft.leg_shape = match self.core_draft.leg_shape {
                    LegShape::NotGiven => LegShape::Rect,
                    LegShape::Rect => LegShape::Round,
                    LegShape::Round => LegShape::NotGiven,
                };
            }
            Field::CApply => self.apply_core(),
            Field::CSave => {
                let id = match &self.build.bobbin_source {
                    BobbinSource::Id(id) => format!("{id}-measured"),
                    BobbinSource::Inline => "my-bobbin".into(),
                };
                self.prompt(
                    "save the build's bobbin to your folder as",
                    id,
                    PromptPurpose::BobbinId,
                );
            }
            _ => return false,
        }
        true
    }

    /// A typed reading of the draft; empty clears it. True when the field is the draft's.
    pub(super) fn submit_core(&mut self, field: Field, t: &str) -> bool {
        let d = &mut self.core_draft;
        if field == Field::CTestTurns {
            match t.parse::<u32>() {
                _ if t.is_empty() => d.test_turns = None,
                Ok(n) if n > 0 => d.test_turns = Some(n),
                _ => self.refuse(format!(
                    "\"{t}\" is not a whole number of turns (1 or more)"
                )),
            }
            return true;
        }
        let slot = match field {
            Field::CLegWidth => &mut d.leg_width_mm,
            Field::CLegDepth => &mut d.leg_depth_mm,
            Field::CLegDiameter => &mut d.leg_diameter_mm,
            Field::CLe => &mut d.le_mm,
            Field::CTestUh => &mut d.test_uh,
            Field::CMuI => &mut d.mu_i,
            _ => return false,
        };
        match t.parse::<f64>() {
            _ if t.is_empty() => *slot = None,
            Ok(v) if v.is_finite() && v > 0.0 => *slot = Some(v),
            _ => self.refuse(format!("\"{t}\" is not a positive number")),
        }
        true
    }

    /// Make the draft the bobbin's core, as one edit.
    fn apply_core(&mut self) {
        let d = self.core_draft.clone();
        let (Some(leg), Some(le_mm)) = (d.leg(), d.le_mm) else {
            self.refuse("give the centre leg and le first: the core needs Ae and le");
            return;
        };
        if d.test_turns.is_some() != d.test_uh.is_some() {
            self.refuse("a test winding needs both its turns and its measured inductance");
            return;
        }
        let bb = &self.build.bobbin;
        let mut origin = "measured with callipers".to_string();
        if let (Some(n), Some(l)) = (d.test_turns, d.test_uh) {
            origin.push_str(&format!("; AL from a {n}-turn test winding of {l} uH"));
        }
        let measured = Measured {
            name: bb.name.clone(),
            origin,
            window_width_mm: bb.window.width_mm,
            window_height_mm: bb.window.height_mm,
            tube: bb.tube.clone(),
            leg: Some(leg),
            le_mm: Some(le_mm),
            al_nh: d.al_nh(),
            pin_count: bb.pin_count,
        };
        let bobbin = core_test::bobbin_from(&measured);
        self.edit("measured core of the bobbin", |b| {
            b.bobbin_source = BobbinSource::Inline;
            b.bobbin = bobbin;
            Ok(())
        });
    }

    /// Save the build's bobbin as `<id>.toml` in the user's folder; an existing file is only
    /// replaced after a yes.
    pub(super) fn save_bobbin_as(&mut self, id: &str) -> Option<Effect> {
        if !id_ok(id) {
            self.refuse(format!(
                "\"{id}\": use letters, digits, '-', '_' or '.' (it becomes the file name)"
            ));
            return None;
        }
        let Some(dir) = self.bobbin_dir.clone() else {
            self.refuse("no data directory on this system: set TURNSTACK_BOBBINS to a folder");
            return None;
        };
        let path = dir.join(format!("{id}.toml"));
        let text = bobbin_to_toml(&self.build.bobbin);
        if path.exists() {
            self.pending_bobbin = Some((path, text));
            self.overlays
                .push(Overlay::Question(Question::OverwriteBobbin));
            return None;
        }
        Some(Effect::SaveBobbin { path, text })
    }
}
