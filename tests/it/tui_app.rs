//! App-state tests of the planner: each action changes the Build as intended, undo and redo
//! round-trip, invalid edits are refused with a message, saving reloads the same build.

use crate::tui_support::*;
use turnstack::files::{BobbinLibrary, load_build, parse_build};
use turnstack::model::{Section, WireSize};
use turnstack::tui::app::{Focus, Overlay, StatusKind};
use turnstack::tui::{Action, App, Effect, run::perform, theme::Theme};

/// The demo's windings wound plainly, one section each: P, tape, S, tape, R, tape.
const PLAIN: &str = r#"
format = 1
title = "plain forward transformer"
bobbin = "e25-13-7"
[setup]
temperature_c = 100
tape_mm = 0.06
frequency_khz = 100
[[winding]]
name = "P"
role = "primary"
turns = 24
wire = "0.63mm"
[[winding]]
name = "S"
role = "secondary"
turns = 16
wire = "0.50mm"
strands = 3
[[winding]]
name = "R"
role = "reset"
turns = 24
wire = "0.25mm"
[[stack]]
winding = "P"
[[stack]]
tape = 1
[[stack]]
winding = "S"
[[stack]]
tape = 1
[[stack]]
winding = "R"
[[stack]]
tape = 2
"#;

fn plain_app() -> App {
    let b = parse_build(PLAIN, None, &BobbinLibrary::bundled_only()).expect("plain build");
    let mut app = App::new(b, None);
    app.ui.theme = Theme::plain();
    turnstack::tui::run::refresh_library(&mut app);
    app
}

/// The stack as short words, tube first: "P24", "t1", "P12+R".
fn stack_words(app: &App) -> Vec<String> {
    let turns = app.doc.build.section_turns();
    app.doc
        .build
        .stack
        .iter()
        .zip(turns)
        .map(|(s, t)| match s {
            Section::Tape { wraps } => format!("t{wraps}"),
            Section::Winding(ws) => match &ws.partner {
                Some(w) => format!("{}{t}+{w}", ws.winding),
                None => format!("{}{t}", ws.winding),
            },
        })
        .collect()
}

fn leakage_uh(app: &App, to: &str) -> f64 {
    app.doc
        .eval
        .leakage
        .iter()
        .find(|l| l.from == "P" && l.to == to)
        .map(|l| l.uh)
        .expect("leakage pair")
}

/// The pair's leakage from the 1-D field across the build alone (without the part between
/// the wires of bifilar sections).
fn leakage_1d_uh(app: &App, to: &str) -> f64 {
    app.doc
        .eval
        .leakage
        .iter()
        .find(|l| l.from == "P" && l.to == to)
        .map(|l| l.uh - l.bifilar_uh)
        .expect("leakage pair")
}

#[test]
fn split_puts_halves_of_the_primary_around_the_secondary_with_the_tape_copied() {
    let mut app = plain_app();
    let before = leakage_uh(&app, "S");
    press(&mut app, "s<enter>");
    assert_eq!(
        stack_words(&app),
        ["P12", "t1", "S16", "t1", "P12", "t1", "R24", "t2"]
    );
    // Interleaving lowers the primary-secondary leakage (Dowell 1966: the MMF peak halves).
    assert!(
        leakage_uh(&app, "S") < before / 2.0,
        "{before} -> {}",
        leakage_uh(&app, "S")
    );
    assert!(app.dirty());
}

#[test]
fn winding_the_reset_bifilar_takes_its_turns_from_its_own_section() {
    let mut app = plain_app();
    press(&mut app, "s<enter>");
    // Section #1 (P12) bifilar with R.
    app.ui.stack_sel = 0;
    press(&mut app, "b<down><down><enter>");
    assert_eq!(
        stack_words(&app),
        ["P12+R", "t1", "S16", "t1", "P12", "t1", "R12", "t2"]
    );
    // Section #5 (P12) too: R's own section empties and goes.
    app.ui.stack_sel = 4;
    press(&mut app, "b<down><down><enter>");
    assert_eq!(
        stack_words(&app),
        ["P12+R", "t1", "S16", "t1", "P12+R", "t1", "t2"]
    );
    assert_eq!(
        leakage_1d_uh(&app, "R"),
        0.0,
        "bifilar pairs share their layers"
    );
    // And alone again: R's turns go back to a section of its own, outermost.
    press(&mut app, "balone<enter>");
    assert_eq!(
        stack_words(&app),
        ["P12+R", "t1", "S16", "t1", "P12", "t1", "R12", "t1", "t2"]
    );
}

#[test]
fn picking_a_thinner_wire_for_the_reset_winding_changes_it_and_its_resistance() {
    let mut app = plain_app();
    let dcr = app.doc.eval.windings[2].dcr_ohm;
    press(&mut app, "<tab><down><down>w");
    assert!(matches!(app.ui.overlays.last(), Some(Overlay::Picker(_))));
    // Filter the table down to the 0.2 mm row and take it.
    press(&mut app, "0.2mm<enter>");
    assert_eq!(
        app.doc.build.windings[2].wire,
        WireSize::Metric { bare_mm: 0.2 }
    );
    assert!(app.doc.eval.windings[2].dcr_ohm > dcr * 1.4);
}

#[test]
fn measured_wire_is_typed_as_bare_and_overall_diameter() {
    let mut app = plain_app();
    app.ui.focus = Focus::Windings;
    app.ui.winding_sel = 2;
    press(&mut app, "wmeasured<enter>0.22 0.25<enter>");
    assert_eq!(
        app.doc.build.windings[2].wire,
        WireSize::Measured {
            bare_mm: 0.22,
            od_mm: 0.25
        }
    );
    // An overall diameter below the bare one is refused by the engine's validation.
    press(&mut app, "wmeasured<enter>0.3 0.2<enter>");
    assert_eq!(app.ui.status.as_ref().unwrap().kind, StatusKind::Refused);
    assert_eq!(
        app.doc.build.windings[2].wire,
        WireSize::Measured {
            bare_mm: 0.22,
            od_mm: 0.25
        }
    );
}

#[test]
fn undo_and_redo_walk_the_history_both_ways() {
    let mut app = plain_app();
    let original = app.doc.build.clone();
    press(&mut app, "s<enter>");
    let split = app.doc.build.clone();
    press(&mut app, "+");
    let taped = app.doc.build.clone();
    assert_ne!(split, taped);
    press(&mut app, "uu");
    assert_eq!(app.doc.build, original);
    assert!(!app.dirty(), "back at the opened build");
    press(&mut app, "U");
    assert_eq!(app.doc.build, split);
    app.update(Action::Redo);
    assert_eq!(app.doc.build, taped);
    press(&mut app, "U");
    assert_eq!(app.ui.status.as_ref().unwrap().text, "nothing to redo");
}

#[test]
fn an_edit_that_breaks_the_build_is_refused_and_the_build_kept() {
    let mut app = plain_app();
    let kept = app.doc.build.clone();
    // 30 strands of 0.566 mm wire need 17 mm per turn in a 15.2 mm window. The field
    // opens holding the present 3 strands: rub it out first. (The conductor row comes
    // before the wire, so strands is the seventh row.)
    app.ui.focus = Focus::Windings;
    app.ui.winding_sel = 1;
    press(
        &mut app,
        "<enter><down><down><down><down><down><down><enter><bs>30<enter>",
    );
    assert_eq!(app.doc.build, kept);
    let st = app.ui.status.clone().unwrap();
    assert_eq!(st.kind, StatusKind::Refused);
    assert!(
        st.text.contains("usable between the margins"),
        "{}",
        st.text
    );
    // Turns that are not a number.
    press(&mut app, "<esc>t");
    press(&mut app, "<bs><bs>x1<enter>");
    assert!(app.ui.status.unwrap().text.contains("not a whole number"));
    assert!(app.doc.undo.is_empty());
}

#[test]
fn deleting_the_only_section_of_a_winding_is_refused() {
    let mut app = plain_app();
    app.ui.stack_sel = 4; // R24
    press(&mut app, "d");
    assert_eq!(stack_words(&app).len(), 6);
    assert!(
        app.ui
            .status
            .unwrap()
            .text
            .contains("no [[stack]] section winds it")
    );
}

#[test]
fn deleting_a_half_gives_its_turns_back_to_the_other_half() {
    let mut app = plain_app();
    press(&mut app, "s<enter>");
    app.ui.stack_sel = 4;
    press(&mut app, "d");
    assert_eq!(
        stack_words(&app),
        ["P24", "t1", "S16", "t1", "t1", "R24", "t2"]
    );
}

#[test]
fn sections_move_outward_and_inward() {
    let mut app = plain_app();
    app.ui.stack_sel = 0;
    press(&mut app, "K");
    assert_eq!(stack_words(&app)[..2], ["t1", "P24"]);
    assert_eq!(app.ui.stack_sel, 1);
    press(&mut app, "J");
    assert_eq!(stack_words(&app)[..2], ["P24", "t1"]);
    press(&mut app, "J");
    assert!(app.ui.status.unwrap().text.contains("next to the tube"));
}

#[test]
fn section_turns_move_between_the_halves_and_tape_wraps_count() {
    let mut app = plain_app();
    press(&mut app, "s<enter>");
    app.ui.stack_sel = 0;
    press(&mut app, "<enter><bs><bs>10<enter>");
    assert_eq!(stack_words(&app)[0], "P10");
    assert_eq!(stack_words(&app)[4], "P14");
    assert_eq!(app.doc.build.windings[0].turns, 24);
    app.ui.stack_sel = 1;
    press(&mut app, "++-");
    assert_eq!(stack_words(&app)[1], "t2");
    press(&mut app, "--");
    assert!(app.ui.status.unwrap().text.contains("at least 1 wrap"));
}

#[test]
fn windings_are_added_renamed_and_deleted_with_the_stack_following() {
    let mut app = plain_app();
    app.ui.focus = Focus::Windings;
    press(&mut app, "a");
    assert_eq!(app.doc.build.windings.len(), 4);
    let name = app.doc.build.windings[3].name.clone();
    assert!(stack_words(&app).contains(&format!("{name}10")));
    app.ui.winding_sel = 0;
    press(&mut app, "n<bs>Pri<enter>");
    assert_eq!(app.doc.build.windings[0].name, "Pri");
    assert_eq!(stack_words(&app)[0], "Pri24");
    press(&mut app, "n<bs><bs><bs>S<enter>");
    assert!(
        app.ui
            .status
            .clone()
            .unwrap()
            .text
            .contains("already called")
    );
    app.ui.winding_sel = 3;
    press(&mut app, "d");
    assert_eq!(app.doc.build.windings.len(), 3);
    // Role, grade, strands, current and pins.
    app.ui.winding_sel = 2;
    press(&mut app, "rg+c0.1<enter>i4 5<enter>");
    let r = &app.doc.build.windings[2];
    assert_eq!(r.role.key(), "auxiliary");
    assert_eq!(r.insulation.key(), "grade3");
    assert_eq!(r.strands, 2);
    assert_eq!(r.current_rms_a, Some(0.1));
    assert_eq!(
        (r.start_pin.as_deref(), r.finish_pin.as_deref()),
        (Some("4"), Some("5"))
    );
}

#[test]
fn setup_and_bobbin_edits_apply_and_range_checks_refuse() {
    let mut app = plain_app();
    // Setup form: allowance field (third row).
    press(&mut app, "G<down><down><enter><bs><bs><bs><bs>1.3<enter>");
    assert_eq!(app.doc.build.setup.allowance_factor, 1.3);
    press(&mut app, "<enter><bs><bs><bs>5<enter>");
    assert!(
        app.ui
            .status
            .clone()
            .unwrap()
            .text
            .contains("between 1.0 and 2.0")
    );
    assert_eq!(app.doc.build.setup.allowance_factor, 1.3);
    press(&mut app, "<esc>");
    // A measured bobbin: the window height typed in.
    press(&mut app, "Bmeasured<enter>");
    assert!(matches!(
        app.doc.build.bobbin_source,
        turnstack::model::BobbinSource::Inline
    ));
    press(&mut app, "<down><down><enter>");
    for _ in 0..6 {
        press(&mut app, "<bs>");
    }
    press(&mut app, "2.5<enter><esc>");
    assert_eq!(app.doc.build.bobbin.window.height_mm, 2.5);
    assert!(
        !app.doc.eval.fits,
        "the plain build is 3.1 mm tall with allowance"
    );
    // Back to a library bobbin by filtering the list.
    press(&mut app, "Betd34<enter>");
    assert_eq!(
        app.doc.build.bobbin_source,
        turnstack::model::BobbinSource::Id("etd34".into())
    );
}

#[test]
fn pinning_keeps_a_reference_until_unpinned() {
    let mut app = plain_app();
    press(&mut app, "p");
    let pinned = app.doc.eval.clone();
    press(&mut app, "s<enter>+");
    let (r, what) = app.reference().unwrap();
    assert_eq!(what, "pinned");
    assert_eq!(r, &pinned);
    press(&mut app, "p");
    let (_, what) = app.reference().unwrap();
    assert!(what.starts_with("before "), "{what}");
}

#[test]
fn save_then_load_gives_the_same_build_and_quitting_asks_first() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("forward.toml");
    let mut app = plain_app();
    press(&mut app, "s<enter>");
    // Quit with unsaved edits: asked, and "n" stays.
    let e = press(&mut app, "q");
    assert!(e.is_empty());
    assert!(matches!(app.ui.overlays.last(), Some(Overlay::Question(_))));
    press(&mut app, "n");
    assert!(app.ui.overlays.is_empty());
    // Save: no file yet, so a name is asked for.
    let effects = press(&mut app, "W");
    assert!(effects.is_empty());
    for _ in 0..20 {
        press(&mut app, "<bs>");
    }
    let effects = press(&mut app, &format!("{}<enter>", path.display()));
    assert_eq!(effects, [Effect::Save(path.clone())]);
    assert!(!perform(&mut app, effects[0].clone()));
    assert!(!app.dirty());
    let back = load_build(&path).expect("saved file loads");
    assert_eq!(back, app.doc.build);
    // Nothing unsaved now: q quits at once.
    assert_eq!(press(&mut app, "q"), [Effect::Quit]);
    // The file is tidy TOML a person can edit.
    let text = std::fs::read_to_string(&path).unwrap();
    assert!(text.starts_with("format = 1\n"));
    assert!(text.contains("[[stack]]\nwinding = \"P\"\nturns = 12\n"));
    // Reopen through the planner.
    let mut other = plain_app();
    assert!(!perform(&mut other, Effect::Open(path.clone())));
    assert_eq!(other.doc.build, app.doc.build);
    assert_eq!(other.doc.path.as_deref(), Some(path.as_path()));
}

#[test]
fn quitting_can_save_first() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("q.toml");
    let mut app = plain_app();
    app.doc.path = Some(path.clone());
    press(&mut app, "+q");
    let e = press(&mut app, "s");
    assert_eq!(e, [Effect::SaveThenQuit(path.clone())]);
    assert!(perform(&mut app, e[0].clone()));
    assert_eq!(load_build(&path).unwrap(), app.doc.build);
}

#[test]
fn a_new_file_starts_from_a_picked_bobbin() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("new.toml");
    let library = turnstack::tui::run::read_library(Some(&path));
    let mut app = App::new_file(path.clone(), library);
    assert!(matches!(app.ui.overlays.last(), Some(Overlay::Picker(_))));
    press(&mut app, "<enter>etd29<enter>");
    assert_eq!(
        app.doc.build.bobbin_source,
        turnstack::model::BobbinSource::Id("etd29".into())
    );
    assert_eq!(app.doc.path.as_deref(), Some(path.as_path()));
    assert!(app.dirty(), "a new build is unsaved until saved");
    assert_eq!(press(&mut app, "W"), [Effect::Save(path)]);
}

#[test]
fn help_lists_every_binding_and_closes() {
    let mut app = plain_app();
    press(&mut app, "?");
    assert!(matches!(app.ui.overlays.last(), Some(Overlay::Help { .. })));
    press(&mut app, "<down><esc>");
    assert!(app.ui.overlays.is_empty());
}

/// The technician's run: on the demo (each winding in one plain section), split the
/// primary around the secondary, put the reset winding on thinner wire, wind it bifilar
/// with both primary halves, undo the last step, save and reopen: the same build comes back.
#[test]
fn demo_scenario_split_thin_bifilar_undo_save_reopen() {
    let mut app = demo_app();
    assert_eq!(stack_words(&app), ["P24", "t1", "S16", "t1", "R24", "t2"]);
    let plain_ps = leakage_uh(&app, "S");
    press(&mut app, "p<down><down><down><down><down><down>s<enter>");
    assert_eq!(
        stack_words(&app),
        ["P12", "t1", "S16", "t1", "P12", "t1", "R24", "t2"]
    );
    assert!(leakage_uh(&app, "S") < plain_ps / 2.0);
    press(&mut app, "<tab><down><down>w0.2mm<enter><tab>");
    assert_eq!(
        app.doc.build.windings[2].wire,
        WireSize::Metric { bare_mm: 0.2 }
    );
    app.ui.stack_sel = 0;
    press(&mut app, "bwith R<enter><up><up><up><up>bwith R<enter>");
    assert_eq!(
        stack_words(&app),
        ["P12+R", "t1", "S16", "t1", "P12+R", "t1", "t2"]
    );
    assert_eq!(leakage_1d_uh(&app, "R"), 0.0);
    assert!(
        leakage_uh(&app, "R") > 0.0,
        "the wires' spacing leaves some"
    );
    let fitted = app.doc.eval.height_with_allowance_mm;
    press(&mut app, "u");
    assert_eq!(
        stack_words(&app),
        ["P12+R", "t1", "S16", "t1", "P12", "t1", "R12", "t2"]
    );
    assert!(app.doc.eval.height_with_allowance_mm > fitted);
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("forward.toml");
    let e = press(
        &mut app,
        &format!("W{}{}<enter>", "<bs>".repeat(13), path.display()),
    );
    assert_eq!(e, [Effect::Save(path.clone())]);
    perform(&mut app, e[0].clone());
    assert_eq!(press(&mut app, "q"), [Effect::Quit]);
    let reopened = App::new(load_build(&path).unwrap(), Some(path));
    assert_eq!(reopened.doc.build, app.doc.build);
    assert_eq!(reopened.doc.eval, app.doc.eval);
}

/// A bobbin file in the `bobbins/` folder beside the build.
fn beside_bobbin(dir: &std::path::Path, id: &str, width_mm: f64, height_mm: f64) {
    let folder = dir.join("bobbins");
    std::fs::create_dir_all(&folder).unwrap();
    let text = format!(
        "format = 1\nname = \"former beside the build\"\norigin = \"measured\"\n\
         [window]\nwidth_mm = {width_mm}\nheight_mm = {height_mm}\n\
         [tube]\nshape = \"round\"\ndiameter_mm = 9.0\n"
    );
    std::fs::write(folder.join(format!("{id}.toml")), text).unwrap();
}

/// The bobbin list shows the bobbins beside the build; choosing one takes that very bobbin,
/// also when its id is a bundled one's (here e25-13-7, with other dimensions) or no bundled
/// one's at all.
#[test]
fn the_bobbin_list_takes_the_bobbin_beside_the_build() {
    let dir = tempfile::tempdir().unwrap();
    beside_bobbin(dir.path(), "e25-13-7", 17.5, 5.5);
    beside_bobbin(dir.path(), "my-former", 16.0, 5.0);
    let bundled = BobbinLibrary::bundled_only()
        .find("e25-13-7")
        .unwrap()
        .unwrap();
    assert_ne!(bundled.window.width_mm, 17.5);
    let mut app = plain_app();
    app.doc.path = Some(dir.path().join("build.toml"));
    // The run loop reads the library for the document's file.
    turnstack::tui::run::refresh_library(&mut app);
    assert_eq!(
        app.doc.build.bobbin.window.width_mm,
        bundled.window.width_mm
    );

    press(&mut app, "Be25-13-7<enter>");
    assert!(app.ui.overlays.is_empty(), "{:?}", app.ui.status);
    assert_eq!(app.doc.build.bobbin.window.width_mm, 17.5);
    assert_eq!(app.doc.build.bobbin.window.height_mm, 5.5);
    assert_eq!(app.doc.build.bobbin.name, "former beside the build");
    assert_eq!(
        app.doc.build.bobbin_source,
        turnstack::model::BobbinSource::Id("e25-13-7".into())
    );

    press(&mut app, "Bmy-former<enter>");
    assert_ne!(
        app.ui.status.as_ref().map(|s| s.kind),
        Some(StatusKind::Error),
        "{:?}",
        app.ui.status
    );
    assert_eq!(app.doc.build.bobbin.window.width_mm, 16.0);
    assert_eq!(
        app.doc.build.bobbin_source,
        turnstack::model::BobbinSource::Id("my-former".into())
    );
}
