//! The planner's longer jobs: the search over wires and section orders, writing the winding
//! sheet, saving a measured bobbin. The figures come from `engine::search` and
//! `report::sheet`; the loop calls these for the matching `Effect`.

use super::app::{App, Overlay, PickItem, PickPurpose, PickValue, Picker};
use crate::engine::search::{self, Settings};
use crate::files::write_atomic;
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
                .as_ref()
                .map(crate::report::search::binding_in_planner)
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

    /// Write the winding sheet of the current build: HTML for a name ending in .html, else
    /// text pages.
    pub fn write_sheet(&mut self, path: &Path) {
        let s = sheet::sheet(&self.build, &self.eval, SHEET_MEASURE_AT_C);
        let is_html = path
            .extension()
            .is_some_and(|e| e.eq_ignore_ascii_case("html"));
        let page = if is_html {
            let (scale, drawing) = svg::cross_section(&self.build, &self.eval);
            html::render(&s, &drawing, scale)
        } else {
            text::render(&s, SHEET_PAGE_LINES)
        };
        let shown = std::path::absolute(path).unwrap_or_else(|_| path.to_path_buf());
        match write_atomic(path, &page) {
            Ok(()) => {
                let kind = if is_html { "HTML" } else { "text" };
                let warn = if self.eval.fits {
                    ""
                } else {
                    " (it does not fit: the sheet says DO NOT WIND)"
                };
                self.info(format!(
                    "wrote {}: the {kind} winding sheet of build {}{warn}",
                    shown.display(),
                    s.build_id
                ));
            }
            Err(e) => self.error(format!("cannot write {}: {e}", shown.display())),
        }
    }

    /// Write a bobbin file (the overwrite question, if any, was asked already).
    pub fn save_bobbin_file(&mut self, path: &Path, text: &str) {
        let written = path
            .parent()
            .map_or(Ok(()), std::fs::create_dir_all)
            .and_then(|()| write_atomic(path, text));
        match written {
            Ok(()) => self.info(format!("saved the bobbin to {}", path.display())),
            Err(e) => self.error(format!("cannot write {}: {e}", path.display())),
        }
    }
}
