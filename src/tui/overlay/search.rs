//! The search's overlay: run `engine::search` on the build and list the trade-offs found;
//! choosing one takes its build as one edit.

use super::{Overlay, PickItem, PickPurpose, PickValue, Picker};
use crate::engine::search::{self, Candidate, Outcome, SearchError, Settings};
use crate::tui::app::App;
use crate::tui::job::{Job, thousands};

/// Most combinations the planner searches: at the search's usual rate (about a million a
/// second on two cores, `cargo bench --bench search`) a few seconds. A larger space goes to
/// `turnstack search`.
pub const PLANNER_MAX_SPACE: usize = 5_000_000;

impl App {
    /// Start the search on the current build in the background (`tui::job`); its result
    /// comes back through `search_done`.
    pub fn start_search(&mut self) {
        let settings = Settings {
            threads: 2,
            ..Settings::default()
        };
        let size = search::space_size(&self.doc.build, &settings);
        if size > PLANNER_MAX_SPACE {
            self.refuse(format!(
                "search: {size} combinations is more than the planner goes through ({PLANNER_MAX_SPACE}); run `turnstack search FILE`, which shows progress and stops on Ctrl-C"
            ));
            return;
        }
        if let Err(e) = search::search_ready(&self.doc.build) {
            self.refuse(format!("search: {e}"));
            return;
        }
        self.info("searching...");
        self.job = Some(Job::search(self.doc.build.clone(), settings));
    }

    /// The search's result: the trade-offs found as a list, or why there are none. A
    /// cancelled search leaves the build as it was and says so.
    pub(crate) fn search_done(&mut self, r: Result<Outcome, SearchError>, cancelled: bool) {
        let outcome = match r {
            _ if cancelled => {
                self.info("search cancelled; the build is as it was");
                return;
            }
            Ok(o) => o,
            Err(SearchError::Cancelled { tried, space }) => {
                self.info(format!(
                    "search cancelled after {} of {} tried; the build is as it was",
                    thousands(tried),
                    thousands(space)
                ));
                return;
            }
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
            self.info(format!("search found nothing ({counts}): {why}"));
            return;
        }
        let items = outcome
            .candidates
            .into_iter()
            .enumerate()
            .map(|(n, c)| PickItem {
                label: format!(
                    "{:>2} {:>8.3} {:>8.3} {:>8.2}  {}",
                    n + 1,
                    c.objectives.loss_w,
                    c.objectives.leakage_uh,
                    c.eval.spare_height_mm,
                    c.description
                ),
                value: PickValue::Candidate {
                    n,
                    candidate: Box::new(c),
                },
            })
            .collect();
        let header = format!(
            "{:>2} {:>8} {:>8} {:>8}  what it does",
            "#", "loss W", "leak uH", "spare mm"
        );
        let title = format!("search: {counts}");
        self.ui.overlays.push(Overlay::Picker(Picker::new(
            title,
            header,
            PickPurpose::Search,
            items,
            0,
        )));
        self.info("Enter takes the candidate as one edit (u undoes it); Esc keeps the build");
    }

    /// Replace the build with candidate `n`'s, as one edit.
    pub(crate) fn take_candidate(&mut self, n: usize, c: Candidate) {
        let label = format!("search candidate {}: {}", n + 1, c.description);
        self.edit(label, |b| {
            *b = c.build;
            Ok(())
        });
    }
}
