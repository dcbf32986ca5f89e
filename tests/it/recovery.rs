//! Recovery after a killed planner: the run loop's recovery keeper writes a copy after each
//! edit (as a save would write it, comments and all), the next start offers it back (restore,
//! keep for later, discard), and saving, undoing back or quitting without saving removes it.

use crate::tui_support::press;
use std::io::Cursor;
use std::path::{Path, PathBuf};
use turnstack::files::{load_build, read_recovery, recovery_path};
use turnstack::tui::run::{Offer, Recovery, offer_recovery, perform};
use turnstack::tui::theme::Theme;
use turnstack::tui::{App, Effect};

fn setup() -> (tempfile::TempDir, PathBuf, PathBuf) {
    let dir = tempfile::tempdir().unwrap();
    let build = dir.path().join("bench.toml");
    std::fs::copy(
        Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/bench-forward.toml"),
        &build,
    )
    .unwrap();
    let rec = dir.path().join("state");
    (dir, build, rec)
}

fn open(build: &Path) -> App {
    let mut app = App::new(load_build(build).unwrap(), Some(build.to_path_buf()));
    app.ui.theme = Theme::plain();
    app
}

/// Keys as the run loop feeds them: the keeper runs after each one.
fn keys(app: &mut App, rec: &mut Recovery, script: &str) -> Vec<Effect> {
    let mut all = Vec::new();
    for c in script.chars() {
        all.extend(press(app, &c.to_string()));
        rec.update(app);
    }
    all
}

#[test]
fn a_killed_planners_edits_are_offered_back_and_can_be_restored() {
    let (_d, build, dir) = setup();
    let original = std::fs::read_to_string(&build).unwrap();
    let mut app = open(&build);
    let mut keeper = Recovery::new(Some(dir.clone()));
    keys(&mut app, &mut keeper, "+");
    assert!(app.dirty());
    let edited = app.doc.build.clone();
    let copy = recovery_path(&dir, &build).unwrap();
    let kept = std::fs::read_to_string(&copy).expect("a copy after the edit");
    // The copy is what a save would write: the file's comments are in it.
    assert!(kept.contains("# Np = 24 keeps the worst-case swing"));
    // The planner is killed: nothing more runs. The file itself is untouched.
    drop(app);
    drop(keeper);
    assert_eq!(std::fs::read_to_string(&build).unwrap(), original);

    // Next start: "n" keeps the copy for later.
    let mut again = open(&build);
    let mut said = Vec::new();
    let o = offer_recovery(&mut again, &dir, &mut Cursor::new("n\n"), &mut said);
    assert_eq!(o, Offer::Kept);
    let said = String::from_utf8(said).unwrap();
    assert!(
        said.contains("has unsaved edits from an earlier session"),
        "{said}"
    );
    assert!(said.contains("y = restore, n = not now"), "{said}");
    assert!(!again.dirty());
    assert!(copy.exists());

    // And the start after that: "y" restores; the planner holds the edits, unsaved.
    let mut third = open(&build);
    let o = offer_recovery(&mut third, &dir, &mut Cursor::new("y\n"), &mut Vec::new());
    assert_eq!(o, Offer::Restored);
    assert_eq!(third.doc.build, edited);
    assert!(third.dirty());
    // Saving removes the copy.
    let mut keeper = Recovery::new(Some(dir.clone()));
    keeper.update(&third);
    let e = keys(&mut third, &mut keeper, "W");
    assert_eq!(e, [Effect::Save(build.clone())]);
    perform(&mut third, e[0].clone());
    keeper.update(&third);
    assert!(!copy.exists(), "saved: the copy is gone");
    assert_eq!(load_build(&build).unwrap(), edited);
}

#[test]
fn discard_undo_and_quitting_without_saving_remove_the_copy() {
    let (_d, build, dir) = setup();
    let copy = recovery_path(&dir, &build).unwrap();
    // Undone back to the file: no copy.
    let mut app = open(&build);
    let mut keeper = Recovery::new(Some(dir.clone()));
    keys(&mut app, &mut keeper, "+");
    assert!(copy.exists());
    keys(&mut app, &mut keeper, "u");
    assert!(!copy.exists(), "undone back to the file");
    // Quit without saving: the edits are thrown away on purpose, and so is the copy.
    keys(&mut app, &mut keeper, "+");
    assert!(copy.exists());
    keeper.quit(&app);
    assert!(!copy.exists());
    // An explicit discard at the offer; end of input (no answer) keeps it.
    keys(&mut app, &mut keeper, "+");
    let mut next = open(&build);
    let o = offer_recovery(&mut next, &dir, &mut Cursor::new(""), &mut Vec::new());
    assert_eq!(o, Offer::Kept);
    let o = offer_recovery(&mut next, &dir, &mut Cursor::new("d\n"), &mut Vec::new());
    assert_eq!(o, Offer::Discarded);
    assert!(read_recovery(&dir, &build).is_none());
    assert!(!next.dirty());
}
