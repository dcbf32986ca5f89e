//! Let the planner find the build: try wire sizes, strands in parallel and section orders for
//! the build's windings on its bobbin, evaluate every candidate with the same `evaluate`, and
//! keep the Pareto set over total loss, leakage and spare window height.
//!
//! Pure: no I/O. Deterministic: the same input gives the same ranked output, whatever the
//! number of threads.

mod pareto;
mod space;
mod threads;

pub use pareto::{Objectives, pareto_indices};
pub use space::{Arrangement, ResetPlace, WireChoice};

use super::{Evaluation, validate};
use crate::model::{Build, Name, Role};
use std::sync::atomic::{AtomicBool, AtomicUsize, Ordering};

/// Which wire series the search draws sizes from.
#[derive(Debug, Clone, Copy, PartialEq, Eq)]
pub enum Series {
    /// Nominal metric sizes (IEC 60317 rows).
    Metric,
    /// American Wire Gauge sizes (ASTM B258).
    Awg,
}

/// What the search may try and what it must meet.
#[derive(Debug, Clone, PartialEq)]
pub struct Settings {
    /// The wire series sizes are drawn from.
    pub series: Series,
    /// Strands in parallel tried per winding: 1..=max_strands, for wire of at least
    /// `min_strand_mm` bare (finer wire is not paralleled by hand).
    pub max_strands: u32,
    /// Finest wire (bare mm) that is paralleled.
    pub min_strand_mm: f64,
    /// Finest wire tried (bare mm): finer wire breaks too easily to wind by hand.
    pub min_wire_mm: f64,
    /// Current density band (A/mm^2 RMS) a wire must fall in.
    pub j_min_a_mm2: f64,
    /// Upper end of the current density band (A/mm^2 RMS).
    pub j_max_a_mm2: f64,
    /// Tape wraps between the primary side (primary, reset) and the secondary side; `None`
    /// takes the most the build has between those sides (at least 1).
    pub isolation_wraps: Option<u32>,
    /// Tape wraps between other adjacent sections.
    pub section_wraps: u32,
    /// Most primary-secondary leakage allowed (uH); `None` for no limit.
    pub max_leakage_uh: Option<f64>,
    /// Highest temperature rise allowed (C); `None` takes the build's own `rise_limit_c`
    /// where the operating point gives a rise.
    pub max_rise_c: Option<f64>,
    /// Skip candidates that cannot fit by a lower bound on their height, and wires outside
    /// the band (turning it off gives the brute-force search the tests compare against).
    pub prune: bool,
    /// Threads to use (1 or more).
    pub threads: usize,
}

impl Default for Settings {
    fn default() -> Self {
        Settings {
            series: Series::Metric,
            max_strands: 4,
            min_strand_mm: 0.2,
            // Below about 0.1 mm, enamelled wire snaps under hand tension (common practice).
            min_wire_mm: 0.1,
            // Small SMPS transformers typically run 3-6 A/mm^2 RMS with natural convection
            // (common practice); the band is kept a little wider so a cool build is not missed.
            j_min_a_mm2: 2.0,
            j_max_a_mm2: 6.0,
            isolation_wraps: None,
            section_wraps: 1,
            max_leakage_uh: None,
            max_rise_c: None,
            prune: true,
            threads: 1,
        }
    }
}

/// One reported candidate.
#[derive(Debug, Clone, PartialEq)]
pub struct Candidate {
    /// The candidate's wires and arrangement in a few words.
    pub description: String,
    /// The build as the candidate would wind it.
    pub build: Build,
    /// Its evaluation.
    pub eval: Evaluation,
    /// Its loss, leakage and spare height, as the Pareto set compares them.
    pub objectives: Objectives,
    /// Its copper loss (W).
    pub copper_loss_w: f64,
}

/// What the search did and found.
#[derive(Debug, Clone, PartialEq)]
pub struct Outcome {
    /// Combinations in the space.
    pub space: usize,
    /// Candidates that went through `evaluate`.
    pub evaluated: usize,
    /// Combinations skipped without evaluation (lower bound on height, current band).
    pub pruned: usize,
    /// Evaluated candidates that fit and meet every constraint.
    pub feasible: usize,
    /// The Pareto set, lowest loss first.
    pub candidates: Vec<Candidate>,
    /// Why nothing was found, when nothing was: the constraint that binds.
    pub binding: Option<Binding>,
    /// Remarks on how the space was built (windings held fixed, and why).
    pub notes: Vec<SearchNote>,
}

/// The constraint that keeps every candidate out, as data; `report::search` words it.
#[derive(Debug, Clone, PartialEq)]
pub enum Binding {
    /// The space is empty: no wire in the series suits the windings.
    EmptySpace,
    /// The current-density band (A/mm^2 RMS): no wire tried puts `windings` inside it, or,
    /// when `windings` is empty, no one choice puts every winding inside it together.
    CurrentBand {
        /// Lower end of the band (A/mm^2 RMS).
        j_min_a_mm2: f64,
        /// Upper end of the band (A/mm^2 RMS).
        j_max_a_mm2: f64,
        /// The windings no wire tried puts inside the band.
        windings: Vec<Name>,
    },
    /// The window height: none of the `in_band` combinations with wire inside the band
    /// fits; `least` is the least height seen or bounded, where known.
    WindowHeight {
        /// Lower end of the band (A/mm^2 RMS).
        j_min_a_mm2: f64,
        /// Upper end of the band (A/mm^2 RMS).
        j_max_a_mm2: f64,
        /// Combinations whose wires all fall inside the band.
        in_band: usize,
        /// The least height seen or bounded, against the window.
        least: Option<LeastHeight>,
    },
    /// The builds that fit within the band run hotter than the temperature-rise limit.
    TemperatureRise,
    /// The builds that fit within the band leave more leakage than allowed.
    Leakage,
}

/// The least height with the allowance that a search saw, against the window.
#[derive(Debug, Clone, Copy, PartialEq)]
pub enum LeastHeight {
    /// Of an evaluated candidate.
    Evaluated {
        /// The least height with allowance (mm).
        height_mm: f64,
        /// The window height (mm).
        window_mm: f64,
    },
    /// A lower bound found while pruning (no candidate in the band was evaluated).
    Bound {
        /// The least lower bound on the height with allowance (mm).
        height_mm: f64,
        /// The window height (mm).
        window_mm: f64,
    },
}

/// A remark on how the search's space was built: a winding whose wire is kept, and why.
#[derive(Debug, Clone, PartialEq)]
pub enum SearchNote {
    /// The winding has no current (no `current_rms_a`, none from an operating point).
    NoCurrent {
        /// The winding kept as it is.
        winding: Name,
    },
    /// No wire in the series suits the winding at its current.
    NoWireSuits {
        /// The winding kept as it is.
        winding: Name,
        /// Its RMS current (A).
        current_a: f64,
    },
    /// Reset and primary turns differ, so the reset is not tried bifilar with the primary.
    ResetTurnsDiffer,
}

/// Why a search cannot start.
#[derive(Debug, Clone, PartialEq, thiserror::Error)]
pub enum SearchError {
    /// The build lacks a primary or a secondary winding.
    #[error(
        "the search needs a primary and a secondary winding (expected a [[winding]] with role = \"primary\" and one with role = \"secondary\")"
    )]
    NeedsRoles,
    /// The build does not pass validation; its first problem.
    #[error("the build is not valid: {0}")]
    Invalid(String),
    /// The caller's cancel flag was set: the search stopped after `tried` of `space`
    /// combinations and reports nothing.
    #[error("the search was stopped after {tried} of {space} combinations")]
    Cancelled {
        /// Combinations gone through before the stop.
        tried: usize,
        /// Combinations in the whole space.
        space: usize,
    },
}

/// RMS current of each winding the search sizes wire for, as the evaluation has it: the
/// build's `current_rms_a`, else what the operating point gives.
pub fn winding_currents(base: &Evaluation) -> Vec<Option<f64>> {
    base.windings.iter().map(|w| w.current_rms_a).collect()
}

/// Copper loss (W) of an evaluated candidate: the engine's per-winding figure (I^2 R over
/// each winding's own waveform where the operating point gives one) over the windings
/// with a current.
pub fn copper_loss_w(eval: &Evaluation) -> f64 {
    eval.windings.iter().filter_map(|w| w.copper_loss_w).sum()
}

/// Total loss (W): copper plus core where the operating point is known.
pub fn total_loss_w(eval: &Evaluation) -> f64 {
    eval.losses
        .as_ref()
        .map_or_else(|| copper_loss_w(eval), |l| l.total_loss_w)
}

/// Combinations a thread goes through between two calls of `progress`.
const PROGRESS_STEP: usize = 4096;

/// Most threads a search uses; more would only add start-up cost on any desktop machine.
pub const MAX_THREADS: usize = 64;
/// Most strands in parallel a search tries per winding: far beyond what is paralleled by hand
/// (litz wire is bought, not wound strand by strand).
pub const MAX_STRANDS: u32 = 32;
/// Most combinations a search goes through; a larger space is refused with a hint to narrow it.
pub const MAX_SPACE: usize = 100_000_000;

/// The number of combinations `search` would go through, before it starts.
pub fn space_size(build: &Build, settings: &Settings) -> usize {
    space::Space::new(build, settings).len()
}

/// Whether `search` can start on this build (valid, with a primary and a secondary).
pub fn search_ready(build: &Build) -> Result<(), SearchError> {
    if let Some(p) = validate(build).first() {
        return Err(SearchError::Invalid(p.to_string()));
    }
    if build.first_of(Role::Primary).is_none() || build.first_of(Role::Secondary).is_none() {
        return Err(SearchError::NeedsRoles);
    }
    Ok(())
}

/// Run the search. `progress` is called now and then with (done, total).
pub fn search(
    build: &Build,
    settings: &Settings,
    progress: &(dyn Fn(usize, usize) + Sync),
) -> Result<Outcome, SearchError> {
    search_cancellable(build, settings, progress, &AtomicBool::new(false))
}

/// `search`, stopped when `cancel` is set: each thread looks at it every `PROGRESS_STEP`
/// combinations (a few milliseconds), and a stopped search returns
/// `SearchError::Cancelled`. The build is only read.
pub fn search_cancellable(
    build: &Build,
    settings: &Settings,
    progress: &(dyn Fn(usize, usize) + Sync),
    cancel: &AtomicBool,
) -> Result<Outcome, SearchError> {
    search_ready(build)?;
    let plan = space::Space::new(build, settings);
    let total = plan.len();
    let done = AtomicUsize::new(0);
    let threads = settings.threads.clamp(1, MAX_THREADS).min(total.max(1));

    // Each thread takes every n-th combination and keeps its own front; the fronts are merged
    // in index order, so the outcome does not depend on the thread count.
    let walk = threads::Walk {
        plan: &plan,
        build,
        settings,
        total,
        threads,
        done: &done,
        progress,
        cancel,
    };
    let parts: Vec<_> = if threads == 1 {
        vec![walk.run(0)]
    } else {
        let walk = &walk;
        std::thread::scope(|s| {
            let handles: Vec<_> = (0..threads).map(|t| s.spawn(move || walk.run(t))).collect();
            handles
                .into_iter()
                .map(|h| h.join().expect("search thread panicked"))
                .collect()
        })
    };
    if cancel.load(Ordering::Relaxed) {
        return Err(SearchError::Cancelled {
            tried: done.load(Ordering::Relaxed).min(total),
            space: total,
        });
    }
    progress(total, total);

    let all = threads::merge(parts);
    let candidates = threads::ranked(all.front);
    let binding = candidates.is_empty().then(|| {
        all.reasons.binding(
            plan.len(),
            settings,
            build.bobbin.window.height_mm,
            plan.out_of_band_windings(),
        )
    });
    Ok(Outcome {
        space: total,
        evaluated: all.evaluated,
        pruned: all.pruned,
        feasible: all.feasible,
        candidates,
        binding,
        notes: plan.notes(),
    })
}

/// Leakage between the first primary and the first secondary, referred to the primary.
pub fn primary_secondary_leakage_uh(build: &Build, eval: &Evaluation) -> f64 {
    super::primary_secondary_leakage(build, eval).map_or(0.0, |l| l.uh)
}
