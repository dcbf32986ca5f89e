//! The planner and the winding sheet on foil and litz windings: the winding form shows the
//! keys of the winding's conductor, its edits are undoable and refused with a message when
//! out of range, the screen labels and draws foil and litz, a save changes only the values
//! touched, and the foil to cut is worked by hand.

use crate::tui_support::*;
use std::path::Path;
use turnstack::engine::{evaluate, foil_cut::foil_cut};
use turnstack::files::load_build;
use turnstack::model::{Conductor, WireSize};
use turnstack::tui::App;
use turnstack::tui::app::{Focus, FormKind, StatusKind};
use turnstack::tui::run::perform;
use turnstack::tui::theme::Theme;

const EXAMPLE: &str = "examples/foil-litz-300k.toml";

fn app_on(path: &Path) -> App {
    let b = load_build(path).expect("the build loads");
    let mut app = App::new(b, Some(path.to_path_buf()));
    app.ui.theme = Theme::plain();
    app
}

fn example_app() -> App {
    app_on(&Path::new(env!("CARGO_MANIFEST_DIR")).join(EXAMPLE))
}

fn labels(app: &App, k: usize) -> Vec<&'static str> {
    app.form_rows(FormKind::Winding(k))
        .iter()
        .map(|r| r.label)
        .collect()
}

fn status(app: &App) -> (String, Option<StatusKind>) {
    app.ui
        .status
        .as_ref()
        .map_or((String::new(), None), |s| (s.text.clone(), Some(s.kind)))
}

/// Open the winding form of winding `k` (Tab to the windings, select it, Enter).
fn open_form(app: &mut App, k: usize) {
    if app.ui.focus != Focus::Windings {
        press(app, "<tab>");
    }
    assert_eq!(app.ui.focus, Focus::Windings);
    press(app, &"k".repeat(10));
    press(app, &"j".repeat(k));
    assert_eq!(app.ui.winding_sel, k);
    press(app, "<enter>");
}

/// Select the form row labelled `label` and press Enter on it.
fn enter_row(app: &mut App, k: usize, label: &str) {
    let at = labels(app, k)
        .iter()
        .position(|l| *l == label)
        .unwrap_or_else(|| panic!("row {label} shown: {:?}", labels(app, k)));
    press(app, &"<up>".repeat(30));
    press(app, &"<down>".repeat(at));
    press(app, "<enter>");
}

#[test]
fn the_winding_form_shows_the_keys_of_each_conductor() {
    let app = example_app();
    // P is litz, S foil, R round wire.
    let litz = labels(&app, 0);
    for l in [
        "conductor",
        "litz strands",
        "strand diameter",
        "insulation",
        "serving",
    ] {
        assert!(litz.contains(&l), "litz shows {l}: {litz:?}");
    }
    for l in ["wire", "foil thickness", "strands in parallel"] {
        assert!(!litz.contains(&l), "litz hides {l}");
    }
    let foil = labels(&app, 1);
    for l in [
        "foil thickness",
        "foil width",
        "interleaf",
        "interleaf overhang",
        "lead tab length",
    ] {
        assert!(foil.contains(&l), "foil shows {l}: {foil:?}");
    }
    for l in ["wire", "insulation", "strands in parallel", "litz strands"] {
        assert!(!foil.contains(&l), "foil hides {l}");
    }
    let round = labels(&app, 2);
    assert!(round.contains(&"wire") && round.contains(&"strands in parallel"));
    assert!(!round.contains(&"foil thickness") && !round.contains(&"litz strands"));
    // The foil's width is left to its default: the form says so and what it comes to
    // (19.4 mm window, no margin, 1 mm a side: 17.4 mm).
    let rows = app.form_rows(FormKind::Winding(1));
    let width = rows.iter().find(|r| r.label == "foil width").unwrap();
    assert!(width.value.contains("17.4 mm"), "{}", width.value);
}

#[test]
fn foil_and_litz_edits_are_written_undone_and_refused_with_a_message() {
    let mut app = example_app();
    open_form(&mut app, 1);
    enter_row(&mut app, 1, "foil thickness");
    press(&mut app, "0.15<enter>");
    let s = &app.doc.build.windings[1];
    match s.conductor {
        Conductor::Foil(f) => assert_eq!(f.thickness_mm, 0.15),
        other => panic!("still foil: {other:?}"),
    }
    assert_eq!(
        s.wire,
        WireSize::Metric { bare_mm: 0.15 },
        "wire mirrors the foil"
    );
    // Too thin: refused, and the build keeps 0.15.
    enter_row(&mut app, 1, "foil thickness");
    press(&mut app, "0.01<enter>");
    let (text, kind) = status(&app);
    assert_eq!(kind, Some(StatusKind::Refused));
    assert!(text.contains("foil thickness must be from 0.025"), "{text}");
    // Wider than the breadth: the engine refuses it.
    enter_row(&mut app, 1, "foil width");
    press(&mut app, "25<enter>");
    let (text, kind) = status(&app);
    assert_eq!(kind, Some(StatusKind::Refused), "{text}");
    assert!(text.contains("wider than the wound breadth"), "{text}");
    // Litz strands of the primary, then undo.
    press(&mut app, "<esc>");
    let mut app2 = example_app();
    open_form(&mut app2, 0);
    enter_row(&mut app2, 0, "litz strands");
    press(&mut app2, "100<enter>");
    match app2.doc.build.windings[0].conductor {
        Conductor::Litz(l) => assert_eq!(l.strands, 100),
        other => panic!("still litz: {other:?}"),
    }
    enter_row(&mut app2, 0, "litz strands");
    press(&mut app2, "1<enter>");
    assert!(status(&app2).0.contains("a whole number from 2 to 5000"));
    press(&mut app2, "<esc>u");
    assert_eq!(
        app2.doc.build,
        example_app().doc.build,
        "undo restores the litz"
    );
    press(&mut app, "u");
    assert_eq!(
        app.doc.build,
        example_app().doc.build,
        "undo restores the foil"
    );
}

#[test]
fn the_conductor_row_cycles_round_foil_litz_and_undo_goes_back() {
    let mut app = example_app();
    // R is wound bifilar with P: foil cannot be, so the cycle skips it and says why.
    open_form(&mut app, 2);
    enter_row(&mut app, 2, "conductor");
    assert!(matches!(
        app.doc.build.windings[2].conductor,
        Conductor::Litz(_)
    ));
    let (text, _) = status(&app);
    assert!(
        text.contains("litz") && text.contains("foil refused"),
        "{text}"
    );
    assert!(text.contains("bifilar"), "{text}");
    assert!(labels(&app, 2).contains(&"litz strands"));
    enter_row(&mut app, 2, "conductor");
    assert_eq!(app.doc.build.windings[2].conductor, Conductor::Round);
    // S (foil, on its own) goes to litz, then round, then foil again.
    press(&mut app, "<esc>");
    open_form(&mut app, 1);
    enter_row(&mut app, 1, "conductor");
    assert!(matches!(
        app.doc.build.windings[1].conductor,
        Conductor::Litz(_)
    ));
    enter_row(&mut app, 1, "conductor");
    assert_eq!(app.doc.build.windings[1].conductor, Conductor::Round);
    enter_row(&mut app, 1, "conductor");
    assert!(matches!(
        app.doc.build.windings[1].conductor,
        Conductor::Foil(_)
    ));
    assert!(labels(&app, 1).contains(&"foil thickness"));
    press(&mut app, "<esc>uuuuu");
    assert_eq!(app.doc.build, example_app().doc.build);
}

#[test]
fn the_screen_labels_foil_and_litz_and_draws_the_foil_as_a_band() {
    let app = example_app();
    for (w, h) in [(80, 24), (100, 30)] {
        let s = screen(&app, w, h);
        assert!(s.contains("foil 0.1x17.4"), "{w}x{h}:\n{s}");
        assert!(s.contains("litz 60x0.1"), "{w}x{h}:\n{s}");
        // Three foil turns, each one band: a letter at each edge of the copper.
        let bands = s
            .lines()
            .filter(|l| l.contains("S▬▬") && l.contains("▬S"))
            .count();
        assert_eq!(bands, 3, "{w}x{h}:\n{s}");
    }
}

/// The litz primary wound bifilar with the round reset wire: at a scale where P's share of
/// each turn spans three cells or more, the share is drawn as a bracketed bundle, `(PPP)`,
/// beside R's plain letter, and every other turn in lower case, `r(ppp)`, as a wide turn is.
#[test]
fn a_bifilar_litz_share_is_drawn_as_a_bundle() {
    let app = example_app();
    let s = screen(&app, 200, 30);
    let row = s
        .lines()
        .find(|l| l.contains("1▶┃"))
        .unwrap_or_else(|| panic!("no first-section row:\n{s}"));
    assert!(row.contains("R(PPP)r(ppp)R(PPP)"), "{row}");
}

/// A save after a foil edit rewrites only the foil's wire line, keeping its comment above
/// and every other line byte for byte.
#[test]
fn a_foil_edit_saves_only_the_values_touched() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("build.toml");
    let text =
        std::fs::read_to_string(Path::new(env!("CARGO_MANIFEST_DIR")).join(EXAMPLE)).unwrap();
    std::fs::write(&path, &text).unwrap();
    let mut app = app_on(&path);
    turnstack::tui::run::refresh_library(&mut app);
    open_form(&mut app, 1);
    enter_row(&mut app, 1, "interleaf");
    press(&mut app, "0.025<enter><esc>");
    open_form(&mut app, 0);
    enter_row(&mut app, 0, "strand diameter");
    press(&mut app, "0.08<enter><esc>");
    let effects = press(&mut app, "W");
    assert_eq!(effects.len(), 1);
    assert!(!perform(&mut app, effects[0].clone()));
    let saved = std::fs::read_to_string(&path).unwrap();
    let before: Vec<&str> = text.lines().collect();
    let after: Vec<&str> = saved.lines().collect();
    assert_eq!(before.len(), after.len(), "{saved}");
    let changed: Vec<(&str, &str)> = before
        .iter()
        .zip(&after)
        .filter(|(a, b)| a != b)
        .map(|(a, b)| (*a, *b))
        .collect();
    assert_eq!(
        changed,
        [
            (
                "wire = { litz_strands = 60, strand_mm = 0.1 }",
                "wire = { litz_strands = 60, strand_mm = 0.08 }"
            ),
            (
                "wire = { foil_mm = 0.1, interleaf_mm = 0.05, tab_mm = 25 }",
                "wire = { foil_mm = 0.1, interleaf_mm = 0.025, tab_mm = 25 }"
            ),
        ],
        "{saved}"
    );
    let back = load_build(&path).unwrap();
    assert_eq!(back, app.doc.build);
}

/// Foil cut by hand: 3 turns of 0.2 mm foil on 0.05 mm interleaf round a 10 mm tube. Layer
/// i's centre sits at (i + 1/2) x 0.25 mm, its MLT pi (10 + 2 y): pi x 10.25, 10.75, 11.25,
/// together pi x 32.25 = 101.32 mm; plus 10 mm at each end, rounded up to 10 mm: 130 mm.
/// The interleaf: 130 mm + one more wrap at the outer MLT (pi x 11.25 = 35.34 mm) + 10 mm
/// overlap = 175.3, rounded up: 180 mm; 10 mm + 1 mm a side = 12 mm wide. The default foil
/// width is the 12 mm breadth less 1 mm a side.
#[test]
fn foil_cut_lengths_worked_by_hand() {
    let dir = tempfile::tempdir().unwrap();
    let path = dir.path().join("one-foil.toml");
    std::fs::write(
        &path,
        "format = 1\n[bobbin]\nname = \"test\"\n[bobbin.window]\nwidth_mm = 12.0\nheight_mm = 5.0\n\
         [bobbin.tube]\nshape = \"round\"\ndiameter_mm = 10.0\n\n[[winding]]\nname = \"S\"\n\
         role = \"secondary\"\nturns = 3\nwire = { foil_mm = 0.2, interleaf_mm = 0.05 }\n\n\
         [[stack]]\nwinding = \"S\"\n",
    )
    .unwrap();
    let b = load_build(&path).unwrap();
    let e = evaluate(&b);
    let c = foil_cut(&b, &e, 0).expect("a foil winding");
    let pi = std::f64::consts::PI;
    assert!((c.wound_mm - pi * 32.25).abs() < 0.01, "{}", c.wound_mm);
    assert_eq!(c.foil_cut_mm, 130.0);
    assert_eq!(c.interleaf_cut_mm, 180.0);
    assert!((c.width_mm - 10.0).abs() < 1e-9);
    assert!((c.interleaf_width_mm - 12.0).abs() < 1e-9);
    // The sheet says the same.
    let sheet = turnstack::report::sheet::sheet(&b, &e, 20.0);
    let step = &sheet.steps[0];
    let foil = step
        .lines
        .iter()
        .find(|(k, _)| k == "Foil S")
        .expect("a foil line");
    assert!(foil.1.contains("10 mm wide, cut 130 mm long"), "{}", foil.1);
    let il = step.lines.iter().find(|(k, _)| k == "Interleaf").unwrap();
    assert!(
        il.1.contains("12 mm wide") && il.1.contains("cut 180 mm long"),
        "{}",
        il.1
    );
    assert!(foil.1.contains("deburr"), "{}", foil.1);
    let tabs = step.lines.iter().find(|(k, _)| k == "Tabs").unwrap();
    assert!(
        tabs.1.contains("solder or crimp") && tabs.1.contains("tape"),
        "{}",
        tabs.1
    );
}

/// The main screen's wire key opens the conductor's own first key; the grade key on a foil
/// says why it does nothing.
#[test]
fn the_wire_and_grade_keys_follow_the_conductor() {
    use turnstack::tui::app::Overlay;
    let mut app = example_app();
    press(&mut app, "<tab>");
    press(&mut app, "jw");
    match app.ui.overlays.last() {
        Some(Overlay::Prompt(p)) => assert_eq!(p.label, "foil thickness"),
        other => panic!("a prompt for the foil: {other:?}"),
    }
    press(&mut app, "<esc>kw");
    match app.ui.overlays.last() {
        Some(Overlay::Prompt(p)) => assert_eq!(p.label, "litz strands"),
        other => panic!("a prompt for the litz: {other:?}"),
    }
    press(&mut app, "<esc>jg");
    let (text, kind) = status(&app);
    assert_eq!(kind, Some(StatusKind::Refused));
    assert!(text.contains("foil has no enamel"), "{text}");
    assert_eq!(app.doc.build, example_app().doc.build);
}
