//! A new build from requirements: the choice between a bobbin and requirements, the
//! requirements form's start and notes, the design run over the planner's bobbin library
//! (in the background, `tui::job`), the ranked designs, and opening one as the build.

use super::{Overlay, PickItem, PickPurpose, PickValue, Picker, Question};
use crate::engine::design::{Design, DesignOutcome, DesignSettings};
use crate::engine::search::Settings;
use crate::model::{Bobbin, Requirements};
use crate::report::design as words;
use crate::report::textfmt::pad;
use crate::tui::app::App;
use crate::tui::fields::FormKind;
use crate::tui::job::Job;
use unicode_width::UnicodeWidthStr;

impl App {
    /// How to start a new build: on a bobbin of the library, or from requirements.
    pub(crate) fn open_new_chooser(&mut self) {
        let items = vec![
            PickItem {
                label: "from a bobbin: a primary and a secondary to edit by hand".into(),
                value: PickValue::NewFromBobbin,
            },
            PickItem {
                label: "from requirements: type the converter's needs, get ranked designs".into(),
                value: PickValue::NewFromRequirements,
            },
        ];
        let title = "start a new build";
        self.ui.overlays.push(Overlay::Picker(Picker::new(
            title,
            "",
            PickPurpose::NewStart,
            items,
            0,
        )));
    }

    /// "From a bobbin": unsaved edits are asked about first (the new build has a fresh
    /// history). A new file's untouched stand-in build has nothing to lose.
    pub(crate) fn new_from_bobbin(&mut self) {
        let untouched_new = self.doc.saved.is_none() && self.doc.undo.is_empty();
        if self.doc.dirty() && !untouched_new {
            self.ui
                .overlays
                .push(Overlay::Question(Question::DiscardForNew));
        } else {
            self.open_bobbin_picker(PickPurpose::NewBuild);
        }
    }

    /// "From requirements": the form, on the requirements typed last, or the demo's.
    pub(crate) fn open_requirements_form(&mut self) {
        if self.ui.needs.is_none() {
            match crate::files::demo_requirements() {
                Ok(r) => self.ui.needs = Some(r),
                Err(e) => {
                    self.error(format!("the starting requirements do not load: {e}"));
                    return;
                }
            }
        }
        self.open_form(FormKind::Requirements);
        self.info("Enter changes a field; the last row designs (Esc closes)");
    }

    /// The bobbins the design tries: the requirements' list, or every readable bobbin of the
    /// library with core figures. An unknown id, or one without a core, is refused.
    fn design_bobbins(&self, req: &Requirements) -> Result<Vec<(String, Bobbin)>, String> {
        let readable = || {
            self.library
                .iter()
                .filter_map(|e| Some((e.id.clone(), e.bobbin.as_ref().ok()?.clone())))
        };
        let Some(ids) = &req.bobbins else {
            return Ok(readable().filter(|(_, b)| b.core.is_some()).collect());
        };
        let mut out = Vec::new();
        for id in ids {
            match readable().find(|(i, _)| i == id) {
                None => {
                    let known: Vec<String> = readable().map(|(i, _)| i).collect();
                    return Err(format!(
                        "unknown bobbin \"{id}\"; the bobbins are: {}",
                        known.join(", ")
                    ));
                }
                Some((_, b)) if b.core.is_none() => {
                    return Err(format!(
                        "bobbin \"{id}\" has no core figures: the design needs them for the flux"
                    ));
                }
                Some(found) => out.push(found),
            }
        }
        Ok(out)
    }

    /// Start the design in the background; its result comes back through `design_done`.
    pub fn start_design(&mut self, req: Requirements) {
        let bobbins = match self.design_bobbins(&req) {
            Ok(b) if b.is_empty() => {
                self.refuse("design: no bobbin with core figures to try");
                return;
            }
            Ok(b) => b,
            Err(why) => {
                self.refuse(format!("design: {why}"));
                return;
            }
        };
        let mut settings = DesignSettings::default();
        settings.search = Settings {
            threads: 2,
            ..settings.search
        };
        self.ui.design_note = None;
        self.info("designing...");
        self.job = Some(Job::design(req, bobbins, settings));
    }

    /// The design's result: the ranked designs as a list over the form, or the engine's
    /// reason under the form when none meets the requirements.
    pub(crate) fn design_done(
        &mut self,
        outcome: DesignOutcome,
        req: Requirements,
        cancelled: bool,
    ) {
        if cancelled || outcome.cancelled {
            self.info("design cancelled; the build is as it was");
            return;
        }
        if let Some(b) = &outcome.binding {
            self.ui.design_note = Some(words::binding_words(b));
            self.refuse("nothing meets the requirements: the reason is under the form");
            return;
        }
        let n_found = outcome.designs.len();
        // As wide as the longest turns (four windings with a second output), never cut.
        let turns_w = outcome
            .designs
            .iter()
            .map(|d| words::turns_text(d).chars().count())
            .max()
            .unwrap_or(0)
            .max("turns".len());
        // As wide as the longest bobbin id, up to a limit that leaves the figures on screen.
        let bobbin_w = outcome
            .designs
            .iter()
            .map(|d| d.bobbin.width())
            .max()
            .unwrap_or(0)
            .clamp("bobbin".len(), BOBBIN_COLUMN_MAX);
        let widths = (bobbin_w, turns_w);
        let items = outcome
            .designs
            .into_iter()
            .enumerate()
            .map(|(n, d)| PickItem {
                label: design_row(&d, widths),
                value: PickValue::Design {
                    n,
                    design: Box::new(d),
                },
            })
            .collect();
        let header = format!(
            "{} {:<turns_w$} {:>5} {:>5} {:>6} {:>6} {:>5} binds (margin left)",
            pad("bobbin", bobbin_w),
            "turns",
            "Nr/Np",
            "Vsw V",
            "loss W",
            "rise C",
            "spare"
        );
        let title = format!(
            "{}: {n_found} of {} bobbins meet it all (spare in mm)",
            if req.title.is_empty() {
                "designs"
            } else {
                req.title.as_str()
            },
            outcome.tried
        );
        self.ui.overlays.push(Overlay::Picker(Picker::new(
            title,
            header,
            PickPurpose::Design,
            items,
            0,
        )));
        self.info("Enter opens it as the build (u undoes that); Esc: back to the form");
    }

    /// Design `n` becomes the build, as one undo step that also leaves the document's file
    /// (saving asks where, so nothing is written over without a question).
    pub(crate) fn open_design(&mut self, n: usize, d: Design) {
        if let Some(p) = crate::engine::validate(&d.build).first() {
            self.refuse(p.to_string());
            return;
        }
        let label = format!(
            "design {} on {}, turns {}",
            n + 1,
            d.bobbin,
            words::turns_text(&d)
        );
        self.ui.overlays.clear();
        self.doc.commit_apart(d.build, label.clone());
        self.ui.stack_sel = 0;
        self.ui.winding_sel = 0;
        let save = match &self.doc.path {
            Some(p) => format!("W saves to {}", p.display()),
            None => "no file yet, W asks where to save".into(),
        };
        let why = d.reset.binds.key();
        self.info(format!(
            "opened {label} (reset: {why} binds); {save}; u returns to the old build"
        ));
    }

    /// Lines under the requirements form: why the last design found nothing, or what the
    /// form leaves out.
    pub(crate) fn requirements_notes(&self) -> Vec<String> {
        if let Some(why) = &self.ui.design_note {
            return vec![format!("Nothing meets them: {why}")];
        }
        vec![
            "One or two outputs here (a second on its own secondary, S2); three or more go in \
             a requirements file ([[output]] tables) for `turnstack design`."
                .into(),
        ]
    }
}

/// Display columns the designs list gives a bobbin id at most; a longer one is cut.
const BOBBIN_COLUMN_MAX: usize = 16;

/// One design as a list line, the CLI's figures in narrower columns, the bobbin id and the
/// turns in columns `bobbin_w` and `turns_w` wide.
fn design_row(d: &Design, (bobbin_w, turns_w): (usize, usize)) -> String {
    let c = d.eval.converter.as_ref();
    let rise = d
        .eval
        .losses
        .as_ref()
        .and_then(|l| l.temperature_rise_c)
        .map_or("-".to_string(), |r| format!("{r:.0}"));
    format!(
        "{} {:<turns_w$} {:>5.2} {:>5.1} {:>6.2} {:>6} {:>5.2} {}",
        pad(&d.bobbin, bobbin_w),
        words::turns_text(d),
        words::reset_ratio(d),
        c.map_or(0.0, |c| c.switch_voltage_v),
        d.total_loss_w,
        rise,
        d.spare_height_mm,
        words::binds_text(d)
    )
}
