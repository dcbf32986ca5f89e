//! The planner's longer jobs: the search over wires and section orders, the winding sheet's
//! page, and what the status line says after the loop wrote a file. The figures come from
//! `engine::search` and `report::sheet`; the loop calls these for the matching `Effect`.

use super::app::{App, Overlay, PickItem, PickPurpose, PickValue, Picker};
use crate::engine::search::{self, Settings};
use crate::report::sheet::{self, html, svg, text};
use std::path::Path;

/// Lines of a text sheet's page, as the CLI's default.
const SHEET_PAGE_LINES: usize = 60;
/// The bench temperature the sheet's resistance checks are given at, as the CLI's default.
const SHEET_MEASURE_AT_C: f64 = 20.0;

impl App {
    /// Search on the current build and list the trade-offs found.
    pub fn run_search(&mut self) {
        let settings = Settings {
            threads: 2,
            ..Settings::default()
        };
        let outcome = match search::search(&self.build, &settings, &|_, _| {}) {
            Ok(o) => o,
            Err(e) => {
                self.refuse(format!("search: {e}"));
                return;
            }
        };
        let counts = format!(
            "{} evaluated, {} skipped, {} on the front",
            outcome.evaluated,
            outcome.pruned,
            outcome.candidates.len()
        );
        if outcome.candidates.is_empty() {
            let why = outcome
                .binding
                .unwrap_or_else(|| "no candidate meets the constraints".into());
            self.found.clear();
            self.info(format!("search found nothing ({counts}): {why}"));
            return;
        }
        let items = outcome
            .candidates
            .iter()
            .enumerate()
            .map(|(i, c)| PickItem {
                label: format!(
                    "{:>2} {:>8.3} {:>8.3} {:>8.2}  {}",
                    i + 1,
                    c.objectives.loss_w,
                    c.objectives.leakage_uh,
                    c.eval.spare_height_mm,
                    c.description
                ),
                value: PickValue::Candidate(i),
            })
            .collect();
        self.found = outcome.candidates;
        self.overlays.push(Overlay::Picker(Picker {
            title: format!("search: {counts}"),
            header: format!(
                "{:>2} {:>8} {:>8} {:>8}  what it does",
                "#", "loss W", "leak uH", "spare mm"
            ),
            purpose: PickPurpose::Search,
            items,
            selected: 0,
            filter: String::new(),
        }));
        self.info("Enter takes the candidate as one edit (u undoes it); Esc keeps the build");
    }

    /// Replace the build with a candidate's, as one edit.
    pub(super) fn take_candidate(&mut self, n: usize) {
        let Some(c) = self.found.get(n) else {
            self.refuse("that candidate is gone: search again");
            return;
        };
        let next = c.build.clone();
        let label = format!("search candidate {}: {}", n + 1, c.description);
        self.edit(label, |b| {
            *b = next;
            Ok(())
        });
    }

    /// The winding sheet of the current build as the page to write to `path`: HTML for a
    /// name ending in .html, else text pages. The loop writes it.
    pub fn sheet_page(&self, path: &Path) -> SheetPage {
        let s = sheet::sheet(&self.build, &self.eval, SHEET_MEASURE_AT_C);
        let html = path
            .extension()
            .is_some_and(|e| e.eq_ignore_ascii_case("html"));
        let text = if html {
            let (scale, drawing) = svg::cross_section(&self.build, &self.eval);
            html::render(&s, &drawing, scale)
        } else {
            text::render(&s, SHEET_PAGE_LINES)
        };
        SheetPage {
            text,
            html,
            build_id: s.build_id,
        }
    }

    /// The loop wrote (or failed to write) the sheet `page` to `path`.
    pub fn wrote_sheet(&mut self, path: &Path, page: &SheetPage, result: std::io::Result<()>) {
        let shown = std::path::absolute(path).unwrap_or_else(|_| path.to_path_buf());
        match result {
            Ok(()) => {
                let kind = if page.html { "HTML" } else { "text" };
                let warn = if self.eval.fits {
                    ""
                } else {
                    " (it does not fit: the sheet says DO NOT WIND)"
                };
                self.info(format!(
                    "wrote {}: the {kind} winding sheet of build {}{warn}",
                    shown.display(),
                    page.build_id
                ));
            }
            Err(e) => self.error(format!("cannot write {}: {e}", shown.display())),
        }
    }

    /// The loop wrote (or failed to write) a bobbin file to `path`.
    pub fn wrote_bobbin(&mut self, path: &Path, result: std::io::Result<()>) {
        match result {
            Ok(()) => self.info(format!("saved the bobbin to {}", path.display())),
            Err(e) => self.error(format!("cannot write {}: {e}", path.display())),
        }
    }
}

/// A winding sheet ready to write.
pub struct SheetPage {
    /// The whole file.
    pub text: String,
    /// HTML (a printable page) rather than text pages.
    pub html: bool,
    /// The build id the sheet carries.
    pub build_id: String,
}
