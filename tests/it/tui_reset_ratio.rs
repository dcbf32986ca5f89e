//! The planner's reset-ratio view at 80x24 and 100x30, its figures held to the reset
//! relations of the single-switch forward converter worked here by hand. Primary-side
//! reset (common practice): the reset duty limit D_max = Np / (Np + Nr), the off-state
//! switch voltage Vin_max (1 + Np/Nr) before the leakage spike; equal turns give 50 % and
//! twice the input (common practice).

use crate::tui_support::*;
use turnstack::model::Role;
use turnstack::tui::App;
use turnstack::tui::app::Overlay;

/// The demo build (Np 24, Nr 24 in a section of its own, highest input 28 V, controller
/// duty limit 0.45) with a switch rated `rating_v` and `nr` reset turns.
fn bench_with(rating_v: f64, nr: u32) -> App {
    let mut app = demo_app();
    let k = app
        .doc
        .build
        .windings
        .iter()
        .position(|w| w.role == Role::Reset)
        .expect("the bench build has a reset winding");
    app.edit("rating and reset turns", |b| {
        b.operating.as_mut().expect("operating").switch_rating_v = Some(rating_v);
        turnstack::tui::edit::set_winding_turns(b, k, nr)
    })
    .unwrap_or_else(|| panic!("{:?}", app.ui.status));
    app
}

/// Primary-side reset, worked by hand for Vin_max = 28 V, Np = 24, D = 0.45, rating 100 V:
/// duty D_max = Np/(Np+Nr) >= D gives Nr <= Np (1 - D)/D = 29.33, so at most 29; the
/// switch Vin (1 + Np/Nr) <= 100 V gives Nr >= Np Vin/(100 - Vin) = 9.33, so at least 10.
fn worked_range() -> (u32, u32) {
    let (np, vin, d, rating) = (24.0_f64, 28.0_f64, 0.45_f64, 100.0_f64);
    let hi = (np * (1.0 - d) / d).floor() as u32;
    let lo = (np * vin / (rating - vin)).ceil() as u32;
    (lo, hi)
}

fn open(app: &mut App) {
    press(app, "D");
    assert_eq!(app.ui.overlays.last(), Some(&Overlay::ResetRatio));
}

#[test]
fn equal_turns_show_half_duty_and_twice_the_input_at_80x24_common_practice() {
    let mut app = bench_with(100.0, 24);
    open(&mut app);
    let s = screen(&app, 80, 24);
    // Equal turns: 24/(24+24) = 0.50 and 28 x (1 + 24/24) = 56 V (common practice).
    let duty = 24.0 / (24.0 + 24.0);
    let volts = 28.0 * (1.0 + 24.0 / 24.0);
    assert!(s.contains(&format!("duty {duty:.2} against 0.45")), "{s}");
    assert!(
        s.contains(&format!("switch {volts:.0} V against 100 V")),
        "{s}"
    );
    // Room: 0.50/0.45 - 1 = 11 % for the duty, 1 - 56/100 = 44 % for the switch, so the
    // duty limit binds.
    let duty_room = (duty / 0.45 - 1.0) * 100.0;
    let volt_room = (1.0 - volts / 100.0) * 100.0;
    assert!(s.contains(&format!("({duty_room:.0} % room)")), "{s}");
    assert!(s.contains(&format!("({volt_room:.0} % room)")), "{s}");
    assert!(s.contains("the controller's duty limit binds"), "{s}");
    let (lo, hi) = worked_range();
    assert_eq!((lo, hi), (10, 29));
    assert!(
        s.contains(&format!("allowed: Nr {lo} to {hi} meets both limits")),
        "{s}"
    );
    // The axis labels: the limits on the value axes, the sweep's ends Np/4 = 6 and
    // 3 Np = 72 and the build's Nr under the reset-turns axis.
    assert!(s.contains("controller's duty limit 0.45"), "{s}");
    assert!(s.contains("switch rating 100 V"), "{s}");
    let rows = render(&app, 80, 24);
    let axis = rows
        .iter()
        .find(|r| r.trim_start().starts_with("Nr ") || r.contains("   Nr "))
        .expect("a reset-turns axis row");
    for label in ["6", "▲24", "72"] {
        assert!(
            axis.split_whitespace().any(|w| w == label),
            "{label} in {axis}"
        );
    }
    // The marker: the build's point is drawn on both plots, in the column of the ▲.
    let col = |row: &str, pat: &str| {
        row.find(pat)
            .map(|b| unicode_width::UnicodeWidthStr::width(&row[..b]))
    };
    let marker_cols: Vec<usize> = rows.iter().filter_map(|r| col(r, "●")).collect();
    let legend_free: Vec<usize> = marker_cols.iter().copied().filter(|&c| c > 6).collect();
    assert_eq!(legend_free.len(), 2, "{s}");
    assert!(legend_free.iter().all(|&c| c == legend_free[0]));
    assert_eq!(col(axis, "▲"), Some(legend_free[0]), "{s}");
    insta::assert_snapshot!("reset_ratio_80x24", s);
}

/// Below the range the switch binds: at Nr = 8, 28 x (1 + 24/8) = 112 V over 100 V.
#[test]
fn few_reset_turns_make_the_switch_rating_bind() {
    let mut app = bench_with(100.0, 8);
    open(&mut app);
    let s = screen(&app, 80, 24);
    let volts = 28.0 * (1.0 + 24.0 / 8.0);
    let short = (volts / 100.0 - 1.0) * 100.0;
    assert!(s.contains("the switch rating binds"), "{s}");
    assert!(
        s.contains(&format!("switch {volts:.0} V against 100 V"))
            && s.contains(&format!("short by {short:.0}")),
        "{s}"
    );
    // 24/(24+8) = 0.75.
    assert!(s.contains("duty 0.75 against 0.45"), "{s}");
}

#[test]
fn the_view_reads_at_100x30_and_closes_with_esc_or_its_key() {
    let mut app = bench_with(100.0, 24);
    open(&mut app);
    let s = screen(&app, 100, 30);
    assert!(s.contains("allowed: Nr 10 to 29 meets both limits"), "{s}");
    assert!(s.contains("▲24"), "{s}");
    insta::assert_snapshot!("reset_ratio_100x30", s);
    press(&mut app, "<esc>");
    assert!(app.ui.overlays.is_empty());
    open(&mut app);
    press(&mut app, "D");
    assert!(app.ui.overlays.is_empty());
}

#[test]
fn without_a_rating_the_range_is_open_below_and_says_so() {
    // The bench build gives no switch rating: only the duty limit bounds Nr, from above.
    let mut app = bench_app();
    open(&mut app);
    let s = screen(&app, 80, 24);
    assert!(s.contains("no switch rating given"), "{s}");
    assert!(s.contains("allowed: Nr 1 to 29 meets both limits"), "{s}");
}

#[test]
fn no_operating_point_gives_a_plain_message() {
    let mut app = bench_app();
    app.edit("no operating point", |b| {
        b.operating = None;
        Ok(())
    });
    assert!(app.doc.build.operating.is_none(), "{:?}", app.ui.status);
    open(&mut app);
    let s = screen(&app, 80, 24);
    assert!(s.contains("The build has no operating point"), "{s}");
}

#[test]
fn the_help_lists_the_views_key() {
    let mut app = bench_app();
    press(&mut app, "?");
    let rows = render(&app, 120, 60);
    assert!(
        rows.iter()
            .any(|l| l.contains(" D ") && l.contains("reset ratio: duty limit")),
        "{rows:#?}"
    );
}
