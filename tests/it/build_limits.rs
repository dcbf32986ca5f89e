//! The documented limits on a build's size (FORMAT.md, "Limits"): far above any hand-wound
//! part, refused beyond with a message, whether the build comes from a file or from edits in
//! the planner (a planner that made a 33rd winding would save a file it cannot open again).

use crate::tui_support::*;
use turnstack::engine::validate::{MAX_SECTIONS, MAX_WINDINGS, validate};
use turnstack::model::Section;

#[test]
fn a_winding_past_the_limit_is_refused_with_its_count() {
    let (mut b, _) = crate::common::example("bench-forward");
    while b.windings.len() <= MAX_WINDINGS {
        let mut w = b.windings[0].clone();
        w.name = format!("X{}", b.windings.len()).as_str().into();
        b.windings.push(w);
    }
    let problems = validate(&b);
    assert!(
        problems
            .iter()
            .any(|p| p.message.contains(&format!("at most {MAX_WINDINGS}"))),
        "{problems:?}"
    );
}

#[test]
fn a_section_past_the_limit_is_refused_with_its_count() {
    let (mut b, _) = crate::common::example("bench-forward");
    while b.stack.len() <= MAX_SECTIONS {
        b.stack.push(Section::Tape { wraps: 1 });
    }
    let problems = validate(&b);
    assert!(
        problems
            .iter()
            .any(|p| p.message.contains(&format!("at most {MAX_SECTIONS}"))),
        "{problems:?}"
    );
}

#[test]
fn the_planner_adds_windings_up_to_the_limit_and_no_further() {
    let mut app = bench_app();
    press(&mut app, "<tab>");
    for _ in 0..(MAX_WINDINGS + 3) {
        press(&mut app, "a");
    }
    assert_eq!(app.doc.build.windings.len(), MAX_WINDINGS);
}
