//! The planner's readings form and its readings-against-the-plan view: readings typed in
//! through keys are stored in the build's `[measured]` table (undo takes them out again), a
//! part one turn short on its secondary shows OUT on that ratio with the winding named, and a
//! clean part shows every reading within.

use crate::tui_support::*;
use turnstack::engine::verify::{Quantity, predictions};
use turnstack::tui::App;
use turnstack::tui::app::{FormKind, Overlay, StatusKind};

/// The row of the readings form whose label and shown value start as given.
fn row_of(app: &App, label: &str, value_starts: &str) -> usize {
    app.form_rows(FormKind::Readings)
        .iter()
        .position(|r| r.label == label && r.value.starts_with(value_starts))
        .unwrap_or_else(|| panic!("no row {label} {value_starts}"))
}

/// In the open readings form: go to a row, clear what the line editor holds, type a value.
fn enter_reading(app: &mut App, label: &str, value_starts: &str, text: &str) {
    let r = row_of(app, label, value_starts);
    press(app, &"<up>".repeat(40));
    press(app, &"<down>".repeat(r));
    press(app, "<enter>");
    press(app, &"<bs>".repeat(40));
    press(app, text);
    press(app, "<enter>");
}

fn refused(app: &App) -> bool {
    app.ui
        .status
        .as_ref()
        .is_some_and(|s| s.kind == StatusKind::Refused)
}

/// Open the view from the form's last row.
fn open_view(app: &mut App) {
    let r = row_of(app, "against the plan", "");
    press(app, &"<up>".repeat(40));
    press(app, &"<down>".repeat(r));
    press(app, "<enter>");
    assert!(matches!(
        app.ui.overlays.last(),
        Some(Overlay::Readings { .. })
    ));
}

#[test]
fn readings_typed_in_are_stored_one_edit_each_and_undo_removes_them() {
    let mut app = bench_app();
    assert!(app.doc.build.measured.as_ref().is_none());
    press(&mut app, "R");
    assert!(
        matches!(app.ui.overlays.last(), Some(Overlay::Form(f)) if f.kind == FormKind::Readings)
    );
    // One DCR row per winding, one ratio row per winding but the first primary.
    let rows = app.form_rows(FormKind::Readings);
    assert_eq!(
        rows.iter().filter(|r| r.label == "DC resistance").count(),
        3
    );
    let ratios: Vec<&str> = rows
        .iter()
        .filter(|r| r.label == "voltage ratio")
        .map(|r| r.value.as_str())
        .collect();
    assert_eq!(ratios, ["S / P: none", "R / P: none"]);

    enter_reading(&mut app, "part temperature", "", "22");
    enter_reading(&mut app, "DC resistance", "S:", "0.0203");
    let said = app.ui.status.as_ref().map(|s| s.text.clone());
    assert_eq!(said.as_deref(), Some("DC resistance of S: 0.0203"));
    enter_reading(&mut app, "magnetising inductance", "", "1200");
    // The loader's checks: above 0, and leakage below the magnetising inductance.
    let before = app.doc.build.clone();
    enter_reading(&mut app, "leakage inductance", "", "1500");
    assert!(refused(&app));
    enter_reading(&mut app, "DC resistance", "P:", "-1");
    assert!(refused(&app));
    enter_reading(&mut app, "voltage ratio", "S /", "0");
    assert!(refused(&app));
    assert_eq!(app.doc.build, before);
    enter_reading(&mut app, "leakage inductance", "", "0.6");
    enter_reading(&mut app, "voltage ratio", "S /", "0.667");

    let m = app
        .doc
        .build
        .measured
        .as_ref()
        .expect("the readings are stored");
    assert_eq!(m.reading_c, Some(22.0));
    assert_eq!(m.dcr_ohm.len(), 1);
    assert_eq!((m.dcr_ohm[0].0.as_str(), m.dcr_ohm[0].1), ("S", 0.0203));
    assert_eq!(m.magnetising_uh, Some(1200.0));
    assert_eq!(m.leakage_uh, Some(0.6));
    assert_eq!(m.ratio.len(), 1);
    assert_eq!((m.ratio[0].0.as_str(), m.ratio[0].1), ("S", 0.667));

    // An empty entry clears that reading only.
    enter_reading(&mut app, "leakage inductance", "", "");
    assert_eq!(app.doc.build.measured.as_ref().unwrap().leakage_uh, None);
    assert_eq!(
        app.doc.build.measured.as_ref().unwrap().magnetising_uh,
        Some(1200.0)
    );

    // Six accepted values, six undo steps; then the build has no table again.
    press(&mut app, "<esc>");
    press(&mut app, "u");
    assert_eq!(
        app.doc.build.measured.as_ref().unwrap().leakage_uh,
        Some(0.6)
    );
    press(&mut app, "uuuuu");
    assert!(
        app.doc.build.measured.as_ref().is_none(),
        "{:?}",
        app.doc.build.measured.as_ref()
    );
}

#[test]
fn a_part_one_turn_short_on_the_secondary_shows_out_on_that_ratio_naming_the_winding() {
    let mut app = bench_app();
    let turns = |name: &str| app.doc.build.winding(name).unwrap().turns;
    let (np, ns, nr) = (turns("P"), turns("S"), turns("R"));
    // Open-circuit voltage ratio of an ideal transformer is the turns ratio (handbook): one
    // turn missing on S reads (Ns - 1) / Np; the reset winding, as wound, Nr / Np.
    let short = f64::from(ns - 1) / f64::from(np);
    let reset = f64::from(nr) / f64::from(np);
    press(&mut app, "R");
    enter_reading(&mut app, "voltage ratio", "S /", &format!("{short:.4}"));
    enter_reading(&mut app, "voltage ratio", "R /", &format!("{reset:.4}"));
    open_view(&mut app);
    let s = screen(&app, 80, 24);
    let line = |needle: &str| {
        s.lines()
            .find(|l| l.contains(needle))
            .unwrap_or_else(|| panic!("no {needle} in\n{s}"))
            .to_string()
    };
    assert!(line("Voltage ratio S / P").contains("OUT"), "{s}");
    assert!(line("Voltage ratio R / P").contains("within"), "{s}");
    assert!(s.contains("1 of 2 readings OUT"), "{s}");
    assert!(
        s.contains(&format!("S most likely has {} turns", ns - 1)),
        "{s}"
    );
    // Esc goes back to the form.
    press(&mut app, "<esc>");
    assert!(
        matches!(app.ui.overlays.last(), Some(Overlay::Form(f)) if f.kind == FormKind::Readings)
    );
}

#[test]
fn a_clean_part_shows_every_reading_within() {
    let mut app = bench_app();
    let (np, ns, nr) = {
        let t = |n: &str| f64::from(app.doc.build.winding(n).unwrap().turns);
        (t("P"), t("S"), t("R"))
    };
    press(&mut app, "R");
    enter_reading(&mut app, "part temperature", "", "20");
    // Ratios from the turns alone (ideal transformer, handbook).
    enter_reading(&mut app, "voltage ratio", "S /", &format!("{:.4}", ns / np));
    enter_reading(&mut app, "voltage ratio", "R /", &format!("{:.4}", nr / np));
    // Resistances and inductances at the plan's own figures: the view is under test here
    // (its words and rows), not the engine's predictions, which tests/it/verify_readings checks.
    for p in predictions(&app.doc.build, &app.doc.eval, 20.0) {
        let text = format!("{:.6}", p.expected);
        match &p.quantity {
            Quantity::Dcr { winding } => {
                enter_reading(&mut app, "DC resistance", &format!("{winding}:"), &text)
            }
            Quantity::Magnetising { .. } => {
                enter_reading(&mut app, "magnetising inductance", "", &text)
            }
            Quantity::Leakage { .. } => enter_reading(&mut app, "leakage inductance", "", &text),
            Quantity::Ratio { .. } => {}
        }
        assert!(!refused(&app), "{:?}", app.ui.status);
    }
    open_view(&mut app);
    let all: Vec<String> = turnstack::tui::view::readings::lines(&app, 76)
        .iter()
        .map(|l| l.to_string())
        .collect();
    let rows: Vec<&String> = all
        .iter()
        .filter(|l| l.starts_with("within") || l.starts_with("OUT") || l.starts_with("n/p"))
        .collect();
    // Three resistances, two inductances, two ratios.
    assert_eq!(rows.len(), 7, "{all:#?}");
    assert!(rows.iter().all(|l| l.starts_with("within")), "{all:#?}");
    assert!(all.iter().any(|l| l.contains("Every reading is within")));
    // At 80x24 the view opens on the verdict and the first rows.
    let s = screen(&app, 80, 24);
    assert!(s.contains("Every reading is within"), "{s}");
    assert!(!s.contains("OUT"), "{s}");
}
