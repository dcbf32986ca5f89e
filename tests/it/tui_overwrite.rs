//! The planner asks before a save-as or a sheet export writes over a file that is there:
//! "y" overwrites, "n" or Esc keeps the file. Driven by keys, with the loop's `perform`
//! carrying out the effects as the terminal loop does.

use crate::tui_support::*;
use turnstack::tui::App;
use turnstack::tui::app::{Overlay, Question};

fn asking(app: &App) -> bool {
    matches!(
        app.ui.overlays.last(),
        Some(Overlay::Question(Question::Overwrite(_)))
    )
}

#[test]
fn save_as_over_an_existing_file_asks_and_cancel_keeps_it() {
    let dir = tempfile::tempdir().unwrap();
    let other = dir.path().join("other.toml");
    std::fs::write(&other, "# someone else's build\n").unwrap();
    let mut app = demo_app();
    app.doc.path = Some(dir.path().join("mine.toml"));
    let keys = format!("A{}{}<enter>", "<bs>".repeat(200), other.display());

    drive(&mut app, &keys);
    assert!(asking(&app), "{:?}", app.ui.overlays);
    let s = screen(&app, 100, 30);
    assert!(
        s.contains("other.toml exists. Write the build over it?"),
        "{s}"
    );
    assert!(s.contains("y yes, overwrite"), "{s}");
    drive(&mut app, "n");
    assert!(app.ui.overlays.is_empty());
    assert_eq!(
        std::fs::read_to_string(&other).unwrap(),
        "# someone else's build\n"
    );
    assert_eq!(
        app.doc.path.as_deref(),
        Some(dir.path().join("mine.toml").as_path())
    );

    // Esc cancels as well.
    drive(&mut app, &keys);
    assert!(asking(&app));
    drive(&mut app, "<esc>");
    assert!(app.ui.overlays.is_empty());
    assert_eq!(
        std::fs::read_to_string(&other).unwrap(),
        "# someone else's build\n"
    );

    // Yes overwrites, and the build now belongs to that file.
    drive(&mut app, &keys);
    drive(&mut app, "y");
    assert!(app.ui.overlays.is_empty());
    let back = turnstack::files::load_build(&other).expect("the saved build loads");
    assert_eq!(back, app.doc.build);
    assert_eq!(app.doc.path.as_deref(), Some(other.as_path()));
    assert!(!app.dirty());
}

#[test]
fn saving_to_its_own_file_or_a_new_name_does_not_ask() {
    let dir = tempfile::tempdir().unwrap();
    let mine = dir.path().join("mine.toml");
    let mut app = demo_app();
    let keys = format!("A{}{}<enter>", "<bs>".repeat(200), mine.display());
    drive(&mut app, &keys);
    assert!(app.ui.overlays.is_empty() && mine.exists());
    // Its own file again, after an edit: written without a question.
    drive(&mut app, "+W");
    assert!(app.ui.overlays.is_empty() && !app.dirty());
    drive(&mut app, &keys);
    assert!(app.ui.overlays.is_empty());
}

#[test]
fn a_sheet_over_an_existing_file_asks_first() {
    let dir = tempfile::tempdir().unwrap();
    let sheet = dir.path().join("bench.sheet.txt");
    std::fs::write(&sheet, "an older sheet\n").unwrap();
    let mut app = demo_app();
    let keys = format!("E{}{}<enter>", "<bs>".repeat(200), sheet.display());

    drive(&mut app, &keys);
    assert!(asking(&app));
    let s = screen(&app, 100, 30);
    assert!(
        s.contains("bench.sheet.txt exists. Write the winding sheet over it?"),
        "{s}"
    );
    drive(&mut app, "n");
    assert_eq!(std::fs::read_to_string(&sheet).unwrap(), "an older sheet\n");

    drive(&mut app, &keys);
    drive(&mut app, "y");
    assert!(app.ui.overlays.is_empty());
    let text = std::fs::read_to_string(&sheet).unwrap();
    assert!(text.contains("Checks"), "{text}");
    assert!(app.ui.status.as_ref().unwrap().text.starts_with("wrote "));
}
