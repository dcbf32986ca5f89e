//! The planner's background work: a search started, cancelled with Esc or finished; and a
//! new build from requirements, designed, opened and undone.

use crate::tui_support::*;
use std::sync::atomic::AtomicBool;
use turnstack::engine::design::{DesignSettings, design};
use turnstack::tui::app::{Overlay, PickValue};
use turnstack::tui::{App, Effect, run::perform};

fn status(app: &App) -> String {
    app.ui
        .status
        .as_ref()
        .map(|s| s.text.clone())
        .unwrap_or_default()
}

#[test]
fn esc_cancels_a_search_and_leaves_the_build() {
    let mut app = demo_app();
    let before = app.doc.build.clone();
    perform(&mut app, Effect::Search);
    assert!(app.job.is_some(), "{}", status(&app));
    press(&mut app, "<esc>");
    finish_job(&mut app);
    assert_eq!(app.doc.build, before);
    assert!(status(&app).contains("cancelled"), "{}", status(&app));
    assert!(app.ui.overlays.is_empty());
}

#[test]
fn a_finished_search_lists_candidates() {
    let mut app = demo_app();
    perform(&mut app, Effect::Search);
    finish_job(&mut app);
    let Some(Overlay::Picker(p)) = app.ui.overlays.last() else {
        panic!("no list: {}", status(&app));
    };
    assert!(matches!(p.items[0].value, PickValue::Candidate { .. }));
}

/// The demo's requirements on one bobbin: the form, the designs, Enter opens the first one
/// with the turns `engine::design::design` gives, and u returns to the old build.
#[test]
fn requirements_flow_opens_the_engines_design_and_undo_returns() {
    let mut app = bench_app();
    let before = app.doc.build.clone();
    press(&mut app, "N<down><enter>");
    assert!(matches!(app.ui.overlays.last(), Some(Overlay::Form(_))));
    let mut req = app.ui.needs.clone().unwrap();
    req.bobbins = Some(vec!["e25-13-7".into()]);
    app.ui.needs = Some(req.clone());
    let effects = press(&mut app, &"<down>".repeat(20));
    assert!(effects.is_empty());
    for e in press(&mut app, "<enter>") {
        perform(&mut app, e);
    }
    finish_job(&mut app);
    let lib = turnstack::files::BobbinLibrary::standard();
    let b = lib.find("e25-13-7").unwrap().unwrap();
    let want = design(
        &req,
        &[("e25-13-7".into(), b)],
        &DesignSettings::default(),
        &|_, _| {},
        &AtomicBool::new(false),
    );
    assert!(!want.designs.is_empty());
    let s = screen(&app, 80, 24);
    assert!(s.contains("e25-13-7"), "{s}");
    press(&mut app, "<enter>");
    let turns: Vec<u32> = app.doc.build.windings.iter().map(|w| w.turns).collect();
    let want_turns: Vec<u32> = want.designs[0]
        .build
        .windings
        .iter()
        .map(|w| w.turns)
        .collect();
    assert_eq!(turns, want_turns);
    assert_eq!(app.doc.path, None, "the design is not the old file's build");
    press(&mut app, "u");
    assert_eq!(app.doc.build, before);
    assert!(app.doc.path.is_some());
    assert!(!app.dirty());
}

/// Equal reset and primary turns give a 50 % reset duty limit and an off-state voltage of
/// 2 Vin (common practice): a 60 V switch at 0.8 derating (48 V) cannot take 2 x 28 V = 56 V.
#[test]
fn an_impossible_switch_rating_is_named_under_the_form() {
    let mut app = demo_app();
    press(&mut app, "N<down><enter>");
    let mut req = app.ui.needs.clone().unwrap();
    req.operating.vin_max_v = 28.0;
    req.operating.duty_limit = Some(0.5);
    req.switch.voltage_rating_v = 60.0;
    req.switch.derating = 0.8;
    req.bobbins = Some(vec!["e25-13-7".into()]);
    app.ui.needs = Some(req);
    press(&mut app, &"<down>".repeat(20));
    for e in press(&mut app, "<enter>") {
        perform(&mut app, e);
    }
    finish_job(&mut app);
    let least_v = 2.0 * 28.0;
    let note = app.ui.design_note.clone().unwrap_or_default();
    assert!(note.contains("switch rating"), "{note}");
    assert!(note.contains(&format!("{least_v} V")), "{note}");
    let s = render(&app, 80, 24).join(" ");
    assert!(s.contains("switch rating"), "{s}");
}

/// A second output typed into the form: the design winds it on its own secondary S2, and the
/// turns give it `V2 = (N2 / N1)(V1 + Vd) - Vd` (a forward converter's outputs share the
/// volts per turn while the switch is on; common practice) within 5 % of its target. Clearing
/// its voltage returns the form to one output.
#[test]
fn a_second_output_typed_in_the_form_gets_its_own_secondary() {
    let mut app = bench_app();
    press(&mut app, "N<down><enter>");
    // Rows: lowest input, highest input, output voltage, output current, then the second's.
    press(&mut app, "<down><down><down><down><enter>");
    press(&mut app, &"<bs>".repeat(20));
    press(&mut app, "12<enter>");
    press(&mut app, "<down><enter>");
    press(&mut app, &"<bs>".repeat(20));
    press(&mut app, "0.3<enter>");
    let mut req = app.ui.needs.clone().unwrap();
    let outs = &req.operating.outputs;
    assert_eq!(outs.len(), 2, "{outs:?}");
    assert_eq!(
        (outs[1].winding.as_str(), outs[1].vout_v, outs[1].iout_a),
        ("S2", 12.0, 0.3)
    );
    assert_eq!(outs[0].vout_v, req.operating.vout_v);
    req.bobbins = Some(vec!["etd29".into()]);
    app.ui.needs = Some(req.clone());
    press(&mut app, &"<down>".repeat(20));
    for e in press(&mut app, "<enter>") {
        perform(&mut app, e);
    }
    finish_job(&mut app);
    press(&mut app, "<enter>");
    let b = &app.doc.build;
    let turns_of = |name: &str| {
        b.windings
            .iter()
            .find(|w| w.name.as_str() == name)
            .map(|w| w.turns)
    };
    let (n1, n2) = (turns_of("S").unwrap(), turns_of("S2").unwrap());
    let vd = req.operating.rectifier_drop_v;
    let v2 = f64::from(n2) / f64::from(n1) * (req.operating.vout_v + vd) - vd;
    assert!(
        (v2 - 12.0).abs() <= 0.05 * 12.0,
        "S {n1} turns, S2 {n2}: {v2} V"
    );
}

/// Clearing the second output's voltage in the form returns it to one output, and the second
/// current cannot be typed before a second voltage.
#[test]
fn clearing_the_second_output_leaves_one() {
    let mut app = bench_app();
    press(&mut app, "N<down><enter>");
    press(&mut app, "<down><down><down><down><down><enter>");
    press(&mut app, "1<enter>");
    assert!(app.ui.needs.as_ref().unwrap().operating.outputs.is_empty());
    assert!(status(&app).contains("voltage first"), "{}", status(&app));
    press(&mut app, "<up><enter>");
    press(&mut app, &"<bs>".repeat(20));
    press(&mut app, "12<enter>");
    assert_eq!(
        app.ui.needs.as_ref().unwrap().operating.outputs.len(),
        2,
        "{}",
        screen(&app, 80, 24)
    );
    press(&mut app, "<enter>");
    press(&mut app, &"<bs>".repeat(20));
    press(&mut app, "<enter>");
    assert!(app.ui.needs.as_ref().unwrap().operating.outputs.is_empty());
}

/// A bobbin id longer than the bundled ones (a user's own, fourteen characters) shows whole
/// in the designs list, and the columns after it line up with the header's.
#[test]
fn a_long_bobbin_id_shows_whole_in_the_designs_list() {
    let mut app = bench_app();
    let mut own = app
        .library
        .iter()
        .find(|e| e.id == "e25-13-7")
        .cloned()
        .unwrap();
    own.id = "my-e25-rewound".into();
    app.library.push(own);
    press(&mut app, "N<down><enter>");
    let mut req = app.ui.needs.clone().unwrap();
    req.bobbins = Some(vec!["my-e25-rewound".into()]);
    app.ui.needs = Some(req);
    press(&mut app, &"<down>".repeat(20));
    for e in press(&mut app, "<enter>") {
        perform(&mut app, e);
    }
    finish_job(&mut app);
    let lines = render(&app, 80, 24);
    let header = lines
        .iter()
        .find(|l| l.contains("bobbin") && l.contains("turns"))
        .unwrap_or_else(|| panic!("{}", lines.join("\n")));
    let row = lines
        .iter()
        .find(|l| l.contains("my-e25-rewound"))
        .unwrap_or_else(|| panic!("{}", lines.join("\n")));
    // The turns start where the header's "turns" does: right after the id and one space.
    let col = |l: &str, s: &str| l.find(s).map(|b| l[..b].chars().count());
    let turns_at = col(header, "turns").unwrap();
    let id_at = col(row, "my-e25-rewound").unwrap();
    assert!(
        turns_at >= id_at + "my-e25-rewound ".len(),
        "{header}\n{row}"
    );
    assert!(
        row.chars()
            .nth(turns_at)
            .is_some_and(|c| c.is_ascii_digit()),
        "the turns sit under their header:\n{header}\n{row}"
    );
}
