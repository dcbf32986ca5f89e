//! The documented limits on a build's size (FORMAT.md, "Limits"), checked with the rest of
//! validation so that a file and the planner's edits meet the same refusal.

use super::layout::Resolved;
use super::validate::Place;
use crate::model::Build;

/// Most windings a build may have: far above any hand-wound part, so that a generated file or
/// a run of edits cannot make an evaluation run for minutes.
pub const MAX_WINDINGS: usize = 32;
/// Most stack sections a build may have.
pub const MAX_SECTIONS: usize = 200;

/// Refuse a build with more windings or sections than the limits.
pub(super) fn check_size(build: &Build, _resolved: &Resolved, bad: &mut dyn FnMut(Place, String)) {
    for (place, count, limit, what) in [
        ("winding", build.windings.len(), MAX_WINDINGS, "windings"),
        ("stack", build.stack.len(), MAX_SECTIONS, "stack sections"),
    ] {
        if count > limit {
            bad(
                Place::Top(place),
                format!(
                    "{count} {what} is more than this program takes (at most {limit}; a hand-wound part has a few)"
                ),
            );
        }
    }
}
