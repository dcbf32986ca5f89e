//! A section's last layer spaced across the width (`spread = true`): read, saved, warned,
//! drawn, written on the sheet and chosen by the design. Spacing a partial last layer so the
//! next section lies flat is common practice in hand winding; the checks are against the
//! format's definition (FORMAT.md, "Partial-layer warning") and hand arithmetic.

use crate::common::*;
use crate::tui_support::*;
use std::path::Path;
use turnstack::engine::{SectionKind, WarningKind, evaluate};
use turnstack::files::build_text;
use turnstack::model::Section;
use turnstack::report::sheet::sheet;

/// P below S on an E25/13/7 bobbin (15.2 mm usable, no margins): 24 turns of 0.5 mm wire
/// hold 26 a layer, so P's one layer is partial; S, 5 turns of 0.8 mm, is the outermost.
fn text(spread: &str) -> String {
    format!(
        r#"format = 1
title = "spaced last layer"
bobbin = "e25-13-7"

[setup]
temperature_c = 20
frequency_khz = 100

[[winding]]
name = "P"
role = "primary"
turns = 24
wire = "0.5mm"
current_rms_a = 1.0

[[winding]]
name = "S"
role = "secondary"
turns = 5
wire = "0.8mm"
current_rms_a = 4.0

[[stack]]
winding = "P"
{spread}
[[stack]]
tape = 1

[[stack]]
winding = "S"
"#
    )
}

fn partial_layer_warned(e: &turnstack::engine::Evaluation, section: usize) -> bool {
    e.warnings
        .iter()
        .any(|w| matches!(w.kind, WarningKind::PartialLayer { section: s, .. } if s == section))
}

/// Without `spread` the partial layer under S is warned; with it the warning goes, and no
/// figure but the layer voltage moves (FORMAT.md, "A spread last layer"): the AC figures,
/// resistances, leakage and capacitance are the same to the bit.
#[test]
fn spread_quiets_the_partial_layer_warning_and_moves_no_other_figure() {
    let (_, close) = eval(&text(""));
    let (b, spaced) = eval(&text("spread = true"));
    assert!(matches!(&b.stack[0], Section::Winding(ws) if ws.spread));
    assert!(partial_layer_warned(&close, 0), "{:?}", close.warnings);
    assert!(!partial_layer_warned(&spaced, 0), "{:?}", spaced.warnings);
    let SectionKind::Winding {
        last_layer_turns,
        turns_per_layer,
        spread,
        ..
    } = &spaced.sections[0].kind
    else {
        panic!("section 1 is P");
    };
    assert_eq!(
        (*last_layer_turns, *turns_per_layer, *spread),
        (24, 26, true)
    );
    for (a, b) in close.windings.iter().zip(&spaced.windings) {
        assert_eq!(a.dcr_ohm, b.dcr_ohm, "{} DCR", a.name);
        assert_eq!(a.ac, b.ac, "{} AC figures", a.name);
        assert_eq!(a.copper_loss_w, b.copper_loss_w, "{} loss", a.name);
    }
    assert_eq!(close.leakage, spaced.leakage);
    assert_eq!(close.capacitance, spaced.capacitance);
    assert_eq!(close.build_height_mm, spaced.build_height_mm);
}

/// The converter build of the stress checks: P with `np` turns (26 a layer) under S, the
/// reset R outermost, at `vin_max_v` highest input.
fn stress_build(spread: &str, np: u32, vin_max_v: f64) -> String {
    text(spread)
        .replace(
            "turns = 24\nwire = \"0.5mm\"",
            &format!("turns = {np}\nwire = \"0.5mm\""),
        )
        .replace(
            "[[stack]]\nwinding = \"S\"\n",
            "[[stack]]\nwinding = \"S\"\n\n[[stack]]\ntape = 1\n\n[[stack]]\nwinding = \"R\"\n",
        )
        .replace(
            "[[stack]]\nwinding = \"P\"",
            &format!(
                "[[winding]]\nname = \"R\"\nrole = \"reset\"\nturns = {np}\nwire = \"0.2mm\"\n\n\
                 [[stack]]\nwinding = \"P\""
            ),
        )
        + &format!(
            "\n[operating]\nconverter = \"forward\"\nreset_side = \"primary\"\n\
             vin_min_v = {}\nvin_max_v = {vin_max_v}\nvout_v = 5\niout_a = 4\n\
             rectifier_drop_v = 0.5\nduty_limit = 0.45\n",
            vin_max_v * 0.7
        )
}

/// P's layer pair: its voltage and what its films stand.
fn p_layers(e: &turnstack::engine::Evaluation) -> (f64, f64) {
    let st = e
        .stress
        .as_ref()
        .expect("an operating point gives stress figures");
    let p = st
        .layers
        .iter()
        .find(|l| l.section == 0)
        .expect("P has two layers");
    (p.voltage_v, p.limit_v)
}

/// 30 primary turns at 26 a layer: layers of 26 and 4. Close-wound, the 4 come back from the
/// far flange over turns 26..23, so the worst pair is turn 30 over turn 23: 7 turns (the
/// usual 2b - 1, common practice). Spread, the 4 sit at 1/8, 3/8, 5/8 and 7/8 of the width
/// from the far flange; the last, 1/8 of the width (3.25 turns of the layer below) from the
/// start flange, lies over turns 3 and 4: 30 - 3 = 27 turns apart. Worked here by hand; the
/// volts per turn are vin_max / Np = 28 / 30.
#[test]
fn a_spread_layer_stands_the_voltage_of_its_last_turn_over_the_layer_below() {
    let vpt = 28.0 / 30.0;
    let layer_v = |spread: &str| {
        let (_, e) = eval(&stress_build(spread, 30, 28.0));
        let st = e.stress.as_ref().unwrap();
        assert_rel(st.volts_per_turn_v, vpt, 1e-12, "V per turn");
        p_layers(&e).0
    };
    assert_rel(layer_v(""), 7.0 * vpt, 1e-12, "close-wound 26 + 4");
    assert_rel(layer_v("spread = true"), 27.0 * vpt, 1e-12, "spread 26 + 4");
    // One turn over 26: it lies in the middle, over turns 13 and 14; 27 - 13 = 14 apart.
    let (_, e) = eval(&stress_build("spread = true", 27, 28.0));
    assert_rel(p_layers(&e).0, 14.0 * 28.0 / 27.0, 1e-12, "spread 26 + 1");
}

/// Where the films stand the close-wound 7 turns' voltage but not the spread 27 turns', the
/// spacing the design and the search apply leaves P close-wound; at a low voltage it spaces
/// it. The input is set from the films' own figure: 15 turns' worth of volts is their limit.
#[test]
fn spacing_is_refused_where_the_films_would_not_stand_it() {
    use turnstack::engine::spacing::space_partial_layers;
    let (_, probe) = eval(&stress_build("", 30, 28.0));
    let (_, limit) = p_layers(&probe);
    let vin = limit / 15.0 * 30.0;
    let (b, e) = eval(&stress_build("", 30, vin));
    let (v, _) = p_layers(&e);
    assert!(v < limit, "close-wound {v} V within {limit} V");
    assert!(partial_layer_warned(&e, 0));
    // S, a single partial layer under R, may be spaced; P may not.
    if let Some((spaced, se)) = space_partial_layers(&b, &e) {
        assert!(
            matches!(&spaced.stack[0], Section::Winding(ws) if !ws.spread),
            "P spread would stand 27 x {} V",
            limit / 15.0
        );
        assert!(partial_layer_warned(&se, 0));
        let (v, _) = p_layers(&se);
        assert!(v < limit);
    }
    // Already over its films close-wound (7 turns of a fifth of the limit each): spacing
    // would only make it worse, so P stays close-wound there too.
    let (b, e) = eval(&stress_build("", 30, limit / 5.0 * 30.0));
    assert!(p_layers(&e).0 > limit);
    if let Some((spaced, _)) = space_partial_layers(&b, &e) {
        assert!(matches!(&spaced.stack[0], Section::Winding(ws) if !ws.spread));
    }
    let (b, e) = eval(&stress_build("", 30, 28.0));
    let (spaced, se) = space_partial_layers(&b, &e).expect("at 28 V P is spaced");
    assert!(matches!(&spaced.stack[0], Section::Winding(ws) if ws.spread));
    assert!(!partial_layer_warned(&se, 0));
    assert!(p_layers(&se).0 <= p_layers(&se).1);
}

/// `spread` on a tape section is refused at its key, as `layer_tape` is.
#[test]
fn spread_on_a_tape_section_is_refused_where_it_stands() {
    let bad = text("").replace("tape = 1\n", "tape = 1\nspread = true\n");
    let err = turnstack::files::parse_build(
        &bad,
        Some(Path::new("test.toml")),
        &turnstack::files::BobbinLibrary::bundled_only(),
    )
    .unwrap_err();
    let msg = err.with_snippet();
    assert!(msg.contains("not `spread`"), "{msg}");
    let line = bad.lines().position(|l| l == "spread = true").unwrap() + 1;
    assert!(msg.contains(&format!("test.toml:{line}:")), "{msg}");
}

/// The sheet's steps tell the winder the spacing, worked by hand over the 15.2 mm usable
/// width: P's 24 turns one every 15.2 / 24 = 0.633 mm, the first 0.317 mm in, leaving gaps of
/// under a tenth of a millimetre beside 0.5 mm wire (too small to measure); S's 5 turns one
/// every 3.04 mm, the first 1.52 mm in, gaps wider than the wire (a wrap of tape advised).
/// Close-wound, no step speaks of spacing.
#[test]
fn the_sheet_gives_the_spacing_of_a_spread_layer() {
    let both =
        text("spread = true").replace("winding = \"S\"\n", "winding = \"S\"\nspread = true\n");
    let (b, e) = eval(&both);
    let s = sheet(&b, &e, 20.0);
    let spacing = |section: usize| {
        let step = s.steps.iter().find(|st| st.section == section).unwrap();
        step.lines
            .iter()
            .find(|(label, _)| label == "Spacing")
            .map(|(_, t)| t.clone())
            .unwrap_or_else(|| panic!("{:?}", step.lines))
    };
    let p = spacing(0);
    for want in [
        "the 24 turns".to_string(),
        format!("one every {:.2} mm", 15.2 / 24.0),
        format!("{:.2} mm in", 15.2 / 48.0),
        "too little to measure".to_string(),
    ] {
        assert!(p.contains(&want), "{want:?} in {p}");
    }
    let sec = spacing(2);
    for want in [
        "the 5 turns",
        "one every 3.04 mm",
        "1.52 mm in",
        "wider than the wire",
    ] {
        assert!(sec.contains(want), "{want:?} in {sec}");
    }
    let (b, e) = eval(&text(""));
    let s = sheet(&b, &e, 20.0);
    assert!(
        s.steps
            .iter()
            .all(|st| st.lines.iter().all(|(label, _)| label != "Spacing"))
    );
}

/// Saved onto the file: turning spread on adds one line, `spread = true`, in the section;
/// turning it off again writes `false` in its place and keeps the comment the user put on
/// that line, every other line as it was.
#[test]
fn a_spread_edit_saves_as_one_line() {
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("test.toml");
    let base = text("# P is wound first, against the tube");
    let mut b = parse(&base);
    let Section::Winding(ws) = &mut b.stack[0] else {
        panic!()
    };
    ws.spread = true;
    let (saved, _) = build_text(&b, Some(&base), &path);
    let added: Vec<&str> = saved
        .lines()
        .filter(|l| !base.lines().any(|o| o == *l))
        .collect();
    assert_eq!(added, ["spread = true"], "{saved}");
    assert_eq!(saved.lines().count(), base.lines().count() + 1);
    assert_eq!(parse(&saved), b);
    // The user notes why on that line; the planner then turns it off.
    let noted = saved.replace("spread = true", "spread = true   # asked for by the winder");
    let Section::Winding(ws) = &mut b.stack[0] else {
        panic!()
    };
    ws.spread = false;
    let (back, _) = build_text(&b, Some(&noted), &path);
    let want = noted.replace("spread = true", "spread = false");
    assert_eq!(back, want);
    assert_eq!(parse(&back), b);
}

/// In the planner `e` spaces the selected section's last layer: the stack list marks it `~`,
/// the warning goes, the drawing shows S's five turns apart, and `u` undoes it. On tape it is
/// refused.
#[test]
fn e_spaces_the_last_layer_in_the_planner() {
    let b = parse(&text(""));
    let mut app = turnstack::tui::App::new(b.clone(), None);
    app.ui.theme = turnstack::tui::theme::Theme::plain();
    assert!(partial_layer_warned(&app.doc.eval, 0));
    // The stack opens on section 1 (P).
    press(&mut app, "e");
    assert!(matches!(&app.doc.build.stack[0], Section::Winding(ws) if ws.spread));
    assert!(!partial_layer_warned(&app.doc.eval, 0));
    let s = screen(&app, 100, 30);
    let p_row = s
        .lines()
        .find(|l| l.contains(" 1 P "))
        .unwrap_or_else(|| panic!("{s}"));
    assert!(p_row.contains("1~"), "{p_row}");
    press(&mut app, "u");
    assert_eq!(app.doc.build, b);
    // S, the outermost, spaced too (and selected, so its row is marked ▶): five runs of S
    // letters with empty cells between.
    press(&mut app, "kk");
    assert_eq!(app.ui.stack_sel, 2);
    press(&mut app, "e");
    let s = screen(&app, 100, 30);
    let row = s
        .lines()
        .find(|l| l.contains(" 3▶┃"))
        .unwrap_or_else(|| panic!("{s}"));
    let inside: String = row
        .split('┃')
        .nth(1)
        .unwrap_or_default()
        .chars()
        .map(|c| c.to_ascii_uppercase())
        .collect();
    let runs = inside.split('·').filter(|r| r.contains('S')).count();
    assert_eq!(runs, 5, "{row}");
    press(&mut app, "j");
    assert_eq!(app.ui.stack_sel, 1);
    let before = app.doc.build.clone();
    press(&mut app, "e");
    assert_eq!(app.doc.build, before, "tape has no layers to space");
}

/// A design from requirements winds every partial last layer that has a section over it
/// spaced, so the build it writes carries no partial-layer warning, and `check` reads it
/// back the same.
#[test]
fn designs_space_their_partial_layers() {
    let req_path =
        Path::new(env!("CARGO_MANIFEST_DIR")).join("examples/requirements/bench-supply-5v.toml");
    let lib = turnstack::files::BobbinLibrary::for_build(&req_path);
    let req = turnstack::files::load_requirements(&req_path, &lib).unwrap();
    let b = lib.find("rm10").unwrap().unwrap();
    let out = turnstack::engine::design::design(
        &req,
        &[("rm10".into(), b)],
        &turnstack::engine::design::DesignSettings::default(),
        &|_, _| {},
        &std::sync::atomic::AtomicBool::new(false),
    );
    let d = out.designs.first().expect("a design on rm10");
    assert!(
        d.eval
            .warnings
            .iter()
            .all(|w| !matches!(w.kind, WarningKind::PartialLayer { .. })),
        "{:?}",
        d.eval.warnings
    );
    let spaced = d
        .build
        .stack
        .iter()
        .filter(|s| matches!(s, Section::Winding(ws) if ws.spread))
        .count();
    assert!(spaced > 0, "the rm10 design has partial layers to space");
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("designed.toml");
    let (written, _) = build_text(&d.build, None, &path);
    let back = parse(&written);
    assert_eq!(back, d.build);
    assert_eq!(evaluate(&back), d.eval);
}

/// A file that says `spread = false` in so many words keeps saying it through an edit of
/// something else: the default stated is the user's text, not a change.
#[test]
fn an_explicit_spread_false_survives_an_unrelated_save() {
    let path = Path::new(env!("CARGO_MANIFEST_DIR")).join("test.toml");
    let base = text("spread = false  # close-wound, as the last build");
    let mut b = parse(&base);
    b.windings[1].turns = 6;
    let (saved, _) = build_text(&b, Some(&base), &path);
    assert!(
        saved.contains("spread = false  # close-wound, as the last build"),
        "{saved}"
    );
    assert_eq!(saved.replace("turns = 6", "turns = 5"), base);
}

/// The search hands out its candidates spaced as the design does: a candidate keeps a
/// partial-layer warning only where spacing that layer would raise a layer-voltage warning
/// (tried here), and its loss, leakage and height are those it was ranked by.
#[test]
fn search_candidates_come_spaced_where_sound() {
    use turnstack::engine::search::{Settings, search};
    let (b, _) = example("first-try");
    let out = search(&b, &Settings::default(), &|_, _| {}).unwrap();
    assert!(!out.candidates.is_empty());
    let mut spaced = 0;
    for c in &out.candidates {
        spaced += c
            .build
            .stack
            .iter()
            .filter(|s| matches!(s, Section::Winding(ws) if ws.spread))
            .count();
        assert_eq!(c.eval.spare_height_mm, c.objectives.spare_height_mm);
        let spread_stressed = c.eval.warnings.iter().any(|w| {
            matches!(w.kind, WarningKind::LayerVoltage { section, .. }
                if matches!(&c.build.stack[section], Section::Winding(ws) if ws.spread))
        });
        assert!(
            !spread_stressed,
            "{}: a spaced section over its films",
            c.description
        );
        for w in &c.eval.warnings {
            let WarningKind::PartialLayer { section, .. } = w.kind else {
                continue;
            };
            let mut tried = c.build.clone();
            let Section::Winding(ws) = &mut tried.stack[section] else {
                panic!("a partial layer is a winding section")
            };
            ws.spread = true;
            let e = evaluate(&tried);
            assert!(
                e.warnings.iter().any(|w| matches!(
                    w.kind,
                    WarningKind::LayerVoltage { section: s, .. } if s == section
                )),
                "{}: section {} left close-wound for no reason",
                c.description,
                section + 1
            );
        }
    }
    assert!(
        spaced > 0,
        "first-try's candidates have partial layers to space"
    );
}
