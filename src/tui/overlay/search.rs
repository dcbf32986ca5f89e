//! The search's overlay: run `engine::search` on the build and list the trade-offs found;
//! choosing one takes its build as one edit.

use super::{Overlay, PickItem, PickPurpose, PickValue, Picker};
use crate::engine::search::{self, Candidate, Settings};
use crate::tui::app::App;

/// Most combinations the planner searches while it waits: at the search's usual rate (about
/// a million a second on two cores, `cargo bench --bench search`) a few seconds. A larger
/// space goes to `turnstack search`, which shows progress and stops on Ctrl-C.
pub const PLANNER_MAX_SPACE: usize = 5_000_000;

impl App {
    /// Search on the current build and list the trade-offs found.
    pub fn run_search(&mut self) {
        let settings = Settings {
            threads: 2,
            ..Settings::default()
        };
        let size = search::space_size(&self.doc.build, &settings);
        if size > PLANNER_MAX_SPACE {
            self.refuse(format!(
                "search: {size} combinations is more than the planner goes through while you wait ({PLANNER_MAX_SPACE}); run `turnstack search FILE`, which shows progress and stops on Ctrl-C"
            ));
            return;
        }
        let outcome = match search::search(&self.doc.build, &settings, &|_, _| {}) {
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
