//! Turn edits in the planner against the build format's rule for a section's turns
//! (shared/spec/build-format.md, `[[stack]] turns`: "this section's share; default: what is
//! left of the winding"): a section that leaves its turns out keeps taking the rest after a
//! change of its winding's total, only the section whose turns are typed is made to state
//! them, and a save changes only the lines of the values touched.

use crate::tui_support::press;
use std::path::PathBuf;
use turnstack::files::load_build;
use turnstack::model::Section;
use turnstack::tui::{App, Effect, run::perform, theme::Theme};

/// A primary in two sections around the secondary: the inner one states 12 turns, the outer
/// one takes the rest; the secondary and the reset each in one section that states nothing.
const HALF_STATED: &str = r#"format = 1
title = "primary with a stated inner half"
bobbin = "e25-13-7"

[setup]
temperature_c = 100
frequency_khz = 100

[[winding]]
name = "P"
role = "primary"
turns = 24  # the whole primary
wire = "0.50mm"

[[winding]]
name = "S"
role = "secondary"
turns = 8
wire = "0.50mm"
strands = 2

[[winding]]
name = "R"
role = "reset"
turns = 24
wire = "0.25mm"

[[stack]]
winding = "P"
turns = 12  # the inner half

[[stack]]
tape = 1

[[stack]]
winding = "S"

[[stack]]
tape = 1

[[stack]]
winding = "P"  # the rest of the primary

[[stack]]
tape = 1

[[stack]]
winding = "R"

[[stack]]
tape = 2
"#;

/// The planner on `text` saved as a file in a fresh folder (kept alive by the guard).
fn app_on(text: &str) -> (App, PathBuf, tempfile::TempDir) {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("build.toml");
    std::fs::write(&path, text).unwrap();
    let mut app = App::new(
        load_build(&path).expect("the build loads"),
        Some(path.clone()),
    );
    app.ui.theme = Theme::plain();
    (app, path, dir)
}

/// Save with W and return the lines of `text` the save took out and the lines it put in
/// (those outside a longest common run of lines of the two).
fn save_and_diff(app: &mut App, path: &PathBuf, text: &str) -> (Vec<String>, Vec<String>) {
    let effects = press(app, "W");
    assert_eq!(effects, [Effect::Save(path.clone())]);
    assert!(!perform(app, effects[0].clone()));
    let saved = std::fs::read_to_string(path).unwrap();
    assert_eq!(
        load_build(path).unwrap(),
        app.doc.build,
        "reads back as the build"
    );
    let (a, b): (Vec<&str>, Vec<&str>) = (text.lines().collect(), saved.lines().collect());
    // l[i][j]: the longest common subsequence of a[i..] and b[j..].
    let mut l = vec![vec![0usize; b.len() + 1]; a.len() + 1];
    for i in (0..a.len()).rev() {
        for j in (0..b.len()).rev() {
            l[i][j] = if a[i] == b[j] {
                l[i + 1][j + 1] + 1
            } else {
                l[i + 1][j].max(l[i][j + 1])
            };
        }
    }
    let (mut i, mut j) = (0, 0);
    let (mut gone, mut new) = (Vec::new(), Vec::new());
    while i < a.len() || j < b.len() {
        if i < a.len() && j < b.len() && a[i] == b[j] {
            (i, j) = (i + 1, j + 1);
        } else if j == b.len() || (i < a.len() && l[i + 1][j] >= l[i][j + 1]) {
            gone.push(a[i].to_string());
            i += 1;
        } else {
            new.push(b[j].to_string());
            j += 1;
        }
    }
    (gone, new)
}

fn lines(v: &[&str]) -> Vec<String> {
    v.iter().map(ToString::to_string).collect()
}

/// The turns each winding section states in the build, tube first (`None`: the rest).
fn stated(app: &App) -> Vec<Option<u32>> {
    app.doc
        .build
        .stack
        .iter()
        .filter_map(|s| match s {
            Section::Winding(ws) => Some(ws.turns),
            Section::Tape { .. } => None,
        })
        .collect()
}

/// The resolved turns of each winding section, tube first.
fn resolved(app: &App) -> Vec<u32> {
    let turns = app.doc.build.section_turns();
    app.doc
        .build
        .stack
        .iter()
        .zip(turns)
        .filter(|(s, _)| matches!(s, Section::Winding(_)))
        .map(|(_, t)| t)
        .collect()
}

/// A winding's new total goes to its section that takes the rest (build-format.md); no
/// section is made to state its turns, and the save changes the total's line alone.
#[test]
fn a_new_winding_total_goes_to_the_section_that_takes_the_rest_build_format_spec() {
    let (mut app, path, _dir) = app_on(HALF_STATED);
    assert_eq!(resolved(&app), [12, 8, 12, 24]);
    press(&mut app, "<tab>t30<enter>");
    assert_eq!(app.doc.build.windings[0].turns, 30);
    assert_eq!(stated(&app), [Some(12), None, None, None]);
    assert_eq!(resolved(&app), [12, 8, 18, 24]);
    assert_eq!(
        save_and_diff(&mut app, &path, HALF_STATED),
        (
            lines(&["turns = 24  # the whole primary"]),
            lines(&["turns = 30  # the whole primary"])
        )
    );
    // Later changes keep going there: the rest goes on taking them.
    press(&mut app, "t20<enter>");
    assert_eq!(resolved(&app), [12, 8, 8, 24]);
    assert_eq!(stated(&app), [Some(12), None, None, None]);
    // Down to the stated half alone is refused: the rest would have no turn.
    press(&mut app, "t12<enter>");
    assert_eq!(app.doc.build.windings[0].turns, 20, "refused");
    assert_eq!(resolved(&app), [12, 8, 8, 24]);
}

/// Every winding in one section that states nothing: a new total leaves every section so, and the file changes by the total's line alone.
#[test]
fn a_winding_in_one_section_keeps_it_taking_the_rest_build_format_spec() {
    let text = HALF_STATED
        .replace(
            "[[stack]]\nwinding = \"P\"\nturns = 12  # the inner half\n\n[[stack]]\ntape = 1\n\n",
            "",
        )
        .replace("turns = 8\n", "turns = 16\n")
        .replace(
            "turns = 24  # the whole primary",
            "turns = 12  # the whole primary",
        );
    let (mut app, path, _dir) = app_on(&text);
    assert_eq!(resolved(&app), [16, 12, 24]);
    press(&mut app, "<tab>jt15<enter>");
    assert_eq!(resolved(&app), [15, 12, 24]);
    assert_eq!(stated(&app), [None, None, None]);
    assert_eq!(
        save_and_diff(&mut app, &path, &text),
        (lines(&["turns = 16"]), lines(&["turns = 15"]))
    );
    // And the primary's: still one line, the total's.
    let text = std::fs::read_to_string(&path).unwrap();
    press(&mut app, "kt13<enter>");
    assert_eq!(resolved(&app), [15, 13, 24]);
    assert_eq!(stated(&app), [None, None, None]);
    assert_eq!(
        save_and_diff(&mut app, &path, &text),
        (
            lines(&["turns = 12  # the whole primary"]),
            lines(&["turns = 13  # the whole primary"])
        )
    );
}

/// Typing the turns of a section that states them changes that line alone: the other
/// section of the winding keeps taking the rest (build-format.md), the total stays.
#[test]
fn typing_a_stated_sections_turns_leaves_the_rest_to_the_other_build_format_spec() {
    let (mut app, path, _dir) = app_on(HALF_STATED);
    app.ui.stack_sel = 0;
    press(&mut app, "<enter><bs><bs>10<enter>");
    assert_eq!(stated(&app), [Some(10), None, None, None]);
    assert_eq!(resolved(&app), [10, 8, 14, 24]);
    assert_eq!(app.doc.build.windings[0].turns, 24);
    assert_eq!(
        save_and_diff(&mut app, &path, HALF_STATED),
        (
            lines(&["turns = 12  # the inner half"]),
            lines(&["turns = 10  # the inner half"])
        )
    );
    // A later total still goes to the section that takes the rest.
    press(&mut app, "<tab>t26<enter>");
    assert_eq!(resolved(&app), [10, 8, 16, 24]);
    assert_eq!(stated(&app), [Some(10), None, None, None]);
}

/// Typing the turns of the section that took the rest makes it state them (one new line);
/// the turns it gives up go to the other primary section, and no other section changes.
#[test]
fn typing_the_rest_sections_turns_states_them_there_only_build_format_spec() {
    let (mut app, path, _dir) = app_on(HALF_STATED);
    app.ui.stack_sel = 4;
    press(&mut app, "<enter><bs><bs>10<enter>");
    assert_eq!(stated(&app), [Some(14), None, Some(10), None]);
    assert_eq!(resolved(&app), [14, 8, 10, 24]);
    assert_eq!(app.doc.build.windings[0].turns, 24);
    assert_eq!(
        save_and_diff(&mut app, &path, HALF_STATED),
        (
            lines(&["turns = 12  # the inner half"]),
            lines(&["turns = 14  # the inner half", "turns = 10"])
        )
    );
}
