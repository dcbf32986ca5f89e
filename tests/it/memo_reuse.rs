//! The evaluation memo (`engine::memo`) on a real build: kept across many evaluations, it
//! changes no figure. (Moved here from the engine's unit tests: the engine does no file I/O,
//! and this check loads an example file.)

use crate::common::example;
use turnstack::engine::memo::{MAX_ENTRIES, Memo};
use turnstack::engine::{evaluate, evaluate_with};

/// A memo kept past its size across many evaluations (here: one changed current each
/// time) starts afresh between them and gives the figures a fresh evaluation gives.
#[test]
fn a_full_memo_starts_afresh_between_evaluations() {
    let (mut build, _) = example("bench-forward");
    let mut memo = Memo::new();
    for n in 0..MAX_ENTRIES + 3 {
        build.windings[0].current_rms_a = Some(0.5 + n as f64 * 1e-4);
        if n + 1 == MAX_ENTRIES {
            build.windings[1].current_rms_a = Some(3.0);
        }
        let e = evaluate_with(&build, &mut memo);
        if n + 3 >= MAX_ENTRIES {
            assert_eq!(e, evaluate(&build));
        }
    }
    assert!(memo.spectrum_count() < MAX_ENTRIES);
}
