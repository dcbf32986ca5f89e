//! TestBackend renders of the planner's newer overlays at 80x24: the operating point,
//! material and isolation forms, the ranked bobbin list, the measured core, the sheet prompt
//! and the search's candidate list; and no panic at any size with each of them open.

use crate::tui_support::*;
use turnstack::tui::{App, Effect, run::perform};

/// The demo with each new overlay open, by the keys a user presses.
fn overlays() -> Vec<(&'static str, App)> {
    let mut v = Vec::new();
    for (name, keys) in [
        ("operating", "V"),
        ("material", "M"),
        ("isolation_reinforced", "I<enter><enter><enter>"),
        ("bobbin_ranked", "B"),
        ("measured_core", "Bmeasured<enter>"),
        ("sheet_prompt", "E"),
    ] {
        let mut app = demo_app();
        press(&mut app, keys);
        v.push((name, app));
    }
    let mut app = demo_app();
    perform(&mut app, Effect::Search);
    finish_job(&mut app);
    v.push(("search", app));
    v
}

#[test]
fn each_new_overlay_draws_at_80x24() {
    for (name, app) in overlays() {
        let lines = render(&app, 80, 24);
        for l in &lines {
            assert_eq!(
                unicode_width::UnicodeWidthStr::width(l.as_str()),
                80,
                "{name}"
            );
        }
        insta::assert_snapshot!(name, lines.join("\n"));
    }
}

#[test]
fn the_new_overlays_never_panic_at_any_size() {
    for (_, app) in overlays() {
        for w in (0..200).step_by(13).chain([1, 79, 80, 81, 199]) {
            for h in (0..60).step_by(7).chain([1, 23, 24, 25, 59]) {
                let _ = render(&app, w, h);
            }
        }
    }
}

/// At 100x30 the operating form, its note and the check panel's reset rows all show.
#[test]
fn operating_form_at_100x30_shows_the_reset_figures() {
    let mut app = demo_app();
    press(&mut app, "V");
    let s = screen(&app, 100, 30);
    assert!(s.contains("reset winding turns"), "{s}");
    assert!(s.contains("reset duty limit 50.0 %"), "{s}");
}
