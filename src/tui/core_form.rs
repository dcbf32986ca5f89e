//! The measured bobbin's core in its form: centre leg, le and a test winding, kept as a draft
//! until applied to the build's bobbin (one undoable edit) or saved to the user's folder.
//! The figures shown (Ae, AL, mu_e, the equivalent gap) come from `engine::core_test`.

use super::app::App;
use super::app::Effect;
use super::overlay::PromptPurpose;
use crate::engine::measured_core::{self as core_test, GapReading, Leg, Measured};
use crate::files::bobbin_to_toml;
use crate::model::BobbinSource;

/// The centre leg's cross-section as measured.
#[derive(Debug, Clone, Copy, Default, PartialEq, Eq)]
pub enum LegShape {
    /// Not measured yet.
    #[default]
    NotGiven,
    /// Rectangular: a width and a depth.
    Rect,
    /// Round: a diameter.
    Round,
}

/// Readings typed in, before they become the bobbin's core.
#[derive(Debug, Clone, Default, PartialEq)]
pub struct CoreDraft {
    /// The centre leg's shape.
    pub leg_shape: LegShape,
    /// A rectangular leg's width.
    pub leg_width_mm: Option<f64>,
    /// A rectangular leg's depth.
    pub leg_depth_mm: Option<f64>,
    /// A round leg's diameter.
    pub leg_diameter_mm: Option<f64>,
    /// The core's effective magnetic path length.
    pub le_mm: Option<f64>,
    /// The test winding's turns.
    pub test_turns: Option<u32>,
    /// The test winding's measured inductance.
    pub test_uh: Option<f64>,
    /// The material's initial permeability.
    pub mu_i: Option<f64>,
}

impl CoreDraft {
    /// The leg as measured, when its shape and figures are all given.
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

    /// AL from the test winding, when both its turns and inductance are given.
    pub fn al_nh(&self) -> Option<f64> {
        Some(core_test::al_nh(self.test_uh?, self.test_turns?))
    }
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
    pub(crate) fn start_core_draft(&mut self) {
        self.ui.core_draft = CoreDraft {
            le_mm: self.doc.build.bobbin.core.as_ref().map(|c| c.le_mm),
            mu_i: self.doc.build.material.as_ref().and_then(|m| m.mu_i),
            ..CoreDraft::default()
        };
    }

    /// The core figures of the draft, from `engine::core_test`, and what the gap says.
    pub(crate) fn core_notes(&self) -> Vec<String> {
        let d = &self.ui.core_draft;
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

    /// Ask for the id to save the build's bobbin under in the user's folder.
    pub(crate) fn ask_bobbin_id(&mut self) {
        let id = match &self.doc.build.bobbin_source {
            BobbinSource::Id(id) => format!("{id}-measured"),
            BobbinSource::Inline => "my-bobbin".into(),
        };
        self.prompt(
            "save the build's bobbin to your folder as",
            id,
            PromptPurpose::BobbinId,
        );
    }

    /// Make the draft the bobbin's core, as one edit.
    pub(crate) fn apply_core(&mut self) {
        let d = self.ui.core_draft.clone();
        let (Some(leg), Some(le_mm)) = (d.leg(), d.le_mm) else {
            self.refuse("give the centre leg and le first: the core needs Ae and le");
            return;
        };
        if d.test_turns.is_some() != d.test_uh.is_some() {
            self.refuse("a test winding needs both its turns and its measured inductance");
            return;
        }
        let bb = &self.doc.build.bobbin;
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

    /// Save the build's bobbin as `<id>.toml` in the user's folder (the loop asks before it
    /// replaces a file there).
    pub(crate) fn save_bobbin_as(&mut self, id: &str) -> Option<Effect> {
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
        let text = bobbin_to_toml(&self.doc.build.bobbin);
        Some(Effect::SaveBobbin { path, text })
    }
}
