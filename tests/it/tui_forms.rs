//! App-state tests of the planner's forms for `[operating]`, `[material]`, `[isolation]`, the
//! ranked bobbin list, the measured core, the winding sheet and the search: each changes the
//! Build as intended, undo restores it, and invalid input is refused with a message.

use crate::tui_support::*;
use turnstack::engine::measured_core;
use turnstack::model::{BobbinSource, IsolationClass, ResetSide};
use turnstack::tui::app::{Overlay, PickValue, StatusKind};
use turnstack::tui::{Action, App, Effect, run::perform};

fn status(app: &App) -> String {
    app.ui
        .status
        .as_ref()
        .map(|s| s.text.clone())
        .unwrap_or_default()
}

fn refused(app: &App) -> bool {
    app.ui
        .status
        .as_ref()
        .is_some_and(|s| s.kind == StatusKind::Refused)
}

/// Replace the prompt's text: clear what is there, type the new value, accept.
fn type_value(app: &mut App, text: &str) {
    press(app, &"<bs>".repeat(40));
    press(app, text);
    press(app, "<enter>");
}

/// A folder of its own for a test that writes files.
fn scratch(name: &str) -> std::path::PathBuf {
    let d = std::env::temp_dir().join(format!("turnstack-tui-{}-{name}", std::process::id()));
    let _ = std::fs::remove_dir_all(&d);
    std::fs::create_dir_all(&d).unwrap();
    d
}

/// Primary-side reset of a single-switch forward converter: the reset winding clamps at
/// Vin x Np/Nr, so the duty limit is Np/(Np+Nr) and the switch sees Vin (1 + Np/Nr); equal
/// turns give 50 % and twice the input (common practice). Fewer reset turns reset faster
/// (more duty) at a higher switch voltage.
#[test]
fn reset_turns_in_the_operating_form_move_duty_limit_and_switch_voltage_common_practice() {
    let mut app = demo_app();
    let vin_max = app.doc.build.operating.as_ref().unwrap().vin_max_v;
    let c = app
        .doc
        .eval
        .converter
        .clone()
        .expect("the demo has an operating point");
    assert_eq!(
        app.doc.build.windings[0].turns,
        app.doc.build.windings[2].turns
    );
    assert!((c.reset_duty_limit - 0.5).abs() < 1e-12);
    assert!((c.switch_voltage_v - 2.0 * vin_max).abs() < 1e-9);
    let before = screen(&app, 80, 24);
    assert!(before.contains("reset %"), "{before}");
    assert!(before.contains("50.0"), "{before}");
    assert!(before.contains("56.0"), "{before}");

    // Second row of the operating form: the reset winding's turns.
    press(&mut app, "V<down><enter>");
    type_value(&mut app, "12");
    assert_eq!(app.doc.build.windings[2].turns, 12);
    let c = app.doc.eval.converter.clone().unwrap();
    assert!(c.reset_duty_limit > 0.5, "{}", c.reset_duty_limit);
    assert!((c.reset_duty_limit - 24.0 / 36.0).abs() < 1e-12);
    assert!(c.switch_voltage_v > 2.0 * vin_max);
    assert!((c.switch_voltage_v - vin_max * 3.0).abs() < 1e-9);
    // The form's note and, once it is closed, the check panel both show the new figures.
    assert!(screen(&app, 80, 24).contains("reset duty limit 66.7 %"));
    press(&mut app, "<esc>");
    let after = screen(&app, 80, 24);
    assert!(after.contains("66.7"), "{after}");
    assert!(after.contains("84.0"), "{after}");

    press(&mut app, "u");
    assert_eq!(app.doc.build.windings[2].turns, 24);
    assert!((app.doc.eval.converter.as_ref().unwrap().reset_duty_limit - 0.5).abs() < 1e-12);
}

/// With no rise limit or ambient in the file, the operating form names the figures the
/// engine takes instead (the evaluation's own `rise_limit_c` and ambient, FORMAT.md's
/// defaults) rather than a bare "none" that reads as no limit at all.
#[test]
fn the_operating_form_shows_the_defaults_the_engine_takes() {
    let mut app = demo_app();
    app.edit("clear the limits", |b| {
        let o = b.operating.as_mut().unwrap();
        o.rise_limit_c = None;
        o.ambient_c = None;
        Ok(())
    });
    let losses = app.doc.eval.losses.clone().unwrap();
    let rows = app.form_rows(turnstack::tui::fields::FormKind::Operating);
    let value = |label: &str| {
        rows.iter()
            .find(|r| r.label == label)
            .map(|r| r.value.clone())
            .unwrap_or_else(|| panic!("no row {label}"))
    };
    assert_eq!(
        value("temperature rise allowed"),
        format!("none: {} C taken", losses.rise_limit_c)
    );
    assert_eq!(
        value("ambient air"),
        format!("none: {} C taken", losses.ambient_c)
    );
}

#[test]
fn operating_fields_edit_and_the_engine_refuses_a_bad_point() {
    let mut app = demo_app();
    // Highest input voltage: fourth row.
    press(&mut app, "V<down><down><down><enter>");
    type_value(&mut app, "30");
    assert_eq!(app.doc.build.operating.as_ref().unwrap().vin_max_v, 30.0);
    // Lowest input above the highest: validation says no, the build is kept.
    press(&mut app, "<up><enter>");
    type_value(&mut app, "40");
    assert!(refused(&app), "{}", status(&app));
    assert!(status(&app).contains("vin_max_v"), "{}", status(&app));
    assert_eq!(app.doc.build.operating.as_ref().unwrap().vin_min_v, 20.0);
    press(&mut app, "<enter>");
    type_value(&mut app, "twenty");
    assert!(status(&app).contains("not a number"));
    // The duty limit may be cleared; a duty of 1.5 is refused.
    press(&mut app, &"<down>".repeat(5));
    press(&mut app, "<enter>");
    type_value(&mut app, "1.5");
    assert!(refused(&app));
    press(&mut app, "<enter>");
    type_value(&mut app, "");
    assert_eq!(app.doc.build.operating.as_ref().unwrap().duty_limit, None);
    // The reset side cycles.
    press(&mut app, &"<up>".repeat(20));
    press(&mut app, "<enter>");
    assert_eq!(
        app.doc.build.operating.as_ref().unwrap().reset_side,
        ResetSide::Secondary
    );
    // Two undos take back the reset side and the cleared duty limit, not the voltage.
    press(&mut app, "<esc>uu");
    assert_eq!(app.doc.build.operating.as_ref().unwrap().vin_max_v, 30.0);
    assert_eq!(
        app.doc.build.operating.as_ref().unwrap().duty_limit,
        Some(0.45)
    );
}

#[test]
fn the_operating_table_is_removed_and_added_back() {
    let mut app = demo_app();
    press(&mut app, "V");
    press(&mut app, &"<down>".repeat(20));
    press(&mut app, "<enter>");
    assert!(app.doc.build.operating.is_none());
    assert!(app.doc.eval.converter.is_none());
    // Only the "add" row is left.
    press(&mut app, "<enter>");
    assert!(app.doc.build.operating.is_some());
    assert!(app.doc.eval.converter.is_some());
    press(&mut app, "<esc>uu");
    assert_eq!(app.doc.build, demo_app().doc.build);

    // Without a frequency the engine refuses an operating point.
    let mut app = demo_app();
    app.edit("no frequency, no point", |b| {
        b.operating = None;
        b.setup.frequency_khz = None;
        Ok(())
    })
    .unwrap();
    press(&mut app, "V<enter>");
    assert!(refused(&app));
    assert!(status(&app).contains("frequency"), "{}", status(&app));
    assert!(app.doc.build.operating.is_none());
}

#[test]
fn material_ferrite_figures_and_removal() {
    let mut app = demo_app();
    assert_eq!(app.doc.build.material.as_ref().unwrap().ferrite, None);
    // The grade row opens the list of bundled ferrites; pick the cold one by filtering.
    press(&mut app, "M<enter>25c<enter>");
    let g = turnstack::library::materials::find("mnzn-power-25c").unwrap();
    let m = app.doc.build.material.clone().unwrap();
    assert_eq!(m.ferrite.as_deref(), Some("mnzn-power-25c"));
    assert_eq!(m.bsat_mt, g.bsat_mt);
    assert_eq!(m.steinmetz, Some(g.steinmetz));
    // Remanence at or above saturation is refused by the engine.
    press(&mut app, "<down><down><enter>");
    type_value(&mut app, "600");
    assert!(refused(&app), "{}", status(&app));
    // Loss coefficients as three numbers; two numbers are refused.
    press(&mut app, "<down><down><enter>");
    type_value(&mut app, "50 1.5 2.7");
    let st = app.doc.build.material.as_ref().unwrap().steinmetz.unwrap();
    assert_eq!((st.k, st.alpha, st.beta), (50.0, 1.5, 2.7));
    press(&mut app, "<enter>");
    type_value(&mut app, "50 1.5");
    assert!(status(&app).contains("three numbers"));
    // A gap, then remove the table.
    press(&mut app, "<down><enter>");
    type_value(&mut app, "0.1");
    assert_eq!(app.doc.build.material.as_ref().unwrap().gap_mm, Some(0.1));
    press(&mut app, "<down><enter>");
    assert!(app.doc.build.material.is_none());
    press(&mut app, "<esc>uuuu");
    assert_eq!(app.doc.build, demo_app().doc.build);
}

#[test]
fn isolation_is_declared_cycled_and_shows_the_caution_when_reinforced() {
    let mut app = demo_app();
    assert!(app.doc.build.isolation.is_none());
    press(&mut app, "I<enter>");
    assert_eq!(
        app.doc.build.isolation.as_ref().unwrap().class,
        IsolationClass::Functional
    );
    press(&mut app, "<enter><enter>");
    assert_eq!(
        app.doc.build.isolation.as_ref().unwrap().class,
        IsolationClass::Reinforced
    );
    let s = screen(&app, 80, 24);
    assert!(s.contains("three"), "{s}");
    assert!(s.contains("hipot"), "{s}");
    assert!(s.contains("qualified person"), "{s}");
    // The engine now warns: the demo has one wrap between primary and secondary.
    assert!(
        app.doc
            .eval
            .warnings
            .iter()
            .any(|w| w.code() == "isolation-wraps"),
        "{:?}",
        app.doc.eval.warnings
    );
    press(&mut app, "<down><down><enter>");
    type_value(&mut app, "-2");
    assert!(refused(&app));
    press(&mut app, "<enter>");
    type_value(&mut app, "6");
    assert_eq!(
        app.doc.build.isolation.as_ref().unwrap().creepage_mm,
        Some(6.0)
    );
    press(&mut app, "<down><enter>");
    assert!(app.doc.build.isolation.is_none());
    press(&mut app, "<esc>uuuuu");
    assert!(app.doc.build.isolation.is_none());
    assert_eq!(app.doc.build, demo_app().doc.build);
}

/// The bobbin list follows `report::fit::rank`: fitting first, most spare first.
#[test]
fn bobbin_list_is_ranked_by_fit_with_the_current_one_marked() {
    let mut app = demo_app();
    press(&mut app, "B");
    let Some(Overlay::Picker(p)) = app.ui.overlays.last().cloned() else {
        panic!("no bobbin list");
    };
    let lib = turnstack::files::BobbinLibrary::standard();
    let bobbins: Vec<_> = lib
        .entries()
        .into_iter()
        .filter_map(|e| e.bobbin.ok().map(|b| (e.id, b)))
        .collect();
    let ranked = turnstack::report::fit::rank(&app.doc.build, &bobbins);
    let ids: Vec<String> = p
        .items
        .iter()
        .filter_map(|it| match &it.value {
            PickValue::Bobbin { id, .. } => Some(id.clone()),
            _ => None,
        })
        .collect();
    let want: Vec<String> = ranked.iter().map(|r| r.bobbin.clone()).collect();
    assert_eq!(ids, want);
    assert!(ranked[0].fits && !ranked.last().unwrap().fits);
    let current = p.items.iter().find(|it| it.label.starts_with('*')).unwrap();
    assert_eq!(current.value.bobbin_id(), Some("e25-13-7"));
    assert!(p.items[0].label.contains("yes"));
    assert!(p.items.iter().any(|it| it.label.contains("too tall")));
    // Choosing one is an edit; undo goes back.
    press(&mut app, "etd34<enter>");
    assert_eq!(
        app.doc.build.bobbin_source,
        BobbinSource::Id("etd34".into())
    );
    press(&mut app, "u");
    assert_eq!(
        app.doc.build.bobbin_source,
        BobbinSource::Id("e25-13-7".into())
    );
}

/// A 20-turn test winding of 600 uH on a 7.5 x 7.5 mm leg, le 57.5 mm, mu_i 2300: AL =
/// L/N^2 = 1500 nH, and the gap from `engine::measured_core` reads as a gapped or dirty face.
#[test]
fn measured_core_shows_al_mu_e_and_gap_then_applies_and_undoes() {
    let mut app = demo_app();
    let old = app.doc.build.bobbin.clone();
    press(&mut app, "Bmeasured<enter>");
    // Applying without a leg is refused.
    press(&mut app, &"<down>".repeat(12));
    press(&mut app, "<enter>");
    assert!(refused(&app), "{}", status(&app));
    assert!(status(&app).contains("centre leg"));
    press(&mut app, &"<up>".repeat(20));
    press(&mut app, &"<down>".repeat(7));
    press(&mut app, "<enter><down><enter>");
    type_value(&mut app, "7.5");
    press(&mut app, "<down><enter>");
    type_value(&mut app, "7.5");
    press(&mut app, "<down><down><enter>");
    type_value(&mut app, "20");
    press(&mut app, "<down><enter>");
    type_value(&mut app, "600");
    press(&mut app, "<enter>");
    type_value(&mut app, "-1");
    assert!(refused(&app));
    assert_eq!(app.ui.core_draft.test_uh, Some(600.0));
    assert_eq!(app.ui.core_draft.le_mm, Some(57.5));
    assert_eq!(app.ui.core_draft.mu_i, Some(2300.0));
    let mu_e = measured_core::mu_e(1500.0, 57.5, 56.25);
    let gap = measured_core::equivalent_gap_mm(mu_e, 2300.0, 57.5);
    let s = screen(&app, 80, 24);
    assert!(s.contains("AL = L/N^2 1500 nH"), "{s}");
    assert!(s.contains(&format!("mu_e {mu_e:.0}")), "{s}");
    assert!(s.contains(&format!("gap {gap:.3} mm")), "{s}");
    assert!(s.contains("dirty"), "{s}");
    // Apply: the bobbin gets the core, one edit.
    press(&mut app, "<down><down><enter>");
    let core = app.doc.build.bobbin.core.clone().expect("a core");
    assert_eq!(core.ae_mm2, 56.25);
    assert_eq!(core.le_mm, 57.5);
    assert_eq!(core.al_nh, Some(1500.0));
    assert_eq!(app.doc.eval.converter.as_ref().unwrap().al_nh, Some(1500.0));
    press(&mut app, "<esc>u");
    assert_eq!(app.doc.build.bobbin, {
        let mut b = old.clone();
        b.name = app.doc.build.bobbin.name.clone();
        b.origin = "measured".into();
        b
    });
}

#[test]
fn a_measured_bobbin_is_saved_and_an_existing_file_kept_unless_confirmed() {
    let dir = scratch("bobbins");
    let mut app = demo_app();
    app.bobbin_dir = Some(dir.clone());
    press(&mut app, "Bmeasured<enter>");
    press(&mut app, &"<down>".repeat(20));
    press(&mut app, "<enter>");
    type_value(&mut app, "bad id!");
    assert!(refused(&app));
    let effects = {
        press(&mut app, "<enter>");
        press(&mut app, &"<bs>".repeat(40));
        press(&mut app, "bench-e25<enter>")
    };
    let [Effect::SaveBobbin { path, .. }] = effects.as_slice() else {
        panic!("{effects:?}");
    };
    assert_eq!(path, &dir.join("bench-e25.toml"));
    perform(&mut app, effects[0].clone());
    let text = std::fs::read_to_string(path).unwrap();
    let back = turnstack::files::parse_bobbin(&text, None).unwrap();
    assert_eq!(back.window, app.doc.build.bobbin.window);
    // Again: it asks (the loop finds the file there); no keeps the file.
    std::fs::write(path, "# mine\n").unwrap();
    press(&mut app, "<enter>");
    press(&mut app, &"<bs>".repeat(40));
    for e in press(&mut app, "bench-e25<enter>") {
        perform(&mut app, e);
    }
    assert!(matches!(app.ui.overlays.last(), Some(Overlay::Question(_))));
    assert!(press(&mut app, "n").is_empty());
    assert_eq!(std::fs::read_to_string(path).unwrap(), "# mine\n");
    // Yes replaces it.
    press(&mut app, "<enter>");
    press(&mut app, &"<bs>".repeat(40));
    for e in press(&mut app, "bench-e25<enter>") {
        perform(&mut app, e);
    }
    let effects = press(&mut app, "y");
    assert_eq!(effects.len(), 1);
    perform(&mut app, effects[0].clone());
    assert_eq!(std::fs::read_to_string(path).unwrap(), text);
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn the_winding_sheet_is_written_as_text_or_html_and_the_status_says_where() {
    let dir = scratch("sheet");
    let mut app = demo_app();
    for (name, marker) in [("w.txt", "Checks"), ("w.html", "<svg")] {
        let path = dir.join(name);
        press(&mut app, "E");
        press(&mut app, &"<bs>".repeat(40));
        let effects = press(&mut app, &format!("{}<enter>", path.display()));
        assert_eq!(effects, vec![Effect::WriteSheet(path.clone())]);
        perform(&mut app, effects[0].clone());
        let text = std::fs::read_to_string(&path).unwrap();
        let id = turnstack::report::sheet::sheet(&app.doc.build, &app.doc.eval, 20.0).build_id;
        assert!(text.contains(&id), "{name}");
        assert!(text.contains(marker), "{name}: {marker}");
        assert!(status(&app).contains(&path.display().to_string()));
    }
    // No name: refused.
    press(&mut app, "E");
    press(&mut app, &"<bs>".repeat(40));
    assert!(press(&mut app, "<enter>").is_empty());
    assert!(refused(&app));
    let _ = std::fs::remove_dir_all(&dir);
}

#[test]
fn search_lists_candidates_and_taking_one_is_one_undoable_edit() {
    let mut app = demo_app();
    let original = app.doc.build.clone();
    let effect = app.update(Action::Search);
    assert_eq!(effect, Some(Effect::Search));
    assert!(status(&app).starts_with("searching"));
    perform(&mut app, Effect::Search);
    finish_job(&mut app);
    let Some(Overlay::Picker(p)) = app.ui.overlays.last().cloned() else {
        panic!("no candidate list: {}", status(&app));
    };
    // Each item carries its candidate, numbered from 0 in the order listed.
    let found: Vec<_> = p
        .items
        .iter()
        .map(|it| match &it.value {
            PickValue::Candidate { n, candidate } => (*n, candidate.build.clone()),
            other => panic!("not a candidate: {other:?}"),
        })
        .collect();
    assert!(!found.is_empty());
    assert!(found.iter().enumerate().all(|(i, (n, _))| i == *n));
    assert!(p.title.contains("evaluated") && p.title.contains("skipped"));
    assert!(p.header.contains("loss W") && p.header.contains("leak uH"));
    press(&mut app, "<down><enter>");
    assert_eq!(app.doc.build, found[1].1);
    assert_ne!(app.doc.build, original);
    assert_eq!(app.doc.undo.len(), 1);
    press(&mut app, "u");
    assert_eq!(app.doc.build, original);
}

#[test]
fn search_on_a_build_without_a_secondary_is_refused() {
    let mut app = demo_app();
    app.edit("all primary", |b| {
        b.operating = None;
        b.windings[1].role = turnstack::model::Role::Primary;
        Ok(())
    })
    .unwrap();
    perform(&mut app, Effect::Search);
    assert!(refused(&app), "{}", status(&app));
    assert!(status(&app).contains("secondary"));
    assert!(app.ui.overlays.is_empty());
}

/// Every row of every form does what its table row says when Enter is pressed on it: a
/// typed field opens the line editor labelled with the row's label and starting from the
/// value shown, and a value that is not one (here "x") is refused, not written; a row that
/// acts at once changes the status or opens a list. Nothing panics, and the form stays open.
#[test]
fn every_form_row_answers_enter_as_its_table_says() {
    use turnstack::tui::app::FormKind;
    let forms = [
        ("G", FormKind::Setup),
        ("<tab><enter>", FormKind::Winding(0)),
        ("V", FormKind::Operating),
        ("M", FormKind::Material),
        ("I", FormKind::Isolation),
        ("Bmeasured<enter>", FormKind::Bobbin),
        ("R", FormKind::Readings),
    ];
    for (open, kind) in forms {
        let rows = {
            let mut app = bench_app();
            press(&mut app, open);
            app.form_rows(kind).len()
        };
        assert!(rows > 0, "{kind:?}");
        for r in 0..rows {
            let mut app = bench_app();
            press(&mut app, open);
            let before = app.doc.build.clone();
            let all = app.form_rows(kind);
            let (label, shown) = (all[r].label, all[r].value.clone());
            press(&mut app, &"<down>".repeat(r));
            press(&mut app, "<enter>");
            match app.ui.overlays.last().cloned() {
                // This row acts: it asks for the id to save the bobbin under.
                Some(Overlay::Prompt(p)) if label == "save the bobbin to your folder" => {
                    assert_eq!(p.purpose, turnstack::tui::app::PromptPurpose::BobbinId);
                    press(&mut app, "<esc>");
                }
                Some(Overlay::Prompt(p)) => {
                    assert_eq!(p.label, label, "{kind:?} row {r}");
                    // The text to edit is the value shown, less its unit and words.
                    let words: Vec<&str> = shown.split_whitespace().collect();
                    for w in p.text.split_whitespace() {
                        assert!(
                            words.contains(&w),
                            "{kind:?} {label}: {} vs {shown}",
                            p.text
                        );
                    }
                    press(&mut app, &"<bs>".repeat(p.text.chars().count() + 1));
                    press(&mut app, "x<enter>");
                    let names_or_pins = matches!(
                        label,
                        "title" | "name" | "pins (start, finish)" | "hipot result" | "note"
                    );
                    if !names_or_pins {
                        assert!(refused(&app), "{kind:?} {label}: {}", status(&app));
                        assert_eq!(app.doc.build, before, "{kind:?} {label}");
                    }
                }
                Some(Overlay::Picker(_) | Overlay::Form(_)) => {}
                other => panic!("{kind:?} row {r}: {other:?}"),
            }
            if matches!(app.ui.overlays.last(), Some(Overlay::Picker(_))) {
                press(&mut app, "<esc>");
            }
            assert!(
                matches!(app.ui.overlays.last(), Some(Overlay::Form(f)) if f.kind == kind),
                "{kind:?} row {r} ({label}): {:?}",
                app.ui.overlays.last()
            );
        }
    }
}

/// The line editor opens on the value as it is: typing replaces it (as a selected field
/// does), Backspace edits it. Typing "30" over 24 turns gives 30, not 2430.
#[test]
fn typing_replaces_the_shown_value_and_backspace_edits_it() {
    let mut app = demo_app();
    let p = app.doc.build.winding_index("P").unwrap();
    assert_eq!(app.doc.build.windings[p].turns, 24);
    press(&mut app, "<tab>t30<enter>");
    assert_eq!(app.doc.build.windings[p].turns, 30);
    press(&mut app, "t<bs>2<enter>");
    assert_eq!(app.doc.build.windings[p].turns, 32);
    let shown = screen(&app, 80, 24);
    assert!(!shown.contains("typing replaces"), "{shown}");
    press(&mut app, "t");
    let shown = screen(&app, 80, 24);
    assert!(shown.contains("typing replaces this value"), "{shown}");
}

/// The switch's rating and the ambient are typed in the operating form. With equal primary
/// and reset turns the switch blocks twice the highest input (common practice): 2 x 28 V =
/// 56 V on the demo, which the reset-ratio view then sets against the typed 50 V.
#[test]
fn the_switch_rating_and_ambient_are_typed_in_the_operating_form() {
    let mut app = demo_app();
    // Switch voltage rating: the row after the controller's duty limit.
    press(&mut app, &format!("V{}<enter>", "<down>".repeat(8)));
    type_value(&mut app, "50");
    let op = app.doc.build.operating.as_ref().unwrap();
    assert_eq!(op.switch_rating_v, Some(50.0));
    // Ambient: two rows further down.
    press(&mut app, "<down><down><enter>");
    type_value(&mut app, "55");
    assert_eq!(
        app.doc.build.operating.as_ref().unwrap().ambient_c,
        Some(55.0)
    );
    press(&mut app, "<esc>D");
    let shown = screen(&app, 80, 24);
    assert!(shown.contains("56 V against 50 V"), "{shown}");
}
