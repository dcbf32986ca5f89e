//! The search's threads: each walks every n-th combination of the space and keeps its own
//! Pareto front; the fronts merge by the same rule, so the answer does not depend on the
//! thread count. Pure apart from the shared progress count and cancel flag.

use super::space::{Combo, Reasons, Space};
use super::{
    Candidate, Objectives, PROGRESS_STEP, Settings, copper_loss_w, pareto_indices,
    primary_secondary_leakage_uh, total_loss_w,
};
use crate::engine::evaluate_with;
use crate::engine::memo::Memo;
use crate::model::{Build, Name};
use std::sync::atomic::{AtomicBool, AtomicUsize, Ordering};

/// A front as a thread keeps it: (index, objectives at the front's resolution, candidate).
pub(super) type Front = Vec<(usize, Objectives, Candidate)>;

/// What one thread (or all of them, merged) found: its front and its counts.
#[derive(Default)]
pub(super) struct Part {
    /// The front, in the order its candidates were kept.
    pub front: Front,
    /// Candidates that went through `evaluate`.
    pub evaluated: usize,
    /// Combinations skipped without evaluation.
    pub pruned: usize,
    /// Evaluated candidates that fit and meet every constraint.
    pub feasible: usize,
    /// Why candidates were turned down.
    pub reasons: Reasons,
}

/// What every thread walks with: the space, the build its candidates start from, the
/// settings, and the progress count, callback and cancel flag the threads share.
pub(super) struct Walk<'w, 'a> {
    /// The space walked.
    pub plan: &'w Space<'a>,
    /// The build each candidate starts from.
    pub build: &'w Build,
    /// What the search may try and must meet.
    pub settings: &'w Settings,
    /// Combinations in the space.
    pub total: usize,
    /// Threads walking it (1 or more).
    pub threads: usize,
    /// Combinations gone through by every thread, published in steps of `PROGRESS_STEP`.
    pub done: &'w AtomicUsize,
    /// Called now and then with (done, total).
    pub progress: &'w (dyn Fn(usize, usize) + Sync),
    /// Set by the caller to stop the search.
    pub cancel: &'w AtomicBool,
}

impl Walk<'_, '_> {
    /// Thread `t`'s walk over combinations `t`, `t + threads`, ... The arrangement is the
    /// slowest digit of the index, so the thread rebuilds its candidate's stack rarely and
    /// otherwise only swaps wires.
    pub fn run(&self, t: usize) -> Part {
        let (plan, settings, total) = (self.plan, self.settings, self.total);
        let mut part = Part::default();
        let mut candidate = own_copy(self.build);
        let mut laid_arrangement = None;
        let mut memo = Memo::new();
        let mut combo = Combo::default();
        for (k, index) in (t..total).step_by(self.threads).enumerate() {
            // Counted locally and published in steps: one shared counter touched by every
            // thread on every index would bounce its cache line between the cores.
            if k > 0 && k.is_multiple_of(PROGRESS_STEP) {
                let n = self.done.fetch_add(PROGRESS_STEP, Ordering::Relaxed) + PROGRESS_STEP;
                (self.progress)(n, total);
            }
            if k.is_multiple_of(PROGRESS_STEP) && self.cancel.load(Ordering::Relaxed) {
                break;
            }
            plan.decode(index, &mut combo);
            let in_band = plan.in_band_all(&combo);
            if in_band {
                part.reasons.in_band += 1;
            }
            if settings.prune && (!in_band || !plan.may_fit(&combo, &mut part.reasons)) {
                part.pruned += 1;
                continue;
            }
            if laid_arrangement != Some(combo.arrangement) {
                plan.set_stack(&mut candidate, combo.arrangement);
                laid_arrangement = Some(combo.arrangement);
            }
            plan.set_wires(&mut candidate, &combo);
            let eval = evaluate_with(&candidate, &mut memo);
            part.evaluated += 1;
            if !part.reasons.accept(&eval, settings, plan.sized()) {
                continue;
            }
            part.feasible += 1;
            let copper = copper_loss_w(&eval);
            let objectives = Objectives {
                loss_w: total_loss_w(&eval),
                leakage_uh: primary_secondary_leakage_uh(&candidate, &eval),
                spare_height_mm: eval.spare_height_mm,
            };
            let coarse = objectives.coarse();
            if !stays(&part.front, &objectives, &coarse) {
                continue;
            }
            part.front
                .retain(|(_, o, _)| !(coarse.dominates(o) || *o == coarse));
            part.front.push((
                index,
                coarse,
                Candidate {
                    description: plan.describe(&combo),
                    build: candidate.clone(),
                    eval,
                    objectives,
                    copper_loss_w: copper,
                },
            ));
        }
        part
    }
}

/// The build a thread's candidates start from, with names of its own: names are shared text
/// whose reference counts every evaluation bumps, and shared by the threads the counts'
/// cache line would bounce between the cores.
fn own_copy(build: &Build) -> Build {
    let mut candidate = build.clone();
    for w in &mut candidate.windings {
        w.name = Name::from(w.name.as_str());
    }
    candidate
}

/// Whether a candidate of `objectives` (`coarse` at the front's resolution) joins `front`:
/// nothing on it dominates it, and of candidates alike at the front's resolution the finer
/// one stays (see `Objectives::finer`); indices rise within a thread, so of exact equals the
/// first.
fn stays(front: &Front, objectives: &Objectives, coarse: &Objectives) -> bool {
    !front
        .iter()
        .any(|(_, o, c)| o.dominates(coarse) || (*o == *coarse && !objectives.finer(&c.objectives)))
}

/// The threads' parts together: their fronts one after the other, their counts summed and
/// their reasons merged.
pub(super) fn merge(parts: Vec<Part>) -> Part {
    let mut all = Part::default();
    for part in parts {
        all.front.extend(part.front);
        all.evaluated += part.evaluated;
        all.pruned += part.pruned;
        all.feasible += part.feasible;
        all.reasons.merge(&part.reasons);
    }
    all
}

/// A candidate as handed out: its partial last layers spaced across the width where that is
/// sound (`engine::spacing`); its objectives do not change.
fn spaced(mut c: Candidate) -> Candidate {
    if let Some((build, eval)) = crate::engine::spacing::space_partial_layers(&c.build, &c.eval) {
        c.build = build;
        c.eval = eval;
    }
    c
}

/// The Pareto set of the merged fronts, lowest loss first (then least leakage, most spare
/// height, and the description).
pub(super) fn ranked(mut all: Front) -> Vec<Candidate> {
    // Finest first, then by index: the first of each alike group is the one the front keeps,
    // whichever thread found it.
    all.sort_by(|(i, _, a), (k, _, b)| a.objectives.exact_cmp(&b.objectives).then(i.cmp(k)));
    let coarse: Vec<Objectives> = all.iter().map(|(_, o, _)| *o).collect();
    let keep = pareto_indices(&coarse);
    let mut candidates: Vec<Candidate> =
        keep.into_iter().map(|k| spaced(all[k].2.clone())).collect();
    candidates.sort_by(|a, b| {
        let (x, y) = (&a.objectives, &b.objectives);
        x.loss_w
            .total_cmp(&y.loss_w)
            .then(x.leakage_uh.total_cmp(&y.leakage_uh))
            .then(y.spare_height_mm.total_cmp(&x.spare_height_mm))
            .then(a.description.cmp(&b.description))
    });
    candidates
}
