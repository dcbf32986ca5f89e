//! Rendering tests of the planner with ratatui's TestBackend at 80x24 and 120x40: the
//! engine's figures appear, an overflow is marked, the help lists every key, small terminals
//! get a plain message, and no size makes drawing panic.

use crate::tui_support::*;
use ratatui::style::{Color, Modifier};
use turnstack::tui::keymap::BINDINGS;
use turnstack::tui::theme::Theme;
use turnstack::tui::view;

fn contains(screen: &str, what: &str) -> bool {
    screen.contains(what)
}

#[test]
fn bench_example_at_80x24_shows_the_engines_figures() {
    let app = bench_app();
    let s = screen(&app, 80, 24);
    let e = &app.doc.eval;
    assert!(contains(&s, "FITS"), "{s}");
    assert!(
        contains(
            &s,
            &format!(
                "{:.2} of {:.2} mm",
                e.height_with_allowance_mm, e.window_height_mm
            )
        ),
        "{s}"
    );
    let ps = e.leakage.iter().find(|l| l.to == "S").unwrap();
    assert!(contains(&s, &format!("{:.3}", ps.uh)), "{s}");
    for w in &e.windings {
        assert!(
            contains(&s, &format!("{:.4}", w.dcr_ohm)),
            "DCR of {} in\n{s}",
            w.name
        );
    }
    for sec in &e.sections {
        assert!(contains(&s, &format!("{:.3}", sec.height_mm)), "{s}");
    }
    assert!(contains(&s, "limit 4.00 mm"), "{s}");
    assert!(contains(&s, &format!("{:.3}", e.fill_factor)), "{s}");
    // A warning next to its section: the mark in the list and the label in the panel.
    assert!(contains(&s, "! 1 P+R"), "{s}");
    assert!(contains(&s, "#1: section 1 (P)"), "{s}");
    // The hint line names the help key.
    assert!(s.lines().last().unwrap().contains("? help"), "{s}");
}

#[test]
fn bench_example_at_120x40_shows_every_column_and_converter_figures() {
    let app = bench_app();
    let s = screen(&app, 120, 40);
    for w in &app.doc.eval.windings {
        assert!(contains(&s, &format!("{:.1}", w.mlt_mm)));
        let ac = w.ac.as_ref().expect("the example has a frequency");
        assert!(contains(&s, &format!("{:.4}", ac.rac_ohm)), "{s}");
    }
    let c = app.doc.eval.converter.as_ref().unwrap();
    assert!(contains(&s, &format!("{:.1}", c.switch_voltage_v)), "{s}");
    assert!(contains(&s, "x1.1 allowance 3.12 mm"), "{s}");
    // Bifilar sections show both letters; the partial last layer leaves empty cells.
    assert!(
        s.lines().any(|l| l.contains("PR") && l.contains("·")),
        "{s}"
    );
}

fn overflowing_app() -> turnstack::tui::App {
    let mut app = bench_app();
    // The bobbin entered as measured, 2.5 mm high: the 3.1 mm build cannot fit.
    app.edit("lower window", |b| {
        b.bobbin.window.height_mm = 2.5;
        Ok(())
    })
    .unwrap();
    app
}

#[test]
fn overflow_is_marked_at_both_sizes() {
    let app = overflowing_app();
    let over = -app.doc.eval.spare_height_mm;
    for (w, h) in [(80, 24), (120, 40)] {
        let s = screen(&app, w, h);
        assert!(contains(&s, "DOES NOT FIT"), "{s}");
        assert!(
            contains(&s, &format!("LIMIT 2.50: over by {over:.2} mm")),
            "{s}"
        );
        // The section past the limit is flagged in the list.
        assert!(s.lines().any(|l| l.contains("^ 5 P+R")), "{s}");
        // Its layer is drawn above the limit line.
        let lines: Vec<&str> = s.lines().collect();
        let limit = lines.iter().position(|l| l.contains("LIMIT")).unwrap();
        assert!(lines[..limit].iter().any(|l| l.contains(" 5 ┃P")), "{s}");
    }
}

#[test]
fn overflow_cells_are_reversed_so_they_show_without_colour() {
    let app = overflowing_app();
    let mut t = ratatui::Terminal::new(ratatui::backend::TestBackend::new(120, 40)).unwrap();
    t.draw(|f| view::draw(&app, f)).unwrap();
    let buf = t.backend().buffer();
    let lines = text_of(buf);
    let y = lines.iter().position(|l| l.contains(" 5 ┃P")).unwrap() as u16;
    let x = lines[y as usize].find("┃P").unwrap();
    let x = lines[y as usize][..x].chars().count() as u16 + 1;
    assert!(buf[(x, y)].modifier.contains(Modifier::REVERSED));
}

#[test]
fn help_lists_every_key_of_the_key_map() {
    let mut app = bench_app();
    press(&mut app, "?");
    let mut seen = String::new();
    for _ in 0..80 {
        seen.push_str(&screen(&app, 120, 40));
        press(&mut app, "<down>");
    }
    for bd in BINDINGS {
        assert!(seen.contains(bd.help), "help is missing \"{}\"", bd.help);
        let first = turnstack::tui::keymap::keys_label(bd);
        assert!(seen.contains(&first), "help is missing the keys {first}");
    }
    // At 80x24 too, the first screen of help shows the help key and the quit key.
    let mut small = bench_app();
    press(&mut small, "?");
    let s = screen(&small, 80, 24);
    assert!(s.contains("Help: every key"), "{s}");
    assert!(s.contains("show this help"), "{s}");
}

#[test]
fn below_80x24_the_screen_says_how_big_it_must_be() {
    let app = bench_app();
    let s = screen(&app, 79, 24);
    assert!(
        s.contains("make the terminal at least 80x24 (now 79x24)"),
        "{s}"
    );
    let s = screen(&app, 100, 12);
    assert!(
        s.contains("make the terminal at least 80x24 (now 100x12)"),
        "{s}"
    );
}

#[test]
fn drawing_never_panics_at_any_size_with_any_popup_open() {
    let mut apps = vec![bench_app(), overflowing_app()];
    for keys in [
        "?",
        "<tab>w",
        "s",
        "b",
        "G",
        "B",
        "a",
        "<tab><enter>",
        "q",
        "V",
        "M",
        "M<enter>",
        "I<enter><enter><enter>",
        "Bmeasured<enter>",
        "E",
    ] {
        let mut a = bench_app();
        press(&mut a, "+"); // unsaved, so q asks
        press(&mut a, keys);
        apps.push(a);
    }
    for app in &apps {
        for w in (0..200).step_by(13).chain([1, 79, 80, 81, 199]) {
            for h in (0..60).step_by(7).chain([1, 23, 24, 25, 59]) {
                let _ = render(app, w, h);
            }
        }
    }
}

#[test]
fn no_color_draws_no_colour_but_keeps_the_selection_reversed() {
    let mut app = bench_app();
    app.ui.theme = Theme::plain();
    let mut t = ratatui::Terminal::new(ratatui::backend::TestBackend::new(80, 24)).unwrap();
    t.draw(|f| view::draw(&app, f)).unwrap();
    let buf = t.backend().buffer();
    assert!(
        buf.content()
            .iter()
            .all(|c| c.fg == Color::Reset && c.bg == Color::Reset)
    );
    assert!(
        buf.content()
            .iter()
            .any(|c| c.modifier.contains(Modifier::REVERSED))
    );
    // With colour, windings get their colour and the letter stays.
    app.ui.theme = Theme { color: true };
    t.draw(|f| view::draw(&app, f)).unwrap();
    assert!(
        t.backend()
            .buffer()
            .content()
            .iter()
            .any(|c| c.fg == Color::Blue && c.symbol() == "P")
    );
}

#[test]
fn wide_characters_in_names_keep_the_columns() {
    let mut app = bench_app();
    app.edit("title", |b| {
        b.title = "变压器 build ✓ with a long title that will not fit".into();
        b.windings[1].name = "二次".into();
        for s in &mut b.stack {
            if let turnstack::model::Section::Winding(ws) = s
                && ws.winding == "S"
            {
                ws.winding = "二次".into();
            }
        }
        Ok(())
    })
    .unwrap();
    for (w, h) in [(80, 24), (120, 40)] {
        let lines = render(&app, w, h);
        for l in &lines {
            assert_eq!(
                unicode_width::UnicodeWidthStr::width(l.as_str()),
                w as usize,
                "{l}"
            );
        }
        assert!(lines.iter().any(|l| l.contains("二次")));
    }
}

#[test]
fn snapshot_demo_80x24() {
    insta::assert_snapshot!(screen(&demo_app(), 80, 24));
}

#[test]
fn snapshot_overflow_120x40() {
    insta::assert_snapshot!(screen(&overflowing_app(), 120, 40));
}

#[test]
fn snapshot_wire_picker_80x24() {
    let mut app = bench_app();
    press(&mut app, "<tab><down><down>w");
    insta::assert_snapshot!(screen(&app, 80, 24));
}

/// At 120 columns the windings panel gives each heading its own column (a space between
/// any two) and spells the roles out as the file writes them.
#[test]
fn windings_headings_apart_and_roles_whole_at_120x40() {
    let app = bench_app();
    let lines = render(&app, 120, 40);
    let head = lines
        .iter()
        .find(|l| l.contains("name") && l.contains("turns"))
        .expect("the windings heading");
    for pair in ["ins len m", "len m   MLT", "MLT DCR ohm", "DCR ohm Rac ohm"] {
        assert!(head.contains(pair), "{pair:?} not in {head}");
    }
    assert!(!head.contains("inslength"), "{head}");
    for w in &app.doc.build.windings {
        let role = w.role.key();
        let row = lines
            .iter()
            .find(|l| l.contains(&format!(" {:<4} {role} ", w.name)))
            .unwrap_or_else(|| panic!("no row of {} with the role {role} whole", w.name));
        assert!(row.contains(&format!(" {} ", w.turns)), "{row}");
    }
}

/// The header says what `check`'s last line says: a build that fits but breaks a limit is
/// marked FAILS with the limit's key (the demo runs over its rise limit), one that passes is not.
#[test]
fn header_names_a_broken_limit_as_check_does() {
    let demo = demo_app();
    let failing: Vec<&str> = demo.doc.eval.failures().iter().map(|c| c.key()).collect();
    assert!(failing.contains(&"temperature-rise"), "{failing:?}");
    let top = &render(&demo, 120, 40)[0];
    assert!(top.contains("FAILS temperature-rise"), "{top}");
    let bench = bench_app();
    assert!(bench.doc.eval.failures().is_empty());
    let top = &render(&bench, 120, 40)[0];
    assert!(top.contains("FITS") && !top.contains("FAILS"), "{top}");
}
